//! Private maths shim: the platform's maths through std's inherent `f64` methods when the `std`
//! feature is on, the pure-Rust `libm` crate otherwise. This is the only module that names
//! `libm`; everything else calls these functions.
#![allow(dead_code)]

macro_rules! unary {
    ($($(#[$m:meta])* $name:ident => $std:ident, $libm:ident;)*) => {$(
        $(#[$m])*
        #[inline(always)]
        pub(crate) fn $name(x: f64) -> f64 {
            #[cfg(feature = "std")]
            { x.$std() }
            #[cfg(not(feature = "std"))]
            { libm::$libm(x) }
        }
    )*};
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
    /// square root
    sqrt => sqrt, sqrt;
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
    /// absolute value
    abs => abs, fabs;
    /// largest integer ≤ x
    floor => floor, floor;
    /// smallest integer ≥ x
    ceil => ceil, ceil;
    /// nearest integer, ties away from zero
    round => round, round;
}

/// xʸ
#[inline(always)]
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

/// xⁿ for an integer n (repeated multiplication with std, `pow` without).
#[inline(always)]
pub(crate) fn powi(x: f64, n: i32) -> f64 {
    #[cfg(feature = "std")]
    {
        x.powi(n)
    }
    #[cfg(not(feature = "std"))]
    {
        libm::pow(x, n as f64)
    }
}

/// Fused multiply–add a·b + c.
#[inline(always)]
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

/// ln Γ(x) for x > 0.
#[inline(always)]
pub(crate) fn ln_gamma(x: f64) -> f64 {
    libm::lgamma(x)
}

/// Γ(x).
#[inline(always)]
pub(crate) fn gamma(x: f64) -> f64 {
    libm::tgamma(x)
}
