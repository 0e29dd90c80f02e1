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

// Least reassuring first: a concern outranks "no verdict", which outranks "within" or "above".
int reassurance(Position position) {
  switch (position) {
    case Position::Critical: return 0;
    case Position::WellBelow: return 1;
    case Position::Below: return 2;
    case Position::Extrapolated: return 3;
    case Position::Within: return 4;
    case Position::Above: return 5;
  }
  return 3;
}

Result<Verdict> assess_at(const Reading& reading, cascade::Acclimatisation acclimatisation) {
  Verdict v;
  v.on_oxygen = reading.oxygen.has_value();
  v.fio2 = cascade::dry_air_fio2();
  if (reading.oxygen) {
    Result<supplemental_oxygen::DeliveredFio2> fio2 = supplemental_oxygen::delivered_fio2_at(
        reading.oxygen->device, reading.oxygen->flow, reading.barometric, acclimatisation,
        reading.breathing);
    if (!fio2) return fio2.error();
    v.fio2 = fio2->fio2;
  }
  Result<expected_spo2::Expectation> e =
      expected_spo2::expected(reading.barometric, acclimatisation, v.fio2);
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

// "Within" and "above" lead to the same action; every other pair of positions does not.
bool same_action(Position a, Position b) {
  auto reassuring = [](Position p) { return p == Position::Within || p == Position::Above; };
  return a == b || (reassuring(a) && reassuring(b));
}

// Both ends of acclimatisation; on a tie the three-week band (the higher one) is shown.
Result<Verdict> assess_any_time(const Reading& reading) {
  Result<Verdict> arrival = assess_at(reading, cascade::acclimatisation_of(cascade::Exposure::Acute));
  if (!arrival) return arrival.error();
  Result<Verdict> weeks = assess_at(reading, cascade::acclimatisation_of(cascade::Exposure::Acclimatised));
  if (!weeks) return weeks.error();
  bool arrival_worse = reassurance(arrival->assessment.position) < reassurance(weeks->assessment.position);
  Verdict v = arrival_worse ? arrival.value() : weeks.value();
  v.judged_at = arrival_worse ? cascade::Exposure::Acute : cascade::Exposure::Acclimatised;
  v.ends_differ = !same_action(arrival->assessment.position, weeks->assessment.position);
  std::vector<std::string_view>& why = v.assessment.why;
  why.insert(why.begin(), kWhyTimeNotGiven);
  if (v.ends_differ) {
    why.insert(why.begin() + 1, kWhyEndsDiffer);
    v.headline += arrival_worse ? " (as on arrival; enter the time here)" : " (as after 3 weeks; enter the time here)";
  }
  return v;
}

}  // namespace

Result<Verdict> assess(const Reading& reading) {
  if (!reading.acclimatisation) return assess_any_time(reading);
  return assess_at(reading, *reading.acclimatisation);
}

}  // namespace firn::casualty_spo2
