#include "model/expected_spo2.hpp"

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"

namespace firn::expected_spo2 {
namespace {

using namespace units;

// Highest altitude of the field data behind the calibration (Botella de Maglia 2005 evaluated
// to 5000 m; Tannheimer 2002 at 4850 m) plus a margin; beyond it the band is flagged.
constexpr double kFieldDataTopM = 5500.0;

constexpr std::string_view kClinicalFirst =
    "Clinical signs first: breathlessness at rest, cough, confusion or ataxia matter more than "
    "the number.";
constexpr std::string_view kUnreliable =
    "Oximeter readings below 80 % carry several points of error (Luks & Swenson 2011): re-measure "
    "on a warm finger with a steady trace.";
constexpr std::string_view kHape =
    "SpO2 well below the expected band: hypoxaemia out of proportion to altitude supports HAPE "
    "(WMS guidelines, Luks 2019). Look for HAPE signs; oxygen to SpO2 > 90 % and descent per "
    "protocol.";
constexpr std::string_view kBelow =
    "Slightly below the expected band, within oximeter error: re-measure after 5 minutes at rest "
    "and compare with clinical signs.";
constexpr std::string_view kWithin =
    "Within the band expected for a healthy lowlander: this does not exclude altitude illness.";
constexpr std::string_view kAbove =
    "Above the expected band: reassuring only if the casualty looks well (or is on oxygen).";
constexpr std::string_view kBand =
    "The band is for healthy lowlanders at rest; field values vary with days at altitude, sleep, "
    "exertion and the oximeter.";

}  // namespace

Pressure field_p50(Exposure exposure) {
  return mmhg(exposure == Exposure::Acute ? kAcuteFieldP50Mmhg : kAcclimatisedFieldP50Mmhg);
}

std::string_view position_key(Position position) {
  switch (position) {
    case Position::WellBelow: return "well-below";
    case Position::Below: return "below";
    case Position::Within: return "within";
    case Position::Above: return "above";
  }
  return "within";
}

Result<Expectation> expected(Pressure barometric, Exposure exposure, Fraction fio2) {
  cascade::CascadeInputs in;
  in.barometric = barometric;
  in.fio2 = fio2;
  in.exposure = exposure;
  in.p50 = field_p50(exposure);
  Result<cascade::Cascade> c = cascade::oxygen_cascade(in);
  if (!c) return c.error();
  Expectation e;
  e.cascade = c.value();
  e.band = {c->lowest.sao2, c->middle.sao2, c->highest.sao2};
  // Compare inspired PO2 with breathing air at the top of the field data.
  Pressure top_pb =
      atmosphere::pressure_at(metres(kFieldDataTopM), atmosphere::Model::West1996).value();
  Pressure top_pio2 = cascade::inspired_po2(top_pb, cascade::dry_air_fio2()).value();
  e.extrapolated = c->paco2_extrapolated || c->inspired < top_pio2 - mmhg(0.01);
  return e;
}

Result<Assessment> assess(Fraction measured, const Band& band) {
  double spo2 = measured.in(percent);
  if (!in_range(spo2, 30.0, 100.0)) return range_error("measured SpO2", 30, 100, "%", spo2);
  FIRN_ASSERT(band.low <= band.mid && band.mid <= band.high, "band edges out of order");
  Assessment a;
  double low = band.low.in(percent), high = band.high.in(percent);
  a.cautions.push_back(kClinicalFirst);
  if (spo2 < low) {
    a.gap_points = spo2 - low;
    a.position = -a.gap_points > kOximeterErrorPoints ? Position::WellBelow : Position::Below;
  } else if (spo2 > high) {
    a.gap_points = spo2 - high;
    a.position = Position::Above;
  }
  a.oximeter_unreliable = spo2 < kOximeterUnreliableBelowPercent;
  a.hape_suspected = a.position == Position::WellBelow;
  if (a.hape_suspected) a.cautions.push_back(kHape);
  if (a.oximeter_unreliable) a.cautions.push_back(kUnreliable);
  if (a.position == Position::Below) a.cautions.push_back(kBelow);
  if (a.position == Position::Within) a.cautions.push_back(kWithin);
  if (a.position == Position::Above) a.cautions.push_back(kAbove);
  a.cautions.push_back(kBand);
  a.cautions.push_back(cautions::short_line);
  return a;
}

}  // namespace firn::expected_spo2
