// Benchmark instance generators; see instance_families.h.
#include "instance_families.h"

#include <cmath>

namespace apportion::bench {

namespace {
void add(Instance& g, Rng& rng, int u, int v, int max_cap, int max_cost) {
  g.tail.push_back(u);
  g.head.push_back(v);
  g.capacity.push_back(1 + rng.below(max_cap));
  g.cost.push_back(rng.below(max_cost + 1));
}
}  // namespace

Instance make_instance(const std::string& family, int arcs, std::uint64_t seed) {
  Rng rng(seed);
  Instance g;
  g.family = family;
  if (family == "grid") {
    // A square grid, arcs right, down and up (about 3 per node); s feeds the left column,
    // the right column feeds t.
    const int side = std::max(2, static_cast<int>(std::sqrt(arcs / 3.0)));
    g.nodes = side * side + 2;
    g.source = side * side, g.sink = side * side + 1;
    auto id = [side](int r, int c) { return r * side + c; };
    for (int r = 0; r < side; ++r) {
      add(g, rng, g.source, id(r, 0), 10000, 10);
      add(g, rng, id(r, side - 1), g.sink, 10000, 10);
      for (int c = 0; c < side; ++c) {
        if (c + 1 < side) add(g, rng, id(r, c), id(r, c + 1), 1000, 100);
        if (r + 1 < side) add(g, rng, id(r, c), id(r + 1, c), 1000, 100);
        if (r > 0) add(g, rng, id(r, c), id(r - 1, c), 1000, 100);
      }
    }
  } else if (family == "layered") {
    // Layers of width w; each node has 4 arcs to random nodes of the next layer.
    const int degree = 4;
    const int total = std::max(degree * 4, arcs / degree);
    const int width = std::max(4, static_cast<int>(std::sqrt(static_cast<double>(total))));
    const int layers = std::max(2, total / width);
    g.nodes = width * layers + 2;
    g.source = width * layers, g.sink = width * layers + 1;
    for (int i = 0; i < width; ++i) {
      add(g, rng, g.source, i, 10000, 10);
      add(g, rng, (layers - 1) * width + i, g.sink, 10000, 10);
    }
    for (int l = 0; l + 1 < layers; ++l)
      for (int i = 0; i < width; ++i)
        for (int k = 0; k < degree; ++k) add(g, rng, l * width + i, (l + 1) * width + rng.below(width), 1000, 100);
  } else {
    // Random sparse graph, average out-degree 8, plus a path 0 -> 1 -> ... so that s = 0
    // reaches t = n-1.
    g.nodes = std::max(2, arcs / 8);
    g.source = 0, g.sink = g.nodes - 1;
    for (int v = 0; v + 1 < g.nodes; ++v) add(g, rng, v, v + 1, 1000, 100);
    while (static_cast<int>(g.tail.size()) < arcs) {
      const int u = rng.below(g.nodes);  // one draw per statement: argument order varies by compiler
      const int v = rng.below(g.nodes);
      add(g, rng, u, v, 1000, 100);
    }
  }
  return g;
}

}  // namespace apportion::bench
