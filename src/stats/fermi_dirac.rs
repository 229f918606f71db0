//! Complete Fermi–Dirac integrals F_j(η) for j = −1/2, 1/2, 3/2 and the inverse of F_{1/2}.
//!
//! # Convention
//! quantaband uses the *normalised* integral (Dingle's convention, the one DLMF §25.12(iii) uses):
//!
//! ```text
//! F_j(η) = 1/Γ(j+1) ∫₀^∞ t^j / (e^{t−η} + 1) dt = −Li_{j+1}(−e^η)
//! ```
//!
//! so that `F_j(η) → e^η` for `η → −∞` and `dF_j/dη = F_{j−1}`. Some semiconductor texts use the
//! unnormalised integral `𝔉_j(η) = ∫₀^∞ t^j/(e^{t−η}+1) dt = Γ(j+1)·F_j(η)`; for j = 1/2 that is
//! `(√π/2)·F_{1/2}`, and the electron density of a parabolic band is `n = N_c·F_{1/2}(η)` with
//! η = (E_F − E_c)/kT in *our* convention (`n = N_c·(2/√π)·𝔉_{1/2}` in theirs).
//!
//! # Method (no allocation; at most ~25 exponentials and 6 complex pole terms per call)
//! - `η ≤ −3`: the alternating polylogarithm series `Σ_{k≥1} (−1)^{k+1} e^{kη}/k^{j+1}`, summed
//!   until the next term is below 1e-17 of the sum (≤ 13 terms; one term for η < −39).
//! - `−3 < η < 37`: with t = u² the integral becomes `∫_ℝ |u|^{2j+1}/(e^{u²−η} + 1) du`
//!   (p = 2j+1 ∈ {0, 2, 4}), an even integrand analytic except for simple poles at
//!   `u² = η + iπ(2m+1)`. The trapezoidal rule with step h = 0.4 is corrected *exactly* for
//!   those poles (their residues are known in closed form):
//!   ```text
//!   ∫ = h Σ_{k∈ℤ} f(kh) − 4π Σ_{m≥0} Im[ s_m^{p−1} · w_m/(1 − w_m) ],
//!   s_m = √(η + iπ(2m+1)),  w_m = e^{2πi s_m/h}
//!   ```
//!   keeping the poles with |w_m| ≥ 1e-18 (at most 6) and the nodes until the terms fall below
//!   1e-18 of the Neumaier-compensated sum (at most 23). The remaining aliasing error of the
//!   Gaussian-like factor is ≈ (π/h)⁴e^{−π²/h²} ≈ 1e-24. The three orders share nodes, Fermi
//!   factors and poles, so the inverse gets F_{1/2} and its derivative F_{−1/2} in one pass.
//! - `η ≥ 37`: the Sommerfeld asymptotic series
//!   `F_j(η) = η^{j+1}/Γ(j+2) · [1 + Σ_{n≥1} 2η(2n)·(j+1)j⋯(j+2−2n)·η^{−2n}]` (η(·) the Dirichlet
//!   eta function). For half-integer j the exponentially small companion term
//!   `cos(πj)·F_j(−η)` vanishes; what remains is the asymptotic remainder, ≈ e^{−η}, which is
//!   below 1e-16 relative from η ≈ 36 on. At most 20 terms (coefficients from mpmath, see
//!   `tables.rs`).
//!
//! The cut-offs were chosen by measuring the error of each method against mpmath on a grid of
//! η (see `tests/stats_reference.rs`).
//!
//! # References
//! - R. B. Dingle, *Asymptotic Expansions: Their Derivation and Interpretation*, Academic Press
//!   (1973), ch. 13 (Sommerfeld-type expansions of Fermi–Dirac functions) (from memory).
//! - NIST DLMF, §25.12(iii) "Fermi–Dirac and Bose–Einstein integrals", eq. 25.12.14–25.12.16 (equation numbers from memory),
//!   <https://dlmf.nist.gov/25.12>.
//! - L. N. Trefethen, J. A. C. Weideman, "The exponentially convergent trapezoidal rule",
//!   SIAM Review 56, 385–458 (2014), doi:10.1137/130932132 (analytic integrands on ℝ; the
//!   contour-integral form of the trapezoidal error used for the pole correction).
//! - The pole-corrected trapezoidal rule for Fermi–Dirac-type integrals goes back to work by
//!   Chiarella & Reichel (Math. Comp. 22, 1968) and was applied to generalised Fermi–Dirac
//!   integrals by Mohankumar & Natarajan (1990s) (both from memory; the correction formula
//!   above was re-derived here and is verified by the mpmath comparison).
//! - J. S. Blakemore, "Approximations for Fermi–Dirac integrals, especially the function
//!   F_{1/2}(η) used to describe electron density in a semiconductor", Solid-State Electronics 25,
//!   1067–1076 (1982), doi:10.1016/0038-1101(82)90143-5.
//! - W. B. Joyce, R. W. Dixon, "Analytic approximations for the Fermi energy of an ideal Fermi
//!   gas", Appl. Phys. Lett. 31, 354–356 (1977), doi:10.1063/1.89697.
#![forbid(unsafe_code)]

