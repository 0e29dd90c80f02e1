// Screen "Oxygen": how long one cylinder lasts (real-gas contents from the gauge AND the
// cylinder's temperature, to a reserve), and an evacuation plan with several such cylinders:
// a first flow for a while, then the steady flow; timeline plot of gauge pressure vs time with
// the reserve line and swap marks.
#include "ui/panels.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <optional>

#include "model/cylinder.hpp"
#include "model/evacuation_plan.hpp"
#include "ui/cylinder_in_hand.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/situation.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;

constexpr std::string_view kGaugeFirst = "Read the cylinder gauge and enter it: no duration without it";
constexpr std::string_view kFlowFirst = "Enter the flow: no duration without it";
constexpr std::string_view kTimeFirst = "Enter the evacuation time: no plan without it";
constexpr std::string_view kCountFirst = "Enter how many cylinders: no plan without it";
constexpr std::string_view kFirstFlowFirst =
    "Enter the starting flow, or set how long it lasts to 0: no plan without it";

void draw_timeline(const AppState& state, const evacuation::PlanInput& input,
                   const evacuation::EvacuationPlan& plan) {
  const UnitChoice& u = state.settings.units;
  const Unit<PressureDimension>& unit = chosen_unit(kCylinderUnits, u.cylinder);
  bool in_psi = &unit == &psi;
  double end_h = input.evacuation.in(hours);
  if (plan.supply_lasts) end_h = std::max(end_h, std::min(plan.supply_lasts->in(hours), end_h * 2));
  double top = 0.0;
  for (const auto& s : plan.samples) top = std::max(top, s.gauge.in(unit));
  double y_tick = in_psi ? 500.0 : 50.0;
  top = std::max(y_tick, std::ceil(top / y_tick) * y_tick);
  double x_tick = end_h > 12 ? 4.0 : end_h > 4 ? 1.0 : 0.5;
  std::string summary = std::to_string(plan.uses.size()) + " cylinders used; " +
                        std::string(evacuation::verdict_key(plan.verdict)) + " for " +
                        duration_text(input.evacuation);
  Plot plot = begin_plot(state.display, "Evacuation timeline", summary, 15.0f,
                         {0, end_h, 0, top, x_tick, y_tick, "hours from now",
                          "gauge, " + std::string(unit.symbol)});
  plot_hline(plot, input.reserve_gauge.in(unit), plot_colour(state.display, PlotColour::Warning), "reserve");
  plot_vline(plot, input.evacuation.in(hours), plot_colour(state.display, PlotColour::Text), "arrival");
  // One line per cylinder: the saw-tooth of swaps reads at a glance.
  std::vector<PlotPoint> line;
  size_t current = plan.samples.empty() ? 0 : plan.samples.front().cylinder_index;
  ImU32 colours[2] = {plot_colour(state.display, PlotColour::Accent), plot_colour(state.display, PlotColour::Danger)};
  for (const auto& s : plan.samples) {
    if (s.cylinder_index != current) {
      plot_line(plot, line, colours[current % 2]);
      line.clear();
      current = s.cylinder_index;
    }
    line.push_back({s.time.in(hours), s.gauge.in(unit)});
  }
  plot_line(plot, line, colours[current % 2]);
  for (const auto& e : plan.events) {
    if (e.kind == evacuation::EventKind::Swap) plot_vline(plot, e.time.in(hours), plot_colour(state.display, PlotColour::Dim), "swap");
    if (e.kind == evacuation::EventKind::Reserve) plot_vline(plot, e.time.in(hours), plot_colour(state.display, PlotColour::Danger), "empty");
  }
}

// The cylinder in hand (ui/cylinder_in_hand): its source and type picked here.
CylinderInHand choose_cylinder(AppState& state) {
  OxygenInputs& in = state.oxygen;
  const team_profile::TeamProfile& team = state.team.profile;
  static constexpr const char* kSources[] = {"Team's cylinders", "Letter size", "Water capacity"};
  choice_row(state.display, "cyl-source", kSources, 3, &in.cylinder_source);
  if (in.cylinder_source == 0 && !team.cylinders.empty()) {
    std::vector<const char*> labels;
    for (const auto& t : team.cylinders) labels.push_back(t.label.c_str());
    in.team_type = std::clamp(in.team_type, 0, static_cast<int>(labels.size()) - 1);
    choice_row(state.display, "cyl-team-type", labels.data(), static_cast<int>(labels.size()), &in.team_type);
    const team_profile::CylinderType& t = team.cylinders[static_cast<size_t>(in.team_type)];
    if (t.water_capacity) {
      result_value(state.display, "Water capacity (team profile)", volume_text(*t.water_capacity), false);
    }
  } else if (in.cylinder_source == 1) {
    static constexpr const char* kSizes[] = {"D", "E", "M", "H"};
    choice_row(state.display, "cyl-letter-size", kSizes, 4, &in.letter_size);
  } else {
    if (in.cylinder_source == 0) message_line("The team profile lists no cylinders: type the water capacity.");
    edit_quantity(state, volume_field("Water capacity", "cyl-capacity", cylinder::min_water_capacity_l,
                                      cylinder::max_water_capacity_l), in.water_capacity);
  }
  CylinderInHand c = cylinder_in_hand(state);
  if (!c.assumption.empty()) {
    std::string text = c.assumption;
    text[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(text[0])));
    message_line(text, true);
  }
  return c;
}

