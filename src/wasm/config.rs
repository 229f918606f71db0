//! Reading configuration objects through the core's own serde types.
//!
//! The facade has already copied the caller's object into fresh plain data (no getters,
//! Proxies or foreign typed arrays reach this point; see `src/wasm/js/runtime.js`). [`Reader`]
//! deserializes the typed definition straight from that JavaScript value and keeps the path of
//! the value being read (so an error names `definition.conditions.window.transmittance`). A
//! struct is handed every key of its object (sorted by name), not only the ones it knows, so the
//! types' `deny_unknown_fields` works.
//!
//! Measured choices (DEVELOPERS.md, size notes): `Reader` replaces
//! `serde_value::ValueDeserializer` + `serde_path_to_error` (together about 50 KB of the module:
//! they wrap every visitor) and serde-wasm-bindgen's deserializer (its error path links the float
//! and string formatters, about 20 KB). Reading the JavaScript value directly instead of through
//! a `serde_value::Value` tree, answering each typed request with the one visitor method that
//! can accept the value, a small heapsort of the keys and path segments formatted outside the
//! generic code took the package from 389 037 B to 338 570 B, together with the float printer
//! that `src/wasm/error.rs` no longer links (DEVELOPERS.md, size notes).
//! serde-wasm-bindgen serializes every result object.

use alloc::format;
use alloc::string::{String, ToString};
use alloc::vec::Vec;
use core::cell::RefCell;
use core::fmt;

