// Files built into the binary (see assets/CMakeLists.txt for where each comes from).
#pragma once

#include <cstddef>
#include <cstdint>
#include <span>

namespace firn::assets {

std::span<const unsigned char> ui_font_regular();  // DejaVu Sans (Debian fonts-dejavu-core)
std::span<const unsigned char> ui_font_bold();     // DejaVu Sans Bold

// The characters each face was cut to, as ImGui glyph ranges (pairs of first and last, then 0):
// FIRN_FONT_UNICODES and FIRN_FONT_BOLD_UNICODES in assets/CMakeLists.txt.
const std::uint16_t* ui_font_regular_ranges();
const std::uint16_t* ui_font_bold_ranges();

}  // namespace firn::assets
