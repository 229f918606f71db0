//! Multi-wavelength pyrometry: the temperature *and* the coefficients of an emissivity model
//! fitted together to N ≥ 2 channel signals by weighted least squares with the full Planck law,
//! with the covariance of the estimates and figures that show when the fit is ill-conditioned.
//!
//! # Method
//! The method is the least-squares form of multi-wavelength pyrometry analysed by Coates (1981)
//! and reviewed by Araújo (2017): each channel i (effective wavelength λᵢ, signal Sᵢ with
//! standard uncertainty uᵢ) is modelled as
//!
//! ```text
//! Sᵢ = ε(λᵢ; a) · Bᵢ(T)
//! ```
//!
//! where Bᵢ(T) is the channel's blackbody signal (Planck's law at one wavelength, or any
//! [`SignalModel`] such as a response-weighted band) and ε is one of two emissivity models of
//! order m ≤ [`MAX_EMISSIVITY_ORDER`] in the reduced wavelength
//! u = (λ − λ_c)/h, λ_c = (λ_min + λ_max)/2, h = (λ_max − λ_min)/2 (so u ∈ [−1, 1] on the
//! channels and the coefficients are dimensionless and comparable):
//!
//! ```text
//! Polynomial     ε(λ)    = a₀ + a₁u + … + a_m u^m
//! LogPolynomial  ln ε(λ) = a₀ + a₁u + … + a_m u^m      (m = 1: the log-linear model ln ε = a + bλ)
//! ```
//!
//! The p = m + 2 unknowns θ = (T, a₀ … a_m) minimise χ² = Σᵢ ((Sᵢ − ε(λᵢ)Bᵢ(T))/uᵢ)². Steps:
//!
//! 1. **Start (Wien-linearised).** With the brightness temperatures Tᵢ of the channels (which
//!    are also reported), Wien's approximation gives c₂/(λᵢTᵢ) = c₂/(λᵢT) − ln ε(λᵢ), which is
//!    linear in (1/T, ln-ε coefficients); it is solved by weighted linear least squares with
//!    weights Sᵢ/uᵢ (under Wien, δ(c₂/λTᵢ) = δSᵢ/Sᵢ). That temperature is then refined along
//!    the bottom of the χ² valley: the profile χ²(T), with the emissivity coefficients solved
//!    linearly at each T with the full Planck law (exactly for the polynomial model, through
//!    ln(Sᵢ/Bᵢ) for the log-polynomial one), is minimised by Brent's method in ln T. The valley
//!    of T against the emissivity slope is long and curved; without this step
//!    Levenberg–Marquardt crawls along it (19–60 iterations instead of 3–5 at order 2–3).
//!    Every local minimum of the profile on a 61-point grid over [T/2, 2T] (at most 6) is
//!    refined and the lowest taken: data can admit several (`local_minima` reports how many).
//! 2. **Levenberg–Marquardt** on all p unknowns (T scaled by its start value), with Marquardt's
//!    column scaling D = max over iterations of the Jacobian's column norms and Nielsen's update
//!    of the damping. Each linearised problem is solved by Givens QR of the weighted Jacobian
//!    accumulated one channel at a time (so any N fits in fixed-size p × p storage and the
//!    normal equations are never squared). It stops when the undamped Gauss–Newton step is
//!    below 1e-14 of the parameters (scaled norm ‖D∘δ‖/‖D∘φ‖). Near the minimum, where the
//!    predicted reduction is below 1e-10·χ² and comparisons of χ² are no longer reliable, the
//!    Gauss–Newton step is taken untested, and the iteration ends when those steps stop
//!    shrinking (the rounding floor of the data and channel models).
//! 3. **Uncertainty and conditioning.** At the solution, with R the triangular factor of the
//!    weighted Jacobian J: covariance C = (JᵀJ)⁻¹ = R⁻¹R⁻ᵀ, i.e. propagated from the channel
//!    uncertainties uᵢ (not rescaled by χ²/ν; χ² and ν are reported so the caller can); the
//!    condition number of J after scaling every column to unit norm (one-sided Jacobi SVD of
//!    R); the correlation between T and the slope coefficient a₁; and the uncertainty
//!    inflation u(T)/u(T | emissivity known) = √(C_TT·(JᵀJ)_TT) — how much the emissivity
//!    freedom costs. The fit is flagged `ill_conditioned` when the condition number or |corr|
//!    exceeds the thresholds of [`MultiwavelengthOptions`]; a scaled condition number above
//!    1e13 (nothing meaningful left in f64) is an error, `DEGENERATE_FIT`.
//!
//! For comparison the same data also give the brightness temperature of every channel and the
//! grey (ε₁ = ε_N) two-colour temperature of the shortest and longest channels.
//!
//! # What the figures mean
//! With m + 1 emissivity coefficients the temperature is found only from the curvature of the
//! signals across the channels that the emissivity model cannot mimic; over a short span of
//! wavelengths, 1/λ is nearly linear in λ and the correlation between T and the slope a₁ is
//! close to ±1. A wrong emissivity model biases T however small u(T) is (Coates 1981): the
//! covariance describes noise, not model error. For band channels the emissivity is taken as
//! constant within each band, at the channel's effective wavelength.
//!
//! # References
//! - P. B. Coates, "Multi-wavelength pyrometry", Metrologia 17, 103–109 (1981),
//!   doi:10.1088/0026-1394/17/3/006 (from memory).
//! - M. A. Araújo, "Multi-spectral pyrometry — a review", Meas. Sci. Technol. 28, 082002
//!   (2017), doi:10.1088/1361-6501/aa7b4b (from memory).
//! - T. Duvaut, "Comparison between multiwavelength infrared and visible pyrometry: application
//!   to metals", Infrared Phys. Technol. 51, 292–299 (2008) (from memory).
//! - D. W. Marquardt, "An algorithm for least-squares estimation of nonlinear parameters",
//!   J. SIAM 11, 431–441 (1963), doi:10.1137/0111030.
//! - J. J. Moré, "The Levenberg–Marquardt algorithm: implementation and theory", in
//!   G. A. Watson (ed.), Numerical Analysis, Springer LNM 630, 105–116 (1978) (scaling of the
//!   damping).
//! - H. B. Nielsen, "Damping parameter in Marquardt's method", report IMM-REP-1999-05,
//!   Technical University of Denmark (1999) (from memory).
//! - R. P. Brent, *Algorithms for Minimization without Derivatives*, Prentice-Hall (1973),
//!   ch. 5 (from memory).
//! - G. H. Golub, C. F. Van Loan, *Matrix Computations*, 4th ed. (2013), §5.1.8 (Givens
//!   updating of a QR factorisation), §8.6.3 (one-sided Jacobi SVD) (from memory).
#![forbid(unsafe_code)]
#![allow(clippy::neg_cmp_op_on_partial_ord)]
// Fixed-size matrix code indexes rows and columns of the same small arrays.
#![allow(clippy::needless_range_loop)]

use super::model::{SignalModel, SpectralPoint};
use super::ratio::{ratio_temperature, two_colour_temperature};
use crate::constants::C2Convention;
use crate::error::{positive, spectral};
use crate::float;
use crate::{Error, Result};

/// Highest order m of the emissivity models (m + 1 coefficients).
pub const MAX_EMISSIVITY_ORDER: usize = 4;
/// Largest number of fitted parameters: T and m + 1 ≤ 5 emissivity coefficients.
pub const MAX_PARAMETERS: usize = MAX_EMISSIVITY_ORDER + 2;
const P: usize = MAX_PARAMETERS;
/// Scaled condition number above which the fit is refused as numerically singular.
const SINGULAR_CONDITION: f64 = 1e13;
const MAX_ITERATIONS: u32 = 200;

