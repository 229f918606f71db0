#!/usr/bin/env bash
# Builds the npm package in pkg/ and the single-file offline page, after installing prerequisites.
#
#   bash pkg-scripts/build.sh [--no-simd] [--opt=-Oz|-O3|-O2|-Os] [--rust-opt=3|s|z] [--no-page]
#                             [--size-report] [--serve[=PORT]]
#
#   --no-simd    build without wasm simd128 (default: with it; Node >= 16.4 and all current
#                browsers run simd128, and the frame conversion is vectorised with it)
#   --opt=LEVEL  wasm-opt optimisation level (default -Oz, the smallest; see DEVELOPERS.md,
#                "Build, package and test matrix")
#   --rust-opt=L rustc opt-level for this build only (default: the `wasm` profile's; see
#                DEVELOPERS.md size notes) (CARGO_PROFILE_WASM_OPT_LEVEL, Cargo.toml untouched)
#   --no-page    skip `node www/build.mjs`
#   --size-report  print where the .wasm bytes go (largest functions, bytes per module); also
#                printed automatically when the size budget is exceeded
#   --serve      after building, serve dist/ on http://127.0.0.1:PORT/ (default 8765) until Ctrl-C
#
# Steps: install.sh -> cargo rustc --crate-type cdylib --profile wasm --target wasm32-unknown-unknown
# --features wasm (the whole API except the spectral-table bindings, with std) -> wasm-bindgen
# --target web -> wasm-opt (binaryen from
# node_modules, with exactly the features the module declares) -> the JavaScript facade
# (pkg-scripts/lib/assemble-js.mjs: src/wasm/js/ -> pkg/lib/, pkg/quantaband.js, pkg/quantaband.d.ts;
# the glue becomes pkg/quantaband_glue.js) -> pkg/package.json + Node entry -> size budget
# (tests/size/check.mjs: 320 KB raw / 128 KB gzip, fails when over) -> load check in Node ->
# the same with --features spectral-js into target/pkg-full/ (the full module: the package plus
# the spectral-table bindings, which do not fit the package's ceiling yet; for the page and the
# JavaScript tests, not published) -> node www/build.mjs --pkg target/pkg-full (the page) ->
# prints the paths.
# Environment: QB_SKIP_INSTALL=1 skips install.sh (test.sh sets it after running it once).
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
ROOT="$(pwd)"

SIMD=1
OPT=-Oz
PAGE=1
SIZE_REPORT=0
SERVE=""
for arg in "$@"; do
  case "$arg" in
    --no-simd) SIMD=0 ;;
    --opt=*) OPT="${arg#--opt=}" ;;
    --rust-opt=*) export CARGO_PROFILE_WASM_OPT_LEVEL="${arg#--rust-opt=}" ;;
    --no-page) PAGE=0 ;;
    --size-report) SIZE_REPORT=1 ;;
    --serve) SERVE=8765 ;;
    --serve=*) SERVE="${arg#--serve=}" ;;
    -h|--help) sed -n '2,28p' "$0"; exit 0 ;;
    *) echo "build.sh: unknown argument '$arg' (try --help)" >&2; exit 2 ;;
  esac
done
case "$OPT" in -O|-O1|-O2|-O3|-O4|-Os|-Oz) ;; *) echo "build.sh: bad --opt '$OPT'" >&2; exit 2 ;; esac
case "${CARGO_PROFILE_WASM_OPT_LEVEL:-3}" in 0|1|2|3|s|z) ;; *) echo "build.sh: bad --rust-opt" >&2; exit 2 ;; esac

say() { printf '[build] %s\n' "$*"; }
now() { date +%s.%N; }
since() { awk -v a="$1" -v b="$(now)" 'BEGIN { printf "%.1f s", b - a }'; }
T0="$(now)"

if [ "${QB_SKIP_INSTALL:-0}" != 1 ]; then
  bash pkg-scripts/install.sh
fi
CARGO_BIN="${CARGO_HOME:-$HOME/.cargo}/bin"
case ":$PATH:" in *":$CARGO_BIN:"*) ;; *) export PATH="$CARGO_BIN:$PATH" ;; esac

# shellcheck source=pkg-scripts/lib/wasm-env.sh
. pkg-scripts/lib/wasm-env.sh
qb_wasm_rustflags "$SIMD"

NAME=quantaband
TARGET_DIR="${CARGO_TARGET_DIR:-$ROOT/target}"
RAW_WASM="$TARGET_DIR/wasm32-unknown-unknown/wasm/$NAME.wasm"
STAGE="$TARGET_DIR/pkg-stage"

# One build at a time per work tree (teammates may share one): pkg/ and the staging folder are
# replaced as a whole.
mkdir -p "$TARGET_DIR"
exec 9>"$TARGET_DIR/.pkg-build.lock"
if ! flock -n 9; then
  say "waiting for another build.sh in this work tree to finish"
  flock 9
fi

