//! What a scene delivers in the instrument's band: the in-band radiance and its temperature
//! derivative ([`InBandRadiance`]), and the [`InBand`] trait through which a rectangular band,
//! a narrow band around one spectral point, or a response-weighted signal model provides them.
//!
//! See the [module docs of `design`](super) for why this value, and not a spectral table, is
//! the interface of the instrument-level functions.
#![forbid(unsafe_code)]

use crate::band;
use crate::error::{finite, positive};
use crate::planck::{Geometry, Quantity, Spectrum};
use crate::thermometry::SignalModel;
use crate::{Error, Result};

/// The unit family of an in-band radiance (and of the flux it gives on a pixel).
///
/// | kind | radiance | flux on a pixel | turned into electrons by |
/// |---|---|---|---|
/// | `Energy` | W·m⁻²·sr⁻¹ | W | a responsivity in A/W |
/// | `Photon` | photons·s⁻¹·m⁻²·sr⁻¹ | photons/s | a quantum efficiency |
/// | `Current` | A·m⁻²·sr⁻¹ (∫ℜ(λ)L_λ dλ, ℜ in A/W) | A | nothing more (÷ e) |
/// | `Electron` | electrons·s⁻¹·m⁻²·sr⁻¹ (∫η(λ)L_q,λ dλ) | electrons/s | nothing more |
///
/// # Examples
/// ```
/// use quantaband::design::RadianceKind;
/// assert_eq!(RadianceKind::Photon.flux_unit(), "photons/s");
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum RadianceKind {
    /// Radiant energy: W·m⁻²·sr⁻¹ (possibly weighted by a relative, dimensionless response).
    Energy,
    /// Photon number: photons·s⁻¹·m⁻²·sr⁻¹.
    Photon,
    /// Weighted by a spectral responsivity in A/W: A·m⁻²·sr⁻¹.
    Current,
    /// Weighted by a quantum efficiency: electrons·s⁻¹·m⁻²·sr⁻¹.
    Electron,
}

impl RadianceKind {
    /// The SI unit of a radiance of this kind, as text.
    ///
    /// # Formula
    /// ```text
    /// Energy → "W/(m2 sr)", Photon → "photons/(s m2 sr)", Current → "A/(m2 sr)",
    /// Electron → "electrons/(s m2 sr)"
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::RadianceKind;
    /// assert_eq!(RadianceKind::Energy.radiance_unit(), "W/(m2 sr)");
    /// ```
    ///
    /// # References
    /// BIPM, *The International System of Units*, 9th ed. (2019).
    pub const fn radiance_unit(self) -> &'static str {
        match self {
            RadianceKind::Energy => "W/(m2 sr)",
            RadianceKind::Photon => "photons/(s m2 sr)",
            RadianceKind::Current => "A/(m2 sr)",
            RadianceKind::Electron => "electrons/(s m2 sr)",
        }
    }

    /// The SI unit of the flux on a pixel of this kind (radiance × étendue), as text.
    ///
    /// # Formula
    /// ```text
    /// Energy → "W", Photon → "photons/s", Current → "A", Electron → "electrons/s"
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::RadianceKind;
    /// assert_eq!(RadianceKind::Current.flux_unit(), "A");
    /// ```
    ///
    /// # References
    /// BIPM, *The International System of Units*, 9th ed. (2019).
    pub const fn flux_unit(self) -> &'static str {
        match self {
            RadianceKind::Energy => "W",
            RadianceKind::Photon => "photons/s",
            RadianceKind::Current => "A",
            RadianceKind::Electron => "electrons/s",
        }
    }
}

/// In-band radiance of a scene and its derivative with respect to the scene temperature.
///
/// `radiance` is in the unit of `kind` ([`RadianceKind::radiance_unit`]), `d_radiance_dt` in
/// the same unit per kelvin. Both must be finite and ≥ 0 (see [`InBandRadiance::new`]).
///
/// # Examples
/// ```
/// use quantaband::design::{InBandRadiance, RadianceKind};
/// let l = InBandRadiance::new(RadianceKind::Energy, 54.93, 0.8378).unwrap();
/// assert_eq!(l.kind, RadianceKind::Energy);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct InBandRadiance {
    /// Unit family of the two values.
    pub kind: RadianceKind,
    /// In-band radiance (unit of `kind`).
    pub radiance: f64,
    /// Its derivative with respect to the scene temperature (unit of `kind` per K).
    pub d_radiance_dt: f64,
}

