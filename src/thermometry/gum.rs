//! The GUM uncertainty framework for any measurement model: the law of propagation of
//! uncertainty with correlated inputs, Type A / Type B inputs with degrees of freedom, the
//! Welch–Satterthwaite effective degrees of freedom, and the coverage factor and expanded
//! uncertainty for a stated coverage probability (JCGM 100:2008).
//!
//! The engine is model-independent: it takes, for each input quantity X_i, the sensitivity
//! coefficient c_i = ∂f/∂x_i of the model Y = f(X_1, …, X_N) and an [`InputUncertainty`]
//! (standard uncertainty, degrees of freedom, Type A/B, distribution), plus an optional
//! [`Correlation`] matrix. Any model's coefficients plug in — the grey measurement equation
//! ([`super::measurement_gum`]), a calibration curve ([`super::calibration_transfer`]), or a
//! caller's own. The same inputs drive the Monte Carlo propagation of
//! [`super::monte_carlo`].
//!
//! # Formula
//! ```text
//! u_c²(y) = Σ_i Σ_j c_i u_i r_ij c_j u_j                     JCGM 100 eq. (16) (eq. (10) if r = I)
//! ν_eff   = u_c⁴(y) / Σ_i (c_i u_i)⁴/ν_i                     Welch–Satterthwaite, JCGM 100 eq. (G.2b)
//! k_p     = t_{(1+p)/2}(ν)   with ν = ν_eff truncated to the next lower integer (JCGM 100 G.4.1
//!                            note 1; kept as is when ν_eff < 1); k_p = z_{(1+p)/2} for ν_eff = ∞
//! U       = k_p · u_c(y)                                      JCGM 100 eq. (18)
//! ```
//! Welch–Satterthwaite is defined for independent inputs; when two inputs with non-zero
//! contributions are correlated and one of them has finite degrees of freedom, ν_eff is not
//! defined ([`GumResult::effective_degrees_of_freedom`] is `None`): a coverage probability
//! cannot then be turned into k and [`propagate`] returns `Unsupported`, while a stated factor
//! ([`Coverage::Factor`]) still gives U. Correlated inputs with ν = ∞ are fine.
//!
//! Cautions: the GUM framework is first order; where the model is strongly non-linear over
//! the input uncertainties, or the output distribution is far from normal or t, check it with
//! the Monte Carlo method of [`super::monte_carlo`] (JCGM 101 §8). An uncertainty evaluation
//! is only as good as the input uncertainties and the model.
//!
//! # References
//! - JCGM 100:2008, *Evaluation of measurement data — Guide to the expression of uncertainty in
//!   measurement* (GUM 1995 with minor corrections), §4 (Type A/B), §5.1–5.2 (eq. 10, 13, 16),
//!   §6 (expanded uncertainty), Annex G (degrees of freedom, Welch–Satterthwaite, Table G.2).
//! - B. L. Welch, Biometrika 34, 28–35 (1947); F. E. Satterthwaite, Biometrics Bulletin 2,
//!   110–114 (1946).
#![forbid(unsafe_code)]

use super::student_t::{check_coverage_probability, check_degrees_of_freedom};
use crate::error::finite;
use crate::float::{floor, sqrt};
use crate::{Error, Result};

/// How a standard uncertainty was evaluated (JCGM 100 §4.2, §4.3).
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::{Evaluation, InputUncertainty};
/// assert_eq!(InputUncertainty::type_a(0.1, 9.0).unwrap().evaluation, Evaluation::TypeA);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Evaluation {
    /// Type A: by statistical analysis of a series of observations.
    TypeA,
    /// Type B: by other means (certificates, specifications, handbooks, experience).
    #[default]
    TypeB,
}

/// The probability distribution assigned to an input quantity, centred on its estimate x and
/// with standard deviation equal to the standard uncertainty u (except `StudentT`, whose scale
/// is u). The GUM law of propagation uses only u; the Monte Carlo method samples the
/// distribution.
///
/// # Formula
/// ```text
/// Normal       N(x, u²)
/// Rectangular  R(x − a, x + a),            a = √3·u        (JCGM 101 §6.4.2)
/// Triangular   symmetric on [x − a, x + a], a = √6·u        (JCGM 101 §6.4.5)
/// Arcsine      U-shaped on [x − a, x + a],  a = √2·u        (JCGM 101 §6.4.6)
/// StudentT     x + u·t_ν, the scaled and shifted t of a Type A evaluation from n = ν + 1
///              observations (u = s/√n); its standard deviation is u·√(ν/(ν − 2)) for ν > 2
///              (JCGM 101 §6.4.9)
/// ```
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::{Distribution, InputUncertainty};
/// let u = InputUncertainty::rectangular(0.02).unwrap(); // half-width 0.02
/// assert_eq!(u.distribution, Distribution::Rectangular);
/// assert!((u.standard_uncertainty - 0.02 / 3f64.sqrt()).abs() < 1e-18);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Distribution {
    /// Gaussian.
    #[default]
    Normal,
    /// Rectangular (uniform).
    Rectangular,
    /// Symmetric triangular.
    Triangular,
    /// Arcsine (U-shaped), e.g. a quantity varying sinusoidally.
    Arcsine,
    /// Scaled and shifted Student's t with the input's degrees of freedom (Type A).
    StudentT,
}

