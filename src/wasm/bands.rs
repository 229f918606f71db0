//! Band integrals, blackbody fractions and dimensionless Planck integrals for JavaScript.
//! Band limits are in the `unit` of the `SpectrumOptions` passed (see `radiometry.rs`).

#[allow(unused_imports)]
use super::prelude::*;

use wasm_bindgen::prelude::*;

use super::error::map_indexed;
use super::opts::{choose, js_string, Opts};
use super::radiometry::parse_spectrum;
use super::radiometry::Spec;
use crate::band;
use crate::band::PlanckKernel;
use crate::error::{self as core_error, Error};
use crate::inverse;

/// Band limits in the user's unit → ordered SI limits of the variable. The order check is
/// done in the user's unit (so `INVALID_BAND` reports what the caller passed); a reciprocal
/// conversion (e.g. µm → Hz) swaps the limits.
fn band_to_si(s: &Spec, lower: f64, upper: f64) -> crate::Result<(f64, f64)> {
    core_error::band("lower", lower, "upper", upper)?;
    let a = s.user_to_si("lower", lower)?;
    let b = s.user_to_si("upper", upper)?;
    if a < b {
        Ok((a, b))
    } else if b < a {
        Ok((b, a))
    } else {
        // distinct limits that became equal after conversion (adjacent f64 values)
        Err(Error::InvalidBand { lower, upper })
    }
}

/// The per-temperature (or per-value) operations of one band, shared by the scalar and the
/// array exports (one out-of-line copy of the option parsing and error plumbing for all).
#[derive(Clone, Copy)]
enum BandOp {
    Integral,
    IntegralDT,
    Fraction,
    Inverse,
}

impl BandOp {
    fn eval(self, s: &Spec, a: f64, b: f64, x: f64) -> crate::Result<f64> {
        match self {
            BandOp::Integral => band::band(&s.spectrum, a, b, x),
            BandOp::IntegralDT => band::band_d_dt(&s.spectrum, a, b, x),
            BandOp::Fraction => band::band_fraction(&s.spectrum, a, b, x),
            BandOp::Inverse => inverse::temperature_from_band(&s.spectrum, a, b, x),
        }
    }
}

#[inline(never)]
fn band_scalar(
    op: BandOp,
    options: &JsValue,
    lower: f64,
    upper: f64,
    x: f64,
) -> Result<f64, JsValue> {
    let s = parse_spectrum(options)?;
    let (a, b) = band_to_si(&s, lower, upper)?;
    Ok(op.eval(&s, a, b, x)?)
}

#[inline(never)]
fn band_array(
    op: BandOp,
    options: &JsValue,
    lower: f64,
    upper: f64,
    xs: &[f64],
) -> Result<Vec<f64>, JsValue> {
    let s = parse_spectrum(options)?;
    let (a, b) = band_to_si(&s, lower, upper)?;
    map_indexed(xs, &|x| op.eval(&s, a, b, x))
}

/// Band integral of the spectrum between `lower` and `upper` (in `options.unit`, lower < upper)
/// at `temperatureK`: band radiance (W·m⁻²·sr⁻¹), band exitance (W·m⁻²) or photon rates.
///
/// Example: `bandIntegral({ unit: "um" }, 8, 14, 300)` → 54.933 W·m⁻²·sr⁻¹ (mpmath quad: 54.93346137683969).
///
/// @throws {QuantabandError} INVALID_BAND (lower ≥ upper), NON_POSITIVE_SPECTRAL, NON_FINITE,
/// NON_POSITIVE_TEMPERATURE, option errors.
#[wasm_bindgen(js_name = bandIntegral)]
pub fn band_integral(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    band_scalar(BandOp::Integral, &options, lower, upper, temperature_k)
}

/// ∂/∂T of `bandIntegral` (per kelvin).
///
/// @throws {QuantabandError} as `bandIntegral`.
#[wasm_bindgen(js_name = bandIntegralDT)]
pub fn band_integral_dt(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    band_scalar(BandOp::IntegralDT, &options, lower, upper, temperature_k)
}

/// Fraction (0…1) of the spectrum's total that lies in the band [`lower`, `upper`] (in
/// `options.unit`) at `temperatureK`. Independent of emissivity, index and geometry.
///
/// @throws {QuantabandError} as `bandIntegral`.
#[wasm_bindgen(js_name = bandFraction)]
pub fn band_fraction(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    band_scalar(BandOp::Fraction, &options, lower, upper, temperature_k)
}

/// `bandIntegral` for every temperature of `temperaturesK` (K), one band, one call.
///
/// @throws {QuantabandError} as `bandIntegral`; `index` is the first bad temperature.
#[wasm_bindgen(js_name = bandIntegralArray)]
pub fn band_integral_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
) -> Result<Vec<f64>, JsValue> {
    band_array(BandOp::Integral, &options, lower, upper, temperatures_k)
}

/// `bandIntegralDT` for every temperature of `temperaturesK` (K).
///
/// @throws {QuantabandError} as `bandIntegralArray`.
#[wasm_bindgen(js_name = bandIntegralDTArray)]
pub fn band_integral_dt_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
) -> Result<Vec<f64>, JsValue> {
    band_array(BandOp::IntegralDT, &options, lower, upper, temperatures_k)
}

