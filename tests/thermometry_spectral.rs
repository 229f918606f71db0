//! The spectral (non-grey) measurement equation against an outside oracle:
//! `tests/data/spectral_reference.json`, written by `tests/data/gen_spectral.py` with mpmath
//! 1.3.0 at 30 digits. The generator shares no algorithm with the crate: every integral is
//! mpmath `quad` (tanh–sinh) of the same piecewise-linear interpolants per interval of the union
//! grid (not Gauss–Legendre), object temperatures come from `findroot` on the full radiance
//! balance, and sensitivity coefficients are central finite differences of such solves (not
//! implicit differentiation). Constants: CODATA 2018 (h, c, k exact). The tables are invented.
//!
//! Also here: grey inputs against today's grey functions (`measured_signal`,
//! `object_temperature`, `sensitivities`), and every table error with its index.
//!
//! Each test prints the largest deviation it measured (`cargo test --test thermometry_spectral
//! -- --nocapture`).

use quantaband::constants::C2Convention;
use quantaband::thermometry::measurement::{
    measured_signal, object_temperature, Conditions, Window,
};
use quantaband::thermometry::model::SignalModel;
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::spectral::{
    band_effective, spectral_measured_signal, spectral_object_temperature, spectral_sensitivities,
    spectral_signal_terms, SpectralConditions, SpectralInstrument, SpectralValue, SpectralWindow,
};
use quantaband::thermometry::table::{Ends, SpectralTable, SpectralTableBuf, TableKind};
use quantaband::thermometry::uncertainty::sensitivities;
use quantaband::units::SpectralUnit;
use quantaband::Error;
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

/// One spectral input from the JSON: a constant or a table.
enum Input {
    Constant(f64),
    Table(Vec<f64>, Vec<f64>, bool),
}

impl Input {
    fn read(v: &Value) -> Input {
        if let Some(c) = v.get("constant") {
            return Input::Constant(num(c));
        }
        Input::Table(
            nums(&v["wavelengths_m"]),
            nums(&v["values"]),
            v["constant_ends"].as_bool().unwrap_or(false),
        )
    }
    fn value(&self, kind: TableKind) -> SpectralValue<'_> {
        match self {
            Input::Constant(c) => SpectralValue::Constant(*c),
            Input::Table(w, v, ends) => {
                let t = SpectralTable::new(kind, w, v).unwrap();
                SpectralValue::Table(if *ends {
                    t.with_ends(Ends::Constant)
                } else {
                    t
                })
            }
        }
    }
}

/// A scene from the JSON, owning its tables.
struct Scene {
    response: (Vec<f64>, Vec<f64>),
    photon: bool,
    emissivity: Input,
    reflectance: Option<Input>,
    path: Input,
    window_t: Input,
    window_r: Input,
    temps: [f64; 4],
}

impl Scene {
    fn read(v: &Value) -> Scene {
        Scene {
            response: (
                nums(&v["response"]["wavelengths_m"]),
                nums(&v["response"]["values"]),
            ),
            photon: v["photon"].as_bool().unwrap(),
            emissivity: Input::read(&v["emissivity"]),
            reflectance: v.get("reflectance").map(Input::read),
            path: Input::read(&v["path_transmittance"]),
            window_t: Input::read(&v["window_transmittance"]),
            window_r: Input::read(&v["window_reflectance"]),
            temps: [
                num(&v["reflected_temperature_k"]),
                num(&v["path_temperature_k"]),
                num(&v["window_temperature_k"]),
                num(&v["window_reflected_temperature_k"]),
            ],
        }
    }
    fn instrument(&self) -> SpectralInstrument<'_> {
        let kind = if self.photon {
            TableKind::PhotonResponse
        } else {
            TableKind::EnergyResponse
        };
        let t = SpectralTable::new(kind, &self.response.0, &self.response.1).unwrap();
        SpectralInstrument::new(t, C2Convention::Codata2018).unwrap()
    }
    fn conditions(&self) -> SpectralConditions<'_> {
        SpectralConditions {
            emissivity: self.emissivity.value(TableKind::Emissivity),
            reflectance: self
                .reflectance
                .as_ref()
                .map(|r| r.value(TableKind::Reflectance)),
            reflected_temperature_k: self.temps[0],
            path_transmittance: self.path.value(TableKind::Transmittance),
            path_temperature_k: self.temps[1],
            window: Some(SpectralWindow {
                transmittance: self.window_t.value(TableKind::Transmittance),
                reflectance: self.window_r.value(TableKind::Reflectance),
                temperature_k: self.temps[2],
                reflected_temperature_k: self.temps[3],
            }),
        }
    }
}

fn rel(a: f64, b: f64) -> f64 {
    if a == b {
        0.0
    } else {
        ((a - b) / b).abs()
    }
}

