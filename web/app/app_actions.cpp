// What the page does to its document and result: edits with undo, solves in the worker,
// opening and exporting. Buttons, keys and the test hook all come here; see app_state.h.
#include <emscripten.h>

#include <algorithm>
#include <cctype>
#include <cstdio>
#include <cstdlib>
#include <nlohmann/json.hpp>
#include <sstream>

#include <imgui.h>

#include "app/app_state.h"
#include "app/appearance.h"
#include "apportion/formats/demand_table.h"
#include "apportion/formats/matrix_csv.h"
#include "apportion/formats/network_json.h"
#include "apportion/layout/network_layout.h"
#include "apportion/model/number_text.h"
#include "apportion/model/size_limits.h"
#include "apportion/model/traffic_matrix.h"
#include "apportion/model/validation.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/multiflow_result_export.h"
#include "apportion/results/multiflow_result_import.h"
#include "apportion/results/network_svg.h"
#include "browser/browser_bridge.h"
#include "panels/panels.h"

namespace apportion::web {

App& app() {
  static App instance;
  return instance;
}

bool result_is_current() { return app().result_revision == app().revision && app().result.status != SolveStatus::kNotSolved; }

const MultiflowResult* current_result() {
  return result_is_current() && app().result.status == SolveStatus::kOptimal ? &app().result : nullptr;
}

namespace {

std::string state_json(const char* event) {
  App& a = app();
  nlohmann::json s = {{"event", event}, {"network", a.doc.name}, {"source", a.doc_name},
                      {"objective", objective_name(kObjectives[a.objective])},
                      {"status", result_is_current() ? status_name(a.result.status) : "not solved"},
                      {"messages", a.open_errors}, {"notice", a.notice}, {"revision", a.revision},
                      {"solving", a.solve.running}, {"nodes", a.doc.node_count()}, {"arcs", a.doc.arc_count()},
                      {"demands", a.doc.demands.size()}, {"undo", a.history.undo_name()},
                      {"redo", a.history.redo_name()}, {"other_tab_saved", a.other_tab_saved},
                      {"auto_solve", a.auto_solve}, {"chart_bars", a.chart_bars},
                      {"change", a.previous_shares.empty() ? std::string() : a.change_caption}};
  nlohmann::json shares = nlohmann::json::array();
  if (result_is_current())
    for (const auto& d : a.result.demands) shares.push_back(d.share);
  s["shares"] = shares;
  nlohmann::json bound = nlohmann::json::array();
  if (result_is_current())
    for (int k = 0; k < static_cast<int>(a.result.demands.size()) && k < 2000; ++k) bound.push_back(share_bound_text(k));
  s["bound_by"] = bound;
  if (result_is_current() && a.result.fairness.status != SolveStatus::kNotSolved)
    s["fairness"] = {{"status", status_name(a.result.fairness.status)},
                     {"max_relative_error", a.result.fairness.max_relative_error},
                     {"witness_tolerance", a.result.fairness.witness_tolerance},
                     {"bounds", a.result.fairness.lower.size()}};
  s["dpr"] = a.dpr;
  nlohmann::json errors = nlohmann::json::array();
  for (const Diagnostic& d : a.diagnostics.items)
    if (d.severity == Severity::kError) errors.push_back(d.to_string());
  s["errors"] = errors;
  nlohmann::json sel = {{"nodes", nlohmann::json::array()}, {"arcs", nlohmann::json::array()},
                        {"demands", nlohmann::json::array()}};
  for (int v : a.selection.nodes) sel["nodes"].push_back(a.doc.nodes[v].id);
  for (int e : a.selection.arcs) sel["arcs"].push_back(a.doc.arcs[e].id);
  for (int k : a.selection.demands) sel["demands"].push_back(a.doc.demands[k].id);
  s["selection"] = sel;
  s["theme"] = appearance().light ? "light" : "dark";
  s["text_size"] = appearance().scale_percent;
  s["side_width"] = a.side_width_used;
  s["chart_ticks"] = a.chart_ticks;
  s["splitter"] = a.splitter;
  s["tabs_y"] = a.tabs_y;
  s["font_px"] = ImGui::GetIO().Fonts->Fonts.empty() ? 0.0f : ImGui::GetIO().Fonts->Fonts[0]->FontSize;
  s["window"] = {ImGui::GetIO().DisplaySize.x, ImGui::GetIO().DisplaySize.y};
  nlohmann::json bar = nlohmann::json::array();
  for (const auto& [name, r] : a.toolbar_items) bar.push_back({name, r[0], r[1], r[2], r[3]});
  s["toolbar"] = bar;
  return s.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
}

}  // namespace

// Every download is "<stem>.<what>.<ext>" (the network itself "<stem>.json"): the stem is the
// network's name with each run of other characters one hyphen, "network" when none is left.
std::string file_stem() {
  std::string s;
  for (char c : app().doc.name) {
    if (std::isalnum(static_cast<unsigned char>(c)) || static_cast<unsigned char>(c) >= 0x80) s += c;  // UTF-8 kept
    else if (!s.empty() && s.back() != '-') s += '-';
  }
  while (!s.empty() && s.back() == '-') s.pop_back();
  return s.empty() ? "network" : s;
}

namespace {

// Keeps the selection inside the document after items were removed or undone.
void clamp_selection() {
  Selection& s = app().selection;
  auto keep = [](std::vector<int>& v, int n) {
    v.erase(std::remove_if(v.begin(), v.end(), [n](int i) { return i < 0 || i >= n; }), v.end());
  };
  keep(s.nodes, app().doc.node_count());
  keep(s.arcs, app().doc.arc_count());
  keep(s.demands, static_cast<int>(app().doc.demands.size()));
  if (app().view.filter_demand >= static_cast<int>(app().doc.demands.size())) app().view.filter_demand = -1;
  if (app().view.pending_from >= app().doc.node_count()) app().view.pending_from = -1;
}

}  // namespace

void load_side_width() {
  const double w = std::atof(read_setting("side-width").c_str());
  if (w >= 200 && w <= 4000) app().side_width = static_cast<float>(w);
}
void remember_side_width() { write_setting("side-width", std::to_string(static_cast<int>(app().side_width))); }

void report(const char* event) { std::printf("apportion:%s %s\n", event, state_json(event).c_str()); }

void after_edit(bool affects_solve) {
  App& a = app();
  ++a.doc_changes;
  clamp_selection();
  autosave(write_network_json(a.doc));
  if (!affects_solve) return;
  ++a.revision;
  a.diagnostics = validate(a.doc);
  if (a.auto_solve) request_solve();
  else if (a.solve.running) cancel_solve();
  report("edited");
}

void set_document(Network net, const std::string& name, bool save) {
  App& a = app();
  // Networks imported without positions get a drawing before anything else sees them.
  bool placed = true;
  for (const Node& v : net.nodes) placed = placed && v.x && v.y;
  if (!placed) auto_layout(net);
  a.doc = std::move(net);
  ++a.doc_changes;
  ++a.document_serial;
  a.doc_name = name;
  a.open_errors.clear();
  a.history.clear();
  a.selection = Selection{};
  a.view = ViewState{};
  a.search[0] = 0;
  a.search_hits.clear();
  ++a.revision;
  a.diagnostics = validate(a.doc);
  if (save) autosave(write_network_json(a.doc));
  request_solve();
}

void request_solve() {
  App& a = app();
  if (a.solve.running) cancel_solve();
  if (a.diagnostics.has_errors()) {
    a.notice = "Not solved: the network has errors (listed above the canvas; click one to select its item).";
    report("invalid");
    return;
  }
  a.options.objective = kObjectives[a.objective];
  RunningSolve& s = a.solve;
  const int id = s.id + 1;
  s = RunningSolve{};
  s.running = true, s.id = id, s.started_ms = emscripten_get_now(), s.revision = a.revision, s.doc = a.doc;
  s.document = a.document_serial, s.objective = a.objective;
  nlohmann::json request = {{"network", write_network_json(a.doc)}, {"objective", objective_name(a.options.objective)},
                            {"epsilon", a.options.epsilon}, {"hop_limit", a.options.routing.hop_limit},
                            {"k_paths", a.options.routing.k_paths}, {"certify", a.options.certify}};
  a.notice.clear();
  start_solve(s.id, request.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace));
  report("solve-started");
}

