//! The multi-wavelength fit for JavaScript (`fitMultiwavelength` and the `MultiwavelengthFit`
//! it returns, in `src/wasm/js/quantum.js`). The facade reads the measurement and options
//! objects itself (as for the other classes of `quantum.rs`, to keep serde `Deserialize`
//! code out of the module) and hands over: the wavelengths, values (radiances or signals) and
//! uncertainties in f64 scratch buffers 0, 1 and 2; the channel models of the band form one
//! instrument at a time ([`add_channel`]); the unit, c2, emissivity model and thresholds as
//! arguments. Here they are checked under their JavaScript paths, converted to SI with
//! `crate::units` and fitted by the core; the handle keeps the fit for its emissivity ε(λ) and
//! hands the result over as one plain object with the covariance trimmed to the fitted
//! parameters and the conditioning warnings listed.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use alloc::string::String;
use alloc::vec::Vec;
use core::cell::RefCell;
use wasm_bindgen::prelude::*;

use super::error::{in_config, number, some, Fail};
use super::instrument::InstrumentHandle;
use super::quantum::{map_each, unit_named};
use super::scratch::with_f64;
use super::testing::Live;
use crate::constants::C2Convention;
use crate::definition::PreparedModel;
use crate::error::{self as check, Error};
use crate::thermometry::multiwavelength::{
    multiwavelength_fit, multiwavelength_fit_channels, EmissivityModel, MultiwavelengthFit,
    MultiwavelengthOptions, MAX_EMISSIVITY_ORDER,
};
use crate::thermometry::response::{Response, ResponseSignal};
use crate::thermometry::SignalModel;
use crate::units::{convert_spectral_checked, SpectralKind, SpectralUnit};

thread_local! {
    /// The channel models of the next band-form fit, added by the facade just before it.
    static CHANNELS: RefCell<Vec<PreparedModel>> = const { RefCell::new(Vec::new()) };
}

/// Appends a copy of `instrument`'s signal model to the channel list of the next fit,
/// emptying the list first when `first`.
#[wasm_bindgen(js_name = qbMultiwavelengthChannel)]
pub fn add_channel(instrument: &InstrumentHandle, first: bool) {
    CHANNELS.with(|c| {
        let mut c = c.borrow_mut();
        if first {
            c.clear();
        }
        c.push(instrument.model.clone());
    });
}

/// One band channel as the core's fit sees it: a borrowed signal model. (Fitting the
/// `PreparedModel`s themselves would instantiate their `SignalModel` impl, which rebuilds a
/// response table's view on every call and costs about 7 KB of the module.)
struct Channel<'a>(&'a dyn SignalModel);

impl SignalModel for Channel<'_> {
    fn signal(&self, t: f64) -> crate::Result<f64> {
        self.0.signal(t)
    }
    fn d_signal_dt(&self, t: f64) -> crate::Result<f64> {
        self.0.d_signal_dt(t)
    }
    fn signal_and_derivative(&self, t: f64) -> crate::Result<(f64, f64)> {
        self.0.signal_and_derivative(t)
    }
    fn temperature(&self, signal: f64) -> crate::Result<f64> {
        self.0.temperature(signal)
    }
}

/// Fits through the channel models `models` (the views of response tables built once).
fn fit_channels(
    models: &[PreparedModel],
    data: [&[f64]; 3],
    options: &MultiwavelengthOptions,
    brightness_k: &mut [f64],
) -> crate::Result<MultiwavelengthFit> {
    let mut responses = Vec::new();
    let mut channels = Vec::new();
    if responses.try_reserve_exact(models.len()).is_err()
        || channels.try_reserve_exact(models.len()).is_err()
    {
        return Err(Error::Unsupported {
            what: "measurement.channels: more channels than the memory holds",
        });
    }
    for m in models {
        responses.push(match m {
            PreparedModel::Response {
                wavelengths_m,
                values,
                c2,
            } => Some(ResponseSignal::new(
                Response::new(wavelengths_m, values)?,
                *c2,
            )),
            _ => None,
        });
    }
    for (m, r) in models.iter().zip(&responses) {
        channels.push(Channel(match (m, r) {
            (PreparedModel::Point(p), _) => p,
            (PreparedModel::Curve(c), _) => c,
            (_, Some(r)) => r,
            (PreparedModel::Response { .. }, None) => {
                return Err(Error::Unsupported {
                    what: "internal: response channel without its view",
                })
            }
        }));
    }
    let [wl, s, u] = data;
    multiwavelength_fit_channels(&channels, wl, s, u, options, brightness_k)
}

