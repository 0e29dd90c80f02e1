// Text into the printable documents (pocket card, reference sheet, handover): one escaping rule.
#pragma once

#include <string>
#include <string_view>

namespace firn {

// &, <, > and " as HTML entities: team names, notes and labels are the user's own words.
inline std::string html_escape(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      default: out += c;
    }
  }
  return out;
}

}  // namespace firn
