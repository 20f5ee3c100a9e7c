// The fair-multiflow engine: published closed forms, hand-derived tiers, and properties
// checked with an independent arc-formulation LP.
#include <catch2/catch.hpp>
#include <cmath>
#include <random>

#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/multiflow/lp_solver.h"
#include "multiflow/arc_formulation.h"

using namespace apportion;
using apportion::test::max_share_arc_formulation;
using Catch::Matchers::WithinAbs;

namespace {

// A network from a compact description; demands ask for `amount` (< 0: "max").
struct Builder {
  Network net;
  explicit Builder(int nodes) {
    for (int v = 0; v < nodes; ++v) net.nodes.push_back({"n" + std::to_string(v), "", std::nullopt, std::nullopt, 0});
  }
  Builder& arc(int u, int v, double cap, bool two_way = false) {
    Arc a;
    a.id = "a" + std::to_string(net.arcs.size());
    a.from = u, a.to = v, a.capacity = cap, a.shared_two_way = two_way;
    net.arcs.push_back(a);
    return *this;
  }
  Builder& demand(int o, int d, double amount = -1, double weight = 1) {
    Demand k;
    k.id = "d" + std::to_string(net.demands.size());
    k.origin = o, k.destination = d, k.weight = weight;
    if (amount >= 0) k.amount = amount;
    net.demands.push_back(k);
    return *this;
  }
};

MultiflowResult fair(const Network& net, FairObjective o = FairObjective::kMaxMinFair, RoutingOptions routing = {}) {
  FairOptions opt;
  opt.objective = o;
  opt.routing = routing;
  MultiflowResult r = solve_multiflow(net, opt);
  REQUIRE(r.status == SolveStatus::kOptimal);
  REQUIRE(r.check.ok);
  return r;
}

Network random_network(std::mt19937_64& rng, int nodes, int arcs, int demands) {
  auto below = [&](int n) { return static_cast<int>(rng() % static_cast<unsigned>(n)); };
  Builder b(nodes);
  for (int a = 0; a < arcs; ++a) {
    const int u = a < nodes - 1 ? a : below(nodes);
    int v = a < nodes - 1 ? a + 1 : below(nodes);
    if (v == u) v = (u + 1) % nodes;
    const double cap = 1 + below(10);
    const bool two_way = below(4) == 0;
    b.arc(u, v, cap, two_way);
  }
  for (int k = 0; k < demands; ++k) {
    const int o = below(nodes);
    const int d = (o + 1 + below(nodes - 1)) % nodes;
    const double amount = below(3) == 0 ? -1 : below(12);
    const double weight = 1 + below(3);
    b.demand(o, d, amount, weight);
  }
  return b.net;
}

}  // namespace

TEST_CASE("max-min: Kelly's line network gives every route one half", "[fair][reference]") {
  // F. Kelly, "Charging and rate control for elastic traffic", European Transactions on
  // Telecommunications 8(1), 1997 (page from memory): n unit-capacity links in a row, one
  // long route across all of them and one short route on each link. Max-min fairness gives
  // every route 1/2 (the closed form is standard). Max throughput serves only the short
  // routes: n, so the price of fairness is (n - (n+1)/2) / n (derived, not quoted).
  for (int n = 1; n <= 6; ++n) {
    Builder b(n + 1);
    for (int i = 0; i < n; ++i) b.arc(i, i + 1, 1.0);
    b.demand(0, n);
    for (int i = 0; i < n; ++i) b.demand(i, i + 1);
    const MultiflowResult r = fair(b.net);
    INFO("n = " << n);
    for (const DemandShare& d : r.demands) {
      CHECK_THAT(d.share, WithinAbs(0.5, 1e-9));
      CHECK(d.tier == 1);
    }
    REQUIRE(r.tiers.size() == 1);
    CHECK(r.tiers[0].binding_arcs.size() == static_cast<std::size_t>(n));
    CHECK_THAT(r.max_throughput, WithinAbs(n, 1e-9));
    CHECK_THAT(r.price_of_fairness, WithinAbs((n - (n + 1) / 2.0) / n, 1e-9));
    CHECK_THAT(r.jain_index, WithinAbs(1.0, 1e-12));
    // The throughput rule itself has no price of fairness to report: nothing is given up.
    FairOptions most;
    most.objective = FairObjective::kMaxThroughput;
    const MultiflowResult t = solve_multiflow(b.net, most);
    CHECK_THAT(t.throughput, WithinAbs(n, 1e-9));
    CHECK(t.price_of_fairness < 0);
  }
}

