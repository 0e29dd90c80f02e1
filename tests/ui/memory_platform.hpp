// The core/ui tests' Platform: storage is a map in memory and can be made to refuse writes (a
// full or blocked localStorage); files are imported by path as natively (no path: the default
// name in the storage folder "memory") from `files`, and downloads land in `downloads`.
#pragma once

#include <map>
#include <optional>
#include <string>
#include <utility>

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
  std::string storage_location() const override { return "memory"; }

  std::map<std::string, std::string> files;  // path → text, what the user could pick
  std::map<std::string, std::string> downloads;  // file name → text handed over
  std::string requested_path;
  bool imports_by_path() const override { return true; }
  bool request_file_import(std::string_view path, std::string_view default_name) override {
    requested_path = path.empty() ? storage_location() + "/" + std::string(default_name) : std::string(path);
    std::string name = requested_path.substr(requested_path.rfind('/') + 1);  // as natively
    auto it = files.find(requested_path);
    picked_ = it == files.end() ? ImportedFile{name, "", "cannot read " + requested_path}
                                : ImportedFile{name, it->second, ""};
    return true;
  }
  std::optional<ImportedFile> take_imported_file() override { return std::exchange(picked_, std::nullopt); }
  std::string offer_download(std::string_view file_name, std::string_view text) override {
    downloads[std::string(file_name)] = std::string(text);
    return storage_location() + "/" + std::string(file_name);
  }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  std::string_view name() const override { return "test"; }

 private:
  std::optional<ImportedFile> picked_;
};

}  // namespace firn::ui::testing
