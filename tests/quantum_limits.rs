//! Limiting cases, identities, published values and typed errors for multi-wavelength
//! pyrometry, Raman and Y-factor thermometry and semiconductor carrier statistics (issue 18).
//! The numerical oracle comparisons are in `tests/quantum_reference.rs`; each check here names
//! its source (a limit of the formulas, or a handbook value "from memory").

use quantaband::constants::{C2Convention, BOLTZMANN_K, PLANCK_H};
use quantaband::planck::spectral_radiance_wavelength;
use quantaband::stats::{
    band_carrier_density, effective_density_of_states, varshni_band_gap, y_factor,
    y_factor_noise_temperature, LoadNoiseModel, Semiconductor,
};
use quantaband::thermometry::multiwavelength::{
    multiwavelength_fit, multiwavelength_fit_channels, EmissivityModel, MultiwavelengthOptions,
};
use quantaband::thermometry::raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
};
use quantaband::thermometry::ratio::two_colour_temperature;
use quantaband::thermometry::SpectralPoint;

const EV: f64 = 1.602_176_634e-19;

fn opts(model: EmissivityModel) -> MultiwavelengthOptions {
    MultiwavelengthOptions {
        model,
        ..Default::default()
    }
}

fn grey_data(wl: &[f64], t: f64, eps: f64) -> (Vec<f64>, Vec<f64>) {
    let l: Vec<f64> = wl
        .iter()
        .map(|&w| eps * spectral_radiance_wavelength(w, t).unwrap())
        .collect();
    let u = l.iter().map(|v| 0.003 * v).collect();
    (l, u)
}

mod multiwavelength {
    use super::*;

    /// Limit: a constant-emissivity model on grey data returns the grey answer (the true T
    /// and ε for every N; for N = 2 exactly the two-colour temperature).
    #[test]
    fn constant_model_returns_the_grey_answer() {
        let all = [0.6e-6, 0.7e-6, 0.8e-6, 0.9e-6, 1.0e-6, 1.1e-6];
        for n in 2..=all.len() {
            for &t in &[700.0, 1500.0, 3200.0] {
                let wl = &all[..n];
                let (l, u) = grey_data(wl, t, 0.42);
                let mut tb = vec![0.0; n];
                for model in [
                    EmissivityModel::GREY,
                    EmissivityModel::LogPolynomial { order: 0 },
                ] {
                    let fit = multiwavelength_fit(
                        wl,
                        &l,
                        &u,
                        C2Convention::Codata2018,
                        &opts(model),
                        &mut tb,
                    )
                    .unwrap();
                    assert!((fit.temperature_k / t - 1.0).abs() < 1e-12, "{n} {t}");
                    assert!((fit.emissivity(0.75e-6).unwrap() - 0.42).abs() < 1e-11);
                    assert!(!fit.ill_conditioned);
                    let tc = fit.grey_two_colour_temperature_k.unwrap();
                    assert!((tc / t - 1.0).abs() < 1e-12);
                }
                if n == 2 {
                    let rd = two_colour_temperature(
                        wl[0],
                        wl[1],
                        l[0] / l[1],
                        1.0,
                        C2Convention::Codata2018,
                    )
                    .unwrap();
                    let fit = multiwavelength_fit(
                        wl,
                        &l,
                        &u,
                        C2Convention::Codata2018,
                        &opts(EmissivityModel::GREY),
                        &mut tb,
                    )
                    .unwrap();
                    assert!((fit.temperature_k / rd.temperature_k - 1.0).abs() < 1e-13);
                }
            }
        }
    }

    /// Identity: the channel-model entry with spectral-point channels is the spectral entry.
    #[test]
    fn channels_entry_agrees_with_spectral_entry() {
        let wl = [0.7e-6, 0.825e-6, 0.95e-6, 1.075e-6, 1.2e-6];
        let noise = [0.004, -0.003, 0.001, 0.005, -0.004];
        let l: Vec<f64> = wl
            .iter()
            .zip(noise)
            .map(|(&w, e)| {
                let u: f64 = (w - 0.95e-6) / 0.25e-6;
                (-0.6 - 0.3 * u).exp()
                    * spectral_radiance_wavelength(w, 1400.0).unwrap()
                    * (1.0 + e)
            })
            .collect();
        let u: Vec<f64> = l.iter().map(|v| 0.005 * v).collect();
        let pts: Vec<SpectralPoint> = wl
            .iter()
            .map(|&w| SpectralPoint::new(w, C2Convention::Codata2018).unwrap())
            .collect();
        let o = opts(EmissivityModel::LOG_LINEAR);
        let (mut tb1, mut tb2) = ([0.0; 5], [0.0; 5]);
        let a = multiwavelength_fit(&wl, &l, &u, C2Convention::Codata2018, &o, &mut tb1).unwrap();
        let b = multiwavelength_fit_channels(&pts, &wl, &l, &u, &o, &mut tb2).unwrap();
        assert!((a.temperature_k / b.temperature_k - 1.0).abs() < 1e-12);
        assert!((a.u_temperature_k / b.u_temperature_k - 1.0).abs() < 1e-9);
        assert_eq!(tb1, tb2);
    }

