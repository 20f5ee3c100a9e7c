// The restricted master LP of the path formulation, solved by column generation.
//
// Model (minimisation, as LpSolver states it):
//   columns  x_p >= 0 for each path p of demand k(p) (cost: its route length when routing
//            is being tidied, else 0); f_k, the share of demand k; t, a level used by the
//            fairness and concurrency objectives; r_k >= 0, the growth of demand k above
//            its level, fixed at 0 except in the saturation tests of the max-min rounds
//   rows     capacity(e):  sum of x_p over paths using arc e (either lane)   <= u(e)
//            flow(k):      sum of x_p over paths of k  -  f_k                  = 0
//            level(k):     f_k  -  w_k t  -  r_k                              >= 0 when active
// Pricing (Dantzig-Wolfe column generation; Ahuja, Magnanti, Orlin, "Network Flows", 1993,
// ch. 17): a new path p for demand k improves the LP exactly when its length under
//   len(e) = -dual(capacity(e)) (+ route length of e when tidying)
// is below dual(flow(k)). One shortest-path tree per origin prices all its demands. When no
// path prices out, the restricted LP is optimal for the full path formulation.
// With RoutingOptions::k_paths the column set is fixed in advance and nothing is priced.
// Column pool: pricing adds paths every round, and most of them end up unused (at 2,000
// demands on a 149-node backbone, 22,000 paths for 4,300 rows). Every simplex iteration
// prices all columns, so the unused ones cost time on every iteration. When the paths
// outnumber the rows path_pool times (FairOptions::path_pool, 0.5), those out of the basis, at zero, with a reduced cost above the
// pricing tolerance are dropped before the next solve; the basis stays valid, and a dropped
// path that becomes attractive again is priced back in. An LP that turns infeasible gets
// every dropped path back and is solved again (see solve()) (the standard column management of
// column generation: G. Desaulniers, J. Desrosiers, M. Solomon (eds.), "Column Generation",
// 2005, ch. 1 -- from memory).
#pragma once

#include <unordered_set>
#include <vector>

#include "apportion/flow/flow_graph.h"
#include "apportion/model/network.h"
#include "apportion/multiflow/lp_solver.h"
#include "apportion/multiflow/multiflow.h"
#include "apportion/multiflow/path_pricing.h"

namespace apportion {

struct DemandSpec {
  int origin = -1, destination = -1;
  double amount = LpSolver::kInf;  // inf: as much as possible
  double weight = 1.0;
};

// The demands of a network as the master LP takes them.
inline std::vector<DemandSpec> demand_specs(const Network& net) {
  std::vector<DemandSpec> s;
  for (const Demand& d : net.demands) s.push_back({d.origin, d.destination, d.amount.value_or(LpSolver::kInf), d.weight});
  return s;
}

struct MasterPath {
  int demand = -1;
  std::vector<int> lanes;  // into PathMaster::lanes()
  int column = -1;
};

class PathMaster {
 public:
  // `route_length` per arc: the metric of k-shortest paths and of route tidying.
  PathMaster(const FlowGraph& g, const std::vector<DemandSpec>& demands, const RoutingOptions& routing,
             const std::vector<double>& route_length);

  LpSolver& lp() { return lp_; }
  int share_column(int k) const { return share_col_[k]; }
  int level_column() const { return level_col_; }
  int level_row(int k) const { return level_row_[k]; }
  int growth_column(int k) const { return growth_col_[k]; }
  int capacity_row(int arc) const { return cap_row_[arc]; }  // -1 for an unusable arc
  bool reachable(int k) const { return reachable_[k]; }      // some path exists (within limits)

  // Path columns cost their route length (true) or nothing (false).
  void set_route_costs(bool on);

  // Column generation until no path prices out. kFailed after too many rounds. The first
  // solve uses `first` (see LpSolver::set_method: the dual simplex after bounds that cut
  // off the last solution, the primal after cost changes); later ones, after new columns,
  // the primal.
  LpStatus solve(LpSolver::Method first = LpSolver::Method::kDual);

  // Adds a path column for `demand` (lanes into lanes()), unless it is there already: to
  // start from routes found elsewhere (the origin-aggregated rounds).
  void add_route(int demand, std::vector<int> lanes) { add_path(demand, std::move(lanes)); }

  const std::vector<Lane>& lanes() const { return pricer_.lanes(); }
  const std::vector<MasterPath>& paths() const { return paths_; }

  // Weak duality of the path formulation: for arc lengths y >= 0 and d_k(y) the length of
  // demand k's shortest allowed path, every routing within the capacities has
  // sum_k f_k d_k(y) <= sum_e c_e y_e (each unit of flow of k uses a path at least d_k long;
  // R. Ahuja, T. Magnanti, J. Orlin, "Network Flows", 1993, ch. 17). Any y >= 0 gives a
  // valid bound, the last solve's duals a tight one; the fairness certificate and the
  // amount search's ceiling use it.
  // y per arc from the capacity rows' duals of the last solve: "<=" rows have duals <= 0 at
  // a minimum, so y = max(0, -dual); prices below 1e-9 of the largest are set to 0. They are
  // rounding noise of a zero, and kept they would give demands tiny distances d_k and
  // magnify every error of a bound divided by d_k.
  std::vector<double> capacity_prices() const;
  // d_k(y) for every demand: over its paths for a fixed path set (k shortest paths), else
  // by one shortest-path tree per origin within the hop limit; +inf where it has no path.
  std::vector<double> distances(const std::vector<double>& y);
  const MultiflowStats& stats() const { return stats_; }
  void set_path_pool(double ratio) { path_pool_ = ratio; }  // see FairOptions::path_pool

 private:
  bool add_path(int demand, std::vector<int> lanes);
  int price();  // adds improving paths, returns how many
  // Marks the paths to drop (see the column pool above), from the last optimal solution.
  std::vector<char> stale_paths() const;
  void drop_paths(const std::vector<char>& stale);
  static std::string path_key(int demand, const std::vector<int>& lanes);

  const FlowGraph& g_;
  std::vector<DemandSpec> demands_;
  RoutingOptions routing_;
  std::vector<double> route_length_;
  PathPricer pricer_;
  LpSolver lp_;
  std::vector<int> share_col_, level_row_, growth_col_, flow_row_, cap_row_;
  std::vector<char> reachable_;
  int level_col_ = -1;
  bool route_costs_ = false;
  double path_pool_ = 2.0;
  std::vector<MasterPath> paths_;
  std::unordered_set<std::string> known_;  // demand and lanes of every path, to refuse repeats
  std::vector<std::pair<int, std::vector<int>>> dropped_;  // demand and lanes, until restored
  std::vector<std::vector<int>> demands_by_origin_;
  MultiflowStats stats_;
};

}  // namespace apportion
