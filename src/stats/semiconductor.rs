//! Semiconductor carrier statistics for parabolic bands: effective densities of states,
//! electron and hole densities from the Fermi level with the complete Fermi–Dirac integral
//! F_{1/2} (and the Boltzmann approximation with its error), the Varshni temperature dependence
//! of the band gap, the intrinsic carrier density and Fermi level, and the Fermi level from a
//! carrier density.
//!
//! # Conventions
//! - Energies are in joules, measured from the **valence-band maximum** E_v = 0, so the
//!   conduction-band minimum is at E_c = E_g(T). Reduced Fermi levels are
//!   η_n = (E_F − E_c)/kT for electrons and η_p = (E_v − E_F)/kT for holes.
//! - Effective masses are **density-of-states** masses in units of the free-electron mass
//!   m_e (CODATA 2018), temperature independent (for silicon, m_de = 6^{2/3}(m_l m_t²)^{1/3}
//!   ≈ 1.08 includes the six conduction valleys).
//! - F_{1/2} is normalised (F_{1/2}(η) → e^η for η → −∞; see [`super::fermi_dirac_integral`]),
//!   so n = N_c·F_{1/2}(η_n) and the Boltzmann approximation is n ≈ N_c·e^{η_n}.
//!
//! ```text
//! N_c,v(T) = 2·(2π m*_{c,v} m_e k T / h²)^{3/2}
//! n = N_c F_{1/2}(η_n),   p = N_v F_{1/2}(η_p)
//! E_g(T) = E_g(0) − αT²/(T + β)                              (Varshni)
//! n_i (Boltzmann) = √(N_c N_v)·exp(−E_g/2kT),   E_i (Boltzmann) = E_g/2 + (kT/2)·ln(N_v/N_c)
//! ```
//!
//! The intrinsic level is also solved exactly with Fermi–Dirac statistics, n(E_F) = p(E_F)
//! (Newton's method on ln n − ln p in E_F/kT, from the Boltzmann value); the two differ in
//! narrow-gap materials and at high temperature. With Boltzmann statistics n·p = n_i²
//! regardless of E_F (mass-action law); with Fermi–Dirac statistics this holds only while
//! both bands are non-degenerate.
//!
//! # Numerics
//! For η ≤ −3 the densities are evaluated as N·e^η·t(η) (N·e^η as exp(ln N + η) where e^η
//! leaves the normal range) with
//! t = F_{1/2}/e^η = Σ (−1)^{k+1} e^{(k−1)η}/k^{3/2}, and the relative error of the Boltzmann
//! approximation as Σ_{k≥2} (−1)^k e^{(k−1)η}/k^{3/2} divided by t, so neither underflows nor
//! cancels however far below the band edge the Fermi level lies; above, expm1(η − ln F_{1/2}).
//!
//! # References
//! - S. M. Sze, K. K. Ng, *Physics of Semiconductor Devices*, 3rd ed., Wiley (2007), §1.4
//!   (carrier concentration, effective densities of states, intrinsic Fermi level)
//!   (from memory).
//! - Y. P. Varshni, "Temperature dependence of the energy gap in semiconductors", Physica 34,
//!   149–154 (1967), doi:10.1016/0031-8914(67)90062-6.
//! - J. S. Blakemore, "Approximations for Fermi–Dirac integrals, especially the function
//!   F_{1/2}(η) used to describe electron density in a semiconductor", Solid-State Electronics
//!   25, 1067–1076 (1982), doi:10.1016/0038-1101(82)90143-5.
#![forbid(unsafe_code)]
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use super::fermi_dirac::{fermi_dirac_integral, inverse_fermi_dirac_half, FdOrder};
use crate::constants::BOLTZMANN_K;
use crate::error::{self, Error, Result};
use crate::float;

/// 2·(2π m_e k/h²)^{3/2}, m⁻³·K^{−3/2} (mpmath, 40 digits, from SI 2019 h, k and CODATA 2018
/// m_e: 4.829 366 079 143 929 687…e21).
const NC_COEF: f64 = 4.829_366_079_143_93e21;

/// ln N for a density of states `n` = N(m*, T) that may have over- or underflowed: formed from
/// ln m* and ln T when `n` is not a positive finite number.
fn ln_dos(n: f64, effective_mass_ratio: f64, temperature_k: f64) -> f64 {
    if n > 0.0 && n.is_finite() {
        float::ln(n)
    } else {
        float::ln(NC_COEF) + 1.5 * (float::ln(effective_mass_ratio) + float::ln(temperature_k))
    }
}

