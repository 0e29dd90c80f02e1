#!/usr/bin/env bash
# Times `./firn.sh test` on a clean clone, as CI runs it, and prints its phase figures (issue 13;
# results go in docs/measurements.md by hand). The machine's load is sampled every 10 s during
# the run and printed with them: on a shared machine the figures mean little without it.
#   tests/bench/clean_clone.sh [REPO] [CLONE_DIR]
#     REPO       what to clone (default: this checkout; its committed HEAD, not the work tree)
#     CLONE_DIR  where (default: a new temporary folder, kept for its logs)
# Exit status: that of ./firn.sh test. The full output is in CLONE_DIR/../clean-clone.log.
set -euo pipefail
repo=${1:-$(cd "$(dirname "$0")/../.." && pwd)}
clone=${2:-$(mktemp -d)/firn}
log=$(dirname "$clone")/clean-clone.log
loads=$(dirname "$clone")/loads.txt

git clone -q "$repo" "$clone"
echo "clean clone of $(git -C "$clone" rev-parse --short HEAD) in $clone; log $log"
: >"$loads"
(while sleep 10; do cut -d' ' -f1 /proc/loadavg >>"$loads"; done) &
sampler=$!
start=$(date +%s)
status=0
(cd "$clone" && ./firn.sh test) >"$log" 2>&1 || status=$?
end=$(date +%s)
kill "$sampler" 2>/dev/null || true

echo "== ./firn.sh test: exit $status, $((end - start)) s wall ($(date -u -d "@$start" +%H:%M)–$(date -u -d "@$end" +%H:%M) UTC), $(nproc) cores"
awk '{ s += $1; if ($1 > m) m = $1 } END { if (NR) printf "load average (1 min, every 10 s): mean %.1f, max %.1f over %d samples\n", s / NR, m, NR }' "$loads"
echo "== phases (seconds)"
phases="$clone/build/logs/phases.tsv"
if [ -f "$phases" ]; then
  awk -F'\t' '
    { printf "%-30s %8s  %s\n", $1, $2, $3 }
    $1 ~ /^ctest:/ { layers += $2 }
    $1 !~ /^ctest/ && $1 != "" { before += $2 }
    END { printf "%-30s %8.1f\n%-30s %8.1f\n", "installs + builds", before, "ctest layers (sum)", layers }' "$phases"
else
  echo "no $phases (the run stopped before its first phase)"; tail -n 30 "$log"
fi
exit $status
