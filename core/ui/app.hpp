// The Firn UI: one call per frame between ImGui::NewFrame() and ImGui::Render(), shared by the
// native and web runners. Runners own the window, GL context and event loop.
#pragma once

#include "ui/app_state.hpp"
#include "ui/platform.hpp"

struct ImFont;

namespace firn::ui {

// Called once after ImGui::CreateContext(): style, saved settings.
void init_app(AppState& state, Platform& platform);

// Rebuilds the font atlas when the pixel ratio or theme scale changed. Returns true when it did:
// the runner must then recreate the renderer's font texture.
bool update_fonts(AppState& state);

// Draws one frame of the whole app into the current ImGui frame, filling `width`×`height`
// framebuffer pixels.
void draw_frame(AppState& state, Platform& platform, float width, float height);

// Nothing in Firn animates by itself (no transitions): the runners draw only in answer to input,
// so an idle phone in the cold spends no battery on us. A visible reassessment timer asks for one
// frame when its minute changes (AppState::wake_after_seconds), never continuous frames.

}  // namespace firn::ui
