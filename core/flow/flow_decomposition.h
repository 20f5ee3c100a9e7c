// Flow decomposition: a flow written as a sum of path flows and cycle flows.
//
// Model: any flow x >= 0 (lanes of shared two-way arcs by the sign of x) with conservation
// outside its terminals is a non-negative combination of at most m paths, each from a node
// with net outflow to a node with net inflow, and cycles (Ford and Fulkerson, "Flows in
// Networks", 1962; Ahuja, Magnanti, Orlin 1993, section 3.5). Walking forward along positive
// flow from a node with net outflow either meets a node with net inflow (a path) or repeats
// a node (a cycle); removing the bottleneck amount zeroes at least one arc, hence at most m
// pieces and O(n m) time.
#pragma once

#include <vector>

#include "apportion/flow/flow_graph.h"
#include "apportion/model/tolerance.h"

namespace apportion {

struct FlowPiece {
  std::vector<int> nodes;  // visited nodes; for a cycle the first node is not repeated
  std::vector<int> arcs;   // arcs, in walking order
  double amount = 0.0;
};

struct FlowDecomposition {
  std::vector<FlowPiece> paths;
  std::vector<FlowPiece> cycles;
};

FlowDecomposition decompose_flow(const FlowGraph& g, const std::vector<double>& flow, const Tolerance& tol);

}  // namespace apportion
