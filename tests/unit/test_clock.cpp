// Clock times typed on the keypad: the shapes a gloved medic types, and what is refused.
// The forms are common practice (24-hour clock, ISO 8601's hh:mm with or without the colon).
#include <catch2/catch.hpp>

#include "model/clock.hpp"

using firn::clock::typed_minutes_of_day;

TEST_CASE("A clock time typed as 1405, 14.05, 14:05 or 930", "[clock]") {
  CHECK(typed_minutes_of_day("1405") == 14 * 60 + 5);
  CHECK(typed_minutes_of_day("14.05") == 14 * 60 + 5);
  CHECK(typed_minutes_of_day("14:05") == 14 * 60 + 5);
  CHECK(typed_minutes_of_day("930") == 9 * 60 + 30);
  CHECK(typed_minutes_of_day("9.30") == 9 * 60 + 30);
  CHECK(typed_minutes_of_day("0000") == 0);
  CHECK(typed_minutes_of_day("2359") == 23 * 60 + 59);
}

TEST_CASE("What is not hours and minutes is refused, never guessed", "[clock]") {
  for (const char* bad : {"", "5", "14", "24:00", "2400", "1460", "14.5", "14.055", "1.2.3", "-930",
                          ".30", "14:", "12345", "ab:cd"}) {
    INFO(bad);
    CHECK_FALSE(typed_minutes_of_day(bad).has_value());
  }
}
