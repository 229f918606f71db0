//! Instrument spectral response tables and the response-weighted blackbody signal.
//!
//! A [`Response`] is a borrowed table of (wavelength, relative response) points: linear between
//! points, zero outside the table. [`ResponseSignal`] weights Planck's law with it:
//! S(T) = ∫ R(λ)·L_λ(λ, T) dλ, with dS/dT, signal-weighted wavelength moments and the effective
//! wavelengths of radiation thermometry.
//!
//! # Method
//! R is linear on each table segment and L_λ is smooth, so each segment is split into
//! geometric sub-intervals — each spans at most a factor e^0.3 in λ and at most 6 in
//! x = c2/(λT) (the exponent of the Planck factor) — and each sub-interval is integrated with
//! the 20-point Gauss–Legendre rule (the private `gauss_legendre` module). On such a piece the
//! integrand is analytic in a Bernstein ellipse wide enough that the rule's error is far below
//! 1e-15 relative; the mpmath comparison measures it. On the short-wavelength side, the part of
//! a segment where L_λ is below e⁻⁵⁰ of its maximum on the segment is skipped, so cold, wide
//! bands need few sub-intervals. Segments where R is zero at both ends are skipped, and so is
//! the rest of a segment once a step can no longer advance λ (x > 5e16 there: L_λ is far below
//! the f64 range).
//!
//! At temperatures so high that L_λ at the nodes would exceed f64::MAX (T ≳ 1e290 K at
//! micrometre wavelengths, judged from the Rayleigh–Jeans bound L_λ ≤ (c1/c2)·T/λ⁴ at the
//! shortest tabulated wavelength) the integrand is scaled by an exact power of two and the
//! scale restored at the end, so S is +∞ only where the true value is, and the signal-weighted
//! moments stay finite.
//!
//! Measured against mpmath `quad` at 60 digits (`tests/data/gen_thermometry.py`): relative
//! error ≤ 3e-13 on the 17 reference cases (`tests/thermometry_reference.rs`); extreme
//! temperatures (1e-300 K, 1e300 K) in `tests/review_regressions.rs`.
#![forbid(unsafe_code)]

use super::gauss_legendre::integrate;
use super::model::{invert_monotone, SignalModel};
use crate::constants::C2Convention;
use crate::error::{finite, positive, spectral, temperature};
use crate::{Error, Result};

/// A validated instrument spectral response: wavelengths (m, strictly increasing) and relative
/// response values (dimensionless, ≥ 0), borrowed from the caller.
///
/// # Formula
/// ```text
/// R(λ) = R_i + (R_{i+1} − R_i)·(λ − λ_i)/(λ_{i+1} − λ_i)   for λ_i ≤ λ ≤ λ_{i+1}
/// R(λ) = 0                                                 outside [λ_0, λ_{n−1}]
/// ```
///
/// # Errors
/// See [`Response::new`].
///
/// # Accuracy
/// Exact linear interpolation (one rounding per operation).
///
/// # Examples
/// ```
/// use quantaband::thermometry::response::Response;
/// let wl = [8e-6, 10e-6, 14e-6];
/// let r = [0.0, 1.0, 1.0];
/// let resp = Response::new(&wl, &r).unwrap();
/// assert_eq!(resp.value_at(9e-6).unwrap(), 0.5);
/// assert_eq!(resp.value_at(20e-6).unwrap(), 0.0);
/// ```
///
/// # References
/// Common practice, no source (piecewise-linear response tables).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Response<'a> {
    wavelengths_m: &'a [f64],
    values: &'a [f64],
}

