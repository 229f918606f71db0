//! The [`SignalModel`] trait — an instrument's signal as a monotone function of blackbody
//! temperature — and the safeguarded inverse shared by models without a closed-form inverse.
//!
//! # Method of the shared inverse
//! The signal S(T) of every radiation thermometer rises monotonically with T, and ln S is very
//! nearly linear in u = 1/T (exactly so in the Wien limit). [`invert_monotone`] therefore runs
//! Newton's method on g(u) = ln S(1/u) − ln s in u from a starting guess, keeping the bracket
//! every evaluation establishes; a step that leaves the bracket is replaced by bisection in u
//! (both ends known) or by a factor-4 expansion (one end known). It stops when the step is below
//! 4·10⁻¹⁶ relative, and reports `NoSolution` once the bracket is pinned at 1e-3 K or 1e9 K.
#![forbid(unsafe_code)]

use crate::error::{positive, temperature};
use crate::{Error, Result};

/// Highest temperature the numerical inverse searches, K.
pub const MAX_TEMPERATURE_K: f64 = 1.0e9;
/// Lowest temperature the numerical inverse searches, K.
pub const MIN_TEMPERATURE_K: f64 = 1.0e-3;

/// An instrument signal as a strictly increasing function S(T) of blackbody temperature.
///
/// The signal is in whatever unit the model defines (a band radiance in W·m⁻²·sr⁻¹, a detector
/// reading in counts…); every part of the measurement equation uses the same unit.
/// Implemented by [`super::response::ResponseSignal`] (a spectral response times Planck's law),
/// [`SpectralPoint`] (one wavelength) and [`super::sakuma_hattori::SakumaHattori`] (a
/// calibration curve).
pub trait SignalModel {
    /// Signal S(T) of a blackbody at `temperature_k` (K).
    ///
    /// A true value above `f64::MAX` (an extreme temperature or response scale) is returned as
    /// +∞, one below the f64 range as 0; neither is an error.
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature` for a bad temperature.
    fn signal(&self, temperature_k: f64) -> Result<f64>;

    /// Temperature derivative dS/dT at `temperature_k` (signal unit per K); +∞ or 0 only where
    /// the true value is beyond the f64 range, as for [`SignalModel::signal`].
    ///
    /// # Errors
    /// As [`SignalModel::signal`].
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64>;

    /// Signal and its temperature derivative together (models override this when the two share
    /// work).
    ///
    /// # Errors
    /// As [`SignalModel::signal`].
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        Ok((
            self.signal(temperature_k)?,
            self.d_signal_dt(temperature_k)?,
        ))
    }

    /// Blackbody temperature (K) at which the model gives `signal` (the inverse of S).
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` for a bad signal; `NoSolution` when no temperature in the
    /// model's range gives it.
    fn temperature(&self, signal: f64) -> Result<f64>;
}

/// Blackbody temperature at which a monotone model gives `signal`, by safeguarded Newton
/// iteration on ln S in 1/T starting from `guess_k` (see the module docs).
///
/// # Formula
/// ```text
/// find T with S(T) = s;  Newton on g(u) = ln S(1/u) − ln s,  u = 1/T,
/// g′(u) = −T²·S′(T)/S(T);  bisection of the bracket when a step leaves it
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for a bad `signal`, `NonFinite` / `NonPositiveTemperature` for a
/// bad `guess_k`; `NoSolution` when S(T) stays below `signal` up to [`MAX_TEMPERATURE_K`] or
/// above it down to [`MIN_TEMPERATURE_K`]; `NotConverged` if 300 iterations do not meet the
/// tolerance (not observed in the tests); errors of the model are passed on.
///
/// # Accuracy
/// Stops when the Newton step is below 4·10⁻¹⁶·T; round trips S → T in the tests agree within
/// 1e-9 K.
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::{invert_monotone, SignalModel, SpectralPoint};
/// let m = SpectralPoint::new(650e-9, Default::default()).unwrap();
/// let s = m.signal(1500.0).unwrap();
/// let t = invert_monotone(&m, s, 300.0).unwrap();
/// assert!((t - 1500.0).abs() < 1e-9);
/// ```
///
/// # References
/// W. H. Press et al., *Numerical Recipes*, 3rd ed., 2007, §9.4 (Newton–Raphson with
/// bracketing).
pub fn invert_monotone<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    guess_k: f64,
) -> Result<f64> {
    invert_with(&|t| model.signal_and_derivative(t), signal, guess_k)
}

