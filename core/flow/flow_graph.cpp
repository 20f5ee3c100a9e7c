// FlowGraph construction from a network document.
#include "apportion/flow/flow_graph.h"

#include <algorithm>
#include <cmath>

namespace apportion {

FlowGraph FlowGraph::from_network(const Network& net) {
  FlowGraph g(net.node_count());
  for (const Arc& a : net.arcs)
    g.add_arc(a.from, a.to, a.enabled ? a.capacity : 0.0, a.cost.value_or(0.0), a.shared_two_way);
  return g;
}

int FlowGraph::add_arc(int tail, int head, double capacity, double cost, bool two_way) {
  tail_.push_back(tail);
  head_.push_back(head);
  capacity_.push_back(capacity);
  cost_.push_back(cost);
  two_way_.push_back(two_way ? 1 : 0);
  return arc_count() - 1;
}

double FlowGraph::max_capacity() const {
  double m = 0.0;
  for (double c : capacity_) m = std::max(m, c);
  return m;
}

double FlowGraph::max_abs_cost() const {
  double m = 0.0;
  for (double c : cost_) m = std::max(m, std::abs(c));
  return m;
}

std::vector<Lane> FlowGraph::lanes() const {
  std::vector<Lane> out;
  out.reserve(tail_.size());
  for (int a = 0; a < arc_count(); ++a) {
    out.push_back({tail_[a], head_[a], a, false});
    if (two_way_[a]) out.push_back({head_[a], tail_[a], a, true});
  }
  return out;
}

}  // namespace apportion
