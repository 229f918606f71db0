//! Core behaviour the JavaScript boundary relies on (issue 12): the Sakuma–Hattori fit's
//! point-order check and size limit, finite uncertainty budgets when an input that does not
//! matter overflows, and unit conversions that report the value the caller gave.

use quantaband::thermometry::sakuma_hattori::MAX_FIT_POINTS;
use quantaband::thermometry::{
    sensitivities, uncertainty_budget, Conditions, SakumaHattori, SignalModel, SpectralPoint,
    StandardUncertainties,
};
use quantaband::units::{convert_spectral_checked, SpectralUnit};
use quantaband::Error;

fn curve() -> SakumaHattori {
    SakumaHattori::new(3.9e-6, 2e-8, 5e4, Default::default()).unwrap()
}

/// Points of `curve()` at `t` (exact signals: the fit must reproduce the curve).
fn points(t: &[f64]) -> Vec<f64> {
    t.iter().map(|&t| curve().signal(t).unwrap()).collect()
}

#[test]
fn fit_gives_the_same_curve_for_any_order_of_the_points() {
    let t = [400.0, 500.0, 650.0, 800.0, 1000.0, 1200.0];
    let s = points(&t);
    let up = SakumaHattori::fit(&t, &s, Default::default(), None).unwrap();
    let (mut td, mut sd) = (t, s.clone());
    td.reverse();
    sd.reverse();
    let down = SakumaHattori::fit(&td, &sd, Default::default(), None).unwrap();
    let order = [3usize, 0, 5, 1, 4, 2];
    let tm: Vec<f64> = order.iter().map(|&i| t[i]).collect();
    let sm: Vec<f64> = order.iter().map(|&i| s[i]).collect();
    let mut res = vec![0.0; 6];
    let mixed = SakumaHattori::fit(&tm, &sm, Default::default(), Some(&mut res)).unwrap();
    let mixed_no_buffer = SakumaHattori::fit(&tm, &sm, Default::default(), None).unwrap();
    for f in [&down, &mixed, &mixed_no_buffer] {
        // The known curve is recovered (its own parameters are the reference).
        assert!((f.curve.a_m() / 3.9e-6 - 1.0).abs() < 1e-8);
        assert!((f.curve.a_m() / up.curve.a_m() - 1.0).abs() < 1e-9);
        assert!(f.max_abs_residual_k < 1e-6);
    }
    // the residual buffer used as scratch ends up holding the residuals
    assert!(res.iter().all(|r| r.abs() < 1e-6));
}

#[test]
fn fit_rejects_points_that_do_not_increase_in_any_order() {
    let degenerate = |t: &[f64], s: &[f64]| {
        let mut r = vec![0.0; t.len()];
        let a = SakumaHattori::fit(t, s, Default::default(), Some(&mut r)).unwrap_err();
        let b = SakumaHattori::fit(t, s, Default::default(), None).unwrap_err();
        assert_eq!(a, b);
        a
    };
    let repeated = degenerate(&[600.0, 400.0, 600.0, 800.0], &[2.0, 1.0, 2.0, 3.0]);
    assert_eq!(
        repeated,
        Error::DegenerateFit {
            reason: "repeated temperature"
        }
    );
    // ordered temperatures, one signal out of order
    let e = degenerate(&[400.0, 600.0, 800.0, 1000.0], &[1.0, 3.0, 2.0, 4.0]);
    assert_eq!(e.code(), "DEGENERATE_FIT");
    // unordered temperatures, signals decreasing with temperature for one pair
    let e = degenerate(&[800.0, 400.0, 1000.0, 600.0], &[3.0, 1.0, 4.0, 3.5]);
    assert_eq!(e.code(), "DEGENERATE_FIT");
}

