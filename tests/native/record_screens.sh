#!/usr/bin/env bash
# The Record screen as a medic sees it mid-incident (docs/screens/record.png): the fictional demo
# record (assets/demo-record.json) with its times moved so that its last entry was 10 minutes
# ago, in a throw-away config directory, at 430×900 (pixel ratio 1) in the day and night themes.
# Not blank, like screenshots.sh. Usage: record_screens.sh FIRN OUT_DIR
set -euo pipefail
firn="$1"; out="$2"
here="$(cd "$(dirname "$0")" && pwd)"
mkdir -p "$out"
export XDG_CONFIG_HOME="$(mktemp -d)"
trap 'rm -rf "$XDG_CONFIG_HOME"' EXIT
mkdir -p "$XDG_CONFIG_HOME/firn"
# Clock times carry no zone: shift them as local wall-clock minutes (Date's local fields).
node - "$here/../../assets/demo-record.json" "$XDG_CONFIG_HOME/firn/incident.json" <<'JS'
const fs = require('fs');
const [input, output] = process.argv.slice(2);
const record = JSON.parse(fs.readFileSync(input, 'utf8'));
const local = (t) => { const [d, h] = t.split('T'); const [y, mo, da] = d.split('-'); const [hh, mm] = h.split(':');
                       return new Date(+y, mo - 1, +da, +hh, +mm); };
const last = local(record.entries.at(-1).time);
const now = new Date(); now.setSeconds(0, 0);
const shift = now - 10 * 60000 - last;
const pad = (n) => String(n).padStart(2, '0');
const text = (d) => `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
for (const e of record.entries) e.time = text(new Date(local(e.time).getTime() + shift));
fs.writeFileSync(output, JSON.stringify(record, null, 2));
JS
fail=0
for theme in day night; do
  png="$out/record-$theme.png"
  rm -f "$png"
  xvfb-run -a -s "-screen 0 1400x1000x24" "$firn" --screenshot "$png" --screen record --theme "$theme" \
    --width 430 --height "${FIRN_SHOT_HEIGHT:-900}" --pixel-ratio 1
  colours=$(node "$here/png_colours.mjs" "$png" 2>/dev/null || echo 0)
  if [ "$colours" -lt 8 ]; then echo "not ok: record $theme screenshot looks blank ($colours colours)"; fail=1
  else echo "ok: record $theme $png ($colours colours)"; fi
done
exit $fail
