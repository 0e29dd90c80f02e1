// Screen "Record": the casualty record over the incident — reassessment timers, a new
// observation in a few gloved taps (last values one tap away), events (oxygen set, bag start/end,
// cylinder swap, arrival), the SpO2 trend, and the handover to copy or print.
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <ctime>

#include "model/atmosphere.hpp"
#include "model/expected_spo2.hpp"
#include "profile/handover.hpp"
#include "ui/cylinder_in_hand.hpp"
#include "ui/fields.hpp"
#include "ui/file_exchange.hpp"
#include "ui/plot.hpp"
#include "ui/record_store.hpp"
#include "ui/situation.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;
using record::ClockTime;
namespace so = supplemental_oxygen;

constexpr const char* kBreathingLabels[] = {"Air", "Cannula", "Mask", "NRB"};
constexpr const char* kAvpuLabels[] = {"A", "V", "P", "U"};
// A bag session is commonly 1–2 h, then reassess (common practice, domain brief).
constexpr double kBagSessionMinutes = 60.0;
// The reserve timer turns to a caution this long before (time to get the next cylinder ready;
// our choice, not a published figure).
constexpr std::int64_t kReserveWarningMinutes = 15;

record::Breathing drafted_breathing(const RecordInputs& in) {
  if (in.on <= 0) return {std::nullopt, litres_per_minute(0.0)};
  return {static_cast<so::Device>(in.on - 1), in.flow};
}

int breathing_index(const record::Breathing& b) {
  if (b.on_air()) return 0;
  for (int i = 0; i < 3; ++i) {
    if (static_cast<so::Device>(i) == *b.device) return i + 1;
  }
  return 0;
}

// Seconds until the shown minute of a countdown changes: the page wakes only for that.
double seconds_to_next_minute() {
  return 60.0 - static_cast<double>(std::time(nullptr) % 60);
}

void wake_in(AppState& state, double seconds) {
  if (state.wake_after_seconds <= 0.0 || seconds < state.wake_after_seconds) {
    state.wake_after_seconds = std::max(1.0, seconds);
  }
}

// [SECTION] Timers

// The highest oxygen flow set at any time from `since` on: the cylinder is timed as if it had
// given that flow all along (a lower flow earlier only leaves more gas: never a later reserve).
VolumeFlow highest_flow_since(const handover::Summary& s, ClockTime since) {
  VolumeFlow highest;
  for (const handover::OxygenPeriod& p : s.oxygen) {
    if (p.to && *p.to < since) continue;
    highest = std::max(highest, p.setting.flow);
  }
  return highest;
}

// When the cylinder on the Oxygen screen reaches its reserve: from the gauge reading typed
// there, at the highest flow the record has set since, by the lower of the real-gas estimate
// and the field rule. No reading: it says where to give one, and times nothing.
void reserve_timer(AppState& state, const handover::Summary& s, ClockTime now) {
  const OxygenInputs& ox = state.oxygen;
  if (ox.gauge_read_at <= 0) {
    verdict_line(state.display, Tone::Neutral, "Cylinder reserve not timed: type the gauge on the Oxygen screen");
    return;
  }
  ClockTime read = clock_at(ox.gauge_read_at);
  // A cylinder changed since: the reading is of the old one.
  for (const record::Entry& e : state.record.store.record.entries) {
    if (e.kind == record::Kind::CylinderSwap && e.time >= read) {
      verdict_line(state.display, Tone::Neutral, "Cylinder reserve not timed: changed at " + record::clock_hhmm(e.time) +
                                                     ", type the new cylinder's gauge on the Oxygen screen");
      return;
    }
  }
  VolumeFlow flow = highest_flow_since(s, read);
  Result<Pressure> here = situation_pressure(state);
  Result<LastsToReserve> lasts =
      lasts_to_reserve(state, cylinder_in_hand(state), here ? here.value() : atmospheres(1.0), flow);
  if (!lasts) {
    verdict_line(state.display, Tone::Neutral, "Cylinder reserve not timed: " + lasts.error().message);
    return;
  }
  ClockTime due{read.minutes + static_cast<std::int64_t>(lasts->lead.duration.in(minutes))};
  std::int64_t left = record::minutes_between(now, due);
  std::string basis = "(" + cylinder_pressure_text(ox.gauge, state.settings.units) + " read " + record::clock_hhmm(read) + ", at " + flow_text(flow) + ")";
  if (lasts->real_gas.below_reserve || left <= 0) {
    verdict_line(state.display, Tone::Danger, "Cylinder at its reserve: change it now " + basis);
  } else {
    verdict_line(state.display, left <= kReserveWarningMinutes ? Tone::Caution : Tone::Neutral,
                 "Cylinder at its reserve in " + std::to_string(left) + " min, at " +
                     record::clock_hhmm(due) + " " + basis);
  }
  wake_in(state, seconds_to_next_minute());
}

