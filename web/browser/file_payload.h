// Files handed over by the browser (picker, share link, autosave), read with the core's
// importers. Any format the core imports: Apportion JSON, CSV tables (the three files
// NAME.nodes.csv, NAME.arcs.csv and optionally NAME.demands.csv chosen together), DIMACS
// and GraphML; a single other CSV file is taken as a traffic matrix for the open network.
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
  std::string matrix;  // one CSV file that is none of the network tables: a traffic matrix
                       // (matrix_csv.h) to add to the open network; `loaded` is then empty
};

Payload read_payload(const std::string& payload_json);

}  // namespace apportion::web
