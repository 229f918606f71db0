//! The spectral (non-grey) measurement equation: target emissivity, target reflectance, path
//! transmittance and window transmittance and reflectance as functions of wavelength
//! ([`SpectralTable`]s or constants), integrated with the instrument's spectral response in
//! energy or photon units; its inverse (object temperature from a signal), the band-effective
//! emissivity and transmittances, and the sensitivity coefficients of the object temperature.
//!
//! # The model
//! With R(λ) the instrument response ([`SpectralInstrument`]) and L(λ, T) Planck's spectral
//! radiance (energy units for an energy response; photon units L·λ/(hc) for a photon
//! response), the signal is
//!
//! ```text
//! signal = ∫ R(λ)·{ τ_w(λ)·[ τ_p(λ)·( ε(λ)·L(λ,T) + ρ(λ)·L(λ,T_refl) ) + (1 − τ_p(λ))·L(λ,T_path) ]
//!                   + ρ_w(λ)·L(λ,T_int) + (1 − τ_w(λ) − ρ_w(λ))·L(λ,T_w) } dλ
//!
//! ε(λ)     target emissivity                    T       object temperature
//! ρ(λ)     target reflectance: 1 − ε(λ) for an  T_refl  temperature of the surroundings the
//!          opaque target, or its own table               target reflects
//! τ_p(λ)   path transmittance (the path emits   T_path  path temperature
//!          1 − τ_p: Kirchhoff, no scattering)
//! τ_w(λ)   window transmittance                 T_w     window temperature (emissivity
//! ρ_w(λ)   window reflectance (instrument side)          1 − τ_w − ρ_w)
//!                                               T_int   what the window reflects into the
//!                                                       instrument
//! ```
//!
//! Without a window τ_w = 1 and ρ_w = 0. The signal is affine in the object term:
//! `signal = G(T) + B`, with `G(T) = ∫ R·τ_w·τ_p·ε·L(λ,T) dλ` strictly increasing in T and the
//! background `B` (every other term) independent of T; so `T = G⁻¹(signal − B)`, found by the
//! crate's safeguarded Newton iteration ([`super::model::invert_monotone`]). A signal at or
//! below B has no physical solution ([`Error::NoPhysicalSolution`]). With every input constant
//! the model is the grey one of [`super::measurement`] and gives its numbers to rounding
//! (tested).
//!
//! # Method and accuracy
//! All tables are linear between their own grid points, so on each interval of the *union* of
//! the grids (the response's, and every table's) each factor is a straight line and their
//! product a polynomial of degree ≤ 5. Each such interval is split into the geometric pieces
//! of [`super::response`] (≤ a factor e^0.3 in λ, ≤ 6 in x = c2/(λT), the part where L is below
//! e⁻⁵⁰ of its maximum on the interval skipped) and every piece is integrated with the 20-point
//! Gauss–Legendre rule. No piece straddles a table point, so there is no interpolation error:
//! the rule integrates polynomial × Planck function, which is analytic in a Bernstein ellipse
//! around the piece, and its error is bounded by Trefethen's theorem (ATAP Thm 19.3):
//! |I − I_n| ≤ (64/15)·M·ρ^(−2n)/(ρ² − 1)·h, with h the half-length of the piece and M the
//! largest |integrand| on the Bernstein ellipse E_ρ. Short pieces (fine tables) take a 4-, 6- or
//! 8-point rule instead of the 20-point one (see the table below). `tests/data/gen_spectral.py`
//! evaluates the bound for the worst pieces of each class (a product of up to 4 linear factors,
//! bounded on E_ρ by (1 + a_ρ)⁴ times its coefficients and on the piece from below by the
//! multilinear minimum; x = c2/(λT) from 1e-3 to 1e4, energy and photon units): at most 3.5e-17
//! of the piece's integral (key `quadrature_bound` of `tests/data/spectral_reference.json`).
//! Every integrand is ≥ 0, so the same relative bound holds for the whole band: the quadrature
//! is exact for the interpolants to rounding. Measured against mpmath `quad` of the same
//! interpolants: see [`spectral_measured_signal`].
//!
//! ```text
//! rule    pieces (ln(q/p) ≤ w and Δx = x(p) − x(q) ≤ δ)    a-priori bound, relative
//! 4-pt    w ≤ 0.001, δ ≤ 0.02                               3.5e-17
//! 6-pt    w ≤ 0.01,  δ ≤ 0.2                                6.2e-20
//! 8-pt    w ≤ 0.03,  δ ≤ 0.6                                1.2e-22
//! 20-pt   every piece of the subdivision (w ≤ 0.3, δ ≤ 6)   9.0e-37
//! ```
//!
//! Terms at temperatures within a factor 2 of each other share one walk over the band, with
//! the pieces made for the coldest of them and the short-wave skip for the hottest (valid for
//! all of them, see [`super::response`]'s `march_pieces`); terms at widely different
//! temperatures are walked separately, so each gets pieces that suit it. Terms whose weight is
//! identically zero (ε = 1 and opaque, τ_p = 1, no window…) are skipped. Node values
//! are scaled by an exact power of two at temperatures where L would overflow
//! (T ≳ 1e290 K), so results are finite wherever the true values are.
//!
//! Cautions: these are calculations, not measurements; spectral tables from a handbook
//! describe a sample, not necessarily your target. They do not replace calibrated instruments
//! and standard procedures; not for medical screening or process-safety decisions; defer to
//! local codes and standards.
//!
//! # References
//! - P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
//!   Industry*, SPIE Press, 2007 (measurement equation with reflection, path and window
//!   terms) — from memory.
//! - L. N. Trefethen, *Approximation Theory and Approximation Practice*, SIAM, 2013,
//!   Theorem 19.3 (Gauss quadrature error for analytic integrands).
//! - JCGM 100:2008 (GUM), §5.1.3 (sensitivity coefficients as partial derivatives).
#![forbid(unsafe_code)]

use super::gauss_legendre::{integrate_rule_pairs, Rule, GL20, GL4, GL6, GL8};
use super::kernel::ScaledRadiance;
use super::measurement::Conditions;
use super::model::{invert_monotone, SignalModel};
use super::response::{march_pieces, node_scale_exp};
use super::table::{Ends, SpectralTable, TableKind};
use crate::constants::C2Convention;
use crate::error::{finite, positive, temperature};
use crate::{Error, Result};

/// A spectral input: a constant (grey) value or a [`SpectralTable`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::SpectralValue;
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let grey = SpectralValue::Constant(0.95);
/// let (wl, e) = ([8e-6, 14e-6], [0.95, 0.85]);
/// let table = SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &wl, &e).unwrap());
/// assert_eq!(grey.value_at(10e-6).unwrap(), 0.95);
/// assert!((table.value_at(11e-6).unwrap() - 0.90).abs() < 1e-15);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SpectralValue<'a> {
    /// The same value at every wavelength (dimensionless, in [0, 1]).
    Constant(f64),
    /// A table of the matching [`TableKind`].
    Table(SpectralTable<'a>),
}

