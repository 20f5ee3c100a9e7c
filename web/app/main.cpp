// Apportion in the browser: Dear ImGui over Emscripten's GLFW and WebGL2. The page holds one
// network document and its result (web/app/app_state.h); every frame is drawn from them. It
// opens the demo network (or the network of a share link, or the autosaved one), edits it
// with undo, solves it with the chosen rule in a worker (web/browser/solver_worker.cpp) while the
// page keeps drawing, and exports results and the network, all inside the browser.
//
// HiDPI: Emscripten 3.1.6's GLFW ignores devicePixelRatio, so each frame sizes the canvas
// backing store to CSS size x DPR itself. The UI is laid out in CSS pixels, as the mouse
// reports them, and drawn with a framebuffer scale of DPR; fonts are rasterised at DPR x
// their size and scaled back, so text stays sharp.
//
// Test hook: machine-readable console lines "apportion:<event> {json}", the exported
// apportion_test_action(), which runs the same code as the buttons, and "state" lines with
// the node positions in CSS pixels, so that tests can click and drag on the canvas.
#include <GLFW/glfw3.h>
#include <emscripten.h>
#include <emscripten/html5.h>
#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <string>

#include "app/app_state.h"
#include "app/appearance.h"
#include "apportion/formats/network_json.h"
#include "apportion/results/flow_result_export.h"
#include "browser/browser_bridge.h"
#include "browser/file_payload.h"
#include "demo_network.h"
#include "panels/panels.h"

