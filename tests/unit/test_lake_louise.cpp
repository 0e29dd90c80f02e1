// 2018 Lake Louise AMS score.
#include <catch2/catch.hpp>

#include "model/lake_louise.hpp"
#include "sweep.hpp"

using namespace firn;
using namespace firn::lake_louise;

namespace {
Score scored(int headache, int gi, int fatigue, int dizziness, bool ascent = true) {
  Result<Score> s = score({headache, gi, fatigue, dizziness, ascent});
  REQUIRE(s.ok());
  return s.value();
}
}  // namespace

TEST_CASE("total and categories", "[lake-louise]") {
  // Roach RC et al., High Alt Med Biol 2018;19:4-6: four items 0–3; AMS = recent ascent +
  // headache + total ≥ 3; mild 3–5, moderate 6–9, severe 10–12.
  CHECK(scored(0, 0, 0, 0).total == 0);
  CHECK(scored(0, 0, 0, 0).category == Category::None);
  CHECK(scored(1, 1, 0, 0).category == Category::None);  // total 2
  CHECK(scored(1, 1, 1, 0).category == Category::Mild);  // 3: lower edge of mild
  CHECK(scored(2, 2, 1, 0).category == Category::Mild);  // 5
  CHECK(scored(2, 2, 2, 0).category == Category::Moderate);  // 6
  CHECK(scored(3, 3, 3, 0).category == Category::Moderate);  // 9
  CHECK(scored(3, 3, 3, 1).category == Category::Severe);    // 10
  CHECK(scored(3, 3, 3, 3).total == 12);
  CHECK(scored(3, 3, 3, 3).category == Category::Severe);
}

TEST_CASE("AMS needs a headache and a recent ascent", "[lake-louise]") {
  // Roach 2018: without headache there is no AMS whatever the total.
  Score no_headache = scored(0, 3, 3, 3);
  CHECK(no_headache.total == 9);
  CHECK_FALSE(no_headache.meets_ams_definition);
  CHECK(no_headache.category == Category::None);
  Score no_ascent = scored(2, 2, 2, 2, false);
  CHECK_FALSE(no_ascent.meets_ams_definition);
  CHECK(no_ascent.category == Category::None);
  CHECK(scored(1, 1, 1, 0).meets_ams_definition);
}

TEST_CASE("items outside 0–3 are errors naming the range", "[lake-louise][errors]") {
  Result<Score> high = score({4, 0, 0, 0, true});
  REQUIRE_FALSE(high.ok());
  CHECK(high.error().message == "headache item must be between 0 and 3 points (got 4 points)");
  Result<Score> negative = score({0, 0, -1, 0, true});
  REQUIRE_FALSE(negative.ok());
  CHECK(negative.error().message.find("fatigue/weakness item") != std::string::npos);
  CHECK(category_key(Category::Moderate) == "moderate");
}

TEST_CASE("sweep: every answer combination", "[lake-louise][sweep]") {
  // All 4⁴ × 2 inputs: the total is the sum (0–12), and the category follows Roach 2018.
  for (int h = 0; h <= 3; ++h) {
    for (int g = 0; g <= 3; ++g) {
      for (int f = 0; f <= 3; ++f) {
        for (int d = 0; d <= 3; ++d) {
          for (bool ascent : {true, false}) {
            Score s = scored(h, g, f, d, ascent);
            int total = h + g + f + d;
            CHECK(s.total == total);
            CHECK(s.meets_ams_definition == (ascent && h >= 1 && total >= 3));
            Category want = !s.meets_ams_definition ? Category::None
                            : total >= 10           ? Category::Severe
                            : total >= 6            ? Category::Moderate
                                                    : Category::Mild;
            CHECK(s.category == want);
          }
        }
      }
    }
  }
}

TEST_CASE("sweep: just outside 0–3 on every item the message names it", "[lake-louise][sweep][errors]") {
  for (int bad : {-1, 4}) {
    CHECK_REFUSED_NAMING(score({bad, 0, 0, 0, true}), "headache item must be between 0 and 3 points");
    CHECK_REFUSED_NAMING(score({0, bad, 0, 0, true}), "gastrointestinal item must be between 0 and 3 points");
    CHECK_REFUSED_NAMING(score({0, 0, bad, 0, true}), "fatigue/weakness item must be between 0 and 3 points");
    CHECK_REFUSED_NAMING(score({0, 0, 0, bad, true}), "dizziness/light-headedness item must be between 0 and 3 points");
  }
}

TEST_CASE("a high score without headache prompts other causes", "[lake-louise]") {
  // Roach 2018: AMS needs a headache. Symptoms scoring 3 or more without it prompt other causes
  // (exhaustion, dehydration, hypothermia, hyponatraemia, carbon monoxide: common practice).
  lake_louise::Answers a{0, 2, 2, 1, true};
  lake_louise::Score s = lake_louise::score(a).value();
  CHECK(s.total == 5);
  CHECK_FALSE(s.meets_ams_definition);
  CHECK(s.consider_other_causes);
  CHECK(std::string(lake_louise::kOtherCauses).find("carbon monoxide") != std::string::npos);
  CHECK_FALSE(lake_louise::score({0, 1, 1, 0, true})->consider_other_causes);  // total 2
  CHECK_FALSE(lake_louise::score({1, 1, 1, 0, true})->consider_other_causes);  // AMS, headache
}
