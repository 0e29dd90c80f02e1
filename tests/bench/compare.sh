#!/usr/bin/env bash
# Firn against the bare toolkit, in one run (docs/BENCHMARKS.md records one run's output):
#   builds Firn's page (build/bench-web, configured like ./firn.sh build), the bare Dear ImGui
#   GLFW/OpenGL3 example with the same Emscripten flags (build/bench-bare, tests/bench/bare/)
#   and the native core benchmark (build/bench-native), then prints
#   1. transfer size per file kind, raw and gzip -9, with ratios (sizes.mjs), and where the
#      wasm bytes go (wasm_sizes.mjs on both, relinked with --profiling-funcs);
#   2. time to first frame (median of cold loads), frames drawn while idle and main-thread time
#      per frame while interacting, in headless Chromium (page_bench.mjs);
#   3. core task times (firn_bench);
#   4. size experiments: link-flag variants of Firn's page and leaner font subsets
#      (skipped with --no-experiments).
# Figures only: nothing here passes or fails on a number. Needs what ./firn.sh deps installs.
# Never touches build/native or build/web. Uses at most FIRN_BENCH_JOBS (default 2) cores.
# Usage: tests/bench/compare.sh [--loads N] [--idle SECONDS] [--no-experiments]
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
cd "$root"
jobs=${FIRN_BENCH_JOBS:-2}
loads=5 idle=10 experiments=1
while [ $# -gt 0 ]; do
  case $1 in
    --loads) loads=$2; shift 2 ;;
    --idle) idle=$2; shift 2 ;;
    --no-experiments) experiments=0; shift ;;
    *) sed -n '2,16p' "$0"; exit 2 ;;
  esac
done
web=build/bench-web bare=build/bench-bare native=build/bench-native
export NODE_PATH=/usr/share/nodejs  # emcc needs Debian's acorn (DEVELOPERS.md)
export CMAKE_GENERATOR="Unix Makefiles"  # relink.sh reads the Makefile generator's link.txt

missing=()
[ -f .deps/imgui-1.86/examples/example_glfw_opengl3/main.cpp ] || missing+=("ImGui source (.deps)")
[ -d tests/browser/node_modules/playwright-core ] || missing+=("playwright-core (tests/browser)")
command -v em++ >/dev/null || missing+=(emscripten)
[ -x "${FIRN_CHROMIUM:-/usr/bin/chromium}" ] || missing+=(chromium)
command -v pyftsubset >/dev/null || missing+=(fonttools)
if [ ${#missing[@]} -gt 0 ]; then
  echo "compare.sh: missing ${missing[*]}: run ./firn.sh deps first" >&2
  exit 1
fi

log=build/bench-logs
mkdir -p "$log"
quiet() {  # name, command...: output to a log, shown only on failure (which stops the run)
  local name=$1; shift
  if ! "$@" >"$log/$name.log" 2>&1; then
    tail -n 40 "$log/$name.log"; echo "compare.sh: $name failed (log: $log/$name.log)" >&2; exit 1
  fi
}

echo "# Firn vs the bare ImGui example — $(date -u '+%Y-%m-%d %H:%M UTC')"
echo "source: $(git rev-parse --short HEAD)$(git diff --quiet HEAD -- . 2>/dev/null || echo ' + uncommitted changes in the work tree')"
echo "machine: $(nproc) cores, $(awk '/MemTotal/ {printf "%.0f GiB", $2/1048576}' /proc/meminfo), load average at start $(cut -d' ' -f1-3 /proc/loadavg)"
# sed -n reads to the end: `| head -1` closes the pipe early and emcc prints a traceback.
first_version() { "$@" 2>/dev/null | sed -n '1s/[^0-9]*\([0-9][0-9.]*\).*/\1/p'; }
echo "tools: emscripten $(first_version em++ --version), node $(first_version node --version)," \
     "Chromium $(first_version "${FIRN_CHROMIUM:-/usr/bin/chromium}" --version), g++ $(first_version g++ --version)"

echo
echo "== building (logs in $log)"
start=$(date +%s)
if [ ! -f $web/CMakeCache.txt ]; then  # the same configure as ./firn.sh build
  quiet configure-web emcmake cmake -S . -B $web -DCMAKE_BUILD_TYPE=Release \
    -DCMAKE_CROSSCOMPILING_EMULATOR=/usr/bin/node
fi
quiet build-web cmake --build $web --target firn_site -j "$jobs"
[ -f $bare/CMakeCache.txt ] || quiet configure-bare emcmake cmake -S tests/bench/bare -B $bare -DCMAKE_BUILD_TYPE=Release
quiet build-bare cmake --build $bare -j "$jobs"
[ -f $native/CMakeCache.txt ] || quiet configure-native cmake -S . -B $native -DCMAKE_BUILD_TYPE=Release
quiet build-native cmake --build $native --target firn_bench firn_frame_bench -j "$jobs"
echo "built in $(( $(date +%s) - start )) s"
echo "Firn link:  $(sed -e 's/ @.*//' -e 's/^[^ ]* //' $web/web/CMakeFiles/firn.dir/link.txt)"
echo "bare link:  $(sed -e 's/ @.*//' -e 's/^[^ ]* //' $bare/CMakeFiles/bare.dir/link.txt)"
echo "(CMake's Release adds -O3 -DNDEBUG to both; the later -Oz wins.)"

echo
echo "== 1. transfer size (every file of each site; Firn's service worker precaches them all)"
node tests/bench/sizes.mjs $web/site $bare/site $web/assets/generated/firn-regular.ttf \
  $web/assets/generated/firn-bold.ttf

echo
echo "== where the wasm bytes go (both relinked with --profiling-funcs: same code, names kept)"
quiet relink-names-firn tests/bench/relink.sh $web firn "$root/$web/with-names" --profiling-funcs
quiet relink-names-bare tests/bench/relink.sh $bare bare "$root/$bare/with-names" --profiling-funcs
node tests/bench/wasm_sizes.mjs $web/with-names/firn.wasm 12
node tests/bench/wasm_sizes.mjs $bare/with-names/bare.wasm 6

echo
echo "== 2. in headless Chromium"
node tests/bench/page_bench.mjs --firn $web/site --bare $bare/site --loads "$loads" --idle "$idle"

echo
echo "== 3. core (native, Release, g++; one thread)"
$native/tests/firn_bench
$native/tests/firn_frame_bench

if [ "$experiments" = 1 ]; then
  echo
  echo "== 4. size experiments on Firn's page (own build dirs; Firn's build is not changed here)"
  node tests/bench/experiments.mjs "$web" "$bare"
fi
echo
echo "load average at the end $(cut -d' ' -f1-3 /proc/loadavg)"
