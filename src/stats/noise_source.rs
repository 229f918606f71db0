//! Noise-source thermometry: the receiver noise temperature from a hot/cold (Y-factor)
//! measurement, with the noise temperatures of the two loads taken in one of three
//! conventions, and the differences between the conventions.
//!
//! # The three load conventions
//! A matched load at physical temperature T delivers, per unit bandwidth at frequency f, the
//! power k·T_L with
//!
//! ```text
//! RayleighJeans  T_L = T                                   (classical; kT per hertz)
//! Planck         T_L = (hf/k)·n̄ = (hf/k)/(e^{hf/kT} − 1)    (thermal photons only)
//! CallenWelton   T_L = (hf/2k)·coth(hf/2kT) = (hf/k)(n̄ + ½) (with the zero-point half quantum)
//! ```
//!
//! (the last two are [`super::rayleigh_jeans_brightness_temperature`] and
//! [`super::quantum_noise_temperature`]). For hf ≪ kT, Planck → T − hf/2k and
//! Callen–Welton → T + (hf)²/(12k²T), so at 10 GHz (hf/k = 0.48 K) a 77 K cold load is
//! already 0.24 K "colder" in the Planck convention. At millimetre and submillimetre
//! wavelengths and cryogenic loads the conventions differ by kelvins.
//!
//! # Y factor
//! With the receiver's own noise temperature T_R referred to its input, the output powers
//! with the hot and cold load connected are in the ratio
//!
//! ```text
//! Y = (T_L,hot + T_R)/(T_L,cold + T_R)   ⇒   T_R = (T_L,hot − Y·T_L,cold)/(Y − 1)
//! ```
//!
//! T_R depends on the convention used for the loads, and only its value *in that convention*
//! is meaningful: the Callen–Welton receiver temperature is the Planck one minus hf/2k
//! exactly (the zero-point noise is then booked to the input rather than the receiver), and a
//! quantum-limited phase-insensitive amplifier has T_R = hf/k (Planck) or hf/2k
//! (Callen–Welton) (Kerr 1999). Y is the linear power ratio (convert from dB with
//! 10^(Y_dB/10) first).
//!
//! # References
//! - A. R. Kerr, "Suggestions for revised definitions of noise quantities, including quantum
//!   effects", IEEE Trans. Microwave Theory Tech. 47, 325–329 (1999), doi:10.1109/22.750234.
//! - H. B. Callen, T. A. Welton, "Irreversibility and generalized noise", Phys. Rev. 83,
//!   34–40 (1951), doi:10.1103/PhysRev.83.34.
//! - D. M. Pozar, *Microwave Engineering*, 4th ed., Wiley (2012), §10.1 (Y-factor method)
//!   (from memory).
#![forbid(unsafe_code)]
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use super::occupancy::{reduced_photon_energy, H_OVER_K};
use super::{quantum_noise_temperature, rayleigh_jeans_brightness_temperature};
use crate::error::{self, Error, Result};

/// Which noise temperature a load at physical temperature T is taken to have (see the module
/// docs).
///
/// # Formula
/// ```text
/// RayleighJeans: T_L = T;   Planck: T_L = (hf/k)/(e^{hf/kT} − 1);
/// CallenWelton:  T_L = (hf/2k)·coth(hf/2kT)
/// ```
///
/// # Errors
/// None (a label).
///
/// # Accuracy
/// Exact.
///
/// # Examples
/// ```
/// use quantaband::stats::{load_noise_temperature, LoadNoiseModel};
/// assert_eq!(load_noise_temperature(1e9, 290.0, LoadNoiseModel::RayleighJeans).unwrap(), 290.0);
/// ```
///
/// # References
/// A. R. Kerr, IEEE Trans. MTT 47, 325 (1999).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum LoadNoiseModel {
    /// Classical: the load's noise temperature is its physical temperature.
    RayleighJeans,
    /// Planck: thermal photons only, (hf/k)·n̄.
    Planck,
    /// Callen–Welton: thermal photons plus the zero-point half quantum, (hf/k)(n̄ + ½).
    #[default]
    CallenWelton,
}

