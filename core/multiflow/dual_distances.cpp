// Arc prices and demand distances; see dual_distances.h.
#include "apportion/multiflow/dual_distances.h"

#include <algorithm>
#include <limits>

namespace apportion {

std::vector<double> capacity_prices(PathMaster& master, int arc_count) {
  std::vector<double> y(arc_count, 0.0);
  double largest = 0.0;
  for (int a = 0; a < arc_count; ++a) {
    const int row = master.capacity_row(a);
    if (row >= 0) y[a] = std::max(0.0, -master.lp().row_dual(row)), largest = std::max(largest, y[a]);
  }
  for (double& v : y)
    if (v < 1e-9 * largest) v = 0.0;
  return y;
}

std::vector<double> demand_distances(const PathMaster& master, PathPricer& pricer, const std::vector<DemandSpec>& specs,
                                     const std::vector<double>& y, bool fixed_paths) {
  const int K = static_cast<int>(specs.size());
  std::vector<double> dist(K, std::numeric_limits<double>::infinity());
  if (fixed_paths) {
    for (const MasterPath& p : master.paths()) {
      double len = 0.0;
      for (int l : p.lanes) len += y[master.lanes()[l].arc];
      dist[p.demand] = std::min(dist[p.demand], len);
    }
    return dist;
  }
  int nodes = 0;
  for (const DemandSpec& s : specs) nodes = std::max({nodes, s.origin + 1, s.destination + 1});
  std::vector<std::vector<int>> by_origin(nodes);
  for (int k = 0; k < K; ++k)
    if (master.reachable(k)) by_origin[specs[k].origin].push_back(k);
  for (int o = 0; o < nodes; ++o) {
    if (by_origin[o].empty()) continue;
    pricer.search(o, y);
    for (int k : by_origin[o]) dist[k] = pricer.distance(specs[k].destination);
  }
  return dist;
}

}  // namespace apportion
