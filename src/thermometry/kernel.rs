//! The Planck values the response-weighted integrals need at one node, from the radiometric
//! core ([`crate::planck::Spectrum`]): blackbody spectral radiance per wavelength and its
//! temperature derivative, for a chosen c2 convention.
#![forbid(unsafe_code)]

use crate::constants::C2Convention;
use crate::error;
use crate::planck::{Direct, Spectrum};
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

/// s·L_λ for a scale factor s in (0, 1] (an exact power of two chosen by the caller so that the
/// values stay below the f64 overflow threshold at extreme temperatures), in energy
/// (W·m⁻³·sr⁻¹) or photon units, at many wavelengths: the spectrum is checked and the
/// density's constants prepared once, not at every node (the value is the same as
/// [`Spectrum::spectral`]'s).
#[derive(Clone, Copy)]
pub(crate) struct ScaledRadiance {
    spec: Spectrum,
    direct: Direct,
}

impl ScaledRadiance {
    /// # Errors
    /// Those of [`Spectrum::validate`] (a scale outside (0, 1]).
    pub(crate) fn new(c2: C2Convention, photon: bool, scale: f64) -> Result<Self> {
        let spec = spectrum(c2, photon, scale);
        spec.validate()?;
        Ok(ScaledRadiance {
            direct: Direct::of(&spec),
            spec,
        })
    }

    /// s·L_λ at `wavelength_m` and `temperature_k`; the caller has checked the temperature
    /// (finite, positive).
    ///
    /// # Errors
    /// `NonFinite`/`NonPositiveSpectral` for `wavelength_m`, as [`Spectrum::spectral`].
    #[inline]
    pub(crate) fn at(&self, wavelength_m: f64, temperature_k: f64) -> Result<f64> {
        error::spectral("wavelength_m", wavelength_m)?;
        Ok(self.direct.density(&self.spec, wavelength_m, temperature_k))
    }

    /// [`ScaledRadiance::at`] at two wavelengths (the two nodes of a Gauss–Legendre pair),
    /// each lane exactly the single value (one vector with simd128).
    #[inline]
    pub(crate) fn at2(&self, wavelengths_m: [f64; 2], temperature_k: f64) -> Result<[f64; 2]> {
        error::spectral("wavelength_m", wavelengths_m[0])?;
        error::spectral("wavelength_m", wavelengths_m[1])?;
        Ok(self
            .direct
            .density2(&self.spec, wavelengths_m, temperature_k))
    }

    /// (s·L, s·∂L/∂T) at `wavelength_m` and `temperature_k` (checked by the caller).
    ///
    /// # Errors
    /// As [`ScaledRadiance::at`].
    pub(crate) fn at_and_dt(&self, wavelength_m: f64, temperature_k: f64) -> Result<(f64, f64)> {
        Ok((
            self.at(wavelength_m, temperature_k)?,
            self.spec.spectral_d_dt(wavelength_m, temperature_k)?,
        ))
    }
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
