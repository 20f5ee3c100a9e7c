// Fairness certificate; see fair_certificate.h for the model and the two facts it rests on.
#include "apportion/multiflow/fair_certificate.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <map>

#include "apportion/flow/flow_graph.h"
#include "apportion/multiflow/path_master.h"
#include "apportion/multiflow/unit_scale.h"

namespace apportion {

namespace {

constexpr double kInf = LpSolver::kInf;
// Normalised shares within this relative gap are one level of the allocation.
constexpr double kLevelGap = 1e-7;
// A witness may miss a target, or exceed a capacity, by this much relative to it (to
// max(1, it) in the certificate's unit, where the largest share is in [1, 2)); beyond, it
// proves nothing and is not used. Measured misses: 1e-10 to 2e-9 (README, Benchmark).
constexpr double kWitnessSlack = 1e-6;
// The LPs' feasibility tolerance, tighter than HiGHS's default 1e-7: a witness misses its
// targets by about this much, and the bounds hold to it. In the certificate's unit the
// largest share is in [1, 2), so it is relative to the shares.
constexpr double kLpTolerance = 1e-9;
// Room below a share that only steers an LP (the witness's first step, the level test):
// the point the last LP reached meets the capacities only to its tolerance, and a share
// held there exactly can leave the next LP infeasible by that much.
constexpr double kRoom = 100 * kLpTolerance;

class Certifier {
 public:
  Certifier(const Network& scaled, const std::vector<double>& shares, const RoutingOptions& routing,
            const std::vector<DemandShare>* routes, double scale,
            const std::function<void(const SolveProgress&)>& on_progress)
      : on_progress_(on_progress),
        scale_(scale),
        g_(FlowGraph::from_network(scaled)),
        specs_(demand_specs(scaled)),
        shares_(shares),
        routing_(routing),
        master_(g_, specs_, routing, std::vector<double>(g_.arc_count(), 1.0)) {
    master_.lp().set_feasibility_tolerance(kLpTolerance);
    if (routes) start_from(*routes);
  }

  // Fills c.lower and c.upper (in the internal unit) with what holds, even after a failure.
  bool run(FairnessCertificate& c) {
    const bool done = certify(c);
    c.lower = lower_;
    c.upper = upper_;
    c.witness_tolerance = tolerance_;
    return done;
  }

 private:
  bool certify(FairnessCertificate& c);
  // The allocation's own paths as the master's first columns: the LPs start near where they
  // end, in far fewer pricing rounds and iterations. (Columns prove nothing by themselves.)
  void start_from(const std::vector<DemandShare>& routes);
  int K() const { return static_cast<int>(specs_.size()); }
  LpSolver& lp() { return master_.lp(); }
  // `last_try` false: a failure is left to the caller to retry another way (no status set).
  bool solve(LpSolver::Method m, FairnessCertificate& c, bool last_try = true);
  // All level rows off, the level fixed at 0, every cost 0; share bounds [lo, hi].
  void reset();
  void bounds(int k, double lo, double hi) {
    lp().set_column_bounds(master_.share_column(k), std::min(lo, hi), hi);
  }
  // The witness at level tau (kInf: above every level); raises `lower_` where it holds.
  bool witness(double tau, FairnessCertificate& c);
  // The allocation itself as the witness at level tau, when it came with its routing: it
  // gives every demand at least min(w_k tau, U_k) once the upper bounds below tau are tight.
  // False (nothing changed) when it misses by more than the slack; then an LP witness runs.
  bool allocation_witness(double tau, FairnessCertificate& c);
  // Upper bounds from the last LP's capacity duals, recomputed by shortest paths.
  void upper_from_duals();
  // The level's demands without a tight upper bound: an LP maximising their sum.
  bool test_level(const std::vector<int>& level, FairnessCertificate& c);
  bool loose(int k) const {
    return !std::isfinite(upper_[k]) || upper_[k] - lower_[k] > 1e-9 * std::max(1.0, upper_[k]);
  }

  void report(int level) const {
    if (!on_progress_) return;
    SolveProgress p;
    p.stage = "proving fairness";
    p.round = level;
    p.demands = K();
    for (int k = 0; k < K(); ++k) p.demands_settled += loose(k) ? 0 : 1;
    p.lp_solves = master_.stats().lp_solves;
    on_progress_(p);
  }

