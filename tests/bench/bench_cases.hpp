// Benchmark cases for the calculators beyond the atmosphere (bench_cases.cpp).
#pragma once

#include <functional>
#include <vector>

namespace firn::bench {

struct Case {
  const char* name;
  int calls;
  std::function<double(int)> body;
};

std::vector<Case> model_cases();

}  // namespace firn::bench
