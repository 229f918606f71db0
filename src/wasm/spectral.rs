//! The prepared spectral instrument (`SpectralInstrument` in the facade,
//! `src/wasm/js/spectral.js`): a response table in energy or photon units and spectral
//! measurement conditions — each optical input a constant or a table in a wavelength unit —
//! read, converted to SI and checked once (including that every table covers the band), then
//! the forward and inverse spectral measurement equation, its five terms, band-effective
//! values and sensitivities on plain numbers; text tables; and the workflows from an
//! indicated temperature with this object (`src/wasm/reading.rs` has them for the grey
//! `Instrument`).
//!
//! Errors name what the caller wrote: table fields by their path in the definition
//! (`definition.conditions.window.reflectance.values`, with the element index), conditions by
//! `definition.conditions.<field>`, method arguments by their JavaScript names.

use alloc::format;
use alloc::vec::Vec;
use core::fmt;

use serde::de::{self, DeserializeSeed, Deserializer, MapAccess, Visitor};
use serde::Deserialize;
use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, some, Fail};
use super::reading::{out, setting_of, workflow, CORRECT};
use super::scratch::{map_in_place, status, with_f64};
use super::testing::Live;
use crate::constants::C2Convention;
use crate::error::{self as check, Error};
use crate::planck::Quantity;
use crate::thermometry::indicated::correct_reading_spectral;
use crate::thermometry::spectral::{
    band_effective, spectral_object_temperature, spectral_sensitivities, spectral_signal_terms,
    SpectralConditions, SpectralInstrument, SpectralValue, SpectralWindow,
};
use crate::thermometry::table::{Ends, SpectralTableBuf, TableKind};
use crate::units::{SpectralKind, SpectralUnit};

// ---------------------------------------------------------------------------------------------
// The definition as JavaScript writes it.

// The readers are written by hand with `visit_map` only: derived ones also carry a sequence
// form and field-name visitors for every struct, which cost the package about 12 KB here and
// are never used (configuration objects are plain objects). Errors go through the same
// reader (`config::read`), so they name the field path as everywhere else.

/// A table: wavelengths in a wavelength unit, values, and `ends` (condition tables) or
/// `quantity` (the response).
struct TableDef {
    wavelengths: Vec<f64>,
    values: Vec<f64>,
    unit: SpectralUnit,
    ends: Ends,
    quantity: Quantity,
}

const TABLE_FIELDS: &[&str] = &["wavelengths", "values", "unit", "ends"];
const RESPONSE_FIELDS: &[&str] = &["wavelengths", "values", "unit", "quantity"];

/// An optical input as given: left out, a number (grey) or a table object.
#[derive(Default)]
enum InputDef {
    #[default]
    Absent,
    Constant(f64),
    Table(TableDef),
}

/// Everything a definition holds, filled in place by the readers below: one flat record, so
/// a reader that fails part-way leaves one value to drop instead of a nest of partly built
/// structs (the nested form cost the package about 3 KB of drop code on the error paths).
#[derive(Default)]
struct Definition {
    /// The response, emissivity, reflectance, path transmittance, window transmittance and
    /// window reflectance (indices [`RESP`] … [`WIN_R`]).
    inputs: [InputDef; 6],
    /// reflectedTemperatureK, pathTemperatureK, window.temperatureK,
    /// window.reflectedTemperatureK (indices [`T_REFL`] … [`T_WIN_REFL`]).
    temps: [Option<f64>; 4],
    window: bool,
    c2: C2Convention,
}

const RESP: usize = 0;
const EPS: usize = 1;
const REFL: usize = 2;
const PATH_T: usize = 3;
const WIN_T: usize = 4;
const WIN_R: usize = 5;
const T_REFL: usize = 0;
const T_PATH: usize = 1;
const T_WIN: usize = 2;
const T_WIN_REFL: usize = 3;

/// The parts of a definition: which object (or optional input) a reader fills in.
#[derive(Clone, Copy)]
enum Part {
    Root,
    Conditions,
    Window,
    /// An optional input (`null` or left out: absent) at this index.
    Input(usize),
    /// An input that is a number or a table (not `null`) at this index.
    Required(usize),
    /// The response table.
    Response,
}

/// Reads one part of a definition into the record.
struct Fill<'a>(&'a mut Definition, Part);

