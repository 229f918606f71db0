//! Property-based fuzz of the radiation-thermometry workflow (`quantaband::thermometry`):
//! signal models, the measurement equation and its uncertainty, ITS-90, Sakuma–Hattori fits and
//! calibration transfer, spectral tables and the spectral measurement equation, indicated-
//! temperature workflows, frame conversion, GUM propagation, Student's t, the random generators,
//! Monte Carlo, multi-wavelength and Raman thermometry. See `tests/common/mod.rs` for the
//! properties and the generators.
//!
//! Methods are called in the fully qualified form (`Type::method(&x, …)`, trait methods as
//! `<Type as Trait>::method`) so that `tests/fuzz_inventory.rs` can check from the text that each
//! one is exercised.

mod common;

use common::{arg, args, check, finite, fuzz, ok, slice, special, Arg, Inf};
use proptest::prelude::*;
use proptest::test_runner::TestCaseError;
use quantaband::constants::C2Convention;
use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
use quantaband::thermometry::frame::{
    fast_ln, FrameConverter, FrameInput, FrameOutput, FrameSummary, PixelCorrections,
};
use quantaband::thermometry::gum::{
    propagate, type_a, type_a_correlation, Correlation, Coverage, Distribution, Evaluation,
    GumEntry, GumMethod, GumResult, InputUncertainty, TypeA,
};
use quantaband::thermometry::indicated::{
    correct_reading, correct_reading_spectral, emissivity_by_contact, emissivity_by_reference,
    reflected_temperature,
};
use quantaband::thermometry::its90::{
    fixed_point_curve, its90_temperature, radiance_ratio, ratio_temperature_sensitivities,
    temperature_from_ratio, FixedPoint, FixedPointCurve, RatioSensitivities,
};
use quantaband::thermometry::measurement::{
    measured_signal, object_temperature, Conditions, Window,
};
use quantaband::thermometry::measurement_gum::{
    measurement_budget, measurement_estimates, measurement_sensitivities, MeasurementEquation,
    MeasurementInput, MeasurementSensitivities,
};
use quantaband::thermometry::model::{invert_monotone, SignalModel, SpectralPoint};
use quantaband::thermometry::monte_carlo::{
    histogram, numerical_tolerance, recommended_bins, validate_gum, IntervalKind, MonteCarlo,
    MonteCarloConfig, MonteCarloModel, RunStatus, TrialCount,
};
use quantaband::thermometry::multiwavelength::{
    multiwavelength_fit, multiwavelength_fit_channels, EmissivityModel, MultiwavelengthFit,
    MultiwavelengthOptions,
};
use quantaband::thermometry::raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
    RamanReading,
};
use quantaband::thermometry::random::{splitmix64, Sampler, Xoshiro256StarStar};
use quantaband::thermometry::ratio::{ratio_temperature, two_colour_temperature, RatioReading};
use quantaband::thermometry::rectangular::RectangularBand;
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::{max_interpolation_error_k, SakumaHattori};
use quantaband::thermometry::spectral::{
    band_effective, spectral_measured_signal, spectral_object_temperature, spectral_sensitivities,
    spectral_signal_terms, SpectralConditions, SpectralInstrument, SpectralValue, SpectralWindow,
};
use quantaband::thermometry::student_t::{coverage_factor, student_t_cdf, student_t_quantile};
use quantaband::thermometry::table::{Ends, SpectralTable, SpectralTableBuf, TableKind};
use quantaband::thermometry::uncertainty::{
    sensitivities, uncertainty_budget, StandardUncertainties,
};
use quantaband::units::SpectralUnit;
use quantaband::Error;

// ---------------------------------------------------------------------------------------------
// Generators

fn c2s() -> impl Strategy<Value = C2Convention> {
    prop::sample::select(vec![C2Convention::Codata2018, C2Convention::Its90])
}

/// Object / source temperature, K, with the inverse's search bounds.
fn temperature() -> Arg {
    arg(200.0, 3000.0).edges(&[0.0, 1e-3, 1e9])
}

fn unit_open_closed() -> Arg {
    arg(0.05, 1.0).edges(&[0.0, 1.0])
}

/// A wavelength, m.
fn wavelength() -> Arg {
    arg(0.4e-6, 14e-6).edges(&[0.0])
}

/// A signal factor applied to a forward signal (1 = exactly consistent data).
fn factor() -> Arg {
    arg(0.5, 2.0).edges(&[0.0, 1.0])
}

/// A description of one signal model with owned data (the models borrow it).
#[derive(Clone, Debug)]
enum ModelCase {
    Point(f64),
    Rect(f64, f64),
    Response(Vec<f64>, Vec<f64>),
    Curve(f64, f64, f64),
    Spectral(Vec<f64>, Vec<f64>, bool, bool),
}

/// A response table: a strictly increasing wavelength grid and values in [0, 1], sometimes
/// adversarial (see `common::slice`).
fn response_table() -> impl Strategy<Value = (Vec<f64>, Vec<f64>)> {
    (
        prop::sample::select(vec![0.65e-6, 1.6e-6, 3.9e-6, 8e-6]),
        slice(&arg(1.0, 1.8), true, 2, 200),
        slice(&arg(0.0, 1.0).edges(&[0.0, 1.0]), false, 2, 200),
    )
        .prop_map(|(l0, grid, mut values)| {
            let w: Vec<f64> = grid.iter().map(|g| g * l0).collect();
            if values.len() > w.len() && w.len() >= 2 {
                values.truncate(w.len());
            }
            (w, values)
        })
}

fn model_cases() -> impl Strategy<Value = ModelCase> {
    prop_oneof![
        wavelength().any().prop_map(ModelCase::Point),
        (wavelength().any(), arg(1.01, 3.0).edges(&[1.0]).any())
            .prop_map(|(a, f)| ModelCase::Rect(a, a * f)),
        response_table().prop_map(|(w, v)| ModelCase::Response(w, v)),
        (
            arg(0.5e-6, 12e-6).edges(&[0.0]).any(),
            arg(-1e-5, 5e-4).edges(&[0.0]).any(),
            arg(1e-3, 1e12).edges(&[0.0]).any()
        )
            .prop_map(|(a, b, c)| ModelCase::Curve(a, b, c)),
        (response_table(), any::<bool>(), any::<bool>())
            .prop_map(|((w, v), photon, constant)| ModelCase::Spectral(w, v, photon, constant)),
    ]
}

/// Builds the model of `case` (checking the constructor's result) and runs `f` on it.
fn with_model(
    case: &ModelCase,
    c2: C2Convention,
    f: &mut dyn FnMut(&dyn SignalModel) -> Result<(), TestCaseError>,
) -> Result<(), TestCaseError> {
    match case {
        ModelCase::Point(l) => {
            let m = SpectralPoint::new(*l, c2);
            ok("SpectralPoint::new", &m)?;
            if let Ok(m) = m {
                f(&m)?;
            }
        }
        ModelCase::Rect(a, b) => {
            let m = RectangularBand::new(*a, *b, c2);
            ok("RectangularBand::new", &m)?;
            if let Ok(m) = m {
                f(&m)?;
            }
        }
        ModelCase::Response(w, v) => {
            let r = Response::new(w, v);
            ok("Response::new", &r)?;
            if let Ok(r) = r {
                f(&ResponseSignal::new(r, c2))?;
            }
        }
        ModelCase::Curve(a, b, c) => {
            let m = SakumaHattori::new(*a, *b, *c, c2);
            ok("SakumaHattori::new", &m)?;
            if let Ok(m) = m {
                f(&m)?;
            }
        }
        ModelCase::Spectral(w, v, photon, constant) => {
            let kind = if *photon {
                TableKind::PhotonResponse
            } else {
                TableKind::EnergyResponse
            };
            let t = SpectralTable::new(kind, w, v);
            ok("SpectralTable::new", &t)?;
            if let Ok(t) = t {
                let ends = if *constant {
                    Ends::Constant
                } else {
                    Ends::Reject
                };
                let m = SpectralInstrument::new(SpectralTable::with_ends(t, ends), c2);
                ok("SpectralInstrument::new", &m)?;
                if let Ok(m) = m {
                    f(&m)?;
                }
            }
        }
    }
    Ok(())
}

