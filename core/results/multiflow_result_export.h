// Fair-multiflow results as files: JSON (core/FORMAT.md, "Fair-multiflow result files") and
// CSV tables per demand, per arc and per path. Items are named by their document ids.
#pragma once

#include <string>

#include "apportion/model/network.h"
#include "apportion/multiflow/multiflow.h"

namespace apportion {

std::string multiflow_json(const Network& net, const MultiflowResult& r);
// id,label,origin,destination,amount,weight,share,percent_of_amount,normalised,tier,limited_by_amount,binding_arcs
// (+ fair_share_lower,fair_share_upper,fair_share_error when r.fairness holds a finished certificate)
std::string multiflow_demands_csv(const Network& net, const MultiflowResult& r);
// id,from,to,capacity,load,utilisation,shadow_price,tier
std::string multiflow_arcs_csv(const Network& net, const MultiflowResult& r);
// demand,path,amount,nodes (space-separated ids)
std::string multiflow_paths_csv(const Network& net, const MultiflowResult& r);

}  // namespace apportion
