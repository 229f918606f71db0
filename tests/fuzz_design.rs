//! Property-based fuzz of the instrument-design functions (`quantaband::design`): throughput,
//! in-band radiance, detector conversion and noise, figures of merit and sources. See
//! `tests/common/mod.rs` for the properties and the generators.
//!
//! Methods are called in the fully qualified form (`Type::method(&x, …)`, trait methods as
//! `<Type as Trait>::method`) so that `tests/fuzz_inventory.rs` can check from the text that each
//! one is exercised.

mod common;

use common::{arg, args, check, fuzz, ok, Arg, Inf};
use proptest::prelude::*;
use proptest::test_runner::TestCaseError;
use quantaband::constants::C2Convention;
use quantaband::design::definition::{
    DesignDefinition, PreparedDesign, PreparedScene, SceneDefinition,
};
use quantaband::design::detector::{
    dark_electrons, electron_rate, noise_budget, quantum_efficiency_from_responsivity,
    responsivity_from_quantum_efficiency, Conversion, Detector, PixelReport,
};
use quantaband::design::merit::{
    background_photon_flux, blip_d_star, blip_d_star_from_flux, d_power_dt_w_per_k,
    d_star_from_nep, d_star_from_netd, d_star_from_netd_optics, nep_w, netd_from_d_star,
    netd_from_d_star_optics, netd_from_noise, noise_bandwidth_hz, BackgroundView, DStarShape,
    Mechanism,
};
use quantaband::design::scene::{Band, InBand, InBandRadiance, Line, ModelRadiance, RadianceKind};
use quantaband::design::sources::{
    cavity_emissivity_gouffe, spot_diameter_focused_m, spot_diameter_m, spot_fill,
    sse_corrected_signal, sse_corrected_temperature, sse_relative_change, Cavity,
};
use quantaband::design::throughput::{
    etendue_between_discs, etendue_from_aperture, etendue_from_f_number, focal_plane_irradiance,
    pixel_flux, projected_solid_angle_sr, ConeForm, Optics, PixelFlux,
};
use quantaband::planck::{Geometry, Quantity, SpectralVariable, Spectrum};
use quantaband::thermometry::{RectangularBand, SpectralPoint};
use quantaband::units::SpectralUnit;
use quantaband::Error;

// design/mod.rs, "Range": "Valid inputs whose true result lies beyond the f64 range ... return
// +∞ or 0, not an error and never NaN". Results that are bounded by construction (validations,
// area ratios, Gouffé's emissivity, the noise budget, in-band radiances, which are validated)
// stay under the strict check `ok`.
fn dok<T: std::fmt::Debug>(what: &str, r: &Result<T, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)
}

fn positive(lo: f64, hi: f64) -> Arg {
    arg(lo, hi).edges(&[0.0])
}

fn unit_open_closed() -> Arg {
    arg(0.05, 1.0).edges(&[0.0, 1.0])
}

fn temperature() -> Arg {
    arg(200.0, 3000.0).edges(&[0.0, 1e-3, 1e9])
}

fn cones() -> impl Strategy<Value = ConeForm> {
    prop::sample::select(vec![ConeForm::Exact, ConeForm::SmallAngle])
}

fn kinds() -> impl Strategy<Value = RadianceKind> {
    prop::sample::select(vec![
        RadianceKind::Energy,
        RadianceKind::Photon,
        RadianceKind::Current,
        RadianceKind::Electron,
    ])
}

fn mechanisms() -> impl Strategy<Value = Mechanism> {
    prop::sample::select(vec![Mechanism::Photovoltaic, Mechanism::Photoconductive])
}

fn optics() -> impl Strategy<Value = Optics> {
    (
        positive(0.7, 8.0).any(),
        unit_open_closed().any(),
        cones(),
        arg(0.0, 0.5)
            .edges(&[0.0, std::f64::consts::FRAC_PI_2])
            .any(),
    )
        .prop_map(|(f, tau, cone, theta)| {
            let o = Optics::new(f, tau);
            let o = Optics::with_cone(o, cone);
            Optics::with_field_angle(o, theta)
        })
}

fn radiances() -> impl Strategy<Value = InBandRadiance> {
    (
        kinds(),
        positive(1e-3, 1e20).any(),
        positive(1e-5, 1e18).any(),
    )
        .prop_map(|(kind, l, dl)| InBandRadiance {
            kind,
            radiance: l,
            d_radiance_dt: dl,
        })
}