# One module build: cargo rustc with FEATURES -> wasm-bindgen -> wasm-opt -> the facade (minus the
# areas in WITHOUT) -> package.json + Node entry, into OUT (replaced as a whole).
build_module() {
  local features="$1" out="$2" without="$3" t before
  t="$(now)"
  say "cargo rustc --profile wasm --lib --crate-type cdylib --target wasm32-unknown-unknown --features $features (simd128: $([ "$SIMD" = 1 ] && echo on || echo off), opt-level ${CARGO_PROFILE_WASM_OPT_LEVEL:-from Cargo.toml})"
  # The crate is an rlib (Cargo.toml); the cdylib is made here only.
  cargo rustc --profile wasm --lib --crate-type cdylib --target wasm32-unknown-unknown --features "$features"
  say "cargo rustc: $(since "$t"), $(stat -c %s "$RAW_WASM") B"

  t="$(now)"
  rm -rf "$STAGE"
  wasm-bindgen --target web --remove-name-section --remove-producers-section --out-dir "$STAGE" "$RAW_WASM"
  BG="$STAGE/${NAME}_bg.wasm"
  say "wasm-bindgen: $(since "$t"), $(stat -c %s "$BG") B"

  t="$(now)"
  read -r -a FEATURES <<<"$(node pkg-scripts/lib/wasm-features.mjs "$BG")"
  if [ "$SIMD" = 1 ] && ! printf '%s\n' "${FEATURES[@]}" | grep -qx -- --enable-simd; then
    echo "[build] ERROR: simd128 requested but the module does not declare it" >&2; exit 1
  fi
  before="$(stat -c %s "$BG")"
  node_modules/.bin/wasm-opt "$OPT" "${FEATURES[@]}" "$BG" -o "$BG.opt"
  mv "$BG.opt" "$BG"
  say "wasm-opt $OPT ${FEATURES[*]}: $(since "$t"), $before -> $(stat -c %s "$BG") B"

  node pkg-scripts/lib/assemble-js.mjs "$STAGE" "--without=$without"
  node pkg-scripts/lib/write-pkg-json.mjs "$STAGE"
  rm -rf "$out"
  mv "$STAGE" "$out"
}

# The npm package: the whole API except the spectral-table bindings (feature `spectral-js`,
# which does not fit the package's size ceiling yet; see DEVELOPERS.md, size notes).
build_module wasm pkg spectral

# Size budget; when it fails (or on request), show where the bytes go, from a build that keeps
# the function names (same wasm-opt level, -g keeps the name section).
size_report() {
  local d="$TARGET_DIR/size-report"
  rm -rf "$d"
  wasm-bindgen --target web --out-dir "$d" "$RAW_WASM"
  node_modules/.bin/wasm-opt "$OPT" -g "${FEATURES[@]}" "$d/${NAME}_bg.wasm" -o "$d/named.wasm"
  node tests/size/breakdown.mjs "$d/named.wasm" 25
}
if ! node tests/size/check.mjs pkg/${NAME}_bg.wasm; then
  size_report
  echo "[build] ERROR: pkg/${NAME}_bg.wasm is over the size budget (see the breakdown above)" >&2
  exit 1
fi
if [ "$SIZE_REPORT" = 1 ]; then size_report; fi

# The full module for the offline page and the JavaScript tests: the package plus the
# spectral-table bindings (target/pkg-full/, same layout as pkg/; not published).
PKG_FULL="$TARGET_DIR/pkg-full"
build_module spectral-js "$PKG_FULL" ""
say "full module (package + spectral-table bindings, for the page and the tests): $PKG_FULL, $(stat -c %s "$PKG_FULL/${NAME}_bg.wasm") B"

# The package must load in Node through its own entry (instantiates the wasm synchronously).
node --input-type=module -e "
  const m = await import('$ROOT/pkg/node.js');
  const n = Object.keys(m).length;
  const v = new m.Spectrum({ unit: 'um' }).point(10, 300);
  if (!(Math.abs(v / 9.924033330070695 - 1) < 1e-12)) throw new Error('pkg/node.js: L(10 um, 300 K) = ' + v);
  console.log('[build] pkg/node.js loads in Node ' + process.version + ': ' + n + ' exports');
"

PAGE_PATH=""
if [ "$PAGE" = 1 ] && [ -f www/build.mjs ]; then
  t="$(now)"
  say "node www/build.mjs --pkg $PKG_FULL"
  node www/build.mjs --pkg "$PKG_FULL"
  say "page build: $(since "$t")"
  if [ -f dist/$NAME.html ]; then PAGE_PATH="$ROOT/dist/$NAME.html"; fi
fi

say "done in $(since "$T0")"
say "package: $ROOT/pkg ($(cd pkg && ls | tr '\n' ' '))"
if [ -n "$PAGE_PATH" ]; then
  say "page:    $PAGE_PATH  (open it by double-clicking; it works offline from disk)"
elif [ "$PAGE" = 1 ]; then
  say "page:    not built (no www/build.mjs or no dist/$NAME.html)"
fi

if [ -n "$SERVE" ]; then
  [ -n "$PAGE_PATH" ] || { echo "[build] --serve: no page to serve" >&2; exit 1; }
  say "serving $ROOT/dist on http://127.0.0.1:$SERVE/$NAME.html (Ctrl-C to stop)"
  exec python3 -m http.server "$SERVE" --bind 127.0.0.1 --directory "$ROOT/dist"
fi
