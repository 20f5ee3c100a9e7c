// A network as three CSV tables (RFC 4180), for spreadsheets:
//   nodes:   id,label,x,y,supply
//   arcs:    id,from,to,capacity,cost,transit,enabled,shared_two_way
//   demands: id,label,origin,destination,amount,weight
// Columns are found by their header name, in any order; an empty cell means "not given".
// `enabled` and `shared_two_way` read true/false (also 1/0, yes/no); `amount` reads a number
// or "max". The network name, units and metadata have no place in these tables.
#pragma once

#include <string>

#include "apportion/formats/load_result.h"

namespace apportion {

struct NetworkCsv {
  std::string nodes, arcs, demands;
};

NetworkCsv write_network_csv(const Network& net);
// `demands` may be empty text (a topology without demands).
LoadResult read_network_csv(const NetworkCsv& tables);

}  // namespace apportion
