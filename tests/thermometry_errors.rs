//! Every bad or degenerate input of the thermometry API returns its typed error (never a panic,
//! NaN or a made-up number). The README's thermometry section lists the same cases.

use quantaband::constants::C2Convention;
use quantaband::thermometry::frame::FrameConverter;
use quantaband::thermometry::measurement::{
    measured_signal, object_temperature, Conditions, Window,
};
use quantaband::thermometry::model::{SignalModel, SpectralPoint};
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::{max_interpolation_error_k, SakumaHattori};
use quantaband::thermometry::uncertainty::{uncertainty_budget, StandardUncertainties};
use quantaband::thermometry::{its90, ratio};
use quantaband::Error;

fn code<T: core::fmt::Debug>(r: Result<T, Error>) -> &'static str {
    r.expect_err("expected an error").code()
}

#[test]
fn response_table_errors() {
    assert_eq!(
        code(Response::new(&[1e-6, 2e-6], &[1.0])),
        "LENGTH_MISMATCH"
    );
    assert_eq!(code(Response::new(&[1e-6], &[1.0])), "TOO_FEW_POINTS");
    assert_eq!(code(Response::new(&[], &[])), "TOO_FEW_POINTS");
    assert_eq!(
        code(Response::new(&[2e-6, 1e-6], &[1.0, 1.0])),
        "NOT_INCREASING"
    );
    assert_eq!(
        code(Response::new(&[1e-6, 1e-6], &[1.0, 1.0])),
        "NOT_INCREASING"
    );
    assert_eq!(
        Response::new(&[1e-6, 2e-6, 2e-6], &[1.0, 1.0, 1.0]),
        Err(Error::NotIncreasing {
            arg: "wavelengths_m",
            index: 2
        })
    );
    assert_eq!(
        code(Response::new(&[0.0, 1e-6], &[1.0, 1.0])),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(Response::new(&[-1e-6, 1e-6], &[1.0, 1.0])),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(Response::new(&[f64::NAN, 1e-6], &[1.0, 1.0])),
        "NON_FINITE"
    );
    assert_eq!(
        code(Response::new(&[1e-6, f64::INFINITY], &[1.0, 1.0])),
        "NON_FINITE"
    );
    assert_eq!(
        code(Response::new(&[1e-6, 2e-6], &[f64::NAN, 1.0])),
        "NON_FINITE"
    );
    assert_eq!(
        code(Response::new(&[1e-6, 2e-6], &[-0.1, 1.0])),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        code(Response::new(&[1e-6, 2e-6], &[0.0, 0.0])),
        "NON_POSITIVE"
    );
    let r = Response::new(&[1e-6, 2e-6], &[1.0, 1.0]).unwrap();
    assert_eq!(code(r.value_at(f64::NAN)), "NON_FINITE");
    assert_eq!(code(r.value_at(0.0)), "NON_POSITIVE_SPECTRAL");
}

