//! Complete uncertainty evaluation of the grey measurement equation of
//! [`super::measurement`]: analytic sensitivity coefficients for all nine inputs (signal,
//! emissivity, reflected temperature, path transmittance and temperature, window
//! transmittance, reflectance, temperature and reflected temperature), the GUM budget with
//! correlations, degrees of freedom and coverage ([`super::gum`]), and the measurement equation
//! as a [`MonteCarloModel`] for the Monte Carlo method ([`super::monte_carlo`]).
//!
//! # Method
//! The equation is F(T, p) = 0 with
//! ```text
//! F = τ_w·[τ(ε S(T) + (1 − ε) S(T_refl)) + (1 − τ) S(T_path)] + ρ_w S(T_int)
//!     + (1 − τ_w − ρ_w) S(T_w) − signal
//! ```
//! and implicit differentiation gives ∂T/∂p = −(∂F/∂p)/(∂F/∂T) from the model's S and dS/dT
//! alone. A derivative S′(T_x) is evaluated only where its weight is non-zero, so an input that
//! does not enter the equation (T_refl at ε = 1, T_path at τ = 1, T_w at τ_w + ρ_w = 1, T_int at
//! ρ_w = 0) gets the coefficient 0 whatever its value.
//!
//! Cautions: a budget is only as good as its input uncertainties and the model (grey object,
//! path and window in the instrument's band); it does not replace a validated calibration
//! procedure. Not for medical screening or process-safety decisions.
//!
//! # References
//! - JCGM 100:2008 §5 (law of propagation), eq. (10), (16); JCGM 101:2008 (Monte Carlo).
//! - P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
//!   Industry*, SPIE Press, 2007 (measurement equation) — from memory.
#![forbid(unsafe_code)]

use super::gum::{propagate, Correlation, Coverage, GumEntry, GumResult, InputUncertainty};
use super::measurement::{object_temperature, Conditions, Window};
use super::model::SignalModel;
use super::monte_carlo::MonteCarloModel;
use crate::{Error, Result};

/// The nine inputs of the measurement equation, in the order of every array in this module.
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement_gum::MeasurementInput;
/// assert_eq!(MeasurementInput::ALL[5], MeasurementInput::WindowTransmittance);
/// assert_eq!(MeasurementInput::WindowTemperature.index(), 7);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum MeasurementInput {
    /// The measured signal (model units).
    Signal,
    /// Object emissivity ε.
    Emissivity,
    /// Reflected (surroundings) temperature T_refl, K.
    ReflectedTemperature,
    /// Path transmittance τ.
    PathTransmittance,
    /// Path temperature T_path, K.
    PathTemperature,
    /// Window transmittance τ_w.
    WindowTransmittance,
    /// Window reflectance ρ_w.
    WindowReflectance,
    /// Window temperature T_w, K.
    WindowTemperature,
    /// Temperature T_int of what the window reflects into the instrument, K.
    WindowReflectedTemperature,
}

impl MeasurementInput {
    /// All inputs in order.
    pub const ALL: [MeasurementInput; 9] = [
        MeasurementInput::Signal,
        MeasurementInput::Emissivity,
        MeasurementInput::ReflectedTemperature,
        MeasurementInput::PathTransmittance,
        MeasurementInput::PathTemperature,
        MeasurementInput::WindowTransmittance,
        MeasurementInput::WindowReflectance,
        MeasurementInput::WindowTemperature,
        MeasurementInput::WindowReflectedTemperature,
    ];

    /// Position in the arrays of this module.
    ///
    /// # Examples
    /// See [`MeasurementInput`].
    pub const fn index(self) -> usize {
        self as usize
    }
}

/// Sensitivity coefficients ∂T_obj/∂x_i of the object temperature to the nine inputs (K per
/// input unit), in the order of [`MeasurementInput`].
///
/// # Examples
/// See [`measurement_sensitivities`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MeasurementSensitivities {
    /// The object temperature the signal gives, K.
    pub temperature_k: f64,
    /// c_i = ∂T/∂x_i; the window's four are 0 without a window.
    pub coefficients: [f64; 9],
}

