//! Reference tests for `quantaband::stats` against values from outside the project.
//!
//! Main oracle: mpmath 1.3.0 at mp.dps = 50, through `tests/data/gen_stats.py`, which writes
//! `tests/data/stats_reference.json` (one row per line: `["table", inputs…, expected]`). The
//! generator uses mpmath's own `expm1`, `polylog`, `zeta`, `quad` and `coth`, never our series.
//! Other sources are named beside their checks. Run with `-- --nocapture` to see the measured
//! maximum errors.

const DATA: &str = include_str!("data/stats_reference.json");

/// All rows of one table, parsed to f64 (inputs…, expected).
fn rows(table: &str) -> Vec<Vec<f64>> {
    let mut out = Vec::new();
    for line in DATA.lines() {
        let line = line.trim();
        if !line.starts_with("[\"") {
            continue;
        }
        let fields: Vec<&str> = line.split('"').skip(1).step_by(2).collect();
        if fields.first() != Some(&table) {
            continue;
        }
        let nums: Vec<f64> = fields[1..]
            .iter()
            .map(|s| s.parse().expect("number"))
            .collect();
        out.push(nums);
    }
    assert!(!out.is_empty(), "no rows for table {table}");
    out
}

/// Relative error, with exact agreement of zeros counted as 0.
fn rel(got: f64, want: f64) -> f64 {
    if got == want {
        0.0
    } else {
        ((got - want) / want).abs()
    }
}

/// Checks every row of `table` with `f`, asserts the maximum relative error ≤ `tol` and prints it.
fn check(table: &str, tol: f64, f: impl Fn(&[f64]) -> f64) -> f64 {
    check_scaled(table, tol, |_| 1.0, f)
}

/// Like [`check`], but the tolerance of a row is `tol * scale(inputs)` (for functions whose
/// condition number grows with an input), and the reported figure is `err / scale`.
fn check_scaled(
    table: &str,
    tol: f64,
    scale: impl Fn(&[f64]) -> f64,
    f: impl Fn(&[f64]) -> f64,
) -> f64 {
    let mut worst = 0.0f64;
    let mut worst_row = Vec::new();
    for r in rows(table) {
        let (inputs, want) = r.split_at(r.len() - 1);
        let got = f(inputs);
        let e = rel(got, want[0]) / scale(inputs);
        assert!(
            e <= tol,
            "{table} {inputs:?}: got {got:e}, want {:e}, rel err {e:e}",
            want[0]
        );
        if e > worst {
            worst = e;
            worst_row = inputs.to_vec();
        }
    }
    println!("{table}: max (rel err / scale) {worst:.2e} at {worst_row:?} (tol {tol:.0e})");
    worst
}

/// max(1, hf/kT) for rows whose first two inputs are (frequency_hz, temperature_k).
fn scale_x(i: &[f64]) -> f64 {
    (4.799_243_073_366_221e-11 * i[0] / i[1]).max(1.0)
}

mod occupancy {
    use super::*;
    use quantaband::stats::*;

    #[test]
    fn bose_einstein_vs_mpmath() {
        check("bose_einstein", 4.5e-16, |i| bose_einstein(i[0]).unwrap());
    }

    #[test]
    fn fermi_dirac_vs_mpmath() {
        check("fermi_dirac", 4.5e-16, |i| fermi_dirac(i[0]).unwrap());
    }

    #[test]
    fn maxwell_boltzmann_vs_mpmath() {
        check("maxwell_boltzmann", 2.3e-16, |i| {
            maxwell_boltzmann(i[0]).unwrap()
        });
    }

    #[test]
    fn thermal_photon_number_vs_mpmath() {
        // The rounding of x = hf/kT (≈ 1.5 ulp) is amplified by x on the Wien side: allow
        // 4 ulp × max(1, x).
        check_scaled("thermal_photon_number", 8.9e-16, scale_x, |i| {
            thermal_photon_number(i[0], i[1]).unwrap()
        });
    }
}
