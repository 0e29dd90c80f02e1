// 2018 Lake Louise acute mountain sickness score (Roach RC et al., "The 2018 Lake Louise Acute
// Mountain Sickness Score", High Alt Med Biol 2018;19:4–6). Four self-reported items, 0–3 each.
#pragma once

#include <array>
#include <string_view>

#include "model/result.hpp"

namespace firn::lake_louise {

// Each item: 0 none, 1 mild, 2 moderate, 3 severe / incapacitating.
struct Answers {
  int headache = 0;
  int gastrointestinal = 0;   // poor appetite, nausea, vomiting
  int fatigue = 0;            // fatigue and/or weakness
  int dizziness = 0;          // dizziness / light-headedness
  bool recent_ascent = true;  // gain in altitude in the last few days
};

enum class Category {
  None,      // total below 3, or no headache, or no recent ascent
  Mild,      // 3–5
  Moderate,  // 6–9
  Severe,    // 10–12
};
std::string_view category_key(Category category);   // "none", "mild", "moderate", "severe"
std::string_view category_name(Category category);  // "No AMS", "Mild AMS", ...

struct Score {
  int total = 0;                // 0–12
  bool meets_ams_definition = false;  // recent ascent + headache ≥ 1 + total ≥ 3
  Category category = Category::None;
  bool consider_other_causes = false;  // total ≥ 3 without headache: see kOtherCauses
};

// A score of 3 or more without headache is not AMS by definition (Roach 2018); the symptoms
// still need a cause. The list is common practice in altitude medicine (as named in issue 11).
inline constexpr std::string_view kOtherCauses =
    "Symptoms without headache are not AMS by the 2018 definition: think of other causes - "
    "exhaustion, dehydration, hypothermia, hyponatraemia, carbon monoxide (stoves in tents).";

// Items outside 0–3 (or a missing headache item for AMS) are errors naming the valid range.
Result<Score> score(const Answers& answers);

// What the score is not, for the result screen and the card.
inline constexpr std::array<std::string_view, 4> caveats{
    "The Lake Louise score is a self-report tool for research and triage, not a diagnosis.",
    "AMS needs a recent ascent, a headache and a total of 3 or more (Roach 2018).",
    "Any ataxia, confusion or drowsiness suggests HACE; breathlessness at rest suggests HAPE: "
    "treat as an emergency whatever the score.",
    "The clinical functional score (how much symptoms limit activity) is reported separately."};

}  // namespace firn::lake_louise
