//! Native benchmarks of the quantaband core: a small self-written harness (no criterion, which
//! is slow to compile on a 2-core machine).
//!
//! For each case: warm up for `WARMUP`, choose an inner repetition count so that one sample
//! lasts at least `SAMPLE`, take up to `SAMPLES` samples (stopping early after `CASE_BUDGET`),
//! and print one JSON line with the median and minimum time per call in nanoseconds, plus the
//! value computed (the table script compares it with `benches/data/bench_reference.json`).
//! Inputs and outputs pass through `std::hint::black_box` so the optimiser can neither
//! constant-fold the call nor drop it.
//!
//! Run through `bash pkg-scripts/bench.sh` (which merges these lines with the Node and SciPy
//! ones into one table), or alone: `cargo bench --bench native [-- FILTER] [-- --quick]`.
//! Timings are never asserted anywhere; this is a measurement tool, not a test.

use std::hint::black_box;
use std::time::{Duration, Instant};

const WARMUP: Duration = Duration::from_millis(100);
const SAMPLE: Duration = Duration::from_millis(5);
const SAMPLES: usize = 31;
const CASE_BUDGET: Duration = Duration::from_millis(1500);

/// Timing summary of one case.
struct Timing {
    ns_median: f64,
    ns_min: f64,
    samples: usize,
    iters: u64,
}

/// Times `f`, which performs ONE call of the operation being measured.
fn measure<R, F: FnMut() -> R>(mut f: F, quick: bool) -> Timing {
    let (warmup, budget) = if quick {
        (WARMUP / 10, CASE_BUDGET / 10)
    } else {
        (WARMUP, CASE_BUDGET)
    };
    let t0 = Instant::now();
    let mut calls: u64 = 0;
    while t0.elapsed() < warmup || calls < 3 {
        black_box(f());
        calls += 1;
    }
    let per_call = t0.elapsed().as_secs_f64() / calls as f64;
    let iters = ((SAMPLE.as_secs_f64() / per_call).ceil() as u64).max(1);
    let mut times = Vec::with_capacity(SAMPLES);
    let start = Instant::now();
    for _ in 0..SAMPLES {
        let a = Instant::now();
        for _ in 0..iters {
            black_box(f());
        }
        times.push(a.elapsed().as_secs_f64() * 1e9 / iters as f64);
        if times.len() >= 5 && start.elapsed() > budget {
            break;
        }
    }
    times.sort_by(f64::total_cmp);
    let mid = times.len() / 2;
    let ns_median = if times.len() % 2 == 1 {
        times[mid]
    } else {
        0.5 * (times[mid - 1] + times[mid])
    };
    Timing {
        ns_median,
        ns_min: times[0],
        samples: times.len(),
        iters,
    }
}

/// A JSON number (JSON has no NaN/∞: those become null).
fn json_num(x: f64) -> String {
    if x.is_finite() {
        format!("{x:e}")
    } else {
        "null".to_string()
    }
}

/// Extra fields of a result line besides the timing.
#[derive(Default)]
struct Extra {
    value: Option<f64>,
    sample_values: Option<Vec<f64>>,
    max_abs_err_k: Option<f64>,
    pixels: Option<usize>,
    note: Option<&'static str>,
}

struct Runner {
    filter: Option<String>,
    quick: bool,
}

impl Runner {
    fn wants(&self, case: &str) -> bool {
        self.filter.as_deref().is_none_or(|f| case.contains(f))
    }

