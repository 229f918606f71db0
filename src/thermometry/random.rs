//! Seeded, reproducible pseudo-random numbers for the Monte Carlo method: the xoshiro256**
//! generator (seeded through SplitMix64) and samplers for the input distributions of
//! [`super::gum::Distribution`].
//!
//! # Method
//! - **Generator:** xoshiro256** (Blackman & Vigna), 256 bits of state, period 2²⁵⁶ − 1,
//!   passes BigCrush; the state is filled from a 64-bit seed by four SplitMix64 outputs, as
//!   its authors recommend. Checked against the published outputs for the state {1, 2, 3, 4}
//!   and SplitMix64's for seed 1234567 (`tests/gum_monte_carlo.rs`).
//! - **Uniform (0, 1):** (⌊x/2¹¹⌋ + ½)·2⁻⁵³ — the 53 high bits, centred in their cell, so 0
//!   and 1 never occur (safe for logarithms).
//! - **Normal:** Box–Muller, r = √(−2 ln u₁), (r cos 2πu₂, r sin 2πu₂); the second deviate is
//!   kept for the next call (JCGM 101 Annex C recommends this transform).
//! - **Rectangular / triangular / arcsine:** x + a(2u − 1); x + a(u₁ + u₂ − 1); x + a·cos πu.
//! - **Student's t:** Bailey's polar method: u, v uniform on (−1, 1) with w = u² + v² < 1,
//!   t = u·√(ν(w^(−2/ν) − 1)/w) — exact for every real ν > 0.
//!
//! A sampler's whole state is plain data ([`Sampler`] is `Copy`), so a run interrupted after
//! any number of draws continues with exactly the numbers an uninterrupted run would draw.
//!
//! # References
//! - D. Blackman, S. Vigna, "Scrambled linear pseudorandom number generators", ACM Trans.
//!   Math. Softw. 47(4), 36 (2021), doi:10.1145/3460772 (xoshiro256**, reference code
//!   <https://prng.di.unimi.it/>).
//! - G. L. Steele, D. Lea, C. H. Flood, "Fast splittable pseudorandom number generators",
//!   OOPSLA 2014, doi:10.1145/2660193.2660195 (SplitMix64).
//! - G. E. P. Box, M. E. Muller, "A note on the generation of random normal deviates", Ann.
//!   Math. Statist. 29, 610–611 (1958).
//! - R. W. Bailey, "Polar generation of random variates with the t-distribution", Math.
//!   Comp. 62, 779–781 (1994).
//! - JCGM 101:2008, §6.4 (distributions) and Annex C (sampling).
#![forbid(unsafe_code)]

use super::gum::Distribution;
use crate::float::{ln, powf, sqrt};
use crate::{Error, Result};

/// One SplitMix64 step: advances `state` and returns the next output.
///
/// # Formula
/// ```text
/// state += 0x9E3779B97F4A7C15;  z = state;
/// z = (z ⊕ (z >> 30))·0xBF58476D1CE4E5B9;  z = (z ⊕ (z >> 27))·0x94D049BB133111EB;  z ⊕ (z >> 31)
/// ```
///
/// # Errors
/// None.
///
/// # Accuracy
/// Exact integer arithmetic (wrapping).
///
/// # Examples
/// ```
/// use quantaband::thermometry::random::splitmix64;
/// // Published SplitMix64 output for seed 1234567 (e.g. the rand_xoshiro test vector)
/// let mut s = 1234567u64;
/// assert_eq!(splitmix64(&mut s), 6457827717110365317);
/// ```
///
/// # References
/// Steele, Lea & Flood (2014), see the module docs.
#[inline(never)] // four draws seed the generator: one copy
pub fn splitmix64(state: &mut u64) -> u64 {
    *state = state.wrapping_add(0x9E37_79B9_7F4A_7C15);
    let mut z = *state;
    z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
    z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
    z ^ (z >> 31)
}

/// The xoshiro256** pseudo-random generator (64-bit outputs).
///
/// # Formula
/// ```text
/// out = rotl(s1·5, 7)·9;  t = s1 << 17;  s2 ⊕= s0;  s3 ⊕= s1;  s1 ⊕= s2;  s0 ⊕= s3;
/// s2 ⊕= t;  s3 = rotl(s3, 45)
/// ```
///
/// # Errors
/// [`Xoshiro256StarStar::from_state`]: `OutOfRange` for the all-zero state.
///
/// # Accuracy
/// Bit-exact with the reference implementation (published outputs checked in the tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::random::Xoshiro256StarStar;
/// // Reference outputs from the state {1, 2, 3, 4} (rand_xoshiro's test vector)
/// let mut g = Xoshiro256StarStar::from_state([1, 2, 3, 4]).unwrap();
/// assert_eq!([g.next_u64(), g.next_u64(), g.next_u64()], [11520, 0, 1509978240]);
/// ```
///
/// # References
/// Blackman & Vigna (2021), see the module docs.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Xoshiro256StarStar {
    s: [u64; 4],
}

