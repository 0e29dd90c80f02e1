// Everything the UI remembers, as plain structs passed into the panels (no function-local
// statics). Settings, the situation, screen inputs and the last results persist across restarts
// (ui/persistence.hpp); the rest is this run's working state.
#pragma once

#include <array>
#include <cstdint>
#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/illness_criteria.hpp"
#include "model/route_plan.hpp"
#include "profile/team_profile.hpp"
#include "model/units.hpp"
#include "ui/file_exchange.hpp"
#include "ui/record_store.hpp"
#include "ui/theme.hpp"

namespace firn::ui {

// Order = order in the navigation bar.
enum class Screen { Here, Casualty, Curve, Bag, Oxygen, Route, Ams, Record, Teaching, Team, Settings };
inline constexpr int kScreenCount = 11;

// Each screen's names, once: `key` in saved state, --screen and test scripts; `label` on the bar.
struct ScreenName {
  Screen screen;
  std::string_view key;
  const char* label;
};
inline constexpr std::array<ScreenName, kScreenCount> kScreenNames{{
    {Screen::Here, "here", "Here"},
    {Screen::Casualty, "casualty", "Casualty"},
    {Screen::Curve, "curve", "Curve"},
    {Screen::Bag, "bag", "Bag"},
    {Screen::Oxygen, "oxygen", "Oxygen"},
    {Screen::Route, "route", "Route"},
    {Screen::Ams, "ams", "AMS"},
    {Screen::Record, "record", "Record"},
    {Screen::Teaching, "teaching", "Teaching"},
    {Screen::Team, "team", "Team"},
    {Screen::Settings, "settings", "Settings"},
}};
constexpr const ScreenName& screen_name(Screen screen) {
  return kScreenNames[static_cast<std::size_t>(screen)];
}
static_assert([] {
  for (std::size_t i = 0; i < kScreenNames.size(); ++i) {
    if (static_cast<std::size_t>(kScreenNames[i].screen) != i) return false;
  }
  return true;
}(), "kScreenNames follows the order of Screen");
// The keys alone, in Screen's order (saved state, --screen).
inline constexpr auto kScreenKeys = [] {
  std::array<std::string_view, kScreenCount> keys{};
  for (std::size_t i = 0; i < keys.size(); ++i) keys[i] = kScreenNames[i].key;
  return keys;
}();

// Units a user reads and types in. Values are stored as typed quantities (SI inside), so
// switching units never rounds an entered value away.
struct UnitChoice {
  enum class Altitude { Metres, Feet } altitude = Altitude::Metres;
  enum class Pressure { Hectopascals, Millimetres, Kilopascals, InchesHg } pressure =
      Pressure::Hectopascals;
  enum class CylinderPressure { Bar, Psi } cylinder = CylinderPressure::Bar;
  enum class Temperature { Celsius, Fahrenheit } temperature = Temperature::Celsius;
};

// The units each choice offers, in the order of its enum: the Settings rows, the saved state,
// the fields and the figures all read them here.
template <class D, std::size_t N>
using UnitList = std::array<const units::Unit<D>*, N>;
inline constexpr UnitList<units::LengthDimension, 2> kAltitudeUnits{&units::metres, &units::feet};
inline constexpr UnitList<units::PressureDimension, 4> kPressureUnits{
    &units::hectopascals, &units::mmhg, &units::kilopascals, &units::inhg};
inline constexpr std::array<int, 4> kPressureDecimals{1, 1, 2, 2};  // air pressures, as shown
inline constexpr UnitList<units::PressureDimension, 2> kCylinderUnits{&units::bar, &units::psi};
inline constexpr UnitList<units::TemperatureDimension, 2> kTemperatureUnits{&units::celsius,
                                                                            &units::fahrenheit};
template <class D, std::size_t N, class Choice>
constexpr const units::Unit<D>& chosen_unit(const UnitList<D, N>& list, Choice choice) {
  return *list[static_cast<std::size_t>(choice)];
}
// The symbols as a choice row's labels ("hPa", "mmHg", …; each symbol is a whole C string).
template <class D, std::size_t N>
constexpr std::array<const char*, N> unit_labels(const UnitList<D, N>& list) {
  std::array<const char*, N> labels{};
  for (std::size_t i = 0; i < N; ++i) labels[i] = list[i]->symbol.data();
  return labels;
}

struct Settings {
  Theme theme = Theme::Day;
  bool night_dim = false;  // the night theme at half brightness
  UnitChoice units;
  atmosphere::Model model = atmosphere::default_medical_model;
};

// Where the barometric pressure comes from.
enum class PressureSource { Altitude, Station, Qnh };

// The one situation every screen reads: where we are and who the casualty is.
struct Situation {
  PressureSource source = PressureSource::Altitude;
  units::Length altitude = units::metres(3000.0);  // meaningless until altitude_entered
  bool altitude_entered = false;      // nobody typed an altitude yet: shown empty, no verdicts
  std::int64_t altitude_entered_at = 0;  // when (seconds since 1970 UTC); 0 unknown
  units::Pressure station_reading = units::hectopascals(700.0);
  units::Pressure qnh = units::hectopascals(1013.25);
  bool qnh_temperature_known = false;
  units::Temperature air_temperature = units::celsius(0.0);  // at the station
  // Barometer source: the altitude is known too, so the two are cross-checked.
  bool station_altitude_known = false;
  // Altitude source: pressure from NRLMSISE-00 for this latitude and month instead of the model.
  bool latitude_month_known = false;
  double latitude_deg = 45.0;  // north +, south −
  int month = 1;               // 1 = January

