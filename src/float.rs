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
