#!/usr/bin/env python3
"""Reference values for the quantaband quantum-statistics module (src/stats).

Oracle: mpmath (arbitrary precision, mp.dps = 50). Every reference value is computed with
mpmath's own routines (exp/expm1, polylog, zeta, quad, coth), never with quantaband's
algorithms. Inputs are written as decimal strings; mpmath evaluates at the *exact* binary64
value of each input (mpf(float(s))), so a Rust test that parses the same string compares like
with like.

Outputs
  tests/data/stats_reference.json  header + rows ["table", input..., expected]
                                   (one row per line so the Rust and JS tests can read it
                                   without a JSON library; it is also valid JSON)
  src/stats/tables.rs              series coefficients used by the Rust code (zeta values),
                                   also from mpmath; --tables writes it.

Regenerate (about 20 s):  python3 tests/data/gen_stats.py [--tables]
"""
import datetime
import json
import sys

import mpmath
from mpmath import mp, mpf

mp.dps = 50

H = mpf("6.62607015e-34")  # Planck constant, exact (SI 2019)
K = mpf("1.380649e-23")  # Boltzmann constant, exact (SI 2019)
C = mpf(299792458)  # speed of light, exact
HBAR = H / (2 * mp.pi)
U = mpf("1.66053906660e-27")  # atomic mass constant, CODATA 2018
ME = mpf("9.1093837015e-31")  # electron mass, CODATA 2018


def d(s):
    """Exact value of the binary64 nearest to decimal string s."""
    return mpf(float(s))


def fmt(v):
    v = mpmath.re(v) if isinstance(v, mpmath.mpc) else v
    if v == 0:
        return "0"
    return mpmath.nstr(v, 25, min_fixed=1, max_fixed=0)


rows = []


def row(table, *vals):
    rows.append([table] + [v if isinstance(v, str) else fmt(v) for v in vals])


# ---- occupancies ------------------------------------------------------------------------------
XS = ["1e-300", "1e-100", "1e-10", "1e-5", "0.001", "0.1", "0.5", "1", "1.5", "2", "3.25", "5",
      "10", "20", "36", "37.5", "40", "50", "100", "300", "600", "700", "709.5", "720", "744"]
for s in XS:
    x = d(s)
    row("bose_einstein", s, 1 / mpmath.expm1(x))
    row("fermi_dirac", s, 1 / (mpmath.exp(x) + 1))
    row("fermi_dirac", "-" + s, 1 / (mpmath.exp(-x) + 1))
    row("maxwell_boltzmann", s, mpmath.exp(-x))
row("fermi_dirac", "0", mpf(1) / 2)

# (frequency_hz, temperature_k) -> mean thermal photon number
PHOTON = [("1e6", "0.01"), ("1.4204e9", "2.725"), ("100e9", "2.725"), ("100e9", "300"),
          ("1e12", "4.2"), ("1e12", "300"), ("3e13", "300"), ("5e14", "3000"), ("1e15", "50"),
          ("1e3", "1e6"), ("2.5e11", "0.02")]
for f, t in PHOTON:
    x = H * d(f) / (K * d(t))
    n = 1 / mpmath.expm1(x)
    row("thermal_photon_number", f, t, n)
    # Rayleigh-Jeans brightness temperature (h f / k) n
    row("rayleigh_jeans_temperature", f, t, H * d(f) / K * n)
    # noise temperature with zero-point term (h f / 2k) coth(h f / 2kT)
    row("quantum_noise_temperature", f, t, H * d(f) / (2 * K) * mpmath.coth(x / 2))

# ---- complete Fermi-Dirac integrals, normalised: F_j = -Li_{j+1}(-e^eta) ----------------------
ETAS = ["-700", "-200", "-50", "-40", "-20", "-10", "-5", "-2", "-1.5", "-1.0001", "-1", "-0.9999",
        "-0.5", "-0.1", "0", "1e-8", "0.1", "0.5", "1", "1.7", "2", "3", "5", "7.5", "10", "12.5",
        "15", "20", "25", "30", "34.9", "35", "35.1", "39.9", "40", "40.1", "50", "75", "100",
        "150", "200", "1000", "1e6"]