#[test]
fn fit_has_a_size_limit_and_returns_at_it() {
    // Unordered points at the limit (the sorted check runs); the fit returns (no timing
    // assertion) and recovers the curve.
    let n = MAX_FIT_POINTS;
    let mut t: Vec<f64> = (0..n)
        .map(|i| 300.0 + 900.0 * i as f64 / n as f64)
        .collect();
    let mut x = 0x2545_f491_4f6c_dd1du64;
    for i in (1..n).rev() {
        x ^= x << 13;
        x ^= x >> 7;
        x ^= x << 17;
        t.swap(i, (x % (i as u64 + 1)) as usize);
    }
    let s = points(&t);
    let f = SakumaHattori::fit(&t, &s, Default::default(), None).unwrap();
    assert!((f.curve.a_m() / 3.9e-6 - 1.0).abs() < 1e-8);
    t.push(1500.0);
    let mut s = s;
    s.push(curve().signal(1500.0).unwrap());
    assert_eq!(
        SakumaHattori::fit(&t, &s, Default::default(), None).unwrap_err(),
        Error::TooLarge {
            arg: "temperatures_k",
            limit: MAX_FIT_POINTS,
            got: MAX_FIT_POINTS + 1
        }
    );
}

#[test]
fn budget_stays_finite_when_an_input_that_does_not_matter_overflows() {
    let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
    let t_obj = 400.0;
    let sig = m.signal(t_obj).unwrap();
    // τ = 1: the path temperature has weight zero in the measurement equation; ε = 1 likewise
    // the reflected temperature for its own sensitivity.
    let c = Conditions {
        path_transmittance: 1.0,
        path_temperature_k: 1e307, // L_λ(10 µm) ≈ 2ckT/λ⁴ overflows (Rayleigh–Jeans)
        ..Conditions::BLACKBODY
    };
    let s = sensitivities(&m, sig, &c);
    // The path transmittance's sensitivity involves S(T_path) = ∞: a typed error names it.
    assert_eq!(
        s.unwrap_err(),
        Error::OutOfRange {
            arg: "path_temperature_k",
            value: 1e307,
            range: "temperatures whose model signal is finite"
        }
    );
    // A huge but finite-signal path temperature with τ = 1: every number finite, the path
    // temperature's sensitivity exactly 0.
    let c = Conditions {
        path_temperature_k: 1e5,
        reflected_temperature_k: 1e5,
        ..Conditions::BLACKBODY
    };
    let u = StandardUncertainties {
        signal: 1.0,
        path_temperature_k: 10.0,
        reflected_temperature_k: 10.0,
        ..Default::default()
    };
    let b = uncertainty_budget(&m, sig, &c, &u).unwrap();
    assert!((b.temperature_k - t_obj).abs() < 1e-9);
    assert!(b.combined_standard_uncertainty_k.is_finite());
    for e in b.entries {
        assert!(
            e.sensitivity.is_finite() && e.contribution_k.is_finite(),
            "{e:?}"
        );
    }
    assert_eq!(b.entries[4].sensitivity, 0.0);
    assert_eq!(b.entries[2].sensitivity, 0.0);
    // A finite sensitivity times a huge uncertainty overflows the variance: typed error.
    let u = StandardUncertainties {
        signal: 1e300,
        ..Default::default()
    };
    assert_eq!(
        uncertainty_budget(&m, sig, &c, &u).unwrap_err().code(),
        "OUT_OF_RANGE"
    );
}

#[test]
fn conversions_report_the_value_given() {
    let e = convert_spectral_checked("x", 1e-320, SpectralUnit::Micrometre, SpectralUnit::Metre)
        .unwrap_err();
    assert_eq!(
        e,
        Error::OutOfRange {
            arg: "x",
            value: 1e-320,
            range: "values whose converted form is a positive finite f64"
        }
    );
    // µm → Hz of a tiny wavelength overflows: reported with the value given
    let e = convert_spectral_checked("x", 1e-320, SpectralUnit::Micrometre, SpectralUnit::Hertz)
        .unwrap_err();
    assert_eq!(e.code(), "OUT_OF_RANGE");
    // 10 µm = 1e-5 m (SI prefixes, BIPM SI Brochure Table 7), within one rounding
    let m =
        convert_spectral_checked("x", 10.0, SpectralUnit::Micrometre, SpectralUnit::Metre).unwrap();
    assert!((m / 1e-5 - 1.0).abs() <= 2.3e-16);
}
