// The desktop app's launch options (--screen, --theme): which screen and theme to open with.
// Unknown names are an error listing the valid ones.
#pragma once

#include <string>

#include "model/result.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

// Empty strings leave the state as it is.
Result<bool> apply_launch_options(AppState& state, const std::string& screen,
                                  const std::string& theme);

}  // namespace firn::ui
