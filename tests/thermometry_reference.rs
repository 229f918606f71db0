//! Radiation-thermometry results against an outside oracle: `tests/data/thermometry_reference.json`,
//! written by `tests/data/gen_thermometry.py` with mpmath 1.3.0 at 60 digits. The generator does
//! not reuse the crate's algorithms: integrals by mpmath `quad` (tanh–sinh) instead of
//! Gauss–Legendre, temperatures by `findroot` on the defining equations instead of closed forms
//! or our safeguarded Newton, sensitivity coefficients by numerical differentiation (`mp.diff`)
//! instead of implicit differentiation. Constants: CODATA 2018 (h, c, k exact) and ITS-90
//! (c2 = 0.014388 m·K; Ag, Au, Cu freezing points from Preston-Thomas, Metrologia 27, 3, 1990).
//!
//! Each test prints the largest relative deviation it measured (`cargo test -- --nocapture`).

use quantaband::constants::C2Convention;
use quantaband::thermometry::measurement::{
    measured_signal, object_temperature, Conditions, Window,
};
use quantaband::thermometry::model::{SignalModel, SpectralPoint};
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;
use quantaband::thermometry::{its90, ratio, uncertainty};

// ---------------------------------------------------------------------------------------------
// A minimal JSON reader (objects, arrays, numbers, strings, true/false/null): enough for the
// generated reference file, so the tests need no extra dependency.
#[derive(Debug, Clone)]
enum J {
    Num(f64),
    Str(String),
    Arr(Vec<J>),
    Obj(Vec<(String, J)>),
    Bool,
    Null,
}

impl J {
    fn get(&self, key: &str) -> &J {
        match self {
            J::Obj(v) => v
                .iter()
                .find(|(k, _)| k == key)
                .map(|(_, v)| v)
                .unwrap_or_else(|| panic!("no key {key}")),
            _ => panic!("not an object looking up {key}"),
        }
    }
    fn f(&self, key: &str) -> f64 {
        match self.get(key) {
            J::Num(x) => *x,
            other => panic!("{key} is not a number: {other:?}"),
        }
    }
    fn s(&self, key: &str) -> &str {
        match self.get(key) {
            J::Str(x) => x,
            other => panic!("{key} is not a string: {other:?}"),
        }
    }
    fn arr(&self) -> &[J] {
        match self {
            J::Arr(v) => v,
            _ => panic!("not an array"),
        }
    }
    fn nums(&self) -> Vec<f64> {
        self.arr()
            .iter()
            .map(|x| match x {
                J::Num(v) => *v,
                _ => panic!("not a number"),
            })
            .collect()
    }
}

struct P<'a> {
    b: &'a [u8],
    i: usize,
}

impl P<'_> {
    fn ws(&mut self) {
        while self.i < self.b.len() && (self.b[self.i] as char).is_whitespace() {
            self.i += 1;
        }
    }
    fn val(&mut self) -> J {
        self.ws();
        match self.b[self.i] {
            b'{' => {
                self.i += 1;
                let mut v = Vec::new();
                loop {
                    self.ws();
                    if self.b[self.i] == b'}' {
                        self.i += 1;
                        break;
                    }
                    let k = match self.val() {
                        J::Str(s) => s,
                        _ => panic!("key"),
                    };
                    self.ws();
                    assert_eq!(self.b[self.i], b':');
                    self.i += 1;
                    let x = self.val();
                    v.push((k, x));
                    self.ws();
                    if self.b[self.i] == b',' {
                        self.i += 1;
                    }
                }
                J::Obj(v)
            }
            b'[' => {
                self.i += 1;
                let mut v = Vec::new();
                loop {
                    self.ws();
                    if self.b[self.i] == b']' {
                        self.i += 1;
                        break;
                    }
                    v.push(self.val());
                    self.ws();
                    if self.b[self.i] == b',' {
                        self.i += 1;
                    }
                }
                J::Arr(v)
            }
            b'"' => {
                self.i += 1;
                let start = self.i;
                while self.b[self.i] != b'"' {
                    self.i += 1;
                }
                let s = String::from_utf8(self.b[start..self.i].to_vec()).unwrap();
                self.i += 1;
                J::Str(s)
            }
            b't' => {
                self.i += 4;
                J::Bool
            }
            b'f' => {
                self.i += 5;
                J::Bool
            }
            b'n' => {
                self.i += 4;
                J::Null
            }
            _ => {
                let start = self.i;
                while self.i < self.b.len() && b"+-0123456789.eE".contains(&self.b[self.i]) {
                    self.i += 1;
                }
                let t = std::str::from_utf8(&self.b[start..self.i]).unwrap();
                J::Num(t.parse().unwrap_or_else(|_| panic!("bad number {t}")))
            }
        }
    }
}

