// The network picture, shared by the browser canvas and the SVG export (W3C SVG 1.1), so
// that the exported picture is the one on screen: fitted layout, both arcs of a pair side
// by side, width by capacity, an arrowhead on one-way arcs, arcs out of service dashed and
// crossed, colour by utilisation on a colour-blind-safe sequential scale, a legend, and the
// planning caution. Two themes: dark (the canvas's default) and light (for print and for a
// meeting's projector); on the dark one lightness rises with utilisation (after the cividis
// map), on the light one it falls, so that a full arc is always the one that stands out.
// The export adds a title block (name, rule, totals, date) for a report.
// Text is XML-escaped: labels can never become markup.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

struct Rgb {
  float r, g, b;
};

enum class PictureTheme { kDark, kLight };

// Dark: 0 (muted blue) .. 1 (bright yellow). Light: 0 (light grey) .. 1 (deep blue).
Rgb utilisation_colour(double utilisation, PictureTheme theme = PictureTheme::kDark);

// Maps node positions into a box of width x height with a margin (and room for labels on
// the right), centred in it. Nodes without a position are placed on a circle.
struct Layout {
  double min_x = 0, min_y = 0, scale = 1, margin = 0;
  double offset_x = 0, offset_y = 0;  // centring, added to the margin
  std::pair<double, double> position(const Node& v) const;
};
Layout fit_layout(const Network& net, double width, double height, double margin, double label_room);

// Per arc: 1 when a reverse twin exists (an arc from its `to` to its `from`), so that both
// directions of a pair are drawn side by side. Shared two-way arcs have no twin. O(m).
std::vector<char> arcs_with_twin(const Network& net);

// Where an arc is drawn between its end points: shifted to its own side by `offset` when it
// has a twin.
struct ArcGeometry {
  float x0, y0, x1, y1, length;
};
ArcGeometry arc_geometry(bool has_twin, float x0, float y0, float x1, float y1, float offset);

std::string xml_escape(const std::string& text);

// What the exported picture says above the network, and how it looks.
struct PictureOptions {
  double width = 1200, height = 800;  // of the network's part, in SVG user units (px)
  PictureTheme theme = PictureTheme::kLight;
  std::string rule;  // the rule the result follows, in words ("" leaves the line out)
  std::string date;  // when it was made, as the caller writes it ("" leaves it out)
};

// A standalone SVG picture of the network with its loads (result may be null): a title
// block (name, rule, totals, date), the network, a legend and the planning caution.
std::string network_svg(const Network& net, const MultiflowResult* result, const PictureOptions& options = {});

}  // namespace apportion
