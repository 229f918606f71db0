//! Workflows that start from an indicated temperature (`thermometry::indicated`) against
//! numbers derived independently: `tests/data/spectral_reference.json`, written by
//! `tests/data/gen_spectral.py` (mpmath 1.3.0, 30 digits), which solves each radiance balance
//! (the grey measurement equation, or the spectral one by mpmath `quad`) with `findroot` for the
//! unknown — object temperature, reflected temperature or emissivity — instead of the closed
//! forms and the affine split the crate uses. Models: a spectral point (10 µm), a rectangular
//! 8–14 µm band (mpmath `quad`), a Sakuma–Hattori curve (its defining formula) and a 3–5 µm
//! response table (`quad` of the interpolant).

use quantaband::constants::C2Convention;
use quantaband::thermometry::indicated::{
    correct_reading, correct_reading_spectral, emissivity_by_contact, emissivity_by_reference,
    reflected_temperature,
};
use quantaband::thermometry::measurement::{Conditions, Window};
use quantaband::thermometry::model::{SignalModel, SpectralPoint};
use quantaband::thermometry::rectangular::RectangularBand;
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;
use quantaband::thermometry::spectral::{
    SpectralConditions, SpectralInstrument, SpectralValue, SpectralWindow,
};
use quantaband::thermometry::table::{SpectralTable, TableKind};
use serde_json::Value;

fn data() -> Value {
    serde_json::from_str(include_str!("data/spectral_reference.json")).expect("reference JSON")
}

fn num(v: &Value) -> f64 {
    v.as_f64().expect("number")
}

fn nums(v: &Value) -> Vec<f64> {
    v.as_array().expect("array").iter().map(num).collect()
}

fn conditions(v: &Value) -> Conditions {
    Conditions {
        emissivity: num(&v["emissivity"]),
        reflected_temperature_k: num(&v["reflected_temperature_k"]),
        path_transmittance: num(&v["path_transmittance"]),
        path_temperature_k: num(&v["path_temperature_k"]),
        window: v.get("window").map(|w| Window {
            transmittance: num(&w["transmittance"]),
            reflectance: num(&w["reflectance"]),
            temperature_k: num(&w["temperature_k"]),
            reflected_temperature_k: num(&w["reflected_temperature_k"]),
        }),
    }
}

const RESPONSE_WL: [f64; 3] = [3.0e-6, 4.0e-6, 5.0e-6];
const RESPONSE_R: [f64; 3] = [0.5, 1.0, 0.8];

fn with_model<R>(d: &Value, name: &str, f: impl FnOnce(&dyn SignalModel) -> R) -> R {
    let c2 = C2Convention::Codata2018;
    match name {
        "point_10um" => f(&SpectralPoint::new(10e-6, c2).unwrap()),
        "rect_8_14um" => f(&RectangularBand::new(8e-6, 14e-6, c2).unwrap()),
        "sakuma_hattori" => {
            let sh = &d["sakuma_hattori"];
            f(&SakumaHattori::new(num(&sh["a_m"]), num(&sh["b_mk"]), num(&sh["c"]), c2).unwrap())
        }
        "response_3_5um" => f(&ResponseSignal::new(
            Response::new(&RESPONSE_WL, &RESPONSE_R).unwrap(),
            c2,
        )),
        other => panic!("unknown model {other}"),
    }
}

