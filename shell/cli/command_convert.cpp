// `apportion convert IN --to FORMAT OUT`: write a network in another format.
#include <iostream>

#include "apportion/formats/network_csv.h"
#include "apportion/formats/network_dimacs.h"
#include "apportion/formats/network_json.h"
#include "commands.h"
#include "network_loader.h"

namespace apportion::cli {

namespace {
const char* kHelp = R"(apportion convert IN --to FORMAT OUT [options]

Converts a network file. FORMAT is one of
  json        the Apportion network file
  csv         three tables OUT.nodes.csv, OUT.arcs.csv, OUT.demands.csv (RFC 4180)
  dimacs-max  DIMACS maximum flow; the s-t pair is the demand chosen by --demand (default: first)
  dimacs-min  DIMACS min-cost flow from node supplies and arc costs
What a target format cannot hold is listed in core/FORMAT.md. The input is never
overwritten; outputs are written atomically.

Options:
  --demand ID    dimacs-max: which demand gives s and t
  (and the reading options of 'apportion validate --help')

Example:
  apportion convert demo-networks/harrowmere-fibre.json --to csv /tmp/harrowmere
)";
}  // namespace

int run_convert(int argc, char** argv) {
  std::set<std::string> valued = kLoaderOptions;
  valued.insert({"to", "demand"});
  Args args = parse_args(argc, argv, 2, valued, {"help"});
  if (args.has("help")) return std::cout << kHelp, kExitOk;
  if (!args.error.empty() || args.positional.size() != 2 || !args.get("to")) {
    std::cerr << "apportion convert: " << (args.error.empty() ? "expected IN --to FORMAT OUT" : args.error) << "\n\n"
              << kHelp;
    return kExitBadInput;
  }
  const std::string to = *args.get("to");
  if (to != "json" && to != "csv" && to != "dimacs-max" && to != "dimacs-min") {
    std::cerr << "apportion convert: unknown target format '" << to << "'\n";
    return kExitBadInput;
  }
  OutputGuard guard;
  const std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  const Network& net = *loaded;
  const std::string& out = args.positional[1];
  std::string error;
  bool ok = true;
  if (to == "json") {
    ok = guard.write(out, write_network_json(net), error);
  } else if (to == "csv") {
    NetworkCsv t = write_network_csv(net);
    ok = guard.write(out + ".nodes.csv", t.nodes, error) && guard.write(out + ".arcs.csv", t.arcs, error) &&
         guard.write(out + ".demands.csv", t.demands, error);
  } else if (to == "dimacs-max") {
    int k = 0;
    if (auto id = args.get("demand")) k = net.find_demand(*id);
    if (k < 0 || k >= static_cast<int>(net.demands.size())) {
      std::cerr << "apportion convert: dimacs-max needs a demand to give s and t (see --demand)\n";
      return kExitBadInput;
    }
    ok = guard.write(out, write_dimacs_max(net, k), error);
  } else {
    ok = guard.write(out, write_dimacs_min(net), error);
  }
  if (!ok) {
    std::cerr << "apportion convert: " << error << '\n';
    return kExitBadInput;
  }
  return kExitOk;
}

}  // namespace apportion::cli
