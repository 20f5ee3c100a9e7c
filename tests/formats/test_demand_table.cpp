// Demands tables added to an open network: comma (RFC 4180), tab (the IANA media type
// text/tab-separated-values, which spreadsheets put on the clipboard -- from memory) and
// semicolon delimiters; columns by name in any order; nodes by id or label; generated ids;
// errors that name the row and the column; and the network's own CSV demands table read
// back unchanged. Expected values are read off the small tables below (common practice,
// no source).
#include <catch2/catch.hpp>

#include "apportion/formats/demand_table.h"
#include "apportion/formats/network_csv.h"
#include "apportion/model/network_edit.h"
#include "apportion/model/size_limits.h"

using namespace apportion;

namespace {

Network three() {
  Network net;
  for (int v = 0; v < 3; ++v) add_node(net, v, 0);
  net.nodes[0].id = "ams", net.nodes[0].label = "Amsterdam";
  net.nodes[1].id = "ber", net.nodes[1].label = "Berlin";
  net.nodes[2].id = "cph", net.nodes[2].label = "Copenhagen";
  Demand k;
  k.id = "ams-ber", k.origin = 0, k.destination = 1;
  net.demands.push_back(k);
  return net;
}

bool has(const Diagnostics& d, const std::string& row, const std::string& field, const std::string& text) {
  for (const Diagnostic& x : d.items)
    if (x.item_id == row && x.field == field && x.message.find(text) != std::string::npos) return true;
  return false;
}

}  // namespace

TEST_CASE("demands table: pasted spreadsheet cells (tabs), columns by name, nodes by label", "[demands][csv]") {
  Network net = three();
  const std::string pasted =
      "Label\tFrom\tTo\tAmount\tWeight\r\n"
      "night backup\tAmsterdam\tCopenhagen\t12.5\t2\r\n"
      "\t\t\t\t\r\n"
      "\tBerlin \tams\tmax\t\r\n"
      "\tams\tber\t\t\r\n";
  REQUIRE(looks_like_demand_table(pasted));
  DemandTableRead t = read_demand_table(net, pasted);
  REQUIRE(t.ok());
  CHECK(t.delimiter == '\t');
  REQUIRE(t.demands.size() == 3);
  CHECK((t.demands[0].origin == 0 && t.demands[0].destination == 2));
  CHECK(*t.demands[0].amount == 12.5);
  CHECK(t.demands[0].weight == 2.0);
  CHECK(t.demands[0].label == "night backup");
  CHECK(t.demands[0].id == "ams-cph");
  CHECK((t.demands[1].origin == 1 && t.demands[1].destination == 0 && !t.demands[1].amount));
  CHECK(t.demands[1].weight == 1.0);
  CHECK(t.demands[2].id == "ams-ber-2");  // the network has ams-ber already
  CHECK(t.generated_ids == 3);
  CHECK(add_demand_table(net, std::move(t), false) == 3);
  CHECK(net.demands.size() == 4);
  CHECK(net.demands[0].id == "ams-ber");
}

TEST_CASE("demands table: semicolons, and the network's own CSV table read back unchanged", "[demands][csv]") {
  Network net = three();
  DemandTableRead t = read_demand_table(net, "origin;destination;amount\nber;cph;3,5\n");
  // "3,5" is a decimal comma, which a ';' table often holds: refused by name, not misread.
  CHECK_FALSE(t.ok());
  CHECK(t.delimiter == ';');
  CHECK(has(t.diagnostics, "2", "column 3 (amount)", "'3,5' is not an amount"));
  CHECK(t.demands.empty());

  Network other = three();
  other.demands[0].amount = 4.25, other.demands[0].weight = 3, other.demands[0].label = "a, \"quoted\" one";
  Demand k;
  k.id = "=sum", k.origin = 2, k.destination = 0;  // a formula-looking id, marked when written
  other.demands.push_back(k);
  const std::string table = write_network_csv(other).demands;
  REQUIRE(looks_like_demand_table(table));
  Network empty = three();
  t = read_demand_table(empty, table, /*replace=*/true);
  REQUIRE(t.ok());
  CHECK(t.generated_ids == 0);
  add_demand_table(empty, std::move(t), true);
  REQUIRE(empty.demands.size() == 2);
  for (int i = 0; i < 2; ++i) {
    CHECK(empty.demands[i].id == other.demands[i].id);
    CHECK(empty.demands[i].label == other.demands[i].label);
    CHECK(empty.demands[i].origin == other.demands[i].origin);
    CHECK(empty.demands[i].destination == other.demands[i].destination);
    CHECK(empty.demands[i].amount == other.demands[i].amount);
    CHECK(empty.demands[i].weight == other.demands[i].weight);
  }
}

