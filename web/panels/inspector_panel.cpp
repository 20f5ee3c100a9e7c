// The inspector: properties of the selected node, arc or demand, editable with undo; for a
// larger selection, what can be done to all of it at once (take arcs out of service to see
// what a failure changes, or scale their capacity to see what an upgrade buys).
#include <imgui.h>

#include <cmath>
#include <string>

#include "app/app_state.h"
#include "app/appearance.h"
#include "panels/field_editors.h"
#include "panels/panels.h"

namespace apportion::web {

namespace {

// A node reference typed as an id; refused (with a notice) when no node has it.
bool edit_node_ref(const char* label, int current, int& out) {
  App& a = app();
  std::string id;
  if (!edit_text(label, a.doc.nodes[current].id, id)) return false;
  out = a.doc.find_node(id);
  if (out < 0) a.notice = "There is no node '" + id + "'; the " + std::string(label) + " is unchanged.";
  return out >= 0;
}

// An id typed for a new name; refused when another item of the kind has it.
template <class Items>
bool edit_id(const Items& items, const std::string& current, std::string& out) {
  if (!edit_text("id", current, out)) return false;
  for (const auto& item : items)
    if (item.id == out) {
      app().notice = "The id '" + out + "' is taken; the id is unchanged.";
      return false;
    }
  if (out.empty()) app().notice = "An id cannot be empty; the id is unchanged.";
  return !out.empty();
}

// The network itself: its name (the title of exports and reports) and units, with undo.
void network_inspector() {
  App& a = app();
  ImGui::TextUnformatted("Network");
  ImGui::PushItemWidth(220 * ui_scale());
  std::string s;
  if (edit_text("name", a.doc.name, s)) action("set network - name " + s);
  if (edit_text("capacity unit", a.doc.units.capacity, s)) action("set network - capacity-unit " + s);
  if (ImGui::IsItemHovered()) ImGui::SetTooltip("Of capacities, amounts and shares, e.g. Gbit/s or t/day.");
  if (edit_text("cost unit", a.doc.units.cost, s)) action("set network - cost-unit " + s);
  if (edit_text("time unit", a.doc.units.time, s)) action("set network - time-unit " + s);
  ImGui::PopItemWidth();
}

void node_inspector(int v) {
  App& a = app();
  const Node& n = a.doc.nodes[v];
  ImGui::Text("Node %s", n.id.c_str());
  std::string s;
  double x;
  if (edit_id(a.doc.nodes, n.id, s)) edit("rename node " + n.id, true, [&](Network& d) { d.nodes[v].id = s; });
  if (edit_text("label", n.label, s)) edit("label of node " + n.id, false, [&](Network& d) { d.nodes[v].label = s; });
  if (edit_number("x", n.x.value_or(0), x)) edit("move node " + n.id, false, [&](Network& d) { d.nodes[v].x = x; });
  if (edit_number("y", n.y.value_or(0), x)) edit("move node " + n.id, false, [&](Network& d) { d.nodes[v].y = x; });
  if (edit_number("supply", n.supply, x)) edit("supply of node " + n.id, true, [&](Network& d) { d.nodes[v].supply = x; });
  ImGui::TextDisabled("supply: > 0 sends, < 0 receives (min-cost flow in the command line)");
}

void arc_inspector(int e) {
  App& a = app();
  const Arc& arc = a.doc.arcs[e];
  ImGui::Text("Arc %s", arc.id.c_str());
  std::string s;
  double x;
  int v;
  if (edit_id(a.doc.arcs, arc.id, s)) edit("rename arc " + arc.id, true, [&](Network& d) { d.arcs[e].id = s; });
  if (edit_node_ref("from", arc.from, v)) edit("move arc " + arc.id, true, [&](Network& d) { d.arcs[e].from = v; });
  if (edit_node_ref("to", arc.to, v)) edit("move arc " + arc.id, true, [&](Network& d) { d.arcs[e].to = v; });
  if (edit_number("capacity", arc.capacity, x)) edit("capacity of arc " + arc.id, true, [&](Network& d) { d.arcs[e].capacity = x; });
  ImGui::SameLine();
  ImGui::TextDisabled("%s", a.doc.units.capacity.c_str());
  if (edit_number("cost", arc.cost.value_or(0), x)) edit("cost of arc " + arc.id, true, [&](Network& d) { d.arcs[e].cost = x; });
  bool on = arc.enabled;
  if (ImGui::Checkbox("in service", &on))
    edit(std::string(on ? "restore" : "take out") + " arc " + arc.id, true, [&](Network& d) { d.arcs[e].enabled = on; });
  bool two_way = arc.shared_two_way;
  if (ImGui::Checkbox("shared two-way (both directions use one capacity)", &two_way))
    edit("two-way setting of arc " + arc.id, true, [&](Network& d) { d.arcs[e].shared_two_way = two_way; });
  if (const MultiflowResult* r = current_result(); r && e < static_cast<int>(r->arcs.size())) {
    const ArcLoad& l = r->arcs[e];
    ImGui::Separator();
    ImGui::Text("load %.6g, utilisation %.1f %%", l.load, 100 * l.utilisation);
    ImGui::Text("shadow price %.4g%s", l.shadow_price, l.tier ? (", binds in tier " + std::to_string(l.tier)).c_str() : "");
    for (auto [k, f] : l.per_demand) ImGui::BulletText("%s: %.6g", a.doc.demands[k].id.c_str(), f);
  }
}

void demand_inspector(int k) {
  App& a = app();
  const Demand& dm = a.doc.demands[k];
  ImGui::Text("Demand %s", dm.id.c_str());
  std::string s;
  double x;
  int v;
  if (edit_id(a.doc.demands, dm.id, s)) edit("rename demand " + dm.id, true, [&](Network& d) { d.demands[k].id = s; });
  if (edit_text("label", dm.label, s)) edit("label of demand " + dm.id, false, [&](Network& d) { d.demands[k].label = s; });
  if (edit_node_ref("origin", dm.origin, v)) edit("origin of demand " + dm.id, true, [&](Network& d) { d.demands[k].origin = v; });
  if (edit_node_ref("destination", dm.destination, v))
    edit("destination of demand " + dm.id, true, [&](Network& d) { d.demands[k].destination = v; });
  bool as_much = !dm.amount.has_value();
  if (ImGui::Checkbox("as much as possible", &as_much))
    edit("amount of demand " + dm.id, true, [&](Network& d) {
      if (as_much) d.demands[k].amount.reset();
      else d.demands[k].amount = 1.0;
    });
  if (dm.amount && edit_number("amount", *dm.amount, x))
    edit("amount of demand " + dm.id, true, [&](Network& d) { d.demands[k].amount = x; });
  if (edit_number("weight", dm.weight, x)) edit("weight of demand " + dm.id, true, [&](Network& d) { d.demands[k].weight = x; });
}

}  // namespace

void draw_inspector() {
  App& a = app();
  const Selection& sel = a.selection;
  const std::size_t count = sel.nodes.size() + sel.arcs.size() + sel.demands.size();
  if (count == 0) {
    network_inspector();
    ImGui::Separator();
    ImGui::TextWrapped("Nothing selected. Click a node or an arc on the canvas, drag a box around nodes, or pick a "
                       "demand in the Demands tab.");
    return;
  }
  ImGui::PushItemWidth(220 * ui_scale());
  if (count == 1) {
    if (!sel.nodes.empty()) node_inspector(sel.nodes[0]);
    if (!sel.arcs.empty()) arc_inspector(sel.arcs[0]);
    if (!sel.demands.empty()) demand_inspector(sel.demands[0]);
  } else {
    ImGui::Text("%zu nodes, %zu arcs, %zu demands selected", sel.nodes.size(), sel.arcs.size(), sel.demands.size());
  }
  ImGui::PopItemWidth();
  if (!sel.arcs.empty()) {
    ImGui::Separator();
    const std::vector<int> arcs = sel.arcs;
    const std::string n = std::to_string(arcs.size()) + (arcs.size() == 1 ? " arc" : " arcs");
    if (ImGui::Button("Take out of service (failure)")) action("take-out-selected");
    ImGui::SameLine();
    if (ImGui::Button("Restore to service")) action("restore-selected");
    static float factor = 2.0f;
    ImGui::SetNextItemWidth(120 * ui_scale());
    ImGui::InputFloat("##factor", &factor, 0, 0, "%.3g");
    ImGui::SameLine();
    if (ImGui::Button("Multiply capacity (upgrade)") && std::isfinite(factor) && factor >= 0)
      edit("capacity x" + std::to_string(factor) + " on " + n, true, [&](Network& d) {
        for (int e : arcs) d.arcs[e].capacity *= factor;
      });
  }
  ImGui::Separator();
  if (ImGui::Button("Delete selected (Del)")) delete_selection();
}

}  // namespace apportion::web
