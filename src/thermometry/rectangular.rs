//! An ideal rectangular band (response 1 between two wavelengths, 0 outside) as a
//! [`SignalModel`], evaluated with the radiometric core's exact band functions
//! ([`crate::band::band`], [`crate::band::band_d_dt`], [`crate::inverse::temperature_from_band`]).
//! It is the special case of [`super::response::ResponseSignal`] with a two-point table of ones;
//! `tests/thermometry_reference.rs` checks that the two agree.
#![forbid(unsafe_code)]

use super::model::SignalModel;
use crate::constants::C2Convention;
use crate::planck::Spectrum;
use crate::Result;

/// Blackbody band radiance between `lower_m` and `upper_m` (m) as a signal model, signal in
/// W·m⁻²·sr⁻¹.
///
/// # Formula
/// ```text
/// S(T) = ∫_{λ1}^{λ2} L_λ(λ, T) dλ     (the core's closed-form series, crate::band::band)
/// ```
///
/// # Errors
/// [`RectangularBand::new`]: `NonFinite` / `NonPositiveSpectral` for a limit, `InvalidBand`
/// unless λ1 < λ2. Evaluation and inverse: as [`crate::band::band`] and
/// [`crate::inverse::temperature_from_band`].
///
/// # Accuracy
/// That of the core's band functions (≤ 1e-13 relative over their reference table); agrees with
/// the response-weighted integral of a flat table to ≤ 1e-10 relative (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::SignalModel;
/// use quantaband::thermometry::rectangular::RectangularBand;
/// let b = RectangularBand::new(8e-6, 14e-6, Default::default()).unwrap();
/// // mpmath quad (tests/data/gen_thermometry.py): 54.933461376839… W·m⁻²·sr⁻¹ at 300 K
/// assert!((b.signal(300.0).unwrap() / 54.933_461_376_839_69 - 1.0).abs() < 1e-12);
/// assert!((b.temperature(b.signal(450.0).unwrap()).unwrap() - 450.0).abs() < 1e-9);
/// ```
///
/// # References
/// See [`crate::band::band`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RectangularBand {
    lower_m: f64,
    upper_m: f64,
    spectrum: Spectrum,
}

impl RectangularBand {
    /// A band from `lower_m` to `upper_m` (m) with the given c2 convention.
    ///
    /// # Formula
    /// See [`RectangularBand`].
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveSpectral` for a limit; `InvalidBand` unless lower < upper.
    ///
    /// # Accuracy
    /// Exact (stores the limits).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::rectangular::RectangularBand;
    /// assert_eq!(RectangularBand::new(14e-6, 8e-6, Default::default()).unwrap_err().code(), "INVALID_BAND");
    /// ```
    ///
    /// # References
    /// See [`crate::band::band`].
    pub fn new(lower_m: f64, upper_m: f64, c2: C2Convention) -> Result<Self> {
        crate::error::band("lower_m", lower_m, "upper_m", upper_m)?;
        Ok(RectangularBand {
            lower_m,
            upper_m,
            spectrum: Spectrum::BLACKBODY.with_c2(c2),
        })
    }

    /// The band limits (lower, upper), m.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::rectangular::RectangularBand;
    /// let b = RectangularBand::new(8e-6, 14e-6, Default::default()).unwrap();
    /// assert_eq!(b.limits_m(), (8e-6, 14e-6));
    /// ```
    pub fn limits_m(&self) -> (f64, f64) {
        (self.lower_m, self.upper_m)
    }
}

impl SignalModel for RectangularBand {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        crate::band::band(&self.spectrum, self.lower_m, self.upper_m, temperature_k)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        crate::band::band_d_dt(&self.spectrum, self.lower_m, self.upper_m, temperature_k)
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        crate::inverse::temperature_from_band(&self.spectrum, self.lower_m, self.upper_m, signal)
    }
}