void timers(AppState& state, const handover::Summary& s, ClockTime now) {
  const RecordInputs& in = state.record;
  if (s.last_time) {
    std::optional<ClockTime> last_check = s.latest_spo2 ? std::optional(s.latest_spo2->time) : s.first_time;
    ClockTime due{last_check->minutes + static_cast<std::int64_t>(in.check_interval.in(minutes))};
    std::int64_t left = record::minutes_between(now, due);
    if (left <= 0) {
      verdict_line(state.display, Tone::Danger, "SpO2 check due now (" + std::to_string(-left) +
                                                    " min overdue; every " +
                                                    format_number(in.check_interval.in(minutes), 0) + " min)");
    } else {
      verdict_line(state.display, Tone::Neutral, "Next SpO2 check in " + std::to_string(left) + " min, at " +
                                                     record::clock_hhmm(due));
    }
    wake_in(state, seconds_to_next_minute());
  }
  if (!s.bag_sessions.empty() && !s.bag_sessions.back().end) {
    std::int64_t in_bag = record::minutes_between(s.bag_sessions.back().start, now);
    if (in_bag >= kBagSessionMinutes) {
      verdict_line(state.display, Tone::Caution, "In the bag " + std::to_string(in_bag) +
                                                     " min: reassess now (then continue, or descend)");
    } else {
      verdict_line(state.display, Tone::Neutral, "In the bag " + std::to_string(in_bag) + " of " +
                                                     format_number(kBagSessionMinutes, 0) + " min");
    }
    wake_in(state, seconds_to_next_minute());
  }
  if (s.current_breathing && !s.current_breathing->on_air()) reserve_timer(state, s, now);
}

// [SECTION] New observation

// A whole-number finding that starts empty; "Same: N" copies the last one in a tap.
void optional_field(AppState& state, const char* label, const char* id, const char* what,
                    std::optional<double>& value, double low, double high, const char* unit,
                    std::optional<int> last) {
  FieldSpec spec{.label = label,
                 .id = id,
                 .shown = value ? format_number(*value, 0) + " " + unit : "\xE2\x80\x94  (tap to enter)",
                 .edit_text = value ? format_number(*value, 0) : "",
                 .unit_symbols = {unit},
                 .hint = format_number(low, 0) + "\xE2\x80\x93" + format_number(high, 0) + " " + unit,
                 .steppers = false};
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> n = parse_number(event.text, what);
    if (!n) {
      state.field_errors[id] = n.error().message;
    } else if (!in_range(*n, low, high) || *n != std::floor(*n)) {
      state.field_errors[id] = std::string(what) + " must be a whole number from " +
                               format_number(low, 0) + " to " + format_number(high, 0) + " " + unit;
    } else {
      state.field_errors.erase(id);
      value = *n;
    }
  }
  if (last && !value) {
    std::string same = std::string("Same as last: ") + std::to_string(*last) + " " + unit +
                       "##" + id;
    if (big_button(state.display, same.c_str())) value = *last;
  }
}

std::optional<int> last_whole(const std::optional<units::Fraction>& f) {
  if (!f) return std::nullopt;
  return static_cast<int>(std::lround(f->in(percent)));
}

