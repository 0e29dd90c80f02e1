#include "ui/widgets.hpp"

#include <cctype>
#include <cmath>
#include <cstdio>

#include "model/cautions.hpp"
#include "ui/test_hook.hpp"

namespace firn::ui {

float em() { return ImGui::GetFontSize(); }

float touch_target(const AppState& state) { return 48.0f * state.pixel_ratio; }

std::string shown_number(double value, int decimals) {
  if (!std::isfinite(value)) return "\xE2\x80\x94";  // em dash
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
  std::string text(buffer);
  if (text == "-0" || text.rfind("-0.", 0) == 0) {
    bool all_zero = text.find_first_not_of("-0.") == std::string::npos;
    if (all_zero) text.erase(0, 1);
  }
  return text;
}

bool big_button(const AppState& state, const char* label, float width) {
  float height = std::max(touch_target(state), ImGui::GetFrameHeight());
  bool pressed = ImGui::Button(label, ImVec2(width, height));
  test_hook::item(label);
  return pressed;
}

bool choice_row(const AppState& state, const char* id, const char* const* labels, int count,
                int* selected) {
  bool changed = false;
  ImGui::PushID(id);
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float width = (ImGui::GetContentRegionAvail().x - spacing * (count - 1)) / count;
  for (int i = 0; i < count; ++i) {
    if (i > 0) ImGui::SameLine();
    bool active = *selected == i;
    if (active) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_Header));
    if (active) ImGui::PushStyleColor(ImGuiCol_Border, ImGui::GetStyleColorVec4(ImGuiCol_CheckMark));
    float height = std::max(touch_target(state), ImGui::GetFrameHeight());
    if (ImGui::Button(labels[i], ImVec2(width, height)) && !active) {
      *selected = i;
      changed = true;
    }
    test_hook::item_text(labels[i], active ? "selected" : "");
    if (active) ImGui::PopStyleColor(2);
  }
  ImGui::PopID();
  return changed;
}

void result_value(const AppState& state, const char* label, const std::string& shown,
                  bool emphasised) {
  ImGui::TextDisabled("%s", label);
  bool large = emphasised && state.font_large != nullptr;
  if (large) ImGui::PushFont(state.font_large);
  ImGui::TextUnformatted(shown.c_str());
  if (large) ImGui::PopFont();
  test_hook::item_text(label, shown);
}

std::optional<std::string> number_field(AppState& state, const char* label, const char* field_id,
                                        const std::string& display_text) {
  ImGui::TextDisabled("%s", label);
  bool editing = state.edit.field_id == field_id;
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%s", editing ? state.edit.text.c_str() : display_text.c_str());
  ImGui::PushID(field_id);
  ImGui::SetNextItemWidth(-1.0f);
  bool enter = ImGui::InputText("##value", buffer, sizeof buffer,
                                ImGuiInputTextFlags_CharsScientific |
                                    ImGuiInputTextFlags_AutoSelectAll |
                                    ImGuiInputTextFlags_EnterReturnsTrue);
  ImGui::PopID();
  test_hook::item_text(label, buffer);
  if (ImGui::IsItemActive()) state.edit = {field_id, buffer};
  if (enter || ImGui::IsItemDeactivatedAfterEdit()) {
    state.edit = {};
    return std::string(buffer);
  }
  if (!ImGui::IsItemActive() && state.edit.field_id == field_id) state.edit = {};
  return std::nullopt;
}

std::string with_default_unit(const std::string& text, std::string_view unit) {
  for (char c : text) {
    if (std::isalpha(static_cast<unsigned char>(c)) && c != 'e' && c != 'E') return text;
    if (static_cast<unsigned char>(c) >= 0x80) return text;  // "°C"
  }
  return text + std::string(unit);
}

void caution_line(AppState& state) {
  (void)state;
  ImGui::Separator();
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("%s", std::string(cautions::short_line).c_str());
  ImGui::PopTextWrapPos();
  test_hook::item_text("Cautions", std::string(cautions::short_line));
  if (ImGui::TreeNode("Read more")) {
    for (std::string_view line : cautions::full_text) {
      ImGui::Bullet();
      ImGui::PushTextWrapPos(0.0f);
      ImGui::TextUnformatted(line.data(), line.data() + line.size());
      ImGui::PopTextWrapPos();
    }
    ImGui::TreePop();
  }
}

}  // namespace firn::ui
