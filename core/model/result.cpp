#include "model/result.hpp"

#include <cmath>
#include <cstdio>

namespace firn {

std::string format_number(double value, int decimals) {
  if (!std::isfinite(value)) return "not a number";
  // Huge figures (only ever someone's typo, echoed in a message) in 6 significant digits: fixed
  // notation would not fit the buffer and was cut to a wrong number (fuzz finding, "2e101"
  // printed as 63 digits; docs/hardening.md).
  if (std::fabs(value) >= 1e15) {
    char scientific[32];
    std::snprintf(scientific, sizeof scientific, "%.6g", value);
    return scientific;
  }
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
  std::string text(buffer);
  if (text.find('.') != std::string::npos) {
    while (!text.empty() && text.back() == '0') text.pop_back();
    if (!text.empty() && text.back() == '.') text.pop_back();
  }
  if (text == "-0") text = "0";
  return text;
}

bool in_range(double value, double low, double high) {
  return std::isfinite(value) && value >= low && value <= high;
}

Error range_error(std::string_view what, double low, double high, std::string_view unit) {
  std::string message(what);
  message += " must be between " + format_number(low) + " and " + format_number(high);
  if (!unit.empty()) message += " " + std::string(unit);  // counts have none: no stray space
  return Error{message};
}

Error range_error(std::string_view what, double low, double high, std::string_view unit,
                  double got) {
  Error error = range_error(what, low, high, unit);
  if (std::isfinite(got)) {
    error.message += " (got " + format_number(got) + (unit.empty() ? "" : " ") + std::string(unit) + ")";
  } else {
    error.message += got_not_a_number;
  }
  return error;
}

}  // namespace firn
