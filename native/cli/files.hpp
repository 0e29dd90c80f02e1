// Reading and writing the documents the CLI takes and makes (profiles, routes, records, cards).
#pragma once

#include <cstdint>
#include <filesystem>
#include <string>

#include "model/result.hpp"

namespace firn::cli {

// The whole file as text; `what` names the document in messages ("record", "team profile").
// A file over `max_bytes` is refused: our documents are a few kB.
Result<std::string> read_document(const std::string& path, const std::string& what,
                                  std::uintmax_t max_bytes);
Result<bool> write_document(const std::filesystem::path& path, const std::string& text);

}  // namespace firn::cli
