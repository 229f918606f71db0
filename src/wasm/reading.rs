//! The workflows from an indicated temperature on the grey `Instrument` (`QbInstrument`;
//! `src/wasm/js/reading.js`): correcting a reading to other settings, the reflected temperature
//! from a reflector reading, and the emissivity by the contact and reference-coating methods
//! (`crate::thermometry::indicated`). `SpectralInstrument` (feature `spectral-js`,
//! `src/wasm/spectral.rs`) runs the same workflows through [`workflow`] with its spectral model.
//!
//! Errors name the JavaScript arguments (`setting.emissivity`, `referenceReadingK`, …).

use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, Fail};
use super::instrument::InstrumentHandle;
use super::scratch::with_f64;
use crate::definition::MeasurementConditions;
use crate::error as check;
use crate::thermometry::indicated::{
    correct_reading, emissivity_by_contact, emissivity_by_reference, reflected_temperature,
};
use crate::thermometry::{Conditions, SignalModel};

/// Writes `v` to f64 scratch buffer 0 for the facade, which builds the result object (smaller
/// than a serde result type per method); returns the count.
#[inline(never)]
pub(crate) fn out(v: &[f64]) -> f64 {
    with_f64(|b| {
        b[0].clear();
        b[0].extend_from_slice(v);
    });
    v.len() as f64
}

/// Operation numbers of `readingWorkflow`: correct a reading (a = indicated temperature),
/// reflected temperature from a reflector reading (a = indicated, b = reflector emissivity,
/// c = reflector temperature), emissivity by contact (2: a = indicated, b = true temperature,
/// c = reflected temperature), the reference-coating method (a = reference reading, b = surface
/// reading, c = reference emissivity, d = reflected temperature).
pub(crate) const CORRECT: u32 = 0;
const REFLECTED: u32 = 1;
const REFERENCE: u32 = 3;

/// The grey measurement conditions an instrument applied to a reading.
#[inline(never)]
pub(crate) fn setting_of(v: JsValue) -> Result<Conditions, Fail> {
    read::<MeasurementConditions>(v, "setting")?
        .conditions()
        .map_err(in_config("setting"))
}

/// The reflector method (`REFLECTED`), the reference-coating method (`REFERENCE`: emissivity
/// and true temperature into f64 scratch buffer 0, see [`out`]; returns 2) or the contact
/// method, with the blackbody signal of `m`; `x` are the operation's numbers in the order of
/// its JavaScript arguments.
pub(crate) fn workflow(
    m: &dyn SignalModel,
    op: u32,
    x: [f64; 4],
    setting: &Conditions,
) -> crate::Result<f64> {
    let [a, b, c, d] = x;
    match op {
        REFLECTED => reflected_temperature(m, a, setting, b, c),
        REFERENCE => {
            let r = reference(m, a, b, c, d, setting)?;
            Ok(out(&[r.emissivity, r.temperature_k]))
        }
        _ => emissivity_by_contact(m, a, setting, b, c),
    }
}

/// The reference-coating method with the blackbody signal of `m`.
fn reference(
    m: &dyn SignalModel,
    reference_k: f64,
    surface_k: f64,
    reference_emissivity: f64,
    reflected_k: f64,
    setting: &Conditions,
) -> crate::Result<crate::thermometry::indicated::ReferenceEmissivity> {
    check::temperature("referenceReadingK", reference_k)?;
    check::temperature("surfaceReadingK", surface_k)?;
    emissivity_by_reference(
        m,
        reference_k,
        surface_k,
        setting,
        reference_emissivity,
        reflected_k,
    )
}

#[wasm_bindgen(js_class = QbInstrument)]
impl InstrumentHandle {
    /// The reading workflows with this instrument's model; a corrected reading is solved under
    /// the instrument's conditions.
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
            Ok(self.model.run(|m| {
                if op == CORRECT {
                    correct_reading(m, a, &s, &self.conditions)
                } else {
                    workflow(m, op, [a, b, c, d], &s)
                }
            })?)
        })())
    }
}
