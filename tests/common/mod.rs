//! Shared harness of the property-based fuzz suites (`tests/fuzz_*.rs`).
//!
//! Every public function of the core is fed adversarial arguments through proptest's
//! `TestRunner` with a fixed seed and a bounded number of cases. The properties are the same for
//! every function:
//!
//! - no panic (the runner catches it, shrinks the input and fails the test with it);
//! - an `Ok` result contains no NaN anywhere (checked on its `Debug` text, so every `f64` field of
//!   a result struct, array or tuple is covered), and no ±∞ unless the function's docs state that
//!   a true value beyond the f64 range is returned as ∞ ([`Inf::Documented`], with the doc line
//!   quoted at the call site);
//! - an `Err` formats (`Display`) without panicking and has a code from `Error::ALL_CODES`.
//!
//! Arguments are drawn per argument from a description ([`Arg`]): a typical range (so that calls
//! reach the computing code, not only the input checks), the argument's documented bounds (each
//! bound exactly, one ulp either side, and 1e-12 / 1e-6 relative either side), special values
//! (NaN, ±∞, ±0, the smallest and largest subnormals, ±`f64::MIN_POSITIVE`, ±`f64::MAX`,
//! ±`f64::EPSILON`, ±1), huge/tiny magnitudes and uniformly random bit patterns (log-uniform over
//! the whole f64 range, both signs). A case mixes typical and adversarial arguments: all typical,
//! exactly one adversarial, or each argument adversarial with probability ½.
//!
//! Case counts are fixed in the test files; `QUANTABAND_FUZZ_SCALE=N` multiplies them for a
//! longer local run (see DEVELOPERS.md). Each test also has a wall-clock budget (scaled the same
//! way) after which the remaining cases are skipped and the number skipped is printed; with the
//! default counts no test comes near it.
#![allow(dead_code)]

use std::fmt::Debug;
use std::sync::atomic::{AtomicU64, Ordering};
use std::time::{Duration, Instant};

use proptest::prelude::*;
use proptest::strategy::{BoxedStrategy, Strategy};
use proptest::test_runner::{Config, RngAlgorithm, RngSeed, TestCaseError, TestRunner};
use quantaband::Error;

/// The suite's base seed; each test derives its own seed from it and its name.
pub const SEED: u64 = 0x7175_616e_7461_6661; // "quantafa"

/// Wall-clock budget of one fuzz test at scale 1, in seconds.
pub const BUDGET_S: f64 = 30.0;

/// The case multiplier from `QUANTABAND_FUZZ_SCALE` (default 1; values < 1 are allowed).
pub fn scale() -> f64 {
    std::env::var("QUANTABAND_FUZZ_SCALE")
        .ok()
        .and_then(|s| s.parse::<f64>().ok())
        .filter(|s| s.is_finite() && *s > 0.0)
        .unwrap_or(1.0)
}

fn name_hash(name: &str) -> u64 {
    // FNV-1a, 64 bit.
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    for b in name.bytes() {
        h ^= u64::from(b);
        h = h.wrapping_mul(0x0100_0000_01b3);
    }
    h
}

/// Runs `test` on `base_cases × scale` values drawn from `strategy`, seeded from `name`.
///
/// Panics (fails the calling `#[test]`) with the shrunk failing input when a case fails or
/// panics. Prints the number of cases and the time taken (`cargo test -- --nocapture`).
pub fn fuzz<S, F>(name: &str, base_cases: u32, strategy: S, test: F)
where
    S: Strategy,
    S::Value: Debug,
    F: Fn(S::Value) -> Result<(), TestCaseError>,
{
    let cases = ((f64::from(base_cases) * scale()).ceil() as u32).max(1);
    let config = Config {
        cases,
        rng_algorithm: RngAlgorithm::ChaCha,
        rng_seed: RngSeed::Fixed(SEED ^ name_hash(name)),
        failure_persistence: None,
        max_shrink_iters: 4096,
        max_shrink_time: 60_000,
        max_global_rejects: 1 << 20,
        max_local_rejects: 1 << 20,
        ..Config::default()
    };
    let budget = Duration::from_secs_f64(BUDGET_S * scale().max(1.0));
    let start = Instant::now();
    let skipped = AtomicU64::new(0);
    let calls = AtomicU64::new(0);
    let mut runner = TestRunner::new(config);
    let result = runner.run(&strategy, |value| {
        if start.elapsed() > budget {
            skipped.fetch_add(1, Ordering::Relaxed);
            return Ok(());
        }
        calls.fetch_add(1, Ordering::Relaxed);
        test(value)
    });
    let skipped = skipped.load(Ordering::Relaxed);
    eprintln!(
        "fuzz {name}: {} cases (shrinking included) in {:.2} s{}",
        calls.load(Ordering::Relaxed),
        start.elapsed().as_secs_f64(),
        if skipped > 0 {
            format!(" ({skipped} skipped: over the {BUDGET_S} s budget)")
        } else {
            String::new()
        }
    );
    if let Err(e) = result {
        panic!("fuzz {name}: {e}");
    }
}

// ---------------------------------------------------------------------------------------------
// Result checks

