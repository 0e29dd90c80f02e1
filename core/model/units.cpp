#include "model/units.hpp"

#include <cctype>
#include <cmath>
#include <cstdlib>
#include <type_traits>

namespace firn::units {
namespace {

std::string_view trim(std::string_view text) {
  while (!text.empty() && std::isspace(static_cast<unsigned char>(text.front()))) text.remove_prefix(1);
  while (!text.empty() && std::isspace(static_cast<unsigned char>(text.back()))) text.remove_suffix(1);
  return text;
}

bool is_number_char(char c) {
  return std::isdigit(static_cast<unsigned char>(c)) || c == '.' || c == ',' || c == '+' ||
         c == '-' || c == 'e' || c == 'E';
}

// Length of the leading run that can belong to a number. An 'e' counts only when a digit or sign
// follows, so "5e3m" is 5000 m but a unit cannot start with a swallowed 'e'.
size_t number_prefix_length(std::string_view text) {
  size_t i = 0;
  while (i < text.size() && is_number_char(text[i])) {
    if (text[i] == 'e' || text[i] == 'E') {
      bool exponent = i + 1 < text.size() &&
                      (std::isdigit(static_cast<unsigned char>(text[i + 1])) ||
                       text[i + 1] == '+' || text[i + 1] == '-');
      if (!exponent) break;
    }
    ++i;
  }
  return i;
}

std::string lower_ascii(std::string_view text) {
  std::string out;
  for (char c : text) out += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

// Accept the degree sign and "deg" decorations in temperature units: "°C", "degC".
std::string normalise_unit(std::string_view unit) {
  std::string text = lower_ascii(trim(unit));
  const std::string degree = "\xC2\xB0";  // UTF-8 '°'
  if (text.rfind(degree, 0) == 0) text.erase(0, degree.size());
  if (text.rfind("deg", 0) == 0 && text.size() > 3) text.erase(0, 3);
  return text;
}

template <class Dimension, size_t N>
Result<Quantity<Dimension>> parse_quantity(std::string_view text, std::string_view what,
                                           const std::array<const Unit<Dimension>*, N>& units,
                                           std::type_identity_t<const Unit<Dimension>*> default_unit) {
  std::string_view trimmed = trim(text);
  size_t split = number_prefix_length(trimmed);
  Result<double> number = split == 0 && !trimmed.empty()
                              ? Result<double>(Error{std::string(what) + " is not a number: '" +
                                                     std::string(trimmed) + "'"})
                              : parse_number(trimmed.substr(0, split), what);
  std::string accepted;
  for (size_t i = 0; i < N; ++i) {
    accepted += std::string(units[i]->symbol);
    accepted += i + 2 < N ? ", " : (i + 1 < N ? " or " : "");
  }
  if (!number.ok()) {
    return Error{number.error().message + " (example: 12" + std::string(units[0]->symbol) + ")"};
  }
  std::string unit = normalise_unit(trimmed.substr(split));
  if (unit.empty()) {
    if (default_unit != nullptr) return (*default_unit)(number.value());
    return Error{std::string(what) + " needs a unit: " + accepted + " (example: " +
                 format_number(number.value()) + std::string(units[0]->symbol) + ")"};
  }
  for (const Unit<Dimension>* candidate : units) {
    if (unit != candidate->spelling) continue;
    if (std::optional<Error> ambiguous = ambiguous_grouping(trimmed.substr(0, split), *candidate, what)) {
      return *ambiguous;
    }
    return (*candidate)(number.value());
  }
  return Error{"unknown unit '" + std::string(trim(trimmed.substr(split))) + "' for " +
               std::string(what) + ": use " + accepted};
}

}  // namespace

Error range_error(std::string_view what, const NumberRange& range) {
  Error e = firn::range_error(what, range.low, range.high, range.unit);
  e.message += range.note;
  return e;
}

Error refused(std::string_view what, double value, const NumberRange& range) {
  Error e = firn::range_error(what, range.low, range.high, range.unit, value);
  e.message += range.note;
  return e;
}

Result<double> check(std::string_view what, double value, const NumberRange& range) {
  if (range.contains(value)) return value;
  return refused(what, value, range);
}

Result<double> parse_number(std::string_view text, std::string_view what) {
  std::string_view trimmed = trim(text);
  if (trimmed.empty()) return Error{std::string(what) + " is missing a number"};
  const std::string quoted = "'" + std::string(trimmed) + "'";
  size_t dots = 0, commas = 0;
  for (char c : trimmed) {
    if (!is_number_char(c)) return Error{std::string(what) + " is not a number: " + quoted};
    dots += c == '.';
    commas += c == ',';
  }
  // "1.2.3" or "1,234.5" has no one meaning: refused, never read as 1.23 or 1.
  if (dots + commas > 1) {
    return Error{std::string(what) + " " + quoted +
                 " has more than one decimal mark: type it again with one (or none)"};
  }
  std::string normalised(trimmed);
  for (char& c : normalised) {
    if (c == ',') c = '.';
  }
  char* end = nullptr;
  double value = std::strtod(normalised.c_str(), &end);
  if (end != normalised.c_str() + normalised.size() || !std::isfinite(value)) {
    return Error{std::string(what) + " is not a number: " + quoted};
  }
  return value;
}

std::optional<double> thousands_reading(std::string_view number_text) {
  std::string_view t = trim(number_text);
  bool negative = !t.empty() && t.front() == '-';
  if (!t.empty() && (t.front() == '-' || t.front() == '+')) t.remove_prefix(1);
  size_t mark = t.find_first_of(".,");
  if (mark == std::string_view::npos || mark == 0 || mark > 3 || t.size() != mark + 4) return std::nullopt;
  if (t.front() == '0') return std::nullopt;  // "0.125" is a decimal, never a grouping
  double value = 0.0;
  for (size_t i = 0; i < t.size(); ++i) {
    if (i == mark) continue;
    if (!std::isdigit(static_cast<unsigned char>(t[i]))) return std::nullopt;
    value = value * 10.0 + (t[i] - '0');
  }
  return negative ? -value : value;
}

namespace {
template <class Dimension>
std::optional<Error> refuse_if_plausible(std::string_view number_text, const Unit<Dimension>& unit,
                                         std::string_view what, bool plausible_as_thousands) {
  if (!plausible_as_thousands) return std::nullopt;
  Result<double> as_decimal = parse_number(number_text, what);
  if (!as_decimal) return std::nullopt;
  std::string symbol = std::string(unit.symbol);
  std::string suffix = symbol.empty() ? "" : " " + symbol;
  return Error{"Did you mean " + format_number(*thousands_reading(number_text), 0) + suffix + " or " +
               format_number(as_decimal.value()) + suffix + "? Type the " + std::string(what) +
               " without a thousands separator"};
}
}  // namespace

std::optional<Error> ambiguous_grouping(std::string_view number_text, const Unit<LengthDimension>& unit,
                                        std::string_view what) {
  std::optional<double> grouped = thousands_reading(number_text);
  bool plausible = grouped && std::fabs(unit(*grouped).in(metres)) <= 30000.0;
  return refuse_if_plausible(number_text, unit, what, plausible);
}

std::optional<Error> ambiguous_grouping(std::string_view number_text, const Unit<PressureDimension>& unit,
                                        std::string_view what) {
  std::optional<double> grouped = thousands_reading(number_text);
  bool plausible = grouped && *grouped >= 0.0 && unit(*grouped).in(bar) <= 400.0;
  return refuse_if_plausible(number_text, unit, what, plausible);
}

Result<Length> parse_length(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, length_units, nullptr);
}

Result<Pressure> parse_pressure(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, pressure_units, nullptr);
}

