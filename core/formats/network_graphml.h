// GraphML topology import (GraphML Primer, graphdrawing.org, 2002; an XML format).
//
// Nodes come from <node id>, arcs from <edge source target>. Attributes are declared by
// <key id attr.name for>; Apportion maps them by attr.name:
//   capacity  (name chosen by the caller, default "capacity"): arc capacity;
//   cost, transit (optional) on edges; label or name, x and y on nodes; Longitude/Latitude
//   are taken as x and -y when x/y are absent (common in published topology files).
// An edge without the capacity attribute gets `default_capacity` and one warning says how
// many did. Undirected edges (edgedefault="undirected" or directed="false") become shared
// two-way arcs, or two independent arcs when `undirected_as_pairs` is set. Demands: none.
#pragma once

#include <string>

#include "apportion/formats/load_result.h"

namespace apportion {

struct GraphmlOptions {
  std::string capacity_attribute = "capacity";
  double default_capacity = 1.0;
  bool undirected_as_pairs = false;
};

LoadResult read_graphml(const std::string& text, const GraphmlOptions& options = {});

}  // namespace apportion
