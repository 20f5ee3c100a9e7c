// Automatic drawing positions for networks imported without them (DIMACS, most GraphML and
// CSV files): force-directed placement after T. Fruchterman, E. Reingold, "Graph drawing by
// force-directed placement", Software: Practice and Experience 21(11), 1991 -- arcs pull
// their end nodes together, all nodes push each other apart, and the step size cools.
// Repulsion is counted only within two ideal distances, found through a uniform grid (the
// grid variant of the same paper), so a step costs about O(n + m) instead of O(n^2).
// Deterministic: the start is a circle in node order, so the same file gives the same picture.
#pragma once

#include "apportion/model/network.h"

namespace apportion {

struct LayoutOptions {
  int iterations = 200;  // at most; see layout_iterations()
  bool keep_placed = true;  // nodes that have a position keep it and only push and pull the others
};

// Writes x and y of the nodes it places (all nodes, or those without a position). Positions
// are in a square of side about 100 * sqrt(n).
void auto_layout(Network& net, const LayoutOptions& options = {});

// The iterations auto_layout runs: options.iterations, fewer (at least 5) past 200,000 nodes
// and arcs together, so that the work stays bounded and opening a huge file does not freeze
// the page.
int layout_iterations(int nodes, int arcs, const LayoutOptions& options);

}  // namespace apportion
