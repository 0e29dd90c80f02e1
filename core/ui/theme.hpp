// Day (high contrast for sunlight), night (red on black, keeps dark adaptation) and projection
// (large type for a training room). Colours and text sizes only; layout is in em units.
#pragma once

#include <imgui.h>

#include "ui/app_state.hpp"

namespace firn::ui {

struct Palette {
  ImVec4 background, text, text_dim, accent, warning, danger, surface, surface_active, border;
};

const Palette& palette(Theme theme);
float theme_text_scale(Theme theme);  // 1.0 day/night, 1.6 projection
void apply_theme(Theme theme, float pixel_ratio);
const char* theme_label(Theme theme);

}  // namespace firn::ui
