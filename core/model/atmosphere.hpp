// Barometric pressure from altitude and back: the standard atmosphere (ISA) and West's 1996
// mountain model, plus pressure from the day's QNH (standard lapse or a known temperature).
#pragma once

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

// Validity of each model, in geometric metres above sea level.
struct AltitudeRange {
  double low_m;
  double high_m;
};
AltitudeRange valid_altitudes(Model model);  // ISA −500…20 000 m; West 0…9 000 m

// Geometric elevation (maps, GPS) ↔ geopotential height (what ISA is defined on).
// Effective Earth radius r0 = 6 356 766 m (US Standard Atmosphere 1976).
double geopotential_from_geometric_m(double geometric_m);
double geometric_from_geopotential_m(double geopotential_m);

Result<Pressure> pressure_at(Length geometric_altitude, Model model);
Result<Length> altitude_at(Pressure pressure, Model model);

// Where the local barometric pressure came from.
enum class TemperatureAt { SeaLevel, Station };

// Pressure at an altitude from the day's sea-level pressure (QNH), using the ISA lapse rate
// (ICAO altimeter setting convention).  Valid QNH 900…1100 hPa, altitude −500…9 000 m.
Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh);

// Same, but with a measured air temperature (at sea level or at the station) by the hypsometric
// equation with the mean temperature of the layer (standard lapse assumed inside the layer).
// Valid temperature −60…+50 °C.
Result<Pressure> pressure_from_qnh(Length geometric_altitude, Pressure qnh,
                                   Temperature temperature, TemperatureAt where);

// A station barometer reading (not corrected to sea level) is PB itself; this only checks it is
// a plausible absolute pressure for a person to be in: 150…1100 hPa.
Result<Pressure> pressure_from_station_reading(Pressure reading);

}  // namespace firn::atmosphere