use core::f64::consts::{FRAC_2_SQRT_PI, PI};

use super::tables::SOMMERFELD_2ETA;
use crate::error::{self, Error, Result};
use crate::float;

/// The orders j of the complete Fermi–Dirac integral [`fermi_dirac_integral`] supports
/// (dimensionless).
///
/// # Formula
/// ```text
/// j ∈ {−1/2, 1/2, 3/2},   F_j(η) = 1/Γ(j+1) ∫₀^∞ t^j/(e^{t−η}+1) dt
/// ```
///
/// # Errors
/// None: an enum makes unsupported orders unrepresentable ([`FdOrder::from_j`] converts a
/// number and reports `UNSUPPORTED`).
///
/// # Accuracy
/// Exact (a label).
///
/// # Examples
/// ```
/// use quantaband::stats::FdOrder;
/// assert_eq!(FdOrder::MinusHalf.j(), -0.5);
/// ```
///
/// # References
/// - NIST DLMF §25.12(iii), <https://dlmf.nist.gov/25.12>.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum FdOrder {
    /// j = −1/2 (the derivative of F_{1/2}; appears in the Einstein relation and in screening).
    MinusHalf,
    /// j = 1/2 (carrier density of a parabolic band).
    Half,
    /// j = 3/2 (kinetic-energy density of a parabolic band).
    ThreeHalves,
}

impl FdOrder {
    /// The order j as a number: −0.5, 0.5 or 1.5 (dimensionless).
    ///
    /// # Formula
    /// ```text
    /// MinusHalf → −1/2, Half → 1/2, ThreeHalves → 3/2
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact (all three are binary fractions).
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::FdOrder;
    /// assert_eq!(FdOrder::ThreeHalves.j(), 1.5);
    /// ```
    ///
    /// # References
    /// - NIST DLMF §25.12(iii), <https://dlmf.nist.gov/25.12>.
    pub const fn j(self) -> f64 {
        match self {
            FdOrder::MinusHalf => -0.5,
            FdOrder::Half => 0.5,
            FdOrder::ThreeHalves => 1.5,
        }
    }

    /// The order for a numeric j (dimensionless), if it is one of −1/2, 1/2, 3/2.
    ///
    /// # Formula
    /// ```text
    /// −0.5 → MinusHalf, 0.5 → Half, 1.5 → ThreeHalves (exact comparison)
    /// ```
    ///
    /// # Errors
    /// [`Error::Unsupported`] for any other value (including NaN).
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::FdOrder;
    /// assert_eq!(FdOrder::from_j(0.5).unwrap(), FdOrder::Half);
    /// assert!(FdOrder::from_j(1.0).is_err());
    /// ```
    ///
    /// # References
    /// - NIST DLMF §25.12(iii), <https://dlmf.nist.gov/25.12>.
    pub fn from_j(j: f64) -> Result<FdOrder> {
        if j == -0.5 {
            Ok(FdOrder::MinusHalf)
        } else if j == 0.5 {
            Ok(FdOrder::Half)
        } else if j == 1.5 {
            Ok(FdOrder::ThreeHalves)
        } else {
            Err(Error::Unsupported {
                what: "Fermi-Dirac integral order j; supported: -0.5, 0.5, 1.5",
            })
        }
    }

