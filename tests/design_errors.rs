//! Bad input to `quantaband::design` gives typed errors with stable codes and the offending
//! argument's name; special values never panic and never produce NaN.
#![cfg(not(target_arch = "wasm32"))]

use quantaband::design::detector::{
    dark_electrons, electron_rate, noise_budget, quantum_efficiency_from_responsivity,
    responsivity_from_quantum_efficiency,
};
use quantaband::design::merit::{
    background_photon_flux, blip_d_star, blip_d_star_from_flux, d_power_dt_w_per_k,
    d_star_from_nep, d_star_from_netd, nep_w, netd_from_d_star, netd_from_d_star_optics,
    netd_from_noise, noise_bandwidth_hz,
};
use quantaband::design::sources::{
    cavity_emissivity_gouffe, spot_diameter_focused_m, spot_diameter_m, spot_fill,
    sse_corrected_signal, sse_relative_change,
};
use quantaband::design::throughput::{
    etendue_between_discs, etendue_from_aperture, etendue_from_f_number, focal_plane_irradiance,
    pixel_flux, projected_solid_angle_sr,
};
use quantaband::design::{
    BackgroundView, Band, Cavity, ConeForm, Conversion, DStarShape, Detector, InBand,
    InBandRadiance, Line, Mechanism, Optics, PixelFlux, RadianceKind,
};
use quantaband::planck::{Geometry, Quantity, Spectrum};
use quantaband::Error;

fn code<T: core::fmt::Debug>(r: Result<T, Error>) -> &'static str {
    r.expect_err("expected an error").code()
}

/// The error's code and that its message names the argument.
fn check<T: core::fmt::Debug>(r: Result<T, Error>, want: &str, arg: &str) {
    let e = r.expect_err("expected an error");
    assert_eq!(e.code(), want, "{e}");
    assert!(e.to_string().contains(arg), "{e} should name {arg}");
}

fn lw() -> InBandRadiance {
    InBandRadiance::new(RadianceKind::Energy, 54.9, 0.84).unwrap()
}

fn detector() -> Detector {
    Detector {
        pixel_area_m2: 225e-12,
        conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
        integration_time_s: 1e-3,
        full_well_electrons: 1e7,
        dark_current_a: 1e-12,
        read_noise_electrons: 100.0,
    }
}

#[test]
fn f_number_and_optics() {
    check(
        projected_solid_angle_sr(0.0, ConeForm::Exact),
        "NON_POSITIVE",
        "f_number",
    );
    check(
        projected_solid_angle_sr(-2.0, ConeForm::SmallAngle),
        "NON_POSITIVE",
        "f_number",
    );
    check(
        projected_solid_angle_sr(f64::NAN, ConeForm::Exact),
        "NON_FINITE",
        "f_number",
    );
    check(
        etendue_from_f_number(1e-10, 0.0, ConeForm::Exact),
        "NON_POSITIVE",
        "f_number",
    );
    check(
        etendue_from_f_number(0.0, 2.0, ConeForm::Exact),
        "NON_POSITIVE",
        "area_m2",
    );
    check(Optics::new(0.0, 0.9).validate(), "NON_POSITIVE", "f_number");
    check(
        Optics::new(2.0, 0.0).validate(),
        "OUT_OF_RANGE",
        "transmittance",
    );
    check(
        Optics::new(2.0, 1.01).validate(),
        "OUT_OF_RANGE",
        "transmittance",
    );
    check(
        Optics::new(2.0, 0.9).with_field_angle(-0.1).validate(),
        "OUT_OF_RANGE",
        "field_angle_rad",
    );
    check(
        Optics::new(2.0, 0.9)
            .with_field_angle(core::f64::consts::FRAC_PI_2)
            .validate(),
        "OUT_OF_RANGE",
        "field_angle_rad",
    );
    check(
        focal_plane_irradiance(-1.0, &Optics::new(2.0, 0.9)),
        "OUT_OF_RANGE",
        "radiance",
    );
    check(
        focal_plane_irradiance(1.0, &Optics::new(-1.0, 0.9)),
        "NON_POSITIVE",
        "f_number",
    );
    check(
        etendue_from_aperture(1e-8, 0.0, 0.05, ConeForm::Exact),
        "NON_POSITIVE",
        "aperture_diameter_m",
    );
    check(
        etendue_from_aperture(1e-8, 0.01, -0.05, ConeForm::Exact),
        "NON_POSITIVE",
        "distance_m",
    );
    check(
        etendue_between_discs(0.0, 0.01, 0.05, ConeForm::Exact),
        "NON_POSITIVE",
        "stop_diameter_m",
    );
    check(
        pixel_flux(&lw(), &Optics::new(2.0, 0.9), 0.0),
        "NON_POSITIVE",
        "pixel_area_m2",
    );
}

