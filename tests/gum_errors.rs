//! Every bad input of the uncertainty API returns its typed error (never a panic, NaN or a
//! made-up number): negative uncertainties, invalid correlation matrices, zero degrees of
//! freedom, coverage probabilities outside (0, 1), and the Monte Carlo, calibration and ITS-90
//! misuse cases.

use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
use quantaband::thermometry::gum::{
    propagate, type_a, type_a_correlation, Correlation, Coverage, Distribution, Evaluation,
    GumEntry, InputUncertainty,
};
use quantaband::thermometry::its90::{
    fixed_point_curve, ratio_temperature_sensitivities, FixedPoint,
};
use quantaband::thermometry::measurement::Conditions;
use quantaband::thermometry::measurement_gum::measurement_budget;
use quantaband::thermometry::model::SpectralPoint;
use quantaband::thermometry::monte_carlo::{
    histogram, MonteCarlo, MonteCarloConfig, RunStatus, TrialCount,
};
use quantaband::thermometry::random::Xoshiro256StarStar;
use quantaband::thermometry::sakuma_hattori::SakumaHattori;
use quantaband::thermometry::student_t::{coverage_factor, student_t_cdf, student_t_quantile};
use quantaband::Error;

fn code<T: core::fmt::Debug>(r: Result<T, Error>) -> &'static str {
    r.expect_err("expected an error").code()
}

fn b(u: f64) -> InputUncertainty {
    InputUncertainty::type_b(u).unwrap()
}

#[test]
fn negative_or_non_finite_uncertainty() {
    assert_eq!(code(InputUncertainty::type_b(-0.1)), "OUT_OF_RANGE");
    assert_eq!(
        InputUncertainty::type_b(-0.1),
        Err(Error::OutOfRange {
            arg: "standard_uncertainty",
            value: -0.1,
            range: "[0, inf)"
        })
    );
    assert_eq!(code(InputUncertainty::type_b(f64::NAN)), "NON_FINITE");
    assert_eq!(code(InputUncertainty::type_b(f64::INFINITY)), "NON_FINITE");
    assert_eq!(code(InputUncertainty::rectangular(-1.0)), "OUT_OF_RANGE");
    let neg = InputUncertainty {
        standard_uncertainty: -1.0,
        ..InputUncertainty::ZERO
    };
    assert_eq!(
        code(propagate(&[1.0], &[neg], None, Coverage::default(), None)),
        "OUT_OF_RANGE"
    );
    let p = ReferencePoint {
        temperature_k: 500.0,
        signal: 1.0,
        u_temperature_k: -0.01,
        u_signal: 0.0,
    };
    assert_eq!(
        code(CalibrationTransfer::fit(&[p; 3], Default::default())),
        "OUT_OF_RANGE"
    );
}

#[test]
fn zero_or_bad_degrees_of_freedom() {
    assert_eq!(code(InputUncertainty::type_a(0.1, 0.0)), "OUT_OF_RANGE");
    assert_eq!(
        InputUncertainty::type_a(0.1, 0.0),
        Err(Error::OutOfRange {
            arg: "degrees_of_freedom",
            value: 0.0,
            range: "(0, inf]"
        })
    );
    assert_eq!(code(InputUncertainty::type_a(0.1, -3.0)), "OUT_OF_RANGE");
    assert_eq!(code(InputUncertainty::type_a(0.1, f64::NAN)), "NON_FINITE");
    // a t distribution with infinite degrees of freedom is the normal one: say so
    assert_eq!(
        code(InputUncertainty::type_a(0.1, f64::INFINITY)),
        "UNSUPPORTED"
    );
    let zero = InputUncertainty {
        degrees_of_freedom: 0.0,
        ..b(1.0)
    };
    assert_eq!(
        code(propagate(&[1.0], &[zero], None, Coverage::default(), None)),
        "OUT_OF_RANGE"
    );
    assert_eq!(code(coverage_factor(0.95, 0.0)), "OUT_OF_RANGE");
    assert_eq!(code(student_t_cdf(1.0, -1.0)), "OUT_OF_RANGE");
    assert_eq!(code(student_t_quantile(0.9, f64::NAN)), "NON_FINITE");
}

