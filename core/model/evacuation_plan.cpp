#include "model/evacuation_plan.hpp"

#include <algorithm>
#include <cmath>

#include "model/oxygen_eos.hpp"

namespace firn::evacuation {
namespace {

using namespace units;

constexpr std::size_t kMaxCylinders = 50, kMaxPhases = 20, kMaxSamples = 600;
constexpr double kMinEvacuationMin = 1.0, kMaxEvacuationH = 72.0;
// Volumes below this (1 mL) are rounding, not oxygen.
constexpr double kVolumeEpsilonL = 1e-3;

// A cylinder resolved to numbers the plan works with.
struct Stock {
  std::string label;
  cylinder::Reading reading;
  double reserve_free_l = 0.0;  // contents at the reserve pressure
  double usable_l = 0.0;        // above the reserve (0 when at or below it)
};

Error with_label(const std::string& label, const Error& e) {
  return Error{label + ": " + e.message};
}

Result<Stock> resolve(const CylinderSpec& spec, const PlanInput& input) {
  std::string label = spec.label.empty() ? "cylinder" : spec.label;
  Volume water;
  if (spec.water_capacity) {
    water = *spec.water_capacity;
  } else if (spec.letter_size) {
    water = cylinder::letter_size_info(*spec.letter_size).water_capacity;
  } else {
    return Error{label + ": give a water capacity (L) or a letter size (D, E, M or H)"};
  }
  Stock s{label, {water, spec.gauge_pressure, spec.temperature, input.ambient_pressure}};
  Result<cylinder::Contents> now = cylinder::contents(s.reading);
  if (!now) return with_label(label, now.error());
  cylinder::Reading at_reserve = s.reading;
  at_reserve.gauge_pressure = input.reserve_gauge;
  Result<cylinder::Contents> reserve = cylinder::contents(at_reserve);
  if (!reserve) return with_label(label, reserve.error());
  s.reserve_free_l = reserve->free_gas.in(litres);
  s.usable_l = std::max(0.0, now->free_gas.in(litres) - s.reserve_free_l);
  return s;
}

Error tiny_flow_error(std::size_t phase, double lpm) {
  return Error{"flow of phase " + std::to_string(phase + 1) + " must be 0 (oxygen off) or " +
               "between " + format_number(cylinder::min_flow_lpm) + " and " +
               format_number(cylinder::max_flow_lpm) + " L/min (got " + format_number(lpm, 6) +
               " L/min)"};
}

Result<double> check_input(const PlanInput& in) {
  if (in.cylinders.empty() || in.cylinders.size() > kMaxCylinders) {
    return range_error("number of cylinders", 1, kMaxCylinders, "",
                       static_cast<double>(in.cylinders.size()));
  }
  if (in.phases.empty() || in.phases.size() > kMaxPhases) {
    return range_error("number of flow phases", 1, kMaxPhases, "",
                       static_cast<double>(in.phases.size()));
  }
  for (std::size_t i = 0; i < in.phases.size(); ++i) {
    double f = in.phases[i].flow.in(litres_per_minute);
    if (!in_range(f, 0.0, cylinder::max_flow_lpm)) {
      return range_error("flow of phase " + std::to_string(i + 1), 0, cylinder::max_flow_lpm,
                         "L/min", f);
    }
    // Fuzz finding: 1e-310 L/min made the spare time infinite (and the CLI assert on it).
    if (f > 0.0 && f < cylinder::min_flow_lpm) return tiny_flow_error(i, f);
    if (i + 1 == in.phases.size()) continue;  // open-ended: its duration, if any, is not used
    if (!in.phases[i].duration) {
      return Error{"phase " + std::to_string(i + 1) + " needs a duration (only the last runs to the end)"};
    }
    double d = in.phases[i].duration->in(minutes);
    if (!in_range(d, 1.0, kMaxEvacuationH * 60.0)) {
      return range_error("duration of phase " + std::to_string(i + 1), 1, kMaxEvacuationH * 60,
                         "min", d);
    }
  }
  double evac = in.evacuation.in(minutes);
  if (!in_range(evac, kMinEvacuationMin, kMaxEvacuationH * 60.0)) {
    return range_error("evacuation time", kMinEvacuationMin, kMaxEvacuationH * 60, "min", evac);
  }
  double reserve = in.reserve_gauge.in(bar);
  if (!in_range(reserve, 0.0, cylinder::max_reserve_bar)) {
    return range_error("reserve pressure (gauge)", 0, cylinder::max_reserve_bar, "bar", reserve);
  }
  double margin = in.margin_minimum.in(minutes);
  if (!in_range(margin, 0.0, max_margin_minimum_min)) {
    return range_error("safety margin", 0, max_margin_minimum_min, "min", margin);
  }
  if (!in_range(in.margin_fraction * 100.0, 0.0, max_margin_fraction * 100.0)) {
    return range_error("safety margin share of the evacuation", 0, max_margin_fraction * 100.0, "%",
                       in.margin_fraction * 100.0);
  }
  FIRN_ASSERT(in.pressure_unit != nullptr, "plan: no pressure unit for its texts");
  double interval = in.sample_interval.in(minutes);
  if (!in_range(interval, 1.0, 60.0)) {
    return range_error("sample interval", 1, 60, "min", interval);
  }
  return 0.0;
}

// The flow schedule: phase boundaries in minutes; the last phase runs on for ever.
struct Schedule {
  std::vector<double> starts_min;
  std::vector<double> flows_lpm;

