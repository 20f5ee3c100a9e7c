// Two charts of the result, drawn with ImGui's draw lists: the demands' normalised shares
// sorted from smallest to largest, coloured by tier with each tier's level marked (the
// max-min staircase), and the arcs' utilisation sorted from fullest, with the 100 % line.
// Hovering a bar names its demand or arc; clicking it shows it on the canvas.
#include <imgui.h>

#include <algorithm>
#include <cstdio>
#include <numeric>
#include <string>
#include <vector>

#include "app/app_state.h"
#include "app/appearance.h"
#include "apportion/results/network_svg.h"
#include "panels/panels.h"

namespace apportion::web {

namespace {

// A bar chart's frame: a y axis with five ticks labelled from 0 to y_max, an x axis with its
// name below, in the theme's colours. Returns the plot box inside the axes, and notes the
// tick labels for the test hook.
bool chart_frame(const char* id, float height, double y_max, const char* y_format, const char* x_label, ImVec2& p0,
                 ImVec2& p1) {
  const Palette& colours = palette();
  const float w = ImGui::GetContentRegionAvail().x;
  if (w < 80) return false;
  char ticks[5][32];
  float label_w = 0;
  for (int i = 0; i < 5; ++i) {
    std::snprintf(ticks[i], sizeof ticks[i], y_format, y_max * i / 4);
    label_w = std::max(label_w, ImGui::CalcTextSize(ticks[i]).x);
  }
  const float line = ImGui::GetTextLineHeight(), pad = 4 * ui_scale();
  ImGui::InvisibleButton(id, ImVec2(w, height));
  const ImVec2 b0 = ImGui::GetItemRectMin(), b1 = ImGui::GetItemRectMax();
  p0 = ImVec2(b0.x + label_w + 2 * pad, b0.y + line / 2);
  p1 = ImVec2(b1.x - pad, b1.y - line - 2 * pad);
  ImDrawList* dl = ImGui::GetWindowDrawList();
  dl->AddRect(p0, p1, colours.chart_frame);
  for (int i = 0; i < 5; ++i) {
    const float y = p1.y - (p1.y - p0.y) * i / 4;
    dl->AddLine(ImVec2(p0.x - pad, y), ImVec2(p0.x, y), colours.chart_axis);
    const ImVec2 size = ImGui::CalcTextSize(ticks[i]);
    dl->AddText(ImVec2(p0.x - pad - 2 - size.x, y - size.y / 2), colours.chart_axis, ticks[i]);
  }
  const ImVec2 xs = ImGui::CalcTextSize(x_label);
  dl->AddText(ImVec2((p0.x + p1.x - xs.x) / 2, p1.y + pad), colours.chart_axis, x_label);
  app().chart_ticks.push_back(ticks[4]);
  return true;
}

}  // namespace

void draw_charts() {
  App& a = app();
  const MultiflowResult* r = current_result();
  if (!r) {
    ImGui::TextWrapped("Charts appear once the network as it is now has been solved.");
    return;
  }
  const Network& net = a.doc;
  const float s = ui_scale();  // layout in CSS pixels (see main.cpp), times the text size
  const Palette& colours = palette();
  a.chart_ticks.clear();
  ImDrawList* dl = ImGui::GetWindowDrawList();
  const ImVec2 mouse = ImGui::GetIO().MousePos;

  // 1. Normalised shares, sorted, coloured by tier.
  const std::string unit = net.units.capacity.empty() ? "" : " (" + net.units.capacity + " per unit of weight)";
  ImGui::TextWrapped("Normalised shares%s, smallest first; the colour changes with the tier, dashes mark the tiers' "
                     "levels", unit.c_str());
  const int K = static_cast<int>(std::min(net.demands.size(), r->demands.size()));
  // The sort is kept until the next result: 40,000 demands take milliseconds to sort.
  static std::vector<int> order;
  static long long sorted_for = -1;
  if (sorted_for != a.result_changes || static_cast<int>(order.size()) != K) {
    order.resize(K);
    std::iota(order.begin(), order.end(), 0);
    std::stable_sort(order.begin(), order.end(),
                     [&](int i, int j) { return r->demands[i].normalised < r->demands[j].normalised; });
    sorted_for = a.result_changes;
  }
  double top = 0;
  for (int k : order) top = std::max(top, r->demands[k].normalised);
  ImVec2 p0, p1;
  const std::string x_shares = std::to_string(K) + " demands, sorted by normalised share";
  if (K > 0 && top > 0 && chart_frame("shares-chart", 220 * s, top, "%.4g", x_shares.c_str(), p0, p1)) {
    // More demands than pixels: one bar per pixel column, the largest share of the demands
    // it covers (the shares are sorted, so the staircase keeps its shape), and the hover
    // names the range. Fewer: one bar per demand.
    const int bars = std::max(1, std::min(K, static_cast<int>(p1.x - p0.x)));
    a.chart_bars = bars;
    const float w = (p1.x - p0.x) / bars, h = p1.y - p0.y;
    int hovered = -1, hovered_first = -1;
    for (int b = 0; b < bars; ++b) {
      const int first = static_cast<int>(static_cast<long long>(b) * K / bars);
      const int last = static_cast<int>(static_cast<long long>(b + 1) * K / bars) - 1;
      const DemandShare& d = r->demands[order[last]];
      const float bar = static_cast<float>(d.normalised / top) * h;
      const ImVec2 a0(p0.x + b * w + (w > 3 ? 1 : 0), p1.y - bar), a1(p0.x + (b + 1) * w, p1.y);
      dl->AddRectFilled(a0, a1, colours.tier_colours[std::max(0, d.tier) % 2]);
      if (bars == K && order[b] == a.view.filter_demand)
        dl->AddRect(ImVec2(a0.x - 1, a0.y - 1), a1, colours.focus, 0, 0, 2 * s);
      if (mouse.x >= a0.x - (w > 3 ? 1 : 0) && mouse.x < a1.x && mouse.y >= p0.y && mouse.y <= p1.y)
        hovered = order[last], hovered_first = order[first];
    }
    if (bars < K && hovered >= 0 && ImGui::IsItemHovered()) {
      ImGui::SetTooltip("%d demands to a pixel here: normalised shares %.6g to %.6g", (K + bars - 1) / bars,
                        r->demands[hovered_first].normalised, r->demands[hovered].normalised);
      hovered = -1;
    }
    for (const Tier& t : r->tiers) {  // tier levels as dashed guides
      const float y = p1.y - static_cast<float>(t.level / top) * h;
      if (t.level <= 0 || t.level > top) continue;
      for (float x = p0.x; x < p1.x; x += 8 * s)
        dl->AddLine(ImVec2(x, y), ImVec2(std::min(x + 4 * s, p1.x), y), colours.chart_axis);
    }
    if (hovered >= 0 && ImGui::IsItemHovered()) {
      const DemandShare& d = r->demands[hovered];
      ImGui::SetTooltip("%s: share %.6g, normalised %.6g, tier %d", net.demands[hovered].id.c_str(), d.share, d.normalised,
                        d.tier);
      if (ImGui::IsItemClicked()) a.view.filter_demand = hovered, a.view.filter_tier = 0;
    }
  }

  // 2. Arc utilisation, sorted, fullest first.
  ImGui::Spacing();
  ImGui::TextWrapped("Arc utilisation (%% of capacity), fullest first; the line is 100 %%");
  const int M = static_cast<int>(std::min<std::size_t>(net.arcs.size(), r->arcs.size()));
  std::vector<int> arcs(M);
  std::iota(arcs.begin(), arcs.end(), 0);
  std::stable_sort(arcs.begin(), arcs.end(), [&](int i, int j) { return r->arcs[i].utilisation > r->arcs[j].utilisation; });
  const std::string x_arcs = std::to_string(M) + " arcs, sorted by utilisation";
  if (M > 0 && chart_frame("utilisation-chart", 180 * s, 100, "%.0f %%", x_arcs.c_str(), p0, p1)) {
    const float w = (p1.x - p0.x) / M, h = p1.y - p0.y;
    int hovered = -1;
    for (int i = 0; i < M; ++i) {
      const ArcLoad& l = r->arcs[arcs[i]];
      const float bar = static_cast<float>(std::min(1.0, l.utilisation)) * h;
      const Rgb c = utilisation_colour(l.utilisation, colours.picture);
      const ImVec2 a0(p0.x + i * w + (w > 3 ? 1 : 0), p1.y - bar), a1(p0.x + (i + 1) * w, p1.y);
      dl->AddRectFilled(a0, a1, ImGui::ColorConvertFloat4ToU32(ImVec4(c.r, c.g, c.b, 1)));
      if (mouse.x >= a0.x - (w > 3 ? 1 : 0) && mouse.x < a1.x && mouse.y >= p0.y && mouse.y <= p1.y) hovered = arcs[i];
    }
    dl->AddLine(ImVec2(p0.x, p1.y - h), ImVec2(p1.x, p1.y - h), colours.chart_axis);
    if (hovered >= 0 && ImGui::IsItemHovered()) {
      const ArcLoad& l = r->arcs[hovered];
      ImGui::SetTooltip("%s: load %.6g of %.6g (%.1f %%)", net.arcs[hovered].id.c_str(), l.load, net.arcs[hovered].capacity,
                        100 * l.utilisation);
      if (ImGui::IsItemClicked()) {
        a.selection = Selection{};
        a.selection.arcs.push_back(hovered);
      }
    }
  }
}

}  // namespace apportion::web
