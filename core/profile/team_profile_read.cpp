// Reading the current schema: every field checked, every problem named with its path.
#include "profile/team_profile_internal.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <functional>
#include <initializer_list>

namespace firn::team_profile::internal {

using namespace units;

std::string child(const std::string& path, std::string_view key) {
  return path.empty() ? std::string(key) : path + "." + std::string(key);
}
std::string item(const std::string& path, size_t index) {
  return path + "[" + std::to_string(index) + "]";
}

// At most `max_bytes` of `text`, cut between characters, any byte that is not UTF-8 shown as '?':
// problem lines reach the screen and JSON output (fuzz finding: a cut or a raw byte broke both).
static std::string utf8_shown(std::string_view text, size_t max_bytes) {
  std::string out;
  for (size_t i = 0; i < text.size();) {
    auto byte = [&](size_t k) { return static_cast<unsigned char>(text[k]); };
    size_t n = byte(i) < 0x80 ? 1 : (byte(i) & 0xE0) == 0xC0 ? 2 : (byte(i) & 0xF0) == 0xE0 ? 3
             : (byte(i) & 0xF8) == 0xF0 ? 4 : 0;
    for (size_t k = 1; n > 1 && k < n; ++k) n = i + k < text.size() && (byte(i + k) & 0xC0) == 0x80 ? n : 0;
    if (out.size() + std::max<size_t>(n, 1) > max_bytes) break;
    out += n == 0 ? std::string("?") : std::string(text.substr(i, n));
    i += std::max<size_t>(n, 1);
  }
  return out;
}

namespace {

// "450bar" as the user wrote it, plus the value in the limit's unit when that differs.
std::string as_written(const std::string& text, double value_in_limit_unit,
                       std::string_view limit_unit) {
  // Compared without spaces, case or degree signs: "-70C" is already "-70 °C".
  auto simplified = [](std::string_view s) {
    std::string out;
    for (unsigned char c : s) {
      if (c != ' ' && c != 0xC2 && c != 0xB0) out += static_cast<char>(std::tolower(c));
    }
    return out;
  };
  std::string compact = simplified(text);
  std::string same = simplified(format_number(value_in_limit_unit, 2) + std::string(limit_unit));
  if (compact == same) return format_number(value_in_limit_unit, 2) + " " + std::string(limit_unit);
  return text + " (" + format_number(value_in_limit_unit, 2) + " " + std::string(limit_unit) + ")";
}

std::string range_text(double low, double high, std::string_view unit) {
  return format_number(low) + "\xE2\x80\xA6" + format_number(high) + " " + std::string(unit);
}


// "cylinders[2].fill_pressure" → "fill pressure": how unit parsers name the field.
std::string field_words(const std::string& path) {
  size_t dot = path.find_last_of('.');
  std::string last = dot == std::string::npos ? path : path.substr(dot + 1);
  if (size_t bracket = last.find('['); bracket != std::string::npos) last.erase(bracket);
  for (char& c : last) c = c == '_' ? ' ' : c;
  return last;
}

// Reads typed fields out of JSON objects, recording a problem (path: what is wrong) for every
// field that is missing, of the wrong kind or out of range.
class Reader {
 public:
  explicit Reader(Problems& problems) : problems_(problems) {}

  void fail(const std::string& path, const std::string& message) {
    problems_.lines.push_back(path + ": " + message);
  }

  const Json* field(const Json& object, const std::string& path, std::string_view key,
                    bool required, std::string_view example) {
    const Json* found = object.find(key);
    if (!found && required) fail(child(path, key), "is missing (example: " + std::string(example) + ")");
    return found;
  }

  bool object(const Json& value, const std::string& path) {
    if (value.is_object()) return true;
    fail(path, "must be an object {…}, got " + json::shown(value));
    return false;
  }

  bool array(const Json& value, const std::string& path, size_t low, size_t high) {
    if (!value.is_array()) {
      fail(path, "must be a list […], got " + json::shown(value));
      return false;
    }
    if (value.size() < low || value.size() > high) {
      fail(path, std::to_string(value.size()) + " entries is outside " + std::to_string(low) +
                     "\xE2\x80\xA6" + std::to_string(high) + " entries");
      return false;
    }
    return true;
  }

