#include "model/route_plan.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_cascade.hpp"

namespace firn::route {
namespace {

using namespace units;
namespace so = supplemental_oxygen;

std::string leg_name(std::size_t i, const Leg& leg) {
  std::string name = "leg " + std::to_string(i + 1);
  return leg.label.empty() ? name : name + " (" + leg.label + ")";
}

Error on_leg(std::size_t i, const Leg& leg, const Error& e) {
  return Error{leg_name(i, leg) + ": " + e.message};
}

std::string metres_text(Length h) { return format_number(std::round(h.in(metres)), 0) + " m"; }
std::string flow_text(VolumeFlow f) { return format_number(f.in(litres_per_minute), 1) + " L/min"; }
std::string pct_text(Fraction f) { return format_number(std::floor(f.in(percent)), 0) + " %"; }
std::string minutes_text(double m) { return format_number(m, 0) + " min"; }

Result<double> check_leg(std::size_t i, const Leg& leg) {
  for (Length h : {leg.start_altitude, leg.end_altitude}) {
    if (!within(h, Limits::altitude_low_m, Limits::altitude_high_m, metres)) {
      return on_leg(i, leg, range_error("altitude", Limits::altitude_low_m,
                                        Limits::altitude_high_m, "m", h.in(metres)));
    }
  }
  if (!within(leg.duration, Limits::leg_low_min, Limits::leg_high_h * 60.0, minutes)) {
    return on_leg(i, leg, range_error("duration", Limits::leg_low_min, Limits::leg_high_h * 60.0,
                                      "min", leg.duration.in(minutes)));
  }
  double feed = leg.bag_oxygen_feed.in(litres_per_minute);
  if (!in_range(feed, 0.0, Limits::bag_feed_high_lpm) ||
      (feed > 0.0 && feed < cylinder::min_flow_lpm)) {
    return on_leg(i, leg, Error{"oxygen fed into the bag must be 0 or between " +
                                format_number(cylinder::min_flow_lpm) + " and " +
                                format_number(Limits::bag_feed_high_lpm) + " L/min (got " +
                                format_number(feed, 3) + " L/min)"});
  }
  if (feed > 0.0 && !leg.bag_flush) {
    return on_leg(i, leg, Error{"oxygen fed into the bag needs the bag's fresh-air flush"});
  }
  return 0.0;
}

Result<double> check_input(const RouteInput& in) {
  if (in.legs.empty() || in.legs.size() > Limits::legs_max) {
    return range_error("number of legs", 1, Limits::legs_max, "", double(in.legs.size()));
  }
  double total = 0.0;
  for (std::size_t i = 0; i < in.legs.size(); ++i) {
    Result<double> ok = check_leg(i, in.legs[i]);
    if (!ok) return ok;
    total += in.legs[i].duration.in(minutes);
  }
  if (!in_range(total, 1.0, Limits::route_high_h * 60.0)) {
    return range_error("route time", 1, Limits::route_high_h * 60.0, "min", total);
  }
  if (!within(in.stock.margin, Limits::margin_low_min, Limits::margin_high_h * 60.0, minutes)) {
    return range_error("safety margin", Limits::margin_low_min, Limits::margin_high_h * 60.0,
                       "min", in.stock.margin.in(minutes));
  }
  double second = in.stock.second_flow.in(litres_per_minute);
  if (!in_range(second, 0.0, Limits::second_flow_high_lpm) ||
      (second > 0.0 && second < cylinder::min_flow_lpm)) {
    return range_error("second consumer's flow (0 for none)", cylinder::min_flow_lpm,
                       Limits::second_flow_high_lpm, "L/min", second);
  }
  double target = in.casualty.target.in(percent);
  if (!in_range(target, Limits::target_low_pct, Limits::target_high_pct)) {
    return range_error("target SpO2", Limits::target_low_pct, Limits::target_high_pct, "%", target);
  }
  if (in.stock.cylinders.empty() || in.stock.cylinders.size() > Limits::cylinders_max) {
    return range_error("number of cylinders", 1, Limits::cylinders_max, "",
                       double(in.stock.cylinders.size()));
  }
  if (in.start_clock_min && !in_range(*in.start_clock_min, 0, 24 * 60 - 1)) {
    return range_error("start time", 0, 24 * 60 - 1, "min after midnight", *in.start_clock_min);
  }
  return 0.0;
}

// The smallest flowmeter setting at or above `flow` that the device accepts; none: `flow`.
VolumeFlow round_up_to_step(VolumeFlow flow, so::Device device,
                            const std::vector<VolumeFlow>& steps) {
  so::FlowRange range = so::valid_flows(device);
  std::optional<VolumeFlow> best;
  for (VolumeFlow s : steps) {
    if (s >= flow && s >= range.low && s <= range.high && (!best || s < *best)) best = s;
  }
  return best.value_or(flow);
}

// The largest flowmeter setting at or below `flow`; no steps: down to 0.5 L/min.
VolumeFlow round_down_to_step(VolumeFlow flow, const std::vector<VolumeFlow>& steps) {
  double lpm = std::max(0.0, flow.in(litres_per_minute));
  double best = std::floor(lpm * 2.0 + 1e-9) / 2.0;
  if (!steps.empty()) {
    best = 0.0;
    for (VolumeFlow s : steps) {
      double v = s.in(litres_per_minute);
      if (v <= lpm + 1e-9) best = std::max(best, v);
    }
  }
  return litres_per_minute(best);
}

// A bag leg: the casualty breathes the bag's gas at the bag's pressure.
Result<double> bag_leg(const RouteInput& in, std::size_t i, LegResult& r) {
  hyperbaric_bag::Settings s;
  s.gauge = in.bag_gauge;
  s.flush = r.leg.bag_flush;
  s.oxygen_feed = r.leg.bag_oxygen_feed;
  Result<hyperbaric_bag::BagResult> bag = hyperbaric_bag::bag_at_altitude(r.highest, in.model, s);
  if (!bag) return on_leg(i, r.leg, bag.error());
  r.bag_inside_pressure = bag->inside_pressure;
  Result<expected_spo2::Expectation> inside =
      expected_spo2::expected(bag->inside_pressure, in.casualty.exposure, bag->inside_o2);
  if (!inside) return on_leg(i, r.leg, inside.error());
  r.spo2_at_flow = inside->band;
  r.extrapolated = r.extrapolated || inside->extrapolated;
  r.flow = r.leg.bag_oxygen_feed;
  return 0.0;
}

// A mask leg: the flow needed for the target, or the flow fixed by hand.
Result<double> mask_leg(const RouteInput& in, std::size_t i, LegResult& r) {
  Result<Need> need = casualty_need(in.casualty, r.pressure, in.flow_steps);
  if (!need) return on_leg(i, r.leg, need.error());
  r.needed_flow = need->flow;
  r.target_reachable = need->reachable;
  r.spo2_at_flow = need->at_flow;
  r.extrapolated = r.extrapolated || need->extrapolated;
  r.flow = need->flow;
  if (r.leg.fixed_flow) {
    Result<so::Prediction> p =
        so::predict(r.pressure, in.casualty.exposure, in.casualty.device, *r.leg.fixed_flow);
    if (!p) return on_leg(i, r.leg, p.error());
    r.flow = *r.leg.fixed_flow;
    r.fixed_by_hand = true;
    r.spo2_at_flow = p->spo2;
    r.extrapolated = need->extrapolated || p->extrapolated;
  }
  return 0.0;
}

Result<LegResult> leg_result(const RouteInput& in, std::size_t i, Duration start) {
  LegResult r;
  r.leg = in.legs[i];
  r.start = start;
  r.highest = std::max(r.leg.start_altitude, r.leg.end_altitude);
  Result<Pressure> pb = atmosphere::pressure_at(r.highest, in.model);
  if (!pb) return on_leg(i, r.leg, pb.error());
  r.pressure = pb.value();
  Result<Pressure> pio2 = cascade::inspired_po2(r.pressure, cascade::dry_air_fio2());
  if (!pio2) return on_leg(i, r.leg, pio2.error());
  r.pio2 = pio2.value();
  Result<expected_spo2::Expectation> air = expected_spo2::expected(r.pressure, in.casualty.exposure);
  if (!air) return on_leg(i, r.leg, air.error());
  r.spo2_on_air = air->band;
  r.extrapolated = air->extrapolated;
  Result<double> ok = r.leg.kind == LegKind::Bag ? bag_leg(in, i, r) : mask_leg(in, i, r);
  if (!ok) return ok.error();
  r.oxygen_used = (r.flow + in.stock.second_flow) * r.leg.duration;
  return r;
}

evacuation::CylinderSpec spec_of(const StockCylinder& c) {
  return {c.label, std::nullopt, c.water_capacity, c.gauge, c.temperature};
}

// The plan's input: one flow phase per leg, then the margin at the route's highest flow.
evacuation::PlanInput plan_input(const RouteInput& in, const std::vector<LegResult>& legs,
                                 Pressure ambient, VolumeFlow margin_flow, Duration until) {
  evacuation::PlanInput p;
  for (const StockCylinder& c : in.stock.cylinders) p.cylinders.push_back(spec_of(c));
  for (const LegResult& l : legs) p.phases.push_back({l.flow + in.stock.second_flow, l.leg.duration});
  p.phases.push_back({margin_flow, minutes(60)});
  p.evacuation = until;
  p.reserve_gauge = in.stock.reserve_gauge;
  p.ambient_pressure = ambient;
  p.counting_cylinder = evacuation::CylinderSpec{"full " + in.stock.count_in_label, std::nullopt,
                                                 in.stock.count_in_water_capacity,
                                                 in.stock.count_in_fill_gauge, cylinder::assumed_temperature};
  return p;
}

void add_leg_cautions(const RouteInput& in, const std::vector<LegResult>& legs, RoutePlan& plan) {
  std::string device(so::device_name(in.casualty.device));
  Length here = in.casualty.measured_at.value_or(legs.front().leg.start_altitude);
  for (std::size_t i = 0; i < legs.size(); ++i) {
    const LegResult& l = legs[i];
    if (l.leg.kind != LegKind::Bag && !l.target_reachable) {
      plan.cautions.push_back(
          leg_name(i, l.leg) + ": the target " + pct_text(in.casualty.target) +
          " is not reachable with a " + device + " at " + metres_text(l.highest) + " (" +
          format_number(l.pressure.in(hectopascals), 0) + " hPa): predicted " +
          pct_text(l.spo2_at_flow.low) + " at its maximum " + flow_text(l.flow) +
          ". Use a stronger device, the bag, or descend.");
    }
    if (l.leg.fixed_flow && l.spo2_at_flow.low < in.casualty.target) {
      plan.cautions.push_back(leg_name(i, l.leg) + ": the flow fixed by hand, " +
                              flow_text(l.flow) + ", is predicted to give " +
                              pct_text(l.spo2_at_flow.low) + ", below the target.");
    }
    if (l.leg.kind == LegKind::Flight && l.highest > here) {
      plan.cautions.push_back(leg_name(i, l.leg) + ": the flight cruises at " +
                              metres_text(l.highest) + ", " + metres_text(l.highest - here) +
                              " above the casualty's altitude before it (" + metres_text(here) +
                              "), unpressurised: the casualty will desaturate; flow planned for "
                              "the cruising altitude.");
    }
    here = l.leg.end_altitude;
  }
}

// True when the measured SpO2 on air is below the healthy band: the flows are then too low.
bool add_casualty_caution(const RouteInput& in, RoutePlan& plan) {
  const Casualty& c = in.casualty;
  if (!c.measured_spo2_on_air || !c.measured_at) return false;
  Result<Pressure> pb = atmosphere::pressure_at(*c.measured_at, in.model);
  if (!pb) return false;
  Result<expected_spo2::Expectation> e = expected_spo2::expected(*pb, c.exposure);
  if (!e) return false;
  Result<expected_spo2::Assessment> a = expected_spo2::assess(*c.measured_spo2_on_air, e->band);
  if (!a || a->position == expected_spo2::Position::Within ||
      a->position == expected_spo2::Position::Above) {
    return false;
  }
  plan.cautions.insert(plan.cautions.begin(),
                       "Measured " + pct_text(*c.measured_spo2_on_air) + " on air at " +
                           metres_text(*c.measured_at) + " is below the healthy band (" +
                           pct_text(e->band.low) + "\xE2\x80\xA6" + pct_text(e->band.high) +
                           "): this casualty is likely to need MORE oxygen than these flows. "
                           "Titrate to the oximeter.");
  return true;
}

void set_verdict(const RouteInput& in, const std::string& unsure, RoutePlan& plan) {
  std::string margin = minutes_text(in.stock.margin.in(minutes));
  if (!plan.enough) {
    plan.verdict = "short by " + minutes_text(plan.shortfall.in(minutes)) + ": " +
                   std::to_string(plan.extra_cylinders) + " more " + in.stock.count_in_label +
                   (plan.extra_cylinders == 1 ? " cylinder" : " cylinders") +
                   " (full) to keep the " + margin + " margin";
    return;
  }
  std::string lasts = minutes_text(plan.spare.in(minutes)) + " spare beyond the " + margin +
                      " margin";
  if (!unsure.empty()) {
    // No reassurance from figures outside their data: the flows themselves are uncertain.
    plan.enough = false;
    plan.verdict = "no verdict: " + unsure + "; at these flows the stock has " + lasts +
                   ", and supports a steady " + flow_text(plan.max_steady_flow);
    return;
  }
  plan.verdict = "enough, " + lasts;
}

}  // namespace

std::string_view leg_kind_key(LegKind kind) {
  switch (kind) {
    case LegKind::Carry: return "carry";
    case LegKind::Wait: return "wait";
    case LegKind::Bag: return "bag";
    case LegKind::Flight: return "flight";
  }
  return "carry";
}

Result<Need> casualty_need(const Casualty& casualty, Pressure barometric,
                           const std::vector<VolumeFlow>& flow_steps) {
  // ADJUSTMENT POINT: an individual estimate (from the SpO2 measured on air) replaces these two
  // healthy-lowlander calls; everything downstream reads only Need.
  Result<so::FlowForTarget> f = so::lowest_flow_for_target(barometric, casualty.exposure,
                                                           casualty.device, casualty.target);
  if (!f) return f.error();
  Result<expected_spo2::Expectation> air = expected_spo2::expected(barometric, casualty.exposure);
  if (!air) return air.error();
  Need need;
  need.on_air_reaches_target = f->reached_on_air;
  need.reachable = f->reachable;
  need.on_air = air->band;
  need.flow = f->flow;
  need.at_flow = f->at_flow.spo2;
  need.extrapolated = air->extrapolated || f->at_flow.extrapolated;
  if (f->reachable) {
    need.flow = round_up_to_step(f->flow, casualty.device, flow_steps);
    Result<so::Prediction> p = so::predict(barometric, casualty.exposure, casualty.device, need.flow);
    if (!p) return p.error();
    need.at_flow = p->spo2;
    need.extrapolated = need.extrapolated || p->extrapolated;
  }
  return need;
}

std::string clock_text(int start_clock_min, Duration offset) {
  long total = (start_clock_min + static_cast<long>(std::floor(offset.in(minutes) + 1e-9))) % 1440;
  char text[8];
  std::snprintf(text, sizeof text, "%02ld:%02ld", total / 60, total % 60);
  return text;
}

namespace {

// The legs in order, each from the time the one before ended; the highest point and the
// highest flow the stock must carry. Sets `unsure` when a leg's flow is extrapolated or the
// target is unreachable (and nobody fixed the flow by hand).
Result<VolumeFlow> walk_legs(const RouteInput& in, RoutePlan& plan, bool& unsure) {
  Duration t = minutes(0);
  VolumeFlow highest_flow = litres_per_minute(0);
  for (std::size_t i = 0; i < in.legs.size(); ++i) {
    Result<LegResult> r = leg_result(in, i, t);
    if (!r) return r.error();
    if (r->highest > plan.highest_altitude || i == 0) {
      plan.highest_altitude = r->highest;
      plan.highest_leg = i;
    }
    unsure = unsure || (!r->fixed_by_hand && (r->extrapolated || !r->target_reachable));
    highest_flow = std::max(highest_flow, r->flow + in.stock.second_flow);
    t += r->leg.duration;
    plan.legs.push_back(r.value());
  }
  plan.route_time = t;
  return highest_flow;
}

// The cylinders' timeline (to arrival: what the team follows) and the verdict's figures (to
// arrival + margin), rounded the conservative way: times down, a shortfall up.
void take_cylinder_plans(const evacuation::EvacuationPlan& timeline,
                         const evacuation::EvacuationPlan& verdict, RoutePlan& plan) {
  for (std::size_t k = 0; k < timeline.uses.size(); ++k) {
    const evacuation::CylinderUse& u = timeline.uses[k];
    plan.spans.push_back({u.cylinder_index, u.start, u.end, u.start_gauge, u.end_gauge,
                          u.reached_reserve});
    if (k > 0) {
      plan.swaps.push_back({minutes(std::floor(u.start.in(minutes) + 1e-9)),
                            timeline.uses[k - 1].cylinder_index, u.cylinder_index});
    }
  }
  if (verdict.supply_lasts) {
    plan.reserve_reached = minutes(std::floor(verdict.supply_lasts->in(minutes) + 1e-9));
  }
  plan.enough = verdict.enough;
  plan.spare = minutes(std::floor(verdict.spare.in(minutes) + 1e-9));
  plan.shortfall = minutes(std::ceil(verdict.shortfall.in(minutes) - 1e-9));
  plan.extra_cylinders = verdict.extra_cylinders_needed;
  plan.oxygen_needed = verdict.oxygen_needed;
  plan.oxygen_usable = verdict.oxygen_usable;
}

// The reverse question: one steady casualty flow on every mask leg and over the margin, with
// the bag feeds and the second consumer as planned.
void set_max_steady_flow(const RouteInput& in, RoutePlan& plan) {
  double fixed_l = in.stock.second_flow.in(litres_per_minute) *
                   (plan.route_time + in.stock.margin).in(minutes);
  double mask_min = in.stock.margin.in(minutes);
  for (const LegResult& l : plan.legs) {
    if (l.leg.kind == LegKind::Bag) {
      fixed_l += (l.flow * l.leg.duration).in(litres);
    } else {
      mask_min += l.leg.duration.in(minutes);
    }
  }
  double steady = mask_min > 0.0 ? (plan.oxygen_usable.in(litres) - fixed_l) / mask_min : 0.0;
  plan.max_steady_flow = round_down_to_step(litres_per_minute(steady), in.flow_steps);
  plan.max_steady_flow_in_device_range =
      plan.max_steady_flow >= so::valid_flows(in.casualty.device).low;
}

// The cautions, then the verdict: the reason a verdict cannot be "enough" comes first.
void set_cautions_and_verdict(const RouteInput& in, bool unsure, bool contents_extrapolated,
                              RoutePlan& plan) {
  std::size_t hi = plan.highest_leg;
  plan.cautions.push_back("Highest point of the route: " + metres_text(plan.highest_altitude) +
                          " on " + leg_name(hi, plan.legs[hi].leg) + ", " +
                          format_number(plan.legs[hi].pressure.in(hectopascals), 0) + " hPa.");
  add_leg_cautions(in, plan.legs, plan);
  bool needs_more = add_casualty_caution(in, plan);
  for (std::size_t i = 0; i < plan.legs.size(); ++i) {
    if (plan.legs[i].extrapolated) {
      plan.cautions.push_back(leg_name(i, plan.legs[i].leg) +
                              ": predicted SpO2 is extrapolated beyond the field data.");
    }
  }
  plan.cautions.push_back("Flows are a " + std::string(kEstimateKind) + ".");
  set_verdict(in,
              needs_more ? "this casualty needs more than the healthy-lowlander flows"
              : unsure   ? "the flows are uncertain (extrapolated or the target unreachable)"
              : contents_extrapolated ? "a cylinder's contents are extrapolated (above 300 K)"
                                      : "",
              plan);
}

std::vector<std::string> route_assumptions(const RouteInput& in, VolumeFlow highest_flow) {
  std::vector<std::string> a = {
      "Each leg is counted at its highest point (the lowest pressure): altitude changes linearly "
      "along a leg; a flight is counted at its cruising altitude, unpressurised.",
      "Cylinders are used in the order listed, each down to the reserve of " +
          format_number(in.stock.reserve_gauge.in(bar), 1) + " bar; a swap takes no time.",
      "The safety margin of " + minutes_text(in.stock.margin.in(minutes)) +
          " is held at the route's highest flow, " + flow_text(highest_flow) +
          "; spare time is counted at that flow.",
      "The casualty's oxygen need is held constant unless SpO2 is measured again.",
      "Gauges are read at the route's start altitude; flows are free-gas litres per minute."};
  if (in.stock.second_flow > litres_per_minute(0)) {
    a.push_back((in.stock.second_who.empty() ? std::string("A second consumer") : in.stock.second_who) +
                " draws " + flow_text(in.stock.second_flow) + " from the same stock for the whole route.");
  }
  return a;
}

}  // namespace

Result<RoutePlan> plan_route(const RouteInput& in) {
  Result<double> ok = check_input(in);
  if (!ok) return ok.error();
  RoutePlan plan;
  bool unsure = false;
  Result<VolumeFlow> highest_flow = walk_legs(in, plan, unsure);
  if (!highest_flow) return highest_flow.error();
  Result<Pressure> ambient = atmosphere::pressure_at(in.legs.front().start_altitude, in.model);
  if (!ambient) return ambient.error();

  // Two plans: to arrival (the timeline the team follows) and to arrival + margin (the verdict).
  Result<evacuation::EvacuationPlan> timeline = evacuation::plan_evacuation(
      plan_input(in, plan.legs, ambient.value(), highest_flow.value(), plan.route_time));
  if (!timeline) return timeline.error();
  Result<evacuation::EvacuationPlan> verdict = evacuation::plan_evacuation(plan_input(
      in, plan.legs, ambient.value(), highest_flow.value(), plan.route_time + in.stock.margin));
  if (!verdict) return verdict.error();

  take_cylinder_plans(timeline.value(), verdict.value(), plan);
  set_max_steady_flow(in, plan);
  set_cautions_and_verdict(in, unsure, verdict->extrapolated, plan);
  plan.assumptions = route_assumptions(in, highest_flow.value());
  return plan;
}

}  // namespace firn::route