TEST_CASE("demands table: errors name the row and the column, and nothing is added", "[demands][csv]") {
  Network net = three();
  net.nodes[2].label = "Berlin";  // a label two nodes share names neither
  const DemandTableRead t = read_demand_table(net,
                                              "id,origin,destination,amount,weight,notes\n"
                                              "ams-ber,ams,cph,1,1,x\n"
                                              "d2,oslo,ams,1,1,\n"
                                              "d3,ams,ams,,,\n"
                                              "d4,Berlin,ams,,,\n"
                                              "d5,ams,cph,-2,0,\n"
                                              "d5,,cph,,,\n");
  CHECK_FALSE(t.ok());
  CHECK(t.demands.empty());
  CHECK(has(t.diagnostics, "1", "column 6 (notes)", "not a demands column"));
  CHECK(has(t.diagnostics, "2", "column 1 (id)", "the network has a demand with this id"));
  CHECK(has(t.diagnostics, "3", "column 2 (origin)", "no node has this id or label ('oslo')"));
  CHECK(has(t.diagnostics, "4", "column 3 (destination)", "the same node as the origin"));
  CHECK(has(t.diagnostics, "5", "column 2 (origin)", "several nodes have this label"));
  CHECK(has(t.diagnostics, "6", "column 4 (amount)", "'-2' is not an amount"));
  CHECK(has(t.diagnostics, "6", "column 5 (weight)", "'0' is not a weight"));
  CHECK(has(t.diagnostics, "7", "column 2 (origin)", "no origin given"));
  CHECK(has(t.diagnostics, "7", "column 1 (id)", "an earlier row has this id"));
  // With replace, the network's ids are free again.
  CHECK(read_demand_table(three(), "id,origin,destination\nams-ber,ber,ams\n", true).ok());
  CHECK_FALSE(read_demand_table(three(), "id,origin,destination\nams-ber,ber,ams\n", false).ok());

  // Fuzzing finding: an id that is not UTF-8 text passed, and the network then failed validation.
  CHECK(has(read_demand_table(three(), "id,origin,destination\nk\xb0,ber,ams\n").diagnostics, "2", "column 1 (id)",
            "not UTF-8 text"));

  const DemandTableRead no_header = read_demand_table(net, "ams,cph,1\n");
  CHECK(has(no_header.diagnostics, "1", "", "must name the columns"));
  CHECK_FALSE(looks_like_demand_table(",ams,ber\nams,,1\n"));  // a matrix

  std::string many = "from,to\n";
  for (int i = 0; i < 30; ++i) many += "nowhere,ams\n";
  const DemandTableRead lots = read_demand_table(net, many);
  CHECK(lots.diagnostics.error_count() == 21);  // 20 listed, then a count
  CHECK(has(lots.diagnostics, "", "", "and 10 more rows with errors"));

  std::string over = "from,to\n";
  for (int i = 0; i < SizeLimits::kMaxDemands; ++i) over += "ams,ber\n";
  const DemandTableRead too_many = read_demand_table(three(), over);
  CHECK(has(too_many.diagnostics, "", "", "would make more than the limit"));
  CHECK(read_demand_table(three(), over, true).ok());
}
