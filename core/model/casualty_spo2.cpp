#include "model/casualty_spo2.hpp"

namespace firn::casualty_spo2 {
namespace {

using namespace units;
using expected_spo2::Position;

std::string headline(Position position, bool on_oxygen) {
  const std::string where = on_oxygen ? " expected on this oxygen" : " expected here on air";
  switch (position) {
    case Position::Critical: return "Critical: SpO2 below 65 %";
    case Position::WellBelow: return "Well below the band" + where;
    case Position::Below: return "Slightly below the band" + where + " (within oximeter error)";
    case Position::Within: return "Within the band" + where;
    case Position::Above: return "Above the band" + where;
    case Position::Extrapolated: return "No verdict: the band is extrapolated here";
  }
  return "No verdict";
}

std::string action(Position position, bool on_oxygen, bool below_target) {
  switch (position) {
    case Position::Critical:
      return on_oxygen ? "Raise the oxygen to SpO2 > 90 % and descend now: treat as HAPE or HACE "
                         "until shown otherwise."
                       : "Give oxygen now (SpO2 > 90 %) and descend: treat as HAPE or HACE until "
                         "shown otherwise.";
    case Position::WellBelow:
      return on_oxygen ? "Worse than this oxygen should give: check for HAPE, raise the flow to "
                         "SpO2 > 90 %, descend."
                       : "Check for HAPE; give oxygen to SpO2 > 90 % and plan descent.";
    default: break;
  }
  if (on_oxygen && below_target) return "Below 90 % on oxygen: raise the flow and re-measure.";
  switch (position) {
    case Position::Below:
      return "Re-measure after 5 minutes at rest on a warm finger; compare with the signs.";
    case Position::Within:
      return on_oxygen ? "Keep SpO2 above 90 % by adjusting the flow; check the signs."
                       : "Check the signs: a normal number does not rule out altitude illness.";
    case Position::Above:
      return "Check the oximeter trace; reassuring only if the casualty looks well.";
    default: break;
  }
  return on_oxygen ? "Judge by the signs; keep SpO2 above 90 % on oxygen."
                   : "Judge by the signs: no band to compare with here.";
}

}  // namespace

Result<Verdict> assess(const Reading& reading) {
  Verdict v;
  v.on_oxygen = reading.oxygen.has_value();
  v.fio2 = cascade::dry_air_fio2();
  if (reading.oxygen) {
    Result<supplemental_oxygen::DeliveredFio2> fio2 = supplemental_oxygen::delivered_fio2_at(
        reading.oxygen->device, reading.oxygen->flow, reading.barometric, reading.acclimatisation,
        reading.breathing);
    if (!fio2) return fio2.error();
    v.fio2 = fio2->fio2;
  }
  Result<expected_spo2::Expectation> e =
      expected_spo2::expected(reading.barometric, reading.acclimatisation, v.fio2);
  if (!e) return e.error();
  Result<expected_spo2::Assessment> a =
      expected_spo2::assess(reading.measured, e->band, e->extrapolated);
  if (!a) return a.error();
  v.band = e->band;
  v.assessment = a.value();
  v.below_oxygen_target =
      v.on_oxygen && reading.measured.in(percent) < supplemental_oxygen::kDefaultTargetPercent;
  if (v.below_oxygen_target) v.assessment.why.push_back(kWhyOxygenTarget);
  v.headline = headline(v.assessment.position, v.on_oxygen);
  v.action = action(v.assessment.position, v.on_oxygen, v.below_oxygen_target);
  return v;
}

}  // namespace firn::casualty_spo2
