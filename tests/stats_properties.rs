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

    /// dF_j/dη = F_{j−1} (DLMF 25.12.16 in the normalised convention), checked with a
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
