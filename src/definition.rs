//! Definitions in user units: what a spectrum or an instrument *is*, as plain data that can be
//! stored, loaded and checked once, then turned into the core's SI objects.
//!
//! The physics modules take SI values ([`Spectrum`], [`SignalModel`] implementations,
//! [`Conditions`]). A user, a configuration file or the JavaScript package describes the same
//! things in the units they think in ("a response table in µm", "radiance per µm"). The types
//! here hold such a description:
//!
//! - [`SpectrumSettings`]: a Planck spectrum plus the unit of its spectral coordinates and the
//!   unit its density is "per";
//! - [`InstrumentModel`] (`alloc`): one wavelength, a response table ([`ResponseTable`], owned)
//!   or a Sakuma–Hattori curve, as a tagged enum (`"kind"`);
//! - [`MeasurementConditions`]: emissivity, surroundings, path and window, where a temperature
//!   whose weight is zero may be left out;
//! - [`InstrumentDefinition`] (`alloc`): a model with its measurement conditions.
//!
//! With the `serde` feature they (de)serialize with camelCase field names and reject unknown
//! fields, so an instrument can be kept as JSON and loaded again (`tests/definition_serde.rs`).
//! Each has a checking step (`spectrum()`, [`InstrumentModel::prepare`], [`MeasurementConditions::conditions`])
//! that validates it once and returns the SI objects; errors name the fields as they are
//! spelled in the serialized form.
#![forbid(unsafe_code)]

use crate::constants::C2Convention;
use crate::error::{self, Error, Result};
use crate::planck::{Geometry, Quantity, SpectralVariable, Spectrum};
use crate::thermometry::{Conditions, Window};
use crate::units::{SpectralKind, SpectralUnit};

#[cfg(feature = "alloc")]
use crate::thermometry::{Response, ResponseSignal, SakumaHattori, SignalModel, SpectralPoint};
#[cfg(feature = "alloc")]
use alloc::vec::Vec;

#[cfg(feature = "serde")]
fn one() -> f64 {
    1.0
}

/// A Planck spectrum in user units: the [`Spectrum`] fields, the unit of spectral coordinates
/// (points, band limits, peak positions) and the unit the spectral density is "per".
///
/// Defaults (serde: fields left out): variable = the kind of `unit`, energy radiance, ε = 1,
/// n = 1, CODATA 2018 c₂, density per `unit` (per the SI unit of the variable when `unit` is of
/// another kind, e.g. a photon-energy unit).
///
/// # Examples
/// ```
/// use quantaband::definition::SpectrumSettings;
/// use quantaband::units::SpectralUnit;
/// let s = SpectrumSettings::new(SpectralUnit::Micrometre);
/// // W·m⁻²·sr⁻¹ per µm: the density per metre × 1e-6 m/µm.
/// assert_eq!(s.density_factor().unwrap(), 1e-6);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct SpectrumSettings {
    /// Unit of every spectral coordinate given or returned.
    pub unit: SpectralUnit,
    /// What the density is per (default: the kind of `unit`; required for a photon-energy unit).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub variable: Option<SpectralVariable>,
    /// Energy or photon quantity (default energy).
    #[cfg_attr(feature = "serde", serde(default))]
    pub quantity: Quantity,
    /// Radiance or exitance (default radiance).
    #[cfg_attr(feature = "serde", serde(default))]
    pub geometry: Geometry,
    /// Grey-body emissivity in (0, 1] (default 1).
    #[cfg_attr(feature = "serde", serde(default = "one"))]
    pub emissivity: f64,
    /// Refractive index of the medium (> 0, default 1).
    #[cfg_attr(feature = "serde", serde(default = "one"))]
    pub refractive_index: f64,
    /// Second radiation constant convention (default CODATA 2018).
    #[cfg_attr(feature = "serde", serde(default))]
    pub c2: C2Convention,
    /// Unit the density is "per" (a unit of the variable's kind; default as described above).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub density_unit: Option<SpectralUnit>,
}

