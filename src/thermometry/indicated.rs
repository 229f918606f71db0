//! Workflows that start from an instrument's *indicated* temperature: the temperature the
//! instrument shows after applying its own emissivity, reflected-temperature (and, if it has
//! them, transmittance and window) settings to what it measured.
//!
//! Every function first recovers the signal the instrument measured, by running the
//! instrument's grey measurement equation forwards at the indicated temperature with the
//! settings in force ([`measured_signal`]), and then solves the radiance balance of the real
//! scene for the unknown:
//!
//! - [`correct_reading`]: the object temperature under other (true) conditions — another
//!   emissivity, reflected temperature, path or window; [`correct_reading_spectral`] with a
//!   non-grey target, path or window;
//! - [`reflected_temperature`]: the reflected (background) temperature from a reading of a
//!   diffuse reflector;
//! - [`emissivity_by_contact`]: the band emissivity of a surface whose true temperature a
//!   contact (reference) thermometer gives;
//! - [`emissivity_by_reference`]: the same with a reference coating or tape of known
//!   emissivity on the surface instead of a contact thermometer.
//!
//! The instrument model is any [`SignalModel`] — a [`super::model::SpectralPoint`], a
//! [`super::rectangular::RectangularBand`], a [`super::response::ResponseSignal`],
//! a [`super::spectral::SpectralInstrument`] or a [`super::sakuma_hattori::SakumaHattori`]
//! calibration curve. The result is only as good as the model: use the curve or response
//! of the instrument that made the reading.
//!
//! The path and window settings of the reading are taken to describe the real path and window
//! in [`reflected_temperature`] and the emissivity methods (as those procedures assume: short
//! path, no window or a known one); to change them too, use [`correct_reading`].
//!
//! # Sources
//! The procedures follow the published test methods for thermal imagers and radiation
//! thermometers, recalled from memory (their texts were not available here): ASTM E1862,
//! *Standard Practice for Measuring and Compensating for Reflected Temperature Using Infrared
//! Imaging Radiometers* (reflector method); ASTM E1933, *Standard Practice for Measuring and
//! Compensating for Emissivity Using Infrared Imaging Radiometers* (contact-thermometer method
//! and reference-material method); ISO 18434-1, *Condition monitoring and diagnostics of
//! machines — Thermography — Part 1: General procedures* (emissivity and reflected apparent
//! temperature). The radiance balance itself is the measurement equation of
//! [`super::measurement`].
//!
//! Cautions: these are calculations from readings; the methods' own conditions (a diffuse
//! reflector at the target's position and orientation, thermal contact and equilibrium of
//! contact probe and tape, target hotter or colder than its surroundings by a clear margin)
//! decide the quality of the result. Not for medical screening or process-safety decisions;
//! follow the standards and local codes.
#![forbid(unsafe_code)]

use super::measurement::{measured_signal, object_temperature, Conditions};
use super::model::SignalModel;
use super::spectral::{spectral_object_temperature, SpectralConditions, SpectralInstrument};
use crate::error::temperature;
use crate::{Error, Result};

/// Object temperature (K) under the true `actual` conditions, from a reading of
/// `indicated_temperature_k` (K) made with the instrument set to `setting` (its emissivity,
/// reflected temperature and any transmittance/window settings).
///
/// # Formula
/// ```text
/// s = a₁·S(T_ind) + b₁                 (setting: Conditions::affine → a₁, b₁)
/// T = S⁻¹((s − b₂)/a₂)                 (actual:  a₂, b₂)
/// no path or window:  S(T) = [ε₁·S(T_ind) + (1 − ε₁)·S(T_r1) − (1 − ε₂)·S(T_r2)] / ε₂
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveTemperature` for the indicated temperature; as
/// [`Conditions::validate`] for either conditions; `NoPhysicalSolution` when the true
/// background alone exceeds the measured signal; errors of the model's inverse.
///
/// # Accuracy
/// That of the model's signal and inverse: against mpmath root finding of the radiance
/// balance (`tests/data/gen_spectral.py`) ≤ 1e-12 relative for a spectral point, a rectangular
/// band, a response table and a Sakuma–Hattori curve (`tests/thermometry_indicated.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::indicated::correct_reading;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// // read at ε = 0.95, T_refl = 293.15 K; the surface really has ε = 0.80 and sees 310 K
/// let setting = Conditions { emissivity: 0.95, ..Conditions::BLACKBODY };
/// let actual = Conditions { emissivity: 0.80, reflected_temperature_k: 310.0, ..Conditions::BLACKBODY };
/// let t = correct_reading(&m, 350.0, &setting, &actual).unwrap();
/// assert!(t > 350.0 && t < 370.0);
/// // with the same conditions the reading stands
/// assert!((correct_reading(&m, 350.0, &setting, &setting).unwrap() - 350.0).abs() < 1e-9);
/// ```
///
/// # References
/// ASTM E1933 and ISO 18434-1 (emissivity correction) — from memory; see the module docs.
pub fn correct_reading<M: SignalModel + ?Sized>(
    model: &M,
    indicated_temperature_k: f64,
    setting: &Conditions,
    actual: &Conditions,
) -> Result<f64> {
    let s = measured(model, indicated_temperature_k, setting)?;
    object_temperature(model, s, actual)
}