fn conversions() -> impl Strategy<Value = Conversion> {
    prop_oneof![
        positive(0.1, 10.0)
            .any()
            .prop_map(|a| Conversion::Responsivity {
                amperes_per_watt: a
            }),
        unit_open_closed()
            .any()
            .prop_map(|e| Conversion::QuantumEfficiency { efficiency: e }),
        Just(Conversion::Included),
    ]
}

fn views() -> impl Strategy<Value = BackgroundView> {
    prop_oneof![
        Just(BackgroundView::Hemisphere),
        (positive(0.7, 8.0).any(), cones())
            .prop_map(|(f, cone)| BackgroundView::ColdStop { f_number: f, cone }),
    ]
}

fn shapes() -> impl Strategy<Value = DStarShape> {
    prop_oneof![
        Just(DStarShape::Flat),
        positive(1e-6, 15e-6)
            .any()
            .prop_map(|p| DStarShape::IdealPhoton {
                peak_wavelength_m: p
            }),
    ]
}

// PixelReport::netd_k: "∞ if the signal does not change with T in f64"; the other fields follow
// the module's range rule (see `dok`). No NaN anywhere.
fn report_check(what: &str, r: &Result<PixelReport, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)?;
    if let Ok(p) = r {
        prop_assert!(
            p.netd_k.is_finite()
                || p.d_signal_electrons_dt == 0.0
                || (p.noise.total_electrons / p.d_signal_electrons_dt).is_infinite(),
            "{}: NETD {} with ∂N_s/∂T = {:e}",
            what,
            p.netd_k,
            p.d_signal_electrons_dt
        );
    }
    Ok(())
}

#[test]
fn fuzz_throughput_and_detector() {
    fuzz(
        "throughput and detector",
        2500,
        (
            optics(),
            radiances(),
            conversions(),
            cones(),
            args(&[
                positive(0.7, 8.0),
                positive(1e-12, 1e-6),
                positive(1e-3, 0.3),
                positive(1e-3, 100.0),
                positive(1e-6, 15e-6),
                arg(0.0, 1e-9).edges(&[0.0]),
                positive(1e-6, 0.1),
                arg(0.0, 1e9).edges(&[0.0]),
                arg(0.0, 100.0).edges(&[0.0]),
                positive(1e3, 1e7),
            ]),
        ),
        |(o, scene, conv, cone, v)| {
            let (f, area, ap, dist, l, idark, tint, nb, rn, well) =
                (v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9]);
            // projected_solid_angle_sr: "The small-angle form is +∞ only where its true value
            // π/(4F²) is above `f64::MAX`"; etendue_from_f_number: the same.
            let d = Inf::Documented;
            check(
                "projected_solid_angle_sr",
                &projected_solid_angle_sr(f, cone),
                d,
            )?;
            check(
                "etendue_from_f_number",
                &etendue_from_f_number(area, f, cone),
                d,
            )?;
            dok(
                "etendue_from_aperture",
                &etendue_from_aperture(area, ap, dist, cone),
            )?;
            dok(
                "etendue_between_discs",
                &etendue_between_discs(ap * 0.1, ap, dist, cone),
            )?;
            dok(
                "etendue_between_discs (raw)",
                &etendue_between_discs(area, f, dist, cone),
            )?;
            ok("Optics::validate", &Optics::validate(&o))?;
            // irradiance_factor_sr / focal_plane_irradiance: "A true ... above `f64::MAX` ... is +∞".
            check(
                "Optics::irradiance_factor_sr",
                &Optics::irradiance_factor_sr(&o),
                d,
            )?;
            check(
                "focal_plane_irradiance",
                &focal_plane_irradiance(scene.radiance, &o),
                d,
            )?;
            let pf = pixel_flux(&scene, &o, area);
            dok("pixel_flux", &pf)?;
            ok("Conversion::validate", &Conversion::validate(&conv))?;
            let raw_flux = PixelFlux {
                kind: scene.kind,
                flux: scene.radiance,
                d_flux_dt: scene.d_radiance_dt,
            };
            dok("electron_rate (raw flux)", &electron_rate(&raw_flux, conv))?;
            if let Ok(pf) = &pf {
                dok("electron_rate", &electron_rate(pf, conv))?;
            }
            let eff = match conv {
                Conversion::QuantumEfficiency { efficiency } => efficiency,
                _ => 0.7,
            };
            dok(
                "responsivity_from_quantum_efficiency",
                &responsivity_from_quantum_efficiency(eff, l),
            )?;
            // quantum_efficiency_from_responsivity: "A true value above `f64::MAX` ... is +∞".
            check(
                "quantum_efficiency_from_responsivity",
                &quantum_efficiency_from_responsivity(f, l),
                d,
            )?;
            dok("dark_electrons", &dark_electrons(idark, tint))?;
            ok(
                "noise_budget",
                &noise_budget(nb, nb * 0.1, idark * 1e12, rn),
            )?;
            let det = Detector {
                pixel_area_m2: area,
                conversion: conv,
                integration_time_s: tint,
                full_well_electrons: well,
                dark_current_a: idark,
                read_noise_electrons: rn,
            };
            ok("Detector::validate", &Detector::validate(&det))?;
            report_check(
                "Detector::evaluate",
                &Detector::evaluate(&det, &scene, &o, nb),
            )?;
            Ok(())
        },
    );
}

