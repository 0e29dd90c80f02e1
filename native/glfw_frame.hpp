// One frame of the app through ImGui's GLFW and OpenGL 3 backends. The desktop app
// (glfw_runner.cpp) and the page (web/main.cpp, on Emscripten's GLFW and WebGL 2) both call it,
// as ImGui's own examples drive native and Emscripten from one loop body; each keeps its own
// window, event loop and idling.
#pragma once

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

struct GLFWwindow;

namespace firn::glfw {

// Frames drawn after an input event before the loop idles: ImGui needs a few to settle hover,
// release and layout.
inline constexpr int kSettleFrames = 4;

// Rebuilds the font texture when the app asks, draws the whole app into the window and renders
// it on the theme's background. Returns that background as 0xRRGGBB.
int draw_frame(GLFWwindow* window, ui::AppState& state, ui::Platform& platform);

}  // namespace firn::glfw