TEST_CASE("max-min: hand-derived tiers", "[fair]") {
  SECTION("a bottleneck behind a shared arc freezes its demand first") {
    // s=0 -> a=1 (cap 3), a -> t=2 (cap 1), a -> u=3 (cap 10); d0: s->t, d1: s->u.
    // Filling: d0 stops at 1 when a->t fills (tier 1); d1 goes on until s->a fills at
    // 1 + d1 = 3, so d1 = 2 (tier 2). Derived by hand.
    Builder b(4);
    b.arc(0, 1, 3).arc(1, 2, 1).arc(1, 3, 10).demand(0, 2).demand(0, 3);
    const MultiflowResult r = fair(b.net);
    CHECK_THAT(r.demands[0].share, WithinAbs(1, 1e-9));
    CHECK_THAT(r.demands[1].share, WithinAbs(2, 1e-9));
    CHECK(r.demands[0].tier == 1);
    CHECK(r.demands[1].tier == 2);
    CHECK(r.demands[0].binding_arcs == std::vector<int>{1});
    CHECK(r.demands[0].binding_arcs_form_cut);
    CHECK(r.demands[1].binding_arcs == std::vector<int>{0});
    CHECK(r.arcs[1].tier == 1);
    CHECK(r.arcs[0].tier == 2);
  }
  SECTION("weights split one bottleneck in proportion") {
    // One arc of capacity 3; weights 2 and 1: f = (2t, t), 3t = 3. Derived by hand.
    Builder b(2);
    b.arc(0, 1, 3).demand(0, 1, -1, 2).demand(0, 1, -1, 1);
    const MultiflowResult r = fair(b.net);
    CHECK_THAT(r.demands[0].share, WithinAbs(2, 1e-9));
    CHECK_THAT(r.demands[1].share, WithinAbs(1, 1e-9));
    CHECK(r.demands[0].tier == r.demands[1].tier);
  }
  SECTION("a demand that gets its amount freezes and leaves the rest to others") {
    // Capacity 3, d0 asks 0.5: it freezes at 0.5 (tier 1, by its amount), d1 takes 2.5.
    Builder b(2);
    b.arc(0, 1, 3).demand(0, 1, 0.5).demand(0, 1);
    const MultiflowResult r = fair(b.net);
    CHECK_THAT(r.demands[0].share, WithinAbs(0.5, 1e-9));
    CHECK(r.demands[0].limited_by_amount);
    CHECK_THAT(r.demands[0].percent_of_amount, WithinAbs(100, 1e-7));
    CHECK_THAT(r.demands[1].share, WithinAbs(2.5, 1e-9));
    CHECK(r.demands[1].tier == 2);
  }
  SECTION("a demand with no path gets nothing, in the first tier") {
    Builder b(3);
    b.arc(0, 1, 5).demand(0, 1).demand(1, 2);
    const MultiflowResult r = fair(b.net);
    CHECK(r.demands[1].share == 0.0);
    CHECK(r.demands[1].tier == 1);
    CHECK_THAT(r.demands[0].share, WithinAbs(5, 1e-9));
    CHECK(r.min_normalised_share == 0.0);
  }
  SECTION("a shared two-way arc holds both directions together") {
    // One two-way arc of capacity 4 used 0->1 by d0 and 1->0 by d1: 2 each.
    Builder b(2);
    b.arc(0, 1, 4, true).demand(0, 1).demand(1, 0);
    const MultiflowResult r = fair(b.net);
    CHECK_THAT(r.demands[0].share, WithinAbs(2, 1e-9));
    CHECK_THAT(r.demands[1].share, WithinAbs(2, 1e-9));
    CHECK_THAT(r.arcs[0].load, WithinAbs(4, 1e-9));
  }
  SECTION("a disabled arc carries nothing") {
    Builder b(2);
    b.arc(0, 1, 4).arc(0, 1, 6).demand(0, 1);
    b.net.arcs[1].enabled = false;
    CHECK_THAT(fair(b.net).demands[0].share, WithinAbs(4, 1e-9));
  }
}

