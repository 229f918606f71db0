//! The prepared spectrum (`Spectrum` in the facade, `src/wasm/js/spectrum.js`): settings read
//! and checked once ([`SpectrumSettings`]), then point, band, total and inverse methods on
//! plain numbers, and their bulk forms on the scratch buffers.
//!
//! Spectral coordinates are in the settings' `unit`; densities per the settings' density unit
//! (default: per `unit`); band integrals and totals in SI (W·m⁻²·sr⁻¹ and so on). Every method
//! checks its own arguments first, under their JavaScript names.

use alloc::string::{String, ToString};
use core::fmt;

use serde::de::{self, Deserializer, MapAccess, Visitor};
use serde::{Deserialize, Serialize};
use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, some, to_js, Fail};
use super::scratch::{map_in_place, status, with_f64};
use super::testing::Live;
use crate::band;
use crate::constants::C2Convention;
use crate::definition::SpectrumSettings;
use crate::error::{self as check, Error};
use crate::inverse;
use crate::planck::{Direct, Geometry, Quantity, SpectralVariable, Spectrum};
use crate::units::{convert_spectral_checked, SpectralKind, SpectralUnit};

/// The core's [`SpectrumSettings`] read by hand with `visit_map` (fields dispatched by their
/// position in one list, each kind of value read at one place): the derived reader carried a
/// field-name visitor and one inlined read per field (about 1.5 KB of the package, DEVELOPERS.md
/// size notes). Same fields, defaults and messages as the derived reader.
struct Settings(SpectrumSettings);

/// The fields of [`SpectrumSettings`] as JavaScript writes them (the derived reader's list).
const SETTINGS_FIELDS: &[&str] = &[
    "unit",
    "variable",
    "quantity",
    "geometry",
    "emissivity",
    "refractiveIndex",
    "c2",
    "densityUnit",
];

impl<'de> Deserialize<'de> for Settings {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> Visitor<'de> for V {
            type Value = Settings;
            fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
                f.write_str("struct SpectrumSettings")
            }
            fn visit_map<A: MapAccess<'de>>(self, mut m: A) -> Result<Settings, A::Error> {
                let mut unit = None;
                let mut s = SpectrumSettings {
                    unit: SpectralUnit::Metre, // (replaced below: `unit` is required)
                    variable: None,
                    quantity: Quantity::default(),
                    geometry: Geometry::default(),
                    emissivity: 1.0,
                    refractive_index: 1.0,
                    c2: C2Convention::default(),
                    density_unit: None,
                };
                while let Some(key) = m.next_key::<String>()? {
                    let Some(at) = SETTINGS_FIELDS.iter().position(|f| *f == key.as_str()) else {
                        return Err(de::Error::unknown_field(&key, SETTINGS_FIELDS));
                    };
                    match at {
                        0 => unit = Some(m.next_value::<SpectralUnit>()?),
                        1 => s.variable = m.next_value::<Option<SpectralVariable>>()?,
                        2 => s.quantity = m.next_value()?,
                        3 => s.geometry = m.next_value()?,
                        4 => s.emissivity = m.next_value()?,
                        5 => s.refractive_index = m.next_value()?,
                        6 => s.c2 = m.next_value()?,
                        _ => s.density_unit = m.next_value::<Option<SpectralUnit>>()?,
                    }
                }
                s.unit = unit.ok_or_else(|| de::Error::missing_field("unit"))?;
                Ok(Settings(s))
            }
        }
        d.deserialize_struct("SpectrumSettings", SETTINGS_FIELDS, V)
    }
}

/// A checked spectrum with its user units.
#[wasm_bindgen(js_name = QbSpectrum)]
pub struct SpectrumHandle {
    settings: SpectrumSettings,
    spectrum: Spectrum,
    /// Unit of coordinates.
    unit: SpectralUnit,
    /// SI unit of the variable.
    si: SpectralUnit,
    /// Density per SI unit × factor = density per the density unit.
    factor: f64,
    density_unit: SpectralUnit,
    /// The density's constants, prepared once (the point path).
    direct: Direct,
    _live: Live,
}

/// Result-unit labels of a spectrum (plain text).
#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct Units {
    coordinate: &'static str,
    density_per: &'static str,
    density: String,
    density_derivative: String,
    total: &'static str,
    total_derivative: String,
}

impl SpectrumHandle {
    /// A coordinate in the user's unit → SI (checked under the JS name `arg`).
    #[inline]
    fn to_si(&self, arg: &'static str, x: f64) -> crate::Result<f64> {
        if self.unit == self.si {
            check::spectral(arg, x)
        } else {
            convert_spectral_checked(arg, x, self.unit, self.si)
        }
    }

