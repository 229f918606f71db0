//! The package build's runtime: a small global allocator and a panic handler (`no_std`).
use core::alloc::{GlobalAlloc, Layout};
use core::sync::atomic::{AtomicUsize, Ordering::Relaxed};

const PAGE: usize = 65_536;
const MIN_CLASS: u32 = 4;
const CLASSES: usize = 32;

struct Heap;

static FREE: [AtomicUsize; CLASSES] = [const { AtomicUsize::new(0) }; CLASSES];
static NEXT: AtomicUsize = AtomicUsize::new(0);
static END: AtomicUsize = AtomicUsize::new(0);

fn class_of(layout: Layout) -> Option<u32> {
    if layout.align() > 16 {
        return None;
    }
    let size = layout.size().max(1 << MIN_CLASS);
    let c = usize::BITS - (size - 1).leading_zeros();
    if (c as usize) < CLASSES {
        Some(c)
    } else {
        None
    }
}

unsafe impl GlobalAlloc for Heap {
    unsafe fn alloc(&self, layout: Layout) -> *mut u8 {
        let Some(c) = class_of(layout) else {
            return core::ptr::null_mut();
        };
        let head = FREE[c as usize].load(Relaxed);
        if head != 0 {
            let next = unsafe { *(head as *const usize) };
            FREE[c as usize].store(next, Relaxed);
            return head as *mut u8;
        }
        let size = 1usize << c;
        let mut start = NEXT.load(Relaxed);
        let mut end = END.load(Relaxed);
        if end - start < size {
            let pages = size.div_ceil(PAGE);
            let old = core::arch::wasm32::memory_grow(0, pages);
            if old == usize::MAX {
                return core::ptr::null_mut();
            }
            let base = old * PAGE;
            if base != end {
                start = base;
            }
            end = base + pages * PAGE;
            END.store(end, Relaxed);
        }
        NEXT.store(start + size, Relaxed);
        start as *mut u8
    }

    unsafe fn dealloc(&self, ptr: *mut u8, layout: Layout) {
        if let Some(c) = class_of(layout) {
            unsafe { *(ptr as *mut usize) = FREE[c as usize].load(Relaxed) };
            FREE[c as usize].store(ptr as usize, Relaxed);
        }
    }

    unsafe fn realloc(&self, ptr: *mut u8, layout: Layout, new_size: usize) -> *mut u8 {
        let new = unsafe { Layout::from_size_align_unchecked(new_size, layout.align()) };
        if class_of(layout) == class_of(new) && class_of(new).is_some() {
            return ptr;
        }
        let p = unsafe { self.alloc(new) };
        if !p.is_null() {
            unsafe {
                core::ptr::copy_nonoverlapping(ptr, p, layout.size().min(new_size));
                self.dealloc(ptr, layout);
            }
        }
        p
    }
}

#[global_allocator]
static HEAP: Heap = Heap;

#[panic_handler]
fn panic(_: &core::panic::PanicInfo) -> ! {
    core::arch::wasm32::unreachable()
}