/// `bandFraction` for every temperature of `temperaturesK` (K).
///
/// @throws {QuantabandError} as `bandIntegralArray`.
#[wasm_bindgen(js_name = bandFractionArray)]
pub fn band_fraction_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
) -> Result<Vec<f64>, JsValue> {
    band_array(BandOp::Fraction, &options, lower, upper, temperatures_k)
}

/// Blackbody fraction of total energy emitted below the product λ·T = `lambdaTMK` (m·K; e.g.
/// 2.898e-3 for 2898 µm·K), CODATA 2018 c2.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE (per the core's bound on λT).
#[wasm_bindgen(js_name = fractionBelow)]
pub fn fraction_below(
    #[wasm_bindgen(js_name = lambdaTMK)] lambda_t_m_k: f64,
) -> Result<f64, JsValue> {
    Ok(band::fraction_below(lambda_t_m_k)?)
}

/// Blackbody fraction of total PHOTON emission below λ·T = `lambdaTMK` (m·K).
///
/// @throws {QuantabandError} as `fractionBelow`.
#[wasm_bindgen(js_name = photonFractionBelow)]
pub fn photon_fraction_below(
    #[wasm_bindgen(js_name = lambdaTMK)] lambda_t_m_k: f64,
) -> Result<f64, JsValue> {
    Ok(band::photon_fraction_below(lambda_t_m_k)?)
}

/// The λ·T product (m·K) below which `fraction` (0 < f < 1) of the blackbody energy lies —
/// inverse of `fractionBelow`.
///
/// @throws {QuantabandError} NON_FINITE, OUT_OF_RANGE, NOT_CONVERGED.
#[wasm_bindgen(js_name = lambdaTAtFraction)]
pub fn lambda_t_at_fraction(fraction: f64) -> Result<f64, JsValue> {
    Ok(band::lambda_t_at_fraction(fraction)?)
}

/// The λ·T product (m·K) below which `fraction` of the blackbody PHOTON emission lies.
///
/// @throws {QuantabandError} as `lambdaTAtFraction`.
#[wasm_bindgen(js_name = photonLambdaTAtFraction)]
pub fn photon_lambda_t_at_fraction(fraction: f64) -> Result<f64, JsValue> {
    Ok(band::photon_lambda_t_at_fraction(fraction)?)
}

fn parse_kernel(name: &JsValue) -> Result<PlanckKernel, JsValue> {
    let name = &js_string(name, "kernel", "UNSUPPORTED")?;
    Ok(
        match choose(
            "kernel",
            name,
            &["photon", "energy", "photonDerivative", "energyDerivative"],
        )? {
            0 => PlanckKernel::Photon,
            1 => PlanckKernel::Energy,
            2 => PlanckKernel::PhotonDerivative,
            _ => PlanckKernel::EnergyDerivative,
        },
    )
}

/// The dimensionless Planck integral of `kernel` over [`lower`, `upper`]; `None` for an open
/// end (one out-of-line copy for the four exports).
#[inline(never)]
fn planck_integral_between(
    kernel: &JsValue,
    lower: Option<f64>,
    upper: Option<f64>,
) -> Result<f64, JsValue> {
    let k = parse_kernel(kernel)?;
    Ok(match (lower, upper) {
        (Some(a), Some(b)) => band::planck_integral(k, a, b)?,
        (Some(a), None) => band::planck_integral_upper(k, a)?,
        (None, Some(b)) => band::planck_integral_lower(k, b)?,
        (None, None) => k.total(),
    })
}

/// ∫ from `xLower` to `xUpper` of a dimensionless Planck integrand (x = hν/kT): "photon"
/// x²/(eˣ−1), "energy" x³/(eˣ−1), "photonDerivative" x³eˣ/(eˣ−1)², "energyDerivative"
/// x⁴eˣ/(eˣ−1)²; 0 ≤ xLower < xUpper.
///
/// @throws {QuantabandError} NON_FINITE, OUT_OF_RANGE (negative limit), INVALID_BAND,
/// UNSUPPORTED (unknown kernel).
#[wasm_bindgen(js_name = planckIntegral)]
pub fn planck_integral(
    #[wasm_bindgen(unchecked_param_type = "PlanckKernel")] kernel: JsValue,
    #[wasm_bindgen(js_name = xLower)] x_lower: f64,
    #[wasm_bindgen(js_name = xUpper)] x_upper: f64,
) -> Result<f64, JsValue> {
    planck_integral_between(&kernel, Some(x_lower), Some(x_upper))
}

/// ∫ from `x` to ∞ of a dimensionless Planck integrand (see `planckIntegral`).
///
/// @throws {QuantabandError} NON_FINITE, OUT_OF_RANGE, UNSUPPORTED.
#[wasm_bindgen(js_name = planckIntegralUpper)]
pub fn planck_integral_upper(
    #[wasm_bindgen(unchecked_param_type = "PlanckKernel")] kernel: JsValue,
    x: f64,
) -> Result<f64, JsValue> {
    planck_integral_between(&kernel, Some(x), None)
}

