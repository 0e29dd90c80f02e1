#include "ui/fields.hpp"

#include <algorithm>
#include <cctype>
#include <ctime>

#include "model/supplemental_oxygen.hpp"
#include "ui/situation.hpp"

namespace firn::ui {

using namespace units;

QuantityField<LengthDimension> altitude_field(const AppState& state, const char* label,
                                              const char* id) {
  return {label, id, "altitude", {kAltitudeUnits.begin(), kAltitudeUnits.end()},
          static_cast<int>(state.settings.units.altitude), atmosphere::kSiteAltitudeRange.low,
          atmosphere::kSiteAltitudeRange.high,
          {100.0, 500.0}, 0};
}

QuantityField<LengthDimension> situation_altitude_field(AppState& state, const char* label) {
  QuantityField<LengthDimension> f = altitude_field(state, label, "altitude");
  f.entered = &state.situation.altitude_entered;
  f.entered_at = &state.situation.altitude_entered_at;
  f.confirm_tenfold = true;
  return f;
}

std::string empty_prompt(const char* what) {
  return "\xE2\x80\x94  enter the " + std::string(what);
}

std::int64_t now_seconds() { return static_cast<std::int64_t>(std::time(nullptr)); }

record::ClockTime clock_now() { return clock_at(now_seconds()); }

record::ClockTime clock_at(std::int64_t seconds_since_1970) {
  auto when = static_cast<std::time_t>(seconds_since_1970);
  std::tm local{};
  if (localtime_r(&when, &local) == nullptr) return {};
  char buffer[24];
  std::strftime(buffer, sizeof buffer, "%Y-%m-%dT%H:%M", &local);
  Result<record::ClockTime> t = record::parse_clock_time(buffer);
  return t ? t.value() : record::ClockTime{};
}

std::string entered_note(std::int64_t entered_at) {
  if (entered_at <= 0) return {};
  std::time_t when = static_cast<std::time_t>(entered_at);
  std::time_t now = std::time(nullptr);
  std::tm at{}, today{};
  if (localtime_r(&when, &at) == nullptr || localtime_r(&now, &today) == nullptr) return {};
  char buffer[48];
  bool same_day = at.tm_year == today.tm_year && at.tm_yday == today.tm_yday;
  std::strftime(buffer, sizeof buffer, same_day ? "entered %H:%M" : "entered %d %b, %H:%M", &at);
  // A value restored from an earlier session must look old (issue 16): the age from an hour on.
  std::int64_t minutes_ago = (static_cast<std::int64_t>(now) - entered_at) / 60;
  return minutes_ago < 60 ? std::string(buffer) : std::string(buffer) + ", " + ago_text(minutes_ago);
}

std::string ago_text(std::int64_t minutes) {
  if (minutes < 1) return "just now";
  if (minutes < 60) return std::to_string(minutes) + " min ago";
  if (minutes < 48 * 60) return std::to_string(minutes / 60) + " h ago";
  return std::to_string(minutes / (24 * 60)) + " d ago";
}

bool tenfold_change(double last, double next, double floor) {
  double a = std::max(std::fabs(last), floor);
  double b = std::max(std::fabs(next), floor);
  return std::max(a, b) >= 10.0 * std::min(a, b);
}

std::string tenfold_question(const char* what, double last, double next, std::string_view symbol) {
  std::string unit = symbol.empty() ? "" : " " + std::string(symbol);
  std::string shown_next = grouped_number(next, 2 * (next != std::round(next))) + unit;
  std::string relation = std::fabs(next) < std::fabs(last) ? "a tenth or less of" : "ten times or more";
  return shown_next + " is " + relation + " the last " + what + " (" + grouped_number(last, 0) + unit +
         "). Use " + shown_next + "?";
}

std::string out_of_range_message(const char* what, double low, double high, double got,
                                 std::string_view symbol, int decimals) {
  std::string unit = symbol.empty() ? "" : " " + std::string(symbol);
  int got_decimals = got == std::round(got) ? 0 : std::max(decimals, 2);
  std::string text = grouped_number(got, got_decimals) + unit + " not taken: the " + what + " goes from " +
                     range_text(low, high, symbol, decimals) + ".";
  text[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(text[0])));
  return text;
}

QuantityField<PressureDimension> air_pressure_field(const AppState& state, const char* label,
                                                    const char* id, Pressure low, Pressure high) {
  auto index = static_cast<std::size_t>(state.settings.units.pressure);
  return {label, id, "pressure", {kPressureUnits.begin(), kPressureUnits.end()},
          static_cast<int>(index), low, high, {1.0, 1.0, 0.1, 0.05}, kPressureDecimals[index]};
}

QuantityField<GaugePressureDimension> cylinder_pressure_field(const AppState& state,
                                                              const char* label, const char* id,
                                                              GaugePressure high) {
  return {label, id, "gauge pressure", {kCylinderUnits.begin(), kCylinderUnits.end()},
          static_cast<int>(state.settings.units.cylinder), bar.gauge(0), high, {10.0, 100.0}, 0};
}

QuantityField<TemperatureDimension> temperature_field(const AppState& state, const char* label,
                                                      const char* id, const Range<TemperatureDimension>& range) {
  return {label, id, "temperature", {kTemperatureUnits.begin(), kTemperatureUnits.end()},
          static_cast<int>(state.settings.units.temperature), range.low, range.high, {1.0, 2.0}, 0};
}

QuantityField<FractionDimension> percent_field(const char* label, const char* id, const char* what,
                                               double low, double high) {
  return {label, id, what, {&percent}, 0, percent(low), percent(high), {1.0}, 0};
}

QuantityField<VolumeFlowDimension> flow_field(const char* label, const char* id, double high_lpm) {
  return {label, id, "flow", {&litres_per_minute}, 0, litres_per_minute(0.0),
          litres_per_minute(high_lpm), {0.5}, 1};
}

QuantityField<VolumeFlowDimension> casualty_flow_field(const AppState& state, const char* label,
                                                       const char* id) {
  supplemental_oxygen::FlowRange range = supplemental_oxygen::valid_flows(situation_device(state));
  QuantityField<VolumeFlowDimension> f = flow_field(label, id, range.high.in(litres_per_minute));
  f.low = range.low;
  return f;
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
