#include "ui/route_store.hpp"

#include "profile/route_file.hpp"
#include "model/route_plan.hpp"

namespace firn::ui {

namespace {

void tell(RouteState& route, std::string text, bool problem) {
  route.file.tell(std::move(text), problem);
}

}  // namespace

void use_usual_route(RouteState& route, const team_profile::TeamProfile& profile) {
  route.loaded = true;
  route.gauge_read_at.clear();  // gauges from a file: none read here
  Result<route::RouteInput> in = route::read_route_file(route::demo_route_json(), profile);
  if (in) {
    route.input = in.value();
    tell(route, "", false);
    return;
  }
  // A team profile without the demo's cylinder types: the demo team's route and stock.
  route.input = route::read_route_file(route::demo_route_json(), team_profile::demo_profile()).value();
  tell(route, "The usual carry-out uses the DEMO team's cylinders (" + in.error().message + ").", true);
}

void load_route(RouteState& route, const team_profile::TeamProfile& profile, Platform& platform) {
  std::optional<std::string> text = platform.load_text(kRouteKey);
  if (!text || text->empty()) {
    use_usual_route(route, profile);
    return;
  }
  Result<route::RouteInput> in = route::read_route_file(*text, profile);
  if (in) {
    route.loaded = true;
    route.input = in.value();
    route.saved_text = *text;
    tell(route, "", false);
    return;
  }
  // Kept before anything else is written under the route key.
  bool kept = platform.save_text(kBadRouteKey, *text);
  std::string why = in.error().message;
  use_usual_route(route, profile);
  tell(route,
       "The saved route could not be read (" + why + "). The usual carry-out is shown. " +
           (kept ? "The old route was kept as " + std::string(kBadRouteKey) + " in " +
                       platform.storage_location() + "."
                 : std::string("The old route could not be copied; it is replaced once you change the route.")),
       true);
  if (!kept) route.saved_text = route::write_route_file(route.input);  // not written until changed
}

void save_route_if_changed(RouteState& route, Platform& platform) {
  if (!route.loaded) return;
  std::string text = route::write_route_file(route.input);
  if (text == route.saved_text || text == route.refused_text) return;
  // A route the plan refuses (48 h in all) is not saved: the last one that planned stays, so a
  // reload never meets a route file it must set aside. The screen already names the problem.
  if (!route::plan_route(route.input)) {
    route.refused_text = text;
    return;
  }
  if (platform.save_text(kRouteKey, text)) {
    route.saved_text = text;
    route.refused_text.clear();
    return;
  }
  route.refused_text = text;  // said once, not retried every frame
  tell(route, "The route could not be saved on " + platform.storage_location() +
                  ": it lasts until Firn is closed.", true);
}

bool import_route(RouteState& route, const team_profile::TeamProfile& profile,
                  std::string_view text, std::string_view source) {
  Result<route::RouteInput> in = route::read_route_file(text, profile);
  if (!in) {
    tell(route, std::string(source) + " was not loaded, nothing changed: " + in.error().message, true);
    return false;
  }
  route.loaded = true;
  route.input = in.value();
  route.gauge_read_at.clear();
  tell(route, "Loaded " + std::string(source) + ": " + route.input.name + ".", false);
  return true;
}

bool use_profile_stock(RouteState& route, const team_profile::TeamProfile& profile) {
  Result<route::Stock> stock = route::stock_from_profile(profile, route.input.stock.margin);
  if (!stock) {
    tell(route, "Nothing changed: " + stock.error().message + ".", true);
    return false;
  }
  route.input.stock = stock.value();
  route.gauge_read_at.clear();
  tell(route, "Cylinders, gauges and reserve from the team profile's evacuation section (" +
                  profile.team_name + "); legs and margin kept.", false);
  return true;
}

}  // namespace firn::ui
