#include "ui/keypad.hpp"

#include <imgui.h>

#include <algorithm>

#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

// The − sign as typed: ASCII, so parse_number reads it.
constexpr char kMinus = '-';

void open_keypad(AppState& state, const FieldSpec& spec) {
  Keypad& k = state.keypad;
  k.open = true;
  k.field_id = spec.id;
  k.label = spec.label;
  k.hint = spec.hint;
  k.text = spec.edit_text;
  k.fresh = true;
  k.unit_symbols = spec.unit_symbols;
  k.unit_index = spec.unit_index;
  k.committed = false;
  k.allow_negative = spec.allow_negative;
  k.allow_decimal = spec.allow_decimal;
  k.question.clear();
  k.confirmed = false;
  // Opening the field again is fixing what the message was about: it goes.
  state.field_errors.erase(spec.id);
}

// Keys the keypad does not show can still come from a keyboard: typed, never dropped, so "5.2"
// is refused or taken as typed, not silently read as 52.
void type_char(Keypad& k, char c, bool from_keyboard = false) {
  if (!from_keyboard && c == kMinus && !k.allow_negative) return;
  if (!from_keyboard && c == '.' && !k.allow_decimal) return;
  k.question.clear();  // typing answers the question: back to editing
  if (k.fresh) {
    k.text.clear();
    k.fresh = false;
  }
  if (c == kMinus) {
    // Toggles the sign wherever it is pressed: a thumb should not need to press it first.
    if (!k.text.empty() && k.text[0] == kMinus) k.text.erase(0, 1);
    else k.text.insert(k.text.begin(), kMinus);
    return;
  }
  // A second '.' is kept, not dropped: "1.2.3" is refused on OK, never silently read as 1.23.
  if (k.text.size() >= 12) return;  // no physical quantity here needs more digits
  k.text += c;
}

void backspace(Keypad& k) {
  k.question.clear();
  // The shown value starts "selected": the first backspace clears it, like a selected field.
  if (k.fresh) k.text.clear();
  k.fresh = false;
  if (!k.text.empty()) k.text.pop_back();
}

void close_keypad(AppState& state, bool commit) {
  // OK on the untouched value changes nothing: the shown text is rounded to the field's
  // precision and must not replace the exact value behind it.
  if (commit && state.keypad.fresh && state.keypad.question.empty()) commit = false;
  state.keypad.open = !commit ? false : state.keypad.open;
  if (commit) {
    state.keypad.confirmed = !state.keypad.question.empty();
    state.keypad.committed = true;  // its field, drawn after the keypad, takes it this frame
  }
}

// Desktop: the keyboard types into the keypad.
void keyboard_into_keypad(AppState& state) {
  ImGuiIO& io = ImGui::GetIO();
  for (ImWchar c : io.InputQueueCharacters) {
    if ((c >= '0' && c <= '9') || c == '.' || c == '-') type_char(state.keypad, static_cast<char>(c), true);
    if (c == ',') type_char(state.keypad, '.', true);
  }
  io.InputQueueCharacters.resize(0);
  if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Backspace))) backspace(state.keypad);
  if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Enter), false) ||
      ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_KeyPadEnter), false)) {
    close_keypad(state, true);
  }
  if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape), false)) close_keypad(state, false);
}

bool key(const AppState& state, const char* shown, const char* test_label, float width,
         float height, bool accent = false) {
  if (accent) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_Header));
  ImGui::PushID(test_label);
  bool pressed = fitted_button(shown, ImVec2(width, height));
  ImGui::PopID();
  if (accent) ImGui::PopStyleColor();
  test_hook::item(test_label);
  (void)state;
  return pressed;
}

}  // namespace

