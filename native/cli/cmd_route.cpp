// `firn route`: oxygen along an evacuation route (docs/route-plan.md) from a route file, with the
// cylinder types, reserve, flowmeter settings and atmosphere model of a team profile.
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <memory>
#include <sstream>

#include "cli/cli.hpp"
#include "cli/files.hpp"
#include "model/cautions.hpp"
#include "profile/route_file.hpp"
#include "model/route_plan.hpp"
#include "profile/team_profile.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace tp = firn::team_profile;

constexpr std::uintmax_t kMaxFileBytes = 1 << 20;  // a route or profile is a few kB

struct RouteOptions {
  std::optional<std::string> file, profile;
  bool demo = false;
  CLI::App* command = nullptr;
};

// Conservative read-outs: SpO2 down, oxygen used up, times down (model rounds swaps and spare).
long long floor_int(double v) { return static_cast<long long>(std::floor(v + 1e-9)); }
long long ceil_int(double v) { return static_cast<long long>(std::ceil(v - 1e-9)); }

Json leg_json(std::size_t i, const route::LegResult& l) {
  Json j = {{"leg", i + 1},
            {"kind", std::string(route::leg_kind_key(l.leg.kind))},
            {"label", l.leg.label},
            {"start_min", floor_int(l.start.in(minutes))},
            {"start_altitude_m", rounded(l.leg.start_altitude.in(metres), 0)},
            {"end_altitude_m", rounded(l.leg.end_altitude.in(metres), 0)},
            {"highest_altitude_m", rounded(l.highest.in(metres), 0)},
            {"duration_min", rounded(l.leg.duration.in(minutes), 1)},
            {"pressure_hpa", rounded(l.pressure.in(hectopascals), 0)},
            {"pio2_mmhg", rounded(l.pio2.in(mmhg), 0)},
            {"spo2_on_air_pct", floor_int(l.spo2_on_air.low.in(percent))},
            {"spo2_predicted_pct", floor_int(l.spo2_at_flow.low.in(percent))},
            {"needed_flow_lpm", nullptr},
            {"flow_lpm", rounded(l.flow.in(litres_per_minute), 1)},
            {"fixed_by_hand", l.fixed_by_hand},
            {"target_reachable", l.target_reachable},
            {"extrapolated", l.extrapolated},
            {"oxygen_used_l", ceil_int(l.oxygen_used.in(litres))}};
  if (l.needed_flow) j["needed_flow_lpm"] = rounded(l.needed_flow->in(litres_per_minute), 1);
  if (l.bag_inside_pressure) {
    j["bag_inside_pressure_hpa"] = rounded(l.bag_inside_pressure->in(hectopascals), 0);
  }
  return j;
}

std::string when(const route::RouteInput& in, Duration t) {
  std::string text = format_number(floor_int(t.in(minutes)), 0) + " min";
  return in.start_clock_min ? route::clock_text(*in.start_clock_min, t) + " (" + text + ")" : text;
}

void add_legs(const route::RouteInput& in, const route::RoutePlan& plan, Report& report) {
  Json legs = Json::array();
  for (std::size_t i = 0; i < plan.legs.size(); ++i) {
    const route::LegResult& l = plan.legs[i];
    legs.push_back(leg_json(i, l));
    std::string what = std::string(route::leg_kind_key(l.leg.kind)) + " " +
                       format_number(l.leg.start_altitude.in(metres), 0) +
                       (l.leg.end_altitude == l.leg.start_altitude
                            ? ""
                            : "-" + format_number(l.leg.end_altitude.in(metres), 0)) +
                       " m, " + format_number(l.leg.duration.in(minutes), 0) + " min";
    std::string result = format_number(l.pressure.in(hectopascals), 0) + " hPa, " +
                         format_number(l.flow.in(litres_per_minute), 1) + " L/min" +
                         (l.fixed_by_hand ? " (fixed)" : "") + ", SpO2 >= " +
                         format_number(floor_int(l.spo2_at_flow.low.in(percent)), 0) + " %, " +
                         format_number(ceil_int(l.oxygen_used.in(litres)), 0) + " L";
    report.rows.emplace_back(when(in, l.start) + " " + what, result);
  }
  report.json["legs"] = legs;
}