impl SpectralValue<'_> {
    /// The value at `wavelength_m` (m).
    ///
    /// # Formula
    /// The constant, or [`SpectralTable::value_at`].
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveSpectral` for a bad wavelength; `NonFinite` (arg `constant`) for
    /// a NaN or infinite constant; those of [`SpectralTable::value_at`].
    ///
    /// # Accuracy
    /// A few ulp.
    ///
    /// # Examples
    /// See [`SpectralValue`].
    ///
    /// # References
    /// See [`super::table`].
    pub fn value_at(&self, wavelength_m: f64) -> Result<f64> {
        crate::error::spectral("wavelength_m", wavelength_m)?;
        match self {
            SpectralValue::Constant(c) => crate::error::finite("constant", *c),
            SpectralValue::Table(t) => t.value_at(wavelength_m),
        }
    }

    fn is_constant(&self, c: f64) -> bool {
        matches!(self, SpectralValue::Constant(v) if *v == c)
    }
}

/// A window between the scene and the instrument with spectral transmittance and reflectance
/// (dimensionless) and two temperatures (K); the spectral form of
/// [`super::measurement::Window`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{SpectralConditions, SpectralValue, SpectralWindow};
/// let w = SpectralWindow {
///     transmittance: SpectralValue::Constant(0.9),
///     reflectance: SpectralValue::Constant(0.2),
///     temperature_k: 300.0,
///     reflected_temperature_k: 300.0,
/// };
/// // τ_w + ρ_w = 1.1 > 1 is rejected
/// let c = SpectralConditions { window: Some(w), ..SpectralConditions::BLACKBODY };
/// assert_eq!(c.validate().unwrap_err().code(), "INVALID_TABLE_ENTRY");
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectralWindow<'a> {
    /// Transmittance τ_w(λ) (a constant or a [`TableKind::Transmittance`] table).
    pub transmittance: SpectralValue<'a>,
    /// Reflectance ρ_w(λ) towards the instrument (a constant or a
    /// [`TableKind::Reflectance`] table); τ_w + ρ_w ≤ 1 at every wavelength.
    pub reflectance: SpectralValue<'a>,
    /// Window temperature T_w, K (its emission is (1 − τ_w − ρ_w)·L(T_w)).
    pub temperature_k: f64,
    /// Temperature T_int of what the window reflects into the instrument, K.
    pub reflected_temperature_k: f64,
}

/// Conditions of a spectral measurement (the symbols of the module docs). Every function
/// validates them with [`SpectralConditions::validate`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{SpectralConditions, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, e) = ([8e-6, 10e-6, 14e-6], [0.95, 0.60, 0.90]);
/// let c = SpectralConditions {
///     emissivity: SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &wl, &e).unwrap()),
///     reflected_temperature_k: 296.0,
///     ..SpectralConditions::BLACKBODY
/// };
/// assert!(c.validate().is_ok());
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectralConditions<'a> {
    /// Target emissivity ε(λ) (a constant or a [`TableKind::Emissivity`] table).
    pub emissivity: SpectralValue<'a>,
    /// Target reflectance ρ(λ): `None` for an opaque target (ρ = 1 − ε), or a constant or a
    /// [`TableKind::Reflectance`] table (a semi-transparent target; ε + ρ ≤ 1 everywhere).
    pub reflectance: Option<SpectralValue<'a>>,
    /// Temperature of the surroundings reflected by the target, K.
    pub reflected_temperature_k: f64,
    /// Path transmittance τ_p(λ) (a constant or a [`TableKind::Transmittance`] table).
    pub path_transmittance: SpectralValue<'a>,
    /// Path temperature, K.
    pub path_temperature_k: f64,
    /// Optional window; `None` means τ_w = 1, ρ_w = 0.
    pub window: Option<SpectralWindow<'a>>,
}

/// Tolerance on sums that must not exceed 1 (τ_w + ρ_w, ε + ρ), for rounding in the tables.
const SUM_SLACK: f64 = 1e-15;

impl<'a> SpectralConditions<'a> {
    /// A blackbody in vacuum: ε = 1 (opaque), τ_p = 1, no window (the reflected and path
    /// temperatures are then irrelevant and set to 293.15 K).
    pub const BLACKBODY: SpectralConditions<'static> = SpectralConditions {
        emissivity: SpectralValue::Constant(1.0),
        reflectance: None,
        reflected_temperature_k: 293.15,
        path_transmittance: SpectralValue::Constant(1.0),
        path_temperature_k: 293.15,
        window: None,
    };

    /// The grey conditions of [`super::measurement`] as constant spectral inputs.
    ///
    /// # Formula
    /// ```text
    /// ε(λ) = ε,  ρ(λ) = 1 − ε (opaque),  τ_p(λ) = τ,  τ_w(λ) = τ_w,  ρ_w(λ) = ρ_w
    /// ```
    ///
    /// # Errors
    /// None (validated when used).
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::measurement::Conditions;
    /// use quantaband::thermometry::spectral::{SpectralConditions, SpectralValue};
    /// let c = SpectralConditions::from_grey(&Conditions { emissivity: 0.9, ..Conditions::BLACKBODY });
    /// assert_eq!(c.emissivity, SpectralValue::Constant(0.9));
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn from_grey(conditions: &Conditions) -> SpectralConditions<'static> {
        SpectralConditions {
            emissivity: SpectralValue::Constant(conditions.emissivity),
            reflectance: None,
            reflected_temperature_k: conditions.reflected_temperature_k,
            path_transmittance: SpectralValue::Constant(conditions.path_transmittance),
            path_temperature_k: conditions.path_temperature_k,
            window: conditions.window.map(|w| SpectralWindow {
                transmittance: SpectralValue::Constant(w.transmittance),
                reflectance: SpectralValue::Constant(w.reflectance),
                temperature_k: w.temperature_k,
                reflected_temperature_k: w.reflected_temperature_k,
            }),
        }
    }

    /// Checks every input.
    ///
    /// # Formula
    /// ```text
    /// constants finite and in [0, 1];  tables of the matching kind;  temperatures finite, > 0 K;
    /// ε + ρ ≤ 1 and τ_w + ρ_w ≤ 1 at every grid point of either table (both are linear between
    /// the points of the union grid, so this holds at every wavelength)
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `OutOfRange` for a bad constant (arg: the field); `Unsupported` for a table
    /// of the wrong kind; `NonFinite` / `NonPositiveTemperature` for a temperature;
    /// `InvalidTableEntry` (arg `window.reflectance.values` or `window.transmittance.values`,
    /// the index of the grid point, the sum as value) where τ_w + ρ_w > 1, and likewise
    /// (`reflectance.values` / `emissivity.values`) where ε + ρ > 1 (a sum of two constants is
    /// reported at index 0).
    ///
    /// # Accuracy
    /// Exact comparisons (sums may exceed 1 by 1e-15 for rounding).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::spectral::{SpectralConditions, SpectralValue};
    /// let c = SpectralConditions { emissivity: SpectralValue::Constant(1.5), ..SpectralConditions::BLACKBODY };
    /// assert_eq!(c.validate().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn validate(&self) -> Result<()> {
        check_value("emissivity", &self.emissivity, TableKind::Emissivity)?;
        if let Some(r) = &self.reflectance {
            check_value("reflectance", r, TableKind::Reflectance)?;
            check_sum(
                (&self.emissivity, "emissivity.values"),
                (r, "reflectance.values"),
            )?;
        }
        temperature("reflected_temperature_k", self.reflected_temperature_k)?;
        check_value(
            "path_transmittance",
            &self.path_transmittance,
            TableKind::Transmittance,
        )?;
        temperature("path_temperature_k", self.path_temperature_k)?;
        if let Some(w) = &self.window {
            check_value(
                "window.transmittance",
                &w.transmittance,
                TableKind::Transmittance,
            )?;
            check_value("window.reflectance", &w.reflectance, TableKind::Reflectance)?;
            check_sum(
                (&w.transmittance, "window.transmittance.values"),
                (&w.reflectance, "window.reflectance.values"),
            )?;
            temperature("window.temperature_k", w.temperature_k)?;
            temperature("window.reflected_temperature_k", w.reflected_temperature_k)?;
        }
        Ok(())
    }

    /// Checks every input ([`SpectralConditions::validate`]) and that every table without
    /// constant ends covers the band of `instrument` (the span of its response segments with
    /// some response): the checks every calculation with this instrument makes first, without
    /// integrating anything — for a caller that prepares a scene once and wants its errors
    /// at once rather than at the first calculation.
    ///
    /// # Formula
    /// ```text
    /// validate()  and  λ_first ≤ λ_lo, λ_last ≥ λ_hi for every table with Ends::Reject,
    /// [λ_lo, λ_hi] = span of the response segments with R > 0 at one end
    /// ```
    ///
    /// # Errors
    /// Those of [`SpectralConditions::validate`]; `OutsideTable` (arg: the input, the first
    /// band edge it misses) for a table that does not cover the band.
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::spectral::{SpectralConditions, SpectralInstrument, SpectralValue};
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
    /// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
    /// // an emissivity table that stops at 12 µm does not cover the 8–14 µm band
    /// let (ew, ev) = ([8e-6, 12e-6], [0.9, 0.8]);
    /// let c = SpectralConditions {
    ///     emissivity: SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap()),
    ///     ..SpectralConditions::BLACKBODY
    /// };
    /// assert_eq!(c.validate_for(&inst).unwrap_err().code(), "OUTSIDE_TABLE");
    /// assert!(SpectralConditions::BLACKBODY.validate_for(&inst).is_ok());
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn validate_for(&self, instrument: &SpectralInstrument<'_>) -> Result<()> {
        Prepared::new(instrument, self).map(|_| ())
    }
}

