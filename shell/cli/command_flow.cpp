// `apportion maxflow|mincut|mincost`: single-commodity solves on a network file.
#include <iostream>
#include <sstream>

#include "apportion/flow/flow_decomposition.h"
#include "apportion/flow/max_flow.h"
#include "apportion/flow/min_cost_flow.h"
#include "apportion/model/number_text.h"
#include "apportion/results/flow_result_export.h"
#include "commands.h"
#include "network_loader.h"
#include "text_table.h"

namespace apportion::cli {

namespace {

const char* kMaxFlowHelp = R"(apportion maxflow|mincut FILE [options]

Maximum flow from the origin(s) to the destination(s), with a minimum cut that proves it:
the cut's capacity equals the flow value. 'mincut' prints the cut first. Every result is
verified by the independent checker before it is printed.

Terminals (default: the first demand of the file):
  --demand ID        the origin and destination of this demand
  --from A[,B...]    source node ids     --to C[,D...]   sink node ids
Output:
  --json OUT         write the result as JSON (format in core/FORMAT.md)
  --csv OUT          write the arc flows as CSV
  --paths            print the flow decomposed into paths
  --all-arcs         list arcs without flow too
  (and the reading options of 'apportion validate --help')

Example:
  apportion maxflow demo-networks/harrowmere-fibre.json --demand d-north --paths
)";

const char* kMinCostHelp = R"(apportion mincost FILE [options]

Minimum-cost flow: sends an amount from a source to a sink, or meets the node supplies of
the file, at least total cost. Prints the arc flows, the cost and the node potentials
(duals: reduced cost c + pi(tail) - pi(head) is >= 0 on arcs below capacity and <= 0 on
arcs with flow). Exit code 1 when the amount or supplies cannot be routed.

What to send (default: node supplies if the file has any, else the first demand with an amount):
  --demand ID               this demand's amount from its origin to its destination
  --from A --to B --amount X
Output: --json OUT, --csv OUT, --paths, --all-arcs as for maxflow.

Example:
  apportion mincost demo-networks/lowmoor-relief-roads.json --demand d-clinic
)";

std::vector<std::string> split(const std::string& s) {
  std::vector<std::string> out;
  std::stringstream ss(s);
  for (std::string item; std::getline(ss, item, ',');)
    if (!item.empty()) out.push_back(item);
  return out;
}

bool resolve_nodes(const Network& net, const std::string& list, std::vector<int>& out, std::string& error) {
  for (const std::string& id : split(list)) {
    const int v = net.find_node(id);
    if (v < 0) {
      error = "unknown node '" + id + "'";
      return false;
    }
    out.push_back(v);
  }
  if (out.empty()) error = "no node given";
  return !out.empty();
}

void print_arcs(const Network& net, const std::vector<double>& flow, bool all, const Tolerance& tol) {
  TextTable t({"arc", "from", "to", "flow", "capacity", "utilisation"});
  for (int a = 0; a < net.arc_count(); ++a) {
    if (!all && tol.zero(flow[a])) continue;
    const Arc& arc = net.arcs[a];
    const double util = arc.capacity > 0 ? 100.0 * std::abs(flow[a]) / arc.capacity : 0.0;
    std::ostringstream u;
    u.precision(1);
    u << std::fixed << util << "%";
    t.add({arc.id, net.nodes[arc.from].id, net.nodes[arc.to].id, format_number(flow[a]), format_number(arc.capacity),
           u.str()});
  }
  t.print(std::cout);
}

void print_paths(const Network& net, const FlowGraph& g, const std::vector<double>& flow, const Tolerance& tol) {
  FlowDecomposition d = decompose_flow(g, flow, tol);
  TextTable t({"path", "amount", "nodes"});
  int i = 0;
  for (const FlowPiece& p : d.paths) {
    std::string nodes;
    for (int v : p.nodes) nodes += (nodes.empty() ? "" : " > ") + net.nodes[v].id;
    t.add({"p" + std::to_string(++i), format_number(p.amount), nodes});
  }
  for (const FlowPiece& c : d.cycles) {
    std::string nodes;
    for (int v : c.nodes) nodes += net.nodes[v].id + " > ";
    t.add({"cycle", format_number(c.amount), nodes + net.nodes[c.nodes[0]].id});
  }
  std::cout << '\n';
  t.print(std::cout);
}

