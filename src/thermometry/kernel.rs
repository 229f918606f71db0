//! The Planck values the response-weighted integrals need at one node, from the radiometric
//! core ([`crate::planck::Spectrum`]): blackbody spectral radiance per wavelength and its
//! temperature derivative, for a chosen c2 convention.
#![forbid(unsafe_code)]

use crate::constants::C2Convention;
use crate::planck::Spectrum;
use crate::Result;

/// (L_λ, ∂L_λ/∂T) in W·m⁻³·sr⁻¹ and W·m⁻³·sr⁻¹·K⁻¹ at `wavelength_m`, `temperature_k`.
///
/// # Errors
/// Those of [`Spectrum::spectral`] (bad wavelength or temperature).
#[inline]
pub(crate) fn radiance_and_dt(
    wavelength_m: f64,
    temperature_k: f64,
    c2: C2Convention,
) -> Result<(f64, f64)> {
    let s = Spectrum::BLACKBODY.with_c2(c2);
    Ok((
        s.spectral(wavelength_m, temperature_k)?,
        s.spectral_d_dt(wavelength_m, temperature_k)?,
    ))
}

/// (ε·L_λ, ε·∂L_λ/∂T) for a scale factor ε in (0, 1] (an exact power of two chosen by the
/// caller so that the values stay below the f64 overflow threshold at extreme temperatures).
///
/// # Errors
/// Those of [`Spectrum::spectral`].
#[inline]
pub(crate) fn scaled_radiance_and_dt(
    wavelength_m: f64,
    temperature_k: f64,
    c2: C2Convention,
    scale: f64,
) -> Result<(f64, f64)> {
    let s = Spectrum::BLACKBODY.with_c2(c2).with_emissivity(scale);
    Ok((
        s.spectral(wavelength_m, temperature_k)?,
        s.spectral_d_dt(wavelength_m, temperature_k)?,
    ))
}

/// ε·L_λ for a scale factor ε in (0, 1] (see [`scaled_radiance_and_dt`]), W·m⁻³·sr⁻¹.
///
/// # Errors
/// Those of [`Spectrum::spectral`].
#[inline]
pub(crate) fn scaled_radiance(
    wavelength_m: f64,
    temperature_k: f64,
    c2: C2Convention,
    scale: f64,
) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_c2(c2)
        .with_emissivity(scale)
        .spectral(wavelength_m, temperature_k)
}

/// (s·L, s·∂L/∂T) per wavelength in energy (W·m⁻³·sr⁻¹) or photon (photons·s⁻¹·m⁻³·sr⁻¹)
/// units, for a scale factor s in (0, 1] (an exact power of two, as in
/// [`scaled_radiance_and_dt`]). Used by the spectral measurement equation.
///
/// # Errors
/// Those of [`Spectrum::spectral`].
#[inline]
pub(crate) fn quantity_radiance_and_dt(
    wavelength_m: f64,
    temperature_k: f64,
    c2: C2Convention,
    photon: bool,
    scale: f64,
) -> Result<(f64, f64)> {
    let s = spectrum(c2, photon, scale);
    Ok((
        s.spectral(wavelength_m, temperature_k)?,
        s.spectral_d_dt(wavelength_m, temperature_k)?,
    ))
}

/// s·L alone (see [`quantity_radiance_and_dt`]).
///
/// # Errors
/// Those of [`Spectrum::spectral`].
#[inline]
pub(crate) fn quantity_radiance(
    wavelength_m: f64,
    temperature_k: f64,
    c2: C2Convention,
    photon: bool,
    scale: f64,
) -> Result<f64> {
    spectrum(c2, photon, scale).spectral(wavelength_m, temperature_k)
}

#[inline]
fn spectrum(c2: C2Convention, photon: bool, scale: f64) -> Spectrum {
    let q = if photon {
        crate::planck::Quantity::Photon
    } else {
        crate::planck::Quantity::Energy
    };
    Spectrum::BLACKBODY
        .with_c2(c2)
        .with_quantity(q)
        .with_emissivity(scale)
}
