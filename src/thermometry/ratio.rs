//! Two-colour (ratio) thermometry: temperature from the ratio of two channel signals, and its
//! sensitivity to the emissivity slope ε1/ε2.
//!
//! Each channel is any [`SignalModel`] (a spectral point, a response-weighted band, a
//! calibration curve). Channel 1 must be the shorter-wavelength one, so the blackbody ratio
//! g(T) = S1(T)/S2(T) increases with T. No Wien approximation is made: the ratio equation
//! ρ·g(T) = r is solved with the safeguarded Newton inverse of [`super::model`]
//! (ln g is nearly linear in 1/T).
//!
//! # References
//! P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
//! Industry*, SPIE Press, 2007 (ratio thermometers, emissivity slope) — from memory.
#![forbid(unsafe_code)]

use super::model::{invert_monotone, SignalModel, SpectralPoint};
use crate::constants::C2Convention;
use crate::error::{positive, temperature};
use crate::{Error, Result};

/// The blackbody ratio ρ·S1/S2 of two channels as a signal model (private helper).
struct RatioModel<'m, A: ?Sized, B: ?Sized> {
    ch1: &'m A,
    ch2: &'m B,
    rho: f64,
}

impl<A: SignalModel + ?Sized, B: SignalModel + ?Sized> SignalModel for RatioModel<'_, A, B> {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.0)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        let (s1, d1) = self.ch1.signal_and_derivative(temperature_k)?;
        let (s2, d2) = self.ch2.signal_and_derivative(temperature_k)?;
        if !(s2 > 0.0) {
            // Both channels underflow: the ratio is 0 at this depth (treated as "too cold").
            return Ok((0.0, 0.0));
        }
        let g = self.rho * s1 / s2;
        // d(ρ s1/s2)/dT = g·(d1/s1 − d2/s2)
        let dg = if s1 > 0.0 {
            g * (d1 / s1 - d2 / s2)
        } else {
            0.0
        };
        Ok((g, dg))
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        invert_monotone(self, signal, 1000.0)
    }
}

/// Result of a ratio measurement with its sensitivities (temperature in K; sensitivities in K
/// per unit ratio), returned by [`ratio_temperature`] and [`two_colour_temperature`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::ratio::two_colour_temperature;
/// // mpmath (tests/data/gen_thermometry.py): T = 1500 K, ε1/ε2 = 1.03 gives r = 0.48564017377974
/// let rd = two_colour_temperature(0.9e-6, 1.05e-6, 0.485_640_173_779_741_8, 1.03, Default::default()).unwrap();
/// assert!((rd.temperature_k - 1500.0).abs() < 1e-8);
/// // identity of the module docs: ∂T/∂ρ = −(r/ρ)·∂T/∂r
/// let expect = -(0.485_640_173_779_741_8 / 1.03) * rd.d_t_d_ratio;
/// assert!((rd.d_t_d_emissivity_ratio / expect - 1.0).abs() < 1e-9);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct RatioReading {
    /// Temperature, K.
    pub temperature_k: f64,
    /// ∂T/∂r, K per unit ratio (+∞ only where the true value is above `f64::MAX`: a ratio so
    /// small that ∂r/∂T is below the f64 range).
    #[cfg_attr(feature = "serde", serde(rename = "dTdRatio"))]
    pub d_t_d_ratio: f64,
    /// ∂T/∂(ε1/ε2), K per unit emissivity ratio.
    #[cfg_attr(feature = "serde", serde(rename = "dTdEmissivityRatio"))]
    pub d_t_d_emissivity_ratio: f64,
}