impl InBandRadiance {
    /// A validated in-band radiance (unit of `kind`) and temperature derivative (per K).
    ///
    /// # Formula
    /// ```text
    /// accepted iff radiance and d_radiance_dt are finite and ≥ 0
    /// ```
    ///
    /// # Errors
    /// `NonFinite` for a NaN or infinite value; `OutOfRange` (range `[0, inf)`) for a negative
    /// one.
    ///
    /// # Accuracy
    /// Exact (validation only).
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{InBandRadiance, RadianceKind};
    /// let e = InBandRadiance::new(RadianceKind::Photon, -1.0, 0.0).unwrap_err();
    /// assert_eq!(e.code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn new(kind: RadianceKind, radiance: f64, d_radiance_dt: f64) -> Result<Self> {
        let v = InBandRadiance {
            kind,
            radiance,
            d_radiance_dt,
        };
        v.validate()?;
        Ok(v)
    }

    /// Checks that both values are finite and ≥ 0 (the fields are public).
    ///
    /// # Formula
    /// ```text
    /// 0 ≤ radiance < ∞,  0 ≤ d_radiance_dt < ∞
    /// ```
    ///
    /// # Errors
    /// As [`InBandRadiance::new`].
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{InBandRadiance, RadianceKind};
    /// let v = InBandRadiance { kind: RadianceKind::Energy, radiance: f64::NAN, d_radiance_dt: 0.0 };
    /// assert_eq!(v.validate().unwrap_err().code(), "NON_FINITE");
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn validate(&self) -> Result<()> {
        non_negative("radiance", self.radiance)?;
        non_negative("d_radiance_dt", self.d_radiance_dt)?;
        Ok(())
    }
}

/// Checks that a value is finite and ≥ 0.
pub(crate) fn non_negative(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if value >= 0.0 {
        Ok(value)
    } else {
        Err(Error::OutOfRange {
            arg,
            value,
            range: "[0, inf)",
        })
    }
}

/// Anything that gives the in-band radiance of a scene and its temperature derivative at a
/// scene temperature (K). The instrument-level functions of [`super`] take its output.
///
/// Implemented by [`Band`] (rectangular band, exact), [`Line`] (narrow band around one
/// spectral point) and [`ModelRadiance`] (any [`SignalModel`], e.g. a response table). A
/// spectral-table type implements it to plug into the same functions.
pub trait InBand {
    /// In-band radiance and ∂/∂T at `temperature_k` (K).
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature` for a bad temperature, and the provider's own
    /// errors (see each implementation).
    fn in_band(&self, temperature_k: f64) -> Result<InBandRadiance>;
}

/// A rectangular band of a [`Spectrum`] (energy or photon radiance of a grey body in a medium,
/// with its c₂ convention), integrated exactly by [`crate::band::band`] and
/// [`crate::band::band_d_dt`].
///
/// `lower < upper` in the SI unit of `spectrum.variable` (m, m⁻¹ or Hz); `upper` may be
/// `f64::MAX` for an open-ended band (e.g. wavenumbers above 1/λc = wavelengths 0…λc).
/// `spectrum.geometry` must be [`Geometry::Radiance`].
///
/// # Formula
/// ```text
/// L = ∫_lower^upper S(v, T) dv,   ∂L/∂T = ∫ ∂S/∂T dv     (S the spectrum's density)
/// kind = Energy for Quantity::Energy, Photon for Quantity::Photon
/// ```
///
/// # Errors
/// `Unsupported` for an exitance spectrum; otherwise those of [`crate::band::band`].
///
/// # Accuracy
/// That of the core's band functions: ≤ 1.7e-14 relative against mpmath (README accuracy
/// list); the photon rows of `tests/data/design_reference.json` agree within 2e-15.
///
/// # Examples
/// ```
/// use quantaband::design::{Band, InBand, RadianceKind};
/// use quantaband::planck::Quantity;
/// let b = Band::wavelength(8e-6, 14e-6, Quantity::Photon).in_band(300.0).unwrap();
/// assert_eq!(b.kind, RadianceKind::Photon);
/// // mpmath quad of the Planck photon radiance, 8–14 µm, 300 K: 3.008 838 695 169 880e21
/// // photons s⁻¹ m⁻² sr⁻¹ (30 digits).
/// assert!((b.radiance / 3.008_838_695_169_880e21 - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Howell, Mengüç, Daun & Siegel, *Thermal Radiation Heat Transfer*, 7th ed. (2020), ch. 1;
/// Widger & Woodall, Bull. Am. Meteorol. Soc. 57, 1217 (1976).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Band {
    /// Spectral variable, quantity, emissivity, medium index and c₂ of the scene.
    pub spectrum: Spectrum,
    /// Lower band limit in the SI unit of `spectrum.variable`.
    pub lower: f64,
    /// Upper band limit in the SI unit of `spectrum.variable` (`f64::MAX` for open-ended).
    pub upper: f64,
}

