// How the page looks: the dark or the light theme (the light one for meetings and print),
// the text size (a UI scale, 80-200 %), and the text font, DejaVu Sans, compiled in
// (web/app/embed_font.py) and rasterised at the device pixel ratio so that it stays crisp.
// Both choices are remembered in this browser's local storage.
//
// The palette gives every colour with a meaning its value in each theme, so that panels and
// the canvas never hard-code one. The marking colours follow Okabe and Ito ("Color Universal
// Design", 2008), readable with the common colour-vision deficiencies; on the light theme
// they are darkened to keep their contrast against white.
#pragma once

#include <imgui.h>

#include "apportion/results/network_svg.h"

namespace apportion::web {

struct Appearance {
  bool light = false;  // the light theme
  int scale_percent = 100;
};
inline constexpr int kScalePercents[] = {80, 90, 100, 115, 130, 150, 175, 200};

struct Palette {
  PictureTheme picture;  // the utilisation scale and the SVG export's theme
  ImU32 ink;             // node discs and labels
  ImU32 halo;            // behind labels, the canvas background
  ImU32 idle_arc, faded_arc;
  ImU32 focus;           // orange: the filtered demand's or tier's flow
  ImU32 binding;         // reddish purple: binding arcs
  ImU32 out_of_service;  // the dashes and the cross
  ImU32 selected;        // sky blue / blue: the selection
  ImU32 match;           // yellow: search matches
  ImU32 moving_mark;     // the dots that move with the flow
  ImU32 chart_frame, chart_axis;
  ImU32 tier_colours[2];  // blue and bluish green, alternating: never the canvas's orange or purple
  ImVec4 error_text, warning_text, caution_text;
  ImVec4 clear;          // behind everything
};

Appearance& appearance();
const Palette& palette();
// The font size in CSS pixels at 100 %.
inline constexpr float kBaseFontPixels = 15.0f;
// The UI scale as a factor (1 at 100 %).
float ui_scale();

// Reads the remembered choices (call once, before the first frame).
void load_appearance();
// Applies the choices to ImGui's style and fonts for this device pixel ratio; call when the
// DPR or a choice changes, outside a frame.
void apply_appearance(float dpr);
// Changes a choice: remembered, and applied at the start of the next frame.
void set_theme(bool light);
void set_scale_percent(int percent);
// True once when a choice changed since the last call (the frame then re-applies it).
bool appearance_changed();

}  // namespace apportion::web
