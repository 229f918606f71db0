//! Regression tests for the defects the property-based fuzz (`tests/fuzz_*.rs`) found.
//!
//! Each test pins one case: a panic-free call that used to return NaN, a spurious ±∞ or a wrong
//! value for an extreme but valid input. Expected values come from mpmath 1.3.0 at mp.dps = 50,
//! evaluating the defining formula, integral or root directly at the exact binary64 inputs (no
//! code of this crate): `python3 tests/data/gen_fuzz_regressions.py` prints every one, and the
//! expression is named beside each literal. Constants: SI 2019 exact h, c, k, e and CODATA 2018
//! m_e. `M` is f64::MAX = 2^1024·(1 − 2^-53).

#![allow(clippy::excessive_precision)] // mpmath digits kept as printed

use quantaband::constants::C2Convention;
use quantaband::design::detector::{electron_rate, noise_budget, Conversion};
use quantaband::design::merit::{
    background_photon_flux, blip_d_star_from_flux, BackgroundView, Mechanism,
};
use quantaband::design::scene::{InBandRadiance, RadianceKind};
use quantaband::design::sources::{cavity_emissivity_gouffe, Cavity};
use quantaband::design::throughput::{
    etendue_between_discs, focal_plane_irradiance, pixel_flux, ConeForm, Optics, PixelFlux,
};
use quantaband::stats::{
    band_carrier_density, fermi_dirac_integral, y_factor, y_factor_noise_temperature, FdOrder,
    LoadNoiseModel, Semiconductor,
};
use quantaband::thermometry::gum::{
    propagate, type_a, type_a_correlation, Coverage, InputUncertainty,
};
use quantaband::thermometry::its90::ratio_temperature_sensitivities;
use quantaband::thermometry::raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
};
use quantaband::thermometry::random::Sampler;
use quantaband::thermometry::ratio::two_colour_temperature;
use quantaband::thermometry::spectral::SpectralValue;
use quantaband::thermometry::student_t::{student_t_cdf, student_t_quantile};
use quantaband::units::{convert_temperature_difference, TemperatureUnit};

fn rel(a: f64, b: f64) -> f64 {
    (a / b - 1.0).abs()
}

const M: f64 = f64::MAX;

// ---------------------------------------------------------------------------------------------
// units

#[test]
fn fahrenheit_difference_near_f64_max_is_finite() {
    // Δt·5 overflowed before the division by 9. mpmath: M*5/9
    let want = 9.987_184_082_568_420_6e307;
    let got = TemperatureUnit::Fahrenheit
        .difference_to_kelvin("dt", M)
        .unwrap();
    assert!(rel(got, want) < 1e-15, "{got:e}");
    let got =
        convert_temperature_difference("dt", -M, TemperatureUnit::Rankine, TemperatureUnit::Kelvin)
            .unwrap();
    assert!(rel(got, -want) < 1e-15, "{got:e}");
}

// ---------------------------------------------------------------------------------------------
// stats

#[test]
fn y_factor_with_both_planck_loads_below_the_f64_range_is_their_ratio() {
    // T_R = 0, T_P(1.99 K) and T_P(2 K) at 1e15 Hz both underflow: 0/0 was NaN.
    // mpmath: T_P(2)/T_P(1.99), T_P(T) = (h f/k)/expm1(h f/(k T))
    let got = y_factor(0.0, 2.0, 1.99, 1e15, LoadNoiseModel::Planck).unwrap();
    assert!(rel(got, 2.338_645_656_541_559_2e52) < 1e-12, "{got:e}");
}

#[test]
fn y_factor_with_loads_near_f64_max_is_finite() {
    // T_hot + T_R overflowed. mpmath: (M + M)/(1 + M) = 2
    let got = y_factor(M, M, 1.0, 1e9, LoadNoiseModel::RayleighJeans).unwrap();
    assert_eq!(got, 2.0);
}