  bool spo2_measured = false;                    // false: nothing entered, no verdict
  units::Fraction spo2 = units::percent(88.0);   // meaningful only when spo2_measured
  std::int64_t spo2_entered_at = 0;              // when (seconds since 1970 UTC); 0 unknown
  // At (or above) this altitude; empty until entered or a preset tapped. Meanwhile figures are
  // for a newcomer (the least oxygen) and the SpO2 verdict holds for any time (casualty_spo2).
  bool time_at_altitude_entered = false;
  units::Duration time_at_altitude = units::hours(0.0);
  bool distress = false;  // breathing fast and deep: lowers the FiO2 a device gives
  bool on_oxygen = false;
  int oxygen_device = 0;  // index into the supplemental-oxygen model's device list
  // Empty until entered: the band on oxygen and the cylinder's duration depend on it.
  bool oxygen_flow_entered = false;
  units::VolumeFlow oxygen_flow = units::litres_per_minute(2.0);
};

// Inputs of the screens beyond the situation.
struct BagInputs {
  units::GaugePressure gauge = units::psi.gauge(2.0);  // bag pressure above ambient
  // How fast the team pumps and how long the casualty has been in: empty until entered (no
  // oxygen verdict without a flush, no session reminder without a time).
  bool flush_entered = false;
  units::VolumeFlow flush = units::litres_per_minute(40.0);  // meaningful only when entered
  bool time_entered = false;
  units::Duration time_in_bag = units::minutes(60.0);  // meaningful only when entered
  static constexpr double kMaxTimeMin = 600.0;  // the field's and the saved state's limit
  // The casualty's gas exchange (STPD) and the gas temperature inside: the bag model's defaults.
  units::VolumeFlow vco2 = units::litres_per_minute(hyperbaric_bag::rest_vco2_lpm);
  units::VolumeFlow vo2 = units::litres_per_minute(hyperbaric_bag::rest_vo2_lpm);
  units::Temperature chamber_temperature = units::celsius(hyperbaric_bag::default_chamber_c);
};

struct OxygenInputs {
  int cylinder_source = 0;  // 0 one of the team's types, 1 a US letter size, 2 a water capacity
  int team_type = 0;        // index into the team profile's cylinders
  int letter_size = 1;      // D, E, M, H
  units::Volume water_capacity = units::litres(2.0);
  // The gauge of the cylinder in hand: empty, and no duration, until someone reads it.
  bool gauge_entered = false;
  units::GaugePressure gauge = units::bar.gauge(200.0);  // meaningful only when gauge_entered
  std::int64_t gauge_read_at = 0;  // when the gauge was typed (s since 1970 UTC); 0: never
  // Empty until entered; counted at cylinder::assumed_temperature meanwhile (said on screen).
  bool temperature_entered = false;
  units::Temperature cylinder_temperature = cylinder::assumed_temperature;
  units::GaugePressure reserve = cylinder::default_reserve_gauge;  // the one default (model)
  // The planning flow (off oxygen), the cylinder count and the evacuation time: empty until
  // entered (no duration and no plan verdict from a flow or a carry-out nobody gave).
  bool flow_entered = false;
  units::VolumeFlow flow = units::litres_per_minute(4.0);
  static constexpr int kMaxCylinders = 20;  // the plan's stepper and saved-state limit
  bool count_entered = false;
  int cylinder_count = 1;
  bool evacuation_entered = false;
  units::Duration evacuation = units::hours(4.0);
  // A first phase at another flow: none until entered (a default one would change the verdict
  // either way, depending on the flow after it). Its flow is empty until entered too: a phase
  // given a time but no flow makes no plan.
  bool first_flow_entered = false;
  units::VolumeFlow first_flow = units::litres_per_minute(8.0);  // meaningful when entered
  units::Duration first_phase = units::hours(0.0);
};

// The Route screen: the carry-out being planned (the team's usual one until edited).
// ui/route_store.hpp keeps it on the device.
struct RouteState {
  route::RouteInput input;
  bool loaded = false;
  std::string saved_text;    // the route file last written (or found): written again only on change
  std::string refused_text;  // last not saved (storage refused, or no plan): not retried each frame
  FileExchange file;  // route file in and out; its message also says why a saved route was not read
  // Per stock cylinder: when its gauge was entered on this screen (s since 1970 UTC); 0 while it
  // is as a file or the profile gave it. The verdict waits until every gauge is read here.
  std::vector<std::int64_t> gauge_read_at;
};

// Each Lake Louise item 0–3, or kUnanswered until the casualty has answered it.
struct AmsInputs {
  static constexpr int kUnanswered = -1;
  int headache = kUnanswered;
  int gastrointestinal = kUnanswered;
  int fatigue = kUnanswered;
  int dizziness = kUnanswered;
  bool recent_ascent = true;
};

struct TeachingInputs {
  // Sea level to the highest summit (8,848.86 m, the 2020 China–Nepal survey), rounded up.
  static constexpr double kTopM = 8849.0;
  units::Length altitude = units::metres(4000.0);
  // Where the finger has put the slider's grab while it is down (ImGui moves it on the press);
  // the altitude follows once the finger slides sideways, or on a tap's release.
  std::optional<double> slider_metres;
};

// The Record screen: the incident's casualty record (ui/record_store.hpp keeps it) and the
// observation being written. Findings start empty: a value nobody entered is never saved.
struct RecordInputs {
  RecordStore store;
  bool loaded = false;
  std::optional<double> spo2_pct, heart_rate, breathing_rate;
  int on = -1;  // 0 air, 1 cannula, 2 mask, 3 non-rebreather; -1: take the last setting
  units::VolumeFlow flow = units::litres_per_minute(2.0);
  int avpu = -1;          // -1 not assessed
  int minutes_ago = 0;    // an entry written up late
  std::optional<size_t> correcting;  // the entry whose time the keypad corrects; none: the latest
  units::Duration check_interval = units::minutes(15.0);  // next SpO2 check
  bool confirm_new = false, confirm_delete = false;
  FileExchange file;  // import/export of the record file
};

// The in-app numeric keypad (the canvas cannot summon a phone keyboard). One field at a time.
struct Keypad {
  bool open = false;
  std::string field_id;
  std::string label;
  std::string hint;     // valid range, in the unit on the keys
  std::string text;     // what has been typed
  bool fresh = true;    // the first key replaces the shown value
  std::vector<std::string> unit_symbols;
  int unit_index = 0;
  bool committed = false;  // OK pressed: its field takes the text when drawn later this frame
  bool allow_negative = true;  // the − key: only for fields whose range goes below zero
  bool allow_decimal = true;   // the . key: only where a fraction of the unit means something
  std::string question;        // asked before OK applies (an altitude ten times the last one)
  bool confirmed = false;      // OK pressed with the question shown
};

// The team profile in use (ui/team_store.hpp keeps it on the device) and the Team screen.
struct TeamState {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  bool stored = false;         // saved on this device (false: the built-in demo, unsaved)
  bool backup_kept = false;    // an unreadable saved profile was kept as team-profile.json.bad
  FileExchange file;  // import/export of the profile file; its message also says print outcomes
  int card_size = 0;               // 0 A6, 1 wallet
};

struct AppState {
  Settings settings;
  Situation situation;
  BagInputs bag;
  OxygenInputs oxygen;
  RouteState route;
  AmsInputs ams;
  TeachingInputs teaching;
  TeamState team;
  RecordInputs record;
  Screen screen = Screen::Here;
  Keypad keypad;
  std::map<std::string, std::string> field_errors;  // field id → message naming range and unit
  std::string status_message;  // e.g. "saved state could not be read"
  bool caution_open = false;   // the "Read more" text below a result screen
  bool casualty_why_open = false;  // Casualty screen: the reasons and cautions under the verdict
  bool casualty_criteria_open = false;     // Casualty screen: the HAPE/HACE checklist
  illness_criteria::Findings criteria;     // what the medic ticked on it (this run only)
  bool press_scrolling = false;  // this press has become a scroll (ui/widgets.hpp)

  // Persistence: the JSON last written, so we only write when something changed.
  std::string saved_json;

  DisplayMetrics display;          // what the widgets read (ui/theme.hpp)
  float built_font_scale = 0.0f;  // the scale the fonts were built for
  bool wide_layout = false;      // two columns this frame

  // Set by a screen that shows a running timer: wake the idle app after this many seconds
  // (0: sleep until input). Cleared at the start of every frame.
  double wake_after_seconds = 0.0;

  int frames_drawn = 0;  // counted by draw_frame; tests read it to check idle frames
};

}  // namespace firn::ui
