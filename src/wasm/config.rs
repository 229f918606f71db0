//! Reading configuration objects through the core's own serde types.
//!
//! The facade has already copied the caller's object into fresh plain data (no getters,
//! Proxies or foreign typed arrays reach this point; see `src/wasm/js/runtime.js`). Here it is
//! read in two steps: into a self-describing [`serde_value::Value`] (every key of every plain
//! object, [`to_value`]), then the typed definition from that value through [`Reader`], a small
//! deserializer over `Value` that keeps the path of the value being read (so an error names
//! `definition.conditions.window.transmittance`). Reading a struct straight from the JavaScript
//! object would visit only its known keys, so a misspelt key would be ignored; read from a
//! `Value`, the types' `deny_unknown_fields` works.
//!
//! Measured choices (DEVELOPERS.md, size notes): `Reader` replaces
//! `serde_value::ValueDeserializer` + `serde_path_to_error` (together about 50 KB of the module:
//! they wrap every visitor), and [`to_value`] replaces serde-wasm-bindgen's deserializer for the
//! first step (its error path links the float and string formatters, about 20 KB).
//! serde-wasm-bindgen serializes every result object.

use alloc::format;
use alloc::string::{String, ToString};
use alloc::vec::Vec;
use core::cell::RefCell;
use core::fmt;

use serde::de::{self, DeserializeOwned, DeserializeSeed, IntoDeserializer, Visitor};
use serde_value::Value;
use wasm_bindgen::{JsCast, JsValue};

use super::error::Fail;
use crate::units::SPECTRAL_NAMES;

thread_local! {
    /// Keys and indices from the root to the value being read (left in place by an error).
    static PATH: RefCell<Vec<String>> = const { RefCell::new(Vec::new()) };
}

/// Why a configuration value was refused.
#[derive(Debug)]
pub(crate) enum ConfigError {
    Custom(String),
    /// ("a string", expected)
    InvalidType(String, String),
    /// (the string given, or a description; expected)
    InvalidValue(Option<String>, String, String),
    UnknownField(String, &'static [&'static str]),
    MissingField(&'static str),
    UnknownVariant(String, &'static [&'static str]),
    InvalidLength(usize, String),
    DuplicateField(&'static str),
}

impl fmt::Display for ConfigError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("invalid configuration value")
    }
}

impl std::error::Error for ConfigError {}

/// "a string", "an object", … (no number formatting: the module carries no float printer
/// for this).
fn got(u: de::Unexpected<'_>) -> String {
    match u {
        de::Unexpected::Bool(true) => "the boolean true",
        de::Unexpected::Bool(false) => "the boolean false",
        de::Unexpected::Unsigned(_) | de::Unexpected::Signed(_) | de::Unexpected::Float(_) => {
            "a number"
        }
        de::Unexpected::Char(_) | de::Unexpected::Str(_) => "a string",
        de::Unexpected::Unit | de::Unexpected::Option => "null",
        de::Unexpected::Seq => "an array",
        de::Unexpected::Map => "an object",
        _ => "a value of another type",
    }
    .to_string()
}

impl de::Error for ConfigError {
    fn custom<T: fmt::Display>(msg: T) -> Self {
        ConfigError::Custom(msg.to_string())
    }
    fn invalid_type(unexp: de::Unexpected<'_>, exp: &dyn de::Expected) -> Self {
        ConfigError::InvalidType(got(unexp), exp.to_string())
    }
    fn invalid_value(unexp: de::Unexpected<'_>, exp: &dyn de::Expected) -> Self {
        let s = match unexp {
            de::Unexpected::Str(s) => Some(s.to_string()),
            _ => None,
        };
        ConfigError::InvalidValue(s, got(unexp), exp.to_string())
    }
    fn invalid_length(len: usize, exp: &dyn de::Expected) -> Self {
        ConfigError::InvalidLength(len, exp.to_string())
    }
    fn unknown_variant(variant: &str, expected: &'static [&'static str]) -> Self {
        ConfigError::UnknownVariant(variant.to_string(), expected)
    }
    fn unknown_field(field: &str, expected: &'static [&'static str]) -> Self {
        ConfigError::UnknownField(field.to_string(), expected)
    }
    fn missing_field(field: &'static str) -> Self {
        ConfigError::MissingField(field)
    }
    fn duplicate_field(field: &'static str) -> Self {
        ConfigError::DuplicateField(field)
    }
}

/// A deserializer over a [`Value`] that records the path it descends.
pub(crate) struct Reader(Value);

impl<'de> de::Deserializer<'de> for Reader {
    type Error = ConfigError;