#[test]
fn y_factor_receiver_fields_with_hot_load_at_f64_max_are_finite() {
    // y·T_cold overflowed: the Callen–Welton receiver temperature was −∞.
    // mpmath: (T_X(M) − y·T_X(1e-3))/(y − 1), T_X the Planck or Callen–Welton load temperature
    let r = y_factor_noise_temperature(
        1e306,
        M,
        1e-3,
        2.187_725_284_778_594_5e13,
        LoadNoiseModel::Planck,
    )
    .unwrap();
    assert!(rel(r.planck_k, 179.769_313_486_231_57) < 1e-12, "{r:?}");
    assert!(
        rel(r.callen_welton_k, -345.201_957_483_859_11) < 1e-12,
        "{r:?}"
    );
}

#[test]
fn fermi_dirac_half_just_below_its_overflow_is_finite() {
    // η·√η overflowed from η ≈ 3.2e205; F_{1/2} itself only from 3.85e205.
    // mpmath: quad(sqrt(t)/(exp(t − η) + 1), [0, ∞))/Γ(3/2) at η = 3.5e205
    let got = fermi_dirac_integral(FdOrder::Half, 3.5e205).unwrap();
    assert!(rel(got, 1.557_635_608_229_060_5e308) < 1e-13, "{got:e}");
}

#[test]
fn carrier_density_with_tiny_n_and_huge_eta_is_finite() {
    // F_{1/2}(1e250) is beyond the f64 range but N·F_{1/2} is not; the Boltzmann error was −1.
    // mpmath: 1e-100·quad(sqrt(t)/(exp(t − η) + 1))/Γ(3/2) at η = 1e250
    let c = band_carrier_density(1e-100, 1e250).unwrap();
    assert!(
        rel(c.density_per_m3, 7.522_527_780_636_749_8e274) < 1e-13,
        "{c:?}"
    );
    assert_eq!(c.boltzmann_relative_error, f64::INFINITY);
}

#[test]
fn fermi_levels_with_density_of_states_beyond_f64_are_finite() {
    // N_c = 2(2π m* m_e k T/h²)^{3/2} overflows for m* = 1e200: ln(n/N_c) was −∞, and the
    // intrinsic level failed to converge.
    let s = Semiconductor::new(1e200, 1.0, 1.8e-19, 0.0, 1.0).unwrap();
    // mpmath: E_g + kT·ln(n/N_c) (non-degenerate) at n = 1e6 m⁻³, T = 1 K
    let ef = s.fermi_level_from_electron_density(1e6, 1.0).unwrap();
    assert!(rel(ef, 1.699_642_140_210_858_4e-19) < 1e-13, "{ef:e}");
    // mpmath: E_g/2 + (kT/2)·ln(N_v/N_c) (both bands non-degenerate)
    let i = s.intrinsic(1.0).unwrap();
    assert!(
        rel(i.fermi_level_j, 8.523_140_729_091_429_8e-20) < 1e-13,
        "{i:?}"
    );
}

// ---------------------------------------------------------------------------------------------
// GUM, Student's t, random deviates

#[test]
fn type_a_of_huge_observations_is_finite() {
    // Σ(q − q̄)² overflowed (and the sum of [M, M] gave a NaN mean). mpmath: 1.896e154/√2
    let a = type_a(&[1.896_150_381_621_835_5e154, 0.0]).unwrap();
    assert!(
        rel(a.standard_deviation, 1.340_780_792_994_259_8e154) < 1e-15,
        "{a:?}"
    );
    let b = type_a(&[M, M]).unwrap();
    assert_eq!((b.mean, b.standard_deviation), (M, 0.0));
    // mpmath: Pearson r of (M, −M, M/2) and (1, 2, 3)
    let r = type_a_correlation(&[M, -M, M / 2.0], &[1.0, 2.0, 3.0]).unwrap();
    assert!(rel(r, -0.240_192_230_707_630_7) < 1e-14, "{r}");
}