    /// Noise-free data of the fitted form are recovered for every model and order the data
    /// can determine (the emissivity kept inside (0, 1)).
    #[test]
    fn exact_data_recovered() {
        let wl = [
            0.55e-6, 0.65e-6, 0.75e-6, 0.85e-6, 0.95e-6, 1.05e-6, 1.15e-6,
        ];
        let (c, h) = (0.85e-6, 0.3e-6);
        let coef: [f64; 5] = [0.45, -0.08, 0.03, -0.01, 0.005];
        for order in 0..=4u8 {
            for log in [false, true] {
                let model = if log {
                    EmissivityModel::LogPolynomial { order }
                } else {
                    EmissivityModel::Polynomial { order }
                };
                let l: Vec<f64> = wl
                    .iter()
                    .map(|&w| {
                        let u: f64 = (w - c) / h;
                        let mut s = 0.0f64;
                        for (k, a) in coef.iter().enumerate().take(order as usize + 1) {
                            s += a * u.powi(k as i32);
                        }
                        let e = if log { (s - 1.2).exp() } else { s };
                        e * spectral_radiance_wavelength(w, 2000.0).unwrap()
                    })
                    .collect();
                let u: Vec<f64> = l.iter().map(|v| 1e-3 * v).collect();
                let mut tb = [0.0; 7];
                let fit = multiwavelength_fit(
                    &wl,
                    &l,
                    &u,
                    C2Convention::Codata2018,
                    &opts(model),
                    &mut tb,
                )
                .unwrap_or_else(|e| panic!("{model:?}: {e}"));
                // the error grows with the inflation factor (rounding of the data amplified)
                let tol = 1e-13 * fit.uncertainty_inflation.max(1.0) * 100.0;
                assert!(
                    (fit.temperature_k / 2000.0 - 1.0).abs() < tol,
                    "{model:?}: {} (tol {tol:e})",
                    fit.temperature_k
                );
                assert!(fit.chi_squared < 1e-12, "{model:?}");
                assert_eq!(fit.degrees_of_freedom, 7 - (order as usize + 2));
            }
        }
    }

    /// Typed errors: fewer channels than unknowns, bad slices, an order beyond the maximum.
    #[test]
    fn typed_errors() {
        let wl = [0.7e-6, 0.8e-6, 0.9e-6];
        let (l, u) = grey_data(&wl, 1500.0, 0.5);
        let mut tb = [0.0; 3];
        let c = C2Convention::Codata2018;
        let e = multiwavelength_fit(
            &wl,
            &l,
            &u,
            c,
            &opts(EmissivityModel::Polynomial { order: 2 }),
            &mut tb,
        )
        .unwrap_err();
        assert_eq!(e.code(), "TOO_FEW_POINTS");
        let e = multiwavelength_fit(
            &wl[..1],
            &l[..1],
            &u[..1],
            c,
            &opts(EmissivityModel::GREY),
            &mut tb[..1],
        )
        .unwrap_err();
        assert_eq!(e.code(), "TOO_FEW_POINTS");
        let e = multiwavelength_fit(&wl, &l, &u, c, &opts(EmissivityModel::GREY), &mut tb[..2])
            .unwrap_err();
        assert_eq!(e.code(), "LENGTH_MISMATCH");
        let rev = [0.9e-6, 0.8e-6, 0.7e-6];
        let e = multiwavelength_fit(&rev, &l, &u, c, &opts(EmissivityModel::GREY), &mut tb)
            .unwrap_err();
        assert_eq!(e.code(), "NOT_INCREASING");
        let e = multiwavelength_fit(
            &wl,
            &l,
            &u,
            c,
            &opts(EmissivityModel::LogPolynomial { order: 9 }),
            &mut tb,
        )
        .unwrap_err();
        assert_eq!(e.code(), "UNSUPPORTED");
        let nan = [l[0], f64::NAN, l[2]];
        let e = multiwavelength_fit(&wl, &nan, &u, c, &opts(EmissivityModel::GREY), &mut tb)
            .unwrap_err();
        assert_eq!(e.code(), "NON_FINITE");
        let pts = [SpectralPoint::new(0.7e-6, c).unwrap()];
        let e =
            multiwavelength_fit_channels(&pts, &wl, &l, &u, &opts(EmissivityModel::GREY), &mut tb)
                .unwrap_err();
        assert_eq!(e.code(), "LENGTH_MISMATCH");
    }
}

