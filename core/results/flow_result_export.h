// Single-commodity results as files: JSON (documented in core/FORMAT.md, "Result files")
// and a CSV table per arc. Both name arcs and nodes by their document ids, so a result can
// be read beside the network file that produced it.
#pragma once

#include <string>

#include "apportion/flow/max_flow.h"
#include "apportion/flow/min_cost_flow.h"
#include "apportion/model/network.h"

namespace apportion {

std::string max_flow_json(const Network& net, const std::vector<int>& sources, const std::vector<int>& sinks,
                          const MaxFlowResult& r);
std::string min_cost_flow_json(const Network& net, const MinCostFlowResult& r);
// id,from,to,capacity,flow,utilisation[,cost][,in_cut]
std::string arc_flow_csv(const Network& net, const std::vector<double>& flow, const std::vector<int>* cut_arcs);

// The caution printed beside every result: Apportion is a planning aid.
extern const char* const kPlanningCaution;

}  // namespace apportion
