//! A design as data (`quantaband::design::definition`): the checking step (units, ordering,
//! pairing of scene and conversion, the D* shape rules), identities with the SI functions it
//! wraps, the mpmath detector rows of `tests/data/design_reference.json` through the whole
//! definition, and (feature `serde`) the JSON shapes of the hand-written deserializers.
#![cfg(not(target_arch = "wasm32"))]

use quantaband::definition::InstrumentModel;
use quantaband::design::definition::{
    DesignDefinition, PreparedDesign, PreparedScene, SceneDefinition,
};
use quantaband::design::merit::{netd_from_d_star_optics, noise_bandwidth_hz};
use quantaband::design::{
    Band, ConeForm, Conversion, DStarShape, Detector, InBand, Optics, RadianceKind,
};
use quantaband::planck::Quantity;
use quantaband::units::SpectralUnit;
use quantaband::Error;
use serde_json::Value;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn code<T: core::fmt::Debug>(r: Result<T, Error>) -> &'static str {
    r.expect_err("an error").code()
}

const QE: Conversion = Conversion::QuantumEfficiency { efficiency: 0.7 };
const RESP: Conversion = Conversion::Responsivity {
    amperes_per_watt: 2.0,
};

fn detector(conversion: Conversion) -> Detector {
    Detector {
        pixel_area_m2: 2.25e-10,
        conversion,
        integration_time_s: 1e-3,
        full_well_electrons: 1.1e7,
        dark_current_a: 1e-12,
        read_noise_electrons: 200.0,
    }
}

fn band(lower: f64, upper: f64, unit: SpectralUnit) -> SceneDefinition {
    SceneDefinition::Band {
        lower,
        upper,
        unit,
        emissivity: 1.0,
        c2: Default::default(),
    }
}

fn design(conversion: Conversion, scene: SceneDefinition) -> DesignDefinition {
    DesignDefinition {
        optics: Optics::new(2.0, 0.9),
        detector: detector(conversion),
        scene,
        background_electrons_per_s: 0.0,
    }
}

fn band_of(p: &PreparedDesign) -> Band {
    match &p.scene {
        PreparedScene::Band(b) => *b,
        PreparedScene::Model(..) => panic!("not a band"),
    }
}

/// The band's quantity follows the conversion; limits in any unit become ordered metres.
#[test]
fn band_scene_units_and_quantity() {
    let q = design(QE, band(3.7, 4.8, SpectralUnit::Micrometre))
        .prepare()
        .unwrap();
    assert_eq!(band_of(&q).spectrum.quantity, Quantity::Photon);
    assert_eq!(q.scene.kind(), RadianceKind::Photon);
    let e = design(RESP, band(3.7, 4.8, SpectralUnit::Micrometre))
        .prepare()
        .unwrap();
    assert_eq!(band_of(&e).spectrum.quantity, Quantity::Energy);
    // 2000–2700 cm⁻¹ = 1/270000 … 1/200000 m, ordered (by hand: λ = 1/ν̃).
    let w = design(QE, band(2000.0, 2700.0, SpectralUnit::PerCentimetre))
        .prepare()
        .unwrap();
    let b = band_of(&w);
    assert!(rel(b.lower, 1.0 / 270_000.0) < 2.3e-16 && b.upper == 5e-6);
    // 0.25–0.5 eV: λ = hc/E (CODATA exact h, c, e): 2.479 683 968 664 … 4.959 367 937 328 µm.
    let ev = design(QE, band(0.25, 0.5, SpectralUnit::Electronvolt))
        .prepare()
        .unwrap();
    let hc_over_e = 6.626_070_15e-34 * 299_792_458.0 / 1.602_176_634e-19;
    let b = band_of(&ev);
    assert!(rel(b.lower, hc_over_e / 0.5) < 5e-16 && rel(b.upper, hc_over_e / 0.25) < 5e-16);
    // The same scene typed in µm and in m gives the same pixel within the unit rounding.
    let m = design(QE, band(3.7e-6, 4.8e-6, SpectralUnit::Metre))
        .prepare()
        .unwrap();
    let (a, c) = (q.evaluate(300.0).unwrap(), m.evaluate(300.0).unwrap());
    assert!(rel(a.netd_k, c.netd_k) < 1e-14);
}