void observation_form(AppState& state, Platform& platform, const handover::Summary& s,
                      ClockTime now) {
  RecordInputs& in = state.record;
  heading("New observation");
  if (in.on < 0) in.on = s.current_breathing ? breathing_index(*s.current_breathing) : 0;
  std::optional<int> last_spo2 = s.latest_spo2 ? last_whole(s.latest_spo2->spo2) : std::nullopt;
  optional_field(state, "SpO2", "record-spo2", "SpO2", in.spo2_pct, record::kMinSpo2Pct,
                 record::kMaxSpo2Pct, "%", last_spo2);
  ImGui::TextDisabled("Breathing");
  choice_row(state.display, "record-on", kBreathingLabels, 4, &in.on);
  if (in.on > 0) {
    so::FlowRange range = so::valid_flows(static_cast<so::Device>(in.on - 1));
    in.flow = std::clamp(in.flow, range.low, range.high);
    QuantityField<VolumeFlowDimension> f = flow_field("Flow", "record-flow", range.high.in(litres_per_minute));
    f.low = range.low;
    edit_quantity(state, f, in.flow);
  }
  optional_field(state, "Heart rate", "record-hr", "heart rate", in.heart_rate, record::kMinHeartRate,
                 record::kMaxHeartRate, "/min", s.latest_heart_rate);
  optional_field(state, "Breathing rate", "record-rr", "breathing rate", in.breathing_rate,
                 record::kMinBreathingRate, record::kMaxBreathingRate, "/min", s.latest_breathing_rate);
  ImGui::TextDisabled("AVPU (alert / voice / pain / unresponsive)");
  choice_row(state.display, "record-avpu", kAvpuLabels, 4, &in.avpu);
  int_stepper(state.display, "Written up late: minutes ago", "record-ago", &in.minutes_ago, 0, 180);

  bool any = in.spo2_pct || in.heart_rate || in.breathing_rate || in.avpu >= 0;
  if (!any) {
    ImGui::TextDisabled("Enter at least one finding to save an observation.");
    return;
  }
  if (big_button(state.display, "Save observation")) {
    record::Entry e;
    e.time = ClockTime{now.minutes - in.minutes_ago};
    e.kind = record::Kind::Observation;
    if (Result<Length> h = situation_altitude(state)) e.altitude = h.value();
    if (in.spo2_pct) {
      e.spo2 = percent(*in.spo2_pct);
      e.breathing = drafted_breathing(in);
    }
    if (in.heart_rate) e.heart_rate = static_cast<int>(*in.heart_rate);
    if (in.breathing_rate) e.breathing_rate = static_cast<int>(*in.breathing_rate);
    if (in.avpu >= 0) e.avpu = static_cast<record::Avpu>(in.avpu);
    add_entry(in.store, platform, e);
    in.spo2_pct.reset();
    in.heart_rate.reset();
    in.breathing_rate.reset();
    in.avpu = -1;
    in.minutes_ago = 0;
  }
}

// [SECTION] Events

void event_buttons(AppState& state, Platform& platform, const handover::Summary& s, ClockTime now) {
  RecordInputs& in = state.record;
  heading("Events (stamped now)");
  auto add = [&](record::Kind kind, auto&& fill) {
    record::Entry e;
    e.time = now;
    e.kind = kind;
    fill(e);
    add_entry(in.store, platform, e);
  };
  record::Breathing drafted = drafted_breathing(in);
  std::string oxygen_label = drafted.on_air() ? "Oxygen stopped (air)" : "Oxygen set: " + record::breathing_words(drafted);
  bool changed = !s.current_breathing || breathing_index(*s.current_breathing) != in.on ||
                 (!drafted.on_air() && !(s.current_breathing->flow == drafted.flow));
  if (changed && big_button(state.display, oxygen_label.c_str())) {
    add(record::Kind::Oxygen, [&](record::Entry& e) { e.breathing = drafted; });
  }
  bool in_bag = !s.bag_sessions.empty() && !s.bag_sessions.back().end;
  if (!in_bag && big_button(state.display, "Bag session start")) {
    add(record::Kind::BagStart, [&](record::Entry& e) { e.bag_gauge = state.bag.gauge; });
  }
  if (in_bag && big_button(state.display, "Bag session end")) add(record::Kind::BagEnd, [](record::Entry&) {});
  if (big_button(state.display, "Cylinder swapped")) add(record::Kind::CylinderSwap, [](record::Entry&) {});
  Result<Length> here = situation_altitude(state);
  if (here) {
    std::string arrived = "Arrived at " + format_number(std::round(here->in(metres)), 0) + " m";
    if (big_button(state.display, arrived.c_str())) {
      add(record::Kind::Arrival, [&](record::Entry& e) { e.altitude = here.value(); });
    }
  }
}

