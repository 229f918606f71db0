//! Detector signal and noise: photocurrent, electrons per integration time, well fill, shot
//! noise of signal and background, dark current and read noise, signal-to-noise ratio and the
//! first-principles NETD.
//!
//! # Model
//!
//! An integrating (photovoltaic, photon-counting) detector collects, in an integration time t,
//!
//! ```text
//! N_s = ṅ_s·t            signal electrons  (ṅ_s from the scene flux and the conversion)
//! N_b = ṅ_b·t            background electrons (stray light, warm optics… given as a rate)
//! N_d = I_d·t/e          dark electrons
//! σ²  = N_s + N_b + N_d + σ_r²     (Poisson shot noise of each, read noise σ_r)
//! SNR = N_s/σ,   NETD = σ/(∂N_s/∂T),   well fill = (N_s + N_b + N_d)/N_well
//! ```
//!
//! The shot-noise variance equals the mean count (Poisson); photon bunching (the Bose factor
//! 1 + n̄, n̄ the mode occupancy) is neglected, which is accurate where n̄ ≪ 1 (n̄ = 0.008 at
//! 10 µm and 300 K). Photoconductors, whose recombination doubles the variance, are treated
//! only in [`super::merit::blip_d_star`].
#![forbid(unsafe_code)]

use super::scene::{non_negative, RadianceKind};
use super::throughput::{pixel_flux, Optics, PixelFlux};
use super::InBandRadiance;
use crate::constants::{ELEMENTARY_CHARGE_E, PLANCK_H, SPEED_OF_LIGHT_C};
use crate::error::{positive, spectral, unit_interval_open_closed};
use crate::float;
use crate::{Error, Result};

/// How the detector turns the flux on a pixel into electrons.
///
/// # Formula
/// ```text
/// Responsivity { ℜ }:       ṅ = Φ_E·ℜ/e      (energy flux Φ_E in W, ℜ in A/W)
/// QuantumEfficiency { η }:  ṅ = η·Φ_q        (photon flux Φ_q in photons/s)
/// Included:                 ṅ = Φ_I/e (current kind, A) or ṅ = Φ_e (electron kind)
/// e elementary charge
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::Conversion;
/// let c = Conversion::QuantumEfficiency { efficiency: 0.7 };
/// assert!(matches!(c, Conversion::QuantumEfficiency { .. }));
/// ```
///
/// With the `serde` feature: `{"kind": "responsivity", "amperesPerWatt": …}`,
/// `{"kind": "quantumEfficiency", "efficiency": …}` or `{"kind": "included"}` (read key by key,
/// unknown fields rejected; `src/design/serde_impls.rs`).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum Conversion {
    /// A band-flat responsivity (A/W); needs an energy flux.
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    Responsivity {
        /// Responsivity ℜ, A/W (> 0).
        amperes_per_watt: f64,
    },
    /// A band-flat quantum efficiency (electrons per photon, in (0, 1]); needs a photon flux.
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    QuantumEfficiency {
        /// Quantum efficiency η, in (0, 1].
        efficiency: f64,
    },
    /// The radiance is already weighted by the detector's spectral response (current or
    /// electron kind).
    Included,
}