impl<'de> DeserializeSeed<'de> for Fill<'_> {
    type Value = ();
    fn deserialize<D: Deserializer<'de>>(self, d: D) -> Result<(), D::Error> {
        match self.1 {
            Part::Root | Part::Response => d.deserialize_map(self),
            Part::Input(_) | Part::Conditions | Part::Window => d.deserialize_option(self),
            Part::Required(_) => d.deserialize_any(self),
        }
    }
}

/// What a field of the definition's objects is.
#[derive(Clone, Copy)]
enum Field {
    C2,
    /// An object or an optional input, read by [`Fill`].
    Object(Part),
    /// An optional temperature at this index of `temps`.
    Temperature(usize),
    /// A table's fields.
    Wavelengths,
    Values,
    Unit,
    Ends,
    Quantity,
}

const ROOT_FIELDS: &[&str] = &["response", "conditions", "c2"];
const ROOT_ACTS: &[Field] = &[
    Field::Object(Part::Response),
    Field::Object(Part::Conditions),
    Field::C2,
];
const TABLE_ACTS: &[Field] = &[Field::Wavelengths, Field::Values, Field::Unit, Field::Ends];
const RESPONSE_ACTS: &[Field] = &[
    Field::Wavelengths,
    Field::Values,
    Field::Unit,
    Field::Quantity,
];
const CONDITIONS_ACTS: &[Field] = &[
    Field::Object(Part::Input(EPS)),
    Field::Object(Part::Input(REFL)),
    Field::Temperature(T_REFL),
    Field::Object(Part::Input(PATH_T)),
    Field::Temperature(T_PATH),
    Field::Object(Part::Window),
];
const WINDOW_ACTS: &[Field] = &[
    Field::Object(Part::Input(WIN_T)),
    Field::Object(Part::Input(WIN_R)),
    Field::Temperature(T_WIN),
    Field::Temperature(T_WIN_REFL),
];
const CONDITIONS_FIELDS: &[&str] = &[
    "emissivity",
    "reflectance",
    "reflectedTemperatureK",
    "pathTransmittance",
    "pathTemperatureK",
    "window",
];
const WINDOW_FIELDS: &[&str] = &[
    "transmittance",
    "reflectance",
    "temperatureK",
    "reflectedTemperatureK",
];

impl<'de> Visitor<'de> for Fill<'_> {
    type Value = ();
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self.1 {
            Part::Input(_) | Part::Required(_) => {
                "a number or a table { wavelengths, values, unit, ends? }"
            }
            _ => "an object",
        })
    }
    fn visit_none<E: de::Error>(self) -> Result<(), E> {
        Ok(())
    }
    fn visit_some<D: Deserializer<'de>>(self, d: D) -> Result<(), D::Error> {
        match self.1 {
            Part::Input(i) => Fill(self.0, Part::Required(i)).deserialize(d),
            _ => d.deserialize_map(self),
        }
    }
    fn visit_f64<E: de::Error>(self, v: f64) -> Result<(), E> {
        if let Part::Required(i) | Part::Input(i) = self.1 {
            if let Some(slot) = self.0.inputs.get_mut(i) {
                *slot = InputDef::Constant(v);
            }
            return Ok(());
        }
        Err(de::Error::invalid_type(de::Unexpected::Float(v), &self))
    }
    fn visit_map<A: MapAccess<'de>>(self, mut m: A) -> Result<(), A::Error> {
        let Fill(d, part) = self;
        let (fields, acts) = match part {
            Part::Root => (ROOT_FIELDS, ROOT_ACTS),
            Part::Conditions => (CONDITIONS_FIELDS, CONDITIONS_ACTS),
            Part::Window => (WINDOW_FIELDS, WINDOW_ACTS),
            Part::Response => (RESPONSE_FIELDS, RESPONSE_ACTS),
            Part::Input(_) | Part::Required(_) => (TABLE_FIELDS, TABLE_ACTS),
        };
        // One loop for every object of a definition: a field's position in its list says what
        // it is (so each kind of value is read at one place). A table's fields collect here.
        let (mut wavelengths, mut values, mut unit) = (None, None, None);
        let (mut ends, mut quantity) = (Ends::Reject, Quantity::Energy);
        while let Some(key) = m.next_key::<alloc::string::String>()? {
            let Some(at) = fields.iter().position(|f| *f == key.as_str()) else {
                return Err(de::Error::unknown_field(&key, fields));
            };
            match acts[at] {
                Field::C2 => d.c2 = m.next_value::<Option<C2Convention>>()?.unwrap_or_default(),
                Field::Object(p) => m.next_value_seed(Fill(&mut *d, p))?,
                Field::Temperature(i) => d.temps[i] = m.next_value()?,
                Field::Wavelengths => wavelengths = Some(m.next_value()?),
                Field::Values => values = Some(m.next_value()?),
                Field::Unit => unit = Some(m.next_value()?),
                Field::Ends => ends = m.next_value()?,
                Field::Quantity => quantity = m.next_value()?,
            }
        }
        let table_at = match part {
            Part::Root if matches!(d.inputs[RESP], InputDef::Absent) => {
                return Err(de::Error::missing_field("response"))
            }
            Part::Window if matches!(d.inputs[WIN_T], InputDef::Absent) => {
                return Err(de::Error::missing_field("transmittance"))
            }
            Part::Window if d.temps[T_WIN].is_none() => {
                return Err(de::Error::missing_field("temperatureK"))
            }
            Part::Window => {
                d.window = true;
                return Ok(());
            }
            Part::Response => RESP,
            Part::Input(i) | Part::Required(i) => i,
            _ => return Ok(()),
        };
        let t = TableDef {
            wavelengths: wavelengths.ok_or_else(|| de::Error::missing_field("wavelengths"))?,
            values: values.ok_or_else(|| de::Error::missing_field("values"))?,
            unit: unit.ok_or_else(|| de::Error::missing_field("unit"))?,
            ends,
            quantity,
        };
        if let Some(slot) = d.inputs.get_mut(table_at) {
            *slot = InputDef::Table(t);
        }
        Ok(())
    }
}

