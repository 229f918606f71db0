//! Uncertainty evaluation for JavaScript (`src/wasm/js/uncertainty.js`): the GUM budget of the
//! measurement equation (`Instrument.uncertaintyBudget`, through [`measurement_budget`]), the
//! law of propagation for any model, Student's t, Type A evaluations, the Monte Carlo method
//! as a prepared object run in chunks (`QbMonteCarlo`), the calibration transfer and the
//! fixed-point curves of `CalibrationCurve`, and the ITS-90 ratio sensitivities.
//!
//! Results leave as plain numbers in f64 scratch buffer 0 (the export returns how many; the
//! facade, `uncertainty_results.js`, reads them back and builds the objects): no serializer
//! per result type in the module. The layouts are documented beside each writer and reader.
//!
//! Configuration arrives as plain numbers too: the facade reads the configuration objects
//! (keys, types and names checked there, with the caller's field paths) and passes each input
//! uncertainty as `[u, ν, evaluation, distribution, shorthand]` (ν = ∞ for omitted or `null`;
//! codes −1 for "not given"), correlations as `[i, j, r]` triples or a row-major matrix, and
//! options as numbers. The values themselves are checked here and in the core. Measured: serde
//! readers for these shapes cost about 60 KB of the module (DEVELOPERS.md, "Uncertainty
//! evaluation").

use alloc::format;
use alloc::vec;
use alloc::vec::Vec;

use wasm_bindgen::prelude::*;

use super::calibration::CalibrationHandle;
use super::error::{number, some, Fail};
use super::instrument::InstrumentHandle;
use super::scratch::with_f64;
use super::testing::Live;
use crate::constants::C2Convention;
use crate::definition::PreparedModel;
use crate::error::{self as check, Error};
use crate::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
use crate::thermometry::gum::{
    propagate, type_a as core_type_a, type_a_correlation as core_type_a_correlation, Correlation,
    Coverage, CoverageMethod, Distribution, Evaluation, GumEntry, GumMethod, GumResult,
    InputUncertainty, Propagation,
};
use crate::thermometry::its90::{self, fixed_point_curve, FixedPoint};
use crate::thermometry::measurement_gum::{
    measurement_budget, measurement_estimates, MeasurementEquation,
};
use crate::thermometry::monte_carlo::{
    histogram, recommended_bins, validate_gum, IntervalKind, MonteCarlo, MonteCarloConfig,
    MonteCarloModel, MonteCarloResult, TrialCount,
};
use crate::thermometry::student_t;
use crate::thermometry::Conditions;

// ---------------------------------------------------------------------------------------------
// Output
// ---------------------------------------------------------------------------------------------

/// Writes `v` to f64 scratch buffer 0 and returns its length (what the facade reads back).
pub(crate) fn put(v: &[f64]) -> f64 {
    with_f64(|b| {
        b[0].clear();
        b[0].extend_from_slice(v);
    });
    v.len() as f64
}

/// An optional number as a number (NaN for `None`; the facade turns NaN into `undefined`).
fn opt(x: Option<f64>) -> f64 {
    x.unwrap_or(f64::NAN)
}

/// Writes a GUM result to f64 scratch 0 and returns its length: `[estimate, u_c, ν_eff, k, p, U, propagation, coverage method,
/// ν used, n]`, then per entry `[id, c, u, ν, evaluation, distribution, |c|·u, share]`.
/// Codes are the enums' declaration order (`Evaluation`: typeA 0, typeB 1; `Distribution`:
/// normal 0 … studentT 4; `Propagation`: uncorrelated 0, correlated 1; `CoverageMethod`:
/// studentT 0, normal 1, statedFactor 2).
fn push_gum(estimate: f64, r: &GumResult, entries: &[GumEntry]) -> f64 {
    with_f64(|b| {
        let out = &mut b[0];
        out.clear();
        out.extend_from_slice(&[
            estimate,
            r.combined_standard_uncertainty,
            opt(r.effective_degrees_of_freedom),
            r.coverage_factor,
            opt(r.coverage_probability),
            r.expanded_uncertainty,
            r.method.propagation as u8 as f64,
            r.method.coverage as u8 as f64,
            opt(r.method.degrees_of_freedom_used),
            entries.len() as f64,
        ]);
        for (i, e) in entries.iter().enumerate() {
            out.extend_from_slice(&[
                i as f64,
                e.sensitivity,
                e.input.standard_uncertainty,
                e.input.degrees_of_freedom,
                e.input.evaluation as u8 as f64,
                e.input.distribution as u8 as f64,
                e.component.abs(),
                e.variance_share,
            ]);
        }
        out.len() as f64
    })
}