/// The emissivity model of a multi-wavelength fit, in the reduced wavelength
/// u = (λ − λ_c)/h of the channels (see the module docs).
///
/// # Formula
/// ```text
/// Polynomial { order: m }:     ε(λ)    = Σ_{k=0..m} a_k u^k
/// LogPolynomial { order: m }:  ln ε(λ) = Σ_{k=0..m} a_k u^k
/// u = (λ − λ_c)/h,  λ_c = (λ_min + λ_max)/2,  h = (λ_max − λ_min)/2
/// ```
/// Order 0 of either is the grey body; `LogPolynomial { order: 1 }` is the log-linear model
/// ln ε = a + bλ (with b = a₁/h per metre).
///
/// # Errors
/// None here; a fit reports `UNSUPPORTED` for an order above [`MAX_EMISSIVITY_ORDER`].
///
/// # Accuracy
/// Exact (a label).
///
/// # Examples
/// ```
/// use quantaband::thermometry::multiwavelength::EmissivityModel;
/// assert_eq!(EmissivityModel::LOG_LINEAR.parameter_count(), 3); // T, a₀, a₁
/// ```
///
/// # References
/// P. B. Coates, Metrologia 17, 103–109 (1981) (from memory).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(tag = "kind", rename_all = "camelCase", deny_unknown_fields)
)]
pub enum EmissivityModel {
    /// ε = a₀ + a₁u + … + a_m u^m.
    Polynomial {
        /// Order m (0 … 4).
        order: u8,
    },
    /// ln ε = a₀ + a₁u + … + a_m u^m (ε > 0 always).
    LogPolynomial {
        /// Order m (0 … 4).
        order: u8,
    },
}

impl EmissivityModel {
    /// Constant (grey) emissivity, `Polynomial { order: 0 }`.
    pub const GREY: EmissivityModel = EmissivityModel::Polynomial { order: 0 };
    /// Log-linear emissivity ln ε = a + bλ, `LogPolynomial { order: 1 }`.
    pub const LOG_LINEAR: EmissivityModel = EmissivityModel::LogPolynomial { order: 1 };
    /// Linear emissivity ε = a + bλ, `Polynomial { order: 1 }`.
    pub const LINEAR: EmissivityModel = EmissivityModel::Polynomial { order: 1 };

    /// The order m.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::multiwavelength::EmissivityModel;
    /// assert_eq!(EmissivityModel::LINEAR.order(), 1);
    /// ```
    pub const fn order(self) -> usize {
        match self {
            EmissivityModel::Polynomial { order } | EmissivityModel::LogPolynomial { order } => {
                order as usize
            }
        }
    }

    /// Number of fitted parameters p = m + 2 (T and m + 1 coefficients).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::multiwavelength::EmissivityModel;
    /// assert_eq!(EmissivityModel::GREY.parameter_count(), 2);
    /// ```
    pub const fn parameter_count(self) -> usize {
        self.order() + 2
    }

    /// ε and ∂ε/∂a_k at reduced wavelength u for coefficients `a` (first m + 1 used).
    fn evaluate(self, a: &[f64; MAX_EMISSIVITY_ORDER + 1], u: f64) -> (f64, [f64; P - 1]) {
        let m = self.order();
        let mut pw = [0.0; P - 1];
        let mut x = 1.0;
        let mut sum = 0.0;
        for k in 0..=m {
            pw[k] = x;
            sum += a[k] * x;
            x *= u;
        }
        match self {
            EmissivityModel::Polynomial { .. } => (sum, pw),
            EmissivityModel::LogPolynomial { .. } => {
                let e = float::exp(sum);
                for v in pw.iter_mut().take(m + 1) {
                    *v *= e;
                }
                (e, pw)
            }
        }
    }
}

/// Settings of a multi-wavelength fit: the emissivity model and the thresholds above which
/// the result is flagged as ill-conditioned.
///
/// # Formula
/// ```text
/// ill_conditioned = condition_number > max_condition_number
///                   or |corr(T, a₁)| > max_abs_correlation
///                   or the profile χ²(T) has several local minima
/// ```
///
/// # Errors
/// A fit reports `NON_POSITIVE` / `NON_FINITE` for a threshold ≤ 0 or NaN, and `OUT_OF_RANGE`
/// for `max_abs_correlation` > 1.
///
/// # Accuracy
/// Exact (settings).
///
/// # Examples
/// ```
/// use quantaband::thermometry::multiwavelength::{EmissivityModel, MultiwavelengthOptions};
/// let o = MultiwavelengthOptions { model: EmissivityModel::LOG_LINEAR, ..Default::default() };
/// assert_eq!(o.max_condition_number, 1e3);
/// ```
///
/// # References
/// The default thresholds are common practice, no source: a scaled condition number of 1e3
/// means a relative perturbation of the data may be amplified a thousandfold in the
/// parameters; |corr| = 0.999 inflates a variance about 500-fold compared with the other
/// parameter known.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MultiwavelengthOptions {
    /// The emissivity model (default: grey).
    pub model: EmissivityModel,
    /// Flag the fit when the scaled condition number exceeds this (default 1e3).
    pub max_condition_number: f64,
    /// Flag the fit when |corr(T, a₁)| exceeds this (default 0.999).
    pub max_abs_correlation: f64,
}

impl Default for MultiwavelengthOptions {
    fn default() -> Self {
        MultiwavelengthOptions {
            model: EmissivityModel::GREY,
            max_condition_number: 1e3,
            max_abs_correlation: 0.999,
        }
    }
}

