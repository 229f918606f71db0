//! Propagation of distributions by the Monte Carlo method (JCGM 101:2008) for any model
//! Y = f(X_1, …, X_N): seeded and reproducible, adaptive number of trials (§7.9) or a fixed
//! count with its numerical tolerance reported, estimate and standard uncertainty,
//! probabilistically symmetric and shortest coverage intervals (§7.7), the validation of a GUM
//! result (§8), and a histogram of the output values.
//!
//! # Use
//! 1. [`MonteCarlo::new`] with a [`MonteCarloConfig`], the input estimates and their
//!    [`InputUncertainty`] (distribution, standard uncertainty, degrees of freedom) and an
//!    optional [`Correlation`] (normal inputs only: a multivariate Gaussian, JCGM 101 §6.4.8).
//! 2. [`MonteCarlo::run`] with the model (anything implementing [`MonteCarloModel`], closures
//!    included), a caller-provided buffer for the output values and the number of trials to do
//!    in this call. Call it repeatedly — e.g. 10⁴ trials at a time from a web worker to report
//!    [`Progress`] — until the status is no longer `Running`. Chunking does not change the
//!    numbers: the run is the same as one uninterrupted call.
//! 3. [`MonteCarlo::finish`] sorts the buffer and returns the [`MonteCarloResult`];
//!    [`histogram`] bins the sorted values; [`validate_gum`] compares with a GUM result.
//!
//! Nothing allocates: the output values (8 bytes per trial, 8 MB for 10⁶ trials) live in the
//! caller's buffer, the histogram counts in the caller's slice.
//!
//! # Method
//! - **Sampling:** [`super::random`] (xoshiro256** seeded by SplitMix64; Box–Muller normals;
//!   rectangular, triangular, arcsine; Bailey's polar method for the scaled-and-shifted t of a
//!   Type A input). Correlated normal inputs: x = μ + u ⊙ (L·z), L the Cholesky factor of the
//!   correlation matrix (JCGM 101 §6.4.8.4 and C.5).
//! - **Trials:** in batches of M = max(J, 10⁴), J = ⌈100/(1 − p)⌉ (JCGM 101 §7.2.2, §7.9.4
//!   b). After every batch h ≥ 2 the standard deviations s of the batch means, batch standard
//!   deviations and batch interval end points (the interval kind chosen in the configuration)
//!   are formed as s² = Σ(v_r − v̄)²/(h(h − 1)); the run is stabilised when 2s ≤ δ for all four,
//!   δ the numerical tolerance of the standard uncertainty of all h·M values to n_dig
//!   significant digits (§7.9.2: u(y) = c·10^l with c an n_dig-digit integer, δ = ½·10^l).
//!   With a fixed count the same batch statistics are reported, so the numerical tolerance
//!   achieved is stated either way.
//! - **Output:** y = mean, u(y) = standard deviation (divisor M − 1) of all values (§7.6);
//!   coverage intervals from the sorted values (§7.7): q = pM (rounded as the standard says),
//!   probabilistically symmetric [y_(r), y_(r+q)] with r = (M − q)/2 (rounded up), shortest
//!   the r* minimising y_(r+q) − y_(r).
//! - **Invalid trials:** a trial whose model evaluation fails (an input drawn outside the
//!   model's domain, e.g. an emissivity above 1) is counted in `invalid_trials` and not stored:
//!   the output then follows the input distributions truncated to the model's domain. A run
//!   stops with `NoSolution` once more than half of the trials (and more than one batch) fail.
//!
//! Cautions: a Monte Carlo result is only as good as the input distributions and the model;
//! the numerical tolerance states the sampling error, not the adequacy of either.
//!
//! # References
//! JCGM 101:2008, *Evaluation of measurement data — Supplement 1 to the "Guide to the
//! expression of uncertainty in measurement" — Propagation of distributions using a Monte
//! Carlo method*, §6.4, §7.2, §7.6, §7.7, §7.9, §8, Annex C.
#![forbid(unsafe_code)]

use super::gum::{cholesky_packed, Correlation, Distribution, GumResult, InputUncertainty};
use super::random::Sampler;
use super::student_t::check_coverage_probability;
use crate::error::finite;
use crate::float::{ceil, floor, log10, powi, sqrt};
use crate::{Error, Result};

/// Most input quantities a [`MonteCarlo`] run takes (its state holds them without
/// allocating).
pub const MAX_INPUTS: usize = 32;
const PACKED: usize = MAX_INPUTS * (MAX_INPUTS + 1) / 2;

/// A measurement model Y = f(X) for the Monte Carlo method: one output value from one draw of
/// the input quantities (in the order the run was given them). Closures
/// `Fn(&[f64]) -> Result<f64>` implement it.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::MonteCarloModel;
/// let sum = |x: &[f64]| -> quantaband::Result<f64> { Ok(x.iter().sum()) };
/// assert_eq!(sum.evaluate(&[1.0, 2.0]).unwrap(), 3.0);
/// ```
pub trait MonteCarloModel {
    /// The output value for input values `inputs`.
    ///
    /// # Errors
    /// Any: the trial is counted as invalid (outside the model's domain).
    fn evaluate(&self, inputs: &[f64]) -> Result<f64>;
}