use serde::de::{self, DeserializeOwned, DeserializeSeed, IntoDeserializer, Visitor};
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
    /// A value plain data cannot hold ("a bigint", …) or one nested too deeply.
    Refused(&'static str),
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

/// A deserializer straight over the plain JavaScript data (or a number of a `Float64Array`
/// already copied out) that records the path it descends. Each typed request
/// (`deserialize_f64`, `deserialize_str`, …) calls only the visitor method that can accept the
/// value and otherwise reports what the visitor's default would (the same `invalid_type`), so
/// every field type instantiates little.
pub(crate) enum Reader {
    Js(JsValue),
    Num(f64),
}

/// What a JavaScript value is, as far as reading configuration goes.
enum Node {
    Null,
    Bool(bool),
    Num(f64),
    Str(String),
    Array(js_sys::Array),
    Numbers(Vec<f64>),
    Object(js_sys::Object),
}

/// The kind of `v`; refuses what plain data cannot hold (with a description).
#[inline(never)]
fn node(v: &JsValue) -> Result<Node, ConfigError> {
    if v.is_undefined() || v.is_null() {
        return Ok(Node::Null);
    }
    if let Some(b) = v.as_bool() {
        return Ok(Node::Bool(b));
    }
    if let Some(x) = v.as_f64() {
        return Ok(Node::Num(x));
    }
    if let Some(s) = v.as_string() {
        return Ok(Node::Str(s));
    }
    if let Some(a) = v.dyn_ref::<js_sys::Float64Array>() {
        return Ok(Node::Numbers(a.to_vec()));
    }
    if js_sys::Array::is_array(v) {
        return Ok(Node::Array(v.clone().unchecked_into()));
    }
    if v.is_object() && !v.is_function() {
        return Ok(Node::Object(v.clone().unchecked_into()));
    }
    Err(ConfigError::Refused(if v.is_bigint() {
        "a bigint"
    } else if v.is_function() {
        "a function"
    } else if v.is_symbol() {
        "a symbol"
    } else {
        "a value of this type"
    }))
}

impl Reader {
    fn node(&self) -> Result<Node, ConfigError> {
        match self {
            Reader::Js(v) => node(v),
            Reader::Num(x) => Ok(Node::Num(*x)),
        }
    }

    /// The error a visitor expecting `exp` gives for this value (serde's `invalid_type`, as
    /// the visitor's own default method would).
    #[inline(never)]
    fn wrong(&self, exp: &dyn de::Expected) -> ConfigError {
        let u = match self.node() {
            Err(e) => return e,
            Ok(Node::Null) => de::Unexpected::Unit,
            Ok(Node::Bool(b)) => de::Unexpected::Bool(b),
            Ok(Node::Num(x)) => de::Unexpected::Float(x),
            Ok(Node::Str(_)) => de::Unexpected::Str(""),
            Ok(Node::Array(_) | Node::Numbers(_)) => de::Unexpected::Seq,
            Ok(Node::Object(_)) => de::Unexpected::Map,
        };
        de::Error::invalid_type(u, exp)
    }

    fn string(&self) -> Option<String> {
        match self {
            Reader::Js(v) => v.as_string(),
            Reader::Num(_) => None,
        }
    }

    /// A collection: the elements of an array, or the fields of an object (`Ok(None)` for
    /// anything else).
    fn collection(&self) -> Result<Option<Result<Items, Entries>>, ConfigError> {
        Ok(collection(self.node()?))
    }
}

/// The elements of an array, or the fields of an object (`None` for anything else).
fn collection(n: Node) -> Option<Result<Items, Entries>> {
    Some(match n {
        Node::Array(a) => Ok(Items {
            len: a.length(),
            items: Elements::Array(a),
            index: 0,
        }),
        Node::Numbers(v) => Ok(Items {
            len: v.len() as u32,
            items: Elements::Numbers(v),
            index: 0,
        }),
        Node::Object(o) => Err(entries(&o)),
        _ => return None,
    })
}

/// The fields of object `o` whose value is not undefined (an undefined field is a field left
/// out), in the order of their names.
#[inline(never)]
fn entries(o: &js_sys::Object) -> Entries {
    let mut fields: Vec<(String, JsValue)> = Vec::new();
    for k in js_sys::Object::keys(o).iter() {
        let Some(key) = k.as_string() else { continue };
        let x = js_sys::Reflect::get(o, &k).unwrap_or(JsValue::UNDEFINED);
        if !x.is_undefined() {
            fields.push((key, x));
        }
    }
    sort_by_name(&mut fields);
    Entries {
        fields: fields.into_iter(),
        value: None,
    }
}

/// Heapsort by field name (names are distinct): n log n for any object, and far less code
/// than the standard library's sort instantiated for these pairs.
fn sort_by_name(v: &mut [(String, JsValue)]) {
    fn sift(v: &mut [(String, JsValue)], mut root: usize, end: usize) {
        loop {
            let mut child = 2 * root + 1;
            if child >= end {
                return;
            }
            if child + 1 < end && v[child].0 < v[child + 1].0 {
                child += 1;
            }
            if v[root].0 >= v[child].0 {
                return;
            }
            v.swap(root, child);
            root = child;
        }
    }
    let n = v.len();
    for i in (0..n / 2).rev() {
        sift(v, i, n);
    }
    for end in (1..n).rev() {
        v.swap(0, end);
        sift(v, 0, end);
    }
}

impl<'de> de::Deserializer<'de> for Reader {
    type Error = ConfigError;

    fn deserialize_any<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.node()? {
            Node::Num(n) => v.visit_f64(n),
            Node::Str(s) => v.visit_string(s),
            Node::Bool(b) => v.visit_bool(b),
            Node::Null => v.visit_unit(),
            n => match collection(n) {
                Some(Ok(items)) => v.visit_seq(items),
                Some(Err(entries)) => v.visit_map(entries),
                None => Err(ConfigError::Custom(
                    "internal: unexpected value".to_string(),
                )),
            },
        }
    }

    fn deserialize_f64<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        let x = match &self {
            Reader::Num(x) => Some(*x),
            Reader::Js(j) => j.as_f64(),
        };
        match x {
            Some(x) => v.visit_f64(x),
            None => Err(self.wrong(&v)),
        }
    }

    fn deserialize_f32<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        self.deserialize_f64(v)
    }

    fn deserialize_bool<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        if let Reader::Js(j) = &self {
            if let Some(b) = j.as_bool() {
                return v.visit_bool(b);
            }
        }
        Err(self.wrong(&v))
    }

    fn deserialize_str<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.string() {
            Some(s) => v.visit_str(&s),
            None => Err(self.wrong(&v)),
        }
    }

    fn deserialize_string<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.string() {
            Some(s) => v.visit_string(s),
            None => Err(self.wrong(&v)),
        }
    }

    fn deserialize_identifier<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        self.deserialize_str(v)
    }

    fn deserialize_option<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match &self {
            Reader::Js(j) if j.is_undefined() || j.is_null() => v.visit_none(),
            _ => v.visit_some(self),
        }
    }

    fn deserialize_enum<V: Visitor<'de>>(
        self,
        _name: &'static str,
        _variants: &'static [&'static str],
        v: V,
    ) -> Result<V::Value, ConfigError> {
        match self.string() {
            Some(s) => v.visit_enum(s.into_deserializer()),
            None => Err(self.wrong(&v)),
        }
    }

    fn deserialize_seq<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.collection()? {
            Some(Ok(items)) => v.visit_seq(items),
            _ => Err(self.wrong(&v)),
        }
    }

    fn deserialize_tuple<V: Visitor<'de>>(
        self,
        _len: usize,
        v: V,
    ) -> Result<V::Value, ConfigError> {
        self.deserialize_seq(v)
    }

    fn deserialize_tuple_struct<V: Visitor<'de>>(
        self,
        _name: &'static str,
        _len: usize,
        v: V,
    ) -> Result<V::Value, ConfigError> {
        self.deserialize_seq(v)
    }

    fn deserialize_map<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        match self.collection()? {
            Some(Err(entries)) => v.visit_map(entries),
            _ => Err(self.wrong(&v)),
        }
    }

    fn deserialize_struct<V: Visitor<'de>>(
        self,
        _name: &'static str,
        _fields: &'static [&'static str],
        v: V,
    ) -> Result<V::Value, ConfigError> {
        // Only an object: serde's derived structs would also read an array field by field in
        // order (`conditions: [0.9]` as an emissivity), a silent coercion the boundary refuses
        // (WRONG_TYPE, "must be an object (got an array)"); it also drops every derived
        // `visit_seq` from the module (10.4 KB).
        match self.collection()? {
            Some(Err(entries)) => v.visit_map(entries),
            _ => Err(self.wrong(&v)),
        }
    }

    fn deserialize_newtype_struct<V: Visitor<'de>>(
        self,
        _name: &'static str,
        v: V,
    ) -> Result<V::Value, ConfigError> {
        v.visit_newtype_struct(self)
    }

    fn deserialize_ignored_any<V: Visitor<'de>>(self, v: V) -> Result<V::Value, ConfigError> {
        // Ignored values are not read (the visitor accepts anything).
        v.visit_unit()
    }

    serde::forward_to_deserialize_any! {
        i8 i16 i32 i64 i128 u8 u16 u32 u64 u128 char bytes byte_buf unit unit_struct
    }
}

