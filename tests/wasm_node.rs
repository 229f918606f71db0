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
    assert_eq!(
        qb::convert_spectral(10.0, "um".into(), "cm-1".into()).unwrap(),
        1000.0
    );
    assert_eq!(
        qb::convert_spectral(500.0, "nm".into(), "\u{b5}m".into()).unwrap(),
        0.5
    );
    // c exact: 1 µm ↔ 299.792458 THz; CODATA 2018 hc/e = 1.239 841 984…e-6 eV·m.
    assert!(
        rel(
            qb::convert_spectral(1.0, "um".into(), "THz".into()).unwrap(),
            299.792_458
        ) < 1e-15
    );
    assert!(
        rel(
            qb::convert_spectral(1.0, "eV".into(), "nm".into()).unwrap(),
            1_239.841_984_332_002_6
        ) < 1e-15
    );
    assert_eq!(
        qb::spectral_unit_kind("meV".into()).unwrap(),
        "photonEnergy"
    );
}

#[wasm_bindgen_test]
fn temperature_conversion_definitions() {
    assert_eq!(
        qb::convert_temperature(0.0, "degC".into(), "K".into()).unwrap(),
        273.15
    );
    assert!(
        rel(
            qb::convert_temperature(212.0, "degF".into(), "K".into()).unwrap(),
            373.15
        ) < 1e-15
    );
    assert_eq!(
        qb::convert_temperature_difference(9.0, "degF".into(), "K".into()).unwrap(),
        5.0
    );
}

#[wasm_bindgen_test]
fn errors_are_quantaband_errors_with_codes() {
    assert_eq!(
        code_of(qb::convert_spectral(1.0, "furlong".into(), "nm".into()).unwrap_err()),
        "UNKNOWN_UNIT"
    );
    assert_eq!(
        code_of(qb::convert_spectral(0.0, "nm".into(), "um".into()).unwrap_err()),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code_of(qb::convert_spectral(f64::NAN, "nm".into(), "um".into()).unwrap_err()),
        "NON_FINITE"
    );
    assert_eq!(
        code_of(qb::convert_temperature(-300.0, "degC".into(), "K".into()).unwrap_err()),
        "NON_POSITIVE_TEMPERATURE"
    );
    // still working afterwards
    assert_eq!(
        qb::convert_spectral(10.0, "um".into(), "cm-1".into()).unwrap(),
        1000.0
    );
}