#[test]
fn fuzz_merit() {
    fuzz(
        "merit",
        2500,
        (
            optics(),
            radiances(),
            shapes(),
            views(),
            mechanisms(),
            args(&[
                positive(1e-6, 1.0),
                positive(1e8, 1e13),
                positive(1e-12, 1e-6),
                positive(1.0, 1e5),
                positive(1e-12, 1e-3),
                positive(1e-3, 1.0),
                positive(1e-6, 15e-6),
                unit_open_closed(),
                temperature(),
                positive(1e10, 1e25),
            ]),
        ),
        |(o, scene, shape, view, mech, v)| {
            let (tint, dstar, area, bw, p, netd, lc, eta, tb, flux) =
                (v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9]);
            dok("noise_bandwidth_hz", &noise_bandwidth_hz(tint))?;
            dok("nep_w", &nep_w(dstar, area, bw))?;
            dok("d_star_from_nep", &d_star_from_nep(p, area, bw))?;
            dok("netd_from_d_star", &netd_from_d_star(dstar, area, bw, p))?;
            dok("d_star_from_netd", &d_star_from_netd(netd, area, bw, p))?;
            dok(
                "d_power_dt_w_per_k",
                &d_power_dt_w_per_k(&scene, shape, &o, area),
            )?;
            dok(
                "netd_from_d_star_optics",
                &netd_from_d_star_optics(dstar, shape, &scene, &o, area, bw),
            )?;
            dok(
                "d_star_from_netd_optics",
                &d_star_from_netd_optics(netd, shape, &scene, &o, area, bw),
            )?;
            dok("netd_from_noise", &netd_from_noise(bw, dstar))?;
            dok(
                "BackgroundView::projected_solid_angle_sr",
                &BackgroundView::projected_solid_angle_sr(&view),
            )?;
            // background_photon_flux: "Valid inputs whose true flux is above `f64::MAX` ... give +∞."
            check(
                "background_photon_flux",
                &background_photon_flux(lc, tb, &view),
                Inf::Documented,
            )?;
            // blip_d_star_from_flux: "A true D* above `f64::MAX` ... is +∞."
            check(
                "blip_d_star_from_flux",
                &blip_d_star_from_flux(lc, eta, flux, mech),
                Inf::Documented,
            )?;
            // blip_d_star: "the D* is formed from logarithms and stays finite (∞ only beyond
            // f64::MAX)".
            check(
                "blip_d_star",
                &blip_d_star(lc, eta, tb, &view, mech),
                Inf::Documented,
            )?;
            Ok(())
        },
    );
}

fn spectra() -> impl Strategy<Value = Spectrum> {
    (
        prop::sample::select(vec![
            SpectralVariable::Wavelength,
            SpectralVariable::Wavenumber,
            SpectralVariable::Frequency,
        ]),
        prop::sample::select(vec![Quantity::Energy, Quantity::Photon]),
        prop::sample::select(vec![Geometry::Radiance, Geometry::Exitance]),
        unit_open_closed().any(),
    )
        .prop_map(|(v, q, g, e)| Spectrum::new(v, q, g).with_emissivity(e))
}

