// Screen "AMS": the 2018 Lake Louise acute mountain sickness score (Roach 2018), four
// self-reported items 0–3 tapped in big buttons. Every item starts unanswered and there is no
// score or verdict until all four are answered; then the total, its category as a verdict, the
// prompt for other causes when the symptoms come without headache, and what the score is not.
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>

#include "model/lake_louise.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

// 0–3 buttons recorded as "<item> 0" … "<item> 3" so tests can tell the rows apart; none is
// selected while the item is unanswered.
void score_row(AppState& state, const char* item, const char* hint, int* value) {
  ImGui::TextUnformatted(item);
  ImGui::SameLine();
  ImGui::TextDisabled("%s", *value == AmsInputs::kUnanswered ? "not answered" : hint);
  const char* words[] = {"0", "1", "2", "3"};
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float width = (ImGui::GetContentRegionAvail().x - 3 * spacing) / 4;
  float height = std::max(touch_target(state.display), ImGui::GetFrameHeight());
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

Tone tone_of(const lake_louise::Score& s) {
  switch (s.category) {
    case lake_louise::Category::None: return s.consider_other_causes ? Tone::Caution : Tone::Good;
    case lake_louise::Category::Mild: return Tone::Caution;
    case lake_louise::Category::Moderate:
    case lake_louise::Category::Severe: return Tone::Danger;
  }
  return Tone::Neutral;
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
  toggle_row(state.display, "ascent", "No recent ascent", "Recent ascent", &in.recent_ascent);

  const int items[] = {in.headache, in.gastrointestinal, in.fatigue, in.dizziness};
  int answered = static_cast<int>(std::count_if(std::begin(items), std::end(items),
                                                [](int v) { return v != AmsInputs::kUnanswered; }));
  if (answered < 4) {
    verdict_line(state.display, Tone::Neutral,
                 "no score yet: " + std::to_string(answered) + " of 4 items answered");
  } else {
    lake_louise::Answers answers{in.headache, in.gastrointestinal, in.fatigue, in.dizziness,
                                 in.recent_ascent};
    Result<lake_louise::Score> score = lake_louise::score(answers);
    if (!score) {
      result_error(state.display, "Lake Louise score", score.error().message);
    } else {
      verdict_line(state.display, tone_of(score.value()), std::string(lake_louise::category_name(score->category)));
      result_value(state.display, "Lake Louise score", std::to_string(score->total) + " of 12");
      if (score->consider_other_causes) message_line(std::string(lake_louise::kOtherCauses), true);
    }
  }
  if (answered > 0 && big_button(state.display, "Clear the answers")) {
    in.headache = in.gastrointestinal = in.fatigue = in.dizziness = AmsInputs::kUnanswered;
  }
  for (std::string_view caveat : lake_louise::caveats) bullet_line(caveat);
  caution_line(state);
}

}  // namespace firn::ui