/// Object temperature (K) under true spectral conditions (a non-grey target, path or window),
/// from a reading of `indicated_temperature_k` (K) made by `instrument` set to the grey
/// `setting`. The instrument's internal conversion uses its own blackbody signal
/// S(T) = ∫ R·L(T) dλ.
///
/// # Formula
/// ```text
/// s = a₁·S(T_ind) + b₁                     (the instrument's grey setting)
/// T = G⁻¹(s − B)                           (spectral::spectral_object_temperature)
/// ```
///
/// # Errors
/// As [`correct_reading`] and [`spectral_object_temperature`].
///
/// # Accuracy
/// As [`spectral_object_temperature`]; against mpmath quadrature and root finding ≤ 1e-12
/// relative (`tests/thermometry_indicated.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::indicated::correct_reading_spectral;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::spectral::{SpectralConditions, SpectralInstrument, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// // an invented oxidised coating: ε 0.9 at 8 µm falling to 0.6 at 14 µm; the reading was
/// // taken at the grey setting ε = 0.9
/// let (ew, ev) = ([8e-6, 14e-6], [0.9, 0.6]);
/// let actual = SpectralConditions {
///     emissivity: SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap()),
///     ..SpectralConditions::BLACKBODY
/// };
/// let setting = Conditions { emissivity: 0.9, ..Conditions::BLACKBODY };
/// let t = correct_reading_spectral(&inst, 350.0, &setting, &actual).unwrap();
/// assert!(t > 350.0);
/// ```
///
/// # References
/// As [`correct_reading`].
pub fn correct_reading_spectral(
    instrument: &SpectralInstrument<'_>,
    indicated_temperature_k: f64,
    setting: &Conditions,
    actual: &SpectralConditions<'_>,
) -> Result<f64> {
    let s = measured(instrument, indicated_temperature_k, setting)?;
    spectral_object_temperature(instrument, s, actual)
}