    /// Measures `f` and prints the result line for `case`.
    fn run<R, F: FnMut() -> R>(&self, case: &str, f: F, extra: Extra) {
        if !self.wants(case) {
            return;
        }
        let t = measure(f, self.quick);
        let mut line = format!(
            "{{\"impl\":\"native\",\"case\":\"{case}\",\"ns_median\":{},\"ns_min\":{},\"samples\":{},\"iters\":{}",
            json_num(t.ns_median),
            json_num(t.ns_min),
            t.samples,
            t.iters
        );
        if let Some(v) = extra.value {
            line += &format!(",\"value\":{}", json_num(v));
        }
        if let Some(vs) = extra.sample_values {
            let parts: Vec<String> = vs.iter().map(|&v| json_num(v)).collect();
            line += &format!(",\"sample_values\":[{}]", parts.join(","));
        }
        if let Some(e) = extra.max_abs_err_k {
            line += &format!(",\"max_abs_err_k\":{}", json_num(e));
        }
        if let Some(p) = extra.pixels {
            line += &format!(",\"pixels\":{p}");
        }
        if let Some(n) = extra.note {
            line += &format!(",\"note\":\"{n}\"");
        }
        line.push('}');
        println!("{line}");
    }

    /// Prints a line saying a case could not be run (never a made-up number).
    fn skip(&self, case: &str, why: &str) {
        if self.wants(case) {
            println!("{{\"impl\":\"native\",\"case\":\"{case}\",\"skipped\":\"{why}\"}}");
        }
    }
}

fn main() {
    let mut filter = None;
    let mut quick = false;
    for a in std::env::args().skip(1) {
        match a.as_str() {
            "--bench" => {}
            "--quick" => quick = true,
            s if !s.starts_with('-') => filter = Some(s.to_string()),
            _ => {}
        }
    }
    let runner = Runner { filter, quick };
    cases::radiometry(&runner);
    cases::thermometry(&runner);
    cases::statistics(&runner);
    cases::uncertainty(&runner);
}

/// The benchmark cases (inputs as in `benches/data/bench_reference.json`).
mod cases {
    use super::{black_box, Extra, Runner};
    use quantaband::constants::C2Convention;
    use quantaband::planck::{self, Spectrum};
    use quantaband::stats::{self, BoseOrder, FdOrder};
    use quantaband::thermometry::frame::FrameInput;
    use quantaband::thermometry::gum::{Distribution, InputUncertainty};
    use quantaband::thermometry::measurement_gum::{measurement_estimates, MeasurementEquation};
    use quantaband::thermometry::monte_carlo::{MonteCarlo, MonteCarloConfig, TrialCount};
    use quantaband::thermometry::spectral::{
        spectral_measured_signal, SpectralConditions, SpectralInstrument, SpectralValue,
        SpectralWindow,
    };
    use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
    use quantaband::thermometry::{
        Conditions, FrameConverter, Response, ResponseSignal, SakumaHattori, SignalModel,
    };
    use quantaband::{band, inverse};

    /// Invented Sakuma–Hattori calibration of the benchmark camera (A in m, B in m·K, C in
    /// signal units), the same as `benches/py/gen_bench_reference.py` and `benches/js/scene.mjs`.
    const SH_A: f64 = 1.05e-5;
    const SH_B: f64 = 1.5e-4;
    const SH_C: f64 = 2.0e4;

    const WIDTH: usize = 640;
    const HEIGHT: usize = 512;
    const EMISSIVITY: f64 = 0.95;
    const T_REFLECTED_K: f64 = 293.15;
    /// The scene as counts of an invented 14-bit camera: signal = gain·count + offset.
    const COUNT_GAIN: f64 = 0.1;
    const COUNT_OFFSET: f64 = -500.0;

    /// Temperature (K) of pixel (x, y) of the invented benchmark scene (as `sceneTemperature` in
    /// `benches/js/scene.mjs`): a gentle gradient with a hot spot.
    fn scene_temperature(x: usize, y: usize) -> f64 {
        let (xf, yf) = (x as f64, y as f64);
        let (dx, dy) = (xf - 400.0, yf - 200.0);
        285.0
            + 40.0 * xf / (WIDTH - 1) as f64
            + 20.0 * yf / (HEIGHT - 1) as f64
            + 120.0 * (-(dx * dx + dy * dy) / 3200.0).exp()
    }

