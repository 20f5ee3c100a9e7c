// Reading browser payloads with the core importers; see file_payload.h.
#include "browser/file_payload.h"

#include <nlohmann/json.hpp>

#include "apportion/formats/network_csv.h"
#include "apportion/formats/network_dimacs.h"
#include "apportion/formats/network_graphml.h"
#include "apportion/formats/network_json.h"

namespace apportion::web {

namespace {
bool ends_with(const std::string& s, const std::string& suffix) {
  return s.size() >= suffix.size() && s.compare(s.size() - suffix.size(), suffix.size(), suffix) == 0;
}
}  // namespace

Payload read_payload(const std::string& payload_json) {
  Payload p;
  const nlohmann::json root = nlohmann::json::parse(payload_json, nullptr, false);
  if (root.is_discarded() || !root.is_object() || !root.contains("files") || !root["files"].is_array()) {
    p.loaded.diagnostics.error("file", "", "", "the browser handed over no readable file");
    return p;
  }
  // Typed look-up: value() on a key of another type would abort the page (no exceptions).
  // Fuzzing finding: {"source": 2.06666, ...}.
  const auto source = root.find("source");
  p.source = source != root.end() && source->is_string() ? source->get<std::string>() : "file";
  if (root.contains("error") && root["error"].is_string()) {
    p.loaded.diagnostics.error("file", "", "", root["error"].get<std::string>());
    return p;
  }
  const auto& files = root["files"];
  if (files.empty()) {
    p.loaded.diagnostics.error("file", "", "", "no file was chosen");
    return p;
  }
  NetworkCsv tables;
  bool any_csv = false;
  for (const auto& f : files) {
    if (!f.is_object() || !f.contains("name") || !f.contains("text") || !f["name"].is_string() || !f["text"].is_string()) {
      p.loaded.diagnostics.error("file", "", "", "a file arrived without its name or text");
      return p;
    }
    const std::string name = f["name"].get<std::string>();
    const std::string& text = f["text"].get_ref<const std::string&>();
    if (ends_with(name, ".csv")) {
      any_csv = true;
      p.name = name;
      if (files.size() == 1 && !ends_with(name, ".nodes.csv") && !ends_with(name, ".arcs.csv")) {
        p.single_csv = text;  // a demands table or a traffic matrix for the open network
        return p;
      }
      if (ends_with(name, ".nodes.csv")) tables.nodes = text;
      else if (ends_with(name, ".arcs.csv")) tables.arcs = text;
      else if (ends_with(name, ".demands.csv")) tables.demands = text;
      else {
        p.loaded.diagnostics.error("file", name, "", "CSV tables must be named NAME.nodes.csv, NAME.arcs.csv, NAME.demands.csv");
        return p;
      }
      continue;
    }
    if (files.size() > 1) {
      p.loaded.diagnostics.error("file", name, "", "choose one network file (or the CSV tables of one network)");
      return p;
    }
    p.name = name;
    if (ends_with(name, ".json")) p.loaded = read_network_json(text);
    else if (ends_with(name, ".graphml") || ends_with(name, ".xml")) p.loaded = read_graphml(text), p.graphml = text;
    else if (ends_with(name, ".max") || ends_with(name, ".min") || ends_with(name, ".dimacs")) p.loaded = read_dimacs(text);
    else p.loaded.diagnostics.error("file", name, "", "unknown file type (json, csv, max, min, dimacs, graphml)");
    return p;
  }
  if (any_csv) {
    if (tables.nodes.empty() || tables.arcs.empty()) {
      p.loaded.diagnostics.error("file", p.name, "", "CSV needs at least the nodes and arcs tables, chosen together");
      return p;
    }
    p.loaded = read_network_csv(tables);
  }
  return p;
}

}  // namespace apportion::web