/// The a-priori bound of the Gauss–Legendre rules on the pieces the integration uses
/// (Trefethen, ATAP Thm 19.3, evaluated by the generator) is below 1e-16 relative for every
/// rule class, so the quadrature is exact for the interpolants to rounding.
#[test]
fn quadrature_bound_below_rounding() {
    let d = data();
    for c in d["quadrature_bound"].as_array().unwrap() {
        let b = num(&c["relative_bound"]);
        println!(
            "{}-point rule, ln(q/p) <= {}, dx <= {}: bound {b:e}",
            c["points"], c["max_ln_ratio"], c["max_dx"]
        );
        assert!(b < 1e-16, "{c}");
    }
}

/// Every term of the spectral equation against mpmath quad of the same interpolants: 200-point
/// tables on five different grids (8–14 µm, 400 K), a photon-counting SWIR detector with a
/// semi-transparent target and constant-end emissivity table (900 K), a window with a steep
/// absorption band (250 K object), 50 K over 3–30 µm, 3000 K over 0.5–1.1 µm, and a stepped
/// emissivity. Target 1e-12 relative.
#[test]
fn terms_and_effective_values_match_mpmath() {
    let d = data();
    let mut worst: f64 = 0.0;
    let mut worst_eff: f64 = 0.0;
    for (name, case) in d["spectral"].as_object().unwrap() {
        let sc = Scene::read(&case["scene"]);
        let (inst, cond) = (sc.instrument(), sc.conditions());
        let t = num(&case["temperature_k"]);
        let got = spectral_signal_terms(&inst, t, &cond).unwrap();
        let terms = [
            got.object,
            got.reflected,
            got.path,
            got.window_reflected,
            got.window_emitted,
        ];
        let want = nums(&case["terms"]);
        let mut w_case: f64 = 0.0;
        for (g, w) in terms.iter().zip(&want) {
            w_case = w_case.max(rel(*g, *w));
        }
        w_case = w_case.max(rel(got.signal, num(&case["signal"])));
        let e = band_effective(&inst, t, &cond).unwrap();
        let we = &case["effective"];
        let mut e_case: f64 = 0.0;
        for (g, key) in [
            (e.emissivity, "emissivity"),
            (e.reflectance, "reflectance"),
            (e.path_transmittance, "path_transmittance"),
            (e.window_transmittance, "window_transmittance"),
            (e.window_reflectance, "window_reflectance"),
            (e.object_gain, "object_gain"),
        ] {
            e_case = e_case.max(rel(g, num(&we[key])));
        }
        println!("{name}: terms max rel err {w_case:e}, effective values {e_case:e}");
        worst = worst.max(w_case);
        worst_eff = worst_eff.max(e_case);
    }
    println!("spectral terms: max relative error {worst:e}; effective values {worst_eff:e}");
    assert!(worst <= 1e-13, "{worst}");
    assert!(worst_eff <= 1e-13, "{worst_eff}");
}

/// The inverse: the object temperature from the mpmath signal of each case (an independent
/// forward value) recovers the case's temperature.
#[test]
fn inverse_recovers_temperature_from_mpmath_signal() {
    let d = data();
    let mut worst: f64 = 0.0;
    for (name, case) in d["spectral"].as_object().unwrap() {
        let sc = Scene::read(&case["scene"]);
        let t = num(&case["temperature_k"]);
        let got =
            spectral_object_temperature(&sc.instrument(), num(&case["signal"]), &sc.conditions())
                .unwrap();
        println!("{name}: T = {got} (expected {t}), dT = {:e} K", got - t);
        worst = worst.max(rel(got, t));
    }
    println!("spectral inverse: max relative error {worst:e}");
    assert!(worst <= 1e-12, "{worst}");
}

/// The motivating example: a flat 8–14 µm band, ε = 0.9 below 10 µm and 0.5 above, 350 K.
/// Treating the target as grey with the band-mean emissivity gives a temperature more than a
/// kelvin off (mpmath: the grey solve of the same signal), and our grey path reproduces that
/// grey number.
#[test]
fn stepped_emissivity_is_not_grey() {
    let d = data();
    let case = &d["spectral"]["step_emissivity"];
    let sc = Scene::read(&case["scene"]);
    let signal = num(&case["signal"]);
    let e_mean = num(&case["grey_mean_emissivity"]);
    let t_grey_mp = num(&case["grey_temperature_k"]);
    let (w, r) = &sc.response;
    let model = ResponseSignal::new(Response::new(w, r).unwrap(), C2Convention::Codata2018);
    let grey = Conditions {
        emissivity: e_mean,
        ..Conditions::BLACKBODY
    };
    let t_grey = object_temperature(&model, signal, &grey).unwrap();
    let t_spec = spectral_object_temperature(&sc.instrument(), signal, &sc.conditions()).unwrap();
    println!(
        "stepped emissivity: spectral {t_spec} K, grey (mean eps {e_mean}) {t_grey} K \
         (mpmath {t_grey_mp} K): difference {:.3} K",
        t_grey - t_spec
    );
    assert!(rel(t_grey, t_grey_mp) <= 1e-12);
    assert!((t_grey - t_spec).abs() > 1.0);
    // ε_eff(T) reproduces the object term at T (G = ε_eff·S); it does not make the grey
    // equation exact, because the reflected term weights 1 − ε with L(T_refl), not L(T)
    let (inst, cond) = (sc.instrument(), sc.conditions());
    let e = band_effective(&inst, 350.0, &cond).unwrap();
    let terms = spectral_signal_terms(&inst, 350.0, &cond).unwrap();
    assert!(rel(terms.object, e.emissivity * inst.signal(350.0).unwrap()) < 1e-14);
    let t_eff = object_temperature(
        &model,
        signal,
        &Conditions {
            emissivity: e.emissivity,
            ..Conditions::BLACKBODY
        },
    )
    .unwrap();
    println!("  grey with eps_eff(350 K) = {}: {t_eff} K", e.emissivity);
    assert!((t_eff - 350.0).abs() > 0.1 && (t_eff - 350.0).abs() < (t_grey - 350.0).abs());
}

