#!/usr/bin/env python3
"""Reference values for the uncertainty tests (tests/gum_*.rs): Student's t, the GUM budget of
the grey measurement equation with a window and correlated inputs, the sensitivities of the
ITS-90 ratio temperature, the calibration transfer of a Sakuma-Hattori curve, and the exact
output distributions of two JCGM 101 section 9.2 additive examples.

Oracle: mpmath 1.3.0 at 50 significant digits. Nothing here reuses the crate's algorithms:
  * Student's t: distribution function by mpmath.quad of the density (normalised with
    mpmath.gamma), cross-checked against mpmath.betainc; quantiles by mpmath.findroot on it
    (the crate uses a continued fraction, Fisher's expansion and a safeguarded Newton in ln t);
  * temperatures by mpmath.findroot on the defining equations, sensitivity coefficients by
    numerical differentiation (mpmath.diff) of those solves (the crate differentiates
    implicitly), combined uncertainty by the explicit double sum of JCGM 100 eq. (16);
  * calibration transfer: the curve is re-solved (three points: findroot through them; least
    squares: findroot on the normal equations) for every perturbed datum, and the reading's
    derivatives are numerical (the crate inverts the Hessian of the fit);
  * JCGM 101 examples: exact distribution functions (Irwin-Hall sum of uniforms; quadrature
    of the normal distribution function over a rectangle) and findroot for the quantiles.
Constants: CODATA 2018 exact h, c, k (c2 = hc/k, c1L = 2hc^2); ITS-90 c2 = 0.014388 m K and
fixed points from H. Preston-Thomas, Metrologia 27, 3 (1990), Table 1.

Run:  python3 tests/data/gen_gum.py   (writes tests/data/gum_reference.json, ~1 min)
"""
import json
import math
import os

import mpmath as mp

mp.mp.dps = 50

H = mp.mpf("6.62607015e-34")
C = mp.mpf("299792458")
K = mp.mpf("1.380649e-23")
C1L = 2 * H * C**2
C2_CODATA = H * C / K
C2_ITS90 = mp.mpf("0.014388")
FIXED = {"zinc": mp.mpf("692.677"), "aluminium": mp.mpf("933.473"),
         "silver": mp.mpf("1234.93"), "gold": mp.mpf("1337.33"), "copper": mp.mpf("1357.77"),
         "indium": mp.mpf("429.7485"), "tin": mp.mpf("505.078")}


def f(x):
    return float(x)


# --------------------------------------------------------------------------------------------
# Student's t
def t_density_fn(nu):
    """The density of Student's t with nu degrees of freedom (normalisation by mpmath.gamma,
    evaluated once)."""
    nu = mp.mpf(nu)
    norm = mp.gamma((nu + 1) / 2) / (mp.sqrt(nu * mp.pi) * mp.gamma(nu / 2))
    return lambda t: norm * (1 + t * t / nu) ** (-(nu + 1) / 2)


def t_density(t, nu):
    return t_density_fn(nu)(t)


def t_upper_tail(t, nu):
    """P(T > t) for t >= 0: quadrature of the density, split at a few scales."""
    t = mp.mpf(t)
    if nu == "inf":
        return mp.erfc(t / mp.sqrt(2)) / 2
    # split points so that tanh-sinh sees smooth pieces of the tail: steps growing
    # geometrically from h, half the length over which the log-density falls by 1 at t
    nu_ = mp.mpf(nu)
    h = min(mp.mpf(1), (nu_ + t * t) / ((nu_ + 1) * t) if t > 0 else mp.mpf(1)) / 2
    pts = [t] + [t + h * 8**j for j in range(0, 21)] + [mp.inf]
    # The integrand is scaled to 1 at t (mpmath's quadrature error control misjudges
    # integrands of size 1e-170) and integrated at 80 digits.
    with mp.workdps(80):
        d0 = t_density_fn(nu_)(t)
        ratio = lambda s: ((nu_ + s * s) / (nu_ + t * t)) ** (-(nu_ + 1) / 2)
        q = +(d0 * mp.quad(ratio, pts))
    # cross-check against the incomplete beta function (where mpmath's series converges)
    nu_ = mp.mpf(nu)
    try:
        qb = mp.betainc(nu_ / 2, mp.mpf(1) / 2, 0, nu_ / (nu_ + t * t), regularized=True) / 2
        assert abs(q / qb - 1) < mp.mpf("1e-20"), (t, nu, q, qb)
    except mp.libmp.libhyper.NoConvergence:
        pass
    return q


