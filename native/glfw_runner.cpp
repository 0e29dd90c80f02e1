// [SECTION] Window and context  [SECTION] Event loop (sleeps when idle)  [SECTION] Screenshot
#include "glfw_runner.hpp"

#include <GLFW/glfw3.h>
#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#define STB_IMAGE_WRITE_IMPLEMENTATION
#include <stb/stb_image_write.h>

#include <cstdio>
#include <vector>

#include "glfw_frame.hpp"
#include "native_platform.hpp"
#include "ui/app.hpp"
#include "app_launch.hpp"

namespace firn::native {
namespace {

bool write_screenshot(const std::string& path, int width, int height) {
  std::vector<unsigned char> pixels(static_cast<size_t>(width) * height * 4);
  glPixelStorei(GL_PACK_ALIGNMENT, 1);
  glReadBuffer(GL_BACK);
  glReadPixels(0, 0, width, height, GL_RGBA, GL_UNSIGNED_BYTE, pixels.data());
  // GL rows run bottom-up, PNG rows top-down.
  std::vector<unsigned char> flipped(pixels.size());
  size_t row = static_cast<size_t>(width) * 4;
  for (int y = 0; y < height; ++y) {
    std::copy_n(&pixels[(height - 1 - y) * row], row, &flipped[y * row]);
  }
  return stbi_write_png(path.c_str(), width, height, 4, flipped.data(), static_cast<int>(row)) != 0;
}

void glfw_error(int code, const char* description) {
  std::fprintf(stderr, "firn: window system error %d: %s\n", code, description);
}

}  // namespace

int run_app(const cli::AppOptions& options) {
  glfwSetErrorCallback(glfw_error);
  if (!glfwInit()) {
    std::fprintf(stderr, "firn: cannot open a window (no display?). The calculators work from the "
                         "command line: firn --help\n");
    return 1;
  }
  // [SECTION] Window and context
  glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
  glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 0);
  bool capture = !options.screenshot_path.empty();
  if (capture) glfwWindowHint(GLFW_RESIZABLE, GLFW_FALSE);
  GLFWwindow* window = glfwCreateWindow(options.width, options.height, "Firn", nullptr, nullptr);
  if (window == nullptr) {
    glfwTerminate();
    std::fprintf(stderr, "firn: cannot create an OpenGL 3 window\n");
    return 1;
  }
  glfwMakeContextCurrent(window);
  glfwSwapInterval(1);

  IMGUI_CHECKVERSION();
  ImGui::CreateContext();
  ImGui_ImplGlfw_InitForOpenGL(window, true);
  ImGui_ImplOpenGL3_Init("#version 130");

  NativePlatform platform({}, options.test_items_path);
  ui::AppState state;
  float x_scale = 1.0f, y_scale = 1.0f;
  glfwGetWindowContentScale(window, &x_scale, &y_scale);
  state.display.pixel_ratio = options.pixel_ratio > 0.0f ? options.pixel_ratio : x_scale;
  ui::init_app(state, platform);
  if (Result<bool> applied = ui::apply_launch_options(state, options.screen, options.theme); !applied) {
    std::fprintf(stderr, "firn: %s\n", applied.error().message.c_str());
    return 2;
  }

  // [SECTION] Event loop (sleeps when idle)
  int settle = glfw::kSettleFrames;
  int frames_for_capture = std::max(options.frames, 2);
  double idle_start = 0.0;
  int idle_frames_at_start = 0;
  bool idle_measuring = options.idle_seconds > 0.0;
  int exit_code = 0;
  while (!glfwWindowShouldClose(window)) {
    bool idle = settle <= 0 && !capture;
    if (idle) {
      if (idle_measuring) {
        if (idle_start == 0.0) {
          idle_start = glfwGetTime();
          idle_frames_at_start = state.frames_drawn;
        }
        double left = options.idle_seconds - (glfwGetTime() - idle_start);
        if (left <= 0.0) {
          std::printf("idle frames drawn in %.1f s without input: %d (settled after %d frames)\n",
                      options.idle_seconds, state.frames_drawn - idle_frames_at_start,
                      idle_frames_at_start);
          break;
        }
        glfwWaitEventsTimeout(left);
        if (glfwGetTime() - idle_start >= options.idle_seconds) continue;  // timed out: report
      } else if (state.wake_after_seconds > 0.0) {
        glfwWaitEventsTimeout(state.wake_after_seconds);  // a timer on screen: its next minute
      } else {
        glfwWaitEvents();  // sleeps until input: an idle app draws nothing
      }
      settle = glfw::kSettleFrames;  // woken by an event: draw until ImGui settles again
    } else {
      glfwPollEvents();
    }

    glfw::draw_frame(window, state, platform);
    int fb_width = 0, fb_height = 0;
    glfwGetFramebufferSize(window, &fb_width, &fb_height);
    --settle;

    // [SECTION] Screenshot
    if (capture && --frames_for_capture <= 0) {
      if (!write_screenshot(options.screenshot_path, fb_width, fb_height)) {
        std::fprintf(stderr, "firn: could not write %s\n", options.screenshot_path.c_str());
        exit_code = 1;
      }
      glfwSwapBuffers(window);
      break;
    }
    glfwSwapBuffers(window);
  }
  platform.write_test_items();
  ImGui_ImplOpenGL3_Shutdown();
  ImGui_ImplGlfw_Shutdown();
  ImGui::DestroyContext();
  glfwDestroyWindow(window);
  glfwTerminate();
  return exit_code;
}

}  // namespace firn::native
