#include "model/lake_louise.hpp"

#include <string>

namespace firn::lake_louise {
namespace {

Result<int> checked_item(int value, std::string_view name) {
  if (value < 0 || value > 3) {
    return range_error(std::string(name) + " item", 0, 3, "points", value);
  }
  return value;
}

}  // namespace

std::string_view category_key(Category category) {
  switch (category) {
    case Category::None: return "none";
    case Category::Mild: return "mild";
    case Category::Moderate: return "moderate";
    case Category::Severe: return "severe";
  }
  return "none";
}

std::string_view category_name(Category category) {
  switch (category) {
    case Category::None: return "No AMS by the score";
    case Category::Mild: return "Mild AMS";
    case Category::Moderate: return "Moderate AMS";
    case Category::Severe: return "Severe AMS";
  }
  return "No AMS by the score";
}

Result<Score> score(const Answers& answers) {
  int total = 0;
  const std::pair<int, std::string_view> items[] = {{answers.headache, "headache"},
                                                    {answers.gastrointestinal, "gastrointestinal"},
                                                    {answers.fatigue, "fatigue/weakness"},
                                                    {answers.dizziness, "dizziness/light-headedness"}};
  for (const auto& [value, name] : items) {
    Result<int> checked = checked_item(value, name);
    if (!checked) return checked.error();
    total += checked.value();
  }
  Score result;
  result.total = total;
  // Roach 2018: AMS = recent gain in altitude, headache, and a total of 3 or more.
  result.meets_ams_definition = answers.recent_ascent && answers.headache >= 1 && total >= 3;
  result.consider_other_causes = answers.headache == 0 && total >= 3;
  if (result.meets_ams_definition) {
    result.category = total >= 10 ? Category::Severe
                      : total >= 6 ? Category::Moderate
                                   : Category::Mild;
  }
  return result;
}

}  // namespace firn::lake_louise
