// The fair-multiflow engine; see fair_multiflow.h for the method and multiflow.h for the
// definitions.
#include "apportion/multiflow/fair_multiflow.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <queue>

#include "apportion/flow/flow_graph.h"
#include "apportion/model/number_text.h"
#include "apportion/model/tolerance.h"
#include "apportion/multiflow/fair_certificate.h"
#include "apportion/multiflow/origin_master.h"
#include "apportion/multiflow/path_master.h"
#include "apportion/multiflow/unit_scale.h"

namespace apportion {

const char* objective_name(FairObjective o) {
  switch (o) {
    case FairObjective::kFeasibility: return "feasibility";
    case FairObjective::kMaxThroughput: return "max-throughput";
    case FairObjective::kMaxConcurrent: return "max-concurrent";
    case FairObjective::kMaxMinFair: return "max-min-fair";
    case FairObjective::kTradeoff: return "tradeoff";
  }
  return "unknown";
}

bool objective_from_name(const std::string& name, FairObjective& out) {
  for (FairObjective o : {FairObjective::kFeasibility, FairObjective::kMaxThroughput, FairObjective::kMaxConcurrent,
                          FairObjective::kMaxMinFair, FairObjective::kTradeoff})
    if (name == objective_name(o)) return out = o, true;
  return false;
}

namespace {

// Whether the max-min rounds of `demands` demands run on the LP aggregated by origin.
bool rounds_by_origin(const FairOptions& o, int demands) { return demands >= o.origin_rounds_from && o.routing.k_paths <= 0; }

constexpr double kInf = LpSolver::kInf;
// The cap on a demand's growth in a saturation test, in units of its tolerance: 1e6 x 1e-9
// = 1e-3 of its own scale, far above the LP tolerances and small enough to share.
constexpr double kGrowthCap = 1e6;

// Everything one solve needs: the graph, the demands and the master LP.
class Engine {
 public:
  Engine(const Network& net, const FairOptions& opt)
      : net_(net),
        opt_(opt),
        g_(FlowGraph::from_network(net)),
        specs_(demand_specs(net)),
        master_(g_, specs_, opt.routing, std::vector<double>(g_.arc_count(), 1.0)),
        demand_tol_(demand_tolerances()) {
    master_.lp().set_hot_start(opt.hot_start);
    master_.set_path_pool(opt.path_pool);
  }

  MultiflowResult run();

 private:
  std::vector<Tolerance> demand_tolerances() const;
  int K() const { return static_cast<int>(specs_.size()); }
  LpSolver& lp() { return master_.lp(); }
  // `clock`, when given, gains the seconds of this solve (MultiflowStats: where the time goes).
  bool solve(MultiflowResult& r, LpSolver::Method first = LpSolver::Method::kDual, double* clock = nullptr) {
    const auto start = std::chrono::steady_clock::now();
    const LpStatus s = master_.solve(first);
    if (clock) *clock += std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    report(master_.stats().lp_solves + origin_stats_.lp_solves);
    if (s == LpStatus::kOptimal) return true;
    r.status = SolveStatus::kNumericalDifficulty;
    r.message = std::string("the LP solver reported '") + lp_status_name(s) + "' (" + lp().last_message() + ")";
    return false;
  }
  void report(int lp_solves) {
    if (!opt_.on_progress) return;
    progress_.demands = K();
    progress_.lp_solves = lp_solves;
    opt_.on_progress(progress_);
  }
  // Shares: bounds of f_k; all level rows off; no objective.
  void reset_objective() {
    lp().set_cost(master_.level_column(), 0.0);
    lp().set_column_bounds(master_.level_column(), 0.0, kInf);
    for (int k = 0; k < K(); ++k) {
      lp().set_cost(master_.share_column(k), 0.0);
      lp().set_row_bounds(master_.level_row(k), -kInf, kInf);
      lp().set_coefficient(master_.level_row(k), master_.level_column(), -specs_[k].weight);
    }
    master_.set_route_costs(false);
  }
  void share_bounds(int k, double lo, double hi) {
    if (!master_.reachable(k)) lo = hi = 0.0;
    lp().set_column_bounds(master_.share_column(k), lo, std::max(lo, hi));
  }

  bool max_min(MultiflowResult& r, std::vector<double>& fair);
  void place_unreachable(MultiflowResult& r, std::vector<int>& freeze, std::vector<int>& unreachable, double t);
  void zero_tier(MultiflowResult& r, const std::vector<int>& unreachable);
  // A round's open demands, the lowest of their amount levels a_k / w_k and their weights' sum.
  struct OpenDemands {
    std::vector<int> demands;
    double cap = kInf, weight_sum = 0.0;
  };
  OpenDemands open_demands(const std::vector<char>& frozen) const;
  bool max_min_by_origin(MultiflowResult& r, std::vector<double>& fair, std::vector<OriginPiece>& routes);
  bool fair_shares(MultiflowResult& r, std::vector<double>& fair, std::vector<OriginPiece>& routes);
  bool use_origins() const { return rounds_by_origin(opt_, K()); }
  bool reaches(const std::vector<int>& open, const std::vector<int>& group, const std::vector<double>& levels, int g,
               bool& yes, MultiflowResult& r, LpSolver::Method method);
  double ceiling(const std::vector<int>& all, const std::vector<char>& frozen, const std::vector<double>& fair);
  bool settle_amounts(MultiflowResult& r, std::vector<double>& fair, std::vector<char>& frozen,
                      const std::vector<int>& at_amount, const std::vector<int>& open, double t, double& no_search_from,
                      bool& settled);
  bool max_throughput(MultiflowResult& r, bool finite_only, double& value);
  bool max_concurrent(MultiflowResult& r, double& lambda);
  bool tidy_routes(MultiflowResult& r, LpSolver::Method first = LpSolver::Method::kDual);
  void collect(MultiflowResult& r, const std::vector<double>* fixed_shares);
  void collect_routes(MultiflowResult& r, const std::vector<OriginPiece>& routes, const std::vector<double>* fixed_shares);
  void explain_tiers(MultiflowResult& r);
  void feasibility_certificate(MultiflowResult& r);
  void totals(MultiflowResult& r);
  void add_stats(MultiflowResult& r) const {
    const MultiflowStats& ms = master_.stats();
    r.stats.lp_solves = ms.lp_solves + origin_stats_.lp_solves;
    r.stats.simplex_iterations = ms.simplex_iterations + origin_stats_.simplex_iterations;
    r.stats.pricing_rounds = ms.pricing_rounds + origin_stats_.pricing_rounds;
    r.stats.path_columns = ms.path_columns + origin_stats_.path_columns;
    r.stats.paths_dropped = ms.paths_dropped;
    r.stats.paths_restored = ms.paths_restored;
  }