// ---------------------------------------------------------------------------------------------
// Errors
// ---------------------------------------------------------------------------------------------

/// `e` with its argument name replaced by `arg` (for NON_FINITE and OUT_OF_RANGE).
fn with_arg(e: Error, arg: &'static str) -> Error {
    match e {
        Error::NonFinite { value, .. } => Error::NonFinite { arg, value },
        Error::OutOfRange { value, range, .. } => Error::OutOfRange { arg, value, range },
        other => other,
    }
}

/// Core arguments that are fields of the `options` object.
const OPTION_ARGS: [&str; 4] = [
    "coverage_probability",
    "coverage_factor",
    "t_min_k",
    "t_max_k",
];

/// A core error, named as a field of `options` when its argument is one.
fn options_arg(e: Error) -> Fail {
    let arg = match e {
        Error::NonFinite { arg, .. }
        | Error::OutOfRange { arg, .. }
        | Error::NonPositiveTemperature { arg, .. } => arg,
        _ => "",
    };
    Fail::Core(
        e,
        None,
        if OPTION_ARGS.contains(&arg) {
            "options"
        } else {
            ""
        },
    )
}

// ---------------------------------------------------------------------------------------------
// Input uncertainties
// ---------------------------------------------------------------------------------------------

/// Numbers per input uncertainty: `[u, ν, evaluation, distribution, shorthand]`.
const SPEC: usize = 5;

/// The input uncertainty at `v[SPEC·i…]`, checked. Codes: evaluation typeA 0, typeB 1;
/// distribution normal 0 … studentT 4; −1 not given; shorthand 1 when the caller gave a
/// number. Defaults: a `studentT` distribution makes a Type A input, Type A with finite ν
/// samples a scaled t (JCGM 101 §6.4.9), anything else is Type B, normal. Errors name `name`
/// (the field, or the array with `index`).
fn input_at(
    v: &[f64],
    i: usize,
    name: &'static str,
    index: Option<usize>,
) -> Result<InputUncertainty, Fail> {
    use Distribution::{Arcsine, Normal, Rectangular, StudentT, Triangular};
    use Evaluation::{TypeA, TypeB};
    let x = v
        .get(SPEC * i..SPEC * (i + 1))
        .unwrap_or(&[0.0, f64::INFINITY, -1.0, -1.0, 1.0]);
    let dof = x[1];
    let given_e = match x[2] as i32 {
        0 => Some(TypeA),
        1 => Some(TypeB),
        _ => None,
    };
    let given_d = match x[3] as i32 {
        0 => Some(Normal),
        1 => Some(Rectangular),
        2 => Some(Triangular),
        3 => Some(Arcsine),
        4 => Some(StudentT),
        _ => None,
    };
    let (evaluation, distribution) = match (given_e, given_d) {
        (Some(e), Some(d)) => (e, d),
        (None, Some(StudentT)) => (TypeA, StudentT),
        (None, Some(d)) => (TypeB, d),
        (Some(TypeA), None) if dof.is_finite() => (TypeA, StudentT),
        (Some(e), None) => (e, Normal),
        (None, None) => (TypeB, Normal),
    };
    let u = InputUncertainty {
        standard_uncertainty: x[0],
        degrees_of_freedom: dof,
        evaluation,
        distribution,
    };
    u.validate().map_err(|e| {
        if x[4] == 1.0 {
            Fail::Core(with_arg(e, name), index, "")
        } else {
            Fail::Core(e, index, name)
        }
    })?;
    Ok(u)
}

/// The keys of the `uncertainties` object, in `MeasurementInput` order.
const KEYS: [&str; 9] = [
    "signal",
    "emissivity",
    "reflectedTemperatureK",
    "pathTransmittance",
    "pathTemperatureK",
    "windowTransmittance",
    "windowReflectance",
    "windowTemperatureK",
    "windowReflectedTemperatureK",
];

