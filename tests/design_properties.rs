//! Limiting cases, scaling laws, identities between the module's routes and round trips of
//! `quantaband::design`. Each identity is derived by hand in the comment beside it (no outside
//! number is needed: both sides are computed independently by different functions).
#![cfg(not(target_arch = "wasm32"))]

use quantaband::constants::{ELEMENTARY_CHARGE_E, PLANCK_H, SPEED_OF_LIGHT_C};
use quantaband::design::detector::{
    electron_rate, quantum_efficiency_from_responsivity, responsivity_from_quantum_efficiency,
};
use quantaband::design::merit::{
    background_photon_flux, blip_d_star, blip_d_star_from_flux, d_star_from_nep, d_star_from_netd,
    d_star_from_netd_optics, nep_w, netd_from_d_star, netd_from_d_star_optics, noise_bandwidth_hz,
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
    BackgroundView, Band, Cavity, ConeForm, Conversion, DStarShape, Detector, InBand, Line,
    Mechanism, ModelRadiance, Optics, RadianceKind,
};
use quantaband::planck::{Geometry, Quantity, SpectralVariable, Spectrum};
use quantaband::thermometry::{Response, ResponseSignal};

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

const CONES: [ConeForm; 2] = [ConeForm::Exact, ConeForm::SmallAngle];

/// Gouffé's ε_eff → 1 as the cavity deepens (s/S → 0 and s/S₀ → 0), rising monotonically; a
/// black wall gives exactly 1.
#[test]
fn cavity_tends_to_blackbody_as_depth_grows() {
    for wall in [0.3, 0.7, 0.9, 0.99] {
        for a in [0.25, 0.5, 1.0] {
            for cone in [false, true] {
                let mut prev = 0.0;
                let mut last = 0.0;
                let mut depth = 2.0;
                while depth <= 1e7 {
                    let cav = if cone {
                        Cavity::Cone {
                            radius_m: 1.0,
                            depth_m: depth,
                            aperture_radius_m: a,
                        }
                    } else {
                        Cavity::Cylinder {
                            radius_m: 1.0,
                            depth_m: depth,
                            aperture_radius_m: a,
                        }
                    };
                    let e = cavity_emissivity_gouffe(wall, &cav).unwrap();
                    assert!(e >= prev && e <= 1.0, "{wall} {a} {cone} {depth}: {e}");
                    prev = e;
                    last = e;
                    depth *= 2.0;
                }
                // At depth 8.4e6 radii: 1 − ε_eff ≈ (1 − ε)/ε · s/S ≤ 1e-6.
                assert!(1.0 - last < 1e-6, "{wall} {a} {cone}: {last}");
            }
        }
    }
    let cav = Cavity::Cylinder {
        radius_m: 0.01,
        depth_m: 0.05,
        aperture_radius_m: 0.005,
    };
    assert_eq!(cavity_emissivity_gouffe(1.0, &cav).unwrap(), 1.0);
}

fn mwir_detector(t_int: f64, read: f64) -> Detector {
    Detector {
        pixel_area_m2: 15e-6 * 15e-6,
        conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
        integration_time_s: t_int,
        full_well_electrons: 1e12,
        dark_current_a: 0.0,
        read_noise_electrons: read,
    }
}

/// NETD ∝ 1/√t_int: through D* (Δf = 1/(2t), NETD ∝ √Δf) and through electron counting with
/// shot noise only (σ ∝ √t, ∂N/∂T ∝ t). With read noise the second route falls faster.
#[test]
fn netd_scales_as_inverse_square_root_of_integration_time() {
    let scene = Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)
        .in_band(300.0)
        .unwrap();
    let lw = Band::wavelength(8e-6, 14e-6, Quantity::Energy)
        .in_band(300.0)
        .unwrap();
    let optics = Optics::new(2.0, 0.9);
    for t in [1e-5, 1e-3, 0.1] {
        let n1 = netd_from_d_star_optics(
            1e9,
            DStarShape::Flat,
            &lw,
            &optics,
            289e-12,
            noise_bandwidth_hz(t).unwrap(),
        )
        .unwrap();
        let n4 = netd_from_d_star_optics(
            1e9,
            DStarShape::Flat,
            &lw,
            &optics,
            289e-12,
            noise_bandwidth_hz(4.0 * t).unwrap(),
        )
        .unwrap();
        assert!(rel(n4, 0.5 * n1) < 1e-15, "{n1} {n4}");

        let e1 = mwir_detector(t, 0.0)
            .evaluate(&scene, &optics, 1e6)
            .unwrap();
        let e4 = mwir_detector(4.0 * t, 0.0)
            .evaluate(&scene, &optics, 1e6)
            .unwrap();
        assert!(rel(e4.netd_k, 0.5 * e1.netd_k) < 1e-15);
        let r1 = mwir_detector(t, 300.0)
            .evaluate(&scene, &optics, 0.0)
            .unwrap();
        let r4 = mwir_detector(4.0 * t, 300.0)
            .evaluate(&scene, &optics, 0.0)
            .unwrap();
        assert!(r4.netd_k < 0.5 * r1.netd_k);
    }
}

