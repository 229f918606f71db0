//! Planck spectra, band quantities and their inverses for JavaScript.
//!
//! Every function takes a `SpectrumOptions` object. Spectral coordinates (points, band limits,
//! peak positions) are in `options.unit`; densities are in SI per the SI unit of
//! `options.variable` (per m, per m⁻¹ or per Hz — see `spectrumUnits`).

#[allow(unused_imports)]
use super::prelude::*;

use wasm_bindgen::prelude::*;

use super::error::{at, fail, map_indexed, with_room};
use super::opts::{choose, Opts, Schema};
use crate::constants::C2Convention;
use crate::error as core_error;
use crate::planck::{self, Geometry, Quantity, SpectralVariable, Spectrum};
use crate::units::{convert_spectral, SpectralKind, SpectralUnit};

#[wasm_bindgen(typescript_custom_section)]
const TS_SPECTRUM: &str = r#"
/** The variable a spectral density is "per": per metre of wavelength, per m⁻¹ of wavenumber, per hertz. */
export type SpectralVariable = "wavelength" | "wavenumber" | "frequency";
/** Radiant energy (W) or photon number (photons/s). */
export type Quantity = "energy" | "photon";
/** Radiance (per steradian) or hemispherical exitance (radiance × π). */
export type Geometry = "radiance" | "exitance";
/** Second radiation constant: CODATA 2018 hc/k, or 0.014388 m·K exactly as fixed by ITS-90. */
export type C2Convention = "codata2018" | "its90";

