//! Sakuma–Hattori calibration curves: S(T) = C / (exp(c2/(A·T + B)) − 1).
//!
//! The curve is the Planck form with an effective wavelength that varies linearly with
//! temperature; it interpolates the signal of a real (finite-band) instrument over a wide range
//! with three parameters and has a closed-form inverse, which makes it the workhorse calibration
//! equation of radiation thermometry and the fast path of the frame conversion
//! ([`super::frame`]).
//!
//! - [`SakumaHattori::new`]: from known A, B, C.
//! - [`SakumaHattori::from_response`]: a starting curve from a spectral response, with A and B
//!   from the mean λ0 and standard deviation σ of the response R(λ) and C matching S(T_ref).
//! - [`SakumaHattori::fit`]: least squares to calibration points (Levenberg–Marquardt on
//!   ln S, 3×3 normal equations, no allocation), residuals in kelvin.
//! - [`SakumaHattori::fit_model`]: least squares to an exact [`SignalModel`] over a range.
//! - [`max_interpolation_error_k`]: max |T_curve(S_exact(T)) − T| over a range.
//!
//! # References
//! - F. Sakuma, S. Hattori, "Establishing a practical temperature standard by using a narrow-band
//!   radiation thermometer with a silicon detector", in *Temperature: Its Measurement and
//!   Control in Science and Industry*, Vol. 5, AIP, 1982, pp. 421–427.
//! - P. Saunders, D. R. White, "Physical basis of interpolation equations for radiation
//!   thermometry", Metrologia 40, 195–203 (2003), doi:10.1088/0026-1394/40/4/309:
//!   A = λ0(1 − 6σ²/λ0²), B = c2σ²/(2λ0²) — from memory.
#![forbid(unsafe_code)]

use super::model::SignalModel;
use super::response::ResponseSignal;
use crate::constants::C2Convention;
use crate::error::{finite, positive, temperature};
use crate::float::{exp, expm1, ln, ln_1p};
use crate::{Error, Result};

/// A Sakuma–Hattori curve S(T) = C/(exp(c2/(A·T + B)) − 1).
///
/// # Formula
/// ```text
/// S(T)  = C / (exp(c2/(A·T + B)) − 1)            A in m, B in m·K, C in signal units
/// T(S)  = (c2 / ln(C/S + 1) − B) / A
/// dS/dT = S · A·x/(A·T + B) · 1/(1 − e^−x),   x = c2/(A·T + B)
/// ```
///
/// # Errors
/// Evaluation: `NonFinite` / `NonPositiveTemperature` for a bad T, `OutOfRange` when
/// A·T + B ≤ 0; inverse: `NonFinite` / `NonPositive` for a bad signal, `NoSolution` when the
/// inverse is ≤ 0 K.
///
/// # Accuracy
/// Closed forms with `expm1`/`ln_1p`: a few ulp; S → T → S round trips within 1e-9 K (tests).
///
/// # Examples
/// ```
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// use quantaband::thermometry::model::SignalModel;
/// let sh = SakumaHattori::new(10e-6, 1e-9, 1e3, Default::default()).unwrap();
/// let s = sh.signal(500.0).unwrap();
/// assert!((sh.temperature(s).unwrap() - 500.0).abs() < 1e-9);
/// ```
///
/// # References
/// See the module docs.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SakumaHattori {
    a_m: f64,
    b_mk: f64,
    c: f64,
    c2_mk: f64,
}

/// Result of a Sakuma–Hattori fit: the curve, its temperature residuals (K) at the fitted
/// points and the iteration count, returned by [`SakumaHattori::fit`] and
/// [`SakumaHattori::fit_model`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::model::SignalModel;
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// // Points taken from a known curve are fitted back with (near) zero residual.
/// let truth = SakumaHattori::new(3.9e-6, 2e-8, 5e4, Default::default()).unwrap();
/// let t = [600.0, 800.0, 1000.0, 1200.0];
/// let s = t.map(|t| truth.signal(t).unwrap());
/// let rep = SakumaHattori::fit(&t, &s, Default::default(), None).unwrap();
/// assert!(rep.max_abs_residual_k < 1e-6 && rep.rms_residual_k <= rep.max_abs_residual_k);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct FitReport {
    /// The fitted curve.
    pub curve: SakumaHattori,
    /// Root-mean-square temperature residual T_curve(S_i) − T_i, K.
    pub rms_residual_k: f64,
    /// Largest |T_curve(S_i) − T_i|, K.
    pub max_abs_residual_k: f64,
    /// Levenberg–Marquardt iterations used.
    pub iterations: u32,
}

