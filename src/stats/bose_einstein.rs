//! Bose–Einstein integrals g_s(z) = Li_s(z) for fugacity 0 ≤ z ≤ 1, and the critical
//! temperature of the ideal Bose gas.
//!
//! # Convention
//! ```text
//! g_s(z) = 1/Γ(s) ∫₀^∞ t^{s−1} / (z⁻¹eᵗ − 1) dt = Σ_{k≥1} z^k / k^s = Li_s(z),   g_s(1) = ζ(s)
//! ```
//! (normalised like the Fermi–Dirac integrals of this module; z = e^{μ/kT} the fugacity.)
//!
//! # Method (no allocation, ≤ 55 terms)
//! - `z ≤ 1/2`, and every z for integer s ≥ 22: the defining series `Σ z^k/k^s`, summed until a
//!   term is below 1e-17 of the sum (geometric with ratio ≤ 1/2, or ≤ 2^{−22} at z = 1).
//! - `1/2 < z ≤ 1`: the expansion in μ = ln z ∈ (−ln 2, 0] (Robinson 1951):
//!   ```text
//!   non-integer s:  Li_s(e^μ) = Γ(1−s)(−μ)^{s−1} + Σ_{k≥0} ζ(s−k) μ^k / k!
//!   integer s = n:  Li_n(e^μ) = μ^{n−1}/(n−1)! · [H_{n−1} − ln(−μ)] + Σ_{k≥0, k≠n−1} ζ(n−k) μ^k / k!
//!   ```
//!   (H_m the harmonic number). The sum converges like (|μ|/2π)^k ≤ 0.11^k; 31 terms are used,
//!   with ζ at s−k from `tables.rs` (mpmath, 50 digits). At z = 1 the result is ζ(s) itself.
//!
//! # References
//! - J. E. Robinson, "Note on the Bose–Einstein integral functions", Phys. Rev. 83, 678–679
//!   (1951), doi:10.1103/PhysRev.83.678.
//! - NIST DLMF §25.12(ii)–(iii) (polylogarithms, Bose–Einstein integrals) and §25.6 (ζ at
//!   integers), <https://dlmf.nist.gov/25.12>.
//! - D. C. Wood, "The computation of polylogarithms", Technical Report 15-92, University of Kent
//!   Computing Laboratory (1992), §9 (the integer-order logarithmic term) (from memory).
#![forbid(unsafe_code)]

use super::tables::{ROBINSON_3_2, ROBINSON_5_2, ZETA_NONPOSITIVE, ZETA_POSITIVE};
use crate::error::{self, Error, Result};
use crate::float;

/// The orders s of the Bose–Einstein integral [`bose_einstein_integral`] supports
/// (dimensionless).
///
/// # Formula
/// ```text
/// s ∈ {3/2, 5/2} ∪ {2, 3, 4, …},   g_s(z) = Σ_{k≥1} z^k/k^s
/// ```
///
/// # Errors
/// None here; `Integer(n)` with n < 2 is rejected by [`bose_einstein_integral`] and
/// [`BoseOrder::from_s`] with `UNSUPPORTED`.
///
/// # Accuracy
/// Exact (a label).
///
/// # Examples
/// ```
/// use quantaband::stats::BoseOrder;
/// assert_eq!(BoseOrder::FiveHalves.s(), 2.5);
/// ```
///
/// # References
/// - NIST DLMF §25.12, <https://dlmf.nist.gov/25.12>.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum BoseOrder {
    /// s = 3/2: number density of the ideal Bose gas, n·λ³ = g_{3/2}(z).
    ThreeHalves,
    /// s = 5/2: pressure and energy of the ideal Bose gas, P·λ³/kT = g_{5/2}(z).
    FiveHalves,
    /// Integer s = n ≥ 2 (n = 4 gives the photon energy, n = 3 the photon number at z = 1).
    Integer(u32),
}

impl BoseOrder {
    /// The order s as a number (1.5, 2.5 or n; dimensionless).
    ///
    /// # Formula
    /// ```text
    /// ThreeHalves → 3/2, FiveHalves → 5/2, Integer(n) → n
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact (every u32 is an f64).
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::BoseOrder;
    /// assert_eq!(BoseOrder::Integer(3).s(), 3.0);
    /// ```
    ///
    /// # References
    /// - NIST DLMF §25.12, <https://dlmf.nist.gov/25.12>.
    pub fn s(self) -> f64 {
        match self {
            BoseOrder::ThreeHalves => 1.5,
            BoseOrder::FiveHalves => 2.5,
            BoseOrder::Integer(n) => f64::from(n),
        }
    }

