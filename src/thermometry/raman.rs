//! Raman thermometry: the temperature of a material from the ratio of its anti-Stokes and
//! Stokes Raman lines for one vibrational mode (phonon), through the Bose–Einstein occupancy
//! of that mode.
//!
//! # Physics
//! A mode of Raman shift ν̃_R (wavenumber, m⁻¹; phonon energy hcν̃_R) has the mean occupancy
//! n = 1/(exp(θ/T) − 1), θ = hcν̃_R/k = c₂ν̃_R ([`crate::stats::bose_einstein`]). Stokes
//! scattering creates a phonon (rate ∝ n + 1), anti-Stokes scattering destroys one (∝ n), so
//! the occupancy factors give n/(n + 1) = exp(−θ/T). The scattered lines lie at
//! ν̃_S = ν̃_L − ν̃_R and ν̃_aS = ν̃_L + ν̃_R (ν̃_L = 1/λ_L, the excitation); the power radiated
//! by the induced dipole goes as the fourth power of the scattered frequency, so
//!
//! ```text
//! R = I_aS / I_S = (ν̃_aS/ν̃_S)^k · n/(n + 1) = (ν̃_aS/ν̃_S)^k · exp(−c₂ν̃_R/T)
//! k = 4  energy-detecting (the intensities are powers, W: thermopile, bolometer, a detector
//!        calibrated in power)
//! k = 3  photon-counting (the intensities are photon rates: CCD, photomultiplier counts;
//!        photon rate = power/(hν), which removes one power of ν)
//! ```
//!
//! The measured ratio must first be corrected for the instrument's relative efficiency at the
//! two lines (spectrometer throughput, detector quantum efficiency, filters) and for any
//! difference in the Raman cross-section not captured by the frequency factor (resonance
//! effects); this module assumes those corrections are already applied. Absorption of the
//! two lines on the way out of the sample, laser heating and the local temperature gradient
//! are the usual limits in practice.
//!
//! # References
//! - D. A. Long, *The Raman Effect: A Unified Treatment of the Theory of Raman Scattering by
//!   Molecules*, Wiley (2002), ch. 5 (ν⁴ dependence and Stokes/anti-Stokes intensities)
//!   (from memory).
//! - T. R. Hart, R. L. Aggarwal, B. Lax, "Temperature dependence of Raman scattering in
//!   silicon", Phys. Rev. B 1, 638–642 (1970), doi:10.1103/PhysRevB.1.638 (from memory).
//! - S. N. Bose, Z. Phys. 26, 178–181 (1924) (occupancy).
#![forbid(unsafe_code)]
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use crate::constants::C2;
use crate::error::{positive, spectral, temperature};
use crate::float;
use crate::stats::bose_einstein;
use crate::{Error, Result};

/// How the Raman line intensities were measured, which sets the power k of the frequency
/// factor (ν̃_aS/ν̃_S)^k.
///
/// # Formula
/// ```text
/// Energy          k = 4   (intensities in W)
/// PhotonCounting  k = 3   (intensities in photons/s or counts)
/// ```
///
/// # Errors
/// None (a label).
///
/// # Accuracy
/// Exact.
///
/// # Examples
/// ```
/// use quantaband::thermometry::raman::RamanDetection;
/// assert_eq!(RamanDetection::PhotonCounting.exponent(), 3);
/// ```
///
/// # References
/// D. A. Long, *The Raman Effect* (2002), ch. 5 (from memory).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum RamanDetection {
    /// Energy (power) detection: frequency factor to the 4th power.
    Energy,
    /// Photon counting: frequency factor to the 3rd power (the usual CCD spectrometer).
    #[default]
    PhotonCounting,
}

impl RamanDetection {
    /// The power k of the frequency factor (4 or 3).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::raman::RamanDetection;
    /// assert_eq!(RamanDetection::Energy.exponent(), 4);
    /// ```
    pub const fn exponent(self) -> i32 {
        match self {
            RamanDetection::Energy => 4,
            RamanDetection::PhotonCounting => 3,
        }
    }
}

