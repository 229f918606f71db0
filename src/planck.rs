//! Planck spectral quantities, totals and peak locations of a blackbody or grey body.
//!
//! # Conventions
//!
//! - Spectral coordinates are **vacuum** values: wavelength λ in m (λ = c₀/ν), wavenumber σ̃ in
//!   m⁻¹ (σ̃ = ν/c₀, *not* angular) and frequency ν in Hz, even when the emitter radiates into a
//!   medium of refractive index n. With vacuum coordinates the medium enters only as the factor
//!   n² in front of the vacuum Planck function (the number of modes per unit solid angle scales
//!   with n²), for every spectral variable:
//!   `L_ν = ε n² · 2hν³/c₀² / (e^{hν/kT} − 1)`. This is the form of Siegel & Howell (Thermal
//!   Radiation Heat Transfer, ch. 1, blackbody intensity in a medium of index n) rewritten from
//!   medium wavelength λ_m = λ/n to the vacuum wavelength λ.
//! - `Quantity::Energy` gives watts; `Quantity::Photon` gives photons per second (the energy
//!   quantity divided by the photon energy hν = hc₀/λ).
//! - `Geometry::Radiance` is per steradian (normal to the surface); `Geometry::Exitance` is the
//!   hemispherical flux of a Lambertian emitter, π × radiance.
//! - The exponent uses the second radiation constant c₂ of the chosen [`C2Convention`]
//!   (CODATA 2018 c₂ = hc/k, or ITS-90 c₂ = 0.014388 m·K); the prefactor always uses the exact SI
//!   values of h and c. In the frequency form the exponent is written c₂ν/(c₀T).
//!
//! Every spectral density has the form `K · v^p / (e^x − 1)` with a reduced variable
//! x = c₂/(λT) = c₂σ̃/T = c₂ν/(c₀T). Valid inputs whose result lies inside the f64 range give a
//! finite, correctly rounded-to-a-few-ulp value: the direct evaluation is used when all its
//! intermediates are normal numbers, and a logarithmic evaluation otherwise (very short or long
//! wavelengths, extreme temperatures). Results below the smallest subnormal return 0, results
//! above `f64::MAX` return `f64::INFINITY`; neither is an error.
//!
//! # References
//! - M. Planck, "Ueber das Gesetz der Energieverteilung im Normalspectrum", Ann. Phys. 309(3),
//!   553–563 (1901), doi:10.1002/andp.19013090310.
//! - J. R. Howell, M. P. Mengüç, K. Daun, R. Siegel, "Thermal Radiation Heat Transfer", 7th ed.,
//!   CRC Press (2020), ch. 1 (blackbody intensity and emissive power, media with n ≠ 1).
//! - E. Tiesinga et al., "CODATA recommended values of the fundamental physical constants: 2018",
//!   Rev. Mod. Phys. 93, 025010 (2021), doi:10.1103/RevModPhys.93.025010.
#![forbid(unsafe_code)]

use crate::constants::{
    C2Convention, BOLTZMANN_K, C1L, PLANCK_H, SPEED_OF_LIGHT_C, WIEN_X_FREQUENCY,
    WIEN_X_PHOTON_FREQUENCY, WIEN_X_PHOTON_WAVELENGTH, WIEN_X_WAVELENGTH, ZETA_3,
};
use crate::error::{self, Result};
use crate::float;

/// π⁴/15 = ∫₀^∞ x³/(eˣ − 1) dx.
pub(crate) const PI4_OVER_15: f64 = 6.493_939_402_266_829;
/// 2ζ(3) = ∫₀^∞ x²/(eˣ − 1) dx.
pub(crate) const TWO_ZETA_3: f64 = 2.404_113_806_319_188_5;
/// 2hc₀² — c1L, the prefactor of energy radiance per wavelength and per wavenumber, W·m²·sr⁻¹.
const K_ENERGY: f64 = C1L;
/// 2c₀, m/s — prefactor of photon radiance per wavelength and per wavenumber.
const K_PHOTON: f64 = 2.0 * SPEED_OF_LIGHT_C;
/// 2h/c₀², J·s³·m⁻² — prefactor of energy radiance per frequency.
const K_ENERGY_FREQ: f64 = 2.0 * PLANCK_H / (SPEED_OF_LIGHT_C * SPEED_OF_LIGHT_C);
/// 2/c₀², s²·m⁻² — prefactor of photon radiance per frequency.
const K_PHOTON_FREQ: f64 = 2.0 / (SPEED_OF_LIGHT_C * SPEED_OF_LIGHT_C);

/// The spectral variable a [`Spectrum`] is expressed in (all vacuum values, SI units).
///
/// A density per wavenumber and one per wavelength describe the same radiation:
/// L_σ̃ = λ²·L_λ at σ̃ = 1/λ (and L_ν = (λ²/c₀)·L_λ at ν = c₀/λ).
///
/// # Examples
/// ```
/// use quantaband::planck::{SpectralVariable, Spectrum};
/// let per_m = Spectrum::default().spectral(10e-6, 300.0).unwrap();
/// let per_inv_m = Spectrum::default()
///     .with_variable(SpectralVariable::Wavenumber)
///     .spectral(1e5, 300.0)
///     .unwrap();
/// // 9.924 033 330 070 695e-4 W·m⁻²·sr⁻¹/m⁻¹ at σ̃ = 1e5 m⁻¹, 300 K (mpmath, 40 digits,
/// // tests/data/gen_core.py); the identity L_σ̃ = λ² L_λ links the two.
/// assert!((per_inv_m / 9.924_033_330_070_695e-4 - 1.0).abs() < 1e-14);
/// assert!((per_inv_m / (per_m * 1e-10) - 1.0).abs() < 1e-14);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum SpectralVariable {
    /// Vacuum wavelength λ in m; densities are per metre of wavelength.
    #[default]
    Wavelength,
    /// Vacuum wavenumber σ̃ = 1/λ in m⁻¹ (not angular); densities are per m⁻¹.
    Wavenumber,
    /// Frequency ν in Hz; densities are per hertz.
    Frequency,
}

impl SpectralVariable {
    /// The argument name (with its unit) used in error values for this variable.
    ///
    /// # Formula
    /// ```text
    /// Wavelength → "wavelength_m", Wavenumber → "wavenumber_per_m", Frequency → "frequency_hz"
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::SpectralVariable;
    /// assert_eq!(SpectralVariable::Frequency.arg_name(), "frequency_hz");
    /// ```
    ///
    /// # References
    /// The crate's argument-naming rule (unit in the name).
    pub const fn arg_name(self) -> &'static str {
        match self {
            SpectralVariable::Wavelength => "wavelength_m",
            SpectralVariable::Wavenumber => "wavenumber_per_m",
            SpectralVariable::Frequency => "frequency_hz",
        }
    }
}

/// Whether a [`Spectrum`] counts energy (W) or photons (photons/s).
///
/// The photon quantity is the energy quantity divided by the photon energy hν = hc₀/λ.
///
/// # Examples
/// ```
/// use quantaband::planck::{Quantity, Spectrum};
/// let e = Spectrum::default().spectral(10e-6, 300.0).unwrap();
/// let p = Spectrum::default().with_quantity(Quantity::Photon).spectral(10e-6, 300.0).unwrap();
/// // h and c₀ exact in the SI (CODATA 2018): photons × hc₀/λ = watts.
/// assert!((p * 6.626_070_15e-34 * 299_792_458.0 / 10e-6 / e - 1.0).abs() < 1e-14);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Quantity {
    /// Radiant energy: W (per m², sr and spectral unit as applicable).
    #[default]
    Energy,
    /// Photon number: photons/s (per m², sr and spectral unit as applicable).
    Photon,
}