/// Sensitivity coefficients against central finite differences of mpmath root-finding solves
/// (step 1e-8 relative, 30 digits), opaque and semi-transparent targets behind a window.
#[test]
fn sensitivities_match_mpmath_finite_differences() {
    let d = data();
    let mut worst: f64 = 0.0;
    for case in d["sensitivities"].as_array().unwrap() {
        let sc = Scene::read(&case["scene"]);
        let c = &case["coefficients"];
        let s =
            spectral_sensitivities(&sc.instrument(), num(&c["signal"]), &sc.conditions()).unwrap();
        assert!(rel(s.temperature_k, num(&c["temperature_k"])) < 1e-13);
        let mut pairs = vec![
            (s.signal, "signal_coefficient"),
            (s.emissivity_scale, "emissivity_scale"),
            (s.path_transmittance_scale, "path_transmittance_scale"),
            (s.window_transmittance_scale, "window_transmittance_scale"),
            (s.window_reflectance_scale, "window_reflectance_scale"),
            (s.response_scale, "response_scale"),
            (s.reflected_temperature, "reflected_temperature"),
            (s.path_temperature, "path_temperature"),
            (s.window_temperature, "window_temperature"),
            (
                s.window_reflected_temperature,
                "window_reflected_temperature",
            ),
        ];
        if case["opaque"].as_bool().unwrap() {
            assert_eq!(s.reflectance_scale, 0.0);
        } else {
            pairs.push((s.reflectance_scale, "reflectance_scale"));
        }
        for (got, key) in pairs {
            let want = num(&c[key]);
            let e = rel(got, want);
            println!("  {key}: {got:e} vs {want:e} ({e:e})");
            worst = worst.max(e);
        }
    }
    println!("spectral sensitivities: max relative deviation {worst:e}");
    assert!(worst <= 1e-9, "{worst}");
}

