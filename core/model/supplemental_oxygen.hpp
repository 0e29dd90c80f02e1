// Supplemental oxygen: FiO2 from a delivery device and its flow, the SpO2 a healthy lowlander is
// predicted to reach with it at this pressure (via the cascade and the expected-SpO2 band), and
// the lowest flow predicted to reach a target SpO2.
#pragma once

#include <string_view>

#include "model/expected_spo2.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::supplemental_oxygen {

using cascade::Acclimatisation;
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
// The same as a range for checks and messages ("oxygen flow for a simple face mask").
units::Range<units::VolumeFlowDimension> flow_range(Device device);

// Flow outside the device's range is an error naming the range in L/min. The sea-level rule of
// thumb above (a resting adult).
Result<Fraction> delivered_fio2(Device device, VolumeFlow flow);

// [FiO2 at altitude] A flowmeter meters free gas: the litres it passes are sea-level litres
// (a fixed orifice passes a fixed mass; a rotameter read at altitude reads low, so it passes at
// least as much), and they expand by P0/P in the thinner air. The casualty inhales VE litres of
// ambient gas a minute. The oxygen above air that the device adds is therefore
//   FiO2 − 0.2095 = (rule(flow) − 0.21) · (P0/P) · (VE at sea level / VE here),
// the sea-level rule's excess scaled by the expansion and the dilution in this casualty's
// ventilation; never above the device's highest rule-of-thumb FiO2 (leaks and entrainment limit
// it) nor below air. At rest the expansion wins (same or higher FiO2 than at sea level); only a
// high minute ventilation lowers it. Method and figures: docs/expected-spo2.md §7.
enum class Breathing { Rest, Distress };
std::string_view breathing_key(Breathing breathing);  // "rest", "distress"
Result<Breathing> parse_breathing(std::string_view key);
// Resting VCO2 0.20 L/min STPD (from memory, domain brief §5); anatomical dead-space ventilation
// 2 L/min (0.15 L × 13 breaths/min, physiology texts, from memory); a casualty in respiratory
// distress breathes about three times the resting volume (from memory: 20–30 L/min).
inline constexpr double kRestingVco2Lpm = 0.20;
inline constexpr double kDeadSpaceVentilationLpm = 2.0;
inline constexpr double kDistressVentilationFactor = 3.0;
// VE = VA + dead space; VA (BTPS, at the local pressure) = 0.863 · VCO2 (mL/min STPD) / PaCO2
// (the alveolar ventilation equation, physiology texts). PaCO2 valid 5…80 mmHg.
Result<VolumeFlow> minute_ventilation(Pressure paco2, Breathing breathing);

struct DeliveredFio2 {
  Fraction fio2;             // at this pressure and ventilation
  Fraction sea_level_rule;   // delivered_fio2(): the rule of thumb
  VolumeFlow ventilation;    // VE here (the resting figure uses the expected PaCO2 on air)
  double expansion = 1.0;    // P0/P
  // The lower of the two: flows for a target are planned with it (more flow, never less).
  Fraction for_planning() const { return fio2 < sea_level_rule ? fio2 : sea_level_rule; }
};
Result<DeliveredFio2> delivered_fio2_at(Device device, VolumeFlow flow, Pressure barometric,
                                        Acclimatisation acclimatisation, Breathing breathing);

struct Prediction {
  Fraction fio2;
  expected_spo2::Band spo2;  // healthy-lowlander band with this FiO2
  bool extrapolated = false;
};
Result<Prediction> predict(Pressure barometric, Exposure exposure, Device device, VolumeFlow flow);
Result<Prediction> predict(Pressure barometric, Acclimatisation acclimatisation, Device device,
                           VolumeFlow flow);
// With the planning FiO2 of delivered_fio2_at (the lower of the rule and the altitude estimate).
Result<Prediction> predict(Pressure barometric, Acclimatisation acclimatisation, Device device,
                           VolumeFlow flow, Breathing breathing);

// WMS guidelines (Luks AM et al., Wilderness Environ Med 2019): target SpO2 > 90 % with oxygen.
inline constexpr double kDefaultTargetPercent = 90.0;
inline constexpr units::NumberRange kTargetSpo2Range{80.0, 99.0, "%", "target SpO2"};

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
Result<FlowForTarget> lowest_flow_for_target(
    Pressure barometric, Acclimatisation acclimatisation, Device device,
    Fraction target = units::percent(kDefaultTargetPercent));
// The same with the planning FiO2 for this breathing (see delivered_fio2_at).
Result<FlowForTarget> lowest_flow_for_target(Pressure barometric, Acclimatisation acclimatisation,
                                             Device device, Fraction target, Breathing breathing);

// Flowmeters step in 0.5 L/min (common practice): flows for a target are rounded up to a step.
inline constexpr double kFlowmeterStepLpm = 0.5;

// Shown with every oxygen result.
inline constexpr std::string_view kRuleOfThumbNote =
    "Device FiO2 values are sea-level rules of thumb (common practice). At altitude the flowmeter's "
    "litres expand by P0/P, so at rest a setting gives the same or a higher FiO2 than at sea level; "
    "only fast, deep breathing (distress) lowers it. Flows for a target use the lower figure. "
    "Titrate to the measured SpO2.";

}  // namespace firn::supplemental_oxygen