/// Reflected (background) temperature, K, from a reading `indicated_temperature_k` (K) of a
/// diffuse reflector (e.g. crumpled and re-flattened aluminium foil) placed at the target and
/// facing the same way, taken with the instrument set to `setting` (the usual practice is
/// ε = 1). The reflector has emissivity `reflector_emissivity` (0 for an ideal reflector) and
/// temperature `reflector_temperature_k` (K; it matters only when its emissivity is not 0).
///
/// # Formula
/// ```text
/// s = a₁·S(T_ind) + b₁                                   (setting)
/// τ_w[τ(ε_f·S(T_f) + (1 − ε_f)·S(T_refl)) + (1 − τ)S(T_path)] + window terms = s
/// (solved as Conditions { emissivity: 1 − ε_f, reflected_temperature_k: T_f } with the
///  reflected surroundings in the object's place)
/// setting ε = 1, ideal reflector (ε_f = 0), no path:  T_refl = T_ind
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` (range `[0, 1)`) for the reflector emissivity;
/// `NonFinite` / `NonPositiveTemperature` for a temperature; as [`Conditions::validate`];
/// `NoPhysicalSolution` when the reflector's own emission (and the path and window) exceed the
/// measured signal; errors of the model's inverse.
///
/// # Accuracy
/// As [`correct_reading`] (≤ 1e-12 relative against mpmath root finding in the tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::indicated::reflected_temperature;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// // ε = 1 setting, ideal reflector: the reading is the reflected temperature
/// let t = reflected_temperature(&m, 301.5, &Conditions::BLACKBODY, 0.0, 295.0).unwrap();
/// assert!((t - 301.5).abs() < 1e-9);
/// // a foil with ε = 0.04 at 295 K: the surroundings are slightly warmer than indicated
/// let t = reflected_temperature(&m, 301.5, &Conditions::BLACKBODY, 0.04, 295.0).unwrap();
/// assert!(t > 301.5 && t < 302.0);
/// ```
///
/// # References
/// ASTM E1862 (reflector method) and ISO 18434-1 (reflected apparent temperature) — from
/// memory; see the module docs.
pub fn reflected_temperature<M: SignalModel + ?Sized>(
    model: &M,
    indicated_temperature_k: f64,
    setting: &Conditions,
    reflector_emissivity: f64,
    reflector_temperature_k: f64,
) -> Result<f64> {
    crate::error::finite("reflector_emissivity", reflector_emissivity)?;
    if !(0.0..1.0).contains(&reflector_emissivity) {
        return Err(Error::OutOfRange {
            arg: "reflector_emissivity",
            value: reflector_emissivity,
            range: "[0, 1)",
        });
    }
    temperature("reflector_temperature_k", reflector_temperature_k)?;
    let s = measured(model, indicated_temperature_k, setting)?;
    // The surroundings' radiance enters with weight 1 − ε_f, the foil's own with ε_f: the
    // measurement equation with the roles of object and surroundings exchanged.
    let swapped = Conditions {
        emissivity: 1.0 - reflector_emissivity,
        reflected_temperature_k: reflector_temperature_k,
        ..*setting
    };
    object_temperature(model, s, &swapped)
}

/// Band emissivity (dimensionless) of a surface at a true temperature `true_temperature_k`
/// (K) known from a contact or reference thermometer, from a reading `indicated_temperature_k`
/// (K) taken with the instrument set to `setting`, and the reflected temperature
/// `reflected_temperature_k` (K, e.g. from [`reflected_temperature`]).
///
/// # Formula
/// ```text
/// s = a₁·S(T_ind) + b₁                         (setting)
/// L_app = (s − b₀)/a₀   (Conditions::affine at ε = 1: the radiance leaving the surface)
/// ε = (L_app − S(T_refl)) / (S(T_true) − S(T_refl))
/// ```
/// It is the emissivity setting at which the instrument would indicate T_true.
///
/// # Errors
/// `NonFinite` / `NonPositiveTemperature` for a temperature; as [`Conditions::validate`];
/// `NoSolution` when T_true and T_refl give the same signal (the method needs the surface
/// clearly hotter or colder than its surroundings); `OutOfRange` (arg `emissivity (result)`,
/// the value) when the readings give an emissivity outside (0, 1] (inconsistent inputs; a
/// result within 1e-12 above 1 is returned as 1).
///
/// # Accuracy
/// Error propagation: ∂ε/∂T_true = −ε·S′(T_true)/(S(T_true) − S(T_refl)) — the closer T_true
/// is to T_refl, the more the inputs' errors are magnified. Arithmetic against mpmath root
/// finding: ≤ 1e-12 relative (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::indicated::emissivity_by_contact;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// // the instrument set to ε = 1 shows 340 K; a contact probe gives 352 K; surroundings 295 K
/// let e = emissivity_by_contact(&m, 340.0, &Conditions::BLACKBODY, 352.0, 295.0).unwrap();
/// assert!(e > 0.7 && e < 0.9);
/// ```
///
/// # References
/// ASTM E1933 (contact-thermometer method) and ISO 18434-1 — from memory; see the module docs.
pub fn emissivity_by_contact<M: SignalModel + ?Sized>(
    model: &M,
    indicated_temperature_k: f64,
    setting: &Conditions,
    true_temperature_k: f64,
    reflected_temperature_k: f64,
) -> Result<f64> {
    temperature("true_temperature_k", true_temperature_k)?;
    temperature("reflected_temperature_k", reflected_temperature_k)?;
    let s = measured(model, indicated_temperature_k, setting)?;
    // Path and window from the setting; ε = 1 isolates the radiance leaving the surface.
    let unit = Conditions {
        emissivity: 1.0,
        reflected_temperature_k,
        ..*setting
    };
    let (a0, b0) = unit.affine(model)?;
    let l_app = (s - b0) / a0;
    let s_true = model.signal(true_temperature_k)?;
    let s_refl = model.signal(reflected_temperature_k)?;
    let den = s_true - s_refl;
    if !(den.abs() > 1e-12 * s_true.abs().max(s_refl.abs())) {
        return Err(Error::NoSolution {
            what: "true and reflected temperatures give the same signal: the surface must be hotter or colder than its surroundings",
        });
    }
    let e = (l_app - s_refl) / den;
    if e > 1.0 && e <= 1.0 + 1e-12 {
        return Ok(1.0);
    }
    if !(e > 0.0 && e <= 1.0) {
        return Err(Error::OutOfRange {
            arg: "emissivity (result)",
            value: e,
            range: "(0, 1]",
        });
    }
    Ok(e)
}

