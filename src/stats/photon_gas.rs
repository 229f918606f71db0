//! Thermal photons: noise temperatures and available noise power in the microwave/THz range,
//! Rayleigh–Jeans brightness temperature and its inverse, the photon density of states, the
//! spectral energy density built from it, and the bulk properties of blackbody radiation
//! (number, energy and entropy density, pressure, mean photon energy).
//!
//! # Zero-point convention
//! Two noise conventions are in use and both are offered, with explicit names:
//! - *thermal only* — n̄·hf per unit bandwidth ([`available_noise_power_density`]), whose
//!   temperature equivalent is the Rayleigh–Jeans brightness temperature
//!   [`rayleigh_jeans_brightness_temperature`] = (hf/k)·n̄;
//! - *with the zero-point half quantum* — (n̄ + ½)·hf ([`available_noise_power_density_with_zero_point`]),
//!   whose temperature equivalent is the Callen–Welton noise temperature
//!   [`quantum_noise_temperature`] = (hf/2k)·coth(hf/2kT), which tends to hf/2k as T → 0.
//!
//! Both tend to k·T (resp. T) when hf ≪ kT.
//!
//! # Numerical notes
//! Powers of T are formed as `((c·T)·T)·T…`, whose partial products move monotonically towards
//! the result, so nothing overflows or underflows unless the result itself does. The spectral
//! energy density switches to logarithms when `E³` or the occupancy leaves the normal f64 range
//! (then the relative error is ≈ 1e-13 instead of a few ulp).
#![forbid(unsafe_code)]

use core::f64::consts::PI;

use super::occupancy::{be_unchecked, reduced_energy, reduced_photon_energy, H_OVER_K};
use crate::constants::{BOLTZMANN_K, PLANCK_H, RADIATION_A, SPEED_OF_LIGHT_C};
use crate::error::{self, Result};
use crate::float;

/// 2ζ(3)/π²·(k/ħc)³, photons per m³ per K³ (mpmath, from exact h, c, k).
const PHOTON_NUMBER_COEF: f64 = 20_286_846.033_907_05;
/// 4a/3, J·m⁻³·K⁻³ (a the radiation constant; mpmath).
const ENTROPY_COEF: f64 = 1.008_764_433_370_667_3e-15;
/// a/3, Pa·K⁻⁴ (mpmath).
const PRESSURE_COEF: f64 = 2.521_911_083_426_668e-16;
/// π⁴/(30ζ(3))·k, J/K (mpmath; π⁴/(30ζ(3)) = 2.701 178 032 919 063 896…).
const MEAN_ENERGY_COEF: f64 = 3.729_378_749_971_673e-23;
/// h·c, J·m (exact product of SI 2019 values).
const HC: f64 = 1.986_445_857_148_928_7e-25;
/// k/(h·c), m⁻¹·K⁻¹ (mpmath).
const K_OVER_HC: f64 = 69.503_480_048_612_74;
/// 8π.
const EIGHT_PI: f64 = 8.0 * PI;

