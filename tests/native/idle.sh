#!/usr/bin/env bash
# Idle costs nothing: the native app under Xvfb, left 5 s without input after settling, must draw
# no frame. Prints the measurement.
set -euo pipefail
firn="$1"
line=$(xvfb-run -a -s "-screen 0 1400x1000x24" "$firn" --idle-report 5 --width 430 --height 800)
echo "$line"
frames=$(sed -n 's/.*without input: \([0-9]*\).*/\1/p' <<<"$line")
[ -n "$frames" ] || { echo "not ok: no idle report"; exit 1; }
[ "$frames" -eq 0 ] || { echo "not ok: $frames frames drawn while idle"; exit 1; }
echo "ok: 0 frames drawn while idle"
