// Typed-quantity fields: a keypad field bound to a units::Quantity, shown in the user's unit,
// validated against a range (message names range and unit), stepped by ± in round steps.
// The quantity is stored exactly as typed (SI inside), so switching units never rounds it.
#pragma once

#include <cmath>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "model/incident_record.hpp"
#include "model/result.hpp"
#include "model/units.hpp"
#include "ui/format.hpp"
#include "ui/keypad.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

// The oxygen devices as every choice row names them; the index is supplemental_oxygen::Device's.
inline constexpr const char* kDeviceLabels[] = {"Cannula", "Mask", "Non-rebreather"};

template <class D>
struct QuantityField {
  const char* label;
  const char* id;
  const char* what;  // "altitude": names the field in error messages
  std::vector<const units::ReadingUnit<D>*> units;  // keypad unit toggles
  int unit_index;                            // the user's display unit among them
  units::Quantity<D> low, high;              // valid range
  std::vector<double> steps;                 // ± step per unit (same order as `units`)
  int decimals = 0;                          // shown on the button and the keypad
  // A value someone must enter (never a silent default): unset shows empty; set by a commit.
  bool* entered = nullptr;
  std::int64_t* entered_at = nullptr;  // stamped with the time of the entry when given
  bool confirm_tenfold = false;        // ask before applying ten times (or a tenth of) the last
};

// [Helpers of edit_quantity, the same for every dimension]
// "Enter the altitude" prompt, "entered 14:05" note.
std::string empty_prompt(const char* what);
std::string entered_note(std::int64_t entered_at);
// "just now", "12 min ago", "3 h ago", "5 d ago": whole units, rounded down.
std::string ago_text(std::int64_t minutes);
std::int64_t now_seconds();
// The device's clock now, as the record and the route write it (local time).
record::ClockTime clock_now();
// A moment stamped in seconds since 1970 (UTC), on the device's clock.
record::ClockTime clock_at(std::int64_t seconds_since_1970);
// Whether `next` differs from `last` by a factor of ten or more (values under `floor` count as
// `floor`): 5,200 m → 52 m or 520 m asks, 5,200 → 3,000 does not.
bool tenfold_change(double last, double next, double floor);
// "52 m is a tenth or less of the last altitude (5 200 m). Use 52 m?"
std::string tenfold_question(const char* what, double last, double next, std::string_view symbol);
// "12 000 m not taken: the altitude goes from −500 to 9 000 m."
std::string out_of_range_message(const char* what, double low, double high, double got,
                                 std::string_view symbol, int decimals);

template <class D>
FieldSpec quantity_spec(const QuantityField<D>& f, const units::Quantity<D>& value) {
  const units::ReadingUnit<D>& unit = *f.units[f.unit_index];
  std::string symbol(unit.symbol);
  std::string suffix = symbol.empty() ? "" : " " + symbol;
  bool empty = f.entered != nullptr && !*f.entered;
  FieldSpec spec{};
  spec.label = f.label;
  spec.id = f.id;
  spec.shown = empty ? empty_prompt(f.what) : shown_number(value.in(unit), f.decimals) + suffix;
  // The keypad starts from what the button shows, never "17060.3675 ft".
  spec.edit_text = empty ? std::string() : shown_number(value.in(unit), f.decimals);
  spec.unit_index = f.unit_index;
  spec.hint = range_text(f.low.in(unit), f.high.in(unit), symbol, f.decimals);
  for (const units::ReadingUnit<D>* u : f.units) spec.unit_symbols.emplace_back(u->symbol);
  // − where the range goes below zero in any of the keypad's units (−4 °F is above −40 °C).
  spec.allow_negative = false;
  for (const units::ReadingUnit<D>* u : f.units) spec.allow_negative = spec.allow_negative || f.low.in(*u) < 0.0;
  spec.allow_decimal = f.decimals > 0;
  for (double step : f.steps) spec.allow_decimal = spec.allow_decimal || step != std::floor(step);
  spec.empty = empty;
  if (f.entered != nullptr && *f.entered && f.entered_at != nullptr) spec.note = entered_note(*f.entered_at);
  return spec;
}