#[wasm_bindgen_test]
fn bulk_errors_carry_the_index() {
    let err =
        qb::convert_spectral_array(&[1.0, 2.0, -1.0, 0.0], "um".into(), "nm".into()).unwrap_err();
    assert_eq!(index_of(&err), Some(2.0));
    let msg = String::from(err.dyn_ref::<js_sys::Error>().unwrap().message());
    assert!(msg.contains("index 2"), "{msg}");
    assert_eq!(code_of(err), "NON_POSITIVE_SPECTRAL");
    let ok = qb::convert_spectral_array(&[1.0, 2.0, 4.0], "um".into(), "cm-1".into()).unwrap();
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

/// A plain JS object from (key, value) pairs.
fn obj(pairs: &[(&str, JsValue)]) -> JsValue {
    let o = js_sys::Object::new();
    for (k, v) in pairs {
        Reflect::set(&o, &(*k).into(), v).unwrap();
    }
    o.into()
}

fn um() -> JsValue {
    obj(&[("unit", "um".into())])
}

#[wasm_bindgen_test]
fn spectrum_and_band_values() {
    // mpmath (tests/data/gen_core.py, 40 digits): L_λ(10 µm, 300 K) = 9.924 033 330 070 695e6
    // W·m⁻²·sr⁻¹·m⁻¹; 8–14 µm band radiance at 300 K = 54.933 461 376 839 69 W·m⁻²·sr⁻¹.
    let l = qb::spectral_density(um(), 10.0, 300.0).unwrap();
    assert!(rel(l, 9.924_033_330_070_695e6) < 1e-13);
    let b = qb::band_integral(um(), 8.0, 14.0, 300.0).unwrap();
    assert!(rel(b, 54.933_461_376_839_69) < 1e-12);
    // the same band given in cm⁻¹
    let cm = obj(&[("unit", "cm-1".into())]);
    let b2 = qb::band_integral(cm, 1e4 / 14.0, 1e4 / 8.0, 300.0).unwrap();
    assert!(rel(b2, 54.933_461_376_839_69) < 1e-12);
    // inverse back to 300 K
    let t = qb::brightness_temperature(um(), 10.0, 9.924_033_330_070_695e6).unwrap();
    assert!(rel(t, 300.0) < 1e-13);
}

#[wasm_bindgen_test]
fn bulk_spectrum_grid_is_row_major() {
    let xs = [1.0, 4.0, 10.0];
    let ts = [300.0, 1000.0];
    let g = qb::spectral_density_grid(um(), &xs, &ts).unwrap();
    assert_eq!(g.len(), 6);
    for (i, &t) in ts.iter().enumerate() {
        for (j, &x) in xs.iter().enumerate() {
            assert_eq!(
                g[i * xs.len() + j],
                qb::spectral_density(um(), x, t).unwrap()
            );
        }
    }
    let err = qb::spectral_density_array(um(), &[1.0, -2.0], 300.0).unwrap_err();
    assert_eq!(index_of(&err), Some(1.0));
    assert_eq!(code_of(err), "NON_POSITIVE_SPECTRAL");
    let big: Vec<f64> = (0..100_000).map(|i| 0.5 + f64::from(i) * 1e-4).collect();
    assert_eq!(
        qb::spectral_density_array(um(), &big, 1500.0)
            .unwrap()
            .len(),
        big.len()
    );
}

#[wasm_bindgen_test]
fn option_errors() {
    let bad = obj(&[("unit", "um".into()), ("emisivity", 0.5.into())]);
    assert_eq!(
        code_of(qb::spectral_density(bad, 10.0, 300.0).unwrap_err()),
        "UNSUPPORTED"
    );
    let bad = obj(&[("unit", "parsec".into())]);
    assert_eq!(
        code_of(qb::spectral_density(bad, 10.0, 300.0).unwrap_err()),
        "UNKNOWN_UNIT"
    );
    let bad = obj(&[("unit", "um".into()), ("emissivity", 1.5.into())]);
    assert_eq!(
        code_of(qb::spectral_density(bad, 10.0, 300.0).unwrap_err()),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code_of(qb::band_integral(um(), 14.0, 8.0, 300.0).unwrap_err()),
        "INVALID_BAND"
    );
    assert_eq!(
        code_of(qb::spectral_density(JsValue::NULL, 10.0, 300.0).unwrap_err()),
        "UNSUPPORTED"
    );
    // still working
    assert!(qb::spectral_density(um(), 10.0, 300.0).is_ok());
}

#[wasm_bindgen_test]
fn statistics() {
    // mpmath (tests/data/stats_reference.json): ζ(3/2) = 2.612 375 348 685 488 3
    let g = qb::bose_einstein_integral(1.5, 1.0).unwrap();
    assert!(rel(g, 2.612_375_348_685_488) < 1e-15);
    assert_eq!(
        code_of(qb::bose_einstein(0.0).unwrap_err()),
        "DIVERGENT_OCCUPATION"
    );
    assert_eq!(
        code_of(qb::fermi_dirac_integral(1.0, 0.0).unwrap_err()),
        "UNSUPPORTED"
    );
    let fd = qb::fermi_dirac_array(&[-1.0, 0.0, 1.0]).unwrap();
    assert!((fd[0] + fd[2] - 1.0).abs() < 1e-15 && fd[1] == 0.5);
}

#[wasm_bindgen_test]
fn thermometry_measurement_and_frame() {
    let curve = obj(&[
        ("kind", "sakumaHattori".into()),
        ("aM", 1e-5.into()),
        ("bMK", 1.8e-4.into()),
        ("c", 1e6.into()),
    ]);
    let cond = obj(&[
        ("emissivity", 0.9.into()),
        ("reflectedTemperatureK", 295.0.into()),
    ]);
    let s = qb::measured_signal(curve.clone(), 400.0, cond.clone()).unwrap();
    let t = qb::object_temperature(curve.clone(), s, cond.clone()).unwrap();
    assert!((t - 400.0).abs() < 1e-9);
    let ts = qb::object_temperature_array(curve.clone(), &[s, s, 1.0], cond.clone()).unwrap_err();
    assert_eq!(index_of(&ts), Some(2.0));
    assert_eq!(code_of(ts), "NO_PHYSICAL_SOLUTION");
    // a 4-pixel frame of Uint16 counts
    let raw = js_sys::Uint16Array::from(&[20_000u16, 30_000, 0, 40_000][..]);
    let opts = obj(&[("conditions", cond.clone()), ("output", "float64".into())]);
    let r = qb::convert_frame(curve.clone(), raw.into(), opts).unwrap();
    let get = |k: &str| Reflect::get(&r, &k.into()).unwrap();
    assert_eq!(get("invalid").as_f64(), Some(1.0));
    let temps: js_sys::Float64Array = get("temperaturesK").dyn_into().unwrap();
    let exact = qb::object_temperature(curve.clone(), 30_000.0, cond.clone()).unwrap();
    assert!((temps.get_index(1) - exact).abs() < 1e-6);
    assert!(temps.get_index(2).is_nan());
    let not_frame = qb::convert_frame(curve, js_sys::Array::new().into(), JsValue::UNDEFINED);
    assert_eq!(code_of(not_frame.unwrap_err()), "UNSUPPORTED");
}

/// The JavaScript message templates (src/wasm/error.js) reproduce the core's `Display` text for
/// every variant (numbers chosen so that Rust's and JavaScript's number formatting agree).
#[wasm_bindgen_test]
fn js_messages_match_the_core_display() {
    use quantaband::Error;
    let all = [
        Error::NonFinite {
            arg: "a",
            value: 2.5,
        },
        Error::NonPositiveTemperature {
            arg: "t",
            value: -3.0,
        },
        Error::NonPositiveSpectral {
            arg: "x",
            value: 0.0,
        },
        Error::NonPositive {
            arg: "s",
            value: -0.5,
        },
        Error::OutOfRange {
            arg: "e",
            value: 1.5,
            range: "(0, 1]",
        },
        Error::InvalidBand {
            lower: 14.0,
            upper: 8.0,
        },
        Error::NoSolution { what: "w" },
        Error::NoPhysicalSolution {
            signal: 1.25,
            background: 2.0,
        },
        Error::DivergentOccupation { x: -1.0 },
        Error::LengthMismatch {
            expected: 3,
            got: 2,
        },
        Error::TooFewPoints { needed: 3, got: 1 },
        Error::NotIncreasing { arg: "w", index: 4 },
        Error::DegenerateFit { reason: "r" },
        Error::NotConverged { what: "n" },
        Error::UnknownUnit { expected: "u" },
        Error::Unsupported { what: "x" },
    ];
    assert_eq!(all.len(), Error::ALL_CODES.len());
    for e in all {
        let js = JsValue::from(e);
        let msg = String::from(js.dyn_ref::<js_sys::Error>().unwrap().message());
        assert_eq!(msg, e.to_string(), "{e:?}");
        assert_eq!(code_of(js), e.code());
    }
}
