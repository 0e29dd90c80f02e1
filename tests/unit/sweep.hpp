// Helpers for the [sweep] tests: an inclusive grid over a documented input range, and the error
// message of an input just outside it (which must name the range and the unit).
#pragma once

#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "model/result.hpp"

namespace firn::sweep {

// steps + 1 points from low to high; both ends exactly.
inline std::vector<double> grid(double low, double high, int steps) {
  std::vector<double> points;
  for (int i = 0; i < steps; ++i) points.push_back(low + (high - low) * i / steps);
  points.push_back(high);
  return points;
}

template <class T>
std::string error_of(const Result<T>& result) {
  REQUIRE_FALSE(result.ok());
  return result.error().message;
}

}  // namespace firn::sweep

// The input was refused, and the message contains `range_text` ("between -500 and 20000 m").
#define CHECK_REFUSED_NAMING(result, range_text) \
  CHECK_THAT(firn::sweep::error_of(result), Catch::Contains(range_text))
