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

mod fermi_dirac_integrals {
    use super::*;
    use quantaband::stats::*;

    #[test]
    fn fermi_dirac_integral_vs_mpmath() {
        check("fermi_dirac_integral", 1e-15, |i| {
            fermi_dirac_integral(FdOrder::from_j(i[0]).unwrap(), i[1]).unwrap()
        });
    }

    #[test]
    fn inverse_fermi_dirac_half_recovers_eta() {
        // Input: mpmath's F_{1/2}(η) rounded to f64; output must be η. Absolute error in η is
        // what a relative error in F maps to for η ≤ 1 (dη = dF/F · F/F'), relative above.
        let mut worst = 0.0f64;
        for r in rows("fermi_dirac_integral") {
            let (j, eta, f) = (r[0], r[1], r[2]);
            if j != 0.5 || !(-50.0..=1e6).contains(&eta) {
                continue;
            }
            let got = inverse_fermi_dirac_half(f).unwrap();
            let err = (got - eta).abs() / eta.abs().max(1.0);
            assert!(err <= 1e-15, "eta {eta}: got {got}, err {err:e}");
            worst = worst.max(err);
        }
        println!(
            "inverse_fermi_dirac_half: max error in eta (abs, or rel above |eta| = 1) {worst:.2e}"
        );
    }

    /// F_{1/2}(0) = (1 − 2^{−1/2})·ζ(3/2) (DLMF §25.12(iii) with η(s) = (1 − 2^{1−s})ζ(s),
    /// DLMF §25.2; equation numbers from memory), with ζ(3/2) = 2.612375348685488343… (mpmath `zeta(1.5)`, 50 digits).
    #[test]
    fn f_half_at_zero_closed_form() {
        let want = (1.0 - core::f64::consts::FRAC_1_SQRT_2) * 2.612_375_348_685_488;
        let got = fermi_dirac_integral(FdOrder::Half, 0.0).unwrap();
        assert!((got / want - 1.0).abs() < 4e-16, "{got} vs {want}");
    }

    /// Blakemore (1982), tables of the normalised F_{1/2}: F_{1/2}(1) = 1.57564 (from memory,
    /// 6 significant digits, so tolerance 5e-6 relative).
    #[test]
    fn f_half_blakemore_row_from_memory() {
        let got = fermi_dirac_integral(FdOrder::Half, 1.0).unwrap();
        assert!((got / 1.575_64 - 1.0).abs() < 5e-6, "{got}");
    }
}

mod bose_einstein_integrals {
    use super::*;
    use quantaband::constants::{ATOMIC_MASS_U, ELECTRON_MASS};
    use quantaband::stats::*;

    #[test]
    fn bose_einstein_integral_vs_mpmath() {
        check("bose_einstein_integral", 1e-15, |i| {
            bose_einstein_integral(BoseOrder::from_s(i[0]).unwrap(), i[1]).unwrap()
        });
    }

    /// ζ values: mpmath rows, and the published digits ζ(3/2) = 2.612375348685488…,
    /// ζ(5/2) = 1.341487257250917…, ζ(3) = 1.202056903159594… (DLMF §25.6 / Table in
    /// Abramowitz & Stegun 23.3 for ζ(3); from memory to the printed 16 digits).
    #[test]
    fn zeta_values() {
        check("zeta", 4.5e-16, |i| {
            bose_einstein_integral(BoseOrder::from_s(i[0]).unwrap(), 1.0).unwrap()
        });
        let g = |o| bose_einstein_integral(o, 1.0).unwrap();
        assert!((g(BoseOrder::ThreeHalves) - 2.612_375_348_685_488).abs() < 2e-15);
        assert!((g(BoseOrder::FiveHalves) - 1.341_487_257_250_917).abs() < 2e-15);
        assert!((g(BoseOrder::Integer(3)) - 1.202_056_903_159_594).abs() < 2e-15);
        // ζ(2) = π²/6, ζ(4) = π⁴/90 (Euler; DLMF §25.6, from memory)
        let pi = core::f64::consts::PI;
        assert!((g(BoseOrder::Integer(2)) / (pi * pi / 6.0) - 1.0).abs() < 4.5e-16);
        assert!((g(BoseOrder::Integer(4)) / (pi.powi(4) / 90.0) - 1.0).abs() < 4.5e-16);
    }

