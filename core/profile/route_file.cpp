// Reading a route file: every field checked, every problem named with its path, value and range
// (the team profile's message style; its JSON syntax reporting is shared).
#include "profile/route_file.hpp"

#include <cmath>
#include <cstdio>
#include <functional>
#include <initializer_list>

#include "model/hyperbaric_bag.hpp"
#include "profile/team_profile_internal.hpp"

namespace firn::route {
namespace {

using namespace units;
using team_profile::Problems;
using team_profile::internal::child;
using team_profile::internal::item;
using team_profile::internal::Json;

constexpr std::size_t kNameCharsMax = 60, kLabelCharsMax = 40;
const std::string kRange = "\xE2\x80\xA6";  // "…"

template <class D>
using Parser = std::function<Result<Quantity<D>>(std::string_view, std::string_view)>;

const Parser<LengthDimension> length_parser = [](std::string_view t, std::string_view w) {
  return parse_length(t, w);
};
// The route's gauge readings, in any pressure unit as the file has always taken them.
const Parser<GaugePressureDimension> gauge_parser = [](std::string_view t, std::string_view w) {
  return parse_gauge_any_unit(t, w);
};
const Parser<TemperatureDimension> temperature_parser = [](std::string_view t,
                                                           std::string_view w) {
  return parse_temperature(t, w);
};
const Parser<VolumeFlowDimension> flow_parser = [](std::string_view t, std::string_view w) {
  return parse_volume_flow(t, w);
};
const Parser<DurationDimension> duration_parser = [](std::string_view t, std::string_view w) {
  return parse_duration(t, w);
};
// "90%": the sign is required so 0.9 is never read as a percentage.
const Parser<FractionDimension> percent_parser =
    [](std::string_view t, std::string_view w) -> Result<Fraction> {
  std::string_view s = t;
  while (!s.empty() && s.back() == ' ') s.remove_suffix(1);
  if (s.empty() || s.back() != '%') {
    return Error{"'" + std::string(t) + "' needs a % sign (example: 90%)"};
  }
  s.remove_suffix(1);
  Result<double> n = parse_number(s, w);
  if (!n) return n.error();
  return percent(n.value());
};

// Field reader that records "path: problem" lines and returns nullopt for anything wrong.
class Reader {
 public:
  explicit Reader(Problems& p) : problems_(p) {}

  void fail(const std::string& path, const std::string& message) {
    problems_.lines.push_back(path + ": " + message);
  }

  bool object(const Json& v, const std::string& path) {
    if (v.is_object()) return true;
    fail(path, "must be an object {" + kRange + "}, got " + json::shown(v));
    return false;
  }

  bool list(const Json& v, const std::string& path, std::size_t low, std::size_t high) {
    if (!v.is_array()) {
      fail(path, "must be a list [" + kRange + "], got " + json::shown(v));
      return false;
    }
    if (v.size() < low || v.size() > high) {
      fail(path, std::to_string(v.size()) + " entries is outside " + std::to_string(low) +
                     kRange + std::to_string(high) + " entries");
      return false;
    }
    return true;
  }

  void only(const Json& obj, const std::string& path, std::initializer_list<std::string_view> known) {
    for (const std::string& key : json::unknown_keys(obj, known)) fail(child(path, key), "unknown field (a typo?)");
  }

  const Json* find(const Json& obj, const std::string& path, std::string_view key, bool required,
                   std::string_view example) {
    if (const Json* v = obj.find(key)) return v;
    if (required) fail(child(path, key), "is missing (example: " + std::string(example) + ")");
    return nullptr;
  }

  std::optional<std::string> text(const Json& obj, const std::string& path, std::string_view key,
                                  bool required, std::size_t max_chars, std::string_view example) {
    const Json* v = find(obj, path, key, required, example);
    if (!v) return std::nullopt;
    if (!v->is_string()) {
      fail(child(path, key), "must be text in quotes, got " + json::shown(*v));
      return std::nullopt;
    }
    const std::string& s = v->as_string();
    if (s.empty() || s.size() > max_chars) {
      fail(child(path, key), std::to_string(s.size()) + " characters is outside 1" + kRange +
                                 std::to_string(max_chars) + " characters");
      return std::nullopt;
    }
    return s;
  }

