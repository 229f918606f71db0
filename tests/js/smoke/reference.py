#!/usr/bin/env python3
"""Writes reference.json for the tarball smoke test (tests/js/smoke/smoke.mjs).

Oracle: mpmath 1.3.0 at 40 significant digits, evaluating Planck's law directly from the exact SI
defining constants (h, c, k are exact since the 2019 SI; values as listed in CODATA 2018,
Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021), DOI 10.1103/RevModPhys.93.025010):

    L_lambda(lambda, T) = 2 h c^2 / lambda^5 / (exp(h c / (lambda k T)) - 1)   [W m^-2 sr^-1 m^-1]

Also exact Celsius-to-kelvin conversions (see "units" below).

The smoke test only proves that the installed npm package computes through its real wasm module
in every environment (Node, web entry, browser, worker); the physics accuracy itself is tested
by the Rust and JS suites against the project's full reference tables.

Run: python3 tests/js/smoke/reference.py > tests/js/smoke/reference.json
"""
import json

import mpmath as mp

mp.mp.dps = 40
H = mp.mpf("6.62607015e-34")  # J s, exact
C = mp.mpf("299792458")  # m/s, exact
K = mp.mpf("1.380649e-23")  # J/K, exact


def spectral_radiance_wavelength(wavelength_m, temperature_k):
    lam = mp.mpf(wavelength_m)
    t = mp.mpf(temperature_k)
    return 2 * H * C**2 / lam**5 / mp.expm1(H * C / (lam * K * t))


cases = [
    # A made-up check point: a room-temperature target seen at 10 um.
    {"wavelength_m": "10e-6", "temperature_k": "300"},
    # A made-up furnace wall seen at 0.65 um.
    {"wavelength_m": "0.65e-6", "temperature_k": "1500"},
]
# Celsius to kelvin, exact by definition: T/K = t/degC + 273.15 (SI Brochure, 9th ed., 2019,
# sect. 2.3.1). The ITS-90 fixed points here are only convenient values (Preston-Thomas 1990,
# Table 1: freezing points of zinc 419.527 degC and gold 1064.18 degC).
celsius = ["0", "25", "419.527", "1064.18"]
out = {
    "units": [
        {"celsius": float(mp.mpf(c)), "kelvin": float(mp.mpf(c) + mp.mpf("273.15"))} for c in celsius
    ],
    "oracle": "mpmath %s, mp.dps=40, Planck's law from exact SI constants (CODATA 2018)" % mp.__version__,
    "quantity": "blackbody spectral radiance per unit wavelength, W m^-2 sr^-1 m^-1, vacuum, emissivity 1",
    "cases": [
        {
            "wavelength_m": float(mp.mpf(c["wavelength_m"])),
            "temperature_k": float(mp.mpf(c["temperature_k"])),
            "radiance_w_m2_sr_m": float(spectral_radiance_wavelength(c["wavelength_m"], c["temperature_k"])),
        }
        for c in cases
    ],
}
print(json.dumps(out, indent=2))
