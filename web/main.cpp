// Apportion in the browser (first version): Dear ImGui over Emscripten's GLFW and WebGL2.
// It loads the demo network through the same core as the command line, solves its weighted
// max-min fair shares, and draws the network with arcs coloured by utilisation, beside the
// table of shares. The full app (editing, worker solves, exports) replaces this page.
//
// HiDPI: Emscripten 3.1.6's GLFW ignores devicePixelRatio, so each frame sizes the canvas
// backing store to CSS size x DPR itself and scales the fonts by the DPR.
#include <GLFW/glfw3.h>
#include <emscripten.h>
#include <emscripten/html5.h>
#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#include <cmath>
#include <cstdio>
#include <string>

#include "apportion/fair_multiflow.h"
#include "apportion/flow_result_export.h"
#include "apportion/network_json.h"
#include "demo_network.h"
#include "network_view.h"

namespace {

struct App {
  GLFWwindow* window = nullptr;
  apportion::LoadResult loaded;
  apportion::MultiflowResult fair;
  float dpr = 1.0f;
  bool first_frame_reported = false;
};

App app;

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
  if (app.loaded.ok()) {
    const apportion::Network& net = *app.loaded.network;
    const bool solved = app.fair.status == apportion::SolveStatus::kOptimal;
    ImGui::Text("%s", net.name.c_str());
    ImGui::Text("%d nodes, %d arcs, %d demands -- weighted max-min fair shares (checked: %s)", net.node_count(),
                net.arc_count(), static_cast<int>(net.demands.size()), solved && app.fair.check.ok ? "ok" : "no");
    ImGui::TextWrapped("%s", apportion::kPlanningCaution);
    ImGui::Separator();
    const float table_w = 520.0f * dpr;
    ImGui::BeginChild("shares", ImVec2(table_w, 0), true);
    if (solved) {
      ImGui::Text("Throughput %.6g %s, minimum normalised share %.6g, Jain's index %.4f", app.fair.throughput,
                  net.units.capacity.c_str(), app.fair.min_normalised_share, app.fair.jain_index);
      if (app.fair.price_of_fairness >= 0)
        ImGui::Text("Price of fairness %.2f%% of the maximum throughput %.6g", 100 * app.fair.price_of_fairness,
                    app.fair.max_throughput);
      if (ImGui::BeginTable("demands", 5, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) {
        ImGui::TableSetupColumn("Demand");
        ImGui::TableSetupColumn("Share");
        ImGui::TableSetupColumn("% of amount");
        ImGui::TableSetupColumn("Tier");
        ImGui::TableSetupColumn("Bound by");
        ImGui::TableHeadersRow();
        for (std::size_t k = 0; k < net.demands.size(); ++k) {
          const apportion::DemandShare& d = app.fair.demands[k];
          ImGui::TableNextRow();
          ImGui::TableNextColumn();
          ImGui::TextUnformatted(net.demands[k].id.c_str());
          ImGui::TableNextColumn();
          ImGui::Text("%.6g", d.share);
          ImGui::TableNextColumn();
          if (d.percent_of_amount >= 0) ImGui::Text("%.1f%%", d.percent_of_amount); else ImGui::TextUnformatted("-");
          ImGui::TableNextColumn();
          ImGui::Text("%d", d.tier);
          ImGui::TableNextColumn();
          std::string bound = d.limited_by_amount ? "its amount" : "";
          for (int a : d.binding_arcs) bound += (bound.empty() ? "" : " ") + net.arcs[a].id;
          ImGui::TextUnformatted(bound.c_str());
        }
        ImGui::EndTable();
      }
    } else {
      ImGui::TextWrapped("Not solved: %s", app.fair.message.c_str());
    }
    ImGui::EndChild();
    ImGui::SameLine();
    ImGui::BeginChild("canvas");
    apportion::web::draw_network(net, solved ? &app.fair : nullptr, dpr);
    ImGui::EndChild();
  } else {
    for (const auto& d : app.loaded.diagnostics.items) ImGui::TextWrapped("%s", d.to_string().c_str());
  }
  ImGui::End();

  ImGui::Render();
  glViewport(0, 0, w, h);
  glClearColor(0.11f, 0.12f, 0.15f, 1.0f);
  glClear(GL_COLOR_BUFFER_BIT);
  ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());

  if (!app.first_frame_reported) {
    // A machine-readable line for the browser tests.
    app.first_frame_reported = true;
    std::string shares;
    for (const auto& d : app.fair.demands) {
      char buf[32];
      std::snprintf(buf, sizeof buf, "%.17g", d.share);
      shares += (shares.empty() ? "" : ",") + std::string(buf);
    }
    std::printf("apportion:first-frame {\"network\":\"%s\",\"status\":\"%s\",\"shares\":[%s],\"dpr\":%g}\n",
                app.loaded.ok() ? app.loaded.network->name.c_str() : "", apportion::status_name(app.fair.status),
                shares.c_str(), dpr);
    EM_ASM(Module.setStatus(''));
  }
}

}  // namespace

int main() {
  app.loaded = apportion::read_network_json(kDemoNetworkJson);
  if (app.loaded.ok()) app.fair = apportion::solve_multiflow(*app.loaded.network, apportion::FairOptions{});
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
  emscripten_set_main_loop(frame, 0, false);
  return 0;
}
