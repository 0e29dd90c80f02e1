// `firn plan`, `firn card` and `firn profile`: the team profile file (docs/team-profile.md), the
// evacuation oxygen plan it describes, and the printed pocket card made from it.
#include <cstdio>
#include <ctime>
#include <filesystem>
#include <fstream>
#include <memory>
#include <sstream>

#include "cli/cli.hpp"
#include "cli/files.hpp"
#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/evacuation_plan.hpp"
#include "profile/pocket_card.hpp"
#include "profile/team_profile.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace tp = firn::team_profile;
namespace card = firn::pocket_card;

constexpr std::uintmax_t max_profile_bytes = 1 << 20;  // a profile is a few kB

Result<tp::TeamProfile> load_profile(const std::optional<std::string>& path) {
  if (!path) return Error{"--profile is required: a team profile JSON file (firn profile --demo prints one)"};
  Result<std::string> text = read_document(*path, "profile", max_profile_bytes);
  if (!text) return text.error();
  Result<tp::TeamProfile> profile = tp::parse_profile(text.value());
  if (!profile) return Error{*path + ": " + profile.error().message};
  return profile;
}

// [SECTION] firn plan

struct PlanOptions {
  std::optional<std::string> profile, ambient_pressure;
};

// Plan minutes: what lasts rounds down, what is missing rounds up (whole minutes).
double down_min(Duration d) { return cylinder::whole_minutes_down(d).in(minutes); }
double up_min(Duration d) { return cylinder::whole_minutes_up(d).in(minutes); }

Json flow_or_null(const std::optional<VolumeFlow>& f) {
  return f ? Json(rounded(f->in(litres_per_minute), 1)) : Json(nullptr);
}

Result<Report> run_plan(const PlanOptions& o) {
  Result<tp::TeamProfile> loaded = load_profile(o.profile);
  if (!loaded) return loaded.error();
  const tp::TeamProfile& p = loaded.value();
  std::optional<Pressure> measured;
  if (o.ambient_pressure) {
    // A measured air pressure where the gauges are read wins over evacuation.altitude.
    Result<Pressure> m = measured_ambient_pressure(o.ambient_pressure);
    if (!m) return m.error();
    measured = m.value();
  }
  Result<evacuation::PlanInput> made = tp::plan_input(p, measured);
  if (!made) return Error{*o.profile + ": " + made.error().message};
  const evacuation::PlanInput& input = made.value();
  const tp::EvacuationSection& e = *p.evacuation;
  Result<evacuation::EvacuationPlan> plan = evacuation::plan_evacuation(input);
  if (!plan) return Error{*o.profile + ": " + plan.error().message};

  Report report;
  report.add_text("team_name", p.team_name, "Team");
  if (p.demo) report.json["demo"] = true;
  report.add("evacuation_min", e.evacuation_time.in(minutes), 0, "Evacuation", "min");
  Json timeline = Json::array();
  for (const evacuation::PlanEvent& event : plan->events) {
    timeline.push_back({{"time_min", down_min(event.time)},
                        {"event", std::string(evacuation::event_key(event.kind))},
                        {"cylinder", input.cylinders[event.cylinder_index].label},
                        {"text", event.text}});
    report.rows.emplace_back(format_number(down_min(event.time), 0) + " min", event.text);
  }
  report.json["timeline"] = timeline;
  Json uses = Json::array();
  for (const evacuation::CylinderUse& use : plan->uses) {
    uses.push_back({{"cylinder", use.label},
                    {"start_min", down_min(use.start)},
                    {"end_min", down_min(use.end)},
                    {"start_gauge_bar", rounded(use.start_gauge.in(bar), 1)},
                    {"end_gauge_bar", rounded(use.end_gauge.in(bar), 1)},
                    {"delivered_l", rounded(use.delivered.in(litres), 0)},
                    {"reached_reserve", use.reached_reserve}});
  }
  report.json["uses"] = uses;
  // "enough" only with the margin and never from an extrapolated figure (evacuation::Verdict).
  report.json["enough"] = plan->verdict == evacuation::Verdict::Enough;
  report.json["lasts_to_arrival"] = plan->enough;
  report.json["verdict"] = std::string(evacuation::verdict_key(plan->verdict));
  report.add_text("verdict_text", evacuation::verdict_text(plan.value()), "Oxygen");
  report.json["extrapolated"] = plan->extrapolated;
  report.add("margin_min", up_min(plan->margin), 0, "Safety margin", "min");
  report.json["max_sustainable_flow_lpm"] = flow_or_null(plan->max_sustainable_flow);
  report.json["max_flow_to_arrival_lpm"] = flow_or_null(plan->max_flow_to_arrival);
  report.rows.emplace_back(
      "Steady flow that lasts",
      plan->max_sustainable_flow
          ? format_number(plan->max_sustainable_flow->in(litres_per_minute), 1) +
                " L/min to arrival with the margin kept"
          : std::string("below 0.1 L/min: no steady flow lasts to arrival with the margin"));
  report.add("reserve_bar", p.reserve_pressure_gauge.in(bar), 1, "Reserve (gauge)", "bar");
  report.json["reserve_psi"] = rounded(p.reserve_pressure_gauge.in(psi), 0);
  report.add("oxygen_needed_l", plan->oxygen_needed.in(litres), 0, "Oxygen needed", "L");
  report.add("oxygen_usable_l", plan->oxygen_usable.in(litres), 0, "Usable above reserve", "L");
  report.add("shortfall_min", up_min(plan->shortfall), 0, "Shortfall", "min");
  report.add("spare_min", down_min(plan->spare), 0, "Spare", "min");
  if (plan->supply_lasts) {
    report.add("supply_lasts_min", down_min(*plan->supply_lasts), 0, "Supply lasts", "min");
  } else {
    report.json["supply_lasts_min"] = nullptr;
  }
  std::string counted = input.counting_cylinder ? input.counting_cylinder->label
                                                : input.cylinders.front().label;
  report.add_text("count_in", counted, "Counted in");
  report.json["extra_cylinders_needed"] = plan->extra_cylinders_needed;
  report.rows.emplace_back("Extra cylinders needed", std::to_string(plan->extra_cylinders_needed));
  report.add("spare_cylinders", plan->spare_cylinders, 2, "Spare cylinders", "");
  for (const std::string& a : plan->assumptions) report.notes.push_back(a);
  report.json["assumptions"] = plan->assumptions;
  report.notes.emplace_back(cautions::short_line);
  return report;
}

