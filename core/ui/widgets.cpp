#include "ui/widgets.hpp"

#include <imgui_internal.h>  // ClearActiveID: a press that became a scroll lets go of its item

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>

#include "model/cautions.hpp"
#include "ui/test_hook.hpp"
#include "ui/theme.hpp"

namespace firn::ui {

// Wrapped text in which a number never ends a line apart from its unit ("150 L", "91 %",
// "2 h"): the space between them is drawn as a no-break space (U+00A0, in the fonts' ranges),
// which ImGui's word wrap does not break at. Test hooks keep the text as given.
void wrapped_text(std::string_view text) {
  std::string drawn;
  drawn.reserve(text.size() + 8);
  for (size_t i = 0; i < text.size(); ++i) {
    auto c = static_cast<unsigned char>(text[i]);
    bool glue = c == ' ' && i > 0 && i + 1 < text.size() &&
                std::isdigit(static_cast<unsigned char>(text[i - 1])) &&
                (std::isalpha(static_cast<unsigned char>(text[i + 1])) || text[i + 1] == '%' ||
                 static_cast<unsigned char>(text[i + 1]) >= 0x80);  // °C, µg, …
    if (glue) drawn += "\xC2\xA0";
    else drawn += text[i];
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextUnformatted(drawn.data(), drawn.data() + drawn.size());
  ImGui::PopTextWrapPos();
}

void dim_wrapped_text(std::string_view text) {
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::GetStyleColorVec4(ImGuiCol_TextDisabled));
  wrapped_text(text);
  ImGui::PopStyleColor();
}

float em() { return ImGui::GetFontSize(); }

float touch_target(const DisplayMetrics& display) { return 48.0f * display.pixel_ratio; }

std::string shown_number(double value, int decimals) {
  if (!std::isfinite(value)) return "\xE2\x80\x94";  // em dash
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
  std::string text(buffer);
  if (text == "-0" || text.rfind("-0.", 0) == 0) {
    bool all_zero = text.find_first_not_of("-0.") == std::string::npos;
    if (all_zero) text.erase(0, 1);
  }
  return text;
}

float tap_slop() {
  const ImGuiIO& io = ImGui::GetIO();
  // The body font is the first in the atlas; the large one must not widen the slop.
  float body_em = io.Fonts->Fonts.empty() ? ImGui::GetFontSize() : io.Fonts->Fonts[0]->FontSize;
  return body_em * (2.0f / 3.0f);
}

bool press_is_tap() {
  const ImGuiIO& io = ImGui::GetIO();
  // MouseDragMaxDistanceSqr covers the frames the button was down; the release frame's
  // position is not in it, so a last move that arrives with the release is added here.
  float travel_sq = io.MouseDragMaxDistanceSqr[0];
  if (ImGui::IsMousePosValid(&io.MousePos) && ImGui::IsMousePosValid(&io.MouseClickedPos[0])) {
    float dx = io.MousePos.x - io.MouseClickedPos[0].x;
    float dy = io.MousePos.y - io.MouseClickedPos[0].y;
    travel_sq = std::max(travel_sq, dx * dx + dy * dy);
  }
  return travel_sq <= tap_slop() * tap_slop();
}

bool tap_button(const char* label, const ImVec2& size) {
  bool released_on_it = ImGui::Button(label, size);
  return released_on_it && press_is_tap();
}

namespace {
// A mouse dragging a scrollbar scrolls by itself: that press is left alone.
bool scrollbar_held() {
  const ImGuiContext& g = *ImGui::GetCurrentContext();
  return g.ActiveId != 0 && g.ActiveIdWindow != nullptr &&
         g.ActiveId == ImGui::GetWindowScrollbarID(g.ActiveIdWindow, ImGuiAxis_Y);
}
}  // namespace

bool press_scrolls(AppState& state) {
  const ImGuiIO& io = ImGui::GetIO();
  if (io.MouseClicked[0]) state.press_scrolling = false;
  bool pressing = io.MouseDown[0] || io.MouseReleased[0];
  if (pressing && !state.press_scrolling && !scrollbar_held() && ImGui::IsMousePosValid(&io.MousePos) &&
      std::fabs(io.MousePos.y - io.MouseClickedPos[0].y) > tap_slop()) {
    state.press_scrolling = true;
  }
  if (!pressing) state.press_scrolling = false;
  if (state.press_scrolling && ImGui::GetActiveID() != 0) ImGui::ClearActiveID();
  return state.press_scrolling && io.MouseDown[0];
}

float label_fit_scale(const char* label, float width) {
  constexpr float kSmallestScale = 0.7f;
  float available = width - 2.0f * ImGui::GetStyle().FramePadding.x;
  float needed = ImGui::CalcTextSize(label, nullptr, true).x;
  if (width <= 0.0f || needed <= available || needed <= 0.0f) return 1.0f;
  return std::max(kSmallestScale, available / needed);
}

bool fitted_button(const char* label, const ImVec2& size) {
  float scale = label_fit_scale(label, size.x);
  // Firn never scales a window's font otherwise, so 1 is the scale to return to.
  if (scale < 1.0f) ImGui::SetWindowFontScale(scale);
  bool pressed = tap_button(label, size);
  if (scale < 1.0f) ImGui::SetWindowFontScale(1.0f);
  return pressed;
}

bool big_button(const DisplayMetrics& display, const char* label, float width) {
  float height = std::max(touch_target(display), ImGui::GetFrameHeight());
  bool pressed = fitted_button(label, ImVec2(width, height));
  test_hook::item(label);
  return pressed;
}

bool choice_row(const DisplayMetrics& display, const char* id, const char* const* labels, int count,
                int* selected) {
  bool changed = false;
  ImGui::PushID(id);
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float width = (ImGui::GetContentRegionAvail().x - spacing * (count - 1)) / count;
  for (int i = 0; i < count; ++i) {
    if (i > 0) ImGui::SameLine();
    bool active = *selected == i;
    if (active) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_Header));
    if (active) ImGui::PushStyleColor(ImGuiCol_Border, ImGui::GetStyleColorVec4(ImGuiCol_CheckMark));
    float height = std::max(touch_target(display), ImGui::GetFrameHeight());
    if (fitted_button(labels[i], ImVec2(width, height)) && !active) {
      *selected = i;
      changed = true;
    }
    test_hook::item_text(labels[i], active ? "selected" : "");
    if (active) ImGui::PopStyleColor(2);
  }
  ImGui::PopID();
  return changed;
}

