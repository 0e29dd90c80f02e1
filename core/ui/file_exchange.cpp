#include "ui/file_exchange.hpp"

#include <imgui.h>

#include <cctype>

#include "ui/app_state.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

std::optional<ImportedFile> import_control(AppState& state, Platform& platform, FileExchange& exchange,
                                           const FileKind& kind) {
  if (platform.imports_by_path()) {
    // Empty: the file in the storage folder.
    std::string hint = platform.storage_location() + "/" + kind.import_name;
    ImGui::TextDisabled("%s", kind.path_label);
    ImGui::SetNextItemWidth(-1.0f);
    ImGui::PushID(kind.path_label);
    ImGui::InputTextWithHint("##import-path", hint.c_str(), exchange.import_path, sizeof exchange.import_path);
    ImGui::PopID();
    test_hook::item_text(kind.path_label, exchange.import_path);
  }
  if (big_button(state.display, kind.import_label)) {
    exchange.import_requested = platform.request_file_import(exchange.import_path, kind.import_name);
    if (!exchange.import_requested) {
      exchange.tell(std::string("This device cannot pick a file here; ") + kind.cli_hint, true);
    }
  }
  // Only the screen that asked collects the answer.
  if (!exchange.import_requested) return std::nullopt;
  std::optional<ImportedFile> file = platform.take_imported_file();
  if (!file) return std::nullopt;
  exchange.import_requested = false;
  if (!file->error.empty()) {
    exchange.tell("Nothing imported: " + file->error, true);
    return std::nullopt;
  }
  return file;
}

void export_control(AppState& state, Platform& platform, FileExchange& exchange, const FileKind& kind,
                    const char* what, const std::function<std::string()>& text) {
  if (!big_button(state.display, kind.export_label)) return;
  std::string where = platform.offer_download(kind.export_name, text());
  std::string noun = what;
  if (!noun.empty()) noun[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(noun[0])));
  exchange.tell(where.empty() ? "The " + std::string(what) + " could not be exported."
                              : noun + " exported to " + where + ".",
                where.empty());
}

}  // namespace firn::ui