def t_quantile_upper(q, nu):
    """t >= 0 with P(T > t) = q."""
    q = mp.mpf(q)
    if nu == "inf":
        return mp.sqrt(2) * mp.erfinv(1 - 2 * q)
    nu_ = mp.mpf(nu)
    # start: from the incomplete-beta inverse by bisection on a coarse grid, then findroot
    g = lambda t: t_upper_tail_fast(t, nu_) - q
    lo, hi = mp.mpf(0), mp.mpf(1)
    while g(hi) > 0:
        hi *= 2
    for _ in range(60):
        mid = (lo + hi) / 2
        if g(mid) > 0:
            lo = mid
        else:
            hi = mid
    t0 = (lo + hi) / 2
    try:
        # incomplete beta (hypergeometric series) for the root, the density's quadrature to
        # confirm it at the root
        t = mp.findroot(lambda t: mp.log(t_upper_tail_beta(t, nu_)) - mp.log(q), t0)
        assert abs(t_upper_tail(t, nu) / q - 1) < mp.mpf("1e-20"), (nu, q, t)
    except mp.libmp.libhyper.NoConvergence:
        t = mp.findroot(lambda t: mp.log(t_upper_tail(t, nu)) - mp.log(q), t0)
    return t


def t_upper_tail_beta(t, nu_):
    return mp.betainc(nu_ / 2, mp.mpf(1) / 2, 0, nu_ / (nu_ + t * t), regularized=True) / 2


def t_upper_tail_fast(t, nu_):
    """For bracketing only: incomplete beta at low precision, the density's quadrature where
    mpmath's series does not converge."""
    with mp.workdps(20):
        try:
            return mp.betainc(nu_ / 2, mp.mpf(1) / 2, 0, nu_ / (nu_ + t * t), regularized=True) / 2
        except mp.libmp.libhyper.NoConvergence:
            return mp.quad(t_density_fn(nu_), [t, t + 1, t + 4, mp.inf])


def student_t_cases():
    nus = ["0.5", "1", "1.5", "2", "3", "4.5", "5", "7", "10", "16", "30", "100", "250", "1000",
           "1e4", "1e5", "1e6", "1e9", "inf"]
    ps = ["0.6827", "0.9", "0.95", "0.9545", "0.99", "0.9973", "0.9999", "0.999999"]
    quantiles = []
    for nu in nus:
        for p in ps:
            # the f64 nearest p is the input the crate sees: 1 − p is formed from it exactly
            q = (1 - mp.mpf(float(p))) / 2
            if nu == "0.5" and mp.mpf(p) > mp.mpf("0.9999"):
                continue  # beyond 1e30
            t = t_quantile_upper(q, nu)
            quantiles.append({"nu": nu, "coverage_probability": p, "k": f(t)})
    cdfs = []
    for nu in ["0.7", "1", "2.5", "9", "60", "600", "5000", "1e7", "inf"]:
        for t in ["0.05", "0.8", "1.7", "2.2", "4", "9", "40"]:
            q = t_upper_tail(mp.mpf(t), nu)
            cdfs.append({"nu": nu, "t": t, "upper_tail": f(q)})
    return {"quantiles": quantiles, "upper_tails": cdfs}


# --------------------------------------------------------------------------------------------
# Measurement equation with a window, correlated inputs
SH = {"a_m": "1.0e-5", "b_mk": "1.8e-4", "c": "1.0e6"}
MEAS = {"object_temperature_k": "420", "emissivity": "0.85", "reflected_temperature_k": "300",
        "path_transmittance": "0.97", "path_temperature_k": "295",
        "window": {"transmittance": "0.88", "reflectance": "0.05", "temperature_k": "310",
                   "reflected_temperature_k": "305"}}
# standard uncertainties (signal relative), degrees of freedom ("inf" = infinite)
U = ["0.002", "0.02", "4", "0.01", "3", "0.01", "0.01", "2", "5"]
NU = ["9", "inf", "inf", "inf", "inf", "inf", "inf", "inf", "inf"]
# correlations (0-based input indices): T_refl-T_path, T_refl-T_w, T_path-T_w, tau_w-rho_w
CORR = [(2, 4, "0.8"), (2, 7, "0.5"), (4, 7, "0.6"), (5, 6, "-0.4")]