/// Callen–Welton (quantum) noise temperature, in kelvin, of a resistor or a single-mode
/// thermal source at physical temperature `temperature_k` (K), observed at `frequency_hz` (Hz).
/// Includes the zero-point half quantum.
///
/// # Formula
/// ```text
/// T_n = (h f / 2k) · coth(h f / 2k T) = (h f / k)·(n̄ + ½),   n̄ = 1/(e^{hf/kT} − 1)
/// ```
/// h Planck constant, k Boltzmann constant, f = `frequency_hz`, T = `temperature_k`.
/// T_n → T for hf ≪ kT and T_n → hf/2k (the standard quantum limit) for T → 0.
///
/// # Errors
/// - [`crate::Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`crate::Error::NonPositiveSpectral`] if `frequency_hz ≤ 0`.
/// - [`crate::Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// Maximum relative error 1.5e-16 against mpmath's `coth` at 50 digits on the 11 reference
/// rows (1 kHz to 1 PHz, 10 mK to 1 MK; asserted ≤ 1e-15 in `tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::quantum_noise_temperature;
/// // An invented 100 GHz receiver test load at 2.725 K: T_n = 3.395 447 552 296 995… K (mpmath)
/// let tn = quantum_noise_temperature(100e9, 2.725).unwrap();
/// assert!((tn / 3.395_447_552_296_995 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - H. B. Callen, T. A. Welton, "Irreversibility and generalized noise", Phys. Rev. 83, 34–40
///   (1951), doi:10.1103/PhysRev.83.34.
/// - A. R. Kerr, "Suggestions for revised definitions of noise quantities, including quantum
///   effects", IEEE Trans. Microwave Theory Tech. 47, 325–329 (1999), doi:10.1109/22.750234.
pub fn quantum_noise_temperature(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("temperature_k", temperature_k)?;
    let y = 0.5 * reduced_photon_energy(frequency_hz, temperature_k);
    if y < 1e-4 {
        // y·coth(y) = 1 + y²/3 − y⁴/45 + …; the dropped term is < 2.3e-18.
        Ok(temperature_k * (1.0 + y * y / 3.0))
    } else {
        Ok(0.5 * H_OVER_K * frequency_hz / float::tanh(y))
    }
}

/// Rayleigh–Jeans brightness temperature (K) at `frequency_hz` (Hz) of a blackbody at physical
/// temperature `temperature_k` (K): the temperature a Rayleigh–Jeans (classical) source would
/// need to give the same thermal-only power. No zero-point term.
///
/// # Formula
/// ```text
/// T_RJ = (h f / k) · n̄ = (h f / k) / (e^{hf/kT} − 1)
/// ```
/// T_RJ → T − hf/2k for hf ≪ kT, and T_RJ ≈ (hf/k)·e^{−hf/kT} for hf ≫ kT.
///
/// # Errors
/// - [`crate::Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`crate::Error::NonPositiveSpectral`] if `frequency_hz ≤ 0`.
/// - [`crate::Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// Maximum relative error 1.9e-16 × max(1, hf/kT) against mpmath at 50 digits on the 11
/// reference rows: on the Wien side the rounding of x = hf/kT is amplified by x, as for
/// [`crate::stats::thermal_photon_number`] (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::rayleigh_jeans_brightness_temperature;
/// // 100 GHz, 2.725 K: T_RJ = 0.995 826 015 613 884 7… K (mpmath)
/// let t = rayleigh_jeans_brightness_temperature(100e9, 2.725).unwrap();
/// assert!((t / 0.995_826_015_613_884_7 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - J. J. Condon, S. M. Ransom, *Essential Radio Astronomy*, Princeton University Press
///   (2016), §2.1 (brightness temperature) (from memory).
pub fn rayleigh_jeans_brightness_temperature(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("temperature_k", temperature_k)?;
    Ok(rj_unchecked(frequency_hz, temperature_k))
}

fn rj_unchecked(frequency_hz: f64, temperature_k: f64) -> f64 {
    let x = reduced_photon_energy(frequency_hz, temperature_k);
    if x == 0.0 {
        temperature_k
    } else if x <= 1.0 {
        temperature_k * (x / float::expm1(x))
    } else {
        (H_OVER_K * frequency_hz) * be_unchecked(x)
    }
}

