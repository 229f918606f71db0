//! Student's t distribution: distribution function, quantile and the GUM coverage factor
//! k_p(ν) = t_{(1+p)/2}(ν) — what turns a combined standard uncertainty with ν effective degrees
//! of freedom into an expanded uncertainty at coverage probability p (JCGM 100:2008 §6.3, G.3).
//!
//! # Method
//! Upper tail for t ≥ 0 and ν > 0 degrees of freedom (ν may be non-integer):
//!
//! ```text
//! Q(t; ν) = P(T > t) = ½·I_x(ν/2, ½),   x = ν/(ν + t²)
//! I_x(a, b) = x^a (1 − x)^b / (a·B(a, b)) · 1/(1+ d1/(1+ d2/(1+ …)))      (continued fraction)
//! ```
//!
//! The continued fraction of the regularised incomplete beta function is evaluated by the
//! modified Lentz method; when x > (a + 1)/(a + b + 2) the symmetry
//! I_x(a, b) = 1 − I_{1−x}(b, a) is used so that it converges in a few tens of terms for every
//! ν from 10⁻² to 10¹⁷ (ν above 10¹⁷ is the normal distribution to double precision). The
//! prefactor is formed in logarithms from t and ν directly (a·ln x = −(ν/2)·ln(1 + t²/ν),
//! ln(1 − x) = −ln(1 + ν/t²)), and ln B(a, ½) = ln Γ(a) + ln √π − ln Γ(a + ½) uses, for a ≥ 20,
//! the Stirling-series difference ln Γ(a + ½) − ln Γ(a) = a·ln(1 + 1/(2a)) − ½ + ½ ln a + ΔS
//! (no cancellation of large log-gamma values). ν = ∞ is the normal distribution,
//! Q = ½·erfc(t/√2).
//!
//! The quantile solves Q(t) = q by Newton's method on ln Q as a function of ln t (nearly
//! linear in both tails: a power law for small ν, and well-conditioned for the normal), kept
//! inside a bracket that every evaluation tightens, with bisection in ln t when a step leaves
//! it.
//!
//! # References
//! - W. H. Press, S. A. Teukolsky, W. T. Vetterling, B. P. Flannery, *Numerical Recipes*, 3rd
//!   ed., Cambridge University Press, 2007, §6.4 (incomplete beta function, continued fraction
//!   and Lentz's method) and §6.14 (Student's t).
//! - M. Abramowitz, I. A. Stegun, *Handbook of Mathematical Functions*, 1964, 26.7.1
//!   (t distribution) and 26.5.27 (relation to the incomplete beta function).
//! - JCGM 100:2008, *Evaluation of measurement data — Guide to the expression of uncertainty in
//!   measurement*, §6.3 and Annex G (Table G.2).
#![forbid(unsafe_code)]

use crate::float::{erfc, exp, ln, ln_1p, sqrt};
use crate::{Error, Result};

/// ln √π.
const LN_SQRT_PI: f64 = 0.572_364_942_924_700_1;
/// 1/√2.
const FRAC_1_SQRT_2: f64 = core::f64::consts::FRAC_1_SQRT_2;
/// Above this many degrees of freedom the t distribution equals the normal one in f64.
const NU_NORMAL: f64 = 1e17;

/// Checks a number of degrees of freedom: ν > 0, +∞ allowed.
pub(crate) fn check_degrees_of_freedom(arg: &'static str, nu: f64) -> Result<f64> {
    if nu.is_nan() {
        return Err(Error::NonFinite { arg, value: nu });
    }
    if nu > 0.0 {
        Ok(nu)
    } else {
        Err(Error::OutOfRange {
            arg,
            value: nu,
            range: "(0, inf]",
        })
    }
}

