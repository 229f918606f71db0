//! Calibration transfer: how the uncertainties of the reference points of a Sakuma–Hattori
//! calibration (their temperatures and the instrument's signals) propagate through the fitted
//! curve into every temperature read with it — the covariance of the fitted parameters, and
//! for any reading the sensitivity ∂T/∂T_i and ∂T/∂S_i to each reference point.
//!
//! # Method
//! The curve is the least-squares solution of the temperature residuals
//! r_i(p) = T_curve(S_i; p) − T_i over p = (A, B′, ln C), B′ = A·T̄ + B (T̄ the mean reference
//! temperature; centring decorrelates A and B), found by [`SakumaHattori::fit`] and polished
//! with full Newton steps so that ∇Φ = Σ r_i ∇r_i = 0 holds to rounding. Differentiating that
//! stationarity condition (implicit function theorem) gives the exact first-order response of
//! the parameters to each datum:
//!
//! ```text
//! H = Σ_i (∇r_i ∇r_iᵀ + r_i ∇²r_i)                      (full Hessian of Φ/2)
//! ∂p/∂T_i = H⁻¹ ∇r_i
//! ∂p/∂S_i = −H⁻¹ (∂r_i/∂S_i · ∇r_i + r_i · ∇(∂r_i/∂S_i))
//! V_p = Σ_i ∂p/∂T_i ∂p/∂T_iᵀ u²(T_i) + ∂p/∂S_i ∂p/∂S_iᵀ u²(S_i)   (independent points)
//! reading T = T_curve(S; p):  ∂T/∂T_i = ∇_pT·∂p/∂T_i,  ∂T/∂S_i = ∇_pT·∂p/∂S_i
//! u²_cal(T) = Σ_i (∂T/∂T_i·u(T_i))² + (∂T/∂S_i·u(S_i))² = ∇_pTᵀ V_p ∇_pT
//! u_signal(T) = |∂T/∂S|·u(S)
//! ```
//!
//! With three points (or zero residuals) H = JᵀJ and ∂p/∂T_i = J⁻¹e_i. Because the curve
//! family is closed under a shift of temperature (T_i + δ is fitted by B → B − A·δ), a
//! reading moves by exactly δ when every reference temperature does: Σ_i ∂T/∂T_i = 1 (a
//! property the tests check).
//!
//! The interpolation error of the curve against the instrument's exact response model is a
//! separate, systematic contribution: [`super::sakuma_hattori::max_interpolation_error_k`] and
//! [`super::its90::FixedPointCurve::interpolation_errors`] report it. The fit is unweighted
//! (what [`SakumaHattori::fit`] does); points are treated as independent (a component common
//! to all reference temperatures, e.g. one reference thermometer, adds directly: Σ ∂T/∂T_i = 1).
//!
//! Cautions: a calibration uncertainty is only as good as the reference points' stated
//! uncertainties; ITS-90 fixed points give ITS-90 temperatures, not thermodynamic ones.
//!
//! # References
//! - JCGM 100:2008 §5.1, §5.2 (law of propagation), JCGM 102:2011 §6 (multivariate
//!   propagation through an implicit model) — from memory.
//! - F. Sakuma, S. Hattori (1982), see [`super::sakuma_hattori`].
#![forbid(unsafe_code)]

use super::model::SignalModel;
use super::sakuma_hattori::{FitReport, SakumaHattori};
use crate::constants::C2Convention;
use crate::error::{finite, positive, temperature};
use crate::float::{exp, ln, ln_1p, sqrt};
use crate::{Error, Result};

/// One reference point of a calibration: its temperature (K) and the instrument's signal
/// there (model units), each with its standard uncertainty.
///
/// # Examples
/// See [`CalibrationTransfer::fit`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct ReferencePoint {
    /// Reference temperature T_i, K.
    pub temperature_k: f64,
    /// Signal S_i at T_i, > 0.
    pub signal: f64,
    /// Standard uncertainty u(T_i), K (≥ 0).
    pub u_temperature_k: f64,
    /// Standard uncertainty u(S_i), signal units (≥ 0).
    pub u_signal: f64,
}