/// The background-limited D* equals the D* that reproduces the photon-noise-only
/// first-principles NETD. Scene = background: a blackbody at T_B filling the cold-stop cone,
/// ideal photon detector (η for λ ≤ λc), no read or dark noise, Δf = 1/(2t). By hand:
/// N = ηΦ_B·A·t, σ = √N, ∂N/∂T = ηA·t·Ω·∂L_q/∂T, NETD = σ/(∂N/∂T);
/// D* from NETD = √(AΔf)/(NETD·(hc/λc)·A·Ω·∂L_q/∂T) = (λc/hc)·√(η/(2Φ_B)).
#[test]
fn blip_d_star_equals_photon_noise_first_principles() {
    for (lc, tb, f, eta) in [
        (5e-6, 300.0, 2.0, 1.0),
        (12e-6, 295.0, 1.0, 0.6),
        (4.8e-6, 200.0, 4.0, 0.8),
    ] {
        for cone in CONES {
            let optics = Optics::new(f, 1.0).with_cone(cone);
            // 0…λc as wavenumbers 1/λc…∞ (f64::MAX).
            let scene = Band::new(
                Spectrum::new(
                    SpectralVariable::Wavenumber,
                    Quantity::Photon,
                    Geometry::Radiance,
                ),
                1.0 / lc,
                f64::MAX,
            )
            .in_band(tb)
            .unwrap();
            let t = 2e-3;
            let det = Detector {
                pixel_area_m2: 20e-6 * 20e-6,
                conversion: Conversion::QuantumEfficiency { efficiency: eta },
                integration_time_s: t,
                full_well_electrons: 1e15,
                dark_current_a: 0.0,
                read_noise_electrons: 0.0,
            };
            let rep = det.evaluate(&scene, &optics, 0.0).unwrap();
            let df = noise_bandwidth_hz(t).unwrap();
            let shape = DStarShape::IdealPhoton {
                peak_wavelength_m: lc,
            };
            let d_fp =
                d_star_from_netd_optics(rep.netd_k, shape, &scene, &optics, det.pixel_area_m2, df)
                    .unwrap();
            let view = BackgroundView::ColdStop { f_number: f, cone };
            let d_blip = blip_d_star(lc, eta, tb, &view, Mechanism::Photovoltaic).unwrap();
            assert!(
                rel(d_fp, d_blip) < 1e-14,
                "{lc} {tb} {cone:?}: {d_fp} vs {d_blip}"
            );
            // And the background flux is the scene's photon flux per unit area.
            let q = background_photon_flux(lc, tb, &view).unwrap();
            assert!(rel(q, rep.flux.flux / det.pixel_area_m2) < 1e-15);
        }
    }
}

/// Photoconductors: generation and recombination double the noise variance, D* is 1/√2 of
/// the photovoltaic value.
#[test]
fn photoconductive_blip_is_photovoltaic_over_root_two() {
    for view in [
        BackgroundView::Hemisphere,
        BackgroundView::ColdStop {
            f_number: 2.5,
            cone: ConeForm::Exact,
        },
    ] {
        let pv = blip_d_star(10e-6, 0.8, 300.0, &view, Mechanism::Photovoltaic).unwrap();
        let pc = blip_d_star(10e-6, 0.8, 300.0, &view, Mechanism::Photoconductive).unwrap();
        assert!(rel(pv / pc, core::f64::consts::SQRT_2) < 1e-15);
    }
    // A cold stop raises D* by √(Ω_hemisphere/Ω_stop) = √(4F² + 1).
    let hemi = blip_d_star(
        10e-6,
        0.8,
        300.0,
        &BackgroundView::Hemisphere,
        Mechanism::Photovoltaic,
    )
    .unwrap();
    let stop = blip_d_star(
        10e-6,
        0.8,
        300.0,
        &BackgroundView::ColdStop {
            f_number: 2.0,
            cone: ConeForm::Exact,
        },
        Mechanism::Photovoltaic,
    )
    .unwrap();
    assert!(rel(stop / hemi, 17f64.sqrt()) < 1e-14);
}