/// Σ_{k≥1} (−1)^{k+1} q^{k−1}/k^{j+1} (= F_j(η)/e^η with q = e^η ≤ e⁻³), and the same sum
/// from k = 2 with the opposite sign, for j = 1/2 (`power` = 1.5) or −1/2 (0.5).
fn tail_sums(q: f64, power: f64) -> (f64, f64) {
    let (mut t, mut s) = (1.0, 0.0);
    let mut qk = 1.0;
    for k in 2..40 {
        qk *= q;
        // k^{3/2} = k·√k and k^{1/2} = √k: no `pow` (1.4 KB of the WebAssembly module for
        // this sum alone); ≤ 1 ulp more rounding in terms that are corrections below e⁻³.
        let kf = k as f64;
        let root = float::sqrt(kf);
        let term = qk / if power > 1.0 { kf * root } else { root };
        // (−1)^{k+1}: k = 2 is subtracted from t and added to s.
        if k % 2 == 0 {
            t -= term;
            s += term;
        } else {
            t += term;
            s -= term;
        }
        if term < 1e-18 * t {
            break;
        }
    }
    (t, s)
}

/// ln F_{1/2}(η) without underflow.
fn ln_f_half(eta: f64) -> f64 {
    if eta <= -3.0 {
        eta + float::ln(tail_sums(float::exp(eta), 1.5).0)
    } else {
        float::ln(fermi_dirac_integral(FdOrder::Half, eta).unwrap_or(f64::NAN))
    }
}

/// F_{−1/2}(η)/F_{1/2}(η) = d ln F_{1/2}/dη, in (0, 1].
fn log_derivative(eta: f64) -> f64 {
    if eta <= -3.0 {
        let q = float::exp(eta);
        tail_sums(q, 0.5).0 / tail_sums(q, 1.5).0
    } else {
        fermi_dirac_integral(FdOrder::MinusHalf, eta).unwrap_or(f64::NAN)
            / fermi_dirac_integral(FdOrder::Half, eta).unwrap_or(f64::NAN)
    }
}

/// Effective density of states (m⁻³) of a parabolic band with density-of-states effective
/// mass `effective_mass_ratio` (m*/m_e, dimensionless) at `temperature_k` (K).
///
/// # Formula
/// ```text
/// N = 2·(2π m* m_e k T / h²)^{3/2} = 2.509 412…e25 m⁻³ · (m*/m_e)^{3/2} · (T/300 K)^{3/2}
/// ```
/// m_e electron mass (CODATA 2018), k Boltzmann and h Planck constants (SI 2019).
///
/// # Errors
/// `NON_FINITE`; `NON_POSITIVE` for an effective mass ≤ 0; `NON_POSITIVE_TEMPERATURE`. A true
/// value above `f64::MAX` (m*·T beyond about 1.1e191 K) returns +∞.
///
/// # Accuracy
/// ≤ 2.0e-16 relative against mpmath on 8 rows, m* from 1e-3 to 50 and T from 1 mK to 1e5 K
/// (`tests/quantum_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::effective_density_of_states;
/// // Free-electron mass at 300 K: 2.509 412 225 228 095 8e25 m⁻³ (mpmath), the 2.51e19 cm⁻³
/// // of the textbooks; silicon's conduction band (m* = 1.08): 2.8e19 cm⁻³ (Sze, from memory).
/// let n = effective_density_of_states(1.0, 300.0).unwrap();
/// assert!((n / 2.509_412_225_228_095_8e25 - 1.0).abs() < 1e-15);
/// let nc = effective_density_of_states(1.08, 300.0).unwrap();
/// assert!((nc / 1e6 / 2.8e19 - 1.0).abs() < 0.01);
/// ```
///
/// # References
/// Sze & Ng, *Physics of Semiconductor Devices*, 3rd ed. (2007), §1.4.1 (from memory).
pub fn effective_density_of_states(effective_mass_ratio: f64, temperature_k: f64) -> Result<f64> {
    error::positive("effective_mass_ratio", effective_mass_ratio)?;
    error::temperature("temperature_k", temperature_k)?;
    let y = effective_mass_ratio * temperature_k;
    Ok(NC_COEF * y * float::sqrt(y))
}

