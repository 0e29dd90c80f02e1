// The native runner: a GLFW window with an OpenGL 3 context, the ImGui GLFW/OpenGL3 backends and
// an event loop that sleeps while nothing changes.
#pragma once

#include "cli/cli.hpp"

namespace firn::native {

// Opens the app window; returns the process exit code.
int run_app(const cli::AppOptions& options);

}  // namespace firn::native
