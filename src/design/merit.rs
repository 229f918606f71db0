//! Figures of merit: noise bandwidth, noise-equivalent power, NETD ↔ D* (both ways, with the
//! optics factor 4F² + 1 or 4F²), the first-principles NETD, and the background-limited
//! (BLIP) D* of photovoltaic and photoconductive detectors.
//!
//! # Conventions
//!
//! - D* (specific detectivity) is in m·Hz^½·W⁻¹; 1 cm·Hz^½·W⁻¹ ("Jones") = 0.01 m·Hz^½·W⁻¹.
//! - The noise bandwidth of an integration of duration t is Δf = 1/(2t)
//!   ([`noise_bandwidth_hz`]); with it the D* route and the electron-counting route give the
//!   same NETD for a shot-noise-limited detector (tested in `tests/design_properties.rs`).
//! - NETD from D*:
//!
//!   ```text
//!   NEP = √(A·Δf)/D*,   NETD = NEP/(∂P/∂T)
//!   ∂P/∂T = A·τ·Ω(F)·cos⁴θ·∂L/∂T,  Ω = π/(4F² + 1) or π/(4F²)
//!   ⇒ NETD = (4F² + 1)·√Δf / (π·τ·D*·√A·∂L/∂T·cos⁴θ)     (4F² in the small-angle form)
//!   ```
//!
//!   For a flat D* (thermal detectors, or D* averaged over the band) ∂L/∂T is the band energy
//!   radiance derivative ([`DStarShape::Flat`]). An ideal photon detector has D*(λ) =
//!   D*(λp)·λ/λp below its cut-off (constant quantum efficiency); then
//!   ∫D*(λ)·∂L_λ/∂T dλ = D*(λp)·(hc/λp)·∂L_q/∂T with the photon radiance L_q
//!   ([`DStarShape::IdealPhoton`]).
//! - BLIP D* at the cut-off wavelength λc of an ideal photon detector of quantum efficiency η
//!   whose only noise is the shot noise of the background photon flux density Φ_B
//!   (photons·s⁻¹·m⁻²) it absorbs:
//!
//!   ```text
//!   photovoltaic:     D* = (λ/(hc))·√(η/(2Φ_B))
//!   photoconductive:  D* = (λ/(2hc))·√(η/Φ_B)      (generation + recombination: 1/√2 of PV)
//!   Φ_B = Ω·∫₀^λc L_q,λ(λ, T_B) dλ,   Ω = π/(4F² + 1) or π/(4F²) (cold stop), π (hemisphere)
//!   ```
#![forbid(unsafe_code)]

use super::scene::{InBandRadiance, RadianceKind};
use super::throughput::{projected_solid_angle_sr, ConeForm, Optics};
use crate::constants::{PLANCK_H, SPEED_OF_LIGHT_C};
use crate::error::{positive, spectral, temperature, unit_interval_open_closed};
use crate::float;
use crate::planck::{Geometry, Quantity, SpectralVariable, Spectrum};
use crate::{Error, Result};
use core::f64::consts::PI;

/// Noise-equivalent bandwidth (Hz) of an integration lasting `integration_time_s` (s).
///
/// # Formula
/// ```text
/// Δf = 1/(2t)
/// (the equivalent noise bandwidth of an ideal integrator, |sinc(πft)|² response)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for `integration_time_s`.
///
/// # Accuracy
/// Correctly rounded.
///
/// # Examples
/// ```
/// use quantaband::design::merit::noise_bandwidth_hz;
/// assert_eq!(noise_bandwidth_hz(10e-3).unwrap(), 50.0);
/// ```
///
/// # References
/// E. L. Dereniak & G. D. Boreman, *Infrared Detectors and Systems*, Wiley (1996), ch. 5
/// (noise-equivalent bandwidth of an integrator); G. C. Holst, *Testing and Evaluation of
/// Infrared Imaging Systems*, 3rd ed., SPIE Press (2008) — from memory.
pub fn noise_bandwidth_hz(integration_time_s: f64) -> Result<f64> {
    positive("integration_time_s", integration_time_s)?;
    Ok(0.5 / integration_time_s)
}