impl<F: Fn(&[f64]) -> Result<f64>> MonteCarloModel for F {
    fn evaluate(&self, inputs: &[f64]) -> Result<f64> {
        self(inputs)
    }
}

/// How many trials to run.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::TrialCount;
/// assert_eq!(TrialCount::default(), TrialCount::Adaptive);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum TrialCount {
    /// Until stabilised to the configured significant digits (JCGM 101 §7.9), or until the
    /// caller's buffer is full.
    #[default]
    Adaptive,
    /// Exactly this many valid trials (the numerical tolerance achieved is reported).
    Fixed {
        /// Number of valid trials M.
        trials: usize,
    },
}

/// Which coverage interval drives the stabilisation test and the GUM validation (both kinds
/// are always reported).
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::IntervalKind;
/// assert_eq!(IntervalKind::default(), IntervalKind::ProbabilisticallySymmetric);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum IntervalKind {
    /// Equal probability (1 − p)/2 below and above (JCGM 101 §7.7.1); compares directly with
    /// the GUM's symmetric interval y ± U.
    #[default]
    ProbabilisticallySymmetric,
    /// The shortest interval with probability p (JCGM 101 §7.7.2).
    Shortest,
}

/// Configuration of a Monte Carlo run.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::MonteCarloConfig;
/// let c = MonteCarloConfig::default();
/// assert_eq!((c.coverage_probability, c.significant_digits), (0.95, 2));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MonteCarloConfig {
    /// Seed of the generator: the same seed, inputs and model give the same numbers.
    pub seed: u64,
    /// Coverage probability p of the coverage intervals, in (0, 1 − 10⁻⁷].
    pub coverage_probability: f64,
    /// Adaptive or fixed number of trials.
    pub trials: TrialCount,
    /// Significant decimal digits n_dig of u(y) regarded as meaningful (1 to 6; JCGM 101
    /// suggests 1 or 2): sets the numerical tolerance δ.
    pub significant_digits: u8,
    /// The interval for the stabilisation test and the validation.
    pub interval: IntervalKind,
}

impl Default for MonteCarloConfig {
    fn default() -> Self {
        MonteCarloConfig {
            seed: 1,
            coverage_probability: 0.95,
            trials: TrialCount::Adaptive,
            significant_digits: 2,
            interval: IntervalKind::ProbabilisticallySymmetric,
        }
    }
}

/// Where a run stands after [`MonteCarlo::run`].
///
/// # Examples
/// See [`MonteCarlo`].
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum RunStatus {
    /// More trials are needed: call [`MonteCarlo::run`] again.
    Running,
    /// Adaptive run stabilised (JCGM 101 §7.9.4 k).
    Stabilized,
    /// Fixed count reached.
    Completed,
    /// The buffer is full before the adaptive run stabilised; the result reports the
    /// numerical tolerance achieved.
    CapacityReached,
}

/// Progress of a run, for a progress display.
///
/// # Examples
/// See [`MonteCarlo`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Progress {
    /// Valid trials stored so far.
    pub trials: usize,
    /// Trials whose model evaluation failed.
    pub invalid_trials: u64,
    /// Complete batches.
    pub batches: usize,
    /// Status.
    pub status: RunStatus,
    /// Numerical tolerance δ of u(y) so far (after 2 batches).
    pub numerical_tolerance: Option<f64>,
    /// Largest of the four 2s batch spreads so far (after 2 batches); the run stabilises when
    /// it is ≤ δ.
    pub largest_spread: Option<f64>,
}

/// Twice the standard deviations of the batch averages (JCGM 101 §7.9.4 g), in the output
/// unit.
///
/// # Examples
/// See [`MonteCarlo`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct BatchSpread {
    /// 2·s of the estimate y.
    pub estimate: f64,
    /// 2·s of the standard uncertainty u(y).
    pub standard_uncertainty: f64,
    /// 2·s of the lower end of the coverage interval.
    pub lower: f64,
    /// 2·s of the upper end of the coverage interval.
    pub upper: f64,
}

impl BatchSpread {
    fn largest(&self) -> f64 {
        self.estimate
            .max(self.standard_uncertainty)
            .max(self.lower)
            .max(self.upper)
    }
}

/// The result of a Monte Carlo run (values in the output quantity's unit).
///
/// # Examples
/// See [`MonteCarlo`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MonteCarloResult {
    /// Valid trials M.
    pub trials: usize,
    /// Trials whose model evaluation failed (not in the statistics).
    pub invalid_trials: u64,
    /// Estimate y: the mean of the output values.
    pub estimate: f64,
    /// Standard uncertainty u(y): their standard deviation.
    pub standard_uncertainty: f64,
    /// Coverage probability p.
    pub coverage_probability: f64,
    /// Probabilistically symmetric coverage interval [y_low, y_high].
    pub symmetric_interval: [f64; 2],
    /// Shortest coverage interval.
    pub shortest_interval: [f64; 2],
    /// The interval used for stabilisation and validation.
    pub interval: IntervalKind,
    /// Significant digits n_dig.
    pub significant_digits: u8,
    /// Numerical tolerance δ of u(y) (JCGM 101 §7.9.2).
    pub numerical_tolerance: f64,
    /// 2s of the batch statistics (`None` with fewer than two batches).
    pub batch_spread: Option<BatchSpread>,
    /// Batch size M_batch = max(⌈100/(1 − p)⌉, 10⁴).
    pub batch_size: usize,
    /// Complete batches.
    pub batches: usize,
    /// Whether every 2s ≤ δ.
    pub stabilized: bool,
    /// Final status of the run.
    pub status: RunStatus,
}

