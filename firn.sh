#!/usr/bin/env bash
# Firn's one set-up script (Debian 12, as root or with sudo). Idempotent and quiet when nothing
# is left to do.
#   ./firn.sh start   install what is missing, build, serve the offline page and open the app
#   ./firn.sh test    install what is missing, build native + web (+ the sanitizer/fuzz tree),
#                     run every test layer
#   ./firn.sh soak    install what is missing, build the page, run the 2,000-step browser
#                     session (FIRN_SESSION_STEPS, FIRN_SESSION_SEED to change or replay it)
#   ./firn.sh deps    only install what is missing
#   ./firn.sh build   only build (native in build/native, web in build/web)
set -euo pipefail
cd "$(dirname "$0")"
ROOT=$PWD
PORT=${FIRN_PORT:-8080}
JOBS=${FIRN_JOBS:-$(nproc)}
LOGS="$ROOT/build/logs"

# Debian packages: compilers and build tools (Ninja: docs/measurements.md), Emscripten, GLFW,
# Catch2, nlohmann-json (the reference the JSON tests compare with), CLI11, stb, the UI font, fonttools (font subsetting), Xvfb + Mesa (software GL), Chromium
# (browser tests, card PDF), poppler (PDF checks), librsvg (icons), node-terser (the page's glue
# script minified), dpkg-dev (apt-get source),
# clang-14 + libclang-rt-14-dev (ASan/UBSan unit tests and libFuzzer targets, docs/hardening.md),
# python3-fluids (reference atmospheres the tests check against; Debian's python3, not pyenv's).
PACKAGES=(build-essential cmake ninja-build pkg-config git ca-certificates xz-utils dpkg-dev
  emscripten libglfw3-dev libgl-dev libegl-dev libgl1-mesa-dri catch2 nlohmann-json3-dev
  libcli11-dev libstb-dev fonts-dejavu-core fonttools xvfb xauth chromium poppler-utils
  librsvg2-bin node-terser clang-14 libclang-rt-14-dev python3-fluids)

say() { printf 'firn: %s\n' "$*"; }
as_root() { if [ "$(id -u)" -eq 0 ]; then "$@"; else sudo "$@"; fi; }

