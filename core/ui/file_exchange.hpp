// A file the user shares with other devices and the CLI (the team profile, the incident record):
// its Import and Export buttons and the outcome message, one way on every screen that has one.
// Import goes through Platform::request_file_import / take_imported_file (web: the browser's
// picker, answered on a later frame; native: a typed path), export through offer_download.
#pragma once

#include <functional>
#include <optional>
#include <string>

#include "ui/platform.hpp"

namespace firn::ui {

struct AppState;

struct FileExchange {
  std::string message;            // last import/export outcome (and the screen's other notes)
  bool message_is_problem = false;
  bool import_requested = false;  // waiting for the platform's picker
  char import_path[512] = {};     // native: typed path of the file to import
  void tell(std::string text, bool problem) {
    message = std::move(text);
    message_is_problem = problem;
  }
};

struct FileKind {
  const char* import_label;  // "Import profile": the button and its test-hook label
  const char* export_label;  // "Export profile"
  const char* path_label;    // "Profile file to import": the native path field
  const char* import_name;   // native, no path typed: this file in the storage folder
  const char* export_name;   // the file handed over on export
  const char* cli_hint;      // where the picker is missing: "use firn profile --check FILE."
};

// The typed path (where the platform imports by path) and the Import button. Returns the
// picked file once it has arrived (on a later frame on the page); an unreadable one is said in
// `exchange` and not returned.
std::optional<ImportedFile> import_control(AppState& state, Platform& platform, FileExchange& exchange,
                                           const FileKind& kind);
// The Export button: hands the file's text (made only when pressed) over as kind.export_name
// and says where it went. `what` names the file in the message ("profile", "record").
void export_control(AppState& state, Platform& platform, FileExchange& exchange, const FileKind& kind,
                    const char* what, const std::function<std::string()>& text);

}  // namespace firn::ui