    fn deserialize_any<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        // `to_value` makes only these kinds of values; matching no others keeps the code each
        // visitor type instantiates small.
        match self.0 {
            Value::F64(n) => v.visit_f64(n),
            Value::String(s) => v.visit_string(s),
            Value::Bool(b) => v.visit_bool(b),
            Value::Unit => v.visit_unit(),
            Value::Seq(items) => v.visit_seq(Items {
                items: items.into_iter(),
                index: 0,
            }),
            Value::Map(map) => v.visit_map(Entries {
                entries: map.into_iter(),
                value: None,
            }),
            _ => Err(ConfigError::Custom(
                "internal: unexpected value".to_string(),
            )),
        }
    }

    fn deserialize_option<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.0 {
            Value::Unit => v.visit_none(),
            other => v.visit_some(Reader(other)),
        }
    }

    fn deserialize_enum<V: Visitor<'de>>(
        self,
        _name: &'static str,
        _variants: &'static [&'static str],
        v: V,
    ) -> Result<V::Value, ConfigError> {
        match self.0 {
            Value::String(s) => v.visit_enum(s.into_deserializer()),
            other => Reader(other).deserialize_any(v),
        }
    }

    fn deserialize_newtype_struct<V: Visitor<'de>>(
        self,
        _name: &'static str,
        v: V,
    ) -> Result<V::Value, ConfigError> {
        v.visit_newtype_struct(self)
    }

    serde::forward_to_deserialize_any! {
        bool i8 i16 i32 i64 i128 u8 u16 u32 u64 u128 f32 f64 char str string bytes byte_buf
        unit unit_struct seq tuple tuple_struct map struct identifier ignored_any
    }
}

/// Runs `f` with `seg` on the path; leaves it there when `f` fails.
fn descend<T>(seg: String, f: impl FnOnce() -> Result<T, ConfigError>) -> Result<T, ConfigError> {
    push(seg);
    let r = f()?;
    pop();
    Ok(r)
}

// The path bookkeeping out of line: `descend` is instantiated for every type read, and these
// few instructions repeated in each cost the package several KB.
#[inline(never)]
fn push(seg: String) {
    PATH.with(|p| p.borrow_mut().push(seg));
}

#[inline(never)]
fn pop() {
    PATH.with(|p| p.borrow_mut().pop());
}

/// The path segment of field `name`.
#[inline(never)]
fn field_segment(name: &str) -> String {
    format!(".{name}")
}

/// The path segment of element `i`.
#[inline(never)]
fn index_segment(i: usize) -> String {
    format!("[{i}]")
}

struct Items {
    items: alloc::vec::IntoIter<Value>,
    index: usize,
}

impl<'de> de::SeqAccess<'de> for Items {
    type Error = ConfigError;
    fn next_element_seed<T: DeserializeSeed<'de>>(
        &mut self,
        seed: T,
    ) -> Result<Option<T::Value>, ConfigError> {
        let Some(item) = self.items.next() else {
            return Ok(None);
        };
        let i = self.index;
        self.index += 1;
        descend(index_segment(i), || seed.deserialize(Reader(item))).map(Some)
    }
    fn size_hint(&self) -> Option<usize> {
        Some(self.items.len())
    }
}

struct Entries {
    entries: alloc::collections::btree_map::IntoIter<Value, Value>,
    value: Option<(String, Value)>,
}

impl<'de> de::MapAccess<'de> for Entries {
    type Error = ConfigError;
    fn next_key_seed<K: DeserializeSeed<'de>>(
        &mut self,
        seed: K,
    ) -> Result<Option<K::Value>, ConfigError> {
        let Some((k, v)) = self.entries.next() else {
            return Ok(None);
        };
        let name = match &k {
            Value::String(s) => s.clone(),
            _ => String::from("?"),
        };
        self.value = Some((name, v));
        seed.deserialize(Reader(k)).map(Some)
    }
    fn next_value_seed<V: DeserializeSeed<'de>>(
        &mut self,
        seed: V,
    ) -> Result<V::Value, ConfigError> {
        let (name, v) = self
            .value
            .take()
            .ok_or_else(|| ConfigError::Custom("internal: value without key".to_string()))?;
        descend(field_segment(&name), || seed.deserialize(Reader(v)))
    }
}

/// Reads `value` (the JavaScript parameter `what`) as a `T`. Errors name the field path from
/// `what`: `UNSUPPORTED` for an unknown key (with the accepted keys) or a value outside a fixed
/// set, `WRONG_TYPE` for a value of the wrong type or a missing required field, `UNKNOWN_UNIT`
/// for an unknown unit name.
#[inline(never)]
pub(crate) fn read<T: DeserializeOwned>(value: JsValue, what: &str) -> Result<T, Fail> {
    let v = to_value(&value, 0).map_err(|(path, kind)| {
        Fail::Binding("WRONG_TYPE", format!("{what}{path} cannot be {kind}"))
    })?;
    PATH.with(|p| p.borrow_mut().clear());
    T::deserialize(Reader(v)).map_err(|e| {
        let path: String = PATH.with(|p| p.borrow_mut().drain(..).collect());
        describe(e, &format!("{what}{path}"))
    })
}

/// Deepest nesting read (configuration objects are 3 levels deep at most).
const MAX_DEPTH: u32 = 16;

