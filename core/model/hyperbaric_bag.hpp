// Portable hyperbaric chamber ("bag"): the pressure inside, the altitude that pressure is
// equivalent to (the SAME atmosphere model inverted), the gas inside when the bag is flushed with
// fresh air (steady-state mass balance for CO2 and O2, optional oxygen feed), the altitude that
// gas is equivalent to, and the one verdict every surface shows (ok / flush more).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/latitude_month.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::hyperbaric_bag {

using units::Duration;
using units::Fraction;
using units::Length;
using units::GaugePressure;
using units::Pressure;
using units::Temperature;
using units::Volume;
using units::VolumeFlow;

// Validity of the settings.
inline constexpr double max_gauge_mbar = 250.0;  // devices run up to ~220 mbar (from memory)
// The bag gauge pressure (inside minus ambient) the model, the Bag screen and the record take.
inline constexpr units::Range<units::GaugePressureDimension> kGaugeRange{
    units::hectopascals.gauge(0.0), units::hectopascals.gauge(max_gauge_mbar), &units::hectopascals,
    "bag gauge pressure"};
inline constexpr double min_flush_lpm = 5.0, max_flush_lpm = 300.0;
inline constexpr double max_oxygen_feed_lpm = 15.0;
inline constexpr double min_bag_volume_l = 100.0, max_bag_volume_l = 2000.0;
inline constexpr double min_chamber_c = -30.0, max_chamber_c = 45.0;
inline constexpr units::Range<units::TemperatureDimension> kChamberTemperatureRange{
    units::celsius(min_chamber_c), units::celsius(max_chamber_c), &units::celsius,
    "chamber temperature"};
inline constexpr double min_co2_limit_pct = 0.1, max_co2_limit_pct = 5.0;
inline constexpr double min_stroke_l = 0.1, max_stroke_l = 10.0;
// The casualty's gas exchange, L/min STPD. Resting values FROM MEMORY (VCO2 0.20, VO2 0.25);
// shivering or distress raise them several times (shivering up to ~5x resting, from memory).
inline constexpr double rest_vco2_lpm = 0.20, rest_vo2_lpm = 0.25;
inline constexpr double min_vco2_lpm = 0.05, max_vco2_lpm = 2.0;
inline constexpr double min_vo2_lpm = 0.05, max_vo2_lpm = 2.5;
inline constexpr double default_co2_limit_pct = 1.0;  // steady-state CO2 (common practice)
inline constexpr double default_chamber_c = 20.0;     // assumption: warmed by the casualty
// Oxygen-enriched atmosphere: O2 above 23.5 % by volume, the threshold of fire-safety standards
// (NFPA 99, Health Care Facilities Code, definition of oxygen-enriched atmosphere).
inline constexpr double fire_risk_o2_fraction = 0.235;
// Ambient pressure where a person can be (as for station readings, atmosphere.hpp): below it the
// inspired PO2 outside is zero or less. ISA reaches it at about 13 600 m; West 1996 never does.
inline constexpr double min_ambient_hpa = 150.0;

struct Settings {
  // Latitude and month (NRLMSISE-00 table): when given, ambient pressure and every equivalent
  // altitude use it both ways, so a descent is in real metres for that place and season.
  std::optional<atmosphere::LatitudeMonth> where;
  GaugePressure gauge = units::psi.gauge(2.0);  // typical working pressure ~2 psi = 137.9 hPa
  // Fresh air pushed through the bag, litres per minute AT CHAMBER PRESSURE (the volume it
  // occupies inside). Absent: no gas balance, only pressures.
  std::optional<VolumeFlow> flush;
  // Oxygen fed into the bag, free-gas litres per minute (1 atm, 15 °C, as a flowmeter shows).
  VolumeFlow oxygen_feed = units::litres_per_minute(0.0);
  // ASSUMPTION: free gas volume of the bag around the casualty, ~480 L; enter the device's.
  Volume bag_volume = units::litres(480.0);
  Temperature chamber_temperature = units::celsius(default_chamber_c);
  Fraction co2_limit = units::percent(default_co2_limit_pct);
  // The casualty, STPD (0 °C, 101.325 kPa, dry); resting by default.
  VolumeFlow vco2_stpd = units::litres_per_minute(rest_vco2_lpm);
  VolumeFlow vo2_stpd = units::litres_per_minute(rest_vo2_lpm);
  // Pump stroke volume, litres of ambient air per stroke. Absent: no strokes per minute.
  std::optional<Volume> stroke_volume;
};

// Fresh air composition (dry): O2 20.95 % (common practice), CO2 0.04 % (from memory, ~420 ppm).
inline constexpr double air_o2_fraction = 0.2095;
inline constexpr double air_co2_fraction = 0.0004;

struct GasBalance {
  Fraction co2;              // steady-state dry fraction inside
  Fraction o2;
  Duration time_constant;    // bag volume / flush: 63 % of the way to steady state per constant
  VolumeFlow vco2_in_chamber;  // VCO2 converted to chamber pressure and temperature
  VolumeFlow flush_ambient_air;  // the same flush as ambient-pressure air (what the pump moves)
  std::optional<double> strokes_per_minute;
};

