// `apportion certify NETWORK RESULT`: proves a saved max-min fair result against its
// network -- the independent check of its routing, then the fairness certificate
// (core/multiflow/fair_certificate.h) of its shares -- without solving again. For a result
// handed over by someone else, or kept from an earlier run.
#include <cstdlib>
#include <iostream>
#include <sstream>

#include "apportion/multiflow/fair_certificate.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/flow_result_export.h"
#include "apportion/results/multiflow_result_export.h"
#include "apportion/results/multiflow_result_import.h"
#include "commands.h"
#include "network_loader.h"

namespace apportion::cli {

namespace {

const char* kHelp = R"HELP(apportion certify NETWORK RESULT [options]

Proves a saved max-min fair result (the JSON of 'apportion fair --json' or of the page's
"Full result (JSON)") against its network, without solving again: first the independent
check of its routing (capacities, conservation, shares), then the fairness certificate --
for every demand an interval that holds its exact max-min fair share, from LP witnesses and
capacity prices recomputed by shortest paths. Prints the largest distance of a share from
its exact fair share, and the demands whose share is furthest.

Options:
  --hop-limit H    the result was solved with paths of at most H arcs
  --k-paths K      the result was solved with each demand's K shortest paths only
  --json OUT       the result again, with the certificate (core/FORMAT.md)
  --csv PREFIX     PREFIX.demands.csv with each share's proven interval
  (and the reading options of 'apportion validate --help', for NETWORK)

Exit status: 0 every share proven to 1e-6 of the largest; 3 not proven (or the routing
fails the check); 2 bad input.

Example:
  apportion fair demo-networks/harrowmere-fibre.json --json /tmp/fair.json
  apportion certify demo-networks/harrowmere-fibre.json /tmp/fair.json
)HELP";

int number_option(const Args& args, const char* name, bool& ok) {
  auto v = args.get(name);
  if (!v) return 0;
  char* end = nullptr;
  const long x = std::strtol(v->c_str(), &end, 10);
  if (end == v->c_str() || *end != '\0' || x < 1 || x > 1000000) {
    std::cerr << "apportion certify: --" << name << " needs a whole number >= 1\n";
    ok = false;
    return 0;
  }
  return static_cast<int>(x);
}

}  // namespace

int run_certify(int argc, char** argv) {
  std::set<std::string> valued = kLoaderOptions;
  valued.insert({"hop-limit", "k-paths", "json", "csv"});
  Args args = parse_args(argc, argv, 2, valued, {"help"});
  if (args.has("help")) return std::cout << kHelp, kExitOk;
  if (usage_error(args, "certify", 2, kHelp)) return kExitBadInput;
  bool ok = true;
  RoutingOptions routing;
  routing.hop_limit = number_option(args, "hop-limit", ok);
  routing.k_paths = number_option(args, "k-paths", ok);
  if (!ok) return kExitBadInput;
  OutputGuard guard;
  const std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  const Network& net = *loaded;
  const std::string& result_path = args.positional[1];
  guard.protect(result_path);
  std::string text, error;
  if (!read_file(result_path, text, error)) {
    std::cerr << "apportion certify: " << error << '\n';
    return kExitBadInput;
  }
  std::optional<MultiflowResult> read = read_multiflow_json(net, text, error);
  if (!read) {
    std::cerr << "apportion certify: " << result_path << " is not a result of this network: " << error << '\n';
    return kExitBadInput;
  }
  MultiflowResult& r = *read;
  if (r.status != SolveStatus::kOptimal || r.objective != FairObjective::kMaxMinFair) {
    std::cerr << "apportion certify: " << result_path << " holds no solved max-min fair result (objective "
              << objective_name(r.objective) << ", status " << status_name(r.status) << ")\n";
    return kExitBadInput;
  }
  r.check = check_multiflow(net, r);
  std::cout << net.name << " -- certificate of " << result_path << "\n\n";
  std::cout << "routing: " << (r.check.ok ? "checked" : "FAILS the check: " + r.check.worst) << '\n';
  r.fairness = certify_max_min(net, r, routing);
  const FairnessCertificate& c = r.fairness;
  const std::string unit = net.units.capacity.empty() ? "" : " " + net.units.capacity;
  bool proven = false;
  if (c.status != SolveStatus::kOptimal) {
    std::cout << "fairness: not proven: " << status_name(c.status) << ": " << c.message << '\n';
  } else {
    proven = r.check.ok && c.max_relative_error <= 1e-6;
    std::ostringstream line;
    line.precision(6);
    line << "fairness: every share is within " << c.max_error << unit << " (" << c.max_relative_error
         << " of the largest share) of its exact max-min fair share" << (proven ? "" : " -- NOT proven to 1e-6");
    std::cout << line.str() << "\n  (to the witnesses' tolerance " << c.witness_tolerance << "; " << c.levels
              << (c.levels == 1 ? " level, " : " levels, ") << c.stats.lp_solves << " LP solves, " << c.seconds
              << " s)\n";
    if (c.worst_demand >= 0) {
      const int k = c.worst_demand;
      std::cout << "  furthest: demand " << net.demands[k].id << ", share " << r.demands[k].share << ", fair share in ["
                << c.lower[k] << ", " << c.upper[k] << "]\n";
    }
  }
  std::cout << '\n' << kPlanningCaution << '\n';
  if (auto p = args.get("json"); p && !guard.write(*p, multiflow_json(net, r), error)) {
    std::cerr << "apportion: " << error << '\n';
    return kExitBadInput;
  }
  if (auto p = args.get("csv"); p && !guard.write(*p + ".demands.csv", multiflow_demands_csv(net, r), error)) {
    std::cerr << "apportion: " << error << '\n';
    return kExitBadInput;
  }
  return proven ? kExitOk : kExitUnproven;
}

}  // namespace apportion::cli
