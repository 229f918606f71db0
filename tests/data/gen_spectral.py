#!/usr/bin/env python3
"""Reference values for the spectral (non-grey) thermometry tests (tests/thermometry_spectral.rs,
tests/thermometry_indicated.rs).

Oracle: mpmath 1.3.0. Nothing here reuses the crate's algorithms:
  * every integral is mpmath.quad (tanh-sinh) of the piecewise-linear interpolants, per interval
    of the union of the tables' grids (so the quadrature never straddles a kink), not
    Gauss-Legendre;
  * temperatures, reflected temperatures and emissivities are found with mpmath.findroot on the
    full radiance balance, never with a closed-form inverse, the affine split the crate uses, or
    its safeguarded Newton;
  * sensitivity coefficients are central finite differences of such root-finding solves, not
    implicit differentiation.
Constants: CODATA 2018 exact defining constants h, c, k (c2 = hc/k, c1L = 2hc^2).

Also written: the 4-, 6- and 8-point Gauss-Legendre nodes and weights (roots of P_n by findroot)
that src/thermometry/gauss_legendre.rs hard-codes, and the a-priori error bound of those rules
on the pieces the spectral integration uses (see quadrature_bound() below), evaluated with
Python's cmath in double precision (a bound to three digits, not a reference value).

All tables are invented for testing; they describe no real material or product.

Run:  python3 tests/data/gen_spectral.py   (writes tests/data/spectral_reference.json; ~22 min,
      most of it the 200-point case and the finite-difference sensitivities)
"""
import cmath
import json
import math
import os

import mpmath as mp

mp.mp.dps = 30

H = mp.mpf("6.62607015e-34")
C = mp.mpf("299792458")
K = mp.mpf("1.380649e-23")
C1L = 2 * H * C**2
C2 = H * C / K


def f(x):
    """Shortest repr that round-trips to the nearest f64."""
    return float(x)


# ---------------------------------------------------------------------------------------------
# Gauss-Legendre rules and the a-priori bound.