#[test]
fn in_band_sources() {
    check(
        InBandRadiance::new(RadianceKind::Photon, -1.0, 0.0),
        "OUT_OF_RANGE",
        "radiance",
    );
    check(
        InBandRadiance::new(RadianceKind::Photon, 1.0, f64::INFINITY),
        "NON_FINITE",
        "d_radiance_dt",
    );
    let exitance = Spectrum::default().with_geometry(Geometry::Exitance);
    assert_eq!(
        code(Band::new(exitance, 8e-6, 14e-6).in_band(300.0)),
        "UNSUPPORTED"
    );
    assert_eq!(
        code(Band::wavelength(14e-6, 8e-6, Quantity::Energy).in_band(300.0)),
        "INVALID_BAND"
    );
    check(
        Band::wavelength(8e-6, 14e-6, Quantity::Energy).in_band(0.0),
        "NON_POSITIVE_TEMPERATURE",
        "temperature_k",
    );
    let line = Line {
        spectrum: Spectrum::default(),
        centre: 10e-6,
        width: 0.0,
    };
    check(line.in_band(300.0), "NON_POSITIVE", "width");
    let line = Line {
        spectrum: Spectrum::default(),
        centre: -10e-6,
        width: 1e-7,
    };
    assert_eq!(code(line.in_band(300.0)), "NON_POSITIVE_SPECTRAL");
}

#[test]
fn detector_inputs() {
    let scene = Band::wavelength(3e-6, 5e-6, Quantity::Photon)
        .in_band(300.0)
        .unwrap();
    let o = Optics::new(2.0, 0.9);
    let zero_t = Detector {
        integration_time_s: 0.0,
        ..detector()
    };
    check(
        zero_t.evaluate(&scene, &o, 0.0),
        "NON_POSITIVE",
        "integration_time_s",
    );
    check(
        noise_bandwidth_hz(0.0),
        "NON_POSITIVE",
        "integration_time_s",
    );
    check(
        dark_electrons(1e-12, 0.0),
        "NON_POSITIVE",
        "integration_time_s",
    );
    check(
        dark_electrons(-1e-12, 1.0),
        "OUT_OF_RANGE",
        "dark_current_a",
    );
    let bad = Detector {
        full_well_electrons: 0.0,
        ..detector()
    };
    check(
        bad.evaluate(&scene, &o, 0.0),
        "NON_POSITIVE",
        "full_well_electrons",
    );
    let bad = Detector {
        read_noise_electrons: -1.0,
        ..detector()
    };
    check(
        bad.evaluate(&scene, &o, 0.0),
        "OUT_OF_RANGE",
        "read_noise_electrons",
    );
    let bad = Detector {
        conversion: Conversion::QuantumEfficiency { efficiency: 1.5 },
        ..detector()
    };
    check(bad.evaluate(&scene, &o, 0.0), "OUT_OF_RANGE", "efficiency");
    let bad = Detector {
        conversion: Conversion::Responsivity {
            amperes_per_watt: 0.0,
        },
        ..detector()
    };
    check(
        bad.evaluate(&scene, &o, 0.0),
        "NON_POSITIVE",
        "amperes_per_watt",
    );
    check(
        detector().evaluate(&scene, &o, -5.0),
        "OUT_OF_RANGE",
        "background_electrons_per_s",
    );
    // Kind and conversion must match.
    let energy = Band::wavelength(3e-6, 5e-6, Quantity::Energy)
        .in_band(300.0)
        .unwrap();
    assert_eq!(code(detector().evaluate(&energy, &o, 0.0)), "UNSUPPORTED");
    let p = PixelFlux {
        kind: RadianceKind::Photon,
        flux: 1.0,
        d_flux_dt: 0.0,
    };
    for c in [
        Conversion::Responsivity {
            amperes_per_watt: 1.0,
        },
        Conversion::Included,
    ] {
        assert_eq!(code(electron_rate(&p, c)), "UNSUPPORTED");
    }
    let p = PixelFlux {
        kind: RadianceKind::Current,
        ..p
    };
    assert_eq!(
        code(electron_rate(
            &p,
            Conversion::QuantumEfficiency { efficiency: 0.5 }
        )),
        "UNSUPPORTED"
    );
    check(
        noise_budget(-1.0, 0.0, 0.0, 0.0),
        "OUT_OF_RANGE",
        "signal_electrons",
    );
    check(
        responsivity_from_quantum_efficiency(0.0, 1e-6),
        "OUT_OF_RANGE",
        "efficiency",
    );
    check(
        responsivity_from_quantum_efficiency(0.5, 0.0),
        "NON_POSITIVE_SPECTRAL",
        "wavelength_m",
    );
    check(
        quantum_efficiency_from_responsivity(-1.0, 1e-6),
        "NON_POSITIVE",
        "amperes_per_watt",
    );
}

