// Drawing of the network canvas; see network_view.h.
#include "network_view.h"

#include <algorithm>
#include <cmath>
#include <imgui.h>

namespace apportion::web {

namespace {
// A sequential scale from muted blue to bright yellow, after the cividis map (readable by
// colour-blind users: it varies in lightness, not only in hue), bright where the load is
// high so that busy arcs stand out on the dark canvas.
ImU32 utilisation_colour(double u) {
  const float t = static_cast<float>(std::clamp(u, 0.0, 1.0));
  const float r = 0.26f + t * (0.99f - 0.26f), g = 0.38f + t * (0.91f - 0.38f), b = 0.60f + t * (0.15f - 0.60f);
  return ImGui::ColorConvertFloat4ToU32(ImVec4(r, g, b, 1.0f));
}
}  // namespace

void draw_network(const Network& net, const MultiflowResult* flow, float ui_scale) {
  ImDrawList* dl = ImGui::GetWindowDrawList();
  const ImVec2 origin = ImGui::GetCursorScreenPos();
  const ImVec2 avail = ImGui::GetContentRegionAvail();
  double min_x = 1e300, max_x = -1e300, min_y = 1e300, max_y = -1e300;
  for (const Node& v : net.nodes) {
    const double x = v.x.value_or(0), y = v.y.value_or(0);
    min_x = std::min(min_x, x), max_x = std::max(max_x, x), min_y = std::min(min_y, y), max_y = std::max(max_y, y);
  }
  if (net.nodes.empty()) return;
  const float pad = 40 * ui_scale;
  const float label_room = 120 * ui_scale;  // node labels are drawn to the right of the node
  const double sx = (avail.x - 2 * pad - label_room) / std::max(1.0, max_x - min_x);
  const double sy = (avail.y - 2 * pad) / std::max(1.0, max_y - min_y);
  const double s = std::min(sx, sy);
  auto at = [&](const Node& v) {
    return ImVec2(origin.x + pad + static_cast<float>((v.x.value_or(0) - min_x) * s),
                  origin.y + pad + static_cast<float>((v.y.value_or(0) - min_y) * s));
  };
  for (int a = 0; a < net.arc_count(); ++a) {
    const Arc& arc = net.arcs[a];
    ImVec2 p = at(net.nodes[arc.from]), q = at(net.nodes[arc.to]);
    // Offset each direction to its own side so both arcs of a pair stay visible.
    const float dx = q.x - p.x, dy = q.y - p.y, len = std::max(1.0f, std::sqrt(dx * dx + dy * dy));
    const float off = arc.shared_two_way ? 0.0f : 4.0f * ui_scale;
    const ImVec2 n(-dy / len * off, dx / len * off);
    p = ImVec2(p.x + n.x, p.y + n.y), q = ImVec2(q.x + n.x, q.y + n.y);
    const double util = flow ? flow->arcs[a].utilisation : 0.0;
    dl->AddLine(p, q, flow ? utilisation_colour(util) : IM_COL32(140, 150, 165, 255), 3.0f * ui_scale);
  }
  for (const Node& v : net.nodes) {
    const ImVec2 c = at(v);
    dl->AddCircleFilled(c, 7 * ui_scale, IM_COL32(230, 232, 236, 255));
    const std::string& label = v.label.empty() ? v.id : v.label;
    dl->AddText(ImVec2(c.x + 9 * ui_scale, c.y - 8 * ui_scale), IM_COL32(230, 232, 236, 255), label.c_str());
  }
  if (flow) {  // legend: utilisation from 0 to 100 %
    const ImVec2 l0(origin.x + pad, origin.y + avail.y - 24 * ui_scale);
    const float w = 160 * ui_scale, h = 10 * ui_scale;
    for (int i = 0; i < 32; ++i)
      dl->AddRectFilled(ImVec2(l0.x + w * i / 32, l0.y), ImVec2(l0.x + w * (i + 1) / 32, l0.y + h),
                        utilisation_colour(i / 31.0));
    dl->AddText(ImVec2(l0.x, l0.y - 16 * ui_scale), IM_COL32(230, 232, 236, 255), "arc utilisation  0 %");
    dl->AddText(ImVec2(l0.x + w + 6 * ui_scale, l0.y - 2 * ui_scale), IM_COL32(230, 232, 236, 255), "100 %");
  }
  ImGui::Dummy(avail);
}

}  // namespace apportion::web
