// The situation, settings, screen inputs and last results survive a restart: saved as JSON text
// through Platform::save_text("state.json") whenever they change. Saved text that cannot be read
// (damaged, from a future version, hand-edited) never stops the app: defaults are used, the bad
// text is kept under "state.json.bad" and a message says so.
#pragma once

#include <string>

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

inline constexpr const char* kStateKey = "state.json";
inline constexpr const char* kBadStateKey = "state.json.bad";

std::string state_to_json(const AppState& state);
// Reads what it can; values that are missing, of the wrong type or out of range keep their
// defaults. Returns false when the text is not a JSON object at all.
bool state_from_json(AppState& state, const std::string& text);

void load_state(AppState& state, Platform& platform);
// Writes only when the JSON differs from what was last written.
void save_state_if_changed(AppState& state, Platform& platform);

}  // namespace firn::ui
