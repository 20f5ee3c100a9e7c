// Regression tests for the first fuzzing findings (shell/fuzz.sh). Text that is not UTF-8 is
// refused by name, in every importer: a CSV label, a DIMACS node name and a GraphML label
// with bytes that are not UTF-8 reached the JSON writer, which cannot write them. The UTF-8
// rules are RFC 3629 (F. Yergeau, 2003), section 3. And a DIMACS number too large for an
// integer is refused before any conversion.
#include <catch2/catch.hpp>
#include <string>

#include "apportion/formats/network_csv.h"
#include "apportion/formats/network_dimacs.h"
#include "apportion/formats/network_graphml.h"
#include "apportion/formats/network_json.h"
#include "apportion/model/validation.h"

using namespace apportion;

namespace {
bool says_not_utf8(const LoadResult& r) {
  for (const Diagnostic& d : r.diagnostics.items)
    if (d.message.find("not UTF-8") != std::string::npos && valid_utf8(d.to_string())) return true;
  return false;
}
}  // namespace

TEST_CASE("UTF-8 well-formedness follows RFC 3629", "[encoding]") {
  CHECK(valid_utf8(""));
  CHECK(valid_utf8("Harrowmere"));
  CHECK(valid_utf8("K\xC3\xB8" "benhavn"));         // two bytes
  CHECK(valid_utf8("\xE2\x82\xAC"));                 // euro sign, three bytes
  CHECK(valid_utf8("\xF0\x9F\x9A\x92"));             // four bytes
  CHECK_FALSE(valid_utf8("caf\xE9"));                // Latin-1 e-acute
  CHECK_FALSE(valid_utf8("\xC0\xAF"));               // overlong '/'
  CHECK_FALSE(valid_utf8("\xED\xA0\x80"));           // a UTF-16 surrogate
  CHECK_FALSE(valid_utf8("\xF4\x90\x80\x80"));       // above U+10FFFF
  CHECK_FALSE(valid_utf8("\xE2\x82"));               // cut short
  CHECK_FALSE(valid_utf8("\xFF"));
}

TEST_CASE("a CSV label in another encoding is refused by name", "[encoding]") {
  NetworkCsv t;
  t.nodes = "id,label\r\na,Alder\r\nb,Caf\xE9 Corner\r\n";
  t.arcs = "id,from,to,capacity\r\nab,a,b,5\r\n";
  const LoadResult r = read_network_csv(t);
  CHECK_FALSE(r.ok());
  CHECK(says_not_utf8(r));
}

TEST_CASE("a DIMACS node name in another encoding is refused by name", "[encoding]") {
  const LoadResult r = read_dimacs("p max 2 1\nc node 1 S\xE9o\nn 1 s\nn 2 t\na 1 2 5\n");
  CHECK_FALSE(r.ok());
  CHECK(says_not_utf8(r));
}

TEST_CASE("a GraphML label with bytes that are not UTF-8 is refused by name", "[encoding]") {
  const std::string text =
      "<?xml version=\"1.0\" encoding=\"UTF-8\"?><graphml xmlns=\"http://graphml.graphdrawing.org/xmlns\">"
      "<key id=\"l\" for=\"node\" attr.name=\"label\" attr.type=\"string\"/><graph edgedefault=\"directed\">"
      "<node id=\"a\"><data key=\"l\">Alde\x8E\x83 Cross</data></node><node id=\"b\"/>"
      "<edge source=\"a\" target=\"b\"/></graph></graphml>";
  const LoadResult r = read_graphml(text);
  CHECK_FALSE(r.ok());
  CHECK(says_not_utf8(r));
}

TEST_CASE("writing JSON never fails on text it cannot write", "[encoding]") {
  Network net;
  net.name = "bad \xFF name";
  const std::string json = write_network_json(net);
  CHECK(valid_utf8(json));
  CHECK(json.find("\xEF\xBF\xBD") != std::string::npos);  // U+FFFD REPLACEMENT CHARACTER
}

TEST_CASE("a DIMACS node number too large for any integer is refused, not converted", "[encoding]") {
  // Fuzzing finding: a 76-digit node number was converted to an integer before the range
  // check (undefined behaviour).
  const LoadResult r = read_dimacs("p max 2 1\nn 1 s\nn 2 t\na 0000000000000000000000000800000000000000000000000005 2 5\n");
  CHECK_FALSE(r.ok());
  CHECK(r.diagnostics.has_errors());
}

TEST_CASE("a GraphML graph id longer than the string limit is refused, as in JSON", "[encoding][limits]") {
  // Fuzzing finding: a 1,124-character graph id became the network's name; the JSON reader
  // refuses names over 1,024 characters, so the JSON written from it (the app's autosave)
  // could not be read back.
  const std::string text = "<?xml version=\"1.0\"?><graphml><graph id=\"" + std::string(1100, 'g') +
                           "\" edgedefault=\"directed\"><node id=\"a\"/><node id=\"b\"/>"
                           "<edge source=\"a\" target=\"b\"/></graph></graphml>";
  const LoadResult r = read_graphml(text);
  CHECK_FALSE(r.ok());
  bool named = false;
  for (const auto& item : r.diagnostics.items)
    named = named || (item.field == "name" && item.message.find("longer than 1024") != std::string::npos);
  CHECK(named);
  // A name of exactly the limit is kept, and survives the round trip.
  const std::string fits = "<?xml version=\"1.0\"?><graphml><graph id=\"" + std::string(1024, 'g') +
                           "\" edgedefault=\"directed\"><node id=\"a\"/><node id=\"b\"/>"
                           "<edge source=\"a\" target=\"b\"/></graph></graphml>";
  const LoadResult ok = read_graphml(fits);
  REQUIRE(ok.ok());
  CHECK(read_network_json(write_network_json(*ok.network)).ok());
}
