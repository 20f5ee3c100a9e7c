// Files handed over by the browser (picker, share link, autosave), read with the core's
// importers. Any format the core imports: Apportion JSON, CSV tables (the three files
// NAME.nodes.csv, NAME.arcs.csv and optionally NAME.demands.csv chosen together), DIMACS
// and GraphML. A single CSV file other than a nodes or arcs table is for the open network:
// a demands table (demand_table.h) or a traffic matrix (matrix_csv.h).
// A failure yields messages and no network, so the page keeps its document.
#pragma once

#include <string>

#include "apportion/formats/load_result.h"

namespace apportion::web {

struct Payload {
  std::string source;  // "file", "link" or "autosave"
  std::string name;    // the file name shown to the user
  LoadResult loaded;   // GraphML: read with the default choices
  std::string graphml; // a GraphML file's text, for the page to ask how to read it
  std::string single_csv;  // that single CSV file's text; `loaded` is then empty
};

Payload read_payload(const std::string& payload_json);

}  // namespace apportion::web