void print_check(const FlowCheck& c) {
  std::cout << "\nchecked: " << (c.ok ? "ok" : "FAILED") << " (largest capacity violation "
            << format_number(c.max_capacity_violation) << ", largest conservation violation "
            << format_number(c.max_conservation_violation) << ")\n";
  if (!c.ok) std::cout << "checker: " << c.worst << '\n';
}

bool write_outputs(const Args& args, const OutputGuard& guard, const std::string& json, const std::string& csv) {
  std::string error;
  if (auto p = args.get("json"); p && !guard.write(*p, json, error)) {
    std::cerr << "apportion: " << error << '\n';
    return false;
  }
  if (auto p = args.get("csv"); p && !guard.write(*p, csv, error)) {
    std::cerr << "apportion: " << error << '\n';
    return false;
  }
  return true;
}

Args parse_flow_args(int argc, char** argv, std::initializer_list<std::string> extra) {
  std::set<std::string> valued = kLoaderOptions;
  valued.insert({"demand", "from", "to", "json", "csv"});
  valued.insert(extra);
  return parse_args(argc, argv, 2, valued, {"help", "paths", "all-arcs"});
}

}  // namespace

int run_max_flow(int argc, char** argv) {
  const bool cut_first = std::string(argv[1]) == "mincut";
  Args args = parse_flow_args(argc, argv, {});
  if (args.has("help")) return std::cout << kMaxFlowHelp, kExitOk;
  if (usage_error(args, argv[1], 1, kMaxFlowHelp)) return kExitBadInput;
  OutputGuard guard;
  const std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  const Network& net = *loaded;

  std::vector<int> sources, sinks;
  std::string error;
  if (args.get("from") || args.get("to")) {
    if (!resolve_nodes(net, args.get("from").value_or(""), sources, error) ||
        !resolve_nodes(net, args.get("to").value_or(""), sinks, error)) {
      std::cerr << "apportion: --from/--to: " << error << '\n';
      return kExitBadInput;
    }
  } else {
    int k = args.get("demand") ? net.find_demand(*args.get("demand")) : (net.demands.empty() ? -1 : 0);
    if (k < 0) {
      std::cerr << "apportion: no demand to take the terminals from; use --demand ID or --from/--to\n";
      return kExitBadInput;
    }
    sources = {net.demands[k].origin};
    sinks = {net.demands[k].destination};
  }

  const FlowGraph g = FlowGraph::from_network(net);
  const MaxFlowResult res = max_flow(g, sources, sinks);
  if (res.status != SolveStatus::kOptimal) {
    std::cerr << "apportion: " << status_name(res.status) << ": " << res.message << '\n';
    return kExitBadInput;
  }
  const Tolerance tol = Tolerance::for_scale(net.magnitude());
  auto print_cut = [&] {
    std::cout << "minimum cut: capacity " << format_number(res.cut_capacity) << ", " << res.cut_arcs.size()
              << " arc(s)\n";
    TextTable t({"cut arc", "from", "to", "capacity"});
    for (int a : res.cut_arcs)
      t.add({net.arcs[a].id, net.nodes[net.arcs[a].from].id, net.nodes[net.arcs[a].to].id,
             format_number(net.arcs[a].capacity)});
    t.print(std::cout);
    std::string side;
    for (int v = 0; v < net.node_count(); ++v)
      if (res.source_side[v]) side += (side.empty() ? "" : ", ") + net.nodes[v].id;
    std::cout << "source side: {" << side << "}\n";
  };
  std::cout << "maximum flow: " << format_number(res.value) << (net.units.capacity.empty() ? "" : " " + net.units.capacity)
            << "\n\n";
  if (cut_first) print_cut(), std::cout << '\n';
  print_arcs(net, res.flow, args.has("all-arcs"), tol);
  if (!cut_first) std::cout << '\n', print_cut();
  if (args.has("paths")) print_paths(net, g, res.flow, tol);
  print_check(res.check);
  std::cout << '\n' << kPlanningCaution << '\n';
  if (!write_outputs(args, guard, max_flow_json(net, sources, sinks, res), arc_flow_csv(net, res.flow, &res.cut_arcs)))
    return kExitBadInput;
  return res.check.ok ? kExitOk : kExitBadInput;
}

