//! Fixed 20-point Gauss–Legendre quadrature on a finite interval.
//!
//! The rule integrates polynomials of degree ≤ 39 exactly. The response-weighted integrals of
//! this module family apply it per sub-interval of each linear segment of an instrument response
//! (see [`super::response`]), where the integrand is a linear function times the smooth Planck
//! function, so a fixed rule with enough sub-intervals reaches ~1e-15 relative accuracy.
//!
//! The nodes and weights below were computed with mpmath at 40 significant digits (roots of the
//! Legendre polynomial P₂₀ by `findroot`, weights 2/((1 − x²)·P₂₀′(x)²)) and rounded to f64;
//! `tests/data/gen_thermometry.py` recomputes them.
#![forbid(unsafe_code)]

/// Positive nodes xᵢ of the 20-point Gauss–Legendre rule on [−1, 1] (the rule uses ±xᵢ).
pub(crate) const NODES: [f64; 10] = [
    0.9931285991850949,
    0.9639719272779138,
    0.912234428251326,
    0.8391169718222188,
    0.7463319064601508,
    0.636053680726515,
    0.5108670019508271,
    0.37370608871541955,
    0.22778585114164507,
    0.07652652113349734,
];

/// Weights wᵢ belonging to [`NODES`] (each used for +xᵢ and −xᵢ).
pub(crate) const WEIGHTS: [f64; 10] = [
    0.017614007139152118,
    0.04060142980038694,
    0.06267204833410907,
    0.08327674157670475,
    0.10193011981724044,
    0.11819453196151841,
    0.13168863844917664,
    0.14209610931838204,
    0.14917298647260374,
    0.15275338713072584,
];

/// ∫ₐᵇ f(x) dx by the 20-point rule for a vector-valued integrand (so several integrals share
/// the node evaluations). Any `Err` from `f` is returned.
pub(crate) fn integrate<const N: usize, F>(a: f64, b: f64, mut f: F) -> crate::Result<[f64; N]>
where
    F: FnMut(f64) -> crate::Result<[f64; N]>,
{
    let half = 0.5 * (b - a);
    let mid = 0.5 * (a + b);
    let mut acc = [0.0; N];
    for (x, w) in NODES.iter().zip(WEIGHTS.iter()) {
        let p = f(mid + half * x)?;
        let m = f(mid - half * x)?;
        for ((s, pk), mk) in acc.iter_mut().zip(p.iter()).zip(m.iter()) {
            *s += w * (pk + mk);
        }
    }
    for s in acc.iter_mut() {
        *s *= half;
    }
    Ok(acc)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Exactness on monomials up to degree 39 is the defining property of the 20-point rule
    /// (any numerical-analysis text, e.g. Abramowitz & Stegun 25.4.29); ∫₀¹ xⁿ dx = 1/(n+1).
    #[test]
    fn exact_for_monomials_up_to_degree_39() {
        for n in 0..40i32 {
            let [v] = integrate(0.0, 1.0, |x| Ok([crate::float::powi(x, n)])).unwrap();
            let exact = 1.0 / f64::from(n + 1);
            assert!(
                (v - exact).abs() <= 4e-16 * exact.max(1.0) * 4.0,
                "degree {n}: {v} vs {exact}"
            );
        }
    }
}
