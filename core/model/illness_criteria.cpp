#include "model/illness_criteria.hpp"

namespace firn::illness_criteria {

Outcome evaluate(const Findings& f) {
  Outcome o;
  o.hape_symptoms = f.dyspnoea_at_rest + f.cough + f.weakness_or_reduced_performance +
                    f.chest_tightness_or_congestion;
  o.hape_signs = f.crackles_or_wheezing + f.central_cyanosis + f.tachypnoea + f.tachycardia;
  o.anything_checked = o.hape_symptoms + o.hape_signs + f.mental_status_change + f.ataxia > 0;
  o.meets_hape = f.recent_ascent && o.hape_symptoms >= kHapeSymptomsNeeded &&
                 o.hape_signs >= kHapeSignsNeeded;
  o.meets_hace = f.recent_ascent && (f.has_ams ? (f.mental_status_change || f.ataxia)
                                               : (f.mental_status_change && f.ataxia));
  o.spo2_supports_hape = f.spo2_out_of_proportion;

  if (o.meets_hace) {
    o.lines.push_back("Meets the criteria for HACE: descend now, oxygen, dexamethasone per protocol.");
  }
  if (o.meets_hape) {
    o.lines.push_back(std::string("Meets the criteria for HAPE") +
                      (o.spo2_supports_hape ? ", and the SpO2 supports it" : "") +
                      ": oxygen to SpO2 > 90 %, descend, keep warm and at rest.");
  } else if (o.spo2_supports_hape) {
    o.lines.push_back("SpO2 out of proportion to altitude supports HAPE (WMS); criteria met so far: " +
                      std::to_string(o.hape_symptoms) + " of 2 symptoms, " +
                      std::to_string(o.hape_signs) + " of 2 signs. Examine the chest.");
  } else if (o.hape_symptoms + o.hape_signs > 0) {
    o.lines.push_back("HAPE criteria not met (" + std::to_string(o.hape_symptoms) + " of 2 symptoms, " +
                      std::to_string(o.hape_signs) + " of 2 signs): this does not exclude it; re-check.");
  }
  if (f.recent_ascent && !o.meets_hace && (f.mental_status_change || f.ataxia)) {
    // Only reached without AMS: with AMS either one meets the criteria.
    o.lines.push_back("Mental change or ataxia alone: HACE if the casualty has AMS (score it); "
                      "treat as HACE until shown otherwise.");
  }
  if (!f.recent_ascent && o.anything_checked) {
    o.lines.push_back("No recent ascent: the altitude-illness criteria do not apply; look for "
                      "another cause.");
  }
  return o;
}

}  // namespace firn::illness_criteria
