// Text and number fields that edit the document once, when the user finishes (Enter or
// leaving the field), so that one change is one undo step and a half-typed number never
// reaches the solver. ImGui writes a field's value on every keystroke; the value typed so
// far is kept here until the field is left.
#pragma once

#include <imgui.h>

#include <cstdio>
#include <string>

namespace apportion::web {

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
inline bool edit_number(const char* label, double current, double& out, const char* format = "%.6g") {
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

inline bool edit_text(const char* label, const std::string& current, std::string& out) {
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
