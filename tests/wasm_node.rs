//! wasm-bindgen-test suite run in Node: the WebAssembly exports as the facade uses them (errors
//! out of band, configuration read through the core's serde types, bulk calls on the scratch
//! buffers, live-object counting), and the facade's message templates against the core's
//! `Display`.
//!
//! Run: `CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUNNER=wasm-bindgen-test-runner cargo test
//! --target wasm32-unknown-unknown --features wasm --test wasm_node`.
//!
//! Reference values: definitions (BIPM SI Brochure 9th ed. 2019; NIST SP 811 (2008) App. B;
//! CODATA 2018 exact h, c, e) and the shared mpmath tables in `tests/data/` (see each check).
#![cfg(target_arch = "wasm32")]

use js_sys::{Float64Array, Object, Reflect};
use wasm_bindgen::prelude::*;
use wasm_bindgen::JsCast;
use wasm_bindgen_test::*;

use quantaband::wasm::{calibration, error, instrument, scratch, spectrum, stats, testing, units};
use quantaband::Error;

#[wasm_bindgen(module = "/src/wasm/js/errors.js")]
extern "C" {
    /// The facade's builder of a QuantabandError from the stored error's data.
    #[wasm_bindgen(js_name = fromPending)]
    fn from_pending(p: JsValue) -> JsValue;
    #[wasm_bindgen(js_name = ERROR_CODES)]
    static ERROR_CODES: JsValue;
}

fn get(o: &JsValue, k: &str) -> JsValue {
    Reflect::get(o, &k.into()).unwrap()
}

/// The stored error (after a sentinel result): its code and the facade's message.
fn taken() -> (String, String) {
    let e = from_pending(error::take_error());
    (
        get(&e, "code").as_string().unwrap(),
        get(&e, "message").as_string().unwrap(),
    )
}

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

/// A plain object from (key, value) pairs.
fn obj(pairs: &[(&str, JsValue)]) -> JsValue {
    let o = Object::new();
    for (k, v) in pairs {
        Reflect::set(&o, &(*k).into(), v).unwrap();
    }
    o.into()
}

/// A view of `n` f64 at byte address `p` of the module's memory.
fn view(p: u32, n: u32) -> Float64Array {
    let mem: js_sys::WebAssembly::Memory = wasm_bindgen::memory().unchecked_into();
    Float64Array::new_with_byte_offset_and_length(&mem.buffer(), p, n)
}

#[wasm_bindgen_test]
fn conversions_are_definitions() {
    assert_eq!(units::convert_unit(0, 10.0, "um", "cm-1"), 1000.0);
    // c exact: 1 µm ↔ 299.792458 THz; CODATA 2018 hc/e = 1.239 841 984…e-6 eV·m.
    assert!(rel(units::convert_unit(0, 1.0, "um", "THz"), 299.792_458) < 1e-15);
    assert!(
        rel(
            units::convert_unit(0, 1.0, "eV", "nm"),
            1_239.841_984_332_002_6
        ) < 1e-15
    );
    assert_eq!(units::convert_unit(1, 0.0, "degC", "K"), 273.15);
    assert_eq!(units::convert_unit(2, 9.0, "degF", "K"), 5.0);
    assert_eq!(
        units::spectral_unit_kind("meV").as_deref(),
        Some("photonEnergy")
    );
}

#[wasm_bindgen_test]
fn errors_come_out_of_band() {
    assert!(units::convert_unit(0, 0.0, "nm", "um").is_nan());
    assert_eq!(taken().0, "NON_POSITIVE_SPECTRAL");
    // taken once: the slot is empty afterwards
    assert!(error::take_error().is_undefined());
    assert!(units::convert_unit(0, 1.0, "furlong", "nm").is_nan());
    assert_eq!(taken().0, "UNKNOWN_UNIT");
    assert!(stats::bose_einstein(-0.5).is_nan());
    let (code, msg) = taken();
    assert_eq!(code, "DIVERGENT_OCCUPATION");
    assert_eq!(
        msg,
        quantaband::stats::bose_einstein(-0.5)
            .unwrap_err()
            .to_string()
    );
    // and the module works on
    assert_eq!(units::convert_unit(0, 10.0, "um", "cm-1"), 1000.0);
    // the core's codes come first in the facade's one list
    let codes: Vec<String> = js_sys::Array::from(&ERROR_CODES)
        .iter()
        .map(|c| c.as_string().unwrap())
        .collect();
    assert_eq!(&codes[..Error::ALL_CODES.len()], Error::ALL_CODES);
    assert_eq!(error::core_codes(), Error::ALL_CODES.join(","));
}