def sh_signal(t):
    a, b, c = (mp.mpf(SH[k]) for k in ("a_m", "b_mk", "c"))
    return c / mp.expm1(C2_CODATA / (a * t + b))


def point_signal(lam):
    return lambda t: C1L / lam**5 / mp.expm1(C2_CODATA / (lam * t))


def measurement(S, t, e, tr, tau, tp, tw, rw, tww, ti):
    scene = tau * (e * S(t) + (1 - e) * S(tr)) + (1 - tau) * S(tp)
    return tw * scene + rw * S(ti) + (1 - tw - rw) * S(tww)


def measurement_case(S, name):
    m = MEAS
    w = m["window"]
    x = [None, mp.mpf(m["emissivity"]), mp.mpf(m["reflected_temperature_k"]),
         mp.mpf(m["path_transmittance"]), mp.mpf(m["path_temperature_k"]),
         mp.mpf(w["transmittance"]), mp.mpf(w["reflectance"]), mp.mpf(w["temperature_k"]),
         mp.mpf(w["reflected_temperature_k"])]
    t0 = mp.mpf(m["object_temperature_k"])
    x[0] = measurement(S, t0, *x[1:])

    def tobj(args):
        return mp.findroot(lambda t: measurement(S, t, *args[1:]) - args[0], t0)

    sens = []
    for i in range(9):
        def g(v, i=i):
            a = list(x)
            a[i] = v
            return tobj(a)
        sens.append(mp.diff(g, x[i]))
    u = [mp.mpf(U[0]) * x[0]] + [mp.mpf(v) for v in U[1:]]
    r = [[mp.mpf(1) if i == j else mp.mpf(0) for j in range(9)] for i in range(9)]
    for i, j, v in CORR:
        r[i][j] = r[j][i] = mp.mpf(v)
    var = mp.mpf(0)
    for i in range(9):
        for j in range(9):
            var += sens[i] * u[i] * r[i][j] * sens[j] * u[j]
    uc = mp.sqrt(var)
    # Welch-Satterthwaite: only the (uncorrelated) signal has finite degrees of freedom
    den = sum((sens[i] * u[i]) ** 4 / mp.mpf(NU[i]) for i in range(9) if NU[i] != "inf")
    nu_eff = uc**4 / den
    nu_used = mp.floor(nu_eff)
    k = t_quantile_upper((1 - mp.mpf("0.95")) / 2, nu_used)
    shares = []
    for i in range(9):
        row = sum(r[i][j] * sens[j] * u[j] for j in range(9))
        shares.append(sens[i] * u[i] * row / var)
    return {"model": name, "signal": f(x[0]), "inputs": MEAS, "u": U, "nu": NU,
            "correlations": [[i, j, v] for i, j, v in CORR],
            "sensitivities": [f(s) for s in sens], "standard_uncertainties": [f(v) for v in u],
            "combined_k": f(uc), "effective_dof": f(nu_eff), "coverage_factor": f(k),
            "expanded_k": f(k * uc), "shares": [f(s) for s in shares],
            "temperature_k": f(t0)}


# --------------------------------------------------------------------------------------------
# ITS-90 ratio temperature sensitivities
def ratio_cases():
    out = []
    for ratio, lam, ref, c2n in [("10", "650e-9", "gold", "its90"), ("0.4", "650e-9", "silver", "its90"),
                                 ("250", "900e-9", "copper", "its90"), ("3", "1.6e-6", "gold", "codata"),
                                 ("1e-3", "650e-9", "silver", "its90")]:
        c2 = C2_ITS90 if c2n == "its90" else C2_CODATA
        r, l, tx = mp.mpf(ratio), mp.mpf(lam), FIXED[ref]

        def solve(rr, ll, txx):
            eq = lambda t: mp.expm1(c2 / (ll * txx)) / mp.expm1(c2 / (ll * t)) - rr
            return mp.findroot(eq, txx * (1 + mp.log(rr) * ll * txx / c2 / 2))

        t = solve(r, l, tx)
        out.append({"ratio": ratio, "wavelength_m": lam, "reference": ref, "c2": c2n,
                    "temperature_k": f(t),
                    "d_t_d_ratio": f(mp.diff(lambda v: solve(v, l, tx), r)),
                    "d_t_d_reference_temperature": f(mp.diff(lambda v: solve(r, l, v), tx)),
                    "d_t_d_wavelength": f(mp.diff(lambda v: solve(r, v, tx), l))})
    return out


