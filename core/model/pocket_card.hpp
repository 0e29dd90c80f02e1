// The printed pocket card: the team's figures computed from its profile with the same model
// functions the app uses, laid out as print-ready HTML (A6 or credit-card "wallet" pages) and as
// CSV tables. A card needs no battery, so it must never show a number a model would refuse:
// a cell outside a model's range says so in words.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/expected_spo2.hpp"
#include "model/team_profile.hpp"
#include "model/units.hpp"

namespace firn::pocket_card {

using units::Duration;
using units::Length;
using units::Pressure;
using units::VolumeFlow;

enum class Size {
  A6,      // 105 × 148 mm
  Wallet,  // 85.6 × 54 mm (ISO/IEC 7810 ID-1, the credit-card size), folds into a wallet
};
Result<Size> parse_size(std::string_view key);  // "a6", "wallet"
std::string_view size_key(Size size);

// [SECTION] The figures (what the tests compare with the model functions).

struct AltitudeRow {
  Length altitude;
  std::optional<Pressure> pb_west, pb_isa;  // nullopt: outside that model's range
  std::optional<Pressure> pio2;             // dry air, profile's atmosphere model
  std::optional<expected_spo2::Band> spo2_acute, spo2_acclimatised;
  bool spo2_extrapolated = false;           // beyond the published field data
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
  Pressure fill_gauge;
  int count = 0;
  std::vector<DurationCell> by_flow;  // one per profile flow
};

// A table as printed: column headings and cell texts (the CSV holds the same texts).
struct Table {
  std::string id;     // "altitude", "bag", "cylinders" (CSV file name)
  std::string title;
  std::vector<std::string> header;
  std::vector<std::vector<std::string>> rows;
  std::vector<std::string> footnotes;
};

struct Card {
  team_profile::TeamProfile profile;
  std::string date;     // as given ("2025-01-31")
  std::string version;  // FIRN_VERSION
  std::vector<AltitudeRow> altitudes;
  std::vector<DurationRow> durations;
  std::vector<Table> tables;  // altitude, bag, cylinders
  std::vector<std::string> assumptions;
};

// Builds every figure from the profile. `date` is printed as given (the CLI passes today's).
Card build_card(const team_profile::TeamProfile& profile, const std::string& date);

// Cell texts (shared by HTML and CSV, and by tests that compare the two).
inline constexpr const char* out_of_range_text = "out of range";

// [SECTION] Output.

// One self-contained HTML document (inline CSS, no scripts, no external resources), paginated
// with CSS @page for `size`. Every page is a <section class="page">; nothing may overflow a
// page (the PDF test checks the page count equals the number of sections).
std::string render_html(const Card& card, Size size);
int page_count(const Card& card, Size size);  // number of <section class="page"> in render_html

// RFC 4180 CSV (CRLF line ends, fields quoted when needed) of one table.
std::string table_csv(const Table& table);

}  // namespace firn::pocket_card