/// Noise-equivalent power (W) of a detector of specific detectivity `d_star` (m·Hz^½·W⁻¹),
/// area `area_m2` (m²) and noise bandwidth `bandwidth_hz` (Hz).
///
/// # Formula
/// ```text
/// NEP = √(A·Δf)/D*
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument (a negative D* included).
///
/// # Accuracy
/// A few ulp; √A and √Δf are taken apart, so the product cannot overflow.
///
/// # Examples
/// ```
/// use quantaband::design::merit::nep_w;
/// // D* = 1e11 Jones = 1e9 m Hz^½/W, 1 mm², 1 Hz: NEP = 1e-3/1e9 = 1e-12 W (by hand).
/// assert!((nep_w(1e9, 1e-6, 1.0).unwrap() - 1e-12).abs() < 1e-27);
/// ```
///
/// # References
/// R. C. Jones, "Performance of detectors for visible and infrared radiation", Adv. Electron.
/// 5, 1–96 (1953) (definition of D*); Dereniak & Boreman (1996), ch. 3 — from memory.
pub fn nep_w(d_star: f64, area_m2: f64, bandwidth_hz: f64) -> Result<f64> {
    positive("d_star", d_star)?;
    positive("area_m2", area_m2)?;
    positive("bandwidth_hz", bandwidth_hz)?;
    Ok(float::sqrt(area_m2) * float::sqrt(bandwidth_hz) / d_star)
}

/// Specific detectivity D* (m·Hz^½·W⁻¹) from a noise-equivalent power `nep_w` (W), area
/// `area_m2` (m²) and bandwidth `bandwidth_hz` (Hz): the inverse of [`nep_w`].
///
/// # Formula
/// ```text
/// D* = √(A·Δf)/NEP
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument.
///
/// # Accuracy
/// A few ulp; round trip with [`nep_w`] within 2.9e-16 (`tests/design_properties.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::merit::d_star_from_nep;
/// assert!((d_star_from_nep(1e-12, 1e-6, 1.0).unwrap() / 1e9 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Jones, Adv. Electron. 5 (1953); Dereniak & Boreman (1996), ch. 3 — from memory.
pub fn d_star_from_nep(nep_w: f64, area_m2: f64, bandwidth_hz: f64) -> Result<f64> {
    positive("nep_w", nep_w)?;
    positive("area_m2", area_m2)?;
    positive("bandwidth_hz", bandwidth_hz)?;
    Ok(float::sqrt(area_m2) * float::sqrt(bandwidth_hz) / nep_w)
}

/// NETD (K) of a detector of D* `d_star` (m·Hz^½·W⁻¹), area `area_m2` (m²) and bandwidth
/// `bandwidth_hz` (Hz) whose in-band power changes by `d_power_dt_w_per_k` (W/K) per kelvin of
/// scene temperature.
///
/// # Formula
/// ```text
/// NETD = NEP/(∂P/∂T) = √(A·Δf)/(D*·∂P/∂T)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::design::merit::netd_from_d_star;
/// // NEP 1e-12 W against 1e-11 W/K: 0.1 K.
/// assert!((netd_from_d_star(1e9, 1e-6, 1.0, 1e-11).unwrap() - 0.1).abs() < 1e-16);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 6 (NETD) — from memory.
pub fn netd_from_d_star(
    d_star: f64,
    area_m2: f64,
    bandwidth_hz: f64,
    d_power_dt_w_per_k: f64,
) -> Result<f64> {
    positive("d_power_dt_w_per_k", d_power_dt_w_per_k)?;
    Ok(nep_w(d_star, area_m2, bandwidth_hz)? / d_power_dt_w_per_k)
}

/// D* (m·Hz^½·W⁻¹) needed for a NETD of `netd_k` (K): the inverse of [`netd_from_d_star`].
///
/// # Formula
/// ```text
/// D* = √(A·Δf)/(NETD·∂P/∂T)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument.
///
/// # Accuracy
/// A few ulp; round trip within 2.9e-16 (`tests/design_properties.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::merit::d_star_from_netd;
/// assert!((d_star_from_netd(0.1, 1e-6, 1.0, 1e-11).unwrap() / 1e9 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman (1996), ch. 6 — from memory.
pub fn d_star_from_netd(
    netd_k: f64,
    area_m2: f64,
    bandwidth_hz: f64,
    d_power_dt_w_per_k: f64,
) -> Result<f64> {
    positive("netd_k", netd_k)?;
    positive("d_power_dt_w_per_k", d_power_dt_w_per_k)?;
    d_star_from_nep(netd_k * d_power_dt_w_per_k, area_m2, bandwidth_hz)
}

