// Schema 1 → 2. Version 1 (Firn 0.0.x) wrote bare numbers with the unit in the key name
// ("fill_pressure_bar": 200) and had no evacuation section; version 2 writes text with units.
#include "profile/team_profile_internal.hpp"

namespace firn::team_profile::internal {

std::optional<Json> migrate_v1(const Json& old, Problems& problems) {
  const std::string top;
  size_t problems_before = problems.lines.size();
  struct {
    Problems& problems;
    void fail(const std::string& path, const std::string& message) {
      problems.lines.push_back(path + ": " + message);
    }
  } r{problems};
  for (const std::string& key : json::unknown_keys(old, {"schema_version", "demo", "team_name",
           "altitude_unit", "card_altitudes", "model", "cylinders", "reserve_pressure_bar",
           "flows_lpm", "bag_gauge_psi", "pump_stroke_l", "co2_limit_pct", "notes"})) {
    r.fail(key, "unknown field in a schema 1 file (a typo?)");
  }
  // A v1 number at `key` becomes v2 text "<number><unit>", or a problem naming the v1 path.
  auto with_unit = [&](const Json& object, const std::string& path, std::string_view key,
                       std::string_view unit) -> Json {
    const Json* found = object.find(key);
    if (!found) return Json();  // v2 parsing reports what is missing
    if (!found->is_number()) {
      r.fail(child(path, key), "must be a number (schema 1), got " + json::shown(*found));
      return Json();
    }
    return Json(format_number(found->as_double(), 6) + std::string(unit));
  };
  auto copy = [&](const Json& from, std::string_view key, Json& to, std::string_view new_key) {
    if (const Json* found = from.find(key)) to[new_key] = *found;
  };
  Json v2 = Json::object();
  v2["schema_version"] = current_schema_version;
  copy(old, "demo", v2, "demo");
  copy(old, "team_name", v2, "team_name");
  std::string altitude_unit = "m";
  if (const Json* found = old.find("altitude_unit"); found) {
    if (found->is_string() && (found->as_string() == "m" || found->as_string() == "ft")) {
      altitude_unit = found->as_string();
    } else {
      r.fail("altitude_unit", json::shown(*found) + " must be \"m\" or \"ft\" (schema 1)");
    }
  }
  v2["units"] = altitude_unit == "ft" ? "us" : "metric";
  v2["atmosphere_model"] = old.contains("model") ? old["model"] : Json("west");
  Json card = Json::object();
  if (const Json* found = old.find("card_altitudes"); found && found->is_object()) {
    for (auto [from, to] : {std::pair{"from", "altitude_from"}, std::pair{"to", "altitude_to"},
                            std::pair{"step", "altitude_step"}}) {
      Json value = with_unit(*found, "card_altitudes", from, altitude_unit);
      if (!value.is_null()) card[to] = value;
    }
  }
  copy(old, "notes", card, "notes");
  v2["card"] = card;
  if (const Json* found = old.find("cylinders"); found && found->is_array()) {
    Json list = Json::array();
    for (size_t i = 0; i < found->size(); ++i) {
      const Json& c = (*found)[i];
      std::string path = item("cylinders", i);
      if (!c.is_object()) { list.push_back(c); continue; }
      Json n = Json::object();
      copy(c, "label", n, "label");
      copy(c, "size", n, "size");
      if (c.contains("water_capacity_l")) n["water_capacity"] = with_unit(c, path, "water_capacity_l", "L");
      if (c.contains("fill_pressure_bar")) n["fill_pressure"] = with_unit(c, path, "fill_pressure_bar", "bar");
      copy(c, "count", n, "count");
      list.push_back(n);
    }
    v2["cylinders"] = list;
  }
  if (old.contains("reserve_pressure_bar")) v2["reserve_pressure"] = with_unit(old, top, "reserve_pressure_bar", "bar");
  if (const Json* found = old.find("flows_lpm"); found && found->is_array()) {
    Json list = Json::array();
    for (size_t i = 0; i < found->size(); ++i) {
      const Json& f = (*found)[i];
      if (!f.is_number()) {
        r.fail(item("flows_lpm", i), "must be a number (schema 1), got " + json::shown(f));
        continue;
      }
      list.push_back(format_number(f.as_double(), 6) + "L/min");
    }
    v2["flows"] = list;
  }
  Json bag = Json::object();
  if (old.contains("bag_gauge_psi")) bag["gauge_pressure"] = with_unit(old, top, "bag_gauge_psi", "psi");
  if (old.contains("pump_stroke_l")) bag["pump_stroke_volume"] = with_unit(old, top, "pump_stroke_l", "L");
  if (old.contains("co2_limit_pct")) bag["co2_limit"] = with_unit(old, top, "co2_limit_pct", "%");
  v2["bag"] = bag;
  if (problems.lines.size() != problems_before) return std::nullopt;
  return v2;
}

}  // namespace firn::team_profile::internal
