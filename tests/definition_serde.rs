//! Instrument and spectrum definitions stored and loaded as JSON (serde feature): round trips,
//! accepted unit spellings, strictness (unknown keys, wrong types, keys of another model kind),
//! and the loaded definition computing a reference value.
//!
//! Run by the test command's `cargo test --features serde`.
#![cfg(feature = "serde")]

use quantaband::definition::{
    InstrumentDefinition, InstrumentModel, MeasurementConditions, ResponseTable, SpectrumSettings,
    WindowDefinition,
};
use quantaband::planck::{Quantity, Spectrum};
use quantaband::thermometry::{
    uncertainty_budget, Conditions, FitReport, SakumaHattori, SignalModel, StandardUncertainties,
};
use quantaband::units::SpectralUnit;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn instrument_definition_round_trips_through_json() {
    let def = InstrumentDefinition {
        model: InstrumentModel::Response(ResponseTable {
            wavelengths: vec![8.0, 10.0, 14.0],
            values: vec![1.0, 0.75, 0.5],
            unit: SpectralUnit::Micrometre,
            c2: Default::default(),
        }),
        conditions: MeasurementConditions {
            emissivity: Some(0.95),
            reflected_temperature_k: Some(293.15),
            path_transmittance: None,
            path_temperature_k: None,
            window: Some(WindowDefinition {
                transmittance: 0.9,
                reflectance: Some(0.05),
                temperature_k: 300.0,
                reflected_temperature_k: Some(290.0),
            }),
        },
    };
    let json = serde_json::to_string(&def).unwrap();
    assert!(json.contains(r#""kind":"response""#), "{json}");
    assert!(json.contains(r#""unit":"um""#), "{json}");
    assert!(json.contains(r#""reflectedTemperatureK":293.15"#), "{json}");
    assert!(
        !json.contains("pathTemperatureK"),
        "left-out fields stay out: {json}"
    );
    let back: InstrumentDefinition = serde_json::from_str(&json).unwrap();
    assert_eq!(back, def);
    // and through serde_json::Value (a self-describing intermediate, as the wasm layer uses)
    let v = serde_json::to_value(&def).unwrap();
    assert_eq!(
        serde_json::from_value::<InstrumentDefinition>(v).unwrap(),
        def
    );
}

#[test]
fn loaded_definition_computes_the_reference_band_radiance() {
    // A flat 8–14 µm response is the band radiance: ∫ L_λ dλ over 8–14 µm at 300 K =
    // 54.933 461 376 839 69 W·m⁻²·sr⁻¹ (mpmath quad, tests/data/gen_core.py, core_reference.json).
    let json = r#"{ "model": { "kind": "response", "wavelengths": [8, 14], "values": [1, 1],
                               "unit": "µm" } }"#;
    let def: InstrumentDefinition = serde_json::from_str(json).unwrap();
    let m = def.model.prepare().unwrap();
    assert!(rel(m.signal(300.0).unwrap(), 54.933_461_376_839_69) < 1e-9);
    assert_eq!(def.conditions.conditions().unwrap(), Conditions::BLACKBODY);
    // the alias is read, the canonical name written
    assert!(serde_json::to_string(&def)
        .unwrap()
        .contains(r#""unit":"um""#));
}

#[test]
fn every_model_kind_round_trips() {
    for json in [
        r#"{"kind":"spectralPoint","wavelength":0.65,"unit":"um","c2":"its90"}"#,
        r#"{"kind":"sakumaHattori","aM":3.9e-6,"bMK":2e-8,"c":50000.0,"c2":"codata2018"}"#,
        r#"{"kind":"response","wavelengths":[1.0,2.0],"values":[1.0,1.0],"unit":"nm","c2":"codata2018"}"#,
    ] {
        let m: InstrumentModel = serde_json::from_str(json).unwrap();
        m.prepare().unwrap();
        let again = serde_json::to_string(&m).unwrap();
        assert_eq!(serde_json::from_str::<InstrumentModel>(&again).unwrap(), m);
    }
}

#[test]
fn definitions_are_strict() {
    let err = |json: &str| {
        serde_json::from_str::<InstrumentDefinition>(json)
            .unwrap_err()
            .to_string()
    };
    // unknown key, with the accepted keys
    let e = err(r#"{"model":{"kind":"spectralPoint","wavelength":1,"unit":"um","colour":1}}"#);
    assert!(
        e.contains("unknown field `colour`") && e.contains("wavelength"),
        "{e}"
    );
    // a key of another kind
    let e = err(r#"{"model":{"kind":"spectralPoint","wavelength":1,"unit":"um","aM":1}}"#);
    assert!(e.contains("unknown field `aM`"), "{e}");
    // wrong type
    let e = err(r#"{"model":{"kind":"spectralPoint","wavelength":"1","unit":"um"}}"#);
    assert!(e.contains("invalid type: string"), "{e}");
    // missing field, unknown kind, unknown unit
    assert!(err(r#"{"model":{"kind":"spectralPoint","unit":"um"}}"#)
        .contains("missing field `wavelength`"));
    assert!(err(r#"{"model":{"kind":"lens"}}"#).contains("unknown variant `lens`"));
    assert!(
        err(r#"{"model":{"kind":"spectralPoint","wavelength":1,"unit":"furlong"}}"#)
            .contains("furlong")
    );
    // misspelt conditions key
    let e = err(
        r#"{"model":{"kind":"spectralPoint","wavelength":1,"unit":"um"},"conditions":{"emisivity":0.9}}"#,
    );
    assert!(
        e.contains("unknown field `emisivity`") && e.contains("emissivity"),
        "{e}"
    );
    // an invalid curve is refused by its constructor
    assert!(serde_json::from_str::<SakumaHattori>(r#"{"aM":-1,"bMK":0,"c":1}"#).is_err());
}

#[test]
fn spectrum_settings_and_core_types_serialize_with_camel_case_names() {
    let s: SpectrumSettings =
        serde_json::from_str(r#"{"unit":"cm⁻¹","quantity":"photon","refractiveIndex":1.5}"#)
            .unwrap();
    assert_eq!(s.unit, SpectralUnit::PerCentimetre);
    assert_eq!(s.quantity, Quantity::Photon);
    assert_eq!(s.spectrum().unwrap().refractive_index, 1.5);
    assert_eq!(s.density_factor().unwrap(), 100.0);
    let j = serde_json::to_string(&Spectrum::default()).unwrap();
    assert_eq!(
        j,
        r#"{"variable":"wavelength","quantity":"energy","geometry":"radiance","emissivity":1.0,"refractiveIndex":1.0,"c2":"codata2018"}"#
    );
    let curve = SakumaHattori::new(3.9e-6, 2e-8, 5e4, Default::default()).unwrap();
    let t = [400.0, 600.0, 900.0, 1200.0];
    let sig = t.map(|t| curve.signal(t).unwrap());
    let fit = SakumaHattori::fit(&t, &sig, Default::default(), None).unwrap();
    let back: FitReport = serde_json::from_str(&serde_json::to_string(&fit).unwrap()).unwrap();
    assert_eq!(back, fit);
    let m = quantaband::thermometry::SpectralPoint::new(10e-6, Default::default()).unwrap();
    let c = Conditions {
        emissivity: 0.95,
        ..Conditions::BLACKBODY
    };
    let u: StandardUncertainties = serde_json::from_str(r#"{"emissivity":0.01}"#).unwrap();
    let b = uncertainty_budget(&m, 8.0e6, &c, &u).unwrap();
    let j = serde_json::to_string(&b).unwrap();
    assert!(
        j.contains(r#""input":"emissivity""#) && j.contains("combinedStandardUncertaintyK"),
        "{j}"
    );
}
