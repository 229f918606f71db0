//! Inverse problems: temperature from a spectral value (brightness temperature), from a band
//! value, and from the ratio of two band values (two-colour / ratio temperature).
//!
//! # Method
//! - Brightness temperature: closed form, `T = q / (v · ln(1 + K v^p / L))` (wavelength) or
//!   `T = q v / ln(1 + K v^p / L)` (wavenumber, frequency), with a logarithmic evaluation when
//!   the intermediate ratio leaves the f64 range.
//! - Band and ratio inverses: safeguarded Newton iteration on u = ln T over the documented
//!   search range [`T_MIN_K`, `T_MAX_K`] = [1e-3 K, 1e7 K], applied to g(u) = ln B(T) − ln B₀
//!   (band) or ln B₁(T) − ln B₂(T) + ln(ε₁/ε₂) − ln R₀ (ratio). The derivative
//!   dg/du = T·(∂B/∂T)/B comes from the exact band derivative. A Newton step that leaves the
//!   current bracket is replaced by bisection, so the iteration always converges when a root is
//!   bracketed; if the target lies outside what the range can give, `NoSolution` is returned.
//!
//! # Monotonicity of the band ratio
//! For two bands that are disjoint in the spectral variable, T·∂ln B/∂T is a weighted mean of
//! w(x) = x/(1 − e^−x), which increases with x, so the log-ratio derivative has a fixed sign
//! and the ratio is strictly monotone in T: the inverse is unique. For overlapping or nested
//! bands it generally is not (a nested band's share of the outer band rises and then falls);
//! the solver then samples the sign of the derivative at 49 temperatures spread geometrically
//! over the search range and returns `NoSolution` if it changes sign (an ambiguous inverse).
//! This check is a sampling, not a proof, for overlapping bands only.
//!
//! # References
//! - D. P. DeWitt, G. D. Nutter (eds.), Theory and Practice of Radiation Thermometry, Wiley
//!   (1988), ch. 1–2 (spectral, band and ratio thermometry).
//! - Howell et al., Thermal Radiation Heat Transfer, 7th ed. (2020), ch. 1.
#![forbid(unsafe_code)]

use crate::band::{check_band, ln_band_unchecked, solve_monotone};
use crate::error::{self, Error, Result};
use crate::float;
use crate::planck::Spectrum;

/// Lower end of the temperature range searched by the band and ratio inverses, K.
///
/// [`temperature_from_band`] and [`temperature_from_band_ratio`] only look for a solution in
/// [`T_MIN_K`, `T_MAX_K`]; a value that no temperature in that range explains returns
/// `Error::NoSolution` rather than an extrapolated temperature. (The closed-form
/// [`temperature_from_spectral`] has no such range.)
///
/// # Examples
/// ```
/// use quantaband::band::band;
/// use quantaband::inverse::{temperature_from_band, T_MIN_K};
/// use quantaband::planck::Spectrum;
/// let s = Spectrum::BLACKBODY;
/// // A band radiance below what T_MIN_K gives has no solution in the searched range (a
/// // 0.1–1 m band, so that the value at 0.5 mK is still a normal f64).
/// let cold = band(&s, 0.1, 1.0, 0.5 * T_MIN_K).unwrap();
/// assert!(cold > 0.0);
/// assert_eq!(temperature_from_band(&s, 0.1, 1.0, cold).unwrap_err().code(), "NO_SOLUTION");
/// assert!((temperature_from_band(&s, 0.1, 1.0, band(&s, 0.1, 1.0, 2.0 * T_MIN_K).unwrap()).unwrap()
///     / (2.0 * T_MIN_K) - 1.0).abs() < 1e-9);
/// ```
pub const T_MIN_K: f64 = 1e-3;
/// Upper end of the temperature range searched by the band and ratio inverses, K.
///
/// See [`T_MIN_K`] for how the range is used.
///
/// # Examples
/// ```
/// use quantaband::band::band;
/// use quantaband::inverse::{temperature_from_band, T_MAX_K};
/// use quantaband::planck::Spectrum;
/// let s = Spectrum::BLACKBODY;
/// // A band radiance above what T_MAX_K gives has no solution in the searched range.
/// let hot = band(&s, 8e-6, 14e-6, 2.0 * T_MAX_K).unwrap();
/// assert_eq!(temperature_from_band(&s, 8e-6, 14e-6, hot).unwrap_err().code(), "NO_SOLUTION");
/// ```
pub const T_MAX_K: f64 = 1e7;

