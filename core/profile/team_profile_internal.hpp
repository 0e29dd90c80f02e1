// Shared by the team-profile reader, the v1 migration and the writer (not for other callers).
#pragma once

#include <optional>
#include <string>
#include <string_view>

#include "model/json.hpp"
#include "profile/team_profile.hpp"

namespace firn::team_profile::internal {

using Json = json::Value;

// "card.altitude_to", "cylinders[2]": field paths as messages show them (0-based indices).
std::string child(const std::string& path, std::string_view key);
std::string item(const std::string& path, size_t index);

// Text → JSON object, with the line and column of a syntax error.
std::optional<Json> parse_json(std::string_view text, Problems& problems);
// The document's schema version (1…current), or a problem.
std::optional<int> schema_version(const Json& root, Problems& problems);
// A current-schema document → a whole profile, or nullopt with every problem recorded.
std::optional<TeamProfile> read_current(const Json& root, Problems& problems);
// A schema 1 document → the same content in the current schema.
std::optional<Json> migrate_v1(const Json& old, Problems& problems);

}  // namespace firn::team_profile::internal
