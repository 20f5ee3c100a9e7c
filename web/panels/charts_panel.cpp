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
#include "apportion/results/network_svg.h"
#include "panels/panels.h"

namespace apportion::web {

namespace {

// Two Okabe-Ito colours alternate between tiers, so neighbouring tiers always differ.
constexpr ImU32 kTierColours[] = {IM_COL32(0, 114, 178, 255), IM_COL32(230, 159, 0, 255)};
constexpr ImU32 kAxis = IM_COL32(200, 204, 212, 255);

// A frame for a bar chart; returns the plot box.
bool chart_frame(const char* id, float height, ImVec2& p0, ImVec2& p1) {
  const float w = ImGui::GetContentRegionAvail().x;
  if (w < 40) return false;
  ImGui::InvisibleButton(id, ImVec2(w, height));
  p0 = ImGui::GetItemRectMin();
  p1 = ImGui::GetItemRectMax();
  ImDrawList* dl = ImGui::GetWindowDrawList();
  dl->AddRect(p0, p1, IM_COL32(90, 96, 110, 255));
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
  const float s = 1.0f;  // layout in CSS pixels (see main.cpp)
  ImDrawList* dl = ImGui::GetWindowDrawList();
  const ImVec2 mouse = ImGui::GetIO().MousePos;

  // 1. Normalised shares, sorted, coloured by tier.
  ImGui::TextUnformatted("Normalised shares (share / weight), smallest first; colour changes with the tier");
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
  if (K > 0 && top > 0 && chart_frame("shares-chart", 200 * s, p0, p1)) {
    // More demands than pixels: one bar per pixel column, the largest share of the demands
    // it covers (the shares are sorted, so the staircase keeps its shape), and the hover
    // names the range. Fewer: one bar per demand.
    const int bars = std::max(1, std::min(K, static_cast<int>(p1.x - p0.x)));
    a.chart_bars = bars;
    const float w = (p1.x - p0.x) / bars, h = p1.y - p0.y - 4 * s;
    int hovered = -1, hovered_first = -1;
    for (int b = 0; b < bars; ++b) {
      const int first = static_cast<int>(static_cast<long long>(b) * K / bars);
      const int last = static_cast<int>(static_cast<long long>(b + 1) * K / bars) - 1;
      const DemandShare& d = r->demands[order[last]];
      const float bar = static_cast<float>(d.normalised / top) * h;
      const ImVec2 a0(p0.x + b * w + (w > 3 ? 1 : 0), p1.y - bar), a1(p0.x + (b + 1) * w, p1.y);
      dl->AddRectFilled(a0, a1, kTierColours[std::max(0, d.tier) % 2]);
      if (bars == K && order[b] == a.view.filter_demand)
        dl->AddRect(ImVec2(a0.x - 1, a0.y - 1), a1, IM_COL32(255, 255, 255, 255), 0, 0, 2 * s);
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
      for (float x = p0.x; x < p1.x; x += 8 * s) dl->AddLine(ImVec2(x, y), ImVec2(std::min(x + 4 * s, p1.x), y), kAxis);
    }
    char label[64];
    std::snprintf(label, sizeof label, "%.4g", top);
    dl->AddText(ImVec2(p0.x + 4 * s, p0.y + 2 * s), kAxis, label);
    if (hovered >= 0 && ImGui::IsItemHovered()) {
      const DemandShare& d = r->demands[hovered];
      ImGui::SetTooltip("%s: share %.6g, normalised %.6g, tier %d", net.demands[hovered].id.c_str(), d.share, d.normalised,
                        d.tier);
      if (ImGui::IsItemClicked()) a.view.filter_demand = hovered, a.view.filter_tier = 0;
    }
  }

  // 2. Arc utilisation, sorted, fullest first.
  ImGui::Spacing();
  ImGui::TextUnformatted("Arc utilisation, fullest first (line: 100 %)");
  const int M = static_cast<int>(std::min<std::size_t>(net.arcs.size(), r->arcs.size()));
  std::vector<int> arcs(M);
  std::iota(arcs.begin(), arcs.end(), 0);
  std::stable_sort(arcs.begin(), arcs.end(), [&](int i, int j) { return r->arcs[i].utilisation > r->arcs[j].utilisation; });
  if (M > 0 && chart_frame("utilisation-chart", 160 * s, p0, p1)) {
    const float w = (p1.x - p0.x) / M, h = p1.y - p0.y - 14 * s;
    int hovered = -1;
    for (int i = 0; i < M; ++i) {
      const ArcLoad& l = r->arcs[arcs[i]];
      const float bar = static_cast<float>(std::min(1.0, l.utilisation)) * h;
      const Rgb c = utilisation_colour(l.utilisation);
      const ImVec2 a0(p0.x + i * w + (w > 3 ? 1 : 0), p1.y - bar), a1(p0.x + (i + 1) * w, p1.y);
      dl->AddRectFilled(a0, a1, ImGui::ColorConvertFloat4ToU32(ImVec4(c.r, c.g, c.b, 1)));
      if (mouse.x >= a0.x - (w > 3 ? 1 : 0) && mouse.x < a1.x && mouse.y >= p0.y && mouse.y <= p1.y) hovered = arcs[i];
    }
    dl->AddLine(ImVec2(p0.x, p1.y - h), ImVec2(p1.x, p1.y - h), kAxis);
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
