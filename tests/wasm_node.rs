//! wasm-bindgen-test suite run in Node: the bindings as Rust sees them, including the thrown
//! `QuantabandError` values and the bulk functions.
//!
//! Run: `CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUNNER=wasm-bindgen-test-runner cargo test
//! --target wasm32-unknown-unknown --features wasm --test wasm_node`.
//!
//! Reference values: definitions (BIPM SI Brochure 9th ed. 2019; NIST SP 811 (2008) App. B;
//! CODATA 2018 exact h, c, e) and the shared mpmath tables in `tests/data/` (see each check).
#![cfg(target_arch = "wasm32")]

use js_sys::Reflect;
use wasm_bindgen::{JsCast, JsValue};
use wasm_bindgen_test::*;

use quantaband::wasm as qb;

/// The `code` of a thrown QuantabandError, checking its class-independent shape on the way.
fn code_of(err: JsValue) -> String {
    let e: &js_sys::Error = err.dyn_ref().expect("thrown value is an Error");
    assert_eq!(String::from(e.name()), "QuantabandError");
    let msg = String::from(e.message());
    assert!(!msg.is_empty());
    Reflect::get(&err, &"code".into())
        .unwrap()
        .as_string()
        .expect("code is a string")
}

fn index_of(err: &JsValue) -> Option<f64> {
    Reflect::get(err, &"index".into()).unwrap().as_f64()
}

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[wasm_bindgen_test]
fn spectral_conversion_definitions() {
    assert_eq!(qb::convert_spectral(10.0, "um", "cm-1").unwrap(), 1000.0);
    assert_eq!(qb::convert_spectral(500.0, "nm", "\u{b5}m").unwrap(), 0.5);
    // c exact: 1 µm ↔ 299.792458 THz; CODATA 2018 hc/e = 1.239 841 984…e-6 eV·m.
    assert!(rel(qb::convert_spectral(1.0, "um", "THz").unwrap(), 299.792_458) < 1e-15);
    assert!(
        rel(
            qb::convert_spectral(1.0, "eV", "nm").unwrap(),
            1239.841_984_332_002_6
        ) < 1e-15
    );
    assert_eq!(qb::spectral_unit_kind("meV").unwrap(), "photonEnergy");
}

#[wasm_bindgen_test]
fn temperature_conversion_definitions() {
    assert_eq!(qb::convert_temperature(0.0, "degC", "K").unwrap(), 273.15);
    assert!(rel(qb::convert_temperature(212.0, "degF", "K").unwrap(), 373.15) < 1e-15);
    assert_eq!(
        qb::convert_temperature_difference(9.0, "degF", "K").unwrap(),
        5.0
    );
}

#[wasm_bindgen_test]
fn errors_are_quantaband_errors_with_codes() {
    assert_eq!(
        code_of(qb::convert_spectral(1.0, "furlong", "nm").unwrap_err()),
        "UNKNOWN_UNIT"
    );
    assert_eq!(
        code_of(qb::convert_spectral(0.0, "nm", "um").unwrap_err()),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code_of(qb::convert_spectral(f64::NAN, "nm", "um").unwrap_err()),
        "NON_FINITE"
    );
    assert_eq!(
        code_of(qb::convert_temperature(-300.0, "degC", "K").unwrap_err()),
        "NON_POSITIVE_TEMPERATURE"
    );
    // still working afterwards
    assert_eq!(qb::convert_spectral(10.0, "um", "cm-1").unwrap(), 1000.0);
}

#[wasm_bindgen_test]
fn bulk_errors_carry_the_index() {
    let err = qb::convert_spectral_array(&[1.0, 2.0, -1.0, 0.0], "um", "nm").unwrap_err();
    assert_eq!(index_of(&err), Some(2.0));
    let msg = String::from(err.dyn_ref::<js_sys::Error>().unwrap().message());
    assert!(msg.contains("index 2"), "{msg}");
    assert_eq!(code_of(err), "NON_POSITIVE_SPECTRAL");
    let ok = qb::convert_spectral_array(&[1.0, 2.0, 4.0], "um", "cm-1").unwrap();
    assert_eq!(ok, vec![10_000.0, 5_000.0, 2_500.0]);
}

#[wasm_bindgen_test]
fn constants_object() {
    let c = qb::constants();
    let get = |k: &str| Reflect::get(&c, &k.into()).unwrap().as_f64().unwrap();
    assert_eq!(get("planckH"), 6.626_070_15e-34); // exact (SI 2019)
    assert_eq!(get("c2Its90"), 0.014_388); // ITS-90
    assert!(rel(get("stefanBoltzmannSigma"), 5.670_374_419e-8) < 1e-9); // CODATA 2018 table
}
