//! Native benchmarks (under construction on the bench branch).
fn main() {}
