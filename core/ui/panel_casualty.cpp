// Screen "Casualty": who the casualty is (measured SpO2 — empty until entered —, time at this
// altitude, breathing, air or oxygen by device and flow); then the verdict from
// casualty_spo2::assess (the band for the oxygen actually given), the one thing to do, the short
// caution, and folded beneath them the reasons with their sources and the cautions; the HAPE/HACE
// criteria checklist (illness_criteria); the band, the flows (this casualty's estimate from the
// reading on air: casualty_oxygen), and a plot of the band against altitude.
#include "ui/panels.hpp"

#include <algorithm>
#include <optional>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/casualty_oxygen.hpp"
#include "model/casualty_spo2.hpp"
#include "model/illness_criteria.hpp"
#include "model/lake_louise.hpp"
#include "model/expected_spo2.hpp"
#include "model/supplemental_oxygen.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/memo.hpp"
#include "ui/plot.hpp"
#include "ui/situation.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;
namespace o2 = supplemental_oxygen;
using expected_spo2::Position;

constexpr const units::NumberRange& kSpo2 = expected_spo2::kMeasuredSpo2Range;

std::string band_text(const expected_spo2::Band& band) {
  return shown_number(band.low.in(percent), 0) + "\xE2\x80\x93" + shown_number(band.high.in(percent), 0) + " %";
}

// The measured SpO2: "not entered" until a value is typed, no steppers until then (a + must not
// invent a reading), and a Clear that makes it empty again.
void spo2_field(AppState& state) {
  Situation& s = state.situation;
  FieldSpec spec{.label = "Measured SpO2",
                 .id = "spo2",
                 .shown = s.spo2_measured ? percent_text(s.spo2) : std::string("not entered"),
                 .edit_text = s.spo2_measured ? format_number(s.spo2.in(percent), 4) : std::string(),
                 .unit_symbols = {"%"},
                 .hint = format_number(kSpo2.low, 0) + "\xE2\x80\x93" + format_number(kSpo2.high, 0) + " %",
                 .steppers = s.spo2_measured};
  // When it was measured: a reading restored from an earlier session must not pass as current.
  if (s.spo2_measured) {
    spec.note = s.spo2_entered_at > 0 ? entered_note(s.spo2_entered_at) : "when: not known (saved by an older Firn)";
  }
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> n = parse_number(event.text, "measured SpO2");
    if (!n) {
      state.field_errors[spec.id] = n.error().message;
    } else if (auto checked = units::check(n.value(), kSpo2); !checked) {
      state.field_errors[spec.id] = checked.error().message;
    } else {
      state.field_errors.erase(spec.id);
      s.spo2 = percent(n.value());
      s.spo2_measured = true;
      s.spo2_entered_at = now_seconds();
    }
  } else if (event.kind != FieldEvent::Kind::None && s.spo2_measured) {
    double step = event.kind == FieldEvent::Kind::Plus ? 1.0 : -1.0;
    s.spo2 = percent(std::clamp(std::round(s.spo2.in(percent)) + step, kSpo2.low, kSpo2.high));
    s.spo2_entered_at = now_seconds();
  }
  if (s.spo2_measured && big_button(state.display, "Clear SpO2")) {
    s.spo2_measured = false;
    state.field_errors.erase(spec.id);
  }
}

// Time at (or above) this altitude, hours or days, with the two presets as buttons.
void time_field(AppState& state) {
  Situation& s = state.situation;
  bool days_shown = s.time_at_altitude >= hours(48.0);
  QuantityField<DurationDimension> f{"Time at this altitude", "time-at-altitude", "time at altitude",
                                     {&hours, &units::days}, days_shown ? 1 : 0, hours(0.0),
                                     units::days(cascade::kTimeAtAltitudeMaxDays), {6.0, 1.0},
                                     days_shown ? 1 : 0};
  f.entered = &s.time_at_altitude_entered;
  edit_quantity(state, f, s.time_at_altitude);
  float half = (ImGui::GetContentRegionAvail().x - ImGui::GetStyle().ItemSpacing.x) / 2;
  if (big_button(state.display, "On arrival (acute)", half)) {
    s.time_at_altitude = cascade::preset_time_at_altitude(cascade::Exposure::Acute);
    s.time_at_altitude_entered = true;
  }
  ImGui::SameLine();
  if (big_button(state.display, "3 weeks (acclimatised)", half)) {
    s.time_at_altitude = cascade::preset_time_at_altitude(cascade::Exposure::Acclimatised);
    s.time_at_altitude_entered = true;
  }
  time_unknown_note(state);
}