/// Whether a [`Spectrum`] gives radiance (per steradian) or hemispherical exitance.
///
/// For a Lambertian emitter the exitance is π sr × the radiance (Howell et al., Thermal
/// Radiation Heat Transfer, 2020, ch. 1).
///
/// # Examples
/// ```
/// use quantaband::planck::{Geometry, Spectrum};
/// let m = Spectrum::default().with_geometry(Geometry::Exitance).total(300.0).unwrap();
/// // σT⁴ at 300 K = 459.300 327 953 938 8 W/m² (σ from CODATA 2018; mpmath, tests/data/gen_core.py).
/// assert!((m / 459.300_327_953_938_8 - 1.0).abs() < 1e-14);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Geometry {
    /// Radiance, per steradian (W·m⁻²·sr⁻¹ or photons·s⁻¹·m⁻²·sr⁻¹, per spectral unit).
    #[default]
    Radiance,
    /// Hemispherical exitance of a Lambertian surface = π × radiance (W·m⁻² or photons·s⁻¹·m⁻²).
    Exitance,
}

/// A choice of spectral variable, quantity, geometry, emissivity, medium index and c₂ convention.
///
/// The fields are public; every method validates them (`emissivity` in (0, 1],
/// `refractive_index` finite and > 0) and returns an error rather than a meaningless number.
///
/// # Examples
/// ```
/// use quantaband::planck::{Spectrum, SpectralVariable, Quantity, Geometry};
/// let s = Spectrum { quantity: Quantity::Photon, ..Spectrum::default() };
/// assert_eq!(s.variable, SpectralVariable::Wavelength);
/// assert_eq!(s.geometry, Geometry::Radiance);
/// // Photon radiance per wavelength at 10 µm, 300 K (mpmath, 40 digits, tests/data/gen_core.py).
/// let v = s.spectral(10e-6, 300.0).unwrap();
/// assert!((v / 4.995_874_060_375_493e26 - 1.0).abs() < 1e-14);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields, default)
)]
pub struct Spectrum {
    /// Spectral variable of the argument `x` and of the density.
    pub variable: SpectralVariable,
    /// Energy (W) or photon (photons/s) units.
    pub quantity: Quantity,
    /// Radiance (per sr) or hemispherical exitance.
    pub geometry: Geometry,
    /// Emissivity ε of a grey body, in (0, 1]; 1 for a blackbody.
    pub emissivity: f64,
    /// Refractive index n of the medium the body radiates into (> 0; 1 for vacuum). Enters as n².
    pub refractive_index: f64,
    /// Which second radiation constant the exponent uses.
    pub c2: C2Convention,
}

impl Default for Spectrum {
    fn default() -> Self {
        Self::BLACKBODY
    }
}

/// Parameters of the density `K · v^p / (e^x − 1)`, x = q·v^s/T (s = ±1).
#[derive(Clone, Copy)]
struct Kernel {
    k: f64,
    p: i32,
    q: f64,
    inverse: bool,
}

impl Spectrum {
    /// Blackbody spectral radiance per vacuum wavelength in vacuum, CODATA 2018 c₂.
    pub const BLACKBODY: Spectrum = Spectrum {
        variable: SpectralVariable::Wavelength,
        quantity: Quantity::Energy,
        geometry: Geometry::Radiance,
        emissivity: 1.0,
        refractive_index: 1.0,
        c2: C2Convention::Codata2018,
    };

    /// A blackbody spectrum (ε = 1, n = 1, CODATA c₂) in the given variable, quantity and geometry.
    ///
    /// # Formula
    /// ```text
    /// Spectrum { variable, quantity, geometry, emissivity: 1, refractive_index: 1, c2: Codata2018 }
    /// ```
    ///
    /// # Errors
    /// None (nothing to validate).
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{Geometry, Quantity, SpectralVariable, Spectrum};
    /// let s = Spectrum::new(SpectralVariable::Frequency, Quantity::Photon, Geometry::Exitance);
    /// assert_eq!((s.emissivity, s.refractive_index), (1.0, 1.0));
    /// ```
    ///
    /// # References
    /// Howell et al., Thermal Radiation Heat Transfer (2020), ch. 1 (blackbody).
    pub const fn new(variable: SpectralVariable, quantity: Quantity, geometry: Geometry) -> Self {
        Spectrum {
            variable,
            quantity,
            geometry,
            emissivity: 1.0,
            refractive_index: 1.0,
            c2: C2Convention::Codata2018,
        }
    }

    /// This spectrum with emissivity ε (dimensionless; validated when used).
    ///
    /// # Formula
    /// ```text
    /// every density, band and total of the spectrum is multiplied by ε (grey body)
    /// ```
    ///
    /// # Errors
    /// None here; an ε outside (0, 1] makes every computing method return `OutOfRange`.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// let grey = Spectrum::default().with_emissivity(0.5).spectral(10e-6, 300.0).unwrap();
    /// let black = Spectrum::default().spectral(10e-6, 300.0).unwrap();
    /// assert_eq!(grey, 0.5 * black);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 3 (grey surfaces).
    pub const fn with_emissivity(mut self, emissivity: f64) -> Self {
        self.emissivity = emissivity;
        self
    }

    /// This spectrum with refractive index n of the medium (dimensionless; validated when used).
    ///
    /// # Formula
    /// ```text
    /// every density, band and total is multiplied by n² (vacuum spectral coordinates)
    /// ```
    ///
    /// # Errors
    /// None here; n not finite or ≤ 0 makes every computing method return an error.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// let glass = Spectrum::default().with_refractive_index(1.5).spectral(10e-6, 300.0).unwrap();
    /// let vacuum = Spectrum::default().spectral(10e-6, 300.0).unwrap();
    /// assert!((glass / vacuum / 2.25 - 1.0).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1 (blackbody intensity in a medium of index n).
    pub const fn with_refractive_index(mut self, refractive_index: f64) -> Self {
        self.refractive_index = refractive_index;
        self
    }

    /// This spectrum with the given c₂ convention (CODATA 2018 hc/k or ITS-90 0.014388 m·K).
    ///
    /// # Formula
    /// ```text
    /// x = c₂/(λT) in the exponent uses the chosen c₂; the prefactor keeps the exact h and c
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::{constants::C2Convention, planck::Spectrum};
    /// let s = Spectrum::default().with_c2(C2Convention::Its90);
    /// assert_eq!(s.c2.c2(), 0.014388);
    /// ```
    ///
    /// # References
    /// Preston-Thomas, Metrologia 27, 3–10 (1990) (ITS-90 c₂).
    pub const fn with_c2(mut self, c2: C2Convention) -> Self {
        self.c2 = c2;
        self
    }

    /// Checks emissivity ∈ (0, 1] and refractive index finite and > 0.
    ///
    /// # Formula
    /// ```text
    /// 0 < ε ≤ 1,  0 < n < ∞
    /// ```
    ///
    /// # Errors
    /// `OutOfRange` (emissivity), `NonFinite`, `NonPositive` (refractive index).
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// assert!(Spectrum::default().validate().is_ok());
    /// assert_eq!(
    ///     Spectrum::default().with_emissivity(1.5).validate().unwrap_err().code(),
    ///     "OUT_OF_RANGE"
    /// );
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn validate(&self) -> Result<()> {
        error::unit_interval_open_closed("emissivity", self.emissivity)?;
        error::positive("refractive_index", self.refractive_index)?;
        Ok(())
    }

    /// ε·n²·(π for exitance): the factor in front of the vacuum blackbody radiance.
    pub(crate) fn scale(&self) -> f64 {
        let g = match self.geometry {
            Geometry::Radiance => 1.0,
            Geometry::Exitance => core::f64::consts::PI,
        };
        self.emissivity * self.refractive_index * self.refractive_index * g
    }