/// How D* varies over the band.
///
/// # Formula
/// ```text
/// Flat:                        D*(λ) = D*            (scene radiance of Energy kind)
/// IdealPhoton { λp }:          D*(λ) = D*·λ/λp       (scene radiance of Photon kind; D* quoted
///                                                     at λp, usually the cut-off)
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::DStarShape;
/// let s = DStarShape::IdealPhoton { peak_wavelength_m: 5e-6 };
/// assert!(matches!(s, DStarShape::IdealPhoton { .. }));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum DStarShape {
    /// D* constant over the band (or already band-averaged); needs an energy radiance.
    Flat,
    /// An ideal photon detector: D* ∝ λ, given at `peak_wavelength_m`; needs a photon radiance.
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    IdealPhoton {
        /// Wavelength (m) at which D* is quoted, normally the cut-off λp.
        peak_wavelength_m: f64,
    },
}

/// The D*-weighted change of pixel power per kelvin (W/K): the ∂P/∂T of [`netd_from_d_star`]
/// for a scene of in-band radiance `scene`, seen through `optics` by a pixel of area
/// `pixel_area_m2` (m²), for the given spectral shape of D*.
///
/// # Formula
/// ```text
/// Flat:          ∂P/∂T = A·K·∂L/∂T               (L energy radiance, W m⁻² sr⁻¹)
/// IdealPhoton:   ∂P/∂T = A·K·(hc/λp)·∂L_q/∂T     (L_q photon radiance)
/// K = τ·Ω(F)·cos⁴θ (Optics::irradiance_factor_sr)
/// ```
///
/// # Errors
/// `Unsupported` if the shape does not match the radiance kind (Flat needs Energy,
/// IdealPhoton needs Photon); `NonFinite` / `NonPositiveSpectral` for `peak_wavelength_m`;
/// `NonFinite` / `NonPositive` for `pixel_area_m2`; those of [`Optics::validate`] and
/// [`InBandRadiance::validate`].
///
/// # Accuracy
/// A few ulp beyond the radiance's error.
///
/// # Examples
/// ```
/// use quantaband::design::merit::d_power_dt_w_per_k;
/// use quantaband::design::{DStarShape, InBandRadiance, Optics, RadianceKind};
/// let l = InBandRadiance::new(RadianceKind::Energy, 54.93, 0.8378).unwrap();
/// let d = d_power_dt_w_per_k(&l, DStarShape::Flat, &Optics::new(1.0, 1.0), 1e-10).unwrap();
/// assert!((d / (1e-10 * core::f64::consts::PI / 5.0 * 0.8378) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 6 (NETD of photon and
/// thermal detectors) — from memory.
pub fn d_power_dt_w_per_k(
    scene: &InBandRadiance,
    shape: DStarShape,
    optics: &Optics,
    pixel_area_m2: f64,
) -> Result<f64> {
    scene.validate()?;
    positive("pixel_area_m2", pixel_area_m2)?;
    let k = optics.irradiance_factor_sr()? * pixel_area_m2;
    match (scene.kind, shape) {
        (RadianceKind::Energy, DStarShape::Flat) => Ok(k * scene.d_radiance_dt),
        (RadianceKind::Photon, DStarShape::IdealPhoton { peak_wavelength_m }) => {
            spectral("peak_wavelength_m", peak_wavelength_m)?;
            Ok(k * (PLANCK_H * SPEED_OF_LIGHT_C / peak_wavelength_m) * scene.d_radiance_dt)
        }
        _ => Err(Error::Unsupported {
            what: "this D* shape for this radiance: DStarShape::Flat needs an energy radiance, \
                   DStarShape::IdealPhoton a photon radiance",
        }),
    }
}

