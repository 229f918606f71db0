//! Quantum statistics and photon-gas quantities for JavaScript: free functions of plain numbers
//! (energies in J, frequencies in Hz, temperatures in K). Each returns its value, or NaN with
//! the error stored for the facade (`src/wasm/js/functions.js`).

use wasm_bindgen::prelude::*;

use super::error::{number, Fail};
use super::scratch::{map_in_place, status};
use crate::{planck, stats};

/// A core result as an export's number.
#[inline]
pub(crate) fn value(r: crate::Result<f64>) -> f64 {
    number(r.map_err(Fail::from))
}

#[wasm_bindgen(js_name = boseEinstein)]
pub fn bose_einstein(x: f64) -> f64 {
    value(stats::bose_einstein(x))
}

#[wasm_bindgen(js_name = fermiDirac)]
pub fn fermi_dirac(x: f64) -> f64 {
    value(stats::fermi_dirac(x))
}

#[wasm_bindgen(js_name = maxwellBoltzmann)]
pub fn maxwell_boltzmann(x: f64) -> f64 {
    value(stats::maxwell_boltzmann(x))
}

#[wasm_bindgen(js_name = boseEinsteinEnergy)]
pub fn bose_einstein_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> f64 {
    value(stats::bose_einstein_energy(energy_j, mu_j, temperature_k))
}

#[wasm_bindgen(js_name = fermiDiracEnergy)]
pub fn fermi_dirac_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> f64 {
    value(stats::fermi_dirac_energy(energy_j, mu_j, temperature_k))
}

#[wasm_bindgen(js_name = maxwellBoltzmannEnergy)]
pub fn maxwell_boltzmann_energy(energy_j: f64, mu_j: f64, temperature_k: f64) -> f64 {
    value(stats::maxwell_boltzmann_energy(
        energy_j,
        mu_j,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = thermalPhotonNumber)]
pub fn thermal_photon_number(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::thermal_photon_number(frequency_hz, temperature_k))
}

#[wasm_bindgen(js_name = boseEinsteinIntegral)]
pub fn bose_einstein_integral(order: f64, fugacity: f64) -> f64 {
    value(stats::BoseOrder::from_s(order).and_then(|o| stats::bose_einstein_integral(o, fugacity)))
}

#[wasm_bindgen(js_name = boseCriticalTemperature)]
pub fn bose_critical_temperature(number_density_per_m3: f64, mass_kg: f64) -> f64 {
    value(stats::bose_critical_temperature(
        number_density_per_m3,
        mass_kg,
    ))
}

#[wasm_bindgen(js_name = fermiDiracIntegral)]
pub fn fermi_dirac_integral(order: f64, eta: f64) -> f64 {
    value(stats::FdOrder::from_j(order).and_then(|o| stats::fermi_dirac_integral(o, eta)))
}

#[wasm_bindgen(js_name = inverseFermiDiracHalf)]
pub fn inverse_fermi_dirac_half(reduced_density: f64) -> f64 {
    value(stats::inverse_fermi_dirac_half(reduced_density))
}

#[wasm_bindgen(js_name = quantumNoiseTemperature)]
pub fn quantum_noise_temperature(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::quantum_noise_temperature(
        frequency_hz,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = rayleighJeansBrightnessTemperature)]
pub fn rayleigh_jeans_brightness_temperature(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::rayleigh_jeans_brightness_temperature(
        frequency_hz,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = physicalTemperatureFromRayleighJeans)]
pub fn physical_temperature_from_rayleigh_jeans(
    frequency_hz: f64,
    brightness_temperature_k: f64,
) -> f64 {
    value(stats::physical_temperature_from_rayleigh_jeans(
        frequency_hz,
        brightness_temperature_k,
    ))
}

#[wasm_bindgen(js_name = availableNoisePowerDensity)]
pub fn available_noise_power_density(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::available_noise_power_density(
        frequency_hz,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = availableNoisePowerDensityWithZeroPoint)]
pub fn available_noise_power_density_with_zero_point(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::available_noise_power_density_with_zero_point(
        frequency_hz,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = photonEntropyDensity)]
pub fn photon_entropy_density(temperature_k: f64) -> f64 {
    value(stats::photon_entropy_density(temperature_k))
}

#[wasm_bindgen(js_name = photonPressure)]
pub fn photon_pressure(temperature_k: f64) -> f64 {
    value(stats::photon_pressure(temperature_k))
}

#[wasm_bindgen(js_name = photonDensityOfStates)]
pub fn photon_density_of_states(energy_j: f64) -> f64 {
    value(stats::photon_density_of_states(energy_j))
}

#[wasm_bindgen(js_name = spectralEnergyDensityEnergy)]
pub fn spectral_energy_density_energy(energy_j: f64, temperature_k: f64) -> f64 {
    value(stats::spectral_energy_density_energy(
        energy_j,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = spectralEnergyDensityFrequency)]
pub fn spectral_energy_density_frequency(frequency_hz: f64, temperature_k: f64) -> f64 {
    value(stats::spectral_energy_density_frequency(
        frequency_hz,
        temperature_k,
    ))
}

#[wasm_bindgen(js_name = photonNumberDensity)]
pub fn photon_number_density(temperature_k: f64) -> f64 {
    value(planck::photon_number_density(temperature_k))
}

#[wasm_bindgen(js_name = energyDensity)]
pub fn energy_density(temperature_k: f64) -> f64 {
    value(planck::energy_density(temperature_k))
}

#[wasm_bindgen(js_name = meanPhotonEnergy)]
pub fn mean_photon_energy(temperature_k: f64) -> f64 {
    value(planck::mean_photon_energy_j(temperature_k))
}

/// Bulk forms over f64 scratch buffer 0: 0 Bose–Einstein, 1 Fermi–Dirac, 2 Maxwell–Boltzmann
/// occupancy of reduced energies; 3 Fermi–Dirac integral of order `order` of each η.
#[wasm_bindgen(js_name = statsBulk)]
pub fn stats_bulk(op: u32, order: f64) -> f64 {
    status(match op {
        0 => map_in_place(stats::bose_einstein),
        1 => map_in_place(stats::fermi_dirac),
        2 => map_in_place(stats::maxwell_boltzmann),
        _ => match stats::FdOrder::from_j(order) {
            Ok(o) => map_in_place(|eta| stats::fermi_dirac_integral(o, eta)),
            Err(e) => Err(e.into()),
        },
    })
}
