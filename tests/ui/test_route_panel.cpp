// The Route screen without GL: it opens on the team's usual carry-out, shows the verdict the
// model (and `firn route`) gives for the same route, and a preset tap adds a leg that the
// verdict then includes.
#include <catch2/catch.hpp>
#include <imgui.h>
#include <nlohmann/json.hpp>

#include "profile/route_file.hpp"
#include "model/route_plan.hpp"
#include "ui/app_state.hpp"
#include "ui/panels.hpp"
#include "ui/platform.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

using namespace firn;
using namespace firn::ui;

namespace {

class NoPlatform : public Platform {
 public:
  std::optional<std::string> load_text(std::string_view) override { return std::nullopt; }
  bool save_text(std::string_view, std::string_view) override { return true; }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  void publish_test_items(std::string_view) override {}
  std::string_view name() const override { return "test"; }
};

struct RouteScreen {
  NoPlatform platform;
  RouteScreen() {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(390, 8000);  // tall: every widget on screen, no scrolling
    io.IniFilename = nullptr;
    io.Fonts->AddFontDefault();
    unsigned char* pixels = nullptr;
    int w = 0, h = 0;
    io.Fonts->GetTexDataAsAlpha8(&pixels, &w, &h);
  }
  ~RouteScreen() { ImGui::DestroyContext(); }

  nlohmann::json frame(AppState& state) {
    ImGuiIO& io = ImGui::GetIO();
    io.DeltaTime = 1.0f / 60.0f;
    ImGui::NewFrame();
    test_hook::begin_frame();
    ++state.frames_drawn;
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(io.DisplaySize);
    ImGui::Begin("test", nullptr, ImGuiWindowFlags_NoDecoration);
    draw_route_panel(state, platform);
    ImGui::End();
    ImGui::Render();
    return nlohmann::json::parse(test_hook::frame_json());
  }

  std::string text(AppState& state, const std::string& label) {
    for (const auto& i : frame(state)) {
      if (i["label"] == label) return i["text"];
    }
    return "(absent)";
  }

  void tap(AppState& state, const std::string& label) {
    bool found = false;
    for (const auto& i : frame(state)) {
      if (i["label"] != label) continue;
      found = true;
      ImGui::GetIO().MousePos = ImVec2(i["x"].get<float>() + i["w"].get<float>() / 2,
                                       i["y"].get<float>() + i["h"].get<float>() / 2);
    }
    REQUIRE(found);
    frame(state);
    ImGui::GetIO().MouseDown[0] = true;
    frame(state);
    ImGui::GetIO().MouseDown[0] = false;
    frame(state);
  }
};

std::string model_verdict(const route::RouteInput& in) {
  Result<route::RoutePlan> plan = route::plan_route(in);
  REQUIRE(plan.ok());
  return plan->verdict;
}

}  // namespace

TEST_CASE("route screen: the usual carry-out's verdict is the model's, and a preset adds a leg") {
  RouteScreen ui;
  AppState state;
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
