//! The prepared calibration curve (`CalibrationCurve` in the facade,
//! `src/wasm/js/calibration.js`): a Sakuma–Hattori curve from its coefficients or from a fit,
//! its signal, inverse and derivative, and whole-frame conversion through the measurement
//! equation into the caller's buffers.

use alloc::vec::Vec;
use serde::{Deserialize, Serialize};
use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, some, to_js, Fail};
use super::instrument::InstrumentHandle;
use super::scratch::{
    map_in_place, status, with_f32, with_f64, with_f64x, with_u16, with_u8, KIND_F64, KIND_U16,
};
use super::testing::Live;
use crate::constants::C2Convention;
use crate::definition::MeasurementConditions;
use crate::error::{self as check, Error};
use crate::thermometry::{
    max_interpolation_error_k, FitReport, FrameConverter, FrameSummary, PixelCorrections,
    SakumaHattori, SignalModel,
};

/// A checked curve, with the report of the fit that made it (if any).
#[wasm_bindgen(js_name = QbCalibration)]
pub struct CalibrationHandle {
    pub(crate) curve: SakumaHattori,
    pub(crate) report: Option<FitReport>,
    pub(crate) residuals: Vec<f64>,
    /// The reference points of a fit through points (uncertainty methods, src/wasm/uncertainty.rs).
    pub(crate) reference: Option<super::uncertainty::Reference>,
    pub(crate) _live: Live,
}

/// The coefficients of a curve as given (checked by `SakumaHattori::new`, whose error keeps its
/// code; the core's own `Deserialize` for the curve reports it as text). Read by a hand-written
/// `visit_map` (smaller than the derived reader; same defaults and messages).
struct Coefficients {
    a_m: f64,
    b_mk: f64,
    c: f64,
    c2: C2Convention,
}

/// The fields of [`Coefficients`] as JavaScript writes them.
const COEFFICIENT_FIELDS: &[&str] = &["aM", "bMK", "c", "c2"];

impl<'de> Deserialize<'de> for Coefficients {
    fn deserialize<D: serde::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> serde::de::Visitor<'de> for V {
            type Value = Coefficients;
            fn expecting(&self, f: &mut core::fmt::Formatter<'_>) -> core::fmt::Result {
                f.write_str("struct Coefficients")
            }
            fn visit_map<A: serde::de::MapAccess<'de>>(
                self,
                mut m: A,
            ) -> Result<Coefficients, A::Error> {
                let mut abc = [None; 3];
                let mut c2 = C2Convention::default();
                while let Some(key) = m.next_key::<alloc::string::String>()? {
                    let Some(at) = COEFFICIENT_FIELDS.iter().position(|f| *f == key.as_str())
                    else {
                        return Err(serde::de::Error::unknown_field(&key, COEFFICIENT_FIELDS));
                    };
                    match abc.get_mut(at) {
                        Some(slot) => *slot = Some(m.next_value::<f64>()?),
                        None => c2 = m.next_value()?,
                    }
                }
                let get = |i: usize| {
                    abc[i].ok_or_else(|| serde::de::Error::missing_field(COEFFICIENT_FIELDS[i]))
                };
                Ok(Coefficients {
                    a_m: get(0)?,
                    b_mk: get(1)?,
                    c: get(2)?,
                    c2,
                })
            }
        }
        d.deserialize_struct("Coefficients", COEFFICIENT_FIELDS, V)
    }
}

/// Options of the fits.
#[derive(Deserialize, Default)]
#[serde(rename_all = "camelCase", deny_unknown_fields)]
struct FitOptions {
    #[serde(default)]
    c2: C2Convention,
}

/// The fit report as returned to JavaScript (the core's report plus the residuals of the
/// points, which only a fit through points has).
#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct Report<'a> {
    rms_residual_k: f64,
    max_abs_residual_k: f64,
    iterations: u32,
    #[serde(skip_serializing_if = "<[f64]>::is_empty")]
    residuals_k: &'a [f64],
}

/// Per-frame settings of a frame conversion. The facade reads the arrays itself and passes
/// `true` for `emissivity`, `pixelGain`, `pixelOffset`, `badPixels` and `out` when they are
/// given; it also chooses the output buffer from `output`, which is checked here. Read by a
/// hand-written `visit_map` (fields by position in one list, each kind of value read at one
/// place; smaller than the derived reader, same defaults and messages).
struct FrameSettings {
    gain: f64,
    offset: f64,
    conditions: MeasurementConditions,
    /// A per-pixel non-uniformity gain map is in f64 scratch slot 3.
    pixel_gain: Option<bool>,
    /// A per-pixel non-uniformity offset map is in f64 scratch slot 4.
    pixel_offset: Option<bool>,
    /// A bad-pixel mask is in u8 scratch slot 0.
    bad_pixels: Option<bool>,
}

