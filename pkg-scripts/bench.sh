#!/usr/bin/env bash
# The bench command: measures the native Rust core, the wasm package in Node, plain-JavaScript
# baselines (A: Planck + Simpson + bisection; C: Sakuma-Hattori closed form over a frame) and a
# SciPy baseline (B: quad + brentq) in ONE run, and prints ONE markdown table with medians,
# ratios and the error of every implementation against mpmath reference values
# (benches/data/bench_reference.json).
#
# usage: bash pkg-scripts/bench.sh [--quick] [--no-build] [--no-scipy] [--readme]
#   --quick     short warm-up and few samples (a smoke run; figures are noisy)
#   --no-build  use the existing pkg/ instead of running pkg-scripts/build.sh
#   --no-scipy  skip Baseline B
#   --readme    also write the table into README.md (between the bench-table markers of the
#               performance section)
#
# Not part of the test command: nothing here asserts a timing. Results land in target/bench/.
set -euo pipefail

cd "$(dirname "$0")/.."
ROOT=$(pwd)
OUT="$ROOT/target/bench"
mkdir -p "$OUT"

QUICK=0
BUILD=1
SCIPY=1
README=0
for arg in "$@"; do
  case "$arg" in
    --quick) QUICK=1 ;;
    --no-build) BUILD=0 ;;
    --no-scipy) SCIPY=0 ;;
    --readme) README=1 ;;
    *) echo "bench.sh: unknown option $arg" >&2; exit 2 ;;
  esac
done
QFLAG=()
[ "$QUICK" = 1 ] && QFLAG=(--quick)
PKG_ARGS=()

RESULTS="$OUT/results.jsonl"
: >"$RESULTS"
say() { printf '\n== %s\n' "$*" >&2; }

# ---- machine description ----------------------------------------------------------------------
CPU=$(lscpu 2>/dev/null | sed -n 's/^Model name:[[:space:]]*//p' | head -n1)
LOAD=$(cut -d' ' -f1-3 /proc/loadavg 2>/dev/null || echo unknown)
node -e '
const [date, cpu, nproc, rustc, node, load] = process.argv.slice(1);
console.log(JSON.stringify({ date, cpu, nproc, rustc, node, load }));
' "$(date -u '+%Y-%m-%d %H:%M UTC')" "${CPU:-unknown CPU}" "$(nproc)" "$(rustc --version)" "$(node --version)" "$LOAD" \
  >"$OUT/machine.json"

# ---- native Rust ------------------------------------------------------------------------------
say "native: cargo bench --bench native"
cargo bench --bench native -- "${QFLAG[@]}" | tee -a "$RESULTS" >&2

# ---- wasm package -----------------------------------------------------------------------------
if [ "$BUILD" = 1 ]; then
  if [ -f pkg-scripts/build.sh ]; then
    # --no-page: the benchmark needs pkg/ only, not the offline page.
    say "package: bash pkg-scripts/build.sh --no-page"
    STAMP="$OUT/build-start"
    touch "$STAMP"
    if ! bash pkg-scripts/build.sh --no-page >&2; then
      # build.sh fails after writing pkg/ when, e.g., the size budget is exceeded: measure that
      # fresh package but say so; never measure a stale one.
      if [ pkg/quantaband_bg.wasm -nt "$STAMP" ]; then
        NOTE="pkg-scripts/build.sh exited non-zero (see its output above); the pkg/ it wrote in this run was measured"
        echo "bench.sh: $NOTE" >&2
        printf '{"impl":"build","meta":true,"warning":"%s"}\n' "$NOTE" >>"$RESULTS"
      else
        echo "bench.sh: pkg-scripts/build.sh failed and wrote no fresh pkg/; the wasm columns are skipped" >&2
        rm -rf "$OUT/no-pkg" && mkdir -p "$OUT/no-pkg"
        PKG_ARGS=(--pkg "$OUT/no-pkg")
      fi
    fi
  else
    say "package: pkg-scripts/build.sh not present yet; the wasm column will be empty"
  fi
fi

say "node: wasm package + Baselines A and C"
node benches/js/bench_node.mjs "${QFLAG[@]}" "${PKG_ARGS[@]}" | tee -a "$RESULTS" >&2
if [ "${#PKG_ARGS[@]}" = 0 ] && [ -f pkg/quantaband_bg.wasm ] && [ -f pkg/quantaband.js ]; then
  say "node: compile + instantiate in fresh processes"
  RUNS=15
  [ "$QUICK" = 1 ] && RUNS=5
  node benches/js/instantiate.mjs --runs "$RUNS" | tee -a "$RESULTS" >&2
fi

# ---- Baseline B: SciPy ------------------------------------------------------------------------
if [ "$SCIPY" = 1 ]; then
  VENV="$ROOT/.venv-bench"
  if [ ! -x "$VENV/bin/python" ] || ! "$VENV/bin/python" -c 'import scipy' 2>/dev/null; then
    say "scipy: creating $VENV (pip install scipy numpy)"
    if ! { python3 -m venv "$VENV" && "$VENV/bin/pip" install -q scipy numpy; } >&2; then
      echo "bench.sh: SciPy unavailable (venv or pip install failed); Baseline B skipped" >&2
    fi
  fi
  if "$VENV/bin/python" -c 'import scipy' 2>/dev/null; then
    say "scipy: quad + brentq"
    "$VENV/bin/python" benches/py/bench_scipy.py benches/data/bench_reference.json | tee -a "$RESULTS" >&2
  fi
fi

# ---- the table --------------------------------------------------------------------------------
say "table"
node benches/js/table.mjs "$RESULTS" --machine "$OUT/machine.json" >"$OUT/table.md"
cat "$OUT/table.md"

if [ "$README" = 1 ]; then
  node -e '
const fs = require("fs");
const [readme, tablePath] = process.argv.slice(1);
const text = fs.readFileSync(readme, "utf8");
const start = "<!-- bench-table:start -->";
const end = "<!-- bench-table:end -->";
const i = text.indexOf(start);
const j = text.indexOf(end);
const s = text.indexOf("<!-- BEGIN performance (owner: bench) -->");
const e = text.indexOf("<!-- END performance -->");
if (i < 0 || j < i || i < s || j > e) {
  console.error("bench.sh: README.md has no bench-table markers inside the performance section");
  process.exit(1);
}
const table = fs.readFileSync(tablePath, "utf8").trimEnd();
fs.writeFileSync(readme, text.slice(0, i + start.length) + "\n" + table + "\n" + text.slice(j));
console.error("bench.sh: README.md performance table updated");
' README.md "$OUT/table.md"
fi
