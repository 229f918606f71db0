//! Band (spectrally integrated) Planck quantities, band fractions and their inverse, computed
//! exactly — no sampled quadrature of a wide band.
//!
//! # Reduction to four dimensionless integrals
//!
//! With the reduced variable x = c₂/(λT) = c₂σ̃/T = c₂ν/(c₀T) every band of a [`Spectrum`] is a
//! prefactor times one of four integrals over [x_a, x_b] (for wavelength bands x_a comes from
//! the *upper* wavelength):
//!
//! ```text
//! energy          ∫ x³/(eˣ−1) dx          × ε n² g · 2hc² (T/c₂)⁴       total π⁴/15
//! photon          ∫ x²/(eˣ−1) dx          × ε n² g · 2c   (T/c₂)³       total 2ζ(3)
//! energy ∂/∂T     ∫ x⁴eˣ/(eˣ−1)² dx       × ε n² g · 2hc² (T/c₂)⁴ / T    total 4π⁴/15
//! photon ∂/∂T     ∫ x³eˣ/(eˣ−1)² dx       × ε n² g · 2c   (T/c₂)³ / T    total 6ζ(3)
//! g = 1 (radiance) or π (exitance)
//! ```
//!
//! The same prefactor holds for all three spectral variables (substitute λ = c₂/(xT),
//! σ̃ = xT/c₂, ν = c₀xT/c₂). The derivative kernels follow from ∂/∂T (eˣ−1)⁻¹ = x eˣ/(eˣ−1)²/T.
//!
//! # Evaluation of the integrals
//!
//! - **Upper tail**, x ≥ 2 (`SPLIT`): the exponential series of Widger & Woodall (1976),
//!   `∫ₓ^∞ tⁿ/(eᵗ−1) dt = Σₖ e^{−kx} Σⱼ n!/(n−j)! x^{n−j}/k^{j+1}`, K terms with K·x ≥ 37.6
//!   (remainder below 2.8e-17 of the sum; at most 20 terms), two interleaved partial sums
//!   (both ends of a band in one loop). The factor e^{−x} is kept separate, so far-tail
//!   values keep full *relative* accuracy and even values below the f64 range can be multiplied
//!   by a large prefactor without loss. For the derivative kernels integration by parts gives
//!   `∫ₓ^∞ t^m eᵗ/(eᵗ−1)² dt = xᵐ/(eˣ−1) + m ∫ₓ^∞ t^{m−1}/(eᵗ−1) dt` (all terms positive).
//! - **Lower head**, x ≤ 2: the Bernoulli expansion `t/(eᵗ−1) = Σ B_j t^j/j!` integrated term by
//!   term, `∫₀ˣ tⁿ/(eᵗ−1) dt = xⁿ[1/n − x/(2(n+1)) + Σₖ B₂ₖ x^{2k}/((2k)!(2k+n))]`, and for the
//!   derivative kernels `∫₀ˣ t^m eᵗ/(eᵗ−1)² dt = x^{m−1}[1/(m−1) − Σₖ (2k−1)B₂ₖ x^{2k}/((2k)!(2k+m−1))]`
//!   (from `t²eᵗ/(eᵗ−1)² = 1 − Σₖ (2k−1)B₂ₖ t^{2k}/(2k)!`). 18 terms (radius of convergence 2π;
//!   at x = 2 the last term is below 1e-18 of the first).
//! - A band is the difference of two tails (both limits ≥ 2), of two heads (both ≤ 2), or
//!   total − head(x_a) − tail(x_b) (limits straddle 2). Outside the narrow-band region below,
//!   these differences lose at most about 4 bits (condition number ≤ ~30, worst near x = 2).
//! - **Narrow bands**: when the half-width h and the centre c of [x_a, x_b] satisfy
//!   `h ≤ 0.5 and h ≤ c/8`, the band is integrated with a fixed 16-point Gauss–Legendre rule
//!   in the *original* spectral variable (so that the width of a very narrow band is exact and
//!   relative accuracy is kept). The integrand is analytic in a Bernstein ellipse around the
//!   interval with ρ ≥ 4.2 (its only singularities are at x = 2πik, k ≠ 0, and the mapping
//!   to λ has its pole at λ = 0, more than 4 half-widths away); the classical bound
//!   `|E| ≤ (64/15)·M·ρ^{−2N}/(ρ²−1)` with N = 16 and the variation M/min ≤ 30 of the integrand on
//!   that ellipse gives a relative truncation error below 1e-19, so rounding (≈1e-16) dominates.
//!   The exponential factor is taken as e^{−x_a}·e^{−d} with d computed from each node's
//!   intended offset from the band ends, so the rule is not shifted by the rounding of its
//!   centre (which would cost x·1.1e-16 at large x).
//!
//! Measured against mpmath (40 digits, `tests/data/gen_core.py`): see the `# Accuracy` sections.
//!
//! # References
//! - W. K. Widger Jr., M. P. Woodall, "Integration of the Planck blackbody radiation function",
//!   Bull. Amer. Meteor. Soc. 57(10), 1217–1219 (1976),
//!   doi:10.1175/1520-0477(1976)057<1217:IOTPBR>2.0.CO;2.
//! - M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions (1964), 23.1.1 (Bernoulli
//!   numbers), 25.4.29–30 (Gauss–Legendre).
//! - L. N. Trefethen, "Is Gauss quadrature better than Clenshaw–Curtis?", SIAM Rev. 50(1),
//!   67–87 (2008), doi:10.1137/060659831 (Theorem 4.5, error bound for analytic integrands).
#![forbid(unsafe_code)]

use crate::constants::{C2, SPEED_OF_LIGHT_C};
use crate::error::{self, Error, Result};
use crate::float;
use crate::planck::{
    ln_expm1, ln_one_minus_exp_neg, Quantity, SpectralVariable, Spectrum, PI4_OVER_15, TWO_ZETA_3,
};

/// Boundary between the head (Bernoulli) and tail (exponential) series.
const SPLIT: f64 = 2.0;
/// Number of Bernoulli terms in the head series.
const NB: usize = 18;

/// B₂ₖ/(2k)! for k = 1…18 (mpmath, 50 digits, rounded to f64).
const BERN: [f64; NB] = [
    0.083_333_333_333_333_33,
    -0.001_388_888_888_888_889,
    3.306_878_306_878_307e-5,
    -8.267_195_767_195_768e-7,
    2.087_675_698_786_81e-8,
    -5.284_190_138_687_493e-10,
    1.338_253_653_068_467_9e-11,
    -3.389_680_296_322_582_7e-13,
    8.586_062_056_277_845e-15,
    -2.174_868_698_558_062e-16,
    5.509_002_828_360_229_5e-18,
    -1.395_446_468_581_252_2e-19,
    3.534_707_039_629_467e-21,
    -8.953_517_427_037_546e-23,
    2.267_952_452_337_683e-24,
    -5.744_790_668_872_202e-26,
    1.455_172_475_614_865e-27,
    -3.685_994_940_665_310_3e-29,
];