/// Errors of the checking step.
#[test]
fn checking_step_errors() {
    let bad = |c: Conversion, s: SceneDefinition| design(c, s).prepare();
    let um = SpectralUnit::Micrometre;
    assert_eq!(
        code(bad(Conversion::Included, band(3.0, 5.0, um))),
        "UNSUPPORTED"
    );
    assert_eq!(code(bad(QE, band(5.0, 3.0, um))), "INVALID_BAND");
    assert_eq!(code(bad(QE, band(0.0, 3.0, um))), "NON_POSITIVE_SPECTRAL");
    assert_eq!(code(bad(QE, band(f64::NAN, 3.0, um))), "NON_FINITE");
    // a limit whose metres underflow to 0
    assert_eq!(
        code(bad(QE, band(1e-320, 1.0, SpectralUnit::Nanometre))),
        "OUT_OF_RANGE"
    );
    let grey = SceneDefinition::Band {
        lower: 3.0,
        upper: 5.0,
        unit: um,
        emissivity: 1.5,
        c2: Default::default(),
    };
    assert_eq!(code(bad(QE, grey)), "OUT_OF_RANGE");
    let mut d = design(QE, band(3.0, 5.0, um));
    d.background_electrons_per_s = -1.0;
    assert_eq!(code(d.prepare()), "OUT_OF_RANGE");
    let mut d = design(QE, band(3.0, 5.0, um));
    d.optics.f_number = 0.0;
    assert_eq!(code(d.prepare()), "NON_POSITIVE");
    let mut d = design(QE, band(3.0, 5.0, um));
    d.detector.integration_time_s = 0.0;
    assert_eq!(code(d.prepare()), "NON_POSITIVE");
    // a model whose kind the conversion cannot turn into electrons
    let table = InstrumentModel::SpectralPoint {
        wavelength: 4.0,
        unit: um,
        c2: Default::default(),
    };
    let energy_model = SceneDefinition::Model {
        model: table.clone(),
        radiance_kind: RadianceKind::Energy,
    };
    assert_eq!(code(bad(QE, energy_model)), "UNSUPPORTED");
    let current_model = SceneDefinition::Model {
        model: table,
        radiance_kind: RadianceKind::Current,
    };
    assert!(bad(Conversion::Included, current_model).is_ok());
    // evaluation errors
    let p = design(QE, band(3.0, 5.0, um)).prepare().unwrap();
    assert_eq!(code(p.evaluate(0.0)), "NON_POSITIVE_TEMPERATURE");
    assert_eq!(code(p.evaluate(f64::INFINITY)), "NON_FINITE");
    assert_eq!(code(p.netd_from_d_star(-1.0, 300.0, None)), "NON_POSITIVE");
    assert_eq!(code(p.d_star_from_netd(0.0, 300.0, None)), "NON_POSITIVE");
    assert_eq!(
        code(p.netd_from_d_star(1e9, 300.0, Some(0.0))),
        "NON_POSITIVE_SPECTRAL"
    );
}

/// The D* shape follows the scene: flat for energy, ideal photon (peak = the band's long limit
/// by default) for photons, none for response-weighted scenes.
#[test]
fn d_star_shape_rules() {
    let um = SpectralUnit::Micrometre;
    let q = design(QE, band(3.7, 4.8, um)).prepare().unwrap();
    assert_eq!(
        q.d_star_shape(None).unwrap(),
        DStarShape::IdealPhoton {
            peak_wavelength_m: 4.8e-6
        }
    );
    assert_eq!(
        q.d_star_shape(Some(5e-6)).unwrap(),
        DStarShape::IdealPhoton {
            peak_wavelength_m: 5e-6
        }
    );
    let e = design(RESP, band(8.0, 14.0, um)).prepare().unwrap();
    assert_eq!(e.d_star_shape(None).unwrap(), DStarShape::Flat);
    assert_eq!(code(e.d_star_shape(Some(10e-6))), "UNSUPPORTED");
    let point = InstrumentModel::SpectralPoint {
        wavelength: 4.0,
        unit: um,
        c2: Default::default(),
    };
    let photon_model = design(
        QE,
        SceneDefinition::Model {
            model: point.clone(),
            radiance_kind: RadianceKind::Photon,
        },
    )
    .prepare()
    .unwrap();
    assert_eq!(code(photon_model.d_star_shape(None)), "UNSUPPORTED");
    assert!(photon_model.d_star_shape(Some(5e-6)).is_ok());
    let current = design(
        Conversion::Included,
        SceneDefinition::Model {
            model: point,
            radiance_kind: RadianceKind::Current,
        },
    )
    .prepare()
    .unwrap();
    assert_eq!(code(current.d_star_shape(None)), "UNSUPPORTED");
    assert_eq!(
        code(current.netd_from_d_star(1e9, 300.0, None)),
        "UNSUPPORTED"
    );
}

