// Edits of a network document that keep it consistent: new items get ids no other item of
// their kind has, and removing nodes removes the arcs and demands that use them, with every
// remaining index renumbered. The browser app's canvas and tables edit through these, so
// that an edit can never leave an arc pointing at a node that is gone.
#pragma once

#include <string>
#include <vector>

#include "apportion/model/network.h"

namespace apportion {

// "prefix1", "prefix2", ...: the first such id that no item of the kind holds.
std::string fresh_node_id(const Network& net, const std::string& prefix = "n");
std::string fresh_arc_id(const Network& net, const std::string& prefix = "a");
std::string fresh_demand_id(const Network& net, const std::string& prefix = "d");

int add_node(Network& net, double x, double y);
// Capacity defaults to the median capacity of the existing arcs (1 when there are none), so
// that a new arc neither dominates the picture nor starves the flows.
int add_arc(Network& net, int from, int to);
int add_demand(Network& net, int origin, int destination);

struct Selection {
  std::vector<int> nodes, arcs, demands;
  bool empty() const { return nodes.empty() && arcs.empty() && demands.empty(); }
};

// Removes the selected items, the arcs and demands of removed nodes included. Returns how
// many items were removed in all.
int remove_items(Network& net, const Selection& selection);

}  // namespace apportion