/// NETD (K) of a pixel of area `pixel_area_m2` (m²) behind `optics`, with detector D*
/// `d_star` (m·Hz^½·W⁻¹; at λp for an ideal photon detector) and noise bandwidth
/// `bandwidth_hz` (Hz), viewing a scene of in-band radiance `scene`.
///
/// # Formula
/// ```text
/// NETD = (4F² + 1)·√Δf / (π·τ·D*·√A·∂L/∂T·cos⁴θ)     (ConeForm::Exact)
/// NETD = 4F²·√Δf / (π·τ·D*·√A·∂L/∂T·cos⁴θ)           (ConeForm::SmallAngle)
/// ∂L/∂T → (hc/λp)·∂L_q/∂T for DStarShape::IdealPhoton; Δf e.g. 1/(2 t_int)
/// ```
///
/// # Errors
/// Those of [`d_power_dt_w_per_k`] and [`netd_from_d_star`] (`NonPositive` for a D* ≤ 0, a
/// zero bandwidth or a scene whose radiance does not change with T).
///
/// # Accuracy
/// A few ulp beyond the radiance's error; against mpmath (band ∂L/∂T by quadrature, the ideal
/// photon case as ∫D*(λ)·∂L_λ/∂T dλ; `tests/design_reference.rs`, 8 cases) within 1.3e-15
/// relative.
///
/// # Examples
/// ```
/// use quantaband::design::merit::{netd_from_d_star_optics, noise_bandwidth_hz};
/// use quantaband::design::{Band, DStarShape, InBand, Optics};
/// use quantaband::planck::Quantity;
/// // Invented LWIR microbolometer: D* = 1e9 m Hz^½/W (1e11 Jones), 17 µm, F/1, τ = 0.9, 16.7 ms.
/// let l = Band::wavelength(8e-6, 14e-6, Quantity::Energy).in_band(300.0).unwrap();
/// let df = noise_bandwidth_hz(16.7e-3).unwrap();
/// let netd = netd_from_d_star_optics(1e9, DStarShape::Flat, &l, &Optics::new(1.0, 0.9), 17e-6 * 17e-6, df).unwrap();
/// // 5·√Δf/(π·0.9·1e9·17e-6·0.837 821 289 527 925 7) with ∂L/∂T from mpmath quad (8–14 µm, 300 K).
/// let by_hand = 5.0 * df.sqrt() / (core::f64::consts::PI * 0.9 * 1e9 * 17e-6 * 0.837_821_289_527_925_7);
/// assert!((netd / by_hand - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 6; Holst, *Testing and
/// Evaluation of Infrared Imaging Systems* (2008), ch. 7 — from memory.
pub fn netd_from_d_star_optics(
    d_star: f64,
    shape: DStarShape,
    scene: &InBandRadiance,
    optics: &Optics,
    pixel_area_m2: f64,
    bandwidth_hz: f64,
) -> Result<f64> {
    positive("d_star", d_star)?;
    let dp = d_power_dt_w_per_k(scene, shape, optics, pixel_area_m2)?;
    netd_from_d_star(d_star, pixel_area_m2, bandwidth_hz, dp)
}

/// D* (m·Hz^½·W⁻¹; at λp for an ideal photon detector) needed for a NETD of `netd_k` (K):
/// the inverse of [`netd_from_d_star_optics`].
///
/// # Formula
/// ```text
/// D* = (4F² + 1)·√Δf / (π·τ·NETD·√A·∂L/∂T·cos⁴θ)   (4F² in the small-angle form)
/// ```
///
/// # Errors
/// As [`netd_from_d_star_optics`], with `netd_k` in place of `d_star`.
///
/// # Accuracy
/// A few ulp; round trip within 2.9e-16 (`tests/design_properties.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::merit::{d_star_from_netd_optics, netd_from_d_star_optics};
/// use quantaband::design::{DStarShape, InBandRadiance, Optics, RadianceKind};
/// let l = InBandRadiance::new(RadianceKind::Energy, 54.93, 0.8378).unwrap();
/// let o = Optics::new(1.0, 0.9);
/// let netd = netd_from_d_star_optics(1e9, DStarShape::Flat, &l, &o, 289e-12, 30.0).unwrap();
/// let back = d_star_from_netd_optics(netd, DStarShape::Flat, &l, &o, 289e-12, 30.0).unwrap();
/// assert!((back / 1e9 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman (1996), ch. 6 — from memory.
pub fn d_star_from_netd_optics(
    netd_k: f64,
    shape: DStarShape,
    scene: &InBandRadiance,
    optics: &Optics,
    pixel_area_m2: f64,
    bandwidth_hz: f64,
) -> Result<f64> {
    let dp = d_power_dt_w_per_k(scene, shape, optics, pixel_area_m2)?;
    d_star_from_netd(netd_k, pixel_area_m2, bandwidth_hz, dp)
}