/// Physical temperature (K) of a blackbody whose Rayleigh–Jeans brightness temperature at
/// `frequency_hz` (Hz) is `brightness_temperature_k` (K): the inverse of
/// [`rayleigh_jeans_brightness_temperature`].
///
/// # Formula
/// ```text
/// T = (h f / k) / ln(1 + h f / (k T_RJ))
/// ```
/// For `r = hf/(kT_RJ) < 1e-6` the series `T = T_RJ·(1 + r/2 − r²/12)` is used (error < 1e-19).
///
/// # Errors
/// - [`crate::Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`crate::Error::NonPositiveSpectral`] if `frequency_hz ≤ 0`.
/// - [`crate::Error::NonPositiveTemperature`] if `brightness_temperature_k ≤ 0`.
///
/// # Accuracy
/// Round trip T → T_RJ → T within 1e-14 relative for T from 1e-3 K to 1e8 K and f from 1 MHz to
/// 1 PHz with hf/kT ≤ 700 (`tests/stats_properties.rs`); the mpmath rows are inverted to 1e-15
/// relative, scaled by max(1, hf/kT) (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::{
///     physical_temperature_from_rayleigh_jeans, rayleigh_jeans_brightness_temperature,
/// };
/// let t_rj = rayleigh_jeans_brightness_temperature(300e9, 20.0).unwrap();
/// let t = physical_temperature_from_rayleigh_jeans(300e9, t_rj).unwrap();
/// assert!((t - 20.0).abs() < 1e-13);
/// ```
///
/// # References
/// - J. J. Condon, S. M. Ransom, *Essential Radio Astronomy* (2016), §2.1 (from memory).
pub fn physical_temperature_from_rayleigh_jeans(
    frequency_hz: f64,
    brightness_temperature_k: f64,
) -> Result<f64> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("brightness_temperature_k", brightness_temperature_k)?;
    let a = H_OVER_K * frequency_hz;
    let r = a / brightness_temperature_k;
    if r < 1e-6 {
        return Ok(brightness_temperature_k * (1.0 + r * (0.5 - r / 12.0)));
    }
    let log = if r.is_finite() {
        float::ln_1p(r)
    } else {
        // hf/kT_RJ overflowed: ln(1 + r) = ln a − ln T_RJ to within 1/r ≈ 0.
        float::ln(a) - float::ln(brightness_temperature_k)
    };
    Ok(a / log)
}

/// Available thermal noise power per unit bandwidth (W/Hz) of a matched source at
/// `temperature_k` (K) at `frequency_hz` (Hz), thermal part only (no zero-point term).
///
/// # Formula
/// ```text
/// P/Δf = n̄ · h f = k · T_RJ,    n̄ = 1/(e^{hf/kT} − 1)
/// ```
/// Tends to kT (Johnson–Nyquist) for hf ≪ kT. Add hf/2 for the zero-point convention
/// ([`available_noise_power_density_with_zero_point`]).
///
/// # Errors
/// As [`rayleigh_jeans_brightness_temperature`].
///
/// # Accuracy
/// That of [`rayleigh_jeans_brightness_temperature`] plus one rounding.
///
/// # Examples
/// ```
/// use quantaband::stats::available_noise_power_density;
/// // 1 MHz, 290 K: essentially kT = 4.003 882 1e-21 W/Hz (hf/kT = 1.7e-7)
/// let p = available_noise_power_density(1e6, 290.0).unwrap();
/// assert!((p / (1.380_649e-23 * 290.0) - 1.0).abs() < 1e-7);
/// ```
///
/// # References
/// - H. Nyquist, "Thermal agitation of electric charge in conductors", Phys. Rev. 32, 110–113
///   (1928), doi:10.1103/PhysRev.32.110 (eq. 8, including the quantum form).
pub fn available_noise_power_density(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    Ok(BOLTZMANN_K * rayleigh_jeans_brightness_temperature(frequency_hz, temperature_k)?)
}

/// Available noise power per unit bandwidth (W/Hz) of a matched source at `temperature_k` (K)
/// at `frequency_hz` (Hz), *including* the zero-point half quantum hf/2.
///
/// # Formula
/// ```text
/// P/Δf = (n̄ + ½) · h f = (h f / 2)·coth(h f / 2kT) = k · T_n
/// ```
/// T_n the [`quantum_noise_temperature`]. Tends to hf/2 as T → 0.
///
/// # Errors
/// As [`quantum_noise_temperature`].
///
/// # Accuracy
/// That of [`quantum_noise_temperature`] plus one rounding.
///
/// # Examples
/// ```
/// use quantaband::stats::available_noise_power_density_with_zero_point;
/// // At 10 mK and 1 THz the thermal part is negligible: P/Δf = hf/2 = 3.313 035 075e-22 W/Hz
/// let p = available_noise_power_density_with_zero_point(1e12, 0.01).unwrap();
/// assert!((p / 3.313_035_075e-22 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - H. B. Callen, T. A. Welton, Phys. Rev. 83, 34–40 (1951), doi:10.1103/PhysRev.83.34.
pub fn available_noise_power_density_with_zero_point(
    frequency_hz: f64,
    temperature_k: f64,
) -> Result<f64> {
    Ok(BOLTZMANN_K * quantum_noise_temperature(frequency_hz, temperature_k)?)
}