// [SECTION] Correcting a time

// An entry's clock time typed on the keypad (an event stamped "now" that happened earlier, or
// one written up late): the latest by default, an earlier one picked with the buttons. Valid
// from the incident's start to now (typed_entry_time says so otherwise).
void entry_time(AppState& state, Platform& platform, ClockTime now) {
  RecordInputs& in = state.record;
  const auto& entries = in.store.record.entries;
  if (entries.empty()) return;
  size_t last = entries.size() - 1;
  size_t index = std::min(in.correcting.value_or(last), last);
  const record::Entry& entry = entries[index];
  std::string what(record::kind_key(entry.kind));
  std::replace(what.begin(), what.end(), '_', ' ');
  std::string hhmm = record::clock_hhmm(entry.time);
  std::string label = index == last ? std::string("Time of the latest entry")
                                    : "Time of entry " + std::to_string(index + 1) + " of " +
                                          std::to_string(entries.size());
  FieldSpec spec{.label = label.c_str(),
                 .id = "record-time",
                 .shown = hhmm + " (" + what + ")",
                 .edit_text = hhmm.substr(0, 2) + hhmm.substr(3),
                 .hint = "e.g. 1405, up to " + record::clock_hhmm(now),
                 .steppers = false,
                 .allow_negative = false};
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<ClockTime> t = typed_entry_time(in.store, event.text, now, index);
    if (!t) {
      state.field_errors[spec.id] = t.error().message;
    } else {
      state.field_errors.erase(spec.id);
      retime_entry(in.store, platform, t.value(), index);
      in.correcting.reset();  // it may have moved: back to the latest
    }
  }
  if (index > 0 && big_button(state.display, "Correct an earlier entry")) in.correcting = index - 1;
  if (index < last && big_button(state.display, "Correct a later entry")) {
    in.correcting = index + 1 == last ? std::nullopt : std::optional<size_t>(index + 1);
  }
}

// [SECTION] Trend

// Minutes since the first entry: the one time axis of the SpO2 chart and the rates beneath it.
struct TrendAxis {
  ClockTime first;
  double span = 30.0;
  double x_of(ClockTime t) const { return static_cast<double>(record::minutes_between(first, t)); }
  PlotAxes axes(double y0, double y1, double y_tick, std::string y_label) const {
    return {0.0, span, y0, y1, span > 240 ? 60.0 : 30.0, y_tick, "minutes since first entry", std::move(y_label)};
  }
};

// "0 min 82 % air": a charted point as the test hook and a reader get it.
std::string point_words(double x, double value, const char* unit, const char* mark = "") {
  return format_number(x, 0) + " min " + format_number(value, 0) + " " + unit + (*mark ? " " : "") + mark;
}

// The healthy-lowlander band on air over one stretch of the record (the altitude of the entry
// that starts it; constant until the next entry), after the time spent there.
struct BandStep {
  double from, to;
  expected_spo2::Band band;
  bool extrapolated;
};

// Time at altitude at a past moment: the Casualty screen's figure (meant as now) counted back,
// never below 0; 0 while it is not entered (the on-arrival band, as the legend says: healthy
// newcomers — a chart to read against, not a verdict).
std::optional<expected_spo2::Expectation> band_on_air(const AppState& state, Length altitude,
                                                      ClockTime at, ClockTime now) {
  double back = static_cast<double>(record::minutes_between(at, now));
  Duration there = minutes(std::max(0.0, state.situation.time_at_altitude.in(minutes) - back));
  Result<Pressure> pb = atmosphere::pressure_at(altitude, atmosphere::default_medical_model);
  Result<cascade::Acclimatisation> a = cascade::acclimatisation_after(there);
  if (!pb || !a) return std::nullopt;
  Result<expected_spo2::Expectation> x = expected_spo2::expected(*pb, *a);
  return x ? std::optional(x.value()) : std::nullopt;
}

