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
// A cylinder's gauge may read up to this share of its type's fill pressure (a warm cylinder).
inline constexpr double kGaugeHighShareOfFill = 1.1;

// Every problem in the file (empty: it reads).
team_profile::Problems check_route_file(std::string_view json_text,
                                        const team_profile::TeamProfile& profile);
// The route, or an Error listing every problem separated by "; ".
Result<RouteInput> read_route_file(std::string_view json_text,
                                   const team_profile::TeamProfile& profile);

// The route as a route file (schema version 1, reserve written out) that read_route_file reads
// back to the same route with a profile that has its cylinder types (unit-tested round trip).
std::string write_route_file(const RouteInput& in);

// The team profile's evacuation section as a route's stock: its cylinders on hand in order (type,
// gauge, temperature), the type a shortfall is counted in, the profile's reserve; `margin` kept.
// An Error when the profile has no evacuation section.
Result<Stock> stock_from_profile(const team_profile::TeamProfile& profile, Duration margin);

// The demo team's usual carry-out (fictional, marked demo): the text of assets/demo-route.json.
std::string_view demo_route_json();

}  // namespace firn::route