TEST_CASE("max-min: every share is judged at its own scale", "[fair][numerics]") {
  // A 0.001 arc feeding a 1e9 arc (12 orders of magnitude apart):
  //   0 -(0.001)-> 1 -(1e9)-> 2,   3 -(2e9)-> 1;   d0: 0->2, d1: 3->2.
  // Derived by hand: d0 is stopped by its own arc at 0.001 (tier 1); d1 takes the rest of
  // the shared 1e9 arc, 1e9 - 0.001 (tier 2).
  // Before shares were judged per demand, a global tolerance (1e-9 of 2e9 = 2) reported
  // d0 as 0.
  Builder b(4);
  b.arc(0, 1, 0.001).arc(1, 2, 1e9).arc(3, 1, 2e9).demand(0, 2).demand(3, 2);
  const MultiflowResult r = fair(b.net);
  CHECK_THAT(r.demands[0].share, WithinAbs(0.001, 1e-15));
  CHECK_THAT(r.demands[1].share, WithinAbs(1e9 - 0.001, 1e-6));
  CHECK(r.demands[0].tier == 1);
  CHECK(r.demands[1].tier == 2);
  REQUIRE(r.demands[0].paths.size() == 1);
  CHECK(r.demands[0].paths[0].arcs == std::vector<int>{0, 1});

  SECTION("the checker measures an excess against the arc's own capacity") {
    // 0.3 too much on the 0.001 arc is 3e-10 of the largest capacity, but 300 times the arc.
    MultiflowResult bad = r;
    bad.demands[0].paths[0].amount += 0.3;
    bad.demands[0].share += 0.3;
    bad.arcs[0].load += 0.3;
    bad.arcs[1].load += 0.3;
    const MultiflowCheck c = check_multiflow(b.net, bad);
    CHECK_FALSE(c.ok);
    CHECK(c.max_capacity_violation > 100);
    CHECK(c.worst.find("'a0'") != std::string::npos);
  }
}

TEST_CASE("routing options: hop limits and k shortest paths restrict the paths", "[fair][routing]") {
  // 0 -> 3 directly (cap 1), and 0 -> 1 -> 2 -> 3 (cap 5 each): all paths give 6; at most
  // one arc gives 1; the single shortest path gives 1; the two shortest give 6.
  Builder b(4);
  b.arc(0, 3, 1).arc(0, 1, 5).arc(1, 2, 5).arc(2, 3, 5).demand(0, 3);
  CHECK_THAT(fair(b.net).demands[0].share, WithinAbs(6, 1e-9));
  CHECK_THAT(fair(b.net, FairObjective::kMaxMinFair, {1, 0}).demands[0].share, WithinAbs(1, 1e-9));
  CHECK_THAT(fair(b.net, FairObjective::kMaxMinFair, {0, 1}).demands[0].share, WithinAbs(1, 1e-9));
  CHECK_THAT(fair(b.net, FairObjective::kMaxMinFair, {0, 2}).demands[0].share, WithinAbs(6, 1e-9));
  CHECK_THAT(fair(b.net, FairObjective::kMaxMinFair, {3, 0}).demands[0].share, WithinAbs(6, 1e-9));
}

TEST_CASE("feasibility: a certificate proves the shortfall", "[fair][feasibility]") {
  // Two demands of 3 each over one arc of 4: lambda = 4/6; 2 units cannot be delivered.
  Builder b(3);
  b.arc(0, 1, 4).arc(1, 2, 10).demand(0, 1, 3).demand(0, 2, 3);
  const MultiflowResult r = fair(b.net, FairObjective::kFeasibility);
  CHECK(!r.all_demands_met);
  CHECK_THAT(r.lambda, WithinAbs(4.0 / 6.0, 1e-9));
  CHECK_THAT(r.shortfall, WithinAbs(2, 1e-9));
  // Weak duality: capacity x length over amount x distance equals lambda.
  CHECK_THAT(r.certificate_capacity / r.certificate_demand, WithinAbs(r.lambda, 1e-9));
  CHECK(r.overloaded_cut_source_side == std::vector<int>{0});
  CHECK_THAT(r.overloaded_cut_demand, WithinAbs(6, 1e-9));
  // With more capacity every demand fits.
  b.net.arcs[0].capacity = 6;
  CHECK(fair(b.net, FairObjective::kFeasibility).all_demands_met);
}

