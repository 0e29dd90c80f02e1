#include "profile/pocket_card.hpp"

#include <algorithm>
#include <cmath>

#include "model/atmosphere.hpp"
#include "model/cylinder.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_cascade.hpp"

namespace firn::pocket_card {
namespace {

using namespace units;
using team_profile::TeamProfile;
using team_profile::UnitSystem;
namespace o2 = supplemental_oxygen;

const std::string dash = "\xE2\x80\x93";  // en dash for ranges

std::string whole(double value) { return format_number(std::round(value), 0); }

std::string altitude_text(Length l, UnitSystem system) {
  return system == UnitSystem::Us ? whole(l.in(feet)) : whole(l.in(metres));
}
// Equivalent altitudes to 10 m / 50 ft (the models are not better than that), rounded up as
// the bag's verdict rounds them: less descent claimed.
std::string coarse_altitude_text(Length l, UnitSystem system) {
  if (system == UnitSystem::Us) return format_number(hyperbaric_bag::altitude_rounded_up(l, feet, 50.0), 0);
  return format_number(hyperbaric_bag::altitude_rounded_up(l, metres, 10.0), 0);
}
// Barometric pressures: hPa (metric) or mmHg (US); gauge pressures: bar/hPa or psi. One unit
// per quantity on a card: a metric card never shows psi, a US card never bar.
std::string pb_text(Pressure p, UnitSystem system) {
  return system == UnitSystem::Us ? whole(p.in(mmhg)) : whole(p.in(hectopascals));
}
const char* altitude_unit(UnitSystem s) { return s == UnitSystem::Us ? "ft" : "m"; }
const char* pb_unit(UnitSystem s) { return s == UnitSystem::Us ? "mmHg" : "hPa"; }
const Unit<PressureDimension>& cylinder_gauge_unit(UnitSystem s) {
  return s == UnitSystem::Us ? psi : bar;
}
const Unit<PressureDimension>& bag_gauge_unit(UnitSystem s) {
  return s == UnitSystem::Us ? psi : hectopascals;
}
std::string gauge_text(GaugePressure p, const Unit<PressureDimension>& unit) {
  return whole(p.in(unit)) + " " + std::string(unit.symbol);
}

std::string band_text(const std::optional<expected_spo2::Band>& band, bool extrapolated) {
  if (!band) return out_of_range_text;
  return whole(band->low.in(percent)) + dash + whole(band->high.in(percent)) +
         (extrapolated ? extrapolated_mark : "");
}

units::Volume water_capacity_of(const team_profile::CylinderType& c) {
  if (c.water_capacity) return *c.water_capacity;
  FIRN_ASSERT(c.letter_size.has_value(), "profile cylinder without capacity or size");
  return cylinder::letter_size_info(*c.letter_size).water_capacity;
}

// Durations are rounded DOWN: a card must never promise oxygen that is not there.
std::string duration_text(const std::optional<Duration>& d, const std::string& note) {
  if (!d) return note;
  return format_number(std::floor(d->in(minutes)), 0);
}

// [SECTION] One function per table's model call (the integrator swaps a call here).

// Air, PiO2 and the expected SpO2 bands (expected_spo2::expected, as `firn oxygenation`).
void add_air_figures(const TeamProfile& p, AltitudeRow& row) {
  if (auto west = atmosphere::pressure_at(row.altitude, atmosphere::Model::West1996)) row.pb_west = *west;
  if (auto isa = atmosphere::pressure_at(row.altitude, atmosphere::Model::Isa)) row.pb_isa = *isa;
  Result<Pressure> pb = atmosphere::pressure_at(row.altitude, p.atmosphere_model);
  if (!pb) return;
  if (auto pio2 = cascade::inspired_po2(*pb, cascade::dry_air_fio2())) row.pio2 = *pio2;
  if (auto acute = expected_spo2::expected(*pb, cascade::Exposure::Acute)) {
    row.spo2_acute = acute->band;
    row.spo2_acute_extrapolated = acute->extrapolated;
  }
  if (auto acclimatised = expected_spo2::expected(*pb, cascade::Exposure::Acclimatised)) {
    row.spo2_acclimatised = acclimatised->band;
    row.spo2_acclimatised_extrapolated = acclimatised->extrapolated;
  }
  row.spo2_extrapolated = row.spo2_acute_extrapolated || row.spo2_acclimatised_extrapolated;
}

// The bag at the team's gauge (hyperbaric_bag::bag_at_altitude, as `firn bag`).
void add_bag_figures(const TeamProfile& p, AltitudeRow& row) {
  hyperbaric_bag::Settings bag;
  bag.gauge = p.bag.gauge_pressure;
  bag.co2_limit = p.bag.co2_limit;
  bag.stroke_volume = p.bag.pump_stroke_volume;
  Result<hyperbaric_bag::BagResult> result =
      hyperbaric_bag::bag_at_altitude(row.altitude, p.atmosphere_model, bag);
  if (!result || !result->required_flush) return;
  // The flush the bag's verdict needs (CO2 under the limit and O2 inside no worse than outside),
  // rounded up as printed; the equivalent altitude is the limiting one at that flush (the
  // pressure or the oxygen inside, whichever gives less descent), as `firn bag --flush`.
  bag.flush = litres_per_minute(std::ceil(result->required_flush->in(litres_per_minute)));
  Result<hyperbaric_bag::BagResult> flushed =
      hyperbaric_bag::bag_at_altitude(row.altitude, p.atmosphere_model, bag);
  if (!flushed || flushed->verdict != hyperbaric_bag::Verdict::Ok) return;
  row.bag_inside = flushed->inside_pressure;
  row.bag_equivalent = flushed->equivalent_altitude;
  row.bag_min_flush = bag.flush;
  row.bag_min_flush_strokes = result->required_flush_strokes_per_minute;
}

// Minutes to the reserve at full and half fill (cylinder::duration, as `firn cylinder`).
DurationRow duration_row(const TeamProfile& p, const team_profile::CylinderType& c) {
  DurationRow row{c.label, water_capacity_of(c), c.fill_pressure_gauge, c.count, {}};
  for (VolumeFlow flow : p.flows) {
    DurationCell cell;
    for (bool half : {false, true}) {
      GaugePressure gauge = half ? c.fill_pressure_gauge / 2.0 : c.fill_pressure_gauge;
      std::optional<Duration>& slot = half ? cell.half : cell.full;
      std::string& note = half ? cell.half_note : cell.full_note;
      if (!(gauge > p.reserve_pressure_gauge)) {
        note = "at reserve";
        continue;
      }
      cylinder::Reading reading{row.water_capacity, gauge, cylinder::assumed_temperature, atmospheres(1.0)};
      Result<cylinder::DurationEstimate> d = cylinder::duration(reading, p.reserve_pressure_gauge, flow);
      if (d) {
        // A letter size also has the US field rule: the lower of the two leads, as on screen and
        // in `firn cylinder` (the rule counts to its own 200 psi residual).
        std::optional<Duration> rule;
        if (c.letter_size) {
          if (Result<Duration> r = cylinder::field_rule_duration(*c.letter_size, gauge, flow)) rule = r.value();
        }
        slot = cylinder::leading_duration(d.value(), rule).duration;
      } else {
        note = out_of_range_text;
      }
    }
    row.by_flow.push_back(cell);
  }
  return row;
}

const o2::Device devices[] = {o2::Device::NasalCannula, o2::Device::SimpleMask,
                              o2::Device::NonRebreather};

// Lowest flow for the WMS target at the band's top (supplemental_oxygen::lowest_flow_for_target,
// as `firn oxygenation --device`).
FlowNeedRow flow_need_row(const TeamProfile& p, Length low, Length high) {
  FlowNeedRow row{low, high, {}};
  Result<Pressure> pb = atmosphere::pressure_at(high, p.atmosphere_model);
  for (o2::Device device : devices) {
    std::optional<o2::FlowForTarget> need;
    if (pb) {
      if (auto r = o2::lowest_flow_for_target(*pb, cascade::Exposure::Acute, device)) need = *r;
    }
    row.by_device.push_back(need);
  }
  return row;
}

// Bands of at least 500 m (or the card's step when larger) over the card's altitudes.
std::vector<FlowNeedRow> flow_need_rows(const TeamProfile& p, const std::vector<Length>& altitudes) {
  std::vector<FlowNeedRow> rows;
  if (altitudes.size() < 2) {
    if (!altitudes.empty()) rows.push_back(flow_need_row(p, altitudes[0], altitudes[0]));
    return rows;
  }
  size_t stride = static_cast<size_t>(std::max(1.0, std::ceil(500.0 / p.card.altitude_step.in(metres) - 1e-9)));
  for (size_t i = 0; i + 1 < altitudes.size(); i += stride) {
    size_t top = std::min(i + stride, altitudes.size() - 1);
    rows.push_back(flow_need_row(p, altitudes[i], altitudes[top]));
  }
  return rows;
}

// [SECTION] Tables (cell texts from the figures above).

Table air_table(const Card& card) {
  UnitSystem u = card.profile.units;
  std::string model = std::string(atmosphere::model_name(card.profile.atmosphere_model));
  Table air{"altitude", "Air and expected SpO2 on air (healthy lowlanders at rest)",
            {std::string("Alt ") + altitude_unit(u), std::string("PB West ") + pb_unit(u),
             std::string("PB ISA ") + pb_unit(u), "PiO2 mmHg", "SpO2 acute %",
             "SpO2 acclim. %"},
            {}, {}, {}};
  bool any_extrapolated = false;
  for (const AltitudeRow& r : card.altitudes) {
    air.rows.push_back({altitude_text(r.altitude, u),
                        r.pb_west ? pb_text(*r.pb_west, u) : out_of_range_text,
                        r.pb_isa ? pb_text(*r.pb_isa, u) : out_of_range_text,
                        r.pio2 ? whole(r.pio2->in(mmhg)) : out_of_range_text,
                        band_text(r.spo2_acute, r.spo2_acute_extrapolated),
                        band_text(r.spo2_acclimatised, r.spo2_acclimatised_extrapolated)});
    any_extrapolated = any_extrapolated || r.spo2_extrapolated;
  }
  std::string band = "The band is what a healthy lowlander shows at rest on air, not a target. "
                     "Well below it: hypoxaemia out of proportion, think HAPE.";
  std::string marked = std::string(extrapolated_mark) +
                       " Extrapolated beyond the published field data: no verdict from it, go by "
                       "clinical signs.";
  air.footnotes.push_back(band);
  if (any_extrapolated) air.footnotes.push_back(marked);
  air.footnotes.push_back("PB and PiO2 by " + model + "; PiO2 = 0.2095 \xC3\x97 (PB \xE2\x88\x92 47 mmHg).");
  air.pocket_notes = {"Healthy, at rest; not a target. Well below: think HAPE."};
  if (any_extrapolated) air.pocket_notes.push_back(std::string(extrapolated_mark) + " Extrapolated: no verdict from it.");
  return air;
}

Table bag_table(const Card& card) {
  const TeamProfile& p = card.profile;
  UnitSystem u = p.units;
  std::string model = std::string(atmosphere::model_name(p.atmosphere_model));
  Table bag{"bag", "Hyperbaric bag at " + gauge_text(p.bag.gauge_pressure, bag_gauge_unit(u)) + " gauge",
            {std::string("Alt ") + altitude_unit(u), std::string("Inside ") + pb_unit(u),
             std::string("Equiv. alt ") + altitude_unit(u), "Flush L/min", "Strokes /min"},
            {}, {}, {}};
  for (const AltitudeRow& r : card.altitudes) {
    std::vector<std::string> cells{altitude_text(r.altitude, u)};
    if (!r.bag_inside) {
      cells.insert(cells.end(), 4, out_of_range_text);
    } else {
      cells.push_back(pb_text(*r.bag_inside, u));
      cells.push_back(r.bag_equivalent ? coarse_altitude_text(*r.bag_equivalent, u)
                                       : "below sea level");
      // Flush and strokes rounded UP: the minimum must not be understated.
      cells.push_back(format_number(std::ceil(r.bag_min_flush->in(litres_per_minute)), 0));
      cells.push_back(r.bag_min_flush_strokes
                          ? format_number(std::ceil(*r.bag_min_flush_strokes), 0)
                          : std::string(out_of_range_text));
    }
    bag.rows.push_back(cells);
  }
  std::string limit = format_number(p.bag.co2_limit.in(percent), 2) + " %";
  std::string pump = format_number(p.bag.pump_stroke_volume.in(litres), 2) + " L pump";
  bag.footnotes.push_back("Flush: at least the L/min of fresh air shown (" + pump +
                          ": strokes/min) keeps CO2 below " + limit +
                          " and O2 inside no worse than outside, resting casualty (assumed). Less: "
                          "flush more, no descent.");
  bag.footnotes.push_back("Equiv. alt at that flush: the lesser descent of pressure and O2 (" + model +
                          "). O2 fed in: fire risk above 23.5 %. Reassess every 1" + dash +
                          "2 h; the bag buys time for descent.");
  bag.pocket_notes = {"Flush at least as shown (" + pump + "): CO2 < " + limit + ", O2 as outside.",
                      "Equiv. alt (" + model + "): lesser descent of pressure and O2. Reassess 1" + dash + "2 h."};
  return bag;
}

Table cylinder_table(const Card& card) {
  const TeamProfile& p = card.profile;
  const Unit<PressureDimension>& gauge = cylinder_gauge_unit(p.units);
  Table t{"cylinders", "Oxygen: minutes to the " + gauge_text(p.reserve_pressure_gauge, gauge) + " reserve",
          {"Cylinder", "Gauge " + std::string(gauge.symbol)}, {}, {}, {}};
  for (VolumeFlow f : p.flows) t.header.push_back(format_number(f.in(litres_per_minute), 2) + " L/min");
  for (const DurationRow& r : card.durations) {
    for (bool half : {false, true}) {
      std::string label = half ? "half" : r.label + " \xC3\x97" + std::to_string(r.count);
      std::vector<std::string> cells{label, whole((half ? r.fill_gauge / 2.0 : r.fill_gauge).in(gauge))};
      for (const DurationCell& cell : r.by_flow) {
        cells.push_back(half ? duration_text(cell.half, cell.half_note)
                             : duration_text(cell.full, cell.full_note));
      }
      t.rows.push_back(cells);
    }
  }
  t.footnotes.push_back("Minutes rounded down, flow as set on the flowmeter. Contents by the oxygen "
                        "equation of state at 15 \xC2\xB0" "C: a cold cylinder reads lower with the "
                        "same gas, so time it by its gauge.");
  t.pocket_notes = {"Minutes rounded down, flow as set. Contents at 15 \xC2\xB0" "C: time a cold "
                    "cylinder by its gauge."};
  return t;
}

std::string flow_cell(const std::optional<o2::FlowForTarget>& need) {
  if (!need) return out_of_range_text;
  std::string mark = need->at_flow.extrapolated ? extrapolated_mark : "";
  if (need->reached_on_air) return "air" + mark;
  if (!need->reachable) return "not reached" + mark;
  return format_number(need->flow.in(litres_per_minute), 1) + mark;
}
std::string litres_per_hour_cell(const std::optional<o2::FlowForTarget>& need) {
  if (!need || need->reached_on_air || !need->reachable) return dash;
  return whole((need->flow * hours(1.0)).in(litres));
}

Table oxygen_table(const Card& card) {
  UnitSystem u = card.profile.units;
  Table t{"oxygen",
          "Oxygen for SpO2 > " + format_number(o2::kDefaultTargetPercent, 0) +
              " % by altitude band: lowest flow and litres per hour",
          {std::string("Band ") + altitude_unit(u)}, {}, {}, {}};
  for (o2::Device d : devices) {
    t.header.push_back(std::string(o2::device_name(d)) + " L/min");
    t.header.push_back("L/h");
  }
  bool any_extrapolated = false;
  for (const FlowNeedRow& r : card.flow_needs) {
    std::vector<std::string> cells{altitude_text(r.band_low, u) + dash + altitude_text(r.band_high, u)};
    for (const auto& need : r.by_device) {
      cells.push_back(flow_cell(need));
      cells.push_back(litres_per_hour_cell(need));
      any_extrapolated = any_extrapolated || (need && need->at_flow.extrapolated);
    }
    t.rows.push_back(cells);
  }
  t.footnotes.push_back("For the low edge of the healthy band (acute exposure) at the top of each "
                        "band: a casualty with HAPE needs more. A starting point only: titrate to "
                        "the oximeter, target SpO2 > 90 % (WMS guidelines, Luks 2019).");
  t.footnotes.push_back("air: a healthy lowlander reaches the target without oxygen; a casualty may "
                        "not. not reached: not with this device, use the next one. Litres per hour "
                        "are free gas at the set flow (what the cylinder loses).");
  if (any_extrapolated) {
    t.footnotes.push_back(std::string(extrapolated_mark) +
                          " Extrapolated beyond the published field data: no verdict from it.");
  }
  t.pocket_notes = t.footnotes;
  return t;
}

}  // namespace

Result<Size> parse_size(std::string_view key) {
  if (key == "a6" || key == "A6") return Size::A6;
  if (key == "wallet") return Size::Wallet;
  if (key == "reference") return Size::Reference;
  return Error{"card size '" + std::string(key) +
               "': use a6 or wallet (pocket card), or reference (A4 team reference sheet)"};
}

std::string_view size_key(Size size) {
  switch (size) {
    case Size::A6: return "a6";
    case Size::Wallet: return "wallet";
    case Size::Reference: return "reference";
  }
  return "a6";
}

Card build_card(const TeamProfile& profile, const std::string& date) {
  Card card;
  card.profile = profile;
  card.date = date;
  card.version = FIRN_VERSION;
  std::vector<Length> altitudes = profile.card_altitudes();
  for (Length altitude : altitudes) {
    AltitudeRow row;
    row.altitude = altitude;
    add_air_figures(profile, row);
    add_bag_figures(profile, row);
    card.altitudes.push_back(row);
  }
  for (const auto& c : profile.cylinders) card.durations.push_back(duration_row(profile, c));
  card.flow_needs = flow_need_rows(profile, altitudes);
  card.tables = {air_table(card), bag_table(card), cylinder_table(card), oxygen_table(card)};
  std::string model = std::string(atmosphere::model_name(profile.atmosphere_model));
  card.assumptions = {"Atmosphere model for medical figures: " + model + ".",
                      "All figures are for healthy adults at rest; the casualty comes first."};
  // The two exposures of the expected-SpO2 model (oxygen_cascade.hpp, Exposure).
  card.exposure_definitions =
      "Acute: hours to 2 days at this altitude. Acclimatised: days to weeks there. In between "
      "(a week into a trek): between the two bands.";
  card.exposure_definitions_short =
      "Acute: first 2 days here. Acclim.: days\xE2\x80\x93weeks there.";
  return card;
}

const Table& table(const Card& card, std::string_view id) {
  auto it = std::find_if(card.tables.begin(), card.tables.end(),
                         [&](const Table& t) { return t.id == id; });
  FIRN_ASSERT(it != card.tables.end(), "card table id unknown");
  return *it;
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
    for (size_t i = 0; i < cells.size(); ++i) {
      if (i) csv += ',';
      csv += field(cells[i]);
    }
    csv += "\r\n";
  };
  line(table.header);
  for (const auto& row : table.rows) line(row);
  return csv;
}

}  // namespace firn::pocket_card