fn reference() -> J {
    let text = include_str!("data/thermometry_reference.json");
    let j = P {
        b: text.as_bytes(),
        i: 0,
    }
    .val();
    assert!(matches!(j, J::Obj(_)));
    j
}

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn response_of(j: &J, name: &str) -> (Vec<f64>, Vec<f64>) {
    let r = j.get("responses").get(name);
    (r.get("wavelengths_m").nums(), r.get("values").nums())
}

// ---------------------------------------------------------------------------------------------

/// Response-weighted signal, dS/dT, mean wavelength, spread and limiting effective wavelength
/// against mpmath quad (brief: ≤ 1e-10 relative). Includes extreme-but-valid cases (650 nm at
/// 100 K ≈ 1e-90, 1–14 µm at 20 K) that must come out as correct tiny numbers.
#[test]
fn response_integrals_match_mpmath_quad() {
    let j = reference();
    let mut worst = [0.0f64; 5];
    for case in j.get("integrals").arr() {
        let (wl, v) = response_of(&j, case.s("response"));
        let model = ResponseSignal::new(Response::new(&wl, &v).unwrap(), C2Convention::Codata2018);
        let t = case.f("temperature_k");
        let (s, ds) = model.signal_and_derivative(t).unwrap();
        let (mean, sd) = model.mean_and_spread_m(t).unwrap();
        let lt = model.limiting_effective_wavelength_m(t).unwrap();
        let errs = [
            rel(s, case.f("signal")),
            rel(ds, case.f("d_signal_dt")),
            rel(mean, case.f("mean_wavelength_m")),
            rel(sd, case.f("spread_m")),
            rel(lt, case.f("limiting_effective_wavelength_m")),
        ];
        for (w, e) in worst.iter_mut().zip(errs) {
            *w = w.max(e);
        }
        assert!(
            errs[0] <= 1e-10,
            "{} at {t} K: S rel err {}",
            case.s("response"),
            errs[0]
        );
        assert!(
            errs[1] <= 1e-10,
            "{} at {t} K: dS/dT rel err {}",
            case.s("response"),
            errs[1]
        );
        assert!(
            errs[2] <= 1e-10 && errs[4] <= 1e-10,
            "{} at {t} K: wavelengths {errs:?}",
            case.s("response")
        );
        assert!(
            errs[3] <= 1e-10,
            "{} at {t} K: spread {} all {errs:?}",
            case.s("response"),
            errs[3]
        );
    }
    println!("max rel err S, dS/dT, mean λ, σ, λ_T: {worst:?}");
}

/// Effective wavelength between two temperatures (Wien-form definition) against mpmath.
#[test]
fn effective_wavelength_matches_mpmath() {
    let j = reference();
    for case in j.get("effective_wavelengths").arr() {
        let (wl, v) = response_of(&j, case.s("response"));
        let model = ResponseSignal::new(Response::new(&wl, &v).unwrap(), C2Convention::Codata2018);
        let le = model
            .effective_wavelength_m(case.f("t1_k"), case.f("t2_k"))
            .unwrap();
        let e = rel(le, case.f("effective_wavelength_m"));
        assert!(e <= 1e-9, "{}: {e}", case.s("response"));
    }
}

/// Moments of the bare response (used for the Sakuma–Hattori start) against mpmath quad.
#[test]
fn response_moments_match_mpmath() {
    let j = reference();
    for case in j.get("response_moments").arr() {
        let (wl, v) = response_of(&j, case.s("response"));
        let (m, sd) = Response::new(&wl, &v).unwrap().mean_and_spread_m().unwrap();
        assert!(rel(m, case.f("mean_m")) <= 1e-13, "{}", case.s("response"));
        assert!(
            rel(sd, case.f("spread_m")) <= 1e-10,
            "{}",
            case.s("response")
        );
    }
}

/// Single-wavelength model, including 100 nm at 300 K (≈ 6e-190) and 650 nm at 100 K.
#[test]
fn spectral_point_matches_mpmath() {
    let j = reference();
    for case in j.get("spectral_points").arr() {
        let m = SpectralPoint::new(case.f("wavelength_m"), C2Convention::Codata2018).unwrap();
        let t = case.f("temperature_k");
        let (l, dl) = m.signal_and_derivative(t).unwrap();
        assert!(
            rel(l, case.f("radiance")) <= 1e-12,
            "L at {t}: {l} vs {}",
            case.f("radiance")
        );
        assert!(rel(dl, case.f("d_radiance_dt")) <= 1e-12, "dL/dT at {t}");
        // and back
        let tb = m.temperature(l).unwrap();
        assert!((tb - t).abs() <= 1e-9 * t.max(1.0), "inverse {tb} vs {t}");
    }
}