impl Conversion {
    /// Checks ℜ > 0 or η in (0, 1].
    ///
    /// # Formula
    /// ```text
    /// 0 < ℜ < ∞;  0 < η ≤ 1
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` (`amperes_per_watt`), `NonFinite` / `OutOfRange`
    /// (`efficiency`).
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Conversion;
    /// let bad = Conversion::QuantumEfficiency { efficiency: 1.2 };
    /// assert_eq!(bad.validate().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn validate(&self) -> Result<()> {
        match *self {
            Conversion::Responsivity { amperes_per_watt } => {
                positive("amperes_per_watt", amperes_per_watt)?;
            }
            Conversion::QuantumEfficiency { efficiency } => {
                unit_interval_open_closed("efficiency", efficiency)?;
            }
            Conversion::Included => {}
        }
        Ok(())
    }
}

/// Electron rate (electrons/s) and its temperature derivative (electrons/s per K) produced by a
/// flux on the pixel, returned as a [`PixelFlux`] of kind [`RadianceKind::Electron`].
///
/// # Formula
/// ```text
/// energy flux Φ (W)      + Responsivity ℜ (A/W):  ṅ = ℜ·Φ/e
/// photon flux Φ (1/s)    + QuantumEfficiency η:   ṅ = η·Φ
/// current flux Φ (A)     + Included:              ṅ = Φ/e
/// electron flux Φ (1/s)  + Included:              ṅ = Φ
/// ∂ṅ/∂T by the same factor; e elementary charge (exact, SI 2019)
/// ```
///
/// # Errors
/// `Unsupported` for any other pairing (a responsivity needs an energy flux, a quantum
/// efficiency a photon flux, a response-weighted flux `Included`); `NonFinite` / `OutOfRange`
/// for a negative or non-finite flux; those of [`Conversion::validate`].
///
/// # Accuracy
/// One or two roundings (≤ 2.2e-16 relative beyond the flux's own error).
///
/// # Examples
/// ```
/// use quantaband::design::detector::electron_rate;
/// use quantaband::design::{Conversion, PixelFlux, RadianceKind};
/// let p = PixelFlux { kind: RadianceKind::Energy, flux: 1e-9, d_flux_dt: 0.0 };
/// let r = electron_rate(&p, Conversion::Responsivity { amperes_per_watt: 2.0 }).unwrap();
/// // 2 nA = 2e-9/1.602 176 634e-19 electrons/s (e exact, SI 2019).
/// assert!((r.flux / (2e-9 / 1.602_176_634e-19) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// E. L. Dereniak & G. D. Boreman, *Infrared Detectors and Systems*, Wiley (1996), ch. 3
/// (responsivity and quantum efficiency) — from memory.
pub fn electron_rate(flux: &PixelFlux, conversion: Conversion) -> Result<PixelFlux> {
    conversion.validate()?;
    non_negative("flux", flux.flux)?;
    non_negative("d_flux_dt", flux.d_flux_dt)?;
    // The factor as mul/div, applied as (x·mul)/div: mul/e alone overflows for a responsivity
    // above ~2.9e289 A/W, and 0·∞ would be NaN for a flux (or ∂/∂T) of 0.
    let (mul, div) = match (flux.kind, conversion) {
        (RadianceKind::Energy, Conversion::Responsivity { amperes_per_watt }) => {
            (amperes_per_watt, ELEMENTARY_CHARGE_E)
        }
        (RadianceKind::Photon, Conversion::QuantumEfficiency { efficiency }) => (efficiency, 1.0),
        (RadianceKind::Current, Conversion::Included) => (1.0, ELEMENTARY_CHARGE_E),
        (RadianceKind::Electron, Conversion::Included) => (1.0, 1.0),
        _ => {
            return Err(Error::Unsupported {
                what: "this conversion for this flux: a responsivity (A/W) needs an energy \
                       flux, a quantum efficiency a photon flux, and a response-weighted \
                       (current or electron) flux needs Conversion::Included",
            })
        }
    };
    Ok(PixelFlux {
        kind: RadianceKind::Electron,
        flux: flux.flux * mul / div,
        d_flux_dt: flux.d_flux_dt * mul / div,
    })
}

/// Responsivity (A/W) of a detector with quantum efficiency `efficiency` at `wavelength_m` (m).
///
/// # Formula
/// ```text
/// ℜ = η·e·λ/(h·c)
/// η quantum efficiency, e elementary charge, λ vacuum wavelength, h Planck constant, c speed
/// of light (e, h, c exact, SI 2019)
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` (`efficiency` outside (0, 1]); `NonFinite` /
/// `NonPositiveSpectral` (`wavelength_m`).
///
/// # Accuracy
/// A few ulp; round trip with [`quantum_efficiency_from_responsivity`] within 2.9e-16
/// (`tests/design_properties.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::detector::responsivity_from_quantum_efficiency;
/// // η = 1 at 1 µm: eλ/(hc) = 0.806 554 393 734 921 A/W (mpmath, exact SI constants).
/// let r = responsivity_from_quantum_efficiency(1.0, 1e-6).unwrap();
/// assert!((r / 0.806_554_393_734_921 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 3 — from memory.
pub fn responsivity_from_quantum_efficiency(efficiency: f64, wavelength_m: f64) -> Result<f64> {
    unit_interval_open_closed("efficiency", efficiency)?;
    spectral("wavelength_m", wavelength_m)?;
    Ok(efficiency * ELEMENTARY_CHARGE_E / (PLANCK_H * SPEED_OF_LIGHT_C) * wavelength_m)
}

/// Quantum efficiency (electrons per photon) of a detector with responsivity
/// `amperes_per_watt` (A/W) at `wavelength_m` (m). A value above 1 means internal gain.
///
/// # Formula
/// ```text
/// η = ℜ·h·c/(e·λ)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` (`amperes_per_watt`); `NonFinite` / `NonPositiveSpectral`
/// (`wavelength_m`).
/// A true value above `f64::MAX` (a wavelength near the bottom of the f64 range) is +∞; the result
/// is not checked against 1.
///
/// # Accuracy
/// A few ulp (see [`responsivity_from_quantum_efficiency`]).
///
/// # Examples
/// ```
/// use quantaband::design::detector::quantum_efficiency_from_responsivity;
/// let eta = quantum_efficiency_from_responsivity(0.806_554_393_734_921, 1e-6).unwrap();
/// assert!((eta - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 3 — from memory.
pub fn quantum_efficiency_from_responsivity(
    amperes_per_watt: f64,
    wavelength_m: f64,
) -> Result<f64> {
    positive("amperes_per_watt", amperes_per_watt)?;
    spectral("wavelength_m", wavelength_m)?;
    Ok(amperes_per_watt * (PLANCK_H * SPEED_OF_LIGHT_C / ELEMENTARY_CHARGE_E) / wavelength_m)
}

/// Number of dark electrons (electrons) collected from a dark current `dark_current_a` (A) in
/// `integration_time_s` (s).
///
/// # Formula
/// ```text
/// N_d = I_d·t/e
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` (negative `dark_current_a`); `NonFinite` / `NonPositive`
/// (`integration_time_s`).
///
/// # Accuracy
/// Two roundings.
///
/// # Examples
/// ```
/// use quantaband::design::detector::dark_electrons;
/// // 1 pA for 10 ms: 1e-14/1.602 176 634e-19 = 62 415.090 744 607 63 electrons (by hand).
/// let n = dark_electrons(1e-12, 10e-3).unwrap();
/// assert!((n / 62_415.090_744_607_63 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman (1996), ch. 3 — from memory.
pub fn dark_electrons(dark_current_a: f64, integration_time_s: f64) -> Result<f64> {
    non_negative("dark_current_a", dark_current_a)?;
    positive("integration_time_s", integration_time_s)?;
    Ok(dark_current_a * integration_time_s / ELEMENTARY_CHARGE_E)
}

/// The noise of one integration, by source, in electrons (rms).
///
/// # Examples
/// ```
/// use quantaband::design::detector::noise_budget;
/// let n = noise_budget(9.0, 16.0, 0.0, 0.0).unwrap();
/// assert_eq!(n.total_electrons, 5.0);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct NoiseBudget {
    /// Shot noise of the signal electrons, √N_s.
    pub signal_shot_electrons: f64,
    /// Shot noise of the background electrons, √N_b.
    pub background_shot_electrons: f64,
    /// Shot noise of the dark electrons, √N_d.
    pub dark_shot_electrons: f64,
    /// Read noise σ_r.
    pub read_electrons: f64,
    /// Total, added in quadrature: √(N_s + N_b + N_d + σ_r²).
    pub total_electrons: f64,
}

