// Above the canvas: the toolbar (files, exports, undo and redo, editing tools, search, the
// rule and its options, solve with progress and cancel) and the notices (a file that did not
// open, validation messages that select their item on click, autosave trouble).
#include <emscripten.h>
#include <imgui.h>

#include <algorithm>
#include <cfloat>
#include <cctype>
#include <cstdio>
#include <cstring>
#include <nlohmann/json.hpp>
#include <string>

#include "app/app_state.h"
#include "app/appearance.h"
#include "browser/browser_bridge.h"
#include "panels/field_editors.h"
#include "panels/panels.h"

namespace apportion::web {

namespace {

// The toolbar's items left to right, a new row when the next would not fit the window (at
// 1,024 px it takes two or three rows); each item's rectangle is kept for the test hook.
// Labels come before their fields.
class ToolbarFlow {
 public:
  // Before an item `width` wide: on this row when it fits, else on the next.
  void next(float width) {
    if (!first_) {
      ImGui::SameLine();
      if (ImGui::GetCursorPosX() + width > ImGui::GetWindowContentRegionMax().x) ImGui::NewLine();
    }
    first_ = false;
  }
  void new_row() { first_ = true; }
  // The last item's rectangle, under `name`.
  void record(const char* name) {
    const ImVec2 p = ImGui::GetItemRectMin(), q = ImGui::GetItemRectMax();
    app().toolbar_items.push_back({name, {p.x, p.y, q.x, q.y}});
  }
  bool button(const char* label, const char* name) {
    next(ImGui::CalcTextSize(label, nullptr, true).x + 2 * ImGui::GetStyle().FramePadding.x);
    const bool pressed = ImGui::Button(label);
    record(name);
    return pressed;
  }
  // A label, and room on its row for the field of `field_width` that follows it.
  void label(const char* text, float field_width, const char* name) {
    const float gap = ImGui::GetStyle().ItemInnerSpacing.x;
    next(ImGui::CalcTextSize(text).x + gap + field_width);
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted(text);
    record((std::string("label:") + name).c_str());
    ImGui::SameLine(0, gap);
    ImGui::SetNextItemWidth(field_width);
  }
  void tool(const char* label, Tool tool, const char* tip) {
    App& a = app();
    const bool on = a.tool == tool;
    if (on) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_ButtonActive));
    const bool pressed = button(label, label);
    if (on) ImGui::PopStyleColor();
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", tip);
    if (pressed) a.tool = tool, a.view.pending_from = -1;
  }

 private:
  bool first_ = true;
};

void update_search() {
  App& a = app();
  a.search_hits.assign(a.doc.nodes.size(), 0);
  std::string q = a.search;
  if (q.empty()) return;
  auto lower = [](std::string s) {
    for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return s;
  };
  q = lower(q);
  Selection found;
  for (int v = 0; v < a.doc.node_count(); ++v)
    if (lower(a.doc.nodes[v].id).find(q) != std::string::npos || lower(a.doc.nodes[v].label).find(q) != std::string::npos)
      a.search_hits[v] = 1, found.nodes.push_back(v);
  for (int e = 0; e < a.doc.arc_count(); ++e)
    if (lower(a.doc.arcs[e].id).find(q) != std::string::npos) found.arcs.push_back(e);
  for (int k = 0; k < static_cast<int>(a.doc.demands.size()); ++k)
    if (lower(a.doc.demands[k].id).find(q) != std::string::npos ||
        lower(a.doc.demands[k].label).find(q) != std::string::npos)
      found.demands.push_back(k);
  a.selection = found;
}

