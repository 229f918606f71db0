//! Reading JavaScript options objects without serde (js-sys `Reflect`, which keeps the module
//! small): strict about unknown fields and about the type of every field, so a misspelt option is
//! an error instead of a silently ignored default.
//!
//! Hot options objects (those of the scalar band, density and model calls) are first read in
//! ONE call into JavaScript (`qbReadOptions` in error.js) against a [`Schema`]: key check and
//! every field at once, numbers and the index of each string among its choices. Only when that
//! reader sees anything unusual (an unknown key, a wrongly typed field, a string outside the
//! choices) is the object read again field by field through `Reflect`, which produces the exact
//! error message (or accepts a spelling outside the choices, such as a unit alias). Both paths
//! read the same values from a well-formed object.

#[allow(unused_imports)]
use super::prelude::*;

use alloc::borrow::Cow;
use core::sync::atomic::{AtomicU32, Ordering};
use js_sys::{Array, Object, Reflect};
use wasm_bindgen::prelude::*;
use wasm_bindgen::JsCast;

use super::error::{define_options, fail, list, read_options};

/// The fields of an options object for the one-call reader.
pub(crate) struct Schema {
    /// A distinct id below 32 (a bit of `DEFINED`).
    pub(crate) id: u32,
    /// `(key, choices)` in reading order: `choices` is empty for a number field, else the
    /// accepted strings of a string field. At most `MAX_FIELDS` fields.
    pub(crate) fields: &'static [(&'static str, &'static [&'static str])],
}

const MAX_FIELDS: usize = 8;

/// Bit `id` is set once schema `id` has been defined on the JavaScript side.
static DEFINED: AtomicU32 = AtomicU32::new(0);

/// Field values read by the one-call reader.
struct Fast {
    schema: &'static Schema,
    /// Bit i set: field i is present (not undefined).
    mask: u32,
    /// Field i: its number, or the index of its string among the choices.
    vals: [f64; MAX_FIELDS],
}

/// Reads `value` against `schema` in one call into JavaScript; `None` when it needs the
/// field-by-field path.
#[inline(never)]
fn read_fast(value: &JsValue, schema: &'static Schema) -> Option<Fast> {
    let bit = 1u32.checked_shl(schema.id)?;
    let n = schema.fields.len();
    if n > MAX_FIELDS {
        return None;
    }
    if DEFINED.load(Ordering::Relaxed) & bit == 0 {
        let mut spec = String::new();
        for (i, (key, choices)) in schema.fields.iter().enumerate() {
            if i > 0 {
                spec.push(';');
            }
            spec.push_str(key);
            for (j, c) in choices.iter().enumerate() {
                spec.push(if j == 0 { '=' } else { '|' });
                spec.push_str(c);
            }
        }
        define_options(schema.id, &spec);
        DEFINED.fetch_or(bit, Ordering::Relaxed);
    }
    let mut vals = [0.0; MAX_FIELDS];
    // A throw (a getter or proxy trap) also means field by field, which meets it again and
    // reports it as before.
    let mask = read_options(value, schema.id, &mut vals[..n]).unwrap_or(-1.0);
    // -1 (or anything that is not a mask of n bits): read field by field.
    if !(mask >= 0.0 && mask < f64::from(1u32 << n)) {
        return None;
    }
    Some(Fast {
        schema,
        mask: mask as u32,
        vals,
    })
}