    /// ln(ε n² g) from the parts, so a subnormal ε (valid) cannot turn into ln 0.
    pub(crate) fn ln_scale(&self) -> f64 {
        let lg = match self.geometry {
            Geometry::Radiance => 0.0,
            Geometry::Exitance => 1.144_729_885_849_400_2, // ln π
        };
        float::ln(self.emissivity) + 2.0 * float::ln(self.refractive_index) + lg
    }

    /// ln(ε n² g · k) for a constant k > 0, robust to the product leaving the f64 range.
    pub(crate) fn ln_scaled(&self, k: f64) -> f64 {
        let v = self.scale() * k;
        if ok(v) {
            float::ln(v)
        } else {
            self.ln_scale() + float::ln(k)
        }
    }

    /// The value of c₂ in m·K for this spectrum.
    pub(crate) fn c2_value(&self) -> f64 {
        self.c2.c2()
    }

    /// (ε n² g K, p, q, inverse, ln(ε n² g K)) of the density ε n² g · K · v^p / (eˣ − 1) with
    /// x = q/(vT) (`inverse`) or x = q·v/T.
    pub(crate) fn density_params(&self) -> (f64, i32, f64, bool, f64) {
        let kn = self.kernel();
        (
            self.scale() * kn.k,
            kn.p,
            kn.q,
            kn.inverse,
            self.ln_scaled(kn.k),
        )
    }

    fn kernel(&self) -> Kernel {
        let c2 = self.c2_value();
        let photon = matches!(self.quantity, Quantity::Photon);
        let pick = |energy: f64, photons: f64| if photon { photons } else { energy };
        let (k, p, q, inverse) = match self.variable {
            SpectralVariable::Wavelength => (pick(K_ENERGY, K_PHOTON), -5i32, c2, true),
            SpectralVariable::Wavenumber => (pick(K_ENERGY, K_PHOTON), 3, c2, false),
            SpectralVariable::Frequency => (
                pick(K_ENERGY_FREQ, K_PHOTON_FREQ),
                3,
                c2 / SPEED_OF_LIGHT_C,
                false,
            ),
        };
        // a photon density has one power of the coordinate fewer (divided by hc/λ, hcσ̃ or hν)
        let p = if photon { p - p.signum() } else { p };
        Kernel { k, p, q, inverse }
    }

    /// Spectral density at spectral coordinate `x` (the variable's SI unit) and temperature.
    ///
    /// Units: W·m⁻²·sr⁻¹ per (m | m⁻¹ | Hz) for energy radiance; photons·s⁻¹·m⁻²·sr⁻¹ per
    /// spectral unit for photon radiance; exitance drops sr⁻¹ and is π × radiance.
    ///
    /// # Formula
    /// ```text
    /// L_λ = ε n² · 2hc²/λ⁵ / (e^x − 1),      x = c₂/(λT)
    /// L_σ = ε n² · 2hc² σ̃³ / (e^x − 1),     x = c₂σ̃/T
    /// L_ν = ε n² · 2hν³/c² / (e^x − 1),     x = c₂ν/(cT)
    /// photon densities: the above divided by hc/λ = hcσ̃ = hν
    /// exitance: π × radiance
    /// ε emissivity, n refractive index of the medium, h Planck constant, c speed of light in
    /// vacuum, c₂ second radiation constant, λ, σ̃, ν vacuum spectral coordinates, T in kelvin.
    /// ```
    ///
    /// # Errors
    /// `NonFinite` or `NonPositiveSpectral` for `x`; `NonFinite` or `NonPositiveTemperature` for
    /// `temperature_k`; the [`Spectrum::validate`] errors.
    ///
    /// # Accuracy
    /// Measured against mpmath at 40 digits (`tests/data/core_reference.json`, 30 cases, all
    /// variables and quantities, x from 1e-8 to 48): max relative error 6.2e-15. The bound grows
    /// like x·1.1e-16 for large x (the rounding of x = c₂/(λT) in f64 is amplified by e^{−x});
    /// the test allows 5e-15 + 2.5e-16·x.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// // 10 µm at 300 K: 9.924 033 330 070 694 67e6 W·m⁻²·sr⁻¹·m⁻¹ (mpmath, 40 digits).
    /// let v = Spectrum::default().spectral(10e-6, 300.0).unwrap();
    /// assert!((v / 9.924_033_330_070_695e6 - 1.0).abs() < 1e-14);
    /// ```
    ///
    /// # References
    /// Planck (1901); Howell, Mengüç, Daun & Siegel, Thermal Radiation Heat Transfer, 7th ed.
    /// (2020), ch. 1, eqs. for blackbody spectral intensity.
    pub fn spectral(&self, x: f64, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        error::spectral(self.variable.arg_name(), x)?;
        error::temperature("temperature_k", temperature_k)?;
        Ok(density(self, x, temperature_k, false))
    }

    /// Partial derivative ∂/∂T of [`Spectrum::spectral`], in the density's unit per kelvin.
    ///
    /// # Formula
    /// ```text
    /// ∂L/∂T = L · x eˣ / ((eˣ − 1) T) = L · x / ((1 − e^−x) T)
    /// with L and x as in Spectrum::spectral.
    /// ```
    ///
    /// # Errors
    /// As [`Spectrum::spectral`].
    ///
    /// # Accuracy
    /// Measured against mpmath at 40 digits (reference table, 28 cases): max relative error
    /// 6.2e-15; same x-dependence as [`Spectrum::spectral`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// // ∂L_λ/∂T at 10 µm, 300 K: 1.599 715 672 513 219e5 W·m⁻³·sr⁻¹·K⁻¹ (mpmath).
    /// let d = Spectrum::default().spectral_d_dt(10e-6, 300.0).unwrap();
    /// assert!((d / 1.599_715_672_513_219_4e5 - 1.0).abs() < 1e-14);
    /// ```
    ///
    /// # References
    /// Derivative of Planck's law; Howell et al., Thermal Radiation Heat Transfer (2020), ch. 1.
    pub fn spectral_d_dt(&self, x: f64, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        error::spectral(self.variable.arg_name(), x)?;
        error::temperature("temperature_k", temperature_k)?;
        Ok(density(self, x, temperature_k, true))
    }

    /// The spectrum integrated over all of its spectral variable: total radiance (W·m⁻²·sr⁻¹ or
    /// photons·s⁻¹·m⁻²·sr⁻¹) or total exitance (W·m⁻² or photons·s⁻¹·m⁻²).
    ///
    /// The result does not depend on `variable`.
    ///
    /// # Formula
    /// ```text
    /// energy: ε n² g · 2hc² (T/c₂)⁴ · π⁴/15     (= ε n² σT⁴ for exitance, CODATA c₂)
    /// photon: ε n² g · 2c  (T/c₂)³ · 2ζ(3)
    /// g = 1 for radiance, π for exitance; ζ(3) Apéry's constant.
    /// ```
    ///
    /// # Errors
    /// `NonFinite`/`NonPositiveTemperature` for `temperature_k`; [`Spectrum::validate`] errors.
    ///
    /// # Accuracy
    /// Max relative error 2.8e-16 against mpmath (`quad` of the density over all x, 24 cases:
    /// energy and photon, radiance and exitance, 1 mK to 1e6 K; reference table).
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{Spectrum, SpectralVariable, Quantity, Geometry};
    /// let s = Spectrum::new(SpectralVariable::Wavelength, Quantity::Energy, Geometry::Exitance);
    /// // σ·(300 K)⁴ = 459.300 327 953 938 8 W/m² (CODATA 2018 σ, mpmath).
    /// assert!((s.total(300.0).unwrap() / 459.300_327_953_938_8 - 1.0).abs() < 1e-14);
    /// ```
    ///
    /// # References
    /// J. Stefan (1879); L. Boltzmann (1884); Howell et al. (2020), ch. 1.
    pub fn total(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        error::temperature("temperature_k", temperature_k)?;
        let (k, power) = self.band_coefficient_unscaled();
        let kz = k * self.kernel_total();
        Ok(scaled_power_ln(
            self.scale() * kz,
            self.ln_scaled(kz),
            temperature_k / self.c2_value(),
            power,
        ))
    }