impl<'a> Response<'a> {
    /// Validates and wraps a response table (`wavelengths_m` in m, `values` dimensionless).
    ///
    /// # Formula
    /// ```text
    /// accepted iff n ≥ 2, len(λ) = len(R), 0 < λ_0 < λ_1 < … (finite), R_i ≥ 0 (finite), Σ R_i > 0
    /// ```
    ///
    /// # Errors
    /// - `LengthMismatch` if the two slices differ in length (expected = wavelengths' length);
    /// - `TooFewPoints` for fewer than 2 points;
    /// - `NonFinite` / `NonPositiveSpectral` for a wavelength that is not finite and > 0;
    /// - `NotIncreasing` (arg `wavelengths_m`) if wavelengths are not strictly increasing;
    /// - `NonFinite` for a non-finite value, `OutOfRange` (range `[0, ∞)`) for a negative one;
    /// - `NonPositive` (arg `values`) if every value is zero.
    ///
    /// # Accuracy
    /// Exact (validation only; the slices are borrowed, not copied).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::Response;
    /// assert_eq!(Response::new(&[2e-6, 1e-6], &[1.0, 1.0]).unwrap_err().code(), "NOT_INCREASING");
    /// assert!(Response::new(&[1e-6, 2e-6], &[0.0, 1.0]).is_ok());
    /// ```
    ///
    /// # References
    /// Common practice, no source.
    pub fn new(wavelengths_m: &'a [f64], values: &'a [f64]) -> Result<Self> {
        if wavelengths_m.len() != values.len() {
            return Err(Error::LengthMismatch {
                expected: wavelengths_m.len(),
                got: values.len(),
            });
        }
        if wavelengths_m.len() < 2 {
            return Err(Error::TooFewPoints {
                needed: 2,
                got: wavelengths_m.len(),
            });
        }
        let mut prev = 0.0;
        for (i, &w) in wavelengths_m.iter().enumerate() {
            spectral("wavelengths_m", w)?;
            if i > 0 && w <= prev {
                return Err(Error::NotIncreasing {
                    arg: "wavelengths_m",
                    index: i,
                });
            }
            prev = w;
        }
        let mut any = false;
        for &v in values {
            finite("values", v)?;
            if v < 0.0 {
                return Err(Error::OutOfRange {
                    arg: "values",
                    value: v,
                    range: "[0, inf)",
                });
            }
            any |= v > 0.0;
        }
        if !any {
            return Err(Error::NonPositive {
                arg: "values",
                value: 0.0,
            });
        }
        Ok(Response {
            wavelengths_m,
            values,
        })
    }

    /// The tabulated wavelengths, m (strictly increasing).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::Response;
    /// let r = Response::new(&[1e-6, 2e-6, 3e-6], &[0.0, 1.0, 0.0]).unwrap();
    /// assert_eq!(r.wavelengths_m(), &[1e-6, 2e-6, 3e-6]);
    /// assert_eq!(r.values(), &[0.0, 1.0, 0.0]);
    /// assert_eq!(r.support_m(), (1e-6, 3e-6));
    /// ```
    pub fn wavelengths_m(&self) -> &'a [f64] {
        self.wavelengths_m
    }

    /// The relative response values (dimensionless, ≥ 0), one per wavelength; see
    /// [`Response::wavelengths_m`] for an example.
    pub fn values(&self) -> &'a [f64] {
        self.values
    }

    /// Shortest and longest tabulated wavelength, m; see [`Response::wavelengths_m`] for an
    /// example.
    pub fn support_m(&self) -> (f64, f64) {
        let n = self.wavelengths_m.len();
        // n ≥ 2 by construction.
        (self.wavelengths_m[0], self.wavelengths_m[n - 1])
    }

    /// Relative response at `wavelength_m` (m): linear interpolation, 0 outside the table.
    ///
    /// # Formula
    /// ```text
    /// R(λ) = R_i + (R_{i+1} − R_i)(λ − λ_i)/(λ_{i+1} − λ_i),  λ_i ≤ λ ≤ λ_{i+1};  0 outside
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveSpectral` for a bad wavelength.
    ///
    /// # Accuracy
    /// A few ulp.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::Response;
    /// let r = Response::new(&[1e-6, 2e-6], &[0.0, 1.0]).unwrap();
    /// assert!((r.value_at(1.5e-6).unwrap() - 0.5).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Common practice, no source.
    pub fn value_at(&self, wavelength_m: f64) -> Result<f64> {
        spectral("wavelength_m", wavelength_m)?;
        let (lo, hi) = self.support_m();
        if wavelength_m < lo || wavelength_m > hi {
            return Ok(0.0);
        }
        // First index with λ_i > λ (binary search); the segment is [i−1, i].
        let i = self.wavelengths_m.partition_point(|&w| w <= wavelength_m);
        let i = i.clamp(1, self.wavelengths_m.len() - 1);
        let (w0, w1) = (self.wavelengths_m[i - 1], self.wavelengths_m[i]);
        let (r0, r1) = (self.values[i - 1], self.values[i]);
        Ok(r0 + (r1 - r0) * (wavelength_m - w0) / (w1 - w0))
    }

    /// Mean wavelength λ0 and standard deviation σ (both m) of the response itself, R(λ) taken
    /// as a distribution over wavelength.
    ///
    /// # Formula
    /// ```text
    /// λ0 = ∫ λ R dλ / ∫ R dλ,   σ² = ∫ (λ − λ0)² R dλ / ∫ R dλ
    /// ```
    ///
    /// # Errors
    /// None in practice (the table is validated); the `Result` is kept for API uniformity.
    ///
    /// # Accuracy
    /// The integrands are polynomials of degree ≤ 3 on each segment, integrated exactly by the
    /// 20-point rule; σ loses digits only for a band narrower than ~1e-7·λ0.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::Response;
    /// let (wl, r) = ([1e-6, 3e-6], [1.0, 1.0]);
    /// let (m, sd) = Response::new(&wl, &r).unwrap().mean_and_spread_m().unwrap();
    /// assert!((m - 2e-6).abs() < 1e-20);
    /// assert!((sd - 2e-6 / 12f64.sqrt()).abs() < 1e-19);
    /// ```
    ///
    /// # References
    /// Common practice, no source.
    pub fn mean_and_spread_m(&self) -> Result<(f64, f64)> {
        let (lo, hi) = self.support_m();
        let centre = 0.5 * (lo + hi);
        let mut acc = [0.0; 3];
        for (a, b, ra, rb) in self.segments() {
            let slope = (rb - ra) / (b - a);
            let part = integrate(a, b, |w| {
                let r = ra + slope * (w - a);
                let d = w - centre;
                Ok([r, r * d, r * d * d])
            })?;
            for (s, p) in acc.iter_mut().zip(part.iter()) {
                *s += p;
            }
        }
        if !(acc[0] > 0.0) {
            return Err(Error::NonPositive {
                arg: "values",
                value: acc[0],
            });
        }
        let md = acc[1] / acc[0];
        let var = (acc[2] / acc[0] - md * md).max(0.0);
        Ok((centre + md, crate::float::sqrt(var)))
    }

    /// Iterator over the segments (λ_a, λ_b, R_a, R_b) with some response.
    fn segments(&self) -> impl Iterator<Item = (f64, f64, f64, f64)> + 'a {
        let w = self.wavelengths_m;
        let v = self.values;
        w.windows(2)
            .zip(v.windows(2))
            .filter(|(_, r)| r[0] > 0.0 || r[1] > 0.0)
            .map(|(w, r)| (w[0], w[1], r[0], r[1]))
    }
}