void result_value(const DisplayMetrics& display, const char* label, const std::string& shown,
                  bool emphasised) {
  if (!emphasised) {
    // Secondary results on one line: the large ones stay above the fold on a phone.
    // Label and value share a line when they fit; otherwise the value wraps on its own line
    // (a long cascade or a range must never run off the right edge of a phone).
    dim_wrapped_text(label);  // a long label wraps on a 360 px phone, never clipped
    float needed = ImGui::CalcTextSize(shown.c_str()).x + ImGui::GetStyle().ItemSpacing.x;
    // The edge of the column it is in (a table cell on the wide Teaching screen), not the
    // window's: measured against the window, a 900 px Teaching screen broke "mmHg" in two.
    if (ImGui::GetItemRectMax().x + needed <= ImGui::GetWindowPos().x + ImGui::GetContentRegionMax().x) {
      ImGui::SameLine();
    }
    wrapped_text(shown);
    test_hook::item_text(label, shown);
    return;
  }
  dim_wrapped_text(label);  // a long label wraps on a 360 px phone, never clipped
  bool large = display.font_large != nullptr;
  if (large) ImGui::PushFont(display.font_large);
  // Wrapped: a long verdict in large type must not run off the right edge of a phone.
  wrapped_text(shown);
  if (large) ImGui::PopFont();
  test_hook::item_text(label, shown);
}

bool toggle_row(const DisplayMetrics& display, const char* id, const char* off_label, const char* on_label,
                bool* value) {
  const char* labels[] = {off_label, on_label};
  int selected = *value ? 1 : 0;
  if (!choice_row(display, id, labels, 2, &selected)) return false;
  *value = selected == 1;
  return true;
}

bool int_stepper(const DisplayMetrics& display, const char* label, const char* id, int* value, int low,
                 int high, bool* entered) {
  ImGui::TextDisabled("%s", label);
  ImGui::PushID(id);
  float height = std::max(touch_target(display), ImGui::GetFrameHeight());
  float width = std::max(height, 2.5f * em());
  int before = *value;
  bool empty = entered != nullptr && !*entered;
  auto first_tap = [&] {
    *value = low;
    *entered = true;
  };
  if (tap_button("\xE2\x88\x92", ImVec2(width, height))) {
    if (empty) first_tap();
    else if (*value > low) --*value;
  }
  test_hook::item(std::string(label) + " -");
  ImGui::SameLine();
  std::string shown = empty ? std::string("not entered") : std::to_string(*value);
  if (display.font_large) ImGui::PushFont(display.font_large);
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(shown.c_str());
  if (display.font_large) ImGui::PopFont();
  test_hook::item_text(label, shown);
  ImGui::SameLine();
  if (tap_button("+", ImVec2(width, height))) {
    if (empty) first_tap();
    else if (*value < high) ++*value;
  }
  test_hook::item(std::string(label) + " +");
  ImGui::PopID();
  return *value != before || (empty && *entered);
}

void message_line(const std::string& text, bool warning) {
  if (warning) ImGui::PushStyleColor(ImGuiCol_Text, ImGui::GetStyleColorVec4(ImGuiCol_PlotHistogram));
  wrapped_text(text);
  if (warning) ImGui::PopStyleColor();
  test_hook::item_text(warning ? "Warning" : "Message", text);
}

const char* tone_word(Tone tone) {
  switch (tone) {
    case Tone::Good: return "OK";
    case Tone::Caution: return "CHECK";
    case Tone::Danger: return "DANGER";
    case Tone::Neutral: return "NO VERDICT";
  }
  return "";
}

