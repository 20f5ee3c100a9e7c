// Fair-multiflow result files read back; see multiflow_result_import.h.
#include "apportion/results/multiflow_result_import.h"

#include <algorithm>
#include <limits>
#include <nlohmann/json.hpp>
#include <unordered_map>

namespace apportion {

using nlohmann::json;

namespace {

// Type-checked look-ups: nlohmann's value() aborts on a wrong type when exceptions are off,
// and a result file may come from anywhere.
const json& member(const json& o, const char* key, const json& fallback) {
  if (!o.is_object()) return fallback;
  auto it = o.find(key);
  return it != o.end() && it->type() == fallback.type() ? *it : fallback;
}
const json kNoObject = json::object();
const json kNoArray = json::array();
const json kNoString = "";
std::string text_of(const json& o, const char* key) { return member(o, key, kNoString).get<std::string>(); }
template <class Int>
Int count_of(const json& o, const char* key) {
  if (!o.is_object()) return 0;
  auto it = o.find(key);
  return it != o.end() && it->is_number_integer() ? it->get<Int>() : 0;
}

struct Reader {
  const Network& net;
  std::string error;
  std::unordered_map<std::string, int> nodes, arcs, demands;

  explicit Reader(const Network& n) : net(n) {
    for (int v = 0; v < n.node_count(); ++v) nodes.emplace(n.nodes[v].id, v);
    for (int a = 0; a < n.arc_count(); ++a) arcs.emplace(n.arcs[a].id, a);
    for (std::size_t k = 0; k < n.demands.size(); ++k) demands.emplace(n.demands[k].id, static_cast<int>(k));
  }
  bool fail(const std::string& what) {
    if (error.empty()) error = what;
    return false;
  }
  // A number, or `absent` for null or a missing key.
  bool number(const json& o, const char* key, double& out, double absent) {
    if (!o.is_object()) return fail("an entry is not an object");
    auto it = o.find(key);
    if (it == o.end() || it->is_null()) return out = absent, true;
    if (!it->is_number()) return fail(std::string("'") + key + "' is not a number");
    out = it->get<double>();
    return true;
  }
  bool integer(const json& o, const char* key, int& out) {
    if (!o.is_object()) return fail("an entry is not an object");
    auto it = o.find(key);
    if (it == o.end() || !it->is_number_integer()) return fail(std::string("'") + key + "' is not an integer");
    out = it->get<int>();
    return true;
  }
  bool boolean(const json& o, const char* key, bool& out) {
    if (!o.is_object()) return fail("an entry is not an object");
    auto it = o.find(key);
    if (it == o.end() || !it->is_boolean()) return fail(std::string("'") + key + "' is not true or false");
    out = it->get<bool>();
    return true;
  }
  bool ids(const json& o, const char* key, const std::unordered_map<std::string, int>& index, std::vector<int>& out) {
    out.clear();
    if (!o.is_object()) return fail("an entry is not an object");
    auto it = o.find(key);
    if (it == o.end()) return true;
    if (!it->is_array()) return fail(std::string("'") + key + "' is not a list");
    for (const json& id : *it) {
      auto found = id.is_string() ? index.find(id.get<std::string>()) : index.end();
      if (found == index.end()) return fail(std::string("'") + key + "' names an item this network does not have");
      out.push_back(found->second);
    }
    return true;
  }
};

}  // namespace

std::optional<MultiflowResult> read_multiflow_json(const Network& net, const std::string& text, std::string& error) {
  json root = json::parse(text, nullptr, false);
  Reader rd(net);
  auto give_up = [&](const std::string& what) -> std::optional<MultiflowResult> {
    error = "not a result of this network: " + what;
    return std::nullopt;
  };
  if (root.is_discarded() || !root.is_object()) return give_up("the text is not a JSON object");
  if (text_of(root, "format") != "apportion-result" || text_of(root, "problem") != "fair-multiflow")
    return give_up("it is not an Apportion fair-multiflow result");
  MultiflowResult r;
  const std::string objective = text_of(root, "objective");
  if (!objective_from_name(objective, r.objective)) return give_up("unknown objective '" + objective + "'");
  const std::string status = text_of(root, "status");
  if (!status_from_name(status, r.status)) return give_up("unknown status '" + status + "'");
  if (r.status != SolveStatus::kOptimal) {
    r.message = text_of(root, "message");
    return r;
  }

  const json& totals = member(root, "totals", kNoObject);
  if (!rd.number(totals, "throughput", r.throughput, 0) ||
      !rd.number(totals, "min_normalised_share", r.min_normalised_share, 0) ||
      !rd.number(totals, "jain_index", r.jain_index, 0) || !rd.number(totals, "max_throughput", r.max_throughput, -1) ||
      !rd.number(totals, "price_of_fairness", r.price_of_fairness, -1) || !rd.number(totals, "lambda", r.lambda, -1))
    return give_up(rd.error);

  if (auto f = root.find("feasibility"); f != root.end() && f->is_object()) {
    const json& cert = member(*f, "certificate", kNoObject);
    if (!rd.boolean(*f, "all_demands_met", r.all_demands_met) || !rd.number(*f, "shortfall", r.shortfall, 0) ||
        !rd.number(cert, "capacity_times_length", r.certificate_capacity, 0) ||
        !rd.number(cert, "amount_times_distance", r.certificate_demand, 0))
      return give_up(rd.error);
    r.dual_lengths.assign(net.arc_count(), 0.0);
    for (auto& [id, value] : member(cert, "dual_lengths", kNoObject).items()) {
      auto a = rd.arcs.find(id);
      if (a == rd.arcs.end() || !value.is_number()) return give_up("a dual length names an unknown arc");
      r.dual_lengths[a->second] = value.get<double>();
    }
    if (auto cut = f->find("overloaded_cut"); cut != f->end()) {
      if (!rd.ids(*cut, "source_side", rd.nodes, r.overloaded_cut_source_side) ||
          !rd.number(*cut, "capacity", r.overloaded_cut_capacity, 0) || !rd.number(*cut, "demand", r.overloaded_cut_demand, 0))
        return give_up(rd.error);
    }
  }

  for (const json& t : member(root, "tiers", kNoArray)) {
    Tier tier;
    if (!rd.integer(t, "index", tier.index) || !rd.number(t, "level", tier.level, 0) ||
        !rd.ids(t, "demands", rd.demands, tier.demands) || !rd.ids(t, "binding_arcs", rd.arcs, tier.binding_arcs))
      return give_up(rd.error);
    r.tiers.push_back(std::move(tier));
  }

  const json& demands = member(root, "demands", kNoArray);
  if (demands.size() != net.demands.size()) return give_up("it has a different number of demands");
  r.demands.resize(net.demands.size());
  for (std::size_t k = 0; k < demands.size(); ++k) {
    const json& o = demands[k];
    if (text_of(o, "id") != net.demands[k].id) return give_up("demand " + std::to_string(k + 1) + " has another id");
    DemandShare& s = r.demands[k];
    if (!rd.number(o, "share", s.share, 0) || !rd.number(o, "percent_of_amount", s.percent_of_amount, -1) ||
        !rd.number(o, "normalised", s.normalised, 0) || !rd.integer(o, "tier", s.tier) ||
        !rd.boolean(o, "limited_by_amount", s.limited_by_amount) || !rd.ids(o, "binding_arcs", rd.arcs, s.binding_arcs) ||
        !rd.boolean(o, "binding_arcs_form_cut", s.binding_arcs_form_cut) ||
        !rd.ids(o, "cut_source_side", rd.nodes, s.cut_source_side))
      return give_up(rd.error);
    for (const json& p : member(o, "paths", kNoArray)) {
      PathShare path;
      if (!rd.ids(p, "nodes", rd.nodes, path.nodes) || !rd.ids(p, "arcs", rd.arcs, path.arcs) ||
          !rd.number(p, "amount", path.amount, 0))
        return give_up(rd.error);
      s.paths.push_back(std::move(path));
    }
  }

  const json& arcs = member(root, "arcs", kNoArray);
  if (arcs.size() != net.arcs.size()) return give_up("it has a different number of arcs");
  r.arcs.resize(net.arcs.size());
  for (std::size_t a = 0; a < arcs.size(); ++a) {
    const json& o = arcs[a];
    if (text_of(o, "id") != net.arcs[a].id) return give_up("arc " + std::to_string(a + 1) + " has another id");
    ArcLoad& l = r.arcs[a];
    if (!rd.number(o, "load", l.load, 0) || !rd.number(o, "utilisation", l.utilisation, 0) ||
        !rd.number(o, "shadow_price", l.shadow_price, 0) || !rd.integer(o, "tier", l.tier))
      return give_up(rd.error);
    for (auto& [id, value] : member(o, "per_demand", kNoObject).items()) {
      auto k = rd.demands.find(id);
      if (k == rd.demands.end() || !value.is_number()) return give_up("an arc load names an unknown demand");
      l.per_demand.emplace_back(k->second, value.get<double>());
    }
    std::sort(l.per_demand.begin(), l.per_demand.end());
  }

  const json& check = member(root, "check", kNoObject);
  if (!rd.boolean(check, "ok", r.check.ok) ||
      !rd.number(check, "max_capacity_violation", r.check.max_capacity_violation, 0) ||
      !rd.number(check, "max_conservation_violation", r.check.max_conservation_violation, 0) ||
      !rd.number(check, "max_share_error", r.check.max_share_error, 0))
    return give_up(rd.error);
  // The fairness certificate, when the result carries one (apportion fair --certify).
  if (auto f = root.find("fairness_certificate"); f != root.end() && f->is_object()) {
    FairnessCertificate& c = r.fairness;
    const std::string status = text_of(*f, "status");
    if (!status_from_name(status, c.status)) return give_up("the fairness certificate's status is not known");
    c.message = text_of(*f, "message");
    const std::string worst = text_of(*f, "worst_demand");
    if (auto k = rd.demands.find(worst); k != rd.demands.end()) c.worst_demand = k->second;
    if (!rd.number(*f, "max_error", c.max_error, 0) || !rd.number(*f, "max_relative_error", c.max_relative_error, 0) ||
        !rd.number(*f, "witness_tolerance", c.witness_tolerance, 0) || !rd.number(*f, "seconds", c.seconds, 0))
      return give_up(rd.error);
    c.levels = count_of<int>(*f, "levels");
    c.stats.lp_solves = count_of<int>(*f, "lp_solves");
    c.stats.simplex_iterations = count_of<long long>(*f, "simplex_iterations");
    if (c.status == SolveStatus::kOptimal) {
      const double inf = std::numeric_limits<double>::infinity();
      c.lower.assign(net.demands.size(), 0.0), c.upper.assign(net.demands.size(), inf);
      c.error.assign(net.demands.size(), inf);
      for (std::size_t k = 0; k < demands.size(); ++k) {
        const json& b = member(demands[k], "fair_share_bounds", kNoObject);
        if (!rd.number(b, "lower", c.lower[k], 0) || !rd.number(b, "upper", c.upper[k], inf) ||
            !rd.number(b, "error", c.error[k], inf))
          return give_up(rd.error);
      }
    }
  }
  const json& stats = member(root, "stats", kNoObject);
  r.stats.lp_solves = count_of<int>(stats, "lp_solves");
  r.stats.simplex_iterations = count_of<long long>(stats, "simplex_iterations");
  r.stats.pricing_rounds = count_of<int>(stats, "pricing_rounds");
  r.stats.path_columns = count_of<int>(stats, "path_columns");
  r.stats.paths_dropped = count_of<int>(stats, "paths_dropped");
  r.stats.saturation_tests = count_of<int>(stats, "saturation_tests");
  r.stats.amount_tests = count_of<int>(stats, "amount_tests");
  return r;
}

}  // namespace apportion
