// Why a demand got nothing: the rule's own reason, in words a planner can act on, so that a 0
// in the shares table is never left unexplained. The reasons, checked in this order:
//   - the demand asks for 0;
//   - no path with capacity joins its origin to its destination (arcs out of service, or of
//     capacity 0), found by a breadth-first search over the usable arcs;
//   - max concurrent flow and feasibility give each demand a fraction of its amount: a demand
//     asking for as much as possible has none; and with lambda = 0 every demand gets 0;
//   - max throughput carries the most flow in total, and can do so without this demand;
//   - max-min fair (and the trade-off): its paths were full when its level was 0, or (no arc
//     binds) the path limits leave it no path.
#pragma once

#include <string>

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

// "" when demand k got more than nothing, or when the result is not optimal.
std::string zero_share_reason(const Network& net, const MultiflowResult& result, int k);

}  // namespace apportion