fn check_value(arg: &'static str, v: &SpectralValue<'_>, kind: TableKind) -> Result<()> {
    match v {
        SpectralValue::Constant(c) => {
            crate::error::unit_interval_closed(arg, *c)?;
        }
        SpectralValue::Table(t) => {
            if t.kind() != kind {
                return Err(Error::Unsupported {
                    what: match kind {
                        TableKind::Emissivity => "this input needs an emissivity table",
                        TableKind::Reflectance => "this input needs a reflectance table",
                        _ => "this input needs a transmittance table",
                    },
                });
            }
        }
    }
    Ok(())
}

/// The value of `v` at `wavelength_m` where it is defined (inside the grid or with constant
/// ends), else `None`.
fn defined_at(v: &SpectralValue<'_>, wavelength_m: f64) -> Option<f64> {
    v.value_at(wavelength_m).ok()
}

/// a + b ≤ 1 (+ slack) at every grid point of either table where both are defined.
fn check_sum(
    a: (&SpectralValue<'_>, &'static str),
    b: (&SpectralValue<'_>, &'static str),
) -> Result<()> {
    let over = |s: f64| s > 1.0 + SUM_SLACK;
    match (a.0, b.0) {
        (SpectralValue::Constant(x), SpectralValue::Constant(y)) => {
            if over(x + y) {
                return Err(Error::InvalidTableEntry {
                    arg: b.1,
                    index: 0,
                    value: x + y,
                    range: "[0, 1] (sum of the two)",
                });
            }
        }
        _ => {
            // The points of b's grid first, then a's (the error names the table whose point it is).
            for (this, other) in [(b, a), (a, b)] {
                if let SpectralValue::Table(t) = this.0 {
                    for (i, (&w, &v)) in t.wavelengths_m().iter().zip(t.values()).enumerate() {
                        if let Some(o) = defined_at(other.0, w) {
                            if over(v + o) {
                                return Err(Error::InvalidTableEntry {
                                    arg: this.1,
                                    index: i,
                                    value: v + o,
                                    range: "[0, 1] (sum of the two)",
                                });
                            }
                        }
                    }
                }
            }
        }
    }
    Ok(())
}

/// An instrument for the spectral measurement equation: a response table in energy or photon
/// units ([`TableKind::EnergyResponse`] / [`TableKind::PhotonResponse`]; zero outside its grid)
/// and the c2 convention. As a [`SignalModel`] it gives the blackbody signal
/// S(T) = ∫ R(λ)·L(λ, T) dλ (W·m⁻²·sr⁻¹ per response unit, or photons·s⁻¹·m⁻²·sr⁻¹ per
/// response unit).
///
/// # Formula
/// ```text
/// energy response:  S(T) = ∫ R(λ)·L_λ(λ,T) dλ,          L_λ = c1L/(λ⁵(exp(c2/(λT)) − 1))
/// photon response:  S(T) = ∫ η(λ)·L_λ(λ,T)·λ/(hc) dλ   (photon radiance)
/// ```
///
/// # Errors
/// [`SpectralInstrument::new`]: `Unsupported` for a table that is not a response.
///
/// # Accuracy
/// As the module docs; an energy response gives [`super::response::ResponseSignal`]'s numbers
/// (the same pieces, a shorter rule on short pieces; ≤ 4e-16 relative in the tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::SignalModel;
/// use quantaband::thermometry::spectral::SpectralInstrument;
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// // mpmath quad (tests/data/gen_thermometry.py): ∫ 8–14 µm L_λ(λ, 300 K) dλ = 54.933461376…
/// assert!((inst.signal(300.0).unwrap() / 54.933_461_376_839_69 - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// M. Planck, *Ann. Phys.* 4, 553 (1901); photon radiance: W. L. Wolfe, G. J. Zissis (eds.),
/// *The Infrared Handbook*, ERIM, 1978, ch. 1 — from memory.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectralInstrument<'a> {
    response: SpectralTable<'a>,
    c2: C2Convention,
}

impl<'a> SpectralInstrument<'a> {
    /// An instrument from a response table and the c2 convention.
    ///
    /// # Formula
    /// See [`SpectralInstrument`].
    ///
    /// # Errors
    /// `Unsupported` if `response` is not an energy or photon response table.
    ///
    /// # Accuracy
    /// Exact (stores the table).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::spectral::SpectralInstrument;
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let t = SpectralTable::new(TableKind::Emissivity, &[1e-6, 2e-6], &[1.0, 1.0]).unwrap();
    /// assert_eq!(SpectralInstrument::new(t, Default::default()).unwrap_err().code(), "UNSUPPORTED");
    /// ```
    ///
    /// # References
    /// See [`SpectralInstrument`].
    pub fn new(response: SpectralTable<'a>, c2: C2Convention) -> Result<Self> {
        if !response.kind().is_response() {
            return Err(Error::Unsupported {
                what: "an instrument needs an energy or photon response table",
            });
        }
        Ok(SpectralInstrument { response, c2 })
    }

    /// The response table.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::spectral::SpectralInstrument;
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let t = SpectralTable::new(TableKind::PhotonResponse, &[1e-6, 2e-6], &[0.8, 0.6]).unwrap();
    /// let i = SpectralInstrument::new(t, Default::default()).unwrap();
    /// assert!(i.is_photon());
    /// assert_eq!(i.response().values(), &[0.8, 0.6]);
    /// ```
    pub fn response(&self) -> SpectralTable<'a> {
        self.response
    }

    /// Whether the response is in photon units ([`TableKind::PhotonResponse`]); see
    /// [`SpectralInstrument::response`] for an example.
    pub fn is_photon(&self) -> bool {
        self.response.kind() == TableKind::PhotonResponse
    }

    /// The c2 value in use, m·K.
    ///
    /// # Examples
    /// ```
    /// use quantaband::constants::C2Convention;
    /// use quantaband::thermometry::spectral::SpectralInstrument;
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let t = SpectralTable::new(TableKind::EnergyResponse, &[1e-6, 2e-6], &[1.0, 1.0]).unwrap();
    /// // ITS-90 c2 = 0.014388 m·K (Preston-Thomas, Metrologia 27, 3, 1990)
    /// assert_eq!(SpectralInstrument::new(t, C2Convention::Its90).unwrap().c2_mk(), 0.014388);
    /// ```
    pub fn c2_mk(&self) -> f64 {
        self.c2.c2()
    }
}

impl SignalModel for SpectralInstrument<'_> {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        temperature("temperature_k", temperature_k)?;
        let p = Prepared::new(self, &SpectralConditions::BLACKBODY)?;
        let [s] = p.terms([Of::L(temperature_k)], |v| [v[R]])?;
        Ok(s)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        temperature("temperature_k", temperature_k)?;
        let p = Prepared::new(self, &SpectralConditions::BLACKBODY)?;
        let [s, ds] = p.terms([Of::L(temperature_k), Of::Dl(temperature_k)], |v| [v[R]; 2])?;
        Ok((s, ds))
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        positive("signal", signal)?;
        let p = Prepared::new(self, &SpectralConditions::BLACKBODY)?;
        p.solve(signal)
    }
}

// ---------------------------------------------------------------------------------------------
// Integration on the union grid.

/// Factor indices in a node's value array: response, emissivity, target reflectance, path
/// transmittance, window transmittance, window reflectance.
const R: usize = 0;
const E: usize = 1;
const RT: usize = 2;
const TP: usize = 3;
const TW: usize = 4;
const RW: usize = 5;
const NF: usize = 6;

/// A factor on one union interval: value at the interval's start `a` and slope (per m).
#[derive(Clone, Copy)]
struct Lin {
    v: f64,
    s: f64,
}

/// A factor being walked along the union grid: a constant (empty grid) or a table.
#[derive(Clone, Copy)]
struct Cursor<'a> {
    xs: &'a [f64],
    ys: &'a [f64],
    c: f64,
    /// Largest i with xs[i] ≤ the current point (0 below the grid).
    i: usize,
}