/// The plain data `v` (a copy the facade made: plain objects, arrays, Float64Arrays, strings,
/// numbers, booleans, undefined/null) as a [`Value`]; anything else is refused with the path
/// and a description of the value.
fn to_value(v: &JsValue, depth: u32) -> Result<Value, (String, &'static str)> {
    if depth > MAX_DEPTH {
        return Err((String::new(), "nested this deeply"));
    }
    if v.is_undefined() || v.is_null() {
        return Ok(Value::Unit);
    }
    if let Some(b) = v.as_bool() {
        return Ok(Value::Bool(b));
    }
    if let Some(x) = v.as_f64() {
        return Ok(Value::F64(x));
    }
    if let Some(s) = v.as_string() {
        return Ok(Value::String(s));
    }
    if let Some(a) = v.dyn_ref::<js_sys::Float64Array>() {
        return Ok(Value::Seq(a.to_vec().into_iter().map(Value::F64).collect()));
    }
    if js_sys::Array::is_array(v) {
        let a: &js_sys::Array = v.unchecked_ref();
        let mut items = Vec::new();
        for (i, x) in a.iter().enumerate() {
            items.push(to_value(&x, depth + 1).map_err(|(p, k)| (format!("[{i}]{p}"), k))?);
        }
        return Ok(Value::Seq(items));
    }
    if v.is_object() && !v.is_function() {
        let mut map = alloc::collections::BTreeMap::new();
        let o: &js_sys::Object = v.unchecked_ref();
        for k in js_sys::Object::keys(o).iter() {
            let Some(key) = k.as_string() else { continue };
            let x = js_sys::Reflect::get(v, &k).unwrap_or(JsValue::UNDEFINED);
            if x.is_undefined() {
                continue; // an undefined field is a field left out
            }
            let val = to_value(&x, depth + 1).map_err(|(p, kind)| (format!(".{key}{p}"), kind))?;
            map.insert(Value::String(key), val);
        }
        return Ok(Value::Map(map));
    }
    Err((
        String::new(),
        if v.is_bigint() {
            "a bigint"
        } else if v.is_function() {
            "a function"
        } else if v.is_symbol() {
            "a symbol"
        } else {
            "a value of this type"
        },
    ))
}

fn list(items: &[&str]) -> String {
    let quoted: Vec<String> = items.iter().map(|s| format!("\"{s}\"")).collect();
    quoted.join(", ")
}

/// "a number" for serde's "f64", and so on.
fn expected(e: &str) -> String {
    match e {
        _ if e == SPECTRAL_NAMES => "a spectral unit name (a string such as \"um\")".to_string(),
        "f64" | "f32" | "i64" | "u64" | "u32" | "usize" => "a number".to_string(),
        "a sequence" => "an array of numbers".to_string(),
        _ if e.starts_with("struct ") || e.starts_with("a map") || e.contains("object") => {
            "an object".to_string()
        }
        _ if e.starts_with("variant identifier") || e.starts_with("enum ") => {
            "a string".to_string()
        }
        _ => e.to_string(),
    }
}

fn describe(e: ConfigError, at: &str) -> Fail {
    match e {
        ConfigError::UnknownField(key, accepted) => Fail::Binding(
            "UNSUPPORTED",
            format!(
                "{at}: unknown field \"{key}\" (accepted fields: {})",
                list(accepted)
            ),
        ),
        ConfigError::MissingField(field) => Fail::Binding(
            "WRONG_TYPE",
            format!("{at}.{field} is required (got undefined)"),
        ),
        ConfigError::InvalidType(g, exp) => Fail::Binding(
            "WRONG_TYPE",
            format!("{at} must be {} (got {g})", expected(&exp)),
        ),
        ConfigError::InvalidValue(Some(s), _, exp) if exp == SPECTRAL_NAMES => Fail::Binding(
            "UNKNOWN_UNIT",
            format!("{at}: unknown unit \"{s}\"; expected a {exp}"),
        ),
        ConfigError::InvalidValue(s, g, exp) => Fail::Binding(
            "UNSUPPORTED",
            match s {
                Some(s) => format!("{at} must be {exp} (got \"{s}\")"),
                None => format!("{at} must be {exp} (got {g})"),
            },
        ),
        ConfigError::UnknownVariant(v, accepted) => Fail::Binding(
            "UNSUPPORTED",
            format!("{at} must be one of {} (got \"{v}\")", list(accepted)),
        ),
        ConfigError::InvalidLength(n, exp) => Fail::Binding(
            "WRONG_TYPE",
            format!("{at} must be {exp} (got {n} elements)"),
        ),
        ConfigError::DuplicateField(f) => {
            Fail::Binding("UNSUPPORTED", format!("{at}: field \"{f}\" given twice"))
        }
        ConfigError::Custom(m) => Fail::Binding("UNSUPPORTED", format!("{at}: {m}")),
    }
}
