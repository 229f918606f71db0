//! (module under construction on its branch; filled in by its owner)
#![forbid(unsafe_code)]