#[test]
fn figures_of_merit() {
    check(nep_w(-1e9, 1e-10, 1.0), "NON_POSITIVE", "d_star");
    check(nep_w(0.0, 1e-10, 1.0), "NON_POSITIVE", "d_star");
    check(nep_w(1e9, 1e-10, 0.0), "NON_POSITIVE", "bandwidth_hz");
    check(d_star_from_nep(0.0, 1e-10, 1.0), "NON_POSITIVE", "nep_w");
    check(
        netd_from_d_star(-1e9, 1e-10, 1.0, 1e-9),
        "NON_POSITIVE",
        "d_star",
    );
    check(
        netd_from_d_star(1e9, 1e-10, 1.0, 0.0),
        "NON_POSITIVE",
        "d_power_dt_w_per_k",
    );
    check(
        d_star_from_netd(0.0, 1e-10, 1.0, 1e-9),
        "NON_POSITIVE",
        "netd_k",
    );
    check(
        netd_from_noise(10.0, 0.0),
        "NON_POSITIVE",
        "d_signal_electrons_dt",
    );
    let o = Optics::new(1.0, 0.9);
    check(
        netd_from_d_star_optics(-1e9, DStarShape::Flat, &lw(), &o, 1e-10, 30.0),
        "NON_POSITIVE",
        "d_star",
    );
    check(
        netd_from_d_star_optics(
            1e9,
            DStarShape::Flat,
            &lw(),
            &Optics::new(0.0, 0.9),
            1e-10,
            30.0,
        ),
        "NON_POSITIVE",
        "f_number",
    );
    // A scene whose radiance does not change with temperature has no NETD.
    let flat = InBandRadiance::new(RadianceKind::Energy, 1.0, 0.0).unwrap();
    check(
        netd_from_d_star_optics(1e9, DStarShape::Flat, &flat, &o, 1e-10, 30.0),
        "NON_POSITIVE",
        "d_power_dt_w_per_k",
    );
    let photon = InBandRadiance::new(RadianceKind::Photon, 1e20, 1e18).unwrap();
    assert_eq!(
        code(d_power_dt_w_per_k(&photon, DStarShape::Flat, &o, 1e-10)),
        "UNSUPPORTED"
    );
    let ideal = DStarShape::IdealPhoton {
        peak_wavelength_m: 5e-6,
    };
    assert_eq!(
        code(d_power_dt_w_per_k(&lw(), ideal, &o, 1e-10)),
        "UNSUPPORTED"
    );
    check(
        d_power_dt_w_per_k(
            &photon,
            DStarShape::IdealPhoton {
                peak_wavelength_m: 0.0,
            },
            &o,
            1e-10,
        ),
        "NON_POSITIVE_SPECTRAL",
        "peak_wavelength_m",
    );
    let hemi = BackgroundView::Hemisphere;
    check(
        blip_d_star(0.0, 1.0, 300.0, &hemi, Mechanism::Photovoltaic),
        "NON_POSITIVE_SPECTRAL",
        "cutoff_wavelength_m",
    );
    check(
        blip_d_star(5e-6, 1.0, 0.0, &hemi, Mechanism::Photovoltaic),
        "NON_POSITIVE_TEMPERATURE",
        "background_temperature_k",
    );
    check(
        blip_d_star(5e-6, 0.0, 300.0, &hemi, Mechanism::Photovoltaic),
        "OUT_OF_RANGE",
        "quantum_efficiency",
    );
    let stop = BackgroundView::ColdStop {
        f_number: 0.0,
        cone: ConeForm::Exact,
    };
    check(
        background_photon_flux(5e-6, 300.0, &stop),
        "NON_POSITIVE",
        "f_number",
    );
    check(
        blip_d_star_from_flux(5e-6, 1.0, 0.0, Mechanism::Photoconductive),
        "NON_POSITIVE",
        "background_photon_flux",
    );
}