mod raman {
    use super::*;

    /// Limits: R → F as T → ∞; R = F·e^{−θ/T} exactly; the energy and photon-counting
    /// ratios differ by exactly one factor ν̃_aS/ν̃_S.
    #[test]
    fn limits_and_identities() {
        let (shift, lam) = (52_070.0, 532e-9);
        let fe = raman_frequency_factor(shift, lam, RamanDetection::Energy).unwrap();
        let fp = raman_frequency_factor(shift, lam, RamanDetection::PhotonCounting).unwrap();
        let nl = 1.0 / lam;
        assert!((fe / fp / ((nl + shift) / (nl - shift)) - 1.0).abs() < 1e-15);
        for &t in &[50.0, 300.0, 3000.0] {
            let re = anti_stokes_stokes_ratio(shift, lam, t, RamanDetection::Energy).unwrap();
            let rp =
                anti_stokes_stokes_ratio(shift, lam, t, RamanDetection::PhotonCounting).unwrap();
            assert!((re / rp / (fe / fp) - 1.0).abs() < 1e-15);
        }
        let r = anti_stokes_stokes_ratio(shift, lam, 1e12, RamanDetection::Energy).unwrap();
        assert!((r / fe - 1.0).abs() < 1e-9);
        // dT/dR from the reading agrees with a central difference of the forward function
        let rd = raman_temperature(shift, lam, 0.05, RamanDetection::Energy).unwrap();
        let h = 1e-6;
        let tp = raman_temperature(shift, lam, 0.05 + h, RamanDetection::Energy).unwrap();
        let tm = raman_temperature(shift, lam, 0.05 - h, RamanDetection::Energy).unwrap();
        let num = (tp.temperature_k - tm.temperature_k) / (2.0 * h);
        assert!((rd.d_t_d_ratio / num - 1.0).abs() < 1e-7);
        // the occupancy reported is the Bose–Einstein value at that temperature
        let x = rd.mode_temperature_k / rd.temperature_k;
        assert!((rd.phonon_occupancy * x.exp_m1() - 1.0).abs() < 1e-14);
    }

    /// Typed errors: a ratio ≤ 0, a ratio at or above the frequency factor, a shift beyond
    /// the excitation wavenumber.
    #[test]
    fn typed_errors() {
        let d = RamanDetection::PhotonCounting;
        for r in [0.0, -1.0] {
            assert_eq!(
                raman_temperature(52_070.0, 532e-9, r, d)
                    .unwrap_err()
                    .code(),
                "NON_POSITIVE"
            );
        }
        let f = raman_frequency_factor(52_070.0, 532e-9, d).unwrap();
        assert_eq!(
            raman_temperature(52_070.0, 532e-9, f, d)
                .unwrap_err()
                .code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            raman_temperature(2e6, 532e-9, 0.1, d).unwrap_err().code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            raman_temperature(52_070.0, 532e-9, f64::NAN, d)
                .unwrap_err()
                .code(),
            "NON_FINITE"
        );
    }
}

mod noise_source {
    use super::*;

