#include "cli/files.hpp"

#include <fstream>
#include <sstream>

namespace firn::cli {

Result<std::string> read_document(const std::string& path, const std::string& what,
                                  std::uintmax_t max_bytes) {
  std::error_code ec;
  std::uintmax_t size = std::filesystem::file_size(path, ec);
  if (ec) return Error{"cannot read " + what + " '" + path + "': " + ec.message()};
  if (size > max_bytes) {
    return Error{what + " '" + path + "' is " + std::to_string(size) + " bytes: a " + what +
                 " is at most " + std::to_string(max_bytes / 1024) + " KB"};
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) return Error{"cannot read " + what + " '" + path + "'"};
  std::stringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

Result<bool> write_document(const std::filesystem::path& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary | std::ios::trunc);
  if (out) out << text;
  if (!out) return Error{"cannot write '" + path.string() + "'"};
  return true;
}

}  // namespace firn::cli
