// [SECTION] Fonts  [SECTION] Frame layout and navigation
#include "ui/app.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <type_traits>

#include "assets.hpp"
#include "model/cautions.hpp"
#include "ui/panels.hpp"
#include "ui/fields.hpp"
#include "ui/keypad.hpp"
#include "ui/persistence.hpp"
#include "ui/route_store.hpp"
#include "ui/situation.hpp"
#include "ui/team_store.hpp"
#include "ui/test_hook.hpp"
#include "ui/theme.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

// [SECTION] Fonts

namespace {
constexpr float kBaseFontPx = 18.0f;  // 1 em at pixel ratio 1, day theme
constexpr float kLargeFontEm = 1.9f;  // results

// The characters each face carries are stated once, in assets/CMakeLists.txt: regular has
// Latin-1 and Latin Extended-A for names, Greek, sub/superscripts, arrows, ≈ ≤ ≥, ▲▼; bold (large
// results and typed values, computed text only) ASCII and the symbols results use, so its atlas
// is small and a phone starts sooner (docs/BENCHMARKS.md).
static_assert(std::is_same_v<ImWchar, std::uint16_t>, "ImGui glyph ranges are 16-bit here");

ImFont* add_font(std::span<const unsigned char> bytes, float size_px, const ImWchar* ranges,
                 float pixel_ratio) {
  ImFontConfig config;
  config.FontDataOwnedByAtlas = false;  // the bytes are static data in firn_assets
  // Horizontal oversampling sharpens small text on a 1:1 screen; at a pixel ratio of 2 or more
  // the glyphs are already large in pixels, and a third of the atlas builds and uploads faster.
  config.OversampleH = pixel_ratio >= 2.0f ? 1 : 2;
  return ImGui::GetIO().Fonts->AddFontFromMemoryTTF(const_cast<unsigned char*>(bytes.data()),
                                                    static_cast<int>(bytes.size()), size_px,
                                                    &config, ranges);
}
}  // namespace

bool update_fonts(AppState& state) {
  float scale = state.display.pixel_ratio * theme_text_scale(state.settings.theme);
  if (std::fabs(scale - state.built_font_scale) < 0.01f) return false;
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  // The atlas exactly as tall as its glyphs (not the next power of two: GL ES 3 and WebGL 2 take
  // any size), and no software mouse cursors (the system draws them): less to upload at start.
  io.Fonts->Flags |= ImFontAtlasFlags_NoPowerOfTwoHeight | ImFontAtlasFlags_NoMouseCursors;
  add_font(assets::ui_font_regular(), std::round(kBaseFontPx * scale), assets::ui_font_regular_ranges(),
           state.display.pixel_ratio);
  state.display.font_large = add_font(assets::ui_font_bold(), std::round(kBaseFontPx * kLargeFontEm * scale),
                                      assets::ui_font_bold_ranges(), state.display.pixel_ratio);
  io.Fonts->Build();
  state.built_font_scale = scale;
  apply_theme(state.settings.theme, state.display.pixel_ratio, state.settings.night_dim);
  return true;
}

void init_app(AppState& state, Platform& platform) {
  ImGuiIO& io = ImGui::GetIO();
  io.IniFilename = nullptr;  // layout is computed, never saved
  io.ConfigInputTextCursorBlink = false;  // a blinking cursor would force frames while idle
  load_state(state, platform);
  load_team_profile(state, platform);
  load_record(state.record.store, platform);
  state.record.loaded = true;
  // The incident in progress first, not the last screen of the session before (issue 16).
  if (incident_in_progress(state.record.store, clock_now())) state.screen = Screen::Record;
  state.built_font_scale = 0.0f;
  apply_theme(state.settings.theme, state.display.pixel_ratio, state.settings.night_dim);
}

// [SECTION] Frame layout and navigation

