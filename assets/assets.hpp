// Files built into the binary (see assets/CMakeLists.txt for where each comes from).
#pragma once

#include <cstddef>
#include <span>

namespace firn::assets {

std::span<const unsigned char> ui_font_regular();  // DejaVu Sans (Debian fonts-dejavu-core)
std::span<const unsigned char> ui_font_bold();     // DejaVu Sans Bold

}  // namespace firn::assets
