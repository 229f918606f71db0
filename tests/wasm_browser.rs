//! wasm-bindgen-test suite run in a headless browser (Chromium through chromedriver): the same
//! checks as `tests/wasm_node.rs` (included below), plus browser-only ones.
//!
//! Run: `CHROMEDRIVER=/usr/bin/chromedriver
//! CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUNNER=wasm-bindgen-test-runner cargo test
//! --target wasm32-unknown-unknown --features wasm --test wasm_browser`.
#![cfg(target_arch = "wasm32")]

use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

/// Every check of the Node suite, run again in the browser.
#[path = "wasm_node.rs"]
mod node_suite;

#[wasm_bindgen_test]
fn runs_in_a_window() {
    // The browser runner gives the module a `window`; Node has none.
    let global = js_sys::global();
    let window = js_sys::Reflect::get(&global, &"window".into()).unwrap();
    assert!(window.is_object());
    assert_eq!(
        quantaband::wasm::units::convert_unit(0, 1.0, "THz", "GHz"),
        1000.0
    );
}
