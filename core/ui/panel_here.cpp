// Screen "Here": barometric pressure at the situation's altitude, by the chosen model with the
// other model beside it.
#include "ui/panels.hpp"

#include "model/atmosphere.hpp"
#include "ui/format.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

void draw_here_panel(AppState& state, Platform&) {
  using namespace units;
  const UnitChoice& u = state.settings.units;

  std::optional<std::string> typed = number_field(state, "Altitude", "altitude",
                                                  altitude_text(state.situation.altitude, u));
  if (typed) {
    Result<Length> parsed = parse_length(with_default_unit(*typed, altitude_unit_symbol(u)));
    if (parsed && parsed->in(metres) >= -500.0 && parsed->in(metres) <= 9000.0) {
      state.situation.altitude = parsed.value();
      state.status_message.clear();
    } else {
      state.status_message = parsed ? range_error("altitude", -500, 9000, "m", parsed->in(metres)).message
                                    : parsed.error().message;
    }
  }
  if (!state.status_message.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::GetStyleColorVec4(ImGuiCol_PlotHistogram));
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextUnformatted(state.status_message.c_str());
    ImGui::PopTextWrapPos();
    ImGui::PopStyleColor();
  }

  const char* models[] = {"West 1996", "ISA"};
  int model_index = state.settings.model == atmosphere::Model::West1996 ? 0 : 1;
  ImGui::TextDisabled("Atmosphere model");
  if (choice_row(state, "model", models, 2, &model_index)) {
    state.settings.model = model_index == 0 ? atmosphere::Model::West1996 : atmosphere::Model::Isa;
  }

  atmosphere::Model chosen = state.settings.model;
  atmosphere::Model other =
      chosen == atmosphere::Model::Isa ? atmosphere::Model::West1996 : atmosphere::Model::Isa;
  Result<Pressure> main_pressure = atmosphere::pressure_at(state.situation.altitude, chosen);
  Result<Pressure> other_pressure = atmosphere::pressure_at(state.situation.altitude, other);

  std::string chosen_label = "Barometric pressure (" + std::string(atmosphere::model_name(chosen)) + ")";
  if (main_pressure) {
    result_value(state, chosen_label.c_str(), pressure_text(main_pressure.value(), u));
  } else {
    result_value(state, chosen_label.c_str(), "\xE2\x80\x94");
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextUnformatted(main_pressure.error().message.c_str());
    ImGui::PopTextWrapPos();
  }
  std::string other_label = std::string(atmosphere::model_name(other)) + " for comparison";
  result_value(state, other_label.c_str(),
               other_pressure ? pressure_text(other_pressure.value(), u) : "outside model range",
               false);
  caution_line(state);
}

}  // namespace firn::ui
