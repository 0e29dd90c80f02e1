// Quantities as the user chose to read them: "701.2 hPa", "13 123 ft". The only place the UI
// turns typed quantities into raw numbers.
#pragma once

#include <string>
#include <string_view>

#include "model/units.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

std::string shown_number(double value, int decimals);  // ui/widgets.hpp

// The one way a quantity becomes "number unit" text: read out in `unit`, `decimals` shown.
template <class D>
std::string quantity_text(units::Quantity<D> q, const units::ReadingUnit<D>& unit, int decimals) {
  std::string text = shown_number(q.in(unit), decimals);
  return unit.symbol.empty() ? text : text + " " + std::string(unit.symbol);
}

// With unit, for results ("701.2 hPa", "526.0 mmHg").
std::string altitude_with_unit(units::Length altitude, const UnitChoice& units);
std::string pressure_text(units::Pressure pressure, const UnitChoice& units);
// A bag's gauge reading, in the same unit as the air pressures beside it.
std::string pressure_text(units::GaugePressure gauge, const UnitChoice& units);

// A number for reading, not editing: thousands grouped by a no-break space and a true minus
// sign ("−1 640", "29.92"). Non-finite values become "—".
std::string grouped_number(double value, int decimals);
// A valid range in messages and on the keypad: bounds rounded inward to three significant
// figures (never finer than `decimals`), so each shown bound is itself accepted:
// "−1 640 to 29 500 ft", not "-1640.42–29527.56 ft". The one place a range is rounded for display.
std::string range_text(double low, double high, std::string_view symbol, int decimals);

std::string cylinder_pressure_text(units::GaugePressure gauge, const UnitChoice& units);
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
