// Screen placeholder while its model lands.
#include "ui/panels.hpp"
#include "ui/widgets.hpp"
namespace firn::ui {
void draw_teaching_panel(AppState& state, Platform&) { caution_line(state); }
}  // namespace firn::ui