/// Where integration of a segment [a, b] at temperature T can start: the part at shorter
/// wavelengths where L_λ is below e⁻⁵⁰ of its largest value on the segment is skipped (it
/// changes the segment's integral by < 1e-18 relative). In x = c2/(λT), ln L_λ = const +
/// g(x) − ln(1 − e^−x) with g(x) = 5 ln x − x, which is largest at x = 5 and decreases beyond.
fn effective_start(a: f64, b: f64, temperature_k: f64, c2_mk: f64) -> f64 {
    let xa = c2_mk / (a * temperature_k);
    let xb = c2_mk / (b * temperature_k);
    let xm = xb.max(5.0);
    if xa <= xm + 50.0 {
        return a;
    }
    let g = |x: f64| 5.0 * crate::float::ln(x) - x;
    // Solve g(x) = g(xm) − 50 for x > xm by the fixed point x = K + 5 ln x (contraction, 5/x < 1).
    let k = 50.0 - g(xm);
    let mut x = xm + 50.0;
    for _ in 0..60 {
        x = k + 5.0 * crate::float::ln(x);
    }
    if x < xa && x > xm {
        c2_mk / (x * temperature_k)
    } else {
        a
    }
}

/// Largest width in ln λ of a sub-interval (a factor e^0.3 = 1.35 in wavelength).
const MAX_STEP_LN: f64 = 0.3;
/// Largest change of x = c2/(λT) across a sub-interval.
const MAX_STEP_X: f64 = 6.0;

/// Width in ln λ of the next sub-interval starting at `lambda_m`: at most [`MAX_STEP_LN`], and
/// at most a change of [`MAX_STEP_X`] in x = c2/(λT) (x(1 − e^−h) ≤ 6).
fn step_ln(lambda_m: f64, temperature_k: f64, c2_mk: f64) -> f64 {
    let x = c2_mk / (lambda_m * temperature_k);
    // x·(1 − e^−0.3) ≤ 6  ⇔  x ≤ 23.15
    if x > 23.0 {
        (-crate::float::ln_1p(-MAX_STEP_X / x)).min(MAX_STEP_LN)
    } else {
        MAX_STEP_LN
    }
}