impl<'de> Deserialize<'de> for Definition {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        let mut def = Definition::default();
        Fill(&mut def, Part::Root).deserialize(d)?;
        Ok(def)
    }
}

// ---------------------------------------------------------------------------------------------
// Checked, owned inputs.

/// Where a table lives in the definition (for error messages).
struct Slot {
    at: &'static str,
    wavelengths: &'static str,
    values: &'static str,
}

/// A slot's three paths from its path (`.wavelengths` and `.values` appended at compile time).
macro_rules! slot {
    ($at:literal) => {
        Slot {
            at: $at,
            wavelengths: concat!($at, ".wavelengths"),
            values: concat!($at, ".values"),
        }
    };
}

const RESPONSE: Slot = slot!("definition.response");
const EMISSIVITY: Slot = slot!("definition.conditions.emissivity");
const REFLECTANCE: Slot = slot!("definition.conditions.reflectance");
const PATH: Slot = slot!("definition.conditions.pathTransmittance");
const WINDOW_T: Slot = slot!("definition.conditions.window.transmittance");
const WINDOW_R: Slot = slot!("definition.conditions.window.reflectance");
const TEXT: Slot = Slot {
    at: "text",
    wavelengths: "wavelengths",
    values: "values",
};

/// A table error with the table's argument names of `s`.
fn rename(e: Error, s: &Slot) -> Error {
    match e {
        Error::InvalidTableEntry {
            arg,
            index,
            value,
            range,
        } => Error::InvalidTableEntry {
            arg: if arg.ends_with("values") {
                s.values
            } else {
                s.wavelengths
            },
            index,
            value,
            range,
        },
        Error::NotIncreasing { index, .. } => Error::NotIncreasing {
            arg: s.wavelengths,
            index,
        },
        Error::NonPositive { value, .. } => Error::NonPositive {
            arg: s.values,
            value,
        },
        other => other,
    }
}

/// A checked table of `kind` from wavelengths in `unit` (a wavelength unit) and values.
#[inline(never)]
fn table(
    mut wl: Vec<f64>,
    values: Vec<f64>,
    unit: SpectralUnit,
    kind: TableKind,
    s: &Slot,
) -> Result<SpectralTableBuf, Fail> {
    if unit.kind() != SpectralKind::Wavelength {
        return Err(Fail::Binding(
            "UNSUPPORTED",
            format!(
                "{}.unit must be a wavelength unit (\"m\", \"mm\", \"um\", \"nm\"; got \"{}\"): \
                 read tables in wavenumber, frequency or photon-energy units with \
                 SpectralInstrument.tableFromText",
                s.at,
                unit.name()
            ),
        ));
    }
    if wl.len() != values.len() {
        return Err(Fail::Binding(
            "LENGTH_MISMATCH",
            format!(
                "{}: one value per wavelength is needed ({} wavelengths, {} values)",
                s.at,
                wl.len(),
                values.len()
            ),
        ));
    }
    if wl.len() < 2 {
        return Err(Fail::Binding(
            "TOO_FEW_POINTS",
            format!("{} needs at least 2 points (got {})", s.at, wl.len()),
        ));
    }
    for (i, w) in wl.iter_mut().enumerate() {
        // A bad wavelength stays as given: the table check names it with its index.
        if *w > 0.0 && *w < f64::INFINITY {
            let given = *w;
            *w = unit
                .to_si(s.wavelengths, given)
                .map_err(|_| Error::InvalidTableEntry {
                    arg: s.wavelengths,
                    index: i,
                    value: given,
                    range: "(0, inf)",
                })?;
        }
    }
    SpectralTableBuf::new(kind, wl, values).map_err(|e| Fail::from(rename(e, s)))
}

