#include "ui/test_hook.hpp"

#include <imgui.h>

#include <cstdio>
#include <vector>

namespace firn::ui::test_hook {
namespace {

struct RecordedItem {
  std::string label;
  std::string text;
  ImVec2 min;
  ImVec2 max;
};

// One UI per process, drawn on one thread: the recorder is process state by nature (like
// ImGui's own context), not app state.
std::vector<RecordedItem>& items() {
  static std::vector<RecordedItem> recorded;
  return recorded;
}

void append_escaped(std::string& out, std::string_view text) {
  for (char c : text) {
    if (c == '"' || c == '\\') {
      out += '\\';
      out += c;
    } else if (static_cast<unsigned char>(c) < 0x20) {
      char buffer[8];
      std::snprintf(buffer, sizeof buffer, "\\u%04x", c);
      out += buffer;
    } else {
      out += c;
    }
  }
}

}  // namespace

void begin_frame() { items().clear(); }

void item(std::string_view label) { item_text(label, {}); }

namespace {

void record(std::string_view label, std::string_view shown_text, ImVec2 min, ImVec2 max) {
#if FIRN_TEST_HOOKS
  std::string unique(label);
  int repeats = 1;
  for (const RecordedItem& existing : items()) {
    if (existing.label == unique) unique = std::string(label) + "#" + std::to_string(++repeats);
  }
  items().push_back({unique, std::string(shown_text), min, max});
#else
  (void)label;
  (void)shown_text;
  (void)min;
  (void)max;
#endif
}

}  // namespace

void item_text(std::string_view label, std::string_view shown_text) {
  record(label, shown_text, ImGui::GetItemRectMin(), ImGui::GetItemRectMax());
}

void drawn(std::string_view label, std::string_view shown_text, float x0, float y0, float x1, float y1) {
  record(label, shown_text, ImVec2(x0, y0), ImVec2(x1, y1));
}

std::string frame_json() {
  std::string out = "[";
  bool first = true;
  for (const RecordedItem& recorded : items()) {
    if (!first) out += ',';
    first = false;
    char numbers[128];
    std::snprintf(numbers, sizeof numbers, "\"x\":%.1f,\"y\":%.1f,\"w\":%.1f,\"h\":%.1f",
                  recorded.min.x, recorded.min.y, recorded.max.x - recorded.min.x,
                  recorded.max.y - recorded.min.y);
    out += "{\"label\":\"";
    append_escaped(out, recorded.label);
    out += "\",\"text\":\"";
    append_escaped(out, recorded.text);
    out += "\",";
    out += numbers;
    out += '}';
  }
  out += ']';
  return out;
}

}  // namespace firn::ui::test_hook