/// Running mean and sum of squared deviations (Welford).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
struct Running {
    n: f64,
    mean: f64,
    m2: f64,
}

impl Running {
    #[inline]
    fn push(&mut self, x: f64) {
        self.n += 1.0;
        let d = x - self.mean;
        self.mean += d / self.n;
        self.m2 += d * (x - self.mean);
    }
    fn sd(&self) -> f64 {
        if self.n > 1.0 {
            sqrt(self.m2 / (self.n - 1.0))
        } else {
            0.0
        }
    }
    /// Twice the standard deviation of the mean of the values pushed.
    fn two_sigma_of_mean(&self) -> f64 {
        if self.n > 1.0 {
            2.0 * sqrt(self.m2 / (self.n * (self.n - 1.0)))
        } else {
            0.0
        }
    }
}

/// A Monte Carlo run in progress (plain data; see the module docs for the use).
///
/// # Formula
/// See the module docs (JCGM 101 §7).
///
/// # Errors
/// [`MonteCarlo::new`]: `LengthMismatch` (estimates, inputs and correlation sizes differ),
/// `Unsupported` for more than [`MAX_INPUTS`] inputs or a correlation involving a non-normal
/// input, `NonFinite` for a non-finite estimate, the errors of
/// [`InputUncertainty::validate`], `OutOfRange` for a coverage probability outside
/// (0, 1 − 10⁻⁷], significant digits outside 1..=6, or a fixed count of 0.
///
/// # Accuracy
/// The sampling error is what the run reports (numerical tolerance and batch spreads). Checked
/// against the exact output distributions of the JCGM 101 §9.2 additive examples (mpmath,
/// `tests/gum_monte_carlo.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::InputUncertainty;
/// use quantaband::thermometry::monte_carlo::{MonteCarlo, MonteCarloConfig, RunStatus, TrialCount};
/// // JCGM 101 §9.2.2: Y = X1 + X2 + X3 + X4, Xi ~ N(0, 1): u(y) = 2, 95 % interval ±3.92
/// let u = [InputUncertainty::type_b(1.0).unwrap(); 4];
/// let config = MonteCarloConfig { trials: TrialCount::Fixed { trials: 50_000 }, ..Default::default() };
/// let mut mc = MonteCarlo::new(config, &[0.0; 4], &u, None).unwrap();
/// let model = |x: &[f64]| -> quantaband::Result<f64> { Ok(x.iter().sum()) };
/// let mut values = vec![0.0; 50_000];
/// while mc.run(&model, &mut values, 10_000).unwrap().status == RunStatus::Running {}
/// let r = mc.finish(&mut values).unwrap();
/// assert!((r.standard_uncertainty - 2.0).abs() < 0.03);
/// assert!((r.symmetric_interval[1] - 3.92).abs() < 0.08);
/// ```
///
/// # References
/// JCGM 101:2008 §7.
#[derive(Debug, Clone, PartialEq)]
pub struct MonteCarlo {
    config: MonteCarloConfig,
    n: usize,
    estimates: [f64; MAX_INPUTS],
    inputs: [InputUncertainty; MAX_INPUTS],
    chol: [f64; PACKED],
    correlated: bool,
    sampler: Sampler,
    batch_size: usize,
    stored: usize,
    invalid: u64,
    batches: usize,
    all: Running,
    batch_stats: [Running; 4],
    status: RunStatus,
}

