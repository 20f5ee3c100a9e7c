// The page's themes, text size and font; see appearance.h.
#include "app/appearance.h"

#include <imgui_impl_opengl3.h>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <string>

#include "browser/browser_bridge.h"
#include "ui_font.h"

namespace apportion::web {

namespace {

bool changed = false;

// The characters web/app/embed_font.py keeps in the font (pairs, zero-terminated).
const ImWchar kUiGlyphRanges[] = {0x0020, 0x007E, 0x00A0, 0x00FF, 0x0394, 0x0394, 0x03B5, 0x03B5, 0x03BB, 0x03BB,
                                  0x2013, 0x2014, 0x2018, 0x201D, 0x2022, 0x2022, 0x2026, 0x2026, 0x2190, 0x2194,
                                  0x2212, 0x2212, 0x2248, 0x2248, 0x2264, 0x2265, 0x2713, 0x2713, 0};

constexpr Palette kDark = {
    PictureTheme::kDark,
    IM_COL32(230, 232, 236, 255), IM_COL32(29, 32, 38, 255),
    IM_COL32(140, 150, 165, 255), IM_COL32(140, 150, 165, 64),
    IM_COL32(230, 159, 0, 255), IM_COL32(204, 121, 167, 255), IM_COL32(190, 195, 205, 230),
    IM_COL32(86, 180, 233, 255), IM_COL32(240, 228, 66, 255), IM_COL32(255, 255, 255, 220),
    IM_COL32(90, 96, 110, 255), IM_COL32(200, 204, 212, 255),
    {IM_COL32(0, 114, 178, 255), IM_COL32(0, 158, 115, 255)},
    ImVec4(1.0f, 0.55f, 0.45f, 1.0f), ImVec4(0.95f, 0.85f, 0.5f, 1.0f), ImVec4(0.95f, 0.80f, 0.45f, 1.0f),
    ImVec4(0.11f, 0.12f, 0.15f, 1.0f)};

// Light: the same meanings, darker where a colour has to stand out against white
// (the orange becomes Okabe-Ito vermillion's neighbour, the yellow match a dark gold ring).
constexpr Palette kLight = {
    PictureTheme::kLight,
    IM_COL32(32, 34, 40, 255), IM_COL32(250, 250, 250, 255),
    IM_COL32(120, 126, 138, 255), IM_COL32(120, 126, 138, 70),
    IM_COL32(213, 120, 0, 255), IM_COL32(173, 60, 130, 255), IM_COL32(90, 95, 105, 230),
    IM_COL32(0, 114, 178, 255), IM_COL32(170, 140, 0, 255), IM_COL32(255, 255, 255, 230),
    IM_COL32(170, 175, 185, 255), IM_COL32(60, 64, 72, 255),
    {IM_COL32(0, 114, 178, 255), IM_COL32(0, 158, 115, 255)},
    ImVec4(0.72f, 0.15f, 0.05f, 1.0f), ImVec4(0.55f, 0.40f, 0.0f, 1.0f), ImVec4(0.55f, 0.32f, 0.0f, 1.0f),
    ImVec4(0.98f, 0.98f, 0.98f, 1.0f)};

int nearest_scale(int percent) {
  int best = 100;
  for (int p : kScalePercents)
    if (std::abs(p - percent) < std::abs(best - percent)) best = p;
  return best;
}

void remember() {
  const Appearance& a = appearance();
  write_setting("appearance", std::string(a.light ? "light" : "dark") + " " + std::to_string(a.scale_percent));
}

}  // namespace

Appearance& appearance() {
  static Appearance a;
  return a;
}

const Palette& palette() { return appearance().light ? kLight : kDark; }

float ui_scale() { return appearance().scale_percent / 100.0f; }

void load_appearance() {
  // "dark 100" or "light 150"; anything else keeps the defaults.
  const std::string s = read_setting("appearance");
  const std::size_t space = s.find(' ');
  if (space == std::string::npos) return;
  const std::string theme = s.substr(0, space);
  if (theme != "light" && theme != "dark") return;
  const int percent = std::atoi(s.c_str() + space + 1);
  if (percent < kScalePercents[0] || percent > 200) return;
  appearance().light = theme == "light";
  appearance().scale_percent = nearest_scale(percent);
}

void apply_appearance(float dpr) {
  const float scale = ui_scale();
  ImGuiStyle style;
  if (appearance().light) {
    ImGui::StyleColorsLight(&style);
    style.Colors[ImGuiCol_WindowBg] = palette().clear;
    style.Colors[ImGuiCol_ChildBg] = palette().clear;
  } else {
    ImGui::StyleColorsDark(&style);
  }
  style.FrameRounding = 3, style.GrabRounding = 3, style.TabRounding = 3;
  style.ScaleAllSizes(scale);
  ImGui::GetStyle() = style;

  // The font is rasterised at its size on screen in device pixels, then drawn at 1/DPR, so
  // that one texel is one device pixel.
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  ImFontConfig cfg;
  cfg.FontDataOwnedByAtlas = false;  // the bytes are static
  cfg.OversampleH = 2, cfg.OversampleV = 1, cfg.PixelSnapH = false;
  const float pixels = std::round(kBaseFontPixels * scale * dpr);
  io.Fonts->AddFontFromMemoryTTF(const_cast<unsigned char*>(kUiFont), static_cast<int>(kUiFontSize), pixels, &cfg,
                                 kUiGlyphRanges);
  io.Fonts->Build();
  io.FontGlobalScale = 1.0f / dpr;
  ImGui_ImplOpenGL3_DestroyFontsTexture();
  ImGui_ImplOpenGL3_CreateFontsTexture();
}

void set_theme(bool light) {
  if (appearance().light == light) return;
  appearance().light = light;
  changed = true;
  remember();
}

void set_scale_percent(int percent) {
  percent = nearest_scale(percent);
  if (appearance().scale_percent == percent) return;
  appearance().scale_percent = percent;
  changed = true;
  remember();
}

bool appearance_changed() {
  const bool c = changed;
  changed = false;
  return c;
}

}  // namespace apportion::web
