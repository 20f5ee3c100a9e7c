// The network picture: labels are escaped (W3C XML 1.0 section 2.4: '<' and '&' must be
// escaped in character data) and the picture carries a legend and the caution.
#include <catch2/catch.hpp>

#include "apportion/formats/network_json.h"
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
  CHECK(svg.find("arc utilisation") != std::string::npos);
}

TEST_CASE("SVG: the utilisation scale rises in lightness", "[svg]") {
  // Colour-blind safety (common practice, no source): a sequential scale whose lightness
  // rises monotonically stays readable without hue.
  double last = -1;
  for (int i = 0; i <= 10; ++i) {
    const Rgb c = utilisation_colour(i / 10.0);
    const double luma = 0.2126 * c.r + 0.7152 * c.g + 0.0722 * c.b;  // ITU-R BT.709 weights
    CHECK(luma > last);
    last = luma;
  }
}
