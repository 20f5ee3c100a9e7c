// The result: totals, what the shares are bound by, a filter that shows one demand or one
// tier on the canvas, and the shares table with the change since the previous result (what
// the last edit -- a failure, an upgrade -- did to each demand).
#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

#include "app/app_state.h"
#include "panels/panels.h"
#include "panels/table_rows.h"

namespace apportion::web {

// The change of demand k since the previous result: NaN when it is new or none is known.
double share_change(int k) {
  const App& a = app();
  if (a.previous_shares.empty() || k >= static_cast<int>(a.result.demands.size())) return std::nan("");
  auto before = a.previous_shares.find(a.doc.demands[k].id);
  return before == a.previous_shares.end() ? std::nan("") : a.result.demands[k].share - before->second;
}

const std::vector<int>& share_rows() {
  static RowOrder order;
  const App& a = app();
  const Network& net = a.doc;
  const MultiflowResult& r = a.result;
  const int count = result_is_current() ? static_cast<int>(std::min(net.demands.size(), r.demands.size())) : 0;
  // Rows change with the result as well as with the document.
  return order.update(
      {a.doc_changes, a.result_changes}, count, a.share_view,
      [&](int k, const std::string& needle) { return demand_matches(net, k, needle); },
      [&](int x, int y, int column) {
        const DemandShare &p = r.demands[x], &q = r.demands[y];
        auto change = [](double c) { return std::isnan(c) ? -1e300 : c; };
        switch (column) {
          case 0: return net.demands[x].id < net.demands[y].id;
          case 1: return p.share < q.share;
          case 2: return p.percent_of_amount < q.percent_of_amount;
          case 3: return p.tier < q.tier;
          case 4: return p.binding_arcs.size() < q.binding_arcs.size();
          case 5: return change(share_change(x)) < change(share_change(y));
        }
        return false;
      });
}

void draw_result_panel() {
  App& a = app();
  const Network& net = a.doc;
  if (!result_is_current()) {
    ImGui::TextWrapped(a.solve.running ? "Solving..." : "No result for the network as it is now: press Solve.");
    return;
  }
  const MultiflowResult& r = a.result;
  if (r.status != SolveStatus::kOptimal) {
    ImGui::TextWrapped("Not solved (%s): %s", status_name(r.status), r.message.c_str());
    return;
  }
  const char* unit = net.units.capacity.c_str();
  if (r.objective == FairObjective::kFeasibility) {
    if (r.all_demands_met)
      ImGui::TextWrapped("Every demand can be met in full (lambda = %.4g).", r.lambda);
    else
      ImGui::TextWrapped("Not every demand can be met: at most %.1f%% of every amount at once; at best %.6g %s stay "
                         "undelivered.", 100 * r.lambda, r.shortfall, unit);
  }
  ImGui::Text("Throughput %.6g %s", r.throughput, unit);
  ImGui::Text("Minimum normalised share %.6g, Jain's index %.4f", r.min_normalised_share, r.jain_index);
  if (r.lambda >= 0) ImGui::Text("Max concurrent flow lambda %.6g", r.lambda);
  if (r.price_of_fairness >= 0)
    ImGui::Text("Price of fairness %.2f%% of the maximum throughput %.6g", 100 * r.price_of_fairness, r.max_throughput);
  ImGui::Text("Independent check: %s (largest capacity excess %.2g of the arc's capacity)", r.check.ok ? "passed" : "FAILED",
              r.check.max_capacity_violation);

  // Filter: everything, one demand, or one tier.
  std::string preview = "all demands";
  if (a.view.filter_demand >= 0 && a.view.filter_demand < static_cast<int>(net.demands.size()))
    preview = "demand " + net.demands[a.view.filter_demand].id;
  else if (a.view.filter_tier > 0)
    preview = "tier " + std::to_string(a.view.filter_tier);
  ImGui::SetNextItemWidth(220);
  if (ImGui::BeginCombo("show on the canvas", preview.c_str())) {
    if (ImGui::Selectable("all demands", a.view.filter_demand < 0 && a.view.filter_tier == 0))
      a.view.filter_demand = -1, a.view.filter_tier = 0;
    for (const Tier& t : r.tiers) {
      char label[96];
      std::snprintf(label, sizeof label, "tier %d (level %.4g, %zu demands)", t.index, t.level, t.demands.size());
      if (ImGui::Selectable(label, a.view.filter_tier == t.index)) a.view.filter_tier = t.index, a.view.filter_demand = -1;
    }
    ImGui::EndCombo();
  }

  const bool have_change = !a.previous_shares.empty();
  if (have_change) ImGui::TextDisabled("%s", a.change_caption.c_str());
  filter_box("##share-filter", a.share_view, "filter: id, label, origin or destination");
  const std::vector<int>& rows = share_rows();
  ImGui::SameLine();
  ImGui::TextDisabled("%zu of %zu demands; click a header to sort", rows.size(), r.demands.size());
  const ImGuiTableFlags flags = ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_Resizable |
                                ImGuiTableFlags_ScrollY | ImGuiTableFlags_SizingStretchProp | ImGuiTableFlags_Sortable |
                                ImGuiTableFlags_SortTristate;
  if (!ImGui::BeginTable("shares", have_change ? 6 : 5, flags)) return;
  ImGui::TableSetupScrollFreeze(0, 1);
  ImGui::TableSetupColumn("Demand");
  ImGui::TableSetupColumn("Share");
  ImGui::TableSetupColumn("% of amount");
  ImGui::TableSetupColumn("Tier");
  ImGui::TableSetupColumn("Bound by");
  if (have_change) ImGui::TableSetupColumn("Change");
  ImGui::TableHeadersRow();
  take_sort_specs(a.share_view);
  ImGuiListClipper clipper;
  clipper.Begin(static_cast<int>(rows.size()));
  while (clipper.Step()) {
    for (int row = clipper.DisplayStart; row < clipper.DisplayEnd; ++row) {
      const int k = rows[row];
      const DemandShare& d = r.demands[k];
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      // Selecting a demand shows its paths and binding arcs on the canvas.
      const bool selected = a.view.filter_demand == k;
      if (ImGui::Selectable(net.demands[k].id.c_str(), selected, ImGuiSelectableFlags_SpanAllColumns)) {
        a.view.filter_demand = selected ? -1 : k;
        a.view.filter_tier = 0;
        a.selection = Selection{};
        if (!selected) a.selection.demands.push_back(k);
      }
      if (!net.demands[k].label.empty() && ImGui::IsItemHovered()) ImGui::SetTooltip("%s", net.demands[k].label.c_str());
      ImGui::TableNextColumn();
      ImGui::Text("%.6g", d.share);
      ImGui::TableNextColumn();
      if (d.percent_of_amount >= 0) ImGui::Text("%.1f%%", d.percent_of_amount);
      else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      if (d.tier) ImGui::Text("%d", d.tier);
      else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      std::string bound = d.limited_by_amount ? "its amount" : "";
      for (int e : d.binding_arcs) bound += (bound.empty() ? "" : " ") + net.arcs[e].id;
      if (d.binding_arcs_form_cut) bound += " (cut)";
      ImGui::TextUnformatted(bound.c_str());
      if (have_change) {
        ImGui::TableNextColumn();
        auto before = a.previous_shares.find(net.demands[k].id);
        if (before == a.previous_shares.end()) {
          ImGui::TextUnformatted("new");
        } else {
          const double delta = share_change(k);
          if (std::abs(delta) <= 1e-9 * std::max(1.0, std::abs(before->second))) ImGui::TextUnformatted("=");
          else ImGui::Text("%+.6g", delta);
        }
      }
    }
  }
  ImGui::EndTable();
}

}  // namespace apportion::web
