// [SECTION] Fonts  [SECTION] Frame layout and navigation
#include "ui/app.hpp"

#include <imgui.h>

#include <cmath>

#include "assets.hpp"
#include "model/cautions.hpp"
#include "ui/panels.hpp"
#include "ui/test_hook.hpp"
#include "ui/theme.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

// [SECTION] Fonts

namespace {
constexpr float kBaseFontPx = 18.0f;  // 1 em at pixel ratio 1, day theme
constexpr float kLargeFontEm = 1.9f;  // results

const ImWchar* glyph_ranges() {
  // Latin-1 + Latin Extended-A, Greek (µ), punctuation, sub/superscripts, arrows, ≈ ≤ ≥, ▲▼.
  static const ImWchar ranges[] = {0x0020, 0x017F, 0x0391, 0x03C9, 0x2013, 0x2030,
                                   0x2070, 0x209F, 0x2190, 0x2195, 0x2212, 0x2212,
                                   0x2248, 0x2248, 0x2260, 0x2265, 0x25B2, 0x25BC, 0};
  return ranges;
}

ImFont* add_font(std::span<const unsigned char> bytes, float size_px) {
  ImFontConfig config;
  config.FontDataOwnedByAtlas = false;  // the bytes are static data in firn_assets
  config.OversampleH = 2;
  return ImGui::GetIO().Fonts->AddFontFromMemoryTTF(const_cast<unsigned char*>(bytes.data()),
                                                    static_cast<int>(bytes.size()), size_px,
                                                    &config, glyph_ranges());
}
}  // namespace

bool update_fonts(AppState& state) {
  float scale = state.pixel_ratio * theme_text_scale(state.settings.theme);
  if (std::fabs(scale - state.built_font_scale) < 0.01f) return false;
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  add_font(assets::ui_font_regular(), std::round(kBaseFontPx * scale));
  state.font_large = add_font(assets::ui_font_bold(), std::round(kBaseFontPx * kLargeFontEm * scale));
  io.Fonts->Build();
  state.built_font_scale = scale;
  apply_theme(state.settings.theme, state.pixel_ratio);
  return true;
}

void init_app(AppState& state, Platform& platform) {
  (void)platform;
  ImGuiIO& io = ImGui::GetIO();
  io.IniFilename = nullptr;  // layout is computed, never saved
  io.ConfigInputTextCursorBlink = false;  // a blinking cursor would force frames while idle
  state.built_font_scale = 0.0f;
  apply_theme(state.settings.theme, state.pixel_ratio);
}

bool wants_continuous_frames(const AppState&) { return false; }

// [SECTION] Frame layout and navigation

namespace {

void draw_top_bar(AppState& state) {
  if (state.font_large) ImGui::PushFont(state.font_large);
  ImGui::TextUnformatted("Firn");
  if (state.font_large) ImGui::PopFont();
  ImGui::SameLine();
  ImGui::TextDisabled("altitude & oxygen");
  const char* screens[] = {"Here", "Settings"};
  int selected = static_cast<int>(state.screen);
  if (choice_row(state, "screens", screens, 2, &selected)) {
    state.screen = static_cast<Screen>(selected);
  }
  ImGui::Separator();
}

}  // namespace

void draw_frame(AppState& state, Platform& platform, float width, float height) {
  ++state.frames_drawn;
  test_hook::begin_frame();
  ImGui::SetNextWindowPos(ImVec2(0, 0));
  ImGui::SetNextWindowSize(ImVec2(width, height));
  ImGui::Begin("Firn", nullptr,
               ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove |
                   ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_NoBringToFrontOnFocus);
  draw_top_bar(state);
  switch (state.screen) {
    case Screen::Here: draw_here_panel(state, platform); break;
    case Screen::Settings: draw_settings_panel(state, platform); break;
  }
  ImGui::End();
#if FIRN_TEST_HOOKS
  platform.publish_test_items(test_hook::frame_json());
#endif
}

}  // namespace firn::ui
