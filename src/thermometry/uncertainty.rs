//! Sensitivity coefficients of the object temperature and the GUM uncertainty budget of a
//! single-band measurement (model of [`super::measurement`]).
//!
//! # Method
//! The measurement equation is F(T, p) = 0 with
//! F = τ_w·[τ(ε S(T) + (1 − ε) S(T_refl)) + (1 − τ) S(T_path)] plus the window terms minus the
//! signal. Implicit differentiation gives every sensitivity coefficient
//! analytically, ∂T/∂p = −(∂F/∂p)/(∂F/∂T), from the model's S and dS/dT only — no finite
//! differences. The combined standard uncertainty follows the law of propagation of uncertainty
//! for uncorrelated inputs, JCGM 100:2008 (GUM) eq. (10): u_c² = Σ (c_i·u_i)².
//!
//! Cautions: an uncertainty budget is only as good as the input uncertainties and the model;
//! it does not replace a validated calibration procedure.
//!
//! # References
//! JCGM 100:2008, *Evaluation of measurement data — Guide to the expression of uncertainty in
//! measurement*, section 5.1.2, eq. (10) and (11a).
#![forbid(unsafe_code)]

use super::measurement::{object_temperature, Conditions};
use super::model::SignalModel;
use crate::error::finite;
use crate::{Error, Result};

/// Sensitivity coefficients ∂T_obj/∂p of the object temperature at a measured signal (each
/// field in K per unit of its input), returned by [`sensitivities`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// use quantaband::thermometry::uncertainty::sensitivities;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let s = sensitivities(&m, 8.0e6, &Conditions::BLACKBODY).unwrap();
/// // a blackbody in vacuum: the reflected and path terms carry no weight
/// assert_eq!((s.reflected_temperature, s.path_temperature), (0.0, 0.0));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Sensitivities {
    /// The object temperature the signal gives, K.
    pub temperature_k: f64,
    /// ∂T/∂signal, K per signal unit.
    pub signal: f64,
    /// ∂T/∂ε, K.
    pub emissivity: f64,
    /// ∂T/∂T_refl, K/K.
    pub reflected_temperature: f64,
    /// ∂T/∂τ, K.
    pub path_transmittance: f64,
    /// ∂T/∂T_path, K/K.
    pub path_temperature: f64,
}