/// What is known about one input quantity apart from its estimate: standard uncertainty (in
/// the input's unit), degrees of freedom, type of evaluation and distribution.
///
/// # Formula
/// ```text
/// u ≥ 0;  ν > 0, ν = ∞ for an exactly known distribution (JCGM 100 G.4.2)
/// ```
///
/// # Errors
/// [`InputUncertainty::validate`]: `NonFinite` (u NaN or ∞; ν NaN), `OutOfRange` for u < 0
/// (range `[0, inf)`) or ν ≤ 0 (range `(0, inf]`), `Unsupported` for a `StudentT`
/// distribution with ν = ∞ (use `Normal`).
///
/// # Accuracy
/// Exact (data).
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::InputUncertainty;
/// // Type A from 10 readings: u = s/√10, ν = 9
/// let a = InputUncertainty::type_a(0.03, 9.0).unwrap();
/// assert_eq!((a.standard_uncertainty, a.degrees_of_freedom), (0.03, 9.0));
/// // Type B, normal, exactly known: ν = ∞
/// assert_eq!(InputUncertainty::type_b(0.5).unwrap().degrees_of_freedom, f64::INFINITY);
/// ```
///
/// # References
/// JCGM 100:2008 §4.2–4.3, G.3–G.4.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct InputUncertainty {
    /// Standard uncertainty u(x_i), in the input's unit, ≥ 0.
    pub standard_uncertainty: f64,
    /// Degrees of freedom ν_i, > 0; `f64::INFINITY` when the uncertainty is known exactly.
    pub degrees_of_freedom: f64,
    /// Type A or Type B.
    pub evaluation: Evaluation,
    /// Distribution (used by the Monte Carlo method; informational for the GUM).
    pub distribution: Distribution,
}

impl Default for InputUncertainty {
    fn default() -> Self {
        InputUncertainty::ZERO
    }
}

impl InputUncertainty {
    /// No uncertainty: u = 0, ν = ∞, Type B, normal (a constant).
    pub const ZERO: InputUncertainty = InputUncertainty {
        standard_uncertainty: 0.0,
        degrees_of_freedom: f64::INFINITY,
        evaluation: Evaluation::TypeB,
        distribution: Distribution::Normal,
    };

    /// Type B, normal distribution, ν = ∞, standard uncertainty `standard_uncertainty`.
    ///
    /// # Errors
    /// As [`InputUncertainty::validate`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::InputUncertainty;
    /// assert_eq!(InputUncertainty::type_b(-1.0).unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    pub fn type_b(standard_uncertainty: f64) -> Result<Self> {
        let u = InputUncertainty {
            standard_uncertainty,
            ..InputUncertainty::ZERO
        };
        u.validate()?;
        Ok(u)
    }

    /// Type A: standard uncertainty of a mean `standard_uncertainty` = s/√n with ν = n − 1
    /// `degrees_of_freedom`, scaled-and-shifted t distribution (JCGM 101 §6.4.9).
    ///
    /// # Errors
    /// As [`InputUncertainty::validate`] (ν = ∞ → `Unsupported`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::InputUncertainty;
    /// assert_eq!(InputUncertainty::type_a(0.1, 0.0).unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    pub fn type_a(standard_uncertainty: f64, degrees_of_freedom: f64) -> Result<Self> {
        let u = InputUncertainty {
            standard_uncertainty,
            degrees_of_freedom,
            evaluation: Evaluation::TypeA,
            distribution: Distribution::StudentT,
        };
        u.validate()?;
        Ok(u)
    }

    /// Type B, rectangular distribution of half-width `half_width` (u = a/√3), ν = ∞.
    ///
    /// # Errors
    /// As [`InputUncertainty::validate`].
    ///
    /// # Examples
    /// See [`Distribution`].
    pub fn rectangular(half_width: f64) -> Result<Self> {
        Self::shaped(half_width, 3.0, Distribution::Rectangular)
    }

    /// Type B, symmetric triangular distribution of half-width `half_width` (u = a/√6), ν = ∞.
    ///
    /// # Errors
    /// As [`InputUncertainty::validate`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::InputUncertainty;
    /// let u = InputUncertainty::triangular(6f64.sqrt()).unwrap();
    /// assert!((u.standard_uncertainty - 1.0).abs() < 1e-15);
    /// ```
    pub fn triangular(half_width: f64) -> Result<Self> {
        Self::shaped(half_width, 6.0, Distribution::Triangular)
    }

    /// Type B, arcsine (U-shaped) distribution of half-width `half_width` (u = a/√2), ν = ∞.
    ///
    /// # Errors
    /// As [`InputUncertainty::validate`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::InputUncertainty;
    /// let u = InputUncertainty::arcsine(2f64.sqrt()).unwrap();
    /// assert!((u.standard_uncertainty - 1.0).abs() < 1e-15);
    /// ```
    pub fn arcsine(half_width: f64) -> Result<Self> {
        Self::shaped(half_width, 2.0, Distribution::Arcsine)
    }

    fn shaped(half_width: f64, divisor_sq: f64, distribution: Distribution) -> Result<Self> {
        finite("half_width", half_width)?;
        if half_width < 0.0 {
            return Err(Error::OutOfRange {
                arg: "half_width",
                value: half_width,
                range: "[0, inf)",
            });
        }
        let u = InputUncertainty {
            standard_uncertainty: half_width / sqrt(divisor_sq),
            distribution,
            ..InputUncertainty::ZERO
        };
        u.validate()?;
        Ok(u)
    }

    /// Checks the fields.
    ///
    /// # Formula
    /// ```text
    /// 0 ≤ u < ∞;  0 < ν ≤ ∞;  StudentT needs ν < ∞
    /// ```
    ///
    /// # Errors
    /// `NonFinite` (arg `standard_uncertainty` or `degrees_of_freedom`), `OutOfRange`,
    /// `Unsupported` — see [`InputUncertainty`].
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::InputUncertainty;
    /// let bad = InputUncertainty { degrees_of_freedom: 0.0, ..InputUncertainty::ZERO };
    /// assert_eq!(bad.validate().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// JCGM 100:2008 G.3, G.4.
    pub fn validate(&self) -> Result<()> {
        finite("standard_uncertainty", self.standard_uncertainty)?;
        if self.standard_uncertainty < 0.0 {
            return Err(Error::OutOfRange {
                arg: "standard_uncertainty",
                value: self.standard_uncertainty,
                range: "[0, inf)",
            });
        }
        check_degrees_of_freedom("degrees_of_freedom", self.degrees_of_freedom)?;
        if self.distribution == Distribution::StudentT && self.degrees_of_freedom.is_infinite() {
            return Err(Error::Unsupported {
                what: "a t distribution needs finite degrees of freedom (use Normal for nu = inf)",
            });
        }
        Ok(())
    }
}