impl SpectrumSettings {
    /// A blackbody energy-radiance spectrum with coordinates in `unit` and every other field at
    /// its default.
    pub const fn new(unit: SpectralUnit) -> Self {
        SpectrumSettings {
            unit,
            variable: None,
            quantity: Quantity::Energy,
            geometry: Geometry::Radiance,
            emissivity: 1.0,
            refractive_index: 1.0,
            c2: C2Convention::Codata2018,
            density_unit: None,
        }
    }

    /// The spectral variable in use: `variable`, or the kind of `unit`.
    ///
    /// # Errors
    /// `Unsupported` when `unit` is a photon-energy unit and `variable` is not given.
    pub fn resolved_variable(&self) -> Result<SpectralVariable> {
        Ok(match (self.variable, self.unit.kind()) {
            (Some(v), _) => v,
            (None, SpectralKind::Wavelength) => SpectralVariable::Wavelength,
            (None, SpectralKind::Wavenumber) => SpectralVariable::Wavenumber,
            (None, SpectralKind::Frequency) => SpectralVariable::Frequency,
            (None, SpectralKind::PhotonEnergy) => {
                return Err(Error::Unsupported {
                    what: "variable is required when unit is a photon-energy unit (J, eV, meV): \
                           choose wavelength, wavenumber or frequency",
                })
            }
        })
    }

    /// The checked SI spectrum these settings describe.
    ///
    /// # Formula
    /// ```text
    /// Spectrum { variable (resolved), quantity, geometry, emissivity, refractive_index, c2 }
    /// ```
    ///
    /// # Errors
    /// `NonFinite`/`OutOfRange` for `emissivity` outside (0, 1]; `NonFinite`/`NonPositive` for
    /// `refractiveIndex`; those of [`SpectrumSettings::resolved_variable`] and
    /// [`SpectrumSettings::density_unit`].
    ///
    /// # Accuracy
    /// Exact (copies the fields).
    ///
    /// # Examples
    /// ```
    /// use quantaband::definition::SpectrumSettings;
    /// use quantaband::units::SpectralUnit;
    /// let mut s = SpectrumSettings::new(SpectralUnit::Nanometre);
    /// s.emissivity = 1.5;
    /// assert_eq!(s.spectrum().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// None (validation only).
    pub fn spectrum(&self) -> Result<Spectrum> {
        error::unit_interval_open_closed("emissivity", self.emissivity)?;
        error::positive("refractiveIndex", self.refractive_index)?;
        let s = Spectrum {
            variable: self.resolved_variable()?,
            quantity: self.quantity,
            geometry: self.geometry,
            emissivity: self.emissivity,
            refractive_index: self.refractive_index,
            c2: self.c2,
        };
        self.density_unit()?;
        Ok(s)
    }

    /// The unit the density is per: `density_unit`, else `unit` when it is of the variable's
    /// kind, else the SI unit of the variable.
    ///
    /// # Errors
    /// `Unsupported` when `density_unit` is not a unit of the variable's kind; those of
    /// [`SpectrumSettings::resolved_variable`].
    pub fn density_unit(&self) -> Result<SpectralUnit> {
        let kind = variable_kind(self.resolved_variable()?);
        match self.density_unit {
            Some(u) if u.kind() == kind => Ok(u),
            Some(_) => Err(Error::Unsupported {
                what: "densityUnit must be a unit of the spectral variable's kind (a wavelength \
                       unit per wavelength, a wavenumber unit per wavenumber, a frequency unit \
                       per frequency)",
            }),
            None if self.unit.kind() == kind => Ok(self.unit),
            None => Ok(kind.si_unit()),
        }
    }

