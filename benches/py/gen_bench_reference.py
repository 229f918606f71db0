#!/usr/bin/env python3
"""Reference values for the benchmark cases (benches/data/bench_reference.json).

The benchmark table reports, next to each speed, how far each implementation's answer is from
the exact value. "Exact" here comes from mpmath at 40 significant digits, evaluated directly
from the definitions (Planck's law in closed form, band integrals by mpmath's tanh-sinh
quadrature `mp.quad`, Fermi-Dirac and Bose-Einstein integrals by `mp.polylog`, the
Sakuma-Hattori inverse in closed form). None of this reuses the package's algorithms (the
package evaluates band integrals by series, not quadrature).

Constants: CODATA 2018 / SI 2019 exact h, c, k (Tiesinga et al., Rev. Mod. Phys. 93, 025010,
2021, doi:10.1103/RevModPhys.93.025010).

The response curve, the calibration coefficients and the frame are invented for the benchmark
(a made-up long-wave camera); they are demo data, not measurements.

Run:  python3 benches/py/gen_bench_reference.py   (needs mpmath; 1.3.0 was used)
"""

import datetime
import json
import os

import mpmath as mp

mp.mp.dps = 40

H = mp.mpf("6.62607015e-34")
C = mp.mpf("299792458")
K = mp.mpf("1.380649e-23")
C1L = 2 * H * C**2
C2 = H * C / K


def planck_l(lam, t):
    """Spectral radiance per wavelength, W m^-2 sr^-1 m^-1 (blackbody, vacuum)."""
    lam = mp.mpf(lam)
    t = mp.mpf(t)
    return C1L / lam**5 / mp.expm1(C2 / (lam * t))


def band_l(lo, hi, t):
    """Band radiance W m^-2 sr^-1 by tanh-sinh quadrature, split into 8 pieces."""
    pts = mp.linspace(mp.mpf(lo), mp.mpf(hi), 9)
    return mp.quad(lambda x: planck_l(x, t), pts)


def s(x):
    return mp.nstr(x, 30, min_fixed=1, max_fixed=0)


cases = {}

# 1. single spectral radiance, 10 um at 300 K
cases["spectral_single"] = {
    "inputs": {"wavelength_m": 10e-6, "temperature_k": 300.0},
    "value": s(planck_l(mp.mpf(10e-6), 300)),
    "unit": "W m^-2 sr^-1 m^-1",
}

# 2. 10 000-point spectrum, lambda_i = 1 um + i * 19 um / 9999 (computed in f64 exactly as the
#    benchmarks do), T = 1000 K; reference at every 100th index and the last one.
n = 10000
lam0, lam1 = 1e-6, 20e-6
step = (lam1 - lam0) / (n - 1)
idx = list(range(0, n, 100)) + [n - 1]
lams = [lam0 + i * step for i in idx]
cases["spectrum_10k"] = {
    "inputs": {"n": n, "first_m": lam0, "last_m": lam1, "temperature_k": 1000.0,
               "grid": "lambda_i = first + i*((last-first)/(n-1)) in f64"},
    "sample_index": idx,
    "sample_values": [s(planck_l(mp.mpf(x), 1000)) for x in lams],
    "unit": "W m^-2 sr^-1 m^-1",
}

# 3./4. band radiances
cases["band_8_14_300"] = {
    "inputs": {"lower_m": 8e-6, "upper_m": 14e-6, "temperature_k": 300.0},
    "value": s(band_l(mp.mpf(8e-6), mp.mpf(14e-6), 300)),
    "unit": "W m^-2 sr^-1",
}
cases["band_1_2_1500"] = {
    "inputs": {"lower_m": 1e-6, "upper_m": 2e-6, "temperature_k": 1500.0},
    "value": s(band_l(mp.mpf(1e-6), mp.mpf(2e-6), 1500)),
    "unit": "W m^-2 sr^-1",
}

# 5. band inverse: the 8-14 um band radiance of a 350 K blackbody, rounded to f64, is the input;
#    the exact answer is the temperature whose band radiance equals that f64 number.
l350 = band_l(mp.mpf(8e-6), mp.mpf(14e-6), 350)
l350_f64 = float(l350)
t_exact = mp.findroot(lambda t: band_l(mp.mpf(8e-6), mp.mpf(14e-6), t) - mp.mpf(l350_f64), 350)
cases["band_inverse_8_14"] = {
    "inputs": {"lower_m": 8e-6, "upper_m": 14e-6, "radiance": l350_f64},
    "value": s(t_exact),
    "unit": "K",
}