/// Noise temperature (K) of a matched load at physical temperature `physical_temperature_k`
/// (K) observed at `frequency_hz` (Hz), in the convention `model`.
///
/// # Formula
/// See [`LoadNoiseModel`].
///
/// # Errors
/// `NON_FINITE`, `NON_POSITIVE_SPECTRAL` (frequency ≤ 0), `NON_POSITIVE_TEMPERATURE`.
///
/// # Accuracy
/// That of [`super::rayleigh_jeans_brightness_temperature`] and
/// [`super::quantum_noise_temperature`] (≤ 2.6e-16 × max(1, hf/kT) relative against mpmath).
///
/// # Examples
/// ```
/// use quantaband::stats::{load_noise_temperature, LoadNoiseModel};
/// // A 4 K load at 150 GHz (mpmath): Planck 1.426 102 155… K, Callen–Welton 5.025 534 46… K
/// let p = load_noise_temperature(150e9, 4.0, LoadNoiseModel::Planck).unwrap();
/// assert!((p / 1.426_102_155_335_542 - 1.0).abs() < 1e-14);
/// let cw = load_noise_temperature(150e9, 4.0, LoadNoiseModel::CallenWelton).unwrap();
/// assert!((cw / 5.025_534_460_360_208 - 1.0).abs() < 1e-14);
/// assert!((cw - p - 0.5 * 4.799_243_073_366_221e-11 * 150e9).abs() < 1e-14);
/// ```
///
/// # References
/// See the module docs.
pub fn load_noise_temperature(
    frequency_hz: f64,
    physical_temperature_k: f64,
    model: LoadNoiseModel,
) -> Result<f64> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("physical_temperature_k", physical_temperature_k)?;
    Ok(match model {
        LoadNoiseModel::RayleighJeans => physical_temperature_k,
        LoadNoiseModel::Planck => {
            rayleigh_jeans_brightness_temperature(frequency_hz, physical_temperature_k)?
        }
        LoadNoiseModel::CallenWelton => {
            quantum_noise_temperature(frequency_hz, physical_temperature_k)?
        }
    })
}

/// (T_Planck − T, T_CW − T) for a load at T, without cancellation for hf ≪ kT.
fn offsets(frequency_hz: f64, temperature_k: f64) -> (f64, f64) {
    let x = reduced_photon_energy(frequency_hz, temperature_k);
    let half = 0.5 * H_OVER_K * frequency_hz;
    if x < 0.1 {
        // x/(eˣ − 1) − 1 = −x/2 + Σ_{n≥1} B_{2n} x^{2n}/(2n)!  (Bernoulli numbers:
        // 1/12, −1/720, 1/30240, −1/1209600, 1/47900160, −691/1307674368000); the first
        // dropped term, (B₁₄/14!)·x¹⁴, is below 1e-21 relative to x²/12 for x < 0.1.
        let x2 = x * x;
        let even = x2
            * (1.0 / 12.0
                + x2 * (-1.0 / 720.0
                    + x2 * (1.0 / 30_240.0
                        + x2 * (-1.0 / 1_209_600.0
                            + x2 * (1.0 / 47_900_160.0 - x2 * (691.0 / 1_307_674_368_000.0))))));
        (temperature_k * even - half, temperature_k * even)
    } else {
        let p =
            rayleigh_jeans_brightness_temperature(frequency_hz, temperature_k).unwrap_or(f64::NAN);
        (p - temperature_k, (p + half) - temperature_k)
    }
}

