#!/usr/bin/env bash
# Installs everything the build and the tests need, idempotently; a second run takes seconds.
#
#   bash pkg-scripts/install.sh
#
# What it installs (only where missing):
#   - rustup targets wasm32-unknown-unknown and thumbv7em-none-eabihf, components rustfmt and clippy
#   - wasm-bindgen-cli 0.2.130 (wasm-bindgen + wasm-bindgen-test-runner), which must equal the
#     crate's pinned wasm-bindgen version exactly (~4 min to compile on 2 cores the first time)
#   - the dev npm packages of package-lock.json (typescript, playwright-core, binaryen's wasm-opt;
#     esbuild, vite and marked for the bundler consumers and the npm README check) via `npm ci`,
#     skipped when node_modules already matches the lockfile
#   - Debian's chromium, chromium-driver and fonts-liberation (headless browser tests), and
#     Node.js/npm if absent (Node.js 20.19+ or 22.12+ is required)
# Works as root with no standard input (CI=true). Set QB_SKIP_APT=1 to skip the Debian packages.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."

WASM_BINDGEN_VERSION=0.2.130
export DEBIAN_FRONTEND=noninteractive

say() { printf '[install] %s\n' "$*"; }
die() { printf '[install] ERROR: %s\n' "$*" >&2; exit 1; }

# Make a rustup installation in the usual place visible to non-login shells.
if ! command -v cargo >/dev/null 2>&1 && [ -f "$HOME/.cargo/env" ]; then
  # shellcheck disable=SC1091
  . "$HOME/.cargo/env"
fi
CARGO_BIN="${CARGO_HOME:-$HOME/.cargo}/bin"
case ":$PATH:" in *":$CARGO_BIN:"*) ;; *) export PATH="$CARGO_BIN:$PATH" ;; esac
command -v cargo >/dev/null 2>&1 || die "cargo not found: install Rust with rustup first"
command -v rustup >/dev/null 2>&1 || die "rustup not found: the wasm and thumbv7em targets are added with rustup"

SUDO=""
if [ "$(id -u)" != 0 ]; then SUDO="sudo -n"; fi
APT_UPDATED=0
apt_install() {
  if [ "${QB_SKIP_APT:-0}" = 1 ]; then die "missing Debian packages ($*) and QB_SKIP_APT=1"; fi
  command -v apt-get >/dev/null 2>&1 || die "apt-get not found; install $* by hand"
  if [ "$APT_UPDATED" = 0 ]; then
    say "apt-get update"
    $SUDO apt-get update -qq </dev/null
    APT_UPDATED=1
  fi
  say "apt-get install $*"
  $SUDO apt-get install -y -qq --no-install-recommends "$@" </dev/null
}

# 1. Rust targets and components.
installed_targets="$(rustup target list --installed)"
for t in wasm32-unknown-unknown thumbv7em-none-eabihf; do
  if grep -qx "$t" <<<"$installed_targets"; then
    say "rust target $t: present"
  else
    say "rustup target add $t"
    rustup target add "$t" </dev/null
  fi
done
cargo fmt --version >/dev/null 2>&1 || { say "rustup component add rustfmt"; rustup component add rustfmt </dev/null; }
cargo clippy --version >/dev/null 2>&1 || { say "rustup component add clippy"; rustup component add clippy </dev/null; }

# 2. wasm-bindgen CLI pinned to the crate's wasm-bindgen version (no --locked: it fails here).
have_wb="$(wasm-bindgen --version 2>/dev/null || true)"
have_runner="$(command -v wasm-bindgen-test-runner || true)"
if [ "$have_wb" = "wasm-bindgen $WASM_BINDGEN_VERSION" ] && [ -n "$have_runner" ]; then
  say "wasm-bindgen-cli $WASM_BINDGEN_VERSION: present"
else
  say "cargo install wasm-bindgen-cli --version $WASM_BINDGEN_VERSION (found: '${have_wb:-none}'; takes ~4 min)"
  cargo install wasm-bindgen-cli --version "$WASM_BINDGEN_VERSION" --force </dev/null
  [ "$(wasm-bindgen --version)" = "wasm-bindgen $WASM_BINDGEN_VERSION" ] || die "wasm-bindgen version mismatch after install"
fi

# 3. Node.js and npm (present on the usual machine; Debian's packages otherwise).
if ! command -v node >/dev/null 2>&1 || ! command -v npm >/dev/null 2>&1; then
  apt_install nodejs npm
fi
# The dev tools (vite 8) and the package's own engines field need 20.19+ or 22.12+.
node -e '
  const [a, b] = process.versions.node.split(".").map(Number);
  process.exit((a === 20 && b >= 19) || (a === 22 && b >= 12) || a >= 23 ? 0 : 1);
' || die "Node.js 20.19+ or 22.12+ needed, found $(node --version)"

# 4. Dev npm packages from the committed lockfile; skipped when node_modules already matches it.
lock_sum="$(sha256sum package-lock.json | cut -d' ' -f1)"
stamp=node_modules/.quantaband-lock.sha256
if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$lock_sum" ] \
   && [ -x node_modules/.bin/wasm-opt ] && [ -x node_modules/.bin/tsc ] && [ -d node_modules/playwright-core ] \
   && [ -x node_modules/.bin/esbuild ] && [ -x node_modules/.bin/vite ] && [ -d node_modules/marked ]; then
  say "npm dev packages: present (node_modules matches package-lock.json)"
else
  say "npm ci"
  npm ci --no-audit --no-fund --loglevel=error </dev/null
  printf '%s\n' "$lock_sum" > "$stamp"
fi

# 5. Headless Chromium and its WebDriver from Debian (never a browser download), with the fonts
#    the page tests lay text out with (fonts-liberation is what chromium recommends; the rest of
#    its recommendations are desktop services a headless run does not use).
need=()
[ -x /usr/bin/chromium ] || need+=(chromium)
[ -x /usr/bin/chromedriver ] || need+=(chromium-driver)
if command -v dpkg-query >/dev/null 2>&1 \
   && [ "$(dpkg-query -W -f='${Status}' fonts-liberation 2>/dev/null)" != "install ok installed" ]; then
  need+=(fonts-liberation)
fi
if [ ${#need[@]} -eq 0 ]; then
  say "chromium + chromedriver + fonts: present"
else
  apt_install "${need[@]}"
fi
[ -x /usr/bin/chromium ] && [ -x /usr/bin/chromedriver ] || die "chromium/chromedriver missing after install"

say "ok: $(rustc --version | cut -d' ' -f1-2), $(wasm-bindgen --version), wasm-opt $(node_modules/.bin/wasm-opt --version | awk '{print $3}'), node $(node --version), $(/usr/bin/chromium --version 2>/dev/null | head -1)"