/// ITS-90 radiance ratio to the Ag/Au/Cu points, with both values of c2, against mpmath
/// findroot on the ITS-90 equation (Preston-Thomas 1990, section 3.3).
#[test]
fn its90_ratio_matches_mpmath() {
    let j = reference();
    for case in j.get("its90").arr() {
        let fp = match case.s("fixed_point") {
            "silver" => its90::FixedPoint::Silver,
            "gold" => its90::FixedPoint::Gold,
            "copper" => its90::FixedPoint::Copper,
            other => panic!("{other}"),
        };
        let r = its90::its90_temperature(case.f("ratio"), case.f("wavelength_m"), fp).unwrap();
        assert!(rel(r.t90_k, case.f("t90_k")) <= 1e-13, "{r:?}");
        assert!(rel(r.t_codata_c2_k, case.f("t_codata_k")) <= 1e-13, "{r:?}");
        assert!(
            (r.c2_effect_k - case.f("difference_k")).abs() <= 1e-9,
            "{r:?}"
        );
        // forward direction gives the ratio back
        let back = its90::radiance_ratio(
            r.t90_k,
            case.f("wavelength_m"),
            fp.temperature_k(),
            C2Convention::Its90,
        )
        .unwrap();
        assert!(rel(back, case.f("ratio")) <= 1e-12);
    }
}

/// Forward and inverse measurement equation with object, reflection, path and window terms on a
/// silicon-band response, against the same equation evaluated with mpmath quad signals.
#[test]
fn measurement_equation_matches_mpmath() {
    let j = reference();
    let c = j.get("measurement");
    let (wl, v) = response_of(&j, c.s("response"));
    let model = ResponseSignal::new(Response::new(&wl, &v).unwrap(), C2Convention::Codata2018);
    let w = c.get("window");
    let cond = Conditions {
        emissivity: c.f("emissivity"),
        reflected_temperature_k: c.f("reflected_temperature_k"),
        path_transmittance: c.f("path_transmittance"),
        path_temperature_k: c.f("path_temperature_k"),
        window: Some(Window {
            transmittance: w.f("transmittance"),
            reflectance: w.f("reflectance"),
            temperature_k: w.f("temperature_k"),
            reflected_temperature_k: w.f("reflected_temperature_k"),
        }),
    };
    let t = c.f("object_temperature_k");
    let s = measured_signal(&model, t, &cond).unwrap();
    assert!(
        rel(s, c.f("signal")) <= 1e-12,
        "forward {s} vs {}",
        c.f("signal")
    );
    let tb = object_temperature(&model, c.f("signal"), &cond).unwrap();
    println!("measurement: object temperature from the mpmath signal: {tb} K (true {t} K)");
    assert!((tb - t).abs() <= 1e-8, "{tb}");
}

/// Uncertainty budget: sensitivity coefficients (ours analytic by implicit differentiation,
/// oracle mpmath.diff of a 40-digit findroot solve), contributions, combined standard
/// uncertainty (JCGM 100:2008 eq. 10) and variance shares.
///
/// Hand derivation of the emissivity line (independent of both codes): with
/// F = τ(εS(T) + (1−ε)S(T_r)) + (1−τ)S(T_p) − signal, ∂T/∂ε = −τ(S(T) − S(T_r))/(τ·ε·S′(T))
/// = −(1 − S(T_r)/S(T))/(ε·d ln S/dT) — τ and the path term cancel. For the Sakuma–Hattori
/// model d ln S/dT = A·x/((AT+B)(1 − e^−x)), x = c2/(AT+B). With A = 1e-5 m, B = 1.8e-4 m·K,
/// c2 = 1.438776877504e-2 m·K: x(350 K) = 3.909720, x(295 K) = 4.596731,
/// S(350)/S(295) = expm1(4.596731)/expm1(3.909720) = 2.007972, d ln S/dT = 1.0841570e-2 K⁻¹, so
/// ∂T/∂ε = −(1 − 1/2.007972)/(0.9 × 1.0841570e-2) = −51.4465 K (evaluated with Python's `math`).
#[test]
fn uncertainty_budget_matches_mpmath() {
    let j = reference();
    let b = j.get("budget");
    let m = b.get("model");
    let p = b.get("inputs");
    let curve =
        SakumaHattori::new(m.f("a_m"), m.f("b_mk"), m.f("c"), C2Convention::Codata2018).unwrap();
    let cond = Conditions {
        emissivity: p.f("emissivity"),
        reflected_temperature_k: p.f("reflected_temperature_k"),
        path_transmittance: p.f("path_transmittance"),
        path_temperature_k: p.f("path_temperature_k"),
        window: None,
    };
    let signal = b.f("signal");
    let u = uncertainty::StandardUncertainties {
        signal: signal * p.f("u_signal_rel"),
        emissivity: p.f("u_emissivity"),
        reflected_temperature_k: p.f("u_reflected_temperature_k"),
        path_transmittance: p.f("u_path_transmittance"),
        path_temperature_k: p.f("u_path_temperature_k"),
    };
    let budget = uncertainty::uncertainty_budget(&curve, signal, &cond, &u).unwrap();
    assert!((budget.temperature_k - p.f("object_temperature_k")).abs() <= 1e-9);
    let sens = b.get("sensitivities").nums();
    let contrib = b.get("contributions_k").nums();
    let shares = b.get("shares").nums();
    let mut worst: f64 = 0.0;
    for (i, e) in budget.entries.iter().enumerate() {
        let es = rel(e.sensitivity, sens[i]);
        worst = worst.max(es);
        assert!(es <= 1e-9, "line {i}: c = {} vs {}", e.sensitivity, sens[i]);
        assert!(rel(e.contribution_k, contrib[i]) <= 1e-9, "line {i}");
        assert!((e.variance_share - shares[i]).abs() <= 1e-9, "line {i}");
    }
    let uc = budget.combined_standard_uncertainty_k;
    assert!(
        rel(uc, b.f("combined_k")) <= 1e-9,
        "u_c = {uc} vs {}",
        b.f("combined_k")
    );
    println!("budget: u_c = {uc} K, max rel err of sensitivities {worst:e}");
    // the hand derivation above
    assert!((budget.entries[1].sensitivity - -51.4465).abs() < 1e-4);
}

