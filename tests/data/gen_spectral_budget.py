#!/usr/bin/env python3
"""Reference values for SpectralInstrument.uncertaintyBudget (tests/js/spectral_budget.test.mjs).

The sensitivity coefficients are the mpmath finite-difference coefficients already in
tests/data/spectral_reference.json (written by gen_spectral.py: central differences of 30-digit
root-finding solves, not the crate's implicit differentiation). On top of them this script
applies the law of propagation of JCGM 100:2008 by its published equations, in mpmath at 30
digits, independently of the crate's GUM engine:
  * eq. (10)  u_c^2 = sum_i (c_i u_i)^2                (uncorrelated inputs),
  * eq. (16)  u_c^2 = sum_i sum_j c_i c_j u_i u_j r_ij (correlated inputs),
  * eq. (G.2b) nu_eff = u_c^4 / sum_i (c_i u_i)^4 / nu_i, truncated to an integer (G.4.1 note),
  * the coverage factor k = t_p(nu_eff): the two-sided quantile of Student's t, found by
    mpmath.findroot on the t CDF written as the regularized incomplete beta function
    (mpmath.betainc), not by the crate's quantile; k for nu = inf is the normal quantile
    sqrt(2) erfinv(p).
Scenarios: the opaque scene and the semi-transparent scene of spectral_reference.json with
invented (demo-like) uncertainties.

Run:  python3 tests/data/gen_spectral_budget.py   (writes tests/data/spectral_budget_reference.json; ~1 s)
"""
import json
import os

import mpmath as mp

mp.mp.dps = 30
HERE = os.path.dirname(os.path.abspath(__file__))

# JS key of the budget -> key of the mpmath coefficient in spectral_reference.json
COEF = {
    "signal": "signal_coefficient",
    "emissivityScale": "emissivity_scale",
    "reflectanceScale": "reflectance_scale",
    "pathTransmittanceScale": "path_transmittance_scale",
    "windowTransmittanceScale": "window_transmittance_scale",
    "windowReflectanceScale": "window_reflectance_scale",
    "responseScale": "response_scale",
    "reflectedTemperatureK": "reflected_temperature",
    "pathTemperatureK": "path_temperature",
    "windowTemperatureK": "window_temperature",
    "windowReflectedTemperatureK": "window_reflected_temperature",
}


def t_cdf(t, nu):
    """Student's t CDF via the regularized incomplete beta function (Abramowitz & Stegun 26.7.1)."""
    x = nu / (nu + t * t)
    tail = mp.betainc(nu / 2, mp.mpf(1) / 2, 0, x, regularized=True) / 2
    return 1 - tail if t > 0 else tail


def coverage_factor(p, nu):
    if nu is None:
        return mp.sqrt(2) * mp.erfinv(p)
    target = (1 + mp.mpf(p)) / 2
    return mp.findroot(lambda t: t_cdf(t, mp.mpf(nu)) - target, mp.mpf(2))


def budget(coefs, inputs, correlations, p=None, k=None):
    names = [n for n in inputs]
    cu = {n: mp.mpf(coefs[COEF[n]]) * mp.mpf(inputs[n][0]) for n in names}
    var = sum(v * v for v in cu.values())
    for (a, b), r in correlations.items():
        var += 2 * mp.mpf(r) * cu[a] * cu[b]
    uc = mp.sqrt(var)
    out = {"combined_k": float(uc)}
    if k is not None:
        out["coverage_factor"] = float(k)
    else:
        finite = [(cu[n], inputs[n][1]) for n in names if inputs[n][1] is not None and cu[n] != 0]
        if correlations or not finite:
            nu = None
        else:
            nu = uc**4 / sum(v**4 / d for v, d in finite)
            out["effective_dof"] = float(nu)
            nu = int(mp.floor(nu))
            out["dof_used"] = nu
        out["coverage_factor"] = float(coverage_factor(mp.mpf(p), nu))
        k = coverage_factor(mp.mpf(p), nu)
    out["expanded_k"] = float(mp.mpf(k) * uc)
    out["contributions_k"] = {n: float(abs(cu[n])) for n in names}
    return out


def main():
    ref = json.load(open(os.path.join(HERE, "spectral_reference.json")))
    opaque, clear = ref["sensitivities"][0], ref["sensitivities"][1]
    assert opaque["opaque"] and not clear["opaque"]
    cases = []
    # 1. opaque target behind a window, every input with nu = inf, p = 0.95 (k = normal quantile)
    u1 = {
        "signal": (0.004 * opaque["coefficients"]["signal"], None),
        "emissivityScale": (0.02, None),
        "pathTransmittanceScale": (0.01, None),
        "windowTransmittanceScale": (0.005, None),
        "windowReflectanceScale": (0.1, None),
        "responseScale": (0.003, None),
        "reflectedTemperatureK": (2.0, None),
        "pathTemperatureK": (1.5, None),
        "windowTemperatureK": (1.0, None),
        "windowReflectedTemperatureK": (3.0, None),
    }
    cases.append({"scene": 0, "uncertainties": u1, "correlations": [], "p": 0.95,
                  **budget(opaque["coefficients"], u1, {}, p=0.95)})
    # 2. the same with the reflected and path temperatures read by one sensor (r = 0.8) and a
    #    stated k = 2 (eq. 16)
    cases.append({"scene": 0, "uncertainties": u1,
                  "correlations": [["reflectedTemperatureK", "pathTemperatureK", 0.8]], "k": 2.0,
                  **budget(opaque["coefficients"], u1, {("reflectedTemperatureK", "pathTemperatureK"): 0.8}, k=2)})
    # 3. semi-transparent target: its reflectance scale enters; the signal is a Type A mean of
    #    5 readings (nu = 4), the emissivity scale has nu = 12: Welch-Satterthwaite, p = 0.95
    u3 = {
        "signal": (0.01 * clear["coefficients"]["signal"], 4),
        "emissivityScale": (0.015, 12),
        "reflectanceScale": (0.05, None),
        "reflectedTemperatureK": (2.0, None),
    }
    cases.append({"scene": 1, "uncertainties": u3, "correlations": [], "p": 0.95,
                  **budget(clear["coefficients"], u3, {}, p=0.95)})
    for c in cases:
        c["uncertainties"] = {n: {"u": v[0], "nu": v[1]} for n, v in c["uncertainties"].items()}
    out = {
        "generator": "tests/data/gen_spectral_budget.py (mpmath %s, 30 digits)" % mp.__version__,
        "cases": cases,
    }
    with open(os.path.join(HERE, "spectral_budget_reference.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