  // "5200m", checked against [low, high] in `unit`; the message quotes what was written.
  template <class D>
  std::optional<Quantity<D>> quantity(const Json& obj, const std::string& path,
                                      std::string_view key, bool required, const Parser<D>& parse,
                                      const ReadingUnit<D>& unit, double low, double high,
                                      std::string_view example) {
    const Json* v = find(obj, path, key, required, example);
    if (!v) return std::nullopt;
    std::string where = child(path, key);
    if (!v->is_string()) {
      fail(where, json::shown(*v) + " needs its unit, written as text like \"" +
                      std::string(example) + "\"");
      return std::nullopt;
    }
    const std::string& written = v->as_string();
    std::string words(key);
    for (char& c : words) c = c == '_' ? ' ' : c;
    Result<Quantity<D>> q = parse(written, words);
    if (!q) {
      fail(where, q.error().message);
      return std::nullopt;
    }
    if (!within(q.value(), low, high, unit)) {
      fail(where, written + " (" + format_number(q->in(unit), 2) + " " + std::string(unit.symbol) +
                      ") is outside " + format_number(low) + kRange + format_number(high) + " " +
                      std::string(unit.symbol));
      return std::nullopt;
    }
    return q.value();
  }

  // A flow that is 0 (none) or within [min, high] L/min.
  std::optional<VolumeFlow> flow_or_zero(const Json& obj, const std::string& path,
                                         std::string_view key, double high) {
    auto f = quantity(obj, path, key, false, flow_parser, litres_per_minute, 0.0, high, "2L/min");
    if (f && *f > litres_per_minute(0) && *f < litres_per_minute(cylinder::min_flow_lpm)) {
      fail(child(path, key), "is below " + format_number(cylinder::min_flow_lpm) +
                                 " L/min: write 0L/min (none) or 0.1" + kRange +
                                 format_number(high) + " L/min");
      return std::nullopt;
    }
    return f;
  }

