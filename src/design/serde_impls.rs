//! Hand-written `Deserialize` for the configuration types of a design ([`Optics`],
//! [`Conversion`], [`Detector`], [`SceneDefinition`], [`DesignDefinition`]): each reads its
//! object key by key through a few shared helpers, so that
//!
//! - an error in a field keeps its path (`detector.conversion.efficiency`): serde's derived
//!   internally-tagged enums buffer the whole object first (its private `Content`), which loses
//!   it;
//! - the WebAssembly package stays small: the derived visitors, with `Content` and a second
//!   instantiation of every nested type's deserializer, cost about 90 KB of module; these cost a
//!   few KB.
//!
//! The accepted JSON is the derived form's: camelCase fields, `"kind"` tags, unknown fields
//! (and fields of another kind) rejected, defaults as documented on each type.

use alloc::string::String;
use core::fmt;

use serde::de::{self, DeserializeSeed, IgnoredAny, MapAccess, Visitor};
use serde::{Deserialize, Deserializer};

use super::definition::{DesignDefinition, SceneDefinition};
use super::detector::{Conversion, Detector};
use super::scene::RadianceKind;
use super::throughput::{ConeForm, Optics};
use crate::constants::C2Convention;
use crate::definition::InstrumentModel;
use crate::units::SpectralUnit;

/// What a [`Seed`] reads: a string that must be one of the listed names (read as its index), or
/// one of the configuration objects.
#[derive(Clone, Copy)]
enum Which {
    Tag(&'static [&'static str]),
    Optics,
    Conversion,
    Detector,
    Scene,
    Design,
}

/// A value read by a [`Seed`].
enum Part {
    Tag(usize),
    Optics(Optics),
    Conversion(Conversion),
    Detector(Detector),
    Scene(SceneDefinition),
    Design(DesignDefinition),
}

/// The one seed (and visitor) through which every configuration object and name of a design is
/// read: one instantiation of the deserializer's value path serves all of them.
#[derive(Clone, Copy)]
struct Seed(Which);

impl<'de> DeserializeSeed<'de> for Seed {
    type Value = Part;
    fn deserialize<D: Deserializer<'de>>(self, d: D) -> Result<Part, D::Error> {
        match self.0 {
            Which::Tag(_) => d.deserialize_str(self),
            _ => d.deserialize_map(self),
        }
    }
}

impl<'de> Visitor<'de> for Seed {
    type Value = Part;
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self.0 {
            Which::Tag(_) => "a string",
            _ => "an object",
        })
    }
    fn visit_str<E: de::Error>(self, v: &str) -> Result<Part, E> {
        match self.0 {
            Which::Tag(names) => names
                .iter()
                .position(|k| *k == v)
                .map(Part::Tag)
                .ok_or_else(|| E::unknown_variant(v, names)),
            _ => Err(E::invalid_type(de::Unexpected::Str(v), &self)),
        }
    }
    fn visit_map<A: MapAccess<'de>>(self, map: A) -> Result<Part, A::Error> {
        match self.0 {
            Which::Tag(_) => Err(de::Error::invalid_type(de::Unexpected::Map, &self)),
            Which::Optics => optics(map).map(Part::Optics),
            Which::Conversion => conversion(map).map(Part::Conversion),
            Which::Detector => detector(map).map(Part::Detector),
            Which::Scene => scene(map).map(Part::Scene),
            Which::Design => design(map).map(Part::Design),
        }
    }
}

/// Reads the next value of `map` through the seed for `which` into `slot` (once).
#[inline(never)]
fn part<'de, A: MapAccess<'de>>(
    map: &mut A,
    slot: &mut Option<Part>,
    name: &'static str,
    which: Which,
) -> Result<(), A::Error> {
    if slot.is_some() {
        return Err(de::Error::duplicate_field(name));
    }
    *slot = Some(map.next_value_seed(Seed(which))?);
    Ok(())
}

