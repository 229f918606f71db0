//! Calibration transfer and the ITS-90 fixed points against outside references:
//! - the sensitivities ∂T/∂T_i and ∂T/∂S_i of readings through a Sakuma–Hattori curve (exact
//!   through three ITS-90 fixed points; least squares through seven scattered points) and the
//!   transferred uncertainty, against mpmath (`tests/data/gen_gum.py`: the curve re-solved at
//!   50 digits for every perturbed datum, five-point differences);
//! - the property Σ_i ∂T/∂T_i = 1 (a shift of every reference temperature shifts every
//!   reading by the same amount) on many readings and point sets;
//! - ITS-90 Table 1 (Preston-Thomas, Metrologia 27, 3, 1990; values checked against the
//!   transcription at its-90.com) and the fixed-point curve's interpolation error.
//!
//! `cargo test --test gum_calibration -- --nocapture` prints the measured figures.

use quantaband::constants::C2Convention;
use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
use quantaband::thermometry::its90::{fixed_point_curve, its90_temperature, FixedPoint};
use quantaband::thermometry::model::{SignalModel, SpectralPoint};
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;
use serde_json::Value;

fn data() -> Value {
    serde_json::from_str(include_str!("data/gum_reference.json")).expect("json")
}

fn rel(got: f64, want: f64) -> f64 {
    if got == want {
        0.0
    } else {
        ((got - want) / want).abs()
    }
}

#[test]
fn calibration_transfer_matches_mpmath() {
    let d = data();
    for case in d["calibration"].as_array().unwrap() {
        let c2 = if case["c2"] == "its90" {
            C2Convention::Its90
        } else {
            C2Convention::Codata2018
        };
        let pts: Vec<ReferencePoint> = case["points"]
            .as_array()
            .unwrap()
            .iter()
            .map(|p| ReferencePoint {
                temperature_k: p["temperature_k"].as_f64().unwrap(),
                signal: p["signal"].as_f64().unwrap(),
                u_temperature_k: p["u_temperature_k"].as_f64().unwrap(),
                u_signal: p["u_signal"].as_f64().unwrap(),
            })
            .collect();
        let cal = CalibrationTransfer::fit(&pts, c2).unwrap();
        // covariance of (A, B, C): entries relative to √(V_aa·V_bb)
        let v = cal.parameter_covariance();
        let want = &case["parameter_covariance"];
        let mut w_cov: f64 = 0.0;
        for a in 0..3 {
            for b in 0..3 {
                let w = want[a][b].as_f64().unwrap();
                let scale = (want[a][a].as_f64().unwrap() * want[b][b].as_f64().unwrap()).sqrt();
                w_cov = w_cov.max((v[a][b] - w).abs() / scale);
            }
        }
        assert!(w_cov < 1e-11, "{} covariance {w_cov:e}", case["name"]);
        let corr = cal.parameter_correlation();
        for (a, row) in corr.iter().enumerate() {
            assert!((row[a] - 1.0).abs() < 1e-12);
        }
        let curve = &case["curve"];
        assert!(rel(cal.curve().a_m(), curve["a_m"].as_f64().unwrap()) < 1e-9);
        assert!(rel(cal.curve().c(), curve["c"].as_f64().unwrap()) < 1e-7);
        let n = pts.len();
        let (mut w_t, mut w_s, mut w_u, mut w_sum): (f64, f64, f64, f64) = (0.0, 0.0, 0.0, 0.0);
        for rd in case["readings"].as_array().unwrap() {
            let mut dtt = vec![0.0; n];
            let mut dts = vec![0.0; n];
            let r = cal
                .reading(
                    rd["signal"].as_f64().unwrap(),
                    0.0,
                    Some(&mut dtt),
                    Some(&mut dts),
                )
                .unwrap();
            assert!((r.temperature_k - rd["temperature_k"].as_f64().unwrap()).abs() < 1e-8);
            // sensitivities are compared relative to the largest one of the reading
            let want_t: Vec<f64> = rd["d_t_d_reference_temperatures"]
                .as_array()
                .unwrap()
                .iter()
                .map(|v| v.as_f64().unwrap())
                .collect();
            let want_s: Vec<f64> = rd["d_t_d_reference_signals"]
                .as_array()
                .unwrap()
                .iter()
                .map(|v| v.as_f64().unwrap())
                .collect();
            let scale_t = want_t.iter().fold(0.0f64, |m, v| m.max(v.abs()));
            let scale_s = want_s.iter().fold(0.0f64, |m, v| m.max(v.abs()));
            for i in 0..n {
                w_t = w_t.max((dtt[i] - want_t[i]).abs() / scale_t);
                w_s = w_s.max((dts[i] - want_s[i]).abs() / scale_s);
            }
            w_u = w_u.max(rel(
                r.u_calibration_k,
                rd["u_calibration_k"].as_f64().unwrap(),
            ));
            w_sum = w_sum.max((r.sum_d_t_d_reference_temperatures - 1.0).abs());
            assert!((dtt.iter().sum::<f64>() - 1.0).abs() < 1e-9);
        }
        println!(
            "{}: dT/dT_i {w_t:.1e}, dT/dS_i {w_s:.1e} (relative to the largest), u_cal {w_u:.1e} \
             relative, covariance {w_cov:.1e}; |sum dT/dT_i - 1| {w_sum:.1e}",
            case["name"]
        );
        assert!(
            w_t < 1e-11 && w_s < 1e-11 && w_u < 1e-11,
            "{}",
            case["name"]
        );
    }
}

