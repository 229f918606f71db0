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
    #[wasm_bindgen(js_name = qbMakeError)]
    fn make_error(code: &str, message: &str, index: Option<u32>) -> JsValue;
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

impl From<Error> for JsValue {
    fn from(e: Error) -> JsValue {
        make_error(e.code(), &e.to_string(), None)
    }
}

/// The error `e`, raised by element `index` of a bulk call.
pub(crate) fn at(e: Error, index: usize) -> JsValue {
    let msg = format!("{e} (at index {index})");
    make_error(
        e.code(),
        &msg,
        Some(u32::try_from(index).unwrap_or(u32::MAX)),
    )
}

/// An error detected by the binding layer itself (malformed options), with a core code.
pub(crate) fn fail(code: &'static str, message: String) -> JsValue {
    make_error(code, &message, None)
}

/// Maps `f` over `xs`, stopping at the first error and reporting its index.
pub(crate) fn map_indexed<T: Copy>(
    xs: &[T],
    mut f: impl FnMut(T) -> crate::Result<f64>,
) -> Result<Vec<f64>, JsValue> {
    let mut out = Vec::with_capacity(xs.len());
    for (i, &x) in xs.iter().enumerate() {
        out.push(f(x).map_err(|e| at(e, i))?);
    }
    Ok(out)
}
