// Oxygen cylinders: contents as free gas, duration to a reserve pressure, the US field rule for
// letter sizes, and how flow devices behave at altitude.
//
// "Free gas" is the volume the oxygen would fill at the reference state 101.325 kPa and 15 °C
// (the state cylinder contents are usually quoted in). Contents are computed with the oxygen
// reference equation of state (model/oxygen_eos.hpp), from the gauge reading AND the cylinder
// temperature: a cold cylinder reads a lower gauge pressure with the same contents.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::cylinder {

using units::Duration;
using units::GaugePressure;
using units::Pressure;
using units::Temperature;
using units::Volume;
using units::VolumeFlow;

// Reference state of "free gas" litres.
inline constexpr Pressure reference_pressure = units::kilopascals(101.325);
inline constexpr Temperature reference_temperature = units::celsius(15.0);

// Validity of the inputs (the equation of state is used over −50…+65 °C, up to 400 bar absolute).
inline constexpr double min_water_capacity_l = 0.1, max_water_capacity_l = 100.0;
inline constexpr double max_gauge_bar = 350.0;  // highest fill in use is 300 bar
inline constexpr double min_temperature_c = -40.0, max_temperature_c = 60.0;
inline constexpr double min_flow_lpm = 0.1, max_flow_lpm = 30.0;  // a flowmeter's range
// Ambient (absolute) pressure the gauge is referenced to: 150…1100 hPa (sea level to above
// Everest's summit).
inline constexpr double min_ambient_hpa = 150.0, max_ambient_hpa = 1100.0;
// The same limits as ranges, for the one check and for the screens' fields.
inline constexpr units::Range<units::VolumeDimension> kWaterCapacityRange{
    units::litres(min_water_capacity_l), units::litres(max_water_capacity_l), &units::litres,
    "water capacity"};
inline constexpr units::Range<units::GaugePressureDimension> kGaugeRange{
    units::bar.gauge(0.0), units::bar.gauge(max_gauge_bar), &units::bar, "cylinder pressure (gauge)"};
inline constexpr units::Range<units::TemperatureDimension> kTemperatureRange{
    units::celsius(min_temperature_c), units::celsius(max_temperature_c), &units::celsius,
    "cylinder temperature"};
inline constexpr units::Range<units::PressureDimension> kAmbientRange{
    units::hectopascals(min_ambient_hpa), units::hectopascals(max_ambient_hpa), &units::hectopascals,
    "ambient pressure"};
inline constexpr units::Range<units::VolumeFlowDimension> kFlowRange{
    units::litres_per_minute(min_flow_lpm), units::litres_per_minute(max_flow_lpm),
    &units::litres_per_minute, "flow"};

// US letter sizes (aluminium / steel medical cylinders as sold in the US).
enum class LetterSize { D, E, M, H };

struct LetterSizeInfo {
  LetterSize size;
  std::string_view name;  // "D"
  // US field rule factor (common practice in EMS references): minutes = (psi − 200)·factor / flow.
  double field_factor;
  // Internal (water) volume, litres: FROM MEMORY (typical US cylinders; check the cylinder label).
  Volume water_capacity;
  // Typical full service pressure: 2015 psi for D/E/M aluminium, 2200 psi for steel H (from memory).
  GaugePressure full_gauge;
  // Nominal contents printed for the size, free-gas litres (from memory).
  Volume nominal_contents;
};

LetterSizeInfo letter_size_info(LetterSize size);
Result<LetterSize> parse_letter_size(std::string_view text);  // "D", "e", …

// Residual pressure the US field rule assumes ("safe residual", common practice).
inline constexpr GaugePressure field_rule_residual_gauge = units::psi.gauge(200.0);

// The one default reserve (swap-at) gauge pressure: the CLI, the app and a team profile without
// its own use it. 20 bar (290 psi) is above the field rule's 200 psi, so it gives the shorter time,
// and keeps a cylinder from being run empty (moist air gets in): common practice, our choice.
inline constexpr GaugePressure default_reserve_gauge = units::bar.gauge(20.0);
inline constexpr double max_reserve_bar = 100.0;  // a reserve above this is a typing slip
inline constexpr units::Range<units::GaugePressureDimension> kReserveRange{
    units::bar.gauge(0.0), units::bar.gauge(max_reserve_bar), &units::bar, "reserve pressure (gauge)"};

// Letter-size water capacities are typical values FROM MEMORY; D and E in particular vary by
// maker (steel or aluminium, 2.1…3.0 L and 4.1…4.8 L). The sentence shown wherever one is used.
std::string letter_size_assumption(LetterSize size);

// A cylinder whose temperature nobody gave is counted at 15 °C, the reference temperature fill
// pressures are quoted at (from memory): a cylinder carried outside at altitude is colder and
// holds more at the same gauge, so the figures err short there. The CLI, the team profile and
// the app use this one value, and say so beside the result.
inline constexpr units::Temperature assumed_temperature = units::celsius(15.0);

// The temperature correction is right only once the gas has reached that temperature.
inline constexpr std::string_view temperature_advice =
    "The temperature correction holds only once the cylinder has reached that temperature "
    "(hours outside, not minutes); when unsure, enter the warmer one: it gives less gas.";
// A cold temperature that raises the contents by more than this (vs the same gauge at 15 °C) is
// called out beside the result.
inline constexpr double cold_gain_caution_fraction = 0.03;