/// ln Γ(a + ½) − ln Γ(a) for a > 0.
///
/// Below a = 20 the recurrence Γ(z + 1) = z·Γ(z) shifts the argument up:
/// ln Γ(a + ½) − ln Γ(a) = [ln Γ(z + ½) − ln Γ(z)] − Σ_{k<m} ln(1 + ½/(a + k)), z = a + m ≥ 20
/// (at most about 20 terms of ln_1p; no log-gamma routine in the module).
fn ln_gamma_half_step(a: f64) -> f64 {
    let mut z = a;
    let mut shift = 0.0;
    while z < 20.0 {
        shift += ln_1p(0.5 / z);
        z += 1.0;
    }
    // Stirling: ln Γ(z) = (z − ½)ln z − z + ½ln 2π + S(z), S(z) = Σ B₂ₖ/(2k(2k−1)z^(2k−1)).
    let s = |z: f64| {
        let r = 1.0 / z;
        let r2 = r * r;
        r * (1.0 / 12.0 - r2 * (1.0 / 360.0 - r2 * (1.0 / 1260.0 - r2 * (1.0 / 1680.0))))
    };
    z * ln_1p(0.5 / z) - 0.5 + 0.5 * ln(z) + (s(z + 0.5) - s(z)) - shift
}

/// ln B(a, ½).
fn ln_beta_half(a: f64) -> f64 {
    LN_SQRT_PI - ln_gamma_half_step(a)
}

/// Continued fraction of I_x(a, b) (modified Lentz), without the prefactor.
fn beta_continued_fraction(a: f64, b: f64, x: f64) -> f64 {
    const TINY: f64 = 1e-300;
    let (qab, qap, qam) = (a + b, a + 1.0, a - 1.0);
    let mut c = 1.0;
    let mut d = 1.0 - qab * x / qap;
    if d.abs() < TINY {
        d = TINY;
    }
    d = 1.0 / d;
    let mut h = d;
    for m in 1..10_000 {
        let m = m as f64;
        let m2 = 2.0 * m;
        let aa = m * (b - m) * x / ((qam + m2) * (a + m2));
        d = 1.0 + aa * d;
        if d.abs() < TINY {
            d = TINY;
        }
        c = 1.0 + aa / c;
        if c.abs() < TINY {
            c = TINY;
        }
        d = 1.0 / d;
        h *= d * c;
        let aa = -(a + m) * (qab + m) * x / ((a + m2) * (qap + m2));
        d = 1.0 + aa * d;
        if d.abs() < TINY {
            d = TINY;
        }
        c = 1.0 + aa / c;
        if c.abs() < TINY {
            c = TINY;
        }
        d = 1.0 / d;
        let del = d * c;
        h *= del;
        if (del - 1.0).abs() <= 1e-16 {
            break;
        }
    }
    h
}

/// ln(1 + t²/ν), also where t²/ν overflows.
fn ln_1p_square_over(t: f64, nu: f64) -> f64 {
    let r = t * t / nu;
    if r.is_finite() {
        ln_1p(r)
    } else {
        2.0 * ln(t.abs()) - ln(nu)
    }
}

/// Upper tail Q(t; ν) = P(T > t) for t ≥ 0 (ν > 0, possibly ∞; no checks).
pub(crate) fn upper_tail(t: f64, nu: f64) -> f64 {
    if t == 0.0 {
        return 0.5;
    }
    if !(nu < NU_NORMAL) {
        return 0.5 * erfc(t * FRAC_1_SQRT_2);
    }
    if t.is_infinite() {
        return 0.0;
    }
    if nu < 1e-300 {
        // Q = ½ − O(ν·ln t) with ln t ≤ 710: ½ to the last bit. Below, a = ν/2 would lose its
        // bits (or round to 0 and give NaN).
        return 0.5;
    }
    let a = 0.5 * nu;
    let t2 = t * t;
    let x = 1.0 / (1.0 + t2 / nu);
    let direct = x < (a + 1.0) / (a + 2.5);
    if direct && 110.0 * t2 < nu {
        // The direct continued fraction loses ~2ε·ν/t² to cancellation when t² ≪ ν; Fisher's
        // expansion (error ∝ ν⁻⁵) is the more accurate of the two there.
        return 0.5 * erfc(fisher_normal_deviate(t, nu) * FRAC_1_SQRT_2);
    }
    // x = ν/(ν + t²), 1 − x = t²/(ν + t²), in logarithms from t and ν.
    let ln_x = -ln_1p_square_over(t, nu);
    let ln_1mx = -ln_1p(nu / t2);
    let ln_front = a * ln_x + 0.5 * ln_1mx - ln_beta_half(a);
    let x1 = 1.0 / (1.0 + nu / t2);
    if direct {
        0.5 * exp(ln_front) * beta_continued_fraction(a, 0.5, x) / a
    } else {
        0.5 * (1.0 - exp(ln_front) * beta_continued_fraction(0.5, a, x1) / 0.5)
    }
}

