// A clock time as typed on a keypad with gloves: "1405", "14.05", "14:05" or "930" (09:30).
// The Record screen's time correction and the Route screen's start time read it the same way.
#pragma once

#include <optional>
#include <string_view>

namespace firn::clock {

// Minutes after midnight (0…1439), or nothing when the text is not hours and minutes.
std::optional<int> typed_minutes_of_day(std::string_view typed);

}  // namespace firn::clock