/// The same as paths of the `uncertainties` argument (error messages).
const PATHS: [&str; 9] = [
    "uncertainties.signal",
    "uncertainties.emissivity",
    "uncertainties.reflectedTemperatureK",
    "uncertainties.pathTransmittance",
    "uncertainties.pathTemperatureK",
    "uncertainties.windowTransmittance",
    "uncertainties.windowReflectance",
    "uncertainties.windowTemperatureK",
    "uncertainties.windowReflectedTemperatureK",
];

/// Most inputs of a model given as a list (the propagation's cost is quadratic in them).
const MAX_INPUTS: usize = 1000;

/// The inputs of a model given as a list (`SPEC` numbers each), checked.
fn input_list(v: &[f64]) -> Result<Vec<InputUncertainty>, Fail> {
    let n = v.len() / SPEC;
    if n > MAX_INPUTS {
        return Err(Error::TooLarge {
            arg: "inputs",
            limit: MAX_INPUTS,
            got: n,
        }
        .into());
    }
    let mut out = Vec::with_capacity(n);
    for i in 0..n {
        out.push(input_at(v, i, "inputs", Some(i))?);
    }
    Ok(out)
}

/// The checked inputs of the measurement equation at `signal`: the nine input uncertainties
/// (`9·SPEC` numbers in `inputs`) and the 9×9 correlation matrix of `[i, j, r]` triples
/// (input codes in `KEYS` order; the facade has refused a pair of one input, a repeated pair
/// and r outside [−1, 1]), built in `m` and checked: INVALID_CORRELATION names an input whose
/// row fails positive semi-definiteness. Errors in that order, then a non-finite signal.
#[inline(never)]
fn measurement_setup<'a>(
    signal: f64,
    inputs: &[f64],
    triples: &[f64],
    m: &'a mut [f64; 81],
) -> Result<([InputUncertainty; 9], Option<Correlation<'a>>), Fail> {
    let mut u = [InputUncertainty::ZERO; 9];
    for (i, x) in u.iter_mut().enumerate() {
        *x = input_at(inputs, i, PATHS[i], None)?;
    }
    let corr = if triples.is_empty() {
        None
    } else {
        for i in 0..9 {
            m[i * 10] = 1.0;
        }
        for t in triples.chunks_exact(3) {
            let (i, j) = ((t[0] as usize).min(8), (t[1] as usize).min(8));
            m[i * 9 + j] = t[2];
            m[j * 9 + i] = t[2];
        }
        let m: &'a [f64; 81] = m;
        Some(Correlation::new(m).map_err(|e| match e {
            Error::InvalidCorrelation { reason, row, .. } => Fail::Binding(
                "INVALID_CORRELATION",
                format!(
                    "options.correlations: {reason} (no joint distribution has these \
                     coefficients; check those involving {})",
                    KEYS.get(row).copied().unwrap_or("?")
                ),
            ),
            other => other.into(),
        })?)
    };
    check::finite("signal", signal)?;
    Ok((u, corr))
}

/// A validated correlation matrix given row-major in `options.correlation`.
fn matrix<'a>(m: &'a [f64], workspace: &'a mut Vec<f64>) -> Result<Correlation<'a>, Fail> {
    let n = (m.len() as f64).sqrt() as usize + 1;
    workspace.resize(n * (n + 1) / 2, 0.0);
    Correlation::with_workspace(m, workspace).map_err(|e| match e {
        Error::InvalidCorrelation { .. } => Fail::Core(e, None, "options.correlation"),
        Error::NonFinite { .. } => Fail::Core(e, None, "options"),
        other => other.into(),
    })
}

/// The checked inputs of a model given as a list (`SPEC` numbers each in `inputs`), then each
/// of `finite_sensitivities` finite, then the correlation matrix `correlation` when
/// `has_correlation` (its Cholesky factor in `workspace`). Errors in that order.
#[inline(never)]
fn list_setup<'a>(
    inputs: &[f64],
    finite_sensitivities: &[f64],
    correlation: &'a [f64],
    has_correlation: bool,
    workspace: &'a mut Vec<f64>,
) -> Result<(Vec<InputUncertainty>, Option<Correlation<'a>>), Fail> {
    let u = input_list(inputs)?;
    for &k in finite_sensitivities {
        check::finite("sensitivities", k)?;
    }
    let corr = if has_correlation {
        Some(matrix(correlation, workspace)?)
    } else {
        None
    };
    Ok((u, corr))
}

