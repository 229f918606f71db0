//! Blackbody fractions and the dimensionless Planck integrals for JavaScript (free functions
//! of plain numbers and a kernel name).

use wasm_bindgen::prelude::*;

use super::error::{number, Fail};
use super::stats::value;
use crate::band::{self, PlanckKernel};
use crate::Error;

#[wasm_bindgen(js_name = fractionBelow)]
pub fn fraction_below(lambda_t_m_k: f64) -> f64 {
    value(band::fraction_below(lambda_t_m_k))
}

#[wasm_bindgen(js_name = photonFractionBelow)]
pub fn photon_fraction_below(lambda_t_m_k: f64) -> f64 {
    value(band::photon_fraction_below(lambda_t_m_k))
}

#[wasm_bindgen(js_name = lambdaTAtFraction)]
pub fn lambda_t_at_fraction(fraction: f64) -> f64 {
    value(band::lambda_t_at_fraction(fraction))
}

#[wasm_bindgen(js_name = photonLambdaTAtFraction)]
pub fn photon_lambda_t_at_fraction(fraction: f64) -> f64 {
    value(band::photon_lambda_t_at_fraction(fraction))
}

fn kernel(name: &str) -> Result<PlanckKernel, Fail> {
    Ok(match name {
        "photon" => PlanckKernel::Photon,
        "energy" => PlanckKernel::Energy,
        "photonDerivative" => PlanckKernel::PhotonDerivative,
        "energyDerivative" => PlanckKernel::EnergyDerivative,
        _ => {
            return Err(Fail::Binding(
                "UNSUPPORTED",
                alloc::format!(
                    "kernel must be one of \"photon\", \"energy\", \"photonDerivative\", \
                     \"energyDerivative\" (got \"{name}\")"
                ),
            ))
        }
    })
}

/// ∫ of a dimensionless Planck integrand over [a, b]; NaN for an open end (`which`: 0 both
/// ends given, 1 from `a` to ∞, 2 from 0 to `b`, 3 the total).
#[wasm_bindgen(js_name = planckIntegralOf)]
pub fn planck_integral_of(name: &str, which: u32, a: f64, b: f64) -> f64 {
    number((|| {
        let k = kernel(name)?;
        Ok::<_, Fail>(match which {
            0 => band::planck_integral(k, a, b)?,
            1 => band::planck_integral_upper(k, a)?,
            2 => band::planck_integral_lower(k, b)?,
            3 => k.total(),
            _ => {
                return Err(Error::Unsupported {
                    what: "internal: integral form",
                }
                .into())
            }
        })
    })())
}
