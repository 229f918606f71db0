//! Bad input returns the right typed error (never a panic, never a NaN).
//!
//! The expected variants follow the crate's error contract (src/error.rs); no outside source is
//! needed for these checks.

use quantaband::band::{
    band, band_d_dt, band_fraction, fraction_below, lambda_t_at_fraction, photon_fraction_below,
    planck_integral, planck_integral_upper, PlanckKernel,
};
use quantaband::inverse::{
    temperature_from_band, temperature_from_band_ratio, temperature_from_spectral,
};
use quantaband::planck::{
    peak_wavelength_m, spectral_radiance_frequency, spectral_radiance_wavelength, total_exitance,
    Spectrum,
};
use quantaband::Error;

fn code<T: core::fmt::Debug>(r: quantaband::Result<T>) -> &'static str {
    r.expect_err("expected an error").code()
}

#[test]
fn spectral_inputs() {
    match spectral_radiance_wavelength(f64::NAN, 300.0) {
        Err(Error::NonFinite { arg, value }) => {
            assert_eq!(arg, "wavelength_m");
            assert!(value.is_nan());
        }
        other => panic!("{other:?}"),
    }
    assert_eq!(
        code(spectral_radiance_wavelength(f64::NAN, 300.0)),
        "NON_FINITE"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(f64::INFINITY, 300.0)),
        "NON_FINITE"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(0.0, 300.0)),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(-1e-6, 300.0)),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(1e-6, 0.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(1e-6, -5.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(spectral_radiance_wavelength(1e-6, f64::NEG_INFINITY)),
        "NON_FINITE"
    );
    match spectral_radiance_frequency(-1.0, 300.0) {
        Err(Error::NonPositiveSpectral { arg, value }) => {
            assert_eq!(arg, "frequency_hz");
            assert_eq!(value, -1.0);
        }
        other => panic!("{other:?}"),
    }
    match spectral_radiance_wavelength(1e-6, f64::NAN) {
        Err(Error::NonFinite { arg, .. }) => assert_eq!(arg, "temperature_k"),
        other => panic!("{other:?}"),
    }
    assert_eq!(code(total_exitance(0.0)), "NON_POSITIVE_TEMPERATURE");
    assert_eq!(code(peak_wavelength_m(f64::NAN)), "NON_FINITE");
}

#[test]
fn spectrum_parameters() {
    for eps in [0.0, -0.1, 1.0000001, 2.0] {
        let s = Spectrum::default().with_emissivity(eps);
        match s.spectral(1e-5, 300.0) {
            Err(Error::OutOfRange { arg, range, .. }) => {
                assert_eq!(arg, "emissivity");
                assert_eq!(range, "(0, 1]");
            }
            other => panic!("{eps}: {other:?}"),
        }
    }
    assert_eq!(
        code(Spectrum::default().with_emissivity(f64::NAN).validate()),
        "NON_FINITE"
    );
    assert_eq!(
        code(Spectrum::default().with_refractive_index(0.0).validate()),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(
            Spectrum::default()
                .with_refractive_index(f64::INFINITY)
                .validate()
        ),
        "NON_FINITE"
    );
    // A grey body with ε = 1 exactly and n = 1.5 is valid.
    assert!(Spectrum::default()
        .with_refractive_index(1.5)
        .validate()
        .is_ok());
}