/// Largest matrix [`Correlation::new`] validates with its own stack workspace; larger ones go
/// through [`Correlation::with_workspace`].
pub const MAX_STACK_CORRELATION: usize = 32;

/// Slack on positive semi-definiteness: the matrix is accepted when R + τ·I is positive
/// definite (its smallest eigenvalue ≥ −τ).
pub const PSD_TOLERANCE: f64 = 1e-12;

/// A validated correlation matrix r_ij of N input quantities, borrowed as N² numbers in
/// row-major order.
///
/// # Formula
/// ```text
/// r_ii = 1;  r_ij = r_ji (within 1e-12);  −1 ≤ r_ij ≤ 1;
/// positive semi-definite: the Cholesky factorisation of R + τ·I succeeds, τ = 1e-12
/// r(x_i, x_j) = u(x_i, x_j)/(u(x_i)·u(x_j))                       JCGM 100 eq. (14)
/// ```
///
/// # Errors
/// `LengthMismatch` when the length is not a perfect square (expected: the next square);
/// `NonFinite` for a NaN or infinite entry; `InvalidCorrelation` (with the entry's row and
/// column) for a diagonal entry ≠ 1, an entry outside [−1, 1], an asymmetric pair, or a matrix
/// that is not positive semi-definite (row = column = the failing pivot);
/// `Unsupported` for N > [`MAX_STACK_CORRELATION`] in [`Correlation::new`];
/// `LengthMismatch` for a workspace shorter than N(N+1)/2.
///
/// # Accuracy
/// Exact comparisons; the semi-definiteness test has the slack τ above.
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::Correlation;
/// let ok = [1.0, 0.5, 0.5, 1.0];
/// assert_eq!(Correlation::new(&ok).unwrap().size(), 2);
/// // three quantities cannot be pairwise −0.9 correlated: not positive semi-definite
/// let bad = [1.0, -0.9, -0.9, -0.9, 1.0, -0.9, -0.9, -0.9, 1.0];
/// assert_eq!(Correlation::new(&bad).unwrap_err().code(), "INVALID_CORRELATION");
/// ```
///
/// # References
/// JCGM 100:2008 §5.2.2, eq. (14) and (16); G. H. Golub, C. F. Van Loan, *Matrix
/// Computations*, 4th ed., 2013, §4.2 (Cholesky factorisation).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Correlation<'a> {
    matrix: &'a [f64],
    n: usize,
}

impl<'a> Correlation<'a> {
    /// Validates a row-major N×N correlation matrix (N ≤ [`MAX_STACK_CORRELATION`]).
    ///
    /// # Errors
    /// See [`Correlation`].
    ///
    /// # Examples
    /// See [`Correlation`].
    pub fn new(matrix: &'a [f64]) -> Result<Self> {
        let n = square_size(matrix.len())?;
        if n > MAX_STACK_CORRELATION {
            return Err(Error::Unsupported {
                what: "correlation matrices above 32 x 32 need Correlation::with_workspace",
            });
        }
        let mut work = [0.0; MAX_STACK_CORRELATION * (MAX_STACK_CORRELATION + 1) / 2];
        Self::with_workspace(matrix, &mut work)
    }

    /// Validates a row-major N×N correlation matrix of any size, using `workspace`
    /// (≥ N(N+1)/2 numbers) for the Cholesky factor. On success the workspace holds the packed
    /// lower-triangular factor L of R + τ·I (row i at offset i(i+1)/2).
    ///
    /// # Errors
    /// See [`Correlation`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::Correlation;
    /// let r = [1.0, 1.0, 1.0, 1.0]; // fully correlated: semi-definite, accepted
    /// let mut w = [0.0; 3];
    /// assert!(Correlation::with_workspace(&r, &mut w).is_ok());
    /// ```
    pub fn with_workspace(matrix: &'a [f64], workspace: &mut [f64]) -> Result<Self> {
        let n = square_size(matrix.len())?;
        let need = n * (n + 1) / 2;
        if workspace.len() < need {
            return Err(Error::LengthMismatch {
                expected: need,
                got: workspace.len(),
            });
        }
        for i in 0..n {
            for j in 0..n {
                let v = matrix[i * n + j];
                finite("correlation", v)?;
                let bad = |reason| Error::InvalidCorrelation {
                    reason,
                    row: i,
                    column: j,
                    value: v,
                };
                if i == j && v != 1.0 {
                    return Err(bad("diagonal entries must be 1"));
                }
                if !(-1.0..=1.0).contains(&v) {
                    return Err(bad("entries must lie in [-1, 1]"));
                }
                if (v - matrix[j * n + i]).abs() > 1e-12 {
                    return Err(bad("matrix must be symmetric"));
                }
            }
        }
        cholesky_packed(matrix, n, workspace)?;
        Ok(Correlation { matrix, n })
    }