  void reject_unknown(const Json& object, const std::string& path,
                      std::initializer_list<std::string_view> known) {
    for (const std::string& key : json::unknown_keys(object, known)) {
      fail(child(path, key), "unknown field (a typo?)");
    }
  }

  std::optional<std::string> text(const Json& object, const std::string& path,
                                  std::string_view key, bool required, size_t low_chars,
                                  size_t max_chars, std::string_view example) {
    const Json* value = field(object, path, key, required, example);
    if (!value) return std::nullopt;
    return text_value(*value, child(path, key), low_chars, max_chars);
  }

  std::optional<std::string> text_value(const Json& value, const std::string& path,
                                        size_t low_chars, size_t max_chars) {
    if (!value.is_string()) {
      fail(path, "must be text in quotes, got " + json::shown(value));
      return std::nullopt;
    }
    const std::string& s = value.as_string();
    if (s.size() < low_chars || s.size() > max_chars) {
      fail(path, std::to_string(s.size()) + " characters is outside " +
                     std::to_string(low_chars) + "\xE2\x80\xA6" + std::to_string(max_chars) +
                     " characters");
      return std::nullopt;
    }
    return s;
  }

  // A quantity written as text with its unit ("200bar"), checked against [low, high] in `unit`.
  template <class D>
  std::optional<Quantity<D>> quantity(
      const Json& object, const std::string& path, std::string_view key, bool required,
      const std::function<Result<Quantity<D>>(std::string_view, std::string_view)>& parse,
      const ReadingUnit<D>& unit, double low, double high, std::string_view example) {
    const Json* value = field(object, path, key, required, example);
    if (!value) return std::nullopt;
    return quantity_value(*value, child(path, key), parse, unit, low, high, example);
  }

  template <class D>
  std::optional<Quantity<D>> quantity_value(
      const Json& value, const std::string& path,
      const std::function<Result<Quantity<D>>(std::string_view, std::string_view)>& parse,
      const ReadingUnit<D>& unit, double low, double high, std::string_view example) {
    if (!value.is_string()) {
      fail(path, json::shown(value) + " needs its unit, written as text like \"" +
                     std::string(example) + "\"");
      return std::nullopt;
    }
    const std::string& text = value.as_string();
    Result<Quantity<D>> parsed = parse(text, field_words(path));
    if (!parsed) {
      fail(path, parsed.error().message);
      return std::nullopt;
    }
    double in_unit = parsed->in(unit);
    if (!in_range(in_unit, low, high)) {
      fail(path, as_written(text, in_unit, unit.symbol) + " is outside " +
                     range_text(low, high, unit.symbol));
      return std::nullopt;
    }
    return parsed.value();
  }

  std::optional<int> integer(const Json& object, const std::string& path, std::string_view key,
                             int low, int high) {
    const Json* value = field(object, path, key, true, std::to_string(low + 1));
    if (!value) return std::nullopt;
    std::string where = child(path, key);
    if (!value->is_number_integer()) {
      fail(where, "must be a whole number, got " + json::shown(*value));
      return std::nullopt;
    }
    long long n = value->as_integer();
    if (n < low || n > high) {
      fail(where, std::to_string(n) + " is outside " + std::to_string(low) + "\xE2\x80\xA6" +
                      std::to_string(high));
      return std::nullopt;
    }
    return static_cast<int>(n);
  }