namespace apportion::web {
namespace {

// What the mouse did on the canvas, turned into selection changes and edits.
void apply_canvas_input(const CanvasInput& in) {
  App& a = app();
  Selection& sel = a.selection;
  auto toggle = [](std::vector<int>& v, int i) {
    auto it = std::find(v.begin(), v.end(), i);
    if (it == v.end()) v.push_back(i);
    else v.erase(it);
  };
  if (in.move_started) {
    if (std::find(sel.nodes.begin(), sel.nodes.end(), in.clicked_node) == sel.nodes.end()) {
      if (!in.additive) sel = Selection{};
      sel.nodes.push_back(in.clicked_node);
    }
    const std::size_t n = sel.nodes.size();
    a.history.record(a.doc, "move " + std::to_string(n) + (n == 1 ? " node" : " nodes"));
  } else if (in.clicked_node >= 0) {
    if (a.tool == Tool::kAddNode || !in.additive) sel = Selection{};
    toggle(sel.nodes, in.clicked_node);
  } else if (in.clicked_arc >= 0) {
    if (!in.additive) sel = Selection{};
    toggle(sel.arcs, in.clicked_arc);
  } else if (in.clicked_empty) {
    if (a.tool == Tool::kAddNode) {
      int v = -1;
      edit("add a node", true, [&](Network& d) { v = add_node(d, in.doc_x, in.doc_y); });
      sel = Selection{};
      sel.nodes.push_back(v);
    } else if (!in.additive) {
      sel = Selection{};
    }
  }
  if (in.move_dx != 0 || in.move_dy != 0)  // live, without an undo step per frame
    for (int v : sel.nodes) {
      Node& node = a.doc.nodes[v];
      node.x = node.x.value_or(0) + in.move_dx;
      node.y = node.y.value_or(0) + in.move_dy;
    }
  if (in.move_ended) after_edit(false);
  if (in.box_done) {
    if (!in.additive) sel = Selection{};
    for (int v : in.box.nodes)
      if (std::find(sel.nodes.begin(), sel.nodes.end(), v) == sel.nodes.end()) sel.nodes.push_back(v);
    for (int e : in.box.arcs)
      if (std::find(sel.arcs.begin(), sel.arcs.end(), e) == sel.arcs.end()) sel.arcs.push_back(e);
  }
  if (in.link_from >= 0) {
    int item = -1;
    if (a.tool == Tool::kAddArc) {
      edit("add an arc", true, [&](Network& d) { item = add_arc(d, in.link_from, in.link_to); });
      sel = Selection{};
      sel.arcs.push_back(item);
    } else {
      edit("add a demand", true, [&](Network& d) { item = add_demand(d, in.link_from, in.link_to); });
      sel = Selection{};
      sel.demands.push_back(item);
    }
    a.right_tab = 1;
  }
  if (in.clicked_node >= 0 || in.clicked_arc >= 0 || in.box_done || in.link_from >= 0 || in.clicked_empty) report("selected");
}

void keyboard() {
  ImGuiIO& io = ImGui::GetIO();
  // Typing, or a dialog open: the keys belong to it (Delete must not delete the selection
  // behind an open dialog).
  if (io.WantTextInput || ImGui::IsPopupOpen("", ImGuiPopupFlags_AnyPopupId)) return;
  const bool command = io.KeyCtrl || io.KeySuper;
  if (command && ImGui::IsKeyPressed(ImGuiKey_Z, false)) io.KeyShift ? redo() : undo();
  else if (command && ImGui::IsKeyPressed(ImGuiKey_Y, false)) redo();
  else if (command && ImGui::IsKeyPressed(ImGuiKey_A, false)) {
    Selection all;
    for (int v = 0; v < app().doc.node_count(); ++v) all.nodes.push_back(v);
    for (int e = 0; e < app().doc.arc_count(); ++e) all.arcs.push_back(e);
    app().selection = all;
  } else if (ImGui::IsKeyPressed(ImGuiKey_Delete, false) || ImGui::IsKeyPressed(ImGuiKey_Backspace, false))
    delete_selection();
  else if (ImGui::IsKeyPressed(ImGuiKey_Escape, false)) {
    app().tool = Tool::kSelect;
    app().view.pending_from = -1;
    app().selection = Selection{};
  }
}

void report_positions() {
  App& a = app();
  nlohmann::json nodes = nlohmann::json::object();
  for (int v = 0; v < a.doc.node_count() && 2 * v + 1 < static_cast<int>(a.view.node_screen.size()); ++v)
    nodes[a.doc.nodes[v].id] = {a.view.node_screen[2 * v], a.view.node_screen[2 * v + 1]};
  nlohmann::json out_of_service = nlohmann::json::array();  // arcs the last frame drew dashed
  for (int e : a.view.drawn_out_of_service)
    if (e >= 0 && e < a.doc.arc_count()) out_of_service.push_back(a.doc.arcs[e].id);
  nlohmann::json labels = nlohmann::json::array();  // node id and the box its label was drawn in
  for (const auto& l : a.view.drawn_labels)
    if (l[0] >= 0 && l[0] < a.doc.node_count()) labels.push_back({a.doc.nodes[static_cast<int>(l[0])].id, l[1], l[2], l[3], l[4]});
  nlohmann::json s = {{"nodes", nodes},
                      {"canvas", {a.view.canvas_x, a.view.canvas_y, a.view.canvas_w, a.view.canvas_h}},
                      {"canvas_ms", a.view.frame_ms},
                      {"out_of_service", out_of_service},
                      {"cut_arcs", a.view.drawn_cut_arcs},
                      {"labels", labels},
                      {"origin", a.view.drawn_origin >= 0 && a.view.drawn_origin < a.doc.node_count()
                                     ? a.doc.nodes[a.view.drawn_origin].id : ""},
                      {"destination", a.view.drawn_destination >= 0 && a.view.drawn_destination < a.doc.node_count()
                                          ? a.doc.nodes[a.view.drawn_destination].id : ""},
                      {"fps", ImGui::GetIO().Framerate}};
  std::printf("apportion:positions %s\n", s.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace).c_str());
}

void frame() {
  App& a = app();
  double css_w = 0, css_h = 0;
  emscripten_get_element_css_size("#canvas", &css_w, &css_h);
  const float dpr = static_cast<float>(emscripten_get_device_pixel_ratio());
  const int w = std::max(1, static_cast<int>(css_w * dpr)), h = std::max(1, static_cast<int>(css_h * dpr));
  emscripten_set_canvas_element_size("#canvas", w, h);
  const bool restyle = appearance_changed();
  if (dpr != a.dpr || restyle) {
    if (dpr != a.dpr || a.applied_scale != ui_scale()) a.view.fitted = false;  // labels and margins change size
    a.dpr = dpr, a.applied_scale = ui_scale();
    apply_appearance(dpr);
  }

  glfwPollEvents();
  ImGui_ImplOpenGL3_NewFrame();
  ImGui_ImplGlfw_NewFrame();
  ImGuiIO& io = ImGui::GetIO();
  io.DisplaySize = ImVec2(static_cast<float>(css_w), static_cast<float>(css_h));
  io.DisplayFramebufferScale = ImVec2(dpr, dpr);
  ImGui::NewFrame();
  keyboard();

  ImGui::SetNextWindowPos(ImVec2(0, 0));
  ImGui::SetNextWindowSize(io.DisplaySize);
  ImGui::Begin("Apportion", nullptr, ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoCollapse |
                                         ImGuiWindowFlags_NoBringToFrontOnFocus);
  draw_toolbar();
  ImGui::Text("%s  (%s; %d nodes, %d arcs, %d demands)", a.doc.name.c_str(), a.doc_name.c_str(), a.doc.node_count(),
              a.doc.arc_count(), static_cast<int>(a.doc.demands.size()));
  ImGui::PushStyleColor(ImGuiCol_Text, palette().caution_text);
  ImGui::TextWrapped("%s", apportion::kPlanningCaution);
  ImGui::PopStyleColor();
  ImGui::Separator();
  // Messages go in the side panel, so that the canvas never moves under the mouse.
  // The side panel, as wide as the user dragged its edge (remembered), leaving the canvas room.
  // Until the user drags it, the panel takes 42 % of the window, within 320-560 px.
  const float side_max = std::max(260.0f, io.DisplaySize.x - 240.0f);
  if (a.side_width > 0) a.side_width = std::clamp(a.side_width, 260.0f, side_max);
  a.side_width_used =
      a.side_width > 0 ? a.side_width : std::clamp(0.42f * io.DisplaySize.x, std::min(320.0f, side_max), std::min(560.0f, side_max));
  ImGui::BeginChild("side", ImVec2(a.side_width_used, 0), true);
  draw_notices();
  a.tabs_y = ImGui::GetCursorScreenPos().y;
  if (ImGui::BeginTabBar("side-tabs")) {
    const int want = a.right_tab;
    a.right_tab = -1;
    auto tab = [&](const char* name, int index) {
      return ImGui::BeginTabItem(name, nullptr, want == index ? ImGuiTabItemFlags_SetSelected : 0);
    };
    if (tab("Shares", 0)) draw_result_panel(), ImGui::EndTabItem();
    if (tab("Selection", 1)) draw_inspector(), ImGui::EndTabItem();
    if (tab("Demands", 2)) draw_demand_table(), ImGui::EndTabItem();
    if (tab("Charts", 3)) draw_charts(), ImGui::EndTabItem();
    ImGui::EndTabBar();
  }
  ImGui::EndChild();
  // The splitter: drag to resize the side panel.
  ImGui::SameLine(0, 0);
  const float grip = 8.0f * ui_scale();
  ImGui::InvisibleButton("side-splitter", ImVec2(grip, std::max(1.0f, ImGui::GetContentRegionAvail().y)));
  if (ImGui::IsItemHovered() || ImGui::IsItemActive()) ImGui::SetMouseCursor(ImGuiMouseCursor_ResizeEW);
  if (ImGui::IsItemActive() && io.MouseDelta.x != 0)
    a.side_width = std::clamp(a.side_width_used + io.MouseDelta.x, 260.0f, side_max);
  if (ImGui::IsItemDeactivated()) remember_side_width();
  a.splitter = {ImGui::GetItemRectMin().x, ImGui::GetItemRectMin().y, ImGui::GetItemRectMax().x, ImGui::GetItemRectMax().y};
  {
    const ImVec2 g0 = ImGui::GetItemRectMin(), g1 = ImGui::GetItemRectMax();
    ImGui::GetWindowDrawList()->AddLine(ImVec2((g0.x + g1.x) / 2, g0.y), ImVec2((g0.x + g1.x) / 2, g1.y),
                                        ImGui::GetColorU32(ImGui::IsItemActive() ? ImGuiCol_SeparatorActive
                                                                                 : ImGuiCol_Separator),
                                        2.0f);
  }
  ImGui::SameLine(0, 0);
  ImGui::BeginChild("canvas", ImVec2(0, 0), false, ImGuiWindowFlags_NoScrollbar | ImGuiWindowFlags_NoScrollWithMouse);
  const CanvasInput in = draw_network(a.doc, current_result(), a.selection, a.search_hits, a.tool, a.view, ui_scale());
  ImGui::EndChild();
  ImGui::End();
  apply_canvas_input(in);

  ImGui::Render();
  glViewport(0, 0, w, h);
  const ImVec4 clear = palette().clear;
  glClearColor(clear.x, clear.y, clear.z, 1.0f);
  glClear(GL_COLOR_BUFFER_BIT);
  ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
  // The canvas alone, read now, while this frame's pixels are in it; a frame after the request,
  // so that the menu that asked for it is closed.
  if (a.png_requested > 0 && --a.png_requested == 0)
    download_canvas_png(file_stem() + ".canvas.png", a.view.canvas_x * dpr, a.view.canvas_y * dpr, a.view.canvas_w * dpr,
                        a.view.canvas_h * dpr);
  if (!a.first_frame_reported) {
    a.first_frame_reported = true;
    report("first-frame");
    EM_ASM(Module.setStatus(null));
  }
}

}  // namespace