    /// Number of input quantities N.
    ///
    /// # Examples
    /// See [`Correlation`].
    pub fn size(&self) -> usize {
        self.n
    }

    /// The entry r_ij (0 outside the matrix).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::Correlation;
    /// let r = Correlation::new(&[1.0, 0.3, 0.3, 1.0]).unwrap();
    /// assert_eq!(r.get(0, 1), 0.3);
    /// ```
    pub fn get(&self, i: usize, j: usize) -> f64 {
        if i < self.n && j < self.n {
            self.matrix.get(i * self.n + j).copied().unwrap_or(0.0)
        } else {
            0.0
        }
    }

    /// The row-major entries.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::Correlation;
    /// assert_eq!(Correlation::new(&[1.0]).unwrap().matrix(), &[1.0]);
    /// ```
    pub fn matrix(&self) -> &'a [f64] {
        self.matrix
    }
}

/// N for a slice of N² numbers.
fn square_size(len: usize) -> Result<usize> {
    let mut n = 0usize;
    while n * n < len {
        n += 1;
    }
    if n * n == len && n > 0 {
        Ok(n)
    } else {
        Err(Error::LengthMismatch {
            expected: (n * n).max(1),
            got: len,
        })
    }
}

/// Packed lower Cholesky factor of R + τI (R symmetric, checked by the caller) into `l`;
/// `InvalidCorrelation` at the first non-positive pivot.
pub(crate) fn cholesky_packed(r: &[f64], n: usize, l: &mut [f64]) -> Result<()> {
    let idx = |i: usize, j: usize| i * (i + 1) / 2 + j;
    for i in 0..n {
        for j in 0..=i {
            let mut s = r[i * n + j] + if i == j { PSD_TOLERANCE } else { 0.0 };
            for k in 0..j {
                s -= l[idx(i, k)] * l[idx(j, k)];
            }
            if i == j {
                if !(s > 0.0) {
                    return Err(Error::InvalidCorrelation {
                        reason: "matrix is not positive semi-definite",
                        row: i,
                        column: i,
                        value: s - PSD_TOLERANCE,
                    });
                }
                l[idx(i, i)] = sqrt(s);
            } else {
                l[idx(i, j)] = s / l[idx(j, j)];
            }
        }
    }
    Ok(())
}

/// The coverage asked for.
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::Coverage;
/// assert_eq!(Coverage::default(), Coverage::Probability(0.95));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(tag = "kind", content = "value", rename_all = "camelCase")
)]
pub enum Coverage {
    /// A coverage probability p ∈ (0, 1): k from Student's t with ν_eff (default 0.95).
    Probability(f64),
    /// A stated coverage factor k > 0 (e.g. k = 2); the result reports the coverage
    /// probability that the t distribution with ν_eff degrees of freedom gives it.
    Factor(f64),
}

impl Default for Coverage {
    fn default() -> Self {
        Coverage::Probability(0.95)
    }
}

/// How the combined standard uncertainty was propagated.
///
/// # Examples
/// See [`propagate`].
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Propagation {
    /// First-order law of propagation, independent inputs (JCGM 100 eq. 10).
    FirstOrderUncorrelated,
    /// First-order law of propagation with correlations (JCGM 100 eq. 13/16).
    FirstOrderCorrelated,
}

/// How the coverage factor was obtained.
///
/// # Examples
/// See [`propagate`].
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum CoverageMethod {
    /// k = t_{(1+p)/2}(ν) from Student's t with the Welch–Satterthwaite ν_eff (JCGM 100 G.4,
    /// G.6.4).
    StudentT,
    /// ν_eff = ∞: k from the normal distribution (JCGM 100 G.6.2 ff.).
    Normal,
    /// k stated by the caller; the coverage probability is what t(ν_eff) gives it.
    StatedFactor,
}

/// The method behind a [`GumResult`].
///
/// # Examples
/// See [`propagate`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct GumMethod {
    /// Propagation law.
    pub propagation: Propagation,
    /// Source of the coverage factor.
    pub coverage: CoverageMethod,
    /// Degrees of freedom the coverage factor was taken at (ν_eff truncated to an integer,
    /// ∞ for the normal case; `None` for a stated factor without a defined ν_eff).
    pub degrees_of_freedom_used: Option<f64>,
}

