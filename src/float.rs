//! Private maths shim: the platform's maths through std's inherent `f64` methods when the `std`
//! feature is on, the pure-Rust `libm` crate otherwise. This is the only module that names
//! `libm`; everything else calls these functions.
#![allow(dead_code)]

macro_rules! unary {
    ($($(#[$m:meta])* $name:ident => $std:ident, $libm:ident;)*) => {$(
        $(#[$m])*
        // With std the platform's function is called (std's methods are small wrappers); without
        // it, one out-of-line copy of each libm routine serves every call site, which keeps the
        // WebAssembly module small (LTO would otherwise inline e.g. `exp` everywhere).
        #[cfg_attr(feature = "std", inline(always))]
        #[cfg_attr(not(feature = "std"), inline(never))]
        pub(crate) fn $name(x: f64) -> f64 {
            #[cfg(feature = "std")]
            { x.$std() }
            #[cfg(not(feature = "std"))]
            { libm::$libm(x) }
        }
    )*};
}

/// Functions that are single instructions on WebAssembly (`f64.sqrt`, `f64.abs`, …). Without
/// std, libm computes them in software on wasm32 (its intrinsics need a nightly feature), so
/// the core calls the instructions directly there; elsewhere std or libm as above.
macro_rules! instruction {
    ($($(#[$m:meta])* $name:ident => $std:ident, $libm:ident, $wasm:ident;)*) => {$(
        $(#[$m])*
        #[inline(always)]
        pub(crate) fn $name(x: f64) -> f64 {
            #[cfg(feature = "std")]
            { x.$std() }
            #[cfg(all(not(feature = "std"), target_arch = "wasm32", target_feature = "simd128"))]
            {
                use core::arch::wasm32::{f64x2_extract_lane, f64x2_splat, $wasm};
                f64x2_extract_lane::<0>($wasm(f64x2_splat(x)))
            }
            #[cfg(all(
                not(feature = "std"),
                not(all(target_arch = "wasm32", target_feature = "simd128"))
            ))]
            { libm::$libm(x) }
        }
    )*};
}

instruction! {
    /// square root
    sqrt => sqrt, sqrt, f64x2_sqrt;
    /// absolute value
    abs => abs, fabs, f64x2_abs;
    /// largest integer ≤ x
    floor => floor, floor, f64x2_floor;
    /// smallest integer ≥ x
    ceil => ceil, ceil, f64x2_ceil;
}

unary! {
    /// eˣ
    exp => exp, exp;
    /// eˣ − 1, accurate for small x
    expm1 => exp_m1, expm1;
    /// natural logarithm
    ln => ln, log;
    /// ln(1 + x), accurate for small x
    ln_1p => ln_1p, log1p;
    /// base-10 logarithm
    log10 => log10, log10;
    /// cube root
    cbrt => cbrt, cbrt;
    /// sine
    sin => sin, sin;
    /// cosine
    cos => cos, cos;
    /// hyperbolic tangent
    tanh => tanh, tanh;
    /// hyperbolic sine
    sinh => sinh, sinh;
    /// hyperbolic cosine
    cosh => cosh, cosh;
    /// nearest integer, ties away from zero
    round => round, round;
}

/// xʸ
#[cfg_attr(feature = "std", inline(always))]
#[cfg_attr(not(feature = "std"), inline(never))]
pub(crate) fn powf(x: f64, y: f64) -> f64 {
    #[cfg(feature = "std")]
    {
        x.powf(y)
    }
    #[cfg(not(feature = "std"))]
    {
        libm::pow(x, y)
    }
}

/// xⁿ for an integer n by repeated squaring: std's `powi`, or without std the loop of
/// compiler-rt's `__powidf2` (what a non-constant `powi` lowers to).
#[inline(always)]
pub(crate) fn powi(x: f64, n: i32) -> f64 {
    #[cfg(feature = "std")]
    {
        x.powi(n)
    }
    #[cfg(not(feature = "std"))]
    {
        let mut a = x;
        let mut b = n;
        let recip = b < 0;
        let mut r = 1.0;
        loop {
            if b & 1 != 0 {
                r *= a;
            }
            b /= 2;
            if b == 0 {
                break;
            }
            a *= a;
        }
        if recip {
            1.0 / r
        } else {
            r
        }
    }
}

/// Fused multiply–add a·b + c.
#[cfg_attr(feature = "std", inline(always))]
#[cfg_attr(not(feature = "std"), inline(never))]
pub(crate) fn mul_add(a: f64, b: f64, c: f64) -> f64 {
    #[cfg(feature = "std")]
    {
        a.mul_add(b, c)
    }
    #[cfg(not(feature = "std"))]
    {
        libm::fma(a, b, c)
    }
}

/// Γ(x).
#[cfg_attr(feature = "std", inline(always))]
#[cfg_attr(not(feature = "std"), inline(never))]
pub(crate) fn gamma(x: f64) -> f64 {
    libm::tgamma(x)
}

/// Complementary error function erfc(x) = 1 − erf(x), accurate in the upper tail.
#[cfg_attr(feature = "std", inline(always))]
#[cfg_attr(not(feature = "std"), inline(never))]
pub(crate) fn erfc(x: f64) -> f64 {
    libm::erfc(x)
}

/// Arithmetic on one `f64` or on the two lanes of a wasm simd128 vector ([`F64x2`]), so that the
/// bulk spectrum and the point evaluation run the same operations, operation for operation (each
/// is a correctly rounded IEEE operation in either form), and the host tests of the `f64` form
/// check the vector form's arithmetic too.
#[cfg_attr(
    not(all(target_arch = "wasm32", target_feature = "simd128")),
    allow(dead_code)
)]
pub(crate) trait Lanes: Copy {
    /// Every lane set to `v`.
    fn splat(v: f64) -> Self;
    /// a + b per lane.
    fn add(self, b: Self) -> Self;
    /// a − b per lane.
    fn sub(self, b: Self) -> Self;
    /// a · b per lane.
    fn mul(self, b: Self) -> Self;
    /// a / b per lane.
    fn div(self, b: Self) -> Self;
    /// 2ᵏ from t = 1.5·2⁵² + k as formed by [`exp_reduced`] (integer k, −1022 ≤ k ≤ 1023),
    /// built from the exponent bits.
    fn pow2_shifted(self) -> Self;
    /// The lanes of `self` where lo ≤ `test` < hi, NaN in the others (and where `test` is NaN).
    fn where_within(self, test: Self, lo: f64, hi: f64) -> Self;
}

