// The Route screen without GL: it opens on the team's usual carry-out (or the route saved on the
// device), shows the verdict the model (and `firn route`) gives for the same route, a preset tap
// adds a leg that the verdict then includes, and no change mark under the chart crosses a label.
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdio>
#include <imgui.h>
#include <nlohmann/json.hpp>

#include "model/route_plan.hpp"
#include "profile/route_file.hpp"
#include "ui_harness.hpp"
#include "ui/app_state.hpp"
#include "ui/format.hpp"
#include "ui/panels.hpp"
#include "ui/platform.hpp"
#include "ui/route_store.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

using namespace firn;
using namespace firn::ui;

namespace {

// The Route screen in the headless harness, tall enough that every widget is on screen.
struct RouteScreen : testing::Headless {
  RouteScreen() {
    ImGui::GetIO().DisplaySize = ImVec2(390, 8000);
    panel = draw_route_panel;
  }
  void tap(AppState& state, const std::string& label) { click(state, label); }
  // Reads every stock cylinder's gauge as it stands (whole bar) on the keypad, as a medic would.
  void read_gauges(AppState& state) {
    for (const route::StockCylinder& c : state.route.input.stock.cylinders) {
      click(state, c.label);
      std::string bar = std::to_string(static_cast<int>(std::lround(c.gauge.in(units::bar))));
      for (char k : bar) click(state, std::string("Key ") + k);
      click(state, "Key OK");
    }
  }
};

std::string model_verdict(const route::RouteInput& in) {
  Result<route::RoutePlan> plan = route::plan_route(in);
  REQUIRE(plan.ok());
  return plan->verdict;
}

}  // namespace

TEST_CASE("route screen: no verdict from gauges as saved; once read, the model's, and a preset adds a leg") {
  RouteScreen ui;
  AppState state;
  // The gauges came with the route file: the figures show, a verdict does not (brief: never
  // reassure beyond the data; a cylinder's gauge is read at the incident).
  std::string unread = ui.text(state, "Verdict");
  CHECK(unread.rfind("NO VERDICT: 3 of 3 cylinder gauges as saved, not read here", 0) == 0);
  CHECK(unread.find("enough") == std::string::npos);
  CHECK(ui.text(state, "#1 2 L alloy gauge") == "as saved, not read here");
  ui.read_gauges(state);
  CHECK(ui.text(state, "#1 2 L alloy gauge").rfind("read ", 0) == 0);
  std::string shown = ui.text(state, "Verdict");
  route::RouteInput usual =
      route::read_route_file(route::demo_route_json(), state.team.profile).value();
  // The demo carry-out is enough (docs/route-plan.md worked example): shown as OK with its text.
  CHECK(shown == std::string(tone_word(Tone::Good)) + ": " + model_verdict(usual));
  CHECK(shown.find("389 min spare beyond the 30 min margin") != std::string::npos);
  std::size_t legs = state.route.input.legs.size();
  ui.tap(state, "Wait 1 h");
  REQUIRE(state.route.input.legs.size() == legs + 1);
  CHECK(state.route.input.legs.back().kind == route::LegKind::Wait);
  CHECK(state.route.input.legs.back().start_altitude == usual.legs.back().end_altitude);
  std::string after = ui.text(state, "Verdict");
  CHECK(after.find(model_verdict(state.route.input)) != std::string::npos);
  CHECK(after != shown);  // an hour more at 2 L/min: 30 min less spare
  ui.tap(state, "Remove the last leg");
  CHECK(ui.text(state, "Verdict") == shown);
}