impl MonteCarlo {
    /// Sets up a run for inputs with estimates `estimates`, uncertainties `inputs` and an
    /// optional correlation matrix.
    ///
    /// # Errors
    /// See [`MonteCarlo`].
    ///
    /// # Examples
    /// See [`MonteCarlo`].
    pub fn new(
        config: MonteCarloConfig,
        estimates: &[f64],
        inputs: &[InputUncertainty],
        correlation: Option<&Correlation<'_>>,
    ) -> Result<Self> {
        let n = estimates.len();
        if inputs.len() != n {
            return Err(Error::LengthMismatch {
                expected: n,
                got: inputs.len(),
            });
        }
        if n > MAX_INPUTS {
            return Err(Error::Unsupported {
                what: "a Monte Carlo run takes at most 32 input quantities",
            });
        }
        let p = check_coverage_probability(config.coverage_probability)?;
        if p > 1.0 - 1e-7 {
            return Err(Error::OutOfRange {
                arg: "coverage_probability",
                value: p,
                range: "(0, 1 - 1e-7]",
            });
        }
        if !(1..=6).contains(&config.significant_digits) {
            return Err(Error::OutOfRange {
                arg: "significant_digits",
                value: config.significant_digits as f64,
                range: "[1, 6]",
            });
        }
        if config.trials == (TrialCount::Fixed { trials: 0 }) {
            return Err(Error::OutOfRange {
                arg: "trials",
                value: 0.0,
                range: "[1, inf)",
            });
        }
        let mut est = [0.0; MAX_INPUTS];
        let mut inp = [InputUncertainty::ZERO; MAX_INPUTS];
        for i in 0..n {
            est[i] = finite("estimates", estimates[i])?;
            inputs[i].validate()?;
            inp[i] = inputs[i];
        }
        let mut chol = [0.0; PACKED];
        let mut correlated = false;
        if let Some(r) = correlation {
            if r.size() != n {
                return Err(Error::LengthMismatch {
                    expected: n * n,
                    got: r.size() * r.size(),
                });
            }
            for i in 0..n {
                for j in 0..n {
                    if i != j
                        && r.get(i, j) != 0.0
                        && inp[i].standard_uncertainty > 0.0
                        && inp[j].standard_uncertainty > 0.0
                    {
                        if inp[i].distribution != Distribution::Normal
                            || inp[j].distribution != Distribution::Normal
                        {
                            return Err(Error::Unsupported {
                                what: "correlated Monte Carlo inputs must be normal \
                                       (multivariate Gaussian, JCGM 101 6.4.8)",
                            });
                        }
                        correlated = true;
                    }
                }
            }
            if correlated {
                cholesky_packed(r.matrix(), n, &mut chol)?;
            }
        }
        let j = ceil(100.0 / (1.0 - p));
        let batch_size = if j > 1e4 { j as usize } else { 10_000 };
        Ok(MonteCarlo {
            config,
            n,
            estimates: est,
            inputs: inp,
            chol,
            correlated,
            sampler: Sampler::new(config.seed),
            batch_size,
            stored: 0,
            invalid: 0,
            batches: 0,
            all: Running::default(),
            batch_stats: [Running::default(); 4],
            status: RunStatus::Running,
        })
    }

    /// The batch size max(⌈100/(1 − p)⌉, 10⁴) (JCGM 101 §7.9.4 b): a buffer for an adaptive
    /// run should hold many batches (e.g. 10⁶ values).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::monte_carlo::{MonteCarlo, MonteCarloConfig};
    /// let c = MonteCarloConfig { coverage_probability: 0.999, ..Default::default() };
    /// assert_eq!(MonteCarlo::new(c, &[], &[], None).unwrap().batch_size(), 100_000);
    /// ```
    pub fn batch_size(&self) -> usize {
        self.batch_size
    }

    /// Draws one set of input values into `x`.
    #[inline]
    #[allow(clippy::needless_range_loop)] // x, the estimates and the inputs share the index
    fn draw(&mut self, x: &mut [f64; MAX_INPUTS]) {
        let n = self.n;
        if self.correlated {
            let mut z = [0.0; MAX_INPUTS];
            for (zi, inp) in z.iter_mut().zip(&self.inputs[..n]) {
                if inp.distribution == Distribution::Normal && inp.standard_uncertainty > 0.0 {
                    *zi = self.sampler.standard_normal();
                }
            }
            for i in 0..n {
                let inp = self.inputs[i];
                x[i] = if inp.standard_uncertainty == 0.0 {
                    self.estimates[i]
                } else if inp.distribution == Distribution::Normal {
                    let row = i * (i + 1) / 2;
                    let mut s = 0.0;
                    for (l, zj) in self.chol[row..=row + i].iter().zip(&z[..=i]) {
                        s += l * zj;
                    }
                    self.estimates[i] + inp.standard_uncertainty * s
                } else {
                    self.sampler.sample(
                        inp.distribution,
                        self.estimates[i],
                        inp.standard_uncertainty,
                        inp.degrees_of_freedom,
                    )
                };
            }
        } else {
            for i in 0..n {
                let inp = self.inputs[i];
                x[i] = if inp.standard_uncertainty == 0.0 {
                    self.estimates[i]
                } else {
                    self.sampler.sample(
                        inp.distribution,
                        self.estimates[i],
                        inp.standard_uncertainty,
                        inp.degrees_of_freedom,
                    )
                };
            }
        }
    }

    fn target(&self) -> Option<usize> {
        match self.config.trials {
            TrialCount::Fixed { trials } => Some(trials),
            TrialCount::Adaptive => None,
        }
    }

