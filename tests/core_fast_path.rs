//! The direct (fast) evaluation of the spectral densities against mpmath.
//!
//! Reference: `tests/data/fast_path_reference.json`, written by `tests/data/gen_fast_path.py`
//! (mpmath 1.3.0 at 40 digits, closed-form Planck's law with mpmath's exp/expm1, SI defining
//! constants h, c, k and c2 = hc/k; inputs are the exact f64 values). Each reference value is
//! stored as hi + lo so errors below one ulp are measured, not rounded away.
//!
//! Bound (a-priori analysis in `src/planck.rs`, `Direct::point`, and DEVELOPERS.md "Radiometric
//! core"): for ln 2 ≤ x < 700 the direct path's relative error is at most 13·2⁻⁵³ (1.5e-15) from
//! the operations plus 4·2⁻⁵³·x from the rounding of x (and of c2) amplified by eˣ/(eˣ − 1) ≤ 2;
//! the other paths keep the bound of `tests/core_reference.rs` (5e-15 + 2.5e-16·x).
//! Run with `-- --nocapture` to print the measured maxima.

use quantaband::planck::{Geometry, Quantity, SpectralVariable, Spectrum};

const DATA: &str = include_str!("data/fast_path_reference.json");

/// Relative error of `y` against the reference hi + lo.
fn rel(y: f64, hi: f64, lo: f64) -> f64 {
    ((y - hi) - lo).abs() / hi
}

fn bound_direct(x: f64) -> f64 {
    1.5e-15 + 4.5e-16 * x
}

fn bound_other(x: f64) -> f64 {
    5e-15 + 2.5e-16 * x
}

fn json() -> serde_json::Value {
    serde_json::from_str(DATA).expect("fast_path_reference.json parses")
}

fn num(v: &serde_json::Value) -> f64 {
    v.as_f64().expect("a number")
}

/// The 10 000-point spectrum of the benches (1–20 µm, 1000 K), every point.
#[test]
fn bench_grid_against_mpmath() {
    let d = json();
    let n = num(&d["bench_count"]) as usize;
    let (first, last) = (num(&d["bench_first_m"]), num(&d["bench_last_m"]));
    let t = num(&d["bench_temperature_k"]);
    let step = (last - first) / (n - 1) as f64;
    let rows = d["bench"].as_array().expect("bench rows");
    assert_eq!(rows.len(), n);
    let spec = Spectrum::default();
    let (mut worst, mut at) = (0.0f64, 0.0);
    for (i, r) in rows.iter().enumerate() {
        let lam = first + i as f64 * step;
        let y = spec.spectral(lam, t).unwrap();
        let e = rel(y, num(&r[0]), num(&r[1]));
        let x = quantaband::constants::C2 / (lam * t);
        assert!(
            e <= bound_direct(x),
            "lambda {lam:e} m: {y:e}, relative error {e:.3e} > {:.3e}",
            bound_direct(x)
        );
        if e > worst {
            (worst, at) = (e, lam);
        }
    }
    println!("bench grid: {n} points, max relative error {worst:.3e} at {at:e} m");
}

/// 3 000 seeded points over every spectral variable and quantity, x from 1e-3 to 690.
#[test]
fn spread_against_mpmath() {
    let d = json();
    let rows = d["spread"].as_array().expect("spread rows");
    assert_eq!(rows.len(), 3000);
    let (mut worst_direct, mut worst_other, mut n_direct) = (0.0f64, 0.0f64, 0usize);
    for r in rows {
        let variable = match r[0].as_str().unwrap() {
            "l" => SpectralVariable::Wavelength,
            "n" => SpectralVariable::Wavenumber,
            _ => SpectralVariable::Frequency,
        };
        let quantity = match r[1].as_str().unwrap() {
            "e" => Quantity::Energy,
            _ => Quantity::Photon,
        };
        let (v, t, x) = (num(&r[2]), num(&r[3]), num(&r[4]));
        let y = Spectrum::new(variable, quantity, Geometry::Radiance)
            .spectral(v, t)
            .unwrap();
        let e = rel(y, num(&r[5]), num(&r[6]));
        // x as the oracle computed it; the direct path is taken from ln 2 up (within an ulp).
        let direct = x > 0.6932;
        let b = if direct {
            bound_direct(x)
        } else {
            bound_other(x)
        };
        assert!(
            e <= b,
            "{variable:?} {quantity:?} v {v:e}, T {t:e} K (x {x:e}): {y:e}, relative error {e:.3e} > {b:.3e}"
        );
        if direct {
            n_direct += 1;
            worst_direct = worst_direct.max(e / (1.0 + x));
        } else {
            worst_other = worst_other.max(e);
        }
    }
    assert!(
        n_direct > 1200,
        "the direct path is exercised ({n_direct} rows)"
    );
    println!(
        "spread: {n_direct} rows with x >= ln 2, max relative error / (1 + x) {worst_direct:.3e}; \
         {} rows below, max relative error {worst_other:.3e}",
        rows.len() - n_direct
    );
}
