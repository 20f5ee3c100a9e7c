// Why a demand got nothing; see zero_share_reason.h.
#include "apportion/results/zero_share_reason.h"

#include <cmath>
#include <vector>

namespace apportion {

namespace {

// Breadth-first search from `from` over enabled arcs of positive capacity (shared two-way
// arcs in both directions).
bool connected(const Network& net, int from, int to) {
  std::vector<std::vector<int>> out(net.nodes.size());
  for (const Arc& a : net.arcs) {
    if (!a.enabled || !(a.capacity > 0) || a.from < 0 || a.to < 0) continue;
    out[a.from].push_back(a.to);
    if (a.shared_two_way) out[a.to].push_back(a.from);
  }
  std::vector<char> seen(net.nodes.size(), 0);
  std::vector<int> queue{from};
  seen[from] = 1;
  for (std::size_t i = 0; i < queue.size(); ++i)
    for (int w : out[queue[i]])
      if (!seen[w]) seen[w] = 1, queue.push_back(w);
  return seen[to];
}

}  // namespace

std::string zero_share_reason(const Network& net, const MultiflowResult& r, int k) {
  if (r.status != SolveStatus::kOptimal || k < 0 || k >= static_cast<int>(net.demands.size()) ||
      k >= static_cast<int>(r.demands.size()) || r.demands[k].share > 0)
    return "";
  const Demand& d = net.demands[k];
  if (d.amount && *d.amount == 0) return "it asks for 0";
  if (!connected(net, d.origin, d.destination))
    return "no path with capacity from its origin to its destination (arcs out of service or of capacity 0)";
  switch (r.objective) {
    case FairObjective::kMaxConcurrent:
    case FairObjective::kFeasibility:
      if (!d.amount) return "it asks for as much as possible, and this rule gives each demand a fraction of its amount";
      if (r.lambda <= 0) return "lambda is 0: some demand cannot be served at all, so this rule gives every demand 0";
      return "";
    case FairObjective::kMaxThroughput:
      return "the most flow in total is reached without it: the capacity it would use carries as much or more for "
             "other demands";
    case FairObjective::kMaxMinFair:
    case FairObjective::kTradeoff:
      if (!r.demands[k].binding_arcs.empty()) return "its paths were full at level 0 (see the binding arcs)";
      return "no path within the hop limit or the paths-per-demand limit";
  }
  return "";
}

}  // namespace apportion