  // The method for a solve after changes that keep the last solution feasible (see
  // FairOptions::dual_rounds: the dual simplex is slower, but its solutions lie on their bounds).
  LpSolver::Method onward() const { return opt_.dual_rounds ? LpSolver::Method::kDual : LpSolver::Method::kPrimal; }

  const Network& net_;
  FairOptions opt_;
  FlowGraph g_;
  std::vector<DemandSpec> specs_;
  PathMaster master_;
  std::vector<Tolerance> demand_tol_;  // per demand: 1e-9 of its own scale (demand_tolerances)
  std::vector<double> concurrent_lengths_;
  SolveProgress progress_;
  MultiflowStats origin_stats_;  // of the origin-aggregated rounds (origin_master.h)
};

// Whether a demand's share is zero, reached its amount or grew is judged at the demand's own
// scale: the bottleneck of its widest path, or its amount if smaller. A global scale (the
// largest capacity) would call a 0.001 share "zero" in a network with 1e9 arcs and freeze it
// there. Demands that cannot be served use the smallest positive capacity.
std::vector<Tolerance> Engine::demand_tolerances() const {
  const double found = net_.positive_capacities().smallest;
  const double smallest = found > 0 ? found : 1.0;
  const std::vector<Lane>& lanes = master_.lanes();
  std::vector<std::vector<int>> out(g_.node_count());
  for (int i = 0; i < static_cast<int>(lanes.size()); ++i) out[lanes[i].tail].push_back(i);
  std::vector<std::vector<int>> by_origin(g_.node_count());
  for (int k = 0; k < K(); ++k) by_origin[specs_[k].origin].push_back(k);
  std::vector<Tolerance> tols(K(), Tolerance(1e-9 * smallest));
  std::vector<double> width(g_.node_count());
  for (int o = 0; o < g_.node_count(); ++o) {
    if (by_origin[o].empty()) continue;
    // Widest paths from o: Dijkstra with min() for the path and max() for the choice.
    std::fill(width.begin(), width.end(), 0.0);
    width[o] = kInf;
    std::priority_queue<std::pair<double, int>> heap;
    heap.push({kInf, o});
    while (!heap.empty()) {
      const auto [w, u] = heap.top();
      heap.pop();
      if (w < width[u]) continue;
      for (int i : out[u]) {
        const double through = std::min(w, g_.capacity(lanes[i].arc));
        if (through > width[lanes[i].head]) width[lanes[i].head] = through, heap.push({through, lanes[i].head});
      }
    }
    for (int k : by_origin[o]) {
      const double scale = std::min(width[specs_[k].destination], specs_[k].amount);
      if (scale > 0) tols[k] = Tolerance(1e-9 * scale);
    }
  }
  return tols;
}

// Demands no path can serve freeze at 0 with the first round that reaches level 0 (joining
// `freeze`), or form the first tier of their own, before the round's tier.
void Engine::place_unreachable(MultiflowResult& r, std::vector<int>& freeze, std::vector<int>& unreachable, double t) {
  if (unreachable.empty()) return;
  bool level_zero = true;  // zero for every demand of this round, at its own scale
  for (int k : freeze) level_zero = level_zero && demand_tol_[k].zero(t * specs_[k].weight);
  if (level_zero) {
    freeze.insert(freeze.end(), unreachable.begin(), unreachable.end());
  } else {
    zero_tier(r, unreachable);
  }
  unreachable.clear();
}

Engine::OpenDemands Engine::open_demands(const std::vector<char>& frozen) const {
  OpenDemands o;
  for (int k = 0; k < K(); ++k) {
    if (frozen[k]) continue;
    o.demands.push_back(k);
    o.cap = std::min(o.cap, specs_[k].amount / specs_[k].weight);
    o.weight_sum += specs_[k].weight;
  }
  return o;
}

// The demands no path can serve, as a tier at level 0 after the tiers so far.
void Engine::zero_tier(MultiflowResult& r, const std::vector<int>& unreachable) {
  Tier zero;
  zero.index = static_cast<int>(r.tiers.size()) + 1;
  zero.demands = unreachable;
  for (int k : unreachable) r.demands[k].tier = zero.index;
  r.tiers.push_back(zero);
}

// Progressive filling with exact freezing; fills r.tiers and r.demands[k].tier and
// limited_by_amount, and `fair` with the shares.
bool Engine::max_min(MultiflowResult& r, std::vector<double>& fair) {
  reset_objective();
  fair.assign(K(), 0.0);
  std::vector<char> frozen(K(), 0);
  std::vector<int> unreachable;
  for (int k = 0; k < K(); ++k) {
    share_bounds(k, 0.0, specs_[k].amount);
    if (!master_.reachable(k)) frozen[k] = 1, unreachable.push_back(k);
  }
  const int level = master_.level_column();
  progress_.stage = "max-min fair";
  // Amount levels at or above this one were tested and not reached since the last freeze at
  // a bottleneck (settle_amounts); freezing demands at their amounts does not change that.
  double no_search_from = kInf;
  for (int round = 1;; ++round) {
    progress_.round = round;
    const OpenDemands round_open = open_demands(frozen);
    const std::vector<int>& open = round_open.demands;
    const double cap_t = round_open.cap, weight_sum = round_open.weight_sum;
    if (open.empty()) break;
    for (int k : open) lp().set_row_bounds(master_.level_row(k), 0.0, kInf);
    lp().set_cost(level, -1.0);
    lp().set_column_bounds(level, 0.0, cap_t);
    // The last round fixed shares where they stood and relaxed or enforced level rows
    // where they hold: the last solution is still feasible (t lies within [0, cap_t]), so
    // the primal simplex goes on from it; the dual would first regain dual feasibility.
    if (!solve(r, onward(), &r.stats.seconds_raising)) return false;
    const double t = lp().value(level);

    Tier tier;
    tier.level = t;
    // A positive dual proves a demand cannot grow (step 2), so noise must not pass for one.
    // The duals of the level rows sum to 1 / (mean weight) over a bottleneck's demands, and
    // a zero dual comes back as rounding noise (seen: 2.9e-12 at 5,000 demands, where the
    // bound 1e-9 / (sum of weights) was 1.3e-12 and froze demands that could still grow).
    // 1e-9 / (mean weight) keeps a margin over the noise at any count of demands; a real
    // dual below it only sends its demand to the sum test, which decides it exactly.
    const double dual_tol = 1e-9 * static_cast<double>(open.size()) / weight_sum;
    for (int a = 0; a < g_.arc_count(); ++a) {
      const int row = master_.capacity_row(a);
      if (row >= 0 && -lp().row_dual(row) > dual_tol) {
        tier.binding_arcs.push_back(a);
        tier.binding_prices.push_back(-lp().row_dual(row));
      }
    }
    std::vector<int> freeze, undecided;
    for (int k : open) {
      const bool at_amount = std::isfinite(specs_[k].amount) && !demand_tol_[k].less(t * specs_[k].weight, specs_[k].amount);
      if (at_amount) {
        r.demands[k].limited_by_amount = true;
        freeze.push_back(k);
      } else if (lp().row_dual(master_.level_row(k)) > dual_tol) {
        freeze.push_back(k);
      } else {
        undecided.push_back(k);
      }
    }
    // A round stopped by amounts alone: settle a run of amount levels at once (step 2a of
    // fair_multiflow.h) instead of one round, and one sum test, per amount.
    auto by_amount = [&](int k) { return r.demands[k].limited_by_amount; };
    const bool by_amount_only = std::all_of(freeze.begin(), freeze.end(), by_amount);
    if (opt_.amount_search && unreachable.empty() && !freeze.empty() && by_amount_only && !undecided.empty()) {
      bool settled = false;
      if (!settle_amounts(r, fair, frozen, freeze, undecided, t, no_search_from, settled)) return false;
      if (settled) continue;
    }
    // Zero duals prove nothing: settle these demands by the sum test (fair_multiflow.h).
    if (!undecided.empty()) {
      lp().set_cost(level, 0.0);
      lp().set_column_bounds(level, t, t);
      // Each test maximises sum_k min(r_k, cap_k), r_k the growth above the level: capped
      // growth spreads the gain, so one test finds most demands that can grow, where the
      // plain sum of shares lets a few take all of it. The rule is unchanged: a demand that
      // grows in the optimum can grow; if none does, none can.
      auto stop_testing = [&](int k) {
        lp().set_cost(master_.growth_column(k), 0.0);
        lp().set_column_bounds(master_.growth_column(k), 0.0, 0.0);
      };
      while (!undecided.empty()) {
        for (int k : undecided) {
          lp().set_cost(master_.growth_column(k), -1.0);
          lp().set_column_bounds(master_.growth_column(k), 0.0, kGrowthCap * demand_tol_[k].epsilon());
        }
        ++r.stats.saturation_tests;
        // Only costs changed (and t was fixed where it stands): the last solution is still
        // feasible, and the primal simplex goes on from it.
        if (!solve(r, onward(), &r.stats.seconds_saturation_tests)) return false;
        std::vector<int> still;
        bool any_grew = false;
        for (int k : undecided) {
          if (demand_tol_[k].greater(lp().value(master_.share_column(k)), specs_[k].weight * t)) {
            any_grew = true;
            stop_testing(k);
          } else {
            still.push_back(k);
          }
        }
        if (!any_grew) {
          // The arcs that stop this group are the binding ones of this final test.
          for (int a = 0; a < g_.arc_count(); ++a) {
            const int row = master_.capacity_row(a);
            if (row < 0 || -lp().row_dual(row) <= dual_tol ||
                std::find(tier.binding_arcs.begin(), tier.binding_arcs.end(), a) != tier.binding_arcs.end())
              continue;
            tier.binding_arcs.push_back(a);
            tier.binding_prices.push_back(-lp().row_dual(row));
          }
          freeze.insert(freeze.end(), still.begin(), still.end());
          for (int k : still) stop_testing(k);
          break;
        }
        undecided = still;
      }
    }
    if (freeze.empty()) {
      r.status = SolveStatus::kNumericalDifficulty;
      r.message = "no demand could be frozen at level " + std::to_string(t) + " (tolerances too tight for this data)";
      return false;
    }
    place_unreachable(r, freeze, unreachable, t);
    tier.index = static_cast<int>(r.tiers.size()) + 1;
    std::sort(freeze.begin(), freeze.end());
    for (int k : freeze) {
      frozen[k] = 1;
      fair[k] = master_.reachable(k) ? std::min(specs_[k].amount, specs_[k].weight * t) : 0.0;
      share_bounds(k, fair[k], fair[k]);
      lp().set_row_bounds(master_.level_row(k), -kInf, kInf);
      r.demands[k].tier = tier.index;
    }
    tier.demands = freeze;
    if (!std::all_of(freeze.begin(), freeze.end(), by_amount))
      no_search_from = kInf;  // a bottleneck froze demands below levels that failed before
    progress_.demands_settled += static_cast<int>(freeze.size());
    r.tiers.push_back(tier);
    lp().set_column_bounds(level, 0.0, kInf);
  }
  if (!unreachable.empty()) zero_tier(r, unreachable);  // every demand is unreachable
  lp().set_cost(level, 0.0);
  return true;
}

// Progressive filling on the origin-aggregated LP (origin_master.h). Each round raises the
// open demands' level t and freezes those at their amounts and those with a positive dual
// (distance under the arc prices), as step 2 of fair_multiflow.h proves; the others stay
// open, and the next round, starting from the same level, freezes more (the duals of a
// round at an unchanged level sum to 1 over its open demands, so some are positive). Rounds
// that end at the same level form one tier. With one row per arc and per group of an
// origin's demands, and the basis kept across the rounds, a round costs tens to hundreds of
// simplex iterations, so no sum tests or amount search are needed to keep the rounds few.
bool Engine::max_min_by_origin(MultiflowResult& r, std::vector<double>& fair, std::vector<OriginPiece>& routes) {
  OriginMaster om(g_, specs_, opt_.routing, std::vector<double>(g_.arc_count(), 1.0));
  fair.assign(K(), 0.0);
  std::vector<char> frozen(K(), 0);
  std::vector<int> unreachable;
  for (int k = 0; k < K(); ++k)
    if (!om.reachable(k)) frozen[k] = 1, unreachable.push_back(k);
  progress_.stage = "max-min fair";
  auto failed = [&](LpStatus s) {
    r.status = SolveStatus::kNumericalDifficulty;
    r.message = std::string("the LP solver reported '") + lp_status_name(s) + "'";
    origin_stats_ = om.stats();
    return false;
  };
  for (int round = 1;; ++round) {
    progress_.round = round;
    const OpenDemands round_open = open_demands(frozen);
    const std::vector<int>& open = round_open.demands;
    const double cap_t = round_open.cap, weight_sum = round_open.weight_sum;
    if (open.empty()) break;
    const LpStatus s = om.raise(cap_t);
    report(om.stats().lp_solves);
    if (s != LpStatus::kOptimal) return failed(s);
    const double t = om.level();
    // As in max_min: duals sum to 1 / (mean weight) over a bottleneck's demands.
    const double dual_tol = 1e-9 * static_cast<double>(open.size()) / weight_sum;
    std::vector<int> freeze;
    for (int k : open) {
      const bool at_amount = std::isfinite(specs_[k].amount) && !demand_tol_[k].less(t * specs_[k].weight, specs_[k].amount);
      if (at_amount) {
        r.demands[k].limited_by_amount = true;
        freeze.push_back(k);
      } else if (om.demand_dual(k) > dual_tol) {
        freeze.push_back(k);
      }
    }
    if (freeze.empty()) {
      r.status = SolveStatus::kNumericalDifficulty;
      r.message = "no demand could be frozen at level " + format_number(t) + " (tolerances too tight for this data)";
      origin_stats_ = om.stats();
      return false;
    }
    place_unreachable(r, freeze, unreachable, t);
    // A round at the level of the last tier settles more of that tier (the per-demand
    // rounds settle them in one round, by sum tests). "The same" is judged at the LP's
    // tolerance (1e-7): each round solves its level anew, to that accuracy.
    const bool same = !r.tiers.empty() && Tolerance(1e-7 * std::max(t, r.tiers.back().level)).equal(t, r.tiers.back().level);
    if (!same) {
      Tier tier;
      tier.index = static_cast<int>(r.tiers.size()) + 1;
      tier.level = t;
      r.tiers.push_back(tier);
    }
    Tier& tier = r.tiers.back();
    for (int a = 0; a < g_.arc_count(); ++a) {
      const double price = om.arc_price(a);
      if (price > dual_tol && std::find(tier.binding_arcs.begin(), tier.binding_arcs.end(), a) == tier.binding_arcs.end())
        tier.binding_arcs.push_back(a), tier.binding_prices.push_back(price);
    }
    for (int k : freeze) {
      frozen[k] = 1;
      fair[k] = om.reachable(k) ? std::min(specs_[k].amount, specs_[k].weight * tier.level) : 0.0;
      r.demands[k].tier = tier.index;
      tier.demands.push_back(k);
    }
    std::sort(tier.demands.begin(), tier.demands.end());
    progress_.demands_settled += static_cast<int>(freeze.size());
    om.freeze(freeze);
  }
  if (!unreachable.empty()) zero_tier(r, unreachable);  // every demand is unreachable
  progress_.stage = "routes";
  const LpStatus s = om.tidy();
  if (s != LpStatus::kOptimal) return failed(s);
  routes = om.routing();
  origin_stats_ = om.stats();
  return true;
}

// The max-min fair shares, on the origin-aggregated LP (with its routes) or on the
// per-demand one (whose routes stay in its LP).
bool Engine::fair_shares(MultiflowResult& r, std::vector<double>& fair, std::vector<OriginPiece>& routes) {
  return use_origins() ? max_min_by_origin(r, fair, routes) : max_min(r, fair);
}

// Whether every open demand k can have min(w_k G, a_k) at once, G = levels[g]: maximise t
// <= G with f_k >= w_k t + r_k, where the growth column r_k of each demand in a group up to g
// may go down to a_k - w_k G. At t = G that asks exactly f_k >= a_k of those, and w_k G of the
// others; below G it asks less than min(w_k t, a_k), so t reaches G if and only if the
// allocation fits. Only bounds change, and each test keeps the last solution feasible.
bool Engine::reaches(const std::vector<int>& open, const std::vector<int>& group, const std::vector<double>& levels,
                     int g, bool& yes, MultiflowResult& r, LpSolver::Method method) {
  const double G = levels[g];
  for (std::size_t i = 0; i < open.size(); ++i) {
    const int k = open[i];
    const double slack = group[i] <= g ? std::max(0.0, specs_[k].weight * G - specs_[k].amount) : 0.0;
    lp().set_column_bounds(master_.growth_column(k), -slack, 0.0);
  }
  lp().set_cost(master_.level_column(), -1.0);
  lp().set_column_bounds(master_.level_column(), 0.0, G);
  ++r.stats.amount_tests;
  if (!solve(r, method, &r.stats.seconds_amount_tests)) return false;
  yes = !Tolerance(1e-9 * G).less(lp().value(master_.level_column()), G);
  return true;
}

// A level above which no amount level can pass: from the last LP's capacity prices y >= 0,
// every routing has sum_k f_k d_k(y) <= sum_e c_e y_e (d_k(y) the shortest allowed path of k
// under y; weak LP duality of the path formulation, as in fair_certificate.h). A routing that
// gives every demand of `all` min(w_k G, a_k) and every frozen demand its share therefore
// needs F(G) = sum_all min(w_k G, a_k) d_k(y) <= sum_e c_e y_e - sum_frozen s_k d_k(y); F is
// piecewise linear and nondecreasing, so the highest such G is found by walking its
// breakpoints a_k / w_k in order. kInf when the prices bound nothing.
double Engine::ceiling(const std::vector<int>& all, const std::vector<char>& frozen, const std::vector<double>& fair) {
  const std::vector<double> y = master_.capacity_prices();
  double budget = 0.0;
  for (int a = 0; a < g_.arc_count(); ++a) budget += g_.capacity(a) * y[a];
  if (!(budget > 0)) return kInf;
  const std::vector<double> dist = master_.distances(y);
  for (int k = 0; k < K(); ++k)
    if (frozen[k] && std::isfinite(dist[k])) budget -= fair[k] * dist[k];
  std::vector<std::pair<double, int>> breaks;  // (a_k / w_k, k)
  double slope = 0.0, fixed = 0.0;
  for (int k : all) {
    if (!std::isfinite(dist[k]) || !(dist[k] > 0)) continue;
    breaks.push_back({specs_[k].amount / specs_[k].weight, k});
    slope += specs_[k].weight * dist[k];
  }
  std::sort(breaks.begin(), breaks.end());
  for (const auto& [c, k] : breaks) {
    if (!std::isfinite(c)) break;
    if (fixed + slope * c > budget) break;  // F(c) already above: the root lies below c
    fixed += specs_[k].amount * dist[k];
    slope -= specs_[k].weight * dist[k];
  }
  return slope > 1e-300 ? (budget - fixed) / slope : kInf;
}

// Step 2a of fair_multiflow.h. The round reached t, the smallest amount level of the open
// demands, and froze only demands at their amounts (at_amount). If every open demand can have
// min(w_k G, a_k) at once for an amount level G > t, no bottleneck stops any demand below G,
// so every demand whose amount level lies below G freezes at its amount, in a tier of its own
// level, as one round each would have found. Galloping then bisecting over the sorted amount
// levels finds the highest such G in about 2 log2(n) tests. The demands at G itself are left
// to the next round, which also finds any bottleneck at exactly G. `settled` is false when
// not even the next level is reached: then the round goes on as usual.
bool Engine::settle_amounts(MultiflowResult& r, std::vector<double>& fair, std::vector<char>& frozen,
                            const std::vector<int>& at_amount, const std::vector<int>& open, double t,
                            double& no_search_from, bool& settled) {
  settled = false;
  // The amount levels a_k / w_k of the open demands, merged where they are equal at the
  // demand's own tolerance (as one round would freeze them together).
  std::vector<std::pair<double, int>> by_level;
  for (int k : open)
    if (std::isfinite(specs_[k].amount)) by_level.push_back({specs_[k].amount / specs_[k].weight, k});
  std::sort(by_level.begin(), by_level.end());
  std::vector<double> first, levels;  // per group: smallest and largest level
  std::vector<int> group_of(K(), std::numeric_limits<int>::max());
  for (const auto& [c, k] : by_level) {
    if (first.empty() || demand_tol_[k].less(specs_[k].weight * first.back(), specs_[k].amount)) {
      if (std::isfinite(no_search_from) && !Tolerance(1e-9 * no_search_from).less(c, no_search_from)) break;
      first.push_back(c), levels.push_back(c);
    }
    levels.back() = c;
    group_of[k] = static_cast<int>(levels.size()) - 1;
  }
  if (levels.empty()) return true;
  // The tests take the round's own demands too, in a group below all others: unfrozen yet,
  // they would hold t at their amount level.
  std::vector<int> all = at_amount, group(at_amount.size(), -1);
  for (int k : open) all.push_back(k), group.push_back(group_of[k]);

  const int n = static_cast<int>(levels.size());
  int pass = -1, fail = n;
  bool yes = false;
  // A floor under the search: the level t_u that every open demand reaches at once with its
  // amount lifted. Scaled down to the amounts, that routing gives each min(w_k t_u, a_k), so
  // every level up to t_u passes without a test. The tests then start just below the
  // highest level, near the current point, where galloping from the lowest level reached
  // its far tests only after crossing it (all pairs of GtsCe: 16 tests, 164 s, in the first
  // round; README, Benchmark).
  LpSolver::Method next = onward();
  if (opt_.amount_floor && n > 1) {
    for (int k : all) share_bounds(k, 0.0, kInf);
    lp().set_column_bounds(master_.level_column(), 0.0, kInf);
    ++r.stats.amount_tests;
    if (!solve(r, onward(), &r.stats.seconds_amount_tests)) return false;
    const double floor = lp().value(master_.level_column()) * (1.0 - 1e-7);
    // The floor LP's prices also bound the search from above (ceiling): levels more than
    // 1e-6 above fail untested (the margin covers the LP tolerances, 1e-7, by ten).
    const double top = opt_.amount_ceiling ? ceiling(all, frozen, fair) * (1.0 + 1e-6) : kInf;
    for (int k : all) share_bounds(k, 0.0, specs_[k].amount);
    pass = static_cast<int>(std::upper_bound(levels.begin(), levels.end(), floor) - levels.begin()) - 1;
    fail = std::max(pass + 1, static_cast<int>(std::upper_bound(levels.begin(), levels.end(), top) - levels.begin()));
    // Shares above their amounts are now out of bounds: the dual simplex restores them.
    next = LpSolver::Method::kDual;
    if (fail == pass + 1 && pass >= 0) {
      // The floor and the ceiling closed the search: one test at the level reached, which
      // the floor passes, still restores the shares, so that the next round starts from a
      // feasible point (from the floor LP's point, its dual simplex failed: all pairs of
      // GtsCe, README, Benchmark).
      if (!reaches(all, group, levels, pass, yes, r, next)) return false;
      next = onward();
      if (!yes) fail = pass, pass = -1;  // not even that (the LP tolerances): search below it
    }
  }
  const int start = pass + 1;
  for (int g = start; g < fail;) {  // galloping from the floor: start, start + 1, start + 3, ...
    if (!reaches(all, group, levels, g, yes, r, next)) return false;
    next = onward();
    if (!yes) {
      fail = g;
      break;
    }
    pass = g;
    if (g == fail - 1) break;
    g = std::min(2 * g + 1 - start, fail - 1);
  }
  while (fail - pass > 1) {
    const int g = pass + (fail - pass) / 2;
    if (!reaches(all, group, levels, g, yes, r, next)) return false;
    next = onward();
    (yes ? pass : fail) = g;
  }
  for (int k : all) lp().set_column_bounds(master_.growth_column(k), 0.0, 0.0);
  if (fail < n) no_search_from = std::min(no_search_from, first[fail]);
  if (pass < 0) return true;  // the sum test sets its own bounds and costs
  // Freeze: the round's own demands at t, then one tier per group below the reached one.
  std::vector<std::vector<int>> tiers(pass + 1);
  tiers[0] = at_amount;
  std::vector<double> tier_level(pass + 1, t);
  for (int g = 0; g < pass; ++g) tier_level[g + 1] = first[g];
  for (std::size_t i = at_amount.size(); i < all.size(); ++i)
    if (group[i] < pass) tiers[group[i] + 1].push_back(all[i]);
  for (int i = 0; i <= pass; ++i) {
    Tier tier;
    tier.index = static_cast<int>(r.tiers.size()) + 1;
    tier.level = tier_level[i];
    std::sort(tiers[i].begin(), tiers[i].end());
    for (int k : tiers[i]) {
      frozen[k] = 1;
      fair[k] = std::min(specs_[k].amount, specs_[k].weight * tier.level);
      share_bounds(k, fair[k], fair[k]);
      lp().set_row_bounds(master_.level_row(k), -kInf, kInf);
      r.demands[k].tier = tier.index;
      r.demands[k].limited_by_amount = true;
    }
    tier.demands = tiers[i];
    progress_.demands_settled += static_cast<int>(tiers[i].size());
    r.tiers.push_back(tier);
  }
  lp().set_column_bounds(master_.level_column(), 0.0, kInf);
  settled = true;
  return true;
}

bool Engine::max_throughput(MultiflowResult& r, bool finite_only, double& value) {
  progress_.stage = "max throughput";
  reset_objective();
  for (int k = 0; k < K(); ++k) {
    const bool take = !finite_only || std::isfinite(specs_[k].amount);
    share_bounds(k, 0.0, take ? specs_[k].amount : 0.0);
    lp().set_cost(master_.share_column(k), -1.0);
  }
  if (!solve(r)) return false;
  value = -lp().objective();
  return true;
}

bool Engine::max_concurrent(MultiflowResult& r, double& lambda) {
  progress_.stage = "max concurrent flow";
  reset_objective();
  double total = 0.0;
  for (int k = 0; k < K(); ++k) {
    share_bounds(k, 0.0, kInf);
    if (std::isfinite(specs_[k].amount)) {
      total += specs_[k].amount;
      lp().set_row_bounds(master_.level_row(k), 0.0, kInf);
      lp().set_coefficient(master_.level_row(k), master_.level_column(), -specs_[k].amount);
    }
  }
  if (!(total > 0)) {  // amounts are >= 0 (validated): any positive one will do
    r.status = SolveStatus::kBadInput;
    r.message = "max concurrent flow needs at least one demand with a positive amount";
    return false;
  }
  lp().set_cost(master_.level_column(), -1.0);
  if (!solve(r)) return false;
  lambda = lp().value(master_.level_column());
  concurrent_lengths_.assign(g_.arc_count(), 0.0);
  for (int a = 0; a < g_.arc_count(); ++a)
    if (master_.capacity_row(a) >= 0) concurrent_lengths_[a] = std::max(0.0, -lp().row_dual(master_.capacity_row(a)));
  return true;
}

// With the shares fixed where the caller left them, route with the fewest arcs in total:
// among equally fair routings, the one a planner would draw.
// `first`: the primal simplex where the shares were fixed where the last solution has them
// (only costs change then), the dual where they moved.
bool Engine::tidy_routes(MultiflowResult& r, LpSolver::Method first) {
  progress_.stage = "routes";
  lp().set_cost(master_.level_column(), 0.0);
  for (int k = 0; k < K(); ++k) lp().set_cost(master_.share_column(k), 0.0);
  master_.set_route_costs(true);
  const bool ok = solve(r, first);
  master_.set_route_costs(false);
  return ok;
}

void Engine::collect(MultiflowResult& r, const std::vector<double>* fixed_shares) {
  std::vector<OriginPiece> routes;
  for (const MasterPath& p : master_.paths()) routes.push_back({p.demand, p.lanes, lp().value(p.column)});
  collect_routes(r, routes, fixed_shares);
}

// The lanes of both masters are the graph's usable lanes in the same order.
void Engine::collect_routes(MultiflowResult& r, const std::vector<OriginPiece>& routes,
                            const std::vector<double>* fixed_shares) {
  const std::vector<Lane>& lanes = master_.lanes();
  r.arcs.assign(g_.arc_count(), ArcLoad{});
  std::vector<double> routed(K(), 0.0);
  for (const OriginPiece& p : routes) {
    const double x = p.amount;
    routed[p.demand] += x;
    if (!demand_tol_[p.demand].positive(x)) continue;
    PathShare ps;
    ps.amount = x;
    ps.nodes.push_back(lanes[p.lanes.front()].tail);
    for (int l : p.lanes) {
      ps.arcs.push_back(lanes[l].arc);
      ps.nodes.push_back(lanes[l].head);
      ArcLoad& load = r.arcs[lanes[l].arc];
      load.load += x;
      const double signed_x = lanes[l].reverse ? -x : x;
      auto it = std::find_if(load.per_demand.begin(), load.per_demand.end(),
                             [&](const auto& e) { return e.first == p.demand; });
      if (it == load.per_demand.end())
        load.per_demand.push_back({p.demand, signed_x});
      else
        it->second += signed_x;
    }
    r.demands[p.demand].paths.push_back(std::move(ps));
  }
  for (int a = 0; a < g_.arc_count(); ++a) {
    ArcLoad& load = r.arcs[a];
    std::sort(load.per_demand.begin(), load.per_demand.end());
    load.utilisation = g_.capacity(a) > 0 ? load.load / g_.capacity(a) : 0.0;
  }
  for (int k = 0; k < K(); ++k) {
    DemandShare& d = r.demands[k];
    // Ties broken by route, so that the order is the same with every standard library.
    std::sort(d.paths.begin(), d.paths.end(), [](const PathShare& a, const PathShare& b) {
      return a.amount != b.amount ? a.amount > b.amount : a.arcs < b.arcs;
    });
    d.share = fixed_shares ? (*fixed_shares)[k] : routed[k];
    if (demand_tol_[k].zero(d.share)) d.share = 0.0;
    d.normalised = d.share / specs_[k].weight;
    d.percent_of_amount = std::isfinite(specs_[k].amount)
                              ? (specs_[k].amount > 0 ? 100.0 * d.share / specs_[k].amount : 100.0)
                              : -1.0;
  }
}

// Per demand: the binding arcs of its tier, and whether they cut its origin from its
// destination (then the origin side is reported as the cut).
void Engine::explain_tiers(MultiflowResult& r) {
  const std::vector<Lane>& lanes = master_.lanes();
  std::vector<std::vector<int>> out(g_.node_count());
  for (int i = 0; i < static_cast<int>(lanes.size()); ++i) out[lanes[i].tail].push_back(i);
  for (const Tier& tier : r.tiers) {
    std::vector<char> binding(g_.arc_count(), 0);
    for (std::size_t i = 0; i < tier.binding_arcs.size(); ++i) {
      const int a = tier.binding_arcs[i];
      binding[a] = 1;
      ArcLoad& load = r.arcs[a];
      if (load.tier == 0) load.tier = tier.index, load.shadow_price = tier.binding_prices[i];
    }
    for (int k : tier.demands) {
      DemandShare& d = r.demands[k];
      if (d.limited_by_amount) continue;
      std::vector<char> seen(g_.node_count(), 0);
      std::vector<int> stack{specs_[k].origin};
      seen[specs_[k].origin] = 1;
      while (!stack.empty()) {
        const int u = stack.back();
        stack.pop_back();
        for (int i : out[u])
          if (!binding[lanes[i].arc] && !seen[lanes[i].head]) seen[lanes[i].head] = 1, stack.push_back(lanes[i].head);
      }
      d.binding_arcs_form_cut = !seen[specs_[k].destination];
      if (d.binding_arcs_form_cut) {
        for (int v = 0; v < g_.node_count(); ++v)
          if (seen[v]) d.cut_source_side.push_back(v);
        for (int a : tier.binding_arcs) {
          const bool crosses = (seen[g_.tail(a)] && !seen[g_.head(a)]) || (g_.two_way(a) && seen[g_.head(a)] && !seen[g_.tail(a)]);
          if (crosses) d.binding_arcs.push_back(a);
        }
      } else {
        for (const PathShare& p : d.paths)
          for (int a : p.arcs)
            if (binding[a] && std::find(d.binding_arcs.begin(), d.binding_arcs.end(), a) == d.binding_arcs.end())
              d.binding_arcs.push_back(a);
        std::sort(d.binding_arcs.begin(), d.binding_arcs.end());
      }
    }
  }
}

void Engine::feasibility_certificate(MultiflowResult& r) {
  r.dual_lengths = concurrent_lengths_;
  const std::vector<Lane>& lanes = master_.lanes();
  std::vector<char> usable(g_.arc_count());
  for (int a = 0; a < g_.arc_count(); ++a) usable[a] = g_.capacity(a) > 0;
  PathPricer pricer(g_, usable, opt_.routing.hop_limit);
  r.certificate_capacity = 0.0;
  for (int a = 0; a < g_.arc_count(); ++a) r.certificate_capacity += g_.capacity(a) * r.dual_lengths[a];
  r.certificate_demand = 0.0;
  for (int k = 0; k < K(); ++k) {
    if (!std::isfinite(specs_[k].amount)) continue;
    pricer.search(specs_[k].origin, r.dual_lengths);
    const double dist = pricer.distance(specs_[k].destination);
    if (std::isfinite(dist)) r.certificate_demand += specs_[k].amount * dist;
  }
  // An overloaded cut, if the arcs with positive length form one around some origin.
  std::vector<std::vector<int>> out(g_.node_count());
  for (int i = 0; i < static_cast<int>(lanes.size()); ++i) out[lanes[i].tail].push_back(i);
  double best_ratio = 1.0, longest = 0.0;
  for (double l : r.dual_lengths) longest = std::max(longest, l);
  const Tolerance length_tol(1e-9 * longest);  // lengths scale as 1 / capacity: judge them among themselves
  for (int o = 0; o < g_.node_count(); ++o) {
    bool is_origin = false;
    for (const DemandSpec& s : specs_) is_origin |= s.origin == o && std::isfinite(s.amount);
    if (!is_origin) continue;
    std::vector<char> seen(g_.node_count(), 0);
    std::vector<int> stack{o};
    seen[o] = 1;
    while (!stack.empty()) {
      const int u = stack.back();
      stack.pop_back();
      for (int i : out[u])
        if (!length_tol.positive(r.dual_lengths[lanes[i].arc]) && !seen[lanes[i].head])
          seen[lanes[i].head] = 1, stack.push_back(lanes[i].head);
    }
    double demand = 0.0, capacity = 0.0;
    for (const DemandSpec& s : specs_)
      if (std::isfinite(s.amount) && seen[s.origin] && !seen[s.destination]) demand += s.amount;
    for (int a = 0; a < g_.arc_count(); ++a)
      if ((seen[g_.tail(a)] && !seen[g_.head(a)]) || (g_.two_way(a) && seen[g_.head(a)] && !seen[g_.tail(a)]))
        capacity += g_.capacity(a);
    if (Tolerance::for_scale(std::max(demand, capacity), 1e-9).greater(demand, capacity) &&
        (capacity == 0 || demand / capacity > best_ratio)) {
      best_ratio = capacity == 0 ? kInf : demand / capacity;
      r.overloaded_cut_source_side.clear();
      for (int v = 0; v < g_.node_count(); ++v)
        if (seen[v]) r.overloaded_cut_source_side.push_back(v);
      r.overloaded_cut_capacity = capacity;
      r.overloaded_cut_demand = demand;
    }
  }
}

void Engine::totals(MultiflowResult& r) {
  double sum = 0.0, sum_sq = 0.0, min_norm = kInf;
  r.throughput = 0.0;
  for (const DemandShare& d : r.demands) {
    r.throughput += d.share;
    sum += d.normalised;
    sum_sq += d.normalised * d.normalised;
    min_norm = std::min(min_norm, d.normalised);
  }
  r.min_normalised_share = r.demands.empty() ? 0.0 : min_norm;
  // Jain's index of the normalised shares; equal shares (all zero included) give 1.
  r.jain_index = sum_sq > 0 ? sum * sum / (static_cast<double>(r.demands.size()) * sum_sq) : 1.0;
  if (r.max_throughput >= 0)
    r.price_of_fairness = r.max_throughput > 0 ? (r.max_throughput - r.throughput) / r.max_throughput : 0.0;
}

MultiflowResult Engine::run() {
  MultiflowResult r;
  r.objective = opt_.objective;
  r.demands.assign(K(), DemandShare{});
  std::vector<double> fair;
  double value = 0.0;
  switch (opt_.objective) {
    case FairObjective::kMaxMinFair: {
      std::vector<OriginPiece> routes;
      if (!fair_shares(r, fair, routes)) break;
      if (use_origins()) {
        collect_routes(r, routes, &fair);
      } else {
        for (int k = 0; k < K(); ++k) share_bounds(k, fair[k], fair[k]);
        if (!tidy_routes(r, onward())) return r;
        collect(r, &fair);
      }
      explain_tiers(r);
      if (opt_.compare_throughput) {
        if (!max_throughput(r, false, value)) return r;
        r.max_throughput = value;
      }
      break;
    }
    case FairObjective::kTradeoff: {
      std::vector<OriginPiece> routes;
      if (!fair_shares(r, fair, routes)) break;
      // The fair routing's paths: with them the LP below starts feasible (every share at
      // least (1 - epsilon) of its fair one), where one path per demand may not be.
      for (OriginPiece& p : routes)
        if (p.amount > 0) master_.add_route(p.demand, std::move(p.lanes));
      progress_.stage = "throughput with a fairness floor";
      reset_objective();
      const double keep = 1.0 - std::clamp(opt_.epsilon, 0.0, 1.0);
      for (int k = 0; k < K(); ++k) {
        share_bounds(k, keep * fair[k], specs_[k].amount);
        lp().set_cost(master_.share_column(k), -1.0);
      }
      if (!solve(r)) return r;
      std::vector<double> shares(K());
      for (int k = 0; k < K(); ++k) shares[k] = lp().value(master_.share_column(k)), share_bounds(k, shares[k], shares[k]);
      if (!tidy_routes(r, onward())) return r;
      collect(r, &shares);
      explain_tiers(r);
      if (!max_throughput(r, false, value)) return r;
      r.max_throughput = value;
      break;
    }
    case FairObjective::kMaxThroughput: {
      if (!max_throughput(r, false, value)) return r;
      std::vector<double> shares(K());
      for (int k = 0; k < K(); ++k) shares[k] = lp().value(master_.share_column(k)), share_bounds(k, shares[k], shares[k]);
      if (!tidy_routes(r, onward())) return r;
      collect(r, &shares);
      r.max_throughput = value;
      break;
    }
    case FairObjective::kMaxConcurrent:
    case FairObjective::kFeasibility: {
      double lambda = 0.0;
      if (!max_concurrent(r, lambda)) return r;
      r.lambda = lambda;
      // Route exactly lambda * amount for each demand with an amount; the others get nothing.
      std::vector<double> shares(K(), 0.0);
      for (int k = 0; k < K(); ++k) {
        shares[k] = std::isfinite(specs_[k].amount) && master_.reachable(k) ? lambda * specs_[k].amount : 0.0;
        if (opt_.objective == FairObjective::kFeasibility && std::isfinite(specs_[k].amount))
          shares[k] = std::min(lambda, 1.0) * specs_[k].amount;
      }
      if (opt_.objective == FairObjective::kFeasibility) {
        r.all_demands_met = !Tolerance(1e-9).less(lambda, 1.0);  // lambda is a ratio
        feasibility_certificate(r);
        double delivered = 0.0, asked = 0.0;
        for (const DemandSpec& s : specs_)
          if (std::isfinite(s.amount)) asked += s.amount;
        if (!max_throughput(r, true, delivered)) return r;
        r.max_throughput = delivered;
        r.shortfall = r.all_demands_met ? 0.0 : std::max(0.0, asked - delivered);
      }
      reset_objective();
      for (int k = 0; k < K(); ++k) share_bounds(k, shares[k], shares[k]);
      if (!tidy_routes(r)) return r;
      collect(r, &shares);
      break;
    }
  }
  if (r.status == SolveStatus::kNumericalDifficulty) {
    add_stats(r);
    return r;
  }
  totals(r);
  // The price of fairness is what a fair rule gives up against the most throughput; the
  // throughput rule gives up nothing by its definition, and feasibility has no fairness.
  if (opt_.objective == FairObjective::kFeasibility || opt_.objective == FairObjective::kMaxThroughput)
    r.price_of_fairness = -1.0;
  add_stats(r);
  r.status = SolveStatus::kOptimal;  // until the check, which the caller runs in the file's units
  return r;
}

}  // namespace

MultiflowResult solve_multiflow(const Network& net, const FairOptions& options) {
  if (net.demands.empty()) {
    MultiflowResult r;
    r.status = SolveStatus::kBadInput;
    r.message = "the network has no demands";
    return r;
  }
  for (const Demand& d : net.demands) {
    if (d.origin < 0 || d.origin >= net.node_count() || d.destination < 0 || d.destination >= net.node_count() ||
        d.origin == d.destination || !(d.weight > 0) || (d.amount && !(*d.amount >= 0))) {
      MultiflowResult r;
      r.status = SolveStatus::kBadInput;
      r.message = "demand '" + d.id + "' is not valid (run validation first)";
      return r;
    }
  }
  // Solved in an internal unit (unit_scale.h), checked in the file's own.
  const double scale = unit_scale(net);
  const Network scaled = scaled_network(net, scale);
  auto attempt = [&](const FairOptions& opt) {
    MultiflowResult r = Engine(scaled, opt).run();
    if (r.status == SolveStatus::kOptimal) {
      unscale_result(r, scale);
      r.check = check_multiflow(net, r);
      if (!r.check.ok) {
        r.status = SolveStatus::kNumericalDifficulty;
        r.message = "the independent check failed: " + r.check.worst;
      }
    }
    return r;
  };
  // The primal simplex after each round is several times faster, but leaves its solutions
  // within the LP solver's absolute tolerances rather than on the bounds; where data span
  // many orders of magnitude that can fail the check on the smallest arcs. Those networks
  // are solved again with dual_rounds, and only that verdict stands. (Only the max-min rounds
  // differ between the two ways.)
  const bool rounds = options.objective == FairObjective::kMaxMinFair || options.objective == FairObjective::kTradeoff;
  auto again = [&](MultiflowResult& r, const FairOptions& other) {
    const MultiflowStats first = r.stats;
    r = attempt(other);
    r.stats.add(first);
    ++r.stats.retries;
  };
  MultiflowResult r = attempt(options);
  // Rounds aggregated by origin that fail (numerical trouble in their LPs) give way to the
  // per-demand rounds, with the same options otherwise.
  const bool by_origin = rounds_by_origin(options, static_cast<int>(r.demands.size()));
  if (r.status == SolveStatus::kNumericalDifficulty && rounds && by_origin) {
    FairOptions per_demand = options;
    per_demand.origin_rounds_from = FairOptions::kNever;
    again(r, per_demand);
  }
  if (r.status == SolveStatus::kNumericalDifficulty && rounds && !options.dual_rounds) {
    FairOptions careful = options;
    careful.dual_rounds = true;
    careful.origin_rounds_from = FairOptions::kNever;
    again(r, careful);
  }
  if (r.status == SolveStatus::kOptimal && options.certify && options.objective == FairObjective::kMaxMinFair) {
    // The certificate's progress continues the solve's LP count.
    std::function<void(const SolveProgress&)> progress;
    if (options.on_progress)
      progress = [&options, solved = r.stats.lp_solves](const SolveProgress& p) {
        SolveProgress q = p;
        q.lp_solves += solved;
        options.on_progress(q);
      };
    r.fairness = certify_max_min(net, r, options.routing, progress);
  }
  if (r.status == SolveStatus::kNumericalDifficulty) {
    // Say what makes this network hard, and what to do about it: the LP solver's tolerances
    // are absolute (1e-7), so a network whose capacities span many orders of magnitude can
    // be out of its reach where each part alone is not.
    const auto [smallest, largest] = net.positive_capacities();
    if (largest > 0 && largest / smallest > 1e7)
      r.message += "; the capacities span " + std::to_string(static_cast<int>(std::floor(std::log10(largest / smallest)))) +
                   " orders of magnitude (" + format_number(smallest) + " to " + format_number(largest) +
                   "), more than the LP solver's tolerances resolve in one network: arcs far below the "
                   "others can be left out, or the parts solved as separate networks";
  }
  return r;
}

}  // namespace apportion
