// Screen "Route": oxygen along the carry-out. The route's altitude over time with the casualty's
// predicted SpO2 beneath it, and one bar per cylinder showing when it is on the casualty. Legs come
// from quick presets and are changed on the keypad; the cylinders are the team profile's types.
// Every figure and the verdict come from route::plan_route (the CLI's `firn route` too).
#include "ui/panels.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "model/clock.hpp"
#include "model/route_plan.hpp"
#include "profile/route_file.hpp"
#include "ui/fields.hpp"
#include "ui/file_exchange.hpp"
#include "ui/format.hpp"
#include "ui/memo.hpp"
#include "ui/plot.hpp"
#include "ui/route_store.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {
namespace {

using namespace units;
using route::Leg;
using route::LegKind;
using route::Limits;

void draw_route_message(const AppState& state) {
  const FileExchange& file = state.route.file;
  if (file.message.empty()) return;
  message_line(file.message, file.message_is_problem);
  test_hook::item_text("Route message", file.message);
}

double end_altitude_m(const route::RouteInput& in) {
  return in.legs.empty() ? 3000.0 : in.legs.back().end_altitude.in(metres);
}

Leg preset_leg(LegKind kind, double from_m, double to_m, double min, const char* label) {
  Leg leg;
  leg.kind = kind;
  leg.label = label;
  leg.start_altitude = metres(std::clamp(from_m, Limits::altitude_low_m, Limits::altitude_high_m));
  leg.end_altitude = metres(std::clamp(to_m, Limits::altitude_low_m, Limits::altitude_high_m));
  leg.duration = minutes(min);
  if (kind == LegKind::Bag) {
    leg.bag_oxygen_feed = litres_per_minute(2);
    leg.bag_flush = litres_per_minute(40);
  }
  return leg;
}

void draw_presets(AppState& state) {
  route::RouteInput& in = state.route.input;
  double here = end_altitude_m(in);
  bool room = in.legs.size() < Limits::legs_max;
  heading("Add a leg");
  if (room && big_button(state.display, "Carry down 600 m in 2 h")) {
    in.legs.push_back(preset_leg(LegKind::Carry, here, here - 600, 120, "carry down"));
  }
  if (room && big_button(state.display, "Carry up 300 m in 1 h")) {
    in.legs.push_back(preset_leg(LegKind::Carry, here, here + 300, 60, "carry up"));
  }
  if (room && big_button(state.display, "Wait 1 h")) in.legs.push_back(preset_leg(LegKind::Wait, here, here, 60, "wait"));
  if (room && big_button(state.display, "Bag 1 h (2 L/min fed)")) in.legs.push_back(preset_leg(LegKind::Bag, here, here, 60, "bag"));
  if (room && big_button(state.display, "Flight 30 min at +500 m")) {
    in.legs.push_back(preset_leg(LegKind::Flight, here + 500, here + 500, 30, "flight"));
  }
  if (in.legs.size() > 1 && big_button(state.display, "Remove the last leg")) in.legs.pop_back();
}

constexpr FileKind kRouteFile{"Load a route file", "Save as a route file", "Route file to load",
                              kRouteImportFileName, kRouteExportFileName, "use firn route --file FILE."};

// Whole routes in (the usual carry-out, a route file), the profile's cylinders, a route file out.
void draw_route_loading(AppState& state, Platform& platform) {
  RouteState& route = state.route;
  const team_profile::TeamProfile& profile = state.team.profile;
  heading("Load or keep a route");
  if (big_button(state.display, "Back to the usual carry-out")) use_usual_route(route, profile);
  if (profile.evacuation && big_button(state.display, "Cylinders from the team profile")) {
    use_profile_stock(route, profile);
  }
  if (std::optional<ImportedFile> file = import_control(state, platform, route.file, kRouteFile)) {
    import_route(route, profile, file->text, file->name.empty() ? "the file" : file->name);
  }
  export_control(state, platform, route.file, kRouteFile, "route file",
                 [&] { return route::write_route_file(route.input); });
  draw_route_message(state);
}

void draw_leg_fields(AppState& state, std::size_t i, Leg& leg) {
  std::string n = std::to_string(i + 1);
  heading(("Leg " + n + ": " + std::string(route::leg_kind_key(leg.kind)) +
           (leg.label.empty() ? "" : " - " + leg.label)).c_str());
  // Labels carry the leg's number: each field is found by its label (keypad title, tests).
  std::string from = "Leg " + n + ": from", to = "Leg " + n + ": to", time = "Leg " + n + ": for";
  std::string at = "Leg " + n + (leg.kind == LegKind::Flight ? ": cruising at" : ": at");
  auto field = [&](const std::string& label, const std::string& id) {
    QuantityField<LengthDimension> f = altitude_field(state, label.c_str(), id.c_str());
    f.low = metres(Limits::altitude_low_m);
    f.high = metres(Limits::altitude_high_m);
    return f;
  };
  if (leg.kind == LegKind::Carry) {
    edit_quantity(state, field(from, "route-from-" + n), leg.start_altitude);
    edit_quantity(state, field(to, "route-to-" + n), leg.end_altitude);
  } else {
    edit_quantity(state, field(at, "route-at-" + n), leg.start_altitude);
    leg.end_altitude = leg.start_altitude;
  }
  std::string time_id = "route-time-" + n;
  edit_quantity(state, duration_field(time.c_str(), time_id.c_str(), Limits::leg_low_min, Limits::leg_high_h * 60),
                leg.duration);
}

void draw_stock(AppState& state) {
  route::Stock& stock = state.route.input.stock;
  std::vector<std::int64_t>& read_at = state.route.gauge_read_at;
  heading("Cylinders, used in this order");
  if (std::count(read_at.begin(), read_at.end(), 0) > 0) {
    message_line("Gauges marked \"as saved\" came with the route or the profile: read each cylinder's "
                 "gauge and enter it (the verdict waits for every one).", true);
  }
  for (std::size_t i = 0; i < stock.cylinders.size(); ++i) {
    route::StockCylinder& c = stock.cylinders[i];
    std::string id = "route-gauge-" + std::to_string(i + 1);
    // The route file's range for this type, so whatever is entered here is saved and read back.
    const team_profile::CylinderType* t = state.team.profile.find_cylinder(c.type_label);
    GaugePressure high = t ? t->fill_pressure_gauge * route::kGaugeHighShareOfFill
                           : bar.gauge(team_profile::Limits::fill_pressure_high_bar);
    QuantityField<GaugePressureDimension> field = cylinder_pressure_field(state, c.label.c_str(), id.c_str(), high);
    field.entered_at = &read_at[i];  // stamped by every entry, the same value or not
    edit_quantity(state, field, c.gauge);
    std::string read = read_at[i] > 0 ? "read " + entered_note(read_at[i]) : std::string("as saved, not read here");
    dim_wrapped_text(read);
    test_hook::item_text(c.label + " gauge", read);
  }
  for (const team_profile::CylinderType& t : state.team.profile.cylinders) {
    std::string add = "+ full " + t.label;
    if (stock.cylinders.size() < Limits::cylinders_max && big_button(state.display, add.c_str())) {
      Volume water = t.water_capacity ? *t.water_capacity
                                      : cylinder::letter_size_info(*t.letter_size).water_capacity;
      stock.cylinders.push_back({"#" + std::to_string(stock.cylinders.size() + 1) + " " + t.label,
                                 t.label, water, t.fill_pressure_gauge, cylinder::assumed_temperature});
      read_at.push_back(now_seconds());  // "full" is the user's own word for it, as typed

    }
  }
  if (stock.cylinders.size() > 1 && big_button(state.display, "Remove the last cylinder")) {
    stock.cylinders.pop_back();
    read_at.pop_back();
  }
  edit_quantity(state, duration_field("Safety margin", "route-margin", 0, Limits::margin_high_h * 60),
                stock.margin);
}

// Altitude over time: the legs as a line (a flight steps up to its cruising altitude).
void draw_profile_chart(const AppState& state, const route::RoutePlan& plan) {
  double end_h = std::max(plan.route_time.in(hours), 0.5);
  double top = std::ceil(plan.highest_altitude.in(metres) / 500.0 + 1) * 500.0;
  double low = top;
  for (const auto& l : plan.legs) low = std::min({low, l.leg.start_altitude.in(metres), l.leg.end_altitude.in(metres)});
  low = std::max(0.0, std::floor(low / 500.0 - 1) * 500.0);
  Plot plot = begin_plot(state.display, "Route profile",
                         "highest " + format_number(plan.highest_altitude.in(metres), 0) + " m",
                         10.0f, {0, end_h, low, top, end_h > 6 ? 2.0 : 1.0, 500, "hours", "altitude, m"});
  std::vector<PlotPoint> line;
  for (const auto& l : plan.legs) {
    double t0 = l.start.in(hours), t1 = (l.start + l.leg.duration).in(hours);
    line.push_back({t0, l.leg.start_altitude.in(metres)});
    line.push_back({t1, l.leg.end_altitude.in(metres)});
  }
  plot_line(plot, line, plot_colour(state.display, PlotColour::Accent));
  const auto& hi = plan.legs[plan.highest_leg];
  plot_point(plot, {hi.start.in(hours) + (hi.leg.end_altitude >= hi.leg.start_altitude ? hi.leg.duration.in(hours) : 0),
                    plan.highest_altitude.in(metres)},
             plot_colour(state.display, PlotColour::Warning), "highest point");
}

// Predicted SpO2 (band low edge) per leg at the planned flow, against the target.
void draw_spo2_chart(const AppState& state, const route::RoutePlan& plan, Fraction target) {
  double end_h = std::max(plan.route_time.in(hours), 0.5);
  Plot plot = begin_plot(state.display, "Predicted SpO2 along the route", "low edge at the planned flow",
                         7.0f, {0, end_h, 60, 100, end_h > 6 ? 2.0 : 1.0, 10, "hours", "SpO2, %"});
  plot_hline(plot, target.in(percent), plot_colour(state.display, PlotColour::Warning), "target");
  for (const auto& l : plan.legs) {
    double t0 = l.start.in(hours), t1 = (l.start + l.leg.duration).in(hours);
    double on_flow = std::max(60.0, l.spo2_at_flow.low.in(percent));
    double on_air = std::max(60.0, l.spo2_on_air.low.in(percent));
    plot_line(plot, {{t0, on_flow}, {t1, on_flow}}, plot_colour(state.display, PlotColour::Accent));
    plot_line(plot, {{t0, on_air}, {t1, on_air}}, plot_colour(state.display, PlotColour::Dim), 0.08f);
  }
  plot_legend({{plot_colour(state.display, PlotColour::Accent), "at the planned flow"},
                      {plot_colour(state.display, PlotColour::Dim), "on air"},
                      {plot_colour(state.display, PlotColour::Warning), "target"}});
}

// One bar per cylinder over time: when it is on the casualty, gauge at each end. Each row holds
// its label (name and gauges) above its bar; a change is marked on the two bars it joins only,
// never across a label, and each label sits on a plate of the background so no grid line runs
// through its text (a phone is narrow: labels and changes share the same few centimetres).
void draw_cylinder_bars(const AppState& state, const route::RouteInput& in, const route::RoutePlan& plan) {
  constexpr float kRowEm = 2.6f;                     // label line (1.2 em) + bar (1 em) + gap
  constexpr double kBarLow = 0.12, kBarHigh = 0.5;   // the bar, in the lower part of its row
  constexpr double kMarkLow = 0.06, kMarkHigh = 0.56;  // a change mark: just beyond the bar
  double end_h = std::max(plan.route_time.in(hours), 0.5);
  double n = static_cast<double>(in.stock.cylinders.size());
  Plot plot = begin_plot(state.display, "Cylinders on the casualty",
                         std::to_string(plan.swaps.size()) + " changes before arrival",
                         static_cast<float>(4.0 + kRowEm * n), {0, end_h, 0, n, end_h > 6 ? 2.0 : 1.0, 0, "hours", ""});  // rows: no y numbers
  auto row_of = [&](std::size_t cylinder) { return n - 1 - static_cast<double>(cylinder); };
  for (const route::CylinderSpan& s : plan.spans) {
    double row = row_of(s.cylinder);
    ImVec2 a = plot.at(s.start.in(hours), row + kBarLow), b = plot.at(s.end.in(hours), row + kBarHigh);
    plot.draw->AddRectFilled(ImVec2(a.x, b.y), ImVec2(b.x, a.y),
                             plot_colour(state.display, s.reached_reserve ? PlotColour::Warning : PlotColour::Accent, 0.6f));
  }
  ImU32 mark = plot_colour(state.display, PlotColour::Text);
  for (std::size_t i = 0; i < plan.swaps.size(); ++i) {
    const route::Swap& s = plan.swaps[i];
    for (std::size_t cylinder : {s.from, s.to}) {
      ImVec2 top = plot.at(s.time.in(hours), row_of(cylinder) + kMarkHigh);
      ImVec2 bottom = plot.at(s.time.in(hours), row_of(cylinder) + kMarkLow);
      plot.draw->AddLine(top, bottom, mark, std::max(1.0f, 0.12f * em()));
      test_hook::drawn("Change mark " + std::to_string(i + 1), "", top.x - 0.06f * em(), top.y,
                       top.x + 0.06f * em(), bottom.y);
    }
  }
  for (const route::CylinderSpan& s : plan.spans) {
    double row = row_of(s.cylinder);
    const route::StockCylinder& c = in.stock.cylinders[s.cylinder];
    // Name and gauge above the bar, kept inside the plot when the bar starts near its right end;
    // a label wider than the rest of the plot may start in the left margin (no y numbers here).
    std::string label = c.label + "  " + cylinder_pressure_text(s.start_gauge, state.settings.units) +
                        " \xE2\x86\x92 " + cylinder_pressure_text(s.end_gauge, state.settings.units);
    ImVec2 size = ImGui::CalcTextSize(label.c_str());
    ImVec2 top = plot.at(s.start.in(hours), row + 1.0);
    float pad = 0.15f * em();
    float left = std::min(plot.min.x + pad, plot.max.x - size.x - pad);
    float x = std::max(std::max(left, plot.min.x - 3.0f * em()), std::min(top.x + pad, plot.max.x - size.x - pad));
    ImVec2 low(x - pad, top.y + 0.05f * em()), high(x + size.x + pad, top.y + 0.05f * em() + size.y);
    plot.draw->AddRectFilled(low, high, ImGui::GetColorU32(ImGuiCol_WindowBg));
    plot.draw->AddText(ImVec2(x, low.y), plot_colour(state.display, PlotColour::Text), label.c_str());
    test_hook::drawn("Cylinder label " + std::to_string(s.cylinder + 1), label, low.x, low.y, high.x, high.y);
  }
  plot_legend({{plot_colour(state.display, PlotColour::Accent, 0.6f), "on the casualty at arrival"},
                      {plot_colour(state.display, PlotColour::Warning, 0.6f), "down to the reserve"},
                      {mark, "a change of cylinder"}});
}

// The plan of the route on screen, made again only when its input changed (ui/memo.hpp).
Result<route::RoutePlan> current_plan(const route::RouteInput& in) {
  static Memo<route::RouteInput, Result<route::RoutePlan>> plans;
  return plans.get(in, route::plan_route);
}

void draw_result(AppState& state) {
  const route::RouteInput& in = state.route.input;
  const Result<route::RoutePlan> plan = current_plan(in);
  if (!plan) {
    result_error(state.display, "Oxygen to arrival", plan.error().message);
    return;
  }
  const route::RoutePlan& p = plan.value();
  const std::vector<std::int64_t>& read_at = state.route.gauge_read_at;
  if (auto unread = std::count(read_at.begin(), read_at.end(), 0); unread > 0) {
    // The figures below are the plan for the saved gauges; a verdict needs the gauges as they are.
    verdict_line(state.display, Tone::Neutral,
                 std::to_string(unread) + " of " + std::to_string(read_at.size()) +
                     " cylinder gauges as saved, not read here: read them below; until then the "
                     "figures are for the saved gauges");
  } else {
    Tone tone = p.enough ? Tone::Good : p.verdict.rfind("short", 0) == 0 ? Tone::Danger : Tone::Neutral;
    // The tone's own word leads ("NO VERDICT"), so the model's same words are not repeated.
    const std::string prefix = "no verdict: ";
    verdict_line(state.display, tone, p.verdict.rfind(prefix, 0) == 0 ? p.verdict.substr(prefix.size()) : p.verdict);
  }
  result_value(state.display, "Highest point", altitude_with_unit(p.highest_altitude, state.settings.units), false);
  result_value(state.display, "Steady flow the stock holds to arrival + margin", flow_text(p.max_steady_flow), false);
  draw_profile_chart(state, p);
  draw_spo2_chart(state, p, in.casualty.target);
  draw_cylinder_bars(state, in, p);
  for (const route::Swap& s : p.swaps) {
    std::string when = in.start_clock_min ? route::clock_text(*in.start_clock_min, s.time)
                                          : duration_text(s.time);
    std::string line = when + "  change to " + in.stock.cylinders[s.to].label;
    bullet_line(line);
    test_hook::item_text("Change " + std::to_string(&s - p.swaps.data() + 1), line);
  }
  for (std::size_t i = 0; i < p.legs.size(); ++i) {
    const route::LegResult& l = p.legs[i];
    std::string line = "Leg " + std::to_string(i + 1) + ": " + flow_text(l.flow) + ", SpO2 from " +
                       percent_text(l.spo2_at_flow.low) + ", " + volume_text(l.oxygen_used);
    bullet_line(line);
    test_hook::item_text("Leg " + std::to_string(i + 1) + " plan", line);
  }
  for (const std::string& c : p.cautions) message_line(c, true);
}

// When the carry-out starts: then the changes read as clock times, else as time from the start.
void draw_start_time(AppState& state) {
  std::optional<int>& start = state.route.input.start_clock_min;
  heading("Start");
  std::string hhmm = start ? route::clock_text(*start, minutes(0)) : std::string();
  FieldSpec spec{.label = "Start time",
                 .id = "route-start",
                 .shown = start ? hhmm : std::string("not set (tap to enter)"),
                 .edit_text = start ? hhmm.substr(0, 2) + hhmm.substr(3) : std::string(),
                 .hint = "e.g. 0730 for 07:30",
                 .steppers = false,
                 .allow_negative = false,
                 .empty = !start,
                 .note = start ? std::string() : std::string("changes are shown as time from the start")};
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::Commit) {
    std::optional<int> typed = clock::typed_minutes_of_day(event.text);
    if (typed) {
      start = typed;
      state.field_errors.erase(spec.id);
    } else {
      state.field_errors[spec.id] = "Type the start as hours and minutes, e.g. 0730 for 07:30 (00:00 to 23:59).";
    }
  }
  if (big_button(state.display, "Start now")) {
    constexpr int kDay = 24 * 60;
    start = static_cast<int>((clock_now().minutes % kDay + kDay) % kDay);
  }
  if (start && big_button(state.display, "No start time")) start.reset();
}

}  // namespace

