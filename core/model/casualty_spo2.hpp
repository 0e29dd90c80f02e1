// The one verdict on a casualty's measured SpO2: compared with the band a healthy lowlander would
// show here on the oxygen actually given (room air, or a device at its flow), at this point of
// acclimatisation. Used by the CLI (`oxygenation --spo2`), the Casualty screen and the card.
// Thresholds and their sources: expected_spo2.hpp; method: docs/expected-spo2.md §4.
#pragma once

#include <optional>
#include <string>
#include <string_view>

#include "model/expected_spo2.hpp"
#include "model/result.hpp"
#include "model/supplemental_oxygen.hpp"
#include "model/units.hpp"

namespace firn::casualty_spo2 {

using units::Fraction;
using units::Pressure;
using units::VolumeFlow;

struct OxygenGiven {
  supplemental_oxygen::Device device;
  VolumeFlow flow;
};

struct Reading {
  Pressure barometric;
  // None: nobody gave the time at this altitude. The reading is then judged at both ends (on
  // arrival and after three weeks) and the less reassuring result is the verdict, so an unknown
  // time never makes a low reading look expected.
  std::optional<cascade::Acclimatisation> acclimatisation;
  std::optional<OxygenGiven> oxygen;  // none: room air
  Fraction measured;                  // 30…100 %
  // On oxygen the band uses the FiO2 the device delivers at this pressure and ventilation
  // (supplemental_oxygen::delivered_fio2_at): at rest at least the sea-level rule of thumb.
  supplemental_oxygen::Breathing breathing = supplemental_oxygen::Breathing::Rest;
};

// WMS guidelines (Luks AM et al., Wilderness Environ Med 2019/2024): with oxygen, aim for > 90 %.
inline constexpr std::string_view kWhyOxygenTarget =
    "On oxygen the aim is SpO2 above 90 % (WMS guidelines, Luks 2019/2024).";
inline constexpr std::string_view kWhyTimeNotGiven =
    "Time at this altitude not entered: the reading was judged against the band on arrival and "
    "the band after three weeks, and the less reassuring result is shown.";
inline constexpr std::string_view kWhyEndsDiffer =
    "For this reading the two differ: enter the time at this altitude for the verdict that fits "
    "this casualty.";

struct Verdict {
  expected_spo2::Assessment assessment;  // position, gap, flags, why, cautions
  expected_spo2::Band band;              // the band compared with
  Fraction fio2;                         // the FiO2 that band assumes
  bool on_oxygen = false;
  bool below_oxygen_target = false;      // on oxygen and below 90 %
  std::string headline;                  // the verdict in words, for the verdict line
  std::string action;                    // the one thing to do
  // Set only when the time at altitude was not given: the end whose band is compared with, and
  // whether the other end's verdict would lead to another action. (The two bands do not overlap
  // from 3000 to 5000 m: a newcomer's usual reading is below the three-week band.)
  std::optional<cascade::Exposure> judged_at;
  bool ends_differ = false;
};

// A bad flow (outside the device's range), pressure or reading is an error naming its range.
Result<Verdict> assess(const Reading& reading);

}  // namespace firn::casualty_spo2