/// The coverage of `options` (the facade refuses both).
fn coverage(probability: Option<f64>, factor: Option<f64>) -> Coverage {
    match (probability, factor) {
        (_, Some(k)) => Coverage::Factor(k),
        (Some(p), None) => Coverage::Probability(p),
        (None, None) => Coverage::default(),
    }
}

// ---------------------------------------------------------------------------------------------
// GUM
// ---------------------------------------------------------------------------------------------

/// `Instrument.uncertaintyBudget(signal, uncertainties, options)`: the GUM budget of the
/// object temperature (rows: the five scene inputs, plus the four window inputs when the
/// conditions have a window), in f64 scratch 0 as [`push_gum`] lays it out.
pub(crate) fn instrument_budget(
    h: &InstrumentHandle,
    signal: f64,
    inputs: &[f64],
    correlations: &[f64],
    coverage_probability: Option<f64>,
    coverage_factor: Option<f64>,
) -> f64 {
    number((|| {
        let mut m = [0.0; 81];
        let (u, corr) = measurement_setup(signal, inputs, correlations, &mut m)?;
        let cov = coverage(coverage_probability, coverage_factor);
        let b = h
            .model
            .run(|s| measurement_budget(s, signal, &h.conditions, &u, corr.as_ref(), cov))
            .map_err(options_arg)?;
        let rows = if h.conditions.window.is_some() { 9 } else { 5 };
        Ok(push_gum(b.temperature_k, &b.result, &b.entries[..rows]))
    })())
}

/// `propagateUncertainty(sensitivities, inputs, options)`: JCGM 100 for any model, in f64
/// scratch 0 as [`push_gum`] lays it out (estimate NaN). `correlation` is used when
/// `has_correlation`.
#[wasm_bindgen(js_name = propagateUncertainty)]
pub fn propagate_uncertainty(
    sensitivities: &[f64],
    inputs: &[f64],
    correlation: &[f64],
    has_correlation: bool,
    coverage_probability: Option<f64>,
    coverage_factor: Option<f64>,
) -> f64 {
    number((|| {
        let mut ws = Vec::new();
        let (u, corr) = list_setup(inputs, &[], correlation, has_correlation, &mut ws)?;
        let mut entries = vec![GumEntry::default(); sensitivities.len()];
        let cov = coverage(coverage_probability, coverage_factor);
        let r = propagate(sensitivities, &u, corr.as_ref(), cov, Some(&mut entries))
            .map_err(options_arg)?;
        Ok(push_gum(f64::NAN, &r, &entries))
    })())
}

/// The free functions on numbers, by `op`: 0 `studentTCdf(a = t, b = ν)`, 1
/// `studentTQuantile(a = p, b = ν)`, 2 `coverageFactor(a = p, b = ν)`, 3 `typeA` of the
/// observations in f64 scratch 0 (`[mean, s, s/√n, ν]` back there; returns 4), 4
/// `typeACorrelation` of the series in f64 scratch 0 and 1. One export for all (their shims
/// and error paths are shared).
#[wasm_bindgen(js_name = qbUncertaintyNumber)]
pub fn uncertainty_number(op: u32, a: f64, b: f64) -> f64 {
    number((|| {
        Ok(match op {
            0 => student_t::student_t_cdf(a, b)?,
            1 => student_t::student_t_quantile(a, b)?,
            2 => student_t::coverage_factor(a, b)?,
            3 => {
                let a = with_f64(|b| core_type_a(&b[0]))?;
                put(&[
                    a.mean,
                    a.standard_deviation,
                    a.standard_uncertainty,
                    a.degrees_of_freedom,
                ])
            }
            _ => with_f64(|b| core_type_a_correlation(&b[0], &b[1]))?,
        })
    })())
}

// ---------------------------------------------------------------------------------------------
// Monte Carlo
// ---------------------------------------------------------------------------------------------

/// The model a run evaluates.
enum Model {
    /// The measurement equation of an instrument (a copy of its model and conditions).
    Measurement(PreparedModel, Conditions),
    /// Y = Σ c_i X_i.
    Linear(Vec<f64>),
}

