// `apportion demands IN OUT`: traffic matrices -- many demands at once -- generated, read
// from a matrix or a demands table, and written as a matrix.
#include <iostream>
#include <sstream>

#include "apportion/formats/csv_table.h"
#include "apportion/formats/demand_table.h"
#include "apportion/formats/matrix_csv.h"
#include "apportion/formats/network_json.h"
#include "apportion/model/node_names.h"
#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/traffic_matrix.h"
#include "apportion/model/validation.h"
#include "commands.h"
#include "network_loader.h"

namespace apportion::cli {

namespace {

const char* kHelp = R"(apportion demands IN OUT [options]
apportion demands IN --export-matrix MATRIX.csv

Adds many demands at once to the network IN and writes the network (JSON) to OUT.

Generated: every ordered pair of distinct nodes, or of the chosen origins and destinations,
with amounts from one of
  --gravity TOTAL       the gravity model: pair (i, j) asks TOTAL x m_i m_j / (sum over
                        the pairs of m_p m_q); node masses m from --masses, else drawn
                        uniformly from [1, 10) with --seed (default 1)
  --uniform AMOUNT      every pair asks AMOUNT
  --max                 every pair asks as much as possible
  --origins A,B,...     only these origins (node ids or labels; default: every node)
  --destinations C,...  only these destinations (default: every node)
  --masses FILE.csv     gravity: rows "node,mass" (id or label; a header row is allowed)
  --seed N              gravity: the seed of the drawn masses

From a file instead:
  --matrix FILE.csv     a matrix: first row the destinations, first column the origins,
                        amounts in the cells ("max" for as much as possible; empty or 0:
                        no demand); nodes by id or label
  --table FILE.csv      a demands table, one demand per row; its first row names the
                        columns: origin and destination (ids or labels), and optionally
                        amount (empty or "max": as much as possible), weight, id, label.
                        Commas, tabs (cells copied from a spreadsheet) or semicolons.
                        Rows without an id get "<origin>-<destination>"

Also:
  --weight W            the new demands' weight (default 1; not for --table)
  --replace             the new demands replace the network's existing ones
  --export-matrix FILE  also write the network's demands as a matrix CSV (with only IN:
                        write it and nothing else)
  (and the reading options of 'apportion validate --help')

New demands are named "<origin>-<destination>". The input is never overwritten; outputs
are written atomically.

Example:
  apportion demands demo-networks/harrowmere-fibre.json /tmp/all-pairs.json --gravity 400 --replace
)";

std::vector<int> node_list(const Network& net, const std::string& text, const char* option, std::string& error) {
  std::vector<int> out;
  const NodeNames names(net);
  for (const std::vector<std::string>& row : parse_csv(text).rows)
    for (const std::string& name : row) {
      if (name.empty()) continue;
      const int v = names.find(name);
      if (v < 0) error = std::string("--") + option + ": " + NodeNames::why_not(v) + " '" + name + "'";
      out.push_back(v);
    }
  return out;
}

bool read_masses(const Network& net, const std::string& text, std::vector<double>& mass, std::string& error) {
  const CsvParse csv = parse_csv(text);
  if (!csv.error.empty()) return error = "--masses: " + csv.error, false;
  const NodeNames names(net);
  mass.assign(net.node_count(), 0.0);
  std::vector<char> given(net.node_count(), 0);
  for (std::size_t r = 0; r < csv.rows.size(); ++r) {
    const std::vector<std::string>& row = csv.rows[r];
    if (row.empty() || (row.size() == 1 && row[0].empty())) continue;
    const std::optional<double> m = row.size() == 2 ? parse_number(row[1]) : std::nullopt;
    if (!m) {
      if (r == 0) continue;  // a header row
      return error = "--masses: line " + std::to_string(r + 1) + " is not \"node,mass\"", false;
    }
    const int v = names.find(row[0]);
    if (v < 0) return error = std::string("--masses: ") + NodeNames::why_not(v) + " '" + row[0] + "'", false;
    mass[v] = *m, given[v] = 1;
  }
  for (int v = 0; v < net.node_count(); ++v)
    if (!given[v]) return error = "--masses: node '" + net.nodes[v].id + "' has no mass", false;
  return true;
}

}  // namespace

