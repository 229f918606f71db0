#!/usr/bin/env python3
"""Reference values for quantaband's multi-wavelength pyrometry, Raman thermometry, Y-factor
(noise-source) thermometry and semiconductor carrier statistics (issue 18).

Oracle: mpmath (mp.dps = 40). Nothing here reuses quantaband's algorithms:
  - multi-wavelength fits: the weighted least-squares solution is found by mp.findroot
    (multidimensional Newton with a numerical Jacobian) on the stationarity conditions
    J^T r = 0, started at the true parameters; the covariance is mp.inverse(J^T J); the scaled
    condition number comes from mp.svd_r of J with unit-norm columns (quantaband: Levenberg-
    Marquardt with Givens QR, triangular inverse and one-sided Jacobi SVD). Band signals are
    mp.quad of Planck's law over the band;
  - Raman: ratio = F * exp(-theta/T) (quantaband forms n/(n+1) from the Bose-Einstein
    occupancy); the temperature by mp.findroot of the ratio equation, dT/dR = 1/mp.diff(R, T);
  - Y factor: mp.findroot of the noise balance Y (T_cold + T_R) = T_hot + T_R for each load
    convention (loads from mp.expm1 and mp.coth);
  - semiconductors: carrier densities by mp.quad of the Fermi-Dirac integral (split at
    t = eta), intrinsic Fermi level by mp.findroot of n = p with those quadratures, the
    Fermi level from a density by mp.findroot; the Varshni gap and N_c from their formulas.

Inputs are written as decimal strings (Python repr of a binary64); the oracle evaluates them at
their exact binary64 value, so the Rust tests compare like with like. Outputs have 25
significant digits.

Regenerate (about 3 min on a 2-core machine):  python3 tests/data/gen_quantum.py
writes tests/data/quantum_reference.json
"""
import datetime
import json

import mpmath
from mpmath import mp, mpf

mp.dps = 40

H = mpf("6.62607015e-34")  # Planck constant, exact (SI 2019)
K = mpf("1.380649e-23")  # Boltzmann constant, exact
C = mpf(299792458)  # speed of light, exact
ME = mpf("9.1093837015e-31")  # electron mass, CODATA 2018
EV = mpf("1.602176634e-19")  # elementary charge, exact
C1L = 2 * H * C ** 2
C2 = H * C / K


def d(s):
    """Exact value of the binary64 nearest to s (string or float)."""
    return mpf(float(s))


def fmt(v):
    if v == 0:
        return "0"
    return mpmath.nstr(mpf(v), 25, min_fixed=1, max_fixed=0)


def r64(v):
    """A value rounded to binary64, as the decimal string Rust parses back exactly."""
    return repr(float(v))


def planck(lam, t):
    return C1L / (lam ** 5 * mpmath.expm1(C2 / (lam * t)))


def dplanck_dt(lam, t):
    x = C2 / (lam * t)
    return planck(lam, t) * x * mpmath.exp(x) / (mpmath.expm1(x) * t)


# ---- multi-wavelength pyrometry ---------------------------------------------------------------
NOISE = [mpf(v) for v in ("0.004", "-0.003", "0.001", "0.005", "-0.004", "0.002", "-0.001",
                          "0.003")]


def emissivity(kind, coef, u):
    s = sum(c * u ** k for k, c in enumerate(coef))
    return mpmath.exp(s) if kind == "logPolynomial" else s


