//! Property-based fuzz of the radiometric core: `constants`, `error`, `planck`, `band`,
//! `inverse`, `units` and `definition`. Every public function and method is called with
//! adversarial arguments; see `tests/common/mod.rs` for the properties and the generators.
//!
//! Methods are called in the fully qualified form (`Spectrum::spectral(&s, …)`) so that
//! `tests/fuzz_inventory.rs` can check from the text that each one is exercised.

mod common;

use common::{arg, args, check, check_err, fuzz, ok, slice, special, Arg, Inf};
use proptest::prelude::*;
use quantaband::band::{
    self, band_d_dt, band_fraction, fraction_below, lambda_t_at_fraction, photon_fraction_below,
    photon_lambda_t_at_fraction, planck_integral, planck_integral_lower, planck_integral_upper,
    PlanckKernel,
};
use quantaband::constants::C2Convention;
use quantaband::definition::{
    variable_kind, InstrumentModel, MeasurementConditions, PreparedModel, ResponseTable,
    SpectrumSettings, WindowDefinition,
};
use quantaband::inverse::{
    brightness_temperature, temperature_from_band, temperature_from_band_ratio,
    temperature_from_spectral,
};
use quantaband::planck::{self, Geometry, Quantity, SpectralVariable, Spectrum};
use quantaband::thermometry::SignalModel;
use quantaband::units::{
    convert_spectral, convert_spectral_checked, convert_temperature,
    convert_temperature_difference, d_star_to_jones, jones_to_d_star, power_ratio_from_decibels,
    power_ratio_to_decibels, SpectralKind, SpectralUnit, TemperatureUnit,
};
use quantaband::Error;

// ---------------------------------------------------------------------------------------------
// Generators

fn c2s() -> impl Strategy<Value = C2Convention> {
    prop::sample::select(vec![C2Convention::Codata2018, C2Convention::Its90])
}

fn variables() -> impl Strategy<Value = SpectralVariable> {
    prop::sample::select(vec![
        SpectralVariable::Wavelength,
        SpectralVariable::Wavenumber,
        SpectralVariable::Frequency,
    ])
}

fn quantities() -> impl Strategy<Value = Quantity> {
    prop::sample::select(vec![Quantity::Energy, Quantity::Photon])
}

fn geometries() -> impl Strategy<Value = Geometry> {
    prop::sample::select(vec![Geometry::Radiance, Geometry::Exitance])
}

fn kernels() -> impl Strategy<Value = PlanckKernel> {
    prop::sample::select(vec![
        PlanckKernel::Photon,
        PlanckKernel::Energy,
        PlanckKernel::PhotonDerivative,
        PlanckKernel::EnergyDerivative,
    ])
}

const SPECTRAL_UNITS: &[SpectralUnit] = &[
    SpectralUnit::Metre,
    SpectralUnit::Millimetre,
    SpectralUnit::Micrometre,
    SpectralUnit::Nanometre,
    SpectralUnit::PerMetre,
    SpectralUnit::PerCentimetre,
    SpectralUnit::Hertz,
    SpectralUnit::Kilohertz,
    SpectralUnit::Megahertz,
    SpectralUnit::Gigahertz,
    SpectralUnit::Terahertz,
    SpectralUnit::Joule,
    SpectralUnit::Electronvolt,
    SpectralUnit::Millielectronvolt,
];

fn spectral_units() -> impl Strategy<Value = SpectralUnit> {
    prop::sample::select(SPECTRAL_UNITS)
}

fn temperature_units() -> impl Strategy<Value = TemperatureUnit> {
    prop::sample::select(vec![
        TemperatureUnit::Kelvin,
        TemperatureUnit::Celsius,
        TemperatureUnit::Fahrenheit,
        TemperatureUnit::Rankine,
    ])
}

fn spectral_kinds() -> impl Strategy<Value = SpectralKind> {
    prop::sample::select(vec![
        SpectralKind::Wavelength,
        SpectralKind::Wavenumber,
        SpectralKind::Frequency,
        SpectralKind::PhotonEnergy,
    ])
}

/// Emissivity: (0, 1].
fn emissivity() -> Arg {
    arg(0.01, 1.0).edges(&[0.0, 1.0])
}

/// Refractive index: (0, ∞).
fn refractive_index() -> Arg {
    arg(1.0, 4.0).edges(&[0.0])
}

/// Temperature, K, with the inverses' search bounds.
fn temperature() -> Arg {
    arg(1e-2, 1e5).edges(&[0.0, 1e-3, 1e7, 1e9])
}

