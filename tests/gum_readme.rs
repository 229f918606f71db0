//! The README "Uncertainty" example, compiled and run (keep the two in sync). The GUM numbers
//! are checked against the module's own parts (they are covered against outside references in
//! `tests/gum_reference.rs`); here the point is that the example works as printed.

use quantaband::thermometry::gum::{Correlation, Coverage, CoverageMethod, InputUncertainty};
use quantaband::thermometry::measurement::Conditions;
use quantaband::thermometry::measurement_gum::{
    measurement_budget, measurement_estimates, MeasurementEquation,
};
use quantaband::thermometry::monte_carlo::{
    validate_gum, MonteCarlo, MonteCarloConfig, RunStatus, TrialCount,
};
use quantaband::thermometry::sakuma_hattori::SakumaHattori;

#[test]
fn readme_uncertainty_example() -> Result<(), quantaband::Error> {
    let curve = SakumaHattori::new(10e-6, 1.8e-4, 1e6, Default::default())?;
    let cond = Conditions {
        emissivity: 0.9,
        reflected_temperature_k: 295.0,
        path_transmittance: 0.98,
        path_temperature_k: 293.0,
        window: None,
    };
    let mut u = [InputUncertainty::ZERO; 9];
    u[0] = InputUncertainty::type_a(300.0, 9.0)?;
    u[1] = InputUncertainty::rectangular(0.02)?;
    u[2] = InputUncertainty::type_b(3.0)?;
    u[4] = InputUncertainty::type_b(3.0)?;
    let mut r = [0.0; 81];
    for i in 0..9 {
        r[i * 9 + i] = 1.0;
    }
    (r[2 * 9 + 4], r[4 * 9 + 2]) = (0.8, 0.8);
    let r = Correlation::new(&r)?;
    let gum = measurement_budget(&curve, 30_000.0, &cond, &u, Some(&r), Coverage::default())?;
    assert_eq!(gum.result.method.coverage, CoverageMethod::StudentT);
    let nu = gum.result.effective_degrees_of_freedom.unwrap();
    assert!(nu > 9.0 && nu.is_finite());
    println!(
        "T = {:.2} K, U = {:.2} K (k = {:.2}, nu_eff = {:?}): {}",
        gum.temperature_k,
        gum.result.expanded_uncertainty,
        gum.result.coverage_factor,
        gum.result.effective_degrees_of_freedom,
        gum.result.method.describe()
    );
    let config = MonteCarloConfig {
        trials: TrialCount::Fixed { trials: 200_000 },
        ..Default::default()
    };
    let mut mc = MonteCarlo::new(
        config,
        &measurement_estimates(30_000.0, &cond),
        &u,
        Some(&r),
    )?;
    let mut values = vec![0.0; 200_000];
    let model = MeasurementEquation::new(&curve, &cond);
    while mc.run(&model, &mut values, 20_000)?.status == RunStatus::Running {}
    let res = mc.finish(&mut values)?;
    let check = validate_gum(gum.temperature_k, &gum.result, &res)?;
    println!(
        "MC: {:.2} K, u = {:.3} K, 95 % [{:.2}, {:.2}] K; GUM validated: {}",
        res.estimate,
        res.standard_uncertainty,
        res.symmetric_interval[0],
        res.symmetric_interval[1],
        check.passed
    );
    // The Type A signal is sampled as a scaled t with ν = 9, whose standard deviation is
    // √(9/7) times u (JCGM 101 §6.4.9): the Monte Carlo u exceeds u_c, while the 95 %
    // intervals agree to about 0.1 K (the GUM's k = 2.05 accounts for the same ν).
    let uc = gum.result.combined_standard_uncertainty;
    assert!(res.standard_uncertainty > 1.03 * uc);
    let u_gum = gum.result.expanded_uncertainty;
    assert!((res.symmetric_interval[0] - (gum.temperature_k - u_gum)).abs() < 0.2);
    assert!((res.symmetric_interval[1] - (gum.temperature_k + u_gum)).abs() < 0.2);
    assert!(!check.passed && check.d_high < 0.2); // not to δ = 0.05 K, though
    Ok(())
}
