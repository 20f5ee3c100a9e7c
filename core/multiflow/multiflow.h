// Fair multicommodity flow: the problems Apportion solves for many demands sharing one
// network, and the result it reports. Definitions (also in README.md):
//
//   Demand k: origin o_k, destination d_k, amount a_k (or "as much as possible": a_k = inf)
//   and weight w_k > 0. Its share f_k is the flow it receives, routed splittably over paths
//   from o_k to d_k. For every arc e: the flow of all demands on e, in both directions for a
//   shared two-way arc, is at most capacity(e). Disabled arcs carry nothing.
//
//   Weighted max-min fairness (lexicographic): raise f_k = w_k t for all demands together; a
//   demand freezes when it reaches its amount, or when it cannot grow without lowering a
//   demand whose normalised share f_j / w_j is already at or below its own; repeat with the
//   others. The result is the unique allocation whose sorted vector of normalised shares is
//   lexicographically largest. Each freezing round is a tier.
//
// Objectives:
//   kFeasibility     can every demand with an amount get it in full? (max concurrent flow
//                    lambda >= 1); if not, by how much, with a dual-length certificate
//   kMaxThroughput   maximise sum_k f_k with f_k <= a_k
//   kMaxConcurrent   maximise lambda with f_k >= lambda a_k for every demand with an amount
//   kMaxMinFair      weighted lexicographic max-min fairness, exact
//   kTradeoff        maximise sum_k f_k subject to f_k >= (1 - epsilon) * (max-min share of k)
#pragma once

#include <functional>
#include <limits>
#include <string>
#include <vector>

#include "apportion/flow/flow_checker.h"
#include "apportion/model/status.h"

namespace apportion {

enum class FairObjective { kFeasibility, kMaxThroughput, kMaxConcurrent, kMaxMinFair, kTradeoff };
const char* objective_name(FairObjective o);
// The objective with this name (objective_name's inverse); false when there is none.
bool objective_from_name(const std::string& name, FairObjective& out);

struct RoutingOptions {
  int hop_limit = 0;  // > 0: paths of at most this many arcs
  int k_paths = 0;    // > 0: only the k shortest paths of each demand (by route length)
};

// Reported after every LP of a solve, so that a caller can show progress (the browser app
// runs the engine in a worker and forwards these).
struct SolveProgress {
  const char* stage = "";   // "max-min fair", "max throughput", ...
  int round = 0;            // max-min: the tier being raised
  int demands_settled = 0;  // max-min: demands frozen so far
  int demands = 0;
  int lp_solves = 0;
};

struct FairOptions {
  FairObjective objective = FairObjective::kMaxMinFair;
  RoutingOptions routing;
  double epsilon = 0.1;     // kTradeoff: each demand keeps at least (1 - epsilon) of its fair share
  bool compare_throughput = true;  // kMaxMinFair: also solve max throughput for the price of fairness
  bool hot_start = true;    // false only to measure what restarting from the last basis saves
  // true: every max-min round and saturation test by the dual simplex, the method before the
  // primal one was measured faster; kept to measure against, and as the fallback (see
  // solve_multiflow)
  bool dual_rounds = false;
  // true: a round stopped only by the smallest amount searches for the highest amount level
  // that every demand can reach, and settles all amounts below it at once (fair_multiflow.h);
  // false: one round per amount, the method before, kept to measure against.
  bool amount_search = true;
  // The amount search starts from the level every open demand reaches with its amount lifted
  // (one LP; fair_multiflow.h, step 2a); false: from the lowest amount level, the method
  // before, kept to measure against.
  bool amount_floor = true;
  // With the floor: levels above a bound from the floor LP's prices fail untested
  // (fair_multiflow.cpp, ceiling); false: they are tested, to measure against.
  bool amount_ceiling = true;
  // Column generation drops the path columns that the LP does not use and that price
  // unattractive once the paths outnumber the rows this many times (path_master.h); 0: every
  // path priced in stays, the method before, kept to measure against. 0.5 drops them after
  // every pricing round at the sizes that matter (the basis alone holds about one path per
  // demand, against two rows); measured with the amount search's floor 1.0-1.3x faster
  // than the earlier 2 up to 2,000 demands, the same at 5,000 (README, Benchmark).
  double path_pool = 0.5;
  // From this many demands on, the max-min rounds run on the LP with the demands aggregated
  // by origin (origin_master.h: one row per arc and one per group of an origin's demands,
  // kept across the rounds), without sum tests or amount search; below it, on the per-demand
  // path LP (path_master.h). Measured (README, Benchmark), the aggregated rounds are 2-4x
  // faster on GtsCe, Deltacom and UsCarrier with 2,000-10,000 demands, but 2-3.5x slower on
  // Uninett2010 and Geant2012 with their link speeds, whose many tiers each cost it a round;
  // so the default is kNever (the per-demand rounds everywhere) and the aggregated rounds
  // are an option (apportion-fair-bench --by-origin). 0: always aggregated. A failing
  // aggregated solve gives way to the per-demand rounds (solve_multiflow). Fixed path sets
  // (k_paths) always use the per-demand LP.
  static constexpr int kNever = std::numeric_limits<int>::max();
  int origin_rounds_from = kNever;
  // kMaxMinFair: after the solve, prove each share with the fairness certificate
  // (fair_certificate.h) into MultiflowResult::fairness; a small fraction of the solve's time.
  bool certify = false;
  std::function<void(const SolveProgress&)> on_progress;  // optional
};

struct PathShare {
  std::vector<int> nodes;
  std::vector<int> arcs;
  double amount = 0.0;
};

struct DemandShare {
  double share = 0.0;
  double percent_of_amount = -1.0;  // -1 when the demand asks for "as much as possible"
  double normalised = 0.0;          // share / weight
  int tier = 0;                     // kMaxMinFair: the round it froze in (1 = first)
  bool limited_by_amount = false;   // froze because it got its full amount
  std::vector<int> binding_arcs;    // arcs with a positive dual in its tier that bind it
  std::vector<int> cut_source_side; // nodes on the origin side of the cut those arcs form
  bool binding_arcs_form_cut = false;  // removing them separates origin from destination
  std::vector<PathShare> paths;
};

struct ArcLoad {
  double load = 0.0;                // both directions together
  double utilisation = 0.0;         // load / capacity (0 for zero capacity)
  std::vector<std::pair<int, double>> per_demand;  // (demand, flow), signed on two-way arcs
  double shadow_price = 0.0;        // dual of its capacity in the first tier it binds, else 0
  int tier = 0;                     // first tier in which it binds (0: never)
};

struct Tier {
  int index = 0;
  double level = 0.0;               // the normalised share t of its demands
  std::vector<int> demands;
  // Capacity rows with a positive dual in this round: in the LP raising the level, and in
  // the last saturation test, which shows what stops the demands settled by testing.
  std::vector<int> binding_arcs;
  std::vector<double> binding_prices;  // their duals: gain in the round's objective per unit of capacity
};

// Violations are relative to what they concern: an arc's excess to its capacity, a demand's
// errors to its share, each at least the network's smallest positive capacity.
struct MultiflowCheck {
  bool ok = false;
  double max_capacity_violation = 0.0;      // (load - capacity) / capacity
  double max_conservation_violation = 0.0;  // per demand, at every node, / share
  double max_share_error = 0.0;             // |reported share - flow leaving its origin| / share
  std::string worst;
};

struct MultiflowStats {
  int lp_solves = 0;
  long long simplex_iterations = 0;
  int pricing_rounds = 0;
  int path_columns = 0;      // paths priced in (a dropped path priced in again counts again)
  int paths_dropped = 0;     // unused paths dropped from the LP (FairOptions::path_pool)
  int paths_restored = 0;    // times the dropped paths all came back for an infeasible LP
  int saturation_tests = 0;  // LPs run to settle zero-dual demands
  int amount_tests = 0;      // LPs of the amount search (step 2a of fair_multiflow.h)
  // Where the max-min rounds' time goes, in seconds: the LPs raising the level, the amount
  // search's and the saturation tests' (each with its pricing rounds).
  double seconds_raising = 0.0, seconds_amount_tests = 0.0, seconds_saturation_tests = 0.0;
  int retries = 0;           // times the network was solved again another way (solve_multiflow)

