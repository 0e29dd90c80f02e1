// Quantities as the user chose to read them: "701.2 hPa", "13 123 ft". The only place the UI
// turns typed quantities into raw numbers.
#pragma once

#include <string>
#include <string_view>

#include "model/units.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

std::string_view altitude_unit_symbol(const UnitChoice& units);
std::string_view pressure_unit_symbol(const UnitChoice& units);

// Number only, in the chosen unit, for editing ("3000", "9842.5").
std::string altitude_text(units::Length altitude, const UnitChoice& units);
// With unit, for results ("701.2 hPa", "526.0 mmHg").
std::string altitude_with_unit(units::Length altitude, const UnitChoice& units);
std::string pressure_text(units::Pressure pressure, const UnitChoice& units);

}  // namespace firn::ui

namespace firn::ui {
std::string cylinder_pressure_text(units::Pressure gauge, const UnitChoice& units);
std::string temperature_text(units::Temperature temperature, const UnitChoice& units);
std::string percent_text(units::Fraction fraction, int decimals = 0);
std::string flow_text(units::VolumeFlow flow);
std::string volume_text(units::Volume volume);
// "1 h 25 min", "40 min"
std::string duration_text(units::Duration duration);
// PiO2, PAO2, PaO2 are read in mmHg by clinicians whatever the weather unit; kPa users get kPa.
std::string gas_pressure_text(units::Pressure pressure, const UnitChoice& units);
// A range with one unit: "57–60 mmHg".
std::string gas_pressure_range_text(units::Pressure low, units::Pressure high, const UnitChoice& units);
}  // namespace firn::ui
