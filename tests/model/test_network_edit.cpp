// Editing operations and automatic layout of network documents. Expected values are derived
// by hand from the small networks below (common practice, no source).
#include <catch2/catch.hpp>
#include <cmath>

#include "apportion/layout/network_layout.h"
#include "apportion/model/network_edit.h"
#include "apportion/model/validation.h"

using namespace apportion;

namespace {

// A path 0-1-2-3 with a chord 0-2 and two demands.
Network sample() {
  Network net;
  for (int v = 0; v < 4; ++v) add_node(net, v * 10.0, 0.0);
  add_arc(net, 0, 1);
  add_arc(net, 1, 2);
  add_arc(net, 2, 3);
  add_arc(net, 0, 2);
  add_demand(net, 0, 3);
  add_demand(net, 1, 3);
  return net;
}

}  // namespace

TEST_CASE("new items get fresh ids and sane defaults", "[edit]") {
  Network net = sample();
  CHECK(net.nodes[3].id == "n4");
  CHECK(net.arcs[3].id == "a4");
  CHECK(net.demands[1].id == "d2");
  CHECK(net.arcs[0].capacity == 1.0);  // no arcs yet: 1
  net.arcs[0].capacity = 10, net.arcs[1].capacity = 30, net.arcs[2].capacity = 20, net.arcs[3].capacity = 1000;
  const int a = add_arc(net, 3, 0);
  CHECK(net.arcs[a].capacity == 30.0);  // the median of {10, 20, 30, 1000} taken at position 2 of 4
  net.nodes[0].id = "n6";                // a renamed node must not be given its id again
  add_node(net, 0, 0);
  add_node(net, 0, 0);
  CHECK(net.nodes[4].id == "n5");
  CHECK(net.nodes[5].id == "n7");
  CHECK_FALSE(validate(net).has_errors());
}

TEST_CASE("removing a node removes its arcs and demands and renumbers the rest", "[edit]") {
  Network net = sample();
  Selection sel;
  sel.nodes = {1};
  CHECK(remove_items(net, sel) == 1 + 2 + 1);  // node n2, arcs a1 (0-1) and a2 (1-2), demand d2 (1-3)
  REQUIRE(net.node_count() == 3);
  REQUIRE(net.arc_count() == 2);
  CHECK(net.arcs[0].id == "a3");
  CHECK(net.nodes[net.arcs[0].from].id == "n3");
  CHECK(net.nodes[net.arcs[0].to].id == "n4");
  CHECK(net.nodes[net.arcs[1].from].id == "n1");
  CHECK(net.nodes[net.arcs[1].to].id == "n3");
  REQUIRE(net.demands.size() == 1);
  CHECK(net.nodes[net.demands[0].origin].id == "n1");
  CHECK(net.nodes[net.demands[0].destination].id == "n4");
  CHECK_FALSE(validate(net).has_errors());
}

TEST_CASE("removing arcs and demands only, out-of-range indices ignored", "[edit]") {
  Network net = sample();
  Selection sel;
  sel.arcs = {3, 3, 99};
  sel.demands = {0, -1};
  CHECK(remove_items(net, sel) == 2);
  CHECK(net.arc_count() == 3);
  CHECK(net.demands.size() == 1);
  CHECK(net.demands[0].id == "d2");
  CHECK(remove_items(net, Selection{}) == 0);
}

TEST_CASE("automatic layout places every node, apart, deterministically", "[layout]") {
  // A 6 x 6 grid without positions.
  Network net;
  const int side = 6;
  for (int v = 0; v < side * side; ++v) net.nodes.push_back({"v" + std::to_string(v), "", std::nullopt, std::nullopt, 0});
  for (int r = 0; r < side; ++r)
    for (int c = 0; c < side; ++c) {
      if (c + 1 < side) add_arc(net, r * side + c, r * side + c + 1);
      if (r + 1 < side) add_arc(net, r * side + c, (r + 1) * side + c);
    }
  Network again = net;
  auto_layout(net);
  auto_layout(again);
  double closest = 1e300, arc_mean = 0, all_mean = 0;
  int pairs = 0;
  for (int u = 0; u < net.node_count(); ++u) {
    REQUIRE(net.nodes[u].x.has_value());
    REQUIRE(net.nodes[u].y.has_value());
    CHECK(*net.nodes[u].x == *again.nodes[u].x);
    CHECK(*net.nodes[u].y == *again.nodes[u].y);
    for (int v = u + 1; v < net.node_count(); ++v) {
      const double d = std::hypot(*net.nodes[u].x - *net.nodes[v].x, *net.nodes[u].y - *net.nodes[v].y);
      closest = std::min(closest, d);
      all_mean += d, ++pairs;
    }
  }
  for (const Arc& a : net.arcs)
    arc_mean += std::hypot(*net.nodes[a.from].x - *net.nodes[a.to].x, *net.nodes[a.from].y - *net.nodes[a.to].y);
  arc_mean /= net.arc_count();
  all_mean /= pairs;
  const double k = 100.0;  // the ideal distance of network_layout.cpp for any n
  CHECK(closest > 0.2 * k);          // no two nodes on top of each other
  CHECK(arc_mean < 0.4 * all_mean);  // neighbours are drawn near each other
}

TEST_CASE("automatic layout bounds its work on huge networks", "[layout][limits]") {
  const LayoutOptions o;
  CHECK(layout_iterations(1000, 3000, o) == 200);
  CHECK(layout_iterations(150000, 50000, o) == 200);
  CHECK(layout_iterations(2000000, 0, o) == 20);        // 200 x 200,000 / 2,000,000
  CHECK(layout_iterations(2000000, 10000000, o) == 5);  // never fewer than 5
  // iterations x (nodes + arcs) stays within 200 x 200,000 above the threshold
  for (int n : {300000, 700000, 1500000})
    CHECK(static_cast<double>(layout_iterations(n, n, o)) * (2.0 * n) <= 200.0 * 200000);
}

TEST_CASE("automatic layout keeps the nodes that already have a position", "[layout]") {
  Network net = sample();
  net.nodes.push_back({"loose", "", std::nullopt, std::nullopt, 0});
  add_arc(net, 4, 0);
  auto_layout(net);
  for (int v = 0; v < 4; ++v) {
    CHECK(*net.nodes[v].x == v * 10.0);
    CHECK(*net.nodes[v].y == 0.0);
  }
  REQUIRE(net.nodes[4].x.has_value());
  CHECK(std::isfinite(*net.nodes[4].x));
  CHECK(std::isfinite(*net.nodes[4].y));
}
