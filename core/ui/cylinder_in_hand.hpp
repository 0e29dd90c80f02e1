// The cylinder on the Oxygen screen (the one feeding the casualty) and how long it lasts to its
// reserve: the Oxygen screen shows it, the Record screen times it. One computation for both.
#pragma once

#include <optional>
#include <string>

#include "model/cylinder.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

// One of the team's types, a US letter size (its water capacity assumed, and said so), or a
// water capacity typed in: as chosen on the Oxygen screen.
struct CylinderInHand {
  units::Volume water_capacity;
  std::optional<cylinder::LetterSize> letter_size;  // for the field rule
  std::string assumption;                           // non-empty: a capacity we assumed
  std::string label;                                // "Cyl", or the team's label
};
CylinderInHand cylinder_in_hand(const AppState& state);

struct LastsToReserve {
  cylinder::DurationEstimate real_gas;
  std::optional<units::Duration> field_rule;  // letter sizes only
  cylinder::LeadingDuration lead;             // the lower of the two, whole minutes down
};
// The cylinder in hand at its gauge, temperature and reserve, at `flow`, its gauge read against
// `ambient`.
Result<LastsToReserve> lasts_to_reserve(const AppState& state, const CylinderInHand& cylinder,
                                        units::Pressure ambient, units::VolumeFlow flow);

}  // namespace firn::ui