void recover_menu() {
  if (!ImGui::BeginPopup("recover")) return;
  static std::string listed;
  static nlohmann::json versions;
  if (ImGui::IsWindowAppearing()) {
    listed = autosave_versions();
    versions = nlohmann::json::parse(listed, nullptr, false);
  }
  ImGui::TextUnformatted("Autosaved versions in this browser, newest first:");
  bool any = false;
  if (versions.is_array())
    for (const auto& v : versions) {
      if (!v.is_object() || !v.contains("slot") || !v["slot"].is_number_integer()) continue;
      any = true;
      const double ms = v.contains("time") && v["time"].is_number() ? v["time"].get<double>() : 0;
      const double minutes = (EM_ASM_DOUBLE({ return Date.now(); }) - ms) / 60000.0;
      const std::string name = v.contains("name") && v["name"].is_string() ? v["name"].get<std::string>() : "";
      char label[200];
      std::snprintf(label, sizeof label, "%s, %.0f min ago (%.0f KB)##%d", name.empty() ? "(unnamed)" : name.c_str(), minutes,
                    v.contains("bytes") && v["bytes"].is_number() ? v["bytes"].get<double>() / 1024 : 0.0,
                    v["slot"].get<int>());
      if (ImGui::Selectable(label)) restore_autosave(v["slot"].get<int>());
    }
  if (!any) ImGui::TextDisabled("none yet");
  ImGui::EndPopup();
}

// The pasted or opened demands table, as it reads against the document: a preview of the
// first rows and every message, so a planner sees what Add will do (demand_table.h).
void table_preview(MatrixChoices& m) {
  App& a = app();
  ImGui::TextWrapped("Copy the rows in a spreadsheet, the header row included (origin and destination, by node id "
                     "or label; optionally amount, weight, id, label), then press Ctrl+V here (Cmd+V on a Mac). "
                     "A CSV file of that form can be opened instead.");
  if (m.table_text.empty()) {
    ImGui::TextDisabled("Nothing pasted yet.");
    return;
  }
  const DemandTableRead& t = pasted_table();
  const char* sep = t.delimiter == '\t' ? "tab" : t.delimiter == ';' ? "semicolon" : "comma";
  const std::string from = m.table_name.empty() ? "Pasted table" : m.table_name;
  if (t.ok())
    ImGui::TextWrapped("%s (%s-separated): %zu demands to add; %d without an id get one from their origin and "
                       "destination.", from.c_str(), sep, t.demands.size(), t.generated_ids);
  else
    ImGui::TextWrapped("%s (%s-separated): %d errors; nothing can be added until they are fixed.", from.c_str(), sep,
                       t.diagnostics.error_count());
  if (!t.demands.empty() &&
      ImGui::BeginTable("table-preview", 5, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_SizingStretchProp)) {
    for (const char* h : {"id", "origin", "destination", "amount", "weight"}) ImGui::TableSetupColumn(h);
    ImGui::TableHeadersRow();
    auto node = [&](int v) { return shown_name(a.doc.nodes[v]); };
    for (std::size_t i = 0; i < t.demands.size() && i < 6; ++i) {
      const Demand& k = t.demands[i];
      ImGui::TableNextRow();
      ImGui::TableNextColumn(), ImGui::TextUnformatted(k.id.c_str());
      ImGui::TableNextColumn(), ImGui::TextUnformatted(node(k.origin).c_str());
      ImGui::TableNextColumn(), ImGui::TextUnformatted(node(k.destination).c_str());
      ImGui::TableNextColumn();
      if (k.amount) ImGui::Text("%.6g", *k.amount);
      else ImGui::TextUnformatted("as much as possible");
      ImGui::TableNextColumn(), ImGui::Text("%.6g", k.weight);
    }
    ImGui::EndTable();
    if (t.demands.size() > 6) ImGui::TextDisabled("... and %zu more", t.demands.size() - 6);
  }
  if (!t.diagnostics.items.empty()) {
    ImGui::BeginChild("table-messages", ImVec2(0, std::min(160.0f, 20.0f * t.diagnostics.items.size() + 8)), true);
    for (const Diagnostic& d : t.diagnostics.items) {
      const bool error = d.severity == Severity::kError;
      ImGui::PushStyleColor(ImGuiCol_Text, error ? palette().error_text : palette().warning_text);
      ImGui::TextWrapped("%s", d.to_string().c_str());
      ImGui::PopStyleColor();
    }
    ImGui::EndChild();
  }
  if (ImGui::SmallButton("Clear the table")) m.table_text.clear(), m.table_name.clear(), m.table_read_at = -1;
}