// Turns "solve after each edit" off after a solve of `ms`, if that was long (see
// App::auto_solve_pause_ms), and says so.
void pause_auto_solve_after(double ms, const char* what) {
  App& a = app();
  if (!a.auto_solve || ms <= a.auto_solve_pause_ms) return;
  a.auto_solve = false;
  char text[300];
  std::snprintf(text, sizeof text,
                "%s took %.1f s, so \"solve after each edit\" is paused: edit freely, then press Solve (or tick the "
                "box again).",
                what, ms / 1000.0);
  a.notice += (a.notice.empty() ? "" : " ") + std::string(text);
  report("auto-solve-paused");
}

void cancel_solve() {
  App& a = app();
  if (!a.solve.running) return;
  stop_solver();
  a.solve.running = false;
  a.notice = "Solve cancelled; the document is unchanged.";
  pause_auto_solve_after(emscripten_get_now() - a.solve.started_ms, "The cancelled solve");
  report("cancelled");
}

void receive_solve_progress(int id, const std::string& json_text) {
  App& a = app();
  if (id != a.solve.id || !a.solve.running) return;
  const nlohmann::json p = nlohmann::json::parse(json_text, nullptr, false);
  if (!p.is_object()) return;
  auto number = [&](const char* key) { return p.contains(key) && p[key].is_number() ? p[key].get<int>() : 0; };
  a.solve.stage = p.contains("stage") && p["stage"].is_string() ? p["stage"].get<std::string>() : "";
  a.solve.round = number("round");
  a.solve.settled = number("settled");
  a.solve.demands = number("demands");
  a.solve.lp_solves = number("lp_solves");
  report("progress");
}

