// `firn ams`: the 2018 Lake Louise AMS score (Roach 2018) from its four items.
#include <cmath>
#include <memory>

#include "cli/cli.hpp"
#include "model/cautions.hpp"
#include "model/lake_louise.hpp"

namespace firn::cli {
namespace {

struct AmsOptions {
  std::optional<std::string> headache, gi, fatigue, dizziness;
  bool no_recent_ascent = false;
};

// A 0–3 item: a whole number of points.
Result<int> item(const std::optional<std::string>& text, const std::string& option,
                 const std::string& what) {
  Result<double> n = required_number(text, option, what + " item", 0, 3, "points");
  if (!n) return n.error();
  if (n.value() != std::floor(n.value())) {
    return Error{option + ": " + what + " item must be a whole number between 0 and 3 points (got " +
                 format_number(n.value()) + ")"};
  }
  return static_cast<int>(n.value());
}

Result<Report> run_ams(const AmsOptions& o) {
  Result<int> headache = item(o.headache, "--headache", "headache");
  if (!headache) return headache.error();
  Result<int> gi = item(o.gi, "--gi", "gastrointestinal");
  if (!gi) return gi.error();
  Result<int> fatigue = item(o.fatigue, "--fatigue", "fatigue/weakness");
  if (!fatigue) return fatigue.error();
  Result<int> dizziness = item(o.dizziness, "--dizziness", "dizziness/light-headedness");
  if (!dizziness) return dizziness.error();
  lake_louise::Answers answers{headache.value(), gi.value(), fatigue.value(), dizziness.value(),
                               !o.no_recent_ascent};
  Result<lake_louise::Score> s = lake_louise::score(answers);
  if (!s) return s.error();
  Report report;
  report.add("headache", answers.headache, 0, "Headache", "");
  report.add("gi", answers.gastrointestinal, 0, "Gastrointestinal", "");
  report.add("fatigue", answers.fatigue, 0, "Fatigue/weakness", "");
  report.add("dizziness", answers.dizziness, 0, "Dizziness/light-headedness", "");
  report.add("total", s->total, 0, "Lake Louise score (2018)", "of 12");
  report.add_text("category", std::string(lake_louise::category_key(s->category)), "Category");
  report.json["ams"] = s->meets_ams_definition;
  report.json["recent_ascent"] = answers.recent_ascent;
  report.rows.emplace_back("Meets AMS definition", s->meets_ams_definition ? "yes" : "no");
  report.json["consider_other_causes"] = s->consider_other_causes;
  if (s->consider_other_causes) {
    report.json["other_causes"] = std::string(lake_louise::kOtherCauses);
    report.notes.emplace_back(lake_louise::kOtherCauses);
  }
  Json caveats = Json::array();
  for (std::string_view c : lake_louise::caveats) {
    caveats.push_back(std::string(c));
    report.notes.emplace_back(c);
  }
  report.json["caveats"] = caveats;
  report.notes.emplace_back(cautions::short_line);
  return report;
}

}  // namespace

void register_ams_commands(CommandTable& table) {
  auto o = std::make_shared<AmsOptions>();
  CLI::App* ams = table.add("ams", "2018 Lake Louise AMS score (Roach 2018)",
                            [o] { return run_ams(*o); });
  ams->add_option("--headache", o->headache, "Headache, 0-3");
  ams->add_option("--gi", o->gi, "Gastrointestinal symptoms, 0-3");
  ams->add_option("--fatigue", o->fatigue, "Fatigue and/or weakness, 0-3");
  ams->add_option("--dizziness", o->dizziness, "Dizziness/light-headedness, 0-3");
  ams->add_flag("--no-recent-ascent", o->no_recent_ascent,
                "No gain in altitude in the last days (then it is not AMS by definition)");
}

}  // namespace firn::cli
