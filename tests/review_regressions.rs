//! Regression tests for defects found in the independent review of the physics modules.
//!
//! Each test pins an extreme but valid input that used to give a spurious NaN or ∞. Expected
//! values come from mpmath 1.3.0 at mp.dps = 50, evaluating the defining formula directly (no
//! code of this crate); the one-line mpmath expression is given beside each value. Constants:
//! SI 2019 exact h, c, k (CODATA 2018) and the ITS-90 c2 = 0.014388 m·K (Preston-Thomas,
//! Metrologia 27, 3, 1990). `f64::MAX` is written M = 2^1024·(1 − 2^-53) in the mpmath
//! expressions.

use quantaband::constants::C2Convention;
use quantaband::stats::{spectral_energy_density_energy, spectral_energy_density_frequency};
use quantaband::thermometry::its90::radiance_ratio;

fn rel(a: f64, b: f64) -> f64 {
    (a / b - 1.0).abs()
}

/// The logarithmic route sums terms of magnitude up to ~750, so its relative error is about
/// 750·2.2e-16 ≈ 2e-13 (common practice, no source: error of exp of a rounded sum).
const LOG_ROUTE_TOL: f64 = 1e-12;

// ---------------------------------------------------------------------------------------------
// spectral_energy_density_*: the Rayleigh–Jeans branch multiplied q² (underflowed to 0) by
// kT/(hc) (overflowed to ∞) for a tiny photon energy/frequency at a temperature near f64::MAX:
// 0·∞ = NaN, or a finite q² times ∞ = ∞, where the true value is an ordinary number.

#[test]
fn energy_density_per_energy_tiny_energy_huge_temperature_is_finite() {
    // mpmath: 8*pi*E**3/((h*c)**3*expm1(E/(k*M)))
    let cases = [
        (1e-300, f64::MAX, 7.958_083_748_126_432e-240),
        (1e-310, f64::MAX, 7.958_083_748_126_432e-260),
        (1e-300, 1e300, 4.426_831_027_941_783e-248),
    ];
    for (e, t, want) in cases {
        let got = spectral_energy_density_energy(e, t).unwrap();
        assert!(
            rel(got, want) < LOG_ROUTE_TOL,
            "u_E({e:e} J, {t:e} K) = {got:e}, mpmath {want:e}"
        );
    }
}

#[test]
fn energy_density_per_frequency_tiny_frequency_huge_temperature_is_finite() {
    // mpmath: 8*pi*h*f**3/(c**3*expm1(h*f/(k*M)))
    let cases = [
        (1e-100, 2.315_136_454_527_247e61),
        (1e-150, 2.315_136_454_527_247e-39),
    ];
    for (f, want) in cases {
        let got = spectral_energy_density_frequency(f, f64::MAX).unwrap();
        assert!(
            rel(got, want) < LOG_ROUTE_TOL,
            "u_nu({f:e} Hz, f64::MAX) = {got:e}, mpmath {want:e}"
        );
    }
    // mpmath gives 2.315e-339 at f = 1e-300 Hz: below the smallest subnormal, so exactly 0.
    assert_eq!(
        spectral_energy_density_frequency(1e-300, f64::MAX).unwrap(),
        0.0
    );
}

// ---------------------------------------------------------------------------------------------
// its90::radiance_ratio: expm1(x_ref)/expm1(x) with x = x_ref = 0 (λ·T beyond f64::MAX) gave
// 0/0 = NaN; ln_expm1(∞) − ln_expm1(∞) (λ near the smallest subnormal) gave ∞ − ∞ = NaN.

#[test]
fn radiance_ratio_at_huge_wavelength_is_the_rayleigh_jeans_ratio() {
    // ITS-90 gold point (Preston-Thomas 1990, Table 1).
    let tref = 1337.33;
    // mpmath: expm1(c2/(M*Tref))/expm1(c2/(M*T)), c2 = 0.014388 (1.1216378904234556916e-3 and
    // 7.4775859361563712771e5, written here to f64 precision).
    let cases = [(1.5, 1.121_637_890_423_456e-3), (1e9, 747_758.593_615_637)];
    for (t, want) in cases {
        let got = radiance_ratio(t, f64::MAX, tref, C2Convention::Its90).unwrap();
        assert!(
            rel(got, want) < 1e-15,
            "r({t} K, λ = f64::MAX) = {got:e}, mpmath {want:e}"
        );
    }
}

