// Result-or-error values for everything a user can get wrong, and FIRN_ASSERT for what only a
// programmer can get wrong. Bad input is data (a Result holding an Error with a message that names
// the valid range and unit); a broken invariant is a bug (an assert).
#pragma once

#include <string>
#include <string_view>
#include <utility>
#include <variant>

// FIRN_ASSERT: a broken invariant aborts with a message, in the app, the tests (Catch2 reports
// the SIGABRT as a failure) and the fuzz targets (a crash) alike.
#include <cstdio>
#include <cstdlib>
#define FIRN_ASSERT(cond, msg)                                                   \
  do {                                                                           \
    if (!(cond)) {                                                               \
      std::fprintf(stderr, "firn assert failed: %s (%s:%d)\n", (msg), __FILE__, __LINE__); \
      std::abort();                                                              \
    }                                                                            \
  } while (0)

namespace firn {

// What went wrong with the user's input, in words a medic can act on.
struct Error {
  std::string message;
};

template <class T>
class [[nodiscard]] Result {
 public:
  using value_type = T;
  Result(T value) : state_(std::move(value)) {}        // NOLINT: implicit by design
  Result(Error error) : state_(std::move(error)) {}    // NOLINT: implicit by design

  bool ok() const { return state_.index() == 0; }
  explicit operator bool() const { return ok(); }

  const T& value() const& {
    FIRN_ASSERT(ok(), "value() called on an error Result");
    return std::get<0>(state_);
  }
  T&& value() && {
    FIRN_ASSERT(ok(), "value() called on an error Result");
    return std::get<0>(std::move(state_));
  }
  const T& operator*() const& { return value(); }
  const T* operator->() const { return &value(); }

  const Error& error() const {
    FIRN_ASSERT(!ok(), "error() called on a successful Result");
    return std::get<1>(state_);
  }

 private:
  std::variant<T, Error> state_;
};

// "altitude must be between -500 and 20000 m (got 25000 m)". Numbers are printed with the fewest
// digits that show them (no trailing zeros); a non-finite "got" is shown as "not a number".
Error range_error(std::string_view what, double low, double high, std::string_view unit,
                  double got);
// What range_error appends for a non-finite "got" (the models that word their own message add it).
inline constexpr std::string_view got_not_a_number = " (got a value that is not a number)";
Error range_error(std::string_view what, double low, double high, std::string_view unit);

// Formats a finite number with up to `decimals` decimals, trailing zeros trimmed; from 1e15 up
// (in size) with 6 significant digits in scientific notation ("2e+101").
std::string format_number(double value, int decimals = 4);

// True when `value` is finite and within [low, high]. For a quantity checked in a unit that is not
// SI, units::within (units.hpp) also takes a value typed exactly at a bound.
bool in_range(double value, double low, double high);

}  // namespace firn