def fit_oracle(kind, order, wl, s, unc, signal, dsignal, theta0):
    """Weighted LS solution by findroot on J^T r = 0, with covariance and conditioning."""
    n = len(wl)
    lc = (wl[0] + wl[-1]) / 2
    hw = (wl[-1] - wl[0]) / 2
    us = [(w - lc) / hw for w in wl]
    p = order + 2

    def resid_jac(th):
        t, coef = th[0], th[1:]
        r, jac = [], []
        for i in range(n):
            b, db = signal(i, t), dsignal(i, t)
            e = emissivity(kind, coef, us[i])
            r.append((s[i] - e * b) / unc[i])
            row = [e * db / unc[i]]
            for k in range(order + 1):
                de = us[i] ** k * (e if kind == "logPolynomial" else 1)
                row.append(b * de / unc[i])
            jac.append(row)
        return r, jac

    def grad(*th):
        r, jac = resid_jac(list(th))
        return [sum(jac[i][k] * r[i] for i in range(n)) for k in range(p)]

    # Start: the truth, then the best point of a coarse grid in T (a brute-force profile with
    # the emissivity coefficients by a linear fit at each grid temperature).
    def profile(t):
        rows, rhs = [], []
        for i in range(n):
            b = signal(i, t)
            if kind == "logPolynomial":
                w = s[i] / unc[i]
                rows.append([w * us[i] ** k for k in range(order + 1)])
                rhs.append(w * mpmath.log(s[i] / b))
            else:
                rows.append([b / unc[i] * us[i] ** k for k in range(order + 1)])
                rhs.append(s[i] / unc[i])
        a = mpmath.matrix(rows)
        coef = mpmath.lu_solve(a.T * a, a.T * mpmath.matrix(rhs))
        th = [t] + [coef[k] for k in range(order + 1)]
        r, _ = resid_jac(th)
        return sum(v * v for v in r), th

    best = None
    for j in range(121):
        t = theta0[0] * mpf(2) ** (mpf(j - 60) / 60)
        c2v, th = profile(t)
        if best is None or c2v < best[0]:
            best = (c2v, th)
    start = best[1]
    # Newton on the stationarity conditions in phi = (T/T_start, a...), with the Jacobian of
    # the gradient by central differences (h = 1e-12; truncation ~1e-24, rounding ~1e-28).
    t_s = start[0]

    def g_phi(*phi):
        th = [phi[0] * t_s] + list(phi[1:])
        gr = grad(*th)
        return [gr[0] * t_s] + gr[1:]

    def jac_phi(*phi):
        h = mpf(10) ** -12
        m = mpmath.matrix(p, p)
        for k in range(p):
            up = list(phi)
            dn = list(phi)
            up[k] += h
            dn[k] -= h
            gu, gd = g_phi(*up), g_phi(*dn)
            for i in range(p):
                m[i, k] = (gu[i] - gd[i]) / (2 * h)
        return m

    # (mp.findroot's MDNewton damps on the max-norm of g and stalls in the curved valleys of
    # these problems; plain Newton converges, and the result is verified below: gradient
    # orthogonal to the residual and a positive-definite Hessian, i.e. a minimum of chi^2.)
    sol = mpmath.matrix([mpf(1)] + start[1:])
    for _ in range(40):
        sol = sol + mpmath.lu_solve(jac_phi(*sol), -mpmath.matrix(g_phi(*sol)))
    hess = jac_phi(*sol)
    # g = Jᵀr = −½∇χ² (r = data − model), so −∂g/∂φ is the Hessian of χ²/2.
    mpmath.cholesky(-(hess + hess.T) / 2)  # raises unless it is positive definite
    th = [sol[0] * t_s] + [sol[k] for k in range(1, p)]
    r, jac = resid_jac(th)
    # Stationarity check: every Jacobian column orthogonal to the residual to 1e-25.
    rn = mpmath.sqrt(sum(v * v for v in r))
    for k in range(p):
        cn = mpmath.sqrt(sum(jac[i][k] ** 2 for i in range(n)))
        g = sum(jac[i][k] * r[i] for i in range(n))
        assert rn == 0 or abs(g) <= mpf(10) ** -25 * cn * max(rn, mpf(10) ** -10), (k, g)
    jm = mpmath.matrix(jac)
    jtj = jm.T * jm
    cov = mpmath.inverse(jtj)
    colnorm = [mpmath.sqrt(jtj[k, k]) for k in range(p)]
    js = mpmath.matrix(n, p)
    for i in range(n):
        for k in range(p):
            js[i, k] = jm[i, k] / colnorm[k]
    sv = mpmath.svd_r(js, compute_uv=False)
    svs = [sv[k] for k in range(p)]
    cond = max(svs) / min(svs)
    corr = cov[0, 2] / mpmath.sqrt(cov[0, 0] * cov[2, 2]) if order >= 1 else None
    inflation = mpmath.sqrt(cov[0, 0] * jtj[0, 0])
    chi2 = sum(v * v for v in r)
    return {
        "temperature_k": fmt(th[0]),
        "coefficients": [fmt(v) for v in th[1:]],
        "covariance": [[fmt(cov[i, j]) for j in range(p)] for i in range(p)],
        "condition_number": fmt(cond),
        "correlation_temperature_slope": fmt(corr) if corr is not None else None,
        "uncertainty_inflation": fmt(inflation),
        "chi_squared": fmt(chi2),
    }