/// c·T^N with partial products that move monotonically towards the result.
#[inline]
fn coef_times_power(coef: f64, t: f64, n: u32) -> f64 {
    let mut v = coef;
    for _ in 0..n {
        v *= t;
    }
    v
}

/// Number of photons per unit volume (m⁻³) in blackbody radiation at `temperature_k` (K).
///
/// # Formula
/// ```text
/// n_γ = (2 ζ(3) / π²) · (k T / ħ c)³ ≈ 2.028 684 6e7 m⁻³K⁻³ · T³
/// ```
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveTemperature`] for a bad
/// `temperature_k`.
///
/// # Accuracy
/// ≤ 2 ulp of the mpmath value (`tests/stats_reference.rs`), T from 1e-70 K to 1e80 K.
///
/// # Examples
/// ```
/// use quantaband::stats::photon_number_density;
/// // Cosmic background at 2.725 K: 4.105e8 photons per m³ (mpmath: 4.105 008 426 944 470…e8)
/// let n = photon_number_density(2.725).unwrap();
/// assert!((n / 4.105_008_426_944_47e8 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - L. D. Landau, E. M. Lifshitz, *Statistical Physics, Part 1*, 3rd ed., Pergamon (1980),
///   §63 (from memory).
pub fn photon_number_density(temperature_k: f64) -> Result<f64> {
    let t = error::temperature("temperature_k", temperature_k)?;
    Ok(coef_times_power(PHOTON_NUMBER_COEF, t, 3))
}

/// Energy per unit volume (J/m³) of blackbody radiation at `temperature_k` (K).
///
/// # Formula
/// ```text
/// u = a T⁴,   a = 4σ/c = 8π⁵k⁴/(15 h³c³) = 7.565 733 25e-16 J·m⁻³·K⁻⁴
/// ```
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveTemperature`].
///
/// # Accuracy
/// ≤ 3 ulp (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::photon_energy_density;
/// let u = photon_energy_density(300.0).unwrap();
/// assert!((u / 6.128_243_932_726_804e-6 - 1.0).abs() < 1e-14); // a·300⁴
/// ```
///
/// # References
/// - Landau & Lifshitz, *Statistical Physics, Part 1* (1980), §63 (from memory).
pub fn photon_energy_density(temperature_k: f64) -> Result<f64> {
    let t = error::temperature("temperature_k", temperature_k)?;
    Ok(coef_times_power(RADIATION_A, t, 4))
}

/// Entropy per unit volume (J·K⁻¹·m⁻³) of blackbody radiation at `temperature_k` (K).
///
/// # Formula
/// ```text
/// s = 4 a T³ / 3
/// ```
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveTemperature`].
///
/// # Accuracy
/// ≤ 2 ulp (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::{photon_energy_density, photon_entropy_density, photon_pressure};
/// // Thermodynamic identity for a gas with μ = 0: T·s = u + p
/// let t = 1500.0;
/// let lhs = t * photon_entropy_density(t).unwrap();
/// let rhs = photon_energy_density(t).unwrap() + photon_pressure(t).unwrap();
/// assert!((lhs / rhs - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// - Landau & Lifshitz, *Statistical Physics, Part 1* (1980), §60, §63 (from memory).
pub fn photon_entropy_density(temperature_k: f64) -> Result<f64> {
    let t = error::temperature("temperature_k", temperature_k)?;
    Ok(coef_times_power(ENTROPY_COEF, t, 3))
}

/// Radiation pressure (Pa) of isotropic blackbody radiation at `temperature_k` (K).
///
/// # Formula
/// ```text
/// p = a T⁴ / 3 = u / 3
/// ```
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveTemperature`].
///
/// # Accuracy
/// ≤ 3 ulp (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::photon_pressure;
/// let p = photon_pressure(5772.0).unwrap();
/// assert!((p / 0.279_920_728_672_171_16 - 1.0).abs() < 1e-14); // a·5772⁴/3 (mpmath)
/// ```
///
/// # References
/// - Landau & Lifshitz, *Statistical Physics, Part 1* (1980), §63 (from memory).
pub fn photon_pressure(temperature_k: f64) -> Result<f64> {
    let t = error::temperature("temperature_k", temperature_k)?;
    Ok(coef_times_power(PRESSURE_COEF, t, 4))
}