    /// 1/Γ(j+1).
    const fn inv_gamma_j1(self) -> f64 {
        match self {
            FdOrder::MinusHalf => INV_GAMMA_1_2,
            FdOrder::Half => INV_GAMMA_3_2,
            FdOrder::ThreeHalves => INV_GAMMA_5_2,
        }
    }
}

/// 1/Γ(1/2) = 1/√π (correctly rounded; mpmath).
const INV_GAMMA_1_2: f64 = 0.564_189_583_547_756_3;
/// 1/Γ(3/2) = 2/√π.
const INV_GAMMA_3_2: f64 = FRAC_2_SQRT_PI;
/// 1/Γ(5/2) = 4/(3√π) = 0.752 252 778 063 675 0… (mpmath).
const INV_GAMMA_5_2: f64 = 0.752_252_778_063_675;
/// 1/Γ(7/2) = 8/(15√π) = 0.300 901 111 225 470 0… (mpmath).
const INV_GAMMA_7_2: f64 = 0.300_901_111_225_47;

/// Below this η the polylogarithm series is used.
const ETA_SERIES_MAX: f64 = -3.0;
/// From this η on the Sommerfeld asymptotic series is used.
const ETA_ASYMPTOTIC_MIN: f64 = 37.0;
/// Step of the pole-corrected trapezoidal rule in u (t = u²).
const TRAPEZOID_H: f64 = 0.4;

/// k^{j+1} for integer k ≥ 1.
#[inline]
fn k_pow(order: FdOrder, k: f64) -> f64 {
    let r = float::sqrt(k);
    match order {
        FdOrder::MinusHalf => r,
        FdOrder::Half => k * r,
        FdOrder::ThreeHalves => k * k * r,
    }
}

fn fd_series(order: FdOrder, eta: f64) -> f64 {
    let z = float::exp(eta);
    let mut zk = z;
    let mut sum = z;
    let mut k = 1.0;
    // Alternating series with decreasing terms: the error is below the first omitted term.
    while k < 60.0 {
        k += 1.0;
        zk *= z;
        let term = zk / k_pow(order, k);
        if term <= 1e-17 * sum {
            break;
        }
        if (k as u32) % 2 == 0 {
            sum -= term;
        } else {
            sum += term;
        }
    }
    sum
}

/// Neumaier-compensated accumulation of `term` into (`sum`, `comp`).
#[inline]
fn neumaier(sum: &mut f64, comp: &mut f64, term: f64) {
    let t = *sum + term;
    if float::abs(*sum) >= float::abs(term) {
        *comp += (*sum - t) + term;
    } else {
        *comp += (term - t) + *sum;
    }
    *sum = t;
}