/// The handler of [`read_fields`] for the keys that are not numbers.
type Other<'f, 'de, A> = dyn FnMut(&mut A, usize) -> Result<(), <A as MapAccess<'de>>::Error> + 'f;

/// Reads every key of `map`: a key named in `numbers` is read as a number into the slot of the
/// same index (once); a key named in `others` is handed to `other(map, index)`; any other key is
/// skipped, and the first such key is returned (for the unknown-field error). One loop for every
/// object type (the callback is dynamic, so it is not duplicated per type).
#[inline(never)]
fn read_fields<'de, A: MapAccess<'de>>(
    map: &mut A,
    numbers: &[&'static str],
    slots: &mut [Option<f64>],
    others: &[&'static str],
    other: &mut Other<'_, 'de, A>,
) -> Result<Option<String>, A::Error> {
    let mut stray = None;
    while let Some(k) = map.next_key::<String>()? {
        if let Some(i) = numbers.iter().position(|n| *n == k) {
            match slots.get_mut(i) {
                Some(slot @ None) => *slot = Some(map.next_value::<f64>()?),
                _ => return Err(de::Error::duplicate_field(numbers[i])),
            }
        } else if let Some(i) = others.iter().position(|n| *n == k) {
            other(map, i)?;
        } else {
            map.next_value::<IgnoredAny>()?;
            stray.get_or_insert(k);
        }
    }
    Ok(stray)
}

/// Reads the next value of `map` as one of `options` into `slot` (its index, once).
#[inline(never)]
fn tag<'de, A: MapAccess<'de>>(
    map: &mut A,
    slot: &mut Option<usize>,
    name: &'static str,
    options: &'static [&'static str],
) -> Result<(), A::Error> {
    if slot.is_some() {
        return Err(de::Error::duplicate_field(name));
    }
    if let Part::Tag(i) = map.next_value_seed(Seed(Which::Tag(options)))? {
        *slot = Some(i);
    }
    Ok(())
}

/// Reads the next value of `map` as a `T` into `slot` (once).
fn take<'de, A: MapAccess<'de>, T: Deserialize<'de>>(
    map: &mut A,
    slot: &mut Option<T>,
    name: &'static str,
) -> Result<(), A::Error> {
    if slot.is_some() {
        return Err(de::Error::duplicate_field(name));
    }
    *slot = Some(map.next_value()?);
    Ok(())
}

/// An unknown-field error for the first unknown key, or for the first of the `present` keys
/// that `accepted` does not list (a field of another kind).
fn check_fields<E: de::Error>(
    stray: &Option<String>,
    present: &[(&'static str, bool)],
    accepted: &'static [&'static str],
) -> Result<(), E> {
    if let Some(k) = stray {
        return Err(E::unknown_field(k, accepted));
    }
    match present
        .iter()
        .find(|(n, here)| *here && !accepted.contains(n))
    {
        Some((name, _)) => Err(E::unknown_field(name, accepted)),
        None => Ok(()),
    }
}

fn required<T, E: de::Error>(v: Option<T>, name: &'static str) -> Result<T, E> {
    v.ok_or_else(|| E::missing_field(name))
}

/// `Deserialize` through the [`Seed`] for one kind of object.
macro_rules! from_seed {
    ($ty:ident) => {
        impl<'de> Deserialize<'de> for $ty {
            fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
                match Seed(Which::$ty).deserialize(d)? {
                    Part::$ty(v) => Ok(v),
                    _ => Err(de::Error::custom("internal: wrong configuration part")),
                }
            }
        }
    };
}

/// The object of kind `$v` in `slot`, or the missing-field error for `$name`.
macro_rules! got {
    ($slot:expr, $v:ident, $name:literal) => {
        match $slot {
            Some(Part::$v(x)) => x,
            _ => return Err(de::Error::missing_field($name)),
        }
    };
}

// ---- optics ---------------------------------------------------------------------------------