// [SECTION] firn card

struct CardOptions {
  std::optional<std::string> profile, out, size, csv, date;
};

std::string today() {
  std::time_t now = std::time(nullptr);
  std::tm local{};
  localtime_r(&now, &local);
  char buffer[16];
  std::strftime(buffer, sizeof buffer, "%Y-%m-%d", &local);
  return buffer;
}

bool looks_like_date(const std::string& s) {
  if (s.size() != 10 || s[4] != '-' || s[7] != '-') return false;
  for (size_t i : {0, 1, 2, 3, 5, 6, 8, 9}) {
    if (!std::isdigit(static_cast<unsigned char>(s[i]))) return false;
  }
  return true;
}

Result<Report> run_card(const CardOptions& o) {
  Result<tp::TeamProfile> profile = load_profile(o.profile);
  if (!profile) return profile.error();
  if (!o.out) return Error{"--out is required: the HTML file to write, e.g. card.html"};
  card::Size size = card::Size::A6;
  if (o.size) {
    Result<card::Size> s = card::parse_size(*o.size);
    if (!s) return Error{"--size: " + s.error().message};
    size = s.value();
  }
  std::string date = o.date.value_or(today());
  if (!looks_like_date(date)) return Error{"--date: '" + date + "' must be YYYY-MM-DD"};

  card::Card built = card::build_card(profile.value(), date);
  Result<bool> written = write_document(*o.out, card::render_html(built, size));
  if (!written) return Error{"--out: " + written.error().message};
  Report report;
  report.add_text("html", *o.out, "Card");
  report.add_text("size", std::string(card::size_key(size)), "Size");
  report.json["pages"] = card::page_count(built, size);
  report.rows.emplace_back("Pages", std::to_string(card::page_count(built, size)));
  Json csv_files = Json::array();
  if (o.csv) {
    std::error_code ec;
    std::filesystem::create_directories(*o.csv, ec);
    if (ec) return Error{"--csv: cannot create directory '" + *o.csv + "': " + ec.message()};
    for (const card::Table& table : built.tables) {
      std::filesystem::path path = std::filesystem::path(*o.csv) / (table.id + ".csv");
      Result<bool> ok = write_document(path, card::table_csv(table));
      if (!ok) return Error{"--csv: " + ok.error().message};
      csv_files.push_back(path.string());
      report.rows.emplace_back("CSV", path.string());
    }
  }
  report.json["csv"] = csv_files;
  if (profile->demo) report.notes.emplace_back("This profile is DEMO DATA; the card says so.");
  report.notes.emplace_back(cautions::short_line);
  return report;
}