/// Whether an `Ok` result may contain ±∞.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Inf {
    /// Never: ∞ is a failure.
    Never,
    /// The function's docs state that a true value beyond the f64 range is returned as ∞.
    Documented,
}

/// The first NaN/±∞ token in a `Debug` text (`NaN`, `inf`, `-inf` as whole words).
fn bad_token(text: &str, inf: Inf) -> Option<&'static str> {
    for token in text.split(|c: char| !(c.is_ascii_alphanumeric() || c == '_')) {
        if token == "NaN" {
            return Some("NaN");
        }
        if token == "inf" && inf == Inf::Never {
            return Some("∞");
        }
    }
    None
}

/// At most 2000 characters of a `Debug` text, for failure messages.
fn clip(text: &str) -> String {
    if text.len() <= 2000 {
        text.to_string()
    } else {
        let cut = (0..=2000)
            .rev()
            .find(|&i| text.is_char_boundary(i))
            .unwrap_or(0);
        format!("{} …", &text[..cut])
    }
}

/// Checks an error: its `Display` text is produced without panicking and its code is listed.
pub fn check_err(what: &str, e: &Error) -> Result<(), TestCaseError> {
    let text = e.to_string();
    prop_assert!(!text.is_empty(), "{what}: empty error message");
    prop_assert!(
        Error::ALL_CODES.contains(&e.code()),
        "{what}: code {} not in Error::ALL_CODES",
        e.code()
    );
    Ok(())
}

/// Checks a `Result` from the core: an `Ok` value must be free of NaN (and of ∞ unless
/// `inf` is [`Inf::Documented`]); an `Err` must format.
pub fn check<T: Debug>(
    what: &str,
    result: &Result<T, Error>,
    inf: Inf,
) -> Result<(), TestCaseError> {
    match result {
        Ok(v) => {
            let text = format!("{v:?}");
            if let Some(bad) = bad_token(&text, inf) {
                return Err(TestCaseError::fail(format!(
                    "{what}: Ok result contains {bad}: {}",
                    clip(&text)
                )));
            }
            Ok(())
        }
        Err(e) => check_err(what, e),
    }
}

/// [`check`] with [`Inf::Never`].
pub fn ok<T: Debug>(what: &str, result: &Result<T, Error>) -> Result<(), TestCaseError> {
    check(what, result, Inf::Never)
}

/// Checks a plain (non-`Result`) value that the docs promise to be finite.
pub fn finite<T: Debug>(what: &str, value: &T) -> Result<(), TestCaseError> {
    let text = format!("{value:?}");
    if let Some(bad) = bad_token(&text, Inf::Never) {
        return Err(TestCaseError::fail(format!(
            "{what}: value contains {bad}: {}",
            clip(&text)
        )));
    }
    Ok(())
}

// ---------------------------------------------------------------------------------------------
// Scalar strategies

/// Special values every argument is tried with.
pub const SPECIALS: &[f64] = &[
    f64::NAN,
    f64::INFINITY,
    f64::NEG_INFINITY,
    0.0,
    -0.0,
    5e-324,                     // smallest subnormal
    -5e-324,                    //
    2.225_073_858_507_201e-308, // largest subnormal
    f64::MIN_POSITIVE,
    -f64::MIN_POSITIVE,
    f64::MAX,
    -f64::MAX,
    f64::EPSILON,
    -f64::EPSILON,
    1.0,
    -1.0,
    1e-300,
    1e300,
    -1e300,
    1e-150,
    1e150,
    0.5,
    2.0,
];

/// One of [`SPECIALS`].
pub fn special() -> BoxedStrategy<f64> {
    prop::sample::select(SPECIALS).boxed()
}

/// Any bit pattern: log-uniform over the whole f64 range, both signs, with NaN and ±∞ rare.
pub fn any_bits() -> BoxedStrategy<f64> {
    any::<u64>().prop_map(f64::from_bits).boxed()
}

/// Log-uniform over [lo, hi] (0 < lo < hi).
pub fn log_uniform(lo: f64, hi: f64) -> BoxedStrategy<f64> {
    let (a, b) = (lo.ln(), hi.ln());
    (0.0..=1.0f64)
        .prop_map(move |u| (a + u * (b - a)).exp().clamp(lo, hi))
        .boxed()
}

/// Uniform over [lo, hi].
pub fn uniform(lo: f64, hi: f64) -> BoxedStrategy<f64> {
    (0.0..=1.0f64)
        .prop_map(move |u| (lo + u * (hi - lo)).clamp(lo, hi))
        .boxed()
}

fn next_up(x: f64) -> f64 {
    if x.is_nan() || x == f64::INFINITY {
        return x;
    }
    if x == 0.0 {
        return 5e-324;
    }
    let b = x.to_bits();
    f64::from_bits(if x > 0.0 { b + 1 } else { b - 1 })
}

fn next_down(x: f64) -> f64 {
    -next_up(-x)
}