    /// Factor from a density per SI unit of the variable to a density per
    /// [`SpectrumSettings::density_unit`] (e.g. 1e-6 for per µm, 100 for per cm⁻¹).
    ///
    /// # Formula
    /// ```text
    /// L per u = L per SI unit × (SI units in one u) = L_SI × si_factor(u)
    /// ```
    ///
    /// # Errors
    /// Those of [`SpectrumSettings::density_unit`].
    ///
    /// # Accuracy
    /// Exact decimal factors (rounded once to f64; 1 for the SI units).
    ///
    /// # Examples
    /// ```
    /// use quantaband::definition::SpectrumSettings;
    /// use quantaband::units::SpectralUnit;
    /// assert_eq!(SpectrumSettings::new(SpectralUnit::PerCentimetre).density_factor().unwrap(), 100.0);
    /// ```
    ///
    /// # References
    /// BIPM, The International System of Units (SI), 9th ed. (2019), Table 7 (prefixes).
    pub fn density_factor(&self) -> Result<f64> {
        Ok(self.density_unit()?.si_factor())
    }
}

/// The kind of spectral coordinate a [`SpectralVariable`] is.
pub const fn variable_kind(v: SpectralVariable) -> SpectralKind {
    match v {
        SpectralVariable::Wavelength => SpectralKind::Wavelength,
        SpectralVariable::Wavenumber => SpectralKind::Wavenumber,
        SpectralVariable::Frequency => SpectralKind::Frequency,
    }
}

/// A window between scene and instrument as written in a definition; the reflected
/// temperature may be left out when the reflectance is 0.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct WindowDefinition {
    /// τ_w in (0, 1].
    pub transmittance: f64,
    /// ρ_w in [0, 1), τ_w + ρ_w ≤ 1 (default 0).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub reflectance: Option<f64>,
    /// Window temperature, K.
    pub temperature_k: f64,
    /// Temperature of what the window reflects, K (required when the reflectance is > 0).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub reflected_temperature_k: Option<f64>,
}

/// Measurement conditions as written in a definition: every field may be left out; a
/// temperature is required only when its weight is not zero (reflected temperature when
/// ε < 1, path temperature when τ < 1).
///
/// # Examples
/// ```
/// use quantaband::definition::MeasurementConditions;
/// let c = MeasurementConditions { emissivity: Some(0.9), ..Default::default() };
/// // ε < 1 needs the reflected temperature
/// assert_eq!(c.conditions().unwrap_err().code(), "UNSUPPORTED");
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MeasurementConditions {
    /// Object emissivity ε in (0, 1] (default 1).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub emissivity: Option<f64>,
    /// Reflected (surroundings) temperature, K.
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub reflected_temperature_k: Option<f64>,
    /// Path transmittance τ in (0, 1] (default 1).
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub path_transmittance: Option<f64>,
    /// Path temperature, K.
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub path_temperature_k: Option<f64>,
    /// Optional window.
    #[cfg_attr(
        feature = "serde",
        serde(default, skip_serializing_if = "Option::is_none")
    )]
    pub window: Option<WindowDefinition>,
}

