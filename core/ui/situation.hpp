// The situation as the models need it: barometric pressure from whichever source the user
// chose, and a one-line summary every screen shows at its top (tap it to change the situation).
#pragma once

#include <string>

#include "model/result.hpp"
#include "model/units.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

// PB here: from the altitude (chosen model), the station barometer, or QNH (+ temperature).
Result<units::Pressure> situation_pressure(const AppState& state);
// Altitude implied by PB with the chosen model (for a barometer reading), or the entered one.
Result<units::Length> situation_altitude(const AppState& state);

// "3000 m · 701 hPa (West 1996) · SpO2 88 % · acute · air"
std::string situation_summary(const AppState& state);

// The summary as a full-width button; tapping it opens the Here screen.
void draw_situation_strip(AppState& state);

}  // namespace firn::ui
