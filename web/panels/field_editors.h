// Text and number fields that edit the document once, when the user finishes (Enter or
// leaving the field), so that one change is one undo step and a half-typed number never
// reaches the solver. ImGui writes a field's value on every keystroke; the value typed so
// far is kept here until the field is left. A visible label comes before its field, the
// fields of a panel lined up in one column.
#pragma once

#include <imgui.h>

#include <cstdio>
#include <string>

#include "app/appearance.h"

namespace apportion::web {

// Draws the visible part of `label` (before any "##") and moves to the field's column;
// returns the ImGui label for the field itself, which keeps the full label as its id.
inline std::string label_before(const char* label, float column_css_px = 110) {
  const std::string full = label;
  const std::string shown = full.substr(0, full.find("##"));
  if (shown.empty()) return full;
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(shown.c_str());
  const float column = column_css_px * ui_scale();
  if (ImGui::GetItemRectSize().x + ImGui::GetStyle().ItemSpacing.x < column) ImGui::SameLine(column);
  else ImGui::SameLine();
  return "##" + full;
}

struct PendingField {
  ImGuiID id = 0;
  std::string text;
  double number = 0;
};
inline PendingField& pending_field() {
  static PendingField p;
  return p;
}

// True with `out` set when the user finished editing with a new value.
inline bool edit_number(const char* visible_label, double current, double& out, const char* format = "%.6g") {
  const std::string field = label_before(visible_label);
  const char* label = field.c_str();
  PendingField& p = pending_field();
  const ImGuiID id = ImGui::GetID(label);
  double v = p.id == id ? p.number : current;
  if (ImGui::InputDouble(label, &v, 0.0, 0.0, format)) p.id = id, p.number = v;
  if (ImGui::IsItemDeactivatedAfterEdit() && p.id == id) {
    p.id = 0;
    out = p.number;
    return out != current;
  }
  if (!ImGui::IsItemActive() && p.id == id) p.id = 0;
  return false;
}

inline bool edit_text(const char* visible_label, const std::string& current, std::string& out) {
  const std::string field = label_before(visible_label);
  const char* label = field.c_str();
  PendingField& p = pending_field();
  const ImGuiID id = ImGui::GetID(label);
  char buf[512];
  std::snprintf(buf, sizeof buf, "%s", (p.id == id ? p.text : current).c_str());
  if (ImGui::InputText(label, buf, sizeof buf)) p.id = id, p.text = buf;
  if (ImGui::IsItemDeactivatedAfterEdit() && p.id == id) {
    p.id = 0;
    out = p.text;
    return out != current;
  }
  if (!ImGui::IsItemActive() && p.id == id) p.id = 0;
  return false;
}

}  // namespace apportion::web
