// A Platform whose storage is a map in memory and can be made to refuse writes (a full or blocked
// localStorage), for the stores' tests.
#pragma once

#include <map>
#include <string>

#include "ui/platform.hpp"

namespace firn::ui::testing {

class MemoryPlatform : public Platform {
 public:
  std::map<std::string, std::string> stored;
  bool refuse_writes = false;
  int writes = 0;  // attempted
  std::optional<std::string> load_text(std::string_view key) override {
    auto it = stored.find(std::string(key));
    if (it == stored.end()) return std::nullopt;
    return it->second;
  }
  bool save_text(std::string_view key, std::string_view text) override {
    ++writes;
    if (refuse_writes) return false;
    stored[std::string(key)] = std::string(text);
    return true;
  }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  void publish_test_items(std::string_view) override {}
  std::string_view name() const override { return "test"; }
};

}  // namespace firn::ui::testing
