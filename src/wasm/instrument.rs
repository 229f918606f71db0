//! The prepared instrument (`Instrument` in the facade, `src/wasm/js/instrument.js`): an
//! [`InstrumentDefinition`] (signal model + measurement conditions) read and checked once;
//! model signal and its inverse, the measurement equation and its inverse, sensitivities,
//! uncertainty budgets, response-table moments and ratio thermometry.

use serde::Serialize;
use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, some, to_js, Fail};
use super::scratch::{map_in_place, status};
use super::testing::Live;
use crate::definition::{InstrumentDefinition, MeasurementConditions, PreparedModel};
use crate::error::{self as check, Error};
use crate::thermometry::{
    ratio_temperature, sensitivities, Conditions, Response, ResponseSignal, SignalModel,
};
use crate::units::{convert_spectral_checked, SpectralUnit};

/// A checked instrument.
#[wasm_bindgen(js_name = QbInstrument)]
pub struct InstrumentHandle {
    definition: InstrumentDefinition,
    pub(crate) model: PreparedModel,
    pub(crate) conditions: Conditions,
    /// gain and background of the measurement equation (or why they cannot be had).
    affine: Result<(f64, f64), Error>,
    _live: Live,
}

#[derive(Serialize)]
struct Affine {
    gain: f64,
    background: f64,
}

#[derive(Serialize)]
struct Moments {
    mean: f64,
    spread: f64,
}

/// The wavelength unit of a response model.
fn response_unit(d: &InstrumentDefinition) -> Option<SpectralUnit> {
    match &d.model {
        crate::definition::InstrumentModel::Response(t) => Some(t.unit),
        _ => None,
    }
}

impl InstrumentHandle {
    fn build(
        definition: InstrumentDefinition,
        conditions_path: &'static str,
    ) -> Result<InstrumentHandle, Fail> {
        let model = definition
            .model
            .prepare()
            .map_err(in_config("definition.model"))?;
        let conditions = definition
            .conditions
            .conditions()
            .map_err(in_config(conditions_path))?;
        let affine = model.run(|m| conditions.affine(m));
        Ok(InstrumentHandle {
            definition,
            model,
            conditions,
            affine,
            _live: Live::new(),
        })
    }

    fn measured(&self, t: f64, arg: &'static str) -> crate::Result<f64> {
        check::temperature(arg, t)?;
        let (gain, bg) = self.affine?;
        Ok(gain * self.model.signal(t)? + bg)
    }

    /// The object temperature of a reading: the core's inverse with the affine form hoisted.
    fn object(&self, m: &dyn SignalModel, signal: f64, arg: &'static str) -> crate::Result<f64> {
        check::finite(arg, signal)?;
        let (gain, bg) = self.affine?;
        let net = signal - bg;
        if net.is_nan() || net <= 0.0 {
            return Err(Error::NoPhysicalSolution {
                signal,
                background: bg,
            });
        }
        m.temperature(check::positive(arg, net / gain)?)
    }

    /// `f` with the model as a response signal, or UNSUPPORTED for another kind.
    pub(crate) fn with_response<R>(
        &self,
        f: impl FnOnce(&ResponseSignal<'_>, SpectralUnit) -> crate::Result<R>,
    ) -> Result<R, Fail> {
        match (&self.model, response_unit(&self.definition)) {
            (
                PreparedModel::Response {
                    wavelengths_m,
                    values,
                    c2,
                },
                Some(unit),
            ) => {
                let rs = ResponseSignal::new(Response::new(wavelengths_m, values)?, *c2);
                Ok(f(&rs, unit)?)
            }
            _ => Err(Error::Unsupported {
                what: "this method needs a response model (kind \"response\")",
            }
            .into()),
        }
    }
}

fn from_m(arg: &'static str, x_m: f64, unit: SpectralUnit) -> crate::Result<f64> {
    convert_spectral_checked(arg, x_m, SpectralUnit::Metre, unit)
}

#[wasm_bindgen(js_class = QbInstrument)]
impl InstrumentHandle {
    /// Reads and checks a definition `{ model, conditions? }` (plain-data copy).
    pub fn create(definition: JsValue) -> Option<InstrumentHandle> {
        some(
            read::<InstrumentDefinition>(definition, "definition")
                .and_then(|d| Self::build(d, "definition.conditions")),
        )
    }

    /// The same model under other conditions.
    #[wasm_bindgen(js_name = withConditions)]
    pub fn with_conditions(&self, conditions: JsValue) -> Option<InstrumentHandle> {
        some((|| {
            let c: MeasurementConditions = read(conditions, "conditions")?;
            let mut d = self.definition.clone();
            d.conditions = c;
            Self::build(d, "conditions")
        })())
    }

    /// The definition as read (serialized: canonical unit names).
    pub fn definition(&self) -> JsValue {
        to_js(&self.definition).unwrap_or(JsValue::UNDEFINED)
    }

    /// The conditions in SI with every default filled in.
    pub fn conditions(&self) -> JsValue {
        to_js(&self.conditions).unwrap_or(JsValue::UNDEFINED)
    }

