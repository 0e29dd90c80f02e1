#!/usr/bin/env bash
# Prints Firn's speed and size figures (results go in docs/measurements.md by hand):
#   core calculator speed (firn_bench), CLI start-to-exit time, web output sizes raw and gzip,
#   native binary size. Usage: tests/bench/run.sh [native-build-dir] [web-build-dir]
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
native=${1:-$root/build/native}
web=${2:-$root/build/web}
cmake --build "$native" --target firn_bench firn -j2 >/dev/null
echo "== core calculators"
"$native/tests/firn_bench"
echo "== CLI: 50 runs of 'firn pressure --altitude 3000m --json'"
start=$(date +%s%N)
for _ in $(seq 50); do "$native/native/firn" pressure --altitude 3000m --json >/dev/null; done
end=$(date +%s%N)
echo "mean $(( (end - start) / 50000 )) µs per run (process start to exit)"
echo "== sizes"
printf '%-28s %10s %10s\n' file bytes gzip-9
printf '%-28s %10s %10s\n' native/firn "$(stat -c %s "$native/native/firn")" "$(gzip -9c "$native/native/firn" | wc -c)"
if [ -d "$web/site" ]; then
  total=0; total_gz=0
  for f in $(cd "$web/site" && find . -type f | sort); do
    raw=$(stat -c %s "$web/site/$f"); gz=$(gzip -9c "$web/site/$f" | wc -c)
    total=$((total + raw)); total_gz=$((total_gz + gz))
    printf '%-28s %10s %10s\n' "site/${f#./}" "$raw" "$gz"
  done
  printf '%-28s %10s %10s\n' "site total" "$total" "$total_gz"
fi
