// Expected resting SpO2 of healthy lowlanders at an altitude, as a band (low–mid–high), and how
// a measured SpO2 compares with it. Built from the oxygen cascade (oxygen_cascade.hpp), spread
// from its PaCO2 and A–a ranges, and calibrated against published field data through one
// "effective P50" per exposure. How and how well: docs/expected-spo2.md.
#pragma once

#include <string_view>
#include <vector>

#include "model/oxygen_cascade.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::expected_spo2 {

using cascade::Exposure;
using units::Fraction;
using units::Pressure;

// Field calibration: the P50 (mmHg) that makes the cascade's middle path match the published
// field points in the least-squares sense (docs/expected-spo2.md, fitted with the code as it is):
//   acute        to Botella de Maglia 2005, unacclimatised regression at 3000/4000/5000 m;
//   acclimatised to Botella de Maglia 2005, acclimatised regression at 3000/4000/5000 m and
//                   Tannheimer 2002, 4850 m median 86.5 %.
// Both sit below the standard 26.8: in vivo at altitude the curve sits left (alkalosis; the
// domain brief cites ~19–20 mmHg on the Everest summit, Winslow 1984, from memory), and
// oximeters read this way in the field.
inline constexpr double kAcuteFieldP50Mmhg = 25.6;
inline constexpr double kAcclimatisedFieldP50Mmhg = 23.7;
Pressure field_p50(Exposure exposure);

struct Band {
  Fraction low, mid, high;
};

struct Expectation {
  Band band;
  cascade::Cascade cascade;  // the three paths behind low, mid and high
  bool extrapolated = false;  // beyond the altitudes the PaCO2 table and field data cover
};

// Band for a barometric pressure (valid 100…1300 hPa; the cascade rejects pressures whose PiO2 is
// below 35 mmHg) and FiO2 (0.15…1; dry air by default). Field data cover ~3000–5000 m on air;
// above 5500 m (or with PiO2 below that altitude's) `extrapolated` is set. Acute exposure with a
// PiO2 below about 41 mmHg (ISA above ~8800 m on air) leaves no arterial PO2 in the model: the
// cascade's "arterial PO2 below 1 mmHg" error, never a number (found by the sweep tests).
Result<Expectation> expected(Pressure barometric, Exposure exposure,
                             Fraction fio2 = cascade::dry_air_fio2());

enum class Position {
  WellBelow,  // more than kOximeterErrorPoints below the band
  Below,      // below the band, within oximeter error of it
  Within,
  Above,
};
std::string_view position_key(Position position);  // "well-below", "below", "within", "above"

// Pulse oximeter accuracy: ISO 80601-2-61 allows an Arms of up to 4 % SpO2 over 70–100 %
// (from memory); a reading further than this below the band is not explained by the device.
inline constexpr double kOximeterErrorPoints = 4.0;
// Below 80 % oximeter readings carry several points of error (Luks & Swenson, High Alt Med
// Biol 2011;12:109–119).
inline constexpr double kOximeterUnreliableBelowPercent = 80.0;

struct Assessment {
  Position position = Position::Within;
  double gap_points = 0.0;  // measured − nearest band edge, % SpO2; 0 inside the band
  bool oximeter_unreliable = false;  // measured below 80 %
  bool hape_suspected = false;       // well below the band: hypoxaemia out of proportion
  std::vector<std::string_view> cautions;  // shown with the result, most important first
};

// Measured SpO2 valid 30…100 %.
Result<Assessment> assess(Fraction measured, const Band& band);

}  // namespace firn::expected_spo2