/// Constant (grey) inputs reproduce today's grey functions with the same response table:
/// `measured_signal`, `object_temperature` and `sensitivities` (ε·∂T/∂ε is the emissivity
/// scale coefficient, τ·∂T/∂τ the path one).
#[test]
fn grey_inputs_reproduce_grey_functions() {
    let tables: [(&[f64], &[f64]); 3] = [
        (&[8e-6, 14e-6], &[1.0, 1.0]),
        (&[3.0e-6, 3.5e-6, 4.5e-6, 5.0e-6], &[0.0, 1.0, 1.0, 0.2]),
        (&[0.80e-6, 0.90e-6, 1.00e-6, 1.10e-6], &[0.2, 0.8, 1.0, 0.1]),
    ];
    let conds = [
        Conditions {
            emissivity: 0.7,
            reflected_temperature_k: 300.0,
            path_transmittance: 0.95,
            path_temperature_k: 290.0,
            window: Some(Window {
                transmittance: 0.92,
                reflectance: 0.04,
                temperature_k: 310.0,
                reflected_temperature_k: 305.0,
            }),
        },
        Conditions {
            emissivity: 0.93,
            reflected_temperature_k: 296.0,
            ..Conditions::BLACKBODY
        },
        Conditions::BLACKBODY,
        Conditions {
            emissivity: 0.3,
            reflected_temperature_k: 500.0,
            path_transmittance: 0.8,
            path_temperature_k: 400.0,
            window: None,
        },
    ];
    let (mut ws, mut wt, mut wk, mut wt_abs): (f64, f64, f64, f64) = (0.0, 0.0, 0.0, 0.0);
    for (w, r) in tables {
        let model = ResponseSignal::new(Response::new(w, r).unwrap(), C2Convention::Codata2018);
        let inst = SpectralInstrument::new(
            SpectralTable::new(TableKind::EnergyResponse, w, r).unwrap(),
            C2Convention::Codata2018,
        )
        .unwrap();
        for c in &conds {
            let sc = SpectralConditions::from_grey(c);
            for t in [250.0, 350.0, 700.0, 1500.0] {
                let s_grey = measured_signal(&model, t, c).unwrap();
                let s_spec = spectral_measured_signal(&inst, t, &sc).unwrap();
                ws = ws.max(rel(s_spec, s_grey));
                let t_grey = object_temperature(&model, s_grey, c).unwrap();
                let t_spec = spectral_object_temperature(&inst, s_grey, &sc).unwrap();
                let k_grey = sensitivities(&model, s_grey, c).unwrap();
                // relative condition number of T(signal): a background that differs by one
                // rounding moves T by ~1e-16·κ·T (κ ~ 1e12 for a 250 K object at 1 µm under
                // 500 K surroundings, where the object term is 1e-12 of the signal)
                let kappa = s_grey * k_grey.signal / t_grey;
                // the relative signal difference that would explain the temperature difference
                wt = wt.max((t_spec - t_grey).abs() / (s_grey * k_grey.signal));
                if kappa <= 100.0 {
                    wt_abs = wt_abs.max((t_spec - t_grey).abs());
                }
                if kappa > 1e4 {
                    continue;
                }
                let k_spec = spectral_sensitivities(&inst, s_grey, &sc).unwrap();
                for (a, b) in [
                    (k_spec.signal, k_grey.signal),
                    (k_spec.emissivity_scale, c.emissivity * k_grey.emissivity),
                    (
                        k_spec.path_transmittance_scale,
                        c.path_transmittance * k_grey.path_transmittance,
                    ),
                ] {
                    wk = wk.max(rel(a, b) / (1.0 + kappa));
                }
                for (a, b) in [
                    (k_spec.reflected_temperature, k_grey.reflected_temperature),
                    (k_spec.path_temperature, k_grey.path_temperature),
                ] {
                    wk = wk.max((a - b).abs() / b.abs().max(1e-6) / (1.0 + kappa));
                }
            }
        }
        // the instrument's blackbody signal equals ResponseSignal's
        for t in [100.0, 300.0, 1000.0, 3000.0] {
            ws = ws.max(rel(inst.signal(t).unwrap(), model.signal(t).unwrap()));
        }
    }
    println!(
        "grey through the spectral path: signal max rel {ws:e}; temperature max |dT| {wt_abs:e} K \
         where kappa = s·(dT/ds)/T <= 100, and at most the effect of a {wt:e} relative signal \
         difference everywhere; sensitivities (kappa <= 1e4) max rel/(1 + kappa) {wk:e}"
    );
    assert!(ws <= 1e-14, "{ws}");
    assert!(wt <= 1e-14, "{wt}");
    assert!(wt_abs <= 1e-11, "{wt_abs}");
    assert!(wk <= 1e-13, "{wk}");
}

/// Round trips T → signal → T with tables, photon units and constant ends; the error is
/// measured as the relative signal difference that would explain it, |ΔT|/(s·∂T/∂s) (a cold
/// object under a warm background: the signal's last bits carry the object, and T is
/// ill-conditioned).
#[test]
fn round_trips() {
    let d = data();
    let mut worst: f64 = 0.0;
    for (_, case) in d["spectral"].as_object().unwrap() {
        let sc = Scene::read(&case["scene"]);
        let (inst, cond) = (sc.instrument(), sc.conditions());
        for t in [60.0, 300.0, 450.0, 1200.0, 2500.0] {
            let s = spectral_measured_signal(&inst, t, &cond).unwrap();
            match spectral_object_temperature(&inst, s, &cond) {
                Ok(back) => {
                    // as the relative signal difference that explains the error
                    let dt_ds = spectral_sensitivities(&inst, s, &cond).unwrap().signal;
                    worst = worst.max((back - t).abs() / (s * dt_ds));
                }
                // a cold object under a warm background: the signal rounds to the background
                Err(Error::NoPhysicalSolution { .. }) => {}
                Err(e) => panic!("{e}"),
            }
        }
    }
    println!(
        "spectral round trips: error at most the effect of a {worst:e} relative signal difference"
    );
    assert!(worst <= 1e-14, "{worst}");
}

/// Photon units: a flat quantum efficiency times the photon radiance equals the energy
/// integral of R(λ) = λ/(hc) (checked here by a table fine enough that linear interpolation
/// of λ/(hc) is exact to 1e-9 relative: λ/(hc) is itself linear, so it is exact).
#[test]
fn photon_response_is_energy_response_times_lambda_over_hc() {
    let w = [1.0e-6, 1.7e-6];
    let hc = 6.626_070_15e-34 * 299_792_458.0;
    let qe = [1.0, 1.0];
    let r = [w[0] / hc, w[1] / hc];
    let p = SpectralInstrument::new(
        SpectralTable::new(TableKind::PhotonResponse, &w, &qe).unwrap(),
        Default::default(),
    )
    .unwrap();
    let e = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &w, &r).unwrap(),
        Default::default(),
    )
    .unwrap();
    for t in [300.0, 800.0, 2000.0] {
        let (a, b) = (p.signal(t).unwrap(), e.signal(t).unwrap());
        assert!(rel(a, b) < 1e-14, "{t}: {a} {b}");
    }
}

// ---------------------------------------------------------------------------------------------
// Errors.

