//! The Monte Carlo method (JCGM 101:2008) against outside references:
//! - the generator against the published xoshiro256** outputs for the state {1, 2, 3, 4} and
//!   SplitMix64's for seed 1234567 (the reference vectors of the rand_xoshiro crate, produced
//!   with the authors' C code);
//! - the JCGM 101 §9.2 additive model Y = X1 + X2 + X3 + X4 (published results recalled from
//!   memory: normal inputs u(y) = 2.00, interval ±3.92; four rectangular inputs ±3.88; three
//!   normal and one rectangular with u = 10: ±17.0, GUM ±19.9 not validated) and the exact
//!   distributions of those models from mpmath (`tests/data/gen_gum.py`);
//! - the grey measurement equation with window and correlated temperatures: Monte Carlo mean
//!   and standard deviation agree with the GUM (linear) result within the stated numerical
//!   tolerance when the input uncertainties are small.
//!
//! Trials are kept to a few 10⁵ so the suite runs in seconds. No timing is asserted.

use quantaband::thermometry::gum::{propagate, Correlation, Coverage, InputUncertainty};
use quantaband::thermometry::measurement::{Conditions, Window};
use quantaband::thermometry::measurement_gum::{
    measurement_budget, measurement_estimates, MeasurementEquation,
};
use quantaband::thermometry::monte_carlo::{
    histogram, recommended_bins, validate_gum, IntervalKind, MonteCarlo, MonteCarloConfig,
    MonteCarloModel, MonteCarloResult, RunStatus, TrialCount,
};
use quantaband::thermometry::random::{splitmix64, Sampler, Xoshiro256StarStar};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;
use quantaband::thermometry::student_t::coverage_factor;
use quantaband::Result;
use serde_json::Value;

fn data() -> Value {
    serde_json::from_str(include_str!("data/gum_reference.json")).expect("json")
}

fn sum_model(x: &[f64]) -> Result<f64> {
    Ok(x.iter().sum())
}

fn run_all<M: MonteCarloModel + ?Sized>(
    config: MonteCarloConfig,
    estimates: &[f64],
    inputs: &[InputUncertainty],
    correlation: Option<&Correlation<'_>>,
    model: &M,
    capacity: usize,
) -> MonteCarloResult {
    let mut mc = MonteCarlo::new(config, estimates, inputs, correlation).unwrap();
    let mut v = vec![0.0; capacity];
    while mc.run(model, &mut v, 50_000).unwrap().status == RunStatus::Running {}
    mc.finish(&mut v).unwrap()
}

#[test]
fn generators_match_published_vectors() {
    // rand_xoshiro `reference` test, "produced with the reference implementation"
    let want = [
        11520u64,
        0,
        1509978240,
        1215971899390074240,
        1216172134540287360,
        607988272756665600,
        16172922978634559625,
        8476171486693032832,
        10595114339597558777,
        2904607092377533576,
    ];
    let mut g = Xoshiro256StarStar::from_state([1, 2, 3, 4]).unwrap();
    for w in want {
        assert_eq!(g.next_u64(), w);
    }
    // SplitMix64, seed 1234567 (Java SplittableRandom / rand_xoshiro test vector)
    let mut s = 1234567u64;
    for w in [
        6457827717110365317u64,
        3203168211198807973,
        9817491932198370423,
        4593380528125082431,
        16408922859458223821,
    ] {
        assert_eq!(splitmix64(&mut s), w);
    }
}