/// All four workflows on four instrument models. Target 1e-12 relative.
#[test]
fn workflows_match_mpmath_root_finding() {
    let d = data();
    let mut worst = [0f64; 4];
    let kinds = ["correct", "reflected", "contact", "reference"];
    for case in d["workflows"].as_array().unwrap() {
        let kind = case["kind"].as_str().unwrap();
        let setting = conditions(&case["setting"]);
        let want = num(&case["expected"]);
        let got = with_model(&d, case["model"].as_str().unwrap(), |m| match kind {
            "correct" => correct_reading(
                m,
                num(&case["indicated_k"]),
                &setting,
                &conditions(&case["actual"]),
            )
            .unwrap(),
            "reflected" => reflected_temperature(
                m,
                num(&case["indicated_k"]),
                &setting,
                num(&case["reflector_emissivity"]),
                num(&case["reflector_temperature_k"]),
            )
            .unwrap(),
            "contact" => emissivity_by_contact(
                m,
                num(&case["indicated_k"]),
                &setting,
                num(&case["true_temperature_k"]),
                num(&case["reflected_temperature_k"]),
            )
            .unwrap(),
            "reference" => {
                let r = emissivity_by_reference(
                    m,
                    num(&case["reference_indicated_k"]),
                    num(&case["surface_indicated_k"]),
                    &setting,
                    num(&case["reference_emissivity"]),
                    num(&case["reflected_temperature_k"]),
                )
                .unwrap();
                let t = num(&case["expected_temperature_k"]);
                assert!(((r.temperature_k - t) / t).abs() < 1e-12, "{case}");
                r.emissivity
            }
            _ => unreachable!(),
        });
        let e = ((got - want) / want).abs();
        let k = kinds.iter().position(|&k| k == kind).unwrap();
        worst[k] = worst[k].max(e);
        assert!(
            e <= 1e-12,
            "{kind} {}: {got} vs {want} ({e:e})",
            case["model"]
        );
    }
    for (k, w) in kinds.iter().zip(worst) {
        println!("workflow {k}: max relative error {w:e}");
    }
}

/// (a) with a non-grey target behind a window table, read by a flat 8–14 µm instrument at a
/// grey setting.
#[test]
fn spectral_correction_matches_mpmath() {
    let d = data();
    let c = &d["spectral_correction"];
    let sc = &c["scene"];
    let (rw, rv) = (
        nums(&sc["response"]["wavelengths_m"]),
        nums(&sc["response"]["values"]),
    );
    let (ew, ev) = (
        nums(&sc["emissivity"]["wavelengths_m"]),
        nums(&sc["emissivity"]["values"]),
    );
    let (tw, tv) = (
        nums(&sc["window_transmittance"]["wavelengths_m"]),
        nums(&sc["window_transmittance"]["values"]),
    );
    let inst = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &rw, &rv).unwrap(),
        C2Convention::Codata2018,
    )
    .unwrap();
    let actual = SpectralConditions {
        emissivity: SpectralValue::Table(
            SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap(),
        ),
        reflectance: None,
        reflected_temperature_k: num(&sc["reflected_temperature_k"]),
        path_transmittance: SpectralValue::Constant(num(&sc["path_transmittance"]["constant"])),
        path_temperature_k: num(&sc["path_temperature_k"]),
        window: Some(SpectralWindow {
            transmittance: SpectralValue::Table(
                SpectralTable::new(TableKind::Transmittance, &tw, &tv).unwrap(),
            ),
            reflectance: SpectralValue::Constant(num(&sc["window_reflectance"]["constant"])),
            temperature_k: num(&sc["window_temperature_k"]),
            reflected_temperature_k: num(&sc["window_reflected_temperature_k"]),
        }),
    };
    let got = correct_reading_spectral(
        &inst,
        num(&c["indicated_k"]),
        &conditions(&c["setting"]),
        &actual,
    )
    .unwrap();
    let want = num(&c["expected"]);
    println!(
        "spectral correction: {got} K vs {want} K ({:e} relative)",
        (got - want) / want
    );
    assert!(((got - want) / want).abs() <= 1e-12);
}

