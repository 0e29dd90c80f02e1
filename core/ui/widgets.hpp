// Firn's widgets on top of ImGui: sized in em units (multiples of the current font size), every
// one recorded by the test hook under its visible label.
#pragma once

#include <imgui.h>

#include <optional>
#include <string>
#include <string_view>

#include "model/result.hpp"
#include "ui/app_state.hpp"
#include "ui/theme.hpp"

namespace firn::ui {

// Current font size in framebuffer pixels: the em of our layout.
float em();
// The minimum touch target: 48 CSS px at any device pixel ratio (≥ 9 mm on phones).
float touch_target(const DisplayMetrics& display);

// [Taps and scrolls] A press is a tap while it stays within tap_slop() of where it began; beyond
// that it is a scroll, and nothing fires when the finger lifts (a thumb dragging the page over
// a stepper must never step it). The slop is two thirds of the body em: 12 CSS px with our
// 18 px text, about 2 mm on a phone (~160 CSS px per inch) — more than a gloved tap wobbles,
// less than the shortest deliberate scroll. ImGui 1.86 has no input queue, so the travel is
// read from ImGui's own press tracking plus the position in the release frame.
float tap_slop();
// True while the current (or just released) left press has stayed within the tap slop.
bool press_is_tap();
// ImGui::Button that fires only for a tap. Every Firn button goes through it.
bool tap_button(const char* label, const ImVec2& size);
// Once a frame before any widget: a press that has moved more than the slop vertically has
// become a scroll; the item it started on (any button, a slider) lets go of it, so no panel
// can act on it. Returns true while the press scrolls (the page follows the finger).
bool press_scrolls(AppState& state);

// The font scale (0.7–1) at which `label` fits a button `width` wide, padding included.
float label_fit_scale(const char* label, float width);
// tap_button whose label is drawn smaller (down to 70 %) when it would not fit the given
// width, instead of being clipped ("Casualty" on a five-across phone bar). Not recorded.
bool fitted_button(const char* label, const ImVec2& size);

// A large button, at least one touch target high. Recorded by its label.
bool big_button(const DisplayMetrics& display, const char* label, float width = 0.0f);

// A row of mutually exclusive options; returns true when the choice changed.
bool choice_row(const DisplayMetrics& display, const char* id, const char* const* labels, int count,
                int* selected);

// A labelled result: name in small type, value large, unit after it. `shown` is what the test
// hook reads back ("701.2 hPa").
void result_value(const DisplayMetrics& display, const char* label, const std::string& shown,
                  bool emphasised = true);

// Two-option toggle shown as a choice row ("Acute" | "Acclimatised"). Returns true on change.
bool toggle_row(const DisplayMetrics& display, const char* id, const char* off_label, const char* on_label,
                bool* value);

// An integer with − / + ("Cylinders": 3). Recorded as label, "<label> -", "<label> +". With
// `entered`, a count nobody gave yet shows "not entered"; the first tap on either sets `low`.
bool int_stepper(const DisplayMetrics& display, const char* label, const char* id, int* value, int low,
                 int high, bool* entered = nullptr);

// How a verdict reads at a glance. Each tone has its own word, shape and colour so that "short"
// never looks like "enough", in every theme and without colour.
enum class Tone {
  Good,     // enough / within / bag safe: a filled circle
  Caution,  // below / extrapolated / check: a triangle
  Danger,   // short / flush more / well below: a filled square
  Neutral,  // no verdict (nothing entered, extrapolated band): an outlined circle
};
// The word a tone leads with ("OK", "CHECK", "DANGER", "NO VERDICT"), shown before the text.
const char* tone_word(Tone tone);
// A verdict line in large type: shape, word, then `text` wrapped. Recorded as "Verdict" with
// "<word>: <text>" so tests read the tone back.
void verdict_line(const DisplayMetrics& display, Tone tone, const std::string& text);

// Wrapped text; `warning` colours it as a caution.
void message_line(const std::string& text, bool warning = false);
// A bullet with wrapped text (ImGui::BulletText runs off a phone's edge). Not recorded.
void bullet_line(std::string_view text);
// Text wrapped at the content edge, a number kept on the line of its unit.
void wrapped_text(std::string_view text);
void dim_wrapped_text(std::string_view text);  // the same in the theme's dim colour
// Small dim heading above a group of widgets.
void heading(const char* text);

// The one-line caution every result screen carries, with a "Read more" that expands it.
void caution_line(AppState& state);
// A model's error as a dash result plus the message (never a silent number).
void result_error(const DisplayMetrics& display, const char* label, const std::string& message);

// Formats a finite value with `decimals`; non-finite values become "—" (never NaN on screen).
std::string shown_number(double value, int decimals);

}  // namespace firn::ui