/// Band gap (J) at `temperature_k` (K) by Varshni's relation from the 0 K gap
/// `band_gap_0k_j` (J) and the parameters `alpha_j_per_k` (J/K) and `beta_k` (K).
///
/// # Formula
/// ```text
/// E_g(T) = E_g(0) − α T² / (T + β)
/// ```
///
/// # Errors
/// `NON_FINITE`; `NON_POSITIVE` for E_g(0) ≤ 0 or β ≤ 0; `OUT_OF_RANGE` for α < 0;
/// `NON_POSITIVE_TEMPERATURE`; `NO_SOLUTION` when the formula gives E_g(T) ≤ 0 (the
/// parameters do not describe the material at that temperature).
///
/// # Accuracy
/// ≤ 2.1e-16 relative against mpmath on 5 rows (`tests/quantum_reference.rs`). The formula
/// itself is an empirical fit; its parameters come with their source's range of validity.
///
/// # Examples
/// ```
/// use quantaband::stats::varshni_band_gap;
/// const EV: f64 = 1.602_176_634e-19;
/// // Silicon, E_g(0) = 1.170 eV, α = 4.73e-4 eV/K, β = 636 K (parameters as quoted by Sze,
/// // from memory): 1.1245 eV at 300 K, the "1.12 eV" of the tables.
/// let eg = varshni_band_gap(1.170 * EV, 4.73e-4 * EV, 636.0, 300.0).unwrap() / EV;
/// assert!((eg - (1.170 - 4.73e-4 * 90_000.0 / 936.0)).abs() < 1e-14);
/// assert!((eg - 1.12).abs() < 0.005);
/// ```
///
/// # References
/// Y. P. Varshni, Physica 34, 149–154 (1967), doi:10.1016/0031-8914(67)90062-6.
pub fn varshni_band_gap(
    band_gap_0k_j: f64,
    alpha_j_per_k: f64,
    beta_k: f64,
    temperature_k: f64,
) -> Result<f64> {
    error::positive("band_gap_0k_j", band_gap_0k_j)?;
    error::finite("alpha_j_per_k", alpha_j_per_k)?;
    if alpha_j_per_k < 0.0 {
        return Err(Error::OutOfRange {
            arg: "alpha_j_per_k",
            value: alpha_j_per_k,
            range: "[0, inf)",
        });
    }
    error::positive("beta_k", beta_k)?;
    error::temperature("temperature_k", temperature_k)?;
    // T²/(T + β) = T·(T/(T + β)) avoids overflow of T².
    let eg = band_gap_0k_j
        - alpha_j_per_k * (temperature_k * (temperature_k / (temperature_k + beta_k)));
    if !(eg > 0.0) {
        return Err(Error::NoSolution {
            what: "the Varshni band gap is <= 0 at this temperature",
        });
    }
    Ok(eg)
}

/// Carrier density of one band with Fermi–Dirac statistics and in the Boltzmann
/// approximation, returned by [`band_carrier_density`] and the [`Semiconductor`] methods
/// (densities in m⁻³).
///
/// # Examples
/// See [`band_carrier_density`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct CarrierDensity {
    /// N·F_{1/2}(η), m⁻³; +∞ only where the true value is above `f64::MAX`.
    pub density_per_m3: f64,
    /// N·e^η, m⁻³; +∞ where the true value is beyond the f64 range (η + ln N > 709.78, far
    /// into degeneracy, where the Boltzmann approximation is meaningless).
    pub boltzmann_density_per_m3: f64,
    /// (N e^η − N F_{1/2}(η)) / (N F_{1/2}(η)) = e^η/F_{1/2}(η) − 1 (≥ 0, dimensionless); +∞
    /// where e^η/F_{1/2}(η) is beyond the f64 range (η ≳ 719.3).
    pub boltzmann_relative_error: f64,
    /// The reduced Fermi level η used (dimensionless).
    pub reduced_fermi_level: f64,
}

