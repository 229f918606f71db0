//! Whole-frame conversion: the fast logarithm's error, the frame path against the exact
//! closed-form inverse (measurement equation + Sakuma–Hattori, `object_temperature`), invalid
//! pixels and the summary. The brief's target is ≤ 1 mK; the measured figures are printed
//! (`cargo test --test thermometry_frame -- --nocapture`). Speed is measured by the benchmark
//! harness, not here.

use quantaband::constants::C2Convention;
use quantaband::thermometry::frame::{fast_ln, FrameConverter};
use quantaband::thermometry::measurement::{object_temperature, Conditions, Window};
use quantaband::thermometry::model::SignalModel;
use quantaband::thermometry::response::{Response, ResponseSignal};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;

/// Relative error of `fast_ln` against the platform logarithm (`f64::ln`, correctly rounded to
/// within an ulp; an outside implementation) over w ∈ [1 + 1e-12, 1e300]. Bound from the module
/// docs: 5.2e-11 (series truncation) plus a few ulp.
#[test]
fn fast_ln_error_bound() {
    let mut worst: f64 = 0.0;
    let mut at = 0.0;
    let mut check = |w: f64| {
        let e = (fast_ln(w) / w.ln() - 1.0).abs();
        if e > worst {
            worst = e;
            at = w;
        }
    };
    // near 1, where ln w is small and relative accuracy matters most
    for i in 0..=4000 {
        check(1.0 + 10f64.powf(-12.0 + 12.0 * f64::from(i) / 4000.0));
    }
    // every octave boundary region and the reduction interval edges
    for i in 0..=200_000 {
        check(10f64.powf(300.0 * f64::from(i) / 200_000.0));
    }
    for k in -5..60 {
        let s = 2f64.powi(k);
        let (h, r2) = (std::f64::consts::FRAC_1_SQRT_2, std::f64::consts::SQRT_2);
        for m in [
            h,
            f64::from_bits(h.to_bits() + 1),
            1.0,
            f64::from_bits(r2.to_bits() - 1),
            r2,
            1.999999,
        ] {
            let w = s * m;
            if w > 1.0 {
                check(w);
            }
        }
    }
    println!("fast_ln: max relative error {worst:e} at w = {at}");
    assert!(worst <= 5.5e-11, "{worst} at {at}");
}

fn lwir_setup() -> (SakumaHattori, Conditions) {
    // A made-up 8–14 µm camera: fitted curve for 250–600 K, viewing a painted steel drum through
    // a germanium window in a humid hall.
    let wl = [8e-6, 14e-6];
    let r = [1.0, 1.0];
    let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Codata2018);
    let fit = SakumaHattori::fit_model(&model, 250.0, 600.0, C2Convention::Codata2018).unwrap();
    let cond = Conditions {
        emissivity: 0.93,
        reflected_temperature_k: 296.0,
        path_transmittance: 0.97,
        path_temperature_k: 299.0,
        window: Some(Window {
            transmittance: 0.9,
            reflectance: 0.04,
            temperature_k: 305.0,
            reflected_temperature_k: 303.0,
        }),
    };
    (fit.curve, cond)
}

