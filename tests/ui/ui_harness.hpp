// The headless ImGui harness of the core/ui tests: an ImGui context with no renderer (fonts built,
// frames begun and ended) drawing a panel or a widget, the keypad over it, clicks by test-hook
// label, and an in-memory platform (storage, a picked file, downloads).
#pragma once

#include <catch2/catch.hpp>
#include <imgui.h>
#include <nlohmann/json.hpp>

#include <functional>
#include <map>
#include <optional>
#include <string>
#include <utility>

#include "memory_platform.hpp"
#include "ui/app_state.hpp"
#include "ui/fields.hpp"
#include "ui/keypad.hpp"
#include "ui/platform.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui::testing {

// One ImGui context per test, no renderer: Render() only builds draw lists.
struct Headless {
  Headless() {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(390, 844);
    io.IniFilename = nullptr;
    io.Fonts->AddFontDefault();
    unsigned char* pixels = nullptr;
    int w = 0, h = 0;
    io.Fonts->GetTexDataAsAlpha8(&pixels, &w, &h);  // builds the atlas
    for (int i = 0; i < ImGuiKey_COUNT; ++i) io.KeyMap[i] = i;
  }
  ~Headless() { ImGui::DestroyContext(); }

  // When set, the frame draws this screen instead of `draw`.
  void (*panel)(AppState&, Platform&) = nullptr;
  MemoryPlatform platform;
  // What a frame draws under the keypad: by default the altitude field (no "entered" flag).
  std::function<void(AppState&)> draw = [](AppState& state) {
    edit_quantity(state, altitude_field(state, "Altitude", "altitude"), state.situation.altitude);
  };

  // One frame with the keypad and the panel (or `draw`); returns the labelled items.
  nlohmann::json frame(AppState& state) {
    ImGuiIO& io = ImGui::GetIO();
    io.DeltaTime = 1.0f / 60.0f;
    ImGui::NewFrame();
    test_hook::begin_frame();
    ++state.frames_drawn;
    state.display.colours = &palette(state.settings.theme, state.settings.night_dim);  // as draw_frame
    press_scrolls(state);  // as draw_frame does, before any widget
    draw_keypad(state, io.DisplaySize.x, io.DisplaySize.y);  // first, as draw_frame does
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(io.DisplaySize);
    ImGui::Begin("test", nullptr, ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoBringToFrontOnFocus);
    if (panel) {
      panel(state, platform);
    } else {
      draw(state);
    }
    ImGui::End();
    if (state.keypad.committed) state.keypad = Keypad{};  // as the app: only its field takes it
    ImGui::Render();
    for (bool& down : io.KeysDown) down = false;
    return nlohmann::json::parse(test_hook::frame_json());
  }

  // Presses and releases the mouse on a labelled item, one frame each.
  void click(AppState& state, const std::string& label) {
    nlohmann::json items = frame(state);
    bool found = false;
    for (const auto& i : items) {
      if (i["label"] != label) continue;
      found = true;
      ImGui::GetIO().MousePos = ImVec2(i["x"].get<float>() + i["w"].get<float>() / 2,
                                       i["y"].get<float>() + i["h"].get<float>() / 2);
    }
    REQUIRE(found);
    frame(state);  // hover
    ImGui::GetIO().MouseDown[0] = true;
    frame(state);
    ImGui::GetIO().MouseDown[0] = false;
    frame(state);  // released: a key acts, and OK's value reaches its field in this frame
  }

  std::string text(AppState& state, const std::string& label) {
    for (const auto& i : frame(state)) {
      if (i["label"] == label) return i["text"];
    }
    return "(absent)";
  }
};

inline void type_on_keypad(Headless& ui, AppState& state, const std::string& keys) {
  for (char c : keys) ui.click(state, std::string("Key ") + c);
}

}  // namespace firn::ui::testing