impl<'a> Cursor<'a> {
    fn of(v: &SpectralValue<'a>) -> Self {
        match v {
            SpectralValue::Constant(c) => Cursor::constant(*c),
            SpectralValue::Table(t) => Cursor::table(t),
        }
    }
    fn constant(c: f64) -> Self {
        Cursor {
            xs: &[],
            ys: &[],
            c,
            i: 0,
        }
    }
    fn table(t: &SpectralTable<'a>) -> Self {
        Cursor {
            xs: t.wavelengths_m(),
            ys: t.values(),
            c: 0.0,
            i: 0,
        }
    }
    /// Moves to the point `a` (never backwards) and returns the next grid point above `a`
    /// (+∞ if none).
    fn seek(&mut self, a: f64) -> f64 {
        while self.xs.get(self.i + 1).is_some_and(|&x| x <= a) {
            self.i += 1;
        }
        match self.xs.get(self.i) {
            None => f64::INFINITY,
            Some(&x) if x > a => x, // below the grid
            Some(_) => self.xs.get(self.i + 1).copied().unwrap_or(f64::INFINITY),
        }
    }
    /// The factor on an interval starting at `a` that lies between two consecutive points of
    /// the union grid (so inside one segment of this table, or beyond one of its ends, where
    /// the end value holds — the coverage check has rejected that case unless the table has
    /// constant ends).
    fn lin(&self, a: f64) -> Lin {
        let (xs, ys, i) = (self.xs, self.ys, self.i);
        match (xs.get(i), xs.get(i + 1), ys.get(i), ys.get(i + 1)) {
            (None, ..) => Lin { v: self.c, s: 0.0 },
            (Some(&x0), _, Some(&y0), _) if x0 > a => Lin { v: y0, s: 0.0 },
            (Some(&x0), Some(&x1), Some(&y0), Some(&y1)) => {
                let s = (y1 - y0) / (x1 - x0);
                Lin {
                    v: y0 + s * (a - x0),
                    s,
                }
            }
            (_, _, Some(&y0), _) => Lin { v: y0, s: 0.0 },
            _ => Lin { v: self.c, s: 0.0 },
        }
    }
}

/// Most outputs of one integration ([`Prepared::scaled_terms_dyn`]; the sensitivities use 14).
const MAX_TERMS: usize = 14;

/// Temperatures within this factor of each other are integrated in one walk (the pieces, made
/// for the coldest, are then at most this factor finer than the hottest needs).
const GROUP_RATIO: f64 = 2.0;

/// What one output of [`Prepared::terms`] integrates against its weight.
#[derive(Clone, Copy, PartialEq)]
enum Of {
    /// Nothing: the output is 0 (a term whose weight vanishes identically).
    Skip,
    /// L(λ, T) at this temperature, K.
    L(f64),
    /// ∂L/∂T(λ, T) at this temperature, K.
    Dl(f64),
}

/// A validated instrument and conditions, ready to integrate.
struct Prepared<'a, 'b> {
    cond: &'b SpectralConditions<'a>,
    /// The span of the response segments with some response.
    lo: f64,
    hi: f64,
    /// Cursors in factor order (R, E, RT, TP, TW, RW); RT unused (None) for an opaque target.
    cur: [Cursor<'a>; NF],
    opaque: bool,
    photon: bool,
    c2: C2Convention,
    c2_mk: f64,
}

impl<'a, 'b> Prepared<'a, 'b> {
    fn new(inst: &'b SpectralInstrument<'a>, cond: &'b SpectralConditions<'a>) -> Result<Self> {
        cond.validate()?;
        let rt = inst.response;
        let (w, v) = (rt.wavelengths_m(), rt.values());
        // The span of the segments with some response (the table has a positive value).
        let first = v.iter().position(|&x| x > 0.0).unwrap_or(0);
        let last = v.iter().rposition(|&x| x > 0.0).unwrap_or(0);
        let lo = w.get(first.saturating_sub(1)).copied().unwrap_or(f64::NAN);
        let hi = w
            .get((last + 1).min(w.len().saturating_sub(1)))
            .copied()
            .unwrap_or(f64::NAN);
        let (tw, rw) = match &cond.window {
            Some(win) => (win.transmittance, win.reflectance),
            None => (SpectralValue::Constant(1.0), SpectralValue::Constant(0.0)),
        };
        let rt_val = cond.reflectance.unwrap_or(SpectralValue::Constant(0.0));
        // Every table must cover [lo, hi] unless it has constant ends.
        let slots: [(&'static str, &SpectralValue<'a>); 5] = [
            ("emissivity", &cond.emissivity),
            ("reflectance", &rt_val),
            ("path_transmittance", &cond.path_transmittance),
            ("window.transmittance", &tw),
            ("window.reflectance", &rw),
        ];
        for (arg, s) in slots {
            if let SpectralValue::Table(t) = s {
                let (f, l) = t.span_m();
                if t.ends() == Ends::Reject && (f > lo || l < hi) {
                    return Err(Error::OutsideTable {
                        arg,
                        wavelength_m: if f > lo { lo } else { hi },
                        first_m: f,
                        last_m: l,
                    });
                }
            }
        }
        let mut r = Cursor::table(&rt);
        r.seek(lo);
        Ok(Prepared {
            cond,
            lo,
            hi,
            cur: [
                r,
                Cursor::of(&cond.emissivity),
                Cursor::of(&rt_val),
                Cursor::of(&cond.path_transmittance),
                Cursor::of(&tw),
                Cursor::of(&rw),
            ],
            opaque: cond.reflectance.is_none(),
            photon: inst.is_photon(),
            c2: inst.c2,
            c2_mk: inst.c2.c2(),
        })
    }

    /// Walks the union grid over [lo, hi] and hands each interval with some response, with
    /// its factors, to `f`.
    fn for_each_interval<F>(&self, mut f: F) -> Result<()>
    where
        F: FnMut(f64, f64, &[Lin; NF]) -> Result<()>,
    {
        let mut cur = self.cur;
        let mut a = self.lo;
        // The walk visits each grid point once; the guard only bounds the loop.
        let guard: usize = cur.iter().map(|c| c.xs.len()).sum::<usize>() + 2;
        for _ in 0..guard {
            if !(a < self.hi) {
                break;
            }
            let mut b = self.hi;
            for c in cur.iter_mut() {
                // not f64::min, a call to libm's fmin on wasm32 (the points are never NaN)
                let x = c.seek(a);
                if x < b {
                    b = x;
                }
            }
            let mut lins = [Lin { v: 0.0, s: 0.0 }; NF];
            for (l, c) in lins.iter_mut().zip(cur.iter()) {
                *l = c.lin(a);
            }
            if self.opaque {
                lins[RT] = Lin {
                    v: 1.0 - lins[E].v,
                    s: -lins[E].s,
                };
            }
            let r = lins[R];
            if r.v > 0.0 || r.v + r.s * (b - a) > 0.0 {
                f(a, b, &lins)?;
            }
            a = b;
        }
        Ok(())
    }

    /// N integrals: output j is ∫ w_j(factors)·L(λ, T_j) dλ or ∫ w_j·∂L/∂T(λ, T_j) dλ as
    /// `spec[j]` says (0 for [`Of::Skip`]). Outputs at the same temperature share the Planck
    /// evaluations; temperatures within a factor [`GROUP_RATIO`] share one walk over the band
    /// (pieces for the coldest, skip for the hottest, [`march_pieces`]), others get their own.
    fn terms<const N: usize, W>(&self, spec: [Of; N], w: W) -> Result<[f64; N]>
    where
        W: Fn(&[f64; NF]) -> [f64; N],
    {
        let (mut acc, ks) = self.scaled_terms(spec, w)?;
        for (s, &k) in acc.iter_mut().zip(ks.iter()) {
            *s *= crate::float::powi(2.0, k);
        }
        Ok(acc)
    }

    /// [`Prepared::terms`] before the scale is restored: output j is 2^(−k_j) times its value
    /// (k_j = 0 except where L would overflow, T ≳ 1e290 K), so that ratios of outputs at one
    /// temperature stay finite where the values themselves overflow.
    ///
    /// A thin typed front end of [`Prepared::scaled_terms_dyn`], which does the work for every
    /// output count and weight function (one copy of the integration code: each caller's
    /// weights are reached through one indirect call per node, which costs nothing measurable
    /// next to the Planck evaluations and keeps the WebAssembly package small).
    fn scaled_terms<const N: usize, W>(&self, spec: [Of; N], w: W) -> Result<([f64; N], [i32; N])>
    where
        W: Fn(&[f64; NF]) -> [f64; N],
    {
        let mut acc = [0.0; N];
        let mut out_k = [0i32; N];
        let weights = |v: &[f64; NF], out: &mut [f64; MAX_TERMS]| {
            for (o, x) in out.iter_mut().zip(w(v)) {
                *o = x;
            }
        };
        self.scaled_terms_dyn(&spec, &weights, &mut acc, &mut out_k)?;
        Ok((acc, out_k))
    }

