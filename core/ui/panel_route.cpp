// Screen "Route": oxygen along the carry-out. The route's altitude over time with the casualty's
// predicted SpO2 beneath it, and one bar per cylinder showing when it is on the casualty. Legs come
// from quick presets and are changed on the keypad; the cylinders are the team profile's types.
// Every figure and the verdict come from route::plan_route (the CLI's `firn route` too).
#include "ui/panels.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "profile/route_file.hpp"
#include "model/route_plan.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {
namespace {

using namespace units;
using route::Leg;
using route::LegKind;
using route::Limits;

// In supplemental_oxygen::Device order.

void load_usual_route(AppState& state) {
  RouteState& r = state.route;
  r.loaded = true;
  Result<route::RouteInput> in = route::read_route_file(route::demo_route_json(), state.team.profile);
  if (in) {
    r.input = in.value();
    r.message.clear();
    return;
  }
  // A team profile without the demo's cylinder types: the demo team's route and stock.
  r.input = route::read_route_file(route::demo_route_json(), team_profile::demo_profile()).value();
  r.message = "The usual carry-out uses the DEMO team's cylinders (" + in.error().message + ").";
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
  if (room && big_button(state, "Carry down 600 m in 2 h")) {
    in.legs.push_back(preset_leg(LegKind::Carry, here, here - 600, 120, "carry down"));
  }
  if (room && big_button(state, "Carry up 300 m in 1 h")) {
    in.legs.push_back(preset_leg(LegKind::Carry, here, here + 300, 60, "carry up"));
  }
  if (room && big_button(state, "Wait 1 h")) in.legs.push_back(preset_leg(LegKind::Wait, here, here, 60, "wait"));
  if (room && big_button(state, "Bag 1 h (2 L/min fed)")) in.legs.push_back(preset_leg(LegKind::Bag, here, here, 60, "bag"));
  if (room && big_button(state, "Flight 30 min at +500 m")) {
    in.legs.push_back(preset_leg(LegKind::Flight, here + 500, here + 500, 30, "flight"));
  }
  if (in.legs.size() > 1 && big_button(state, "Remove the last leg")) in.legs.pop_back();
  if (big_button(state, "Back to the usual carry-out")) load_usual_route(state);
}

void draw_leg_fields(AppState& state, std::size_t i, Leg& leg) {
  std::string n = std::to_string(i + 1);
  heading(("Leg " + n + ": " + std::string(route::leg_kind_key(leg.kind)) +
           (leg.label.empty() ? "" : " - " + leg.label)).c_str());
  auto field = [&](const char* what, const std::string& id) {
    QuantityField<LengthDimension> f = altitude_field(state, what, id.c_str());
    f.low = metres(Limits::altitude_low_m);
    return f;
  };
  if (leg.kind == LegKind::Carry) {
    std::string from = "route-from-" + n, to = "route-to-" + n;
    edit_quantity(state, field("From", from), leg.start_altitude);
    edit_quantity(state, field("To", to), leg.end_altitude);
  } else {
    std::string at = "route-at-" + n;
    edit_quantity(state, field(leg.kind == LegKind::Flight ? "Cruising at" : "At", at), leg.start_altitude);
    leg.end_altitude = leg.start_altitude;
  }
  std::string time = "route-time-" + n;
  edit_quantity(state, duration_field("For", time.c_str(), Limits::leg_low_min, Limits::leg_high_h * 60),
                leg.duration);
}

void draw_stock(AppState& state) {
  route::Stock& stock = state.route.input.stock;
  heading("Cylinders, used in this order");
  for (std::size_t i = 0; i < stock.cylinders.size(); ++i) {
    route::StockCylinder& c = stock.cylinders[i];
    std::string id = "route-gauge-" + std::to_string(i + 1);
    edit_quantity(state, cylinder_pressure_field(state, c.label.c_str(), id.c_str(), bar(300)), c.gauge);
  }
  for (const team_profile::CylinderType& t : state.team.profile.cylinders) {
    std::string add = "+ full " + t.label;
    if (stock.cylinders.size() < Limits::cylinders_max && big_button(state, add.c_str())) {
      Volume water = t.water_capacity ? *t.water_capacity
                                      : cylinder::letter_size_info(*t.letter_size).water_capacity;
      stock.cylinders.push_back({"#" + std::to_string(stock.cylinders.size() + 1) + " " + t.label,
                                 t.label, water, t.fill_pressure_gauge, celsius(15)});
    }
  }
  if (stock.cylinders.size() > 1 && big_button(state, "Remove the last cylinder")) stock.cylinders.pop_back();
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
  Plot plot = begin_plot(state, "Route profile",
                         "highest " + format_number(plan.highest_altitude.in(metres), 0) + " m",
                         10.0f, {0, end_h, low, top, end_h > 6 ? 2.0 : 1.0, 500, "hours", "altitude, m"});
  std::vector<PlotPoint> line;
  for (const auto& l : plan.legs) {
    double t0 = l.start.in(hours), t1 = (l.start + l.leg.duration).in(hours);
    line.push_back({t0, l.leg.start_altitude.in(metres)});
    line.push_back({t1, l.leg.end_altitude.in(metres)});
  }
  plot_line(plot, line, plot_colour(state, PlotColour::Accent));
  const auto& hi = plan.legs[plan.highest_leg];
  plot_point(plot, {hi.start.in(hours) + (hi.leg.end_altitude >= hi.leg.start_altitude ? hi.leg.duration.in(hours) : 0),
                    plan.highest_altitude.in(metres)},
             plot_colour(state, PlotColour::Warning), "highest point");
}

// Predicted SpO2 (band low edge) per leg at the planned flow, against the target.
void draw_spo2_chart(const AppState& state, const route::RoutePlan& plan, Fraction target) {
  double end_h = std::max(plan.route_time.in(hours), 0.5);
  Plot plot = begin_plot(state, "Predicted SpO2 along the route", "low edge at the planned flow",
                         7.0f, {0, end_h, 60, 100, end_h > 6 ? 2.0 : 1.0, 10, "hours", "SpO2, %"});
  plot_hline(plot, target.in(percent), plot_colour(state, PlotColour::Warning), "target");
  for (const auto& l : plan.legs) {
    double t0 = l.start.in(hours), t1 = (l.start + l.leg.duration).in(hours);
    double on_flow = std::max(60.0, l.spo2_at_flow.low.in(percent));
    double on_air = std::max(60.0, l.spo2_on_air.low.in(percent));
    plot_line(plot, {{t0, on_flow}, {t1, on_flow}}, plot_colour(state, PlotColour::Accent));
    plot_line(plot, {{t0, on_air}, {t1, on_air}}, plot_colour(state, PlotColour::Dim), 0.08f);
  }
  plot_legend(state, {{plot_colour(state, PlotColour::Accent), "at the planned flow"},
                      {plot_colour(state, PlotColour::Dim), "on air"},
                      {plot_colour(state, PlotColour::Warning), "target"}});
}

// One bar per cylinder over time: when it is on the casualty, gauge at each end.
void draw_cylinder_bars(const AppState& state, const route::RouteInput& in, const route::RoutePlan& plan) {
  double end_h = std::max(plan.route_time.in(hours), 0.5);
  double n = static_cast<double>(in.stock.cylinders.size());
  Plot plot = begin_plot(state, "Cylinders on the casualty",
                         std::to_string(plan.swaps.size()) + " changes before arrival",
                         static_cast<float>(2.0 + 2.8 * n), {0, end_h, 0, n, end_h > 6 ? 2.0 : 1.0, 0, "hours", ""});  // rows: no y numbers
  for (const route::CylinderSpan& s : plan.spans) {
    double row = n - 1 - static_cast<double>(s.cylinder);
    // The bar in the lower half of its row, its label (one line, ~1 em of the row's 2.8) above.
    ImVec2 a = plot.at(s.start.in(hours), row + 0.1), b = plot.at(s.end.in(hours), row + 0.45);
    plot.draw->AddRectFilled(ImVec2(a.x, b.y), ImVec2(b.x, a.y),
                             plot_colour(state, s.reached_reserve ? PlotColour::Warning : PlotColour::Accent, 0.6f));
    const route::StockCylinder& c = in.stock.cylinders[s.cylinder];
    // Name and gauge above the bar, kept inside the plot when the bar starts near its right end.
    std::string label = c.label + "  " + cylinder_pressure_text(s.start_gauge, state.settings.units) +
                        " \xE2\x86\x92 " + cylinder_pressure_text(s.end_gauge, state.settings.units);
    float width = ImGui::CalcTextSize(label.c_str()).x;
    ImVec2 top = plot.at(s.start.in(hours), row + 1.0);
    float x = std::max(plot.min.x + 0.2f * em(), std::min(top.x, plot.max.x - width - 0.2f * em()));
    plot.draw->AddText(ImVec2(x, top.y), plot_colour(state, PlotColour::Text), label.c_str());
  }
  plot_legend(state, {{plot_colour(state, PlotColour::Accent, 0.6f), "on the casualty at arrival"},
                      {plot_colour(state, PlotColour::Warning, 0.6f), "down to the reserve"}});
  for (const route::Swap& s : plan.swaps) {
    plot_vline(plot, s.time.in(hours), plot_colour(state, PlotColour::Dim));
  }
}

void draw_result(AppState& state) {
  const route::RouteInput& in = state.route.input;
  Result<route::RoutePlan> plan = route::plan_route(in);
  if (!plan) {
    result_error(state, "Oxygen to arrival", plan.error().message);
    return;
  }
  const route::RoutePlan& p = plan.value();
  Tone tone = p.enough ? Tone::Good : p.verdict.rfind("short", 0) == 0 ? Tone::Danger : Tone::Neutral;
  // The tone's own word leads ("NO VERDICT"), so the model's same words are not repeated.
  const std::string prefix = "no verdict: ";
  verdict_line(state, tone, p.verdict.rfind(prefix, 0) == 0 ? p.verdict.substr(prefix.size()) : p.verdict);
  result_value(state, "Highest point", altitude_with_unit(p.highest_altitude, state.settings.units), false);
  result_value(state, "Steady flow the stock holds to arrival + margin", flow_text(p.max_steady_flow), false);
  draw_profile_chart(state, p);
  draw_spo2_chart(state, p, in.casualty.target);
  draw_cylinder_bars(state, in, p);
  for (const route::Swap& s : p.swaps) {
    std::string when = in.start_clock_min ? route::clock_text(*in.start_clock_min, s.time)
                                          : duration_text(s.time);
    bullet_line(when + "  change to " + in.stock.cylinders[s.to].label);
  }
  for (std::size_t i = 0; i < p.legs.size(); ++i) {
    const route::LegResult& l = p.legs[i];
    bullet_line("Leg " + std::to_string(i + 1) + ": " + flow_text(l.flow) + ", SpO2 from " +
                percent_text(l.spo2_at_flow.low) + ", " + volume_text(l.oxygen_used));
  }
  for (const std::string& c : p.cautions) message_line(state, c, true);
}

}  // namespace

void draw_route_panel(AppState& state, Platform&) {
  if (!state.route.loaded) load_usual_route(state);
  route::RouteInput& in = state.route.input;
  if (!state.route.message.empty()) message_line(state, state.route.message, true);
  if (in.demo) message_line(state, "DEMO route: fictional team and range.");
  draw_result(state);
  heading("Casualty");
  int device = static_cast<int>(in.casualty.device);
  if (choice_row(state, "route-device", kDeviceLabels, 3, &device)) {
    in.casualty.device = static_cast<supplemental_oxygen::Device>(device);
    for (Leg& leg : in.legs) leg.fixed_flow.reset();  // a fixed flow belonged to the old device
  }
  edit_quantity(state, percent_field("Target SpO2", "route-target", "target SpO2",
                                     Limits::target_low_pct, Limits::target_high_pct),
                in.casualty.target);
  for (std::size_t i = 0; i < in.legs.size(); ++i) draw_leg_fields(state, i, in.legs[i]);
  draw_presets(state);
  draw_stock(state);
  caution_line(state);
}

}  // namespace firn::ui
