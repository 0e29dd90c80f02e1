#include "model/supplemental_oxygen.hpp"

#include <cmath>
#include <string>

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

Result<Fraction> delivered_fio2(Device device, VolumeFlow flow) {
  DeviceRule r = rule(device);
  double lpm = flow.in(litres_per_minute);
  if (!in_range(lpm, r.low_lpm, r.high_lpm)) {
    return range_error("oxygen flow for a " + std::string(device_name(device)), r.low_lpm,
                       r.high_lpm, "L/min", lpm);
  }
  return fraction(fio2_at(device, lpm));
}

Result<Prediction> predict(Pressure barometric, Exposure exposure, Device device,
                           VolumeFlow flow) {
  Result<Fraction> fio2 = delivered_fio2(device, flow);
  if (!fio2) return fio2.error();
  Result<expected_spo2::Expectation> e = expected_spo2::expected(barometric, exposure, fio2.value());
  if (!e) return e.error();
  return Prediction{fio2.value(), e->band, e->extrapolated};
}

Result<FlowForTarget> lowest_flow_for_target(Pressure barometric, Exposure exposure, Device device,
                                             Fraction target) {
  double target_pct = target.in(percent);
  if (!in_range(target_pct, 80.0, 99.0)) {
    return range_error("target SpO2", 80, 99, "%", target_pct);
  }
  FlowRange range = valid_flows(device);
  auto low_edge = [&](VolumeFlow flow) -> Result<Prediction> {
    return predict(barometric, exposure, device, flow);
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
  double stepped = std::min(std::ceil(lo * 2.0 - 1e-9) / 2.0, range.high.in(litres_per_minute));
  Result<Prediction> final_prediction = low_edge(litres_per_minute(stepped));
  if (!final_prediction) return final_prediction.error();
  result.reachable = true;
  result.flow = litres_per_minute(stepped);
  result.at_flow = final_prediction.value();
  return result;
}

}  // namespace firn::supplemental_oxygen
