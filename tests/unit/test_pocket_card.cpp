// Pocket card: every figure is the model function's own result (rounded as printed), cells a
// model refuses say so, the HTML is self-contained and paginated, the CSV holds the same cells.
// The models themselves are checked against published values in their own test files.
#include <catch2/catch.hpp>

#include <cctype>
#include <cmath>
#include <string>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/cylinder.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_cascade.hpp"
#include "model/pocket_card.hpp"
#include "model/team_profile.hpp"
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

}  // namespace

TEST_CASE("Card altitude figures are the models' results", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  REQUIRE(card.altitudes.size() == 19);
  const Table& air = card.tables.at(0);
  REQUIRE(air.id == "altitude");
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
    const auto& row = air.rows[i];
    CHECK(row[0] == whole(h.in(metres)));
    CHECK(row[1] == whole(west.in(hectopascals)));
    CHECK(row[2] == whole(isa.in(hectopascals)));
    CHECK(row[3] == whole(pio2.in(mmhg)));
    std::string star = acute.extrapolated || acclim.extrapolated ? "*" : "";
    CHECK(row[4] == whole(acute.band.low.in(percent)) + "\xE2\x80\x93" +
                        whole(acute.band.high.in(percent)) + star);
    CHECK(row[5] == whole(acclim.band.low.in(percent)) + "\xE2\x80\x93" +
                        whole(acclim.band.high.in(percent)) + star);
  }
  // West 1996 at 4000 m is 475 Torr (West JB, J Appl Physiol 1996;81:1850, table at 15°):
  // the card's 4000 m row prints 634 hPa (= 475.3 Torr).
  CHECK(air.rows[10][0] == "4000");
  CHECK(air.rows[10][1] == "634");
}

TEST_CASE("Card bag figures are the bag model's results at the team's gauge", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  const Table& bag = card.tables.at(1);
  REQUIRE(bag.id == "bag");
  hyperbaric_bag::Settings settings;
  settings.gauge = profile.bag.gauge_pressure;
  settings.co2_limit = profile.bag.co2_limit;
  settings.stroke_volume = profile.bag.pump_stroke_volume;
  for (size_t i = 0; i < card.altitudes.size(); ++i) {
    auto r = hyperbaric_bag::bag_at_altitude(card.altitudes[i].altitude,
                                             atmosphere::Model::West1996, settings).value();
    CHECK(bag.rows[i][1] == whole(r.inside_pressure.in(hectopascals)));
    CHECK(bag.rows[i][2] ==
          format_number(std::round(r.equivalent_altitude->in(metres) / 10.0) * 10.0, 0));
    CHECK(bag.rows[i][3] == format_number(std::ceil(r.min_flush.in(litres_per_minute)), 0));
    CHECK(bag.rows[i][4] == format_number(std::ceil(*r.min_flush_strokes_per_minute), 0));
  }
  // Worked example (Taber RL, 1990, portable hyperbaric chamber protocols): at 4243 m a 2 psi bag
  // is ≈ 2560 m. The card's 4250 m row at the demo's 2 psi lands within 100 m of it (West model).
  CHECK(bag.rows[11][0] == "4250");
  CHECK(std::stod(bag.rows[11][2]) == Approx(2560).margin(100));
  REQUIRE_FALSE(bag.footnotes.empty());
  CHECK(bag.footnotes[0].find("below 1 %") != std::string::npos);
}

TEST_CASE("Card duration table is the cylinder model at full and half pressure", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  const Table& table = card.tables.at(2);
  REQUIRE(table.rows.size() == 2 * profile.cylinders.size());
  for (size_t c = 0; c < profile.cylinders.size(); ++c) {
    const auto& type = profile.cylinders[c];
    Volume capacity = type.water_capacity
                          ? *type.water_capacity
                          : cylinder::letter_size_info(*type.letter_size).water_capacity;
    for (size_t f = 0; f < profile.flows.size(); ++f) {
      for (int half = 0; half < 2; ++half) {
        Pressure gauge = half ? type.fill_pressure_gauge / 2.0 : type.fill_pressure_gauge;
        cylinder::Reading reading{capacity, gauge, celsius(15), atmospheres(1)};
        auto d = cylinder::duration(reading, profile.reserve_pressure_gauge, profile.flows[f]);
        REQUIRE(d.ok());
        CHECK(table.rows[2 * c + half][2 + f] ==
              format_number(std::floor(d->to_reserve.in(minutes)), 0));
      }
    }
  }
  // Ideal-gas cross-check, common practice: a 2 L cylinder at 200 bar holds ≈ 400 L; above a
  // 20 bar reserve at 2 L/min that is ≈ 180 min ideal; real gas at 15 °C holds a few % more
  // (Z at 200 bar < 1, Schmidt & Wagner 1985), so the card's figure is a little above 180.
  CHECK(std::stod(table.rows[0][2]) > 180);
  CHECK(std::stod(table.rows[0][2]) < 200);
}