// Shown when the gauge is at or below the reserve.
inline constexpr std::string_view below_reserve_text = "Below the reserve: change the cylinder now";

// A cylinder as read in the field.
struct Reading {
  Volume water_capacity;
  GaugePressure gauge_pressure;                 // above ambient, as the gauge shows it
  Temperature temperature = units::celsius(15.0);  // of the cylinder (the gas in it)
  Pressure ambient_pressure = units::atmospheres(1.0);  // a gauge reads relative to this
};

struct Contents {
  Volume free_gas;           // real gas, by the equation of state
  Volume ideal_free_gas;     // water capacity × absolute pressure / reference, same temperature
                             // correction, no compressibility: shown beside it for teaching
  double z_in_cylinder;      // compressibility at cylinder temperature and absolute pressure
  double z_reference;        // compressibility at 101.325 kPa, 15 °C (≈ 0.9992)
  Pressure absolute_pressure;
  // Above the equation of state's published 300 K (oxygen_eos::extrapolated): no "enough" from it.
  bool extrapolated = false;
  // Extra gas the temperature correction claims: contents / contents of the same gauge at 15 °C
  // − 1 (0 at 15 °C and warmer). Above cold_gain_caution_fraction, temperature_caution() speaks.
  double cold_gain = 0.0;
};

Result<Contents> contents(const Reading& reading);

// The gauge pressure at which the cylinder holds `free_gas` (inverse of contents(), by
// bisection). Used for reserve pressures and for pressure-vs-time curves.
Result<GaugePressure> gauge_pressure_for(Volume water_capacity, Temperature temperature,
                                    Pressure ambient_pressure, Volume free_gas);

struct DurationEstimate {
  Duration to_reserve;      // (contents − contents at reserve) / flow; 0 when below_reserve
  Volume usable_free_gas;   // contents above the reserve
  Volume reserve_free_gas;  // contents left at the reserve pressure
  Contents contents;
  bool below_reserve = false;  // gauge at or below the reserve: below_reserve_text
};

// Flow is free-gas litres per minute (what a flowmeter calibrated at 1 atm means; see the flow
// corrections below for altitude). Flow must be > 0 and ≤ 30 L/min; the reserve is a gauge
// pressure 0…max_reserve_bar. A reading at or below the reserve is a result (below_reserve), not
// an error: it is what the medic must be told.
Result<DurationEstimate> duration(const Reading& reading, GaugePressure reserve_gauge, VolumeFlow flow);

// "At −20 °C this reading means 24 % more oxygen than at 15 °C…", when cold_gain is above
// cold_gain_caution_fraction; "extrapolated…" above 300 K. Empty when there is nothing to say.
std::vector<std::string> temperature_cautions(const Contents& contents, Temperature temperature);

// [SECTION] Conservative figures: one rounding for the CLI, the screens and the card.

// Whole minutes, rounded down (a duration the oxygen lasts) or up (a time without oxygen). A
// billionth of a minute of slack keeps 50.0000000001 at 50.
Duration whole_minutes_down(Duration d);
Duration whole_minutes_up(Duration d);

// Which estimate leads when the real-gas duration and the US field rule differ: the lower one.
enum class DurationBasis { RealGas, FieldRule };
struct LeadingDuration {
  Duration duration;     // whole minutes, rounded down
  DurationBasis basis;
  std::string why;       // "the US field rule gives less (its nominal capacities are conservative)"
};
LeadingDuration leading_duration(const DurationEstimate& real_gas,
                                 const std::optional<Duration>& field_rule);

// US field rule: minutes = (psi − 200) × factor / flow. Gauge 200…3000 psi.
Result<Duration> field_rule_duration(LetterSize size, GaugePressure gauge, VolumeFlow flow);

// [SECTION] Flow devices at altitude. Returned as explained corrections: the number AND the reason.

struct FlowCorrection {
  VolumeFlow set_flow;              // what the device is set to / indicates
  VolumeFlow actual_at_ambient;     // litres per minute at the ambient pressure (what the
                                    // patient's mask receives, by volume)
  VolumeFlow actual_free_gas;       // the same flow as free gas at 1 atm (what the cylinder loses)
  double ratio;                     // actual_free_gas / set_flow
  std::string explanation;
};

// A rotameter (float in a tapered tube) calibrated at `calibration` (usually 1 atm) reads low
// at lower ambient pressure: actual ≈ indicated·√(P_cal/P_ambient) by volume at ambient
// (rotameter density correction, manufacturers' technical notes); as free gas that is
// indicated·√(P_ambient/P_cal).
Result<FlowCorrection> rotameter_at_altitude(VolumeFlow indicated, Pressure ambient,
                                             Pressure calibration = units::atmospheres(1.0));

// A fixed-orifice (choked) regulator set to `nominal` with its regulated pressure referenced to
// ambient: mass flow ∝ absolute upstream pressure = regulated gauge + ambient, so free-gas flow
// falls by (P_reg + P_ambient)/(P_reg + P_cal). Derived from choked-flow physics; no published
// measurement known. The regulated pressure is typically ~50 psi gauge (from memory).
Result<FlowCorrection> fixed_orifice_at_altitude(
    VolumeFlow nominal, Pressure ambient, GaugePressure regulated_gauge = units::psi.gauge(50.0),
    Pressure calibration = units::atmospheres(1.0));

}  // namespace firn::cylinder
