#include "model/supplemental_oxygen.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <string>

#include "model/atmosphere.hpp"

namespace firn::supplemental_oxygen {
namespace {

using namespace units;

struct DeviceRule {
  double low_lpm, high_lpm;
  double fio2_at_low, fio2_per_lpm;
};

DeviceRule rule(Device device) {
  switch (device) {
    case Device::NasalCannula: return {0.5, 6.0, 0.21 + 0.04 * 0.5, 0.04};
    case Device::SimpleMask: return {5.0, 10.0, 0.35, (0.55 - 0.35) / 5.0};
    case Device::NonRebreather: return {10.0, 15.0, 0.60, (0.90 - 0.60) / 5.0};
  }
  return {0.5, 6.0, 0.23, 0.04};
}

double fio2_at(Device device, double lpm) {
  DeviceRule r = rule(device);
  return r.fio2_at_low + r.fio2_per_lpm * (lpm - r.low_lpm);
}

}  // namespace

// ISA sea-level pressure (ICAO standard atmosphere): where the rules of thumb were measured.
constexpr double kSeaLevelHpa = 1013.25;

Result<FlowForTarget> flow_for_target(Pressure barometric, Acclimatisation exposure, Device device,
                                      Fraction target, std::optional<Breathing> breathing);

std::string_view device_key(Device device) {
  switch (device) {
    case Device::NasalCannula: return "cannula";
    case Device::SimpleMask: return "mask";
    case Device::NonRebreather: return "non-rebreather";
  }
  return "cannula";
}

std::string_view device_name(Device device) {
  switch (device) {
    case Device::NasalCannula: return "nasal cannula";
    case Device::SimpleMask: return "simple face mask";
    case Device::NonRebreather: return "non-rebreather mask";
  }
  return "nasal cannula";
}

Result<Device> parse_device(std::string_view key) {
  for (Device d : {Device::NasalCannula, Device::SimpleMask, Device::NonRebreather}) {
    if (key == device_key(d)) return d;
  }
  return Error{"unknown oxygen device '" + std::string(key) +
               "': use cannula, mask or non-rebreather"};
}

FlowRange valid_flows(Device device) {
  DeviceRule r = rule(device);
  return {litres_per_minute(r.low_lpm), litres_per_minute(r.high_lpm)};
}

units::Range<units::VolumeFlowDimension> flow_range(Device device) {
  static const std::array<std::string, 3> what = [] {
    std::array<std::string, 3> w;
    for (Device d : {Device::NasalCannula, Device::SimpleMask, Device::NonRebreather}) {
      w[static_cast<size_t>(d)] = "oxygen flow for a " + std::string(device_name(d));
    }
    return w;
  }();
  FlowRange r = valid_flows(device);
  return {r.low, r.high, &litres_per_minute, what[static_cast<size_t>(device)]};
}

Result<Fraction> delivered_fio2(Device device, VolumeFlow flow) {
  if (auto f = units::check(flow, flow_range(device)); !f) return f.error();
  return fraction(fio2_at(device, flow.in(litres_per_minute)));
}

std::string_view breathing_key(Breathing breathing) {
  return breathing == Breathing::Rest ? "rest" : "distress";
}

Result<Breathing> parse_breathing(std::string_view key) {
  if (key == "rest") return Breathing::Rest;
  if (key == "distress") return Breathing::Distress;
  return Error{"unknown breathing '" + std::string(key) + "': use rest or distress"};
}

Result<VolumeFlow> minute_ventilation(Pressure paco2, Breathing breathing) {
  double p = paco2.in(mmhg);
  if (!in_range(p, 5.0, 80.0)) return range_error("PaCO2", 5, 80, "mmHg", p);
  double alveolar = 0.863 * kRestingVco2Lpm * 1000.0 / p;
  double rest = alveolar + kDeadSpaceVentilationLpm;
  return litres_per_minute(breathing == Breathing::Rest ? rest : rest * kDistressVentilationFactor);
}

Result<DeliveredFio2> delivered_fio2_at(Device device, VolumeFlow flow, Pressure barometric,
                                        Acclimatisation acclimatisation, Breathing breathing) {
  Result<Fraction> rule_fio2 = delivered_fio2(device, flow);
  if (!rule_fio2) return rule_fio2.error();
  Result<Pressure> pio2 = cascade::inspired_po2(barometric, cascade::dry_air_fio2());
  if (!pio2) return pio2.error();
  // Ventilation is driven by the hypoxia of breathing air here (PaCO2 expected on air): with
  // oxygen it falls a little, which would raise FiO2, so this errs low.
  Result<cascade::Paco2Estimate> paco2 = cascade::expected_paco2(
      pio2->in(mmhg) < 35.0 ? mmhg(35.0) : pio2.value(), acclimatisation);
  if (!paco2) return paco2.error();
  Result<VolumeFlow> here = minute_ventilation(paco2->paco2.mid, breathing);
  if (!here) return here.error();
  VolumeFlow sea_level = minute_ventilation(mmhg(40.0), Breathing::Rest).value();
  double expansion = kSeaLevelHpa / barometric.in(hectopascals);
  double excess = (rule_fio2->in(fraction) - 0.21) * expansion *
                  (sea_level.in(litres_per_minute) / here->in(litres_per_minute));
  double ceiling = fio2_at(device, rule(device).high_lpm);
  double fio2 = std::clamp(cascade::kDryAirFio2 + excess, cascade::kDryAirFio2, ceiling);
  return DeliveredFio2{fraction(fio2), rule_fio2.value(), here.value(), expansion};
}

Result<Prediction> predict(Pressure barometric, Exposure exposure, Device device,
                           VolumeFlow flow) {
  return predict(barometric, cascade::acclimatisation_of(exposure), device, flow);
}

Result<Prediction> predict(Pressure barometric, Acclimatisation exposure, Device device,
                           VolumeFlow flow, Breathing breathing) {
  Result<DeliveredFio2> fio2 = delivered_fio2_at(device, flow, barometric, exposure, breathing);
  if (!fio2) return fio2.error();
  Result<expected_spo2::Expectation> e =
      expected_spo2::expected(barometric, exposure, fio2->for_planning());
  if (!e) return e.error();
  return Prediction{fio2->for_planning(), e->band, e->extrapolated};
}

Result<Prediction> predict(Pressure barometric, Acclimatisation exposure, Device device,
                           VolumeFlow flow) {
  Result<Fraction> fio2 = delivered_fio2(device, flow);
  if (!fio2) return fio2.error();
  Result<expected_spo2::Expectation> e = expected_spo2::expected(barometric, exposure, fio2.value());
  if (!e) return e.error();
  return Prediction{fio2.value(), e->band, e->extrapolated};
}

Result<FlowForTarget> lowest_flow_for_target(Pressure barometric, Exposure exposure, Device device,
                                             Fraction target) {
  return lowest_flow_for_target(barometric, cascade::acclimatisation_of(exposure), device, target);
}

Result<FlowForTarget> lowest_flow_for_target(Pressure barometric, Acclimatisation exposure,
                                             Device device, Fraction target) {
  return flow_for_target(barometric, exposure, device, target, std::nullopt);
}

Result<FlowForTarget> lowest_flow_for_target(Pressure barometric, Acclimatisation exposure,
                                             Device device, Fraction target, Breathing breathing) {
  return flow_for_target(barometric, exposure, device, target, breathing);
}

// Without a breathing: the sea-level rule of thumb (the figure before altitude FiO2 existed).
Result<FlowForTarget> flow_for_target(Pressure barometric, Acclimatisation exposure, Device device,
                                      Fraction target, std::optional<Breathing> breathing) {
  if (auto t = units::check(target.in(percent), kTargetSpo2Range); !t) return t.error();
  FlowRange range = valid_flows(device);
  auto low_edge = [&](VolumeFlow flow) -> Result<Prediction> {
    return breathing ? predict(barometric, exposure, device, flow, *breathing)
                     : predict(barometric, exposure, device, flow);
  };
  FlowForTarget result;
  Result<expected_spo2::Expectation> on_air = expected_spo2::expected(barometric, exposure);
  if (!on_air) return on_air.error();
  result.reached_on_air = on_air->band.low >= target;

  Result<Prediction> at_max = low_edge(range.high);
  if (!at_max) return at_max.error();
  if (at_max->spo2.low < target) {
    result.flow = range.high;
    result.at_flow = at_max.value();
    return result;  // not reachable with this device
  }
  // SpO2 rises with flow: bisect for the lowest flow whose low edge reaches the target.
  double lo = range.low.in(litres_per_minute), hi = range.high.in(litres_per_minute);
  Result<Prediction> at_min = low_edge(range.low);
  if (!at_min) return at_min.error();
  if (at_min->spo2.low < target) {
    for (int i = 0; i < 40; ++i) {
      double mid = (lo + hi) / 2.0;
      Result<Prediction> p = low_edge(litres_per_minute(mid));
      if (!p) return p.error();
      (p->spo2.low >= target ? hi : lo) = mid;
    }
    lo = hi;
  }
  // Flowmeters step in 0.5 L/min: round up, staying inside the device range.
  double stepped = std::min(std::ceil(lo / kFlowmeterStepLpm - 1e-9) * kFlowmeterStepLpm,
                            range.high.in(litres_per_minute));
  Result<Prediction> final_prediction = low_edge(litres_per_minute(stepped));
  if (!final_prediction) return final_prediction.error();
  result.reachable = true;
  result.flow = litres_per_minute(stepped);
  result.at_flow = final_prediction.value();
  return result;
}

}  // namespace firn::supplemental_oxygen
