// Force-directed placement with a grid for repulsion; see network_layout.h.
#include "apportion/layout/network_layout.h"

#include <algorithm>
#include <cmath>
#include <unordered_map>
#include <vector>

namespace apportion {

void auto_layout(Network& net, const LayoutOptions& options) {
  const int n = net.node_count();
  if (n == 0) return;
  std::vector<char> movable(n, 1);
  bool any_placed = false;
  for (int v = 0; v < n; ++v)
    if (options.keep_placed && net.nodes[v].x && net.nodes[v].y) movable[v] = 0, any_placed = true;
  const double side = 100.0 * std::sqrt(static_cast<double>(n));
  const double k = side / std::sqrt(static_cast<double>(n));  // ideal distance (FR's k = sqrt(area / n))
  std::vector<double> x(n), y(n);
  const double pi = std::acos(-1.0);
  double cx = side / 2, cy = side / 2;
  if (any_placed) {  // start new nodes around the centre of the placed ones
    double sx = 0, sy = 0;
    int c = 0;
    for (int v = 0; v < n; ++v)
      if (!movable[v]) sx += *net.nodes[v].x, sy += *net.nodes[v].y, ++c;
    cx = sx / c, cy = sy / c;
  }
  for (int v = 0; v < n; ++v) {
    if (!movable[v]) {
      x[v] = *net.nodes[v].x, y[v] = *net.nodes[v].y;
    } else {
      const double angle = 2 * pi * v / n;
      x[v] = cx + side / 2 * std::cos(angle);
      y[v] = cy + side / 2 * std::sin(angle);
    }
  }
  std::vector<double> dx(n), dy(n);
  const double cell = 2 * k;
  std::unordered_map<long long, std::vector<int>> grid;
  auto key = [](long long gx, long long gy) { return gx * 1000003LL + gy; };
  double temperature = side / 10;
  const int iterations = layout_iterations(n, net.arc_count(), options);
  for (int it = 0; it < iterations; ++it) {
    std::fill(dx.begin(), dx.end(), 0.0);
    std::fill(dy.begin(), dy.end(), 0.0);
    grid.clear();
    for (int v = 0; v < n; ++v)
      grid[key(static_cast<long long>(std::floor(x[v] / cell)), static_cast<long long>(std::floor(y[v] / cell)))].push_back(v);
    for (int v = 0; v < n; ++v) {
      const long long gx = static_cast<long long>(std::floor(x[v] / cell)), gy = static_cast<long long>(std::floor(y[v] / cell));
      for (long long ox = -1; ox <= 1; ++ox)
        for (long long oy = -1; oy <= 1; ++oy) {
          auto found = grid.find(key(gx + ox, gy + oy));
          if (found == grid.end()) continue;
          for (int u : found->second) {
            if (u == v) continue;
            double ex = x[v] - x[u], ey = y[v] - y[u];
            double d2 = ex * ex + ey * ey;
            if (d2 < 1e-9) ex = 1e-3 * ((v % 7) - 3 + 0.5), ey = 1e-3 * ((u % 5) - 2 + 0.5), d2 = ex * ex + ey * ey;
            if (d2 > cell * cell) continue;
            const double f = k * k / d2;  // repulsion k^2 / d, along the unit vector
            dx[v] += ex * f, dy[v] += ey * f;
          }
        }
    }
    for (const Arc& a : net.arcs) {
      if (a.from == a.to || a.from < 0 || a.to < 0 || a.from >= n || a.to >= n) continue;
      const double ex = x[a.from] - x[a.to], ey = y[a.from] - y[a.to];
      const double d = std::sqrt(ex * ex + ey * ey);
      if (d < 1e-9) continue;
      const double f = d / k;  // attraction d^2 / k, along the unit vector
      dx[a.from] -= ex * f, dy[a.from] -= ey * f;
      dx[a.to] += ex * f, dy[a.to] += ey * f;
    }
    for (int v = 0; v < n; ++v) {
      if (!movable[v]) continue;
      const double d = std::sqrt(dx[v] * dx[v] + dy[v] * dy[v]);
      if (d < 1e-12) continue;
      const double step = std::min(d, temperature);
      x[v] += dx[v] / d * step;
      y[v] += dy[v] / d * step;
    }
    temperature = std::max(temperature * 0.97, k * 0.01);
  }
  for (int v = 0; v < n; ++v)
    if (movable[v]) net.nodes[v].x = std::round(x[v] * 100) / 100, net.nodes[v].y = std::round(y[v] * 100) / 100;
}

int layout_iterations(int nodes, int arcs, const LayoutOptions& options) {
  constexpr double kWork = 200.0 * 200000;  // iterations times (nodes + arcs)
  const double size = std::max(1.0, static_cast<double>(nodes) + arcs);
  return std::min(options.iterations, std::max(5, static_cast<int>(kWork / size)));
}

}  // namespace apportion