// Many demands in one step: a traffic matrix (traffic_matrix.h) -- which pairs, their
// amounts, their weight -- or a table pasted from a spreadsheet (demand_table.h).
void matrix_dialog() {
  App& a = app();
  MatrixChoices& m = a.matrix;
  ImGui::SetNextWindowSize(ImVec2(520 * ui_scale(), 0), ImGuiCond_Appearing);
  if (!ImGui::BeginPopupModal("Add demands", nullptr, ImGuiWindowFlags_NoSavedSettings)) return;
  if (ImGui::IsWindowAppearing()) m.error.clear();
  ImGui::RadioButton("generate pairs", &m.source, 0);
  ImGui::SameLine();
  ImGui::RadioButton("from a table (paste or open)", &m.source, 1);
  ImGui::Separator();
  if (m.source == 1) {
    table_preview(m);
  } else {
    const int all = a.doc.node_count();
    const int sel = static_cast<int>(a.selection.nodes.size());
    ImGui::TextUnformatted("One demand for every ordered pair of distinct nodes");
    ImGui::RadioButton("among all nodes", &m.between, 0);
    char label[96];
    std::snprintf(label, sizeof label, "among the %d selected nodes", sel);
    ImGui::SameLine();
    ImGui::RadioButton(label, &m.between, 1);
    std::snprintf(label, sizeof label, "from the %d selected to every node", sel);
    ImGui::RadioButton(label, &m.between, 2);
    std::snprintf(label, sizeof label, "from every node to the %d selected", sel);
    ImGui::SameLine();
    ImGui::RadioButton(label, &m.between, 3);
    const long long pairs = m.between == 0   ? static_cast<long long>(all) * std::max(0, all - 1)
                            : m.between == 1 ? static_cast<long long>(sel) * std::max(0, sel - 1)
                                             : static_cast<long long>(sel) * std::max(0, all - 1);
    ImGui::Text("%lld pairs", pairs);
    if (m.between > 0) ImGui::TextDisabled("Select nodes on the canvas: click, shift-click for more.");
    ImGui::Separator();
    ImGui::TextUnformatted("Amounts");
    ImGui::RadioButton("gravity model", &m.amounts, 0);
    ImGui::SameLine();
    ImGui::RadioButton("the same for each", &m.amounts, 1);
    ImGui::SameLine();
    ImGui::RadioButton("as much as possible", &m.amounts, 2);
    const std::string unit = a.doc.units.capacity.empty() ? "" : " (" + a.doc.units.capacity + ")";
    if (m.amounts == 0) {
      ImGui::TextWrapped("Pair (i, j) asks total x m_i m_j / (sum over the pairs of m_p m_q), node masses m drawn "
                         "from [1, 10) with the seed. Total 0: a third of the total capacity.");
      const std::string field_1 = label_before(("total" + unit).c_str(), 170);
      ImGui::SetNextItemWidth(160 * ui_scale());
      ImGui::InputDouble(field_1.c_str(), &m.total, 0, 0, "%.6g");
      const std::string field_2 = label_before("seed", 170);
      ImGui::SetNextItemWidth(160 * ui_scale());
      ImGui::InputInt(field_2.c_str(), &m.seed);
    } else if (m.amounts == 1) {
      const std::string field_3 = label_before(("amount of each pair" + unit).c_str(), 170);
      ImGui::SetNextItemWidth(160 * ui_scale());
      ImGui::InputDouble(field_3.c_str(), &m.amount, 0, 0, "%.6g");
    }
    const std::string field_4 = label_before("weight of each", 170);
    ImGui::SetNextItemWidth(160 * ui_scale());
    ImGui::InputDouble(field_4.c_str(), &m.weight, 0, 0, "%.6g");
  }
  ImGui::Checkbox("replace the existing demands", &m.replace);
  if (!m.error.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, palette().error_text);
    ImGui::TextWrapped("%s", m.error.c_str());
    ImGui::PopStyleColor();
  }
  ImGui::TextDisabled("One step: Undo takes all of them back.");
  const bool blocked = m.source == 1 && (m.table_text.empty() || !pasted_table().ok());
  ImGui::BeginDisabled(blocked);
  if (ImGui::Button("Add") && (m.source == 1 ? add_pasted_table() : add_matrix_demands())) ImGui::CloseCurrentPopup();
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Cancel") || ImGui::IsKeyPressed(ImGuiKey_Escape)) ImGui::CloseCurrentPopup();
  ImGui::EndPopup();
}