/// A Raman temperature with its sensitivities, returned by [`raman_temperature`].
///
/// # Examples
/// See [`raman_temperature`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct RamanReading {
    /// Temperature, K.
    pub temperature_k: f64,
    /// dT/dR, K per unit ratio (+∞ only where the true value is above `f64::MAX`).
    #[cfg_attr(feature = "serde", serde(rename = "dTdRatio"))]
    pub d_t_d_ratio: f64,
    /// (1/R)·dR/dT = θ/T², K⁻¹: the relative change of the ratio per kelvin (+∞ only where
    /// the true value is above `f64::MAX`, e.g. a mode of a shift far below 1 m⁻¹ read at a
    /// temperature below the normal f64 range).
    pub relative_sensitivity_per_k: f64,
    /// Bose–Einstein occupancy n of the mode at that temperature (dimensionless).
    pub phonon_occupancy: f64,
    /// The frequency factor (ν̃_aS/ν̃_S)^k used (dimensionless).
    pub frequency_factor: f64,
    /// θ = hcν̃_R/k, the mode's temperature scale, K.
    pub mode_temperature_k: f64,
}

/// Validates the mode and excitation and returns (θ in K, frequency factor).
fn mode(
    raman_shift_per_m: f64,
    excitation_wavelength_m: f64,
    detection: RamanDetection,
) -> Result<(f64, f64)> {
    spectral("raman_shift_per_m", raman_shift_per_m)?;
    spectral("excitation_wavelength_m", excitation_wavelength_m)?;
    let nu_l = 1.0 / excitation_wavelength_m;
    if !(raman_shift_per_m < nu_l) {
        return Err(Error::OutOfRange {
            arg: "raman_shift_per_m",
            value: raman_shift_per_m,
            range: "(0, 1/excitation_wavelength_m)",
        });
    }
    let q = if nu_l.is_finite() {
        (nu_l + raman_shift_per_m) / (nu_l - raman_shift_per_m)
    } else {
        // λ_L below 1/f64::MAX: ∞/∞; with p = ν̃_R·λ_L < 1 the same ratio is (1 + p)/(1 − p).
        let p = raman_shift_per_m * excitation_wavelength_m;
        (1.0 + p) / (1.0 - p)
    };
    Ok((C2 * raman_shift_per_m, float::powi(q, detection.exponent())))
}

/// The frequency factor (ν̃_aS/ν̃_S)^k of a Raman mode of shift `raman_shift_per_m` (m⁻¹)
/// excited at `excitation_wavelength_m` (m) (dimensionless, > 1).
///
/// # Formula
/// ```text
/// F = ((ν̃_L + ν̃_R)/(ν̃_L − ν̃_R))^k,   ν̃_L = 1/λ_L,  k = 4 (energy) or 3 (photon counting)
/// ```
///
/// # Errors
/// `NON_FINITE` / `NON_POSITIVE_SPECTRAL` for a bad shift or wavelength; `OUT_OF_RANGE` when
/// the shift is not below the excitation wavenumber (no Stokes line).
///
/// # Accuracy
/// A few ulp (two additions, a division, an integer power); checked against mpmath in
/// `tests/quantum_reference.rs`.
///
/// # Examples
/// ```
/// use quantaband::thermometry::raman::{raman_frequency_factor, RamanDetection};
/// // Silicon's 520.7 cm⁻¹ optical phonon excited at 532 nm: ((ν̃_L+ν̃_R)/(ν̃_L−ν̃_R))³
/// let f = raman_frequency_factor(52_070.0, 532e-9, RamanDetection::PhotonCounting).unwrap();
/// let nl: f64 = 1.0 / 532e-9;
/// assert!((f - ((nl + 52_070.0) / (nl - 52_070.0)).powi(3)).abs() < 1e-15);
/// ```
///
/// # References
/// See the module docs.
pub fn raman_frequency_factor(
    raman_shift_per_m: f64,
    excitation_wavelength_m: f64,
    detection: RamanDetection,
) -> Result<f64> {
    Ok(mode(raman_shift_per_m, excitation_wavelength_m, detection)?.1)
}

