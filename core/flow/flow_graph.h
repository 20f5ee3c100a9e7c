// FlowGraph: the solver-side view of a network document.
//
// Arc i of a FlowGraph is arc i of the document: solvers report one flow per document arc,
// so results map back without a translation table. A disabled arc keeps its place with
// capacity 0. The flow on a directed arc lies in [0, capacity]; on a shared two-way arc it
// is signed (positive from `tail` to `head`) and lies in [-capacity, capacity]: with the two
// directions cancelled against each other, |flow| is what both directions use together.
//
// Lanes are the directed ways a unit of flow can travel: one per directed arc, two per
// shared two-way arc. A lane knows its arc, so a capacity constraint is "the lanes of arc i
// together carry at most capacity(i)" -- the form a multicommodity model needs.
#pragma once

#include <vector>

#include "apportion/model/network.h"

namespace apportion {

struct Lane {
  int tail = -1;
  int head = -1;
  int arc = -1;      // the FlowGraph / document arc this lane belongs to
  bool reverse = false;  // true for the head-to-tail lane of a shared two-way arc
};

class FlowGraph {
 public:
  FlowGraph() = default;
  explicit FlowGraph(int node_count) : node_count_(node_count) {}

  // Builds from a document: disabled arcs get capacity 0; a missing cost counts as 0.
  static FlowGraph from_network(const Network& net);

  // Adds an arc and returns its index.
  int add_arc(int tail, int head, double capacity, double cost = 0.0, bool two_way = false);

  int node_count() const { return node_count_; }
  int arc_count() const { return static_cast<int>(tail_.size()); }
  int tail(int a) const { return tail_[a]; }
  int head(int a) const { return head_[a]; }
  double capacity(int a) const { return capacity_[a]; }
  double cost(int a) const { return cost_[a]; }
  bool two_way(int a) const { return two_way_[a] != 0; }
  // Largest capacity; scales tolerances.
  double max_capacity() const;
  double max_abs_cost() const;

  // Every directed lane, in arc order (a two-way arc's reverse lane follows its forward one).
  std::vector<Lane> lanes() const;

 private:
  int node_count_ = 0;
  std::vector<int> tail_, head_;
  std::vector<double> capacity_, cost_;
  std::vector<char> two_way_;
};

}  // namespace apportion