/// Fisher's expansion t = z + g1(z)/ν + g2(z)/ν² + g3(z)/ν³ + g4(z)/ν⁴ (Abramowitz & Stegun
/// 26.7.5) and its z-derivative.
fn fisher_series(z: f64, nu: f64) -> (f64, f64) {
    let z2 = z * z;
    let r = 1.0 / nu;
    // g_k(z) = z·P_k(z²), with P_k below; derivatives via d/dz[z·P(z²)] = P + 2z²P′.
    let p1 = (z2 + 1.0) / 4.0;
    let d1 = (3.0 * z2 + 1.0) / 4.0;
    let p2 = ((5.0 * z2 + 16.0) * z2 + 3.0) / 96.0;
    let d2 = ((25.0 * z2 + 48.0) * z2 + 3.0) / 96.0;
    let p3 = (((3.0 * z2 + 19.0) * z2 + 17.0) * z2 - 15.0) / 384.0;
    let d3 = (((21.0 * z2 + 95.0) * z2 + 51.0) * z2 - 15.0) / 384.0;
    let p4 = ((((79.0 * z2 + 776.0) * z2 + 1482.0) * z2 - 1920.0) * z2 - 945.0) / 92160.0;
    let d4 = ((((711.0 * z2 + 5432.0) * z2 + 7410.0) * z2 - 5760.0) * z2 - 945.0) / 92160.0;
    let corr = r * (p1 + r * (p2 + r * (p3 + r * p4)));
    let dcorr = r * (d1 + r * (d2 + r * (d3 + r * d4)));
    (z * (1.0 + corr), 1.0 + dcorr)
}

/// The standard normal deviate z whose Fisher expansion gives t (Newton; z ≈ t).
fn fisher_normal_deviate(t: f64, nu: f64) -> f64 {
    let mut z = t;
    for _ in 0..20 {
        let (tz, dtz) = fisher_series(z, nu);
        let step = (tz - t) / dtz;
        z -= step;
        if step.abs() <= 1e-17 * z.abs() {
            break;
        }
    }
    z
}

/// Probability density f(t; ν) (ν > 0, possibly ∞; no checks).
pub(crate) fn density(t: f64, nu: f64) -> f64 {
    if !(nu < NU_NORMAL) {
        // 1/√(2π)
        return 0.398_942_280_401_432_7 * exp(-0.5 * t * t);
    }
    let ln_f = -ln_beta_half(0.5 * nu) - 0.5 * ln(nu) - 0.5 * (nu + 1.0) * ln_1p_square_over(t, nu);
    exp(ln_f)
}

