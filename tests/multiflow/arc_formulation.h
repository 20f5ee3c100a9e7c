// A reference LP for the fair-multiflow tests: the arc formulation (one flow variable per
// demand and lane, conservation at every node), sharing nothing with the engine's path
// formulation but the LP solver. Test helper only.
#pragma once

#include <algorithm>
#include <catch2/catch.hpp>
#include <vector>

#include "apportion/model/network.h"
#include "apportion/multiflow/lp_solver.h"

namespace apportion::test {

// The most demand k can get while every demand j keeps at least floor[j] and at most its
// amount.
inline double max_share_arc_formulation(const Network& net, int k, const std::vector<double>& floor) {
  LpSolver lp;
  const int K = static_cast<int>(net.demands.size());
  std::vector<int> cap_row(net.arc_count());
  for (int a = 0; a < net.arc_count(); ++a)
    cap_row[a] = lp.add_row(-LpSolver::kInf, net.arcs[a].enabled ? net.arcs[a].capacity : 0.0);
  for (int j = 0; j < K; ++j) {
    const Demand& d = net.demands[j];
    std::vector<int> node_row(net.node_count());
    for (int v = 0; v < net.node_count(); ++v) node_row[v] = lp.add_row(0.0, 0.0);
    const double hi = d.amount ? *d.amount : LpSolver::kInf;
    lp.add_column(j == k ? -1.0 : 0.0, std::min(floor[j], hi), hi, {node_row[d.origin], node_row[d.destination]},
                  {-1.0, 1.0});
    for (int a = 0; a < net.arc_count(); ++a) {
      const Arc& arc = net.arcs[a];
      lp.add_column(0.0, 0.0, LpSolver::kInf, {cap_row[a], node_row[arc.from], node_row[arc.to]}, {1.0, 1.0, -1.0});
      if (arc.shared_two_way)
        lp.add_column(0.0, 0.0, LpSolver::kInf, {cap_row[a], node_row[arc.to], node_row[arc.from]}, {1.0, 1.0, -1.0});
    }
  }
  REQUIRE(lp.solve() == LpStatus::kOptimal);
  return -lp.objective();
}

}  // namespace apportion::test