/// Puts `seg` on the path (where an error leaves it); refuses a value nested too deeply.
#[inline(never)]
fn enter(seg: fmt::Arguments<'_>) -> Result<(), ConfigError> {
    let seg = format!("{seg}");
    let deep = PATH.with(|p| {
        let mut p = p.borrow_mut();
        p.push(seg);
        p.len() > MAX_DEPTH
    });
    if deep {
        Err(ConfigError::Refused("nested this deeply"))
    } else {
        Ok(())
    }
}

/// Takes the last segment off the path (after a value was read).
#[inline(never)]
fn leave() {
    PATH.with(|p| p.borrow_mut().pop());
}

enum Elements {
    Array(js_sys::Array),
    Numbers(Vec<f64>),
}

struct Items {
    items: Elements,
    len: u32,
    index: u32,
}

impl Items {
    /// The next element, its index on the path.
    #[inline(never)]
    fn next_item(&mut self) -> Result<Option<Reader>, ConfigError> {
        let i = self.index;
        if i >= self.len {
            return Ok(None);
        }
        self.index += 1;
        enter(format_args!("[{i}]"))?;
        Ok(Some(match &self.items {
            Elements::Array(a) => Reader::Js(a.get(i)),
            Elements::Numbers(v) => Reader::Num(v.get(i as usize).copied().unwrap_or(f64::NAN)),
        }))
    }
}

impl<'de> de::SeqAccess<'de> for Items {
    type Error = ConfigError;
    fn next_element_seed<T: DeserializeSeed<'de>>(
        &mut self,
        seed: T,
    ) -> Result<Option<T::Value>, ConfigError> {
        let Some(item) = self.next_item()? else {
            return Ok(None);
        };
        let v = seed.deserialize(item)?;
        leave();
        Ok(Some(v))
    }
    fn size_hint(&self) -> Option<usize> {
        Some((self.len - self.index) as usize)
    }
}

struct Entries {
    fields: alloc::vec::IntoIter<(String, JsValue)>,
    value: Option<(String, JsValue)>,
}

impl Entries {
    /// The value of the last key, its name on the path.
    #[inline(never)]
    fn next_field(&mut self) -> Result<Reader, ConfigError> {
        let (name, v) = self
            .value
            .take()
            .ok_or_else(|| ConfigError::Custom("internal: value without key".to_string()))?;
        enter(format_args!(".{name}"))?;
        Ok(Reader::Js(v))
    }
}

impl<'de> de::MapAccess<'de> for Entries {
    type Error = ConfigError;
    fn next_key_seed<K: DeserializeSeed<'de>>(
        &mut self,
        seed: K,
    ) -> Result<Option<K::Value>, ConfigError> {
        let Some((k, v)) = self.fields.next() else {
            return Ok(None);
        };
        let r = seed.deserialize(k.as_str().into_deserializer());
        self.value = Some((k, v));
        r.map(Some)
    }
    fn next_value_seed<V: DeserializeSeed<'de>>(
        &mut self,
        seed: V,
    ) -> Result<V::Value, ConfigError> {
        let v = seed.deserialize(self.next_field()?)?;
        leave();
        Ok(v)
    }
}