    /// ∂/∂T of [`Spectrum::total`] (the total's unit per kelvin).
    ///
    /// # Formula
    /// ```text
    /// energy: 4 · total/T;  photon: 3 · total/T
    /// ```
    ///
    /// # Errors
    /// As [`Spectrum::total`].
    ///
    /// # Accuracy
    /// A few ulp.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{Spectrum, SpectralVariable, Quantity, Geometry};
    /// let s = Spectrum::new(SpectralVariable::Wavelength, Quantity::Energy, Geometry::Exitance);
    /// // 4σT³ at 300 K = 6.124 004 372 719 184 W·m⁻²·K⁻¹ (CODATA 2018 σ).
    /// assert!((s.total_d_dt(300.0).unwrap() / 6.124_004_372_719_184 - 1.0).abs() < 1e-14);
    /// ```
    ///
    /// # References
    /// Stefan–Boltzmann law differentiated.
    pub fn total_d_dt(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        error::temperature("temperature_k", temperature_k)?;
        let (k, power) = self.band_coefficient_unscaled();
        let c2 = self.c2_value();
        let kz = k * self.kernel_total() * f64::from(power) / c2;
        Ok(scaled_power_ln(
            self.scale() * kz,
            self.ln_scaled(kz),
            temperature_k / c2,
            power - 1,
        ))
    }

    /// ∫₀^∞ of the spectrum's dimensionless kernel: π⁴/15 (energy) or 2ζ(3) (photon).
    fn kernel_total(&self) -> f64 {
        match self.quantity {
            Quantity::Energy => PI4_OVER_15,
            Quantity::Photon => TWO_ZETA_3,
        }
    }

    /// (K, p) with band = ε n² g · K · (T/c₂)^p · (dimensionless Planck integral).
    pub(crate) fn band_coefficient_unscaled(&self) -> (f64, i32) {
        match self.quantity {
            Quantity::Energy => (C1L, 4),
            Quantity::Photon => (K_PHOTON, 3),
        }
    }

    /// Location of the maximum of the spectral density, in the spectral variable's SI unit
    /// (m, m⁻¹ or Hz). Independent of ε, n and geometry.
    ///
    /// # Formula
    /// ```text
    /// wavelength:  λ_max = c₂ / (x T)    x = 4.965 114 231 7… (energy), 3.920 690 394 8… (photon)
    /// wavenumber:  σ̃_max = x T / c₂      x = 2.821 439 372 1… (energy), 1.593 624 260 0… (photon)
    /// frequency:   ν_max = x c T / c₂    same x as wavenumber
    /// x is the root of x = m(1 − e^−x), m = 5, 4, 3, 2 for the respective densities.
    /// ```
    ///
    /// # Errors
    /// `NonFinite`/`NonPositiveTemperature` for `temperature_k`; [`Spectrum::validate`] errors.
    ///
    /// # Accuracy
    /// Max relative error 2.2e-16 against mpmath (`findroot` of d ln L/d ln v, 12 cases: three
    /// variables, energy and photon, 300 K and 5772 K; reference table).
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::Spectrum;
    /// // Wien: b/T with b = 2.897 771 955e-3 m·K (CODATA 2018).
    /// let lam = Spectrum::default().peak(5000.0).unwrap();
    /// assert!((lam / (2.897_771_955e-3 / 5000.0) - 1.0).abs() < 1e-9);
    /// ```
    ///
    /// # References
    /// W. Wien (1893); CODATA 2018 (b and b′); Howell et al. (2020), ch. 1.
    pub fn peak(&self, temperature_k: f64) -> Result<f64> {
        self.validate()?;
        error::temperature("temperature_k", temperature_k)?;
        let c2 = self.c2_value();
        Ok(match (self.variable, self.quantity) {
            (SpectralVariable::Wavelength, Quantity::Energy) => {
                (c2 / WIEN_X_WAVELENGTH) / temperature_k
            }
            (SpectralVariable::Wavelength, Quantity::Photon) => {
                (c2 / WIEN_X_PHOTON_WAVELENGTH) / temperature_k
            }
            (SpectralVariable::Wavenumber, Quantity::Energy) => {
                (WIEN_X_FREQUENCY / c2) * temperature_k
            }
            (SpectralVariable::Wavenumber, Quantity::Photon) => {
                (WIEN_X_PHOTON_FREQUENCY / c2) * temperature_k
            }
            (SpectralVariable::Frequency, Quantity::Energy) => {
                (WIEN_X_FREQUENCY * SPEED_OF_LIGHT_C / c2) * temperature_k
            }
            (SpectralVariable::Frequency, Quantity::Photon) => {
                (WIEN_X_PHOTON_FREQUENCY * SPEED_OF_LIGHT_C / c2) * temperature_k
            }
        })
    }
}

/// True for a finite, normal (not subnormal, not zero) number.
#[inline]
fn ok(v: f64) -> bool {
    v.is_normal()
}

/// x and ln x for the kernel at (v, T); both valid for any positive finite inputs (x may be 0 or
/// +∞ when the true value is outside the f64 range, ln x is always finite).
#[inline]
fn reduced_x(kn: Kernel, v: f64, t: f64) -> (f64, f64) {
    let x = if kn.inverse {
        kn.q / (v * t)
    } else {
        kn.q * v / t
    };
    if ok(x) && (if kn.inverse { ok(v * t) } else { ok(kn.q * v) }) {
        (x, float::ln(x))
    } else {
        let lnx = if kn.inverse {
            float::ln(kn.q) - float::ln(v) - float::ln(t)
        } else {
            float::ln(kn.q) + float::ln(v) - float::ln(t)
        };
        (float::exp(lnx), lnx)
    }
}

/// ln(eˣ − 1) for x given with its logarithm (x may be 0 or +∞; lnx is finite).
pub(crate) fn ln_expm1(x: f64, lnx: f64) -> f64 {
    if x > 1.0 {
        x + float::ln_1p(-float::exp(-x))
    } else if lnx > -30.0 {
        float::ln(float::expm1(x))
    } else {
        lnx + 0.5 * x
    }
}

/// ln(1 − e^−x) for x given with its logarithm.
pub(crate) fn ln_one_minus_exp_neg(x: f64, lnx: f64) -> f64 {
    if x > core::f64::consts::LN_2 {
        float::ln_1p(-float::exp(-x))
    } else if lnx > -30.0 {
        float::ln(-float::expm1(-x))
    } else {
        lnx - 0.5 * x
    }
}

/// The constants of a spectrum's density ε n² g · K · v^p / (eˣ − 1) for the direct formula.
#[derive(Clone, Copy)]
pub(crate) struct Direct {
    /// ε n² g · K
    coef: f64,
    /// q of x = q/(vT) or x = q·v/T
    q: f64,
    /// |p| (5, 4, 3 or 2)
    n: u32,
    /// x = q/(vT) and v^p = 1/vⁿ (wavelength) instead of x = q·v/T and v^p = vⁿ
    inverse: bool,
}