/// The fields of [`FrameSettings`] as JavaScript writes them.
const FRAME_FIELDS: &[&str] = &[
    "gain",
    "offset",
    "conditions",
    "output",
    "emissivity",
    "out",
    "pixelGain",
    "pixelOffset",
    "badPixels",
];

impl<'de> Deserialize<'de> for FrameSettings {
    fn deserialize<D: serde::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> serde::de::Visitor<'de> for V {
            type Value = FrameSettings;
            fn expecting(&self, f: &mut core::fmt::Formatter<'_>) -> core::fmt::Result {
                f.write_str("struct FrameSettings")
            }
            fn visit_map<A: serde::de::MapAccess<'de>>(
                self,
                mut m: A,
            ) -> Result<FrameSettings, A::Error> {
                let mut s = FrameSettings {
                    gain: 1.0,
                    offset: 0.0,
                    conditions: MeasurementConditions::default(),
                    pixel_gain: None,
                    pixel_offset: None,
                    bad_pixels: None,
                };
                while let Some(key) = m.next_key::<alloc::string::String>()? {
                    let Some(at) = FRAME_FIELDS.iter().position(|f| *f == key.as_str()) else {
                        return Err(serde::de::Error::unknown_field(&key, FRAME_FIELDS));
                    };
                    match at {
                        0 | 1 => {
                            let v = m.next_value::<f64>()?;
                            if at == 0 {
                                s.gain = v;
                            } else {
                                s.offset = v;
                            }
                        }
                        2 => s.conditions = m.next_value()?,
                        3 => {
                            m.next_value::<FrameOutput>()?;
                        }
                        _ => {
                            let v = m.next_value::<Option<bool>>()?;
                            match at {
                                6 => s.pixel_gain = v,
                                7 => s.pixel_offset = v,
                                8 => s.bad_pixels = v,
                                _ => {}
                            }
                        }
                    }
                }
                Ok(s)
            }
        }
        d.deserialize_struct("FrameSettings", FRAME_FIELDS, V)
    }
}

/// Element type of the returned temperatures.
#[derive(Deserialize, Default)]
#[serde(rename_all = "camelCase")]
enum FrameOutput {
    #[default]
    Float32,
    Float64,
}

#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct FrameResult {
    valid: usize,
    invalid: usize,
    min_temperature_k: f64,
    max_temperature_k: f64,
    background_signal: f64,
}

#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct InterpolationError {
    max_error_k: f64,
    at_temperature_k: f64,
}

/// `nPoints` as a count in [0, 1e7] (OUT_OF_RANGE otherwise, so no call runs for hours).
fn count(arg: &'static str, n: f64) -> crate::Result<usize> {
    check::finite(arg, n)?;
    if (0.0..=1.0e7).contains(&n) && n.fract() == 0.0 {
        Ok(n as usize)
    } else {
        Err(Error::OutOfRange {
            arg,
            value: n,
            range: "integers in [0, 10000000]",
        })
    }
}

impl CalibrationHandle {
    fn from_curve(curve: SakumaHattori) -> Self {
        CalibrationHandle {
            curve,
            report: None,
            residuals: Vec::new(),
            reference: None,
            _live: Live::new(),
        }
    }
}

#[wasm_bindgen(js_class = QbCalibration)]
impl CalibrationHandle {
    /// A curve from its coefficients `{ aM, bMK, c, c2? }` (plain-data copy).
    pub fn create(coefficients: JsValue) -> Option<CalibrationHandle> {
        some((|| {
            let c: Coefficients = read(coefficients, "coefficients")?;
            let curve =
                SakumaHattori::new(c.a_m, c.b_mk, c.c, c.c2).map_err(in_config("coefficients"))?;
            Ok(Self::from_curve(curve))
        })())
    }