  const std::function<void(const SolveProgress&)>& on_progress_;
  double scale_;  // the certificate's unit, in the network's
  FlowGraph g_;
  std::vector<DemandSpec> specs_;
  std::vector<double> shares_;
  RoutingOptions routing_;
  PathMaster master_;
  std::vector<double> lower_, upper_;
  bool solved_ = false;              // the LP holds a solution
  double tolerance_ = 0.0;           // the most any accepted witness missed by, relative
  std::vector<double> routed_;       // the allocation's shares, from its own paths (when given)
  double routed_excess_ = kInf;      // its largest capacity excess, relative (kInf: no routing)
};

void Certifier::start_from(const std::vector<DemandShare>& routes) {
  std::map<std::pair<int, int>, int> lane_of;  // (arc, tail) -> lane
  for (int l = 0; l < static_cast<int>(master_.lanes().size()); ++l)
    lane_of[{master_.lanes()[l].arc, master_.lanes()[l].tail}] = l;
  for (int k = 0; k < K() && k < static_cast<int>(routes.size()); ++k) {
    if (!master_.reachable(k)) continue;
    for (const PathShare& p : routes[k].paths) {
      if (p.nodes.size() != p.arcs.size() + 1) continue;
      std::vector<int> lanes;
      for (std::size_t i = 0; i < p.arcs.size(); ++i) {
        const auto it = lane_of.find({p.arcs[i], p.nodes[i]});
        if (it == lane_of.end()) break;  // an arc out of service, or a path of another network
        lanes.push_back(it->second);
      }
      if (lanes.size() == p.arcs.size() && !lanes.empty()) master_.add_route(k, std::move(lanes));
    }
  }
  // The allocation as a routing: its shares and loads, recomputed from its paths, in the
  // certificate's unit (the shares' scale).
  routed_.assign(K(), 0.0);
  std::vector<double> load(g_.arc_count(), 0.0);
  for (int k = 0; k < K() && k < static_cast<int>(routes.size()); ++k)
    for (const PathShare& p : routes[k].paths) {
      routed_[k] += p.amount / scale_;
      for (int a : p.arcs)
        if (a >= 0 && a < g_.arc_count()) load[a] += p.amount / scale_;
    }
  routed_excess_ = 0.0;
  for (int a = 0; a < g_.arc_count(); ++a)
    if (load[a] > g_.capacity(a))
      routed_excess_ = std::max(routed_excess_, (load[a] - g_.capacity(a)) / std::max(1.0, g_.capacity(a)));
}

void Certifier::reset() {
  lp().set_cost(master_.level_column(), 0.0);
  lp().set_column_bounds(master_.level_column(), 0.0, 0.0);
  for (int k = 0; k < K(); ++k) {
    lp().set_cost(master_.share_column(k), 0.0);
    lp().set_row_bounds(master_.level_row(k), -kInf, kInf);
  }
}

bool Certifier::solve(LpSolver::Method m, FairnessCertificate& c, bool last_try) {
  LpStatus s = master_.solve(m);
  // HiGHS's primal simplex can end "infeasible" from a feasible start (seen with no primal
  // infeasibility left, GtsCe with 2,000 demands); every LP here is feasible, so such an
  // answer is retried with the dual simplex, then from scratch.
  if (s != LpStatus::kOptimal) s = master_.solve(LpSolver::Method::kDual);
  if (s != LpStatus::kOptimal) {
    lp().set_hot_start(false);
    s = master_.solve(LpSolver::Method::kDual);
    lp().set_hot_start(true);
  }
  c.stats = master_.stats();
  solved_ = s == LpStatus::kOptimal;
  if (solved_ || !last_try) return solved_;
  c.status = SolveStatus::kNumericalDifficulty;
  c.message = std::string("a certificate LP ended '") + lp_status_name(s) + "' (" + lp().last_message() + ")";
  return false;
}

bool Certifier::allocation_witness(double tau, FairnessCertificate& c) {
  if (!(routed_excess_ <= kWitnessSlack)) return false;
  double missed = routed_excess_;
  for (int k = 0; k < K(); ++k) {
    if (!master_.reachable(k) || lower_[k] >= specs_[k].weight * tau) continue;  // known at or above
    const double target = std::min(specs_[k].weight * tau, upper_[k]);
    if (routed_[k] < target) missed = std::max(missed, (target - routed_[k]) / std::max(1.0, target));
  }
  if (!(missed <= kWitnessSlack)) return false;
  tolerance_ = std::max(tolerance_, missed);
  ++c.witnesses_used;
  for (int k = 0; k < K(); ++k)
    if (master_.reachable(k)) lower_[k] = std::max(lower_[k], std::min(specs_[k].weight * tau, upper_[k]));
  return true;
}

bool Certifier::witness(double tau, FairnessCertificate& c) {
  // Demands whose upper bound lies below the level get it in full; the others rise together.
  std::vector<char> below(K(), 0);
  bool any_below = false, any_rising = false;
  for (int k = 0; k < K(); ++k) {
    if (!master_.reachable(k)) continue;
    below[k] = std::isfinite(upper_[k]) && (tau == kInf || upper_[k] <= specs_[k].weight * tau * (1.0 + 1e-9));
    any_below |= below[k] != 0;
    any_rising |= below[k] == 0;
  }
  // The last LP's shares: a demand below the level keeps at least its share there, so that
  // the last solution stays feasible and the primal simplex goes on from it.
  std::vector<double> last(K(), 0.0);
  if (solved_)
    for (int k = 0; k < K(); ++k) last[k] = lp().value(master_.share_column(k));
  reset();
  std::vector<double> reached(K(), 0.0);
  if (any_below) {
    // (a) every demand below the level to its upper bound, or as near as they all can: with
    // T the highest of their levels U_k / w_k, maximise t <= T subject to
    // f_k - w_k t >= U_k - w_k T (the level rows), so that any shortfall w_k (T - t) that
    // the capacities force is shared out by weight rather than left on a few demands: the
    // upper bounds stand a little above the fair shares, within the LPs' tolerance, and a
    // thousand of them together can ask 1e-7 more than fits.
    double top = 0.0;
    for (int k = 0; k < K(); ++k)
      if (below[k]) top = std::max(top, upper_[k] / specs_[k].weight);
    lp().set_cost(master_.level_column(), -1.0);
    lp().set_column_bounds(master_.level_column(), 0.0, top);
    for (int k = 0; k < K(); ++k) {
      if (!master_.reachable(k)) continue;
      bounds(k, below[k] ? std::max(0.0, std::min(last[k], upper_[k]) - kRoom * std::max(1.0, upper_[k])) : 0.0,
             below[k] ? upper_[k] : specs_[k].amount);
      if (below[k]) lp().set_row_bounds(master_.level_row(k), upper_[k] - specs_[k].weight * top, kInf);
    }
    if (!solve(LpSolver::Method::kPrimal, c)) return false;
    const double short_by = top - lp().value(master_.level_column());
    for (int k = 0; k < K(); ++k)
      if (below[k] && specs_[k].weight * short_by > kWitnessSlack * std::max(1.0, upper_[k]))
        return ++c.witnesses_refused, true;
    for (int k = 0; k < K(); ++k)
      if (below[k]) reached[k] = std::min(lp().value(master_.share_column(k)), upper_[k]);
    reset();
    for (int k = 0; k < K(); ++k)
      if (below[k]) bounds(k, reached[k], upper_[k]);
  }
  // (b) the others rise to the highest common level they can reach.
  double theta = kInf;
  if (any_rising) {
    lp().set_cost(master_.level_column(), -1.0);
    lp().set_column_bounds(master_.level_column(), 0.0, kInf);
    for (int k = 0; k < K(); ++k) {
      if (!master_.reachable(k) || below[k]) continue;
      bounds(k, 0.0, specs_[k].amount);
      lp().set_row_bounds(master_.level_row(k), 0.0, kInf);  // f_k - w_k t >= 0
    }
    if (!solve(LpSolver::Method::kPrimal, c, false)) {
      // The point reached in (a) meets the capacities only to the LP's tolerance; held there
      // exactly it can leave this LP infeasible by as much (seen: 1.3e-7, GtsCe with 2,000
      // demands). Again with ten times the LP's tolerance as room; the check below counts
      // what that costs.
      for (int k = 0; k < K(); ++k)
        if (below[k]) bounds(k, std::max(0.0, reached[k] - 10 * kLpTolerance * std::max(1.0, upper_[k])), upper_[k]);
      if (!solve(LpSolver::Method::kDual, c)) return false;
    }
    theta = lp().value(master_.level_column());
  }
  // The witness, recomputed from its path flows: its shares against their targets and its
  // loads against the capacities. What it misses by, relative, is the tolerance to which
  // the lower bounds it proves hold (tolerance_, reported with the certificate).
  std::vector<double> got(K(), 0.0), load(g_.arc_count(), 0.0);
  for (const MasterPath& p : master_.paths()) {
    const double x = std::max(0.0, lp().value(p.column));
    got[p.demand] += x;
    for (int l : p.lanes) load[master_.lanes()[l].arc] += x;
  }
  double missed = 0.0;
  for (int a = 0; a < g_.arc_count(); ++a)
    if (load[a] > g_.capacity(a)) missed = std::max(missed, (load[a] - g_.capacity(a)) / std::max(1.0, g_.capacity(a)));
  for (int k = 0; k < K(); ++k) {
    if (!master_.reachable(k)) continue;
    const double target = below[k] ? upper_[k] : specs_[k].weight * theta;
    if (got[k] < target) missed = std::max(missed, (target - got[k]) / std::max(1.0, target));
  }
  if (missed > kWitnessSlack) return ++c.witnesses_refused, true;
  tolerance_ = std::max(tolerance_, missed);
  ++c.witnesses_used;
  for (int k = 0; k < K(); ++k)
    if (master_.reachable(k)) lower_[k] = std::max(lower_[k], std::min(specs_[k].weight * theta, upper_[k]));
  if (any_rising) upper_from_duals();
  return true;
}

namespace {
// Neumaier's compensated sum: the error stays within 2 units in the last place of the sum of
// magnitudes, whatever the number of terms (N. Higham, "Accuracy and Stability of Numerical
// Algorithms", 2nd ed., 2002, section 4.3).
struct CompensatedSum {
  double sum = 0.0, carry = 0.0;
  void add(double x) {
    const double t = sum + x;
    carry += std::abs(sum) >= std::abs(x) ? (sum - t) + x : (x - t) + sum;
    sum = t;
  }
  double value() const { return sum + carry; }
};
}  // namespace

void Certifier::upper_from_duals() {
  const std::vector<double> y = master_.capacity_prices();
  CompensatedSum capacity_value;
  for (int a = 0; a < g_.arc_count(); ++a) capacity_value.add(g_.capacity(a) * y[a]);
  if (!(capacity_value.value() > 0)) return;
  const std::vector<double> dist = master_.distances(y);
  CompensatedSum carried;
  for (int k = 0; k < K(); ++k)
    if (std::isfinite(dist[k]) && lower_[k] > 0) carried.add(lower_[k] * dist[k]);
  // G = sum_e c_e y_e - sum_j L_j d_j, made safe against rounding: each distance is a sum
  // along a path of at most n - 1 arcs, each product and sum rounds once more, so (n + 4)
  // units in the last place of both sums bound it, doubled for margin. (The witnesses'
  // own tolerance is not added: it is reported, and the bounds hold to it.)
  constexpr double kUnit = std::numeric_limits<double>::epsilon() / 2;
  const double margin = 2.0 * (g_.node_count() + 4) * kUnit * (capacity_value.value() + carried.value());
  const double gap = std::max(capacity_value.value() - carried.value(), 0.0) + margin;
  for (int k = 0; k < K(); ++k)
    if (std::isfinite(dist[k]) && dist[k] > 0)
      upper_[k] = std::min(upper_[k], (lower_[k] + gap / dist[k]) * (1.0 + 4.0 * kUnit));
}

bool Certifier::test_level(const std::vector<int>& level, FairnessCertificate& c) {
  std::vector<int> open;
  for (int k : level)
    if (loose(k)) open.push_back(k);
  if (open.empty()) return true;
  // Every demand at or above its lower bound (less a little room: the LP's tolerance). Any LP
  // gives valid bounds -- they rest on its duals and the proven lower bounds alone -- but
  // only this one gives tight ones: a demand of a higher level let down below its lower bound
  // frees capacity the level's demands then seem to be able to use (seen when the last
  // solution held such a demand lower, and its bound followed it).
  reset();
  for (int k = 0; k < K(); ++k)
    if (master_.reachable(k)) bounds(k, std::max(0.0, lower_[k] - kRoom * std::max(1.0, lower_[k])), specs_[k].amount);
  for (int k : open) lp().set_cost(master_.share_column(k), -1.0);
  if (!solve(LpSolver::Method::kPrimal, c)) return false;
  upper_from_duals();
  return true;
}

bool Certifier::certify(FairnessCertificate& c) {
  lower_.assign(K(), 0.0);
  upper_.assign(K(), 0.0);
  for (int k = 0; k < K(); ++k) upper_[k] = master_.reachable(k) ? specs_[k].amount : 0.0;
  // The allocation's levels: its demands below their amounts, by normalised share.
  std::vector<int> rising;
  for (int k = 0; k < K(); ++k)
    if (master_.reachable(k) && shares_[k] < specs_[k].amount * (1.0 - kLevelGap)) rising.push_back(k);
  std::sort(rising.begin(), rising.end(), [&](int a, int b) {
    return shares_[a] / specs_[a].weight < shares_[b] / specs_[b].weight;
  });
  std::vector<std::vector<int>> levels;
  double last = -1.0;
  for (int k : rising) {
    const double v = shares_[k] / specs_[k].weight;
    if (levels.empty() || v > last * (1.0 + kLevelGap) + 1e-300) levels.push_back({}), last = v;
    levels.back().push_back(k);
  }
  for (const std::vector<int>& level : levels) {
    // The allocation is its own witness at the level's lowest share (every demand of the
    // level and above has at least that); where it falls short, an LP witness at the highest.
    double low = kInf, high = 0.0;
    for (int k : level) {
      low = std::min(low, shares_[k] / specs_[k].weight);
      high = std::max(high, shares_[k] / specs_[k].weight);
    }
    if (!allocation_witness(low, c) && !witness(high, c)) return false;
    if (!test_level(level, c)) return false;
    ++c.levels;
    report(c.levels);
  }
  // The demands at their amounts above the top level.
  return allocation_witness(kInf, c) || witness(kInf, c);
}

using Progress = std::function<void(const SolveProgress&)>;

FairnessCertificate certify(const Network& net, const std::vector<double>& shares, const RoutingOptions& routing,
                            const std::vector<DemandShare>* routes, const Progress& on_progress);

}  // namespace

FairnessCertificate certify_max_min(const Network& net, const MultiflowResult& result, const RoutingOptions& routing,
                                    const Progress& on_progress) {
  std::vector<double> shares;
  for (const DemandShare& d : result.demands) shares.push_back(d.share);
  return certify(net, shares, routing, &result.demands, on_progress);
}

FairnessCertificate certify_max_min(const Network& net, const std::vector<double>& shares, const RoutingOptions& routing,
                                    const Progress& on_progress) {
  return certify(net, shares, routing, nullptr, on_progress);
}

namespace {

FairnessCertificate certify(const Network& net, const std::vector<double>& shares, const RoutingOptions& routing,
                            const std::vector<DemandShare>* routes, const Progress& on_progress) {
  const auto start = std::chrono::steady_clock::now();
  FairnessCertificate c;
  if (net.demands.empty() || shares.size() != net.demands.size()) {
    c.status = SolveStatus::kBadInput;
    c.message = net.demands.empty() ? "the network has no demands" : "one share per demand is needed";
    return c;
  }
  // The certificate's unit: the largest share in [1, 2), so that the LP's absolute
  // tolerance is relative to the shares (a power of two: exact both ways).
  double largest_share = 0.0;
  for (double v : shares) largest_share = std::max(largest_share, std::abs(v));
  int exponent = 0;
  std::frexp(largest_share, &exponent);
  const double scale = largest_share > 0 && std::isfinite(largest_share) ? std::ldexp(1.0, exponent - 1) : unit_scale(net);
  const Network scaled = scaled_network(net, scale);
  std::vector<double> s(shares.size());
  for (std::size_t k = 0; k < shares.size(); ++k) s[k] = shares[k] / scale;
  Certifier cert(scaled, s, routing, routes, scale, on_progress);
  const bool done = cert.run(c);
  if (done) c.status = SolveStatus::kOptimal;
  const int K = static_cast<int>(shares.size());
  double largest = 1e-300;
  for (int k = 0; k < K; ++k) {
    c.lower[k] *= scale;
    c.upper[k] *= scale;
    largest = std::max(largest, std::abs(shares[k]));
  }
  c.error.assign(K, 0.0);
  for (int k = 0; k < K; ++k) {
    c.error[k] = std::max({c.upper[k] - shares[k], shares[k] - c.lower[k], 0.0});
    if (c.worst_demand < 0 || c.error[k] > c.max_error) c.max_error = c.error[k], c.worst_demand = k;
  }
  c.max_relative_error = c.max_error / largest;
  c.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  return c;
}

}  // namespace

}  // namespace apportion