impl GumMethod {
    /// One sentence stating the method, for a report.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::{CoverageMethod, GumMethod, Propagation};
    /// let m = GumMethod { propagation: Propagation::FirstOrderCorrelated,
    ///     coverage: CoverageMethod::StudentT, degrees_of_freedom_used: Some(16.0) };
    /// assert!(m.describe().contains("Welch-Satterthwaite"));
    /// ```
    pub fn describe(&self) -> &'static str {
        match (self.propagation, self.coverage) {
            (Propagation::FirstOrderUncorrelated, CoverageMethod::StudentT) => {
                "JCGM 100:2008 first-order law of propagation (eq. 10, uncorrelated inputs); \
                 Welch-Satterthwaite effective degrees of freedom (eq. G.2b), truncated; \
                 coverage factor from Student's t"
            }
            (Propagation::FirstOrderCorrelated, CoverageMethod::StudentT) => {
                "JCGM 100:2008 first-order law of propagation with correlations (eq. 16); \
                 Welch-Satterthwaite effective degrees of freedom (eq. G.2b), truncated; \
                 coverage factor from Student's t"
            }
            (Propagation::FirstOrderUncorrelated, CoverageMethod::Normal) => {
                "JCGM 100:2008 first-order law of propagation (eq. 10, uncorrelated inputs); \
                 infinite effective degrees of freedom; coverage factor from the normal \
                 distribution"
            }
            (Propagation::FirstOrderCorrelated, CoverageMethod::Normal) => {
                "JCGM 100:2008 first-order law of propagation with correlations (eq. 16); \
                 infinite effective degrees of freedom; coverage factor from the normal \
                 distribution"
            }
            (Propagation::FirstOrderUncorrelated, CoverageMethod::StatedFactor) => {
                "JCGM 100:2008 first-order law of propagation (eq. 10, uncorrelated inputs); \
                 stated coverage factor"
            }
            (Propagation::FirstOrderCorrelated, CoverageMethod::StatedFactor) => {
                "JCGM 100:2008 first-order law of propagation with correlations (eq. 16); \
                 stated coverage factor"
            }
        }
    }
}

/// One input's line in a GUM budget.
///
/// # Examples
/// See [`propagate`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct GumEntry {
    /// Sensitivity coefficient c_i (output unit per input unit).
    pub sensitivity: f64,
    /// The input's uncertainty description.
    pub input: InputUncertainty,
    /// Uncertainty component u_i(y) = c_i·u(x_i), signed, output unit.
    pub component: f64,
    /// Share of u_c²: c_i u_i Σ_j r_ij c_j u_j / u_c² (the shares sum to 1; with
    /// correlations a share can be negative). 0 when u_c = 0.
    pub variance_share: f64,
}

impl Default for GumEntry {
    fn default() -> Self {
        GumEntry {
            sensitivity: 0.0,
            input: InputUncertainty::ZERO,
            component: 0.0,
            variance_share: 0.0,
        }
    }
}

/// The result of [`propagate`] (uncertainties in the output quantity's unit).
///
/// # Examples
/// See [`propagate`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct GumResult {
    /// Combined standard uncertainty u_c(y).
    pub combined_standard_uncertainty: f64,
    /// Welch–Satterthwaite effective degrees of freedom, untruncated (`f64::INFINITY` when
    /// every contributing input has ν = ∞ or u_c = 0); `None` when not defined (correlated
    /// inputs with finite degrees of freedom).
    pub effective_degrees_of_freedom: Option<f64>,
    /// Coverage factor k.
    pub coverage_factor: f64,
    /// Coverage probability p: the one asked for, or, for a stated k, the one t(ν_eff) gives
    /// it (`None` when ν_eff is not defined).
    pub coverage_probability: Option<f64>,
    /// Expanded uncertainty U = k·u_c(y).
    pub expanded_uncertainty: f64,
    /// The method used.
    pub method: GumMethod,
}