    /// Band limits in the user's unit → ordered SI limits (order checked in the user's unit,
    /// so INVALID_BAND reports what the caller passed; a reciprocal unit swaps them).
    fn band_si(&self, lower: f64, upper: f64) -> crate::Result<(f64, f64)> {
        check::band("lower", lower, "upper", upper)?;
        let a = self.to_si("lower", lower)?;
        let b = self.to_si("upper", upper)?;
        if a < b {
            Ok((a, b))
        } else if b < a {
            Ok((b, a))
        } else {
            Err(Error::InvalidBand { lower, upper })
        }
    }

    fn units(&self) -> Units {
        let base = match (self.spectrum.quantity, self.spectrum.geometry) {
            (Quantity::Energy, Geometry::Radiance) => "W m^-2 sr^-1",
            (Quantity::Energy, Geometry::Exitance) => "W m^-2",
            (Quantity::Photon, Geometry::Radiance) => "s^-1 m^-2 sr^-1",
            (Quantity::Photon, Geometry::Exitance) => "s^-1 m^-2",
        };
        let du = self.density_unit;
        let per = match (du.kind(), du) {
            (SpectralKind::Wavenumber, SpectralUnit::PerCentimetre) => "cm".to_string(),
            (SpectralKind::Wavenumber, _) => "m".to_string(),
            _ => [du.name(), "^-1"].concat(),
        };
        let density = [base, " ", &per].concat();
        Units {
            coordinate: self.unit.name(),
            density_per: du.name(),
            density_derivative: [&density, " K^-1"].concat(),
            density,
            total: base,
            total_derivative: [base, " K^-1"].concat(),
        }
    }

    fn density(&self, x: f64, t: f64, d_dt: bool) -> crate::Result<f64> {
        let xs = self.to_si("x", x)?;
        check::temperature("temperatureK", t)?;
        // The spectrum was validated when the handle was made, x and T just now.
        let v = if d_dt {
            self.spectrum.spectral_d_dt(xs, t)?
        } else {
            self.direct.density(&self.spectrum, xs, t)
        };
        Ok(v * self.factor)
    }

    fn inverse(&self, x: f64, value: f64, blackbody: bool) -> crate::Result<f64> {
        let xs = self.to_si("x", x)?;
        check::positive("value", value)?;
        let v = value / self.factor;
        if blackbody {
            inverse::brightness_temperature(&self.spectrum, xs, v)
        } else {
            inverse::temperature_from_spectral(&self.spectrum, xs, v)
        }
    }
}

/// The bulk forms: which operation a bulk call applies to every element of scratch buffer 0.
#[derive(Clone, Copy, PartialEq, Eq)]
enum Bulk {
    Points,
    Derivatives,
    Bands,
    BandDerivatives,
    BandFractions,
    BandTemperatures,
    Temperatures,
    BrightnessTemperatures,
}

#[wasm_bindgen(js_class = QbSpectrum)]
impl SpectrumHandle {
    /// Reads and checks `settings` (a plain-data copy made by the facade).
    pub fn create(settings: JsValue) -> Option<SpectrumHandle> {
        some((|| {
            let settings = read::<Settings>(settings, "settings")?.0;
            let spectrum = settings.spectrum().map_err(in_config("settings"))?;
            let density_unit = settings.density_unit().map_err(in_config("settings"))?;
            let si = crate::definition::variable_kind(spectrum.variable).si_unit();
            Ok::<_, Fail>(SpectrumHandle {
                settings,
                spectrum,
                unit: settings.unit,
                si,
                factor: density_unit.si_factor(),
                density_unit,
                direct: Direct::of(&spectrum),
                _live: Live::new(),
            })
        })())
    }

    /// The settings as read, with defaults filled in.
    pub fn settings(&self) -> JsValue {
        let mut s = self.settings;
        s.variable = Some(self.spectrum.variable);
        s.density_unit = Some(self.density_unit);
        to_js(&s).unwrap_or(JsValue::UNDEFINED)
    }

    /// Labels of the result units.
    #[wasm_bindgen(js_name = units)]
    pub fn units_js(&self) -> JsValue {
        to_js(&self.units()).unwrap_or(JsValue::UNDEFINED)
    }

    pub fn point(&self, x: f64, t: f64) -> f64 {
        number(self.density(x, t, false).map_err(Fail::from))
    }

    pub fn derivative(&self, x: f64, t: f64) -> f64 {
        number(self.density(x, t, true).map_err(Fail::from))
    }

