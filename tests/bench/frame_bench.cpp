// Time of one whole Firn frame per screen (draw_frame between NewFrame and Render, no GPU), the
// part of a frame that is Firn's own: printed as figures, never asserted (DEVELOPERS.md). The
// page's frame adds the WebGL calls and the browser's event handling (page_bench.mjs measures
// those). Run by tests/bench/compare.sh.
#include <imgui.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <optional>
#include <string>
#include <vector>

#include "ui/app.hpp"
#include "ui/app_state.hpp"
#include "ui/platform.hpp"

namespace {

// Storage that holds nothing and opens nothing: every screen starts as on a first visit.
class NoStorage : public firn::ui::Platform {
 public:
  std::optional<std::string> load_text(std::string_view) override { return std::nullopt; }
  bool save_text(std::string_view, std::string_view) override { return true; }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  std::string_view name() const override { return "bench"; }
};

double frame_ms(firn::ui::AppState& state, firn::ui::Platform& platform, float width, float height) {
  ImGuiIO& io = ImGui::GetIO();
  io.DisplaySize = ImVec2(width, height);
  io.DeltaTime = 1.0f / 60.0f;
  auto start = std::chrono::steady_clock::now();
  ImGui::NewFrame();
  firn::ui::draw_frame(state, platform, width, height);
  ImGui::Render();
  return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace

int main() {
  using namespace firn::ui;
  ImGui::CreateContext();
  ImGui::GetIO().IniFilename = nullptr;
  NoStorage platform;
  AppState state;
  init_app(state, platform);
  // The font atlas (both faces rasterised; the GPU upload is not included) as at a start.
  for (float ratio : {1.0f, 2.0f, 3.0f}) {
    std::vector<double> ms;
    for (int i = 0; i < 7; ++i) {
      state.display.pixel_ratio = ratio;
      state.built_font_scale = 0.0f;
      auto start = std::chrono::steady_clock::now();
      update_fonts(state);
      unsigned char* pixels = nullptr;
      int w = 0, h = 0;
      ImGui::GetIO().Fonts->GetTexDataAsRGBA32(&pixels, &w, &h);  // as the renderer asks
      ms.push_back(std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count());
      if (i == 6) std::printf("font atlas at pixel ratio %.0f: median %.1f ms, %d x %d texels\n", ratio, (std::sort(ms.begin(), ms.end()), ms[3]), w, h);
    }
  }
  state.display.pixel_ratio = 1.0f;
  state.built_font_scale = 0.0f;
  update_fonts(state);
  // A casualty at 4500 m with an SpO2 entered, so the screens show their figures and verdicts.
  state.situation.altitude = firn::units::metres(4500.0);
  state.situation.altitude_entered = true;
  state.situation.spo2 = firn::units::percent(78.0);
  state.situation.spo2_measured = true;
  std::printf("Firn frame benchmark: draw_frame per screen (4500 m, SpO2 78 %%), median of 200 frames after 20\n");
  for (auto [width, height] : {std::pair{1280.0f, 720.0f}, std::pair{390.0f, 844.0f}}) {
    for (const auto& screen : kScreenNames) {
      state.screen = screen.screen;
      std::vector<double> ms;
      for (int i = 0; i < 220; ++i) {
        double t = frame_ms(state, platform, width, height);
        if (i >= 20) ms.push_back(t);
      }
      std::sort(ms.begin(), ms.end());
      std::printf("%4.0f x %-4.0f %-10s median %7.3f ms  slowest %7.3f ms  %6d vertices\n", width,
                  height, std::string(screen.label).c_str(), ms[ms.size() / 2], ms.back(),
                  ImGui::GetDrawData()->TotalVtxCount);
    }
  }
  ImGui::DestroyContext();
}
