//! Private Planck kernel used by the response-weighted integrals: blackbody spectral radiance per
//! wavelength and its temperature derivative at one node, for a chosen c2.
#![forbid(unsafe_code)]

use crate::constants::C1L;
use crate::float::{exp, expm1, ln, ln_1p};

/// (L_λ, ∂L_λ/∂T) in W·m⁻³·sr⁻¹ and W·m⁻³·sr⁻¹·K⁻¹ for wavelength `wavelength_m` > 0 and
/// temperature `temperature_k` > 0 (the caller validates). Underflows to 0 only where the true
/// value is below the f64 range.
#[inline]
pub(crate) fn radiance_and_dt(wavelength_m: f64, temperature_k: f64, c2_mk: f64) -> (f64, f64) {
    let x = c2_mk / (wavelength_m * temperature_k);
    // e^x/(e^x − 1) = 1/(1 − e^−x); −expm1(−x) keeps it exact for small x.
    let bose = 1.0 / -expm1(-x);
    let l = if x <= 700.0 && (1e-60..=1e60).contains(&wavelength_m) {
        let l5 = wavelength_m * wavelength_m * wavelength_m * wavelength_m * wavelength_m;
        C1L / l5 / expm1(x)
    } else {
        // ln L = ln c1L − 5 ln λ − x − ln(1 − e^−x): no intermediate overflow or underflow.
        exp(ln(C1L) - 5.0 * ln(wavelength_m) - x - ln_1p(-exp(-x)))
    };
    let dl = l * (x / temperature_k) * bose;
    (l, if dl.is_finite() { dl } else { 0.0 })
}