    /// The order for a numeric s (dimensionless): 1.5, 2.5 or an integer ≥ 2 (up to 2³²−1).
    ///
    /// # Formula
    /// ```text
    /// 1.5 → ThreeHalves, 2.5 → FiveHalves, n ∈ {2, 3, …} → Integer(n) (exact comparison)
    /// ```
    ///
    /// # Errors
    /// [`Error::Unsupported`] for any other value (including NaN and s < 2 integers, where
    /// g_s(1) diverges).
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::BoseOrder;
    /// assert_eq!(BoseOrder::from_s(4.0).unwrap(), BoseOrder::Integer(4));
    /// assert!(BoseOrder::from_s(1.0).is_err());
    /// ```
    ///
    /// # References
    /// - NIST DLMF §25.12, <https://dlmf.nist.gov/25.12>.
    pub fn from_s(s: f64) -> Result<BoseOrder> {
        if s == 1.5 {
            Ok(BoseOrder::ThreeHalves)
        } else if s == 2.5 {
            Ok(BoseOrder::FiveHalves)
        } else if s >= 2.0 && s <= f64::from(u32::MAX) && float::floor(s) == s {
            Ok(BoseOrder::Integer(s as u32))
        } else {
            Err(UNSUPPORTED)
        }
    }
}

const UNSUPPORTED: Error = Error::Unsupported {
    what: "Bose-Einstein integral order s; supported: 1.5, 2.5 and integers >= 2",
};

/// Γ(−1/2) = −2√π (mpmath).
const GAMMA_MINUS_1_2: f64 = -3.544_907_701_811_032;
/// Γ(−3/2) = 4√π/3 (mpmath).
const GAMMA_MINUS_3_2: f64 = 2.363_271_801_207_355;
/// Integer orders from this one on use the direct series for every z.
const DIRECT_ORDER_MIN: u32 = 22;

/// k^s for k ≥ 1 (n ≤ 1100 for integers; larger n are handled before).
#[inline]
fn k_pow(order: BoseOrder, k: f64) -> f64 {
    match order {
        BoseOrder::ThreeHalves => k * float::sqrt(k),
        BoseOrder::FiveHalves => k * k * float::sqrt(k),
        BoseOrder::Integer(n) => float::powi(k, n as i32),
    }
}

fn direct_series(order: BoseOrder, z: f64) -> f64 {
    let mut sum = z;
    let mut zk = z;
    let mut k = 1.0;
    while k < 80.0 {
        k += 1.0;
        zk *= z;
        let term = zk / k_pow(order, k);
        sum += term;
        if term <= 1e-17 * sum {
            break;
        }
    }
    sum
}

/// Σ c_k μ^k by Horner's rule.
fn horner(c: &[f64], mu: f64) -> f64 {
    c.iter()
        .rev()
        .fold(0.0, |acc, &ck| float::mul_add(acc, mu, ck))
}

fn robinson_integer(n: u32, mu: f64) -> f64 {
    // Σ_{k≠n−1} ζ(n−k) μ^k/k!, k = 0..=30, plus the logarithmic term at k = n−1.
    let mut sum = 0.0;
    let mut pow_over_fact = 1.0; // μ^k / k!
    let mut harmonic = 0.0; // H_k
    let n = n as i64;
    for k in 0..=30i64 {
        if k > 0 {
            pow_over_fact *= mu / k as f64;
        }
        let m = n - k;
        let zeta = if m >= 2 {
            ZETA_POSITIVE.get((m - 2) as usize).copied()
        } else if m <= 0 {
            ZETA_NONPOSITIVE.get((-m) as usize).copied()
        } else {
            // m = 1: H_{n−1} − ln(−μ) replaces the pole of ζ at 1.
            Some(harmonic - float::ln(-mu))
        };
        sum += zeta.unwrap_or(0.0) * pow_over_fact;
        harmonic += 1.0 / (k + 1) as f64;
    }
    sum
}

