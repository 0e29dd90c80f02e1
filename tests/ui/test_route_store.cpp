// The route being planned, kept on the device (ui/route_store.hpp): it survives a restart as a
// route file `firn route` reads, an unreadable one is kept as a backup and said, a refused write
// is said once, and whole routes load from a file or the team profile's evacuation section.
#include <catch2/catch.hpp>

#include "memory_platform.hpp"
#include "profile/route_file.hpp"
#include "model/route_plan.hpp"
#include "profile/team_profile.hpp"
#include "ui/route_store.hpp"

using namespace firn;
using namespace firn::ui;
using firn::ui::testing::MemoryPlatform;

namespace {

const team_profile::TeamProfile& demo() {
  static const team_profile::TeamProfile profile = team_profile::demo_profile();
  return profile;
}

}  // namespace

TEST_CASE("route store: the edited route survives a restart, as a route file", "[route]") {
  MemoryPlatform storage;
  RouteState route;
  load_route(route, demo(), storage);
  REQUIRE(route.loaded);
  CHECK(route.file.message.empty());
  CHECK(route.input.name == route::read_route_file(route::demo_route_json(), demo())->name);
  // The medic's edits: a leg's time, a gauge, the device, the start time.
  route.input.legs[1].duration = units::minutes(150);
  route.input.stock.cylinders[0].gauge = units::bar.gauge(120);
  route.input.casualty.device = supplemental_oxygen::Device::SimpleMask;
  route.input.start_clock_min = 6 * 60 + 5;
  save_route_if_changed(route, storage);
  REQUIRE(storage.stored.count(kRouteKey) == 1);
  // What is kept is a route file: the CLI's reader takes it as it is.
  CHECK(route::check_route_file(storage.stored[kRouteKey], demo()).empty());

  RouteState restarted;
  load_route(restarted, demo(), storage);
  CHECK(restarted.file.message.empty());
  CHECK(restarted.input.legs.size() == route.input.legs.size());
  CHECK(restarted.input.legs[1].duration.in(units::minutes) == Approx(150));
  CHECK(restarted.input.stock.cylinders[0].gauge.in(units::bar) == Approx(120));
  CHECK(restarted.input.casualty.device == supplemental_oxygen::Device::SimpleMask);
  CHECK(restarted.input.start_clock_min == 6 * 60 + 5);
  CHECK(route::plan_route(restarted.input)->verdict == route::plan_route(route.input)->verdict);
  // Nothing changed since: nothing is written again.
  int writes = storage.writes;
  save_route_if_changed(restarted, storage);
  CHECK(storage.writes == writes);
}

TEST_CASE("route store: an unreadable saved route is kept as a backup and said", "[route]") {
  MemoryPlatform storage;
  const std::string damaged = "{\"schema_version\": 1, \"name\": \"half wr";
  storage.stored[kRouteKey] = damaged;
  RouteState route;
  load_route(route, demo(), storage);
  CHECK(storage.stored[kBadRouteKey] == damaged);
  CHECK(route.file.message_is_problem);
  CHECK_THAT(route.file.message, Catch::Contains("saved route could not be read"));
  CHECK_THAT(route.file.message, Catch::Contains(kBadRouteKey));
  CHECK(route.input.legs.size() == 6);  // the usual carry-out (assets/demo-route.json)
  save_route_if_changed(route, storage);  // the backup is safe: the usual route is saved
  CHECK(route::check_route_file(storage.stored[kRouteKey], demo()).empty());

  // A route naming a cylinder type the team profile no longer has is set aside the same way.
  team_profile::TeamProfile other = demo();
  other.cylinders.erase(other.cylinders.begin());  // "2 L alloy" gone
  other.evacuation.reset();
  const std::string saved = storage.stored[kRouteKey];
  RouteState again;
  load_route(again, other, storage);
  CHECK(storage.stored[kBadRouteKey] == saved);
  CHECK_THAT(again.file.message, Catch::Contains("\"2 L alloy\" is not a cylinder type"));
}

TEST_CASE("route store: a refused write is said once; a route with no plan is not saved", "[route]") {
  MemoryPlatform storage;
  RouteState route;
  load_route(route, demo(), storage);
  storage.refuse_writes = true;
  save_route_if_changed(route, storage);
  CHECK_THAT(route.file.message, Catch::Contains("could not be saved"));
  int writes = storage.writes;
  save_route_if_changed(route, storage);
  CHECK(storage.writes == writes);  // not retried every frame
  storage.refuse_writes = false;

  route.input.legs[0].duration = units::minutes(100);
  save_route_if_changed(route, storage);
  const std::string good = storage.stored[kRouteKey];
  // 16 legs of 24 h: over the 48 h a route may last (the plan refuses it): the last good stays.
  route.input.legs.assign(route::Limits::legs_max, route.input.legs[0]);
  for (route::Leg& leg : route.input.legs) leg.duration = units::hours(24);
  REQUIRE_FALSE(route::plan_route(route.input).ok());
  save_route_if_changed(route, storage);
  CHECK(storage.stored[kRouteKey] == good);
}

TEST_CASE("route store: a route file and the profile's cylinders load whole or not at all", "[route]") {
  MemoryPlatform storage;
  RouteState route;
  load_route(route, demo(), storage);
  const std::size_t legs = route.input.legs.size();
  CHECK_FALSE(import_route(route, demo(), R"({"schema_version": 1, "name": "x", "legs": []})",
                           "mine.json"));
  CHECK(route.input.legs.size() == legs);
  CHECK(route.file.message_is_problem);
  CHECK_THAT(route.file.message, Catch::Contains("mine.json was not loaded, nothing changed"));
  CHECK_THAT(route.file.message, Catch::Contains("legs: 0 entries is outside 1"));

  std::string two_legs = R"({"schema_version": 1, "name": "Short carry", "casualty": {"device": "mask"},
    "legs": [{"kind": "carry", "from": "4200m", "to": "3900m", "duration": "45min"},
             {"kind": "wait", "at": "3900m", "duration": "30min"}],
    "stock": {"cylinders": [{"type": "3 L composite", "pressure": "250bar"}], "margin": "20min"}})";
  REQUIRE(import_route(route, demo(), two_legs, "short.json"));
  CHECK(route.input.name == "Short carry");
  CHECK(route.input.legs.size() == 2);
  CHECK_FALSE(route.file.message_is_problem);

  REQUIRE(use_profile_stock(route, demo()));
  const team_profile::EvacuationSection& e = *demo().evacuation;
  REQUIRE(route.input.stock.cylinders.size() == e.cylinders.size());
  CHECK(route.input.stock.cylinders[0].gauge == e.cylinders[0].pressure_gauge);
  CHECK(route.input.stock.margin.in(units::minutes) == Approx(20));  // the route's margin kept
  CHECK(route.input.legs.size() == 2);                                // and its legs

  team_profile::TeamProfile none = demo();
  none.evacuation.reset();
  CHECK_FALSE(use_profile_stock(route, none));
  CHECK_THAT(route.file.message, Catch::Contains("no evacuation section"));
  CHECK(route.input.stock.cylinders.size() == e.cylinders.size());
}
