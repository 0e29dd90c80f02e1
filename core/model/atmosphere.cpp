#include "model/atmosphere.hpp"

#include <array>
#include <cmath>
#include <string>
#include <utility>

#include "model/latitude_month.hpp"

namespace firn::atmosphere {
namespace {

using namespace units;

// ICAO Doc 7488 / US Standard Atmosphere 1976 constants.
constexpr double kP0 = 101325.0;          // Pa
constexpr double kT0 = 288.15;            // K
constexpr double kLapse = 0.0065;         // K/m, troposphere
constexpr double kG0 = 9.80665;           // m/s²
constexpr double kMolarMass = 0.0289644;  // kg/mol, dry air
constexpr double kGasConstant = 8.31432;  // J/(mol·K), value used by USSA 1976
constexpr double kEarthRadius = 6356766.0;  // m
constexpr double kTropopause = 11000.0;     // m geopotential
constexpr double kTropopauseTemperature = 216.65;  // K
// g0·M/(R*·L) = 5.255876...
constexpr double kExponent = kG0 * kMolarMass / (kGasConstant * kLapse);

// West 1996: PB[Torr] = exp(a − b·h − c·h²), h in km.
constexpr double kWestA = 6.63268;  // sea level 759.5 Torr
constexpr double kWestB = 0.1112;
constexpr double kWestC = 0.00149;

double isa_tropopause_pressure() {
  return kP0 * std::pow(1.0 - kLapse * kTropopause / kT0, kExponent);
}

double isa_pressure_pa(double geopotential_m) {
  if (geopotential_m <= kTropopause) {
    return kP0 * std::pow(1.0 - kLapse * geopotential_m / kT0, kExponent);
  }
  return isa_tropopause_pressure() *
         std::exp(-kG0 * kMolarMass * (geopotential_m - kTropopause) /
                  (kGasConstant * kTropopauseTemperature));
}

double isa_geopotential_m(double pressure_pa) {
  double p11 = isa_tropopause_pressure();
  if (pressure_pa >= p11) return kT0 / kLapse * (1.0 - std::pow(pressure_pa / kP0, 1.0 / kExponent));
  return kTropopause - std::log(pressure_pa / p11) * kGasConstant * kTropopauseTemperature /
                           (kG0 * kMolarMass);
}

double west_pressure_torr(double km) { return std::exp(kWestA - kWestB * km - kWestC * km * km); }

double west_altitude_km(double torr) {
  // c·h² + b·h + (ln P − a) = 0, positive root.
  double k = std::log(torr) - kWestA;
  return (-kWestB + std::sqrt(kWestB * kWestB - 4.0 * kWestC * k)) / (2.0 * kWestC);
}

}  // namespace

std::string_view model_name(Model model) { return model == Model::Isa ? "ISA" : "West 1996"; }
std::string_view model_key(Model model) { return model == Model::Isa ? "isa" : "west"; }

Result<Model> parse_model(std::string_view key) {
  if (key == "isa" || key == "ISA") return Model::Isa;
  if (key == "west" || key == "west1996" || key == "West") return Model::West1996;
  return Error{"unknown atmosphere model '" + std::string(key) + "': use isa or west"};
}

units::Range<units::LengthDimension> altitude_range(Model model) {
  if (model == Model::Isa) {
    return {metres(-500.0), metres(20000.0), &metres, "altitude", " for the ISA model"};
  }
  return {metres(0.0), metres(9000.0), &metres, "altitude", " for the West 1996 model"};
}

units::Range<units::PressureDimension> pressure_range(Model model) {
  // High altitude = low pressure; computed once per model.
  static const auto make = [](Model m) {
    units::Range<units::LengthDimension> z = altitude_range(m);
    const double low_hpa = std::ceil(pressure_at(z.high, m)->in(hectopascals) * 10) / 10;
    const double high_hpa = std::floor(pressure_at(z.low, m)->in(hectopascals) * 10) / 10;
    return std::pair{std::array{low_hpa, high_hpa},
                     std::string(z.note) + " (" + format_number(z.low_in_unit()) + " to " +
                         format_number(z.high_in_unit()) + " m)"};
  };
  static const auto isa = make(Model::Isa), west = make(Model::West1996);
  const auto& [hpa, note] = model == Model::Isa ? isa : west;
  return {hectopascals(hpa[0]), hectopascals(hpa[1]), &hectopascals, "pressure", note};
}

AltitudeRange valid_altitudes(Model model) {
  units::Range<units::LengthDimension> r = altitude_range(model);
  return {r.low_in_unit(), r.high_in_unit()};
}

double geopotential_from_geometric_m(double z) { return kEarthRadius * z / (kEarthRadius + z); }
double geometric_from_geopotential_m(double h) { return kEarthRadius * h / (kEarthRadius - h); }

Result<Pressure> pressure_at(Length geometric_altitude, Model model) {
  if (auto a = check(geometric_altitude, altitude_range(model)); !a) return a.error();
  double z = geometric_altitude.in(metres);
  if (model == Model::Isa) return pascals(isa_pressure_pa(geopotential_from_geometric_m(z)));
  return torr(west_pressure_torr(z / 1000.0));
}

Result<Length> altitude_at(Pressure pressure, Model model) {
  // Judged on the exact bounds (the pressure at 9,000 m reads back as 9,000 m); refused with the
  // published range, which lies inside them.
  units::Range<units::LengthDimension> z = altitude_range(model);
  if (!in_range(pressure.in(hectopascals), pressure_at(z.high, model)->in(hectopascals),
                pressure_at(z.low, model)->in(hectopascals))) {
    return refused(pressure, pressure_range(model));
  }
  if (model == Model::Isa) {
    return metres(geometric_from_geopotential_m(isa_geopotential_m(pressure.in(pascals))));
  }
  return kilometres(west_altitude_km(pressure.in(torr)));
}

namespace {
Result<double> check_qnh_inputs(Length altitude, Pressure qnh) {
  if (auto z = check("altitude", altitude, kSiteAltitudeRange); !z) return z.error();
  if (auto q = check("QNH (sea-level pressure)", qnh, kQnhRange); !q) return q.error();
  return geopotential_from_geometric_m(altitude.in(metres));
}
}  // namespace

Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh) {
  Result<double> h = check_qnh_inputs(geometric_altitude, qnh);
  if (!h) return h.error();
  return pascals(qnh.in(pascals) * std::pow(1.0 - kLapse * h.value() / kT0, kExponent));
}

Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh,
                                   Temperature temperature, TemperatureAt where) {
  Result<double> h = check_qnh_inputs(geometric_altitude, qnh);
  if (!h) return h.error();
  if (auto t = check(temperature, kAirTemperatureRange); !t) return t.error();
  // Mean layer temperature with the standard lapse inside the layer (AMS Glossary,
  // "hypsometric equation").
  double t = temperature.in(kelvin);
  double mean_t = where == TemperatureAt::SeaLevel ? t - kLapse * h.value() / 2.0
                                                   : t + kLapse * h.value() / 2.0;
  return pascals(qnh.in(pascals) *
                 std::exp(-kG0 * kMolarMass * h.value() / (kGasConstant * mean_t)));
}