/// Trapezoidal rule with pole correction for all three orders at once (they share nodes,
/// Fermi factors and poles): returns [F_{−1/2}, F_{1/2}, F_{3/2}] at η.
fn fd_trapezoid_all(eta: f64) -> [f64; 3] {
    let h = TRAPEZOID_H;
    // Node u = 0 counts once in Σ_{k∈ℤ} (only u⁰ is non-zero there); the rest count twice.
    let mut sum = [0.5 / (1.0 + float::exp(-eta)), 0.0, 0.0];
    let mut comp = [0.0; 3];
    let mut k = 0.0;
    while k < 400.0 {
        k += 1.0;
        let u = k * h;
        let u2 = u * u;
        let a = u2 - eta;
        let fermi = if a < 0.0 {
            1.0 / (1.0 + float::exp(a))
        } else {
            let e = float::exp(-a);
            e / (1.0 + e)
        };
        let terms = [fermi, fermi * u2, fermi * u2 * u2];
        for i in 0..3 {
            neumaier(&mut sum[i], &mut comp[i], terms[i]);
        }
        // u⁴·fermi decays last; once it is negligible so are the others.
        if a > 0.0 && terms[0] < 1e-18 * sum[0] && terms[2] < 1e-18 * sum[2] {
            break;
        }
    }
    let mut total = [0.0; 3];
    for i in 0..3 {
        total[i] = 2.0 * h * (sum[i] + comp[i]);
    }
    // Pole correction: the integrand u^p/(e^{u²−η}+1) has simple poles at u² = η + iπ(2m+1);
    // for each m ≥ 0 the upper-half-plane poles s_m = √(η + iπ(2m+1)) and −conj(s_m) have
    // residue ∓s^{p−1}/2, and the exact error of the trapezoidal sum gives
    //   ∫ = h Σ_k f(kh) − 4π Σ_{m≥0} Im[ s_m^{p−1} w_m/(1 − w_m) ],   w_m = e^{2πi s_m/h}.
    // Poles with |w_m| < 1e-18 are dropped (|w_m| falls as m grows).
    let mut m = 0.0;
    while m < 64.0 {
        let (sr, si) = csqrt_upper(eta, PI * (2.0 * m + 1.0));
        let decay = 2.0 * PI * si / h;
        if decay > 41.5 {
            break;
        }
        let mag = float::exp(-decay);
        // θ = 2π·sr/h, taken in turns so that the range reduction is exact.
        let (sin_t, cos_t) = sin_cos_turns(sr / h);
        let (wr, wi) = (mag * cos_t, mag * sin_t);
        // q = w/(1 − w)
        let (dr, di) = (1.0 - wr, -wi);
        let dd = dr * dr + di * di;
        let (qr, qi) = ((wr * dr + wi * di) / dd, (wi * dr - wr * di) / dd);
        // s^{−1} = conj(s)/|s|², s, s³
        let ss = sr * sr + si * si;
        let inv = (sr / ss, -si / ss);
        let s2 = (sr * sr - si * si, 2.0 * sr * si);
        let s3 = (s2.0 * sr - s2.1 * si, s2.0 * si + s2.1 * sr);
        for (t, pw) in total.iter_mut().zip([inv, (sr, si), s3]) {
            let im = pw.0 * qi + pw.1 * qr;
            *t -= 4.0 * PI * im;
        }
        m += 1.0;
    }
    [
        total[0] * FdOrder::MinusHalf.inv_gamma_j1(),
        total[1] * FdOrder::Half.inv_gamma_j1(),
        total[2] * FdOrder::ThreeHalves.inv_gamma_j1(),
    ]
}

/// (sin 2πt, cos 2πt) for finite t (an angle in turns).
///
/// t − round(t) and the split into quarter turns are exact in f64 (Sterbenz), so only the
/// reduced angle x = 2π·r, |r| ≤ 1/8, is rounded; sin x and cos x then come from their Taylor
/// series in nested (Horner) form through x¹⁷ and x¹⁶, whose first omitted terms are below
/// 2·10⁻¹⁸ relative for |x| ≤ π/4. This avoids the general-purpose sin/cos with their
/// large-argument reduction, which the callers here never need.
pub(crate) fn sin_cos_turns(t: f64) -> (f64, f64) {
    let f = t - float::round(t);
    let q = float::round(4.0 * f);
    let x = 2.0 * PI * (f - 0.25 * q);
    let x2 = x * x;
    let (mut s, mut c) = (1.0, 1.0);
    let mut k = 8.0;
    while k > 0.5 {
        s = 1.0 - x2 / ((2.0 * k) * (2.0 * k + 1.0)) * s;
        c = 1.0 - x2 / ((2.0 * k - 1.0) * (2.0 * k)) * c;
        k -= 1.0;
    }
    s *= x;
    // q ∈ {−2, −1, 0, 1, 2}: the angle is x + q·π/2.
    match (q as i32) & 3 {
        0 => (s, c),
        1 => (c, -s),
        2 => (-s, -c),
        _ => (-c, s),
    }
}

/// Principal square root of a + ib for b > 0, computed without cancellation.
#[inline]
fn csqrt_upper(a: f64, b: f64) -> (f64, f64) {
    let r = float::sqrt(a * a + b * b);
    if a >= 0.0 {
        let re = float::sqrt(0.5 * (r + a));
        (re, b / (2.0 * re))
    } else {
        let im = float::sqrt(0.5 * (r - a));
        (b / (2.0 * im), im)
    }
}