const OPTICS_FIELDS: &[&str] = &["fNumber", "transmittance", "fieldAngleRad", "cone"];
const CONES: &[&str] = &["exact", "smallAngle"];

fn optics<'de, A: MapAccess<'de>>(mut map: A) -> Result<Optics, A::Error> {
    let mut v = [None; 3];
    let mut cone = None;
    let stray = read_fields(
        &mut map,
        &OPTICS_FIELDS[..3],
        &mut v,
        &["cone"],
        &mut |m, _| tag(m, &mut cone, "cone", CONES),
    )?;
    check_fields(&stray, &[], OPTICS_FIELDS)?;
    Ok(Optics {
        f_number: required(v[0], "fNumber")?,
        transmittance: required(v[1], "transmittance")?,
        cone: if cone == Some(1) {
            ConeForm::SmallAngle
        } else {
            ConeForm::Exact
        },
        field_angle_rad: v[2].unwrap_or(0.0),
    })
}

from_seed!(Optics);

// ---- conversion -----------------------------------------------------------------------------

const CONVERSION_KINDS: &[&str] = &["responsivity", "quantumEfficiency", "included"];
const CONVERSION_NUMBERS: &[&str] = &["amperesPerWatt", "efficiency"];
const CONVERSION_FIELDS: [&[&str]; 3] = [
    &["kind", "amperesPerWatt"],
    &["kind", "efficiency"],
    &["kind"],
];

fn conversion<'de, A: MapAccess<'de>>(mut map: A) -> Result<Conversion, A::Error> {
    let mut v = [None; 2];
    let mut kind = None;
    let stray = read_fields(
        &mut map,
        CONVERSION_NUMBERS,
        &mut v,
        &["kind"],
        &mut |m, _| tag(m, &mut kind, "kind", CONVERSION_KINDS),
    )?;
    let kind = required(kind, "kind")?;
    check_fields(
        &stray,
        &[
            ("amperesPerWatt", v[0].is_some()),
            ("efficiency", v[1].is_some()),
        ],
        CONVERSION_FIELDS[kind.min(2)],
    )?;
    Ok(match kind {
        0 => Conversion::Responsivity {
            amperes_per_watt: required(v[0], "amperesPerWatt")?,
        },
        1 => Conversion::QuantumEfficiency {
            efficiency: required(v[1], "efficiency")?,
        },
        _ => Conversion::Included,
    })
}

from_seed!(Conversion);

// ---- detector -------------------------------------------------------------------------------

const DETECTOR_FIELDS: &[&str] = &[
    "pixelAreaM2",
    "integrationTimeS",
    "fullWellElectrons",
    "darkCurrentA",
    "readNoiseElectrons",
    "conversion",
];

fn detector<'de, A: MapAccess<'de>>(mut map: A) -> Result<Detector, A::Error> {
    let mut v = [None; 5];
    let mut conv = None;
    let stray = read_fields(
        &mut map,
        &DETECTOR_FIELDS[..5],
        &mut v,
        &["conversion"],
        &mut |m, _| part(m, &mut conv, "conversion", Which::Conversion),
    )?;
    check_fields(&stray, &[], DETECTOR_FIELDS)?;
    let mut x = [0.0; 5];
    for (i, (out, slot)) in x.iter_mut().zip(v).enumerate() {
        *out = required(slot, DETECTOR_FIELDS[i])?;
    }
    Ok(Detector {
        pixel_area_m2: x[0],
        conversion: got!(conv, Conversion, "conversion"),
        integration_time_s: x[1],
        full_well_electrons: x[2],
        dark_current_a: x[3],
        read_noise_electrons: x[4],
    })
}

from_seed!(Detector);

// ---- scene ----------------------------------------------------------------------------------