// How to read a GraphML topology: which edge attribute is the capacity, in what unit, what
// links without it get, and how undirected links become arcs (network_graphml.h).
void graphml_dialog() {
  App& a = app();
  GraphmlChoices& g = a.graphml;
  if (g.requested) ImGui::OpenPopup("Open topology"), g.requested = false;
  ImGui::SetNextWindowSize(ImVec2(520 * ui_scale(), 0), ImGuiCond_Appearing);
  if (!ImGui::BeginPopupModal("Open topology", nullptr, ImGuiWindowFlags_NoSavedSettings)) return;
  if (!g.pending) {
    ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
    return;
  }
  ImGui::TextWrapped("%s: how should its links' capacities be read?", g.name.c_str());
  std::string current = g.attribute >= 0 ? g.attributes[g.attribute].name : "(none: every link gets the default)";
  const std::string field_5 = label_before("capacity from", 210);
  ImGui::SetNextItemWidth(260 * ui_scale());
  if (ImGui::BeginCombo(field_5.c_str(), current.c_str())) {
    if (ImGui::Selectable("(none: every link gets the default)", g.attribute < 0)) g.attribute = -1;
    for (int i = 0; i < static_cast<int>(g.attributes.size()); ++i) {
      char label[300];
      std::snprintf(label, sizeof label, "%s (%d links)", g.attributes[i].name.c_str(), g.attributes[i].edges_with_value);
      if (ImGui::Selectable(label, g.attribute == i)) g.attribute = i;
    }
    ImGui::EndCombo();
  }
  if (g.attribute >= 0) {
    const char* units[] = {"already in the network's unit", "bit/s", "kbit/s", "Mbit/s", "Gbit/s", "Tbit/s"};
    const std::string field_6 = label_before("its values are in", 210);
    ImGui::SetNextItemWidth(260 * ui_scale());
    ImGui::Combo(field_6.c_str(), &g.value_unit, units, IM_ARRAYSIZE(units));
  }
  char unit[64];
  std::snprintf(unit, sizeof unit, "%s", g.unit.c_str());
  const std::string field_7 = label_before("network's capacity unit", 210);
  ImGui::SetNextItemWidth(260 * ui_scale());
  if (ImGui::InputText(field_7.c_str(), unit, sizeof unit)) g.unit = unit;
  const std::string field_8 = label_before("capacity of links without it", 210);
  ImGui::SetNextItemWidth(260 * ui_scale());
  ImGui::InputDouble(field_8.c_str(), &g.default_capacity, 0, 0, "%.6g");
  const char* lengths[] = {"not used", "as each arc's cost (km)", "as each arc's transit time"};
  const std::string field_9 = label_before("great-circle length", 210);
  ImGui::SetNextItemWidth(260 * ui_scale());
  ImGui::Combo(field_9.c_str(), &g.length_as, lengths, IM_ARRAYSIZE(lengths));
  if (ImGui::IsItemHovered())
    ImGui::SetTooltip("From the nodes' Longitude and Latitude; links with an end without them get none.");
  if (g.length_as == 2) {
    const std::string field_10 = label_before("speed (km per time unit)", 210);
    ImGui::SetNextItemWidth(260 * ui_scale());
    ImGui::InputDouble(field_10.c_str(), &g.speed, 0, 0, "%.6g");
  }
  ImGui::RadioButton("an undirected link is one arc shared by both directions", &g.undirected, 0);
  ImGui::RadioButton("an undirected link is two arcs, one per direction", &g.undirected, 1);
  if (!g.error.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, palette().error_text);
    ImGui::TextWrapped("%s", g.error.c_str());
    ImGui::PopStyleColor();
  }
  if (ImGui::Button("Open")) open_graphml_with_choices();
  ImGui::SameLine();
  if (ImGui::Button("Cancel") || ImGui::IsKeyPressed(ImGuiKey_Escape)) g.pending = false, g.text.clear();
  if (!g.pending) ImGui::CloseCurrentPopup();
  ImGui::EndPopup();
}

}  // namespace

