// Day (high contrast for sunlight), night (red on black, keeps dark adaptation) and projection
// (large type for a training room). Colours and text sizes only; layout is in em units.
#pragma once

#include <imgui.h>

#include "ui/app_state.hpp"

namespace firn::ui {

struct Palette {
  ImVec4 background, text, text_dim, accent, warning, danger, surface, surface_active, border;
  // Verdict "OK". At night every colour is red, so the tones differ by lightness (danger is
  // drawn as a bright block with dark text, caution in the lightest red, good mid, no verdict
  // dim) and by shape; by day and on the projector they differ by hue as well.
  ImVec4 good;
};

// `night_dim`: the night theme at about half the luminance, for eyes adapted to the dark; the
// tones keep their order and separation. Ignored by day and projector.
const Palette& palette(Theme theme, bool night_dim = false);
float theme_text_scale(Theme theme);  // 1.0 day/night, 1.6 projection
void apply_theme(Theme theme, float pixel_ratio, bool night_dim = false);
const char* theme_label(Theme theme);

}  // namespace firn::ui