void add_cylinders(const route::RouteInput& in, const route::RoutePlan& plan, Report& report) {
  Json spans = Json::array();
  for (const route::CylinderSpan& s : plan.spans) {
    const route::StockCylinder& c = in.stock.cylinders[s.cylinder];
    spans.push_back({{"cylinder", c.label},
                     {"type", c.type_label},
                     {"start_min", floor_int(s.start.in(minutes))},
                     {"end_min", floor_int(s.end.in(minutes))},
                     {"start_gauge_bar", rounded(s.start_gauge.in(bar), 0)},
                     {"end_gauge_bar", rounded(s.end_gauge.in(bar), 0)},
                     {"reached_reserve", s.reached_reserve}});
  }
  report.json["cylinders"] = spans;
  Json swaps = Json::array();
  for (const route::Swap& s : plan.swaps) {
    const std::string& from = in.stock.cylinders[s.from].label;
    const std::string& to = in.stock.cylinders[s.to].label;
    Json j = {{"time_min", floor_int(s.time.in(minutes))}, {"from", from}, {"to", to}};
    if (in.start_clock_min) j["clock"] = route::clock_text(*in.start_clock_min, s.time);
    swaps.push_back(j);
    report.rows.emplace_back("Change cylinder " + when(in, s.time), from + " to " + to);
  }
  report.json["swaps"] = swaps;
  if (plan.reserve_reached) {
    report.json["reserve_reached_min"] = floor_int(plan.reserve_reached->in(minutes));
    report.rows.emplace_back("Stock at reserve", when(in, *plan.reserve_reached));
  } else {
    report.json["reserve_reached_min"] = nullptr;
  }
}

void add_verdict(const route::RouteInput& in, const route::RoutePlan& plan, Report& report) {
  report.json["enough"] = plan.enough;
  report.add_text("verdict", plan.verdict, "Oxygen");
  report.add("spare_min", plan.spare.in(minutes), 0, "Spare beyond the margin", "min");
  report.add("shortfall_min", plan.shortfall.in(minutes), 0, "Short by", "min");
  report.add("margin_min", in.stock.margin.in(minutes), 0, "Safety margin", "min");
  report.json["extra_cylinders"] = plan.extra_cylinders;
  report.add_text("count_in", in.stock.count_in_label, "Counted in");
  report.json["oxygen_needed_l"] = ceil_int(plan.oxygen_needed.in(litres));
  report.json["oxygen_usable_l"] = floor_int(plan.oxygen_usable.in(litres));
  report.add("max_sustainable_flow_lpm", plan.max_steady_flow.in(litres_per_minute), 1,
             "Highest steady flow to arrival + margin", "L/min");
  report.json["max_sustainable_flow_in_device_range"] = plan.max_steady_flow_in_device_range;
}

Result<Report> run_route(const RouteOptions& o) {
  if (o.demo) {  // the file itself (as `firn profile --demo`)
    Report report;
    if (o.command->count("--json") > 0) {
      report.json = json::parse(route::demo_route_json()).value;
    } else {
      std::fputs(std::string(route::demo_route_json()).c_str(), stdout);
    }
    return report;
  }
  if (!o.file) return Error{"--file is required: a route file (docs/route-plan.md, e.g. assets/demo-route.json)"};
  tp::TeamProfile profile = tp::demo_profile();
  if (o.profile) {
    Result<std::string> text = read_document(*o.profile, "profile", kMaxFileBytes);
    if (!text) return text.error();
    Result<tp::TeamProfile> parsed = tp::parse_profile(text.value());
    if (!parsed) return Error{*o.profile + ": " + parsed.error().message};
    profile = parsed.value();
  }
  Result<std::string> text = read_document(*o.file, "route file", kMaxFileBytes);
  if (!text) return text.error();
  Result<route::RouteInput> in = route::read_route_file(text.value(), profile);
  if (!in) return Error{*o.file + ": " + in.error().message};
  Result<route::RoutePlan> plan = route::plan_route(in.value());
  if (!plan) return Error{*o.file + ": " + plan.error().message};

  Report report;
  report.add_text("name", in->name, "Route");
  if (in->demo || profile.demo) report.json["demo"] = true;
  report.add_text("team_name", profile.team_name, "Team");
  report.json["estimate"] = std::string(route::kEstimateKind);
  report.add("route_min", plan->route_time.in(minutes), 0, "Route time", "min");
  report.add("highest_altitude_m", plan->highest_altitude.in(metres), 0, "Highest point", "m");
  add_legs(in.value(), plan.value(), report);
  add_cylinders(in.value(), plan.value(), report);
  add_verdict(in.value(), plan.value(), report);
  report.json["cautions"] = plan->cautions;
  report.json["assumptions"] = plan->assumptions;
  for (const std::string& c : plan->cautions) report.notes.push_back(c);
  for (const std::string& a : plan->assumptions) report.notes.push_back(a);
  if (!o.profile) report.notes.emplace_back("Cylinder types from the DEMO team profile (give --profile).");
  report.notes.emplace_back(cautions::short_line);
  return report;
}

}  // namespace

void register_route_commands(CommandTable& table) {
  auto o = std::make_shared<RouteOptions>();
  CLI::App* cmd = table.add("route", "Oxygen along an evacuation route (route file + team profile)",
                            [o] { return run_route(*o); });
  o->command = cmd;
  cmd->add_option("--file", o->file, "Route file JSON (docs/route-plan.md)");
  cmd->add_option("--profile", o->profile, "Team profile JSON (default: the demo profile)");
  cmd->add_flag("--demo", o->demo, "Print the demo route file (fictional team) as JSON");
}

}  // namespace firn::cli
