// Screen "AMS": the 2018 Lake Louise acute mountain sickness score (Roach 2018), four
// self-reported items 0–3 tapped in big buttons, the total and its category, and what the
// score is not (HACE/HAPE signs override it).
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>

#include "model/lake_louise.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

// 0–3 buttons recorded as "<item> 0" … "<item> 3" so tests can tell the rows apart.
void score_row(AppState& state, const char* item, const char* hint, int* value) {
  ImGui::TextUnformatted(item);
  ImGui::SameLine();
  ImGui::TextDisabled("%s", hint);
  const char* words[] = {"0", "1", "2", "3"};
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float width = (ImGui::GetContentRegionAvail().x - 3 * spacing) / 4;
  float height = std::max(touch_target(state), ImGui::GetFrameHeight());
  ImGui::PushID(item);
  for (int i = 0; i < 4; ++i) {
    if (i > 0) ImGui::SameLine();
    bool active = *value == i;
    if (active) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_Header));
    if (active) ImGui::PushStyleColor(ImGuiCol_Border, ImGui::GetStyleColorVec4(ImGuiCol_CheckMark));
    if (ImGui::Button(words[i], ImVec2(width, height))) *value = i;
    if (active) ImGui::PopStyleColor(2);
    test_hook::item_text(std::string(item) + " " + std::to_string(i), active ? "selected" : "");
  }
  ImGui::PopID();
}

}  // namespace

void draw_ams_panel(AppState& state, Platform&) {
  AmsInputs& in = state.ams;
  heading("Lake Louise AMS score (2018)");
  ImGui::TextDisabled("0 none \xC2\xB7 1 mild \xC2\xB7 2 moderate \xC2\xB7 3 severe");
  score_row(state, "Headache", "", &in.headache);
  score_row(state, "Gastrointestinal", "appetite, nausea, vomiting", &in.gastrointestinal);
  score_row(state, "Fatigue", "and/or weakness", &in.fatigue);
  score_row(state, "Dizziness", "light-headedness", &in.dizziness);
  toggle_row(state, "ascent", "No recent ascent", "Recent ascent", &in.recent_ascent);

  lake_louise::Answers answers{in.headache, in.gastrointestinal, in.fatigue, in.dizziness,
                               in.recent_ascent};
  Result<lake_louise::Score> score = lake_louise::score(answers);
  if (!score) {
    result_error(state, "Lake Louise score", score.error().message);
  } else {
    result_value(state, "Lake Louise score", std::to_string(score->total) + " of 12");
    result_value(state, "Assessment", std::string(lake_louise::category_name(score->category)));
  }
  for (std::string_view caveat : lake_louise::caveats) bullet_line(caveat);
  caution_line(state);
}

}  // namespace firn::ui