Result<QnhWithTemperature> qnh_with_temperature(Length geometric_altitude, Pressure qnh,
                                                Temperature temperature, TemperatureAt where) {
  Result<Pressure> hypsometric = pressure_from_qnh(geometric_altitude, qnh, temperature, where);
  if (!hypsometric) return hypsometric.error();
  Pressure standard = pressure_from_qnh(geometric_altitude, qnh).value();
  double difference = std::fabs(hypsometric->in(hectopascals) - standard.in(hectopascals));
  std::string note =
      "A QNH from a station above sea level is a standard-atmosphere reduction, not a true "
      "sea-level pressure: for such a QNH the standard-lapse figure (" +
      format_number(standard.in(hectopascals), 1) +
      " hPa) is right and the temperature does not apply. The temperature correction is for a "
      "true sea-level pressure; here the two differ by " + format_number(difference, 1) +
      " hPa, more with a higher station and colder air. Best: the station's own reading.";
  return QnhWithTemperature{hypsometric.value(), standard, note};
}

Result<Pressure> pressure_from_station_reading(Pressure reading) {
  return check("station barometer reading", reading, kStationReadingRange);
}

Result<StationCheck> check_station_reading(Pressure reading, Length geometric_altitude, Model model) {
  Result<Pressure> checked = pressure_from_station_reading(reading);
  if (!checked) return checked.error();
  Result<PressureEnvelope> envelope = climatological_envelope(geometric_altitude);
  if (!envelope) return envelope.error();
  StationCheck check;
  check.expected_low = envelope->low * (1.0 - kStationWeatherMargin);
  check.expected_high = envelope->high * (1.0 + kStationWeatherMargin);
  if (Result<Length> a = altitude_at(reading, model)) {
    check.pressure_altitude = a.value();
    check.pressure_altitude_known = true;
  }
  double hpa = reading.in(hectopascals);
  std::string at = format_number(std::round(geometric_altitude.in(metres)), 0) + " m";
  std::string expected = format_number(std::floor(check.expected_low.in(hectopascals)), 0) + "\xE2\x80\x93" +
                         format_number(std::ceil(check.expected_high.in(hectopascals)), 0) + " hPa";
  if (hpa > kSeaLevelFigureAboveHpa && geometric_altitude.in(metres) > kSeaLevelFigureAltitudeM) {
    check.verdict = ReadingCheck::LooksLikeSeaLevel;
    check.message = format_number(hpa, 1) + " hPa at " + at +
                    " is probably a sea-level figure (QNH or a weather report), not the pressure "
                    "here (" + expected + " is usual at this altitude). Read the barometer's "
                    "station pressure, or enter the figure as QNH.";
  } else if (reading < check.expected_low || reading > check.expected_high) {
    check.verdict = ReadingCheck::Mismatch;
    check.message = "The reading and the altitude do not agree: " + format_number(hpa, 1) +
                    " hPa at " + at + ", where " + expected +
                    " is usual. Check the altitude, the unit and that the reading is the station "
                    "pressure, not QNH.";
  } else {
    check.message = "The reading fits the altitude (" + expected + " is usual at " + at + ").";
  }
  return check;
}

}  // namespace firn::atmosphere
