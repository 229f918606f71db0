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
  # LLVM's inliner threshold 50 (225 at opt-level 3): the export shims no longer carry inlined
  # copies of the configuration readers; 42 KB smaller, no slower on the bench's hot cases
  # (DEVELOPERS.md, size notes).
  local inline="-C llvm-args=-inline-threshold=50"
  if [ "$1" = 1 ]; then
    export CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUSTFLAGS="-C target-feature=+simd128 $inline"
  else
    export CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUSTFLAGS="$inline"
  fi
}
