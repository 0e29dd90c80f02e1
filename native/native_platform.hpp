// Platform services for the native app: settings in the user's config directory, documents
// written to a file and opened with the desktop's handler.
#pragma once

#include <string>

#include "ui/platform.hpp"

namespace firn::native {

class NativePlatform final : public ui::Platform {
 public:
  // `config_dir` empty: $XDG_CONFIG_HOME/firn or ~/.config/firn.
  explicit NativePlatform(std::string config_dir = {}, std::string test_items_path = {});

  std::optional<std::string> load_text(std::string_view key) override;
  bool save_text(std::string_view key, std::string_view text) override;
  bool open_html_document(std::string_view title, std::string_view html) override;
  std::string_view name() const override { return "native"; }
  // A typed path (empty: <config dir>/team-profile-import.json); read at once.
  bool request_file_import(std::string_view path, std::string_view default_name) override;
  bool imports_by_path() const override { return true; }
  std::optional<ui::ImportedFile> take_imported_file() override;
  std::string offer_download(std::string_view file_name, std::string_view text) override;
  std::string storage_location() const override { return config_dir_; }
  std::string document_location(std::string_view title) const override;

  // The last frame's test items, written to the --test-items file on exit.
  void write_test_items() const;

 private:
  std::string path_for(std::string_view key) const;
  std::string config_dir_;
  std::string test_items_path_;
  std::optional<ui::ImportedFile> imported_;
};

}  // namespace firn::native
