//! Property tests for `quantaband::stats` (host only: proptest does not run on wasm32).
//! Identities checked are exact mathematical facts about the functions (sources named beside
//! each); tolerances allow for f64 rounding only.
#![cfg(not(target_arch = "wasm32"))]

use proptest::prelude::*;
use quantaband::stats::*;
use quantaband::Error;

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    /// f(−x) = 1 − f(x) (follows from 1/(e^{−x}+1) = eˣ/(1+eˣ)); both sides to rounding.
    #[test]
    fn fermi_dirac_symmetry(x in -800.0f64..800.0) {
        let a = fermi_dirac(x).unwrap();
        let b = fermi_dirac(-x).unwrap();
        prop_assert!((a + b - 1.0).abs() <= 2.0 * f64::EPSILON, "x={x}: {a} + {b}");
        prop_assert!((0.0..=1.0).contains(&a));
    }

    /// n_BE(x) = e^{-x}/(1 − e^{-x}) → e^{-x} for x ≫ 1, relative difference e^{-x}.
    #[test]
    fn bose_einstein_tends_to_maxwell_boltzmann(x in 40.0f64..740.0) {
        let be = bose_einstein(x).unwrap();
        let mb = maxwell_boltzmann(x).unwrap();
        prop_assert!(be > 0.0);
        prop_assert!((be / mb - 1.0).abs() <= 4.0 * f64::EPSILON, "x={x}: {be} vs {mb}");
    }

    /// Occupancies decrease with level energy at fixed μ and T (all three statistics).
    #[test]
    fn occupancy_monotone_in_energy(
        e1 in 1e-23f64..1e-19, de in 1e-24f64..1e-20, t in 1.0f64..5000.0
    ) {
        let e2 = e1 + de;
        prop_assert!(bose_einstein_energy(e2, 0.0, t).unwrap()
            <= bose_einstein_energy(e1, 0.0, t).unwrap());
        prop_assert!(fermi_dirac_energy(e2, 5e-21, t).unwrap()
            <= fermi_dirac_energy(e1, 5e-21, t).unwrap());
        prop_assert!(maxwell_boltzmann_energy(e2, 0.0, t).unwrap()
            <= maxwell_boltzmann_energy(e1, 0.0, t).unwrap());
    }

    /// Extreme but valid inputs never give NaN; BE and FD never give ∞ for x > 0.
    #[test]
    fn occupancy_extreme_inputs_finite(
        e in prop_oneof![1e-300f64..1e-250, 1e-30f64..1e-10, 1e250f64..1e300],
        t in prop_oneof![1e-300f64..1e-250, 1e-3f64..1e6, 1e250f64..1e300],
        f in prop_oneof![1e-300f64..1e-250, 1e6f64..1e16, 1e250f64..1e300],
    ) {
        let be = bose_einstein_energy(e, 0.0, t).unwrap();
        prop_assert!(!be.is_nan() && be >= 0.0);
        let fd = fermi_dirac_energy(e, -e, t).unwrap();
        prop_assert!(fd.is_finite() && (0.0..=0.5).contains(&fd));
        let mb = maxwell_boltzmann_energy(e, 0.0, t).unwrap();
        prop_assert!(mb.is_finite() && (0.0..=1.0).contains(&mb));
        let n = thermal_photon_number(f, t).unwrap();
        prop_assert!(!n.is_nan() && n >= 0.0);
    }

    /// E ≤ μ is always DivergentOccupation for Bose–Einstein, never a negative number.
    #[test]
    fn bose_einstein_below_mu_is_error(x in -1e6f64..=0.0) {
        prop_assert_eq!(bose_einstein(x), Err(Error::DivergentOccupation { x }));
    }
}

