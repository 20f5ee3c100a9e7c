// Maximum flow with a minimum-cut certificate.
//
// Model: given sources S and sinks T (disjoint), find x with
//     0 <= x(a) <= u(a)          (|x(a)| <= u(a) on shared two-way arcs)
//     net outflow(v) = 0         for every v not in S or T
// maximising the net outflow of S. The certificate is a cut: a node set C containing S and
// no sink; the capacity of the arcs leaving C equals the flow value, which proves optimality
// (max-flow min-cut theorem, Ford and Fulkerson 1956).
//
// Method: push-relabel (Goldberg and Tarjan, J. ACM 35(4), 1988) with highest-label
// selection, periodic global relabelling by reverse breadth-first search and the gap
// heuristic (Cherkassky and Goldberg, Algorithmica 19, 1997). Phase one finds a maximum
// preflow; phase two returns the remaining excess to the sources by the same routine aimed
// at the super source. O(n^2 sqrt(m)) time; real capacities are handled through Tolerance.
// Several sources or sinks are joined through a super source and a super sink.
#pragma once

#include <vector>

#include "apportion/flow/flow_checker.h"
#include "apportion/flow/flow_graph.h"
#include "apportion/model/status.h"
#include "apportion/model/tolerance.h"

namespace apportion {

struct MaxFlowResult {
  SolveStatus status = SolveStatus::kNotSolved;
  std::string message;             // why the input was refused, when it was
  double value = 0.0;              // net outflow of the sources
  std::vector<double> flow;        // per arc of the graph (signed on shared two-way arcs)
  std::vector<char> source_side;   // the cut C: 1 for nodes on the source side
  std::vector<int> cut_arcs;       // arcs crossing from C to the rest (either way for two-way)
  double cut_capacity = 0.0;       // sum of their capacities: equals `value` at optimum
  FlowCheck check;                 // the independent checker's verdict on `flow`
};

// Solves the maximum flow from `sources` to `sinks`. Refuses (kBadInput) a node that is
// both a source and a sink, an index out of range, or a capacity that is negative or not
// finite. `tol` defaults to Tolerance::for_scale(largest capacity).
MaxFlowResult max_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks);
MaxFlowResult max_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks,
                       const Tolerance& tol);

}  // namespace apportion