impl Xoshiro256StarStar {
    /// A generator seeded from a 64-bit `seed` through four SplitMix64 outputs.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Xoshiro256StarStar;
    /// let (mut a, mut b) = (Xoshiro256StarStar::new(7), Xoshiro256StarStar::new(7));
    /// assert_eq!(a.next_u64(), b.next_u64()); // reproducible
    /// ```
    pub fn new(seed: u64) -> Self {
        let mut sm = seed;
        let s = [
            splitmix64(&mut sm),
            splitmix64(&mut sm),
            splitmix64(&mut sm),
            splitmix64(&mut sm),
        ];
        // SplitMix64 is a bijection of its counter, so four consecutive outputs are never all
        // zero; the guard documents the invariant.
        if s == [0; 4] {
            return Xoshiro256StarStar { s: [1, 0, 0, 0] };
        }
        Xoshiro256StarStar { s }
    }

    /// A generator with the given raw state (not all zero).
    ///
    /// # Errors
    /// `OutOfRange` (arg `state`) for the all-zero state, which the generator never leaves.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Xoshiro256StarStar;
    /// assert_eq!(Xoshiro256StarStar::from_state([0; 4]).unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    pub fn from_state(state: [u64; 4]) -> Result<Self> {
        if state == [0; 4] {
            return Err(Error::OutOfRange {
                arg: "state",
                value: 0.0,
                range: "not all zero",
            });
        }
        Ok(Xoshiro256StarStar { s: state })
    }

    /// The raw state (to save and restore a run).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Xoshiro256StarStar;
    /// let g = Xoshiro256StarStar::from_state([1, 2, 3, 4]).unwrap();
    /// assert_eq!(g.state(), [1, 2, 3, 4]);
    /// ```
    pub fn state(&self) -> [u64; 4] {
        self.s
    }

    /// The next 64-bit output.
    ///
    /// # Examples
    /// See [`Xoshiro256StarStar`].
    #[inline]
    pub fn next_u64(&mut self) -> u64 {
        let s = &mut self.s;
        let out = s[1].wrapping_mul(5).rotate_left(7).wrapping_mul(9);
        let t = s[1] << 17;
        s[2] ^= s[0];
        s[3] ^= s[1];
        s[1] ^= s[2];
        s[0] ^= s[3];
        s[2] ^= t;
        s[3] = s[3].rotate_left(45);
        out
    }

    /// A uniform deviate in the open interval (0, 1) from the 53 high bits.
    ///
    /// # Formula
    /// ```text
    /// u = (⌊x / 2¹¹⌋ + ½)·2⁻⁵³
    /// ```
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Xoshiro256StarStar;
    /// let mut g = Xoshiro256StarStar::from_state([1, 2, 3, 4]).unwrap();
    /// let _ = g.next_u64();
    /// // the second output is 0: the smallest value, ½·2⁻⁵³, not 0
    /// assert_eq!(g.next_open01(), 0.5 * 2f64.powi(-53));
    /// ```
    #[inline(never)] // one copy for every distribution (Sampler::sample draws it in six places)
    pub fn next_open01(&mut self) -> f64 {
        ((self.next_u64() >> 11) as f64 + 0.5) * (1.0 / 9_007_199_254_740_992.0)
    }
}

/// Samples of the input distributions of [`super::gum::Distribution`] from an
/// [`Xoshiro256StarStar`] stream (see the module docs for the methods).
///
/// # Examples
/// ```
/// use quantaband::thermometry::random::Sampler;
/// let mut s = Sampler::new(2024);
/// let n = 20_000;
/// let mean = (0..n).map(|_| s.standard_normal()).sum::<f64>() / n as f64;
/// assert!(mean.abs() < 0.03); // 4 standard errors
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sampler {
    rng: Xoshiro256StarStar,
    spare_normal: Option<f64>,
}

