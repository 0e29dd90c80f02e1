// Platform services for the page: settings in localStorage, documents opened in a new browser
// window (print from there), UI test items published on window.firnTestItems.
#pragma once

#include <optional>
#include <string>

#include "ui/platform.hpp"

namespace firn::web {

class WebPlatform final : public ui::Platform {
 public:
  std::optional<std::string> load_text(std::string_view key) override;
  bool save_text(std::string_view key, std::string_view text) override;
  bool open_html_document(std::string_view title, std::string_view html) override;
  void publish_test_items() override;
  std::string_view name() const override { return "web"; }
  // The browser's file picker; the chosen file's text arrives through firn_file_imported().
  bool request_file_import(std::string_view path, std::string_view default_name) override;
  std::optional<ui::ImportedFile> take_imported_file() override;
  std::string offer_download(std::string_view file_name, std::string_view text) override;
  std::string storage_location() const override { return "this browser's storage"; }

  // Called (through firn_file_imported) when the picker's file has been read.
  void file_imported(ui::ImportedFile file) { imported_ = std::move(file); }

 private:
  std::optional<ui::ImportedFile> imported_;
};

// Tells the page shell why Firn cannot start ("webgl"), so it shows a message, not a blank canvas.
void report_start_problem(const char* kind);

// Gives the page the pointer it passes back to firn_wake(), and says the app is running.
void hand_runner_to_page(void* runner);

// After every frame: frames drawn so far (idle tests read window.firnFramesDrawn), whether a
// text field wants typing (window.firnWantsText) and the pixel ratio the frame was drawn for.
// The theme's background as 0xRRGGBB: the page sets its theme-color and background to it.
void publish_page_colour(int rgb);
// Wakes the paused main loop after `seconds` if the page is visible then (a running timer).
void schedule_wake(double seconds);

void publish_frame_info(int frames_drawn, bool wants_text_input, float pixel_ratio);

}  // namespace firn::web