/// Carrier density (m⁻³) of a parabolic band with effective density of states
/// `effective_density_per_m3` (m⁻³) at reduced Fermi level `reduced_fermi_level`
/// η (dimensionless; η = (E_F − E_c)/kT for electrons, (E_v − E_F)/kT for holes), with the
/// Boltzmann approximation and its relative error.
///
/// # Formula
/// ```text
/// n = N·F_{1/2}(η),   n_B = N·e^η,   error = n_B/n − 1 = e^η/F_{1/2}(η) − 1
/// ```
///
/// # Errors
/// `NON_FINITE`; `NON_POSITIVE` for N ≤ 0.
///
/// # Accuracy
/// Density ≤ 2.1e-16 relative against mpmath quadrature of the Fermi–Dirac integral
/// (`tests/quantum_reference.rs`, 14 rows, η from −800 to 100; where e^η is outside the
/// normal range, |η| ≳ 690, add ≈ 1.1e-16·|ln N + η| from the logarithmic form). The
/// Boltzmann error ≤ 1.3e-14 relative over the same range (no cancellation: it is summed
/// directly for η ≤ −3; above, the rounding of η − ln F_{1/2} is amplified by up to η).
///
/// # Examples
/// ```
/// use quantaband::stats::band_carrier_density;
/// // At η = 0 Boltzmann overestimates by 1/F_{1/2}(0) − 1 = 0.306 938 363…,
/// // F_{1/2}(0) = (1 − 2^{−1/2})·ζ(3/2) (DLMF 25.12, from memory).
/// let c = band_carrier_density(1e25, 0.0).unwrap();
/// let f0 = (1.0 - 0.5f64.sqrt()) * 2.612_375_348_685_488_3;
/// assert!((c.density_per_m3 / (1e25 * f0) - 1.0).abs() < 1e-15);
/// assert!((c.boltzmann_relative_error - (1.0 / f0 - 1.0)).abs() < 1e-15);
/// ```
///
/// # References
/// J. S. Blakemore, Solid-State Electronics 25, 1067–1076 (1982).
pub fn band_carrier_density(
    effective_density_per_m3: f64,
    reduced_fermi_level: f64,
) -> Result<CarrierDensity> {
    let n = error::positive("effective_density_per_m3", effective_density_per_m3)?;
    let eta = error::finite("reduced_fermi_level", reduced_fermi_level)?;
    let q = float::exp(eta);
    // N·e^η, in logarithms only where e^η leaves the normal range (|η| ≳ 690).
    let boltzmann = if q > 1e-300 && q < 1e300 {
        n * q
    } else {
        float::exp(float::ln(n) + eta)
    };
    let (density, error) = if eta <= -3.0 {
        let (t, s) = tail_sums(q, 1.5);
        (boltzmann * t, s / t)
    } else if eta > 1e100 {
        // F_{1/2}(η) = η^{3/2}/Γ(5/2)·(1 + O(η⁻²)) may exceed f64::MAX while N·F does not:
        // ((N·η)/Γ(5/2))·√η, where N·η ≥ 5e-224 is normal and overflows only if N·F does.
        // 1/Γ(5/2) = 0.752 252 778 063 675 (mpmath); e^η/F is far beyond the f64 range.
        (
            (n * eta) * 0.752_252_778_063_675 * float::sqrt(eta),
            f64::INFINITY,
        )
    } else {
        let f = fermi_dirac_integral(FdOrder::Half, eta)?;
        (n * f, float::expm1(eta - float::ln(f)))
    };
    Ok(CarrierDensity {
        density_per_m3: density,
        boltzmann_density_per_m3: boltzmann,
        boltzmann_relative_error: error,
        reduced_fermi_level: eta,
    })
}

/// A semiconductor described by its density-of-states effective masses and a Varshni band
/// gap; energies in J measured from the valence-band maximum (see the module docs).
///
/// # Formula
/// ```text
/// N_c = N(m_e*, T), N_v = N(m_h*, T),   E_c = E_g(T) = E_g(0) − αT²/(T + β),   E_v = 0
/// ```
///
/// # Errors
/// Every method checks the fields first: `NON_POSITIVE` for a mass, E_g(0) or β ≤ 0,
/// `OUT_OF_RANGE` for α < 0, `NON_FINITE`.
///
/// # Accuracy
/// See the methods.
///
/// # Examples
/// ```
/// use quantaband::stats::Semiconductor;
/// const EV: f64 = 1.602_176_634e-19;
/// // Silicon-like parameters (m_de = 1.08, m_dh = 0.81; Varshni 1.170 eV, 4.73e-4 eV/K, 636 K;
/// // Sze, from memory).
/// let si = Semiconductor::new(1.08, 0.81, 1.170 * EV, 4.73e-4 * EV, 636.0).unwrap();
/// let i = si.intrinsic(300.0).unwrap();
/// // n_i ≈ 8e15 m⁻³ (8e9 cm⁻³ with these masses and gap); Fermi–Dirac and Boltzmann agree
/// assert!((i.density_per_m3 / 8.0e15 - 1.0).abs() < 0.05);
/// assert!((i.density_per_m3 / i.boltzmann_density_per_m3 - 1.0).abs() < 1e-8);
/// // mass-action law in the non-degenerate limit: n·p = n_i² for a Fermi level 0.3 eV above E_v
/// let n = si.electron_density(0.3 * EV, 300.0).unwrap().density_per_m3;
/// let p = si.hole_density(0.3 * EV, 300.0).unwrap().density_per_m3;
/// assert!((n * p / (i.density_per_m3 * i.density_per_m3) - 1.0).abs() < 1e-5);
/// ```
///
/// # References
/// See the module docs.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct Semiconductor {
    /// Electron density-of-states effective mass m_de/m_e (dimensionless, > 0).
    pub electron_mass_ratio: f64,
    /// Hole density-of-states effective mass m_dh/m_e (dimensionless, > 0).
    pub hole_mass_ratio: f64,
    /// Band gap at 0 K, J (> 0).
    pub band_gap_0k_j: f64,
    /// Varshni α, J/K (≥ 0; 0 for a constant gap).
    pub varshni_alpha_j_per_k: f64,
    /// Varshni β, K (> 0).
    pub varshni_beta_k: f64,
}