#[test]
fn propagated_uncertainty_of_f64_max_is_f64_max() {
    // (c·u)² overflowed: u_c = ∞ for u = M. mpmath: z_0.75 = 0.674 489 750 196 081 74
    let u = [InputUncertainty::type_b(M).unwrap()];
    let g = propagate(&[1.0], &u, None, Coverage::Probability(0.5), None).unwrap();
    assert_eq!(g.combined_standard_uncertainty, M);
    assert!(rel(g.expanded_uncertainty, 0.674_489_750_196_081_74 * M) < 1e-15);
    // and u = 1e-200 squared to 0: u_c must be 1e-200 (exact: one input, c = 1)
    let u = [InputUncertainty::type_b(1e-200).unwrap()];
    let g = propagate(&[1.0], &u, None, Coverage::Factor(2.0), None).unwrap();
    assert_eq!(g.combined_standard_uncertainty, 1e-200);
    // a component beyond the f64 range is an error, not ∞·0 = NaN shares
    let u = [InputUncertainty::type_b(1e200).unwrap()];
    let e = propagate(&[1e200], &u, None, Coverage::Factor(2.0), None).unwrap_err();
    assert_eq!(e.code(), "OUT_OF_RANGE");
}

#[test]
fn welch_satterthwaite_keeps_a_subnormal_degrees_of_freedom() {
    // q⁴/ν overflowed for ν = 5e-324: ν_eff = 1/∞ = 0 and the coverage probability NaN.
    // With ν → 0, P(|T| ≤ 1) → 0 (the t distribution's mass leaves every finite interval).
    let u = [InputUncertainty::type_a(0.525_260_563_217_658_7, 5e-324).unwrap()];
    let g = propagate(&[1.0], &u, None, Coverage::Factor(1.0), None).unwrap();
    assert_eq!(g.effective_degrees_of_freedom, Some(5e-324));
    assert_eq!(g.coverage_probability, Some(0.0));
}

#[test]
fn student_t_cdf_with_vanishing_degrees_of_freedom_is_one_half() {
    // ν/2 rounded to 0 (NaN) or lost its bits (1.0 for ν = 1e-323). Q = ½ − O(ν·ln t).
    for nu in [5e-324, 1e-323, 1e-310] {
        for t in [1e-10, 1.0, 1e300, -1.0] {
            assert_eq!(student_t_cdf(t, nu).unwrap(), 0.5, "t = {t}, ν = {nu}");
        }
    }
}

#[test]
fn student_t_quantiles_far_in_heavy_tails_are_finite() {
    // lo·hi overflowed in the bisection step: −∞ was returned.
    // mpmath: −cot(π·1e-200) (ν = 1, Cauchy)
    let got = student_t_quantile(1e-200, 1.0).unwrap();
    assert!(rel(got, -3.183_098_861_837_906_8e199) < 1e-13, "{got:e}");
    // mpmath: findroot of betainc(ν/2, 1/2, 0, ν/(ν + t²))/2 = 1e-300, ν = 1.5
    let got = student_t_quantile(1e-300, 1.5).unwrap();
    assert!(rel(got, -5.219_469_427_344_636_3e199) < 1e-12, "{got:e}");
}

#[test]
fn student_t_deviates_for_infinite_and_huge_degrees_of_freedom_are_normal() {
    // ν = ∞ gave NaN (∞·0); ν > 1e16 gave exactly 0 every time (w^(−2/ν) rounded to 1). Both
    // tend to the standard normal (common practice, no source): sample variance ≈ 1.
    for nu in [f64::INFINITY, 1e17] {
        let mut s = Sampler::new(7);
        let n = 20_000;
        let xs: Vec<f64> = (0..n).map(|_| s.student_t(nu)).collect();
        assert!(xs.iter().all(|x| x.is_finite()), "ν = {nu}");
        let var = xs.iter().map(|x| x * x).sum::<f64>() / n as f64;
        assert!((var - 1.0).abs() < 0.05, "ν = {nu}: variance {var}");
    }
}

// ---------------------------------------------------------------------------------------------
// thermometry

#[test]
fn spectral_value_constant_nan_is_an_error() {
    // Constant(NaN).value_at returned Ok(NaN).
    let e = SpectralValue::Constant(f64::NAN)
        .value_at(1e-6)
        .unwrap_err();
    assert_eq!(e.code(), "NON_FINITE");
    assert!(SpectralValue::Constant(f64::INFINITY)
        .value_at(1e-6)
        .is_err());
}