impl Direct {
    /// The constants of `spec`.
    #[inline]
    pub(crate) fn of(spec: &Spectrum) -> Direct {
        let kn = spec.kernel();
        Direct {
            coef: spec.scale() * kn.k,
            q: kn.q,
            n: kn.p.unsigned_abs(),
            inverse: kn.inverse,
        }
    }

    /// The density of `spec` (whose constants these are) at validated v and T: the fast path
    /// where it applies, else the rest of [`density`]; the same value as [`Spectrum::spectral`]
    /// for inputs already checked, without preparing the constants on every call.
    #[inline]
    pub(crate) fn density(&self, spec: &Spectrum, v: f64, t: f64) -> f64 {
        let y = self.point(v, t);
        if ok(y) {
            y
        } else {
            density(spec, v, t, false)
        }
    }

    /// The density (or, with `d_dt`, its T-derivative) by the direct formula when every
    /// intermediate is a normal number and x < 700, else NaN; the caller uses it only when it
    /// is a normal number, and otherwise the logarithmic form of [`density`].
    ///
    /// For x ≥ ln 2, eˣ ≥ 2, so eˣ − 1 formed as `exp(x) − 1` is within ½ ulp + 2·err(exp) of
    /// the true value (the subtraction rounds once and amplifies the relative error of eˣ by
    /// eˣ/(eˣ − 1) ≤ 2): `expm1` (slower) is needed only below ln 2. vⁿ by two or three
    /// multiplications instead of `powi`; the kernel constants come prepared. No logarithm (the
    /// fallback's are computed only there).
    #[inline(never)]
    fn eval(&self, v: f64, t: f64, d_dt: bool) -> f64 {
        let (x, denom) = if self.inverse {
            let d = v * t;
            (self.q / d, d)
        } else {
            let d = self.q * v;
            (d / t, d)
        };
        if !((f64::MIN_POSITIVE..700.0).contains(&x) && ok(denom)) {
            return f64::NAN;
        }
        let em1 = if x >= core::f64::consts::LN_2 {
            float::exp(x) - 1.0
        } else {
            float::expm1(x)
        };
        let v2 = v * v;
        let vn = match self.n {
            5 => v2 * v2 * v,
            4 => v2 * v2,
            3 => v2 * v,
            _ => v2,
        };
        if !ok(vn) {
            return f64::NAN;
        }
        let val = if self.inverse {
            self.coef / (vn * em1)
        } else {
            self.coef * vn / em1
        };
        if d_dt {
            val * (x / t) / (-float::expm1(-x))
        } else {
            val
        }
    }

    /// The density on lanes (one `f64`, or the two of a simd128 vector) by the direct formula
    /// with [`float::exp_reduced`] for eˣ; NaN in a lane unless ln 2 ≤ x < 700 and vⁿ and the
    /// value are normal numbers (the caller then uses the rest of [`density`], which covers
    /// every other input). Same operations as [`Direct::eval`] except eˣ (bound: see
    /// `exp_reduced`): the point and the bulk loop run these, so they agree to the bit.
    #[inline(always)]
    fn lanes<L: float::Lanes>(&self, v: L, t: L) -> L {
        let s = L::splat;
        let x = if self.inverse {
            s(self.q).div(v.mul(t))
        } else {
            s(self.q).mul(v).div(t)
        };
        let em1 = float::exp_reduced(x).sub(s(1.0));
        let v2 = v.mul(v);
        let vn = match self.n {
            5 => v2.mul(v2).mul(v),
            4 => v2.mul(v2),
            3 => v2.mul(v),
            _ => v2,
        };
        let val = if self.inverse {
            s(self.coef).div(vn.mul(em1))
        } else {
            s(self.coef).mul(vn).div(em1)
        };
        val.where_within(x, core::f64::consts::LN_2, 700.0)
            .where_within(vn, f64::MIN_POSITIVE, f64::INFINITY)
            .where_within(val, f64::MIN_POSITIVE, f64::INFINITY)
    }

    /// Two values of the fast path.
    #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
    #[inline(never)]
    fn pair(&self, v: float::F64x2, t: float::F64x2) -> float::F64x2 {
        self.lanes(v, t)
    }

    /// One value of the fast path (lane 0 of [`Direct::pair`]: one copy of the code in the
    /// module), or NaN when the rest of [`density`] must be used.
    #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
    #[inline]
    fn point(&self, v: f64, t: f64) -> f64 {
        use float::Lanes;
        let y = self.pair(float::F64x2::splat(v), float::F64x2::splat(t));
        core::arch::wasm32::f64x2_extract_lane::<0>(y.0)
    }

    /// One value of the fast path, or NaN when the rest of [`density`] must be used.
    #[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
    #[inline]
    fn point(&self, v: f64, t: f64) -> f64 {
        self.lanes(v, t)
    }

    /// The densities at two coordinates `v` (validated: positive and finite, in the spectrum's
    /// SI unit) at one temperature `t` (validated): each lane exactly [`Direct::density`] at its
    /// coordinate (the same operations per lane; with simd128 both on one vector).
    #[inline]
    pub(crate) fn density2(&self, spec: &Spectrum, v: [f64; 2], t: f64) -> [f64; 2] {
        #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
        let y = {
            use core::arch::wasm32::{f64x2, f64x2_extract_lane};
            use float::Lanes;
            let y = self.pair(float::F64x2(f64x2(v[0], v[1])), float::F64x2::splat(t));
            [f64x2_extract_lane::<0>(y.0), f64x2_extract_lane::<1>(y.0)]
        };
        #[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
        let y = self.lanes(v, [t, t]);
        let [y0, y1] = y;
        [
            if ok(y0) {
                y0
            } else {
                density(spec, v[0], t, false)
            },
            if ok(y1) {
                y1
            } else {
                density(spec, v[1], t, false)
            },
        ]
    }

    /// The densities at the coordinates `vs` (validated: positive and finite, in the spectrum's
    /// SI unit) at temperature `t` (validated), times `factor`, written over `vs`: one loop over
    /// constants prepared once; with simd128, two coordinates per step through [`Direct::pair`].
    #[cfg_attr(not(feature = "wasm"), allow(dead_code))]
    pub(crate) fn fill(&self, spec: &Spectrum, vs: &mut [f64], t: f64, factor: f64) {
        #[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
        for p in vs.chunks_mut(2) {
            use core::arch::wasm32::{f64x2, f64x2_extract_lane};
            use float::Lanes;
            // an odd last element is paired with itself
            let a = p[0];
            let b = p.get(1).copied().unwrap_or(a);
            let y = self.pair(float::F64x2(f64x2(a, b)), float::F64x2::splat(t));
            let y = [f64x2_extract_lane::<0>(y.0), f64x2_extract_lane::<1>(y.0)];
            for (o, y) in p.iter_mut().zip(y) {
                *o = factor
                    * if ok(y) {
                        y
                    } else {
                        density(spec, *o, t, false)
                    };
            }
        }
        #[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
        for v in vs.iter_mut() {
            let y = self.point(*v, t);
            *v = factor
                * if ok(y) {
                    y
                } else {
                    density(spec, *v, t, false)
                };
        }
    }
}