# dense grids around the method cut-offs of src/stats/fermi_dirac.rs (eta = -3 and 37) and a
# sweep of the quadrature range
ETAS += [f"{-4 + 0.25 * i:g}" for i in range(17)] + [f"{30 + 0.5 * i:g}" for i in range(21)]
ETAS += [f"{-40 + 2.7 * i:.4g}" for i in range(30)] + [f"{0.7 * i + 0.05:.4g}" for i in range(53)]
ETAS = sorted(set(ETAS), key=float)
for j, js in [(mpf(-1) / 2, "-0.5"), (mpf(1) / 2, "0.5"), (mpf(3) / 2, "1.5")]:
    for es in ETAS:
        eta = d(es)
        v = -mpmath.polylog(j + 1, -mpmath.exp(eta))
        if -60 < eta < 250:  # independent cross-check by quadrature of the defining integral
            e0 = max(eta, mpf(0))
            q = mpmath.quad(lambda t: t ** j / (mpmath.exp(t - eta) + 1),
                            [0, e0 / 2, e0, e0 + 20, e0 + 80, mpmath.inf]) / mpmath.gamma(j + 1)
            assert abs(q / v - 1) < mpf(10) ** -25, (js, es, v, q)
        row("fermi_dirac_integral", js, es, v)

# ---- Bose-Einstein integrals g_s(z) = Li_s(z), 0 <= z <= 1 --------------------------------------
ZS = ["0", "1e-300", "1e-10", "0.01", "0.1", "0.3", "0.49", "0.5", "0.51", "0.7", "0.9", "0.99",
      "0.999", "0.999999", "0.9999999999", "1"]
for s in ["1.5", "2.5", "2", "3", "4", "5", "7", "10", "15", "19", "20", "21", "30", "60"]:
    for zs in ZS:
        z = d(zs)
        v = mpmath.zeta(d(s)) if z == 1 else mpmath.polylog(d(s), z)
        row("bose_einstein_integral", s, zs, v)
for s in ["1.5", "2.5", "3", "4", "5"]:
    row("zeta", s, mpmath.zeta(d(s)))

# ---- ideal Bose gas critical temperature: T_c = 2 pi hbar^2/(m k) (n/zeta(3/2))^(2/3) ------------
for n, m in [("1e20", "87"), ("2.5e19", "23"), ("1e26", "4.002602"), ("1e12", "1"),
             ("1e300", "1e-3")]:
    mass = d(m) * U
    tc = 2 * mp.pi * HBAR ** 2 / (mass * K) * (d(n) / mpmath.zeta(mpf(3) / 2)) ** (mpf(2) / 3)
    row("bose_critical_temperature_u", n, m, tc)
row("bose_critical_temperature_me", "1e24",
    2 * mp.pi * HBAR ** 2 / (ME * K) * (mpf(10) ** 24 / mpmath.zeta(mpf(3) / 2)) ** (mpf(2) / 3))

# ---- blackbody photon gas ---------------------------------------------------------------------
A = 8 * mp.pi ** 5 * K ** 4 / (15 * H ** 3 * C ** 3)  # radiation constant a
for ts in ["1e-70", "2.725", "300", "5772", "1e6", "1e80"]:
    t = d(ts)
    row("photon_number_density", ts, 2 * mpmath.zeta(3) / mp.pi ** 2 * (K * t / (HBAR * C)) ** 3)
    row("photon_energy_density", ts, A * t ** 4)
    row("photon_entropy_density", ts, 4 * A * t ** 3 / 3)
    row("photon_pressure", ts, A * t ** 4 / 3)
    row("mean_photon_energy", ts, mp.pi ** 4 / (30 * mpmath.zeta(3)) * K * t)

# ---- photon density of states and spectral energy density per unit energy ---------------------
for es, ts in [("1e-22", "2.725"), ("1.602176634e-19", "300"), ("1.602176634e-19", "5772"),
               ("3e-21", "1e4"), ("1e-15", "300"), ("1e-25", "1e-3")]:
    e, t = d(es), d(ts)
    g = 8 * mp.pi * e ** 2 / (H * C) ** 3
    row("photon_density_of_states", es, g)
    row("spectral_energy_density_energy", es, ts, g * e / mpmath.expm1(e / (K * t)))