/// Distribution function P(T ≤ t) of Student's t with `degrees_of_freedom` ν (> 0, non-integer
/// and +∞ allowed; ∞ is the standard normal distribution).
///
/// # Formula
/// ```text
/// P(T ≤ t) = 1 − ½·I_x(ν/2, ½) for t ≥ 0, ½·I_x(ν/2, ½) for t < 0,   x = ν/(ν + t²)
/// ν = ∞:  Φ(t) = ½·erfc(−t/√2)
/// ```
/// (see the module docs for the evaluation).
///
/// # Errors
/// `NonFinite` for a NaN `t` or ν; `OutOfRange` (range `(0, inf]`) for ν ≤ 0. t = ±∞ is
/// allowed (gives 1 or 0).
///
/// # Accuracy
/// Against mpmath at 50 digits (`tests/data/gen_gum.py`: incomplete beta and quadrature of
/// the density): the smaller of P and 1 − P within 1e-13 relative (measured 6.5e-14 over
/// ν = 0.7…10⁷ and ∞, t = 0.05…40; `tests/gum_reference.rs`). Far in a tail the problem
/// itself is ill-conditioned (relative condition number ≈ t² for the normal).
///
/// # Examples
/// ```
/// use quantaband::thermometry::student_t::student_t_cdf;
/// // ν = 1 is the Cauchy distribution: P(T ≤ 1) = 1/2 + arctan(1)/π = 3/4
/// assert!((student_t_cdf(1.0, 1.0).unwrap() - 0.75).abs() < 1e-15);
/// assert_eq!(student_t_cdf(0.0, 7.0).unwrap(), 0.5);
/// ```
///
/// # References
/// Abramowitz & Stegun (1964) 26.7.1, 26.5.27; Press et al., *Numerical Recipes* 3rd ed.
/// (2007) §6.4.
pub fn student_t_cdf(t: f64, degrees_of_freedom: f64) -> Result<f64> {
    if t.is_nan() {
        return Err(Error::NonFinite { arg: "t", value: t });
    }
    let nu = check_degrees_of_freedom("degrees_of_freedom", degrees_of_freedom)?;
    let q = upper_tail(t.abs(), nu);
    Ok(if t < 0.0 { q } else { 1.0 - q })
}

/// The t value with upper-tail probability `q` ∈ (0, ½] (t ≥ 0), by safeguarded Newton in ln t.
pub(crate) fn upper_quantile(q: f64, nu: f64) -> Result<f64> {
    if q >= 0.5 {
        return Ok(0.0);
    }
    let target = ln(q);
    // Bracket on t: Q(lo) > q ≥ Q(hi); 0 and ∞ until seen.
    let mut lo = 0.0f64;
    let mut hi = f64::INFINITY;
    let mut t: f64 = 2.0;
    for _ in 0..400 {
        let tail = upper_tail(t, nu);
        if !(tail > 0.0) {
            // Underflow: far beyond the root.
            hi = hi.min(t);
            // √lo·√t: lo·t can overflow for heavy tails (ν ≤ 2, tiny q).
            t = if lo > 0.0 {
                sqrt(lo) * sqrt(t)
            } else {
                0.5 * t
            };
            continue;
        }
        let g = ln(tail) - target;
        if g == 0.0 {
            return Ok(t);
        }
        if g > 0.0 {
            lo = t;
        } else {
            hi = t;
        }
        // d ln Q / d ln t = −t·f(t)/Q(t); where f(t) underflows (t far out in the tail) its
        // limit, the power-law exponent −ν of Q ∝ t^(−ν).
        let mut slope = -t * density(t, nu) / tail;
        let power_law = !(slope < 0.0);
        if power_law {
            slope = -nu;
        }
        let mut next = t * exp(-g / slope);
        if power_law && hi.is_infinite() && next.is_infinite() {
            // Q ∝ t^(−ν) this far out: the root lies beyond the largest f64.
            return Ok(f64::INFINITY);
        }
        if !(next > lo && next < hi) {
            next = if hi.is_infinite() {
                4.0 * t
            } else if lo == 0.0 {
                0.25 * t
            } else {
                // √lo·√hi: lo·hi overflows for quantiles beyond 1e154 (the density there may
                // underflow, so this bisection in ln t is what converges).
                sqrt(lo) * sqrt(hi)
            };
        }
        if !next.is_finite() {
            if t < f64::MAX {
                next = f64::MAX;
            } else {
                // Quantile beyond the largest f64 (tiny ν with a small tail probability).
                return Ok(f64::INFINITY);
            }
        }
        if (next - t).abs() <= 4e-16 * t || (hi.is_finite() && hi - lo <= 4e-16 * hi) {
            return Ok(next);
        }
        t = next;
    }
    Err(Error::NotConverged {
        what: "Student's t quantile",
    })
}