impl MeasurementSensitivities {
    /// The coefficient of one input.
    ///
    /// # Examples
    /// See [`measurement_sensitivities`].
    pub fn get(&self, input: MeasurementInput) -> f64 {
        self.coefficients[input.index()]
    }
}

/// S and S′ at an input temperature, the derivative only where its weight is non-zero (out of
/// line: [`measurement_sensitivities`] asks for four of them).
#[inline(never)]
fn signal_pair<M: SignalModel + ?Sized>(
    model: &M,
    temperature_k: f64,
    weight: f64,
) -> Result<(f64, f64)> {
    if weight != 0.0 {
        model.signal_and_derivative(temperature_k)
    } else {
        Ok((model.signal(temperature_k)?, 0.0))
    }
}

/// Analytic sensitivity coefficients of the object temperature to all nine inputs of the
/// measurement equation at `signal` under `conditions`.
///
/// # Formula
/// ```text
/// ∂T/∂p = −(∂F/∂p)/(∂F/∂T),   ∂F/∂T = τ_w τ ε S′(T)
/// ∂F/∂signal = −1                       ∂F/∂ε      = τ_w τ (S(T) − S(T_refl))
/// ∂F/∂T_refl = τ_w τ (1 − ε) S′(T_refl)  ∂F/∂τ      = τ_w (ε S(T) + (1 − ε) S(T_refl) − S(T_path))
/// ∂F/∂T_path = τ_w (1 − τ) S′(T_path)    ∂F/∂τ_w    = scene − S(T_w)
/// ∂F/∂ρ_w    = S(T_int) − S(T_w)         ∂F/∂T_w    = (1 − τ_w − ρ_w) S′(T_w)
/// ∂F/∂T_int  = ρ_w S′(T_int)             scene = τ(ε S(T) + (1 − ε) S(T_refl)) + (1 − τ) S(T_path)
/// ```
/// (∂F/∂τ_w and ∂F/∂ρ_w vary one of τ_w, ρ_w at fixed other, the window's emissivity taking
/// up the change.)
///
/// # Errors
/// Those of [`object_temperature`] and of the model; `NoSolution` if dS/dT is 0 at the
/// solution (signal underflow); `OutOfRange` naming the reflected, path or window temperature
/// whose model signal overflows when a coefficient would be infinite (`NoSolution` when no
/// single temperature is to blame).
///
/// # Accuracy
/// Analytic; agrees with mpmath numerical differentiation of a 50-digit solve with window to
/// 1.3e-14 relative (Sakuma–Hattori and 10 µm spectral-point models,
/// `tests/gum_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::{Conditions, Window};
/// use quantaband::thermometry::measurement_gum::{measurement_sensitivities, MeasurementInput};
/// use quantaband::thermometry::model::SpectralPoint;
/// let m = SpectralPoint::new(10e-6, Default::default()).unwrap();
/// let w = Window { transmittance: 0.9, reflectance: 0.04, temperature_k: 310.0, reflected_temperature_k: 300.0 };
/// let c = Conditions { emissivity: 0.9, window: Some(w), ..Conditions::BLACKBODY };
/// let s = measurement_sensitivities(&m, 2e7, &c).unwrap();
/// // a warmer window adds signal: the object must be cooler for the same reading
/// assert!(s.get(MeasurementInput::WindowTemperature) < 0.0);
/// // a more transparent window means a cooler object for the same reading
/// assert!(s.get(MeasurementInput::WindowTransmittance) < 0.0);
/// ```
///
/// # References
/// JCGM 100:2008 §5.1.3 (sensitivity coefficients); implicit function theorem.
pub fn measurement_sensitivities<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    conditions: &Conditions,
) -> Result<MeasurementSensitivities> {
    let t = object_temperature(model, signal, conditions)?;
    let (s_t, ds_t) = model.signal_and_derivative(t)?;
    let eps = conditions.emissivity;
    let tau = conditions.path_transmittance;
    let (tw, rw) = conditions
        .window
        .map_or((1.0, 0.0), |w| (w.transmittance, w.reflectance));
    let df_dt = tw * tau * eps * ds_t;
    if !(df_dt > 0.0 && df_dt.is_finite()) {
        return Err(Error::NoSolution {
            what: "dS/dT vanishes at the solution (signal underflow)",
        });
    }
    let pair = |temperature_k: f64, weight: f64| signal_pair(model, temperature_k, weight);
    let (s_r, ds_r) = pair(conditions.reflected_temperature_k, 1.0 - eps)?;
    let (s_p, ds_p) = pair(conditions.path_temperature_k, 1.0 - tau)?;
    let c = |df_dp: f64| -df_dp / df_dt;
    let mut k = [0.0; 9];
    k[0] = 1.0 / df_dt;
    k[1] = c(tw * tau * (s_t - s_r));
    k[2] = if eps < 1.0 {
        c(tw * tau * (1.0 - eps) * ds_r)
    } else {
        0.0
    };
    let scene_unit = eps * s_t + (1.0 - eps) * s_r;
    k[3] = c(tw * (scene_unit - s_p));
    k[4] = if tau < 1.0 {
        c(tw * (1.0 - tau) * ds_p)
    } else {
        0.0
    };
    // The first input temperature whose model signal (or its derivative) overflows.
    let finite = |(v, d): (f64, f64)| v.is_finite() && d.is_finite();
    let mut overflow = if !finite((s_r, ds_r)) {
        Some((
            "reflected_temperature_k",
            conditions.reflected_temperature_k,
        ))
    } else if !finite((s_p, ds_p)) {
        Some(("path_temperature_k", conditions.path_temperature_k))
    } else {
        None
    };
    if let Some(w) = conditions.window {
        let emis = (1.0 - tw - rw).max(0.0);
        let (s_w, ds_w) = pair(w.temperature_k, emis)?;
        let (s_i, ds_i) = pair(w.reflected_temperature_k, rw)?;
        let scene = tau * scene_unit + (1.0 - tau) * s_p;
        k[5] = c(scene - s_w);
        k[6] = c(s_i - s_w);
        k[7] = if emis > 0.0 { c(emis * ds_w) } else { 0.0 };
        k[8] = if rw > 0.0 { c(rw * ds_i) } else { 0.0 };
        if overflow.is_none() && !finite((s_w, ds_w)) {
            overflow = Some(("window.temperature_k", w.temperature_k));
        } else if overflow.is_none() && !finite((s_i, ds_i)) {
            overflow = Some(("window.reflected_temperature_k", w.reflected_temperature_k));
        }
    }
    // A coefficient that overflowed is an error, not an infinite sensitivity (an input whose
    // weight is zero has the coefficient 0 whatever its temperature).
    if k.iter().any(|v| !v.is_finite()) {
        return Err(match overflow {
            Some((arg, value)) => Error::OutOfRange {
                arg,
                value,
                range: "temperatures whose model signal is finite",
            },
            None => Error::NoSolution {
                what: "the sensitivity coefficients overflow at this reading",
            },
        });
    }
    Ok(MeasurementSensitivities {
        temperature_k: t,
        coefficients: k,
    })
}