    /// Limit: with Planck (and Callen–Welton) loads the Y-factor result tends to the
    /// Rayleigh–Jeans one as hν/kT → 0; the difference Planck − RJ tends to +hf/2k, and
    /// Callen–Welton − Planck is −hf/2k exactly (Kerr 1999).
    #[test]
    fn planck_tends_to_rayleigh_jeans() {
        let (th, tc, y) = (295.0, 77.0, 2.5);
        let mut last = f64::INFINITY;
        for &f in &[1e12, 1e11, 1e10, 1e9, 1e8, 1e6, 1e3] {
            let r = y_factor_noise_temperature(y, th, tc, f, LoadNoiseModel::Planck).unwrap();
            let half = 0.5 * PLANCK_H * f / BOLTZMANN_K;
            let gap = (r.planck_k - r.rayleigh_jeans_k).abs() / r.rayleigh_jeans_k;
            assert!(gap < last, "{f}");
            last = gap;
            assert!((r.callen_welton_k - r.planck_k + half).abs() < 1e-12 * r.planck_k);
            if f <= 1e9 {
                // first order: T_R(P) − T_R(RJ) = hf/2k (1 + O(hf/kT))
                assert!(
                    (r.planck_minus_rayleigh_jeans_k / half - 1.0).abs() < 1e-2,
                    "{f}"
                );
            }
        }
        assert!(last < 1e-9);
    }

    /// Round trip, the quantum-limit identity and typed errors (Y ≤ 1, Y too large, loads in
    /// the wrong order).
    #[test]
    fn round_trip_and_errors() {
        for m in [
            LoadNoiseModel::RayleighJeans,
            LoadNoiseModel::Planck,
            LoadNoiseModel::CallenWelton,
        ] {
            for &f in &[1e9, 100e9, 500e9] {
                let y = y_factor(35.0, 300.0, 20.0, f, m).unwrap();
                let r = y_factor_noise_temperature(y, 300.0, 20.0, f, m).unwrap();
                assert!((r.receiver_noise_temperature_k / 35.0 - 1.0).abs() < 1e-13);
                // dT/dY against a central difference
                let h = 1e-7;
                let up = y_factor_noise_temperature(y + h, 300.0, 20.0, f, m).unwrap();
                let dn = y_factor_noise_temperature(y - h, 300.0, 20.0, f, m).unwrap();
                let num =
                    (up.receiver_noise_temperature_k - dn.receiver_noise_temperature_k) / (2.0 * h);
                assert!((r.d_t_d_y / num - 1.0).abs() < 1e-6);
            }
            for y in [1.0, 0.9, 0.0, -3.0] {
                assert_eq!(
                    y_factor_noise_temperature(y, 300.0, 20.0, 1e9, m)
                        .unwrap_err()
                        .code(),
                    "OUT_OF_RANGE"
                );
            }
            assert_eq!(
                y_factor_noise_temperature(20.0, 300.0, 20.0, 1e9, m)
                    .unwrap_err()
                    .code(),
                "OUT_OF_RANGE"
            );
            assert_eq!(
                y_factor_noise_temperature(2.0, 20.0, 300.0, 1e9, m)
                    .unwrap_err()
                    .code(),
                "OUT_OF_RANGE"
            );
            assert_eq!(
                y_factor_noise_temperature(2.0, 300.0, 0.0, 1e9, m)
                    .unwrap_err()
                    .code(),
                "NON_POSITIVE_TEMPERATURE"
            );
        }
        // A quantum-limited amplifier (T_R = hf/k with Planck loads) is hf/2k with
        // Callen–Welton loads (Kerr 1999).
        let f = 230e9;
        let hf_k = PLANCK_H * f / BOLTZMANN_K;
        let y = y_factor(hf_k, 295.0, 77.0, f, LoadNoiseModel::Planck).unwrap();
        let r = y_factor_noise_temperature(y, 295.0, 77.0, f, LoadNoiseModel::Planck).unwrap();
        assert!((r.callen_welton_k / (0.5 * hf_k) - 1.0).abs() < 1e-12);
    }
}

mod semiconductor {
    use super::*;

    fn silicon_like() -> Semiconductor {
        // Sze & Ng (2007), from memory: m_de = 1.08, m_dh = 0.81; Varshni parameters of Si
        // 1.170 eV, 4.73e-4 eV/K, 636 K.
        Semiconductor::new(1.08, 0.81, 1.170 * EV, 4.73e-4 * EV, 636.0).unwrap()
    }