/// Mean photon energy (J) of blackbody radiation at `temperature_k` (K): total energy density
/// divided by photon number density.
///
/// # Formula
/// ```text
/// ⟨E⟩ = u / n_γ = π⁴/(30 ζ(3)) · k T ≈ 2.701 178 · k T
/// ```
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveTemperature`].
///
/// # Accuracy
/// ≤ 1 ulp (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::constants::BOLTZMANN_K;
/// use quantaband::stats::mean_photon_energy;
/// let e = mean_photon_energy(1000.0).unwrap();
/// assert!((e / (BOLTZMANN_K * 1000.0) - 2.701_178_032_919_064).abs() < 1e-14);
/// ```
///
/// # References
/// - Landau & Lifshitz, *Statistical Physics, Part 1* (1980), §63 (from memory).
pub fn mean_photon_energy(temperature_k: f64) -> Result<f64> {
    let t = error::temperature("temperature_k", temperature_k)?;
    Ok(MEAN_ENERGY_COEF * t)
}

/// Photon density of states per unit volume and unit energy (J⁻¹·m⁻³), both polarisations, in
/// vacuum, at photon energy `energy_j` (J).
///
/// # Formula
/// ```text
/// g(E) = 8π E² / (h c)³
/// ```
/// h Planck constant, c speed of light. g(E) dE counts the modes per m³ with energy in
/// [E, E + dE]. Per unit frequency it is g_ν = 8πν²/c³.
///
/// # Errors
/// [`crate::Error::NonFinite`] / [`crate::Error::NonPositiveSpectral`] for a bad `energy_j`.
///
/// # Accuracy
/// ≤ 3 ulp against mpmath (`tests/stats_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::photon_density_of_states;
/// // 1 eV photons: g = 8π(1.602 176 634e-19)²/(hc)³ = 8.230 580 180 519 699…e37 J⁻¹m⁻³ (mpmath)
/// let g = photon_density_of_states(1.602_176_634e-19).unwrap();
/// assert!((g / 8.230_580_180_519_699e37 - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed. (1980), ch. 4 (from memory).
pub fn photon_density_of_states(energy_j: f64) -> Result<f64> {
    let e = error::spectral("energy_j", energy_j)?;
    let q = e / HC;
    Ok((EIGHT_PI / HC) * q * q)
}