FieldEvent keypad_field(AppState& state, const FieldSpec& spec) {
  FieldEvent event;
  Keypad& k = state.keypad;
  if (k.committed && k.field_id == spec.id) {
    event.kind = FieldEvent::Kind::Commit;
    event.text = k.text;
    event.unit_index = k.unit_index;
    event.confirmed = k.confirmed;
    k = Keypad{};
  }

  ImGui::TextDisabled("%s", spec.label);
  ImGui::PushID(spec.id);
  float height = std::max(touch_target(state.display), ImGui::GetFrameHeight());
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  // An empty field has nothing to step from: the whole row is the prompt to enter it.
  bool steppers = spec.steppers && !spec.empty;
  float stepper_width = steppers ? std::max(height, 2.5f * em()) : 0.0f;
  float value_width = ImGui::GetContentRegionAvail().x - (steppers ? 2 * (stepper_width + spacing) : 0);
  if (steppers) {
    if (tap_button("\xE2\x88\x92", ImVec2(stepper_width, height))) event.kind = FieldEvent::Kind::Minus;
    test_hook::item(std::string(spec.label) + " -");
    ImGui::SameLine();
  }
  bool large = state.display.font_large && !spec.empty;
  if (large) ImGui::PushFont(state.display.font_large);
  // The large font makes the value readable at arm's length; the button keeps one touch target.
  bool editing = k.open && k.field_id == spec.id;
  if (editing) ImGui::PushStyleColor(ImGuiCol_Border, ImGui::GetStyleColorVec4(ImGuiCol_CheckMark));
  ImGui::PushStyleVar(ImGuiStyleVar_ButtonTextAlign, ImVec2(0.5f, 0.5f));
  if (tap_button(spec.shown.c_str(), ImVec2(value_width, std::max(height, ImGui::GetFrameHeight())))) {
    open_keypad(state, spec);
  }
  ImGui::PopStyleVar();
  if (editing) ImGui::PopStyleColor();
  if (large) ImGui::PopFont();
  test_hook::item_text(spec.label, spec.shown);
  if (steppers) {
    ImGui::SameLine();
    if (tap_button("+", ImVec2(stepper_width, height))) event.kind = FieldEvent::Kind::Plus;
    test_hook::item(std::string(spec.label) + " +");
  }
  ImGui::PopID();
  if (!spec.note.empty()) {
    ImGui::TextDisabled("%s", spec.note.c_str());
    test_hook::item_text(std::string(spec.label) + " note", spec.note);
  }
  auto error = state.field_errors.find(spec.id);
  if (error != state.field_errors.end()) message_line(error->second, true);
  return event;
}

void ask_on_keypad(AppState& state, const FieldSpec& spec, const FieldEvent& event,
                   std::string question) {
  open_keypad(state, spec);
  Keypad& k = state.keypad;
  k.text = event.text;
  k.unit_index = event.unit_index;
  k.fresh = false;  // the typed number stays; a key edits it
  k.question = std::move(question);
}