/// A Monte Carlo run (JCGM 101) in progress: the core's state, the model and the output
/// values. (The facade computes the GUM result of the same inputs with the GUM exports and
/// hands it to [`MonteCarloHandle::finish`] for the §8 comparison.)
#[wasm_bindgen(js_name = QbMonteCarlo)]
pub struct MonteCarloHandle {
    run: MonteCarlo,
    model: Model,
    values: Vec<f64>,
    /// Set by the first `finish`: the run is over.
    result: Option<MonteCarloResult>,
    _live: Live,
}

/// The run's configuration and capacity from `settings` = `[coverageProbability, seed,
/// trials (0: adaptive), capacity, significantDigits, interval code]` (whole numbers checked
/// by the facade; p and the digits are checked again by the core).
fn mc_config(settings: &[f64]) -> (MonteCarloConfig, usize) {
    let at = |k: usize| settings.get(k).copied().unwrap_or(0.0);
    let trials = at(2) as usize;
    (
        MonteCarloConfig {
            coverage_probability: at(0),
            seed: at(1) as u64,
            trials: if trials > 0 {
                TrialCount::Fixed { trials }
            } else {
                TrialCount::Adaptive
            },
            significant_digits: at(4) as u8,
            interval: if at(5) == 1.0 {
                IntervalKind::Shortest
            } else {
                IntervalKind::ProbabilisticallySymmetric
            },
        },
        at(3) as usize,
    )
}

impl MonteCarloHandle {
    #[inline(never)]
    fn build(
        settings: &[f64],
        estimates: &[f64],
        inputs: &[InputUncertainty],
        corr: Option<&Correlation<'_>>,
        model: Model,
    ) -> Result<MonteCarloHandle, Fail> {
        let (config, capacity) = mc_config(settings);
        let run = MonteCarlo::new(config, estimates, inputs, corr).map_err(options_arg)?;
        let mut values = Vec::new();
        if values.try_reserve_exact(capacity).is_err() {
            return Err(Fail::Binding(
                "OUT_OF_RANGE",
                "options: the WebAssembly memory cannot hold this many trials".into(),
            ));
        }
        values.resize(capacity, 0.0);
        Ok(MonteCarloHandle {
            run,
            model,
            values,
            result: None,
            _live: Live::new(),
        })
    }
}

#[wasm_bindgen(js_class = QbMonteCarlo)]
impl MonteCarloHandle {
    /// The measurement equation of `instrument` at `signal`, inputs and correlations as for
    /// the GUM budget, settings as [`mc_config`].
    pub fn measurement(
        instrument: &InstrumentHandle,
        signal: f64,
        inputs: &[f64],
        correlations: &[f64],
        settings: &[f64],
    ) -> Option<MonteCarloHandle> {
        some((|| {
            let mut m = [0.0; 81];
            let (u, corr) = measurement_setup(signal, inputs, correlations, &mut m)?;
            let cond = instrument.conditions;
            if cond.window.is_none() && u[5..].iter().any(|x| x.standard_uncertainty != 0.0) {
                return Err(Error::Unsupported {
                    what: "window uncertainties need a window in the conditions",
                }
                .into());
            }
            Self::build(
                settings,
                &measurement_estimates(signal, &cond),
                &u,
                corr.as_ref(),
                Model::Measurement(instrument.model.clone(), cond),
            )
        })())
    }

    /// Y = Σ c_i X_i with estimates `estimates` (as long as `sensitivities`) and the
    /// correlation matrix `correlation` (when `has_correlation`).
    pub fn linear(
        sensitivities: &[f64],
        inputs: &[f64],
        correlation: &[f64],
        has_correlation: bool,
        estimates: &[f64],
        settings: &[f64],
    ) -> Option<MonteCarloHandle> {
        some((|| {
            let mut ws = Vec::new();
            let (u, corr) =
                list_setup(inputs, sensitivities, correlation, has_correlation, &mut ws)?;
            Self::build(
                settings,
                estimates,
                &u,
                corr.as_ref(),
                Model::Linear(sensitivities.to_vec()),
            )
        })())
    }