    /// Runs up to `max_trials` more trials of `model`, storing the valid output values in
    /// `values` (the same buffer on every call; its length is the run's capacity).
    ///
    /// # Formula
    /// See the module docs.
    ///
    /// # Errors
    /// `LengthMismatch` when `values` is shorter than the values already stored, or shorter
    /// than a fixed trial count; `NoSolution` when more than half of the trials (and more than
    /// one batch) fail in the model.
    ///
    /// # Accuracy
    /// See [`MonteCarlo`].
    ///
    /// # Examples
    /// See [`MonteCarlo`].
    ///
    /// # References
    /// JCGM 101:2008 §7.9.4.
    pub fn run<M: MonteCarloModel + ?Sized>(
        &mut self,
        model: &M,
        values: &mut [f64],
        max_trials: usize,
    ) -> Result<Progress> {
        if values.len() < self.stored {
            return Err(Error::LengthMismatch {
                expected: self.stored,
                got: values.len(),
            });
        }
        if let Some(t) = self.target() {
            if values.len() < t {
                return Err(Error::LengthMismatch {
                    expected: t,
                    got: values.len(),
                });
            }
        }
        let mut x = [0.0; MAX_INPUTS];
        let mut done = 0usize;
        while self.status == RunStatus::Running && done < max_trials {
            if self.target() == Some(self.stored) {
                self.status = RunStatus::Completed;
                break;
            }
            if self.stored >= values.len() {
                self.status = RunStatus::CapacityReached;
                break;
            }
            self.draw(&mut x);
            done += 1;
            match model.evaluate(&x[..self.n]) {
                Ok(y) if y.is_finite() => {
                    values[self.stored] = y;
                    self.stored += 1;
                    self.all.push(y);
                    if self.stored % self.batch_size == 0 {
                        self.close_batch(&mut values[self.stored - self.batch_size..self.stored]);
                    }
                }
                _ => {
                    self.invalid += 1;
                    if self.invalid > self.batch_size as u64 && self.invalid > self.stored as u64 {
                        return Err(Error::NoSolution {
                            what: "more than half of the Monte Carlo trials fell outside the \
                                   model's domain; review the input distributions",
                        });
                    }
                }
            }
        }
        if self.status == RunStatus::Running {
            if self.target() == Some(self.stored) {
                self.status = RunStatus::Completed;
            } else if self.stored >= values.len() {
                self.status = RunStatus::CapacityReached;
            }
        }
        Ok(self.progress())
    }

    /// Summarises a complete batch (sorting it in place) and tests stabilisation.
    fn close_batch(&mut self, batch: &mut [f64]) {
        let (mean, sd) = mean_sd(batch);
        sort_values(batch);
        let p = self.config.coverage_probability;
        let (lo, hi) = match self.config.interval {
            IntervalKind::ProbabilisticallySymmetric => symmetric_interval(batch, p),
            IntervalKind::Shortest => shortest_interval(batch, p),
        };
        for (acc, v) in self.batch_stats.iter_mut().zip([mean, sd, lo, hi]) {
            acc.push(v);
        }
        self.batches += 1;
        if self.config.trials == TrialCount::Adaptive && self.batches >= 2 {
            if let (Some(delta), Some(spread)) = (self.tolerance(), self.spread()) {
                if spread.largest() <= delta {
                    self.status = RunStatus::Stabilized;
                }
            }
        }
    }

    fn tolerance(&self) -> Option<f64> {
        if self.batches >= 2 {
            Some(numerical_tolerance(
                self.all.sd(),
                self.config.significant_digits,
            ))
        } else {
            None
        }
    }

    fn spread(&self) -> Option<BatchSpread> {
        if self.batches >= 2 {
            let s = |i: usize| self.batch_stats[i].two_sigma_of_mean();
            Some(BatchSpread {
                estimate: s(0),
                standard_uncertainty: s(1),
                lower: s(2),
                upper: s(3),
            })
        } else {
            None
        }
    }

    /// Progress so far.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::monte_carlo::{MonteCarlo, MonteCarloConfig, RunStatus};
    /// let mc = MonteCarlo::new(MonteCarloConfig::default(), &[], &[], None).unwrap();
    /// assert_eq!((mc.progress().trials, mc.progress().status), (0, RunStatus::Running));
    /// ```
    pub fn progress(&self) -> Progress {
        Progress {
            trials: self.stored,
            invalid_trials: self.invalid,
            batches: self.batches,
            status: self.status,
            numerical_tolerance: self.tolerance(),
            largest_spread: self.spread().map(|s| s.largest()),
        }
    }

    /// Sorts the stored values (`values[..trials]`, ascending) and returns the results.
    ///
    /// # Formula
    /// See the module docs (JCGM 101 §7.6, §7.7, §7.9.2).
    ///
    /// # Errors
    /// `TooFewPoints` with fewer than 2 valid trials; `LengthMismatch` when `values` is
    /// shorter than the values stored.
    ///
    /// # Accuracy
    /// Two-pass mean and standard deviation over the values.
    ///
    /// # Examples
    /// See [`MonteCarlo`].
    ///
    /// # References
    /// JCGM 101:2008 §7.6, §7.7.
    pub fn finish(&self, values: &mut [f64]) -> Result<MonteCarloResult> {
        let m = self.stored;
        if values.len() < m {
            return Err(Error::LengthMismatch {
                expected: m,
                got: values.len(),
            });
        }
        if m < 2 {
            return Err(Error::TooFewPoints { needed: 2, got: m });
        }
        let v = &mut values[..m];
        let (mean, sd) = mean_sd(v);
        sort_values(v);
        let p = self.config.coverage_probability;
        let sym = symmetric_interval(v, p);
        let short = shortest_interval(v, p);
        let delta = numerical_tolerance(sd, self.config.significant_digits);
        let spread = self.spread();
        Ok(MonteCarloResult {
            trials: m,
            invalid_trials: self.invalid,
            estimate: mean,
            standard_uncertainty: sd,
            coverage_probability: p,
            symmetric_interval: [sym.0, sym.1],
            shortest_interval: [short.0, short.1],
            interval: self.config.interval,
            significant_digits: self.config.significant_digits,
            numerical_tolerance: delta,
            batch_spread: spread,
            batch_size: self.batch_size,
            batches: self.batches,
            stabilized: spread.is_some_and(|s| s.largest() <= delta),
            status: self.status,
        })
    }
}