/// The input estimates of the measurement equation in [`MeasurementInput`] order: the signal
/// and the conditions' values (without a window τ_w = 1, ρ_w = 0, and T_w = T_int = 293.15 K,
/// which then do not enter).
///
/// # Formula
/// ```text
/// x = [signal, ε, T_refl, τ, T_path, τ_w, ρ_w, T_w, T_int]
/// ```
///
/// # Errors
/// None (no validation; the functions that use the vector validate it).
///
/// # Accuracy
/// Exact (copies).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::measurement_gum::measurement_estimates;
/// let x = measurement_estimates(120.0, &Conditions::BLACKBODY);
/// assert_eq!((x[0], x[1], x[5], x[6]), (120.0, 1.0, 1.0, 0.0));
/// ```
///
/// # References
/// See the module docs.
pub fn measurement_estimates(signal: f64, conditions: &Conditions) -> [f64; 9] {
    let w = conditions.window.unwrap_or(Window {
        transmittance: 1.0,
        reflectance: 0.0,
        temperature_k: 293.15,
        reflected_temperature_k: 293.15,
    });
    [
        signal,
        conditions.emissivity,
        conditions.reflected_temperature_k,
        conditions.path_transmittance,
        conditions.path_temperature_k,
        w.transmittance,
        w.reflectance,
        w.temperature_k,
        w.reflected_temperature_k,
    ]
}