    #[test]
    fn critical_temperature_vs_mpmath() {
        check("bose_critical_temperature_u", 1e-15, |i| {
            bose_critical_temperature(i[0], i[1] * ATOMIC_MASS_U).unwrap()
        });
        check("bose_critical_temperature_me", 1e-15, |i| {
            bose_critical_temperature(i[0], ELECTRON_MASS).unwrap()
        });
    }
}

mod photon_gas {
    use super::*;
    use quantaband::stats::*;

    #[test]
    fn noise_and_brightness_temperatures_vs_mpmath() {
        check_scaled("rayleigh_jeans_temperature", 1e-15, scale_x, |i| {
            rayleigh_jeans_brightness_temperature(i[0], i[1]).unwrap()
        });
        check("quantum_noise_temperature", 1e-15, |i| {
            quantum_noise_temperature(i[0], i[1]).unwrap()
        });
    }

    /// Inverting mpmath's T_RJ (rounded to f64) must give back T.
    #[test]
    fn rayleigh_jeans_inverse_vs_mpmath() {
        let mut worst = 0.0f64;
        for r in rows("rayleigh_jeans_temperature") {
            let (f, t, t_rj) = (r[0], r[1], r[2]);
            if t_rj < f64::MIN_POSITIVE {
                continue; // T_RJ itself underflows in f64: nothing to invert
            }
            let got = physical_temperature_from_rayleigh_jeans(f, t_rj).unwrap();
            let e = rel(got, t) / scale_x(&[f, t]);
            assert!(e <= 1e-15, "f={f} T={t}: got {got}");
            worst = worst.max(e);
        }
        println!("physical_temperature_from_rayleigh_jeans: max (rel err / scale) {worst:.2e}");
    }

    #[test]
    fn blackbody_gas_vs_mpmath() {
        check("photon_number_density", 4.5e-16, |i| {
            photon_number_density(i[0]).unwrap()
        });
        check("photon_energy_density", 6.7e-16, |i| {
            photon_energy_density(i[0]).unwrap()
        });
        check("photon_entropy_density", 4.5e-16, |i| {
            photon_entropy_density(i[0]).unwrap()
        });
        check("photon_pressure", 6.7e-16, |i| {
            photon_pressure(i[0]).unwrap()
        });
        check("mean_photon_energy", 2.3e-16, |i| {
            mean_photon_energy(i[0]).unwrap()
        });
    }

    #[test]
    fn density_of_states_and_spectral_density_vs_mpmath() {
        check("photon_density_of_states", 6.7e-16, |i| {
            photon_density_of_states(i[0]).unwrap()
        });
        // Scale by max(1, E/kT): the rounding of x is amplified on the Wien side.
        check_scaled(
            "spectral_energy_density_energy",
            1e-15,
            |i| (i[0] / (1.380_649e-23 * i[1])).max(1.0),
            |i| spectral_energy_density_energy(i[0], i[1]).unwrap(),
        );
    }

    /// The radiation constant: u = aT⁴ with a = 7.565 733 250 280 00(47)e-16 J m⁻³ K⁻⁴ is the
    /// CODATA 2018 value derived from σ (4σ/c; CODATA 2018, σ = 5.670 374 419…e-8 W m⁻² K⁻⁴).
    #[test]
    fn energy_density_codata_sigma() {
        let sigma = 5.670_374_419e-8; // CODATA 2018, printed digits
        let u = photon_energy_density(1000.0).unwrap();
        assert!((u / (4.0 * sigma / 299_792_458.0 * 1e12) - 1.0).abs() < 1e-10);
    }
}