impl MeasurementConditions {
    /// The checked SI [`Conditions`]. A temperature left out whose weight is zero takes the
    /// value of [`Conditions::BLACKBODY`] (it then has no effect on any result).
    ///
    /// # Formula
    /// ```text
    /// ε = emissivity or 1; τ = pathTransmittance or 1; T_refl required if ε ≠ 1;
    /// T_path required if τ ≠ 1; window: ρ_w = reflectance or 0, T_w,refl required if ρ_w ≠ 0
    /// (else = T_w)
    /// ```
    ///
    /// # Errors
    /// `Unsupported` for a required temperature left out; those of [`Conditions::validate`].
    ///
    /// # Accuracy
    /// Exact (copies the fields).
    ///
    /// # Examples
    /// ```
    /// use quantaband::definition::MeasurementConditions;
    /// let c = MeasurementConditions { path_transmittance: Some(0.9), path_temperature_k: Some(290.0), ..Default::default() };
    /// assert_eq!(c.conditions().unwrap().path_temperature_k, 290.0);
    /// ```
    ///
    /// # References
    /// None (validation only).
    pub fn conditions(&self) -> Result<Conditions> {
        let bb = Conditions::BLACKBODY;
        let emissivity = self.emissivity.unwrap_or(1.0);
        let path_transmittance = self.path_transmittance.unwrap_or(1.0);
        let reflected_temperature_k = match self.reflected_temperature_k {
            Some(t) => t,
            None if emissivity == 1.0 => bb.reflected_temperature_k,
            None => {
                return Err(Error::Unsupported {
                    what: "reflectedTemperatureK is required when emissivity < 1",
                })
            }
        };
        let path_temperature_k = match self.path_temperature_k {
            Some(t) => t,
            None if path_transmittance == 1.0 => bb.path_temperature_k,
            None => {
                return Err(Error::Unsupported {
                    what: "pathTemperatureK is required when pathTransmittance < 1",
                })
            }
        };
        let window = match self.window {
            None => None,
            Some(w) => {
                let reflectance = w.reflectance.unwrap_or(0.0);
                let reflected = match w.reflected_temperature_k {
                    Some(t) => t,
                    None if reflectance == 0.0 => w.temperature_k,
                    None => {
                        return Err(Error::Unsupported {
                            what: "window.reflectedTemperatureK is required when \
                                   window.reflectance > 0",
                        })
                    }
                };
                Some(Window {
                    transmittance: w.transmittance,
                    reflectance,
                    temperature_k: w.temperature_k,
                    reflected_temperature_k: reflected,
                })
            }
        };
        let c = Conditions {
            emissivity,
            reflected_temperature_k,
            path_transmittance,
            path_temperature_k,
            window,
        };
        validate_conditions(&c)?;
        Ok(c)
    }
}

/// [`Conditions::validate`] with the field names of the serialized form.
fn validate_conditions(c: &Conditions) -> Result<()> {
    error::unit_interval_open_closed("emissivity", c.emissivity)?;
    error::temperature("reflectedTemperatureK", c.reflected_temperature_k)?;
    error::unit_interval_open_closed("pathTransmittance", c.path_transmittance)?;
    error::temperature("pathTemperatureK", c.path_temperature_k)?;
    if let Some(w) = c.window {
        error::unit_interval_open_closed("window.transmittance", w.transmittance)?;
        error::unit_interval_closed("window.reflectance", w.reflectance)?;
        error::temperature("window.temperatureK", w.temperature_k)?;
        error::temperature("window.reflectedTemperatureK", w.reflected_temperature_k)?;
    }
    c.validate()
}

/// A relative spectral response table R(λ) owning its data: wavelengths in `unit` (strictly
/// increasing, at least 2) and values ≥ 0 (not all 0), linear between the points.
#[cfg(feature = "alloc")]
#[derive(Debug, Clone, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct ResponseTable {
    /// Wavelengths, in `unit`.
    pub wavelengths: Vec<f64>,
    /// Response values (any unit; the signal is in W·m⁻²·sr⁻¹ times it).
    pub values: Vec<f64>,
    /// A wavelength unit.
    pub unit: SpectralUnit,
    /// c₂ convention of the Planck values (default CODATA 2018).
    #[cfg_attr(feature = "serde", serde(default))]
    pub c2: C2Convention,
}