/// A temperature read with a calibrated curve and its uncertainty, returned by
/// [`CalibrationTransfer::reading`].
///
/// # Examples
/// See [`CalibrationTransfer::fit`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct CalibratedReading {
    /// T = T_curve(S), K.
    pub temperature_k: f64,
    /// Standard uncertainty from the calibration (reference temperatures and signals), K.
    pub u_calibration_k: f64,
    /// Standard uncertainty from the reading's own signal, K.
    pub u_signal_k: f64,
    /// √(u_cal² + u_signal²), K.
    pub combined_standard_uncertainty_k: f64,
    /// ∂T/∂S of the reading, K per signal unit.
    #[cfg_attr(feature = "serde", serde(rename = "dTdSignal"))]
    pub d_t_d_signal: f64,
    /// Σ_i ∂T/∂T_i (1 up to rounding; a check of the propagation).
    #[cfg_attr(feature = "serde", serde(rename = "dTdReferenceTemperaturesSum"))]
    pub sum_d_t_d_reference_temperatures: f64,
}

/// Temperature of the curve at signal s with its derivatives in p = (A, B′, ln C).
struct PointTerms {
    /// T_curve(s).
    t: f64,
    /// ∇_p T.
    g: [f64; 3],
    /// ∇²_p T.
    h: [[f64; 3]; 3],
    /// ∂T/∂s.
    dts: f64,
    /// ∇_p(∂T/∂s).
    dg_ds: [f64; 3],
}

/// T_curve(s; p) = T̄ + (c2/L − B′)/A, L = ln(1 + C/s), and derivatives.
fn terms(c2: f64, t_mid: f64, p: &[f64; 3], s: f64) -> Option<PointTerms> {
    let (a, bp) = (p[0], p[1]);
    let q = exp(p[2]) / s;
    let l = ln_1p(q);
    if !(a > 0.0 && l > 0.0 && l.is_finite() && q.is_finite()) {
        return None;
    }
    let w = q / (1.0 + q);
    let u = c2 / l - bp; // = A·(T − T̄)
    let t = t_mid + u / a;
    let dev = t - t_mid;
    let k2 = c2 * w / (a * l * l);
    // ∂/∂lnC of (w/L²) = w(1 − w)/L² − 2w²/L³
    let curv = w * (1.0 - w) / (l * l) - 2.0 * w * w / (l * l * l);
    let g = [-dev / a, -1.0 / a, -k2];
    let h = [
        [2.0 * dev / (a * a), 1.0 / (a * a), k2 / a],
        [1.0 / (a * a), 0.0, 0.0],
        [k2 / a, 0.0, -(c2 / a) * curv],
    ];
    let dts = k2 / s;
    let dg_ds = [-dts / a, 0.0, (c2 / (a * s)) * curv];
    Some(PointTerms {
        t,
        g,
        h,
        dts,
        dg_ds,
    })
}

/// The Hessian, gradient and sum of squares of the temperature residuals at parameters `p`
/// (`None` where a point has no model temperature). Out of line: [`CalibrationTransfer::fit`]
/// calls it twice.
#[allow(clippy::needless_range_loop)] // 3×3 matrix updates
#[inline(never)]
fn assemble(
    points: &[ReferencePoint],
    c2: f64,
    t_mid: f64,
    p: &[f64; 3],
) -> Option<([[f64; 3]; 3], [f64; 3], f64)> {
    let mut h = [[0.0; 3]; 3];
    let mut grad = [0.0; 3];
    let mut ss = 0.0;
    for pt in points {
        let k = terms(c2, t_mid, p, pt.signal)?;
        let r = k.t - pt.temperature_k;
        ss += r * r;
        for i in 0..3 {
            grad[i] += r * k.g[i];
            for j in 0..3 {
                h[i][j] += k.g[i] * k.g[j] + r * k.h[i][j];
            }
        }
    }
    Some((h, grad, ss))
}

