// Drawing of the network canvas and the mouse on it; see network_view.h.
#include "canvas/network_view.h"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <imgui.h>
#include <string>

#include "app/appearance.h"

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

CanvasInput draw_network(const Network& net, const MultiflowResult* flow, const Selection& selection,
                         const std::vector<char>& highlight, Tool tool, ViewState& view, float ui_scale) {
  const auto started = std::chrono::steady_clock::now();
  const Palette& colours = palette();
  const ImU32 kFocus = colours.focus, kBinding = colours.binding, kOutOfService = colours.out_of_service;
  const ImU32 kSelected = colours.selected, kMatch = colours.match, kInk = colours.ink;
  CanvasInput in;
  ImDrawList* dl = ImGui::GetWindowDrawList();
  const ImVec2 origin = ImGui::GetCursorScreenPos();
  const ImVec2 avail = ImGui::GetContentRegionAvail();
  view.canvas_x = origin.x, view.canvas_y = origin.y, view.canvas_w = avail.x, view.canvas_h = avail.y;
  if (avail.x < 10 || avail.y < 10) return in;
  // A resized canvas (window, side panel) fits again, unless the user has zoomed or panned
  // since the last fit: then the view stays where they put it, and Fit brings it back.
  const bool untouched = view.zoom == 1 && view.pan_x == 0 && view.pan_y == 0;
  if (view.fitted && untouched && (std::abs(avail.x - view.fitted_w) > 0.5f || std::abs(avail.y - view.fitted_h) > 0.5f))
    view.fitted = false;
  if (!view.fitted) {
    // Room on the right for the labels that go there; a label with no room goes left.
    view.layout = fit_layout(net, avail.x, avail.y, 30 * ui_scale, 60 * ui_scale);
    view.fitted_w = avail.x, view.fitted_h = avail.y;
    view.pan_x = view.pan_y = 0;
    view.zoom = 1;
    view.fitted = true;
  }

  // Pan and zoom first, so that this frame draws with this frame's view.
  ImGui::InvisibleButton("canvas", avail,
                         ImGuiButtonFlags_MouseButtonLeft | ImGuiButtonFlags_MouseButtonRight | ImGuiButtonFlags_MouseButtonMiddle);
  const bool hovered = ImGui::IsItemHovered();
  const bool active = ImGui::IsItemActive();
  const bool pressed = ImGui::IsItemClicked(ImGuiMouseButton_Left);
  const bool released = ImGui::IsItemDeactivated() && ImGui::IsMouseReleased(ImGuiMouseButton_Left);
  ImGuiIO& io = ImGui::GetIO();
  const ImVec2 mouse = io.MousePos;
  if (active && (ImGui::IsMouseDragging(ImGuiMouseButton_Right) || ImGui::IsMouseDragging(ImGuiMouseButton_Middle))) {
    view.pan_x += io.MouseDelta.x;
    view.pan_y += io.MouseDelta.y;
  }
  if (hovered && io.MouseWheel != 0) {
    const float factor = std::pow(1.15f, io.MouseWheel);
    const float mx = mouse.x - origin.x, my = mouse.y - origin.y;
    view.pan_x = mx - (mx - view.pan_x) * factor;  // zoom about the cursor
    view.pan_y = my - (my - view.pan_y) * factor;
    view.zoom = std::clamp(view.zoom * factor, 0.02f, 200.0f);
  }
  const float unit = static_cast<float>(view.layout.scale) * view.zoom;  // device pixels per document unit
  auto at = [&](int v) {
    const auto [x, y] = view.layout.position(net.nodes[v]);
    return ImVec2(origin.x + view.pan_x + static_cast<float>(x) * view.zoom,
                  origin.y + view.pan_y + static_cast<float>(y) * view.zoom);
  };
  auto to_doc = [&](ImVec2 p, double& x, double& y) {
    x = ((p.x - origin.x - view.pan_x) / view.zoom - view.layout.margin - view.layout.offset_x) / view.layout.scale +
        view.layout.min_x;
    y = ((p.y - origin.y - view.pan_y) / view.zoom - view.layout.margin - view.layout.offset_y) / view.layout.scale +
        view.layout.min_y;
  };

  dl->PushClipRect(origin, ImVec2(origin.x + avail.x, origin.y + avail.y), true);
  view.node_screen.resize(2 * net.nodes.size());
  for (int v = 0; v < net.node_count(); ++v) {
    const ImVec2 c = at(v);
    view.node_screen[2 * v] = c.x, view.node_screen[2 * v + 1] = c.y;
  }
  const float node_r = 7 * ui_scale;
  int hover_node = -1;
  if (hovered)
    for (int v = net.node_count() - 1; v >= 0 && hover_node < 0; --v) {
      const float dx = view.node_screen[2 * v] - mouse.x, dy = view.node_screen[2 * v + 1] - mouse.y;
      if (dx * dx + dy * dy <= (node_r + 3 * ui_scale) * (node_r + 3 * ui_scale)) hover_node = v;
    }

  // What is in focus: one demand, one tier, or everything.
  const int demands = flow ? static_cast<int>(flow->demands.size()) : 0;
  const int focus_demand = view.filter_demand >= 0 && view.filter_demand < demands ? view.filter_demand : -1;
  const Tier* focus_tier = nullptr;
  if (flow && focus_demand < 0)
    for (const Tier& t : flow->tiers)
      if (t.index == view.filter_tier) focus_tier = &t;
  const bool filtering = focus_demand >= 0 || focus_tier;
  auto in_focus = [&](int k) {
    if (focus_demand >= 0) return k == focus_demand;
    if (focus_tier) return flow->demands[k].tier == focus_tier->index;
    return true;
  };
  const std::vector<int>* binding = focus_demand >= 0 ? &flow->demands[focus_demand].binding_arcs
                                    : focus_tier      ? &focus_tier->binding_arcs
                                                      : nullptr;

  double max_cap = 0;
  for (const Arc& a : net.arcs) max_cap = std::max(max_cap, a.capacity);
  const std::vector<char> twin = arcs_with_twin(net);
  // Per-arc marks, so that each arc is looked up once, not searched for in the selection.
  std::vector<char> arc_selected(net.arcs.size(), 0), arc_binding(net.arcs.size(), 0);
  for (int e : selection.arcs)
    if (e >= 0 && e < net.arc_count()) arc_selected[e] = 1;
  if (binding)
    for (int e : *binding)
      if (e >= 0 && e < net.arc_count()) arc_binding[e] = 1;
  // Feasibility: the overloaded cut it found, when nothing is filtered: the arcs leaving its
  // origin side outlined like binding arcs, and that side's nodes ringed.
  std::vector<char> cut_side(net.nodes.size(), 0);
  view.drawn_cut_arcs = 0;
  if (flow && !filtering && flow->objective == FairObjective::kFeasibility && !flow->overloaded_cut_source_side.empty()) {
    for (int v : flow->overloaded_cut_source_side)
      if (v >= 0 && v < net.node_count()) cut_side[v] = 1;
    for (int e = 0; e < net.arc_count(); ++e) {
      const Arc& arc = net.arcs[e];
      const bool out = cut_side[arc.from] && !cut_side[arc.to];
      const bool back = arc.shared_two_way && cut_side[arc.to] && !cut_side[arc.from];
      if (arc.enabled && (out || back)) arc_binding[e] = 1, ++view.drawn_cut_arcs;
    }
  }
  const float time = static_cast<float>(ImGui::GetTime());
  view.drawn_out_of_service.clear();
  view.drawn_origin = view.drawn_destination = -1;
  view.drawn_labels.clear();
  int hover_arc = -1;
  float best = 8 * ui_scale;
  for (int a = 0; a < net.arc_count(); ++a) {
    const Arc& arc = net.arcs[a];
    const ImVec2 from = at(arc.from), to = at(arc.to);
    const ArcGeometry geo = arc_geometry(twin[a], from.x, from.y, to.x, to.y, 5.0f * ui_scale);
    const ImVec2 p(geo.x0, geo.y0), q(geo.x1, geo.y1);
    // Off-screen arcs cost nothing more.
    if (std::max(p.x, q.x) < origin.x || std::min(p.x, q.x) > origin.x + avail.x || std::max(p.y, q.y) < origin.y ||
        std::min(p.y, q.y) > origin.y + avail.y)
      continue;
    const float width =
        (1.5f + 5.0f * static_cast<float>(std::sqrt(max_cap > 0 ? arc.capacity / max_cap : 0))) * ui_scale;
    const ArcLoad* load = flow && a < static_cast<int>(flow->arcs.size()) ? &flow->arcs[a] : nullptr;
    double focus_flow = 0;
    if (load)
      for (auto [k, f] : load->per_demand)
        if (in_focus(k)) focus_flow += f;
    if (arc_selected[a]) dl->AddLine(p, q, kSelected, width + 6 * ui_scale);
    if (arc_binding[a]) dl->AddLine(p, q, kBinding, width + 4 * ui_scale);
    if (!arc.enabled) {
      // Out of service: dashes, and a cross at the middle that stays readable when zoomed out.
      const float dash = 7 * ui_scale, gap = 5 * ui_scale, w = std::max(2.0f * ui_scale, width * 0.6f);
      for (float d = 0; d < geo.length; d += dash + gap) {
        const float t0 = d / geo.length, t1 = std::min(1.0f, (d + dash) / geo.length);
        dl->AddLine(ImVec2(p.x + (q.x - p.x) * t0, p.y + (q.y - p.y) * t0),
                    ImVec2(p.x + (q.x - p.x) * t1, p.y + (q.y - p.y) * t1), kOutOfService, w);
      }
      const ImVec2 m((p.x + q.x) / 2, (p.y + q.y) / 2);
      const float c = 6 * ui_scale;
      dl->AddCircleFilled(m, c + 3 * ui_scale, colours.halo);
      dl->AddLine(ImVec2(m.x - c, m.y - c), ImVec2(m.x + c, m.y + c), kOutOfService, 2.5f * ui_scale);
      dl->AddLine(ImVec2(m.x - c, m.y + c), ImVec2(m.x + c, m.y - c), kOutOfService, 2.5f * ui_scale);
      view.drawn_out_of_service.push_back(a);
      if (hovered && hover_node < 0) {
        const float dd = distance_to_segment(mouse, p, q);
        if (dd < best) best = dd, hover_arc = a;
      }
      continue;
    }
    ImU32 colour;
    if (filtering) colour = focus_flow != 0 ? kFocus : colours.faded_arc;
    else colour = load ? to_imgui(utilisation_colour(load->utilisation, colours.picture)) : colours.idle_arc;
    dl->AddLine(p, q, colour, width);
    if (!arc.shared_two_way && geo.length > 4 * node_r) {  // an arrowhead at two thirds of the way
      const float ux = (q.x - p.x) / geo.length, uy = (q.y - p.y) / geo.length;
      const ImVec2 tip(p.x + (q.x - p.x) * 0.67f, p.y + (q.y - p.y) * 0.67f);
      const float s = 5 * ui_scale + width * 0.5f;
      dl->AddTriangleFilled(ImVec2(tip.x + ux * s, tip.y + uy * s), ImVec2(tip.x - uy * s, tip.y + ux * s),
                            ImVec2(tip.x + uy * s, tip.y - ux * s), colour);
    }
    // Moving marks: spacing fixed, speed by utilisation, direction by the flow in focus.
    if (load && view.animate && focus_flow != 0) {
      const float spacing = 28 * ui_scale;
      const float speed = (20.0f + 100.0f * static_cast<float>(std::min(1.0, load->utilisation))) * ui_scale;
      const float phase = std::fmod(time * speed, spacing);
      for (float d = phase; d < geo.length; d += spacing) {
        const float t = focus_flow > 0 ? d / geo.length : 1.0f - d / geo.length;
        dl->AddCircleFilled(ImVec2(p.x + (q.x - p.x) * t, p.y + (q.y - p.y) * t), 2.2f * ui_scale,
                            colours.moving_mark, 8);
      }
    }
    if (hovered && hover_node < 0) {
      const float d = distance_to_segment(mouse, p, q);
      if (d < best) best = d, hover_arc = a;
    }
  }

  // Nodes, then their labels: the same size on screen at any zoom, the most connected nodes
  // first, and a label that would overlap one already drawn is left out (hover, select or
  // search a node to read it), so that 200-800 nodes stay readable where they crowd.
  std::vector<char> node_selected(net.nodes.size(), 0);
  for (int v : selection.nodes)
    if (v >= 0 && v < net.node_count()) node_selected[v] = 1;
  auto visible = [&](const ImVec2& c) {
    return c.x >= origin.x - 50 && c.x <= origin.x + avail.x + 50 && c.y >= origin.y - 50 && c.y <= origin.y + avail.y + 50;
  };
  std::vector<int> degree(net.nodes.size(), 0);
  for (const Arc& e : net.arcs)
    if (e.from >= 0 && e.to >= 0) ++degree[e.from], ++degree[e.to];
  std::vector<int> by_importance;
  for (int v = 0; v < net.node_count(); ++v) {
    const ImVec2 c = at(v);
    if (!visible(c)) continue;
    const bool selected = node_selected[v];
    const bool match = v < static_cast<int>(highlight.size()) && highlight[v];
    if (match) dl->AddCircle(c, node_r + 6 * ui_scale, kMatch, 0, 2.5f * ui_scale);
    if (selected || v == view.pending_from) dl->AddCircleFilled(c, node_r + 3 * ui_scale, kSelected);
    if (cut_side[v]) dl->AddCircle(c, node_r + 4 * ui_scale, kBinding, 0, 2.5f * ui_scale);
    dl->AddCircleFilled(c, node_r, kInk);
    if (focus_demand >= 0 && (v == net.demands[focus_demand].origin || v == net.demands[focus_demand].destination)) {
      // The filtered demand's ends: a ring in the flow's colour and a word below.
      const bool from = v == net.demands[focus_demand].origin;
      dl->AddCircle(c, node_r + 5 * ui_scale, kFocus, 0, 3 * ui_scale);
      const char* word = from ? "origin" : "destination";
      const ImVec2 size = ImGui::CalcTextSize(word);
      dl->AddText(ImVec2(c.x - size.x / 2, c.y + node_r + 8 * ui_scale), kFocus, word);
      (from ? view.drawn_origin : view.drawn_destination) = v;
    }
    by_importance.push_back(v);
  }
  auto must_show = [&](int v) {
    return node_selected[v] || v == hover_node || (v < static_cast<int>(highlight.size()) && highlight[v]);
  };
  std::stable_sort(by_importance.begin(), by_importance.end(), [&](int x, int y) {
    if (must_show(x) != must_show(y)) return must_show(x);
    return degree[x] > degree[y];
  });
  // Cells of the canvas a label or a node already covers. Each label tries the right of its
  // node, then the left, above and below, and is left out when all four are taken.
  const float cell = 6 * ui_scale;
  const int cols = static_cast<int>(avail.x / cell) + 2, rows = static_cast<int>(avail.y / cell) + 2;
  // Per cell: -1 free, v >= 0 under node v's disc, -2 under a label. A label may touch its
  // own node's cells.
  std::vector<int> taken(static_cast<std::size_t>(cols) * rows, -1);
  auto cells = [&](ImVec2 p, ImVec2 size, int& x0, int& y0, int& x1, int& y1) {
    x0 = std::max(0, static_cast<int>((p.x - origin.x) / cell)), y0 = std::max(0, static_cast<int>((p.y - origin.y) / cell));
    x1 = std::min(cols - 1, static_cast<int>((p.x + size.x - origin.x) / cell));
    y1 = std::min(rows - 1, static_cast<int>((p.y + size.y - origin.y) / cell));
  };
  auto is_free = [&](ImVec2 p, ImVec2 size, int v) {
    if (p.x < origin.x || p.y < origin.y || p.x + size.x > origin.x + avail.x || p.y + size.y > origin.y + avail.y)
      return false;  // a label cut by the canvas's edge is no label
    int x0, y0, x1, y1;
    cells(p, size, x0, y0, x1, y1);
    for (int y = y0; y <= y1; ++y)
      for (int x = x0; x <= x1; ++x) {
        const int t = taken[static_cast<std::size_t>(y) * cols + x];
        if (t != -1 && t != v) return false;
      }
    return true;
  };
  auto take = [&](ImVec2 p, ImVec2 size, int owner) {
    int x0, y0, x1, y1;
    cells(p, size, x0, y0, x1, y1);
    for (int y = y0; y <= y1; ++y)
      for (int x = x0; x <= x1; ++x) taken[static_cast<std::size_t>(y) * cols + x] = owner;
  };
  for (int v : by_importance) {  // the discs first: no label covers a node
    const ImVec2 c = at(v);
    take(ImVec2(c.x - node_r + 1, c.y - node_r + 1), ImVec2(2 * node_r - 2, 2 * node_r - 2), v);
  }
  for (int v : by_importance) {
    const ImVec2 c = at(v);
    const std::string& label = shown_name(net.nodes[v]);
    const ImVec2 size = ImGui::CalcTextSize(label.c_str());
    const float gap = node_r + 3 * ui_scale;
    const ImVec2 places[] = {ImVec2(c.x + gap, c.y - size.y / 2), ImVec2(c.x - gap - size.x, c.y - size.y / 2),
                             ImVec2(c.x - size.x / 2, c.y - gap - size.y), ImVec2(c.x - size.x / 2, c.y + gap)};
    int place = -1;
    for (int i = 0; i < 4 && place < 0; ++i)
      if (is_free(places[i], size, v)) place = i;
    if (place < 0 && !must_show(v)) continue;
    const ImVec2 pos = places[std::max(0, place)];
    take(pos, size, -2);
    // A halo in the background's colour keeps a label readable where it crosses an arc.
    const float o = std::max(1.0f, ui_scale);
    for (const ImVec2 d : {ImVec2(-o, 0), ImVec2(o, 0), ImVec2(0, -o), ImVec2(0, o), ImVec2(-o, -o), ImVec2(o, o),
                           ImVec2(-o, o), ImVec2(o, -o)})
      dl->AddText(ImVec2(pos.x + d.x, pos.y + d.y), colours.halo, label.c_str());
    dl->AddText(pos, kInk, label.c_str());
    view.drawn_labels.push_back({static_cast<float>(v), pos.x, pos.y, pos.x + size.x, pos.y + size.y});
  }

  // The mouse: a click, a move of the selected nodes, a selection box, or a new link.
  if (pressed) {
    view.pressed_node = hover_node;
    view.press_x = mouse.x, view.press_y = mouse.y;
    view.moving = view.boxing = false;
  }
  if (active && ImGui::IsMouseDown(ImGuiMouseButton_Left) && ImGui::IsMouseDragging(ImGuiMouseButton_Left, 4 * ui_scale) &&
      tool == Tool::kSelect) {
    if (view.pressed_node >= 0) {
      // The first moving frame catches up with the whole drag, threshold included.
      const ImVec2 step = view.moving ? io.MouseDelta : ImGui::GetMouseDragDelta(ImGuiMouseButton_Left);
      if (!view.moving) {
        view.moving = true;
        in.move_started = true;
        in.clicked_node = view.pressed_node;  // the app selects it first when it is not selected
        in.additive = io.KeyShift;
      }
      in.move_dx = step.x / unit;
      in.move_dy = step.y / unit;
    } else {
      view.boxing = true;
    }
  }
  // A drag that began and ended between two frames (a quick flick, or a slow frame) shows
  // up only at the release: it still moves or selects.
  const ImVec2 drag = released ? ImGui::GetMouseDragDelta(ImGuiMouseButton_Left, 4 * ui_scale) : ImVec2(0, 0);
  const bool late_drag = released && !view.moving && !view.boxing && (drag.x != 0 || drag.y != 0) && tool == Tool::kSelect;
  if (late_drag && view.pressed_node >= 0) {
    in.move_started = true;
    in.clicked_node = view.pressed_node;
    in.additive = io.KeyShift;
    in.move_dx = drag.x / unit;
    in.move_dy = drag.y / unit;
    in.move_ended = true;
  } else if (view.boxing || late_drag) {
    const ImVec2 a(std::min(view.press_x, mouse.x), std::min(view.press_y, mouse.y));
    const ImVec2 b(std::max(view.press_x, mouse.x), std::max(view.press_y, mouse.y));
    dl->AddRectFilled(a, b, (kSelected & ~IM_COL32_A_MASK) | IM_COL32(0, 0, 0, 40));
    dl->AddRect(a, b, kSelected);
    if (released) {
      in.box_done = true;
      in.additive = io.KeyShift;
      std::vector<char> inside(net.nodes.size(), 0);
      for (int v = 0; v < net.node_count(); ++v) {
        const float x = view.node_screen[2 * v], y = view.node_screen[2 * v + 1];
        if (x >= a.x && x <= b.x && y >= a.y && y <= b.y) in.box.nodes.push_back(v), inside[v] = 1;
      }
      for (int e = 0; e < net.arc_count(); ++e)
        if (inside[net.arcs[e].from] && inside[net.arcs[e].to]) in.box.arcs.push_back(e);
      view.boxing = false;
    }
  } else if (view.moving) {
    if (released) view.moving = false, in.move_ended = true;
  } else if (released && hovered && drag.x == 0 && drag.y == 0) {
    // A click (released without dragging).
    in.additive = io.KeyShift;
    to_doc(mouse, in.doc_x, in.doc_y);
    if (tool == Tool::kAddArc || tool == Tool::kAddDemand) {
      if (hover_node < 0) {
        view.pending_from = -1;
      } else if (view.pending_from < 0 || view.pending_from >= net.node_count()) {
        view.pending_from = hover_node;
      } else if (hover_node != view.pending_from) {
        in.link_from = view.pending_from, in.link_to = hover_node;
        view.pending_from = -1;
      }
    } else if (hover_node >= 0) {
      in.clicked_node = hover_node;
    } else if (hover_arc >= 0 && tool == Tool::kSelect) {
      in.clicked_arc = hover_arc;
    } else {
      in.clicked_empty = true;
    }
  }
  if ((tool == Tool::kAddArc || tool == Tool::kAddDemand) && view.pending_from >= 0 && view.pending_from < net.node_count())
    dl->AddLine(at(view.pending_from), mouse, tool == Tool::kAddArc ? kSelected : kFocus, 2 * ui_scale);

  if (flow) {  // legend: short lines that fit a narrow canvas, each on the background's halo
    const float line = ImGui::GetTextLineHeight(), w = 160 * ui_scale, h = 10 * ui_scale;
    const float zero = ImGui::CalcTextSize("0 % ").x;
    const ImVec2 l0(origin.x + 12 * ui_scale + zero, origin.y + avail.y - 12 * ui_scale - line);
    auto text = [&](float x, float y, ImU32 colour, const char* t) {
      const ImVec2 size = ImGui::CalcTextSize(t);
      dl->AddRectFilled(ImVec2(x - 2, y - 1), ImVec2(x + size.x + 2, y + size.y + 1), colours.halo & 0xC0FFFFFF);
      dl->AddText(ImVec2(x, y), colour, t);
    };
    for (int i = 0; i < 32; ++i)
      dl->AddRectFilled(ImVec2(l0.x + w * i / 32, l0.y + (line - h) / 2), ImVec2(l0.x + w * (i + 1) / 32, l0.y + (line + h) / 2),
                        to_imgui(utilisation_colour(i / 31.0, colours.picture)));
    text(l0.x - zero, l0.y, kInk, "0 %");
    text(l0.x + w + 6 * ui_scale, l0.y, kInk, "100 %");
    text(l0.x - zero, l0.y - line - 2, kInk,
         filtering                 ? "orange: flow in the filter; purple: its binding arcs"
         : view.drawn_cut_arcs > 0 ? "arc utilisation; purple: the overloaded cut"
                                   : "arc utilisation; width: capacity");
    if (!view.drawn_out_of_service.empty())
      text(l0.x - zero, l0.y - 2 * line - 4, kOutOfService, "dashed and crossed: out of service");
  }
  dl->PopClipRect();

  if (hover_node >= 0 && !view.moving && !view.boxing) {
    const Node& n = net.nodes[hover_node];
    ImGui::BeginTooltip();
    if (n.label.empty()) ImGui::Text("node %s", n.id.c_str());
    else ImGui::Text("%s  (node %s)", n.label.c_str(), n.id.c_str());
    ImGui::EndTooltip();
  } else if (hover_arc >= 0 && !view.moving && !view.boxing) {
    const Arc& arc = net.arcs[hover_arc];
    ImGui::BeginTooltip();
    ImGui::Text("%s %s %s  (arc %s%s)", shown_name(net.nodes[arc.from]).c_str(), arc.shared_two_way ? "\u2194" : "\u2192",
                shown_name(net.nodes[arc.to]).c_str(), arc.id.c_str(), arc.shared_two_way ? ", shared two-way" : "");
    const char* unit = net.units.capacity.c_str();
    ImGui::Text("capacity %.6g %s%s", arc.capacity, unit, arc.enabled ? "" : " (out of service)");
    if (flow && hover_arc < static_cast<int>(flow->arcs.size())) {
      const ArcLoad& l = flow->arcs[hover_arc];
      ImGui::Text("load %.6g %s (%.1f %%), shadow price %.4g%s", l.load, unit, 100 * l.utilisation, l.shadow_price,
                  l.tier ? (", binds in tier " + std::to_string(l.tier)).c_str() : "");
      for (auto [k, f] : l.per_demand)
        ImGui::BulletText("%s: %.6g %s", shown_name(net.demands[k]).c_str(), f, unit);
    }
    ImGui::EndTooltip();
  }
  view.frame_ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - started).count();
  return in;
}

}  // namespace apportion::web
