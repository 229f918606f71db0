//! ITS-90 for radiation thermometry: the defining freezing points from indium to copper
//! ([`FixedPoint`]); above the silver point, temperature from the ratio of spectral radiances
//! of a blackbody to a fixed-point blackbody with the scale's c2 = 0.014388 m·K (and the same
//! calculation with CODATA 2018's c2 = hc/k for comparison), with its sensitivity coefficients;
//! and Sakuma–Hattori curves through three fixed points with their interpolation error.
//!
//! These are ITS-90 temperatures T90, not thermodynamic temperatures T. The difference T − T90
//! (tens of millikelvin at these points) is not computed here: it needs consensus estimates
//! that this crate does not carry. The c2 comparison ([`Its90Temperature::c2_effect_k`]) is
//! only the effect of the value of c2 in the ratio equation with the same T90(X).
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
//! 3–10 (1990), doi:10.1088/0026-1394/27/1/002 (Table 1 fixed points; section 3.3). Table 1
//! values checked against the transcription at <http://www.its-90.com/table1.html>.
#![forbid(unsafe_code)]

use super::model::SignalModel;
use super::sakuma_hattori::{max_interpolation_error_k, SakumaHattori};
use crate::constants::C2Convention;
use crate::error::{positive, spectral, temperature};
use crate::float::{exp, expm1, ln, ln_1p};
use crate::{Error, Result};

/// The ITS-90 defining freezing points from indium to copper, with their assigned values T90
/// (K) from Preston-Thomas, Metrologia 27, 3 (1990), Table 1. Above the silver point the
/// scale is defined by the radiance-ratio relation to the Ag, Au or Cu point
/// ([`FixedPoint::defines_ratio_relation`]); In, Sn, Zn and Al are the points radiation
/// thermometer calibrations commonly add below it. These are ITS-90 temperatures, not
/// thermodynamic ones.
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::FixedPoint;
/// // ITS-90 Table 1: In 429.7485 K, Ag 1234.93 K, Cu 1357.77 K.
/// assert_eq!(FixedPoint::Indium.temperature_k(), 429.7485);
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
    /// Freezing point of indium, T90 = 429.7485 K (156.5985 °C).
    Indium,
    /// Freezing point of tin, T90 = 505.078 K (231.928 °C).
    Tin,
    /// Freezing point of zinc, T90 = 692.677 K (419.527 °C).
    Zinc,
    /// Freezing point of aluminium, T90 = 933.473 K (660.323 °C).
    Aluminium,
    /// Freezing point of silver, T90 = 1234.93 K (961.78 °C).
    Silver,
    /// Freezing point of gold, T90 = 1337.33 K (1064.18 °C).
    Gold,
    /// Freezing point of copper, T90 = 1357.77 K (1084.62 °C).
    Copper,
}

impl FixedPoint {
    /// All seven, in increasing temperature.
    pub const ALL: [FixedPoint; 7] = [
        FixedPoint::Indium,
        FixedPoint::Tin,
        FixedPoint::Zinc,
        FixedPoint::Aluminium,
        FixedPoint::Silver,
        FixedPoint::Gold,
        FixedPoint::Copper,
    ];

    /// The assigned temperature T90 of the fixed point, K (ITS-90 Table 1).
    ///
    /// # Formula
    /// ```text
    /// In 429.7485 K, Sn 505.078 K, Zn 692.677 K, Al 933.473 K,
    /// Ag 1234.93 K, Au 1337.33 K, Cu 1357.77 K (freezing points at 101 325 Pa, exact by
    /// definition of the scale)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact (defined values; the realisation of a fixed point has its own uncertainty).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::its90::FixedPoint;
    /// assert_eq!(FixedPoint::Gold.temperature_k(), 1337.33);
    /// assert_eq!(FixedPoint::Zinc.temperature_k(), 692.677);
    /// ```
    ///
    /// # References
    /// Preston-Thomas, Metrologia 27, 3 (1990), Table 1.
    pub const fn temperature_k(self) -> f64 {
        match self {
            FixedPoint::Indium => 429.7485,
            FixedPoint::Tin => 505.078,
            FixedPoint::Zinc => 692.677,
            FixedPoint::Aluminium => 933.473,
            FixedPoint::Silver => 1234.93,
            FixedPoint::Gold => 1337.33,
            FixedPoint::Copper => 1357.77,
        }
    }