/// ε n² g · K·v^p/(eˣ − 1), or its T-derivative; inputs validated. Out of line: one copy serves
/// the point, the bulk loop's fallback and the derivative.
#[inline(never)]
fn density(spec: &Spectrum, v: f64, t: f64, d_dt: bool) -> f64 {
    let direct = Direct::of(spec);
    // values: the lanes form (as the bulk loop) for ln 2 ≤ x < 700, then `eval` (expm1 below
    // ln 2), then the logarithmic form; derivatives: `eval`, then the logarithmic form
    let mut y = if d_dt { f64::NAN } else { direct.point(v, t) };
    if !ok(y) {
        y = direct.eval(v, t, d_dt);
    }
    if ok(y) {
        return y;
    }
    let kn = spec.kernel();
    // Logarithmic evaluation: correct tiny or huge values, 0 or ∞ only outside the f64 range.
    let (x, lnx) = reduced_x(kn, v, t);
    let mut lnv = spec.ln_scaled(kn.k) + f64::from(kn.p) * float::ln(v) - ln_expm1(x, lnx);
    if d_dt {
        lnv += lnx - float::ln(t) - ln_one_minus_exp_neg(x, lnx);
    }
    float::exp(lnv)
}

/// coef · r^n with a logarithmic fallback so that r^n overflowing or underflowing on its own
/// does not spoil a representable product (coef > 0, r > 0).
pub(crate) fn scaled_power(coef: f64, r: f64, n: i32) -> f64 {
    scaled_power_ln(coef, float::ln(coef), r, n)
}

/// As [`scaled_power`] with ln(coef) supplied (coef itself may have underflowed).
pub(crate) fn scaled_power_ln(coef: f64, ln_coef: f64, r: f64, n: i32) -> f64 {
    let rn = float::powi(r, n);
    let v = coef * rn;
    if ok(coef) && ok(rn) && ok(v) {
        v
    } else {
        float::exp(ln_coef + f64::from(n) * float::ln(r))
    }
}

fn check_t(temperature_k: f64) -> Result<f64> {
    error::temperature("temperature_k", temperature_k)
}

/// Blackbody spectral radiance per vacuum wavelength in vacuum, W·m⁻²·sr⁻¹·m⁻¹ (CODATA c₂).
///
/// # Formula
/// ```text
/// L_λ = 2hc² / λ⁵ / (exp(c₂/(λT)) − 1),  c₂ = hc/k
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveSpectral` for `wavelength_m`; `NonFinite`/`NonPositiveTemperature`
/// for `temperature_k`.
///
/// # Accuracy
/// See [`Spectrum::spectral`] (≤ 6.2e-15 relative against mpmath over the reference table).
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_radiance_wavelength;
/// // 0.5 µm at 5800 K: 2.688 219 962 592 930 7e13 W·m⁻²·sr⁻¹·m⁻¹ (mpmath, 40 digits).
/// let v = spectral_radiance_wavelength(0.5e-6, 5800.0).unwrap();
/// assert!((v / 2.688_219_962_592_930_7e13 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al., Thermal Radiation Heat Transfer, 7th ed. (2020), ch. 1.
pub fn spectral_radiance_wavelength(wavelength_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY.spectral(wavelength_m, temperature_k)
}

/// Blackbody spectral radiance per vacuum wavenumber (m⁻¹), W·m⁻²·sr⁻¹/(m⁻¹).
///
/// # Formula
/// ```text
/// L_σ = 2hc² σ̃³ / (exp(c₂σ̃/T) − 1)
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveSpectral` for `wavenumber_per_m`; temperature errors.
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_radiance_wavenumber;
/// // σ̃ = 1e5 m⁻¹ (1000 cm⁻¹) at 300 K: 9.924 033 330 070 694 67e-4 (mpmath).
/// let v = spectral_radiance_wavenumber(1e5, 300.0).unwrap();
/// assert!((v / 9.924_033_330_070_695e-4 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_radiance_wavenumber(wavenumber_per_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_variable(SpectralVariable::Wavenumber)
        .spectral(wavenumber_per_m, temperature_k)
}

/// Blackbody spectral radiance per frequency, W·m⁻²·sr⁻¹·Hz⁻¹.
///
/// # Formula
/// ```text
/// L_ν = 2hν³/c² / (exp(hν/(kT)) − 1)
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveSpectral` for `frequency_hz`; temperature errors.
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_radiance_frequency;
/// // 10 THz at 300 K: 3.731 225 896 155 288e-12 W·m⁻²·sr⁻¹·Hz⁻¹ (mpmath).
/// let v = spectral_radiance_frequency(1e13, 300.0).unwrap();
/// assert!((v / 3.731_225_896_155_288e-12 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_radiance_frequency(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_variable(SpectralVariable::Frequency)
        .spectral(frequency_hz, temperature_k)
}

/// Blackbody spectral photon radiance per vacuum wavelength, photons·s⁻¹·m⁻²·sr⁻¹·m⁻¹.
///
/// # Formula
/// ```text
/// L_p,λ = 2c / λ⁴ / (exp(c₂/(λT)) − 1)
/// ```
///
/// # Errors
/// As [`spectral_radiance_wavelength`].
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_photon_radiance_wavelength;
/// // 10 µm at 300 K: 4.995 874 060 375 493e26 (mpmath).
/// let v = spectral_photon_radiance_wavelength(10e-6, 300.0).unwrap();
/// assert!((v / 4.995_874_060_375_493e26 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_photon_radiance_wavelength(wavelength_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_quantity(Quantity::Photon)
        .spectral(wavelength_m, temperature_k)
}

/// Blackbody spectral photon radiance per frequency, photons·s⁻¹·m⁻²·sr⁻¹·Hz⁻¹.
///
/// # Formula
/// ```text
/// L_p,ν = 2ν²/c² / (exp(hν/(kT)) − 1)
/// ```
///
/// # Errors
/// As [`spectral_radiance_frequency`].
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::{spectral_photon_radiance_frequency, spectral_radiance_frequency};
/// // photon density = energy density / (hν)
/// let p = spectral_photon_radiance_frequency(1e13, 300.0).unwrap();
/// let e = spectral_radiance_frequency(1e13, 300.0).unwrap();
/// assert!((p * 6.626_070_15e-34 * 1e13 / e - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_photon_radiance_frequency(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::new(
        SpectralVariable::Frequency,
        Quantity::Photon,
        Geometry::Radiance,
    )
    .spectral(frequency_hz, temperature_k)
}

/// Blackbody spectral photon radiance per vacuum wavenumber, photons·s⁻¹·m⁻²·sr⁻¹/(m⁻¹).
///
/// # Formula
/// ```text
/// L_p,σ = 2c σ̃² / (exp(c₂σ̃/T) − 1)
/// ```
///
/// # Errors
/// As [`spectral_radiance_wavenumber`].
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::{spectral_photon_radiance_wavenumber, spectral_radiance_wavenumber};
/// // photon density = energy density / (hcσ̃)
/// let p = spectral_photon_radiance_wavenumber(1e5, 300.0).unwrap();
/// let e = spectral_radiance_wavenumber(1e5, 300.0).unwrap();
/// assert!((p * 6.626_070_15e-34 * 299_792_458.0 * 1e5 / e - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_photon_radiance_wavenumber(
    wavenumber_per_m: f64,
    temperature_k: f64,
) -> Result<f64> {
    Spectrum::new(
        SpectralVariable::Wavenumber,
        Quantity::Photon,
        Geometry::Radiance,
    )
    .spectral(wavenumber_per_m, temperature_k)
}