/// Splits [a, b] into the geometric pieces of the module docs (each ≤ a factor e^0.3 in λ and
/// ≤ 6 in x = c2/(λ·`step_temperature_k`); the part where L_λ at `skip_temperature_k` is below
/// e⁻⁵⁰ of its largest value on [a, b] skipped) and hands each piece [lo, hi] to `piece`.
/// Shared by [`ResponseSignal`] (per response segment; both temperatures T) and the spectral
/// measurement equation ([`super::spectral`], per interval of the union of its tables' grids,
/// for terms at several nearby temperatures at once: steps for the coldest, skip for the
/// hottest — where the hottest term's L_λ is below e⁻⁵⁰ of its maximum on [a, b], so is every
/// colder one's, because L_λ(λ,T′)/L_λ(λ,T) increases with λ for T′ < T and the skipped part
/// lies below the hottest term's maximum).
pub(crate) fn march_pieces<F>(
    a: f64,
    b: f64,
    skip_temperature_k: f64,
    step_temperature_k: f64,
    c2_mk: f64,
    mut piece: F,
) -> Result<()>
where
    F: FnMut(f64, f64) -> Result<()>,
{
    let temperature_k = step_temperature_k;
    let mut lo = effective_start(a, b, skip_temperature_k, c2_mk);
    // The guard only bounds the loop; the steps reach b long before it.
    for _ in 0..100_000 {
        if lo >= b {
            break;
        }
        let h = step_ln(lo, temperature_k, c2_mk);
        let mut hi = lo * crate::float::exp(h);
        if !(hi > lo) {
            // No progress: h is below one ulp, i.e. x = c2/(λT) > 6/1.1e-16 ≈ 5e16 at lo
            // and beyond on this segment. There L_λ ≤ 2hc²λ⁻⁵e⁻ˣ with ln(2hc²λ⁻⁵) < 3800
            // for any positive f64 λ, so the rest of the segment is far below the f64 range:
            // skip it instead of spinning through the guard on empty pieces.
            break;
        }
        if hi * crate::float::exp(0.5 * h) >= b {
            hi = b; // merge a short remainder into this piece
        }
        piece(lo, hi)?;
        lo = hi;
    }
    Ok(())
}

/// Exponent k (0 ≤ k ≤ 1000) such that 2⁻ᵏ·L_λ·e^`extra_ln` stays below ~1e300 for every
/// wavelength ≥ `shortest_m` (`extra_ln` bounds the logarithm of any further factor of the
/// integrand, e.g. λ/(hc) for photon units; 0 for plain L_λ). Planck's L_λ never exceeds its
/// Rayleigh–Jeans value (c1/c2)·T/λ⁴ (x/(eˣ − 1) ≤ 1), and that bound is largest at the
/// shortest wavelength. k > 0 only for
/// T ≳ 1e290 K at micrometre wavelengths, where the nodes' L_λ would overflow although the
/// integrals (and their ratios) are ordinary numbers; k is 0 for every ordinary temperature,
/// leaving the arithmetic unchanged.
pub(crate) fn node_scale_exp(
    shortest_m: f64,
    temperature_k: f64,
    c2_mk: f64,
    extra_ln: f64,
) -> i32 {
    let ln_bound = crate::float::ln(crate::constants::C1L / c2_mk)
        + crate::float::ln(temperature_k)
        - 4.0 * crate::float::ln(shortest_m)
        + extra_ln;
    let excess = ln_bound - 690.0; // ln 1e300 ≈ 690.8
    if excess > 0.0 {
        // Finite: T and λ are finite and positive, so |ln_bound| < 4000.
        // excess/ln 2 > 0 here, so truncation + 1 rounds up (one spare factor of 2 at most).
        let k = excess / core::f64::consts::LN_2;
        if k >= 999.0 {
            1000
        } else {
            k as i32 + 1
        }
    } else {
        0
    }
}