/// 8π·scale·q³·n̄(x), with q = num/den = E/hc (m⁻¹) and x = E/kT, safe against overflow and
/// underflow of the factors. `scale` is 1 (per unit energy) or h (per unit frequency).
fn energy_density_core(num: f64, den: f64, x: f64, temperature_k: f64, scale: f64) -> f64 {
    if x == f64::INFINITY {
        // x > 1.8e308 while ln(8π q³) < 2400: e^{−x} wins, the true value is far below 1e-323.
        return 0.0;
    }
    let q = num / den;
    let normal = |a: f64| (f64::MIN_POSITIVE..=f64::MAX).contains(&a);
    if x < 1e-300 {
        // Rayleigh–Jeans: n̄ = 1/x to within x/2 ≈ 0, and q/x = kT/(hc).
        let q2 = q * q;
        let kt_hc = K_OVER_HC * temperature_k;
        let v = EIGHT_PI * scale * q2 * kt_hc;
        if normal(q2) && normal(kt_hc) && normal(v) {
            return v;
        }
        // q² may underflow while kT/(hc) overflows (tiny E with T near f64::MAX): 0·∞ would be
        // NaN although the product is representable, so go through logarithms.
        let ln_q = float::ln(num) - float::ln(den);
        return float::exp(
            float::ln(EIGHT_PI * scale)
                + 2.0 * ln_q
                + float::ln(K_OVER_HC)
                + float::ln(temperature_k),
        );
    }
    let n = be_unchecked(x);
    let lead = EIGHT_PI * scale * q * q * q;
    let v = lead * n;
    if normal(lead) && normal(n) && normal(v) {
        return v;
    }
    // Logarithmic route: ln n̄ = −x − ln(1 − e^{−x}) for x > 1, −ln(expm1 x) otherwise.
    let ln_n = if x > 1.0 {
        -x - float::ln_1p(-float::exp(-x))
    } else {
        -float::ln(float::expm1(x))
    };
    // ln q from num and den separately: q itself may have overflowed.
    let ln_q = float::ln(num) - float::ln(den);
    float::exp(float::ln(EIGHT_PI * scale) + 3.0 * ln_q + ln_n)
}

/// Spectral energy density of blackbody radiation per unit photon energy (J·m⁻³ per J, i.e.
/// m⁻³) at photon energy `energy_j` (J) and temperature `temperature_k` (K), built from the
/// photon density of states and the Bose–Einstein occupancy.
///
/// # Formula
/// ```text
/// u_E(E, T) = g(E) · E · n̄_BE(E/kT) = 8π E³ / ((hc)³ (e^{E/kT} − 1))
/// ```
/// Consistent with spectral radiance: u_E = u_ν / h and u_ν = 4π L_ν / c for the same
/// temperature (checked against `quantaband::planck` in `tests/stats_properties.rs`).
///
/// # Errors
/// - [`crate::Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`crate::Error::NonPositiveSpectral`] if `energy_j ≤ 0`.
/// - [`crate::Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// Maximum relative error 2.6e-16 × max(1, E/kT) against mpmath at 50 digits on the 6
/// reference rows (`tests/stats_reference.rs`); in the extreme region where E³ or n̄ leave the
/// normal f64 range the logarithmic route is ≈ 1e-13 relative (tiny E with T near f64::MAX
/// checked to 1e-12 against mpmath in `tests/review_regressions.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::spectral_energy_density_energy;
/// // 1 eV photons in a 5772 K cavity: 2.039 117 555 934 789e18 m⁻³ (mpmath)
/// let u = spectral_energy_density_energy(1.602_176_634e-19, 5772.0).unwrap();
/// assert!((u / 2.039_117_555_934_789e18 - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// - M. Planck, Ann. Phys. 309, 553–563 (1901), doi:10.1002/andp.19013090310.
/// - C. Kittel, H. Kroemer, *Thermal Physics*, 2nd ed. (1980), ch. 4 (from memory).
pub fn spectral_energy_density_energy(energy_j: f64, temperature_k: f64) -> Result<f64> {
    let e = error::spectral("energy_j", energy_j)?;
    let t = error::temperature("temperature_k", temperature_k)?;
    let x = reduced_energy(e, t);
    Ok(energy_density_core(e, HC, x, t, 1.0))
}