#[test]
fn signal_model_errors() {
    let r = Response::new(&[1e-6, 2e-6], &[1.0, 1.0]).unwrap();
    let m = ResponseSignal::new(r, C2Convention::Codata2018);
    assert_eq!(code(m.signal(0.0)), "NON_POSITIVE_TEMPERATURE");
    assert_eq!(code(m.signal(-5.0)), "NON_POSITIVE_TEMPERATURE");
    assert_eq!(code(m.signal(f64::NAN)), "NON_FINITE");
    assert_eq!(code(m.d_signal_dt(f64::INFINITY)), "NON_FINITE");
    assert_eq!(code(m.temperature(0.0)), "NON_POSITIVE");
    assert_eq!(code(m.temperature(-1.0)), "NON_POSITIVE");
    assert_eq!(code(m.temperature(f64::NAN)), "NON_FINITE");
    // more than any temperature up to 1e9 K gives
    assert_eq!(code(m.temperature(1e300)), "NO_SOLUTION");
    // a subnormal signal is still a valid (very cold) answer, not an error
    let t = m.temperature(1e-320).unwrap();
    assert!(t > 5.0 && t < 15.0, "{t}");
    assert_eq!(code(m.mean_wavelength_m(5.0)), "NO_SOLUTION"); // signal underflows at 5 K
    assert_eq!(
        code(m.effective_wavelength_m(0.0, 300.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(SpectralPoint::new(0.0, C2Convention::Its90)),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(SpectralPoint::new(f64::NAN, C2Convention::Its90)),
        "NON_FINITE"
    );
}

#[test]
fn measurement_errors() {
    let m = SpectralPoint::new(10e-6, C2Convention::Codata2018).unwrap();
    let ok = Conditions {
        emissivity: 0.9,
        ..Conditions::BLACKBODY
    };
    let bad = |c: Conditions| code(measured_signal(&m, 300.0, &c));
    assert_eq!(
        bad(Conditions {
            emissivity: 0.0,
            ..ok
        }),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        bad(Conditions {
            emissivity: 1.2,
            ..ok
        }),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        bad(Conditions {
            emissivity: f64::NAN,
            ..ok
        }),
        "NON_FINITE"
    );
    assert_eq!(
        bad(Conditions {
            path_transmittance: 0.0,
            ..ok
        }),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        bad(Conditions {
            reflected_temperature_k: 0.0,
            ..ok
        }),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        bad(Conditions {
            path_temperature_k: -1.0,
            ..ok
        }),
        "NON_POSITIVE_TEMPERATURE"
    );
    let w = Window {
        transmittance: 0.9,
        reflectance: 0.05,
        temperature_k: 300.0,
        reflected_temperature_k: 300.0,
    };
    assert_eq!(
        bad(Conditions {
            window: Some(Window {
                transmittance: 0.0,
                ..w
            }),
            ..ok
        }),
        "OUT_OF_RANGE"
    );
    assert_eq!(
        bad(Conditions {
            window: Some(Window {
                reflectance: -0.1,
                ..w
            }),
            ..ok
        }),
        "OUT_OF_RANGE"
    );
    // τ_w + ρ_w > 1: negative window emissivity
    assert_eq!(
        measured_signal(
            &m,
            300.0,
            &Conditions {
                window: Some(Window {
                    reflectance: 0.2,
                    ..w
                }),
                ..ok
            }
        ),
        Err(Error::OutOfRange {
            arg: "window.reflectance",
            value: 0.2,
            range: "[0, 1 - window.transmittance]"
        })
    );
    assert_eq!(
        bad(Conditions {
            window: Some(Window {
                temperature_k: 0.0,
                ..w
            }),
            ..ok
        }),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(measured_signal(&m, 0.0, &ok)),
        "NON_POSITIVE_TEMPERATURE"
    );
    // signal at or below the background: no physical solution, with both numbers reported
    let cold = Conditions {
        emissivity: 0.5,
        reflected_temperature_k: 300.0,
        ..Conditions::BLACKBODY
    };
    let bg = 0.5 * m.signal(300.0).unwrap();
    match object_temperature(&m, bg, &cold) {
        Err(Error::NoPhysicalSolution { signal, background }) => {
            assert_eq!(signal, bg);
            assert!((background - bg).abs() <= 1e-9 * bg);
        }
        other => panic!("{other:?}"),
    }
    assert_eq!(
        code(object_temperature(&m, 0.5 * bg, &cold)),
        "NO_PHYSICAL_SOLUTION"
    );
    assert_eq!(
        code(object_temperature(&m, -1.0, &ok)),
        "NO_PHYSICAL_SOLUTION"
    );
    assert_eq!(code(object_temperature(&m, f64::NAN, &ok)), "NON_FINITE");
}

#[test]
fn sakuma_hattori_errors() {
    let c2 = C2Convention::Codata2018;
    assert_eq!(code(SakumaHattori::new(0.0, 0.0, 1.0, c2)), "NON_POSITIVE");
    assert_eq!(
        code(SakumaHattori::new(1e-6, f64::NAN, 1.0, c2)),
        "NON_FINITE"
    );
    assert_eq!(
        code(SakumaHattori::new(1e-6, 0.0, -1.0, c2)),
        "NON_POSITIVE"
    );
    let sh = SakumaHattori::new(1e-5, -1e-3, 1.0, c2).unwrap();
    assert_eq!(code(sh.signal(50.0)), "OUT_OF_RANGE"); // A·T + B ≤ 0
    assert_eq!(code(sh.temperature(0.0)), "NON_POSITIVE");
    let sh = SakumaHattori::new(1e-5, 1e-3, 1.0, c2).unwrap();
    assert_eq!(code(sh.temperature(1e-300)), "NO_SOLUTION"); // inverse would be ≤ 0 K
                                                             // fit: too few, mismatched, repeated, non-monotone
    let mut r2 = [0.0; 2];
    assert_eq!(
        code(SakumaHattori::fit(&[300.0, 400.0], &[1.0, 2.0], c2, None)),
        "TOO_FEW_POINTS"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, 500.0],
            &[1.0, 2.0],
            c2,
            None
        )),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, 500.0],
            &[1.0, 2.0, 3.0],
            c2,
            Some(&mut r2)
        )),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        SakumaHattori::fit(&[300.0, 400.0, 400.0], &[1.0, 2.0, 2.5], c2, None),
        Err(Error::DegenerateFit {
            reason: "repeated temperature"
        })
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, 500.0],
            &[1.0, 3.0, 2.0],
            c2,
            None
        )),
        "DEGENERATE_FIT"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, 500.0],
            &[3.0, 2.0, 1.0],
            c2,
            None
        )),
        "DEGENERATE_FIT"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, 500.0],
            &[1.0, 0.0, 2.0],
            c2,
            None
        )),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, -400.0, 500.0],
            &[1.0, 2.0, 3.0],
            c2,
            None
        )),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(SakumaHattori::fit(
            &[300.0, 400.0, f64::NAN],
            &[1.0, 2.0, 3.0],
            c2,
            None
        )),
        "NON_FINITE"
    );
    let m = SpectralPoint::new(4e-6, c2).unwrap();
    assert_eq!(
        code(SakumaHattori::fit_model(&m, 600.0, 300.0, c2)),
        "DEGENERATE_FIT"
    );
    assert_eq!(
        code(max_interpolation_error_k(&sh, &m, 300.0, 600.0, 1)),
        "TOO_FEW_POINTS"
    );
    assert_eq!(
        code(max_interpolation_error_k(&sh, &m, 600.0, 600.0, 10)),
        "DEGENERATE_FIT"
    );
}