header = {
    "oracle": "mpmath",
    "oracle_version": mpmath.__version__,
    "mp_dps": mp.dps,
    "generated_utc": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%M:%SZ"),
    "generator": "tests/data/gen_stats.py",
    "constants": "SI 2019 exact h, k, c; CODATA 2018 u and m_e",
    "row_format": "[table, inputs..., expected]; inputs are decimal strings evaluated at their "
                  "exact binary64 value; expected has 25 significant digits",
    "conventions": "fermi_dirac_integral: [j, eta, F_j(eta)] normalised, "
                   "F_j = 1/Gamma(j+1) * int_0^inf t^j/(exp(t-eta)+1) dt = -polylog(j+1, -exp(eta)); "
                   "bose_einstein_integral: [s, z, Li_s(z)]; bose_critical_temperature_u: "
                   "[n m^-3, mass in u, T_c K]; rayleigh_jeans_temperature and "
                   "quantum_noise_temperature: [f Hz, T K, K]",
}

with open("tests/data/stats_reference.json", "w") as fh:
    fh.write("{\n\"header\": " + json.dumps(header) + ",\n\"rows\": [\n")
    fh.write(",\n".join(json.dumps(r) for r in rows))
    fh.write("\n]}\n")
json.load(open("tests/data/stats_reference.json"))  # validate
print(len(rows), "rows")


# ---- coefficient tables for the Rust code -----------------------------------------------------
def lit(v):
    s = mpmath.nstr(v, 20, min_fixed=-5, max_fixed=6)
    if "." not in s and "e" not in s:
        s += ".0"
    return s


def arr(name, doc, vals):
    out = "".join(f"/// {line}\n" for line in doc)
    out += f"pub(crate) const {name}: [f64; {len(vals)}] = [\n"
    out += "".join(f"    {lit(v)},\n" for v in vals)
    return out + "];\n\n"


if "--tables" in sys.argv:
    NK = 31
    src = ("//! Series coefficients for the quantum-statistics module, generated by\n"
           "//! `tests/data/gen_stats.py --tables` with mpmath " + mpmath.__version__ +
           " at mp.dps = 50 (values of the Riemann\n"
           "//! zeta function, DLMF §25.2-25.6). Do not edit by hand.\n"
           "#![forbid(unsafe_code)]\n#![allow(clippy::excessive_precision)]\n\n")
    src += arr("SOMMERFELD_2ETA",
               ["Sommerfeld coefficients 2·η(2n) = 2(1 − 2^(1−2n))·ζ(2n) for n = 1, 2, …",
                "(η the Dirichlet eta function)."],
               [2 * (1 - mpf(2) ** (1 - 2 * n)) * mpmath.zeta(2 * n) for n in range(1, 21)])
    src += arr("ROBINSON_3_2",
               ["ζ(3/2 − k)/k! for k = 0, 1, …: coefficients of Li_{3/2}(e^μ) − Γ(−1/2)(−μ)^{1/2}."],
               [mpmath.zeta(mpf(3) / 2 - k) / mpmath.factorial(k) for k in range(NK)])
    src += arr("ROBINSON_5_2",
               ["ζ(5/2 − k)/k! for k = 0, 1, …: coefficients of Li_{5/2}(e^μ) − Γ(−3/2)(−μ)^{3/2}."],
               [mpmath.zeta(mpf(5) / 2 - k) / mpmath.factorial(k) for k in range(NK)])
    src += arr("ZETA_NONPOSITIVE",
               ["ζ(−m) for m = 0, 1, 2, … (ζ(0) = −1/2, ζ(−m) = −B_{m+1}/(m+1))."],
               [mpmath.zeta(-m) for m in range(NK + 1)])
    src += arr("ZETA_POSITIVE",
               ["ζ(m) for m = 2, 3, …, 21."],
               [mpmath.zeta(m) for m in range(2, 22)])
    with open("src/stats/tables.rs", "w") as fh:
        fh.write(src.rstrip() + "\n")
    print("wrote src/stats/tables.rs")
