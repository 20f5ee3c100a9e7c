// Restricted master LP and column generation; see path_master.h.
#include "apportion/multiflow/path_master.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>

#include "apportion/multiflow/k_shortest_paths.h"

namespace apportion {

namespace {
constexpr int kMaxPricingRounds = 100000;
}  // namespace

PathMaster::PathMaster(const FlowGraph& g, const std::vector<DemandSpec>& demands, const RoutingOptions& routing,
                       const std::vector<double>& route_length)
    : g_(g),
      demands_(demands),
      routing_(routing),
      route_length_(route_length),
      pricer_(g, usable_arcs(g), routing.k_paths > 0 ? 0 : routing.hop_limit) {
  const int K = static_cast<int>(demands_.size());
  cap_row_.assign(g.arc_count(), -1);
  const std::vector<char> usable = usable_arcs(g);
  for (int a = 0; a < g.arc_count(); ++a)
    if (usable[a]) cap_row_[a] = lp_.add_row(-LpSolver::kInf, g.capacity(a));
  level_col_ = lp_.add_column(0.0, 0.0, LpSolver::kInf);
  demands_by_origin_.assign(g.node_count(), {});
  reachable_.assign(K, 0);
  for (int k = 0; k < K; ++k) {
    const DemandSpec& d = demands_[k];
    share_col_.push_back(lp_.add_column(0.0, 0.0, d.amount));
    flow_row_.push_back(lp_.add_row(0.0, 0.0, {share_col_[k]}, {-1.0}));
    level_row_.push_back(lp_.add_row(-LpSolver::kInf, LpSolver::kInf, {share_col_[k], level_col_}, {1.0, -d.weight}));
    growth_col_.push_back(lp_.add_column(0.0, 0.0, 0.0, {level_row_[k]}, {-1.0}));
    demands_by_origin_[d.origin].push_back(k);
  }
  // Starting columns: the k shortest paths (fixed set), or one fewest-arcs path.
  for (int k = 0; k < K; ++k) {
    const DemandSpec& d = demands_[k];
    if (routing_.k_paths > 0) {
      std::vector<LanePath> ps = k_shortest_paths(g.node_count(), pricer_.lanes(), route_length_, d.origin,
                                                  d.destination, routing_.k_paths);
      for (LanePath& p : ps)
        if (routing_.hop_limit <= 0 || static_cast<int>(p.lanes.size()) <= routing_.hop_limit)
          reachable_[k] |= add_path(k, std::move(p.lanes));
    } else {
      LanePath p;
      if (pricer_.shortest_hop_path(d.origin, d.destination, p) &&
          (routing_.hop_limit <= 0 || static_cast<int>(p.lanes.size()) <= routing_.hop_limit)) {
        reachable_[k] = add_path(k, std::move(p.lanes));
      }
    }
    if (!reachable_[k]) lp_.set_column_bounds(share_col_[k], 0.0, 0.0);
  }
}

bool PathMaster::add_path(int demand, std::vector<int> lanes) {
  if (lanes.empty()) return false;
  if (!known_.insert(path_key(demand, lanes)).second) return false;
  // One coefficient per capacity row (both lanes of a two-way arc share the row).
  std::map<int, double> coef;
  double length = 0.0;
  for (int l : lanes) {
    const int arc = pricer_.lanes()[l].arc;
    coef[cap_row_[arc]] += 1.0;
    length += route_length_[arc];
  }
  std::vector<int> rows{flow_row_[demand]};
  std::vector<double> values{1.0};
  for (auto [r, v] : coef) rows.push_back(r), values.push_back(v);
  MasterPath p{demand, std::move(lanes), -1};
  p.column = lp_.add_column(route_costs_ ? length : 0.0, 0.0, LpSolver::kInf, rows, values);
  paths_.push_back(std::move(p));
  ++stats_.path_columns;
  return true;
}

std::string PathMaster::path_key(int demand, const std::vector<int>& lanes) {
  std::string key = std::to_string(demand);
  for (int l : lanes) key += ',' + std::to_string(l);
  return key;
}

std::vector<char> PathMaster::stale_paths() const {
  std::vector<char> stale;
  if (!(path_pool_ > 0) || routing_.k_paths > 0 || static_cast<double>(paths_.size()) <= path_pool_ * lp_.row_count())
    return stale;
  // The same relative tolerance as pricing: a path within it of pricing in is kept.
  double scale = 1.0;
  for (const MasterPath& p : paths_) scale = std::max(scale, std::abs(lp_.reduced_cost(p.column)));
  const double tol = 1e-9 * scale;
  stale.assign(paths_.size(), 0);
  for (std::size_t i = 0; i < paths_.size(); ++i) {
    const int c = paths_[i].column;
    stale[i] = !lp_.is_basic(c) && lp_.value(c) == 0.0 && lp_.reduced_cost(c) > tol;
  }
  return stale;
}

void PathMaster::drop_paths(const std::vector<char>& stale) {
  std::vector<char> drop(lp_.column_count(), 0);
  int dropped = 0;
  for (std::size_t i = 0; i < stale.size(); ++i)
    if (stale[i]) drop[paths_[i].column] = 1, ++dropped;
  if (dropped == 0) return;
  const std::vector<int> moved = lp_.delete_columns(drop);
  std::vector<MasterPath> kept;
  kept.reserve(paths_.size() - dropped);
  for (std::size_t i = 0; i < paths_.size(); ++i) {  // paths priced in after `stale` was read stay
    if (i < stale.size() && stale[i]) {
      known_.erase(path_key(paths_[i].demand, paths_[i].lanes));
      dropped_.push_back({paths_[i].demand, std::move(paths_[i].lanes)});
      continue;
    }
    paths_[i].column = moved[paths_[i].column];
    kept.push_back(std::move(paths_[i]));
  }
  paths_ = std::move(kept);
  // The other columns were added first and are never dropped; remapped all the same.
  level_col_ = moved[level_col_];
  for (int& c : share_col_) c = moved[c];
  for (int& c : growth_col_) c = moved[c];
  stats_.paths_dropped += dropped;
}

void PathMaster::set_route_costs(bool on) {
  if (on == route_costs_) return;
  route_costs_ = on;
  for (const MasterPath& p : paths_) {
    double length = 0.0;
    for (int l : p.lanes) length += route_length_[pricer_.lanes()[l].arc];
    lp_.set_cost(p.column, on ? length : 0.0);
  }
}

int PathMaster::price() {
  double scale = 1.0;
  std::vector<double> length(g_.arc_count(), 0.0);
  for (int a = 0; a < g_.arc_count(); ++a) {
    if (cap_row_[a] < 0) continue;
    // Capacity rows are "<=": their duals are <= 0 at a minimum; rounding may leave +0.
    length[a] = std::max(0.0, -lp_.row_dual(cap_row_[a]));
    scale = std::max(scale, length[a]);
    if (route_costs_) length[a] += route_length_[a];
  }
  for (int k = 0; k < static_cast<int>(demands_.size()); ++k) scale = std::max(scale, std::abs(lp_.row_dual(flow_row_[k])));
  const double tol = 1e-9 * scale;
  int added = 0;
  for (int o = 0; o < g_.node_count(); ++o) {
    if (demands_by_origin_[o].empty()) continue;
    bool searched = false;
    for (int k : demands_by_origin_[o]) {
      if (!reachable_[k]) continue;
      if (!searched) pricer_.search(o, length), searched = true;
      const double dist = pricer_.distance(demands_[k].destination);
      if (dist < lp_.row_dual(flow_row_[k]) - tol)
        added += add_path(k, pricer_.path_to(demands_[k].destination).lanes) ? 1 : 0;
    }
  }
  return added;
}

std::vector<double> PathMaster::capacity_prices() const {
  std::vector<double> y(g_.arc_count(), 0.0);
  double largest = 0.0;
  for (int a = 0; a < g_.arc_count(); ++a)
    if (cap_row_[a] >= 0) y[a] = std::max(0.0, -lp_.row_dual(cap_row_[a])), largest = std::max(largest, y[a]);
  for (double& v : y)
    if (v < 1e-9 * largest) v = 0.0;
  return y;
}

std::vector<double> PathMaster::distances(const std::vector<double>& y) {
  std::vector<double> dist(demands_.size(), std::numeric_limits<double>::infinity());
  if (routing_.k_paths > 0) {
    for (const MasterPath& p : paths_) {
      double len = 0.0;
      for (int l : p.lanes) len += y[pricer_.lanes()[l].arc];
      dist[p.demand] = std::min(dist[p.demand], len);
    }
    return dist;
  }
  for (int o = 0; o < g_.node_count(); ++o) {
    bool searched = false;
    for (int k : demands_by_origin_[o]) {
      if (!reachable_[k]) continue;
      if (!searched) pricer_.search(o, y), searched = true;
      dist[k] = pricer_.distance(demands_[k].destination);
    }
  }
  return dist;
}

LpStatus PathMaster::solve(LpSolver::Method first) {
  for (int round = 0; round < kMaxPricingRounds; ++round) {
    // Later rounds follow new path columns only: primal simplex (see LpSolver::set_method).
    const LpSolver::Method method = round == 0 ? first : LpSolver::Method::kPrimal;
    lp_.set_method(method);
    LpStatus s = lp_.solve();
    ++stats_.lp_solves;
    // HiGHS's primal simplex can end "infeasible" from a feasible point, with no primal
    // infeasibility left in its log (seen in the fairness certificate's LPs, GtsCe with
    // 2,000 demands); the dual simplex, from the same basis, settles it.
    if (method == LpSolver::Method::kPrimal && (s == LpStatus::kInfeasible || s == LpStatus::kFailed)) {
      lp_.set_method(LpSolver::Method::kDual);
      s = lp_.solve();
      ++stats_.lp_solves;
    }
    stats_.simplex_iterations = lp_.total_iterations();
    if (s == LpStatus::kInfeasible && !dropped_.empty()) {
      // A change that moved off the last solution (the amount search's tests) can need a
      // path that was dropped: the restricted LP is then infeasible where the full one is
      // not. Every dropped path comes back, which restores the column set of an engine that
      // never drops (that set held every earlier solution), and the LP is solved again.
      std::vector<std::pair<int, std::vector<int>>> back = std::move(dropped_);
      dropped_.clear();
      for (auto& [k, lanes] : back) add_path(k, std::move(lanes));
      ++stats_.paths_restored;
      continue;
    }
    if (s != LpStatus::kOptimal) return s;
    if (routing_.k_paths > 0) return s;
    ++stats_.pricing_rounds;
    const std::vector<char> stale = stale_paths();  // read before pricing changes the LP
    if (price() == 0) return s;
    if (!stale.empty()) drop_paths(stale);  // only before a solve: the caller reads the last one
  }
  return LpStatus::kFailed;
}

}  // namespace apportion