    /// The integration of [`Prepared::scaled_terms`] for `spec.len()` ≤ [`MAX_TERMS`] outputs
    /// (`w` writes the weights of a node into the first `spec.len()` entries); results into
    /// `acc` and `out_k`.
    #[inline(never)]
    fn scaled_terms_dyn(
        &self,
        spec: &[Of],
        w: &dyn Fn(&[f64; NF], &mut [f64; MAX_TERMS]),
        acc: &mut [f64],
        out_k: &mut [i32],
    ) -> Result<()> {
        let n = spec.len();
        if n > MAX_TERMS || acc.len() != n || out_k.len() != n {
            return Err(Error::Unsupported {
                what: "internal: too many terms in one integration",
            });
        }
        // Distinct temperatures, which of L and ∂L/∂T each needs, and each output's slot.
        let mut ts = [0.0; MAX_TERMS];
        let mut need_d = [false; MAX_TERMS];
        let mut slot = [0usize; MAX_TERMS];
        let mut m = 0;
        for (j, sp) in spec.iter().enumerate() {
            let (t, d) = match *sp {
                Of::Skip => continue,
                Of::L(t) => (t, false),
                Of::Dl(t) => (t, true),
            };
            let s = match ts.get(..m).and_then(|x| x.iter().position(|&u| u == t)) {
                Some(s) => s,
                None => {
                    if let Some(x) = ts.get_mut(m) {
                        *x = t;
                    }
                    m += 1;
                    m - 1
                }
            };
            if let (Some(nd), Some(sl)) = (need_d.get_mut(s), slot.get_mut(j)) {
                *nd |= d;
                *sl = s;
            }
        }
        for a in acc.iter_mut() {
            *a = 0.0;
        }
        for k in out_k.iter_mut() {
            *k = 0;
        }
        let ts = ts.get(..m).unwrap_or(&[]);
        if ts.is_empty() {
            return Ok(());
        }
        // Per-temperature scale 2⁻ᵏ (k > 0 only where L would overflow, T ≳ 1e290 K).
        let extra_ln = if self.photon {
            crate::float::ln(
                self.hi / (crate::constants::PLANCK_H * crate::constants::SPEED_OF_LIGHT_C),
            )
        } else {
            0.0
        };
        let mut ks = [0i32; MAX_TERMS];
        for (k, &t) in ks.iter_mut().zip(ts) {
            *k = node_scale_exp(self.lo, t, self.c2_mk, extra_ln);
        }
        // Each temperature's s·L with its scale, checked and prepared once for every node.
        let mut kernels = [ScaledRadiance::new(self.c2, self.photon, 1.0)?; MAX_TERMS];
        for ((kernel, &k), &t) in kernels.iter_mut().zip(ks.iter()).zip(ts) {
            temperature("temperature_k", t)?;
            *kernel = ScaledRadiance::new(self.c2, self.photon, crate::float::powi(2.0, -k))?;
        }
        let c2 = self.c2_mk;
        // Temperatures within a factor GROUP_RATIO of each other share a walk (pieces for the
        // group's coldest, short-wave skip for its hottest: march_pieces); widely different ones
        // get their own, so a very cold term does not force tiny steps on a hot one.
        let mut order = [0usize; MAX_TERMS];
        for (i, o) in order.iter_mut().enumerate() {
            *o = i;
        }
        let order = order.get_mut(..m).unwrap_or(&mut []);
        order.sort_unstable_by(|&i, &j| {
            let (a, b) = (ts.get(i).copied(), ts.get(j).copied());
            a.partial_cmp(&b).unwrap_or(core::cmp::Ordering::Equal)
        });
        let mut first = 0;
        while first < order.len() {
            let t_cold = order
                .get(first)
                .and_then(|&i| ts.get(i))
                .copied()
                .unwrap_or(1.0);
            let mut last = first;
            while order
                .get(last + 1)
                .and_then(|&i| ts.get(i))
                .is_some_and(|&t| t <= GROUP_RATIO * t_cold)
            {
                last += 1;
            }
            let group = order.get(first..=last).unwrap_or(&[]);
            let t_hot = group
                .last()
                .and_then(|&i| ts.get(i))
                .copied()
                .unwrap_or(t_cold);
            // Where each output takes its kernel value in a node's `kv`: L of slot s at s,
            // ∂L/∂T at MAX_TERMS + s, nothing (skipped, or its temperature is in another group)
            // at ZERO, an entry that stays 0.
            const ZERO: usize = 2 * MAX_TERMS;
            let mut src = [ZERO; MAX_TERMS];
            for (j, sj) in src.iter_mut().enumerate().take(n) {
                let s = slot.get(j).copied().unwrap_or(0);
                if group.contains(&s) {
                    *sj = match spec.get(j) {
                        Some(Of::L(_)) => s,
                        Some(Of::Dl(_)) => MAX_TERMS + s,
                        _ => ZERO,
                    };
                }
            }
            // A node pair's kernel values and a node's weights, reused from node to node: only
            // the entries the group and the weight function write are ever read.
            let mut kv = [[0.0; ZERO + 1]; 2];
            let mut wv = [0.0; MAX_TERMS];
            self.for_each_interval(|a, b, lins| {
                march_pieces(a, b, t_hot, t_cold, c2, |p, q| {
                    let rule = rule_for(p, q, t_cold, c2);
                    // Both nodes of a Gauss–Legendre pair at once: the kernels on two lanes
                    // (each lane exactly the single-node value), the rest node by node.
                    let part = integrate_rule_pairs(
                        rule,
                        p,
                        q,
                        n,
                        |xs, out: &mut [[f64; MAX_TERMS]; 2]| {
                            for &s in group {
                                let t = ts.get(s).copied().unwrap_or(1.0);
                                let Some(kernel) = kernels.get(s) else {
                                    continue;
                                };
                                let [kp, km] = &mut kv;
                                if need_d.get(s) == Some(&true) {
                                    let (lp, dp) = kernel.at_and_dt(xs[0], t)?;
                                    let (lm, dm) = kernel.at_and_dt(xs[1], t)?;
                                    for (k, (l, d)) in [(kp, (lp, dp)), (km, (lm, dm))] {
                                        if let Some(x) = k.get_mut(s) {
                                            *x = l;
                                        }
                                        if let Some(x) = k.get_mut(MAX_TERMS + s) {
                                            *x = d;
                                        }
                                    }
                                } else {
                                    let [lp, lm] = kernel.at2(xs, t)?;
                                    if let (Some(x), Some(y)) = (kp.get_mut(s), km.get_mut(s)) {
                                        (*x, *y) = (lp, lm);
                                    }
                                }
                            }
                            for ((o, &x), kv) in out.iter_mut().zip(xs.iter()).zip(&kv) {
                                let d = x - a;
                                let mut v = [0.0; NF];
                                for (vi, f) in v.iter_mut().zip(lins.iter()) {
                                    *vi = f.v + f.s * d;
                                }
                                w(&v, &mut wv);
                                for ((o, &wj), &sj) in o.iter_mut().zip(&wv).zip(&src).take(n) {
                                    *o = if sj == ZERO {
                                        0.0
                                    } else {
                                        wj * kv.get(sj).copied().unwrap_or(0.0)
                                    };
                                }
                            }
                            Ok(())
                        },
                    )?;
                    for (acc_j, p) in acc.iter_mut().zip(part.iter()) {
                        *acc_j += p;
                    }
                    Ok(())
                })
            })?;
            first = last + 1;
        }
        for (j, k) in out_k.iter_mut().enumerate() {
            *k = slot.get(j).and_then(|&sl| ks.get(sl)).copied().unwrap_or(0);
        }
        Ok(())
    }

    /// ∫ of the object weight R·τ_w·τ_p·ε dλ (trapezoid per union interval: a scale for the
    /// starting guess only) — 0 if the object term vanishes.
    fn object_weight_area(&self) -> Result<f64> {
        let mut area = 0.0;
        self.for_each_interval(|a, b, l| {
            let at = |d: f64| -> f64 {
                [R, TW, TP, E]
                    .iter()
                    .map(|&i| l[i].v + l[i].s * d)
                    .product()
            };
            area += 0.5 * (at(0.0) + at(b - a)) * (b - a);
            Ok(())
        })?;
        Ok(area)
    }