/// Colder backgrounds give larger BLIP D*, finite even when the background flux underflows.
#[test]
fn blip_d_star_for_cold_backgrounds_is_finite_and_monotone() {
    let mut prev = 0.0;
    for tb in [300.0, 100.0, 30.0, 10.0, 3.0, 2.5] {
        let d = blip_d_star(
            5e-6,
            1.0,
            tb,
            &BackgroundView::Hemisphere,
            Mechanism::Photovoltaic,
        )
        .unwrap();
        assert!(d.is_finite() && d > prev, "{tb}: {d}");
        prev = d;
    }
    // Wien limit check at 3 K (x = c2/(λT) ≈ 959, far in the Wien regime): ln Φ_B =
    // ln(π·2c(T/c2)³) + ln(∫_x^∞ t²e^{−t}dt) with ∫ = e^{−x}(x² + 2x + 2) (by hand).
    let (lc, tb) = (5e-6, 3.0);
    let c2 = quantaband::constants::C2;
    let x = c2 / (lc * tb);
    let ln_phi = (core::f64::consts::PI * 2.0 * SPEED_OF_LIGHT_C * (tb / c2).powi(3)).ln()
        + (x * x + 2.0 * x + 2.0).ln()
        - x;
    let ln_d = (lc / (PLANCK_H * SPEED_OF_LIGHT_C)).ln() - 0.5 * (2.0f64.ln() + ln_phi);
    let d = blip_d_star(
        lc,
        1.0,
        tb,
        &BackgroundView::Hemisphere,
        Mechanism::Photovoltaic,
    )
    .unwrap();
    assert!((d.ln() - ln_d).abs() < 1e-12, "{} vs {ln_d}", d.ln());
    // Colder still: at 2 K the flux is ≈ e^{−1390} and D* ≈ e^{740}, beyond f64: +∞, not NaN.
    let d = blip_d_star(
        5e-6,
        1.0,
        2.0,
        &BackgroundView::Hemisphere,
        Mechanism::Photovoltaic,
    )
    .unwrap();
    assert_eq!(d, f64::INFINITY);
}

#[test]
fn round_trips() {
    let mut worst = 0f64;
    for &d in &[1e7, 3.3e9, 2e11] {
        for &a in &[1e-12, 2.89e-10, 1e-6] {
            for &df in &[1.0, 30.0, 5e4] {
                let nep = nep_w(d, a, df).unwrap();
                worst = worst.max(rel(d_star_from_nep(nep, a, df).unwrap(), d));
                let netd = netd_from_d_star(d, a, df, 3.7e-11).unwrap();
                worst = worst.max(rel(d_star_from_netd(netd, a, df, 3.7e-11).unwrap(), d));
            }
        }
    }
    let lw = Band::wavelength(8e-6, 14e-6, Quantity::Energy)
        .in_band(300.0)
        .unwrap();
    let mw = Band::wavelength(3e-6, 5e-6, Quantity::Photon)
        .in_band(300.0)
        .unwrap();
    for cone in CONES {
        let o = Optics::new(1.3, 0.85).with_cone(cone).with_field_angle(0.2);
        for (scene, shape) in [
            (lw, DStarShape::Flat),
            (
                mw,
                DStarShape::IdealPhoton {
                    peak_wavelength_m: 5e-6,
                },
            ),
        ] {
            let n = netd_from_d_star_optics(2e9, shape, &scene, &o, 225e-12, 50.0).unwrap();
            let back = d_star_from_netd_optics(n, shape, &scene, &o, 225e-12, 50.0).unwrap();
            worst = worst.max(rel(back, 2e9));
        }
    }
    for &lam in &[0.5e-6, 1.55e-6, 4e-6, 10e-6] {
        for &eta in &[0.05, 0.6, 1.0] {
            let r = responsivity_from_quantum_efficiency(eta, lam).unwrap();
            worst = worst.max(rel(
                quantum_efficiency_from_responsivity(r, lam).unwrap(),
                eta,
            ));
        }
    }
    println!("round trips (NEP, NETD, D*, QE/responsivity): max rel {worst:.1e}");
    assert!(worst <= 4.5e-16);
    // SSE: the corrected reading of a signal scaled by the relative change is the original.
    for (sm, sc) in [(-0.002, 0.001), (0.0, 0.0), (0.01, -0.005)] {
        let delta = sse_relative_change(sm, sc).unwrap();
        assert!(rel(1.0 + delta, (1.0 + sm) / (1.0 + sc)) < 1e-15);
        let s = 123.456;
        assert!(rel(sse_corrected_signal(s * (1.0 + delta), delta).unwrap(), s) < 1e-15);
    }
}