/// The prepared design is exactly the SI chain it wraps (same calls, same order: equal bits).
#[test]
fn identities_with_the_si_functions() {
    let um = SpectralUnit::Micrometre;
    let mut d = design(QE, band(3.7e-6, 4.8e-6, SpectralUnit::Metre));
    d.optics = d
        .optics
        .with_cone(ConeForm::SmallAngle)
        .with_field_angle(0.2);
    d.background_electrons_per_s = 1e6;
    let p = d.prepare().unwrap();
    let scene = Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)
        .in_band(310.0)
        .unwrap();
    let direct = d.detector.evaluate(&scene, &d.optics, 1e6).unwrap();
    assert_eq!(p.evaluate(310.0).unwrap(), direct);
    let df = noise_bandwidth_hz(1e-3).unwrap();
    let shape = DStarShape::IdealPhoton {
        peak_wavelength_m: 4.8e-6,
    };
    let want = netd_from_d_star_optics(2e9, shape, &scene, &d.optics, 2.25e-10, df).unwrap();
    assert_eq!(p.netd_from_d_star(2e9, 310.0, None).unwrap(), want);
    let back = p.d_star_from_netd(want, 310.0, None).unwrap();
    assert!(rel(back, 2e9) < 4.5e-16);
    // a responsivity table in A/W (model scene, current kind) equals the band with that
    // responsivity (the table integral and the band integral are different routes)
    let table = design(
        Conversion::Included,
        SceneDefinition::Model {
            model: InstrumentModel::Response(quantaband::definition::ResponseTable {
                wavelengths: vec![8.0, 14.0],
                values: vec![2.0, 2.0],
                unit: um,
                c2: Default::default(),
            }),
            radiance_kind: RadianceKind::Current,
        },
    )
    .prepare()
    .unwrap();
    let flat = design(RESP, band(8.0, 14.0, um)).prepare().unwrap();
    let (a, b) = (
        table.evaluate(300.0).unwrap(),
        flat.evaluate(300.0).unwrap(),
    );
    assert!(rel(a.photocurrent_a, b.photocurrent_a) < 1e-12);
    assert!(rel(a.netd_k, b.netd_k) < 1e-12);
}

fn data() -> Value {
    serde_json::from_str(include_str!("data/design_reference.json")).expect("reference JSON")
}

fn num(v: &Value, key: &str) -> f64 {
    v[key].as_str().expect(key).parse().expect(key)
}

/// The mpmath detector rows (tests/data/gen_design.py) through the whole definition, limits
/// typed in µm (one rounding each).
#[test]
fn detector_rows_through_the_definition() {
    let d = data();
    let mut worst = 0f64;
    for r in d["detector"].as_array().expect("detector rows") {
        let v = num(r, "conversion_value");
        let conversion = match r["conversion"].as_str() {
            Some("qe") => Conversion::QuantumEfficiency { efficiency: v },
            _ => Conversion::Responsivity {
                amperes_per_watt: v,
            },
        };
        let def = DesignDefinition {
            optics: Optics::new(num(r, "f_number"), num(r, "transmittance")),
            detector: Detector {
                pixel_area_m2: num(r, "pixel_area_m2"),
                conversion,
                integration_time_s: num(r, "integration_time_s"),
                full_well_electrons: num(r, "full_well_electrons"),
                dark_current_a: num(r, "dark_current_a"),
                read_noise_electrons: num(r, "read_noise_electrons"),
            },
            scene: band(
                num(r, "lower_m") * 1e6,
                num(r, "upper_m") * 1e6,
                SpectralUnit::Micrometre,
            ),
            background_electrons_per_s: num(r, "background_electrons_per_s"),
        };
        let rep = def
            .prepare()
            .unwrap()
            .evaluate(num(r, "temperature_k"))
            .unwrap();
        for (got, key) in [
            (rep.signal_electrons, "signal_electrons"),
            (rep.photocurrent_a, "photocurrent_a"),
            (rep.noise.total_electrons, "noise_electrons"),
            (rep.snr, "snr"),
            (rep.well_fill, "well_fill"),
            (rep.netd_k, "netd_k"),
        ] {
            worst = worst.max(rel(got, num(r, key)));
        }
    }
    println!(
        "detector rows through DesignDefinition (limits in µm) vs mpmath: max rel {worst:.1e}"
    );
    assert!(worst < 1e-13);
}

