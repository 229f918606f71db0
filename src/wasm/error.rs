//! Errors at the JavaScript boundary: every failure becomes one `QuantabandError` (defined in
//! `error.js`, re-exported from the package entry) carrying the core's stable code, the core's
//! `Display` text and, for bulk calls, the index of the first bad element.

use wasm_bindgen::prelude::*;

use crate::Error;

#[wasm_bindgen(module = "/src/wasm/error.js")]
extern "C" {
    // Re-exported from the package entry so that `err instanceof QuantabandError` works; its
    // TypeScript declaration is the custom section below (a re-exported import would otherwise be
    // typed `unknown`).
    #[wasm_bindgen(reexport = "QuantabandError", skip_typescript, js_name = QuantabandError)]
    fn quantaband_error_class();
    #[wasm_bindgen(reexport = "ERROR_CODES", skip_typescript, js_name = ERROR_CODES)]
    fn error_codes_array();
    /// Builds the error; each U+0001 in `template` is replaced by the next element of `numbers`
    /// formatted by JavaScript's `String(number)`.
    #[wasm_bindgen(js_name = qbMakeError)]
    fn make_error(code: &str, template: &str, numbers: &[f64], index: Option<u32>) -> JsValue;
}

#[wasm_bindgen(typescript_custom_section)]
const TS_ERRORS: &str = r#"
/**
 * Stable machine-readable error codes (never renamed once released). Branch on these, never on
 * the message text. See the README "Errors" table for their meaning.
 */
export type ErrorCode =
  | "NON_FINITE"
  | "NON_POSITIVE_TEMPERATURE"
  | "NON_POSITIVE_SPECTRAL"
  | "NON_POSITIVE"
  | "OUT_OF_RANGE"
  | "INVALID_BAND"
  | "NO_SOLUTION"
  | "NO_PHYSICAL_SOLUTION"
  | "DIVERGENT_OCCUPATION"
  | "LENGTH_MISMATCH"
  | "TOO_FEW_POINTS"
  | "NOT_INCREASING"
  | "DEGENERATE_FIT"
  | "NOT_CONVERGED"
  | "UNKNOWN_UNIT"
  | "UNSUPPORTED";

/** Every {@link ErrorCode}, in a fixed order (frozen array). */
export const ERROR_CODES: readonly ErrorCode[];

/**
 * The one error class every function of this package throws for invalid input.
 *
 * - `name` is `"QuantabandError"`;
 * - `code` is a stable {@link ErrorCode};
 * - `message` states the violated bound and the value received;
 * - `index` (bulk functions only) is the index of the first bad element, and the message
 *   mentions it.
 *
 * The module stays usable after an error. The class lives in the module snippet
 * `pkg/snippets/quantaband-<hash>/src/wasm/error.js`, which the package entry re-exports.
 */
export class QuantabandError extends Error {
  constructor(code: ErrorCode, message: string, index?: number);
  readonly name: "QuantabandError";
  readonly code: ErrorCode;
  readonly index?: number;
}
"#;

/// Placeholder for a number in a message template (filled in by JavaScript).
const NUM: char = '\u{1}';

/// The core's `Display` text of `e`, with every floating-point value replaced by [`NUM`] and
/// collected in order. JavaScript formats the numbers, so the module does not carry Rust's
/// float formatter (about 20 KB of wasm); the wording is the core's (the host test below
/// checks it against `Display` for every variant).
fn describe(e: &Error) -> (String, Vec<f64>) {
    let n = NUM;
    match *e {
        Error::NonFinite { arg, value } => {
            (format!("{arg} must be a finite number (got {n})"), vec![value])
        }
        Error::NonPositiveTemperature { arg, value } => {
            (format!("{arg} must be > 0 K (got {n} K)"), vec![value])
        }
        Error::NonPositiveSpectral { arg, value } => {
            (format!("{arg} must be > 0 (got {n})"), vec![value])
        }
        Error::NonPositive { arg, value } => (format!("{arg} must be > 0 (got {n})"), vec![value]),
        Error::OutOfRange { arg, value, range } => {
            (format!("{arg} must lie in {range} (got {n})"), vec![value])
        }
        Error::InvalidBand { lower, upper } => (
            format!("band limits must satisfy lower < upper (got lower = {n}, upper = {n})"),
            vec![lower, upper],
        ),
        Error::NoSolution { what } => (format!("no solution: {what}"), vec![]),
        Error::NoPhysicalSolution { signal, background } => (
            format!(
                "no physical solution: signal {n} must exceed the reflected and path \
                 contribution {n}"
            ),
            vec![signal, background],
        ),
        Error::DivergentOccupation { x } => (
            format!("Bose-Einstein occupancy needs E > mu, i.e. x = (E - mu)/kT > 0 (got x = {n})"),
            vec![x],
        ),
        Error::LengthMismatch { expected, got } => (
            format!("array lengths must match (expected {expected}, got {got})"),
            vec![],
        ),
        Error::TooFewPoints { needed, got } => (
            format!("at least {needed} points are needed (got {got})"),
            vec![],
        ),
        Error::NotIncreasing { arg, index } => (
            format!(
                "{arg} must be strictly increasing (element {index} is not larger than the one before)"
            ),
            vec![],
        ),
        Error::DegenerateFit { reason } => (format!("degenerate fit: {reason}"), vec![]),
        Error::NotConverged { what } => (format!("did not converge: {what}"), vec![]),
        Error::UnknownUnit { expected } => {
            (format!("unknown unit; expected a {expected}"), vec![])
        }
        Error::Unsupported { what } => (format!("unsupported: {what}"), vec![]),
    }
}