def two_colour(sig, i, j, ratio, t0):
    return mpmath.findroot(lambda t: sig(i, t) / sig(j, t) - ratio, t0)


def brightness(sig, i, value, t0):
    return mpmath.findroot(lambda t: sig(i, t) - value, t0)


MW_CASES = []


def mw_spectral(name, wl_s, t_true, true_kind, true_coef, noise, rel_unc, models):
    wl = [d(w) for w in wl_s]
    lc = (wl[0] + wl[-1]) / 2
    hw = (wl[-1] - wl[0]) / 2
    rad, unc = [], []
    for i, w in enumerate(wl):
        e = emissivity(true_kind, true_coef, (w - lc) / hw)
        v = float(e * planck(w, t_true) * (1 + (NOISE[i] if noise else 0)))
        rad.append(v)
        unc.append(float(d(rel_unc) * mpf(v)))
    s = [mpf(v) for v in rad]
    u = [mpf(v) for v in unc]
    sig = lambda i, t: planck(wl[i], t)
    dsig = lambda i, t: dplanck_dt(wl[i], t)
    tb = [brightness(sig, i, s[i], t_true) for i in range(len(wl))]
    tc = two_colour(sig, 0, len(wl) - 1, s[0] / s[-1], t_true)
    for kind, order in models:
        # start the oracle at the truth, with true coefficients re-expressed where possible
        theta0 = [mpf(t_true)] + [mpf(0)] * (order + 1)
        e0 = emissivity(true_kind, true_coef, 0)
        theta0[1] = mpmath.log(e0) if kind == "logPolynomial" else e0
        # first refine the start by a fit of the model to the true emissivity (no noise)
        case = {
            "name": name,
            "channels": "spectral",
            "model": {"kind": kind, "order": order},
            "wavelengths_m": [r64(w) for w in wl],
            "radiances": [r64(v) for v in rad],
            "uncertainties": [r64(v) for v in unc],
            "brightness_k": [fmt(v) for v in tb],
            "two_colour_k": fmt(tc),
        }
        theta0 = start_from_emissivity(kind, order, wl, t_true, true_kind, true_coef)
        case.update(fit_oracle(kind, order, wl, s, u, sig, dsig, theta0))
        MW_CASES.append(case)


def start_from_emissivity(kind, order, wl, t, true_kind, true_coef):
    """Least-squares fit of the model to the true emissivity at the channels (a start only)."""
    lc = (wl[0] + wl[-1]) / 2
    hw = (wl[-1] - wl[0]) / 2
    us = [(w - lc) / hw for w in wl]
    target = [emissivity(true_kind, true_coef, u) for u in us]
    if kind == "logPolynomial":
        target = [mpmath.log(v) for v in target]
    a = mpmath.matrix([[u ** k for k in range(order + 1)] for u in us])
    b = mpmath.matrix(target)
    coef = mpmath.lu_solve(a.T * a, a.T * b)
    return [mpf(t)] + [coef[k] for k in range(order + 1)]


def mw_bands(name, centres_s, half_width_s, t_true, true_coef, rel_unc, models):
    """Rectangular-band channels: B_i(T) = quad of Planck over [c - h, c + h]."""
    cs = [d(c) for c in centres_s]
    hwid = d(half_width_s)
    lo = [float(c - hwid) for c in cs]
    hi = [float(c + hwid) for c in cs]
    lo_m = [mpf(v) for v in lo]
    hi_m = [mpf(v) for v in hi]
    sig = lambda i, t: mpmath.quad(lambda l: planck(l, t), [lo_m[i], hi_m[i]])
    dsig = lambda i, t: mpmath.quad(lambda l: dplanck_dt(l, t), [lo_m[i], hi_m[i]])
    lc = (cs[0] + cs[-1]) / 2
    hw = (cs[-1] - cs[0]) / 2
    rad, unc = [], []
    for i, c in enumerate(cs):
        e = emissivity("polynomial", true_coef, (c - lc) / hw)
        v = float(e * sig(i, t_true) * (1 + NOISE[i]))
        rad.append(v)
        unc.append(float(d(rel_unc) * mpf(v)))
    s = [mpf(v) for v in rad]
    u = [mpf(v) for v in unc]
    tb = [brightness(sig, i, s[i], t_true) for i in range(len(cs))]
    tc = two_colour(sig, 0, len(cs) - 1, s[0] / s[-1], t_true)
    for kind, order in models:
        theta0 = start_from_emissivity(kind, order, cs, t_true, "polynomial", true_coef)
        case = {
            "name": name,
            "channels": "bands",
            "model": {"kind": kind, "order": order},
            "wavelengths_m": [r64(c) for c in cs],
            "band_lower_m": [r64(v) for v in lo],
            "band_upper_m": [r64(v) for v in hi],
            "radiances": [r64(v) for v in rad],
            "uncertainties": [r64(v) for v in unc],
            "brightness_k": [fmt(v) for v in tb],
            "two_colour_k": fmt(tc),
        }
        case.update(fit_oracle(kind, order, cs, s, u, sig, dsig, theta0))
        MW_CASES.append(case)