#[cfg_attr(
    not(all(target_arch = "wasm32", target_feature = "simd128")),
    allow(dead_code)
)]
impl Lanes for f64 {
    #[inline(always)]
    fn splat(v: f64) -> Self {
        v
    }
    #[inline(always)]
    fn add(self, b: Self) -> Self {
        self + b
    }
    #[inline(always)]
    fn sub(self, b: Self) -> Self {
        self - b
    }
    #[inline(always)]
    fn mul(self, b: Self) -> Self {
        self * b
    }
    #[inline(always)]
    fn div(self, b: Self) -> Self {
        self / b
    }
    #[inline(always)]
    fn pow2_shifted(self) -> Self {
        f64::from_bits((self.to_bits() << 52).wrapping_add(ONE_BITS))
    }
    #[inline(always)]
    fn where_within(self, test: Self, lo: f64, hi: f64) -> Self {
        if test >= lo && test < hi {
            self
        } else {
            f64::NAN
        }
    }
}

/// Two f64 lanes as a plain pair (targets without wasm simd128; the compiler may vectorise it).
#[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
impl Lanes for [f64; 2] {
    #[inline(always)]
    fn splat(v: f64) -> Self {
        [v, v]
    }
    #[inline(always)]
    fn add(self, b: Self) -> Self {
        [self[0] + b[0], self[1] + b[1]]
    }
    #[inline(always)]
    fn sub(self, b: Self) -> Self {
        [self[0] - b[0], self[1] - b[1]]
    }
    #[inline(always)]
    fn mul(self, b: Self) -> Self {
        [self[0] * b[0], self[1] * b[1]]
    }
    #[inline(always)]
    fn div(self, b: Self) -> Self {
        [self[0] / b[0], self[1] / b[1]]
    }
    #[inline(always)]
    fn pow2_shifted(self) -> Self {
        [self[0].pow2_shifted(), self[1].pow2_shifted()]
    }
    #[inline(always)]
    fn where_within(self, test: Self, lo: f64, hi: f64) -> Self {
        [
            self[0].where_within(test[0], lo, hi),
            self[1].where_within(test[1], lo, hi),
        ]
    }
}