/// Head-series coefficient tables, built at compile time (a macro rather than a `const fn`
/// so that float arithmetic stays in const items):
/// `head_table!(j, n)`: B₂ₖ/((2k)!(2k+n)) for ∫₀ˣ tⁿ/(eᵗ−1);
/// `head_table!(d, m)`: −(2k−1)B₂ₖ/((2k)!(2k+m−1)) for ∫₀ˣ tᵐeᵗ/(eᵗ−1)².
macro_rules! head_table {
    (j, $n:expr) => {{
        let mut t = [0.0; NB];
        let mut k = 0;
        while k < NB {
            t[k] = BERN[k] / (2.0 * (k as f64 + 1.0) + $n);
            k += 1;
        }
        t
    }};
    (d, $m:expr) => {{
        let mut t = [0.0; NB];
        let mut k = 0;
        while k < NB {
            let kk = k as f64 + 1.0;
            t[k] = -(2.0 * kk - 1.0) * BERN[k] / (2.0 * kk + $m - 1.0);
            k += 1;
        }
        t
    }};
}

const HEAD_J2: [f64; NB] = head_table!(j, 2.0);
const HEAD_J3: [f64; NB] = head_table!(j, 3.0);
const HEAD_D3: [f64; NB] = head_table!(d, 3.0);
const HEAD_D4: [f64; NB] = head_table!(d, 4.0);

/// 1/k for k = 1…24.
const INV_K: [f64; 24] = {
    let mut t = [0.0; 24];
    let mut k = 0;
    while k < 24 {
        t[k] = 1.0 / (k as f64 + 1.0);
        k += 1;
    }
    t
};

/// Positive nodes and weights of the 16-point Gauss–Legendre rule on [−1, 1]
/// (mpmath, 50 digits, rounded to f64; Abramowitz & Stegun Table 25.4 lists them to 15 digits).
const GL16: [(f64, f64); 8] = [
    (0.095_012_509_837_637_44, 0.189_450_610_455_068_5),
    (0.281_603_550_779_258_9, 0.182_603_415_044_923_58),
    (0.458_016_777_657_227_37, 0.169_156_519_395_002_54),
    (0.617_876_244_402_643_8, 0.149_595_988_816_576_74),
    (0.755_404_408_355_003, 0.124_628_971_255_533_88),
    (0.865_631_202_387_831_8, 0.095_158_511_682_492_79),
    (0.944_575_023_073_232_6, 0.062_253_523_938_647_894),
    (0.989_400_934_991_649_9, 0.027_152_459_411_754_096),
];

/// One of the four dimensionless Planck integrands (functions of the reduced variable
/// x = c₂/(λT), dimensionless), integrated by [`planck_integral`] and friends.
///
/// # Examples
/// ```
/// use quantaband::band::{planck_integral_lower, PlanckKernel};
/// // Up to x = 200 the integral equals its total π⁴/15 to far below 1 ulp (the rest is
/// // ~200³e⁻²⁰⁰); Abramowitz & Stegun 23.2.7 with ζ(4) = π⁴/90.
/// let all = planck_integral_lower(PlanckKernel::Energy, 200.0).unwrap();
/// assert!((all / 6.493_939_402_266_829 - 1.0).abs() < 1e-15);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum PlanckKernel {
    /// x²/(eˣ − 1): photon quantities. ∫₀^∞ = 2ζ(3).
    Photon,
    /// x³/(eˣ − 1): energy quantities. ∫₀^∞ = π⁴/15.
    Energy,
    /// x³eˣ/(eˣ − 1)²: ∂/∂T of photon quantities. ∫₀^∞ = 6ζ(3).
    PhotonDerivative,
    /// x⁴eˣ/(eˣ − 1)²: ∂/∂T of energy quantities. ∫₀^∞ = 4π⁴/15.
    EnergyDerivative,
}

impl PlanckKernel {
    /// ∫₀^∞ of the kernel (dimensionless): 2ζ(3), π⁴/15, 6ζ(3) or 4π⁴/15.
    ///
    /// # Formula
    /// ```text
    /// ∫₀^∞ xⁿ/(eˣ−1) dx = n! ζ(n+1);  ∫₀^∞ xᵐeˣ/(eˣ−1)² dx = m! ζ(m)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// The f64 nearest to the exact value (π⁴/15 and 2ζ(3) from mpmath); the derivative totals
    /// are exact multiples (×4, ×3).
    ///
    /// # Examples
    /// ```
    /// use quantaband::band::PlanckKernel;
    /// // π⁴/15 = 6.493 939 402 266 829 … (Abramowitz & Stegun 23.2.24 with ζ(4) = π⁴/90).
    /// assert!((PlanckKernel::Energy.total() - 6.493_939_402_266_829).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Abramowitz & Stegun (1964), 23.2.7 and 23.2.24 (ζ(n) and its integral representation).
    pub const fn total(self) -> f64 {
        match self {
            PlanckKernel::Photon => TWO_ZETA_3,
            PlanckKernel::Energy => PI4_OVER_15,
            PlanckKernel::PhotonDerivative => 3.0 * TWO_ZETA_3,
            PlanckKernel::EnergyDerivative => 4.0 * PI4_OVER_15,
        }
    }

    /// The power of x in front of the head-series bracket.
    const fn head_power(self) -> i32 {
        match self {
            PlanckKernel::Photon => 2,
            PlanckKernel::Energy => 3,
            PlanckKernel::PhotonDerivative => 2,
            PlanckKernel::EnergyDerivative => 3,
        }
    }

    fn of(quantity: Quantity, d_dt: bool) -> Self {
        match (quantity, d_dt) {
            (Quantity::Energy, false) => PlanckKernel::Energy,
            (Quantity::Photon, false) => PlanckKernel::Photon,
            (Quantity::Energy, true) => PlanckKernel::EnergyDerivative,
            (Quantity::Photon, true) => PlanckKernel::PhotonDerivative,
        }
    }

    /// The integrand at x divided by e^{−(x − d)}: e^{−d}·(xⁿ or xᵐ)/(1 − e^{−x})^{1 or 2}
    /// (x > 0 moderate, d ≥ 0 the offset of x from the reference point x − d).
    #[inline]
    fn eval_shifted(self, x: f64, d: f64) -> f64 {
        let ed = float::exp(-d);
        let one_minus = -float::expm1(-x);
        match self {
            PlanckKernel::Photon => x * x * ed / one_minus,
            PlanckKernel::Energy => x * x * x * ed / one_minus,
            PlanckKernel::PhotonDerivative => x * x * x * ed / (one_minus * one_minus),
            PlanckKernel::EnergyDerivative => x * x * x * x * ed / (one_minus * one_minus),
        }
    }

    /// ln of the integrand at x, for any x ≥ 0 given with its logarithm.
    fn ln_eval(self, x: f64, lnx: f64) -> f64 {
        match self {
            PlanckKernel::Photon => 2.0 * lnx - ln_expm1(x, lnx),
            PlanckKernel::Energy => 3.0 * lnx - ln_expm1(x, lnx),
            PlanckKernel::PhotonDerivative => {
                3.0 * lnx - ln_expm1(x, lnx) - ln_one_minus_exp_neg(x, lnx)
            }
            PlanckKernel::EnergyDerivative => {
                4.0 * lnx - ln_expm1(x, lnx) - ln_one_minus_exp_neg(x, lnx)
            }
        }
    }
}