void draw_who(AppState& state) {
  Situation& s = state.situation;
  heading("Casualty");
  spo2_field(state);
  time_field(state);
  toggle_row(state.display, "ventilation", "Breathing at rest", "Breathless (distress)", &s.distress);
  toggle_row(state.display, "breathing", "Room air", "On oxygen", &s.on_oxygen);
  if (s.on_oxygen) {
    if (choice_row(state.display, "device", kDeviceLabels, 3, &s.oxygen_device)) {
      // Keep the flow inside the new device's range rather than showing an error at once.
      o2::FlowRange range = o2::valid_flows(situation_device(state));
      s.oxygen_flow = std::clamp(s.oxygen_flow, range.low, range.high);
    }
    QuantityField<VolumeFlowDimension> flow = casualty_flow_field(state, "Oxygen flow", "o2-flow");
    flow.entered = &s.oxygen_flow_entered;
    edit_quantity(state, flow, s.oxygen_flow);
  }
}

Tone tone_of(const casualty_spo2::Verdict& v) {
  switch (v.assessment.position) {
    case Position::Critical:
    case Position::WellBelow: return Tone::Danger;
    case Position::Below: return Tone::Caution;
    case Position::Within:
    case Position::Above: return v.below_oxygen_target ? Tone::Caution : Tone::Good;
    case Position::Extrapolated: return Tone::Neutral;
  }
  return Tone::Neutral;
}

Result<casualty_spo2::Verdict> situation_verdict(const AppState& state) {
  const Situation& s = state.situation;
  Result<Pressure> pb = situation_pressure(state);
  if (!pb) return pb.error();
  casualty_spo2::Reading reading{pb.value(), situation_known_acclimatisation(state), std::nullopt, s.spo2,
                                 situation_breathing(state)};
  if (s.on_oxygen) {
    if (!s.oxygen_flow_entered) return Error{std::string(kEnterOxygenFlow)};
    reading.oxygen = casualty_spo2::OxygenGiven{situation_device(state), s.oxygen_flow};
  }
  return casualty_spo2::assess(reading);
}

// The reasons (each with its source) and the cautions, folded under one full-width button.
void why_section(AppState& state, const casualty_spo2::Verdict& v) {
  if (big_button(state.display, state.casualty_why_open ? "Hide why" : "Why, and cautions")) {
    state.casualty_why_open = !state.casualty_why_open;
  }
  if (!state.casualty_why_open) return;
  for (std::string_view w : v.assessment.why) bullet_line(w);
  for (std::string_view c : v.assessment.cautions) {
    // The short line, the oximeter and the CO cautions are shown once, above.
    if (c != cautions::short_line && c != expected_spo2::kOximeterUnreliable &&
        c != expected_spo2::kCarbonMonoxide) {
      bullet_line(c);
    }
  }
}

casualty_oxygen::Casualty situation_casualty(const AppState& state, Pressure pb) {
  return {pb, situation_acclimatisation(state), state.situation.spo2, situation_breathing(state)};
}

// casualty_oxygen::lowest_flow on one device, remembered for the three devices (ui/memo.hpp):
// it predicts every flowmeter step, and two parts of this screen ask for it.
Result<casualty_oxygen::CasualtyFlow> casualty_flow(const casualty_oxygen::Casualty& c, o2::Device d) {
  static Memo<std::pair<casualty_oxygen::Casualty, o2::Device>, Result<casualty_oxygen::CasualtyFlow>, 3> flows;
  return flows.get({c, d}, [](const auto& key) { return casualty_oxygen::lowest_flow(key.first, key.second); });
}