/// First-principles NETD (K): total noise `noise_electrons` (electrons rms) over the change of
/// signal electrons per kelvin of scene temperature `d_signal_electrons_dt` (electrons/K).
///
/// # Formula
/// ```text
/// NETD = σ/(∂N_s/∂T)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for either argument.
///
/// # Accuracy
/// Correctly rounded.
///
/// # Examples
/// ```
/// use quantaband::design::merit::netd_from_noise;
/// assert_eq!(netd_from_noise(500.0, 2.0e4).unwrap(), 0.025);
/// ```
///
/// # References
/// Holst, *Testing and Evaluation of Infrared Imaging Systems* (2008), ch. 7 (NETD as noise
/// over signal transfer) — from memory.
pub fn netd_from_noise(noise_electrons: f64, d_signal_electrons_dt: f64) -> Result<f64> {
    positive("noise_electrons", noise_electrons)?;
    positive("d_signal_electrons_dt", d_signal_electrons_dt)?;
    Ok(noise_electrons / d_signal_electrons_dt)
}

/// Detector mechanism, for the background-limited D*.
///
/// # Formula
/// ```text
/// Photovoltaic: noise variance = mean count (shot noise)                   m = 2
/// Photoconductive: generation and recombination both fluctuate (× 2)      m = 4
/// D*_BLIP = (λ/(hc))·√(η/(m·Φ_B))
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::Mechanism;
/// assert_ne!(Mechanism::Photovoltaic, Mechanism::Photoconductive);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Mechanism {
    /// Photodiode (shot noise only).
    Photovoltaic,
    /// Photoconductor (generation–recombination noise, √2 more noise).
    Photoconductive,
}

/// What the detector sees of its background.
///
/// # Formula
/// ```text
/// ColdStop { F, cone }:  Ω = π/(4F² + 1) (Exact) or π/(4F²) (SmallAngle)
/// Hemisphere:            Ω = π
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::{BackgroundView, ConeForm};
/// let v = BackgroundView::ColdStop { f_number: 2.0, cone: ConeForm::Exact };
/// assert!(matches!(v, BackgroundView::ColdStop { .. }));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum BackgroundView {
    /// A cold stop (cold shield) of f-number `f_number` limits the view; outside it the
    /// shield is cold enough to contribute nothing.
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    ColdStop {
        /// Cold-stop f-number (> 0).
        f_number: f64,
        /// 4F² + 1 or 4F².
        cone: ConeForm,
    },
    /// The whole hemisphere at the background temperature (no cold shield).
    Hemisphere,
}

impl BackgroundView {
    /// Projected solid angle (sr) of this view.
    ///
    /// # Formula
    /// ```text
    /// ColdStop: π/(4F² + 1) or π/(4F²);  Hemisphere: π
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` for a cold-stop `f_number`.
    ///
    /// # Accuracy
    /// A few ulp.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::BackgroundView;
    /// assert_eq!(BackgroundView::Hemisphere.projected_solid_angle_sr().unwrap(), core::f64::consts::PI);
    /// ```
    ///
    /// # References
    /// Wolfe, *Introduction to Radiometry* (1998), ch. 2 — from memory.
    pub fn projected_solid_angle_sr(&self) -> Result<f64> {
        match *self {
            BackgroundView::ColdStop { f_number, cone } => projected_solid_angle_sr(f_number, cone),
            BackgroundView::Hemisphere => Ok(PI),
        }
    }
}

/// The background photon flux density (photons·s⁻¹·m⁻²) on an ideal photon detector with
/// cut-off `cutoff_wavelength_m`, and its logarithm (finite even where the flux underflows).
fn background_photon_flux_and_ln(
    cutoff_wavelength_m: f64,
    background_temperature_k: f64,
    view: &BackgroundView,
) -> Result<(f64, f64)> {
    spectral("cutoff_wavelength_m", cutoff_wavelength_m)?;
    temperature("background_temperature_k", background_temperature_k)?;
    let omega = view.projected_solid_angle_sr()?;
    // 0…λc in wavelength = 1/λc…∞ in wavenumber; f64::MAX stands for ∞ (the band kernel's
    // tail series takes any upper limit).
    let spec = Spectrum::new(
        SpectralVariable::Wavenumber,
        Quantity::Photon,
        Geometry::Radiance,
    );
    let lower = 1.0 / cutoff_wavelength_m;
    let l = crate::band::band(&spec, lower, f64::MAX, background_temperature_k)?;
    let q = omega * l;
    if q.is_normal() {
        return Ok((q, float::ln(q)));
    }
    let ln_l =
        crate::band::ln_band_unchecked(&spec, lower, f64::MAX, background_temperature_k, false);
    // Ω overflows only in the small-angle form with F below ~1e-154: ln Ω = ln(π/4) − 2 ln F.
    let ln_omega = match view {
        BackgroundView::ColdStop { f_number, .. } if omega.is_infinite() => {
            float::ln(core::f64::consts::FRAC_PI_4) - 2.0 * float::ln(*f_number)
        }
        _ => float::ln(omega),
    };
    let ln_q = ln_omega + ln_l;
    // Ω = ∞ with a band below the f64 range would give ∞·0: the product from the logarithms.
    let q = if q.is_nan() || q.is_infinite() {
        float::exp(ln_q)
    } else {
        q
    };
    Ok((q, ln_q))
}

