// Number entry for gloved thumbs: a field shows its value as a large button flanked by − / +
// steppers; tapping it opens the in-app keypad (digits, ., −, backspace, unit toggles, OK /
// Cancel). The canvas cannot summon a phone keyboard; on desktop the keyboard types into the
// keypad too (digits, Backspace, Enter, Escape).
#pragma once

#include <string>
#include <vector>

#include "ui/app_state.hpp"

namespace firn::ui {

struct FieldSpec {
  const char* label;   // visible, and the test-hook name of the value button
  const char* id;      // unique per field; keys the keypad and field_errors
  std::string shown;   // on the button, with unit ("3000 m")
  std::string edit_text;  // what the keypad starts with (number only, full precision)
  std::vector<std::string> unit_symbols;  // unit toggles on the keypad; first row
  int unit_index = 0;
  std::string hint;      // valid range in the current unit
  bool steppers = true;  // − / + beside the value, recorded as "<label> -" / "<label> +"
  bool allow_negative = true;  // keypad shows the − key
  bool allow_decimal = true;   // keypad shows the . key
  bool empty = false;    // nothing entered yet: `shown` is a prompt, no steppers
  std::string note;      // small line under the value ("entered 14:05")
};

struct FieldEvent {
  enum class Kind { None, Commit, Minus, Plus } kind = Kind::None;
  std::string text;    // typed number (Commit)
  int unit_index = 0;  // unit toggled on the keypad (Commit)
  bool confirmed = false;  // the user answered the keypad's question with OK (Commit)
};

// Draws the field; returns what the user did to it this frame. Errors in
// state.field_errors[spec.id] are shown under it.
FieldEvent keypad_field(AppState& state, const FieldSpec& spec);

// Opens the keypad again on the typed text with a question above it; OK then commits with
// `confirmed` set, any key goes back to editing.
void ask_on_keypad(AppState& state, const FieldSpec& spec, const FieldEvent& event,
                   std::string question);

// Draws the keypad over the bottom of the screen when open. Call after the panels.
void draw_keypad(AppState& state, float width, float height);

}  // namespace firn::ui