/// Intrinsic carrier density and Fermi level of a [`Semiconductor`], exact (Fermi–Dirac) and in
/// the Boltzmann approximation; returned by [`Semiconductor::intrinsic`].
///
/// # Examples
/// See [`Semiconductor`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct IntrinsicCarriers {
    /// n_i = n = p with Fermi–Dirac statistics, m⁻³; +∞ only where the true value is above
    /// `f64::MAX`.
    pub density_per_m3: f64,
    /// √(N_c N_v)·exp(−E_g/2kT), m⁻³; +∞ only where the true value is above `f64::MAX`.
    pub boltzmann_density_per_m3: f64,
    /// Intrinsic Fermi level with Fermi–Dirac statistics, J above E_v.
    pub fermi_level_j: f64,
    /// E_g/2 + (kT/2)·ln(N_v/N_c), J above E_v.
    pub boltzmann_fermi_level_j: f64,
    /// E_g(T), J.
    pub band_gap_j: f64,
}

impl Semiconductor {
    /// A validated semiconductor (arguments as the fields, units in their names).
    ///
    /// # Formula
    /// See [`Semiconductor`].
    ///
    /// # Errors
    /// `NON_FINITE`; `NON_POSITIVE` for an effective mass, E_g(0) or β ≤ 0; `OUT_OF_RANGE`
    /// for α < 0.
    ///
    /// # Accuracy
    /// Exact (stores the values).
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// let e = Semiconductor::new(0.0, 0.81, 1.8e-19, 7.6e-23, 636.0).unwrap_err();
    /// assert_eq!(e.code(), "NON_POSITIVE");
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn new(
        electron_mass_ratio: f64,
        hole_mass_ratio: f64,
        band_gap_0k_j: f64,
        varshni_alpha_j_per_k: f64,
        varshni_beta_k: f64,
    ) -> Result<Semiconductor> {
        let s = Semiconductor {
            electron_mass_ratio,
            hole_mass_ratio,
            band_gap_0k_j,
            varshni_alpha_j_per_k,
            varshni_beta_k,
        };
        s.validate()?;
        Ok(s)
    }

    fn validate(&self) -> Result<()> {
        error::positive("electron_mass_ratio", self.electron_mass_ratio)?;
        error::positive("hole_mass_ratio", self.hole_mass_ratio)?;
        // Checks E_g(0), α and β (at an arbitrary valid temperature).
        varshni_band_gap(
            self.band_gap_0k_j,
            self.varshni_alpha_j_per_k,
            self.varshni_beta_k,
            1e-300,
        )?;
        Ok(())
    }

    /// Band gap E_g(T) (J) at `temperature_k` (K), by [`varshni_band_gap`].
    ///
    /// # Formula
    /// ```text
    /// E_g(T) = E_g(0) − αT²/(T + β)
    /// ```
    ///
    /// # Errors
    /// Field errors (see [`Semiconductor`]); as [`varshni_band_gap`].
    ///
    /// # Accuracy
    /// As [`varshni_band_gap`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// let s = Semiconductor::new(1.0, 1.0, 2e-19, 0.0, 100.0).unwrap();
    /// assert_eq!(s.band_gap_j(500.0).unwrap(), 2e-19);
    /// ```
    ///
    /// # References
    /// Varshni (1967).
    pub fn band_gap_j(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        varshni_band_gap(
            self.band_gap_0k_j,
            self.varshni_alpha_j_per_k,
            self.varshni_beta_k,
            temperature_k,
        )
    }

    /// Conduction-band effective density of states N_c (m⁻³) at `temperature_k` (K).
    ///
    /// # Formula
    /// ```text
    /// N_c = 2·(2π m_de m_e k T/h²)^{3/2}
    /// ```
    ///
    /// # Errors
    /// Field errors; `NON_FINITE` / `NON_POSITIVE_TEMPERATURE`. +∞ where the true value is above
    /// `f64::MAX`, as for [`effective_density_of_states`].
    ///
    /// # Accuracy
    /// As [`effective_density_of_states`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::{effective_density_of_states, Semiconductor};
    /// let s = Semiconductor::new(1.08, 0.81, 1.8e-19, 0.0, 1.0).unwrap();
    /// assert_eq!(s.conduction_band_density_of_states(300.0).unwrap(),
    ///            effective_density_of_states(1.08, 300.0).unwrap());
    /// ```
    ///
    /// # References
    /// Sze & Ng (2007), §1.4.1 (from memory).
    pub fn conduction_band_density_of_states(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        effective_density_of_states(self.electron_mass_ratio, temperature_k)
    }

    /// Valence-band effective density of states N_v (m⁻³) at `temperature_k` (K).
    ///
    /// # Formula
    /// ```text
    /// N_v = 2·(2π m_dh m_e k T/h²)^{3/2}
    /// ```
    ///
    /// # Errors
    /// As [`Semiconductor::conduction_band_density_of_states`] (including +∞ for a true value
    /// above `f64::MAX`).
    ///
    /// # Accuracy
    /// As [`effective_density_of_states`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::{effective_density_of_states, Semiconductor};
    /// let s = Semiconductor::new(1.08, 0.81, 1.8e-19, 0.0, 1.0).unwrap();
    /// assert_eq!(s.valence_band_density_of_states(300.0).unwrap(),
    ///            effective_density_of_states(0.81, 300.0).unwrap());
    /// ```
    ///
    /// # References
    /// Sze & Ng (2007), §1.4.1 (from memory).
    pub fn valence_band_density_of_states(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        effective_density_of_states(self.hole_mass_ratio, temperature_k)
    }