#[test]
fn band_inputs() {
    let s = Spectrum::default();
    match band(&s, 14e-6, 8e-6, 300.0) {
        Err(Error::InvalidBand { lower, upper }) => assert_eq!((lower, upper), (14e-6, 8e-6)),
        other => panic!("{other:?}"),
    }
    assert_eq!(code(band(&s, 8e-6, 8e-6, 300.0)), "INVALID_BAND");
    assert_eq!(
        code(band_d_dt(&s, 8e-6, 14e-6, -1.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(band_fraction(&s, f64::NAN, 14e-6, 300.0)),
        "NON_FINITE"
    );
    match band(&s, 0.0, 14e-6, 300.0) {
        Err(Error::NonPositiveSpectral { arg, .. }) => assert_eq!(arg, "lower_wavelength_m"),
        other => panic!("{other:?}"),
    }
    assert_eq!(code(fraction_below(0.0)), "NON_POSITIVE");
    assert_eq!(code(photon_fraction_below(f64::NAN)), "NON_FINITE");
    assert_eq!(
        code(planck_integral(PlanckKernel::Energy, -1.0, 2.0)),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code(planck_integral(PlanckKernel::Energy, 3.0, 2.0)),
        "INVALID_BAND"
    );
    assert_eq!(
        code(planck_integral_upper(PlanckKernel::Photon, f64::INFINITY)),
        "NON_FINITE"
    );
}

#[test]
fn fraction_inverse_inputs() {
    for f in [0.0, 1.0, -0.5, 1.5] {
        match lambda_t_at_fraction(f) {
            Err(Error::OutOfRange { arg, range, .. }) => {
                assert_eq!(arg, "fraction");
                assert_eq!(range, "(0, 1)");
            }
            other => panic!("{f}: {other:?}"),
        }
    }
    assert_eq!(code(lambda_t_at_fraction(f64::NAN)), "NON_FINITE");
    // Extreme but valid fractions still solve.
    assert!(lambda_t_at_fraction(1e-300).unwrap() > 0.0);
    assert!(lambda_t_at_fraction(1.0 - f64::EPSILON)
        .unwrap()
        .is_finite());
}

#[test]
fn inverse_inputs() {
    let s = Spectrum::default();
    assert_eq!(
        code(temperature_from_spectral(&s, 1e-5, 0.0)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(temperature_from_spectral(&s, 1e-5, f64::NAN)),
        "NON_FINITE"
    );
    assert_eq!(
        code(temperature_from_spectral(&s, -1e-5, 1.0)),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(temperature_from_band(&s, 8e-6, 14e-6, -3.0)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(temperature_from_band(&s, 14e-6, 8e-6, 3.0)),
        "INVALID_BAND"
    );
    // More than an 8–14 µm band gives at the 1e7 K ceiling.
    assert_eq!(
        code(temperature_from_band(&s, 8e-6, 14e-6, 1e300)),
        "NO_SOLUTION"
    );
    // Less than a 1–2 m band gives at the 1e-3 K floor (Rayleigh–Jeans: ~2e-18 W m⁻² sr⁻¹).
    assert_eq!(
        code(temperature_from_band(&s, 1.0, 2.0, 1e-30)),
        "NO_SOLUTION"
    );
    let b1 = (8e-6, 10e-6);
    let b2 = (10e-6, 12e-6);
    assert_eq!(
        code(temperature_from_band_ratio(&s, b1, b2, 0.0, 1.0)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(temperature_from_band_ratio(&s, b1, b2, 1.0, 0.0)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(temperature_from_band_ratio(&s, (10e-6, 8e-6), b2, 1.0, 1.0)),
        "INVALID_BAND"
    );
    // A ratio beyond what the bands can give: the 8–10 / 10–12 µm ratio rises from 0 to its
    // Rayleigh–Jeans limit ≈ 1.5 and never reaches 100.
    assert_eq!(
        code(temperature_from_band_ratio(&s, b1, b2, 100.0, 1.0)),
        "NO_SOLUTION"
    );
}

#[test]
fn ratio_of_nested_bands_is_detected_as_ambiguous() {
    // 9–10 µm inside 3–30 µm: its share of the outer band rises then falls with T.
    let s = Spectrum::default();
    let r = temperature_from_band_ratio(&s, (9e-6, 10e-6), (3e-6, 30e-6), 0.05, 1.0);
    assert_eq!(code(r), "NO_SOLUTION");
    // Identical bands: constant ratio 1.
    let r = temperature_from_band_ratio(&s, (9e-6, 10e-6), (9e-6, 10e-6), 1.0, 1.0);
    assert_eq!(code(r), "NO_SOLUTION");
}

#[test]
fn overlapping_but_monotone_bands_still_solve() {
    // 8–12 µm and 10–14 µm overlap, but the ratio is monotone over the search range.
    let s = Spectrum::default();
    let (b1, b2) = ((8e-6, 12e-6), (10e-6, 14e-6));
    let r = band(&s, b1.0, b1.1, 350.0).unwrap() / band(&s, b2.0, b2.1, 350.0).unwrap();
    let t = temperature_from_band_ratio(&s, b1, b2, r, 1.0).unwrap();
    assert!((t / 350.0 - 1.0).abs() < 1e-10, "{t}");
}