    /// Limit: n·p = n_i² (Boltzmann n_i) in the non-degenerate limit, whatever E_F; it
    /// fails, as it should, once a band becomes degenerate.
    #[test]
    fn mass_action_law() {
        let s = silicon_like();
        for &t in &[250.0, 300.0, 500.0] {
            let i = s.intrinsic(t).unwrap();
            let eg = i.band_gap_j;
            let kt = BOLTZMANN_K * t;
            for frac in [0.3, 0.4, 0.5, 0.6, 0.7] {
                let ef = frac * eg;
                let n = s.electron_density(ef, t).unwrap().density_per_m3;
                let p = s.hole_density(ef, t).unwrap().density_per_m3;
                let ni2 = i.boltzmann_density_per_m3 * i.boltzmann_density_per_m3;
                // deviation ≈ e^{η}/2^{3/2} for the nearer band, η ≤ −(0.3 E_g)/kT
                let eta = -(frac.min(1.0 - frac) * eg) / kt;
                assert!((n * p / ni2 - 1.0).abs() < 2.0 * eta.exp(), "{t} {frac}");
            }
            // degenerate n-type (E_F above E_c): FD n·p falls below n_i²
            let n = s.electron_density(eg + 3.0 * kt, t).unwrap().density_per_m3;
            let p = s.hole_density(eg + 3.0 * kt, t).unwrap().density_per_m3;
            let ni2 = i.boltzmann_density_per_m3 * i.boltzmann_density_per_m3;
            assert!(n * p < 0.5 * ni2);
        }
    }

    /// Identities: equal masses put the intrinsic level at mid-gap; the FD intrinsic values
    /// equal the Boltzmann ones for a wide gap; E_F → n → E_F round trips.
    #[test]
    fn identities() {
        let s = Semiconductor::new(0.7, 0.7, 1.4 * EV, 0.0, 1.0).unwrap();
        for &t in &[10.0, 300.0, 1500.0] {
            let i = s.intrinsic(t).unwrap();
            assert!((i.fermi_level_j / (0.7 * EV) - 1.0).abs() < 1e-14, "{t}");
        }
        let i = silicon_like().intrinsic(300.0).unwrap();
        assert!((i.density_per_m3 / i.boltzmann_density_per_m3 - 1.0).abs() < 1e-8);
        assert!((i.fermi_level_j - i.boltzmann_fermi_level_j).abs() < 1e-8 * EV);
        let s = silicon_like();
        for ef_ev in [-0.2, 0.1, 0.56, 1.0, 1.25, 1.5] {
            let n = s
                .electron_density(ef_ev * EV, 300.0)
                .unwrap()
                .density_per_m3;
            let back = s.fermi_level_from_electron_density(n, 300.0).unwrap();
            assert!((back - ef_ev * EV).abs() < 1e-12 * EV, "{ef_ev}");
            let p = s.hole_density(ef_ev * EV, 300.0).unwrap().density_per_m3;
            let back = s.fermi_level_from_hole_density(p, 300.0).unwrap();
            assert!((back - ef_ev * EV).abs() < 1e-12 * EV, "{ef_ev}");
        }
    }

    /// Narrow-gap material at room temperature: the Boltzmann intrinsic density is visibly
    /// too high, and the error figure says so.
    #[test]
    fn narrow_gap_degeneracy_shows() {
        // invented InSb-like parameters
        let s = Semiconductor::new(0.014, 0.43, 0.2352 * EV, 6.0e-4 * EV, 500.0).unwrap();
        let i = s.intrinsic(450.0).unwrap();
        assert!(i.boltzmann_density_per_m3 > 1.3 * i.density_per_m3);
        let n = s.electron_density(i.fermi_level_j, 450.0).unwrap();
        assert!(n.boltzmann_relative_error > 0.3);
        assert!((n.density_per_m3 / i.density_per_m3 - 1.0).abs() < 1e-12);
    }

    /// Handbook values (from memory): N = 2.51e19 cm⁻³ for m* = 1 at 300 K; silicon
    /// N_c = 2.8e19 cm⁻³ (Sze); silicon E_g(300 K) = 1.12 eV; F_{1/2}(0) = (1 − 2^{−1/2})ζ(3/2)
    /// (DLMF §25.12), ζ(3/2) = 2.612 375 348 685 488 (DLMF 25.6).
    #[test]
    fn handbook_values() {
        let n = effective_density_of_states(1.0, 300.0).unwrap() / 1e6;
        assert!((n / 2.51e19 - 1.0).abs() < 0.001);
        let nc = silicon_like()
            .conduction_band_density_of_states(300.0)
            .unwrap()
            / 1e6;
        assert!((nc / 2.8e19 - 1.0).abs() < 0.01);
        let eg = varshni_band_gap(1.170 * EV, 4.73e-4 * EV, 636.0, 300.0).unwrap() / EV;
        assert!((eg - 1.12).abs() < 0.005);
        let f0 = (1.0 - 0.5f64.sqrt()) * 2.612_375_348_685_488;
        let c = band_carrier_density(1.0, 0.0).unwrap();
        assert!((c.density_per_m3 / f0 - 1.0).abs() < 1e-15);
    }

