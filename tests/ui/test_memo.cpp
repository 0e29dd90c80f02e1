// ui::Memo: a screen's model result is made again exactly when its input changed (common
// practice for memoising a pure function; the screens rely on it to stay current).
#include <catch2/catch.hpp>

#include <string>
#include <utility>

#include "ui/memo.hpp"

using firn::ui::Memo;

TEST_CASE("Memo: computes once per input, again when the input changes") {
  Memo<int, std::string> memo;
  int calls = 0;
  auto compute = [&](int k) { ++calls; return std::to_string(k * 10); };
  CHECK(memo.get(4, compute) == "40");
  CHECK(memo.get(4, compute) == "40");
  CHECK(calls == 1);
  CHECK(memo.get(5, compute) == "50");  // a changed input: computed, not the old value
  CHECK(calls == 2);
  CHECK(memo.get(4, compute) == "40");  // capacity 1: the first input was forgotten
  CHECK(calls == 3);
}

TEST_CASE("Memo: keeps as many inputs as its capacity, forgetting the oldest") {
  Memo<std::pair<int, char>, int, 3> memo;
  int calls = 0;
  auto compute = [&](const std::pair<int, char>& k) { ++calls; return k.first + k.second; };
  for (char device : {'a', 'b', 'c'}) memo.get({1, device}, compute);
  for (char device : {'a', 'b', 'c'}) CHECK(memo.get({1, device}, compute) == 1 + device);
  CHECK(calls == 3);
  memo.get({2, 'a'}, compute);  // a fourth input pushes out {1, 'a'}
  CHECK(calls == 4);
  memo.get({1, 'b'}, compute);
  CHECK(calls == 4);
  memo.get({1, 'a'}, compute);
  CHECK(calls == 5);
}