TEST_CASE("trade-off: throughput grows as fairness is relaxed", "[fair][tradeoff]") {
  Builder b(3);
  b.arc(0, 1, 1).arc(1, 2, 1).demand(0, 2).demand(0, 1).demand(1, 2);
  FairOptions opt;
  opt.objective = FairObjective::kTradeoff;
  double last = 0;
  for (double eps : {0.0, 0.5, 1.0}) {
    opt.epsilon = eps;
    MultiflowResult r = solve_multiflow(b.net, opt);
    REQUIRE(r.status == SolveStatus::kOptimal);
    // Kelly's line with n = 2: fair 1/2 each (throughput 1.5); the long route keeps
    // (1 - eps)/2, the short ones take the rest: throughput 1.5 + eps/2 (derived).
    CHECK_THAT(r.throughput, WithinAbs(1.5 + eps / 2, 1e-9));
    CHECK(r.demands[0].share >= (1 - eps) * 0.5 - 1e-9);
    CHECK(r.throughput >= last - 1e-12);
    last = r.throughput;
  }
}

TEST_CASE("max-min: properties on random networks", "[fair][property]") {
  std::mt19937_64 rng(2718);
  for (int i = 0; i < 40; ++i) {
    const Network net = random_network(rng, 3 + static_cast<int>(rng() % 6), 4 + static_cast<int>(rng() % 12),
                                       1 + static_cast<int>(rng() % 6));
    const MultiflowResult r = fair(net);
    const int K = static_cast<int>(net.demands.size());
    INFO("instance " << i);
    // No frozen demand can grow without lowering a demand at or below its normalised
    // level, checked with an independent arc-formulation LP.
    for (int k = 0; k < K; ++k) {
      std::vector<double> floor(K, 0.0);
      for (int j = 0; j < K; ++j)
        if (j != k && r.demands[j].normalised <= r.demands[k].normalised + 1e-9) floor[j] = r.demands[j].share;
      CHECK(max_share_arc_formulation(net, k, floor) <= r.demands[k].share + 1e-6);
    }
    // Scaling capacities and amounts scales every share.
    Network scaled = net;
    for (Arc& a : scaled.arcs) a.capacity *= 3;
    for (Demand& d : scaled.demands)
      if (d.amount) *d.amount *= 3;
    const MultiflowResult rs = fair(scaled);
    for (int k = 0; k < K; ++k) CHECK_THAT(rs.demands[k].share, WithinAbs(3 * r.demands[k].share, 1e-6));
    // Permuting the demands permutes the shares.
    Network permuted = net;
    std::reverse(permuted.demands.begin(), permuted.demands.end());
    const MultiflowResult rp = fair(permuted);
    for (int k = 0; k < K; ++k) CHECK_THAT(rp.demands[K - 1 - k].share, WithinAbs(r.demands[k].share, 1e-6));
    // Adding capacity never lowers the minimum share.
    Network bigger = net;
    bigger.arcs[rng() % bigger.arcs.size()].capacity += 5;
    CHECK(fair(bigger).min_normalised_share >= r.min_normalised_share - 1e-6);
  }
}