/// Consistency and errors: correcting to the setting's own conditions returns the reading; the
/// workflows invert each other; bad inputs give the documented codes.
#[test]
fn identities_and_errors() {
    let m = SpectralPoint::new(10e-6, C2Convention::Codata2018).unwrap();
    let set = Conditions {
        emissivity: 0.9,
        reflected_temperature_k: 300.0,
        ..Conditions::BLACKBODY
    };
    assert!((correct_reading(&m, 345.0, &set, &set).unwrap() - 345.0).abs() < 1e-10);
    // contact method: the emissivity it finds is the setting at which the reading is T_true
    let e = emissivity_by_contact(&m, 330.0, &Conditions::BLACKBODY, 352.0, 300.0).unwrap();
    let back = correct_reading(
        &m,
        330.0,
        &Conditions::BLACKBODY,
        &Conditions {
            emissivity: e,
            reflected_temperature_k: 300.0,
            ..Conditions::BLACKBODY
        },
    )
    .unwrap();
    assert!((back - 352.0).abs() < 1e-9, "{back}");
    // reflector method with an ideal reflector and an ε = 1 setting: identity
    let t = reflected_temperature(&m, 287.0, &Conditions::BLACKBODY, 0.0, 300.0).unwrap();
    assert!((t - 287.0).abs() < 1e-10);
    // errors
    let code = |r: quantaband::Result<f64>| r.unwrap_err().code();
    assert_eq!(
        code(reflected_temperature(&m, 300.0, &set, 1.0, 300.0)),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code(reflected_temperature(&m, 300.0, &set, f64::NAN, 300.0)),
        "NON_FINITE"
    );
    assert_eq!(
        code(reflected_temperature(&m, 300.0, &set, 0.1, -3.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
    // a reflector that emits more than the reading: no physical solution
    assert_eq!(
        code(reflected_temperature(
            &m,
            250.0,
            &Conditions::BLACKBODY,
            0.5,
            400.0
        )),
        "NO_PHYSICAL_SOLUTION"
    );
    assert_eq!(
        code(emissivity_by_contact(
            &m,
            310.0,
            &Conditions::BLACKBODY,
            300.0,
            300.0
        )),
        "NO_SOLUTION"
    );
    // reading above the true temperature with cold surroundings: ε > 1, inconsistent
    assert_eq!(
        code(emissivity_by_contact(
            &m,
            360.0,
            &Conditions::BLACKBODY,
            350.0,
            290.0
        )),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code(correct_reading(&m, 0.0, &set, &set)),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        emissivity_by_reference(&m, 350.0, 320.0, &set, 0.0, 295.0)
            .unwrap_err()
            .code(),
        "OUT_OF_RANGE"
    );
    // the actual conditions' background above the signal
    let hot_refl = Conditions {
        emissivity: 0.2,
        reflected_temperature_k: 600.0,
        ..Conditions::BLACKBODY
    };
    assert_eq!(
        code(correct_reading(&m, 320.0, &set, &hot_refl)),
        "NO_PHYSICAL_SOLUTION"
    );
}

/// The README "Non-grey thermometry" example, compiled and run (keep the two in sync).
#[test]
fn readme_example() -> Result<(), quantaband::Error> {
    use quantaband::thermometry::spectral::band_effective;
    use quantaband::thermometry::table::SpectralTableBuf;
    use quantaband::units::SpectralUnit;
    // An invented oxidised-steel sample, pasted as text (µm, emissivity).
    let eps = SpectralTableBuf::from_text(
        TableKind::Emissivity,
        "# made-up sample\nwavelength_um,emissivity\n8,0.92\n9.5,0.70\n11,0.85\n14,0.80\n",
        SpectralUnit::Micrometre,
    )?;
    let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
    let inst = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &wl, &r)?,
        Default::default(),
    )?;
    let actual = SpectralConditions {
        emissivity: SpectralValue::Table(eps.as_table()),
        reflected_temperature_k: 296.0,
        ..SpectralConditions::BLACKBODY
    };
    // The camera showed 350 K with its emissivity set to 0.9.
    let setting = Conditions {
        emissivity: 0.9,
        reflected_temperature_k: 296.0,
        ..Conditions::BLACKBODY
    };
    let t = correct_reading_spectral(&inst, 350.0, &setting, &actual)?;
    let e = band_effective(&inst, t, &actual)?;
    println!("{t:.2} K; band-effective emissivity {:.4}", e.emissivity);
    // the sample's band emissivity is below the 0.9 setting, so the surface is hotter
    assert!(t > 351.0 && e.emissivity < 0.85 && e.emissivity > 0.75);
    Ok(())
}