/// ∂L_σ/∂T of blackbody spectral radiance per wavenumber, W·m⁻²·sr⁻¹/(m⁻¹)·K⁻¹.
///
/// # Formula
/// ```text
/// ∂L_σ/∂T = L_σ · x eˣ / ((eˣ − 1) T),  x = c₂σ̃/T
/// ```
///
/// # Errors
/// As [`spectral_radiance_wavenumber`].
///
/// # Accuracy
/// As [`Spectrum::spectral_d_dt`].
///
/// # Examples
/// ```
/// use quantaband::planck::d_spectral_radiance_wavenumber_dt;
/// // σ̃ = 1e5 m⁻¹ is λ = 10 µm: ∂L_σ/∂T = λ² ∂L_λ/∂T = 1e-10 × 1.599 715 672 513 219 4e5
/// // (mpmath value of ∂L_λ/∂T at 10 µm, 300 K).
/// let d = d_spectral_radiance_wavenumber_dt(1e5, 300.0).unwrap();
/// assert!((d / 1.599_715_672_513_219_4e-5 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901), differentiated.
pub fn d_spectral_radiance_wavenumber_dt(wavenumber_per_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_variable(SpectralVariable::Wavenumber)
        .spectral_d_dt(wavenumber_per_m, temperature_k)
}

/// Blackbody spectral exitance per vacuum wavelength, W·m⁻²·m⁻¹ (π × radiance).
///
/// # Formula
/// ```text
/// M_λ = 2πhc² / λ⁵ / (exp(c₂/(λT)) − 1) = c₁ / λ⁵ / (exp(c₂/(λT)) − 1)
/// ```
///
/// # Errors
/// As [`spectral_radiance_wavelength`].
///
/// # Accuracy
/// As [`Spectrum::spectral`].
///
/// # Examples
/// ```
/// use quantaband::planck::spectral_exitance_wavelength;
/// // π × 9.924 033 330 070 695e6 at 10 µm, 300 K (mpmath radiance × π).
/// let m = spectral_exitance_wavelength(10e-6, 300.0).unwrap();
/// assert!((m / (core::f64::consts::PI * 9.924_033_330_070_695e6) - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901); Howell et al. (2020), ch. 1.
pub fn spectral_exitance_wavelength(wavelength_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::new(
        SpectralVariable::Wavelength,
        Quantity::Energy,
        Geometry::Exitance,
    )
    .spectral(wavelength_m, temperature_k)
}

/// ∂L_λ/∂T of blackbody spectral radiance per wavelength, W·m⁻²·sr⁻¹·m⁻¹·K⁻¹.
///
/// # Formula
/// ```text
/// ∂L_λ/∂T = L_λ · x eˣ / ((eˣ − 1) T),  x = c₂/(λT)
/// ```
///
/// # Errors
/// As [`spectral_radiance_wavelength`].
///
/// # Accuracy
/// As [`Spectrum::spectral_d_dt`].
///
/// # Examples
/// ```
/// use quantaband::planck::d_spectral_radiance_wavelength_dt;
/// // 10 µm, 300 K: 1.599 715 672 513 219 4e5 (mpmath).
/// let d = d_spectral_radiance_wavelength_dt(10e-6, 300.0).unwrap();
/// assert!((d / 1.599_715_672_513_219_4e5 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Planck (1901), differentiated.
pub fn d_spectral_radiance_wavelength_dt(wavelength_m: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY.spectral_d_dt(wavelength_m, temperature_k)
}

/// ∂L_ν/∂T of blackbody spectral radiance per frequency, W·m⁻²·sr⁻¹·Hz⁻¹·K⁻¹.
///
/// # Formula
/// ```text
/// ∂L_ν/∂T = L_ν · x eˣ / ((eˣ − 1) T),  x = hν/(kT)
/// ```
///
/// # Errors
/// As [`spectral_radiance_frequency`].
///
/// # Accuracy
/// As [`Spectrum::spectral_d_dt`].
///
/// # Examples
/// ```
/// use quantaband::planck::{d_spectral_radiance_frequency_dt, spectral_radiance_frequency};
/// // Rayleigh–Jeans regime (hν ≪ kT): ∂L/∂T → L/T.
/// let (nu, t) = (1e6, 300.0);
/// let d = d_spectral_radiance_frequency_dt(nu, t).unwrap();
/// let l = spectral_radiance_frequency(nu, t).unwrap();
/// assert!((d * t / l - 1.0).abs() < 1e-6);
/// ```
///
/// # References
/// Planck (1901), differentiated.
pub fn d_spectral_radiance_frequency_dt(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_variable(SpectralVariable::Frequency)
        .spectral_d_dt(frequency_hz, temperature_k)
}

/// Blackbody total (hemispherical) exitance σT⁴, W·m⁻² (Stefan–Boltzmann law, vacuum).
///
/// # Formula
/// ```text
/// M = σ T⁴,  σ = 2π⁵k⁴/(15h³c²) = 5.670 374 419…e-8 W·m⁻²·K⁻⁴
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp (σ is the f64 nearest the exact CODATA 2018 value).
///
/// # Examples
/// ```
/// use quantaband::planck::total_exitance;
/// assert!((total_exitance(300.0).unwrap() / 459.300_327_953_938_8 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// CODATA 2018 (σ); J. Stefan (1879); L. Boltzmann (1884).
pub fn total_exitance(temperature_k: f64) -> Result<f64> {
    let t = check_t(temperature_k)?;
    Ok(scaled_power(crate::constants::STEFAN_BOLTZMANN_SIGMA, t, 4))
}

/// Blackbody total radiance σT⁴/π, W·m⁻²·sr⁻¹ (vacuum).
///
/// # Formula
/// ```text
/// L = σ T⁴ / π
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::total_radiance;
/// let l = total_radiance(300.0).unwrap();
/// assert!((l * core::f64::consts::PI / 459.300_327_953_938_8 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// CODATA 2018 (σ).
pub fn total_radiance(temperature_k: f64) -> Result<f64> {
    let t = check_t(temperature_k)?;
    Ok(scaled_power(
        crate::constants::STEFAN_BOLTZMANN_SIGMA / core::f64::consts::PI,
        t,
        4,
    ))
}

/// Blackbody total photon exitance, photons·s⁻¹·m⁻² (vacuum).
///
/// # Formula
/// ```text
/// M_p = 4πζ(3) k³T³ / (h³c²) = 2π · 2ζ(3) · c (T/c₂)³
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::total_photon_exitance;
/// // 300 K: 4.105 244 320 361 467 8e22 photons·s⁻¹·m⁻² (mpmath).
/// let m = total_photon_exitance(300.0).unwrap();
/// assert!((m / 4.105_244_320_361_467_8e22 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Howell et al. (2020), ch. 1 (photon emission); ζ(3) from mpmath.
pub fn total_photon_exitance(temperature_k: f64) -> Result<f64> {
    Spectrum::new(
        SpectralVariable::Wavelength,
        Quantity::Photon,
        Geometry::Exitance,
    )
    .total(temperature_k)
}

/// Number of photons per unit volume in blackbody radiation, m⁻³ (vacuum).
///
/// # Formula
/// ```text
/// n_γ = (2ζ(3)/π²) (kT/(ħc))³ = 16π ζ(3) (T/c₂)³
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::photon_number_density;
/// // 300 K: 5.477 448 429 154 903e14 m⁻³ (mpmath).
/// let n = photon_number_density(300.0).unwrap();
/// assert!((n / 5.477_448_429_154_903e14 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// L. D. Landau, E. M. Lifshitz, Statistical Physics Part 1, §63 (black-body radiation).
pub fn photon_number_density(temperature_k: f64) -> Result<f64> {
    let t = check_t(temperature_k)?;
    let coef = 16.0 * core::f64::consts::PI * ZETA_3;
    Ok(scaled_power(coef, t / crate::constants::C2, 3))
}

/// Energy density of blackbody radiation aT⁴, J·m⁻³ (vacuum).
///
/// # Formula
/// ```text
/// u = a T⁴,  a = 4σ/c
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::{energy_density, total_exitance};
/// let u = energy_density(300.0).unwrap();
/// assert!((u * 299_792_458.0 / 4.0 / total_exitance(300.0).unwrap() - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// CODATA 2018 (radiation constant a = 4σ/c).
pub fn energy_density(temperature_k: f64) -> Result<f64> {
    let t = check_t(temperature_k)?;
    Ok(scaled_power(crate::constants::RADIATION_A, t, 4))
}