/// Reads `value` (the JavaScript parameter `what`) as a `T`. Errors name the field path from
/// `what`: `UNSUPPORTED` for an unknown key (with the accepted keys) or a value outside a fixed
/// set, `WRONG_TYPE` for a value of the wrong type or a missing required field, `UNKNOWN_UNIT`
/// for an unknown unit name.
pub(crate) fn read<T: DeserializeOwned>(value: JsValue, what: &str) -> Result<T, Fail> {
    PATH.with(|p| p.borrow_mut().clear());
    T::deserialize(Reader::Js(value)).map_err(|e| failure(e, what))
}

/// The failure of a read of `what`, at the path left by the error.
#[inline(never)]
fn failure(e: ConfigError, what: &str) -> Fail {
    let path: String = PATH.with(|p| p.borrow_mut().drain(..).collect());
    describe(e, &cat(&[what, &path]))
}

/// Deepest nesting read (configuration objects are 3 levels deep at most).
const MAX_DEPTH: usize = 16;

/// `"a", "b", …` (quoted, comma-separated).
fn list(items: &[&str]) -> String {
    let mut out = String::new();
    for (i, s) in items.iter().enumerate() {
        if i > 0 {
            out.push_str(", ");
        }
        out.push('"');
        out.push_str(s);
        out.push('"');
    }
    out
}

/// The parts concatenated (messages without `format!`: one small loop instead of a formatting
/// call per message shape).
fn cat(parts: &[&str]) -> String {
    let mut out = String::new();
    for p in parts {
        out.push_str(p);
    }
    out
}

/// "a number" for serde's "f64", and so on.
fn expected(e: &str) -> String {
    match e {
        _ if e == SPECTRAL_NAMES => "a spectral unit name (a string such as \"um\")".to_string(),
        "f64" | "f32" | "i64" | "u64" | "u32" | "usize" => "a number".to_string(),
        "a sequence" => "an array of numbers".to_string(),
        // (a byte-window search: `str::contains` links a 1.6 KB substring searcher)
        _ if e.starts_with("struct ")
            || e.starts_with("a map")
            || e.as_bytes().windows(6).any(|w| w == b"object") =>
        {
            "an object".to_string()
        }
        _ if e.starts_with("variant identifier") || e.starts_with("enum ") => {
            "a string".to_string()
        }
        _ => e.to_string(),
    }
}

fn describe(e: ConfigError, at: &str) -> Fail {
    let (code, msg) = match e {
        ConfigError::UnknownField(key, accepted) => (
            "UNSUPPORTED",
            cat(&[
                at,
                ": unknown field \"",
                &key,
                "\" (accepted fields: ",
                &list(accepted),
                ")",
            ]),
        ),
        ConfigError::MissingField(field) => (
            "WRONG_TYPE",
            cat(&[at, ".", field, " is required (got undefined)"]),
        ),
        ConfigError::InvalidType(g, exp) => (
            "WRONG_TYPE",
            cat(&[at, " must be ", &expected(&exp), " (got ", &g, ")"]),
        ),
        ConfigError::InvalidValue(Some(s), _, exp) if exp == SPECTRAL_NAMES => (
            "UNKNOWN_UNIT",
            cat(&[at, ": unknown unit \"", &s, "\"; expected a ", &exp]),
        ),
        ConfigError::InvalidValue(s, g, exp) => (
            "UNSUPPORTED",
            match s {
                Some(s) => cat(&[at, " must be ", &exp, " (got \"", &s, "\")"]),
                None => cat(&[at, " must be ", &exp, " (got ", &g, ")"]),
            },
        ),
        ConfigError::UnknownVariant(v, accepted) => (
            "UNSUPPORTED",
            cat(&[
                at,
                " must be one of ",
                &list(accepted),
                " (got \"",
                &v,
                "\")",
            ]),
        ),
        ConfigError::InvalidLength(n, exp) => (
            "WRONG_TYPE",
            format!("{at} must be {exp} (got {n} elements)"),
        ),
        ConfigError::DuplicateField(f) => {
            ("UNSUPPORTED", cat(&[at, ": field \"", f, "\" given twice"]))
        }
        ConfigError::Custom(m) => ("UNSUPPORTED", cat(&[at, ": ", &m])),
        ConfigError::Refused(kind) => ("WRONG_TYPE", cat(&[at, " cannot be ", kind])),
    };
    Fail::Binding(code, msg)
}