/// Solves the 3×3 system m·x = b after symmetric diagonal scaling, by Gaussian elimination
/// with partial pivoting; `None` if singular.
#[allow(clippy::needless_range_loop)]
fn solve3_scaled(m: &[[f64; 3]; 3], b: &[f64; 3]) -> Option<[f64; 3]> {
    let mut d = [0.0; 3];
    for i in 0..3 {
        let v = m[i][i].abs();
        d[i] = if v > 0.0 && v.is_finite() {
            1.0 / sqrt(v)
        } else {
            1.0
        };
    }
    let mut a = [[0.0; 3]; 3];
    let mut r = [0.0; 3];
    for i in 0..3 {
        for j in 0..3 {
            a[i][j] = d[i] * m[i][j] * d[j];
        }
        r[i] = d[i] * b[i];
    }
    for col in 0..3 {
        let mut piv = col;
        for row in col + 1..3 {
            if a[row][col].abs() > a[piv][col].abs() {
                piv = row;
            }
        }
        if !(a[piv][col].abs() > 1e-14) {
            return None;
        }
        a.swap(col, piv);
        r.swap(col, piv);
        for row in col + 1..3 {
            let f = a[row][col] / a[col][col];
            for k in col..3 {
                a[row][k] -= f * a[col][k];
            }
            r[row] -= f * r[col];
        }
    }
    let mut x = [0.0; 3];
    for col in (0..3).rev() {
        let mut acc = r[col];
        for k in col + 1..3 {
            acc -= a[col][k] * x[k];
        }
        x[col] = acc / a[col][col];
    }
    let out = [x[0] * d[0], x[1] * d[1], x[2] * d[2]];
    if out.iter().all(|v| v.is_finite()) {
        Some(out)
    } else {
        None
    }
}

fn dot(a: &[f64; 3], b: &[f64; 3]) -> f64 {
    a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}

/// A Sakuma–Hattori calibration through reference points with uncertainties, ready to
/// propagate them into readings (see the module docs).
///
/// # Examples
/// See [`CalibrationTransfer::fit`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CalibrationTransfer<'a> {
    points: &'a [ReferencePoint],
    curve: SakumaHattori,
    c2: f64,
    t_mid: f64,
    /// (A, B′, ln C)
    p: [f64; 3],
    hessian: [[f64; 3]; 3],
    /// Covariance of (A, B′, ln C).
    cov: [[f64; 3]; 3],
    rms_residual_k: f64,
}

