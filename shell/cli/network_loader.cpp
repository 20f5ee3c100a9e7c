// Format detection and loading for the command line; see network_loader.h.
#include "network_loader.h"

#include <iostream>

#include "apportion/formats/network_csv.h"
#include "apportion/formats/network_dimacs.h"
#include "apportion/formats/network_graphml.h"
#include "apportion/formats/network_json.h"
#include "apportion/model/number_text.h"

namespace apportion::cli {

namespace {
bool ends_with(const std::string& s, const std::string& suffix) {
  return s.size() >= suffix.size() && s.compare(s.size() - suffix.size(), suffix.size(), suffix) == 0;
}

std::string detect_format(const std::string& path) {
  if (ends_with(path, ".json")) return "json";
  if (ends_with(path, ".graphml") || ends_with(path, ".xml")) return "graphml";
  if (ends_with(path, ".max") || ends_with(path, ".min") || ends_with(path, ".dimacs")) return "dimacs";
  if (ends_with(path, ".csv")) return "csv";
  return "";
}
}  // namespace

LoadResult load_network(const std::string& path, const Args& args, OutputGuard& guard) {
  LoadResult failed;
  const std::string format = args.get("format").value_or(detect_format(path));
  std::string text, error;
  if (format == "csv") {
    std::string base = path;
    for (const char* suffix : {".nodes.csv", ".arcs.csv", ".demands.csv", ".csv"})
      if (ends_with(base, suffix)) {
        base.resize(base.size() - std::string(suffix).size());
        break;
      }
    NetworkCsv tables;
    for (auto [suffix, slot] : {std::pair{".nodes.csv", &tables.nodes}, std::pair{".arcs.csv", &tables.arcs},
                                std::pair{".demands.csv", &tables.demands}}) {
      const std::string file = base + suffix;
      if (!read_file(file, *slot, error)) {
        if (slot == &tables.demands) continue;  // a topology may come without demands
        failed.diagnostics.error("file", file, "", error);
        return failed;
      }
      guard.protect(file);
    }
    return read_network_csv(tables);
  }
  if (!read_file(path, text, error)) {
    failed.diagnostics.error("file", path, "", error);
    return failed;
  }
  guard.protect(path);
  if (format == "json") return read_network_json(text);
  if (format == "dimacs") return read_dimacs(text);
  if (format == "graphml") {
    GraphmlOptions opt;
    if (auto a = args.get("capacity-attribute")) opt.capacity_attribute = *a;
    if (auto c = args.get("default-capacity")) {
      auto v = parse_number(*c);
      if (!v || *v < 0) {
        failed.diagnostics.error("option", "--default-capacity", "", "'" + *c + "' is not a non-negative number");
        return failed;
      }
      opt.default_capacity = *v;
    }
    if (auto u = args.get("undirected")) {
      if (*u != "shared" && *u != "pairs") {
        failed.diagnostics.error("option", "--undirected", "", "must be 'shared' or 'pairs'");
        return failed;
      }
      opt.undirected_as_pairs = *u == "pairs";
    }
    if (auto u = args.get("unit")) opt.capacity_unit = *u;
    if (auto from = args.get("attribute-unit")) {
      if (opt.capacity_unit.empty()) opt.capacity_unit = "Gbit/s";
      const double f = link_speed_factor(*from), to = link_speed_factor(opt.capacity_unit);
      if (f == 0 || to == 0) {
        failed.diagnostics.error("option", f == 0 ? "--attribute-unit" : "--unit", "",
                                 "'" + (f == 0 ? *from : opt.capacity_unit) +
                                     "' is not a link speed unit (bit/s, kbit/s, Mbit/s, Gbit/s, Tbit/s)");
        return failed;
      }
      opt.capacity_scale = f / to;
    }
    if (auto l = args.get("length-as")) {
      if (*l != "cost" && *l != "transit") {
        failed.diagnostics.error("option", "--length-as", "", "must be 'cost' or 'transit'");
        return failed;
      }
      opt.length_as = *l == "cost" ? GraphmlOptions::Length::kCost : GraphmlOptions::Length::kTransit;
    }
    if (auto sp = args.get("speed")) {
      auto v = parse_number(*sp);
      if (!v || !(*v > 0)) {
        failed.diagnostics.error("option", "--speed", "", "'" + *sp + "' is not a number > 0");
        return failed;
      }
      opt.speed = *v;
    }
    return read_graphml(text, opt);
  }
  failed.diagnostics.error("file", path, "", format.empty() ? "unknown file type; use --format json|csv|dimacs|graphml"
                                                           : "unknown format '" + format + "'");
  return failed;
}

void print_diagnostics(const Diagnostics& d) {
  for (const Diagnostic& x : d.items) std::cerr << x.to_string() << '\n';
}

std::optional<Network> load_for_command(const Args& args, OutputGuard& guard) {
  LoadResult r = load_network(args.positional[0], args, guard);
  print_diagnostics(r.diagnostics);
  return std::move(r.network);
}

bool usage_error(const Args& args, const std::string& command, std::size_t positionals, const char* help) {
  if (args.error.empty() && args.positional.size() == positionals) return false;
  std::cerr << "apportion " << command << ": "
            << (args.error.empty() ? (positionals == 1 ? std::string("expected one FILE") : "wrong number of arguments")
                                   : args.error)
            << "\n\n" << help;
  return true;
}

}  // namespace apportion::cli