/// f64 signals through the frame path against `object_temperature` (exact closed-form inverse)
/// over 200–1500 K on an LWIR curve and 500–3500 K on a short-wave curve. Bound (module docs):
/// 1e-10·(T + B/A) for x ≥ 0.05.
#[test]
fn frame_matches_exact_inverse_f64() {
    let (lwir, cond) = lwir_setup();
    let sw = SakumaHattori::new(0.9e-6, 6e-9, 3.0e8, C2Convention::Its90).unwrap();
    let sw_cond = Conditions {
        emissivity: 0.35,
        reflected_temperature_k: 900.0,
        ..Conditions::BLACKBODY
    };
    for (curve, cond, lo, hi) in [(lwir, cond, 200.0, 1500.0), (sw, sw_cond, 500.0, 3500.0)] {
        let n = 20_001;
        let temps: Vec<f64> = (0..n)
            .map(|i| lo + (hi - lo) * i as f64 / (n - 1) as f64)
            .collect();
        let (gain, bg) = cond.affine(&curve).unwrap();
        let signals: Vec<f64> = temps
            .iter()
            .map(|&t| gain * curve.signal(t).unwrap() + bg)
            .collect();
        let conv = FrameConverter::new(&curve, &cond, 1.0, 0.0).unwrap();
        let mut out = vec![0f64; n];
        let sum = conv.convert(&signals, &mut out).unwrap();
        assert_eq!((sum.valid, sum.invalid), (n, 0));
        let mut worst: f64 = 0.0;
        for (i, &s) in signals.iter().enumerate() {
            let exact = object_temperature(&curve, s, &cond).unwrap();
            worst = worst.max((out[i] - exact).abs());
            // and the exact inverse itself reproduces the generating temperature
            assert!((exact - temps[i]).abs() < 1e-8 * temps[i]);
        }
        println!("frame f64 vs exact inverse, {lo}-{hi} K: max |dT| = {worst:e} K");
        assert!(worst <= 1e-10 * hi * 2.0 + 1e-9, "{worst}");
        assert!(
            (sum.min_temperature_k - out[0]).abs() < 1e-12
                && (sum.max_temperature_k - out[n - 1]).abs() < 1e-9
        );
    }
}

/// u16 counts with gain/offset into f32 output: ≤ 1 mK against the exact inverse (brief), with
/// out-of-range counts flagged.
#[test]
fn frame_u16_counts_to_f32_within_1_mk() {
    let (curve, cond) = lwir_setup();
    // invented 14-bit detector: signal = 0.05·count − 120 (curve units)
    let (gain, offset) = (0.05, -120.0);
    let conv = FrameConverter::new(&curve, &cond, gain, offset).unwrap();
    let counts: Vec<u16> = (0..=u16::MAX).collect();
    let mut out = vec![0f32; counts.len()];
    let sum = conv.convert(&counts, &mut out).unwrap();
    let mut worst: f64 = 0.0;
    let mut valid = 0;
    let (mut lo, mut hi) = (f64::INFINITY, f64::NEG_INFINITY);
    for (&c, &t) in counts.iter().zip(&out) {
        let s = gain * f64::from(c) + offset;
        match object_temperature(&curve, s, &cond) {
            Ok(exact) => {
                valid += 1;
                assert!(!t.is_nan(), "count {c}");
                worst = worst.max((f64::from(t) - exact).abs());
                lo = lo.min(f64::from(t));
                hi = hi.max(f64::from(t));
            }
            Err(e) => {
                assert_eq!(e.code(), "NO_PHYSICAL_SOLUTION");
                assert!(t.is_nan(), "count {c} gave {t}");
            }
        }
    }
    println!(
        "u16 -> f32: {} valid, {} invalid, T {lo}..{hi} K, max |dT| = {worst:e} K",
        sum.valid, sum.invalid
    );
    assert_eq!(sum.valid, valid);
    assert_eq!(sum.invalid, counts.len() - valid);
    assert!(sum.invalid > 0 && sum.valid > 60_000);
    assert!(worst <= 1e-3, "{worst}");
    assert_eq!((sum.min_temperature_k, sum.max_temperature_k), (lo, hi));
}

