// The browser's file payload (share links, picked files, autosaves) read by the page's own
// reader, web/browser/file_payload.cpp: what arrives with the wrong shape gives a message,
// never an abort (the page is built without exceptions, so a failed JSON look-up would end it).
#include <catch2/catch.hpp>
#include <string>

#include "browser/file_payload.h"

using namespace apportion;

namespace {
const std::string kNetwork =
    R"({\"format\": \"apportion-network\", \"version\": 1, \"nodes\": [{\"id\": \"a\"}, {\"id\": \"b\"}],)"
    R"( \"arcs\": [{\"id\": \"ab\", \"from\": \"a\", \"to\": \"b\", \"capacity\": 5}], \"demands\": []})";
// A payload as the page sends it: one file with this source, name and text.
std::string payload(const std::string& source_json, const std::string& name, const std::string& text) {
  return "{\"source\": " + source_json + ", \"files\": [{\"name\": \"" + name + "\", \"text\": \"" + text + "\"}]}";
}
}  // namespace

TEST_CASE("a payload's source of the wrong type is read as a picked file", "[payload]") {
  // Fuzzing finding: {"source": 2.06666, ...} aborted the reader.
  const std::string crash =
      "{\"source\":2.06666, \"files\": [{\"name\": \"n..xml\", \"text\": \"{\\n  \\\"\\\": <acitan    }+\\n      n\"}]}\n";
  const web::Payload bad = web::read_payload(crash);
  CHECK(bad.source == "file");
  CHECK_FALSE(bad.loaded.ok());
  CHECK(bad.loaded.diagnostics.has_errors());

  const web::Payload good = web::read_payload(payload("7", "n.json", kNetwork));
  CHECK(good.source == "file");
  REQUIRE(good.loaded.ok());
  CHECK(good.loaded.network->arc_count() == 1);
}

TEST_CASE("a share link payload keeps its source", "[payload]") {
  const web::Payload p = web::read_payload(payload("\"link\"", "shared.json", kNetwork));
  CHECK(p.source == "link");
  REQUIRE(p.loaded.ok());
  CHECK(p.loaded.network->node_count() == 2);
}

TEST_CASE("payloads of the wrong shape give a message", "[payload]") {
  for (const char* text : {"", "[]", "{\"files\": 3}", "{\"files\": [{\"name\": 1, \"text\": \"x\"}]}",
                           "{\"files\": []}", "{\"files\": [1]}", "{\"source\": [], \"error\": 5, \"files\": []}"}) {
    INFO(text);
    const web::Payload p = web::read_payload(text);
    CHECK_FALSE(p.loaded.ok());
    CHECK(p.loaded.diagnostics.has_errors());
  }
}