    /// The scene as u16 counts (the f64 signal rounded to the nearest count, floor(x + 0.5) as
    /// in `benches/js/scene.mjs`) and the exact object temperatures of the counts' signals.
    fn scene_counts(sh: &SakumaHattori) -> (Vec<u16>, Vec<f64>) {
        let s = |t: f64| sh.c() / (sh.c2_mk() / (sh.a_m() * t + sh.b_mk())).exp_m1();
        let background = (1.0 - EMISSIVITY) * s(T_REFLECTED_K);
        let mut counts = Vec::with_capacity(WIDTH * HEIGHT);
        let mut exact = Vec::with_capacity(WIDTH * HEIGHT);
        for y in 0..HEIGHT {
            for x in 0..WIDTH {
                let t = scene_temperature(x, y);
                let signal = EMISSIVITY * s(t) + background;
                let c = ((signal - COUNT_OFFSET) / COUNT_GAIN + 0.5).floor() as u16;
                counts.push(c);
                let so = (COUNT_GAIN * f64::from(c) + COUNT_OFFSET - background) / EMISSIVITY;
                exact.push((sh.c2_mk() / (sh.c() / so).ln_1p() - sh.b_mk()) / sh.a_m());
            }
        }
        (counts, exact)
    }

    /// Times `conv` on one frame into f32, with the error of the output against `exact`.
    fn frame_row<I: FrameInput>(
        r: &Runner,
        case: &str,
        conv: &FrameConverter,
        raw: &[I],
        exact: &[f64],
        note: &'static str,
    ) {
        let mut out = vec![0f32; raw.len()];
        let err = match conv.convert(raw, &mut out) {
            Ok(_) => out
                .iter()
                .zip(exact)
                .map(|(&o, &e)| (f64::from(o) - e).abs())
                .fold(
                    0.0,
                    |m: f64, e| if e.is_nan() { f64::INFINITY } else { m.max(e) },
                ),
            Err(_) => f64::INFINITY,
        };
        let mut buf = vec![0f32; raw.len()];
        r.run(
            case,
            || conv.convert(black_box(raw), &mut buf).map(|s| s.valid),
            Extra {
                max_abs_err_k: Some(err),
                pixels: Some(raw.len()),
                note: Some(note),
                ..Extra::default()
            },
        );
    }

    /// The invented benchmark scene (same formulas as `benches/js/scene.mjs`): f32 measured
    /// signals and the exact object temperatures of those f32 signals (closed-form inverse in
    /// f64).
    fn scene(sh: &SakumaHattori) -> (Vec<f32>, Vec<f64>) {
        let s = |t: f64| sh.c() / (sh.c2_mk() / (sh.a_m() * t + sh.b_mk())).exp_m1();
        let background = (1.0 - EMISSIVITY) * s(T_REFLECTED_K);
        let mut signals = Vec::with_capacity(WIDTH * HEIGHT);
        for y in 0..HEIGHT {
            for x in 0..WIDTH {
                let t = scene_temperature(x, y);
                signals.push((EMISSIVITY * s(t) + background) as f32);
            }
        }
        let exact = signals
            .iter()
            .map(|&v| {
                let so = (f64::from(v) - background) / EMISSIVITY;
                (sh.c2_mk() / (sh.c() / so).ln_1p() - sh.b_mk()) / sh.a_m()
            })
            .collect();
        (signals, exact)
    }

