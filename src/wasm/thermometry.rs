//! Radiation-thermometry workflow for JavaScript: instrument signal models (one wavelength, a
//! spectral-response table, a Sakuma–Hattori curve), the measurement equation and its inverse
//! (scalar and bulk), calibration-curve fits, ITS-90 radiance ratios, ratio (two-colour)
//! thermometry and GUM uncertainty budgets.
//!
//! Cautions (also in the TypeScript docs): these are calculations, not measurements; they do not
//! replace calibrated instruments and standard procedures, must not be used for medical
//! temperature screening or process-safety decisions, and defer to local codes and standards.

#[allow(unused_imports)]
use super::prelude::*;

use js_sys::{Array, Float32Array, Float64Array, Object, Reflect, Uint16Array};
use wasm_bindgen::prelude::*;
use wasm_bindgen::JsCast;

use super::error::{at, decimal, fail, map_indexed, object, with_room};
use super::opts::{choose, Opts, Schema};
use super::opts::{js_string, opt_js_string};
use super::radiometry::parse_c2;
use crate::constants::C2Convention;
use crate::error::{finite, positive, temperature};
use crate::thermometry::its90::{self, FixedPoint};
use crate::thermometry::{max_interpolation_error_k, two_colour_temperature as core_two_colour};
use crate::thermometry::{
    measured_signal as core_measured_signal, object_temperature as core_object_temperature,
    uncertainty::BudgetInput, uncertainty::StandardUncertainties,
    uncertainty_budget as core_budget, Conditions, FitReport, FrameConverter, Response,
    ResponseSignal, SakumaHattori, SignalModel, SpectralPoint, Window,
};
use crate::thermometry::{
    ratio_temperature as core_ratio_temperature, sensitivities as core_sensitivities, RatioReading,
};
use crate::units::{convert_spectral, SpectralKind, SpectralUnit};
use crate::Error;
use alloc::borrow::Cow;

#[wasm_bindgen(typescript_custom_section)]
const TS_THERMOMETRY: &str = r#"
/** A wavelength unit (the wavelength spellings of SpectralUnit). */
export type WavelengthUnit = "m" | "mm" | "um" | "µm" | "μm" | "micron" | "nm";

/** An instrument that sees one wavelength (narrow-band): signal = spectral radiance L_λ, W·m⁻²·sr⁻¹·m⁻¹. */
export interface SpectralPointModel {
  kind: "spectralPoint";
  /** Wavelength, in `unit`. */
  wavelength: number;
  unit: WavelengthUnit;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/**
 * An instrument with a relative spectral response R(λ) (piecewise linear between the points,
 * zero outside): signal = ∫ R(λ)·L_λ(λ, T) dλ, W·m⁻²·sr⁻¹ times the unit of R.
 */
export interface ResponseModel {
  kind: "response";
  /** Strictly increasing wavelengths, in `unit` (at least 2). */
  wavelengths: Float64Array | readonly number[];
  /** Response values ≥ 0 (not all zero), same length as `wavelengths`. */
  values: Float64Array | readonly number[];
  unit: WavelengthUnit;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/**
 * A Sakuma–Hattori calibration curve S(T) = C / (exp(c2 / (A·T + B)) − 1), in the signal unit
 * of C.
 */
export interface SakumaHattoriModel {
  kind: "sakumaHattori";
  /** A, m (> 0). */
  aM: number;
  /** B, m·K. */
  bMK: number;
  /** C, signal units (> 0). */
  c: number;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** An instrument's blackbody signal S(T), strictly increasing in T. */
export type InstrumentModel = SpectralPointModel | ResponseModel | SakumaHattoriModel;

/** A window between scene and instrument (grey in the instrument's band). */
export interface WindowConditions {
  /** τ_w in (0, 1]. */
  transmittance: number;
  /** ρ_w (instrument side) in [0, 1), τ_w + ρ_w ≤ 1. Default 0. */
  reflectance?: number;
  /** Window temperature, K. */
  temperatureK: number;
  /** Temperature of what the window reflects into the instrument, K. Required when reflectance > 0. */
  reflectedTemperatureK?: number;
}

/**
 * Measurement conditions: signal = τ_w·{τ·[ε·S(T_obj) + (1 − ε)·S(T_refl)] + (1 − τ)·S(T_path)}
 * + ρ_w·S(T_int) + (1 − τ_w − ρ_w)·S(T_w).
 */
export interface MeasurementConditions {
  /** Object emissivity ε in (0, 1]. Default 1. */
  emissivity?: number;
  /** Reflected (surroundings) temperature, K. Required when emissivity < 1. */
  reflectedTemperatureK?: number;
  /** Path transmittance τ in (0, 1]. Default 1. */
  pathTransmittance?: number;
  /** Path temperature, K. Required when pathTransmittance < 1. */
  pathTemperatureK?: number;
  /** Optional window. */
  window?: WindowConditions;
}

/** The measurement equation in affine form: signal = gain·S(T_obj) + background. */
export interface AffineForm {
  gain: number;
  background: number;
}

/** Result of a Sakuma–Hattori least-squares fit. */
export interface SakumaHattoriFit {
  curve: SakumaHattoriModel;
  /** RMS of T_curve(S_i) − T_i, K. */
  rmsResidualK: number;
  /** Largest |T_curve(S_i) − T_i|, K. */
  maxAbsResidualK: number;
  /** Levenberg–Marquardt iterations used. */
  iterations: number;
  /** T_curve(S_i) − T_i per point, K (sakumaHattoriFit only). */
  residualsK?: Float64Array;
}

/** Largest interpolation error of a curve against an exact model. */
export interface InterpolationError {
  /** max |T_curve(S_exact(T)) − T|, K. */
  maxErrorK: number;
  /** Temperature where it occurs, K. */
  atTemperatureK: number;
}

/** Response-weighted mean wavelength and spread (standard deviation), in the model's unit. */
export interface ResponseMoments {
  mean: number;
  spread: number;
}

/** An ITS-90 fixed point used as radiance reference. */
export type FixedPoint = "silver" | "gold" | "copper";

/** Temperature of a radiance ratio with both values of c2. */
export interface RatioTemperatures {
  /** With c2 = 0.014388 m·K (ITS-90), K. */
  t90K: number;
  /** With c2 = hc/k (CODATA 2018), K. */
  tCodataK: number;
  /** tCodataK − t90K, K. */
  differenceK: number;
}

/** A ratio (two-colour) reading with its sensitivities. */
export interface RatioReading {
  temperatureK: number;
  /** ∂T/∂r, K per unit ratio. */
  dTdRatio: number;
  /** ∂T/∂(ε1/ε2), K per unit emissivity ratio. */
  dTdEmissivityRatio: number;
}

/** Sensitivity coefficients ∂T_obj/∂x of the object temperature at a reading. */
export interface Sensitivities {
  /** Object temperature, K. */
  temperatureK: number;
  /** K per signal unit. */
  signal: number;
  /** K per unit emissivity. */
  emissivity: number;
  /** K per K of reflected temperature. */
  reflectedTemperature: number;
  /** K per unit path transmittance. */
  pathTransmittance: number;
  /** K per K of path temperature. */
  pathTemperature: number;
}

/** Standard uncertainties of the inputs (all ≥ 0; omitted = 0). */
export interface StandardUncertainties {
  signal?: number;
  emissivity?: number;
  reflectedTemperatureK?: number;
  pathTransmittance?: number;
  pathTemperatureK?: number;
}

/** An input of the uncertainty budget. */
export type BudgetInput =
  | "signal"
  | "emissivity"
  | "reflectedTemperature"
  | "pathTransmittance"
  | "pathTemperature";

/** One row of a GUM uncertainty budget. */
export interface BudgetEntry {
  input: BudgetInput;
  /** ∂T/∂x. */
  sensitivity: number;
  /** u(x). */
  standardUncertainty: number;
  /** |∂T/∂x|·u(x), K. */
  contributionK: number;
  /** Share of the combined variance, 0…1. */
  varianceShare: number;
}

/** A GUM (first-order, uncorrelated inputs) uncertainty budget of the object temperature. */
export interface UncertaintyBudget {
  temperatureK: number;
  entries: BudgetEntry[];
  /** Combined standard uncertainty u_c(T), K. */
  combinedStandardUncertaintyK: number;
}

/** Options of `convertFrame`. */
export interface FrameOptions {
  /** signal = gain·raw + offset (signal in the curve's unit). Default 1. Must be > 0. */
  gain?: number;
  /** Default 0. */
  offset?: number;
  /** Per-frame measurement conditions (scalar emissivity etc.). Default: blackbody in vacuum. */
  conditions?: MeasurementConditions;
  /**
   * Per-pixel emissivity map (same length as the frame), replacing conditions.emissivity.
   * Pixels with ε outside (0, 1] become NaN.
   */
  emissivity?: Float32Array | Float64Array;
  /** Element type of the returned temperatures. Default "float32". */
  output?: "float32" | "float64";
}

/** A converted frame: temperatures in K (NaN for invalid pixels) and counts. */
export interface FrameResult<T extends Float32Array | Float64Array = Float32Array | Float64Array> {
  /** Object temperature per pixel, K, row-major like the input; NaN where invalid. */
  temperaturesK: T;
  /** Pixels converted. */
  valid: number;
  /** Pixels set to NaN (non-finite input, at or below the background, bad emissivity). */
  invalid: number;
  /** Smallest valid temperature, K (NaN when none). */
  minTemperatureK: number;
  /** Largest valid temperature, K (NaN when none). */
  maxTemperatureK: number;
  /** Background signal (reflected, path and window terms) for the scalar emissivity. */
  backgroundSignal: number;
}
"#;

// ---------------------------------------------------------------------------------------------
// Parsing
// ---------------------------------------------------------------------------------------------

/// A parsed `InstrumentModel`, owning its data.
pub(crate) enum Model {
    Point(SpectralPoint),
    Response {
        wavelengths_m: Vec<f64>,
        values: Vec<f64>,
        c2: C2Convention,
        unit: SpectralUnit,
    },
    Curve(SakumaHattori),
}

impl Model {
    /// Calls `f` once with the model as a `SignalModel` (one non-generic function, so the
    /// response-table set-up is not copied into every caller).
    #[inline(never)]
    fn with(&self, f: &mut dyn FnMut(&dyn SignalModel) -> crate::Result<()>) -> crate::Result<()> {
        match self {
            Model::Point(p) => f(p),
            Model::Curve(c) => f(c),
            Model::Response {
                wavelengths_m,
                values,
                c2,
                ..
            } => {
                let r = Response::new(wavelengths_m, values)?;
                f(&ResponseSignal::new(r, *c2))
            }
        }
    }

