// What the UI asks of the platform it runs on. native/ (GLFW) and web/ (Emscripten) each
// implement this once; the panels never include a platform header.
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace firn::ui {

class Platform {
 public:
  virtual ~Platform() = default;

  // Small persistent key/value storage (web: localStorage; native: files in the user's config
  // directory). Returns nullopt when nothing is stored under `key`.
  virtual std::optional<std::string> load_text(std::string_view key) = 0;
  virtual bool save_text(std::string_view key, std::string_view text) = 0;

  // Opens an HTML document for reading or printing (the pocket card). Returns false when the
  // platform cannot (the UI then says where the CLI can write it instead).
  virtual bool open_html_document(std::string_view title, std::string_view html) = 0;

  // Published to UI tests (web: window.firnTestItems; native: --test-items FILE). Only called
  // when FIRN_TEST_HOOKS is on.
  virtual void publish_test_items(std::string_view json) = 0;

  // "native" or "web": shown in About, used to word platform-specific hints.
  virtual std::string_view name() const = 0;
};

}  // namespace firn::ui
