// The handover: what the receiving crew (helicopter, hospital) needs from a casualty record in
// one read — the course of SpO2 and on what, oxygen and bag given with times, criteria met, the
// latest observations, the cautions — as plain text (radio, message) and as a one-page printable
// record (A4 or A5). One document for the native app, the page and the CLI.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/expected_spo2.hpp"
#include "model/incident_record.hpp"

namespace firn::handover {

using record::Breathing;
using record::ClockTime;

struct Spo2Reading {
  ClockTime time;
  units::Fraction spo2;
  std::optional<Breathing> on;           // what it was measured on (unknown if not written)
  std::optional<units::Length> altitude;  // where (the latest altitude written before it)
  // On air with a known altitude: the healthy-lowlander band there for a newly arrived climber
  // (acute preset, the lower of the two presets: docs/expected-spo2.md). Absent otherwise.
  std::optional<expected_spo2::Band> band_on_air;
  bool band_extrapolated = false;
};

struct OxygenPeriod {
  ClockTime from;
  std::optional<ClockTime> to;  // absent: still running at the last entry
  Breathing setting;            // never air
};

struct BagSession {
  ClockTime start;
  std::optional<ClockTime> end;  // absent: still in the bag at the last entry
  std::optional<units::GaugePressure> gauge;
};

struct Summary {
  int entries = 0;
  std::optional<ClockTime> first_time, last_time;
  std::optional<Spo2Reading> first_spo2, latest_spo2, lowest_spo2;
  std::vector<OxygenPeriod> oxygen;
  std::vector<BagSession> bag_sessions;
  std::vector<record::Criterion> criteria_met;  // ever ticked, in the order first ticked
  std::optional<units::Length> highest_altitude, current_altitude;
  std::optional<int> latest_heart_rate, latest_breathing_rate, latest_lake_louise;
  std::optional<record::Avpu> latest_avpu;
  int cylinder_swaps = 0;
  std::optional<Breathing> current_breathing;  // the last oxygen setting (or air)
};

// Walks the record once in time order.
Summary summarise(const record::Record& record);

enum class Units { Metric, Us };  // metric: m, hPa, bar; US: ft, mmHg… and psi (gauge)
Result<Units> parse_units(std::string_view key);  // "metric" | "us"

// Plain words, one read: a few short lines, then the cautions.
std::string summary_text(const record::Record& record, const Summary& summary, Units units);

enum class Page { A4, A5 };
Result<Page> parse_page(std::string_view key);  // "a4" | "a5"
// One self-contained HTML page (no scripts, no external resources), print-ready.
std::string render_html(const record::Record& record, const Summary& summary, Units units,
                        Page page);

}  // namespace firn::handover
