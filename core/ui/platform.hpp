// What the UI asks of the platform it runs on. native/ (GLFW) and web/ (Emscripten) each
// implement this once; the panels never include a platform header.
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace firn::ui {

// Storage keys both platforms accept: lower-case ASCII letters, digits, '-', '_' and '.', no
// "..". One rule, so a key that works on one platform works on the other.
inline bool is_valid_storage_key(std::string_view key) {
  if (key.empty() || key.find("..") != std::string_view::npos) return false;
  for (char c : key) {
    bool ok = (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '-' || c == '_' || c == '.';
    if (!ok) return false;
  }
  return true;
}

// A file the user picked for import: its name (no folder) and its whole text, or why it could
// not be read.
struct ImportedFile {
  std::string name;
  std::string text;
  std::string error;  // non-empty: the file could not be read (text is empty)
};

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

  // [Files the user shares: the team profile, the incident record (ui/file_exchange.hpp).]
  // Asks for a file to import. Web: opens the browser's file picker (`path` and `default_name`
  // unused), the answer arrives later; native: reads `path`, or `default_name` in the storage
  // folder when no path was typed. Returns false when nothing can be asked. The picked file is
  // collected with take_imported_file() on a later frame (once).
  virtual bool request_file_import(std::string_view path, std::string_view default_name) {
    return (void)path, (void)default_name, false;
  }
  // True where the file to import is named by a typed path (a desktop keyboard), false where
  // the platform's own picker names it.
  virtual bool imports_by_path() const { return false; }
  virtual std::optional<ImportedFile> take_imported_file() { return std::nullopt; }
  // Hands `text` to the user as a file called `file_name` (web: a download; native: written to
  // the config directory). Returns where it went, for the message; empty when it failed.
  virtual std::string offer_download(std::string_view file_name, std::string_view text) {
    return (void)file_name, (void)text, std::string();
  }
  // Where load_text/save_text keep things, in words the user can act on (native: the folder).
  virtual std::string storage_location() const { return "this device"; }
  // Where open_html_document(title, …) wrote its file, if it writes one ("" otherwise).
  virtual std::string document_location(std::string_view title) const {
    return (void)title, std::string();
  }

  // After each frame when FIRN_TEST_HOOKS is on: the frame's items (test_hook::frame_json()) are
  // there for UI tests until the next frame (web: window.firnTestItems, made only when a test
  // reads it; native: --test-items FILE at exit). Nothing is built per frame: the hooks ship.
  virtual void publish_test_items() {}

  // "native" or "web": shown in About, used to word platform-specific hints.
  virtual std::string_view name() const = 0;
};

}  // namespace firn::ui
