//! Quantum statistics for JavaScript: occupancies, Bose–Einstein and Fermi–Dirac integrals,
//! photon-gas quantities and noise temperatures. Energies in J, frequencies in Hz, temperatures
//! in K (convert eV with `convertSpectral(x, "eV", "J")`).

#[allow(unused_imports)]
use super::prelude::*;

use wasm_bindgen::prelude::*;

use super::error::map_indexed;
use crate::stats;

#[wasm_bindgen(typescript_custom_section)]
const TS_STATS: &str = r#"
/** Order j of the complete Fermi–Dirac integral: −1/2, 1/2 or 3/2. */
export type FermiDiracOrder = -0.5 | 0.5 | 1.5;
"#;

/// Bose–Einstein occupancy 1/(eˣ − 1) at reduced energy x = (E − μ)/kT > 0.
///
/// @throws {QuantabandError} NON_FINITE; DIVERGENT_OCCUPATION for x ≤ 0.
#[wasm_bindgen(js_name = boseEinstein)]
pub fn bose_einstein(x: f64) -> Result<f64, JsValue> {
    Ok(stats::bose_einstein(x)?)
}

/// `boseEinstein` for every element of `xs`.
///
/// @throws {QuantabandError} as `boseEinstein`; `index` is the first bad element.
#[wasm_bindgen(js_name = boseEinsteinArray)]
pub fn bose_einstein_array(xs: &[f64]) -> Result<Vec<f64>, JsValue> {
    map_indexed(xs, &stats::bose_einstein)
}

/// Fermi–Dirac occupancy 1/(eˣ + 1) at reduced energy x = (E − μ)/kT (any finite x).
///
/// @throws {QuantabandError} NON_FINITE.
#[wasm_bindgen(js_name = fermiDirac)]
pub fn fermi_dirac(x: f64) -> Result<f64, JsValue> {
    Ok(stats::fermi_dirac(x)?)
}

/// `fermiDirac` for every element of `xs`.
///
/// @throws {QuantabandError} as `fermiDirac`; `index` is the first bad element.
#[wasm_bindgen(js_name = fermiDiracArray)]
pub fn fermi_dirac_array(xs: &[f64]) -> Result<Vec<f64>, JsValue> {
    map_indexed(xs, &stats::fermi_dirac)
}

/// Maxwell–Boltzmann occupancy e⁻ˣ at reduced energy x = (E − μ)/kT.
///
/// @throws {QuantabandError} NON_FINITE.
#[wasm_bindgen(js_name = maxwellBoltzmann)]
pub fn maxwell_boltzmann(x: f64) -> Result<f64, JsValue> {
    Ok(stats::maxwell_boltzmann(x)?)
}

/// `maxwellBoltzmann` for every element of `xs`.
///
/// @throws {QuantabandError} as `maxwellBoltzmann`; `index` is the first bad element.
#[wasm_bindgen(js_name = maxwellBoltzmannArray)]
pub fn maxwell_boltzmann_array(xs: &[f64]) -> Result<Vec<f64>, JsValue> {
    map_indexed(xs, &stats::maxwell_boltzmann)
}

/// Bose–Einstein occupancy of a state of energy `energyJ` (J) at chemical potential
/// `chemicalPotentialJ` (J) and temperature `temperatureK` (K).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, DIVERGENT_OCCUPATION (E ≤ μ).
#[wasm_bindgen(js_name = boseEinsteinEnergy)]
pub fn bose_einstein_energy(
    #[wasm_bindgen(js_name = energyJ)] energy_j: f64,
    #[wasm_bindgen(js_name = chemicalPotentialJ)] mu_j: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::bose_einstein_energy(energy_j, mu_j, temperature_k)?)
}

/// Fermi–Dirac occupancy of a state of energy `energyJ` (J) at chemical potential
/// `chemicalPotentialJ` (J) and temperature `temperatureK` (K).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = fermiDiracEnergy)]
pub fn fermi_dirac_energy(
    #[wasm_bindgen(js_name = energyJ)] energy_j: f64,
    #[wasm_bindgen(js_name = chemicalPotentialJ)] mu_j: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::fermi_dirac_energy(energy_j, mu_j, temperature_k)?)
}