/// JSON shapes (feature `serde`): defaults, strictness at every level, and the serialized form
/// read back.
#[cfg(feature = "serde")]
#[test]
fn serde_shapes() {
    let json = r#"{
        "optics": {"fNumber": 2, "transmittance": 0.9},
        "detector": {"pixelAreaM2": 2.25e-10,
                     "conversion": {"kind": "quantumEfficiency", "efficiency": 0.7},
                     "integrationTimeS": 0.001, "fullWellElectrons": 1.1e7,
                     "darkCurrentA": 1e-12, "readNoiseElectrons": 200},
        "scene": {"kind": "band", "lower": 3.7, "upper": 4.8, "unit": "um"}
    }"#;
    let d: DesignDefinition = serde_json::from_str(json).unwrap();
    assert_eq!(d, design(QE, band(3.7, 4.8, SpectralUnit::Micrometre)));
    assert_eq!(d.optics.cone, ConeForm::Exact);
    assert_eq!(d.optics.field_angle_rad, 0.0);
    // the serialized form (every default written out) reads back to the same value
    let out = serde_json::to_string(&d).unwrap();
    assert!(out.contains(r#""cone":"exact""#) && out.contains(r#""kind":"band""#));
    assert!(out.contains(r#""backgroundElectronsPerS":0.0"#), "{out}");
    assert_eq!(serde_json::from_str::<DesignDefinition>(&out).unwrap(), d);
    let model = design(
        Conversion::Included,
        SceneDefinition::Model {
            model: InstrumentModel::SpectralPoint {
                wavelength: 4.0,
                unit: SpectralUnit::Micrometre,
                c2: Default::default(),
            },
            radiance_kind: RadianceKind::Current,
        },
    );
    let out = serde_json::to_string(&model).unwrap();
    assert!(out.contains(r#""radianceKind":"current""#) && out.contains(r#""kind":"included""#));
    assert_eq!(
        serde_json::from_str::<DesignDefinition>(&out).unwrap(),
        model
    );
    let r: Conversion =
        serde_json::from_str(r#"{"kind":"responsivity","amperesPerWatt":2}"#).unwrap();
    assert_eq!(r, RESP);
    // strict at every level: unknown keys, keys of another kind, missing keys, unknown names
    for bad in [
        r#"{"kind":"responsivity","amperesPerWatt":2,"x":1}"#,
        r#"{"kind":"responsivity","efficiency":0.5}"#,
        r#"{"kind":"quantumEfficiency"}"#,
        r#"{"kind":"bolometric"}"#,
        r#"{"efficiency":0.5}"#,
    ] {
        assert!(serde_json::from_str::<Conversion>(bad).is_err(), "{bad}");
    }
    for bad in [
        r#"{"fNumber":2,"transmittance":0.9,"x":1}"#,
        r#"{"fNumber":2}"#,
        r#"{"fNumber":2,"transmittance":0.9,"cone":"wide"}"#,
        r#"{"fNumber":"2","transmittance":0.9}"#,
    ] {
        assert!(serde_json::from_str::<Optics>(bad).is_err(), "{bad}");
    }
    for bad in [
        r#"{"kind":"band","lower":3,"upper":5}"#,
        r#"{"kind":"band","lower":3,"upper":5,"unit":"um","radianceKind":"energy"}"#,
        r#"{"kind":"band","lower":3,"upper":5,"unit":"furlong"}"#,
        r#"{"kind":"model","radianceKind":"energy"}"#,
        r#"{"kind":"line","lower":3,"upper":5,"unit":"um"}"#,
    ] {
        assert!(
            serde_json::from_str::<SceneDefinition>(bad).is_err(),
            "{bad}"
        );
    }
    let mut v: Value = serde_json::from_str(json).unwrap();
    v["detector"]["gain"] = Value::from(1.0);
    assert!(serde_json::from_value::<DesignDefinition>(v).is_err());
    let mut v: Value = serde_json::from_str(json).unwrap();
    v["extra"] = Value::from(1.0);
    assert!(serde_json::from_value::<DesignDefinition>(v).is_err());
}
