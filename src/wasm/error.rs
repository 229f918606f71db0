//! Errors at the JavaScript boundary: every failure becomes one `QuantabandError` (defined in
//! `error.js`, re-exported from the package entry) carrying the core's stable code, the core's
//! `Display` text and, for bulk calls, the index of the first bad element.

#[allow(unused_imports)]
use super::prelude::*;

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
    /// Builds the error of a core `Error` from its fields (message template in error.js).
    #[wasm_bindgen(js_name = qbCoreError)]
    fn core_error(code: &str, s0: &str, s1: &str, numbers: &[f64], index: Option<u32>) -> JsValue;
    /// Builds an error found by the binding layer, with a ready message.
    #[wasm_bindgen(js_name = qbBindingError)]
    fn binding_error(code: &str, message: &str) -> JsValue;
    /// Defines options schema `id` (see `opts::Schema`) on the JavaScript side, once.
    #[wasm_bindgen(js_name = qbDefineOptions)]
    pub(crate) fn define_options(id: u32, spec: &str);
    /// Reads an options object against schema `id` in one crossing: field values into `out`,
    /// returns the mask of present fields or -1 (then read it field by field). Caught: a
    /// throwing getter or proxy trap never unwinds through WebAssembly frames.
    #[wasm_bindgen(catch, js_name = qbReadOptions)]
    pub(crate) fn read_options(obj: &JsValue, id: u32, out: &mut [f64]) -> Result<f64, JsValue>;
    /// A plain object with the numbers `values` under the ";"-separated `keys`, built in one
    /// crossing.
    #[wasm_bindgen(js_name = qbNumbers)]
    fn numbers_object(keys: &str, values: &[f64]) -> JsValue;
}

/// A result object: the numbers `values` under the ";"-separated `keys`, then the `extra`
/// fields (strings, arrays, nested objects) in order.
#[inline(never)]
pub(crate) fn object(keys: &str, values: &[f64], extra: &[(&str, &JsValue)]) -> JsValue {
    let o = numbers_object(keys, values);
    for (k, v) in extra {
        // Defining a data property on a fresh plain object cannot fail.
        let _ = js_sys::Reflect::set(&o, &JsValue::from_str(k), v);
    }
    o
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

/// The text fields and the numbers of `e`, in declaration order (the JavaScript templates in
/// error.js put them into the core's `Display` wording).
fn fields(e: &Error) -> (&'static str, &'static str, [f64; 2]) {
    match *e {
        Error::NonFinite { arg, value }
        | Error::NonPositiveTemperature { arg, value }
        | Error::NonPositiveSpectral { arg, value }
        | Error::NonPositive { arg, value } => (arg, "", [value, 0.0]),
        Error::OutOfRange { arg, value, range } => (arg, range, [value, 0.0]),
        Error::InvalidBand { lower, upper } => ("", "", [lower, upper]),
        Error::NoSolution { what } | Error::NotConverged { what } | Error::Unsupported { what } => {
            (what, "", [0.0; 2])
        }
        Error::NoPhysicalSolution { signal, background } => ("", "", [signal, background]),
        Error::DivergentOccupation { x } => ("", "", [x, 0.0]),
        Error::LengthMismatch { expected, got } => ("", "", [expected as f64, got as f64]),
        Error::TooFewPoints { needed, got } => ("", "", [needed as f64, got as f64]),
        Error::NotIncreasing { arg, index } => (arg, "", [index as f64, 0.0]),
        Error::DegenerateFit { reason } => (reason, "", [0.0; 2]),
        Error::UnknownUnit { expected } => (expected, "", [0.0; 2]),
    }
}

fn to_js(e: Error, index: Option<u32>) -> JsValue {
    let (s0, s1, n) = fields(&e);
    core_error(e.code(), s0, s1, &n, index)
}

impl From<Error> for JsValue {
    #[inline(never)]
    fn from(e: Error) -> JsValue {
        to_js(e, None)
    }
}

/// The error `e`, raised by element `index` of a bulk call.
#[inline(never)]
pub(crate) fn at(e: Error, index: usize) -> JsValue {
    to_js(e, Some(u32::try_from(index).unwrap_or(u32::MAX)))
}

/// An error detected by the binding layer itself (malformed options), with a core code and a
/// message made of `parts` (concatenated here rather than with `format!`, which would bring
/// `core::fmt` into the WebAssembly module).
#[inline(never)]
pub(crate) fn fail(code: &'static str, parts: &[&str]) -> JsValue {
    binding_error(code, &parts.concat())
}

/// `n` in decimal digits (for messages; see [`fail`]).
pub(crate) fn decimal(n: usize) -> String {
    let mut s = String::new();
    let mut p = 1;
    while n / p >= 10 {
        p *= 10;
    }
    loop {
        s.push(char::from(b'0' + (n / p % 10) as u8));
        if p == 1 {
            return s;
        }
        p /= 10;
    }
}

/// `items` separated by ", " (for messages).
pub(crate) fn list(items: &[&str]) -> String {
    let mut s = String::new();
    for (i, item) in items.iter().enumerate() {
        if i > 0 {
            s.push_str(", ");
        }
        s.push_str(item);
    }
    s
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

/// Maps `f` over `xs`, stopping at the first error and reporting its index. One out-of-line
/// copy serves every bulk export (`f` is called through a reference: an indirect call per
/// element, which is small next to any of the physics).
#[inline(never)]
pub(crate) fn map_indexed(
    xs: &[f64],
    f: &dyn Fn(f64) -> crate::Result<f64>,
) -> Result<Vec<f64>, JsValue> {
    let mut out = with_room(xs.len())?;
    for (i, &x) in xs.iter().enumerate() {
        out.push(f(x).map_err(|e| at(e, i))?);
    }
    Ok(out)
}
