#include "web_platform.hpp"

#include "ui/test_hook.hpp"

#include <emscripten.h>

#include <cctype>
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

// A blob URL in a new window, where the browser's own print command works. Returns 2 when
// pop-ups are blocked (the caller offers the document as a download instead), 0 on failure.
EM_JS(int, firn_js_open_document, (const char* html), {
  try {
    var blob = new Blob([UTF8ToString(html)], {type: 'text/html;charset=utf-8'});
    var url = URL.createObjectURL(blob);
    var opened = window.open(url, '_blank');
    setTimeout(function() { URL.revokeObjectURL(url); }, 120000);
    return opened ? 1 : 2;
  } catch (e) {
    return 0;
  }
});

// A hidden <input type=file>; the chosen file is read as text and handed back to the platform
// object (`platform`) through the exported firn_file_imported, then the paused loop is woken.
EM_JS(int, firn_js_request_file_import, (void* platform), {
  try {
    var input = document.createElement('input');
    input.type = 'file';
    input.accept = '.json,application/json';
    input.hidden = true;
    var give = function(name, text, error) {
      var pass = function(value) {
        var size = lengthBytesUTF8(value) + 1;
        var pointer = _malloc(size);
        stringToUTF8(value, pointer, size);
        return pointer;
      };
      var n = pass(name), t = pass(text), e = pass(error);
      Module['_firn_file_imported'](platform, n, t, e);
      _free(n); _free(t); _free(e);
      if (window.firnShell && window.firnShell.wake) window.firnShell.wake();
    };
    input.addEventListener('change', function() {
      var file = input.files && input.files[0];
      input.remove();
      if (!file) return;
      file.text().then(function(text) { give(file.name, text, ""); },
                       function(error) { give(file.name, "", 'cannot read ' + file.name + ': ' + error); });
    });
    document.body.appendChild(input);
    input.click();
    return 1;
  } catch (e) {
    return 0;
  }
});

// A download through a blob link (works offline; the browser asks where or uses Downloads).
EM_JS(int, firn_js_offer_download, (const char* name, const char* text, const char* type), {
  try {
    var blob = new Blob([UTF8ToString(text)], {type: UTF8ToString(type) + ';charset=utf-8'});
    var url = URL.createObjectURL(blob);
    var link = document.createElement('a');
    link.href = url;
    link.download = UTF8ToString(name);
    document.body.appendChild(link);
    link.click();
    link.remove();
    setTimeout(function() { URL.revokeObjectURL(url); }, 120000);
    return 1;
  } catch (e) {
    return 0;
  }
});

// window.firnTestItems: the last frame's items, made from the wasm only when a test reads them.
EM_JS(void, firn_js_publish_test_items, (), {
  if (window.firnTestItemsInstalled) return;
  window.firnTestItemsInstalled = true;
  Object.defineProperty(window, 'firnTestItems', {configurable: true, get: function() {
    try {
      return JSON.parse(UTF8ToString(Module['_firn_test_items_json']()));
    } catch (e) {
      return [];
    }
  }});
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

// One pending wake at a time; a hidden page is not woken (the shell wakes it when it shows).
EM_JS(void, firn_js_schedule_wake, (double seconds), {
  clearTimeout(window.firnWakeTimer);
  window.firnWakeTimer = setTimeout(function() {
    if (document.visibilityState === 'visible' && window.firnShell) window.firnShell.wake();
  }, seconds * 1000);
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

std::optional<std::string> WebPlatform::load_text(std::string_view key) {
  if (!ui::is_valid_storage_key(key)) return std::nullopt;
  char* stored = firn_js_storage_load(std::string(key).c_str());
  if (stored == nullptr) return std::nullopt;
  std::string text(stored);
  std::free(stored);
  return text;
}

bool WebPlatform::save_text(std::string_view key, std::string_view text) {
  if (!ui::is_valid_storage_key(key)) return false;
  return firn_js_storage_save(std::string(key).c_str(), std::string(text).c_str()) != 0;
}

bool WebPlatform::open_html_document(std::string_view title, std::string_view html) {
  std::string text(html);
  int opened = firn_js_open_document(text.c_str());
  if (opened != 2) return opened == 1;
  std::string file_name;
  for (char c : title) file_name += std::isalnum(static_cast<unsigned char>(c)) ? c : '-';
  return firn_js_offer_download(((file_name.empty() ? std::string("firn") : file_name) + ".html").c_str(),
                                text.c_str(), "text/html") != 0;
}

void WebPlatform::publish_test_items() { firn_js_publish_test_items(); }

bool WebPlatform::request_file_import(std::string_view, std::string_view) {
  return firn_js_request_file_import(this) != 0;
}

std::optional<ui::ImportedFile> WebPlatform::take_imported_file() {
  std::optional<ui::ImportedFile> file = std::move(imported_);
  imported_.reset();
  return file;
}

std::string WebPlatform::offer_download(std::string_view file_name, std::string_view text) {
  bool offered = firn_js_offer_download(std::string(file_name).c_str(), std::string(text).c_str(),
                                        "application/json") != 0;
  return offered ? "a download called " + std::string(file_name) : std::string();
}

void report_start_problem(const char* kind) { firn_js_report_start_problem(kind); }

void hand_runner_to_page(void* runner) { firn_js_hand_runner_to_page(runner); }

void publish_page_colour(int rgb) { firn_js_publish_page_colour(rgb); }

void schedule_wake(double seconds) { firn_js_schedule_wake(seconds); }

void publish_frame_info(int frames_drawn, bool wants_text_input, float pixel_ratio) {
  firn_js_publish_frame_info(frames_drawn, wants_text_input ? 1 : 0, pixel_ratio);
}

}  // namespace firn::web

extern "C" EMSCRIPTEN_KEEPALIVE void firn_file_imported(void* platform, const char* name,
                                                       const char* text, const char* error) {
  if (platform == nullptr) return;
  static_cast<firn::web::WebPlatform*>(platform)->file_imported({name, text, error});
}

// The last frame's test items as JSON, for window.firnTestItems (valid until the next call).
extern "C" EMSCRIPTEN_KEEPALIVE const char* firn_test_items_json() {
  static std::string json;
  json = firn::ui::test_hook::frame_json();
  return json.c_str();
}