    /// Typed errors: effective mass ≤ 0, bad Varshni parameters, a density ≤ 0.
    #[test]
    fn typed_errors() {
        for m in [0.0, -0.5] {
            assert_eq!(
                effective_density_of_states(m, 300.0).unwrap_err().code(),
                "NON_POSITIVE"
            );
            assert_eq!(
                Semiconductor::new(m, 1.0, 1e-19, 0.0, 1.0)
                    .unwrap_err()
                    .code(),
                "NON_POSITIVE"
            );
            assert_eq!(
                Semiconductor::new(1.0, m, 1e-19, 0.0, 1.0)
                    .unwrap_err()
                    .code(),
                "NON_POSITIVE"
            );
        }
        assert_eq!(
            Semiconductor::new(1.0, 1.0, 0.0, 0.0, 1.0)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            Semiconductor::new(1.0, 1.0, 1e-19, 0.0, 0.0)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        let s = silicon_like();
        assert_eq!(
            s.fermi_level_from_electron_density(0.0, 300.0)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            s.intrinsic(-1.0).unwrap_err().code(),
            "NON_POSITIVE_TEMPERATURE"
        );
        // the Varshni formula runs out: E_g(T) ≤ 0 at 5000 K for silicon's parameters
        assert_eq!(s.intrinsic(5000.0).unwrap_err().code(), "NO_SOLUTION");
    }
}

/// With the `serde` feature: the configuration and result types read and write the
/// camelCase JSON the bindings will use, and unknown fields are rejected.
#[cfg(feature = "serde")]
mod serde_shapes {
    use super::*;

