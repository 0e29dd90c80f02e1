// The architecture rule, checked: core/model (physics) includes no document, UI or platform
// header; core/profile (documents) no UI or platform header; core/ui no platform header
// (GLFW, GL, Emscripten). None reads JSON but through model/json.hpp (the page carries one JSON
// reader, issue 17). Reads the source tree at test time.
#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

namespace fs = std::filesystem;

namespace {

std::vector<std::string> includes_of(const fs::path& file) {
  std::ifstream in(file);
  std::vector<std::string> found;
  std::string line;
  while (std::getline(in, line)) {
    size_t start = line.find_first_not_of(" \t");
    if (start != std::string::npos && line.compare(start, 8, "#include") == 0) found.push_back(line);
  }
  return found;
}

std::vector<std::string> violations(const std::string& folder, const std::vector<std::string>& banned) {
  std::vector<std::string> bad;
  size_t files = 0;
  for (const auto& entry : fs::directory_iterator(fs::path(FIRN_SOURCE_DIR) / folder)) {
    std::string ext = entry.path().extension().string();
    if (ext != ".cpp" && ext != ".hpp" && ext != ".h") continue;
    ++files;
    for (const std::string& include : includes_of(entry.path())) {
      for (const std::string& word : banned) {
        if (include.find(word) != std::string::npos) bad.push_back(entry.path().filename().string() + ": " + include);
      }
    }
  }
  REQUIRE(files > 3);  // the folder was really read
  return bad;
}

}  // namespace

TEST_CASE("core/model has no UI or platform dependency", "[layering]") {
  std::vector<std::string> bad =
      violations("core/model", {"imgui", "GL/", "GLES", "GLFW", "glfw", "emscripten", "ui/", "profile/", "nlohmann"});
  INFO(Catch::Detail::stringify(bad));
  CHECK(bad.empty());
}

TEST_CASE("core/profile has no UI or platform dependency", "[layering]") {
  std::vector<std::string> bad =
      violations("core/profile", {"imgui", "GL/", "GLES", "GLFW", "glfw", "emscripten", "ui/", "nlohmann"});
  INFO(Catch::Detail::stringify(bad));
  CHECK(bad.empty());
}

TEST_CASE("core/ui has no platform dependency", "[layering]") {
  std::vector<std::string> bad = violations("core/ui", {"GL/", "GLES", "GLFW", "glfw", "emscripten",
                                                        "imgui_impl", "nlohmann"});
  INFO(Catch::Detail::stringify(bad));
  CHECK(bad.empty());
}