int run_min_cost_flow(int argc, char** argv) {
  Args args = parse_flow_args(argc, argv, {"amount"});
  if (args.has("help")) return std::cout << kMinCostHelp, kExitOk;
  if (usage_error(args, "mincost", 1, kMinCostHelp)) return kExitBadInput;
  OutputGuard guard;
  const std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  const Network& net = *loaded;

  std::vector<double> supply(net.node_count(), 0.0);
  bool has_supplies = false;
  for (int v = 0; v < net.node_count(); ++v) supply[v] = net.nodes[v].supply, has_supplies |= supply[v] != 0;
  std::string what = "node supplies";
  if (args.get("from") || args.get("to") || args.get("amount")) {
    const int s = net.find_node(args.get("from").value_or("")), t = net.find_node(args.get("to").value_or(""));
    auto amount = args.get("amount") ? parse_number(*args.get("amount")) : std::nullopt;
    if (s < 0 || t < 0 || !amount || *amount < 0) {
      std::cerr << "apportion mincost: --from, --to and --amount need two known nodes and a number >= 0\n";
      return kExitBadInput;
    }
    std::fill(supply.begin(), supply.end(), 0.0);
    supply[s] += *amount, supply[t] -= *amount;
    what = format_number(*amount) + " from " + net.nodes[s].id + " to " + net.nodes[t].id;
  } else if (args.get("demand") || !has_supplies) {
    int k = -1;
    if (args.get("demand")) {
      k = net.find_demand(*args.get("demand"));
    } else {
      for (int i = 0; i < static_cast<int>(net.demands.size()) && k < 0; ++i)
        if (net.demands[i].amount) k = i;
    }
    if (k < 0 || !net.demands[k].amount) {
      std::cerr << "apportion mincost: no supplies and no demand with an amount; use --demand or --from/--to/--amount\n";
      return kExitBadInput;
    }
    const Demand& d = net.demands[k];
    std::fill(supply.begin(), supply.end(), 0.0);
    supply[d.origin] += *d.amount, supply[d.destination] -= *d.amount;
    what = "demand " + d.id + ": " + format_number(*d.amount) + " from " + net.nodes[d.origin].id + " to " +
           net.nodes[d.destination].id;
  }

  const FlowGraph g = FlowGraph::from_network(net);
  const MinCostFlowResult res = min_cost_flow(g, supply);
  std::cout << "min-cost flow for " << what << ": " << status_name(res.status) << '\n';
  if (res.status != SolveStatus::kOptimal) {
    std::cerr << "apportion mincost: " << res.message << '\n';
    write_outputs(args, guard, min_cost_flow_json(net, res), "");
    return res.status == SolveStatus::kBadInput ? kExitBadInput : kExitNoSolution;
  }
  const Tolerance tol = Tolerance::for_scale(net.magnitude());
  std::cout << "total cost: " << format_number(res.cost) << (net.units.cost.empty() ? "" : " " + net.units.cost)
            << "\n\n";
  print_arcs(net, res.flow, args.has("all-arcs"), tol);
  TextTable pt({"node", "potential"});
  for (int v = 0; v < net.node_count(); ++v) pt.add({net.nodes[v].id, format_number(res.potential[v])});
  std::cout << '\n';
  pt.print(std::cout);
  if (args.has("paths")) print_paths(net, g, res.flow, tol);
  print_check(res.check);
  std::cout << '\n' << kPlanningCaution << '\n';
  if (!write_outputs(args, guard, min_cost_flow_json(net, res), arc_flow_csv(net, res.flow, nullptr)))
    return kExitBadInput;
  return res.check.ok ? kExitOk : kExitBadInput;
}

}  // namespace apportion::cli