/// √(N_s + N_b + N_d + σ_r²); where the sum (or σ_r²) overflows although the root does not,
/// scaled by the largest of √N_s, √N_b, √N_d, σ_r.
fn total_noise(s: f64, b: f64, d: f64, r: f64) -> f64 {
    let sum = s + b + d + r * r;
    if sum.is_finite() {
        return float::sqrt(sum);
    }
    let m = float::sqrt(s)
        .max(float::sqrt(b))
        .max(float::sqrt(d))
        .max(r);
    m * float::sqrt(s / m / m + b / m / m + d / m / m + (r / m) * (r / m))
}

/// Noise budget (electrons rms) of one integration from the mean signal, background and dark
/// electron counts and the read noise.
///
/// # Formula
/// ```text
/// σ_s = √N_s,  σ_b = √N_b,  σ_d = √N_d,  σ = √(N_s + N_b + N_d + σ_r²)
/// (Poisson shot noise; σ_r read noise)
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` for a negative or non-finite argument.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::design::detector::noise_budget;
/// let n = noise_budget(1.0e6, 0.0, 1.0e4, 30.0).unwrap();
/// // √(1e6 + 1e4 + 900) by hand.
/// assert!((n.total_electrons - 1_010_900f64.sqrt()).abs() < 1e-9);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5 (shot noise); J. R.
/// Janesick, *Photon Transfer*, SPIE Press (2007), ch. 2 (noise sources in quadrature) — from
/// memory.
pub fn noise_budget(
    signal_electrons: f64,
    background_electrons: f64,
    dark_electrons: f64,
    read_noise_electrons: f64,
) -> Result<NoiseBudget> {
    non_negative("signal_electrons", signal_electrons)?;
    non_negative("background_electrons", background_electrons)?;
    non_negative("dark_electrons", dark_electrons)?;
    non_negative("read_noise_electrons", read_noise_electrons)?;
    Ok(NoiseBudget {
        signal_shot_electrons: float::sqrt(signal_electrons),
        background_shot_electrons: float::sqrt(background_electrons),
        dark_shot_electrons: float::sqrt(dark_electrons),
        read_electrons: read_noise_electrons,
        total_electrons: total_noise(
            signal_electrons,
            background_electrons,
            dark_electrons,
            read_noise_electrons,
        ),
    })
}

/// A pixel's detector: area, conversion, integration time, full well, dark current and read
/// noise.
///
/// # Examples
/// ```
/// use quantaband::design::{Conversion, Detector};
/// let d = Detector {
///     pixel_area_m2: 15e-6 * 15e-6,
///     conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
///     integration_time_s: 10e-3,
///     full_well_electrons: 1.0e7,
///     dark_current_a: 1e-12,
///     read_noise_electrons: 300.0,
/// };
/// assert!(d.validate().is_ok());
/// ```
///
/// With the `serde` feature: camelCase fields, all required, unknown fields rejected (read key
/// by key: `src/design/serde_impls.rs`).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(rename_all = "camelCase")
)]
pub struct Detector {
    /// Pixel (detector) area A, m² (> 0).
    pub pixel_area_m2: f64,
    /// How flux becomes electrons.
    pub conversion: Conversion,
    /// Integration time t, s (> 0).
    pub integration_time_s: f64,
    /// Full-well capacity N_well, electrons (> 0).
    pub full_well_electrons: f64,
    /// Dark current I_d, A (≥ 0).
    pub dark_current_a: f64,
    /// Read noise σ_r, electrons rms (≥ 0).
    pub read_noise_electrons: f64,
}

