//! Mean occupation numbers of a single-particle level: Bose–Einstein, Fermi–Dirac and
//! Maxwell–Boltzmann.
//!
//! Every function exists in two forms: in terms of the reduced energy `x = (E − μ)/kT`
//! (dimensionless) and directly from the level energy `energy_j`, the chemical potential `mu_j`
//! (both in joules) and the temperature `temperature_k` (kelvin). Photons (μ = 0, E = hf) have
//! [`thermal_photon_number`].
//!
//! # Method
//! - Bose–Einstein `1/(eˣ − 1)`: for `0 < x ≤ 1` it is `1/expm1(x)`, so `x → 0` gives `≈ 1/x`
//!   without cancellation; for `x > 1` it is `e⁻ˣ/(−expm1(−x))`, which never overflows and returns
//!   the correct tiny value up to `x ≈ 745` (below the smallest subnormal only beyond that).
//! - Fermi–Dirac `1/(eˣ + 1)`: the side that is smaller than ½ is always computed directly,
//!   `e⁻ˣ/(1 + e⁻ˣ)` for `x > 0` and `1/(1 + eˣ)` for `x ≤ 0`, so both tails are accurate to a few
//!   ulp relative and `f(−x) = 1 − f(x)` holds to rounding.
//! - Maxwell–Boltzmann `e⁻ˣ` (any sign of x; overflows to `+∞` only for `x < −709.78`, where the
//!   true value exceeds the f64 range).
//! - The reduced energy is formed as `(E − μ)/(k·T)`, falling back to `((E − μ)/k)/T` when `k·T`
//!   underflows, so a very low temperature gives `x = ±∞` only when it truly is out of range.
#![forbid(unsafe_code)]

use crate::constants::BOLTZMANN_K;
use crate::error::{self, Error, Result};
use crate::float;

/// h/k in kelvin per hertz (the ratio of two exact SI constants, correctly rounded):
/// 4.799 243 073 366 221 248…e-11 K/Hz (mpmath, 40 digits, from h and k of SI 2019).
pub(crate) const H_OVER_K: f64 = 4.799_243_073_366_221e-11;

/// Reduced energy x = (E − μ)/(kT) from already validated inputs, avoiding a spurious 0/0 or
/// overflow when k·T underflows.
#[inline]
pub(crate) fn reduced_energy(delta_j: f64, temperature_k: f64) -> f64 {
    if delta_j == 0.0 {
        return 0.0;
    }
    let kt = BOLTZMANN_K * temperature_k;
    if kt >= f64::MIN_POSITIVE {
        delta_j / kt
    } else {
        (delta_j / BOLTZMANN_K) / temperature_k
    }
}

/// Reduced photon energy x = hf/(kT) from already validated inputs.
#[inline]
pub(crate) fn reduced_photon_energy(frequency_hz: f64, temperature_k: f64) -> f64 {
    (H_OVER_K * frequency_hz) / temperature_k
}

/// Bose–Einstein occupancy for an already validated `x > 0` (may be `+∞`).
#[inline]
pub(crate) fn be_unchecked(x: f64) -> f64 {
    if x <= 1.0 {
        1.0 / float::expm1(x)
    } else {
        let e = float::exp(-x);
        e / -float::expm1(-x)
    }
}

/// Fermi–Dirac occupancy for a non-NaN x.
#[inline]
pub(crate) fn fd_unchecked(x: f64) -> f64 {
    if x > 0.0 {
        let e = float::exp(-x);
        e / (1.0 + e)
    } else {
        1.0 / (1.0 + float::exp(x))
    }
}

