#include "model/expected_spo2.hpp"

#include <algorithm>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"

namespace firn::expected_spo2 {
namespace {

using namespace units;

constexpr std::string_view kClinicalFirst =
    "Clinical signs first: breathlessness at rest, cough, confusion or ataxia matter more than "
    "the number.";
constexpr std::string_view kCritical =
    "SpO2 below 65 %: severe hypoxaemia (Tannheimer 2002). Oxygen now, descend, treat as HAPE or "
    "HACE until shown otherwise.";
constexpr std::string_view kHape =
    "SpO2 well below the expected band: hypoxaemia out of proportion to altitude supports HAPE "
    "(WMS guidelines, Luks 2019/2024). Look for HAPE signs; oxygen to SpO2 > 90 % and descent per "
    "protocol.";
constexpr std::string_view kBelow =
    "Slightly below the expected band, within oximeter error: re-measure after 5 minutes at rest "
    "and compare with clinical signs.";
constexpr std::string_view kWithin =
    "Within the band expected for a healthy lowlander: this does not exclude altitude illness.";
constexpr std::string_view kAbove =
    "Above the expected band: reassuring only if the casualty looks well.";
constexpr std::string_view kNoVerdict =
    "No verdict: the band is extrapolated here, so a reading inside or above it does not "
    "reassure. Judge by the clinical signs.";
constexpr std::string_view kBand =
    "The band is for healthy lowlanders at rest; field values vary with days at altitude, sleep, "
    "exertion and the oximeter.";

// Inspired PO2 breathing air at the top of the field data: below it a band is extrapolated.
Pressure field_data_top_pio2() {
  Pressure pb = atmosphere::pressure_at(metres(kFieldDataTopM), atmosphere::Model::West1996).value();
  return cascade::inspired_po2(pb, cascade::dry_air_fio2()).value();
}

}  // namespace

Pressure field_p50(Exposure exposure) {
  return field_p50(cascade::acclimatisation_of(exposure));
}

Pressure field_p50(Acclimatisation acclimatisation) {
  double s = std::clamp(acclimatisation.share, 0.0, 1.0);
  return mmhg(kAcuteFieldP50Mmhg + s * (kAcclimatisedFieldP50Mmhg - kAcuteFieldP50Mmhg));
}

std::string_view position_key(Position position) {
  switch (position) {
    case Position::Critical: return "critical";
    case Position::WellBelow: return "well-below";
    case Position::Below: return "below";
    case Position::Within: return "within";
    case Position::Above: return "above";
    case Position::Extrapolated: return "extrapolated";
  }
  return "extrapolated";
}

Result<Expectation> expected(Pressure barometric, Exposure exposure, Fraction fio2) {
  return expected(barometric, cascade::acclimatisation_of(exposure), fio2);
}

Result<Expectation> expected(Pressure barometric, Acclimatisation acclimatisation, Fraction fio2) {
  cascade::CascadeInputs in;
  in.barometric = barometric;
  in.fio2 = fio2;
  in.acclimatisation = acclimatisation;
  in.p50 = field_p50(acclimatisation);
  Result<cascade::Cascade> c = cascade::oxygen_cascade(in);
  if (!c) return c.error();
  Expectation e;
  e.cascade = c.value();
  e.band = {c->lowest.sao2, c->middle.sao2, c->highest.sao2};
  e.extrapolated = c->paco2_extrapolated || c->inspired < field_data_top_pio2() - mmhg(0.01);
  return e;
}

Result<Assessment> assess(Fraction measured, const Band& band, bool extrapolated) {
  const double spo2 = measured.in(percent);
  if (auto s = units::check(spo2, kMeasuredSpo2Range); !s) return s.error();
  FIRN_ASSERT(band.low <= band.mid && band.mid <= band.high, "band edges out of order");
  Assessment a;
  a.extrapolated = extrapolated;
  double low = band.low.in(percent), high = band.high.in(percent);
  a.cautions.push_back(kClinicalFirst);
  a.position = Position::Within;
  if (spo2 < low) {
    a.gap_points = spo2 - low;
    a.position = -a.gap_points > kOximeterErrorPoints ? Position::WellBelow : Position::Below;
  } else if (spo2 > high) {
    a.gap_points = spo2 - high;
    a.position = Position::Above;
  }
  if (spo2 < kCriticalBelowPercent) a.position = Position::Critical;
  // Concern stays; reassurance needs a band the data support.
  if (extrapolated && (a.position == Position::Within || a.position == Position::Above)) {
    a.position = Position::Extrapolated;
  }
  a.oximeter_unreliable = spo2 < kOximeterUnreliableBelowPercent;
  a.hape_suspected = a.position == Position::Critical || a.position == Position::WellBelow;

  if (a.position == Position::Critical) a.why.push_back(kWhyCritical);
  if (a.hape_suspected) a.why.push_back(kWhyOutOfProportion);
  if (a.position == Position::Below) a.why.push_back(kWhyWithinError);
  a.why.push_back(extrapolated ? kWhyExtrapolated : kWhyBand);

  switch (a.position) {
    case Position::Critical: a.cautions.push_back(kCritical); break;
    case Position::WellBelow: a.cautions.push_back(kHape); break;
    case Position::Below: a.cautions.push_back(kBelow); break;
    case Position::Within: a.cautions.push_back(kWithin); break;
    case Position::Above: a.cautions.push_back(kAbove); break;
    case Position::Extrapolated: a.cautions.push_back(kNoVerdict); break;
  }
  if (a.oximeter_unreliable) a.cautions.push_back(kOximeterUnreliable);
  a.cautions.push_back(kCarbonMonoxide);
  a.cautions.push_back(kBand);
  a.cautions.push_back(cautions::short_line);
  return a;
}

}  // namespace firn::expected_spo2
