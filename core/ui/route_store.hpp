// The route being planned on the Route screen, kept on the device as a route file
// (Platform::save_text("route.json"), the schema `firn route --file` reads: docs/route-plan.md),
// written whenever it changes, so a reload, going offline or a restart loses nothing. A saved
// route that cannot be read (damaged, or naming cylinder types the team profile no longer has)
// is kept as "route.json.bad", the usual carry-out is shown and the screen says why. Routes are
// loaded whole or not at all: the usual carry-out, a route file, the profile's evacuation stock.
// No ImGui here.
#pragma once

#include <string>
#include <string_view>

#include "profile/team_profile.hpp"
#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

inline constexpr const char* kRouteKey = "route.json";
inline constexpr const char* kBadRouteKey = "route.json.bad";
inline constexpr const char* kRouteExportFileName = "firn-route.json";
inline constexpr const char* kRouteImportFileName = "route-import.json";  // native, no path typed

// At the Route screen's first draw: the saved route, or the usual carry-out (nothing saved, or
// unreadable: then the text is kept as kBadRouteKey and route.file.message says so).
void load_route(RouteState& route, const team_profile::TeamProfile& profile, Platform& platform);
// Writes the route file only when it differs from what was last written and makes a plan (a route
// the plan refuses is not saved: the last one that planned stays); a refused write is said once.
void save_route_if_changed(RouteState& route, Platform& platform);

// The demo team's usual carry-out (assets/demo-route.json), with the team's cylinder types when
// the profile has them, else the demo team's (and the message says so).
void use_usual_route(RouteState& route, const team_profile::TeamProfile& profile);
// Reads `text` (a route file named `source`) against the profile; applied whole, or nothing
// changes and the message lists every problem with its path and range.
bool import_route(RouteState& route, const team_profile::TeamProfile& profile,
                  std::string_view text, std::string_view source);
// The profile's evacuation section becomes the route's cylinders (legs and margin kept).
bool use_profile_stock(RouteState& route, const team_profile::TeamProfile& profile);

}  // namespace firn::ui
