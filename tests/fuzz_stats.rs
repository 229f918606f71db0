//! Property-based fuzz of the quantum-statistics functions (`quantaband::stats`): occupancies,
//! Fermi–Dirac and Bose–Einstein integrals, the photon gas, noise sources and semiconductor
//! carrier statistics. See `tests/common/mod.rs` for the properties and the generators.

mod common;

use common::{arg, args, check, fuzz, ok, Arg, Inf};
use proptest::prelude::*;
use proptest::test_runner::TestCaseError;
use quantaband::stats::{
    available_noise_power_density, available_noise_power_density_with_zero_point,
    band_carrier_density, bose_critical_temperature, bose_einstein, bose_einstein_energy,
    bose_einstein_integral, effective_density_of_states, fermi_dirac, fermi_dirac_energy,
    fermi_dirac_integral, inverse_fermi_dirac_half, load_noise_temperature, maxwell_boltzmann,
    maxwell_boltzmann_energy, mean_photon_energy, photon_density_of_states, photon_energy_density,
    photon_entropy_density, photon_number_density, photon_pressure,
    physical_temperature_from_rayleigh_jeans, quantum_noise_temperature,
    rayleigh_jeans_brightness_temperature, spectral_energy_density_energy,
    spectral_energy_density_frequency, thermal_photon_number, varshni_band_gap, y_factor,
    y_factor_noise_temperature, BoseOrder, CarrierDensity, FdOrder, LoadNoiseModel, Semiconductor,
};
use quantaband::Error;

const EV: f64 = 1.602_176_634e-19;

/// A carrier density of a band with effective density of states `nc`: no NaN anywhere; ±∞ only
/// in the fields whose docs say "+∞ only where the true value is above `f64::MAX`", and for the
/// density itself only where a rough logarithmic estimate of N·F_{1/2}(η) (leading Sommerfeld
/// term η^{3/2}/Γ(5/2) for η > 1e3, where F_{1/2} ≤ 2.4e4 below) is within 1e-9 of ln f64::MAX.
fn carrier(what: &str, nc: f64, r: &Result<CarrierDensity, Error>) -> Result<(), TestCaseError> {
    check(what, r, Inf::Documented)?;
    if let Ok(c) = r {
        ok(what, &Ok::<_, Error>(c.reduced_fermi_level))?;
        if c.density_per_m3.is_infinite() {
            let eta = c.reduced_fermi_level;
            let ln_f = if eta > 1e3 {
                1.5 * eta.ln() - 0.2847
            } else {
                2.4e4f64.ln()
            };
            prop_assert!(
                nc.ln() + ln_f > f64::MAX.ln() - 1e-9,
                "{what}: density +∞ where N·F ≈ e^{} (N = {nc:e}, η = {eta:e})",
                nc.ln() + ln_f
            );
        }
    }
    Ok(())
}

fn temperature() -> Arg {
    arg(1e-3, 1e5).edges(&[0.0])
}

fn frequency() -> Arg {
    arg(1e6, 1e15).edges(&[0.0])
}

fn energy() -> Arg {
    arg(1e-25, 1e-17).edges(&[0.0])
}

fn models() -> impl Strategy<Value = LoadNoiseModel> {
    prop::sample::select(vec![
        LoadNoiseModel::RayleighJeans,
        LoadNoiseModel::Planck,
        LoadNoiseModel::CallenWelton,
    ])
}

// ---------------------------------------------------------------------------------------------
// occupancy