impl<'a> CalibrationTransfer<'a> {
    /// Fits a Sakuma–Hattori curve to `points` (≥ 3; exact through three) and propagates
    /// their uncertainties to the parameters.
    ///
    /// # Formula
    /// See the module docs.
    ///
    /// # Errors
    /// `TooFewPoints` (< 3); `NonFinite` / `NonPositiveTemperature` / `NonPositive` for a bad
    /// point, `OutOfRange` (range `[0, inf)`) for a negative or `NonFinite` for a non-finite
    /// uncertainty; the errors of [`SakumaHattori::fit`]; `DegenerateFit` when the Hessian is
    /// singular or the Newton polish does not settle at a minimum.
    ///
    /// # Accuracy
    /// First order in the point uncertainties (exact linearisation of the least-squares
    /// solution). Against mpmath (curve re-solved at 50 digits per perturbed datum, five-point
    /// differences, `tests/data/gen_gum.py`): ∂T/∂T_i, ∂T/∂S_i, u_cal and the parameter
    /// covariance within 3.3e-13 (relative to the largest entry) for three ITS-90 fixed points
    /// and a seven-point least-squares fit; Σ ∂T/∂T_i = 1 to 4.2e-13·max(1, Σ|∂T/∂T_i|) over
    /// 180 readings (`tests/gum_calibration.rs`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
    /// use quantaband::thermometry::model::SignalModel;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let truth = SakumaHattori::new(6.5e-7, 2e-9, 1e9, Default::default()).unwrap();
    /// // three blackbody points, 50 mK standard uncertainty each, signals to 0.01 %
    /// let pts = [600.0, 800.0, 1000.0].map(|t| {
    ///     let s = truth.signal(t).unwrap();
    ///     ReferencePoint { temperature_k: t, signal: s, u_temperature_k: 0.05, u_signal: 1e-4 * s }
    /// });
    /// let cal = CalibrationTransfer::fit(&pts, Default::default()).unwrap();
    /// let mut w = [0.0; 3];
    /// let r = cal.reading(truth.signal(700.0).unwrap(), 0.0, Some(&mut w), None).unwrap();
    /// assert!((r.temperature_k - 700.0).abs() < 1e-6);
    /// assert!((w.iter().sum::<f64>() - 1.0).abs() < 1e-9); // Σ ∂T/∂T_i = 1
    /// assert!(r.u_calibration_k > 0.03 && r.u_calibration_k < 0.2);
    /// ```
    ///
    /// # References
    /// See the module docs.
    #[allow(clippy::needless_range_loop)] // 3×3 matrix updates
    pub fn fit(points: &'a [ReferencePoint], c2: C2Convention) -> Result<Self> {
        let n = points.len();
        if n < 3 {
            return Err(Error::TooFewPoints { needed: 3, got: n });
        }
        let mut t_sum = 0.0;
        for p in points {
            temperature("temperature_k", p.temperature_k)?;
            positive("signal", p.signal)?;
            for (arg, u) in [
                ("u_temperature_k", p.u_temperature_k),
                ("u_signal", p.u_signal),
            ] {
                finite(arg, u)?;
                if u < 0.0 {
                    return Err(Error::OutOfRange {
                        arg,
                        value: u,
                        range: "[0, inf)",
                    });
                }
            }
            t_sum += p.temperature_k;
        }
        let t_mid = t_sum / n as f64;
        let fit = fit_points(points, c2)?;
        let c2v = c2.c2();
        let sh = fit.curve;
        let mut p = [sh.a_m(), sh.a_m() * t_mid + sh.b_mk(), ln(sh.c())];
        let degenerate = || Error::DegenerateFit {
            reason: "the calibration's Hessian is singular or not at a minimum",
        };
        // Newton polish of the stationarity condition.
        let (mut h, mut grad, mut ss) = assemble(points, c2v, t_mid, &p).ok_or_else(degenerate)?;
        for _ in 0..8 {
            let step = solve3_scaled(&h, &grad).ok_or_else(degenerate)?;
            let np = [p[0] - step[0], p[1] - step[1], p[2] - step[2]];
            let Some((nh, ng, nss)) = assemble(points, c2v, t_mid, &np) else {
                break;
            };
            if !(nss <= ss * (1.0 + 1e-12) + 1e-30) {
                break;
            }
            let small = step[0].abs() <= 1e-15 * p[0].abs()
                && step[1].abs() <= 1e-15 * p[1].abs().max(p[0] * t_mid)
                && step[2].abs() <= 1e-15 * p[2].abs().max(1.0);
            p = np;
            h = nh;
            grad = ng;
            ss = nss;
            if small {
                break;
            }
        }
        // At a minimum H is positive definite.
        if !positive_definite3(&h) {
            return Err(degenerate());
        }
        let curve = SakumaHattori::new(p[0], p[1] - p[0] * t_mid, exp(p[2]), c2)
            .map_err(|_| degenerate())?;
        let mut cal = CalibrationTransfer {
            points,
            curve,
            c2: c2v,
            t_mid,
            p,
            hessian: h,
            cov: [[0.0; 3]; 3],
            rms_residual_k: sqrt(ss / n as f64),
        };
        let mut cov = [[0.0; 3]; 3];
        for (i, pt) in points.iter().enumerate() {
            let (dt, ds) = cal.parameter_response(i).ok_or_else(degenerate)?;
            let (ut, us) = (pt.u_temperature_k, pt.u_signal);
            for a in 0..3 {
                for b in 0..3 {
                    cov[a][b] += dt[a] * dt[b] * ut * ut + ds[a] * ds[b] * us * us;
                }
            }
        }
        cal.cov = cov;
        Ok(cal)
    }

    /// (∂p/∂T_i, ∂p/∂S_i) for point i, p = (A, B′, ln C).
    fn parameter_response(&self, i: usize) -> Option<([f64; 3], [f64; 3])> {
        let pt = self.points.get(i)?;
        let k = terms(self.c2, self.t_mid, &self.p, pt.signal)?;
        let r = k.t - pt.temperature_k;
        let dt = solve3_scaled(&self.hessian, &k.g)?;
        let b = [
            -(k.dts * k.g[0] + r * k.dg_ds[0]),
            -(k.dts * k.g[1] + r * k.dg_ds[1]),
            -(k.dts * k.g[2] + r * k.dg_ds[2]),
        ];
        let ds = solve3_scaled(&self.hessian, &b)?;
        Some((dt, ds))
    }

