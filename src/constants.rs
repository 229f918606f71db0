//! Physical constants: CODATA 2018 (the values fixed by the 2019 redefinition of the SI) and the
//! ITS-90 second radiation constant.
//!
//! The defining constants h, c, k, e and N_A are exact by definition. Derived constants are given
//! as the f64 nearest to the exact value, computed once at 40 significant digits (mpmath) from the
//! defining constants and written here as literals, so no rounding accumulates from evaluating
//! the formula in f64. `tests/constants.rs` checks every value against the CODATA 2018 table as
//! published by NIST and recomputes the derived ones from h, c and k.
//!
//! # References
//! - E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, "CODATA recommended values of the
//!   fundamental physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021),
//!   doi:10.1103/RevModPhys.93.025010.
//! - H. Preston-Thomas, "The International Temperature Scale of 1990 (ITS-90)", Metrologia 27,
//!   3–10 (1990), doi:10.1088/0026-1394/27/1/002.

/// Planck constant h, J·s. Exact (SI 2019).
pub const PLANCK_H: f64 = 6.626_070_15e-34;
/// Reduced Planck constant ħ = h/2π, J·s. Exact value 1.054 571 817 646 156 391…e-34.
pub const PLANCK_HBAR: f64 = 1.054_571_817_646_156_4e-34;
/// Speed of light in vacuum c, m/s. Exact (SI 2019).
pub const SPEED_OF_LIGHT_C: f64 = 299_792_458.0;
/// Boltzmann constant k, J/K. Exact (SI 2019).
pub const BOLTZMANN_K: f64 = 1.380_649e-23;
/// Elementary charge e, C. Exact (SI 2019). Used to convert electronvolts to joules.
pub const ELEMENTARY_CHARGE_E: f64 = 1.602_176_634e-19;
/// Avogadro constant N_A, 1/mol. Exact (SI 2019).
pub const AVOGADRO_NA: f64 = 6.022_140_76e23;
/// Unified atomic mass unit u, kg (CODATA 2018, relative standard uncertainty 3.0e-10).
pub const ATOMIC_MASS_U: f64 = 1.660_539_066_60e-27;
/// Electron mass m_e, kg (CODATA 2018, relative standard uncertainty 3.0e-10).
pub const ELECTRON_MASS: f64 = 9.109_383_701_5e-31;

/// First radiation constant c1 = 2πhc², W·m² (exitance form). Exact value
/// 3.741 771 852 192 758 011…e-16.
pub const C1: f64 = 3.741_771_852_192_758e-16;
/// First radiation constant for spectral radiance c1L = 2hc², W·m²·sr⁻¹. Exact value
/// 1.191 042 972 397 188 414…e-16.
pub const C1L: f64 = 1.191_042_972_397_188_4e-16;
/// Second radiation constant c2 = hc/k, m·K (CODATA 2018). Exact value
/// 1.438 776 877 503 933 802…e-2.
pub const C2: f64 = 1.438_776_877_503_933_8e-2;
/// Second radiation constant as fixed by ITS-90, m·K (exact by the scale's definition).
pub const C2_ITS90: f64 = 0.014_388;
/// Stefan–Boltzmann constant σ = 2π⁵k⁴/(15h³c²), W·m⁻²·K⁻⁴. Exact value
/// 5.670 374 419 184 429 453…e-8.
pub const STEFAN_BOLTZMANN_SIGMA: f64 = 5.670_374_419_184_429_5e-8;
/// Radiation constant a = 4σ/c, J·m⁻³·K⁻⁴. Exact value 7.565 733 250 280 004 647…e-16.
pub const RADIATION_A: f64 = 7.565_733_250_280_005e-16;
/// Wien wavelength displacement constant b = hc/(k·x₅), m·K, where x₅ = 5 + W₀(−5e⁻⁵).
/// Exact value 2.897 771 955 185 172 661…e-3.
pub const WIEN_B: f64 = 2.897_771_955_185_172_7e-3;
/// Wien frequency displacement constant b′ = x₃·k/h, Hz/K, where x₃ = 3 + W₀(−3e⁻³).
/// Exact value 5.878 925 757 646 824 946…e10.
pub const WIEN_B_FREQUENCY: f64 = 5.878_925_757_646_825e10;

/// Root of x = 5(1 − e⁻ˣ): peak of spectral radiance per wavelength is at λT = c2/x.
pub const WIEN_X_WAVELENGTH: f64 = 4.965_114_231_744_276;
/// Root of x = 3(1 − e⁻ˣ): peak of spectral radiance per frequency is at hν = x·kT.
pub const WIEN_X_FREQUENCY: f64 = 2.821_439_372_122_078_9;
/// Root of x = 4(1 − e⁻ˣ): peak of photon radiance per wavelength is at λT = c2/x.
pub const WIEN_X_PHOTON_WAVELENGTH: f64 = 3.920_690_394_872_886_3;
/// Root of x = 2(1 − e⁻ˣ): peak of photon radiance per frequency is at hν = x·kT.
pub const WIEN_X_PHOTON_FREQUENCY: f64 = 1.593_624_260_040_04;
/// Apéry's constant ζ(3).
pub const ZETA_3: f64 = 1.202_056_903_159_594_3;

/// Which value of the second radiation constant c2 a calculation uses.
///
/// Physics uses c2 = hc/k (CODATA 2018). Radiation thermometry under ITS-90 uses c2 = 0.014388 m·K
/// exactly; the two differ by 16.07 ppm. For a temperature T inferred from a radiance ratio to a
/// fixed point T_X, the shift is δT ≈ T·(T/T_X − 1)·δc2/c2 (Wien approximation): relative to the
/// gold point (1337.33 K) about 0.016 K at 2000 K and 0.060 K at 3000 K.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum C2Convention {
    /// c2 = hc/k from CODATA 2018 ([`C2`]).
    #[default]
    Codata2018,
    /// c2 = 0.014388 m·K exactly, as fixed by ITS-90 ([`C2_ITS90`]).
    Its90,
}

impl C2Convention {
    /// The value of c2 in m·K for this convention.
    ///
    /// # Examples
    /// ```
    /// use quantaband::constants::C2Convention;
    /// assert_eq!(C2Convention::Its90.c2(), 0.014388);
    /// ```
    pub const fn c2(self) -> f64 {
        match self {
            C2Convention::Codata2018 => C2,
            C2Convention::Its90 => C2_ITS90,
        }
    }
}
