// One function per screen; each lives in its own panel_*.cpp file.
#pragma once

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

void draw_here_panel(AppState& state, Platform& platform);      // pressure & oxygen here
void draw_casualty_panel(AppState& state, Platform& platform);  // SpO2 vs expected
void draw_curve_panel(AppState& state, Platform& platform);     // dissociation curve
void draw_bag_panel(AppState& state, Platform& platform);       // hyperbaric bag
void draw_oxygen_panel(AppState& state, Platform& platform);    // cylinder, evacuation plan
void draw_route_panel(AppState& state, Platform& platform);     // oxygen along the route
void draw_ams_panel(AppState& state, Platform& platform);       // Lake Louise 2018
void draw_record_panel(AppState& state, Platform& platform);    // casualty record, handover
void draw_teaching_panel(AppState& state, Platform& platform);  // cascade sweep
void draw_team_panel(AppState& state, Platform& platform);      // team profile, pocket card
void draw_settings_panel(AppState& state, Platform& platform);  // units, theme

}  // namespace firn::ui