    /// The assigned Celsius temperature t90, °C (ITS-90 Table 1; t90 = T90 − 273.15 K).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::its90::FixedPoint;
    /// assert_eq!(FixedPoint::Tin.temperature_c(), 231.928);
    /// ```
    pub const fn temperature_c(self) -> f64 {
        match self {
            FixedPoint::Indium => 156.5985,
            FixedPoint::Tin => 231.928,
            FixedPoint::Zinc => 419.527,
            FixedPoint::Aluminium => 660.323,
            FixedPoint::Silver => 961.78,
            FixedPoint::Gold => 1064.18,
            FixedPoint::Copper => 1084.62,
        }
    }

    /// The element's name in English (`"indium"` … `"copper"`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::its90::FixedPoint;
    /// assert_eq!(FixedPoint::Aluminium.name(), "aluminium");
    /// ```
    pub const fn name(self) -> &'static str {
        match self {
            FixedPoint::Indium => "indium",
            FixedPoint::Tin => "tin",
            FixedPoint::Zinc => "zinc",
            FixedPoint::Aluminium => "aluminium",
            FixedPoint::Silver => "silver",
            FixedPoint::Gold => "gold",
            FixedPoint::Copper => "copper",
        }
    }

    /// Whether ITS-90 defines T90 above the silver point by the radiance ratio to this point
    /// (Ag, Au, Cu: yes; In, Sn, Zn, Al: no).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::its90::FixedPoint;
    /// assert!(FixedPoint::Gold.defines_ratio_relation());
    /// assert!(!FixedPoint::Zinc.defines_ratio_relation());
    /// ```
    pub const fn defines_ratio_relation(self) -> bool {
        matches!(
            self,
            FixedPoint::Silver | FixedPoint::Gold | FixedPoint::Copper
        )
    }
}

/// A radiance-ratio temperature on ITS-90, with the same equation evaluated with CODATA's c2
/// for comparison (all fields in K), returned by [`its90_temperature`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::its90::{its90_temperature, FixedPoint};
/// // A ratio of 1 is the fixed point itself, whatever c2 (ITS-90 section 3.3 form).
/// let r = its90_temperature(1.0, 650e-9, FixedPoint::Gold).unwrap();
/// assert!((r.t90_k - 1337.33).abs() < 1e-9 && r.c2_effect_k.abs() < 1e-9);
/// assert!(!r.below_silver_point);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Its90Temperature {
    /// T90 from the ITS-90 ratio relation with c2 = 0.014388 m·K, K.
    pub t90_k: f64,
    /// The same relation with c2 = hc/k (CODATA 2018) and the same T90(X), K.
    pub t_codata_c2_k: f64,
    /// `t_codata_c2_k − t90_k`, K: only the effect of the value of c2 in the ratio equation.
    /// It is NOT T − T90 (thermodynamic minus ITS-90 temperature), which needs the
    /// thermodynamic temperature of the reference point.
    pub c2_effect_k: f64,
    /// True when T90 is below the silver point (1234.93 K), where ITS-90 does not define T90
    /// by this relation (platinum resistance thermometry does): the value is then an
    /// extrapolation of the equation, not a T90.
    pub below_silver_point: bool,
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