/// The GUM law of propagation of uncertainty for any model: combined standard uncertainty,
/// Welch–Satterthwaite effective degrees of freedom, coverage factor and expanded uncertainty
/// from the sensitivity coefficients `sensitivities` (c_i), the inputs' uncertainties
/// `inputs` and an optional correlation matrix; optionally writes one [`GumEntry`] per input
/// to `entries`.
///
/// # Formula
/// ```text
/// u_c² = Σ_i Σ_j c_i u_i r_ij c_j u_j;   ν_eff = u_c⁴ / Σ_i (c_i u_i)⁴/ν_i
/// k = t_{(1+p)/2}(⌊ν_eff⌋) (or the stated k);   U = k·u_c
/// share_i = c_i u_i Σ_j r_ij c_j u_j / u_c²
/// ```
/// (see the module docs).
///
/// # Errors
/// - `LengthMismatch` when `inputs`, the correlation matrix or `entries` do not match
///   `sensitivities` in length;
/// - `NonFinite` for a non-finite sensitivity of an input with u > 0 (an input with u = 0
///   contributes nothing, whatever its coefficient); the errors of [`InputUncertainty::validate`]
///   (negative uncertainty → `OutOfRange`, zero degrees of freedom → `OutOfRange`);
///   `OutOfRange` (arg `sensitivities`) when a component c_i·u_i is beyond the f64 range;
/// - `OutOfRange` for a coverage probability outside (0, 1) (arg `coverage_probability`) or a
///   coverage factor ≤ 0 (arg `coverage_factor`);
/// - `Unsupported` when a coverage probability is asked for but ν_eff is not defined
///   (correlated inputs with finite degrees of freedom).
///
/// u_c and U are +∞ only where their true value is above `f64::MAX` (several components near
/// it, or a large coverage factor).
///
/// # Accuracy
/// Sums in f64 (u_c to a few ulp; a rounding-negative u_c² from strong negative correlation is
/// clamped to 0; components beyond 1e±150 are scaled by an exact power of two first). Reproduces the JCGM 100 H.1 and H.2 worked examples to their printed digits
/// and an mpmath evaluation of a correlated 9-input budget to 1e-13 relative
/// (`tests/gum_reference.rs`); k as [`super::student_t::coverage_factor`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::{propagate, Coverage, CoverageMethod, InputUncertainty};
/// // JCGM 100:2008 H.1 (end-gauge calibration), contributions in nm (from memory):
/// // 25 (ν 18), 9.7 (ν 25.6), 2.9 (ν 50), 16.6 (ν 2), coefficients 1.
/// let u = [
///     InputUncertainty::type_a(25.0, 18.0).unwrap(),
///     InputUncertainty::type_a(9.7, 25.6).unwrap(),
///     InputUncertainty::type_a(2.9, 50.0).unwrap(),
///     InputUncertainty::type_a(16.6, 2.0).unwrap(),
/// ];
/// let r = propagate(&[1.0; 4], &u, None, Coverage::Probability(0.99), None).unwrap();
/// assert_eq!(r.combined_standard_uncertainty.round(), 32.0); // u_c = 32 nm
/// assert_eq!(r.effective_degrees_of_freedom.unwrap().floor(), 16.0); // ν_eff = 16
/// assert_eq!((r.coverage_factor * 100.0).round() / 100.0, 2.92); // t_99(16) = 2.92
/// assert_eq!(r.method.coverage, CoverageMethod::StudentT);
/// ```
///
/// # References
/// JCGM 100:2008 eq. (10), (13), (16), (18), (G.2b), G.4.1, Table G.2.
pub fn propagate(
    sensitivities: &[f64],
    inputs: &[InputUncertainty],
    correlation: Option<&Correlation<'_>>,
    coverage: Coverage,
    entries: Option<&mut [GumEntry]>,
) -> Result<GumResult> {
    let n = sensitivities.len();
    if inputs.len() != n {
        return Err(Error::LengthMismatch {
            expected: n,
            got: inputs.len(),
        });
    }
    if let Some(r) = correlation {
        if r.size() != n {
            return Err(Error::LengthMismatch {
                expected: n * n,
                got: r.size() * r.size(),
            });
        }
    }
    if let Some(e) = entries.as_deref() {
        if e.len() != n {
            return Err(Error::LengthMismatch {
                expected: n,
                got: e.len(),
            });
        }
    }
    for (c, u) in sensitivities.iter().zip(inputs) {
        u.validate()?;
        // An input with zero uncertainty contributes nothing, whatever its coefficient.
        if u.standard_uncertainty > 0.0 {
            finite("sensitivities", *c)?;
            if !(c * u.standard_uncertainty).is_finite() {
                return Err(Error::OutOfRange {
                    arg: "sensitivities",
                    value: *c,
                    range: "|c_i u_i| <= f64::MAX",
                });
            }
        }
    }
    match coverage {
        Coverage::Probability(p) => {
            check_coverage_probability(p)?;
        }
        Coverage::Factor(k) => {
            finite("coverage_factor", k)?;
            if !(k > 0.0) {
                return Err(Error::OutOfRange {
                    arg: "coverage_factor",
                    value: k,
                    range: "(0, inf)",
                });
            }
        }
    }
    let comp_unscaled = |i: usize| {
        let u = inputs[i].standard_uncertainty;
        if u > 0.0 {
            sensitivities[i] * u
        } else {
            0.0
        }
    };
    // The components scaled by an exact power of two when the largest is beyond 1e±150, so
    // that neither the variance nor the fourth powers overflow or underflow; u_c is scaled
    // back at the end.
    let largest = (0..n).fold(0.0, |m: f64, i| m.max(comp_unscaled(i).abs()));
    let scale = if largest > 1e150 {
        f64::from_bits((1023 - 600) << 52)
    } else if largest > 0.0 && largest < 1e-150 {
        f64::from_bits((1023 + 600) << 52)
    } else {
        1.0
    };
    let comp = |i: usize| comp_unscaled(i) * scale;
    let r = |i: usize, j: usize| match correlation {
        Some(c) => c.get(i, j),
        None => {
            if i == j {
                1.0
            } else {
                0.0
            }
        }
    };
    // Variance and each input's share (row sums of the covariance of the components).
    let mut var = 0.0;
    let mut correlated = false;
    let mut ws_undefined = false;
    for i in 0..n {
        let ci = comp(i);
        let mut row = 0.0;
        for j in 0..n {
            let rij = r(i, j);
            if i != j && rij != 0.0 {
                let cj = comp(j);
                if ci != 0.0 && cj != 0.0 {
                    correlated = true;
                    if inputs[i].degrees_of_freedom.is_finite()
                        || inputs[j].degrees_of_freedom.is_finite()
                    {
                        ws_undefined = true;
                    }
                }
                row += rij * cj;
            } else if i == j {
                row += ci;
            }
        }
        var += ci * row;
    }
    let var = var.max(0.0);
    let uc = sqrt(var);
    let uc_unscaled = uc / scale;
    // Welch–Satterthwaite (scaled by u_c to avoid overflow of the fourth powers).
    let nu_eff = if ws_undefined {
        None
    } else if !(uc > 0.0) {
        Some(f64::INFINITY)
    } else {
        let mut den = 0.0;
        for (i, u) in inputs.iter().enumerate() {
            if u.degrees_of_freedom.is_finite() {
                let q = comp(i) / uc;
                den += q * q * q * q / u.degrees_of_freedom;
            }
        }
        if den == f64::INFINITY {
            // A ν_i below the f64 range's reciprocal: ν_eff = ν_min / Σ q⁴·(ν_min/ν_i), each
            // term ≤ 1, instead of 1/∞ = 0.
            let nu_min = inputs
                .iter()
                .map(|u| u.degrees_of_freedom)
                .fold(f64::INFINITY, f64::min);
            let mut d = 0.0;
            for (i, u) in inputs.iter().enumerate() {
                if u.degrees_of_freedom.is_finite() {
                    let q = comp(i) / uc;
                    d += q * q * q * q * (nu_min / u.degrees_of_freedom);
                }
            }
            Some(if d > 0.0 { nu_min / d } else { f64::INFINITY })
        } else {
            Some(if den > 0.0 { 1.0 / den } else { f64::INFINITY })
        }
    };
    let nu_used = nu_eff.map(|v| if v >= 1.0 { floor(v) } else { v });
    let propagation = if correlated {
        Propagation::FirstOrderCorrelated
    } else {
        Propagation::FirstOrderUncorrelated
    };
    let (k, p, method) = match coverage {
        Coverage::Probability(p) => {
            let Some(nu) = nu_used else {
                return Err(Error::Unsupported {
                    what: "effective degrees of freedom are not defined for correlated inputs \
                           with finite degrees of freedom; state a coverage factor instead",
                });
            };
            let k = super::student_t::coverage_factor(p, nu)?;
            let m = if nu.is_infinite() {
                CoverageMethod::Normal
            } else {
                CoverageMethod::StudentT
            };
            (k, Some(p), m)
        }
        Coverage::Factor(k) => {
            let p = nu_used.map(|nu| 1.0 - 2.0 * super::student_t::upper_tail(k, nu));
            (k, p, CoverageMethod::StatedFactor)
        }
    };
    if let Some(out) = entries {
        for (i, e) in out.iter_mut().enumerate() {
            let ci = comp(i);
            let mut row = 0.0;
            for j in 0..n {
                row += r(i, j) * comp(j);
            }
            *e = GumEntry {
                sensitivity: sensitivities[i],
                input: inputs[i],
                component: comp_unscaled(i),
                variance_share: if var > 0.0 { ci * row / var } else { 0.0 },
            };
        }
    }
    Ok(GumResult {
        combined_standard_uncertainty: uc_unscaled,
        effective_degrees_of_freedom: nu_eff,
        coverage_factor: k,
        coverage_probability: p,
        expanded_uncertainty: k * uc_unscaled,
        method: GumMethod {
            propagation,
            coverage: method,
            degrees_of_freedom_used: nu_used,
        },
    })
}

