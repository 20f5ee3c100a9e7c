// Minimum-cost flow: a textbook value, infeasibility, and optimality proven through
// reduced costs and potentials on seeded random graphs.
#include <catch2/catch.hpp>

#include "apportion/flow/max_flow.h"
#include "apportion/flow/min_cost_flow.h"
#include "random_networks.h"

using namespace apportion;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
// Complementary slackness: the largest violation of rc >= 0 below capacity and rc <= 0
// above zero, over every lane (two per shared two-way arc).
double slackness_violation(const FlowGraph& g, const MinCostFlowResult& r) {
  double worst = 0;
  for (int a = 0; a < g.arc_count(); ++a) {
    const int u = g.tail(a), v = g.head(a);
    const double x = r.flow[a], cap = g.capacity(a);
    auto lane = [&](double flow, double rc) {
      if (flow < cap - 1e-9) worst = std::max(worst, -rc);
      if (flow > 1e-9) worst = std::max(worst, rc);
    };
    lane(std::max(x, 0.0), g.cost(a) + r.potential[u] - r.potential[v]);
    if (g.two_way(a)) lane(std::max(-x, 0.0), g.cost(a) + r.potential[v] - r.potential[u]);
  }
  return worst;
}
}  // namespace

TEST_CASE("min-cost flow: Bradley-Hax-Magnanti Figure 8.1 costs 150", "[mincost][reference]") {
  // Bradley, Hax, Magnanti, Applied Mathematical Programming, Addison-Wesley 1977,
  // Figure 8.1 as commonly reproduced (numbering from memory): optimal cost 150.
  FlowGraph g(5);
  g.add_arc(0, 1, 15, 4), g.add_arc(0, 2, 8, 4), g.add_arc(1, 2, 20, 2), g.add_arc(1, 3, 4, 2);
  g.add_arc(1, 4, 10, 6), g.add_arc(2, 3, 15, 1), g.add_arc(2, 4, 4, 3), g.add_arc(3, 4, 20, 2);
  g.add_arc(4, 2, 5, 3);
  MinCostFlowResult r = min_cost_flow(g, {20, 0, 0, -5, -15});
  REQUIRE(r.status == SolveStatus::kOptimal);
  CHECK(r.cost == 150.0);
  CHECK(r.check.ok);
  CHECK(slackness_violation(g, r) <= 1e-9);
}

TEST_CASE("min-cost flow: infeasible and refused inputs", "[mincost]") {
  FlowGraph g(3);
  g.add_arc(0, 1, 5, 1), g.add_arc(1, 2, 3, 1);
  CHECK(min_cost_flow(g, 0, 2, 4).status == SolveStatus::kInfeasible);       // more than the cut
  CHECK(min_cost_flow(g, {1, 0, 0}).status == SolveStatus::kInfeasible);     // supplies do not balance
  CHECK(min_cost_flow(g, 0, 0, 1).status == SolveStatus::kBadInput);         // source is sink
  CHECK(min_cost_flow(g, {1, 0}).status == SolveStatus::kBadInput);          // wrong size
  MinCostFlowResult ok = min_cost_flow(g, 0, 2, 3);
  CHECK(ok.status == SolveStatus::kOptimal);
  CHECK(ok.cost == 6.0);
  SECTION("a negative-cost cycle is used to its capacity") {
    FlowGraph c(2);
    c.add_arc(0, 1, 4, -3), c.add_arc(1, 0, 4, 1);
    MinCostFlowResult r = min_cost_flow(c, {0, 0});
    REQUIRE(r.status == SolveStatus::kOptimal);
    CHECK(r.cost == -8.0);
  }
}

TEST_CASE("min-cost flow: reduced-cost optimality on random graphs", "[mincost][property]") {
  std::mt19937_64 rng(7);
  int feasible = 0;
  for (int i = 0; i < 300; ++i) {
    test::RandomSpec spec;
    spec.nodes = 2 + static_cast<int>(rng() % 30);
    spec.arcs = static_cast<int>(rng() % 120);
    spec.integral = i % 2 == 0;
    spec.two_way_share = (i % 3 == 0) ? 0.3 : 0.0;
    FlowGraph g = test::random_graph(rng, spec);
    // Send half of the maximum flow, so that the instance is feasible and costs matter.
    const double amount = max_flow(g, {0}, {spec.nodes - 1}).value / 2;
    MinCostFlowResult r = min_cost_flow(g, 0, spec.nodes - 1, amount);
    INFO("instance " << i);
    REQUIRE(r.status == SolveStatus::kOptimal);
    ++feasible;
    CHECK(r.check.ok);
    CHECK(slackness_violation(g, r) <= 1e-7 * (1 + g.max_abs_cost()));
  }
  CHECK(feasible == 300);
}
