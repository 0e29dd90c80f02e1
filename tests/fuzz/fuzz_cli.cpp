// Fuzz target: the command-line layer, firn::cli::run(argc, argv, AppOptions&) (native/cli).
// Input: argument words separated by '\n'; after the first NUL byte, the content of the file
// "fuzz.json" that --profile / --check may name. Runs in its own temporary directory.
// Kept harmless: a word containing '/' is dropped (no path leaves that directory); --out and
// --csv values are replaced by "card.html" and "csv" there, removed after every run. "No command"
// (run() returns -1) never opens the app: only main() does that.
// Invariants: no crash, uncaught exception or sanitizer report; exit code 0 or 2 (or -1 with no
// command); with --json, stdout is JSON; nothing printed to stdout shows "nan"/"inf" unless the
// input itself contains it.
#include <sys/mman.h>
#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>  // the reference reader judges what Firn's writer printed

#include "cli/cli.hpp"
#include "fuzz_checks.hpp"
#include "profile/team_profile.hpp"

namespace {

int stdout_file = -1;  // a memory file behind fd 1, read back after every run

void write_file(const char* name, std::string_view text) {
  std::ofstream out(name, std::ios::binary | std::ios::trunc);
  out << text;
}

std::string take_stdout() {
  std::fflush(stdout);
  std::cout.flush();
  off_t size = lseek(stdout_file, 0, SEEK_END);
  std::string text(static_cast<size_t>(size > 0 ? size : 0), '\0');
  if (size > 0 && pread(stdout_file, text.data(), text.size(), 0) != size) text.clear();
  if (ftruncate(stdout_file, 0) != 0 || lseek(stdout_file, 0, SEEK_SET) != 0) {
    firn::fuzz::fail("cannot reset the captured stdout");
  }
  return text;
}

// Words the fuzzer gives, made harmless (see the header).
std::vector<std::string> argument_words(std::string_view text) {
  std::vector<std::string> words{"firn"};
  bool next_is_out = false, next_is_csv = false;
  size_t start = 0;
  while (start <= text.size() && words.size() < 40) {
    size_t end = text.find('\n', start);
    if (end == std::string_view::npos) end = text.size();
    std::string word(text.substr(start, end - start));
    start = end + 1;
    if (next_is_out || next_is_csv) {
      words.push_back(next_is_out ? "card.html" : "csv");
      next_is_out = next_is_csv = false;
      continue;
    }
    if (word.rfind("--out", 0) == 0) {
      next_is_out = word == "--out";
      words.push_back(next_is_out ? word : "--out=card.html");
      continue;
    }
    if (word.rfind("--csv", 0) == 0) {
      next_is_csv = word == "--csv";
      words.push_back(next_is_csv ? word : "--csv=csv");
      continue;
    }
    if (word.find('/') != std::string::npos || word.size() > 300) continue;
    words.push_back(std::move(word));
  }
  return words;
}

// The target works in its own directory; libFuzzer's path arguments (corpus directories,
// -artifact_prefix=, -dict=, ...) are made absolute first so they keep meaning what they said.
void absolute_path_arguments(int argc, char** argv) {
  static std::vector<std::string> rewritten;
  rewritten.reserve(static_cast<size_t>(argc));
  for (int i = 1; i < argc; ++i) {
    std::string arg = argv[i];
    size_t eq = arg.find('=');
    bool flag = arg.rfind('-', 0) == 0;
    if (flag && eq == std::string::npos) continue;
    std::string prefix = flag ? arg.substr(0, eq + 1) : "";
    std::string value = flag ? arg.substr(eq + 1) : arg;
    bool path_flag = prefix == "-artifact_prefix=" || prefix == "-exact_artifact_path=" ||
                     prefix == "-dict=" || prefix == "-merge_control_file=" ||
                     prefix == "-features_dir=";
    if ((flag && !path_flag) || value.empty() || value[0] == '/') continue;
    rewritten.push_back(prefix + std::filesystem::absolute(value).string());
    argv[i] = rewritten.back().data();
  }
}

}  // namespace

extern "C" int LLVMFuzzerInitialize(int* argc, char*** argv) {
  absolute_path_arguments(*argc, *argv);
  char dir[] = "/tmp/firn-fuzz-cli-XXXXXX";
  if (mkdtemp(dir) == nullptr || chdir(dir) != 0) firn::fuzz::fail("no temporary directory");
  static const std::string work_dir = dir;
  std::atexit([] {
    std::error_code ignored;
    std::filesystem::remove_all(work_dir, ignored);
  });
  write_file("demo.json", firn::team_profile::demo_profile_json());
  write_file("broken.json", "{\"schema_version\": 2, \"team_name\": ");
  write_file("empty.json", "");
  stdout_file = memfd_create("firn-fuzz-stdout", 0);
  if (stdout_file < 0 || dup2(stdout_file, STDOUT_FILENO) < 0) firn::fuzz::fail("no stdout capture");
  return 0;
}

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* bytes, size_t size) {
  std::string_view input(reinterpret_cast<const char*>(bytes), size);
  size_t nul = input.find('\0');
  std::string_view arguments = input.substr(0, nul);
  std::string_view file = nul == std::string_view::npos ? std::string_view{} : input.substr(nul + 1);
  write_file("fuzz.json", file);

  std::vector<std::string> words = argument_words(arguments);
  std::vector<char*> argv;
  for (std::string& w : words) argv.push_back(w.data());
  argv.push_back(nullptr);

  firn::cli::AppOptions app_options;
  int code = firn::cli::run(static_cast<int>(words.size()), argv.data(), app_options);
  std::string printed = take_stdout();

  std::error_code ignored;
  std::filesystem::remove("card.html", ignored);
  std::filesystem::remove_all("csv", ignored);

  firn::fuzz::require(code == 0 || code == 2 || code == -1,
                      "run() returned exit code " + std::to_string(code));
  // --json promises JSON on stdout (help and version text aside).
  bool wants_json = false, asks_help = false;
  for (const std::string& w : words) {
    wants_json = wants_json || w == "--json";
    bool short_flags = w.size() > 1 && w[0] == '-' && w[1] != '-';  // "-h", "-hx": help
    asks_help = asks_help || (short_flags && w.find('h') != std::string::npos) ||
                w.rfind("--help", 0) == 0 || w.rfind("--version", 0) == 0;
  }
  if (wants_json && !asks_help && code != -1) {
    firn::fuzz::require(nlohmann::json::accept(printed), "--json printed no JSON: " + printed);
  }
  if (!firn::fuzz::has_non_finite_text(input)) {
    firn::fuzz::require_clean_text(printed, "CLI output");
  }
  return 0;
}