/// Result of a multi-wavelength fit: temperature (K), emissivity coefficients
/// (dimensionless, in the reduced wavelength u), their covariance, the conditioning figures,
/// and the grey two-colour reading for comparison. Parameters are indexed 0 = T,
/// 1 + k = a_k.
///
/// # Examples
/// ```
/// use quantaband::thermometry::multiwavelength::{multiwavelength_fit, MultiwavelengthOptions};
/// use quantaband::planck::spectral_radiance_wavelength;
/// // An invented grey (ε = 0.4) strip at 1500 K seen at three wavelengths.
/// let wl = [0.8e-6, 0.9e-6, 1.0e-6];
/// let l: Vec<f64> = wl.iter().map(|&w| 0.4 * spectral_radiance_wavelength(w, 1500.0).unwrap()).collect();
/// let u: Vec<f64> = l.iter().map(|v| 1e-3 * v).collect();
/// let mut tb = [0.0; 3];
/// let fit = multiwavelength_fit(&wl, &l, &u, Default::default(), &MultiwavelengthOptions::default(), &mut tb).unwrap();
/// assert!((fit.temperature_k - 1500.0).abs() < 1e-8);
/// assert!((fit.coefficients[0] - 0.4).abs() < 1e-12);
/// assert!((fit.grey_two_colour_temperature_k.unwrap() - 1500.0).abs() < 1e-8);
/// assert!(tb.iter().all(|&t| t < 1500.0)); // brightness readings are low
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MultiwavelengthFit {
    /// Fitted temperature, K.
    pub temperature_k: f64,
    /// Standard uncertainty of the temperature propagated from the channel uncertainties, K.
    pub u_temperature_k: f64,
    /// The emissivity model fitted.
    pub model: EmissivityModel,
    /// Emissivity coefficients a₀ … a_m (dimensionless; unused entries are 0).
    pub coefficients: [f64; MAX_EMISSIVITY_ORDER + 1],
    /// Covariance of (T, a₀ … a_m) (K², K, 1); rows/columns beyond p are 0.
    pub covariance: [[f64; MAX_PARAMETERS]; MAX_PARAMETERS],
    /// λ_c of the reduced wavelength, m.
    pub centre_wavelength_m: f64,
    /// h of the reduced wavelength, m.
    pub half_span_m: f64,
    /// 2-norm condition number of the weighted Jacobian with unit-norm columns.
    pub condition_number: f64,
    /// Correlation coefficient between T and the slope coefficient a₁ (`None` for order 0).
    pub correlation_temperature_slope: Option<f64>,
    /// u(T) divided by what it would be with the emissivity known: √(C_TT·(JᵀJ)_TT) ≥ 1.
    pub uncertainty_inflation: f64,
    /// Number of local minima of the profile χ²(T) seen on the start grid (61 temperatures
    /// over a factor 4 around the Wien start). More than one means the data admit several
    /// distinct temperatures; the fit returns the lowest χ² found.
    pub local_minima: u32,
    /// True when the condition number or |corr(T, a₁)| exceeds the options' thresholds, or
    /// the profile χ²(T) has more than one local minimum.
    pub ill_conditioned: bool,
    /// True when the fitted emissivity lies in (0, 1 + 1e-9] at every channel.
    pub emissivity_physical: bool,
    /// χ² = Σ ((Sᵢ − ε(λᵢ)Bᵢ(T))/uᵢ)² at the solution.
    pub chi_squared: f64,
    /// Degrees of freedom ν = N − p.
    pub degrees_of_freedom: usize,
    /// Levenberg–Marquardt iterations used.
    pub iterations: u32,
    /// The Wien-linearised starting temperature, K.
    pub start_temperature_k: f64,
    /// Grey two-colour temperature (ε equal at the shortest and longest channel), K; `None`
    /// when that ratio has no solution.
    pub grey_two_colour_temperature_k: Option<f64>,
}

impl MultiwavelengthFit {
    /// Number of fitted parameters p = m + 2.
    ///
    /// # Examples
    /// See [`MultiwavelengthFit`].
    pub fn parameter_count(&self) -> usize {
        self.model.parameter_count()
    }

    /// Fitted emissivity at `wavelength_m` (m), dimensionless (extrapolation outside the
    /// channels is the caller's responsibility).
    ///
    /// # Formula
    /// ```text
    /// ε(λ) of the model at u = (λ − λ_c)/h
    /// ```
    ///
    /// # Errors
    /// `NON_FINITE` / `NON_POSITIVE_SPECTRAL` for a bad wavelength.
    ///
    /// # Accuracy
    /// A few ulp of the coefficients' evaluation.
    ///
    /// # Examples
    /// See [`MultiwavelengthFit`]; for a grey fit `emissivity(λ)` is `coefficients[0]`.
    ///
    /// # References
    /// See the module docs.
    pub fn emissivity(&self, wavelength_m: f64) -> Result<f64> {
        spectral("wavelength_m", wavelength_m)?;
        let u = (wavelength_m - self.centre_wavelength_m) / self.half_span_m;
        Ok(self.model.evaluate(&self.coefficients, u).0)
    }

    /// Slope of the model at λ_c in per-metre units: dε/dλ (polynomial) or d ln ε/dλ
    /// (log-polynomial), m⁻¹; `None` for order 0.
    ///
    /// # Formula
    /// ```text
    /// a₁ / h
    /// ```
    ///
    /// # Examples
    /// See the tests; for order 0 this is `None`.
    pub fn slope_per_m(&self) -> Option<f64> {
        (self.model.order() >= 1).then(|| self.coefficients[1] / self.half_span_m)
    }

    /// Standard uncertainty of parameter `index` (0 = T in K, 1 + k = a_k), `None` beyond p.
    ///
    /// # Formula
    /// ```text
    /// √C_ii
    /// ```
    ///
    /// # Examples
    /// See the tests.
    pub fn standard_uncertainty(&self, index: usize) -> Option<f64> {
        (index < self.parameter_count()).then(|| float::sqrt(self.covariance[index][index]))
    }

    /// Correlation coefficient of parameters `i` and `j`, `None` beyond p.
    ///
    /// # Formula
    /// ```text
    /// C_ij / √(C_ii C_jj)
    /// ```
    ///
    /// # Examples
    /// See the tests.
    pub fn correlation(&self, i: usize, j: usize) -> Option<f64> {
        let p = self.parameter_count();
        (i < p && j < p).then(|| {
            self.covariance[i][j] / float::sqrt(self.covariance[i][i] * self.covariance[j][j])
        })
    }
}

/// Temperature and emissivity model from N spectral radiances (W·m⁻³·sr⁻¹ at `wavelengths_m`,
/// m, strictly increasing) with standard uncertainties `uncertainties` (same unit) by weighted
/// least squares with Planck's law (c₂ per `c2`); the brightness temperature of every channel
/// (K) is written to `brightness_k`.
///
/// # Formula
/// ```text
/// minimise Σᵢ ((Lᵢ − ε(λᵢ; a)·L_λ(λᵢ, T))/uᵢ)²,  L_λ = c1L/(λ⁵(exp(c2/(λT)) − 1))
/// ```
/// (method, start and figures: module docs).
///
/// # Errors
/// `LENGTH_MISMATCH` (slices of unequal length), `TOO_FEW_POINTS` (N < p = order + 2: fewer
/// channels than unknowns), `UNSUPPORTED` (order > 4), `NON_FINITE` / `NON_POSITIVE_SPECTRAL`
/// (wavelengths), `NOT_INCREASING` (wavelengths), `NON_POSITIVE` (a radiance, an uncertainty,
/// a threshold), `OUT_OF_RANGE` (`max_abs_correlation` > 1), `DEGENERATE_FIT` (the start or the
/// solution is numerically singular: scaled condition number > 1e13), `NOT_CONVERGED` (the
/// iteration stalls on nearly singular data, e.g. four channels 0.1 nm apart at 1 µm with a
/// quadratic model: `tests/js/quantum.test.mjs`), `NO_SOLUTION` (a signal underflows at the
/// start temperature).
///
/// # Accuracy
/// Against the weighted least-squares solution found independently by mpmath (Newton's
/// method on the stationarity conditions at 40 digits, verified minimum;
/// `tests/quantum_reference.rs`, 11 spectral fits of orders 0–4 and scaled condition numbers up
/// to 5.2e3): temperature ≤ 1.6e-14 relative, coefficients ≤ 3.8e-12 of their standard
/// uncertainty, covariance ≤ 1.6e-12 of √(C_ii C_jj), condition number and uncertainty
/// inflation ≤ 7.7e-13 relative, corr(T, a₁) ≤ 6.7e-16 absolute, brightness and two-colour
/// temperatures ≤ 4e-16. Noise-free data of the fitted form are recovered to ≈ 1e-13 × the
/// inflation factor (`tests/quantum_limits.rs`). When the data admit several minima the one
/// with the lowest χ² on the start grid is returned (`local_minima` counts them).
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_radiance_wavelength;
/// use quantaband::thermometry::multiwavelength::{multiwavelength_fit, EmissivityModel, MultiwavelengthOptions};
/// // An invented oxidising steel strip: ln ε = −0.6 − 0.3·u over 0.7–1.2 µm, 1400 K, 5 channels.
/// let wl = [0.7e-6, 0.825e-6, 0.95e-6, 1.075e-6, 1.2e-6];
/// let mut l = [0.0; 5];
/// for i in 0..5 {
///     let u = (wl[i] - 0.95e-6) / 0.25e-6;
///     l[i] = f64::exp(-0.6 - 0.3 * u) * spectral_radiance_wavelength(wl[i], 1400.0).unwrap();
/// }
/// let u = l.map(|v| 0.005 * v);
/// let opts = MultiwavelengthOptions { model: EmissivityModel::LOG_LINEAR, ..Default::default() };
/// let mut tb = [0.0; 5];
/// let fit = multiwavelength_fit(&wl, &l, &u, Default::default(), &opts, &mut tb).unwrap();
/// assert!((fit.temperature_k - 1400.0).abs() < 1e-6);
/// assert!((fit.coefficients[1] + 0.3).abs() < 1e-9);
/// assert!(fit.emissivity_physical && !fit.ill_conditioned);
/// // A slope costs precision: T and a₁ are strongly correlated.
/// assert!(fit.correlation_temperature_slope.unwrap().abs() > 0.9);
/// assert!(fit.uncertainty_inflation > 5.0);
/// ```
///
/// # References
/// See the module docs (Coates 1981; Araújo 2017; Marquardt 1963).
pub fn multiwavelength_fit(
    wavelengths_m: &[f64],
    radiances: &[f64],
    uncertainties: &[f64],
    c2: C2Convention,
    options: &MultiwavelengthOptions,
    brightness_k: &mut [f64],
) -> Result<MultiwavelengthFit> {
    let data = Data::new(
        wavelengths_m,
        radiances,
        uncertainties,
        options,
        brightness_k,
    )?;
    let n = wavelengths_m.len();
    // Channel models are rebuilt on the fly: SpectralPoint is a validated copy of λ and c2.
    let eval = |i: usize, t: f64| -> Result<(f64, f64)> {
        SpectralPoint::new(wavelengths_m[i], c2)?.signal_and_derivative(t)
    };
    let bright = |i: usize, s: f64| -> Result<f64> {
        SpectralPoint::new(wavelengths_m[i], c2)?.temperature(s)
    };
    let two_colour = || -> Result<f64> {
        two_colour_temperature(
            wavelengths_m[0],
            wavelengths_m[n - 1],
            radiances[0] / radiances[n - 1],
            1.0,
            c2,
        )
        .map(|r| r.temperature_k)
    };
    data.fit(&eval, &bright, &two_colour, c2.c2(), brightness_k)
}