    /// Runs up to `trials` more trials (none after `finish`); the progress, `[trials, invalid
    /// trials, batches, status, δ, largest 2s, finished, capacity]`, in f64 scratch 0.
    pub fn step(&mut self, trials: f64) -> f64 {
        number((|| {
            if self.result.is_none() {
                let n = trials as usize;
                let (run, values) = (&mut self.run, &mut self.values);
                // one instantiation of the run loop for both models
                let mut go = |model: &dyn MonteCarloModel| run.run(model, values, n);
                match &self.model {
                    Model::Measurement(m, c) => {
                        m.run(|s| go(&MeasurementEquation::new(s, c)))?;
                    }
                    Model::Linear(k) => {
                        let f = |x: &[f64]| -> crate::Result<f64> {
                            Ok(k.iter().zip(x).map(|(a, b)| a * b).sum())
                        };
                        go(&f)?;
                    }
                }
            }
            let p = self.run.progress();
            Ok(put(&[
                p.trials as f64,
                p.invalid_trials as f64,
                p.batches as f64,
                p.status as u8 as f64,
                opt(p.numerical_tolerance),
                opt(p.largest_spread),
                if self.result.is_some() { 1.0 } else { 0.0 },
                self.values.len() as f64,
            ]))
        })())
    }

    /// Ends the run (the first call) and writes the result to f64 scratch 0:
    /// `[M, invalid, y, u, p, sym lo, sym hi, short lo, short hi, interval, n_dig, δ,
    /// 2s(y), 2s(u), 2s(lo), 2s(hi), batch size, batches, stabilized, status,
    /// d_low, d_high, δ_GUM, passed, lower, upper, bin width, bins, below, above, counts…]`
    /// (NaN where there is nothing). `bins` (a whole number ≤ 10⁴ checked by the facade; 0:
    /// Freedman–Diaconis); `gum` = `[y, u_c, U, p]` of the GUM result of the same inputs
    /// (empty: none) for the JCGM 101 §8 comparison.
    pub fn finish(&mut self, bins: f64, gum: &[f64]) -> f64 {
        number((|| {
            let r = match self.result {
                Some(r) => r,
                None => {
                    let r = self.run.finish(&mut self.values)?;
                    self.result = Some(r);
                    r
                }
            };
            let sorted = self.values.get(..r.trials).unwrap_or(&[]);
            let bins = match bins as usize {
                0 => recommended_bins(sorted)?,
                b => b,
            };
            let mut counts = vec![0u64; bins];
            let h = histogram(sorted, &mut counts)?;
            let s = r.batch_spread;
            let v = match gum {
                [y, uc, big_u, p] => {
                    // validate_gum reads p, U and u_c of the GUM result
                    let g = GumResult {
                        combined_standard_uncertainty: *uc,
                        effective_degrees_of_freedom: None,
                        coverage_factor: big_u / uc,
                        coverage_probability: Some(*p),
                        expanded_uncertainty: *big_u,
                        method: GumMethod {
                            propagation: Propagation::FirstOrderUncorrelated,
                            coverage: CoverageMethod::StudentT,
                            degrees_of_freedom_used: None,
                        },
                    };
                    Some(validate_gum(*y, &g, &r)?)
                }
                _ => None,
            };
            let head = [
                r.trials as f64,
                r.invalid_trials as f64,
                r.estimate,
                r.standard_uncertainty,
                r.coverage_probability,
                r.symmetric_interval[0],
                r.symmetric_interval[1],
                r.shortest_interval[0],
                r.shortest_interval[1],
                r.interval as u8 as f64,
                r.significant_digits as f64,
                r.numerical_tolerance,
                opt(s.map(|s| s.estimate)),
                opt(s.map(|s| s.standard_uncertainty)),
                opt(s.map(|s| s.lower)),
                opt(s.map(|s| s.upper)),
                r.batch_size as f64,
                r.batches as f64,
                if r.stabilized { 1.0 } else { 0.0 },
                r.status as u8 as f64,
                opt(v.map(|v| v.d_low)),
                opt(v.map(|v| v.d_high)),
                opt(v.map(|v| v.tolerance)),
                opt(v.map(|v| if v.passed { 1.0 } else { 0.0 })),
                h.lower,
                h.upper,
                h.bin_width,
                h.bins as f64,
                h.below as f64,
                h.above as f64,
            ];
            let len = with_f64(|b| {
                let out = &mut b[0];
                out.clear();
                out.extend_from_slice(&head);
                out.extend(counts.iter().map(|&c| c as f64));
                out.len()
            });
            Ok(len as f64)
        })())
    }
}

// ---------------------------------------------------------------------------------------------
// Calibration transfer and fixed-point curves (methods of QbCalibration)
// ---------------------------------------------------------------------------------------------