impl Band {
    /// A band of `spectrum` between `lower` and `upper` (SI unit of its variable).
    ///
    /// # Formula
    /// ```text
    /// Band { spectrum, lower, upper }   (validated when used)
    /// ```
    ///
    /// # Errors
    /// None here; see [`Band`].
    ///
    /// # Accuracy
    /// Exact: the values are stored.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Band;
    /// use quantaband::planck::Spectrum;
    /// let b = Band::new(Spectrum::default(), 3e-6, 5e-6);
    /// assert_eq!(b.upper, 5e-6);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1.
    pub const fn new(spectrum: Spectrum, lower: f64, upper: f64) -> Self {
        Band {
            spectrum,
            lower,
            upper,
        }
    }

    /// A blackbody band between two vacuum wavelengths (m) in energy or photon units.
    ///
    /// # Formula
    /// ```text
    /// Band { spectrum: blackbody radiance per wavelength (ε = 1, n = 1, CODATA c₂) with
    ///        quantity, lower: lower_m, upper: upper_m }
    /// ```
    ///
    /// # Errors
    /// None here; see [`Band`].
    ///
    /// # Accuracy
    /// Exact: the values are stored.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Band;
    /// use quantaband::planck::Quantity;
    /// let b = Band::wavelength(3e-6, 5e-6, Quantity::Photon);
    /// assert_eq!(b.spectrum.quantity, Quantity::Photon);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1.
    pub const fn wavelength(lower_m: f64, upper_m: f64, quantity: Quantity) -> Self {
        Band {
            spectrum: Spectrum::BLACKBODY.with_quantity(quantity),
            lower: lower_m,
            upper: upper_m,
        }
    }
}

fn radiance_kind(spectrum: &Spectrum) -> Result<RadianceKind> {
    if spectrum.geometry != Geometry::Radiance {
        return Err(Error::Unsupported {
            what: "an exitance spectrum; in-band radiance needs Geometry::Radiance",
        });
    }
    Ok(match spectrum.quantity {
        Quantity::Energy => RadianceKind::Energy,
        Quantity::Photon => RadianceKind::Photon,
    })
}

impl InBand for Band {
    fn in_band(&self, temperature_k: f64) -> Result<InBandRadiance> {
        let kind = radiance_kind(&self.spectrum)?;
        let radiance = band::band(&self.spectrum, self.lower, self.upper, temperature_k)?;
        let d_radiance_dt = band::band_d_dt(&self.spectrum, self.lower, self.upper, temperature_k)?;
        InBandRadiance::new(kind, radiance, d_radiance_dt)
    }
}

/// A narrow band of width `width` centred on one spectral point of a [`Spectrum`]: the
/// spectral density at the centre times the width.
///
/// `centre` and `width` are in the SI unit of `spectrum.variable`; `spectrum.geometry` must be
/// [`Geometry::Radiance`].
///
/// # Formula
/// ```text
/// L ≈ S(v₀, T)·Δv,   ∂L/∂T ≈ ∂S/∂T(v₀, T)·Δv      (v₀ centre, Δv width)
/// ```
///
/// # Errors
/// `Unsupported` for an exitance spectrum; `NonFinite` / `NonPositive` for `width`; those of
/// [`Spectrum::spectral`] for the centre and temperature.
///
/// # Accuracy
/// The midpoint rule: the relative error is about (Δv²/24)·S″/S — measured against mpmath quad
/// (`tests/design_reference.rs`, photon units): 2.0e-5 for 0.1 µm at 10 µm and 2.9e-4 for
/// 0.05 µm at 4 µm (300 K), 8.9e-4 for 10 nm at 650 nm (1500 K). Use [`Band`] when the exact
/// band value matters.
///
/// # Examples
/// ```
/// use quantaband::design::{InBand, Line};
/// use quantaband::planck::{Quantity, Spectrum};
/// let line = Line { spectrum: Spectrum::default().with_quantity(Quantity::Photon), centre: 10e-6, width: 0.1e-6 };
/// // L_q,λ(10 µm, 300 K) = 4.995 874 060 375 493e26 photons s⁻¹ m⁻² sr⁻¹ m⁻¹ (mpmath), × 0.1 µm.
/// let v = line.in_band(300.0).unwrap();
/// assert!((v.radiance / 4.995_874_060_375_493e19 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Midpoint rule: Abramowitz & Stegun, *Handbook of Mathematical Functions* (1964), 25.4.2.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Line {
    /// Spectral variable, quantity, emissivity, medium index and c₂ of the scene.
    pub spectrum: Spectrum,
    /// Centre of the band in the SI unit of `spectrum.variable`.
    pub centre: f64,
    /// Full width of the band in the SI unit of `spectrum.variable` (> 0).
    pub width: f64,
}