#[wasm_bindgen_test]
fn spectrum_read_through_serde_and_evaluated() {
    let s = spectrum::SpectrumHandle::create(obj(&[("unit", "um".into())])).unwrap();
    // L_λ(10 µm, 300 K) = 9.924 033 330 070 695e6 W·m⁻²·sr⁻¹·m⁻¹ (mpmath, tests/data/gen_core.py),
    // per µm ×1e-6.
    assert!(rel(s.point(10.0, 300.0), 9.924_033_330_070_695) < 1e-14);
    // 8–14 µm band at 300 K: 54.933 461 376 839 69 W·m⁻²·sr⁻¹ (mpmath quad, core_reference.json)
    assert!(rel(s.band(8.0, 14.0, 300.0), 54.933_461_376_839_69) < 1e-13);
    assert!(rel(s.brightness_temperature(10.0, 9.924_033_330_070_695), 300.0) < 1e-13);
    assert_eq!(
        get(&s.units_js(), "density").as_string().unwrap(),
        "W m^-2 sr^-1 um^-1"
    );
    assert!(s.point(10.0, -1.0).is_nan());
    assert_eq!(
        taken(),
        (
            "NON_POSITIVE_TEMPERATURE".into(),
            "temperatureK must be > 0 K (got -1 K)".into()
        )
    );
    // unknown and mistyped fields
    assert!(spectrum::SpectrumHandle::create(obj(&[
        ("unit", "um".into()),
        ("emisivity", 0.5.into())
    ]))
    .is_none());
    let (code, msg) = taken();
    assert_eq!(code, "UNSUPPORTED");
    assert!(
        msg.starts_with("settings: unknown field \"emisivity\""),
        "{msg}"
    );
    assert!(spectrum::SpectrumHandle::create(obj(&[
        ("unit", "um".into()),
        ("emissivity", "0.5".into())
    ]))
    .is_none());
    assert_eq!(
        taken(),
        (
            "WRONG_TYPE".into(),
            "settings.emissivity must be a number (got a string)".into()
        )
    );
}

#[wasm_bindgen_test]
fn bulk_calls_work_on_the_scratch_buffers() {
    let s = spectrum::SpectrumHandle::create(obj(&[("unit", "um".into())])).unwrap();
    let xs = [8.0, 10.0, 12.0, 14.0];
    let p = scratch::scratch(0, 0, xs.len() as u32);
    assert_ne!(p, 0);
    view(p, 4).copy_from(&xs);
    assert_eq!(s.bulk(0, 300.0, 0.0), 0.0);
    let out = view(p, 4).to_vec();
    for (x, y) in xs.iter().zip(&out) {
        assert_eq!(*y, s.point(*x, 300.0));
    }
    // an error stops the loop and carries the index
    let p = scratch::scratch(0, 0, 3);
    view(p, 3).copy_from(&[10.0, 10.0, -1.0]);
    assert!(s.bulk(0, 300.0, 0.0).is_nan());
    let e = from_pending(error::take_error());
    assert_eq!(get(&e, "index").as_f64(), Some(2.0));
    // a buffer the memory cannot hold is refused (0), not an abort
    assert_eq!(scratch::scratch(0, 1, u32::MAX), 0);
    assert_eq!(s.point(10.0, 300.0), out[1]);
}