/// Mean photon energy of blackbody radiation, J.
///
/// # Formula
/// ```text
/// ⟨E⟩ = u / n_γ = π⁴ / (30 ζ(3)) · kT ≈ 2.701 178 kT
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::mean_photon_energy_j;
/// // 300 K: 1.118 813 624 991 501 8e-20 J (mpmath).
/// let e = mean_photon_energy_j(300.0).unwrap();
/// assert!((e / 1.118_813_624_991_501_8e-20 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Landau & Lifshitz, Statistical Physics Part 1, §63.
pub fn mean_photon_energy_j(temperature_k: f64) -> Result<f64> {
    let t = check_t(temperature_k)?;
    Ok(PI4_OVER_15 / TWO_ZETA_3 * BOLTZMANN_K * t)
}

/// Wavelength of maximum blackbody spectral radiance (energy, per wavelength), m.
///
/// # Formula
/// ```text
/// λ_max = b / T,  b = hc/(k x₅) = 2.897 771 955…e-3 m·K, x₅ = 5 + W₀(−5e⁻⁵)
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::peak_wavelength_m;
/// assert!((peak_wavelength_m(1000.0).unwrap() / 2.897_771_955e-6 - 1.0).abs() < 1e-9);
/// ```
///
/// # References
/// CODATA 2018 (Wien wavelength displacement law constant b).
pub fn peak_wavelength_m(temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY.peak(temperature_k)
}

/// Frequency of maximum blackbody spectral radiance per frequency, Hz.
///
/// # Formula
/// ```text
/// ν_max = b′ T,  b′ = x₃ k/h = 5.878 925 757…e10 Hz/K, x₃ = 3 + W₀(−3e⁻³)
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::peak_frequency_hz;
/// assert!((peak_frequency_hz(1000.0).unwrap() / 5.878_925_757e13 - 1.0).abs() < 1e-9);
/// ```
///
/// # References
/// CODATA 2018 (Wien frequency displacement law constant b′).
pub fn peak_frequency_hz(temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_variable(SpectralVariable::Frequency)
        .peak(temperature_k)
}

/// Wavelength of maximum blackbody spectral photon radiance per wavelength, m.
///
/// # Formula
/// ```text
/// λ_max,p = c₂ / (x₄ T),  x₄ = 4 + W₀(−4e⁻⁴) = 3.920 690 394 872 886…
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::peak_photon_wavelength_m;
/// // c₂/(x₄·1000 K) = 3.669 651 …e-6 m (x₄ from mpmath lambertw).
/// let l = peak_photon_wavelength_m(1000.0).unwrap();
/// assert!((l / (1.438_776_877_503_933_8e-2 / 3.920_690_394_872_886 / 1000.0) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Peak of the photon form of Planck's law; x₄ via the Lambert W function.
pub fn peak_photon_wavelength_m(temperature_k: f64) -> Result<f64> {
    Spectrum::BLACKBODY
        .with_quantity(Quantity::Photon)
        .peak(temperature_k)
}

/// Frequency of maximum blackbody spectral photon radiance per frequency, Hz.
///
/// # Formula
/// ```text
/// ν_max,p = x₂ kT / h,  x₂ = 2 + W₀(−2e⁻²) = 1.593 624 260 040 040…
/// ```
///
/// # Errors
/// `NonFinite`/`NonPositiveTemperature` for `temperature_k`.
///
/// # Accuracy
/// A few ulp.
///
/// # Examples
/// ```
/// use quantaband::planck::peak_photon_frequency_hz;
/// let nu = peak_photon_frequency_hz(1000.0).unwrap();
/// assert!((nu / (1.593_624_260_040_040 * 1.380_649e-23 * 1000.0 / 6.626_070_15e-34) - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// Peak of the photon form of Planck's law; x₂ via the Lambert W function.
pub fn peak_photon_frequency_hz(temperature_k: f64) -> Result<f64> {
    Spectrum::new(
        SpectralVariable::Frequency,
        Quantity::Photon,
        Geometry::Radiance,
    )
    .peak(temperature_k)
}

impl Spectrum {
    /// This spectrum with another spectral variable (wavelength m, wavenumber m⁻¹, frequency Hz).
    ///
    /// # Formula
    /// ```text
    /// same physics, densities per unit of the new variable
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{SpectralVariable, Spectrum};
    /// let s = Spectrum::default().with_variable(SpectralVariable::Wavenumber);
    /// assert_eq!(s.variable, SpectralVariable::Wavenumber);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1.
    pub const fn with_variable(mut self, variable: SpectralVariable) -> Self {
        self.variable = variable;
        self
    }

    /// This spectrum with another quantity (energy in W or photons in photons/s).
    ///
    /// # Formula
    /// ```text
    /// photon density = energy density / (hc/λ)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{Quantity, Spectrum};
    /// let s = Spectrum::default().with_quantity(Quantity::Photon);
    /// assert_eq!(s.quantity, Quantity::Photon);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1.
    pub const fn with_quantity(mut self, quantity: Quantity) -> Self {
        self.quantity = quantity;
        self
    }

    /// This spectrum with another geometry (radiance per sr, or hemispherical exitance).
    ///
    /// # Formula
    /// ```text
    /// exitance = π × radiance (Lambertian emitter)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact: the value is stored, not computed.
    ///
    /// # Examples
    /// ```
    /// use quantaband::planck::{Geometry, Spectrum};
    /// let m = Spectrum::default().with_geometry(Geometry::Exitance).spectral(1e-5, 300.0).unwrap();
    /// let l = Spectrum::default().spectral(1e-5, 300.0).unwrap();
    /// assert!((m / l / core::f64::consts::PI - 1.0).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Howell et al. (2020), ch. 1 (emissive power = π × intensity).
    pub const fn with_geometry(mut self, geometry: Geometry) -> Self {
        self.geometry = geometry;
        self
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wien_and_rayleigh_jeans_limits() {
        // Wien limit (x ≫ 1): L → 2hc²/λ⁵ e^−x, x = 40 gives a relative difference e^−40.
        let t = 300.0;
        let lam = crate::constants::C2 / (40.0 * t);
        let l = spectral_radiance_wavelength(lam, t).unwrap();
        let wien = C1L / float::powi(lam, 5) * float::exp(-40.0);
        assert!((l / wien - 1.0).abs() < 1e-14);
        // Rayleigh–Jeans (x ≪ 1): L → 2ckT/λ⁴ · (1 − x/2 + …); x = 1e-6.
        let lam = crate::constants::C2 / (1e-6 * t);
        let l = spectral_radiance_wavelength(lam, t).unwrap();
        let rj = 2.0 * SPEED_OF_LIGHT_C * BOLTZMANN_K * t / float::powi(lam, 4);
        assert!((l / rj - 1.0).abs() < 1e-6);
    }

    #[test]
    fn extreme_inputs_are_finite_or_zero() {
        for &lam in &[1e-300, 1e-12, 1e-9, 1.0, 1e10, 1e300] {
            for &t in &[1e-300, 1e-3, 1.0, 1e6, 1e300] {
                let v = spectral_radiance_wavelength(lam, t).unwrap();
                let d = d_spectral_radiance_wavelength_dt(lam, t).unwrap();
                assert!(!v.is_nan() && v >= 0.0, "{lam} {t} {v}");
                assert!(!d.is_nan() && d >= 0.0, "{lam} {t} {d}");
            }
        }
    }
}