/// A value m · f with f = eᵉ kept apart (f may under/overflow; e is its exact logarithm).
#[derive(Clone, Copy, Debug)]
struct Sc {
    m: f64,
    f: f64,
    /// ln f, or NaN when it is to be computed on demand as `lazy_pw · ln(lazy_x)`.
    e: f64,
    lazy_pw: i32,
    lazy_x: f64,
}

impl Sc {
    const fn plain(m: f64) -> Self {
        Sc::new(m, 1.0, 0.0)
    }
    const fn new(m: f64, f: f64, e: f64) -> Self {
        Sc {
            m,
            f,
            e,
            lazy_pw: 0,
            lazy_x: 1.0,
        }
    }
    /// ln f.
    fn e(&self) -> f64 {
        if self.e.is_nan() {
            f64::from(self.lazy_pw) * float::ln(self.lazy_x)
        } else {
            self.e
        }
    }
    fn value(self) -> f64 {
        if self.m <= 0.0 {
            0.0
        } else if self.f.is_normal() && (self.m * self.f).is_normal() {
            self.m * self.f
        } else {
            self.m * float::exp_fast(self.e())
        }
    }
    /// ln(m·f); −∞ when the value is 0.
    fn ln(self) -> f64 {
        if self.m <= 0.0 {
            f64::NEG_INFINITY
        } else if self.f.is_normal() && (self.m * self.f).is_normal() {
            float::ln(self.m * self.f)
        } else {
            float::ln(self.m) + self.e()
        }
    }
}

/// ∫₀ˣ (head series), valid for 0 ≤ x ≤ SPLIT.
fn head(kind: PlanckKernel, x: f64, lnx: f64) -> Sc {
    let y = x * x;
    let (table, lead) = match kind {
        PlanckKernel::Photon => (&HEAD_J2, 0.5 - x / 6.0),
        PlanckKernel::Energy => (&HEAD_J3, 1.0 / 3.0 - x / 8.0),
        PlanckKernel::PhotonDerivative => (&HEAD_D3, 0.5),
        PlanckKernel::EnergyDerivative => (&HEAD_D4, 1.0 / 3.0),
    };
    let mut s = 0.0;
    for &c in table.iter().rev() {
        s = s * y + c;
    }
    let pw = kind.head_power();
    let m = s * y + lead;
    let f = float::powi(x, pw);
    if lnx.is_nan() {
        Sc {
            m,
            f,
            e: f64::NAN,
            lazy_pw: pw,
            lazy_x: x,
        }
    } else {
        Sc::new(m, f, f64::from(pw) * lnx)
    }
}

/// Number of tail-series terms at x ≥ SPLIT: K with K·x ≥ 37.6 (the least such K, or one more
/// when 37.6/x is a whole number), rounded up to even.
///
/// Term k is e^{−(k−1)x}·p_k(x) with p_k ≤ p_1/k, so the remainder after K terms is at most
/// p_1·e^{−Kx}/((K+1)(1 − e^{−x})) ≤ p_1·e^{−37.6}·1.16/2 < 2.8e-17·p_1 (x ≥ 2, K ≥ 1): below
/// a quarter of the unit roundoff 2⁻⁵³ relative to the sum.
#[inline]
fn tail_terms(x: f64) -> usize {
    let terms = if x >= 37.6 {
        1
    } else {
        (37.6 / x) as usize + 1
    };
    (terms + (terms & 1)).min(INV_K.len())
}

/// e^x · ∫ₓ^∞ tⁿ/(eᵗ−1) dt for n = 3 (`n3`) or 2 (x ≥ SPLIT, finite), given r = e^{−x}, with
/// `terms` terms (even), on one `f64` or on lanes (both ends of a band at once).
///
/// Term k is e^{−(k−1)x} Σⱼ n!/(n−j)! x^{n−j}/k^{j+1}, summed as two interleaved sums (odd and
/// even k, the power of r stepping by r²), so independent recurrences run side by side instead
/// of one chain of dependent multiply–adds: the loop is bound by latency, not by arithmetic.
/// Every lane runs the same operations in the same order as the `f64` form.
#[inline(always)]
fn tail_poly_j<L: float::Lanes>(n3: bool, x: L, r: L, terms: usize) -> L {
    let s = L::splat;
    // One loop per n (the branch stays out of the loop).
    if n3 {
        let (x3, c3x2, c6x) = (x.mul(x).mul(x), s(3.0).mul(x).mul(x), s(6.0).mul(x));
        tail_series(r, terms, |ik| {
            let i = s(ik);
            i.mul(x3.add(i.mul(c3x2.add(i.mul(c6x.add(s(6.0 * ik)))))))
        })
    } else {
        let (x2, c2x) = (x.mul(x), s(2.0).mul(x));
        tail_series(r, terms, |ik| {
            let i = s(ik);
            i.mul(x2.add(i.mul(c2x.add(s(2.0 * ik)))))
        })
    }
}

/// Σₖ r^{k−1}·term(1/k) for k = 1…`terms` (even), as the sums over odd and even k.
#[inline(always)]
fn tail_series<L: float::Lanes>(r: L, terms: usize, term: impl Fn(f64) -> L) -> L {
    let s = L::splat;
    let r2 = r.mul(r);
    let (mut even, mut odd) = (s(1.0), r);
    let (mut s0, mut s1) = (s(0.0), s(0.0));
    for ik in INV_K.chunks_exact(2).take(terms / 2) {
        s0 = s0.add(even.mul(term(ik[0])));
        s1 = s1.add(odd.mul(term(ik[1])));
        even = even.mul(r2);
        odd = odd.mul(r2);
    }
    s0.add(s1)
}

/// [`tail_poly_j`] at two points a and b in one loop, with the terms the smaller point needs
/// (more than enough for the other): the two lanes of a simd128 vector on wasm32, a pair of
/// `f64` (which the compiler vectorises) elsewhere.
fn tail_poly_j_pair(n3: bool, a: f64, ra: f64, b: f64, rb: f64, terms: usize) -> (f64, f64) {
    #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
    {
        use core::arch::wasm32::{f64x2, f64x2_extract_lane};
        let v = tail_poly_j(
            n3,
            float::F64x2(f64x2(a, b)),
            float::F64x2(f64x2(ra, rb)),
            terms,
        );
        (f64x2_extract_lane::<0>(v.0), f64x2_extract_lane::<1>(v.0))
    }
    #[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
    {
        let [ja, jb] = tail_poly_j(n3, [a, b], [ra, rb], terms);
        (ja, jb)
    }
}

/// e^x · ∫ₓ^∞ of the kernel (SPLIT ≤ x ≤ 1e4) from `j` = e^x · ∫ₓ^∞ tⁿ/(eᵗ−1) dt of the
/// kernel's n, and r = e^{−x}: the derivative kernels by parts (module docs).
#[inline]
fn tail_from_j(kind: PlanckKernel, x: f64, r: f64, j: f64) -> f64 {
    match kind {
        PlanckKernel::Photon | PlanckKernel::Energy => j,
        PlanckKernel::PhotonDerivative => x * x * x / (1.0 - r) + 3.0 * j,
        PlanckKernel::EnergyDerivative => x * x * x * x / (1.0 - r) + 4.0 * j,
    }
}