/// T90 from a radiance `ratio` to a `fixed_point` blackbody (Ag, Au or Cu) at
/// `wavelength_m`, with the temperature the same equation gives with CODATA's c2 = hc/k, the
/// c2 effect, and a flag for results below the silver point.
///
/// # Formula
/// ```text
/// T90      = c2,90 / (λ·ln(1 + (exp(c2,90/(λ·T90(X))) − 1)/r)),   c2,90 = 0.014388 m·K
/// T_CODATA = same with c2 = hc/k = 0.014387768775… m·K (and the same T90(X))
/// c2_effect = T_CODATA − T90;   below_silver_point = T90 < 1234.93 K
/// ```
///
/// # Errors
/// As [`temperature_from_ratio`]; `Unsupported` for a reference other than Ag, Au or Cu (the
/// ITS-90 relation is defined with those three only).
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
/// assert!((r.c2_effect_k - 0.004_034_165_872_284_7).abs() < 1e-9);
/// // a ratio below 1 to silver lies below the silver point: flagged
/// assert!(its90_temperature(0.5, 650e-9, FixedPoint::Silver).unwrap().below_silver_point);
/// ```
///
/// # References
/// Preston-Thomas, Metrologia 27, 3 (1990), section 3.3; CODATA 2018 (Tiesinga et al., Rev.
/// Mod. Phys. 93, 025010, 2021).
pub fn its90_temperature(
    ratio: f64,
    wavelength_m: f64,
    fixed_point: FixedPoint,
) -> Result<Its90Temperature> {
    if !fixed_point.defines_ratio_relation() {
        return Err(Error::Unsupported {
            what: "the ITS-90 ratio relation uses the silver, gold or copper point",
        });
    }
    let tx = fixed_point.temperature_k();
    let t90 = temperature_from_ratio(ratio, wavelength_m, tx, C2Convention::Its90)?;
    let tc = temperature_from_ratio(ratio, wavelength_m, tx, C2Convention::Codata2018)?;
    Ok(Its90Temperature {
        t90_k: t90,
        t_codata_c2_k: tc,
        c2_effect_k: tc - t90,
        below_silver_point: t90 < FixedPoint::Silver.temperature_k(),
    })
}

/// Sensitivity coefficients of a radiance-ratio temperature, returned by
/// [`ratio_temperature_sensitivities`].
///
/// # Examples
/// See [`ratio_temperature_sensitivities`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct RatioSensitivities {
    /// The temperature T, K.
    pub temperature_k: f64,
    /// ∂T/∂r, K per unit ratio. Each sensitivity here is ±∞ only where its true value is beyond
    /// the f64 range (a ratio or wavelength near the bottom of the f64 range).
    #[cfg_attr(feature = "serde", serde(rename = "dTdRatio"))]
    pub d_t_d_ratio: f64,
    /// ∂T/∂T_X (reference-point temperature), K/K.
    #[cfg_attr(feature = "serde", serde(rename = "dTdReferenceTemperature"))]
    pub d_t_d_reference_temperature: f64,
    /// ∂T/∂λ at fixed ratio, K/m.
    #[cfg_attr(feature = "serde", serde(rename = "dTdWavelength"))]
    pub d_t_d_wavelength: f64,
}

/// Sensitivity coefficients of the ratio temperature T (from [`temperature_from_ratio`]) to
/// the measured `ratio` r, the reference-point temperature T_X (`reference_temperature_k`) and
/// the `wavelength_m` λ — the inputs of an uncertainty budget above the silver point.
///
/// # Formula
/// ```text
/// x = c2/(λT),  x_X = c2/(λT_X),  g(y) = 1 − e^(−y)
/// ∂T/∂r   = T·g(x)/(x·r)
/// ∂T/∂T_X = (T/T_X)²·g(x)/g(x_X)                (Wien limit: (T/T_X)²)
/// ∂T/∂λ   = (T/λ)·[(T/T_X)·g(x)/g(x_X) − 1]     (Wien limit: T(T − T_X)/(λT_X))
/// ```
/// (differentiating T = c2/(λ·ln(1 + (e^{x_X} − 1)/r))).
///
/// # Errors
/// As [`temperature_from_ratio`].
///
/// # Accuracy
/// Closed forms with `expm1`: a few ulp on top of T; against mpmath numerical derivatives of a
/// `findroot` solution 1.7e-15 relative (five cases, Ag/Au/Cu, 650 nm–1.6 µm,
/// `tests/gum_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::constants::C2Convention;
/// use quantaband::thermometry::its90::{ratio_temperature_sensitivities, FixedPoint};
/// let tx = FixedPoint::Gold.temperature_k();
/// let s = ratio_temperature_sensitivities(1.0, 650e-9, tx, C2Convention::Its90).unwrap();
/// // at the reference point itself: ∂T/∂T_X = 1 and no wavelength sensitivity
/// assert!((s.d_t_d_reference_temperature - 1.0).abs() < 1e-12);
/// assert!(s.d_t_d_wavelength.abs() < 1e-3);
/// ```
///
/// # References
/// Preston-Thomas, Metrologia 27, 3 (1990), section 3.3 (the relation); JCGM 100:2008 §5.1.3
/// (sensitivity coefficients).
pub fn ratio_temperature_sensitivities(
    ratio: f64,
    wavelength_m: f64,
    reference_temperature_k: f64,
    c2: C2Convention,
) -> Result<RatioSensitivities> {
    let t = temperature_from_ratio(ratio, wavelength_m, reference_temperature_k, c2)?;
    let c2v = c2.c2();
    let x = c2v / (wavelength_m * t);
    let x_ref = c2v / (wavelength_m * reference_temperature_k);
    let g = |y: f64| -expm1(-y);
    let rel = t / reference_temperature_k;
    let gg = g(x) / g(x_ref);
    // T·g(x)/x = λT²·g(x)/c2, with g(x)/x ∈ (0, 1] formed first so that λT²/c2 cannot overflow
    // on its own (g(x)/x → 1 where x underflows to 0).
    let g_over_x = if x > 0.0 { g(x) / x } else { 1.0 };
    let d_t_d_ratio = g_over_x * t / ratio;
    Ok(RatioSensitivities {
        temperature_k: t,
        d_t_d_ratio,
        // rel·gg is moderate; rel² alone overflows for T/T_X > 1.3e154.
        d_t_d_reference_temperature: rel * (rel * gg),
        // (rel·gg − 1)·T first: T/λ can overflow where the difference is 0.
        d_t_d_wavelength: (rel * gg - 1.0) * t / wavelength_m,
    })
}

