//! # quantaband
//!
//! Exact thermal-radiation and quantum-statistics functions for people who design, calibrate and
//! support radiation thermometers, thermal cameras, blackbody sources and infrared detectors:
//! Planck spectral and band quantities (energy and photon units, per wavelength, wavenumber and
//! frequency), their temperature derivatives and inverses, instrument-response-weighted signals,
//! calibration curves, measurement-equation solutions with uncertainty budgets, and Bose–Einstein /
//! Fermi–Dirac occupancies and integrals.
//!
//! All physics is in SI base units; argument names carry their unit (`wavelength_m`,
//! `temperature_k`). Conversions from user units live in one place ([`units`]).
//!
//! The core is `no_std` when built without the default `std` feature (maths from `libm`); the
//! optional `wasm` feature adds the JavaScript binding layer, which the physics modules never use.
#![cfg_attr(not(feature = "std"), no_std)]
// The physics core has no unsafe code at all. The wasm-bindgen macros expand to `unsafe` blocks,
// so with the `wasm` feature the crate-level lint is `deny` and only `src/wasm/` opts out; every
// physics module also carries its own `#![forbid(unsafe_code)]`.
#![cfg_attr(not(feature = "wasm"), forbid(unsafe_code))]
#![cfg_attr(feature = "wasm", deny(unsafe_code))]
#![warn(missing_docs)]

pub mod constants;
pub mod error;
mod float;

// Radiometric core.
pub mod band;
pub mod inverse;
pub mod planck;

// Quantum statistics.
pub mod stats;

// Radiation-thermometry workflow.
pub mod thermometry;

// User-unit parsing and conversion (shared by the binding layer and the page).
pub mod units;

// Definitions in user units (spectrum settings, instrument models, conditions), serialisable.
pub mod definition;

#[cfg(feature = "alloc")]
extern crate alloc;

// JavaScript binding layer (internal: the public JavaScript API is the package's facade).
#[cfg(feature = "wasm")]
#[doc(hidden)]
pub mod wasm;

pub use error::{Error, Result};
