#include "model/clock.hpp"

namespace firn::clock {

namespace {

bool whole(std::string_view digits, int& out) {
  if (digits.empty() || digits.size() > 4) return false;
  out = 0;
  for (char c : digits) {
    if (c < '0' || c > '9') return false;
    out = out * 10 + (c - '0');
  }
  return true;
}

}  // namespace

std::optional<int> typed_minutes_of_day(std::string_view typed) {
  int hours = -1, minutes = -1;
  size_t mark = typed.find_first_of(".:");
  bool read = false;
  if (mark != std::string_view::npos) {
    read = mark >= 1 && mark <= 2 && typed.size() - mark - 1 == 2 && whole(typed.substr(0, mark), hours) &&
           whole(typed.substr(mark + 1), minutes);
  } else if (typed.size() == 3 || typed.size() == 4) {
    int n = 0;
    read = whole(typed, n);
    hours = n / 100;
    minutes = n % 100;
  }
  if (!read || hours > 23 || minutes > 59) return std::nullopt;
  return hours * 60 + minutes;
}

}  // namespace firn::clock