/** Which Planck spectrum, and the unit of spectral coordinates passed and returned. */
export interface SpectrumOptions {
  /**
   * Unit of every spectral coordinate given to or returned by a function taking these options
   * (points, band limits, peak positions). Required.
   */
  unit: SpectralUnit;
  /**
   * What the density is per. Default: the kind of `unit` (wavelength units → "wavelength",
   * wavenumber → "wavenumber", frequency → "frequency"). Required when `unit` is a photon-energy
   * unit (J, eV, meV), since there is no per-energy density here.
   */
  variable?: SpectralVariable;
  /** Default "energy". */
  quantity?: Quantity;
  /** Default "radiance". */
  geometry?: Geometry;
  /** Grey-body emissivity in (0, 1]. Default 1. */
  emissivity?: number;
  /** Refractive index of the medium radiated into (> 0; enters as n²). Default 1. */
  refractiveIndex?: number;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** A spectral band; limits in the `unit` of the SpectrumOptions it is used with. */
export interface Band {
  lower: number;
  upper: number;
}

/** SI unit labels (plain text) of the results for a given SpectrumOptions. */
export interface SpectrumUnits {
  /** Unit of spectral coordinates (= options.unit, canonical spelling). */
  coordinate: string;
  /** Unit of spectralDensity, e.g. "W m^-2 sr^-1 m^-1". */
  spectralDensity: string;
  /** Unit of spectralDensityDT (density per kelvin). */
  spectralDensityDT: string;
  /** Unit of spectrumTotal and bandIntegral, e.g. "W m^-2 sr^-1". */
  total: string;
  /** Unit of spectrumTotalDT and bandIntegralDT (per kelvin). */
  totalDT: string;
}

/** A dimensionless Planck integrand (see planckIntegral). */
export type PlanckKernel = "photon" | "energy" | "photonDerivative" | "energyDerivative";
"#;

const SPECTRUM_FIELDS: &[&str] = &[
    "unit",
    "variable",
    "quantity",
    "geometry",
    "emissivity",
    "refractiveIndex",
    "c2",
];

/// `SPECTRUM_FIELDS` for the one-call reader, in the order `parse_spectrum` reads them. The unit
/// choices are the canonical names of `SpectralUnit::ALL` (an alias such as "µm" takes the
/// field-by-field path).
static SPECTRUM_SCHEMA: Schema = Schema {
    id: 0,
    fields: &[
        (
            "unit",
            &[
                "m", "mm", "um", "nm", "m-1", "cm-1", "Hz", "kHz", "MHz", "GHz", "THz", "J", "eV",
                "meV",
            ],
        ),
        ("variable", &["wavelength", "wavenumber", "frequency"]),
        ("quantity", &["energy", "photon"]),
        ("geometry", &["radiance", "exitance"]),
        ("c2", &["codata2018", "its90"]),
        ("emissivity", &[]),
        ("refractiveIndex", &[]),
    ],
};

/// A parsed `SpectrumOptions`: the core spectrum plus the user's coordinate unit.
pub(crate) struct Spec {
    pub(crate) spectrum: Spectrum,
    pub(crate) unit: SpectralUnit,
    /// The SI unit of the spectrum's variable.
    pub(crate) si: SpectralUnit,
}

pub(crate) fn variable_kind(v: SpectralVariable) -> SpectralKind {
    match v {
        SpectralVariable::Wavelength => SpectralKind::Wavelength,
        SpectralVariable::Wavenumber => SpectralKind::Wavenumber,
        SpectralVariable::Frequency => SpectralKind::Frequency,
    }
}

/// Reads a `C2Convention` string.
pub(crate) fn parse_c2(what: &str, s: Option<&str>) -> Result<C2Convention, JsValue> {
    Ok(match s {
        None => C2Convention::Codata2018,
        Some(s) => match choose(what, s, &["codata2018", "its90"])? {
            0 => C2Convention::Codata2018,
            _ => C2Convention::Its90,
        },
    })
}

/// Reads and validates a `SpectrumOptions` object.
#[inline(never)]
pub(crate) fn parse_spectrum(value: &JsValue) -> Result<Spec, JsValue> {
    let o = Opts::with_schema(value, "SpectrumOptions", SPECTRUM_FIELDS, &SPECTRUM_SCHEMA)?;
    let unit_name = o.string("unit", "UNKNOWN_UNIT")?.ok_or_else(|| {
        fail(
            "UNKNOWN_UNIT",
            &["SpectrumOptions.unit is required (a spectral unit such as \"um\")"],
        )
    })?;
    let unit = SpectralUnit::parse(&unit_name)?;
    let variable =
        match o.string("variable", "UNSUPPORTED")? {
            Some(v) => match choose(
                "SpectrumOptions.variable",
                &v,
                &["wavelength", "wavenumber", "frequency"],
            )? {
                0 => SpectralVariable::Wavelength,
                1 => SpectralVariable::Wavenumber,
                _ => SpectralVariable::Frequency,
            },
            None => match unit.kind() {
                SpectralKind::Wavelength => SpectralVariable::Wavelength,
                SpectralKind::Wavenumber => SpectralVariable::Wavenumber,
                SpectralKind::Frequency => SpectralVariable::Frequency,
                SpectralKind::PhotonEnergy => return Err(fail(
                    "UNSUPPORTED",
                    &[
                        "SpectrumOptions.variable is required when unit is a photon-energy unit \
                     (J, eV, meV): choose \"wavelength\", \"wavenumber\" or \"frequency\"",
                    ],
                )),
            },
        };
    let quantity = match o.string("quantity", "UNSUPPORTED")? {
        None => Quantity::Energy,
        Some(q) => match choose("SpectrumOptions.quantity", &q, &["energy", "photon"])? {
            0 => Quantity::Energy,
            _ => Quantity::Photon,
        },
    };
    let geometry = match o.string("geometry", "UNSUPPORTED")? {
        None => Geometry::Radiance,
        Some(g) => match choose("SpectrumOptions.geometry", &g, &["radiance", "exitance"])? {
            0 => Geometry::Radiance,
            _ => Geometry::Exitance,
        },
    };
    let c2 = parse_c2(
        "SpectrumOptions.c2",
        o.string("c2", "UNSUPPORTED")?.as_deref(),
    )?;
    let spectrum = Spectrum {
        variable,
        quantity,
        geometry,
        emissivity: o.num("emissivity")?.unwrap_or(1.0),
        refractive_index: o.num("refractiveIndex")?.unwrap_or(1.0),
        c2,
    };
    spectrum.validate()?;
    Ok(Spec {
        spectrum,
        unit,
        si: variable_kind(variable).si_unit(),
    })
}

impl Spec {
    /// A coordinate in the user's unit → SI of the spectrum's variable.
    pub(crate) fn user_to_si(&self, arg: &'static str, x: f64) -> crate::Result<f64> {
        convert_spectral(arg, x, self.unit, self.si)
    }