void receive_solve_result(int id, const std::string& text) {
  App& a = app();
  if (id != a.solve.id || !a.solve.running) return;
  a.solve.running = false;
  std::string error;
  auto read = read_multiflow_json(a.solve.doc, text, error);
  MultiflowResult r;
  if (!read) {
    r.status = SolveStatus::kNumericalDifficulty;
    r.message = "the solver's answer could not be read (" + error + ")";
  } else {
    r = std::move(*read);
    if (r.status == SolveStatus::kOptimal) {
      // The page checks the worker's answer itself with the independent checker.
      r.check = check_multiflow(a.solve.doc, r);
      if (!r.check.ok) r.status = SolveStatus::kNumericalDifficulty, r.message = "the check failed: " + r.check.worst;
    }
  }
  a.previous_shares.clear();
  a.change_caption.clear();
  // The change column compares with the last result of the same network only: a newly
  // opened file's demands share ids with the old one's by chance, not by meaning.
  if (a.result.status == SolveStatus::kOptimal && r.status == SolveStatus::kOptimal &&
      a.result_document == a.solve.document) {
    for (std::size_t k = 0; k < a.result.demands.size() && k < a.result_doc_ids.size(); ++k)
      a.previous_shares[a.result_doc_ids[k]] = a.result.demands[k].share;
    const std::string edit = a.history.undo_name();
    if (a.result_objective != a.solve.objective && a.result_objective >= 0)
      a.change_caption = std::string("change: since the result under \"") + kObjectiveLabels[a.result_objective] + "\"";
    else if (a.result_revision != a.solve.revision && !edit.empty())
      a.change_caption = "change: since the result before \"" + edit + "\"";
    else
      a.change_caption = "change: since the previous result";
  }
  a.result_document = a.solve.document, a.result_objective = a.solve.objective;
  a.result = std::move(r);
  ++a.result_changes;
  a.result_revision = a.solve.revision;
  a.result_doc_ids.clear();
  for (const Demand& d : a.solve.doc.demands) a.result_doc_ids.push_back(d.id);
  a.solve.doc = Network{};
  report("solved");
  pause_auto_solve_after(emscripten_get_now() - a.solve.started_ms, "The last solve");
}

void receive_solve_failure(int id, const std::string& message) {
  App& a = app();
  if (id != a.solve.id || !a.solve.running) return;
  a.solve.running = false;
  a.result = MultiflowResult{};
  a.result.status = SolveStatus::kNumericalDifficulty;
  a.result.message = "the solver stopped: " + message;
  ++a.result_changes;
  a.result_revision = a.solve.revision;
  report("solved");
}

void undo() {
  if (!app().history.undo(app().doc)) return;
  after_edit(true);
}

void redo() {
  if (!app().history.redo(app().doc)) return;
  after_edit(true);
}

void delete_selection() {
  Selection sel = app().selection;
  if (sel.empty()) return;
  const std::size_t n = sel.nodes.size() + sel.arcs.size() + sel.demands.size();
  edit("delete " + std::to_string(n) + (n == 1 ? " item" : " items"), true,
       [&](Network& doc) { remove_items(doc, sel); });
  app().selection = Selection{};
}

