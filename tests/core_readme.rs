//! The README "Rust quick start" example, compiled and checked (keep the two in sync).
//!
//! Expected values: mpmath 1.3.0 at 40 digits (`tests/data/core_reference.json`: 10 µm and
//! 8–14 µm at 300 K, the median λT) and CODATA 2018 σ for σT⁴.

use quantaband::band::{band, band_fraction, lambda_t_at_fraction};
use quantaband::inverse::{
    temperature_from_band, temperature_from_band_ratio, temperature_from_spectral,
};
use quantaband::planck::{
    spectral_radiance_wavelength, total_exitance, Geometry, Quantity, SpectralVariable, Spectrum,
};

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn readme_quick_start() -> Result<(), quantaband::Error> {
    let lwir = Spectrum::default();
    let l = spectral_radiance_wavelength(10e-6, 300.0)?;
    assert!(rel(l, 9.924_033_330_070_695e6) < 1e-14);
    let b = band(&lwir, 8e-6, 14e-6, 300.0)?;
    assert!(rel(b, 54.933_461_376_839_69) < 1e-14);
    let f = band_fraction(&lwir, 8e-6, 14e-6, 300.0)?;
    assert!(rel(f, 0.375_742_293_645_924_3) < 1e-14);
    let m = total_exitance(300.0)?;
    assert!(rel(m, 459.300_327_953_938_8) < 1e-15);
    let t = temperature_from_band(&lwir, 8e-6, 14e-6, b)?;
    assert!((t - 300.0).abs() < 1e-9);

    let photons = Spectrum::new(
        SpectralVariable::Frequency,
        Quantity::Photon,
        Geometry::Radiance,
    )
    .with_emissivity(0.9);
    let n_dot = photons.spectral(3e13, 300.0)?;
    let t_true = temperature_from_spectral(&photons, 3e13, n_dot)?;
    assert!(rel(t_true, 300.0) < 1e-14);

    let r = band(&lwir, 0.9e-6, 1.0e-6, 1400.0)? / band(&lwir, 1.0e-6, 1.1e-6, 1400.0)?;
    let t_ratio = temperature_from_band_ratio(&lwir, (0.9e-6, 1.0e-6), (1.0e-6, 1.1e-6), r, 1.0)?;
    assert!(rel(t_ratio, 1400.0) < 1e-12);
    let median_lambda_t = lambda_t_at_fraction(0.5)?;
    assert!(rel(median_lambda_t, 4.107_248_487_711_177e-3) < 1e-14);
    Ok(())
}