    pub fn total(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.spectrum.total(t)
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = totalDerivative)]
    pub fn total_derivative(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.spectrum.total_d_dt(t)
            })()
            .map_err(Fail::from),
        )
    }

    pub fn peak(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                let p = self.spectrum.peak(t)?;
                convert_spectral_checked("peak", p, self.si, self.unit)
            })()
            .map_err(Fail::from),
        )
    }

    pub fn band(&self, lower: f64, upper: f64, t: f64) -> f64 {
        number(
            (|| {
                let (a, b) = self.band_si(lower, upper)?;
                check::temperature("temperatureK", t)?;
                // The spectrum was validated when the object was made.
                Ok::<_, Error>(band::band_checked(&self.spectrum, a, b, t, false))
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = bandDerivative)]
    pub fn band_derivative(&self, lower: f64, upper: f64, t: f64) -> f64 {
        number(
            (|| {
                let (a, b) = self.band_si(lower, upper)?;
                check::temperature("temperatureK", t)?;
                Ok::<_, Error>(band::band_checked(&self.spectrum, a, b, t, true))
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = bandFraction)]
    pub fn band_fraction(&self, lower: f64, upper: f64, t: f64) -> f64 {
        number(
            (|| {
                let (a, b) = self.band_si(lower, upper)?;
                check::temperature("temperatureK", t)?;
                band::band_fraction(&self.spectrum, a, b, t)
            })()
            .map_err(Fail::from),
        )
    }

    pub fn temperature(&self, x: f64, value: f64) -> f64 {
        number(self.inverse(x, value, false).map_err(Fail::from))
    }

    #[wasm_bindgen(js_name = brightnessTemperature)]
    pub fn brightness_temperature(&self, x: f64, value: f64) -> f64 {
        number(self.inverse(x, value, true).map_err(Fail::from))
    }

    #[wasm_bindgen(js_name = bandTemperature)]
    pub fn band_temperature(&self, lower: f64, upper: f64, value: f64) -> f64 {
        number(
            (|| {
                let (a, b) = self.band_si(lower, upper)?;
                check::positive("value", value)?;
                inverse::temperature_from_band(&self.spectrum, a, b, value)
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = bandRatioTemperature)]
    pub fn band_ratio_temperature(
        &self,
        lower1: f64,
        upper1: f64,
        lower2: f64,
        upper2: f64,
        ratio: f64,
        emissivity_ratio: f64,
    ) -> f64 {
        number(
            (|| {
                let b1 = self.band_si(lower1, upper1)?;
                let b2 = self.band_si(lower2, upper2)?;
                check::positive("ratio", ratio)?;
                check::positive("emissivityRatio", emissivity_ratio)?;
                inverse::temperature_from_band_ratio(
                    &self.spectrum,
                    b1,
                    b2,
                    ratio,
                    emissivity_ratio,
                )
            })()
            .map_err(Fail::from),
        )
    }

    /// A bulk form over f64 scratch buffer 0 (see `Bulk`): `a`, `b` are the fixed arguments
    /// (a temperature, a point, band limits). Returns 0, or NaN with the error stored.
    pub fn bulk(&self, op: u32, a: f64, b: f64) -> f64 {
        let op = match op {
            0 => Bulk::Points,
            1 => Bulk::Derivatives,
            2 => Bulk::Bands,
            3 => Bulk::BandDerivatives,
            4 => Bulk::BandFractions,
            5 => Bulk::BandTemperatures,
            6 => Bulk::Temperatures,
            _ => Bulk::BrightnessTemperatures,
        };
        status(self.run_bulk(op, a, b))
    }
}

impl SpectrumHandle {
    #[inline(never)]
    fn run_bulk(&self, op: Bulk, a: f64, b: f64) -> Result<(), Fail> {
        let s = &self.spectrum;
        match op {
            Bulk::Points | Bulk::Derivatives => {
                check::temperature("temperatureK", a)?;
                let d = matches!(op, Bulk::Derivatives);
                let f = self.factor;
                // Points: checked and converted first (errors name the element), then one loop
                // over the prepared constants.
                map_in_place(|x| {
                    let xs = self.to_si("xs", x)?;
                    Ok(if d { f * s.spectral_d_dt(xs, a)? } else { xs })
                })?;
                if !d {
                    with_f64(|b| Direct::of(s).fill(s, &mut b[0], a, f));
                }
                Ok(())
            }
            Bulk::Bands | Bulk::BandDerivatives | Bulk::BandFractions | Bulk::BandTemperatures => {
                let (lo, hi) = self.band_si(a, b)?;
                map_in_place(|t| match op {
                    Bulk::Bands | Bulk::BandDerivatives => {
                        check::temperature("temperaturesK", t)?;
                        Ok(band::band_checked(
                            s,
                            lo,
                            hi,
                            t,
                            op == Bulk::BandDerivatives,
                        ))
                    }
                    Bulk::BandFractions => {
                        check::temperature("temperaturesK", t)?;
                        band::band_fraction(s, lo, hi, t)
                    }
                    _ => {
                        check::positive("values", t)?;
                        inverse::temperature_from_band(s, lo, hi, t)
                    }
                })
            }
            Bulk::Temperatures | Bulk::BrightnessTemperatures => {
                let xs = self.to_si("x", a)?;
                let bb = matches!(op, Bulk::BrightnessTemperatures);
                let f = self.factor;
                map_in_place(|v| {
                    check::positive("values", v)?;
                    if bb {
                        inverse::brightness_temperature(s, xs, v / f)
                    } else {
                        inverse::temperature_from_spectral(s, xs, v / f)
                    }
                })
            }
        }
    }
}