void select_item(const std::string& kind, const std::string& id) {
  App& a = app();
  Selection s;
  int i = -1;
  if (kind == "node" && (i = a.doc.find_node(id)) >= 0) s.nodes.push_back(i);
  if (kind == "arc" && (i = a.doc.find_arc(id)) >= 0) s.arcs.push_back(i);
  if (kind == "demand" && (i = a.doc.find_demand(id)) >= 0) s.demands.push_back(i);
  if (i < 0 && !id.empty() && id[0] == '#') {  // an item without a usable id: "#3" is the third
    i = std::atoi(id.c_str() + 1) - 1;
    if (kind == "node" && i >= 0 && i < a.doc.node_count()) s.nodes.push_back(i);
    if (kind == "arc" && i >= 0 && i < a.doc.arc_count()) s.arcs.push_back(i);
    if (kind == "demand" && i >= 0 && i < static_cast<int>(a.doc.demands.size())) s.demands.push_back(i);
  }
  if (s.empty()) return;
  a.selection = s;
  a.right_tab = 1;  // the inspector
  report("selected");
}

// "KIND ID FIELD VALUE": one field edit, as the inspector makes it (used by the test hook).
void set_field(const std::string& spec) {
  App& a = app();
  std::istringstream in(spec);
  std::string kind, id, field, value;
  in >> kind >> id >> field;
  std::getline(in >> std::ws, value);
  const std::optional<double> number = parse_number(value);
  const std::string what = field + " of " + kind + " " + id;
  if (kind == "arc" && a.doc.find_arc(id) >= 0) {
    const int e = a.doc.find_arc(id);
    if (field == "capacity" && number) edit(what, true, [&](Network& d) { d.arcs[e].capacity = *number; });
    if (field == "enabled") edit(what, true, [&](Network& d) { d.arcs[e].enabled = value == "true"; });
  } else if (kind == "demand" && a.doc.find_demand(id) >= 0) {
    const int k = a.doc.find_demand(id);
    if (field == "weight" && number) edit(what, true, [&](Network& d) { d.demands[k].weight = *number; });
    if (field == "amount" && number) edit(what, true, [&](Network& d) { d.demands[k].amount = *number; });
  } else if (kind == "node" && a.doc.find_node(id) >= 0) {
    const int v = a.doc.find_node(id);
    if (field == "label") edit(what, false, [&](Network& d) { d.nodes[v].label = value; });
  } else if (kind == "network") {  // "network - name|capacity-unit|cost-unit|time-unit TEXT"
    // The same limit as every file's (size_limits.h); the solve does not depend on these.
    if (value.size() > SizeLimits::kMaxStringLength) {
      a.notice = "That " + field + " is longer than " + std::to_string(SizeLimits::kMaxStringLength) +
                 " characters; it is unchanged.";
      return;
    }
    std::string Network::*name = nullptr;
    std::string Units::*unit = nullptr;
    if (field == "name") name = &Network::name;
    if (field == "capacity-unit") unit = &Units::capacity;
    if (field == "cost-unit") unit = &Units::cost;
    if (field == "time-unit") unit = &Units::time;
    if (name) edit("rename the network", false, [&](Network& d) { d.*name = value; });
    if (unit) edit(field.substr(0, field.find('-')) + " unit", false, [&](Network& d) { d.units.*unit = value; });
    report("edited");
  }
}

bool add_matrix_demands() {
  App& a = app();
  MatrixChoices& m = a.matrix;
  TrafficMatrixSpec spec;
  if (m.between == 1) {
    if (a.selection.nodes.size() < 2) return m.error = "Select at least two nodes, or choose all nodes.", false;
    spec.origins = spec.destinations = a.selection.nodes;
  } else if (m.between >= 2) {
    if (a.selection.nodes.empty()) return m.error = "Select the nodes first (click, or shift-click for more).", false;
    (m.between == 2 ? spec.origins : spec.destinations) = a.selection.nodes;
  }
  spec.amounts = m.amounts == 0 ? MatrixAmounts::kGravity : m.amounts == 1 ? MatrixAmounts::kUniform : MatrixAmounts::kMax;
  spec.total = m.total;
  if (m.amounts == 0 && !(m.total > 0)) {  // default: a third of the capacity, as the benchmarks ask
    spec.total = 0;
    for (const Arc& e : a.doc.arcs) spec.total += e.enabled ? e.capacity : 0.0;
    spec.total /= 3;
  }
  spec.uniform_amount = m.amount;
  spec.seed = static_cast<std::uint64_t>(std::max(0, m.seed));
  spec.weight = m.weight;
  spec.replace = m.replace;
  Network trial = a.doc;
  const TrafficMatrixResult r = add_traffic_matrix(trial, spec);
  if (!r.ok) {
    m.error = r.diagnostics.items.empty() ? "The demands could not be added." : r.diagnostics.items[0].to_string();
    return false;
  }
  m.error.clear();
  const char* kind = m.amounts == 0 ? "gravity" : m.amounts == 1 ? "same amount" : "as much as possible";
  edit("add " + std::to_string(r.added) + " demands (" + kind + ")", true, [&](Network& d) { d = std::move(trial); });
  return true;
}