/// A Type A evaluation of a series of `observations` (JCGM 100 §4.2): their mean, the
/// experimental standard deviation s, the standard uncertainty of the mean s/√n and ν = n − 1.
///
/// # Examples
/// See [`type_a`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct TypeA {
    /// Arithmetic mean q̄ (eq. 3).
    pub mean: f64,
    /// Experimental standard deviation s(q_k) (eq. 4).
    pub standard_deviation: f64,
    /// Experimental standard deviation of the mean s(q̄) = s/√n (eq. 5), the standard
    /// uncertainty of the mean.
    pub standard_uncertainty: f64,
    /// Degrees of freedom ν = n − 1.
    pub degrees_of_freedom: f64,
}

impl TypeA {
    /// The corresponding [`InputUncertainty`] (Type A, scaled-and-shifted t).
    ///
    /// # Errors
    /// As [`InputUncertainty::type_a`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::type_a;
    /// let u = type_a(&[1.0, 2.0, 3.0]).unwrap().input().unwrap();
    /// assert_eq!(u.degrees_of_freedom, 2.0);
    /// ```
    pub fn input(&self) -> Result<InputUncertainty> {
        InputUncertainty::type_a(self.standard_uncertainty, self.degrees_of_freedom)
    }
}

/// Type A evaluation of repeated `observations` (≥ 2, any unit).
///
/// # Formula
/// ```text
/// q̄ = Σ q_k / n;   s² = Σ (q_k − q̄)² / (n − 1);   u(q̄) = s/√n;   ν = n − 1
/// ```
/// (two-pass sums).
///
/// # Errors
/// `TooFewPoints` for fewer than 2 observations; `NonFinite` for a non-finite one.
///
/// # Accuracy
/// Two-pass mean and variance: a few ulp for well-scaled data.
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::type_a;
/// // JCGM 100:2008 H.2 (from memory): five voltage readings, mean 4.9990 V, s(mean) = 0.0032 V
/// let v = type_a(&[5.007, 4.994, 5.005, 4.990, 4.999]).unwrap();
/// assert!((v.mean - 4.999).abs() < 1e-12);
/// assert_eq!((v.standard_uncertainty * 1e4).round(), 32.0);
/// assert_eq!(v.degrees_of_freedom, 4.0);
/// ```
///
/// # References
/// JCGM 100:2008 §4.2, eq. (3)–(5).
pub fn type_a(observations: &[f64]) -> Result<TypeA> {
    let n = observations.len();
    if n < 2 {
        return Err(Error::TooFewPoints { needed: 2, got: n });
    }
    for &q in observations {
        finite("observations", q)?;
    }
    let k = overflow_scale(observations);
    let (mean, s) = mean_and_deviation(observations, k);
    let nf = n as f64;
    Ok(TypeA {
        mean: mean / k,
        standard_deviation: s / k,
        standard_uncertainty: s / k / sqrt(nf),
        degrees_of_freedom: nf - 1.0,
    })
}

/// 1, or 2⁻⁶⁰⁰ (exact) when an observation exceeds 1e150 in magnitude, so that the sums of
/// [`mean_and_deviation`] cannot overflow.
fn overflow_scale(observations: &[f64]) -> f64 {
    if observations.iter().any(|q| q.abs() > 1e150) {
        // 2⁻⁶⁰⁰: a power of two, so the scaling is exact.
        f64::from_bits((1023 - 600) << 52)
    } else {
        1.0
    }
}