/// Result of [`emissivity_by_reference`]: the surface's band emissivity (dimensionless) and
/// the true temperature the reference gave (K).
///
/// # Examples
/// See [`emissivity_by_reference`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct ReferenceEmissivity {
    /// The surface's band emissivity.
    pub emissivity: f64,
    /// The true surface temperature from the reference reading, K.
    pub temperature_k: f64,
}

/// Band emissivity of a surface by the reference-coating (reference-tape) method: a coating
/// or tape of known emissivity `reference_emissivity` on the surface is read
/// (`reference_reading_k`, K), then the bare surface next to it (`surface_reading_k`, K), both
/// with the instrument set to `setting`; `reflected_temperature_k` (K) is the reflected
/// temperature. The coating is assumed to be at the surface's temperature (thin, in good
/// contact, in equilibrium).
///
/// # Formula
/// ```text
/// T_true = correct_reading(T_ref reading, setting → actual ε = ε_ref, T_refl)
/// ε      = emissivity_by_contact(T_surface reading, setting, T_true, T_refl)
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` (range `(0, 1]`) for the reference emissivity; those of
/// [`correct_reading`] and [`emissivity_by_contact`].
///
/// # Accuracy
/// As [`emissivity_by_contact`] (≤ 1e-12 relative against mpmath root finding in the tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::indicated::emissivity_by_reference;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// // set to ε = 0.95 (the tape's value): tape reads 360 K, the bare metal next to it 318 K
/// let set = Conditions { emissivity: 0.95, reflected_temperature_k: 295.0, ..Conditions::BLACKBODY };
/// let r = emissivity_by_reference(&m, 360.0, 318.0, &set, 0.95, 295.0).unwrap();
/// assert!((r.temperature_k - 360.0).abs() < 1e-9); // the setting matched the tape
/// assert!(r.emissivity > 0.2 && r.emissivity < 0.4);
/// ```
///
/// # References
/// ASTM E1933 (reference-material method) and ISO 18434-1 — from memory; see the module docs.
pub fn emissivity_by_reference<M: SignalModel + ?Sized>(
    model: &M,
    reference_reading_k: f64,
    surface_reading_k: f64,
    setting: &Conditions,
    reference_emissivity: f64,
    reflected_temperature_k: f64,
) -> Result<ReferenceEmissivity> {
    crate::error::unit_interval_open_closed("reference_emissivity", reference_emissivity)?;
    temperature("reflected_temperature_k", reflected_temperature_k)?;
    let actual = Conditions {
        emissivity: reference_emissivity,
        reflected_temperature_k,
        ..*setting
    };
    let t_true = correct_reading(model, reference_reading_k, setting, &actual)?;
    let e = emissivity_by_contact(
        model,
        surface_reading_k,
        setting,
        t_true,
        reflected_temperature_k,
    )?;
    Ok(ReferenceEmissivity {
        emissivity: e,
        temperature_k: t_true,
    })
}

/// The signal the instrument measured when it indicated `indicated_temperature_k` at `setting`.
fn measured<M: SignalModel + ?Sized>(
    model: &M,
    indicated_temperature_k: f64,
    setting: &Conditions,
) -> Result<f64> {
    temperature("indicated_temperature_k", indicated_temperature_k)?;
    measured_signal(model, indicated_temperature_k, setting)
}