// While the casualty is on oxygen the cylinder feeds that flow (one value, from the Casualty
// screen); otherwise the flow typed here for planning.
VolumeFlow cylinder_flow(const AppState& state) {
  return state.situation.on_oxygen ? state.situation.oxygen_flow : state.oxygen.flow;
}

// What must be entered before a duration: the gauge and the flow (the casualty's, on oxygen).
std::optional<std::string_view> missing_for_duration(const AppState& state) {
  if (!state.oxygen.gauge_entered) return kGaugeFirst;
  bool flow_entered = state.situation.on_oxygen ? state.situation.oxygen_flow_entered : state.oxygen.flow_entered;
  if (!flow_entered) return kFlowFirst;
  return std::nullopt;
}

// The duration figures: the lower of the real-gas estimate and the field rule leads.
void show_duration(AppState& state, const LastsToReserve& lasts) {
  const cylinder::DurationEstimate& d = lasts.real_gas;
  if (d.below_reserve) {
    verdict_line(state.display, Tone::Danger, std::string(cylinder::below_reserve_text));
    return;
  }
  result_value(state.display, "Lasts to reserve", duration_text(lasts.lead.duration));
  if (lasts.field_rule) {
    message_line("Count on the lower figure: " + lasts.lead.why + ".");
    result_value(state.display, "Real-gas estimate", duration_text(cylinder::whole_minutes_down(d.to_reserve)), false);
    result_value(state.display, "US field rule (to 200 psi)", duration_text(cylinder::whole_minutes_down(*lasts.field_rule)), false);
  }
  result_value(state.display, "Contents (free gas, real gas)", volume_text(d.contents.free_gas), false);
  result_value(state.display, "Usable above reserve", volume_text(d.usable_free_gas), false);
  for (const std::string& line : cylinder::temperature_cautions(d.contents, state.oxygen.cylinder_temperature)) {
    message_line(line, true);
  }
}

