// GraphML topology import (GraphML Primer, graphdrawing.org, 2002; an XML format).
//
// Nodes come from <node id>, arcs from <edge source target>. Attributes are declared by
// <key id attr.name for>; Apportion maps them by attr.name:
//   capacity  (name chosen by the caller, default "capacity"): arc capacity;
//   cost, transit (optional) on edges; label or name, x and y on nodes; Longitude/Latitude
//   (common in published topology files) when x/y are absent, drawn on the equidistant
//   cylindrical projection at the mean latitude, with nodes that lack them placed beside
//   their neighbours (place_geographically in the .cpp).
// An edge without the capacity attribute gets `default_capacity` and one warning says how
// many did. Attribute values are multiplied by `capacity_scale` (a link speed in bit/s read
// into Gbit/s: 1e-9; see link_speed_factor), and `capacity_unit`, when given, becomes the
// network's capacity unit; the default capacity is taken in that unit as it is. Undirected edges (edgedefault="undirected" or directed="false") become shared
// two-way arcs, or two independent arcs when `undirected_as_pairs` is set. Demands: none.
#pragma once

#include <string>
#include <vector>

#include "apportion/formats/load_result.h"

namespace apportion {

struct GraphmlOptions {
  std::string capacity_attribute = "capacity";
  double default_capacity = 1.0;
  bool undirected_as_pairs = false;
  double capacity_scale = 1.0;
  std::string capacity_unit;  // empty: none set
  // The great-circle length of each link between nodes with Longitude and Latitude, in km
  // (haversine, mean Earth radius 6371.0088 km), as each arc's cost (unit "km") or as its
  // transit time at `speed` km per time unit; links with an end without coordinates keep
  // none, and a warning counts them.
  enum class Length { kNone, kCost, kTransit } length_as = Length::kNone;
  double speed = 1.0;
};

// The great-circle distance in km between two points given in degrees (haversine formula;
// R. W. Sinnott, Sky and Telescope 68(2), 1984; mean Earth radius 6371.0088 km, IUGG -- from
// memory).
double great_circle_km(double lon1, double lat1, double lon2, double lat2);

LoadResult read_graphml(const std::string& text, const GraphmlOptions& options = {});

// The edge attributes a GraphML file declares (attr.name of each <key for="edge|all">), in
// file order, and how many edges give each a value: for choosing the capacity attribute.
struct GraphmlAttribute {
  std::string name;
  int edges_with_value = 0;
};
std::vector<GraphmlAttribute> graphml_edge_attributes(const std::string& text);

// Bits per second in one unit of a link speed: "bit/s" 1, "kbit/s" 1e3, "Mbit/s" 1e6,
// "Gbit/s" 1e9, "Tbit/s" 1e12 (SI prefixes, as link speeds are quoted); 0 for any other.
double link_speed_factor(const std::string& unit);

}  // namespace apportion
