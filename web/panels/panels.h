// The page's panels around the canvas, each drawn from the App state every frame.
#pragma once

#include <string>
#include <vector>

namespace apportion::web {

void draw_toolbar();       // files, exports, undo/redo, tools, search, rule and solve controls
void draw_notices();       // open errors, validation messages (click to select), events
void draw_result_panel();  // totals, filter, the shares table
void draw_demand_table();  // the demands, editable
void draw_inspector();     // the selected items, editable
void draw_charts();        // shares sorted with tiers marked; arc utilisation

// The rows the demands and shares tables show, filtered and sorted as their views say (also
// for the test hook).
const std::vector<int>& demand_rows();
const std::vector<int>& share_rows();
// The shares table's "Bound by" of demand k: its amount, its binding arcs by name, or why it
// got 0.
std::string share_bound_text(int k);

}  // namespace apportion::web
