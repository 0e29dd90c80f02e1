// Writing a route file: the RouteInput as the JSON that read_route_file reads back (the Route
// screen saves the route being planned this way, so the app's saved route is a file the CLI reads).
// Quantities are written in the units the schema's examples use, with as many digits as it takes
// to read back the same double.
#include <cmath>
#include <cstdio>
#include <cstdlib>

#include "profile/route_file.hpp"
#include "profile/team_profile_internal.hpp"

namespace firn::route {
namespace {

using namespace units;
using team_profile::internal::Json;

// The shortest plain decimal (no exponent: the unit parser reads none) that reads back as `v`.
std::string plain_number(double v) {
  if (!std::isfinite(v)) return "0";  // never written: the reader refuses it anyway
  char buffer[64];
  for (int digits = 6; digits <= 17; ++digits) {
    std::snprintf(buffer, sizeof buffer, "%.*g", digits, v);
    std::string text(buffer);
    if (text.find_first_of("eE") != std::string::npos) break;
    if (std::strtod(buffer, nullptr) == v) return text;
  }
  std::snprintf(buffer, sizeof buffer, "%.12f", v);
  std::string text(buffer);
  while (text.back() == '0') text.pop_back();
  if (text.back() == '.') text.pop_back();
  return text == "-0" ? "0" : text;
}

template <class D>
std::string written(Quantity<D> q, const ReadingUnit<D>& unit, std::string_view written_unit) {
  return plain_number(q.in(unit)) + std::string(written_unit);
}

std::string clock_written(int minutes_after_midnight) {
  char buffer[8];
  std::snprintf(buffer, sizeof buffer, "%02d:%02d", minutes_after_midnight / 60 % 24,
                minutes_after_midnight % 60);
  return buffer;
}

Json leg_object(const Leg& leg) {
  Json j;
  j["kind"] = std::string(leg_kind_key(leg.kind));
  if (!leg.label.empty()) j["label"] = leg.label;
  switch (leg.kind) {
    case LegKind::Carry:
      j["from"] = written(leg.start_altitude, metres, "m");
      j["to"] = written(leg.end_altitude, metres, "m");
      break;
    case LegKind::Wait:
    case LegKind::Bag:
      j["at"] = written(leg.start_altitude, metres, "m");
      break;
    case LegKind::Flight:
      j["cruise"] = written(leg.start_altitude, metres, "m");
      break;
  }
  j["duration"] = written(leg.duration, minutes, "min");
  if (leg.kind == LegKind::Bag) {
    j["oxygen_feed"] = written(leg.bag_oxygen_feed, litres_per_minute, "L/min");
    if (leg.bag_flush) j["flush"] = written(*leg.bag_flush, litres_per_minute, "L/min");
  } else if (leg.fixed_flow) {
    j["flow"] = written(*leg.fixed_flow, litres_per_minute, "L/min");
  }
  return j;
}

Json stock_object(const Stock& stock) {
  Json cylinders = Json::array();
  for (const StockCylinder& c : stock.cylinders) {
    cylinders.push_back({{"type", c.type_label},
                         {"pressure", written(c.gauge, bar, "bar")},
                         {"temperature", written(c.temperature, celsius, "C")}});
  }
  Json j;
  j["cylinders"] = cylinders;
  j["reserve"] = written(stock.reserve_gauge, bar, "bar");
  j["margin"] = written(stock.margin, minutes, "min");
  if (!stock.count_in_label.empty()) j["count_in"] = stock.count_in_label;
  if (stock.second_flow > litres_per_minute(0) || !stock.second_who.empty()) {
    j["second_consumer"] = {{"who", stock.second_who.empty() ? "second consumer" : stock.second_who},
                            {"flow", written(stock.second_flow, litres_per_minute, "L/min")}};
  }
  return j;
}

}  // namespace

std::string write_route_file(const RouteInput& in) {
  Json root;
  root["schema_version"] = current_route_schema_version;
  if (in.demo) root["demo"] = true;
  root["name"] = in.name.empty() ? "Route" : in.name;
  if (in.start_clock_min) root["start_time"] = clock_written(*in.start_clock_min);
  const Casualty& c = in.casualty;
  Json casualty;
  if (c.measured_spo2_on_air && c.measured_at) {
    casualty["spo2_on_air"] = written(*c.measured_spo2_on_air, percent, "%");
    casualty["measured_at"] = written(*c.measured_at, metres, "m");
  }
  casualty["exposure"] = std::string(cascade::exposure_key(c.exposure));
  casualty["target_spo2"] = written(c.target, percent, "%");
  casualty["device"] = std::string(supplemental_oxygen::device_key(c.device));
  root["casualty"] = casualty;
  Json legs = Json::array();
  for (const Leg& leg : in.legs) legs.push_back(leg_object(leg));
  root["legs"] = legs;
  root["stock"] = stock_object(in.stock);
  return root.dump(2) + "\n";
}

}  // namespace firn::route
