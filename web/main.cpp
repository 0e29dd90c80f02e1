// [SECTION] Canvas size and pixel ratio  [SECTION] Frame  [SECTION] Waking from idle  [SECTION] Start
// The page's entry point: GLFW (Emscripten's built-in port) + WebGL2 + the shared ImGui UI.
// The main loop pauses once the UI has settled, so an idle page draws nothing; the page shell
// (web/shell/firn-shell.js) calls firn_wake() on any input, resize or visibility change.
#include <GLFW/glfw3.h>
#include <emscripten.h>
#include <emscripten/html5.h>
#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#include <malloc.h>

#include <algorithm>
#include <cmath>

#include "glfw_frame.hpp"
#include "ui/app.hpp"
#include "web_platform.hpp"

namespace firn::web {
namespace {

struct WebRunner {
  GLFWwindow* window = nullptr;
  ui::AppState state;
  WebPlatform platform;
  int settle_frames = glfw::kSettleFrames;
  bool paused = false;
  int page_colour = -1;  // 0xRRGGBB last given to the page shell, -1 before the first frame
};

// [SECTION] Canvas size and pixel ratio

struct CanvasSize {
  int width = 1;   // framebuffer pixels
  int height = 1;
  float pixel_ratio = 1.0f;
};

// Emscripten's GLFW ignores devicePixelRatio: we size the GLFW window (= the canvas's backing
// store) in device pixels; the stylesheet keeps the canvas at full-window CSS size, so the page
// is sharp on phones. The whole UI then works in framebuffer pixels, scaled by pixel_ratio.
CanvasSize wanted_canvas_size() {
  double css_width = 0.0, css_height = 0.0;
  emscripten_get_element_css_size("#canvas", &css_width, &css_height);
  double ratio = emscripten_get_device_pixel_ratio();
  if (!(ratio > 0.0) || !std::isfinite(ratio)) ratio = 1.0;
  CanvasSize size;
  size.width = std::max(1, static_cast<int>(std::lround(css_width * ratio)));
  size.height = std::max(1, static_cast<int>(std::lround(css_height * ratio)));
  size.pixel_ratio = static_cast<float>(ratio);
  return size;
}

void follow_canvas_size(WebRunner& runner) {
  CanvasSize wanted = wanted_canvas_size();
  int width = 0, height = 0;
  glfwGetWindowSize(runner.window, &width, &height);
  if (wanted.width != width || wanted.height != height) {
    glfwSetWindowSize(runner.window, wanted.width, wanted.height);
  }
  runner.state.display.pixel_ratio = wanted.pixel_ratio;
}

// [SECTION] Frame

void draw_one_frame(void* argument) {
  WebRunner& runner = *static_cast<WebRunner*>(argument);
  follow_canvas_size(runner);
  int colour = glfw::draw_frame(runner.window, runner.state, runner.platform);
  // The browser's bars and the page behind the canvas follow the theme (day white, night black).
  if (colour != runner.page_colour) {
    runner.page_colour = colour;
    publish_page_colour(colour);
  }

  publish_frame_info(runner.state.frames_drawn, ImGui::GetIO().WantTextInput, runner.state.display.pixel_ratio);
  if (--runner.settle_frames <= 0) {
    runner.paused = true;
    emscripten_pause_main_loop();  // idle: no frames until firn_wake()
    if (runner.state.wake_after_seconds > 0.0) schedule_wake(runner.state.wake_after_seconds);
  }
}

// Emscripten 3.1.6's GLFW hands the scroll callback the DOM wheel delta as it is: positive =
// down and about 100 per notch in pixel mode (3 in line mode), where GLFW and ImGui expect
// positive = up and 1 per notch. Passed on raw, a notch down scrolled 200 lines *up* (nothing
// moved at the top of a screen) and a notch up jumped to the bottom.
double wheel_steps(double dom_delta) {
  double per_notch = std::fabs(dom_delta) >= 50.0 ? 100.0 : 3.0;
  return -dom_delta / per_notch;
}

void scroll_callback(GLFWwindow* window, double dom_x, double dom_y) {
  ImGui_ImplGlfw_ScrollCallback(window, wheel_steps(dom_x), wheel_steps(dom_y));
}

}  // namespace
}  // namespace firn::web

// [SECTION] Waking from idle

// Called by the page shell on input, resize, orientation or visibility change. `runner` is the
// pointer main() handed to the page (Module.firnRunner).
extern "C" EMSCRIPTEN_KEEPALIVE void firn_wake(void* runner_pointer) {
  auto* runner = static_cast<firn::web::WebRunner*>(runner_pointer);
  if (runner == nullptr) return;
  runner->settle_frames = firn::glfw::kSettleFrames;
  if (runner->paused) {
    runner->paused = false;
    emscripten_resume_main_loop();
  }
}

// Bytes the app holds on its heap right now (emmalloc's in-use total): the long-session
// browser test checks that it stays level over thousands of interactions.
extern "C" EMSCRIPTEN_KEEPALIVE unsigned firn_heap_in_use() {
  return static_cast<unsigned>(mallinfo().uordblks);
}

// [SECTION] Start

int main() {
  using namespace firn;
  if (!glfwInit()) {
    web::report_start_problem("webgl");
    return 1;
  }
  glfwWindowHint(GLFW_CLIENT_API, GLFW_OPENGL_ES_API);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 0);
  web::CanvasSize size = web::wanted_canvas_size();
  GLFWwindow* window = glfwCreateWindow(size.width, size.height, "Firn", nullptr, nullptr);
  if (window == nullptr) {
    web::report_start_problem("webgl");
    return 1;
  }
  glfwMakeContextCurrent(window);

  IMGUI_CHECKVERSION();
  ImGui::CreateContext();
  ImGui_ImplGlfw_InitForOpenGL(window, true);
  glfwSetScrollCallback(window, web::scroll_callback);  // replaces ImGui's; calls it normalised
  ImGui_ImplOpenGL3_Init("#version 300 es");

  // Lives as long as the page; never freed on purpose.
  auto* runner = new web::WebRunner();
  runner->window = window;
  runner->state.display.pixel_ratio = size.pixel_ratio;
  ui::init_app(runner->state, runner->platform);
  web::hand_runner_to_page(runner);
  emscripten_set_main_loop_arg(web::draw_one_frame, runner, 0, 1);
  return 0;
}
