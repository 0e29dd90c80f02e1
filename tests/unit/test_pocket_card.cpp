// Pocket card and team reference sheet: every figure is the model function's own result (rounded
// as printed), cells a model refuses say so, extrapolated cells are marked, the cautions and the
// definitions are on the side that needs them, no psi in a bar card, the HTML is self-contained
// and has the page count a laminated card allows. The models themselves are checked against
// published values in their own test files; the printed page count by tests/cli/card_pdf.
#include <catch2/catch.hpp>

#include <cctype>
#include <cmath>
#include <regex>
#include <string>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/cylinder.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_cascade.hpp"
#include "profile/pocket_card.hpp"
#include "model/supplemental_oxygen.hpp"
#include "profile/team_profile.hpp"
#include "sweep.hpp"

using namespace firn;
using namespace firn::units;
using namespace firn::pocket_card;

namespace {

std::string whole(double v) { return format_number(std::round(v), 0); }

size_t count_of(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

// The HTML of each printed side (<section class="page"> … </section>).
std::vector<std::string> sides_of(const std::string& html) {
  std::vector<std::string> sides;
  const std::string open = "<section class=\"page\">", close = "</section>";
  for (size_t at = html.find(open); at != std::string::npos; at = html.find(open, at + 1)) {
    sides.push_back(html.substr(at, html.find(close, at) - at));
  }
  return sides;
}

// The largest profile the schema allows: 40 card rows, 8 cylinder types with 24-character
// labels, 8 flows, 6 notes of 90 characters, a 60-character team name.
team_profile::TeamProfile largest_profile() {
  team_profile::TeamProfile p = team_profile::demo_profile();
  p.team_name = std::string(60, 'W');
  p.card = {metres(0), metres(7800), metres(200), {}};
  for (int i = 0; i < 6; ++i) p.card.notes.push_back(std::string(89, 'n') + std::to_string(i));
  p.cylinders.clear();
  for (int i = 0; i < 8; ++i) {
    p.cylinders.push_back({std::string(23, 'C') + std::to_string(i), std::nullopt,
                           litres(2.0 + i), bar.gauge(300), 99});
  }
  p.flows.clear();
  for (double f : {0.25, 1.5, 2.5, 4.0, 6.0, 12.5, 15.0, 25.0}) p.flows.push_back(litres_per_minute(f));
  return p;
}

}  // namespace

TEST_CASE("Card altitude figures are the models' results", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  REQUIRE(card.altitudes.size() == 19);
  const Table& air = table(card, "altitude");
  for (size_t i = 0; i < card.altitudes.size(); ++i) {
    Length h = card.altitudes[i].altitude;
    Pressure west = atmosphere::pressure_at(h, atmosphere::Model::West1996).value();
    Pressure isa = atmosphere::pressure_at(h, atmosphere::Model::Isa).value();
    Pressure pio2 = cascade::inspired_po2(west, cascade::dry_air_fio2()).value();
    auto acute = expected_spo2::expected(west, cascade::Exposure::Acute).value();
    auto acclim = expected_spo2::expected(west, cascade::Exposure::Acclimatised).value();
    CHECK(card.altitudes[i].pb_west == west);
    CHECK(card.altitudes[i].pio2 == pio2);
    CHECK(card.altitudes[i].spo2_acute->low == acute.band.low);
    CHECK(card.altitudes[i].spo2_acclimatised->high == acclim.band.high);
    CHECK(card.altitudes[i].spo2_acute_extrapolated == acute.extrapolated);
    CHECK(card.altitudes[i].spo2_acclimatised_extrapolated == acclim.extrapolated);
    const auto& row = air.rows[i];
    CHECK(row[0] == whole(h.in(metres)));
    CHECK(row[1] == whole(west.in(hectopascals)));
    CHECK(row[2] == whole(isa.in(hectopascals)));
    CHECK(row[3] == whole(pio2.in(mmhg)));
    // Each band carries its own mark: an extrapolated band is never printed plain.
    CHECK(row[4] == whole(acute.band.low.in(percent)) + "\xE2\x80\x93" +
                        whole(acute.band.high.in(percent)) + (acute.extrapolated ? "*" : ""));
    CHECK(row[5] == whole(acclim.band.low.in(percent)) + "\xE2\x80\x93" +
                        whole(acclim.band.high.in(percent)) + (acclim.extrapolated ? "*" : ""));
  }
  // West 1996 at 4000 m is 475 Torr (West JB, J Appl Physiol 1996;81:1850, table at 15°):
  // the card's 4000 m row prints 633 hPa (= 475.1 Torr with the published constant 6.63268).
  CHECK(air.rows[10][0] == "4000");
  CHECK(std::stod(air.rows[10][1]) == Approx(475.0 * 1.33322).margin(1.0));
}

TEST_CASE("Extrapolated bands are marked, explained on their side, and give no verdict", "[card]") {
  Card card = build_card(team_profile::demo_profile(), "2025-01-31");
  const Table& air = table(card, "altitude");
  // The demo range reaches 6000 m: above the field data (expected_spo2.hpp) the model says
  // extrapolated, at 4000 m it does not.
  REQUIRE(card.altitudes.back().spo2_extrapolated);
  REQUIRE_FALSE(card.altitudes[10].spo2_extrapolated);
  CHECK(air.rows.back()[4].back() == '*');
  CHECK(air.rows[10][4].back() != '*');
  bool explained = false;
  for (const std::string& note : air.footnotes) {
    if (note.rfind("* Extrapolated", 0) == 0 && note.find("no verdict") != std::string::npos) explained = true;
  }
  CHECK(explained);
  for (Size size : {Size::A6, Size::Wallet, Size::Reference}) {
    std::vector<std::string> sides = sides_of(render_html(card, size));
    for (const std::string& side : sides) {
      // The footnote is on every side whose table has a marked cell, and only there.
      bool marked = side.find("class=\"ext\"") != std::string::npos;
      CHECK(marked == (side.find("* Extrapolated") != std::string::npos));
    }
    CHECK(sides[0].find("class=\"ext\"") != std::string::npos);  // the 6000 m row is printed
  }
}

TEST_CASE("Card bag figures are the bag model's results at the team's gauge", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  const Table& bag = table(card, "bag");
  hyperbaric_bag::Settings settings;
  settings.gauge = profile.bag.gauge_pressure;
  settings.co2_limit = profile.bag.co2_limit;
  settings.stroke_volume = profile.bag.pump_stroke_volume;
  for (size_t i = 0; i < card.altitudes.size(); ++i) {
    // The card prints the flush the bag's verdict needs (rounded up) and the limiting equivalent
    // altitude at that flush: what `firn bag --flush N` gives.
    auto needs = hyperbaric_bag::bag_at_altitude(card.altitudes[i].altitude,
                                                 atmosphere::Model::West1996, settings).value();
    REQUIRE(needs.required_flush);
    hyperbaric_bag::Settings flushed = settings;
    flushed.flush = litres_per_minute(std::ceil(needs.required_flush->in(litres_per_minute)));
    auto r = hyperbaric_bag::bag_at_altitude(card.altitudes[i].altitude,
                                             atmosphere::Model::West1996, flushed).value();
    CHECK(r.verdict == hyperbaric_bag::Verdict::Ok);
    CHECK(bag.rows[i][1] == whole(r.inside_pressure.in(hectopascals)));
    // Up to 10 m, as the bag's verdict rounds: the card never claims more descent.
    CHECK(bag.rows[i][2] ==
          format_number(std::ceil(r.equivalent_altitude->in(metres) / 10.0) * 10.0, 0));
    // Never more descent than the pressure alone gives.
    CHECK(r.equivalent_altitude->in(metres) >= r.pressure_equivalent_altitude->in(metres) - 1e-6);
    CHECK(bag.rows[i][3] == format_number(flushed.flush->in(litres_per_minute), 0));
    CHECK(bag.rows[i][4] == format_number(std::ceil(*needs.required_flush_strokes_per_minute), 0));
    if (card.altitudes[i].altitude == metres(4250)) {
      // Worked example (Taber RL, 1990, portable hyperbaric chamber protocols): at 4243 m a 2 psi
      // bag is ≈ 2560 m by pressure. The card's 4250 m row, by pressure, lands within 100 m of
      // it (West model); the printed figure is the limiting one, at or above it.
      CHECK(r.pressure_equivalent_altitude->in(metres) == Approx(2560).margin(100));
      CHECK(std::stod(bag.rows[i][2]) >= 2560 - 100);
    }
  }
  CHECK(bag.rows[11][0] == "4250");
  // The metric card names the gauge in hPa (2 psi = 137.9 hPa), never in psi.
  CHECK(bag.title == "Hyperbaric bag at 138 hPa gauge");
  REQUIRE_FALSE(bag.footnotes.empty());
  CHECK(bag.footnotes[0].find("below 1 %") != std::string::npos);
}

TEST_CASE("Card duration table is the cylinder model at full and half pressure, rounded down", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  const Table& t = table(card, "cylinders");
  REQUIRE(t.rows.size() == 2 * profile.cylinders.size());
  for (size_t c = 0; c < profile.cylinders.size(); ++c) {
    const auto& type = profile.cylinders[c];
    Volume capacity = type.water_capacity
                          ? *type.water_capacity
                          : cylinder::letter_size_info(*type.letter_size).water_capacity;
    for (size_t f = 0; f < profile.flows.size(); ++f) {
      for (int half = 0; half < 2; ++half) {
        GaugePressure gauge = half ? type.fill_pressure_gauge / 2.0 : type.fill_pressure_gauge;
        cylinder::Reading reading{capacity, gauge, celsius(15), atmospheres(1)};
        auto d = cylinder::duration(reading, profile.reserve_pressure_gauge, profile.flows[f]);
        REQUIRE(d.ok());
        // A letter size also has the US field rule (common practice): the lower leads.
        std::optional<Duration> rule;
        if (type.letter_size) {
          auto r = cylinder::field_rule_duration(*type.letter_size, gauge, profile.flows[f]);
          if (r) rule = r.value();
        }
        auto lead = cylinder::leading_duration(d.value(), rule);
        CHECK(lead.duration <= cylinder::whole_minutes_down(d->to_reserve));
        CHECK(t.rows[2 * c + half][2 + f] == format_number(lead.duration.in(minutes), 0));
      }
    }
  }
  // Ideal-gas cross-check, common practice: a 2 L cylinder at 200 bar holds ≈ 400 L; above a
  // 20 bar reserve at 2 L/min that is ≈ 180 min ideal; real gas at 15 °C holds a few % more
  // (Z at 200 bar < 1, Schmidt & Wagner 1985), so the card's figure is a little above 180.
  CHECK(std::stod(t.rows[0][2]) > 180);
  CHECK(std::stod(t.rows[0][2]) < 200);
  // The US E cylinder in a metric profile: its 2015 psi fill printed in bar (139), no psi.
  CHECK(t.header[1] == "Gauge bar");
  CHECK(t.rows[4][1] == "139");
}

TEST_CASE("Oxygen by altitude band is the lowest flow for the target at the band's top", "[card]") {
  namespace o2 = supplemental_oxygen;
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  const Table& t = table(card, "oxygen");
  // 1500…6000 m every 250 m: bands of 500 m, 1500–2000 … 5500–6000.
  REQUIRE(t.rows.size() == 9);
  CHECK(t.rows[0][0] == "1500\xE2\x80\x93" "2000");
  CHECK(t.rows[8][0] == "5500\xE2\x80\x93" "6000");
  const o2::Device devices[] = {o2::Device::NasalCannula, o2::Device::SimpleMask, o2::Device::NonRebreather};
  int flows_printed = 0;
  for (size_t r = 0; r < t.rows.size(); ++r) {
    Pressure top = atmosphere::pressure_at(card.flow_needs[r].band_high, atmosphere::Model::West1996).value();
    for (size_t d = 0; d < 3; ++d) {
      auto need = o2::lowest_flow_for_target(top, cascade::Exposure::Acute, devices[d]).value();
      const std::string& flow = t.rows[r][1 + 2 * d];
      const std::string& per_hour = t.rows[r][2 + 2 * d];
      std::string mark = need.at_flow.extrapolated ? "*" : "";
      if (need.reached_on_air) {
        CHECK(flow == "air" + mark);
      } else if (!need.reachable) {
        CHECK(flow == "not reached" + mark);
      } else {
        CHECK(flow == format_number(need.flow.in(litres_per_minute), 1) + mark);
        // Litres per hour: 60 × the flow, arithmetic.
        CHECK(std::stod(per_hour) == Approx(60.0 * need.flow.in(litres_per_minute)).margin(0.5));
        ++flows_printed;
      }
    }
  }
  CHECK(flows_printed > 0);
  // At 5500–6000 m a healthy lowlander on air is below 90 % (the expected band there is well
  // below 90, field data e.g. Botella de Maglia 2005): the cannula row names a flow, not "air".
  CHECK(t.rows[8][1] != "air");
}

TEST_CASE("Cells outside a model's range say so instead of a number", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  profile.card.altitude_from = metres(0);  // 2 psi at sea level: inside above 1 atm
  profile.card.altitude_to = metres(9000);
  profile.card.altitude_step = metres(1000);
  profile.reserve_pressure_gauge = bar.gauge(99);  // above half of the 2 L's fill: "at reserve"
  profile.cylinders[0].fill_pressure_gauge = bar.gauge(190);
  Card card = build_card(profile, "2025-01-31");
  CHECK(table(card, "bag").rows[0][2] == "below sea level");
  CHECK(table(card, "cylinders").rows[1][2] == "at reserve");
  for (const Table& t : card.tables) {
    for (const auto& row : t.rows) {
      for (const std::string& cell : row) {
        CHECK(cell.find("nan") == std::string::npos);
        CHECK(cell.find("inf") == std::string::npos);
        CHECK_FALSE(cell.empty());
      }
    }
  }
}

TEST_CASE("One unit per quantity: no psi on a metric card, no bar on a US card", "[card]") {
  team_profile::TeamProfile metric = team_profile::demo_profile();  // has a US E cylinder
  for (Size size : {Size::A6, Size::Wallet, Size::Reference}) {
    std::string html = render_html(build_card(metric, "2025-01-31"), size);
    std::string printed = html.substr(html.find("</style>"));  // (the CSS says "ellipsis")
    CHECK(printed.find("psi") == std::string::npos);
  }
  team_profile::TeamProfile us = metric;
  us.units = team_profile::UnitSystem::Us;
  Card card = build_card(us, "2025-01-31");
  for (const Table& t : card.tables) {
    CHECK(t.title.find(" bar") == std::string::npos);  // ("Hyperbaric" is not a unit)
    for (const std::string& h : t.header) CHECK(h.find("bar") == std::string::npos);
    for (const std::string& h : t.header) CHECK(h.find("hPa") == std::string::npos);
  }
  CHECK(table(card, "cylinders").header[1] == "Gauge psi");
  CHECK(table(card, "cylinders").rows[0][1] == whole(bar(200).in(psi)));  // 2901
  CHECK(table(card, "bag").title == "Hyperbaric bag at 2 psi gauge");
}

TEST_CASE("The pocket card is one sheet: A6 two sides, wallet four; the reference sheet A4",
          "[card]") {
  for (const team_profile::TeamProfile& profile : {team_profile::demo_profile(), largest_profile()}) {
    Card card = build_card(profile, "2025-01-31");
    CHECK(page_count(card, Size::A6) == 2);
    CHECK(page_count(card, Size::Wallet) == 4);
    CHECK(page_count(card, Size::Reference) == 2);
    for (Size size : {Size::A6, Size::Wallet, Size::Reference}) {
      std::string html = render_html(card, size);
      std::vector<std::string> sides = sides_of(html);
      REQUIRE(static_cast<int>(sides.size()) == page_count(card, size));
      // Every side carries its number and the short caution line; a wallet card (sides 1–2,
      // 3–4) carries it once, on its back (side 4 has the full cautions).
      for (size_t i = 0; i < sides.size(); ++i) {
        bool line = size != Size::Wallet || i == 1;
        CHECK((sides[i].find(std::string(cautions::short_line)) != std::string::npos) == line);
        CHECK(sides[i].find(std::to_string(i + 1) + "/" + std::to_string(sides.size())) != std::string::npos);
      }
      // The full cautions on the card (A6 side 2, wallet side 4, the sheet's page 2).
      for (std::string_view caution : cautions::full_text) {
        CHECK(sides.back().find(std::string(caution)) != std::string::npos);
      }
      // "acute"/"acclimatised" are defined on a side that prints the bands.
      CHECK(sides[0].find(size == Size::Wallet ? card.exposure_definitions_short
                                               : card.exposure_definitions) != std::string::npos);
      // Nothing printed below 8 pt: every font-size in the style is ≥ 8 pt or ≥ 1 em.
      std::regex size_re("font-size:([0-9.]+)(pt|em)");
      for (auto it = std::sregex_iterator(html.begin(), html.end(), size_re); it != std::sregex_iterator(); ++it) {
        double value = std::stod((*it)[1]);
        CHECK(value >= ((*it)[2] == "pt" ? 8.0 : 1.0));
      }
    }
    std::vector<std::string> a6 = sides_of(render_html(card, Size::A6));
    CHECK(a6[0].find(card.exposure_definitions) != std::string::npos);
    CHECK(a6[0].find("data-table=\"altitude\"") != std::string::npos);
    CHECK(a6[1].find("data-table=\"cylinders\"") != std::string::npos);
    CHECK(a6[1].find("data-table=\"bag\"") != std::string::npos);
    // The highest card altitude is always on the pocket card, even when rows are thinned.
    CHECK(a6[0].find("<td>" + table(card, "altitude").rows.back()[0] + "</td>") != std::string::npos);
    // Footnotes on the side that uses them: the cylinder note on side 2, not side 1.
    CHECK(a6[1].find("Minutes rounded down") != std::string::npos);
    CHECK(a6[0].find("Minutes rounded down") == std::string::npos);
  }
}

TEST_CASE("Card HTML is self-contained and carries identity", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  for (Size size : {Size::A6, Size::Wallet, Size::Reference}) {
    std::string html = render_html(card, size);
    const char* page = size == Size::A6 ? "size:105mm 148mm" : size == Size::Wallet ? "size:85.6mm 54mm"
                                                                                   : "size:210mm 297mm";
    CHECK(html.find(page) != std::string::npos);
    // No external resources: no URLs, scripts or linked files.
    CHECK(html.find("http") == std::string::npos);
    CHECK(html.find("<script") == std::string::npos);
    CHECK(html.find("<link") == std::string::npos);
    CHECK(html.find("url(") == std::string::npos);
    CHECK(html.find("DEMO Skarnvald Valley Mountain Rescue") != std::string::npos);
    CHECK(html.find("DEMO DATA") != std::string::npos);
    CHECK(html.find("2025-01-31") != std::string::npos);
    CHECK(html.find(std::string("Firn ") + FIRN_VERSION) != std::string::npos);
    CHECK(html.find("West 1996") != std::string::npos);
  }
  // The team's notes are on the reference sheet.
  std::string sheet = render_html(card, Size::Reference);
  for (const std::string& note : profile.card.notes) CHECK(sheet.find(note) != std::string::npos);
  // Profile text is escaped, never interpreted.
  profile.team_name = "<b>Team & co</b>";
  std::string html = render_html(build_card(profile, "2025-01-31"), Size::A6);
  CHECK(html.find("&lt;b&gt;Team &amp; co&lt;/b&gt;") != std::string::npos);
}

TEST_CASE("CSV tables hold the card's cells", "[card]") {
  Card card = build_card(team_profile::demo_profile(), "2025-01-31");
  std::string csv = table_csv(table(card, "cylinders"));
  CHECK(csv.rfind("Cylinder,Gauge bar,2 L/min,4 L/min,6 L/min,10 L/min,15 L/min\r\n", 0) == 0);
  CHECK(count_of(csv, "\r\n") == table(card, "cylinders").rows.size() + 1);
  Table quoted{"t", "T", {"a,b", "say \"hi\""}, {{"1", "2"}}, {}, {}};
  CHECK(table_csv(quoted) == "\"a,b\",\"say \"\"hi\"\"\"\r\n1,2\r\n");
}

namespace {
// A printed cell: a figure (digits, maybe a range "90–94" or a '*'), or one of the card's words.
bool is_card_cell(const std::string& cell) {
  std::string bare = !cell.empty() && cell.back() == '*' ? cell.substr(0, cell.size() - 1) : cell;
  for (const char* word : {out_of_range_text, "below sea level", "at reserve", "air", "not reached",
                           "\xE2\x80\x93"}) {
    if (bare == word) return true;
  }
  if (cell.empty()) return false;
  for (unsigned char c : cell) {
    bool figure = std::isdigit(c) || c == '.' || c == '-' || c == '*' || c == 0xE2 || c == 0x80 || c == 0x93;
    if (!figure) return false;
  }
  return std::isdigit(static_cast<unsigned char>(cell[0])) || cell[0] == '-';
}
}  // namespace

TEST_CASE("sweep: cards over the whole altitude range, both unit systems and models, and every "
          "fill, reserve and flow", "[card][sweep]") {
  // Card altitudes 0…9000 m in steps 50…1000 m (≤ 40 rows), fills 50…300 bar, reserve 0…100 bar,
  // flows 0.25…25 L/min: every model figure finite and plausible, every altitude-, bag- and
  // oxygen-table cell a figure or a word, never a "nan"; the pocket card stays 2 or 4 sides.
  struct Range { double from, to, step; };
  for (Range r : {Range{0, 9000, 250}, Range{0, 1950, 50}, Range{7000, 9000, 1000}, Range{4050, 6000, 65}}) {
    for (auto units : {team_profile::UnitSystem::Metric, team_profile::UnitSystem::Us}) {
      for (auto model : {atmosphere::Model::West1996, atmosphere::Model::Isa}) {
        team_profile::TeamProfile p = team_profile::demo_profile();
        p.card = {metres(r.from), metres(r.to), metres(r.step), {}};
        p.units = units;
        p.atmosphere_model = model;
        Card card = build_card(p, "2025-01-31");
        REQUIRE(card.altitudes.size() <= 40);
        for (const AltitudeRow& row : card.altitudes) {
          REQUIRE(row.pb_west);
          REQUIRE(row.pb_isa);
          REQUIRE(row.pio2);
          // Acute below PiO2 ~41 mmHg (ISA above ~8800 m on air) the cascade refuses: "out of range".
          if (row.pio2->in(mmhg) >= 41.0) REQUIRE(row.spo2_acute);
          REQUIRE(row.spo2_acclimatised);
          if (row.spo2_acute) CHECK(row.spo2_acute->low.in(percent) >= 0.0);
          CHECK(row.spo2_acclimatised->high.in(percent) <= 100.0);
          REQUIRE(row.bag_inside);
          CHECK(row.bag_min_flush->in(litres_per_minute) >= 0.0);
        }
        for (const char* id : {"altitude", "bag", "oxygen"}) {
          for (const auto& cells : table(card, id).rows) {
            for (const std::string& cell : cells) CHECK(is_card_cell(cell));
          }
        }
        CHECK(render_html(card, Size::Wallet).find("nan") == std::string::npos);
        CHECK(page_count(card, Size::A6) == 2);
        CHECK(page_count(card, Size::Wallet) == 4);
      }
    }
  }
  for (double fill : sweep::grid(50, 300, 5)) {
    for (double reserve : sweep::grid(0, 100, 4)) {
      team_profile::TeamProfile p = team_profile::demo_profile();
      for (auto& c : p.cylinders) c.fill_pressure_gauge = bar.gauge(fill);
      p.reserve_pressure_gauge = bar.gauge(reserve);
      p.flows = {litres_per_minute(0.25), litres_per_minute(6), litres_per_minute(25)};
      Card card = build_card(p, "2025-01-31");
      for (const DurationRow& row : card.durations) {
        for (const DurationCell& cell : row.by_flow) {
          // A cell is minutes (≥ 0) or says why not: at or below the reserve, or out of range.
          if (cell.full) CHECK(cell.full->in(minutes) >= 0.0);
          if (!cell.full) CHECK((cell.full_note == "at reserve" || cell.full_note == out_of_range_text));
          if (!cell.half) CHECK((cell.half_note == "at reserve" || cell.half_note == out_of_range_text));
          if (fill > reserve) CHECK(cell.full.has_value());
        }
      }
      for (const auto& cells : table(card, "cylinders").rows) {
        for (size_t i = 2; i < cells.size(); ++i) CHECK(is_card_cell(cells[i]));
      }
    }
  }
}

TEST_CASE("sweep: just outside the card's ranges the message names them", "[card][sweep][errors]") {
  auto card_problems = [](const std::string& from, const std::string& to, const std::string& step) {
    team_profile::TeamProfile p = team_profile::demo_profile();
    std::string text = team_profile::serialize_profile(p);
    auto replace = [&](const std::string& key, const std::string& value) {
      size_t at = text.find("\"" + key + "\": ");
      REQUIRE(at != std::string::npos);
      size_t end = text.find(',', at);
      text.replace(at, end - at, "\"" + key + "\": \"" + value + "\"");
    };
    replace("altitude_from", from);
    replace("altitude_to", to);
    replace("altitude_step", step);
    return team_profile::parse_profile(text);
  };
  CHECK_REFUSED_NAMING(card_problems("-0.01m", "6000m", "250m"), "outside 0\xE2\x80\xA6" "9000 m");
  CHECK_REFUSED_NAMING(card_problems("1500m", "9000.01m", "250m"), "outside 0\xE2\x80\xA6" "9000 m");
  CHECK_REFUSED_NAMING(card_problems("1500m", "3000m", "49.99m"), "outside 50\xE2\x80\xA6" "1000 m");
  CHECK_REFUSED_NAMING(card_problems("1500m", "6000m", "1000.01m"), "outside 50\xE2\x80\xA6" "1000 m");
  CHECK_REFUSED_NAMING(card_problems("0m", "9000m", "225m"), "41 card rows is more than 40");
  CHECK_REFUSED_NAMING(parse_size("a5"), "use a6 or wallet");
  CHECK(parse_size("reference").value() == Size::Reference);
}