    /// Least-squares fit through the points in f64 scratch buffers 0 (temperatures, K) and 1
    /// (signals); the residuals go to the handle, and the points with their standard
    /// uncertainties (bit 0 / 1 of `given`: `u_temperatures_k` / `u_signals` given, one per
    /// point) for the calibration transfer.
    pub fn fit(
        options: JsValue,
        u_temperatures_k: &[f64],
        u_signals: &[f64],
        given: u32,
    ) -> Option<CalibrationHandle> {
        some((|| {
            let o: FitOptions = read(options, "options")?;
            with_f64(|b| {
                let [t, s, _] = b;
                let mut residuals = Vec::new();
                if residuals.try_reserve_exact(t.len()).is_err() {
                    return Err(Fail::from(Error::TooLarge {
                        arg: "temperaturesK",
                        limit: crate::thermometry::sakuma_hattori::MAX_FIT_POINTS,
                        got: t.len(),
                    }));
                }
                residuals.resize(t.len(), 0.0);
                let r = SakumaHattori::fit(t, s, o.c2, Some(&mut residuals))?;
                let points =
                    super::uncertainty::reference(t, s, u_temperatures_k, u_signals, given, o.c2)?;
                Ok(CalibrationHandle {
                    curve: r.curve,
                    report: Some(r),
                    residuals,
                    reference: Some(points),
                    _live: Live::new(),
                })
            })
        })())
    }

    /// Fit to an exact instrument model over [tMinK, tMaxK].
    #[wasm_bindgen(js_name = fitInstrument)]
    pub fn fit_instrument(
        instrument: &InstrumentHandle,
        t_min: f64,
        t_max: f64,
        options: JsValue,
    ) -> Option<CalibrationHandle> {
        some((|| {
            let o: FitOptions = read(options, "options")?;
            check::temperature("tMinK", t_min)?;
            check::temperature("tMaxK", t_max)?;
            let r = instrument
                .model
                .run(|m| SakumaHattori::fit_model(m, t_min, t_max, o.c2))?;
            Ok(CalibrationHandle {
                curve: r.curve,
                report: Some(r),
                residuals: Vec::new(),
                reference: None,
                _live: Live::new(),
            })
        })())
    }

    /// Starting curve from a response model's moments, exact at `referenceTemperatureK`.
    #[wasm_bindgen(js_name = fromResponse)]
    pub fn from_response(instrument: &InstrumentHandle, t_ref: f64) -> Option<CalibrationHandle> {
        some((|| {
            check::temperature("referenceTemperatureK", t_ref)?;
            let c = instrument.with_response(|rs, _| SakumaHattori::from_response(rs, t_ref))?;
            Ok(Self::from_curve(c))
        })())
    }

    /// `{ aM, bMK, c, c2 }`.
    pub fn coefficients(&self) -> JsValue {
        to_js(&self.curve).unwrap_or(JsValue::UNDEFINED)
    }

    /// The fit report, or `undefined` for a curve made from coefficients.
    #[wasm_bindgen(js_name = fitReport)]
    pub fn fit_report(&self) -> JsValue {
        match &self.report {
            None => JsValue::UNDEFINED,
            Some(r) => to_js(&Report {
                rms_residual_k: r.rms_residual_k,
                max_abs_residual_k: r.max_abs_residual_k,
                iterations: r.iterations,
                residuals_k: &self.residuals,
            })
            .unwrap_or(JsValue::UNDEFINED),
        }
    }