fn fd_trapezoid(order: FdOrder, eta: f64) -> f64 {
    let all = fd_trapezoid_all(eta);
    match order {
        FdOrder::MinusHalf => all[0],
        FdOrder::Half => all[1],
        FdOrder::ThreeHalves => all[2],
    }
}

/// (F_{1/2}(η), F_{−1/2}(η)) sharing the quadrature nodes where that applies.
fn fd_half_and_derivative(eta: f64) -> (f64, f64) {
    if eta > ETA_SERIES_MAX && eta < ETA_ASYMPTOTIC_MIN {
        let all = fd_trapezoid_all(eta);
        (all[1], all[0])
    } else {
        (
            fd_integral_unchecked(FdOrder::Half, eta),
            fd_integral_unchecked(FdOrder::MinusHalf, eta),
        )
    }
}

fn fd_asymptotic(order: FdOrder, eta: f64) -> f64 {
    let j = order.j();
    let inv2 = 1.0 / (eta * eta);
    let mut sum = 1.0;
    let mut p = 1.0;
    let mut q = 1.0;
    for (n, a) in SOMMERFELD_2ETA.iter().enumerate() {
        let n = (n + 1) as f64;
        p *= (j + 3.0 - 2.0 * n) * (j + 2.0 - 2.0 * n);
        q *= inv2;
        let term = a * p * q;
        sum += term;
        if float::abs(term) < 1e-17 * sum {
            break;
        }
    }
    // η^{j+1}/Γ(j+2), written so that it overflows only when the true value does.
    let r = float::sqrt(eta);
    let lead = match order {
        FdOrder::MinusHalf => INV_GAMMA_3_2 * r,
        // 1/Γ < 1 multiplies first: η·√η alone overflows from η ≈ 3.2e205, F_{1/2} only
        // from 3.85e205.
        FdOrder::Half => (INV_GAMMA_5_2 * eta) * r,
        FdOrder::ThreeHalves => (INV_GAMMA_7_2 * eta) * r * eta,
    };
    lead * sum
}

/// F_j(η) for finite η without validation.
pub(crate) fn fd_integral_unchecked(order: FdOrder, eta: f64) -> f64 {
    if eta <= ETA_SERIES_MAX {
        fd_series(order, eta)
    } else if eta < ETA_ASYMPTOTIC_MIN {
        fd_trapezoid(order, eta)
    } else {
        fd_asymptotic(order, eta)
    }
}

