//! Native benchmarks of the quantaband core: a small self-written harness (no criterion, which
//! is slow to compile on a 2-core machine).
//!
//! For each case: warm up for `WARMUP`, choose an inner repetition count so that one sample
//! lasts at least `SAMPLE`, take up to `SAMPLES` samples (stopping early after `CASE_BUDGET`),
//! and print one JSON line with the median and minimum time per call in nanoseconds, plus the
//! value computed (the table script compares it with `benches/data/bench_reference.json`).
//! Inputs and outputs pass through `std::hint::black_box` so the optimiser can neither
//! constant-fold the call nor drop it.
//!
//! Run through `bash pkg-scripts/bench.sh` (which merges these lines with the Node and SciPy
//! ones into one table), or alone: `cargo bench --bench native [-- FILTER] [-- --quick]`.
//! Timings are never asserted anywhere; this is a measurement tool, not a test.

use std::hint::black_box;
use std::time::{Duration, Instant};

const WARMUP: Duration = Duration::from_millis(100);
const SAMPLE: Duration = Duration::from_millis(5);
const SAMPLES: usize = 31;
const CASE_BUDGET: Duration = Duration::from_millis(1500);

/// Timing summary of one case.
struct Timing {
    ns_median: f64,
    ns_min: f64,
    samples: usize,
    iters: u64,
}

/// Times `f`, which performs ONE call of the operation being measured.
fn measure<R, F: FnMut() -> R>(mut f: F, quick: bool) -> Timing {
    let (warmup, budget) = if quick {
        (WARMUP / 10, CASE_BUDGET / 10)
    } else {
        (WARMUP, CASE_BUDGET)
    };
    let t0 = Instant::now();
    let mut calls: u64 = 0;
    while t0.elapsed() < warmup || calls < 3 {
        black_box(f());
        calls += 1;
    }
    let per_call = t0.elapsed().as_secs_f64() / calls as f64;
    let iters = ((SAMPLE.as_secs_f64() / per_call).ceil() as u64).max(1);
    let mut times = Vec::with_capacity(SAMPLES);
    let start = Instant::now();
    for _ in 0..SAMPLES {
        let a = Instant::now();
        for _ in 0..iters {
            black_box(f());
        }
        times.push(a.elapsed().as_secs_f64() * 1e9 / iters as f64);
        if times.len() >= 5 && start.elapsed() > budget {
            break;
        }
    }
    times.sort_by(f64::total_cmp);
    let mid = times.len() / 2;
    let ns_median = if times.len() % 2 == 1 {
        times[mid]
    } else {
        0.5 * (times[mid - 1] + times[mid])
    };
    Timing {
        ns_median,
        ns_min: times[0],
        samples: times.len(),
        iters,
    }
}

/// A JSON number (JSON has no NaN/∞: those become null).
fn json_num(x: f64) -> String {
    if x.is_finite() {
        format!("{x:e}")
    } else {
        "null".to_string()
    }
}

/// Extra fields of a result line besides the timing.
#[derive(Default)]
struct Extra {
    value: Option<f64>,
    sample_values: Option<Vec<f64>>,
    max_abs_err_k: Option<f64>,
    pixels: Option<usize>,
    note: Option<&'static str>,
}

struct Runner {
    filter: Option<String>,
    quick: bool,
}

impl Runner {
    fn wants(&self, case: &str) -> bool {
        self.filter.as_deref().is_none_or(|f| case.contains(f))
    }

    /// Measures `f` and prints the result line for `case`.
    fn run<R, F: FnMut() -> R>(&self, case: &str, f: F, extra: Extra) {
        if !self.wants(case) {
            return;
        }
        let t = measure(f, self.quick);
        let mut line = format!(
            "{{\"impl\":\"native\",\"case\":\"{case}\",\"ns_median\":{},\"ns_min\":{},\"samples\":{},\"iters\":{}",
            json_num(t.ns_median),
            json_num(t.ns_min),
            t.samples,
            t.iters
        );
        if let Some(v) = extra.value {
            line += &format!(",\"value\":{}", json_num(v));
        }
        if let Some(vs) = extra.sample_values {
            let parts: Vec<String> = vs.iter().map(|&v| json_num(v)).collect();
            line += &format!(",\"sample_values\":[{}]", parts.join(","));
        }
        if let Some(e) = extra.max_abs_err_k {
            line += &format!(",\"max_abs_err_k\":{}", json_num(e));
        }
        if let Some(p) = extra.pixels {
            line += &format!(",\"pixels\":{p}");
        }
        if let Some(n) = extra.note {
            line += &format!(",\"note\":\"{n}\"");
        }
        line.push('}');
        println!("{line}");
    }

    /// Prints a line saying a case could not be run (never a made-up number).
    fn skip(&self, case: &str, why: &str) {
        if self.wants(case) {
            println!("{{\"impl\":\"native\",\"case\":\"{case}\",\"skipped\":\"{why}\"}}");
        }
    }
}

fn main() {
    let mut filter = None;
    let mut quick = false;
    for a in std::env::args().skip(1) {
        match a.as_str() {
            "--bench" => {}
            "--quick" => quick = true,
            s if !s.starts_with('-') => filter = Some(s.to_string()),
            _ => {}
        }
    }
    let runner = Runner { filter, quick };
    cases::radiometry(&runner);
    cases::thermometry(&runner);
    cases::statistics(&runner);
}

/// The benchmark cases (inputs as in `benches/data/bench_reference.json`).
mod cases {
    use super::{black_box, Extra, Runner};

    pub fn radiometry(r: &Runner) {
        let _ = r;
    }

    pub fn thermometry(r: &Runner) {
        let _ = r;
    }

    pub fn statistics(r: &Runner) {
        let _ = (r, black_box(0), Extra::default());
    }
}