/// Sorts `v` ascending in the total order of `f64::total_cmp`, in place: heapsort (Williams
/// 1964, Floyd's heap construction), O(n log n) comparisons without allocation. Chosen over the
/// standard library's pattern-defeating quicksort for code size: a few hundred bytes against
/// about 6 KB of the WebAssembly package (measured); on 10⁶ values it is slower by a factor of
/// about two, a small part of a run (see DEVELOPERS.md, "Uncertainty evaluation").
fn sort_values(v: &mut [f64]) {
    fn sift_down(v: &mut [f64], mut root: usize, end: usize) {
        loop {
            let mut child = 2 * root + 1;
            if child >= end {
                return;
            }
            if child + 1 < end && v[child].total_cmp(&v[child + 1]).is_lt() {
                child += 1;
            }
            if !v[root].total_cmp(&v[child]).is_lt() {
                return;
            }
            v.swap(root, child);
            root = child;
        }
    }
    let n = v.len();
    for i in (0..n / 2).rev() {
        sift_down(v, i, n);
    }
    for end in (1..n).rev() {
        v.swap(0, end);
        sift_down(v, 0, end);
    }
}

/// Two-pass mean and standard deviation (divisor n − 1).
fn mean_sd(v: &[f64]) -> (f64, f64) {
    let n = v.len() as f64;
    let mean = v.iter().sum::<f64>() / n;
    let ss: f64 = v.iter().map(|x| (x - mean) * (x - mean)).sum();
    (mean, if n > 1.0 { sqrt(ss / (n - 1.0)) } else { 0.0 })
}

/// q = pM (integer) or ⌊pM + ½⌋, at least 1 and at most M − 1 (JCGM 101 §7.7.1).
fn coverage_count(m: usize, p: f64) -> usize {
    let pm = p * m as f64;
    let q = if pm == floor(pm) { pm } else { floor(pm + 0.5) };
    (q as usize).clamp(1, m.saturating_sub(1).max(1))
}

/// Probabilistically symmetric interval of sorted values (JCGM 101 §7.7.1).
fn symmetric_interval(sorted: &[f64], p: f64) -> (f64, f64) {
    let m = sorted.len();
    let q = coverage_count(m, p);
    let d = m - q;
    // r = (M − q)/2 if an integer, else the integer part of (M − q + 1)/2; 1-based, ≥ 1.
    let r = d.div_ceil(2).max(1);
    let lo = sorted.get(r - 1).copied().unwrap_or(f64::NAN);
    let hi = sorted
        .get((r + q - 1).min(m - 1))
        .copied()
        .unwrap_or(f64::NAN);
    (lo, hi)
}

/// Shortest interval of sorted values (JCGM 101 §7.7.2).
fn shortest_interval(sorted: &[f64], p: f64) -> (f64, f64) {
    let m = sorted.len();
    let q = coverage_count(m, p);
    let mut best = (f64::INFINITY, 0usize);
    for r in 0..m - q {
        let w = sorted[r + q] - sorted[r];
        if w < best.0 {
            best = (w, r);
        }
    }
    (sorted[best.1], sorted[best.1 + q])
}

/// Numerical tolerance δ of a value z to `significant_digits` n_dig decimal digits (JCGM 101
/// §7.9.2): z = c·10^l with c an n_dig-digit integer, δ = ½·10^l (0 for z = 0).
///
/// # Formula
/// ```text
/// l = ⌊log10 |z|⌋ − n_dig + 1  (plus 1 if rounding |z|/10^l gives 10^n_dig);  δ = 10^l / 2
/// ```
///
/// # Errors
/// None (non-finite z gives NaN-free 0 for 0 and ∞ for ∞).
///
/// # Accuracy
/// Exact decision of l; δ is 10^l/2 to a rounding.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::numerical_tolerance;
/// // u(y) = 2.0 with 2 significant digits: c = 20, l = −1, δ = 0.05 (JCGM 101 §9.2.2)
/// assert!((numerical_tolerance(2.0, 2) - 0.05).abs() < 1e-17);
/// // 0.996 to 2 digits is 1.0 = 10·10⁻¹: δ = 0.05
/// assert!((numerical_tolerance(0.996, 2) - 0.05).abs() < 1e-17);
/// ```
///
/// # References
/// JCGM 101:2008 §7.9.2.
pub fn numerical_tolerance(z: f64, significant_digits: u8) -> f64 {
    let a = z.abs();
    if !(a > 0.0) {
        return 0.0;
    }
    if a.is_infinite() {
        return f64::INFINITY;
    }
    let nd = significant_digits.max(1) as i32;
    let mut l = floor(log10(a)) as i32 - nd + 1;
    let scale = |l: i32| powi(10.0, l);
    // Guard the log10 rounding on exact powers of ten, then the carry of the rounding.
    if crate::float::round(a / scale(l)) < powi(10.0, nd - 1) {
        l -= 1;
    }
    if crate::float::round(a / scale(l)) >= powi(10.0, nd) {
        l += 1;
    }
    0.5 * scale(l)
}