/// The core's options from the facade's arguments (defaults filled in), checked under their
/// JavaScript names: `kind` 0 polynomial, 1 log-polynomial.
fn options(
    kind: u32,
    order: f64,
    max_condition_number: Option<f64>,
    max_abs_correlation: Option<f64>,
) -> Result<MultiwavelengthOptions, Fail> {
    let mut o = MultiwavelengthOptions::default();
    let at = in_config("options.model");
    let k = check::finite("order", order).map_err(&at)?;
    if !(k >= 0.0 && k <= MAX_EMISSIVITY_ORDER as f64 && k.fract() == 0.0) {
        return Err(at(Error::OutOfRange {
            arg: "order",
            value: k,
            range: "the integers 0 to 4",
        }));
    }
    let order = k as u8;
    o.model = if kind == 1 {
        EmissivityModel::LogPolynomial { order }
    } else {
        EmissivityModel::Polynomial { order }
    };
    let at = in_config("options");
    if let Some(c) = max_condition_number {
        o.max_condition_number = check::positive("maxConditionNumber", c).map_err(&at)?;
    }
    if let Some(c) = max_abs_correlation {
        check::positive("maxAbsCorrelation", c).map_err(&at)?;
        if c > 1.0 {
            return Err(at(Error::OutOfRange {
                arg: "maxAbsCorrelation",
                value: c,
                range: "(0, 1]",
            }));
        }
        o.max_abs_correlation = c;
    }
    Ok(o)
}

/// A fit, the unit of its wavelengths, the brightness temperatures of the channels and the
/// thresholds it was judged by.
#[wasm_bindgen(js_name = QbMultiwavelengthFit)]
pub struct FitHandle {
    fit: MultiwavelengthFit,
    unit: SpectralUnit,
    brightness_k: Vec<f64>,
    options: MultiwavelengthOptions,
    _live: Live,
}

/// Positions in the summary that `FitHandle::summary` writes to f64 scratch buffer 0 (the
/// facade builds the result object from it: a serde `Serialize` of the same figures cost about
/// 2 KB of the module). After the header: the m + 1 coefficients, the p × p covariance
/// (row-major) and the N brightness temperatures. "None" is NaN.
const HEADER: usize = 21;

/// The error `e` of element `index` of the measurement's array named in `e`.
fn element(index: usize) -> impl Fn(Error) -> Fail {
    move |e| Fail::Core(e, Some(index), "measurement")
}

fn refused(what: &str) -> Fail {
    Fail::Binding("UNSUPPORTED", String::from(what))
}

/// Checks the values of array `arg` (> 0, with their index) and multiplies them by `scale` in
/// place (an exact power of ten: per unit of wavelength → per metre).
fn scaled(arg: &'static str, values: &mut [f64], scale: f64) -> Result<(), Fail> {
    for (i, v) in values.iter_mut().enumerate() {
        check::positive(arg, *v).map_err(element(i))?;
        let s = *v * scale;
        if !s.is_finite() {
            return Err(element(i)(Error::OutOfRange {
                arg,
                value: *v,
                range: "values whose per-metre form is a finite f64",
            }));
        }
        *v = s;
    }
    Ok(())
}

#[wasm_bindgen(js_class = QbMultiwavelengthFit)]
impl FitHandle {
    /// Fits the data in f64 scratch buffers 0 (wavelengths, in `unit`), 1 (radiances per
    /// `unit`; or, when `channels` ≥ 0, band signals of the `channels` models just added by
    /// `qbMultiwavelengthChannel`) and 2 (uncertainties); `c2` 0 CODATA 2018, 1 ITS-90;
    /// `kind` 0 polynomial, 1 log-polynomial.
    #[allow(clippy::too_many_arguments)]
    pub fn create(
        unit: &str,
        channels: i32,
        c2: u32,
        kind: u32,
        order: f64,
        max_condition_number: Option<f64>,
        max_abs_correlation: Option<f64>,
    ) -> Option<FitHandle> {
        let models = CHANNELS.with(|c| core::mem::take(&mut *c.borrow_mut()));
        some((|| {
            let o = options(kind, order, max_condition_number, max_abs_correlation)?;
            let c2 = if c2 == 1 {
                C2Convention::Its90
            } else {
                C2Convention::Codata2018
            };
            // the last `channels` models added (the facade adds them just before; none when
            // it adds none, whatever an interrupted earlier call left)
            let band = usize::try_from(channels)
                .ok()
                .map(|k| models.get(models.len().saturating_sub(k)..).unwrap_or(&[]));
            Self::build(unit, band, c2, o)
        })())
    }