/// Sensitivity coefficients of the object temperature with respect to the signal, emissivity,
/// reflected temperature, path transmittance and path temperature, at `signal` under
/// `conditions`.
///
/// # Formula
/// ```text
/// ∂T/∂p = −(∂F/∂p)/(∂F/∂T),   ∂F/∂T = τ_w·τ·ε·S′(T)
/// ∂F/∂signal = −1
/// ∂F/∂ε      = τ_w·τ·(S(T) − S(T_refl))
/// ∂F/∂T_refl = τ_w·τ·(1 − ε)·S′(T_refl)
/// ∂F/∂τ      = τ_w·(ε S(T) + (1 − ε) S(T_refl) − S(T_path))
/// ∂F/∂T_path = τ_w·(1 − τ)·S′(T_path)
/// ```
///
/// # Errors
/// Those of [`object_temperature`]; `NoSolution` if dS/dT is 0 at the solution (signal
/// underflow). `OutOfRange` naming the reflected or path temperature when its model signal
/// overflows and a sensitivity would be infinite; an input whose weight is zero (the path
/// temperature with τ = 1, the reflected temperature with ε = 1) has sensitivity 0 whatever its
/// value.
///
/// # Accuracy
/// Analytic; agrees with mpmath numerical differentiation of a 40-digit solve to ≤ 1e-9
/// relative (`tests/thermometry_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// use quantaband::thermometry::uncertainty::sensitivities;
/// let m = SpectralPoint::new(1e-6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.5, ..Conditions::BLACKBODY };
/// let s = sensitivities(&m, 1.0e4, &c).unwrap();
/// // a lower emissivity means a hotter object for the same signal
/// assert!(s.emissivity < 0.0 && s.signal > 0.0);
/// ```
///
/// # References
/// JCGM 100:2008 eq. (10) (sensitivity coefficients c_i = ∂f/∂x_i).
pub fn sensitivities<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    conditions: &Conditions,
) -> Result<Sensitivities> {
    let t = object_temperature(model, signal, conditions)?;
    let (s_t, ds_t) = model.signal_and_derivative(t)?;
    let eps = conditions.emissivity;
    let tau = conditions.path_transmittance;
    let tw = conditions.window.map_or(1.0, |w| w.transmittance);
    let (s_r, ds_r) = model.signal_and_derivative(conditions.reflected_temperature_k)?;
    let (s_p, ds_p) = model.signal_and_derivative(conditions.path_temperature_k)?;
    let df_dt = tw * tau * eps * ds_t;
    if !(df_dt > 0.0 && df_dt.is_finite()) {
        return Err(Error::NoSolution {
            what: "dS/dT vanishes at the solution (signal underflow)",
        });
    }
    let c = |df_dp: f64| if df_dp == 0.0 { 0.0 } else { -df_dp / df_dt };
    // A term whose weight is zero contributes exactly 0, even when the model signal of its
    // temperature overflows (0·∞ would be NaN): such an input does not matter.
    let weighted = |w: f64, v: f64| if w == 0.0 { 0.0 } else { w * v };
    let s = Sensitivities {
        temperature_k: t,
        signal: 1.0 / df_dt,
        emissivity: c(tw * tau * (s_t - s_r)),
        reflected_temperature: c(weighted(tw * tau * (1.0 - eps), ds_r)),
        path_transmittance: c(tw * (eps * s_t + weighted(1.0 - eps, s_r) - s_p)),
        path_temperature: c(weighted(tw * (1.0 - tau), ds_p)),
    };
    let all = [
        s.signal,
        s.emissivity,
        s.reflected_temperature,
        s.path_transmittance,
        s.path_temperature,
    ];
    if all.iter().all(|v| v.is_finite()) {
        return Ok(s);
    }
    // An input that matters overflowed: name the temperature whose model signal did.
    let finite_at = |v: f64, d: f64| v.is_finite() && d.is_finite();
    Err(if !finite_at(s_r, ds_r) {
        Error::OutOfRange {
            arg: "reflected_temperature_k",
            value: conditions.reflected_temperature_k,
            range: "temperatures whose model signal is finite",
        }
    } else if !finite_at(s_p, ds_p) {
        Error::OutOfRange {
            arg: "path_temperature_k",
            value: conditions.path_temperature_k,
            range: "temperatures whose model signal is finite",
        }
    } else {
        Error::NoSolution {
            what: "the sensitivity coefficients overflow at this reading",
        }
    })
}

/// Standard uncertainties of the inputs (uncorrelated), in the inputs' units (signal units,
/// dimensionless, K); `Default` is all zeros. See [`uncertainty_budget`] for an example.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields, default)
)]
pub struct StandardUncertainties {
    /// u(signal), signal units.
    pub signal: f64,
    /// u(ε).
    pub emissivity: f64,
    /// u(T_refl), K.
    pub reflected_temperature_k: f64,
    /// u(τ).
    pub path_transmittance: f64,
    /// u(T_path), K.
    pub path_temperature_k: f64,
}

/// Which input a budget line belongs to; [`UncertaintyBudget::entries`] lists them in
/// declaration order.
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// use quantaband::thermometry::uncertainty::{uncertainty_budget, BudgetInput, StandardUncertainties};
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let b = uncertainty_budget(&m, 8.0e6, &Conditions::BLACKBODY, &StandardUncertainties::default()).unwrap();
/// assert_eq!(b.entries[0].input, BudgetInput::Signal);
/// assert_eq!(b.entries[4].input, BudgetInput::PathTemperature);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum BudgetInput {
    /// The measured signal.
    Signal,
    /// Object emissivity.
    Emissivity,
    /// Reflected (surroundings) temperature.
    ReflectedTemperature,
    /// Path transmittance.
    PathTransmittance,
    /// Path temperature.
    PathTemperature,
}

/// One line of an uncertainty budget (sensitivity in K per input unit, contribution in K).
/// See [`uncertainty_budget`] for an example.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct BudgetEntry {
    /// The input.
    pub input: BudgetInput,
    /// Sensitivity coefficient c_i = ∂T/∂x_i.
    pub sensitivity: f64,
    /// Standard uncertainty u(x_i), input units.
    pub standard_uncertainty: f64,
    /// Contribution |c_i|·u(x_i), K.
    pub contribution_k: f64,
    /// Share of the combined variance (c_i u_i)²/u_c², in [0, 1] (0 when u_c = 0).
    pub variance_share: f64,
}

/// An uncertainty budget for the object temperature (temperatures and uncertainties in K),
/// returned by [`uncertainty_budget`], which shows an example.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct UncertaintyBudget {
    /// The object temperature, K.
    pub temperature_k: f64,
    /// One line per input, in the order of [`BudgetInput`].
    pub entries: [BudgetEntry; 5],
    /// Combined standard uncertainty u_c(T), K (coverage factor 1).
    pub combined_standard_uncertainty_k: f64,
}