namespace {
// Opens the "Add demands" dialog on a demands table (pasted: no name), read afresh.
void show_table(const std::string& text, const std::string& name) {
  MatrixChoices& m = app().matrix;
  m.source = 1;
  m.table_text = text, m.table_name = name, m.table_read_at = -1;
  app().matrix_dialog_requested = true;
}
}  // namespace

const DemandTableRead& pasted_table() {
  App& a = app();
  MatrixChoices& m = a.matrix;
  if (m.table_read_at != a.doc_changes || m.table_read_replace != m.replace) {
    m.table = m.table_text.empty() ? DemandTableRead{} : read_demand_table(a.doc, m.table_text, m.replace);
    m.table_read_at = a.doc_changes, m.table_read_replace = m.replace;
  }
  return m.table;
}

bool add_pasted_table() {
  App& a = app();
  MatrixChoices& m = a.matrix;
  if (m.table_text.empty()) return m.error = "Nothing pasted yet: copy the rows in a spreadsheet, then press Ctrl+V here.", false;
  DemandTableRead table = pasted_table();
  if (!table.ok()) {
    int errors = table.diagnostics.error_count();
    for (const Diagnostic& d : table.diagnostics.items)
      if (d.severity == Severity::kError) {
        m.error = d.to_string() + (errors > 1 ? " (and " + std::to_string(errors - 1) + " more, listed above)" : "");
        break;
      }
    return false;
  }
  m.error.clear();
  const std::string from = m.table_name.empty() ? "a pasted table" : m.table_name;
  const int count = static_cast<int>(table.demands.size());
  edit("add " + std::to_string(count) + " demands from " + from, true,
       [&](Network& d) { add_demand_table(d, std::move(table), m.replace); });
  a.notice = from + ": " + std::to_string(count) + " demands added" +
             (m.replace ? ", in place of the earlier ones." : ".");
  m.table_text.clear(), m.table_name.clear(), m.table_read_at = -1;
  report("demands-added");
  return true;
}

void receive_share_answer(const std::string& json_text) {
  App& a = app();
  const nlohmann::json j = nlohmann::json::parse(json_text, nullptr, false);
  if (!j.is_object()) return;
  const bool copied = j.contains("copied") && j["copied"].is_boolean() && j["copied"].get<bool>();
  const bool local = j.contains("local") && j["local"].is_boolean() && j["local"].get<bool>();
  const std::string link = j.contains("link") && j["link"].is_string() ? j["link"].get<std::string>() : "";
  const std::string error = j.contains("error") && j["error"].is_string() ? j["error"].get<std::string>() : "";
  if (link.empty()) {
    a.notice = "The share link could not be made: " + error;
  } else {
    const std::string size = std::to_string(link.size() / 1024 + 1) + " KB";
    a.notice = copied ? "Share link copied (" + size + "): whoever opens it gets this network as it is now; it "
                        "travels only inside the link."
                      : "The share link could not be copied for you (" + error + "); the browser showed it to copy by hand.";
    if (local)
      a.notice += " This page was opened as a file, so the link points into this computer. To share, send the "
                  "page's file together with the network (Save network), or put the page where others can open it.";
  }
  report(copied ? "share-copied" : "share-not-copied");
}

void receive_paste(const std::string& text) {
  App& a = app();
  ImGuiIO& io = ImGui::GetIO();
  if (io.WantTextInput) {  // GLFW's clipboard is empty in the browser: type the text in
    io.AddInputCharactersUTF8(text.c_str());
    return;
  }
  if (!looks_like_demand_table(text)) {
    a.notice = "The pasted text is not a demands table: its first row must name the columns, with at least "
               "origin and destination (also amount, weight, id, label).";
    report("paste-refused");
    return;
  }
  show_table(text, "");
  report("table-pasted");
}