/// Y factor (linear power ratio, dimensionless) that a receiver of noise temperature
/// `receiver_noise_temperature_k` (K, in the convention `model`) shows between loads at
/// physical temperatures `hot_load_k` and `cold_load_k` (K) at `frequency_hz` (Hz).
///
/// # Formula
/// ```text
/// Y = (T_L(T_hot) + T_R)/(T_L(T_cold) + T_R),   T_L per `model`
/// ```
///
/// # Errors
/// `NON_FINITE`; `OUT_OF_RANGE` (receiver temperature < 0, or `hot_load_k` not above
/// `cold_load_k`); `NON_POSITIVE_SPECTRAL`; `NON_POSITIVE_TEMPERATURE`. A true Y above
/// `f64::MAX` (a cold load whose noise temperature is below the f64 range with T_R = 0, or
/// `hot_load_k`/`cold_load_k` beyond it) returns +∞.
///
/// # Accuracy
/// A few ulp beyond that of the load temperatures.
///
/// # Examples
/// ```
/// use quantaband::stats::{y_factor, LoadNoiseModel};
/// // 290 K / 77 K loads, a 50 K receiver, classical loads: Y = 340/127
/// let y = y_factor(50.0, 290.0, 77.0, 1e9, LoadNoiseModel::RayleighJeans).unwrap();
/// assert!((y - 340.0 / 127.0).abs() < 1e-15);
/// ```
///
/// # References
/// See the module docs.
pub fn y_factor(
    receiver_noise_temperature_k: f64,
    hot_load_k: f64,
    cold_load_k: f64,
    frequency_hz: f64,
    model: LoadNoiseModel,
) -> Result<f64> {
    error::finite("receiver_noise_temperature_k", receiver_noise_temperature_k)?;
    if receiver_noise_temperature_k < 0.0 {
        return Err(Error::OutOfRange {
            arg: "receiver_noise_temperature_k",
            value: receiver_noise_temperature_k,
            range: "[0, inf)",
        });
    }
    let (th, tc) = loads(hot_load_k, cold_load_k, frequency_hz, model)?;
    let r = receiver_noise_temperature_k;
    if tc + r == 0.0 {
        // T_R = 0 and the Planck temperature of the cold load below the f64 range (the other
        // models never give 0): Y = T_P(hot)/T_P(cold) = e^{x_c − x_h}·(1 − e^{−x_c})/(1 − e^{−x_h}),
        // x = hf/kT, formed in logarithms (th/tc would be 0/0 or x/0).
        let q = H_OVER_K * frequency_hz;
        let d = (q / cold_load_k) * ((hot_load_k - cold_load_k) / hot_load_k);
        let ln_1m = |x: f64| crate::float::ln(-crate::float::expm1(-x));
        return Ok(crate::float::exp(
            d + ln_1m(q / cold_load_k) - ln_1m(q / hot_load_k),
        ));
    }
    let y = (th + r) / (tc + r);
    if y.is_finite() || (th + r).is_finite() {
        Ok(y)
    } else {
        // th + T_R overflowed although the ratio may be ordinary: halve both sums.
        Ok((th * 0.5 + r * 0.5) / (tc * 0.5 + r * 0.5))
    }
}

fn loads(
    hot_load_k: f64,
    cold_load_k: f64,
    frequency_hz: f64,
    model: LoadNoiseModel,
) -> Result<(f64, f64)> {
    error::spectral("frequency_hz", frequency_hz)?;
    error::temperature("hot_load_k", hot_load_k)?;
    error::temperature("cold_load_k", cold_load_k)?;
    if !(hot_load_k > cold_load_k) {
        return Err(Error::OutOfRange {
            arg: "hot_load_k",
            value: hot_load_k,
            range: "(cold_load_k, inf)",
        });
    }
    Ok((
        load_noise_temperature(frequency_hz, hot_load_k, model)?,
        load_noise_temperature(frequency_hz, cold_load_k, model)?,
    ))
}