    /// kT (J) and E_g(T) (J) after validating everything.
    fn kt_and_gap(&self, temperature_k: f64) -> Result<(f64, f64)> {
        let eg = self.band_gap_j(temperature_k)?;
        Ok((BOLTZMANN_K * temperature_k, eg))
    }

    /// kT, E_g, the effective density of states N and ln N of the conduction band (or, with
    /// `holes`, of the valence band) at `temperature_k`. One out-of-line copy for every method
    /// (each inlined its own copy before, about 1 KB of the WebAssembly module).
    #[inline(never)]
    fn band(&self, holes: bool, temperature_k: f64) -> Result<(f64, f64, f64, f64)> {
        let (kt, eg) = self.kt_and_gap(temperature_k)?;
        let m = if holes {
            self.hole_mass_ratio
        } else {
            self.electron_mass_ratio
        };
        let n = effective_density_of_states(m, temperature_k)?;
        Ok((kt, eg, n, ln_dos(n, m, temperature_k)))
    }

    /// Electron density (m⁻³) in the conduction band for a Fermi level `fermi_level_j` (J above
    /// E_v) at `temperature_k` (K), with the Boltzmann approximation and its error.
    ///
    /// # Formula
    /// ```text
    /// n = N_c F_{1/2}(η_n),   η_n = (E_F − E_g(T))/kT
    /// ```
    ///
    /// # Errors
    /// Field errors; `NON_FINITE`; `NON_POSITIVE_TEMPERATURE`; `NO_SOLUTION` (Varshni gap ≤ 0).
    ///
    /// # Accuracy
    /// As [`band_carrier_density`] plus the rounding of η (relative error ≈ 1.1e-16·|η| in n).
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// const EV: f64 = 1.602_176_634e-19;
    /// let s = Semiconductor::new(1.08, 0.81, 1.170 * EV, 4.73e-4 * EV, 636.0).unwrap();
    /// // Fermi level at the conduction-band edge (η = 0): Boltzmann is 30.7 % too high
    /// let eg = s.band_gap_j(300.0).unwrap();
    /// let n = s.electron_density(eg, 300.0).unwrap();
    /// assert!((n.boltzmann_relative_error - 0.306_938_363_237_534_3).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Sze & Ng (2007), §1.4.1 (from memory).
    pub fn electron_density(
        &self,
        fermi_level_j: f64,
        temperature_k: f64,
    ) -> Result<CarrierDensity> {
        error::finite("fermi_level_j", fermi_level_j)?;
        let (kt, eg, nc, _) = self.band(false, temperature_k)?;
        band_carrier_density(nc, (fermi_level_j - eg) / kt)
    }

    /// Hole density (m⁻³) in the valence band for a Fermi level `fermi_level_j` (J above E_v)
    /// at `temperature_k` (K), with the Boltzmann approximation and its error.
    ///
    /// # Formula
    /// ```text
    /// p = N_v F_{1/2}(η_p),   η_p = (0 − E_F)/kT
    /// ```
    ///
    /// # Errors
    /// As [`Semiconductor::electron_density`].
    ///
    /// # Accuracy
    /// As [`Semiconductor::electron_density`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// let s = Semiconductor::new(1.0, 1.0, 1.8e-19, 0.0, 1.0).unwrap();
    /// // Equal masses: the hole density at E_F equals the electron density at E_g − E_F
    /// let p = s.hole_density(0.2e-19, 300.0).unwrap().density_per_m3;
    /// let n = s.electron_density(1.6e-19, 300.0).unwrap().density_per_m3;
    /// assert!((p / n - 1.0).abs() < 1e-14);
    /// ```
    ///
    /// # References
    /// Sze & Ng (2007), §1.4.1 (from memory).
    pub fn hole_density(&self, fermi_level_j: f64, temperature_k: f64) -> Result<CarrierDensity> {
        error::finite("fermi_level_j", fermi_level_j)?;
        let (kt, _, nv, _) = self.band(true, temperature_k)?;
        band_carrier_density(nv, -fermi_level_j / kt)
    }