/// The reference points of a curve fitted through points (with their uncertainties), kept to
/// propagate them into readings; for a fixed-point curve also its fixed points and
/// interpolation errors.
pub(crate) struct Reference {
    points: Vec<ReferencePoint>,
    c2: C2Convention,
    /// A fixed-point curve's report, as [`CalibrationHandle::fixed_point_report`] lays it out.
    fixed: Option<[f64; 15]>,
}

/// Per-point uncertainties `v` (one per point, each finite and ≥ 0: checked by the facade,
/// and again by the calibration transfer) when `given`; an empty slice otherwise.
fn per_point(v: &[f64], given: bool, n: usize) -> Result<&[f64], Fail> {
    if !given {
        return Ok(&[]);
    }
    if v.len() != n {
        return Err(Error::LengthMismatch {
            expected: n,
            got: v.len(),
        }
        .into());
    }
    Ok(v)
}

/// The reference points of a fit (temperatures `t`, K, signals `s`) with the uncertainties
/// `u_temperatures_k`, `u_signals` (bit 0 / bit 1 of `given`: given; else 0).
pub(crate) fn reference(
    t: &[f64],
    s: &[f64],
    u_temperatures_k: &[f64],
    u_signals: &[f64],
    given: u32,
    c2: C2Convention,
) -> Result<Reference, Fail> {
    let n = t.len().min(s.len());
    let ut = per_point(u_temperatures_k, given & 1 != 0, n)?;
    let us = per_point(u_signals, given & 2 != 0, n)?;
    let points = (0..n)
        .map(|i| ReferencePoint {
            temperature_k: t[i],
            signal: s[i],
            u_temperature_k: ut.get(i).copied().unwrap_or(0.0),
            u_signal: us.get(i).copied().unwrap_or(0.0),
        })
        .collect();
    Ok(Reference {
        points,
        c2,
        fixed: None,
    })
}

impl CalibrationHandle {
    /// `f` on the calibration transfer of a curve fitted through points (UNSUPPORTED
    /// otherwise); the transfer is formed from the kept points on each call.
    fn transfer<R>(
        &self,
        f: impl FnOnce(&CalibrationTransfer<'_>, usize) -> crate::Result<R>,
    ) -> Result<R, Fail> {
        let Some(r) = &self.reference else {
            return Err(Error::Unsupported {
                what: "this curve has no reference points: fit it through points \
                       (CalibrationCurve.fit or .throughFixedPoints) to propagate their \
                       uncertainties",
            }
            .into());
        };
        let cal = fit_reference(r)?;
        Ok(f(&cal, r.points.len())?)
    }
}

/// The calibration transfer of the kept reference points (out of line: shared by the methods
/// of [`CalibrationHandle::transfer`]).
#[inline(never)]
fn fit_reference(r: &Reference) -> crate::Result<CalibrationTransfer<'_>> {
    CalibrationTransfer::fit(&r.points, r.c2)
}