/// The JCGM 101 §8 comparison of a GUM result with a Monte Carlo result: the end-point
/// differences and whether they are within the numerical tolerance.
///
/// # Examples
/// See [`validate_gum`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct GumValidation {
    /// d_low = |y − U_p − y_low|.
    pub d_low: f64,
    /// d_high = |y + U_p − y_high|.
    pub d_high: f64,
    /// δ: the numerical tolerance of the GUM u_c to the run's significant digits.
    pub tolerance: f64,
    /// The Monte Carlo interval compared.
    pub interval: IntervalKind,
    /// Both differences ≤ δ: the GUM uncertainty framework is validated.
    pub passed: bool,
}

/// JCGM 101 §8.2 validation of the GUM uncertainty framework: compares the GUM interval
/// y ± U (from `gum_estimate` and `gum`) with the Monte Carlo interval of `mc` (the kind in
/// `mc.interval`).
///
/// # Formula
/// ```text
/// d_low = |y − U_p − y_low|,  d_high = |y + U_p − y_high|;  passed ⇔ max(d_low, d_high) ≤ δ
/// δ = numerical_tolerance(u_c(y), n_dig)
/// ```
///
/// # Errors
/// `NonFinite` for a non-finite `gum_estimate`; `Unsupported` when the GUM coverage
/// probability is not the Monte Carlo one (or not defined).
///
/// # Accuracy
/// Exact arithmetic on the inputs.
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::{propagate, Coverage, InputUncertainty};
/// use quantaband::thermometry::monte_carlo::*;
/// let u = [InputUncertainty::type_b(1.0).unwrap(); 4];
/// let gum = propagate(&[1.0; 4], &u, None, Coverage::Probability(0.95), None).unwrap();
/// let config = MonteCarloConfig { trials: TrialCount::Fixed { trials: 200_000 }, significant_digits: 1, ..Default::default() };
/// let mut mc = MonteCarlo::new(config, &[0.0; 4], &u, None).unwrap();
/// let mut v = vec![0.0; 200_000];
/// mc.run(&|x: &[f64]| -> quantaband::Result<f64> { Ok(x.iter().sum()) }, &mut v, usize::MAX).unwrap();
/// let r = mc.finish(&mut v).unwrap();
/// assert!(validate_gum(0.0, &gum, &r).unwrap().passed); // linear model, normal inputs
/// ```
///
/// # References
/// JCGM 101:2008 §8.1, §8.2.
pub fn validate_gum(
    gum_estimate: f64,
    gum: &GumResult,
    mc: &MonteCarloResult,
) -> Result<GumValidation> {
    finite("gum_estimate", gum_estimate)?;
    match gum.coverage_probability {
        Some(p) if (p - mc.coverage_probability).abs() <= 1e-12 => {}
        _ => {
            return Err(Error::Unsupported {
                what: "validation compares intervals of the same coverage probability",
            })
        }
    }
    let [lo, hi] = match mc.interval {
        IntervalKind::ProbabilisticallySymmetric => mc.symmetric_interval,
        IntervalKind::Shortest => mc.shortest_interval,
    };
    let u = gum.expanded_uncertainty;
    let d_low = (gum_estimate - u - lo).abs();
    let d_high = (gum_estimate + u - hi).abs();
    let tolerance = numerical_tolerance(gum.combined_standard_uncertainty, mc.significant_digits);
    Ok(GumValidation {
        d_low,
        d_high,
        tolerance,
        interval: mc.interval,
        passed: d_low <= tolerance && d_high <= tolerance,
    })
}

/// A histogram of Monte Carlo output values: equal bins between `lower` and `upper`, counts in
/// the caller's slice, values outside counted separately.
///
/// # Examples
/// See [`histogram`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Histogram {
    /// Lower edge of the first bin.
    pub lower: f64,
    /// Upper edge of the last bin.
    pub upper: f64,
    /// Bin width (upper − lower)/bins.
    pub bin_width: f64,
    /// Number of bins.
    pub bins: usize,
    /// Values below `lower`.
    pub below: u64,
    /// Values above `upper`.
    pub above: u64,
}