#[test]
fn samplers_have_the_stated_moments_and_quantiles() {
    // Standard deviations of each distribution with u = 1, and the t(3) central 95 % from
    // mpmath (tests/data/gen_gum.py: k_95(3) = 3.182 446 305 284 263).
    use quantaband::thermometry::gum::Distribution::*;
    let n = 200_000;
    for dist in [Normal, Rectangular, Triangular, Arcsine] {
        let mut s = Sampler::new(99);
        let v: Vec<f64> = (0..n)
            .map(|_| s.sample(dist, 5.0, 1.0, f64::INFINITY))
            .collect();
        let m = v.iter().sum::<f64>() / n as f64;
        let sd = (v.iter().map(|x| (x - m) * (x - m)).sum::<f64>() / (n - 1) as f64).sqrt();
        assert!((m - 5.0).abs() < 0.01, "{dist:?} mean {m}");
        assert!((sd - 1.0).abs() < 0.01, "{dist:?} sd {sd}");
    }
    let mut s = Sampler::new(7);
    let k = 3.182_446_305_284_263;
    let inside = (0..n).filter(|_| s.student_t(3.0).abs() <= k).count() as f64 / n as f64;
    // binomial standard error √(0.95·0.05/n) = 4.9e-4
    assert!((inside - 0.95).abs() < 2.5e-3, "{inside}");
}

#[test]
fn jcgm_101_9_2_2_normal_inputs() {
    let d = data();
    let exact = d["jcgm101_9_2"]["normal4_upper"].as_f64().unwrap(); // 2·1.959 963 98…
    let u = [InputUncertainty::type_b(1.0).unwrap(); 4];
    let gum = propagate(&[1.0; 4], &u, None, Coverage::default(), None).unwrap();
    assert!((gum.combined_standard_uncertainty - 2.0).abs() < 1e-15);
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 300_000 },
        seed: 2008,
        ..Default::default()
    };
    let r = run_all(config, &[0.0; 4], &u, None, &sum_model, 300_000);
    // published MCM (JCGM 101 Table 2, from memory): u(y) = 2.00, interval [−3.92, 3.92]
    assert_eq!((r.standard_uncertainty * 100.0).round() / 100.0, 2.0);
    assert_eq!((r.symmetric_interval[1] * 100.0).round() / 100.0, 3.92);
    // linear model, normal inputs: mean and sd equal the GUM result within the sampling
    // error the run reports (2s of the batch means, 30 batches)
    let spread = r.batch_spread.unwrap();
    assert!(r.estimate.abs() <= 2.0 * spread.estimate, "{r:?}");
    assert!((r.standard_uncertainty - 2.0).abs() <= 2.0 * spread.standard_uncertainty);
    assert!((r.symmetric_interval[1] - exact).abs() <= 2.0 * spread.upper);
    let v = validate_gum(0.0, &gum, &r).unwrap();
    assert!(v.passed, "{v:?}");
    println!(
        "JCGM 101 9.2.2: y = {:.4}, u = {:.4}, interval [{:.4}, {:.4}] (exact ±{exact:.4}), \
         delta = {}, 2s = {spread:?}",
        r.estimate,
        r.standard_uncertainty,
        r.symmetric_interval[0],
        r.symmetric_interval[1],
        r.numerical_tolerance
    );
}

#[test]
fn jcgm_101_9_2_3_rectangular_inputs() {
    let d = data();
    let exact = d["jcgm101_9_2"]["rect4_upper"].as_f64().unwrap(); // 3.879 4…
    let u = [InputUncertainty::rectangular(3f64.sqrt()).unwrap(); 4];
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 300_000 },
        seed: 3,
        ..Default::default()
    };
    let r = run_all(config, &[0.0; 4], &u, None, &sum_model, 300_000);
    let spread = r.batch_spread.unwrap();
    // published MCM (from memory): u(y) = 2.00, 95 % interval [−3.88, 3.88]; the exact end
    // point rounds to the published one, and the run lies within its sampling spread of it
    assert_eq!((exact * 100.0).round() / 100.0, 3.88);
    assert!((r.standard_uncertainty - 2.0).abs() <= 2.0 * spread.standard_uncertainty);
    assert!((r.symmetric_interval[1] - exact).abs() <= 2.0 * spread.upper);
    assert!((r.symmetric_interval[0] + exact).abs() <= 2.0 * spread.lower);
    // The GUM interval ±3.92 differs by 0.04 = δ(2, n_dig = 2) ≈ 0.05: validated, as
    // JCGM 101 reports for this case.
    let gum = propagate(&[1.0; 4], &u, None, Coverage::default(), None).unwrap();
    assert!(validate_gum(0.0, &gum, &r).unwrap().passed);
}

