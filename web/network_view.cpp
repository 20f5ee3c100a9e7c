// Drawing of the network canvas; see network_view.h.
#include "network_view.h"

#include <algorithm>
#include <cmath>
#include <imgui.h>
#include <string>

#include "apportion/network_svg.h"

namespace apportion::web {

namespace {

ImU32 to_imgui(const Rgb& c, float alpha = 1.0f) {
  return ImGui::ColorConvertFloat4ToU32(ImVec4(c.r, c.g, c.b, alpha));
}

float distance_to_segment(ImVec2 p, ImVec2 a, ImVec2 b) {
  const float dx = b.x - a.x, dy = b.y - a.y;
  const float len2 = std::max(1e-6f, dx * dx + dy * dy);
  const float t = std::clamp(((p.x - a.x) * dx + (p.y - a.y) * dy) / len2, 0.0f, 1.0f);
  const float ex = a.x + t * dx - p.x, ey = a.y + t * dy - p.y;
  return std::sqrt(ex * ex + ey * ey);
}

}  // namespace

void draw_network(const Network& net, const MultiflowResult* flow, ViewState& view, float ui_scale) {
  ImDrawList* dl = ImGui::GetWindowDrawList();
  const ImVec2 origin = ImGui::GetCursorScreenPos();
  const ImVec2 avail = ImGui::GetContentRegionAvail();
  if (net.nodes.empty() || avail.x < 10 || avail.y < 10) return;

  // Interaction first, so that this frame draws with this frame's pan and zoom.
  ImGui::InvisibleButton("canvas", avail);
  const bool hovered = ImGui::IsItemHovered();
  ImGuiIO& io = ImGui::GetIO();
  if (ImGui::IsItemActive() && ImGui::IsMouseDragging(ImGuiMouseButton_Left)) {
    view.pan_x += io.MouseDelta.x;
    view.pan_y += io.MouseDelta.y;
  }
  if (hovered && io.MouseWheel != 0) {
    const float factor = std::pow(1.15f, io.MouseWheel);
    const float mx = io.MousePos.x - origin.x, my = io.MousePos.y - origin.y;
    view.pan_x = mx - (mx - view.pan_x) * factor;  // zoom about the cursor
    view.pan_y = my - (my - view.pan_y) * factor;
    view.zoom *= factor;
  }
  dl->PushClipRect(origin, ImVec2(origin.x + avail.x, origin.y + avail.y), true);

  const Layout layout = fit_layout(net, avail.x, avail.y, 40 * ui_scale, 120 * ui_scale);
  auto at = [&](int v) {
    const auto [x, y] = layout.position(net.nodes[v]);
    return ImVec2(origin.x + view.pan_x + static_cast<float>(x) * view.zoom,
                  origin.y + view.pan_y + static_cast<float>(y) * view.zoom);
  };
  double max_cap = 0;
  for (const Arc& a : net.arcs) max_cap = std::max(max_cap, a.capacity);
  const int sel = flow && view.selected_demand < static_cast<int>(flow->demands.size()) ? view.selected_demand : -1;
  const float time = static_cast<float>(ImGui::GetTime());
  int hovered_arc = -1;
  float best = 8 * ui_scale;

  for (int a = 0; a < net.arc_count(); ++a) {
    const Arc& arc = net.arcs[a];
    const ArcGeometry geo = arc_geometry(net, a, at(arc.from).x, at(arc.from).y, at(arc.to).x, at(arc.to).y,
                                         5.0f * ui_scale);
    const ImVec2 p(geo.x0, geo.y0), q(geo.x1, geo.y1);
    const float width = (1.5f + 5.0f * static_cast<float>(std::sqrt(max_cap > 0 ? arc.capacity / max_cap : 0))) * ui_scale;
    const ArcLoad* load = flow ? &flow->arcs[a] : nullptr;
    double demand_flow = 0;
    if (sel >= 0 && load)
      for (auto [k, f] : load->per_demand)
        if (k == sel) demand_flow = f;
    Rgb colour = load ? utilisation_colour(load->utilisation) : Rgb{0.55f, 0.59f, 0.65f};
    float alpha = 1.0f;
    if (sel >= 0) alpha = demand_flow != 0 ? 1.0f : 0.25f;
    if (!arc.enabled) colour = Rgb{0.4f, 0.4f, 0.4f}, alpha = 0.5f;
    dl->AddLine(p, q, to_imgui(colour, alpha), width);
    if (!arc.shared_two_way) {  // an arrowhead at two thirds of the way
      const float ux = (q.x - p.x) / geo.length, uy = (q.y - p.y) / geo.length;
      const ImVec2 tip(p.x + (q.x - p.x) * 0.67f, p.y + (q.y - p.y) * 0.67f);
      const float s = 5 * ui_scale + width * 0.5f;
      dl->AddTriangleFilled(ImVec2(tip.x + ux * s, tip.y + uy * s), ImVec2(tip.x - uy * s, tip.y + ux * s),
                            ImVec2(tip.x + uy * s, tip.y - ux * s), to_imgui(colour, alpha));
    }
    if (sel >= 0) {
      const auto& bind = flow->demands[sel].binding_arcs;
      if (std::find(bind.begin(), bind.end(), a) != bind.end())
        dl->AddLine(p, q, IM_COL32(255, 90, 70, 255), width + 4 * ui_scale);  // binding arc of the selected demand
    }
    // Moving marks: spacing fixed, speed by utilisation, direction by the net flow.
    if (load && view.animate && load->load > 0) {
      double net_flow = 0;
      for (auto [k, f] : load->per_demand)
        if (sel < 0 || k == sel) net_flow += f;
      if (net_flow != 0) {
        const float spacing = 28 * ui_scale;
        const float speed = (20.0f + 100.0f * static_cast<float>(std::min(1.0, load->utilisation))) * ui_scale;
        const float phase = std::fmod(time * speed, spacing);
        for (float d = phase; d < geo.length; d += spacing) {
          const float t = net_flow > 0 ? d / geo.length : 1.0f - d / geo.length;
          dl->AddCircleFilled(ImVec2(p.x + (q.x - p.x) * t, p.y + (q.y - p.y) * t), 2.2f * ui_scale,
                              IM_COL32(255, 255, 255, 220));
        }
      }
    }
    if (hovered) {
      const float d = distance_to_segment(io.MousePos, p, q);
      if (d < best) best = d, hovered_arc = a;
    }
  }
  for (int v = 0; v < net.node_count(); ++v) {
    const ImVec2 c = at(v);
    dl->AddCircleFilled(c, 7 * ui_scale, IM_COL32(230, 232, 236, 255));
    const std::string& label = net.nodes[v].label.empty() ? net.nodes[v].id : net.nodes[v].label;
    dl->AddText(ImVec2(c.x + 9 * ui_scale, c.y - 8 * ui_scale), IM_COL32(230, 232, 236, 255), label.c_str());
  }
  if (flow) {  // legend
    const ImVec2 l0(origin.x + 12 * ui_scale, origin.y + avail.y - 24 * ui_scale);
    const float w = 160 * ui_scale, h = 10 * ui_scale;
    for (int i = 0; i < 32; ++i)
      dl->AddRectFilled(ImVec2(l0.x + w * i / 32, l0.y), ImVec2(l0.x + w * (i + 1) / 32, l0.y + h),
                        to_imgui(utilisation_colour(i / 31.0)));
    dl->AddText(ImVec2(l0.x, l0.y - 16 * ui_scale), IM_COL32(230, 232, 236, 255),
                "arc utilisation 0 %  (width: capacity; dots move with the flow)");
    dl->AddText(ImVec2(l0.x + w + 6 * ui_scale, l0.y - 2 * ui_scale), IM_COL32(230, 232, 236, 255), "100 %");
  }
  dl->PopClipRect();

  if (hovered_arc >= 0) {
    const Arc& arc = net.arcs[hovered_arc];
    ImGui::BeginTooltip();
    ImGui::Text("arc %s: %s -> %s%s", arc.id.c_str(), net.nodes[arc.from].id.c_str(), net.nodes[arc.to].id.c_str(),
                arc.shared_two_way ? " (shared two-way)" : "");
    ImGui::Text("capacity %.6g %s%s", arc.capacity, net.units.capacity.c_str(), arc.enabled ? "" : " (disabled)");
    if (flow) {
      const ArcLoad& l = flow->arcs[hovered_arc];
      ImGui::Text("load %.6g (%.1f %%), shadow price %.4g%s", l.load, 100 * l.utilisation, l.shadow_price,
                  l.tier ? (", binds in tier " + std::to_string(l.tier)).c_str() : "");
      for (auto [k, f] : l.per_demand) ImGui::BulletText("%s: %.6g", net.demands[k].id.c_str(), f);
    }
    ImGui::EndTooltip();
  }
}

}  // namespace apportion::web