// The first flow for this casualty (estimate) on the chosen device, or the first device that
// reaches the target.
void start_flow_line(AppState& state) {
  Result<Pressure> pb = situation_pressure(state);
  if (!pb) return;
  o2::Device chosen = situation_device(state);
  std::vector<o2::Device> order{chosen};
  for (o2::Device d : {o2::Device::NasalCannula, o2::Device::SimpleMask, o2::Device::NonRebreather}) {
    if (d != chosen) order.push_back(d);
  }
  std::optional<casualty_oxygen::CasualtyFlow> best;
  for (o2::Device d : order) {
    Result<casualty_oxygen::CasualtyFlow> f = casualty_flow(situation_casualty(state, pb.value()), d);
    if (f && f->reachable) {
      result_value(state.display, "Start oxygen at (estimate)",
                   std::string(o2::device_name(d)) + " " + flow_text(f->flow) + ", then titrate to the oximeter",
                   false);
      return;
    }
    if (f && d == o2::Device::NonRebreather) best = f.value();
  }
  std::string most = best ? "non-rebreather mask " + flow_text(best->flow) + " (predicted " +
                                percent_text(best->predicted) + ")"
                          : std::string("the most oxygen you have");
  result_value(state.display, "Start oxygen at (estimate)",
               most + ": no device is predicted to reach 90 %; descend", false);
}

// Verdict, the one thing to do, the short caution; the rest folded.
// Returns whether the reading supports HAPE (hypoxaemia out of proportion), for the checklist.
bool draw_verdict(AppState& state) {
  const Situation& s = state.situation;
  heading("Verdict");
  if (!s.spo2_measured) {
    verdict_line(state.display, Tone::Neutral, "enter the measured SpO2 to compare it with the band");
    caution_line(state);
    return false;
  }
  Result<casualty_spo2::Verdict> v = situation_verdict(state);
  if (!v) {
    verdict_line(state.display, Tone::Neutral, v.error().message);
    caution_line(state);
    return false;
  }
  verdict_line(state.display, tone_of(v.value()),
               v->headline + " (" + percent_text(s.spo2) + " vs " + band_text(v->band) + ")");
  result_value(state.display, "What to do", v->action);
  if (!s.on_oxygen && v->assessment.hape_suspected) start_flow_line(state);
  if (v->assessment.oximeter_unreliable) {
    message_line(std::string(expected_spo2::kOximeterUnreliable), true);
  }
  message_line(std::string(expected_spo2::kCarbonMonoxide), true);
  caution_line(state);
  why_section(state, v.value());
  const expected_spo2::Assessment& a = v->assessment;
  std::string gap = a.gap_points == 0.0 ? "0 points"
                                         : (a.gap_points > 0 ? "+" : "\xE2\x88\x92") +
                                               shown_number(std::abs(a.gap_points), 0) + " points";
  result_value(state.display, "Gap to the band", gap, false);
  return a.hape_suspected;
}

void draw_band_plot(const AppState& state, const expected_spo2::Band& here_band) {
  const UnitChoice& u = state.settings.units;
  const Unit<LengthDimension>& unit = chosen_unit(kAltitudeUnits, u.altitude);
  bool feet = &unit == &units::feet;
  Result<Fraction> fio2 = situation_fio2(state);
  std::vector<PlotPoint> low, high;
  for (double m = 0; m <= 7000; m += 250) {
    Result<Pressure> pb = atmosphere::pressure_at(metres(m), state.settings.model);
    if (!pb || !fio2) continue;
    Result<expected_spo2::Expectation> e =
        expected_spo2::expected(pb.value(), situation_acclimatisation(state), fio2.value());
    if (!e) continue;
    low.push_back({metres(m).in(unit), e->band.low.in(percent)});
    high.push_back({metres(m).in(unit), e->band.high.in(percent)});
  }
  Result<Length> altitude = situation_altitude(state);
  std::string summary = "expected band " + band_text(here_band);
  Plot plot = begin_plot(state.display, "Expected SpO2 plot", summary, 13.0f,
                         {0, metres(7000).in(unit), 50, 100, feet ? 5000.0 : 1000.0, 10,
                          "altitude, " + std::string(unit.symbol), "SpO2, %"});
  plot_band(plot, low, high, plot_colour(state.display, PlotColour::Accent, 0.35f));
  plot_line(plot, low, plot_colour(state.display, PlotColour::Accent), 0.08f);
  plot_line(plot, high, plot_colour(state.display, PlotColour::Accent), 0.08f);
  plot_hline(plot, 80, plot_colour(state.display, PlotColour::Dim), "unreliable below 80 %",
             LineLabel::BelowLeft);
  if (altitude) {
    double x = altitude->in(unit);
    plot_vline(plot, x, plot_colour(state.display, PlotColour::Dim));
    if (state.situation.spo2_measured) {
      plot_point(plot, {x, state.situation.spo2.in(percent)}, plot_colour(state.display, PlotColour::Danger),
                 "measured " + percent_text(state.situation.spo2));
    }
  }
}

