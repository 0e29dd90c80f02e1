// Invariants every fuzz target asserts, and a source of awkward doubles. A broken invariant
// prints what broke and aborts, which libFuzzer reports as a crash with the input that caused it.
#pragma once

#include <fuzzer/FuzzedDataProvider.h>

#include <cctype>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <limits>
#include <string>
#include <string_view>

#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::fuzz {

[[noreturn]] inline void fail(const std::string& what) {
  std::fprintf(stderr, "fuzz invariant broken: %s\n", what.c_str());
  std::abort();
}

inline void require(bool condition, const std::string& what) {
  if (!condition) fail(what);
}

inline void require_finite(double value, const std::string& what) {
  if (!std::isfinite(value)) fail(what + " is not finite");
}

template <class Dimension>
void require_finite(units::Quantity<Dimension> q, const std::string& what) {
  // Read in the SI unit of the dimension (scale 1, offset 0).
  require_finite(q.in(units::ReadingUnit<Dimension>{1.0, 0.0, "", ""}), what);
}

// "nan", "inf", "-nan" as whole words: what printf makes of a non-finite double.
inline bool has_non_finite_text(std::string_view text) {
  auto is_letter = [](char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; };
  for (std::string_view word : {"nan", "inf"}) {
    for (size_t at = 0; at + word.size() <= text.size(); ++at) {
      bool match = true;
      for (size_t k = 0; k < word.size() && match; ++k) {
        match = std::tolower(static_cast<unsigned char>(text[at + k])) == word[k];
      }
      if (!match) continue;
      bool starts = at == 0 || !is_letter(text[at - 1]);
      bool ends = at + word.size() == text.size() || !is_letter(text[at + word.size()]);
      if (starts && ends) return true;
    }
  }
  return false;
}

inline void require_clean_text(std::string_view text, const std::string& what) {
  if (has_non_finite_text(text)) fail(what + " shows a non-finite number: " + std::string(text));
}

// An error must say something a medic can act on, and never print "nan".
inline void require_message(const Error& error, const std::string& what) {
  require(!error.message.empty(), what + ": error with an empty message");
  require_clean_text(error.message, what + " error message");
}

// Well-formed UTF-8 (what the UI font, the card and JSON output need).
inline bool is_utf8(std::string_view text) {
  for (size_t i = 0; i < text.size();) {
    unsigned char c = static_cast<unsigned char>(text[i]);
    size_t extra = c < 0x80 ? 0 : (c & 0xE0) == 0xC0 ? 1 : (c & 0xF0) == 0xE0 ? 2
                 : (c & 0xF8) == 0xF0 ? 3 : 99;
    if (extra == 99 || extra >= text.size() - i) return false;
    for (size_t k = 1; k <= extra; ++k) {
      if ((static_cast<unsigned char>(text[i + k]) & 0xC0) != 0x80) return false;
    }
    i += extra + 1;
  }
  return true;
}

// Checks a Result: an error needs a message (free of "nan" unless `message_may_echo_input`:
// messages quote what the user typed); a value goes to `check_value`.
template <class T, class Check>
void check_result(const Result<T>& result, const std::string& what, Check check_value,
                  bool message_may_echo_input = false) {
  if (!result.ok()) {
    if (message_may_echo_input) {
      require(!result.error().message.empty(), what + ": error with an empty message");
    } else {
      require_message(result.error(), what);
    }
    return;
  }
  check_value(result.value());
}

// A double the model may meet at its edges: non-finite, huge, tiny, negative, a boundary, or
// (most often) a value in [low, high] so that the fuzzer also reaches the success paths.
inline double awkward_double(FuzzedDataProvider& data, double low, double high) {
  static constexpr double specials[] = {
      std::numeric_limits<double>::quiet_NaN(), -std::numeric_limits<double>::quiet_NaN(),
      std::numeric_limits<double>::infinity(), -std::numeric_limits<double>::infinity(),
      std::numeric_limits<double>::max(), -std::numeric_limits<double>::max(),
      std::numeric_limits<double>::min(), std::numeric_limits<double>::denorm_min(),
      -std::numeric_limits<double>::denorm_min(), 0.0, -0.0, 1.0, -1.0, 1e300, -1e300, 1e-300,
      9e15, -9e15, 1e18};
  uint8_t kind = data.ConsumeIntegral<uint8_t>();
  if (kind < 24) return data.PickValueInArray(specials);
  if (kind < 40) {  // raw bits: every NaN payload, denormal and exponent
    uint64_t bits = data.ConsumeIntegral<uint64_t>();
    double value;
    static_assert(sizeof value == sizeof bits);
    __builtin_memcpy(&value, &bits, sizeof value);
    return value;
  }
  if (kind < 56) {  // a boundary, or just past it
    double edge = data.ConsumeBool() ? low : high;
    switch (data.ConsumeIntegralInRange<int>(0, 3)) {
      case 0: return edge;
      case 1: return std::nextafter(edge, -INFINITY);
      case 2: return std::nextafter(edge, INFINITY);
      default: return edge + data.ConsumeFloatingPointInRange<double>(-1.0, 1.0);
    }
  }
  if (kind < 72) return data.ConsumeFloatingPoint<double>();  // any finite value
  return data.ConsumeFloatingPointInRange<double>(low, high);
}

}  // namespace firn::fuzz
