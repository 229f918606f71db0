//! Unit conversion and physical constants for JavaScript.

#[allow(unused_imports)]
use super::prelude::*;

use js_sys::Object;
use wasm_bindgen::prelude::*;
use wasm_bindgen::JsCast;

use super::opts::js_string;

use super::error::{map_indexed, object};
use crate::constants as k;
use crate::units::{
    convert_spectral as conv_spectral, convert_temperature as conv_temperature,
    convert_temperature_difference as conv_difference, SpectralUnit, TemperatureUnit,
};

#[wasm_bindgen(typescript_custom_section)]
const TS_UNITS: &str = r#"
/**
 * A spectral unit name (case-sensitive). Wavelength: m, mm, um/µm/μm/micron, nm. Wavenumber:
 * m-1 (m^-1, m⁻¹, 1/m), cm-1 (cm^-1, cm⁻¹, 1/cm). Frequency: Hz, kHz, MHz, GHz, THz. Photon
 * energy: J, eV, meV.
 */
export type SpectralUnit =
  | "m" | "mm" | "um" | "µm" | "μm" | "micron" | "nm"
  | "m-1" | "m^-1" | "m⁻¹" | "1/m"
  | "cm-1" | "cm^-1" | "cm⁻¹" | "1/cm"
  | "Hz" | "kHz" | "MHz" | "GHz" | "THz"
  | "J" | "eV" | "meV";

/** The kind of quantity a spectral unit measures. */
export type SpectralKind = "wavelength" | "wavenumber" | "frequency" | "photonEnergy";

/**
 * A temperature unit name (case-sensitive): K; degC (°C, ℃, C); degF (°F, ℉, F); degR (°R,
 * Rankine).
 */
export type TemperatureUnit =
  | "K"
  | "degC" | "°C" | "℃" | "C"
  | "degF" | "°F" | "℉" | "F"
  | "degR" | "°R";

/** Physical constants used by the package (SI units; CODATA 2018 and ITS-90). */
export interface Constants {
  /** Planck constant h, J·s (exact). */
  readonly planckH: number;
  /** Reduced Planck constant ħ, J·s. */
  readonly planckHbar: number;
  /** Speed of light in vacuum c, m/s (exact). */
  readonly speedOfLightC: number;
  /** Boltzmann constant k, J/K (exact). */
  readonly boltzmannK: number;
  /** Elementary charge e, C (exact). */
  readonly elementaryChargeE: number;
  /** Avogadro constant N_A, 1/mol (exact). */
  readonly avogadroNA: number;
  /** Unified atomic mass unit, kg. */
  readonly atomicMassU: number;
  /** Electron mass, kg. */
  readonly electronMass: number;
  /** First radiation constant c1 = 2πhc², W·m². */
  readonly c1: number;
  /** First radiation constant for radiance c1L = 2hc², W·m²·sr⁻¹. */
  readonly c1L: number;
  /** Second radiation constant c2 = hc/k (CODATA 2018), m·K. */
  readonly c2: number;
  /** Second radiation constant fixed by ITS-90, m·K (0.014388 exactly). */
  readonly c2Its90: number;
  /** Stefan–Boltzmann constant σ, W·m⁻²·K⁻⁴. */
  readonly stefanBoltzmannSigma: number;
  /** Radiation constant a = 4σ/c, J·m⁻³·K⁻⁴. */
  readonly radiationA: number;
  /** Wien wavelength displacement constant b, m·K. */
  readonly wienB: number;
  /** Wien frequency displacement constant b′, Hz/K. */
  readonly wienBFrequency: number;
}
"#;

/// The conversions, shared by the scalar and array exports (one out-of-line copy of the unit
/// parsing and error plumbing for all of them).
#[derive(Clone, Copy)]
enum Conv {
    Spectral,
    Temperature,
    Difference,
}

/// `conv` of every element of `values` from unit `from` to unit `to`.
#[inline(never)]
fn convert(conv: Conv, values: &[f64], from: &JsValue, to: &JsValue) -> Result<Vec<f64>, JsValue> {
    let from = &js_string(from, "from", "UNKNOWN_UNIT")?;
    let to = &js_string(to, "to", "UNKNOWN_UNIT")?;
    match conv {
        Conv::Spectral => {
            let (f, t) = (SpectralUnit::parse(from)?, SpectralUnit::parse(to)?);
            map_indexed(values, &|v| conv_spectral("value", v, f, t))
        }
        _ => {
            let (f, t) = (TemperatureUnit::parse(from)?, TemperatureUnit::parse(to)?);
            map_indexed(values, &|v| match conv {
                Conv::Difference => conv_difference("difference", v, f, t),
                _ => conv_temperature("temperature", v, f, t),
            })
        }
    }
}

/// `convert` of one value (an error carries no bulk index).
#[inline(never)]
fn convert_one(conv: Conv, value: f64, from: &JsValue, to: &JsValue) -> Result<f64, JsValue> {
    let from = &js_string(from, "from", "UNKNOWN_UNIT")?;
    let to = &js_string(to, "to", "UNKNOWN_UNIT")?;
    Ok(match conv {
        Conv::Spectral => conv_spectral(
            "value",
            value,
            SpectralUnit::parse(from)?,
            SpectralUnit::parse(to)?,
        )?,
        _ => {
            let (f, t) = (TemperatureUnit::parse(from)?, TemperatureUnit::parse(to)?);
            match conv {
                Conv::Difference => conv_difference("difference", value, f, t)?,
                _ => conv_temperature("temperature", value, f, t)?,
            }
        }
    })
}