// ok: the flush keeps CO2 within the limit and the oxygen inside worth at least outside air.
// flush_more: CO2 above the limit, the oxygen inside worth less than outside, or no flush given.
enum class Verdict { Ok, FlushMore };
// Which equivalent altitude is the higher (the smaller descent): that one is the headline.
enum class Limit { Pressure, Oxygen };
std::string_view verdict_key(Verdict verdict);  // "ok" / "flush_more" (CLI JSON)
std::string_view limit_key(Limit limit);        // "pressure" / "oxygen" (CLI JSON)

struct BagResult {
  atmosphere::Model model;
  Pressure ambient_pressure;
  Length ambient_altitude;
  Pressure inside_pressure;            // ambient + gauge
  // The altitude whose ambient pressure equals the inside pressure (same model inverted). Absent
  // when the inside pressure is above the model's sea-level pressure ("below sea level").
  std::optional<Length> pressure_equivalent_altitude;
  // The altitude whose ambient dry air gives the PiO2 inside: FO2_inside·(P_inside − 47 mmHg) =
  // 0.2095·(PB(h) − 47 mmHg), same model inverted. Absent without a flush (the gas inside is not
  // known) and outside the model's altitudes (below sea level, or above its top).
  std::optional<Length> oxygen_equivalent_altitude;
  // The limiting figure: the higher of the two (without a flush, the pressure one).
  std::optional<Length> equivalent_altitude;
  Limit limited_by = Limit::Pressure;
  // ambient altitude − equivalent altitude; absent when the inside is no better than outside
  // (PiO2 inside at most PiO2 outside) or the equivalent altitude is absent.
  std::optional<Length> descent_equivalent;
  Verdict verdict = Verdict::FlushMore;
  Fraction co2_limit;                  // the limit judged against (from the settings)
  bool co2_above_limit = false;        // steady-state CO2 above the limit
  bool oxygen_below_outside = false;   // PiO2 inside below PiO2 outside
  // Smallest flush (chamber pressure, at least min_flush_lpm) that gives the verdict ok: CO2 at
  // most the limit and PiO2 inside at least outside. Absent when no flush can (no bag pressure).
  std::optional<VolumeFlow> required_flush;
  std::optional<double> required_flush_strokes_per_minute;
  // O2 inside above fire_risk_o2_fraction, or oxygen fed with no flush given (it accumulates).
  bool fire_risk = false;
  Fraction inside_o2;                  // 20.95 % without a flush; steady state with one
  Pressure pio2_ambient;               // FiO2·(PB − 47 mmHg) outside, dry air
  Pressure pio2_inside;                // inside, with inside_o2
  std::optional<GasBalance> gas;       // when a flush is given
  VolumeFlow min_flush;                // fresh air (chamber pressure) for the CO2 limit
  std::optional<double> min_flush_strokes_per_minute;
  std::vector<std::string> notes;      // assumptions and explanations to show with the result
};

// How every surface rounds the bag's figures, as the verdict does: less descent claimed. An
// equivalent altitude up, a descent down, to whole `step`s of `unit` (the card: 10 m / 50 ft).
double altitude_rounded_up(units::Length altitude, const units::Unit<units::LengthDimension>& unit,
                           double step = 1.0);
double descent_rounded_down(units::Length descent, const units::Unit<units::LengthDimension>& unit,
                            double step = 1.0);

// The verdict in words for every surface, altitudes in `unit`: "Flush more: at least 24 L/min,
// or 14 strokes/min" / "Descent equivalent 1280 m (to 2720 m); the oxygen inside limits it".
std::string verdict_text(const BagResult& r, const units::Unit<units::LengthDimension>& unit);
// Why the verdict is flush_more, in a sentence (empty when ok).
std::string flush_more_reason(const BagResult& r);
// The fire caution (empty without fire risk).
std::string fire_caution_text(const BagResult& r);

// Where a bag can be computed: the model's altitudes whose pressure is at least min_ambient_hpa,
// and those pressures (rounded inward to 0.1 hPa).
units::Range<units::LengthDimension> altitude_range(atmosphere::Model model);
units::Range<units::PressureDimension> ambient_pressure_range(atmosphere::Model model);

// Ambient from an altitude by `model`; the same model gives the equivalent altitude. The altitude
// must be in altitude_range(model).
Result<BagResult> bag_at_altitude(Length ambient_altitude, atmosphere::Model model,
                                  const Settings& settings);
// Ambient from a barometer (station reading); the ambient altitude is then `model` inverted.
// Valid from min_ambient_hpa to the model's sea-level-range pressure.
Result<BagResult> bag_at_pressure(Pressure ambient_pressure, atmosphere::Model model,
                                  const Settings& settings);

}  // namespace firn::hyperbaric_bag