#[test]
fn fuzz_scene() {
    fuzz(
        "scene",
        1500,
        (
            spectra(),
            kinds(),
            prop::sample::select(vec![Quantity::Energy, Quantity::Photon]),
            args(&[
                positive(1e-6, 15e-6),
                arg(1.05, 3.0).edges(&[1.0]),
                temperature(),
                positive(1e-3, 1e20),
                positive(1e-5, 1e18),
                positive(1e-9, 1e-6),
            ]),
        ),
        |(s, kind, q, v)| {
            let (l, ratio, t, rad, drad, width) = (v[0], v[1], v[2], v[3], v[4], v[5]);
            prop_assert!(!RadianceKind::radiance_unit(kind).is_empty());
            prop_assert!(!RadianceKind::flux_unit(kind).is_empty());
            let r = InBandRadiance::new(kind, rad, drad);
            ok("InBandRadiance::new", &r)?;
            let raw = InBandRadiance {
                kind,
                radiance: rad,
                d_radiance_dt: drad,
            };
            ok("InBandRadiance::validate", &InBandRadiance::validate(&raw))?;
            // A band in the spectrum's own variable: the wavelength limits converted.
            let (lo, hi) = match s.variable {
                SpectralVariable::Wavelength => (l, l * ratio),
                SpectralVariable::Wavenumber => (1.0 / (l * ratio), 1.0 / l),
                SpectralVariable::Frequency => (2.997_924_58e8 / (l * ratio), 2.997_924_58e8 / l),
            };
            let b = Band::new(s, lo, hi);
            ok(
                "<Band as InBand>::in_band",
                &<Band as InBand>::in_band(&b, t),
            )?;
            let open = Band::new(s, lo, f64::MAX);
            ok(
                "<Band as InBand>::in_band (open)",
                &<Band as InBand>::in_band(&open, t),
            )?;
            let bw = Band::wavelength(l, l * ratio, q);
            ok("Band::wavelength in_band", &bw.in_band(t))?;
            let line = Line {
                spectrum: s,
                centre: lo,
                width: width * lo / l,
            };
            ok(
                "<Line as InBand>::in_band",
                &<Line as InBand>::in_band(&line, t),
            )?;
            // A model's signal as an in-band radiance.
            if let Ok(m) = SpectralPoint::new(l, Default::default()) {
                let mr = ModelRadiance::new(&m, kind);
                prop_assert_eq!(ModelRadiance::kind(&mr), kind);
                ok(
                    "<ModelRadiance as InBand>::in_band",
                    &<ModelRadiance<SpectralPoint> as InBand>::in_band(&mr, t),
                )?;
                let dynm: &dyn InBand = &mr;
                ok("dyn InBand::in_band", &dynm.in_band(t))?;
            }
            Ok(())
        },
    );
}

fn cavities() -> impl Strategy<Value = Cavity> {
    (
        any::<bool>(),
        args(&[
            positive(1e-3, 0.05),
            positive(1e-2, 0.5),
            positive(1e-4, 0.05),
        ]),
    )
        .prop_map(|(cyl, v)| {
            let (radius_m, depth_m, aperture_radius_m) = (v[0], v[1], v[2]);
            if cyl {
                Cavity::Cylinder {
                    radius_m,
                    depth_m,
                    aperture_radius_m,
                }
            } else {
                Cavity::Cone {
                    radius_m,
                    depth_m,
                    aperture_radius_m,
                }
            }
        })
}