/// An instrument's blackbody signal model, as written in a definition (tag `"kind"`:
/// `"spectralPoint"`, `"response"` or `"sakumaHattori"`).
///
/// # Examples
/// ```
/// use quantaband::definition::InstrumentModel;
/// use quantaband::thermometry::SignalModel;
/// use quantaband::units::SpectralUnit;
/// let m = InstrumentModel::SpectralPoint { wavelength: 10.0, unit: SpectralUnit::Micrometre, c2: Default::default() };
/// let p = m.prepare().unwrap();
/// // L_λ(10 µm, 300 K) = 9.924 033 330 070 695e6 W·m⁻²·sr⁻¹·m⁻¹ (mpmath, tests/data/gen_core.py)
/// assert!((p.signal(300.0).unwrap() / 9.924_033_330_070_695e6 - 1.0).abs() < 1e-14);
/// ```
#[cfg(feature = "alloc")]
#[derive(Debug, Clone, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum InstrumentModel {
    /// One wavelength: signal = spectral radiance L_λ, W·m⁻²·sr⁻¹·m⁻¹.
    SpectralPoint {
        /// Wavelength, in `unit`.
        wavelength: f64,
        /// A wavelength unit.
        unit: SpectralUnit,
        /// c₂ convention (default CODATA 2018).
        c2: C2Convention,
    },
    /// A spectral response table: signal = ∫ R(λ) L_λ dλ.
    Response(ResponseTable),
    /// A Sakuma–Hattori curve S(T) = C / (exp(c₂/(A·T + B)) − 1).
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    SakumaHattori {
        /// A, m.
        a_m: f64,
        /// B, m·K.
        #[cfg_attr(feature = "serde", serde(rename = "bMK"))]
        b_mk: f64,
        /// C, signal units.
        c: f64,
        /// c₂ convention (default CODATA 2018).
        c2: C2Convention,
    },
}

/// A checked instrument model in SI units, owning its data; a [`SignalModel`].
#[cfg(feature = "alloc")]
#[derive(Debug, Clone, PartialEq)]
pub enum PreparedModel {
    /// One wavelength.
    Point(SpectralPoint),
    /// A response table, wavelengths in m (checked once).
    Response {
        /// Wavelengths, m.
        wavelengths_m: Vec<f64>,
        /// Response values.
        values: Vec<f64>,
        /// c₂ convention.
        c2: C2Convention,
    },
    /// A Sakuma–Hattori curve.
    Curve(SakumaHattori),
}

/// Converts a wavelength in `unit` to metres, failing for a unit of another kind.
#[cfg(feature = "alloc")]
fn wavelength_m(arg: &'static str, x: f64, unit: SpectralUnit) -> Result<f64> {
    if unit.kind() != SpectralKind::Wavelength {
        return Err(Error::Unsupported {
            what: "unit must be a wavelength unit (m, mm, um, nm)",
        });
    }
    crate::units::convert_spectral(arg, x, unit, SpectralUnit::Metre)
}

/// An error of [`Response::new`] with the table's field names of the serialized form.
#[cfg(feature = "alloc")]
fn table_names(e: Error) -> Error {
    let name = |arg: &'static str| {
        if arg == "wavelengths_m" {
            "wavelengths"
        } else {
            arg
        }
    };
    match e {
        Error::NotIncreasing { arg, index } => Error::NotIncreasing {
            arg: name(arg),
            index,
        },
        Error::NonFinite { arg, value } => Error::NonFinite {
            arg: name(arg),
            value,
        },
        Error::NonPositiveSpectral { arg, value } => Error::NonPositiveSpectral {
            arg: name(arg),
            value,
        },
        other => other,
    }
}

