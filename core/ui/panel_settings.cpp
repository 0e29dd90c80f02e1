// Screen "Settings": units, theme, about. Units change only how values are shown and typed:
// the stored quantities stay exactly as entered.
#include "ui/panels.hpp"

#include <imgui.h>

#include "ui/theme.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {
template <class D, std::size_t N, class Choice>
void unit_row(const AppState& state, const char* title, const char* id,
              const UnitList<D, N>& list, Choice& choice) {
  ImGui::TextDisabled("%s", title);
  auto labels = unit_labels(list);
  int index = static_cast<int>(choice);
  if (choice_row(state.display, id, labels.data(), static_cast<int>(N), &index)) {
    choice = static_cast<Choice>(index);
  }
}
}  // namespace

void draw_settings_panel(AppState& state, Platform& platform) {
  UnitChoice& u = state.settings.units;

  unit_row(state, "Altitude unit", "altitude-unit", kAltitudeUnits, u.altitude);
  unit_row(state, "Pressure unit", "pressure-unit", kPressureUnits, u.pressure);
  unit_row(state, "Cylinder pressure unit", "cylinder-unit", kCylinderUnits, u.cylinder);
  unit_row(state, "Temperature unit", "temperature-unit", kTemperatureUnits, u.temperature);

  ImGui::TextDisabled("Theme");
  const char* themes[] = {theme_label(Theme::Day), theme_label(Theme::Night),
                          theme_label(Theme::Projection)};
  int theme_index = static_cast<int>(state.settings.theme);
  if (choice_row(state.display, "theme", themes, 3, &theme_index)) {
    state.settings.theme = static_cast<Theme>(theme_index);
    state.built_font_scale = 0.0f;  // fonts and style are rebuilt before the next frame
  }
  if (state.settings.theme == Theme::Night &&
      toggle_row(state.display, "night-brightness", "Night: normal", "Night: dim", &state.settings.night_dim)) {
    state.built_font_scale = 0.0f;
  }

  ImGui::Separator();
  ImGui::TextDisabled("Firn %s (%.*s)%s%s", FIRN_VERSION, static_cast<int>(platform.name().size()),
                      platform.name().data(), FIRN_BUILD_LABEL[0] ? " · " : "", FIRN_BUILD_LABEL);
  caution_line(state);
}

}  // namespace firn::ui