    /// The tables (response, emissivity, path transmittance, window transmittance, window
    /// reflectance) and temperatures (object, reflected, path, window, window-reflected; K) of
    /// the `signal_table_400` case, read from benches/data/bench_reference.json.
    fn spectral_table_case() -> Result<(Vec<SpectralTableBuf>, [f64; 5]), &'static str> {
        let path = concat!(
            env!("CARGO_MANIFEST_DIR"),
            "/benches/data/bench_reference.json"
        );
        let text =
            std::fs::read_to_string(path).map_err(|_| "bench_reference.json not readable")?;
        let json: serde_json::Value =
            serde_json::from_str(&text).map_err(|_| "bench_reference.json not JSON")?;
        let i = &json["cases"]["signal_table_400"]["inputs"];
        let nums = |v: &serde_json::Value| -> Option<Vec<f64>> {
            v.as_array()?
                .iter()
                .map(serde_json::Value::as_f64)
                .collect()
        };
        let kinds = [
            ("response", TableKind::EnergyResponse),
            ("emissivity", TableKind::Emissivity),
            ("path_transmittance", TableKind::Transmittance),
            ("window_transmittance", TableKind::Transmittance),
            ("window_reflectance", TableKind::Reflectance),
        ];
        let mut tables = Vec::new();
        for (name, kind) in kinds {
            let t = &i["tables"][name];
            let (Some(w), Some(v)) = (nums(&t["wavelengths_m"]), nums(&t["values"])) else {
                return Err("signal_table_400 inputs missing (rerun gen_bench_reference.py)");
            };
            tables.push(SpectralTableBuf::new(kind, w, v).map_err(|e| e.code())?);
        }
        let mut temps = [0.0; 5];
        for (t, k) in temps.iter_mut().zip([
            "temperature_k",
            "reflected_temperature_k",
            "path_temperature_k",
            "window_temperature_k",
            "window_reflected_temperature_k",
        ]) {
            *t = i[k]
                .as_f64()
                .ok_or("signal_table_400 temperatures missing")?;
        }
        Ok((tables, temps))
    }

    /// `Ok(v)` as `v`, an error as NaN (the table then shows the case as wrong, not fast).
    fn val(r: quantaband::Result<f64>) -> f64 {
        r.unwrap_or(f64::NAN)
    }

    pub fn radiometry(r: &Runner) {
        // Single spectral radiance, 10 µm at 300 K.
        let one = || {
            val(planck::spectral_radiance_wavelength(
                black_box(10e-6),
                black_box(300.0),
            ))
        };
        r.run(
            "spectral_single",
            one,
            Extra {
                value: Some(one()),
                ..Extra::default()
            },
        );

        // A 10 000-point spectrum at 1000 K into a caller-provided buffer.
        let n = 10_000usize;
        let (first, last) = (1e-6, 20e-6);
        let step = (last - first) / (n - 1) as f64;
        let lambdas: Vec<f64> = (0..n).map(|i| first + i as f64 * step).collect();
        let mut out = vec![0.0; n];
        let spec = Spectrum::BLACKBODY;
        let spectrum = |out: &mut [f64]| {
            let t = black_box(1000.0);
            for (o, &l) in out.iter_mut().zip(black_box(&lambdas)) {
                *o = val(spec.spectral(l, t));
            }
            black_box(out[0])
        };
        spectrum(&mut out);
        let samples: Vec<f64> = (0..n).step_by(100).chain([n - 1]).map(|i| out[i]).collect();
        let mut buf = vec![0.0; n];
        r.run(
            "spectrum_10k",
            || spectrum(&mut buf),
            Extra {
                sample_values: Some(samples),
                ..Extra::default()
            },
        );
        // Band radiances.
        for (case, lo, hi, t) in [
            ("band_8_14_300", 8e-6, 14e-6, 300.0),
            ("band_1_2_1500", 1e-6, 2e-6, 1500.0),
        ] {
            let f = || {
                val(band::band(
                    &spec,
                    black_box(lo),
                    black_box(hi),
                    black_box(t),
                ))
            };
            r.run(
                case,
                f,
                Extra {
                    value: Some(f()),
                    ..Extra::default()
                },
            );
        }

        // Band inverse: the f64 band radiance of a 350 K blackbody in 8–14 µm.
        let radiance = 106.444_466_095_305_23;
        let f = || {
            val(inverse::temperature_from_band(
                &spec,
                black_box(8e-6),
                black_box(14e-6),
                black_box(radiance),
            ))
        };
        r.run(
            "band_inverse_8_14",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
    }

    pub fn thermometry(r: &Runner) {
        // Response-weighted signal of the invented 9-point long-wave response at 400 K.
        let wl = [
            7.5e-6, 8e-6, 9e-6, 10e-6, 11e-6, 12e-6, 13e-6, 14e-6, 14.5e-6,
        ];
        let resp = [0.0, 0.55, 0.85, 1.0, 0.97, 0.9, 0.75, 0.5, 0.0];
        match Response::new(&wl, &resp) {
            Ok(response) => {
                let model = ResponseSignal::new(response, C2Convention::Codata2018);
                let f = || val(model.signal(black_box(400.0)));
                r.run(
                    "response_signal_400",
                    f,
                    Extra {
                        value: Some(f()),
                        ..Extra::default()
                    },
                );
            }
            Err(e) => r.skip("response_signal_400", e.code()),
        }

        // Spectral-table signal: the spectral measurement equation with the 200-point tables
        // over 8–14 µm of benches/data/bench_reference.json (`signal_table_400`), 400 K.
        match spectral_table_case() {
            Ok((tables, temps)) => {
                let view = |k: usize| SpectralValue::Table(tables[k].as_table());
                let prepared = (|| -> quantaband::Result<_> {
                    let inst =
                        SpectralInstrument::new(tables[0].as_table(), C2Convention::Codata2018)?;
                    let cond = SpectralConditions {
                        emissivity: view(1),
                        reflectance: None,
                        reflected_temperature_k: temps[1],
                        path_transmittance: view(2),
                        path_temperature_k: temps[2],
                        window: Some(SpectralWindow {
                            transmittance: view(3),
                            reflectance: view(4),
                            temperature_k: temps[3],
                            reflected_temperature_k: temps[4],
                        }),
                    };
                    Ok((inst, cond))
                })();
                match prepared {
                    Ok((inst, cond)) => {
                        let f = || val(spectral_measured_signal(&inst, black_box(temps[0]), &cond));
                        r.run(
                            "signal_table_400",
                            f,
                            Extra {
                                value: Some(f()),
                                note: Some("spectral_measured_signal: 5 tables on 5 grids (200/200/200/150/120 points)"),
                                ..Extra::default()
                            },
                        );
                    }
                    Err(e) => r.skip("signal_table_400", e.code()),
                }
            }
            Err(why) => r.skip("signal_table_400", why),
        }

        // Sakuma–Hattori inverse, one value (invented coefficients, see the reference JSON).
        match SakumaHattori::new(SH_A, SH_B, SH_C, C2Convention::Codata2018) {
            Ok(sh) => {
                let f = || val(sh.temperature(black_box(476.040_312_057_229_7)));
                r.run(
                    "sh_inverse",
                    f,
                    Extra {
                        value: Some(f()),
                        ..Extra::default()
                    },
                );
            }
            Err(e) => r.skip("sh_inverse", e.code()),
        }

        // Whole-frame conversion, 640×512 f32 signals → f32 temperatures, the invented scene of
        // benches/js/scene.mjs (same formulas), emissivity 0.95, reflected 293.15 K.
        match SakumaHattori::new(SH_A, SH_B, SH_C, C2Convention::Codata2018) {
            Ok(sh) => {
                let cond = Conditions {
                    emissivity: EMISSIVITY,
                    reflected_temperature_k: T_REFLECTED_K,
                    ..Conditions::BLACKBODY
                };
                let (signals, exact) = scene(&sh);
                match FrameConverter::new(&sh, &cond, 1.0, 0.0) {
                    Ok(conv) => frame_row(
                        r,
                        "frame_640x512",
                        &conv,
                        &signals,
                        &exact,
                        "f32 signals in, f32 temperatures out",
                    ),
                    Err(e) => r.skip("frame_640x512", e.code()),
                }
                // the same scene as camera counts with gain/offset
                let (counts, exact) = scene_counts(&sh);
                match FrameConverter::new(&sh, &cond, COUNT_GAIN, COUNT_OFFSET) {
                    Ok(conv) => frame_row(
                        r,
                        "frame_counts_640x512",
                        &conv,
                        &counts,
                        &exact,
                        "u16 counts in (gain/offset), f32 temperatures out",
                    ),
                    Err(e) => r.skip("frame_counts_640x512", e.code()),
                }
            }
            Err(e) => {
                r.skip("frame_640x512", e.code());
                r.skip("frame_counts_640x512", e.code());
            }
        }
    }

    pub fn statistics(r: &Runner) {
        let f = || val(stats::bose_einstein(black_box(2.0)));
        r.run(
            "be_occupancy",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
        let f = || val(stats::fermi_dirac(black_box(2.0)));
        r.run(
            "fd_occupancy",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
        let f = || val(stats::fermi_dirac_integral(FdOrder::Half, black_box(1.5)));
        r.run(
            "fd_half",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
        let f = || {
            val(stats::inverse_fermi_dirac_half(black_box(
                2.144_860_877_583_114,
            )))
        };
        r.run(
            "fd_half_inverse",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
        let f = || {
            val(stats::bose_einstein_integral(
                BoseOrder::ThreeHalves,
                black_box(0.5),
            ))
        };
        r.run(
            "be_g32",
            f,
            Extra {
                value: Some(f()),
                ..Extra::default()
            },
        );
    }
    /// Monte Carlo (JCGM 101): 10⁵ trials of the measurement equation of the benchmark camera
    /// (its Sakuma–Hattori curve, emissivity 0.95, reflected 293.15 K) at the reading of a
    /// 350 K object, seed 1, including the final sort and statistics. The value is the run's
    /// standard uncertainty u(y), K; the reference is the GUM u_c of the same inputs (mpmath,
    /// `benches/py/gen_bench_reference.py`): they differ by the sampling error.
    pub fn uncertainty(r: &Runner) {
        const TRIALS: usize = 100_000;
        let Ok(sh) = SakumaHattori::new(SH_A, SH_B, SH_C, C2Convention::Codata2018) else {
            r.skip("monte_carlo_1e5", "curve");
            return;
        };
        let cond = Conditions {
            emissivity: EMISSIVITY,
            reflected_temperature_k: T_REFLECTED_K,
            ..Conditions::BLACKBODY
        };
        // signal of a 350 K object (as in the reference JSON), u(signal) = 0.5, emissivity
        // rectangular ±0.01 (u = 0.01/√3), u(T_refl) = 2 K
        let signal = 463.970_592_706_228_8;
        let mut u = [InputUncertainty::ZERO; 9];
        u[0].standard_uncertainty = 0.5;
        u[1].standard_uncertainty = 0.005_773_502_691_896_258;
        u[1].distribution = Distribution::Rectangular;
        u[2].standard_uncertainty = 2.0;
        let estimates = measurement_estimates(signal, &cond);
        let model = MeasurementEquation::new(&sh, &cond);
        let config = MonteCarloConfig {
            trials: TrialCount::Fixed { trials: TRIALS },
            seed: 1,
            ..MonteCarloConfig::default()
        };
        let mut values = vec![0.0; TRIALS];
        let run = |values: &mut [f64]| -> f64 {
            let mut go = || -> quantaband::Result<f64> {
                let mut mc = MonteCarlo::new(config, black_box(&estimates), &u, None)?;
                mc.run(&model, values, usize::MAX)?;
                Ok(mc.finish(values)?.standard_uncertainty)
            };
            val(go())
        };
        let value = run(&mut values);
        r.run(
            "monte_carlo_1e5",
            || run(&mut values),
            Extra {
                value: Some(value),
                note: Some(
                    "value: u(y) of the run vs the GUM u_c (mpmath); differs by the sampling error",
                ),
                ..Extra::default()
            },
        );
    }
}