#[test]
fn reference_temperature_sensitivities_sum_to_one() {
    // Many readings, inside and outside the calibrated range, for exact three-point curves
    // and noisy least-squares fits.
    let truth = SakumaHattori::new(3.9e-6, 2e-8, 5e4, C2Convention::Codata2018).unwrap();
    let mut worst: f64 = 0.0;
    for (set, temps) in [
        vec![500.0, 800.0, 1200.0],
        vec![300.0, 310.0, 320.0],
        vec![400.0, 450.0, 600.0, 750.0, 900.0, 1000.0, 1300.0, 1500.0],
    ]
    .into_iter()
    .enumerate()
    {
        let pts: Vec<ReferencePoint> = temps
            .iter()
            .enumerate()
            .map(|(i, &t)| {
                // deterministic scatter of up to ±30 mK for the least-squares set
                let scatter = if temps.len() > 3 {
                    0.03 * ((i as f64 * 2.3).sin())
                } else {
                    0.0
                };
                ReferencePoint {
                    temperature_k: t,
                    signal: truth.signal(t + scatter).unwrap(),
                    u_temperature_k: 0.01 * (1.0 + i as f64),
                    u_signal: 0.0,
                }
            })
            .collect();
        let cal = CalibrationTransfer::fit(&pts, C2Convention::Codata2018).unwrap();
        let mut w = vec![0.0; pts.len()];
        for k in 0..60 {
            let t = 200.0 + 30.0 * k as f64;
            let s = truth.signal(t).unwrap();
            cal.reading(s, 0.0, Some(&mut w), None).unwrap();
            // Far extrapolation makes the individual sensitivities large (Σ|w_i| up to 4e4
            // for 300–320 K points read at 1970 K): the sum is exact to rounding relative to
            // them.
            let size = w.iter().map(|x| x.abs()).sum::<f64>().max(1.0);
            let e = (w.iter().sum::<f64>() - 1.0).abs() / size;
            worst = worst.max(e);
            assert!(e < 1e-11, "set {set}, {t} K: {e:e}");
        }
    }
    println!("sum of dT/dT_i over 180 readings: max |sum - 1|/max(1, sum|w_i|) = {worst:.1e}");
}

