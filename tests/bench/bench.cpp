// Speed of the core calculators, printed as figures (never asserted: see DEVELOPERS.md).
// Each line: name, calls, nanoseconds per call; then whole tasks (median of 21 runs).
// Run by tests/bench/run.sh and tests/bench/compare.sh.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <functional>
#include <vector>

#include "model/atmosphere.hpp"
#include "bench_cases.hpp"

namespace {

// Keeps results alive so the optimiser cannot drop the calls.
volatile double sink = 0.0;

void measure(const char* name, int calls, const std::function<double(int)>& body) {
  auto start = std::chrono::steady_clock::now();
  double total = 0.0;
  for (int i = 0; i < calls; ++i) total += body(i);
  auto elapsed = std::chrono::steady_clock::now() - start;
  sink = sink + total;
  double ns = std::chrono::duration<double, std::nano>(elapsed).count() / calls;
  std::printf("%-40s %9d calls %12.1f ns/call\n", name, calls, ns);
}

// A whole task: one untimed warm-up run, then `runs` timed runs; prints median and slowest.
void measure_task(const firn::bench::Task& task, int runs) {
  sink = sink + task.run();
  std::vector<double> ms;
  for (int i = 0; i < runs; ++i) {
    auto start = std::chrono::steady_clock::now();
    sink = sink + task.run();
    ms.push_back(std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start).count());
  }
  std::sort(ms.begin(), ms.end());
  std::printf("%-52s %3d runs  median %8.3f ms  slowest %8.3f ms\n", task.name, runs,
              ms[ms.size() / 2], ms.back());
}

}  // namespace

int main() {
  using namespace firn;
  using namespace firn::units;
  std::printf("Firn core benchmark (steady_clock, one thread)\n");
  measure("atmosphere::pressure_at (ISA)", 1000000, [](int i) {
    return atmosphere::pressure_at(metres(i % 9000), atmosphere::Model::Isa)->in(pascals);
  });
  measure("atmosphere::pressure_at (West)", 1000000, [](int i) {
    return atmosphere::pressure_at(metres(i % 9000), atmosphere::Model::West1996)->in(pascals);
  });
  measure("atmosphere::altitude_at (West)", 1000000, [](int i) {
    return atmosphere::altitude_at(hectopascals(400 + i % 500), atmosphere::Model::West1996)->in(metres);
  });
  measure("units::parse_length", 1000000, [](int i) {
    return parse_length(i % 2 ? "13120ft" : "4000m")->in(metres);
  });
  for (const firn::bench::Case& c : firn::bench::model_cases()) measure(c.name, c.calls, c.body);
  std::printf("Whole tasks\n");
  for (const firn::bench::Task& t : firn::bench::task_cases()) measure_task(t, 21);
  return 0;
}