# --------------------------------------------------------------------------------------------
# Calibration transfer
def sh_curve_temperature(p, s, c2):
    a, b, c = p
    return (c2 / mp.log(1 + c / s) - b) / a


def solve_three(ts, ss, c2, start):
    """Sakuma-Hattori (A, B, C) exactly through three points."""
    a0, b0, c0 = start

    def eqs(da, db, dc):
        p = (a0 * (1 + da), b0 + a0 * db, c0 * mp.exp(dc))
        return [sh_curve_temperature(p, s, c2) - t for t, s in zip(ts, ss)]

    d = mp.findroot(eqs, (mp.mpf(0), mp.mpf(0), mp.mpf(0)))
    return (a0 * (1 + d[0]), b0 + a0 * d[1], c0 * mp.exp(d[2]))


def solve_least_squares(ts, ss, c2, start):
    """Unweighted least squares in temperature: findroot on the three normal equations
    sum r_i dr_i/dq = 0 (q = relative changes of A, B/A, ln C from the start)."""
    a0, b0, c0 = start

    def grad(da, db, dc):
        a, b, c = a0 * (1 + da), b0 + a0 * db, c0 * mp.exp(dc)
        g = [mp.mpf(0)] * 3
        for t, s in zip(ts, ss):
            l = mp.log(1 + c / s)
            tc = (c2 / l - b) / a
            r = tc - t
            dq = [-tc * a0 / a, -a0 / a, -c2 / (a * l * l) * (c / s) / (1 + c / s)]
            for k in range(3):
                g[k] += r * dq[k]
        return g

    d = mp.findroot(grad, (mp.mpf(0), mp.mpf(0), mp.mpf(0)))
    return (a0 * (1 + d[0]), b0 + a0 * d[1], c0 * mp.exp(d[2]))


def calibration_case(name, ts, ss, uts, uss, c2, start, readings, solver):
    """Derivatives of each reading by the five-point central difference of re-solved curves
    (relative step 1e-12 at 50 digits: truncation ~1e-48, rounding ~1e-38)."""
    ts = [mp.mpf(t) for t in ts]
    p0 = solver(ts, ss, c2, start)
    n = len(ts)
    dtt = [[None] * n for _ in readings]
    dts = [[None] * n for _ in readings]
    cov = [[mp.mpf(0)] * 3 for _ in range(3)]
    stencil = lambda v, h: (v[0] - 8 * v[1] + 8 * v[2] - v[3]) / (12 * h)
    for i in range(n):
        for which, base, u in (("t", ts[i], mp.mpf(uts[i])), ("s", ss[i], uss[i])):
            h = base * mp.mpf("1e-12")
            vals, params = [], []
            for m in (-2, -1, 1, 2):
                t2, s2 = list(ts), list(ss)
                if which == "t":
                    t2[i] = base + m * h
                else:
                    s2[i] = base + m * h
                p = solver(t2, s2, c2, p0)
                params.append(p)
                vals.append([sh_curve_temperature(p, sr, c2) for sr in readings])
            for k in range(len(readings)):
                d = stencil([v[k] for v in vals], h)
                (dtt if which == "t" else dts)[k][i] = d
            dp = [stencil([p[a] for p in params], h) for a in range(3)]
            for a in range(3):
                for b in range(3):
                    cov[a][b] += dp[a] * dp[b] * u * u
    out_readings = []
    for k, sr in enumerate(readings):
        ucal = mp.sqrt(sum((a * mp.mpf(u)) ** 2 for a, u in zip(dtt[k], uts)) +
                       sum((b * u) ** 2 for b, u in zip(dts[k], uss)))
        out_readings.append({"signal": f(sr), "temperature_k": f(sh_curve_temperature(p0, sr, c2)),
                             "d_t_d_reference_temperatures": [f(v) for v in dtt[k]],
                             "d_t_d_reference_signals": [f(v) for v in dts[k]],
                             "u_calibration_k": f(ucal)})
    return {"name": name, "c2": "its90" if c2 == C2_ITS90 else "codata",
            "points": [{"temperature_k": f(t), "signal": f(s), "u_temperature_k": f(mp.mpf(ut)),
                        "u_signal": f(us)} for t, s, ut, us in zip(ts, ss, uts, uss)],
            "curve": {"a_m": f(p0[0]), "b_mk": f(p0[1]), "c": f(p0[2])},
            "parameter_covariance": [[f(v) for v in row] for row in cov],
            "readings": out_readings}


