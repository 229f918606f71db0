//! The module's memory allocator (wasm32 without threads only): blocks in power-of-two size
//! classes from 16 B to 2 GiB, each class with a free list, fresh blocks cut from the end of
//! the linear memory, which grows by whole 64 KiB pages.
//!
//! Why: std's allocator on this target (dlmalloc) is about 7 KB of the package; this one is a
//! few hundred bytes (DEVELOPERS.md, size notes). What it gives up: freed blocks are never
//! merged or split, so memory used for one size class is not reused for another, and a block
//! is up to twice its request. The module's allocations are few and repetitive (configuration
//! strings and objects, results, scratch buffers that keep their capacity), so once a call
//! pattern has run, repeating it finds every block it needs on a free list and the memory stops
//! growing (`tests/js/memory.test.mjs`).
//!
//! Soundness: every block of class c is 2^(c+4) bytes at an address that is a multiple of
//! min(2^(c+4), 64 KiB) — fresh blocks are cut at that alignment, and a freed block only ever
//! serves its own class again — so a block satisfies any layout whose size and alignment round
//! up to its class (alignments above 64 KiB are refused). A free block holds the address of the
//! next one in its first word (blocks are ≥ 16 B and 16-aligned). The state is touched only by
//! the allocator's methods, which never re-enter one another; the target has no threads (the
//! module is compiled only without the `atomics` feature), so no two calls overlap.

use core::alloc::{GlobalAlloc, Layout};
use core::arch::wasm32::memory_grow;
use core::cell::UnsafeCell;
use core::ptr::null_mut;

/// log2 of the smallest block (16 B).
const MIN_SHIFT: u32 = 4;
/// Size classes: 16 B … 2 GiB.
const CLASSES: usize = 28;
/// The wasm page.
const PAGE: usize = 65536;

struct State {
    /// First free block of each class (0: none).
    free: [usize; CLASSES],
    /// The unused tail of the memory this allocator grew: [top, end).
    top: usize,
    end: usize,
}

/// The allocator (one instance, [`HEAP`]).
pub struct Heap(UnsafeCell<State>);

// SAFETY: wasm32 without the `atomics` feature runs one thread; the state is never shared
// between threads (see the module docs).
unsafe impl Sync for Heap {}

#[global_allocator]
static HEAP: Heap = Heap(UnsafeCell::new(State {
    free: [0; CLASSES],
    top: 0,
    end: 0,
}));

/// The class of a layout: the smallest power of two ≥ size and alignment (≥ 16 B); `None` for
/// more than 2 GiB or an alignment above a page.
fn class(size: usize, align: usize) -> Option<usize> {
    if align > PAGE {
        return None;
    }
    let bytes = size.max(align).max(1 << MIN_SHIFT);
    let c = (bytes.checked_next_power_of_two()?.trailing_zeros() - MIN_SHIFT) as usize;
    (c < CLASSES).then_some(c)
}

impl State {
    /// A fresh block of class `c`, aligned to min(its size, a page); null when the memory
    /// cannot grow.
    #[inline(never)]
    fn carve(&mut self, c: usize) -> *mut u8 {
        let size = 1usize << (c as u32 + MIN_SHIFT);
        let align = size.min(PAGE);
        loop {
            let Some(start) = self.top.checked_add(align - 1).map(|x| x & !(align - 1)) else {
                return null_mut();
            };
            let Some(new_top) = start.checked_add(size) else {
                return null_mut();
            };
            if new_top <= self.end {
                self.top = new_top;
                return start as *mut u8;
            }
            let pages = (new_top - self.end).div_ceil(PAGE);
            let prev = memory_grow(0, pages);
            if prev == usize::MAX {
                return null_mut();
            }
            let prev_end = prev * PAGE;
            if prev_end != self.end {
                // First call (or the memory ended elsewhere): continue after its end.
                self.top = prev_end;
            }
            self.end = (prev + pages).saturating_mul(PAGE);
        }
    }
}

// SAFETY: `alloc` returns a block of the layout's class (module docs: large and aligned
// enough) or null; `dealloc` and `realloc` receive, by `GlobalAlloc`'s contract, a pointer
// this allocator returned for the same layout, so `class` gives back its class.
unsafe impl GlobalAlloc for Heap {
    unsafe fn alloc(&self, layout: Layout) -> *mut u8 {
        let Some(c) = class(layout.size(), layout.align()) else {
            return null_mut();
        };
        // SAFETY: single-threaded, not re-entered (module docs).
        let s = unsafe { &mut *self.0.get() };
        let head = s.free[c];
        if head == 0 {
            return s.carve(c);
        }
        // SAFETY: `head` is a free block of class c; its first word links the next one.
        s.free[c] = unsafe { *(head as *const usize) };
        head as *mut u8
    }

    unsafe fn dealloc(&self, ptr: *mut u8, layout: Layout) {
        let Some(c) = class(layout.size(), layout.align()) else {
            return;
        };
        // SAFETY: single-threaded, not re-entered; `ptr` is a block of class c that the caller
        // gives up, ≥ 16 B and 16-aligned, so its first word can hold the link.
        unsafe {
            let s = &mut *self.0.get();
            *(ptr as *mut usize) = s.free[c];
            s.free[c] = ptr as usize;
        }
    }

    unsafe fn realloc(&self, ptr: *mut u8, layout: Layout, new_size: usize) -> *mut u8 {
        if class(layout.size(), layout.align()) == class(new_size, layout.align()) {
            return ptr;
        }
        // SAFETY: the caller guarantees `new_size` with this alignment is a valid layout.
        let new =
            unsafe { self.alloc(Layout::from_size_align_unchecked(new_size, layout.align())) };
        if !new.is_null() {
            // SAFETY: both blocks hold at least min(old, new) bytes and are distinct (`ptr` is
            // live, so it is on no free list and cannot be handed out again).
            unsafe {
                core::ptr::copy_nonoverlapping(ptr, new, layout.size().min(new_size));
                self.dealloc(ptr, layout);
            }
        }
        new
    }
}
