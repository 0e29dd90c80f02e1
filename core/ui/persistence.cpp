// Values are stored in fixed SI-like units named in each key ("altitude_m", "qnh_pa"), at full
// double precision, so a value typed in feet comes back exactly. Enums are stored as words.
// Parsing never throws (the web build has no exceptions): every access checks the type first.
#include "ui/persistence.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <cmath>
#include <string_view>

#include "model/cylinder.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/json.hpp"
#include "model/oxygen_cascade.hpp"

namespace firn::ui {

using Json = json::Value;
using namespace units;

namespace {

constexpr int kFormatVersion = 1;

constexpr std::array<std::string_view, 3> kSourceKeys{"altitude", "station", "qnh"};
// Unit choices are saved as the unit's parsing spelling ("hpa", "c") and read case-insensitively,
// so files that saved the symbol ("hPa") or "C" read the same.
template <class D, std::size_t N>
constexpr std::array<std::string_view, N> unit_keys(const UnitList<D, N>& list) {
  std::array<std::string_view, N> keys{};
  for (std::size_t i = 0; i < N; ++i) keys[i] = list[i]->spelling;
  return keys;
}

// Readers: leave `out` untouched unless the value is there, of the right type and in range.
void read(const Json& j, const char* key, double low, double high, double& out) {
  const Json* it = j.find(key);
  if (!it || !it->is_number()) return;
  double v = it->as_double();
  if (std::isfinite(v) && v >= low && v <= high) out = v;
}
// When a value was entered, seconds since 1970: 0 (unknown) … the year 2100.
std::int64_t entered_at_value(const Json& v, std::int64_t fallback) {
  if (!v.is_number()) return fallback;
  double at = v.as_double();
  return std::isfinite(at) && at >= 0.0 && at <= 4102444800.0 ? static_cast<std::int64_t>(at) : fallback;
}
std::int64_t read_entered_at(const Json& j, const char* key, std::int64_t fallback) {
  const Json* it = j.find(key);
  return !it ? fallback : entered_at_value(*it, fallback);
}

void read(const Json& j, const char* key, bool& out) {
  const Json* it = j.find(key);
  if (it && it->is_boolean()) out = it->as_bool();
}
void read(const Json& j, const char* key, int low, int high, int& out) {
  const Json* it = j.find(key);
  if (!it || !it->is_number_integer()) return;
  long long v = it->as_integer();
  if (v >= low && v <= high) out = static_cast<int>(v);
}
bool same_letters(std::string_view a, std::string_view b) {
  return a.size() == b.size() && std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) {
           return std::tolower(static_cast<unsigned char>(x)) ==
                  std::tolower(static_cast<unsigned char>(y));
         });
}
template <class Enum, size_t N>
void read(const Json& j, const char* key, const std::array<std::string_view, N>& keys, Enum& out) {
  const Json* it = j.find(key);
  if (!it || !it->is_string()) return;
  const std::string& text = it->as_string();
  for (size_t i = 0; i < N; ++i) {
    if (same_letters(keys[i], text)) out = static_cast<Enum>(i);
  }
}
template <class D>
void read(const Json& j, const char* key, const ReadingUnit<D>& unit, double low, double high,
          Quantity<D>& out) {
  double v = out.in(unit);
  read(j, key, low, high, v);
  out = from_reading<D>(unit, v);
}
// A saved quantity (a number in `unit`), kept only inside the model's published range.
template <class D>
void read(const Json& j, const char* key, const ReadingUnit<D>& unit, const Range<D>& range,
          Quantity<D>& out) {
  const Json* it = j.find(key);
  if (!it || !it->is_number()) return;
  Quantity<D> v = from_reading<D>(unit, it->as_double());
  if (range.contains(v)) out = v;  // contains() refuses NaN and infinities too
}
Json child(const Json& j, const char* key) {
  const Json* it = j.find(key);
  return it && it->is_object() ? *it : Json::object();
}

template <class Enum, size_t N>
std::string word(const std::array<std::string_view, N>& keys, Enum value) {
  return std::string(keys[static_cast<size_t>(value)]);
}

}  // namespace