/// Values at and around the given points: each exactly, one ulp either side, 1e-12 and 1e-6
/// relative either side, and its negation.
pub fn near(points: Vec<f64>) -> BoxedStrategy<f64> {
    (prop::sample::select(points), 0..8usize)
        .prop_map(|(p, k)| match k {
            0 => p,
            1 => next_up(p),
            2 => next_down(p),
            3 => p * (1.0 + 1e-12),
            4 => p * (1.0 - 1e-12),
            5 => p * (1.0 + 1e-6),
            6 => p * (1.0 - 1e-6),
            _ => -p,
        })
        .boxed()
}

/// The description of one scalar argument.
#[derive(Clone, Debug)]
pub struct Arg {
    lo: f64,
    hi: f64,
    edges: Vec<f64>,
}

/// An argument whose typical values lie in [lo, hi] (log-uniform when 0 < lo and hi/lo ≥ 100,
/// uniform otherwise).
pub fn arg(lo: f64, hi: f64) -> Arg {
    Arg {
        lo,
        hi,
        edges: Vec::new(),
    }
}

impl Arg {
    /// Adds documented bounds (or other critical points) to try exactly and around.
    pub fn edges(mut self, e: &[f64]) -> Self {
        self.edges.extend_from_slice(e);
        self
    }

    /// Typical values.
    pub fn typical(&self) -> BoxedStrategy<f64> {
        if self.lo > 0.0 && self.hi / self.lo >= 100.0 {
            log_uniform(self.lo, self.hi)
        } else {
            uniform(self.lo, self.hi)
        }
    }

    /// Adversarial values.
    pub fn adversarial(&self) -> BoxedStrategy<f64> {
        let mut points = self.edges.clone();
        points.push(self.lo);
        points.push(self.hi);
        prop_oneof![
            3 => special(),
            3 => near(points),
            3 => any_bits(),
            1 => log_uniform(1e-300, 1e300),
            1 => log_uniform(1e-300, 1e300).prop_map(|v| -v),
        ]
        .boxed()
    }

    /// Typical (60 %) or adversarial (40 %) values.
    pub fn any(&self) -> BoxedStrategy<f64> {
        prop_oneof![3 => self.typical(), 2 => self.adversarial()].boxed()
    }
}

/// Values for a list of arguments: all typical (¼ of the cases), exactly one adversarial (¼),
/// or each adversarial with probability ½ (½).
pub fn args(list: &[Arg]) -> BoxedStrategy<Vec<f64>> {
    let n = list.len();
    let typical: Vec<BoxedStrategy<f64>> = list.iter().map(Arg::typical).collect();
    let adversarial: Vec<BoxedStrategy<f64>> = list.iter().map(Arg::adversarial).collect();
    let one = if n == 0 {
        Just(0u64).boxed()
    } else {
        (0..n).prop_map(|i| 1u64 << i).boxed()
    };
    let mask = prop_oneof![1 => Just(0u64), 1 => one, 2 => any::<u64>()];
    (typical, adversarial, mask)
        .prop_map(|(t, a, m)| {
            t.into_iter()
                .zip(a)
                .enumerate()
                .map(|(i, (t, a))| if m >> (i % 64) & 1 == 1 { a } else { t })
                .collect()
        })
        .boxed()
}

// ---------------------------------------------------------------------------------------------
// Slices

/// A slice argument: mostly valid data in the typical range (strictly increasing when
/// `increasing`), or an adversarial shape: empty, one element, non-increasing (reversed, with a
/// repeated element), containing NaN/±∞ or a special value, or long (`long` elements).
pub fn slice(elem: &Arg, increasing: bool, min_len: usize, long: usize) -> BoxedStrategy<Vec<f64>> {
    let typical = elem.typical();
    let hi_len = (min_len + 12).max(min_len + 1);
    let base = prop::collection::vec(typical.clone(), min_len..hi_len).prop_map(move |mut v| {
        if increasing {
            v.sort_by(f64::total_cmp);
            v.dedup();
        }
        v
    });
    let special_at = (
        base.clone(),
        elem.adversarial(),
        any::<prop::sample::Index>(),
    )
        .prop_map(|(mut v, s, i)| {
            if !v.is_empty() {
                let k = i.index(v.len());
                v[k] = s;
            }
            v
        });
    let non_increasing = base.clone().prop_map(|mut v| {
        v.reverse();
        if v.len() >= 2 {
            v[1] = v[0];
        }
        v
    });
    let long_v = prop::collection::vec(typical.clone(), long..=long).prop_map(move |mut v| {
        if increasing {
            v.sort_by(f64::total_cmp);
            v.dedup();
        }
        v
    });
    prop_oneof![
        6 => base,
        1 => Just(Vec::new()),
        1 => typical.prop_map(|x| vec![x]),
        2 => non_increasing,
        3 => special_at,
        1 => long_v,
        1 => prop::collection::vec(any_bits(), 0..8),
    ]
    .boxed()
}

/// A strictly increasing grid of `n` points log-spaced over [lo, hi] (helper for valid data).
pub fn log_grid(lo: f64, hi: f64, n: usize) -> Vec<f64> {
    (0..n)
        .map(|i| {
            if n == 1 {
                lo
            } else {
                lo * (hi / lo).powf(i as f64 / (n - 1) as f64)
            }
        })
        .collect()
}