/// A GUM budget of the object temperature (temperatures and uncertainties in K), returned by
/// [`measurement_budget`].
///
/// # Examples
/// See [`measurement_budget`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct MeasurementBudget {
    /// The object temperature, K.
    pub temperature_k: f64,
    /// One line per input, in [`MeasurementInput`] order.
    pub entries: [GumEntry; 9],
    /// Combined, effective degrees of freedom, coverage factor, expanded uncertainty, method.
    pub result: GumResult,
}

/// GUM uncertainty budget of the object temperature at `signal` under `conditions`: the
/// analytic coefficients of [`measurement_sensitivities`] with the nine inputs' uncertainties
/// `inputs` (in [`MeasurementInput`] order), an optional 9×9 correlation matrix (e.g. reflected
/// and path temperatures read by the same sensor) and the coverage asked for.
///
/// # Formula
/// ```text
/// c = measurement_sensitivities(…);  gum::propagate(c, inputs, correlation, coverage)
/// ```
///
/// # Errors
/// Those of [`measurement_sensitivities`] and [`propagate`]; `LengthMismatch` for a
/// correlation matrix that is not 9×9; `Unsupported` when a window input has a non-zero
/// uncertainty but the conditions have no window.
///
/// # Accuracy
/// As [`measurement_sensitivities`] and [`propagate`]: a correlated case with window agrees
/// with an mpmath evaluation (numerical derivatives, explicit double sum) to 1.3e-14 relative
/// in u_c, ν_eff, k and U (`tests/gum_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::gum::{Correlation, Coverage, InputUncertainty};
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::measurement_gum::{measurement_budget, MeasurementInput};
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// let curve = SakumaHattori::new(10e-6, 1.8e-4, 1e6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.9, reflected_temperature_k: 295.0,
///     path_transmittance: 0.98, path_temperature_k: 293.0, window: None };
/// let mut u = [InputUncertainty::ZERO; 9];
/// u[0] = InputUncertainty::type_a(300.0, 9.0).unwrap();  // signal: 10 readings
/// u[1] = InputUncertainty::rectangular(0.02).unwrap();  // emissivity ± 0.02
/// u[2] = InputUncertainty::type_b(3.0).unwrap();        // T_refl
/// u[4] = InputUncertainty::type_b(3.0).unwrap();        // T_path, same sensor as T_refl:
/// let mut r = [0.0; 81];
/// for i in 0..9 { r[i * 9 + i] = 1.0; }
/// r[2 * 9 + 4] = 0.8;
/// r[4 * 9 + 2] = 0.8;
/// let r = Correlation::new(&r).unwrap();
/// let b = measurement_budget(&curve, 30_000.0, &c, &u, Some(&r), Coverage::default()).unwrap();
/// // finite effective degrees of freedom: k above the normal 1.96
/// assert!(b.result.coverage_factor > 1.96 && b.result.effective_degrees_of_freedom.unwrap() < 1e3);
/// let shares: f64 = b.entries.iter().map(|e| e.variance_share).sum();
/// assert!((shares - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// JCGM 100:2008 eq. (10), (16), (G.2b), §6.
pub fn measurement_budget<M: SignalModel + ?Sized>(
    model: &M,
    signal: f64,
    conditions: &Conditions,
    inputs: &[InputUncertainty; 9],
    correlation: Option<&Correlation<'_>>,
    coverage: Coverage,
) -> Result<MeasurementBudget> {
    if conditions.window.is_none() && inputs[5..].iter().any(|u| u.standard_uncertainty != 0.0) {
        return Err(Error::Unsupported {
            what: "window uncertainties need a window in the conditions",
        });
    }
    let s = measurement_sensitivities(model, signal, conditions)?;
    let mut entries = [GumEntry::default(); 9];
    let result = propagate(
        &s.coefficients,
        inputs,
        correlation,
        coverage,
        Some(&mut entries),
    )?;
    Ok(MeasurementBudget {
        temperature_k: s.temperature_k,
        entries,
        result,
    })
}