#[wasm_bindgen_test]
fn instrument_calibration_and_frame() {
    let curve = obj(&[
        ("kind", "sakumaHattori".into()),
        ("aM", 1.0e-5.into()),
        ("bMK", 1.8e-4.into()),
        ("c", 1.0e6.into()),
    ]);
    let cond = obj(&[
        ("emissivity", 0.95.into()),
        ("reflectedTemperatureK", 295.0.into()),
    ]);
    let inst = instrument::InstrumentHandle::create(obj(&[
        ("model", curve),
        ("conditions", cond.clone()),
    ]))
    .unwrap();
    let s = inst.measured_signal(400.0);
    assert!(rel(inst.object_temperature(s), 400.0) < 1e-12);
    // the budget's inputs as the facade encodes them ([u, ν, evaluation, distribution,
    // shorthand] per input); the result in f64 scratch 0 ([T, u_c, ν_eff, k, …])
    let mut inputs = [0.0; 45];
    for i in 0..9 {
        inputs[5 * i..5 * i + 5].copy_from_slice(&[0.0, f64::INFINITY, -1.0, -1.0, 1.0]);
    }
    inputs[5] = 0.01; // emissivity
    let n = inst.uncertainty_budget(s, &inputs, &[], None, None);
    assert_eq!(n, 10.0 + 8.0 * 5.0); // five rows without a window
    let out = view(scratch::scratch(0, 0, n as u32), n as u32).to_vec();
    assert!(rel(out[0], 400.0) < 1e-12);
    assert!(out[1] > 0.0 && out[2] == f64::INFINITY && out[4] == 0.95);
    // a negative uncertainty: NaN and OUT_OF_RANGE naming the JavaScript field
    inputs[5] = -0.01;
    assert!(inst
        .uncertainty_budget(s, &inputs, &[], None, None)
        .is_nan());
    let (code, message) = taken();
    assert_eq!(code, "OUT_OF_RANGE");
    assert_eq!(
        message,
        "uncertainties.emissivity must lie in [0, inf) (got -0.01)"
    );
    let cal = calibration::CalibrationHandle::create(obj(&[
        ("aM", 1.0e-5.into()),
        ("bMK", 1.8e-4.into()),
        ("c", 1.0e6.into()),
    ]))
    .unwrap();
    // a frame of f64 signals in f64 scratch 0, converted into f64 scratch 1
    let pin = scratch::scratch(0, 0, 3);
    view(pin, 3).copy_from(&[s, s, 1.0]);
    let pout = scratch::scratch(0, 1, 3);
    let r = cal
        .convert_frame(0, true, false, obj(&[("conditions", cond)]))
        .unwrap();
    assert_eq!(get(&r, "valid").as_f64(), Some(2.0));
    let t = view(pout, 3).to_vec();
    assert!((t[0] - 400.0).abs() < 1e-6, "{t:?}");
    assert!(t[2].is_nan());
    // live objects are counted and released on drop
    let before = testing::live_objects();
    drop(cal);
    assert_eq!(testing::live_objects(), before - 1);
}

/// The facade's message templates (src/wasm/js/errors.js) reproduce the core's `Display` text
/// for every variant (numbers chosen so that Rust's and JavaScript's formatting agree; argument
/// names that the facade keeps as they are).
#[wasm_bindgen_test]
fn js_messages_match_the_core_display() {
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
        Error::TooLarge {
            arg: "xs",
            limit: 10,
            got: 11,
        },
        Error::InvalidCorrelation {
            reason: "not symmetric",
            row: 1,
            column: 2,
            value: 0.25,
        },
        Error::InvalidTableEntry {
            arg: "emissivity.values",
            index: 3,
            value: 1.5,
            range: "[0, 1]",
        },
        Error::OutsideTable {
            arg: "emissivity",
            wavelength_m: 0.5,
            first_m: 0.25,
            last_m: 0.375,
        },
        Error::InvalidLine {
            line: 7,
            reason: "expected two numbers",
        },
    ];
    assert_eq!(all.len(), Error::ALL_CODES.len());
    for e in all {
        let js = from_pending(error::pending_of(e, None));
        assert_eq!(
            get(&js, "message").as_string().unwrap(),
            e.to_string(),
            "{e:?}"
        );
        assert_eq!(get(&js, "code").as_string().unwrap(), e.code());
    }
}