def gauss_legendre(n):
    out = []
    for i in range(1, n // 2 + 1):
        x0 = mp.cos(mp.pi * (i - mp.mpf(1) / 4) / (n + mp.mpf(1) / 2))
        x = mp.findroot(lambda t: mp.legendre(n, t), x0)
        w = 2 / ((1 - x**2) * mp.diff(lambda t: mp.legendre(n, t), x) ** 2)
        out.append([f(x), f(w)])
    return out


# Bound of the n-point Gauss rule on one piece [p, q] of the spectral integration, relative to
# the piece's integral. The integrand is P(lam)*L(lam, T) with P a product of D <= 4 linear
# factors, each >= 0 on the piece (response, transmittances, emissivity...), and L Planck's
# spectral radiance (energy or photon units). Map the piece to z in [-1, 1], lam = c(1 + u z),
# c the centre, u = h/c. Trefethen, ATAP (2013) Thm 19.3: if the integrand is analytic in the
# Bernstein ellipse E_rho with |f| <= M there, |I - I_n| <= (64/15) M rho^(-2n) / (rho^2 - 1)
# (times h). A linear factor a + b z >= 0 on [-1, 1] (|b| <= a) is <= a (1 + a_rho) on E_rho,
# a_rho = (rho + 1/rho)/2; and int_{-1}^{1} prod(a_i + b_i z) dz >= 2 m_D prod a_i, with
# m_D = min_k 2^D k!(D-k)!/(D+1)! (the integral is multilinear in the b_i, so its minimum over
# |b_i| <= a_i is at a vertex b_i = +-a_i). So
#   relative error <= (64/15) rho^(-2n)/(rho^2 - 1) (1 + a_rho)^D / (2 m_D) * max_E|L| / min L,
# minimised over rho below the nearest singularity of L (lam = 0, and c2/(lam T) = 2 pi i k).
# max_E |L| is taken over 256 points of the ellipse, min L over 81 points of the piece.
D = 4
M_D = min(2.0**D * math.factorial(k) * math.factorial(D - k) / math.factorial(D + 1) for k in range(D + 1))


def _ln_planck_ratio(t, xc, photon):
    """ln(L(c t)/L(c)) for complex t (x = xc at t = 1)."""
    y = xc / t
    if y.real > 30:
        le = y + cmath.log(1 - cmath.exp(-y))
    elif abs(y) > 1e-5:
        le = cmath.log(cmath.exp(y) - 1)
    else:
        le = cmath.log(y * (1 + y / 2 + y * y / 6))
    lc = xc + math.log(-math.expm1(-xc)) if xc > 30 else math.log(math.expm1(xc))
    v = -5 * cmath.log(t) + lc - le
    if photon:
        v += cmath.log(t)
    return v


def _rho_singular(u, xc):
    def r(z0):
        s = cmath.sqrt(z0 * z0 - 1)
        return max(abs(z0 + s), abs(z0 - s))
    rs = [r(complex(-1 / u, 0))]
    for k in range(1, 21):
        for sg in (1, -1):
            lam = xc / (2 * math.pi * 1j * k * sg)
            rs.append(r((lam - 1) / u))
    return min(rs)


def _piece_bound(n, u, xc, photon):
    rmax = _rho_singular(u, xc) * 0.999
    lmin = min(_ln_planck_ratio(complex(1 + u * (-1 + 2 * i / 80), 0), xc, photon).real for i in range(81))
    best = math.inf
    for j in range(1, 60):
        rho = math.exp(math.log(rmax) * j / 60)
        a = (rho + 1 / rho) / 2
        lmax = max(_ln_planck_ratio(1 + u * (rho * cmath.exp(2j * math.pi * i / 256)
                                             + cmath.exp(-2j * math.pi * i / 256) / rho) / 2,
                                    xc, photon).real for i in range(256))
        lnb = (math.log(64 / 15) - 2 * n * math.log(rho) - math.log(rho * rho - 1)
               + D * math.log(1 + a) - math.log(2 * M_D) + lmax - lmin)
        best = min(best, lnb)
    return math.exp(best)


# (rule, largest ln(q/p), largest change of x = c2/(lam T) across the piece): the classes of
# rule_for() in src/thermometry/spectral.rs; the 20-point class is every piece of the geometric
# subdivision of src/thermometry/response.rs.
RULE_CLASSES = [(4, 0.001, 0.02), (6, 0.01, 0.2), (8, 0.03, 0.6), (20, 0.3, 6.0)]


def quadrature_bound():
    out = []
    for n, wmax, dx in RULE_CLASSES:
        worst = 0.0
        for e in range(-12, 17):          # x at the piece's short end: 1e-3 ... 1e4
            xp = 10 ** (e / 4)
            wfull = wmax if xp * (1 - math.exp(-wmax)) <= dx else -math.log(1 - dx / xp)
            for w in (wfull, wfull / 2, wfull / 4):
                p, q = 1.0, math.exp(w)
                c, h = (p + q) / 2, (q - p) / 2
                for photon in (False, True):
                    worst = max(worst, _piece_bound(n, h / c, xp * p / c, photon))
        out.append({"points": n, "max_ln_ratio": wmax, "max_dx": dx, "relative_bound": worst})
    return out


# ---------------------------------------------------------------------------------------------
# Tables and the spectral measurement equation in mpmath.

class Table:
    """Piecewise-linear table; outside the grid: None (not defined) or the end values."""

    def __init__(self, wl, vals, constant_ends=False):
        self.wl = [float(w) for w in wl]
        self.vals = [float(v) for v in vals]
        self.w = [mp.mpf(w) for w in self.wl]       # exact binary values
        self.v = [mp.mpf(v) for v in self.vals]
        self.constant_ends = constant_ends
        self.constant = None

    def at(self, lam):
        w, v = self.w, self.v
        if lam <= w[0]:
            return v[0]
        if lam >= w[-1]:
            return v[-1]
        lo, hi = 0, len(w) - 1
        while hi - lo > 1:
            mid = (lo + hi) // 2
            if w[mid] <= lam:
                lo = mid
            else:
                hi = mid
        return v[lo] + (v[hi] - v[lo]) * (lam - w[lo]) / (w[hi] - w[lo])

    def json(self):
        if self.constant is not None:
            return {"constant": self.constant}
        return {"wavelengths_m": self.wl, "values": self.vals, "constant_ends": self.constant_ends}


def const(c):
    """A constant (grey) input: the same value everywhere (written to JSON as a constant)."""
    t = Table([1e-9, 1.0], [c, c], True)
    t.constant = c
    return t


def planck(lam, t, photon=False):
    v = C1L / lam**5 / mp.expm1(C2 / (lam * t))
    return v * lam / (H * C) if photon else v


def band_span(resp):
    first = next(i for i, v in enumerate(resp.vals) if v > 0)
    last = max(i for i, v in enumerate(resp.vals) if v > 0)
    return resp.w[max(first - 1, 0)], resp.w[min(last + 1, len(resp.w) - 1)]


def union_grid(tables, lo, hi):
    pts = {lo, hi}
    for t in tables:
        pts.update(w for w in t.w if lo < w < hi)
    return sorted(pts)


def integrate(grid, g):
    """sum of mp.quad(g, [a, b]) over the union intervals; wide intervals split geometrically
    so that tanh-sinh sees a smooth integrand on each."""
    total = mp.mpf(0)
    for a, b in zip(grid[:-1], grid[1:]):
        m = max(1, int(mp.ceil(mp.log(b / a) / mp.mpf("0.05"))))
        pts = [a * (b / a) ** (mp.mpf(j) / m) for j in range(m + 1)]
        total += mp.quad(g, pts)
    return total


class Scene:
    """Instrument response + spectral conditions (symbols of src/thermometry/spectral.rs)."""

    def __init__(self, resp, photon, eps, refl, tp, tw, rw, t_refl, t_path, t_win, t_int):
        self.resp, self.photon = resp, photon
        self.eps, self.refl, self.tp, self.tw, self.rw = eps, refl, tp, tw, rw
        self.t_refl, self.t_path, self.t_win, self.t_int = (mp.mpf(x) for x in (t_refl, t_path, t_win, t_int))
        self.lo, self.hi = band_span(resp)
        tabs = [resp, eps, tp, tw, rw] + ([refl] if refl is not None else [])
        self.grid = union_grid(tabs, self.lo, self.hi)

    def factors(self, lam, k):
        """(R, eps, rho, tau_p, tau_w, rho_w) at lam with scale factors k (dict)."""
        r = k.get("r", 1) * self.resp.at(lam)
        e = k.get("e", 1) * self.eps.at(lam)
        rho = (1 - e) if self.refl is None else k.get("rho", 1) * self.refl.at(lam)
        tp = k.get("tp", 1) * self.tp.at(lam)
        tw = k.get("tw", 1) * self.tw.at(lam)
        rw = k.get("rw", 1) * self.rw.at(lam)
        return r, e, rho, tp, tw, rw

    def terms(self, t, k=None, temps=None):
        """[object, reflected, path, window reflected, window emitted] at object temperature t."""
        k = k or {}
        tr, tpa, twi, tin = temps or (self.t_refl, self.t_path, self.t_win, self.t_int)
        ph = self.photon

        def term(fn, temp):
            return integrate(self.grid, lambda lam: fn(*self.factors(lam, k)) * planck(lam, temp, ph))

        return [
            term(lambda r, e, rho, tp, tw, rw: r * tw * tp * e, t),
            term(lambda r, e, rho, tp, tw, rw: r * tw * tp * rho, tr),
            term(lambda r, e, rho, tp, tw, rw: r * tw * (1 - tp), tpa),
            term(lambda r, e, rho, tp, tw, rw: r * rw, tin),
            term(lambda r, e, rho, tp, tw, rw: r * (1 - tw - rw), twi),
        ]

    def effective(self, t):
        ph = self.photon

        def avg(fn):
            return integrate(self.grid, lambda lam: fn(*self.factors(lam, {})) * planck(lam, t, ph))

        s = avg(lambda r, e, rho, tp, tw, rw: r)
        return {
            "emissivity": f(avg(lambda r, e, rho, tp, tw, rw: r * e) / s),
            "reflectance": f(avg(lambda r, e, rho, tp, tw, rw: r * rho) / s),
            "path_transmittance": f(avg(lambda r, e, rho, tp, tw, rw: r * tp) / s),
            "window_transmittance": f(avg(lambda r, e, rho, tp, tw, rw: r * tw) / s),
            "window_reflectance": f(avg(lambda r, e, rho, tp, tw, rw: r * rw) / s),
            "object_gain": f(avg(lambda r, e, rho, tp, tw, rw: r * tw * tp * e) / s),
        }

    def solve_t(self, signal, guess, k=None, temps=None):
        return mp.findroot(lambda t: sum(self.terms(t, k, temps)) - signal, mp.mpf(guess), tol=mp.mpf(10) ** -26)


def smooth(wl, fn, digits=4):
    return [round(fn(w * 1e6), digits) for w in wl]


def grid_um(lo, hi, n, shift=0.0):
    """n points from lo to hi (um), interior points shifted by `shift` of a step; in m."""
    step = (hi - lo) / (n - 1)
    pts = [lo] + [lo + step * (i + shift) for i in range(1, n - 1)] + [hi]
    return [round(p, 6) * 1e-6 for p in pts]


def lwir_200():
    """The bench configuration: 200-point tables over 8-14 um on different grids, 400 K."""
    wl_r = grid_um(8, 14, 200)
    resp = Table(wl_r, smooth(wl_r, lambda u: min(1.0, 0.3 + 0.7 * math.sin(math.pi * (u - 8) / 6) ** 0.5)))
    wl_e = grid_um(8, 14, 200, 0.37)
    eps = Table(wl_e, smooth(wl_e, lambda u: 0.88 - 0.35 * math.exp(-((u - 9.4) / 0.45) ** 2)
                             + 0.03 * math.sin(3 * u)))
    wl_p = grid_um(8, 14, 200, 0.61)
    tp = Table(wl_p, smooth(wl_p, lambda u: 0.97 - 0.12 * math.exp(-((u - 9.6) / 0.15) ** 2)
                            - 0.02 * (u - 8) / 6))
    wl_w = grid_um(8, 14, 150, 0.5)
    tw = Table(wl_w, smooth(wl_w, lambda u: 0.78 - 0.25 * math.exp(-((u - 12.2) / 0.3) ** 2)))
    wl_rw = grid_um(8, 14, 120, 0.25)
    rw = Table(wl_rw, smooth(wl_rw, lambda u: 0.05 + 0.01 * math.cos(u)))
    return Scene(resp, False, eps, None, tp, tw, rw, 295, 290, 300, 305), 400.0


def swir_photon():
    """Photon-counting 0.9-1.7 um detector (quantum-efficiency table), semi-transparent target
    with its own reflectance table, emissivity table with constant ends narrower than the
    band, grey path, no window; 900 K."""
    wl_r = [x * 1e-6 for x in (0.90, 0.95, 1.00, 1.10, 1.20, 1.30, 1.40, 1.55, 1.65, 1.70)]
    resp = Table(wl_r, [0.0, 0.45, 0.62, 0.74, 0.80, 0.82, 0.80, 0.78, 0.40, 0.0])
    eps = Table([x * 1e-6 for x in (1.0, 1.2, 1.4, 1.6)], [0.30, 0.34, 0.41, 0.45], True)
    refl = Table([x * 1e-6 for x in (0.9, 1.3, 1.7)], [0.50, 0.46, 0.40])
    return Scene(resp, True, eps, refl, const(0.98), const(1.0), const(0.0), 310, 300, 300, 300), 900.0


def mwir_window():
    """3-5 um energy response through a window whose transmittance falls steeply near 4.3 um,
    cold target (250 K) behind a warm window."""
    wl_r = [x * 1e-6 for x in (3.0, 3.4, 4.0, 4.6, 5.0)]
    resp = Table(wl_r, [0.2, 0.9, 1.0, 0.95, 0.3])
    tw = Table([x * 1e-6 for x in (2.9, 4.2, 4.3, 4.4, 5.1)], [0.92, 0.90, 0.30, 0.88, 0.91])
    rw = Table([x * 1e-6 for x in (2.9, 5.1)], [0.03, 0.05])
    eps = Table([x * 1e-6 for x in (3.0, 5.0)], [0.95, 0.80])
    return Scene(resp, False, eps, None, const(0.99), tw, rw, 280, 285, 320, 318), 250.0


def cold_wide():
    """50 K object over 3-30 um (tiny signals from the short end)."""
    resp = Table([3e-6, 10e-6, 30e-6], [1.0, 1.0, 0.5])
    eps = Table([2e-6, 30e-6], [0.9, 0.7])
    return Scene(resp, False, eps, None, const(1.0), const(1.0), const(0.0), 40, 40, 40, 40), 50.0


def hot_short():
    """3000 K over 0.5-1.1 um, with a grey path at 300 K."""
    resp = Table([0.5e-6, 0.8e-6, 1.1e-6], [0.3, 1.0, 0.2])
    eps = Table([0.5e-6, 0.7e-6, 1.1e-6], [0.45, 0.40, 0.33])
    return Scene(resp, False, eps, None, const(0.9), const(1.0), const(0.0), 300, 300, 300, 300), 3000.0


def step_emissivity():
    """The grey-versus-spectral example: flat 8-14 um response, emissivity 0.9 below 10 um and
    0.5 above (a steep step), 350 K, surroundings at 293.15 K. Also the object temperature a
    grey calculation with the band-average emissivity (arithmetic mean over wavelength) would
    give for the same signal, found by findroot."""
    resp = Table([8e-6, 14e-6], [1.0, 1.0])
    eps = Table([8e-6, 9.99e-6, 10.01e-6, 14e-6], [0.9, 0.9, 0.5, 0.5])
    return Scene(resp, False, eps, None, const(1.0), const(1.0), const(0.0), 293.15, 293.15, 293.15, 293.15), 350.0


SCENES = {
    "lwir_200": lwir_200,
    "swir_photon": swir_photon,
    "mwir_window": mwir_window,
    "cold_wide": cold_wide,
    "hot_short": hot_short,
    "step_emissivity": step_emissivity,
}


def scene_json(sc):
    d = {"response": sc.resp.json(), "photon": sc.photon, "emissivity": sc.eps.json(),
         "path_transmittance": sc.tp.json(), "window_transmittance": sc.tw.json(),
         "window_reflectance": sc.rw.json(),
         "reflected_temperature_k": f(sc.t_refl), "path_temperature_k": f(sc.t_path),
         "window_temperature_k": f(sc.t_win), "window_reflected_temperature_k": f(sc.t_int)}
    if sc.refl is not None:
        d["reflectance"] = sc.refl.json()
    return d


def spectral_cases():
    out = {}
    for name, make in SCENES.items():
        sc, t = make()
        terms = sc.terms(mp.mpf(t))
        d = {"scene": scene_json(sc), "temperature_k": t, "terms": [f(x) for x in terms],
             "signal": f(sum(terms)), "effective": sc.effective(mp.mpf(t))}
        if name == "step_emissivity":
            s = sum(terms)
            e_mean = integrate(sc.grid, lambda lam: sc.eps.at(lam)) / (sc.hi - sc.lo)
            bb = lambda tt: integrate(sc.grid, lambda lam: planck(lam, tt))
            tr = sc.t_refl
            t_grey = mp.findroot(lambda tt: e_mean * bb(tt) + (1 - e_mean) * bb(tr) - s, mp.mpf(t))
            d["grey_mean_emissivity"] = f(e_mean)
            d["grey_temperature_k"] = f(t_grey)
        out[name] = d
        print("  spectral case", name)
    return out


# ---------------------------------------------------------------------------------------------
# Sensitivities: central differences of findroot solves.

def sens_scene(opaque):
    resp = Table([8e-6, 11e-6, 14e-6], [0.6, 1.0, 0.7])
    eps = Table([7.5e-6, 9e-6, 10.5e-6, 14.5e-6], [0.92, 0.75, 0.85, 0.80])
    refl = None if opaque else Table([7.5e-6, 14.5e-6], [0.05, 0.12])
    tp = Table([7.5e-6, 9.6e-6, 14.5e-6], [0.96, 0.88, 0.95])
    tw = Table([7.5e-6, 12e-6, 14.5e-6], [0.85, 0.80, 0.70])
    rw = Table([7.5e-6, 14.5e-6], [0.04, 0.06])
    return Scene(resp, False, eps, refl, tp, tw, rw, 300, 290, 305, 310)


def sensitivity_case(opaque):
    sc = sens_scene(opaque)
    t0 = mp.mpf(380)
    signal = sum(sc.terms(t0))
    base_t = (sc.t_refl, sc.t_path, sc.t_win, sc.t_int)
    hrel = mp.mpf("1e-8")

    def d(fun, x0):
        h = hrel * x0
        return (fun(x0 + h) - fun(x0 - h)) / (2 * h)

    out = {"signal": f(signal), "temperature_k": f(t0)}
    out["signal_coefficient"] = f(d(lambda s: sc.solve_t(s, t0), signal))
    for key, name in [("e", "emissivity_scale"), ("rho", "reflectance_scale"), ("tp", "path_transmittance_scale"),
                      ("tw", "window_transmittance_scale"), ("rw", "window_reflectance_scale"), ("r", "response_scale")]:
        if key == "rho" and opaque:
            continue
        out[name] = f(d(lambda kk: sc.solve_t(signal, t0, {key: kk}), mp.mpf(1)))
    for i, name in enumerate(["reflected_temperature", "path_temperature", "window_temperature",
                              "window_reflected_temperature"]):
        def tf(x, i=i):
            temps = list(base_t)
            temps[i] = x
            return sc.solve_t(signal, t0, None, tuple(temps))
        out[name] = f(d(tf, base_t[i]))
    print("  sensitivities", "opaque" if opaque else "semi-transparent")
    return {"scene": scene_json(sc), "opaque": opaque, "coefficients": out}


# ---------------------------------------------------------------------------------------------
# Workflows from an indicated temperature: radiance balances solved by findroot.

SH = {"a_m": 1.0e-5, "b_mk": 1.8e-4, "c": 1.0e6}


def model_fn(name):
    if name == "point_10um":
        return lambda t: planck(mp.mpf("10e-6"), t)
    if name == "rect_8_14um":
        return lambda t: mp.quad(lambda lam: planck(lam, t),
                                 [mp.mpf("8e-6") * mp.mpf(14 / 8) ** (mp.mpf(j) / 12) for j in range(13)])
    if name == "sakuma_hattori":
        a, b, c = (mp.mpf(SH[k]) for k in ("a_m", "b_mk", "c"))
        return lambda t: c / mp.expm1(C2 / (a * t + b))
    if name == "response_3_5um":
        tab = Table([3.0e-6, 4.0e-6, 5.0e-6], [0.5, 1.0, 0.8])
        return lambda t: integrate(tab.w, lambda lam: tab.at(lam) * planck(lam, t))
    raise ValueError(name)


def grey_signal(S, t, c):
    """The grey measurement equation (module docs of src/thermometry/measurement.rs)."""
    e, tau = mp.mpf(c["emissivity"]), mp.mpf(c["path_transmittance"])
    scene = tau * (e * S(t) + (1 - e) * S(mp.mpf(c["reflected_temperature_k"]))) \
        + (1 - tau) * S(mp.mpf(c["path_temperature_k"]))
    w = c.get("window")
    if w is None:
        return scene
    tw, rw = mp.mpf(w["transmittance"]), mp.mpf(w["reflectance"])
    return tw * scene + rw * S(mp.mpf(w["reflected_temperature_k"])) + (1 - tw - rw) * S(mp.mpf(w["temperature_k"]))


def cond(e=1.0, tr=293.15, tau=1.0, tp=293.15, window=None):
    d = {"emissivity": e, "reflected_temperature_k": tr, "path_transmittance": tau, "path_temperature_k": tp}
    if window:
        d["window"] = window
    return d


WINDOW = {"transmittance": 0.9, "reflectance": 0.04, "temperature_k": 305.0, "reflected_temperature_k": 303.0}


def workflow_cases():
    out = []
    for m in ["point_10um", "rect_8_14um", "sakuma_hattori", "response_3_5um"]:
        S = model_fn(m)
        tol = mp.mpf(10) ** -24
        # (a) correction to another emissivity / reflected temperature (and path / window)
        for t_ind, setting, actual in [
            (350.0, cond(0.95), cond(0.80, 310.0)),
            (520.0, cond(1.0, 293.15, 0.97, 299.0), cond(0.62, 330.0, 0.90, 301.0, WINDOW)),
            (280.0, cond(0.90, 293.15), cond(0.70, 250.0)),
        ]:
            s = grey_signal(S, mp.mpf(t_ind), setting)
            t = mp.findroot(lambda tt: grey_signal(S, tt, actual) - s, mp.mpf(t_ind), tol=tol)
            out.append({"kind": "correct", "model": m, "indicated_k": t_ind, "setting": setting,
                        "actual": actual, "expected": f(t)})
        # (b) reflected temperature from a diffuse reflector
        for t_ind, setting, e_f, t_f in [(301.5, cond(1.0), 0.0, 295.0), (301.5, cond(1.0), 0.04, 295.0),
                                         (288.0, cond(0.95, 300.0, 0.98, 290.0), 0.06, 296.0)]:
            s = grey_signal(S, mp.mpf(t_ind), setting)

            def bal(tr, setting=setting, e_f=e_f, t_f=t_f):
                c = dict(setting, emissivity=e_f, reflected_temperature_k=tr)
                return grey_signal(S, mp.mpf(t_f), c) - s
            tr = mp.findroot(bal, mp.mpf(t_ind), tol=tol)
            out.append({"kind": "reflected", "model": m, "indicated_k": t_ind, "setting": setting,
                        "reflector_emissivity": e_f, "reflector_temperature_k": t_f, "expected": f(tr)})
        # (c1) emissivity by the contact method
        for t_ind, setting, t_true, t_refl in [(340.0, cond(1.0), 352.0, 295.0),
                                               (410.0, cond(0.9, 300.0, 0.97, 295.0), 455.0, 305.0),
                                               (265.0, cond(1.0), 262.0, 296.0)]:
            s = grey_signal(S, mp.mpf(t_ind), setting)

            def bal(e, setting=setting, t_true=t_true, t_refl=t_refl):
                c = dict(setting, emissivity=e, reflected_temperature_k=t_refl)
                return grey_signal(S, mp.mpf(t_true), c) - s
            e = mp.findroot(bal, mp.mpf("0.5"), tol=tol)
            out.append({"kind": "contact", "model": m, "indicated_k": t_ind, "setting": setting,
                        "true_temperature_k": t_true, "reflected_temperature_k": t_refl, "expected": f(e)})
        # (c2) emissivity by the reference-coating method: T_true from the coating, then eps
        for ref_ind, surf_ind, setting, e_ref, t_refl in [(360.0, 318.0, cond(0.95, 295.0), 0.95, 295.0),
                                                          (372.0, 330.0, cond(1.0, 293.15, 0.98, 294.0), 0.93, 298.0)]:
            s_ref = grey_signal(S, mp.mpf(ref_ind), setting)
            s_surf = grey_signal(S, mp.mpf(surf_ind), setting)

            def bal_t(tt, setting=setting, e_ref=e_ref, t_refl=t_refl):
                c = dict(setting, emissivity=e_ref, reflected_temperature_k=t_refl)
                return grey_signal(S, tt, c) - s_ref
            t_true = mp.findroot(bal_t, mp.mpf(ref_ind), tol=tol)

            def bal_e(e, setting=setting, t_refl=t_refl, t_true=t_true):
                c = dict(setting, emissivity=e, reflected_temperature_k=t_refl)
                return grey_signal(S, t_true, c) - s_surf
            e = mp.findroot(bal_e, mp.mpf("0.5"), tol=tol)
            out.append({"kind": "reference", "model": m, "reference_indicated_k": ref_ind,
                        "surface_indicated_k": surf_ind, "setting": setting, "reference_emissivity": e_ref,
                        "reflected_temperature_k": t_refl, "expected": f(e), "expected_temperature_k": f(t_true)})
        print("  workflows", m)
    return out


def spectral_correction_case():
    """(a) with a non-grey target and window: the instrument (flat 8-14 um) indicated 350 K at
    the grey setting eps = 0.9, T_refl = 293.15 K; the real target has the lwir emissivity
    table below and sits behind a window table."""
    resp = Table([8e-6, 14e-6], [1.0, 1.0])
    eps = Table([8e-6, 9.5e-6, 11e-6, 14e-6], [0.92, 0.70, 0.85, 0.80])
    tw = Table([7e-6, 15e-6], [0.88, 0.80])
    sc = Scene(resp, False, eps, None, const(1.0), tw, const(0.03), 300, 293.15, 302, 301)
    bb = lambda t: integrate(sc.grid, lambda lam: planck(lam, t))
    setting = cond(0.9)
    s = grey_signal(bb, mp.mpf(350), setting)
    t = sc.solve_t(s, 360)
    print("  spectral correction")
    return {"scene": scene_json(sc), "indicated_k": 350.0, "setting": setting, "expected": f(t)}


def main():
    data = {
        "generator": "tests/data/gen_spectral.py (mpmath %s, %d digits)" % (mp.__version__, mp.mp.dps),
        "gauss_legendre": {str(n): gauss_legendre(n) for n in (4, 6, 8)},
    }
    print("quadrature bound ...")
    data["quadrature_bound"] = quadrature_bound()
    print("spectral cases ...")
    data["spectral"] = spectral_cases()
    print("sensitivities ...")
    data["sensitivities"] = [sensitivity_case(True), sensitivity_case(False)]
    print("workflows ...")
    data["sakuma_hattori"] = SH
    data["workflows"] = workflow_cases()
    data["spectral_correction"] = spectral_correction_case()
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "spectral_reference.json")
    with open(path, "w") as fh:
        json.dump(data, fh, indent=1)
        fh.write("\n")
    print("wrote", path)


if __name__ == "__main__":
    main()
