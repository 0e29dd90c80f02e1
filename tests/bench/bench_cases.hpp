// Benchmark cases for the calculators beyond the atmosphere, and whole tasks (bench_cases.cpp).
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

// Whole tasks a user waits for, timed as one run each (bench.cpp prints the median of several):
// the full pocket card of the demo profile, and 10 000 oxygenation evaluations.
struct Task {
  const char* name;
  std::function<double()> run;
};

std::vector<Task> task_cases();

}  // namespace firn::bench
