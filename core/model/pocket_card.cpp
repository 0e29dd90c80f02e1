#include "model/pocket_card.hpp"

#include <algorithm>
#include <cmath>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/cylinder.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_cascade.hpp"

namespace firn::pocket_card {
namespace {

using namespace units;
using team_profile::TeamProfile;
using team_profile::UnitSystem;

const std::string dash = "\xE2\x80\x93";  // en dash for ranges

std::string whole(double value) { return format_number(std::round(value), 0); }

std::string altitude_text(Length l, UnitSystem system) {
  return system == UnitSystem::Us ? whole(l.in(feet)) : whole(l.in(metres));
}
// Equivalent altitudes to the nearest 10 m / 50 ft: the models are not better than that.
std::string coarse_altitude_text(Length l, UnitSystem system) {
  if (system == UnitSystem::Us) return format_number(std::round(l.in(feet) / 50.0) * 50.0, 0);
  return format_number(std::round(l.in(metres) / 10.0) * 10.0, 0);
}
std::string pb_text(Pressure p, UnitSystem system) {
  return system == UnitSystem::Us ? whole(p.in(mmhg)) : whole(p.in(hectopascals));
}
const char* altitude_unit(UnitSystem s) { return s == UnitSystem::Us ? "ft" : "m"; }
const char* pb_unit(UnitSystem s) { return s == UnitSystem::Us ? "mmHg" : "hPa"; }

std::string band_text(const std::optional<expected_spo2::Band>& band, bool extrapolated) {
  if (!band) return out_of_range_text;
  return whole(band->low.in(percent)) + dash + whole(band->high.in(percent)) +
         (extrapolated ? "*" : "");
}

Volume water_capacity_of(const team_profile::CylinderType& c) {
  if (c.water_capacity) return *c.water_capacity;
  FIRN_ASSERT(c.letter_size.has_value(), "profile cylinder without capacity or size");
  return cylinder::letter_size_info(*c.letter_size).water_capacity;
}

// Durations are rounded DOWN: a card must never promise oxygen that is not there.
std::string duration_text(const std::optional<Duration>& d, const std::string& note) {
  if (!d) return note;
  return format_number(std::floor(d->in(minutes)), 0);
}

AltitudeRow altitude_row(const TeamProfile& p, Length altitude) {
  AltitudeRow row;
  row.altitude = altitude;
  if (auto west = atmosphere::pressure_at(altitude, atmosphere::Model::West1996)) row.pb_west = *west;
  if (auto isa = atmosphere::pressure_at(altitude, atmosphere::Model::Isa)) row.pb_isa = *isa;
  Result<Pressure> pb = atmosphere::pressure_at(altitude, p.atmosphere_model);
  if (!pb) return row;
  if (auto pio2 = cascade::inspired_po2(*pb, cascade::dry_air_fio2())) row.pio2 = *pio2;
  if (auto acute = expected_spo2::expected(*pb, cascade::Exposure::Acute)) {
    row.spo2_acute = acute->band;
    row.spo2_extrapolated = row.spo2_extrapolated || acute->extrapolated;
  }
  if (auto acclimatised = expected_spo2::expected(*pb, cascade::Exposure::Acclimatised)) {
    row.spo2_acclimatised = acclimatised->band;
    row.spo2_extrapolated = row.spo2_extrapolated || acclimatised->extrapolated;
  }
  hyperbaric_bag::Settings bag;
  bag.gauge = p.bag.gauge_pressure;
  bag.co2_limit = p.bag.co2_limit;
  bag.stroke_volume = p.bag.pump_stroke_volume;
  if (auto result = hyperbaric_bag::bag_at_altitude(altitude, p.atmosphere_model, bag)) {
    row.bag_inside = result->inside_pressure;
    row.bag_equivalent = result->equivalent_altitude;
    row.bag_min_flush = result->min_flush;
    row.bag_min_flush_strokes = result->min_flush_strokes_per_minute;
  }
  return row;
}

DurationRow duration_row(const TeamProfile& p, const team_profile::CylinderType& c) {
  DurationRow row{c.label, water_capacity_of(c), c.fill_pressure_gauge, c.count, {}};
  for (VolumeFlow flow : p.flows) {
    DurationCell cell;
    for (bool half : {false, true}) {
      Pressure gauge = half ? c.fill_pressure_gauge / 2.0 : c.fill_pressure_gauge;
      std::optional<Duration>& slot = half ? cell.half : cell.full;
      std::string& note = half ? cell.half_note : cell.full_note;
      if (!(gauge > p.reserve_pressure_gauge)) {
        note = "at reserve";
        continue;
      }
      cylinder::Reading reading{row.water_capacity, gauge, celsius(15.0), atmospheres(1.0)};
      Result<cylinder::DurationEstimate> d = cylinder::duration(reading, p.reserve_pressure_gauge, flow);
      if (d) {
        slot = d->to_reserve;
      } else {
        note = out_of_range_text;
      }
    }
    row.by_flow.push_back(cell);
  }
  return row;
}

std::string flow_heading(VolumeFlow f) { return format_number(f.in(litres_per_minute), 2); }

std::string pressure_heading(Pressure gauge, bool psi_units) {
  return psi_units ? whole(gauge.in(psi)) + " psi" : whole(gauge.in(bar)) + " bar";
}

}  // namespace

Result<Size> parse_size(std::string_view key) {
  if (key == "a6" || key == "A6") return Size::A6;
  if (key == "wallet") return Size::Wallet;
  return Error{"card size '" + std::string(key) + "': use a6 or wallet"};
}

std::string_view size_key(Size size) { return size == Size::A6 ? "a6" : "wallet"; }

Card build_card(const TeamProfile& profile, const std::string& date) {
  Card card;
  card.profile = profile;
  card.date = date;
  card.version = FIRN_VERSION;
  UnitSystem u = profile.units;
  std::string model = std::string(atmosphere::model_name(profile.atmosphere_model));

  for (Length altitude : profile.card_altitudes()) card.altitudes.push_back(altitude_row(profile, altitude));
  for (const auto& c : profile.cylinders) card.durations.push_back(duration_row(profile, c));

  Table air{"altitude", "Air and expected SpO2 (healthy lowlanders, at rest)",
            {std::string("Alt ") + altitude_unit(u), std::string("PB West ") + pb_unit(u),
             std::string("PB ISA ") + pb_unit(u), "PiO2 mmHg", "SpO2 acute %",
             "SpO2 acclim. %"},
            {}, {}};
  bool any_extrapolated = false;
  for (const AltitudeRow& r : card.altitudes) {
    air.rows.push_back({altitude_text(r.altitude, u),
                        r.pb_west ? pb_text(*r.pb_west, u) : out_of_range_text,
                        r.pb_isa ? pb_text(*r.pb_isa, u) : out_of_range_text,
                        r.pio2 ? whole(r.pio2->in(mmhg)) : out_of_range_text,
                        band_text(r.spo2_acute, r.spo2_extrapolated),
                        band_text(r.spo2_acclimatised, r.spo2_extrapolated)});
    any_extrapolated = any_extrapolated || r.spo2_extrapolated;
  }
  air.footnotes.push_back("PiO2 and SpO2 use " + model + " pressures, dry air FiO2 0.2095.");
  air.footnotes.push_back("SpO2: expected band, not a target. Below about 80 % oximeters err by "
                          "several points. Well below the band: think HAPE.");
  if (any_extrapolated) {
    air.footnotes.push_back("* beyond the published field data the band is extrapolated.");
  }

  std::string gauge = pressure_heading(profile.bag.gauge_pressure, true);
  if (u == UnitSystem::Metric) gauge += " (" + whole(profile.bag.gauge_pressure.in(millibar)) + " mbar)";
  Table bag{"bag", "Hyperbaric bag at " + gauge,
            {std::string("Alt ") + altitude_unit(u), std::string("Inside ") + pb_unit(u),
             std::string("Equiv. alt ") + altitude_unit(u), "Flush L/min",
             "Strokes /min"},
            {}, {}};
  double flush_low = 1e9, flush_high = 0, strokes_low = 1e9, strokes_high = 0;
  for (const AltitudeRow& r : card.altitudes) {
    std::vector<std::string> cells{altitude_text(r.altitude, u)};
    if (!r.bag_inside) {
      cells.insert(cells.end(), 4, out_of_range_text);
    } else {
      cells.push_back(pb_text(*r.bag_inside, u));
      cells.push_back(r.bag_equivalent ? coarse_altitude_text(*r.bag_equivalent, u)
                                       : "below sea level");
      // Flush and strokes rounded UP: the minimum must not be understated.
      double flush = std::ceil(r.bag_min_flush->in(litres_per_minute));
      cells.push_back(format_number(flush, 0));
      flush_low = std::min(flush_low, flush);
      flush_high = std::max(flush_high, flush);
      if (r.bag_min_flush_strokes) {
        double strokes = std::ceil(*r.bag_min_flush_strokes);
        cells.push_back(format_number(strokes, 0));
        strokes_low = std::min(strokes_low, strokes);
        strokes_high = std::max(strokes_high, strokes);
      } else {
        cells.push_back(out_of_range_text);
      }
    }
    bag.rows.push_back(cells);
  }
  std::string limit = format_number(profile.bag.co2_limit.in(percent), 2) + " %";
  if (flush_high > 0) {
    bag.footnotes.push_back(
        "Flush rule: to keep CO2 below " + limit + ", push at least " + format_number(flush_low, 0) +
        (flush_high > flush_low ? dash + format_number(flush_high, 0) : std::string()) +
        " L/min fresh air through the bag = " + format_number(strokes_low, 0) +
        (strokes_high > strokes_low ? dash + format_number(strokes_high, 0) : std::string()) +
        " strokes/min of the " + format_number(profile.bag.pump_stroke_volume.in(litres), 2) +
        " L pump (row for your altitude).");
  }
  bag.footnotes.push_back("Same " + model + " model both ways. Resting casualty: VCO2 0.20 L/min "
                          "(assumed). Reassess every 1" + dash + "2 h; the bag buys time for descent.");

  bool psi_units = u == UnitSystem::Us;
  Table cylinders{"cylinders",
                  "Oxygen minutes to reserve " + pressure_heading(profile.reserve_pressure_gauge, psi_units),
                  {"Cylinder", "Gauge"}, {}, {}};
  for (VolumeFlow f : profile.flows) cylinders.header.push_back(flow_heading(f) + " L/min");
  for (const DurationRow& r : card.durations) {
    bool row_psi = psi_units || profile.find_cylinder(r.label)->letter_size.has_value();
    for (bool half : {false, true}) {
      std::string label = half ? "half" : r.label + " \xC3\x97" + std::to_string(r.count);
      std::vector<std::string> cells{label, pressure_heading(half ? r.fill_gauge / 2.0 : r.fill_gauge, row_psi)};
      for (const DurationCell& cell : r.by_flow) {
        cells.push_back(half ? duration_text(cell.half, cell.half_note)
                             : duration_text(cell.full, cell.full_note));
      }
      cylinders.rows.push_back(cells);
    }
  }
  cylinders.footnotes.push_back("Minutes, rounded down. Real-gas contents (oxygen equation of "
                                "state) at 15 \xC2\xB0" "C; a cold cylinder reads lower with the "
                                "same gas: time it by its gauge.");
  cylinders.footnotes.push_back("Flow as set on a flowmeter calibrated at sea level; gauge read "
                                "against 1 atm.");
  card.tables = {air, bag, cylinders};
  card.assumptions = {"Atmosphere model for medical figures: " + model + ".",
                      "All figures are for healthy adults at rest; the casualty comes first."};
  return card;
}

std::string table_csv(const Table& table) {
  auto field = [](const std::string& text) {
    bool quote = text.find_first_of(",\"\r\n") != std::string::npos || text.rfind(' ', 0) == 0;
    if (!quote) return text;
    std::string out = "\"";
    for (char c : text) out += c == '"' ? std::string("\"\"") : std::string(1, c);
    return out + "\"";
  };
  std::string csv;
  auto line = [&](const std::vector<std::string>& cells) {
    for (size_t i = 0; i < cells.size(); ++i) csv += (i ? "," : "") + field(cells[i]);
    csv += "\r\n";
  };
  line(table.header);
  for (const auto& row : table.rows) line(row);
  return csv;
}

}  // namespace firn::pocket_card