#[test]
fn sources() {
    let cyl = |r: f64, l: f64, a: f64| Cavity::Cylinder {
        radius_m: r,
        depth_m: l,
        aperture_radius_m: a,
    };
    check(
        cavity_emissivity_gouffe(0.9, &cyl(1.0, 0.0, 0.5)),
        "NON_POSITIVE",
        "depth_m",
    );
    check(
        cavity_emissivity_gouffe(0.9, &cyl(1.0, -4.0, 0.5)),
        "NON_POSITIVE",
        "depth_m",
    );
    check(
        cavity_emissivity_gouffe(0.9, &cyl(1.0, 0.9, 0.5)),
        "OUT_OF_RANGE",
        "depth_m",
    );
    check(
        cavity_emissivity_gouffe(0.9, &cyl(1.0, 8.0, 1.5)),
        "OUT_OF_RANGE",
        "aperture_radius_m",
    );
    check(
        cavity_emissivity_gouffe(0.9, &cyl(0.0, 8.0, 0.5)),
        "NON_POSITIVE",
        "radius_m",
    );
    check(
        cavity_emissivity_gouffe(0.0, &cyl(1.0, 8.0, 0.5)),
        "OUT_OF_RANGE",
        "wall_emissivity",
    );
    check(
        cavity_emissivity_gouffe(1.2, &cyl(1.0, 8.0, 0.5)),
        "OUT_OF_RANGE",
        "wall_emissivity",
    );
    let cone = Cavity::Cone {
        radius_m: 1.0,
        depth_m: f64::NAN,
        aperture_radius_m: 0.5,
    };
    check(
        cavity_emissivity_gouffe(0.9, &cone),
        "NON_FINITE",
        "depth_m",
    );
    check(
        sse_relative_change(-1.0, 0.0),
        "OUT_OF_RANGE",
        "sse_at_measurement",
    );
    check(
        sse_relative_change(0.0, -1.5),
        "OUT_OF_RANGE",
        "sse_at_calibration",
    );
    check(
        sse_corrected_signal(1.0, -1.0),
        "OUT_OF_RANGE",
        "relative_change",
    );
    check(sse_corrected_signal(-1.0, 0.0), "OUT_OF_RANGE", "signal");
    check(spot_diameter_m(0.0, 12.0), "NON_POSITIVE", "distance_m");
    check(
        spot_diameter_m(1.0, -12.0),
        "NON_POSITIVE",
        "distance_to_spot_ratio",
    );
    check(
        spot_diameter_focused_m(1.0, 0.03, 0.0, 0.01),
        "NON_POSITIVE",
        "focus_distance_m",
    );
    check(spot_fill(0.0, 0.05), "NON_POSITIVE", "target_diameter_m");
}