    /// Object temperature with object term G(T) = `net` (> 0).
    fn solve(&self, net: f64) -> Result<f64> {
        let area = self.object_weight_area()?;
        if !(area > 0.0) {
            return Err(Error::NoSolution {
                what: "the object term vanishes: response x window x path transmittance x emissivity is zero over the band",
            });
        }
        let model = ObjectTerm { p: self };
        invert_monotone(&model, net, self.guess(net, area))
    }

    /// Starting temperature: Planck's law at the band's geometric-mean wavelength, matched to
    /// `net` per unit of object weight.
    fn guess(&self, net: f64, area: f64) -> f64 {
        let lam = crate::float::sqrt(self.lo * self.hi);
        let mut l = net / area;
        if self.photon {
            l *= crate::constants::PLANCK_H * crate::constants::SPEED_OF_LIGHT_C / lam;
        }
        let l5 = crate::float::powi(lam, 5);
        let t = self.c2_mk / (lam * crate::float::ln_1p(crate::constants::C1L / (l5 * l)));
        if t.is_finite() && t > 0.0 {
            t
        } else {
            1000.0
        }
    }

    /// Which background terms to integrate, at which temperatures: [reflected, path,
    /// window-reflected, window-emitted]; a term whose weight vanishes identically (ε = 1 and
    /// opaque, τ_p = 1, no window…) is skipped.
    fn background_spec(&self) -> [Of; 4] {
        let c = self.cond;
        let refl_zero = match &c.reflectance {
            None => c.emissivity.is_constant(1.0),
            Some(r) => r.is_constant(0.0),
        } || c.path_transmittance.is_constant(0.0);
        let mut spec = [Of::Skip; 4];
        if !refl_zero {
            spec[0] = Of::L(c.reflected_temperature_k);
        }
        if !c.path_transmittance.is_constant(1.0) {
            spec[1] = Of::L(c.path_temperature_k);
        }
        if let Some(w) = &c.window {
            if !w.reflectance.is_constant(0.0) {
                spec[2] = Of::L(w.reflected_temperature_k);
            }
            let opaque_free = matches!(
                (&w.transmittance, &w.reflectance),
                (SpectralValue::Constant(t), SpectralValue::Constant(r)) if t + r >= 1.0
            );
            if !opaque_free {
                spec[3] = Of::L(w.temperature_k);
            }
        }
        spec
    }

    /// The weights of the four background terms at a node.
    #[inline]
    fn background_weights(v: &[f64; NF]) -> [f64; 4] {
        let rw = v[R] * v[TW];
        [
            rw * v[TP] * v[RT],
            rw * (1.0 - v[TP]),
            v[R] * v[RW],
            v[R] * window_emissivity(v),
        ]
    }

    /// The background terms (every term but the object's) at the conditions' temperatures:
    /// [reflected, path, window-reflected, window-emitted].
    fn background(&self) -> Result<[f64; 4]> {
        self.terms(self.background_spec(), Self::background_weights)
    }
}

/// The Gauss–Legendre rule for a piece [p, q] at temperature T: the shortest rule whose
/// a-priori error bound (module docs' table) is below 1e-16 relative for pieces of this size
/// (Δx = c2/T·(1/p − 1/q)).
#[inline]
fn rule_for(p: f64, q: f64, temperature_k: f64, c2_mk: f64) -> &'static Rule {
    // e^0.001, e^0.01, e^0.03 (rounded down, so the test is at most as wide as stated)
    const W4: f64 = 1.001_000_500_166_708;
    const W6: f64 = 1.010_050_167_084_168;
    const W8: f64 = 1.030_454_533_953_516;
    let ratio = q / p;
    let dx = c2_mk / temperature_k * (1.0 / p - 1.0 / q);
    if ratio <= W4 && dx <= 0.02 {
        &GL4
    } else if ratio <= W6 && dx <= 0.2 {
        &GL6
    } else if ratio <= W8 && dx <= 0.6 {
        &GL8
    } else {
        &GL20
    }
}

/// 1 − τ_w − ρ_w at a node, never below 0 (rounding).
#[inline]
fn window_emissivity(v: &[f64; NF]) -> f64 {
    // a comparison, not f64::max (a call to libm's fmax on wasm32, at every node)
    let e = 1.0 - v[TW] - v[RW];
    if e > 0.0 {
        e
    } else {
        0.0
    }
}

/// The object term G(T) = ∫ R·τ_w·τ_p·ε·L(λ,T) dλ as a monotone signal model, for the shared
/// safeguarded inverse.
struct ObjectTerm<'p, 'a, 'b> {
    p: &'p Prepared<'a, 'b>,
}

impl SignalModel for ObjectTerm<'_, '_, '_> {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.0)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        temperature("temperature_k", temperature_k)?;
        let [g, dg] = self
            .p
            .terms([Of::L(temperature_k), Of::Dl(temperature_k)], |v| {
                [v[R] * v[TW] * v[TP] * v[E]; 2]
            })?;
        Ok((g, dg))
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        self.p.solve(signal)
    }
}

// ---------------------------------------------------------------------------------------------
// Public functions.

/// The terms of the spectral measurement equation at one object temperature (signal units of
/// the instrument), returned by [`spectral_signal_terms`].
///
/// # Examples
/// See [`spectral_signal_terms`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct SignalTerms {
    /// The instrument signal: the sum of the five terms below.
    pub signal: f64,
    /// Object emission ∫ R·τ_w·τ_p·ε·L(T) dλ.
    pub object: f64,
    /// Reflected surroundings ∫ R·τ_w·τ_p·ρ·L(T_refl) dλ.
    pub reflected: f64,
    /// Path emission ∫ R·τ_w·(1 − τ_p)·L(T_path) dλ.
    pub path: f64,
    /// Window reflection ∫ R·ρ_w·L(T_int) dλ.
    pub window_reflected: f64,
    /// Window emission ∫ R·(1 − τ_w − ρ_w)·L(T_w) dλ.
    pub window_emitted: f64,
}

/// Every term of the spectral measurement equation for an object at `object_temperature_k`
/// (K), in the instrument's signal unit.
///
/// # Formula
/// See the module docs; `signal = object + reflected + path + window_reflected + window_emitted`.
///
/// # Errors
/// `NonFinite` / `NonPositiveTemperature` for a bad temperature; as
/// [`SpectralConditions::validate`]; `OutsideTable` (arg: the input) when a table without
/// constant ends does not cover the response's band.
///
/// # Accuracy
/// As [`spectral_measured_signal`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{spectral_signal_terms, SpectralConditions, SpectralInstrument, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// let c = SpectralConditions { path_transmittance: SpectralValue::Constant(0.9), ..SpectralConditions::BLACKBODY };
/// let t = spectral_signal_terms(&inst, 400.0, &c).unwrap();
/// assert_eq!(t.reflected, 0.0); // ε = 1: nothing reflected
/// assert!((t.signal - (t.object + t.path)).abs() <= 1e-15 * t.signal);
/// ```
///
/// # References
/// See the module docs.
pub fn spectral_signal_terms(
    instrument: &SpectralInstrument<'_>,
    object_temperature_k: f64,
    conditions: &SpectralConditions<'_>,
) -> Result<SignalTerms> {
    temperature("object_temperature_k", object_temperature_k)?;
    let p = Prepared::new(instrument, conditions)?;
    let [b0, b1, b2, b3] = p.background_spec();
    let [object, reflected, path, window_reflected, window_emitted] =
        p.terms([Of::L(object_temperature_k), b0, b1, b2, b3], |v| {
            let [x0, x1, x2, x3] = Prepared::background_weights(v);
            [v[R] * v[TW] * v[TP] * v[E], x0, x1, x2, x3]
        })?;
    Ok(SignalTerms {
        signal: object + reflected + path + window_reflected + window_emitted,
        object,
        reflected,
        path,
        window_reflected,
        window_emitted,
    })
}

