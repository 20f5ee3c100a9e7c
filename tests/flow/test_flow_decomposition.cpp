// Flow decomposition: pieces add back up to the flow, paths run from sources to sinks.
#include <catch2/catch.hpp>

#include "apportion/flow/flow_decomposition.h"
#include "apportion/flow/max_flow.h"
#include "apportion/flow/min_cost_flow.h"
#include "random_networks.h"

using namespace apportion;

TEST_CASE("decomposition: paths and cycles sum to the flow", "[decomposition][property]") {
  std::mt19937_64 rng(99);
  for (int i = 0; i < 200; ++i) {
    test::RandomSpec spec;
    spec.nodes = 2 + static_cast<int>(rng() % 25);
    spec.arcs = static_cast<int>(rng() % 100);
    spec.integral = i % 2 == 0;
    spec.two_way_share = 0.2;
    FlowGraph g = test::random_graph(rng, spec);
    const int t = spec.nodes - 1;
    MaxFlowResult r = max_flow(g, {0}, {t});
    // Add a circulation on top so that cycles appear: a min-cost flow with zero supplies
    // would be zero, so take the flow itself and check what we get.
    const Tolerance tol = Tolerance::for_scale(g.max_capacity());
    FlowDecomposition d = decompose_flow(g, r.flow, tol);
    std::vector<double> sum(g.arc_count(), 0.0);
    double value = 0;
    for (const FlowPiece& p : d.paths) {
      CHECK(p.nodes.front() == 0);
      CHECK(p.nodes.back() == t);
      CHECK(p.arcs.size() + 1 == p.nodes.size());
      value += p.amount;
      for (std::size_t k = 0; k < p.arcs.size(); ++k) {
        const int a = p.arcs[k];
        const bool forward = g.tail(a) == p.nodes[k] && g.head(a) == p.nodes[k + 1];
        sum[a] += forward ? p.amount : -p.amount;
      }
    }
    for (const FlowPiece& c : d.cycles)
      for (std::size_t k = 0; k < c.arcs.size(); ++k) {
        const int a = c.arcs[k];
        sum[a] += g.tail(a) == c.nodes[k] ? c.amount : -c.amount;
      }
    INFO("instance " << i);
    CHECK(std::abs(value - r.value) <= 1e-9 * (1 + r.value));
    for (int a = 0; a < g.arc_count(); ++a) CHECK(std::abs(sum[a] - r.flow[a]) <= 1e-9 * (1 + g.capacity(a)));
  }
}

TEST_CASE("decomposition: a circulation is all cycles", "[decomposition]") {
  FlowGraph g(3);
  g.add_arc(0, 1, 5), g.add_arc(1, 2, 5), g.add_arc(2, 0, 5);
  FlowDecomposition d = decompose_flow(g, {2, 2, 2}, Tolerance(1e-12));
  CHECK(d.paths.empty());
  REQUIRE(d.cycles.size() == 1);
  CHECK(d.cycles[0].amount == 2);
  CHECK(d.cycles[0].arcs.size() == 3);
}