/// Bose–Einstein mean occupation number of a level at reduced energy `x = (E − μ)/kT`
/// (dimensionless, result dimensionless).
///
/// # Formula
/// ```text
/// n_BE(x) = 1 / (eˣ − 1),   x = (E − μ)/(k T) > 0
/// ```
/// E level energy, μ chemical potential, k Boltzmann constant, T temperature. Limits:
/// `n → 1/x − 1/2` for `x → 0⁺`, `n → e⁻ˣ` (the Maxwell–Boltzmann value) for `x ≫ 1`.
///
/// # Errors
/// - [`Error::NonFinite`] if `x` is NaN or ±∞.
/// - [`Error::DivergentOccupation`] if `x ≤ 0` (E ≤ μ: the occupancy diverges at x = 0 and would
///   be negative below it, which no Bose system in equilibrium has).
///
/// Returns `+∞` for `0 < x < 1/f64::MAX ≈ 5.6e-309` (the true occupancy ≈ 1/x is then beyond
/// the f64 range).
///
/// # Accuracy
/// Within 2 ulp of the correctly rounded value (≈ 4.4e-16 relative) for every tested `x` in
/// `[1e-300, 745]`; measured against mpmath at 50 digits on the rows of
/// `tests/data/stats_reference.json` (`tests/stats_reference.rs`). Underflows to 0 only for
/// `x > 745.13`, where the true value is below the smallest subnormal.
///
/// # Examples
/// ```
/// use quantaband::stats::bose_einstein;
/// // 1/(e − 1) = 0.581976706869326424385… (mpmath, 30 digits)
/// let n = bose_einstein(1.0).unwrap();
/// assert!((n - 0.581_976_706_869_326_4).abs() < 1e-16);
/// assert!(bose_einstein(0.0).is_err());
/// ```
///
/// # References
/// - S. N. Bose, "Plancks Gesetz und Lichtquantenhypothese", Z. Phys. 26, 178–181 (1924),
///   doi:10.1007/BF01327326.
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed., Freeman (1980), ch. 6, eq. (6.72)
///   (from memory).
pub fn bose_einstein(x: f64) -> Result<f64> {
    error::finite("x", x)?;
    if x <= 0.0 {
        return Err(Error::DivergentOccupation { x });
    }
    Ok(be_unchecked(x))
}

/// Bose–Einstein mean occupation number of a level of energy `energy_j` (J) with chemical
/// potential `mu_j` (J) at temperature `temperature_k` (K); result dimensionless.
///
/// # Formula
/// ```text
/// n_BE = 1 / (e^{(E − μ)/(k T)} − 1)
/// ```
/// E = `energy_j`, μ = `mu_j`, T = `temperature_k`, k Boltzmann constant (exact, SI 2019).
///
/// # Errors
/// - [`Error::NonFinite`] if any input is NaN or ±∞.
/// - [`Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
/// - [`Error::DivergentOccupation`] if `energy_j ≤ mu_j`.
///
/// Returns `+∞` when `E > μ` but `(E − μ)/kT` is below the smallest subnormal (the true
/// occupancy ≈ kT/(E − μ) is then beyond the f64 range).
///
/// # Accuracy
/// That of [`bose_einstein`] plus the rounding of `x = (E − μ)/(kT)` (≤ 2 ulp of x), which
/// propagates with condition number `x·eˣ/(eˣ − 1)`, i.e. ≈ 1 for small x and ≈ x for large x.
///
/// # Examples
/// ```
/// use quantaband::constants::BOLTZMANN_K;
/// use quantaband::stats::bose_einstein_energy;
/// // E − μ = kT exactly: 1/(e − 1) = 0.5819767068693264… (mpmath)
/// let t = 300.0;
/// let n = bose_einstein_energy(BOLTZMANN_K * t, 0.0, t).unwrap();
/// assert!((n - 0.581_976_706_869_326_4).abs() < 1e-15);
/// ```
///
/// # References
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed., Freeman (1980), ch. 6 (from memory).
pub fn bose_einstein_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> Result<f64> {
    error::finite("energy_j", energy_j)?;
    error::finite("mu_j", mu_j)?;
    error::temperature("temperature_k", temperature_k)?;
    let x = reduced_energy(energy_j - mu_j, temperature_k);
    if energy_j <= mu_j || x.is_nan() {
        return Err(Error::DivergentOccupation { x });
    }
    if x == 0.0 {
        // E > μ but (E − μ)/kT underflowed: the occupancy ≈ kT/(E − μ) exceeds the f64 range.
        return Ok(f64::INFINITY);
    }
    Ok(be_unchecked(x))
}

