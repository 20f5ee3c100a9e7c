// Maximum flow and minimum cut: textbook values, unpleasant inputs, and properties that
// prove answers (flow feasible, flow value equal to cut capacity) on seeded random graphs.
#include <catch2/catch.hpp>

#include "apportion/flow/max_flow.h"
#include "random_networks.h"

using namespace apportion;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
// Every arc's capacity summed over the arcs leaving the node set `side` (two-way both ways).
double cut_capacity(const FlowGraph& g, const std::vector<char>& side) {
  double c = 0;
  for (int a = 0; a < g.arc_count(); ++a) {
    if (side[g.tail(a)] && !side[g.head(a)]) c += g.capacity(a);
    else if (g.two_way(a) && side[g.head(a)] && !side[g.tail(a)]) c += g.capacity(a);
  }
  return c;
}
}  // namespace

TEST_CASE("max flow: CLRS Figure 26.1 network has value 23", "[maxflow][reference]") {
  // Cormen, Leiserson, Rivest, Stein, Introduction to Algorithms, 3rd ed., MIT Press 2009,
  // Figure 26.1: maximum flow 23; a minimum cut has source side {s, v1, v2, v4}.
  enum { s, v1, v2, v3, v4, t };
  FlowGraph g(6);
  g.add_arc(s, v1, 16), g.add_arc(s, v2, 13), g.add_arc(v1, v3, 12), g.add_arc(v2, v1, 4);
  g.add_arc(v2, v4, 14), g.add_arc(v3, v2, 9), g.add_arc(v3, t, 20), g.add_arc(v4, v3, 7), g.add_arc(v4, t, 4);
  MaxFlowResult r = max_flow(g, {s}, {t});
  REQUIRE(r.status == SolveStatus::kOptimal);
  CHECK(r.value == 23.0);
  CHECK(r.cut_capacity == 23.0);
  CHECK(r.check.ok);
  // The minimum cut of this network is unique: {s, v1, v2, v4} against {v3, t}.
  CHECK(r.source_side == std::vector<char>{1, 1, 1, 0, 1, 0});
  CHECK(r.cut_arcs.size() == 3);  // v1-v3 (12), v4-v3 (7), v4-t (4)
}

TEST_CASE("max flow: unpleasant inputs", "[maxflow]") {
  SECTION("a node that is both source and sink is bad input") {
    FlowGraph g(2);
    g.add_arc(0, 1, 5);
    CHECK(max_flow(g, {0}, {0}).status == SolveStatus::kBadInput);
  }
  SECTION("indices out of range are bad input") {
    FlowGraph g(2);
    CHECK(max_flow(g, {0}, {7}).status == SolveStatus::kBadInput);
  }
  SECTION("NaN and infinite capacities are bad input") {
    FlowGraph g(2);
    g.add_arc(0, 1, std::nan(""));
    CHECK(max_flow(g, {0}, {1}).status == SolveStatus::kBadInput);
    FlowGraph h(2);
    h.add_arc(0, 1, INFINITY);
    CHECK(max_flow(h, {0}, {1}).status == SolveStatus::kBadInput);
  }
  SECTION("no arcs: value 0, the cut is the source alone") {
    FlowGraph g(3);
    MaxFlowResult r = max_flow(g, {0}, {2});
    REQUIRE(r.status == SolveStatus::kOptimal);
    CHECK(r.value == 0.0);
    CHECK(r.cut_arcs.empty());
  }
  SECTION("parallel arcs add up; self-loops and zero capacities carry nothing") {
    FlowGraph g(2);
    g.add_arc(0, 1, 2.5), g.add_arc(0, 1, 4), g.add_arc(1, 1, 9), g.add_arc(0, 1, 0);
    MaxFlowResult r = max_flow(g, {0}, {1});
    CHECK(r.value == 6.5);
    CHECK(r.flow[2] == 0.0);
    CHECK(r.check.ok);
  }
  SECTION("a shared two-way arc carries flow against its drawn direction, within its capacity") {
    FlowGraph g(3);
    g.add_arc(0, 1, 10);
    g.add_arc(2, 1, 7, 0, /*two_way=*/true);  // drawn 2 -> 1, used 1 -> 2
    MaxFlowResult r = max_flow(g, {0}, {2});
    CHECK(r.value == 7.0);
    CHECK(r.flow[1] == -7.0);
    CHECK(r.check.ok);
  }
  SECTION("several sources and sinks") {
    // Two sources each with one arc into a hub, hub to two sinks: min(3+4, 5+1) = 6.
    FlowGraph g(5);
    g.add_arc(0, 2, 3), g.add_arc(1, 2, 4), g.add_arc(2, 3, 5), g.add_arc(2, 4, 1);
    MaxFlowResult r = max_flow(g, {0, 1}, {3, 4});
    CHECK(r.value == 6.0);
    CHECK(r.cut_capacity == 6.0);
    CHECK(r.check.ok);
  }
  SECTION("capacities twelve orders of magnitude apart") {
    FlowGraph g(3);
    g.add_arc(0, 1, 1e12), g.add_arc(1, 2, 1e-3), g.add_arc(0, 2, 1e12);
    MaxFlowResult r = max_flow(g, {0}, {2});
    CHECK_THAT(r.value, WithinRel(1e12 + 1e-3, 1e-12));
    CHECK(r.check.ok);
  }
}

TEST_CASE("max flow: value equals cut capacity on random graphs", "[maxflow][property]") {
  std::mt19937_64 rng(20261202);
  for (int i = 0; i < 300; ++i) {
    test::RandomSpec spec;
    spec.nodes = 2 + static_cast<int>(rng() % 40);
    spec.arcs = static_cast<int>(rng() % 160);
    spec.integral = i % 2 == 0;
    spec.two_way_share = (i % 3 == 0) ? 0.3 : 0.0;
    FlowGraph g = test::random_graph(rng, spec);
    MaxFlowResult r = max_flow(g, {0}, {spec.nodes - 1});
    INFO("instance " << i);
    REQUIRE(r.status == SolveStatus::kOptimal);
    CHECK(r.check.ok);
    CHECK_THAT(r.cut_capacity, WithinRel(r.value, 1e-9) || WithinAbs(r.value, 1e-9));
    // The reported side really is a cut of that capacity, containing s but not t.
    CHECK(r.source_side[0] == 1);
    CHECK(r.source_side[spec.nodes - 1] == 0);
    CHECK_THAT(cut_capacity(g, r.source_side), WithinRel(r.value, 1e-9) || WithinAbs(r.value, 1e-9));
  }
}
