#!/usr/bin/env bash
# Native smoke test: the app under Xvfb (Mesa software GL) writes a screenshot of every screen at
# a phone-like size (430×900) and a laptop size (1366×768), and each must show more than a blank
# window. Runs with a throw-away config directory so saved state never leaks in or out.
# Usage: screenshots.sh FIRN OUT_DIR   (prints where the PNGs are)
set -euo pipefail
# One X server for all the shots (an xvfb-run per shot cost ~1 s each).
if [ -z "${FIRN_IN_XVFB:-}" ]; then
  FIRN_IN_XVFB=1 exec xvfb-run -a -s "-screen 0 1400x1000x24" "$0" "$@"
fi
firn="$1"; out="$2"
mkdir -p "$out"
export XDG_CONFIG_HOME="$(mktemp -d)"
trap 'rm -rf "$XDG_CONFIG_HOME"' EXIT
fail=0
# The screens' keys from their one table (kScreenNames in core/ui/app_state.hpp), then the keypad.
screens=$(sed -nE 's/^ *\{Screen::[A-Za-z]+, "([a-z]+)", "[^"]*"\},?$/\1/p' \
  "$(dirname "$0")/../../core/ui/app_state.hpp")
[ "$(wc -w <<<"$screens")" -ge 11 ] || { echo "not ok: screen keys not found in app_state.hpp"; exit 1; }
for screen in $screens keypad; do
  for size in phone:430:900 laptop:1366:768; do
    IFS=: read -r name width height <<<"$size"
    png="$out/$screen-$name.png"
    rm -f "$png"
    "$firn" --screenshot "$png" --screen "$screen" --width "$width" --height "$height" \
      --pixel-ratio 1
    test -s "$png" || { echo "not ok: no screenshot for $screen $name"; fail=1; continue; }
    # Not blank: a one-colour window has few colours; our screens have text in several colours.
    # Count distinct colours with node's zlib (no image library needed).
    colours=$(node "$(dirname "$0")/png_colours.mjs" "$png")
    if [ "$colours" -lt 8 ]; then echo "not ok: $screen $name screenshot looks blank ($colours colours)"; fail=1
    else echo "ok: $screen $name screenshot $png ($colours colours)"; fi
  done
done
echo "screenshots in $out"
exit $fail
