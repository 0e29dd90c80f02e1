#include "native_platform.hpp"

#include "ui/test_hook.hpp"

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>

namespace firn::native {

namespace fs = std::filesystem;

namespace {
std::string default_config_dir() {
  if (const char* xdg = std::getenv("XDG_CONFIG_HOME"); xdg && *xdg) return std::string(xdg) + "/firn";
  if (const char* home = std::getenv("HOME"); home && *home) return std::string(home) + "/.config/firn";
  return ".firn";
}

}  // namespace

NativePlatform::NativePlatform(std::string config_dir, std::string test_items_path)
    : config_dir_(config_dir.empty() ? default_config_dir() : std::move(config_dir)),
      test_items_path_(std::move(test_items_path)) {}

std::string NativePlatform::path_for(std::string_view key) const {
  return config_dir_ + "/" + std::string(key);
}

std::optional<std::string> NativePlatform::load_text(std::string_view key) {
  if (!ui::is_valid_storage_key(key)) return std::nullopt;
  std::ifstream in(path_for(key), std::ios::binary);
  if (!in) return std::nullopt;
  std::ostringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

bool NativePlatform::save_text(std::string_view key, std::string_view text) {
  if (!ui::is_valid_storage_key(key)) return false;
  std::error_code ec;
  fs::create_directories(config_dir_, ec);
  // Write then rename, so a crash mid-write never leaves half a settings file.
  std::string final_path = path_for(key);
  std::string temp_path = final_path + ".tmp";
  {
    std::ofstream out(temp_path, std::ios::binary | std::ios::trunc);
    if (!out) return false;
    out.write(text.data(), static_cast<std::streamsize>(text.size()));
    if (!out) return false;
  }
  fs::rename(temp_path, final_path, ec);
  return !ec;
}

namespace {
// The card's file name from its title: letters and digits only, so it is safe in a shell command.
std::string document_file_name(std::string_view title) {
  std::string file_name(title);
  for (char& c : file_name) {
    if (!((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9'))) c = '-';
  }
  return file_name + ".html";
}
}  // namespace

bool NativePlatform::open_html_document(std::string_view title, std::string_view html) {
  std::string file_name = document_file_name(title);
  if (!save_text(file_name, html)) return false;
  std::string command = "xdg-open '" + path_for(file_name) + "' >/dev/null 2>&1 &";
  return std::system(command.c_str()) == 0;
}

std::string NativePlatform::document_location(std::string_view title) const {
  return path_for(document_file_name(title));
}

bool NativePlatform::request_file_import(std::string_view path, std::string_view default_name) {
  std::string wanted = path.empty() ? path_for(default_name) : std::string(path);
  ui::ImportedFile file;
  file.name = fs::path(wanted).filename().string();
  std::error_code ec;
  if (fs::is_directory(wanted, ec)) {
    file.error = wanted + " is a folder, not a file";
  } else if (std::ifstream in{wanted, std::ios::binary}) {
    std::ostringstream buffer;
    buffer << in.rdbuf();
    file.text = buffer.str();
  } else {
    file.error = "cannot read " + wanted;
  }
  imported_ = std::move(file);
  return true;
}

std::optional<ui::ImportedFile> NativePlatform::take_imported_file() {
  std::optional<ui::ImportedFile> file = std::move(imported_);
  imported_.reset();
  return file;
}

std::string NativePlatform::offer_download(std::string_view file_name, std::string_view text) {
  return save_text(file_name, text) ? path_for(file_name) : std::string();
}

void NativePlatform::write_test_items() const {
  if (test_items_path_.empty()) return;
  std::ofstream out(test_items_path_, std::ios::binary | std::ios::trunc);
  out << ui::test_hook::frame_json();  // the last frame's
}

}  // namespace firn::native