#[test]
fn bad_tables_name_the_index() {
    use TableKind::*;
    let w = [8e-6, 9e-6, 10e-6];
    let e = |k, w: &[f64], v: &[f64]| SpectralTable::new(k, w, v).unwrap_err();
    assert_eq!(
        e(Emissivity, &[], &[]),
        Error::TooFewPoints { needed: 2, got: 0 }
    );
    assert_eq!(
        e(Emissivity, &[8e-6], &[0.5]),
        Error::TooFewPoints { needed: 2, got: 1 }
    );
    assert_eq!(
        e(Emissivity, &w, &[0.5, 0.5]),
        Error::LengthMismatch {
            expected: 3,
            got: 2
        }
    );
    assert_eq!(
        e(Transmittance, &[8e-6, 9e-6, 9e-6], &[0.5; 3]),
        Error::NotIncreasing {
            arg: "transmittance.wavelengths_m",
            index: 2
        }
    );
    assert_eq!(
        e(Transmittance, &[8e-6, 7e-6, 9e-6], &[0.5; 3]).code(),
        "NOT_INCREASING"
    );
    for (bad, i) in [(f64::NAN, 1usize), (f64::INFINITY, 2), (-1e-6, 0), (0.0, 0)] {
        let mut ww = w;
        ww[i] = bad;
        match e(Emissivity, &ww, &[0.5; 3]) {
            Error::InvalidTableEntry { arg, index, .. } => {
                assert_eq!((arg, index), ("emissivity.wavelengths_m", i))
            }
            other => panic!("{other:?}"),
        }
    }
    for (kind, arg) in [
        (Emissivity, "emissivity.values"),
        (Reflectance, "reflectance.values"),
        (Transmittance, "transmittance.values"),
    ] {
        for (bad, i) in [
            (f64::NAN, 1usize),
            (1.0000001, 2),
            (-0.01, 0),
            (f64::INFINITY, 1),
        ] {
            let mut v = [0.5; 3];
            v[i] = bad;
            match e(kind, &w, &v) {
                Error::InvalidTableEntry {
                    arg: a,
                    index,
                    range,
                    value,
                } => {
                    assert_eq!((a, index, range), (arg, i, "[0, 1]"));
                    assert!(value.is_nan() || value == bad);
                }
                other => panic!("{other:?}"),
            }
        }
    }
    // responses: ≥ 0, finite, not all zero; values above 1 are fine (A/W, counts)
    assert!(SpectralTable::new(EnergyResponse, &w, &[0.0, 2.5, 7.0]).is_ok());
    assert!(matches!(
        e(PhotonResponse, &w, &[0.0, -0.1, 0.3]),
        Error::InvalidTableEntry { index: 1, .. }
    ));
    assert_eq!(
        e(EnergyResponse, &w, &[0.0; 3]),
        Error::NonPositive {
            arg: "energy_response.values",
            value: 0.0
        }
    );
    // owned tables validate the same way
    assert_eq!(
        SpectralTableBuf::new(Emissivity, vec![8e-6, 9e-6], vec![0.5, 1.5]).unwrap_err(),
        Error::InvalidTableEntry {
            arg: "emissivity.values",
            index: 1,
            value: 1.5,
            range: "[0, 1]"
        }
    );
}

#[test]
fn queries_outside_the_grid() {
    let (w, v) = ([8e-6, 14e-6], [0.9, 0.7]);
    let t = SpectralTable::new(TableKind::Emissivity, &w, &v).unwrap();
    assert_eq!(
        t.value_at(7e-6).unwrap_err(),
        Error::OutsideTable {
            arg: "emissivity",
            wavelength_m: 7e-6,
            first_m: 8e-6,
            last_m: 14e-6
        }
    );
    assert_eq!(t.value_at(14e-6).unwrap(), 0.7);
    assert_eq!(t.value_at(8e-6).unwrap(), 0.9);
    let c = t.with_ends(Ends::Constant);
    assert_eq!(
        (c.value_at(1e-6).unwrap(), c.value_at(1.0).unwrap()),
        (0.9, 0.7)
    );
    assert_eq!(t.value_at(f64::NAN).unwrap_err().code(), "NON_FINITE");
    assert_eq!(
        t.value_at(-1.0).unwrap_err().code(),
        "NON_POSITIVE_SPECTRAL"
    );
    // in the measurement equation: a table that does not cover the response band
    let (rw, rv) = ([7.5e-6, 14.5e-6], [1.0, 1.0]);
    let inst = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &rw, &rv).unwrap(),
        Default::default(),
    )
    .unwrap();
    let cond = SpectralConditions {
        emissivity: SpectralValue::Table(t),
        ..SpectralConditions::BLACKBODY
    };
    assert_eq!(
        spectral_measured_signal(&inst, 400.0, &cond).unwrap_err(),
        Error::OutsideTable {
            arg: "emissivity",
            wavelength_m: 7.5e-6,
            first_m: 8e-6,
            last_m: 14e-6
        }
    );
    let path = SpectralConditions {
        path_transmittance: SpectralValue::Table(
            SpectralTable::new(TableKind::Transmittance, &[7e-6, 12e-6], &[0.9, 0.9]).unwrap(),
        ),
        ..SpectralConditions::BLACKBODY
    };
    assert!(matches!(
        spectral_object_temperature(&inst, 50.0, &path).unwrap_err(),
        Error::OutsideTable { arg: "path_transmittance", wavelength_m, .. } if wavelength_m == 14.5e-6
    ));
    // constant ends extend it; zero-response padding outside the table needs no coverage
    let cond = SpectralConditions {
        emissivity: SpectralValue::Table(c),
        ..SpectralConditions::BLACKBODY
    };
    assert!(spectral_measured_signal(&inst, 400.0, &cond).is_ok());
    let (pw, pv) = ([6e-6, 8e-6, 14e-6, 16e-6], [0.0, 1.0, 1.0, 0.0]);
    let padded = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &pw, &pv).unwrap(),
        Default::default(),
    )
    .unwrap();
    let (pw2, pv2) = ([6e-6, 16e-6], [0.9, 0.7]);
    let wide = SpectralConditions {
        emissivity: SpectralValue::Table(
            SpectralTable::new(TableKind::Emissivity, &pw2, &pv2).unwrap(),
        ),
        ..SpectralConditions::BLACKBODY
    };
    assert!(spectral_measured_signal(&padded, 400.0, &wide).is_ok());
    let narrow = SpectralConditions {
        emissivity: SpectralValue::Table(t),
        ..SpectralConditions::BLACKBODY
    };
    // the padded response's band is 6–16 µm (its outer segments rise from 0): not covered
    assert_eq!(
        spectral_measured_signal(&padded, 400.0, &narrow)
            .unwrap_err()
            .code(),
        "OUTSIDE_TABLE"
    );
}