TEST_CASE("Cells outside a model's range say so instead of a number", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  profile.card.altitude_from = metres(0);  // 2 psi at sea level: inside above 1 atm
  profile.card.altitude_to = metres(9000);
  profile.card.altitude_step = metres(1000);
  profile.reserve_pressure_gauge = bar(99);  // above half of the 2 L's fill: "at reserve"
  profile.cylinders[0].fill_pressure_gauge = bar(190);
  Card card = build_card(profile, "2025-01-31");
  CHECK(card.tables[1].rows[0][2] == "below sea level");
  CHECK(card.tables[2].rows[1][2] == "at reserve");
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

TEST_CASE("Card HTML is self-contained, paginated and carries cautions and identity", "[card]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  Card card = build_card(profile, "2025-01-31");
  for (Size size : {Size::A6, Size::Wallet}) {
    std::string html = render_html(card, size);
    int pages = page_count(card, size);
    CHECK(static_cast<int>(count_of(html, "<section class=\"page\">")) == pages);
    CHECK(count_of(html, "page " + std::to_string(pages) + "/" + std::to_string(pages)) == 1);
    CHECK(html.find(size == Size::A6 ? "size:105mm 148mm" : "size:85.6mm 54mm") != std::string::npos);
    // No external resources: no URLs, scripts or linked files.
    CHECK(html.find("http") == std::string::npos);
    CHECK(html.find("<script") == std::string::npos);
    CHECK(html.find("<link") == std::string::npos);
    CHECK(html.find("url(") == std::string::npos);
    for (std::string_view caution : cautions::full_text) {
      CHECK(html.find(std::string(caution)) != std::string::npos);
    }
    CHECK(html.find("DEMO Skarnvald Valley Mountain Rescue") != std::string::npos);
    CHECK(html.find("DEMO DATA") != std::string::npos);
    CHECK(html.find("2025-01-31") != std::string::npos);
    CHECK(html.find(std::string("Firn ") + FIRN_VERSION) != std::string::npos);
    CHECK(html.find("West 1996") != std::string::npos);
  }
  CHECK(page_count(card, Size::A6) == 5);
  CHECK(page_count(card, Size::Wallet) > page_count(card, Size::A6));
  // Profile text is escaped, never interpreted.
  profile.team_name = "<b>Team & co</b>";
  std::string html = render_html(build_card(profile, "2025-01-31"), Size::A6);
  CHECK(html.find("&lt;b&gt;Team &amp; co&lt;/b&gt;") != std::string::npos);
}

TEST_CASE("CSV tables hold the card's cells", "[card]") {
  Card card = build_card(team_profile::demo_profile(), "2025-01-31");
  std::string csv = table_csv(card.tables[2]);
  CHECK(csv.rfind("Cylinder,Gauge,2 L/min,4 L/min,6 L/min,10 L/min,15 L/min\r\n", 0) == 0);
  CHECK(count_of(csv, "\r\n") == card.tables[2].rows.size() + 1);
  Table quoted{"t", "T", {"a,b", "say \"hi\""}, {{"1", "2"}}, {}};
  CHECK(table_csv(quoted) == "\"a,b\",\"say \"\"hi\"\"\"\r\n1,2\r\n");
}

namespace {
// A printed cell: a figure (digits, maybe a range "90–94" or a '*'), or one of the card's words.
bool is_card_cell(const std::string& cell) {
  if (cell == out_of_range_text || cell == "below sea level" || cell == "at reserve") return true;
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
  // flows 0.25…25 L/min: every model figure finite and plausible, every altitude-table and
  // bag-table cell a figure or a word, never a "nan".
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
          // Acute below PiO2 ~41 mmHg (ISA above ~8800 m) the cascade refuses: "out of range".
          if (row.pio2->in(mmhg) >= 41.0) REQUIRE(row.spo2_acute);
          REQUIRE(row.spo2_acclimatised);
          if (row.spo2_acute) CHECK(row.spo2_acute->low.in(percent) >= 0.0);
          CHECK(row.spo2_acclimatised->high.in(percent) <= 100.0);
          REQUIRE(row.bag_inside);
          CHECK(row.bag_min_flush->in(litres_per_minute) >= 0.0);
        }
        for (const Table& t : {card.tables[0], card.tables[1]}) {
          for (const auto& cells : t.rows) {
            for (const std::string& cell : cells) CHECK(is_card_cell(cell));
          }
        }
        CHECK(render_html(card, Size::Wallet).find("nan") == std::string::npos);
      }
    }
  }
  for (double fill : sweep::grid(50, 300, 5)) {
    for (double reserve : sweep::grid(0, 100, 4)) {
      team_profile::TeamProfile p = team_profile::demo_profile();
      for (auto& c : p.cylinders) c.fill_pressure_gauge = bar(fill);
      p.reserve_pressure_gauge = bar(reserve);
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
      for (const auto& cells : card.tables[2].rows) {
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
}
