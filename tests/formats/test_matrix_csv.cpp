// Traffic matrices as CSV (RFC 4180): nodes by id or label, "max", empty and zero cells,
// errors that name the line and column, and the round trip. Expected values are read off
// the small tables below (common practice, no source).
#include <catch2/catch.hpp>

#include "apportion/formats/matrix_csv.h"
#include "apportion/model/network_edit.h"

using namespace apportion;

namespace {

Network three() {
  Network net;
  for (int v = 0; v < 3; ++v) add_node(net, v, 0);
  net.nodes[0].id = "ams", net.nodes[0].label = "Amsterdam";
  net.nodes[1].id = "ber", net.nodes[1].label = "Berlin";
  net.nodes[2].id = "cph", net.nodes[2].label = "Copenhagen";
  return net;
}

bool has(const Diagnostics& d, const std::string& field, const std::string& text) {
  for (const Diagnostic& x : d.items)
    if (x.field == field && x.message.find(text) != std::string::npos) return true;
  return false;
}

}  // namespace

TEST_CASE("matrix CSV: cells become demands, by id or label", "[matrix][csv]") {
  const Network net = three();
  const MatrixCsvRead m = read_matrix_csv(net,
                                          "from \\ to,ams,Berlin,cph\r\n"
                                          "ams,,12.5,max\r\n"
                                          "Berlin,3,0,\r\n"
                                          "cph,0,\" 7 \",\r\n");
  REQUIRE(m.ok());
  REQUIRE(m.pairs.size() == 4);
  CHECK((m.pairs[0].origin == 0 && m.pairs[0].destination == 1 && *m.pairs[0].amount == 12.5));
  CHECK((m.pairs[1].origin == 0 && m.pairs[1].destination == 2 && !m.pairs[1].amount));
  CHECK((m.pairs[2].origin == 1 && m.pairs[2].destination == 0 && *m.pairs[2].amount == 3.0));
  CHECK((m.pairs[3].origin == 2 && m.pairs[3].destination == 1 && *m.pairs[3].amount == 7.0));
  CHECK(has(m.diagnostics, "", "1 cells of 0 made no demand"));  // (cph, ams); (ber, ber) is the diagonal
}

TEST_CASE("matrix CSV: errors name the line and the column", "[matrix][csv]") {
  Network net = three();
  MatrixCsvRead m = read_matrix_csv(net, ",ams,ber,oslo\nams,,7,1\nber,x,3,\nams,,4,\n");
  CHECK_FALSE(m.ok());
  CHECK(m.pairs.empty());
  CHECK(has(m.diagnostics, "column 4 (oslo)", "no node has this id or label (destination)"));
  CHECK(has(m.diagnostics, "column 2 (ams)", "'x' is not a number"));
  CHECK(has(m.diagnostics, "column 3 (ber)", "origin and destination are the same node"));
  CHECK(has(m.diagnostics, "column 3 (ber)", "this pair was given before, on line 2"));

  m = read_matrix_csv(net, ",ams,ber\nams,,-1\ncph,1,2,3\n");
  CHECK(has(m.diagnostics, "column 3 (ber)", "must be >= 0"));
  CHECK(has(m.diagnostics, "", "has 4 cells, the first row 3"));

  net.nodes[2].label = "Berlin";  // a label two nodes share names neither
  m = read_matrix_csv(net, ",Berlin\nams,1\n");
  CHECK(has(m.diagnostics, "column 2 (Berlin)", "several nodes have this label"));

  m = read_matrix_csv(net, "ams,ber\n");
  CHECK(has(m.diagnostics, "", "at least one row per origin"));
  m = read_matrix_csv(net, ",ams\n\"ber,1\n");
  CHECK_FALSE(m.ok());
}

TEST_CASE("matrix CSV: written and read back, several demands of a pair summed", "[matrix][csv]") {
  Network net = three();
  add_pair_demands(net, {{0, 1, 0.1}, {1, 2, std::nullopt}, {2, 0, 1e9 / 3}}, 1.0, false);
  MatrixCsvWrite w = write_matrix_csv(net);
  CHECK(w.diagnostics.items.empty());
  CHECK(w.text.rfind("origin \\ destination,ams,ber,cph\r\n", 0) == 0);
  MatrixCsvRead back = read_matrix_csv(net, w.text);
  REQUIRE(back.ok());
  REQUIRE(back.pairs.size() == 3);
  CHECK(*back.pairs[0].amount == 0.1);  // shortest text that reads back to the same double
  CHECK_FALSE(back.pairs[1].amount.has_value());
  CHECK(*back.pairs[2].amount == 1e9 / 3);

  add_pair_demands(net, {{0, 1, 0.2}}, 1.0, false);
  w = write_matrix_csv(net);
  CHECK(has(w.diagnostics, "", "1 pairs have several demands"));
  back = read_matrix_csv(net, w.text);
  REQUIRE(back.ok());
  CHECK(*back.pairs[0].amount == 0.1 + 0.2);
}