namespace {
ImVec4 tone_colour(const Palette& p, Tone tone) {
  switch (tone) {
    case Tone::Good: return p.good;
    case Tone::Caution: return p.warning;
    case Tone::Danger: return p.danger;
    case Tone::Neutral: return p.text_dim;
  }
  return p.text;
}

// The tone's shape, one em square, drawn where the cursor is, with a mark cut into the filled
// ones (✓ in the circle, ! in the triangle, × in the square) so it reads without colour.
void tone_shape(Tone tone, ImU32 colour, ImU32 cut) {
  const float size = em();
  const ImVec2 p = ImGui::GetCursorScreenPos();
  const ImVec2 c(p.x + size * 0.5f, p.y + size * 0.5f);
  const float line = std::max(1.0f, size * 0.12f);
  ImDrawList* draw = ImGui::GetWindowDrawList();
  auto at = [&](float x, float y) { return ImVec2(p.x + size * x, p.y + size * y); };
  switch (tone) {
    case Tone::Good:
      draw->AddCircleFilled(c, size * 0.46f, colour);
      draw->AddLine(at(0.27f, 0.52f), at(0.44f, 0.69f), cut, line);
      draw->AddLine(at(0.44f, 0.69f), at(0.74f, 0.34f), cut, line);
      break;
    case Tone::Caution:
      draw->AddTriangleFilled(at(0.5f, 0.04f), at(0.98f, 0.94f), at(0.02f, 0.94f), colour);
      draw->AddLine(at(0.5f, 0.34f), at(0.5f, 0.64f), cut, line);
      draw->AddCircleFilled(at(0.5f, 0.79f), line * 0.6f, cut);
      break;
    case Tone::Danger:
      draw->AddRectFilled(at(0.04f, 0.04f), at(0.96f, 0.96f), colour);
      draw->AddLine(at(0.28f, 0.28f), at(0.72f, 0.72f), cut, line);
      draw->AddLine(at(0.72f, 0.28f), at(0.28f, 0.72f), cut, line);
      break;
    case Tone::Neutral: draw->AddCircle(c, size * 0.4f, colour, 0, line); break;
  }
  ImGui::Dummy(ImVec2(size, size));
}

// The tone's word: a solid block (danger: the loudest thing on a screen), an outlined box
// (caution), or plain (good, no verdict) — four looks that need neither hue nor shape.
void tone_word_badge(Tone tone, ImU32 colour, ImU32 background) {
  const char* word = tone_word(tone);
  const ImVec2 text = ImGui::CalcTextSize(word);
  const ImVec2 pad(em() * 0.3f, 0.0f);
  const ImVec2 p = ImGui::GetCursorScreenPos();
  const ImVec2 q(p.x + text.x + 2 * pad.x, p.y + text.y);
  ImDrawList* draw = ImGui::GetWindowDrawList();
  const float rounding = em() * 0.15f;
  if (tone == Tone::Danger) draw->AddRectFilled(p, q, colour, rounding);
  if (tone == Tone::Caution) draw->AddRect(p, q, colour, rounding, 0, std::max(1.0f, em() * 0.1f));
  draw->AddText(ImVec2(p.x + pad.x, p.y), tone == Tone::Danger ? background : colour, word);
  ImGui::Dummy(ImVec2(q.x - p.x, q.y - p.y));
}
}  // namespace

void verdict_line(const DisplayMetrics& display, Tone tone, const std::string& text) {
  const Palette& p = *display.colours;
  const ImVec4 colour = tone_colour(p, tone);
  const ImU32 colour32 = ImGui::GetColorU32(colour);
  const ImU32 background32 = ImGui::GetColorU32(p.background);
  ImGui::BeginGroup();
  tone_shape(tone, colour32, background32);
  ImGui::SameLine();
  tone_word_badge(tone, colour32, background32);
  ImGui::SameLine();
  ImGui::PushStyleColor(ImGuiCol_Text, colour);
  wrapped_text(text);
  ImGui::PopStyleColor();
  ImGui::EndGroup();
  test_hook::item_text("Verdict", std::string(tone_word(tone)) + ": " + text);
}

void bullet_line(std::string_view text) {
  ImGui::Bullet();
  wrapped_text(text);
}

void heading(const char* text) {
  ImGui::Spacing();
  dim_wrapped_text(text);
}

void result_error(const DisplayMetrics& display, const char* label, const std::string& message) {
  result_value(display, label, "\xE2\x80\x94");
  message_line(message, true);
}

void caution_line(AppState& state) {
  ImGui::Separator();
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("%s", std::string(cautions::short_line).c_str());
  ImGui::PopTextWrapPos();
  test_hook::item_text("Cautions", std::string(cautions::short_line));
  // A full-height button, not a tree arrow: a gloved thumb must be able to hit it.
  if (big_button(state.display, state.caution_open ? "Read less" : "Read more")) {
    state.caution_open = !state.caution_open;
  }
  if (state.caution_open) {
    for (std::string_view line : cautions::full_text) bullet_line(line);
  }
}

}  // namespace firn::ui