std::string state_to_json(const AppState& state) {
  const Settings& st = state.settings;
  const Situation& s = state.situation;
  Json j;
  j["version"] = kFormatVersion;
  j["screen"] = word(kScreenKeys, state.screen);
  j["settings"] = {{"theme", word(kThemeKeys, st.theme)},
                   {"night_dim", st.night_dim},
                   {"model", std::string(atmosphere::model_key(st.model))},
                   {"altitude_unit", word(unit_keys(kAltitudeUnits), st.units.altitude)},
                   {"pressure_unit", word(unit_keys(kPressureUnits), st.units.pressure)},
                   {"cylinder_unit", word(unit_keys(kCylinderUnits), st.units.cylinder)},
                   {"temperature_unit", word(unit_keys(kTemperatureUnits), st.units.temperature)}};
  j["situation"] = {{"source", word(kSourceKeys, s.source)},
                    {"altitude_m", s.altitude.in(metres)},
                    {"altitude_entered", s.altitude_entered},
                    {"altitude_entered_at", s.altitude_entered_at},
                    {"station_pa", s.station_reading.in(pascals)},
                    {"qnh_pa", s.qnh.in(pascals)},
                    {"temperature_known", s.qnh_temperature_known},
                    {"air_temperature_k", s.air_temperature.in(kelvin)},
                    {"station_altitude_known", s.station_altitude_known},
                    {"latitude_month_known", s.latitude_month_known},
                    {"latitude_deg", s.latitude_deg},
                    {"month", s.month},
                    {"spo2_measured", s.spo2_measured},
                    {"spo2", s.spo2.in(fraction)},
                    {"spo2_entered_at", s.spo2_entered_at},
                    {"time_at_altitude_h", s.time_at_altitude.in(hours)},
                    {"time_at_altitude_entered", s.time_at_altitude_entered},
                    {"distress", s.distress},
                    {"on_oxygen", s.on_oxygen},
                    {"oxygen_device", s.oxygen_device},
                    {"oxygen_flow_entered", s.oxygen_flow_entered},
                    {"oxygen_flow_lpm", s.oxygen_flow.in(litres_per_minute)}};
  const BagInputs& b = state.bag;
  j["bag"] = {{"gauge_pa", b.gauge.in(pascals)},
              {"flush_entered", b.flush_entered},
              {"flush_lpm", b.flush.in(litres_per_minute)},
              {"time_entered", b.time_entered},
              {"time_min", b.time_in_bag.in(minutes)},
              {"vco2_lpm", b.vco2.in(litres_per_minute)},
              {"vo2_lpm", b.vo2.in(litres_per_minute)},
              {"chamber_temperature_c", b.chamber_temperature.in(celsius)}};
  const OxygenInputs& o = state.oxygen;
  j["oxygen"] = {{"water_capacity_l", o.water_capacity.in(litres)},
                 {"gauge_entered", o.gauge_entered},
                 {"gauge_pa", o.gauge.in(pascals)},
                 {"gauge_read_at", o.gauge_read_at},
                 {"temperature_entered", o.temperature_entered},
                 {"cylinder_temperature_k", o.cylinder_temperature.in(kelvin)},
                 {"reserve_pa", o.reserve.in(pascals)},
                 {"flow_entered", o.flow_entered},
                 {"flow_lpm", o.flow.in(litres_per_minute)},
                 {"count_entered", o.count_entered},
                 {"cylinders", o.cylinder_count},
                 {"evacuation_entered", o.evacuation_entered},
                 {"evacuation_min", o.evacuation.in(minutes)},
                 {"first_flow_entered", o.first_flow_entered},
                 {"first_flow_lpm", o.first_flow.in(litres_per_minute)},
                 {"first_phase_min", o.first_phase.in(minutes)}};
  const AmsInputs& a = state.ams;
  j["ams"] = {{"headache", a.headache}, {"gastrointestinal", a.gastrointestinal},
              {"fatigue", a.fatigue}, {"dizziness", a.dizziness},
              {"recent_ascent", a.recent_ascent}};
  j["teaching"] = {{"altitude_m", state.teaching.altitude.in(metres)}};
  j["route_gauges_read_at"] = state.route.gauge_read_at;
  return j.dump(1);
}