#[test]
fn its90_errors() {
    let g = its90::FixedPoint::Gold;
    assert_eq!(
        code(its90::its90_temperature(0.0, 650e-9, g)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(its90::its90_temperature(f64::INFINITY, 650e-9, g)),
        "NON_FINITE"
    );
    assert_eq!(
        code(its90::its90_temperature(2.0, 0.0, g)),
        "NON_POSITIVE_SPECTRAL"
    );
    assert_eq!(
        code(its90::temperature_from_ratio(
            2.0,
            650e-9,
            0.0,
            C2Convention::Its90
        )),
        "NON_POSITIVE_TEMPERATURE"
    );
    assert_eq!(
        code(its90::radiance_ratio(
            -1.0,
            650e-9,
            1337.33,
            C2Convention::Its90
        )),
        "NON_POSITIVE_TEMPERATURE"
    );
}

#[test]
fn uncertainty_errors() {
    let m = SpectralPoint::new(10e-6, C2Convention::Codata2018).unwrap();
    let c = Conditions {
        emissivity: 0.9,
        ..Conditions::BLACKBODY
    };
    let u = StandardUncertainties {
        emissivity: -0.01,
        ..Default::default()
    };
    assert_eq!(code(uncertainty_budget(&m, 8e6, &c, &u)), "OUT_OF_RANGE");
    let u = StandardUncertainties {
        signal: f64::NAN,
        ..Default::default()
    };
    assert_eq!(code(uncertainty_budget(&m, 8e6, &c, &u)), "NON_FINITE");
    let u = StandardUncertainties::default();
    assert_eq!(
        code(uncertainty_budget(&m, 0.0, &c, &u)),
        "NO_PHYSICAL_SOLUTION"
    );
}

#[test]
fn ratio_errors() {
    let c2 = C2Convention::Codata2018;
    assert_eq!(
        code(ratio::two_colour_temperature(1.05e-6, 0.9e-6, 0.5, 1.0, c2)),
        "INVALID_BAND"
    );
    assert_eq!(
        code(ratio::two_colour_temperature(0.9e-6, 0.9e-6, 0.5, 1.0, c2)),
        "INVALID_BAND"
    );
    assert_eq!(
        code(ratio::two_colour_temperature(0.9e-6, 1.05e-6, 0.0, 1.0, c2)),
        "NON_POSITIVE"
    );
    assert_eq!(
        code(ratio::two_colour_temperature(0.9e-6, 1.05e-6, 0.5, 0.0, c2)),
        "NON_POSITIVE"
    );
    // above the Rayleigh–Jeans limit (λ2/λ1)⁴ = 1.85: no temperature gives it
    assert_eq!(
        code(ratio::two_colour_temperature(0.9e-6, 1.05e-6, 2.0, 1.0, c2)),
        "NO_SOLUTION"
    );
    // channels given in the wrong order
    let a = SpectralPoint::new(0.9e-6, c2).unwrap();
    let b = SpectralPoint::new(1.05e-6, c2).unwrap();
    assert_eq!(
        code(ratio::ratio_temperature(&b, &a, 1.5, 1.0, 1500.0)),
        "UNSUPPORTED"
    );
    assert_eq!(
        code(ratio::ratio_temperature(&a, &b, 0.5, 1.0, 0.0)),
        "NON_POSITIVE_TEMPERATURE"
    );
}

#[test]
fn frame_errors() {
    let sh = SakumaHattori::new(1e-5, 1.8e-4, 1e6, C2Convention::Codata2018).unwrap();
    let c = Conditions::BLACKBODY;
    assert_eq!(code(FrameConverter::new(&sh, &c, 0.0, 0.0)), "NON_POSITIVE");
    assert_eq!(
        code(FrameConverter::new(&sh, &c, 1.0, f64::NAN)),
        "NON_FINITE"
    );
    assert_eq!(
        code(FrameConverter::new(
            &sh,
            &Conditions {
                emissivity: 2.0,
                ..c
            },
            1.0,
            0.0
        )),
        "OUT_OF_RANGE"
    );
    let conv = FrameConverter::new(&sh, &c, 1.0, 0.0).unwrap();
    let mut out = [0f32; 3];
    assert_eq!(code(conv.convert(&[1u16, 2], &mut out)), "LENGTH_MISMATCH");
    assert_eq!(
        code(conv.convert_with_emissivity(&[1u16, 2, 3], &[0.9f32, 0.9], &mut out)),
        "LENGTH_MISMATCH"
    );
    assert_eq!(
        code(conv.convert_with_emissivity(&[1u16, 2], &[0.9f32, 0.9], &mut out)),
        "LENGTH_MISMATCH"
    );
}