install_packages() {
  local missing=() installed
  # One dpkg-query for all (one per package took ~45 s on a busy 2-core machine).
  installed=$(dpkg-query -W -f='${Package}\t${Status}\n' "${PACKAGES[@]}" 2>/dev/null \
    | awk -F'\t' '$2 ~ /install ok installed/ { print $1 }') || true
  for p in "${PACKAGES[@]}"; do
    [[ $'\n'$installed$'\n' == *$'\n'$p$'\n'* ]] || missing+=("$p")
  done
  command -v node >/dev/null 2>&1 || missing+=(nodejs)
  command -v npm >/dev/null 2>&1 || missing+=(npm)
  if [ ${#missing[@]} -gt 0 ]; then
    say "installing Debian packages: ${missing[*]}"
    as_root apt-get update -qq
    as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends \
      "${missing[@]}" >/dev/null
  fi
}

# A deb-src twin of the machine's own apt sources (same URIs, suites, components, keys), so a
# mirror configured here keeps working and this script names no package host. deb822 stanzas
# from /etc/apt/sources.list.d/*.sources, or the deb lines of /etc/apt/sources.list.
write_deb_src() {
  local stanzas= lines
  local files; files=$(ls /etc/apt/sources.list.d/*.sources 2>/dev/null | grep -v /firn-deb-src) || true
  # shellcheck disable=SC2086  # the file names have no spaces (apt's own naming)
  [ -z "$files" ] || stanzas=$(awk '
    BEGIN { RS = ""; FS = "\n" }
    {
      out = ""; binary = 0; enabled = 1
      for (i = 1; i <= NF; i++) {
        if ($i ~ /^#/) continue
        if ($i ~ /^Types:/) { if ($i ~ /[ \t]deb([ \t]|$)/) binary = 1; $i = "Types: deb-src" }
        if ($i ~ /^Enabled:[ \t]*(no|false)/) enabled = 0
        out = out $i "\n"
      }
      if (binary && enabled) printf "%s\n", out
    }' $files)
  if [ -n "$stanzas" ]; then
    printf '%s\n' "$stanzas" | as_root tee /etc/apt/sources.list.d/firn-deb-src.sources >/dev/null
    return 0
  fi
  lines=$(sed -nE 's/^[[:space:]]*deb([[:space:]])/deb-src\1/p' /etc/apt/sources.list 2>/dev/null)
  [ -n "$lines" ] || { say "no apt source to take a deb-src entry from (see DEVELOPERS.md)"; return 1; }
  printf '%s\n' "$lines" | as_root tee /etc/apt/sources.list.d/firn-deb-src.list >/dev/null
}

# Dear ImGui 1.86 source from Debian's source package, unpacked into .deps/ (git-ignored).
install_imgui_source() {
  [ -f .deps/imgui-1.86/imgui.cpp ] && return 0
  if ! grep -rqs '^Types:.*deb-src' /etc/apt/sources.list.d/ && ! grep -qs '^deb-src' /etc/apt/sources.list; then
    say "adding deb-src entries mirroring the machine's apt sources"
    write_deb_src
    as_root apt-get update -qq
  fi
  say "fetching Debian's imgui 1.86 source package"
  local tmp; tmp=$(mktemp -d)
  (cd "$tmp" && apt-get source --download-only imgui=1.86+ds-1 >/dev/null 2>&1 \
    || apt-get source --download-only imgui >/dev/null)
  mkdir -p .deps
  tar -xJf "$tmp"/imgui_1.86+ds.orig.tar.xz -C .deps
  rm -rf "$tmp"
}

# playwright-core (npm) for the browser tests; exact versions from package-lock.json.
install_node_modules() {
  [ -f tests/browser/package.json ] || return 0
  # A linked node_modules belongs to another checkout: npm ci here would empty the link's target
  # (it did: a worktree's run emptied the main checkout's playwright-core for every worktree).
  [ -L tests/browser/node_modules ] && return 0
  if [ ! -d tests/browser/node_modules ] || [ tests/browser/package-lock.json -nt tests/browser/node_modules ]; then
    say "installing test tooling from npm (tests/browser)"
    (cd tests/browser && npm ci --no-audit --no-fund --loglevel=error >/dev/null)
    touch tests/browser/node_modules
  fi
}

# Phase times (issue 13): every phase appends "name<TAB>seconds<TAB>status" to $PHASES, which
# `test` prints at the end, also when a phase fails.
PHASES="$LOGS/phases.tsv"
record_phase() { mkdir -p "$LOGS"; printf '%s\t%s\t%s\n' "$1" "$2" "$3" >>"$PHASES"; }
seconds_since() { awk -v a="$1" -v b="$EPOCHREALTIME" 'BEGIN { printf "%.1f", b - a }'; }
# name, command...: runs it (set -e still stops the script inside it) and records its wall time;
# a phase still running when the script exits is recorded as failed by print_phases.
PHASE= PHASE_START=
timed() {
  PHASE=$1 PHASE_START=$EPOCHREALTIME; shift
  "$@"
  record_phase "$PHASE" "$(seconds_since "$PHASE_START")" ok
  PHASE=
}

deps() {
  timed install-packages install_packages
  timed imgui-source install_imgui_source
  timed npm-tooling install_node_modules
}

run_logged() {  # name, command...: output to a log, shown only on failure; its time recorded
  local name=$1 start=$EPOCHREALTIME; shift
  mkdir -p "$LOGS"
  if ! "$@" >"$LOGS/$name.log" 2>&1; then
    record_phase "$name" "$(seconds_since "$start")" failed
    tail -n 60 "$LOGS/$name.log"; say "$name failed (full log: $LOGS/$name.log)"; exit 1
  fi
  record_phase "$name" "$(seconds_since "$start")" ok
}

# ctest, with each layer's time and result added to the phases as ctest:<layer>.
run_ctest() {
  local start=$EPOCHREALTIME status=0
  # Two layers at a time: most wait on a browser, a window or a child process (issue 13).
  (cd build/native && ctest --output-on-failure --timeout 300 -j 2) 2>&1 | tee "$LOGS/ctest.log" \
    || status=$?
  # "  3/12 Test  #3: wasm_unit ........   Passed    6.02 sec" (or ***Failed, ***Timeout)
  sed -nE 's/^ *[0-9]+\/[0-9]+ Test +#[0-9]+: ([^ ]+) \.* *(\*\*\*)?([A-Za-z]+).* ([0-9.]+) sec$/ctest:\1\t\4\t\3/p' \
    "$LOGS/ctest.log" | sed 's/\tPassed$/\tok/' >>"$PHASES"
  record_phase ctest "$(seconds_since "$start")" "$([ $status -eq 0 ] && echo ok || echo failed)"
  return $status
}

print_phases() {
  local total; total=$(seconds_since "$RUN_START")
  [ -f "$PHASES" ] || return 0
  [ -z "$PHASE" ] || record_phase "$PHASE" "$(seconds_since "$PHASE_START")" failed
  say "phase times (seconds; also in $PHASES, name<TAB>seconds<TAB>status)"
  awk -F'\t' '{ printf "firn:   %-28s %8s  %s\n", $1, $2, $3 }' "$PHASES"
  printf 'firn:   %-28s %8s\n' total "$total"
}

HARDENING=build/hardening  # the clang-14 sanitizer + fuzz tree, built by `test` only
# New build trees use Ninja; a tree configured before keeps its generator.
export CMAKE_GENERATOR=${CMAKE_GENERATOR:-Ninja}

WEB=build/web

build_web() {  # [cmake --build options]: all of the web tree by default
  export NODE_PATH=/usr/share/nodejs  # emcc needs Debian's acorn (see DEVELOPERS.md)
  if [ ! -f $WEB/CMakeCache.txt ]; then
    run_logged configure-web emcmake cmake -S . -B $WEB -DCMAKE_BUILD_TYPE=Release \
      -DCMAKE_CROSSCOMPILING_EMULATOR=/usr/bin/node
  fi
  run_logged build-web cmake --build $WEB -j "$JOBS" "$@"
}

build() {
  build_web
  local web=$WEB native=build/native
  # Configured again when a tree made before the hardening layers lacks their directories.
  if [ ! -f $native/CMakeCache.txt ] || ! grep -q "^FIRN_FUZZ_BUILD_DIR:PATH=$ROOT/$HARDENING\$" $native/CMakeCache.txt; then
    run_logged configure-native cmake -S . -B $native -DCMAKE_BUILD_TYPE=Release \
      -DFIRN_WEB_BUILD_DIR="$ROOT/$web" -DFIRN_SANITIZED_BUILD_DIR="$ROOT/$HARDENING" \
      -DFIRN_FUZZ_BUILD_DIR="$ROOT/$HARDENING"
  fi
  run_logged build-native cmake --build $native -j "$JOBS"
}

# One clang tree for the unit tests with ASan+UBSan (ctest unit_sanitized) and the libFuzzer
# targets (fuzz_smoke): core/model compiled once, sanitized and coverage-instrumented, at -O0
# (builds in half the time of -O1; the tests run ~10 s longer; docs/hardening.md). Only those
# programs are built.
build_hardening() {
  if [ ! -f $HARDENING/CMakeCache.txt ]; then
    run_logged configure-hardening env CC=clang-14 CXX=clang++-14 cmake -S . -B $HARDENING \
      -DFIRN_FUZZ=ON -DCMAKE_BUILD_TYPE=Debug -DCMAKE_CXX_FLAGS_DEBUG=-O0
  fi
  run_logged build-hardening cmake --build $HARDENING -j "$JOBS" --target firn_unit_tests \
    fuzz_units fuzz_cli fuzz_profile fuzz_models
}

# The long soak (2,000 seeded random interactions; issue 7), kept out of `test` (issue 13): the
# test run has a 150-step session (ctest browser_session).
soak() {
  local steps=${FIRN_SESSION_STEPS:-2000}
  say "soak: $steps random interactions on the phone-sized page"
  FIRN_SITE=$WEB/site FIRN_SESSION_STEPS=$steps FIRN_SCREENSHOTS=build/screenshots/soak \
    exec node --test --test-reporter=spec --test-timeout=$((steps * 2000)) \
    tests/browser/long-session.mjs
}

case "${1:-}" in
  deps) deps ;;
  soak) deps; build_web --target firn_site; soak ;;  # the page only, not the wasm unit tests
  build) deps; build ;;
  start)
    deps; build
    if [ -n "${DISPLAY:-}" ]; then say "opening the native app"; build/native/native/firn & fi
    say "serving the offline page on http://127.0.0.1:$PORT/ (Ctrl-C stops)"
    exec node web/serve.mjs build/web/site / "$PORT"
    ;;
  test)
    RUN_START=$EPOCHREALTIME
    mkdir -p "$LOGS"; : >"$PHASES"
    trap print_phases EXIT
    deps; build; build_hardening
    run_ctest
    ;;
  *) sed -n '2,10p' "$0"; exit 2 ;;
esac
