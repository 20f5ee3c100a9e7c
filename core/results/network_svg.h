// The network picture, shared by the browser canvas and the SVG export (W3C SVG 1.1), so
// that the exported picture is the one on screen: fitted layout, both arcs of a pair side
// by side, width by capacity, colour by utilisation on a colour-blind-safe scale (after the
// cividis map: lightness rises with utilisation), a legend, and the planning caution.
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

// 0 (muted blue) .. 1 (bright yellow).
Rgb utilisation_colour(double utilisation);

// Maps node positions into a box of width x height with a margin (and room for labels on
// the right). Nodes without a position are placed on a circle.
struct Layout {
  double min_x = 0, min_y = 0, scale = 1, margin = 0;
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

// A standalone SVG picture of the network with its loads (result may be null).
std::string network_svg(const Network& net, const MultiflowResult* result, double width = 1200, double height = 800);

}  // namespace apportion