/// An optical input, owned.
enum Input {
    Constant(f64),
    Table(SpectralTableBuf),
}

impl Input {
    fn of(d: InputDef, kind: TableKind, s: &Slot, default: f64) -> Result<Input, Fail> {
        Ok(match d {
            InputDef::Absent => Input::Constant(default),
            InputDef::Constant(c) => Input::Constant(c),
            InputDef::Table(t) => {
                Input::Table(table(t.wavelengths, t.values, t.unit, kind, s)?.with_ends(t.ends))
            }
        })
    }
    fn view(&self) -> SpectralValue<'_> {
        match self {
            Input::Constant(c) => SpectralValue::Constant(*c),
            Input::Table(t) => SpectralValue::Table(t.as_table()),
        }
    }
    fn is(&self, c: f64) -> bool {
        matches!(self, Input::Constant(v) if *v == c)
    }
}

struct WindowInput {
    transmittance: Input,
    reflectance: Input,
    temperature_k: f64,
    reflected_temperature_k: f64,
}

/// A temperature left out where its term has weight (UNSUPPORTED, as for grey conditions).
fn required(field: &str, when: &str) -> Fail {
    Fail::Binding(
        "UNSUPPORTED",
        format!("definition.conditions.{field} is required when {when}"),
    )
}

/// Temperature of a term that has no weight (as `Conditions::BLACKBODY`).
const UNUSED_K: f64 = 293.15;

/// A checked spectral instrument and its conditions, owning the tables.
#[wasm_bindgen(js_name = QbSpectral)]
pub struct SpectralHandle {
    response: SpectralTableBuf,
    c2: C2Convention,
    emissivity: Input,
    reflectance: Option<Input>,
    reflected_temperature_k: f64,
    path_transmittance: Input,
    path_temperature_k: f64,
    window: Option<WindowInput>,
    _live: Live,
}

impl SpectralHandle {
    #[inline(never)]
    fn build(mut d: Definition) -> Result<SpectralHandle, Fail> {
        let mut take = |i: usize| core::mem::take(&mut d.inputs[i]);
        // (the reader requires a response table)
        let InputDef::Table(r) = take(RESP) else {
            return Err(Fail::from(Error::Unsupported {
                what: "definition.response",
            }));
        };
        let kind = match r.quantity {
            Quantity::Energy => TableKind::EnergyResponse,
            Quantity::Photon => TableKind::PhotonResponse,
        };
        let response = table(r.wavelengths, r.values, r.unit, kind, &RESPONSE)?;
        let emissivity = Input::of(take(EPS), TableKind::Emissivity, &EMISSIVITY, 1.0)?;
        let reflectance = match take(REFL) {
            InputDef::Absent => None,
            r => Some(Input::of(r, TableKind::Reflectance, &REFLECTANCE, 0.0)?),
        };
        let path_transmittance = Input::of(take(PATH_T), TableKind::Transmittance, &PATH, 1.0)?;
        let window = if d.window {
            let transmittance = Input::of(take(WIN_T), TableKind::Transmittance, &WINDOW_T, 1.0)?;
            let reflectance = Input::of(take(WIN_R), TableKind::Reflectance, &WINDOW_R, 0.0)?;
            let temperature_k = d.temps[T_WIN].unwrap_or(UNUSED_K);
            let reflected_temperature_k = match d.temps[T_WIN_REFL] {
                Some(t) => t,
                None if reflectance.is(0.0) => temperature_k,
                None => {
                    return Err(required(
                        "window.reflectedTemperatureK",
                        "window.reflectance is not 0",
                    ))
                }
            };
            Some(WindowInput {
                transmittance,
                reflectance,
                temperature_k,
                reflected_temperature_k,
            })
        } else {
            None
        };
        let reflects = match &reflectance {
            None => !emissivity.is(1.0),
            Some(r) => !r.is(0.0),
        };
        let reflected_temperature_k =
            match d.temps[T_REFL] {
                Some(t) => t,
                None if !reflects => UNUSED_K,
                None => return Err(required(
                    "reflectedTemperatureK",
                    "the target reflects (emissivity other than 1, or a reflectance other than 0)",
                )),
            };
        let path_temperature_k = match d.temps[T_PATH] {
            Some(t) => t,
            None if path_transmittance.is(1.0) => UNUSED_K,
            None => return Err(required("pathTemperatureK", "pathTransmittance is not 1")),
        };
        let h = SpectralHandle {
            response,
            c2: d.c2,
            emissivity,
            reflectance,
            reflected_temperature_k,
            path_transmittance,
            path_temperature_k,
            window,
            _live: Live::new(),
        };
        h.run(|inst, cond| cond.validate_for(inst))
            .map_err(in_config("definition.conditions"))?;
        Ok(h)
    }

