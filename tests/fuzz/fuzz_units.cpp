// Fuzz target: "number + unit" text as a user types it (core/model/units.hpp parse_*), and the
// number formatting every message and output goes through (format_number in result.hpp).
// Invariants: no crash or sanitizer report; an error has a message without "nan"; a parsed value
// is finite; a formatted number reads back as the same number.
#include <cmath>
#include <string>

#include "fuzz_checks.hpp"
#include "model/units.hpp"

using namespace firn;
using namespace firn::units;

namespace {

// format_number(v, 4) must read back as v to within what it promises to show: a message that
// prints a figure must print THAT figure.
void check_formatting(double value) {
  std::string shown = format_number(value, 4);
  Result<double> back = parse_number(shown, "shown number");
  fuzz::require(back.ok(), "format_number(" + std::to_string(value) + ") gave '" + shown +
                               "', which does not read back as a number");
  // 4 decimals; from 1e15 up, 6 significant digits (format_number's contract).
  double tolerance = std::fabs(value) >= 1e15 ? std::fabs(value) * 5e-6 * 1.0001
                                               : 0.5e-4 * 1.0001 + std::fabs(value) * 1e-15;
  fuzz::require(std::fabs(back.value() - value) <= tolerance,
                "format_number gave '" + shown + "' for " + std::to_string(value));
}

// Error messages quote the text; it may itself say "nan", which is then no finding.
bool echoes_non_finite = false;

template <class Dimension>
void check_quantity(const Result<Quantity<Dimension>>& parsed, const char* what) {
  fuzz::check_result(
      parsed, what,
      [&](Quantity<Dimension> q) {
        fuzz::require_finite(q, what);
        check_formatting(q.in(ReadingUnit<Dimension>{1.0, 0.0, "", ""}));
      },
      echoes_non_finite);
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* bytes, size_t size) {
  std::string_view text(reinterpret_cast<const char*>(bytes), size);
  echoes_non_finite = fuzz::has_non_finite_text(text);
  fuzz::check_result(
      parse_number(text, "number"), "parse_number",
      [](double v) {
        fuzz::require_finite(v, "parse_number");
        check_formatting(v);
      },
      echoes_non_finite);
  check_quantity(parse_length(text), "parse_length");
  check_quantity(parse_pressure(text), "parse_pressure");
  check_quantity(parse_gauge_pressure(text), "parse_gauge_pressure");
  check_quantity(parse_gauge_any_unit(text), "parse_gauge_any_unit");
  check_quantity(parse_temperature(text), "parse_temperature");
  check_quantity(parse_volume(text), "parse_volume");
  check_quantity(parse_volume_flow(text), "parse_volume_flow");
  check_quantity(parse_duration(text), "parse_duration");
  // The same text as the field name: names are free text and must not upset the messages.
  Result<Length> named = parse_length("4000x", text);
  fuzz::require(!named.ok(), "'4000x' parsed as a length");
  fuzz::require(!named.error().message.empty(), "parse_length with a fuzzed name: empty message");
  return 0;
}
