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
#![forbid(unsafe_code)]

mod bose_einstein;
mod fermi_dirac;
mod occupancy;
mod tables;

pub use bose_einstein::{bose_critical_temperature, bose_einstein_integral, BoseOrder};
pub use fermi_dirac::{fermi_dirac_integral, inverse_fermi_dirac_half, FdOrder};
pub use occupancy::{
    bose_einstein, bose_einstein_energy, fermi_dirac, fermi_dirac_energy, maxwell_boltzmann,
    maxwell_boltzmann_energy, thermal_photon_number,
};