# 6. response-weighted signal of an invented long-wave camera at 400 K: linear interpolation of
#    the table, zero outside; integrated segment by segment with mp.quad.
resp_m = [7.5e-6, 8e-6, 9e-6, 10e-6, 11e-6, 12e-6, 13e-6, 14e-6, 14.5e-6]
resp_val = [0.0, 0.55, 0.85, 1.0, 0.97, 0.9, 0.75, 0.5, 0.0]


def response_signal(t):
    total = mp.mpf(0)
    for i in range(len(resp_m) - 1):
        a, b = mp.mpf(resp_m[i]), mp.mpf(resp_m[i + 1])
        ra, rb = mp.mpf(resp_val[i]), mp.mpf(resp_val[i + 1])

        def f(x, a=a, b=b, ra=ra, rb=rb):
            return (ra + (rb - ra) * (x - a) / (b - a)) * planck_l(x, t)

        total += mp.quad(f, [a, b])
    return total


cases["response_signal_400"] = {
    "inputs": {"wavelengths_m": resp_m, "response": resp_val, "temperature_k": 400.0},
    "value": s(response_signal(400)),
    "unit": "W m^-2 sr^-1",
}

# 6b. Spectral-table signal: the spectral measurement equation of an invented long-wave scene
#     with 200-point tables over 8-14 um on different grids (response; target emissivity, opaque;
#     path transmittance; window transmittance 150 points, window reflectance 120 points), object
#     at 400 K, reflected 295 K, path 290 K, window 300 K, window-reflected 305 K. The tables are
#     those of `lwir_200` in tests/data/gen_spectral.py (same formulas, rounded to 4 decimals),
#     written out below so every harness reads the same numbers. Reference: the piecewise-linear
#     interpolants integrated with mp.quad per interval of the union of the grids (never across a
#     kink), each interval split geometrically so tanh-sinh sees a smooth integrand.
def grid_um(lo, hi, n, shift=0.0):
    """n points from lo to hi (um), interior points shifted by `shift` of a step; in m."""
    step = (hi - lo) / (n - 1)
    pts = [lo] + [lo + step * (i + shift) for i in range(1, n - 1)] + [hi]
    return [round(p, 6) * 1e-6 for p in pts]


def smooth(wl, fn):
    return [round(fn(w * 1e6), 4) for w in wl]


def lwir_tables():
    import math
    wl_r = grid_um(8, 14, 200)
    wl_e = grid_um(8, 14, 200, 0.37)
    wl_p = grid_um(8, 14, 200, 0.61)
    wl_w = grid_um(8, 14, 150, 0.5)
    wl_rw = grid_um(8, 14, 120, 0.25)
    return {
        "response": (wl_r, smooth(wl_r, lambda u: min(1.0, 0.3 + 0.7 * math.sin(math.pi * (u - 8) / 6) ** 0.5))),
        "emissivity": (wl_e, smooth(wl_e, lambda u: 0.88 - 0.35 * math.exp(-((u - 9.4) / 0.45) ** 2)
                                    + 0.03 * math.sin(3 * u))),
        "path_transmittance": (wl_p, smooth(wl_p, lambda u: 0.97 - 0.12 * math.exp(-((u - 9.6) / 0.15) ** 2)
                                            - 0.02 * (u - 8) / 6)),
        "window_transmittance": (wl_w, smooth(wl_w, lambda u: 0.78 - 0.25 * math.exp(-((u - 12.2) / 0.3) ** 2))),
        "window_reflectance": (wl_rw, smooth(wl_rw, lambda u: 0.05 + 0.01 * math.cos(u))),
    }


def linear(wl, vals):
    """The piecewise-linear interpolant of a table (exact binary grid values)."""
    w = [mp.mpf(x) for x in wl]
    v = [mp.mpf(x) for x in vals]

    def at(lam):
        lo, hi = 0, len(w) - 1
        while hi - lo > 1:
            mid = (lo + hi) // 2
            if w[mid] <= lam:
                lo = mid
            else:
                hi = mid
        return v[lo] + (v[hi] - v[lo]) * (lam - w[lo]) / (w[hi] - w[lo])

    return w, at


