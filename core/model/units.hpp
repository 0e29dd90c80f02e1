// Quantities with their units in the type. A value is made from a named unit and read back only
// through a named unit:  Length h = metres(4000);  double ft = h.in(feet);
// Raw doubles exist only at the UI / CLI edge. Parsing "4000m", "616hPa", "-5C"... lives here too.
#pragma once

#include <array>
#include <concepts>
#include <optional>
#include <span>
#include <string>
#include <string_view>

#include "model/result.hpp"

namespace firn::units {

template <class Dimension>
struct Unit;

struct PressureDimension;
struct GaugePressureDimension;
struct TemperatureDimension;
// The dimension of the units a quantity is made and read in: its own, except a gauge pressure,
// which is read in the pressure units (bar, psi) yet is a type of its own, so that a gauge
// reading never adds to, compares with or passes for an absolute pressure.
template <class Dimension>
struct ReadingDimensionOf {
  using type = Dimension;
};
template <>
struct ReadingDimensionOf<GaugePressureDimension> {
  using type = PressureDimension;
};
template <class Dimension>
using ReadingDimension = typename ReadingDimensionOf<Dimension>::type;
// The units that make and read a Quantity<Dimension>.
template <class Dimension>
using ReadingUnit = Unit<ReadingDimension<Dimension>>;

// A point on a scale with an offset (a temperature: 10 °C + 10 °C is not 20 °C, and twice 10 °C
// is not 20 °C). Points are not added, scaled or divided; the difference of two points is a
// quantity of its own dimension (PointDifference), which a point can be moved by.
template <class Dimension>
inline constexpr bool is_point = false;
template <>
inline constexpr bool is_point<TemperatureDimension> = true;
template <class PointDimension>
struct DifferenceOf {};

// A physical quantity of one dimension, stored in SI (m, Pa, K, m³/s, m³, s, fraction).
template <class Dimension>
class Quantity {
 public:
  using dimension = Dimension;
  constexpr Quantity() = default;  // zero of the dimension (absolute zero for temperature)

  constexpr double in(const ReadingUnit<Dimension>& unit) const {
    return (si_ - unit.offset) / unit.scale;
  }

  constexpr bool operator==(const Quantity&) const = default;
  constexpr auto operator<=>(const Quantity&) const = default;
  constexpr Quantity operator+(Quantity other) const requires(!is_point<Dimension>) {
    return Quantity(si_ + other.si_);
  }
  constexpr Quantity operator-(Quantity other) const requires(!is_point<Dimension>) {
    return Quantity(si_ - other.si_);
  }
  constexpr Quantity operator*(double factor) const requires(!is_point<Dimension>) {
    return Quantity(si_ * factor);
  }
  constexpr Quantity operator/(double divisor) const requires(!is_point<Dimension>) {
    return Quantity(si_ / divisor);
  }
  constexpr double operator/(Quantity other) const requires(!is_point<Dimension>) {
    return si_ / other.si_;
  }
  constexpr Quantity& operator+=(Quantity other) requires(!is_point<Dimension>) {
    si_ += other.si_;
    return *this;
  }
  constexpr Quantity& operator-=(Quantity other) requires(!is_point<Dimension>) {
    si_ -= other.si_;
    return *this;
  }
  // Point − point = difference; point ± difference = point (kelvin steps either way).
  constexpr Quantity<DifferenceOf<Dimension>> operator-(Quantity other) const
      requires(is_point<Dimension>) {
    return Quantity<DifferenceOf<Dimension>>(si_ - other.si_);
  }
  constexpr Quantity operator+(Quantity<DifferenceOf<Dimension>> step) const
      requires(is_point<Dimension>) {
    return Quantity(si_ + step.si_);
  }
  constexpr Quantity operator-(Quantity<DifferenceOf<Dimension>> step) const
      requires(is_point<Dimension>) {
    return Quantity(si_ - step.si_);
  }

 private:
  friend struct Unit<ReadingDimension<Dimension>>;
  template <class> friend class Quantity;  // a point and its difference
  constexpr explicit Quantity(double si) : si_(si) {}
  double si_ = 0.0;
};

// A named unit: si = amount * scale + offset.
template <class Dimension>
struct Unit {
  double scale;
  double offset;
  std::string_view symbol;  // what we print: "m", "hPa", "°C"
  std::string_view spelling;  // what we accept when parsing (ASCII, compared case-insensitively)

