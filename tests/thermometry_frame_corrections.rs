//! Per-pixel corrections of the frame conversion (non-uniformity gain and offset, emissivity
//! map, bad-pixel mask) against the exact closed-form inverse per pixel (`object_temperature`
//! with the Sakuma–Hattori curve on the corrected signal), and the promise that frames without
//! corrections take exactly the existing path. Figures printed with `--nocapture`.

use quantaband::constants::C2Convention;
use quantaband::thermometry::frame::{FrameConverter, FrameSummary, PixelCorrections};
use quantaband::thermometry::measurement::{object_temperature, Conditions, Window};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;

fn setup() -> (SakumaHattori, Conditions) {
    // An invented LWIR curve and scene (the same kind as tests/thermometry_frame.rs).
    let curve = SakumaHattori::new(1.02e-5, 1.9e-4, 1.1e6, C2Convention::Codata2018).unwrap();
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
    (curve, cond)
}

/// A deterministic pseudo-random sequence in [0, 1) (a 64-bit LCG; test data only).
fn lcg(n: usize, seed: u64) -> Vec<f64> {
    let mut s = seed;
    (0..n)
        .map(|_| {
            s = s
                .wrapping_mul(6_364_136_223_846_793_005)
                .wrapping_add(1_442_695_040_888_963_407);
            (s >> 11) as f64 / (1u64 << 53) as f64
        })
        .collect()
}

/// Same output bits and the same summary (NaN range fields compared as NaN).
fn same32(a: &[f32], sa: FrameSummary, b: &[f32], sb: FrameSummary) {
    if let Some(i) = (0..a.len()).find(|&i| a[i].to_bits() != b[i].to_bits()) {
        panic!("pixel {i}: {} vs {}", a[i], b[i]);
    }
    same_summary(sa, sb);
}

fn same_summary(a: FrameSummary, b: FrameSummary) {
    assert_eq!((a.valid, a.invalid), (b.valid, b.invalid));
    assert_eq!(a.min_temperature_k.to_bits(), b.min_temperature_k.to_bits());
    assert_eq!(a.max_temperature_k.to_bits(), b.max_temperature_k.to_bits());
}

/// NUC gain and offset, an emissivity map and a mask on u16 counts, into f64 and f32: each
/// valid pixel against `object_temperature` of gain·(g_i·raw_i + o_i) + offset with ε_i.
/// Bound: f64 loop 1e-10·(T + B/A) (module docs); f32 output adds its rounding (6e-8·T).
#[test]
fn corrected_frames_match_exact_inverse() {
    let (curve, cond) = setup();
    let (gain, offset) = (0.5, 5000.0);
    let conv = FrameConverter::new(&curve, &cond, gain, offset).unwrap();
    let n = 20_000;
    let u = lcg(4 * n, 7);
    let raw: Vec<u16> = (0..n).map(|i| 12_000 + (u[i] * 50_000.0) as u16).collect();
    let g: Vec<f32> = (0..n).map(|i| (0.9 + 0.2 * u[n + i]) as f32).collect();
    let o: Vec<f32> = (0..n)
        .map(|i| (-300.0 + 600.0 * u[2 * n + i]) as f32)
        .collect();
    let eps: Vec<f32> = (0..n).map(|i| (0.5 + 0.5 * u[3 * n + i]) as f32).collect();
    let mask: Vec<u8> = (0..n).map(|i| u8::from(i % 97 == 0)).collect();
    let masked = mask.iter().filter(|&&m| m != 0).count();
    for with_eps in [false, true] {
        let corr = PixelCorrections {
            gain: Some(&g[..]),
            offset: Some(&o[..]),
            emissivity: if with_eps { Some(&eps[..]) } else { None },
            bad_pixels: Some(&mask[..]),
        };
        let mut out64 = vec![0f64; n];
        let mut out32 = vec![0f32; n];
        let s64 = conv.convert_corrected(&raw, &corr, &mut out64).unwrap();
        let s32 = conv.convert_corrected(&raw, &corr, &mut out32).unwrap();
        let (mut w64, mut w32): (f64, f64) = (0.0, 0.0);
        let mut valid = 0;
        let (mut lo, mut hi) = (f64::INFINITY, 0f64);
        for i in 0..n {
            if mask[i] != 0 {
                assert!(out64[i].is_nan() && out32[i].is_nan());
                continue;
            }
            let signal = gain * (f64::from(g[i]) * f64::from(raw[i]) + f64::from(o[i])) + offset;
            let c = Conditions {
                emissivity: if with_eps {
                    f64::from(eps[i])
                } else {
                    cond.emissivity
                },
                ..cond
            };
            match object_temperature(&curve, signal, &c) {
                Ok(t) => {
                    valid += 1;
                    lo = lo.min(t);
                    hi = hi.max(t);
                    w64 = w64.max((out64[i] - t).abs());
                    w32 = w32.max((f64::from(out32[i]) - t).abs() / t);
                }
                Err(_) => assert!(out64[i].is_nan() && out32[i].is_nan(), "pixel {i}"),
            }
        }
        println!(
            "NUC{} + mask: f64 max |dT| {w64:e} K, f32 max relative {w32:e}; {valid} valid, {masked} masked",
            if with_eps { " + emissivity map" } else { "" }
        );
        assert!(
            w64 <= 1e-10 * (hi + curve.b_mk() / curve.a_m()) + 1e-12,
            "{w64}"
        );
        assert!(w32 <= 6.0e-8, "{w32}");
        assert_eq!((s64.valid, s64.invalid), (valid, n - valid));
        assert_eq!((s32.valid, s32.invalid), (valid, n - valid));
        assert!(
            (s64.min_temperature_k - lo).abs() < 1e-8 && (s64.max_temperature_k - hi).abs() < 1e-8
        );
        assert!(valid > n / 2);
    }
}