#[test]
fn raman_at_extreme_inputs_is_finite() {
    // 1/λ_L = ∞ for λ_L = 5e-324: (∞ + ν̃)/(∞ − ν̃) = NaN. mpmath: ((1+p)/(1−p))^4, p = ν̃·λ_L
    let f = raman_frequency_factor(1000.0, 5e-324, RamanDetection::Energy).unwrap();
    assert_eq!(f, 1.0);
    // n = ∞ (θ/T below 1/f64::MAX): n/(n + 1) = ∞/∞. mpmath: F·exp(−θ/T) = 1 to the last bit
    let r = anti_stokes_stokes_ratio(
        2.225_073_858_507_201_4e-308,
        2e-7,
        1.0,
        RamanDetection::Energy,
    )
    .unwrap();
    assert_eq!(r, 1.0);
    // T and θ subnormal: T²/(θ·R) was 0/0. Checked against the formula at the returned T
    // (the subnormal T carries only a few bits): dT/dR = T²/(θ·R), θ = c₂·ν̃.
    let shift = 1.186_45e-319;
    let ratio = 2.220_446_049_250_313e-16;
    let rd = raman_temperature(shift, 2e-7, ratio, RamanDetection::Energy).unwrap();
    let theta = rd.mode_temperature_k;
    let t = rd.temperature_k;
    assert!(rd.d_t_d_ratio.is_finite() && rd.d_t_d_ratio > 0.0, "{rd:?}");
    assert!(
        rel(rd.d_t_d_ratio, (t / theta) * (t / ratio)) < 1e-15,
        "{rd:?}"
    );
}

#[test]
fn two_colour_with_a_subnormal_ratio_finds_the_right_temperature() {
    // ρ·S1/S2 compared with r = 5e-324 lost the ratio's bits: T came out 414.8 K, and
    // ∂T/∂ρ was −∞. mpmath: findroot of ρ·(λ2/λ1)^5·expm1(c2/(λ2 T))/expm1(c2/(λ1 T)) = r, and
    // ∂T/∂ρ = −(g/g′)/ρ there.
    let rd = two_colour_temperature(
        4e-7,
        5.166_630_291_178_4e-7,
        5e-324,
        9.655_481_441_952_772e-303,
        C2Convention::Codata2018,
    )
    .unwrap();
    assert!(
        rel(rd.temperature_k, 161.457_143_846_687_55) < 1e-12,
        "{rd:?}"
    );
    assert!(
        rel(rd.d_t_d_emissivity_ratio, -3.324_155_081_398_716e302) < 1e-9,
        "{rd:?}"
    );
}

#[test]
fn ratio_temperature_sensitivities_at_extreme_temperature_are_finite() {
    // λT²/c2 overflowed: ∂T/∂r was ∞. mpmath: d/dr of c2/(λ·ln(1 + expm1(c2/(λT_X))/r))
    let s = ratio_temperature_sensitivities(
        1.582_362_905_843_795_7e188,
        4e-7,
        429.7485,
        C2Convention::Codata2018,
    )
    .unwrap();
    assert!(
        rel(s.temperature_k, 2.542_872_055_023_358_4e156) < 1e-12,
        "{s:?}"
    );
    assert!(
        rel(s.d_t_d_ratio, 1.607_009_394_388_811_7e-32) < 1e-12,
        "{s:?}"
    );
    // r = 1 at λ = f64::MIN_POSITIVE: T = T_X, (T/λ)·0 was ∞·0 = NaN; the true value is 0.
    let s =
        ratio_temperature_sensitivities(1.0, f64::MIN_POSITIVE, 200.0, C2Convention::Codata2018)
            .unwrap();
    assert_eq!((s.temperature_k, s.d_t_d_wavelength), (200.0, 0.0));
}

// ---------------------------------------------------------------------------------------------
// design