/// Quantile of Student's t: the t with P(T ≤ t) = `probability` ∈ (0, 1), for
/// `degrees_of_freedom` ν > 0 (non-integer and +∞ allowed; ∞ is the standard normal).
///
/// # Formula
/// ```text
/// t_P(ν) = F⁻¹(P; ν),   F(t; ν) = P(T ≤ t)   (student_t_cdf);   t_{1−P} = −t_P
/// ```
///
/// # Errors
/// `NonFinite` for NaN; `OutOfRange` for `probability` outside (0, 1) or ν ≤ 0 (range
/// `(0, inf]`); `NotConverged` if the safeguarded Newton iteration fails (seen only for ν < 1
/// with a tail probability far below 1e-100, where the quantile is beyond the f64 range).
/// A quantile beyond the f64 range is otherwise returned as ±∞.
///
/// # Accuracy
/// Against mpmath at 50 digits (`findroot` on the incomplete beta function, confirmed by
/// quadrature of the density, `tests/data/gen_gum.py`): within 5e-14 relative (measured
/// 1.2e-14) for ν = 0.5…10⁹ and ∞ and two-sided probabilities 0.6827…0.999999
/// (`tests/gum_reference.rs`). JCGM 100 Table G.2 (from memory) agrees to its printed digits.
///
/// # Examples
/// ```
/// use quantaband::thermometry::student_t::student_t_quantile;
/// // ν = 1 (Cauchy): t_0.975 = tan(0.475π) = 12.706 204 736 174 7…
/// let t = student_t_quantile(0.975, 1.0).unwrap();
/// assert!((t - 12.706_204_736_174_7).abs() < 1e-11);
/// // ν = ∞: the normal quantile 1.959 963 984 540 054
/// let z = student_t_quantile(0.975, f64::INFINITY).unwrap();
/// assert!((z - 1.959_963_984_540_054).abs() < 1e-14);
/// ```
///
/// # References
/// Abramowitz & Stegun (1964) 26.7; Press et al., *Numerical Recipes* 3rd ed. (2007) §6.14.
pub fn student_t_quantile(probability: f64, degrees_of_freedom: f64) -> Result<f64> {
    crate::error::finite("probability", probability)?;
    if !(probability > 0.0 && probability < 1.0) {
        return Err(Error::OutOfRange {
            arg: "probability",
            value: probability,
            range: "(0, 1)",
        });
    }
    let nu = check_degrees_of_freedom("degrees_of_freedom", degrees_of_freedom)?;
    if probability >= 0.5 {
        upper_quantile(1.0 - probability, nu)
    } else {
        Ok(-upper_quantile(probability, nu)?)
    }
}

/// Coverage factor k_p = t_{(1+p)/2}(ν) for a symmetric coverage interval with coverage
/// probability `coverage_probability` p ∈ (0, 1) and `degrees_of_freedom` ν (> 0, +∞ allowed,
/// giving the normal-distribution factor, e.g. 1.960 for p = 0.95).
///
/// # Formula
/// ```text
/// k_p(ν) = t such that P(−t ≤ T ≤ t) = p,   i.e. Q(t; ν) = (1 − p)/2
/// ```
///
/// # Errors
/// `NonFinite`; `OutOfRange` for p outside (0, 1) or ν ≤ 0; as [`student_t_quantile`]
/// (`NotConverged`, or +∞ for a factor beyond the f64 range: ν far below 1 with p near 1).
///
/// # Accuracy
/// As [`student_t_quantile`] (the tail probability (1 − p)/2 is formed exactly).
///
/// # Examples
/// ```
/// use quantaband::thermometry::student_t::coverage_factor;
/// // JCGM 100:2008 Table G.2 (from memory): t_95(10) = 2.23, t_99(16) = 2.92, t_95.45(∞) = 2.00
/// assert_eq!((coverage_factor(0.95, 10.0).unwrap() * 100.0).round() / 100.0, 2.23);
/// assert_eq!((coverage_factor(0.99, 16.0).unwrap() * 100.0).round() / 100.0, 2.92);
/// assert_eq!((coverage_factor(0.9545, f64::INFINITY).unwrap() * 100.0).round() / 100.0, 2.0);
/// ```
///
/// # References
/// JCGM 100:2008 §6.3.3 and G.3.4 (eq. G.1c), Table G.2.
pub fn coverage_factor(coverage_probability: f64, degrees_of_freedom: f64) -> Result<f64> {
    check_coverage_probability(coverage_probability)?;
    let nu = check_degrees_of_freedom("degrees_of_freedom", degrees_of_freedom)?;
    upper_quantile(0.5 * (1.0 - coverage_probability), nu)
}

