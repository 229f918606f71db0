//! JavaScript binding layer (under construction on its branch).