/// Signal an instrument reads from an object at `object_temperature_k` (K) under spectral
/// `conditions` (forward spectral measurement equation; unit of the instrument).
///
/// # Formula
/// See the module docs.
///
/// # Errors
/// As [`spectral_signal_terms`].
///
/// # Accuracy
/// Quadrature exact for the piecewise-linear tables to the rule's bound (module docs, < 1e-15
/// relative per piece). Measured against mpmath `quad` of the same interpolants at 40 digits
/// (`tests/data/gen_spectral.py`, `tests/thermometry_spectral.rs`): ≤ 2e-15 relative over the
/// reference cases (200-point tables, photon response, constant ends, 50 K to 3000 K; measured
/// 1.3e-15). Grey inputs give [`super::measurement::measured_signal`]'s number to ≤ 4e-16
/// relative (measured 3.3e-16).
///
/// # Examples
/// ```
/// use quantaband::thermometry::measurement::{measured_signal, Conditions};
/// use quantaband::thermometry::response::{Response, ResponseSignal};
/// use quantaband::thermometry::spectral::{spectral_measured_signal, SpectralConditions, SpectralInstrument};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 10e-6, 14e-6], [0.2, 1.0, 0.7]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// let grey = Conditions { emissivity: 0.8, reflected_temperature_k: 300.0, path_transmittance: 0.9, ..Conditions::BLACKBODY };
/// let s = spectral_measured_signal(&inst, 400.0, &SpectralConditions::from_grey(&grey)).unwrap();
/// let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
/// // grey inputs reproduce the grey measurement equation
/// assert!((s / measured_signal(&model, 400.0, &grey).unwrap() - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// See the module docs.
pub fn spectral_measured_signal(
    instrument: &SpectralInstrument<'_>,
    object_temperature_k: f64,
    conditions: &SpectralConditions<'_>,
) -> Result<f64> {
    Ok(spectral_signal_terms(instrument, object_temperature_k, conditions)?.signal)
}

/// Object temperature (K) that explains `signal` (unit of the instrument) under spectral
/// `conditions` (inverse spectral measurement equation).
///
/// # Formula
/// ```text
/// T = G⁻¹(signal − B),   G(T) = ∫ R·τ_w·τ_p·ε·L(λ,T) dλ,   B = the other four terms
/// (safeguarded Newton on ln G in 1/T, model::invert_monotone)
/// ```
///
/// # Errors
/// `NonFinite` for a non-finite signal; `NoPhysicalSolution { signal, background }` when
/// `signal ≤ B`; `NoSolution` when the object term vanishes (ε, τ or the response zero over the
/// band) or no temperature in 1e-3 K … 1e9 K explains the signal; as
/// [`spectral_signal_terms`].
///
/// # Accuracy
/// Newton stops at a step below 4e-16·T. From mpmath signals the reference temperatures are
/// recovered to ≤ 5e-16 relative; round trips and the grey comparison with
/// [`super::measurement::object_temperature`] (≤ 7e-13 K where T is well conditioned) agree
/// within the effect of a 4e-15 relative signal difference — a cold object under a warm
/// background is ill-conditioned: |ΔT| = |Δs|·∂T/∂s (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{spectral_measured_signal, spectral_object_temperature, SpectralConditions, SpectralInstrument, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// // an invented two-level emissivity: 0.9 below 10 µm, 0.5 above (a steep step)
/// let (ew, ev) = ([8e-6, 9.99e-6, 10.01e-6, 14e-6], [0.9, 0.9, 0.5, 0.5]);
/// let c = SpectralConditions {
///     emissivity: SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap()),
///     reflected_temperature_k: 295.0,
///     ..SpectralConditions::BLACKBODY
/// };
/// let s = spectral_measured_signal(&inst, 350.0, &c).unwrap();
/// assert!((spectral_object_temperature(&inst, s, &c).unwrap() - 350.0).abs() < 1e-9);
/// // a signal below what the surroundings alone give has no physical solution
/// assert_eq!(spectral_object_temperature(&inst, 1.0, &c).unwrap_err().code(), "NO_PHYSICAL_SOLUTION");
/// ```
///
/// # References
/// See the module docs.
pub fn spectral_object_temperature(
    instrument: &SpectralInstrument<'_>,
    signal: f64,
    conditions: &SpectralConditions<'_>,
) -> Result<f64> {
    finite("signal", signal)?;
    let p = Prepared::new(instrument, conditions)?;
    let bg: f64 = p.background()?.iter().sum();
    let net = signal - bg;
    if !(net > 0.0) {
        return Err(Error::NoPhysicalSolution {
            signal,
            background: bg,
        });
    }
    p.solve(net)
}

/// Band-effective (response- and Planck-weighted) values of the spectral inputs at one
/// temperature (dimensionless), returned by [`band_effective`].
///
/// # Examples
/// See [`band_effective`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct BandEffective {
    /// The temperature of the weighting, K.
    pub temperature_k: f64,
    /// ε_eff(T) = ∫ R·ε·L(T) dλ / ∫ R·L(T) dλ.
    pub emissivity: f64,
    /// ρ_eff(T) of the target (1 − ε_eff for an opaque target).
    pub reflectance: f64,
    /// τ_p,eff(T) of the path.
    pub path_transmittance: f64,
    /// τ_w,eff(T) of the window (1 without a window).
    pub window_transmittance: f64,
    /// ρ_w,eff(T) of the window (0 without a window).
    pub window_reflectance: f64,
    /// (τ_w·τ_p·ε)_eff(T): the object term over the blackbody signal, G(T)/S(T) — not the
    /// product of the three effective values when they vary across the band.
    pub object_gain: f64,
}

/// Band-effective emissivity, reflectance and transmittances at `temperature_k` (K): each
/// input averaged over the band with the instrument response and Planck's law at that
/// temperature as weight.
///
/// # Formula
/// ```text
/// q_eff(T) = ∫ R(λ)·q(λ)·L(λ,T) dλ / ∫ R(λ)·L(λ,T) dλ      q = ε, ρ, τ_p, τ_w, ρ_w, τ_w·τ_p·ε
/// ```
/// ε_eff depends on T: a grey-body setting of ε_eff(T_obj) reproduces the object term at T_obj
/// only. Evaluate ρ_eff at T_refl to weight it like the reflected term.
///
/// # Errors
/// As [`spectral_signal_terms`]; `NoSolution` if the blackbody signal underflows to 0 at this
/// temperature.
///
/// # Accuracy
/// Ratios of integrals, each as [`spectral_measured_signal`] (≤ 2e-15 relative against mpmath
/// in the tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{band_effective, SpectralConditions, SpectralInstrument, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// let (ew, ev) = ([8e-6, 14e-6], [0.9, 0.6]);
/// let c = SpectralConditions {
///     emissivity: SpectralValue::Table(SpectralTable::new(TableKind::Emissivity, &ew, &ev).unwrap()),
///     ..SpectralConditions::BLACKBODY
/// };
/// let e = band_effective(&inst, 350.0, &c).unwrap();
/// assert!(e.emissivity > 0.6 && e.emissivity < 0.9);
/// assert!((e.emissivity + e.reflectance - 1.0).abs() < 1e-15); // opaque target
/// ```
///
/// # References
/// P. Saunders, *Radiation Thermometry*, SPIE Press, 2007 (band-averaged emissivity) — from
/// memory.
pub fn band_effective(
    instrument: &SpectralInstrument<'_>,
    temperature_k: f64,
    conditions: &SpectralConditions<'_>,
) -> Result<BandEffective> {
    temperature("temperature_k", temperature_k)?;
    let p = Prepared::new(instrument, conditions)?;
    // One temperature, one scale: the ratios need no rescaling (and stay finite where the
    // integrals overflow).
    let ([s, e, rt, tp, tw, rw, g], _) = p.scaled_terms([Of::L(temperature_k); 7], |v| {
        let rl = v[R];
        [
            rl,
            rl * v[E],
            rl * v[RT],
            rl * v[TP],
            rl * v[TW],
            rl * v[RW],
            rl * v[TW] * v[TP] * v[E],
        ]
    })?;
    if !(s > 0.0) {
        return Err(Error::NoSolution {
            what: "signal underflows at this temperature",
        });
    }
    Ok(BandEffective {
        temperature_k,
        emissivity: e / s,
        reflectance: rt / s,
        path_transmittance: tp / s,
        window_transmittance: tw / s,
        window_reflectance: rw / s,
        object_gain: g / s,
    })
}