/// The measurement equation as a Monte Carlo model: input values in [`MeasurementInput`]
/// order → object temperature (K) by [`object_temperature`]. A draw outside the equation's
/// domain (ε or τ outside (0, 1], a signal at or below the background…) fails and is counted
/// as an invalid trial.
///
/// Per trial it costs one inverse of the model plus one signal per reflected, path and window
/// term present: with a [`super::sakuma_hattori::SakumaHattori`] curve (closed-form inverse)
/// a trial with sampling costs about 0.6 µs natively (10⁶ trials ≈ 0.7 s, measured); an
/// exact response-integral model ([`super::response::ResponseSignal`]) costs ~10³ times more
/// per trial — fit a curve with [`super::sakuma_hattori::SakumaHattori::fit_model`] first and
/// add its interpolation error.
///
/// # Formula
/// ```text
/// T_obj = S⁻¹((signal − background(x))/gain(x))     (see measurement::object_temperature)
/// ```
///
/// # Errors
/// `evaluate`: those of [`object_temperature`] (→ an invalid trial in a run);
/// `LengthMismatch` for an input slice that is not 9 long.
///
/// # Accuracy
/// That of [`object_temperature`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::measurement_gum::{measurement_estimates, MeasurementEquation};
/// use quantaband::thermometry::monte_carlo::MonteCarloModel;
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// let curve = SakumaHattori::new(10e-6, 1.8e-4, 1e6, Default::default()).unwrap();
/// let c = Conditions { emissivity: 0.9, ..Conditions::BLACKBODY };
/// let eq = MeasurementEquation::new(&curve, &c);
/// let t = eq.evaluate(&measurement_estimates(30_000.0, &c)).unwrap();
/// assert!(t > 300.0 && t < 500.0);
/// ```
///
/// # References
/// See the module docs.
#[derive(Debug, Clone, Copy)]
pub struct MeasurementEquation<'a, M: SignalModel + ?Sized> {
    model: &'a M,
    has_window: bool,
}

impl<'a, M: SignalModel + ?Sized> MeasurementEquation<'a, M> {
    /// The equation for `model`, with a window when `conditions` has one.
    ///
    /// # Examples
    /// See [`MeasurementEquation`].
    pub fn new(model: &'a M, conditions: &Conditions) -> Self {
        MeasurementEquation {
            model,
            has_window: conditions.window.is_some(),
        }
    }
}

impl<M: SignalModel + ?Sized> MonteCarloModel for MeasurementEquation<'_, M> {
    fn evaluate(&self, x: &[f64]) -> Result<f64> {
        let [signal, eps, t_r, tau, t_p, tw, rw, t_w, t_i] = x else {
            return Err(Error::LengthMismatch {
                expected: 9,
                got: x.len(),
            });
        };
        let conditions = Conditions {
            emissivity: *eps,
            reflected_temperature_k: *t_r,
            path_transmittance: *tau,
            path_temperature_k: *t_p,
            window: if self.has_window {
                Some(Window {
                    transmittance: *tw,
                    reflectance: *rw,
                    temperature_k: *t_w,
                    reflected_temperature_k: *t_i,
                })
            } else {
                None
            },
        };
        object_temperature(self.model, *signal, &conditions)
    }
}
