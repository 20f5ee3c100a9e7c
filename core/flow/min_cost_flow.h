// Minimum-cost flow with node potentials (the dual solution).
//
// Model: given supplies b(v) summing to zero, find x minimising sum_a c(a) x(a) subject to
//     0 <= x(a) <= u(a)                  (|x(a)| <= u(a) on shared two-way arcs, cost c(a)|x(a)|)
//     net outflow(v) = b(v)              for every node v.
// Duals: potentials pi with reduced costs rc(a) = c(a) + pi(tail) - pi(head) satisfying
//     rc(a) >= 0 where x(a) < u(a),  rc(a) <= 0 where x(a) > 0
// (complementary slackness); together with a feasible x they prove optimality.
//
// Method: primal network simplex with a strongly feasible spanning tree, an artificial root
// with big-M arcs for the start, and block-search pivoting (Ahuja, Magnanti, Orlin, "Network
// Flows", Prentice Hall 1993, ch. 11; pivot and leaving-arc rules as in LEMON's
// NetworkSimplex, Kiraly and Kovacs, 2012). A shared two-way arc becomes two opposite arcs
// with the same capacity and cost; with c >= 0 (validation enforces it) cancelling their
// flows keeps optimality and gives |x| <= u.
#pragma once

#include <string>
#include <vector>

#include "apportion/flow/flow_checker.h"
#include "apportion/flow/flow_graph.h"
#include "apportion/model/status.h"
#include "apportion/model/tolerance.h"

namespace apportion {

struct MinCostFlowResult {
  SolveStatus status = SolveStatus::kNotSolved;
  std::string message;             // why the input was refused or infeasible
  double cost = 0.0;
  std::vector<double> flow;        // per arc (signed on shared two-way arcs)
  std::vector<double> potential;   // per node, the duals described above
  long long pivots = 0;
  FlowCheck check;                 // the independent checker's verdict
};

// Supplies per node (positive: source). kInfeasible when they do not sum to zero or cannot
// be routed; kUnbounded never occurs because every capacity is finite.
MinCostFlowResult min_cost_flow(const FlowGraph& g, const std::vector<double>& supply);

// Sends `amount` from s to t at least cost.
MinCostFlowResult min_cost_flow(const FlowGraph& g, int s, int t, double amount);

}  // namespace apportion