 private:
  Problems& problems_;
};

using Limits = team_profile::Limits;

const std::function<Result<Length>(std::string_view, std::string_view)> length_parser =
    [](std::string_view t, std::string_view w) { return parse_length(t, w); };
// A bag gauge is marked in any pressure unit; cylinder gauges in bar, psi, kPa or MPa only.
const std::function<Result<GaugePressure>(std::string_view, std::string_view)> bag_gauge_parser =
    [](std::string_view t, std::string_view w) { return parse_gauge_any_unit(t, w); };
const std::function<Result<GaugePressure>(std::string_view, std::string_view)> gauge_parser =
    [](std::string_view t, std::string_view w) { return parse_gauge_pressure(t, w); };
const std::function<Result<Temperature>(std::string_view, std::string_view)> temperature_parser =
    [](std::string_view t, std::string_view w) { return parse_temperature(t, w); };
const std::function<Result<Volume>(std::string_view, std::string_view)> volume_parser =
    [](std::string_view t, std::string_view w) { return parse_volume(t, w); };
const std::function<Result<VolumeFlow>(std::string_view, std::string_view)> flow_parser =
    [](std::string_view t, std::string_view w) { return parse_volume_flow(t, w); };
const std::function<Result<Duration>(std::string_view, std::string_view)> duration_parser =
    [](std::string_view t, std::string_view w) { return parse_duration(t, w); };
// "1%": the percent sign is required so a fraction (0.01) is never mistaken for a percentage.
const std::function<Result<Fraction>(std::string_view, std::string_view)> percent_parser =
    [](std::string_view t, std::string_view w) -> Result<Fraction> {
  std::string_view s = t;
  while (!s.empty() && s.back() == ' ') s.remove_suffix(1);
  if (s.empty() || s.back() != '%') {
    return Error{"'" + std::string(t) + "' needs a % sign (example: 1%)"};
  }
  s.remove_suffix(1);
  Result<double> n = parse_number(s, w);
  if (!n) return n.error();
  return percent(n.value());
};

std::optional<CylinderType> read_cylinder(Reader& r, const Json& value, const std::string& path) {
  if (!r.object(value, path)) return std::nullopt;
  r.reject_unknown(value, path, {"label", "size", "water_capacity", "fill_pressure", "count"});
  CylinderType c;
  bool ok = true;
  auto label = r.text(value, path, "label", true, 1, Limits::label_chars_max, "\"2 L alloy\"");
  ok = ok && label;
  if (const Json* size = r.field(value, path, "size", false, "\"D\"")) {
    Result<LetterSize> parsed = Error{""};
    if (size->is_string()) parsed = cylinder::parse_letter_size(size->as_string());
    if (!parsed) {
      r.fail(child(path, "size"), json::shown(*size) + " is not a US letter size: use D, E, M or H");
      ok = false;
    } else {
      c.letter_size = parsed.value();
    }
  }
  auto capacity = r.quantity(value, path, "water_capacity", false, volume_parser, litres,
                             Limits::water_capacity_low_l, Limits::water_capacity_high_l, "2L");
  if (value.contains("water_capacity") && !capacity) ok = false;
  c.water_capacity = capacity;
  if (!value.contains("size") && !value.contains("water_capacity")) {
    r.fail(path, "needs a water_capacity (e.g. \"2L\") or a US letter size (\"size\": \"D\")");
    ok = false;
  }
  auto fill = r.quantity(value, path, "fill_pressure", true, gauge_parser, bar,
                         Limits::fill_pressure_low_bar, Limits::fill_pressure_high_bar, "200bar");
  auto count = r.integer(value, path, "count", Limits::count_low, Limits::count_high);
  if (!ok || !fill || !count) return std::nullopt;
  c.label = *label;
  c.fill_pressure_gauge = *fill;
  c.count = *count;
  return c;
}

// Both parts optional: a missing one keeps its default.
std::optional<SafetyMargin> read_margin(Reader& r, const Json& value, const std::string& path) {
  if (!r.object(value, path)) return std::nullopt;
  r.reject_unknown(value, path, {"minimum", "share"});
  SafetyMargin margin;
  bool ok = true;
  if (value.contains("minimum")) {
    auto minimum = r.quantity(value, path, "minimum", false, duration_parser, minutes,
                              Limits::margin_minimum_low_min, Limits::margin_minimum_high_min,
                              "30min");
    if (minimum) margin.minimum = *minimum;
    ok = ok && minimum;
  }
  if (value.contains("share")) {
    auto share = r.quantity(value, path, "share", false, percent_parser, percent,
                            Limits::margin_share_low_pct, Limits::margin_share_high_pct, "20%");
    if (share) margin.share = *share;
    ok = ok && share;
  }
  if (!ok) return std::nullopt;
  return margin;
}

std::optional<CardLayout> read_card(Reader& r, const Json& value, const std::string& path) {
  if (!r.object(value, path)) return std::nullopt;
  r.reject_unknown(value, path, {"altitude_from", "altitude_to", "altitude_step", "notes"});
  auto from = r.quantity(value, path, "altitude_from", true, length_parser, metres,
                         Limits::card_altitude_low_m, Limits::card_altitude_high_m, "1500m");
  auto to = r.quantity(value, path, "altitude_to", true, length_parser, metres,
                       Limits::card_altitude_low_m, Limits::card_altitude_high_m, "6000m");
  auto step = r.quantity(value, path, "altitude_step", true, length_parser, metres,
                         Limits::card_step_low_m, Limits::card_step_high_m, "250m");
  CardLayout card;
  bool ok = from && to && step;
  if (const Json* notes = r.field(value, path, "notes", false, "")) {
    std::string notes_path = child(path, "notes");
    if (r.array(*notes, notes_path, 0, Limits::note_lines_max)) {
      for (size_t i = 0; i < notes->size(); ++i) {
        auto line = r.text_value((*notes)[i], item(notes_path, i), 1, Limits::note_chars_max);
        if (line) card.notes.push_back(*line);
        ok = ok && line;
      }
    } else {
      ok = false;
    }
  }
  if (from && to && !(*to > *from)) {
    r.fail(child(path, "altitude_to"), "must be above altitude_from");
    ok = false;
  }
  if (from && to && step && *to > *from) {
    double rows = std::floor((*to - *from) / *step + 1e-9) + 1.0;
    if (rows > static_cast<double>(Limits::card_rows_max)) {
      r.fail(child(path, "altitude_step"),
             format_number(rows, 0) + " card rows is more than " +
                 std::to_string(Limits::card_rows_max) + ": use a larger step or a smaller range");
      ok = false;
    }
  }
  if (!ok) return std::nullopt;
  card.altitude_from = *from;
  card.altitude_to = *to;
  card.altitude_step = *step;
  return card;
}

std::optional<BagSetup> read_bag(Reader& r, const Json& value, const std::string& path) {
  if (!r.object(value, path)) return std::nullopt;
  r.reject_unknown(value, path, {"gauge_pressure", "pump_stroke_volume", "co2_limit"});
  auto gauge = r.quantity(value, path, "gauge_pressure", true, bag_gauge_parser, hectopascals,
                          Limits::bag_gauge_low_hpa, Limits::bag_gauge_high_hpa, "2psi");
  auto stroke = r.quantity(value, path, "pump_stroke_volume", true, volume_parser, litres,
                           Limits::stroke_low_l, Limits::stroke_high_l, "3L");
  auto co2 = r.quantity(value, path, "co2_limit", true, percent_parser, percent,
                        Limits::co2_limit_low_pct, Limits::co2_limit_high_pct, "1%");
  if (!gauge || !stroke || !co2) return std::nullopt;
  return BagSetup{*gauge, *stroke, *co2};
}

std::optional<EvacuationSection> read_evacuation(Reader& r, const Json& value,
                                              const std::string& path,
                                              const std::vector<CylinderType>& types,
                                              bool types_ok) {
  if (!r.object(value, path)) return std::nullopt;
  r.reject_unknown(value, path, {"duration", "altitude", "cylinders", "phases", "count_in"});
  EvacuationSection plan;
  bool ok = true;
  auto known_type = [&](const std::string& label, const std::string& where) {
    if (!types_ok) return false;  // the inventory itself has problems, already reported
    for (const CylinderType& t : types) {
      if (t.label == label) return true;
    }
    std::string known;
    for (const CylinderType& t : types) known += (known.empty() ? "" : ", ") + ("\"" + t.label + "\"");
    r.fail(where, "\"" + label + "\" is not a cylinder label in cylinders (" + known + ")");
    return false;
  };
  auto duration = r.quantity(value, path, "duration", true, duration_parser, hours,
                             Limits::evacuation_low_h, Limits::evacuation_high_h, "6h");
  ok = ok && duration;
  if (value.contains("altitude")) {
    plan.altitude = r.quantity(value, path, "altitude", false, length_parser, metres,
                               Limits::card_altitude_low_m, Limits::card_altitude_high_m, "4200m");
    ok = ok && plan.altitude;
  }
  if (const Json* list = r.field(value, path, "cylinders", true, "[{\"type\": …}]")) {
    std::string list_path = child(path, "cylinders");
    if (r.array(*list, list_path, 1, Limits::cylinders_on_hand_max)) {
      for (size_t i = 0; i < list->size(); ++i) {
        const Json& entry = (*list)[i];
        std::string p = item(list_path, i);
        if (!r.object(entry, p)) { ok = false; continue; }
        r.reject_unknown(entry, p, {"type", "pressure", "temperature"});
        auto type = r.text(entry, p, "type", true, 1, Limits::label_chars_max, "\"2 L alloy\"");
        auto pressure = r.quantity(entry, p, "pressure", true, gauge_parser, bar,
                                   Limits::on_hand_pressure_low_bar,
                                   Limits::on_hand_pressure_high_bar, "180bar");
        std::optional<Temperature> temperature = cylinder::assumed_temperature;
        if (entry.contains("temperature")) {
          temperature = r.quantity(entry, p, "temperature", false, temperature_parser, celsius,
                                   Limits::temperature_low_c, Limits::temperature_high_c, "-10C");
        }
        bool type_ok = type && known_type(*type, child(p, "type"));
        if (!type_ok || !pressure || !temperature) { ok = false; continue; }
        plan.cylinders.push_back({*type, *pressure, *temperature});
      }
    } else {
      ok = false;
    }
  } else {
    ok = false;
  }
  if (const Json* list = r.field(value, path, "phases", true, "[{\"flow\": \"15L/min\", …}]")) {
    std::string list_path = child(path, "phases");
    if (r.array(*list, list_path, 1, Limits::phases_max)) {
      for (size_t i = 0; i < list->size(); ++i) {
        const Json& entry = (*list)[i];
        std::string p = item(list_path, i);
        if (!r.object(entry, p)) { ok = false; continue; }
        r.reject_unknown(entry, p, {"flow", "duration"});
        auto flow = r.quantity(entry, p, "flow", true, flow_parser, litres_per_minute, 0.0,
                               Limits::flow_high_lpm, "6L/min");
        bool last = i + 1 == list->size();
        std::optional<Duration> phase_time;
        if (entry.contains("duration") || !last) {
          phase_time = r.quantity(entry, p, "duration", true, duration_parser, minutes, 1.0,
                                  Limits::evacuation_high_h * 60.0, "60min");
          if (!phase_time) { ok = false; continue; }
        }
        if (flow && *flow > litres_per_minute(0) && *flow < litres_per_minute(cylinder::min_flow_lpm)) {
          r.fail(child(p, "flow"), "is below 0.1 L/min: write 0 (oxygen off) or at least 0.1L/min");
          flow.reset();
        }
        if (!flow) { ok = false; continue; }
        plan.phases.push_back({*flow, phase_time});
      }
    } else {
      ok = false;
    }
  } else {
    ok = false;
  }
  if (auto count_in = r.text(value, path, "count_in", false, 1, Limits::label_chars_max, "")) {
    ok = known_type(*count_in, child(path, "count_in")) && ok;
    plan.shortfall_type_label = *count_in;
  } else if (value.contains("count_in")) {
    ok = false;
  }
  if (!ok) return std::nullopt;
  plan.evacuation_time = *duration;
  return plan;
}

}  // namespace

// Reads a current-schema document. Returns a profile only when nothing is wrong.
// demo, team_name, units and atmosphere_model into `p`; false when one is wrong (said in the problems).
bool read_settings(Reader& r, const Json& root, TeamProfile& p) {
  const std::string top;
  bool ok = true;
  if (const Json* demo = r.field(root, top, "demo", false, "")) {
    if (demo->is_boolean()) {
      p.demo = demo->as_bool();
    } else {
      r.fail("demo", "must be true or false, got " + json::shown(*demo));
      ok = false;
    }
  }
  if (auto name = r.text(root, top, "team_name", true, 1, Limits::team_name_max_chars,
                         "\"Valley Rescue\"")) {
    p.team_name = *name;
  } else {
    ok = false;
  }
  if (auto system = r.text(root, top, "units", true, 1, 20, "\"metric\"")) {
    if (*system == "metric") {
      p.units = UnitSystem::Metric;
    } else if (*system == "us") {
      p.units = UnitSystem::Us;
    } else {
      r.fail("units", "\"" + *system + "\" is not a unit system: use \"metric\" or \"us\"");
      ok = false;
    }
  } else {
    ok = false;
  }
  if (auto model = r.text(root, top, "atmosphere_model", true, 1, 20, "\"west\"")) {
    Result<atmosphere::Model> parsed = atmosphere::parse_model(*model);
    if (parsed) {
      p.atmosphere_model = parsed.value();
    } else {
      r.fail("atmosphere_model", "\"" + *model + "\": use \"west\" or \"isa\"");
      ok = false;
    }
  } else {
    ok = false;
  }
  return ok;
}

// The cylinder types into `p`, each label once; false when the list or one type is wrong.
bool read_cylinders(Reader& r, const Json& root, TeamProfile& p) {
  const Json* list = r.field(root, std::string(), "cylinders", true, "[{\"label\": …}]");
  if (list == nullptr || !r.array(*list, "cylinders", 1, Limits::cylinder_types_max)) return false;
  bool ok = true;
  for (size_t i = 0; i < list->size(); ++i) {
    auto c = read_cylinder(r, (*list)[i], item("cylinders", i));
    if (c && p.find_cylinder(c->label)) {
      r.fail(item("cylinders", i) + ".label", "\"" + c->label + "\" is used twice");
      c.reset();
    }
    if (c) p.cylinders.push_back(*c);
    ok = ok && c;
  }
  return ok;
}

// Optional: without it the one default reserve of the CLI and the app. Below every type's fill.
std::optional<GaugePressure> read_reserve(Reader& r, const Json& root, const TeamProfile& p,
                                          bool cylinders_ok) {
  std::optional<GaugePressure> reserve = cylinder::default_reserve_gauge;
  if (root.contains("reserve_pressure")) {
    reserve = r.quantity(root, std::string(), "reserve_pressure", false, gauge_parser, bar,
                         Limits::reserve_low_bar, Limits::reserve_high_bar, "20bar");
  }
  if (!reserve || !cylinders_ok) return reserve;
  for (size_t i = 0; i < p.cylinders.size(); ++i) {
    if (!(*reserve < p.cylinders[i].fill_pressure_gauge)) {
      r.fail("reserve_pressure", "must be below cylinders[" + std::to_string(i) +
                                     "].fill_pressure (" +
                                     format_number(p.cylinders[i].fill_pressure_gauge.in(bar), 1) +
                                     " bar)");
      return std::nullopt;
    }
  }
  return reserve;
}

// The team's usual flows into `p`; false when the list or one flow is wrong.
bool read_flows(Reader& r, const Json& root, TeamProfile& p) {
  const Json* list = r.field(root, std::string(), "flows", true, "[\"2L/min\", \"15L/min\"]");
  if (list == nullptr || !r.array(*list, "flows", 1, Limits::flows_max)) return false;
  bool ok = true;
  for (size_t i = 0; i < list->size(); ++i) {
    const Json& v = (*list)[i];
    // Flows are L/min across Firn: a bare number is accepted as L/min.
    Json text = v.is_number() ? Json(v.dump() + "L/min") : v;
    auto flow = r.quantity_value(text, item("flows", i), flow_parser, litres_per_minute,
                                 Limits::flow_low_lpm, Limits::flow_high_lpm, "6L/min");
    if (flow) p.flows.push_back(*flow);
    ok = ok && flow;
  }
  return ok;
}

std::optional<TeamProfile> read_current(const Json& root, Problems& problems) {
  Reader r(problems);
  const std::string top;
  r.reject_unknown(root, top,
                   {"schema_version", "demo", "team_name", "units", "atmosphere_model", "card",
                    "cylinders", "reserve_pressure", "safety_margin", "flows", "bag",
                    "evacuation"});
  TeamProfile p;
  // Every section is read (and its problems listed) even after one has failed.
  bool ok = read_settings(r, root, p);
  std::optional<CardLayout> card;
  if (const Json* v = r.field(root, top, "card", true, "{\"altitude_from\": \"1500m\", …}")) {
    card = read_card(r, *v, "card");
  }
  ok = ok && card;
  bool cylinders_ok = read_cylinders(r, root, p);
  ok = ok && cylinders_ok;
  std::optional<GaugePressure> reserve = read_reserve(r, root, p, cylinders_ok);
  ok = ok && reserve;
  if (const Json* v = r.field(root, top, "safety_margin", false, "")) {
    std::optional<SafetyMargin> margin = read_margin(r, *v, "safety_margin");
    if (margin) p.safety_margin = *margin;
    ok = ok && margin;
  }
  ok = read_flows(r, root, p) && ok;
  std::optional<BagSetup> bag;
  if (const Json* v = r.field(root, top, "bag", true, "{\"gauge_pressure\": \"2psi\", …}")) {
    bag = read_bag(r, *v, "bag");
  }
  ok = ok && bag;
  if (const Json* v = r.field(root, top, "evacuation", false, "")) {
    p.evacuation = read_evacuation(r, *v, "evacuation", p.cylinders, cylinders_ok);
    ok = ok && p.evacuation;
  }
  if (!ok || !problems.empty()) return std::nullopt;
  p.card = *card;
  p.reserve_pressure_gauge = *reserve;
  p.bag = *bag;
  return p;
}

// Parses text to JSON, reporting syntax errors with line and column.
std::optional<Json> parse_json(std::string_view text, Problems& problems) {
  json::Parsed parsed = json::parse(text);
  if (!parsed.ok && !parsed.error.limit.empty()) {
    problems.lines.push_back("the file is not a Firn file: " + parsed.error.limit);
    return std::nullopt;
  }
  if (!parsed.ok) {
    size_t line = 1, column = 1;
    for (size_t i = 0; i < parsed.error.offset && i < text.size(); ++i) {
      if (text[i] == '\n') { ++line; column = 1; } else { ++column; }
    }
    problems.lines.push_back("the file is not valid JSON: line " + std::to_string(line) +
                             ", column " + std::to_string(column) + " near '" +
                             utf8_shown(parsed.error.near, 20) + "'");
    return std::nullopt;
  }
  if (!parsed.value.is_object()) {
    problems.lines.push_back("the file must hold one JSON object {…}, got " + json::shown(parsed.value));
    return std::nullopt;
  }
  return std::move(parsed.value);
}

// The schema version of a parsed document, or a problem.
std::optional<int> schema_version(const Json& root, Problems& problems) {
  const Json* found = root.find("schema_version");
  if (!found) {
    problems.lines.push_back("schema_version: is missing (this Firn writes " +
                             std::to_string(current_schema_version) + ")");
    return std::nullopt;
  }
  if (!found->is_number_integer()) {
    problems.lines.push_back("schema_version: must be a whole number, got " + json::shown(*found));
    return std::nullopt;
  }
  long long v = found->as_integer();
  if (v < 1 || v > current_schema_version) {
    std::string hint = v > current_schema_version ? " (written by a newer Firn: update Firn)" : "";
    problems.lines.push_back("schema_version: " + std::to_string(v) + " is outside 1\xE2\x80\xA6" +
                             std::to_string(current_schema_version) + hint);
    return std::nullopt;
  }
  return static_cast<int>(v);
}

}  // namespace firn::team_profile::internal