/// Signal, noise and figures of one pixel for one integration (see [`Detector::evaluate`]).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct PixelReport {
    /// Scene flux on the pixel in the scene radiance's kind (W, photons/s, A or electrons/s) and
    /// its derivative per K.
    pub flux: PixelFlux,
    /// Photocurrent of the scene signal, A.
    pub photocurrent_a: f64,
    /// Signal electrons N_s per integration.
    pub signal_electrons: f64,
    /// ∂N_s/∂T, electrons per K of scene temperature.
    pub d_signal_electrons_dt: f64,
    /// Background electrons N_b per integration.
    pub background_electrons: f64,
    /// Dark electrons N_d per integration.
    pub dark_electrons: f64,
    /// (N_s + N_b + N_d)/N_well; ≥ 1 means the well is full.
    pub well_fill: f64,
    /// `well_fill >= 1`: the pixel saturates and the noise figures below no longer apply.
    pub saturated: bool,
    /// Noise by source, electrons rms.
    pub noise: NoiseBudget,
    /// Signal-to-noise ratio N_s/σ (0 when there is neither signal nor noise).
    pub snr: f64,
    /// First-principles NETD σ/(∂N_s/∂T), K (∞ if the signal does not change with T in f64).
    pub netd_k: f64,
}

impl Detector {
    /// Checks every field (area, integration time and full well > 0; dark current and read
    /// noise ≥ 0; the conversion).
    ///
    /// # Formula
    /// ```text
    /// A > 0, t > 0, N_well > 0, I_d ≥ 0, σ_r ≥ 0, conversion valid
    /// ```
    ///
    /// # Errors
    /// `NonFinite`, `NonPositive` (`pixel_area_m2`, `integration_time_s`,
    /// `full_well_electrons`), `OutOfRange` (negative `dark_current_a`,
    /// `read_noise_electrons`) and those of [`Conversion::validate`].
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{Conversion, Detector};
    /// let d = Detector {
    ///     pixel_area_m2: 1e-10,
    ///     conversion: Conversion::Included,
    ///     integration_time_s: 0.0,
    ///     full_well_electrons: 1e6,
    ///     dark_current_a: 0.0,
    ///     read_noise_electrons: 0.0,
    /// };
    /// assert_eq!(d.validate().unwrap_err().code(), "NON_POSITIVE");
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn validate(&self) -> Result<()> {
        positive("pixel_area_m2", self.pixel_area_m2)?;
        self.conversion.validate()?;
        positive("integration_time_s", self.integration_time_s)?;
        positive("full_well_electrons", self.full_well_electrons)?;
        non_negative("dark_current_a", self.dark_current_a)?;
        non_negative("read_noise_electrons", self.read_noise_electrons)?;
        Ok(())
    }