/// Per-pixel emissivity: each pixel equals the exact inverse with that pixel's emissivity; bad
/// emissivities and non-finite inputs become NaN and are counted.
#[test]
fn frame_emissivity_map_and_invalid_pixels() {
    let (curve, cond) = lwir_setup();
    let conv = FrameConverter::new(&curve, &cond, 1.0, 0.0).unwrap();
    let (gain0, bg0) = cond.affine(&curve).unwrap();
    let base = gain0 * curve.signal(420.0).unwrap() + bg0;
    let eps: Vec<f32> = (0..1000).map(|i| 0.2 + 0.8 * i as f32 / 999.0).collect();
    let raw: Vec<f32> = vec![base as f32; 1000];
    let mut out = vec![0f64; 1000];
    let sum = conv.convert_with_emissivity(&raw, &eps, &mut out).unwrap();
    let mut worst: f64 = 0.0;
    for i in 0..1000 {
        let c = Conditions {
            emissivity: f64::from(eps[i]),
            ..cond
        };
        match object_temperature(&curve, f64::from(raw[i]), &c) {
            Ok(exact) => worst = worst.max((out[i] - exact).abs()),
            Err(_) => assert!(out[i].is_nan()),
        }
    }
    println!(
        "emissivity map: {} valid, max |dT| = {worst:e} K",
        sum.valid
    );
    assert!(worst <= 1e-7, "{worst}");
    // constant map equals the scalar path
    let c93 = vec![0.93f64; 4];
    let raw4 = [base, base * 1.1, base * 0.9, base * 2.0];
    let (mut a, mut b) = ([0f64; 4], [0f64; 4]);
    conv.convert(&raw4, &mut a).unwrap();
    conv.convert_with_emissivity(&raw4, &c93, &mut b).unwrap();
    for i in 0..4 {
        assert!((a[i] - b[i]).abs() < 1e-9, "{i}: {} vs {}", a[i], b[i]);
    }
    // invalid pixels
    let raw = [base, f64::NAN, f64::INFINITY, -1.0, 0.0, base];
    let eps = [0.9, 0.9, 0.9, 0.9, 0.9, 1.5];
    let mut out = [0f64; 6];
    let sum = conv.convert_with_emissivity(&raw, &eps, &mut out).unwrap();
    assert_eq!((sum.valid, sum.invalid), (1, 5));
    assert!(out[0].is_finite() && out[1..].iter().all(|t| t.is_nan()));
    assert_eq!(sum.min_temperature_k, out[0]);
    assert_eq!(sum.max_temperature_k, out[0]);
    // an all-invalid frame has NaN extremes, and an empty frame is fine
    let sum = conv.convert(&[f64::NAN, -5.0], &mut [0f64; 2]).unwrap();
    assert_eq!((sum.valid, sum.invalid), (0, 2));
    assert!(sum.min_temperature_k.is_nan() && sum.max_temperature_k.is_nan());
    let sum = conv.convert::<f64, f32>(&[], &mut []).unwrap();
    assert_eq!((sum.valid, sum.invalid), (0, 0));
}

/// A full 640×512 frame converts in one call; the summary matches a scan of the output.
#[test]
fn full_frame_summary() {
    let (curve, cond) = lwir_setup();
    let conv = FrameConverter::new(&curve, &cond, 0.02, 0.0).unwrap();
    let n = 640 * 512;
    // a made-up scene: a warm gradient with a cold stripe below the background (invalid)
    let counts: Vec<u16> = (0..n)
        .map(|i| {
            if i % 640 < 8 {
                10
            } else {
                (9000 + (i % 640) * 40 + (i / 640) * 3) as u16
            }
        })
        .collect();
    let mut out = vec![0f32; n];
    let sum = conv.convert(&counts, &mut out).unwrap();
    let valid: Vec<f32> = out.iter().copied().filter(|t| !t.is_nan()).collect();
    assert_eq!(sum.valid, valid.len());
    assert_eq!(sum.invalid, 512 * 8);
    let lo = valid.iter().copied().fold(f32::INFINITY, f32::min);
    let hi = valid.iter().copied().fold(f32::NEG_INFINITY, f32::max);
    assert_eq!(
        (sum.min_temperature_k, sum.max_temperature_k),
        (f64::from(lo), f64::from(hi))
    );
}