/// (eᵖ, e^q) by [`float::exp_fast`]; on wasm32 with simd128 both at once on the two lanes of a
/// vector when both are within the own eˣ's range (same operations per lane, so the same bits).
#[inline]
fn exp_pair(p: f64, q: f64) -> (f64, f64) {
    #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
    if (-708.0..=709.0).contains(&p) && (-708.0..=709.0).contains(&q) {
        use core::arch::wasm32::{f64x2, f64x2_extract_lane};
        let v = float::exp_reduced(float::F64x2(f64x2(p, q)));
        return (f64x2_extract_lane::<0>(v.0), f64x2_extract_lane::<1>(v.0));
    }
    (float::exp_fast(p), float::exp_fast(q))
}

/// Whether the kernel's tail series is that of n = 3 (else n = 2).
#[inline]
fn n3(kind: PlanckKernel) -> bool {
    matches!(kind, PlanckKernel::Energy | PlanckKernel::EnergyDerivative)
}

/// ∫ₓ^∞ (tail series), valid for x ≥ SPLIT (x may be +∞).
fn tail(kind: PlanckKernel, x: f64) -> Sc {
    if x.is_infinite() {
        return Sc::new(0.0, 0.0, f64::NEG_INFINITY);
    }
    if x > 1e4 {
        // Far beyond the f64 range (e^{−x} < e^{−10000}) but kept finite in logarithmic form
        // for the inverses: only the k = 1 term matters, written as e^{−x} x^p (1 + …) so that
        // x^p cannot overflow. (The derivative kernels share the polynomial of J_p there.)
        let (pw, poly) = match kind {
            PlanckKernel::Photon => (2, 1.0 + (2.0 + 2.0 / x) / x),
            PlanckKernel::Energy | PlanckKernel::PhotonDerivative => {
                (3, 1.0 + (3.0 + (6.0 + 6.0 / x) / x) / x)
            }
            PlanckKernel::EnergyDerivative => {
                (4, 1.0 + (4.0 + (12.0 + (24.0 + 24.0 / x) / x) / x) / x)
            }
        };
        return Sc::new(poly, 0.0, -x + f64::from(pw) * float::ln(x));
    }
    // e^{−x} once: the series' ratio, the common factor and 1 − e^{−x} (≥ 0.86 for x ≥ 2, so
    // one subtraction is within ½ ulp + r·err(r) < 0.6 ulp: no `expm1` needed)
    let r = float::exp_fast(-x);
    let j = tail_poly_j(n3(kind), x, r, tail_terms(x));
    Sc::new(tail_from_j(kind, x, r, j), r, -x)
}

/// ∫₀ˣ for any x ≥ 0.
fn lower(kind: PlanckKernel, x: f64, lnx: f64) -> Sc {
    if x <= SPLIT {
        head(kind, x, lnx)
    } else {
        Sc::plain(kind.total() - tail(kind, x).value())
    }
}

/// ∫ₓ^∞ for any x ≥ 0.
fn upper(kind: PlanckKernel, x: f64, lnx: f64) -> Sc {
    if x >= SPLIT {
        tail(kind, x)
    } else {
        Sc::plain(kind.total() - head(kind, x, lnx).value())
    }
}

/// ∫ₐᵇ by the cumulative forms (not for narrow bands). 0 ≤ a < b ≤ ∞.
fn interval(kind: PlanckKernel, a: f64, lna: f64, b: f64, lnb: f64) -> Sc {
    if b.is_infinite() {
        return upper(kind, a, lna);
    }
    if a >= SPLIT {
        // ta − tb = e^{ta.e} (ta.m − tb.m e^{tb.e − ta.e}); tb.e − ta.e = −(b − a) in the
        // ordinary range.
        if b <= 1e4 {
            // Both tails in one loop (their recurrences interleave), as many terms as the
            // lower limit needs (more than enough for the upper one).
            let (ra, rel) = exp_pair(-a, -(b - a));
            let rb = ra * rel;
            let (ja, jb) = tail_poly_j_pair(n3(kind), a, ra, b, rb, tail_terms(a));
            let (ma, mb) = (tail_from_j(kind, a, ra, ja), tail_from_j(kind, b, rb, jb));
            return Sc::new(ma - rel * mb, ra, -a);
        }
        let ta = tail(kind, a);
        let tb = tail(kind, b);
        let rel = float::exp(tb.e() - ta.e());
        Sc {
            m: ta.m - rel * tb.m,
            ..ta
        }
    } else if b <= SPLIT {
        let ha = head(kind, a, lna);
        let hb = head(kind, b, lnb);
        let ratio = if a.is_normal() && b.is_normal() {
            float::powi(a / b, kind.head_power())
        } else {
            float::exp(f64::from(kind.head_power()) * (ln_or(a, lna) - ln_or(b, lnb)))
        };
        Sc {
            m: hb.m - ratio * ha.m,
            ..hb
        }
    } else {
        Sc::plain(kind.total() - head(kind, a, lna).value() - tail(kind, b).value())
    }
}

/// ln(9/7): h ≤ c/8 for the interval [a, b] is b/a ≤ 9/7.
const LN_9_OVER_7: f64 = 0.251_314_428_280_906_1;

/// The narrow-band criterion on the reduced limits (see the module docs): half-width
/// h ≤ 0.5 and h ≤ c/8 (c the centre), i.e. b − a ≤ 1 and b/a ≤ 9/7. Written with the
/// logarithms so that it also holds when a and b are below the f64 range.
#[inline]
fn is_narrow(a: f64, lna: f64, b: f64, lnb: f64) -> bool {
    if a.is_normal() && b.is_normal() {
        b - a <= 1.0 && 7.0 * b <= 9.0 * a
    } else {
        b - a <= 1.0 && ln_or(b, lnb) - ln_or(a, lna) <= LN_9_OVER_7
    }
}

/// ln x, from `lnx` unless that is NaN ("not computed").
#[inline]
fn ln_or(x: f64, lnx: f64) -> f64 {
    if lnx.is_nan() {
        float::ln(x)
    } else {
        lnx
    }
}

/// How the spectral variable maps to the reduced variable: x = q/(vT) or x = q·v/T.
#[derive(Clone, Copy)]
struct Map {
    q: f64,
    inverse: bool,
}

impl Map {
    fn of(spec: &Spectrum) -> Self {
        let c2 = spec.c2.c2();
        match spec.variable {
            SpectralVariable::Wavelength => Map {
                q: c2,
                inverse: true,
            },
            SpectralVariable::Wavenumber => Map {
                q: c2,
                inverse: false,
            },
            SpectralVariable::Frequency => Map {
                q: c2 / SPEED_OF_LIGHT_C,
                inverse: false,
            },
        }
    }
    /// Identity map (x = v), for the dimensionless integrals.
    const IDENTITY: Map = Map {
        q: 1.0,
        inverse: false,
    };