/// Exact and small-angle forms: ratio 1 + 1/(4F²); the aperture/distance form is the f-number
/// form with F = d/D; the disc-to-disc étendue reduces to the point form for a tiny stop and to
/// A₁A₂/d² far away.
#[test]
fn cone_forms_and_geometry_limits() {
    for f in [0.7, 1.0, 2.0, 8.0] {
        let e = projected_solid_angle_sr(f, ConeForm::Exact).unwrap();
        let s = projected_solid_angle_sr(f, ConeForm::SmallAngle).unwrap();
        assert!(rel(s / e, 1.0 + 1.0 / (4.0 * f * f)) < 1e-15);
        let d_ap = 0.02;
        for cone in CONES {
            let a = etendue_from_aperture(1e-8, d_ap, f * d_ap, cone).unwrap();
            let b = etendue_from_f_number(1e-8, f, cone).unwrap();
            assert!(rel(a, b) < 1e-15);
            let lw = 54.9;
            let irr = focal_plane_irradiance(lw, &Optics::new(f, 0.5).with_cone(cone)).unwrap();
            assert!(rel(irr, 0.5 * lw * b / 1e-8) < 1e-15);
        }
        // Tiny field stop (1 µm) against the point form.
        let stop = 1e-6;
        let g = etendue_between_discs(stop, d_ap, f * d_ap, ConeForm::Exact).unwrap();
        let area = core::f64::consts::PI * stop * stop / 4.0;
        let p = etendue_from_aperture(area, d_ap, f * d_ap, ConeForm::Exact).unwrap();
        assert!(rel(g, p) < 1e-9, "{g} {p}");
    }
    // Far apart: exact → A₁A₂/d² (relative difference ≈ (r₁² + r₂²)/d²).
    let g = etendue_between_discs(0.01, 0.02, 100.0, ConeForm::Exact).unwrap();
    let s = etendue_between_discs(0.01, 0.02, 100.0, ConeForm::SmallAngle).unwrap();
    assert!(rel(g, s) < 2e-8);
    // Symmetric in the two discs (reciprocity).
    let a = etendue_between_discs(0.003, 0.05, 0.2, ConeForm::Exact).unwrap();
    let b = etendue_between_discs(0.05, 0.003, 0.2, ConeForm::Exact).unwrap();
    assert!(rel(a, b) < 1e-15);
    // Extreme sizes: finite or exact underflow, never NaN.
    for (d1, d2, d) in [
        (1e-200, 1e-200, 1.0),
        (1e200, 1e200, 1.0),
        (1.0, 1.0, 1e300),
    ] {
        for cone in CONES {
            let g = etendue_between_discs(d1, d2, d, cone).unwrap();
            assert!(!g.is_nan() && g >= 0.0, "{d1} {d2} {d}: {g}");
        }
    }
    let g = etendue_between_discs(1e200, 1e200, 1.0, ConeForm::Exact).unwrap();
    assert_eq!(g, f64::INFINITY); // π·A·1 ≈ 2.5e400: beyond f64
                                  // A huge area behind a tiny aperture: π·1e300/(4·1e400) = 7.85e-101, not a spurious 0.
    for cone in CONES {
        let g = etendue_from_f_number(1e300, 1e200, cone).unwrap();
        assert!(rel(g, core::f64::consts::PI / 4.0 * 1e-100) < 1e-15, "{g}");
        let g = etendue_from_aperture(1e300, 1e-100, 1e100, cone).unwrap();
        assert!(rel(g, core::f64::consts::PI / 4.0 * 1e-100) < 1e-15, "{g}");
    }
}

