// Writing a route file (route::write_route_file): what the Route screen saves must read back to
// the same route (round trip, common practice for a saved format), and the team profile's
// evacuation section becomes a route's stock.
#include <catch2/catch.hpp>

#include <string>

#include "profile/route_file.hpp"
#include "model/route_plan.hpp"
#include "profile/team_profile.hpp"

using namespace firn;
using namespace firn::units;
using namespace firn::route;

namespace {

// Equal to 1 part in 10^12: a gauge typed in psi is written in bar and read back as pascals.
template <class D>
void same(Quantity<D> a, Quantity<D> b, const ReadingUnit<D>& unit) {
  CHECK(a.in(unit) == Approx(b.in(unit)).epsilon(1e-12).margin(1e-12));
}

void same_route(const RouteInput& a, const RouteInput& b) {
  CHECK(a.name == b.name);
  CHECK(a.demo == b.demo);
  CHECK(a.start_clock_min == b.start_clock_min);
  CHECK(a.casualty.device == b.casualty.device);
  CHECK(a.casualty.exposure == b.casualty.exposure);
  same(a.casualty.target, b.casualty.target, percent);
  REQUIRE(a.casualty.measured_spo2_on_air.has_value() == b.casualty.measured_spo2_on_air.has_value());
  if (a.casualty.measured_spo2_on_air) {
    same(*a.casualty.measured_spo2_on_air, *b.casualty.measured_spo2_on_air, percent);
    same(*a.casualty.measured_at, *b.casualty.measured_at, metres);
  }
  REQUIRE(a.legs.size() == b.legs.size());
  for (std::size_t i = 0; i < a.legs.size(); ++i) {
    INFO("leg " << i + 1);
    const Leg &x = a.legs[i], &y = b.legs[i];
    CHECK(x.kind == y.kind);
    CHECK(x.label == y.label);
    same(x.start_altitude, y.start_altitude, metres);
    same(x.end_altitude, y.end_altitude, metres);
    same(x.duration, y.duration, minutes);
    REQUIRE(x.fixed_flow.has_value() == y.fixed_flow.has_value());
    if (x.fixed_flow) same(*x.fixed_flow, *y.fixed_flow, litres_per_minute);
    same(x.bag_oxygen_feed, y.bag_oxygen_feed, litres_per_minute);
    REQUIRE(x.bag_flush.has_value() == y.bag_flush.has_value());
    if (x.bag_flush) same(*x.bag_flush, *y.bag_flush, litres_per_minute);
  }
  REQUIRE(a.stock.cylinders.size() == b.stock.cylinders.size());
  for (std::size_t i = 0; i < a.stock.cylinders.size(); ++i) {
    INFO("cylinder " << i + 1);
    CHECK(a.stock.cylinders[i].label == b.stock.cylinders[i].label);
    CHECK(a.stock.cylinders[i].type_label == b.stock.cylinders[i].type_label);
    same(a.stock.cylinders[i].water_capacity, b.stock.cylinders[i].water_capacity, litres);
    same(a.stock.cylinders[i].gauge, b.stock.cylinders[i].gauge, bar);
    same(a.stock.cylinders[i].temperature, b.stock.cylinders[i].temperature, kelvin);
  }
  same(a.stock.reserve_gauge, b.stock.reserve_gauge, bar);
  same(a.stock.margin, b.stock.margin, minutes);
  CHECK(a.stock.count_in_label == b.stock.count_in_label);
  same(a.stock.second_flow, b.stock.second_flow, litres_per_minute);
  CHECK(a.stock.second_who == b.stock.second_who);
}

}  // namespace

TEST_CASE("route file: the demo route written and read back is the same route", "[route]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  RouteInput demo = read_route_file(demo_route_json(), profile).value();
  std::string text = write_route_file(demo);
  INFO(text);
  CHECK(check_route_file(text, profile).empty());
  Result<RouteInput> back = read_route_file(text, profile);
  REQUIRE(back.ok());
  same_route(demo, back.value());
  CHECK(write_route_file(back.value()) == text);  // a fixed point: saving again changes nothing
  // The figures, not only the inputs: the plan (and so the screen and `firn route`) is the same.
  CHECK(plan_route(back.value())->verdict == plan_route(demo)->verdict);
  // Readable text in the schema's own units (docs/route-plan.md), the demo's values as written.
  CHECK_THAT(text, Catch::Contains("\"from\": \"4700m\""));
  CHECK_THAT(text, Catch::Contains("\"duration\": \"120min\""));
  CHECK_THAT(text, Catch::Contains("\"pressure\": \"190bar\""));
  CHECK_THAT(text, Catch::Contains("\"temperature\": \"-10C\""));
  CHECK_THAT(text, Catch::Contains("\"start_time\": \"07:30\""));
  CHECK_THAT(text, Catch::Contains("\"spo2_on_air\": \"72%\""));
}