void add_single_csv(const std::string& name, const std::string& text) {
  App& a = app();
  if (looks_like_demand_table(text)) {  // a demands table: shown in the dialog to check, then added
    show_table(text, name);
    report("table-opened");
    return;
  }
  const MatrixCsvRead m = read_matrix_csv(a.doc, text);
  if (!m.ok() || a.doc.demands.size() + m.pairs.size() > static_cast<std::size_t>(SizeLimits::kMaxDemands)) {
    a.open_errors.clear();
    a.open_errors.push_back(name + " was read as a traffic matrix for this network (rows: origins, columns: "
                                   "destinations), and:");
    for (const Diagnostic& d : m.diagnostics.items)
      if (d.severity == Severity::kError) a.open_errors.push_back(d.to_string());
    if (m.ok()) a.open_errors.push_back("it would make more demands than the limit of " +
                                        std::to_string(SizeLimits::kMaxDemands));
    report("open-failed");
    return;
  }
  std::string warnings;
  for (const Diagnostic& d : m.diagnostics.items)
    if (d.severity == Severity::kWarning) warnings += " " + d.message + ".";
  if (!m.pairs.empty())
    edit("add " + std::to_string(m.pairs.size()) + " demands from " + name, true,
         [&](Network& d) { add_pair_demands(d, m.pairs, 1.0, false); });
  a.notice = name + ": " + std::to_string(m.pairs.size()) + " demands added from the matrix." + warnings;
  report("matrix-added");
}

void ask_graphml_choices(const std::string& name, const std::string& text) {
  GraphmlChoices& g = app().graphml;
  const GraphmlChoices kept = g;  // the unit and default of the last import stay
  g = GraphmlChoices{};
  g.unit = kept.unit, g.default_capacity = kept.default_capacity, g.undirected = kept.undirected;
  g.pending = g.requested = true;
  g.name = name, g.text = text;
  g.attributes = graphml_edge_attributes(text);
  // A first guess: an attribute named capacity, else the one with "speed" or "bandwidth" in
  // its name that most edges give.
  int best = -1;
  for (int i = 0; i < static_cast<int>(g.attributes.size()); ++i) {
    std::string lower = g.attributes[i].name;
    for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    if (lower == "capacity") {
      best = i;
      break;
    }
    const bool likely = lower.find("speed") != std::string::npos || lower.find("bandwidth") != std::string::npos;
    if (likely && (best < 0 || g.attributes[i].edges_with_value > g.attributes[best].edges_with_value)) best = i;
  }
  g.attribute = best;
  nlohmann::json names = nlohmann::json::array();
  for (const GraphmlAttribute& at : g.attributes) names.push_back({{"name", at.name}, {"edges", at.edges_with_value}});
  std::printf("apportion:import-choices %s\n",
              nlohmann::json({{"file", name}, {"attributes", names}, {"guess", best}})
                  .dump(-1, ' ', false, nlohmann::json::error_handler_t::replace)
                  .c_str());
}

void open_graphml_with_choices() {
  App& a = app();
  GraphmlChoices& g = a.graphml;
  if (!g.pending) return;
  GraphmlOptions opt;
  opt.capacity_attribute = g.attribute >= 0 && g.attribute < static_cast<int>(g.attributes.size())
                               ? g.attributes[g.attribute].name
                               : std::string();
  opt.default_capacity = g.default_capacity;
  opt.undirected_as_pairs = g.undirected == 1;
  opt.capacity_unit = g.unit;
  opt.length_as = g.length_as == 1   ? GraphmlOptions::Length::kCost
                  : g.length_as == 2 ? GraphmlOptions::Length::kTransit
                                     : GraphmlOptions::Length::kNone;
  if (g.length_as == 2 && !(g.speed > 0)) {
    g.error = a.notice = "The speed must be a number > 0 to turn lengths into transit times.";
    report("open-failed");
    return;
  }
  opt.speed = g.speed;
  if (g.value_unit > 0) {
    const double to = link_speed_factor(g.unit);
    if (to == 0) {
      g.error = a.notice = "'" + g.unit + "' is not a link speed unit, so a link speed cannot be converted to it: "
                           "choose bit/s, kbit/s, Mbit/s, Gbit/s or Tbit/s, or take the values as they are.";
      report("open-failed");
      return;
    }
    opt.capacity_scale = link_speed_factor(kLinkSpeedUnits[g.value_unit - 1]) / to;
  }
  LoadResult r = read_graphml(g.text, opt);
  if (!r.ok()) {
    a.open_errors.clear();
    for (const Diagnostic& d : r.diagnostics.items)
      if (d.severity == Severity::kError) a.open_errors.push_back(d.to_string());
    g.pending = false;
    report("open-failed");
    return;
  }
  std::string warnings;
  for (const Diagnostic& d : r.diagnostics.items)
    if (d.severity == Severity::kWarning) warnings += (warnings.empty() ? "" : " ") + d.message + ".";
  const std::string name = g.name;
  g.pending = false;
  g.text.clear();
  set_document(std::move(*r.network), name, /*save=*/true);
  if (!warnings.empty()) a.notice = "Opened " + name + ": " + warnings;
  report("opened");
}