/// A monochromatic line converted by a responsivity ℜ = ηeλ/(hc) (energy route) gives the same
/// electrons as the photon route with quantum efficiency η.
#[test]
fn energy_and_photon_routes_agree() {
    let optics = Optics::new(2.0, 0.9);
    for lam in [1.55e-6, 4e-6, 10e-6] {
        let eta = 0.65;
        let w = lam * 1e-4;
        let le = Line {
            spectrum: Spectrum::default(),
            centre: lam,
            width: w,
        }
        .in_band(500.0)
        .unwrap();
        let lq = Line {
            spectrum: Spectrum::default().with_quantity(Quantity::Photon),
            centre: lam,
            width: w,
        }
        .in_band(500.0)
        .unwrap();
        let r = responsivity_from_quantum_efficiency(eta, lam).unwrap();
        let ne = electron_rate(
            &pixel_flux(&le, &optics, 1e-10).unwrap(),
            Conversion::Responsivity {
                amperes_per_watt: r,
            },
        )
        .unwrap();
        let nq = electron_rate(
            &pixel_flux(&lq, &optics, 1e-10).unwrap(),
            Conversion::QuantumEfficiency { efficiency: eta },
        )
        .unwrap();
        assert!(rel(ne.flux, nq.flux) < 1e-14);
        assert!(rel(ne.d_flux_dt, nq.d_flux_dt) < 1e-14);
    }
    // A flat responsivity table through ResponseSignal (Current kind) equals the exact band
    // with a Responsivity conversion, to the table integral's accuracy.
    let (wl, amps) = ([8e-6, 14e-6], [2.5, 2.5]);
    let table = ResponseSignal::new(Response::new(&wl, &amps).unwrap(), Default::default());
    let cur = ModelRadiance::new(&table, RadianceKind::Current)
        .in_band(320.0)
        .unwrap();
    let band = Band::wavelength(8e-6, 14e-6, Quantity::Energy)
        .in_band(320.0)
        .unwrap();
    let a = electron_rate(
        &pixel_flux(&cur, &optics, 1e-10).unwrap(),
        Conversion::Included,
    )
    .unwrap();
    let b = electron_rate(
        &pixel_flux(&band, &optics, 1e-10).unwrap(),
        Conversion::Responsivity {
            amperes_per_watt: 2.5,
        },
    )
    .unwrap();
    assert!(rel(a.flux, b.flux) < 1e-12 && rel(a.d_flux_dt, b.d_flux_dt) < 1e-12);
    // Photocurrent in the report is e × electron rate.
    let det = Detector {
        pixel_area_m2: 1e-10,
        conversion: Conversion::Included,
        integration_time_s: 1e-3,
        full_well_electrons: 1e9,
        dark_current_a: 0.0,
        read_noise_electrons: 0.0,
    };
    let rep = det.evaluate(&cur, &optics, 0.0).unwrap();
    assert!(rel(rep.photocurrent_a, a.flux * ELEMENTARY_CHARGE_E) < 1e-15);
}

#[test]
fn saturation_and_degenerate_signals() {
    let scene = Band::wavelength(3e-6, 5e-6, Quantity::Photon)
        .in_band(1500.0)
        .unwrap();
    let rep = mwir_detector(1e-3, 100.0)
        .evaluate(&scene, &Optics::new(2.0, 0.9), 0.0)
        .unwrap();
    let det_small = Detector {
        full_well_electrons: 1e6,
        ..mwir_detector(1e-3, 100.0)
    };
    let sat = det_small
        .evaluate(&scene, &Optics::new(2.0, 0.9), 0.0)
        .unwrap();
    assert!(!rep.saturated && sat.saturated && sat.well_fill >= 1.0);
    // A scene so cold that its in-band signal underflows: NETD +∞, SNR 0, never NaN.
    let cold = Band::wavelength(3e-6, 5e-6, Quantity::Photon)
        .in_band(1.0)
        .unwrap();
    let r = mwir_detector(1e-3, 0.0)
        .evaluate(&cold, &Optics::new(2.0, 0.9), 0.0)
        .unwrap();
    assert_eq!((r.snr, r.netd_k), (0.0, f64::INFINITY));
    let r = mwir_detector(1e-3, 10.0)
        .evaluate(&cold, &Optics::new(2.0, 0.9), 0.0)
        .unwrap();
    assert_eq!((r.snr, r.netd_k), (0.0, f64::INFINITY));
}