void draw_keypad(AppState& state, float width, float height) {
  Keypad& k = state.keypad;
  if (!k.open) return;
  // Tells the runner typing goes somewhere (the web page publishes it as firnWantsText);
  // ImGui recomputes it at the next NewFrame.
  ImGui::GetIO().WantTextInput = true;
  keyboard_into_keypad(state);
  if (!k.open || k.committed) return;

  const ImGuiStyle& style = ImGui::GetStyle();
  float key_height = std::max(touch_target(state.display) * 1.15f, ImGui::GetFrameHeight() * 1.3f);
  // Never wider than a hand: on a laptop the keypad stays phone-sized, centred.
  float pad_width = std::min(width, 26.0f * em());
  int unit_rows = k.unit_symbols.size() > 1 ? 1 : 0;
  float question_height =
      k.question.empty() ? 0.0f
                         : ImGui::CalcTextSize(k.question.c_str(), nullptr, false,
                                               pad_width - 2 * style.WindowPadding.x).y +
                               style.ItemSpacing.y;
  float pad_height = style.WindowPadding.y * 2 + em() * 2.4f + ImGui::GetTextLineHeightWithSpacing() * 2 +
                     question_height + (key_height + style.ItemSpacing.y) * (4 + unit_rows);
  ImGui::SetNextWindowPos(ImVec2((width - pad_width) * 0.5f, height - pad_height));
  ImGui::SetNextWindowSize(ImVec2(pad_width, pad_height));
  ImGui::SetNextWindowFocus();
  ImGui::PushStyleVar(ImGuiStyleVar_WindowBorderSize, 2.0f * state.display.pixel_ratio);
  ImGui::Begin("Keypad", nullptr,
               ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove |
                   ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_NoScrollWithMouse);
  ImGui::TextUnformatted(k.label.c_str());
  ImGui::SameLine();
  ImGui::TextDisabled("%s", k.hint.c_str());
  // The typed number, large, with its unit.
  std::string shown = (k.text.empty() ? std::string("\xE2\x80\x94") : k.text);
  if (!k.unit_symbols.empty()) shown += " " + k.unit_symbols[k.unit_index];
  if (state.display.font_large) ImGui::PushFont(state.display.font_large);
  ImGui::TextUnformatted(shown.c_str());
  if (state.display.font_large) ImGui::PopFont();
  test_hook::item_text("Keypad value", shown);
  if (!k.question.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::GetStyleColorVec4(ImGuiCol_PlotHistogram));
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextUnformatted(k.question.c_str());
    ImGui::PopTextWrapPos();
    ImGui::PopStyleColor();
    test_hook::item_text("Keypad question", k.question);
  }

  float spacing = style.ItemSpacing.x;
  float avail = ImGui::GetContentRegionAvail().x;
  if (unit_rows) {
    int count = static_cast<int>(k.unit_symbols.size());
    float w = (avail - spacing * (count - 1)) / count;
    for (int i = 0; i < count; ++i) {
      if (i > 0) ImGui::SameLine();
      std::string test_label = "Unit " + k.unit_symbols[i];
      if (key(state, k.unit_symbols[i].c_str(), test_label.c_str(), w, key_height, i == k.unit_index)) {
        k.unit_index = i;  // the typed digits keep their meaning in the new unit
      }
    }
  }
  float w = (avail - spacing * 3) / 4;
  // Digits in the large font: readable through a misted visor, and the key still one target.
  if (state.display.font_large) ImGui::PushFont(state.display.font_large);
  const char* rows[3][3] = {{"7", "8", "9"}, {"4", "5", "6"}, {"1", "2", "3"}};
  for (int r = 0; r < 3; ++r) {
    for (int c = 0; c < 3; ++c) {
      if (c > 0) ImGui::SameLine();
      std::string test_label = std::string("Key ") + rows[r][c];
      if (key(state, rows[r][c], test_label.c_str(), w, key_height)) type_char(k, rows[r][c][0]);
    }
    ImGui::SameLine();
    // − and . only where they mean something; their cell stays empty so the digits never move.
    if (r == 0 && key(state, "\xE2\x86\x90", "Key Backspace", w, key_height)) backspace(k);
    if (r == 1 && !k.allow_negative) ImGui::Dummy(ImVec2(w, key_height));
    if (r == 1 && k.allow_negative && key(state, "\xE2\x88\x92", "Key -", w, key_height)) type_char(k, kMinus);
    if (r == 2 && !k.allow_decimal) ImGui::Dummy(ImVec2(w, key_height));
    if (r == 2 && k.allow_decimal && key(state, ".", "Key .", w, key_height)) type_char(k, '.');
  }
  if (key(state, "Cancel", "Key Cancel", w, key_height)) close_keypad(state, false);
  ImGui::SameLine();
  if (key(state, "0", "Key 0", w, key_height)) type_char(k, '0');
  ImGui::SameLine();
  const char* ok = k.question.empty() ? "OK" : "Yes, use it";
  if (key(state, ok, "Key OK", w * 2 + spacing, key_height, true)) close_keypad(state, true);
  if (state.display.font_large) ImGui::PopFont();
  ImGui::End();
  ImGui::PopStyleVar();
}

}  // namespace firn::ui