TEST_CASE("route file: values typed in other units and every optional part survive", "[route]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  RouteInput in = read_route_file(demo_route_json(), profile).value();
  in.demo = false;
  in.name = "Col route, edited";
  in.start_clock_min = 23 * 60 + 59;
  in.casualty.device = supplemental_oxygen::Device::SimpleMask;
  in.casualty.exposure = cascade::Exposure::Acclimatised;
  in.casualty.target = percent(92);
  in.casualty.measured_spo2_on_air.reset();
  in.casualty.measured_at.reset();
  in.legs[0].start_altitude = feet(15000);      // 4,572 m: not a whole number of metres in binary
  in.legs[0].duration = hours(1.0 / 3.0);       // 20 min, a repeating fraction of an hour
  in.legs[0].fixed_flow = litres_per_minute(6.5);
  in.legs[2].bag_oxygen_feed = litres_per_minute(0);
  in.legs[2].bag_flush.reset();
  in.stock.cylinders[1].gauge = psi.gauge(2015.5);
  in.stock.cylinders[2].temperature = fahrenheit(17.3);
  in.stock.reserve_gauge = bar.gauge(25);
  in.stock.margin = minutes(45);
  in.stock.second_who = "crew member";
  in.stock.second_flow = litres_per_minute(1.5);
  in.stock.count_in_label = "3 L composite";
  std::string text = write_route_file(in);
  INFO(text);
  Result<RouteInput> back = read_route_file(text, profile);
  REQUIRE(back.ok());
  same_route(in, back.value());
  CHECK(write_route_file(back.value()) == text);
  CHECK_FALSE(back->legs[2].bag_flush.has_value());
  CHECK_THAT(text, Catch::Contains("\"start_time\": \"23:59\""));
  CHECK_THAT(text, Catch::Contains("\"exposure\": \"acclimatised\""));
  CHECK_THAT(text, Catch::Contains("\"device\": \"mask\""));
  CHECK(text.find("demo") == std::string::npos);
  CHECK(text.find("spo2_on_air") == std::string::npos);  // not measured: not written
}

TEST_CASE("route file: the profile's evacuation section becomes the route's stock", "[route]") {
  team_profile::TeamProfile profile = team_profile::demo_profile();
  REQUIRE(profile.evacuation.has_value());
  Result<Stock> stock = stock_from_profile(profile, minutes(40));
  REQUIRE(stock.ok());
  const team_profile::EvacuationSection& e = *profile.evacuation;
  REQUIRE(stock->cylinders.size() == e.cylinders.size());
  for (std::size_t i = 0; i < e.cylinders.size(); ++i) {
    CHECK(stock->cylinders[i].type_label == e.cylinders[i].type_label);
    CHECK(stock->cylinders[i].label == "#" + std::to_string(i + 1) + " " + e.cylinders[i].type_label);
    CHECK(stock->cylinders[i].gauge == e.cylinders[i].pressure_gauge);
    CHECK(stock->cylinders[i].temperature == e.cylinders[i].temperature);
  }
  CHECK(stock->reserve_gauge == profile.reserve_pressure_gauge);
  CHECK(stock->margin == minutes(40));
  // docs/route-plan.md: the demo route's stock is the demo profile's evacuation section.
  RouteInput demo = read_route_file(demo_route_json(), profile).value();
  REQUIRE(demo.stock.cylinders.size() == stock->cylinders.size());
  for (std::size_t i = 0; i < demo.stock.cylinders.size(); ++i) {
    CHECK(demo.stock.cylinders[i].gauge == stock->cylinders[i].gauge);
    same(demo.stock.cylinders[i].temperature, stock->cylinders[i].temperature, kelvin);
    same(demo.stock.cylinders[i].water_capacity, stock->cylinders[i].water_capacity, litres);
  }
  CHECK(stock->count_in_label == demo.stock.count_in_label);

  profile.evacuation.reset();
  Result<Stock> none = stock_from_profile(profile, minutes(40));
  REQUIRE_FALSE(none.ok());
  CHECK_THAT(none.error().message, Catch::Contains("no evacuation section"));
}