#[test]
fn sums_above_one_and_wrong_kinds() {
    let (w, tw, rw) = ([8e-6, 10e-6, 14e-6], [0.9, 0.9, 0.8], [0.05, 0.12, 0.1]);
    let tt = SpectralTable::new(TableKind::Transmittance, &w, &tw).unwrap();
    let rt = SpectralTable::new(TableKind::Reflectance, &w, &rw).unwrap();
    let win = |t, r| SpectralConditions {
        window: Some(SpectralWindow {
            transmittance: t,
            reflectance: r,
            temperature_k: 300.0,
            reflected_temperature_k: 300.0,
        }),
        ..SpectralConditions::BLACKBODY
    };
    // τ_w + ρ_w = 1.02 at index 1 of the reflectance table
    assert_eq!(
        win(SpectralValue::Table(tt), SpectralValue::Table(rt))
            .validate()
            .unwrap_err(),
        Error::InvalidTableEntry {
            arg: "window.reflectance.values",
            index: 1,
            value: 0.9 + 0.12,
            range: "[0, 1] (sum of the two)"
        }
    );
    // a constant reflectance against the transmittance table: index into the τ table
    assert!(matches!(
        win(SpectralValue::Table(tt), SpectralValue::Constant(0.11))
            .validate()
            .unwrap_err(),
        Error::InvalidTableEntry {
            arg: "window.transmittance.values",
            index: 0,
            ..
        }
    ));
    // between grid points of different grids: checked at the union points
    let (w2, r2) = ([9e-6, 11e-6], [0.10, 0.12]);
    let r2t = SpectralTable::new(TableKind::Reflectance, &w2, &r2).unwrap();
    let err = win(SpectralValue::Table(tt), SpectralValue::Table(r2t))
        .validate()
        .unwrap_err();
    assert!(
        matches!(
            err,
            Error::InvalidTableEntry {
                arg: "window.transmittance.values",
                index: 1,
                ..
            }
        ),
        "{err:?}"
    );
    assert_eq!(
        win(SpectralValue::Constant(0.9), SpectralValue::Constant(0.2))
            .validate()
            .unwrap_err()
            .code(),
        "INVALID_TABLE_ENTRY"
    );
    assert!(
        win(SpectralValue::Constant(0.9), SpectralValue::Constant(0.1))
            .validate()
            .is_ok()
    );
    // a semi-transparent target: ε + ρ ≤ 1
    let (ew, ev) = ([8e-6, 14e-6], [0.6, 0.7]);
    let et = SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap();
    let c = SpectralConditions {
        emissivity: SpectralValue::Table(et),
        reflectance: Some(SpectralValue::Constant(0.35)),
        ..SpectralConditions::BLACKBODY
    };
    assert!(matches!(
        c.validate().unwrap_err(),
        Error::InvalidTableEntry {
            arg: "emissivity.values",
            index: 1,
            ..
        }
    ));
    // wrong kinds
    let c = SpectralConditions {
        emissivity: SpectralValue::Table(tt),
        ..SpectralConditions::BLACKBODY
    };
    assert_eq!(c.validate().unwrap_err().code(), "UNSUPPORTED");
    assert_eq!(
        SpectralInstrument::new(tt, Default::default())
            .unwrap_err()
            .code(),
        "UNSUPPORTED"
    );
    // bad constants and temperatures
    for bad in [f64::NAN, -0.1, 1.1] {
        let c = SpectralConditions {
            path_transmittance: SpectralValue::Constant(bad),
            ..SpectralConditions::BLACKBODY
        };
        assert!(matches!(
            c.validate().unwrap_err().code(),
            "NON_FINITE" | "OUT_OF_RANGE"
        ));
    }
    let c = SpectralConditions {
        reflected_temperature_k: 0.0,
        ..SpectralConditions::BLACKBODY
    };
    assert_eq!(c.validate().unwrap_err().code(), "NON_POSITIVE_TEMPERATURE");
}