/// Temperature and emissivity model from N instrument channel signals: channel i is any
/// [`SignalModel`] `channels[i]` (a band, a response-weighted signal, a calibration curve)
/// with the emissivity taken at its effective wavelength `wavelengths_m[i]` (m, strictly
/// increasing); `signals` and `uncertainties` in the models' signal unit; brightness
/// temperatures (K) of the channels go to `brightness_k`.
///
/// # Formula
/// ```text
/// minimise Σᵢ ((Sᵢ − ε(λᵢ; a)·Bᵢ(T))/uᵢ)²,  Bᵢ = channels[i].signal(T)
/// ```
/// The Wien start uses c₂ = hc/k (CODATA 2018); the fit itself uses the channel models only.
///
/// # Errors
/// As [`multiwavelength_fit`]; errors of the channel models are passed on.
///
/// # Accuracy
/// As [`multiwavelength_fit`], plus the accuracy of the channel models (a rectangular-band
/// fit against mpmath quadrature of Planck's law is among the reference cases; same bounds).
///
/// # Examples
/// ```
/// use quantaband::thermometry::multiwavelength::{multiwavelength_fit_channels, MultiwavelengthOptions};
/// use quantaband::thermometry::{RectangularBand, SignalModel};
/// // Three invented 20 nm bands on a grey (ε = 0.7) target at 1200 K.
/// let centres = [0.8e-6, 0.95e-6, 1.1e-6];
/// let bands = centres.map(|c| RectangularBand::new(c - 10e-9, c + 10e-9, Default::default()).unwrap());
/// let s: Vec<f64> = bands.iter().map(|b| 0.7 * b.signal(1200.0).unwrap()).collect();
/// let u: Vec<f64> = s.iter().map(|v| 1e-3 * v).collect();
/// let mut tb = [0.0; 3];
/// let fit = multiwavelength_fit_channels(&bands, &centres, &s, &u, &MultiwavelengthOptions::default(), &mut tb).unwrap();
/// assert!((fit.temperature_k - 1200.0).abs() < 1e-7);
/// assert!((fit.coefficients[0] - 0.7).abs() < 1e-10);
/// ```
///
/// # References
/// See the module docs.
pub fn multiwavelength_fit_channels<M: SignalModel>(
    channels: &[M],
    wavelengths_m: &[f64],
    signals: &[f64],
    uncertainties: &[f64],
    options: &MultiwavelengthOptions,
    brightness_k: &mut [f64],
) -> Result<MultiwavelengthFit> {
    if channels.len() != wavelengths_m.len() {
        return Err(Error::LengthMismatch {
            expected: wavelengths_m.len(),
            got: channels.len(),
        });
    }
    let data = Data::new(wavelengths_m, signals, uncertainties, options, brightness_k)?;
    let n = channels.len();
    let eval = |i: usize, t: f64| channels[i].signal_and_derivative(t);
    let bright = |i: usize, s: f64| channels[i].temperature(s);
    let two_colour = || -> Result<f64> {
        let guess = channels[0].temperature(signals[0])?;
        let (a, b): (&dyn SignalModel, &dyn SignalModel) = (&channels[0], &channels[n - 1]);
        ratio_temperature(a, b, signals[0] / signals[n - 1], 1.0, guess).map(|r| r.temperature_k)
    };
    data.fit(
        &eval,
        &bright,
        &two_colour,
        crate::constants::C2,
        brightness_k,
    )
}

/// Validated inputs of a fit.
struct Data<'a> {
    wl: &'a [f64],
    s: &'a [f64],
    u: &'a [f64],
    model: EmissivityModel,
    order: usize,
    p: usize,
    centre: f64,
    half: f64,
    max_cond: f64,
    max_corr: f64,
}

/// Upper-triangular factor R and Qᵀr of a least-squares problem, accumulated row by row with
/// Givens rotations; also the squared column norms of the rows added.
#[derive(Clone, Copy)]
struct Tri {
    r: [[f64; P]; P],
    z: [f64; P],
    colsq: [f64; P],
    p: usize,
}

/// One evaluation of the fit at a parameter vector.
#[derive(Clone, Copy)]
struct Eval {
    chi2: f64,
    tri: Tri,
}

/// √(x² + y²) without overflow or underflow of the squares.
fn hypot(x: f64, y: f64) -> f64 {
    let (a, b) = (float::abs(x), float::abs(y));
    let m = a.max(b);
    if m == 0.0 || !m.is_finite() {
        return m;
    }
    let (a, b) = (a / m, b / m);
    m * float::sqrt(a * a + b * b)
}

impl Tri {
    fn new(p: usize) -> Tri {
        Tri {
            r: [[0.0; P]; P],
            z: [0.0; P],
            colsq: [0.0; P],
            p,
        }
    }

