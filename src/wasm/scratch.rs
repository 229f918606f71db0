//! Scratch buffers for bulk calls, owned by the module and reused from call to call.
//!
//! The facade never hands a caller's array to the generated glue (which would trust its
//! `length` property and allocate per call). It asks [`scratch`] for a buffer of `n` elements,
//! writes the elements with `TypedArray.prototype.set` (which uses the true internal length),
//! calls the bulk method, which reads and writes the same buffers, and copies the results out
//! (into a new typed array or the caller's `out`). Nothing runs between the request and the
//! write, so no view into wasm memory is held across anything that could grow it, and a
//! frame conversion allocates nothing once the buffers are large enough.
//!
//! Slots: f64 0 (bulk input/output, frame input), f64 1 (second input: fit signals, frame
//! output), f64 2 (emissivity map, fit residuals); f32 0 (frame input), f32 1 (frame output);
//! u16 0 (frame counts); f64 3 and 4 (frame non-uniformity gain and offset maps) and u8 0
//! (bad-pixel mask), kept apart from the first three f64 slots so code destructuring those is
//! unaffected.

use alloc::vec::Vec;
use core::cell::RefCell;
use wasm_bindgen::prelude::*;

thread_local! {
    static F64: RefCell<[Vec<f64>; 3]> = const { RefCell::new([Vec::new(), Vec::new(), Vec::new()]) };
    static F32: RefCell<[Vec<f32>; 2]> = const { RefCell::new([Vec::new(), Vec::new()]) };
    static U16: RefCell<Vec<u16>> = const { RefCell::new(Vec::new()) };
    /// f64 slots 3 and 4.
    static F64X: RefCell<[Vec<f64>; 2]> = const { RefCell::new([Vec::new(), Vec::new()]) };
    static U8: RefCell<Vec<u8>> = const { RefCell::new(Vec::new()) };
}

/// Element type of a scratch buffer (the `kind` argument of [`scratch`]).
pub(crate) const KIND_F64: u32 = 0;
pub(crate) const KIND_F32: u32 = 1;
pub(crate) const KIND_U16: u32 = 2;
pub(crate) const KIND_U8: u32 = 3;

/// Sets buffer `v` to `n` elements (contents unspecified); false when the memory cannot grow.
fn fit<T: Copy + Default>(v: &mut Vec<T>, n: usize) -> bool {
    if v.len() >= n {
        v.truncate(n);
        return true;
    }
    if v.try_reserve_exact(n - v.len()).is_err() {
        return false;
    }
    v.resize(n, T::default());
    true
}

/// The byte address of scratch buffer (`kind`, `slot`) resized to `n` elements, or 0 when the
/// memory cannot hold it (or `kind`/`slot` do not exist).
#[wasm_bindgen(js_name = qbScratch)]
pub fn scratch(kind: u32, slot: u32, n: u32) -> u32 {
    let n = n as usize;
    let s = slot as usize;
    // Addresses are 32-bit on wasm32.
    let addr = |p: usize| p as u32;
    match kind {
        KIND_F64 if s >= 3 => F64X.with(|b| {
            let mut b = b.borrow_mut();
            let Some(v) = b.get_mut(s - 3) else { return 0 };
            if fit(v, n) {
                addr(v.as_mut_ptr() as usize)
            } else {
                0
            }
        }),
        KIND_U8 if s == 0 => U8.with(|v| {
            let mut v = v.borrow_mut();
            if fit(&mut v, n) {
                addr(v.as_mut_ptr() as usize)
            } else {
                0
            }
        }),
        KIND_F64 => F64.with(|b| {
            let mut b = b.borrow_mut();
            let Some(v) = b.get_mut(s) else { return 0 };
            if fit(v, n) {
                addr(v.as_mut_ptr() as usize)
            } else {
                0
            }
        }),
        KIND_F32 => F32.with(|b| {
            let mut b = b.borrow_mut();
            let Some(v) = b.get_mut(s) else { return 0 };
            if fit(v, n) {
                addr(v.as_mut_ptr() as usize)
            } else {
                0
            }
        }),
        KIND_U16 if s == 0 => U16.with(|v| {
            let mut v = v.borrow_mut();
            if fit(&mut v, n) {
                addr(v.as_mut_ptr() as usize)
            } else {
                0
            }
        }),
        _ => 0,
    }
}

/// Runs `f` on the f64 scratch buffers.
pub(crate) fn with_f64<R>(f: impl FnOnce(&mut [Vec<f64>; 3]) -> R) -> R {
    F64.with(|b| f(&mut b.borrow_mut()))
}

/// Runs `f` on the f32 scratch buffers.
pub(crate) fn with_f32<R>(f: impl FnOnce(&mut [Vec<f32>; 2]) -> R) -> R {
    F32.with(|b| f(&mut b.borrow_mut()))
}

/// Runs `f` on the u16 scratch buffer.
pub(crate) fn with_u16<R>(f: impl FnOnce(&mut Vec<u16>) -> R) -> R {
    U16.with(|b| f(&mut b.borrow_mut()))
}

/// Runs `f` on f64 scratch slots 3 and 4.
pub(crate) fn with_f64x<R>(f: impl FnOnce(&mut [Vec<f64>; 2]) -> R) -> R {
    F64X.with(|b| f(&mut b.borrow_mut()))
}

/// Runs `f` on the u8 scratch buffer.
pub(crate) fn with_u8<R>(f: impl FnOnce(&mut Vec<u8>) -> R) -> R {
    U8.with(|b| f(&mut b.borrow_mut()))
}

/// Applies `op` to every element of f64 scratch buffer 0, in place; the first error stops it
/// and carries the element index. Generic, so each bulk method gets its own tight loop with the
/// operation inlined (no indirect call per element).
#[inline(always)]
pub(crate) fn map_in_place<F: Fn(f64) -> crate::Result<f64>>(
    op: F,
) -> Result<(), super::error::Fail> {
    with_f64(|b| {
        for (i, v) in b[0].iter_mut().enumerate() {
            *v = op(*v).map_err(|e| super::error::at(e, i))?;
        }
        Ok(())
    })
}

/// The status number of a bulk method: 0, or NaN with the error stored.
pub(crate) fn status(r: Result<(), super::error::Fail>) -> f64 {
    super::error::number(r.map(|()| 0.0))
}
