#!/usr/bin/env bash
# Links a built Emscripten target again with extra flags into another folder, from CMake's own
# link line (Unix Makefiles generator: <dir>/CMakeFiles/<target>.dir/link.txt). For the size
# experiments in tests/bench: a link takes seconds, a rebuild minutes.
# Usage: tests/bench/relink.sh BUILD_DIR TARGET OUT_DIR [EXTRA_FLAG...]
#   TARGET firn (Firn's page, BUILD_DIR/web) or bare (the baseline); writes OUT_DIR/TARGET.js/.wasm
set -euo pipefail
[ $# -ge 3 ] || { sed -n '2,6p' "$0"; exit 2; }
dir=$1 target=$2 out=$(mkdir -p "$3" && cd "$3" && pwd); shift 3
[ "$target" = firn ] && dir=$dir/web
link=$dir/CMakeFiles/$target.dir/link.txt
[ -f "$link" ] || { echo "relink.sh: no $link (build $target first)" >&2; exit 1; }
line=$(sed "s# -o $target.js # -o $out/$target.js #" "$link")
[[ $line == *" -o $out/$target.js "* ]] || { echo "relink.sh: unexpected link line in $link" >&2; exit 1; }
export NODE_PATH=${NODE_PATH:-/usr/share/nodejs}
cd "$dir"
# The link line is CMake's own (compiler, flags, @response files); extra flags are appended.
eval "$line $(printf '%q ' "$@")"
