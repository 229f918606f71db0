//! The measurement equation of a single-band radiation thermometer: what an instrument reads
//! from a grey object seen through an absorbing path (and optionally a window), and the object
//! temperature that explains a reading.
//!
//! # The model
//! All terms are signals S(T) of the same [`SignalModel`] (the instrument's response to a
//! blackbody at T), so the model is exact for a grey object, grey path and grey window inside
//! the instrument's band:
//!
//! ```text
//! scene  = τ·[ε·S(T_obj) + (1 − ε)·S(T_refl)] + (1 − τ)·S(T_path)
//! signal = τ_w·scene + ρ_w·S(T_int) + (1 − τ_w − ρ_w)·S(T_w)
//!
//! ε       object emissivity, (0, 1]          T_refl  temperature of the surroundings the
//! τ       path transmittance, (0, 1]                 object reflects (opaque object: ρ = 1 − ε)
//! T_path  temperature of the path (air,      τ_w     window transmittance, (0, 1]
//!         gas) that emits 1 − τ              ρ_w     window reflectance, [0, 1), τ_w + ρ_w ≤ 1
//! T_w     window temperature (window         T_int   temperature of what the window reflects
//!         emissivity 1 − τ_w − ρ_w)                  back into the instrument (its interior)
//! ```
//!
//! Without a window, τ_w = 1 and ρ_w = 0. The equation is affine in S(T_obj):
//! `signal = a·S(T_obj) + b` with `a = τ_w·τ·ε` and `b` the background (every other term), so
//! the object temperature is `T_obj = S⁻¹((signal − b)/a)`. A signal at or below `b` has no
//! physical solution and is reported as [`Error::NoPhysicalSolution`].
//!
//! Cautions: these are calculations, not measurements; they do not replace calibrated
//! instruments and standard procedures, must not be used for medical temperature screening, and
//! defer to local codes and standards.
//!
//! # References
//! - P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
//!   Industry*, SPIE Press, 2007 (emissivity, reflection and path corrections) — from memory.
#![forbid(unsafe_code)]

use super::model::SignalModel;
use crate::error::{
    finite, positive, temperature, unit_interval_closed, unit_interval_open_closed,
};
use crate::{Error, Result};

/// A window between the scene and the instrument (grey in the instrument's band):
/// transmittance and reflectance (dimensionless) and two temperatures (K).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::{Conditions, Window};
/// let w = Window { transmittance: 0.9, reflectance: 0.05, temperature_k: 300.0, reflected_temperature_k: 300.0 };
/// assert!(Conditions { window: Some(w), ..Conditions::BLACKBODY }.validate().is_ok());
/// // τ_w + ρ_w > 1 is rejected
/// let bad = Window { reflectance: 0.2, ..w };
/// assert!(Conditions { window: Some(bad), ..Conditions::BLACKBODY }.validate().is_err());
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Window {
    /// Transmittance τ_w, (0, 1].
    pub transmittance: f64,
    /// Reflectance ρ_w (instrument side), [0, 1), with τ_w + ρ_w ≤ 1.
    pub reflectance: f64,
    /// Window temperature T_w, K (sets its emission (1 − τ_w − ρ_w)·S(T_w)).
    pub temperature_k: f64,
    /// Temperature T_int of what the window reflects into the instrument, K.
    pub reflected_temperature_k: f64,
}

/// Conditions of a measurement: object emissivity, reflected surroundings, path and window (the
/// symbols of the module docs' model; every function validates them with
/// [`Conditions::validate`]). Emissivity and transmittance are dimensionless, temperatures in K.
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// let c = Conditions { emissivity: 0.8, reflected_temperature_k: 296.0, ..Conditions::BLACKBODY };
/// assert!(c.validate().is_ok());
/// assert_eq!(Conditions { emissivity: 0.0, ..c }.validate().unwrap_err().code(), "OUT_OF_RANGE");
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Conditions {
    /// Object emissivity ε in the instrument's band, (0, 1].
    pub emissivity: f64,
    /// Temperature of the surroundings reflected by the object, K.
    pub reflected_temperature_k: f64,
    /// Path transmittance τ, (0, 1].
    pub path_transmittance: f64,
    /// Path temperature, K.
    pub path_temperature_k: f64,
    /// Optional window; `None` means τ_w = 1, ρ_w = 0.
    pub window: Option<Window>,
}

impl Conditions {
    /// A blackbody in vacuum: ε = 1, τ = 1 (the reflected and path temperatures are then
    /// irrelevant and set to 293.15 K).
    pub const BLACKBODY: Conditions = Conditions {
        emissivity: 1.0,
        reflected_temperature_k: 293.15,
        path_transmittance: 1.0,
        path_temperature_k: 293.15,
        window: None,
    };