/// Anti-Stokes/Stokes intensity ratio (dimensionless) of a Raman mode of shift
/// `raman_shift_per_m` (m⁻¹), excited at `excitation_wavelength_m` (m), in a material at
/// `temperature_k` (K).
///
/// # Formula
/// ```text
/// R = F · n/(n + 1),   n = 1/(exp(θ/T) − 1),  θ = c₂ν̃_R = hcν̃_R/k
/// F = ((ν̃_L + ν̃_R)/(ν̃_L − ν̃_R))^k,   k = 4 (energy detection) or 3 (photon counting)
/// ```
///
/// # Errors
/// As [`raman_frequency_factor`]; `NON_FINITE` / `NON_POSITIVE_TEMPERATURE` for a bad
/// temperature.
///
/// # Accuracy
/// ≤ 5.5e-16 relative × max(1, θ/T) against mpmath's exp on 16 rows, θ/T from 7e-4 to 690
/// (`tests/quantum_reference.rs`; the rounding of θ/T is amplified by θ/T). Returns 0 only where θ/T > 745 (true value below
/// the f64 range).
///
/// # Examples
/// ```
/// use quantaband::thermometry::raman::{anti_stokes_stokes_ratio, RamanDetection};
/// // Silicon, 520.7 cm⁻¹, 532 nm excitation, 300 K, CCD detection (mpmath):
/// let r = anti_stokes_stokes_ratio(52_070.0, 532e-9, 300.0, RamanDetection::PhotonCounting).unwrap();
/// assert!((r / 0.097_199_754_436_265_66 - 1.0).abs() < 1e-14, "{r}");
/// ```
///
/// # References
/// See the module docs.
pub fn anti_stokes_stokes_ratio(
    raman_shift_per_m: f64,
    excitation_wavelength_m: f64,
    temperature_k: f64,
    detection: RamanDetection,
) -> Result<f64> {
    let (theta, f) = mode(raman_shift_per_m, excitation_wavelength_m, detection)?;
    temperature("temperature_k", temperature_k)?;
    let x = theta / temperature_k;
    if !(x <= 745.2) {
        // n < 4.9e-324: the ratio is below the f64 range.
        return Ok(0.0);
    }
    let n = bose_einstein(x)?;
    // n/(n + 1) = exp(−x), formed from the occupancy without cancellation; 1/(1 + 1/n) where n
    // overflows (x below 1/f64::MAX), which n/(n + 1) would turn into ∞/∞.
    Ok(f * if n.is_finite() {
        n / (n + 1.0)
    } else {
        1.0 / (1.0 + 1.0 / n)
    })
}