void frame_entry() { frame(); }
void positions_entry() { report_positions(); }

}  // namespace apportion::web

using apportion::web::app;

extern "C" {

// Files from the browser (picker, share link, autosave), as JSON; see file_payload.h.
EMSCRIPTEN_KEEPALIVE void apportion_receive_files(const char* payload) {
  apportion::web::Payload p = apportion::web::read_payload(payload);
  if (!p.single_csv.empty()) {
    apportion::web::add_single_csv(p.name, p.single_csv);
    return;
  }
  if (!p.loaded.ok()) {
    app().open_errors.clear();
    for (const auto& d : p.loaded.diagnostics.items)
      if (d.severity == apportion::Severity::kError) app().open_errors.push_back(d.to_string());
    apportion::web::report("open-failed");
    return;
  }
  if (!p.graphml.empty() && p.source == "file") {  // ask which attribute holds capacity, in what unit
    apportion::web::ask_graphml_choices(p.name, p.graphml);
    return;
  }
  const std::string label = p.source == "link" ? "from a share link" : p.source == "autosave" ? "autosaved" : p.name;
  apportion::web::set_document(std::move(*p.loaded.network), label, /*save=*/p.source != "autosave");
  apportion::web::report("opened");
}

// Text the browser's paste event carries (see shell.html; GLFW's clipboard is empty in the
// browser).
EMSCRIPTEN_KEEPALIVE void apportion_receive_paste(const char* text) { apportion::web::receive_paste(text); }

// Answers of the solver worker (web/browser/shell.html forwards them).
EMSCRIPTEN_KEEPALIVE void apportion_solve_progress(int id, const char* json) {
  apportion::web::receive_solve_progress(id, json);
}
EMSCRIPTEN_KEEPALIVE void apportion_solve_done(int id, const char* result) { apportion::web::receive_solve_result(id, result); }
EMSCRIPTEN_KEEPALIVE void apportion_solve_failed(int id, const char* message) {
  apportion::web::receive_solve_failure(id, message);
}

// How "Copy share link" went: {"copied", "link", "local" (opened from file://), "error"}.
EMSCRIPTEN_KEEPALIVE void apportion_share_event(const char* json) { apportion::web::receive_share_answer(json); }

// Autosave trouble and other tabs: "quota:<detail>" or "other-tab:<network name>".
EMSCRIPTEN_KEEPALIVE void apportion_storage_event(const char* what) {
  const std::string s = what;
  if (s.rfind("quota:", 0) == 0) {
    app().notice = "Autosave failed: " + s.substr(6) + ". Use Save network to keep your work in a file.";
    apportion::web::report("autosave-failed");
  } else if (s.rfind("other-tab:", 0) == 0) {
    app().other_tab_saved = true;
    apportion::web::report("other-tab-saved");
  }
}

// The test hook: runs a button's action by name; "positions" reports node positions.
EMSCRIPTEN_KEEPALIVE void apportion_test_action(const char* what) {
  if (std::string(what) == "positions") apportion::web::positions_entry();
  else apportion::web::action(what);
}

}  // extern "C"

