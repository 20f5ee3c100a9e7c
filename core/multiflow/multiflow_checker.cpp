// The independent checker of multiflow results; see check_multiflow() in fair_multiflow.h.
// Written from the definitions alone: it rebuilds every demand's arc flows from the
// reported paths and shares no code with the engine.
//
// Every violation is measured at the scale of what it concerns: a capacity excess relative
// to that arc's capacity, a demand's imbalance relative to its share -- each floored at the
// smallest positive capacity of the network. A tolerance relative to the largest capacity
// would let a 0.001 arc carry 0.3 in a network with 1e9 arcs.
#include <algorithm>
#include <cmath>
#include <string>

#include "apportion/model/number_text.h"
#include "apportion/multiflow/fair_multiflow.h"

namespace apportion {

MultiflowCheck check_multiflow(const Network& net, const MultiflowResult& r) {
  MultiflowCheck c;
  const int n = net.node_count(), m = net.arc_count();
  const double found = net.positive_capacities().smallest;
  const double smallest = found > 0 ? found : 1.0;
  auto scale_of = [smallest](double v) { return std::max(std::abs(v), smallest); };
  auto note = [&c](double& slot, double v, const std::string& what) {
    if (v > slot) {
      slot = v;
      if (v > 1e-9) c.worst = what;
    }
  };
  if (r.demands.size() != net.demands.size()) {
    c.worst = "the result has " + std::to_string(r.demands.size()) + " demands, the network " +
              std::to_string(net.demands.size());
    c.max_share_error = INFINITY;
    return c;
  }
  std::vector<double> total(m, 0.0);
  for (std::size_t k = 0; k < net.demands.size(); ++k) {
    const Demand& dem = net.demands[k];
    const DemandShare& d = r.demands[k];
    std::vector<double> net_out(n, 0.0);
    double sent = 0.0;
    for (const PathShare& p : d.paths) {
      bool walk_ok = p.nodes.size() == p.arcs.size() + 1 && p.amount >= 0 && std::isfinite(p.amount) &&
                     !p.nodes.empty() && p.nodes.front() == dem.origin && p.nodes.back() == dem.destination;
      for (std::size_t i = 0; walk_ok && i < p.arcs.size(); ++i) {
        const int a = p.arcs[i];
        if (a < 0 || a >= m) {
          walk_ok = false;
          break;
        }
        const Arc& arc = net.arcs[a];
        const int u = p.nodes[i], v = p.nodes[i + 1];
        const bool forward = arc.from == u && arc.to == v;
        const bool backward = arc.shared_two_way && arc.to == u && arc.from == v;
        walk_ok = forward || backward;
        if (walk_ok) {
          total[a] += p.amount;
          net_out[u] += p.amount;
          net_out[v] -= p.amount;
        }
      }
      if (!walk_ok) {
        note(c.max_conservation_violation, INFINITY, "demand '" + dem.id + "' has a path that is not a walk from its origin to its destination");
        continue;
      }
      sent += p.amount;
    }
    const double scale = scale_of(d.share);
    note(c.max_share_error, std::abs(sent - d.share) / scale,
         "demand '" + dem.id + "' reports " + format_number(d.share) + " but its paths carry " + format_number(sent));
    for (int v = 0; v < n; ++v) {
      const double expected = v == dem.origin ? d.share : v == dem.destination ? -d.share : 0.0;
      note(c.max_conservation_violation, std::abs(net_out[v] - expected) / scale,
           "demand '" + dem.id + "' is out of balance at node '" + net.nodes[v].id + "'");
    }
  }
  for (int a = 0; a < m; ++a) {
    const double cap = net.arcs[a].enabled ? net.arcs[a].capacity : 0.0;
    note(c.max_capacity_violation, (total[a] - cap) / scale_of(cap),
         "arc '" + net.arcs[a].id + "' carries " + format_number(total[a]) + " with capacity " + format_number(cap));
    if (a < static_cast<int>(r.arcs.size()))
      note(c.max_share_error, std::abs(r.arcs[a].load - total[a]) / scale_of(total[a]),
           "arc '" + net.arcs[a].id + "' reports load " + format_number(r.arcs[a].load) + " but its paths give " +
               format_number(total[a]));
  }
  // The LP solver's feasibility tolerance (1e-7 in HiGHS) is the accuracy to expect, with a
  // margin.
  const double limit = 1e-6;
  c.ok = c.max_capacity_violation <= limit && c.max_conservation_violation <= limit && c.max_share_error <= limit;
  if (c.ok) c.worst.clear();
  return c;
}

}  // namespace apportion
