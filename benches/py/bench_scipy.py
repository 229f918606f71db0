#!/usr/bin/env python3
"""Baseline B: what a scientist would use - SciPy `integrate.quad` for band radiances and
`optimize.brentq` (around quad) for the band inverse, quad with break points for the
response-weighted signal, with SciPy's default tolerances and a
plain Python Planck function (math.expm1).

Emits one JSON line per case on stdout (same fields as the Rust and Node harnesses):
{"impl": "scipy", "case": ..., "ns_median": ..., "ns_min": ..., "samples": ..., "iters": ...,
 "value": ...}. The table script compares `value` with benches/data/bench_reference.json.

Run by pkg-scripts/bench.sh inside a private virtual environment (.venv-bench).
"""

import json
import math
import statistics
import sys
import time

import numpy as np
import scipy
from scipy import integrate, optimize

H = 6.62607015e-34
C = 299792458.0
K = 1.380649e-23
C1L = 2 * H * C * C
C2 = H * C / K


def planck(lam, t):
    """Spectral radiance per wavelength, W m^-2 sr^-1 m^-1."""
    return C1L / lam**5 / math.expm1(C2 / (lam * t))


def band(lo, hi, t):
    return integrate.quad(planck, lo, hi, args=(t,))[0]


def response_signal(wl, resp, t):
    """Response-weighted signal: quad of np.interp(R) * L over the response's support, with the
    table's wavelengths as break points."""
    return integrate.quad(lambda x: float(np.interp(x, wl, resp)) * planck(x, t), wl[0], wl[-1],
                          args=(), points=wl[1:-1])[0]


def band_inverse(lo, hi, radiance):
    return optimize.brentq(lambda t: band(lo, hi, t) - radiance, 50.0, 5000.0)


def measure(fn, sample_s=0.02, samples=15, max_s=4.0):
    t0 = time.perf_counter()
    calls = 0
    while time.perf_counter() - t0 < 0.1 or calls < 3:
        fn()
        calls += 1
    per_call = (time.perf_counter() - t0) / calls
    iters = max(1, int(math.ceil(sample_s / per_call)))
    times = []
    start = time.perf_counter()
    for _ in range(samples):
        a = time.perf_counter_ns()
        for _ in range(iters):
            fn()
        times.append((time.perf_counter_ns() - a) / iters)
        if len(times) >= 5 and time.perf_counter() - start > max_s:
            break
    return statistics.median(times), min(times), len(times), iters


def emit(case, fn, note=None):
    med, mn, n, iters = measure(fn)
    rec = {"impl": "scipy", "case": case, "ns_median": med, "ns_min": mn, "samples": n,
           "iters": iters, "value": fn()}
    if note:
        rec["note"] = note
    print(json.dumps(rec), flush=True)


def main():
    ref = json.load(open(sys.argv[1])) if len(sys.argv) > 1 else None
    inv_radiance = 106.44446609530523
    if ref is not None:
        inv_radiance = ref["cases"]["band_inverse_8_14"]["inputs"]["radiance"]
    print(json.dumps({"impl": "scipy", "meta": True, "scipy": scipy.__version__,
                      "python": sys.version.split()[0]}), flush=True)
    emit("spectral_single", lambda: planck(10e-6, 300.0))
    emit("band_8_14_300", lambda: band(8e-6, 14e-6, 300.0), "quad, default tolerances")
    emit("band_1_2_1500", lambda: band(1e-6, 2e-6, 1500.0), "quad, default tolerances")
    if ref is not None:
        r = ref["cases"]["response_signal_400"]["inputs"]
        wl, resp = np.array(r["wavelengths_m"]), np.array(r["response"])
        emit("response_signal_400", lambda: response_signal(wl, resp, r["temperature_k"]),
             "quad with the table points as break points, np.interp for R")
    emit("band_inverse_8_14", lambda: band_inverse(8e-6, 14e-6, inv_radiance),
         "brentq on [50, 5000] K around quad, default tolerances")


if __name__ == "__main__":
    main()