// The origin-aggregated rounds (origin_master.h) against the per-demand ones: the same
// shares, and every demand frozen at the same level, on random networks with amounts
// (integer data, so that amount levels coincide with bottleneck levels) and weights. The
// aggregated rounds must have run to the end, not fallen back to the per-demand LP.
TEST_CASE("max-min: the rounds aggregated by origin give the per-demand rounds' answer", "[fair][property]") {
  std::mt19937_64 rng(4142);
  for (int i = 0; i < 40; ++i) {
    const int nodes = 3 + static_cast<int>(rng() % 6);
    Network net = random_network(rng, nodes, nodes + 2 + static_cast<int>(rng() % 10), 2 + static_cast<int>(rng() % 20));
    for (Demand& d : net.demands) {
      if (rng() % 3 != 0) d.amount = 0.25 * static_cast<double>(1 + rng() % 12);
      if (rng() % 4 == 0) d.weight = 2.0;
    }
    FairOptions by_origin, per_demand;
    by_origin.origin_rounds_from = 0;
    per_demand.origin_rounds_from = FairOptions::kNever;
    const MultiflowResult a = solve_multiflow(net, by_origin), b = solve_multiflow(net, per_demand);
    INFO("instance " << i);
    REQUIRE(a.status == SolveStatus::kOptimal);
    REQUIRE(b.status == SolveStatus::kOptimal);
    REQUIRE(a.check.ok);
    CHECK(a.stats.retries == 0);
    CHECK(a.stats.saturation_tests == 0);  // none run: the per-demand rounds did not run
    REQUIRE(a.tiers.size() == b.tiers.size());
    for (std::size_t k = 0; k < net.demands.size(); ++k) {
      CHECK_THAT(a.demands[k].share, WithinAbs(b.demands[k].share, 1e-7));
      CHECK(a.demands[k].limited_by_amount == b.demands[k].limited_by_amount);
      CHECK_THAT(a.tiers[a.demands[k].tier - 1].level, WithinAbs(b.tiers[b.demands[k].tier - 1].level, 1e-7));
    }
  }
}

// The amount search (fair_multiflow.h, step 2a) must give what one round per amount level
// gives: the same shares, the same tiers at the same levels; and so must the search without
// its floor (FairOptions::amount_floor) or its ceiling (amount_ceiling). Instances with many demands limited by their
// amounts, and integer data so that amount levels often coincide with bottleneck levels.
TEST_CASE("max-min: the amount search settles runs of amounts as one round each would", "[fair][property]") {
  std::mt19937_64 rng(1618);
  int batched = 0, floored = 0, ceiled = 0;
  for (int i = 0; i < 30; ++i) {
    const int nodes = 4 + static_cast<int>(rng() % 5);
    Network net = random_network(rng, nodes, nodes + 4 + static_cast<int>(rng() % 8), 8 + static_cast<int>(rng() % 16));
    for (Demand& d : net.demands)
      if (rng() % 5 != 0) d.amount = 0.25 * static_cast<double>(1 + rng() % 12);
    FairOptions on, off, from_lowest, no_ceiling;
    off.amount_search = false;
    from_lowest.amount_floor = false;
    no_ceiling.amount_ceiling = false;
    const MultiflowResult a = solve_multiflow(net, on), b = solve_multiflow(net, off), c = solve_multiflow(net, from_lowest),
                          d = solve_multiflow(net, no_ceiling);
    INFO("instance " << i);
    REQUIRE(a.status == SolveStatus::kOptimal);
    REQUIRE(b.status == SolveStatus::kOptimal);
    REQUIRE(c.status == SolveStatus::kOptimal);
    REQUIRE(a.check.ok);
    for (std::size_t k = 0; k < net.demands.size(); ++k) {
      CHECK_THAT(c.demands[k].share, WithinAbs(b.demands[k].share, 1e-7));
      CHECK(c.demands[k].tier == b.demands[k].tier);
      CHECK_THAT(d.demands[k].share, WithinAbs(b.demands[k].share, 1e-7));
      CHECK(d.demands[k].tier == b.demands[k].tier);
      CHECK_THAT(a.demands[k].share, WithinAbs(b.demands[k].share, 1e-7));
      CHECK(a.demands[k].tier == b.demands[k].tier);
      CHECK(a.demands[k].limited_by_amount == b.demands[k].limited_by_amount);
    }
    REQUIRE(a.tiers.size() == b.tiers.size());
    for (std::size_t t = 0; t < a.tiers.size(); ++t) {
      CHECK_THAT(a.tiers[t].level, WithinAbs(b.tiers[t].level, 1e-7));
      CHECK(a.tiers[t].demands == b.tiers[t].demands);
    }
    batched += a.stats.lp_solves < b.stats.lp_solves;
    floored += d.stats.amount_tests < c.stats.amount_tests;
    ceiled += a.stats.amount_tests < d.stats.amount_tests;
  }
  // The search has to have settled runs of amounts in some of them, and its floor and
  // ceiling to have saved tests in some, or this tested nothing.
  CHECK(batched >= 5);
  CHECK(floored >= 5);
  CHECK(ceiled >= 3);
}