/// Temperature from a two-channel signal `ratio` = S1/S2 and the emissivity ratio ε1/ε2, with
/// the sensitivities ∂T/∂r and ∂T/∂(ε1/ε2). `guess_k` starts the search.
///
/// # Formula
/// ```text
/// r = ρ·g(T),  g(T) = S1(T)/S2(T),  ρ = ε1/ε2
/// ∂T/∂r = 1/(ρ·g′(T)),   ∂T/∂ρ = −g(T)/(ρ·g′(T)) = −(r/ρ)·∂T/∂r
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for a bad ratio or emissivity ratio; `NonPositiveTemperature`
/// for a bad guess; `Unsupported` if g does not increase with T at the guess (channel 1 must be
/// the shorter-wavelength one); `NoSolution` when the ratio lies outside what any temperature
/// in 1e-3 K … 1e9 K gives (above the Rayleigh–Jeans limit, for example).
///
/// # Accuracy
/// Solve to 4e-16 relative; sensitivities analytic. Against mpmath (findroot and numerical
/// derivatives) ≤ 1e-9 relative (`tests/thermometry_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::{SignalModel, SpectralPoint};
/// use quantaband::thermometry::ratio::ratio_temperature;
/// let c1 = SpectralPoint::new(0.9e-6, Default::default()).unwrap();
/// let c2 = SpectralPoint::new(1.05e-6, Default::default()).unwrap();
/// let r = c1.signal(1500.0).unwrap() / c2.signal(1500.0).unwrap();
/// let rd = ratio_temperature(&c1, &c2, r, 1.0, 1000.0).unwrap();
/// assert!((rd.temperature_k - 1500.0).abs() < 1e-9);
/// ```
///
/// # References
/// See the module docs.
pub fn ratio_temperature<A: SignalModel + ?Sized, B: SignalModel + ?Sized>(
    channel1: &A,
    channel2: &B,
    ratio: f64,
    emissivity_ratio: f64,
    guess_k: f64,
) -> Result<RatioReading> {
    positive("ratio", ratio)?;
    positive("emissivity_ratio", emissivity_ratio)?;
    temperature("guess_k", guess_k)?;
    // Solve S1/S2 = r/ρ where that quotient is a normal number: comparing ρ·S1/S2 with r loses
    // the ratio's bits when r is subnormal (r = 5e-324 with ρ = 1e-302 stopped 250 K off).
    let q = ratio / emissivity_ratio;
    let (target, rho) = if q.is_normal() {
        (q, 1.0)
    } else {
        (ratio, emissivity_ratio)
    };
    let m = RatioModel {
        ch1: channel1,
        ch2: channel2,
        rho,
    };
    let (_, dg0) = m.signal_and_derivative(guess_k)?;
    if dg0 < 0.0 {
        return Err(Error::Unsupported {
            what: "channel 1 must be the shorter-wavelength channel (S1/S2 increasing with T)",
        });
    }
    let t = invert_monotone(&m, target, guess_k)?;
    let (g, dg) = m.signal_and_derivative(t)?;
    if !(dg > 0.0) {
        return Err(Error::NoSolution {
            what: "ratio slope vanishes at the solution",
        });
    }
    // The measured ratio is (ρ/rho)·g: ∂T/∂r = (1/dg)/(ρ/rho); ∂T/∂ρ below needs no factor.
    let dt_dr = 1.0 / dg / (emissivity_ratio / rho);
    // g here already includes ρ: ∂T/∂ρ = −(ρ g_bb)/(ρ dg_bb)/ρ = −g/(dg·ρ)
    Ok(RatioReading {
        temperature_k: t,
        d_t_d_ratio: dt_dr,
        // (g/dg) first: dg·ρ can underflow to 0 where the quotient is ordinary.
        d_t_d_emissivity_ratio: -(g / dg) / emissivity_ratio,
    })
}

/// Spectral-point two-colour thermometer: temperature from the spectral-radiance ratio
/// L_λ(λ1)/L_λ(λ2) (λ1 < λ2, m) and the emissivity ratio ε(λ1)/ε(λ2), with sensitivities.
///
/// # Formula
/// ```text
/// r = (ε1/ε2)·[λ2⁵·(exp(c2/(λ2 T)) − 1)] / [λ1⁵·(exp(c2/(λ1 T)) − 1)]   (full Planck law)
/// ```
///
/// # Errors
/// `NonPositiveSpectral` for a bad wavelength, `InvalidBand` unless λ1 < λ2; as
/// [`ratio_temperature`].
///
/// # Accuracy
/// As [`ratio_temperature`]; the guess is the Wien-approximation closed form.
///
/// # Examples
/// ```
/// use quantaband::thermometry::ratio::two_colour_temperature;
/// // mpmath (tests/data/gen_thermometry.py): T = 1500 K, ε1/ε2 = 1.03 gives r = 0.48564017377974
/// let rd = two_colour_temperature(0.9e-6, 1.05e-6, 0.485_640_173_779_741_8, 1.03, Default::default()).unwrap();
/// assert!((rd.temperature_k - 1500.0).abs() < 1e-8);
/// ```
///
/// # References
/// See the module docs.
pub fn two_colour_temperature(
    wavelength1_m: f64,
    wavelength2_m: f64,
    ratio: f64,
    emissivity_ratio: f64,
    c2: C2Convention,
) -> Result<RatioReading> {
    crate::error::band(
        "wavelength1_m",
        wavelength1_m,
        "wavelength2_m",
        wavelength2_m,
    )?;
    positive("ratio", ratio)?;
    positive("emissivity_ratio", emissivity_ratio)?;
    let ch1 = SpectralPoint::new(wavelength1_m, c2)?;
    let ch2 = SpectralPoint::new(wavelength2_m, c2)?;
    // Wien: ln(r/ρ) = 5 ln(λ2/λ1) − c2(1/λ1 − 1/λ2)/T
    let c2v = c2.c2();
    let den = 5.0 * crate::float::ln(wavelength2_m / wavelength1_m)
        - crate::float::ln(ratio / emissivity_ratio);
    let wien = c2v * (1.0 / wavelength1_m - 1.0 / wavelength2_m) / den;
    let guess = if wien.is_finite() && wien > 0.0 {
        wien.clamp(1e-3, 1e9)
    } else {
        1e4
    };
    // As trait objects: the same instance of the solver as for any other pair of models.
    let (m1, m2): (&dyn SignalModel, &dyn SignalModel) = (&ch1, &ch2);
    ratio_temperature(m1, m2, ratio, emissivity_ratio, guess)
}