/// A spectral coordinate in the SI unit of `v`, typical over 100 nm … 1 mm.
fn coordinate(v: SpectralVariable) -> Arg {
    match v {
        SpectralVariable::Wavelength => arg(1e-7, 1e-3).edges(&[0.0]),
        SpectralVariable::Wavenumber => arg(1e3, 1e7).edges(&[0.0]),
        SpectralVariable::Frequency => arg(3e11, 3e15).edges(&[0.0]),
    }
}

/// A spectrum built through the public builder methods (every one of them is thereby called),
/// with an emissivity and refractive index that are sometimes invalid.
fn spectra() -> impl Strategy<Value = Spectrum> {
    (
        variables(),
        quantities(),
        geometries(),
        c2s(),
        emissivity().any(),
        refractive_index().any(),
        variables(),
        quantities(),
        geometries(),
    )
        .prop_map(|(v, q, g, c2, e, n, v2, q2, g2)| {
            let s = Spectrum::new(v2, q2, g2);
            let s = Spectrum::with_variable(s, v);
            let s = Spectrum::with_quantity(s, q);
            let s = Spectrum::with_geometry(s, g);
            let s = Spectrum::with_c2(s, c2);
            let s = Spectrum::with_emissivity(s, e);
            Spectrum::with_refractive_index(s, n)
        })
}

/// A spectrum and `n` values for its spectral coordinate plus `extra` further arguments.
fn spectrum_and(n: usize, extra: Vec<Arg>) -> impl Strategy<Value = (Spectrum, Vec<f64>)> {
    spectra().prop_flat_map(move |s| {
        let mut list: Vec<Arg> = (0..n).map(|_| coordinate(s.variable)).collect();
        list.extend(extra.iter().cloned());
        (Just(s), args(&list))
    })
}

// ---------------------------------------------------------------------------------------------
// constants, error

#[test]
fn fuzz_constants_and_error_codes() {
    fuzz("constants", 64, (c2s(), special()), |(c2, v)| {
        let c = C2Convention::c2(c2);
        prop_assert!(c.is_finite() && c > 0.0);
        // Error::code and Display on every variant family the core produces.
        let errors = [
            Error::NonFinite { arg: "x", value: v },
            Error::NonPositiveTemperature { arg: "t", value: v },
            Error::OutOfRange {
                arg: "x",
                value: v,
                range: "(0, 1]",
            },
            Error::InvalidBand {
                lower: v,
                upper: -v,
            },
            Error::LengthMismatch {
                expected: usize::MAX,
                got: 0,
            },
            Error::NotIncreasing {
                arg: "x",
                index: usize::MAX,
            },
        ];
        for e in &errors {
            let code = Error::code(e);
            prop_assert!(!code.is_empty());
            check_err("Error", e)?;
        }
        Ok(())
    });
}

// ---------------------------------------------------------------------------------------------
// planck

// planck.rs module docs: "Results below the smallest subnormal return 0, results above
// `f64::MAX` return `f64::INFINITY`; neither is an error."
const PLANCK_INF: Inf = Inf::Documented;

#[test]
fn fuzz_spectrum_methods() {
    fuzz(
        "Spectrum methods",
        3000,
        spectrum_and(1, vec![temperature()]),
        |(s, v)| {
            let (x, t) = (v[0], v[1]);
            check("Spectrum::validate", &Spectrum::validate(&s), Inf::Never)?;
            check(
                "SpectralVariable::arg_name",
                &Ok::<_, Error>(SpectralVariable::arg_name(s.variable)),
                Inf::Never,
            )?;
            check(
                "Spectrum::spectral",
                &Spectrum::spectral(&s, x, t),
                PLANCK_INF,
            )?;
            check(
                "Spectrum::spectral_d_dt",
                &Spectrum::spectral_d_dt(&s, x, t),
                PLANCK_INF,
            )?;
            check("Spectrum::total", &Spectrum::total(&s, t), PLANCK_INF)?;
            check(
                "Spectrum::total_d_dt",
                &Spectrum::total_d_dt(&s, t),
                PLANCK_INF,
            )?;
            check("Spectrum::peak", &Spectrum::peak(&s, t), PLANCK_INF)?;
            Ok(())
        },
    );
}