def table_signal(tables, t, t_refl, t_path, t_win, t_int):
    fns = {k: linear(*tab) for k, tab in tables.items()}
    r, e, tp = fns["response"][1], fns["emissivity"][1], fns["path_transmittance"][1]
    tw, rw = fns["window_transmittance"][1], fns["window_reflectance"][1]
    t, t_refl, t_path, t_win, t_int = (mp.mpf(x) for x in (t, t_refl, t_path, t_win, t_int))

    def g(lam):
        ev, tpv, twv, rwv = e(lam), tp(lam), tw(lam), rw(lam)
        scene = tpv * (ev * planck_l(lam, t) + (1 - ev) * planck_l(lam, t_refl)) + (1 - tpv) * planck_l(lam, t_path)
        return r(lam) * (twv * scene + rwv * planck_l(lam, t_int) + (1 - twv - rwv) * planck_l(lam, t_win))

    # the response is positive over its whole grid: the band is [8, 14] um
    lo, hi = fns["response"][0][0], fns["response"][0][-1]
    grid = sorted({x for w, _ in fns.values() for x in w if lo <= x <= hi})
    total = mp.mpf(0)
    for a, b in zip(grid[:-1], grid[1:]):
        m = max(1, int(mp.ceil(mp.log(b / a) / mp.mpf("0.05"))))
        total += mp.quad(g, [a * (b / a) ** (mp.mpf(j) / m) for j in range(m + 1)])
    return total


lwir = lwir_tables()
lwir_temps = {"temperature_k": 400.0, "reflected_temperature_k": 295.0, "path_temperature_k": 290.0,
              "window_temperature_k": 300.0, "window_reflected_temperature_k": 305.0}
assert all(v > 0 for v in lwir["response"][1])
sig_table = table_signal(lwir, 400, 295, 290, 300, 305)
# Cross-check with the spectral tests' reference (tests/data/spectral_reference.json, written by
# gen_spectral.py at 30 digits with its own code): the same scene's signal as an f64.
_spec_ref = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "tests", "data",
                         "spectral_reference.json")
if os.path.exists(_spec_ref):
    with open(_spec_ref) as fh:
        _lw = json.load(fh)["spectral"]["lwir_200"]
    for k, (wl, vals) in lwir.items():
        assert _lw["scene"][k]["wavelengths_m"] == wl and _lw["scene"][k]["values"] == vals, k
    assert abs(mp.mpf(_lw["signal"]) / sig_table - 1) < mp.mpf("1e-15"), (_lw["signal"], sig_table)
cases["signal_table_400"] = {
    "inputs": {
        **lwir_temps,
        "tables": {k: {"wavelengths_m": wl, "values": vals} for k, (wl, vals) in lwir.items()},
        "note": "energy response (relative); opaque target (reflectance 1 - emissivity); tables linear "
                "between points, zero response outside 8-14 um",
    },
    "value": s(sig_table),
    "unit": "W m^-2 sr^-1 (times the response unit)",
}

# 7. Sakuma-Hattori inverse T = (c2 / ln(C/S + 1) - B) / A with invented coefficients.
SH_A, SH_B, SH_C = 1.05e-5, 1.5e-4, 2.0e4


def sh_signal(t):
    return mp.mpf(SH_C) / mp.expm1(C2 / (mp.mpf(SH_A) * t + mp.mpf(SH_B)))


def sh_inverse(sig):
    return (C2 / mp.log(mp.mpf(SH_C) / mp.mpf(sig) + 1) - mp.mpf(SH_B)) / mp.mpf(SH_A)


sig_350 = float(sh_signal(mp.mpf(350)))
cases["sh_inverse"] = {
    "inputs": {"a_m": SH_A, "b_m_k": SH_B, "c": SH_C, "c2": "CODATA 2018", "signal": sig_350},
    "value": s(sh_inverse(sig_350)),
    "unit": "K",
}

# 8. Quantum statistics (normalised Fermi-Dirac integral F_j(eta) = -Li_{j+1}(-e^eta),
#    Bose-Einstein integral g_s(z) = Li_s(z)).
cases["be_occupancy"] = {"inputs": {"x": 2.0}, "value": s(1 / mp.expm1(2)), "unit": "1"}
cases["fd_occupancy"] = {"inputs": {"x": 2.0}, "value": s(1 / (mp.exp(2) + 1)), "unit": "1"}
fd_eta = 1.5


def fd_half(eta):
    """F_{1/2}(eta) = -Li_{3/2}(-e^eta) (mpmath returns an mpc with zero imaginary part)."""
    v = -mp.polylog(mp.mpf(3) / 2, -mp.exp(eta))
    return mp.re(v)