/// Two f64 lanes of a wasm simd128 vector.
#[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
#[derive(Clone, Copy)]
pub(crate) struct F64x2(pub(crate) core::arch::wasm32::v128);

#[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
impl Lanes for F64x2 {
    #[inline(always)]
    fn splat(v: f64) -> Self {
        F64x2(core::arch::wasm32::f64x2_splat(v))
    }
    #[inline(always)]
    fn add(self, b: Self) -> Self {
        F64x2(core::arch::wasm32::f64x2_add(self.0, b.0))
    }
    #[inline(always)]
    fn sub(self, b: Self) -> Self {
        F64x2(core::arch::wasm32::f64x2_sub(self.0, b.0))
    }
    #[inline(always)]
    fn mul(self, b: Self) -> Self {
        F64x2(core::arch::wasm32::f64x2_mul(self.0, b.0))
    }
    #[inline(always)]
    fn div(self, b: Self) -> Self {
        F64x2(core::arch::wasm32::f64x2_div(self.0, b.0))
    }
    #[inline(always)]
    fn pow2_shifted(self) -> Self {
        use core::arch::wasm32::{i64x2_add, i64x2_shl, i64x2_splat};
        F64x2(i64x2_add(
            i64x2_shl(self.0, 52),
            i64x2_splat(ONE_BITS as i64),
        ))
    }
    #[inline(always)]
    fn where_within(self, test: Self, lo: f64, hi: f64) -> Self {
        use core::arch::wasm32::{f64x2_ge, f64x2_lt, f64x2_splat, v128_and, v128_bitselect};
        let inside = v128_and(
            f64x2_ge(test.0, f64x2_splat(lo)),
            f64x2_lt(test.0, f64x2_splat(hi)),
        );
        F64x2(v128_bitselect(self.0, f64x2_splat(f64::NAN), inside))
    }
}

#[cfg_attr(
    not(all(target_arch = "wasm32", target_feature = "simd128")),
    allow(dead_code)
)]
/// Bits of 1.0 (the exponent bias in place).
const ONE_BITS: u64 = 0x3FF0_0000_0000_0000;

