// The origin-aggregated master of the max-min rounds; see origin_master.h.
#include "apportion/multiflow/origin_master.h"

#include <algorithm>
#include <cmath>
#include <map>

namespace apportion {

namespace {
constexpr double kInf = LpSolver::kInf;
constexpr int kMaxPricingRounds = 100000;
// These LPs have a few hundred rows and need a few hundred iterations: far more means the
// simplex has stalled. A stalled dual simplex fails the solve, and the engine falls back to
// the per-demand LP (solve_multiflow).
constexpr long long kPrimalLimit = 20000, kDualLimit = 200000;
}  // namespace

OriginMaster::OriginMaster(const FlowGraph& g, const std::vector<DemandSpec>& demands, const RoutingOptions& routing,
                           const std::vector<double>& route_length)
    : g_(g),
      demands_(demands),
      route_length_(route_length),
      pricer_(g, usable_arcs(g), routing.hop_limit),
      usable_(usable_arcs(g)) {
  const int K = static_cast<int>(demands_.size());
  reachable_.assign(K, 0);
  open_.assign(K, 0);
  share_.assign(K, 0.0);
  dual_.assign(K, 0.0);
  price_.assign(g.arc_count(), 0.0);
  by_origin_.assign(g.node_count(), {});
  // Starting columns: per origin, the fewest-arcs path to each destination.
  std::vector<Column> first(g.node_count());
  for (int k = 0; k < K; ++k) {
    const DemandSpec& d = demands_[k];
    by_origin_[d.origin].push_back(k);
    LanePath p;
    if (pricer_.shortest_hop_path(d.origin, d.destination, p) && !p.lanes.empty() &&
        (routing.hop_limit <= 0 || static_cast<int>(p.lanes.size()) <= routing.hop_limit)) {
      reachable_[k] = open_[k] = 1;
      first[d.origin].origin = d.origin;
      first[d.origin].pieces.push_back({k, std::move(p.lanes), d.weight});
    }
  }
  for (Column& c : first)
    if (!c.pieces.empty()) columns_.push_back(std::move(c));
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

void OriginMaster::build_lp(bool route_costs) {
  lp_ = std::make_unique<LpSolver>();
  // The frozen routings come from earlier solutions, which meet the capacities to the LP's
  // tolerance (1e-7), not exactly: fixed now, such an excess would make the LP infeasible
  // (seen: 3e-8 on a capacity of 1.25 after 108 rounds). An arc keeps the excess it has, up
  // to 1e-7 of its capacity (the independent check allows 1e-6); a larger one is left to
  // fail, and the engine falls back to the per-demand LP.
  std::vector<double> frozen_load(g_.arc_count(), 0.0);
  for (const Column& c : columns_)
    if (!c.open)
      for (const OriginPiece& p : c.pieces)
        for (int l : p.lanes) frozen_load[pricer_.lanes()[l].arc] += p.amount * c.value;
  cap_row_.assign(g_.arc_count(), -1);
  for (int a = 0; a < g_.arc_count(); ++a) {
    const double cap = g_.capacity(a);
    if (usable_[a]) cap_row_[a] = lp_->add_row(-kInf, frozen_load[a] <= cap * (1 + 1e-7) ? std::max(cap, frozen_load[a]) : cap);
  }
  level_col_ = lp_->add_column(route_costs ? 0.0 : -1.0, 0.0, route_costs ? 0.0 : cap_);
  open_row_.assign(g_.node_count(), -1);
  frozen_row_.assign(g_.node_count(), -1);
  for (int o = 0; o < g_.node_count(); ++o) {
    bool any_open = false, any_frozen = false;
    for (int k : by_origin_[o]) any_open |= open_[k] != 0, any_frozen |= !open_[k] && share_[k] > 0;
    if (any_open) open_row_[o] = lp_->add_row(0.0, 0.0, {level_col_}, {-1.0});
    if (any_frozen) frozen_row_[o] = lp_->add_row(1.0, 1.0);
  }
  std::vector<Column> kept = std::move(columns_);
  columns_.clear();
  lp_column_.clear();
  for (Column& c : kept) add_column(std::move(c), route_costs);
}

int OriginMaster::add_column(Column c, bool route_costs) {
  const int row = c.open ? open_row_[c.origin] : frozen_row_[c.origin];
  if (row < 0 || c.pieces.empty()) return -1;
  std::map<int, double> load;
  for (const OriginPiece& p : c.pieces)
    for (int l : p.lanes) load[cap_row_[pricer_.lanes()[l].arc]] += p.amount;
  std::vector<int> rows{row};
  std::vector<double> values{1.0};
  for (auto [r, v] : load) rows.push_back(r), values.push_back(v);
  const int col = lp_->add_column(route_costs ? column_cost(c) : 0.0, 0.0, kInf, rows, values);
  columns_.push_back(std::move(c));
  lp_column_.push_back(col);
  return col;
}

LpStatus OriginMaster::solve_with_pricing(bool route_costs) {
  std::vector<double> length(g_.arc_count(), 0.0);
  for (int round = 0; round < kMaxPricingRounds; ++round) {
    // After new columns, the primal simplex goes on from the last basis (still feasible);
    // should it stall (it did once, on a degenerate LP: 200,000 iterations at an optimum it
    // could not prove), the dual simplex takes over from where it stopped.
    const bool primal = round > 0;
    lp_->set_method(primal ? LpSolver::Method::kPrimal : LpSolver::Method::kDual);
    lp_->set_iteration_limit(primal ? kPrimalLimit : kDualLimit);
    LpStatus s = lp_->solve();
    ++stats_.lp_solves;
    stats_.simplex_iterations += lp_->last_iterations();
    if (s == LpStatus::kFailed && primal) {
      lp_->set_method(LpSolver::Method::kDual);
      lp_->set_iteration_limit(kDualLimit);
      s = lp_->solve();
      ++stats_.lp_solves;
      stats_.simplex_iterations += lp_->last_iterations();
    }
    if (s == LpStatus::kFailed) {
      // An ill-conditioned basis (seen: HiGHS raising its Markowitz threshold, then giving
      // up) is left behind: the dual simplex starts again from the slack basis.
      lp_->set_hot_start(false);
      s = lp_->solve();
      lp_->set_hot_start(true);
      ++stats_.lp_solves;
      stats_.simplex_iterations += lp_->last_iterations();
    }
    if (s != LpStatus::kOptimal) return s;
    ++stats_.pricing_rounds;
    double scale = 1.0;
    for (int a = 0; a < g_.arc_count(); ++a) {
      price_[a] = cap_row_[a] >= 0 ? std::max(0.0, -lp_->row_dual(cap_row_[a])) : 0.0;
      scale = std::max(scale, price_[a]);
      length[a] = price_[a] + (route_costs ? route_length_[a] : 0.0);
    }
    for (int o = 0; o < g_.node_count(); ++o) {
      if (open_row_[o] >= 0) scale = std::max(scale, std::abs(lp_->row_dual(open_row_[o])));
      if (frozen_row_[o] >= 0) scale = std::max(scale, std::abs(lp_->row_dual(frozen_row_[o])));
    }
    const double tol = 1e-9 * scale;
    int added = 0;
    for (int o = 0; o < g_.node_count(); ++o) {
      if (open_row_[o] < 0 && frozen_row_[o] < 0) continue;
      pricer_.search(o, length);
      double open_len = 0.0, frozen_len = 0.0;
      for (int k : by_origin_[o]) {
        if (!reachable_[k]) continue;
        const double dist = pricer_.distance(demands_[k].destination);
        if (open_[k]) dual_[k] = dist, open_len += demands_[k].weight * dist;
        else if (share_[k] > 0) frozen_len += share_[k] * dist;
      }
      // Reduced cost of a routing: its cost plus what it pays for capacity, less its row's
      // dual. The paths are read only for a routing that prices in. A routing priced in
      // before is not added again: the LP solver judged it at its own tolerance (1e-7) and
      // found nothing to gain.
      for (const bool open : {true, false}) {
        const int row = open ? open_row_[o] : frozen_row_[o];
        if (row < 0 || !((open ? open_len : frozen_len) < lp_->row_dual(row) - tol)) continue;
        Column c{o, open, {}, 0.0};
        for (int k : by_origin_[o])
          if (reachable_[k] && (open ? open_[k] != 0 : !open_[k] && share_[k] > 0))
            c.pieces.push_back({k, pricer_.path_to(demands_[k].destination).lanes, open ? demands_[k].weight : share_[k]});
        if (known_.insert(key(c)).second) added += add_column(std::move(c), route_costs) >= 0;
      }
    }
    stats_.path_columns += added;
    if (added == 0) {
      for (std::size_t i = 0; i < columns_.size(); ++i) columns_[i].value = lp_->value(lp_column_[i]);
      level_ = lp_->value(level_col_);
      return s;
    }
  }
  return LpStatus::kFailed;
}

std::string OriginMaster::key(const Column& c) {
  std::string k = std::to_string(c.origin) + (c.open ? "o" : "f");
  for (const OriginPiece& p : c.pieces) {
    k += ';' + std::to_string(p.demand) + ':';
    for (int l : p.lanes) k += std::to_string(l) + ',';
  }
  return k;
}

LpStatus OriginMaster::raise(double cap) {
  cap_ = cap;
  known_.clear();
  build_lp(false);
  return solve_with_pricing(false);
}

LpStatus OriginMaster::tidy() {
  known_.clear();
  build_lp(true);
  return solve_with_pricing(true);
}

void OriginMaster::freeze(const std::vector<int>& demands, const std::vector<double>& shares) {
  std::vector<char> touched(g_.node_count(), 0), now(demands_.size(), 0);
  for (std::size_t i = 0; i < demands.size(); ++i) {
    const int k = demands[i];
    if (!open_[k]) continue;
    open_[k] = 0;
    share_[k] = shares[i];
    now[k] = 1;
    touched[demands_[k].origin] = 1;
  }
  std::vector<Column> kept;
  std::vector<std::map<std::pair<int, std::vector<int>>, double>> flows(g_.node_count());
  for (Column& c : columns_) {
    if (!(c.value > 0)) continue;  // unused: pricing brings back what is needed
    if (!touched[c.origin]) {
      kept.push_back(std::move(c));
      continue;
    }
    // The flows the solution sends to the origin's frozen destinations go into its new
    // frozen routing; an open routing keeps the rest.
    Column rest{c.origin, true, {}, c.value};
    for (OriginPiece& p : c.pieces) {
      if (!c.open || now[p.demand])
        flows[c.origin][{p.demand, p.lanes}] += p.amount * c.value;
      else
        rest.pieces.push_back(std::move(p));
    }
    if (c.open && !rest.pieces.empty()) kept.push_back(std::move(rest));
  }
  for (int o = 0; o < g_.node_count(); ++o) {
    if (!touched[o]) continue;
    // Each frozen demand's paths scaled to its share exactly (the solution holds it to the
    // LP's tolerances).
    std::vector<double> sent(demands_.size(), 0.0);
    for (const auto& [key, amount] : flows[o]) sent[key.first] += amount;
    // Flows below 1e-7 of their demand's share are at the LP's tolerance; kept, they put
    // coefficients 1e-9 beside 10 into the LP, which then stalled the simplex or left it an
    // ill-conditioned basis (GtsCe, 5,000 and 10,000 demands). The rest of the demand's
    // flow takes them over (an arc gains at most 1e-7 of a share; see build_lp).
    for (const auto& [key, amount] : flows[o])
      if (share_[key.first] > 0 && amount < 1e-7 * share_[key.first]) sent[key.first] -= amount;
    Column c{o, false, {}, 1.0};
    for (const auto& [key, amount] : flows[o]) {
      const int k = key.first;
      if (share_[k] > 0 && sent[k] > 0 && amount >= 1e-7 * share_[k])
        c.pieces.push_back({k, key.second, amount * share_[k] / sent[k]});
    }
    for (int k : by_origin_[o]) {
      if (open_[k] || !(share_[k] > 0) || sent[k] > 0) continue;
      LanePath p;  // not routed in the solution (cannot happen for a positive share): fewest arcs
      if (pricer_.shortest_hop_path(o, demands_[k].destination, p)) c.pieces.push_back({k, std::move(p.lanes), share_[k]});
    }
    if (!c.pieces.empty()) kept.push_back(std::move(c));
  }
  columns_ = std::move(kept);
  lp_.reset();
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
