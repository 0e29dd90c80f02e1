#include "ui/fields.hpp"

namespace firn::ui {

using namespace units;

QuantityField<LengthDimension> altitude_field(const AppState& state, const char* label,
                                              const char* id) {
  int index = state.settings.units.altitude == UnitChoice::Altitude::Feet ? 1 : 0;
  return {label, id, "altitude", {&metres, &feet}, index, metres(-500), metres(9000),
          {100.0, 500.0}, 0};
}

QuantityField<PressureDimension> air_pressure_field(const AppState& state, const char* label,
                                                    const char* id, Pressure low, Pressure high) {
  int index = static_cast<int>(state.settings.units.pressure);
  int decimals = index == 0 ? 1 : index == 1 ? 1 : 2;
  return {label, id, "pressure", {&hectopascals, &mmhg, &kilopascals, &inhg}, index, low, high,
          {1.0, 1.0, 0.1, 0.05}, decimals};
}

QuantityField<PressureDimension> cylinder_pressure_field(const AppState& state, const char* label,
                                                         const char* id, Pressure high) {
  int index = state.settings.units.cylinder == UnitChoice::CylinderPressure::Psi ? 1 : 0;
  return {label, id, "gauge pressure", {&bar, &psi}, index, bar(0), high, {10.0, 100.0}, 0};
}

QuantityField<TemperatureDimension> temperature_field(const AppState& state, const char* label,
                                                      const char* id, double low_c, double high_c) {
  int index = state.settings.units.temperature == UnitChoice::Temperature::Fahrenheit ? 1 : 0;
  return {label, id, "temperature", {&celsius, &fahrenheit}, index, celsius(low_c),
          celsius(high_c), {1.0, 2.0}, 0};
}

QuantityField<FractionDimension> percent_field(const char* label, const char* id, const char* what,
                                               double low, double high) {
  return {label, id, what, {&percent}, 0, percent(low), percent(high), {1.0}, 0};
}

QuantityField<VolumeFlowDimension> flow_field(const char* label, const char* id, double high_lpm) {
  return {label, id, "flow", {&litres_per_minute}, 0, litres_per_minute(0.0),
          litres_per_minute(high_lpm), {0.5}, 1};
}

QuantityField<DurationDimension> duration_field(const char* label, const char* id, double low_min,
                                                double high_min) {
  return {label, id, "time", {&minutes, &hours}, 0, minutes(low_min), minutes(high_min),
          {15.0, 0.5}, 0};
}

QuantityField<VolumeDimension> volume_field(const char* label, const char* id, double low_l,
                                            double high_l) {
  return {label, id, "water capacity", {&litres}, 0, litres(low_l), litres(high_l), {0.5}, 1};
}

}  // namespace firn::ui
