// Arc prices from the capacity duals of a path LP, and each demand's shortest allowed path
// under them: the two halves of the weak-duality bound that the fairness certificate and
// the amount search's ceiling both use.
//
// Model: for arc lengths y >= 0 and d_k(y) the length of demand k's shortest allowed path,
// every routing within the capacities has sum_k f_k d_k(y) <= sum_e c_e y_e (each unit of
// flow of k uses a path at least d_k long; weak LP duality of the path formulation,
// R. Ahuja, T. Magnanti, J. Orlin, "Network Flows", 1993, ch. 17). Any y >= 0 gives a valid
// bound; the duals of the last solve give a tight one.
#pragma once

#include <vector>

#include "apportion/multiflow/path_master.h"
#include "apportion/multiflow/path_pricing.h"

namespace apportion {

// y per arc from the capacity rows' duals of the master's last solve: "<=" rows have duals
// <= 0 at a minimum, so y = max(0, -dual); prices below 1e-9 of the largest are set to 0.
// They are rounding noise of a zero, and kept they would give demands tiny distances d_k
// and magnify every error of a bound divided by d_k.
std::vector<double> capacity_prices(PathMaster& master, int arc_count);

// d_k(y) for every demand: over its fixed paths with `fixed_paths` (k shortest paths), else
// by one shortest-path tree per origin (`pricer`, with the routing's hop limit); +inf where
// the demand has no allowed path.
std::vector<double> demand_distances(const PathMaster& master, PathPricer& pricer, const std::vector<DemandSpec>& specs,
                                     const std::vector<double>& y, bool fixed_paths);

}  // namespace apportion