#[test]
fn cavity_far_wider_than_deep_has_finite_ratios() {
    // a/R and L/R both underflowed: q = 0/0. mpmath: Gouffé's ε0 with f = (a/R)²/(2L/R + 2),
    // f0 = (a/L)², ε = 0.5
    let cav = Cavity::Cylinder {
        radius_m: 1e300,
        depth_m: 1e-30,
        aperture_radius_m: 1e-31,
    };
    let (f, f0) = cav.area_ratios().unwrap();
    assert!(f.is_finite() && rel(f0, 0.01) < 1e-15, "{f} {f0}");
    let e = cavity_emissivity_gouffe(0.5, &cav).unwrap();
    assert!(rel(e, 0.995) < 1e-15, "{e}");
}

#[test]
fn noise_budget_total_without_spurious_overflow() {
    // σ_r² or the sum overflowed although the root does not.
    let n = noise_budget(0.0, 0.0, 0.0, 1e200).unwrap();
    assert_eq!(n.total_electrons, 1e200);
    // mpmath: sqrt(2·M)
    let n = noise_budget(M, M, 0.0, 0.0).unwrap();
    assert!(
        rel(n.total_electrons, 1.896_150_381_621_835_2e154) < 1e-15,
        "{n:?}"
    );
}

#[test]
fn electron_rate_with_huge_responsivity_and_zero_derivative_is_not_nan() {
    // R/e overflowed and 0·∞ gave NaN. mpmath: 1e-3·1.701955221933048e291/e
    let flux = PixelFlux {
        kind: RadianceKind::Energy,
        flux: 1e-3,
        d_flux_dt: 0.0,
    };
    let conv = Conversion::Responsivity {
        amperes_per_watt: 1.701_955_221_933_048e291,
    };
    let r = electron_rate(&flux, conv).unwrap();
    assert_eq!(r.d_flux_dt, 0.0);
    assert!(rel(r.flux, 1.062_276_896_202_1e307) < 1e-15, "{r:?}");
}

#[test]
fn background_flux_through_an_overflowing_solid_angle_is_finite() {
    // Ω = π/(4F²) = ∞ for F = 1e-160 (small angle) times a band below the f64 range was NaN.
    // mpmath: π/(4F²)·2c(T/c2)³·quad(x²/expm1(x), [c2/(λc T), ∞)) at λc = 1 µm, T = 14.388 K
    // (the integrand normalised by e^{x0}, see the generator)
    let view = BackgroundView::ColdStop {
        f_number: 1e-160,
        cone: ConeForm::SmallAngle,
    };
    let got = background_photon_flux(1e-6, 14.388, &view).unwrap();
    assert!(rel(got, 2.433_961_288_809_931_5e-91) < 1e-11, "{got:e}");
}

#[test]
fn small_angle_etendue_of_discs_600_orders_apart_is_finite() {
    // After scaling by the largest length, a and h underflowed: 0/0. mpmath: π²(r1 r2/d)²
    let got = etendue_between_discs(
        1e-300,
        2.114_468_239_128_189_3e63,
        5e-324,
        ConeForm::SmallAngle,
    )
    .unwrap();
    assert!(rel(got, 1.129_829_164_781_595_1e173) < 1e-12, "{got:e}");
}

#[test]
fn zero_radiance_through_an_overflowing_optics_factor_is_zero() {
    // 0 × π/(4F²) with F = 5e-324 (∞) was NaN.
    let optics = Optics::new(5e-324, 0.05).with_cone(ConeForm::SmallAngle);
    assert_eq!(focal_plane_irradiance(0.0, &optics).unwrap(), 0.0);
    let scene = InBandRadiance::new(RadianceKind::Energy, 0.0, 0.0).unwrap();
    let p = pixel_flux(&scene, &optics, 1e-10).unwrap();
    assert_eq!((p.flux, p.d_flux_dt), (0.0, 0.0));
}

#[test]
fn blip_d_star_with_huge_wavelength_and_subnormal_efficiency_is_finite() {
    // λ/hc = ∞ times √(η/2) = 0 (η/2 rounded to 0) was NaN.
    // mpmath: M/(h c)·sqrt(5e-324/2)/sqrt(1e10)
    let got = blip_d_star_from_flux(M, 5e-324, 1e10, Mechanism::Photovoltaic).unwrap();
    assert!(rel(got, 1.422_381_706_636_385_8e166) < 1e-14, "{got:e}");
}