    /// (x, ln x) at v, T; x may be 0 or ∞ for extreme inputs. ln x is finite, or NaN (not
    /// computed) when 1e-60 < x < 700.
    #[inline]
    fn x(self, v: f64, t: f64) -> (f64, f64) {
        let den = if self.inverse { v * t } else { self.q * v };
        let x = if self.inverse { self.q / den } else { den / t };
        if x.is_normal() && den.is_normal() && x < 700.0 && x > 1e-60 {
            // Comfortable range: nothing built on x can leave the f64 range, ln x is only
            // needed on demand (NaN = "not computed", see `ln_or`).
            (x, f64::NAN)
        } else if x.is_normal() && den.is_normal() && x < 1e300 && x > 1e-300 {
            (x, float::ln(x))
        } else {
            let lnx = if self.inverse {
                float::ln(self.q) - float::ln(v) - float::ln(t)
            } else {
                float::ln(self.q) + float::ln(v) - float::ln(t)
            };
            (float::exp(lnx), lnx)
        }
    }
}

/// ∫ over the reduced interval of the band [v1, v2] by 16-point Gauss–Legendre in v:
/// Σ wᵢ f(x(vᵢ)) |dx/dv|ᵢ · h, with |dx/dv| = x/v for both maps.
fn narrow(kind: PlanckKernel, map: Map, v1: f64, v2: f64, t: f64, xa: f64, xb: f64) -> Sc {
    let vc = 0.5 * (v1 + v2);
    let hv = 0.5 * (v2 - v1);
    let qt = map.q / t;
    if xa >= 1e-60 && xb <= 700.0 && qt.is_normal() {
        // e^{−x} is taken as e^{−x_a}·e^{−d}, with the offset d = x − x_a formed from the
        // nodes' intended distances to the band ends (h(1 ∓ z), accurate to a few ulp of
        // themselves) rather than from rounded node positions: at large x a node (or centre)
        // displaced by one ulp of v would otherwise cost x·1.1e-16 of relative accuracy.
        let mut s = 0.0;
        for &(z, w) in GL16.iter() {
            let (near, far) = (hv * (1.0 - z), hv * (1.0 + z));
            for (from_lo, to_hi) in [(near, far), (far, near)] {
                let v = v1 + from_lo;
                let (x, _) = map.x(v, t);
                let d = if map.inverse {
                    qt * (to_hi / (v * v2))
                } else {
                    qt * from_lo
                };
                s += w * kind.eval_shifted(x, d) * (x / v);
            }
        }
        Sc::new(hv * s, float::exp(-xa), -xa)
    } else {
        // Scaled by the integrand at the centre (extreme x only).
        let (xc, lnxc) = map.x(vc, t);
        let lnxc = ln_or(xc, lnxc);
        let ec = kind.ln_eval(xc, lnxc) + lnxc - float::ln(vc);
        let mut s = 0.0;
        for &(z, w) in GL16.iter() {
            for v in [vc - hv * z, vc + hv * z] {
                let (x, lnx) = map.x(v, t);
                let lnx = ln_or(x, lnx);
                let le = kind.ln_eval(x, lnx) + lnx - float::ln(v);
                s += w * float::exp(le - ec);
            }
        }
        Sc::new(hv * s, float::exp(ec), ec)
    }
}

/// The dimensionless integral over the band [v1, v2] (validated, v1 < v2) at T.
fn reduced_band(kind: PlanckKernel, map: Map, v1: f64, v2: f64, t: f64) -> Sc {
    let (x1, lnx1) = map.x(v1, t);
    let (x2, lnx2) = map.x(v2, t);
    let (a, lna, b, lnb) = if map.inverse {
        (x2, lnx2, x1, lnx1)
    } else {
        (x1, lnx1, x2, lnx2)
    };
    if is_narrow(a, lna, b, lnb) {
        narrow(kind, map, v1, v2, t, a, b)
    } else {
        interval(kind, a, lna, b, lnb)
    }
}

/// Prefactor P = K (T/c₂)^p [/T] with band = P · (dimensionless integral); ln P on demand.
#[derive(Clone, Copy)]
struct Pref {
    p: f64,
    /// ln k when k (= ε n² g K) is not a normal number (subnormal ε); NaN otherwise.
    ln_k: f64,
    k: f64,
    power: i32,
    r: f64,
    /// c₂ in m·K: ln r is formed as ln T − ln c₂, since r = T/c₂ itself overflows for
    /// T > c₂·f64::MAX ≈ 2.6e306 K (valid input whose band value may be ordinary).
    c2: f64,
    t: f64,
    d_dt: bool,
}

impl Pref {
    #[inline(always)]
    fn of(spec: &Spectrum, t: f64, d_dt: bool) -> Self {
        let (k0, power) = spec.band_coefficient_unscaled();
        let k = spec.scale() * k0;
        let c2 = spec.c2.c2();
        let r = t / c2;
        // r³ or r⁴ as `powi` would form them (r·r², (r²)²), without its out-of-line loop.
        let r2 = r * r;
        let mut p = k * if power == 4 { r2 * r2 } else { r * r2 };
        if d_dt {
            p /= t;
        }
        Pref {
            p,
            ln_k: if k.is_normal() {
                f64::NAN
            } else {
                spec.ln_scaled(k0)
            },
            k,
            power,
            r,
            c2,
            t,
            d_dt,
        }
    }
    fn ln(&self) -> f64 {
        let lk = if self.ln_k.is_nan() {
            float::ln(self.k)
        } else {
            self.ln_k
        };
        let ln_r = if self.r.is_finite() {
            float::ln(self.r)
        } else {
            float::ln(self.t) - float::ln(self.c2)
        };
        let mut l = lk + f64::from(self.power) * ln_r;
        if self.d_dt {
            l -= float::ln(self.t);
        }
        l
    }
}

/// P · integral with a logarithmic fallback; 0 only below the f64 range.
#[inline(always)]
fn combine(p: &Pref, s: Sc) -> f64 {
    if s.m <= 0.0 {
        return 0.0;
    }
    let v = p.p * s.m * s.f;
    if p.p.is_normal() && s.f.is_normal() && v.is_normal() {
        v
    } else {
        s.m * float::exp(p.ln() + s.e())
    }
}

fn limit_names(variable: SpectralVariable) -> (&'static str, &'static str) {
    match variable {
        SpectralVariable::Wavelength => ("lower_wavelength_m", "upper_wavelength_m"),
        SpectralVariable::Wavenumber => ("lower_wavenumber_per_m", "upper_wavenumber_per_m"),
        SpectralVariable::Frequency => ("lower_frequency_hz", "upper_frequency_hz"),
    }
}

fn check(spec: &Spectrum, lower: f64, upper: f64, temperature_k: f64) -> Result<()> {
    check_band(spec, lower, upper)?;
    error::temperature("temperature_k", temperature_k)?;
    Ok(())
}

/// (P, integral) for validated input.
#[inline(always)]
fn band_parts(spec: &Spectrum, lower: f64, upper: f64, t: f64, d_dt: bool) -> (Pref, Sc) {
    let kind = PlanckKernel::of(spec.quantity, d_dt);
    let s = reduced_band(kind, Map::of(spec), lower, upper, t);
    (Pref::of(spec, t, d_dt), s)
}

/// ln of the band quantity (or of its T-derivative) for validated input; −∞ if it is 0.
pub(crate) fn ln_band_unchecked(
    spec: &Spectrum,
    lower: f64,
    upper: f64,
    t: f64,
    d_dt: bool,
) -> f64 {
    let (p, s) = band_parts(spec, lower, upper, t, d_dt);
    let v = combine(&p, s);
    if v.is_normal() {
        float::ln(v)
    } else if s.m <= 0.0 {
        f64::NEG_INFINITY
    } else {
        p.ln() + s.e() + float::ln(s.m)
    }
}

