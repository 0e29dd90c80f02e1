// The printed cards: the team's figures computed from its profile with the same model functions
// the app and the CLI call, laid out as print-ready HTML and as CSV tables.
//   - the pocket card: ONE sheet, two sides (A6), or at most two double-sided wallet cards: the
//     figures a medic needs at the casualty;
//   - the team reference sheet (A4, for the vehicle or hut): the full tables behind the card,
//     oxygen by altitude band and how long each cylinder type lasts at each flow.
// A card needs no battery, so it must never show a number a model would refuse (a cell outside
// a model's range says so in words), and an extrapolated figure is marked and gives no verdict.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/expected_spo2.hpp"
#include "model/supplemental_oxygen.hpp"
#include "profile/team_profile.hpp"
#include "model/units.hpp"

namespace firn::pocket_card {

using units::Duration;
using units::Length;
using units::GaugePressure;
using units::Pressure;
using units::VolumeFlow;

enum class Size {
  A6,         // 105 × 148 mm, one sheet printed on both sides (2 pages)
  Wallet,     // 85.6 × 54 mm (ISO/IEC 7810 ID-1, the credit-card size): two double-sided cards
  Reference,  // A4 portrait, the team reference sheet (not folded, not carried)
};
Result<Size> parse_size(std::string_view key);  // "a6", "wallet", "reference"
std::string_view size_key(Size size);

// [SECTION] The figures (what the tests compare with the model functions). Each table is made by
// one function in pocket_card.cpp that calls its model once per cell: swap the call there.

struct AltitudeRow {
  Length altitude;
  std::optional<Pressure> pb_west, pb_isa;  // nullopt: outside that model's range
  std::optional<Pressure> pio2;             // dry air, profile's atmosphere model
  std::optional<expected_spo2::Band> spo2_acute, spo2_acclimatised;
  bool spo2_acute_extrapolated = false;     // beyond the published field data: no verdict
  bool spo2_acclimatised_extrapolated = false;
  bool spo2_extrapolated = false;           // either of the two
  // Bag at the team's gauge pressure, profile's atmosphere model both ways.
  std::optional<Pressure> bag_inside;
  std::optional<Length> bag_equivalent;     // nullopt with bag_inside set: above sea-level PB
  std::optional<VolumeFlow> bag_min_flush;  // fresh air for the CO2 limit (chamber pressure)
  std::optional<double> bag_min_flush_strokes;  // pump strokes per minute for that flush
};

struct DurationCell {
  std::optional<Duration> full, half;  // to the reserve; nullopt: the model refused (see text)
  std::string full_note, half_note;    // why a cell is empty
};

struct DurationRow {
  std::string label;
  units::Volume water_capacity;
  GaugePressure fill_gauge;
  int count = 0;
  std::vector<DurationCell> by_flow;  // one per profile flow
};

// The lowest flow for SpO2 > 90 % in one altitude band, per device, computed at the band's TOP
// (the higher altitude needs more oxygen) for the healthy-lowlander band, acute exposure (the
// one needing more flow). A casualty needs more: the card says to titrate.
struct FlowNeedRow {
  Length band_low, band_high;
  std::vector<std::optional<supplemental_oxygen::FlowForTarget>> by_device;  // nullopt: refused
};

// A table as printed: column headings and cell texts (the CSV holds the same texts). A cell that
// ends in extrapolated_mark is extrapolated (printed in italics, explained in a footnote).
struct Table {
  std::string id;     // "altitude", "bag", "cylinders", "oxygen" (CSV file name)
  std::string title;
  std::vector<std::string> header;
  std::vector<std::vector<std::string>> rows;
  std::vector<std::string> footnotes;     // the reference sheet's notes
  std::vector<std::string> pocket_notes;  // the same, shortened for the pocket card's side
};

struct Card {
  team_profile::TeamProfile profile;
  std::string date;     // as given ("2025-01-31")
  std::string version;  // FIRN_VERSION
  std::vector<AltitudeRow> altitudes;
  std::vector<DurationRow> durations;
  std::vector<FlowNeedRow> flow_needs;
  std::vector<Table> tables;  // altitude, bag, cylinders, oxygen
  std::vector<std::string> assumptions;
  // Words printed on the card that several pages share (definitions, not figures).
  std::string exposure_definitions, exposure_definitions_short;
};

// Builds every figure from the profile. `date` is printed as given (the CLI passes today's).
Card build_card(const team_profile::TeamProfile& profile, const std::string& date);

const Table& table(const Card& card, std::string_view id);  // FIRN_ASSERT: the id exists

// Cell texts (shared by HTML and CSV, and by tests that compare the two).
inline constexpr const char* out_of_range_text = "out of range";
inline constexpr const char* extrapolated_mark = "*";

// [SECTION] Output.

// One self-contained HTML document (inline CSS, no scripts, no external resources), paginated
// with CSS @page for `size`. Every page is a <section class="page">; nothing may overflow a
// page (the PDF test checks the page count equals the number of sections). The pocket card is
// always 2 pages (A6) or 4 (wallet): rows beyond what a side holds are thinned evenly (the
// reference sheet has them all).
std::string render_html(const Card& card, Size size);
int page_count(const Card& card, Size size);  // number of <section class="page"> in render_html

// RFC 4180 CSV (CRLF line ends, fields quoted when needed) of one table.
std::string table_csv(const Table& table);

}  // namespace firn::pocket_card