CylinderInHand draw_cylinder(AppState& state, Pressure ambient) {
  OxygenInputs& in = state.oxygen;
  heading("Cylinder");
  CylinderInHand chosen = choose_cylinder(state);
  QuantityField<GaugePressureDimension> gauge =
      cylinder_pressure_field(state, "Cylinder gauge", "cyl-gauge", cylinder::kGaugeRange.high);
  gauge.entered = &in.gauge_entered;
  gauge.entered_at = &in.gauge_read_at;  // the Record screen times the reserve from this reading
  edit_quantity(state, gauge, in.gauge);
  if (in.gauge_read_at > 0) {
    dim_wrapped_text("Gauge " + entered_note(in.gauge_read_at) + ": the Record screen times the reserve from it");
  }
  QuantityField<TemperatureDimension> temperature =
      temperature_field(state, "Cylinder temperature", "cyl-temperature", cylinder::kTemperatureRange);
  temperature.entered = &in.temperature_entered;
  edit_quantity(state, temperature, in.cylinder_temperature);
  if (!in.temperature_entered) {
    std::string assumed = "Not entered: counted at " +
                          temperature_text(cylinder::assumed_temperature, state.settings.units) +
                          "; a colder cylinder holds more at the same gauge";
    dim_wrapped_text(assumed);
    test_hook::item_text("Cylinder temperature assumed", assumed);
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("%s", std::string(cylinder::temperature_advice).c_str());
  ImGui::PopTextWrapPos();
  edit_quantity(state, cylinder_pressure_field(state, "Reserve (swap at)", "cyl-reserve", bar.gauge(cylinder::max_reserve_bar)), in.reserve);
  if (state.situation.on_oxygen) {
    QuantityField<VolumeFlowDimension> linked =
        casualty_flow_field(state, "Flow (the casualty's, as on Casualty)", "cyl-flow");
    linked.entered = &state.situation.oxygen_flow_entered;
    edit_quantity(state, linked, state.situation.oxygen_flow);
  } else {
    QuantityField<VolumeFlowDimension> flow = flow_field("Flow", "cyl-flow", cylinder::max_flow_lpm);
    flow.entered = &in.flow_entered;
    edit_quantity(state, flow, in.flow);
  }

  if (std::optional<std::string_view> missing = missing_for_duration(state)) {
    verdict_line(state.display, Tone::Neutral, std::string(*missing));
    return chosen;
  }
  Result<LastsToReserve> lasts = lasts_to_reserve(state, chosen, ambient, cylinder_flow(state));
  if (!lasts) {
    result_error(state.display, "Lasts to reserve", lasts.error().message);
    return chosen;
  }
  show_duration(state, lasts.value());
  return chosen;
}

Tone plan_tone(evacuation::Verdict v) {
  switch (v) {
    case evacuation::Verdict::Enough: return Tone::Good;
    case evacuation::Verdict::BelowMargin: return Tone::Caution;
    case evacuation::Verdict::Extrapolated: return Tone::Caution;
    case evacuation::Verdict::Short: return Tone::Danger;
  }
  return Tone::Neutral;
}

void draw_plan(AppState& state, Pressure ambient, const CylinderInHand& chosen) {
  OxygenInputs& in = state.oxygen;
  heading("Evacuation plan (cylinders like this one, used in turn)");
  int_stepper(state.display, "Cylinders", "plan-count", &in.cylinder_count, 1, OxygenInputs::kMaxCylinders,
              &in.count_entered);
  QuantityField<VolumeFlowDimension> first_flow = flow_field("Starting flow", "plan-first-flow", cylinder::max_flow_lpm);
  first_flow.entered = &in.first_flow_entered;
  edit_quantity(state, first_flow, in.first_flow);
  edit_quantity(state, duration_field("Starting flow lasts", "plan-first-time", 0, 4320), in.first_phase);
  QuantityField<DurationDimension> time = duration_field("Evacuation time", "plan-time", 1, 4320);
  time.entered = &in.evacuation_entered;
  edit_quantity(state, time, in.evacuation);
  ImGui::TextDisabled("Then the flow above until arrival.");

  std::optional<std::string_view> missing = missing_for_duration(state);
  if (!missing && !in.count_entered) missing = kCountFirst;
  if (!missing && !in.evacuation_entered) missing = kTimeFirst;
  if (!missing && in.first_phase.in(minutes) > 0.0 && !in.first_flow_entered) missing = kFirstFlowFirst;
  if (missing) {
    verdict_line(state.display, Tone::Neutral, std::string(*missing));
    return;
  }
  evacuation::PlanInput input;
  for (int i = 0; i < in.cylinder_count; ++i) {
    evacuation::CylinderSpec spec;
    spec.label = chosen.label + " " + std::to_string(i + 1);
    spec.water_capacity = chosen.water_capacity;
    spec.gauge_pressure = in.gauge;
    spec.temperature = in.cylinder_temperature;
    input.cylinders.push_back(spec);
  }
  if (in.first_phase.in(minutes) > 0.0) input.phases.push_back({in.first_flow, in.first_phase});
  input.phases.push_back({cylinder_flow(state), std::nullopt});  // until arrival
  input.evacuation = in.evacuation;
  input.reserve_gauge = in.reserve;
  input.ambient_pressure = ambient;
  input.margin_minimum = state.team.profile.safety_margin.minimum;
  input.margin_fraction = state.team.profile.safety_margin.share.in(fraction);
  input.pressure_unit = &chosen_unit(kCylinderUnits, state.settings.units.cylinder);
  Result<evacuation::EvacuationPlan> plan = evacuation::plan_evacuation(input);
  if (!plan) {
    result_error(state.display, "Oxygen for the evacuation", plan.error().message);
    return;
  }
  const evacuation::EvacuationPlan& p = plan.value();
  verdict_line(state.display, plan_tone(p.verdict), evacuation::verdict_text(p));
  if (p.verdict == evacuation::Verdict::Short) {
    result_value(state.display, "Extra cylinders needed", std::to_string(p.extra_cylinders_needed), false);
  }
  result_value(state.display, "Steady flow that lasts (margin kept)",
               p.max_sustainable_flow
                   ? format_number(p.max_sustainable_flow->in(litres_per_minute), 1) + " L/min"
                   : "below 0.1 L/min",
               false);
  result_value(state.display, "Supply lasts",
               p.supply_lasts ? duration_text(cylinder::whole_minutes_down(*p.supply_lasts)) : "\xE2\x80\x94", false);
  result_value(state.display, "Safety margin (team profile)", duration_text(cylinder::whole_minutes_up(p.margin)), false);
  draw_timeline(state, input, p);
  for (const auto& e : p.events) {
    bullet_line(duration_text(cylinder::whole_minutes_down(e.time)) + "  " + e.text);
  }
  for (const std::string& a : p.assumptions) {
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", a.c_str());
    ImGui::PopTextWrapPos();
  }
}

}  // namespace

void draw_oxygen_panel(AppState& state, Platform&) {
  // Gauges read relative to the air around them: the situation's pressure.
  Result<Pressure> pb = situation_pressure(state);
  Pressure ambient = pb ? pb.value() : units::atmospheres(1.0);
  if (!pb) message_line("Pressure here unknown (" + pb.error().message + "); gauges taken at 1 atm.", true);
  CylinderInHand chosen = draw_cylinder(state, ambient);
  draw_plan(state, ambient, chosen);
  caution_line(state);
}

}  // namespace firn::ui