/// Mean number of thermal photons in one mode of frequency `frequency_hz` (Hz) at temperature
/// `temperature_k` (K): the Bose–Einstein occupancy with μ = 0 and E = hf. Dimensionless.
///
/// # Formula
/// ```text
/// n̄(f, T) = 1 / (e^{h f/(k T)} − 1)
/// ```
/// h Planck constant, k Boltzmann constant (both exact, SI 2019), f = `frequency_hz`,
/// T = `temperature_k`. For `hf ≪ kT` it tends to `kT/(hf) − 1/2` (Rayleigh–Jeans regime).
///
/// # Errors
/// - [`Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`Error::NonPositiveSpectral`] if `frequency_hz ≤ 0`.
/// - [`Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// Returns `+∞` when `hf/kT` is below the smallest subnormal (the true occupancy ≈ kT/(hf) is
/// then beyond the f64 range).
///
/// # Accuracy
/// Within 4 ulp relative for `hf/kT ≤ 1`; for larger `x = hf/kT` the rounding of x (≤ 1.5 ulp)
/// is amplified by x, e.g. ≈ 1e-14 relative at x = 100 (measured against mpmath at 50 digits,
/// `tests/stats_reference.rs`). Returns 0 only where the true value is below 4.9e-324.
///
/// # Examples
/// ```
/// use quantaband::stats::thermal_photon_number;
/// // A 100 GHz mode at 2.725 K: hf/kT = 1.761 190 118 666…, n̄ = 0.207 496 474 004 473 7… (mpmath, 40 digits)
/// let n = thermal_photon_number(100e9, 2.725).unwrap();
/// assert!((n / 0.207_496_474_004_473_7 - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// - M. Planck, "Ueber das Gesetz der Energieverteilung im Normalspectrum", Ann. Phys. 309,
///   553–563 (1901), doi:10.1002/andp.19013090310.
pub fn thermal_photon_number(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("temperature_k", temperature_k)?;
    let x = reduced_photon_energy(frequency_hz, temperature_k);
    if x > 0.0 {
        Ok(be_unchecked(x))
    } else {
        // hf/kT underflowed to 0: the occupancy is kT/hf, beyond the f64 range.
        Ok(f64::INFINITY)
    }
}

/// Fermi–Dirac mean occupation number of a level at reduced energy `x = (E − μ)/kT`
/// (dimensionless, result in [0, 1]).
///
/// # Formula
/// ```text
/// f_FD(x) = 1 / (eˣ + 1),    f_FD(−x) = 1 − f_FD(x)
/// ```
/// E level energy, μ chemical potential (Fermi level), k Boltzmann constant, T temperature.
///
/// # Errors
/// - [`Error::NonFinite`] if `x` is NaN or ±∞.
///
/// # Accuracy
/// Within 2 ulp relative on both sides (the smaller of f and 1 − f is always computed directly),
/// measured against mpmath at 50 digits for `x` in `[−745, 745]` (`tests/stats_reference.rs`).
/// Underflows to 0 only for `x > 745.13`.
///
/// # Examples
/// ```
/// use quantaband::stats::fermi_dirac;
/// assert_eq!(fermi_dirac(0.0).unwrap(), 0.5);
/// // 1/(e^40 + 1) = 4.248354255291588…e-18 (mpmath, 30 digits)
/// let f = fermi_dirac(40.0).unwrap();
/// assert!((f / 4.248_354_255_291_588e-18 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// - E. Fermi, "Zur Quantelung des idealen einatomigen Gases", Z. Phys. 36, 902–912 (1926),
///   doi:10.1007/BF01400221.
/// - P. A. M. Dirac, "On the theory of quantum mechanics", Proc. R. Soc. A 112, 661–677 (1926),
///   doi:10.1098/rspa.1926.0133.
pub fn fermi_dirac(x: f64) -> Result<f64> {
    error::finite("x", x)?;
    Ok(fd_unchecked(x))
}