#[cfg(feature = "alloc")]
impl InstrumentModel {
    /// Checks the model once and converts it to SI: the model every calculation then uses.
    ///
    /// # Formula
    /// ```text
    /// spectralPoint: λ_m = wavelength × unit;  response: λ_i,m = wavelengths_i × unit,
    /// table checked (Response::new);  sakumaHattori: SakumaHattori::new(A, B, C, c2)
    /// ```
    ///
    /// # Errors
    /// `Unsupported` for a unit that is not a wavelength unit; the unit conversion errors
    /// (`NonFinite`, `NonPositiveSpectral`, `OutOfRange`) with the index of a bad table entry
    /// lost (see the JavaScript layer for indices); those of [`Response::new`],
    /// [`SpectralPoint::new`] and [`SakumaHattori::new`].
    ///
    /// # Accuracy
    /// One rounding per converted wavelength.
    ///
    /// # Examples
    /// See [`InstrumentModel`].
    ///
    /// # References
    /// None (conversion and validation).
    pub fn prepare(&self) -> Result<PreparedModel> {
        Ok(match self {
            InstrumentModel::SpectralPoint {
                wavelength,
                unit,
                c2,
            } => PreparedModel::Point(SpectralPoint::new(
                wavelength_m("wavelength", *wavelength, *unit)?,
                *c2,
            )?),
            InstrumentModel::Response(t) => {
                let mut wavelengths_m = Vec::new();
                if wavelengths_m
                    .try_reserve_exact(t.wavelengths.len())
                    .is_err()
                {
                    return Err(Error::OutOfRange {
                        arg: "wavelengths",
                        value: t.wavelengths.len() as f64,
                        range: "lengths the memory can hold",
                    });
                }
                for &w in &t.wavelengths {
                    wavelengths_m.push(wavelength_m("wavelengths", w, t.unit)?);
                }
                Response::new(&wavelengths_m, &t.values).map_err(table_names)?;
                PreparedModel::Response {
                    wavelengths_m,
                    values: t.values.clone(),
                    c2: t.c2,
                }
            }
            InstrumentModel::SakumaHattori { a_m, b_mk, c, c2 } => {
                PreparedModel::Curve(SakumaHattori::new(*a_m, *b_mk, *c, *c2)?)
            }
        })
    }
}

#[cfg(feature = "alloc")]
impl PreparedModel {
    /// Runs `f` with the model as a [`SignalModel`] (one non-generic function: the response
    /// table's borrowed view is set up here only).
    #[inline(never)]
    pub fn with_model(&self, f: &mut dyn FnMut(&dyn SignalModel) -> Result<()>) -> Result<()> {
        match self {
            PreparedModel::Point(p) => f(p),
            PreparedModel::Curve(c) => f(c),
            PreparedModel::Response {
                wavelengths_m,
                values,
                c2,
            } => f(&ResponseSignal::new(
                Response::new(wavelengths_m, values)?,
                *c2,
            )),
        }
    }

    /// `f` applied to the model as a [`SignalModel`].
    pub fn run<R>(&self, f: impl FnOnce(&dyn SignalModel) -> Result<R>) -> Result<R> {
        let mut f = Some(f);
        let mut out = None;
        self.with_model(&mut |m| {
            if let Some(f) = f.take() {
                out = Some(f(m)?);
            }
            Ok(())
        })?;
        // `with_model` calls the closure exactly once on success; no panic path regardless.
        out.ok_or(Error::Unsupported {
            what: "internal: signal model was not evaluated",
        })
    }
}

#[cfg(feature = "alloc")]
impl SignalModel for PreparedModel {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        self.run(|m| m.signal(temperature_k))
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        self.run(|m| m.d_signal_dt(temperature_k))
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        self.run(|m| m.signal_and_derivative(temperature_k))
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        self.run(|m| m.temperature(signal))
    }
}

/// An instrument: its signal model and the conditions it measures under.
///
/// # Examples
/// ```
/// # #[cfg(feature = "serde")] {
/// use quantaband::definition::InstrumentDefinition;
/// let json = r#"{"model":{"kind":"spectralPoint","wavelength":10,"unit":"um"},
///                "conditions":{"emissivity":0.95,"reflectedTemperatureK":293.15}}"#;
/// let d: InstrumentDefinition = serde_json::from_str(json).unwrap();
/// assert_eq!(d.conditions.conditions().unwrap().emissivity, 0.95);
/// # }
/// ```
#[cfg(feature = "alloc")]
#[derive(Debug, Clone, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct InstrumentDefinition {
    /// The blackbody signal model.
    pub model: InstrumentModel,
    /// Measurement conditions (default: a blackbody in vacuum).
    #[cfg_attr(feature = "serde", serde(default))]
    pub conditions: MeasurementConditions,
}

#[cfg(feature = "serde")]
mod serde_impls;
