//! The README "Instrument design" example, compiled and checked (keep the two in sync).
//!
//! Expected values: mpmath 1.3.0 at 40 digits (`tests/data/design_reference.json`, detector case
//! "mwir_doc": the same pixel), Gouffé's formula evaluated by hand for the cavity, and
//! similar triangles for the spot.
#![cfg(not(target_arch = "wasm32"))]

use quantaband::design::merit::{blip_d_star, d_star_from_netd_optics, noise_bandwidth_hz};
use quantaband::design::sources::{cavity_emissivity_gouffe, spot_diameter_m, spot_fill};
use quantaband::design::{
    BackgroundView, Band, Cavity, ConeForm, Conversion, DStarShape, Detector, InBand, Mechanism,
    Optics,
};
use quantaband::planck::Quantity;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn readme_instrument_design() -> Result<(), quantaband::Error> {
    let optics = Optics::new(2.0, 0.9);
    let det = Detector {
        pixel_area_m2: 15e-6 * 15e-6,
        conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
        integration_time_s: 1e-3,
        full_well_electrons: 1.1e7,
        dark_current_a: 1e-12,
        read_noise_electrons: 200.0,
    };
    let scene = Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon).in_band(300.0)?;
    let px = det.evaluate(&scene, &optics, 0.0)?;
    // mpmath, case "mwir_doc".
    assert!(rel(px.signal_electrons, 7.286_514_519_299_288e5) < 1e-14);
    assert!(rel(px.snr, 8.277_495_945_522_212e2) < 1e-14);
    assert!(rel(px.well_fill, 6.680_845_100_039_905e-2) < 1e-14);
    assert!(rel(px.netd_k, 3.317_257_179_344_383e-2) < 1e-14);

    let df = noise_bandwidth_hz(det.integration_time_s)?;
    let shape = DStarShape::IdealPhoton {
        peak_wavelength_m: 4.8e-6,
    };
    let d_pixel =
        d_star_from_netd_optics(px.netd_k, shape, &scene, &optics, det.pixel_area_m2, df)?;
    let stop = BackgroundView::ColdStop {
        f_number: 2.0,
        cone: ConeForm::Exact,
    };
    let d_blip = blip_d_star(4.8e-6, 0.7, 300.0, &stop, Mechanism::Photovoltaic)?;
    // The README quotes 6.44e11 and 6.04e11 cm Hz^½/W.
    assert!((100.0 * d_pixel / 6.44e11 - 1.0).abs() < 5e-3);
    assert!((100.0 * d_blip / 6.04e11 - 1.0).abs() < 5e-3);

    let cav = Cavity::Cylinder {
        radius_m: 0.025,
        depth_m: 0.2,
        aperture_radius_m: 0.0125,
    };
    let eps = cavity_emissivity_gouffe(0.9, &cav)?;
    // By hand: s/S = 0.25/(2·8 + 2) = 1/72, s/S₀ = 0.25/64; ε′ = 0.9/(0.9·71/72 + 1/72),
    // k = 0.1·(1/72 − 1/256).
    let (f, f0) = (1.0 / 72.0, 1.0 / 256.0);
    let by_hand = 0.9 / (0.9 * (1.0 - f) + f) * (1.0 + 0.1 * (f - f0));
    assert!(rel(eps, by_hand) < 1e-15);
    assert!((eps - 0.99946).abs() < 5e-6);
    let spot = spot_diameter_m(0.6, 12.0)?;
    assert!((spot - 0.05).abs() < 1e-17);
    let fill = spot_fill(0.1, spot)?;
    assert!(fill.fills && rel(fill.diameter_ratio, 2.0) < 1e-15);
    Ok(())
}
