// The independent solution checker. It knows nothing of how a flow was found: it takes the
// graph, the flow per arc and what the solver claims, and measures
//   capacity:      0 <= x(a) <= u(a) on directed arcs, |x(a)| <= u(a) on shared two-way arcs;
//   conservation:  net outflow(v) = supply(v) at every node with a fixed balance
//                  (every node except the sources and sinks of a maximum flow);
//   claimed value: the flow value, or the cost, the solver reports.
// It reports the largest violation of each kind, and passes the flow when all of them are
// within the tolerance. Every result Apportion reports is checked this way.
#pragma once

#include <string>
#include <vector>

#include "apportion/flow/flow_graph.h"
#include "apportion/model/tolerance.h"

namespace apportion {

struct FlowCheck {
  bool ok = false;
  double max_capacity_violation = 0.0;
  double max_conservation_violation = 0.0;
  double value_error = 0.0;  // |claimed - measured| for the flow value or the cost
  std::string worst;         // a sentence about the largest violation, empty when ok
};

// A maximum (or any s-t) flow: conservation at all nodes but `sources` and `sinks`; the value
// is the net outflow of the sources, which must equal the net inflow of the sinks.
FlowCheck check_terminal_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks,
                              const std::vector<double>& flow, double claimed_value, const Tolerance& tol);

// A flow meeting node supplies exactly (net outflow = supply everywhere), with its cost.
FlowCheck check_supply_flow(const FlowGraph& g, const std::vector<double>& supply, const std::vector<double>& flow,
                            double claimed_cost, const Tolerance& tol);

}  // namespace apportion
