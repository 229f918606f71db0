# Shared by build.sh and test.sh (sourced): the rustc flags every wasm32 build of this crate uses,
# so that the package, the wasm-bindgen-test suites and the no_std wasm build compile the same
# code paths and cargo does not rebuild between them.
#
#   qb_wasm_rustflags 1   # with simd128 (default)
#   qb_wasm_rustflags 0   # without
# Only the wasm32 target gets the flag (target-specific variable), so host builds, build scripts
# and proc-macros are unaffected. A global RUSTFLAGS would take precedence over it: refuse that.
qb_wasm_rustflags() {
  if [ -n "${RUSTFLAGS:-}" ] || [ -n "${CARGO_ENCODED_RUSTFLAGS:-}" ]; then
    echo "[wasm-env] RUSTFLAGS/CARGO_ENCODED_RUSTFLAGS is set and would override the wasm32 flags; unset it" >&2
    return 1
  fi
  # LLVM's inliner threshold 15 (opt-level "s" of the wasm profile): the export shims do not carry
  # inlined copies of the configuration readers and checks; with every capability bound this is
  # what keeps the module within 320 KB / 128 KB gzip-9 (threshold 50: 317.8 / 130.5 KB; 15:
  # 308.7 / 127.8 KB; DEVELOPERS.md, size notes, for the speed measured).
  local inline="-C llvm-args=-inline-threshold=15"
  if [ "$1" = 1 ]; then
    export CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUSTFLAGS="-C target-feature=+simd128 $inline"
  else
    export CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUSTFLAGS="$inline"
  fi
}