/// A validated options object: a plain object whose keys are all in an allowed list.
pub(crate) struct Opts<'a> {
    obj: &'a JsValue,
    what: &'static str,
    fast: Option<Fast>,
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
                &[
                    what,
                    " must be an options object with fields ",
                    &list(allowed),
                ],
            ));
        }
        let obj: &Object = value.unchecked_ref();
        let keys = Object::keys(obj);
        for k in keys.iter() {
            let key = k.as_string().unwrap_or_default();
            if !allowed.iter().any(|a| *a == key) {
                return Err(fail(
                    "UNSUPPORTED",
                    &[
                        what,
                        ": unknown field \"",
                        &key,
                        "\" (accepted fields: ",
                        &list(allowed),
                        ")",
                    ],
                ));
            }
        }
        Ok(Opts {
            obj: value,
            what,
            fast: None,
        })
    }

    /// As [`Opts::new`], reading the whole object in one call into JavaScript when it is
    /// well-formed for `schema` (whose keys must be exactly `allowed`).
    pub(crate) fn with_schema(
        value: &'a JsValue,
        what: &'static str,
        allowed: &[&str],
        schema: &'static Schema,
    ) -> Result<Self, JsValue> {
        match read_fast(value, schema) {
            Some(fast) => Ok(Opts {
                obj: value,
                what,
                fast: Some(fast),
            }),
            None => Opts::new(value, what, allowed),
        }
    }

    /// The one-call read alone: `None` when the object is not well-formed for `schema` (nothing
    /// reported; the caller then takes its field-by-field path).
    pub(crate) fn fast_only(
        value: &'a JsValue,
        what: &'static str,
        schema: &'static Schema,
    ) -> Option<Self> {
        read_fast(value, schema).map(|fast| Opts {
            obj: value,
            what,
            fast: Some(fast),
        })
    }

    /// Field `key` of the one-call read: its presence, value and choices (`None`: not read so).
    fn fast_field(&self, key: &str) -> Option<(bool, f64, &'static [&'static str])> {
        let f = self.fast.as_ref()?;
        let i = f.schema.fields.iter().position(|(k, _)| *k == key)?;
        let choices = f.schema.fields[i].1;
        Some(((f.mask >> i) & 1 != 0, f.vals[i], choices))
    }

    fn get(&self, key: &str) -> Result<JsValue, JsValue> {
        Reflect::get(self.obj, &JsValue::from_str(key))
    }

    /// An optional number field (`undefined` → `None`). Any other non-number is `NON_FINITE`.
    #[inline(never)]
    pub(crate) fn num(&self, key: &str) -> Result<Option<f64>, JsValue> {
        if let Some((present, x, [])) = self.fast_field(key) {
            return Ok(if present { Some(x) } else { None });
        }
        let v = self.get(key)?;
        if v.is_undefined() {
            return Ok(None);
        }
        match v.as_f64() {
            Some(x) => Ok(Some(x)),
            None => Err(fail(
                "NON_FINITE",
                &[
                    self.what,
                    ".",
                    key,
                    " must be a finite number (got a ",
                    type_name(&v),
                    ")",
                ],
            )),
        }
    }

    /// A required number field. Missing or non-number: `NON_FINITE`.
    pub(crate) fn req_num(&self, key: &str) -> Result<f64, JsValue> {
        match self.num(key)? {
            Some(x) => Ok(x),
            None => Err(fail(
                "NON_FINITE",
                &[
                    self.what,
                    ".",
                    key,
                    " is required and must be a finite number",
                ],
            )),
        }
    }

    /// An optional string field (`undefined` → `None`). A non-string is reported with `code`.
    #[inline(never)]
    pub(crate) fn string(
        &self,
        key: &str,
        code: &'static str,
    ) -> Result<Option<Cow<'static, str>>, JsValue> {
        if let Some((present, index, choices)) = self.fast_field(key) {
            if !choices.is_empty() {
                if !present {
                    return Ok(None);
                }
                if let Some(c) = choices.get(index as usize) {
                    return Ok(Some(Cow::Borrowed(c)));
                }
            }
        }
        let v = self.get(key)?;
        if v.is_undefined() {
            return Ok(None);
        }
        match v.as_string() {
            Some(s) => Ok(Some(Cow::Owned(s))),
            None => Err(fail(
                code,
                &[
                    self.what,
                    ".",
                    key,
                    " must be a string (got a ",
                    type_name(&v),
                    ")",
                ],
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
            &[
                what,
                " must be one of ",
                &list(choices),
                " (got \"",
                value,
                "\")",
            ],
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
            &[what, " must be a string (got a ", type_name(v), ")"],
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