 private:
  Problems& problems_;
};

std::optional<int> clock_minutes(Reader& r, const Json& root) {
  const Json* v = root.find("start_time");
  if (!v) return std::nullopt;
  int h = -1, m = -1;
  char tail = 0;
  if (v->is_string() && std::sscanf(v->as_string().c_str(), "%2d:%2d%c", &h,
                                    &m, &tail) == 2 && h >= 0 && h < 24 && m >= 0 && m < 60) {
    return h * 60 + m;
  }
  r.fail("start_time", json::shown(*v) + " is not a clock time 00:00" + kRange + "23:59 (\"07:30\")");
  return -1;
}

std::optional<Casualty> read_casualty(Reader& r, const Json& v) {
  const std::string path = "casualty";
  if (!r.object(v, path)) return std::nullopt;
  r.only(v, path, {"spo2_on_air", "measured_at", "exposure", "target_spo2", "device"});
  Casualty c;
  bool ok = true;
  c.measured_spo2_on_air = r.quantity(v, path, "spo2_on_air", false, percent_parser, percent,
                                      Limits::measured_low_pct, Limits::measured_high_pct, "78%");
  ok = ok && (c.measured_spo2_on_air || !v.contains("spo2_on_air"));
  c.measured_at = r.quantity(v, path, "measured_at", c.measured_spo2_on_air.has_value(),
                             length_parser, metres, Limits::altitude_low_m,
                             Limits::altitude_high_m, "5200m");
  ok = ok && (c.measured_at || !v.contains("measured_at")) &&
       (c.measured_at || !c.measured_spo2_on_air);
  if (auto e = r.text(v, path, "exposure", false, 20, "\"acute\"")) {
    if (*e == "acclimatised" || *e == "acclimatized") {
      c.exposure = cascade::Exposure::Acclimatised;
    } else if (*e != "acute") {
      r.fail("casualty.exposure", "\"" + *e + "\": use \"acute\" or \"acclimatised\"");
      ok = false;
    }
  } else {
    ok = ok && !v.contains("exposure");
  }
  if (v.contains("target_spo2")) {
    auto t = r.quantity(v, path, "target_spo2", false, percent_parser, percent,
                        Limits::target_low_pct, Limits::target_high_pct, "90%");
    if (t) c.target = *t;
    ok = ok && t;
  }
  if (auto d = r.text(v, path, "device", true, 20, "\"cannula\"")) {
    Result<supplemental_oxygen::Device> parsed = supplemental_oxygen::parse_device(*d);
    if (parsed) {
      c.device = parsed.value();
    } else {
      r.fail("casualty.device", parsed.error().message);
      ok = false;
    }
  } else {
    ok = false;
  }
  if (!ok) return std::nullopt;
  return c;
}

std::optional<Leg> read_leg(Reader& r, const Json& v, const std::string& path) {
  if (!r.object(v, path)) return std::nullopt;
  auto kind = r.text(v, path, "kind", true, 20, "\"carry\"");
  if (!kind) return std::nullopt;
  Leg leg;
  auto altitude = [&](std::string_view key, std::string_view example) {
    return r.quantity(v, path, key, true, length_parser, metres, Limits::altitude_low_m,
                      Limits::altitude_high_m, example);
  };
  std::optional<Length> from, to;
  if (*kind == "carry" || *kind == "walk") {
    r.only(v, path, {"kind", "label", "from", "to", "duration", "flow"});
    leg.kind = LegKind::Carry;
    from = altitude("from", "5200m");
    to = altitude("to", "4600m");
  } else if (*kind == "wait" || *kind == "bag") {
    leg.kind = *kind == "wait" ? LegKind::Wait : LegKind::Bag;
    if (leg.kind == LegKind::Wait) {
      r.only(v, path, {"kind", "label", "at", "duration", "flow"});
    } else {
      r.only(v, path, {"kind", "label", "at", "duration", "oxygen_feed", "flush"});
    }
    from = to = altitude("at", "4600m");
  } else if (*kind == "flight") {
    r.only(v, path, {"kind", "label", "cruise", "duration", "flow"});
    leg.kind = LegKind::Flight;
    from = to = altitude("cruise", "5800m");
  } else {
    r.fail(child(path, "kind"), "\"" + *kind + "\": use carry, walk, wait, bag or flight");
    return std::nullopt;
  }
  bool ok = from && to;
  if (auto label = r.text(v, path, "label", false, kLabelCharsMax, "\"over the col\"")) {
    leg.label = *label;
  } else {
    ok = ok && !v.contains("label");
  }
  auto duration = r.quantity(v, path, "duration", true, duration_parser, minutes,
                             Limits::leg_low_min, Limits::leg_high_h * 60.0, "90min");
  ok = ok && duration;
  if (v.contains("flow")) {
    // Checked against the device's own range by the plan (which names it).
    leg.fixed_flow = r.quantity(v, path, "flow", false, flow_parser, litres_per_minute,
                                cylinder::min_flow_lpm, 15.0, "4L/min");
    ok = ok && leg.fixed_flow;
  }
  if (v.contains("oxygen_feed")) {
    auto feed = r.flow_or_zero(v, path, "oxygen_feed", Limits::bag_feed_high_lpm);
    ok = ok && feed;
    if (feed) leg.bag_oxygen_feed = *feed;
  }
  if (v.contains("flush")) {
    leg.bag_flush = r.quantity(v, path, "flush", false, flow_parser, litres_per_minute,
                               hyperbaric_bag::min_flush_lpm, hyperbaric_bag::max_flush_lpm, "40L/min");
    ok = ok && leg.bag_flush;
  }
  if (leg.bag_oxygen_feed > litres_per_minute(0) && !v.contains("flush")) {
    r.fail(child(path, "flush"), "is missing: oxygen fed into the bag needs the bag's fresh-air "
                                 "flush (example: \"40L/min\")");
    ok = false;
  }
  if (!ok) return std::nullopt;
  leg.start_altitude = *from;
  leg.end_altitude = *to;
  leg.duration = *duration;
  return leg;
}

Volume water_of(const team_profile::CylinderType& t) {
  return t.water_capacity ? *t.water_capacity : cylinder::letter_size_info(*t.letter_size).water_capacity;
}

StockCylinder stock_cylinder(const team_profile::CylinderType& t, std::size_t index,
                             GaugePressure gauge, Temperature temperature) {
  return {"#" + std::to_string(index + 1) + " " + t.label, t.label, water_of(t), gauge, temperature};
}

// Shortfalls and spares counted in full cylinders of the profile's type `label` (if it has it).
void count_in_type(Stock& s, const team_profile::TeamProfile& profile, const std::string& label) {
  if (const team_profile::CylinderType* t = profile.find_cylinder(label)) {
    s.count_in_label = t->label;
    s.count_in_water_capacity = water_of(*t);
    s.count_in_fill_gauge = t->fill_pressure_gauge;
  }
}

// One cylinder on hand: a type from the team profile, its gauge reading and temperature.
std::optional<StockCylinder> read_cylinder(Reader& r, const Json& v, const std::string& path,
                                           const team_profile::TeamProfile& profile,
                                           std::size_t index) {
  if (!r.object(v, path)) return std::nullopt;
  r.only(v, path, {"type", "pressure", "temperature"});
  namespace tpl = team_profile;
  auto type = r.text(v, path, "type", true, tpl::Limits::label_chars_max, "\"2 L alloy\"");
  const tpl::CylinderType* t = type ? profile.find_cylinder(*type) : nullptr;
  if (type && !t) {
    std::string known;
    for (const tpl::CylinderType& c : profile.cylinders) {
      known += (known.empty() ? "\"" : ", \"") + c.label + "\"";
    }
    r.fail(child(path, "type"), "\"" + *type + "\" is not a cylinder type of team \"" +
                                    profile.team_name + "\" (" + known + ")");
  }
  double high_bar = t ? t->fill_pressure_gauge.in(bar) * kGaugeHighShareOfFill : tpl::Limits::fill_pressure_high_bar;
  auto pressure = r.quantity(v, path, "pressure", true, gauge_parser, bar, 0.0, high_bar,
                             "190bar");
  std::optional<Temperature> temperature = cylinder::assumed_temperature;
  if (v.contains("temperature")) {
    temperature = r.quantity(v, path, "temperature", false, temperature_parser, celsius,
                             tpl::Limits::temperature_low_c, tpl::Limits::temperature_high_c,
                             "-10C");
  }
  if (!t || !pressure || !temperature) return std::nullopt;
  return stock_cylinder(*t, index, *pressure, *temperature);
}

std::optional<Stock> read_stock(Reader& r, const Json& v, const team_profile::TeamProfile& profile) {
  const std::string path = "stock";
  if (!r.object(v, path)) return std::nullopt;
  r.only(v, path, {"cylinders", "reserve", "margin", "count_in", "second_consumer"});
  Stock s;
  bool ok = true;
  if (const Json* list = r.find(v, path, "cylinders", true, "[{\"type\": \"2 L alloy\", …}]")) {
    std::string lp = child(path, "cylinders");
    if (r.list(*list, lp, 1, Limits::cylinders_max)) {
      for (std::size_t i = 0; i < list->size(); ++i) {
        auto c = read_cylinder(r, (*list)[i], item(lp, i), profile, i);
        if (c) s.cylinders.push_back(*c);
        ok = ok && c;
      }
    } else {
      ok = false;
    }
  } else {
    ok = false;
  }
  s.reserve_gauge = profile.reserve_pressure_gauge;
  if (v.contains("reserve")) {
    auto reserve = r.quantity(v, path, "reserve", false, gauge_parser, bar,
                              team_profile::Limits::reserve_low_bar,
                              team_profile::Limits::reserve_high_bar, "20bar");
    if (reserve) s.reserve_gauge = *reserve;
    ok = ok && reserve;
  }
  auto margin = r.quantity(v, path, "margin", true, duration_parser, minutes,
                           Limits::margin_low_min, Limits::margin_high_h * 60.0, "30min");
  if (margin) s.margin = *margin;
  ok = ok && margin;
  std::string count_in = s.cylinders.empty() ? std::string() : s.cylinders.front().type_label;
  if (v.contains("count_in")) {
    auto label = r.text(v, path, "count_in", false, team_profile::Limits::label_chars_max, "");
    if (label && !profile.find_cylinder(*label)) {
      r.fail("stock.count_in", "\"" + *label + "\" is not a cylinder type of the team profile");
      label.reset();
    }
    ok = ok && label;
    if (label) count_in = *label;
  }
  count_in_type(s, profile, count_in);
  if (const Json* second = r.find(v, path, "second_consumer", false, "")) {
    std::string sp = child(path, "second_consumer");
    if (r.object(*second, sp)) {
      r.only(*second, sp, {"who", "flow"});
      auto who = r.text(*second, sp, "who", true, kLabelCharsMax, "\"crew member\"");
      auto flow = r.flow_or_zero(*second, sp, "flow", Limits::second_flow_high_lpm);
      if (!second->contains("flow")) r.fail(child(sp, "flow"), "is missing (example: 2L/min)");
      ok = ok && who && flow;
      if (who && flow) {
        s.second_who = *who;
        s.second_flow = *flow;
      }
    } else {
      ok = false;
    }
  }
  if (!ok) return std::nullopt;
  return s;
}

std::optional<int> schema_version(Reader& r, const Json& root) {
  const Json* v = r.find(root, "", "schema_version", true, std::to_string(current_route_schema_version));
  if (!v) return std::nullopt;
  if (!v->is_number_integer() || v->as_integer() < 1 ||
      v->as_integer() > current_route_schema_version) {
    std::string newer = v->is_number_integer() && v->as_integer() > current_route_schema_version
                            ? " (written by a newer Firn: update Firn)" : "";
    r.fail("schema_version", json::shown(*v) + " is outside 1" + kRange +
                                 std::to_string(current_route_schema_version) + newer);
    return std::nullopt;
  }
  return static_cast<int>(v->as_integer());
}

std::optional<RouteInput> read_root(Reader& r, const Json& root,
                                    const team_profile::TeamProfile& profile) {
  if (!schema_version(r, root)) return std::nullopt;
  r.only(root, "", {"schema_version", "demo", "name", "start_time", "casualty", "legs", "stock"});
  RouteInput in;
  in.model = profile.atmosphere_model;
  in.bag_gauge = profile.bag.gauge_pressure;
  in.flow_steps = profile.flows;
  bool ok = true;
  if (root.contains("demo")) {
    if (root["demo"].is_boolean()) {
      in.demo = root["demo"].as_bool();
    } else {
      r.fail("demo", "must be true or false, got " + json::shown(root["demo"]));
      ok = false;
    }
  }
  auto name = r.text(root, "", "name", true, kNameCharsMax, "\"Carry-out to the hut\"");
  ok = ok && name;
  in.start_clock_min = clock_minutes(r, root);
  ok = ok && in.start_clock_min.value_or(0) >= 0;
  std::optional<Casualty> casualty;
  if (const Json* v = r.find(root, "", "casualty", true, "{\"device\": \"cannula\", …}")) {
    casualty = read_casualty(r, *v);
  }
  ok = ok && casualty;
  bool legs_ok = false;
  if (const Json* list = r.find(root, "", "legs", true, "[{\"kind\": \"carry\", …}]")) {
    if (r.list(*list, "legs", 1, Limits::legs_max)) {
      legs_ok = true;
      for (std::size_t i = 0; i < list->size(); ++i) {
        auto leg = read_leg(r, (*list)[i], item("legs", i));
        if (leg) in.legs.push_back(*leg);
        legs_ok = legs_ok && leg;
      }
    }
  }
  ok = ok && legs_ok;
  if (legs_ok && casualty) {
    // A flow fixed by hand must suit the casualty's device.
    supplemental_oxygen::FlowRange range = supplemental_oxygen::valid_flows(casualty->device);
    for (std::size_t i = 0; i < in.legs.size(); ++i) {
      const std::optional<VolumeFlow>& f = in.legs[i].fixed_flow;
      if (f && (*f < range.low || *f > range.high)) {
        r.fail(child(item("legs", i), "flow"),
               format_number(f->in(litres_per_minute), 2) + " L/min is outside " +
                   format_number(range.low.in(litres_per_minute)) + kRange +
                   format_number(range.high.in(litres_per_minute)) + " L/min for a " +
                   std::string(supplemental_oxygen::device_name(casualty->device)));
        ok = false;
      }
    }
  }
  if (legs_ok) {
    double total = 0.0;
    for (const Leg& leg : in.legs) total += leg.duration.in(minutes);
    if (total > Limits::route_high_h * 60.0) {
      r.fail("legs", format_number(total, 0) + " min in all is outside 1" + kRange +
                         format_number(Limits::route_high_h * 60.0) + " min");
      ok = false;
    }
  }
  std::optional<Stock> stock;
  if (const Json* v = r.find(root, "", "stock", true, "{\"cylinders\": […], \"margin\": \"30min\"}")) {
    stock = read_stock(r, *v, profile);
  }
  ok = ok && stock;
  if (!ok) return std::nullopt;
  in.name = *name;
  in.casualty = *casualty;
  in.stock = *stock;
  return in;
}

}  // namespace

team_profile::Problems check_route_file(std::string_view json_text,
                                        const team_profile::TeamProfile& profile) {
  Problems problems;
  std::optional<Json> root = team_profile::internal::parse_json(json_text, problems);
  if (!root) return problems;
  Reader r(problems);
  std::optional<RouteInput> in = read_root(r, *root, profile);
  if (in && problems.empty()) {
    // What only the whole plan can judge (a flow outside the device's range, a bag at an
    // altitude its model refuses) is named by the plan itself.
    Result<RoutePlan> plan = plan_route(*in);
    if (!plan) problems.lines.push_back(plan.error().message);
  } else if (problems.empty()) {
    problems.lines.push_back("the route file could not be read");
  }
  return problems;
}

Result<Stock> stock_from_profile(const team_profile::TeamProfile& profile, Duration margin) {
  if (!profile.evacuation || profile.evacuation->cylinders.empty()) {
    return Error{"team \"" + profile.team_name + "\" has no evacuation section with cylinders"};
  }
  Stock s;
  for (const team_profile::CylinderOnHand& c : profile.evacuation->cylinders) {
    const team_profile::CylinderType* t = profile.find_cylinder(c.type_label);
    if (!t) return Error{"cylinder type \"" + c.type_label + "\" is not in the team profile"};
    s.cylinders.push_back(stock_cylinder(*t, s.cylinders.size(), c.pressure_gauge, c.temperature));
  }
  s.reserve_gauge = profile.reserve_pressure_gauge;
  s.margin = margin;
  const std::string& count_in = profile.evacuation->shortfall_type_label;
  count_in_type(s, profile, count_in.empty() ? s.cylinders.front().type_label : count_in);
  return s;
}

Result<RouteInput> read_route_file(std::string_view json_text,
                                   const team_profile::TeamProfile& profile) {
  Problems problems;
  std::optional<Json> root = team_profile::internal::parse_json(json_text, problems);
  if (!root) return Error{problems.joined()};
  Reader r(problems);
  std::optional<RouteInput> in = read_root(r, *root, profile);
  if (!in || !problems.empty()) {
    if (problems.empty()) problems.lines.push_back("the route file could not be read");
    return Error{problems.joined()};
  }
  return *in;
}

}  // namespace firn::route
