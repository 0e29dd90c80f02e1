// Everything the UI remembers, as plain structs passed into the panels (no function-local
// statics). Settings persist across restarts; AppState is this run's working state.
#pragma once

#include <string>

#include "model/atmosphere.hpp"
#include "model/units.hpp"

struct ImFont;

namespace firn::ui {

enum class Theme { Day, Night, Projection };

enum class Screen { Here, Settings };

// Units a user reads and types in. Values are stored as typed quantities (SI inside), so
// switching units never rounds an entered value away.
struct UnitChoice {
  enum class Altitude { Metres, Feet } altitude = Altitude::Metres;
  enum class Pressure { Hectopascals, Millimetres, Kilopascals, InchesHg } pressure =
      Pressure::Hectopascals;
  enum class CylinderPressure { Bar, Psi } cylinder = CylinderPressure::Bar;
  enum class Temperature { Celsius, Fahrenheit } temperature = Temperature::Celsius;
};

struct Settings {
  Theme theme = Theme::Day;
  UnitChoice units;
  atmosphere::Model model = atmosphere::default_medical_model;
};

// Where we are: entered once, read by every calculator.
struct Situation {
  units::Length altitude = units::metres(3000.0);
};

// Text being edited in a numeric field, and which field it belongs to.
struct FieldEdit {
  std::string field_id;
  std::string text;
};

struct AppState {
  Settings settings;
  Situation situation;
  Screen screen = Screen::Here;
  FieldEdit edit;
  std::string status_message;  // last input error shown under the field, empty when none

  // Display: framebuffer pixels per CSS/logical pixel, and the scale the fonts were built for.
  float pixel_ratio = 1.0f;
  float built_font_scale = 0.0f;
  ImFont* font_large = nullptr;  // results; owned by ImGui's font atlas

  int frames_drawn = 0;  // counted by draw_frame; tests read it to check idle frames
};

}  // namespace firn::ui