#[test]
fn fuzz_sources() {
    fuzz(
        "sources",
        2500,
        (
            cavities(),
            args(&[
                unit_open_closed(),
                arg(-0.01, 0.01).edges(&[-1.0, 0.0]),
                arg(-0.01, 0.01).edges(&[-1.0, 0.0]),
                positive(1e-3, 1e3),
                positive(0.1, 100.0),
                positive(1.0, 300.0),
                positive(1e-3, 0.1),
                positive(1e-4, 0.05),
                positive(1e-3, 1.0),
            ]),
        ),
        |(cav, v)| {
            let (ew, sm, sc, signal, dist, dsr, ap, fspot, target) =
                (v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8]);
            ok("Cavity::validate", &Cavity::validate(&cav))?;
            ok("Cavity::area_ratios", &Cavity::area_ratios(&cav))?;
            ok(
                "cavity_emissivity_gouffe",
                &cavity_emissivity_gouffe(ew, &cav),
            )?;
            // sse_relative_change: "A true change above `f64::MAX` is +∞."
            let rc = sse_relative_change(sm, sc);
            check("sse_relative_change", &rc, Inf::Documented)?;
            dok("sse_corrected_signal", &sse_corrected_signal(signal, sm))?;
            if let Ok(m) = RectangularBand::new(8e-6, 14e-6, Default::default()) {
                dok(
                    "sse_corrected_temperature",
                    &sse_corrected_temperature(&m, signal, rc.unwrap_or(sm)),
                )?;
            }
            // spot_diameter_m: "A true diameter above `f64::MAX` ... is +∞."
            check(
                "spot_diameter_m",
                &spot_diameter_m(dist, dsr),
                Inf::Documented,
            )?;
            dok(
                "spot_diameter_focused_m",
                &spot_diameter_focused_m(dist, ap, dist * 0.5, fspot),
            )?;
            dok(
                "spot_diameter_focused_m (raw)",
                &spot_diameter_focused_m(dist, ap, dsr, fspot),
            )?;
            dok("spot_fill", &spot_fill(target, fspot))?;
            Ok(())
        },
    );
}

fn spectral_units() -> impl Strategy<Value = SpectralUnit> {
    prop::sample::select(vec![
        SpectralUnit::Micrometre,
        SpectralUnit::Nanometre,
        SpectralUnit::PerCentimetre,
        SpectralUnit::Terahertz,
        SpectralUnit::Electronvolt,
    ])
}

fn scene_definitions() -> impl Strategy<Value = SceneDefinition> {
    (
        args(&[positive(0.5, 30.0), positive(0.5, 30.0), unit_open_closed()]),
        spectral_units(),
    )
        .prop_map(|(v, unit)| SceneDefinition::Band {
            lower: v[0],
            upper: v[1],
            unit,
            emissivity: v[2],
            c2: C2Convention::Codata2018,
        })
}

fn detectors() -> impl Strategy<Value = Detector> {
    (
        conversions(),
        args(&[
            positive(1e-11, 1e-9),
            positive(1e-5, 1e-1),
            positive(1e4, 1e8),
            arg(0.0, 1e-9).edges(&[0.0]),
            arg(0.0, 500.0).edges(&[0.0]),
        ]),
    )
        .prop_map(|(conversion, v)| Detector {
            pixel_area_m2: v[0],
            conversion,
            integration_time_s: v[1],
            full_well_electrons: v[2],
            dark_current_a: v[3],
            read_noise_electrons: v[4],
        })
}

#[test]
fn fuzz_design_definition() {
    fuzz(
        "design definition",
        1500,
        (
            optics(),
            detectors(),
            scene_definitions(),
            args(&[
                arg(0.0, 1e6).edges(&[0.0]),
                temperature(),
                positive(1e6, 1e12),
                positive(1e-3, 1.0),
                positive(1e-6, 15e-6),
            ]),
            any::<bool>(),
        ),
        |(optics, detector, scene, v, with_peak)| {
            let conversion = detector.conversion;
            let prepared_scene = SceneDefinition::prepare(&scene, conversion);
            ok("SceneDefinition::prepare", &prepared_scene)?;
            if let Ok(s) = &prepared_scene {
                let _ = PreparedScene::kind(s);
                ok(
                    "<PreparedScene as InBand>::in_band",
                    &<PreparedScene as InBand>::in_band(s, v[1]),
                )?;
            }
            let definition = DesignDefinition {
                optics,
                detector,
                scene,
                background_electrons_per_s: v[0],
            };
            let prepared = DesignDefinition::prepare(&definition);
            ok("DesignDefinition::prepare", &prepared)?;
            if let Ok(d) = &prepared {
                let peak = with_peak.then_some(v[4]);
                report_check(
                    "PreparedDesign::evaluate",
                    &PreparedDesign::evaluate(d, v[1]),
                )?;
                ok(
                    "PreparedDesign::d_star_shape",
                    &PreparedDesign::d_star_shape(d, peak),
                )?;
                dok(
                    "PreparedDesign::netd_from_d_star",
                    &PreparedDesign::netd_from_d_star(d, v[2], v[1], peak),
                )?;
                dok(
                    "PreparedDesign::d_star_from_netd",
                    &PreparedDesign::d_star_from_netd(d, v[3], v[1], peak),
                )?;
            }
            Ok(())
        },
    );
}