/// ∫ from 0 to `x` of a dimensionless Planck integrand (see `planckIntegral`).
///
/// @throws {QuantabandError} NON_FINITE, OUT_OF_RANGE, UNSUPPORTED.
#[wasm_bindgen(js_name = planckIntegralLower)]
pub fn planck_integral_lower(
    #[wasm_bindgen(unchecked_param_type = "PlanckKernel")] kernel: JsValue,
    x: f64,
) -> Result<f64, JsValue> {
    planck_integral_between(&kernel, None, Some(x))
}

/// Total value ∫₀^∞ of a dimensionless Planck integrand: 2ζ(3), π⁴/15, 6ζ(3) or 4π⁴/15.
///
/// @throws {QuantabandError} UNSUPPORTED (unknown kernel).
#[wasm_bindgen(js_name = planckIntegralTotal)]
pub fn planck_integral_total(
    #[wasm_bindgen(unchecked_param_type = "PlanckKernel")] kernel: JsValue,
) -> Result<f64, JsValue> {
    planck_integral_between(&kernel, None, None)
}

// ---------------------------------------------------------------------------------------------
// Inverses (signal → temperature)
// ---------------------------------------------------------------------------------------------

/// Temperature (K) at which the spectrum's density at `x` (in `options.unit`) equals `value`
/// (SI density, as returned by `spectralDensity`). With emissivity 1 this is the brightness
/// temperature; with ε < 1 the true temperature of that grey body.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE (value ≤ 0), NON_POSITIVE_SPECTRAL,
/// NO_SOLUTION, option errors.
#[wasm_bindgen(js_name = brightnessTemperature)]
pub fn brightness_temperature(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    x: f64,
    value: f64,
) -> Result<f64, JsValue> {
    let s = parse_spectrum(&options)?;
    let xs = s.user_to_si("x", x)?;
    Ok(inverse::temperature_from_spectral(&s.spectrum, xs, value)?)
}

/// `brightnessTemperature` for every density value of `values` at one point `x`, one call.
///
/// @throws {QuantabandError} as `brightnessTemperature`; `index` is the first bad value.
#[wasm_bindgen(js_name = brightnessTemperatureArray)]
pub fn brightness_temperature_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    x: f64,
    values: &[f64],
) -> Result<Vec<f64>, JsValue> {
    let s = parse_spectrum(&options)?;
    let xs = s.user_to_si("x", x)?;
    map_indexed(values, &|v| {
        inverse::temperature_from_spectral(&s.spectrum, xs, v)
    })
}

/// Temperature (K) at which the band integral over [`lower`, `upper`] (in `options.unit`)
/// equals `value` (the unit of `bandIntegral`).
///
/// @throws {QuantabandError} INVALID_BAND, NON_FINITE, NON_POSITIVE, NO_SOLUTION,
/// NOT_CONVERGED, option errors.
#[wasm_bindgen(js_name = temperatureFromBand)]
pub fn temperature_from_band(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    value: f64,
) -> Result<f64, JsValue> {
    band_scalar(BandOp::Inverse, &options, lower, upper, value)
}

/// `temperatureFromBand` for every band value of `values`, one band, one call.
///
/// @throws {QuantabandError} as `temperatureFromBand`; `index` is the first bad value.
#[wasm_bindgen(js_name = temperatureFromBandArray)]
pub fn temperature_from_band_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    lower: f64,
    upper: f64,
    values: &[f64],
) -> Result<Vec<f64>, JsValue> {
    band_array(BandOp::Inverse, &options, lower, upper, values)
}

/// Temperature (K) at which (ε1/ε2)·B(band1, T)/B(band2, T) = `ratio` (ratio / two-colour
/// thermometry with band integrals; grey body). Band limits in `options.unit`.
///
/// @throws {QuantabandError} INVALID_BAND, NON_FINITE, NON_POSITIVE, NO_SOLUTION (ratio out of
/// reach, or ambiguous for overlapping bands), NOT_CONVERGED, option errors.
#[wasm_bindgen(js_name = temperatureFromBandRatio)]
pub fn temperature_from_band_ratio(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    #[wasm_bindgen(unchecked_param_type = "Band")] band1: JsValue,
    #[wasm_bindgen(unchecked_param_type = "Band")] band2: JsValue,
    ratio: f64,
    #[wasm_bindgen(js_name = emissivityRatio)] emissivity_ratio: f64,
) -> Result<f64, JsValue> {
    let s = parse_spectrum(&options)?;
    let b1 = parse_band(&s, &band1, "band1")?;
    let b2 = parse_band(&s, &band2, "band2")?;
    Ok(inverse::temperature_from_band_ratio(
        &s.spectrum,
        b1,
        b2,
        ratio,
        emissivity_ratio,
    )?)
}

fn parse_band(s: &Spec, v: &JsValue, what: &'static str) -> Result<(f64, f64), JsValue> {
    let o = Opts::new(v, what, &["lower", "upper"])?;
    Ok(band_to_si(s, o.req_num("lower")?, o.req_num("upper")?)?)
}