/// Background photon flux density (photons·s⁻¹·m⁻²) on an ideal photon detector with cut-off
/// `cutoff_wavelength_m` (m; it absorbs every wavelength below) viewing a blackbody background
/// at `background_temperature_k` (K) through `view`.
///
/// # Formula
/// ```text
/// Φ_B = Ω·∫₀^λc L_q,λ(λ, T_B) dλ,   L_q,λ = 2c/λ⁴/(exp(c₂/(λT_B)) − 1)
/// Ω from the view (cold stop π/(4F² + 1) or π/(4F²), hemisphere π)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveSpectral` (`cutoff_wavelength_m`), `NonFinite` /
/// `NonPositiveTemperature` (`background_temperature_k`), and the view's errors.
/// Valid inputs whose true flux is above `f64::MAX` (background temperatures near the top of the
/// f64 range) give +∞.
///
/// # Accuracy
/// As the core's band integral (≤ 1.7e-14); against mpmath (quadrature over θ, and over x =
/// c₂/(λT) cross-checked with polylogarithms; `tests/design_reference.rs`, 8 backgrounds from
/// 3 K to 300 K) within 4.7e-15 relative. 0 only below the f64 range.
///
/// # Examples
/// ```
/// use quantaband::design::merit::background_photon_flux;
/// use quantaband::design::BackgroundView;
/// // 0–5 µm of a 300 K hemisphere: π × 4.201 061 850 293 917e19 photons s⁻¹ m⁻² sr⁻¹
/// // (mpmath quad of the Planck photon radiance, tests/data/gen_design.py).
/// let q = background_photon_flux(5e-6, 300.0, &BackgroundView::Hemisphere).unwrap();
/// assert!((q / (core::f64::consts::PI * 4.201_061_850_293_917e19) - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5 (background photon
/// flux) — from memory; Howell et al., *Thermal Radiation Heat Transfer* (2020), ch. 1.
pub fn background_photon_flux(
    cutoff_wavelength_m: f64,
    background_temperature_k: f64,
    view: &BackgroundView,
) -> Result<f64> {
    Ok(background_photon_flux_and_ln(cutoff_wavelength_m, background_temperature_k, view)?.0)
}

/// Background-limited D* (m·Hz^½·W⁻¹) at `wavelength_m` (m) of a detector of quantum
/// efficiency `quantum_efficiency` under a background photon flux density
/// `background_photon_flux` (photons·s⁻¹·m⁻²).
///
/// # Formula
/// ```text
/// photovoltaic:    D* = (λ/(hc))·√(η/(2Φ_B))
/// photoconductive: D* = (λ/(2hc))·√(η/Φ_B)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveSpectral` (`wavelength_m`), `NonFinite` / `OutOfRange`
/// (`quantum_efficiency` outside (0, 1]), `NonFinite` / `NonPositive`
/// (`background_photon_flux`).
/// A true D* above `f64::MAX` (a flux near the bottom of the f64 range) is +∞.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::design::merit::blip_d_star_from_flux;
/// use quantaband::design::Mechanism;
/// let pv = blip_d_star_from_flux(5e-6, 1.0, 1e20, Mechanism::Photovoltaic).unwrap();
/// let pc = blip_d_star_from_flux(5e-6, 1.0, 1e20, Mechanism::Photoconductive).unwrap();
/// assert!((pv / pc - 2f64.sqrt()).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5 (BLIP D*, the √2 between
/// photovoltaic and photoconductive detectors); P. W. Kruse, L. D. McGlauchlin & R. B.
/// McQuistan, *Elements of Infrared Technology*, Wiley (1962) — from memory.
pub fn blip_d_star_from_flux(
    wavelength_m: f64,
    quantum_efficiency: f64,
    background_photon_flux: f64,
    mechanism: Mechanism,
) -> Result<f64> {
    spectral("wavelength_m", wavelength_m)?;
    unit_interval_open_closed("quantum_efficiency", quantum_efficiency)?;
    positive("background_photon_flux", background_photon_flux)?;
    let m = mechanism_factor(mechanism);
    let hc = PLANCK_H * SPEED_OF_LIGHT_C;
    let d = wavelength_m / hc * float::sqrt(quantum_efficiency / m)
        / float::sqrt(background_photon_flux);
    if d.is_finite() && d > 0.0 {
        return Ok(d);
    }
    // λ/hc overflowed (λ > 3.6e283 m) or η/m underflowed (η subnormal): ∞·0 = NaN, or a
    // spurious ∞ or 0. √η/√m/√Φ first, then λ, then 1/hc (which only enlarges).
    let k = float::sqrt(quantum_efficiency) / float::sqrt(m) / float::sqrt(background_photon_flux);
    Ok(wavelength_m * k / hc)
}