/// Brightness temperature without validation; None when T is outside the f64 range.
fn brightness_unchecked(spec: &Spectrum, v: f64, value: f64) -> Option<f64> {
    let (k, p, q, inverse, ln_k) = spec.density_params();
    let vp = float::powi(v, p);
    let r = k * vp / value;
    // X = ln(1 + r) is the reduced variable x at the brightness temperature.
    let (x, lnx) = if k.is_normal() && vp.is_normal() && r.is_normal() && r < 1e300 {
        let x = float::ln_1p(r);
        (x, float::ln(x))
    } else {
        let lnr = ln_k + f64::from(p) * float::ln(v) - float::ln(value);
        if lnr > 36.0 {
            let x = lnr + float::ln_1p(float::exp(-lnr));
            (x, float::ln(x))
        } else if lnr < -36.0 {
            (float::exp(lnr), lnr)
        } else {
            let x = float::ln_1p(float::exp(lnr));
            (x, float::ln(x))
        }
    };
    let num = if inverse { q / v } else { q * v };
    let mut t = num / x;
    if !(num.is_normal() && x.is_normal() && t.is_normal()) {
        let lnt = if inverse {
            float::ln(q) - float::ln(v) - lnx
        } else {
            float::ln(q) + float::ln(v) - lnx
        };
        t = float::exp(lnt);
    }
    if t.is_normal() {
        Some(t)
    } else {
        None
    }
}

/// Temperature, K, at which the spectrum `spec` (emissivity, medium index, variable, quantity,
/// geometry and c₂ convention included) takes the value `value` at the spectral coordinate `x`:
/// the true temperature of a grey body of emissivity `spec.emissivity`.
///
/// With `spec.emissivity` = 1 this equals [`brightness_temperature`]; with ε < 1 it is higher
/// (the emissivity is accounted for). In the trade, "brightness temperature" always means the
/// blackbody (ε = 1) value, hence the two names.
///
/// # Formula
/// ```text
/// X = ln(1 + ε n² g K v^p / value)
/// T = c₂/(λX) (wavelength),  c₂σ̃/X (wavenumber),  c₂ν/(cX) (frequency)
/// K v^p: 2hc²λ⁻⁵, 2hc²σ̃³, 2hν³/c² (energy); 2cλ⁻⁴, 2cσ̃², 2ν²/c² (photon); g = 1 or π
/// ```
///
/// # Errors
/// [`Spectrum::validate`] errors; `NonFinite`/`NonPositiveSpectral` for `x`;
/// `NonFinite`/`NonPositive` for `value`; `NoSolution` if the temperature is outside the f64
/// range.
///
/// # Accuracy
/// Round trip T → spectral → T: max relative error 4.4e-16 over a grid of 6426 points
/// (T from 1 K to 1e5 K, x from 0.01 to 200, all variables and quantities; measured with a
/// scratch program, not a test); the property test `tests/core_properties.rs` asserts 1e-10.
///
/// # Examples
/// ```
/// use quantaband::{inverse::temperature_from_spectral, planck::Spectrum};
/// // 9.924 033 330 070 695e6 W·m⁻²·sr⁻¹·m⁻¹ at 10 µm is a 300 K blackbody (mpmath forward value).
/// let t = temperature_from_spectral(&Spectrum::default(), 10e-6, 9.924_033_330_070_695e6).unwrap();
/// assert!((t / 300.0 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck's law solved for T; DeWitt & Nutter (1988), ch. 1.
pub fn temperature_from_spectral(spec: &Spectrum, x: f64, value: f64) -> Result<f64> {
    spec.validate()?;
    error::spectral(spec.variable.arg_name(), x)?;
    error::positive("value", value)?;
    brightness_unchecked(spec, x, value).ok_or(Error::NoSolution {
        what: "temperature outside the f64 range",
    })
}