    /// `f` with the instrument and the conditions as the core's borrowed views.
    fn run<R>(
        &self,
        f: impl FnOnce(&SpectralInstrument<'_>, &SpectralConditions<'_>) -> crate::Result<R>,
    ) -> crate::Result<R> {
        let (inst, cond) = self.views()?;
        f(&inst, &cond)
    }

    /// The instrument and the conditions as the core's borrowed views (out of line: every
    /// method needs them).
    #[inline(never)]
    fn views(&self) -> crate::Result<(SpectralInstrument<'_>, SpectralConditions<'_>)> {
        let inst = SpectralInstrument::new(self.response.as_table(), self.c2)?;
        let cond = SpectralConditions {
            emissivity: self.emissivity.view(),
            reflectance: self.reflectance.as_ref().map(Input::view),
            reflected_temperature_k: self.reflected_temperature_k,
            path_transmittance: self.path_transmittance.view(),
            path_temperature_k: self.path_temperature_k,
            window: self.window.as_ref().map(|w| SpectralWindow {
                transmittance: w.transmittance.view(),
                reflectance: w.reflectance.view(),
                temperature_k: w.temperature_k,
                reflected_temperature_k: w.reflected_temperature_k,
            }),
        };
        Ok((inst, cond))
    }
}

#[wasm_bindgen(js_class = QbSpectral)]
impl SpectralHandle {
    /// Reads and checks a definition `{ response, conditions?, c2? }` (plain-data copy).
    pub fn create(definition: JsValue) -> Option<SpectralHandle> {
        some(read::<Definition>(definition, "definition").and_then(Self::build))
    }

    /// The methods on one number `x`, by `op`: 0 blackbody signal ∫R·L(T) dλ (no conditions;
    /// x = T), 1 measured signal (x = object temperature), 2 object temperature (x = signal),
    /// 3 the five terms and their sum (signal, object, reflected, path, window reflected,
    /// window emitted), 4 the band-effective values (in the order of the core's
    /// `BandEffective` fields), 5 the sensitivities (in the order of the core's
    /// `SpectralSensitivities` fields). 3–5 go to f64 scratch buffer 0 (see [`out`]) and
    /// return their count. NaN with the error stored. (One export instead of six: smaller.)
    pub fn number(&self, op: u32, x: f64) -> f64 {
        number(self.number_op(op, x))
    }
    /// Bulk forms over f64 scratch buffer 0: 0 measured signals, 1 object temperatures.
    pub fn bulk(&self, op: u32) -> f64 {
        status(self.run_bulk(op))
    }

    /// The reading workflows with this instrument (see [`workflow`]).
    #[wasm_bindgen(js_name = readingWorkflow)]
    pub fn reading_workflow(
        &self,
        op: u32,
        a: f64,
        b: f64,
        c: f64,
        d: f64,
        setting: JsValue,
    ) -> f64 {
        number((|| {
            let s = setting_of(setting)?;
            Ok(self.run(|inst, cond| {
                if op == CORRECT {
                    correct_reading_spectral(inst, a, &s, cond)
                } else {
                    workflow(inst, op, [a, b, c, d], &s)
                }
            })?)
        })())
    }
}

impl SpectralHandle {
    /// [`SpectralHandle::number`].
    fn number_op(&self, op: u32, x: f64) -> Result<f64, Fail> {
        let arg = match op {
            0 | 4 => "temperatureK",
            1 | 3 => "objectTemperatureK",
            _ => "signal",
        };
        let (inst, c) = self.views()?;
        Ok(eval(&inst, &c, op, x, arg)?)
    }

