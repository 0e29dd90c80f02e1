#include "assets.hpp"

namespace firn::assets {

extern const unsigned char font_regular[];
extern const std::size_t font_regular_size;
extern const unsigned char font_bold[];
extern const std::size_t font_bold_size;

std::span<const unsigned char> ui_font_regular() { return {font_regular, font_regular_size}; }
std::span<const unsigned char> ui_font_bold() { return {font_bold, font_bold_size}; }

const std::uint16_t* ui_font_regular_ranges() {
  static constexpr std::uint16_t ranges[] = {FIRN_FONT_REGULAR_RANGES, 0};
  return ranges;
}
const std::uint16_t* ui_font_bold_ranges() {
  static constexpr std::uint16_t ranges[] = {FIRN_FONT_BOLD_RANGES, 0};
  return ranges;
}

}  // namespace firn::assets
