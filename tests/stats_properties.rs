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
