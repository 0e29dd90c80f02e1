#include "app_launch.hpp"

#include "model/atmosphere.hpp"
#include "ui/format.hpp"

#include <array>
#include <string_view>

namespace firn::ui {
namespace {

// `keys` in the order of the enum T (kScreenKeys, kThemeKeys).
template <class T, size_t N>
Result<T> lookup(const std::array<std::string_view, N>& keys, const std::string& name,
                 const char* what) {
  std::string valid;
  for (size_t i = 0; i < N; ++i) {
    if (keys[i] == name) return static_cast<T>(i);
    valid += valid.empty() ? "" : ", ";
    valid += keys[i];
  }
  return Error{std::string("unknown ") + what + " '" + name + "': use " + valid};
}

}  // namespace

Result<bool> apply_launch_options(AppState& state, const std::string& screen,
                                  const std::string& theme) {
  if (screen == "keypad") {
    // The keypad open on the Here screen's altitude: for screenshots of the number entry.
    state.screen = Screen::Here;
    const units::Range<units::LengthDimension>& site = atmosphere::kSiteAltitudeRange;
    state.keypad = Keypad{.open = true,
                          .field_id = "altitude",
                          .label = "Altitude",
                          .hint = range_text(site.low_in_unit(), site.high_in_unit(), "m", 0),
                          .text = "4250",
                          .fresh = false,
                          .unit_symbols = {"m", "ft"},
                          .allow_negative = true,
                          .allow_decimal = false};
  } else if (!screen.empty()) {
    Result<Screen> s = lookup<Screen>(kScreenKeys, screen, "screen");
    if (!s) return s.error();
    state.screen = s.value();
  }
  if (!theme.empty()) {
    Result<Theme> t = lookup<Theme>(kThemeKeys, theme, "theme");
    if (!t) return t.error();
    state.settings.theme = t.value();
    state.built_font_scale = 0.0f;
  }
  return true;
}

}  // namespace firn::ui
