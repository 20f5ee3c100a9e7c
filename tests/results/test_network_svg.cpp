// The network picture: labels are escaped (W3C XML 1.0 section 2.4: '<' and '&' must be
// escaped in character data), the file is well-formed XML (read back with pugixml), and the
// picture carries a title block, arrows, the out-of-service marks, a legend and the caution.
#include <catch2/catch.hpp>
#include <pugixml.hpp>

#include "apportion/formats/network_json.h"
#include "apportion/results/flow_result_export.h"
#include "apportion/results/network_svg.h"

using namespace apportion;

TEST_CASE("SVG: hostile labels stay text", "[svg]") {
  CHECK(xml_escape("<script>alert('x')</script> & \"q\"") ==
        "&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; &quot;q&quot;");
  CHECK(xml_escape(std::string("a\x01") + "b") == "a b");
  LoadResult r = read_network_json(R"({"format":"apportion-network","version":1,"name":"<b>net</b>",
    "nodes":[{"id":"a","label":"<svg onload=alert(1)>","x":0,"y":0},{"id":"b","x":10,"y":5}],
    "arcs":[{"id":"e&1","from":"a","to":"b","capacity":2}],"demands":[]})");
  REQUIRE(r.ok());
  const std::string svg = network_svg(*r.network, nullptr);
  CHECK(svg.rfind("<svg", 0) == 0);
  CHECK(svg.find("<svg onload") == std::string::npos);
  CHECK(svg.find("&lt;svg onload=alert(1)&gt;") != std::string::npos);
  CHECK(svg.find("e&amp;1") != std::string::npos);
  CHECK(svg.find("planning aid") != std::string::npos);
  CHECK(svg.find("width: capacity") != std::string::npos);
}

TEST_CASE("SVG: the utilisation scale is monotone in lightness, towards the contrast", "[svg]") {
  // Colour-blind safety (common practice, no source): a sequential scale whose lightness
  // changes monotonically stays readable without hue. On the dark theme it rises, on the
  // light one it falls, so that a full arc stands out from the background on both.
  auto luma = [](const Rgb& c) { return 0.2126 * c.r + 0.7152 * c.g + 0.0722 * c.b; };  // ITU-R BT.709 weights
  double dark = -1, light = 2;
  for (int i = 0; i <= 10; ++i) {
    const double d = luma(utilisation_colour(i / 10.0, PictureTheme::kDark));
    const double l = luma(utilisation_colour(i / 10.0, PictureTheme::kLight));
    CHECK(d > dark);
    CHECK(l < light);
    dark = d, light = l;
  }
  // An empty arc is still visible on white: its luma is below 0.8 (white is 1).
  CHECK(luma(utilisation_colour(0, PictureTheme::kLight)) < 0.8);
}

TEST_CASE("SVG: a picture for a report", "[svg]") {
  // Two one-way arcs and a shared two-way one; one-way b->c out of service.
  LoadResult r = read_network_json(R"({"format":"apportion-network","version":1,"name":"Ring & spur",
    "units":{"capacity":"Gbit/s"},
    "nodes":[{"id":"a","x":0,"y":0},{"id":"b","x":100,"y":0},{"id":"c","x":50,"y":80}],
    "arcs":[{"id":"ab","from":"a","to":"b","capacity":10},{"id":"bc","from":"b","to":"c","capacity":5,"enabled":false},
            {"id":"ca","from":"c","to":"a","capacity":5,"shared_two_way":true}],
    "demands":[{"id":"d1","origin":"a","destination":"b","amount":4}]})");
  REQUIRE(r.ok());
  MultiflowResult res;
  res.status = SolveStatus::kOptimal;
  res.throughput = 4;
  res.min_normalised_share = 1;
  res.jain_index = 1;
  res.check.ok = true;
  res.arcs.resize(3);
  res.arcs[0].load = 4, res.arcs[0].utilisation = 0.4;
  PictureOptions o;
  o.rule = "Max-min fair shares (weighted)";
  o.date = "2026-12-05 10:00";
  const std::string svg = network_svg(*r.network, &res, o);
  pugi::xml_document doc;
  REQUIRE(doc.load_string(svg.c_str()));  // well-formed
  const pugi::xml_node root = doc.child("svg");
  REQUIRE(root);
  CHECK(std::string(root.child("rect").attribute("fill").value()) == "#ffffff");  // light by default
  CHECK(svg.find(">Ring &amp; spur</text>") != std::string::npos);
  CHECK(svg.find("Rule: Max-min fair shares (weighted)") != std::string::npos);
  CHECK(svg.find("throughput 4 Gbit/s") != std::string::npos);
  CHECK(svg.find("independent check passed") != std::string::npos);
  CHECK(svg.find("made 2026-12-05 10:00") != std::string::npos);
  CHECK(svg.find("width: capacity (Gbit/s)") != std::string::npos);
  CHECK(svg.find("dashed and crossed: out of service") != std::string::npos);
  // Arrowheads: only the enabled one-way arc ab; bc is out of service, ca is two-way.
  int arrows = 0, dashed_lines = 0;
  for (const pugi::xml_node g : root.child("g").children("g")) {
    arrows += g.child("polygon") ? 1 : 0;
    dashed_lines += g.child("line").attribute("stroke-dasharray") ? 1 : 0;
  }
  CHECK(arrows == 1);
  CHECK(dashed_lines == 1);
  // The caution is there, wrapped, in full.
  std::string caution;
  for (const pugi::xml_node t : root.children("text"))
    if (std::string(t.attribute("font-size").value()) == "11") {
      if (!caution.empty()) caution += ' ';
      caution += t.text().get();
    }
  CHECK(caution == kPlanningCaution);

  o.theme = PictureTheme::kDark;
  const std::string dark = network_svg(*r.network, nullptr, o);
  REQUIRE(doc.load_string(dark.c_str()));
  CHECK(std::string(doc.child("svg").child("rect").attribute("fill").value()) == "#1d2026");
  CHECK(dark.find("No result: the network alone.") != std::string::npos);
  CHECK(dark.find("arc utilisation") == std::string::npos);  // no loads, no scale
}
