// The last results of a pure model call, kept while its input stays the same. Firn draws a frame
// at every finger move, and a screen's plan or flow search (route: ~3 ms, a casualty's flows on
// three devices: ~0.3 ms natively, several times that in the page) need not run again for a
// value that did not change (tests/bench/frame_bench.cpp measures a frame).
#pragma once

#include <cstddef>
#include <utility>
#include <vector>

namespace firn::ui {

template <class Key, class Value, std::size_t Capacity = 1>
class Memo {
 public:
  // The value for `key`: remembered, or `compute(key)` remembered in place of the oldest.
  template <class Compute>
  Value get(const Key& key, Compute&& compute) {
    for (const auto& [k, v] : entries_) {
      if (k == key) return v;
    }
    if (entries_.size() == Capacity) entries_.erase(entries_.begin());
    entries_.emplace_back(key, compute(key));
    return entries_.back().second;
  }

 private:
  std::vector<std::pair<Key, Value>> entries_;
};

}  // namespace firn::ui