void draw_toolbar() {
  App& a = app();
  const bool solved = current_result() != nullptr;
  const float k = ui_scale();
  a.toolbar_items.clear();
  ToolbarFlow bar;
  if (bar.button("Open network...", "open")) action("open");
  graphml_dialog();
  if (bar.button("Save network", "save")) action("save-network");
  if (bar.button("Copy share link", "share")) action("share-link");
  if (bar.button("Recover...", "recover")) ImGui::OpenPopup("recover");
  recover_menu();
  if (bar.button("Export...", "export")) ImGui::OpenPopup("export");
  if (ImGui::BeginPopup("export")) {
    if (ImGui::MenuItem("Shares per demand (CSV)", nullptr, false, solved)) action("export-demands-csv");
    if (ImGui::MenuItem("Loads per arc (CSV)", nullptr, false, solved)) action("export-arcs-csv");
    if (ImGui::MenuItem("Paths (CSV)", nullptr, false, solved)) action("export-paths-csv");
    if (ImGui::MenuItem("Full result (JSON)", nullptr, false, solved)) action("export-result-json");
    ImGui::Separator();
    if (ImGui::MenuItem("Demands as a matrix (CSV)")) action("export-matrix-csv");
    if (ImGui::IsItemHovered())
      ImGui::SetTooltip("Origins down, destinations across. Open such a file to add its demands to the network.");
    if (ImGui::MenuItem("Picture for a report (SVG)")) action("export-svg");
    if (ImGui::IsItemHovered())
      ImGui::SetTooltip("The whole network on white, with the rule, the totals, a legend, the date and the caution.");
    if (ImGui::MenuItem("Canvas as shown (PNG)")) action("export-png");
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("The network canvas alone, as it is on screen now.");
    ImGui::EndPopup();
  }
  ImGui::BeginDisabled(!a.history.can_undo());
  if (bar.button("Undo", "undo")) undo();
  if (ImGui::IsItemHovered(ImGuiHoveredFlags_AllowWhenDisabled))
    ImGui::SetTooltip("Undo %s (Ctrl+Z)", a.history.undo_name().c_str());
  ImGui::EndDisabled();
  ImGui::BeginDisabled(!a.history.can_redo());
  if (bar.button("Redo", "redo")) redo();
  if (ImGui::IsItemHovered(ImGuiHoveredFlags_AllowWhenDisabled))
    ImGui::SetTooltip("Redo %s (Ctrl+Y or Ctrl+Shift+Z)", a.history.redo_name().c_str());
  ImGui::EndDisabled();
  bar.tool("Select", Tool::kSelect, "Click to select (Shift adds), drag nodes to move them, drag on empty canvas to "
                                    "select a box. Right-drag pans, the wheel zooms. (Esc)");
  bar.tool("Add node", Tool::kAddNode, "Click on empty canvas to add a node there.");
  bar.tool("Add arc", Tool::kAddArc, "Click the tail node, then the head node.");
  bar.tool("Add demand", Tool::kAddDemand, "Click the origin, then the destination.");
  if (bar.button("Demands...", "demands") || a.matrix_dialog_requested) ImGui::OpenPopup("Add demands");
  a.matrix_dialog_requested = false;
  if (ImGui::IsItemHovered())
    ImGui::SetTooltip("Add a demand for every pair of nodes (all, or the selected ones) at once, or paste a table.");
  matrix_dialog();
  if (bar.button("Fit", "fit")) action("fit");
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("Fit the whole network into the canvas.");
  if (bar.button("Arrange", "arrange")) action("arrange");
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("Place all nodes by force-directed layout (undoable).");
  bar.label("Find", 150 * k, "find");
  if (ImGui::InputTextWithHint("##search", "id or label", a.search, sizeof a.search)) update_search();
  bar.record("find");
  if (bar.button("Display...", "display")) ImGui::OpenPopup("display");
  if (ImGui::BeginPopup("display")) {
    ImGui::TextUnformatted("Theme");
    if (ImGui::RadioButton("dark", !appearance().light)) set_theme(false);
    ImGui::SameLine();
    if (ImGui::RadioButton("light (meetings, print)", appearance().light)) set_theme(true);
    ImGui::TextUnformatted("Text size");
    for (int p : kScalePercents) {
      const std::string name = std::to_string(p) + " %";
      if (ImGui::RadioButton(name.c_str(), appearance().scale_percent == p)) set_scale_percent(p);
      if (p != 130 && p != kScalePercents[std::size(kScalePercents) - 1]) ImGui::SameLine();
    }
    ImGui::TextDisabled("Remembered in this browser.");
    ImGui::EndPopup();
  }

  // Rule, options, solve: on a row of their own.
  bar.new_row();
  bar.label("Rule", 250 * k, "rule");
  if (ImGui::Combo("##rule", &a.objective, kObjectiveLabels, IM_ARRAYSIZE(kObjectiveLabels))) request_solve();
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", kObjectiveExplanations[a.objective]);
  bar.record("rule");
  if (kObjectives[a.objective] == FairObjective::kTradeoff) {
    float eps = static_cast<float>(a.options.epsilon);
    bar.label("Fairness given up", 120 * k, "tradeoff");
    if (ImGui::SliderFloat("##tradeoff", &eps, 0.0f, 1.0f, "%.2f")) a.options.epsilon = eps;
    if (ImGui::IsItemDeactivatedAfterEdit()) request_solve();
    bar.record("tradeoff");
  }
  bar.label("Hop limit", 90 * k, "hops");
  if (ImGui::InputInt("##hops", &a.options.routing.hop_limit)) {
    a.options.routing.hop_limit = std::max(0, a.options.routing.hop_limit);
    request_solve();
  }
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("Paths of at most this many arcs (0: no limit).");
  bar.record("hops");
  bar.label("Paths per demand", 90 * k, "paths");
  if (ImGui::InputInt("##paths", &a.options.routing.k_paths)) {
    a.options.routing.k_paths = std::max(0, a.options.routing.k_paths);
    request_solve();
  }
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("Only the k shortest paths of each demand (0: any path).");
  bar.record("paths");
  if (kObjectives[a.objective] == FairObjective::kMaxMinFair) {
    bar.next(ImGui::GetFrameHeight() + ImGui::CalcTextSize("prove fairness").x + ImGui::GetStyle().ItemInnerSpacing.x);
    if (ImGui::Checkbox("prove fairness", &a.options.certify)) request_solve();
    if (ImGui::IsItemHovered())
      ImGui::SetTooltip("After the solve, prove every share: an interval that holds its exact max-min fair share,\n"
                        "from LPs of its own, checked from first principles. Adds a fraction of the solve's time.");
    bar.record("certify");
  }
  bar.next(ImGui::GetFrameHeight() + ImGui::CalcTextSize("solve after each edit").x + ImGui::GetStyle().ItemInnerSpacing.x);
  ImGui::Checkbox("solve after each edit", &a.auto_solve);
  bar.record("auto-solve");
  if (a.solve.running) {
    if (bar.button("Cancel", "cancel")) cancel_solve();
    const double seconds = (emscripten_get_now() - a.solve.started_ms) / 1000.0;
    const float fraction = a.solve.demands > 0 ? static_cast<float>(a.solve.settled) / a.solve.demands : 0.0f;
    // Time left, from the rate at which demands settle so far: rough (late tiers can be
    // slower or faster), so shown only once a tenth is settled, and as "about".
    char left[64] = "";
    if (fraction >= 0.1f && fraction < 1.0f)
      std::snprintf(left, sizeof left, ", about %.0f s left in this stage", seconds * (1.0 - fraction) / fraction);
    char overlay[200];
    std::snprintf(overlay, sizeof overlay, "%s: %d of %d demands settled, %d LPs, %.1f s%s",
                  a.solve.stage.empty() ? "starting" : a.solve.stage.c_str(), a.solve.settled, a.solve.demands,
                  a.solve.lp_solves, seconds, left);
    bar.next(300 * k);
    ImGui::ProgressBar(fraction, ImVec2(-1, 0), overlay);
    bar.record("progress");
  } else {
    if (bar.button("Solve", "solve")) request_solve();
    bar.next(ImGui::GetFrameHeight() + ImGui::CalcTextSize("animate").x + ImGui::GetStyle().ItemInnerSpacing.x);
    ImGui::Checkbox("animate", &a.view.animate);
    bar.record("animate");
  }
}

