#!/usr/bin/env bash
# ctest fuzz_smoke: every fuzz target replays its committed corpus (tests/fuzz/corpus, including
# the inputs of past findings), then fuzzes briefly from it with a fixed seed: 5 s per target,
# about 30 s in all. Fails on any crash, sanitizer report or broken invariant.
#   tests/fuzz/smoke.sh BUILD_DIR      (BUILD_DIR: the FIRN_FUZZ tree, build/hardening)
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
work=$(mktemp -d); trap 'rm -rf "$work"' EXIT
failed=0
for target in fuzz_units fuzz_cli fuzz_profile fuzz_models; do
  "$here/run.sh" "$1" "$target" 5 "$work/$target" -seed=1 || failed=1
done
exit $failed