#[test]
fn fuzz_occupancies() {
    // x = (E − μ)/kT with the cut-offs of the methods (1, ±709.78, 745.13).
    let x = arg(-50.0, 50.0).edges(&[0.0, 1.0, 1e-300, 709.78, -709.78, 745.13, 746.0]);
    let mu = arg(-1e-19, 1e-19).edges(&[0.0]);
    fuzz(
        "occupancies",
        5000,
        args(&[x, energy(), mu, temperature(), frequency()]),
        |v| {
            let (x, e, mu, t, f) = (v[0], v[1], v[2], v[3], v[4]);
            // bose_einstein: "Returns `+∞` for `0 < x < 1/f64::MAX`".
            check("bose_einstein", &bose_einstein(x), Inf::Documented)?;
            // bose_einstein_energy: "Returns `+∞` when `E > μ` but `(E − μ)/kT` is below the
            // smallest subnormal".
            check(
                "bose_einstein_energy",
                &bose_einstein_energy(e, mu, t),
                Inf::Documented,
            )?;
            check(
                "bose_einstein_energy",
                &bose_einstein_energy(e, e * (1.0 - 1e-12), t),
                Inf::Documented,
            )?;
            // thermal_photon_number: "Returns `+∞` when `hf/kT` is below the smallest subnormal".
            check(
                "thermal_photon_number",
                &thermal_photon_number(f, t),
                Inf::Documented,
            )?;
            ok("fermi_dirac", &fermi_dirac(x))?;
            ok("fermi_dirac_energy", &fermi_dirac_energy(e, mu, t))?;
            // maxwell_boltzmann: "Returns `+∞` for `x < −709.78` (true value above f64 range)";
            // the module docs say the same of the energy form.
            check("maxwell_boltzmann", &maxwell_boltzmann(x), Inf::Documented)?;
            check(
                "maxwell_boltzmann_energy",
                &maxwell_boltzmann_energy(e, mu, t),
                Inf::Documented,
            )?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// Fermi–Dirac and Bose–Einstein integrals

#[test]
fn fuzz_quantum_integrals() {
    let eta = arg(-60.0, 100.0).edges(&[-3.0, 37.0, -745.13, 1.5e123]);
    let y = arg(1e-12, 1e6).edges(&[0.0, 1e-8, 8.0]);
    let z = arg(0.0, 1.0).edges(&[0.0, 0.5, 1.0]);
    let order_num = arg(-2.0, 30.0).edges(&[-0.5, 0.5, 1.5, 2.5, 2.0, 22.0, 1.0, 0.0]);
    let n = arg(1e10, 1e30).edges(&[0.0]);
    let mass = arg(1e-30, 1e-24).edges(&[0.0]);
    fuzz(
        "quantum integrals",
        4000,
        (
            prop::sample::select(vec![
                FdOrder::MinusHalf,
                FdOrder::Half,
                FdOrder::ThreeHalves,
            ]),
            prop_oneof![
                Just(BoseOrder::ThreeHalves),
                Just(BoseOrder::FiveHalves),
                (0u32..40).prop_map(BoseOrder::Integer),
                any::<u32>().prop_map(BoseOrder::Integer),
            ],
            args(&[eta, y, z, order_num.clone(), order_num, n, mass]),
        ),
        |(fd, be, v)| {
            let (eta, y, z, j, s, n, m) = (v[0], v[1], v[2], v[3], v[4], v[5], v[6]);
            let jj = FdOrder::j(fd);
            prop_assert!(jj.is_finite());
            ok("FdOrder::from_j", &FdOrder::from_j(j))?;
            ok("FdOrder::from_j (own order)", &FdOrder::from_j(jj))?;
            // fermi_dirac_integral: "for j = 3/2 overflows to `+∞` only for η > 1.5e123".
            check(
                "fermi_dirac_integral",
                &fermi_dirac_integral(fd, eta),
                Inf::Documented,
            )?;
            ok("inverse_fermi_dirac_half", &inverse_fermi_dirac_half(y))?;
            let ss = BoseOrder::s(be);
            prop_assert!(!ss.is_nan());
            ok("BoseOrder::from_s", &BoseOrder::from_s(s))?;
            ok("bose_einstein_integral", &bose_einstein_integral(be, z))?;
            // bose_critical_temperature: "A true T_c above `f64::MAX` ... returns `+∞`".
            check(
                "bose_critical_temperature",
                &bose_critical_temperature(n, m),
                Inf::Documented,
            )?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// photon gas

// photon_gas.rs module docs: "Powers of T are formed as `((c·T)·T)·T…`, whose partial products
// move monotonically towards the result, so nothing overflows or underflows unless the result
// itself does."
const GAS_INF: Inf = Inf::Documented;

#[test]
fn fuzz_photon_gas() {
    fuzz(
        "photon gas",
        4000,
        args(&[frequency(), temperature(), energy(), temperature()]),
        |v| {
            let (f, t, e, tb) = (v[0], v[1], v[2], v[3]);
            ok(
                "quantum_noise_temperature",
                &quantum_noise_temperature(f, t),
            )?;
            ok(
                "rayleigh_jeans_brightness_temperature",
                &rayleigh_jeans_brightness_temperature(f, t),
            )?;
            ok(
                "physical_temperature_from_rayleigh_jeans",
                &physical_temperature_from_rayleigh_jeans(f, tb),
            )?;
            if let Ok(b) = rayleigh_jeans_brightness_temperature(f, t) {
                ok(
                    "physical_temperature_from_rayleigh_jeans (forward)",
                    &physical_temperature_from_rayleigh_jeans(f, b),
                )?;
            }
            ok(
                "available_noise_power_density",
                &available_noise_power_density(f, t),
            )?;
            ok(
                "available_noise_power_density_with_zero_point",
                &available_noise_power_density_with_zero_point(f, t),
            )?;
            check("photon_number_density", &photon_number_density(t), GAS_INF)?;
            check("photon_energy_density", &photon_energy_density(t), GAS_INF)?;
            check(
                "photon_entropy_density",
                &photon_entropy_density(t),
                GAS_INF,
            )?;
            check("photon_pressure", &photon_pressure(t), GAS_INF)?;
            check("mean_photon_energy", &mean_photon_energy(t), GAS_INF)?;
            check(
                "photon_density_of_states",
                &photon_density_of_states(e),
                GAS_INF,
            )?;
            check(
                "spectral_energy_density_energy",
                &spectral_energy_density_energy(e, t),
                GAS_INF,
            )?;
            check(
                "spectral_energy_density_frequency",
                &spectral_energy_density_frequency(f, t),
                GAS_INF,
            )?;
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// noise sources

#[test]
fn fuzz_noise_sources() {
    let receiver = arg(0.0, 2000.0).edges(&[0.0]);
    let y = arg(1.0, 20.0).edges(&[1.0]);
    fuzz(
        "noise sources",
        4000,
        (
            models(),
            args(&[
                frequency(),
                temperature(),
                receiver,
                temperature(),
                temperature(),
                y,
            ]),
        ),
        |(model, v)| {
            let (f, t, tr, a, b, y) = (v[0], v[1], v[2], v[3], v[4], v[5]);
            let (hot, cold) = (a.max(b), a.min(b));
            ok(
                "load_noise_temperature",
                &load_noise_temperature(f, t, model),
            )?;
            // y_factor: "A true Y above `f64::MAX` ... returns +∞."
            check(
                "y_factor",
                &y_factor(tr, hot, cold, f, model),
                Inf::Documented,
            )?;
            check(
                "y_factor (swapped)",
                &y_factor(tr, cold, hot, f, model),
                Inf::Documented,
            )?;
            // y_factor_noise_temperature: "A field whose true value is beyond the f64 range (`y`
            // within a few ulp of 1 with a hot load near `f64::MAX`) is ±∞."
            let d = Inf::Documented;
            check(
                "y_factor_noise_temperature",
                &y_factor_noise_temperature(y, hot, cold, f, model),
                d,
            )?;
            if let Ok(yy) = y_factor(tr, hot, cold, f, model) {
                check(
                    "y_factor_noise_temperature (forward)",
                    &y_factor_noise_temperature(yy, hot, cold, f, model),
                    d,
                )?;
            }
            Ok(())
        },
    );
}

// ---------------------------------------------------------------------------------------------
// semiconductor

#[test]
fn fuzz_semiconductor() {
    let mass = arg(0.01, 3.0).edges(&[0.0]);
    let gap = arg(0.05 * EV, 6.0 * EV).edges(&[0.0]);
    let alpha = arg(0.0, 1e-3 * EV).edges(&[0.0]);
    let beta = arg(1.0, 2000.0).edges(&[0.0]);
    let t = arg(1.0, 3000.0).edges(&[0.0]);
    let fermi = arg(-EV, 7.0 * EV);
    let density = arg(1e6, 1e30).edges(&[0.0]);
    let eta = arg(-100.0, 100.0).edges(&[-3.0, 0.0]);
    fuzz(
        "semiconductor",
        1500,
        args(&[
            mass.clone(),
            mass,
            gap,
            alpha,
            beta,
            t,
            fermi,
            density.clone(),
            density,
            eta,
        ]),
        |v| {
            let (me, mh, eg, a, b, t, ef, n, nc, eta) =
                (v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9]);
            // effective_density_of_states: "A true value above `f64::MAX` ... returns +∞."
            check(
                "effective_density_of_states",
                &effective_density_of_states(me, t),
                Inf::Documented,
            )?;
            ok("varshni_band_gap", &varshni_band_gap(eg, a, b, t))?;
            carrier("band_carrier_density", nc, &band_carrier_density(nc, eta))?;
            let sc = Semiconductor::new(me, mh, eg, a, b);
            ok("Semiconductor::new", &sc)?;
            // The methods check the fields again: call them also on a struct built directly.
            let raw = Semiconductor {
                electron_mass_ratio: me,
                hole_mass_ratio: mh,
                band_gap_0k_j: eg,
                varshni_alpha_j_per_k: a,
                varshni_beta_k: b,
            };
            for s in [sc.ok(), Some(raw)].into_iter().flatten() {
                ok(
                    "Semiconductor::band_gap_j",
                    &Semiconductor::band_gap_j(&s, t),
                )?;
                // "+∞ where the true value is above `f64::MAX`, as for
                // [`effective_density_of_states`]".
                check(
                    "Semiconductor::conduction_band_density_of_states",
                    &Semiconductor::conduction_band_density_of_states(&s, t),
                    Inf::Documented,
                )?;
                check(
                    "Semiconductor::valence_band_density_of_states",
                    &Semiconductor::valence_band_density_of_states(&s, t),
                    Inf::Documented,
                )?;
                let ncv = |m: f64| effective_density_of_states(m, t).unwrap_or(f64::NAN);
                carrier(
                    "Semiconductor::electron_density",
                    ncv(s.electron_mass_ratio),
                    &Semiconductor::electron_density(&s, ef, t),
                )?;
                carrier(
                    "Semiconductor::hole_density",
                    ncv(s.hole_mass_ratio),
                    &Semiconductor::hole_density(&s, ef, t),
                )?;
                ok(
                    "Semiconductor::fermi_level_from_electron_density",
                    &Semiconductor::fermi_level_from_electron_density(&s, n, t),
                )?;
                ok(
                    "Semiconductor::fermi_level_from_hole_density",
                    &Semiconductor::fermi_level_from_hole_density(&s, n, t),
                )?;
                // IntrinsicCarriers: the two densities are "+∞ only where the true value is above
                // `f64::MAX`"; the levels and the gap must be finite.
                let r = Semiconductor::intrinsic(&s, t);
                check("Semiconductor::intrinsic", &r, Inf::Documented)?;
                if let Ok(i) = r {
                    let levels = (i.fermi_level_j, i.boltzmann_fermi_level_j, i.band_gap_j);
                    ok("Semiconductor::intrinsic levels", &Ok::<_, Error>(levels))?;
                }
            }
            Ok(())
        },
    );
}