/// eˣ for −708 ≤ x ≤ 709 (outside that range the result is meaningless: callers test x), on
/// one value or on lanes, without a call into the platform's maths (a few additions and
/// multiplications the compiler can keep inline or vectorise).
///
/// # Formula
/// ```text
/// k = round(x/ln 2)                       (t = x·(1/ln 2) + 1.5·2⁵²: the rounding to an integer)
/// r = (x − k·L_hi) − k·L_lo,  |r| ≤ ln2/2 + 1e-13,  L_hi + L_lo = ln 2 (L_hi: 32 trailing zero bits)
/// eʳ ≈ 1 + (r + r²·P(r)),  P(r) = Σ_{j=2..13} r^{j−2}/j!   (Taylor, Estrin's scheme)
/// eˣ = 2ᵏ · eʳ                           (2ᵏ from the exponent bits, exact)
/// ```
///
/// # Accuracy
/// A priori: k·L_hi and x − k·L_hi are exact (|k| ≤ 1022 needs 10 bits, L_hi has 21
/// significant bits; Sterbenz), so r carries at most ½ ulp(r) + |k|·2⁻⁵³·L_lo ≤ 2.0e-17
/// absolute error, i.e. ≤ 2.0e-17 relative in eʳ; the Taylor remainder after r¹³/13! is
/// ≤ (ln2/2)¹⁴/14!·e^{ln2/2}/e^{−ln2/2} < 8.3e-18 relative; the rounding of r²P(r) (|r²P| ≤ 0.066,
/// relative error ≤ 8 ulp of itself) ≤ 1.2e-16 absolute, of r + r²P ≤ 2.8e-17, of the final 1 + …
/// ½ ulp. In all ≤ 2.2e-16 + ½ ulp of the result, i.e. below 3.4e-16 relative (≈ 1.5 ulp).
/// Measured through the densities that use it (`tests/core_fast_path.rs`, host, f64 form;
/// `tests/js/fast_path.test.mjs`, the package's f64x2 form): against mpmath at 40 digits over
/// the bench grid and 3 000 seeded points, within the bounds stated there.
///
/// # References
/// W. J. Cody and W. Waite, Software Manual for the Elementary Functions (1980), ch. 6
/// (additive argument reduction with a split ln 2); K. C. Ng, "Argument reduction for huge
/// arguments" (1992) for the split constant; Estrin's scheme: Knuth, TAOCP vol. 2, §4.6.4.
#[cfg_attr(
    not(all(target_arch = "wasm32", target_feature = "simd128")),
    allow(dead_code)
)]
#[inline(always)]
pub(crate) fn exp_reduced<L: Lanes>(x: L) -> L {
    const SHIFT: f64 = 6_755_399_441_055_744.0; // 1.5·2⁵²
    const INV_LN2: f64 = core::f64::consts::LOG2_E;
    const LN2_HI: f64 = f64::from_bits(0x3FE6_2E42_FEE0_0000); // 6.93147180369123816490e-01
    const LN2_LO: f64 = 1.908_214_929_270_587_7e-10; // ln 2 − LN2_HI
    const C: [f64; 12] = [
        1.0 / 2.0,
        1.0 / 6.0,
        1.0 / 24.0,
        1.0 / 120.0,
        1.0 / 720.0,
        1.0 / 5_040.0,
        1.0 / 40_320.0,
        1.0 / 362_880.0,
        1.0 / 3_628_800.0,
        1.0 / 39_916_800.0,
        1.0 / 479_001_600.0,
        1.0 / 6_227_020_800.0,
    ];
    let s = L::splat;
    let t = x.mul(s(INV_LN2)).add(s(SHIFT));
    let k = t.sub(s(SHIFT));
    let r = x.sub(k.mul(s(LN2_HI))).sub(k.mul(s(LN2_LO)));
    let r2 = r.mul(r);
    let r4 = r2.mul(r2);
    let pair = |i: usize| s(C[i]).add(s(C[i + 1]).mul(r));
    let b0 = pair(0).add(pair(2).mul(r2));
    let b1 = pair(4).add(pair(6).mul(r2));
    let b2 = pair(8).add(pair(10).mul(r2));
    let p = b0.add(b1.mul(r4)).add(b2.mul(r4.mul(r4)));
    s(1.0).add(r.add(r2.mul(p))).mul(t.pow2_shifted())
}

/// eˣ by [`exp_reduced`] on one `f64` where it is valid (−708 ≤ x ≤ 709: a few inline
/// multiplications and additions, ≤ 3.4e-16 relative), the platform's `exp` elsewhere (its
/// underflow and overflow, and NaN).
#[inline]
pub(crate) fn exp_fast(x: f64) -> f64 {
    if (-708.0..=709.0).contains(&x) {
        exp_reduced(x)
    } else {
        exp(x)
    }
}

#[cfg(all(test, feature = "std"))]
mod tests {
    use super::exp_reduced;

    /// The scalar form of `exp_reduced` (the same operations the package runs on simd128
    /// lanes) against the platform's `exp` (glibc on the test machine: a different algorithm,
    /// table-driven, < 1 ulp) at 20 001 points over [−708, 709] and at the ends of every
    /// reduction interval: within the a-priori 3.4e-16 plus one ulp of the reference.
    #[test]
    fn exp_reduced_against_the_platform_exp() {
        let mut worst = 0.0f64;
        let mut check = |x: f64| {
            let want = x.exp();
            let got = exp_reduced(x);
            let rel = ((got - want) / want).abs();
            worst = worst.max(rel);
            assert!(
                rel <= 3.4e-16 + f64::EPSILON / 2.0,
                "exp({x:e}): {got:e} vs {want:e}, rel {rel:e}"
            );
        };
        for i in 0..=20_000 {
            check(-708.0 + 1417.0 * f64::from(i) / 20_000.0);
        }
        for k in -1021..=1022 {
            let half = 0.5 * core::f64::consts::LN_2;
            let c = f64::from(k) * core::f64::consts::LN_2;
            for x in [c - half, c + half, c] {
                if (-708.0..=709.0).contains(&x) {
                    check(x);
                }
            }
        }
        eprintln!("exp_reduced vs platform exp: worst relative difference {worst:e}");
        assert!(worst > 0.0, "the comparison ran");
    }
}
