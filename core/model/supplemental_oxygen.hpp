// Supplemental oxygen: FiO2 from a delivery device and its flow, the SpO2 a healthy lowlander is
// predicted to reach with it at this pressure (via the cascade and the expected-SpO2 band), and
// the lowest flow predicted to reach a target SpO2.
#pragma once

#include <string_view>

#include "model/expected_spo2.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::supplemental_oxygen {

using cascade::Exposure;
using units::Fraction;
using units::Pressure;
using units::VolumeFlow;

// Rules of thumb, common practice (sea-level figures):
//   nasal cannula   0.5–6 L/min:  FiO2 ≈ 0.21 + 0.04 per L/min  (6 L/min → ~0.45)
//   simple mask     5–10 L/min:   0.35 → 0.55, linear           (below 5 L/min CO2 is rebreathed)
//   non-rebreather  10–15 L/min:  0.60 → 0.90, linear           (reservoir bag must stay full)
enum class Device { NasalCannula, SimpleMask, NonRebreather };
std::string_view device_key(Device device);   // "cannula", "mask", "non-rebreather"
std::string_view device_name(Device device);  // "nasal cannula", ...
Result<Device> parse_device(std::string_view key);

struct FlowRange {
  VolumeFlow low, high;
};
FlowRange valid_flows(Device device);

// Flow outside the device's range is an error naming the range in L/min.
Result<Fraction> delivered_fio2(Device device, VolumeFlow flow);

struct Prediction {
  Fraction fio2;
  expected_spo2::Band spo2;  // healthy-lowlander band with this FiO2
  bool extrapolated = false;
};
Result<Prediction> predict(Pressure barometric, Exposure exposure, Device device, VolumeFlow flow);

// WMS guidelines (Luks AM et al., Wilderness Environ Med 2019): target SpO2 > 90 % with oxygen.
inline constexpr double kDefaultTargetPercent = 90.0;

struct FlowForTarget {
  bool reachable = false;
  bool reached_on_air = false;  // the band's low edge is at the target without oxygen
  VolumeFlow flow;              // lowest flow, rounded up to 0.5 L/min (device maximum if not
                                // reachable)
  Prediction at_flow;           // what that flow is predicted to give
};

// Lowest flow with which even the LOW edge of the healthy band reaches the target (valid target
// 80…99 %). A casualty with HAPE has an extra gradient the band does not know: titrate to the
// oximeter.
Result<FlowForTarget> lowest_flow_for_target(
    Pressure barometric, Exposure exposure, Device device,
    Fraction target = units::percent(kDefaultTargetPercent));

// Shown with every oxygen result.
inline constexpr std::string_view kRuleOfThumbNote =
    "Device FiO2 values are rules of thumb (common practice) measured at sea level; at altitude a "
    "casualty breathes larger volumes of thinner air, so the real FiO2 may be lower. Titrate to "
    "the measured SpO2.";

}  // namespace firn::supplemental_oxygen
