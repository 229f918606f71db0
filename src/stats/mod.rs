//! Quantum statistics: Bose–Einstein, Fermi–Dirac and Maxwell–Boltzmann occupancies, complete
//! Fermi–Dirac integrals and their inverse, Bose–Einstein integrals (polylogarithms) with the
//! ideal-Bose-gas critical temperature, and photon-gas and thermal-noise quantities.
//!
//! Everything is in SI base units with the unit in the argument name (`energy_j`, `mu_j`,
//! `temperature_k`, `frequency_hz`, `number_density_per_m3`, `mass_kg`); reduced
//! (dimensionless) arguments are called `x = (E − μ)/kT` or `eta = μ/kT`. All functions are
//! allocation-free and `no_std`; invalid input returns [`crate::Error`], never a panic.
//!
//! All items are re-exported here, so `quantaband::stats::*` is the whole public surface.
//!
//! # Examples
//! ```
//! use quantaband::stats::{fermi_dirac_integral, inverse_fermi_dirac_half, FdOrder};
//! use quantaband::stats::{quantum_noise_temperature, thermal_photon_number};
//!
//! // An invented 150 GHz cryogenic receiver looking at a 4 K load (values from mpmath):
//! let n = thermal_photon_number(150e9, 4.0)?;
//! assert!((n / 0.198_100_982_944_554_84 - 1.0).abs() < 1e-14);
//! let t_n = quantum_noise_temperature(150e9, 4.0)?; // includes the hf/2k zero point
//! assert!((t_n / 5.025_534_460_360_208 - 1.0).abs() < 1e-14);
//! // Reduced carrier density n/N_c = 3 in a parabolic band: η = (E_F − E_c)/kT = 2.118 39…
//! let eta = inverse_fermi_dirac_half(3.0)?;
//! assert!((eta - 2.118_393_525_341_202_6).abs() < 1e-14);
//! assert!((fermi_dirac_integral(FdOrder::Half, eta)? - 3.0).abs() < 1e-14);
//! # Ok::<(), quantaband::Error>(())
//! ```
//!
//! # Sources
//! Every number the tests compare against comes from mpmath (generator
//! `tests/data/gen_stats.py`) or from a source named beside the check. The literature citations
//! in the docs (authors, titles, DOIs, equation numbers) were written from memory and are marked
//! so where a specific value or equation number is quoted.
//!
//! # Safety of use
//! These are idealised equilibrium formulas. Where results feed decisions about people or
//! plant (cryogenic or process safety, exposure to radiation), follow the applicable local
//! codes, standards and licensed professional practice.
#![forbid(unsafe_code)]

mod bose_einstein;
mod fermi_dirac;
mod occupancy;
mod photon_gas;
mod tables;

pub use bose_einstein::{bose_critical_temperature, bose_einstein_integral, BoseOrder};
pub(crate) use fermi_dirac::sin_cos_turns;
pub use fermi_dirac::{fermi_dirac_integral, inverse_fermi_dirac_half, FdOrder};
pub use occupancy::{
    bose_einstein, bose_einstein_energy, fermi_dirac, fermi_dirac_energy, maxwell_boltzmann,
    maxwell_boltzmann_energy, thermal_photon_number,
};
pub use photon_gas::{
    available_noise_power_density, available_noise_power_density_with_zero_point,
    mean_photon_energy, photon_density_of_states, photon_energy_density, photon_entropy_density,
    photon_number_density, photon_pressure, physical_temperature_from_rayleigh_jeans,
    quantum_noise_temperature, rayleigh_jeans_brightness_temperature,
    spectral_energy_density_energy, spectral_energy_density_frequency,
};

// Noise-source (Y-factor) thermometry and semiconductor carrier statistics (issue 18).
mod noise_source;
pub use noise_source::{
    load_noise_temperature, y_factor, y_factor_noise_temperature, LoadNoiseModel, YFactorReading,
};
mod semiconductor;
pub use semiconductor::{
    band_carrier_density, effective_density_of_states, varshni_band_gap, CarrierDensity,
    IntrinsicCarriers, Semiconductor,
};
