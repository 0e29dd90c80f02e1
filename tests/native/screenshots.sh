#!/usr/bin/env bash
# Native smoke test: the app under Xvfb (Mesa software GL) writes a screenshot of each screen,
# and each must show more than a blank window. Prints where the PNGs are.
set -euo pipefail
firn="$1"; out="$2"
mkdir -p "$out"
fail=0
for screen in here settings; do
  png="$out/$screen.png"
  rm -f "$png"
  xvfb-run -a -s "-screen 0 1400x1000x24" "$firn" --screenshot "$png" --screen "$screen" --width 1280 --height 800
  test -s "$png" || { echo "not ok: no screenshot for $screen"; fail=1; continue; }
  # Not blank: the PNG of a one-colour window compresses to almost nothing; our screens have
  # text in several colours. Count distinct colours with node's zlib (no image library needed).
  colours=$(node "$(dirname "$0")/png_colours.mjs" "$png")
  if [ "$colours" -lt 8 ]; then echo "not ok: $screen screenshot looks blank ($colours colours)"; fail=1
  else echo "ok: $screen screenshot $png ($colours colours)"; fi
done
echo "screenshots in $out"
exit $fail