namespace {

struct ScreenInfo {
  Screen screen;
  void (*draw)(AppState&, Platform&);
  Screen companion;  // shown beside it on a wide screen (itself: full width)
  const char* nav_label() const { return screen_name(screen).label; }
};

constexpr ScreenInfo kScreens[kScreenCount] = {
    {Screen::Here, draw_here_panel, Screen::Casualty},
    {Screen::Casualty, draw_casualty_panel, Screen::Curve},
    {Screen::Curve, draw_curve_panel, Screen::Casualty},
    {Screen::Bag, draw_bag_panel, Screen::Here},
    {Screen::Oxygen, draw_oxygen_panel, Screen::Casualty},
    {Screen::Route, draw_route_panel, Screen::Route},
    {Screen::Ams, draw_ams_panel, Screen::Casualty},
    {Screen::Record, draw_record_panel, Screen::Casualty},
    {Screen::Teaching, draw_teaching_panel, Screen::Teaching},
    {Screen::Team, draw_team_panel, Screen::Team},
    {Screen::Settings, draw_settings_panel, Screen::Here},
};

static_assert([] {
  for (int i = 0; i < kScreenCount; ++i) {
    if (static_cast<int>(kScreens[i].screen) != i) return false;
  }
  return true;
}(), "kScreens follows the order of Screen");

const ScreenInfo& info(Screen screen) { return kScreens[static_cast<int>(screen)]; }

// One row whenever all nine labels still read at 80 % of their size or more: a landscape phone
// (844 CSS px) gets one row, where the two-row bar took a third of its height. Two rows (5 + 4)
// on a phone held upright.
float nav_rows(float width) {
  const ImGuiStyle& style = ImGui::GetStyle();
  float button = (width - 2 * style.WindowPadding.x - style.ItemSpacing.x * (kScreenCount - 1)) / kScreenCount;
  for (const ScreenInfo& screen : kScreens) {
    float needed = ImGui::CalcTextSize(screen.nav_label()).x + 0.2f * em();  // the bar's padding
    if (0.8f * needed > button) return 2;
  }
  return 1;
}

float nav_height(const AppState& state, float width) {
  float row = std::max(touch_target(state.display) * 1.1f, ImGui::GetFrameHeight() * 1.2f);
  return nav_rows(width) * (row + ImGui::GetStyle().ItemSpacing.y);
}

// Bottom bar: where a thumb reaches on a phone held upright. Two rows (5 + 4) on a phone.
void draw_nav_bar(AppState& state, float width) {
  int per_row = nav_rows(width) == 1 ? kScreenCount : (kScreenCount + 1) / 2;
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float button_width = (ImGui::GetContentRegionAvail().x - spacing * (per_row - 1)) / per_row;
  float row = std::max(touch_target(state.display) * 1.1f, ImGui::GetFrameHeight() * 1.2f);
  ImGui::PushID("nav");
  // Five to a row on a phone: the labels need the button's whole width, not its padding.
  ImGui::PushStyleVar(ImGuiStyleVar_FramePadding,
                      ImVec2(0.1f * em(), ImGui::GetStyle().FramePadding.y));
  // One label size for the whole bar, the size at which the longest label fits.
  float scale = 1.0f;
  for (int i = 0; i < kScreenCount; ++i) {
    scale = std::min(scale, label_fit_scale(kScreens[i].nav_label(), button_width));
  }
  if (scale < 1.0f) ImGui::SetWindowFontScale(scale);
  for (int i = 0; i < kScreenCount; ++i) {
    if (i % per_row != 0) ImGui::SameLine();
    bool active = state.screen == kScreens[i].screen ||
                  (state.wide_layout && info(state.screen).companion == kScreens[i].screen);
    bool current = state.screen == kScreens[i].screen;
    if (active) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_Header));
    if (current) ImGui::PushStyleColor(ImGuiCol_Border, ImGui::GetStyleColorVec4(ImGuiCol_CheckMark));
    if (current) ImGui::PushStyleVar(ImGuiStyleVar_FrameBorderSize, 2.0f * state.display.pixel_ratio);
    if (tap_button(kScreens[i].nav_label(), ImVec2(button_width, row))) {
      state.screen = kScreens[i].screen;
      ImGui::SetScrollY(0.0f);
    }
    if (current) ImGui::PopStyleVar();
    if (current) ImGui::PopStyleColor();
    if (active) ImGui::PopStyleColor();
    test_hook::item_text(kScreens[i].nav_label(), current ? "selected" : "");
  }
  if (scale < 1.0f) ImGui::SetWindowFontScale(1.0f);
  ImGui::PopStyleVar();
  ImGui::PopID();
}

