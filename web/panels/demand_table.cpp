// The demands as an editable table: one row per demand, every cell an edit with undo,
// origin and destination typed as node ids. Rows are clipped, filtered and sorted
// (table_rows.h), so tens of thousands of demands scroll smoothly.
#include <imgui.h>

#include <string>

#include "app/app_state.h"
#include "apportion/model/number_text.h"
#include "panels/field_editors.h"
#include "panels/panels.h"
#include "panels/table_rows.h"

namespace apportion::web {

const std::vector<int>& demand_rows() {
  static RowOrder order;
  const Network& net = app().doc;
  auto amount = [&](int k) { return net.demands[k].amount ? *net.demands[k].amount : 1e300; };  // max sorts last
  return order.update(
      {app().doc_changes, 0}, static_cast<int>(net.demands.size()), app().demand_view,
      [&](int k, const std::string& needle) { return demand_matches(net, k, needle); },
      [&](int x, int y, int column) {
        const Demand &p = net.demands[x], &q = net.demands[y];
        switch (column) {
          case 0: return p.label < q.label;
          case 1: return p.id < q.id;
          case 2: return net.nodes[p.origin].id < net.nodes[q.origin].id;
          case 3: return net.nodes[p.destination].id < net.nodes[q.destination].id;
          case 4: return amount(x) < amount(y);
          case 5: return p.weight < q.weight;
        }
        return false;
      });
}

void draw_demand_table() {
  App& a = app();
  if (ImGui::Button("Add demand")) {
    if (a.doc.node_count() < 2) {
      a.notice = "A demand needs two nodes; add nodes first.";
    } else {
      int k = -1;
      edit("add a demand", true, [&](Network& d) { k = add_demand(d, 0, d.node_count() - 1); });
      a.selection = Selection{};
      a.selection.demands.push_back(k);
    }
  }
  ImGui::SameLine();
  ImGui::TextDisabled("or use the Add demand tool: click its origin, then its destination");
  filter_box("##demand-filter", a.demand_view, "filter: id, label, origin or destination");
  const std::vector<int>& rows = demand_rows();
  ImGui::SameLine();
  ImGui::TextDisabled("%zu of %zu demands; click a header to sort", rows.size(), a.doc.demands.size());
  const ImGuiTableFlags flags = ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_ScrollY |
                                ImGuiTableFlags_Resizable | ImGuiTableFlags_SizingStretchProp |
                                ImGuiTableFlags_Sortable | ImGuiTableFlags_SortTristate;
  if (!ImGui::BeginTable("demand-table", 7, flags)) return;
  ImGui::TableSetupScrollFreeze(0, 1);
  ImGui::TableSetupColumn("label");  // labels first, as the shares table shows them
  ImGui::TableSetupColumn("id");
  ImGui::TableSetupColumn("origin (node id)");
  ImGui::TableSetupColumn("destination (node id)");
  ImGui::TableSetupColumn("amount (empty: max)");
  ImGui::TableSetupColumn("weight");
  ImGui::TableSetupColumn("", ImGuiTableColumnFlags_WidthFixed | ImGuiTableColumnFlags_NoSort);
  ImGui::TableHeadersRow();
  take_sort_specs(a.demand_view);
  ImGuiListClipper clipper;
  clipper.Begin(static_cast<int>(rows.size()));
  int remove = -1;
  while (clipper.Step()) {
    for (int row = clipper.DisplayStart; row < clipper.DisplayEnd; ++row) {
      const int k = rows[row];
      const Demand& dm = a.doc.demands[k];
      ImGui::PushID(k);
      ImGui::TableNextRow();
      std::string s;
      double x;
      ImGui::TableNextColumn();
      ImGui::SetNextItemWidth(-1);
      if (edit_text("##label", dm.label, s)) edit("label of demand " + dm.id, false, [&](Network& d) { d.demands[k].label = s; });
      ImGui::TableNextColumn();
      ImGui::SetNextItemWidth(-1);
      if (edit_text("##id", dm.id, s)) {
        if (s.empty() || a.doc.find_demand(s) >= 0) a.notice = "The demand id '" + s + "' is empty or taken.";
        else edit("rename demand " + dm.id, true, [&](Network& d) { d.demands[k].id = s; });
      }
      for (int end = 0; end < 2; ++end) {
        ImGui::TableNextColumn();
        ImGui::SetNextItemWidth(-1);
        const int node = end == 0 ? dm.origin : dm.destination;
        const bool typed = edit_text(end == 0 ? "##origin" : "##destination", a.doc.nodes[node].id, s);
        if (ImGui::IsItemHovered() && !a.doc.nodes[node].label.empty())
          ImGui::SetTooltip("%s", a.doc.nodes[node].label.c_str());
        if (typed) {
          const int v = a.doc.find_node(s);
          if (v < 0) a.notice = "There is no node '" + s + "'.";
          else
            edit((end == 0 ? "origin of demand " : "destination of demand ") + dm.id, true, [&](Network& d) {
              (end == 0 ? d.demands[k].origin : d.demands[k].destination) = v;
            });
        }
      }
      ImGui::TableNextColumn();
      ImGui::SetNextItemWidth(-1);
      if (edit_text("##amount", dm.amount ? format_number(*dm.amount) : std::string(), s)) {
        const std::optional<double> v = parse_number(s);
        if (s.empty()) edit("amount of demand " + dm.id, true, [&](Network& d) { d.demands[k].amount.reset(); });
        else if (v && *v >= 0)
          edit("amount of demand " + dm.id, true, [&](Network& d) { d.demands[k].amount = *v; });
        else a.notice = "The amount must be a number >= 0, or empty for as much as possible.";
      }
      ImGui::TableNextColumn();
      ImGui::SetNextItemWidth(-1);
      if (edit_number("##weight", dm.weight, x)) edit("weight of demand " + dm.id, true, [&](Network& d) { d.demands[k].weight = x; });
      ImGui::TableNextColumn();
      if (ImGui::SmallButton("x")) remove = k;
      if (ImGui::IsItemHovered()) ImGui::SetTooltip("Delete demand %s", dm.id.c_str());
      ImGui::PopID();
    }
  }
  ImGui::EndTable();
  if (remove >= 0) {
    Selection sel;
    sel.demands.push_back(remove);
    edit("delete demand " + a.doc.demands[remove].id, true, [&](Network& d) { remove_items(d, sel); });
  }
}

}  // namespace apportion::web
