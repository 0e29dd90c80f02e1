// Oxygen along an evacuation route: the flow a casualty needs on each leg of a carry-out (carry,
// wait, bag session, flight), the oxygen each leg uses, and whether the team's mixed cylinders
// last to arrival with a safety margin (docs/route-plan.md).
//
// Pure data in, pure data out. Per leg the flow comes from supplemental_oxygen (lowest flow for the
// target at the pressure of the leg's HIGHEST point); the cylinder timeline, swaps and the verdict
// come from evacuation::plan_evacuation (one flow phase per leg), so a flat route gives exactly the
// plan's answer. Durations round down, flows round up, shortfalls round up.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/cylinder.hpp"
#include "model/evacuation_plan.hpp"
#include "model/expected_spo2.hpp"
#include "model/result.hpp"
#include "model/supplemental_oxygen.hpp"
#include "model/units.hpp"

namespace firn::route {

using units::Duration;
using units::Fraction;
using units::Length;
using units::GaugePressure;
using units::Pressure;
using units::Temperature;
using units::Volume;
using units::VolumeFlow;

enum class LegKind {
  Carry,   // carried or walking: altitude changes linearly from start to end
  Wait,    // at one altitude (a hut, a landing site)
  Bag,     // a hyperbaric bag session: no mask; oxygen only if fed into the bag
  Flight,  // unpressurised, the whole leg counted at the cruising altitude
};
std::string_view leg_kind_key(LegKind kind);  // "carry", "wait", "bag", "flight"

// Valid ranges (the route file's messages and docs/route-plan.md quote them).
struct Limits {
  static constexpr std::size_t legs_max = 16;
  static constexpr double altitude_low_m = 0.0, altitude_high_m = 9000.0;
  static constexpr double leg_low_min = 1.0, leg_high_h = 24.0;
  static constexpr double route_high_h = 48.0;
  static constexpr double margin_low_min = 0.0, margin_high_h = 12.0;
  static constexpr double target_low_pct = 80.0, target_high_pct = 99.0;
  static constexpr double measured_low_pct = 30.0, measured_high_pct = 100.0;
  static constexpr double second_flow_high_lpm = 15.0;  // 0 = no second consumer
  static constexpr std::size_t cylinders_max = 40;
  static constexpr double bag_feed_high_lpm = 15.0;
  static constexpr std::size_t flow_steps_max = 12;
};

// One stretch of the route.
struct Leg {
  LegKind kind = LegKind::Carry;
  std::string label;          // "up to the col"
  Length start_altitude;      // a flight: its cruising altitude (start = end)
  Length end_altitude;
  Duration duration;
  std::optional<VolumeFlow> fixed_flow;  // set by hand: not computed from the target
  // Bag legs: oxygen fed into the bag (free gas), and the fresh-air flush that carries it.
  VolumeFlow bag_oxygen_feed = units::litres_per_minute(0.0);
  std::optional<VolumeFlow> bag_flush;
  bool operator==(const Leg&) const = default;
};

struct Casualty {
  // SpO2 measured on air at a known altitude: compared with the healthy band there (and the point
  // where an individual estimate plugs in, see casualty_need). Absent: not measured.
  std::optional<Fraction> measured_spo2_on_air;
  std::optional<Length> measured_at;
  cascade::Exposure exposure = cascade::Exposure::Acute;  // acute predicts less oxygen
  Fraction target = units::percent(supplemental_oxygen::kDefaultTargetPercent);
  supplemental_oxygen::Device device = supplemental_oxygen::Device::NasalCannula;
  bool operator==(const Casualty&) const = default;
};

// One cylinder on hand (its type from the team profile).
struct StockCylinder {
  std::string label;        // "#1 2 L alloy"
  std::string type_label;   // "2 L alloy"
  Volume water_capacity;
  GaugePressure gauge;      // as read now, at the route's start altitude
  Temperature temperature = cylinder::assumed_temperature;
  bool operator==(const StockCylinder&) const = default;
};

struct Stock {
  std::vector<StockCylinder> cylinders;      // used in this order
  GaugePressure reserve_gauge = units::bar.gauge(20.0);
  Duration margin = units::minutes(30.0);     // oxygen to hold beyond arrival
  // A second casualty or a crew member drawing from the same stock for the whole route.
  VolumeFlow second_flow = units::litres_per_minute(0.0);
  std::string second_who;                     // "crew member"
  // Shortfalls and spares are counted in full cylinders of this type.
  std::string count_in_label;
  Volume count_in_water_capacity;
  GaugePressure count_in_fill_gauge;
  bool operator==(const Stock&) const = default;
};

struct RouteInput {
  std::string name;
  bool demo = false;  // shipped demo data: every output says so
  Casualty casualty;
  std::vector<Leg> legs;
  Stock stock;
  atmosphere::Model model = atmosphere::default_medical_model;
  // The team's flowmeter settings: needed flows round UP to the next one the device accepts.
  // Empty: 0.5 L/min steps (supplemental_oxygen's rounding).
  std::vector<VolumeFlow> flow_steps;
  std::optional<int> start_clock_min;  // minutes after midnight: swap times as clock times
  // Hyperbaric bag settings for bag legs (the team profile's bag gauge pressure).
  GaugePressure bag_gauge = units::psi.gauge(2.0);
  bool operator==(const RouteInput&) const = default;
};

// [SECTION] The casualty's need at one pressure: the one place an individual estimate plugs in.

struct Need {
  bool on_air_reaches_target = false;
  bool reachable = true;                 // the target is reachable with the device
  VolumeFlow flow;                       // needed (rounded up to a step), or the device maximum
  expected_spo2::Band on_air;            // predicted on air
  expected_spo2::Band at_flow;           // predicted at `flow`
  bool extrapolated = false;
};
// Today: the healthy-lowlander band (supplemental_oxygen::lowest_flow_for_target); an individual
// estimate from the SpO2 measured on air replaces the body of this function alone.
inline constexpr std::string_view kEstimateKind =
    "healthy-lowlander estimate (no individual correction yet): titrate to the oximeter";
Result<Need> casualty_need(const Casualty& casualty, Pressure barometric,
                           const std::vector<VolumeFlow>& flow_steps);

// [SECTION] The plan.

struct LegResult {
  Leg leg;
  Duration start;                // from the route's start
  Length highest;                // the leg's highest point
  Pressure pressure;             // ambient at the highest point
  Pressure pio2;                 // on air at the highest point
  std::optional<Pressure> bag_inside_pressure;  // bag legs
  expected_spo2::Band spo2_on_air;
  expected_spo2::Band spo2_at_flow;  // at the planned flow (in a bag: inside the bag)
  std::optional<VolumeFlow> needed_flow;  // for the target (absent on bag legs)
  VolumeFlow flow;               // planned for the casualty: needed, or fixed by hand, or bag feed
  bool fixed_by_hand = false;
  bool target_reachable = true;
  bool extrapolated = false;
  Volume oxygen_used;            // casualty + second consumer, free gas
};

struct Swap {
  Duration time;                 // rounded down (an earlier swap is the safe side)
  std::size_t from, to;          // indices into stock.cylinders
};

struct CylinderSpan {
  std::size_t cylinder;
  Duration start, end;
  GaugePressure start_gauge, end_gauge;
  bool reached_reserve;
};

struct RoutePlan {
  std::vector<LegResult> legs;
  Duration route_time;
  Length highest_altitude;
  std::size_t highest_leg = 0;
  std::vector<CylinderSpan> spans;
  std::vector<Swap> swaps;
  std::optional<Duration> reserve_reached;  // when the whole stock reaches the reserve (floor)
  bool enough = false;                      // lasts to arrival + margin
  Duration spare;                           // beyond the margin at the highest flow (floor)
  Duration shortfall;                       // (ceil)
  int extra_cylinders = 0;                  // of the count-in type
  Volume oxygen_needed, oxygen_usable;
  VolumeFlow max_steady_flow;               // one flow on every non-bag leg, margin kept (floor)
  bool max_steady_flow_in_device_range = false;
  std::string verdict;                      // "enough, 40 min spare beyond the 30 min margin"
  std::vector<std::string> cautions;        // the leader's warnings, most important first
  std::vector<std::string> assumptions;
};

Result<RoutePlan> plan_route(const RouteInput& input);

// "07:30" for minutes after midnight plus an offset (wraps past midnight).
std::string clock_text(int start_clock_min, Duration offset);

}  // namespace firn::route