    /// Fermi level (J above E_v) at which the conduction band holds `electron_density_per_m3`
    /// (m⁻³) electrons at `temperature_k` (K): the inverse of F_{1/2}.
    ///
    /// # Formula
    /// ```text
    /// E_F = E_g(T) + kT·F_{1/2}⁻¹(n/N_c)
    /// ```
    ///
    /// # Errors
    /// Field errors; `NON_FINITE`; `NON_POSITIVE` (density ≤ 0); `NON_POSITIVE_TEMPERATURE`;
    /// `NO_SOLUTION` (Varshni gap ≤ 0).
    ///
    /// # Accuracy
    /// ≤ 7.2e-16 relative against mpmath `findroot` with quadrature on 27 rows
    /// (`tests/quantum_reference.rs`); round trips E_F → n → E_F within 1e-12 eV
    /// (`tests/quantum_limits.rs`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// let s = Semiconductor::new(0.067, 0.5, 2.4e-19, 0.0, 1.0).unwrap();
    /// let n = s.electron_density(2.45e-19, 300.0).unwrap().density_per_m3; // degenerate n-type
    /// let ef = s.fermi_level_from_electron_density(n, 300.0).unwrap();
    /// assert!((ef / 2.45e-19 - 1.0).abs() < 1e-13);
    /// ```
    ///
    /// # References
    /// Joyce & Dixon (1977); Blakemore (1982).
    pub fn fermi_level_from_electron_density(
        &self,
        electron_density_per_m3: f64,
        temperature_k: f64,
    ) -> Result<f64> {
        error::positive("electron_density_per_m3", electron_density_per_m3)?;
        let (kt, eg, nc, ln_nc) = self.band(false, temperature_k)?;
        Ok(eg + kt * reduced_level(electron_density_per_m3, nc, ln_nc)?)
    }

    /// Fermi level (J above E_v) at which the valence band holds `hole_density_per_m3` (m⁻³)
    /// holes at `temperature_k` (K).
    ///
    /// # Formula
    /// ```text
    /// E_F = −kT·F_{1/2}⁻¹(p/N_v)
    /// ```
    ///
    /// # Errors
    /// As [`Semiconductor::fermi_level_from_electron_density`].
    ///
    /// # Accuracy
    /// As [`Semiconductor::fermi_level_from_electron_density`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::stats::Semiconductor;
    /// let s = Semiconductor::new(1.08, 0.81, 1.87e-19, 0.0, 1.0).unwrap();
    /// let p = s.hole_density(0.4e-19, 300.0).unwrap().density_per_m3;
    /// let ef = s.fermi_level_from_hole_density(p, 300.0).unwrap();
    /// assert!((ef / 0.4e-19 - 1.0).abs() < 1e-13);
    /// ```
    ///
    /// # References
    /// Joyce & Dixon (1977); Blakemore (1982).
    pub fn fermi_level_from_hole_density(
        &self,
        hole_density_per_m3: f64,
        temperature_k: f64,
    ) -> Result<f64> {
        error::positive("hole_density_per_m3", hole_density_per_m3)?;
        let (kt, _, nv, ln_nv) = self.band(true, temperature_k)?;
        Ok(-kt * reduced_level(hole_density_per_m3, nv, ln_nv)?)
    }

    /// Intrinsic carrier density (m⁻³) and Fermi level (J above E_v) at `temperature_k` (K),
    /// exact with Fermi–Dirac statistics and in the Boltzmann approximation.
    ///
    /// # Formula
    /// ```text
    /// exact:     N_c F_{1/2}((E_F − E_g)/kT) = N_v F_{1/2}(−E_F/kT) = n_i   (solved for E_F)
    /// Boltzmann: n_i = √(N_c N_v)·e^{−E_g/2kT},   E_i = E_g/2 + (kT/2)·ln(N_v/N_c)
    /// ```
    ///
    /// # Errors
    /// Field errors; `NON_FINITE` / `NON_POSITIVE_TEMPERATURE`; `NO_SOLUTION` (Varshni gap ≤ 0);
    /// `NOT_CONVERGED` (not observed in the tests).
    ///
    /// # Accuracy
    /// Against mpmath (quadrature of the Fermi–Dirac integrals and `findroot` of n = p, 40
    /// digits, 9 rows incl. a degenerate narrow-gap case): Fermi level ≤ 3.6e-16 relative,
    /// density ≤ 6.5e-15 relative, the Boltzmann values ≤ 6.5e-15
    /// (`tests/quantum_reference.rs`). Densities below the f64 range (e.g. a wide gap at a
    /// few kelvin) are 0.
    ///
    /// # Examples
    /// See [`Semiconductor`].
    ///
    /// # References
    /// Sze & Ng (2007), §1.4.1, eqs. for n_i and E_i (from memory).
    pub fn intrinsic(&self, temperature_k: f64) -> Result<IntrinsicCarriers> {
        let (kt, eg, _, ln_nc) = self.band(false, temperature_k)?;
        let (_, _, _, ln_nv) = self.band(true, temperature_k)?;
        let g = eg / kt;
        let xi_b = 0.5 * g + 0.5 * (ln_nv - ln_nc);
        let boltzmann_density = float::exp(0.5 * (ln_nc + ln_nv) - 0.5 * g);
        // Newton on h(ξ) = ln n − ln p, h′ = G(ξ − g) + G(−ξ), G = F_{−1/2}/F_{1/2} ∈ (0, 1].
        let mut xi = xi_b;
        let mut done = false;
        for _ in 0..100 {
            let h = ln_nc + ln_f_half(xi - g) - ln_nv - ln_f_half(-xi);
            let hp = log_derivative(xi - g) + log_derivative(-xi);
            if !(h.is_finite() && hp > 0.0) {
                break;
            }
            let step = (h / hp).clamp(-20.0, 20.0);
            xi -= step;
            if float::abs(step) <= 4e-16 * float::abs(xi).max(1.0) {
                done = true;
                break;
            }
        }
        if !done {
            return Err(Error::NotConverged {
                what: "intrinsic Fermi level (Newton on ln n - ln p)",
            });
        }
        let density = float::exp(ln_nc + ln_f_half(xi - g));
        Ok(IntrinsicCarriers {
            density_per_m3: density,
            boltzmann_density_per_m3: boltzmann_density,
            fermi_level_j: xi * kt,
            boltzmann_fermi_level_j: xi_b * kt,
            band_gap_j: eg,
        })
    }
}