std::vector<BandStep> band_steps(const AppState& state, const record::Record& rec, const TrendAxis& axis,
                                 ClockTime now) {
  std::vector<BandStep> steps;
  std::optional<Length> altitude;
  for (const record::Entry& e : rec.entries) {
    if (e.altitude) altitude = e.altitude;
    if (!altitude) continue;
    double x = axis.x_of(e.time);
    if (!steps.empty()) steps.back().to = x;
    std::optional<expected_spo2::Expectation> band = band_on_air(state, *altitude, e.time, now);
    if (band) steps.push_back({x, axis.span, band->band, band->extrapolated});
  }
  std::erase_if(steps, [](const BandStep& b) { return b.to <= b.from; });
  return steps;
}

// A calibrated stretch is a filled band; an extrapolated one only its two edges, dashed, in the
// warning colour (named in the legend): it must not read as a reassuring range.
void draw_band(AppState& state, const Plot& plot, const std::vector<BandStep>& steps, double span) {
  double dash = span / 60.0;
  for (const BandStep& b : steps) {
    double low = b.band.low.in(percent), high = b.band.high.in(percent);
    if (!b.extrapolated) {
      plot_band(plot, {{b.from, low}, {b.to, low}}, {{b.from, high}, {b.to, high}},
                plot_colour(state.display, PlotColour::Accent, 0.2f));
      continue;
    }
    for (double x = b.from; x < b.to; x += 2 * dash) {
      double end = std::min(x + dash, b.to);
      for (double y : {low, high}) plot_line(plot, {{x, y}, {end, y}}, plot_colour(state.display, PlotColour::Warning), 0.1f);
    }
  }
}

void spo2_chart(AppState& state, const record::Record& rec, const handover::Summary& s, const TrendAxis& axis,
                ClockTime now) {
  heading("SpO2 over time");
  std::vector<PlotPoint> line;
  std::vector<bool> on_air;
  std::string points;
  for (const record::Entry& e : rec.entries) {
    if (e.kind != record::Kind::Observation || !e.spo2) continue;
    line.push_back({axis.x_of(e.time), e.spo2->in(percent)});
    on_air.push_back(e.breathing && e.breathing->on_air());
    points += (points.empty() ? "" : " | ") + point_words(line.back().x, line.back().y, "%", on_air.back() ? "air" : "O2");
  }
  std::vector<BandStep> band = band_steps(state, rec, axis, now);
  int extrapolated = static_cast<int>(std::count_if(band.begin(), band.end(), [](const BandStep& b) { return b.extrapolated; }));
  double lowest = std::min_element(line.begin(), line.end(), [](PlotPoint a, PlotPoint b) { return a.y < b.y; })->y;
  double y0 = std::min(50.0, std::floor(lowest / 10.0) * 10.0);
  std::string summary = std::to_string(line.size()) + " SpO2 points: " + points + "; band on air: " +
                        std::to_string(band.size()) + " stretches, " + std::to_string(extrapolated) + " extrapolated";
  Plot plot = begin_plot(state.display, "SpO2 trend", summary, 12.0f, axis.axes(y0, 100.0, 10.0, "SpO2 %"));
  draw_band(state, plot, band, axis.span);
  for (const handover::BagSession& b : s.bag_sessions) {
    plot_vline(plot, axis.x_of(b.start), plot_colour(state.display, PlotColour::Dim), "bag");
    if (b.end) plot_vline(plot, axis.x_of(*b.end), plot_colour(state.display, PlotColour::Dim));
  }
  // The flow bar along the bottom, its label a line of text above it.
  double per_em = (100.0 - y0) / (plot.max.y - plot.min.y) * em();
  for (const handover::OxygenPeriod& p : s.oxygen) {
    double to = p.to ? axis.x_of(*p.to) : axis.span;
    double bar = y0 + 0.4 * per_em;
    plot_line(plot, {{axis.x_of(p.from), bar}, {to, bar}}, plot_colour(state.display, PlotColour::Accent), 0.35f);
    plot_text(plot, {axis.x_of(p.from), bar + 1.4 * per_em}, plot_colour(state.display, PlotColour::Accent),
              format_number(p.setting.flow.in(litres_per_minute), 1) + " L/min");
  }
  plot_line(plot, line, plot_colour(state.display, PlotColour::Text));
  for (size_t i = 0; i < line.size(); ++i) {
    plot_point(plot, line[i], plot_colour(state.display, on_air[i] ? PlotColour::Danger : PlotColour::Text), on_air[i] ? "air" : "O2");
  }
  std::vector<std::pair<ImU32, std::string>> legend{
      {plot_colour(state.display, PlotColour::Text), "SpO2 (point: air or O2)"},
      {plot_colour(state.display, PlotColour::Accent, 0.4f), "expected on air (healthy newcomers)"},
      {plot_colour(state.display, PlotColour::Accent), "oxygen given (L/min)"},
      {plot_colour(state.display, PlotColour::Dim), "bag session"}};
  if (extrapolated > 0) legend.push_back({plot_colour(state.display, PlotColour::Warning), "band extrapolated (dashed): no reassurance"});
  plot_legend(legend);
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("Band at each entry's altitude and time there (the Casualty screen's time at "
                      "altitude, counted back); for comparison only, never a verdict.");
  ImGui::PopTextWrapPos();
}

