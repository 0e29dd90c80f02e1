// The published diagnostic criteria for high-altitude pulmonary and cerebral oedema, as a
// checklist: the Lake Louise consensus definitions as given by Hackett PH & Roach RC, "High-
// altitude illness", N Engl J Med 2001;345:107–114, and used by the WMS guidelines (Luks AM et
// al., Wilderness Environ Med 2019, updated 2024), which add that hypoxaemia out of proportion to
// altitude supports HAPE. The medic ticks what is present; the model counts.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace firn::illness_criteria {

struct Findings {
  bool recent_ascent = true;  // a gain in altitude in the last days: all criteria need it
  // HAPE symptoms (at least two).
  bool dyspnoea_at_rest = false;
  bool cough = false;
  bool weakness_or_reduced_performance = false;
  bool chest_tightness_or_congestion = false;
  // HAPE signs (at least two).
  bool crackles_or_wheezing = false;  // in at least one lung field
  bool central_cyanosis = false;
  bool tachypnoea = false;
  bool tachycardia = false;
  // HACE.
  bool mental_status_change = false;
  bool ataxia = false;
  bool has_ams = false;  // meets the Lake Louise AMS definition (lake_louise::score)
  // The SpO2 verdict is critical or well below the band (expected_spo2::Assessment::hape_suspected).
  bool spo2_out_of_proportion = false;
};

inline constexpr int kHapeSymptomsNeeded = 2;
inline constexpr int kHapeSignsNeeded = 2;

inline constexpr std::string_view kSource =
    "Lake Louise consensus criteria as given by Hackett PH & Roach RC (N Engl J Med "
    "2001;345:107) and the WMS guidelines (Luks AM et al. 2019, updated 2024).";

struct Outcome {
  int hape_symptoms = 0;
  int hape_signs = 0;
  bool meets_hape = false;  // recent ascent, ≥ 2 symptoms and ≥ 2 signs
  bool meets_hace = false;  // recent ascent and (with AMS: mental change or ataxia; without: both)
  bool spo2_supports_hape = false;  // WMS: hypoxaemia out of proportion to altitude
  bool anything_checked = false;
  std::vector<std::string> lines;  // the outcome in words, most serious first
};

Outcome evaluate(const Findings& findings);

}  // namespace firn::illness_criteria
