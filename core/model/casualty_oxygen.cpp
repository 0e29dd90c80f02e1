#include "model/casualty_oxygen.hpp"

#include <algorithm>
#include <cmath>

#include "model/dissociation.hpp"

namespace firn::casualty_oxygen {
namespace {

using namespace units;

double content(Fraction saturation, Pressure po2) {
  return kHufnerMlPerG * kHaemoglobinGdl * saturation.in(fraction) +
         kDissolvedMlDlPerMmhg * po2.in(mmhg);
}

// The healthy middle path at this FiO2 and its dissociation curve (the one its SaO2 came from).
struct Path {
  Pressure arterial;
  dissociation::Curve curve;
  bool extrapolated;
};

Result<Path> healthy_middle(const Casualty& c, Fraction fio2) {
  Result<expected_spo2::Expectation> e = expected_spo2::expected(c.barometric, c.acclimatisation, fio2);
  if (!e) return e.error();
  const cascade::CascadePath& mid = e->cascade.middle;
  dissociation::CurveShift shift;
  shift.ph = mid.acid_base.ph;
  shift.base_excess_mmol_l = mid.acid_base.base_excess_mmol_l;
  shift.p50 = expected_spo2::field_p50(c.acclimatisation);
  Result<dissociation::Curve> curve = dissociation::make_curve(shift);
  if (!curve) return curve.error();
  return Path{mid.arterial, curve.value(), e->extrapolated};
}

// The saturation whose content (with its own dissolved O2) is `target_ml_dl`, on this curve.
Fraction saturation_for_content(const dissociation::Curve& curve, double target_ml_dl) {
  double lo = 0.5, hi = 1000.0;
  if (content(curve.saturation(mmhg(lo)), mmhg(lo)) >= target_ml_dl) return curve.saturation(mmhg(lo));
  for (int i = 0; i < 60; ++i) {
    double mid = (lo + hi) / 2.0;
    (content(curve.saturation(mmhg(mid)), mmhg(mid)) < target_ml_dl ? lo : hi) = mid;
  }
  return curve.saturation(mmhg(lo));
}

Result<Fraction> predicted_at(const Casualty& c, double shunt, Fraction fio2) {
  Result<Path> p = healthy_middle(c, fio2);
  if (!p) return p.error();
  double capillary = content(p->curve.saturation(p->arterial), p->arterial);
  // Ca = Cc − s·(a−v)/(1 − s): the shunt equation with Cv = Ca − (a−v).
  double arterial = capillary - shunt * kArterioVenousMlDl / (1.0 - shunt);
  return saturation_for_content(p->curve, arterial);
}

Result<Fraction> planning_fio2(const Casualty& c, Device device, VolumeFlow flow) {
  Result<supplemental_oxygen::DeliveredFio2> d = supplemental_oxygen::delivered_fio2_at(
      device, flow, c.barometric, c.acclimatisation, c.breathing);
  if (!d) return d.error();
  return d->for_planning();
}

}  // namespace

Result<Shunt> virtual_shunt(const Casualty& c) {
  if (auto s = units::check("SpO2 measured on air", c.spo2_on_air.in(percent),
                            expected_spo2::kMeasuredSpo2Range); !s) {
    return s.error();
  }
  Result<Path> air = healthy_middle(c, cascade::dry_air_fio2());
  if (!air) return air.error();
  double capillary = content(air->curve.saturation(air->arterial), air->arterial);
  double measured = content(c.spo2_on_air, air->curve.po2_for(c.spo2_on_air));
  Shunt s;
  s.extrapolated = air->extrapolated;
  if (measured < capillary) {
    double gap = capillary - measured;
    s.fraction = std::min(gap / (gap + kArterioVenousMlDl), kShuntCeiling);
  }
  return s;
}

Result<Fraction> predicted_spo2(const Casualty& c, Device device, VolumeFlow flow) {
  Result<Shunt> s = virtual_shunt(c);
  if (!s) return s.error();
  Result<Fraction> fio2 = planning_fio2(c, device, flow);
  if (!fio2) return fio2.error();
  return predicted_at(c, s->fraction, fio2.value());
}

Result<CasualtyFlow> lowest_flow(const Casualty& c, Device device, Fraction target) {
  if (auto t = units::check(target.in(percent), supplemental_oxygen::kTargetSpo2Range); !t) {
    return t.error();
  }
  Result<Shunt> s = virtual_shunt(c);
  if (!s) return s.error();
  CasualtyFlow out;
  out.shunt = s.value();
  out.reached_on_air = c.spo2_on_air >= target;
  supplemental_oxygen::FlowRange range = supplemental_oxygen::valid_flows(device);
  const double step = supplemental_oxygen::kFlowmeterStepLpm;
  double low = range.low.in(litres_per_minute), high = range.high.in(litres_per_minute);
  std::optional<size_t> first;
  for (double lpm = std::ceil(low / step - 1e-9) * step; lpm <= high + 1e-9; lpm += step) {
    Result<Fraction> fio2 = planning_fio2(c, device, litres_per_minute(lpm));
    if (!fio2) return fio2.error();
    Result<Fraction> spo2 = predicted_at(c, s->fraction, fio2.value());
    if (!spo2) return spo2.error();
    out.by_flow.push_back({litres_per_minute(lpm), spo2.value()});
    if (!first && spo2.value() >= target) first = out.by_flow.size() - 1;
  }
  FIRN_ASSERT(!out.by_flow.empty(), "a device range holds at least one flowmeter step");
  const FlowPoint& chosen = first ? out.by_flow[*first] : out.by_flow.back();
  out.reachable = first.has_value();
  out.flow = chosen.flow;
  out.predicted = chosen.spo2;
  // Never less than the healthy band's low edge needs (lowest_flow_for_target).
  Result<supplemental_oxygen::FlowForTarget> healthy = supplemental_oxygen::lowest_flow_for_target(
      c.barometric, c.acclimatisation, device, target, c.breathing);
  if (!healthy) return healthy.error();
  if (out.reachable && healthy->flow > out.flow) {
    out.reachable = healthy->reachable;
    out.flow = healthy->flow;
    for (const FlowPoint& p : out.by_flow) {
      if (std::fabs(p.flow.in(litres_per_minute) - out.flow.in(litres_per_minute)) < 1e-9) out.predicted = p.spo2;
    }
  }
  return out;
}

}  // namespace firn::casualty_oxygen
