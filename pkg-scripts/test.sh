#!/usr/bin/env bash
# THE test command: installs prerequisites, then runs every check of the project in order and
# stops at the first failure.
#
#   bash pkg-scripts/test.sh [--only=REGEX] [--skip=REGEX] [--list]
#
# --only / --skip select steps by name (extended regex), for local iteration; CI runs them all.
# Each step's full output is kept in target/test-logs/run-*/NN-STEP.log (the newest run is
# target/test-logs/latest). The closing lines give a table of steps with timings and one line
# "tests: N passed, M failed, K skipped", the sums of the counts reported by cargo test,
# wasm-bindgen-test-runner and node's test runner.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
ROOT="$(pwd)"

ONLY=""
SKIP=""
LIST=0
for arg in "$@"; do
  case "$arg" in
    --only=*) ONLY="${arg#--only=}" ;;
    --skip=*) SKIP="${arg#--skip=}" ;;
    --list) LIST=1 ;;
    -h|--help) sed -n '2,11p' "$0"; exit 0 ;;
    *) echo "test.sh: unknown argument '$arg' (try --help)" >&2; exit 2 ;;
  esac
done

export CI="${CI:-}"
export CARGO_TERM_COLOR=never
export NO_COLOR=1
# The browser suites of wasm-bindgen-test and large-array tests in debug builds can be slow.
export WASM_BINDGEN_TEST_TIMEOUT="${WASM_BINDGEN_TEST_TIMEOUT:-300}"

# A log folder per run (teammates sharing a work tree may run tests at the same time);
# target/test-logs/latest points at the newest.
LOGDIR="$ROOT/target/test-logs/run-$(date +%Y%m%d-%H%M%S)-$$"
mkdir -p "$LOGDIR"
ln -sfn "$LOGDIR" "$ROOT/target/test-logs/latest"
# Keep the ten newest runs.
find "$ROOT/target/test-logs" -maxdepth 1 -name 'run-*' -type d -printf '%T@ %p\n' | sort -rn | tail -n +11 \
  | cut -d' ' -f2- | while read -r old; do rm -rf -- "$old"; done

now() { date +%s.%N; }
secs() { awk -v a="$1" -v b="$2" 'BEGIN { printf "%.1f", b - a }'; }

T0="$(now)"
N=0
PASSED=0
FAILED=0
SKIPPED=0
SUMMARY=()

