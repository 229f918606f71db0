//! ITS-90 above the silver point: temperature from the ratio of spectral radiances of a
//! blackbody to a fixed-point blackbody, with the scale's c2 = 0.014388 m·K, and the same
//! calculation with CODATA 2018's c2 = hc/k for comparison.
//!
//! # Formula (ITS-90, Preston-Thomas 1990, section 3.3, eq. 25)
//! ```text
//! L_λ(T90) / L_λ(T90(X)) = [exp(c2/(λ·T90(X))) − 1] / [exp(c2/(λ·T90)) − 1]
//! ⇒ T90 = c2 / (λ · ln(1 + [exp(c2/(λ·T90(X))) − 1]/r)),   r = the measured ratio
//! ```
//! evaluated as T = c2/(λ·softplus(q)), q = ln(expm1(x_X)) − ln r, x_X = c2/(λ·T_X), so that no
//! intermediate overflows for any valid input.
//!
//! # References
//! H. Preston-Thomas, "The International Temperature Scale of 1990 (ITS-90)", Metrologia 27,
//! 3–10 (1990), doi:10.1088/0026-1394/27/1/002 (Table 1 fixed points; section 3.3).
#![forbid(unsafe_code)]

use crate::constants::C2Convention;
use crate::error::{positive, spectral, temperature};
use crate::float::{exp, expm1, ln, ln_1p};
use crate::{Error, Result};

/// The ITS-90 freezing points used as references for radiation thermometry (assigned values
/// T90 in K from Preston-Thomas, Metrologia 27, 3 (1990), Table 1).
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::FixedPoint;
/// // ITS-90 Table 1: Ag 1234.93 K, Cu 1357.77 K.
/// assert_eq!(FixedPoint::Silver.temperature_k(), 1234.93);
/// assert_eq!(FixedPoint::Copper.temperature_k(), 1357.77);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum FixedPoint {
    /// Freezing point of silver, T90 = 1234.93 K.
    Silver,
    /// Freezing point of gold, T90 = 1337.33 K.
    Gold,
    /// Freezing point of copper, T90 = 1357.77 K.
    Copper,
}

impl FixedPoint {
    /// The assigned temperature T90 of the fixed point, K (ITS-90 Table 1).
    ///
    /// # Formula
    /// ```text
    /// Ag 1234.93 K, Au 1337.33 K, Cu 1357.77 K (freezing points, exact by definition)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact (defined values).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::its90::FixedPoint;
    /// assert_eq!(FixedPoint::Gold.temperature_k(), 1337.33);
    /// ```
    ///
    /// # References
    /// Preston-Thomas, Metrologia 27, 3 (1990), Table 1.
    pub const fn temperature_k(self) -> f64 {
        match self {
            FixedPoint::Silver => 1234.93,
            FixedPoint::Gold => 1337.33,
            FixedPoint::Copper => 1357.77,
        }
    }
}

/// The temperature of a radiance ratio computed with both values of c2 (all fields in K),
/// returned by [`its90_temperature`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::{its90_temperature, FixedPoint};
/// // A ratio of 1 is the fixed point itself, whatever c2 (ITS-90 section 3.3 form).
/// let r = its90_temperature(1.0, 650e-9, FixedPoint::Gold).unwrap();
/// assert!((r.t90_k - 1337.33).abs() < 1e-9 && r.difference_k.abs() < 1e-9);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct RatioTemperatures {
    /// T90 with c2 = 0.014388 m·K (the ITS-90 value), K.
    pub t90_k: f64,
    /// The same equation with c2 = hc/k (CODATA 2018), K.
    pub t_codata_k: f64,
    /// `t_codata_k − t90_k`, K.
    pub difference_k: f64,
}

/// ln(1 + e^q) without overflow or loss of digits.
fn softplus(q: f64) -> f64 {
    if q > 0.0 {
        q + ln_1p(exp(-q))
    } else {
        ln_1p(exp(q))
    }
}

/// ln(e^x − 1) for x > 0 without overflow.
fn ln_expm1(x: f64) -> f64 {
    if x > 30.0 {
        x + ln_1p(-exp(-x))
    } else {
        ln(expm1(x))
    }
}

/// Temperature (K) whose spectral radiance at `wavelength_m` is `ratio` times that of a
/// blackbody at `reference_temperature_k`, with the given c2 convention.
///
/// # Formula
/// ```text
/// T = c2 / (λ·ln(1 + (exp(c2/(λ·T_X)) − 1)/r))
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for the ratio, `NonPositiveSpectral` for λ,
/// `NonPositiveTemperature` for T_X; `NoSolution` if the result overflows (ratio beyond the
/// range any finite temperature gives).
///
/// # Accuracy
/// A few ulp (closed form with `expm1`/`ln_1p`); agrees with an mpmath `findroot` solution of
/// the ITS-90 ratio equation to ≤ 1e-13 relative (`tests/thermometry_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::temperature_from_ratio;
/// use quantaband::constants::C2Convention;
/// // ratio 1 gives the reference temperature back
/// let t = temperature_from_ratio(1.0, 650e-9, 1337.33, C2Convention::Its90).unwrap();
/// assert!((t - 1337.33).abs() < 1e-9);
/// ```
///
/// # References
/// Preston-Thomas, Metrologia 27, 3 (1990), section 3.3.
pub fn temperature_from_ratio(
    ratio: f64,
    wavelength_m: f64,
    reference_temperature_k: f64,
    c2: C2Convention,
) -> Result<f64> {
    positive("ratio", ratio)?;
    spectral("wavelength_m", wavelength_m)?;
    temperature("reference_temperature_k", reference_temperature_k)?;
    let c2v = c2.c2();
    let x_ref = c2v / (wavelength_m * reference_temperature_k);
    let q = ln_expm1(x_ref) - ln(ratio);
    let t = c2v / (wavelength_m * softplus(q));
    if t.is_finite() && t > 0.0 {
        Ok(t)
    } else {
        Err(Error::NoSolution {
            what: "radiance ratio beyond the range of finite temperatures",
        })
    }
}

