// The independent solution checker; see flow_checker.h. Deliberately written from the
// definitions alone, sharing no code with the solvers it checks.
#include "apportion/flow/flow_checker.h"

#include <cmath>

namespace apportion {

namespace {

// Capacity violations and net outflow per node; fills `check` and returns the net outflows.
std::vector<double> measure(const FlowGraph& g, const std::vector<double>& flow, FlowCheck& check) {
  std::vector<double> net(g.node_count(), 0.0);
  if (static_cast<int>(flow.size()) != g.arc_count()) {
    check.max_capacity_violation = INFINITY;
    check.worst = "the flow has " + std::to_string(flow.size()) + " entries for " + std::to_string(g.arc_count()) +
                  " arcs";
    return net;
  }
  for (int a = 0; a < g.arc_count(); ++a) {
    const double x = flow[a];
    const double u = g.capacity(a);
    double v = 0.0;
    if (!std::isfinite(x)) {
      v = INFINITY;
    } else if (g.two_way(a)) {
      v = std::abs(x) - u;
    } else {
      v = std::max(-x, x - u);
    }
    if (v > check.max_capacity_violation) {
      check.max_capacity_violation = v;
      check.worst = "arc #" + std::to_string(a) + " carries " + std::to_string(x) + " with capacity " + std::to_string(u);
    }
    net[g.tail(a)] += x;
    net[g.head(a)] -= x;
  }
  return net;
}

void note_conservation(int v, double violation, FlowCheck& check) {
  if (violation > check.max_conservation_violation) {
    check.max_conservation_violation = violation;
    if (violation > check.max_capacity_violation)
      check.worst = "node #" + std::to_string(v) + " is out of balance by " + std::to_string(violation);
  }
}

void finish(FlowCheck& check, const Tolerance& tol) {
  check.ok = !tol.positive(check.max_capacity_violation) && !tol.positive(check.max_conservation_violation) &&
             !tol.positive(check.value_error);
  if (check.ok) check.worst.clear();
}

}  // namespace

FlowCheck check_terminal_flow(const FlowGraph& g, const std::vector<int>& sources, const std::vector<int>& sinks,
                              const std::vector<double>& flow, double claimed_value, const Tolerance& tol) {
  FlowCheck check;
  std::vector<double> net = measure(g, flow, check);
  std::vector<char> terminal(g.node_count(), 0);
  double out_of_sources = 0.0, into_sinks = 0.0;
  for (int s : sources) terminal[s] = 1, out_of_sources += net[s];
  for (int t : sinks) terminal[t] = 1, into_sinks -= net[t];
  for (int v = 0; v < g.node_count(); ++v)
    if (!terminal[v]) note_conservation(v, std::abs(net[v]), check);
  check.value_error = std::max(std::abs(out_of_sources - claimed_value), std::abs(into_sinks - claimed_value));
  if (tol.positive(check.value_error) && check.worst.empty())
    check.worst = "claimed value " + std::to_string(claimed_value) + " but the sources send " +
                  std::to_string(out_of_sources);
  finish(check, tol);
  return check;
}

FlowCheck check_supply_flow(const FlowGraph& g, const std::vector<double>& supply, const std::vector<double>& flow,
                            double claimed_cost, const Tolerance& tol) {
  FlowCheck check;
  std::vector<double> net = measure(g, flow, check);
  for (int v = 0; v < g.node_count(); ++v) note_conservation(v, std::abs(net[v] - supply[v]), check);
  if (static_cast<int>(flow.size()) == g.arc_count()) {
    double cost = 0.0;
    for (int a = 0; a < g.arc_count(); ++a) cost += g.cost(a) * std::abs(flow[a]);
    // Costs are compared relative to their own magnitude, not the capacities'.
    check.value_error = std::abs(cost - claimed_cost) / std::max(1.0, std::abs(cost));
    if (tol.positive(check.value_error) && check.worst.empty())
      check.worst = "claimed cost " + std::to_string(claimed_cost) + " but the flow costs " + std::to_string(cost);
  }
  finish(check, tol);
  return check;
}

}  // namespace apportion
