// Expected resting SpO2 of healthy lowlanders at an altitude, as a band (low–mid–high), and how
// a measured SpO2 compares with it. Built from the oxygen cascade (oxygen_cascade.hpp), spread
// from its PaCO2 and A–a ranges, and calibrated against published field data through one
// "effective P50" per end of acclimatisation. How and how well: docs/expected-spo2.md.
// The verdict on a casualty's reading (air or oxygen) is casualty_spo2.hpp; it calls assess().
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "model/oxygen_cascade.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::expected_spo2 {

using cascade::Acclimatisation;
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
// oximeters read this way in the field. In between, linear in the acclimatisation share.
inline constexpr double kAcuteFieldP50Mmhg = 25.6;
inline constexpr double kAcclimatisedFieldP50Mmhg = 23.7;
Pressure field_p50(Exposure exposure);
Pressure field_p50(Acclimatisation acclimatisation);

// The calibration sources measured (or were evaluated) from 3000 to 5000 m on air (Botella de
// Maglia 2005 regressions evaluated at 3000/4000/5000 m; Tannheimer 2002 at 4850 m). A band whose
// inspired PO2 is below that of 5000 m on air (West 1996), or whose PaCO2 comes from beyond its
// table, is extrapolated. Below 3000 m the model runs to the sea-level physiology (interpolation).
inline constexpr double kFieldDataBottomM = 3000.0;
inline constexpr double kFieldDataTopM = 5000.0;

struct Band {
  Fraction low, mid, high;
};

struct Expectation {
  Band band;
  cascade::Cascade cascade;  // the three paths behind low, mid and high
  bool extrapolated = false;  // beyond the altitudes the PaCO2 table and field data cover
};

// Band for a barometric pressure (valid 100…1300 hPa; the cascade rejects pressures whose PiO2 is
// below 35 mmHg) and FiO2 (0.15…1; dry air by default). Above the field data (see
// kFieldDataTopM) `extrapolated` is set. Acute exposure with a PiO2 below about 41 mmHg (ISA above
// ~8800 m on air) leaves no arterial PO2 in the model: the cascade's "arterial PO2 below 1 mmHg"
// error, never a number (found by the sweep tests).
Result<Expectation> expected(Pressure barometric, Exposure exposure,
                             Fraction fio2 = cascade::dry_air_fio2());
// The same for any point of the acclimatisation time course (cascade::acclimatisation_after).
Result<Expectation> expected(Pressure barometric, Acclimatisation acclimatisation,
                             Fraction fio2 = cascade::dry_air_fio2());

enum class Position {
  Critical,      // below kCriticalBelowPercent, whatever the band
  WellBelow,     // more than kOximeterErrorPoints below the band
  Below,         // below the band, within oximeter error of it
  Within,
  Above,
  Extrapolated,  // at or above the low edge of an extrapolated band: no verdict
};
// "critical", "well-below", "below", "within", "above", "extrapolated".
std::string_view position_key(Position position);

// Pulse oximeter accuracy: ISO 80601-2-61 allows an Arms of up to 4 % SpO2 over 70–100 %
// (from memory); a reading further than this below the band is not explained by the device.
inline constexpr double kOximeterErrorPoints = 4.0;
// Below 80 % oximeter readings carry several points of error (Luks & Swenson, High Alt Med
// Biol 2011;12:109–119).
inline constexpr double kOximeterUnreliableBelowPercent = 80.0;
// Tannheimer M et al., Int J Sports Med 2002;23:329: climbers with a resting SpO2 below 65 % at
// ~4850 m developed the severe forms of altitude illness. Below it the verdict is "critical" at
// any altitude and on any oxygen (lower down the same reading is worse still).
inline constexpr double kCriticalBelowPercent = 65.0;

// Each reason shown under "why", with its source.
inline constexpr std::string_view kWhyCritical =
    "SpO2 below 65 %: at ~4,850 m climbers below this developed the severe forms of altitude "
    "illness (Tannheimer M et al., Int J Sports Med 2002;23:329).";
inline constexpr std::string_view kWhyOutOfProportion =
    "More than 4 points below the band: hypoxaemia out of proportion to altitude supports HAPE "
    "(WMS guidelines, Luks AM et al., Wilderness Environ Med 2019, updated 2024). 4 points is the "
    "oximeter error allowed by ISO 80601-2-61 (from memory).";
inline constexpr std::string_view kWhyWithinError =
    "Below the band by no more than the oximeter error of 4 points (ISO 80601-2-61, from memory).";
inline constexpr std::string_view kWhyBand =
    "The band is built from the oxygen cascade and calibrated to field data from 3,000–5,000 m "
    "(Botella de Maglia J et al., Med Clin 2005;124:172; Tannheimer 2002).";
inline constexpr std::string_view kWhyExtrapolated =
    "Outside the altitudes the calibration data cover (3,000–5,000 m on air): the band is "
    "extrapolated, so a reading inside or above it is not a reassurance.";
// Beside every SpO2 result.
// Shown beside every reading below kOximeterUnreliableBelowPercent.
inline constexpr std::string_view kOximeterUnreliable =
    "Oximeter readings below 80 % carry several points of error (Luks & Swenson 2011): re-measure "
    "on a warm finger with a steady trace.";
inline constexpr std::string_view kCarbonMonoxide =
    "Carbon monoxide (stoves in tents or snow holes) makes a pulse oximeter read falsely normal: "
    "a normal SpO2 does not rule out CO poisoning (two-wavelength oximeters count "
    "carboxyhaemoglobin as oxygenated).";

struct Assessment {
  Position position = Position::Within;
  double gap_points = 0.0;  // measured − nearest band edge, % SpO2; 0 inside the band
  bool oximeter_unreliable = false;  // measured below 80 %
  bool hape_suspected = false;       // critical or well below the band (sources above)
  bool extrapolated = false;         // the band compared with was extrapolated
  std::vector<std::string_view> why;       // the sourced reasons for the position
  std::vector<std::string_view> cautions;  // shown with the result, most important first
};

// Measured SpO2 valid 30…100 %. An extrapolated band gives no "within" or "above" (position
// Extrapolated); readings below it keep their concern.
// What a pulse oximeter reading can be taken as (below 30 % oximeters are not calibrated).
inline constexpr units::NumberRange kMeasuredSpo2Range{30.0, 100.0, "%", "measured SpO2"};
Result<Assessment> assess(Fraction measured, const Band& band, bool extrapolated = false);

}  // namespace firn::expected_spo2
