// The team profile kept on the device: Platform::save_text("team-profile.json"), the same
// schema-2 JSON file that is exported, imported and read by `firn plan|card`. Nothing is ever
// silently lost: a saved profile that cannot be read is kept as "team-profile.json.bad", the
// demo profile is used and the user is told what was wrong; an import is applied whole or not
// at all. No ImGui here (tests/native/profile_storage.sh drives it through the app).
#pragma once

#include <string>
#include <string_view>

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

inline constexpr const char* kProfileKey = "team-profile.json";
inline constexpr const char* kBadProfileKey = "team-profile.json.bad";
inline constexpr const char* kExportFileName = "firn-team-profile.json";

// At start. Nothing saved: the demo profile (marked demo). Saved but unreadable: backup, demo
// profile, and state.status_message names the problem (parse_profile's message).
void load_team_profile(AppState& state, Platform& platform);

// Reads `text` (a profile file named `source`); on success it becomes the team profile and is
// saved. On failure nothing changes and the Team screen's message lists every problem.
bool import_team_profile(AppState& state, Platform& platform, std::string_view text,
                         std::string_view source);

// The shipped demo profile becomes the team profile (and is saved, so it survives restarts).
void use_demo_profile(AppState& state, Platform& platform);

// The team profile as the file that is exported (schema 2).
std::string exported_profile_text(const AppState& state);

// Today's date as YYYY-MM-DD (local time), printed on the card.
std::string today_iso_date();

}  // namespace firn::ui