#[wasm_bindgen(js_class = QbCalibration)]
impl CalibrationHandle {
    /// A curve exact through an instrument's signals at three ITS-90 fixed points (`codes`,
    /// `FixedPoint` order), c2 ITS-90 unless `c2_codata`, with the points' uncertainties (as
    /// [`reference`], in the order given) and the interpolation errors over [tMinK, tMaxK]
    /// (default: the fixed points' range) at `n_points` temperatures per part.
    #[wasm_bindgen(js_name = throughFixedPoints)]
    #[allow(clippy::too_many_arguments)]
    pub fn through_fixed_points(
        instrument: &InstrumentHandle,
        codes: &[f64],
        c2_codata: bool,
        u_temperatures_k: &[f64],
        u_signals: &[f64],
        given: u32,
        t_min_k: Option<f64>,
        t_max_k: Option<f64>,
        n_points: f64,
    ) -> Option<CalibrationHandle> {
        some((|| {
            let fp = |k: usize| {
                let c = codes.get(k).copied().unwrap_or(0.0) as usize;
                FixedPoint::ALL[c.min(6)]
            };
            let given_fp = [fp(0), fp(1), fp(2)];
            let c2 = if c2_codata {
                C2Convention::Codata2018
            } else {
                C2Convention::Its90
            };
            let ut = per_point(u_temperatures_k, given & 1 != 0, 3)?;
            let us = per_point(u_signals, given & 2 != 0, 3)?;
            // The points in increasing temperature, each with its own uncertainties.
            let mut order = [0usize, 1, 2];
            for (i, j) in [(0, 1), (1, 2), (0, 1)] {
                if given_fp[order[j]].temperature_k() < given_fp[order[i]].temperature_k() {
                    order.swap(i, j);
                }
            }
            let n = n_points as usize; // a whole number in [2, 10⁵], checked by the facade
            let (fc, report) = instrument
                .model
                .run(|m| {
                    let fc = fixed_point_curve(m, given_fp, c2)?;
                    let lo = fc.fixed_points[0].temperature_k();
                    let hi = fc.fixed_points[2].temperature_k();
                    let t_min = t_min_k.unwrap_or(lo);
                    let t_max = t_max_k.unwrap_or(hi);
                    Ok((fc, fc.interpolation_errors(m, t_min, t_max, n)?))
                })
                .map_err(options_arg)?;
            let points = (0..3)
                .map(|k| {
                    let i = order[k];
                    ReferencePoint {
                        temperature_k: fc.fixed_points[k].temperature_k(),
                        signal: fc.signals[k],
                        u_temperature_k: ut.get(i).copied().unwrap_or(0.0),
                        u_signal: us.get(i).copied().unwrap_or(0.0),
                    }
                })
                .collect();
            let part = |e: Option<&its90::InterpolationError>| {
                e.map_or([f64::NAN; 2], |e| [e.max_abs_error_k, e.at_temperature_k])
            };
            let ([b0, b1], [l0, l1], [h0, h1]) = (
                part(Some(&report.between)),
                part(report.below.as_ref()),
                part(report.above.as_ref()),
            );
            let (f, t, s) = (
                fc.fixed_points,
                fc.fixed_points.map(|p| p.temperature_k()),
                fc.signals,
            );
            let fixed = [
                f[0] as u8 as f64,
                f[1] as u8 as f64,
                f[2] as u8 as f64,
                t[0],
                t[1],
                t[2],
                s[0],
                s[1],
                s[2],
                b0,
                b1,
                l0,
                l1,
                h0,
                h1,
            ];
            Ok(CalibrationHandle {
                curve: fc.curve,
                report: None,
                residuals: Vec::new(),
                reference: Some(Reference {
                    points,
                    c2,
                    fixed: Some(fixed),
                }),
                _live: Live::new(),
            })
        })())
    }

    /// `[3 fixed-point codes, 3 T90 (K), 3 signals, between (max |ΔT|, at T), below, above]`
    /// (NaN for a part not asked for), or nothing for another curve.
    #[wasm_bindgen(js_name = fixedPointReport)]
    pub fn fixed_point_report(&self) -> f64 {
        put(self
            .reference
            .as_ref()
            .and_then(|r| r.fixed.as_ref())
            .map_or(&[], |f| &f[..]))
    }

    /// Covariance then correlation matrix of (A, B, C), row-major, in f64 scratch 0.
    #[wasm_bindgen(js_name = parameterCovariance)]
    pub fn parameter_covariance(&self) -> f64 {
        number(self.transfer(|cal, _| {
            let mut out = Vec::with_capacity(18);
            for m in [cal.parameter_covariance(), cal.parameter_correlation()] {
                out.extend(m.iter().flatten());
            }
            Ok(put(&out))
        }))
    }

    /// A reading and its calibration uncertainty: `[T, u_cal, u_signal, u_c, ∂T/∂S,
    /// Σ∂T/∂T_i, ∂T/∂T_i…, ∂T/∂S_i…]` in f64 scratch 0.
    #[wasm_bindgen(js_name = readingUncertainty)]
    pub fn reading_uncertainty(&self, signal: f64, u_signal: f64) -> f64 {
        number(self.transfer(|cal, n| {
            let mut out = vec![0.0; 6 + 2 * n];
            let (head, rest) = out.split_at_mut(6);
            let (dt, ds) = rest.split_at_mut(n);
            let r = cal.reading(signal, u_signal, Some(dt), Some(ds))?;
            head.copy_from_slice(&[
                r.temperature_k,
                r.u_calibration_k,
                r.u_signal_k,
                r.combined_standard_uncertainty_k,
                r.d_t_d_signal,
                r.sum_d_t_d_reference_temperatures,
            ]);
            Ok(put(&out))
        }))
    }
}