fd_val = fd_half(fd_eta)
# Cross-check the polylog route against direct quadrature of the defining integral.
fd_quad = mp.quad(lambda t: mp.sqrt(t) / (mp.exp(t - fd_eta) + 1), [0, fd_eta, mp.inf]) / mp.gamma(1.5)
assert abs(fd_quad / fd_val - 1) < mp.mpf("1e-30"), (fd_quad, fd_val)
cases["fd_half"] = {"inputs": {"eta": fd_eta}, "value": s(fd_val), "unit": "1"}
fd_val_f64 = float(fd_val)
eta_exact = mp.findroot(lambda e: fd_half(e) - mp.mpf(fd_val_f64), fd_eta)
cases["fd_half_inverse"] = {"inputs": {"value": fd_val_f64}, "value": s(eta_exact), "unit": "1"}
cases["be_g32"] = {"inputs": {"s": 1.5, "z": 0.5}, "value": s(mp.re(mp.polylog(mp.mpf(3) / 2, mp.mpf("0.5")))),
                   "unit": "1"}

# 9. Monte Carlo (JCGM 101), 10^5 trials of the measurement equation of the invented camera
#    (the Sakuma-Hattori curve above, emissivity 0.95, reflected 293.15 K) at the reading of a
#    350 K object, with a normal signal uncertainty, a rectangular emissivity and a normal
#    reflected temperature. The value a run reports is its standard uncertainty u(y) (the
#    standard deviation of the 10^5 output temperatures, seed 1); it is compared with the GUM's
#    first-order u_c of the same inputs, computed here from numerical derivatives (mp.diff) of
#    the closed-form inverse. The two differ by the sampling error of the run (about
#    u/sqrt(2M) = 0.2 % of u for M = 10^5) and by the model's non-linearity (negligible at these
#    uncertainties): the table's |dT| for this row is that difference, not a rounding error.
MC_EPS, MC_T_REFL, MC_T_OBJ = 0.95, 293.15, 350
mc_signal = float(MC_EPS * sh_signal(mp.mpf(MC_T_OBJ)) + (1 - MC_EPS) * sh_signal(mp.mpf(MC_T_REFL)))
mc_u = {"signal": 0.5, "emissivity": float(mp.mpf("0.01") / mp.sqrt(3)), "reflected_temperature_k": 2.0}


def object_temperature(sig, eps, t_refl):
    s_obj = (sig - (1 - eps) * sh_signal(t_refl)) / eps
    return (C2 / mp.log(mp.mpf(SH_C) / s_obj + 1) - mp.mpf(SH_B)) / mp.mpf(SH_A)


x0 = [mp.mpf(mc_signal), mp.mpf(MC_EPS), mp.mpf(MC_T_REFL)]
mc_sens = []
for k in range(3):
    def along(v, k=k):
        x = list(x0)
        x[k] = v
        return object_temperature(*x)
    mc_sens.append(mp.diff(along, x0[k]))
mc_uc = mp.sqrt(sum((c * mp.mpf(u)) ** 2 for c, u in zip(mc_sens, mc_u.values())))
cases["monte_carlo_1e5"] = {
    "inputs": {"a_m": SH_A, "b_m_k": SH_B, "c": SH_C, "c2": "CODATA 2018",
               "emissivity": MC_EPS, "reflected_temperature_k": MC_T_REFL, "signal": mc_signal,
               "u_signal": mc_u["signal"], "u_emissivity": mc_u["emissivity"],
               "emissivity_distribution": "rectangular",
               "u_reflected_temperature_k": mc_u["reflected_temperature_k"],
               "trials": 100000, "seed": 1},
    "temperature_k": s(object_temperature(*x0)),
    "value": s(mc_uc),
    "compared": "u(y) of the run vs the GUM u_c (first order, mpmath derivatives); they differ by the sampling error",
    "unit": "K",
}

out = {
    "oracle": "mpmath " + mp.__version__ + " (mp.quad tanh-sinh, mp.polylog, closed forms)",
    "mp_dps": mp.mp.dps,
    "generated": datetime.date.today().isoformat(),
    "constants": "CODATA 2018 exact h, c, k; c1L = 2hc^2, c2 = hc/k",
    "note": "Invented demo inputs (response curve, calibration coefficients); values are decimal strings.",
    "cases": cases,
}
path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "data", "bench_reference.json")
with open(path, "w") as fh:
    json.dump(out, fh, indent=1)
    fh.write("\n")
print("wrote", os.path.normpath(path))
