#include "ui/cylinder_in_hand.hpp"

#include <algorithm>

namespace firn::ui {

CylinderInHand cylinder_in_hand(const AppState& state) {
  const OxygenInputs& in = state.oxygen;
  const team_profile::TeamProfile& team = state.team.profile;
  CylinderInHand c{in.water_capacity, std::nullopt, "", "Cyl"};
  if (in.cylinder_source == 0 && !team.cylinders.empty()) {
    int type = std::clamp(in.team_type, 0, static_cast<int>(team.cylinders.size()) - 1);
    const team_profile::CylinderType& t = team.cylinders[static_cast<size_t>(type)];
    c.letter_size = t.letter_size;
    c.label = t.label;
    if (t.water_capacity) {
      c.water_capacity = *t.water_capacity;
    } else if (t.letter_size) {
      c.water_capacity = cylinder::letter_size_info(*t.letter_size).water_capacity;
      c.assumption = cylinder::letter_size_assumption(*t.letter_size) + " on the Team screen.";
    }
  } else if (in.cylinder_source == 1) {
    auto size = static_cast<cylinder::LetterSize>(std::clamp(in.letter_size, 0, 3));
    c.letter_size = size;
    c.water_capacity = cylinder::letter_size_info(size).water_capacity;
    c.assumption = cylinder::letter_size_assumption(size) + " (Water capacity, or the Team screen).";
    c.label = std::string(cylinder::letter_size_info(size).name);
  }
  return c;
}

Result<LastsToReserve> lasts_to_reserve(const AppState& state, const CylinderInHand& cylinder,
                                        units::Pressure ambient, units::VolumeFlow flow) {
  const OxygenInputs& in = state.oxygen;
  cylinder::Reading reading{cylinder.water_capacity, in.gauge, in.cylinder_temperature, ambient};
  Result<cylinder::DurationEstimate> d = cylinder::duration(reading, in.reserve, flow);
  if (!d) return d.error();
  std::optional<units::Duration> rule;
  if (cylinder.letter_size) {
    Result<units::Duration> r = cylinder::field_rule_duration(*cylinder.letter_size, in.gauge, flow);
    if (r) rule = r.value();
  }
  return LastsToReserve{d.value(), rule, cylinder::leading_duration(d.value(), rule)};
}

}  // namespace firn::ui
