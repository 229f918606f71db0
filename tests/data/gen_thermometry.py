#!/usr/bin/env python3
"""Reference values for the radiation-thermometry tests (tests/thermometry_*.rs).

Oracle: mpmath 1.3.0 at 60 significant digits (40 left mpmath.quad ~1e-11 short on the
sharply weighted cold cases). Nothing here reuses the crate's algorithms:
  * response-weighted integrals use mpmath.quad (tanh-sinh) per table segment, not Gauss-Legendre;
  * temperatures are found with mpmath.findroot on the defining equation, never a closed-form
    inverse or the crate's safeguarded Newton;
  * sensitivity coefficients are numerical derivatives (mpmath.diff) of the high-precision solve,
    not implicit differentiation.
Constants: CODATA 2018 exact defining constants h, c, k (c2 = hc/k, c1L = 2hc^2); ITS-90
c2 = 0.014388 m K and fixed-point temperatures from H. Preston-Thomas, Metrologia 27, 3 (1990)
(Table 1: Ag 1234.93 K, Au 1337.33 K, Cu 1357.77 K; section 3.3 for the radiance-ratio equation).

Run:  python3 tests/data/gen_thermometry.py   (writes tests/data/thermometry_reference.json)
"""
import json
import os

import mpmath as mp

mp.mp.dps = 60

H = mp.mpf("6.62607015e-34")
C = mp.mpf("299792458")
K = mp.mpf("1.380649e-23")
C1L = 2 * H * C**2
C2_CODATA = H * C / K
C2_ITS90 = mp.mpf("0.014388")


def f(x):
    """Shortest repr that round-trips to the nearest f64."""
    return float(x)


def planck(lam, t, c2=C2_CODATA):
    return C1L / lam**5 / mp.expm1(c2 / (lam * t))


def dplanck_dt(lam, t, c2=C2_CODATA):
    return mp.diff(lambda tt: planck(lam, tt, c2), t)


def response_at(wl, vals, lam):
    for i in range(len(wl) - 1):
        a, b = wl[i], wl[i + 1]
        if a <= lam <= b:
            return vals[i] + (vals[i + 1] - vals[i]) * (lam - a) / (b - a)
    return mp.mpf(0)


def weighted(wl, vals, t, g):
    """sum over segments of quad(R(lam) * g(lam), [a, b]); each segment is split geometrically
    into max(8, ln(b/a)/0.05) pieces so tanh-sinh sees a smooth integrand on each."""
    wl = [mp.mpf(w) for w in wl]
    vals = [mp.mpf(v) for v in vals]
    total = mp.mpf(0)
    for i in range(len(wl) - 1):
        a, b = wl[i], wl[i + 1]
        ra, rb = vals[i], vals[i + 1]
        if ra == 0 and rb == 0:
            continue
        m = max(8, int(mp.ceil(mp.log(b / a) / mp.mpf("0.05"))))
        pts = [a * (b / a) ** (mp.mpf(j) / m) for j in range(m + 1)]
        total += mp.quad(lambda lam: (ra + (rb - ra) * (lam - a) / (b - a)) * g(lam), pts)
    return total