  std::size_t phase_at(double t) const {
    std::size_t k = 0;
    while (k + 1 < starts_min.size() && starts_min[k + 1] <= t) ++k;
    return k;
  }
  double next_boundary(double t) const {
    for (double s : starts_min) {
      if (s > t) return s;
    }
    return INFINITY;
  }
  double demand_l(double from, double to) const {
    double total = 0.0, t = from;
    while (t < to) {
      double end = std::min(to, next_boundary(t));
      total += flows_lpm[phase_at(t)] * (end - t);
      t = end;
    }
    return total;
  }
};

// One cylinder supplying at one flow over [start, end].
struct Segment {
  std::size_t cylinder;
  double start_min, end_min;
  double remaining_at_start_l;
  double flow_lpm;
};

double gauge_bar_at(const Stock& s, double remaining_l) {
  double free_l = s.reserve_free_l + std::max(0.0, remaining_l);
  Result<GaugePressure> p = cylinder::gauge_pressure_for(s.reading.water_capacity,
                                                    s.reading.temperature,
                                                    s.reading.ambient_pressure, litres(free_l));
  // Remaining gas lies between the reserve and the starting reading, both validated.
  FIRN_ASSERT(p.ok(), "plan: gauge pressure out of the cylinder's range");
  return p->in(bar);
}

std::string minutes_text(double t) { return format_number(t, 0) + " min"; }

// "1 h 12 min", "45 min": whole minutes as given (the caller rounds).
std::string hours_minutes_text(Duration d) {
  long total = std::lround(d.in(minutes));
  if (total < 60) return std::to_string(total) + " min";
  return std::to_string(total / 60) + " h " + std::to_string(total % 60) + " min";
}

// The steady flow that spreads `litres` over `over_min`, rounded down to 0.1 L/min.
std::optional<VolumeFlow> steady_flow(double litres_available, double over_min) {
  double lpm = std::floor(litres_available / over_min * 10.0 + 1e-9) / 10.0;
  if (!(lpm >= cylinder::min_flow_lpm)) return std::nullopt;
  return litres_per_minute(std::min(lpm, cylinder::max_flow_lpm));
}

// Count shortfalls in the chosen cylinder, else in the first one filled above the reserve.
Result<Stock> counting_stock(const PlanInput& input, const std::vector<Stock>& stock) {
  Result<Stock> counting = Error{""};
  if (input.counting_cylinder) {
    CylinderSpec spec = *input.counting_cylinder;
    // A letter size with no pressure given means a full one at its service pressure.
    if (spec.letter_size && spec.gauge_pressure == GaugePressure{}) {
      spec.gauge_pressure = cylinder::letter_size_info(*spec.letter_size).full_gauge;
    }
    counting = resolve(spec, input);
    if (!counting) return counting.error();
  } else {
    counting = stock.front();
    for (const Stock& s : stock) {
      if (s.usable_l > kVolumeEpsilonL) {
        counting = s;
        break;
      }
    }
  }
  if (counting->usable_l <= kVolumeEpsilonL) {
    return Error{"the cylinder to start with (" + counting->label +
                 ") must be filled above the reserve pressure"};
  }
  return counting;
}

Schedule schedule_of(const std::vector<FlowPhase>& phases) {
  Schedule schedule;
  double t_acc = 0.0;
  for (const FlowPhase& phase : phases) {
    schedule.starts_min.push_back(t_acc);
    schedule.flows_lpm.push_back(phase.flow.in(litres_per_minute));
    t_acc += phase.duration ? phase.duration->in(minutes) : 0.0;  // the last: open-ended
  }
  return schedule;
}

// "20.0 bar", "290 psi gauge": the reserve as the plan's sentences say it.
std::string reserve_text(const PlanInput& input) {
  const auto& unit = *input.pressure_unit;
  bool in_psi = unit.symbol == "psi";
  return format_number(input.reserve_gauge.in(unit), in_psi ? 0 : 1) + " " +
         std::string(unit.symbol) + (in_psi ? " gauge" : "");
}

// What the plan assumes, shown with it; sets `extrapolated` for a cylinder beyond the EOS data.
void note_assumptions(EvacuationPlan& plan, const PlanInput& input, const std::vector<Stock>& stock,
                      const std::string& reserve) {
  plan.assumptions = {
      "Cylinders are used one after another in the order listed, each down to the reserve "
      "pressure of " + reserve + "; a swap takes no time.",
      "Each cylinder stays at its own temperature (cooling as gas is drawn off is ignored).",
      "Flows are free-gas litres per minute (at 1 atm); a flowmeter at altitude may deliver "
      "differently (see the flow corrections).",
      "The last flow phase continues until arrival; spare time is counted at the flow in use "
      "at arrival."};
  for (const Stock& s : stock) {
    if (s.usable_l <= kVolumeEpsilonL) {
      plan.assumptions.push_back(s.label + " is at or below the reserve pressure: not used.");
    }
    plan.extrapolated = plan.extrapolated || oxygen_eos::extrapolated(s.reading.temperature);
  }
  std::vector<cylinder::LetterSize> assumed;
  for (const CylinderSpec& spec : input.cylinders) {
    if (spec.letter_size && !spec.water_capacity &&
        std::find(assumed.begin(), assumed.end(), *spec.letter_size) == assumed.end()) {
      assumed.push_back(*spec.letter_size);
      plan.assumptions.push_back(cylinder::letter_size_assumption(*spec.letter_size) + ".");
    }
  }
  if (plan.extrapolated) {
    std::string text(oxygen_eos::extrapolated_text);
    plan.assumptions.push_back("A cylinder is warmer than 300 K: " + text + "; no \"enough\" from it.");
  }
}

// The timeline walked: which cylinder supplies when, and what is left.
struct Walk {
  std::vector<Segment> segments;
  std::vector<double> remaining;  // litres above reserve per cylinder at the end
  std::size_t current = 0;        // the cylinder in use at the end
  double ran_out_at = -1.0;       // minutes; < 0: the oxygen lasted
};

// Cylinder exhaustion and phase boundaries cut the evacuation into segments; fills the plan's
// uses and events on the way.
Walk walk_timeline(EvacuationPlan& plan, const std::vector<Stock>& stock, const Schedule& schedule,
                   double evac, GaugePressure reserve_gauge, const std::string& reserve) {
  Walk w;
  for (const Stock& s : stock) w.remaining.push_back(s.usable_l);
  auto next_cylinder = [&](std::size_t from) {
    std::size_t i = from;
    while (i < stock.size() && w.remaining[i] <= kVolumeEpsilonL) ++i;
    return i;
  };
  std::size_t& current = w.current;
  current = next_cylinder(0);
  double t = 0.0;
  if (current < stock.size()) {
    plan.events.push_back({minutes(0), EventKind::Start, current, "Open " + stock[current].label});
    plan.uses.push_back({current, stock[current].label, minutes(0), minutes(0),
                         stock[current].reading.gauge_pressure, reserve_gauge, litres(0), false});
  } else {
    w.ran_out_at = 0.0;
    plan.events.push_back({minutes(0), EventKind::Reserve, 0,
                           "No cylinder is filled above the reserve pressure"});
  }
  while (w.ran_out_at < 0.0 && t < evac) {
    std::size_t phase = schedule.phase_at(t);
    double flow = schedule.flows_lpm[phase];
    double phase_end = std::min(evac, schedule.next_boundary(t));
    double exhaust = flow > 0.0 ? t + w.remaining[current] / flow : INFINITY;
    double end = std::min(phase_end, exhaust);
    w.segments.push_back({current, t, end, w.remaining[current], flow});
    w.remaining[current] = end == exhaust ? 0.0 : w.remaining[current] - flow * (end - t);
    plan.uses.back().delivered += litres(flow * (end - t));
    t = end;
    if (end == exhaust) {
      CylinderUse& use = plan.uses.back();
      use.end = minutes(t);
      use.reached_reserve = true;
      std::size_t next = next_cylinder(current + 1);
      if (next < stock.size()) {
        plan.events.push_back({minutes(t), EventKind::Swap, next,
                               "Swap " + stock[current].label + " (at reserve " + reserve +
                                   ") to " + stock[next].label});
        plan.uses.push_back({next, stock[next].label, minutes(t), minutes(t),
                             stock[next].reading.gauge_pressure, reserve_gauge, litres(0), false});
        current = next;
      } else {
        w.ran_out_at = t;
        plan.events.push_back({minutes(t), EventKind::Reserve, current,
                               stock[current].label + " at reserve " + reserve +
                                   ": no oxygen above reserve left"});
      }
    } else if (t < evac) {
      plan.events.push_back({minutes(t), EventKind::FlowChange, current,
                             "Flow " + format_number(schedule.flows_lpm[schedule.phase_at(t)], 1) +
                                 " L/min"});
    }
  }
  if (!plan.uses.empty() && !plan.uses.back().reached_reserve) {
    CylinderUse& use = plan.uses.back();
    use.end = minutes(evac);
    use.end_gauge = bar.gauge(gauge_bar_at(stock[current], w.remaining[current]));
  }
  plan.events.push_back({minutes(evac), EventKind::Arrival,
                         plan.uses.empty() ? 0 : plan.uses.back().cylinder_index,
                         "Arrival after " + minutes_text(evac)});
  return w;
}

// Enough or short, in minutes and in cylinders of the counting size.
void add_totals(EvacuationPlan& plan, const Walk& w, const Schedule& schedule, double evac,
                double counting_l) {
  double left = 0.0;
  for (double r : w.remaining) left += r;
  plan.counting_cylinder_usable = litres(counting_l);
  if (w.ran_out_at < 0.0) {
    plan.enough = true;
    plan.shortfall = minutes(0);
    plan.shortfall_volume = litres(0);
    plan.spare_volume = litres(left);
    plan.extra_cylinders_needed = 0;
    plan.spare_cylinders = left / counting_l;
    double final_flow = schedule.flows_lpm[schedule.phase_at(evac)];
    if (final_flow > 0.0) {
      plan.spare = minutes(left / final_flow);
      plan.supply_lasts = minutes(evac + left / final_flow);
    } else {
      plan.spare = minutes(0);
      plan.assumptions.push_back("The flow at arrival is 0 L/min: spare time is not counted.");
    }
  } else {
    double missing = schedule.demand_l(w.ran_out_at, evac);
    plan.enough = missing <= kVolumeEpsilonL;
    plan.supply_lasts = minutes(w.ran_out_at);
    plan.shortfall = plan.enough ? minutes(0) : minutes(evac - w.ran_out_at);
    plan.shortfall_volume = litres(plan.enough ? 0.0 : missing);
    plan.spare_volume = litres(0);
    plan.spare = minutes(0);
    plan.spare_cylinders = 0.0;
    plan.extra_cylinders_needed =
        plan.enough ? 0 : static_cast<int>(std::ceil(missing / counting_l - 1e-9));
  }
}

// The verdict: enough only with the margin, never from an extrapolated figure; and the reverse
// question, the steady flows the stock holds.
void decide_verdict(EvacuationPlan& plan, const PlanInput& input, double usable_total) {
  const double evac = input.evacuation.in(minutes);
  plan.margin = std::max(input.margin_minimum, input.evacuation * input.margin_fraction);
  if (!plan.enough) {
    plan.verdict = Verdict::Short;
  } else if (plan.extrapolated) {
    plan.verdict = Verdict::Extrapolated;
  } else {
    bool margin_kept = !plan.supply_lasts ||
                       *plan.supply_lasts >= input.evacuation + plan.margin - minutes(1e-9);
    plan.verdict = margin_kept ? Verdict::Enough : Verdict::BelowMargin;
  }
  plan.max_sustainable_flow = steady_flow(usable_total, evac + plan.margin.in(minutes));
  plan.max_flow_to_arrival = steady_flow(usable_total, evac);
}

// Pressure-vs-time samples: every interval and every segment end (events), capped in number.
void add_samples(EvacuationPlan& plan, const Walk& w, const std::vector<Stock>& stock, double evac,
                 double interval) {
  if (evac / interval > kMaxSamples) {
    interval = std::ceil(evac / kMaxSamples);
    plan.assumptions.push_back("Samples every " + minutes_text(interval) + " to keep the plot small.");
  }
  auto add_sample = [&](double time, std::size_t cyl, double remaining_l, double flow) {
    PressureSample s{minutes(time), cyl, bar.gauge(gauge_bar_at(stock[cyl], remaining_l)),
                     litres_per_minute(flow)};
    if (!plan.samples.empty() && plan.samples.back().time == s.time &&
        plan.samples.back().cylinder_index == cyl) {
      plan.samples.back() = s;  // same instant and cylinder: keep the newer flow
    } else {
      plan.samples.push_back(s);
    }
  };
  for (const Segment& seg : w.segments) {
    add_sample(seg.start_min, seg.cylinder, seg.remaining_at_start_l, seg.flow_lpm);
    for (double k = std::floor(seg.start_min / interval) + 1; k * interval < seg.end_min; ++k) {
      double at = k * interval;
      add_sample(at, seg.cylinder, seg.remaining_at_start_l - seg.flow_lpm * (at - seg.start_min),
                 seg.flow_lpm);
    }
    double at_end = seg.remaining_at_start_l - seg.flow_lpm * (seg.end_min - seg.start_min);
    add_sample(seg.end_min, seg.cylinder, at_end, seg.flow_lpm);
  }
  // After the oxygen ran out: the last cylinder stays at reserve until arrival.
  if (w.ran_out_at >= 0.0 && w.ran_out_at < evac && !plan.uses.empty()) {
    std::size_t last = plan.uses.back().cylinder_index;
    for (double k = std::floor(w.ran_out_at / interval) + 1; k * interval < evac; ++k) {
      add_sample(k * interval, last, 0.0, 0.0);
    }
    add_sample(evac, last, 0.0, 0.0);
  }
}

}  // namespace

std::string_view verdict_key(Verdict verdict) {
  switch (verdict) {
    case Verdict::Enough: return "enough";
    case Verdict::BelowMargin: return "below_margin";
    case Verdict::Short: return "short";
    case Verdict::Extrapolated: return "extrapolated";
  }
  return "unknown";
}

std::string verdict_text(const EvacuationPlan& p) {
  std::string margin = hours_minutes_text(cylinder::whole_minutes_up(p.margin));
  std::string spare = hours_minutes_text(cylinder::whole_minutes_down(p.spare));
  switch (p.verdict) {
    case Verdict::Enough:
      if (!p.supply_lasts) return "Enough with the " + margin + " margin: the oxygen is off at arrival";
      return "Enough with the " + margin + " margin: " + spare + " spare";
    case Verdict::BelowMargin:
      return "Lasts to arrival with only " + spare + " spare: less than the " + margin +
             " margin";
    case Verdict::Short:
      return "Short by " + hours_minutes_text(cylinder::whole_minutes_up(p.shortfall));
    case Verdict::Extrapolated:
      return "No verdict: a cylinder is above 300 K, where the oxygen figures are extrapolated";
  }
  return "";
}

std::string_view event_key(EventKind kind) {
  switch (kind) {
    case EventKind::Start: return "start";
    case EventKind::FlowChange: return "flow_change";
    case EventKind::Swap: return "swap";
    case EventKind::Reserve: return "reserve";
    case EventKind::Arrival: return "arrival";
  }
  return "unknown";
}

Result<EvacuationPlan> plan_evacuation(const PlanInput& input) {
  Result<double> ok = check_input(input);
  if (!ok) return ok.error();
  std::vector<Stock> stock;
  for (const CylinderSpec& spec : input.cylinders) {
    Result<Stock> s = resolve(spec, input);
    if (!s) return s.error();
    stock.push_back(s.value());
  }
  Result<Stock> counting = counting_stock(input, stock);
  if (!counting) return counting.error();

  EvacuationPlan plan;
  const Schedule schedule = schedule_of(input.phases);
  const double evac = input.evacuation.in(minutes);
  const std::string reserve = reserve_text(input);
  plan.oxygen_needed = litres(schedule.demand_l(0.0, evac));
  double usable_total = 0.0;
  for (const Stock& s : stock) usable_total += s.usable_l;
  plan.oxygen_usable = litres(usable_total);
  note_assumptions(plan, input, stock, reserve);

  const Walk walk = walk_timeline(plan, stock, schedule, evac, input.reserve_gauge, reserve);
  add_totals(plan, walk, schedule, evac, counting->usable_l);
  decide_verdict(plan, input, usable_total);
  add_samples(plan, walk, stock, evac, input.sample_interval.in(minutes));
  return plan;
}

}  // namespace firn::evacuation