/// g_s(z) for validated 0 ≤ z ≤ 1 and supported order.
pub(crate) fn bose_integral_unchecked(order: BoseOrder, z: f64) -> f64 {
    if z == 0.0 {
        return 0.0;
    }
    if let BoseOrder::Integer(n) = order {
        if n >= 1100 {
            // 2^{−n} is below 2^{−1100}: every term after z is lost to rounding.
            return z;
        }
        if n >= DIRECT_ORDER_MIN || z <= 0.5 {
            return direct_series(order, z);
        }
        if z == 1.0 {
            if let Some(&zeta) = ZETA_POSITIVE.get(n.saturating_sub(2) as usize) {
                return zeta;
            }
        }
        return robinson_integer(n, float::ln(z));
    }
    if z <= 0.5 {
        return direct_series(order, z);
    }
    let mu = float::ln(z);
    match order {
        BoseOrder::ThreeHalves => GAMMA_MINUS_1_2 * float::sqrt(-mu) + horner(&ROBINSON_3_2, mu),
        _ => {
            let r = float::sqrt(-mu);
            GAMMA_MINUS_3_2 * (-mu) * r + horner(&ROBINSON_5_2, mu)
        }
    }
}

/// Bose–Einstein integral g_s(z) = Li_s(z) (dimensionless) at fugacity `fugacity` = z = e^{μ/kT}
/// (dimensionless, 0 ≤ z ≤ 1), for s = 3/2, 5/2 or an integer ≥ 2.
///
/// # Formula
/// ```text
/// g_s(z) = 1/Γ(s) ∫₀^∞ t^{s−1} / (z⁻¹eᵗ − 1) dt = Σ_{k≥1} z^k / k^s,    g_s(1) = ζ(s)
/// ```
/// t = E/kT, μ ≤ 0 the chemical potential, ζ the Riemann zeta function. The ideal Bose gas has
/// n·λ_T³ = g_{3/2}(z) and P·λ_T³/(kT) = g_{5/2}(z), with λ_T = h/√(2πmkT). Method: see the
/// module documentation.
///
/// # Errors
/// - [`Error::NonFinite`] if `fugacity` is NaN or ±∞.
/// - [`Error::OutOfRange`] if `fugacity` is outside [0, 1] (for z > 1 the Bose integrals are
///   complex; the gas would have μ > 0).
/// - [`Error::Unsupported`] for `BoseOrder::Integer(n)` with n < 2 (g_1(1) and g_0(1) diverge).
///
/// # Accuracy
/// Measured against mpmath `polylog`/`zeta` at 50 digits over 224 rows (14 orders × 16 values of
/// z from 0 to 1, including 1 − 1e-10 and 1): maximum relative error 6.9e-16 (at s = 3/2,
/// z = 0.51, where the two terms of the μ-expansion partly cancel), asserted ≤ 1e-15 in
/// `tests/stats_reference.rs`; ζ(s) at z = 1 is exact to the last bit for the tested s.
///
/// # Examples
/// ```
/// use quantaband::stats::{bose_einstein_integral, BoseOrder};
/// // g_{3/2}(1) = ζ(3/2) = 2.612375348685488343… (DLMF §25.12, value from mpmath)
/// let g = bose_einstein_integral(BoseOrder::ThreeHalves, 1.0).unwrap();
/// assert!((g - 2.612_375_348_685_488).abs() < 1e-15);
/// // g_2(1/2) = Li₂(1/2) = π²/12 − (ln 2)²/2 (DLMF §25.12, equation number not checked)
/// let li2 = bose_einstein_integral(BoseOrder::Integer(2), 0.5).unwrap();
/// let exact = std::f64::consts::PI.powi(2) / 12.0 - std::f64::consts::LN_2.powi(2) / 2.0;
/// assert!((li2 - exact).abs() < 1e-15);
/// ```
///
/// # References
/// - J. E. Robinson, Phys. Rev. 83, 678–679 (1951), doi:10.1103/PhysRev.83.678.
/// - NIST DLMF §25.12, <https://dlmf.nist.gov/25.12>.
pub fn bose_einstein_integral(order: BoseOrder, fugacity: f64) -> Result<f64> {
    let z = error::unit_interval_closed("fugacity", fugacity)?;
    if let BoseOrder::Integer(n) = order {
        if n < 2 {
            return Err(UNSUPPORTED);
        }
    }
    Ok(bose_integral_unchecked(order, z))
}

/// h²/(2πk) in K·kg·m² (= 2πħ²/k; from the exact SI 2019 h and k, mpmath).
const H2_OVER_2PI_K: f64 = 5.061_146_491_205_542e-45;