    /// The fitted curve.
    ///
    /// # Examples
    /// See [`CalibrationTransfer::fit`].
    pub fn curve(&self) -> &SakumaHattori {
        &self.curve
    }

    /// Root-mean-square temperature residual of the fit, K (0 to rounding for three points).
    ///
    /// # Examples
    /// See [`CalibrationTransfer::fit`].
    pub fn rms_residual_k(&self) -> f64 {
        self.rms_residual_k
    }

    /// Covariance matrix of the curve parameters (A in m, B in m·K, C in signal units), from
    /// the reference points' uncertainties.
    ///
    /// # Formula
    /// ```text
    /// V_(A,B,C) = J V_(A,B′,lnC) Jᵀ,   B = B′ − A·T̄,  C = exp(ln C)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// First order (see [`CalibrationTransfer::fit`]).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
    /// use quantaband::thermometry::model::SignalModel;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let truth = SakumaHattori::new(6.5e-7, 2e-9, 1e9, Default::default()).unwrap();
    /// let pts = [600.0, 800.0, 1000.0].map(|t| ReferencePoint { temperature_k: t,
    ///     signal: truth.signal(t).unwrap(), u_temperature_k: 0.05, u_signal: 0.0 });
    /// let cal = CalibrationTransfer::fit(&pts, Default::default()).unwrap();
    /// let v = cal.parameter_covariance();
    /// assert!(v[0][0] > 0.0 && (v[0][1] - v[1][0]).abs() <= 1e-12 * v[0][1].abs());
    /// ```
    ///
    /// # References
    /// JCGM 100:2008 §5.2 (covariances).
    pub fn parameter_covariance(&self) -> [[f64; 3]; 3] {
        let c = exp(self.p[2]);
        // rows: ∂(A, B, C)/∂(A, B′, lnC)
        let j = [[1.0, 0.0, 0.0], [-self.t_mid, 1.0, 0.0], [0.0, 0.0, c]];
        let mut out = [[0.0; 3]; 3];
        for a in 0..3 {
            for b in 0..3 {
                let mut s = 0.0;
                for k in 0..3 {
                    for l in 0..3 {
                        s += j[a][k] * self.cov[k][l] * j[b][l];
                    }
                }
                out[a][b] = s;
            }
        }
        out
    }

    /// Correlation matrix of the curve parameters (A, B, C) (zeros where a variance is 0).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::calibration_transfer::{CalibrationTransfer, ReferencePoint};
    /// use quantaband::thermometry::model::SignalModel;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let truth = SakumaHattori::new(6.5e-7, 2e-9, 1e9, Default::default()).unwrap();
    /// let pts = [600.0, 800.0, 1000.0].map(|t| ReferencePoint { temperature_k: t,
    ///     signal: truth.signal(t).unwrap(), u_temperature_k: 0.05, u_signal: 0.0 });
    /// let r = CalibrationTransfer::fit(&pts, Default::default()).unwrap().parameter_correlation();
    /// assert!((r[0][0] - 1.0).abs() < 1e-12 && r[0][1].abs() <= 1.0 + 1e-12);
    /// ```
    pub fn parameter_correlation(&self) -> [[f64; 3]; 3] {
        let v = self.parameter_covariance();
        let mut r = [[0.0; 3]; 3];
        for a in 0..3 {
            for b in 0..3 {
                let d = sqrt(v[a][a] * v[b][b]);
                r[a][b] = if d > 0.0 { v[a][b] / d } else { 0.0 };
            }
        }
        r
    }