/// Receiver noise temperature from a Y-factor measurement, in the chosen load convention and
/// in all three for comparison (all in K), returned by [`y_factor_noise_temperature`].
///
/// # Examples
/// See [`y_factor_noise_temperature`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct YFactorReading {
    /// The load convention of `receiver_noise_temperature_k`.
    pub model: LoadNoiseModel,
    /// Receiver noise temperature T_R in the chosen convention, K (> 0).
    pub receiver_noise_temperature_k: f64,
    /// dT_R/dY in the chosen convention, K per unit Y.
    #[cfg_attr(feature = "serde", serde(rename = "dTdY"))]
    pub d_t_d_y: f64,
    /// Noise temperature of the hot load in the chosen convention, K.
    pub hot_load_noise_temperature_k: f64,
    /// Noise temperature of the cold load in the chosen convention, K.
    pub cold_load_noise_temperature_k: f64,
    /// T_R with Rayleigh–Jeans (classical) loads, K (may be ≤ 0 if Y is inconsistent with
    /// that convention).
    pub rayleigh_jeans_k: f64,
    /// T_R with Planck loads, K (may be ≤ 0, as above).
    pub planck_k: f64,
    /// T_R with Callen–Welton loads, K (may be ≤ 0, as above).
    pub callen_welton_k: f64,
    /// T_R(Planck) − T_R(Rayleigh–Jeans), K, computed without cancellation.
    pub planck_minus_rayleigh_jeans_k: f64,
    /// T_R(Callen–Welton) − T_R(Rayleigh–Jeans), K, computed without cancellation.
    pub callen_welton_minus_rayleigh_jeans_k: f64,
}