#[test]
fn jcgm_101_9_2_4_dominant_rectangular_input_fails_the_gum() {
    let d = data();
    let exact = d["jcgm101_9_2"]["rect10_normal3_upper"].as_f64().unwrap(); // 16.99…
    let mut u = [InputUncertainty::type_b(1.0).unwrap(); 4];
    u[3] = InputUncertainty::rectangular(10.0 * 3f64.sqrt()).unwrap();
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 300_000 },
        seed: 4,
        ..Default::default()
    };
    let r = run_all(config, &[0.0; 4], &u, None, &sum_model, 300_000);
    // published (from memory): u(y) = 10.1 (GUM and MCM), MCM interval [−17.0, 17.0],
    // GUM interval [−19.9, 19.9]; exact: u = √103, end point from mpmath
    let u_exact = d["jcgm101_9_2"]["rect10_normal3_u"].as_f64().unwrap();
    assert_eq!(
        (
            (u_exact * 10.0).round() / 10.0,
            (exact * 10.0).round() / 10.0
        ),
        (10.1, 17.0)
    );
    let spread = r.batch_spread.unwrap();
    assert!((r.standard_uncertainty - u_exact).abs() <= 2.0 * spread.standard_uncertainty);
    assert!((r.symmetric_interval[1] - exact).abs() <= 2.0 * spread.upper);
    let gum = propagate(&[1.0; 4], &u, None, Coverage::default(), None).unwrap();
    assert_eq!((gum.expanded_uncertainty * 10.0).round() / 10.0, 19.9);
    let v = validate_gum(0.0, &gum, &r).unwrap();
    assert!(!v.passed && v.d_high > 2.0, "{v:?}");
    // the shortest interval of a symmetric output is the symmetric one, within sampling
    assert!((r.shortest_interval[1] - r.symmetric_interval[1]).abs() < 0.2);
}

#[test]
fn chunked_runs_are_identical_to_one_call() {
    let u = [
        InputUncertainty::type_a(0.3, 4.0).unwrap(),
        InputUncertainty::triangular(1.0).unwrap(),
        InputUncertainty::arcsine(0.5).unwrap(),
    ];
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 25_000 },
        seed: 42,
        ..Default::default()
    };
    let model = |x: &[f64]| -> Result<f64> { Ok(x[0] * x[1].exp() + x[2]) };
    let est = [1.0, 0.2, 3.0];
    let mut a = MonteCarlo::new(config, &est, &u, None).unwrap();
    let mut b = a.clone();
    let mut va = vec![0.0; 25_000];
    let mut vb = vec![0.0; 25_000];
    a.run(&model, &mut va, usize::MAX).unwrap();
    let mut calls = 0;
    while b.run(&model, &mut vb, 777).unwrap().status == RunStatus::Running {
        calls += 1;
    }
    assert!(calls > 30);
    assert_eq!(va, vb);
    assert_eq!(a.finish(&mut va).unwrap(), b.finish(&mut vb).unwrap());
}

#[test]
fn adaptive_run_stabilises_and_states_its_tolerance() {
    let u = [InputUncertainty::type_b(1.0).unwrap(); 4];
    let config = MonteCarloConfig {
        significant_digits: 1,
        seed: 5,
        ..Default::default()
    };
    let r = run_all(config, &[0.0; 4], &u, None, &sum_model, 1_000_000);
    assert_eq!(r.status, RunStatus::Stabilized);
    assert!(r.stabilized && r.batches >= 2);
    assert_eq!(r.trials, r.batches * r.batch_size);
    // n_dig = 1: u = 2 → δ = 0.5
    assert_eq!(r.numerical_tolerance, 0.5);
    let s = r.batch_spread.unwrap();
    assert!(s.estimate <= 0.5 && s.upper <= 0.5);
    // a tiny buffer stops the same run before it stabilises
    let config = MonteCarloConfig {
        significant_digits: 4,
        ..config
    };
    let r = run_all(config, &[0.0; 4], &u, None, &sum_model, 30_000);
    assert_eq!(
        (r.status, r.stabilized, r.trials),
        (RunStatus::CapacityReached, false, 30_000)
    );
}