// [SECTION] firn profile

struct ProfileOptions {
  std::optional<std::string> check;
  bool demo = false;
  CLI::App* command = nullptr;
};

Result<Report> run_profile(const ProfileOptions& o) {
  bool json = o.command->count("--json") > 0;
  if (o.demo == o.check.has_value()) return Error{"give --check FILE or --demo"};
  Report report;
  if (o.demo) {
    if (json) {
      report.json = json::parse(tp::demo_profile_json()).value;
    } else {
      std::fputs(std::string(tp::demo_profile_json()).c_str(), stdout);
    }
    return report;
  }
  Result<std::string> text = read_document(*o.check, "profile", max_profile_bytes);
  if (!text) return text.error();
  tp::Problems problems = tp::check_profile(text.value());
  if (!problems.empty()) {
    if (!json) {
      for (const std::string& line : problems.lines) std::printf("problem: %s\n", line.c_str());
    }
    return Error{*o.check + ": " + std::to_string(problems.lines.size()) +
                 (problems.lines.size() == 1 ? " problem: " : " problems: ") + problems.joined()};
  }
  tp::TeamProfile profile = tp::parse_profile(text.value()).value();
  report.json["ok"] = true;
  report.add_text("team_name", profile.team_name, "Team");
  report.json["demo"] = profile.demo;
  report.add("cylinder_types", static_cast<double>(profile.cylinders.size()), 0, "Cylinder types", "");
  report.add("card_rows", static_cast<double>(profile.card_altitudes().size()), 0, "Card rows", "");
  report.json["evacuation"] = profile.evacuation.has_value();
  int version = static_cast<int>(json::parse(text.value()).value["schema_version"].as_integer());
  bool migrated = version < tp::current_schema_version;
  report.json["migrated_from_older_schema"] = migrated;
  if (migrated) report.notes.emplace_back("older schema: read and upgraded; save it again to keep the new form");
  report.notes.emplace_back("profile is valid");
  return report;
}

}  // namespace

void register_profile_commands(CommandTable& table) {
  auto plan = std::make_shared<PlanOptions>();
  CLI::App* plan_cmd = table.add("plan", "Evacuation oxygen plan from a team profile",
                                 [plan] { return run_plan(*plan); });
  plan_cmd->add_option("--profile", plan->profile, "Team profile JSON (docs/team-profile.md)");
  plan_cmd->add_option("--ambient-pressure", plan->ambient_pressure,
                       "Measured air pressure where the gauges are read (instead of "
                       "evacuation.altitude), e.g. 600hPa");

  auto c = std::make_shared<CardOptions>();
  CLI::App* card_cmd = table.add("card", "Printable pocket card or team reference sheet (HTML, optional CSV) from a team profile",
                                 [c] { return run_card(*c); });
  card_cmd->add_option("--profile", c->profile, "Team profile JSON");
  card_cmd->add_option("--out", c->out, "HTML file to write");
  card_cmd->add_option("--size", c->size,
                       "a6 (default: one sheet, 2 sides), wallet (85.6 x 54 mm, 4 sides) or "
                       "reference (the A4 team reference sheet)");
  card_cmd->add_option("--csv", c->csv, "Also write every table as CSV into this directory");
  card_cmd->add_option("--date", c->date, "Date printed on the card, YYYY-MM-DD (default today)");

  auto p = std::make_shared<ProfileOptions>();
  CLI::App* profile_cmd = table.add("profile", "Check a team profile file, or print the demo profile",
                                    [p] { return run_profile(*p); });
  p->command = profile_cmd;
  profile_cmd->add_option("--check", p->check, "Validate this profile file and list its problems");
  profile_cmd->add_flag("--demo", p->demo, "Print the demo profile (fictional team) as JSON");
}

}  // namespace firn::cli