impl Sampler {
    /// A sampler seeded from `seed` (see [`Xoshiro256StarStar::new`]).
    ///
    /// # Examples
    /// See [`Sampler`].
    pub fn new(seed: u64) -> Self {
        Sampler {
            rng: Xoshiro256StarStar::new(seed),
            spare_normal: None,
        }
    }

    /// The underlying generator.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::{Sampler, Xoshiro256StarStar};
    /// assert_eq!(Sampler::new(1).generator().state(), Xoshiro256StarStar::new(1).state());
    /// ```
    pub fn generator(&self) -> &Xoshiro256StarStar {
        &self.rng
    }

    /// A uniform deviate in (0, 1).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Sampler;
    /// let u = Sampler::new(3).uniform();
    /// assert!(u > 0.0 && u < 1.0);
    /// ```
    #[inline]
    pub fn uniform(&mut self) -> f64 {
        self.rng.next_open01()
    }

    /// A standard normal deviate (Box–Muller; pairs, the second one cached).
    ///
    /// # Examples
    /// See [`Sampler`].
    #[inline]
    pub fn standard_normal(&mut self) -> f64 {
        if let Some(z) = self.spare_normal.take() {
            return z;
        }
        let u1 = self.uniform();
        let u2 = self.uniform();
        let r = sqrt(-2.0 * ln(u1));
        let (s, c) = crate::stats::sin_cos_turns(u2);
        self.spare_normal = Some(r * s);
        r * c
    }

    /// A standard Student's t deviate with `degrees_of_freedom` ν > 0 (Bailey's polar
    /// method; the caller guarantees ν > 0; ν = ∞ gives a standard normal deviate). For ν
    /// below about 0.06 a deviate can exceed the f64 range and is then ±∞.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::random::Sampler;
    /// let mut s = Sampler::new(11);
    /// let n = 40_000;
    /// // ν = 1 (Cauchy): P(|T| ≤ 1) = 1/2
    /// let inside = (0..n).filter(|_| s.student_t(1.0).abs() <= 1.0).count() as f64 / n as f64;
    /// assert!((inside - 0.5).abs() < 0.01);
    /// ```
    pub fn student_t(&mut self, degrees_of_freedom: f64) -> f64 {
        if degrees_of_freedom == f64::INFINITY {
            // The normal limit (below, ν·c2 would be ∞·0 = NaN).
            return self.standard_normal();
        }
        loop {
            let u = 2.0 * self.uniform() - 1.0;
            let v = 2.0 * self.uniform() - 1.0;
            let w = u * u + v * v;
            if w < 1.0 && w > 0.0 {
                let c2 = if degrees_of_freedom > 1e6 {
                    // w^(−2/ν) rounds to 1 for large ν: every deviate would be 0.
                    crate::float::expm1(-2.0 / degrees_of_freedom * ln(w))
                } else {
                    powf(w, -2.0 / degrees_of_freedom) - 1.0
                };
                return u * sqrt(degrees_of_freedom * c2 / w);
            }
        }
    }

    /// A deviate of `distribution` with estimate (centre) `estimate`, standard uncertainty
    /// `standard_uncertainty` and `degrees_of_freedom` (used by `StudentT` only), per
    /// [`super::gum::Distribution`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::gum::Distribution;
    /// use quantaband::thermometry::random::Sampler;
    /// let mut s = Sampler::new(5);
    /// let x = s.sample(Distribution::Rectangular, 10.0, 1.0, f64::INFINITY);
    /// assert!((x - 10.0).abs() <= 3f64.sqrt());
    /// ```
    #[inline]
    pub fn sample(
        &mut self,
        distribution: Distribution,
        estimate: f64,
        standard_uncertainty: f64,
        degrees_of_freedom: f64,
    ) -> f64 {
        let u = standard_uncertainty;
        match distribution {
            Distribution::Normal => estimate + u * self.standard_normal(),
            Distribution::Rectangular => estimate + u * SQRT_3 * (2.0 * self.uniform() - 1.0),
            Distribution::Triangular => {
                estimate + u * SQRT_6 * (self.uniform() + self.uniform() - 1.0)
            }
            Distribution::Arcsine => {
                estimate
                    + u * core::f64::consts::SQRT_2
                        * crate::stats::sin_cos_turns(0.5 * self.uniform()).1
            }
            Distribution::StudentT => estimate + u * self.student_t(degrees_of_freedom),
        }
    }
}

/// √3.
const SQRT_3: f64 = 1.732_050_807_568_877_2;
/// √6.
const SQRT_6: f64 = 2.449_489_742_783_178;