mw_spectral("steel-strip 0.7-1.2 um, 1400 K, ln eps = -0.6 - 0.3u, 0.5 %",
            ["0.7e-6", "0.825e-6", "0.95e-6", "1.075e-6", "1.2e-6"], 1400, "logPolynomial",
            [mpf("-0.6"), mpf("-0.3")], True, "0.005",
            [("polynomial", 0), ("polynomial", 1), ("logPolynomial", 1), ("polynomial", 2),
             ("logPolynomial", 2)])
mw_spectral("SWIR 1.0-2.4 um, 900 K, eps = 0.35 + 0.08u, 0.2 %",
            ["1.0e-6", "1.2e-6", "1.4e-6", "1.6e-6", "1.8e-6", "2.0e-6", "2.2e-6", "2.4e-6"],
            900, "polynomial", [mpf("0.35"), mpf("0.08")], True, "0.002",
            [("polynomial", 1), ("logPolynomial", 1), ("polynomial", 3)])
mw_spectral("exact log-linear data, 2500 K, 0.5-0.9 um",
            ["0.5e-6", "0.6e-6", "0.75e-6", "0.9e-6"], 2500, "logPolynomial",
            [mpf("-1.2"), mpf("0.25")], False, "0.01", [("logPolynomial", 1)])
mw_spectral("exact grey data (eps = 0.3), 3 channels, 1800 K",
            ["0.65e-6", "0.8e-6", "0.95e-6"], 1800, "polynomial", [mpf("0.3")], False, "0.01",
            [("polynomial", 0)])
mw_spectral("ill-conditioned: 6 channels 0.65-0.95 um, order 4, 1600 K",
            ["0.65e-6", "0.71e-6", "0.77e-6", "0.83e-6", "0.89e-6", "0.95e-6"], 1600,
            "polynomial", [mpf("0.45"), mpf("-0.05")], True, "0.001", [("polynomial", 4)])
mw_bands("rectangular 40 nm bands, 1300 K, eps = 0.5 + 0.05u, 0.3 %",
         ["0.8e-6", "0.95e-6", "1.1e-6", "1.25e-6"], "20e-9", 1300,
         [mpf("0.5"), mpf("0.05")], "0.003", [("polynomial", 1)])

# ---- Raman ------------------------------------------------------------------------------------
RAMAN = []
RAMAN_INV = []
# (shift m^-1, excitation m, T K)
for shift, lam, t in [("52070", "532e-9", "300"), ("52070", "532e-9", "77"),
                      ("52070", "785e-9", "1000"), ("133200", "532e-9", "1500"),
                      ("130000", "633e-9", "600"), ("2000", "1064e-9", "4.2"),
                      ("300000", "355e-9", "250"), ("10000", "532e-9", "20000")]:
    nr, nl = d(shift), 1 / d(lam)
    theta = C2 * nr
    for kexp, det in [(4, "energy"), (3, "photonCounting")]:
        f = ((nl + nr) / (nl - nr)) ** kexp
        ratio = f * mpmath.exp(-theta / d(t))
        RAMAN.append([shift, lam, t, det, fmt(ratio), fmt(theta / d(t))])
        rr = float(ratio)
        tt = mpmath.findroot(lambda x: f * mpmath.exp(-theta / x) - mpf(rr), d(t))
        dtdr = 1 / mpmath.diff(lambda x: f * mpmath.exp(-theta / x), tt)
        RAMAN_INV.append([shift, lam, r64(rr), det, fmt(tt), fmt(dtdr)])