bool state_from_json(AppState& state, const std::string& text) {
  json::Parsed parsed = json::parse(text);
  if (!parsed.ok || !parsed.value.is_object()) return false;
  const Json& j = parsed.value;
  read(j, "screen", kScreenKeys, state.screen);

  const Json st = child(j, "settings");
  Settings& settings = state.settings;
  read(st, "theme", kThemeKeys, settings.theme);
  read(st, "night_dim", settings.night_dim);
  if (const Json* it = st.find("model"); it && it->is_string()) {
    if (Result<atmosphere::Model> m = atmosphere::parse_model(it->as_string())) {
      settings.model = m.value();
    }
  }
  read(st, "altitude_unit", unit_keys(kAltitudeUnits), settings.units.altitude);
  read(st, "pressure_unit", unit_keys(kPressureUnits), settings.units.pressure);
  read(st, "cylinder_unit", unit_keys(kCylinderUnits), settings.units.cylinder);
  read(st, "temperature_unit", unit_keys(kTemperatureUnits), settings.units.temperature);

  // Ranges here are those of the input fields: anything else is damage, not a situation.
  const Json si = child(j, "situation");
  Situation& s = state.situation;
  read(si, "source", kSourceKeys, s.source);
  read(si, "altitude_m", metres, atmosphere::kSiteAltitudeRange, s.altitude);
  // Saves from before the flag: an altitude other than the old default of 3,000 m was typed
  // or stepped by someone; 3,000 m may be the default nobody entered, so it shows empty.
  s.altitude_entered = si.contains("altitude_m") && s.altitude.in(metres) != 3000.0;
  read(si, "altitude_entered", s.altitude_entered);
  s.altitude_entered_at = read_entered_at(si, "altitude_entered_at", s.altitude_entered_at);
  read(si, "station_pa", pascals, atmosphere::kStationReadingRange, s.station_reading);
  read(si, "qnh_pa", pascals, atmosphere::kQnhRange, s.qnh);
  read(si, "temperature_known", s.qnh_temperature_known);
  read(si, "air_temperature_k", kelvin, 213.15, 323.15, s.air_temperature);
  read(si, "station_altitude_known", s.station_altitude_known);
  read(si, "latitude_month_known", s.latitude_month_known);
  read(si, "latitude_deg", -90.0, 90.0, s.latitude_deg);
  read(si, "month", 1, 12, s.month);
  read(si, "spo2_measured", s.spo2_measured);
  read(si, "spo2", fraction, 0.3, 1.0, s.spo2);
  s.spo2_entered_at = read_entered_at(si, "spo2_entered_at", s.spo2_entered_at);
  bool acclimatised = false;  // saved by versions with two states only: the preset
  read(si, "acclimatised", acclimatised);
  if (acclimatised) s.time_at_altitude = cascade::preset_time_at_altitude(cascade::Exposure::Acclimatised);
  read(si, "time_at_altitude_h", hours, 0, 8760, s.time_at_altitude);
  // Saves before the flag defaulted to 0 h: only a time away from that default was entered.
  s.time_at_altitude_entered = acclimatised || s.time_at_altitude.in(hours) > 0.0;
  read(si, "time_at_altitude_entered", s.time_at_altitude_entered);
  read(si, "distress", s.distress);
  read(si, "on_oxygen", s.on_oxygen);
  read(si, "oxygen_device", 0, 9, s.oxygen_device);
  read(si, "oxygen_flow_entered", s.oxygen_flow_entered);  // older saves: empty again
  read(si, "oxygen_flow_lpm", litres_per_minute, 0, 30, s.oxygen_flow);

  const Json b = child(j, "bag");
  read(b, "gauge_pa", pascals, 0, 30000, state.bag.gauge);
  namespace hb = hyperbaric_bag;
  // Saves from before the flags held the old defaults nobody entered: they stay empty.
  read(b, "flush_entered", state.bag.flush_entered);
  read(b, "flush_lpm", litres_per_minute, 0, hb::max_flush_lpm, state.bag.flush);
  read(b, "time_entered", state.bag.time_entered);
  read(b, "time_min", minutes, 0, BagInputs::kMaxTimeMin, state.bag.time_in_bag);
  read(b, "vco2_lpm", litres_per_minute, hb::min_vco2_lpm, hb::max_vco2_lpm, state.bag.vco2);
  read(b, "vo2_lpm", litres_per_minute, hb::min_vo2_lpm, hb::max_vo2_lpm, state.bag.vo2);
  read(b, "chamber_temperature_c", celsius, hb::kChamberTemperatureRange, state.bag.chamber_temperature);

  const Json o = child(j, "oxygen");
  OxygenInputs& ox = state.oxygen;
  read(o, "water_capacity_l", litres, 0.1, 100, ox.water_capacity);
  read(o, "gauge_pa", pascals, 0, 35e6, ox.gauge);
  ox.gauge_read_at = read_entered_at(o, "gauge_read_at", ox.gauge_read_at);
  // Saves from before the flag: only a gauge with its reading time was surely typed.
  ox.gauge_entered = ox.gauge_read_at > 0;
  read(o, "gauge_entered", ox.gauge_entered);
  read(o, "temperature_entered", ox.temperature_entered);
  read(o, "cylinder_temperature_k", kelvin, cylinder::kTemperatureRange, ox.cylinder_temperature);
  // Saves from before the flag held the old 0 °C default nobody entered (it claimed more gas).
  if (!ox.temperature_entered) ox.cylinder_temperature = cylinder::assumed_temperature;
  read(o, "reserve_pa", pascals, 0, 35e6, ox.reserve);
  // Saves from before these flags held the old defaults nobody entered: they come back empty.
  read(o, "flow_entered", ox.flow_entered);
  read(o, "flow_lpm", litres_per_minute, 0, 30, ox.flow);
  read(o, "count_entered", ox.count_entered);
  read(o, "cylinders", 1, OxygenInputs::kMaxCylinders, ox.cylinder_count);
  read(o, "evacuation_entered", ox.evacuation_entered);
  read(o, "evacuation_min", minutes, 1, 4320, ox.evacuation);
  read(o, "first_flow_entered", ox.first_flow_entered);  // older saves: empty again
  read(o, "first_flow_lpm", litres_per_minute, 0, 30, ox.first_flow);
  read(o, "first_phase_min", minutes, 0, 4320, ox.first_phase);
  if (!ox.evacuation_entered) ox.first_phase = minutes(0.0);  // an old save's default 1 h

  const Json a = child(j, "ams");
  read(a, "headache", AmsInputs::kUnanswered, 3, state.ams.headache);
  read(a, "gastrointestinal", AmsInputs::kUnanswered, 3, state.ams.gastrointestinal);
  read(a, "fatigue", AmsInputs::kUnanswered, 3, state.ams.fatigue);
  read(a, "dizziness", AmsInputs::kUnanswered, 3, state.ams.dizziness);
  read(a, "recent_ascent", state.ams.recent_ascent);

  read(child(j, "teaching"), "altitude_m", metres, 0, TeachingInputs::kTopM, state.teaching.altitude);
  // The route screen's gauge readings (the route itself is its own file): one time each.
  if (const Json* it = j.find("route_gauges_read_at"); it && it->is_array()) {
    std::vector<std::int64_t>& read_at = state.route.gauge_read_at;
    read_at.clear();
    for (const Json& at : *it) read_at.push_back(entered_at_value(at, 0));
  }

  return true;
}

void load_state(AppState& state, Platform& platform) {
  std::optional<std::string> text = platform.load_text(kStateKey);
  if (!text) return;
  AppState fresh = state;  // a half-read state must not leak into the defaults
  if (state_from_json(fresh, *text)) {
    state = fresh;
    state.saved_json = *text;
    return;
  }
  platform.save_text(kBadStateKey, *text);
  state.status_message =
      "The saved situation could not be read; defaults are shown. The old text was kept as " +
      std::string(kBadStateKey) + ".";
}

void save_state_if_changed(AppState& state, Platform& platform) {
  std::string json = state_to_json(state);
  if (json == state.saved_json) return;
  if (platform.save_text(kStateKey, json)) state.saved_json = json;
}

}  // namespace firn::ui