#[test]
fn its90_table_1_fixed_points() {
    // Preston-Thomas (1990), Table 1: T90/K and t90/°C of the freezing points In…Cu
    let table = [
        (FixedPoint::Indium, 429.7485, 156.5985),
        (FixedPoint::Tin, 505.078, 231.928),
        (FixedPoint::Zinc, 692.677, 419.527),
        (FixedPoint::Aluminium, 933.473, 660.323),
        (FixedPoint::Silver, 1234.93, 961.78),
        (FixedPoint::Gold, 1337.33, 1064.18),
        (FixedPoint::Copper, 1357.77, 1084.62),
    ];
    assert_eq!(FixedPoint::ALL.len(), table.len());
    for (fp, k, c) in table {
        assert_eq!(fp.temperature_k(), k);
        assert_eq!(fp.temperature_c(), c);
        assert!((k - 273.15 - c).abs() < 1e-9);
        assert_eq!(fp.defines_ratio_relation(), k >= 1234.93);
    }
}

#[test]
fn its90_ratio_relation_flags_results_below_silver() {
    let r = its90_temperature(0.2, 650e-9, FixedPoint::Silver).unwrap();
    assert!(r.below_silver_point && r.t90_k < 1234.93);
    let r = its90_temperature(5.0, 650e-9, FixedPoint::Silver).unwrap();
    assert!(!r.below_silver_point);
    // below-silver fixed points are not references of the relation
    for fp in [
        FixedPoint::Indium,
        FixedPoint::Tin,
        FixedPoint::Zinc,
        FixedPoint::Aluminium,
    ] {
        assert_eq!(
            its90_temperature(2.0, 650e-9, fp).unwrap_err().code(),
            "UNSUPPORTED"
        );
    }
}

#[test]
fn fixed_point_curves_and_their_interpolation_error() {
    // A single-wavelength instrument is exactly a Sakuma–Hattori curve (B = 0): zero error.
    let point = SpectralPoint::new(650e-9, C2Convention::Its90).unwrap();
    let c = fixed_point_curve(
        &point,
        [FixedPoint::Copper, FixedPoint::Zinc, FixedPoint::Aluminium],
        C2Convention::Its90,
    )
    .unwrap();
    assert_eq!(
        c.fixed_points,
        [FixedPoint::Zinc, FixedPoint::Aluminium, FixedPoint::Copper]
    );
    let e = c.interpolation_errors(&point, 500.0, 3000.0, 300).unwrap();
    assert!(e.between.max_abs_error_k < 1e-6 && e.above.unwrap().max_abs_error_k < 1e-5);
    // Finite bands: the curve passes through the three points; error between and beyond.
    for (name, wl, r, fps, lo, hi) in [
        (
            "20 nm at 650 nm, Zn-Al-Cu",
            [640e-9, 660e-9],
            [1.0, 1.0],
            [FixedPoint::Zinc, FixedPoint::Aluminium, FixedPoint::Copper],
            600.0,
            2500.0,
        ),
        (
            "1.5-1.7 um, In-Zn-Al",
            [1.5e-6, 1.7e-6],
            [1.0, 1.0],
            [FixedPoint::Indium, FixedPoint::Zinc, FixedPoint::Aluminium],
            400.0,
            1400.0,
        ),
        (
            "8-14 um, In-Sn-Zn",
            [8e-6, 14e-6],
            [1.0, 1.0],
            [FixedPoint::Indium, FixedPoint::Tin, FixedPoint::Zinc],
            300.0,
            1000.0,
        ),
    ] {
        let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Its90);
        let c = fixed_point_curve(&model, fps, C2Convention::Its90).unwrap();
        for (fp, s) in c.fixed_points.iter().zip(c.signals) {
            assert!((c.curve.temperature(s).unwrap() - fp.temperature_k()).abs() < 1e-9);
        }
        let e = c.interpolation_errors(&model, lo, hi, 400).unwrap();
        let below = e.below.unwrap();
        let above = e.above.unwrap();
        println!(
            "{name}: between {:.3e} K (at {:.1} K), below {:.3e} K (at {:.1} K), above {:.3e} K \
             (at {:.1} K)",
            e.between.max_abs_error_k,
            e.between.at_temperature_k,
            below.max_abs_error_k,
            below.at_temperature_k,
            above.max_abs_error_k,
            above.at_temperature_k
        );
        assert!(e.between.max_abs_error_k < above.max_abs_error_k);
    }
}
