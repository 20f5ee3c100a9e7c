// `apportion validate FILE`: load and validate, print every message and a summary.
#include <iostream>

#include "commands.h"
#include "network_loader.h"

namespace apportion::cli {

namespace {
const char* kHelp = R"(apportion validate FILE [options]

Checks a network file and lists its errors and warnings, each naming the item and field.
Exit code 0 when the file has no errors (warnings allowed), 2 otherwise.

Options:
  --format F                json | csv | dimacs | graphml (default: from the file name)
  --capacity-attribute NAME GraphML: the edge attribute holding capacity (default capacity)
  --default-capacity X      GraphML: capacity for edges without it (default 1)
  --undirected shared|pairs GraphML: undirected edges as one shared arc or two arcs
  --attribute-unit U        GraphML: the capacity attribute is a link speed in U (bit/s,
                            kbit/s, Mbit/s, Gbit/s, Tbit/s), converted to the network's unit
  --unit U                  GraphML: the network's capacity unit (default with
                            --attribute-unit: Gbit/s); the default capacity is in it
  --length-as cost|transit  GraphML: each link's great-circle length (km, from the nodes'
                            Longitude and Latitude) as its cost, or as its transit time
  --speed S                 GraphML: km per time unit for --length-as transit (default 1)

Example:
  apportion validate demo-networks/harrowmere-fibre.json
)";
}  // namespace

int run_validate(int argc, char** argv) {
  Args args = parse_args(argc, argv, 2, kLoaderOptions, {"help"});
  if (args.has("help")) return std::cout << kHelp, kExitOk;
  if (usage_error(args, "validate", 1, kHelp)) return kExitBadInput;
  OutputGuard guard;
  LoadResult r = load_network(args.positional[0], args, guard);
  print_diagnostics(r.diagnostics);
  if (!r.ok()) {
    std::cerr << "apportion validate: " << r.diagnostics.error_count() << " error(s)\n";
    return kExitBadInput;
  }
  const Network& net = *r.network;
  std::cout << "ok: " << net.node_count() << " nodes, " << net.arc_count() << " arcs, " << net.demands.size()
            << " demands, " << r.diagnostics.warning_count() << " warning(s)\n";
  return kExitOk;
}

}  // namespace apportion::cli