/// No corrections: the very same output bits and summary as `convert` (u16 → f32 and f32 →
/// f32 take the single-precision loop; f64 the f64 loop).
#[test]
fn no_corrections_is_convert() {
    let (curve, cond) = setup();
    let conv = FrameConverter::new(&curve, &cond, 0.4, 0.0).unwrap();
    let n = 10_007;
    let u = lcg(n, 11);
    let counts: Vec<u16> = u.iter().map(|x| (x * 65_535.0) as u16).collect();
    let sig32: Vec<f32> = counts.iter().map(|&c| f32::from(c) * 0.4).collect();
    let sig64: Vec<f64> = sig32.iter().map(|&s| f64::from(s)).collect();
    let none = PixelCorrections::<f32>::NONE;
    let (mut a, mut b) = (vec![0f32; n], vec![0f32; n]);
    let sa = conv.convert(&counts, &mut a).unwrap();
    let sb = conv.convert_corrected(&counts, &none, &mut b).unwrap();
    same32(&a, sa, &b, sb);
    assert!(sa.valid > n / 2 && sa.invalid > 0);
    let conv1 = FrameConverter::new(&curve, &cond, 1.0, 0.0).unwrap();
    let sa = conv1.convert(&sig32, &mut a).unwrap();
    let sb = conv1.convert_corrected(&sig32, &none, &mut b).unwrap();
    same32(&a, sa, &b, sb);
    let (mut c, mut d) = (vec![0f64; n], vec![0f64; n]);
    let sc = conv1.convert(&sig64, &mut c).unwrap();
    let sd = conv1
        .convert_corrected(&sig64, &PixelCorrections::<f64>::default(), &mut d)
        .unwrap();
    same_summary(sc, sd);
    assert!(c.iter().zip(&d).all(|(x, y)| x.to_bits() == y.to_bits()));
    // identity NUC maps through the f64 loop give the f64 loop's numbers
    let ones = vec![1f32; n];
    let zeros = vec![0f32; n];
    let ident = PixelCorrections {
        gain: Some(&ones[..]),
        offset: Some(&zeros[..]),
        ..PixelCorrections::NONE
    };
    let se = conv1.convert_corrected(&sig64, &ident, &mut d).unwrap();
    same_summary(sc, se);
    assert!(c.iter().zip(&d).all(|(x, y)| x.to_bits() == y.to_bits()));
}