/// Spectral-point two-colour thermometer at 0.9/1.05 µm: temperature and both sensitivities
/// against mpmath findroot + mp.diff.
#[test]
fn two_colour_matches_mpmath() {
    let j = reference();
    let c = j.get("two_colour");
    let r = ratio::two_colour_temperature(
        c.f("wavelength1_m"),
        c.f("wavelength2_m"),
        c.f("ratio"),
        c.f("emissivity_ratio"),
        C2Convention::Codata2018,
    )
    .unwrap();
    assert!(
        (r.temperature_k - c.f("temperature_k")).abs() <= 1e-8,
        "{r:?}"
    );
    assert!(
        rel(r.d_t_d_emissivity_ratio, c.f("d_t_d_emissivity_ratio")) <= 1e-8,
        "{r:?}"
    );
    assert!(rel(r.d_t_d_ratio, c.f("d_t_d_ratio")) <= 1e-8, "{r:?}");
}

/// The rectangular-response special case: the response-weighted integral of a flat two-point
/// table (our Gauss–Legendre marching) equals the radiometric core's exact band function
/// (`band::band`, `band::band_d_dt`: closed-form series, a different algorithm) to ≤ 1e-10
/// relative (brief), and both equal the mpmath values for the flat reference tables.
#[test]
fn rectangular_band_equals_core_band_functions() {
    use quantaband::thermometry::rectangular::RectangularBand;
    let mut worst: f64 = 0.0;
    let bands = [
        (8e-6, 14e-6),
        (3e-6, 5e-6),
        (0.64e-6, 0.66e-6),
        (1e-6, 14e-6),
        (1e-6, 1000e-6),
        (50e-6, 1000e-6),
    ];
    let temps = [20.0, 77.0, 250.0, 300.0, 600.0, 1234.93, 3000.0, 6000.0];
    for (lo, hi) in bands {
        let wl = [lo, hi];
        let ones = [1.0, 1.0];
        let flat =
            ResponseSignal::new(Response::new(&wl, &ones).unwrap(), C2Convention::Codata2018);
        let exact = RectangularBand::new(lo, hi, C2Convention::Codata2018).unwrap();
        for t in temps {
            let (s, ds) = flat.signal_and_derivative(t).unwrap();
            let (e, de) = (exact.signal(t).unwrap(), exact.d_signal_dt(t).unwrap());
            if e == 0.0 {
                // below the f64 range for both
                assert_eq!(s, 0.0, "{lo}-{hi} at {t}");
                continue;
            }
            let (r1, r2) = (rel(s, e), rel(ds, de));
            worst = worst.max(r1).max(r2);
            assert!(
                r1 <= 1e-10 && r2 <= 1e-10,
                "{lo}-{hi} m at {t} K: {r1:e} {r2:e}"
            );
            // and the inverses agree
            let t_back = exact.temperature(s).unwrap();
            assert!((t_back - t).abs() <= 1e-9 * t, "{t_back} vs {t}");
        }
    }
    println!("flat table vs core band functions: max rel diff {worst:e}");
    let j = reference();
    for case in j.get("integrals").arr() {
        let name = case.s("response");
        let (wl, v) = response_of(&j, name);
        if v.iter().all(|&x| x == 1.0) && wl.len() == 2 {
            let b = RectangularBand::new(wl[0], wl[1], C2Convention::Codata2018).unwrap();
            let t = case.f("temperature_k");
            assert!(
                rel(b.signal(t).unwrap(), case.f("signal")) <= 1e-12,
                "{name} at {t}"
            );
        }
    }
}
