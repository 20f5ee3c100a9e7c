// JSON and CSV files for single-commodity results; see flow_result_export.h.
#include "apportion/results/flow_result_export.h"

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>

#include "apportion/formats/csv_table.h"
#include "apportion/model/number_text.h"

namespace apportion {

using nlohmann::json;

const char* const kPlanningCaution =
    "Apportion is a planning aid. Results for safety-critical uses (evacuation, emergency supply, "
    "critical infrastructure) need review by qualified engineers under local codes and licensed practice.";

namespace {

json arc_rows(const Network& net, const std::vector<double>& flow) {
  json arcs = json::array();
  for (int a = 0; a < net.arc_count() && a < static_cast<int>(flow.size()); ++a) {
    const Arc& arc = net.arcs[a];
    json o = {{"id", arc.id}, {"flow", flow[a]}, {"capacity", arc.capacity}};
    o["utilisation"] = arc.capacity > 0 ? std::abs(flow[a]) / arc.capacity : 0.0;
    arcs.push_back(std::move(o));
  }
  return arcs;
}

json check_json(const FlowCheck& c) {
  return {{"ok", c.ok},
          {"max_capacity_violation", c.max_capacity_violation},
          {"max_conservation_violation", c.max_conservation_violation},
          {"value_error", c.value_error}};
}

json ids(const Network& net, const std::vector<int>& nodes) {
  json out = json::array();
  for (int v : nodes) out.push_back(net.nodes[v].id);
  return out;
}

}  // namespace

std::string max_flow_json(const Network& net, const std::vector<int>& sources, const std::vector<int>& sinks,
                          const MaxFlowResult& r) {
  json root = {{"format", "apportion-result"}, {"version", 1}, {"problem", "max-flow"}, {"status", status_name(r.status)}};
  root["network"] = net.name;
  root["sources"] = ids(net, sources);
  root["sinks"] = ids(net, sinks);
  root["caution"] = kPlanningCaution;
  if (r.status == SolveStatus::kOptimal) {
    root["value"] = r.value;
    root["arcs"] = arc_rows(net, r.flow);
    std::vector<int> side;
    for (int v = 0; v < net.node_count(); ++v)
      if (r.source_side[v]) side.push_back(v);
    json cut_arcs = json::array();
    for (int a : r.cut_arcs) cut_arcs.push_back(net.arcs[a].id);
    root["min_cut"] = {{"source_side", ids(net, side)}, {"arcs", cut_arcs}, {"capacity", r.cut_capacity}};
    root["check"] = check_json(r.check);
  } else {
    root["message"] = r.message;
  }
  return root.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
}

std::string min_cost_flow_json(const Network& net, const MinCostFlowResult& r) {
  json root = {{"format", "apportion-result"}, {"version", 1}, {"problem", "min-cost-flow"}, {"status", status_name(r.status)}};
  root["network"] = net.name;
  root["caution"] = kPlanningCaution;
  if (r.status == SolveStatus::kOptimal) {
    root["cost"] = r.cost;
    json arcs = arc_rows(net, r.flow);
    for (int a = 0; a < net.arc_count(); ++a) arcs[a]["unit_cost"] = net.arcs[a].cost.value_or(0.0);
    root["arcs"] = std::move(arcs);
    json pot = json::object();
    for (int v = 0; v < net.node_count(); ++v) pot[net.nodes[v].id] = r.potential[v];
    root["potentials"] = std::move(pot);
    root["check"] = check_json(r.check);
  } else {
    root["message"] = r.message;
  }
  return root.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
}

std::string arc_flow_csv(const Network& net, const std::vector<double>& flow, const std::vector<int>* cut_arcs) {
  std::vector<CsvRow> rows{{"id", "from", "to", "capacity", "flow", "utilisation", "unit_cost"}};
  if (cut_arcs) rows[0].push_back("in_min_cut");
  for (int a = 0; a < net.arc_count() && a < static_cast<int>(flow.size()); ++a) {
    const Arc& arc = net.arcs[a];
    CsvRow row{arc.id, net.nodes[arc.from].id, net.nodes[arc.to].id, format_number(arc.capacity), format_number(flow[a]),
               format_number(arc.capacity > 0 ? std::abs(flow[a]) / arc.capacity : 0.0),
               arc.cost ? format_number(*arc.cost) : ""};
    if (cut_arcs) row.push_back(std::find(cut_arcs->begin(), cut_arcs->end(), a) != cut_arcs->end() ? "true" : "false");
    rows.push_back(std::move(row));
  }
  return write_csv(rows);
}

}  // namespace apportion
