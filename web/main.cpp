// Apportion in the browser (first version): Dear ImGui over Emscripten's GLFW and WebGL2.
// The page holds one network document and its result; both are the single source of truth
// and every frame is drawn from them. It opens the demo network (or the network of a share
// link, or the autosaved one), solves it with the chosen rule through the same core as the
// command line, and exports results and the network, all inside the browser.
//
// HiDPI: Emscripten 3.1.6's GLFW ignores devicePixelRatio, so each frame sizes the canvas
// backing store to CSS size x DPR itself and scales the fonts by the DPR.
//
// Test hook: machine-readable console lines "apportion:<event> {json}" and the exported
// apportion_test_action(), which runs the same code as the buttons.
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
#include <vector>

#include "apportion/fair_multiflow.h"
#include "apportion/flow_result_export.h"
#include "apportion/multiflow_result_export.h"
#include "apportion/network_json.h"
#include "apportion/network_svg.h"
#include "browser_bridge.h"
#include "demo_network.h"
#include "file_payload.h"
#include "network_view.h"

namespace {

using apportion::FairObjective;

constexpr FairObjective kObjectives[] = {FairObjective::kMaxMinFair, FairObjective::kMaxConcurrent,
                                         FairObjective::kMaxThroughput, FairObjective::kTradeoff,
                                         FairObjective::kFeasibility};
constexpr const char* kObjectiveLabels[] = {"Max-min fair shares (weighted)", "Max concurrent flow",
                                            "Max throughput", "Throughput with a fairness floor",
                                            "Can every demand be met?"};

struct App {
  GLFWwindow* window = nullptr;
  apportion::Network doc;        // the document
  std::string doc_name;          // where it came from
  apportion::FairOptions options;
  int objective = 0;             // index into kObjectives
  apportion::MultiflowResult result;
  std::vector<std::string> messages;  // from the last failed open, shown until dismissed
  apportion::web::ViewState view;     // how the user looks at the network (not the document)
  bool png_requested = false;
  float dpr = 1.0f;
  bool first_frame_reported = false;
};

App app;

std::string state_json(const char* event) {
  nlohmann::json s = {{"event", event}, {"network", app.doc.name}, {"source", app.doc_name},
                      {"objective", apportion::objective_name(app.result.objective)},
                      {"status", apportion::status_name(app.result.status)}, {"messages", app.messages}};
  nlohmann::json shares = nlohmann::json::array();
  for (const auto& d : app.result.demands) shares.push_back(d.share);
  s["shares"] = shares;
  s["dpr"] = app.dpr;
  return s.dump();
}

void report(const char* event) { std::printf("apportion:%s %s\n", event, state_json(event).c_str()); }

void solve() {
  app.options.objective = kObjectives[app.objective];
  app.result = apportion::solve_multiflow(app.doc, app.options);
  report("solved");
}

void set_document(apportion::Network net, const std::string& name, bool save) {
  app.doc = std::move(net);
  app.doc_name = name;
  app.messages.clear();
  app.view = apportion::web::ViewState{};
  if (save) apportion::web::autosave(apportion::write_network_json(app.doc));
  solve();
}

std::string file_stem() {
  std::string s = app.doc.name.empty() ? "network" : app.doc.name;
  for (char& c : s)
    if (!std::isalnum(static_cast<unsigned char>(c))) c = '-';
  return s;
}

// Every button's action, by name: the UI and the test hook share this code.
void action(const std::string& what) {
  using namespace apportion;
  const bool solved = app.result.status == SolveStatus::kOptimal;
  if (what == "open") web::open_file_picker();
  else if (what == "save-network") web::download_text(file_stem() + ".json", "application/json", write_network_json(app.doc));
  else if (what == "share-link") web::publish_share_link(write_network_json(app.doc));
  else if (what == "solve") solve();
  else if (what == "export-demands-csv" && solved)
    web::download_text(file_stem() + ".demands.csv", "text/csv", multiflow_demands_csv(app.doc, app.result));
  else if (what == "export-arcs-csv" && solved)
    web::download_text(file_stem() + ".arcs.csv", "text/csv", multiflow_arcs_csv(app.doc, app.result));
  else if (what == "export-paths-csv" && solved)
    web::download_text(file_stem() + ".paths.csv", "text/csv", multiflow_paths_csv(app.doc, app.result));
  else if (what == "export-svg")
    web::download_text(file_stem() + ".svg", "image/svg+xml", network_svg(app.doc, solved ? &app.result : nullptr));
  else if (what == "export-png") app.png_requested = true;
  else if (what == "export-result-json" && solved)
    web::download_text(file_stem() + ".result.json", "application/json", multiflow_json(app.doc, app.result));
}

void apply_scale(float dpr) {
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  ImFontConfig cfg;
  cfg.SizePixels = std::round(13.0f * dpr);
  io.Fonts->AddFontDefault(&cfg);
  io.Fonts->Build();
  ImGui_ImplOpenGL3_DestroyFontsTexture();
  ImGui_ImplOpenGL3_CreateFontsTexture();
  ImGuiStyle style;
  ImGui::StyleColorsDark(&style);
  style.ScaleAllSizes(dpr);
  ImGui::GetStyle() = style;
}

void draw_toolbar() {
  const bool solved = app.result.status == apportion::SolveStatus::kOptimal;
  if (ImGui::Button("Open network...")) action("open");
  ImGui::SameLine();
  if (ImGui::Button("Save network")) action("save-network");
  ImGui::SameLine();
  if (ImGui::Button("Copy share link")) action("share-link");
  ImGui::SameLine();
  ImGui::BeginDisabled(!solved);
  if (ImGui::Button("Shares CSV")) action("export-demands-csv");
  ImGui::SameLine();
  if (ImGui::Button("Arcs CSV")) action("export-arcs-csv");
  ImGui::SameLine();
  if (ImGui::Button("Paths CSV")) action("export-paths-csv");
  ImGui::SameLine();
  if (ImGui::Button("Result JSON")) action("export-result-json");
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Picture SVG")) action("export-svg");
  ImGui::SameLine();
  if (ImGui::Button("Picture PNG")) action("export-png");
  ImGui::SameLine();
  ImGui::Checkbox("Animate", &app.view.animate);

  ImGui::SetNextItemWidth(260 * app.dpr);
  if (ImGui::Combo("Rule", &app.objective, kObjectiveLabels, IM_ARRAYSIZE(kObjectiveLabels))) solve();
  ImGui::SameLine();
  if (kObjectives[app.objective] == FairObjective::kTradeoff) {
    float eps = static_cast<float>(app.options.epsilon);
    ImGui::SetNextItemWidth(140 * app.dpr);
    if (ImGui::SliderFloat("fairness given up", &eps, 0.0f, 1.0f, "%.2f")) app.options.epsilon = eps;
    if (ImGui::IsItemDeactivatedAfterEdit()) solve();
    ImGui::SameLine();
  }
  ImGui::SetNextItemWidth(90 * app.dpr);
  if (ImGui::InputInt("hop limit (0: none)", &app.options.routing.hop_limit)) {
    app.options.routing.hop_limit = std::max(0, app.options.routing.hop_limit);
    solve();
  }
}

void draw_result_panel() {
  const apportion::Network& net = app.doc;
  const apportion::MultiflowResult& r = app.result;
  if (r.status != apportion::SolveStatus::kOptimal) {
    ImGui::TextWrapped("Not solved (%s): %s", apportion::status_name(r.status), r.message.c_str());
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
  ImGui::Text("Throughput %.6g %s, minimum normalised share %.6g, Jain's index %.4f", r.throughput, unit,
              r.min_normalised_share, r.jain_index);
  if (r.lambda >= 0) ImGui::Text("Max concurrent flow lambda %.6g", r.lambda);
  if (r.price_of_fairness >= 0)
    ImGui::Text("Price of fairness %.2f%% of the maximum throughput %.6g", 100 * r.price_of_fairness, r.max_throughput);
  ImGui::Text("Checked: %s", r.check.ok ? "ok" : "FAILED");
  if (ImGui::BeginTable("demands", 5, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_Resizable)) {
    ImGui::TableSetupColumn("Demand");
    ImGui::TableSetupColumn("Share");
    ImGui::TableSetupColumn("% of amount");
    ImGui::TableSetupColumn("Tier");
    ImGui::TableSetupColumn("Bound by");
    ImGui::TableHeadersRow();
    for (std::size_t k = 0; k < net.demands.size() && k < r.demands.size(); ++k) {
      const apportion::DemandShare& d = r.demands[k];
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      // Selecting a demand highlights its paths and binding arcs on the canvas.
      const bool selected = app.view.selected_demand == static_cast<int>(k);
      if (ImGui::Selectable(net.demands[k].id.c_str(), selected, ImGuiSelectableFlags_SpanAllColumns))
        app.view.selected_demand = selected ? -1 : static_cast<int>(k);
      if (!net.demands[k].label.empty() && ImGui::IsItemHovered()) ImGui::SetTooltip("%s", net.demands[k].label.c_str());
      ImGui::TableNextColumn();
      ImGui::Text("%.6g", d.share);
      ImGui::TableNextColumn();
      if (d.percent_of_amount >= 0) ImGui::Text("%.1f%%", d.percent_of_amount); else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      if (d.tier) ImGui::Text("%d", d.tier); else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      std::string bound = d.limited_by_amount ? "its amount" : "";
      for (int a : d.binding_arcs) bound += (bound.empty() ? "" : " ") + net.arcs[a].id;
      if (d.binding_arcs_form_cut) bound += " (cut)";
      ImGui::TextUnformatted(bound.c_str());
    }
    ImGui::EndTable();
  }
}

void frame() {
  double css_w = 0, css_h = 0;
  emscripten_get_element_css_size("#canvas", &css_w, &css_h);
  const float dpr = static_cast<float>(emscripten_get_device_pixel_ratio());
  const int w = std::max(1, static_cast<int>(css_w * dpr)), h = std::max(1, static_cast<int>(css_h * dpr));
  emscripten_set_canvas_element_size("#canvas", w, h);
  if (dpr != app.dpr) app.dpr = dpr, apply_scale(dpr);

  glfwPollEvents();
  ImGui_ImplOpenGL3_NewFrame();
  ImGui_ImplGlfw_NewFrame();
  ImGuiIO& io = ImGui::GetIO();
  io.DisplaySize = ImVec2(static_cast<float>(w), static_cast<float>(h));
  io.DisplayFramebufferScale = ImVec2(1, 1);
  // GLFW reports the mouse in CSS pixels; the UI is laid out in device pixels.
  if (io.MousePos.x > -FLT_MAX) io.MousePos = ImVec2(io.MousePos.x * dpr, io.MousePos.y * dpr);
  ImGui::NewFrame();

  ImGui::SetNextWindowPos(ImVec2(0, 0));
  ImGui::SetNextWindowSize(io.DisplaySize);
  ImGui::Begin("Apportion", nullptr, ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoCollapse);
  draw_toolbar();
  ImGui::Text("%s  (%s; %d nodes, %d arcs, %d demands)", app.doc.name.c_str(), app.doc_name.c_str(),
              app.doc.node_count(), app.doc.arc_count(), static_cast<int>(app.doc.demands.size()));
  ImGui::TextWrapped("%s", apportion::kPlanningCaution);
  if (!app.messages.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImVec4(1.0f, 0.55f, 0.45f, 1.0f));
    ImGui::TextUnformatted("The file was not opened; the current network is unchanged:");
    for (const std::string& m : app.messages) ImGui::BulletText("%s", m.c_str());
    ImGui::PopStyleColor();
    if (ImGui::SmallButton("Dismiss")) app.messages.clear();
  }
  ImGui::Separator();
  ImGui::BeginChild("shares", ImVec2(540.0f * dpr, 0), true);
  draw_result_panel();
  ImGui::EndChild();
  ImGui::SameLine();
  ImGui::BeginChild("canvas");
  const bool solved = app.result.status == apportion::SolveStatus::kOptimal;
  apportion::web::draw_network(app.doc, solved ? &app.result : nullptr, app.view, dpr);
  ImGui::EndChild();
  ImGui::End();

  ImGui::Render();
  glViewport(0, 0, w, h);
  glClearColor(0.11f, 0.12f, 0.15f, 1.0f);
  glClear(GL_COLOR_BUFFER_BIT);
  ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
  if (app.png_requested) {  // read the canvas now, while this frame's pixels are in it
    app.png_requested = false;
    apportion::web::download_canvas_png(file_stem() + ".png");
  }

  if (!app.first_frame_reported) {
    app.first_frame_reported = true;
    report("first-frame");
    EM_ASM(Module.setStatus(''));
  }
}

}  // namespace

