#!/usr/bin/env python3
"""Reference values for the direct (fast) path of the spectral densities.

Writes tests/data/fast_path_reference.json, read by tests/core_fast_path.rs.

Oracle: mpmath (arbitrary precision, mp.dps = 40), Planck's law evaluated in closed form with
mpmath's own exp/expm1 at 40 digits, at the exact value of each f64 input (inputs are
written with Python's repr, which round-trips), with the SI defining constants h, c, k
(exact since 2019; CODATA 2018) and c2 = hc/k.

Rows:
  * "bench": the bench grid of `spectrum_10k` (benches/native.rs, benches/js): 10 000
    wavelengths lambda_i = 1e-6 + i*step, step = (20e-6 - 1e-6)/9999, formed in f64 exactly
    as the benches form them, at T = 1000 K; spectral radiance per wavelength.
  * "spread": 3 000 seeded pseudo-random points (500 per spectral variable and quantity),
    x = c2/(lambda T) (or its wavenumber/frequency form) log-uniform in [1e-3, 690] and the
    coordinate log-uniform over a wide range, so every branch of the direct evaluation is hit.

Each value is stored as [hi, lo]: hi the f64 nearest to the exact value, lo the rest
(exact - hi) to 4 digits, so the test can measure errors below one ulp.

Run: python3 tests/data/gen_fast_path.py   (mpmath 1.3.0, a few seconds)
"""

import json
import os
import random

import mpmath
from mpmath import mp, mpf

mp.dps = 40

H = mpf("6.62607015e-34")
C = mpf("299792458")
K = mpf("1.380649e-23")
C2 = H * C / K


def density(variable, quantity, v, t):
    """Blackbody spectral radiance (energy or photon) per m, per m^-1 or per Hz."""
    v = mpf(v)
    t = mpf(t)
    # variable: "wavelength" (m), "wavenumber" (m^-1) or "frequency" (Hz)
    if variable == "wavelength":
        x = C2 / (v * t)
        e = 2 * H * C**2 / v**5 / mp.expm1(x)
        photon = e / (H * C / v)
    elif variable == "wavenumber":
        x = C2 * v / t
        e = 2 * H * C**2 * v**3 / mp.expm1(x)
        photon = e / (H * C * v)
    else:
        x = C2 * v / (C * t)
        e = 2 * H * v**3 / C**2 / mp.expm1(x)
        photon = e / (H * v)
    return (e if quantity == "energy" else photon), x


CODE = {"wavelength": "l", "wavenumber": "n", "frequency": "f"}


def split(value):
    hi = float(value)
    lo = float(mpmath.nstr(value - mpf(hi), 4, strip_zeros=False)) if value != hi else 0.0
    return [hi, lo]


def main():
    n = 10_000
    first, last = 1e-6, 20e-6
    step = (last - first) / (n - 1)
    bench = []
    for i in range(n):
        lam = first + i * step
        val, _ = density("wavelength", "energy", lam, 1000.0)
        bench.append(split(val))

    rng = random.Random(20261203)
    ranges = {  # log10 range of the coordinate, SI units
        "wavelength": (-8.0, -2.0),
        "wavenumber": (1.0, 7.0),
        "frequency": (9.0, 16.0),
    }
    spread = []
    for variable, (lo, hi) in ranges.items():
        for quantity in ("energy", "photon"):
            for _ in range(500):
                v = 10.0 ** rng.uniform(lo, hi)
                x_target = 10.0 ** rng.uniform(-3.0, mpmath.log10(690))
                if variable == "wavelength":
                    t = float(C2 / (mpf(v) * x_target))
                elif variable == "wavenumber":
                    t = float(C2 * mpf(v) / x_target)
                else:
                    t = float(C2 * mpf(v) / (C * x_target))
                val, x = density(variable, quantity, v, t)
                spread.append([CODE[variable], quantity[0], v, t, float(x)] + split(val))

    out = {
        "source": "mpmath %s, mp.dps = %d; tests/data/gen_fast_path.py" % (mpmath.__version__, mp.dps),
        "bench_temperature_k": 1000.0,
        "bench_first_m": first,
        "bench_last_m": last,
        "bench_count": n,
        "bench": bench,
        "spread_columns": ["variable (l: wavelength, n: wavenumber, f: frequency)", "quantity (e|p)", "v", "t_k", "x", "hi", "lo"],
        "spread": spread,
    }
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "fast_path_reference.json")
    with open(path, "w") as f:
        json.dump(out, f, separators=(",", ":"))
        f.write("\n")
    print("wrote", path, len(bench), "bench rows,", len(spread), "spread rows")


if __name__ == "__main__":
    main()