/// Fermi–Dirac mean occupation number of a level of energy `energy_j` (J) with chemical
/// potential `mu_j` (J) at temperature `temperature_k` (K); result dimensionless in [0, 1].
///
/// # Formula
/// ```text
/// f_FD = 1 / (e^{(E − μ)/(k T)} + 1)
/// ```
/// E = `energy_j`, μ = `mu_j` (the Fermi level), T = `temperature_k`, k Boltzmann constant.
///
/// # Errors
/// - [`Error::NonFinite`] if any input is NaN or ±∞.
/// - [`Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// That of [`fermi_dirac`] plus the rounding of `x = (E − μ)/(kT)` (≤ 2 ulp of x), amplified by
/// `|x|·(1 − f)` on the small side.
///
/// # Examples
/// ```
/// use quantaband::constants::BOLTZMANN_K;
/// use quantaband::stats::fermi_dirac_energy;
/// let t = 77.0;
/// // A level exactly at the Fermi level is half filled.
/// assert_eq!(fermi_dirac_energy(1e-20, 1e-20, t).unwrap(), 0.5);
/// // One kT above it: 1/(e + 1) = 0.2689414213699951… (mpmath)
/// let f = fermi_dirac_energy(BOLTZMANN_K * t, 0.0, t).unwrap();
/// assert!((f - 0.268_941_421_369_995_1).abs() < 1e-15);
/// ```
///
/// # References
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed., Freeman (1980), ch. 7 (from memory).
pub fn fermi_dirac_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> Result<f64> {
    error::finite("energy_j", energy_j)?;
    error::finite("mu_j", mu_j)?;
    error::temperature("temperature_k", temperature_k)?;
    let x = reduced_energy(energy_j - mu_j, temperature_k);
    if x.is_nan() {
        // Only reachable if E − μ overflowed to ±∞ and was divided by ∞, which finite inputs
        // cannot produce; keep the public API panic- and NaN-free regardless.
        return Err(Error::NonFinite {
            arg: "energy_j",
            value: energy_j,
        });
    }
    Ok(fd_unchecked(x))
}

/// Maxwell–Boltzmann (classical) occupancy `e⁻ˣ` of a level at reduced energy
/// `x = (E − μ)/kT` (dimensionless, result dimensionless).
///
/// # Formula
/// ```text
/// n_MB(x) = e^{−x}
/// ```
/// The common large-x limit of [`bose_einstein`] and [`fermi_dirac`].
///
/// # Errors
/// - [`Error::NonFinite`] if `x` is NaN or ±∞.
///
/// # Accuracy
/// That of the platform `exp` (≤ 1 ulp with std, libm otherwise). Returns `+∞` for
/// `x < −709.78` (true value above f64 range) and 0 for `x > 745.13`.
///
/// # Examples
/// ```
/// use quantaband::stats::maxwell_boltzmann;
/// // e^{-1} = 0.36787944117144233… (DLMF §4.4 / mpmath)
/// assert!((maxwell_boltzmann(1.0).unwrap() - 0.367_879_441_171_442_33).abs() < 1e-16);
/// ```
///
/// # References
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed., Freeman (1980), ch. 6 (from memory).
pub fn maxwell_boltzmann(x: f64) -> Result<f64> {
    error::finite("x", x)?;
    Ok(float::exp(-x))
}