void draw_route_panel(AppState& state, Platform& platform) {
  if (!state.route.loaded) load_route(state.route, state.team.profile, platform);
  // One reading time per cylinder: a new cylinder starts unread.
  state.route.gauge_read_at.resize(state.route.input.stock.cylinders.size(), 0);
  route::RouteInput& in = state.route.input;
  // A saved route that could not be read is said first; other outcomes under the load buttons.
  if (state.route.file.message_is_problem) draw_route_message(state);
  if (in.demo) message_line("DEMO route: fictional team and range.");
  draw_result(state);
  heading("Casualty");
  int device = static_cast<int>(in.casualty.device);
  if (choice_row(state.display, "route-device", kDeviceLabels, 3, &device)) {
    in.casualty.device = static_cast<supplemental_oxygen::Device>(device);
    for (Leg& leg : in.legs) leg.fixed_flow.reset();  // a fixed flow belonged to the old device
  }
  edit_quantity(state, percent_field("Target SpO2", "route-target", "target SpO2",
                                     Limits::target_low_pct, Limits::target_high_pct),
                in.casualty.target);
  draw_start_time(state);
  for (std::size_t i = 0; i < in.legs.size(); ++i) draw_leg_fields(state, i, in.legs[i]);
  draw_presets(state);
  draw_stock(state);
  draw_route_loading(state, platform);
  caution_line(state);
}

}  // namespace firn::ui