// Returns true when the value changed.
template <class D>
bool edit_quantity(AppState& state, const QuantityField<D>& f, units::Quantity<D>& value) {
  const units::ReadingUnit<D>& unit = *f.units[f.unit_index];
  FieldSpec spec = quantity_spec(f, value);
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::None) return false;

  units::Quantity<D> candidate = value;
  const units::ReadingUnit<D>& typed_unit = *f.units[event.unit_index];
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> number = units::parse_number(event.text, f.what);
    if (!number) {
      state.field_errors[f.id] = number.error().message;
      return false;
    }
    if (std::optional<Error> ambiguous = units::ambiguous_grouping(event.text, typed_unit, f.what)) {
      state.field_errors[f.id] = ambiguous->message;
      return false;
    }
    candidate = units::from_reading<D>(typed_unit, number.value());
    // A little slack so a bound typed in another unit is not rejected by rounding.
    double slack = 1e-9 * (std::fabs(f.high.in(typed_unit)) + 1.0);
    if (!(candidate.in(typed_unit) >= f.low.in(typed_unit) - slack &&
          candidate.in(typed_unit) <= f.high.in(typed_unit) + slack)) {
      // Refused, never applied with a warning: the field keeps the value it shows.
      state.field_errors[f.id] = out_of_range_message(f.what, f.low.in(typed_unit), f.high.in(typed_unit),
                                                      number.value(), typed_unit.symbol, f.decimals);
      return false;
    }
    bool had_value = f.entered == nullptr || *f.entered;
    double floor = f.steps[event.unit_index];
    if (f.confirm_tenfold && had_value && !event.confirmed &&
        tenfold_change(value.in(typed_unit), number.value(), floor)) {
      ask_on_keypad(state, spec, event,
                    tenfold_question(f.what, value.in(typed_unit), number.value(), typed_unit.symbol));
      return false;
    }
  } else {
    // Steps land on round numbers of the shown unit (3962 m + → 4000 m): easier to read back.
    double step = f.steps[f.unit_index];
    double shown = value.in(unit) / step;
    double snapped = event.kind == FieldEvent::Kind::Plus ? std::floor(shown + 1e-6) + 1
                                                          : std::ceil(shown - 1e-6) - 1;
    candidate = units::from_reading<D>(unit, snapped * step);
    if (candidate < f.low) candidate = f.low;
    if (candidate > f.high) candidate = f.high;
  }
  state.field_errors.erase(f.id);
  if (f.entered != nullptr) *f.entered = true;
  if (f.entered_at != nullptr) *f.entered_at = now_seconds();
  bool changed = !(candidate == value);
  value = candidate;
  return changed;
}

// Field descriptions for the situation's quantities, in the user's units.
QuantityField<units::LengthDimension> altitude_field(const AppState& state, const char* label,
                                                     const char* id);
// The situation's altitude: empty until entered, stamped with when, and a tenfold change asks.
QuantityField<units::LengthDimension> situation_altitude_field(AppState& state, const char* label);
QuantityField<units::PressureDimension> air_pressure_field(const AppState& state, const char* label,
                                                           const char* id, units::Pressure low,
                                                           units::Pressure high);
QuantityField<units::GaugePressureDimension> cylinder_pressure_field(const AppState& state,
                                                                     const char* label,
                                                                     const char* id,
                                                                     units::GaugePressure high);
// A temperature within a model's published range, in the user's temperature unit.
QuantityField<units::TemperatureDimension> temperature_field(
    const AppState& state, const char* label, const char* id,
    const units::Range<units::TemperatureDimension>& range);
QuantityField<units::FractionDimension> percent_field(const char* label, const char* id,
                                                      const char* what, double low, double high);
QuantityField<units::VolumeFlowDimension> flow_field(const char* label, const char* id,
                                                     double high_lpm);
// The casualty's oxygen flow, within the chosen device's range: the Casualty screen and the
// Oxygen screen (while the casualty is on oxygen) edit this one value.
QuantityField<units::VolumeFlowDimension> casualty_flow_field(const AppState& state,
                                                              const char* label, const char* id);
QuantityField<units::DurationDimension> duration_field(const char* label, const char* id,
                                                       double low_min, double high_min);
QuantityField<units::VolumeDimension> volume_field(const char* label, const char* id,
                                                   double low_l, double high_l);

}  // namespace firn::ui