/// Validates band arguments (used by the inverse module too).
pub(crate) fn check_band(spec: &Spectrum, lower: f64, upper: f64) -> Result<()> {
    spec.validate()?;
    let (ln, un) = limit_names(spec.variable);
    error::band(ln, lower, un, upper)?;
    Ok(())
}

/// Band quantity of a spectrum between two spectral limits, integrated over the spectral
/// variable: W·m⁻²·sr⁻¹ (energy radiance), W·m⁻² (energy exitance), photons·s⁻¹·m⁻²·sr⁻¹ or
/// photons·s⁻¹·m⁻² (photon quantities).
///
/// `lower` and `upper` are in the SI unit of `spec.variable` (m, m⁻¹ or Hz), `lower < upper`.
///
/// # Formula
/// ```text
/// B = ∫_lower^upper S(v, T) dv = ε n² g · K · (T/c₂)^p · ∫_{x_a}^{x_b} x^{p−1}/(eˣ−1) dx
/// energy: K = 2hc², p = 4;  photon: K = 2c, p = 3;  g = 1 (radiance) or π (exitance)
/// x = c₂/(λT) (limits swap for wavelength), c₂σ̃/T, c₂ν/(cT)
/// ```
///
/// # Errors
/// [`Spectrum::validate`] errors; `NonFinite`/`NonPositiveSpectral` for a limit; `InvalidBand`
/// if `lower >= upper`; `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// Measured against mpmath `quad` at 40 digits over the reference table (58 bands: all three
/// variables, energy and photon, wide, narrow down to 1e-10 relative width, far tails, 1 mK to
/// 1e6 K): max relative error 1.7e-14 (bound tested: 1e-13 + 2.5e-16·x_a, x_a the smaller
/// reduced limit — the inherent sensitivity to rounding of the inputs). Values below the f64
/// range return 0; values above `f64::MAX` (e.g. with n² beyond the f64 range) return +∞.
///
/// # Examples
/// ```
/// use quantaband::{band::band, planck::Spectrum};
/// // 8–14 µm radiance of a 300 K blackbody: 54.933 461 376 839 688 W·m⁻²·sr⁻¹
/// // (mpmath quad, 40 digits; tests/data/core_reference.json).
/// let b = band(&Spectrum::default(), 8e-6, 14e-6, 300.0).unwrap();
/// assert!((b / 54.933_461_376_839_688 - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Widger & Woodall (1976); Howell et al., Thermal Radiation Heat Transfer (2020), ch. 1
/// (blackbody fractions).
pub fn band(spec: &Spectrum, lower: f64, upper: f64, temperature_k: f64) -> Result<f64> {
    check(spec, lower, upper, temperature_k)?;
    Ok(band_checked(spec, lower, upper, temperature_k, false))
}

/// [`band`] (or, with `d_dt`, [`band_d_dt`]) for arguments the caller has already checked:
/// `spec` passes [`Spectrum::validate`], `0 < lower < upper` are finite, `temperature_k` is
/// finite and positive. For callers that validate a spectrum once and then evaluate it many
/// times (the JavaScript bindings' prepared `Spectrum`).
pub(crate) fn band_checked(spec: &Spectrum, lower: f64, upper: f64, t: f64, d_dt: bool) -> f64 {
    let (p, s) = band_parts(spec, lower, upper, t, d_dt);
    combine(&p, s)
}

/// ∂/∂T of [`band`], in the band quantity's unit per kelvin.
///
/// # Formula
/// ```text
/// ∂B/∂T = ε n² g · K · (T/c₂)^p / T · ∫_{x_a}^{x_b} x^p eˣ/(eˣ−1)² dx
/// (K, p, g, x as in `band`)
/// ```
///
/// # Errors
/// As [`band`].
///
/// # Accuracy
/// Measured against mpmath `quad` of ∂L/∂T (58 reference bands): max relative error 1.7e-14.
/// As for [`band`], values below the f64 range return 0 and values above `f64::MAX` return +∞.
///
/// # Examples
/// ```
/// use quantaband::{band::{band, band_d_dt}, planck::Spectrum};
/// // Central difference check (common practice, no source): ≈ 1e-8 agreement.
/// let s = Spectrum::default();
/// let d = band_d_dt(&s, 8e-6, 14e-6, 300.0).unwrap();
/// let fd = (band(&s, 8e-6, 14e-6, 300.01).unwrap() - band(&s, 8e-6, 14e-6, 299.99).unwrap()) / 0.02;
/// assert!((d / fd - 1.0).abs() < 1e-8);
/// ```
///
/// # References
/// Derived from Widger & Woodall (1976) by integration by parts (see module docs).
pub fn band_d_dt(spec: &Spectrum, lower: f64, upper: f64, temperature_k: f64) -> Result<f64> {
    check(spec, lower, upper, temperature_k)?;
    Ok(band_checked(spec, lower, upper, temperature_k, true))
}

/// Fraction (0…1) of the total energy or photon emission (per `spec.quantity`) that lies
/// between two spectral limits. Independent of ε, n, geometry.
///
/// # Formula
/// ```text
/// F = ∫_{x_a}^{x_b} x³/(eˣ−1) dx / (π⁴/15)    (energy)
/// F = ∫_{x_a}^{x_b} x²/(eˣ−1) dx / (2ζ(3))    (photon)
/// ```
///
/// # Errors
/// As [`band`].
///
/// # Accuracy
/// Against mpmath over the reference table (52 bands): max relative error 1.7e-14, absolute
/// error ≤ 1e-15 (both asserted).
///
/// # Examples
/// ```
/// use quantaband::{band::band_fraction, planck::Spectrum};
/// // 8–14 µm at 300 K: 0.375 742 293 645 924 3 of σT⁴/π (mpmath quad, reference table).
/// let f = band_fraction(&Spectrum::default(), 8e-6, 14e-6, 300.0).unwrap();
/// assert!((f - 0.375_742_293_645_924_3).abs() < 1e-15);
/// ```
///
/// # References
/// Widger & Woodall (1976); Howell et al. (2020), ch. 1.
pub fn band_fraction(spec: &Spectrum, lower: f64, upper: f64, temperature_k: f64) -> Result<f64> {
    check(spec, lower, upper, temperature_k)?;
    let kind = PlanckKernel::of(spec.quantity, false);
    let s = reduced_band(kind, Map::of(spec), lower, upper, temperature_k);
    Ok((s.value() / kind.total()).min(1.0))
}

fn check_lambda_t(lambda_t_m_k: f64) -> Result<f64> {
    error::finite("lambda_t_m_k", lambda_t_m_k)?;
    if lambda_t_m_k > 0.0 {
        Ok(lambda_t_m_k)
    } else {
        Err(Error::NonPositive {
            arg: "lambda_t_m_k",
            value: lambda_t_m_k,
        })
    }
}

