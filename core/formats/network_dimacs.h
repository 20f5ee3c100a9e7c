// DIMACS formats of the First DIMACS Implementation Challenge (1990-91):
//   maximum flow:   "p max N M", "n ID s", "n ID t", "a U V CAP"
//   min-cost flow:  "p min N M", "n ID SUPPLY", "a U V LOW CAP COST"
// Nodes are numbered 1..N. Writing adds comment lines "c node K <id>" and "c arc K <id>" so
// that reading the file back restores the ids; other readers ignore them.
// What the formats cannot hold: labels, positions, units, metadata, transit times, and
// demands other than the one s-t pair of "p max". Shared two-way arcs are written as two
// opposite arcs (the same maximum flow, and the same min-cost flow for costs >= 0); disabled
// arcs are left out. Lower bounds other than 0 are refused on reading.
#pragma once

#include <string>

#include "apportion/formats/load_result.h"

namespace apportion {

// `demand` selects the s-t pair of "p max" (index into net.demands).
std::string write_dimacs_max(const Network& net, int demand);
// Node supplies become the "n" lines.
std::string write_dimacs_min(const Network& net);
// Reads either problem type; "p max" gives one demand "d1" with amount "max", "p min"
// gives node supplies and arc costs.
LoadResult read_dimacs(const std::string& text);

}  // namespace apportion
