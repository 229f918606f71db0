//! Errors at the JavaScript boundary, raised out of band.
//!
//! No export throws and none returns a `Result` (which the glue would turn into a per-call
//! array and a throw from inside the call). Instead an export that fails stores the error in a
//! slot and returns a sentinel the facade recognises without a second crossing: `NaN` for an
//! export returning a number (the core never returns NaN as a success), `undefined` for one
//! returning an object or a prepared handle. The facade (`src/wasm/js/runtime.js`) then calls
//! [`take_error`], which hands the error over as plain data, and builds the one
//! `QuantabandError` class from it (messages of core errors are templates in
//! `src/wasm/js/errors.js`, in the wording of the core's `Display`).

use core::cell::RefCell;

use alloc::string::String;
use serde::Serialize;
use wasm_bindgen::prelude::*;

use crate::Error;

/// A failure of an export: a core error (with the element index of a bulk call), or an error
/// found by the binding layer itself (a malformed configuration object), with its own code and
/// a ready message.
#[derive(Debug)]
pub(crate) enum Fail {
    /// A core error, the element index of a bulk call, and the path of the configuration
    /// object the error's argument lives in (e.g. `"definition.model"`; empty for arguments).
    Core(Error, Option<usize>, &'static str),
    Binding(&'static str, String),
}

impl From<Error> for Fail {
    fn from(e: Error) -> Fail {
        Fail::Core(e, None, "")
    }
}

/// The error `e`, raised by element `index` of a bulk call.
pub(crate) fn at(e: Error, index: usize) -> Fail {
    Fail::Core(e, Some(index), "")
}

/// The error `e` of a field of the configuration object at `path`.
pub(crate) fn in_config(path: &'static str) -> impl Fn(Error) -> Fail {
    move |e| Fail::Core(e, None, path)
}

thread_local! {
    static PENDING: RefCell<Option<Fail>> = const { RefCell::new(None) };
}

#[inline(never)]
fn store(f: Fail) {
    PENDING.with(|p| *p.borrow_mut() = Some(f));
}

/// An export's number: the value, or NaN with the error stored.
#[inline]
pub(crate) fn number(r: Result<f64, Fail>) -> f64 {
    match r {
        Ok(v) => v,
        Err(f) => {
            store(f);
            f64::NAN
        }
    }
}

/// An export's object or handle: `Some`, or `None` (JS `undefined`) with the error stored.
#[inline]
pub(crate) fn some<T>(r: Result<T, Fail>) -> Option<T> {
    match r {
        Ok(v) => Some(v),
        Err(f) => {
            store(f);
            None
        }
    }
}

/// A result object for JavaScript (serde-wasm-bindgen: structs become plain objects).
pub(crate) fn to_js<T: Serialize + ?Sized>(v: &T) -> Result<JsValue, Fail> {
    v.serialize(&serde_wasm_bindgen::Serializer::new())
        .map_err(|e| Fail::Binding("UNSUPPORTED", alloc::format!("internal: {e}")))
}

/// A stored error as plain data for the facade.
#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct Pending {
    code: &'static str,
    /// The variant's text fields (core errors), in declaration order.
    texts: [String; 2],
    /// The variant's numbers (core errors), in declaration order (a grid's ends are numbers
    /// too, formatted by the facade: the module then links no float printer).
    numbers: [f64; 3],
    /// First bad element of a bulk call.
    #[serde(skip_serializing_if = "Option::is_none")]
    index: Option<usize>,
    /// A ready message (binding errors).
    #[serde(skip_serializing_if = "Option::is_none")]
    message: Option<String>,
}

/// The text fields and the numbers of `e`, in declaration order (integers that a message shows
/// as a bracketed position are pre-formatted as text).
fn fields(e: &Error) -> ([String; 2], [f64; 3]) {
    let t = |a: &str, b: &str| [String::from(a), String::from(b)];
    match *e {
        Error::NonFinite { arg, value }
        | Error::NonPositiveTemperature { arg, value }
        | Error::NonPositiveSpectral { arg, value }
        | Error::NonPositive { arg, value } => (t(arg, ""), [value, 0.0, 0.0]),
        Error::OutOfRange { arg, value, range } => (t(arg, range), [value, 0.0, 0.0]),
        Error::InvalidBand { lower, upper } => (t("", ""), [lower, upper, 0.0]),
        Error::NoSolution { what } | Error::NotConverged { what } | Error::Unsupported { what } => {
            (t(what, ""), [0.0; 3])
        }
        Error::NoPhysicalSolution { signal, background } => (t("", ""), [signal, background, 0.0]),
        Error::DivergentOccupation { x } => (t("", ""), [x, 0.0, 0.0]),
        Error::LengthMismatch { expected, got } => (t("", ""), [expected as f64, got as f64, 0.0]),
        Error::TooFewPoints { needed, got } => (t("", ""), [needed as f64, got as f64, 0.0]),
        Error::NotIncreasing { arg, index } => (t(arg, ""), [index as f64, 0.0, 0.0]),
        Error::DegenerateFit { reason } => (t(reason, ""), [0.0; 3]),
        Error::UnknownUnit { expected } => (t(expected, ""), [0.0; 3]),
        Error::TooLarge { arg, limit, got } => (t(arg, ""), [limit as f64, got as f64, 0.0]),
        Error::InvalidCorrelation {
            reason,
            row,
            column,
            value,
        } => (
            [String::from(reason), alloc::format!("[{row}][{column}]")],
            [value, 0.0, 0.0],
        ),
        Error::InvalidTableEntry {
            arg,
            index,
            value,
            range,
        } => (t(arg, range), [value, index as f64, 0.0]),
        Error::OutsideTable {
            arg,
            wavelength_m,
            first_m,
            last_m,
        } => (t(arg, ""), [wavelength_m, first_m, last_m]),
        Error::InvalidLine { line, reason } => (t(reason, ""), [line as f64, 0.0, 0.0]),
    }
}

/// The plain data the facade receives for core error `e` (for the wasm-bindgen-test suites, which
/// check the facade's message templates against the core's `Display`; not exported).
pub fn pending_of(e: Error, index: Option<usize>) -> JsValue {
    let (texts, numbers) = fields(&e);
    to_js(&Pending {
        code: e.code(),
        texts,
        numbers,
        index,
        message: None,
    })
    .unwrap_or(JsValue::UNDEFINED)
}

/// Hands over (and clears) the stored error: `{ code, texts, numbers, index?, message? }`, or
/// `undefined` when none is stored. Called by the facade after a sentinel result.
#[wasm_bindgen(js_name = qbTakeError)]
pub fn take_error() -> JsValue {
    let Some(f) = PENDING.with(|p| p.borrow_mut().take()) else {
        return JsValue::UNDEFINED;
    };
    let p = match f {
        Fail::Core(e, index, path) => {
            let (texts, numbers) = fields(&e);
            // Prefix the argument name of a configuration field with its object's path.
            let has_arg = matches!(
                e,
                Error::NonFinite { .. }
                    | Error::NonPositiveTemperature { .. }
                    | Error::NonPositiveSpectral { .. }
                    | Error::NonPositive { .. }
                    | Error::OutOfRange { .. }
                    | Error::NotIncreasing { .. }
                    | Error::TooLarge { .. }
                    | Error::InvalidTableEntry { .. }
                    | Error::OutsideTable { .. }
            );
            let [first, second] = texts;
            let first = if has_arg && !path.is_empty() {
                alloc::format!("{path}.{first}")
            } else {
                first
            };
            // A correlation matrix's entry is named with the matrix's path.
            let second = if matches!(e, Error::InvalidCorrelation { .. }) && !path.is_empty() {
                alloc::format!("{path}{second}")
            } else {
                second
            };
            Pending {
                code: e.code(),
                texts: [first, second],
                numbers,
                index,
                message: None,
            }
        }
        Fail::Binding(code, message) => Pending {
            code,
            texts: [String::new(), String::new()],
            numbers: [0.0; 3],
            index: None,
            message: Some(message),
        },
    };
    to_js(&p).unwrap_or(JsValue::UNDEFINED)
}

/// Every stable code of the Rust core, in order (`Error::ALL_CODES`), joined by commas: the
/// facade's test checks its one list of codes against it.
#[wasm_bindgen(js_name = qbCoreCodes)]
pub fn core_codes() -> String {
    Error::ALL_CODES.join(",")
}