fn fraction_below_kernel(kind: PlanckKernel, lambda_t_m_k: f64) -> Result<f64> {
    let lt = check_lambda_t(lambda_t_m_k)?;
    let (x, lnx) = Map {
        q: C2,
        inverse: true,
    }
    .x(lt, 1.0);
    Ok((upper(kind, x, lnx).value() / kind.total()).min(1.0))
}

/// Blackbody fraction F(0→λT): the share of the total exitance emitted at wavelengths below λ,
/// as a function of the product λT in m·K (CODATA c₂).
///
/// # Formula
/// ```text
/// F(0→λT) = (15/π⁴) ∫_x^∞ t³/(eᵗ−1) dt,  x = c₂/(λT)
/// ```
///
/// # Errors
/// `NonFinite`, `NonPositive` for `lambda_t_m_k`.
///
/// # Accuracy
/// Against mpmath (`quad` and polylogarithms, 40 digits) at 41 values of λT from 50 µm·K to
/// 1e6 µm·K: absolute error ≤ 1e-15 and max relative error 3.7e-14 (at λT = 50 µm·K, where
/// x = 288 and F ≈ 4e-120; inherent sensitivity x·1.1e-16).
///
/// # Examples
/// ```
/// use quantaband::band::fraction_below;
/// // λT = 2898 µm·K: F = 0.250 … (Incropera & DeWitt, Table 12.1 lists 0.250 108, from memory).
/// let f = fraction_below(2898e-6).unwrap();
/// assert!((f - 0.250_108).abs() < 5e-5);
/// ```
///
/// # References
/// Widger & Woodall (1976); F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass
/// Transfer, Table 12.1 (blackbody radiation functions).
pub fn fraction_below(lambda_t_m_k: f64) -> Result<f64> {
    fraction_below_kernel(PlanckKernel::Energy, lambda_t_m_k)
}

/// Photon-number blackbody fraction: the share of the total photon exitance at wavelengths
/// below λ, as a function of λT in m·K (CODATA c₂).
///
/// # Formula
/// ```text
/// F_p(0→λT) = (1/(2ζ(3))) ∫_x^∞ t²/(eᵗ−1) dt,  x = c₂/(λT)
/// ```
///
/// # Errors
/// `NonFinite`, `NonPositive` for `lambda_t_m_k`.
///
/// # Accuracy
/// As [`fraction_below`]: absolute ≤ 1e-15, max relative 3.7e-14 over 41 reference values.
///
/// # Examples
/// ```
/// use quantaband::band::photon_fraction_below;
/// // Median of the photon spectrum is at a longer λT than the energy median (≈ 4110 µm·K).
/// assert!(photon_fraction_below(4110e-6).unwrap() < 0.5);
/// ```
///
/// # References
/// Widger & Woodall (1976) (n = 2 form).
pub fn photon_fraction_below(lambda_t_m_k: f64) -> Result<f64> {
    fraction_below_kernel(PlanckKernel::Photon, lambda_t_m_k)
}

fn lambda_t_at_fraction_kernel(kind: PlanckKernel, fraction: f64) -> Result<f64> {
    error::finite("fraction", fraction)?;
    if !(fraction > 0.0 && fraction < 1.0) {
        return Err(Error::OutOfRange {
            arg: "fraction",
            value: fraction,
            range: "(0, 1)",
        });
    }
    let z = kind.total();
    // Solve in x = c₂/(λT). For fraction ≤ 1/2 match ln ∫ₓ^∞ = ln(fZ) (x large); otherwise
    // ln ∫₀ˣ = ln((1−f)Z) (x small). Both sides are monotone in x.
    let use_upper = fraction <= 0.5;
    let target = if use_upper {
        float::ln(fraction * z)
    } else {
        float::ln((1.0 - fraction) * z)
    };
    // g(x) = ln(cumulative) − target; increasing in x for the lower form, decreasing for upper.
    let g = |x: f64| -> (f64, f64) {
        let lnx = float::ln(x);
        let (c, sign) = if use_upper {
            (upper(kind, x, lnx), -1.0)
        } else {
            (lower(kind, x, lnx), 1.0)
        };
        let lc = c.ln();
        // d/dx ln C = ± f(x)/C
        let dl = sign * float::exp(kind.ln_eval(x, lnx) - lc);
        (lc - target, dl)
    };
    // Bracket in x (decreasing order of the cumulative for the upper form).
    let (lo, hi) = if use_upper {
        (0.5, 2.0 * (-target).max(1.0) + 60.0)
    } else {
        (1e-12, 40.0)
    };
    let x = solve_monotone(g, lo, hi, None, !use_upper, true)?;
    Ok(C2 / x)
}

/// Safeguarded Newton for g(x) = 0 on [lo, hi] with g monotone (increasing if `increasing`);
/// the caller guarantees that the root is bracketed (sign change between lo and hi);
/// g returns (g, g′). A Newton step that leaves the current bracket is replaced by bisection
/// (geometric mean if `geometric`, arithmetic otherwise). Converged when a step is below
/// 2e-15 relative (geometric) or 2e-15·max(|x|, 1) absolute (arithmetic).
pub(crate) fn solve_monotone<G>(
    g: G,
    lo: f64,
    hi: f64,
    x0: Option<f64>,
    increasing: bool,
    geometric: bool,
) -> Result<f64>
where
    G: Fn(f64) -> (f64, f64),
{
    let (mut lo, mut hi) = (lo, hi);
    let sgn = if increasing { 1.0 } else { -1.0 };
    let mid = |a: f64, b: f64| {
        if geometric {
            float::sqrt(a * b)
        } else {
            0.5 * (a + b)
        }
    };
    let scale = |x: f64| if geometric { x } else { float::abs(x).max(1.0) };
    let mut x = match x0 {
        Some(x0) if x0 > lo && x0 < hi => x0,
        _ => mid(lo, hi),
    };
    let mut last_step = f64::INFINITY;
    for _ in 0..200 {
        let (gx, dg) = g(x);
        if gx == 0.0 {
            return Ok(x);
        }
        if sgn * gx < 0.0 {
            lo = x;
        } else {
            hi = x;
        }
        let newton = x - gx / dg;
        let tol = 2e-15 * scale(x);
        // A converged Newton step may land a rounding error outside the bracket (the root sits
        // on a bracket end): accept it when the step itself is below the tolerance.
        if newton.is_finite() && float::abs(newton - x) <= tol {
            return Ok(newton.max(lo).min(hi));
        }
        let next = if newton.is_finite() && newton > lo && newton < hi {
            newton
        } else {
            mid(lo, hi)
        };
        let step = float::abs(next - x);
        if step <= tol || hi - lo <= 2e-15 * scale(hi) {
            return Ok(next);
        }
        last_step = step / scale(x);
        x = next;
    }
    if last_step < 1e-12 {
        Ok(x)
    } else {
        Err(Error::NotConverged {
            what: "safeguarded Newton iteration",
        })
    }
}

