//! JavaScript binding layer (only with the `wasm` feature).
//!
//! This layer validates JavaScript arguments, converts user units with [`crate::units`], calls
//! the core and turns every [`crate::Error`] into one thrown `QuantabandError` with a stable
//! `code`. It holds no physics. Names are camelCase (`js_name`); options objects are read with
//! js-sys `Reflect` (smaller than serde) and reject unknown fields; every options and result type
//! is declared for TypeScript in a `typescript_custom_section` next to the functions using it.
//!
//! The module is `pub` only so that the `wasm-bindgen-test` suites (`tests/wasm_node.rs`,
//! `tests/wasm_browser.rs`) can call the bindings from Rust; Rust users call the core directly.
//!
//! No function here can panic on any input: array lengths are checked, options are checked
//! field by field, and errors are returned, because a panic aborts the whole wasm instance.
// The wasm-bindgen macros expand to `unsafe` blocks; the physics modules keep `forbid`.
#![allow(unsafe_code)]

#[cfg(all(target_arch = "wasm32", not(feature = "std")))]
mod runtime;

/// What `std`'s prelude would bring; the package build is `no_std` (see `runtime.rs`).
mod prelude {
    pub(crate) use alloc::string::{String, ToString};
    pub(crate) use alloc::vec::Vec;
}

mod bands;
mod convert;
mod error;
mod opts;
mod photon_gas;
mod radiometry;
mod stats;
mod thermometry;

pub use bands::*;
pub use convert::*;
pub use photon_gas::*;
pub use radiometry::*;
pub use stats::*;
pub use thermometry::*;