extern "C" {

// Files from the browser (picker, share link, autosave), as JSON; see file_payload.h.
EMSCRIPTEN_KEEPALIVE void apportion_receive_files(const char* payload) {
  apportion::web::Payload p = apportion::web::read_payload(payload);
  if (!p.loaded.ok()) {
    app.messages.clear();
    for (const auto& d : p.loaded.diagnostics.items)
      if (d.severity == apportion::Severity::kError) app.messages.push_back(d.to_string());
    report("open-failed");
    return;
  }
  const std::string label = p.source == "link" ? "from a share link" : p.source == "autosave" ? "autosaved" : p.name;
  set_document(std::move(*p.loaded.network), label, /*save=*/p.source != "autosave");
  report("opened");
}

// The test hook: runs a button's action by name.
EMSCRIPTEN_KEEPALIVE void apportion_test_action(const char* what) { action(what); }

}  // extern "C"

int main() {
  apportion::LoadResult demo = apportion::read_network_json(kDemoNetworkJson);
  if (demo.ok()) set_document(std::move(*demo.network), "demo network", /*save=*/false);
  if (!glfwInit()) {
    std::printf("apportion:error GLFW could not start\n");
    return 1;
  }
  glfwWindowHint(GLFW_CLIENT_API, GLFW_OPENGL_ES_API);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 0);
  app.window = glfwCreateWindow(800, 600, "Apportion", nullptr, nullptr);
  if (!app.window) {
    std::printf("apportion:error WebGL2 is not available in this browser\n");
    return 1;
  }
  glfwMakeContextCurrent(app.window);
  IMGUI_CHECKVERSION();
  ImGui::CreateContext();
  ImGui::GetIO().IniFilename = nullptr;  // no file system in the page
  ImGui_ImplGlfw_InitForOpenGL(app.window, true);
  ImGui_ImplOpenGL3_Init("#version 300 es");
  app.dpr = 0;  // forces apply_scale on the first frame
  apportion::web::load_startup_network();
  emscripten_set_main_loop(frame, 0, false);
  return 0;
}