    /// Checks every field.
    ///
    /// # Formula
    /// ```text
    /// ε, τ, τ_w ∈ (0, 1];  ρ_w ∈ [0, 1);  τ_w + ρ_w ≤ 1;  all temperatures finite and > 0 K
    /// ```
    ///
    /// # Errors
    /// `NonFinite`; `OutOfRange` for ε, τ, τ_w outside (0, 1], ρ_w outside [0, 1) or
    /// τ_w + ρ_w > 1 (arg `window.reflectance`); `NonPositiveTemperature` for a temperature ≤ 0.
    ///
    /// # Accuracy
    /// Exact comparisons (τ_w + ρ_w may exceed 1 by 1e-15 for rounding).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::measurement::Conditions;
    /// let c = Conditions { emissivity: 0.0, ..Conditions::BLACKBODY };
    /// assert_eq!(c.validate().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn validate(&self) -> Result<()> {
        unit_interval_open_closed("emissivity", self.emissivity)?;
        temperature("reflected_temperature_k", self.reflected_temperature_k)?;
        unit_interval_open_closed("path_transmittance", self.path_transmittance)?;
        temperature("path_temperature_k", self.path_temperature_k)?;
        if let Some(w) = self.window {
            unit_interval_open_closed("window.transmittance", w.transmittance)?;
            unit_interval_closed("window.reflectance", w.reflectance)?;
            if w.reflectance >= 1.0 || w.transmittance + w.reflectance > 1.0 + 1e-15 {
                return Err(Error::OutOfRange {
                    arg: "window.reflectance",
                    value: w.reflectance,
                    range: "[0, 1 - window.transmittance]",
                });
            }
            temperature("window.temperature_k", w.temperature_k)?;
            temperature("window.reflected_temperature_k", w.reflected_temperature_k)?;
        }
        Ok(())
    }

    /// The affine form of the equation for a model: `signal = gain·S(T_obj) + background`.
    ///
    /// # Formula
    /// ```text
    /// gain       = τ_w·τ·ε
    /// background = τ_w·[τ(1 − ε)S(T_refl) + (1 − τ)S(T_path)] + ρ_w S(T_int) + (1 − τ_w − ρ_w) S(T_w)
    /// ```
    ///
    /// # Errors
    /// As [`Conditions::validate`]; errors of the model.
    ///
    /// # Accuracy
    /// A few ulp on top of the model's signals.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::measurement::Conditions;
    /// use quantaband::thermometry::model::SpectralPoint;
    /// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
    /// let (gain, bg) = Conditions::BLACKBODY.affine(&m).unwrap();
    /// assert_eq!((gain, bg), (1.0, 0.0));
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn affine<M: SignalModel + ?Sized>(&self, model: &M) -> Result<(f64, f64)> {
        self.validate()?;
        let eps = self.emissivity;
        let tau = self.path_transmittance;
        let mut scene_bg = 0.0;
        if eps < 1.0 {
            scene_bg += tau * (1.0 - eps) * model.signal(self.reflected_temperature_k)?;
        }
        if tau < 1.0 {
            scene_bg += (1.0 - tau) * model.signal(self.path_temperature_k)?;
        }
        let (tw, extra) = match self.window {
            None => (1.0, 0.0),
            Some(w) => {
                let emis = (1.0 - w.transmittance - w.reflectance).max(0.0);
                let mut e = 0.0;
                if w.reflectance > 0.0 {
                    e += w.reflectance * model.signal(w.reflected_temperature_k)?;
                }
                if emis > 0.0 {
                    e += emis * model.signal(w.temperature_k)?;
                }
                (w.transmittance, e)
            }
        };
        Ok((tw * tau * eps, tw * scene_bg + extra))
    }
}

/// Signal an instrument with signal model `model` reads from an object at
/// `object_temperature_k` (K) under `conditions` (forward measurement equation; unit of the
/// model).
///
/// # Formula
/// ```text
/// signal = gain·S(T_obj) + background     (see the module docs and Conditions::affine)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveTemperature` for a bad temperature; as [`Conditions::validate`].
///
/// # Accuracy
/// A few ulp on top of the model's signals; round trips with [`object_temperature`] agree
/// within 1e-9 K (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::{measured_signal, Conditions};
/// use quantaband::thermometry::model::{SignalModel, SpectralPoint};
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.5, ..Conditions::BLACKBODY };
/// // ε·S(T) + (1 − ε)·S(T_refl)
/// let s = measured_signal(&m, 400.0, &c).unwrap();
/// let expect = 0.5 * m.signal(400.0).unwrap() + 0.5 * m.signal(293.15).unwrap();
/// assert!((s / expect - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// See the module docs.
pub fn measured_signal<M: SignalModel + ?Sized>(
    model: &M,
    object_temperature_k: f64,
    conditions: &Conditions,
) -> Result<f64> {
    temperature("object_temperature_k", object_temperature_k)?;
    let (gain, bg) = conditions.affine(model)?;
    Ok(gain * model.signal(object_temperature_k)? + bg)
}

/// Object temperature (K) that explains a measured `signal` (unit of the model) under
/// `conditions` (inverse measurement equation).
///
/// # Formula
/// ```text
/// T_obj = S⁻¹((signal − background)/gain)
/// ```
///
/// # Errors
/// `NonFinite` for a non-finite signal; `NoPhysicalSolution { signal, background }` when
/// `signal ≤ background` (the reflected, path and window terms alone already give the signal);
/// as [`Conditions::validate`]; `NoSolution` from the model's inverse.
///
/// # Accuracy
/// That of the model's inverse (closed form for Sakuma–Hattori; ≤ 4e-16·T stopping tolerance
/// for the numerical inverse); round trips agree within 1e-9 K (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::{measured_signal, object_temperature, Conditions};
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.8, path_transmittance: 0.9, ..Conditions::BLACKBODY };
/// let s = measured_signal(&m, 350.0, &c).unwrap();
/// assert!((object_temperature(&m, s, &c).unwrap() - 350.0).abs() < 1e-9);
/// ```
///
/// # References
/// See the module docs.
pub fn object_temperature<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    conditions: &Conditions,
) -> Result<f64> {
    finite("signal", signal)?;
    let (gain, bg) = conditions.affine(model)?;
    let net = signal - bg;
    if !(net > 0.0) {
        return Err(Error::NoPhysicalSolution {
            signal,
            background: bg,
        });
    }
    let s_obj = net / gain;
    positive("signal", s_obj)?;
    model.temperature(s_obj)
}
