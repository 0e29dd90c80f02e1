// Screen "Settings": units, theme, about. Units change only how values are shown and typed:
// the stored quantities stay exactly as entered.
#include "ui/panels.hpp"

#include <imgui.h>

#include "ui/theme.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

void draw_settings_panel(AppState& state, Platform& platform) {
  UnitChoice& u = state.settings.units;

  ImGui::TextDisabled("Altitude unit");
  const char* altitude_units[] = {"m", "ft"};
  int altitude_index = static_cast<int>(u.altitude);
  if (choice_row(state, "altitude-unit", altitude_units, 2, &altitude_index)) {
    u.altitude = static_cast<UnitChoice::Altitude>(altitude_index);
  }

  ImGui::TextDisabled("Pressure unit");
  const char* pressure_units[] = {"hPa", "mmHg", "kPa", "inHg"};
  int pressure_index = static_cast<int>(u.pressure);
  if (choice_row(state, "pressure-unit", pressure_units, 4, &pressure_index)) {
    u.pressure = static_cast<UnitChoice::Pressure>(pressure_index);
  }

  ImGui::TextDisabled("Cylinder pressure unit");
  const char* cylinder_units[] = {"bar", "psi"};
  int cylinder_index = static_cast<int>(u.cylinder);
  if (choice_row(state, "cylinder-unit", cylinder_units, 2, &cylinder_index)) {
    u.cylinder = static_cast<UnitChoice::CylinderPressure>(cylinder_index);
  }

  ImGui::TextDisabled("Temperature unit");
  const char* temperature_units[] = {"\xC2\xB0" "C", "\xC2\xB0" "F"};
  int temperature_index = static_cast<int>(u.temperature);
  if (choice_row(state, "temperature-unit", temperature_units, 2, &temperature_index)) {
    u.temperature = static_cast<UnitChoice::Temperature>(temperature_index);
  }

  ImGui::TextDisabled("Theme");
  const char* themes[] = {theme_label(Theme::Day), theme_label(Theme::Night),
                          theme_label(Theme::Projection)};
  int theme_index = static_cast<int>(state.settings.theme);
  if (choice_row(state, "theme", themes, 3, &theme_index)) {
    state.settings.theme = static_cast<Theme>(theme_index);
    state.built_font_scale = 0.0f;  // fonts and style are rebuilt before the next frame
  }

  ImGui::Separator();
  ImGui::TextDisabled("Firn %s (%.*s)%s%s", FIRN_VERSION, static_cast<int>(platform.name().size()),
                      platform.name().data(), FIRN_BUILD_LABEL[0] ? " · " : "", FIRN_BUILD_LABEL);
  caution_line(state);
}

}  // namespace firn::ui