/// ln(e^x − 1) without overflow.
#[inline]
fn ln_expm1(x: f64) -> f64 {
    if x > 30.0 {
        x + ln_1p(-exp(-x))
    } else {
        ln(expm1(x))
    }
}

impl SakumaHattori {
    /// A curve from its parameters: `a_m` (m, > 0), `b_mk` (m·K), `c` (signal units, > 0) and
    /// the c2 convention.
    ///
    /// # Formula
    /// See [`SakumaHattori`].
    ///
    /// # Errors
    /// `NonFinite`, `NonPositive` (A or C ≤ 0).
    ///
    /// # Accuracy
    /// Exact (stores the parameters).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// assert_eq!(SakumaHattori::new(0.0, 0.0, 1.0, Default::default()).unwrap_err().code(), "NON_POSITIVE");
    /// ```
    ///
    /// # References
    /// Sakuma & Hattori (1982), see the module docs.
    pub fn new(a_m: f64, b_mk: f64, c: f64, c2: C2Convention) -> Result<Self> {
        positive("a_m", a_m)?;
        finite("b_mk", b_mk)?;
        positive("c", c)?;
        Ok(SakumaHattori {
            a_m,
            b_mk,
            c,
            c2_mk: c2.c2(),
        })
    }

    /// Parameter A, m.
    ///
    /// # Examples
    /// ```
    /// use quantaband::constants::C2Convention;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let sh = SakumaHattori::new(10e-6, 1e-9, 1e3, C2Convention::Its90).unwrap();
    /// assert_eq!((sh.a_m(), sh.b_mk(), sh.c()), (10e-6, 1e-9, 1e3));
    /// // ITS-90 c2 = 0.014388 m·K (Preston-Thomas, Metrologia 27, 3, 1990)
    /// assert_eq!(sh.c2_mk(), 0.014388);
    /// ```
    pub fn a_m(&self) -> f64 {
        self.a_m
    }
    /// Parameter B, m·K; see [`SakumaHattori::a_m`] for an example.
    pub fn b_mk(&self) -> f64 {
        self.b_mk
    }
    /// Parameter C, signal units; see [`SakumaHattori::a_m`] for an example.
    pub fn c(&self) -> f64 {
        self.c
    }
    /// c2 in use, m·K; see [`SakumaHattori::a_m`] for an example.
    pub fn c2_mk(&self) -> f64 {
        self.c2_mk
    }

    /// Starting curve from a spectral response: A and B from the mean λ0 and spread σ of the
    /// response R(λ), C so that the curve reproduces the exact signal at
    /// `reference_temperature_k` (K).
    ///
    /// # Formula
    /// ```text
    /// A = λ0·(1 − 6σ²/λ0²),  B = c2·σ²/(2λ0²),  C = S(T_ref)·(exp(c2/(A·T_ref + B)) − 1)
    /// (Wien limit, second order in σ/λ0: the limiting effective wavelength of the response is
    ///  λ_T ≈ A + 2B/T, which is what the Sakuma–Hattori form has)
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature`; `NoSolution` if the signal underflows at T_ref;
    /// `DegenerateFit` if the band is so wide that A ≤ 0.
    ///
    /// # Accuracy
    /// An approximation (second order in σ/λ0); exact at T_ref. Use [`SakumaHattori::fit_model`]
    /// for a least-squares curve.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// use quantaband::thermometry::model::SignalModel;
    /// let (wl, r) = ([640e-9, 660e-9], [1.0, 1.0]);
    /// let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// let sh = SakumaHattori::from_response(&model, 1300.0).unwrap();
    /// let t = sh.temperature(model.signal(1500.0).unwrap()).unwrap();
    /// assert!((t - 1500.0).abs() < 0.01);
    /// ```
    ///
    /// # References
    /// P. Saunders, D. R. White, Metrologia 40, 195 (2003) — from memory.
    pub fn from_response(model: &ResponseSignal<'_>, reference_temperature_k: f64) -> Result<Self> {
        temperature("reference_temperature_k", reference_temperature_k)?;
        let (l0, sd) = model.response().mean_and_spread_m()?;
        let c2 = model.c2_mk();
        let v = sd * sd / (l0 * l0);
        let a = l0 * (1.0 - 6.0 * v);
        let b = c2 * v / 2.0;
        if !(a > 0.0) {
            return Err(Error::DegenerateFit {
                reason: "band too wide for the moment start (A <= 0)",
            });
        }
        let s_ref = model.signal(reference_temperature_k)?;
        let c = s_ref * expm1(c2 / (a * reference_temperature_k + b));
        if !(c > 0.0 && c.is_finite()) {
            return Err(Error::NoSolution {
                what: "signal out of range at the reference temperature",
            });
        }
        Ok(SakumaHattori {
            a_m: a,
            b_mk: b,
            c,
            c2_mk: c2,
        })
    }