#[test]
fn radiance_ratio_at_smallest_wavelength_is_zero_one_or_infinity() {
    let tref = 1337.33;
    let lam = f64::from_bits(1); // 4.9e-324 m, the smallest positive f64
                                 // mpmath: log10(expm1(c2/(lam*Tref))/expm1(c2/(lam*1000))) = -3.19e317 → below the f64
                                 // range, so exactly 0.
    assert_eq!(
        radiance_ratio(1000.0, lam, tref, C2Convention::Its90).unwrap(),
        0.0
    );
    // The reciprocal situation (T above T_ref): 10^(+…e317), above f64::MAX, so +∞.
    assert_eq!(
        radiance_ratio(2000.0, lam, tref, C2Convention::Its90).unwrap(),
        f64::INFINITY
    );
    // Identity: the ratio of a radiance to itself is 1 at any wavelength.
    assert_eq!(
        radiance_ratio(tref, lam, tref, C2Convention::Codata2018).unwrap(),
        1.0
    );
}

// ---------------------------------------------------------------------------------------------
// ResponseSignal at very low temperature: the sub-interval march advanced λ by a factor e^h with
// h below one ulp once x = c2/(λT) > 5e16, so it spun through its 100 000-step guard on empty
// pieces (about 1 s per call in a release build, measured once by hand, not here). It now stops
// when no progress is possible. The values must stay what Planck's law gives: L_λ ∝ e^{−x} with
// x ≥ c2/(1.5e-6 m · 1e-20 K) ≈ 1e24, far below the smallest subnormal, so exactly 0 (Planck
// 1901 / Howell et al. 2020 ch. 1 for the form; the underflow is plain arithmetic).

#[test]
fn response_signal_at_tiny_temperature_is_exactly_zero() {
    use quantaband::thermometry::model::SignalModel;
    use quantaband::thermometry::response::{Response, ResponseSignal};
    let wl = [1e-6, 1.2e-6, 1.5e-6];
    let r = [0.0, 1.0, 0.5];
    let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Its90);
    for t in [1e-20, 1e-300, f64::from_bits(1)] {
        assert_eq!(s.signal(t).unwrap(), 0.0, "S({t:e} K)");
        assert_eq!(s.d_signal_dt(t).unwrap(), 0.0, "dS/dT({t:e} K)");
    }
    // Just above the underflow the early stop must not drop signal: at 30 K the response-
    // weighted integral is tiny but representable and positive.
    assert!(s.signal(30.0).unwrap() > 0.0);
}

// ---------------------------------------------------------------------------------------------
// band(): the prefactor's logarithmic fallback used ln(T/c2), and T/c2 overflows to ∞ for
// T > c2·f64::MAX ≈ 2.6e306 K, so band values that are ordinary numbers came out as +∞ (and
// values below the f64 range as +∞ instead of 0).

#[test]
fn band_at_temperature_near_f64_max_is_finite() {
    use quantaband::band::band;
    use quantaband::planck::{SpectralVariable, Spectrum};
    // mpmath: quad(lambda nu: 2*h*nu**3/c**2/expm1(h*nu/(k*M)), [1e6, 2e6])
    let s = Spectrum::BLACKBODY.with_variable(SpectralVariable::Frequency);
    let got = band(&s, 1e6, 2e6, f64::MAX).unwrap();
    let want = 1.288_736_763_449_515e287;
    assert!(rel(got, want) < LOG_ROUTE_TOL, "{got:e} vs mpmath {want:e}");
    // mpmath: quad(lambda lam: 2*h*c**2/lam**5/expm1(c2/(lam*M)), [1e-6, 2e-6]) = 4.3404658e311,
    // times ε = 1e-30.
    let s = Spectrum::BLACKBODY.with_emissivity(1e-30);
    let got = band(&s, 1e-6, 2e-6, f64::MAX).unwrap();
    let want = 4.340_465_808_717_808e281;
    assert!(rel(got, want) < LOG_ROUTE_TOL, "{got:e} vs mpmath {want:e}");
    // A band whose true value (≈5.0e-607, the Rayleigh–Jeans integral 2ckT∫λ⁻⁴dλ over
    // [1e300 m, f64::MAX]) is below the f64 range: exactly 0, not ∞.
    let got = band(&Spectrum::BLACKBODY, 1e300, f64::MAX, f64::MAX).unwrap();
    assert_eq!(got, 0.0);
}