#[test]
fn inverse_strictness() {
    let (w, r) = ([8e-6, 14e-6], [1.0, 1.0]);
    let inst = SpectralInstrument::new(
        SpectralTable::new(TableKind::EnergyResponse, &w, &r).unwrap(),
        Default::default(),
    )
    .unwrap();
    let c = SpectralConditions {
        emissivity: SpectralValue::Constant(0.5),
        reflected_temperature_k: 300.0,
        ..SpectralConditions::BLACKBODY
    };
    let bg = spectral_signal_terms(&inst, 300.0, &c).unwrap().reflected;
    for s in [bg, 0.5 * bg, 0.0, -1.0] {
        match spectral_object_temperature(&inst, s, &c).unwrap_err() {
            Error::NoPhysicalSolution { signal, background } => {
                assert_eq!(signal, s);
                assert!(rel(background, bg) < 1e-15);
            }
            e => panic!("{e:?}"),
        }
    }
    assert_eq!(
        spectral_object_temperature(&inst, f64::NAN, &c)
            .unwrap_err()
            .code(),
        "NON_FINITE"
    );
    // a target with no emissivity anywhere in the band: no solution at all
    let (ew, ev) = ([8e-6, 14e-6], [0.0, 0.0]);
    let zero = SpectralConditions {
        emissivity: SpectralValue::Table(
            SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap(),
        ),
        ..c
    };
    assert_eq!(
        spectral_object_temperature(&inst, 2.0 * bg + 1.0, &zero)
            .unwrap_err()
            .code(),
        "NO_SOLUTION"
    );
    assert_eq!(
        spectral_measured_signal(&inst, -5.0, &c)
            .unwrap_err()
            .code(),
        "NON_POSITIVE_TEMPERATURE"
    );
}

// ---------------------------------------------------------------------------------------------
// Text tables.

#[test]
fn text_tables() {
    use TableKind::*;
    let um = SpectralUnit::Micrometre;
    let text = "\u{feff}# invented sample\n% another comment\n\nlambda [um]; epsilon\n8.0;0.95\r\n 10.0 ;0.90 # note\n14\t0.80\n";
    let t = SpectralTableBuf::from_text(Emissivity, text, um).unwrap();
    assert_eq!(t.as_table().wavelengths_m(), &[8e-6, 10e-6, 14e-6]);
    assert_eq!(t.as_table().values(), &[0.95, 0.90, 0.80]);
    // nm, blanks as separators
    let t =
        SpectralTableBuf::from_text(Transmittance, "500 0.1\n600 0.2\n", SpectralUnit::Nanometre)
            .unwrap();
    assert_eq!(t.as_table().wavelengths_m(), &[5e-7, 6e-7]);
    // wavenumber files descending in cm⁻¹ are ascending in wavelength; ascending ones are
    // reversed
    let t = SpectralTableBuf::from_text(
        Transmittance,
        "1250,0.5\n1000,0.6\n800,0.7\n",
        SpectralUnit::PerCentimetre,
    )
    .unwrap();
    assert_eq!(t.as_table().wavelengths_m(), &[8e-6, 10e-6, 12.5e-6]);
    let t = SpectralTableBuf::from_text(
        Transmittance,
        "800,0.7\n1000,0.6\n1250,0.5\n",
        SpectralUnit::PerCentimetre,
    )
    .unwrap();
    assert_eq!(t.as_table().values(), &[0.5, 0.6, 0.7]);
    let line = |text: &str| SpectralTableBuf::from_text(Emissivity, text, um).unwrap_err();
    assert_eq!(
        line("8,0.9\n9,0.9\n9,0.8\n"),
        Error::InvalidLine {
            line: 3,
            reason:
                "wavelengths must be strictly monotone (the first two data lines set the order)"
        }
    );
    assert!(matches!(
        line("8,0.9\n9,0.9\n8.5,0.8\n"),
        Error::InvalidLine { line: 3, .. }
    ));
    assert!(matches!(
        line("h\n8,0.9\n9,nan\n"),
        Error::InvalidLine { line: 3, .. }
    ));
    assert!(matches!(
        line("8,0.9\n9,0.9x\n"),
        Error::InvalidLine {
            line: 2,
            reason: "not a number"
        }
    ));
    assert!(matches!(
        line("8,0.9\n9,0.8,1\n"),
        Error::InvalidLine { line: 2, .. }
    ));
    assert!(matches!(
        line("8,0.9\n9\n"),
        Error::InvalidLine { line: 2, .. }
    ));
    assert!(matches!(
        line("8,0.9\nwavelength,eps\n"),
        Error::InvalidLine { line: 2, .. }
    ));
    assert!(matches!(
        line("# c\n8,0.9\n-9,0.8\n"),
        Error::InvalidLine { line: 3, .. }
    ));
    assert_eq!(
        line("8,0.9\n9,1.2\n"),
        Error::InvalidLine {
            line: 2,
            reason: "value outside [0, 1]"
        }
    );
    // decimal commas are not guessed: the line has four fields
    assert!(matches!(
        line("8,5;0,9\n"),
        Error::InvalidLine { line: 1, .. }
    ));
    assert_eq!(
        line("# only a comment\n8,0.9\n"),
        Error::TooFewPoints { needed: 2, got: 1 }
    );
    assert_eq!(line(""), Error::TooFewPoints { needed: 2, got: 0 });
    assert_eq!(
        SpectralTableBuf::from_text(PhotonResponse, "1,0\n2,0\n", um)
            .unwrap_err()
            .code(),
        "NON_POSITIVE"
    );
    assert!(matches!(
        SpectralTableBuf::from_text(PhotonResponse, "1,0\n2,-1\n", um).unwrap_err(),
        Error::InvalidLine {
            line: 2,
            reason: "response below 0"
        }
    ));
    // responses may exceed 1 (A/W)
    assert!(SpectralTableBuf::from_text(EnergyResponse, "1,0.5\n2,6.5\n", um).is_ok());
}

