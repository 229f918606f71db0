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
//! `temperature_k`). Conversions from user units live in one place ([`units`]). Functions that can
//! be given invalid input return [`Result`] with the one [`Error`] enum (stable codes via
//! [`Error::code`]); none panics.
//!
//! # Example
//!
//! An invented 8–14 µm camera looking at a painted steel plate (ε = 0.93) in a 296 K room:
//!
//! ```
//! use quantaband::band::band;
//! use quantaband::inverse::temperature_from_band;
//! use quantaband::planck::Spectrum;
//! use quantaband::thermometry::{object_temperature, Conditions, RectangularBand};
//!
//! # fn main() -> Result<(), quantaband::Error> {
//! // Band radiance of a 300 K blackbody in 8–14 µm, W m⁻² sr⁻¹ (mpmath quad: 54.933 461 376 8…).
//! let l = band(&Spectrum::default(), 8e-6, 14e-6, 300.0)?;
//! assert!((l - 54.933_461_376_839_688).abs() < 1e-12);
//! assert!((temperature_from_band(&Spectrum::default(), 8e-6, 14e-6, l)? - 300.0).abs() < 1e-9);
//!
//! // The same camera reading a signal of 60 W m⁻² sr⁻¹ off the plate: object temperature with
//! // emissivity and reflected surroundings accounted for.
//! let camera = RectangularBand::new(8e-6, 14e-6, Default::default())?;
//! let cond = Conditions { emissivity: 0.93, reflected_temperature_k: 296.0, ..Conditions::BLACKBODY };
//! let t = object_temperature(&camera, 60.0, &cond)?;
//! assert!(t > 300.0 && t < 320.0);
//! # Ok(())
//! # }
//! ```
//!
//! # Features
//!
//! | feature | default | what it adds | needs |
//! |---|---|---|---|
//! | `std` | yes | the platform's maths through std's `f64` methods (otherwise `libm`) | std, implies `alloc` |
//! | `alloc` | with `std` | owned, heap-backed types (tables and definitions that own their data); the functions themselves never allocate | an allocator |
//! | `serde` | no | `Serialize`/`Deserialize` for the public configuration and result types (camelCase field names, unknown fields rejected), so instrument definitions can be stored as data | implies `alloc`; works without std |
//! | `wasm` | no | the JavaScript binding layer (`quantaband::wasm`), used by the npm package build | std |
//!
//! Without default features the crate is `no_std` (and allocation-free unless `alloc` or `serde`
//! is enabled); it is built for `thumbv7em-none-eabihf` in CI, and a `no_std` dependent crate is
//! checked, tested and built there too (`tests/no_std_dependent/`).
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

// The instrument designer's radiometry (throughput, detector, figures of merit, sources).
pub mod design;