// Heart and breathing rate beneath, on the same minutes.
void rates_chart(AppState& state, const record::Record& rec, const TrendAxis& axis) {
  std::vector<PlotPoint> heart, breathing;
  std::string heart_words, breathing_words;
  for (const record::Entry& e : rec.entries) {
    if (e.kind != record::Kind::Observation) continue;
    double x = axis.x_of(e.time);
    if (e.heart_rate) {
      heart.push_back({x, static_cast<double>(*e.heart_rate)});
      heart_words += (heart_words.empty() ? "" : " | ") + point_words(x, *e.heart_rate, "/min");
    }
    if (e.breathing_rate) {
      breathing.push_back({x, static_cast<double>(*e.breathing_rate)});
      breathing_words += (breathing_words.empty() ? "" : " | ") + point_words(x, *e.breathing_rate, "/min");
    }
  }
  if (heart.empty() && breathing.empty()) return;
  heading("Heart rate and breathing rate");
  double highest = 0.0;
  for (const PlotPoint& p : heart) highest = std::max(highest, p.y);
  for (const PlotPoint& p : breathing) highest = std::max(highest, p.y);
  double top = std::max(160.0, std::ceil(highest / 40.0) * 40.0);
  std::string summary = "heart rate: " + (heart_words.empty() ? std::string("none") : heart_words) +
                        "; breathing rate: " + (breathing_words.empty() ? std::string("none") : breathing_words);
  Plot plot = begin_plot(state.display, "Rates trend", summary, 8.0f, axis.axes(0.0, top, 40.0, "per min"));
  ImU32 heart_colour = plot_colour(state.display, PlotColour::Text), breathing_colour = plot_colour(state.display, PlotColour::Warning);
  plot_line(plot, heart, heart_colour);
  plot_line(plot, breathing, breathing_colour);
  for (const PlotPoint& p : heart) plot_point(plot, p, heart_colour, {}, 0.3f);
  for (const PlotPoint& p : breathing) plot_point(plot, p, breathing_colour, {}, 0.3f);
  plot_legend({{heart_colour, "heart rate /min"}, {breathing_colour, "breathing rate /min"}});
}

void trend_charts(AppState& state, const record::Record& rec, const handover::Summary& s, ClockTime now) {
  if (!s.first_time) return;
  TrendAxis axis{*s.first_time, std::max(30.0, static_cast<double>(record::minutes_between(*s.first_time, *s.last_time)))};
  if (s.first_spo2) spo2_chart(state, rec, s, axis, now);
  rates_chart(state, rec, axis);
}

// [SECTION] Handover and the incident

void handover_section(AppState& state, Platform& platform, const record::Record& rec,
                      const handover::Summary& s) {
  heading("Handover");
  handover::Units units = state.settings.units.altitude == UnitChoice::Altitude::Feet
                              ? handover::Units::Us : handover::Units::Metric;
  std::string text = handover::summary_text(rec, s, units);
  message_line(text);
  if (big_button(state.display, "Copy handover text")) ImGui::SetClipboardText(text.c_str());
  if (big_button(state.display, "Print handover (A4)")) {
    platform.open_html_document("Firn handover", handover::render_html(rec, s, units, handover::Page::A4));
  }
}

