// Seeded random flow instances for property tests. Invented data, for tests only.
#pragma once

#include <cmath>
#include <random>

#include "apportion/flow/flow_graph.h"

namespace apportion::test {

struct RandomSpec {
  int nodes = 10;
  int arcs = 30;
  bool integral = true;       // integer capacities and costs
  double max_capacity = 100;
  double max_cost = 20;
  double two_way_share = 0.0; // fraction of arcs that are shared two-way
};

// A random graph with a Hamiltonian-ish backbone 0 -> 1 -> ... so that s = 0 and
// t = n-1 are usually connected, plus random arcs (parallel arcs and self-loops included).
inline FlowGraph random_graph(std::mt19937_64& rng, const RandomSpec& spec) {
  FlowGraph g(spec.nodes);
  // Hand-rolled draws instead of std:: distributions, whose output differs between
  // libstdc++ and libc++: native and WebAssembly runs then test the same instances.
  auto node = [&](std::mt19937_64& r) { return static_cast<int>(r() % static_cast<unsigned>(spec.nodes)); };
  auto unit = [](std::mt19937_64& r) { return static_cast<double>(r() >> 11) * 0x1.0p-53; };
  auto value = [&](double max) { return spec.integral ? std::floor(unit(rng) * (max + 1)) : unit(rng) * max; };
  for (int a = 0; a < spec.arcs; ++a) {
    int u, v;
    if (a < spec.nodes - 1 && unit(rng) < 0.5) {
      u = a, v = a + 1;
    } else {
      u = node(rng), v = node(rng);
    }
    // One draw per statement: argument evaluation order differs between compilers.
    const double cap = value(spec.max_capacity);
    const double cost = value(spec.max_cost);
    const bool two_way = unit(rng) < spec.two_way_share;
    g.add_arc(u, v, cap, cost, two_way);
  }
  return g;
}

}  // namespace apportion::test