int main() {
  apportion::LoadResult demo = apportion::read_network_json(kDemoNetworkJson);
  if (!glfwInit()) {
    std::printf("apportion:error GLFW could not start\n");
    return 1;
  }
  glfwWindowHint(GLFW_CLIENT_API, GLFW_OPENGL_ES_API);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 0);
  app().window = glfwCreateWindow(800, 600, "Apportion", nullptr, nullptr);
  if (!app().window) {
    std::printf("apportion:error WebGL2 is not available in this browser\n");
    return 1;
  }
  glfwMakeContextCurrent(app().window);
  IMGUI_CHECKVERSION();
  ImGui::CreateContext();
  ImGui::GetIO().IniFilename = nullptr;  // no file system in the page
  ImGui_ImplGlfw_InitForOpenGL(app().window, true);
  // Emscripten's GLFW reports the mouse in canvas backing-store pixels (CSS x DPR); the UI
  // is laid out in CSS pixels. The cursor is taken as inside from the start, so that the
  // backend never falls back to the unscaled position.
  glfwSetCursorPosCallback(app().window, [](GLFWwindow* w, double x, double y) {
    const double s = app().dpr > 0 ? app().dpr : 1.0;
    ImGui_ImplGlfw_CursorPosCallback(w, x / s, y / s);
  });
  ImGui_ImplGlfw_CursorEnterCallback(app().window, GLFW_TRUE);
  // The backend listens for the wheel on the document, where browsers make listeners passive,
  // so its preventDefault logged an error on every zoom. The wheel is taken on the canvas
  // instead (not passive), at the same rate: a step per 100 pixels, 3 lines or 1/80 page.
  emscripten_set_wheel_callback(EMSCRIPTEN_EVENT_TARGET_DOCUMENT, nullptr, false, nullptr);
  emscripten_set_wheel_callback("#canvas", nullptr, false, [](int, const EmscriptenWheelEvent* ev, void*) -> EM_BOOL {
    const double per_step = ev->deltaMode == DOM_DELTA_PIXEL ? 100.0 : ev->deltaMode == DOM_DELTA_LINE ? 3.0 : 1.0 / 80.0;
    ImGui::GetIO().AddMouseWheelEvent(static_cast<float>(-ev->deltaX / per_step), static_cast<float>(-ev->deltaY / per_step));
    return EM_TRUE;
  });
  ImGui_ImplOpenGL3_Init("#version 300 es");
  app().dpr = 0;  // forces apply_appearance on the first frame
  apportion::web::load_appearance();
  apportion::web::load_side_width();
  if (demo.ok()) apportion::web::set_document(std::move(*demo.network), "demo network", /*save=*/false);
  apportion::web::load_startup_network();
  emscripten_set_main_loop(apportion::web::frame_entry, 0, false);
  return 0;
}