// A tick box a gloved thumb can hit, recorded as its label with "checked" or "".
void check_item(AppState& state, const char* label, bool* value) {
  float pad = std::max(0.0f, (touch_target(state.display) - ImGui::GetFontSize()) / 2);
  ImGui::PushStyleVar(ImGuiStyleVar_FramePadding, ImVec2(pad, pad));
  ImGui::Checkbox(label, value);
  ImGui::PopStyleVar();
  test_hook::item_text(label, *value ? "checked" : "");
}

// The Lake Louise consensus criteria for HAPE and HACE (Hackett & Roach 2001; WMS), folded.
void draw_criteria(AppState& state, bool spo2_out_of_proportion) {
  illness_criteria::Findings& f = state.criteria;
  f.spo2_out_of_proportion = spo2_out_of_proportion;
  f.has_ams = false;
  const AmsInputs& ams = state.ams;
  if (ams.headache >= 0 && ams.gastrointestinal >= 0 && ams.fatigue >= 0 && ams.dizziness >= 0) {
    Result<lake_louise::Score> score = lake_louise::score(
        {ams.headache, ams.gastrointestinal, ams.fatigue, ams.dizziness, ams.recent_ascent});
    f.has_ams = score && score->meets_ams_definition;
  }
  heading("HAPE and HACE criteria");
  if (big_button(state.display, state.casualty_criteria_open ? "Hide the checklist" : "HAPE / HACE checklist")) {
    state.casualty_criteria_open = !state.casualty_criteria_open;
  }
  if (state.casualty_criteria_open) {
    check_item(state, "Recent gain in altitude", &f.recent_ascent);
    ImGui::TextDisabled("HAPE symptoms (2 or more)");
    check_item(state, "Breathless at rest", &f.dyspnoea_at_rest);
    check_item(state, "Cough", &f.cough);
    check_item(state, "Weakness or reduced performance", &f.weakness_or_reduced_performance);
    check_item(state, "Chest tightness or congestion", &f.chest_tightness_or_congestion);
    ImGui::TextDisabled("HAPE signs (2 or more)");
    check_item(state, "Crackles or wheeze (one lung field or more)", &f.crackles_or_wheezing);
    check_item(state, "Central cyanosis", &f.central_cyanosis);
    check_item(state, "Fast breathing (tachypnoea)", &f.tachypnoea);
    check_item(state, "Fast pulse (tachycardia)", &f.tachycardia);
    ImGui::TextDisabled("HACE (with AMS: one; without AMS: both)");
    check_item(state, "Change in mental status", &f.mental_status_change);
    check_item(state, "Ataxia", &f.ataxia);
    ImGui::TextDisabled("%s", f.has_ams ? "AMS by the Lake Louise score: yes" : "AMS by the Lake Louise score: not scored or no");
  }
  illness_criteria::Outcome o = illness_criteria::evaluate(f);
  for (const std::string& line : o.lines) {
    bool met = line.rfind("Meets", 0) == 0;
    verdict_line(state.display, met || o.spo2_supports_hape ? Tone::Danger : Tone::Caution, line);
  }
  if (!o.lines.empty()) {
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", std::string(illness_criteria::kSource).c_str());
    ImGui::PopTextWrapPos();
  }
}

// While the time at altitude is not entered the verdict also compares with this band.
void weeks_band_line(AppState& state) {
  Result<expected_spo2::Expectation> weeks =
      situation_expectation(state, cascade::acclimatisation_of(cascade::Exposure::Acclimatised));
  if (!weeks) return;
  result_value(state.display, "Expected SpO2, after 3 weeks",
               band_text(weeks->band) + (weeks->extrapolated ? " (extrapolated)" : ""));
}

