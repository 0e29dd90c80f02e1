#include "ui/team_store.hpp"

#include <ctime>

namespace firn::ui {

namespace tp = team_profile;

namespace {

void tell(TeamState& team, std::string text, bool problem) { team.file.tell(std::move(text), problem); }

void append_status(AppState& state, const std::string& text) {
  if (!state.status_message.empty()) state.status_message += "\n";
  state.status_message += text;
}

}  // namespace

void load_team_profile(AppState& state, Platform& platform) {
  TeamState& team = state.team;
  team.stored = false;
  // The demo is parsed only where it is used: a saved profile is the usual start (issue 17).
  std::optional<std::string> text = platform.load_text(kProfileKey);
  if (!text) {  // first start: the demo profile, marked demo on screen and card
    team.profile = tp::demo_profile();
    return;
  }
  Result<tp::TeamProfile> parsed = tp::parse_profile(*text);
  if (parsed) {
    team.profile = std::move(parsed).value();
    team.stored = true;
    return;
  }
  team.profile = tp::demo_profile();
  // Keep the unreadable text before anything else is written under the profile key.
  bool kept = platform.save_text(kBadProfileKey, *text);
  std::string message = "The saved team profile could not be read (" + parsed.error().message +
                        "). The demo profile is in use. " +
                        (kept ? "The old text was kept as " + std::string(kBadProfileKey) +
                                    " in " + platform.storage_location() + "."
                              : std::string("The old text could not be copied; it stays under ") +
                                    kProfileKey + " until you import or load a profile.");
  append_status(state, message);  // shown on every screen until dismissed
  team.backup_kept = kept;
}

bool import_team_profile(AppState& state, Platform& platform, std::string_view text,
                         std::string_view source) {
  TeamState& team = state.team;
  Result<tp::TeamProfile> parsed = tp::parse_profile(text);
  if (!parsed) {
    tell(team, std::string(source) + " was not imported, nothing changed: " + parsed.error().message,
         true);
    return false;
  }
  team.profile = parsed.value();
  // Saved as written by us (schema 2), so an imported schema-1 file is stored migrated.
  team.stored = platform.save_text(kProfileKey, tp::serialize_profile(team.profile));
  tell(team,
       "Imported " + std::string(source) + ": " + team.profile.team_name +
           (team.stored ? "" : ". It could not be saved on " + platform.storage_location() +
                                   ", so it lasts until Firn is closed"),
       !team.stored);
  return true;
}

void use_demo_profile(AppState& state, Platform& platform) {
  TeamState& team = state.team;
  team.profile = tp::demo_profile();
  team.stored = platform.save_text(kProfileKey, tp::demo_profile_json());
  tell(team, "The demo profile (fictional team, DEMO DATA) is in use.", false);
}

std::string exported_profile_text(const AppState& state) {
  return tp::serialize_profile(state.team.profile);
}

std::string today_iso_date() {
  std::time_t now = std::time(nullptr);
  std::tm local{};
  if (localtime_r(&now, &local) == nullptr) return "";
  char buffer[16];
  std::strftime(buffer, sizeof buffer, "%Y-%m-%d", &local);
  return buffer;
}

}  // namespace firn::ui
