//! Reading JavaScript options objects without serde (js-sys `Reflect`, which keeps the module
//! small): strict about unknown fields and about the type of every field, so a misspelt option is
//! an error instead of a silently ignored default.

use js_sys::{Array, Object, Reflect};
use wasm_bindgen::prelude::*;
use wasm_bindgen::JsCast;

use super::error::fail;

/// A validated options object: a plain object whose keys are all in an allowed list.
pub(crate) struct Opts<'a> {
    obj: &'a JsValue,
    what: &'static str,
}

impl<'a> Opts<'a> {
    /// Checks that `value` is a non-null, non-array object with no keys outside `allowed`.
    ///
    /// Errors: `UNSUPPORTED` (not an object, or an unknown key; the message lists the accepted
    /// keys).
    #[inline(never)]
    pub(crate) fn new(
        value: &'a JsValue,
        what: &'static str,
        allowed: &[&str],
    ) -> Result<Self, JsValue> {
        if !value.is_object() || Array::is_array(value) || value.is_function() {
            return Err(fail(
                "UNSUPPORTED",
                format!(
                    "{what} must be an options object with fields {}",
                    allowed.join(", ")
                ),
            ));
        }
        let obj: &Object = value.unchecked_ref();
        let keys = Object::keys(obj);
        for k in keys.iter() {
            let key = k.as_string().unwrap_or_default();
            if !allowed.iter().any(|a| *a == key) {
                return Err(fail(
                    "UNSUPPORTED",
                    format!(
                        "{what}: unknown field \"{key}\" (accepted fields: {})",
                        allowed.join(", ")
                    ),
                ));
            }
        }
        Ok(Opts { obj: value, what })
    }

    fn get(&self, key: &str) -> Result<JsValue, JsValue> {
        Reflect::get(self.obj, &JsValue::from_str(key))
    }

    /// An optional number field (`undefined` → `None`). Any other non-number is `NON_FINITE`.
    #[inline(never)]
    pub(crate) fn num(&self, key: &str) -> Result<Option<f64>, JsValue> {
        let v = self.get(key)?;
        if v.is_undefined() {
            return Ok(None);
        }
        match v.as_f64() {
            Some(x) => Ok(Some(x)),
            None => Err(fail(
                "NON_FINITE",
                format!(
                    "{}.{key} must be a finite number (got a {})",
                    self.what,
                    type_name(&v)
                ),
            )),
        }
    }

    /// A required number field. Missing or non-number: `NON_FINITE`.
    pub(crate) fn req_num(&self, key: &str) -> Result<f64, JsValue> {
        match self.num(key)? {
            Some(x) => Ok(x),
            None => Err(fail(
                "NON_FINITE",
                format!(
                    "{}.{key} is required and must be a finite number",
                    self.what
                ),
            )),
        }
    }

    /// An optional string field (`undefined` → `None`). A non-string is reported with `code`.
    #[inline(never)]
    pub(crate) fn string(&self, key: &str, code: &'static str) -> Result<Option<String>, JsValue> {
        let v = self.get(key)?;
        if v.is_undefined() {
            return Ok(None);
        }
        match v.as_string() {
            Some(s) => Ok(Some(s)),
            None => Err(fail(
                code,
                format!(
                    "{}.{key} must be a string (got a {})",
                    self.what,
                    type_name(&v)
                ),
            )),
        }
    }

    /// A raw field, for nested objects and arrays.
    pub(crate) fn raw(&self, key: &str) -> Result<JsValue, JsValue> {
        self.get(key)
    }

    /// The name used in messages.
    pub(crate) fn what(&self) -> &'static str {
        self.what
    }
}

/// A choice among fixed names: `Ok(index)` or `UNSUPPORTED` listing the choices.
#[inline(never)]
pub(crate) fn choose(what: &str, value: &str, choices: &[&str]) -> Result<usize, JsValue> {
    choices.iter().position(|c| *c == value).ok_or_else(|| {
        fail(
            "UNSUPPORTED",
            format!(
                "{what} must be one of {} (got \"{value}\")",
                choices.join(", ")
            ),
        )
    })
}

/// A string argument (unit names, choices). Taken as a `JsValue` rather than `&str`: the
/// generated glue would otherwise try to encode a non-string argument and can trap.
#[inline(never)]
pub(crate) fn js_string(v: &JsValue, what: &str, code: &'static str) -> Result<String, JsValue> {
    v.as_string().ok_or_else(|| {
        fail(
            code,
            format!("{what} must be a string (got a {})", type_name(v)),
        )
    })
}

/// An optional string argument (`undefined` or `null` → `None`).
pub(crate) fn opt_js_string(
    v: &JsValue,
    what: &str,
    code: &'static str,
) -> Result<Option<String>, JsValue> {
    if v.is_undefined() || v.is_null() {
        Ok(None)
    } else {
        js_string(v, what, code).map(Some)
    }
}

/// `typeof`-style name of a JS value for messages.
pub(crate) fn type_name(v: &JsValue) -> &'static str {
    if v.is_null() {
        "null"
    } else if v.is_string() {
        "string"
    } else if v.as_bool().is_some() {
        "boolean"
    } else if v.as_f64().is_some() {
        "number"
    } else if Array::is_array(v) {
        "array"
    } else if v.is_function() {
        "function"
    } else if v.is_object() {
        "object"
    } else if v.is_bigint() {
        "bigint"
    } else {
        "value of another type"
    }
}