/// Spectral-radiance ratio L_λ(T)/L_λ(T_X) at `wavelength_m` for a blackbody at
/// `temperature_k` against one at `reference_temperature_k` (forward ITS-90 equation).
///
/// # Formula
/// ```text
/// r = (exp(c2/(λ·T_X)) − 1) / (exp(c2/(λ·T)) − 1)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveSpectral` / `NonPositiveTemperature` for bad inputs.
///
/// # Accuracy
/// A few ulp; evaluated as exp(ln(expm1(x_X)) − ln(expm1(x))) so it overflows to ∞ or
/// underflows to 0 only where the true ratio is outside the f64 range. When λ·T is so large
/// that x underflows the Rayleigh–Jeans form (T/T_X)·h(x_X)/h(x), h(y) = (eʸ − 1)/y, is used,
/// and when x overflows the exponent x_X − x is formed as (c2/λ)·(T − T_X)/(T·T_X); both
/// extremes are checked against mpmath in `tests/review_regressions.rs`.
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::{radiance_ratio, temperature_from_ratio};
/// use quantaband::constants::C2Convention;
/// let r = radiance_ratio(1800.0, 650e-9, 1337.33, C2Convention::Its90).unwrap();
/// let t = temperature_from_ratio(r, 650e-9, 1337.33, C2Convention::Its90).unwrap();
/// assert!((t - 1800.0).abs() < 1e-9);
/// ```
///
/// # References
/// Preston-Thomas, Metrologia 27, 3 (1990), section 3.3.
pub fn radiance_ratio(
    temperature_k: f64,
    wavelength_m: f64,
    reference_temperature_k: f64,
    c2: C2Convention,
) -> Result<f64> {
    temperature("temperature_k", temperature_k)?;
    spectral("wavelength_m", wavelength_m)?;
    temperature("reference_temperature_k", reference_temperature_k)?;
    let c2v = c2.c2();
    let x = c2v / (wavelength_m * temperature_k);
    let x_ref = c2v / (wavelength_m * reference_temperature_k);
    if x <= 30.0 && x_ref <= 30.0 {
        if x >= f64::MIN_POSITIVE && x_ref >= f64::MIN_POSITIVE {
            return Ok(expm1(x_ref) / expm1(x));
        }
        // λ·T so large that x or x_ref is subnormal or 0 (e.g. λ near f64::MAX): 0/0 would be
        // NaN. Rayleigh–Jeans side: r = (T/T_ref)·h(x_ref)/h(x) with h(y) = (e^y − 1)/y → 1.
        return Ok((temperature_k / reference_temperature_k) * (expm1_over(x_ref) / expm1_over(x)));
    }
    if x.is_infinite() || x_ref.is_infinite() {
        // c2/(λT) overflowed (λ near the smallest subnormal): ln r = x_ref − x + (tiny
        // corrections), with x_ref − x = (c2/λ)·(T − T_ref)/(T·T_ref) formed without ∞ − ∞
        // (→ 0 or ∞ as the true value is, exactly 1 for T = T_ref).
        let d = (temperature_k - reference_temperature_k) / temperature_k / reference_temperature_k;
        let diff = c2v * d / wavelength_m;
        let corr = ln_1p(-exp(-x_ref)) - ln_1p(-exp(-x));
        return Ok(exp(diff + corr));
    }
    Ok(exp(ln_expm1(x_ref) - ln_expm1(x)))
}

/// (e^y − 1)/y for 0 ≤ y ≤ 30, with the limit 1 at y = 0.
fn expm1_over(y: f64) -> f64 {
    if y == 0.0 {
        1.0
    } else {
        expm1(y) / y
    }
}

/// T90 from a radiance `ratio` to a `fixed_point` blackbody at `wavelength_m`, together with
/// the temperature the same equation gives with CODATA's c2 = hc/k, and their difference.
///
/// # Formula
/// ```text
/// T90      = c2,90 / (λ·ln(1 + (exp(c2,90/(λ·T90(X))) − 1)/r)),   c2,90 = 0.014388 m·K
/// T_CODATA = same with c2 = hc/k = 0.014387768775… m·K (and the same T90(X))
/// ```
///
/// # Errors
/// As [`temperature_from_ratio`].
///
/// # Accuracy
/// ≤ 1e-13 relative against mpmath (`tests/thermometry_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::{its90_temperature, FixedPoint};
/// // mpmath findroot (tests/data/gen_thermometry.py): r = 10 at 650 nm against gold
/// let r = its90_temperature(10.0, 650e-9, FixedPoint::Gold).unwrap();
/// assert!((r.t90_k - 1553.432_320_365_467_6).abs() < 1e-9);
/// assert!((r.difference_k - 0.004_034_165_872_284_7).abs() < 1e-9);
/// ```
///
/// # References
/// Preston-Thomas, Metrologia 27, 3 (1990); CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93,
/// 025010, 2021).
pub fn its90_temperature(
    ratio: f64,
    wavelength_m: f64,
    fixed_point: FixedPoint,
) -> Result<RatioTemperatures> {
    let tx = fixed_point.temperature_k();
    let t90 = temperature_from_ratio(ratio, wavelength_m, tx, C2Convention::Its90)?;
    let tc = temperature_from_ratio(ratio, wavelength_m, tx, C2Convention::Codata2018)?;
    Ok(RatioTemperatures {
        t90_k: t90,
        t_codata_k: tc,
        difference_k: tc - t90,
    })
}
