// The origin-aggregated master of the max-min rounds; see origin_master.h.
#include "apportion/multiflow/origin_master.h"

#include <algorithm>
#include <cmath>
#include <map>

namespace apportion {

namespace {
constexpr double kInf = LpSolver::kInf;
constexpr int kMaxPricingRounds = 100000;
// A round goes on from the last basis in tens to hundreds of iterations: far more means the
// simplex has stalled. A stalled dual simplex fails the solve, and the engine falls back to
// the per-demand LP (solve_multiflow).
constexpr long long kPrimalLimit = 20000, kDualLimit = 200000;
}  // namespace

OriginMaster::OriginMaster(const FlowGraph& g, const std::vector<DemandSpec>& demands, const RoutingOptions& routing,
                           const std::vector<double>& route_length)
    : g_(g),
      demands_(demands),
      route_length_(route_length),
      usable_(usable_arcs(g)),
      pricer_(g, usable_, routing.hop_limit) {
  const int K = static_cast<int>(demands_.size());
  reachable_.assign(K, 0);
  open_.assign(K, 0);
  dual_.assign(K, 0.0);
  price_.assign(g.arc_count(), 0.0);
  groups_of_origin_.assign(g.node_count(), {});
  open_group_.assign(g.node_count(), -1);
  cap_row_.assign(g.arc_count(), -1);
  for (int a = 0; a < g.arc_count(); ++a)
    if (usable_[a]) cap_row_[a] = lp_.add_row(-kInf, g.capacity(a));
  // Starting columns: per origin, the fewest-arcs path to each destination.
  std::vector<std::vector<int>> members(g.node_count());
  std::vector<std::vector<OriginPiece>> first(g.node_count());
  for (int k = 0; k < K; ++k) {
    const DemandSpec& d = demands_[k];
    LanePath p;
    if (pricer_.shortest_hop_path(d.origin, d.destination, p) && !p.lanes.empty() &&
        (routing.hop_limit <= 0 || static_cast<int>(p.lanes.size()) <= routing.hop_limit)) {
      reachable_[k] = open_[k] = 1;
      members[d.origin].push_back(k);
      first[d.origin].push_back({k, std::move(p.lanes), d.weight});
    }
  }
  for (int o = 0; o < g.node_count(); ++o) {
    if (members[o].empty()) continue;
    open_group_[o] = add_group(o, std::move(members[o]));
    add_column({open_group_[o], std::move(first[o]), 0.0}, false);
  }
}

// A group's row: its routings less its increments = 0.
int OriginMaster::add_group(int origin, std::vector<int> demands) {
  Group grp{origin, std::move(demands), lp_.add_row(0.0, 0.0), base_};
  groups_.push_back(std::move(grp));
  const int index = static_cast<int>(groups_.size()) - 1;
  groups_of_origin_[origin].push_back(index);
  return index;
}

double OriginMaster::path_length(const std::vector<int>& lanes) const {
  double length = 0.0;
  for (int l : lanes) length += route_length_[pricer_.lanes()[l].arc];
  return length;
}

double OriginMaster::column_cost(const Column& c) const {
  double cost = 0.0;
  for (const OriginPiece& p : c.pieces) cost += p.amount * path_length(p.lanes);
  return cost;
}

int OriginMaster::add_column(Column c, bool route_costs) {
  if (c.pieces.empty()) return -1;
  std::map<int, double> load;
  for (const OriginPiece& p : c.pieces)
    for (int l : p.lanes) load[cap_row_[pricer_.lanes()[l].arc]] += p.amount;
  std::vector<int> rows{groups_[c.group].row};
  std::vector<double> values{1.0};
  for (auto [r, v] : load) rows.push_back(r), values.push_back(v);
  const int col = lp_.add_column(route_costs ? column_cost(c) : 0.0, 0.0, kInf, rows, values);
  columns_.push_back(std::move(c));
  lp_column_.push_back(col);
  return col;
}

// The round's increment keeps its value for good; its cost goes, so that the next round's
// increment is the one the LP raises.
void OriginMaster::fix_increment() {
  if (increment_fixed_) return;
  // An increment at rounding-noise size (seen: 2e-17 after a round at an unchanged level)
  // is 0: kept, it fixes bounds of 1e-17 beside shares of 1e-2, and the primal simplex lost
  // feasibility in its clean-up and stalled (GtsCe, 10,000 demands).
  double d = level_ - base_;
  if (!(d > 1e-9 * level_)) d = 0.0, level_ = base_;
  lp_.set_column_bounds(increment_, d, d);
  lp_.set_cost(increment_, 0.0);
  base_ = level_;
  increment_fixed_ = true;
}

// Routings out of the basis and at zero are dropped when the columns outnumber the rows
// twice (the basis stays valid; pricing brings back one that pays again). Every column is
// dense -- a routing crosses most arcs -- so the simplex's pricing costs as much as all
// columns together (measured: 44 % of the time in column-wise pricing with 14,000 columns
// on 2,300 rows, GtsCe with 10,000 demands). Measured (GtsCe with 2,000 demands, Geant2012
// with all pairs; ms): a pool of 1.2 rows + 100 5,147 / 9,510; 2 rows + 200 3,755 / 8,264;
// 3 rows + 400 4,338 / 8,433; 4 rows + 600 5,556 / 8,080; 6 rows + 1,000 13,628 / 10,007.
void OriginMaster::drop_idle_columns() {
  if (columns_.size() <= 2 * static_cast<std::size_t>(lp_.row_count()) + 200) return;
  std::vector<char> drop(lp_.column_count(), 0);
  bool any = false;
  for (std::size_t i = 0; i < columns_.size(); ++i) {
    const int col = lp_column_[i];
    if (!lp_.is_basic(col) && !(columns_[i].value > 0)) drop[col] = 1, any = true;
  }
  if (!any) return;
  const std::vector<int> index = lp_.delete_columns(drop);
  std::vector<Column> kept;
  std::vector<int> kept_col;
  for (std::size_t i = 0; i < columns_.size(); ++i) {
    if (index[lp_column_[i]] < 0) continue;
    kept_col.push_back(index[lp_column_[i]]);
    kept.push_back(std::move(columns_[i]));
  }
  columns_ = std::move(kept);
  lp_column_ = std::move(kept_col);
  if (increment_ >= 0) increment_ = index[increment_];
}

LpStatus OriginMaster::solve_with_pricing(bool route_costs) {
  std::vector<double> length(g_.arc_count(), 0.0);
  known_.clear();
  for (int round = 0; round < kMaxPricingRounds; ++round) {
    // Every change the rounds make keeps the last solution feasible, so the primal simplex
    // goes on from it; should it stall (seen on degenerate LPs), the dual simplex takes over
    // from where it stopped, and then a cold start.
    lp_.set_method(LpSolver::Method::kPrimal);
    lp_.set_iteration_limit(kPrimalLimit);
    LpStatus s = lp_.solve();
    ++stats_.lp_solves;
    stats_.simplex_iterations += lp_.last_iterations();
    // The primal simplex can also end "infeasible" where the last solution stands within
    // the tolerances (seen: 1.03e-7 in all after a round's increment of 1e-7 was fixed).
    if (s == LpStatus::kFailed || s == LpStatus::kInfeasible) {
      lp_.set_method(LpSolver::Method::kDual);
      lp_.set_iteration_limit(kDualLimit);
      s = lp_.solve();
      ++stats_.lp_solves;
      stats_.simplex_iterations += lp_.last_iterations();
    }
    if (s == LpStatus::kFailed || s == LpStatus::kInfeasible) {
      lp_.set_hot_start(false);
      s = lp_.solve();
      lp_.set_hot_start(true);
      ++stats_.lp_solves;
      stats_.simplex_iterations += lp_.last_iterations();
    }
    if (s != LpStatus::kOptimal) return s;
    ++stats_.pricing_rounds;
    double scale = 1.0;
    for (int a = 0; a < g_.arc_count(); ++a) {
      price_[a] = cap_row_[a] >= 0 ? std::max(0.0, -lp_.row_dual(cap_row_[a])) : 0.0;
      scale = std::max(scale, price_[a]);
      length[a] = price_[a] + (route_costs ? route_length_[a] : 0.0);
    }
    for (const Group& grp : groups_) scale = std::max(scale, std::abs(lp_.row_dual(grp.row)));
    const double tol = 1e-9 * scale;
    int added = 0;
    std::vector<double> dist(demands_.size(), 0.0);
    for (int o = 0; o < g_.node_count(); ++o) {
      if (groups_of_origin_[o].empty()) continue;
      pricer_.search(o, length);
      for (int gi : groups_of_origin_[o])
        for (int k : groups_[gi].demands) {
          dist[k] = pricer_.distance(demands_[k].destination);
          if (open_[k]) dual_[k] = dist[k];
        }
      // Reduced cost of a routing: its cost plus what it pays for capacity, less its row's
      // dual. The paths are read only for a routing that prices in. A routing priced in
      // before in this solve is not added again: the LP solver judged it at its own
      // tolerance (1e-7) and found nothing to gain.
      for (int gi : groups_of_origin_[o]) {
        const Group& grp = groups_[gi];
        if (grp.dead) continue;
        double len = 0.0;
        for (int k : grp.demands) len += demands_[k].weight * dist[k];
        if (!(len < lp_.row_dual(grp.row) - tol)) continue;
        Column c{gi, {}, 0.0};
        for (int k : grp.demands) c.pieces.push_back({k, pricer_.path_to(demands_[k].destination).lanes, demands_[k].weight});
        if (known_.insert(key(c)).second) added += add_column(std::move(c), route_costs) >= 0;
      }
    }
    stats_.path_columns += added;
    if (added == 0) {
      for (std::size_t i = 0; i < columns_.size(); ++i) columns_[i].value = lp_.value(lp_column_[i]);
      if (!increment_fixed_) level_ = base_ + lp_.value(increment_);
      drop_idle_columns();
      return s;
    }
  }
  return LpStatus::kFailed;
}

std::string OriginMaster::key(const Column& c) {
  std::string k = std::to_string(c.group);
  for (const OriginPiece& p : c.pieces) {
    k += ';';
    for (int l : p.lanes) k += std::to_string(l) + ',';
  }
  return k;
}

LpStatus OriginMaster::raise(double cap) {
  fix_increment();
  std::vector<int> rows;
  std::vector<double> values;
  for (int o = 0; o < g_.node_count(); ++o)
    if (open_group_[o] >= 0) rows.push_back(groups_[open_group_[o]].row), values.push_back(-1.0);
  increment_ = lp_.add_column(-1.0, 0.0, std::max(0.0, cap - base_), rows, values);
  increment_fixed_ = false;
  level_ = base_;
  return solve_with_pricing(false);
}

LpStatus OriginMaster::tidy() {
  fix_increment();
  for (std::size_t i = 0; i < columns_.size(); ++i) lp_.set_cost(lp_column_[i], column_cost(columns_[i]));
  return solve_with_pricing(true);
}

void OriginMaster::freeze(const std::vector<int>& demands) {
  fix_increment();
  std::vector<char> touched(g_.node_count(), 0);
  for (int k : demands)
    if (open_[k]) open_[k] = 0, touched[demands_[k].origin] = 1;
  for (int o = 0; o < g_.node_count(); ++o) {
    if (!touched[o]) continue;
    // The open group closes with the increments it has; the demands still open form a new
    // one, whose first routings are the old group's routings in use without the demands
    // that froze.
    const int old = open_group_[o];
    // A group that closes at the level it opened with (a second round at one level) routes
    // nothing: its routings are held at 0 by their bounds and it is priced no more, so that
    // such groups do not fill the LP with degenerate columns.
    if (!(base_ > groups_[old].start)) {
      groups_[old].dead = true;
      for (std::size_t i = 0; i < columns_.size(); ++i)
        if (columns_[i].group == old) lp_.set_column_bounds(lp_column_[i], 0.0, 0.0);
    }
    std::vector<int> rest;
    for (int k : groups_[old].demands)
      if (open_[k]) rest.push_back(k);
    open_group_[o] = -1;
    if (rest.empty()) continue;
    const int now = add_group(o, std::move(rest));
    open_group_[o] = now;
    const std::size_t count = columns_.size();
    for (std::size_t i = 0; i < count; ++i) {
      if (columns_[i].group != old || !(columns_[i].value > 0)) continue;
      Column c{now, {}, 0.0};
      for (const OriginPiece& p : columns_[i].pieces)
        if (open_[p.demand]) c.pieces.push_back(p);
      add_column(std::move(c), false);
    }
  }
}

std::vector<OriginPiece> OriginMaster::routing() const {
  std::map<std::pair<int, std::vector<int>>, double> flows;
  for (const Column& c : columns_)
    if (c.value > 0)
      for (const OriginPiece& p : c.pieces) flows[{p.demand, p.lanes}] += p.amount * c.value;
  std::vector<OriginPiece> out;
  for (const auto& [key, amount] : flows) out.push_back({key.first, key.second, amount});
  return out;
}

}  // namespace apportion