/// A Sakuma–Hattori curve through the signals of an instrument at three ITS-90 fixed points,
/// returned by [`fixed_point_curve`].
///
/// # Examples
/// See [`fixed_point_curve`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FixedPointCurve {
    /// The curve, exact through the three points (to < 1e-9 K).
    pub curve: SakumaHattori,
    /// The fixed points, in increasing temperature.
    pub fixed_points: [FixedPoint; 3],
    /// The model's signals at their T90, in the same order.
    pub signals: [f64; 3],
}

/// Largest interpolation error of a curve over a temperature range, and where it occurs.
///
/// # Examples
/// See [`fixed_point_curve`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct InterpolationError {
    /// max |T_curve(S_exact(T)) − T| over the range, K.
    pub max_abs_error_k: f64,
    /// The temperature where it occurs, K.
    pub at_temperature_k: f64,
}

/// Interpolation error of a fixed-point curve between its points and beyond them.
///
/// # Examples
/// See [`fixed_point_curve`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct InterpolationReport {
    /// Between the lowest and the highest fixed point.
    pub between: InterpolationError,
    /// From the lower range limit up to the lowest fixed point (extrapolation), if below it.
    pub below: Option<InterpolationError>,
    /// From the highest fixed point up to the upper range limit (extrapolation), if above it.
    pub above: Option<InterpolationError>,
}