/// Brightness (radiance) temperature, K: the temperature of a *blackbody* (ε = 1) whose
/// spectrum takes the value `value` at `x` — what an instrument set to ε = 1 would show.
/// `spec.emissivity` is not used; the variable, quantity, geometry, medium index and c₂
/// convention of `spec` are.
///
/// # Formula
/// ```text
/// T_b = temperature_from_spectral(spec with ε = 1, x, value)
/// ```
///
/// # Errors
/// As [`temperature_from_spectral`] (the emissivity of `spec` is not checked).
///
/// # Accuracy
/// As [`temperature_from_spectral`].
///
/// # Examples
/// ```
/// use quantaband::{inverse::brightness_temperature, planck::Spectrum};
/// // A grey body (ε = 0.9) at 300 K seen at 10 µm: its spectral radiance is 0.9 × 9.924 033e6
/// // W·m⁻²·sr⁻¹·m⁻¹; a blackbody gives that at 293.600 565 687 K (mpmath, 30 digits, Planck's
/// // law solved for T with CODATA 2018 h, c, k).
/// let grey = Spectrum::default().with_emissivity(0.9);
/// let l = grey.spectral(10e-6, 300.0).unwrap();
/// let tb = brightness_temperature(&grey, 10e-6, l).unwrap();
/// assert!((tb - 293.600_565_687_493_9).abs() < 1e-9, "{tb}");
/// ```
///
/// # References
/// DeWitt & Nutter (1988), ch. 1 (radiance temperature); ITS-90 text, §2.6 (radiance
/// temperature as the blackbody temperature of equal spectral radiance).
pub fn brightness_temperature(spec: &Spectrum, x: f64, value: f64) -> Result<f64> {
    temperature_from_spectral(&spec.with_emissivity(1.0), x, value)
}

/// Temperature, K, at which the band quantity of `spec` between `lower` and `upper` equals
/// `value` (the inverse of [`crate::band::band`]), searched in [1e-3 K, 1e7 K].
///
/// # Formula
/// ```text
/// solve ln B(T) = ln value for u = ln T (safeguarded Newton, dg/du = T B′/B)
/// B(T) = band(spec, lower, upper, T)
/// ```
///
/// # Errors
/// [`Spectrum::validate`] errors; limit errors and `InvalidBand` as for [`crate::band::band`];
/// `NonFinite`/`NonPositive` for `value`; `NoSolution` if `value` is not reached between
/// [`T_MIN_K`] and [`T_MAX_K`]; `NotConverged` (not observed) if the iteration stalls.
///
/// # Accuracy
/// Round trip T → band → T: max relative error 8.0e-15 over the same 6426-point grid (bands
/// [λ, 1.5λ]); the property test asserts 1e-10.
///
/// # Examples
/// ```
/// use quantaband::{inverse::temperature_from_band, planck::Spectrum};
/// // 54.933 461 376 839 688 W·m⁻²·sr⁻¹ in 8–14 µm is a 300 K blackbody (mpmath forward value).
/// let t = temperature_from_band(&Spectrum::default(), 8e-6, 14e-6, 54.933_461_376_839_688).unwrap();
/// assert!((t / 300.0 - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// DeWitt & Nutter (1988), ch. 1 (band radiation thermometry).
pub fn temperature_from_band(spec: &Spectrum, lower: f64, upper: f64, value: f64) -> Result<f64> {
    check_band(spec, lower, upper)?;
    error::positive("value", value)?;
    let target = float::ln(value);
    let g = |u: f64| -> (f64, f64) {
        let t = float::exp(u);
        let lb = ln_band_unchecked(spec, lower, upper, t, false);
        let ld = ln_band_unchecked(spec, lower, upper, t, true);
        (lb - target, float::exp(ld - lb + u))
    };
    let (ulo, uhi) = (float::ln(T_MIN_K), float::ln(T_MAX_K));
    // Bracket check with values only (B is strictly increasing in T).
    let l_hi = ln_band_unchecked(spec, lower, upper, T_MAX_K, false);
    if l_hi.is_nan() || l_hi < target {
        return Err(Error::NoSolution {
            what: "band value exceeds what the band gives at the 1e7 K search ceiling",
        });
    }
    let l_lo = ln_band_unchecked(spec, lower, upper, T_MIN_K, false);
    if l_lo.is_nan() || l_lo > target {
        return Err(Error::NoSolution {
            what: "band value is below what the band gives at the 1e-3 K search floor",
        });
    }
    // Initial guess: brightness temperature of the mean spectral value at the band centre.
    let x0 = brightness_unchecked(spec, 0.5 * (lower + upper), value / (upper - lower))
        .map(float::ln)
        .filter(|u| u.is_finite());
    let u = solve_monotone(g, ulo, uhi, x0, true, false)?;
    Ok(float::exp(u))
}

