// A rescue team's own setup: units, card altitudes, cylinders, flows, bag and evacuation plan.
// Read from / written to one JSON file with a schema version (docs/team-profile.md). Parsing
// either yields a whole, valid profile or a list of problems naming field, value and valid
// range: nothing is ever half-applied. Older schema versions are migrated on read.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/cylinder.hpp"
#include "model/evacuation_plan.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::team_profile {

using units::Duration;
using units::Fraction;
using units::Length;
using units::GaugePressure;
using units::Pressure;
using units::Temperature;
using units::Volume;
using units::VolumeFlow;

inline constexpr int current_schema_version = 2;

// How the card and the plan print quantities: metric (m, bar, °C) or US (ft, psi, °F).
enum class UnitSystem { Metric, Us };

using cylinder::LetterSize;  // US letter sizes D, E, M, H (model/cylinder.hpp)

// One kind of cylinder the team carries. A letter size without a water capacity uses the
// cylinder model's (from-memory) capacity for that size.
struct CylinderType {
  std::string label;                        // "2 L alloy", "D"
  std::optional<LetterSize> letter_size;    // US size, and/or…
  std::optional<Volume> water_capacity;     // …water capacity (at least one is set)
  GaugePressure fill_pressure_gauge;        // full-cylinder gauge pressure
  int count = 1;                            // how many the team has

  bool operator==(const CylinderType&) const = default;
};

// A flow held for a time; the last phase of a plan may run to the end of the evacuation.
struct FlowPhase {
  VolumeFlow flow;
  std::optional<Duration> duration;  // nullopt: until the end of the evacuation

  bool operator==(const FlowPhase&) const = default;
};

// A cylinder actually on hand at an incident, as read from its gauge.
struct CylinderOnHand {
  std::string type_label;        // refers to CylinderType::label
  GaugePressure pressure_gauge;
  Temperature temperature;

  bool operator==(const CylinderOnHand&) const = default;
};

// The profile's evacuation section (a team's usual carry-out); evacuation_plan.hpp's
// EvacuationPlan is the result of planning one.
struct EvacuationSection {
  Duration evacuation_time;
  std::optional<Length> altitude;         // where the gauges are read; nullopt: sea level
  std::vector<CylinderOnHand> cylinders;  // used in this order
  std::vector<FlowPhase> phases;
  std::string shortfall_type_label;       // express a shortfall/spare in cylinders of this type

  bool operator==(const EvacuationSection&) const = default;
};

struct CardLayout {
  Length altitude_from;
  Length altitude_to;
  Length altitude_step;
  std::vector<std::string> notes;  // the team's own lines, printed on the card

  bool operator==(const CardLayout&) const = default;
};

struct BagSetup {
  GaugePressure gauge_pressure;  // inside minus ambient
  Volume pump_stroke_volume;
  Fraction co2_limit;            // steady-state CO2 fraction not to exceed

  bool operator==(const BagSetup&) const = default;
};

// How much oxygen beyond the arrival time a plan must keep before it says "enough": the larger of
// `minimum` and `share` of the evacuation time (defaults and why: model/evacuation_plan.hpp).
struct SafetyMargin {
  Duration minimum = evacuation::default_margin_minimum;
  Fraction share = units::fraction(evacuation::default_margin_fraction);

  bool operator==(const SafetyMargin&) const = default;
};

struct TeamProfile {
  bool demo = false;  // shipped demo data: the card and the app say so
  std::string team_name;
  UnitSystem units = UnitSystem::Metric;
  atmosphere::Model atmosphere_model = atmosphere::default_medical_model;
  CardLayout card;
  std::vector<CylinderType> cylinders;
  // Optional in the file: cylinder::default_reserve_gauge, the one default of the CLI and the app.
  GaugePressure reserve_pressure_gauge = cylinder::default_reserve_gauge;
  SafetyMargin safety_margin;  // optional in the file
  std::vector<VolumeFlow> flows;
  BagSetup bag;
  std::optional<EvacuationSection> evacuation;

