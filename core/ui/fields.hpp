// Typed-quantity fields: a keypad field bound to a units::Quantity, shown in the user's unit,
// validated against a range (message names range and unit), stepped by ± in round steps.
// The quantity is stored exactly as typed (SI inside), so switching units never rounds it.
#pragma once

#include <cmath>
#include <string>
#include <vector>

#include "model/result.hpp"
#include "model/units.hpp"
#include "ui/keypad.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

template <class D>
struct QuantityField {
  const char* label;
  const char* id;
  const char* what;  // "altitude": names the field in error messages
  std::vector<const units::Unit<D>*> units;  // keypad unit toggles
  int unit_index;                            // the user's display unit among them
  units::Quantity<D> low, high;              // valid range
  std::vector<double> steps;                 // ± step per unit (same order as `units`)
  int decimals = 0;                          // shown on the button
};

// Returns true when the value changed.
template <class D>
bool edit_quantity(AppState& state, const QuantityField<D>& f, units::Quantity<D>& value) {
  const units::Unit<D>& unit = *f.units[f.unit_index];
  std::string symbol(unit.symbol);
  FieldSpec spec{f.label, f.id, shown_number(value.in(unit), f.decimals) + (symbol.empty() ? "" : " " + symbol),
                 format_number(value.in(unit), 4), {}, f.unit_index,
                 format_number(f.low.in(unit), 2) + "\xE2\x80\x93" + format_number(f.high.in(unit), 2) +
                     " " + symbol,
                 true};
  for (const units::Unit<D>* u : f.units) spec.unit_symbols.emplace_back(u->symbol);
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::None) return false;

  units::Quantity<D> candidate = value;
  const units::Unit<D>& typed_unit = *f.units[event.unit_index];
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> number = units::parse_number(event.text, f.what);
    if (!number) {
      state.field_errors[f.id] = number.error().message;
      return false;
    }
    candidate = typed_unit(number.value());
    // A little slack so a bound typed in another unit is not rejected by rounding.
    double slack = 1e-9 * (std::fabs(f.high.in(typed_unit)) + 1.0);
    if (!(candidate.in(typed_unit) >= f.low.in(typed_unit) - slack &&
          candidate.in(typed_unit) <= f.high.in(typed_unit) + slack)) {
      state.field_errors[f.id] = range_error(f.what, f.low.in(typed_unit), f.high.in(typed_unit),
                                             typed_unit.symbol, number.value())
                                     .message;
      return false;
    }
  } else {
    // Steps land on round numbers of the shown unit (3962 m + → 4000 m): easier to read back.
    double step = f.steps[f.unit_index];
    double shown = value.in(unit) / step;
    double snapped = event.kind == FieldEvent::Kind::Plus ? std::floor(shown + 1e-6) + 1
                                                          : std::ceil(shown - 1e-6) - 1;
    candidate = unit(snapped * step);
    if (candidate < f.low) candidate = f.low;
    if (candidate > f.high) candidate = f.high;
  }
  state.field_errors.erase(f.id);
  bool changed = !(candidate == value);
  value = candidate;
  return changed;
}

// Field descriptions for the situation's quantities, in the user's units.
QuantityField<units::LengthDimension> altitude_field(const AppState& state, const char* label,
                                                     const char* id);
QuantityField<units::PressureDimension> air_pressure_field(const AppState& state, const char* label,
                                                           const char* id, units::Pressure low,
                                                           units::Pressure high);
QuantityField<units::PressureDimension> cylinder_pressure_field(const AppState& state,
                                                                const char* label, const char* id,
                                                                units::Pressure high);
QuantityField<units::TemperatureDimension> temperature_field(const AppState& state,
                                                             const char* label, const char* id,
                                                             double low_c, double high_c);
QuantityField<units::FractionDimension> percent_field(const char* label, const char* id,
                                                      const char* what, double low, double high);
QuantityField<units::VolumeFlowDimension> flow_field(const char* label, const char* id,
                                                     double high_lpm);
QuantityField<units::DurationDimension> duration_field(const char* label, const char* id,
                                                       double low_min, double high_min);
QuantityField<units::VolumeDimension> volume_field(const char* label, const char* id,
                                                   double low_l, double high_l);

}  // namespace firn::ui