    pub fn signal(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.curve.signal(t)
            })()
            .map_err(Fail::from),
        )
    }

    #[wasm_bindgen(js_name = signalDerivative)]
    pub fn signal_derivative(&self, t: f64) -> f64 {
        number(
            (|| {
                check::temperature("temperatureK", t)?;
                self.curve.d_signal_dt(t)
            })()
            .map_err(Fail::from),
        )
    }

    pub fn temperature(&self, signal: f64) -> f64 {
        // the curve checks the signal itself (same argument name)
        number(self.curve.temperature(signal).map_err(Fail::from))
    }

    /// Bulk forms over f64 scratch buffer 0: 0 signals, 1 signal derivatives, 2 temperatures.
    pub fn bulk(&self, op: u32) -> f64 {
        let c = &self.curve;
        status(match op {
            0 => map_in_place(|t| {
                check::temperature("temperaturesK", t)?;
                c.signal(t)
            }),
            1 => map_in_place(|t| {
                check::temperature("temperaturesK", t)?;
                c.d_signal_dt(t)
            }),
            _ => map_in_place(|s| {
                check::positive("signals", s)?;
                c.temperature(s)
            }),
        })
    }

    /// max |T_curve(S_exact(T)) − T| against an instrument's exact model.
    #[wasm_bindgen(js_name = maxInterpolationError)]
    pub fn max_interpolation_error(
        &self,
        exact: &InstrumentHandle,
        t_min: f64,
        t_max: f64,
        n_points: f64,
    ) -> Option<JsValue> {
        some((|| {
            let n = count("nPoints", n_points)?;
            check::temperature("tMinK", t_min)?;
            check::temperature("tMaxK", t_max)?;
            let (max_error_k, at_temperature_k) = exact
                .model
                .run(|m| max_interpolation_error_k(&self.curve, m, t_min, t_max, n))?;
            to_js(&InterpolationError {
                max_error_k,
                at_temperature_k,
            })
        })())
    }

    /// Converts the frame in scratch into f64 or f32 buffer 1. Without per-pixel corrections
    /// the input is f64 buffer 0, f32 buffer 0 or u16 buffer 0 by `input`. With corrections
    /// (emissivity in f64 buffer 2 when `map`, gain in f64 buffer 3, offset in f64 buffer 4, a
    /// bad-pixel mask in u8 buffer 0, as the settings say) the input is f64 buffer 0.
    #[wasm_bindgen(js_name = convertFrame)]
    pub fn convert_frame(
        &self,
        input: u32,
        out_f64: bool,
        map: bool,
        settings: JsValue,
    ) -> Option<JsValue> {
        some((|| {
            let fs: FrameSettings = read(settings, "options")?;
            let conditions = fs
                .conditions
                .conditions()
                .map_err(in_config("options.conditions"))?;
            let conv =
                FrameConverter::new(&self.curve, &conditions, fs.gain, fs.offset).map_err(|e| {
                    match e {
                        Error::NonPositive { arg: "gain", value } => Error::NonPositive {
                            arg: "options.gain",
                            value,
                        },
                        Error::NonFinite { arg, value } => Error::NonFinite {
                            arg: match arg {
                                "gain" => "options.gain",
                                "offset" => "options.offset",
                                a => a,
                            },
                            value,
                        },
                        other => other,
                    }
                })?;
            let maps = map || fs.pixel_gain.is_some() || fs.pixel_offset.is_some();
            let masked = fs.bad_pixels.is_some();
            let summary = with_f64(|f| {
                let [f0, f1, f2] = f;
                with_f32(|g| {
                    let [g0, g1] = g;
                    with_u16(|u| {
                        if !maps && !masked && input != KIND_F64 {
                            // u16 counts or f32 signals: the single-precision loop where it
                            // applies (f32 out), else the f64 loop on the frame widened to f64
                            // first (exact), so that loop exists once per output type.
                            let n = if input == KIND_U16 { u.len() } else { g0.len() };
                            let n_out = if out_f64 { f1.len() } else { g1.len() };
                            if n != n_out {
                                return Err(Error::LengthMismatch {
                                    expected: n,
                                    got: n_out,
                                });
                            }
                            if !out_f64 {
                                let fast = if input == KIND_U16 {
                                    conv.convert_f32(&u[..], &[], &mut g1[..])
                                } else {
                                    conv.convert_f32(&[], &g0[..], &mut g1[..])
                                };
                                if let Some(sum) = fast {
                                    return Ok(sum);
                                }
                            }
                            widen(f0, &u[..], &g0[..], input == KIND_U16);
                        }
                        with_f64x(|x| {
                            let [x3, x4] = x;
                            with_u8(|m| {
                                let corr = PixelCorrections::<f64> {
                                    gain: fs.pixel_gain.map(|_| &x3[..]),
                                    offset: fs.pixel_offset.map(|_| &x4[..]),
                                    emissivity: if map { Some(&f2[..]) } else { None },
                                    bad_pixels: if masked { Some(&m[..]) } else { None },
                                };
                                // The f64 loops: one per output type (and emissivity case);
                                // an uncorrected frame keeps the plain loop (no per-pixel
                                // correction branches: about 20 % faster).
                                match (maps || masked, out_f64) {
                                    (false, true) => conv.convert(&f0[..], &mut f1[..]),
                                    (false, false) => conv.convert(&f0[..], &mut g1[..]),
                                    (true, true) => {
                                        conv.convert_corrected(&f0[..], &corr, &mut f1[..])
                                    }
                                    (true, false) => {
                                        conv.convert_corrected(&f0[..], &corr, &mut g1[..])
                                    }
                                }
                            })
                        })
                    })
                })
            })?;
            let FrameSummary {
                valid,
                invalid,
                min_temperature_k,
                max_temperature_k,
            } = summary;
            to_js(&FrameResult {
                valid,
                invalid,
                min_temperature_k,
                max_temperature_k,
                background_signal: conv.background(),
            })
        })())
    }
}

/// The frame in u16 `counts` (`counts_in`) or f32 `signals` as f64 into `f0` (exact).
#[inline(never)]
fn widen(f0: &mut Vec<f64>, counts: &[u16], signals: &[f32], counts_in: bool) {
    f0.clear();
    if counts_in {
        f0.extend(counts.iter().map(|&c| f64::from(c)));
    } else {
        f0.extend(signals.iter().map(|&x| f64::from(x)));
    }
}
