#!/usr/bin/env bash
# One fuzz target for a while, from the committed corpus (docs/hardening.md):
#   tests/fuzz/run.sh BUILD_DIR TARGET SECONDS [WORK_DIR] [libFuzzer flags...]
# BUILD_DIR is the FIRN_FUZZ tree (build/hardening). New inputs go to WORK_DIR (default
# BUILD_DIR/work/TARGET), never into tests/fuzz/corpus; a crash is written to WORK_DIR/crash-*,
# replayed with its full message and printed as hex. Prints libFuzzer's final statistics.
set -euo pipefail
build=$(cd "$1" && pwd); target=$2; seconds=$3
here=$(cd "$(dirname "$0")" && pwd)
work=${4:-$build/work/$target}; shift $(( $# < 4 ? $# : 4 ))
bin=$build/tests/fuzz/$target
mkdir -p "$work/corpus"
dict=(); [ -f "$here/$target.dict" ] && dict=(-dict="$here/$target.dict")
# stderr of the target closed (the CLI prints every refusal there); libFuzzer keeps its own.
set +e
"$bin" -max_total_time="$seconds" -timeout=10 -rss_limit_mb=2048 -close_fd_mask=2 \
  -print_final_stats=1 -artifact_prefix="$work/" "${dict[@]}" "$@" \
  "$work/corpus" "$here/corpus/$target" >"$work/log" 2>&1
status=$?
set -e
grep -aE '^stat::|^#[0-9]+[[:space:]]+DONE' "$work/log" || true
if [ $status -ne 0 ]; then
  tail -n 20 "$work/log"
  for crash in "$work"/crash-* "$work"/leak-* "$work"/timeout-* "$work"/oom-*; do
    [ -f "$crash" ] || continue
    echo "--- $target: $crash"
    { "$bin" "$crash" 2>&1 | grep -avE '^INFO|^ *#[0-9]+ 0x.* in (fuzzer::|__libc|_start|main )' | head -40; } || true
    xxd "$crash" | head -20 || true
  done
  echo "$target: FAILED (exit $status)"
  exit 1
fi
echo "$target: ok"