  // Every count and time of `o` added to these (a solve run again adds the first one's).
  void add(const MultiflowStats& o) {
    lp_solves += o.lp_solves;
    simplex_iterations += o.simplex_iterations;
    pricing_rounds += o.pricing_rounds;
    path_columns += o.path_columns;
    paths_dropped += o.paths_dropped;
    paths_restored += o.paths_restored;
    saturation_tests += o.saturation_tests;
    amount_tests += o.amount_tests;
    seconds_raising += o.seconds_raising;
    seconds_amount_tests += o.seconds_amount_tests;
    seconds_saturation_tests += o.seconds_saturation_tests;
    retries += o.retries;
  }
};

// Proven bounds on each demand's exact weighted max-min fair share, for any allocation
// (fair_certificate.h); filled when asked for (apportion fair --certify).
struct FairnessCertificate {
  SolveStatus status = SolveStatus::kNotSolved;
  std::string message;
  std::vector<double> lower, upper;  // per demand, bounds on its exact max-min fair share
  std::vector<double> error;         // per demand: max(upper - share, share - lower, 0)
  double max_error = 0.0;            // largest error, in the network's unit
  double max_relative_error = 0.0;   // largest error / largest share
  int worst_demand = -1;
  int levels = 0;                    // levels of the allocation that were certified
  int witnesses_used = 0, witnesses_refused = 0;
  double witness_tolerance = 0.0;    // the most an accepted witness missed a target or capacity by, relative
  MultiflowStats stats;              // of the certificate's own LPs
  double seconds = 0.0;              // its time
};

struct MultiflowResult {
  SolveStatus status = SolveStatus::kNotSolved;
  std::string message;
  FairObjective objective = FairObjective::kMaxMinFair;
  std::vector<DemandShare> demands;
  std::vector<ArcLoad> arcs;
  std::vector<Tier> tiers;  // kMaxMinFair and kTradeoff (the tiers of the underlying max-min)

  double throughput = 0.0;
  double min_normalised_share = 0.0;
  double jain_index = 0.0;           // over normalised shares (Jain, Chiu, Hawe 1984)
  double max_throughput = -1.0;      // when solved alongside (-1: not solved)
  double price_of_fairness = -1.0;   // (max_throughput - throughput) / max_throughput

  // kMaxConcurrent and kFeasibility
  double lambda = -1.0;
  // kFeasibility
  bool all_demands_met = false;
  double shortfall = 0.0;            // sum of amounts minus the most that can be delivered
  std::vector<double> dual_lengths;  // per arc: a certificate when lambda < 1
  double certificate_capacity = 0.0; // sum_e capacity(e) * length(e)
  double certificate_demand = 0.0;   // sum_k a_k * dist_length(o_k, d_k); ratio = lambda
  std::vector<int> overloaded_cut_source_side;  // nodes; empty when no overloaded cut was found
  double overloaded_cut_capacity = 0.0, overloaded_cut_demand = 0.0;

  MultiflowCheck check;
  MultiflowStats stats;
  FairnessCertificate fairness;  // kNotSolved unless asked for
};

}  // namespace apportion
