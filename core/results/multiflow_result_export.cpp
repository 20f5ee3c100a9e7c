// JSON and CSV files of fair-multiflow results; see multiflow_result_export.h.
#include "apportion/results/multiflow_result_export.h"

#include <cmath>
#include <nlohmann/json.hpp>

#include "apportion/formats/csv_table.h"
#include "apportion/model/number_text.h"
#include "apportion/results/flow_result_export.h"

namespace apportion {

using nlohmann::json;

namespace {
json node_ids(const Network& net, const std::vector<int>& v) {
  json out = json::array();
  for (int i : v) out.push_back(net.nodes[i].id);
  return out;
}
json arc_ids(const Network& net, const std::vector<int>& v) {
  json out = json::array();
  for (int i : v) out.push_back(net.arcs[i].id);
  return out;
}
std::string joined_arcs(const Network& net, const std::vector<int>& v) {
  std::string s;
  for (int a : v) s += (s.empty() ? "" : " ") + net.arcs[a].id;
  return s;
}
// JSON has no infinity: absent values are written as null.
json number_or_null(double v, bool present) { return present && std::isfinite(v) ? json(v) : json(nullptr); }
// Per-demand bounds are written when a certificate ran to the end (fair_certificate.h).
bool certified(const MultiflowResult& r) {
  return r.fairness.status == SolveStatus::kOptimal && r.fairness.lower.size() == r.demands.size();
}
}  // namespace

std::string multiflow_json(const Network& net, const MultiflowResult& r) {
  json root = {{"format", "apportion-result"}, {"version", 1}, {"problem", "fair-multiflow"},
               {"objective", objective_name(r.objective)}, {"status", status_name(r.status)}};
  root["network"] = net.name;
  root["caution"] = kPlanningCaution;
  if (r.status != SolveStatus::kOptimal) {
    root["message"] = r.message;
    return root.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
  }
  root["totals"] = {{"throughput", r.throughput},
                    {"min_normalised_share", r.min_normalised_share},
                    {"jain_index", r.jain_index},
                    {"max_throughput", number_or_null(r.max_throughput, r.max_throughput >= 0)},
                    {"price_of_fairness", number_or_null(r.price_of_fairness, r.price_of_fairness >= 0)},
                    {"lambda", number_or_null(r.lambda, r.lambda >= 0)}};
  if (r.objective == FairObjective::kFeasibility) {
    json lengths = json::object();
    for (int a = 0; a < net.arc_count() && a < static_cast<int>(r.dual_lengths.size()); ++a)
      if (r.dual_lengths[a] > 0) lengths[net.arcs[a].id] = r.dual_lengths[a];
    json f = {{"all_demands_met", r.all_demands_met},
              {"shortfall", r.shortfall},
              {"certificate", {{"dual_lengths", lengths},
                               {"capacity_times_length", r.certificate_capacity},
                               {"amount_times_distance", r.certificate_demand}}}};
    if (!r.overloaded_cut_source_side.empty())
      f["overloaded_cut"] = {{"source_side", node_ids(net, r.overloaded_cut_source_side)},
                             {"capacity", r.overloaded_cut_capacity},
                             {"demand", r.overloaded_cut_demand}};
    root["feasibility"] = f;
  }
  json tiers = json::array();
  for (const Tier& t : r.tiers) {
    json ds = json::array();
    for (int k : t.demands) ds.push_back(net.demands[k].id);
    tiers.push_back({{"index", t.index}, {"level", t.level}, {"demands", ds}, {"binding_arcs", arc_ids(net, t.binding_arcs)}});
  }
  root["tiers"] = tiers;
  json demands = json::array();
  for (std::size_t k = 0; k < r.demands.size(); ++k) {
    const Demand& d = net.demands[k];
    const DemandShare& s = r.demands[k];
    json paths = json::array();
    for (const PathShare& p : s.paths)
      paths.push_back({{"nodes", node_ids(net, p.nodes)}, {"arcs", arc_ids(net, p.arcs)}, {"amount", p.amount}});
    json o = {{"id", d.id},
              {"origin", net.nodes[d.origin].id},
              {"destination", net.nodes[d.destination].id},
              {"amount", d.amount ? json(*d.amount) : json("max")},
              {"weight", d.weight},
              {"share", s.share},
              {"percent_of_amount", number_or_null(s.percent_of_amount, s.percent_of_amount >= 0)},
              {"normalised", s.normalised},
              {"tier", s.tier},
              {"limited_by_amount", s.limited_by_amount},
              {"binding_arcs", arc_ids(net, s.binding_arcs)},
              {"binding_arcs_form_cut", s.binding_arcs_form_cut},
              {"cut_source_side", node_ids(net, s.cut_source_side)},
              {"paths", paths}};
    if (!d.label.empty()) o["label"] = d.label;
    if (certified(r))
      o["fair_share_bounds"] = {{"lower", r.fairness.lower[k]},
                                {"upper", number_or_null(r.fairness.upper[k], true)},
                                {"error", number_or_null(r.fairness.error[k], true)}};
    demands.push_back(std::move(o));
  }
  root["demands"] = demands;
  json arcs = json::array();
  for (int a = 0; a < net.arc_count() && a < static_cast<int>(r.arcs.size()); ++a) {
    const ArcLoad& l = r.arcs[a];
    json per = json::object();
    for (auto [k, f] : l.per_demand) per[net.demands[k].id] = f;
    arcs.push_back({{"id", net.arcs[a].id}, {"capacity", net.arcs[a].enabled ? net.arcs[a].capacity : 0.0},
                    {"load", l.load}, {"utilisation", l.utilisation}, {"shadow_price", l.shadow_price},
                    {"tier", l.tier}, {"per_demand", per}});
  }
  root["arcs"] = arcs;
  root["check"] = {{"ok", r.check.ok},
                   {"max_capacity_violation", r.check.max_capacity_violation},
                   {"max_conservation_violation", r.check.max_conservation_violation},
                   {"max_share_error", r.check.max_share_error}};
  if (r.fairness.status != SolveStatus::kNotSolved) {
    const FairnessCertificate& c = r.fairness;
    json f = {{"status", status_name(c.status)},
              {"max_error", number_or_null(c.max_error, certified(r))},
              {"max_relative_error", number_or_null(c.max_relative_error, certified(r))},
              {"worst_demand", c.worst_demand >= 0 ? json(net.demands[c.worst_demand].id) : json(nullptr)},
              {"levels", c.levels},
              {"witness_tolerance", c.witness_tolerance},
              {"lp_solves", c.stats.lp_solves},
              {"simplex_iterations", c.stats.simplex_iterations},
              {"seconds", c.seconds}};
    if (!c.message.empty()) f["message"] = c.message;
    root["fairness_certificate"] = f;
  }
  root["stats"] = {{"lp_solves", r.stats.lp_solves}, {"simplex_iterations", r.stats.simplex_iterations},
                   {"pricing_rounds", r.stats.pricing_rounds}, {"path_columns", r.stats.path_columns},
                   {"paths_dropped", r.stats.paths_dropped}, {"saturation_tests", r.stats.saturation_tests},
                   {"amount_tests", r.stats.amount_tests}};
  return root.dump(2, ' ', false, nlohmann::json::error_handler_t::replace) + "\n";
}

std::string multiflow_demands_csv(const Network& net, const MultiflowResult& r) {
  std::vector<CsvRow> rows{{"id", "label", "origin", "destination", "amount", "weight", "share", "percent_of_amount",
                            "normalised", "tier", "limited_by_amount", "binding_arcs"}};
  if (certified(r)) rows[0].insert(rows[0].end(), {"fair_share_lower", "fair_share_upper", "fair_share_error"});
  for (std::size_t k = 0; k < r.demands.size(); ++k) {
    const Demand& d = net.demands[k];
    const DemandShare& s = r.demands[k];
    rows.push_back({d.id, d.label, net.nodes[d.origin].id, net.nodes[d.destination].id,
                    d.amount ? format_number(*d.amount) : "max", format_number(d.weight), format_number(s.share),
                    s.percent_of_amount >= 0 ? format_number(s.percent_of_amount) : "", format_number(s.normalised),
                    std::to_string(s.tier), s.limited_by_amount ? "true" : "false", joined_arcs(net, s.binding_arcs)});
    if (certified(r)) {
      const FairnessCertificate& c = r.fairness;
      auto text = [](double v) { return std::isfinite(v) ? format_number(v) : std::string(); };
      rows.back().insert(rows.back().end(), {text(c.lower[k]), text(c.upper[k]), text(c.error[k])});
    }
  }
  return write_csv(rows);
}

std::string multiflow_arcs_csv(const Network& net, const MultiflowResult& r) {
  std::vector<CsvRow> rows{{"id", "from", "to", "capacity", "load", "utilisation", "shadow_price", "tier"}};
  for (int a = 0; a < net.arc_count() && a < static_cast<int>(r.arcs.size()); ++a) {
    const Arc& arc = net.arcs[a];
    const ArcLoad& l = r.arcs[a];
    rows.push_back({arc.id, net.nodes[arc.from].id, net.nodes[arc.to].id, format_number(arc.enabled ? arc.capacity : 0.0),
                    format_number(l.load), format_number(l.utilisation), format_number(l.shadow_price),
                    std::to_string(l.tier)});
  }
  return write_csv(rows);
}

std::string multiflow_paths_csv(const Network& net, const MultiflowResult& r) {
  std::vector<CsvRow> rows{{"demand", "path", "amount", "nodes"}};
  for (std::size_t k = 0; k < r.demands.size(); ++k) {
    int i = 0;
    for (const PathShare& p : r.demands[k].paths) {
      std::string nodes;
      for (int v : p.nodes) nodes += (nodes.empty() ? "" : " ") + net.nodes[v].id;
      rows.push_back({net.demands[k].id, std::to_string(++i), format_number(p.amount), nodes});
    }
  }
  return write_csv(rows);
}

}  // namespace apportion