/// Maxwell–Boltzmann occupancy of a state of energy `energyJ` (J) at chemical potential
/// `chemicalPotentialJ` (J) and temperature `temperatureK` (K).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = maxwellBoltzmannEnergy)]
pub fn maxwell_boltzmann_energy(
    #[wasm_bindgen(js_name = energyJ)] energy_j: f64,
    #[wasm_bindgen(js_name = chemicalPotentialJ)] mu_j: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::maxwell_boltzmann_energy(
        energy_j,
        mu_j,
        temperature_k,
    )?)
}

/// Mean thermal photon number 1/(e^{hν/kT} − 1) of a mode of frequency `frequencyHz` (Hz) at
/// `temperatureK` (K).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = thermalPhotonNumber)]
pub fn thermal_photon_number(
    #[wasm_bindgen(js_name = frequencyHz)] frequency_hz: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(stats::thermal_photon_number(frequency_hz, temperature_k)?)
}

/// Bose–Einstein (polylogarithm) integral g_s(z) of order `order` (1.5, 2.5 or an integer ≥ 2)
/// at fugacity `fugacity` in [0, 1].
///
/// @throws {QuantabandError} UNSUPPORTED (order), NON_FINITE, OUT_OF_RANGE (fugacity).
#[wasm_bindgen(js_name = boseEinsteinIntegral)]
pub fn bose_einstein_integral(order: f64, fugacity: f64) -> Result<f64, JsValue> {
    let o = stats::BoseOrder::from_s(order)?;
    Ok(stats::bose_einstein_integral(o, fugacity)?)
}

/// Bose–Einstein condensation temperature (K) of an ideal gas of number density
/// `numberDensityPerM3` (m⁻³) and particle mass `massKg` (kg).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE.
#[wasm_bindgen(js_name = boseCriticalTemperature)]
pub fn bose_critical_temperature(
    #[wasm_bindgen(js_name = numberDensityPerM3)] number_density_per_m3: f64,
    #[wasm_bindgen(js_name = massKg)] mass_kg: f64,
) -> Result<f64, JsValue> {
    Ok(stats::bose_critical_temperature(
        number_density_per_m3,
        mass_kg,
    )?)
}

/// Normalised complete Fermi–Dirac integral F_j(η) of order −1/2, 1/2 or 3/2 at reduced
/// chemical potential `eta`.
///
/// @throws {QuantabandError} UNSUPPORTED (order), NON_FINITE.
#[wasm_bindgen(js_name = fermiDiracIntegral)]
pub fn fermi_dirac_integral(
    #[wasm_bindgen(unchecked_param_type = "FermiDiracOrder")] order: f64,
    eta: f64,
) -> Result<f64, JsValue> {
    let o = stats::FdOrder::from_j(order)?;
    Ok(stats::fermi_dirac_integral(o, eta)?)
}

/// `fermiDiracIntegral` for every element of `etas`.
///
/// @throws {QuantabandError} as `fermiDiracIntegral`; `index` is the first bad element.
#[wasm_bindgen(js_name = fermiDiracIntegralArray)]
pub fn fermi_dirac_integral_array(
    #[wasm_bindgen(unchecked_param_type = "FermiDiracOrder")] order: f64,
    etas: &[f64],
) -> Result<Vec<f64>, JsValue> {
    let o = stats::FdOrder::from_j(order)?;
    map_indexed(etas, &|eta| stats::fermi_dirac_integral(o, eta))
}

/// Reduced chemical potential η with F_{1/2}(η) = `reducedDensity` (> 0), the inverse of
/// `fermiDiracIntegral(0.5, η)`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE, NOT_CONVERGED.
#[wasm_bindgen(js_name = inverseFermiDiracHalf)]
pub fn inverse_fermi_dirac_half(
    #[wasm_bindgen(js_name = reducedDensity)] reduced_density: f64,
) -> Result<f64, JsValue> {
    Ok(stats::inverse_fermi_dirac_half(reduced_density)?)
}