# ---- Y factor -----------------------------------------------------------------------------------


def load(kind, f, t):
    x = H * f / (K * t)
    if kind == "rayleighJeans":
        return t
    if kind == "planck":
        return H * f / K / mpmath.expm1(x)
    return H * f / (2 * K) * mpmath.coth(x / 2)


YF = []
for y, th, tc, f in [("2.5", "295", "77", "1e9"), ("1.8", "295", "77", "230e9"),
                     ("3.1", "300", "20", "100e9"), ("1.2", "295", "77", "1e12"),
                     ("6.0", "300", "4.2", "650e9"), ("1.05", "373", "296", "10e9"),
                     ("2.0", "290", "77", "1e3"), ("4.0", "77", "4", "50e9")]:
    row = [y, th, tc, f]
    trs = []
    for kind in ("rayleighJeans", "planck", "callenWelton"):
        lh, lcold = load(kind, d(f), d(th)), load(kind, d(f), d(tc))
        tr = mpmath.findroot(lambda x: d(y) * (lcold + x) - (lh + x), mpf(50))
        trs.append(tr)
        row.append(fmt(tr))
    row += [fmt(trs[1] - trs[0]), fmt(trs[2] - trs[0])]
    YF.append(row)

# ---- semiconductors -----------------------------------------------------------------------------


def fd_half_quad(eta):
    """Normalised F_1/2 by quadrature of the defining integral, split at t = eta."""
    g = lambda t: mpmath.sqrt(t) / (mpmath.exp(t - eta) + 1)
    pts = [0, eta, eta + 40, mpmath.inf] if eta > 0 else [0, 1, 40, mpmath.inf]
    return 2 / mpmath.sqrt(mpmath.pi) * mpmath.quad(g, pts)


def fd_half_quad_scaled(eta):
    """F_1/2(eta) * exp(-eta) by quadrature (no underflow for eta << 0)."""
    g = lambda t: mpmath.sqrt(t) / (mpmath.exp(t) + mpmath.exp(eta))
    return 2 / mpmath.sqrt(mpmath.pi) * mpmath.quad(g, [0, 1, 40, mpmath.inf])


def nc(m, t):
    return 2 * (2 * mpmath.pi * m * ME * K * t / H ** 2) ** mpf(1.5)


DOS = []
for m, t in [("1", "300"), ("1.08", "300"), ("0.81", "300"), ("0.067", "77"), ("0.014", "4.2"),
             ("0.5", "1500"), ("1e-3", "1e-3"), ("50", "1e5")]:
    DOS.append([m, t, fmt(nc(d(m), d(t)))])

CARRIER = []
for n, eta in [("1e25", "-800"), ("2.8e25", "-40"), ("2.8e25", "-10"), ("2.8e25", "-3.5"),
               ("2.8e25", "-3"), ("2.8e25", "-2.999"), ("2.8e25", "-1"), ("2.8e25", "0"),
               ("2.8e25", "0.5"), ("4.4e23", "3"), ("4.4e23", "10"), ("4.4e23", "35"),
               ("4.4e23", "100"), ("1e20", "-20.5")]:
    e = d(eta)
    if e < -3:
        scaled = fd_half_quad_scaled(e)
        dens = d(n) * mpmath.exp(e) * scaled
        relerr = 1 / scaled - 1
    else:
        fq = fd_half_quad(e)
        dens = d(n) * fq
        relerr = mpmath.exp(e) / fq - 1
    CARRIER.append([n, eta, fmt(dens), fmt(relerr)])


def varshni(eg0, a, b, t):
    return eg0 - a * t * t / (t + b)


VARSHNI = []
for eg0, a, b, t in [("1.170", "4.73e-4", "636", "300"), ("1.519", "5.405e-4", "204", "300"),
                     ("1.519", "5.405e-4", "204", "4.2"), ("0.2352", "6.0e-4", "500", "400"),
                     ("3.47", "7.7e-4", "600", "1200")]:
    VARSHNI.append([eg0, a, b, t,
                    fmt(varshni(d(eg0) * EV, d(a) * EV, d(b), d(t)))])

INTRINSIC = []
FERMI = []
# (name, m_e, m_h, Eg0 eV, alpha eV/K, beta K, temperatures)
MATERIALS = [("silicon-like", "1.08", "0.81", "1.170", "4.73e-4", "636",
              ["200", "300", "600", "1000"]),
             ("GaAs-like", "0.067", "0.5", "1.519", "5.405e-4", "204", ["300", "700"]),
             ("narrow-gap (InSb-like)", "0.014", "0.43", "0.2352", "6.0e-4", "500",
              ["77", "300", "450"])]