    /// Adds the row `a`·x ≈ `b`.
    fn add_row(&mut self, mut a: [f64; P], mut b: f64) {
        for k in 0..self.p.min(P) {
            self.colsq[k] += a[k] * a[k];
        }
        for k in 0..self.p.min(P) {
            if a[k] == 0.0 {
                continue;
            }
            let rho = hypot(self.r[k][k], a[k]);
            let (c, s) = (self.r[k][k] / rho, a[k] / rho);
            for j in k..self.p.min(P) {
                let (rk, aj) = (self.r[k][j], a[j]);
                self.r[k][j] = c * rk + s * aj;
                a[j] = -s * rk + c * aj;
            }
            let zk = self.z[k];
            self.z[k] = c * zk + s * b;
            b = -s * zk + c * b;
        }
    }

    /// Solves R x = z by back substitution; `None` if a pivot is zero or the result is not
    /// finite.
    fn solve(&self) -> Option<[f64; P]> {
        let mut x = [0.0; P];
        for k in (0..self.p.min(P)).rev() {
            let mut acc = self.z[k];
            for j in (k + 1)..self.p.min(P) {
                acc -= self.r[k][j] * x[j];
            }
            if self.r[k][k] == 0.0 {
                return None;
            }
            x[k] = acc / self.r[k][k];
            if !x[k].is_finite() {
                return None;
            }
        }
        Some(x)
    }

    /// The Levenberg–Marquardt step for damping `lambda` and scaling `d`: the least-squares
    /// solution of [J; √λ·D] x ≈ [r; 0].
    fn lm_step(&self, lambda: f64, d: &[f64; P]) -> Option<[f64; P]> {
        let mut t = *self;
        let sl = float::sqrt(lambda);
        for k in 0..self.p.min(P) {
            let mut row = [0.0; P];
            row[k] = sl * d[k];
            if row[k] > 0.0 {
                // Only the factor matters here, not the column norms.
                t.add_row(row, 0.0);
            }
        }
        t.solve()
    }

    /// Scaled condition number of J (columns of unit norm) and the covariance (JᵀJ)⁻¹, or
    /// `None` if R is singular.
    fn condition_and_covariance(&self) -> Option<(f64, [[f64; P]; P])> {
        let p = self.p.min(P);
        // One-sided Jacobi SVD of R·diag(1/‖J_k‖).
        let mut a = [[0.0; P]; P];
        for j in 0..p {
            let cn = float::sqrt(self.colsq[j]);
            if !(cn > 0.0) {
                return None;
            }
            for i in 0..p {
                a[i][j] = self.r[i][j] / cn;
            }
        }
        for _sweep in 0..60 {
            let mut rotated = false;
            for i in 0..p {
                for j in (i + 1)..p {
                    let (mut al, mut be, mut ga) = (0.0, 0.0, 0.0);
                    for k in 0..p {
                        al += a[k][i] * a[k][i];
                        be += a[k][j] * a[k][j];
                        ga += a[k][i] * a[k][j];
                    }
                    if float::abs(ga) <= 1e-16 * float::sqrt(al * be) || ga == 0.0 {
                        continue;
                    }
                    rotated = true;
                    let zeta = (be - al) / (2.0 * ga);
                    let t = zeta.signum() / (float::abs(zeta) + float::sqrt(1.0 + zeta * zeta));
                    let c = 1.0 / float::sqrt(1.0 + t * t);
                    let s = c * t;
                    for k in 0..p {
                        let (x, y) = (a[k][i], a[k][j]);
                        a[k][i] = c * x - s * y;
                        a[k][j] = s * x + c * y;
                    }
                }
            }
            if !rotated {
                break;
            }
        }
        let (mut smax, mut smin) = (0.0f64, f64::INFINITY);
        for j in 0..p {
            let mut s = 0.0;
            for k in 0..p {
                s += a[k][j] * a[k][j];
            }
            let s = float::sqrt(s);
            smax = smax.max(s);
            smin = smin.min(s);
        }
        if !(smin > 0.0) {
            return None;
        }
        let cond = smax / smin;
        // R⁻¹ (upper triangular), then C = R⁻¹R⁻ᵀ.
        let mut inv = [[0.0; P]; P];
        for col in 0..p {
            for i in (0..=col).rev() {
                let mut acc = if i == col { 1.0 } else { 0.0 };
                for j in (i + 1)..=col {
                    acc -= self.r[i][j] * inv[j][col];
                }
                if self.r[i][i] == 0.0 {
                    return None;
                }
                inv[i][col] = acc / self.r[i][i];
            }
        }
        let mut cov = [[0.0; P]; P];
        for i in 0..p {
            for j in 0..p {
                let mut acc = 0.0;
                for k in i.max(j)..p {
                    acc += inv[i][k] * inv[j][k];
                }
                cov[i][j] = acc;
            }
        }
        Some((cond, cov))
    }
}

type ChannelEval<'a> = dyn Fn(usize, f64) -> Result<(f64, f64)> + 'a;
type ChannelBright<'a> = dyn Fn(usize, f64) -> Result<f64> + 'a;
type TwoColour<'a> = dyn Fn() -> Result<f64> + 'a;