    /// Signal, noise, SNR, well fill and first-principles NETD of one pixel viewing a scene of
    /// in-band radiance `scene` through `optics`, with an extra background electron rate
    /// `background_electrons_per_s` (electrons/s: stray light, warm optics; 0 if none).
    ///
    /// # Formula
    /// ```text
    /// Φ = L·A·τ·Ω(F)·cos⁴θ                  (throughput::pixel_flux)
    /// ṅ_s = conversion(Φ)                   (electron_rate)
    /// N_s = ṅ_s·t,  ∂N_s/∂T = ∂ṅ_s/∂T·t,  N_b = ṅ_b·t,  N_d = I_d·t/e,  I_s = e·ṅ_s
    /// σ = √(N_s + N_b + N_d + σ_r²),  SNR = N_s/σ,  NETD = σ/(∂N_s/∂T)
    /// well fill = (N_s + N_b + N_d)/N_well
    /// ```
    ///
    /// # Errors
    /// Those of [`Detector::validate`], [`Optics::validate`], [`InBandRadiance::validate`] and
    /// [`electron_rate`] (kind and conversion must match); `NonFinite` / `OutOfRange` for a
    /// negative background rate.
    ///
    /// # Accuracy
    /// A few ulp beyond the in-band radiance's error. Against an mpmath evaluation of the same
    /// chain from quadrature of the Planck radiance (`tests/design_reference.rs`, 4 pixels):
    /// electrons, current, noise, SNR, well fill and NETD within 8.9e-16 relative.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{Band, Conversion, Detector, InBand, Optics};
    /// use quantaband::planck::Quantity;
    /// // An invented MWIR pixel: 15 µm, η = 0.7, 1 ms, 1.1e7 e⁻ well, 1 pA dark, 200 e⁻ read noise.
    /// let det = Detector {
    ///     pixel_area_m2: 15e-6 * 15e-6,
    ///     conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
    ///     integration_time_s: 1e-3,
    ///     full_well_electrons: 1.1e7,
    ///     dark_current_a: 1e-12,
    ///     read_noise_electrons: 200.0,
    /// };
    /// let scene = Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon).in_band(300.0).unwrap();
    /// let r = det.evaluate(&scene, &Optics::new(2.0, 0.9), 0.0).unwrap();
    /// assert!(!r.saturated);
    /// // mpmath chain (tests/data/gen_design.py, case "mwir_doc"): NETD 0.033 172 571 793 443 83 K.
    /// assert!((r.netd_k / 0.033_172_571_793_443_83 - 1.0).abs() < 1e-13, "{}", r.netd_k);
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5–6 (noise, NETD);
    /// G. C. Holst, *Testing and Evaluation of Infrared Imaging Systems*, 3rd ed. (2008), ch. 7
    /// (NETD) — from memory.
    pub fn evaluate(
        &self,
        scene: &InBandRadiance,
        optics: &Optics,
        background_electrons_per_s: f64,
    ) -> Result<PixelReport> {
        self.validate()?;
        non_negative("background_electrons_per_s", background_electrons_per_s)?;
        let flux = pixel_flux(scene, optics, self.pixel_area_m2)?;
        let rate = electron_rate(&flux, self.conversion)?;
        let t = self.integration_time_s;
        let n_s = rate.flux * t;
        let dn_s = rate.d_flux_dt * t;
        let n_b = background_electrons_per_s * t;
        let n_d = dark_electrons(self.dark_current_a, t)?;
        let noise = noise_budget(n_s, n_b, n_d, self.read_noise_electrons)?;
        let well_fill = (n_s + n_b + n_d) / self.full_well_electrons;
        let snr = if noise.total_electrons > 0.0 {
            n_s / noise.total_electrons
        } else {
            0.0
        };
        let netd_k = if dn_s > 0.0 {
            noise.total_electrons / dn_s
        } else {
            f64::INFINITY
        };
        Ok(PixelReport {
            flux,
            photocurrent_a: rate.flux * ELEMENTARY_CHARGE_E,
            signal_electrons: n_s,
            d_signal_electrons_dt: dn_s,
            background_electrons: n_b,
            dark_electrons: n_d,
            well_fill,
            saturated: well_fill >= 1.0,
            noise,
            snr,
            netd_k,
        })
    }
}