def calibration_cases():
    out = []
    # (1) three ITS-90 fixed points, single-wavelength instrument at 650 nm (ITS-90 c2)
    lam = mp.mpf("650e-9")
    S = lambda t: C1L / lam**5 / mp.expm1(C2_ITS90 / (lam * t))
    ts = [FIXED["zinc"], FIXED["aluminium"], FIXED["copper"]]
    ss = [S(t) for t in ts]
    uts = ["0.003", "0.005", "0.02"]
    uss = [s * mp.mpf("2e-4") for s in ss]
    readings = [S(mp.mpf(t)) for t in ("800", "1100", "1500", "2500")]
    out.append(calibration_case("fixed_points_650nm", ts, ss, uts, uss, C2_ITS90,
                                (lam, mp.mpf("1e-12"), C1L / lam**5), readings, solve_three))
    # (2) least squares through seven blackbody points with residuals (scatter in T)
    a, b, c = mp.mpf("3.9e-6"), mp.mpf("2e-8"), mp.mpf("5e4")
    S2 = lambda t: c / mp.expm1(C2_CODATA / (a * t + b))
    tt = [mp.mpf(t) for t in ("400", "500", "600", "700", "800", "900", "1000")]
    scatter = [mp.mpf(v) for v in ("0.03", "-0.02", "0.01", "-0.04", "0.02", "0.015", "-0.01")]
    ss2 = [S2(t + d) for t, d in zip(tt, scatter)]  # signals of slightly different temperatures
    uts2 = ["0.02"] * 7
    uss2 = [s * mp.mpf("1e-4") for s in ss2]
    readings2 = [S2(mp.mpf(t)) for t in ("450", "750", "1100")]
    out.append(calibration_case("least_squares_7", tt, ss2, uts2, uss2, C2_CODATA, (a, b, c),
                                readings2, solve_least_squares))
    return out


# --------------------------------------------------------------------------------------------
# JCGM 101 section 9.2 additive model: exact 95 % probabilistically symmetric end points
def jcgm101_cases():
    # 9.2.3: four rectangular inputs with u = 1: Y = 2 sqrt3 S - 4 sqrt3, S Irwin-Hall(4)
    def ih_cdf(x, n=4):
        return sum((-1) ** k * mp.binomial(n, k) * (x - k) ** n
                   for k in range(int(mp.floor(x)) + 1)) / mp.factorial(n)
    s = mp.findroot(lambda x: ih_cdf(x) - mp.mpf("0.975"), 3)
    rect4 = 2 * mp.sqrt(3) * s - 4 * mp.sqrt(3)
    # 9.2.4: three N(0,1) and one rectangular with u = 10: Y = R(-10 sqrt3, 10 sqrt3) + N(0, 3)
    a, sig = 10 * mp.sqrt(3), mp.sqrt(3)
    F = lambda y: mp.quad(lambda v: mp.ncdf((y - v) / sig), [-a, 0, a]) / (2 * a)
    mixed = mp.findroot(lambda y: F(y) - mp.mpf("0.975"), 17)
    normal4 = 2 * mp.sqrt(2) * mp.erfinv(mp.mpf("0.95"))
    return {"normal4_upper": f(normal4), "rect4_upper": f(rect4), "rect10_normal3_upper": f(mixed),
            "rect10_normal3_u": f(mp.sqrt(100 + 3))}


def main():
    data = {
        "generator": "tests/data/gen_gum.py (mpmath %s, %d digits)" % (mp.__version__, mp.mp.dps),
        "student_t": student_t_cases(),
        "measurement_sh": measurement_case(sh_signal, "sakuma_hattori"),
        "measurement_point": measurement_case(point_signal(mp.mpf("10e-6")), "spectral_point_10um"),
        "ratio_sensitivities": ratio_cases(),
        "calibration": calibration_cases(),
        "jcgm101_9_2": jcgm101_cases(),
    }
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "gum_reference.json")
    with open(path, "w") as fh:
        json.dump(data, fh, indent=1)
        fh.write("\n")
    print("wrote", path)


if __name__ == "__main__":
    main()