/// The single-precision loop (u16 counts → f32) against the exact closed-form f64 inverse
/// (`object_temperature`), every count 0..=65535, for an LWIR curve over 200–1500 K and a
/// 0.65 µm curve over 500–3500 K, with count scalings that put the background count (where
/// ln(1 + v) → ∞ and w → 1 at the far end) inside the range, near an integer from either side,
/// and below zero. Bound from the module docs: ≤ 1 mK (the f32 loop's own bound ≤ 0.74 mK at its
/// T + B/A ≤ 1200 K limit; a frame with a hotter pixel or one within 1/16 count of the
/// background goes through the f64 loop). Validity (NaN or not) must match the exact inverse pixel for pixel.
#[test]
fn frame_f32_path_error_bound_sweep() {
    let (lwir, cond) = lwir_setup();
    let sw = SakumaHattori::new(0.65e-6, 3e-10, 2.0e9, C2Convention::Its90).unwrap();
    let sw_cond = Conditions {
        emissivity: 0.8,
        reflected_temperature_k: 600.0,
        ..Conditions::BLACKBODY
    };
    let mut overall: f64 = 0.0;
    // (lo, hi) sub-ranges: counts 300..65000 span S(lo)..S(hi); a 0.65 µm signal changes by
    // e^38 over 500–3500 K, far more than 16 bits hold, so that curve is swept gain by gain.
    // (a frame with any pixel outside the f32 loop's range, e.g. above T + B/A = 1200 K, goes
    // whole through the f64 loop, so the first range of each curve stays below that)
    let lwir_ranges = [(200.0, 1150.0), (200.0, 1500.0)];
    let sw_ranges = [
        (500.0, 620.0),
        (600.0, 800.0),
        (780.0, 1100.0),
        (1050.0, 1600.0),
        (1500.0, 3500.0),
    ];
    for (name, curve, cond, ranges) in [
        ("LWIR 8-14 um", lwir, cond, &lwir_ranges[..]),
        ("0.65 um", sw, sw_cond, &sw_ranges[..]),
    ] {
        let (a, b) = cond.affine(&curve).unwrap();
        let sig = |t: f64| a * curve.signal(t).unwrap() + b;
        // signal = gain·count + offset; r0 = (b − offset)/gain is the background count
        let mut scalings = Vec::new();
        for &(lo, hi) in ranges {
            let g = (sig(hi) - sig(lo)) / 64_700.0;
            scalings.push((g, sig(lo) - 300.0 * g));
        }
        let (_, hi) = ranges[0];
        let span = sig(hi) - b;
        for r0 in [1000.01, 999.99, 37.5, -20_000.0] {
            let g = span / (65_535.0 - r0);
            scalings.push((g, b - g * r0));
        }
        let counts: Vec<u16> = (0..=u16::MAX).collect();
        for (gain, offset) in scalings {
            let conv = FrameConverter::new(&curve, &cond, gain, offset).unwrap();
            let mut out = vec![0f32; counts.len()];
            let sum = conv.convert(&counts, &mut out).unwrap();
            let mut worst: f64 = 0.0;
            let mut valid = 0;
            for (&c, &t) in counts.iter().zip(&out) {
                let s = gain * f64::from(c) + offset;
                match object_temperature(&curve, s, &cond) {
                    Ok(exact) if exact < 1e4 => {
                        valid += 1;
                        assert!(!t.is_nan(), "{name}: count {c}");
                        worst = worst.max((f64::from(t) - exact).abs());
                    }
                    Ok(_) => valid += 1,
                    Err(_) => assert!(t.is_nan(), "{name}: count {c} gave {t}"),
                }
            }
            assert_eq!(sum.valid, valid, "{name}");
            println!(
                "f32 loop {name}, gain {gain:.4e}, offset {offset:.4e}: {valid} valid, max |dT| = {worst:e} K"
            );
            overall = overall.max(worst);
            assert!(worst <= 0.74e-3, "{name}: {worst}");
        }
    }
    println!("f32 loop: overall max |dT| = {overall:e} K");
}