/// λT (m·K) at which the blackbody fraction F(0→λT) reaches `fraction` (energy).
///
/// # Formula
/// ```text
/// solve (15/π⁴) ∫_x^∞ t³/(eᵗ−1) dt = fraction for x, then λT = c₂/x
/// ```
///
/// # Errors
/// `NonFinite`; `OutOfRange` (range "(0, 1)") if `fraction` ∉ (0, 1).
///
/// # Accuracy
/// Relative ≤ 1e-14 in λT against mpmath (reference table; measured max 4.3e-16), except
/// near fraction → 1 where rounding of the input fraction (1.1e-16/(1 − f)) dominates.
///
/// # Examples
/// ```
/// use quantaband::band::lambda_t_at_fraction;
/// // Median: λT = 4.107 248 487 711 177e-3 m·K (mpmath, bisection on the polylog form,
/// // tests/data/gen_core.py).
/// let lt = lambda_t_at_fraction(0.5).unwrap();
/// assert!((lt / 4.107_248_487_711_177e-3 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Widger & Woodall (1976).
pub fn lambda_t_at_fraction(fraction: f64) -> Result<f64> {
    lambda_t_at_fraction_kernel(PlanckKernel::Energy, fraction)
}

/// λT (m·K) at which the photon fraction reaches `fraction`.
///
/// # Formula
/// ```text
/// solve (1/(2ζ(3))) ∫_x^∞ t²/(eᵗ−1) dt = fraction for x, then λT = c₂/x
/// ```
///
/// # Errors
/// `NonFinite`; `OutOfRange` if `fraction` ∉ (0, 1).
///
/// # Accuracy
/// Relative ≤ 1e-14 in λT against mpmath (reference table; measured max 6.8e-16).
///
/// # Examples
/// ```
/// use quantaband::band::{photon_fraction_below, photon_lambda_t_at_fraction};
/// let lt = photon_lambda_t_at_fraction(0.25).unwrap();
/// assert!((photon_fraction_below(lt).unwrap() - 0.25).abs() < 1e-15);
/// ```
///
/// # References
/// Widger & Woodall (1976).
pub fn photon_lambda_t_at_fraction(fraction: f64) -> Result<f64> {
    lambda_t_at_fraction_kernel(PlanckKernel::Photon, fraction)
}

fn check_x(arg: &'static str, x: f64) -> Result<f64> {
    error::finite(arg, x)?;
    if x >= 0.0 {
        Ok(x)
    } else {
        Err(Error::OutOfRange {
            arg,
            value: x,
            range: "[0, ∞)",
        })
    }
}

/// ∫_{x_lower}^{x_upper} of a dimensionless Planck kernel (0 ≤ x_lower < x_upper < ∞).
///
/// # Formula
/// ```text
/// ∫ k(x) dx, k = x²/(eˣ−1), x³/(eˣ−1), x³eˣ/(eˣ−1)², x⁴eˣ/(eˣ−1)²  (see PlanckKernel)
/// ```
///
/// # Errors
/// `NonFinite`, `OutOfRange` for a negative limit, `InvalidBand` if `x_lower >= x_upper`.
///
/// # Accuracy
/// Max relative error 6.6e-16 against mpmath `quad` (188 reference intervals, all kernels,
/// including 160 seeded random ones from x = 1e-3 to 1.2e3 and relative widths 1e-6 to 3);
/// the test asserts 2e-15.
///
/// # Examples
/// ```
/// use quantaband::band::{planck_integral, PlanckKernel};
/// // ∫₀^∞ x³/(eˣ−1) = π⁴/15; ∫₀^50 differs by ∫₅₀^∞ ≈ 2.6e-17.
/// let v = planck_integral(PlanckKernel::Energy, 0.0, 50.0).unwrap();
/// assert!((v / 6.493_939_402_266_829 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Widger & Woodall (1976); Abramowitz & Stegun 23.1.1.
pub fn planck_integral(kernel: PlanckKernel, x_lower: f64, x_upper: f64) -> Result<f64> {
    let a = check_x("x_lower", x_lower)?;
    let b = check_x("x_upper", x_upper)?;
    if a >= b {
        return Err(Error::InvalidBand { lower: a, upper: b });
    }
    let lna = if a > 0.0 {
        float::ln(a)
    } else {
        f64::NEG_INFINITY
    };
    let lnb = float::ln(b);
    let s = if is_narrow(a, lna, b, lnb) {
        narrow(kernel, Map::IDENTITY, a, b, 1.0, a, b)
    } else {
        interval(kernel, a, lna, b, lnb)
    };
    Ok(s.value())
}

/// ∫_x^∞ of a dimensionless Planck kernel, full relative accuracy in the far tail (x ≥ 0).
///
/// # Formula
/// ```text
/// ∫_x^∞ k(t) dt = Σₖ e^{−kx} (…)   (Widger–Woodall series; see module docs)
/// ```
///
/// # Errors
/// `NonFinite`, `OutOfRange` for x < 0.
///
/// # Accuracy
/// Max relative error 3.4e-16 against mpmath polylogarithms and `quad` (60 reference values,
/// x from 1e-6 to 500, all kernels).
///
/// # Examples
/// ```
/// use quantaband::band::{planck_integral_upper, PlanckKernel};
/// // ∫₁₀₀^∞ x³/(eˣ−1) dx = e^−100 (100³ + 3·100² + 6·100 + 6) (1 + O(e^−100)).
/// let v = planck_integral_upper(PlanckKernel::Energy, 100.0).unwrap();
/// assert!((v / (3.720_075_976_020_836e-44 * 1_030_606.0) - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Widger & Woodall (1976).
pub fn planck_integral_upper(kernel: PlanckKernel, x: f64) -> Result<f64> {
    let x = check_x("x", x)?;
    let lnx = if x > 0.0 {
        float::ln(x)
    } else {
        f64::NEG_INFINITY
    };
    Ok(upper(kernel, x, lnx).value())
}

/// ∫_0^x of a dimensionless Planck kernel (x ≥ 0).
///
/// # Formula
/// ```text
/// ∫₀ˣ k(t) dt = xⁿ [1/n − …]   (Bernoulli series for x ≤ 2; total − tail above)
/// ```
///
/// # Errors
/// `NonFinite`, `OutOfRange` for x < 0.
///
/// # Accuracy
/// Max relative error 1.1e-15 against mpmath `quad` (60 reference values).
///
/// # Examples
/// ```
/// use quantaband::band::{planck_integral_lower, PlanckKernel};
/// // Small x: ∫₀ˣ t²/(eᵗ−1) dt ≈ x²/2 − x³/6.
/// let v = planck_integral_lower(PlanckKernel::Photon, 1e-6).unwrap();
/// assert!((v / (0.5e-12 - 1e-18 / 6.0) - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// Abramowitz & Stegun 23.1.1 (Bernoulli numbers).
pub fn planck_integral_lower(kernel: PlanckKernel, x: f64) -> Result<f64> {
    let x = check_x("x", x)?;
    let lnx = if x > 0.0 {
        float::ln(x)
    } else {
        f64::NEG_INFINITY
    };
    Ok(lower(kernel, x, lnx).value())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn head_and_tail_agree_at_the_split() {
        for kind in [
            PlanckKernel::Photon,
            PlanckKernel::Energy,
            PlanckKernel::PhotonDerivative,
            PlanckKernel::EnergyDerivative,
        ] {
            let x = SPLIT;
            let h = head(kind, x, float::ln(x)).value();
            let t = tail(kind, x).value();
            assert!(((h + t) / kind.total() - 1.0).abs() < 4e-16, "{kind:?}");
        }
    }
}
