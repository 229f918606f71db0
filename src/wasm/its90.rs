//! ITS-90 radiance ratios and two-colour temperatures for JavaScript (free functions; the
//! wavelength in a wavelength unit given by name, c2 by convention name). Kept thin: the core's
//! its90 results are serialized as they are.

use wasm_bindgen::prelude::*;

use super::error::{number, some, to_js, Fail};
use crate::constants::C2Convention;
use crate::thermometry::its90::{self, FixedPoint};
use crate::thermometry::two_colour_temperature as core_two_colour;
use crate::units::{convert_spectral_checked, SpectralKind, SpectralUnit};
use crate::Error;

pub(crate) fn wavelength_m(arg: &'static str, x: f64, unit: &str) -> Result<f64, Fail> {
    let u = SpectralUnit::parse(unit)?;
    if u.kind() != SpectralKind::Wavelength {
        return Err(Error::Unsupported {
            what: "unit must be a wavelength unit (m, mm, um, nm)",
        }
        .into());
    }
    Ok(convert_spectral_checked(arg, x, u, SpectralUnit::Metre)?)
}

pub(crate) fn c2(name: &str) -> Result<C2Convention, Fail> {
    match name {
        "" | "codata2018" => Ok(C2Convention::Codata2018),
        "its90" => Ok(C2Convention::Its90),
        _ => Err(Fail::Binding(
            "UNSUPPORTED",
            alloc::format!("c2 must be one of \"codata2018\", \"its90\" (got \"{name}\")"),
        )),
    }
}

fn fixed_point(name: &str) -> Result<FixedPoint, Fail> {
    FixedPoint::ALL
        .into_iter()
        .find(|f| f.name() == name)
        .ok_or_else(|| {
            Fail::Binding(
                "UNSUPPORTED",
                alloc::format!(
                    "fixedPoint must be one of \"indium\", \"tin\", \"zinc\", \"aluminium\", \"silver\", \"gold\", \"copper\" (got \"{name}\")"
                ),
            )
        })
}

#[wasm_bindgen(js_name = fixedPointTemperature)]
pub fn fixed_point_temperature(name: &str) -> f64 {
    number(fixed_point(name).map(|f| f.temperature_k()))
}

#[wasm_bindgen(js_name = temperatureFromRatio)]
pub fn temperature_from_ratio(
    ratio: f64,
    wavelength: f64,
    unit: &str,
    reference_temperature_k: f64,
    c2_name: &str,
) -> f64 {
    number((|| {
        let wl = wavelength_m("wavelength", wavelength, unit)?;
        Ok(its90::temperature_from_ratio(
            ratio,
            wl,
            reference_temperature_k,
            c2(c2_name)?,
        )?)
    })())
}

#[wasm_bindgen(js_name = radianceRatio)]
pub fn radiance_ratio(
    temperature_k: f64,
    wavelength: f64,
    unit: &str,
    reference_temperature_k: f64,
    c2_name: &str,
) -> f64 {
    number((|| {
        let wl = wavelength_m("wavelength", wavelength, unit)?;
        Ok(its90::radiance_ratio(
            temperature_k,
            wl,
            reference_temperature_k,
            c2(c2_name)?,
        )?)
    })())
}

#[wasm_bindgen(js_name = its90Temperature)]
pub fn its90_temperature(ratio: f64, wavelength: f64, unit: &str, fixed: &str) -> Option<JsValue> {
    some((|| {
        let wl = wavelength_m("wavelength", wavelength, unit)?;
        let r = its90::its90_temperature(ratio, wl, fixed_point(fixed)?)?;
        to_js(&r)
    })())
}

#[wasm_bindgen(js_name = twoColourTemperature)]
pub fn two_colour_temperature(
    wavelength1: f64,
    wavelength2: f64,
    unit: &str,
    ratio: f64,
    emissivity_ratio: f64,
    c2_name: &str,
) -> Option<JsValue> {
    some((|| {
        let l1 = wavelength_m("wavelength1", wavelength1, unit)?;
        let l2 = wavelength_m("wavelength2", wavelength2, unit)?;
        let r = core_two_colour(l1, l2, ratio, emissivity_ratio, c2(c2_name)?)?;
        to_js(&r)
    })())
}
