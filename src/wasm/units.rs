//! Unit conversion and physical constants for JavaScript. Unit names are strings checked by
//! the core's unit module.

use serde::Serialize;
use wasm_bindgen::prelude::*;

use super::error::{number, to_js, Fail};
use super::scratch::{map_in_place, status};
use crate::constants as k;
use crate::units::{
    convert_spectral_checked, convert_temperature, convert_temperature_difference, SpectralUnit,
    TemperatureUnit,
};

/// What a conversion converts: 0 spectral coordinates, 1 temperatures, 2 temperature
/// differences.
fn convert_one(what: u32, value: f64, from: &str, to: &str) -> Result<f64, Fail> {
    Ok(match what {
        0 => convert_spectral_checked(
            "value",
            value,
            SpectralUnit::parse(from)?,
            SpectralUnit::parse(to)?,
        )?,
        1 => convert_temperature(
            "value",
            value,
            TemperatureUnit::parse(from)?,
            TemperatureUnit::parse(to)?,
        )?,
        _ => convert_temperature_difference(
            "value",
            value,
            TemperatureUnit::parse(from)?,
            TemperatureUnit::parse(to)?,
        )?,
    })
}

#[wasm_bindgen(js_name = convertUnit)]
pub fn convert_unit(what: u32, value: f64, from: &str, to: &str) -> f64 {
    number(convert_one(what, value, from, to))
}

/// The bulk form over f64 scratch buffer 0.
#[wasm_bindgen(js_name = convertUnitBulk)]
pub fn convert_unit_bulk(what: u32, from: &str, to: &str) -> f64 {
    status((|| {
        if what == 0 {
            let (f, t) = (SpectralUnit::parse(from)?, SpectralUnit::parse(to)?);
            map_in_place(|v| convert_spectral_checked("values", v, f, t))
        } else {
            let (f, t) = (TemperatureUnit::parse(from)?, TemperatureUnit::parse(to)?);
            map_in_place(|v| convert_temperature("values", v, f, t))
        }
    })())
}

/// The kind of a spectral unit ("wavelength", "wavenumber", "frequency", "photonEnergy"), or
/// `undefined` with the error stored.
#[wasm_bindgen(js_name = spectralUnitKind)]
pub fn spectral_unit_kind(unit: &str) -> Option<String> {
    super::error::some(
        SpectralUnit::parse(unit)
            .map(|u| u.kind().name().into())
            .map_err(Fail::from),
    )
}

#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct Constants {
    planck_h: f64,
    planck_hbar: f64,
    speed_of_light_c: f64,
    boltzmann_k: f64,
    elementary_charge_e: f64,
    avogadro_n_a: f64,
    atomic_mass_u: f64,
    electron_mass: f64,
    c1: f64,
    #[serde(rename = "c1L")]
    c1_l: f64,
    c2: f64,
    c2_its90: f64,
    stefan_boltzmann_sigma: f64,
    radiation_a: f64,
    wien_b: f64,
    wien_b_frequency: f64,
}

/// The physical constants the package uses (plain object; the facade freezes it).
#[wasm_bindgen]
pub fn constants() -> JsValue {
    to_js(&Constants {
        planck_h: k::PLANCK_H,
        planck_hbar: k::PLANCK_HBAR,
        speed_of_light_c: k::SPEED_OF_LIGHT_C,
        boltzmann_k: k::BOLTZMANN_K,
        elementary_charge_e: k::ELEMENTARY_CHARGE_E,
        avogadro_n_a: k::AVOGADRO_NA,
        atomic_mass_u: k::ATOMIC_MASS_U,
        electron_mass: k::ELECTRON_MASS,
        c1: k::C1,
        c1_l: k::C1L,
        c2: k::C2,
        c2_its90: k::C2_ITS90,
        stefan_boltzmann_sigma: k::STEFAN_BOLTZMANN_SIGMA,
        radiation_a: k::RADIATION_A,
        wien_b: k::WIEN_B,
        wien_b_frequency: k::WIEN_B_FREQUENCY,
    })
    .unwrap_or(JsValue::UNDEFINED)
}