/// η = F_{1/2}⁻¹(density/N), falling back to ln density − ln N where the ratio underflows.
fn reduced_level(density: f64, n: f64, ln_n: f64) -> Result<f64> {
    let y = density / n;
    if y > 0.0 && y.is_finite() {
        inverse_fermi_dirac_half(y)
    } else if y == 0.0 {
        // ln_n rather than ln(n): n may have overflowed (y = 0 although the true y is not).
        Ok(float::ln(density) - ln_n)
    } else {
        Err(Error::NoSolution {
            what: "carrier density beyond the f64 range relative to the density of states",
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn tail_sums_match_integral_near_switch() {
        for &eta in &[-3.0f64, -3.5, -5.0, -20.0] {
            let f = fermi_dirac_integral(FdOrder::Half, eta).unwrap();
            let (t, _) = tail_sums(eta.exp(), 1.5);
            assert!((eta.exp() * t / f - 1.0).abs() < 1e-15, "{eta}");
            let fm = fermi_dirac_integral(FdOrder::MinusHalf, eta).unwrap();
            assert!((log_derivative(eta) / (fm / f) - 1.0).abs() < 1e-15);
        }
        // continuity of the Boltzmann error across η = −3
        let a = band_carrier_density(1.0, -3.0)
            .unwrap()
            .boltzmann_relative_error;
        let b = band_carrier_density(1.0, -2.999_999_999)
            .unwrap()
            .boltzmann_relative_error;
        assert!((a / b - 1.0).abs() < 1e-8);
    }

    #[test]
    fn extremes_do_not_underflow_spuriously() {
        // Fermi level 800 kT below the band: N e^η is representable for N = 1e25
        let c = band_carrier_density(1e25, -700.0).unwrap();
        assert!(c.density_per_m3 > 0.0 && c.density_per_m3.is_finite());
        assert!(c.boltzmann_relative_error > 0.0);
        // wide gap at 2 K: n_i underflows to 0 (true value ≈ 1e-2900 m⁻³), no NaN
        let s = Semiconductor::new(1.0, 1.0, 8e-19, 0.0, 1.0).unwrap();
        let i = s.intrinsic(2.0).unwrap();
        assert_eq!(i.density_per_m3, 0.0);
        assert!((i.fermi_level_j / 4e-19 - 1.0).abs() < 1e-12);
    }

    #[test]
    fn errors() {
        assert_eq!(
            effective_density_of_states(-1.0, 300.0).unwrap_err().code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            effective_density_of_states(1.0, 0.0).unwrap_err().code(),
            "NON_POSITIVE_TEMPERATURE"
        );
        assert_eq!(
            Semiconductor::new(1.0, 0.0, 1e-19, 0.0, 1.0)
                .unwrap_err()
                .code(),
            "NON_POSITIVE"
        );
        assert_eq!(
            Semiconductor::new(1.0, 1.0, 1e-19, -1e-23, 1.0)
                .unwrap_err()
                .code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            varshni_band_gap(1e-19, 1e-21, 100.0, 1000.0)
                .unwrap_err()
                .code(),
            "NO_SOLUTION"
        );
        let s = Semiconductor {
            electron_mass_ratio: f64::NAN,
            ..Semiconductor::new(1.0, 1.0, 1e-19, 0.0, 1.0).unwrap()
        };
        assert_eq!(s.intrinsic(300.0).unwrap_err().code(), "NON_FINITE");
        assert_eq!(
            band_carrier_density(1e25, f64::INFINITY)
                .unwrap_err()
                .code(),
            "NON_FINITE"
        );
    }
}