/// Converts a spectral coordinate between units, across kinds if needed (wavelength ↔
/// wavenumber ↔ frequency ↔ photon energy; vacuum values, CODATA 2018 h and c).
///
/// Example: `convertSpectral(10, "um", "cm-1")` → 1000.
///
/// @throws {QuantabandError} `UNKNOWN_UNIT` for an unknown unit name, `NON_FINITE` /
/// `NON_POSITIVE_SPECTRAL` for a value that is not a finite number > 0.
#[wasm_bindgen(js_name = convertSpectral)]
pub fn convert_spectral(
    value: f64,
    #[wasm_bindgen(unchecked_param_type = "SpectralUnit")] from: JsValue,
    #[wasm_bindgen(unchecked_param_type = "SpectralUnit")] to: JsValue,
) -> Result<f64, JsValue> {
    convert_one(Conv::Spectral, value, &from, &to)
}

/// Converts every element of `values` between spectral units (see `convertSpectral`). Returns a
/// new `Float64Array` of the same length.
///
/// @throws {QuantabandError} as `convertSpectral`; `index` is the first bad element.
#[wasm_bindgen(js_name = convertSpectralArray)]
pub fn convert_spectral_array(
    values: &[f64],
    #[wasm_bindgen(unchecked_param_type = "SpectralUnit")] from: JsValue,
    #[wasm_bindgen(unchecked_param_type = "SpectralUnit")] to: JsValue,
) -> Result<Vec<f64>, JsValue> {
    convert(Conv::Spectral, values, &from, &to)
}

/// The kind of quantity a spectral unit measures.
///
/// @throws {QuantabandError} `UNKNOWN_UNIT`.
#[wasm_bindgen(js_name = spectralUnitKind, unchecked_return_type = "SpectralKind")]
pub fn spectral_unit_kind(
    #[wasm_bindgen(unchecked_param_type = "SpectralUnit")] unit: JsValue,
) -> Result<String, JsValue> {
    let unit = &js_string(&unit, "unit", "UNKNOWN_UNIT")?;
    Ok(SpectralUnit::parse(unit)?.kind().name().into())
}

/// Converts an ABSOLUTE temperature between units (K, °C, °F, °R). For a temperature
/// difference use `convertTemperatureDifference`.
///
/// Example: `convertTemperature(100, "degC", "K")` → 373.15.
///
/// @throws {QuantabandError} `UNKNOWN_UNIT`; `NON_FINITE`; `NON_POSITIVE_TEMPERATURE` when the
/// value is at or below absolute zero.
#[wasm_bindgen(js_name = convertTemperature)]
pub fn convert_temperature(
    value: f64,
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] from: JsValue,
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] to: JsValue,
) -> Result<f64, JsValue> {
    convert_one(Conv::Temperature, value, &from, &to)
}

/// Converts every element of `values` (absolute temperatures) between units.
///
/// @throws {QuantabandError} as `convertTemperature`; `index` is the first bad element.
#[wasm_bindgen(js_name = convertTemperatureArray)]
pub fn convert_temperature_array(
    values: &[f64],
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] from: JsValue,
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] to: JsValue,
) -> Result<Vec<f64>, JsValue> {
    convert(Conv::Temperature, values, &from, &to)
}

/// Converts a temperature DIFFERENCE between units (no offset: a rise of 9 °F is a rise of
/// 5 K). May be negative.
///
/// @throws {QuantabandError} `UNKNOWN_UNIT`; `NON_FINITE`.
#[wasm_bindgen(js_name = convertTemperatureDifference)]
pub fn convert_temperature_difference(
    value: f64,
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] from: JsValue,
    #[wasm_bindgen(unchecked_param_type = "TemperatureUnit")] to: JsValue,
) -> Result<f64, JsValue> {
    convert_one(Conv::Difference, value, &from, &to)
}

/// The physical constants the package uses (SI; CODATA 2018, ITS-90 c2).
#[wasm_bindgen(js_name = constants, unchecked_return_type = "Constants")]
pub fn constants() -> JsValue {
    let o = object(
        "planckH;planckHbar;speedOfLightC;boltzmannK;elementaryChargeE;avogadroNA;atomicMassU;\
         electronMass;c1;c1L;c2;c2Its90;stefanBoltzmannSigma;radiationA;wienB;wienBFrequency",
        &[
            k::PLANCK_H,
            k::PLANCK_HBAR,
            k::SPEED_OF_LIGHT_C,
            k::BOLTZMANN_K,
            k::ELEMENTARY_CHARGE_E,
            k::AVOGADRO_NA,
            k::ATOMIC_MASS_U,
            k::ELECTRON_MASS,
            k::C1,
            k::C1L,
            k::C2,
            k::C2_ITS90,
            k::STEFAN_BOLTZMANN_SIGMA,
            k::RADIATION_A,
            k::WIEN_B,
            k::WIEN_B_FREQUENCY,
        ],
        &[],
    );
    Object::freeze(o.unchecked_ref::<Object>()).into()
}