impl<'a> Data<'a> {
    fn new(
        wl: &'a [f64],
        s: &'a [f64],
        u: &'a [f64],
        options: &MultiwavelengthOptions,
        brightness_k: &[f64],
    ) -> Result<Data<'a>> {
        let n = wl.len();
        for len in [s.len(), u.len(), brightness_k.len()] {
            if len != n {
                return Err(Error::LengthMismatch {
                    expected: n,
                    got: len,
                });
            }
        }
        let model = options.model;
        let order = model.order();
        if order > MAX_EMISSIVITY_ORDER {
            return Err(Error::Unsupported {
                what: "emissivity model order above 4 (MAX_EMISSIVITY_ORDER)",
            });
        }
        let p = order + 2;
        if n < p {
            return Err(Error::TooFewPoints { needed: p, got: n });
        }
        for (i, &w) in wl.iter().enumerate() {
            spectral("wavelengths_m", w)?;
            if i > 0 && !(w > wl[i - 1]) {
                return Err(Error::NotIncreasing {
                    arg: "wavelengths_m",
                    index: i,
                });
            }
        }
        for &v in s {
            positive("signals", v)?;
        }
        for &v in u {
            positive("uncertainties", v)?;
        }
        positive("max_condition_number", options.max_condition_number)?;
        positive("max_abs_correlation", options.max_abs_correlation)?;
        if options.max_abs_correlation > 1.0 {
            return Err(Error::OutOfRange {
                arg: "max_abs_correlation",
                value: options.max_abs_correlation,
                range: "(0, 1]",
            });
        }
        let centre = 0.5 * (wl[0] + wl[n - 1]);
        let half = 0.5 * (wl[n - 1] - wl[0]);
        Ok(Data {
            wl,
            s,
            u,
            model,
            order,
            p,
            centre,
            half,
            max_cond: options.max_condition_number,
            max_corr: options.max_abs_correlation,
        })
    }

    fn reduced(&self, i: usize) -> f64 {
        (self.wl[i] - self.centre) / self.half
    }

    /// χ² and the QR factor of the weighted Jacobian with respect to φ (θ = scale∘φ).
    fn evaluate(&self, eval: &ChannelEval<'_>, theta: &[f64; P], scale: &[f64; P]) -> Result<Eval> {
        let t = theta[0];
        let mut a = [0.0; MAX_EMISSIVITY_ORDER + 1];
        a[..=self.order].copy_from_slice(&theta[1..=self.order + 1]);
        let mut tri = Tri::new(self.p);
        let mut chi2 = 0.0;
        for i in 0..self.wl.len() {
            let (b, db) = eval(i, t)?;
            let (e, de) = self.model.evaluate(&a, self.reduced(i));
            let w = 1.0 / self.u[i];
            let r = (self.s[i] - e * b) * w;
            let mut row = [0.0; P];
            row[0] = e * db * w * scale[0];
            for k in 0..=self.order.min(MAX_EMISSIVITY_ORDER) {
                row[1 + k] = b * de[k] * w * scale[1 + k];
            }
            tri.add_row(row, r);
            chi2 += r * r;
        }
        if !chi2.is_finite() {
            return Err(Error::DegenerateFit {
                reason: "residuals not finite",
            });
        }
        Ok(Eval { chi2, tri })
    }

    /// Wien-linearised start temperature from the brightness temperatures.
    fn wien_start(&self, tb: &[f64], c2v: f64) -> Result<f64> {
        let t_ref = tb.iter().fold(0.0f64, |m, &t| m.max(t));
        // Unknowns φ₀ = T_ref/T and the ln-ε coefficients b_k.
        let mut tri = Tri::new(self.p);
        for i in 0..self.wl.len() {
            let w = self.s[i] / self.u[i];
            let x = c2v / self.wl[i];
            let mut row = [0.0; P];
            row[0] = w * x / t_ref;
            let u = self.reduced(i);
            let mut pw = 1.0;
            for k in 0..=self.order.min(MAX_EMISSIVITY_ORDER) {
                row[1 + k] = -w * pw;
                pw *= u;
            }
            tri.add_row(row, w * x / tb[i]);
        }
        let t0 = match tri.solve() {
            Some(phi) if phi[0] > 0.0 => t_ref / phi[0],
            _ => f64::NAN,
        };
        Ok(if t0.is_finite() && t0 > 0.0 {
            t0
        } else {
            t_ref
        })
    }

    /// Emissivity coefficients by linear least squares at a fixed temperature.
    fn coefficients_at(&self, eval: &ChannelEval<'_>, t: f64) -> Result<[f64; P]> {
        let q = self.order.min(MAX_EMISSIVITY_ORDER) + 1;
        let mut tri = Tri::new(q);
        for i in 0..self.wl.len() {
            let (b, _) = eval(i, t)?;
            if !(b > 0.0 && b.is_finite()) {
                return Err(Error::NoSolution {
                    what: "a channel's blackbody signal underflows at the start temperature",
                });
            }
            let w = 1.0 / self.u[i];
            let u = self.reduced(i);
            let (coef, rhs) = match self.model {
                EmissivityModel::Polynomial { .. } => (b * w, self.s[i] * w),
                EmissivityModel::LogPolynomial { .. } => {
                    let sw = self.s[i] * w;
                    (sw, sw * float::ln(self.s[i] / b))
                }
            };
            let mut row = [0.0; P];
            let mut pw = 1.0;
            for k in 0..q {
                row[k] = coef * pw;
                pw *= u;
            }
            tri.add_row(row, rhs);
        }
        tri.solve().ok_or(Error::DegenerateFit {
            reason: "emissivity coefficients singular at the start temperature",
        })
    }

    /// Profile χ²(T): the emissivity coefficients solved linearly at `t`, then the true χ².
    fn profile(&self, eval: &ChannelEval<'_>, t: f64) -> f64 {
        let Ok(a) = self.coefficients_at(eval, t) else {
            return f64::INFINITY;
        };
        let mut c = [0.0; MAX_EMISSIVITY_ORDER + 1];
        c[..=self.order].copy_from_slice(&a[..=self.order]);
        let mut chi2 = 0.0;
        for i in 0..self.wl.len() {
            let Ok((b, _)) = eval(i, t) else {
                return f64::INFINITY;
            };
            let e = self.model.evaluate(&c, self.reduced(i)).0;
            let r = (self.s[i] - e * b) / self.u[i];
            chi2 += r * r;
        }
        if chi2.is_finite() {
            chi2
        } else {
            f64::INFINITY
        }
    }

    /// Lowest minimum of the profile χ²(T): a grid of 61 temperatures spaced evenly in ln T over
    /// [t0/2, 2·t0]; every local minimum on the grid (up to 6, the lowest) is refined by
    /// Brent's method in x = ln T, after a downhill search when it lies at an end of the grid.
    /// Returns the temperature and the number of local minima seen on the grid; `None` if
    /// nothing finite was found.
    fn profile_minimum(&self, eval: &ChannelEval<'_>, t0: f64) -> Option<(f64, u32)> {
        const GRID: usize = 61;
        const KEEP: usize = 6;
        let f = |x: f64| self.profile(eval, float::exp(x));
        let x0 = float::ln(t0);
        let h = core::f64::consts::LN_2 / 30.0;
        let xj = |j: usize| x0 + h * (j as f64 - 30.0);
        let mut vals = [f64::INFINITY; GRID];
        for (j, v) in vals.iter_mut().enumerate() {
            *v = f(xj(j));
        }
        // Local minima (ends count when lower than their neighbour); keep the KEEP lowest.
        let mut found = [(usize::MAX, f64::INFINITY); KEEP];
        let mut minima = 0u32;
        for j in 0..GRID {
            let left = if j > 0 { vals[j - 1] } else { f64::INFINITY };
            let right = if j + 1 < GRID {
                vals[j + 1]
            } else {
                f64::INFINITY
            };
            if vals[j].is_finite() && vals[j] < left && vals[j] <= right {
                minima += 1;
                // replace the worst kept entry if this one is lower
                let mut worst = 0;
                for k in 1..KEEP {
                    if found[k].1 > found[worst].1 {
                        worst = k;
                    }
                }
                if vals[j] < found[worst].1 {
                    found[worst] = (j, vals[j]);
                }
            }
        }
        let mut best: Option<(f64, f64)> = None;
        for &(j, _) in found.iter().filter(|e| e.0 != usize::MAX) {
            let refined = if j > 0 && j + 1 < GRID {
                Some(brent(&f, xj(j - 1), xj(j), vals[j], xj(j + 1)))
            } else {
                let dir = if j == 0 { -h } else { h };
                downhill(&f, xj(j) - dir, xj(j), vals[j])
                    .map(|(a, b, fb, c)| brent(&f, a, b, fb, c))
            };
            if let Some((x, fx)) = refined {
                if best.is_none_or(|(_, fb)| fx < fb) {
                    best = Some((x, fx));
                }
            }
        }
        best.map(|(x, _)| (float::exp(x), minima))
    }

    /// Levenberg–Marquardt from `theta` (updated in place) in φ = θ/scale; returns the final
    /// evaluation and the iteration count.
    fn levenberg_marquardt(
        &self,
        eval: &ChannelEval<'_>,
        theta: &mut [f64; P],
        scale: &[f64; P],
    ) -> Result<(Eval, u32)> {
        let p = self.p.min(P); // p ≤ P: lets the compiler drop index checks
        let mut cur = self.evaluate(eval, theta, scale)?;
        let mut d = [0.0; P];
        for k in 0..p {
            d[k] = float::sqrt(cur.tri.colsq[k]);
        }
        // Scaled size ‖D∘δ‖/‖D∘φ‖ of a step δ in φ.
        let rel_size = |d: &[f64; P], theta: &[f64; P], st: &[f64; P]| {
            let (mut dx, mut dphi) = (0.0, 0.0);
            for k in 0..p {
                dx += (d[k] * st[k]) * (d[k] * st[k]);
                let phi = theta[k] / scale[k];
                dphi += (d[k] * phi) * (d[k] * phi);
            }
            float::sqrt(dx / dphi)
        };
        let mut lambda = 1e-3;
        let mut nu = 2.0;
        let mut last_floor_step = f64::INFINITY;
        for iteration in 1..=MAX_ITERATIONS {
            if cur.chi2 == 0.0 {
                return Ok((cur, iteration));
            }
            // The undamped (Gauss–Newton) step measures the distance to the minimum.
            if let Some(gn) = cur.tri.solve() {
                let size = rel_size(&d, theta, &gn);
                if size <= 1e-14 {
                    return Ok((cur, iteration));
                }
                // Its predicted reduction of χ² is ‖Q_pᵀr‖². Below 1e-10·χ² a comparison of χ²
                // values is no longer reliable (residuals are differences of nearly equal
                // numbers), but the linearisation is: take the step without the test. When
                // such steps stop shrinking, the rounding floor of the data is reached.
                let mut zp2 = 0.0;
                for k in 0..p {
                    zp2 += cur.tri.z[k] * cur.tri.z[k];
                }
                if zp2 <= 1e-10 * cur.chi2 {
                    if size >= 0.5 * last_floor_step {
                        return Ok((cur, iteration));
                    }
                    last_floor_step = size;
                    let mut th = *theta;
                    for k in 0..p {
                        th[k] += scale[k] * gn[k];
                    }
                    if th[0] > 0.0 && th[0].is_finite() {
                        if let Ok(e) = self.evaluate(eval, &th, scale) {
                            *theta = th;
                            cur = e;
                            continue;
                        }
                    }
                }
            }
            let mut accepted = false;
            while lambda <= 1e16 {
                let step = cur.tri.lm_step(lambda, &d);
                let trial = step.and_then(|st| {
                    let mut th = *theta;
                    for k in 0..p {
                        th[k] += scale[k] * st[k];
                    }
                    if !(th[0] > 0.0 && th[0].is_finite()) {
                        return None;
                    }
                    self.evaluate(eval, &th, scale)
                        .ok()
                        .filter(|e| e.chi2 < cur.chi2)
                        .map(|e| (th, e, st))
                });
                match trial {
                    Some((th, e, st)) => {
                        // Gain ratio ρ = actual / predicted reduction of χ², with
                        // predicted = ‖r‖² − ‖r − Jδ‖² = 2 (Rδ)·z − ‖Rδ‖².
                        let mut pred = 0.0;
                        for i in 0..p {
                            let mut rd = 0.0;
                            for k in i..p {
                                rd += cur.tri.r[i][k] * st[k];
                            }
                            pred += rd * (2.0 * cur.tri.z[i] - rd);
                        }
                        let rho = (cur.chi2 - e.chi2) / pred;
                        *theta = th;
                        cur = e;
                        for k in 0..p {
                            d[k] = d[k].max(float::sqrt(cur.tri.colsq[k]));
                        }
                        // Nielsen's update of the damping.
                        let q = 2.0 * rho - 1.0;
                        let f = if rho.is_finite() {
                            (1.0 - q * q * q).max(1.0 / 3.0)
                        } else {
                            1.0 / 3.0
                        };
                        lambda = (lambda * f).max(1e-20);
                        nu = 2.0;
                        accepted = true;
                        break;
                    }
                    None => {
                        lambda *= nu;
                        nu *= 2.0;
                    }
                }
            }
            if !accepted {
                // No step lowers χ² even with heavy damping: at the minimum to rounding,
                // provided the Gauss–Newton step is already small.
                let size = cur
                    .tri
                    .solve()
                    .map_or(f64::INFINITY, |gn| rel_size(&d, theta, &gn));
                if size <= 1e-8 {
                    return Ok((cur, iteration));
                }
                break;
            }
        }
        Err(Error::NotConverged {
            what: "multi-wavelength least-squares fit (Levenberg-Marquardt)",
        })
    }

    fn fit(
        &self,
        eval: &ChannelEval<'_>,
        bright: &ChannelBright<'_>,
        two_colour: &TwoColour<'_>,
        c2v: f64,
        brightness_k: &mut [f64],
    ) -> Result<MultiwavelengthFit> {
        let n = self.wl.len();
        let p = self.p.min(P); // p ≤ P: lets the compiler drop index checks
        for i in 0..n {
            brightness_k[i] = bright(i, self.s[i])?;
        }
        let t0 = self.wien_start(brightness_k, c2v)?;
        // Refine along the bottom of the χ² valley: the profile χ²(T) with the emissivity
        // coefficients solved linearly at each T (exact for the polynomial model, the
        // log-linearised solution for the log-polynomial one), minimised by Brent's method in
        // ln T. The valley of T against the emissivity slope is long and curved; starting
        // Levenberg–Marquardt near its lowest point saves it from crawling along it.
        let (t1, local_minima) = self.profile_minimum(eval, t0).unwrap_or((t0, 0));
        let a0 = self.coefficients_at(eval, t1)?;
        let mut theta = [0.0; P];
        theta[0] = t1;
        theta[1..p].copy_from_slice(&a0[..p - 1]);
        let mut scale = [1.0; P];
        scale[0] = t1;

        // Levenberg–Marquardt in φ = θ/scale.
        let (cur, iterations) = self.levenberg_marquardt(eval, &mut theta, &scale)?;

        let (cond, cov_phi) = cur
            .tri
            .condition_and_covariance()
            .filter(|(c, _)| *c <= SINGULAR_CONDITION)
            .ok_or(Error::DegenerateFit {
                reason: "temperature and emissivity coefficients cannot be separated \
                         (scaled condition number above 1e13)",
            })?;
        let mut cov = [[0.0; P]; P];
        for i in 0..p {
            for j in 0..p {
                cov[i][j] = cov_phi[i][j] * scale[i] * scale[j];
            }
        }
        let corr = (self.order >= 1).then(|| cov[0][2] / float::sqrt(cov[0][0] * cov[2][2]));
        let inflation = float::sqrt(cov_phi[0][0] * cur.tri.colsq[0]);
        let mut coefficients = [0.0; MAX_EMISSIVITY_ORDER + 1];
        coefficients[..p - 1].copy_from_slice(&theta[1..p]);
        let mut physical = true;
        for i in 0..n {
            let e = self.model.evaluate(&coefficients, self.reduced(i)).0;
            physical &= e > 0.0 && e <= 1.0 + 1e-9;
        }
        let ill = cond > self.max_cond
            || corr.is_some_and(|c| float::abs(c) > self.max_corr)
            || local_minima > 1;
        Ok(MultiwavelengthFit {
            temperature_k: theta[0],
            u_temperature_k: float::sqrt(cov[0][0]),
            model: self.model,
            coefficients,
            covariance: cov,
            centre_wavelength_m: self.centre,
            half_span_m: self.half,
            condition_number: cond,
            correlation_temperature_slope: corr,
            uncertainty_inflation: inflation,
            local_minima,
            ill_conditioned: ill,
            emissivity_physical: physical,
            chi_squared: cur.chi2,
            degrees_of_freedom: n - p,
            iterations,
            start_temperature_k: t0,
            grey_two_colour_temperature_k: two_colour().ok(),
        })
    }
}