#[test]
fn coverage_probability_outside_zero_one() {
    let u = [b(1.0)];
    for p in [0.0, 1.0, -0.5, 1.5] {
        assert_eq!(
            propagate(&[1.0], &u, None, Coverage::Probability(p), None),
            Err(Error::OutOfRange {
                arg: "coverage_probability",
                value: p,
                range: "(0, 1)"
            })
        );
        assert_eq!(code(coverage_factor(p, 5.0)), "OUT_OF_RANGE");
        assert_eq!(code(student_t_quantile(p, 5.0)), "OUT_OF_RANGE");
        let c = MonteCarloConfig {
            coverage_probability: p,
            ..Default::default()
        };
        assert_eq!(code(MonteCarlo::new(c, &[0.0], &u, None)), "OUT_OF_RANGE");
    }
    assert_eq!(code(coverage_factor(f64::NAN, 5.0)), "NON_FINITE");
    assert_eq!(
        code(propagate(&[1.0], &u, None, Coverage::Factor(0.0), None)),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code(propagate(
            &[1.0],
            &u,
            None,
            Coverage::Factor(f64::NAN),
            None
        )),
        "NON_FINITE"
    );
    // p so close to 1 that the batch would exceed 10⁹ trials
    let c = MonteCarloConfig {
        coverage_probability: 1.0 - 1e-9,
        ..Default::default()
    };
    assert_eq!(code(MonteCarlo::new(c, &[0.0], &u, None)), "OUT_OF_RANGE");
}

#[test]
fn invalid_correlation_matrices() {
    let bad = |m: &[f64]| Correlation::new(m).expect_err("invalid");
    // not positive semi-definite: pairwise −0.9 among three
    let e = bad(&[1.0, -0.9, -0.9, -0.9, 1.0, -0.9, -0.9, -0.9, 1.0]);
    assert_eq!(e.code(), "INVALID_CORRELATION");
    assert!(matches!(
        e,
        Error::InvalidCorrelation {
            reason: "matrix is not positive semi-definite",
            row: 2,
            ..
        }
    ));
    // not symmetric
    assert!(matches!(
        bad(&[1.0, 0.5, 0.4, 1.0]),
        Error::InvalidCorrelation {
            reason: "matrix must be symmetric",
            row: 0,
            column: 1,
            ..
        }
    ));
    // diagonal ≠ 1
    assert!(matches!(
        bad(&[1.0, 0.0, 0.0, 0.9]),
        Error::InvalidCorrelation {
            reason: "diagonal entries must be 1",
            row: 1,
            column: 1,
            ..
        }
    ));
    // entry outside [−1, 1]
    assert!(matches!(
        bad(&[1.0, 1.2, 1.2, 1.0]),
        Error::InvalidCorrelation {
            reason: "entries must lie in [-1, 1]",
            ..
        }
    ));
    assert_eq!(bad(&[1.0, f64::NAN, f64::NAN, 1.0]).code(), "NON_FINITE");
    assert_eq!(bad(&[1.0, 0.0, 0.0]).code(), "LENGTH_MISMATCH");
    assert_eq!(bad(&[]).code(), "LENGTH_MISMATCH");
    let big = vec![0.0; 33 * 33];
    assert_eq!(bad(&big).code(), "UNSUPPORTED");
    let mut w = [0.0; 2];
    assert_eq!(
        code(Correlation::with_workspace(&[1.0, 0.0, 0.0, 1.0], &mut w)),
        "LENGTH_MISMATCH"
    );
    // the display names the entry
    let msg = bad(&[1.0, 0.5, 0.4, 1.0]).to_string();
    assert!(msg.contains("[0][1]") && msg.contains("symmetric"), "{msg}");
    // size mismatch with the inputs
    let ok = Correlation::new(&[1.0, 0.2, 0.2, 1.0]).unwrap();
    assert_eq!(
        code(propagate(
            &[1.0; 3],
            &[b(1.0); 3],
            Some(&ok),
            Coverage::default(),
            None
        )),
        "LENGTH_MISMATCH"
    );
}

