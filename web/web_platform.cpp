#include "web_platform.hpp"

#include <emscripten.h>

#include <cstdlib>
#include <string>

// The JavaScript halves. Every call is wrapped in try/catch: storage can be disabled (private
// windows, full quota) and a blocked pop-up must not stop the app.

EM_JS(char*, firn_js_storage_load, (const char* key), {
  try {
    var value = window.localStorage.getItem('firn.' + UTF8ToString(key));
    if (value === null) return 0;
    var size = lengthBytesUTF8(value) + 1;
    var pointer = _malloc(size);
    stringToUTF8(value, pointer, size);
    return pointer;
  } catch (e) {
    return 0;
  }
});

EM_JS(int, firn_js_storage_save, (const char* key, const char* text), {
  try {
    window.localStorage.setItem('firn.' + UTF8ToString(key), UTF8ToString(text));
    return 1;
  } catch (e) {
    return 0;
  }
});

// A blob URL in a new window, where the browser's own print command works; when pop-ups are
// blocked the document is offered as a download instead.
EM_JS(int, firn_js_open_document, (const char* title, const char* html), {
  try {
    var blob = new Blob([UTF8ToString(html)], {type: 'text/html;charset=utf-8'});
    var url = URL.createObjectURL(blob);
    var opened = window.open(url, '_blank');
    if (!opened) {
      var link = document.createElement('a');
      link.href = url;
      link.download = (UTF8ToString(title).replace(/[^A-Za-z0-9]+/g, '-') || 'firn') + '.html';
      document.body.appendChild(link);
      link.click();
      link.remove();
    }
    setTimeout(function() { URL.revokeObjectURL(url); }, 120000);
    return 1;
  } catch (e) {
    return 0;
  }
});

EM_JS(void, firn_js_publish_test_items, (const char* json), {
  try {
    window.firnTestItems = JSON.parse(UTF8ToString(json));
  } catch (e) {
    window.firnTestItems = [];
  }
});

EM_JS(void, firn_js_report_start_problem, (const char* kind), {
  if (window.firnShell) window.firnShell.showProblem(UTF8ToString(kind));
});

EM_JS(void, firn_js_hand_runner_to_page, (void* runner), {
  if (window.firnShell) window.firnShell.started(runner);
});

EM_JS(void, firn_js_publish_frame_info, (int frames_drawn, int wants_text, float pixel_ratio), {
  window.firnFramesDrawn = frames_drawn;
  window.firnPixelRatio = pixel_ratio;
  window.firnWantsText = !!wants_text;
});

EM_JS(void, firn_js_publish_page_colour, (int rgb), {
  var colour = '#' + (rgb + 0x1000000).toString(16).slice(1);
  document.body.style.background = colour;
  document.querySelectorAll('meta[name="theme-color"]').forEach(function(meta) {
    meta.setAttribute('content', colour);
    meta.removeAttribute('media');
  });
  window.firnPageColour = colour;
});

namespace firn::web {

namespace {
// Same key rule as the native platform, so a key that works on one works on the other.
bool safe_key(std::string_view key) {
  if (key.empty()) return false;
  for (char c : key) {
    bool ok = (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '-' || c == '_' || c == '.';
    if (!ok) return false;
  }
  return key.find("..") == std::string_view::npos;
}
}  // namespace

std::optional<std::string> WebPlatform::load_text(std::string_view key) {
  if (!safe_key(key)) return std::nullopt;
  char* stored = firn_js_storage_load(std::string(key).c_str());
  if (stored == nullptr) return std::nullopt;
  std::string text(stored);
  std::free(stored);
  return text;
}

bool WebPlatform::save_text(std::string_view key, std::string_view text) {
  if (!safe_key(key)) return false;
  return firn_js_storage_save(std::string(key).c_str(), std::string(text).c_str()) != 0;
}

bool WebPlatform::open_html_document(std::string_view title, std::string_view html) {
  return firn_js_open_document(std::string(title).c_str(), std::string(html).c_str()) != 0;
}

void WebPlatform::publish_test_items(std::string_view json) {
  firn_js_publish_test_items(std::string(json).c_str());
}

void report_start_problem(const char* kind) { firn_js_report_start_problem(kind); }

void hand_runner_to_page(void* runner) { firn_js_hand_runner_to_page(runner); }

void publish_page_colour(int rgb) { firn_js_publish_page_colour(rgb); }

void publish_frame_info(int frames_drawn, bool wants_text_input, float pixel_ratio) {
  firn_js_publish_frame_info(frames_drawn, wants_text_input ? 1 : 0, pixel_ratio);
}

}  // namespace firn::web