/// Complete Fermi–Dirac integral F_j(η) in the normalised convention, for j = −1/2, 1/2, 3/2;
/// `eta` = η = (μ − E₀)/kT is dimensionless, and so is the result.
///
/// # Formula
/// ```text
/// F_j(η) = 1/Γ(j+1) ∫₀^∞ t^j / (e^{t−η} + 1) dt = −Li_{j+1}(−e^η)
/// F_j(η) → e^η (η → −∞),    F_j(η) → η^{j+1}/Γ(j+2) (η → +∞),    dF_j/dη = F_{j−1}
/// ```
/// t = (E − E₀)/kT the reduced kinetic energy, η the reduced chemical potential, Γ the gamma
/// function, Li the polylogarithm. Texts that omit 1/Γ(j+1) use `𝔉_j = Γ(j+1)·F_j`; multiply
/// our value by Γ(j+1) (√π, √π/2, 3√π/4 for j = −1/2, 1/2, 3/2) to get theirs. See the module
/// documentation for the method.
///
/// # Errors
/// [`Error::NonFinite`] if `eta` is NaN or ±∞.
///
/// Underflows to 0 only for η < −745.13 (true value ≈ e^η below the f64 range); overflows to
/// `+∞` only where the true value is above the f64 range: for j = 3/2 from η ≈ 3.24e123, for
/// j = 1/2 from η ≈ 3.85e205 (j = −1/2 never overflows).
///
/// # Accuracy
/// Maximum relative error 6.0e-16 (under 3 ulp) over the 463 rows (≈ 150 values of η in
/// [−700, 1e6] per order, dense around the method cut-offs) of
/// `tests/data/stats_reference.json`, measured against mpmath's `polylog` at 50 digits,
/// cross-checked by mpmath quadrature (`tests/stats_reference.rs`, tolerance 1e-15). Well
/// inside the 1e-12 target for −50 ≤ η ≤ 200.
///
/// # Examples
/// ```
/// use quantaband::stats::{fermi_dirac_integral, FdOrder};
/// // F_{1/2}(0) = (1 − 2^{−1/2})·ζ(3/2) = 0.765147024625407945… (DLMF §25.12 and §25.2,
/// // equation numbers not checked; value from mpmath)
/// let f = fermi_dirac_integral(FdOrder::Half, 0.0).unwrap();
/// assert!((f - 0.765_147_024_625_407_9).abs() < 1e-15);
/// ```
///
/// # References
/// - NIST DLMF §25.12(iii), eq. 25.12.14–25.12.16 (equation numbers from memory), <https://dlmf.nist.gov/25.12>.
/// - J. S. Blakemore, Solid-State Electronics 25, 1067–1076 (1982),
///   doi:10.1016/0038-1101(82)90143-5 (conventions and tables of F_{1/2}).
/// - L. N. Trefethen, J. A. C. Weideman, SIAM Review 56, 385–458 (2014),
///   doi:10.1137/130932132 (trapezoidal rule).
pub fn fermi_dirac_integral(order: FdOrder, eta: f64) -> Result<f64> {
    error::finite("eta", eta)?;
    Ok(fd_integral_unchecked(order, eta))
}

