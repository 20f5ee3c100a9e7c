// The k shortest loopless paths between two nodes.
//
// Model: lanes with non-negative lengths; the k simple origin-destination lane paths of
// least total length (ties broken by lane order).
// Method: J. Y. Yen, "Finding the k shortest loopless paths in a network", Management
// Science 17(11), 1971: each new path deviates from an earlier one at a spur node, with the
// root's nodes and the earlier paths' next lanes removed; Dijkstra for each spur.
// O(k n (m + n log n)).
#pragma once

#include <vector>

#include "apportion/flow/flow_graph.h"
#include "apportion/multiflow/path_pricing.h"

namespace apportion {

// `lanes` as from PathPricer::lanes(); `length` per arc. Returns up to k paths.
std::vector<LanePath> k_shortest_paths(int node_count, const std::vector<Lane>& lanes,
                                       const std::vector<double>& length, int origin, int destination, int k);

}  // namespace apportion