/// A mask alone keeps the single-precision loop: bit-identical to `convert` on the pixels
/// that are not masked, NaN on masked ones, and the summary counts and range without them.
#[test]
fn mask_only_keeps_fast_loop() {
    let (curve, cond) = setup();
    let conv = FrameConverter::new(&curve, &cond, 0.5, 0.0).unwrap();
    let n = 5_003;
    let u = lcg(n, 3);
    let mut counts: Vec<u16> = u.iter().map(|x| 20_000 + (x * 30_000.0) as u16).collect();
    // the hottest pixel is masked, so the range must exclude it
    counts[17] = 60_000;
    let mask: Vec<u8> = (0..n).map(|i| u8::from(i == 17 || i % 10 == 3)).collect();
    let mut full = vec![0f32; n];
    conv.convert(&counts, &mut full).unwrap();
    let mut out = vec![0f32; n];
    let corr = PixelCorrections::<f32> {
        bad_pixels: Some(&mask[..]),
        ..PixelCorrections::NONE
    };
    let s = conv.convert_corrected(&counts, &corr, &mut out).unwrap();
    let mut expect = FrameSummary {
        valid: 0,
        invalid: 0,
        min_temperature_k: f64::INFINITY,
        max_temperature_k: 0.0,
    };
    for i in 0..n {
        if mask[i] != 0 {
            assert!(out[i].is_nan());
            expect.invalid += 1;
        } else {
            assert_eq!(out[i].to_bits(), full[i].to_bits(), "pixel {i}");
            expect.valid += 1;
            expect.min_temperature_k = expect.min_temperature_k.min(f64::from(out[i]));
            expect.max_temperature_k = expect.max_temperature_k.max(f64::from(out[i]));
        }
    }
    same_summary(s, expect);
    assert!(s.valid > 0 && s.max_temperature_k < f64::from(full[17]));
    // and it was the single-precision loop: its result differs from the f64 loop's (rounded)
    // on some pixels (the f32 arithmetic error is ~0.1 mK, the output rounding ~0.01 mK)
    let mut exact = vec![0f64; n];
    conv.convert(&counts, &mut exact).unwrap();
    assert!((0..n).any(|i| mask[i] == 0 && out[i] != exact[i] as f32));
    // a frame that needs the f64 fallback (a pixel hotter than the f32 range) still masks
    let mut hot = counts.clone();
    hot[1] = 65_535;
    let hot_conv = FrameConverter::new(&curve, &cond, 30.0, 0.0).unwrap();
    let mut f64_out = vec![0f64; n];
    hot_conv.convert(&hot, &mut f64_out).unwrap();
    let s = hot_conv.convert_corrected(&hot, &corr, &mut out).unwrap();
    assert!(f64_out[1] > 1300.0, "{}", f64_out[1]);
    for i in 0..n {
        if mask[i] != 0 {
            assert!(out[i].is_nan());
        } else {
            assert_eq!(out[i], f64_out[i] as f32, "pixel {i}");
        }
    }
    assert_eq!(s.invalid, mask.iter().filter(|&&m| m != 0).count());
}

/// Bad per-pixel values are invalid pixels, not errors; wrong lengths are errors.
#[test]
fn invalid_pixels_and_lengths() {
    let (curve, cond) = setup();
    let conv = FrameConverter::new(&curve, &cond, 1.0, 0.0).unwrap();
    let raw = [30_000.0f64; 4];
    assert!(conv.background() < 20_000.0);
    let g = [1.0f32, f32::NAN, 1.0, 1.0];
    let o = [0.0f32, 0.0, f32::INFINITY, -1.0e9];
    let mut out = [0f64; 4];
    let corr = PixelCorrections {
        gain: Some(&g[..]),
        offset: Some(&o[..]),
        ..PixelCorrections::NONE
    };
    let s = conv.convert_corrected(&raw, &corr, &mut out).unwrap();
    assert_eq!((s.valid, s.invalid), (1, 3));
    assert!(out[0].is_finite() && out[1].is_nan() && out[2].is_nan() && out[3].is_nan());
    let e = [0.9f32, 0.0, 1.5, f32::NAN];
    let corr = PixelCorrections {
        emissivity: Some(&e[..]),
        ..PixelCorrections::NONE
    };
    let s = conv.convert_corrected(&raw, &corr, &mut out).unwrap();
    assert_eq!((s.valid, s.invalid), (1, 3));
    let short = [1.0f32; 3];
    let mask3 = [0u8; 3];
    for corr in [
        PixelCorrections {
            gain: Some(&short[..]),
            ..PixelCorrections::NONE
        },
        PixelCorrections {
            offset: Some(&short[..]),
            ..PixelCorrections::NONE
        },
        PixelCorrections {
            emissivity: Some(&short[..]),
            ..PixelCorrections::NONE
        },
        PixelCorrections {
            bad_pixels: Some(&mask3[..]),
            ..PixelCorrections::NONE
        },
    ] {
        assert_eq!(
            conv.convert_corrected(&raw, &corr, &mut out)
                .unwrap_err()
                .code(),
            "LENGTH_MISMATCH"
        );
    }
    let mut out3 = [0f64; 3];
    assert_eq!(
        conv.convert_corrected(&raw, &PixelCorrections::<f32>::NONE, &mut out3)
            .unwrap_err()
            .code(),
        "LENGTH_MISMATCH"
    );
}