// On air with a reading: this casualty's flow on each device (estimate).
void draw_casualty_flows(AppState& state) {
  Result<Pressure> pb = situation_pressure(state);
  if (!pb) return;
  heading("Oxygen for this casualty (estimate from the SpO2 on air)");
  for (o2::Device d : {o2::Device::NasalCannula, o2::Device::SimpleMask, o2::Device::NonRebreather}) {
    Result<casualty_oxygen::CasualtyFlow> f = casualty_flow(situation_casualty(state, pb.value()), d);
    std::string label = "For SpO2 > 90 %, " + std::string(o2::device_name(d));
    std::string text = !f ? std::string("\xE2\x80\x94")
                       : f->reached_on_air ? std::string("reached on air")
                       : f->reachable      ? flow_text(f->flow) + " (predicted " + percent_text(f->predicted) + ")"
                                           : "not reached (max " + flow_text(f->flow) + ", predicted " +
                                                 percent_text(f->predicted) + ")";
    result_value(state.display, label.c_str(), text, false);
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("%s", std::string(casualty_oxygen::kEstimateNote).c_str());
  ImGui::PopTextWrapPos();
}

void draw_flow_for_target(AppState& state) {
  Result<Pressure> pb = situation_pressure(state);
  Result<o2::FlowForTarget> flow =
      pb ? o2::lowest_flow_for_target(pb.value(), situation_acclimatisation(state), situation_device(state),
                                      percent(o2::kDefaultTargetPercent), situation_breathing(state))
         : Result<o2::FlowForTarget>(pb.error());
  std::string label = "Healthy lowlander: flow for SpO2 > 90 % (" + std::string(o2::device_name(situation_device(state))) + ")";
  std::string text = !flow ? std::string("\xE2\x80\x94")
                     : flow->reached_on_air ? std::string("reached on air")
                     : flow->reachable      ? flow_text(flow->flow)
                                            : "not reached (max " + flow_text(flow->flow) + ")";
  result_value(state.display, label.c_str(), text, false);
}

}  // namespace

void draw_casualty_panel(AppState& state, Platform&) {
  draw_who(state);
  const Situation& s = state.situation;
  bool out_of_proportion = draw_verdict(state);
  draw_criteria(state, out_of_proportion);
  heading(s.on_oxygen ? "Expected for a healthy lowlander here, on this oxygen"
                      : "Expected for a healthy lowlander here, on air");
  Result<expected_spo2::Expectation> expectation = situation_expectation(state);
  if (!expectation) {
    result_error(state.display, "Expected SpO2", expectation.error().message);
    return;
  }
  const expected_spo2::Band& band = expectation->band;
  result_value(state.display, "Expected SpO2",
               band_text(band) + (expectation->extrapolated ? " (extrapolated)" : "") +
                   (s.time_at_altitude_entered ? "" : " on arrival"));
  if (!s.time_at_altitude_entered) weeks_band_line(state);
  result_value(state.display, "Middle of the band", percent_text(band.mid), false);
  if (expectation->extrapolated) {
    message_line(std::string(expected_spo2::kWhyExtrapolated), true);
  }
  if (s.on_oxygen) {
    Result<Fraction> fio2 = situation_fio2(state);
    Result<Fraction> rule = o2::delivered_fio2(situation_device(state), s.oxygen_flow);
    result_value(state.display, s.distress ? "FiO2 here (estimate, breathless)" : "FiO2 here (estimate, at rest)",
                 fio2 ? percent_text(fio2.value()) : "\xE2\x80\x94", false);
    result_value(state.display, "FiO2 at sea level (rule of thumb)", rule ? percent_text(rule.value()) : "\xE2\x80\x94", false);
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", std::string(o2::kRuleOfThumbNote).c_str());
    ImGui::PopTextWrapPos();
  } else {
    if (s.spo2_measured) draw_casualty_flows(state);
    draw_flow_for_target(state);
  }
  draw_band_plot(state, band);
}

}  // namespace firn::ui
