#include "glfw_frame.hpp"

#include <GLFW/glfw3.h>
#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#include <algorithm>

#include "ui/app.hpp"

namespace firn::glfw {

int draw_frame(GLFWwindow* window, ui::AppState& state, ui::Platform& platform) {
  // The first NewFrame creates the device objects and uploads the atlas just built; creating the
  // texture here as well uploaded the first atlas twice and lost one texture (issue 17).
  bool texture_exists = ImGui::GetIO().Fonts->TexID != ImTextureID{};
  if (ui::update_fonts(state) && texture_exists) {
    ImGui_ImplOpenGL3_DestroyFontsTexture();
    ImGui_ImplOpenGL3_CreateFontsTexture();
  }
  ImGui_ImplOpenGL3_NewFrame();
  ImGui_ImplGlfw_NewFrame();
  ImGuiIO& io = ImGui::GetIO();
  io.DisplayFramebufferScale = ImVec2(1.0f, 1.0f);  // the app lays out in framebuffer pixels
  ImGui::NewFrame();
  ui::draw_frame(state, platform, io.DisplaySize.x, io.DisplaySize.y);
  ImGui::Render();
  int fb_width = 0, fb_height = 0;
  glfwGetFramebufferSize(window, &fb_width, &fb_height);
  glViewport(0, 0, fb_width, fb_height);
  const ImVec4 clear = ImGui::GetStyle().Colors[ImGuiCol_WindowBg];
  glClearColor(clear.x, clear.y, clear.z, 1.0f);
  glClear(GL_COLOR_BUFFER_BIT);
  ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
  auto channel = [](float value) { return std::clamp(static_cast<int>(value * 255.0f + 0.5f), 0, 255); };
  return (channel(clear.x) << 16) | (channel(clear.y) << 8) | channel(clear.z);
}

}  // namespace firn::glfw