int run_demands(int argc, char** argv) {
  std::set<std::string> valued = kLoaderOptions;
  valued.insert({"gravity", "uniform", "origins", "destinations", "masses", "seed", "matrix", "table", "weight",
                 "export-matrix"});
  Args args = parse_args(argc, argv, 2, valued, {"help", "max", "replace"});
  if (args.has("help")) return std::cout << kHelp, kExitOk;
  const int sources = (args.get("gravity") ? 1 : 0) + (args.get("uniform") ? 1 : 0) + (args.has("max") ? 1 : 0) +
                      (args.get("matrix") ? 1 : 0) + (args.get("table") ? 1 : 0);
  std::string error;
  if (!args.error.empty()) error = args.error;
  else if (args.positional.size() == 1 && (sources > 0 || !args.get("export-matrix")))
    error = "with only IN, give --export-matrix and nothing to add";
  else if (args.positional.size() == 2 && sources != 1)
    error = "give exactly one of --gravity, --uniform, --max, --matrix, --table";
  else if (args.positional.empty() || args.positional.size() > 2)
    error = "expected IN OUT";
  if (error.empty() && (args.get("masses") || args.get("seed")) && !args.get("gravity"))
    error = "--masses and --seed belong to --gravity";
  if (error.empty() && (args.get("origins") || args.get("destinations")) && (args.get("matrix") || args.get("table")))
    error = "--origins and --destinations choose generated pairs, not those of a file";
  if (!error.empty()) {
    std::cerr << "apportion demands: " << error << "\n\n" << kHelp;
    return kExitBadInput;
  }
  OutputGuard guard;
  std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  Network net = std::move(*loaded);
  auto fail = [](const std::string& why) {
    std::cerr << "apportion demands: " << why << '\n';
    return kExitBadInput;
  };
  auto number = [&](const char* option, double& out) {
    const auto text = args.get(option);
    if (!text) return true;
    const auto v = parse_number(*text);
    if (!v) return error = std::string("--") + option + " needs a number", false;
    out = *v;
    return true;
  };
  auto read_input = [&](const char* option, std::string& text) {
    const std::string path = *args.get(option);
    guard.protect(path);
    if (!read_file(path, text, error)) return error = std::string("--") + option + ": " + error, false;
    return true;
  };

  const std::size_t before = net.demands.size();
  if (args.positional.size() == 2) {
    double weight = 1.0;
    if (!number("weight", weight)) return fail(error);
    if (args.get("matrix")) {
      std::string text;
      if (!read_input("matrix", text)) return fail(error);
      MatrixCsvRead m = read_matrix_csv(net, text);
      print_diagnostics(m.diagnostics);
      if (!m.ok()) return kExitBadInput;
      const std::size_t kept = args.has("replace") ? 0 : net.demands.size();
      if (kept + m.pairs.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands))
        return fail("the matrix would make more demands than the limit of " + std::to_string(SizeLimits::kMaxDemands));
      if (!(weight > 0)) return fail("--weight must be a number > 0");
      add_pair_demands(net, m.pairs, weight, args.has("replace"));
    } else if (args.get("table")) {
      if (args.get("weight")) return fail("--weight: a demands table gives each demand's weight in its own column");
      std::string text;
      if (!read_input("table", text)) return fail(error);
      DemandTableRead table = read_demand_table(net, text, args.has("replace"));
      print_diagnostics(table.diagnostics);
      if (!table.ok()) return kExitBadInput;
      add_demand_table(net, std::move(table), args.has("replace"));
    } else {
      TrafficMatrixSpec spec;
      spec.weight = weight;
      spec.replace = args.has("replace");
      if (args.get("origins")) spec.origins = node_list(net, *args.get("origins"), "origins", error);
      if (args.get("destinations")) spec.destinations = node_list(net, *args.get("destinations"), "destinations", error);
      if (!error.empty()) return fail(error);
      if (args.get("gravity")) {
        spec.amounts = MatrixAmounts::kGravity;
        if (!number("gravity", spec.total)) return fail(error);
        double seed = 1;
        if (!number("seed", seed)) return fail(error);
        if (!(seed >= 0 && seed <= 9007199254740992.0) || seed != static_cast<double>(static_cast<long long>(seed)))
          return fail("--seed needs a whole number >= 0");
        spec.seed = static_cast<std::uint64_t>(seed);
        if (args.get("masses")) {
          std::string text;
          if (!read_input("masses", text) || !read_masses(net, text, spec.masses, error)) return fail(error);
        }
      } else if (args.get("uniform")) {
        spec.amounts = MatrixAmounts::kUniform;
        if (!number("uniform", spec.uniform_amount)) return fail(error);
      } else {
        spec.amounts = MatrixAmounts::kMax;
      }
      TrafficMatrixResult r = add_traffic_matrix(net, spec);
      print_diagnostics(r.diagnostics);
      if (!r.ok) return kExitBadInput;
    }
    const Diagnostics checked = validate(net);
    if (checked.has_errors()) {
      print_diagnostics(checked);
      return kExitBadInput;
    }
  }
  if (auto path = args.get("export-matrix")) {
    MatrixCsvWrite m = write_matrix_csv(net);
    print_diagnostics(m.diagnostics);
    if (!guard.write(*path, m.text, error)) return fail(error);
  }
  if (args.positional.size() == 2) {
    if (!guard.write(args.positional[1], write_network_json(net), error)) return fail(error);
    std::cout << args.positional[1] << ": " << net.demands.size() << " demands ("
              << (args.has("replace") ? std::string("replacing ") + std::to_string(before)
                                      : std::to_string(net.demands.size() - before) + " new")
              << ")\n";
  }
  return kExitOk;
}

}  // namespace apportion::cli
