//! Hand-written serde impls: units by name (every accepted spelling in, the canonical name out),
//! Sakuma–Hattori curves through their checked constructor, and the instrument model's tagged
//! enum read key by key, so that an error in a field keeps its path (`model.wavelength`), which
//! serde's buffered internally-tagged enums lose.

use core::fmt;

use serde::de::{self, IgnoredAny, MapAccess, Visitor};
use serde::ser::SerializeStruct;
use serde::{Deserialize, Deserializer, Serialize, Serializer};

use super::{InstrumentModel, ResponseTable};
use crate::constants::C2Convention;
use crate::thermometry::SakumaHattori;
use crate::units::{SpectralUnit, SPECTRAL_NAMES};
use alloc::vec::Vec;

impl Serialize for SpectralUnit {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(self.name())
    }
}

struct UnitVisitor;

impl Visitor<'_> for UnitVisitor {
    type Value = SpectralUnit;
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(SPECTRAL_NAMES)
    }
    fn visit_str<E: de::Error>(self, v: &str) -> Result<SpectralUnit, E> {
        SpectralUnit::parse(v).map_err(|_| E::invalid_value(de::Unexpected::Str(v), &self))
    }
}

impl<'de> Deserialize<'de> for SpectralUnit {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_str(UnitVisitor)
    }
}

/// The serialized fields of a Sakuma–Hattori curve.
#[derive(Serialize, Deserialize)]
#[serde(rename_all = "camelCase", deny_unknown_fields)]
struct CurveFields {
    a_m: f64,
    #[serde(rename = "bMK")]
    b_mk: f64,
    c: f64,
    #[serde(default)]
    c2: C2Convention,
}

/// The convention whose value is `c2_mk` (a curve is only ever built from a convention).
fn convention(c2_mk: f64) -> C2Convention {
    if c2_mk == C2Convention::Its90.c2() {
        C2Convention::Its90
    } else {
        C2Convention::Codata2018
    }
}

impl Serialize for SakumaHattori {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        let mut st = s.serialize_struct("SakumaHattori", 4)?;
        st.serialize_field("aM", &self.a_m())?;
        st.serialize_field("bMK", &self.b_mk())?;
        st.serialize_field("c", &self.c())?;
        st.serialize_field("c2", &convention(self.c2_mk()))?;
        st.end()
    }
}

impl<'de> Deserialize<'de> for SakumaHattori {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        let f = CurveFields::deserialize(d)?;
        SakumaHattori::new(f.a_m, f.b_mk, f.c, f.c2).map_err(de::Error::custom)
    }
}

const KINDS: &[&str] = &["spectralPoint", "response", "sakumaHattori"];
const POINT_FIELDS: &[&str] = &["kind", "wavelength", "unit", "c2"];
const RESPONSE_FIELDS: &[&str] = &["kind", "wavelengths", "values", "unit", "c2"];
const CURVE_FIELDS: &[&str] = &["kind", "aM", "bMK", "c", "c2"];

#[derive(Clone, Copy, PartialEq)]
enum Kind {
    Point,
    Response,
    Curve,
}

impl<'de> Deserialize<'de> for Kind {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl Visitor<'_> for V {
            type Value = Kind;
            fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
                f.write_str("a model kind")
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<Kind, E> {
                match v {
                    "spectralPoint" => Ok(Kind::Point),
                    "response" => Ok(Kind::Response),
                    "sakumaHattori" => Ok(Kind::Curve),
                    _ => Err(E::unknown_variant(v, KINDS)),
                }
            }
        }
        d.deserialize_str(V)
    }
}

/// Every value an instrument model can hold, read key by key.
#[derive(Default)]
struct Fields {
    kind: Option<Kind>,
    wavelength: Option<f64>,
    unit: Option<SpectralUnit>,
    c2: Option<C2Convention>,
    wavelengths: Option<Vec<f64>>,
    values: Option<Vec<f64>>,
    a_m: Option<f64>,
    b_mk: Option<f64>,
    c: Option<f64>,
    /// The first key that no kind has, or that the model's kind does not have.
    stray: Option<alloc::string::String>,
}

struct ModelVisitor;

impl<'de> Visitor<'de> for ModelVisitor {
    type Value = InstrumentModel;
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("an instrument model object with a \"kind\"")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<InstrumentModel, A::Error> {
        let mut f = Fields::default();
        while let Some(key) = map.next_key::<alloc::string::String>()? {
            macro_rules! take {
                ($slot:ident, $name:literal) => {{
                    if f.$slot.is_some() {
                        return Err(de::Error::duplicate_field($name));
                    }
                    f.$slot = Some(map.next_value()?);
                }};
            }
            match key.as_str() {
                "kind" => take!(kind, "kind"),
                "wavelength" => take!(wavelength, "wavelength"),
                "unit" => take!(unit, "unit"),
                "c2" => take!(c2, "c2"),
                "wavelengths" => take!(wavelengths, "wavelengths"),
                "values" => take!(values, "values"),
                "aM" => take!(a_m, "aM"),
                "bMK" => take!(b_mk, "bMK"),
                "c" => take!(c, "c"),
                _ => {
                    map.next_value::<IgnoredAny>()?;
                    if f.stray.is_none() {
                        f.stray = Some(key);
                    }
                }
            }
        }
        let kind = f.kind.ok_or_else(|| de::Error::missing_field("kind"))?;
        let accepted: &'static [&'static str] = match kind {
            Kind::Point => POINT_FIELDS,
            Kind::Response => RESPONSE_FIELDS,
            Kind::Curve => CURVE_FIELDS,
        };
        if let Some(k) = &f.stray {
            return Err(de::Error::unknown_field(k, accepted));
        }
        // a key that belongs to another kind
        let present = [
            ("wavelength", f.wavelength.is_some()),
            ("unit", f.unit.is_some()),
            ("wavelengths", f.wavelengths.is_some()),
            ("values", f.values.is_some()),
            ("aM", f.a_m.is_some()),
            ("bMK", f.b_mk.is_some()),
            ("c", f.c.is_some()),
        ];
        if let Some((name, _)) = present
            .iter()
            .find(|(n, here)| *here && !accepted.contains(n))
        {
            return Err(de::Error::unknown_field(name, accepted));
        }
        let c2 = f.c2.unwrap_or_default();
        Ok(match kind {
            Kind::Point => InstrumentModel::SpectralPoint {
                wavelength: f
                    .wavelength
                    .ok_or_else(|| de::Error::missing_field("wavelength"))?,
                unit: f.unit.ok_or_else(|| de::Error::missing_field("unit"))?,
                c2,
            },
            Kind::Response => InstrumentModel::Response(ResponseTable {
                wavelengths: f
                    .wavelengths
                    .ok_or_else(|| de::Error::missing_field("wavelengths"))?,
                values: f.values.ok_or_else(|| de::Error::missing_field("values"))?,
                unit: f.unit.ok_or_else(|| de::Error::missing_field("unit"))?,
                c2,
            }),
            Kind::Curve => InstrumentModel::SakumaHattori {
                a_m: f.a_m.ok_or_else(|| de::Error::missing_field("aM"))?,
                b_mk: f.b_mk.ok_or_else(|| de::Error::missing_field("bMK"))?,
                c: f.c.ok_or_else(|| de::Error::missing_field("c"))?,
                c2,
            },
        })
    }
}

impl<'de> Deserialize<'de> for InstrumentModel {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_map(ModelVisitor)
    }
}