#[test]
fn gum_shape_and_definition_errors() {
    assert_eq!(
        code(propagate(
            &[1.0, 2.0],
            &[b(1.0)],
            None,
            Coverage::default(),
            None
        )),
        "LENGTH_MISMATCH"
    );
    let mut e = [GumEntry::default(); 1];
    assert_eq!(
        code(propagate(
            &[1.0, 2.0],
            &[b(1.0); 2],
            None,
            Coverage::default(),
            Some(&mut e)
        )),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        code(propagate(
            &[f64::NAN],
            &[b(1.0)],
            None,
            Coverage::default(),
            None
        )),
        "NON_FINITE"
    );
    // … but an input with zero uncertainty contributes nothing, whatever its coefficient
    let r = propagate(
        &[f64::INFINITY, 1.0],
        &[b(0.0), b(2.0)],
        None,
        Coverage::default(),
        None,
    )
    .unwrap();
    assert_eq!(r.combined_standard_uncertainty, 2.0);
    // correlated finite-dof inputs: ν_eff undefined, a probability cannot be turned into k
    let r = Correlation::new(&[1.0, 0.3, 0.3, 1.0]).unwrap();
    let u = [InputUncertainty::type_a(1.0, 4.0).unwrap(), b(1.0)];
    assert_eq!(
        code(propagate(
            &[1.0, 1.0],
            &u,
            Some(&r),
            Coverage::default(),
            None
        )),
        "UNSUPPORTED"
    );
    assert_eq!(code(type_a(&[1.0])), "TOO_FEW_POINTS");
    assert_eq!(code(type_a(&[1.0, f64::NAN])), "NON_FINITE");
    assert_eq!(
        code(type_a_correlation(&[1.0, 2.0], &[1.0])),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        code(type_a_correlation(&[1.0, 1.0], &[1.0, 2.0])),
        "DEGENERATE_FIT"
    );
}

#[test]
fn measurement_budget_errors() {
    let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
    let mut u = [InputUncertainty::ZERO; 9];
    u[7] = b(1.0); // window temperature without a window
    assert_eq!(
        code(measurement_budget(
            &m,
            1e7,
            &Conditions::BLACKBODY,
            &u,
            None,
            Coverage::default()
        )),
        "UNSUPPORTED"
    );
    let u = [InputUncertainty::ZERO; 9];
    let r = Correlation::new(&[1.0, 0.0, 0.0, 1.0]).unwrap();
    assert_eq!(
        code(measurement_budget(
            &m,
            1e7,
            &Conditions::BLACKBODY,
            &u,
            Some(&r),
            Coverage::default()
        )),
        "LENGTH_MISMATCH"
    );
    let bad = Conditions {
        emissivity: 1.5,
        ..Conditions::BLACKBODY
    };
    assert_eq!(
        code(measurement_budget(
            &m,
            1e7,
            &bad,
            &u,
            None,
            Coverage::default()
        )),
        "OUT_OF_RANGE"
    );
    // τ = 1: the path temperature has no weight, but ∂T/∂τ contains its model signal, which
    // overflows at 1e307 K: a typed error naming it, not an infinite coefficient
    let absurd = Conditions {
        path_transmittance: 1.0,
        path_temperature_k: 1e307,
        ..Conditions::BLACKBODY
    };
    let s400 = quantaband::thermometry::model::SignalModel::signal(&m, 400.0).unwrap();
    assert_eq!(
        measurement_budget(&m, s400, &absurd, &u, None, Coverage::default()).unwrap_err(),
        Error::OutOfRange {
            arg: "path_temperature_k",
            value: 1e307,
            range: "temperatures whose model signal is finite",
        }
    );
}

