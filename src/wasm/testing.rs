//! Test-only exports (not part of the typed public API; the facade exposes them as
//! `__testing`): the count of live prepared objects, so the tests can check that `free()`,
//! `Symbol.dispose` and the FinalizationRegistry release them.

use core::sync::atomic::{AtomicU32, Ordering};
use wasm_bindgen::prelude::*;

static LIVE: AtomicU32 = AtomicU32::new(0);

/// Counts one more live prepared object (called by each handle's constructor).
pub(crate) fn born() {
    LIVE.fetch_add(1, Ordering::Relaxed);
}

/// Counts one live prepared object less (called by each handle's `Drop`).
pub(crate) fn died() {
    LIVE.fetch_sub(1, Ordering::Relaxed);
}

/// The number of prepared objects (spectra, instruments, curves) not yet freed.
#[wasm_bindgen(js_name = qbLiveObjects)]
pub fn live_objects() -> u32 {
    LIVE.load(Ordering::Relaxed)
}

/// A field of every prepared handle: counts the handle as live until it is dropped.
pub(crate) struct Live(());

impl Live {
    pub(crate) fn new() -> Live {
        born();
        Live(())
    }
}

impl Drop for Live {
    fn drop(&mut self) {
        died();
    }
}