fn fd(order: FdOrder, eta: f64) -> f64 {
    fermi_dirac_integral(order, eta).unwrap()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(1000))]

    /// dF_j/dη = F_{j−1} (DLMF §25.12(iii), from memory), checked with a
    /// five-point central difference (truncation error ~h⁴/30·F⁽⁵⁾ ≈ 1e-10 relative here).
    #[test]
    fn fermi_dirac_derivative_identity(eta in -60.0f64..200.0) {
        let h = 0.01 * eta.max(1.0); // F varies on a scale of 1 below η = 1, of η above
        for (order, lower) in [(FdOrder::Half, FdOrder::MinusHalf),
                               (FdOrder::ThreeHalves, FdOrder::Half)] {
            let d = (-fd(order, eta + 2.0 * h) + 8.0 * fd(order, eta + h)
                - 8.0 * fd(order, eta - h) + fd(order, eta - 2.0 * h)) / (12.0 * h);
            let want = fd(lower, eta);
            prop_assert!((d / want - 1.0).abs() < 1e-8, "{order:?} eta={eta}: {d} vs {want}");
        }
    }

    /// F_j is positive and strictly increasing in η (its derivative F_{j−1} is positive).
    #[test]
    fn fermi_dirac_integral_increasing(eta in -700.0f64..1e5, step in 1e-3f64..10.0) {
        for order in [FdOrder::MinusHalf, FdOrder::Half, FdOrder::ThreeHalves] {
            let a = fd(order, eta);
            let b = fd(order, eta + step);
            prop_assert!(a > 0.0 && b > a, "{order:?} eta={eta}: {a} !< {b}");
        }
    }

    /// inverse(F_{1/2}(η)) = η for η in [−50, 1e4] (the brief's range and beyond).
    #[test]
    fn inverse_of_forward(eta in -50.0f64..1e4) {
        let y = fd(FdOrder::Half, eta);
        let back = inverse_fermi_dirac_half(y).unwrap();
        // Conditioning: dη = (F/F') dF/F, F/F' ≤ max(1, 2η/3) + 1; allow 8 ulp of y.
        let tol = 8.0 * f64::EPSILON * (1.0 + eta.abs());
        prop_assert!((back - eta).abs() <= tol, "eta={eta}: back {back}");
    }

    /// forward(inverse(y)) = y for reduced densities from 1e-300 to 1e300.
    #[test]
    fn forward_of_inverse(log10_y in -300.0f64..300.0) {
        let y = 10f64.powf(log10_y);
        let eta = inverse_fermi_dirac_half(y).unwrap();
        let back = fd(FdOrder::Half, eta);
        // Rounding η to f64 alone moves F by up to ½ulp(η)·F'/F ≤ ½ulp(η): allow 4 ulp of y
        // plus 2 ulp of η.
        let tol = 4.0 * f64::EPSILON + 2.0 * f64::EPSILON * eta.abs();
        prop_assert!((back / y - 1.0).abs() <= tol, "y={y:e}: eta {eta} gives {back:e}");
    }

    /// Extreme but valid η: never NaN, never negative; ∞ only where the true value overflows
    /// (F_{3/2}(η) > f64::MAX needs η > 1.5e123).
    #[test]
    fn fermi_dirac_integral_extremes(eta in prop_oneof![-1e300f64..-700.0, 1e5f64..1e120,
                                                        1e120f64..1e300]) {
        for order in [FdOrder::MinusHalf, FdOrder::Half, FdOrder::ThreeHalves] {
            let v = fd(order, eta);
            prop_assert!(!v.is_nan() && v >= 0.0, "{order:?} eta={eta:e}: {v}");
            if eta < 1e120 {
                prop_assert!(v.is_finite());
            }
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(1000))]

    /// T_n = T_RJ + hf/2k: coth(y) = 1 + 2/(e^{2y} − 1) (hyperbolic identity, DLMF §4.28, from memory), i.e. n̄ + ½ = ½coth(y).
    #[test]
    fn noise_temperature_is_rj_plus_half_quantum(
        log_f in 3.0f64..16.0, log_t in -3.0f64..6.0
    ) {
        let (f, t) = (10f64.powf(log_f), 10f64.powf(log_t));
        let tn = quantum_noise_temperature(f, t).unwrap();
        let trj = rayleigh_jeans_brightness_temperature(f, t).unwrap();
        let half = 0.5 * 6.626_070_15e-34 * f / 1.380_649e-23;
        prop_assert!((tn / (trj + half) - 1.0).abs() < 4e-15, "f={f:e} T={t:e}: {tn} vs {trj}+{half}");
        prop_assert!(tn >= t * (1.0 - 1e-15), "T_n must not be below T");
        let p0 = available_noise_power_density_with_zero_point(f, t).unwrap();
        let p = available_noise_power_density(f, t).unwrap();
        prop_assert!((p0 / (1.380_649e-23 * tn) - 1.0).abs() < 4e-16);
        prop_assert!(p == 1.380_649e-23 * trj);
    }

    /// T → T_RJ → T round trip (brightness temperature inverse).
    #[test]
    fn rayleigh_jeans_round_trip(log_f in 6.0f64..15.0, log_t in -3.0f64..8.0) {
        let (f, t) = (10f64.powf(log_f), 10f64.powf(log_t));
        let x = 4.799_243_073_366_221e-11 * f / t;
        prop_assume!(x <= 700.0);
        let trj = rayleigh_jeans_brightness_temperature(f, t).unwrap();
        let back = physical_temperature_from_rayleigh_jeans(f, trj).unwrap();
        prop_assert!((back / t - 1.0).abs() < 1e-14, "f={f:e} T={t:e}: back {back}");
    }

    /// Blackbody gas identities: T·s = u + p (Gibbs–Duhem with μ = 0), u = 3p, n·⟨E⟩ = u.
    #[test]
    fn photon_gas_identities(log_t in -60.0f64..70.0) {
        let t = 10f64.powf(log_t);
        let u = photon_energy_density(t).unwrap();
        let p = photon_pressure(t).unwrap();
        let s = photon_entropy_density(t).unwrap();
        let n = photon_number_density(t).unwrap();
        let e = mean_photon_energy(t).unwrap();
        prop_assert!(u.is_finite() && u > 0.0);
        prop_assert!((t * s / (u + p) - 1.0).abs() < 1e-14);
        prop_assert!((u / (3.0 * p) - 1.0).abs() < 1e-15);
        prop_assert!((n * e / u - 1.0).abs() < 1e-14);
    }

    /// u_E(E) = g(E)·E·n̄(E/kT) (definition) and u_ν = h·u_E(hν); no NaN/∞ at extreme inputs.
    #[test]
    fn spectral_energy_density_consistency(log_e in -30.0f64..-14.0, log_t in -3.0f64..7.0) {
        let (e, t) = (10f64.powf(log_e), 10f64.powf(log_t));
        let x = e / (1.380_649e-23 * t);
        prop_assume!(x < 600.0);
        let u = spectral_energy_density_energy(e, t).unwrap();
        let built = photon_density_of_states(e).unwrap() * e * bose_einstein(x).unwrap();
        prop_assert!((u / built - 1.0).abs() < 1e-13, "E={e:e} T={t:e}: {u} vs {built}");
        let nu = e / 6.626_070_15e-34;
        let u_nu = spectral_energy_density_frequency(nu, t).unwrap();
        // ν = E/h is rounded (½ ulp, tripled by ν³ and multiplied by x on the Wien side), on
        // top of a few ulp for each evaluation.
        let tol = 3e-15 * (1.0 + x);
        prop_assert!((u_nu / (6.626_070_15e-34 * u) - 1.0).abs() < tol, "E={e:e} T={t:e}");
    }

    #[test]
    fn photon_functions_extremes_never_nan(
        a in prop_oneof![1e-300f64..1e-250, 1e-30f64..1e30, 1e250f64..1e300],
        t in prop_oneof![1e-300f64..1e-250, 1e-3f64..1e6, 1e250f64..1e300],
    ) {
        for v in [
            quantum_noise_temperature(a, t).unwrap(),
            rayleigh_jeans_brightness_temperature(a, t).unwrap(),
            physical_temperature_from_rayleigh_jeans(a, t).unwrap(),
            available_noise_power_density(a, t).unwrap(),
            spectral_energy_density_energy(a, t).unwrap(),
            spectral_energy_density_frequency(a, t).unwrap(),
            photon_density_of_states(a).unwrap(),
            photon_energy_density(t).unwrap(),
            photon_number_density(t).unwrap(),
        ] {
            prop_assert!(!v.is_nan() && v >= 0.0, "a={a:e} t={t:e}: {v}");
        }
        prop_assert!(physical_temperature_from_rayleigh_jeans(a, t).unwrap() > 0.0);
        prop_assert!(quantum_noise_temperature(a, t).unwrap() > 0.0);
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    /// Consistency with the radiometric core: for isotropic blackbody radiation the spectral
    /// energy density is u_ν = 4π L_ν / c per unit frequency and u_E = u_ν / h per unit photon
    /// energy (energy flux through a surface = c·u/4π per steradian; e.g. Kittel & Kroemer,
    /// Thermal Physics, ch. 4, from memory). L_ν from `quantaband::planck`.
    #[test]
    fn energy_density_consistent_with_planck_radiance(
        log_f in 6.0f64..16.0, log_t in -2.0f64..6.0
    ) {
        let (f, t) = (10f64.powf(log_f), 10f64.powf(log_t));
        let x = 4.799_243_073_366_221e-11 * f / t;
        prop_assume!(x < 700.0);
        let c = 299_792_458.0;
        let h = 6.626_070_15e-34;
        let l_nu = quantaband::planck::spectral_radiance_frequency(f, t).unwrap();
        let from_radiance = 4.0 * core::f64::consts::PI * l_nu / c;
        // Subnormal results carry fewer than 16 digits: compare in the normal range only.
        prop_assume!(from_radiance >= f64::MIN_POSITIVE);
        let u_nu = spectral_energy_density_frequency(f, t).unwrap();
        // Two independent implementations, each a few ulp, the x-amplified rounding of hf/kT.
        let tol = 2e-15 * (1.0 + x);
        prop_assert!((u_nu / from_radiance - 1.0).abs() < tol,
            "f={f:e} T={t:e}: {u_nu:e} vs {from_radiance:e}");
        let u_e = spectral_energy_density_energy(h * f, t).unwrap();
        prop_assert!((u_e / (from_radiance / h) - 1.0).abs() < tol,
            "f={f:e} T={t:e}: {u_e:e} vs {:e}", from_radiance / h);
    }
}
