// One function per screen; each lives in its own panel_*.cpp file.
#pragma once

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

void draw_here_panel(AppState& state, Platform& platform);
void draw_settings_panel(AppState& state, Platform& platform);

}  // namespace firn::ui