// Every button's action, by name: the UI and the test hook share this code.
void action(const std::string& what) {
  App& a = app();
  const MultiflowResult* r = current_result();
  if (what == "open") open_file_picker();
  else if (what == "save-network") download_text(file_stem() + ".json", "application/json", write_network_json(a.doc));
  else if (what == "share-link") publish_share_link(write_network_json(a.doc));
  else if (what == "solve") request_solve();
  else if (what == "cancel") cancel_solve();
  else if (what == "undo") undo();
  else if (what == "redo") redo();
  else if (what == "delete") delete_selection();
  else if (what == "arrange") {
    edit("arrange the nodes", false, [](Network& doc) {
      LayoutOptions o;
      o.keep_placed = false;
      auto_layout(doc, o);
    });
    a.view.fitted = false;
  } else if (what == "fit") a.view.fitted = false;
  else if (what == "export-demands-csv" && r)
    download_text(file_stem() + ".demands.csv", "text/csv", multiflow_demands_csv(a.doc, *r));
  else if (what == "export-arcs-csv" && r)
    download_text(file_stem() + ".arcs.csv", "text/csv", multiflow_arcs_csv(a.doc, *r));
  else if (what == "export-paths-csv" && r)
    download_text(file_stem() + ".paths.csv", "text/csv", multiflow_paths_csv(a.doc, *r));
  else if (what == "export-svg") {
    PictureOptions o;  // the light theme, for a report
    o.rule = r ? kObjectiveLabels[a.objective] : "";
    o.date = local_time_text();
    download_text(file_stem() + ".picture.svg", "image/svg+xml", network_svg(a.doc, r, o));
  } else if (what == "export-png") a.png_requested = 2;
  else if (what.rfind("theme ", 0) == 0) set_theme(what.substr(6) == "light");
  else if (what.rfind("text-size ", 0) == 0) set_scale_percent(std::atoi(what.c_str() + 10));
  else if (what.rfind("side-width ", 0) == 0) {
    a.side_width = static_cast<float>(std::atof(what.c_str() + 11));
    remember_side_width();
  }
  else if (what == "export-matrix-csv")
    download_text(file_stem() + ".matrix.csv", "text/csv", write_matrix_csv(a.doc).text);
  else if (what == "export-result-json" && r)
    download_text(file_stem() + ".result.json", "application/json", multiflow_json(a.doc, *r));
  else if (what == "certify on" || what == "certify off") {
    a.options.certify = what == "certify on";
    request_solve();
  } else if (what.rfind("objective ", 0) == 0) {
    const int i = std::atoi(what.c_str() + 10);
    if (i >= 0 && i < static_cast<int>(std::size(kObjectives))) a.objective = i, request_solve();
  } else if (what == "take-out-selected" || what == "restore-selected") {
    const std::vector<int> arcs = a.selection.arcs;
    const bool on = what == "restore-selected";
    if (arcs.empty()) return;
    const std::string n = std::to_string(arcs.size()) + (arcs.size() == 1 ? " arc" : " arcs");
    edit((on ? "restore " : "take out ") + n, true, [&](Network& d) {
      for (int e : arcs) d.arcs[e].enabled = on;
    });
  } else if (what.rfind("tool ", 0) == 0) {
    const std::string t = what.substr(5);
    a.tool = t == "add-node" ? Tool::kAddNode : t == "add-arc" ? Tool::kAddArc : t == "add-demand" ? Tool::kAddDemand
                                                                                                    : Tool::kSelect;
    a.view.pending_from = -1;
  } else if (what.rfind("select-diagnostic ", 0) == 0) {
    const std::size_t i = std::strtoul(what.c_str() + 18, nullptr, 10);
    if (i < a.diagnostics.items.size()) select_item(a.diagnostics.items[i].item_kind, a.diagnostics.items[i].item_id);
  } else if (what.rfind("set ", 0) == 0) {
    set_field(what.substr(4));
  } else if (what == "state") {
    report("state");
  } else if (what.rfind("auto-solve-pause-ms ", 0) == 0) {
    a.auto_solve_pause_ms = std::atof(what.c_str() + 20);
  } else if (what.rfind("import-graphml ", 0) == 0) {
    // "import-graphml ATTRIBUTE|- VALUE-UNIT|- NETWORK-UNIT DEFAULT shared|pairs": the dialog's Open
    std::istringstream in(what.substr(15));
    std::string attribute, value_unit, unit, mode;
    double fallback = 1;
    in >> attribute >> value_unit >> unit >> fallback >> mode;
    GraphmlChoices& g = a.graphml;
    g.attribute = -1;
    for (int i = 0; i < static_cast<int>(g.attributes.size()); ++i)
      if (g.attributes[i].name == attribute) g.attribute = i;
    g.value_unit = 0;
    for (int i = 0; i < static_cast<int>(std::size(kLinkSpeedUnits)); ++i)
      if (value_unit == kLinkSpeedUnits[i]) g.value_unit = i + 1;
    g.unit = unit == "-" ? "" : unit;
    g.default_capacity = fallback;
    g.undirected = mode == "pairs" ? 1 : 0;
    open_graphml_with_choices();
  } else if (what.rfind("view ", 0) == 0) {
    // "view demands|shares filter TEXT", "... sort COLUMN asc|desc|none", "... report"
    std::istringstream in(what.substr(5));
    std::string table, verb, rest;
    in >> table >> verb;
    std::getline(in >> std::ws, rest);
    TableView& v = table == "shares" ? a.share_view : a.demand_view;
    if (verb == "filter") v.filter = rest;
    if (verb == "sort") {
      std::istringstream r(rest);
      std::string direction;
      r >> v.column >> direction;
      v.descending = direction == "desc";
      if (direction == "none") v.column = -1;
    }
    const std::vector<int>& rows = table == "shares" ? share_rows() : demand_rows();
    nlohmann::json first = nlohmann::json::array();
    for (std::size_t i = 0; i < rows.size() && i < 5; ++i) first.push_back(a.doc.demands[rows[i]].id);
    std::printf("apportion:table %s\n", nlohmann::json({{"table", table}, {"rows", rows.size()}, {"first", first}})
                                            .dump(-1, ' ', false, nlohmann::json::error_handler_t::replace)
                                            .c_str());
  } else if (what.rfind("tab ", 0) == 0) {
    a.right_tab = std::atoi(what.c_str() + 4);
  } else if (what.rfind("table-add ", 0) == 0) {  // "table-add keep|replace": the dialog's Add for a table
    a.matrix.replace = what.substr(10) == "replace";
    if (!add_pasted_table()) {
      a.notice = a.matrix.error;
      report("table-refused");
    }
  } else if (what.rfind("show demand ", 0) == 0) {  // the canvas filter "show on the canvas"
    a.view.filter_demand = a.doc.find_demand(what.substr(12));
    a.view.filter_tier = 0;
  } else if (what == "matrix-dialog") {
    a.matrix_dialog_requested = true;
  } else if (what.rfind("matrix ", 0) == 0) {
    // "matrix gravity|uniform|max all|selected|from-selected|to-selected VALUE SEED WEIGHT
    // keep|replace": the dialog's Add
    std::istringstream in(what.substr(7));
    std::string amounts, between, mode;
    double value = 0, weight = 1;
    int seed = 1;
    in >> amounts >> between >> value >> seed >> weight >> mode;
    MatrixChoices& m = a.matrix;
    m.source = 0;
    m.amounts = amounts == "gravity" ? 0 : amounts == "uniform" ? 1 : 2;
    m.between = between == "selected" ? 1 : between == "from-selected" ? 2 : between == "to-selected" ? 3 : 0;
    (m.amounts == 0 ? m.total : m.amount) = value;
    m.seed = seed, m.weight = weight, m.replace = mode == "replace";
    if (!add_matrix_demands()) {
      a.notice = m.error;
      report("matrix-refused");
    }
  }
}

}  // namespace apportion::web