    /// A coordinate in SI of the spectrum's variable → the user's unit.
    pub(crate) fn si_to_user(&self, arg: &'static str, x_si: f64) -> crate::Result<f64> {
        convert_spectral(arg, x_si, self.si, self.unit)
    }
}

/// The single-spectrum operations, shared by the scalar and array exports (one out-of-line copy
/// of the option parsing and error plumbing for all of them).
#[derive(Clone, Copy)]
enum SpecOp {
    Density,
    DensityDT,
    Total,
    TotalDT,
    Peak,
}

impl SpecOp {
    /// The operation at point `x` (user unit; unused by the totals and the peak) and `t` (K).
    fn eval(self, s: &Spec, x: f64, t: f64) -> crate::Result<f64> {
        match self {
            SpecOp::Density => s.spectrum.spectral(s.user_to_si("x", x)?, t),
            SpecOp::DensityDT => s.spectrum.spectral_d_dt(s.user_to_si("x", x)?, t),
            SpecOp::Total => s.spectrum.total(t),
            SpecOp::TotalDT => s.spectrum.total_d_dt(t),
            SpecOp::Peak => s.si_to_user("peak", s.spectrum.peak(t)?),
        }
    }
}

#[inline(never)]
fn spec_scalar(op: SpecOp, options: &JsValue, x: f64, t: f64) -> Result<f64, JsValue> {
    let s = parse_spectrum(options)?;
    Ok(op.eval(&s, x, t)?)
}

#[inline(never)]
fn spec_array(op: SpecOp, options: &JsValue, xs: &[f64], t: f64) -> Result<Vec<f64>, JsValue> {
    let s = parse_spectrum(options)?;
    core_error::temperature("temperature_k", t)?;
    map_indexed(xs, &|x| op.eval(&s, x, t))
}

/// Spectral density of a (grey-body) Planck spectrum at one point `x` (in `options.unit`) and
/// temperature `temperatureK` (K). Result in SI per the SI unit of `options.variable`, e.g.
/// W·m⁻²·sr⁻¹·m⁻¹ for energy radiance per wavelength (README "Conventions"; `spectrumUnits`
/// gives the labels).
///
/// Example: `spectralDensity({ unit: "um" }, 10, 300)` → 9.924e6 W·m⁻²·sr⁻¹·m⁻¹.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_SPECTRAL (x ≤ 0), NON_POSITIVE_TEMPERATURE,
/// OUT_OF_RANGE (emissivity), NON_POSITIVE (refractiveIndex), UNKNOWN_UNIT, UNSUPPORTED (bad
/// option field or value).
#[wasm_bindgen(js_name = spectralDensity)]
pub fn spectral_density(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    x: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    spec_scalar(SpecOp::Density, &options, x, temperature_k)
}

/// ∂/∂T of `spectralDensity` (density unit per kelvin).
///
/// @throws {QuantabandError} as `spectralDensity`.
#[wasm_bindgen(js_name = spectralDensityDT)]
pub fn spectral_density_dt(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    x: f64,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    spec_scalar(SpecOp::DensityDT, &options, x, temperature_k)
}

/// Spectral density at every point of `xs` (in `options.unit`) at one temperature (K), in one
/// call. Returns a new Float64Array of the same length.
///
/// @throws {QuantabandError} as `spectralDensity`; `index` is the first bad element of `xs`.
#[wasm_bindgen(js_name = spectralDensityArray)]
pub fn spectral_density_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    xs: &[f64],
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<Vec<f64>, JsValue> {
    spec_array(SpecOp::Density, &options, xs, temperature_k)
}

/// ∂/∂T of the spectral density at every point of `xs`, one temperature (K).
///
/// @throws {QuantabandError} as `spectralDensityArray`.
#[wasm_bindgen(js_name = spectralDensityDTArray)]
pub fn spectral_density_dt_array(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    xs: &[f64],
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<Vec<f64>, JsValue> {
    spec_array(SpecOp::DensityDT, &options, xs, temperature_k)
}

/// Spectral density on a grid: every point of `xs` (in `options.unit`) × every temperature of
/// `temperaturesK` (K). Returns ONE Float64Array of length `temperaturesK.length * xs.length`,
/// row-major with one row per temperature: `out[i * xs.length + j] = density(xs[j],
/// temperaturesK[i])`.
///
/// @throws {QuantabandError} as `spectralDensity`. A bad temperature reports its index in
/// `temperaturesK`; a bad spectral point its index in `xs` (the message says which array).
#[wasm_bindgen(js_name = spectralDensityGrid)]
pub fn spectral_density_grid(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    xs: &[f64],
    #[wasm_bindgen(js_name = temperaturesK)] temperatures_k: &[f64],
) -> Result<Vec<f64>, JsValue> {
    let s = parse_spectrum(&options)?;
    let mut xs_si = with_room(xs.len())?;
    for (j, &x) in xs.iter().enumerate() {
        xs_si.push(s.user_to_si("xs", x).map_err(|e| at(e, j))?);
    }
    for (i, &t) in temperatures_k.iter().enumerate() {
        core_error::temperature("temperaturesK", t).map_err(|e| at(e, i))?;
    }
    let mut out = with_room(xs.len().saturating_mul(temperatures_k.len()))?;
    for &t in temperatures_k {
        for (j, &x) in xs_si.iter().enumerate() {
            out.push(s.spectrum.spectral(x, t).map_err(|e| at(e, j))?);
        }
    }
    Ok(out)
}

/// The spectrum integrated over its whole spectral range: total radiance (W·m⁻²·sr⁻¹), total
/// exitance (W·m⁻²) or their photon counterparts (photons·s⁻¹·m⁻²[·sr⁻¹]) at `temperatureK`.
/// `options.unit` and `variable` do not affect the result.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE, option errors.
#[wasm_bindgen(js_name = spectrumTotal)]
pub fn spectrum_total(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    spec_scalar(SpecOp::Total, &options, 1.0, temperature_k)
}

/// ∂/∂T of `spectrumTotal` (per kelvin).
///
/// @throws {QuantabandError} as `spectrumTotal`.
#[wasm_bindgen(js_name = spectrumTotalDT)]
pub fn spectrum_total_dt(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    spec_scalar(SpecOp::TotalDT, &options, 1.0, temperature_k)
}

/// Position of the maximum of the spectral density (per `options.variable`), returned in
/// `options.unit`. Note the peak depends on the variable: per-frequency and per-wavelength
/// densities peak at different places (Wien: 2897.77 µm·K per wavelength, energy).
///
/// @throws {QuantabandError} as `spectrumTotal`.
#[wasm_bindgen(js_name = spectrumPeak)]
pub fn spectrum_peak(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    spec_scalar(SpecOp::Peak, &options, 1.0, temperature_k)
}

/// Plain-text SI unit labels of the results for these options (for axis labels and tables).
///
/// @throws {QuantabandError} option errors.
#[wasm_bindgen(js_name = spectrumUnits, unchecked_return_type = "SpectrumUnits")]
pub fn spectrum_units(
    #[wasm_bindgen(unchecked_param_type = "SpectrumOptions")] options: JsValue,
) -> Result<JsValue, JsValue> {
    let s = parse_spectrum(&options)?;
    let base = match (s.spectrum.quantity, s.spectrum.geometry) {
        (Quantity::Energy, Geometry::Radiance) => "W m^-2 sr^-1",
        (Quantity::Energy, Geometry::Exitance) => "W m^-2",
        (Quantity::Photon, Geometry::Radiance) => "s^-1 m^-2 sr^-1",
        (Quantity::Photon, Geometry::Exitance) => "s^-1 m^-2",
    };
    let per = match s.spectrum.variable {
        SpectralVariable::Wavelength => "m^-1",
        SpectralVariable::Wavenumber => "m",
        SpectralVariable::Frequency => "Hz^-1",
    };
    let o = js_sys::Object::new();
    for (k, v) in [
        ("coordinate", s.unit.name().to_string()),
        ("spectralDensity", [base, " ", per].concat()),
        ("spectralDensityDT", [base, " ", per, " K^-1"].concat()),
        ("total", base.to_string()),
        ("totalDT", [base, " K^-1"].concat()),
    ] {
        let _ = js_sys::Reflect::set(&o, &JsValue::from_str(k), &JsValue::from_str(&v));
    }
    Ok(o.into())
}

/// Photon number density of blackbody radiation in a cavity, m⁻³, at `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = photonNumberDensity)]
pub fn photon_number_density(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(planck::photon_number_density(temperature_k)?)
}

/// Energy density u = aT⁴ of blackbody radiation in a cavity, J·m⁻³, at `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = energyDensity)]
pub fn energy_density(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(planck::energy_density(temperature_k)?)
}

/// Mean photon energy of blackbody radiation, J, at `temperatureK`.
///
/// @throws {QuantabandError} NON_FINITE, NON_POSITIVE_TEMPERATURE.
#[wasm_bindgen(js_name = meanPhotonEnergy)]
pub fn mean_photon_energy(
    #[wasm_bindgen(js_name = temperatureK)] temperature_k: f64,
) -> Result<f64, JsValue> {
    Ok(planck::mean_photon_energy_j(temperature_k)?)
}
