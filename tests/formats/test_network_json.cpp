// The JSON network file: reading, writing, and every validation rule with its message.
#include <catch2/catch.hpp>

#include "apportion/formats/network_json.h"

using namespace apportion;

namespace {
std::string doc(const std::string& nodes, const std::string& arcs, const std::string& demands = "[]") {
  return R"({"format":"apportion-network","version":1,"nodes":)" + nodes + R"(,"arcs":)" + arcs +
         R"(,"demands":)" + demands + "}";
}
const char* kTwoNodes = R"([{"id":"a"},{"id":"b"}])";

bool has_message(const LoadResult& r, Severity sev, const std::string& kind, const std::string& id,
                 const std::string& field) {
  for (const Diagnostic& d : r.diagnostics.items)
    if (d.severity == sev && d.item_kind == kind && d.item_id == id && d.field == field) return true;
  return false;
}
}  // namespace

TEST_CASE("network JSON: a full document reads and writes back identically", "[json]") {
  const std::string text = R"({
  "format": "apportion-network", "version": 1, "name": "Test",
  "units": {"capacity": "Gbit/s", "cost": "ms", "time": "h"},
  "nodes": [{"id": "a", "label": "Alpha", "x": 1.5, "y": -2, "supply": 3}, {"id": "b", "supply": -3}],
  "arcs": [{"id": "e1", "from": "a", "to": "b", "capacity": 10, "cost": 2, "transit": 0.5},
           {"id": "e2", "from": "b", "to": "a", "capacity": 4, "enabled": false, "shared_two_way": true}],
  "demands": [{"id": "k1", "origin": "a", "destination": "b", "amount": 7, "weight": 2, "label": "main"},
              {"id": "k2", "origin": "b", "destination": "a", "amount": "max"}],
  "metadata": {"author": "test", "nested": [1, 2]}
})";
  LoadResult r = read_network_json(text);
  REQUIRE(r.ok());
  const Network& n = *r.network;
  CHECK(n.name == "Test");
  CHECK(n.units.capacity == "Gbit/s");
  CHECK(n.nodes[0].label == "Alpha");
  CHECK(*n.nodes[0].x == 1.5);
  CHECK(!n.nodes[1].x);
  CHECK(n.arcs[1].shared_two_way);
  CHECK(!n.arcs[1].enabled);
  CHECK(*n.arcs[0].transit == 0.5);
  CHECK(*n.demands[0].amount == 7);
  CHECK(!n.demands[1].amount);
  CHECK(n.demands[0].weight == 2);
  LoadResult again = read_network_json(write_network_json(n));
  REQUIRE(again.ok());
  CHECK(write_network_json(*again.network) == write_network_json(n));
  CHECK(again.network->metadata_json == R"({"author":"test","nested":[1,2]})");
}

TEST_CASE("network JSON: errors name the item and the field", "[json][validation]") {
  SECTION("unknown node reference") {
    LoadResult r = read_network_json(doc(kTwoNodes, R"([{"id":"e","from":"a","to":"zz","capacity":1}])"));
    CHECK(!r.ok());
    CHECK(has_message(r, Severity::kError, "arc", "e", "to"));
  }
  SECTION("duplicate ids") {
    LoadResult r = read_network_json(doc(R"([{"id":"a"},{"id":"a"}])", "[]"));
    CHECK(!r.ok());
    CHECK(has_message(r, Severity::kError, "node", "a", "id"));
    LoadResult r2 = read_network_json(
        doc(kTwoNodes, R"([{"id":"e","from":"a","to":"b","capacity":1},{"id":"e","from":"b","to":"a","capacity":1}])"));
    CHECK(has_message(r2, Severity::kError, "arc", "e", "id"));
  }
  SECTION("negative, infinite and non-numeric capacity") {
    CHECK(has_message(read_network_json(doc(kTwoNodes, R"([{"id":"e","from":"a","to":"b","capacity":-1}])")),
                      Severity::kError, "arc", "e", "capacity"));
    // A number too large for a double is refused by the JSON reader itself, with its place.
    LoadResult big = read_network_json(doc(kTwoNodes, R"([{"id":"e","from":"a","to":"b","capacity":1e999}])"));
    REQUIRE(!big.ok());
    CHECK(big.diagnostics.items[0].message.find("1e999") != std::string::npos);
    CHECK(has_message(read_network_json(doc(kTwoNodes, R"([{"id":"e","from":"a","to":"b","capacity":"NaN"}])")),
                      Severity::kError, "arc", "e", "capacity"));
  }
  SECTION("origin equal to destination") {
    LoadResult r = read_network_json(doc(kTwoNodes, "[]", R"([{"id":"k","origin":"a","destination":"a","amount":1}])"));
    CHECK(has_message(r, Severity::kError, "demand", "k", "destination"));
  }
  SECTION("non-positive weight") {
    LoadResult r = read_network_json(
        doc(kTwoNodes, "[]", R"([{"id":"k","origin":"a","destination":"b","amount":1,"weight":0}])"));
    CHECK(has_message(r, Severity::kError, "demand", "k", "weight"));
  }
  SECTION("wrong format, version and broken JSON") {
    CHECK(!read_network_json("{").ok());
    CHECK(!read_network_json("[]").ok());
    CHECK(!read_network_json(R"({"format":"other","version":1})").ok());
    LoadResult v = read_network_json(R"({"format":"apportion-network","version":99})");
    CHECK(has_message(v, Severity::kError, "file", "", "version"));
  }
}

TEST_CASE("network JSON: warnings do not stop loading", "[json][validation]") {
  LoadResult r = read_network_json(doc(R"([{"id":"a"},{"id":"b"},{"id":"c"},{"id":"lonely"}])",
                                       R"([{"id":"loop","from":"a","to":"a","capacity":1},
                                           {"id":"zero","from":"a","to":"b","capacity":0},
                                           {"id":"cb","from":"c","to":"b","capacity":1}])",
                                       R"([{"id":"k","origin":"a","destination":"c","amount":1}])"));
  REQUIRE(r.ok());
  CHECK(has_message(r, Severity::kWarning, "arc", "loop", "to"));
  CHECK(has_message(r, Severity::kWarning, "arc", "zero", "capacity"));
  CHECK(has_message(r, Severity::kWarning, "node", "lonely", ""));
  CHECK(has_message(r, Severity::kWarning, "demand", "k", "destination"));  // c is not reachable from a
  CHECK(r.diagnostics.error_count() == 0);
}

TEST_CASE("network JSON: duplicate keys are refused by name", "[json][hostile]") {
  // RFC 8259 section 4: names within an object SHOULD be unique; behaviour is otherwise
  // unpredictable, so Apportion refuses such files.
  LoadResult r = read_network_json(
      R"({"format":"apportion-network","version":1,"nodes":[{"id":"a","id":"b"}],"arcs":[],"demands":[]})");
  CHECK(!r.ok());
  CHECK(has_message(r, Severity::kError, "file", "", "id"));
  LoadResult top = read_network_json(R"({"format":"apportion-network","version":1,"version":1,"nodes":[]})");
  CHECK(!top.ok());
  // The same key in different objects is fine.
  CHECK(read_network_json(doc(kTwoNodes, "[]")).ok());
}