  const CylinderType* find_cylinder(std::string_view label) const;  // nullptr when absent
  std::vector<Length> card_altitudes() const;  // from, from+step, … ≤ to

  bool operator==(const TeamProfile&) const = default;
};

// [SECTION] Valid ranges (also in docs/team-profile.md; messages quote them).
struct Limits {
  static constexpr size_t team_name_max_chars = 60;
  static constexpr double card_altitude_low_m = 0.0, card_altitude_high_m = 9000.0;
  static constexpr double card_step_low_m = 50.0, card_step_high_m = 1000.0;
  static constexpr size_t card_rows_max = 40;
  static constexpr size_t note_lines_max = 6, note_chars_max = 90;
  static constexpr size_t cylinder_types_max = 8;
  static constexpr size_t label_chars_max = 24;
  static constexpr double water_capacity_low_l = 0.5, water_capacity_high_l = 50.0;
  static constexpr double fill_pressure_low_bar = 50.0, fill_pressure_high_bar = 300.0;
  static constexpr int count_low = 0, count_high = 99;
  static constexpr double reserve_low_bar = 0.0, reserve_high_bar = cylinder::max_reserve_bar;
  static constexpr double margin_minimum_low_min = 0.0;
  static constexpr double margin_minimum_high_min = evacuation::max_margin_minimum_min;
  static constexpr double margin_share_low_pct = 0.0;
  static constexpr double margin_share_high_pct = evacuation::max_margin_fraction * 100.0;
  static constexpr size_t flows_max = 8;
  static constexpr double flow_low_lpm = 0.25, flow_high_lpm = 25.0;
  static constexpr double bag_gauge_low_hpa = 50.0;
  static constexpr double bag_gauge_high_hpa = hyperbaric_bag::max_gauge_mbar;
  static constexpr double stroke_low_l = 0.1, stroke_high_l = 10.0;
  static constexpr double co2_limit_low_pct = 0.2, co2_limit_high_pct = 3.0;
  static constexpr double evacuation_low_h = 0.25, evacuation_high_h = 72.0;
  static constexpr size_t cylinders_on_hand_max = 40, phases_max = 12;
  static constexpr double on_hand_pressure_low_bar = 0.0, on_hand_pressure_high_bar = 300.0;
  static constexpr double temperature_low_c = cylinder::min_temperature_c;
  static constexpr double temperature_high_c = cylinder::max_temperature_c;
};

// Every problem found in a profile file, each naming field path, value and valid range:
// "cylinders[2].fill_pressure: 450 bar is outside 50…300 bar".
struct Problems {
  std::vector<std::string> lines;
  bool empty() const { return lines.empty(); }
  std::string joined(std::string_view separator = "; ") const;
};

// Parses profile JSON text of any supported schema version (1 or 2). On failure the Error's
// message lists every problem, separated by "; ".
Result<TeamProfile> parse_profile(std::string_view json_text);
// The same, returning every problem separately (for `firn profile --check` and the UI).
Problems check_profile(std::string_view json_text);

// Upgrades the JSON text of an older schema to the current one (v1 → v2), as JSON text.
// Version 1 (Firn 0.0.x) used bare numbers with the unit in the key ("fill_pressure_bar").
Result<std::string> migrate_to_current(std::string_view json_text);

// Current-schema JSON text (2-space indent) that parse_profile reads back to an equal profile.
std::string serialize_profile(const TeamProfile& profile);

// The demo team (fictional team and range, marked demo). Same text as assets/demo-profile.json.
std::string_view demo_profile_json();
TeamProfile demo_profile();

// The evacuation plan the profile's evacuation section describes: each cylinder on hand with its
// type, the flow phases, the reserve and margin, the ambient pressure from `measured_ambient`
// when given (the gauges' reference where they are read) else from evacuation.altitude. An
// error when the section is missing. The CLI's `firn plan` and the app take the same input.
Result<evacuation::PlanInput> plan_input(const TeamProfile& profile,
                                         std::optional<Pressure> measured_ambient = std::nullopt);

}  // namespace firn::team_profile