  constexpr Quantity<Dimension> operator()(double amount) const {
    return Quantity<Dimension>(amount * scale + offset);
  }
  // A gauge reading (above ambient) in this unit: bar.gauge(200) is a cylinder at 200 bar gauge.
  constexpr Quantity<GaugePressureDimension> gauge(double amount) const
      requires std::same_as<Dimension, PressureDimension> {
    return Quantity<GaugePressureDimension>(amount * scale + offset);
  }
};

struct LengthDimension {};
struct PressureDimension {};
struct GaugePressureDimension {};
struct TemperatureDimension {};
struct VolumeDimension {};
struct VolumeFlowDimension {};
struct DurationDimension {};
struct FractionDimension {};

using Length = Quantity<LengthDimension>;
// Absolute pressure (air, alveolar, inside a bag). What a cylinder, regulator or bag gauge shows
// is a GaugePressure (above ambient): made and read in the same units (bar.gauge(200),
// g.in(psi)), it becomes absolute only with the ambient pressure given (absolute_from_gauge).
using Pressure = Quantity<PressureDimension>;
using GaugePressure = Quantity<GaugePressureDimension>;
using Temperature = Quantity<TemperatureDimension>;
using Volume = Quantity<VolumeDimension>;
using VolumeFlow = Quantity<VolumeFlowDimension>;
using Duration = Quantity<DurationDimension>;
using Fraction = Quantity<FractionDimension>;        // FiO2, SpO2, gas fractions

// Conversion factors: BIPM SI Brochure (2019) and NIST SP 811 (2008) Appendix B.
inline constexpr Unit<LengthDimension> metres{1.0, 0.0, "m", "m"};
inline constexpr Unit<LengthDimension> kilometres{1000.0, 0.0, "km", "km"};
inline constexpr Unit<LengthDimension> feet{0.3048, 0.0, "ft", "ft"};

inline constexpr Unit<PressureDimension> pascals{1.0, 0.0, "Pa", "pa"};
inline constexpr Unit<PressureDimension> hectopascals{100.0, 0.0, "hPa", "hpa"};
inline constexpr Unit<PressureDimension> millibar{100.0, 0.0, "mbar", "mbar"};
inline constexpr Unit<PressureDimension> kilopascals{1000.0, 0.0, "kPa", "kpa"};
inline constexpr Unit<PressureDimension> bar{100000.0, 0.0, "bar", "bar"};
inline constexpr Unit<PressureDimension> mmhg{101325.0 / 760.0, 0.0, "mmHg", "mmhg"};
inline constexpr Unit<PressureDimension> torr{101325.0 / 760.0, 0.0, "Torr", "torr"};
inline constexpr Unit<PressureDimension> inhg{3386.389, 0.0, "inHg", "inhg"};
inline constexpr Unit<PressureDimension> psi{6894.757293168, 0.0, "psi", "psi"};
inline constexpr Unit<PressureDimension> atmospheres{101325.0, 0.0, "atm", "atm"};
inline constexpr Unit<PressureDimension> megapascals{1e6, 0.0, "MPa", "mpa"};

inline constexpr Unit<TemperatureDimension> kelvin{1.0, 0.0, "K", "k"};
inline constexpr Unit<TemperatureDimension> celsius{1.0, 273.15, "°C", "c"};
inline constexpr Unit<TemperatureDimension> fahrenheit{5.0 / 9.0, 273.15 - 32.0 * 5.0 / 9.0, "°F",
                                                       "f"};

inline constexpr Unit<VolumeDimension> litres{1e-3, 0.0, "L", "l"};
inline constexpr Unit<VolumeDimension> millilitres{1e-6, 0.0, "mL", "ml"};

inline constexpr Unit<VolumeFlowDimension> litres_per_minute{1e-3 / 60.0, 0.0, "L/min", "l/min"};

inline constexpr Unit<DurationDimension> seconds{1.0, 0.0, "s", "s"};
inline constexpr Unit<DurationDimension> minutes{60.0, 0.0, "min", "min"};
inline constexpr Unit<DurationDimension> hours{3600.0, 0.0, "h", "h"};
inline constexpr Unit<DurationDimension> days{86400.0, 0.0, "d", "d"};

inline constexpr Unit<FractionDimension> fraction{1.0, 0.0, "", ""};
inline constexpr Unit<FractionDimension> percent{0.01, 0.0, "%", "%"};

// Flow × time and volume / flow, the two products the oxygen calculators need.
constexpr Volume operator*(VolumeFlow flow, Duration time) {
  return litres(flow.in(litres_per_minute) * time.in(minutes));
}
constexpr Duration operator/(Volume volume, VolumeFlow flow) {
  return minutes(volume.in(litres) / flow.in(litres_per_minute));
}

// `amount` in `unit` for code generic over the dimension: unit(amount), or unit.gauge(amount)
// for a gauge pressure.
template <class Dimension>
constexpr Quantity<Dimension> from_reading(const ReadingUnit<Dimension>& unit, double amount) {
  if constexpr (std::same_as<Dimension, GaugePressureDimension>) {
    return unit.gauge(amount);
  } else {
    return unit(amount);
  }
}

// A gauge shows the pressure above the air around it, so the absolute pressure is the gauge
// reading plus the ambient pressure, and the other way round; there is no conversion without it.
constexpr Pressure absolute_from_gauge(GaugePressure gauge, Pressure ambient) {
  return pascals(gauge.in(pascals) + ambient.in(pascals));
}
constexpr GaugePressure gauge_from_absolute(Pressure absolute, Pressure ambient) {
  return pascals.gauge(absolute.in(pascals) - ambient.in(pascals));
}

// True when `q` is finite and within [low, high] of `unit`, compared in SI. Reading a value back
// in its unit can be a rounding off ("1000mmHg" reads back as 1000.0000000000001 mmHg, and was
// refused as outside 0…1000 mmHg: sweep finding); the bound converted the same way is not.
template <class Dimension>
bool within(Quantity<Dimension> q, double low, double high, const ReadingUnit<Dimension>& unit) {
  constexpr ReadingUnit<Dimension> si{1.0, 0.0, "", ""};
  return in_range(q.in(si), from_reading<Dimension>(unit, low).in(si),
                  from_reading<Dimension>(unit, high).in(si));
}

// A valid range, published once by the model that owns it and read by the fields, the saved
// state and the CLI; `unit` is the one its messages use ("between 900 and 1100 hPa"). `what`
// names the value as the model's messages do, `note` follows the range ("for the ISA model").
template <class Dimension>
struct Range {
  Quantity<Dimension> low, high;
  const ReadingUnit<Dimension>* unit;
  std::string_view what{};
  std::string_view note{};