/// Sensitivity coefficients of the object temperature of a spectral measurement (each in K per
/// unit of its input), returned by [`spectral_sensitivities`]. A `*_scale` coefficient is
/// ∂T/∂k for the table multiplied by a factor k at k = 1: a relative standard uncertainty u_rel
/// of the whole table enters a budget as u(k) = u_rel.
///
/// # Examples
/// See [`spectral_sensitivities`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct SpectralSensitivities {
    /// The object temperature the signal gives, K.
    pub temperature_k: f64,
    /// ∂T/∂signal, K per signal unit.
    pub signal: f64,
    /// ∂T/∂k for ε(λ) → k·ε(λ) (for an opaque target the reflectance 1 − k·ε follows), K.
    pub emissivity_scale: f64,
    /// ∂T/∂k for ρ(λ) → k·ρ(λ), K (0 for an opaque target: its reflectance follows ε).
    pub reflectance_scale: f64,
    /// ∂T/∂k for τ_p(λ) → k·τ_p(λ) (the path emits 1 − k·τ_p), K.
    pub path_transmittance_scale: f64,
    /// ∂T/∂k for τ_w(λ) → k·τ_w(λ) (the window emits 1 − k·τ_w − ρ_w), K (0 without a window).
    pub window_transmittance_scale: f64,
    /// ∂T/∂k for ρ_w(λ) → k·ρ_w(λ) (the window emits 1 − τ_w − k·ρ_w), K (0 without a window).
    pub window_reflectance_scale: f64,
    /// ∂T/∂k for R(λ) → k·R(λ) (a calibration scale error of the instrument), K.
    pub response_scale: f64,
    /// ∂T/∂T_refl, K/K.
    pub reflected_temperature: f64,
    /// ∂T/∂T_path, K/K.
    pub path_temperature: f64,
    /// ∂T/∂T_w, K/K (0 without a window).
    pub window_temperature: f64,
    /// ∂T/∂T_int, K/K (0 without a window).
    pub window_reflected_temperature: f64,
}

/// Sensitivity coefficients of the object temperature at `signal` under spectral
/// `conditions`, by implicit differentiation of the spectral measurement equation.
///
/// # Formula
/// ```text
/// F(T, p) = G(T) + B − signal = 0,   ∂T/∂p = −(∂F/∂p)/(∂F/∂T),   ∂F/∂T = ∫ R τ_w τ_p ε ∂L(T)/∂T dλ
/// ∂F/∂signal = −1
/// ∂F/∂k_ε   = ∫ R τ_w τ_p ε [L(T) − L(T_refl)] dλ   (opaque)   or  ∫ R τ_w τ_p ε L(T) dλ
/// ∂F/∂k_ρ   = ∫ R τ_w τ_p ρ L(T_refl) dλ                          (explicit reflectance)
/// ∂F/∂k_τp  = ∫ R τ_w τ_p [ε L(T) + ρ L(T_refl) − L(T_path)] dλ
/// ∂F/∂k_τw  = ∫ R τ_w [τ_p(ε L(T) + ρ L(T_refl)) + (1 − τ_p) L(T_path) − L(T_w)] dλ
/// ∂F/∂k_ρw  = ∫ R ρ_w [L(T_int) − L(T_w)] dλ
/// ∂F/∂k_R   = signal
/// ∂F/∂T_refl = ∫ R τ_w τ_p ρ ∂L(T_refl)/∂T dλ,  ∂F/∂T_path = ∫ R τ_w (1 − τ_p) ∂L(T_path)/∂T dλ
/// ∂F/∂T_w    = ∫ R (1 − τ_w − ρ_w) ∂L(T_w)/∂T dλ,  ∂F/∂T_int = ∫ R ρ_w ∂L(T_int)/∂T dλ
/// ```
///
/// # Errors
/// Those of [`spectral_object_temperature`]; `NoSolution` if ∂F/∂T is 0 at the solution.
///
/// # Accuracy
/// Analytic; agrees with central finite differences of 30-digit mpmath root-finding solves of
/// the same equation to 1.5e-15 relative (22 coefficients, opaque and semi-transparent target
/// behind a window; `tests/thermometry_spectral.rs` asserts 1e-9).
///
/// # Examples
/// ```
/// use quantaband::thermometry::spectral::{spectral_measured_signal, spectral_sensitivities, SpectralConditions, SpectralInstrument, SpectralValue};
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
/// let inst = SpectralInstrument::new(SpectralTable::new(TableKind::EnergyResponse, &wl, &r).unwrap(), Default::default()).unwrap();
/// let c = SpectralConditions { emissivity: SpectralValue::Constant(0.9), reflected_temperature_k: 300.0, ..SpectralConditions::BLACKBODY };
/// let s = spectral_measured_signal(&inst, 350.0, &c).unwrap();
/// let k = spectral_sensitivities(&inst, s, &c).unwrap();
/// // a higher emissivity (or response) explains the same signal with a cooler object
/// assert!(k.emissivity_scale < 0.0 && k.response_scale < 0.0 && k.signal > 0.0);
/// assert!(k.reflected_temperature > -1.0 && k.reflected_temperature < 0.0);
/// ```
///
/// # References
/// JCGM 100:2008 (GUM), §5.1.3 (sensitivity coefficients); implicit-function theorem.
pub fn spectral_sensitivities(
    instrument: &SpectralInstrument<'_>,
    signal: f64,
    conditions: &SpectralConditions<'_>,
) -> Result<SpectralSensitivities> {
    finite("signal", signal)?;
    let p = Prepared::new(instrument, conditions)?;
    let bg: f64 = p.background()?.iter().sum();
    let net = signal - bg;
    if !(net > 0.0) {
        return Err(Error::NoPhysicalSolution {
            signal,
            background: bg,
        });
    }
    let t = p.solve(net)?;
    let c = conditions;
    let (tr, tp) = (c.reflected_temperature_k, c.path_temperature_k);
    let (tw, ti) = c
        .window
        .map_or((tr, tr), |w| (w.temperature_k, w.reflected_temperature_k));
    let win = if c.window.is_some() {
        [
            Of::L(ti),
            Of::Dl(ti),
            Of::L(tw),
            Of::Dl(tw),
            Of::L(tw),
            Of::L(tw),
        ]
    } else {
        [Of::Skip; 6]
    };
    // One walk: [G, G'] at T; [Refl, Refl', X_r = ∫R τ_w τ_p ε L] at T_refl; [Path, Path',
    // Y_p = ∫R τ_w τ_p L] at T_path; [WinR, WinR'] at T_int; [WinE, WinE', Z_w = ∫R τ_w L,
    // Zr_w = ∫R ρ_w L] at T_w.
    let [g, dg, refl, drefl, x_r, path, dpath, y_p, win_r, dwin_r, win_e, dwin_e, z_w, zr_w] = p
        .terms(
            [
                Of::L(t),
                Of::Dl(t),
                Of::L(tr),
                Of::Dl(tr),
                Of::L(tr),
                Of::L(tp),
                Of::Dl(tp),
                Of::L(tp),
                win[0],
                win[1],
                win[2],
                win[3],
                win[4],
                win[5],
            ],
            |v| {
                let obj = v[R] * v[TW] * v[TP] * v[E];
                let rs = v[R] * v[TW] * v[TP];
                let pa = v[R] * v[TW] * (1.0 - v[TP]);
                let we = v[R] * window_emissivity(v);
                [
                    obj,
                    obj,
                    rs * v[RT],
                    rs * v[RT],
                    rs * v[E],
                    pa,
                    pa,
                    v[R] * v[TW] * v[TP],
                    v[R] * v[RW],
                    v[R] * v[RW],
                    we,
                    we,
                    v[R] * v[TW],
                    v[R] * v[RW],
                ]
            },
        )?;
    if !(dg > 0.0 && dg.is_finite()) {
        return Err(Error::NoSolution {
            what: "dS/dT vanishes at the solution (signal underflow)",
        });
    }
    let k = |df_dp: f64| -df_dp / dg;
    let model_signal = g + refl + path + win_r + win_e;
    let has_window = c.window.is_some();
    Ok(SpectralSensitivities {
        temperature_k: t,
        signal: 1.0 / dg,
        emissivity_scale: k(if p.opaque { g - x_r } else { g }),
        reflectance_scale: if p.opaque { 0.0 } else { k(refl) },
        path_transmittance_scale: k(g + refl - y_p),
        window_transmittance_scale: if has_window {
            k(g + refl + path - z_w)
        } else {
            0.0
        },
        window_reflectance_scale: if has_window { k(win_r - zr_w) } else { 0.0 },
        response_scale: k(model_signal),
        reflected_temperature: k(drefl),
        path_temperature: k(dpath),
        window_temperature: k(dwin_e),
        window_reflected_temperature: k(dwin_r),
    })
}
