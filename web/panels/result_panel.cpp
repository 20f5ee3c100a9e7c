// The result: totals, what the shares are bound by, a filter that shows one demand or one
// tier on the canvas, and the shares table with the change since the previous result (what
// the last edit -- a failure, an upgrade -- did to each demand).
#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

#include "app/app_state.h"
#include "app/appearance.h"
#include "panels/field_editors.h"
#include "panels/panels.h"
#include "panels/table_rows.h"
#include "apportion/results/zero_share_reason.h"

namespace apportion::web {

// The change of demand k since the previous result: NaN when it is new or none is known.
double share_change(int k) {
  const App& a = app();
  if (a.previous_shares.empty() || k >= static_cast<int>(a.result.demands.size())) return std::nan("");
  auto before = a.previous_shares.find(a.doc.demands[k].id);
  return before == a.previous_shares.end() ? std::nan("") : a.result.demands[k].share - before->second;
}

namespace {

// A demand's ends as the canvas names them.
std::string ends_name(const Network& net, int k) {
  return shown_name(net.nodes[net.demands[k].origin]) + " \u2192 " + shown_name(net.nodes[net.demands[k].destination]);
}
// What stops demand k: its amount, the arcs that bind it (by their ends' names), or why it
// got nothing at all.
std::string bound_text(const Network& net, const MultiflowResult& r, int k) {
  const DemandShare& d = r.demands[k];
  if (d.limited_by_amount) return "its amount";
  const std::string zero = zero_share_reason(net, r, k);
  if (!zero.empty() && d.binding_arcs.empty()) return "0: " + zero;
  std::string bound;
  for (int e : d.binding_arcs) bound += (bound.empty() ? "" : ", ") + arc_name(net, e);
  if (d.binding_arcs_form_cut) bound += " (a cut)";
  return bound;
}

}  // namespace

std::string share_bound_text(int k) {
  const App& a = app();
  if (!result_is_current() || k < 0 || k >= static_cast<int>(std::min(a.doc.demands.size(), a.result.demands.size())))
    return "";
  return bound_text(a.doc, a.result, k);
}

const std::vector<int>& share_rows() {
  static RowOrder order;
  const App& a = app();
  const Network& net = a.doc;
  const MultiflowResult& r = a.result;
  const int count = result_is_current() ? static_cast<int>(std::min(net.demands.size(), r.demands.size())) : 0;
  // The text columns' keys, made once per sort rather than twice per comparison (a sort of
  // 40,000 rows makes about a million comparisons; "Bound by" may search the network).
  static std::vector<std::string> keys;
  int keyed_column = -1;
  auto key = [&](int k, int column) -> const std::string& {
    if (keyed_column != column) {
      keys.assign(count, std::string());
      for (int i = 0; i < count; ++i)
        keys[i] = column == 0 ? shown_name(net.demands[i]) : column == 4 ? bound_text(net, r, i) : ends_name(net, i);
      keyed_column = column;
    }
    return keys[k];
  };
  // Rows change with the result as well as with the document.
  return order.update(
      {a.doc_changes, a.result_changes}, count, a.share_view,
      [&](int k, const std::string& needle) { return demand_matches(net, k, needle); },
      [&](int x, int y, int column) {
        const DemandShare &p = r.demands[x], &q = r.demands[y];
        auto change = [](double c) { return std::isnan(c) ? -1e300 : c; };
        switch (column) {
          case 0: return key(x, 0) < key(y, 0);
          case 1: return p.share < q.share;
          case 2: return p.percent_of_amount < q.percent_of_amount;
          case 3: return p.tier < q.tier;
          case 4: return key(x, 4) < key(y, 4);
          case 5: return key(x, 5) < key(y, 5);
          case 6: return change(share_change(x)) < change(share_change(y));
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
  // What the rule optimises, so that every number below reads against it.
  ImGui::PushTextWrapPos(0);
  for (int i = 0; i < static_cast<int>(std::size(kObjectives)); ++i)
    if (kObjectives[i] == r.objective) ImGui::TextDisabled("%s\n%s", kObjectiveLabels[i], kObjectiveExplanations[i]);
  if (r.objective == FairObjective::kFeasibility) {
    if (r.all_demands_met)
      ImGui::Text("Every demand can be met in full (lambda = %.4g).", r.lambda);
    else
      ImGui::Text("Not every demand can be met: at most %.1f%% of every amount at once; at best %.6g %s stay "
                  "undelivered.", 100 * r.lambda, r.shortfall, unit);
    if (!r.overloaded_cut_source_side.empty())
      ImGui::Text("An overloaded cut (purple on the canvas, its origin side ringed): the demands across it ask for "
                  "%.6g %s, its arcs carry at most %.6g %s.", r.overloaded_cut_demand, unit, r.overloaded_cut_capacity,
                  unit);
  }
  ImGui::Text("Throughput %.6g %s", r.throughput, unit);
  // One figure to a line: ImGui may wrap at a decimal point.
  ImGui::Text("Minimum normalised share %.6g", r.min_normalised_share);
  ImGui::Text("Jain's index %.4f", r.jain_index);
  if (r.lambda >= 0) ImGui::Text("Max concurrent flow lambda %.6g", r.lambda);
  if (r.price_of_fairness >= 0)
    ImGui::Text("Price of fairness %.2f%% of the maximum throughput %.6g %s", 100 * r.price_of_fairness,
                r.max_throughput, unit);
  ImGui::Text("Independent check: %s", r.check.ok ? "passed" : "FAILED");
  if (ImGui::IsItemHovered())
    ImGui::SetTooltip("Largest capacity excess %.2g of the arc's capacity; largest share error %.2g", r.check.max_capacity_violation,
                      r.check.max_share_error);
  // The fairness certificate, when asked for ("prove fairness"): the check above proves the
  // routing feasible, this proves the shares fair.
  const FairnessCertificate& c = r.fairness;
  if (c.status == SolveStatus::kOptimal) {
    const bool proven = c.max_relative_error <= 1e-6;
    ImGui::Text("Fairness %s: every share within %.3g %s of its exact max-min fair share (%.2g of the largest)",
                proven ? "proven" : "NOT proven", c.max_error, unit, c.max_relative_error);
    if (ImGui::IsItemHovered())
      ImGui::SetTooltip("Each demand's exact fair share lies in an interval proven by LPs of the certificate's own:\n"
                        "a routing that gives every demand up to a level its share (lower bounds) and the arcs'\n"
                        "prices (upper bounds), recomputed by shortest paths. %d levels, %d LPs, %.1f s;\n"
                        "the witnesses met their targets to %.2g. The intervals are in the demands CSV export.",
                        c.levels, c.stats.lp_solves, c.seconds, c.witness_tolerance);
  } else if (c.status != SolveStatus::kNotSolved) {
    ImGui::Text("Fairness not proven (%s): %s", status_name(c.status), c.message.c_str());
  }
  ImGui::PopTextWrapPos();

  // Filter: everything, one demand, or one tier.
  std::string preview = "all demands";
  if (a.view.filter_demand >= 0 && a.view.filter_demand < static_cast<int>(net.demands.size()))
    preview = "demand " + net.demands[a.view.filter_demand].id;
  else if (a.view.filter_tier > 0)
    preview = "tier " + std::to_string(a.view.filter_tier);
  const std::string show_label = label_before("Show on the canvas", 0);
  ImGui::SetNextItemWidth(220 * ui_scale());
  if (ImGui::BeginCombo(show_label.c_str(), preview.c_str())) {
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
  // Every column as wide as its content (nothing clipped), the table scrolling sideways when
  // they do not fit, with the demand's column kept in view.
  const ImGuiTableFlags flags = ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_Resizable |
                                ImGuiTableFlags_ScrollY | ImGuiTableFlags_ScrollX | ImGuiTableFlags_SizingFixedFit |
                                ImGuiTableFlags_Sortable | ImGuiTableFlags_SortTristate;
  // With a finished fairness certificate, each share's proven distance from its fair share.
  const bool have_proof = r.fairness.status == SolveStatus::kOptimal && r.fairness.error.size() == r.demands.size();
  if (!ImGui::BeginTable("shares", 6 + (have_change ? 1 : 0) + (have_proof ? 1 : 0), flags)) return;
  ImGui::TableSetupScrollFreeze(1, 1);
  const std::string share_header = net.units.capacity.empty() ? "Share" : "Share (" + net.units.capacity + ")";
  // The numbers first, the ends (also in the demand's tooltip) last.
  ImGui::TableSetupColumn("Demand");
  ImGui::TableSetupColumn(share_header.c_str());
  ImGui::TableSetupColumn("% of amount");
  ImGui::TableSetupColumn("Tier");
  ImGui::TableSetupColumn("Bound by");
  ImGui::TableSetupColumn("From \u2192 to");
  if (have_change) ImGui::TableSetupColumn("Change");
  if (have_proof) ImGui::TableSetupColumn("Proven fair within", ImGuiTableColumnFlags_NoSort);
  ImGui::TableHeadersRow();
  take_sort_specs(a.share_view);
  ImGuiListClipper clipper;
  clipper.Begin(static_cast<int>(rows.size()));
  while (clipper.Step()) {
    for (int row = clipper.DisplayStart; row < clipper.DisplayEnd; ++row) {
      const int k = rows[row];
      const DemandShare& d = r.demands[k];
      const Demand& dm = net.demands[k];
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      // Selecting a demand shows its paths and binding arcs on the canvas.
      const bool selected = a.view.filter_demand == k;
      ImGui::PushID(k);
      if (ImGui::Selectable(shown_name(net.demands[k]).c_str(), selected, ImGuiSelectableFlags_SpanAllColumns)) {
        a.view.filter_demand = selected ? -1 : k;
        a.view.filter_tier = 0;
        a.selection = Selection{};
        if (!selected) a.selection.demands.push_back(k);
      }
      ImGui::PopID();
      if (ImGui::IsItemHovered())
        ImGui::SetTooltip("demand %s%s%s: from %s to %s", dm.id.c_str(), dm.label.empty() ? "" : ", ",
                          dm.label.c_str(), shown_name(net.nodes[dm.origin]).c_str(), shown_name(net.nodes[dm.destination]).c_str());
      if (!dm.label.empty()) {
        ImGui::SameLine();
        ImGui::TextDisabled("%s", dm.id.c_str());
      }
      ImGui::TableNextColumn();
      ImGui::Text("%.6g", d.share);
      ImGui::TableNextColumn();
      if (d.percent_of_amount >= 0) ImGui::Text("%.1f %%", d.percent_of_amount);
      else ImGui::TextDisabled("no amount");
      ImGui::TableNextColumn();
      if (d.tier) ImGui::Text("%d", d.tier);
      else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      const std::string bound = bound_text(net, r, k);
      ImGui::TextUnformatted(bound.c_str());
      if (ImGui::IsItemHovered() && !d.binding_arcs.empty()) {
        std::string ids;
        for (int e : d.binding_arcs) ids += (ids.empty() ? "" : " ") + net.arcs[e].id;
        ImGui::SetTooltip("binding arcs: %s", ids.c_str());
      }
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(ends_name(net, k).c_str());
      if (have_change) {
        ImGui::TableNextColumn();
        auto before = a.previous_shares.find(dm.id);
        if (before == a.previous_shares.end()) {
          ImGui::TextUnformatted("new");
        } else {
          const double delta = share_change(k);
          if (std::abs(delta) <= 1e-9 * std::max(1.0, std::abs(before->second))) ImGui::TextUnformatted("=");
          else ImGui::Text("%+.6g", delta);
        }
      }
      if (have_proof) {
        ImGui::TableNextColumn();
        ImGui::Text("\u00b1 %.2g", r.fairness.error[k]);
        if (ImGui::IsItemHovered())
          ImGui::SetTooltip("Its exact max-min fair share lies in [%.9g, %.9g]", r.fairness.lower[k], r.fairness.upper[k]);
      }
    }
  }
  ImGui::EndTable();
}

}  // namespace apportion::web