    pub fn signal(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.model.signal(t)
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = signalDerivative)]
    pub fn signal_derivative(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.model.d_signal_dt(t)
            })()
            .map_err(Fail::from),
        )
    }

    pub fn temperature(&self, signal: f64) -> f64 {
        number(
            (|| {
                check::positive("signal", signal)?;
                self.model.temperature(signal)
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = measuredSignal)]
    pub fn measured_signal(&self, t: f64) -> f64 {
        number(self.measured(t, "objectTemperatureK").map_err(Fail::from))
    }

    #[wasm_bindgen(js_name = objectTemperature)]
    pub fn object_temperature(&self, signal: f64) -> f64 {
        number(
            self.model
                .run(|m| self.object(m, signal, "signal"))
                .map_err(Fail::from),
        )
    }

    /// Bulk forms over f64 scratch buffer 0: 0 signals, 1 signal derivatives, 2 temperatures,
    /// 3 measured signals, 4 object temperatures. Returns 0, or NaN with the error stored.
    pub fn bulk(&self, op: u32) -> f64 {
        status(self.run_bulk(op))
    }

    pub fn sensitivities(&self, signal: f64) -> Option<JsValue> {
        some((|| {
            check::finite("signal", signal)?;
            let s = self
                .model
                .run(|m| sensitivities(m, signal, &self.conditions))?;
            to_js(&s)
        })())
    }

    /// The GUM budget of the object temperature: inputs and correlations as the facade
    /// encodes them, the result as numbers in f64 scratch 0 (see `super::uncertainty`).
    #[wasm_bindgen(js_name = uncertaintyBudget)]
    pub fn uncertainty_budget(
        &self,
        signal: f64,
        inputs: &[f64],
        correlations: &[f64],
        coverage_probability: Option<f64>,
        coverage_factor: Option<f64>,
    ) -> f64 {
        super::uncertainty::instrument_budget(
            self,
            signal,
            inputs,
            correlations,
            coverage_probability,
            coverage_factor,
        )
    }

    #[wasm_bindgen(js_name = measurementAffine)]
    pub fn measurement_affine(&self) -> Option<JsValue> {
        some((|| {
            let (gain, background) = self.affine?;
            to_js(&Affine { gain, background })
        })())
    }

    #[wasm_bindgen(js_name = responseMoments)]
    pub fn response_moments(&self) -> Option<JsValue> {
        some((|| {
            let (mean, spread) = self.with_response(|rs, unit| {
                let (m, s) = rs.response().mean_and_spread_m()?;
                Ok((from_m("mean", m, unit)?, s / unit.si_factor()))
            })?;
            to_js(&Moments { mean, spread })
        })())
    }

    #[wasm_bindgen(js_name = signalMoments)]
    pub fn signal_moments(&self, t: f64) -> Option<JsValue> {
        some((|| {
            let (mean, spread) = self.with_response(|rs, unit| {
                check::temperature("temperatureK", t)?;
                let (m, s) = rs.mean_and_spread_m(t)?;
                Ok((from_m("mean", m, unit)?, s / unit.si_factor()))
            })?;
            to_js(&Moments { mean, spread })
        })())
    }

    #[wasm_bindgen(js_name = limitingEffectiveWavelength)]
    pub fn limiting_effective_wavelength(&self, t: f64) -> f64 {
        number(self.with_response(|rs, unit| {
            check::temperature("temperatureK", t)?;
            from_m("wavelength", rs.limiting_effective_wavelength_m(t)?, unit)
        }))
    }

    #[wasm_bindgen(js_name = effectiveWavelength)]
    pub fn effective_wavelength(&self, t1: f64, t2: f64) -> f64 {
        number(self.with_response(|rs, unit| {
            check::temperature("t1K", t1)?;
            check::temperature("t2K", t2)?;
            from_m("wavelength", rs.effective_wavelength_m(t1, t2)?, unit)
        }))
    }

    #[wasm_bindgen(js_name = responseAt)]
    pub fn response_at(&self, wavelength: f64) -> f64 {
        number(self.with_response(|rs, unit| {
            let w = convert_spectral_checked("wavelength", wavelength, unit, SpectralUnit::Metre)?;
            rs.response().value_at(w)
        }))
    }

    /// Two-colour reading with `other` as channel 2.
    #[wasm_bindgen(js_name = ratioTemperature)]
    pub fn ratio_temperature(
        &self,
        other: &InstrumentHandle,
        ratio: f64,
        emissivity_ratio: f64,
        guess_k: f64,
    ) -> Option<JsValue> {
        some((|| {
            check::positive("ratio", ratio)?;
            check::positive("emissivityRatio", emissivity_ratio)?;
            check::temperature("guessK", guess_k)?;
            let r = self.model.run(|a| {
                other
                    .model
                    .run(|b| ratio_temperature(a, b, ratio, emissivity_ratio, guess_k))
            })?;
            to_js(&r)
        })())
    }
}

impl InstrumentHandle {
    #[inline(never)]
    fn run_bulk(&self, op: u32) -> Result<(), Fail> {
        let mut out = Ok(());
        self.model.run(|m| {
            out = match op {
                0 => map_in_place(|t| {
                    check::temperature("temperaturesK", t)?;
                    m.signal(t)
                }),
                1 => map_in_place(|t| {
                    check::temperature("temperaturesK", t)?;
                    m.d_signal_dt(t)
                }),
                2 => map_in_place(|s| {
                    check::positive("signals", s)?;
                    m.temperature(s)
                }),
                3 => {
                    let (gain, bg) = self.affine?;
                    map_in_place(|t| {
                        check::temperature("objectTemperaturesK", t)?;
                        Ok(gain * m.signal(t)? + bg)
                    })
                }
                _ => {
                    self.affine?;
                    map_in_place(|s| self.object(m, s, "signals"))
                }
            };
            Ok(())
        })?;
        out
    }
}