    /// Runs `f` with the model as a `SignalModel` and returns its result.
    pub(crate) fn run<R>(
        &self,
        f: impl FnOnce(&dyn SignalModel) -> crate::Result<R>,
    ) -> crate::Result<R> {
        let mut f = Some(f);
        let mut out = None;
        self.with(&mut |m| {
            if let Some(f) = f.take() {
                out = Some(f(m)?);
            }
            Ok(())
        })?;
        // `with` always calls the closure exactly once, so `out` is set; no panic path regardless.
        out.ok_or(Error::Unsupported {
            what: "internal: signal model was not evaluated",
        })
    }
}

/// A wavelength unit name (UNKNOWN_UNIT for unknown names, UNSUPPORTED for a non-wavelength unit).
#[inline(never)]
fn wavelength_unit(name: &str) -> Result<SpectralUnit, JsValue> {
    let u = SpectralUnit::parse(name)?;
    if u.kind() != SpectralKind::Wavelength {
        return Err(fail(
            "UNSUPPORTED",
            &[
                "unit must be a wavelength unit (m, mm, um, nm), got \"",
                name,
                "\"",
            ],
        ));
    }
    Ok(u)
}

fn to_m(arg: &'static str, x: f64, unit: SpectralUnit) -> crate::Result<f64> {
    convert_spectral(arg, x, unit, SpectralUnit::Metre)
}

fn from_m(arg: &'static str, x_m: f64, unit: SpectralUnit) -> crate::Result<f64> {
    convert_spectral(arg, x_m, SpectralUnit::Metre, unit)
}

/// Reads an array field given as an Array of numbers or a Float64Array/Float32Array.
#[inline(never)]
fn number_array(what: &str, v: &JsValue) -> Result<Vec<f64>, JsValue> {
    if let Some(a) = v.dyn_ref::<Float64Array>() {
        return Ok(a.to_vec());
    }
    if let Some(a) = v.dyn_ref::<Float32Array>() {
        return Ok(a.to_vec().into_iter().map(f64::from).collect());
    }
    if Array::is_array(v) {
        let a: &Array = v.unchecked_ref();
        let mut out = with_room(a.length() as usize)?;
        for (i, x) in a.iter().enumerate() {
            match x.as_f64() {
                Some(x) => out.push(x),
                None => {
                    return Err(fail(
                        "NON_FINITE",
                        &[
                            what,
                            "[",
                            &decimal(i),
                            "] must be a finite number (at index ",
                            &decimal(i),
                            ")",
                        ],
                    ))
                }
            }
        }
        return Ok(out);
    }
    Err(fail(
        "UNSUPPORTED",
        &[what, " must be a Float64Array or an array of numbers"],
    ))
}

fn required_string(o: &Opts, key: &str, code: &'static str) -> Result<Cow<'static, str>, JsValue> {
    o.string(key, code)?
        .ok_or_else(|| fail(code, &[o.what(), ".", key, " is required"]))
}

const POINT_FIELDS: &[&str] = &["kind", "wavelength", "unit", "c2"];
const CURVE_FIELDS: &[&str] = &["kind", "aM", "bMK", "c", "c2"];

/// `POINT_FIELDS` for the one-call reader, in the order `point_model` reads them.
static POINT_SCHEMA: Schema = Schema {
    id: 1,
    fields: &[
        ("kind", &["spectralPoint"]),
        ("unit", &["m", "mm", "um", "nm"]),
        ("c2", &["codata2018", "its90"]),
        ("wavelength", &[]),
    ],
};

/// `CURVE_FIELDS` for the one-call reader, in the order `curve_model` reads them.
static CURVE_SCHEMA: Schema = Schema {
    id: 2,
    fields: &[
        ("kind", &["sakumaHattori"]),
        ("c2", &["codata2018", "its90"]),
        ("aM", &[]),
        ("bMK", &[]),
        ("c", &[]),
    ],
};

#[inline(never)]
fn point_model(o: &Opts) -> Result<Model, JsValue> {
    let unit = wavelength_unit(&required_string(o, "unit", "UNKNOWN_UNIT")?)?;
    let c2 = parse_c2(
        "SpectralPointModel.c2",
        o.string("c2", "UNSUPPORTED")?.as_deref(),
    )?;
    let wl = to_m("wavelength", o.req_num("wavelength")?, unit)?;
    Ok(Model::Point(SpectralPoint::new(wl, c2)?))
}

#[inline(never)]
fn curve_model(o: &Opts) -> Result<Model, JsValue> {
    let c2 = parse_c2(
        "SakumaHattoriModel.c2",
        o.string("c2", "UNSUPPORTED")?.as_deref(),
    )?;
    Ok(Model::Curve(SakumaHattori::new(
        o.req_num("aM")?,
        o.req_num("bMK")?,
        o.req_num("c")?,
        c2,
    )?))
}

/// Reads and validates an `InstrumentModel`.
#[inline(never)]
pub(crate) fn parse_model(value: &JsValue) -> Result<Model, JsValue> {
    // A well-formed curve or spectral-point model is read in one call into JavaScript; anything
    // else (a response model, a malformed object) field by field below.
    if let Some(o) = Opts::fast_only(value, "SakumaHattoriModel", &CURVE_SCHEMA) {
        if o.string("kind", "UNSUPPORTED")?.is_some() {
            return curve_model(&o);
        }
    }
    if let Some(o) = Opts::fast_only(value, "SpectralPointModel", &POINT_SCHEMA) {
        if o.string("kind", "UNSUPPORTED")?.is_some() {
            return point_model(&o);
        }
    }
    let kind_v = if value.is_object() {
        Reflect::get(value, &JsValue::from_str("kind"))?
    } else {
        JsValue::UNDEFINED
    };
    let kind = kind_v.as_string().unwrap_or_default();
    let k = choose(
        "InstrumentModel.kind",
        &kind,
        &["spectralPoint", "response", "sakumaHattori"],
    )?;
    match k {
        0 => point_model(&Opts::new(value, "SpectralPointModel", POINT_FIELDS)?),
        1 => {
            let o = Opts::new(
                value,
                "ResponseModel",
                &["kind", "wavelengths", "values", "unit", "c2"],
            )?;
            let unit = wavelength_unit(&required_string(&o, "unit", "UNKNOWN_UNIT")?)?;
            let c2 = parse_c2(
                "ResponseModel.c2",
                o.string("c2", "UNSUPPORTED")?.as_deref(),
            )?;
            let wl = number_array("ResponseModel.wavelengths", &o.raw("wavelengths")?)?;
            let values = number_array("ResponseModel.values", &o.raw("values")?)?;
            let mut wavelengths_m = Vec::with_capacity(wl.len());
            for (i, &x) in wl.iter().enumerate() {
                wavelengths_m.push(to_m("wavelengths", x, unit).map_err(|e| at(e, i))?);
            }
            // Validate once here so every later call sees a good table.
            Response::new(&wavelengths_m, &values)?;
            Ok(Model::Response {
                wavelengths_m,
                values,
                c2,
                unit,
            })
        }
        _ => curve_model(&Opts::new(value, "SakumaHattoriModel", CURVE_FIELDS)?),
    }
}

/// Reads `MeasurementConditions` (`undefined` → a blackbody in vacuum).
#[inline(never)]
pub(crate) fn parse_conditions(value: &JsValue) -> Result<Conditions, JsValue> {
    if value.is_undefined() {
        return Ok(Conditions::BLACKBODY);
    }
    let o = Opts::new(
        value,
        "MeasurementConditions",
        &[
            "emissivity",
            "reflectedTemperatureK",
            "pathTransmittance",
            "pathTemperatureK",
            "window",
        ],
    )?;
    let emissivity = o.num("emissivity")?.unwrap_or(1.0);
    let path_transmittance = o.num("pathTransmittance")?.unwrap_or(1.0);
    // A temperature that matters must be given; one that does not (its weight is 0) defaults to
    // the value the core uses for a blackbody (it then has no effect on any result).
    let needed = |key: &str, needed: bool| -> Result<f64, JsValue> {
        match o.num(key)? {
            Some(t) => Ok(t),
            None if !needed => Ok(Conditions::BLACKBODY.reflected_temperature_k),
            None => Err(fail(
                "NON_FINITE",
                &[
                    "MeasurementConditions.",
                    key,
                    " is required when ",
                    if key == "reflectedTemperatureK" {
                        "emissivity < 1"
                    } else {
                        "pathTransmittance < 1"
                    },
                ],
            )),
        }
    };
    let reflected_temperature_k = needed("reflectedTemperatureK", emissivity != 1.0)?;
    let path_temperature_k = needed("pathTemperatureK", path_transmittance != 1.0)?;
    let wv = o.raw("window")?;
    let window = if wv.is_undefined() {
        None
    } else {
        let w = Opts::new(
            &wv,
            "WindowConditions",
            &[
                "transmittance",
                "reflectance",
                "temperatureK",
                "reflectedTemperatureK",
            ],
        )?;
        let reflectance = w.num("reflectance")?.unwrap_or(0.0);
        let temperature_k = w.req_num("temperatureK")?;
        let reflected =
            match w.num("reflectedTemperatureK")? {
                Some(t) => t,
                None if reflectance == 0.0 => temperature_k,
                None => return Err(fail(
                    "NON_FINITE",
                    &["WindowConditions.reflectedTemperatureK is required when reflectance > 0"],
                )),
            };
        Some(Window {
            transmittance: w.req_num("transmittance")?,
            reflectance,
            temperature_k,
            reflected_temperature_k: reflected,
        })
    };
    let c = Conditions {
        emissivity,
        reflected_temperature_k,
        path_transmittance,
        path_temperature_k,
        window,
    };
    c.validate()?;
    Ok(c)
}

fn c2_name(c2_mk: f64) -> &'static str {
    if c2_mk == C2Convention::Its90.c2() {
        "its90"
    } else {
        "codata2018"
    }
}

#[inline(never)]
fn curve_object(c: &SakumaHattori) -> JsValue {
    object(
        "aM;bMK;c",
        &[c.a_m(), c.b_mk(), c.c()],
        &[
            ("kind", &JsValue::from_str("sakumaHattori")),
            ("c2", &JsValue::from_str(c2_name(c.c2_mk()))),
        ],
    )
}

#[inline(never)]
fn fit_object(r: &FitReport, residuals: Option<Vec<f64>>) -> JsValue {
    let curve = curve_object(&r.curve);
    let res: JsValue = match residuals {
        Some(res) => Float64Array::from(res.as_slice()).into(),
        None => JsValue::UNDEFINED,
    };
    let extra: &[(&str, &JsValue)] = if res.is_undefined() {
        &[("curve", &curve)]
    } else {
        &[("curve", &curve), ("residualsK", &res)]
    };
    object(
        "rmsResidualK;maxAbsResidualK;iterations",
        &[
            r.rms_residual_k,
            r.max_abs_residual_k,
            f64::from(r.iterations),
        ],
        extra,
    )
}

fn ratio_object(r: &RatioReading) -> JsValue {
    object(
        "temperatureK;dTdRatio;dTdEmissivityRatio",
        &[r.temperature_k, r.d_t_d_ratio, r.d_t_d_emissivity_ratio],
        &[],
    )
}

/// The wavelength unit and c2 convention arguments of the ratio functions.
#[inline(never)]
fn unit_and_c2(unit: &JsValue, c2: &JsValue) -> Result<(SpectralUnit, C2Convention), JsValue> {
    let unit = &js_string(unit, "unit", "UNKNOWN_UNIT")?;
    let c2 = opt_js_string(c2, "c2", "UNSUPPORTED")?;
    Ok((wavelength_unit(unit)?, c2_arg(c2)?))
}

fn parse_fixed_point(name: &str) -> Result<FixedPoint, JsValue> {
    Ok(
        match choose("fixedPoint", name, &["silver", "gold", "copper"])? {
            0 => FixedPoint::Silver,
            1 => FixedPoint::Gold,
            _ => FixedPoint::Copper,
        },
    )
}

fn c2_arg(c2: Option<String>) -> Result<C2Convention, JsValue> {
    parse_c2("c2", c2.as_deref())
}

/// `nPoints` as a count in [2, 1e7] (OUT_OF_RANGE otherwise, so no call can run for hours).
fn count(arg: &'static str, n: f64) -> Result<usize, JsValue> {
    finite(arg, n)?;
    if (0.0..=1.0e7).contains(&n) && (n as usize) as f64 == n {
        // exact: an integer in [0, 1e7] converts without loss
        Ok(n as usize)
    } else {
        Err(Error::OutOfRange {
            arg,
            value: n,
            range: "integers in [0, 10000000]",
        }
        .into())
    }
}

// ---------------------------------------------------------------------------------------------
// Signal models
// ---------------------------------------------------------------------------------------------

/// The per-value operations on an instrument model, shared by the scalar and array exports (one
/// out-of-line copy of the model and conditions parsing for all of them).
#[derive(Clone, Copy)]
enum ModelOp {
    /// S(T)
    Signal,
    /// dS/dT
    SignalDT,
    /// T(S)
    Temperature,
    /// measured signal of an object at T, one value (the core's measurement equation)
    Measured,
    /// object temperature of a reading, one value (the core's inverse)
    Object,
    /// `Measured` over an array: the affine form computed once
    MeasuredBulk,
    /// `Object` over an array: the affine form computed once
    ObjectBulk,
}

/// `op` for every element of `xs` under `model` (and `conditions` for the measurement ops).
#[inline(never)]
fn model_op(
    op: ModelOp,
    model: &JsValue,
    conditions: &JsValue,
    xs: &[f64],
) -> Result<Vec<f64>, JsValue> {
    let m = parse_model(model)?;
    let c = match op {
        ModelOp::Signal | ModelOp::SignalDT | ModelOp::Temperature => Conditions::BLACKBODY,
        _ => parse_conditions(conditions)?,
    };
    let mut out = Ok(Vec::new());
    m.run(|sm| {
        let (gain, bg) = match op {
            ModelOp::MeasuredBulk | ModelOp::ObjectBulk => c.affine(sm)?,
            _ => (1.0, 0.0),
        };
        out = map_indexed(xs, &|x| match op {
            ModelOp::Signal => sm.signal(x),
            ModelOp::SignalDT => sm.d_signal_dt(x),
            ModelOp::Temperature => sm.temperature(x),
            ModelOp::Measured => core_measured_signal(sm, x, &c),
            ModelOp::Object => core_object_temperature(sm, x, &c),
            ModelOp::MeasuredBulk => {
                temperature("object_temperature_k", x)?;
                Ok(gain * sm.signal(x)? + bg)
            }
            ModelOp::ObjectBulk => {
                // the same steps as thermometry::object_temperature, with the affine form hoisted
                finite("signal", x)?;
                let net = x - bg;
                if net.is_nan() || net <= 0.0 {
                    return Err(Error::NoPhysicalSolution {
                        signal: x,
                        background: bg,
                    });
                }
                let s_obj = positive("signal", net / gain)?;
                sm.temperature(s_obj)
            }
        });
        Ok(())
    })?;
    out
}

/// `model_op` for one value: its result, or the error without a bulk index.
#[inline(never)]
fn model_op_one(
    op: ModelOp,
    model: &JsValue,
    conditions: &JsValue,
    x: f64,
) -> Result<f64, JsValue> {
    let m = parse_model(model)?;
    let c = match op {
        ModelOp::Measured | ModelOp::Object => parse_conditions(conditions)?,
        _ => Conditions::BLACKBODY,
    };
    Ok(m.run(|sm| match op {
        ModelOp::SignalDT => sm.d_signal_dt(x),
        ModelOp::Temperature => sm.temperature(x),
        ModelOp::Measured => core_measured_signal(sm, x, &c),
        ModelOp::Object => core_object_temperature(sm, x, &c),
        _ => sm.signal(x),
    })?)
}

/// Blackbody signal S(T) of an instrument model at `temperatureK` (in the model's signal unit).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, model errors (UNKNOWN_UNIT,
/// UNSUPPORTED, NON_POSITIVE_SPECTRAL, LENGTH_MISMATCH, TOO_FEW_POINTS, NOT_INCREASING,
/// OUT_OF_RANGE, NON_POSITIVE).
#[wasm_bindgen(js_name = modelSignal)]
pub fn model_signal(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    model_op_one(ModelOp::Signal, &model, &JsValue::UNDEFINED, temperature_k)
}

/// dS/dT of an instrument model at `temperatureK` (signal unit per K).
///
/// @throws {QuantabandError} as `modelSignal`.
#[wasm_bindgen(js_name = modelSignalDT)]
pub fn model_signal_dt(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    model_op_one(
        ModelOp::SignalDT,
        &model,
        &JsValue::UNDEFINED,
        temperature_k,
    )
}

/// Blackbody temperature (K) at which the model gives `signal` (inverse of `modelSignal`).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE (signal ≤ 0), NO_SOLUTION, NOT_CONVERGED,
/// model errors.
#[wasm_bindgen(js_name = modelTemperature)]
pub fn model_temperature(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signal: f64,
) -> Result<f64, JsValue> {
    model_op_one(ModelOp::Temperature, &model, &JsValue::UNDEFINED, signal)
}

/// `modelSignal` for every temperature of `temperaturesK` (K), one call.
///
/// @throws {QuantabandError} as `modelSignal`; `index` is the first bad temperature.
#[wasm_bindgen(js_name = modelSignalArray)]
pub fn model_signal_array(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
) -> Result<Vec<f64>, JsValue> {
    model_op(ModelOp::Signal, &model, &JsValue::UNDEFINED, temperatures_k)
}

/// `modelTemperature` for every signal of `signals`, one call.
///
/// @throws {QuantabandError} as `modelTemperature`; `index` is the first bad signal.
#[wasm_bindgen(js_name = modelTemperatureArray)]
pub fn model_temperature_array(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signals: &[f64],
) -> Result<Vec<f64>, JsValue> {
    model_op(ModelOp::Temperature, &model, &JsValue::UNDEFINED, signals)
}

// ---------------------------------------------------------------------------------------------
// Measurement equation
// ---------------------------------------------------------------------------------------------

/// The signal an instrument reads from an object at `objectTemperatureK` under `conditions`
/// (emissivity, reflected surroundings, path, window). Omitted conditions = blackbody in vacuum.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, OUT_OF_RANGE (ε, τ, window),
/// UNSUPPORTED (unknown field), model errors.
#[wasm_bindgen(js_name = measuredSignal)]
pub fn measured_signal(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = objectTemperatureK)] object_temperature_k: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<f64, JsValue> {
    model_op_one(ModelOp::Measured, &model, &conditions, object_temperature_k)
}

/// Object temperature (K) that explains a reading `signal` under `conditions` — the inverse of
/// the measurement equation.
///
/// @throws {QuantabandError} NO_PHYSICAL_SOLUTION (signal ≤ reflected + path contribution),
/// NO_SOLUTION, NON_FINITE, OUT_OF_RANGE, model errors.
#[wasm_bindgen(js_name = objectTemperature)]
pub fn object_temperature(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signal: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<f64, JsValue> {
    model_op_one(ModelOp::Object, &model, &conditions, signal)
}

/// `objectTemperature` for every reading of `signals` (e.g. the pixels of a frame already in
/// signal units), one call; the affine form of the conditions is computed once.
///
/// @throws {QuantabandError} as `objectTemperature`; `index` is the first bad reading.
#[wasm_bindgen(js_name = objectTemperatureArray)]
pub fn object_temperature_array(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signals: &[f64],
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<Vec<f64>, JsValue> {
    model_op(ModelOp::ObjectBulk, &model, &conditions, signals)
}

/// `measuredSignal` for every object temperature of `objectTemperaturesK` (K), one call.
///
/// @throws {QuantabandError} as `measuredSignal`; `index` is the first bad temperature.
#[wasm_bindgen(js_name = measuredSignalArray)]
pub fn measured_signal_array(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = objectTemperaturesK)] object_temperatures_k: &[f64],
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<Vec<f64>, JsValue> {
    model_op(
        ModelOp::MeasuredBulk,
        &model,
        &conditions,
        object_temperatures_k,
    )
}

/// The measurement equation in affine form for a model: signal = gain·S(T_obj) + background.
///
/// @throws {QuantabandError} as `measuredSignal`.
#[wasm_bindgen(js_name = measurementAffine, unchecked_return_type = "AffineForm")]
pub fn measurement_affine(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<JsValue, JsValue> {
    let m = parse_model(&model)?;
    let c = parse_conditions(&conditions)?;
    let (gain, bg) = m.run(|sm| c.affine(sm))?;
    Ok(object("gain;background", &[gain, bg], &[]))
}

// ---------------------------------------------------------------------------------------------
// Spectral responses
// ---------------------------------------------------------------------------------------------

/// Calls `f` once with the response model's `ResponseSignal` and coordinate unit (one
/// non-generic function; UNSUPPORTED for another model kind).
#[inline(never)]
fn with_response_dyn(
    model: &JsValue,
    f: &mut dyn FnMut(&ResponseSignal<'_>, SpectralUnit) -> crate::Result<()>,
) -> Result<(), JsValue> {
    match parse_model(model)? {
        Model::Response {
            wavelengths_m,
            values,
            c2,
            unit,
        } => {
            let r = Response::new(&wavelengths_m, &values)?;
            Ok(f(&ResponseSignal::new(r, c2), unit)?)
        }
        _ => Err(fail(
            "UNSUPPORTED",
            &["this function needs a ResponseModel (kind \"response\")"],
        )),
    }
}

fn with_response<R>(
    model: &JsValue,
    f: impl FnOnce(&ResponseSignal<'_>, SpectralUnit) -> crate::Result<R>,
) -> Result<R, JsValue> {
    let mut f = Some(f);
    let mut out = None;
    with_response_dyn(model, &mut |rs, unit| {
        if let Some(f) = f.take() {
            out = Some(f(rs, unit)?);
        }
        Ok(())
    })?;
    // `with_response_dyn` calls the closure exactly once on success; no panic path regardless.
    out.ok_or_else(|| {
        Error::Unsupported {
            what: "internal: response model was not evaluated",
        }
        .into()
    })
}

/// The per-response-table operations, shared by their exports (one out-of-line copy).
#[derive(Clone, Copy)]
enum ResponseOp {
    /// mean and spread of R(λ)
    ResponseMoments,
    /// mean and spread of R(λ)·L_λ(λ, T = a)
    SignalMoments,
    /// λ_T at T = a
    Limiting,
    /// λ_e between T1 = a and T2 = b
    Effective,
    /// R(λ = a)
    ValueAt,
}

/// `op` on a response model: two numbers in the model's unit (the second 0 when unused).
#[inline(never)]
fn response_op(op: ResponseOp, model: &JsValue, a: f64, b: f64) -> Result<[f64; 2], JsValue> {
    let mut out = [0.0; 2];
    with_response_dyn(model, &mut |rs, unit| {
        out = match op {
            ResponseOp::ResponseMoments | ResponseOp::SignalMoments => {
                let (m, s) = match op {
                    ResponseOp::ResponseMoments => rs.response().mean_and_spread_m()?,
                    _ => rs.mean_and_spread_m(a)?,
                };
                [from_m("mean", m, unit)?, s / unit.si_factor()]
            }
            ResponseOp::Limiting => [
                from_m("wavelength", rs.limiting_effective_wavelength_m(a)?, unit)?,
                0.0,
            ],
            ResponseOp::Effective => [
                from_m("wavelength", rs.effective_wavelength_m(a, b)?, unit)?,
                0.0,
            ],
            ResponseOp::ValueAt => [rs.response().value_at(to_m("wavelength", a, unit)?)?, 0.0],
        };
        Ok(())
    })?;
    Ok(out)
}

/// Mean wavelength and spread (standard deviation) of the response table itself, weighted by
/// R(λ) alone, in the model's unit.
///
/// @throws {QuantabandError} model errors; UNSUPPORTED for a non-response model.
#[wasm_bindgen(js_name = responseMoments, unchecked_return_type = "ResponseMoments")]
pub fn response_moments(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
) -> Result<JsValue, JsValue> {
    let [m, sd] = response_op(ResponseOp::ResponseMoments, &model, 0.0, 0.0)?;
    Ok(object("mean;spread", &[m, sd], &[]))
}

/// Mean wavelength of the signal R(λ)·L_λ(λ, T) at `temperatureK`, and its spread, in the
/// model's unit.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, model errors.
#[wasm_bindgen(js_name = signalMoments, unchecked_return_type = "ResponseMoments")]
pub fn signal_moments(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<JsValue, JsValue> {
    let [m, sd] = response_op(ResponseOp::SignalMoments, &model, temperature_k, 0.0)?;
    Ok(object("mean;spread", &[m, sd], &[]))
}

/// Limiting effective wavelength λ_T = c2/(T²·d ln S/dT) at `temperatureK` — the wavelength of
/// a Wien-law monochromatic thermometer with the same relative sensitivity — in the model's unit.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, model errors.
#[wasm_bindgen(js_name = limitingEffectiveWavelength)]
pub fn limiting_effective_wavelength(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(response_op(ResponseOp::Limiting, &model, temperature_k, 0.0)?[0])
}

/// Effective wavelength λ_e = c2·(1/T1 − 1/T2)/ln(S(T2)/S(T1)) between `t1K` and `t2K` — the
/// wavelength of a Wien-law thermometer giving the same signal ratio — in the model's unit.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, model errors.
#[wasm_bindgen(js_name = effectiveWavelength)]
pub fn effective_wavelength(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
    #[wasm_bindgen(js_name = t1K)] t1_k: f64,
    #[wasm_bindgen(js_name = t2K)] t2_k: f64,
) -> Result<f64, JsValue> {
    Ok(response_op(ResponseOp::Effective, &model, t1_k, t2_k)?[0])
}

/// Value of the response table at one wavelength (in the model's unit): linear interpolation,
/// 0 outside the table.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, model errors.
#[wasm_bindgen(js_name = responseValueAt)]
pub fn response_value_at(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
    wavelength: f64,
) -> Result<f64, JsValue> {
    Ok(response_op(ResponseOp::ValueAt, &model, wavelength, 0.0)?[0])
}

// ---------------------------------------------------------------------------------------------
// Sakuma–Hattori curves
// ---------------------------------------------------------------------------------------------

/// Least-squares Sakuma–Hattori curve through calibration points (`temperaturesK`, K, and
/// `signals`, same length, at least 3, signals increasing with temperature).
///
/// @throws {QuantabandError} LENGTH_MISMATCH, TOO_FEW_POINTS, NON_FINITE,
/// NON_POSITIVE_TEMPERATURE, NON_POSITIVE, DEGENERATE_FIT, NOT_CONVERGED, UNSUPPORTED (c2).
#[wasm_bindgen(js_name = sakumaHattoriFit, unchecked_return_type = "SakumaHattoriFit")]
pub fn sakuma_hattori_fit(
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
    signals: &[f64],
    #[wasm_bindgen(unchecked_optional_param_type = "C2Convention")] c2: JsValue,
) -> Result<JsValue, JsValue> {
    let c2 = opt_js_string(&c2, "c2", "UNSUPPORTED")?;
    let c2 = c2_arg(c2)?;
    let mut res = with_room(temperatures_k.len())?;
    res.resize(temperatures_k.len(), 0.0);
    let r = SakumaHattori::fit(temperatures_k, signals, c2, Some(&mut res))?;
    Ok(fit_object(&r, Some(res)))
}

/// Least-squares Sakuma–Hattori curve for an exact model over [`tMinK`, `tMaxK`] (16 points
/// evenly spaced in 1/T).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, DEGENERATE_FIT (tMinK ≥
/// tMaxK), NOT_CONVERGED, model errors.
#[wasm_bindgen(js_name = sakumaHattoriFitModel, unchecked_return_type = "SakumaHattoriFit")]
pub fn sakuma_hattori_fit_model(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    #[wasm_bindgen(js_name = tMinK)] t_min_k: f64,
    #[wasm_bindgen(js_name = tMaxK)] t_max_k: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "C2Convention")] c2: JsValue,
) -> Result<JsValue, JsValue> {
    let c2 = opt_js_string(&c2, "c2", "UNSUPPORTED")?;
    let c2 = c2_arg(c2)?;
    let m = parse_model(&model)?;
    let r = m.run(|sm| SakumaHattori::fit_model(sm, t_min_k, t_max_k, c2))?;
    Ok(fit_object(&r, None))
}

/// Sakuma–Hattori curve from the response table's moments (exact at `referenceTemperatureK`;
/// a starting approximation, second order in spread/mean).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, DEGENERATE_FIT, model errors.
#[wasm_bindgen(js_name = sakumaHattoriFromResponse, unchecked_return_type = "SakumaHattoriModel")]
pub fn sakuma_hattori_from_response(
    #[wasm_bindgen(unchecked_param_type = "ResponseModel")] model: JsValue,
    #[wasm_bindgen(js_name = referenceTemperatureK)] reference_temperature_k: f64,
) -> Result<JsValue, JsValue> {
    let c = with_response(&model, |rs, _| {
        SakumaHattori::from_response(rs, reference_temperature_k)
    })?;
    Ok(curve_object(&c))
}

/// Largest interpolation error max |T_curve(S_exact(T)) − T| of `curve` against `exact` on
/// `nPoints` temperatures evenly spaced in [`tMinK`, `tMaxK`].
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, TOO_FEW_POINTS,
/// OUT_OF_RANGE (nPoints not an integer ≤ 1e7), DEGENERATE_FIT, model errors.
#[wasm_bindgen(js_name = maxInterpolationError, unchecked_return_type = "InterpolationError")]
pub fn max_interpolation_error(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] curve: JsValue,
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] exact: JsValue,
    #[wasm_bindgen(js_name = tMinK)] t_min_k: f64,
    #[wasm_bindgen(js_name = tMaxK)] t_max_k: f64,
    #[wasm_bindgen(js_name = nPoints)] n_points: f64,
) -> Result<JsValue, JsValue> {
    let n = count("nPoints", n_points)?;
    let c = parse_model(&curve)?;
    let e = parse_model(&exact)?;
    let (err, at_t) =
        c.run(|cm| e.run(|em| max_interpolation_error_k(cm, em, t_min_k, t_max_k, n)))?;
    Ok(object("maxErrorK;atTemperatureK", &[err, at_t], &[]))
}

// ---------------------------------------------------------------------------------------------
// ITS-90 and ratio thermometry
// ---------------------------------------------------------------------------------------------

/// Assigned ITS-90 temperature T90 of a fixed point, K (silver 1234.93, gold 1337.33, copper
/// 1357.77).
///
/// @throws {QuantabandError} UNSUPPORTED (unknown fixed point).
#[wasm_bindgen(js_name = fixedPointTemperature)]
pub fn fixed_point_temperature(
    #[wasm_bindgen(js_name = fixedPoint, unchecked_param_type = "FixedPoint")] fixed_point: JsValue,
) -> Result<f64, JsValue> {
    let fixed_point = &js_string(&fixed_point, "fixed_point", "UNSUPPORTED")?;
    Ok(parse_fixed_point(fixed_point)?.temperature_k())
}

/// Temperature (K) whose spectral radiance at `wavelength` (in `unit`) is `ratio` times that at
/// `referenceTemperatureK` (ITS-90 radiance-ratio equation, Planck form).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE, NON_POSITIVE_SPECTRAL,
/// NON_POSITIVE_TEMPERATURE, UNKNOWN_UNIT, UNSUPPORTED, NO_SOLUTION.
#[wasm_bindgen(js_name = temperatureFromRatio)]
pub fn temperature_from_ratio(
    ratio: f64,
    wavelength: f64,
    #[wasm_bindgen(unchecked_param_type = "WavelengthUnit")] unit: JsValue,
    #[wasm_bindgen(js_name = referenceTemperatureK)] reference_temperature_k: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "C2Convention")] c2: JsValue,
) -> Result<f64, JsValue> {
    let (u, c2) = unit_and_c2(&unit, &c2)?;
    let wl = to_m("wavelength", wavelength, u)?;
    Ok(its90::temperature_from_ratio(
        ratio,
        wl,
        reference_temperature_k,
        c2,
    )?)
}

/// Spectral-radiance ratio L(λ, T)/L(λ, T_ref) at `wavelength` (in `unit`).
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL, NON_POSITIVE_TEMPERATURE,
/// UNKNOWN_UNIT, UNSUPPORTED.
#[wasm_bindgen(js_name = radianceRatio)]
pub fn radiance_ratio(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
    wavelength: f64,
    #[wasm_bindgen(unchecked_param_type = "WavelengthUnit")] unit: JsValue,
    #[wasm_bindgen(js_name = referenceTemperatureK)] reference_temperature_k: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "C2Convention")] c2: JsValue,
) -> Result<f64, JsValue> {
    let (u, c2) = unit_and_c2(&unit, &c2)?;
    let wl = to_m("wavelength", wavelength, u)?;
    Ok(its90::radiance_ratio(
        temperature_k,
        wl,
        reference_temperature_k,
        c2,
    )?)
}

/// T90 from a radiance ratio to an ITS-90 fixed point at `wavelength` (in `unit`), with the same
/// equation evaluated with the CODATA 2018 c2 for comparison.
///
/// @throws {QuantabandError} as `temperatureFromRatio`; UNSUPPORTED (fixed point).
#[wasm_bindgen(js_name = its90Temperature, unchecked_return_type = "RatioTemperatures")]
pub fn its90_temperature(
    ratio: f64,
    wavelength: f64,
    #[wasm_bindgen(unchecked_param_type = "WavelengthUnit")] unit: JsValue,
    #[wasm_bindgen(js_name = fixedPoint, unchecked_param_type = "FixedPoint")] fixed_point: JsValue,
) -> Result<JsValue, JsValue> {
    let unit = &js_string(&unit, "unit", "UNKNOWN_UNIT")?;
    let fixed_point = &js_string(&fixed_point, "fixed_point", "UNSUPPORTED")?;
    let u = wavelength_unit(unit)?;
    let fp = parse_fixed_point(fixed_point)?;
    let wl = to_m("wavelength", wavelength, u)?;
    let r = its90::its90_temperature(ratio, wl, fp)?;
    Ok(object(
        "t90K;tCodataK;differenceK",
        &[r.t90_k, r.t_codata_k, r.difference_k],
        &[],
    ))
}

/// Temperature from a two-channel signal ratio S1/S2 and the emissivity ratio ε1/ε2, with
/// sensitivities. Channel 1 must be the shorter-wavelength one. `guessK` starts the search.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE, NON_POSITIVE_TEMPERATURE, UNSUPPORTED
/// (channel order), NO_SOLUTION, model errors.
#[wasm_bindgen(js_name = ratioTemperature, unchecked_return_type = "RatioReading")]
pub fn ratio_temperature(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] channel1: JsValue,
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] channel2: JsValue,
    ratio: f64,
    #[wasm_bindgen(js_name = emissivityRatio)] emissivity_ratio: f64,
    #[wasm_bindgen(js_name = guessK)] guess_k: f64,
) -> Result<JsValue, JsValue> {
    let a = parse_model(&channel1)?;
    let b = parse_model(&channel2)?;
    let r =
        a.run(|am| b.run(|bm| core_ratio_temperature(am, bm, ratio, emissivity_ratio, guess_k)))?;
    Ok(ratio_object(&r))
}

/// Two-colour (Wien-free, Planck) temperature from a spectral-radiance ratio L(λ1)/L(λ2) at two
/// wavelengths (in `unit`) and the emissivity ratio ε1/ε2.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE, NON_POSITIVE_SPECTRAL, UNKNOWN_UNIT,
/// UNSUPPORTED, NO_SOLUTION.
#[wasm_bindgen(js_name = twoColourTemperature, unchecked_return_type = "RatioReading")]
pub fn two_colour_temperature(
    wavelength1: f64,
    wavelength2: f64,
    #[wasm_bindgen(unchecked_param_type = "WavelengthUnit")] unit: JsValue,
    ratio: f64,
    #[wasm_bindgen(js_name = emissivityRatio)] emissivity_ratio: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "C2Convention")] c2: JsValue,
) -> Result<JsValue, JsValue> {
    let (u, c2) = unit_and_c2(&unit, &c2)?;
    let l1 = to_m("wavelength1", wavelength1, u)?;
    let l2 = to_m("wavelength2", wavelength2, u)?;
    Ok(ratio_object(&core_two_colour(
        l1,
        l2,
        ratio,
        emissivity_ratio,
        c2,
    )?))
}

// ---------------------------------------------------------------------------------------------
// Uncertainty
// ---------------------------------------------------------------------------------------------

/// Sensitivity coefficients ∂T_obj/∂x of the object temperature at a reading `signal` under
/// `conditions` (x = signal, emissivity, reflected temperature, path transmittance, path
/// temperature).
///
/// @throws {QuantabandError} as `objectTemperature`.
#[wasm_bindgen(js_name = sensitivities, unchecked_return_type = "Sensitivities")]
pub fn sensitivities(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signal: f64,
    #[wasm_bindgen(unchecked_optional_param_type = "MeasurementConditions")] conditions: JsValue,
) -> Result<JsValue, JsValue> {
    let m = parse_model(&model)?;
    let c = parse_conditions(&conditions)?;
    let s = m.run(|sm| core_sensitivities(sm, signal, &c))?;
    Ok(object(
        "temperatureK;signal;emissivity;reflectedTemperature;pathTransmittance;pathTemperature",
        &[
            s.temperature_k,
            s.signal,
            s.emissivity,
            s.reflected_temperature,
            s.path_transmittance,
            s.path_temperature,
        ],
        &[],
    ))
}

/// GUM uncertainty budget (first order, uncorrelated inputs) of the object temperature at a
/// reading `signal` under `conditions`, from the standard uncertainties of the inputs.
///
/// @throws {QuantabandError} as `objectTemperature`; NON_FINITE / OUT_OF_RANGE for a negative
/// or non-finite uncertainty; UNSUPPORTED (unknown field).
#[wasm_bindgen(js_name = uncertaintyBudget, unchecked_return_type = "UncertaintyBudget")]
pub fn uncertainty_budget(
    #[wasm_bindgen(unchecked_param_type = "InstrumentModel")] model: JsValue,
    signal: f64,
    #[wasm_bindgen(unchecked_param_type = "MeasurementConditions | undefined")] conditions: JsValue,
    #[wasm_bindgen(unchecked_param_type = "StandardUncertainties")] uncertainties: JsValue,
) -> Result<JsValue, JsValue> {
    let m = parse_model(&model)?;
    let c = parse_conditions(&conditions)?;
    let o = Opts::new(
        &uncertainties,
        "StandardUncertainties",
        &[
            "signal",
            "emissivity",
            "reflectedTemperatureK",
            "pathTransmittance",
            "pathTemperatureK",
        ],
    )?;
    let u = StandardUncertainties {
        signal: o.num("signal")?.unwrap_or(0.0),
        emissivity: o.num("emissivity")?.unwrap_or(0.0),
        reflected_temperature_k: o.num("reflectedTemperatureK")?.unwrap_or(0.0),
        path_transmittance: o.num("pathTransmittance")?.unwrap_or(0.0),
        path_temperature_k: o.num("pathTemperatureK")?.unwrap_or(0.0),
    };
    let b = m.run(|sm| core_budget(sm, signal, &c, &u))?;
    let entries = Array::new();
    for e in b.entries.iter() {
        let input = match e.input {
            BudgetInput::Signal => "signal",
            BudgetInput::Emissivity => "emissivity",
            BudgetInput::ReflectedTemperature => "reflectedTemperature",
            BudgetInput::PathTransmittance => "pathTransmittance",
            BudgetInput::PathTemperature => "pathTemperature",
        };
        entries.push(&object(
            "sensitivity;standardUncertainty;contributionK;varianceShare",
            &[
                e.sensitivity,
                e.standard_uncertainty,
                e.contribution_k,
                e.variance_share,
            ],
            &[("input", &JsValue::from_str(input))],
        ));
    }
    Ok(object(
        "temperatureK;combinedStandardUncertaintyK",
        &[b.temperature_k, b.combined_standard_uncertainty_k],
        &[("entries", &entries.into())],
    ))
}

// ---------------------------------------------------------------------------------------------
// Frames
// ---------------------------------------------------------------------------------------------

/// Reads a frame's pixels into f64 (one copy out of JS memory, widening u16/f32 exactly), so
/// that only the f64 instantiation of the core's pixel loop is compiled into the module.
#[inline(never)]
fn frame_pixels(raw: &JsValue) -> Result<Vec<f64>, JsValue> {
    if let Some(a) = raw.dyn_ref::<Uint16Array>() {
        Ok(a.to_vec().into_iter().map(f64::from).collect())
    } else if let Some(a) = raw.dyn_ref::<Float32Array>() {
        Ok(a.to_vec().into_iter().map(f64::from).collect())
    } else if let Some(a) = raw.dyn_ref::<Float64Array>() {
        Ok(a.to_vec())
    } else {
        Err(fail(
            "UNSUPPORTED",
            &["raw must be a Uint16Array, Float32Array or Float64Array"],
        ))
    }
}

/// Converts a whole frame of raw values (camera counts as a Uint16Array, or signals as a
/// Float32Array/Float64Array; row-major, any shape) to object temperatures through a
/// Sakuma–Hattori calibration curve and the measurement equation, in one call. signal =
/// gain·raw + offset. Invalid pixels (non-finite, at or below the background, emissivity outside
/// (0, 1]) become NaN and are counted; they do not throw.
///
/// Caution: a thermal image converted this way is a calculation from the given emissivity and
/// conditions, not a substitute for a calibrated instrument; never use it for medical or fever
/// screening.
///
/// @throws {QuantabandError} UNSUPPORTED (raw not a Uint16Array/Float32Array/Float64Array,
/// unknown option), LENGTH_MISMATCH (emissivity map), NON_POSITIVE (gain), NON_FINITE,
/// OUT_OF_RANGE (conditions), NO_SOLUTION (constants overflow), curve errors.
#[wasm_bindgen(js_name = convertFrame, unchecked_return_type = "FrameResult")]
pub fn convert_frame(
    #[wasm_bindgen(unchecked_param_type = "SakumaHattoriModel")] curve: JsValue,
    #[wasm_bindgen(unchecked_param_type = "Uint16Array | Float32Array | Float64Array")]
    raw: JsValue,
    #[wasm_bindgen(unchecked_optional_param_type = "FrameOptions")] options: JsValue,
) -> Result<JsValue, JsValue> {
    let sh = match parse_model(&curve)? {
        Model::Curve(c) => c,
        _ => return Err(fail("UNSUPPORTED", &["convertFrame needs a SakumaHattoriModel curve (fit one with sakumaHattoriFitModel)"])),
    };
    // an empty options object only when none was passed (not one per call)
    let empty;
    let ov = if options.is_undefined() {
        empty = JsValue::from(Object::new());
        &empty
    } else {
        &options
    };
    let o = Opts::new(
        ov,
        "FrameOptions",
        &["gain", "offset", "conditions", "emissivity", "output"],
    )?;
    let gain = o.num("gain")?.unwrap_or(1.0);
    let offset = o.num("offset")?.unwrap_or(0.0);
    let conditions = parse_conditions(&o.raw("conditions")?)?;
    let ev = o.raw("emissivity")?;
    let eps = if ev.is_undefined() {
        None
    } else if let Some(a) = ev.dyn_ref::<Float32Array>() {
        Some(a.to_vec().into_iter().map(f64::from).collect::<Vec<f64>>())
    } else if let Some(a) = ev.dyn_ref::<Float64Array>() {
        Some(a.to_vec())
    } else {
        return Err(fail(
            "UNSUPPORTED",
            &["FrameOptions.emissivity must be a Float32Array or Float64Array"],
        ));
    };
    let f64_out = match o.string("output", "UNSUPPORTED")? {
        None => false,
        Some(v) => choose("FrameOptions.output", &v, &["float32", "float64"])? == 1,
    };
    let conv = FrameConverter::new(&sh, &conditions, gain, offset)?;
    // Counts or f32 signals to f32 without an emissivity map (the camera case): straight from
    // the typed array's copy into the returned array's buffer, through the core's
    // single-precision loop (None when the frame constants do not suit that loop or a pixel
    // needs f64: the f64 loop below runs instead).
    if let (None, false) = (&eps, f64_out) {
        let counts = raw.dyn_ref::<Uint16Array>().map(|a| a.to_vec());
        let signals = raw.dyn_ref::<Float32Array>().map(|a| a.to_vec());
        if counts.is_some() || signals.is_some() {
            let (counts, signals) = (counts.unwrap_or_default(), signals.unwrap_or_default());
            let n = counts.len() + signals.len();
            let mut out32: Vec<f32> = with_room(n)?;
            out32.resize(n, 0.0);
            if let Some(sum) = conv.convert_f32(&counts, &signals, &mut out32) {
                return Ok(frame_result(
                    Float32Array::from(out32.as_slice()).into(),
                    &sum,
                    sum.min_temperature_k,
                    sum.max_temperature_k,
                    conv.background(),
                ));
            }
        }
    }
    let pixels = frame_pixels(&raw)?;
    let mut out = with_room(pixels.len())?;
    out.resize(pixels.len(), 0.0f64);
    let sum = match eps.as_deref() {
        None => conv.convert(&pixels, &mut out)?,
        Some(e) => conv.convert_with_emissivity(&pixels, e, &mut out)?,
    };
    let (temps, lo, hi): (JsValue, f64, f64) = if f64_out {
        (
            Float64Array::from(out.as_slice()).into(),
            sum.min_temperature_k,
            sum.max_temperature_k,
        )
    } else {
        // Rounding to f32 is monotone, so the extremes of the rounded frame are the rounded
        // extremes (identical to the core's f32 output path).
        let mut out32: Vec<f32> = with_room(out.len())?;
        out32.extend(out.iter().map(|&t| t as f32));
        (
            Float32Array::from(out32.as_slice()).into(),
            f64::from(sum.min_temperature_k as f32),
            f64::from(sum.max_temperature_k as f32),
        )
    };
    Ok(frame_result(temps, &sum, lo, hi, conv.background()))
}

/// The `FrameResult` object of [`convert_frame`].
fn frame_result(
    temps: JsValue,
    sum: &crate::thermometry::frame::FrameSummary,
    lo: f64,
    hi: f64,
    bg: f64,
) -> JsValue {
    object(
        "valid;invalid;minTemperatureK;maxTemperatureK;backgroundSignal",
        &[sum.valid as f64, sum.invalid as f64, lo, hi, bg],
        &[("temperaturesK", &temps)],
    )
}
