// Team profile: the public entry points (parse, check, migrate, write) and the writer.
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <initializer_list>

#include "profile/team_profile_internal.hpp"

namespace firn::team_profile {
namespace {

using internal::Json;
using namespace units;

// 17 significant digits of `value`, or of a neighbouring double, whose text `reads_back` to the
// exact value written: 17 digits name a double exactly, but a unit's scale can cost the last bit
// on the way back (fuzz and sweep findings: 15 digits, then a 6-decimal percentage, read back a
// rounding off and broke write → read = the same profile).
template <class ReadsBack>
std::string exact_digits(double value, const ReadsBack& reads_back) {
  char buffer[64];
  for (int steps = 0; steps <= 4; ++steps) {
    for (double direction : {INFINITY, -INFINITY}) {
      double candidate = value;
      for (int i = 0; i < steps; ++i) candidate = std::nextafter(candidate, direction);
      std::snprintf(buffer, sizeof buffer, "%.17g", candidate);
      if (reads_back(std::string(buffer))) return buffer;
    }
  }
  std::snprintf(buffer, sizeof buffer, "%.17g", value);
  return buffer;
}

// The shortest text of `q` that reads back to exactly the same value: the candidate unit
// needing the fewest decimals (≤ 3) wins, earlier candidates on a tie; so "2psi" stays "2psi"
// and "200bar" stays "200bar". `spellings` are what we write (ASCII, parseable).
template <class D>
std::string quantity_text(Quantity<D> q,
                          std::initializer_list<std::pair<const ReadingUnit<D>*, const char*>> candidates,
                          const std::function<Result<Quantity<D>>(std::string_view)>& parse) {
  std::string best;
  int best_decimals = 99;
  for (auto [unit, spelling] : candidates) {
    for (int decimals = 0; decimals <= 3 && decimals < best_decimals; ++decimals) {
      std::string text = format_number(q.in(*unit), decimals) + spelling;
      Result<Quantity<D>> back = parse(text);
      if (back && back.value() == q) {
        best = text;
        best_decimals = decimals;
        break;
      }
    }
  }
  if (!best.empty()) return best;
  const ReadingUnit<D>* unit = candidates.begin()->first;  // plain names: clang 14 cannot capture
  const std::string spelling = candidates.begin()->second;  // structured bindings
  return exact_digits(q.in(*unit), [&](const std::string& digits) {
           Result<Quantity<D>> back = parse(digits + spelling);
           return back && back.value() == q;
         }) + spelling;
}

std::string length_text(Length l, UnitSystem system) {
  auto parse = [](std::string_view t) { return parse_length(t); };
  if (system == UnitSystem::Us) return quantity_text<LengthDimension>(l, {{&feet, "ft"}, {&metres, "m"}}, parse);
  return quantity_text<LengthDimension>(l, {{&metres, "m"}, {&feet, "ft"}}, parse);
}

// A bag gauge pressure: in any pressure unit a bag gauge is marked in, read back the same way.
std::string bag_gauge_text(GaugePressure p, bool prefer_psi) {
  auto parse = [](std::string_view t) { return parse_gauge_any_unit(t); };
  if (prefer_psi) {
    return quantity_text<GaugePressureDimension>(
        p, {{&psi, "psi"}, {&bar, "bar"}, {&millibar, "mbar"}, {&kilopascals, "kPa"}}, parse);
  }
  return quantity_text<GaugePressureDimension>(
      p, {{&bar, "bar"}, {&psi, "psi"}, {&millibar, "mbar"}, {&kilopascals, "kPa"}}, parse);
}

// A cylinder gauge pressure: in the gauge units only (bar, psi, kPa, MPa), read back by the
// gauge parser.
std::string gauge_pressure_text(GaugePressure p, bool prefer_psi) {
  auto parse = [](std::string_view t) { return parse_gauge_pressure(t); };
  if (prefer_psi) {
    return quantity_text<GaugePressureDimension>(
        p, {{&psi, "psi"}, {&bar, "bar"}, {&kilopascals, "kPa"}, {&megapascals, "MPa"}}, parse);
  }
  return quantity_text<GaugePressureDimension>(
      p, {{&bar, "bar"}, {&psi, "psi"}, {&kilopascals, "kPa"}, {&megapascals, "MPa"}}, parse);
}

std::string temperature_text(Temperature t, UnitSystem system) {
  auto parse = [](std::string_view s) { return parse_temperature(s); };
  if (system == UnitSystem::Us) {
    return quantity_text<TemperatureDimension>(t, {{&fahrenheit, "F"}, {&celsius, "C"}}, parse);
  }
  return quantity_text<TemperatureDimension>(t, {{&celsius, "C"}, {&fahrenheit, "F"}}, parse);
}

std::string volume_text(Volume v) {
  auto parse = [](std::string_view s) { return parse_volume(s); };
  return quantity_text<VolumeDimension>(v, {{&litres, "L"}, {&millilitres, "mL"}}, parse);
}

std::string flow_text(VolumeFlow f) {
  auto parse = [](std::string_view s) { return parse_volume_flow(s); };
  return quantity_text<VolumeFlowDimension>(f, {{&litres_per_minute, "L/min"}}, parse);
}

std::string duration_text(Duration d) {
  auto parse = [](std::string_view s) { return parse_duration(s); };
  return quantity_text<DurationDimension>(d, {{&hours, "h"}, {&minutes, "min"}, {&seconds, "s"}},
                                          parse);
}

// Read back as the reader does: a number, then percent().
std::string percent_text(Fraction f) {
  auto reads_back = [&](const std::string& digits) {
    Result<double> back = parse_number(digits, "CO2 limit");
    return back && percent(back.value()) == f;
  };
  for (int decimals = 0; decimals <= 6; ++decimals) {
    std::string text = format_number(f.in(percent), decimals);
    if (reads_back(text)) return text + "%";
  }
  return exact_digits(f.in(percent), reads_back) + "%";
}

}  // namespace

std::string Problems::joined(std::string_view separator) const {
  std::string text;
  for (const std::string& line : lines) {
    if (!text.empty()) text += separator;
    text += line;
  }
  return text;
}

const CylinderType* TeamProfile::find_cylinder(std::string_view label) const {
  for (const CylinderType& c : cylinders) {
    if (c.label == label) return &c;
  }
  return nullptr;
}

std::vector<Length> TeamProfile::card_altitudes() const {
  std::vector<Length> rows;
  double count = std::floor((card.altitude_to - card.altitude_from) / card.altitude_step + 1e-9);
  FIRN_ASSERT(count >= 0 && count < Limits::card_rows_max, "card range was not validated");
  for (int i = 0; i <= static_cast<int>(count); ++i) {
    rows.push_back(card.altitude_from + card.altitude_step * static_cast<double>(i));
  }
  return rows;
}

namespace {
// The file's JSON in the current schema: parsed, version checked, older versions migrated.
std::optional<Json> current_schema_json(std::string_view json_text, Problems& problems) {
  std::optional<Json> root = internal::parse_json(json_text, problems);
  if (!root) return std::nullopt;
  std::optional<int> version = internal::schema_version(*root, problems);
  if (!version) return std::nullopt;
  if (*version == 1) return internal::migrate_v1(*root, problems);
  return root;
}
}  // namespace

Problems check_profile(std::string_view json_text) {
  Problems problems;
  std::optional<Json> root = current_schema_json(json_text, problems);
  if (!root) return problems;
  std::optional<TeamProfile> profile = internal::read_current(*root, problems);
  FIRN_ASSERT(profile.has_value() == problems.empty(), "profile reader lost a problem");
  return problems;
}


Result<TeamProfile> parse_profile(std::string_view json_text) {
  Problems problems;
  std::optional<Json> root = current_schema_json(json_text, problems);
  if (!root) return Error{problems.joined()};
  std::optional<TeamProfile> profile = internal::read_current(*root, problems);
  if (!profile) return Error{problems.joined()};
  return std::move(*profile);
}

Result<std::string> migrate_to_current(std::string_view json_text) {
  Problems problems;
  std::optional<Json> root = current_schema_json(json_text, problems);
  if (!root) return Error{problems.joined()};
  return root->dump(2);
}

std::string serialize_profile(const TeamProfile& p) {
  Json root = Json::object();
  root["schema_version"] = current_schema_version;
  if (p.demo) root["demo"] = true;
  root["team_name"] = p.team_name;
  root["units"] = p.units == UnitSystem::Us ? "us" : "metric";
  root["atmosphere_model"] = std::string(atmosphere::model_key(p.atmosphere_model));
  Json card = Json::object();
  card["altitude_from"] = length_text(p.card.altitude_from, p.units);
  card["altitude_to"] = length_text(p.card.altitude_to, p.units);
  card["altitude_step"] = length_text(p.card.altitude_step, p.units);
  card["notes"] = p.card.notes;
  root["card"] = card;
  bool us = p.units == UnitSystem::Us;
  Json cylinders = Json::array();
  for (const CylinderType& c : p.cylinders) {
    Json entry = Json::object();
    entry["label"] = c.label;
    if (c.letter_size) entry["size"] = std::string(cylinder::letter_size_info(*c.letter_size).name);
    if (c.water_capacity) entry["water_capacity"] = volume_text(*c.water_capacity);
    entry["fill_pressure"] = gauge_pressure_text(c.fill_pressure_gauge, us || c.letter_size);
    entry["count"] = c.count;
    cylinders.push_back(entry);
  }
  root["cylinders"] = cylinders;
  root["reserve_pressure"] = gauge_pressure_text(p.reserve_pressure_gauge, us);
  root["safety_margin"] = Json{{"minimum", duration_text(p.safety_margin.minimum)},
                               {"share", percent_text(p.safety_margin.share)}};
  Json flows = Json::array();
  for (VolumeFlow f : p.flows) flows.push_back(flow_text(f));
  root["flows"] = flows;
  Json bag = Json::object();
  bag["gauge_pressure"] = bag_gauge_text(p.bag.gauge_pressure, true);
  bag["pump_stroke_volume"] = volume_text(p.bag.pump_stroke_volume);
  bag["co2_limit"] = percent_text(p.bag.co2_limit);
  root["bag"] = bag;
  if (p.evacuation) {
    const EvacuationSection& e = *p.evacuation;
    Json plan = Json::object();
    plan["duration"] = duration_text(e.evacuation_time);
    if (e.altitude) plan["altitude"] = length_text(*e.altitude, p.units);
    Json on_hand = Json::array();
    for (const CylinderOnHand& c : e.cylinders) {
      const CylinderType* type = p.find_cylinder(c.type_label);
      bool psi_gauge = us || (type && type->letter_size);
      on_hand.push_back(Json{{"type", c.type_label},
                             {"pressure", gauge_pressure_text(c.pressure_gauge, psi_gauge)},
                             {"temperature", temperature_text(c.temperature, p.units)}});
    }
    plan["cylinders"] = on_hand;
    Json phases = Json::array();
    for (const FlowPhase& phase : e.phases) {
      Json entry = Json{{"flow", flow_text(phase.flow)}};
      if (phase.duration) entry["duration"] = duration_text(*phase.duration);
      phases.push_back(entry);
    }
    plan["phases"] = phases;
    if (!e.shortfall_type_label.empty()) plan["count_in"] = e.shortfall_type_label;
    root["evacuation"] = plan;
  }
  return root.dump(2) + "\n";
}

TeamProfile demo_profile() {
  Result<TeamProfile> demo = parse_profile(demo_profile_json());
  FIRN_ASSERT(demo.ok(), "the built-in demo profile does not parse");
  return std::move(demo).value();
}

namespace {
evacuation::CylinderSpec spec_for(const CylinderType& type, std::string label,
                                  GaugePressure gauge, Temperature temperature) {
  return {std::move(label), type.letter_size, type.water_capacity, gauge, temperature};
}
}  // namespace

Result<evacuation::PlanInput> plan_input(const TeamProfile& p, std::optional<Pressure> measured_ambient) {
  if (!p.evacuation) {
    return Error{"evacuation: is missing (the plan needs the cylinders on hand, flow phases and "
                 "duration; see docs/team-profile.md)"};
  }
  const EvacuationSection& e = *p.evacuation;
  evacuation::PlanInput input;
  for (size_t i = 0; i < e.cylinders.size(); ++i) {
    const CylinderOnHand& c = e.cylinders[i];
    const CylinderType* type = p.find_cylinder(c.type_label);
    FIRN_ASSERT(type != nullptr, "validated profile lost a cylinder type");
    input.cylinders.push_back(spec_for(*type, "#" + std::to_string(i + 1) + " " + c.type_label,
                                       c.pressure_gauge, c.temperature));
  }
  for (const FlowPhase& phase : e.phases) input.phases.push_back({phase.flow, phase.duration});
  input.evacuation = e.evacuation_time;
  input.reserve_gauge = p.reserve_pressure_gauge;
  input.margin_minimum = p.safety_margin.minimum;
  input.margin_fraction = p.safety_margin.share.in(units::fraction);
  input.pressure_unit = p.units == UnitSystem::Us ? &units::psi : &units::bar;
  if (measured_ambient) {
    input.ambient_pressure = *measured_ambient;
  } else if (e.altitude) {
    Result<Pressure> ambient = atmosphere::pressure_at(*e.altitude, p.atmosphere_model);
    if (!ambient) return Error{"evacuation.altitude: " + ambient.error().message};
    input.ambient_pressure = ambient.value();
  }
  if (!e.shortfall_type_label.empty()) {
    const CylinderType* type = p.find_cylinder(e.shortfall_type_label);
    FIRN_ASSERT(type != nullptr, "validated profile lost its shortfall cylinder type");
    input.counting_cylinder =
        spec_for(*type, "full " + type->label, type->fill_pressure_gauge, cylinder::assumed_temperature);
  }
  return input;
}

}  // namespace firn::team_profile
