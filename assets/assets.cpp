#include "assets.hpp"

namespace firn::assets {

extern const unsigned char font_regular[];
extern const std::size_t font_regular_size;
extern const unsigned char font_bold[];
extern const std::size_t font_bold_size;

std::span<const unsigned char> ui_font_regular() { return {font_regular, font_regular_size}; }
std::span<const unsigned char> ui_font_bold() { return {font_bold, font_bold_size}; }

}  // namespace firn::assets
