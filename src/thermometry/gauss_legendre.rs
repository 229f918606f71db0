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

/// A symmetric Gauss–Legendre rule on [−1, 1]: its positive nodes and their weights (each
/// used for +xᵢ and −xᵢ; even orders only). The n-point rule integrates polynomials of degree
/// ≤ 2n − 1 exactly. Nodes and weights of the 4-, 6- and 8-point rules were computed like the
/// 20-point ones (mpmath, 40 digits) and are recomputed by `tests/data/gen_spectral.py`.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Rule {
    pub(crate) nodes: &'static [f64],
    pub(crate) weights: &'static [f64],
}

/// The 4-point rule.
pub(crate) const GL4: Rule = Rule {
    nodes: &[0.8611363115940526, 0.33998104358485626],
    weights: &[0.34785484513745385, 0.6521451548625461],
};

/// The 6-point rule.
pub(crate) const GL6: Rule = Rule {
    nodes: &[0.932469514203152, 0.6612093864662645, 0.2386191860831969],
    weights: &[0.17132449237917036, 0.3607615730481386, 0.46791393457269104],
};

/// The 8-point rule.
pub(crate) const GL8: Rule = Rule {
    nodes: &[
        0.9602898564975363,
        0.7966664774136267,
        0.525532409916329,
        0.1834346424956498,
    ],
    weights: &[
        0.10122853629037626,
        0.22238103445337448,
        0.31370664587788727,
        0.362683783378362,
    ],
};

/// The 20-point rule ([`NODES`], [`WEIGHTS`]).
pub(crate) const GL20: Rule = Rule {
    nodes: &NODES,
    weights: &WEIGHTS,
};

/// ∫ₐᵇ f(x) dx by `rule` for a vector-valued integrand, as [`integrate`] (which is this with
/// [`GL20`], written out), with the two nodes of each symmetric pair evaluated in one call:
/// `f([mid + h·x, mid − h·x], out)` writes the integrand at both into `out[0]` and `out[1]`
/// (so it can evaluate them on two lanes; `out` is reused from pair to pair, not cleared, so
/// `f` writes every entry it is asked for). The same sums in the same order as [`integrate`],
/// so the same result to the bit. Only the first `len` entries are summed (the others stay 0):
/// an integrand with fewer outputs than its array holds pays only for those.
pub(crate) fn integrate_rule_pairs<const N: usize, F>(
    rule: &Rule,
    a: f64,
    b: f64,
    len: usize,
    mut f: F,
) -> crate::Result<[f64; N]>
where
    F: FnMut([f64; 2], &mut [[f64; N]; 2]) -> crate::Result<()>,
{
    let half = 0.5 * (b - a);
    let mid = 0.5 * (a + b);
    let mut acc = [0.0; N];
    let mut pm = [[0.0; N]; 2];
    for (x, w) in rule.nodes.iter().zip(rule.weights.iter()) {
        f([mid + half * x, mid - half * x], &mut pm)?;
        let [p, m] = &pm;
        for ((s, pk), mk) in acc.iter_mut().zip(p.iter()).zip(m.iter()).take(len) {
            *s += w * (pk + mk);
        }
    }
    for s in acc.iter_mut().take(len) {
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

    /// The rule applied node by node, through the paired form.
    fn integrate_rule<const N: usize>(
        rule: &Rule,
        a: f64,
        b: f64,
        f: impl Fn(f64) -> crate::Result<[f64; N]>,
    ) -> crate::Result<[f64; N]> {
        integrate_rule_pairs(rule, a, b, N, |[p, m], out| {
            *out = [f(p)?, f(m)?];
            Ok(())
        })
    }

    /// Each shorter rule is exact on monomials up to degree 2n − 1 (the defining property of
    /// Gauss–Legendre quadrature, e.g. Abramowitz & Stegun 25.4.29); ∫₀¹ xᵏ dx = 1/(k+1). The
    /// 20-point rule through `integrate_rule_pairs` equals `integrate` bit for bit.
    #[test]
    fn shorter_rules_exact_up_to_degree_2n_minus_1() {
        for rule in [GL4, GL6, GL8, GL20] {
            let n = 2 * rule.nodes.len() as i32;
            for k in 0..2 * n {
                let [v] =
                    integrate_rule(&rule, 0.0, 1.0, |x| Ok([crate::float::powi(x, k)])).unwrap();
                let exact = 1.0 / f64::from(k + 1);
                assert!(
                    (v - exact).abs() <= 2e-15 * exact,
                    "n = {n}, degree {k}: {v} vs {exact}"
                );
            }
            // degree 2n is not exact (the rule has exactly the order it claims; for n = 20 the
            // error on x⁴⁰ is below the rounding)
            if n == 20 {
                continue;
            }
            let [v] =
                integrate_rule(&rule, 0.0, 1.0, |x| Ok([crate::float::powi(x, 2 * n)])).unwrap();
            assert!(
                (v - 1.0 / f64::from(2 * n + 1)).abs() > 1e-15 / f64::from(n),
                "n = {n}"
            );
        }
        let f = |x: f64| Ok([crate::float::exp(-x) / (1.0 + x)]);
        assert_eq!(
            integrate(0.1, 2.3, f).unwrap(),
            integrate_rule(&GL20, 0.1, 2.3, f).unwrap()
        );
    }
}