/// The fallback margin of the f32-signal loop for a frame (module docs of `frame`): pixels with
/// |raw − r0| below it go to the f64 loop. Returns (r0, margin) with r0 the raw value at the
/// background and ia = C·a/gain the raw-unit scale of v = ia/(raw − r0).
fn signal_margin(curve: &SakumaHattori, cond: &Conditions, gain: f64, offset: f64) -> (f64, f64) {
    let (a, b) = cond.affine(curve).unwrap();
    let r0 = (b - offset) / gain;
    let ia = curve.c() * a / gain;
    let margin = (r0.abs() / 16384.0).max(ia * 7.52e-37).max(2.36e-38);
    (r0, margin)
}

/// The single-precision loop for f32 signals (f32 → f32, scalar emissivity) against the exact
/// closed-form f64 inverse (`object_temperature`, measurement equation + Sakuma–Hattori
/// inverse), for an 8–14 µm curve over 200–1500 K and a 0.65 µm curve over 500–3500 K, each
/// with several emissivity/reflected/path settings and raw scalings (gain/offset putting the
/// background raw value r0 positive, zero and negative).
///
/// Frame A per setting: 10⁶ f32 signals log-spaced in d = raw − r0 from the cold end of the
/// range up to T + B/A = 1195 K (the f32 loop's limit is 1200 K), 2·10⁴ more log-spaced from
/// just above the fallback margin (|d| = 1.05·margin, or T = 20 K) up to the cold end, and
/// invalid pixels (d = −1.05·margin, below the background, NaN, −∞). It must take the f32 loop
/// (proved by output differing from the f64 loop's rounded output), match the exact inverse's
/// validity pixel for pixel, and stay within the derived bound 0.81 mK (module docs;
/// target ≤ 1 mK). Frame B adds one pixel just inside a fallback margin (|d| = 0.95·margin, or
/// T + B/A = 1210 K, or the top of the range): the whole frame must then equal the f64 loop.
#[test]
fn frame_f32_signals_error_bound_sweep() {
    let (lwir, lwir_cond) = lwir_setup();
    let sw = SakumaHattori::new(0.65e-6, 3e-10, 2.0e9, C2Convention::Its90).unwrap();
    let hall = Conditions {
        emissivity: 0.6,
        reflected_temperature_k: 350.0,
        path_transmittance: 0.9,
        path_temperature_k: 290.0,
        window: None,
    };
    let sw_a = Conditions {
        emissivity: 0.8,
        reflected_temperature_k: 600.0,
        ..Conditions::BLACKBODY
    };
    let sw_b = Conditions {
        emissivity: 0.35,
        reflected_temperature_k: 900.0,
        ..Conditions::BLACKBODY
    };
    // (name, curve, conditions, gain, offset, T range)
    let settings = [
        ("LWIR window", lwir, lwir_cond, 1.0, 0.0, 200.0, 1500.0),
        ("LWIR hall", lwir, hall, 1.0, 0.0, 200.0, 1500.0),
        (
            "LWIR blackbody",
            lwir,
            Conditions::BLACKBODY,
            1.0,
            0.0,
            200.0,
            1500.0,
        ),
        (
            "LWIR window, offset",
            lwir,
            lwir_cond,
            2.5e-3,
            40.0,
            200.0,
            1500.0,
        ),
        ("0.65 um e=0.8", sw, sw_a, 1.0, 0.0, 500.0, 3500.0),
        ("0.65 um e=0.35", sw, sw_b, 1.0, 0.0, 500.0, 3500.0),
        (
            "0.65 um blackbody",
            sw,
            Conditions::BLACKBODY,
            1.0,
            0.0,
            500.0,
            3500.0,
        ),
        (
            "0.65 um e=0.8, offset",
            sw,
            sw_a,
            1e4,
            -3.0e-6,
            500.0,
            3500.0,
        ),
    ];
    let mut overall: f64 = 0.0;
    for (name, curve, cond, gain, offset, lo, hi) in settings {
        let (a, _) = cond.affine(&curve).unwrap();
        let k0 = curve.b_mk() / curve.a_m();
        // raw − r0 of the pixel at temperature t
        let d_of = |t: f64| a * curve.signal(t).unwrap() / gain;
        let (r0, margin) = signal_margin(&curve, &cond, gain, offset);
        let t_top = (1195.0 - k0).min(hi);
        let d_min = (1.05 * margin).max(d_of(20.0));
        // (a cold object's signal can be below the f32 resolution of a large background: the
        // range then starts at the margin)
        let (d_lo, d_top) = (d_of(lo).max(d_min), d_of(t_top));
        let logspace = |x0: f64, x1: f64, n: usize| -> Vec<f64> {
            (0..n)
                .map(|i| x0 * (x1 / x0).powf(i as f64 / (n - 1) as f64))
                .collect()
        };
        let mut raw: Vec<f32> = logspace(d_lo, d_top, 1_000_000)
            .into_iter()
            .chain(logspace(d_min, d_lo, 20_000))
            .map(|d| (r0 + d) as f32)
            .collect();
        raw.extend([
            (r0 - 1.05 * margin) as f32,
            (r0 - 0.5 * r0.abs() - 1.0) as f32,
            f32::NAN,
            f32::NEG_INFINITY,
        ]);
        let conv = FrameConverter::new(&curve, &cond, gain, offset).unwrap();
        let mut out = vec![0f32; raw.len()];
        let sum = conv.convert(&raw, &mut out).unwrap();
        let mut out64 = vec![0f64; raw.len()];
        conv.convert(&raw, &mut out64).unwrap();
        let mut worst: f64 = 0.0;
        let mut valid = 0;
        let mut differs = 0;
        for ((&r, &t), &t64) in raw.iter().zip(&out).zip(&out64) {
            differs += usize::from(t.to_bits() != (t64 as f32).to_bits());
            match object_temperature(&curve, gain * f64::from(r) + offset, &cond) {
                Ok(exact) => {
                    valid += 1;
                    assert!(!t.is_nan(), "{name}: raw {r}");
                    worst = worst.max((f64::from(t) - exact).abs());
                }
                Err(_) => assert!(t.is_nan(), "{name}: raw {r} gave {t}"),
            }
        }
        assert_eq!(sum.valid, valid, "{name}");
        assert_eq!(sum.invalid, 4, "{name}");
        assert!(differs > 0, "{name}: frame A did not take the f32 loop");
        let t_first = object_temperature(&curve, gain * (r0 + d_lo) + offset, &cond).unwrap();
        println!(
            "f32 signals {name}: k0 {k0:.3} K, r0 {r0:.4e}, {valid} valid, {t_first:.0}..{t_top:.0} K, \
             {differs} differ from f64, max |dT| = {worst:e} K"
        );
        overall = overall.max(worst);
        assert!(worst <= 0.81e-3, "{name}: {worst}");

        // Frame B: one pixel inside a fallback margin sends the whole frame to the f64 loop.
        let near = [
            r0 + 0.95 * margin,
            r0 - 0.95 * margin,
            r0 + d_of(1210.0 - k0),
            r0 + d_of(hi),
        ];
        for extra in near {
            let mut raw_b = raw[..2000].to_vec();
            raw_b.push(extra as f32);
            let mut o32 = vec![0f32; raw_b.len()];
            let mut o64 = vec![0f64; raw_b.len()];
            conv.convert(&raw_b, &mut o32).unwrap();
            conv.convert(&raw_b, &mut o64).unwrap();
            for (x, y) in o32.iter().zip(&o64) {
                assert_eq!(x.to_bits(), (*y as f32).to_bits(), "{name}: extra {extra}");
            }
            // and the pixel itself (f64 loop, f32 output) agrees with the exact inverse
            let r = f64::from(extra as f32);
            match object_temperature(&curve, gain * r + offset, &cond) {
                Ok(exact) => assert!((f64::from(o32[2000]) - exact).abs() <= 1e-3, "{name}"),
                Err(_) => assert!(o32[2000].is_nan(), "{name}"),
            }
        }
    }
    println!("f32 signals: overall max |dT| = {overall:e} K");
}