/// Inverse of the normalised F_{1/2}: the reduced chemical potential η (dimensionless) for which
/// F_{1/2}(η) equals `reduced_density` (dimensionless, e.g. n/N_c for a parabolic band).
///
/// # Formula
/// ```text
/// solve F_{1/2}(η) = y  for η,   y = reduced_density > 0
/// ```
/// Newton's method on `ln F_{1/2}(η) − ln y`, whose derivative is `F_{−1/2}(η)/F_{1/2}(η)`.
/// `ln F_{1/2}` is increasing and concave, so after the first step every iterate lies below the
/// root and the iteration converges monotonically from any start. Starting value: the
/// Joyce–Dixon series `η ≈ ln y + y/√8 − 4.95009e-3·y² + 1.48386e-4·y³ − 4.42563e-6·y⁴` (from
/// memory; only a starting value) for y ≤ 8, and the first two Sommerfeld terms
/// `η ≈ x(1 − π²/(12x²))`, `x = (Γ(5/2)·y)^{2/3}`, above. For y ≤ 1e-8 the result is
/// `ln y + y/√8` directly (the next term is below 5e-19).
///
/// # Errors
/// - [`Error::NonFinite`] if `reduced_density` is NaN or ±∞.
/// - [`Error::NonPositive`] if `reduced_density ≤ 0`.
/// - [`Error::NotConverged`] if Newton's method does not settle within 60 steps (not observed
///   in testing; kept so that no input can loop or panic).
///
/// # Accuracy
/// `F_{1/2}(inverse(y))` reproduces y to within 4 ulp plus 2 ulp × |η| (the unavoidable effect of
/// rounding η itself) for y from 1e-300 to 1e300 (`tests/stats_properties.rs`); the η of the
/// mpmath reference rows with −50 ≤ η ≤ 1e6 is recovered to 4.1e-16 (absolute for |η| ≤ 1,
/// relative above; `tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::inverse_fermi_dirac_half;
/// // F_{1/2}(1) = 1.575640776151300230790… (mpmath polylog, 50 digits)
/// let eta = inverse_fermi_dirac_half(1.575_640_776_151_300_2).unwrap();
/// assert!((eta - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - W. B. Joyce, R. W. Dixon, Appl. Phys. Lett. 31, 354–356 (1977), doi:10.1063/1.89697.
/// - J. S. Blakemore, Solid-State Electronics 25, 1067–1076 (1982),
///   doi:10.1016/0038-1101(82)90143-5.
pub fn inverse_fermi_dirac_half(reduced_density: f64) -> Result<f64> {
    let y = error::positive("reduced_density", reduced_density)?;
    const A1: f64 = 0.353_553_390_593_273_8; // 1/√8
    if y <= 1e-8 {
        return Ok(float::ln(y) + A1 * y);
    }
    let ln_y = float::ln(y);
    let mut eta = if y <= 8.0 {
        ln_y + y * (A1 + y * (-4.950_09e-3 + y * (1.483_86e-4 - y * 4.425_63e-6)))
    } else {
        // Γ(5/2)^{2/3} · y^{2/3}, kept separate so that y near f64::MAX does not overflow.
        const GAMMA_5_2_POW_2_3: f64 = 1.208_993_965_512_352_2; // (3√π/4)^{2/3}
                                                                // y^{2/3} = exp(⅔·ln y): a starting guess only, and it spares the module the general
                                                                // power function.
        let x = GAMMA_5_2_POW_2_3 * float::exp(ln_y * (2.0 / 3.0));
        x * (1.0 - PI * PI / (12.0 * x * x))
    };
    let mut prev_step = f64::INFINITY;
    for _ in 0..60 {
        let (f, df) = fd_half_and_derivative(eta);
        // Far from the root: Newton on ln F (globally convergent, see above). Close to it:
        // Newton on F itself, whose residual f − y loses no digits to the logarithms.
        let step = if float::abs(f - y) < 0.5 * y {
            (f - y) / df
        } else {
            (float::ln(f) - ln_y) * (f / df)
        };
        if !step.is_finite() {
            break;
        }
        eta -= step;
        let scale = float::abs(eta).max(1.0);
        // Converged, or at the rounding-noise floor of F (quadratic convergence has stopped
        // and the step is already tiny).
        if float::abs(step) <= 4.0 * f64::EPSILON * scale
            || (float::abs(step) >= 0.5 * prev_step && float::abs(step) <= 1e-12 * scale)
        {
            return Ok(eta);
        }
        prev_step = float::abs(step);
    }
    Err(Error::NotConverged {
        what: "Newton iteration for the inverse of F_1/2",
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The three methods agree where their ranges meet (continuity across the cut-offs).
    #[test]
    fn methods_agree_at_cutoffs() {
        for order in [FdOrder::MinusHalf, FdOrder::Half, FdOrder::ThreeHalves] {
            let a = fd_series(order, -3.0);
            let b = fd_trapezoid(order, -3.0);
            assert!((a / b - 1.0).abs() < 1e-15, "{order:?}: {a} vs {b}");
            let c = fd_trapezoid(order, 37.0);
            let d = fd_asymptotic(order, 37.0);
            assert!((c / d - 1.0).abs() < 1e-15, "{order:?}: {c} vs {d}");
        }
    }

    #[test]
    fn sin_cos_turns_matches_std() {
        // Reference: the platform's sin/cos (std), common practice, no source.
        let mut t = -3.7;
        while t < 3.7 {
            let (s, c) = sin_cos_turns(t);
            let a = 2.0 * PI * t;
            assert!((s - a.sin()).abs() < 4e-15, "sin at t = {t}");
            assert!((c - a.cos()).abs() < 4e-15, "cos at t = {t}");
            t += 0.0137;
        }
        assert_eq!(sin_cos_turns(0.0), (0.0, 1.0));
        let (s, c) = sin_cos_turns(0.25);
        assert!((s - 1.0).abs() < 1e-16 && c.abs() < 1e-16);
    }

    #[test]
    fn from_j_rejects_nan() {
        assert!(FdOrder::from_j(f64::NAN).is_err());
    }

    #[test]
    fn inverse_rejects_bad_input() {
        assert!(matches!(
            inverse_fermi_dirac_half(0.0),
            Err(Error::NonPositive { .. })
        ));
        assert!(matches!(
            inverse_fermi_dirac_half(f64::INFINITY),
            Err(Error::NonFinite { .. })
        ));
    }
}
