//! WebAssembly exports (only with the `wasm` feature): the low-level half of the JavaScript
//! package. The public package entry is the hand-written facade in `src/wasm/js/`, which wraps
//! these exports; nothing here is meant to be called by users directly.
//!
//! Rules of this layer (see DEVELOPERS.md, "JavaScript boundary"):
//! - no physics: it reads configuration through the core's serde types ([`config`]), converts
//!   user units with [`crate::units`], calls the core and hands errors to the facade;
//! - no export throws and none returns a `Result`: a failing export stores its error and
//!   returns NaN / `undefined` ([`error`]);
//! - prepared objects (`QbSpectrum`, `QbInstrument`, `QbCalibration`) are parsed once by their
//!   `create` and then take plain numbers; bulk forms read and write module-owned scratch
//!   buffers ([`scratch`]) that the facade fills;
//! - one file per area, so a new capability adds a file here and one in `src/wasm/js/`.
//!
//! The module is `pub` so that the `wasm-bindgen-test` suites (`tests/wasm_node.rs`,
//! `tests/wasm_browser.rs`) can call the exports from Rust.
// The wasm-bindgen macros expand to `unsafe` blocks; the physics modules keep `forbid`.
#![allow(unsafe_code)]
// Internal exports: each is documented (JSDoc and TypeScript) on the facade method or function
// that wraps it, in src/wasm/js/; the module is hidden from the crate docs.
#![allow(missing_docs)]

pub mod calibration;
pub(crate) mod config;
pub mod design;
pub mod error;
pub mod fractions;
#[cfg(all(target_arch = "wasm32", not(target_feature = "atomics")))]
mod heap;
pub mod instrument;
pub mod its90;
pub mod quantum;
pub mod quantum_fit;
pub mod reading;
pub mod scratch;
#[cfg(feature = "spectral-js")]
pub mod spectral;
pub mod spectrum;
pub mod stats;
pub mod testing;
pub mod uncertainty;
pub mod units;