#[test]
fn fuzz_planck_free_functions() {
    let lambda = arg(1e-7, 1e-3).edges(&[0.0]);
    let sigma = arg(1e3, 1e7).edges(&[0.0]);
    let nu = arg(3e11, 3e15).edges(&[0.0]);
    fuzz(
        "planck free functions",
        2500,
        args(&[lambda, sigma, nu, temperature()]),
        |v| {
            let (l, s, f, t) = (v[0], v[1], v[2], v[3]);
            let i = PLANCK_INF;
            check(
                "spectral_radiance_wavelength",
                &planck::spectral_radiance_wavelength(l, t),
                i,
            )?;
            check(
                "spectral_radiance_wavenumber",
                &planck::spectral_radiance_wavenumber(s, t),
                i,
            )?;
            check(
                "spectral_radiance_frequency",
                &planck::spectral_radiance_frequency(f, t),
                i,
            )?;
            check(
                "spectral_photon_radiance_wavelength",
                &planck::spectral_photon_radiance_wavelength(l, t),
                i,
            )?;
            check(
                "spectral_photon_radiance_frequency",
                &planck::spectral_photon_radiance_frequency(f, t),
                i,
            )?;
            check(
                "spectral_photon_radiance_wavenumber",
                &planck::spectral_photon_radiance_wavenumber(s, t),
                i,
            )?;
            check(
                "d_spectral_radiance_wavenumber_dt",
                &planck::d_spectral_radiance_wavenumber_dt(s, t),
                i,
            )?;
            check(
                "spectral_exitance_wavelength",
                &planck::spectral_exitance_wavelength(l, t),
                i,
            )?;
            check(
                "d_spectral_radiance_wavelength_dt",
                &planck::d_spectral_radiance_wavelength_dt(l, t),
                i,
            )?;
            check(
                "d_spectral_radiance_frequency_dt",
                &planck::d_spectral_radiance_frequency_dt(f, t),
                i,
            )?;
            check("total_exitance", &planck::total_exitance(t), i)?;
            check("total_radiance", &planck::total_radiance(t), i)?;
            check(
                "total_photon_exitance",
                &planck::total_photon_exitance(t),
                i,
            )?;
            check(
                "photon_number_density",
                &planck::photon_number_density(t),
                i,
            )?;
            check("energy_density", &planck::energy_density(t), i)?;
            check("mean_photon_energy_j", &planck::mean_photon_energy_j(t), i)?;
            check("peak_wavelength_m", &planck::peak_wavelength_m(t), i)?;
            check("peak_frequency_hz", &planck::peak_frequency_hz(t), i)?;
            check(
                "peak_photon_wavelength_m",
                &planck::peak_photon_wavelength_m(t),
                i,
            )?;
            check(
                "peak_photon_frequency_hz",
                &planck::peak_photon_frequency_hz(t),
                i,
            )?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// band

#[test]
fn fuzz_band_functions() {
    fuzz(
        "band",
        1500,
        spectrum_and(2, vec![temperature()]),
        |(s, v)| {
            let (a, b, t) = (v[0].min(v[1]), v[0].max(v[1]), v[2]);
            // Both orders: the reversed one must be an error or finite, never a panic.
            for (lo, hi) in [(a, b), (b, a)] {
                // band docs: "values above `f64::MAX` (e.g. with n² beyond the f64 range)
                // return +∞"; band_d_dt: "As for [`band`]".
                check("band", &band::band(&s, lo, hi, t), Inf::Documented)?;
                check("band_d_dt", &band_d_dt(&s, lo, hi, t), Inf::Documented)?;
                ok("band_fraction", &band_fraction(&s, lo, hi, t))?;
            }
            // Open-ended band (upper limit f64::MAX), as the design module uses it.
            check(
                "band open",
                &band::band(&s, a, f64::MAX, t),
                Inf::Documented,
            )?;
            Ok(())
        },
    );
}

#[test]
fn fuzz_band_dimensionless() {
    let lambda_t = arg(1e-5, 1.0).edges(&[0.0]);
    let fraction = arg(0.0, 1.0).edges(&[0.0, 1.0, 1e-300, 1.0 - 1e-16]);
    let x = arg(1e-3, 800.0).edges(&[0.0, 2.0, 1e4]);
    fuzz(
        "band dimensionless",
        2500,
        (kernels(), args(&[lambda_t, fraction, x.clone(), x])),
        |(k, v)| {
            let (lt, f, x1, x2) = (v[0], v[1], v[2], v[3]);
            let total = PlanckKernel::total(k);
            prop_assert!(total.is_finite() && total > 0.0);
            ok("fraction_below", &fraction_below(lt))?;
            ok("photon_fraction_below", &photon_fraction_below(lt))?;
            ok("lambda_t_at_fraction", &lambda_t_at_fraction(f))?;
            ok(
                "photon_lambda_t_at_fraction",
                &photon_lambda_t_at_fraction(f),
            )?;
            ok("planck_integral", &planck_integral(k, x1, x2))?;
            ok(
                "planck_integral",
                &planck_integral(k, x1.min(x2), x1.max(x2)),
            )?;
            ok("planck_integral_upper", &planck_integral_upper(k, x1))?;
            ok("planck_integral_lower", &planck_integral_lower(k, x2))?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// inverse

#[test]
fn fuzz_inverse() {
    // Values are drawn around a forward value at a typical temperature, so that most cases
    // have a solution; the adversarial ones do not.
    let value = arg(1e-30, 1e30).edges(&[0.0]);
    let ratio = arg(1e-6, 1e6).edges(&[0.0, 1.0]);
    fuzz(
        "inverse",
        700,
        spectrum_and(4, vec![temperature(), value, ratio.clone(), ratio]),
        |(s, v)| {
            let (x, t, value, ratio, e_ratio) = (v[0], v[4], v[5], v[6], v[7]);
            let b1 = (v[0].min(v[1]), v[0].max(v[1]));
            let b2 = (v[2].min(v[3]), v[2].max(v[3]));
            ok(
                "temperature_from_spectral",
                &temperature_from_spectral(&s, x, value),
            )?;
            ok(
                "brightness_temperature",
                &brightness_temperature(&s, x, value),
            )?;
            ok(
                "temperature_from_band",
                &temperature_from_band(&s, b1.0, b1.1, value),
            )?;
            ok(
                "temperature_from_band_ratio",
                &temperature_from_band_ratio(&s, b1, b2, ratio, e_ratio),
            )?;
            // Round-trip shaped inputs: the forward value at t.
            if let Ok(l) = Spectrum::spectral(&s, x, t) {
                ok(
                    "temperature_from_spectral (forward)",
                    &temperature_from_spectral(&s, x, l),
                )?;
                ok(
                    "brightness_temperature (forward)",
                    &brightness_temperature(&s, x, l),
                )?;
            }
            if let (Ok(l1), Ok(l2)) = (band::band(&s, b1.0, b1.1, t), band::band(&s, b2.0, b2.1, t))
            {
                ok(
                    "temperature_from_band (forward)",
                    &temperature_from_band(&s, b1.0, b1.1, l1),
                )?;
                ok(
                    "temperature_from_band_ratio (forward)",
                    &temperature_from_band_ratio(&s, b1, b2, l1 / l2, e_ratio),
                )?;
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// units

#[test]
fn fuzz_units() {
    let value = arg(1e-12, 1e16).edges(&[0.0]);
    let temp = arg(-500.0, 5000.0).edges(&[0.0, -273.15, -459.67, 273.15, 459.67]);
    let names = prop::sample::select(vec![
        "m", "mm", "um", "µm", "nm", "cm-1", "1/m", "Hz", "kHz", "MHz", "GHz", "THz", "J", "eV",
        "meV", "K", "degC", "°C", "degF", "°F", "R", "", " ", "M", "mhz", "\u{0}", "nm ",
    ])
    .prop_map(String::from);
    let free_text = ".{0,6}";
    fuzz(
        "units",
        4000,
        (
            (
                spectral_units(),
                spectral_units(),
                spectral_kinds(),
                spectral_kinds(),
            ),
            (temperature_units(), temperature_units()),
            args(&[value, temp]),
            prop_oneof![names, free_text.prop_map(|s: String| s)],
        ),
        |((u1, u2, k1, k2), (t1, t2), v, name)| {
            let (x, t) = (v[0], v[1]);
            // convert_si: "A result beyond the f64 range is ∞ or 0 only when the true value is."
            check(
                "SpectralKind::convert_si",
                &SpectralKind::convert_si(k1, "x", x, k2),
                Inf::Documented,
            )?;
            prop_assert!(!SpectralKind::name(k1).is_empty());
            let _ = SpectralKind::si_unit(k1);
            ok("SpectralUnit::parse", &SpectralUnit::parse(&name))?;
            ok("TemperatureUnit::parse", &TemperatureUnit::parse(&name))?;
            prop_assert!(!SpectralUnit::name(u1).is_empty());
            let _ = SpectralUnit::kind(u1);
            let factor = SpectralUnit::si_factor(u1);
            prop_assert!(factor.is_finite() && factor > 0.0);
            ok("SpectralUnit::to_si", &SpectralUnit::to_si(u1, "x", x))?;
            // from_si: "A result beyond the f64 range is +∞ or 0 only when the true value is."
            check(
                "SpectralUnit::from_si",
                &SpectralUnit::from_si(u1, "x", x),
                Inf::Documented,
            )?;
            // convert_spectral: "A valid input whose true result lies outside the f64 range
            // gives ∞ or 0."
            check(
                "convert_spectral",
                &convert_spectral("x", x, u1, u2),
                Inf::Documented,
            )?;
            ok(
                "convert_spectral_checked",
                &convert_spectral_checked("x", x, u1, u2),
            )?;
            prop_assert!(!TemperatureUnit::name(t1).is_empty());
            ok(
                "TemperatureUnit::to_kelvin",
                &TemperatureUnit::to_kelvin(t1, "t", t),
            )?;
            // from_kelvin, difference_from_kelvin and the two conversions through them: "A result
            // beyond the f64 range (°F or °R above `f64::MAX`/1.8 K) is +∞" (±∞ for differences).
            let d = Inf::Documented;
            check(
                "TemperatureUnit::from_kelvin",
                &TemperatureUnit::from_kelvin(t1, "t", t),
                d,
            )?;
            ok(
                "TemperatureUnit::difference_to_kelvin",
                &TemperatureUnit::difference_to_kelvin(t1, "t", t),
            )?;
            check(
                "TemperatureUnit::difference_from_kelvin",
                &TemperatureUnit::difference_from_kelvin(t1, "t", t),
                d,
            )?;
            check(
                "convert_temperature",
                &convert_temperature("t", t, t1, t2),
                d,
            )?;
            check(
                "convert_temperature_difference",
                &convert_temperature_difference("t", t, t1, t2),
                d,
            )?;
            // D* ↔ Jones and decibels: a result beyond the f64 range is OUT_OF_RANGE, never ∞.
            ok("d_star_to_jones", &d_star_to_jones(x))?;
            ok("jones_to_d_star", &jones_to_d_star(x))?;
            ok(
                "power_ratio_from_decibels",
                &power_ratio_from_decibels("y", t),
            )?;
            ok("power_ratio_to_decibels", &power_ratio_to_decibels("y", x))?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// definition

fn option_of(a: Arg) -> impl Strategy<Value = Option<f64>> {
    prop::option::weighted(0.7, a.any())
}

fn window_definitions() -> impl Strategy<Value = Option<WindowDefinition>> {
    prop::option::weighted(
        0.4,
        (
            emissivity().any(),
            option_of(arg(0.0, 0.5).edges(&[0.0, 1.0])),
            temperature().any(),
            option_of(temperature()),
        )
            .prop_map(|(tau, rho, t, tr)| WindowDefinition {
                transmittance: tau,
                reflectance: rho,
                temperature_k: t,
                reflected_temperature_k: tr,
            }),
    )
}

fn measurement_conditions() -> impl Strategy<Value = MeasurementConditions> {
    (
        option_of(emissivity()),
        option_of(temperature()),
        option_of(emissivity()),
        option_of(temperature()),
        window_definitions(),
    )
        .prop_map(|(e, tr, tau, tp, w)| MeasurementConditions {
            emissivity: e,
            reflected_temperature_k: tr,
            path_transmittance: tau,
            path_temperature_k: tp,
            window: w,
        })
}

fn instrument_models() -> impl Strategy<Value = InstrumentModel> {
    let wavelength = arg(0.2, 20.0).edges(&[0.0]);
    let point = (wavelength.any(), spectral_units(), c2s()).prop_map(|(w, unit, c2)| {
        InstrumentModel::SpectralPoint {
            wavelength: w,
            unit,
            c2,
        }
    });
    let response = (
        slice(&arg(0.3, 20.0), true, 2, 300),
        slice(&arg(0.0, 1.0).edges(&[0.0, 1.0]), false, 2, 300),
        prop::sample::select(vec![
            SpectralUnit::Micrometre,
            SpectralUnit::Nanometre,
            SpectralUnit::PerCentimetre,
        ]),
        c2s(),
    )
        .prop_map(|(mut w, mut r, unit, c2)| {
            // Usually equal lengths, so the validation gets past the length check.
            if r.len() > w.len() && w.len() >= 2 {
                r.truncate(w.len());
            }
            if unit == SpectralUnit::Nanometre {
                w.iter_mut().for_each(|x| *x *= 1000.0);
            }
            InstrumentModel::Response(ResponseTable {
                wavelengths: w,
                values: r,
                unit,
                c2,
            })
        });
    let curve = (
        arg(0.3e-6, 15e-6).edges(&[0.0]).any(),
        arg(-2e-8, 2e-8).edges(&[0.0]).any(),
        arg(-1e-3, 1e-3).edges(&[0.0]).any(),
        c2s(),
    )
        .prop_map(|(a, b, c, c2)| InstrumentModel::SakumaHattori {
            a_m: a,
            b_mk: b,
            c,
            c2,
        });
    prop_oneof![point, response, curve]
}

fn spectrum_settings() -> impl Strategy<Value = SpectrumSettings> {
    (
        spectral_units(),
        prop::option::of(variables()),
        quantities(),
        geometries(),
        emissivity().any(),
        refractive_index().any(),
        c2s(),
        prop::option::of(spectral_units()),
    )
        .prop_map(|(unit, v, q, g, e, n, c2, du)| {
            let mut s = SpectrumSettings::new(unit);
            s.variable = v;
            s.quantity = q;
            s.geometry = g;
            s.emissivity = e;
            s.refractive_index = n;
            s.c2 = c2;
            s.density_unit = du;
            s
        })
}

// SignalModel::signal docs: "A true value above `f64::MAX` (an extreme temperature or response
// scale) is returned as +∞"; d_signal_dt: "+∞ or 0 only where the true value is beyond the f64
// range".
const MODEL_INF: Inf = Inf::Documented;

/// Calls every `SignalModel` method of a model (also used through `dyn SignalModel`).
fn exercise_model(
    what: &str,
    m: &dyn SignalModel,
    t: f64,
    signal: f64,
) -> Result<(), TestCaseError> {
    check(what, &m.signal(t), MODEL_INF)?;
    check(what, &m.d_signal_dt(t), MODEL_INF)?;
    check(what, &m.signal_and_derivative(t), MODEL_INF)?;
    ok(what, &m.temperature(signal))?;
    if let Ok(s) = m.signal(t) {
        ok(what, &m.temperature(s))?;
    }
    Ok(())
}

#[test]
fn fuzz_definition() {
    let signal = arg(1e-20, 1e20).edges(&[0.0]);
    fuzz(
        "definition",
        600,
        (
            spectrum_settings(),
            measurement_conditions(),
            instrument_models(),
            variables(),
            args(&[temperature(), signal]),
        ),
        |(settings, mc, model, v, a)| {
            let (t, signal) = (a[0], a[1]);
            ok(
                "SpectrumSettings::resolved_variable",
                &SpectrumSettings::resolved_variable(&settings),
            )?;
            ok(
                "SpectrumSettings::spectrum",
                &SpectrumSettings::spectrum(&settings),
            )?;
            ok(
                "SpectrumSettings::density_unit",
                &SpectrumSettings::density_unit(&settings),
            )?;
            ok(
                "SpectrumSettings::density_factor",
                &SpectrumSettings::density_factor(&settings),
            )?;
            let _ = variable_kind(v);
            ok(
                "MeasurementConditions::conditions",
                &MeasurementConditions::conditions(&mc),
            )?;
            let prepared = InstrumentModel::prepare(&model);
            ok("InstrumentModel::prepare", &prepared)?;
            if let Ok(p) = prepared {
                exercise_model("PreparedModel (dyn)", &p, t, signal)?;
                check(
                    "<PreparedModel as SignalModel>::signal",
                    &<PreparedModel as SignalModel>::signal(&p, t),
                    MODEL_INF,
                )?;
                check(
                    "<PreparedModel as SignalModel>::d_signal_dt",
                    &<PreparedModel as SignalModel>::d_signal_dt(&p, t),
                    MODEL_INF,
                )?;
                check(
                    "<PreparedModel as SignalModel>::signal_and_derivative",
                    &<PreparedModel as SignalModel>::signal_and_derivative(&p, t),
                    MODEL_INF,
                )?;
                ok(
                    "<PreparedModel as SignalModel>::temperature",
                    &<PreparedModel as SignalModel>::temperature(&p, signal),
                )?;
                let mut seen = 0;
                let r = PreparedModel::with_model(&p, &mut |m| {
                    seen += 1;
                    m.signal(t).map(|_| ())
                });
                ok("PreparedModel::with_model", &r)?;
                prop_assert!(seen <= 1);
                let r = PreparedModel::run(&p, |m| m.signal_and_derivative(t));
                check("PreparedModel::run", &r, MODEL_INF)?;
            }
            Ok(())
        },
    );
}