// Dropping unused path columns (path_master.h, the column pool) must change no result: the
// same shares, tiers and levels as keeping every path, a result the independent checker
// accepts, and the same optimum for the other objectives. A small pool makes the drops
// happen on these small networks; the test requires that they did.
TEST_CASE("column pool: dropping unused paths changes no result", "[fair][property]") {
  std::mt19937_64 rng(4669);
  int dropped = 0;
  for (int i = 0; i < 30; ++i) {
    const int nodes = 5 + static_cast<int>(rng() % 5);
    Network net = random_network(rng, nodes, nodes + 6 + static_cast<int>(rng() % 10), 6 + static_cast<int>(rng() % 14));
    for (Demand& d : net.demands)
      if (rng() % 3 == 0) d.amount = 0.5 * static_cast<double>(1 + rng() % 8);
    FairOptions pool, all;
    pool.path_pool = 0.05, all.path_pool = 0;
    const MultiflowResult a = solve_multiflow(net, pool), b = solve_multiflow(net, all);
    INFO("instance " << i << ": " << a.message);
    REQUIRE(a.status == SolveStatus::kOptimal);
    REQUIRE(b.status == SolveStatus::kOptimal);
    REQUIRE(a.check.ok);
    CHECK(b.stats.paths_dropped == 0);
    for (std::size_t k = 0; k < net.demands.size(); ++k) {
      CHECK_THAT(a.demands[k].share, WithinAbs(b.demands[k].share, 1e-7));
      CHECK(a.demands[k].tier == b.demands[k].tier);
    }
    REQUIRE(a.tiers.size() == b.tiers.size());
    for (std::size_t t = 0; t < a.tiers.size(); ++t) CHECK_THAT(a.tiers[t].level, WithinAbs(b.tiers[t].level, 1e-7));
    CHECK_THAT(a.max_throughput, WithinAbs(b.max_throughput, 1e-6));
    pool.objective = all.objective = FairObjective::kMaxThroughput;
    const MultiflowResult ta = solve_multiflow(net, pool), tb = solve_multiflow(net, all);
    REQUIRE(ta.check.ok);
    CHECK_THAT(ta.throughput, WithinAbs(tb.throughput, 1e-6));
    dropped += a.stats.paths_dropped > 0;
  }
  CHECK(dropped >= 10);
}

TEST_CASE("max-min: a run of amount levels is settled in a few LPs", "[fair]") {
  // Twelve demands across one arc of capacity 100, amounts 1..12 (hand-derived: all fit,
  // 78 in all, so each demand gets its amount, in a tier of its own at its own level).
  Builder b(2);
  b.arc(0, 1, 100);
  for (int k = 1; k <= 12; ++k) b.demand(0, 1, k);
  FairOptions on, off;
  off.amount_search = false;
  const MultiflowResult a = solve_multiflow(b.net, on), one_by_one = solve_multiflow(b.net, off);
  REQUIRE(a.status == SolveStatus::kOptimal);
  REQUIRE(a.check.ok);
  REQUIRE(a.tiers.size() == 12);
  for (int k = 0; k < 12; ++k) {
    CHECK_THAT(a.demands[k].share, WithinAbs(k + 1.0, 1e-9));
    CHECK(a.demands[k].limited_by_amount);
    CHECK(a.demands[k].tier == k + 1);
    CHECK_THAT(a.tiers[k].level, WithinAbs(k + 1.0, 1e-9));
  }
  CHECK(a.stats.lp_solves < one_by_one.stats.lp_solves);
}
