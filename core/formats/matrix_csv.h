// A traffic matrix as one CSV table (RFC 4180, csv_table.h), as spreadsheets hold them:
//
//   ,n1,n2,n3          <- first row: a corner cell (any text), then one destination per column
//   n1,,12.5,4         <- then one origin per row: the amount of each (origin, destination)
//   n2,3,,max
//
// Nodes are matched by id, else by label (a label two nodes share is refused). A number >= 0
// is the pair's amount, "max" asks as much as possible, and an empty cell or 0 means no
// demand (a spreadsheet's full matrix holds zeros where nothing flows); a cell on the
// diagonal (origin = destination) must be empty or 0. Writing lists every node as a row and
// a column, in the network's order, by id; pairs with several demands are summed (any "max"
// among them makes "max") and said so.
#pragma once

#include <string>
#include <vector>

#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"
#include "apportion/model/traffic_matrix.h"

namespace apportion {

struct MatrixCsvRead {
  std::vector<PairAmount> pairs;  // in row, then column order
  Diagnostics diagnostics;        // errors name the line and the column
  bool ok() const { return !diagnostics.has_errors(); }
};

MatrixCsvRead read_matrix_csv(const Network& net, const std::string& text);

struct MatrixCsvWrite {
  std::string text;
  Diagnostics diagnostics;  // warnings: summed pairs
};

MatrixCsvWrite write_matrix_csv(const Network& net);

}  // namespace apportion