def ln_f(eta):
    return eta + mpmath.log(fd_half_quad_scaled(eta)) if eta < -3 else mpmath.log(
        fd_half_quad(eta))


for name, me, mh, eg0, a, b, temps in MATERIALS:
    for t in temps:
        tt = d(t)
        kt = K * tt
        eg = varshni(d(eg0) * EV, d(a) * EV, d(b), tt)
        ncv, nvv = nc(d(me), tt), nc(d(mh), tt)
        g = eg / kt
        xi_b = g / 2 + mpmath.log(nvv / ncv) / 2
        xi = mpmath.findroot(lambda x: mpmath.log(ncv) + ln_f(x - g) - mpmath.log(nvv)
                             - ln_f(-x), xi_b)
        ni = mpmath.exp(mpmath.log(ncv) + ln_f(xi - g))
        ni_b = mpmath.sqrt(ncv * nvv) * mpmath.exp(-g / 2)
        INTRINSIC.append([me, mh, str(float(d(eg0) * EV)), str(float(d(a) * EV)), b, t,
                          fmt(xi * kt), fmt(ni), fmt(xi_b * kt), fmt(ni_b)])
        # Fermi level from an electron density (findroot of N_c F(eta) = n)
        for n in ["1e21", "1e24", "3e25"]:
            eta = mpmath.findroot(lambda e: ln_f(e) - mpmath.log(d(n) / ncv), 0)
            FERMI.append([me, mh, str(float(d(eg0) * EV)), str(float(d(a) * EV)), b, t, n,
                          fmt(eg + eta * kt)])

out = {
    "header": {
        "oracle": "mpmath",
        "oracle_version": mpmath.__version__,
        "mp_dps": mp.dps,
        "generated_utc": datetime.datetime.now(datetime.timezone.utc).strftime(
            "%Y-%m-%dT%H:%M:%SZ"),
        "generator": "tests/data/gen_quantum.py",
        "constants": "SI 2019 exact h, k, c, e; CODATA 2018 m_e; c2 = hc/k",
        "formats": {
            "multiwavelength": "objects; reduced wavelength u = (lambda - lc)/h over the "
                               "channels; covariance over (T, a0..am); bands: rectangular, "
                               "emissivity at the listed centre",
            "raman": "[shift m^-1, excitation m, T K, detection, ratio, theta/T]",
            "raman_inverse": "[shift, excitation, ratio, detection, T K, dT/dR K]",
            "y_factor": "[Y, T_hot K, T_cold K, f Hz, T_R rayleighJeans, T_R planck, "
                        "T_R callenWelton, planck - rayleighJeans, callenWelton - "
                        "rayleighJeans] (K)",
            "dos": "[m*/m_e, T K, N m^-3]",
            "carrier": "[N m^-3, eta, N F_1/2(eta) m^-3, Boltzmann relative error]",
            "varshni": "[Eg0 eV, alpha eV/K, beta K, T K, Eg J]",
            "intrinsic": "[m_e*, m_h*, Eg0 J, alpha J/K, beta K, T K, E_F J, n_i m^-3, "
                         "E_i Boltzmann J, n_i Boltzmann m^-3]",
            "fermi_from_density": "[m_e*, m_h*, Eg0 J, alpha J/K, beta K, T K, n m^-3, E_F J]",
        },
    },
    "multiwavelength": MW_CASES,
    "raman": RAMAN,
    "raman_inverse": RAMAN_INV,
    "y_factor": YF,
    "dos": DOS,
    "carrier": CARRIER,
    "varshni": VARSHNI,
    "intrinsic": INTRINSIC,
    "fermi_from_density": FERMI,
}
with open("tests/data/quantum_reference.json", "w") as fh:
    json.dump(out, fh, indent=1)
    fh.write("\n")
print(f"{len(MW_CASES)} fits, {len(RAMAN)} + {len(RAMAN_INV)} Raman, {len(YF)} Y-factor, "
      f"{len(DOS)} N_c, {len(CARRIER)} densities, {len(INTRINSIC)} intrinsic, "
      f"{len(FERMI)} Fermi levels")