/// A Sakuma–Hattori curve through an instrument's signals at three ITS-90 fixed points: the
/// `model` (a [`super::model::SpectralPoint`], a response-table
/// [`super::response::ResponseSignal`], …) gives S(T90) at each point, and the curve is
/// solved exactly through the three (T90, S) pairs.
///
/// The model should use the ITS-90 c2 (`C2Convention::Its90`) and so should the curve (`c2`),
/// so that the curve is a realisation of T90. The result carries ITS-90 temperatures, not
/// thermodynamic ones.
///
/// # Formula
/// ```text
/// S_i = model.signal(T90_i);   S(T) = C/(exp(c2/(A·T + B)) − 1) through (T90_i, S_i), i = 1..3
/// ```
///
/// # Errors
/// `DegenerateFit` for a repeated fixed point; errors of the model and of
/// [`SakumaHattori::fit`].
///
/// # Accuracy
/// The curve reproduces the three signals to < 1e-9 K; its interpolation error against the
/// exact model is reported by [`FixedPointCurve::interpolation_errors`] (e.g. 20 nm band at
/// 650 nm through Zn, Al, Cu: see `tests/gum_calibration.rs`).
///
/// # Examples
/// ```
/// use quantaband::constants::C2Convention;
/// use quantaband::thermometry::its90::{fixed_point_curve, FixedPoint};
/// use quantaband::thermometry::response::{Response, ResponseSignal};
/// let (wl, r) = ([640e-9, 660e-9], [1.0, 1.0]);
/// let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Its90);
/// let fp = [FixedPoint::Zinc, FixedPoint::Aluminium, FixedPoint::Copper];
/// let c = fixed_point_curve(&model, fp, C2Convention::Its90).unwrap();
/// let e = c.interpolation_errors(&model, 600.0, 2000.0, 200).unwrap();
/// assert!(e.between.max_abs_error_k < 1e-3);   // sub-millikelvin between Zn and Cu
/// assert!(e.above.unwrap().max_abs_error_k > e.between.max_abs_error_k); // extrapolation
/// ```
///
/// # References
/// Preston-Thomas (1990), Table 1; Sakuma & Hattori (1982), see
/// [`super::sakuma_hattori`].
pub fn fixed_point_curve<M: SignalModel + ?Sized>(
    model: &M,
    fixed_points: [FixedPoint; 3],
    c2: C2Convention,
) -> Result<FixedPointCurve> {
    let mut fp = fixed_points;
    // three elements: compare and swap (no general sort routine in the module)
    for (i, j) in [(0, 1), (1, 2), (0, 1)] {
        if fp[j].temperature_k() < fp[i].temperature_k() {
            fp.swap(i, j);
        }
    }
    if fp[0] == fp[1] || fp[1] == fp[2] {
        return Err(Error::DegenerateFit {
            reason: "three different fixed points are needed",
        });
    }
    let t = fp.map(FixedPoint::temperature_k);
    let signals = [
        model.signal(t[0])?,
        model.signal(t[1])?,
        model.signal(t[2])?,
    ];
    let fit = SakumaHattori::fit(&t, &signals, c2, None)?;
    Ok(FixedPointCurve {
        curve: fit.curve,
        fixed_points: fp,
        signals,
    })
}

impl FixedPointCurve {
    /// Interpolation error of the curve against the exact `model` between the fixed points and
    /// beyond them over [`t_min_k`, `t_max_k`], each part sampled at `n_points` evenly spaced
    /// temperatures.
    ///
    /// # Formula
    /// ```text
    /// ΔT(T) = T_curve(S_model(T)) − T;  max |ΔT| over [T1, T3], [t_min, T1], [T3, t_max]
    /// ```
    ///
    /// # Errors
    /// Those of [`max_interpolation_error_k`] (`TooFewPoints` for `n_points` < 2, bad
    /// temperatures); `DegenerateFit` when t_min ≥ t_max.
    ///
    /// # Accuracy
    /// Sampled maxima (see [`max_interpolation_error_k`]).
    ///
    /// # Examples
    /// See [`fixed_point_curve`].
    ///
    /// # References
    /// Common practice, no source.
    pub fn interpolation_errors<M: SignalModel + ?Sized>(
        &self,
        model: &M,
        t_min_k: f64,
        t_max_k: f64,
        n_points: usize,
    ) -> Result<InterpolationReport> {
        temperature("t_min_k", t_min_k)?;
        temperature("t_max_k", t_max_k)?;
        if !(t_min_k < t_max_k) {
            return Err(Error::DegenerateFit {
                reason: "t_min_k must be below t_max_k",
            });
        }
        let lo = self.fixed_points[0].temperature_k();
        let hi = self.fixed_points[2].temperature_k();
        let part = |a: f64, b: f64| -> Result<InterpolationError> {
            let (e, at) = max_interpolation_error_k(&self.curve, model, a, b, n_points)?;
            Ok(InterpolationError {
                max_abs_error_k: e,
                at_temperature_k: at,
            })
        };
        Ok(InterpolationReport {
            between: part(lo, hi)?,
            below: if t_min_k < lo {
                Some(part(t_min_k, lo)?)
            } else {
                None
            },
            above: if t_max_k > hi {
                Some(part(hi, t_max_k)?)
            } else {
                None
            },
        })
    }
}