# Sums the test counts a step printed: cargo test / wasm-bindgen-test-runner
# ("test result: ok. 12 passed; 0 failed; 1 ignored; ...") and node --test ("ℹ pass 12",
# "ℹ skipped 1", or "# pass 12" in TAP). Prints "PASSED FAILED SKIPPED".
count_tests() {
  local log="$1"
  awk '
    /^test result: / {
      for (i = 1; i <= NF; i++) {
        if ($(i) ~ /^passed;?$/) p += $(i - 1)
        if ($(i) ~ /^failed;?$/) f += $(i - 1)
        if ($(i) ~ /^ignored;?$/) s += $(i - 1)
      }
    }
    /^(ℹ|#) pass [0-9]+$/ { p += $3 }
    /^(ℹ|#) (fail|cancelled) [0-9]+$/ { f += $3 }
    /^(ℹ|#) (skipped|todo) [0-9]+$/ { s += $3 }
    END { printf "%d %d %d\n", p, f, s }
  ' "$log"
}

print_summary() {
  local status="$1"
  echo
  echo "==================== quantaband test summary ===================="
  printf '%s\n' "${SUMMARY[@]}"
  echo "total time: $(secs "$T0" "$(now)") s; logs: $LOGDIR"
  echo "steps: $status"
  echo "tests: $PASSED passed, $FAILED failed, $SKIPPED skipped"
}

# step NAME COMMAND...   runs COMMAND (through bash -c when it is a single string).
step() {
  local name="$1"; shift
  if [ -n "$ONLY" ] && ! [[ "$name" =~ $ONLY ]]; then return 0; fi
  if [ -n "$SKIP" ] && [[ "$name" =~ $SKIP ]]; then return 0; fi
  N=$((N + 1))
  if [ "$LIST" = 1 ]; then echo "$name: $*"; return 0; fi
  local log
  log="$LOGDIR/$(printf '%02d' "$N")-$name.log"
  echo
  echo "==> [$N] $name: $*"
  local t rc=0
  t="$(now)"
  set +e
  if [ $# -eq 1 ]; then
    bash -c "$1" </dev/null 2>&1 | tee "$log"
  else
    "$@" </dev/null 2>&1 | tee "$log"
  fi
  rc="${PIPESTATUS[0]}"
  set -e
  local dt p f sk
  dt="$(secs "$t" "$(now)")"
  read -r p f sk < <(count_tests "$log")
  PASSED=$((PASSED + p))
  FAILED=$((FAILED + f))
  SKIPPED=$((SKIPPED + sk))
  local counts=""
  if [ "$p" -gt 0 ] || [ "$f" -gt 0 ]; then
    if [ "$sk" -gt 0 ]; then counts="  ($p passed, $f failed, $sk skipped)"; else counts="  ($p passed, $f failed)"; fi
  fi
  if [ "$rc" -ne 0 ]; then
    SUMMARY+=("$(printf 'FAIL  %-22s %7s s%s  exit %d' "$name" "$dt" "$counts" "$rc")")
    [ "$f" -gt 0 ] || FAILED=$((FAILED + 1))
    echo "==> [$N] $name FAILED (exit $rc) after $dt s; log: $log"
    print_summary "FAILED at '$name'"
    exit 1
  fi
  SUMMARY+=("$(printf 'ok    %-22s %7s s%s' "$name" "$dt" "$counts")")
  echo "==> [$N] $name ok ($dt s)$counts"
}

# skipped NAME REASON: a step whose inputs do not exist in this checkout (shown in the summary).
skipped() {
  if [ -n "$ONLY" ] && ! [[ "$1" =~ $ONLY ]]; then return 0; fi
  if [ -n "$SKIP" ] && [[ "$1" =~ $SKIP ]]; then return 0; fi
  if [ "$LIST" = 1 ]; then echo "$1: skipped ($2)"; return 0; fi
  SUMMARY+=("$(printf 'skip  %-22s %9s  %s' "$1" "" "$2")")
  echo
  echo "==> $1 skipped: $2"
}

step install bash pkg-scripts/install.sh
export QB_SKIP_INSTALL=1
CARGO_BIN="${CARGO_HOME:-$HOME/.cargo}/bin"
case ":$PATH:" in *":$CARGO_BIN:"*) ;; *) export PATH="$CARGO_BIN:$PATH" ;; esac
# shellcheck source=pkg-scripts/lib/wasm-env.sh
. pkg-scripts/lib/wasm-env.sh
qb_wasm_rustflags 1

step fmt cargo fmt --all --check -- --color never
step clippy-host cargo clippy --all-targets -- -D warnings
# The crate is an rlib (the package script builds the cdylib), so the no_std lib lints directly.
step clippy-no-std cargo clippy --lib --no-default-features -- -D warnings
step clippy-no-std-serde cargo clippy --lib --no-default-features --features serde -- -D warnings
# The bindings (the package and the wasm-bindgen-test suites both build them with std).
step clippy-wasm cargo clippy --lib --features wasm --target wasm32-unknown-unknown -- -D warnings
# ... and with the spectral-table bindings (feature spectral-js: the full build of the page and
# the JavaScript tests; the npm package leaves them out for its size ceiling).
step clippy-wasm-spectral cargo clippy --lib --features spectral-js --target wasm32-unknown-unknown -- -D warnings
step no-std-thumbv7em "cargo build --lib --no-default-features --target thumbv7em-none-eabihf && cargo build --lib --no-default-features --features serde --target thumbv7em-none-eabihf"
step no-std-wasm32 cargo build --lib --no-default-features --target wasm32-unknown-unknown
# A no_std crate that depends on quantaband with default-features = false: checks, tests on the
# host and builds for the bare-metal target (proves dependents are not forced to build a cdylib).
step no-std-dependent "cargo test --manifest-path tests/no_std_dependent/Cargo.toml --target-dir target/no-std-dependent && cargo build --manifest-path tests/no_std_dependent/Cargo.toml --target-dir target/no-std-dependent --target thumbv7em-none-eabihf"
# serde on: the definition round trips (tests/definition_serde.rs) and the serde doctests.
step cargo-test cargo test --features serde
step cargo-doc "RUSTDOCFLAGS='-D warnings' cargo doc --no-deps"

if [ -f tests/wasm_node.rs ]; then
  step wasm-test-node env CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUNNER=wasm-bindgen-test-runner \
    cargo test --target wasm32-unknown-unknown --features wasm --test wasm_node
else
  skipped wasm-test-node "tests/wasm_node.rs absent"
fi
if [ -f tests/wasm_browser.rs ]; then
  step wasm-test-browser env CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUNNER=wasm-bindgen-test-runner \
    CHROMEDRIVER=/usr/bin/chromedriver \
    cargo test --target wasm32-unknown-unknown --features wasm --test wasm_browser
else
  skipped wasm-test-browser "tests/wasm_browser.rs absent"
fi

step build bash pkg-scripts/build.sh

if compgen -G 'tests/js/*.test.mjs' >/dev/null; then
  step js-node-test "node --test --test-reporter=spec tests/js/*.test.mjs"
else
  skipped js-node-test "no tests/js/*.test.mjs"
fi
if [ -f tests/types/tsconfig.json ]; then
  step types node_modules/.bin/tsc --strict --noEmit -p tests/types
else
  skipped types "tests/types/tsconfig.json absent"
fi
step size node tests/size/check.mjs
# One tarball for the steps that install it (each packs its own when this step did not run).
step pack "set -o pipefail; bash pkg-scripts/pack.sh | tee '$LOGDIR/tarball-path'"
if [ "$LIST" != 1 ] && [ -s "$LOGDIR/tarball-path" ]; then
  QB_TARBALL="$(tail -n 1 "$LOGDIR/tarball-path")"
  export QB_TARBALL
fi
step tarball-smoke node --test --test-reporter=spec tests/js/smoke/smoke.mjs tests/js/smoke/readme-page.test.mjs
step consumers node --test --test-reporter=spec tests/consumers/consumers.test.mjs
if compgen -G 'tests/page/*.test.mjs' >/dev/null; then
  step page-test "node --test --test-reporter=spec tests/page/*.test.mjs"
else
  skipped page-test "no tests/page/*.test.mjs"
fi

if [ "$LIST" = 1 ]; then exit 0; fi
if [ "$N" -eq 0 ]; then echo "test.sh: no step selected" >&2; exit 2; fi
print_summary "all $N passed"