/// Special values in every numeric argument: an error or a non-NaN value, never a panic.
#[test]
fn special_values_never_panic_or_give_nan() {
    let specials = [
        f64::NAN,
        f64::INFINITY,
        f64::NEG_INFINITY,
        0.0,
        -0.0,
        -1.0,
        5e-324,
        1e-300,
        1e-6,
        0.5,
        1.0,
        2.0,
        1e300,
        f64::MAX,
    ];
    macro_rules! ok {
        ($e:expr, $x:expr, $y:expr) => {
            if let Ok(v) = $e {
                assert!(
                    !v.is_nan(),
                    "{} gave NaN at x = {}, y = {}",
                    stringify!($e),
                    $x,
                    $y
                );
            }
        };
    }
    for &x in &specials {
        for &y in &specials {
            ok!(projected_solid_angle_sr(x, ConeForm::Exact), x, y);
            ok!(etendue_from_f_number(x, y, ConeForm::SmallAngle), x, y);
            ok!(etendue_from_aperture(x, y, 1.0, ConeForm::Exact), x, y);
            ok!(
                etendue_from_aperture(1e-8, x, y, ConeForm::SmallAngle),
                x,
                y
            );
            ok!(etendue_between_discs(x, y, 0.1, ConeForm::Exact), x, y);
            ok!(etendue_between_discs(0.01, x, y, ConeForm::Exact), x, y);
            ok!(
                etendue_between_discs(0.01, x, y, ConeForm::SmallAngle),
                x,
                y
            );
            ok!(focal_plane_irradiance(x, &Optics::new(y, 0.9)), x, y);
            ok!(Optics::new(x, y).irradiance_factor_sr(), x, y);
            ok!(
                Optics::new(2.0, 0.9)
                    .with_field_angle(x)
                    .irradiance_factor_sr(),
                x,
                y
            );
            ok!(nep_w(x, y, 1.0), x, y);
            ok!(d_star_from_nep(x, 1.0, y), x, y);
            ok!(netd_from_d_star(x, 1e-10, y, 1e-9), x, y);
            ok!(noise_bandwidth_hz(x), x, y);
            ok!(netd_from_noise(x, y), x, y);
            ok!(dark_electrons(x, y), x, y);
            ok!(responsivity_from_quantum_efficiency(x, y), x, y);
            ok!(quantum_efficiency_from_responsivity(x, y), x, y);
            ok!(
                blip_d_star_from_flux(x, 1.0, y, Mechanism::Photovoltaic),
                x,
                y
            );
            ok!(
                blip_d_star(
                    x,
                    1.0,
                    y,
                    &BackgroundView::Hemisphere,
                    Mechanism::Photovoltaic,
                ),
                x,
                y
            );
            ok!(
                background_photon_flux(x, y, &BackgroundView::Hemisphere),
                x,
                y
            );
            ok!(sse_relative_change(x, y), x, y);
            ok!(sse_corrected_signal(x, y), x, y);
            ok!(spot_diameter_m(x, y), x, y);
            ok!(spot_diameter_focused_m(x, y, 1.0, 0.01), x, y);
            ok!(spot_diameter_focused_m(1.0, 0.03, x, y), x, y);
            let cyl = Cavity::Cylinder {
                radius_m: x,
                depth_m: y,
                aperture_radius_m: 0.25,
            };
            ok!(cavity_emissivity_gouffe(0.9, &cyl), x, y);
            let cone = Cavity::Cone {
                radius_m: 1.0,
                depth_m: x,
                aperture_radius_m: 0.5,
            };
            ok!(cavity_emissivity_gouffe(y, &cone), x, y);
            if let Ok(s) = spot_fill(x, y) {
                assert!(!s.fill_fraction.is_nan() && !s.diameter_ratio.is_nan());
            }
            if let Ok(n) = noise_budget(x, y, 0.0, 1.0) {
                assert!(!n.total_electrons.is_nan());
            }
            let scene = InBandRadiance {
                kind: RadianceKind::Photon,
                radiance: x,
                d_radiance_dt: y,
            };
            if let Ok(r) = detector().evaluate(&scene, &Optics::new(2.0, 0.9), 0.0) {
                for v in [r.signal_electrons, r.snr, r.netd_k, r.well_fill] {
                    assert!(!v.is_nan(), "{x} {y}: {r:?}");
                }
            }
            if let Ok(p) = pixel_flux(&scene, &Optics::new(2.0, 0.9), 1e-10) {
                assert!(!p.flux.is_nan() && !p.d_flux_dt.is_nan());
            }
        }
    }
}