impl From<Error> for JsValue {
    #[inline(never)]
    fn from(e: Error) -> JsValue {
        let (template, numbers) = describe(&e);
        make_error(e.code(), &template, &numbers, None)
    }
}

/// The error `e`, raised by element `index` of a bulk call.
#[inline(never)]
pub(crate) fn at(e: Error, index: usize) -> JsValue {
    let (mut template, numbers) = describe(&e);
    template.push_str(&format!(" (at index {index})"));
    make_error(
        e.code(),
        &template,
        &numbers,
        Some(u32::try_from(index).unwrap_or(u32::MAX)),
    )
}

/// An error detected by the binding layer itself (malformed options), with a core code.
/// `message` must not contain U+0001.
#[inline(never)]
pub(crate) fn fail(code: &'static str, message: String) -> JsValue {
    make_error(code, &message, &[], None)
}

/// An empty vector with room for `n` values, or an `OUT_OF_RANGE` error when that much memory
/// cannot be had (instead of the allocation failure that would abort the wasm instance).
#[inline(never)]
pub(crate) fn with_room<T>(n: usize) -> Result<Vec<T>, JsValue> {
    let mut v = Vec::new();
    if v.try_reserve_exact(n).is_err() {
        return Err(Error::OutOfRange {
            arg: "result length",
            value: n as f64,
            range: "what the WebAssembly memory can hold",
        }
        .into());
    }
    Ok(v)
}

/// Maps `f` over `xs`, stopping at the first error and reporting its index.
pub(crate) fn map_indexed<T: Copy>(
    xs: &[T],
    mut f: impl FnMut(T) -> crate::Result<f64>,
) -> Result<Vec<f64>, JsValue> {
    let mut out = with_room(xs.len())?;
    for (i, &x) in xs.iter().enumerate() {
        out.push(f(x).map_err(|e| at(e, i))?);
    }
    Ok(out)
}

#[cfg(all(test, not(target_arch = "wasm32")))]
mod tests {
    use super::*;

    /// Rust's `{}` for the f64 values used below equals JavaScript's `String(x)` (integers and
    /// short decimals), so substituting them must give the core's `Display` text exactly.
    fn fill(template: &str, numbers: &[f64]) -> String {
        let mut out = String::new();
        let mut it = numbers.iter();
        for ch in template.chars() {
            if ch == NUM {
                out.push_str(&it.next().expect("a number per placeholder").to_string());
            } else {
                out.push(ch);
            }
        }
        assert!(it.next().is_none(), "unused numbers");
        out
    }

    #[test]
    fn messages_match_the_core_display_for_every_variant() {
        let all = [
            Error::NonFinite {
                arg: "a",
                value: 2.5,
            },
            Error::NonPositiveTemperature {
                arg: "t",
                value: -3.0,
            },
            Error::NonPositiveSpectral {
                arg: "x",
                value: 0.0,
            },
            Error::NonPositive {
                arg: "s",
                value: -0.5,
            },
            Error::OutOfRange {
                arg: "e",
                value: 1.5,
                range: "(0, 1]",
            },
            Error::InvalidBand {
                lower: 14.0,
                upper: 8.0,
            },
            Error::NoSolution { what: "w" },
            Error::NoPhysicalSolution {
                signal: 1.25,
                background: 2.0,
            },
            Error::DivergentOccupation { x: -1.0 },
            Error::LengthMismatch {
                expected: 3,
                got: 2,
            },
            Error::TooFewPoints { needed: 3, got: 1 },
            Error::NotIncreasing { arg: "w", index: 4 },
            Error::DegenerateFit { reason: "r" },
            Error::NotConverged { what: "n" },
            Error::UnknownUnit { expected: "u" },
            Error::Unsupported { what: "x" },
        ];
        assert_eq!(all.len(), Error::ALL_CODES.len());
        for e in all {
            let (t, n) = describe(&e);
            assert_eq!(fill(&t, &n), e.to_string(), "{e:?}");
        }
    }
}