/// Critical temperature (K) of Bose–Einstein condensation of an ideal gas of spin-0 bosons with
/// number density `number_density_per_m3` (m⁻³) and particle mass `mass_kg` (kg).
///
/// # Formula
/// ```text
/// T_c = (2πħ² / (m k)) · (n / ζ(3/2))^{2/3}
/// ```
/// n number density, m particle mass, ħ reduced Planck constant, k Boltzmann constant,
/// ζ(3/2) = 2.612 375 348 685 488… It follows from n·λ_T³ = ζ(3/2) with λ_T = h/√(2πmkT).
/// For particles with g internal states, pass n/g. Trapped (non-uniform) gases have a different
/// formula.
///
/// # Errors
/// - [`Error::NonFinite`] if an input is NaN or ±∞.
/// - [`Error::NonPositive`] if `number_density_per_m3 ≤ 0` or `mass_kg ≤ 0`.
///
/// A true T_c above `f64::MAX` (an absurdly dense gas or light particle) returns `+∞`.
///
/// # Accuracy
/// Maximum relative error 3.6e-16 against mpmath at 50 digits on the 6 reference rows
/// (n from 1e12 to 1e300 m⁻³; `tests/stats_reference.rs`); the CODATA 2018 uncertainty of a mass in kg (3e-10 relative
/// for u and m_e) dominates in practice.
///
/// # Examples
/// ```
/// use quantaband::constants::ATOMIC_MASS_U;
/// use quantaband::stats::bose_critical_temperature;
/// // An invented cold-atom cell: 1e20 m⁻³ of bosons of mass 87 u → 3.979 148 738 153 343e-7 K
/// // (mpmath, 50 digits; see tests/data/stats_reference.json)
/// let tc = bose_critical_temperature(1e20, 87.0 * ATOMIC_MASS_U).unwrap();
/// assert!((tc / 3.979_148_738_153_343e-7 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - A. Einstein, "Quantentheorie des einatomigen idealen Gases. Zweite Abhandlung",
///   Sitzungsber. Preuss. Akad. Wiss., 3–14 (1925).
/// - K. Huang, *Statistical Mechanics*, 2nd ed., Wiley (1987), §12.3, eq. (12.52) (from memory).
pub fn bose_critical_temperature(number_density_per_m3: f64, mass_kg: f64) -> Result<f64> {
    let n = error::positive("number_density_per_m3", number_density_per_m3)?;
    let m = error::positive("mass_kg", mass_kg)?;
    let zeta_3_2 = ROBINSON_3_2[0];
    // (h²/2πk)·(n/ζ)^{2/3} stays within range for every positive n; the final division by m
    // then over- or underflows only when the true value does.
    // cbrt(·)² rather than powf(·, 2/3): the rounded exponent 2/3 would cost ln(n)·4e-17.
    let c = float::cbrt(n / zeta_3_2);
    Ok(H2_OVER_2PI_K * (c * c) / m)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn series_and_expansion_agree_at_half() {
        for order in [
            BoseOrder::ThreeHalves,
            BoseOrder::FiveHalves,
            BoseOrder::Integer(2),
            BoseOrder::Integer(3),
            BoseOrder::Integer(7),
        ] {
            let a = direct_series(order, 0.5);
            let mu = float::ln(0.5);
            let b = match order {
                BoseOrder::ThreeHalves => {
                    GAMMA_MINUS_1_2 * float::sqrt(-mu) + horner(&ROBINSON_3_2, mu)
                }
                BoseOrder::FiveHalves => {
                    GAMMA_MINUS_3_2 * (-mu) * float::sqrt(-mu) + horner(&ROBINSON_5_2, mu)
                }
                BoseOrder::Integer(n) => robinson_integer(n, mu),
            };
            assert!((a / b - 1.0).abs() < 2e-15, "{order:?}: {a} vs {b}");
        }
    }

    #[test]
    fn rejects_bad_input() {
        assert!(matches!(
            bose_einstein_integral(BoseOrder::Integer(1), 0.5),
            Err(Error::Unsupported { .. })
        ));
        assert!(matches!(
            bose_einstein_integral(BoseOrder::ThreeHalves, 1.5),
            Err(Error::OutOfRange { .. })
        ));
        assert!(matches!(
            bose_critical_temperature(0.0, 1e-27),
            Err(Error::NonPositive { .. })
        ));
        assert!(BoseOrder::from_s(f64::NAN).is_err());
        assert!(BoseOrder::from_s(2.5000001).is_err());
    }

    #[test]
    fn huge_integer_order_is_z() {
        assert_eq!(
            bose_einstein_integral(BoseOrder::Integer(u32::MAX), 0.75),
            Ok(0.75)
        );
        assert_eq!(
            bose_einstein_integral(BoseOrder::Integer(1099), 1.0),
            Ok(1.0)
        );
    }
}