#[cfg(feature = "serde")]
#[test]
fn owned_tables_serde_round_trip_and_validate() {
    let t = SpectralTableBuf::new(TableKind::Emissivity, vec![8e-6, 14e-6], vec![0.9, 0.7])
        .unwrap()
        .with_ends(Ends::Constant);
    let s = serde_json::to_string(&t).unwrap();
    assert_eq!(
        s,
        r#"{"kind":"emissivity","wavelengthsM":[8e-6,0.000014],"values":[0.9,0.7],"ends":"constant"}"#
    );
    let back: SpectralTableBuf = serde_json::from_str(&s).unwrap();
    assert_eq!(back, t);
    // defaults and validation on the way in
    let d: SpectralTableBuf = serde_json::from_str(
        r#"{"kind":"transmittance","wavelengthsM":[1e-6,2e-6],"values":[1,1]}"#,
    )
    .unwrap();
    assert_eq!(d.as_table().ends(), Ends::Reject);
    let bad = serde_json::from_str::<SpectralTableBuf>(
        r#"{"kind":"emissivity","wavelengthsM":[1e-6,2e-6],"values":[1,2]}"#,
    );
    assert!(bad
        .unwrap_err()
        .to_string()
        .contains("emissivity.values[1]"));
    let unknown = serde_json::from_str::<SpectralTableBuf>(
        r#"{"kind":"emissivity","wavelengthsM":[1e-6,2e-6],"values":[1,1],"x":1}"#,
    );
    assert!(unknown.is_err());
}

/// Extreme but valid temperatures give finite (or, where the true value overflows, infinite)
/// numbers, never NaN, and the inverse reports errors instead of panicking.
#[test]
fn extreme_temperatures() {
    let (w, r) = ([0.5e-6, 1.0e-6, 14e-6], [0.3, 1.0, 0.5]);
    let (ew, ev) = ([0.5e-6, 14e-6], [0.9, 0.4]);
    for kind in [TableKind::EnergyResponse, TableKind::PhotonResponse] {
        let inst = SpectralInstrument::new(
            SpectralTable::new(kind, &w, &r).unwrap(),
            Default::default(),
        )
        .unwrap();
        let c = SpectralConditions {
            emissivity: SpectralValue::Table(
                SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap(),
            ),
            path_transmittance: SpectralValue::Constant(0.9),
            ..SpectralConditions::BLACKBODY
        };
        for t in [1e-300, 1e-3, 1.0, 1e6, 1e150, 1e290, 1e300] {
            let terms = spectral_signal_terms(&inst, t, &c).unwrap();
            assert!(
                !terms.signal.is_nan() && terms.signal >= 0.0,
                "{t}: {terms:?}"
            );
            let e = band_effective(&inst, t, &c);
            if let Ok(e) = e {
                assert!(e.emissivity > 0.39 && e.emissivity < 0.91, "{t}: {e:?}");
            }
        }
        let e = band_effective(&inst, 1e300, &c).unwrap();
        assert!(e.emissivity.is_finite());
        for s in [1e-300, 1e300, f64::MAX] {
            if let Err(e) = spectral_object_temperature(&inst, s, &c) {
                assert!(
                    matches!(e.code(), "NO_SOLUTION" | "NO_PHYSICAL_SOLUTION"),
                    "{s}: {e}"
                );
            }
        }
    }
}