#[test]
fn measurement_equation_small_uncertainties_agree_with_gum() {
    // Small input uncertainties: the measurement equation is close to linear, so the Monte
    // Carlo mean and standard deviation must agree with the GUM estimate and u_c within the
    // numerical tolerance of the run (JCGM 101 §8), including correlated normal inputs.
    let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
    let w = Window {
        transmittance: 0.88,
        reflectance: 0.05,
        temperature_k: 310.0,
        reflected_temperature_k: 305.0,
    };
    let cond = Conditions {
        emissivity: 0.85,
        reflected_temperature_k: 300.0,
        path_transmittance: 0.97,
        path_temperature_k: 295.0,
        window: Some(w),
    };
    let signal = 40_000.0;
    let mut u = [InputUncertainty::ZERO; 9];
    u[0] = InputUncertainty::type_b(5.0).unwrap();
    u[1] = InputUncertainty::type_b(0.0005).unwrap();
    u[2] = InputUncertainty::type_b(1.0).unwrap();
    u[3] = InputUncertainty::type_b(0.0005).unwrap();
    u[4] = InputUncertainty::type_b(1.0).unwrap();
    u[5] = InputUncertainty::type_b(0.0005).unwrap();
    u[7] = InputUncertainty::type_b(1.0).unwrap();
    let mut m = [0.0; 81];
    for k in 0..9 {
        m[k * 9 + k] = 1.0;
    }
    for (i, j, r) in [(2, 4, 0.8), (2, 7, 0.5), (4, 7, 0.6)] {
        m[i * 9 + j] = r;
        m[j * 9 + i] = r;
    }
    let corr = Correlation::new(&m).unwrap();
    let gum =
        measurement_budget(&curve, signal, &cond, &u, Some(&corr), Coverage::default()).unwrap();
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 200_000 },
        seed: 9,
        significant_digits: 2,
        interval: IntervalKind::ProbabilisticallySymmetric,
        ..Default::default()
    };
    let eq = MeasurementEquation::new(&curve, &cond);
    let est = measurement_estimates(signal, &cond);
    let r = run_all(config, &est, &u, Some(&corr), &eq, 200_000);
    assert_eq!(r.invalid_trials, 0);
    let uc = gum.result.combined_standard_uncertainty;
    let delta = r.numerical_tolerance;
    assert!(
        (r.estimate - gum.temperature_k).abs() <= delta,
        "{} vs {}",
        r.estimate,
        gum.temperature_k
    );
    assert!(
        (r.standard_uncertainty - uc).abs() <= delta,
        "{} vs {uc}",
        r.standard_uncertainty
    );
    // The GUM interval is validated to the digits the run supports: two significant digits
    // of u_c when the run is stable to them (2s of the batch statistics ≤ δ), else one.
    let digits = if r.stabilized { 2 } else { 1 };
    let checked = MonteCarloResult {
        significant_digits: digits,
        ..r
    };
    let v = validate_gum(gum.temperature_k, &gum.result, &checked).unwrap();
    assert!(v.passed, "{v:?}");
    // without the correlations both methods give a measurably different spread (the
    // correlated sampling has teeth)
    let gum0 = measurement_budget(&curve, signal, &cond, &u, None, Coverage::default()).unwrap();
    let u0 = gum0.result.combined_standard_uncertainty;
    let r0 = run_all(config, &est, &u, None, &eq, 200_000);
    assert!((r0.standard_uncertainty - u0).abs() <= r0.numerical_tolerance);
    assert!((u0 - uc).abs() > 3.0 * delta, "{u0} vs {uc}");
    assert!((r0.standard_uncertainty - uc).abs() > 3.0 * delta);
    println!(
        "measurement equation, 200000 trials: MC y = {:.4} K, u = {:.4} K; GUM {:.4} K, u_c = \
         {uc:.4} K; delta = {delta} K; uncorrelated MC u = {:.4} K",
        r.estimate, r.standard_uncertainty, gum.temperature_k, r0.standard_uncertainty
    );
}