/// The signal of an instrument with spectral response R viewing a blackbody:
/// S(T) = ∫ R(λ)·L_λ(λ, T) dλ, in W·m⁻²·sr⁻¹ per unit relative response.
///
/// # Formula
/// ```text
/// S(T)    = ∫ R(λ)·L_λ(λ,T) dλ
/// dS/dT   = ∫ R(λ)·∂L_λ/∂T dλ
/// L_λ     = c1L/(λ⁵(exp(c2/(λT)) − 1)),   c1L = 2hc²
/// ```
///
/// # Errors
/// Construction cannot fail (the response is already validated). Evaluation: `NonFinite` /
/// `NonPositiveTemperature` for a bad temperature.
///
/// # Accuracy
/// ≤ 3e-13 relative against mpmath `quad` at 60 digits on the reference cases (1 µm to 14 µm
/// responses, 250 K to 3000 K), see `tests/thermometry_reference.rs`; the brief's bound is 1e-10.
///
/// # Examples
/// ```
/// use quantaband::thermometry::response::{Response, ResponseSignal};
/// use quantaband::thermometry::model::SignalModel;
/// let wl = [8e-6, 14e-6];
/// let r = [1.0, 1.0];
/// let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
/// // mpmath quad (tests/data/gen_thermometry.py): ∫ 8–14 µm L_λ(λ, 300 K) dλ = 54.933461376…
/// let v = s.signal(300.0).unwrap();
/// assert!((v / 54.933_461_376_839_69 - 1.0).abs() < 1e-12, "{v}");
/// let t = s.temperature(v).unwrap();
/// assert!((t - 300.0).abs() < 1e-9);
/// ```
///
/// # References
/// P. Saunders, *Radiation Thermometry: Fundamentals and Applications in the Petrochemical
/// Industry*, SPIE Press, 2007, ch. 2 (signal as the response-weighted Planck integral) — from
/// memory.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResponseSignal<'a> {
    response: Response<'a>,
    c2: C2Convention,
    c2_mk: f64,
}

impl<'a> ResponseSignal<'a> {
    /// Wraps a validated response with the c2 convention to use in Planck's law (CODATA 2018
    /// hc/k, or 0.014388 m·K for ITS-90 work).
    ///
    /// # Formula
    /// See [`ResponseSignal`].
    ///
    /// # Errors
    /// None: the response is already validated.
    ///
    /// # Accuracy
    /// See [`ResponseSignal`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::constants::C2Convention;
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let s = ResponseSignal::new(Response::new(&[1e-6, 2e-6], &[1.0, 1.0]).unwrap(), C2Convention::Its90);
    /// assert_eq!(s.c2_mk(), 0.014388);
    /// ```
    ///
    /// # References
    /// Preston-Thomas, Metrologia 27, 3 (1990) for the ITS-90 c2.
    pub fn new(response: Response<'a>, c2: C2Convention) -> Self {
        ResponseSignal {
            response,
            c2,
            c2_mk: c2.c2(),
        }
    }