/// Spectral energy density of blackbody radiation per unit frequency (J·m⁻³·Hz⁻¹) at
/// `frequency_hz` (Hz) and `temperature_k` (K).
///
/// # Formula
/// ```text
/// u_ν(ν, T) = (8π h ν³ / c³) / (e^{hν/kT} − 1) = h · u_E(hν, T) = 4π L_ν(ν, T) / c
/// ```
/// L_ν the blackbody spectral radiance per unit frequency.
///
/// # Errors
/// - [`crate::Error::NonFinite`] for NaN or ±∞ inputs.
/// - [`crate::Error::NonPositiveSpectral`] if `frequency_hz ≤ 0`.
/// - [`crate::Error::NonPositiveTemperature`] if `temperature_k ≤ 0`.
///
/// # Accuracy
/// As [`spectral_energy_density_energy`].
///
/// # Examples
/// ```
/// use quantaband::stats::{spectral_energy_density_energy, spectral_energy_density_frequency};
/// let (nu, t) = (2.0e13, 800.0);
/// let u_nu = spectral_energy_density_frequency(nu, t).unwrap();
/// let u_e = spectral_energy_density_energy(6.626_070_15e-34 * nu, t).unwrap();
/// assert!((u_nu / (6.626_070_15e-34 * u_e) - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// - M. Planck, Ann. Phys. 309, 553–563 (1901), doi:10.1002/andp.19013090310.
pub fn spectral_energy_density_frequency(frequency_hz: f64, temperature_k: f64) -> Result<f64> {
    let f = error::spectral("frequency_hz", frequency_hz)?;
    let t = error::temperature("temperature_k", temperature_k)?;
    let x = reduced_photon_energy(f, t);
    Ok(energy_density_core(f, SPEED_OF_LIGHT_C, x, t, PLANCK_H))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn constants_from_defining_constants() {
        // Recompute the literals from h, c, k in f64 (loose: f64 evaluation of the formulas).
        let hbar_c = PLANCK_H / (2.0 * PI) * SPEED_OF_LIGHT_C;
        let zeta3 = crate::constants::ZETA_3;
        let cn = 2.0 * zeta3 / (PI * PI) * (BOLTZMANN_K / hbar_c).powi(3);
        assert!((cn / PHOTON_NUMBER_COEF - 1.0).abs() < 1e-14);
        assert!((4.0 * RADIATION_A / 3.0 / ENTROPY_COEF - 1.0).abs() < 1e-15);
        assert!((RADIATION_A / 3.0 / PRESSURE_COEF - 1.0).abs() < 1e-15);
        let mean = PI.powi(4) / (30.0 * zeta3) * BOLTZMANN_K;
        assert!((mean / MEAN_ENERGY_COEF - 1.0).abs() < 1e-14);
        assert!((BOLTZMANN_K / HC / K_OVER_HC - 1.0).abs() < 1e-15);
        assert!((PLANCK_H * SPEED_OF_LIGHT_C / HC - 1.0).abs() < 1e-16);
    }

    #[test]
    fn noise_limits() {
        // T → 0: T_n → hf/2k; hf ≪ kT: T_n → T.
        let f = 1e12;
        let tn = quantum_noise_temperature(f, 1e-6).unwrap();
        assert!((tn / (0.5 * H_OVER_K * f) - 1.0).abs() < 1e-15);
        let tn = quantum_noise_temperature(1.0, 300.0).unwrap();
        assert!((tn / 300.0 - 1.0).abs() < 1e-15);
        // Tiny f, huge T: y underflows, result T, no 0/0.
        assert_eq!(quantum_noise_temperature(1e-300, 1e300).unwrap(), 1e300);
        assert_eq!(
            rayleigh_jeans_brightness_temperature(1e-300, 1e300).unwrap(),
            1e300
        );
    }

    #[test]
    fn energy_density_tiny_energy_rayleigh_jeans() {
        // E³ is subnormal here, so the logarithmic route is taken; n̄ = kT/E to 1e-108.
        let (e, t) = (1e-130, 300.0);
        let u = spectral_energy_density_energy(e, t).unwrap();
        let q = e / HC;
        let rj = EIGHT_PI * q * q * K_OVER_HC * t;
        assert!((u / rj - 1.0).abs() < 1e-13, "{u} vs {rj}");
    }

    #[test]
    fn energy_density_log_route_matches_direct() {
        // Just inside the direct route vs forced log route on the same point.
        let (q, x, t) = (1e6, 50.0, 300.0);
        let direct = energy_density_core(q, 1.0, x, t, 1.0);
        let ln_n = -x - float::ln_1p(-float::exp(-x));
        let via_log = float::exp(float::ln(EIGHT_PI) + 3.0 * float::ln(q) + ln_n);
        assert!((direct / via_log - 1.0).abs() < 1e-13);
    }
}