/// Uncertainty budget of the object temperature at `signal` under `conditions`, from the
/// standard uncertainties `u` of the inputs (first-order law of propagation, uncorrelated
/// inputs).
///
/// # Formula
/// ```text
/// c_i = ∂T/∂x_i (see sensitivities),  contribution_i = |c_i|·u_i,
/// u_c(T) = sqrt(Σ (c_i·u_i)²)   (JCGM 100:2008 eq. 10),   share_i = (c_i u_i)²/u_c²
/// ```
///
/// # Errors
/// `NonFinite` for a non-finite uncertainty, `OutOfRange` (range `[0, inf)`) for a negative one,
/// or for one whose contribution to the variance overflows; those of [`sensitivities`]. Every
/// returned number is finite.
///
/// # Accuracy
/// First-order propagation (GUM eq. 10): exact for the linearised model; agrees with the
/// mpmath-derived budget in `tests/thermometry_reference.rs` to ≤ 1e-8 relative.
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::model::SpectralPoint;
/// use quantaband::thermometry::uncertainty::{uncertainty_budget, StandardUncertainties};
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.95, ..Conditions::BLACKBODY };
/// let u = StandardUncertainties { emissivity: 0.01, ..Default::default() };
/// let b = uncertainty_budget(&m, 8.0e6, &c, &u).unwrap();
/// // one input only: the combined uncertainty is its contribution
/// assert!((b.combined_standard_uncertainty_k - b.entries[1].contribution_k).abs() < 1e-15);
/// assert_eq!(b.entries[1].variance_share, 1.0);
/// ```
///
/// # References
/// JCGM 100:2008 (GUM), section 5.1.2, eq. (10).
pub fn uncertainty_budget<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    conditions: &Conditions,
    u: &StandardUncertainties,
) -> Result<UncertaintyBudget> {
    let us = [
        ("u.signal", u.signal),
        ("u.emissivity", u.emissivity),
        ("u.reflected_temperature_k", u.reflected_temperature_k),
        ("u.path_transmittance", u.path_transmittance),
        ("u.path_temperature_k", u.path_temperature_k),
    ];
    for &(arg, v) in &us {
        finite(arg, v)?;
        if v < 0.0 {
            return Err(Error::OutOfRange {
                arg,
                value: v,
                range: "[0, inf)",
            });
        }
    }
    let s = sensitivities(model, signal, conditions)?;
    let cs = [
        s.signal,
        s.emissivity,
        s.reflected_temperature,
        s.path_transmittance,
        s.path_temperature,
    ];
    let inputs = [
        BudgetInput::Signal,
        BudgetInput::Emissivity,
        BudgetInput::ReflectedTemperature,
        BudgetInput::PathTransmittance,
        BudgetInput::PathTemperature,
    ];
    let mut entries = [BudgetEntry {
        input: BudgetInput::Signal,
        sensitivity: 0.0,
        standard_uncertainty: 0.0,
        contribution_k: 0.0,
        variance_share: 0.0,
    }; 5];
    let mut var = 0.0;
    for (i, e) in entries.iter_mut().enumerate() {
        let contribution = (cs[i] * us[i].1).abs();
        *e = BudgetEntry {
            input: inputs[i],
            sensitivity: cs[i],
            standard_uncertainty: us[i].1,
            contribution_k: contribution,
            variance_share: 0.0,
        };
        var += contribution * contribution;
    }
    if var > 0.0 {
        for e in entries.iter_mut() {
            e.variance_share = e.contribution_k * e.contribution_k / var;
        }
    }
    if !var.is_finite() {
        // finite sensitivities times a huge (finite) uncertainty: name the first such input
        let arg = us
            .iter()
            .zip(cs)
            .find(|((_, u), c)| !(c * u).is_finite() || !(c * u * c * u).is_finite())
            .map_or("u", |((arg, _), _)| *arg);
        let value = us
            .iter()
            .find(|(a, _)| *a == arg)
            .map_or(f64::NAN, |(_, u)| *u);
        return Err(Error::OutOfRange {
            arg,
            value,
            range: "uncertainties whose contribution to the variance is finite",
        });
    }
    Ok(UncertaintyBudget {
        temperature_k: s.temperature_k,
        entries,
        combined_standard_uncertainty_k: crate::float::sqrt(var),
    })
}