#[test]
fn spot_geometry() {
    for (d, r) in [(0.6, 12.0), (5.0, 75.0), (1e-3, 2.0)] {
        assert!(rel(spot_diameter_m(d, r).unwrap() * r, d) < 1e-15);
    }
    // Focused instrument: at the lens the spot is the aperture, at the focus the focal spot;
    // far away the D:S tends to d_f/(D + s_f) (similar triangles through the focus).
    let (ap, df, sf) = (0.03, 1.0, 0.01);
    assert!(rel(spot_diameter_focused_m(1e-12, ap, df, sf).unwrap(), ap) < 1e-10);
    assert!(rel(spot_diameter_focused_m(df, ap, df, sf).unwrap(), sf) < 1e-15);
    let far = 1e6;
    let ratio = far / spot_diameter_focused_m(far, ap, df, sf).unwrap();
    assert!(rel(ratio, df / (ap + sf)) < 1e-5);
    let f = spot_fill(0.05, 0.05).unwrap();
    assert!(f.fills && f.fill_fraction == 1.0);
    let f = spot_fill(0.049_999, 0.05).unwrap();
    assert!(!f.fills && f.fill_fraction < 1.0);
}

/// BLIP D* from a flux: the formula's dependence on η and λ (D* ∝ λ√η).
#[test]
fn blip_from_flux_scaling() {
    let a = blip_d_star_from_flux(5e-6, 0.25, 1e20, Mechanism::Photovoltaic).unwrap();
    let b = blip_d_star_from_flux(10e-6, 1.0, 1e20, Mechanism::Photovoltaic).unwrap();
    assert!(rel(b / a, 4.0) < 1e-15);
    let c = blip_d_star_from_flux(5e-6, 0.25, 4e20, Mechanism::Photovoltaic).unwrap();
    assert!(rel(a / c, 2.0) < 1e-15);
}

/// Configuration and result types as JSON (feature `serde`): camelCase fields, `kind` tags,
/// unknown fields rejected.
#[cfg(feature = "serde")]
#[test]
fn serde_shapes() {
    let det = Detector {
        pixel_area_m2: 225e-12,
        conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
        integration_time_s: 1e-3,
        full_well_electrons: 1.1e7,
        dark_current_a: 1e-12,
        read_noise_electrons: 200.0,
    };
    let json = serde_json::to_string(&det).unwrap();
    assert!(json.contains(r#""conversion":{"kind":"quantumEfficiency","efficiency":0.7}"#));
    assert!(json.contains(r#""pixelAreaM2""#) && json.contains(r#""readNoiseElectrons""#));
    assert_eq!(serde_json::from_str::<Detector>(&json).unwrap(), det);
    let o: Optics = serde_json::from_str(
        r#"{"fNumber":2,"transmittance":0.9,"cone":"smallAngle","fieldAngleRad":0}"#,
    )
    .unwrap();
    assert_eq!(o, Optics::new(2.0, 0.9).with_cone(ConeForm::SmallAngle));
    assert!(serde_json::from_str::<Optics>(
        r#"{"fNumber":2,"transmittance":0.9,"cone":"exact","fieldAngleRad":0,"x":1}"#
    )
    .is_err());
    let v: BackgroundView =
        serde_json::from_str(r#"{"kind":"coldStop","fNumber":2,"cone":"exact"}"#).unwrap();
    assert_eq!(
        v,
        BackgroundView::ColdStop {
            f_number: 2.0,
            cone: ConeForm::Exact
        }
    );
    let c: Cavity = serde_json::from_str(
        r#"{"kind":"cone","radiusM":0.01,"depthM":0.06,"apertureRadiusM":0.005}"#,
    )
    .unwrap();
    assert!(matches!(c, Cavity::Cone { .. }));
    let s: DStarShape =
        serde_json::from_str(r#"{"kind":"idealPhoton","peakWavelengthM":5e-6}"#).unwrap();
    assert_eq!(
        s,
        DStarShape::IdealPhoton {
            peak_wavelength_m: 5e-6
        }
    );
    let scene = Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)
        .in_band(300.0)
        .unwrap();
    let rep = det.evaluate(&scene, &Optics::new(2.0, 0.9), 0.0).unwrap();
    let j = serde_json::to_string(&rep).unwrap();
    assert!(j.contains(r#""netdK""#) && j.contains(r#""kind":"photon""#));
}