const SCENE_KINDS: &[&str] = &["band", "model"];
const SCENE_NUMBERS: &[&str] = &["lower", "upper", "emissivity"];
const SCENE_OTHERS: &[&str] = &["kind", "unit", "c2", "model", "radianceKind"];
const SCENE_FIELDS: [&[&str]; 2] = [
    &["kind", "lower", "upper", "unit", "emissivity", "c2"],
    &["kind", "model", "radianceKind"],
];
const RADIANCE_KINDS: &[&str] = &["energy", "photon", "current", "electron"];

fn scene<'de, A: MapAccess<'de>>(mut map: A) -> Result<SceneDefinition, A::Error> {
    let mut v = [None; 3];
    let (mut kind, mut radiance_kind) = (None, None);
    let mut unit: Option<SpectralUnit> = None;
    let mut c2: Option<C2Convention> = None;
    let mut model: Option<InstrumentModel> = None;
    let stray = read_fields(
        &mut map,
        SCENE_NUMBERS,
        &mut v,
        SCENE_OTHERS,
        &mut |m, i| match i {
            0 => tag(m, &mut kind, "kind", SCENE_KINDS),
            1 => take(m, &mut unit, "unit"),
            2 => take(m, &mut c2, "c2"),
            3 => take(m, &mut model, "model"),
            _ => tag(m, &mut radiance_kind, "radianceKind", RADIANCE_KINDS),
        },
    )?;
    let kind = required(kind, "kind")?;
    check_fields(
        &stray,
        &[
            ("lower", v[0].is_some()),
            ("upper", v[1].is_some()),
            ("emissivity", v[2].is_some()),
            ("unit", unit.is_some()),
            ("c2", c2.is_some()),
            ("model", model.is_some()),
            ("radianceKind", radiance_kind.is_some()),
        ],
        SCENE_FIELDS[kind.min(1)],
    )?;
    if kind == 0 {
        return Ok(SceneDefinition::Band {
            lower: required(v[0], "lower")?,
            upper: required(v[1], "upper")?,
            unit: required(unit, "unit")?,
            emissivity: v[2].unwrap_or(1.0),
            c2: c2.unwrap_or_default(),
        });
    }
    Ok(SceneDefinition::Model {
        model: required(model, "model")?,
        radiance_kind: match required(radiance_kind, "radianceKind")? {
            0 => RadianceKind::Energy,
            1 => RadianceKind::Photon,
            2 => RadianceKind::Current,
            _ => RadianceKind::Electron,
        },
    })
}

impl<'de> Deserialize<'de> for SceneDefinition {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        match Seed(Which::Scene).deserialize(d)? {
            Part::Scene(v) => Ok(v),
            _ => Err(de::Error::custom("internal: wrong configuration part")),
        }
    }
}

// ---- design ---------------------------------------------------------------------------------

const DESIGN_FIELDS: &[&str] = &["backgroundElectronsPerS", "optics", "detector", "scene"];

fn design<'de, A: MapAccess<'de>>(mut map: A) -> Result<DesignDefinition, A::Error> {
    let mut v = [None; 1];
    let (mut o, mut d, mut s) = (None, None, None);
    let stray = read_fields(
        &mut map,
        &DESIGN_FIELDS[..1],
        &mut v,
        &DESIGN_FIELDS[1..],
        &mut |m, i| match i {
            0 => part(m, &mut o, "optics", Which::Optics),
            1 => part(m, &mut d, "detector", Which::Detector),
            _ => part(m, &mut s, "scene", Which::Scene),
        },
    )?;
    check_fields(&stray, &[], DESIGN_FIELDS)?;
    Ok(DesignDefinition {
        optics: got!(o, Optics, "optics"),
        detector: got!(d, Detector, "detector"),
        scene: got!(s, Scene, "scene"),
        background_electrons_per_s: v[0].unwrap_or(0.0),
    })
}

impl<'de> Deserialize<'de> for DesignDefinition {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        match Seed(Which::Design).deserialize(d)? {
            Part::Design(v) => Ok(v),
            _ => Err(de::Error::custom("internal: wrong configuration part")),
        }
    }
}