    /// ln S(T) − ln C and its gradient with respect to (A, B) at T (unchecked helper).
    fn ln_shape(&self, a: f64, b: f64, t: f64) -> (f64, f64, f64) {
        let d = a * t + b;
        let x = self.c2_mk / d;
        let bose = 1.0 / -expm1(-x);
        let f = -ln_expm1(x);
        // ∂f/∂A = bose·x·T/d,  ∂f/∂B = bose·x/d
        (f, bose * x * t / d, bose * x / d)
    }

    /// Least-squares Sakuma–Hattori curve through calibration points (`temperatures_k`, K;
    /// `signals`, > 0), with optional temperature residuals T_curve(S_i) − T_i written to
    /// `residuals_k` (same length).
    ///
    /// # Formula
    /// ```text
    /// start:   B = 0 and the straight line ln S = ln C − (c2/A)·(1/T) through the points
    /// stage 1: minimise Σ [ln C − ln(exp(c2/(A·T_i + B)) − 1) − ln S_i]²  over (A, B, ln C)
    /// stage 2: minimise Σ [T_curve(S_i) − T_i]²,  T_curve(S) = (c2/ln(1 + C/S) − B)/A
    /// both by Levenberg–Marquardt with Marquardt's diagonal scaling; 3×3 normal equations
    /// ```
    ///
    /// # Errors
    /// - `LengthMismatch` if the slices differ in length;
    /// - `TooFewPoints` for fewer than 3 points; `TooLarge` for more than [`MAX_FIT_POINTS`];
    /// - `NonFinite` / `NonPositiveTemperature` / `NonPositive` for a bad point;
    /// - `DegenerateFit` for a repeated temperature, signals not strictly increasing with
    ///   temperature, or singular normal equations;
    /// - `NotConverged` if 500 iterations do not converge.
    ///
    /// # Accuracy
    /// Three exact points are reproduced to < 1e-9 K; 16 points of an 8–14 µm band over
    /// 250–600 K give a curve within 8.45 mK of the exact signal; [`SakumaHattori::fit_model`]
    /// reweights towards equal ripple and reaches 6.71 mK (`tests/thermometry_roundtrip.rs`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// use quantaband::thermometry::model::SignalModel;
    /// let truth = SakumaHattori::new(3.9e-6, 2e-8, 5e4, Default::default()).unwrap();
    /// let t = [400.0, 600.0, 900.0, 1200.0];
    /// let s = t.map(|t| truth.signal(t).unwrap());
    /// let mut res = [0.0; 4];
    /// let fit = SakumaHattori::fit(&t, &s, Default::default(), Some(&mut res)).unwrap();
    /// assert!(fit.max_abs_residual_k < 1e-8);
    /// assert!((fit.curve.a_m() / 3.9e-6 - 1.0).abs() < 1e-8);
    /// ```
    ///
    /// # References
    /// D. W. Marquardt, "An algorithm for least-squares estimation of nonlinear parameters",
    /// J. SIAM 11, 431–441 (1963), doi:10.1137/0111030; curve: see the module docs.
    pub fn fit(
        temperatures_k: &[f64],
        signals: &[f64],
        c2: C2Convention,
        residuals_k: Option<&mut [f64]>,
    ) -> Result<FitReport> {
        let n = temperatures_k.len();
        if signals.len() != n {
            return Err(Error::LengthMismatch {
                expected: n,
                got: signals.len(),
            });
        }
        if let Some(r) = residuals_k.as_deref() {
            if r.len() != n {
                return Err(Error::LengthMismatch {
                    expected: n,
                    got: r.len(),
                });
            }
        }
        if n < 3 {
            return Err(Error::TooFewPoints { needed: 3, got: n });
        }
        if n > MAX_FIT_POINTS {
            return Err(Error::TooLarge {
                arg: "temperatures_k",
                limit: MAX_FIT_POINTS,
                got: n,
            });
        }
        for (&t, &s) in temperatures_k.iter().zip(signals) {
            temperature("temperatures_k", t)?;
            positive("signals", s)?;
        }
        let mut residuals_k = residuals_k;
        check_increasing(temperatures_k, signals, residuals_k.as_deref_mut())?;
        let c2v = c2.c2();
        // Start: ln S = ln C − (c2/A)/T (least-squares line in 1/T).
        let nf = n as f64;
        let (mut sx, mut sy) = (0.0, 0.0);
        for (&t, &s) in temperatures_k.iter().zip(signals) {
            sx += 1.0 / t;
            sy += ln(s);
        }
        let (mx, my) = (sx / nf, sy / nf);
        let (mut sxx, mut sxy) = (0.0, 0.0);
        for (&t, &s) in temperatures_k.iter().zip(signals) {
            let dx = 1.0 / t - mx;
            sxx += dx * dx;
            sxy += dx * (ln(s) - my);
        }
        let slope = sxy / sxx;
        if !(slope < 0.0 && slope.is_finite()) {
            return Err(Error::DegenerateFit {
                reason: "signals must increase strictly with temperature",
            });
        }
        let a = -c2v / slope;
        let b = 0.0;
        // ln_shape only reads c2 from `shape`; A and B are passed explicitly.
        let shape = SakumaHattori {
            a_m: a,
            b_mk: b,
            c: 1.0,
            c2_mk: c2v,
        };
        // Best ln C for the start shape.
        let mut lnc = 0.0;
        for (&t, &s) in temperatures_k.iter().zip(signals) {
            lnc += ln(s) - shape.ln_shape(a, b, t).0;
        }
        lnc /= nf;

        let t_scale = mx.recip();
        // Stage 1: residuals in ln S (robust from the Wien start).
        let stage1 = |p: &[f64; 3], i: usize| -> Option<(f64, [f64; 3])> {
            let (t, s) = (temperatures_k[i], signals[i]);
            if !(p[0] > 0.0 && p[0] * t + p[1] > 0.0) {
                return None;
            }
            let (fv, da, db) = shape.ln_shape(p[0], p[1], t);
            Some((p[2] + fv - ln(s), [da, db, 1.0]))
        };
        let (p1, it1) = levenberg_marquardt([a, b, lnc], n, t_scale, &stage1)?;
        // Stage 2: residuals in temperature, T_curve(S_i) − T_i, which is what a calibration is
        // judged by: T = (c2/L − B)/A, L = ln(1 + C/S).
        let stage2 = |p: &[f64; 3], i: usize| t_residual(c2v, p, temperatures_k[i], signals[i]);
        let (p2, it2) = levenberg_marquardt(p1, n, t_scale, &stage2)?;
        let (a, b, lnc) = (p2[0], p2[1], p2[2]);
        let iterations = it1 + it2;
        let curve = SakumaHattori::new(a, b, exp(lnc), c2).map_err(|_| Error::DegenerateFit {
            reason: "fit left the valid parameter range",
        })?;
        let mut sum2 = 0.0;
        let mut maxr: f64 = 0.0;
        let mut out = residuals_k;
        for (i, (&t, &s)) in temperatures_k.iter().zip(signals).enumerate() {
            let r = curve.temperature(s)? - t;
            sum2 += r * r;
            maxr = maxr.max(r.abs());
            if let Some(o) = out.as_deref_mut() {
                if let Some(slot) = o.get_mut(i) {
                    *slot = r;
                }
            }
        }
        Ok(FitReport {
            curve,
            rms_residual_k: crate::float::sqrt(sum2 / nf),
            max_abs_residual_k: maxr,
            iterations,
        })
    }