Result<GaugePressure> parse_gauge_pressure(std::string_view text, std::string_view what) {
  std::string_view trimmed = trim(text);
  std::string unit = normalise_unit(trimmed.substr(number_prefix_length(trimmed)));
  const std::string units_named = "bar, psi (gauge), kPa or MPa";
  if (unit == "psia") {
    return Error{std::string(what) + " is read on a gauge: psia is absolute; use " + units_named};
  }
  // "psig" says gauge explicitly: the same psi.
  std::string text_used(trimmed);
  if (unit == "psig") text_used.erase(text_used.size() - 1);
  Result<Pressure> p = parse_quantity(text_used, what, gauge_pressure_units, nullptr);
  if (p) return pascals.gauge(p->in(pascals));
  std::string message = p.error().message;
  // Name the gauge units in the user's words, whatever the generic parser listed.
  if (size_t use = message.find(": use "); use != std::string::npos) {
    message = message.substr(0, use) + ": a gauge reads in " + units_named;
  } else if (size_t needs = message.find(" needs a unit: "); needs != std::string::npos) {
    message = message.substr(0, needs) + " needs a gauge unit: " + units_named +
              message.substr(message.find(" (example"));
  }
  return Error{message};
}

Result<GaugePressure> parse_gauge_any_unit(std::string_view text, std::string_view what) {
  Result<Pressure> p = parse_pressure(text, what);
  if (!p) return p.error();
  return pascals.gauge(p->in(pascals));
}

Result<Temperature> parse_temperature(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, temperature_units, nullptr);
}

Result<Volume> parse_volume(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, volume_units, &litres);
}

Result<VolumeFlow> parse_volume_flow(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, volume_flow_units, &litres_per_minute);
}

Result<Duration> parse_duration(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, duration_units, nullptr);
}

Result<Duration> parse_long_duration(std::string_view text, std::string_view what) {
  return parse_quantity(text, what, long_duration_units, nullptr);
}

}  // namespace firn::units