    /// The response table (wavelengths in m, relative values dimensionless).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let s = ResponseSignal::new(Response::new(&[1e-6, 2e-6], &[1.0, 0.5]).unwrap(), Default::default());
    /// assert_eq!(s.response().values(), &[1.0, 0.5]);
    /// ```
    pub fn response(&self) -> Response<'a> {
        self.response
    }

    /// The value of c2 in use, m·K.
    ///
    /// # Examples
    /// ```
    /// use quantaband::constants::C2Convention;
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let s = ResponseSignal::new(Response::new(&[1e-6, 2e-6], &[1.0, 1.0]).unwrap(), C2Convention::Its90);
    /// // ITS-90 c2 = 0.014388 m·K (Preston-Thomas, Metrologia 27, 3, 1990)
    /// assert_eq!(s.c2_mk(), 0.014388);
    /// ```
    pub fn c2_mk(&self) -> f64 {
        self.c2_mk
    }

    /// Marches over every segment in geometric pieces (see the module docs) and hands each piece
    /// [lo, hi] and the segment's linear response (R(λ) = ra + slope·(λ − a)) to `piece`.
    fn march<F>(&self, temperature_k: f64, mut piece: F) -> Result<()>
    where
        F: FnMut(f64, f64, f64, f64, f64) -> Result<()>,
    {
        let c2 = self.c2_mk;
        for (a, b, ra, rb) in self.response.segments() {
            let slope = (rb - ra) / (b - a);
            march_pieces(a, b, temperature_k, temperature_k, c2, |lo, hi| {
                piece(lo, hi, a, ra, slope)
            })?;
        }
        Ok(())
    }

    /// S and dS/dT (one pass, no moments).
    fn signal_pair(&self, temperature_k: f64) -> Result<(f64, f64)> {
        let (s, ds, k) = self.scaled_signal_pair(temperature_k)?;
        let up = crate::float::powi(2.0, k);
        Ok((s * up, ds * up))
    }

    /// Exponent k (0 ≤ k ≤ 1000) such that 2⁻ᵏ·L_λ stays below ~1e300 on the whole table
    /// (see [`node_scale_exp`]).
    fn node_scale_exp(&self, temperature_k: f64) -> i32 {
        node_scale_exp(self.response.support_m().0, temperature_k, self.c2_mk, 0.0)
    }

    /// (2⁻ᵏ·S, 2⁻ᵏ·dS/dT, k) with k from [`Self::node_scale_exp`].
    fn scaled_signal_pair(&self, temperature_k: f64) -> Result<(f64, f64, i32)> {
        temperature("temperature_k", temperature_k)?;
        let conv = self.c2;
        let k = self.node_scale_exp(temperature_k);
        let scaled = super::kernel::ScaledRadiance::new(conv, false, crate::float::powi(2.0, -k))?;
        let (mut s, mut ds) = (0.0, 0.0);
        self.march(temperature_k, |lo, hi, a, ra, slope| {
            let [p0, p1] = integrate(lo, hi, |w| {
                let r = ra + slope * (w - a);
                let (l, dl) = scaled.at_and_dt(w, temperature_k)?;
                Ok([r * l, r * dl])
            })?;
            s += p0;
            ds += p1;
            Ok(())
        })?;
        Ok((s, ds, k))
    }

    /// ln S(T), formed from the scaled integral so that it stays finite where S overflows.
    fn ln_signal(&self, temperature_k: f64) -> Result<f64> {
        let (s, k) = self.scaled_signal_only(temperature_k)?;
        Ok(crate::float::ln(s) + f64::from(k) * core::f64::consts::LN_2)
    }

    /// S alone (one Planck evaluation per node).
    fn signal_only(&self, temperature_k: f64) -> Result<f64> {
        let (s, k) = self.scaled_signal_only(temperature_k)?;
        Ok(s * crate::float::powi(2.0, k))
    }

    /// (2⁻ᵏ·S, k) with k from [`Self::node_scale_exp`].
    fn scaled_signal_only(&self, temperature_k: f64) -> Result<(f64, i32)> {
        temperature("temperature_k", temperature_k)?;
        let conv = self.c2;
        let k = self.node_scale_exp(temperature_k);
        let scaled = super::kernel::ScaledRadiance::new(conv, false, crate::float::powi(2.0, -k))?;
        let mut s = 0.0;
        self.march(temperature_k, |lo, hi, a, ra, slope| {
            let [p0] = integrate(lo, hi, |w| {
                let r = ra + slope * (w - a);
                Ok([r * scaled.at(w, temperature_k)?])
            })?;
            s += p0;
            Ok(())
        })?;
        Ok((s, k))
    }

    /// [S, dS/dT, λ̄, σ²] in one pass. Each sub-interval's weight, mean and second central moment
    /// are merged into running values with Chan's parallel update, so the variance never suffers
    /// cancellation however far the weight sits from any fixed origin. λ̄ and σ² are NaN when S
    /// is 0.
    fn moments(&self, temperature_k: f64) -> Result<[f64; 4]> {
        temperature("temperature_k", temperature_k)?;
        let conv = self.c2;
        let k = self.node_scale_exp(temperature_k);
        let scaled = super::kernel::ScaledRadiance::new(conv, false, crate::float::powi(2.0, -k))?;
        let (mut s_tot, mut ds_tot) = (0.0, 0.0);
        let (mut weight, mut mean, mut m2) = (0.0f64, 0.0f64, 0.0f64);
        self.march(temperature_k, |lo, hi, a, ra, slope| {
            let centre = 0.5 * (lo + hi);
            let [p0, p1, pm1, pm2] = integrate(lo, hi, |w| {
                let r = ra + slope * (w - a);
                let (l, dl) = scaled.at_and_dt(w, temperature_k)?;
                let rl = r * l;
                let d = w - centre;
                Ok([rl, r * dl, rl * d, rl * d * d])
            })?;
            s_tot += p0;
            ds_tot += p1;
            if p0 > 0.0 {
                // piece: weight p0, mean centre + pm1/p0, M2 = pm2 − pm1²/p0; merge (Chan).
                let mean_p = centre + pm1 / p0;
                let m2_p = (pm2 - pm1 * (pm1 / p0)).max(0.0);
                let total = weight + p0;
                let delta = mean_p - mean;
                mean += delta * (p0 / total);
                // weight·(p0/total), not weight·p0/total: the product overflows for weights
                // above ~1e154 (T ≳ 1e150 K), which made σ = ∞.
                m2 += m2_p + delta * delta * (weight * (p0 / total));
                weight = total;
            }
            Ok(())
        })?;
        // The scale cancels in the mean and variance; S and dS/dT get it back.
        let up = crate::float::powi(2.0, k);
        if weight > 0.0 {
            Ok([s_tot * up, ds_tot * up, mean, (m2 / weight).max(0.0)])
        } else {
            Ok([s_tot * up, ds_tot * up, f64::NAN, f64::NAN])
        }
    }

    /// Signal-weighted mean wavelength λ̄ = ∫λ·R·L dλ / ∫R·L dλ at `temperature_k`, m.
    ///
    /// # Formula
    /// ```text
    /// λ̄(T) = ∫ λ R(λ) L_λ(λ,T) dλ / ∫ R(λ) L_λ(λ,T) dλ
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature`; `NoSolution` if the signal underflows to 0 at
    /// this temperature (no weight to average with).
    ///
    /// # Accuracy
    /// As the integrals (≤ 3e-13 relative), checked against mpmath in the reference tests.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let (wl, r) = ([8e-6, 14e-6], [1.0, 1.0]);
    /// let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// let m = s.mean_wavelength_m(300.0).unwrap();
    /// assert!(m > 10.5e-6 && m < 11.0e-6);
    /// ```
    ///
    /// # References
    /// P. Saunders, D. R. White, "Physical basis of interpolation equations for radiation
    /// thermometry", Metrologia 40, 195–203 (2003), doi:10.1088/0026-1394/40/4/309 (moments of
    /// the weighted response) — from memory.
    pub fn mean_wavelength_m(&self, temperature_k: f64) -> Result<f64> {
        let m = self.moments(temperature_k)?;
        if !(m[0] > 0.0) {
            return Err(Error::NoSolution {
                what: "signal underflows at this temperature",
            });
        }
        Ok(m[2])
    }

    /// Signal-weighted mean wavelength λ̄ and standard deviation σ (both m) at `temperature_k`.
    ///
    /// # Formula
    /// ```text
    /// σ² = ∫ λ² R L dλ / ∫ R L dλ − λ̄²
    /// ```
    ///
    /// # Errors
    /// As [`ResponseSignal::mean_wavelength_m`].
    ///
    /// # Accuracy
    /// Per-piece central moments merged with Chan's update: ≤ 1e-12 relative against mpmath on
    /// the reference cases.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let (wl, r) = ([9.9e-6, 10.1e-6], [1.0, 1.0]);
    /// let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// let (m, sd) = s.mean_and_spread_m(500.0).unwrap();
    /// // a flat 0.2 µm band: σ ≈ 0.2 µm/√12
    /// assert!((sd / (0.2e-6 / 12f64.sqrt()) - 1.0).abs() < 1e-3);
    /// assert!((m - 10e-6).abs() < 1e-9);
    /// ```
    ///
    /// # References
    /// As [`ResponseSignal::mean_wavelength_m`].
    pub fn mean_and_spread_m(&self, temperature_k: f64) -> Result<(f64, f64)> {
        let m = self.moments(temperature_k)?;
        if !(m[0] > 0.0) {
            return Err(Error::NoSolution {
                what: "signal underflows at this temperature",
            });
        }
        Ok((m[2], crate::float::sqrt(m[3])))
    }

    /// Limiting effective wavelength λ_T at `temperature_k`, m: the wavelength of a Wien-law
    /// monochromatic thermometer with the same relative sensitivity (d ln S/dT) at T.
    ///
    /// # Formula
    /// ```text
    /// λ_T(T) = c2 / (T² · d ln S/dT) = c2·S / (T²·dS/dT)
    /// ```
    ///
    /// # Errors
    /// As [`ResponseSignal::mean_wavelength_m`].
    ///
    /// # Accuracy
    /// As the integrals (≤ 3e-13 relative).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let (wl, r) = ([649e-9, 651e-9], [1.0, 1.0]);
    /// let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// // narrow band at 650 nm, Wien regime: λ_T ≈ 650 nm
    /// let lt = s.limiting_effective_wavelength_m(1300.0).unwrap();
    /// assert!((lt / 650e-9 - 1.0).abs() < 1e-3);
    /// ```
    ///
    /// # References
    /// R. D. Lee, "The NBS photoelectric pyrometer and its use in realizing the International
    /// Practical Temperature Scale above 1063 °C", Metrologia 2, 150 (1966); P. Saunders,
    /// D. R. White, Metrologia 40, 195 (2003) — definitions from memory.
    pub fn limiting_effective_wavelength_m(&self, temperature_k: f64) -> Result<f64> {
        // The common scale 2⁻ᵏ cancels in S/S′ (both stay finite where S would overflow).
        let (s0, s1, _) = self.scaled_signal_pair(temperature_k)?;
        let m = [s0, s1];
        if !(m[0] > 0.0 && m[1] > 0.0) {
            return Err(Error::NoSolution {
                what: "signal underflows at this temperature",
            });
        }
        // (S/S′)/T/T rather than S/(T²·S′): T² overflows above 1.3e154 K.
        Ok(self.c2_mk * (m[0] / m[1]) / temperature_k / temperature_k)
    }

    /// Effective wavelength λ_e between two temperatures, m: the wavelength of a Wien-law
    /// monochromatic thermometer giving the same signal ratio S(T2)/S(T1). Equals the limiting
    /// effective wavelength when T1 = T2.
    ///
    /// # Formula
    /// ```text
    /// λ_e(T1,T2) = c2·(1/T1 − 1/T2) / ln(S(T2)/S(T1))
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature` for a bad temperature; `NoSolution` if a signal
    /// underflows to 0.
    ///
    /// # Accuracy
    /// As the integrals; for |T1 − T2| < 1e-6·T the formula loses digits and the limiting value is
    /// returned instead (error ≤ 1e-9 relative).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// let (wl, r) = ([649e-9, 651e-9], [1.0, 1.0]);
    /// let s = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// let le = s.effective_wavelength_m(1234.93, 1337.33).unwrap();
    /// assert!((le / 650e-9 - 1.0).abs() < 1e-3);
    /// ```
    ///
    /// # References
    /// As [`ResponseSignal::limiting_effective_wavelength_m`].
    pub fn effective_wavelength_m(&self, t1_k: f64, t2_k: f64) -> Result<f64> {
        temperature("t1_k", t1_k)?;
        temperature("t2_k", t2_k)?;
        if (t1_k - t2_k).abs() <= 1e-6 * t1_k.max(t2_k) {
            return self.limiting_effective_wavelength_m(0.5 * (t1_k + t2_k));
        }
        let s1 = self.signal(t1_k)?;
        let s2 = self.signal(t2_k)?;
        if !(s1 > 0.0 && s2 > 0.0) {
            return Err(Error::NoSolution {
                what: "signal underflows at this temperature",
            });
        }
        let ln_ratio = if s1.is_finite() && s2.is_finite() {
            crate::float::ln(s2 / s1)
        } else {
            // A signal beyond f64::MAX (T ≳ 1e295 K): the ratio from the scaled logarithms.
            self.ln_signal(t2_k)? - self.ln_signal(t1_k)?
        };
        Ok(self.c2_mk * (1.0 / t1_k - 1.0 / t2_k) / ln_ratio)
    }

    /// Starting temperature for the numerical inverse: Wien's law at the response's
    /// middle wavelength, matched to the signal per unit of response area.
    fn guess(&self, signal: f64) -> f64 {
        let (lo, hi) = self.response.support_m();
        let lam = crate::float::sqrt(lo * hi);
        let mut area = 0.0;
        for (a, b, ra, rb) in self.response.segments() {
            area += 0.5 * (ra + rb) * (b - a);
        }
        let l = signal / area;
        let l5 = crate::float::powi(lam, 5);
        let t = self.c2_mk / (lam * crate::float::ln_1p(crate::constants::C1L / (l5 * l)));
        if t.is_finite() && t > 0.0 {
            t
        } else {
            1000.0
        }
    }
}

impl SignalModel for ResponseSignal<'_> {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        self.signal_only(temperature_k)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_pair(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        self.signal_pair(temperature_k)
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        positive("signal", signal)?;
        invert_monotone(self, signal, self.guess(signal))
    }
}
