// Day (high contrast for sunlight), night (red on black, keeps dark adaptation) and projection
// (large type for a training room). Colours and text sizes only; layout is in em units.
#pragma once

#include <imgui.h>

#include <array>
#include <string_view>

namespace firn::ui {

enum class Theme { Day, Night, Projection };
// Each theme's key in saved state and --theme, in the enum's order (labels: theme_label).
inline constexpr std::array<std::string_view, 3> kThemeKeys{"day", "night", "projector"};

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

// What a widget reads of the display, never the whole app state: the device pixel ratio (touch
// targets, line widths), the large face (results, typed values) and the theme's colours.
// draw_frame refreshes the colours every frame; update_fonts sets the face.
struct DisplayMetrics {
  float pixel_ratio = 1.0f;  // framebuffer pixels per CSS/logical pixel
  ImFont* font_large = nullptr;  // owned by ImGui's font atlas; nullptr: the body face
  const Palette* colours = &palette(Theme::Day);
};

}  // namespace firn::ui