/// Golden-ratio downhill search from a → b (f(b) ≤ f(a)) until the function rises: a bracket
/// (a, b, f(b), c) with f(b) ≤ f(a), f(c); `None` if it runs past 1e-3 K … 1e9 K.
fn downhill(f: &dyn Fn(f64) -> f64, a: f64, b: f64, fb: f64) -> Option<(f64, f64, f64, f64)> {
    const GOLD: f64 = 1.618_033_988_749_895;
    let (lo_lim, hi_lim) = (float::ln(1e-3), float::ln(1e9));
    let (mut a, mut b, mut fb) = (a, b, fb);
    let mut c = b + GOLD * (b - a);
    let mut fc = f(c);
    for _ in 0..60 {
        if !(fc < fb) {
            return Some((a, b, fb, c));
        }
        if !(c > lo_lim && c < hi_lim) {
            return None;
        }
        a = b;
        b = c;
        fb = fc;
        c = b + GOLD * (b - a);
        fc = f(c);
    }
    None
}

/// Brent's minimisation (parabolic interpolation with golden-section safeguard) of f on the
/// bracket (a, b, c) with f(b) = fb ≤ f(a), f(c); returns (x, f(x)) to 1e-9 relative in x.
fn brent(f: &dyn Fn(f64) -> f64, a: f64, b: f64, fb: f64, c: f64) -> (f64, f64) {
    const CGOLD: f64 = 0.381_966_011_250_105_1;
    let (mut lo, mut hi) = if a < c { (a, c) } else { (c, a) };
    let (mut x, mut w, mut v) = (b, b, b);
    let (mut fx, mut fw, mut fv) = (fb, fb, fb);
    let (mut d, mut e) = (0.0f64, 0.0f64);
    for _ in 0..100 {
        let xm = 0.5 * (lo + hi);
        let tol1 = 1e-9 * float::abs(x) + 1e-12;
        let tol2 = 2.0 * tol1;
        if float::abs(x - xm) <= tol2 - 0.5 * (hi - lo) {
            break;
        }
        let mut golden = true;
        if float::abs(e) > tol1 {
            let r = (x - w) * (fx - fv);
            let mut q = (x - v) * (fx - fw);
            let mut pp = (x - v) * q - (x - w) * r;
            q = 2.0 * (q - r);
            if q > 0.0 {
                pp = -pp;
            }
            q = float::abs(q);
            let etemp = e;
            e = d;
            if !(float::abs(pp) >= float::abs(0.5 * q * etemp)
                || pp <= q * (lo - x)
                || pp >= q * (hi - x))
            {
                d = pp / q;
                let u = x + d;
                if u - lo < tol2 || hi - u < tol2 {
                    d = if xm >= x { tol1 } else { -tol1 };
                }
                golden = false;
            }
        }
        if golden {
            e = if x >= xm { lo - x } else { hi - x };
            d = CGOLD * e;
        }
        let u = if float::abs(d) >= tol1 {
            x + d
        } else {
            x + if d >= 0.0 { tol1 } else { -tol1 }
        };
        let fu = f(u);
        if fu <= fx {
            if u >= x {
                lo = x;
            } else {
                hi = x;
            }
            v = w;
            fv = fw;
            w = x;
            fw = fx;
            x = u;
            fx = fu;
        } else {
            if u < x {
                lo = u;
            } else {
                hi = u;
            }
            if fu <= fw || w == x {
                v = w;
                fv = fw;
                w = u;
                fw = fu;
            } else if fu <= fv || v == x || v == w {
                v = u;
                fv = fu;
            }
        }
    }
    (x, fx)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::planck::spectral_radiance_wavelength;

    fn synth(wl: &[f64], t: f64, eps: impl Fn(f64) -> f64) -> Vec<f64> {
        wl.iter()
            .map(|&w| eps(w) * spectral_radiance_wavelength(w, t).unwrap())
            .collect()
    }

    #[test]
    fn qr_matches_normal_equations() {
        // Overdetermined 3-parameter line fit: x = (1, 2, 3) for exact data.
        let mut tri = Tri::new(3);
        for i in 0..6 {
            let x = i as f64;
            let mut row = [0.0; P];
            row[0] = 1.0;
            row[1] = x;
            row[2] = x * x;
            tri.add_row(row, 1.0 + 2.0 * x + 3.0 * x * x);
        }
        let s = tri.solve().unwrap();
        assert!((s[0] - 1.0).abs() < 1e-12 && (s[1] - 2.0).abs() < 1e-12);
        assert!((s[2] - 3.0).abs() < 1e-12);
        let (cond, cov) = tri.condition_and_covariance().unwrap();
        assert!(cond > 1.0 && cond.is_finite());
        assert!((cov[0][1] - cov[1][0]).abs() < 1e-15);
    }

    #[test]
    fn grey_two_channels_equals_two_colour() {
        let wl = [0.65e-6, 0.9e-6];
        let l = synth(&wl, 2100.0, |_| 0.3);
        let u = [l[0] * 0.01, l[1] * 0.01];
        let mut tb = [0.0; 2];
        let fit = multiwavelength_fit(
            &wl,
            &l,
            &u,
            C2Convention::Codata2018,
            &MultiwavelengthOptions::default(),
            &mut tb,
        )
        .unwrap();
        let tc = fit.grey_two_colour_temperature_k.unwrap();
        assert!((fit.temperature_k - tc).abs() < 1e-9 * tc);
        assert_eq!(fit.degrees_of_freedom, 0);
    }

    #[test]
    fn errors() {
        let wl = [0.65e-6, 0.9e-6, 1.0e-6];
        let l = synth(&wl, 2100.0, |_| 0.3);
        let u = [1.0; 3];
        let mut tb = [0.0; 3];
        let o = |m| MultiwavelengthOptions {
            model: m,
            ..Default::default()
        };
        let c = C2Convention::Codata2018;
        let e = multiwavelength_fit(
            &wl,
            &l,
            &u,
            c,
            &o(EmissivityModel::Polynomial { order: 2 }),
            &mut tb,
        );
        assert_eq!(e.unwrap_err(), Error::TooFewPoints { needed: 4, got: 3 });
        let e = multiwavelength_fit(
            &wl,
            &l,
            &u,
            c,
            &o(EmissivityModel::Polynomial { order: 5 }),
            &mut tb,
        );
        assert_eq!(e.unwrap_err().code(), "UNSUPPORTED");
        let e = multiwavelength_fit(&wl, &l[..2], &u, c, &o(EmissivityModel::GREY), &mut tb);
        assert_eq!(e.unwrap_err().code(), "LENGTH_MISMATCH");
        let wl2 = [0.65e-6, 0.65e-6, 1.0e-6];
        let e = multiwavelength_fit(&wl2, &l, &u, c, &o(EmissivityModel::GREY), &mut tb);
        assert_eq!(e.unwrap_err().code(), "NOT_INCREASING");
        let l2 = [l[0], -1.0, l[2]];
        let e = multiwavelength_fit(&wl, &l2, &u, c, &o(EmissivityModel::GREY), &mut tb);
        assert_eq!(e.unwrap_err().code(), "NON_POSITIVE");
        let u2 = [1.0, 0.0, 1.0];
        let e = multiwavelength_fit(&wl, &l, &u2, c, &o(EmissivityModel::GREY), &mut tb);
        assert_eq!(e.unwrap_err().code(), "NON_POSITIVE");
        let bad = MultiwavelengthOptions {
            max_abs_correlation: 1.5,
            ..Default::default()
        };
        let e = multiwavelength_fit(&wl, &l, &u, c, &bad, &mut tb);
        assert_eq!(e.unwrap_err().code(), "OUT_OF_RANGE");
    }
}