def gauss_legendre_20():
    n = 20
    out = []
    for i in range(1, n // 2 + 1):
        x0 = mp.cos(mp.pi * (i - mp.mpf(1) / 4) / (n + mp.mpf(1) / 2))
        x = mp.findroot(lambda t: mp.legendre(n, t), x0)
        w = 2 / ((1 - x**2) * mp.diff(lambda t: mp.legendre(n, t), x) ** 2)
        out.append([f(x), f(w)])
    return out


RESPONSES = {
    "rect_8_14um": ([8e-6, 14e-6], [1.0, 1.0]),
    "trapezoid_3_5um": ([3.0e-6, 3.5e-6, 4.5e-6, 5.0e-6], [0.0, 1.0, 1.0, 0.2]),
    "si_0p8_1p1um": ([0.80e-6, 0.90e-6, 1.00e-6, 1.10e-6], [0.2, 0.8, 1.0, 0.1]),
    "triangle_650nm": ([0.645e-6, 0.650e-6, 0.655e-6], [0.0, 1.0, 0.0]),
    "rect_1_14um": ([1e-6, 14e-6], [1.0, 1.0]),
    "rect_1_1000um": ([1e-6, 1000e-6], [1.0, 1.0]),
    "ramp_0p3_30um": ([0.3e-6, 30e-6], [1.0, 0.0]),
}

INTEGRAL_CASES = [
    ("rect_8_14um", 250.0), ("rect_8_14um", 300.0), ("rect_8_14um", 600.0),
    ("rect_8_14um", 3000.0),
    ("trapezoid_3_5um", 300.0), ("trapezoid_3_5um", 1000.0),
    ("si_0p8_1p1um", 700.0), ("si_0p8_1p1um", 2000.0),
    ("triangle_650nm", 1234.93), ("triangle_650nm", 3000.0),
    # extreme but valid: tiny true values that are still inside the f64 range
    ("triangle_650nm", 100.0), ("rect_1_14um", 20.0), ("si_0p8_1p1um", 150.0),
    # very wide segments: hot (peak far inside the short end) and cold (Wien tail over 3 decades)
    ("rect_1_1000um", 5000.0), ("rect_1_1000um", 3.0), ("ramp_0p3_30um", 1500.0),
    ("ramp_0p3_30um", 6000.0),
]


def integral_cases():
    out = []
    for name, t in INTEGRAL_CASES:
        wl, vals = RESPONSES[name]
        tt = mp.mpf(t)
        s = weighted(wl, vals, tt, lambda lam: planck(lam, tt))
        ds = weighted(wl, vals, tt, lambda lam: dplanck_dt(lam, tt))
        m1 = weighted(wl, vals, tt, lambda lam: lam * planck(lam, tt))
        m2 = weighted(wl, vals, tt, lambda lam: lam * lam * planck(lam, tt))
        mean = m1 / s
        sd = mp.sqrt(m2 / s - mean**2)
        lam_t = C2_CODATA * s / (tt**2 * ds)
        out.append({
            "response": name, "temperature_k": t,
            "signal": f(s), "d_signal_dt": f(ds),
            "mean_wavelength_m": f(mean), "spread_m": f(sd),
            "limiting_effective_wavelength_m": f(lam_t),
        })
    return out


def effective_wavelength_cases():
    out = []
    for name, t1, t2 in [("si_0p8_1p1um", 1234.93, 1337.33), ("rect_8_14um", 273.15, 373.15)]:
        wl, vals = RESPONSES[name]
        s1 = weighted(wl, vals, mp.mpf(t1), lambda lam: planck(lam, mp.mpf(t1)))
        s2 = weighted(wl, vals, mp.mpf(t2), lambda lam: planck(lam, mp.mpf(t2)))
        le = C2_CODATA * (1 / mp.mpf(t1) - 1 / mp.mpf(t2)) / mp.log(s2 / s1)
        out.append({"response": name, "t1_k": t1, "t2_k": t2, "effective_wavelength_m": f(le)})
    return out


def response_moments():
    out = []
    for name, (wl, vals) in RESPONSES.items():
        r = lambda lam: 1
        m0 = weighted(wl, vals, None, lambda lam: 1)
        m1 = weighted(wl, vals, None, lambda lam: lam)
        m2 = weighted(wl, vals, None, lambda lam: lam * lam)
        mean = m1 / m0
        out.append({"response": name, "mean_m": f(mean), "spread_m": f(mp.sqrt(m2 / m0 - mean**2))})
    return out


def spectral_point_cases():
    out = []
    for lam, t in [(10e-6, 300.0), (0.65e-6, 1337.33), (0.65e-6, 100.0), (100e-6, 5.0), (1e-7, 300.0)]:
        out.append({"wavelength_m": lam, "temperature_k": t,
                    "radiance": f(planck(mp.mpf(lam), mp.mpf(t))),
                    "d_radiance_dt": f(dplanck_dt(mp.mpf(lam), mp.mpf(t)))})
    return out


FIXED = {"silver": "1234.93", "gold": "1337.33", "copper": "1357.77"}


def its90_cases():
    """ITS-90 section 3.3: L(T90)/L(T90(X)) = [exp(c2/(lam T90(X))) - 1]/[exp(c2/(lam T90)) - 1].
    Solved with findroot for T, once with c2 = 0.014388 m K and once with c2 = hc/k."""
    out = []
    for point, lam, ratio in [("gold", 650e-9, 10.0), ("gold", 650e-9, 0.25), ("silver", 900e-9, 3.0),
                              ("copper", 650e-9, 1000.0)]:
        tx = mp.mpf(FIXED[point])
        lamm = mp.mpf(lam)
        r = mp.mpf(ratio)

        def solve(c2):
            g = lambda t: (mp.expm1(c2 / (lamm * tx)) / mp.expm1(c2 / (lamm * t))) - r
            return mp.findroot(g, tx * (1 + mp.log(r) / 20))

        t90 = solve(C2_ITS90)
        tc = solve(C2_CODATA)
        out.append({"fixed_point": point, "wavelength_m": lam, "ratio": ratio,
                    "t90_k": f(t90), "t_codata_k": f(tc), "difference_k": f(tc - t90)})
    return out


MEAS = {
    "response": "si_0p8_1p1um", "object_temperature_k": 1100.0, "emissivity": 0.7,
    "reflected_temperature_k": 300.0, "path_transmittance": 0.95, "path_temperature_k": 290.0,
    "window": {"transmittance": 0.92, "reflectance": 0.04, "temperature_k": 310.0,
               "reflected_temperature_k": 305.0},
}


def measurement_case():
    """Forward measurement equation (module docs of src/thermometry/measurement.rs) with every
    signal from mpmath quad."""
    wl, vals = RESPONSES[MEAS["response"]]
    S = lambda t: weighted(wl, vals, mp.mpf(t), lambda lam: planck(lam, mp.mpf(t)))
    e, tau = mp.mpf(MEAS["emissivity"]), mp.mpf(MEAS["path_transmittance"])
    w = MEAS["window"]
    tw, rw = mp.mpf(w["transmittance"]), mp.mpf(w["reflectance"])
    scene = tau * (e * S(MEAS["object_temperature_k"]) + (1 - e) * S(MEAS["reflected_temperature_k"])) \
        + (1 - tau) * S(MEAS["path_temperature_k"])
    sig = tw * scene + rw * S(w["reflected_temperature_k"]) + (1 - tw - rw) * S(w["temperature_k"])
    d = dict(MEAS)
    d["signal"] = f(sig)
    return d


# Uncertainty budget on a Sakuma-Hattori signal model (closed form, evaluated in mpmath).
SH = {"a_m": 1.0e-5, "b_mk": 1.8e-4, "c": 1.0e6}
BUDGET = {
    "object_temperature_k": 350.0, "emissivity": 0.9, "reflected_temperature_k": 295.0,
    "path_transmittance": 0.98, "path_temperature_k": 293.0,
    # standard uncertainties
    "u_signal_rel": 1e-3, "u_emissivity": 0.02, "u_reflected_temperature_k": 5.0,
    "u_path_transmittance": 0.01, "u_path_temperature_k": 3.0,
}


def budget_case():
    """Sensitivity coefficients by numerical differentiation (mpmath.diff) of T_obj(p) obtained
    with findroot from the measurement equation; combined standard uncertainty by JCGM 100:2008
    eq. (10) (uncorrelated inputs): u_c^2 = sum (c_i u_i)^2."""
    a, b, c = (mp.mpf(SH[k]) for k in ("a_m", "b_mk", "c"))
    S = lambda t: c / mp.expm1(C2_CODATA / (a * t + b))
    p = BUDGET

    def meas(t, e, tr, tau, tp):
        return tau * (e * S(t) + (1 - e) * S(tr)) + (1 - tau) * S(tp)

    base = [mp.mpf(p["emissivity"]), mp.mpf(p["reflected_temperature_k"]),
            mp.mpf(p["path_transmittance"]), mp.mpf(p["path_temperature_k"])]
    signal = meas(mp.mpf(p["object_temperature_k"]), *base)

    def tobj(sig, e, tr, tau, tp):
        return mp.findroot(lambda t: meas(t, e, tr, tau, tp) - sig, mp.mpf(p["object_temperature_k"]))

    args = [signal] + base
    sens = []
    for i in range(5):
        def g(x, i=i):
            aa = list(args)
            aa[i] = x
            return tobj(*aa)
        sens.append(mp.diff(g, args[i]))
    us = [signal * mp.mpf(p["u_signal_rel"]), mp.mpf(p["u_emissivity"]),
          mp.mpf(p["u_reflected_temperature_k"]), mp.mpf(p["u_path_transmittance"]),
          mp.mpf(p["u_path_temperature_k"])]
    contrib = [abs(s * u) for s, u in zip(sens, us)]
    uc = mp.sqrt(sum(x**2 for x in contrib))
    d = {"model": SH, "inputs": p, "signal": f(signal),
         "sensitivities": [f(s) for s in sens], "standard_uncertainties": [f(u) for u in us],
         "contributions_k": [f(x) for x in contrib], "combined_k": f(uc),
         "shares": [f(x**2 / uc**2) for x in contrib]}
    return d


def two_colour_case():
    """Spectral-point ratio thermometer: R = rho * L(l1,T)/L(l2,T), rho = eps1/eps2.
    T by findroot; dT/drho by mpmath.diff of the solve at fixed R."""
    l1, l2, t, rho = mp.mpf("0.9e-6"), mp.mpf("1.05e-6"), mp.mpf(1500), mp.mpf("1.03")
    ratio = rho * planck(l1, t) / planck(l2, t)

    def solve(rr, rh):
        return mp.findroot(lambda tt: rh * planck(l1, tt) / planck(l2, tt) - rr, mp.mpf(1400))

    dtdrho = mp.diff(lambda rh: solve(ratio, rh), rho)
    dtdr = mp.diff(lambda rr: solve(rr, rho), ratio)
    return {"wavelength1_m": 0.9e-6, "wavelength2_m": 1.05e-6, "temperature_k": 1500.0,
            "emissivity_ratio": 1.03, "ratio": f(ratio), "d_t_d_emissivity_ratio": f(dtdrho),
            "d_t_d_ratio": f(dtdr)}


def main():
    data = {
        "generator": "tests/data/gen_thermometry.py (mpmath %s, %d digits)" % (mp.__version__, mp.mp.dps),
        "gauss_legendre_20": gauss_legendre_20(),
        "responses": {k: {"wavelengths_m": v[0], "values": v[1]} for k, v in RESPONSES.items()},
        "response_moments": response_moments(),
        "integrals": integral_cases(),
        "effective_wavelengths": effective_wavelength_cases(),
        "spectral_points": spectral_point_cases(),
        "its90": its90_cases(),
        "measurement": measurement_case(),
        "budget": budget_case(),
        "two_colour": two_colour_case(),
    }
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "thermometry_reference.json")
    with open(path, "w") as fh:
        json.dump(data, fh, indent=1)
        fh.write("\n")
    print("wrote", path)


if __name__ == "__main__":
    main()
