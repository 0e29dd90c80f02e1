// Oxygen for an evacuation: a set of cylinders used one after another against a schedule of flow
// phases ("15 L/min for 1 h, then 6 L/min"). Gives a timeline (which cylinder is in use when,
// swap times, when the reserve is reached), pressure-vs-time samples for a plot, and the
// shortfall or spare in minutes and in cylinders of a chosen size.
//
// Pure data in, pure data out: the team-profile file parser and `firn plan` build PlanInput.
// Assumptions (documented in docs/oxygen-supply.md): cylinders are used in the order given, each
// down to the reserve pressure, swaps take no time; each cylinder stays at its own temperature
// (no cooling from expansion); flows are free-gas litres per minute (see cylinder.hpp).
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "model/cylinder.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::evacuation {

using units::Duration;
using units::GaugePressure;
using units::Pressure;
using units::Temperature;
using units::Volume;
using units::VolumeFlow;

// One cylinder the team carries. Give a water capacity, or a US letter size (its water
// capacity is then the from-memory value in cylinder::letter_size_info); a water capacity wins
// when both are given.
struct CylinderSpec {
  std::string label;                                  // "Cyl 1", "E-07"
  std::optional<cylinder::LetterSize> letter_size;
  std::optional<Volume> water_capacity;
  GaugePressure gauge_pressure;                       // as read on the gauge now
  Temperature temperature = cylinder::assumed_temperature;     // of the cylinder
};

// A flow held for a while. The LAST phase's flow continues until the end of the evacuation (and
// beyond, when the spare time is computed), so "15 L/min for 1 h, then 6 L/min" is two phases,
// the second without a duration.
struct FlowPhase {
  VolumeFlow flow;                   // free gas: 0 (oxygen off) or 0.1…30 L/min
  std::optional<Duration> duration;  // 1 min…72 h, required but for the last (open-ended) phase
};

// Default safety margin: the larger of 30 min and 20 % of the evacuation time. A fixed part covers
// one delay that does not scale with the carry (a jammed regulator, waiting at a landing site); the
// share covers the time estimate itself, which is less sure the longer the carry. Our choice, not
// a published figure; a team profile may set its own (docs/team-profile.md).
inline constexpr Duration default_margin_minimum = units::minutes(30.0);
inline constexpr double default_margin_fraction = 0.20;
inline constexpr double max_margin_fraction = 1.0;
inline constexpr double max_margin_minimum_min = 12.0 * 60.0;

struct PlanInput {
  std::vector<CylinderSpec> cylinders;  // used in this order; 1…50
  std::vector<FlowPhase> phases;        // 1…20
  Duration evacuation;                  // total time to deliver the casualty, 1 min…72 h
  GaugePressure reserve_gauge = cylinder::default_reserve_gauge;  // swap when a cylinder reaches this
  Pressure ambient_pressure = units::atmospheres(1.0);  // gauges read relative to this
  // The cylinder the shortfall / spare is counted in ("you need 2 more E cylinders"); a full one
  // of this spec (a letter size with gauge_pressure left at 0 means full at its service pressure).
  // When absent: the first listed cylinder filled above the reserve, as it is now.
  std::optional<CylinderSpec> counting_cylinder;
  Duration sample_interval = units::minutes(5.0);  // pressure-vs-time spacing (1 min…1 h)
  // "Enough" only with a margin: the larger of a fixed time and a share of the evacuation time
  // (defaults below; a team profile may set its own).
  Duration margin_minimum = default_margin_minimum;
  double margin_fraction = default_margin_fraction;
  // Unit of the gauge pressures in the plan's texts (a US team reads psi): bar or psi.
  const units::Unit<units::PressureDimension>* pressure_unit = &units::bar;
};

// A stretch of time during which one cylinder supplies the casualty.
struct CylinderUse {
  std::size_t cylinder_index;  // into PlanInput::cylinders
  std::string label;
  Duration start;
  Duration end;
  GaugePressure start_gauge;
  GaugePressure end_gauge;
  Volume delivered;           // free gas
  bool reached_reserve;       // false: the evacuation ended while it was in use
};

enum class EventKind {
  Start,          // first cylinder opened
  FlowChange,     // a new flow phase starts
  Swap,           // a cylinder reached the reserve; the next one is opened
  Reserve,        // the last cylinder reached the reserve: no oxygen above reserve left
  Arrival,        // end of the evacuation
};

struct PlanEvent {
  Duration time;
  EventKind kind;
  std::size_t cylinder_index;  // cylinder in use (after a swap: the new one)
  std::string text;            // "Swap Cyl 1 → Cyl 2 (Cyl 1 at reserve 200 psi)"
};

struct PressureSample {
  Duration time;
  std::size_t cylinder_index;
  GaugePressure gauge;
  VolumeFlow flow;
};

// Enough only with the margin; an extrapolated figure never says enough.
enum class Verdict {
  Enough,        // lasts until arrival + margin
  BelowMargin,   // lasts until arrival, but not the margin beyond it
  Short,         // runs out before arrival
  Extrapolated,  // would not be short, but a cylinder's figure is extrapolated (> 300 K)
};

struct EvacuationPlan {
  std::vector<CylinderUse> uses;        // in time order
  std::vector<PlanEvent> events;        // in time order
  std::vector<PressureSample> samples;  // in time order; every interval plus every event time
  Volume oxygen_needed;                 // free gas the schedule asks for over the evacuation
  Volume oxygen_usable;                 // free gas above reserve in all cylinders
  // How long the usable oxygen lasts on this schedule (the last flow continuing). Equal to or
  // longer than `evacuation` when there is enough. Absent when the flow ends at zero and the
  // oxygen never runs out.
  std::optional<Duration> supply_lasts;
  bool enough;                          // oxygen_usable ≥ oxygen_needed (no margin: see verdict)
  Duration shortfall;                   // evacuation time without oxygen above reserve (0 if enough)
  Duration spare;                       // extra time at the final flow (0 if short)
  Volume shortfall_volume;              // free gas missing (0 if enough)
  Volume spare_volume;                  // free gas left above reserve at arrival (0 if short)
  Volume counting_cylinder_usable;      // free gas above reserve in one counting cylinder
  int extra_cylinders_needed;           // ceil(shortfall_volume / counting usable); 0 if enough
  double spare_cylinders;               // spare_volume / counting usable (fractional)
  std::vector<std::string> assumptions;  // shown with the plan

  // The verdict (one function decides it; CLI, screen and card show it):
  Duration margin;                      // max(margin_minimum, margin_fraction × evacuation)
  bool extrapolated = false;            // some cylinder above the EOS's published 300 K
  Verdict verdict = Verdict::Short;
  // The reverse question: the steady flow at which the usable oxygen lasts until arrival with the
  // margin kept (and without it), rounded DOWN to 0.1 L/min. Absent below 0.1 L/min.
  std::optional<VolumeFlow> max_sustainable_flow;
  std::optional<VolumeFlow> max_flow_to_arrival;
};

Result<EvacuationPlan> plan_evacuation(const PlanInput& input);

// "enough", "below_margin", "short", "extrapolated": for JSON.
std::string_view verdict_key(Verdict verdict);
// One line for a screen or a table: "Enough with the 1 h 12 min margin: 2 h 5 min spare",
// "Short by 1 h 15 min", "Arrives with 20 min spare: less than the 1 h 12 min margin".
// Durations in whole minutes: spare rounded down, shortfall up.
std::string verdict_text(const EvacuationPlan& plan);

// Text for an event kind ("swap", "reserve" …), for JSON and tables.
std::string_view event_key(EventKind kind);

}  // namespace firn::evacuation
