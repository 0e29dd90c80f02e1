// A Platform whose storage is a map in memory and can be made to refuse writes (a full or blocked
// localStorage), for the stores' tests. Files to import are named by path (as natively) and
// read from `files`.
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
  std::map<std::string, std::string> files;  // path → text, for request_file_import
  std::string requested_path;
  bool request_file_import(std::string_view path) override {
    requested_path = std::string(path);
    auto it = files.find(requested_path);
    std::string name = requested_path.substr(requested_path.rfind('/') + 1);  // as natively
    imported_ = it == files.end() ? ImportedFile{name, "", "cannot read " + requested_path}
                                  : ImportedFile{name, it->second, ""};
    return true;
  }
  bool imports_by_path() const override { return true; }
  std::optional<ImportedFile> take_imported_file() override {
    std::optional<ImportedFile> file = std::move(imported_);
    imported_.reset();
    return file;
  }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  void publish_test_items(std::string_view) override {}
  std::string_view name() const override { return "test"; }

 private:
  std::optional<ImportedFile> imported_;
};

}  // namespace firn::ui::testing