  constexpr double low_in_unit() const { return low.in(*unit); }
  constexpr double high_in_unit() const { return high.in(*unit); }
  bool contains(Quantity<Dimension> q) const {
    return within(q, low_in_unit(), high_in_unit(), *unit);
  }
};

// A range of a plain number (SpO2 %, pH, a score), with the unit its messages print.
struct NumberRange {
  double low, high;
  std::string_view unit;
  std::string_view what{};
  std::string_view note{};

  bool contains(double value) const { return in_range(value, low, high); }
};

// The range in words, with no value: "altitude must be between 0 and 9000 m for the West 1996
// model". What a missing or unreadable entry is told.
template <class Dimension>
Error range_error(std::string_view what, const Range<Dimension>& range) {
  Error e = firn::range_error(what, range.low_in_unit(), range.high_in_unit(), range.unit->symbol);
  e.message += range.note;
  return e;
}
Error range_error(std::string_view what, const NumberRange& range);

// The refusal of a value outside `range`: its range, unit and the value ("(got 9500 m)").
template <class Dimension>
Error refused(std::string_view what, Quantity<Dimension> q, const Range<Dimension>& range) {
  Error e = firn::range_error(what, range.low_in_unit(), range.high_in_unit(), range.unit->symbol,
                              q.in(*range.unit));
  e.message += range.note;
  return e;
}
template <class Dimension>
Error refused(Quantity<Dimension> q, const Range<Dimension>& range) {
  return refused(range.what, q, range);
}
Error refused(std::string_view what, double value, const NumberRange& range);

// The one range check: the value, or a message naming `what` (the range's own name when not
// given), the range, its unit and the value.
template <class Dimension>
Result<Quantity<Dimension>> check(std::string_view what, Quantity<Dimension> q,
                                  const Range<Dimension>& range) {
  if (range.contains(q)) return q;
  return refused(what, q, range);
}
template <class Dimension>
Result<Quantity<Dimension>> check(Quantity<Dimension> q, const Range<Dimension>& range) {
  return check(range.what, q, range);
}
Result<double> check(std::string_view what, double value, const NumberRange& range);
inline Result<double> check(double value, const NumberRange& range) {
  return check(range.what, value, range);
}

// [SECTION] Parsing "number + unit" text typed by a user or passed on the command line.

inline constexpr std::array<const Unit<LengthDimension>*, 3> length_units{&metres, &feet,
                                                                          &kilometres};
inline constexpr std::array<const Unit<PressureDimension>*, 9> pressure_units{
    &hectopascals, &mmhg, &kilopascals, &inhg, &psi, &bar, &millibar, &torr, &pascals};
// Units a cylinder or regulator gauge is marked in: gauge pressures are read in these only (an
// air-pressure unit such as hPa or mmHg on a cylinder is a slip).
inline constexpr std::array<const Unit<PressureDimension>*, 4> gauge_pressure_units{
    &bar, &psi, &kilopascals, &megapascals};
inline constexpr std::array<const Unit<TemperatureDimension>*, 3> temperature_units{
    &celsius, &fahrenheit, &kelvin};
inline constexpr std::array<const Unit<VolumeDimension>*, 2> volume_units{&litres, &millilitres};
inline constexpr std::array<const Unit<VolumeFlowDimension>*, 1> volume_flow_units{
    &litres_per_minute};
inline constexpr std::array<const Unit<DurationDimension>*, 3> duration_units{&minutes, &hours,
                                                                              &seconds};

// Parses a decimal number (a comma is accepted as the decimal mark); rejects nan, inf, hex,
// trailing junk and more than one separator ("1.2.3", "1,234.5"). `what` names the field in the
// message.
Result<double> parse_number(std::string_view text, std::string_view what);

// "5.200" or "-1,640": one separator followed by exactly three digits, as a thousands separator
// is written. Returns the number read that way (5200, -1640); nothing for any other shape
// ("0.125" too: a thousands group never follows a lone 0).
std::optional<double> thousands_reading(std::string_view number_text);

// A length or pressure typed like "5.200" is refused as ambiguous when, read with a thousands
// separator, it is a plausible altitude (|h| <= 30 km) or pressure (<= 400 bar, cylinders
// included): "did you mean 5200 or 5.2?". Other quantities have no such habit to trap.
std::optional<Error> ambiguous_grouping(std::string_view number_text,
                                        const Unit<LengthDimension>& unit, std::string_view what);
std::optional<Error> ambiguous_grouping(std::string_view number_text,
                                        const Unit<PressureDimension>& unit, std::string_view what);
template <class Dimension>
std::optional<Error> ambiguous_grouping(std::string_view, const Unit<Dimension>&, std::string_view) {
  return std::nullopt;
}

// "4000m", "13120 ft", "616hPa", "-5C", "-4°F", "200bar". The unit is required; `what` names the
// field in error messages ("altitude", "cylinder pressure").
Result<Length> parse_length(std::string_view text, std::string_view what = "altitude");
Result<Pressure> parse_pressure(std::string_view text, std::string_view what = "pressure");
Result<Temperature> parse_temperature(std::string_view text,
                                      std::string_view what = "temperature");
// A gauge pressure (above ambient) of a cylinder or regulator: "200bar", "2015psi", "2015psig",
// "20MPa", "13790kPa". Only gauge_pressure_units; "psia" (absolute) and air-pressure units are
// refused with a message naming the gauge units.
Result<GaugePressure> parse_gauge_pressure(std::string_view text,
                                           std::string_view what = "gauge pressure");
// A gauge pressure in any pressure unit ("2psi", "138hPa", "140mbar"): a bag's gauge is marked
// in air-pressure units as often as in psi. Cylinders use parse_gauge_pressure.
Result<GaugePressure> parse_gauge_any_unit(std::string_view text,
                                           std::string_view what = "gauge pressure");
// A volume: "10L", "680ml"; a bare number is taken as litres.
Result<Volume> parse_volume(std::string_view text, std::string_view what = "volume");
// A flow: "15L/min"; a bare number is taken as L/min (flows are L/min across Firn).
Result<VolumeFlow> parse_volume_flow(std::string_view text, std::string_view what = "flow");
// A duration: "90min", "1.5h", "30s". The unit is required.
Result<Duration> parse_duration(std::string_view text, std::string_view what = "duration");
// A longer span such as time at altitude: "2d", "36h", "90min". The unit is required.
inline constexpr std::array<const Unit<DurationDimension>*, 3> long_duration_units{&days, &hours,
                                                                                   &minutes};
Result<Duration> parse_long_duration(std::string_view text, std::string_view what = "duration");

}  // namespace firn::units