impl InBand for Line {
    fn in_band(&self, temperature_k: f64) -> Result<InBandRadiance> {
        let kind = radiance_kind(&self.spectrum)?;
        positive("width", self.width)?;
        let s = self.spectrum.spectral(self.centre, temperature_k)?;
        let ds = self.spectrum.spectral_d_dt(self.centre, temperature_k)?;
        InBandRadiance::new(kind, s * self.width, ds * self.width)
    }
}

/// Any [`SignalModel`] — in particular the response-table integral
/// [`crate::thermometry::ResponseSignal`], S(T) = ∫R(λ)·L_λ(λ, T) dλ — read as an in-band
/// radiance of a declared kind.
///
/// The kind states the unit of the model's signal: a responsivity table in A/W gives
/// [`RadianceKind::Current`] (A·m⁻²·sr⁻¹); a relative (dimensionless) response gives a
/// weighted [`RadianceKind::Energy`] (W·m⁻²·sr⁻¹, to be multiplied by the peak responsivity);
/// a model of ∫η(λ)·L_q,λ dλ gives [`RadianceKind::Electron`].
///
/// # Formula
/// ```text
/// L = S(T),  ∂L/∂T = dS/dT        (the model's signal_and_derivative)
/// ```
///
/// # Errors
/// Those of the model; `NonFinite` / `OutOfRange` if it returns a non-finite or negative value.
///
/// # Accuracy
/// That of the model (≤ 3e-13 relative for `ResponseSignal`, README accuracy list).
///
/// # Examples
/// ```
/// use quantaband::design::{InBand, ModelRadiance, RadianceKind};
/// use quantaband::thermometry::{Response, ResponseSignal};
/// let (wl, amps_per_watt) = ([8e-6, 14e-6], [2.0, 2.0]);
/// let table = ResponseSignal::new(Response::new(&wl, &amps_per_watt).unwrap(), Default::default());
/// let v = ModelRadiance::new(&table, RadianceKind::Current).in_band(300.0).unwrap();
/// // 2 A/W × 54.933 461 376 839 69 W m⁻² sr⁻¹ (8–14 µm at 300 K, mpmath quad).
/// assert!((v.radiance / (2.0 * 54.933_461_376_839_69) - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
/// Industry*, SPIE Press (2007), ch. 2 (response-weighted signal) — from memory.
#[derive(Debug, Clone, Copy)]
pub struct ModelRadiance<'a, M: ?Sized> {
    model: &'a M,
    kind: RadianceKind,
}

impl<'a, M: SignalModel + ?Sized> ModelRadiance<'a, M> {
    /// Wraps a signal model whose signal is a radiance of the given kind.
    ///
    /// # Formula
    /// See [`ModelRadiance`].
    ///
    /// # Errors
    /// None (the model is evaluated later).
    ///
    /// # Accuracy
    /// See [`ModelRadiance`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{ModelRadiance, RadianceKind};
    /// use quantaband::thermometry::SpectralPoint;
    /// let p = SpectralPoint::new(10e-6, Default::default()).unwrap();
    /// let m = ModelRadiance::new(&p, RadianceKind::Energy);
    /// assert_eq!(m.kind(), RadianceKind::Energy);
    /// ```
    ///
    /// # References
    /// See [`ModelRadiance`].
    pub fn new(model: &'a M, kind: RadianceKind) -> Self {
        ModelRadiance { model, kind }
    }

    /// The declared kind of the model's signal; see [`ModelRadiance::new`] for an example.
    pub fn kind(&self) -> RadianceKind {
        self.kind
    }
}

impl<M: SignalModel + ?Sized> InBand for ModelRadiance<'_, M> {
    fn in_band(&self, temperature_k: f64) -> Result<InBandRadiance> {
        let (s, ds) = self.model.signal_and_derivative(temperature_k)?;
        InBandRadiance::new(self.kind, s, ds)
    }
}