/// Receiver noise temperature (K) from a measured Y factor `y` (linear power ratio hot/cold)
/// with loads at physical temperatures `hot_load_k` and `cold_load_k` (K), at `frequency_hz`
/// (Hz), in the load convention `model`, together with the values in the other two
/// conventions and their differences.
///
/// # Formula
/// ```text
/// T_R = (T_L,hot − Y·T_L,cold)/(Y − 1),   dT_R/dY = −(T_L,hot − T_L,cold)/(Y − 1)²
/// T_R(P) − T_R(RJ) = (δP_hot − Y·δP_cold)/(Y − 1),  δP = T_Planck − T   (same for CW)
/// T_R(CW) − T_R(P) = −hf/2k  (identity)
/// ```
///
/// # Errors
/// `NON_FINITE`; `OUT_OF_RANGE` for `y` ≤ 1, for `y` ≥ T_L,hot/T_L,cold (T_R ≤ 0 in the
/// chosen convention), and for `hot_load_k` not above `cold_load_k`;
/// `NON_POSITIVE_SPECTRAL`; `NON_POSITIVE_TEMPERATURE`. A field whose true value is beyond the
/// f64 range (`y` within a few ulp of 1 with a hot load near `f64::MAX`) is ±∞.
///
/// # Accuracy
/// Against mpmath `findroot` of the noise balance Y·(T_L,cold + T_R) = T_L,hot + T_R at 40
/// digits, 8 measurements from 1 kHz to 1 THz and 4–373 K loads: ≤ 7.3e-16 relative for the
/// three receiver temperatures (the subtraction T_L,hot − Y·T_L,cold is well conditioned
/// unless T_R ≪ T_L,cold), and the differences ≤ 7.8e-14 relative, including hf/kT down to
/// 1e-10 where they are 1e-8 K (`tests/quantum_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::stats::{y_factor, y_factor_noise_temperature, LoadNoiseModel};
/// // An invented 230 GHz receiver measured with 295 K and 77 K loads; Y taken from a 60 K
/// // (Callen–Welton) receiver.
/// let y = y_factor(60.0, 295.0, 77.0, 230e9, LoadNoiseModel::CallenWelton).unwrap();
/// let r = y_factor_noise_temperature(y, 295.0, 77.0, 230e9, LoadNoiseModel::CallenWelton).unwrap();
/// assert!((r.receiver_noise_temperature_k - 60.0).abs() < 1e-12);
/// // the Planck value is higher by exactly hf/2k = 5.519 K
/// assert!((r.planck_k - r.callen_welton_k - 0.5 * 4.799_243_073_366_221e-11 * 230e9).abs() < 1e-12);
/// // and the classical reading differs as well
/// assert!(r.rayleigh_jeans_k > r.callen_welton_k);
/// ```
///
/// # References
/// See the module docs.
pub fn y_factor_noise_temperature(
    y: f64,
    hot_load_k: f64,
    cold_load_k: f64,
    frequency_hz: f64,
    model: LoadNoiseModel,
) -> Result<YFactorReading> {
    error::finite("y", y)?;
    if !(y > 1.0) {
        return Err(Error::OutOfRange {
            arg: "y",
            value: y,
            range: "(1, inf)",
        });
    }
    let (th, tc) = loads(hot_load_k, cold_load_k, frequency_hz, model)?;
    let ym1 = y - 1.0;
    // (h − y·c)/(y − 1); y·c may overflow for loads near f64::MAX when the quotient does not.
    let receiver = |h: f64, c: f64| {
        let r = (h - y * c) / ym1;
        if r.is_finite() {
            r
        } else {
            h / ym1 - c * (y / ym1)
        }
    };
    let t_r = receiver(th, tc);
    if !(t_r > 0.0) {
        return Err(Error::OutOfRange {
            arg: "y",
            value: y,
            range: "(1, T_hot/T_cold) with the loads' noise temperatures of the chosen model",
        });
    }
    let (ph, cwh) = offsets(frequency_hz, hot_load_k);
    let (pc, cwc) = offsets(frequency_hz, cold_load_k);
    let rj = receiver(hot_load_k, cold_load_k);
    let pl = receiver(
        rayleigh_jeans_brightness_temperature(frequency_hz, hot_load_k)?,
        rayleigh_jeans_brightness_temperature(frequency_hz, cold_load_k)?,
    );
    let cw = receiver(
        quantum_noise_temperature(frequency_hz, hot_load_k)?,
        quantum_noise_temperature(frequency_hz, cold_load_k)?,
    );
    Ok(YFactorReading {
        model,
        receiver_noise_temperature_k: t_r,
        d_t_d_y: -(th - tc) / (ym1 * ym1),
        hot_load_noise_temperature_k: th,
        cold_load_noise_temperature_k: tc,
        rayleigh_jeans_k: rj,
        planck_k: pl,
        callen_welton_k: cw,
        planck_minus_rayleigh_jeans_k: receiver(ph, pc),
        callen_welton_minus_rayleigh_jeans_k: receiver(cwh, cwc),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn offsets_match_direct_where_both_are_accurate() {
        // At x just below and above the 0.1 switch, the two forms agree.
        let t = 10.0;
        for &x in &[0.0999, 0.1001, 0.05, 0.3] {
            let f = x * t / H_OVER_K;
            let (p, cw) = offsets(f, t);
            let pd = rayleigh_jeans_brightness_temperature(f, t).unwrap() - t;
            let cwd = quantum_noise_temperature(f, t).unwrap() - t;
            assert!((p / pd - 1.0).abs() < 1e-13, "{x}");
            assert!((cw / cwd - 1.0).abs() < 1e-12, "{x}");
        }
    }

    #[test]
    fn errors() {
        let m = LoadNoiseModel::Planck;
        for y in [1.0, 0.5, -2.0] {
            assert_eq!(
                y_factor_noise_temperature(y, 295.0, 77.0, 1e9, m)
                    .unwrap_err()
                    .code(),
                "OUT_OF_RANGE"
            );
        }
        assert_eq!(
            y_factor_noise_temperature(f64::NAN, 295.0, 77.0, 1e9, m)
                .unwrap_err()
                .code(),
            "NON_FINITE"
        );
        // Y above T_hot/T_cold: negative receiver temperature
        assert_eq!(
            y_factor_noise_temperature(4.0, 295.0, 77.0, 1e9, m)
                .unwrap_err()
                .code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            y_factor_noise_temperature(2.0, 77.0, 295.0, 1e9, m)
                .unwrap_err()
                .code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            y_factor_noise_temperature(2.0, 295.0, 77.0, 0.0, m)
                .unwrap_err()
                .code(),
            "NON_POSITIVE_SPECTRAL"
        );
        assert_eq!(
            y_factor(-1.0, 295.0, 77.0, 1e9, m).unwrap_err().code(),
            "OUT_OF_RANGE"
        );
    }
}