/// Mean and sample standard deviation of the observations times `k` (two passes; n ≥ 2, finite).
fn mean_and_deviation(observations: &[f64], k: f64) -> (f64, f64) {
    let nf = observations.len() as f64;
    let mean = observations.iter().map(|q| q * k).sum::<f64>() / nf;
    let ss: f64 = observations
        .iter()
        .map(|q| (q * k - mean) * (q * k - mean))
        .sum();
    (mean, sqrt(ss / (nf - 1.0)))
}

/// Estimated correlation coefficient of the means of two simultaneously observed series `x`
/// and `y` (JCGM 100 eq. (14) and (17)).
///
/// # Formula
/// ```text
/// s(q̄, r̄) = Σ (q_k − q̄)(r_k − r̄) / (n(n − 1));   r(q̄, r̄) = s(q̄, r̄) / (s(q̄)·s(r̄))
/// ```
///
/// # Errors
/// `LengthMismatch`; `TooFewPoints` (< 2); `NonFinite`; `DegenerateFit` when a series is
/// constant (its standard deviation is 0).
///
/// # Accuracy
/// Two-pass sums; clamped to [−1, 1].
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::type_a_correlation;
/// // JCGM 100:2008 H.2 (from memory): r(V, I) = −0.36 from five paired readings
/// let v = [5.007, 4.994, 5.005, 4.990, 4.999];
/// let i = [19.663, 19.639, 19.640, 19.685, 19.678];
/// assert_eq!((type_a_correlation(&v, &i).unwrap() * 100.0).round() / 100.0, -0.36);
/// ```
///
/// # References
/// JCGM 100:2008 §5.2.3, eq. (14), (17).
pub fn type_a_correlation(x: &[f64], y: &[f64]) -> Result<f64> {
    if x.len() != y.len() {
        return Err(Error::LengthMismatch {
            expected: x.len(),
            got: y.len(),
        });
    }
    let a = type_a(x)?;
    let b = type_a(y)?;
    if !(a.standard_deviation > 0.0 && b.standard_deviation > 0.0) {
        return Err(Error::DegenerateFit {
            reason: "a constant series has no correlation",
        });
    }
    // Standardised deviations (|d/s| ≤ √(n − 1)), on data scaled as in type_a: neither the sum
    // of products nor the product of the deviations can overflow or underflow.
    let (kx, ky) = (overflow_scale(x), overflow_scale(y));
    let ((mx, sx), (my, sy)) = (mean_and_deviation(x, kx), mean_and_deviation(y, ky));
    let mut sxy = 0.0;
    for (&p, &q) in x.iter().zip(y) {
        sxy += ((p * kx - mx) / sx) * ((q * ky - my) / sy);
    }
    let r = sxy / (x.len() as f64 - 1.0);
    Ok(r.clamp(-1.0, 1.0))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn uncorrelated_equals_root_sum_of_squares() {
        let u = [
            InputUncertainty::type_b(1.0).unwrap(),
            InputUncertainty::type_b(2.0).unwrap(),
        ];
        let r = propagate(&[3.0, -1.0], &u, None, Coverage::Factor(2.0), None).unwrap();
        assert!((r.combined_standard_uncertainty - 13f64.sqrt()).abs() < 1e-15);
        assert_eq!(
            r.expanded_uncertainty,
            2.0 * r.combined_standard_uncertainty
        );
        // ν = ∞: the coverage probability of k = 2 is 2Φ(2) − 1 = 0.954 499 736 103 642
        let p = r.coverage_probability.unwrap();
        assert!((p - 0.954_499_736_103_641_6).abs() < 1e-15);
    }

    #[test]
    fn full_positive_correlation_adds_linearly() {
        let u = [
            InputUncertainty::type_b(1.0).unwrap(),
            InputUncertainty::type_b(2.0).unwrap(),
        ];
        let m = [1.0, 1.0, 1.0, 1.0];
        let c = Correlation::new(&m).unwrap();
        let mut e = [GumEntry::default(); 2];
        let r = propagate(&[1.0, 1.0], &u, Some(&c), Coverage::default(), Some(&mut e)).unwrap();
        assert!((r.combined_standard_uncertainty - 3.0).abs() < 1e-15);
        assert_eq!(r.method.propagation, Propagation::FirstOrderCorrelated);
        assert!((e[0].variance_share + e[1].variance_share - 1.0).abs() < 1e-15);
        // opposite signs cancel
        let r = propagate(&[1.0, -0.5], &u, Some(&c), Coverage::default(), None).unwrap();
        assert!(r.combined_standard_uncertainty.abs() < 1e-15);
    }

    #[test]
    fn correlated_finite_dof_needs_stated_factor() {
        let u = [
            InputUncertainty::type_a(1.0, 5.0).unwrap(),
            InputUncertainty::type_b(1.0).unwrap(),
        ];
        let m = [1.0, 0.5, 0.5, 1.0];
        let c = Correlation::new(&m).unwrap();
        let e = propagate(&[1.0, 1.0], &u, Some(&c), Coverage::default(), None);
        assert_eq!(e.unwrap_err().code(), "UNSUPPORTED");
        let r = propagate(&[1.0, 1.0], &u, Some(&c), Coverage::Factor(2.0), None).unwrap();
        assert_eq!(r.effective_degrees_of_freedom, None);
        assert_eq!(r.coverage_probability, None);
        assert!((r.expanded_uncertainty - 2.0 * 3f64.sqrt()).abs() < 1e-14);
    }
}
