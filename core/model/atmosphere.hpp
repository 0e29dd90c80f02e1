// Barometric pressure from altitude and back: the standard atmosphere (ISA) and West's 1996
// mountain model, plus pressure from the day's QNH (standard lapse or a known temperature).
#pragma once

#include <string>
#include <string_view>

#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::atmosphere {

using units::Length;
using units::Pressure;
using units::Temperature;

enum class Model {
  Isa,       // ICAO Doc 7488 / ISO 2533 / US Standard Atmosphere 1976: aviation, mid-latitude
  West1996,  // West JB, J Appl Physiol 1996;81:1850: fitted to high mountains, low latitude
};

// The model used for medical figures unless the user picks another (West 1996; see docs).
inline constexpr Model default_medical_model = Model::West1996;

std::string_view model_name(Model model);       // "ISA" / "West 1996"
std::string_view model_key(Model model);        // "isa" / "west" (CLI, JSON, profiles)
Result<Model> parse_model(std::string_view key);  // accepts "isa", "west", "west1996"

// Validity of each model, in geometric metres above sea level: ISA −500…20 000 m; West 0…9 000 m.
// The pressure range is the altitude range mapped through the model, rounded inward to 0.1 hPa.
units::Range<units::LengthDimension> altitude_range(Model model);
units::Range<units::PressureDimension> pressure_range(Model model);
struct AltitudeRange {
  double low_m;
  double high_m;
};
AltitudeRange valid_altitudes(Model model);  // altitude_range in metres

// Geometric elevation (maps, GPS) ↔ geopotential height (what ISA is defined on).
// Effective Earth radius r0 = 6 356 766 m (US Standard Atmosphere 1976).
double geopotential_from_geometric_m(double geometric_m);
double geometric_from_geopotential_m(double geopotential_m);

Result<Pressure> pressure_at(Length geometric_altitude, Model model);
Result<Length> altitude_at(Pressure pressure, Model model);

// Where the local barometric pressure came from.
enum class TemperatureAt { SeaLevel, Station };

// Where a rescue can be: below the lowest shore on land (the Dead Sea, about −430 m) to above the
// highest summit (8,849 m). The situation's altitude field and the QNH reduction take this.
inline constexpr units::Range<units::LengthDimension> kSiteAltitudeRange{
    units::metres(-500.0), units::metres(9000.0), &units::metres, "altitude"};
// A reported sea-level pressure (QNH) and a station barometer reading (an absolute pressure a
// person can be in).
inline constexpr units::Range<units::PressureDimension> kQnhRange{
    units::hectopascals(900.0), units::hectopascals(1100.0), &units::hectopascals,
    "QNH (sea-level pressure)"};
inline constexpr units::Range<units::PressureDimension> kStationReadingRange{
    units::hectopascals(150.0), units::hectopascals(1100.0), &units::hectopascals,
    "station barometer reading"};
// The air temperature a QNH reduction takes (surface air on Earth, with room to spare).
inline constexpr units::Range<units::TemperatureDimension> kAirTemperatureRange{
    units::celsius(-60.0), units::celsius(50.0), &units::celsius, "air temperature"};

// Pressure at an altitude from the day's sea-level pressure (QNH), using the ISA lapse rate
// (ICAO altimeter setting convention). Altitude in kSiteAltitudeRange, QNH in kQnhRange.
Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh);

// Same, but with a measured air temperature (at sea level or at the station) by the hypsometric
// equation with the mean temperature of the layer (standard lapse assumed inside the layer).
// Valid temperature −60…+50 °C.
Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh,
                                   Temperature temperature, TemperatureAt where);

// A QNH with a temperature, with what it cannot know. A QNH reported by a station above sea level
// is its pressure reduced with the standard atmosphere (ICAO altimeter setting), not a true
// sea-level pressure: from that station the standard-lapse figure undoes the reduction exactly,
// and the temperature correction is right only for a true sea-level pressure. The two differ more
// the higher the station and the colder the air; both are kept, with a note saying so.
struct QnhWithTemperature {
  Pressure with_temperature;  // hypsometric, as pressure_from_qnh with a temperature
  Pressure standard_lapse;    // as pressure_from_qnh without one
  std::string note;           // the caveat above, with this case's difference in hPa
};
Result<QnhWithTemperature> qnh_with_temperature(Length geometric_altitude, Pressure qnh,
                                                Temperature temperature, TemperatureAt where);

// A station barometer reading (not corrected to sea level) is PB itself; this only checks it is
// a plausible absolute pressure for a person to be in (kStationReadingRange).
Result<Pressure> pressure_from_station_reading(Pressure reading);

// A station reading checked against a known altitude. `LooksLikeSeaLevel`: above 950 hPa at a
// known altitude over 1,500 m (issue 11's rule; no place that high has such a pressure), almost
// certainly a QNH or a weather report's sea-level figure. `Mismatch`: outside every monthly
// pressure NRLMSISE-00 gives at this altitude (any latitude, any month) widened by
// kStationWeatherMargin for the day's weather. Altitude 0…9 000 m.
inline constexpr double kSeaLevelFigureAboveHpa = 950.0;
inline constexpr double kSeaLevelFigureAltitudeM = 1500.0;
inline constexpr double kStationWeatherMargin = 0.05;  // ±5 % (deep lows, strong highs; from memory)
enum class ReadingCheck { Consistent, LooksLikeSeaLevel, Mismatch };
struct StationCheck {
  ReadingCheck verdict = ReadingCheck::Consistent;
  Pressure expected_low, expected_high;  // plausible at this altitude (envelope with weather)
  Length pressure_altitude;              // the reading's altitude by the model (0 if outside it)
  bool pressure_altitude_known = false;
  std::string message;                   // what to do, in the user's words
};
Result<StationCheck> check_station_reading(Pressure reading, Length geometric_altitude, Model model);

}  // namespace firn::atmosphere