fn mechanism_factor(mechanism: Mechanism) -> f64 {
    match mechanism {
        Mechanism::Photovoltaic => 2.0,
        Mechanism::Photoconductive => 4.0,
    }
}

/// Background-limited D* (m·Hz^½·W⁻¹) at the cut-off `cutoff_wavelength_m` (m) of an ideal
/// photon detector of quantum efficiency `quantum_efficiency` that absorbs every wavelength
/// below the cut-off, viewing a blackbody background at `background_temperature_k` (K) through
/// `view` (a cold stop or the whole hemisphere).
///
/// # Formula
/// ```text
/// D* = (λc/(hc))·√(η/(m·Φ_B)),   m = 2 (photovoltaic) or 4 (photoconductive)
/// Φ_B = Ω·∫₀^λc L_q,λ(λ, T_B) dλ     (background_photon_flux)
/// ```
///
/// # Errors
/// Those of [`background_photon_flux`] and [`blip_d_star_from_flux`].
///
/// # Accuracy
/// As the band integral (≤ 1.7e-14); against mpmath (`tests/design_reference.rs`, 32 cases)
/// within 2.2e-15 relative. Where the background flux is below the f64 range the D* is formed
/// from logarithms and stays finite (∞ only beyond f64::MAX): a 3 K background on a 5 µm
/// cut-off (flux 4e-395 photons s⁻¹ m⁻²) gives D* = 2.73e216 within 4.3e-14 (the rounding of
/// ln Φ_B ≈ −909 is inherent).
///
/// # Examples
/// ```
/// use quantaband::design::merit::blip_d_star;
/// use quantaband::design::{BackgroundView, Mechanism};
/// // 5 µm cut-off, η = 1, 300 K hemisphere, photovoltaic: (λ/(hc))·√(1/(2Φ_B)) with
/// // Φ_B = π × 4.201 061 850 293 917e19 photons s⁻¹ m⁻² (mpmath quad).
/// let d = blip_d_star(5e-6, 1.0, 300.0, &BackgroundView::Hemisphere, Mechanism::Photovoltaic).unwrap();
/// let phi = core::f64::consts::PI * 4.201_061_850_293_917e19;
/// let by_hand = 5e-6 / (6.626_070_15e-34 * 299_792_458.0) / (2.0 * phi).sqrt();
/// assert!((d / by_hand - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5 — from memory.
pub fn blip_d_star(
    cutoff_wavelength_m: f64,
    quantum_efficiency: f64,
    background_temperature_k: f64,
    view: &BackgroundView,
    mechanism: Mechanism,
) -> Result<f64> {
    spectral("cutoff_wavelength_m", cutoff_wavelength_m)?;
    unit_interval_open_closed("quantum_efficiency", quantum_efficiency)?;
    let (q, ln_q) =
        background_photon_flux_and_ln(cutoff_wavelength_m, background_temperature_k, view)?;
    let hc = PLANCK_H * SPEED_OF_LIGHT_C;
    let m = mechanism_factor(mechanism);
    if q.is_normal() {
        return blip_d_star_from_flux(cutoff_wavelength_m, quantum_efficiency, q, mechanism);
    }
    // The flux is outside the normal f64 range: combine in logarithms.
    let ln_d = float::ln(cutoff_wavelength_m) - float::ln(hc)
        + 0.5 * (float::ln(quantum_efficiency) - float::ln(m) - ln_q);
    Ok(float::exp(ln_d))
}