fn windows() -> impl Strategy<Value = Option<Window>> {
    prop::option::weighted(
        0.3,
        (
            unit_open_closed().any(),
            arg(0.0, 0.3).edges(&[0.0, 1.0]).any(),
            temperature().any(),
            temperature().any(),
        )
            .prop_map(|(tau, rho, t, tr)| Window {
                transmittance: tau,
                reflectance: rho,
                temperature_k: t,
                reflected_temperature_k: tr,
            }),
    )
}

fn conditions() -> impl Strategy<Value = Conditions> {
    prop_oneof![
        1 => Just(Conditions::BLACKBODY),
        4 => (
            unit_open_closed().any(),
            temperature().any(),
            unit_open_closed().any(),
            temperature().any(),
            windows(),
        )
            .prop_map(|(e, tr, tau, tp, w)| Conditions {
                emissivity: e,
                reflected_temperature_k: tr,
                path_transmittance: tau,
                path_temperature_k: tp,
                window: w,
            }),
    ]
}

fn distributions() -> impl Strategy<Value = Distribution> {
    prop::sample::select(vec![
        Distribution::Normal,
        Distribution::Rectangular,
        Distribution::Triangular,
        Distribution::Arcsine,
        Distribution::StudentT,
    ])
}

fn input_uncertainties() -> impl Strategy<Value = InputUncertainty> {
    (
        arg(0.0, 10.0).edges(&[0.0]).any(),
        arg(1.0, 100.0).edges(&[0.0, f64::INFINITY]).any(),
        prop::sample::select(vec![Evaluation::TypeA, Evaluation::TypeB]),
        distributions(),
    )
        .prop_map(|(u, dof, evaluation, distribution)| InputUncertainty {
            standard_uncertainty: u,
            degrees_of_freedom: dof,
            evaluation,
            distribution,
        })
}

fn coverages() -> impl Strategy<Value = Coverage> {
    prop_oneof![
        arg(0.5, 0.999)
            .edges(&[0.0, 1.0, 0.9545])
            .any()
            .prop_map(Coverage::Probability),
        arg(1.0, 3.0).edges(&[0.0]).any().prop_map(Coverage::Factor),
    ]
}

// SignalModel::signal docs: "A true value above `f64::MAX` ... is returned as +∞";
// d_signal_dt: "+∞ or 0 only where the true value is beyond the f64 range".
const MODEL_INF: Inf = Inf::Documented;

// ---------------------------------------------------------------------------------------------
// Signal models

/// Every SignalModel method through the trait object, and the shared inverse.
fn exercise_model(m: &dyn SignalModel, t: f64, f: f64, s_raw: f64) -> Result<(), TestCaseError> {
    check("signal", &m.signal(t), MODEL_INF)?;
    check("d_signal_dt", &m.d_signal_dt(t), MODEL_INF)?;
    check(
        "signal_and_derivative",
        &m.signal_and_derivative(t),
        MODEL_INF,
    )?;
    ok("temperature (raw signal)", &m.temperature(s_raw))?;
    ok(
        "invert_monotone (raw signal)",
        &invert_monotone(m, s_raw, t),
    )?;
    if let Ok(s) = m.signal(t) {
        ok("temperature", &m.temperature(s * f))?;
        ok("invert_monotone", &invert_monotone(m, s * f, 1000.0))?;
    }
    Ok(())
}

