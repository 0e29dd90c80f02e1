// UI test hook: our widgets record the rectangle (and shown text) of every labelled item each
// frame, so browser and native tests find widgets by label instead of by pixel position.
// Rectangles are in framebuffer pixels; the web page divides by devicePixelRatio.
#pragma once

#include <string>
#include <string_view>

namespace firn::ui::test_hook {

void begin_frame();
// Records the last ImGui item under `label` (unique per frame; a repeat gets "#2" appended).
void item(std::string_view label);
// Records the last ImGui item under `label` with the text it shows ("701.2 hPa").
void item_text(std::string_view label, std::string_view shown_text);
// Records something drawn rather than an ImGui item (a chart's label or mark), with its rectangle
// in framebuffer pixels, so a test can check what it overlaps.
void drawn(std::string_view label, std::string_view shown_text, float x0, float y0, float x1, float y1);
// The frame's items as a JSON array [{"label","text","x","y","w","h"}].
std::string frame_json();

}  // namespace firn::ui::test_hook