/// The body of [`invert_monotone`], with the model as a trait object so that it is compiled
/// once for every model type (it keeps the wasm module small).
fn invert_with(
    signal_and_derivative: &dyn Fn(f64) -> Result<(f64, f64)>,
    signal: f64,
    guess_k: f64,
) -> Result<f64> {
    positive("signal", signal)?;
    temperature("guess_k", guess_k)?;
    let target = crate::float::ln(signal);
    // Known bracket: S(t_lo) < s ≤ S(t_hi); `None` until a point on that side has been seen.
    let mut t_lo: Option<f64> = None;
    let mut t_hi: Option<f64> = None;
    let mut t = guess_k.clamp(MIN_TEMPERATURE_K, MAX_TEMPERATURE_K);
    for _ in 0..300 {
        let (s, ds) = signal_and_derivative(t)?;
        let mut newton = f64::NAN;
        if s > 0.0 {
            let g = crate::float::ln(s) - target;
            if g == 0.0 {
                return Ok(t);
            }
            if g > 0.0 {
                t_hi = Some(t);
            } else {
                t_lo = Some(t);
            }
            if ds > 0.0 {
                // g(u) = ln S(1/u) − ln s, g′(u) = −T²·S′/S, u = 1/T
                let gp = -t * t * ds / s;
                newton = 1.0 / (1.0 / t - g / gp);
            }
        } else {
            t_lo = Some(t);
        }
        let lo = t_lo.unwrap_or(MIN_TEMPERATURE_K);
        let hi = t_hi.unwrap_or(MAX_TEMPERATURE_K);
        if t_lo.is_some_and(|v| v >= MAX_TEMPERATURE_K) {
            return Err(Error::NoSolution {
                what: "signal above what the model gives up to 1e9 K",
            });
        }
        if t_hi.is_some_and(|v| v <= MIN_TEMPERATURE_K) {
            return Err(Error::NoSolution {
                what: "signal below what the model gives down to 1e-3 K",
            });
        }
        let next = if newton > lo && newton < hi {
            newton
        } else {
            match (t_lo, t_hi) {
                // Both sides known: bisect in u = 1/T.
                (Some(l), Some(h)) => 2.0 / (1.0 / l + 1.0 / h),
                // Only too-cold points so far: expand upwards.
                (Some(l), None) => (l * 4.0).min(MAX_TEMPERATURE_K),
                // Only too-hot points so far: expand downwards.
                (None, Some(h)) => (h * 0.25).max(MIN_TEMPERATURE_K),
                (None, None) => {
                    return Err(Error::NotConverged {
                        what: "temperature from signal",
                    })
                }
            }
        };
        if (next - t).abs() <= 4e-16 * t
            || (t_lo.is_some() && t_hi.is_some() && hi - lo <= 4e-16 * hi)
        {
            return Ok(next);
        }
        t = next;
    }
    Err(Error::NotConverged {
        what: "temperature from signal (safeguarded Newton)",
    })
}

/// Spectral radiance L_λ(λ, T) at one wavelength as a [`SignalModel`]: an ideal
/// single-wavelength (narrow-band) thermometer, signal in W·m⁻³·sr⁻¹.
///
/// # Formula
/// ```text
/// S(T) = c1L / (λ⁵·(exp(c2/(λT)) − 1))      c1L = 2hc², c2 per the chosen convention
/// T(S) = c2 / (λ·ln(1 + c1L/(λ⁵·S)))       (crate::inverse::temperature_from_spectral)
/// ```
///
/// # Errors
/// [`SpectralPoint::new`]: `NonFinite` / `NonPositiveSpectral` for a bad wavelength.
///
/// # Accuracy
/// Planck's law from the radiometric core ([`crate::planck::Spectrum`]): ≤ 1e-12 relative
/// against mpmath in `tests/thermometry_reference.rs`; the numerical inverse round-trips within
/// 1e-9 K.
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::{SignalModel, SpectralPoint};
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// // mpmath (tests/data/gen_thermometry.py): L_λ(10 µm, 300 K) = 9.924 033 330 070 695e6 W·m⁻³·sr⁻¹
/// assert!((m.signal(300.0).unwrap() / 9.924_033_330_070_695e6 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// M. Planck, *Ann. Phys.* 4, 553 (1901); constants: CODATA 2018 (Tiesinga et al., Rev. Mod.
/// Phys. 93, 025010, 2021) or ITS-90 (Preston-Thomas, Metrologia 27, 3, 1990).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectralPoint {
    wavelength_m: f64,
    c2: crate::constants::C2Convention,
}

impl SpectralPoint {
    /// A single-wavelength model at `wavelength_m` (m) with the given c2 convention.
    ///
    /// # Formula
    /// See [`SpectralPoint`].
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveSpectral` for a bad wavelength.
    ///
    /// # Accuracy
    /// Exact (stores the wavelength).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::model::SpectralPoint;
    /// assert_eq!(SpectralPoint::new(-1.0, Default::default()).unwrap_err().code(), "NON_POSITIVE_SPECTRAL");
    /// ```
    ///
    /// # References
    /// See [`SpectralPoint`].
    pub fn new(wavelength_m: f64, c2: crate::constants::C2Convention) -> Result<Self> {
        crate::error::spectral("wavelength_m", wavelength_m)?;
        Ok(SpectralPoint { wavelength_m, c2 })
    }

    /// The wavelength, m.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::model::SpectralPoint;
    /// assert_eq!(SpectralPoint::new(650e-9, Default::default()).unwrap().wavelength_m(), 650e-9);
    /// ```
    pub fn wavelength_m(&self) -> f64 {
        self.wavelength_m
    }
}

impl SignalModel for SpectralPoint {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.0)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        temperature("temperature_k", temperature_k)?;
        super::kernel::radiance_and_dt(self.wavelength_m, temperature_k, self.c2)
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        positive("signal", signal)?;
        // Closed-form brightness temperature from the radiometric core.
        let spec = crate::planck::Spectrum::BLACKBODY.with_c2(self.c2);
        crate::inverse::temperature_from_spectral(&spec, self.wavelength_m, signal)
    }
}
