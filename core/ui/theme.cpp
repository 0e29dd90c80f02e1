#include "ui/theme.hpp"

namespace firn::ui {
namespace {

ImVec4 rgb(int r, int g, int b) { return ImVec4(r / 255.f, g / 255.f, b / 255.f, 1.f); }

// Day: near-black on white, 18.9:1; dim text #3d3d3d on white 11:1 (WCAG 2.1 contrast formula).
const Palette kDay{rgb(255, 255, 255), rgb(17, 17, 17),    rgb(61, 61, 61),   rgb(0, 70, 140),
                   rgb(100, 58, 0),    rgb(160, 0, 0),     rgb(232, 236, 241), rgb(196, 214, 236),
                   rgb(80, 80, 80),    rgb(0, 100, 40)};
// Night: only red light. Text #ff3b30-ish on black. Tones by lightness: caution is the
// lightest red, danger a bright block, good the body red, no verdict the dim red.
const Palette kNight{rgb(0, 0, 0),    rgb(230, 40, 30),  rgb(170, 30, 24), rgb(255, 80, 60),
                     rgb(255, 135, 105), rgb(255, 60, 50), rgb(36, 4, 2),   rgb(80, 10, 6),
                     rgb(120, 20, 12),  rgb(220, 40, 30)};
// Night, dimmed: every light at about half the luminance (49–65 %), the bright tones lowered
// most; the tones stay ≥ 1.3:1 apart and dim text 2.25:1 on black (WCAG 2.1 formulas; the
// figures are checked in tests/ui).
const Palette kNightDim{rgb(0, 0, 0),     rgb(179, 31, 23), rgb(139, 25, 20), rgb(191, 60, 45),
                        rgb(184, 97, 76), rgb(191, 45, 38), rgb(29, 3, 2),    rgb(64, 8, 5),
                        rgb(96, 16, 10),  rgb(172, 31, 23)};
// Projection: white on very dark blue, large type.
const Palette kProjection{rgb(12, 18, 32),   rgb(255, 255, 255), rgb(215, 222, 232),
                          rgb(120, 190, 255), rgb(255, 200, 90),  rgb(255, 120, 110),
                          rgb(32, 44, 70),    rgb(52, 80, 130),   rgb(140, 150, 170),
                          rgb(120, 225, 150)};

}  // namespace

const Palette& palette(Theme theme, bool night_dim) {
  switch (theme) {
    case Theme::Night: return night_dim ? kNightDim : kNight;
    case Theme::Projection: return kProjection;
    case Theme::Day: break;
  }
  return kDay;
}

float theme_text_scale(Theme theme) { return theme == Theme::Projection ? 1.6f : 1.0f; }

const char* theme_label(Theme theme) {
  switch (theme) {
    case Theme::Night: return "Night";
    case Theme::Projection: return "Projector";
    case Theme::Day: break;
  }
  return "Day";
}

void apply_theme(Theme theme, float pixel_ratio, bool night_dim) {
  const Palette& p = palette(theme, night_dim);
  ImGuiStyle style;  // fresh defaults, then scaled: ScaleAllSizes is not idempotent
  style.WindowPadding = ImVec2(12, 12);
  style.FramePadding = ImVec2(10, 10);
  style.ItemSpacing = ImVec2(10, 10);
  style.ItemInnerSpacing = ImVec2(8, 8);
  style.FrameRounding = 6.0f;
  style.GrabRounding = 6.0f;
  style.WindowRounding = 0.0f;
  style.WindowBorderSize = 0.0f;
  style.FrameBorderSize = 1.0f;
  style.ScrollbarSize = 18.0f;
  style.GrabMinSize = 24.0f;
  style.TouchExtraPadding = ImVec2(4, 4);
  style.ScaleAllSizes(pixel_ratio * theme_text_scale(theme));

  ImVec4* c = style.Colors;
  c[ImGuiCol_Text] = p.text;
  c[ImGuiCol_TextDisabled] = p.text_dim;
  c[ImGuiCol_WindowBg] = p.background;
  c[ImGuiCol_ChildBg] = p.background;
  c[ImGuiCol_PopupBg] = p.background;
  c[ImGuiCol_Border] = p.border;
  c[ImGuiCol_FrameBg] = p.surface;
  c[ImGuiCol_FrameBgHovered] = p.surface_active;
  c[ImGuiCol_FrameBgActive] = p.surface_active;
  c[ImGuiCol_TitleBg] = p.surface;
  c[ImGuiCol_TitleBgActive] = p.surface_active;
  c[ImGuiCol_MenuBarBg] = p.surface;
  c[ImGuiCol_ScrollbarBg] = p.background;
  c[ImGuiCol_ScrollbarGrab] = p.border;
  c[ImGuiCol_ScrollbarGrabHovered] = p.accent;
  c[ImGuiCol_ScrollbarGrabActive] = p.accent;
  c[ImGuiCol_CheckMark] = p.accent;
  c[ImGuiCol_SliderGrab] = p.accent;
  c[ImGuiCol_SliderGrabActive] = p.accent;
  c[ImGuiCol_Button] = p.surface;
  // Hover is a tint between plain and selected: a mouse over an option never looks chosen.
  c[ImGuiCol_ButtonHovered] = ImVec4(p.surface.x + (p.surface_active.x - p.surface.x) * 0.35f,
                                     p.surface.y + (p.surface_active.y - p.surface.y) * 0.35f,
                                     p.surface.z + (p.surface_active.z - p.surface.z) * 0.35f, 1.0f);
  c[ImGuiCol_ButtonActive] = p.surface_active;
  c[ImGuiCol_Header] = p.surface_active;
  c[ImGuiCol_HeaderHovered] = p.surface_active;
  c[ImGuiCol_HeaderActive] = p.surface_active;
  c[ImGuiCol_Separator] = p.border;
  c[ImGuiCol_Tab] = p.surface;
  c[ImGuiCol_TabHovered] = p.surface_active;
  c[ImGuiCol_TabActive] = p.surface_active;
  c[ImGuiCol_TableHeaderBg] = p.surface;
  c[ImGuiCol_TableBorderStrong] = p.border;
  c[ImGuiCol_TableBorderLight] = p.border;
  c[ImGuiCol_TextSelectedBg] = p.surface_active;
  c[ImGuiCol_NavHighlight] = p.accent;
  c[ImGuiCol_PlotHistogram] = p.danger;  // warnings in text (message_line)
  c[ImGuiCol_PlotLines] = p.accent;
  ImGui::GetStyle() = style;
}

}  // namespace firn::ui