#[test]
fn invalid_trials_are_counted_and_a_mostly_invalid_run_stops() {
    let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
    let cond = Conditions {
        emissivity: 0.99,
        ..Conditions::BLACKBODY
    };
    let mut u = [InputUncertainty::ZERO; 9];
    u[1] = InputUncertainty::type_b(0.01).unwrap(); // normal about 0.99: some draws exceed 1
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 20_000 },
        ..Default::default()
    };
    let eq = MeasurementEquation::new(&curve, &cond);
    let r = run_all(
        config,
        &measurement_estimates(30_000.0, &cond),
        &u,
        None,
        &eq,
        20_000,
    );
    // P(ε > 1) = P(Z > 1) = 0.1587: about 0.1587/0.8413 invalid per valid trial
    let frac = r.invalid_trials as f64 / (r.invalid_trials as f64 + r.trials as f64);
    assert!((frac - 0.1587).abs() < 0.01, "{frac}");
    // centred on 1.0, more than half fail once a batch is done: NO_SOLUTION
    let cond1 = Conditions {
        emissivity: 1.0,
        ..Conditions::BLACKBODY
    };
    let mut u1 = u;
    u1[1] = InputUncertainty::type_b(0.001).unwrap();
    let mut mc =
        MonteCarlo::new(config, &measurement_estimates(30_000.0, &cond1), &u1, None).unwrap();
    let mut v = vec![0.0; 20_000];
    let eq1 = MeasurementEquation::new(&curve, &cond1);
    let mut err = None;
    for _ in 0..10 {
        match mc.run(&eq1, &mut v, 10_000) {
            Ok(p) if p.status == RunStatus::Running => {}
            Ok(p) => panic!("{p:?}"),
            Err(e) => {
                err = Some(e);
                break;
            }
        }
    }
    assert_eq!(err.map(|e| e.code()), Some("NO_SOLUTION"));
}

#[test]
fn histogram_bins_every_value_once() {
    let u = [InputUncertainty::type_b(1.0).unwrap(); 2];
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 100_000 },
        ..Default::default()
    };
    let mut mc = MonteCarlo::new(config, &[0.0; 2], &u, None).unwrap();
    let mut v = vec![0.0; 100_000];
    mc.run(&sum_model, &mut v, usize::MAX).unwrap();
    let r = mc.finish(&mut v).unwrap();
    let bins = recommended_bins(&v[..r.trials]).unwrap();
    // Freedman–Diaconis for a normal output: ≈ 2.44·M^(1/3) = 113 bins for 10⁵ values
    assert!((100..=125).contains(&bins), "{bins}");
    let mut counts = vec![0u64; bins];
    let h = histogram(&v[..r.trials], &mut counts).unwrap();
    assert_eq!(
        counts.iter().sum::<u64>() + h.below + h.above,
        r.trials as u64
    );
    assert!(h.below <= 51 && h.above <= 51);
    // the fullest bin is at the centre
    let (imax, _) = counts.iter().enumerate().max_by_key(|(_, c)| **c).unwrap();
    let centre = h.lower + (imax as f64 + 0.5) * h.bin_width;
    assert!(centre.abs() < 4.0 * h.bin_width, "{centre}");
    // coverage factor of the normal for comparison: the histogram spans ±3.29σ
    let z = coverage_factor(0.999, f64::INFINITY).unwrap() * 2f64.sqrt();
    assert!((h.upper - z).abs() < 0.1 && (h.lower + z).abs() < 0.1);
}