TEST_CASE("route screen: opens on the saved route, and every cylinder label is clear of change marks") {
  RouteScreen ui;
  AppState state;
  route::RouteInput saved =
      route::read_route_file(route::demo_route_json(), state.team.profile).value();
  saved.legs.resize(3);
  saved.legs[2].duration = units::minutes(200);  // a long bag session: more changes
  saved.stock.cylinders[0].gauge = units::bar.gauge(90);
  saved.name = "Saved on this phone";
  ui.platform.stored[kRouteKey] = route::write_route_file(saved);
  ui.frame(state);
  ui.read_gauges(state);
  nlohmann::json items = ui.frame(state);
  CHECK(state.route.input.name == "Saved on this phone");
  CHECK(ui.text(state, "Verdict").find(model_verdict(saved)) != std::string::npos);

  struct Box { std::string label; float x0, y0, x1, y1; };
  std::vector<Box> labels, marks;
  for (const auto& i : items) {
    std::string label = i["label"];
    Box b{label, i["x"], i["y"], i["x"].get<float>() + i["w"].get<float>(),
          i["y"].get<float>() + i["h"].get<float>()};
    if (label.rfind("Cylinder label", 0) == 0) labels.push_back(b);
    if (label.rfind("Change mark", 0) == 0) marks.push_back(b);
  }
  Result<route::RoutePlan> plan = route::plan_route(saved);
  REQUIRE(plan.ok());
  REQUIRE(plan->swaps.size() >= 2);
  CHECK(labels.size() == plan->spans.size());
  CHECK(marks.size() == 2 * plan->swaps.size());  // one on each bar a change joins
  for (const Box& l : labels) {
    CHECK(l.x0 >= 0.0f);
    CHECK(l.x1 <= 390.0f);  // inside a phone's width
    for (const Box& m : marks) {
      INFO(l.label << " [" << l.x0 << "," << l.y0 << "," << l.x1 << "," << l.y1 << "] vs " << m.label
                   << " [" << m.x0 << "," << m.y0 << "," << m.x1 << "," << m.y1 << "]");
      bool apart = m.x1 <= l.x0 || m.x0 >= l.x1 || m.y1 <= l.y0 || m.y0 >= l.y1;
      CHECK(apart);
    }
  }
}

TEST_CASE("route screen: a route file loads by its typed path; a bad one changes nothing") {
  RouteScreen ui;
  AppState state;
  ui.frame(state);
  ui.platform.files["/field/short.json"] = R"({"schema_version": 1, "name": "Short carry",
    "casualty": {"device": "mask"},
    "legs": [{"kind": "carry", "from": "4200m", "to": "3900m", "duration": "45min"}],
    "stock": {"cylinders": [{"type": "3 L composite", "pressure": "250bar"}], "margin": "20min"}})";
  std::snprintf(state.route.file.import_path, sizeof state.route.file.import_path, "%s", "/field/short.json");
  ui.tap(state, "Load a route file");
  CHECK(ui.platform.requested_path == "/field/short.json");
  CHECK(state.route.input.name == "Short carry");
  CHECK(ui.text(state, "Verdict").rfind("NO VERDICT: 1 of 1 cylinder gauges as saved", 0) == 0);
  ui.read_gauges(state);
  CHECK(ui.text(state, "Verdict").find(model_verdict(state.route.input)) != std::string::npos);
  CHECK(ui.text(state, "Route message") == "Loaded short.json: Short carry.");

  std::snprintf(state.route.file.import_path, sizeof state.route.file.import_path, "%s", "/field/missing.json");
  ui.tap(state, "Load a route file");
  CHECK(state.route.input.name == "Short carry");
  CHECK(ui.text(state, "Route message") == "Nothing imported: cannot read /field/missing.json");
  // Nothing typed: the file in the storage folder, named for routes (not the profile's).
  state.route.file.import_path[0] = '\0';
  ui.tap(state, "Load a route file");
  CHECK(ui.platform.requested_path == ui.platform.storage_location() + "/" + kRouteImportFileName);
}

TEST_CASE("route screen: the start time typed on the keypad makes the changes clock times") {
  RouteScreen ui;
  AppState state;
  ui.frame(state);
  REQUIRE(state.route.input.start_clock_min == 7 * 60 + 30);  // the demo route starts 07:30
  Result<route::RoutePlan> plan = route::plan_route(state.route.input);
  REQUIRE(plan.ok());
  REQUIRE_FALSE(plan->swaps.empty());
  units::Duration first = plan->swaps.front().time;
  CHECK(ui.text(state, "Change 1").rfind(route::clock_text(7 * 60 + 30, first), 0) == 0);

  ui.click(state, "No start time");
  CHECK_FALSE(state.route.input.start_clock_min.has_value());
  CHECK(ui.text(state, "Start time") == "not set (tap to enter)");
  CHECK(ui.text(state, "Change 1").rfind(duration_text(first), 0) == 0);

  ui.click(state, "Start time");
  testing::type_on_keypad(ui, state, "2400");  // not a clock time: refused, nothing changes
  ui.click(state, "Key OK");
  CHECK_FALSE(state.route.input.start_clock_min.has_value());
  CHECK(state.field_errors.count("route-start") == 1);

  ui.click(state, "Start time");
  testing::type_on_keypad(ui, state, "1405");
  ui.click(state, "Key OK");
  CHECK(state.route.input.start_clock_min == 14 * 60 + 5);
  CHECK(ui.text(state, "Start time") == "14:05");
  CHECK(ui.text(state, "Change 1").rfind(route::clock_text(14 * 60 + 5, first), 0) == 0);
}