// ---------------------------------------------------------------------------------------------
// ResponseSignal at T ≳ 1e295 K: L_λ at the quadrature nodes overflowed although the integral
// is an ordinary number, so S came out +∞ and the signal-weighted moments ∞/∞ = NaN. The
// integrand is now scaled by an exact power of two when the Rayleigh–Jeans bound requires it.

#[test]
fn response_signal_at_huge_temperature_is_finite() {
    use quantaband::thermometry::model::SignalModel;
    use quantaband::thermometry::response::{Response, ResponseSignal};
    let wl = [1e-6, 1.2e-6, 1.5e-6];
    let r = [0.0, 1.0, 0.5];
    let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Its90);
    let t = 1e300;
    // mpmath: quad(lambda l: R(l)*c1/l**5/expm1(c2/(l*T)), [1e-6, 1.2e-6, 1.5e-6]),
    // c1 = 2hc², c2 = 0.014388, R the table above (linear between points).
    let want = 1.124_176_928_679_341e303;
    let got = s.signal(t).unwrap();
    assert!(rel(got, want) < 1e-12, "S = {got:e}, mpmath {want:e}");
    // mpmath: the same quadrature with an extra factor l in the numerator, divided by S.
    let want = 1.227_272_727_272_727e-6;
    let got = s.mean_wavelength_m(t).unwrap();
    assert!(rel(got, want) < 1e-12, "mean λ = {got:e}, mpmath {want:e}");
    // mpmath: c2*(1/T1 - 1/T2)/log(S(T2)/S(T1)) with T1 = 1e300, T2 = 2e300.
    let want = 1.037_874_812_415_52e-302;
    let got = s.effective_wavelength_m(t, 2.0 * t).unwrap();
    assert!(rel(got, want) < 1e-10, "λ_e = {got:e}, mpmath {want:e}");
    // Rayleigh–Jeans regime: S ∝ T, so λ_T = c2·S/(T²·S′) = c2/T (Planck's law, x ≈ 1e-296).
    let got = s.limiting_effective_wavelength_m(t).unwrap();
    assert!(rel(got, 0.014388 / t) < 1e-10, "λ_T = {got:e}");
}

// ---------------------------------------------------------------------------------------------
// ResponseSignal::mean_and_spread_m: the merge of per-piece moments formed weight·p0 (and
// pm1²), which overflows once the piece weights pass ~1e154 (T ≳ 1e150 K for a micrometre
// table), so σ came out +∞ although the mean was right.

#[test]
fn response_spread_at_very_high_temperature_is_finite() {
    use quantaband::thermometry::response::{Response, ResponseSignal};
    let wl = [1e-6, 1.2e-6, 1.5e-6];
    let r = [0.0, 1.0, 0.5];
    let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), C2Convention::Its90);
    // mpmath at T = 1e200 K: mean = quad(l*R*L)/quad(R*L) = 1.2272727272727272727e-6,
    // σ = sqrt(quad((l − mean)²*R*L)/quad(R*L)) = 1.1586404884074987833e-7 (L Planck's L_λ with
    // c2 = 0.014388, same quadrature as above).
    for t in [1e200, 1e250] {
        let (m, sd) = s.mean_and_spread_m(t).unwrap();
        assert!(
            rel(m, 1.227_272_727_272_727e-6) < 1e-12,
            "mean {m:e} at {t:e} K"
        );
        assert!(
            rel(sd, 1.158_640_488_407_498_8e-7) < 1e-10,
            "σ {sd:e} at {t:e} K"
        );
    }
}