    /// Calibration curve for an exact signal model over [`t_min_k`, `t_max_k`]: fits 40 points
    /// spaced evenly in 1/T (Chebyshev–Lobatto spacing) of `model` by [`SakumaHattori::fit`],
    /// then reweights towards the minimax (equal-ripple) temperature error.
    ///
    /// # Formula
    /// ```text
    /// u_i = 1/T_max + (1/T_min − 1/T_max)·(1 − cos(π i/39))/2,  T_i = 1/u_i,  S_i = model(T_i)
    /// SakumaHattori::fit, then 60 Lawson steps: w_i ← w_i·|r_i|/Σ w_j|r_j|, weighted LM on
    /// the temperature residuals r_i; the parameters with the smallest max |r_i| are kept
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature`; `DegenerateFit` for t_min ≥ t_max; errors of the
    /// model and of [`SakumaHattori::fit`]. The report's residuals are those of the 40 points.
    ///
    /// # Accuracy
    /// Measured with [`max_interpolation_error_k`] (`tests/thermometry_roundtrip.rs`): 6.71 mK
    /// max on a flat 8–14 µm band over 250–600 K; 0.054 mK on a 20 nm wide band at 650 nm over
    /// 600–1600 K.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::response::{Response, ResponseSignal};
    /// use quantaband::thermometry::sakuma_hattori::{max_interpolation_error_k, SakumaHattori};
    /// let (wl, r) = ([3e-6, 5e-6], [1.0, 1.0]);
    /// let model = ResponseSignal::new(Response::new(&wl, &r).unwrap(), Default::default());
    /// let fit = SakumaHattori::fit_model(&model, 500.0, 1000.0, Default::default()).unwrap();
    /// let (err, _) = max_interpolation_error_k(&fit.curve, &model, 500.0, 1000.0, 200).unwrap();
    /// assert!(err < 0.1);
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn fit_model<M: SignalModel + ?Sized>(
        model: &M,
        t_min_k: f64,
        t_max_k: f64,
        c2: C2Convention,
    ) -> Result<FitReport> {
        temperature("t_min_k", t_min_k)?;
        temperature("t_max_k", t_max_k)?;
        if !(t_min_k < t_max_k) {
            return Err(Error::DegenerateFit {
                reason: "t_min_k must be below t_max_k",
            });
        }
        const N: usize = 40;
        let mut ts = [0.0; N];
        let mut ss = [0.0; N];
        let (u0, u1) = (1.0 / t_max_k, 1.0 / t_min_k);
        for i in 0..N {
            // cos(π·i/(N − 1)), i.e. 2π·i/(2N − 2) in turns.
            let c = crate::stats::sin_cos_turns(i as f64 / (2 * (N - 1)) as f64).1;
            let u = u0 + (u1 - u0) * (1.0 - c) * 0.5;
            ts[i] = 1.0 / u;
            ss[i] = model.signal(ts[i])?;
        }
        let base = Self::fit(&ts, &ss, c2, None)?;
        // Lawson's iteratively reweighted least squares towards the minimax (equal-ripple)
        // curve: w_i ← w_i·|r_i| / Σ w_j·|r_j|, each step a weighted LM from the previous one.
        let c2v = c2.c2();
        let t_scale = 0.5 * (u0 + u1);
        let mut p = [base.curve.a_m, base.curve.b_mk, ln(base.curve.c)];
        let mut w = [1.0 / N as f64; N];
        let mut best = (base.max_abs_residual_k, p);
        let mut iterations = base.iterations;
        for _ in 0..60 {
            let mut sum = 0.0;
            for i in 0..N {
                let Some((r, _)) = t_residual(c2v, &p, ts[i], ss[i]) else {
                    break;
                };
                w[i] *= r.abs();
                sum += w[i];
            }
            if !(sum > 0.0 && sum.is_finite()) {
                break;
            }
            for wi in w.iter_mut() {
                *wi /= sum;
            }
            let weighted = |q: &[f64; 3], i: usize| {
                let (r, g) = t_residual(c2v, q, ts[i], ss[i])?;
                let sw = crate::float::sqrt(w[i]);
                Some((r * sw, [g[0] * sw, g[1] * sw, g[2] * sw]))
            };
            let Ok((np, it)) = levenberg_marquardt(p, N, t_scale, &weighted) else {
                break;
            };
            iterations += it;
            p = np;
            let mut worst: f64 = 0.0;
            for i in 0..N {
                match t_residual(c2v, &p, ts[i], ss[i]) {
                    Some((r, _)) => worst = worst.max(r.abs()),
                    None => worst = f64::INFINITY,
                }
            }
            if worst < best.0 {
                best = (worst, p);
            }
        }
        let [a, b, lnc] = best.1;
        let curve = SakumaHattori::new(a, b, exp(lnc), c2).map_err(|_| Error::DegenerateFit {
            reason: "fit left the valid parameter range",
        })?;
        let mut sum2 = 0.0;
        for i in 0..N {
            let r = curve.temperature(ss[i])? - ts[i];
            sum2 += r * r;
        }
        Ok(FitReport {
            curve,
            rms_residual_k: crate::float::sqrt(sum2 / N as f64),
            max_abs_residual_k: best.0,
            iterations,
        })
    }
}

impl SignalModel for SakumaHattori {
    fn signal(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.0)
    }
    fn d_signal_dt(&self, temperature_k: f64) -> Result<f64> {
        Ok(self.signal_and_derivative(temperature_k)?.1)
    }
    fn signal_and_derivative(&self, temperature_k: f64) -> Result<(f64, f64)> {
        temperature("temperature_k", temperature_k)?;
        let d = self.a_m * temperature_k + self.b_mk;
        if !(d > 0.0) {
            return Err(Error::OutOfRange {
                arg: "temperature_k",
                value: temperature_k,
                range: "A*T + B > 0",
            });
        }
        let x = self.c2_mk / d;
        let em = expm1(x);
        let s = if em.is_finite() {
            self.c / em
        } else {
            self.c * exp(-x) / -expm1(-x)
        };
        let ds = s * (self.a_m * x / d) / -expm1(-x);
        Ok((s, if ds.is_finite() { ds } else { 0.0 }))
    }
    fn temperature(&self, signal: f64) -> Result<f64> {
        positive("signal", signal)?;
        let l = ln_1p(self.c / signal);
        let t = (self.c2_mk / l - self.b_mk) / self.a_m;
        if t > 0.0 && t.is_finite() {
            Ok(t)
        } else {
            Err(Error::NoSolution {
                what: "Sakuma-Hattori inverse gives T <= 0 K for this signal",
            })
        }
    }
}

/// Temperature residual T_curve(S) − T of parameters p = (A, B, ln C) at one calibration point,
/// with its gradient; `None` outside the curve's domain.
fn t_residual(c2v: f64, p: &[f64; 3], t: f64, s: f64) -> Option<(f64, [f64; 3])> {
    let q = exp(p[2]) / s;
    let l = ln_1p(q);
    if !(p[0] > 0.0 && l > 0.0 && l.is_finite() && q.is_finite()) {
        return None;
    }
    let tm = (c2v / l - p[1]) / p[0];
    let dl = -c2v / (p[0] * l * l) * q / (1.0 + q);
    Some((tm - t, [-tm / p[0], -1.0 / p[0], dl]))
}

/// Residual i and its gradient at parameters p, `None` outside the model's domain.
type Residual<'a> = dyn Fn(&[f64; 3], usize) -> Option<(f64, [f64; 3])> + 'a;

/// Levenberg–Marquardt with Marquardt's diagonal scaling for three parameters: `resid(p, i)`
/// gives residual i and its gradient, or `None` where p is outside the model's domain. Returns
/// the parameters and the iteration count. `resid` is a trait object so that the solver is
/// compiled once for its three callers (a cold path; this keeps the wasm module small).
/// The most calibration points [`SakumaHattori::fit`] accepts. Each Levenberg–Marquardt
/// iteration is O(n) and a fit takes at most 1000, so this bounds the time of any fit; a
/// typical fit at the limit took 35 ms natively (12–14 iterations, one run on a 2-core VM).
pub const MAX_FIT_POINTS: usize = 10_000;

const NOT_INCREASING: Error = Error::DegenerateFit {
    reason: "signals must increase strictly with temperature",
};
const REPEATED: Error = Error::DegenerateFit {
    reason: "repeated temperature",
};

/// Checks that the signals increase strictly with temperature over every pair of points (and
/// that no temperature repeats). Points given in increasing or decreasing order of temperature
/// take one O(n) pass over neighbours; otherwise the order of the points by temperature is
/// sorted (heapsort, O(n log n)) in `scratch` (the residuals buffer, overwritten later), or in
/// a temporary vector with the `alloc` feature.
fn check_increasing(t: &[f64], s: &[f64], scratch: Option<&mut [f64]>) -> Result<()> {
    let up = t.windows(2).all(|w| w[0] < w[1]);
    if up || t.windows(2).all(|w| w[0] > w[1]) {
        for (wt, ws) in t.windows(2).zip(s.windows(2)) {
            if !((wt[1] - wt[0]) * (ws[1] - ws[0]) > 0.0) {
                return Err(NOT_INCREASING);
            }
        }
        return Ok(());
    }
    match scratch {
        Some(idx) => sorted_check(t, s, idx),
        #[cfg(feature = "alloc")]
        None => {
            let mut idx = alloc::vec::Vec::new();
            if idx.try_reserve_exact(t.len()).is_err() {
                return Err(Error::OutOfRange {
                    arg: "temperatures_k length",
                    value: t.len() as f64,
                    range: "lengths the memory can hold",
                });
            }
            idx.resize(t.len(), 0.0);
            sorted_check(t, s, &mut idx)
        }
        #[cfg(not(feature = "alloc"))]
        None => Err(Error::Unsupported {
            what: "points not in order of temperature need a residuals buffer without the alloc \
                   feature",
        }),
    }
}

/// `check_increasing` for points in any order: sorts the indices 0..n by temperature in `idx`
/// (as f64, exact below 2^53) and checks neighbours.
fn sorted_check(t: &[f64], s: &[f64], idx: &mut [f64]) -> Result<()> {
    let n = t.len();
    let idx = match idx.get_mut(..n) {
        Some(i) => i,
        None => {
            return Err(Error::LengthMismatch {
                expected: n,
                got: idx.len(),
            })
        }
    };
    for (i, v) in idx.iter_mut().enumerate() {
        *v = i as f64;
    }
    let key = |v: f64| t.get(v as usize).copied().unwrap_or(f64::NAN);
    // heapsort (ascending) of idx by key
    let sift = |idx: &mut [f64], mut root: usize, end: usize| loop {
        let mut child = 2 * root + 1;
        if child >= end {
            break;
        }
        if child + 1 < end && key(idx[child]) < key(idx[child + 1]) {
            child += 1;
        }
        if key(idx[root]) < key(idx[child]) {
            idx.swap(root, child);
            root = child;
        } else {
            break;
        }
    };
    for start in (0..n / 2).rev() {
        sift(idx, start, n);
    }
    for end in (1..n).rev() {
        idx.swap(0, end);
        sift(idx, 0, end);
    }
    for w in idx.windows(2) {
        let (a, b) = (w[0] as usize, w[1] as usize);
        let (ta, tb) = (key(w[0]), key(w[1]));
        if ta == tb {
            return Err(REPEATED);
        }
        let (sa, sb) = (
            s.get(a).copied().unwrap_or(f64::NAN),
            s.get(b).copied().unwrap_or(f64::NAN),
        );
        if !(sb > sa) {
            return Err(NOT_INCREASING);
        }
    }
    Ok(())
}

fn levenberg_marquardt(
    p0: [f64; 3],
    n: usize,
    t_scale: f64,
    resid: &Residual<'_>,
) -> Result<([f64; 3], u32)> {
    let cost = |p: &[f64; 3]| -> f64 {
        let mut c = 0.0;
        for i in 0..n {
            match resid(p, i) {
                Some((r, _)) => c += r * r,
                None => return f64::INFINITY,
            }
        }
        c
    };
    let mut p = p0;
    let mut f = cost(&p);
    if !f.is_finite() {
        return Err(Error::DegenerateFit {
            reason: "starting curve outside the valid range",
        });
    }
    let mut lambda = 1e-3;
    let mut iterations = 0u32;
    while iterations < 500 {
        iterations += 1;
        if f <= 1e-30 * n as f64 {
            return Ok((p, iterations));
        }
        let mut jtj = [[0.0f64; 3]; 3];
        let mut jtr = [0.0f64; 3];
        for i in 0..n {
            let Some((r, j)) = resid(&p, i) else {
                return Err(Error::DegenerateFit {
                    reason: "fit left the valid parameter range",
                });
            };
            for a in 0..3 {
                jtr[a] += j[a] * r;
                for b in 0..3 {
                    jtj[a][b] += j[a] * j[b];
                }
            }
        }
        let mut stepped = false;
        for _ in 0..40 {
            let mut m = jtj;
            for (k, row) in m.iter_mut().enumerate() {
                row[k] += lambda * jtj[k][k].max(1e-300);
            }
            let Some(d) = solve3(m, [-jtr[0], -jtr[1], -jtr[2]]) else {
                return Err(Error::DegenerateFit {
                    reason: "singular normal equations",
                });
            };
            let np = [p[0] + d[0], p[1] + d[1], p[2] + d[2]];
            let nf = cost(&np);
            if nf.is_finite() && nf <= f {
                let rel = (f - nf) / f.max(1e-300);
                let small = d[0].abs() <= 1e-14 * p[0].abs()
                    && d[1].abs() <= 1e-14 * (p[0] / t_scale).abs()
                    && d[2].abs() <= 1e-14;
                p = np;
                f = nf;
                lambda = (lambda * 0.3).max(1e-12);
                stepped = true;
                if rel < 1e-14 || small {
                    return Ok((p, iterations));
                }
                break;
            }
            lambda *= 10.0;
        }
        if !stepped {
            // No downhill step even with heavy damping: at the minimum to rounding.
            return Ok((p, iterations));
        }
    }
    Err(Error::NotConverged {
        what: "Sakuma-Hattori least-squares fit",
    })
}

/// Solves a 3×3 system by Gaussian elimination with partial pivoting; `None` if singular.
#[allow(clippy::needless_range_loop)] // row operations index two rows of the same matrix
fn solve3(mut m: [[f64; 3]; 3], mut r: [f64; 3]) -> Option<[f64; 3]> {
    let scale = m
        .iter()
        .flat_map(|row| row.iter())
        .fold(0.0f64, |acc, v| acc.max(v.abs()));
    if !(scale > 0.0 && scale.is_finite()) {
        return None;
    }
    for col in 0..3 {
        let mut piv = col;
        for row in (col + 1)..3 {
            if m[row][col].abs() > m[piv][col].abs() {
                piv = row;
            }
        }
        if !(m[piv][col].abs() > 1e-300) {
            return None;
        }
        m.swap(col, piv);
        r.swap(col, piv);
        for row in (col + 1)..3 {
            let f = m[row][col] / m[col][col];
            for k in col..3 {
                m[row][k] -= f * m[col][k];
            }
            r[row] -= f * r[col];
        }
    }
    let mut x = [0.0; 3];
    for col in (0..3).rev() {
        let mut acc = r[col];
        for k in (col + 1)..3 {
            acc -= m[col][k] * x[k];
        }
        x[col] = acc / m[col][col];
    }
    if x.iter().all(|v| v.is_finite()) {
        Some(x)
    } else {
        None
    }
}

/// Largest interpolation error of a calibration curve against an exact model over a range:
/// max |T_curve(S_exact(T)) − T| on `n_points` temperatures evenly spaced in
/// [`t_min_k`, `t_max_k`]. Returns (max error in K, temperature where it occurs in K).
///
/// # Formula
/// ```text
/// ΔT(T) = T_curve(S_exact(T)) − T,   reported: max |ΔT| and its T
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositiveTemperature`; `TooFewPoints` for `n_points` < 2; `DegenerateFit`
/// for t_min ≥ t_max; errors of the models.
///
/// # Accuracy
/// Sampled maximum: the true maximum can lie between grid points; use a few hundred points.
///
/// # Examples
/// ```
/// use quantaband::thermometry::sakuma_hattori::{max_interpolation_error_k, SakumaHattori};
/// let sh = SakumaHattori::new(4e-6, 0.0, 1.0, Default::default()).unwrap();
/// let (e, _) = max_interpolation_error_k(&sh, &sh, 300.0, 900.0, 50).unwrap();
/// assert!(e < 1e-9);
/// ```
///
/// # References
/// Common practice, no source.
pub fn max_interpolation_error_k<C: SignalModel + ?Sized, M: SignalModel + ?Sized>(
    curve: &C,
    exact: &M,
    t_min_k: f64,
    t_max_k: f64,
    n_points: usize,
) -> Result<(f64, f64)> {
    temperature("t_min_k", t_min_k)?;
    temperature("t_max_k", t_max_k)?;
    if n_points < 2 {
        return Err(Error::TooFewPoints {
            needed: 2,
            got: n_points,
        });
    }
    if !(t_min_k < t_max_k) {
        return Err(Error::DegenerateFit {
            reason: "t_min_k must be below t_max_k",
        });
    }
    let mut worst = (0.0, t_min_k);
    for i in 0..n_points {
        let t = t_min_k + (t_max_k - t_min_k) * i as f64 / (n_points - 1) as f64;
        let e = (curve.temperature(exact.signal(t)?)? - t).abs();
        if e > worst.0 {
            worst = (e, t);
        }
    }
    Ok(worst)
}
