//! Property tests (proptest): invariants of the thermometry API over random response tables,
//! conditions and frames — positivity and monotonicity of S(T), forward/inverse round trips,
//! and frame conversion never panicking with consistent counts for arbitrary inputs (NaN, ±∞,
//! negative values included). Common practice, no source: these are self-consistency checks;
//! values are checked against mpmath in `tests/thermometry_reference.rs`.
#![cfg(not(target_arch = "wasm32"))]

use proptest::prelude::*;
use quantaband::constants::C2Convention;
use quantaband::thermometry::frame::FrameConverter;
use quantaband::thermometry::measurement::{measured_signal, object_temperature, Conditions};
use quantaband::thermometry::model::SignalModel;
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;

/// A random response table: 2–6 strictly increasing wavelengths in 0.5–20 µm, values in [0, 1]
/// with the first one forced positive.
fn table() -> impl Strategy<Value = (Vec<f64>, Vec<f64>)> {
    (2usize..=6).prop_flat_map(|n| {
        (
            0.5e-6f64..10e-6,
            proptest::collection::vec(0.05e-6f64..2e-6, n - 1),
            proptest::collection::vec(0.0f64..1.0, n),
        )
            .prop_map(|(start, steps, mut vals)| {
                let mut wl = vec![start];
                for s in steps {
                    let last = *wl.last().unwrap();
                    wl.push(last + s);
                }
                vals[0] = vals[0].max(0.01);
                (wl, vals)
            })
    })
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 48, ..ProptestConfig::default() })]

    #[test]
    fn signal_positive_increasing_and_invertible((wl, v) in table(), t in 250.0f64..3000.0) {
        let m = ResponseSignal::new(Response::new(&wl, &v).unwrap(), C2Convention::Codata2018);
        let (s, ds) = m.signal_and_derivative(t).unwrap();
        prop_assert!(s > 0.0 && s.is_finite());
        prop_assert!(ds > 0.0 && ds.is_finite());
        let s_hotter = m.signal(t * 1.01).unwrap();
        prop_assert!(s_hotter > s);
        let tb = m.temperature(s).unwrap();
        prop_assert!((tb - t).abs() <= 1e-9 * t, "{} vs {}", tb, t);
        let lt = m.limiting_effective_wavelength_m(t).unwrap();
        prop_assert!(lt > 0.0 && lt.is_finite());
    }

    #[test]
    fn measurement_round_trip(
        t in 300.0f64..2500.0,
        eps in 0.05f64..=1.0,
        tau in 0.05f64..=1.0,
        t_refl in 200.0f64..400.0,
        t_path in 200.0f64..400.0,
    ) {
        let curve = SakumaHattori::new(3.9e-6, 2e-8, 5e4, C2Convention::Codata2018).unwrap();
        let c = Conditions {
            emissivity: eps,
            reflected_temperature_k: t_refl,
            path_transmittance: tau,
            path_temperature_k: t_path,
            window: None,
        };
        let s = measured_signal(&curve, t, &c).unwrap();
        let tb = object_temperature(&curve, s, &c).unwrap();
        prop_assert!((tb - t).abs() <= 1e-8 * t, "{} vs {}", tb, t);
    }

    #[test]
    fn frame_never_panics_and_counts_add_up(
        raw in proptest::collection::vec(prop_oneof![
            -1e6f64..1e6,
            Just(f64::NAN),
            Just(f64::INFINITY),
            Just(f64::NEG_INFINITY),
            Just(0.0),
            Just(f64::MAX),
            Just(f64::MIN_POSITIVE),
        ], 0..64),
        gain in 1e-6f64..1e3,
        offset in -1e4f64..1e4,
    ) {
        let curve = SakumaHattori::new(1e-5, 1.8e-4, 1e6, C2Convention::Codata2018).unwrap();
        let c = Conditions { emissivity: 0.9, reflected_temperature_k: 300.0, ..Conditions::BLACKBODY };
        let conv = FrameConverter::new(&curve, &c, gain, offset).unwrap();
        let mut out = vec![0f64; raw.len()];
        let sum = conv.convert(&raw, &mut out).unwrap();
        prop_assert_eq!(sum.valid + sum.invalid, raw.len());
        let valid = out.iter().filter(|t| !t.is_nan()).count();
        prop_assert_eq!(valid, sum.valid);
        for &t in &out {
            prop_assert!(t.is_nan() || (t > 0.0 && t.is_finite()));
        }
        if sum.valid > 0 {
            prop_assert!(sum.min_temperature_k <= sum.max_temperature_k);
        }
    }
}