/// Temperature (K) from a measured anti-Stokes/Stokes ratio `ratio` (dimensionless, corrected
/// for the instrument's relative efficiency) of a mode of shift `raman_shift_per_m` (m⁻¹)
/// excited at `excitation_wavelength_m` (m), with dT/dR and the mode's occupancy.
///
/// # Formula
/// ```text
/// T = θ / ln(F/R),   θ = c₂ν̃_R,   F = ((ν̃_L + ν̃_R)/(ν̃_L − ν̃_R))^k
/// dT/dR = T²/(θ·R),   (1/R)·dR/dT = θ/T²
/// ```
///
/// # Errors
/// As [`raman_frequency_factor`]; `NON_FINITE` / `NON_POSITIVE` for a ratio ≤ 0;
/// `OUT_OF_RANGE` for a ratio ≥ F (that would need an infinite or negative temperature).
///
/// # Accuracy
/// Against mpmath `findroot` of the ratio equation on 16 rows: T ≤ 5.1e-16 relative ×
/// max(1, T/θ), dT/dR ≤ 2.8e-14 relative (`tests/quantum_reference.rs`). The problem's own
/// condition number is 1/ln(F/R) ≈ T/θ: near R = F (T ≫ θ) a ratio error is strongly
/// amplified, as dT/dR shows.
///
/// # Examples
/// ```
/// use quantaband::thermometry::raman::{raman_temperature, RamanDetection};
/// let rd = raman_temperature(52_070.0, 532e-9, 0.097_199_754_436_265_66, RamanDetection::PhotonCounting).unwrap();
/// assert!((rd.temperature_k - 300.0).abs() < 1e-11);
/// // A 1 % error in the ratio costs T/θ % of T: 0.40 % here (θ = 749.171 120 116 K, mpmath)
/// let rel = 0.097_199_754_436_265_66 * rd.d_t_d_ratio / rd.temperature_k;
/// assert!((rel - 300.0 / 749.171_120_116_298_3).abs() < 1e-12);
/// ```
///
/// # References
/// See the module docs.
pub fn raman_temperature(
    raman_shift_per_m: f64,
    excitation_wavelength_m: f64,
    ratio: f64,
    detection: RamanDetection,
) -> Result<RamanReading> {
    let (theta, f) = mode(raman_shift_per_m, excitation_wavelength_m, detection)?;
    positive("ratio", ratio)?;
    if !(ratio < f) {
        return Err(Error::OutOfRange {
            arg: "ratio",
            value: ratio,
            range: "(0, frequency factor (nu_aS/nu_S)^k)",
        });
    }
    let l = float::ln(f / ratio);
    let t = theta / l;
    if !(t > 0.0 && t.is_finite()) {
        return Err(Error::NoSolution {
            what: "Raman temperature outside the f64 range",
        });
    }
    let x = theta / t;
    let n = if x <= 745.2 { bose_einstein(x)? } else { 0.0 };
    Ok(RamanReading {
        temperature_k: t,
        // Quotients first: t·t and θ·R can underflow (0/0) where the results are ordinary.
        d_t_d_ratio: (t / theta) * (t / ratio),
        relative_sensitivity_per_k: theta / t / t,
        phonon_occupancy: n,
        frequency_factor: f,
        mode_temperature_k: theta,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn round_trip_and_limits() {
        for &t in &[10.0, 77.0, 300.0, 1000.0, 5000.0] {
            for det in [RamanDetection::Energy, RamanDetection::PhotonCounting] {
                let r = anti_stokes_stokes_ratio(52_070.0, 532e-9, t, det).unwrap();
                let rd = raman_temperature(52_070.0, 532e-9, r, det).unwrap();
                assert!((rd.temperature_k / t - 1.0).abs() < 1e-13, "{t}");
            }
        }
        // High temperature: R → F
        let f = raman_frequency_factor(52_070.0, 532e-9, RamanDetection::Energy).unwrap();
        let r = anti_stokes_stokes_ratio(52_070.0, 532e-9, 1e9, RamanDetection::Energy).unwrap();
        assert!((r / f - 1.0).abs() < 1e-6);
        // Very cold: underflow to exactly 0, never NaN
        let r = anti_stokes_stokes_ratio(52_070.0, 532e-9, 0.5, RamanDetection::Energy).unwrap();
        assert_eq!(r, 0.0);
    }

    #[test]
    fn errors() {
        let d = RamanDetection::Energy;
        assert_eq!(
            raman_temperature(52_070.0, 532e-9, 0.0, d)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            raman_temperature(52_070.0, 532e-9, -0.1, d)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            raman_temperature(52_070.0, 532e-9, 5.0, d)
                .unwrap_err()
                .code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            raman_frequency_factor(3e6, 532e-9, d).unwrap_err().code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            raman_frequency_factor(0.0, 532e-9, d).unwrap_err().code(),
            "NON_POSITIVE_SPECTRAL"
        );
        assert_eq!(
            anti_stokes_stokes_ratio(52_070.0, 532e-9, 0.0, d)
                .unwrap_err()
                .code(),
            "NON_POSITIVE_TEMPERATURE"
        );
    }
}