    /// A temperature read with the curve at `signal`, with the uncertainty the calibration
    /// transfers to it and that of the reading's own signal (`u_signal`); optionally the
    /// sensitivities ∂T/∂T_i and ∂T/∂S_i to each reference point (slices as long as the
    /// points).
    ///
    /// # Formula
    /// See the module docs.
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` for the signal, `OutOfRange` / `NonFinite` for `u_signal`;
    /// `NoSolution` when the curve gives no positive temperature; `LengthMismatch` for output
    /// slices of the wrong length; `DegenerateFit` if the stored Hessian became singular.
    ///
    /// # Accuracy
    /// See [`CalibrationTransfer::fit`].
    ///
    /// # Examples
    /// See [`CalibrationTransfer::fit`].
    ///
    /// # References
    /// See the module docs.
    pub fn reading(
        &self,
        signal: f64,
        u_signal: f64,
        d_t_d_reference_temperatures: Option<&mut [f64]>,
        d_t_d_reference_signals: Option<&mut [f64]>,
    ) -> Result<CalibratedReading> {
        positive("signal", signal)?;
        finite("u_signal", u_signal)?;
        if u_signal < 0.0 {
            return Err(Error::OutOfRange {
                arg: "u_signal",
                value: u_signal,
                range: "[0, inf)",
            });
        }
        let n = self.points.len();
        for out in [&d_t_d_reference_temperatures, &d_t_d_reference_signals]
            .into_iter()
            .flatten()
        {
            if out.len() != n {
                return Err(Error::LengthMismatch {
                    expected: n,
                    got: out.len(),
                });
            }
        }
        let t = self.curve.temperature(signal)?;
        let k = terms(self.c2, self.t_mid, &self.p, signal).ok_or(Error::NoSolution {
            what: "the calibration curve gives no temperature for this signal",
        })?;
        let mut var = 0.0;
        let mut sum = 0.0;
        let mut dtt = d_t_d_reference_temperatures;
        let mut dts = d_t_d_reference_signals;
        for i in 0..n {
            let (dp_dt, dp_ds) = self.parameter_response(i).ok_or(Error::DegenerateFit {
                reason: "the calibration's Hessian is singular",
            })?;
            let a = dot(&k.g, &dp_dt);
            let b = dot(&k.g, &dp_ds);
            let pt = &self.points[i];
            var += (a * pt.u_temperature_k) * (a * pt.u_temperature_k)
                + (b * pt.u_signal) * (b * pt.u_signal);
            sum += a;
            if let Some(o) = dtt.as_deref_mut() {
                o[i] = a;
            }
            if let Some(o) = dts.as_deref_mut() {
                o[i] = b;
            }
        }
        let u_cal = sqrt(var);
        let u_sig = (k.dts * u_signal).abs();
        Ok(CalibratedReading {
            temperature_k: t,
            u_calibration_k: u_cal,
            u_signal_k: u_sig,
            combined_standard_uncertainty_k: sqrt(u_cal * u_cal + u_sig * u_sig),
            d_t_d_signal: k.dts,
            sum_d_t_d_reference_temperatures: sum,
        })
    }
}

/// [`SakumaHattori::fit`] on the temperatures and signals of `points` (copied to stack
/// buffers in chunks of up to 64 points; more points are first fitted on an evenly spread
/// subset of 64 and then polished on all by the caller's Newton steps).
fn fit_points(points: &[ReferencePoint], c2: C2Convention) -> Result<FitReport> {
    const N: usize = 64;
    let n = points.len();
    let m = n.min(N);
    let mut t = [0.0; N];
    let mut s = [0.0; N];
    for k in 0..m {
        // evenly spread subset (all points when n ≤ 64)
        let i = if n <= N { k } else { k * (n - 1) / (m - 1) };
        t[k] = points[i].temperature_k;
        s[k] = points[i].signal;
    }
    SakumaHattori::fit(&t[..m], &s[..m], c2, None)
}

/// Whether a symmetric 3×3 matrix is positive definite (Cholesky after diagonal scaling).
#[allow(clippy::needless_range_loop)]
fn positive_definite3(m: &[[f64; 3]; 3]) -> bool {
    let mut d = [0.0; 3];
    for i in 0..3 {
        if !(m[i][i] > 0.0 && m[i][i].is_finite()) {
            return false;
        }
        d[i] = 1.0 / sqrt(m[i][i]);
    }
    let mut l = [[0.0; 3]; 3];
    for i in 0..3 {
        for j in 0..=i {
            let mut s = d[i] * m[i][j] * d[j];
            for k in 0..j {
                s -= l[i][k] * l[j][k];
            }
            if i == j {
                if !(s > 1e-14) {
                    return false;
                }
                l[i][i] = sqrt(s);
            } else {
                l[i][j] = s / l[j][j];
            }
        }
    }
    true
}
