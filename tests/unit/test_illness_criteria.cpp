// HAPE and HACE criteria: Lake Louise consensus definitions as given by Hackett PH & Roach RC,
// N Engl J Med 2001;345:107 (and the WMS guidelines, Luks 2019/2024).
#include <catch2/catch.hpp>

#include "model/illness_criteria.hpp"

using namespace firn::illness_criteria;

TEST_CASE("HAPE: two symptoms and two signs after a recent ascent", "[criteria]") {
  // Hackett & Roach 2001: at least two of dyspnoea at rest, cough, weakness/decreased exercise
  // performance, chest tightness or congestion; and at least two of crackles or wheezing, central
  // cyanosis, tachypnoea, tachycardia.
  Findings f;
  f.dyspnoea_at_rest = true;
  f.cough = true;
  f.crackles_or_wheezing = true;
  CHECK_FALSE(evaluate(f).meets_hape);  // one sign
  f.tachypnoea = true;
  Outcome o = evaluate(f);
  CHECK(o.hape_symptoms == 2);
  CHECK(o.hape_signs == 2);
  CHECK(o.meets_hape);
  CHECK(o.lines.front().find("Meets the criteria for HAPE") == 0);
  f.recent_ascent = false;
  CHECK_FALSE(evaluate(f).meets_hape);
  // Symptoms alone never meet them, however many.
  Findings symptoms;
  symptoms.dyspnoea_at_rest = symptoms.cough = symptoms.weakness_or_reduced_performance =
      symptoms.chest_tightness_or_congestion = true;
  CHECK_FALSE(evaluate(symptoms).meets_hape);
}

TEST_CASE("HACE: with AMS one of mental change or ataxia, without AMS both", "[criteria]") {
  // Hackett & Roach 2001: a change in mental status and/or ataxia in a person with AMS, or both
  // in a person without AMS.
  Findings f;
  f.ataxia = true;
  CHECK_FALSE(evaluate(f).meets_hace);
  f.has_ams = true;
  CHECK(evaluate(f).meets_hace);
  Findings both;
  both.ataxia = both.mental_status_change = true;
  CHECK(evaluate(both).meets_hace);
  both.recent_ascent = false;
  CHECK_FALSE(evaluate(both).meets_hace);
}

TEST_CASE("SpO2 out of proportion supports HAPE but is not a criterion", "[criteria]") {
  // WMS guidelines (Luks 2019/2024): hypoxaemia out of proportion to altitude supports HAPE.
  Findings f;
  f.spo2_out_of_proportion = true;
  Outcome o = evaluate(f);
  CHECK(o.spo2_supports_hape);
  CHECK_FALSE(o.meets_hape);
  REQUIRE_FALSE(o.lines.empty());
  CHECK(o.lines.front().find("supports HAPE") != std::string::npos);
  CHECK(evaluate(Findings{}).lines.empty());  // nothing ticked, nothing said
}
