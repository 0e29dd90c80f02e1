// Oxygen for this casualty, not for a healthy one: from the SpO2 measured on air here, the
// casualty's extra gas-exchange impairment as a virtual shunt fraction (the iso-shunt method:
// Benatar SR, Hewlett AM & Nunn JF, "The use of iso-shunt lines for control of oxygen therapy",
// Br J Anaesth 1973;45:711–718), then the SpO2 predicted on each device and flow, and the lowest
// flow for the target. Ventilation–perfusion mismatch (much of HAPE) responds to oxygen better
// than true shunt, so a shunt model asks for more oxygen, not less. An estimate: titrate to the
// oximeter. Method and limits: docs/expected-spo2.md §8.
#pragma once

#include <string_view>
#include <vector>

#include "model/expected_spo2.hpp"
#include "model/result.hpp"
#include "model/supplemental_oxygen.hpp"
#include "model/units.hpp"

namespace firn::casualty_oxygen {

using supplemental_oxygen::Breathing;
using supplemental_oxygen::Device;
using units::Fraction;
using units::Pressure;
using units::VolumeFlow;

// The iso-shunt diagram's assumptions (Benatar 1973, from memory): haemoglobin 14 g/dL and an
// arterio-venous O2 content difference of 5 mL/dL. O2 content = 1.34·Hb·SO2 + 0.003·PO2
// (physiology texts).
inline constexpr double kHaemoglobinGdl = 14.0;
inline constexpr double kArterioVenousMlDl = 5.0;
inline constexpr double kHufnerMlPerG = 1.34;
inline constexpr double kDissolvedMlDlPerMmhg = 0.003;
inline constexpr double kShuntCeiling = 0.6;  // beyond any casualty who can still be carried

inline constexpr std::string_view kEstimateNote =
    "Estimate for this casualty from the SpO2 on air (virtual shunt, iso-shunt method: Benatar, "
    "Hewlett & Nunn, Br J Anaesth 1973): titrate to the oximeter.";

struct Casualty {
  Pressure barometric;
  cascade::Acclimatisation acclimatisation;
  Fraction spo2_on_air;  // 30…100 %, measured at rest on room air here
  Breathing breathing = Breathing::Rest;
  bool operator==(const Casualty&) const = default;
};

struct Shunt {
  double fraction = 0.0;       // 0 when the reading is at or above the healthy middle
  bool extrapolated = false;   // the healthy band here is extrapolated
};
Result<Shunt> virtual_shunt(const Casualty& casualty);

// SpO2 predicted for this casualty on a device at a flow (planning FiO2, see supplemental_oxygen).
Result<Fraction> predicted_spo2(const Casualty& casualty, Device device, VolumeFlow flow);

struct FlowPoint {
  VolumeFlow flow;
  Fraction spo2;
};

struct CasualtyFlow {
  Shunt shunt;
  bool reached_on_air = false;     // the reading is already at the target
  bool reachable = false;
  VolumeFlow flow;                 // lowest flowmeter step reaching the target (device maximum if
                                   // not reachable); never below the healthy band's own figure
  Fraction predicted;              // SpO2 predicted at that flow
  std::vector<FlowPoint> by_flow;  // every flowmeter step of the device
};
// Target valid 80…99 % (WMS: > 90 %).
Result<CasualtyFlow> lowest_flow(const Casualty& casualty, Device device,
                                 Fraction target = units::percent(supplemental_oxygen::kDefaultTargetPercent));

}  // namespace firn::casualty_oxygen