/// Checks a coverage probability: finite and in (0, 1).
pub(crate) fn check_coverage_probability(p: f64) -> Result<f64> {
    crate::error::finite("coverage_probability", p)?;
    if p > 0.0 && p < 1.0 {
        Ok(p)
    } else {
        Err(Error::OutOfRange {
            arg: "coverage_probability",
            value: p,
            range: "(0, 1)",
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn cauchy_and_two_degrees_closed_forms() {
        // ν = 1: F(t) = 1/2 + atan(t)/π; ν = 2: F(t) = 1/2 + t/(2√(2 + t²)) (A&S 26.7.3/26.7.4).
        for &t in &[0.1f64, 0.5, 1.0, 3.0, 20.0] {
            let c1 = 0.5 + t.atan() / core::f64::consts::PI;
            assert!((student_t_cdf(t, 1.0).unwrap() - c1).abs() < 2e-16 * 4.0);
            let c2 = 0.5 + t / (2.0 * (2.0 + t * t).sqrt());
            assert!((student_t_cdf(t, 2.0).unwrap() - c2).abs() < 2e-16 * 4.0);
        }
    }

    #[test]
    fn quantile_inverts_cdf() {
        for &nu in &[0.7, 1.0, 3.0, 12.5, 1e3, 1e8] {
            for &p in &[0.55, 0.9, 0.975, 0.9995] {
                let t = student_t_quantile(p, nu).unwrap();
                let back = student_t_cdf(t, nu).unwrap();
                assert!(
                    ((1.0 - back) / (1.0 - p) - 1.0).abs() < 1e-12,
                    "{nu} {p} {t} {back}"
                );
                assert_eq!(student_t_quantile(1.0 - p, nu).unwrap(), -t);
            }
        }
    }

    #[test]
    fn far_tail_quantiles_stay_finite_until_they_overflow() {
        // Closed forms (A&S 26.7.3, 26.7.4): ν = 1, t_p = −cot(πp) = −1/(πp)·(1 − (πp)²/3 …);
        // ν = 2, t_p = (2p − 1)/√(2p(1 − p)). Far beyond the f64 range of t² and of the
        // density, short of the overflow of t itself.
        for &p in &[1e-100, 1e-200, 1e-300] {
            let t1 = student_t_quantile(p, 1.0).unwrap();
            let want1 = -1.0 / (core::f64::consts::PI * p);
            assert!((t1 / want1 - 1.0).abs() < 1e-12, "{p}: {t1} vs {want1}");
            let t2 = student_t_quantile(p, 2.0).unwrap();
            let want2 = (2.0 * p - 1.0) / (2.0 * p * (1.0 - p)).sqrt();
            assert!((t2 / want2 - 1.0).abs() < 1e-12, "{p}: {t2} vs {want2}");
        }
        // −1/(π·1e-309) = −3.2e308 is beyond the largest f64: the quantile overflows to −∞
        assert_eq!(student_t_quantile(1e-309, 1.0).unwrap(), f64::NEG_INFINITY);
    }

    #[test]
    fn symmetry_and_limits() {
        assert_eq!(student_t_quantile(0.5, 3.0).unwrap(), 0.0);
        assert_eq!(student_t_cdf(f64::INFINITY, 3.0).unwrap(), 1.0);
        assert_eq!(student_t_cdf(f64::NEG_INFINITY, 3.0).unwrap(), 0.0);
        let a = student_t_cdf(-1.3, 4.5).unwrap();
        let b = student_t_cdf(1.3, 4.5).unwrap();
        assert!((a + b - 1.0).abs() < 1e-15);
    }
}