constexpr FileKind kRecordFile{"Import record", "Export record", "Record file to import", "incident-import.json",
                               kRecordExportName, "firn handover --record FILE reads a record file."};

// The record as the file the CLI reads, to hand over or keep; an imported one becomes the
// current incident (the one before archived).
void record_file(AppState& state, Platform& platform) {
  RecordInputs& in = state.record;
  heading("Record file");
  if (std::optional<ImportedFile> file = import_control(state, platform, in.file, kRecordFile)) {
    Result<std::string> done = import_record(in.store, platform, file->text, file->name.empty() ? "The file" : file->name);
    in.file.tell(done ? done.value() : done.error().message, !done);
  }
  if (!in.store.record.entries.empty()) {
    export_control(state, platform, in.file, kRecordFile, "record", [&] { return record::write_record(in.store.record); });
  }
  if (!in.file.message.empty()) message_line(in.file.message, in.file.message_is_problem);
}

void incident_buttons(AppState& state, Platform& platform) {
  RecordInputs& in = state.record;
  heading("Incident");
  ImGui::TextDisabled("Kept on this device only. Archived incidents: %d of %d.", archived_count(platform), kArchiveSlots);
  if (!in.confirm_new && big_button(state.display, "New incident")) in.confirm_new = true;
  if (in.confirm_new) {
    verdict_line(state.display, Tone::Caution, "Archive this record and start a new, empty one?");
    if (big_button(state.display, "Yes, new incident")) {
      new_incident(in.store, platform);
      in.confirm_new = false;
    }
    if (big_button(state.display, "Keep this incident")) in.confirm_new = false;
  }
  if (!in.confirm_delete && big_button(state.display, "Delete all records")) in.confirm_delete = true;
  if (in.confirm_delete) {
    verdict_line(state.display, Tone::Danger, "Delete this record and every archived one from this device?");
    if (big_button(state.display, "Yes, delete everything")) {
      delete_all_records(in.store, platform);
      in.confirm_delete = false;
    }
    if (big_button(state.display, "Cancel delete")) in.confirm_delete = false;
  }
}

}  // namespace

void draw_record_panel(AppState& state, Platform& platform) {
  RecordInputs& in = state.record;
  if (!in.loaded) {
    load_record(in.store, platform);
    in.loaded = true;
  }
  const record::Record& rec = in.store.record;
  handover::Summary s = handover::summarise(rec);
  ClockTime now = clock_now();
  heading(rec.entries.empty() ? "Casualty record: no entries yet"
                              : ("Casualty record: " + std::to_string(rec.entries.size()) + " entries, since " +
                                 record::clock_hhmm(*s.first_time)).c_str());
  if (!in.store.problem.empty()) verdict_line(state.display, Tone::Danger, in.store.problem);
  // A record left from an earlier incident keeps no timers running (and wakes nothing).
  if (incident_in_progress(in.store, now)) {
    timers(state, s, now);
  } else if (s.last_time) {
    std::string last = record::clock_text(*s.last_time);
    std::replace(last.begin(), last.end(), 'T', ' ');
    message_line("Last entry " + last + ", " + ago_text(record::minutes_between(*s.last_time, now)) +
                            ": no timers. \"New incident\" below starts the record of a new casualty.");
  }
  if (s.latest_spo2) {
    message_line("Latest SpO2 " + format_number(s.latest_spo2->spo2.in(percent), 0) + " % on " +
                            (s.latest_spo2->on ? record::breathing_words(*s.latest_spo2->on) : "?") +
                            " at " + record::clock_hhmm(s.latest_spo2->time) + ", " +
                            ago_text(record::minutes_between(s.latest_spo2->time, now)));
  }
  observation_form(state, platform, s, now);
  event_buttons(state, platform, s, now);
  entry_time(state, platform, now);
  trend_charts(state, rec, s, now);
  if (!rec.entries.empty()) handover_section(state, platform, rec, s);
  record_file(state, platform);
  incident_buttons(state, platform);
  caution_line(state);
}

}  // namespace firn::ui
