// A demands table to add to an open network: a CSV file, or rows copied from a spreadsheet
// (tab-separated), one demand per row.
//
//   origin,destination,amount,weight,id,label      <- first row: the columns, in any order
//   Lisbon,Madrid,12.5,,,                          <- nodes by id or label (node_names.h)
//   n4,n9,max,2,d-17,backup feed
//
// Columns are found by name, ignoring case and blanks: origin (or from, source) and
// destination (or to, target) are required; amount (a number >= 0, or empty / "max" for
// as much as possible), weight (> 0, default 1), id and label are optional. A row without an
// id gets "<origin id>-<destination id>" (a number appended where taken), as the traffic
// matrices do. The delimiter is the one the first row uses: a tab, else ';' when it has no
// comma, else ','. Errors name the line and the column; after 20 of them the rest are
// counted. Nothing is added while any error remains.
// The table of the network's own CSV form (network_csv.h, "id,label,origin,destination,
// amount,weight") reads as it is, so an exported demands table comes back unchanged.
#pragma once

#include <string>
#include <vector>

#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"

namespace apportion {

struct DemandTableRead {
  std::vector<Demand> demands;  // ready to append: ids unique against the network's
  Diagnostics diagnostics;
  char delimiter = ',';
  int generated_ids = 0;        // rows that had no id
  bool ok() const { return !diagnostics.has_errors(); }
};

// `replace`: the table will replace the network's demands, so their ids are free again.
DemandTableRead read_demand_table(const Network& net, const std::string& text, bool replace = false);

// True when the first row names an origin and a destination column: how the page tells a
// demands table from a traffic matrix when a single CSV file is opened.
bool looks_like_demand_table(const std::string& text);

// Appends (or, with `replace`, puts in place of the network's demands) a table read with
// the same `replace`; nothing when it has errors. Returns how many were added.
int add_demand_table(Network& net, DemandTableRead table, bool replace);

}  // namespace apportion