// ImGui scrolls with the wheel and the scrollbar only; a thumb drags the page. The page moves
// exactly when the press has become a scroll (press_scrolls, beyond the tap slop), the same
// moment the control under the thumb lets go: a move is a tap or a scroll, never both.
void drag_to_scroll(const AppState& state) {
  ImGuiIO& io = ImGui::GetIO();
  if (state.press_scrolling && io.MouseDown[0] &&
      ImGui::IsWindowHovered(ImGuiHoveredFlags_AllowWhenBlockedByActiveItem) && io.MouseDelta.y != 0.0f) {
    ImGui::SetScrollY(ImGui::GetScrollY() - io.MouseDelta.y);
  }
}

void draw_column(AppState& state, Platform& platform, Screen screen, const char* id, float width,
                 float height) {
  ImGui::BeginChild(id, ImVec2(width, height), false, ImGuiWindowFlags_NoSavedSettings);
  if (screen != Screen::Here && screen != Screen::Teaching && screen != Screen::Settings &&
      screen != Screen::Team) {
    draw_situation_strip(state);
  }
  info(screen).draw(state, platform);
  ImGui::Dummy(ImVec2(0, em()));  // the last widget never sits flush on the nav bar
  drag_to_scroll(state);
  ImGui::EndChild();
}

void draw_status(AppState& state) {
  if (state.status_message.empty()) return;
  message_line(state.status_message, true);
  if (big_button(state.display, "Dismiss")) state.status_message.clear();
}

}  // namespace

void draw_frame(AppState& state, Platform& platform, float width, float height) {
  ++state.frames_drawn;
  state.wake_after_seconds = 0.0;  // a screen with a running timer sets it again this frame
  state.display.colours = &palette(state.settings.theme, state.settings.night_dim);
  test_hook::begin_frame();
  // The keypad is drawn first (it stays on top: it takes the focus) so that the value OK
  // commits reaches its field in the same frame.
  Keypad& keypad = state.keypad;
  draw_keypad(state, width, height);
  bool modal = keypad.open && !keypad.committed;
  press_scrolls(state);  // before any widget: a scroll lets go of what it started on

  ImGui::SetNextWindowPos(ImVec2(0, 0));
  ImGui::SetNextWindowSize(ImVec2(width, height));
  ImGui::Begin("Firn", nullptr,
               ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove |
                   ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_NoBringToFrontOnFocus |
                   ImGuiWindowFlags_NoScrollbar | ImGuiWindowFlags_NoScrollWithMouse);
  // While the keypad is up the page behind it must not take taps meant for a key.
  ImGui::BeginDisabled(modal);
  draw_status(state);
  state.wide_layout = width > 60.0f * em();
  float content_height = ImGui::GetContentRegionAvail().y - nav_height(state, width);
  Screen companion = info(state.screen).companion;
  if (state.wide_layout && companion != state.screen) {
    float spacing = ImGui::GetStyle().ItemSpacing.x * 2;
    float column = (ImGui::GetContentRegionAvail().x - spacing) * 0.5f;
    draw_column(state, platform, state.screen, "primary", column, content_height);
    ImGui::SameLine(0, spacing);
    draw_column(state, platform, companion, "companion", column, content_height);
  } else {
    draw_column(state, platform, state.screen, "primary", 0, content_height);
  }
  draw_nav_bar(state, width);
  ImGui::EndDisabled();
  ImGui::End();
  if (keypad.committed) keypad = Keypad{};  // its field is not on screen: nothing changes

  // Save once a gesture is over, not on every frame of a drag.
  if (!ImGui::IsMouseDown(ImGuiMouseButton_Left)) {
    save_state_if_changed(state, platform);
    save_route_if_changed(state.route, platform);
  }
#if FIRN_TEST_HOOKS
  platform.publish_test_items();
#endif
}

}  // namespace firn::ui
