#include "bench_cases.hpp"

namespace firn::bench {

std::vector<Case> model_cases() { return {}; }

}  // namespace firn::bench