    #[test]
    fn options_and_models_round_trip() {
        let o: MultiwavelengthOptions = serde_json::from_str(
            r#"{"model":{"kind":"logPolynomial","order":1},"maxConditionNumber":1000.0,"maxAbsCorrelation":0.999}"#,
        )
        .unwrap();
        assert_eq!(o, opts(EmissivityModel::LOG_LINEAR));
        assert!(serde_json::from_str::<MultiwavelengthOptions>(
            r#"{"model":{"kind":"polynomial","order":1},"maxConditionNumber":1.0,"maxAbsCorrelation":0.9,"extra":1}"#
        )
        .is_err());
        let s: Semiconductor = serde_json::from_str(
            r#"{"electronMassRatio":1.08,"holeMassRatio":0.81,"bandGap0kJ":1.8e-19,"varshniAlphaJPerK":7.6e-23,"varshniBetaK":636.0}"#,
        )
        .unwrap();
        assert_eq!(s.hole_mass_ratio, 0.81);
        assert_eq!(
            serde_json::to_string(&LoadNoiseModel::CallenWelton).unwrap(),
            r#""callenWelton""#
        );
        assert_eq!(
            serde_json::to_string(&RamanDetection::PhotonCounting).unwrap(),
            r#""photonCounting""#
        );
        let wl = [0.7e-6, 0.8e-6, 0.9e-6];
        let (l, u) = grey_data(&wl, 1500.0, 0.5);
        let mut tb = [0.0; 3];
        let fit = multiwavelength_fit(&wl, &l, &u, C2Convention::Codata2018, &o, &mut tb).unwrap();
        let json = serde_json::to_string(&fit).unwrap();
        assert!(
            json.contains("\"temperatureK\"") && json.contains("\"correlationTemperatureSlope\"")
        );
        let back: quantaband::thermometry::MultiwavelengthFit =
            serde_json::from_str(&json).unwrap();
        // (serde_json without its float_roundtrip feature may differ in the last bit)
        assert_eq!(back.model, fit.model);
        assert_eq!(back.local_minima, fit.local_minima);
        assert!((back.temperature_k / fit.temperature_k - 1.0).abs() < 1e-15);
    }
}

/// The README example of the "Multi-wavelength, Raman and noise-source thermometry; carrier
/// statistics" section, compiled and its commented numbers checked (keep the two in sync).
#[test]
fn readme_example() -> Result<(), quantaband::Error> {
    let wl = [0.7e-6, 0.825e-6, 0.95e-6, 1.075e-6, 1.2e-6];
    let noise = [0.004, -0.003, 0.001, 0.005, -0.004];
    let mut l = [0.0; 5];
    for i in 0..5 {
        let u: f64 = (wl[i] - 0.95e-6) / 0.25e-6;
        l[i] = (-0.6 - 0.3 * u).exp()
            * spectral_radiance_wavelength(wl[i], 1400.0)?
            * (1.0 + noise[i]);
    }
    let u = l.map(|v| 0.005 * v);
    let opts = MultiwavelengthOptions {
        model: EmissivityModel::LOG_LINEAR,
        ..Default::default()
    };
    let mut tb = [0.0; 5];
    let fit = multiwavelength_fit(&wl, &l, &u, Default::default(), &opts, &mut tb)?;
    assert!((fit.temperature_k - 1399.92).abs() < 0.005);
    assert!((fit.u_temperature_k - 9.13).abs() < 0.005);
    assert!((fit.correlation_temperature_slope.unwrap() - 0.987).abs() < 0.0005);
    assert!((fit.uncertainty_inflation - 33.0).abs() < 0.5);
    assert!((fit.grey_two_colour_temperature_k.unwrap() - 1554.6).abs() < 0.05);
    assert!((tb[0] - 1372.3).abs() < 0.05 && (tb[4] - 1266.3).abs() < 0.05);
    let rd = raman_temperature(52_070.0, 532e-9, 0.115, RamanDetection::PhotonCounting)?;
    assert!((rd.temperature_k - 321.66).abs() < 0.005);
    assert!((rd.d_t_d_ratio - 1201.0).abs() < 0.5);
    let y = y_factor_noise_temperature(1.8, 295.0, 77.0, 230e9, LoadNoiseModel::CallenWelton)?;
    assert!((y.receiver_noise_temperature_k - 195.25).abs() < 0.005);
    assert!((y.planck_k - 200.77).abs() < 0.005);
    assert!((y.rayleigh_jeans_k - 195.50).abs() < 0.005);
    let s = Semiconductor::new(0.014, 0.43, 0.2352 * EV, 6.0e-4 * EV, 500.0)?;
    let ni = s.intrinsic(300.0)?;
    assert!((ni.density_per_m3 / 1.948e22 - 1.0).abs() < 5e-4);
    assert!((ni.boltzmann_density_per_m3 / 2.117e22 - 1.0).abs() < 5e-4);
    Ok(())
}

/// Response-weighted channels (numerically integrated, ≈ 1e-13 rounding in the model): a
/// log-linear fit of noise-free synthetic signals converges and recovers T and the slope.
#[test]
fn response_weighted_channels_converge() {
    use quantaband::thermometry::{Response, ResponseSignal, SignalModel};
    let centres = [0.8e-6, 0.9e-6, 1.0e-6, 1.1e-6, 1.2e-6];
    let tables: Vec<([f64; 3], [f64; 3])> = centres
        .iter()
        .map(|&c| ([c - 30e-9, c, c + 30e-9], [0.0, 1.0, 0.0]))
        .collect();
    let models: Vec<ResponseSignal<'_>> = tables
        .iter()
        .map(|(w, r)| ResponseSignal::new(Response::new(w, r).unwrap(), C2Convention::Codata2018))
        .collect();
    for &t in &[900.0, 1700.0] {
        let s: Vec<f64> = models
            .iter()
            .zip(centres)
            .map(|(m, c)| {
                let u: f64 = (c - 1.0e-6) / 0.2e-6;
                (-0.5 + 0.2 * u).exp() * m.signal(t).unwrap()
            })
            .collect();
        let unc: Vec<f64> = s.iter().map(|v| 2e-3 * v).collect();
        let mut tb = [0.0; 5];
        let fit = multiwavelength_fit_channels(
            &models,
            &centres,
            &s,
            &unc,
            &opts(EmissivityModel::LOG_LINEAR),
            &mut tb,
        )
        .unwrap();
        assert!(
            (fit.temperature_k / t - 1.0).abs() < 1e-9,
            "{t}: {}",
            fit.temperature_k
        );
        assert!((fit.coefficients[1] - 0.2).abs() < 1e-7);
        assert!(fit.iterations < 50);
    }
}
