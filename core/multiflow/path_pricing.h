// Shortest paths for column generation: one shortest-path tree per origin, on the lanes of
// a network with non-negative lengths per arc.
//
// Model: lanes l = (u, v, arc) with length len(arc) >= 0; the distance d(o, v) is the least
// total length of a lane path from o to v, optionally using at most H lanes.
// Methods: Dijkstra with a binary heap (O(m log n) per origin) without a hop limit;
// Bellman-Ford by rounds (O(H m) per origin, exact for "at most H lanes") with one.
// One tree serves every demand of the origin: pricing costs one search per origin, not per
// demand.
#pragma once

#include <vector>

#include "apportion/flow/flow_graph.h"

namespace apportion {

struct LanePath {
  std::vector<int> lanes;  // indices into the lane list, origin to destination
};

// The arcs a path may use: in service with positive capacity, and not loops.
std::vector<char> usable_arcs(const FlowGraph& g);

class PathPricer {
 public:
  // `usable[arc]` false removes an arc (disabled or zero capacity) from every path.
  PathPricer(const FlowGraph& g, const std::vector<char>& usable, int hop_limit = 0);

  const std::vector<Lane>& lanes() const { return lanes_; }
  int hop_limit() const { return hop_limit_; }

  // Distances from `origin` with `length` per arc (the same for both lanes of an arc).
  void search(int origin, const std::vector<double>& length);
  double distance(int node) const;  // +inf when unreachable (within the hop limit)
  LanePath path_to(int node) const; // valid when distance(node) is finite

  // Fewest-lanes path from origin to destination (lengths all 1), empty when none.
  bool shortest_hop_path(int origin, int destination, LanePath& out);

 private:
  int n_, arc_count_, hop_limit_;
  std::vector<Lane> lanes_;
  std::vector<int> first_out_, out_lanes_;  // lanes leaving each node
  std::vector<double> dist_;
  std::vector<int> pred_;                   // without hop limit: lane into node
  std::vector<std::vector<int>> pred_by_hops_;  // with hop limit: per round
  std::vector<std::vector<double>> dist_by_hops_;
};

}  // namespace apportion
