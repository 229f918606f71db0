//! Photon-gas quantities and thermal-noise temperatures for JavaScript (frequencies in Hz,
//! energies in J, temperatures in K).

#[allow(unused_imports)]
use super::prelude::*;

use wasm_bindgen::prelude::*;

use crate::stats;

/// Quantum noise temperature (hν/2k)·coth(hν/2kT), K, of a resistor or mode at physical
/// temperature `temperatureK` and frequency `frequencyHz` (includes zero-point fluctuations).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = quantumNoiseTemperature)]
pub fn quantum_noise_temperature(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::quantum_noise_temperature(
        frequency_hz,
        temperature_k,
    )?)
}

/// Rayleigh–Jeans brightness temperature (K) of a blackbody at physical temperature
/// `temperatureK`, observed at `frequencyHz`: (hν/k)/(e^{hν/kT} − 1).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = rayleighJeansBrightnessTemperature)]
pub fn rayleigh_jeans_brightness_temperature(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::rayleigh_jeans_brightness_temperature(
        frequency_hz,
        temperature_k,
    )?)
}

/// Physical temperature (K) whose Rayleigh–Jeans brightness temperature at `frequencyHz` is
/// `brightnessTemperatureK` (inverse of `rayleighJeansBrightnessTemperature`).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = physicalTemperatureFromRayleighJeans)]
pub fn physical_temperature_from_rayleigh_jeans(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = brightnessTemperatureK)] brightness_temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::physical_temperature_from_rayleigh_jeans(
        frequency_hz,
        brightness_temperature_k,
    )?)
}

/// Available thermal noise power per unit bandwidth, W/Hz, hν/(e^{hν/kT} − 1), at
/// `frequencyHz` and `temperatureK` (no zero-point term).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = availableNoisePowerDensity)]
pub fn available_noise_power_density(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::available_noise_power_density(
        frequency_hz,
        temperature_k,
    )?)
}

/// Available noise power per unit bandwidth including the zero-point term hν/2, W/Hz.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = availableNoisePowerDensityWithZeroPoint)]
pub fn available_noise_power_density_with_zero_point(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::available_noise_power_density_with_zero_point(
        frequency_hz,
        temperature_k,
    )?)
}

/// Entropy density of blackbody radiation, J·K⁻¹·m⁻³, at `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = photonEntropyDensity)]
pub fn photon_entropy_density(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::photon_entropy_density(temperature_k)?)
}

/// Radiation pressure of isotropic blackbody radiation, Pa, at `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = photonPressure)]
pub fn photon_pressure(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::photon_pressure(temperature_k)?)
}

/// Photon density of states per unit volume and energy, J⁻¹·m⁻³, at photon energy `energyJ`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL.
#[wasm_bindgen(js_name = photonDensityOfStates)]
pub fn photon_density_of_states(
    #[wasm_bindgen(js_name = energyJ)] energy_j: f64,
) -> Result<f64, JsValue> {
    Ok(stats::photon_density_of_states(energy_j)?)
}

/// Spectral energy density of blackbody radiation per unit photon energy, J·m⁻³·J⁻¹, at
/// `energyJ` and `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = spectralEnergyDensityEnergy)]
pub fn spectral_energy_density_energy(
    #[wasm_bindgen(js_name = energyJ)] energy_j: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::spectral_energy_density_energy(
        energy_j,
        temperature_k,
    )?)
}

/// Spectral energy density of blackbody radiation per unit frequency, J·m⁻³·Hz⁻¹, at
/// `frequencyHz` and `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = spectralEnergyDensityFrequency)]
pub fn spectral_energy_density_frequency(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::spectral_energy_density_frequency(
        frequency_hz,
        temperature_k,
    )?)
}