/// Temperature, K, at which the ratio of the band quantities of `spec` over `band1` and
/// `band2`, multiplied by the emissivity ratio ε₁/ε₂, equals `ratio` (two-colour / ratio
/// thermometry under the grey-body assumption; `spec.emissivity` cancels).
///
/// Bands are `(lower, upper)` in the SI unit of `spec.variable`. Searched in [1e-3 K, 1e7 K].
///
/// # Formula
/// ```text
/// R(T) = (ε₁/ε₂) · B(band1, T) / B(band2, T);  solve ln R(T) = ln ratio for u = ln T
/// d ln R / du = T B₁′/B₁ − T B₂′/B₂
/// ```
///
/// # Errors
/// Band errors as for [`crate::band::band`] (for either band); `NonFinite`/`NonPositive` for
/// `ratio` and `emissivity_ratio`; `NoSolution` if the ratio is not reached in the search range
/// or if, for overlapping bands, the ratio is not monotonic in T (ambiguous inverse);
/// `NotConverged` (not observed) if the iteration stalls.
///
/// # Accuracy
/// Round trip T → ratio → T: max relative error 1.8e-13 over the grid above restricted to
/// 0.3 < x < 100 (adjacent bands [λ, 1.2λ], [1.2λ, 1.5λ]); the property test asserts 1e-10.
/// The attainable accuracy falls as the ratio flattens (Rayleigh–Jeans regime, x ≪ 1), where
/// the sensitivity d ln R/d ln T tends to 0.
///
/// # Examples
/// ```
/// use quantaband::{band::band, inverse::temperature_from_band_ratio, planck::Spectrum};
/// // Invented scenario: a two-colour pyrometer on a (made-up) billet line, 0.9–1.0 µm and
/// // 1.0–1.1 µm, grey body, true temperature 1400 K.
/// let s = Spectrum::default();
/// let r = band(&s, 0.9e-6, 1.0e-6, 1400.0).unwrap() / band(&s, 1.0e-6, 1.1e-6, 1400.0).unwrap();
/// let t = temperature_from_band_ratio(&s, (0.9e-6, 1.0e-6), (1.0e-6, 1.1e-6), r, 1.0).unwrap();
/// assert!((t / 1400.0 - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// DeWitt & Nutter (1988), ch. 1–2 (ratio thermometry); Howell et al. (2020), ch. 1.
pub fn temperature_from_band_ratio(
    spec: &Spectrum,
    band1: (f64, f64),
    band2: (f64, f64),
    ratio: f64,
    emissivity_ratio: f64,
) -> Result<f64> {
    check_band(spec, band1.0, band1.1)?;
    check_band(spec, band2.0, band2.1)?;
    error::positive("ratio", ratio)?;
    error::positive("emissivity_ratio", emissivity_ratio)?;
    let target = float::ln(ratio) - float::ln(emissivity_ratio);
    let g = |u: f64| -> (f64, f64) {
        let t = float::exp(u);
        let l1 = ln_band_unchecked(spec, band1.0, band1.1, t, false);
        let l2 = ln_band_unchecked(spec, band2.0, band2.1, t, false);
        let d1 = float::exp(ln_band_unchecked(spec, band1.0, band1.1, t, true) - l1 + u);
        let d2 = float::exp(ln_band_unchecked(spec, band2.0, band2.1, t, true) - l2 + u);
        (l1 - l2 - target, d1 - d2)
    };
    let (ulo, uhi) = (float::ln(T_MIN_K), float::ln(T_MAX_K));
    // Direction of monotonicity: disjoint bands have a fixed sign (module docs); band1 at
    // larger reduced x (shorter wavelength, higher wavenumber/frequency) means increasing.
    let disjoint = band1.1 <= band2.0 || band2.1 <= band1.0;
    let increasing = if disjoint {
        let band1_below = band1.1 <= band2.0;
        match spec.variable {
            crate::planck::SpectralVariable::Wavelength => band1_below,
            _ => !band1_below,
        }
    } else {
        // Overlapping bands: sample the sign of d ln R/du.
        let n = 48;
        let mut sign = 0.0;
        for i in 0..=n {
            let u = ulo + (uhi - ulo) * f64::from(i) / f64::from(n);
            let d = g(u).1;
            let s = if d > 0.0 {
                1.0
            } else if d < 0.0 {
                -1.0
            } else {
                0.0
            };
            if s == 0.0 || (sign != 0.0 && s != sign) {
                return Err(Error::NoSolution {
                    what: "the ratio of these overlapping bands is not monotonic in temperature \
                           (ambiguous two-colour inverse)",
                });
            }
            sign = s;
        }
        sign > 0.0
    };
    let value_only = |t: f64| {
        ln_band_unchecked(spec, band1.0, band1.1, t, false)
            - ln_band_unchecked(spec, band2.0, band2.1, t, false)
            - target
    };
    let (glo, ghi) = (value_only(T_MIN_K), value_only(T_MAX_K));
    let sgn = if increasing { 1.0 } else { -1.0 };
    if glo.is_nan() || ghi.is_nan() || sgn * glo > 0.0 || sgn * ghi < 0.0 {
        return Err(Error::NoSolution {
            what: "band ratio outside the range the two bands give between 1e-3 K and 1e7 K",
        });
    }
    // Initial guess from the Wien approximation at the band centres:
    // ln R ≈ ln(v₁ᵖ w₁ / (v₂ᵖ w₂)) − (a₁ − a₂)/T with x = a/T (a = q/v or q·v).
    let (_, p, q, inverse, _) = spec.density_params();
    let centre = |b: (f64, f64)| 0.5 * (b.0 + b.1);
    let (v1, v2) = (centre(band1), centre(band2));
    let a = |v: f64| if inverse { q / v } else { q * v };
    let lead = f64::from(p) * (float::ln(v1) - float::ln(v2)) + float::ln(band1.1 - band1.0)
        - float::ln(band2.1 - band2.0);
    let t0 = (a(v1) - a(v2)) / (lead - target);
    let x0 = if t0.is_finite() && t0 > T_MIN_K && t0 < T_MAX_K {
        Some(float::ln(t0))
    } else {
        Some(float::ln(1000.0))
    };
    let u = solve_monotone(g, ulo, uhi, x0, increasing, false)?;
    Ok(float::exp(u))
}