/// The Freedman–Diaconis number of bins for `sorted_values` over the range [`histogram`] uses:
/// width h = 2·IQR·M^(−1/3), bins = ⌈range/h⌉, clamped to [10, 1000] (10 when the IQR is 0).
/// About 2.4·M^(1/3) bins for a normal output (113 for 10⁵ values, 244 for 10⁶).
///
/// # Formula
/// ```text
/// IQR = y_(⌈0.75M⌉) − y_(⌈0.25M⌉);  range = y_(0.9995) − y_(0.0005);  bins = ⌈range/(2·IQR·M^(−1/3))⌉
/// ```
///
/// # Errors
/// `TooFewPoints` for fewer than 2 values.
///
/// # Accuracy
/// A rule of thumb for density estimates.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::recommended_bins;
/// let v: Vec<f64> = (0..1000).map(|i| i as f64).collect(); // uniform
/// assert_eq!(recommended_bins(&v).unwrap(), 10); // 999/(2·500·0.1) ≈ 10
/// ```
///
/// # References
/// D. Freedman, P. Diaconis, "On the histogram as a density estimator: L2 theory",
/// Z. Wahrscheinlichkeitstheorie verw. Gebiete 57, 453–476 (1981).
pub fn recommended_bins(sorted_values: &[f64]) -> Result<usize> {
    let m = sorted_values.len();
    if m < 2 {
        return Err(Error::TooFewPoints { needed: 2, got: m });
    }
    let q = |f: f64| sorted_values[((f * m as f64) as usize).min(m - 1)];
    let iqr = q(0.75) - q(0.25);
    let (lo, hi) = histogram_range(sorted_values);
    if !(iqr > 0.0) || !(hi > lo) {
        return Ok(10);
    }
    let h = 2.0 * iqr / crate::float::cbrt(m as f64);
    let b = ceil((hi - lo) / h);
    Ok(if b.is_finite() {
        (b as usize).clamp(10, 1000)
    } else {
        1000
    })
}

/// Range of the histogram: the central 99.9 % of the sorted values.
fn histogram_range(sorted: &[f64]) -> (f64, f64) {
    let m = sorted.len();
    let lo = sorted[((0.0005 * m as f64) as usize).min(m - 1)];
    let hi = sorted[(m - 1).saturating_sub((0.0005 * m as f64) as usize)];
    (lo, hi)
}

/// Bins `sorted_values` (ascending, as [`MonteCarlo::finish`] leaves them) into
/// `counts.len()` equal bins spanning the central 99.9 % of the values (the 0.05 % and
/// 99.95 % order statistics; the few values outside are counted in `below` / `above`).
///
/// # Formula
/// ```text
/// lower = y_(⌊0.0005M⌋+1), upper = y_(M−⌊0.0005M⌋);  bin k = ⌊(y − lower)/w⌋, w = (upper − lower)/bins
/// (the upper edge belongs to the last bin; a zero range is widened to ±½ around the value)
/// ```
///
/// # Errors
/// `TooFewPoints` for fewer than 2 values or an empty `counts`; `NotIncreasing` (arg
/// `sorted_values`) when the values are not in ascending order.
///
/// # Accuracy
/// Exact counts.
///
/// # Examples
/// ```
/// use quantaband::thermometry::monte_carlo::histogram;
/// let v: Vec<f64> = (0..10_000).map(|i| i as f64).collect();
/// let mut counts = [0u64; 10];
/// let h = histogram(&v, &mut counts).unwrap();
/// assert_eq!((h.below, h.above), (5, 5));
/// assert_eq!(counts.iter().sum::<u64>(), 9_990);
/// ```
///
/// # References
/// Common practice, no source.
pub fn histogram(sorted_values: &[f64], counts: &mut [u64]) -> Result<Histogram> {
    let m = sorted_values.len();
    if m < 2 {
        return Err(Error::TooFewPoints { needed: 2, got: m });
    }
    let bins = counts.len();
    if bins == 0 {
        return Err(Error::TooFewPoints { needed: 1, got: 0 });
    }
    for (i, w) in sorted_values.windows(2).enumerate() {
        if !(w[1] >= w[0]) {
            return Err(Error::NotIncreasing {
                arg: "sorted_values",
                index: i + 1,
            });
        }
    }
    let (mut lo, mut hi) = histogram_range(sorted_values);
    if !(hi > lo) {
        lo -= 0.5;
        hi += 0.5;
    }
    let w = (hi - lo) / bins as f64;
    counts.fill(0);
    let (mut below, mut above) = (0u64, 0u64);
    for &y in sorted_values {
        if y < lo {
            below += 1;
        } else if y > hi {
            above += 1;
        } else {
            let k = (((y - lo) / w) as usize).min(bins - 1);
            counts[k] += 1;
        }
    }
    Ok(Histogram {
        lower: lo,
        upper: hi,
        bin_width: w,
        bins,
        below,
        above,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn interval_indices_follow_jcgm_101() {
        // M = 10⁴, p = 0.95: q = 9500, r = 250 → [y_(250), y_(9750)] (1-based)
        let v: Vec<f64> = (1..=10_000).map(|i| i as f64).collect();
        assert_eq!(symmetric_interval(&v, 0.95), (250.0, 9750.0));
        // every interval of a uniform grid has the same width: the first is the shortest
        assert_eq!(shortest_interval(&v, 0.95), (1.0, 9501.0));
    }

    #[test]
    fn tolerance_digits() {
        assert!((numerical_tolerance(0.0126, 2) - 0.0005).abs() < 1e-18);
        assert!((numerical_tolerance(1000.0, 1) - 500.0).abs() < 1e-12);
        assert!((numerical_tolerance(99.96, 3) - 0.5).abs() < 1e-15);
        assert_eq!(numerical_tolerance(0.0, 2), 0.0);
    }
}
