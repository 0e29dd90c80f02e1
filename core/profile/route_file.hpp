// The route file: a planned carry-out as JSON (schema in docs/route-plan.md), read against the
// team profile whose cylinder types, reserve, flowmeter settings, bag pressure and atmosphere
// model it uses. Like the team profile, reading yields a whole RouteInput or every problem, each
// naming its path, the value and the valid range: "legs[2].duration: 30h is outside 1…1440 min".
#pragma once

#include <string_view>

#include "model/result.hpp"
#include "model/route_plan.hpp"
#include "profile/team_profile.hpp"

namespace firn::route {

inline constexpr int current_route_schema_version = 1;

// Every problem in the file (empty: it reads).
team_profile::Problems check_route_file(std::string_view json_text,
                                        const team_profile::TeamProfile& profile);
// The route, or an Error listing every problem separated by "; ".
Result<RouteInput> read_route_file(std::string_view json_text,
                                   const team_profile::TeamProfile& profile);

// The demo team's usual carry-out (fictional, marked demo): the text of assets/demo-route.json.
std::string_view demo_route_json();

}  // namespace firn::route