void draw_notices() {
  App& a = app();
  if (a.open_errors.empty() && !a.other_tab_saved && a.notice.empty() && a.diagnostics.items.empty()) return;
  // Wrapped to the panel, in a box that grows with them up to a third of the window and then
  // scrolls, so that a long list never pushes the tabs out of sight.
  ImGui::SetNextWindowSizeConstraints(ImVec2(0, 0), ImVec2(FLT_MAX, ImGui::GetIO().DisplaySize.y / 3));
  ImGui::BeginChild("notices", ImVec2(0, 0), ImGuiChildFlags_AutoResizeY);
  ImGui::PushTextWrapPos(0);
  if (!a.open_errors.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, palette().error_text);
    ImGui::TextUnformatted("The file was not opened; the current network is unchanged:");
    for (const std::string& m : a.open_errors) ImGui::BulletText("%s", m.c_str());
    ImGui::PopStyleColor();
    if (ImGui::SmallButton("Dismiss")) a.open_errors.clear();
  }
  if (a.other_tab_saved) {
    ImGui::PushStyleColor(ImGuiCol_Text, palette().warning_text);
    ImGui::TextWrapped("Another tab autosaved a network in this browser. Both tabs' work is kept: this tab's next "
                       "edit is saved as a new version, and Recover... lists the other tab's.");
    ImGui::PopStyleColor();
    if (ImGui::SmallButton("OK##othertab")) a.other_tab_saved = false;
  }
  if (!a.notice.empty()) {
    ImGui::TextWrapped("%s", a.notice.c_str());
    if (ImGui::SmallButton("OK##notice")) a.notice.clear();
  }
  int shown = 0;
  for (const Diagnostic& d : a.diagnostics.items) {
    if (shown == 6) {
      ImGui::TextDisabled("... and %zu more", a.diagnostics.items.size() - 6);
      break;
    }
    ++shown;
    const bool error = d.severity == Severity::kError;
    ImGui::PushStyleColor(ImGuiCol_Text, error ? palette().error_text : palette().warning_text);
    ImGui::TextWrapped("%s", d.to_string().c_str());
    ImGui::PopStyleColor();
    if (ImGui::IsItemHovered()) {
      ImGui::SetMouseCursor(ImGuiMouseCursor_Hand);
      ImGui::SetTooltip("Click to select %s %s", d.item_kind.c_str(), d.item_id.c_str());
    }
    if (ImGui::IsItemClicked()) select_item(d.item_kind, d.item_id);
  }
  ImGui::PopTextWrapPos();
  ImGui::EndChild();
}

}  // namespace apportion::web
