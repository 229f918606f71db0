//! ITS-90 radiance ratios and two-colour temperatures for JavaScript (free functions; the
//! wavelength in a wavelength unit given by name, c2 by convention name). One export,
//! [`ratio_op`], for all of them (the facade, `functions.js` and `uncertainty.js`, passes the
//! operation number); object results leave as numbers in f64 scratch buffer 0 and the facade
//! builds the objects.

use wasm_bindgen::prelude::*;

use super::error::{number, Fail};
use super::uncertainty::put;
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

/// The ITS-90 and ratio free functions, by `op` (one export: their string arguments and error
/// paths are shared; `name` is a c2 convention name, or a fixed point's for ops 0 and 4):
/// 0 `fixedPointTemperature(name)`; 1 `temperatureFromRatio(a = ratio, b = wavelength, unit,
/// c = T_X, name)`; 2 `radianceRatio(a = T, b = wavelength, unit, c = T_X, name)`;
/// 3 `ratioTemperatureSensitivities(a = ratio, b = wavelength, unit, c = T_X, name)`: `[T,
/// ∂T/∂r, ∂T/∂T_X, ∂T/∂λ]` in f64 scratch 0, ∂T/∂λ in K per `unit`; 4 `its90Temperature(a =
/// ratio, b = wavelength, unit, name)`: `[T90, T with CODATA c2, c2 effect, below silver (0/1)]`
/// in f64 scratch 0; 5 `twoColourTemperature(a = λ1, b = λ2, unit, c = ratio, d = emissivity
/// ratio, name)`: `[T, ∂T/∂r, ∂T/∂(ε1/ε2)]` in f64 scratch 0. Scratch results return how many.
#[wasm_bindgen(js_name = qbRatio)]
#[allow(clippy::too_many_arguments)]
pub fn ratio_op(op: u32, a: f64, b: f64, c: f64, d: f64, unit: &str, name: &str) -> f64 {
    number((|| {
        if op == 0 {
            return Ok(fixed_point(name)?.temperature_k());
        }
        let (arg, arg2) = if op == 5 {
            ("wavelength1", "wavelength2")
        } else {
            ("wavelength", "")
        };
        let wl = wavelength_m(arg, if op == 5 { a } else { b }, unit)?;
        Ok(match op {
            1 => its90::temperature_from_ratio(a, wl, c, c2(name)?)?,
            2 => its90::radiance_ratio(a, wl, c, c2(name)?)?,
            3 => {
                let s = its90::ratio_temperature_sensitivities(a, wl, c, c2(name)?)?;
                // metres per unit of the call (one rounding; the unit was parsed above)
                let per_unit = wl / b;
                put(&[
                    s.temperature_k,
                    s.d_t_d_ratio,
                    s.d_t_d_reference_temperature,
                    s.d_t_d_wavelength * per_unit,
                ])
            }
            4 => {
                let r = its90::its90_temperature(a, wl, fixed_point(name)?)?;
                put(&[
                    r.t90_k,
                    r.t_codata_c2_k,
                    r.c2_effect_k,
                    if r.below_silver_point { 1.0 } else { 0.0 },
                ])
            }
            _ => {
                let l2 = wavelength_m(arg2, b, unit)?;
                let r = core_two_colour(wl, l2, c, d, c2(name)?)?;
                put(&[r.temperature_k, r.d_t_d_ratio, r.d_t_d_emissivity_ratio])
            }
        })
    })())
}
