#!/usr/bin/env bash
# Native team-profile storage: the app under Xvfb with a throw-away config directory.
#  1. nothing saved: the Team screen shows the demo profile, marked DEMO DATA;
#  2. a damaged team-profile.json: kept byte for byte as team-profile.json.bad, the demo profile
#     is used, and the screen says what was wrong (parse_profile's message) and where the backup is;
#  3. an out-of-range profile: the message names field, value and range.
# Reads the labelled items the app writes with --test-items. Usage: profile_storage.sh FIRN
set -euo pipefail
firn="$1"
config="$(mktemp -d)"; export XDG_CONFIG_HOME="$config"
trap 'rm -rf "$config"' EXIT
dir="$config/firn"; mkdir -p "$dir"
fail=0
demo_name=$("$firn" profile --demo | node -e 'let s="";process.stdin.on("data",d=>s+=d).on("end",()=>console.log(JSON.parse(s).team_name))')

run_app() {  # writes the Team screen's items to $config/items.json
  xvfb-run -a -s "-screen 0 1400x1000x24" "$firn" --screenshot "$config/team.png" --screen team \
    --width 430 --height 900 --pixel-ratio 1 --test-items "$config/items.json" >/dev/null
}
# text of the first item labelled $1
item_text() {
  node -e 'const items=JSON.parse(require("fs").readFileSync(process.argv[1],"utf8"));
           const it=items.find(i=>i.label===process.argv[2]); console.log(it ? it.text : "<none>")' \
    "$config/items.json" "$1"
}
check() {  # check "what" actual expected-substring
  if [[ "$2" == *"$3"* ]]; then echo "ok: $1"; else echo "not ok: $1: got '$2', wanted '$3'"; fail=1; fi
}

run_app
check "first start shows the demo team" "$(item_text 'Team name')" "$demo_name"
check "first start marks DEMO DATA" "$(item_text 'Demo')" "DEMO DATA"
[ ! -e "$dir/team-profile.json" ] && echo "ok: nothing written at first start" || { echo "not ok: profile written at first start"; fail=1; }

garbage='{"schema_version": 2, "team_name": "Half wri'
printf '%s' "$garbage" > "$dir/team-profile.json"
run_app
if cmp -s <(printf '%s' "$garbage") "$dir/team-profile.json.bad"; then echo "ok: damaged profile kept as team-profile.json.bad"
else echo "not ok: backup missing or different"; fail=1; fi
message=$(item_text 'Warning')
check "message says it could not be read" "$message" "team profile could not be read"
check "message carries the parser's reason" "$message" "not valid JSON"
check "message names the backup and its folder" "$message" "team-profile.json.bad in $dir"
check "defaults (demo) loaded" "$(item_text 'Team name')" "$demo_name"

"$firn" profile --demo | sed 's/"200bar"/"450bar"/' > "$dir/team-profile.json"
grep -q 450bar "$dir/team-profile.json" || { echo "not ok: could not make the out-of-range file"; fail=1; }
run_app
check "out-of-range message names field, value and range" "$(item_text 'Warning')" "fill_pressure: 450 bar is outside 50…300 bar"
exit $fail