    /// Bulk forms over f64 scratch buffer 0 (ops 1 and 2 of [`eval`] element by element).
    #[inline(never)]
    fn run_bulk(&self, op: u32) -> Result<(), Fail> {
        let (inst, c) = self.views()?;
        let (op, arg) = if op == 0 {
            (1, "objectTemperaturesK")
        } else {
            (2, "signals")
        };
        map_in_place(|x| eval(&inst, &c, op, x, arg))
    }
}

/// One evaluation of [`SpectralHandle::number`]'s `op` with the core's views; `arg` names `x`
/// in errors. Ops 3–5 write to f64 scratch buffer 0 (not for bulk use).
fn eval(
    inst: &SpectralInstrument<'_>,
    c: &SpectralConditions<'_>,
    op: u32,
    x: f64,
    arg: &'static str,
) -> crate::Result<f64> {
    if op == 2 || op == 5 {
        check::finite(arg, x)?;
    } else {
        check::temperature(arg, x)?;
    }
    Ok(match op {
        0 => spectral_signal_terms(inst, x, &SpectralConditions::BLACKBODY)?.signal,
        1 => spectral_signal_terms(inst, x, c)?.signal,
        2 => spectral_object_temperature(inst, x, c)?,
        3 => {
            let r = spectral_signal_terms(inst, x, c)?;
            out(&[
                r.signal,
                r.object,
                r.reflected,
                r.path,
                r.window_reflected,
                r.window_emitted,
            ])
        }
        4 => {
            let e = band_effective(inst, x, c)?;
            out(&[
                e.temperature_k,
                e.emissivity,
                e.reflectance,
                e.path_transmittance,
                e.window_transmittance,
                e.window_reflectance,
                e.object_gain,
            ])
        }
        _ => {
            let s = spectral_sensitivities(inst, x, c)?;
            out(&[
                s.temperature_k,
                s.signal,
                s.emissivity_scale,
                s.reflectance_scale,
                s.path_transmittance_scale,
                s.window_transmittance_scale,
                s.window_reflectance_scale,
                s.response_scale,
                s.reflected_temperature,
                s.path_temperature,
                s.window_temperature,
                s.window_reflected_temperature,
            ])
        }
    })
}

// ---------------------------------------------------------------------------------------------
// Text tables.

/// Reads a two-column text table (`kind`: 0 emissivity, 1 reflectance, 2 transmittance,
/// 3 response), the spectral coordinate in `unit`, with the core's reader
/// (`SpectralTableBuf::from_text_with`). The facade has converted every number-like token of
/// `text` already (JavaScript's correctly rounded `Number`, so the module links no second
/// decimal parser): f64 scratch buffer 0 holds their values, buffer 1 their UTF-8 byte offsets
/// in `text` (increasing) and buffer 2 their byte lengths; a field is a number when a token
/// starts where it starts and is exactly as long. On success the wavelengths (m, increasing)
/// go to buffer 0 and the values to buffer 1, and their number is returned (NaN with the error
/// stored).
#[wasm_bindgen(js_name = spectralTableFromText)]
pub fn table_from_text(text: &str, unit: &str, kind: u32) -> f64 {
    number((|| {
        let unit = SpectralUnit::parse(unit)?;
        let kind = match kind {
            0 => TableKind::Emissivity,
            1 => TableKind::Reflectance,
            2 => TableKind::Transmittance,
            _ => TableKind::EnergyResponse,
        };
        let base = text.as_ptr() as usize;
        with_f64(|b| {
            let [values, offsets, lengths] = b;
            let token = |field: &str| -> Option<f64> {
                let at = (field.as_ptr() as usize).wrapping_sub(base) as f64;
                let i = offsets.partition_point(|&o| o < at);
                match (offsets.get(i), lengths.get(i), values.get(i)) {
                    (Some(&o), Some(&len), Some(&v)) if o == at && len == field.len() as f64 => {
                        Some(v)
                    }
                    _ => None,
                }
            };
            let t = SpectralTableBuf::from_text_with(kind, text, unit, &token).map_err(
                |e| match e {
                    Error::TooFewPoints { got, .. } => Fail::Binding(
                        "TOO_FEW_POINTS",
                        format!("text has {got} data line(s); a table needs at least 2"),
                    ),
                    e => Fail::from(rename(e, &TEXT)),
                },
            )?;
            let t = t.as_table();
            let (w, v) = (t.wavelengths_m(), t.values());
            values.clear();
            values.extend_from_slice(w);
            offsets.clear();
            offsets.extend_from_slice(v);
            Ok(w.len() as f64)
        })
    })())
}