#[test]
fn monte_carlo_errors() {
    let u = [b(1.0); 2];
    let cfg = MonteCarloConfig::default();
    assert_eq!(
        code(MonteCarlo::new(cfg, &[0.0], &u, None)),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        code(MonteCarlo::new(cfg, &[0.0, f64::NAN], &u, None)),
        "NON_FINITE"
    );
    let many = vec![b(1.0); 33];
    assert_eq!(
        code(MonteCarlo::new(cfg, &[0.0; 33], &many, None)),
        "UNSUPPORTED"
    );
    let digits = MonteCarloConfig {
        significant_digits: 0,
        ..cfg
    };
    assert_eq!(
        code(MonteCarlo::new(digits, &[0.0; 2], &u, None)),
        "OUT_OF_RANGE"
    );
    let zero = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 0 },
        ..cfg
    };
    assert_eq!(
        code(MonteCarlo::new(zero, &[0.0; 2], &u, None)),
        "OUT_OF_RANGE"
    );
    // correlated inputs must be normal
    let r = Correlation::new(&[1.0, 0.5, 0.5, 1.0]).unwrap();
    let mixed = [b(1.0), InputUncertainty::rectangular(1.0).unwrap()];
    assert_eq!(
        code(MonteCarlo::new(cfg, &[0.0; 2], &mixed, Some(&r))),
        "UNSUPPORTED"
    );
    // buffer shorter than a fixed count
    let fixed = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 100 },
        ..cfg
    };
    let mut mc = MonteCarlo::new(fixed, &[0.0; 2], &u, None).unwrap();
    let model = |x: &[f64]| -> quantaband::Result<f64> { Ok(x[0] + x[1]) };
    let mut small = [0.0; 50];
    assert_eq!(code(mc.run(&model, &mut small, 10)), "LENGTH_MISMATCH");
    let mut v = [0.0; 100];
    assert_eq!(code(mc.finish(&mut v)), "TOO_FEW_POINTS");
    let p = mc.run(&model, &mut v, 1000).unwrap();
    assert_eq!((p.status, p.trials), (RunStatus::Completed, 100));
    assert_eq!(code(mc.finish(&mut small)), "LENGTH_MISMATCH");
    // histogram of unsorted values, no bins
    assert_eq!(
        code(histogram(&[2.0, 1.0, 3.0], &mut [0u64; 4])),
        "NOT_INCREASING"
    );
    assert_eq!(code(histogram(&[1.0, 2.0], &mut [])), "TOO_FEW_POINTS");
    assert_eq!(code(Xoshiro256StarStar::from_state([0; 4])), "OUT_OF_RANGE");
    // a model that always fails stops the run with a typed error
    let failing =
        |_: &[f64]| -> quantaband::Result<f64> { Err(Error::NoSolution { what: "test model" }) };
    let mut mc = MonteCarlo::new(cfg, &[0.0; 2], &u, None).unwrap();
    let mut v = vec![0.0; 1000];
    assert_eq!(code(mc.run(&failing, &mut v, 100_000)), "NO_SOLUTION");
}

#[test]
fn calibration_and_its90_errors() {
    let truth = SakumaHattori::new(3.9e-6, 2e-8, 5e4, Default::default()).unwrap();
    use quantaband::thermometry::model::SignalModel;
    let pt = |t: f64| ReferencePoint {
        temperature_k: t,
        signal: truth.signal(t).unwrap(),
        u_temperature_k: 0.01,
        u_signal: 0.0,
    };
    assert_eq!(
        code(CalibrationTransfer::fit(
            &[pt(500.0), pt(600.0)],
            Default::default()
        )),
        "TOO_FEW_POINTS"
    );
    assert_eq!(
        code(CalibrationTransfer::fit(
            &[pt(500.0), pt(500.0), pt(600.0)],
            Default::default()
        )),
        "DEGENERATE_FIT"
    );
    let pts = [pt(500.0), pt(700.0), pt(900.0)];
    let cal = CalibrationTransfer::fit(&pts, Default::default()).unwrap();
    assert_eq!(code(cal.reading(-1.0, 0.0, None, None)), "NON_POSITIVE");
    assert_eq!(code(cal.reading(1.0, -1.0, None, None)), "OUT_OF_RANGE");
    let mut short = [0.0; 2];
    assert_eq!(
        code(cal.reading(1.0, 0.0, Some(&mut short), None)),
        "LENGTH_MISMATCH"
    );
    let m = SpectralPoint::new(650e-9, Default::default()).unwrap();
    assert_eq!(
        code(fixed_point_curve(
            &m,
            [FixedPoint::Zinc, FixedPoint::Zinc, FixedPoint::Copper],
            Default::default()
        )),
        "DEGENERATE_FIT"
    );
    let c = fixed_point_curve(
        &m,
        [FixedPoint::Zinc, FixedPoint::Aluminium, FixedPoint::Copper],
        Default::default(),
    )
    .unwrap();
    assert_eq!(
        code(c.interpolation_errors(&m, 900.0, 800.0, 10)),
        "DEGENERATE_FIT"
    );
    assert_eq!(
        code(c.interpolation_errors(&m, 600.0, 800.0, 1)),
        "TOO_FEW_POINTS"
    );
    assert_eq!(
        code(ratio_temperature_sensitivities(
            0.0,
            650e-9,
            1337.33,
            Default::default()
        )),
        "NON_POSITIVE"
    );
    // the Type A/B label does not change the numbers
    let a = InputUncertainty {
        evaluation: Evaluation::TypeA,
        distribution: Distribution::Normal,
        ..b(1.0)
    };
    assert!(a.validate().is_ok());
}