    /// Writes the figures to f64 scratch buffer 0 (layout: `fitSummary` in quantum.js) and
    /// returns their count, or NaN (memory) with the error stored.
    pub fn summary(&self) -> f64 {
        let f = &self.fit;
        let p = f.parameter_count();
        let n = self.brightness_k.len();
        let corr = f.correlation_temperature_slope;
        let mut warnings = 0u32;
        if f.condition_number > self.options.max_condition_number {
            warnings |= 1;
        }
        if corr.is_some_and(|c| c.abs() > self.options.max_abs_correlation) {
            warnings |= 2;
        }
        if f.local_minima > 1 {
            warnings |= 4;
        }
        if !f.emissivity_physical {
            warnings |= 8;
        }
        let (kind, order) = match f.model {
            EmissivityModel::Polynomial { order } => (0.0, order),
            EmissivityModel::LogPolynomial { order } => (1.0, order),
        };
        let bit = |b: bool| if b { 1.0 } else { 0.0 };
        // a length is a positive finite value: from_si only scales it
        let in_unit = |x: f64| self.unit.from_si("wavelength", x).unwrap_or(f64::NAN);
        let header: [f64; HEADER] = [
            f.temperature_k,
            f.u_temperature_k,
            bit(f.ill_conditioned),
            f64::from(warnings),
            kind,
            f64::from(order),
            in_unit(f.centre_wavelength_m),
            in_unit(f.half_span_m),
            f.condition_number,
            corr.unwrap_or(f64::NAN),
            f.uncertainty_inflation,
            f64::from(f.local_minima),
            bit(f.emissivity_physical),
            f.chi_squared,
            f.degrees_of_freedom as f64,
            f64::from(f.iterations),
            f.start_temperature_k,
            f.grey_two_colour_temperature_k.unwrap_or(f64::NAN),
            self.options.max_condition_number,
            self.options.max_abs_correlation,
            n as f64,
        ];
        let len = HEADER + (p - 1) + p * p + n;
        number(with_f64(|b| {
            let out = &mut b[0];
            out.clear();
            out.try_reserve_exact(len)
                .map_err(|_| refused("the fit summary does not fit in memory"))?;
            out.extend_from_slice(&header);
            out.extend_from_slice(f.coefficients.get(..p - 1).unwrap_or(&[]));
            for row in f.covariance.iter().take(p) {
                out.extend_from_slice(row.get(..p).unwrap_or(&[]));
            }
            out.extend_from_slice(&self.brightness_k);
            Ok(out.len() as f64)
        }))
    }

    /// ε at `wavelength` (in the measurement's unit).
    pub fn emissivity(&self, wavelength: f64) -> f64 {
        number(
            self.emissivity_at("wavelength", wavelength)
                .map_err(Fail::from),
        )
    }

    /// Bulk form over f64 scratch buffer 0: ε at each wavelength. Returns 0, or NaN with the
    /// error stored.
    pub fn bulk(&self) -> f64 {
        map_each(&|w| self.emissivity_at("wavelengths", w))
    }
}

impl FitHandle {
    fn emissivity_at(&self, arg: &'static str, wavelength: f64) -> crate::Result<f64> {
        let m = convert_spectral_checked(arg, wavelength, self.unit, SpectralUnit::Metre)?;
        let e = self.fit.emissivity(m)?;
        if e.is_nan() {
            // far outside the channels a polynomial's terms can overflow to ∞ − ∞
            return Err(Error::OutOfRange {
                arg,
                value: wavelength,
                range: "wavelengths where the fitted emissivity is a number",
            });
        }
        Ok(e)
    }

    #[inline(never)]
    fn build(
        unit: &str,
        channels: Option<&[PreparedModel]>,
        c2: C2Convention,
        options: MultiwavelengthOptions,
    ) -> Result<FitHandle, Fail> {
        let unit = unit_named("measurement.unit", unit)?;
        if unit.kind() != SpectralKind::Wavelength {
            return Err(Error::Unsupported {
                what: "measurement.unit must be a wavelength unit (m, mm, um, nm)",
            }
            .into());
        }
        with_f64(|b| {
            let [wl, s, u] = b;
            for (i, w) in wl.iter_mut().enumerate() {
                *w = convert_spectral_checked("wavelengths", *w, unit, SpectralUnit::Metre)
                    .map_err(element(i))?;
            }
            // radiances per `unit` of wavelength → per metre (an exact power of ten)
            let (values, scale) = match channels {
                None => ("radiances", unit.from_si("unit", 1.0)?),
                Some(_) => ("signals", 1.0),
            };
            scaled(values, s, scale)?;
            scaled("uncertainties", u, scale)?;
            let mut brightness_k = Vec::new();
            brightness_k
                .try_reserve_exact(wl.len())
                .map_err(|_| refused("measurement: arrays too long for the memory"))?;
            brightness_k.resize(wl.len(), 0.0);
            let fit = match channels {
                None => multiwavelength_fit(wl, s, u, c2, &options, &mut brightness_k),
                Some(m) => fit_channels(m, [wl, s, u], &options, &mut brightness_k),
            }
            .map_err(in_config("measurement"))?;
            Ok(FitHandle {
                fit,
                unit,
                brightness_k,
                options,
                _live: Live::new(),
            })
        })
    }
}
