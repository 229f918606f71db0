//! The runtime of the package's WebAssembly module, which is built without `std`
//! (`--no-default-features --features wasm`, see `pkg-scripts/build.sh`): a global allocator
//! and a panic handler. Compiled only for that build (wasm32 and no `std`); the wasm-bindgen-test
//! suites and every native build use std's.
//!
//! Why: std's allocator (dlmalloc, ~8 KB of code) and the formatting machinery its panic path
//! pulls in were about a tenth of the module; this file replaces both with well under 1 KB.
//!
//! # Allocator
//! Segregated free lists of power-of-two blocks (16 B … 2 GiB), carved from pages obtained
//! with `memory.grow`:
//! - a request of `size` bytes with alignment ≤ 16 takes a block of the smallest class
//!   2^c ≥ max(size, 16); a freed block goes to the head of its class's list and is reused by the
//!   next request of that class (first in, last out), so a call pattern that repeats reuses the
//!   same blocks and the memory stops growing after the first round (tests/js/memory.test.mjs);
//! - every block starts on a multiple of 16 (pages are 64 KiB-aligned and blocks are powers of
//!   two ≥ 16 carved in sequence), which meets every alignment ≤ 16;
//! - `realloc` within the same class returns the same block (a growing `Vec` doubles, so it
//!   moves once per class);
//! - costs: up to 2× the requested size per block, and memory once taken by a class stays with
//!   that class (WebAssembly memory never shrinks anyway); no coalescing.
//!
//! Alignment above 16 is refused (null, which the caller reports as an allocation failure); no
//! type in this crate or in wasm-bindgen's glue asks for it. Bulk exports reserve their output
//! with `try_reserve` (`error::with_room`), so a result too large for memory is an
//! `OUT_OF_RANGE` error, not an abort.
//!
//! The module is single-threaded (no shared memory, no atomics target feature), so the relaxed
//! atomics below compile to plain loads and stores and nothing can interleave with them.
//!
//! # Panics
//! No public function can panic (array lengths and options are checked, errors are returned);
//! should one ever do so, the handler executes `unreachable`, which traps: the JavaScript caller
//! gets a `WebAssembly.RuntimeError`, as with std's `panic = "abort"`.

use core::alloc::{GlobalAlloc, Layout};
use core::sync::atomic::{AtomicUsize, Ordering::Relaxed};

/// WebAssembly page size, bytes.
const PAGE: usize = 65_536;
/// Smallest block: 2^4 = 16 bytes (room for the free-list link, alignment 16).
const MIN_CLASS: u32 = 4;
/// Classes 0 … 31 (only 4 … 31 are used): blocks up to 2^31 bytes.
const CLASSES: usize = 32;
/// Largest alignment served.
const MAX_ALIGN: usize = 16;

/// Head of the free list of each class (0: empty). A free block's first word holds the address
/// of the next free block of its class.
static FREE: [AtomicUsize; CLASSES] = [const { AtomicUsize::new(0) }; CLASSES];
/// Start of the unused part of the current bump region, and its end.
static NEXT: AtomicUsize = AtomicUsize::new(0);
static END: AtomicUsize = AtomicUsize::new(0);

/// The class of a layout: c with 2^c ≥ max(size, 16); `None` when the block would exceed 2^31
/// bytes or the alignment exceeds 16.
fn class_of(layout: Layout) -> Option<u32> {
    if layout.align() > MAX_ALIGN {
        return None;
    }
    let size = layout.size().max(1 << MIN_CLASS);
    // ceil(log2(size)) for size ≥ 2
    let c = usize::BITS - (size - 1).leading_zeros();
    if (c as usize) < CLASSES {
        Some(c)
    } else {
        None
    }
}

/// A fresh block of 2^`c` bytes from the bump region, growing memory when it is used up;
/// 0 when memory cannot grow.
fn carve(c: u32) -> usize {
    let size = 1usize << c;
    let mut start = NEXT.load(Relaxed);
    let mut end = END.load(Relaxed);
    if end - start < size {
        let pages = size.div_ceil(PAGE);
        let old_pages = core::arch::wasm32::memory_grow(0, pages);
        if old_pages == usize::MAX {
            return 0;
        }
        let base = old_pages * PAGE;
        // Pages adjacent to the current region extend it; otherwise (memory grown by someone
        // else in between, or the first call) a new region starts at them, and the rest of the
        // old one is left unused.
        if base != end {
            start = base;
        }
        end = base + pages * PAGE;
        END.store(end, Relaxed);
    }
    NEXT.store(start + size, Relaxed);
    start
}

/// The global allocator of the package build (see the module documentation).
struct SizeClassHeap;

// SAFETY: `alloc` returns null or a block of at least `layout.size()` bytes aligned to
// `layout.align()` (≤ 16) that no other live allocation overlaps: a block is either carved
// from memory never handed out before (`carve` advances `NEXT` past it) or popped from its
// class's free list, where only `dealloc` puts blocks that the caller no longer uses. `dealloc`
// and `realloc` receive, by the `GlobalAlloc` contract, a block from this allocator with the
// layout it was allocated with, hence the same class.
unsafe impl GlobalAlloc for SizeClassHeap {
    unsafe fn alloc(&self, layout: Layout) -> *mut u8 {
        let Some(c) = class_of(layout) else {
            return core::ptr::null_mut();
        };
        let list = &FREE[c as usize];
        let head = list.load(Relaxed);
        if head != 0 {
            // SAFETY: `head` is a free block of this class (≥ 16 bytes, 16-aligned) whose first
            // word `dealloc` set to the next free block.
            let next = unsafe { *(head as *const usize) };
            list.store(next, Relaxed);
            return head as *mut u8;
        }
        carve(c) as *mut u8
    }

    unsafe fn dealloc(&self, ptr: *mut u8, layout: Layout) {
        if let Some(c) = class_of(layout) {
            let list = &FREE[c as usize];
            // SAFETY: `ptr` is a block of this class that the caller gives up; its first word
            // (the block is ≥ 16 bytes and 16-aligned) becomes the link to the old head.
            unsafe { *(ptr as *mut usize) = list.load(Relaxed) };
            list.store(ptr as usize, Relaxed);
        }
    }

    unsafe fn realloc(&self, ptr: *mut u8, layout: Layout, new_size: usize) -> *mut u8 {
        let Ok(new_layout) = Layout::from_size_align(new_size, layout.align()) else {
            return core::ptr::null_mut();
        };
        let class = class_of(new_layout);
        if class.is_some() && class == class_of(layout) {
            // the block already has room for `new_size` bytes
            return ptr;
        }
        // SAFETY: as `alloc`; the old block stays valid until it is copied and freed.
        unsafe {
            let new = self.alloc(new_layout);
            if !new.is_null() {
                core::ptr::copy_nonoverlapping(ptr, new, layout.size().min(new_size));
                self.dealloc(ptr, layout);
            }
            new
        }
    }
}

#[global_allocator]
static HEAP: SizeClassHeap = SizeClassHeap;

#[panic_handler]
fn panic(_: &core::panic::PanicInfo) -> ! {
    core::arch::wasm32::unreachable()
}