/// Maxwell–Boltzmann occupancy of a level of energy `energy_j` (J) with chemical potential
/// `mu_j` (J) at temperature `temperature_k` (K); result dimensionless.
///
/// # Formula
/// ```text
/// n_MB = e^{−(E − μ)/(k T)}
/// ```
///
/// # Errors
/// - [`Error::NonFinite`] if any input is NaN or ±∞.
/// - [`Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// That of `exp` plus the rounding of x amplified by |x| (≈ 1e-14 relative at |x| = 100).
///
/// # Examples
/// ```
/// use quantaband::constants::BOLTZMANN_K;
/// use quantaband::stats::maxwell_boltzmann_energy;
/// let t = 500.0;
/// let n = maxwell_boltzmann_energy(2.0 * BOLTZMANN_K * t, BOLTZMANN_K * t, t).unwrap();
/// assert!((n - 0.367_879_441_171_442_33).abs() < 1e-15); // e^{-1}
/// ```
///
/// # References
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed., Freeman (1980), ch. 6 (from memory).
pub fn maxwell_boltzmann_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> Result<f64> {
    error::finite("energy_j", energy_j)?;
    error::finite("mu_j", mu_j)?;
    error::temperature("temperature_k", temperature_k)?;
    let x = reduced_energy(energy_j - mu_j, temperature_k);
    if x.is_nan() {
        return Err(Error::NonFinite {
            arg: "energy_j",
            value: energy_j,
        });
    }
    Ok(float::exp(-x))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fd_half_at_zero_and_symmetry() {
        assert_eq!(fd_unchecked(0.0), 0.5);
        for &x in &[1e-10, 0.3, 1.0, 5.0, 36.0, 100.0] {
            let s = fd_unchecked(x) + fd_unchecked(-x);
            assert!((s - 1.0).abs() <= 2.0 * f64::EPSILON, "x={x} s={s}");
        }
    }

    #[test]
    fn be_small_x_limit() {
        // n = 1/x − 1/2 + x/12 − … (Bernoulli expansion of 1/(eˣ−1), DLMF §24.2, from memory)
        let x = 1e-6;
        let n = be_unchecked(x);
        let series = 1.0 / x - 0.5 + x / 12.0;
        assert!((n / series - 1.0).abs() < 1e-15);
    }

    #[test]
    fn be_large_x_no_overflow() {
        let n = be_unchecked(700.0);
        assert!(n > 0.0 && (n / float::exp(-700.0) - 1.0).abs() < 1e-15);
        assert!(be_unchecked(744.0) > 0.0);
        assert_eq!(be_unchecked(800.0), 0.0);
    }

    #[test]
    fn errors() {
        assert_eq!(
            bose_einstein(-1.0),
            Err(Error::DivergentOccupation { x: -1.0 })
        );
        assert!(matches!(
            bose_einstein(f64::NAN),
            Err(Error::NonFinite { .. })
        ));
        assert!(matches!(
            bose_einstein_energy(1.0e-21, 1.0e-21, 300.0),
            Err(Error::DivergentOccupation { .. })
        ));
        assert!(matches!(
            fermi_dirac_energy(0.0, 0.0, 0.0),
            Err(Error::NonPositiveTemperature { .. })
        ));
        assert!(matches!(
            thermal_photon_number(0.0, 300.0),
            Err(Error::NonPositiveSpectral { .. })
        ));
    }

    #[test]
    fn tiny_temperature_gives_limits_not_nan() {
        // k·T underflows here; x must still be ±∞ with the right sign.
        assert_eq!(fermi_dirac_energy(1e-20, 0.0, 1e-300).unwrap(), 0.0);
        assert_eq!(fermi_dirac_energy(-1e-20, 0.0, 1e-300).unwrap(), 1.0);
        assert_eq!(bose_einstein_energy(1e-20, 0.0, 1e-300).unwrap(), 0.0);
        assert_eq!(thermal_photon_number(1e9, 1e-300).unwrap(), 0.0);
    }
}