#[test]
fn fuzz_signal_models() {
    let signal = arg(1e-10, 1e12).edges(&[0.0]);
    fuzz(
        "signal models",
        500,
        (
            model_cases(),
            c2s(),
            args(&[temperature(), factor(), signal, temperature()]),
        ),
        |(case, c2, v)| {
            let (t, f, s_raw, t2) = (v[0], v[1], v[2], v[3]);
            with_model(&case, c2, &mut |m| exercise_model(m, t, f, s_raw))?;
            // The concrete types: accessors and the trait methods by name.
            match &case {
                ModelCase::Point(l) => {
                    if let Ok(m) = SpectralPoint::new(*l, c2) {
                        prop_assert!(SpectralPoint::wavelength_m(&m) > 0.0);
                        check(
                            "<SpectralPoint as SignalModel>::signal",
                            &<SpectralPoint as SignalModel>::signal(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<SpectralPoint as SignalModel>::d_signal_dt",
                            &<SpectralPoint as SignalModel>::d_signal_dt(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<SpectralPoint as SignalModel>::signal_and_derivative",
                            &<SpectralPoint as SignalModel>::signal_and_derivative(&m, t),
                            MODEL_INF,
                        )?;
                        ok(
                            "<SpectralPoint as SignalModel>::temperature",
                            &<SpectralPoint as SignalModel>::temperature(&m, s_raw),
                        )?;
                    }
                }
                ModelCase::Rect(a, b) => {
                    if let Ok(m) = RectangularBand::new(*a, *b, c2) {
                        let (lo, hi) = RectangularBand::limits_m(&m);
                        prop_assert!(lo < hi);
                        check(
                            "<RectangularBand as SignalModel>::signal",
                            &<RectangularBand as SignalModel>::signal(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<RectangularBand as SignalModel>::d_signal_dt",
                            &<RectangularBand as SignalModel>::d_signal_dt(&m, t),
                            MODEL_INF,
                        )?;
                        ok(
                            "<RectangularBand as SignalModel>::temperature",
                            &<RectangularBand as SignalModel>::temperature(&m, s_raw),
                        )?;
                    }
                }
                ModelCase::Response(w, v) => {
                    if let Ok(r) = Response::new(w, v) {
                        prop_assert_eq!(
                            Response::wavelengths_m(&r).len(),
                            Response::values(&r).len()
                        );
                        let (lo, hi) = Response::support_m(&r);
                        prop_assert!(lo < hi);
                        ok("Response::value_at", &Response::value_at(&r, t * 1e-9))?;
                        ok("Response::value_at", &Response::value_at(&r, s_raw))?;
                        ok(
                            "Response::mean_and_spread_m",
                            &Response::mean_and_spread_m(&r),
                        )?;
                        let m = ResponseSignal::new(r, c2);
                        let _ = ResponseSignal::response(&m);
                        prop_assert!(ResponseSignal::c2_mk(&m) > 0.0);
                        ok(
                            "ResponseSignal::mean_wavelength_m",
                            &ResponseSignal::mean_wavelength_m(&m, t),
                        )?;
                        ok(
                            "ResponseSignal::mean_and_spread_m",
                            &ResponseSignal::mean_and_spread_m(&m, t),
                        )?;
                        ok(
                            "ResponseSignal::limiting_effective_wavelength_m",
                            &ResponseSignal::limiting_effective_wavelength_m(&m, t),
                        )?;
                        ok(
                            "ResponseSignal::effective_wavelength_m",
                            &ResponseSignal::effective_wavelength_m(&m, t, t2),
                        )?;
                        check(
                            "<ResponseSignal as SignalModel>::signal",
                            &<ResponseSignal as SignalModel>::signal(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<ResponseSignal as SignalModel>::d_signal_dt",
                            &<ResponseSignal as SignalModel>::d_signal_dt(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<ResponseSignal as SignalModel>::signal_and_derivative",
                            &<ResponseSignal as SignalModel>::signal_and_derivative(&m, t),
                            MODEL_INF,
                        )?;
                        ok(
                            "<ResponseSignal as SignalModel>::temperature",
                            &<ResponseSignal as SignalModel>::temperature(&m, s_raw),
                        )?;
                        ok(
                            "SakumaHattori::from_response",
                            &SakumaHattori::from_response(&m, t),
                        )?;
                    }
                }
                ModelCase::Curve(a, b, c) => {
                    if let Ok(m) = SakumaHattori::new(*a, *b, *c, c2) {
                        let p = (
                            SakumaHattori::a_m(&m),
                            SakumaHattori::b_mk(&m),
                            SakumaHattori::c(&m),
                            SakumaHattori::c2_mk(&m),
                        );
                        finite("SakumaHattori parameters", &p)?;
                        check(
                            "<SakumaHattori as SignalModel>::signal",
                            &<SakumaHattori as SignalModel>::signal(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<SakumaHattori as SignalModel>::d_signal_dt",
                            &<SakumaHattori as SignalModel>::d_signal_dt(&m, t),
                            MODEL_INF,
                        )?;
                        check(
                            "<SakumaHattori as SignalModel>::signal_and_derivative",
                            &<SakumaHattori as SignalModel>::signal_and_derivative(&m, t),
                            MODEL_INF,
                        )?;
                        ok(
                            "<SakumaHattori as SignalModel>::temperature",
                            &<SakumaHattori as SignalModel>::temperature(&m, s_raw),
                        )?;
                    }
                }
                ModelCase::Spectral(w, v, photon, _) => {
                    let kind = if *photon {
                        TableKind::PhotonResponse
                    } else {
                        TableKind::EnergyResponse
                    };
                    if let Ok(tab) = SpectralTable::new(kind, w, v) {
                        if let Ok(m) = SpectralInstrument::new(tab, c2) {
                            let _ = SpectralInstrument::response(&m);
                            prop_assert_eq!(SpectralInstrument::is_photon(&m), *photon);
                            prop_assert!(SpectralInstrument::c2_mk(&m) > 0.0);
                            check(
                                "<SpectralInstrument as SignalModel>::signal",
                                &<SpectralInstrument as SignalModel>::signal(&m, t),
                                MODEL_INF,
                            )?;
                            check(
                                "<SpectralInstrument as SignalModel>::d_signal_dt",
                                &<SpectralInstrument as SignalModel>::d_signal_dt(&m, t),
                                MODEL_INF,
                            )?;
                            check(
                                "<SpectralInstrument as SignalModel>::signal_and_derivative",
                                &<SpectralInstrument as SignalModel>::signal_and_derivative(&m, t),
                                MODEL_INF,
                            )?;
                            ok(
                                "<SpectralInstrument as SignalModel>::temperature",
                                &<SpectralInstrument as SignalModel>::temperature(&m, s_raw),
                            )?;
                        }
                    }
                }
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Measurement equation, its uncertainty, indicated temperatures, ratio thermometry

fn standard_uncertainties() -> impl Strategy<Value = StandardUncertainties> {
    args(&[
        arg(0.0, 1.0).edges(&[0.0]),
        arg(0.0, 0.05).edges(&[0.0]),
        arg(0.0, 5.0).edges(&[0.0]),
        arg(0.0, 0.05).edges(&[0.0]),
        arg(0.0, 5.0).edges(&[0.0]),
    ])
    .prop_map(|v| StandardUncertainties {
        signal: v[0],
        emissivity: v[1],
        reflected_temperature_k: v[2],
        path_transmittance: v[3],
        path_temperature_k: v[4],
    })
}

#[test]
fn fuzz_measurement_equation() {
    fuzz(
        "measurement equation",
        350,
        (
            model_cases(),
            c2s(),
            (conditions(), conditions()),
            standard_uncertainties(),
            prop::collection::vec(input_uncertainties(), 9),
            coverages(),
            args(&[
                temperature(),
                factor(),
                unit_open_closed(),
                temperature(),
                temperature(),
            ]),
        ),
        |(case, c2, (cond, actual), su, inputs, coverage, v)| {
            let (t, f, eps, t2, t3) = (v[0], v[1], v[2], v[3], v[4]);
            ok("Conditions::validate", &Conditions::validate(&cond))?;
            with_model(&case, c2, &mut |m| {
                ok("Conditions::affine", &Conditions::affine(&cond, m))?;
                let s = measured_signal(m, t, &cond);
                check("measured_signal", &s, MODEL_INF)?;
                let s = s.unwrap_or(1.0) * f;
                ok("object_temperature", &object_temperature(m, s, &cond))?;
                ok("sensitivities", &sensitivities(m, s, &cond))?;
                ok("uncertainty_budget", &uncertainty_budget(m, s, &cond, &su))?;
                let ms = measurement_sensitivities(m, s, &cond);
                ok("measurement_sensitivities", &ms)?;
                if let Ok(ms) = &ms {
                    for input in MeasurementInput::ALL {
                        let i = MeasurementInput::index(input);
                        prop_assert!(i < 9);
                        let _ = MeasurementSensitivities::get(ms, input);
                    }
                }
                let est = measurement_estimates(s, &cond);
                prop_assert_eq!(est.len(), 9);
                let arr: [InputUncertainty; 9] = inputs.clone().try_into().unwrap();
                let b = measurement_budget(m, s, &cond, &arr, None, coverage);
                let bound = b
                    .as_ref()
                    .map_or(0.0, |b| b.entries.iter().map(|e| e.component.abs()).sum());
                gum_check("measurement_budget", b.as_ref().map(|b| &b.result), bound)?;
                if let Ok(b) = &b {
                    ok(
                        "measurement_budget entries",
                        &Ok::<_, Error>((
                            b.temperature_k,
                            b.entries
                                .map(|e| (e.sensitivity, e.component, e.variance_share)),
                        )),
                    )?;
                }
                let eq = MeasurementEquation::new(m, &cond);
                ok("MeasurementEquation::evaluate", &eq.evaluate(&est))?;
                ok(
                    "<MeasurementEquation as MonteCarloModel>::evaluate",
                    &<MeasurementEquation<dyn SignalModel> as MonteCarloModel>::evaluate(
                        &eq,
                        &est[..5],
                    ),
                )?;
                // Indicated-temperature workflows.
                ok("correct_reading", &correct_reading(m, t, &cond, &actual))?;
                ok(
                    "reflected_temperature",
                    &reflected_temperature(m, t, &cond, eps * 0.99, t2),
                )?;
                ok(
                    "emissivity_by_contact",
                    &emissivity_by_contact(m, t, &cond, t2, t3),
                )?;
                ok(
                    "emissivity_by_reference",
                    &emissivity_by_reference(m, t, t2, &cond, eps, t3),
                )?;
                // Ratio thermometry: the model against a second spectral point.
                if let Ok(p2) = SpectralPoint::new(12e-6, c2) {
                    ratio_check("ratio_temperature", &ratio_temperature(m, &p2, f, eps, t))?;
                    if let (Ok(a), Ok(b)) = (m.signal(t), p2.signal(t)) {
                        ratio_check(
                            "ratio_temperature (forward)",
                            &ratio_temperature(m, &p2, a / b, 1.0, 1000.0),
                        )?;
                    }
                }
                Ok(())
            })
        },
    );
}

/// A ratio reading: ∞ only in ∂T/∂r, whose docs say "+∞ only where the true value is above
/// `f64::MAX`".
fn ratio_check(what: &str, r: &Result<RatioReading, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)?;
    if let Ok(r) = r {
        ok(
            what,
            &Ok::<_, Error>((r.temperature_k, r.d_t_d_emissivity_ratio)),
        )?;
    }
    Ok(())
}

#[test]
fn fuzz_two_colour() {
    fuzz(
        "two colour",
        3000,
        (
            c2s(),
            args(&[
                wavelength(),
                wavelength(),
                arg(1e-3, 1e3).edges(&[0.0, 1.0]),
                unit_open_closed(),
                temperature(),
            ]),
        ),
        |(c2, v)| {
            let (l1, l2, r, e, t) = (v[0], v[1], v[2], v[3], v[4]);
            ratio_check(
                "two_colour_temperature",
                &two_colour_temperature(l1.min(l2), l1.max(l2), r, e, c2),
            )?;
            ratio_check(
                "two_colour_temperature (order)",
                &two_colour_temperature(l1, l2, r, e, c2),
            )?;
            // Consistent data from Planck's law at t.
            if let (Ok(a), Ok(b)) = (
                quantaband::planck::spectral_radiance_wavelength(l1.min(l2), t),
                quantaband::planck::spectral_radiance_wavelength(l1.max(l2), t),
            ) {
                ratio_check(
                    "two_colour_temperature (forward)",
                    &two_colour_temperature(l1.min(l2), l1.max(l2), a / b, 1.0, c2),
                )?;
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// GUM

/// A GUM result: no NaN; ±∞ in the degrees of freedom, which the docs define as `f64::INFINITY`
/// when the uncertainty is known exactly ("Welch–Satterthwaite effective degrees of freedom,
/// untruncated (`f64::INFINITY` when …)"), and in u_c and U only where the docs allow it ("+∞
/// only where their true value is above `f64::MAX`"): u_c only if `bound` = Σ|c_i u_i| ≥ u_c is
/// at least f64::MAX, U only if u_c is ∞ or the product k·u_c overflows.
fn gum_check(what: &str, r: Result<&GumResult, &Error>, bound: f64) -> Result<(), TestCaseError> {
    match r {
        Ok(g) => {
            check(what, &Ok::<_, Error>(g), Inf::Documented)?;
            let uc = g.combined_standard_uncertainty;
            let uc_ok = uc.is_finite() || bound >= f64::MAX;
            let big_u = g.expanded_uncertainty;
            let u_ok =
                big_u.is_finite() || !uc.is_finite() || !(g.coverage_factor * uc).is_finite();
            prop_assert!(
                uc_ok && u_ok,
                "{}: u_c = {:e}, U = {:e}, Σ|c u| = {:e}",
                what,
                uc,
                big_u,
                bound
            );
            // coverage_factor: "+∞ for a factor beyond the f64 range".
            prop_assert!(
                g.coverage_factor >= 0.0,
                "{}: k = {}",
                what,
                g.coverage_factor
            );
            prop_assert!(!GumMethod::describe(&g.method).is_empty());
            Ok(())
        }
        Err(e) => common::check_err(what, e),
    }
}

/// An input uncertainty: the uncertainty finite; the degrees of freedom may be ∞ ("`f64::INFINITY`
/// when the uncertainty is known exactly").
fn input_check(what: &str, r: &Result<InputUncertainty, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)?;
    if let Ok(i) = r {
        ok(what, &Ok::<_, Error>(i.standard_uncertainty))?;
    }
    Ok(())
}

/// A valid N×N correlation matrix from random unit vectors (Gram matrix), or an adversarial one.
fn correlation_matrices() -> impl Strategy<Value = Vec<f64>> {
    let gram = (1usize..5)
        .prop_flat_map(|n| prop::collection::vec(prop::collection::vec(-1.0..1.0f64, 3), n))
        .prop_map(|vs| {
            let n = vs.len();
            let unit: Vec<Vec<f64>> = vs
                .iter()
                .map(|v| {
                    let l = v.iter().map(|x| x * x).sum::<f64>().sqrt().max(1e-300);
                    v.iter().map(|x| x / l).collect()
                })
                .collect();
            let mut m = vec![0.0; n * n];
            for i in 0..n {
                for j in 0..n {
                    m[i * n + j] = if i == j {
                        1.0
                    } else {
                        unit[i]
                            .iter()
                            .zip(&unit[j])
                            .map(|(a, b)| a * b)
                            .sum::<f64>()
                            .clamp(-1.0, 1.0)
                    };
                }
            }
            for i in 0..n {
                for j in 0..i {
                    m[i * n + j] = m[j * n + i];
                }
            }
            m
        });
    prop_oneof![
        3 => gram,
        1 => prop::collection::vec(prop_oneof![special(), -1.5..1.5f64], 0..20),
        1 => (1usize..5).prop_map(|n| {
            let mut m = vec![1.0; n * n];
            if n > 1 { m[1] = -1.0; m[n] = -1.0; }
            m
        }),
    ]
}

#[test]
fn fuzz_gum() {
    fuzz(
        "gum",
        1500,
        (
            prop::collection::vec(input_uncertainties(), 0..6),
            slice(&arg(-10.0, 10.0), false, 0, 40),
            slice(&arg(-10.0, 10.0), false, 0, 40),
            correlation_matrices(),
            coverages(),
            args(&[
                arg(0.0, 10.0).edges(&[0.0]),
                arg(1.0, 100.0).edges(&[0.0, f64::INFINITY]),
                arg(-5.0, 5.0),
                arg(0.5, 0.999).edges(&[0.0, 1.0]),
            ]),
        ),
        |(inputs, x, y, matrix, coverage, v)| {
            let (u, dof, t, p) = (v[0], v[1], v[2], v[3]);
            input_check("InputUncertainty::type_b", &InputUncertainty::type_b(u))?;
            input_check(
                "InputUncertainty::type_a",
                &InputUncertainty::type_a(u, dof),
            )?;
            input_check(
                "InputUncertainty::rectangular",
                &InputUncertainty::rectangular(u),
            )?;
            input_check(
                "InputUncertainty::triangular",
                &InputUncertainty::triangular(u),
            )?;
            input_check("InputUncertainty::arcsine", &InputUncertainty::arcsine(u))?;
            for i in &inputs {
                ok("InputUncertainty::validate", &InputUncertainty::validate(i))?;
            }
            let ta = type_a(&x);
            check("type_a", &ta, Inf::Never)?;
            if let Ok(ta) = &ta {
                input_check("TypeA::input", &TypeA::input(ta))?;
            }
            ok("type_a_correlation", &type_a_correlation(&x, &y))?;
            let corr = Correlation::new(&matrix);
            ok("Correlation::new", &corr)?;
            let mut work = vec![0.0; matrix.len()];
            ok(
                "Correlation::with_workspace",
                &Correlation::with_workspace(&matrix, &mut work),
            )?;
            let n = inputs.len();
            let sens: Vec<f64> = x
                .iter()
                .copied()
                .chain(std::iter::repeat(1.0))
                .take(n)
                .collect();
            let bound = |s: &[f64], u: &[InputUncertainty]| -> f64 {
                s.iter()
                    .zip(u)
                    .map(|(c, u)| (c * u.standard_uncertainty).abs())
                    .sum()
            };
            let mut entries = vec![GumEntry::default(); n];
            let r = propagate(&sens, &inputs, None, coverage, Some(&mut entries));
            gum_check("propagate", r.as_ref(), bound(&sens, &inputs))?;
            if r.is_ok() {
                let e: Vec<(f64, f64)> = entries
                    .iter()
                    .map(|e| (e.component, e.variance_share))
                    .collect();
                ok("propagate entries", &Ok::<_, Error>(e))?;
            }
            gum_check(
                "propagate (raw sensitivities)",
                propagate(&x, &inputs, None, coverage, None).as_ref(),
                bound(&x, &inputs),
            )?;
            if let Ok(c) = &corr {
                let k = Correlation::size(c);
                prop_assert_eq!(Correlation::matrix(c).len(), k * k);
                finite(
                    "Correlation::get",
                    &(
                        Correlation::get(c, 0, 0),
                        Correlation::get(c, k, 0),
                        Correlation::get(c, usize::MAX, usize::MAX),
                    ),
                )?;
                let inputs_k: Vec<InputUncertainty> =
                    inputs.iter().copied().cycle().take(k).collect();
                let sens_k = vec![1.0; inputs_k.len()];
                // Σ|c_i u_i| bounds u_c also with correlations (|r_ij| ≤ 1).
                gum_check(
                    "propagate (correlated)",
                    propagate(&sens_k, &inputs_k, Some(c), coverage, None).as_ref(),
                    bound(&sens_k, &inputs_k),
                )?;
            }
            ok("student_t_cdf", &student_t_cdf(t, dof))?;
            // student_t_quantile: "A quantile beyond the f64 range is otherwise returned as ±∞";
            // coverage_factor: "+∞ for a factor beyond the f64 range".
            check(
                "student_t_quantile",
                &student_t_quantile(p, dof),
                Inf::Documented,
            )?;
            check("coverage_factor", &coverage_factor(p, dof), Inf::Documented)?;
            // Loose check of that claim: an infinite quantile needs a heavy tail (ν < 1, where
            // |t| ~ (1/q)^(1/ν) can leave the f64 range for q ≥ 5e-324 only if ν < 0.43).
            if let Ok(q) = student_t_quantile(p, dof) {
                prop_assert!(q.is_finite() || dof < 0.5, "quantile {} for ν = {}", q, dof);
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Random generators and Monte Carlo

#[test]
fn fuzz_random() {
    fuzz(
        "random",
        2000,
        (
            any::<u64>(),
            any::<[u64; 4]>(),
            distributions(),
            args(&[
                arg(-10.0, 10.0),
                arg(0.0, 10.0).edges(&[0.0]),
                arg(1.0, 100.0).edges(&[f64::INFINITY]),
            ]),
        ),
        |(seed, state, dist, v)| {
            let (est, u, dof) = (v[0], v[1], v[2]);
            let mut s = seed;
            let _ = splitmix64(&mut s);
            let mut g = Xoshiro256StarStar::new(seed);
            let _ = Xoshiro256StarStar::next_u64(&mut g);
            let x = Xoshiro256StarStar::next_open01(&mut g);
            prop_assert!(x > 0.0 && x < 1.0);
            let _ = Xoshiro256StarStar::state(&g);
            let from = Xoshiro256StarStar::from_state(state);
            ok("Xoshiro256StarStar::from_state", &from)?;
            prop_assert!(Xoshiro256StarStar::from_state([0; 4]).is_err());
            let mut sm = Sampler::new(seed);
            let _ = Sampler::generator(&sm);
            let uu = Sampler::uniform(&mut sm);
            prop_assert!(uu > 0.0 && uu < 1.0);
            finite(
                "Sampler::standard_normal",
                &Sampler::standard_normal(&mut sm),
            )?;
            // student_t and sample: "the caller guarantees ν > 0"; with a valid input they must
            // give a number.
            if dof > 0.0 {
                finite(
                    "Sampler::student_t",
                    &Sampler::student_t(&mut sm, dof.max(1.0)),
                )?;
            }
            if est.is_finite()
                && u.is_finite()
                && u >= 0.0
                && est.abs() < 1e300
                && u < 1e300
                && dof >= 1.0
            {
                finite(
                    "Sampler::sample",
                    &Sampler::sample(&mut sm, dist, est, u, dof),
                )?;
            }
            Ok(())
        },
    );
}

fn mc_models() -> impl Strategy<Value = u8> {
    0u8..6
}

/// Model `k` of a small set: well-behaved, with NaN/∞ outputs, with errors.
fn mc_model(k: u8) -> impl Fn(&[f64]) -> quantaband::Result<f64> {
    move |x: &[f64]| -> quantaband::Result<f64> {
        let s: f64 = x.iter().sum();
        match k {
            0 => Ok(s),
            1 => Ok(x.iter().product()),
            2 => Ok(1.0 / s),
            3 => Ok(if s > 0.0 { f64::NAN } else { s }),
            4 => {
                if s > 0.5 {
                    Err(Error::NoSolution { what: "fuzz model" })
                } else {
                    Ok(s.exp())
                }
            }
            _ => Ok(s * 1e300 * 1e10),
        }
    }
}

#[test]
fn fuzz_monte_carlo() {
    fuzz(
        "monte carlo",
        250,
        (
            any::<u64>(),
            arg(0.5, 0.99).edges(&[0.0, 1.0, 1.0 - 1e-7]).any(),
            prop_oneof![
                Just(TrialCount::Adaptive),
                (0usize..400).prop_map(|trials| TrialCount::Fixed { trials })
            ],
            0u8..8,
            prop::sample::select(vec![
                IntervalKind::ProbabilisticallySymmetric,
                IntervalKind::Shortest,
            ]),
            prop::collection::vec(input_uncertainties(), 0..4),
            slice(&arg(-3.0, 3.0), false, 0, 6),
            (mc_models(), 0usize..400, 0usize..600),
            slice(&arg(-5.0, 5.0), true, 0, 300),
        ),
        |(
            seed,
            p,
            trials,
            digits,
            interval,
            inputs,
            estimates,
            (model, max_trials, values_len),
            sorted,
        )| {
            let config = MonteCarloConfig {
                seed,
                coverage_probability: p,
                trials,
                significant_digits: digits,
                interval,
            };
            let mc = MonteCarlo::new(config, &estimates, &inputs, None);
            // The run state is not a result (it holds the inputs, whose ν may be ∞): only the
            // error is checked here; progress and results below.
            if let Err(e) = &mc {
                common::check_err("MonteCarlo::new", e)?;
            }
            if let Ok(mut mc) = mc {
                prop_assert!(MonteCarlo::batch_size(&mc) > 0);
                let mut values = vec![0.0; values_len];
                let f = mc_model(model);
                let progress = MonteCarlo::run(&mut mc, &f, &mut values, max_trials);
                ok("MonteCarlo::run", &progress)?;
                ok(
                    "MonteCarlo::progress",
                    &Ok::<_, Error>(MonteCarlo::progress(&mc)),
                )?;
                if matches!(progress, Ok(p) if p.status == RunStatus::Running) {
                    ok(
                        "MonteCarlo::run (again)",
                        &MonteCarlo::run(&mut mc, &f, &mut values, max_trials),
                    )?;
                }
                let r = MonteCarlo::finish(&mc, &mut values);
                ok("MonteCarlo::finish", &r)?;
                if let Ok(r) = &r {
                    let sens = vec![1.0; inputs.len()];
                    if let Ok(g) = propagate(&sens, &inputs, None, Coverage::Probability(p), None) {
                        ok("validate_gum", &validate_gum(estimates.iter().sum(), &g, r))?;
                    }
                }
            }
            let tol = numerical_tolerance(p * 10.0, digits);
            prop_assert!(!tol.is_nan(), "numerical_tolerance NaN");
            let _ = numerical_tolerance(f64::INFINITY, digits);
            ok("recommended_bins", &recommended_bins(&sorted))?;
            let mut counts = vec![0u64; (max_trials % 50) + (digits as usize % 2)];
            ok("histogram", &histogram(&sorted, &mut counts))?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// ITS-90, Sakuma–Hattori fits, calibration transfer

fn fixed_points() -> impl Strategy<Value = FixedPoint> {
    prop::sample::select(FixedPoint::ALL.to_vec())
}

/// Ratio-temperature sensitivities: the temperature finite, the sensitivities ±∞ only as the
/// docs allow ("Each sensitivity here is ±∞ only where its true value is beyond the f64 range").
fn sens_check(what: &str, r: &Result<RatioSensitivities, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)?;
    if let Ok(s) = r {
        ok(what, &Ok::<_, Error>(s.temperature_k))?;
    }
    Ok(())
}

#[test]
fn fuzz_its90() {
    fuzz(
        "its90",
        3000,
        (
            fixed_points(),
            c2s(),
            args(&[
                arg(1e-6, 1e6).edges(&[0.0, 1.0]),
                wavelength(),
                temperature(),
                temperature(),
            ]),
        ),
        |(fp, c2, v)| {
            let (r, l, t, tx) = (v[0], v[1], v[2], v[3]);
            let tk = FixedPoint::temperature_k(fp);
            prop_assert!(tk > 0.0 && FixedPoint::temperature_c(fp).is_finite());
            prop_assert!(!FixedPoint::name(fp).is_empty());
            let _ = FixedPoint::defines_ratio_relation(fp);
            ok(
                "temperature_from_ratio",
                &temperature_from_ratio(r, l, tx, c2),
            )?;
            // radiance_ratio: "it overflows to ∞ or underflows to 0 only where the true ratio
            // is outside the f64 range".
            check(
                "radiance_ratio",
                &radiance_ratio(t, l, tx, c2),
                Inf::Documented,
            )?;
            ok("its90_temperature", &its90_temperature(r, l, fp))?;
            sens_check(
                "ratio_temperature_sensitivities",
                &ratio_temperature_sensitivities(r, l, tx, c2),
            )?;
            if let Ok(rr) = radiance_ratio(t, l, tk, c2) {
                ok("its90_temperature (forward)", &its90_temperature(rr, l, fp))?;
                ok(
                    "temperature_from_ratio (forward)",
                    &temperature_from_ratio(rr, l, tk, c2),
                )?;
                sens_check(
                    "ratio_temperature_sensitivities (forward)",
                    &ratio_temperature_sensitivities(rr, l, tk, c2),
                )?;
            }
            Ok(())
        },
    );
}

#[test]
fn fuzz_fits() {
    fuzz(
        "sakuma-hattori fits",
        60,
        (
            model_cases(),
            c2s(),
            [fixed_points(), fixed_points(), fixed_points()],
            slice(&arg(300.0, 2500.0), true, 3, 120),
            slice(&arg(-1e-4, 1e-4).edges(&[0.0]), false, 3, 120),
            args(&[
                temperature(),
                temperature(),
                arg(2.0, 60.0).edges(&[0.0, 1.0, 2.0]),
            ]),
        ),
        |(case, c2, fps, temps, noise, v)| {
            let (t1, t2, n) = (v[0], v[1], v[2]);
            let n_points = if n.is_finite() && n >= 0.0 {
                (n as usize).min(200)
            } else {
                0
            };
            with_model(&case, c2, &mut |m| {
                // Signals from the model (relative noise added), or raw adversarial values.
                let signals: Vec<f64> = temps
                    .iter()
                    .zip(noise.iter().chain(std::iter::repeat(&0.0)))
                    .map(|(t, e)| m.signal(*t).unwrap_or(*t) * (1.0 + e))
                    .collect();
                let mut residuals = vec![0.0; temps.len()];
                let fit = SakumaHattori::fit(&temps, &signals, c2, Some(&mut residuals));
                ok("SakumaHattori::fit", &fit)?;
                ok(
                    "SakumaHattori::fit (raw signals)",
                    &SakumaHattori::fit(&temps, &noise, c2, None),
                )?;
                let fm = SakumaHattori::fit_model(m, t1, t2, c2);
                ok("SakumaHattori::fit_model", &fm)?;
                if let Ok(fit) = &fit {
                    ok(
                        "max_interpolation_error_k",
                        &max_interpolation_error_k(&fit.curve, m, t1, t2, n_points),
                    )?;
                }
                let fpc = fixed_point_curve(m, fps, c2);
                ok("fixed_point_curve", &fpc)?;
                if let Ok(curve) = &fpc {
                    ok(
                        "FixedPointCurve::interpolation_errors",
                        &FixedPointCurve::interpolation_errors(curve, m, t1, t2, n_points),
                    )?;
                }
                // Calibration transfer through reference points on the model.
                let points: Vec<ReferencePoint> = temps
                    .iter()
                    .zip(&signals)
                    .zip(noise.iter().chain(std::iter::repeat(&0.0)))
                    .map(|((t, s), e)| ReferencePoint {
                        temperature_k: *t,
                        signal: *s,
                        u_temperature_k: e.abs() * 1e3,
                        u_signal: e.abs() * s.abs(),
                    })
                    .collect();
                let ct = CalibrationTransfer::fit(&points, c2);
                ok("CalibrationTransfer::fit", &ct)?;
                if let Ok(ct) = &ct {
                    let _ = CalibrationTransfer::curve(ct);
                    finite(
                        "CalibrationTransfer::rms_residual_k",
                        &CalibrationTransfer::rms_residual_k(ct),
                    )?;
                    finite(
                        "CalibrationTransfer::parameter_covariance",
                        &CalibrationTransfer::parameter_covariance(ct),
                    )?;
                    finite(
                        "CalibrationTransfer::parameter_correlation",
                        &CalibrationTransfer::parameter_correlation(ct),
                    )?;
                    let s = m.signal(t1).unwrap_or(t1);
                    let mut dt = vec![0.0; points.len()];
                    let mut ds = vec![0.0; points.len()];
                    let r =
                        CalibrationTransfer::reading(ct, s, s * 1e-3, Some(&mut dt), Some(&mut ds));
                    ok("CalibrationTransfer::reading", &r)?;
                    if r.is_ok() {
                        finite("CalibrationTransfer::reading derivatives", &(&dt, &ds))?;
                    }
                    ok(
                        "CalibrationTransfer::reading (raw)",
                        &CalibrationTransfer::reading(ct, t2, n, None, None),
                    )?;
                }
                Ok(())
            })
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Spectral tables and the spectral measurement equation

const KINDS: [TableKind; 5] = [
    TableKind::Emissivity,
    TableKind::Reflectance,
    TableKind::Transmittance,
    TableKind::EnergyResponse,
    TableKind::PhotonResponse,
];

/// An optical-property table (ε, ρ or τ) over a range around the response's band.
fn property_table() -> impl Strategy<Value = (Vec<f64>, Vec<f64>)> {
    (
        slice(&arg(0.3e-6, 20e-6), true, 2, 100),
        slice(&arg(0.0, 1.0).edges(&[0.0, 1.0]), false, 2, 100),
    )
        .prop_map(|(w, mut v)| {
            if v.len() > w.len() && w.len() >= 2 {
                v.truncate(w.len());
            }
            (w, v)
        })
}

#[derive(Clone, Debug)]
enum ValueCase {
    Constant(f64),
    Table(Vec<f64>, Vec<f64>, bool),
}

fn value_cases(constant: Arg) -> impl Strategy<Value = ValueCase> {
    prop_oneof![
        constant.any().prop_map(ValueCase::Constant),
        (property_table(), any::<bool>()).prop_map(|((w, v), c)| ValueCase::Table(w, v, c)),
    ]
}

fn spectral_value(case: &ValueCase, kind: TableKind) -> Option<SpectralValue<'_>> {
    match case {
        ValueCase::Constant(c) => Some(SpectralValue::Constant(*c)),
        ValueCase::Table(w, v, c) => SpectralTable::new(kind, w, v).ok().map(|t| {
            SpectralValue::Table(SpectralTable::with_ends(
                t,
                if *c { Ends::Constant } else { Ends::Reject },
            ))
        }),
    }
}

#[test]
fn fuzz_spectral() {
    let text_line = prop_oneof![
        (arg(0.3, 20.0).any(), arg(0.0, 1.0).any()).prop_map(|(a, b)| format!("{a} {b}")),
        (arg(0.3, 20.0).any(), arg(0.0, 1.0).any()).prop_map(|(a, b)| format!("{a},{b}")),
        Just("# comment".to_string()),
        Just(String::new()),
        "[ -~]{0,12}",
        Just("1e400 0.5".to_string()),
        Just("nan 0.5".to_string()),
        Just("5 inf".to_string()),
    ];
    fuzz(
        "spectral",
        250,
        (
            (response_table(), any::<bool>(), c2s()),
            (
                value_cases(unit_open_closed()),
                prop::option::weighted(0.3, value_cases(arg(0.0, 0.5).edges(&[0.0, 1.0]))),
                value_cases(unit_open_closed()),
            ),
            prop::option::weighted(
                0.3,
                (
                    value_cases(unit_open_closed()),
                    value_cases(arg(0.0, 0.3).edges(&[0.0, 1.0])),
                ),
            ),
            (
                prop::collection::vec(text_line, 0..12),
                prop::sample::select(KINDS.to_vec()),
                prop::sample::select(vec![
                    SpectralUnit::Micrometre,
                    SpectralUnit::Nanometre,
                    SpectralUnit::PerCentimetre,
                    SpectralUnit::Terahertz,
                    SpectralUnit::Electronvolt,
                ]),
            ),
            conditions(),
            args(&[
                temperature(),
                temperature(),
                temperature(),
                temperature(),
                temperature(),
                factor(),
                wavelength(),
            ]),
        ),
        |((resp, photon, c2), (eps, rho, tau), window, (lines, kind, unit), grey, v)| {
            let (t, tr, tp, tw, twr, f, l) = (v[0], v[1], v[2], v[3], v[4], v[5], v[6]);
            // Tables.
            for k in KINDS {
                let _ = TableKind::is_response(k);
                prop_assert!(!TableKind::name(k).is_empty());
                let tab = SpectralTable::new(k, &resp.0, &resp.1);
                ok("SpectralTable::new", &tab)?;
                if let Ok(tab) = tab {
                    for ends in [Ends::Reject, Ends::Constant] {
                        let tab = SpectralTable::with_ends(tab, ends);
                        prop_assert_eq!(SpectralTable::kind(&tab), k);
                        prop_assert_eq!(SpectralTable::ends(&tab), ends);
                        prop_assert_eq!(
                            SpectralTable::wavelengths_m(&tab).len(),
                            SpectralTable::values(&tab).len()
                        );
                        let (a, b) = SpectralTable::span_m(&tab);
                        prop_assert!(a < b);
                        ok("SpectralTable::value_at", &SpectralTable::value_at(&tab, l))?;
                        ok(
                            "SpectralTable::value_at (inside)",
                            &SpectralTable::value_at(&tab, 0.5 * (a + b)),
                        )?;
                    }
                }
                let buf = SpectralTableBuf::new(k, resp.0.clone(), resp.1.clone());
                ok("SpectralTableBuf::new", &buf)?;
                if let Ok(buf) = buf {
                    let buf = SpectralTableBuf::with_ends(buf, Ends::Constant);
                    prop_assert_eq!(SpectralTableBuf::kind(&buf), k);
                    ok(
                        "SpectralTableBuf::as_table value_at",
                        &SpectralTable::value_at(&SpectralTableBuf::as_table(&buf), l),
                    )?;
                }
            }
            let text = lines.join("\n");
            let parsed = SpectralTableBuf::from_text(kind, &text, unit);
            ok("SpectralTableBuf::from_text", &parsed)?;
            // The same text through the caller's parser (Rust's, as the facade's is
            // equivalent): the same table or the same error.
            let with = SpectralTableBuf::from_text_with(kind, &text, unit, &|f: &str| {
                f.parse::<f64>().ok()
            });
            ok("SpectralTableBuf::from_text_with", &with)?;
            prop_assert_eq!(format!("{with:?}"), format!("{parsed:?}"));
            // Spectral values and conditions.
            let eps_v = spectral_value(&eps, TableKind::Emissivity);
            let rho_v = rho
                .as_ref()
                .map(|r| spectral_value(r, TableKind::Reflectance));
            let tau_v = spectral_value(&tau, TableKind::Transmittance);
            let win_v = window.as_ref().map(|(wt, wr)| {
                (
                    spectral_value(wt, TableKind::Transmittance),
                    spectral_value(wr, TableKind::Reflectance),
                )
            });
            if let Some(e) = &eps_v {
                ok("SpectralValue::value_at", &SpectralValue::value_at(e, l))?;
            }
            let (Some(e), Some(tau_v)) = (eps_v, tau_v) else {
                return Ok(());
            };
            let reflectance = match rho_v {
                Some(Some(r)) => Some(r),
                Some(None) => return Ok(()),
                None => None,
            };
            let window = match win_v {
                Some((Some(wt), Some(wr))) => Some(SpectralWindow {
                    transmittance: wt,
                    reflectance: wr,
                    temperature_k: tw,
                    reflected_temperature_k: twr,
                }),
                Some(_) => return Ok(()),
                None => None,
            };
            let cond = SpectralConditions {
                emissivity: e,
                reflectance,
                reflected_temperature_k: tr,
                path_transmittance: tau_v,
                path_temperature_k: tp,
                window,
            };
            ok(
                "SpectralConditions::validate",
                &SpectralConditions::validate(&cond),
            )?;
            let grey_s = SpectralConditions::from_grey(&grey);
            ok(
                "SpectralConditions::validate (grey)",
                &SpectralConditions::validate(&grey_s),
            )?;
            let rkind = if photon {
                TableKind::PhotonResponse
            } else {
                TableKind::EnergyResponse
            };
            let Ok(rtab) = SpectralTable::new(rkind, &resp.0, &resp.1) else {
                return Ok(());
            };
            let Ok(inst) = SpectralInstrument::new(rtab, c2) else {
                return Ok(());
            };
            for c in [&cond, &grey_s] {
                ok(
                    "SpectralConditions::validate_for",
                    &SpectralConditions::validate_for(c, &inst),
                )?;
                let terms = spectral_signal_terms(&inst, t, c);
                check("spectral_signal_terms", &terms, MODEL_INF)?;
                let s = spectral_measured_signal(&inst, t, c);
                check("spectral_measured_signal", &s, MODEL_INF)?;
                let s = s.unwrap_or(1.0) * f;
                ok(
                    "spectral_object_temperature",
                    &spectral_object_temperature(&inst, s, c),
                )?;
                ok("band_effective", &band_effective(&inst, t, c))?;
                ok(
                    "spectral_sensitivities",
                    &spectral_sensitivities(&inst, s, c),
                )?;
                ok(
                    "correct_reading_spectral",
                    &correct_reading_spectral(&inst, t, &grey, c),
                )?;
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Frame conversion

/// Checks a converted frame: every output is NaN (invalid) or a finite positive temperature,
/// the summary counts them, and its range spans the valid pixels (NaN when there is none, as
/// `FrameSummary` documents).
fn frame_check<O: FrameOutput + Into<f64>>(
    what: &str,
    r: &Result<FrameSummary, Error>,
    out: &[O],
) -> Result<(), TestCaseError> {
    match r {
        Ok(s) => {
            let vals: Vec<f64> = out.iter().map(|&o| o.into()).collect();
            let valid: Vec<f64> = vals.iter().copied().filter(|v| !v.is_nan()).collect();
            prop_assert_eq!(s.valid, valid.len(), "{}: valid count", what);
            prop_assert_eq!(
                s.invalid,
                vals.len() - valid.len(),
                "{}: invalid count",
                what
            );
            // FrameOutput::from_f64: "for `f32` a temperature above `f32::MAX` ... becomes +∞
            // and one below the f32 range 0, both still counted valid".
            let f32_out = std::mem::size_of::<O>() == 4;
            for v in &valid {
                prop_assert!(
                    (v.is_finite() && *v > 0.0) || (f32_out && (*v == f64::INFINITY || *v == 0.0)),
                    "{}: pixel temperature {}",
                    what,
                    v
                );
            }
            if valid.is_empty() {
                prop_assert!(
                    s.min_temperature_k.is_nan() && s.max_temperature_k.is_nan(),
                    "{}: {:?}",
                    what,
                    s
                );
            } else {
                let lo = valid.iter().copied().fold(f64::INFINITY, f64::min);
                let hi = valid.iter().copied().fold(0.0, f64::max);
                prop_assert_eq!(
                    (s.min_temperature_k, s.max_temperature_k),
                    (lo, hi),
                    "{}",
                    what
                );
            }
            Ok(())
        }
        Err(e) => common::check_err(what, e),
    }
}

#[test]
fn fuzz_frame() {
    let raw = arg(0.0, 65535.0);
    fuzz(
        "frame",
        400,
        (
            (
                arg(0.5e-6, 12e-6).any(),
                arg(-1e-5, 5e-4).edges(&[0.0]).any(),
                arg(1e-3, 1e9).edges(&[0.0]).any(),
                c2s(),
            ),
            conditions(),
            args(&[arg(1e-4, 10.0).edges(&[0.0]), arg(-1e3, 1e3).edges(&[0.0])]),
            slice(&raw, false, 0, 500),
            (
                prop::option::of(slice(&arg(0.8, 1.2).edges(&[0.0]), false, 0, 8)),
                prop::option::of(slice(&arg(-100.0, 100.0), false, 0, 8)),
                prop::option::of(slice(&unit_open_closed(), false, 0, 8)),
                prop::option::of(prop::collection::vec(0u8..3, 0..8)),
            ),
            any::<u16>(),
        ),
        |((a, b, c, c2), cond, gv, raw, (gain, offset, emis, bad), w)| {
            let (g, o) = (gv[0], gv[1]);
            // fast_ln: "the result is meaningless for w < √½ or non-finite w"; for w ≥ 1 it must
            // be finite.
            let lw = fast_ln(f64::from(w) + 1.0);
            prop_assert!(lw.is_finite());
            let _ = fast_ln(raw.first().copied().unwrap_or(f64::NAN));
            let _ = <u16 as FrameInput>::to_f64(w);
            let _ = <f32 as FrameInput>::to_f64(w as f32);
            let _ = <f64 as FrameInput>::to_f64(f64::from(w));
            let _ = <f32 as FrameOutput>::from_f64(a);
            let _ = <f64 as FrameOutput>::from_f64(a);
            // min_max: "of a slice of non-negative values and NaN".
            let nonneg: Vec<f64> = raw
                .iter()
                .map(|x| if x.is_nan() || *x < 0.0 { f64::NAN } else { *x })
                .collect();
            let (lo, hi) = <f64 as FrameOutput>::min_max(&nonneg);
            let finite_vals: Vec<f64> = nonneg.iter().copied().filter(|v| !v.is_nan()).collect();
            if !finite_vals.is_empty() {
                prop_assert_eq!(
                    lo,
                    finite_vals.iter().copied().fold(f64::INFINITY, f64::min)
                );
                prop_assert_eq!(hi, finite_vals.iter().copied().fold(0.0, f64::max));
            }
            let nonneg32: Vec<f32> = nonneg.iter().map(|&v| v as f32).collect();
            let _ = <f32 as FrameOutput>::min_max(&nonneg32);

            let Ok(curve) = SakumaHattori::new(a, b, c, c2) else {
                return Ok(());
            };
            let conv = FrameConverter::new(&curve, &cond, g, o);
            ok("FrameConverter::new", &conv)?;
            let Ok(conv) = conv else { return Ok(()) };
            finite(
                "FrameConverter::background",
                &FrameConverter::background(&conv),
            )?;
            let counts: Vec<u16> = raw.iter().map(|&x| x.clamp(0.0, 65535.0) as u16).collect();
            let raw32: Vec<f32> = raw.iter().map(|&x| x as f32).collect();
            let n = raw.len();
            let mut out64 = vec![0f64; n];
            let mut out32 = vec![0f32; n];
            let r = FrameConverter::convert(&conv, &raw, &mut out64);
            frame_check("convert f64→f64", &r, &out64)?;
            let r = FrameConverter::convert(&conv, &counts, &mut out32);
            frame_check("convert u16→f32", &r, &out32)?;
            let r = FrameConverter::convert(&conv, &raw32, &mut out32);
            frame_check("convert f32→f32", &r, &out32)?;
            let r = FrameConverter::convert(&conv, &counts, &mut out64[..n.saturating_sub(1)]);
            frame_check("convert (short output)", &r, &out64[..n.saturating_sub(1)])?;
            // Emissivity maps: cycled to the frame length (or left short, an error).
            let cyc = |m: &Option<Vec<f64>>| -> Option<Vec<f32>> {
                m.as_ref().map(|m| {
                    if m.is_empty() {
                        Vec::new()
                    } else {
                        m.iter().cycle().take(n).map(|&x| x as f32).collect()
                    }
                })
            };
            let emis32 = cyc(&emis).unwrap_or_else(|| vec![0.9; n]);
            let r = FrameConverter::convert_with_emissivity(&conv, &counts, &emis32, &mut out32);
            frame_check("convert_with_emissivity u16", &r, &out32)?;
            let emis64: Vec<f64> = emis32.iter().map(|&x| f64::from(x)).collect();
            let r = FrameConverter::convert_with_emissivity(&conv, &raw, &emis64, &mut out64);
            frame_check("convert_with_emissivity f64", &r, &out64)?;
            let (gain32, offset32, bad_v) = (
                cyc(&gain),
                cyc(&offset),
                bad.map(|b| {
                    if b.is_empty() {
                        b
                    } else {
                        b.iter().cycle().take(n).copied().collect()
                    }
                }),
            );
            let corr = PixelCorrections {
                gain: gain32.as_deref(),
                offset: offset32.as_deref(),
                emissivity: cyc(&emis).as_deref().map(|_| &emis32[..]),
                bad_pixels: bad_v.as_deref(),
            };
            let r = FrameConverter::convert_corrected(&conv, &raw32, &corr, &mut out32);
            frame_check("convert_corrected f32", &r, &out32)?;
            let r = FrameConverter::convert_corrected(&conv, &counts, &corr, &mut out64);
            frame_check("convert_corrected u16→f64", &r, &out64)?;
            let none: PixelCorrections<'_, f32> = PixelCorrections::NONE;
            let r = FrameConverter::convert_corrected(&conv, &counts, &none, &mut out32);
            frame_check("convert_corrected none", &r, &out32)?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Multi-wavelength and Raman thermometry

fn emissivity_models() -> impl Strategy<Value = EmissivityModel> {
    prop_oneof![
        (0u8..7).prop_map(|order| EmissivityModel::Polynomial { order }),
        (0u8..7).prop_map(|order| EmissivityModel::LogPolynomial { order }),
        Just(EmissivityModel::GREY),
        Just(EmissivityModel::LINEAR),
        Just(EmissivityModel::LOG_LINEAR),
    ]
}

fn fit_methods(fit: &MultiwavelengthFit, l: f64) -> Result<(), TestCaseError> {
    let p = MultiwavelengthFit::parameter_count(fit);
    prop_assert!(p >= 2);
    ok(
        "MultiwavelengthFit::emissivity",
        &MultiwavelengthFit::emissivity(fit, l),
    )?;
    ok(
        "MultiwavelengthFit::emissivity (centre)",
        &MultiwavelengthFit::emissivity(fit, fit.centre_wavelength_m),
    )?;
    finite(
        "MultiwavelengthFit::slope_per_m",
        &MultiwavelengthFit::slope_per_m(fit),
    )?;
    for i in 0..p + 2 {
        finite(
            "MultiwavelengthFit::standard_uncertainty",
            &MultiwavelengthFit::standard_uncertainty(fit, i),
        )?;
        for j in [0, i, p + 5] {
            finite(
                "MultiwavelengthFit::correlation",
                &MultiwavelengthFit::correlation(fit, i, j),
            )?;
        }
    }
    Ok(())
}

#[test]
fn fuzz_multiwavelength() {
    fuzz(
        "multiwavelength",
        150,
        (
            emissivity_models(),
            c2s(),
            slice(&arg(0.5e-6, 2.5e-6), true, 2, 64),
            slice(&arg(-0.02, 0.02), false, 2, 64),
            args(&[
                arg(600.0, 3000.0).edges(&[0.0]),
                arg(0.1, 1.0).edges(&[0.0]),
                arg(-0.3, 0.3),
                arg(1e-3, 0.05).edges(&[0.0]),
                arg(1e6, 1e14).edges(&[0.0]),
                arg(0.9, 1.0).edges(&[0.0, 1.0]),
            ]),
        ),
        |(model, c2, w, noise, v)| {
            let (t, e0, slope, ur, cond_max, corr_max) = (v[0], v[1], v[2], v[3], v[4], v[5]);
            let _ = EmissivityModel::order(model);
            let _ = EmissivityModel::parameter_count(model);
            let options = MultiwavelengthOptions {
                model,
                max_condition_number: cond_max,
                max_abs_correlation: corr_max,
            };
            let n = w.len();
            let lmid = w.get(n / 2).copied().unwrap_or(1e-6);
            let radiances: Vec<f64> = w
                .iter()
                .zip(noise.iter().chain(std::iter::repeat(&0.0)))
                .map(|(l, e)| {
                    let eps = (e0 * (1.0 + slope * (l / lmid - 1.0))).clamp(1e-3, 1.0);
                    quantaband::planck::spectral_radiance_wavelength(*l, t).unwrap_or(*l)
                        * eps
                        * (1.0 + e)
                })
                .collect();
            let u: Vec<f64> = radiances.iter().map(|r| r.abs() * ur).collect();
            let mut bright = vec![0.0; n];
            let fit = multiwavelength_fit(&w, &radiances, &u, c2, &options, &mut bright);
            ok("multiwavelength_fit", &fit)?;
            if let Ok(fit) = &fit {
                fit_methods(fit, lmid)?;
                finite("multiwavelength_fit brightness", &bright)?;
            }
            let defaults = MultiwavelengthOptions::default();
            ok(
                "multiwavelength_fit (raw)",
                &multiwavelength_fit(&w, &noise, &u, c2, &defaults, &mut bright),
            )?;
            let channels: Vec<SpectralPoint> = w
                .iter()
                .filter_map(|l| SpectralPoint::new(*l, c2).ok())
                .collect();
            let fit =
                multiwavelength_fit_channels(&channels, &w, &radiances, &u, &options, &mut bright);
            ok("multiwavelength_fit_channels", &fit)?;
            if let Ok(fit) = &fit {
                fit_methods(fit, lmid)?;
            }
            Ok(())
        },
    );
}

#[test]
fn fuzz_raman() {
    fuzz(
        "raman",
        4000,
        (
            prop::sample::select(vec![RamanDetection::Energy, RamanDetection::PhotonCounting]),
            args(&[
                arg(1e3, 1e6).edges(&[0.0]),
                arg(0.2e-6, 1.1e-6).edges(&[0.0]),
                arg(1.0, 3000.0).edges(&[0.0]),
                arg(1e-6, 1.0).edges(&[0.0, 1.0]),
            ]),
        ),
        |(det, v)| {
            let (shift, lx, t, r) = (v[0], v[1], v[2], v[3]);
            let _ = RamanDetection::exponent(det);
            ok(
                "raman_frequency_factor",
                &raman_frequency_factor(shift, lx, det),
            )?;
            ok(
                "anti_stokes_stokes_ratio",
                &anti_stokes_stokes_ratio(shift, lx, t, det),
            )?;
            // RamanReading: d_t_d_ratio and relative_sensitivity_per_k are "+∞ only where the
            // true value is above `f64::MAX`"; the rest must be finite.
            let raman_check =
                |what: &str, r: &Result<RamanReading, Error>| -> Result<(), TestCaseError> {
                    check(what, r, Inf::Documented)?;
                    if let Ok(r) = r {
                        ok(
                            what,
                            &Ok::<_, Error>((
                                r.temperature_k,
                                r.phonon_occupancy,
                                r.frequency_factor,
                                r.mode_temperature_k,
                            )),
                        )?;
                    }
                    Ok(())
                };
            raman_check("raman_temperature", &raman_temperature(shift, lx, r, det))?;
            if let Ok(rr) = anti_stokes_stokes_ratio(shift, lx, t, det) {
                raman_check(
                    "raman_temperature (forward)",
                    &raman_temperature(shift, lx, rr, det),
                )?;
            }
            Ok(())
        },
    );
}
