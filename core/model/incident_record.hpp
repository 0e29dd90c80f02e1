// The casualty record of one incident: timed entries (observations, oxygen changes, bag sessions,
// descent, cylinder swaps, notes) as the medic writes them over hours, and its file format
// (docs/incident-record.md). Pure data: the handover (handover.hpp) reads it.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/result.hpp"
#include "model/supplemental_oxygen.hpp"
#include "model/units.hpp"

namespace firn::record {

using units::Fraction;
using units::Length;
using units::GaugePressure;
using units::Pressure;
using units::VolumeFlow;

// Clock time as the medic's watch shows it: minutes since 1970-01-01 00:00 of that clock (no
// time zone: an incident is written and read in one place). Written "2026-12-02T14:05".
struct ClockTime {
  std::int64_t minutes = 0;
  constexpr auto operator<=>(const ClockTime&) const = default;
};
Result<ClockTime> parse_clock_time(std::string_view text);
std::string clock_text(ClockTime t);        // "2026-12-02T14:05" (the file's form)
std::string clock_hhmm(ClockTime t);        // "14:05" (what a reader scans for)
std::int64_t minutes_between(ClockTime from, ClockTime to);

enum class Kind { Observation, Oxygen, BagStart, BagEnd, Descent, Arrival, CylinderSwap, Note };
std::string_view kind_key(Kind kind);  // "observation", "oxygen", "bag_start", …
std::optional<Kind> parse_kind(std::string_view key);

// AVPU scale (common practice in first aid and pre-hospital care).
enum class Avpu { Alert, Voice, Pain, Unresponsive };
std::string_view avpu_key(Avpu avpu);   // "A", "V", "P", "U"
std::string_view avpu_words(Avpu avpu);  // "alert", "responds to voice", …

// What the casualty breathes: air, or a device at a flow.
struct Breathing {
  std::optional<supplemental_oxygen::Device> device;  // none: air
  VolumeFlow flow;                                     // 0 on air
  bool on_air() const { return !device.has_value(); }
};
std::string breathing_words(const Breathing& b);  // "air", "mask 6 L/min"

// Published diagnoses the medic may tick (the criteria themselves are judged elsewhere).
enum class Criterion { Ams, Hape, Hace };
std::string_view criterion_key(Criterion c);    // "ams", "hape", "hace"
std::string_view criterion_words(Criterion c);  // "AMS", "HAPE", "HACE"

struct Entry {
  ClockTime time;
  Kind kind = Kind::Note;
  std::optional<Length> altitude;     // where the casualty is (an observation, descent, arrival)
  std::optional<Fraction> spo2;       // observation
  std::optional<Breathing> breathing;  // observation: what it was measured on; oxygen: the new
                                       // setting (air = oxygen stopped)
  std::optional<int> heart_rate;      // beats/min
  std::optional<int> breathing_rate;  // breaths/min
  std::optional<Avpu> avpu;
  std::optional<int> lake_louise;     // 2018 Lake Louise AMS score, 0–12
  std::vector<Criterion> criteria;    // diagnoses the criteria were met for, at this time
  std::optional<GaugePressure> bag_gauge;  // bag_start: the working gauge pressure
  std::string note;
};

struct Record {
  std::string incident;  // a label, e.g. "Demo — Grey Cirque callout"; never a casualty's name
  std::string casualty;  // e.g. "Casualty 1"
  std::vector<Entry> entries;  // in time order (parse_record sorts; equal times keep file order)
};

// Limits of the file (published once; the reader and the screens use them).
inline constexpr int kSchemaVersion = 1;
inline constexpr size_t kMaxEntries = 2000;
inline constexpr size_t kMaxNoteChars = 500;
inline constexpr size_t kMaxLabelChars = 80;
// The site altitudes and bag gauge pressures of the models that own them.
inline constexpr double kMinAltitudeM = atmosphere::kSiteAltitudeRange.low_in_unit();
inline constexpr double kMaxAltitudeM = atmosphere::kSiteAltitudeRange.high_in_unit();
inline constexpr double kMinSpo2Pct = expected_spo2::kMeasuredSpo2Range.low;
inline constexpr double kMaxSpo2Pct = expected_spo2::kMeasuredSpo2Range.high;
inline constexpr int kMinHeartRate = 20, kMaxHeartRate = 250;
inline constexpr int kMinBreathingRate = 2, kMaxBreathingRate = 80;
inline constexpr double kMaxBagGaugeMbar = hyperbaric_bag::max_gauge_mbar;

// Reads a record file; every problem is named with its path ("entries[3].spo2: …") and the
// valid range, all of them joined in the Error.
Result<Record> parse_record(std::string_view json_text);
// JSON text that parse_record reads back to the same record.
std::string write_record(const Record& record);

}  // namespace firn::record
