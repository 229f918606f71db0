#!/usr/bin/env python3
"""Generate tests/data/core_reference.json: reference values for the radiometric core.

Oracle: mpmath (arbitrary precision, mp.dps = 40).
  * spectral values: Planck's law evaluated directly in mpmath from the exact SI 2019 constants;
  * band values and band derivatives: numerical quadrature `mp.quad` (tanh-sinh) of the
    spectral density (or of its analytic T-derivative) in the ORIGINAL spectral variable, on a
    subdivided interval; each band value is cross-checked in this script against the
    independent closed form with polylogarithms `mp.polylog` (for x^3/(e^x-1):
    int_x^inf = x^3 Li1(e^-x) + 3x^2 Li2(e^-x) + 6x Li3(e^-x) + 6 Li4(e^-x));
  * inverse band fraction: bisection (160 halvings in ln x) on the polylog form.
Neither uses the series/rules implemented in src/band.rs (Widger-Woodall partial sums with
cut-offs, Bernoulli head series, 16-point Gauss-Legendre).

Run from the repository root:  python3 tests/data/gen_core.py
Inputs are written as the decimal strings below; the oracle evaluates at the exact value of
the nearest f64 (what Rust's parser gives), so input rounding is not counted as error.
Every expected value is written as a decimal string with 25 significant digits.
"""
import datetime
import json
import os

import mpmath
from mpmath import mp, mpf

mp.dps = 40

H = mpf("6.62607015e-34")
C = mpf("299792458")
K = mpf("1.380649e-23")
C1L = 2 * H * C**2
C2_CODATA = H * C / K
C2_ITS90 = mpf("0.014388")
SIGMA = 2 * mp.pi**5 * K**4 / (15 * H**3 * C**2)

DIGITS = 25


def f64(v):
    """The exact value of the f64 nearest to the decimal string v (what the Rust side parses),
    so the reference is the function of the very input the library receives."""
    return mpf(float(v)) if isinstance(v, str) else mpf(v)


def s(v):
    return mpmath.nstr(mpf(v), DIGITS, min_fixed=1, max_fixed=0)


def c2_of(conv):
    return C2_CODATA if conv == "codata2018" else C2_ITS90


def density(variable, quantity, v, T, c2):
    """Vacuum blackbody spectral radiance (eps = n = 1) in the given variable."""
    v = f64(v)
    T = f64(T)
    if variable == "wavelength":
        x = c2 / (v * T)
        e = C1L / v**5 / mp.expm1(x)
        photon_energy = H * C / v
    elif variable == "wavenumber":
        x = c2 * v / T
        e = C1L * v**3 / mp.expm1(x)
        photon_energy = H * C * v
    else:
        x = c2 * v / (C * T)
        e = 2 * H * v**3 / C**2 / mp.expm1(x)
        photon_energy = H * v
    val = e if quantity == "energy" else e / photon_energy
    return val, x


def density_d_dt(variable, quantity, v, T, c2):
    val, x = density(variable, quantity, v, T, c2)
    return val * x * mp.exp(x) / mp.expm1(x) / f64(T)


def nquad(f, pts):
    """mp.quad with the integrand normalised by its largest value at the subdivision points.

    mp.quad stops on an ABSOLUTE error estimate (about 10**-dps), so an unnormalised far-tail
    integrand (1e-118) would be returned with only a few correct digits."""
    pts = [mpf(p) for p in pts]
    scale = max(abs(f(p)) for p in pts)
    if scale == 0:
        return mpf(0)
    return scale * mp.quad(lambda t: f(t) / scale, pts)


def quad_band(variable, quantity, lo, hi, T, c2, d_dt, pieces=None):
    lo, hi = f64(lo), f64(hi)
    f = (lambda v: density_d_dt(variable, quantity, v, T, c2)) if d_dt else (
        lambda v: density(variable, quantity, v, T, c2)[0])
    ratio = hi / lo
    if pieces is None:
        pieces = int(min(200, max(4, 4 * mp.log10(ratio) + 4)))
    pts = [lo * ratio ** (mpf(i) / pieces) for i in range(pieces + 1)]
    pts[0], pts[-1] = lo, hi
    return nquad(f, pts)


def li_upper(n, x):
    """int_x^inf t^n/(e^t-1) dt via polylogarithms (n = 2, 3)."""
    q = mp.exp(-x)
    total = mpf(0)
    fact_n = mp.factorial(n)
    for j in range(n + 1):
        # mp.polylog(1, q) returns 0 for very small q; Li1(q) = -log(1 - q) exactly.
        li = -mp.log1p(-q) if j == 0 else mp.polylog(j + 1, q)
        total += fact_n / mp.factorial(n - j) * x ** (n - j) * li
    return total


def li_upper_d(m, x):
    """int_x^inf t^m e^t/(e^t-1)^2 dt = x^m/(e^x-1) + m int_x^inf t^(m-1)/(e^t-1) dt."""
    return x**m / mp.expm1(x) + m * li_upper(m - 1, x)


def kernel_upper(kernel, x):
    x = mpf(x)
    return {"photon": lambda: li_upper(2, x), "energy": lambda: li_upper(3, x),
            "photon_derivative": lambda: li_upper_d(3, x),
            "energy_derivative": lambda: li_upper_d(4, x)}[kernel]()


def kernel_integrand(kernel, t):
    return {"photon": t**2 / mp.expm1(t), "energy": t**3 / mp.expm1(t),
            "photon_derivative": t**3 * mp.exp(t) / mp.expm1(t) ** 2,
            "energy_derivative": t**4 * mp.exp(t) / mp.expm1(t) ** 2}[kernel]


def kernel_total(kernel):
    return {"photon": 2 * mp.zeta(3), "energy": mp.pi**4 / 15,
            "photon_derivative": 6 * mp.zeta(3), "energy_derivative": 4 * mp.pi**4 / 15}[kernel]


def reduced(variable, v, T, c2):
    v, T = f64(v), f64(T)
    if variable == "wavelength":
        return c2 / (v * T)
    if variable == "wavenumber":
        return c2 * v / T
    return c2 * v / (C * T)


def polylog_band(variable, quantity, lo, hi, T, c2, d_dt):
    xa, xb = sorted([reduced(variable, lo, T, c2), reduced(variable, hi, T, c2)])
    kern = ("energy" if quantity == "energy" else "photon") + ("_derivative" if d_dt else "")
    integral = kernel_upper(kern, xa) - kernel_upper(kern, xb)
    T = f64(T)
    if quantity == "energy":
        pref = C1L * (T / c2) ** 4
    else:
        pref = 2 * C * (T / c2) ** 3
    if d_dt:
        pref /= T
    return pref * integral


cases = []


def add(**kw):
    cases.append({k: (v if isinstance(v, str) else s(v)) for k, v in kw.items()})


# 1. Spectral densities and their T-derivatives, vacuum blackbody.
spectral_points = [
    ("wavelength", "1e-9", "1e6"), ("wavelength", "0.5e-6", "5800"), ("wavelength", "10e-6", "300"),
    ("wavelength", "4e-6", "1500"), ("wavelength", "1e-6", "300"), ("wavelength", "1e-2", "3"),
    ("wavelength", "1", "1e6"), ("wavelength", "3e-7", "50"), ("wavelength", "1e-3", "1e-3"),
    ("wavenumber", "1e5", "300"), ("wavenumber", "2.5e5", "1000"), ("wavenumber", "1", "300"),
    ("frequency", "1e13", "300"), ("frequency", "1.5e11", "2.725"), ("frequency", "1e15", "6000"),
    ("frequency", "1e9", "1e-3"),
]
for var, v, T in spectral_points:
    for q in ("energy", "photon"):
        val, x = density(var, q, v, T, C2_CODATA)
        if val < mpf("1e-300"):
            continue
        add(kind="spectral", variable=var, quantity=q, x=v, temperature_k=T, c2="codata2018",
            reduced_x=x, expected=val)
        add(kind="spectral_d_dt", variable=var, quantity=q, x=v, temperature_k=T,
            c2="codata2018", reduced_x=x, expected=density_d_dt(var, q, v, T, C2_CODATA))
# ITS-90 c2 variant.
for var, v, T in [("wavelength", "0.65e-6", "1337.33"), ("wavelength", "0.9e-6", "2000")]:
    val, x = density(var, "energy", v, T, C2_ITS90)
    add(kind="spectral", variable=var, quantity="energy", x=v, temperature_k=T, c2="its90",
        reduced_x=x, expected=val)

# 2. Blackbody fractions F(0 -> lambda T), lambda T from 50 to 1e6 um K (energy and photon).
for i in range(41):
    lt_um = mpf(50) * (mpf(1e6) / 50) ** (mpf(i) / 40)
    lt = mpmath.nstr(lt_um * mpf("1e-6"), 17)
    x = C2_CODATA / f64(lt)
    for kern, kind in (("energy", "fraction_below"), ("photon", "photon_fraction_below")):
        t_int = nquad(lambda t: kernel_integrand(kern, t), [x, x + 1, x + 4, x + 16, x + 64, x + 256]) \
            if x > 1 else nquad(lambda t: kernel_integrand(kern, t), [x, 1, 4, 16, 64, 256])
        pl = kernel_upper(kern, x)
        assert abs(t_int / pl - 1) < mpf("1e-30"), (lt, kern)
        add(kind=kind, lambda_t_m_k=lt, reduced_x=x, expected=pl / kernel_total(kern))

# 3. Band values (energy/photon, radiance, all three variables, d/dT).
band_cases = [
    ("wavelength", "8e-6", "14e-6", "300", "typical LWIR band"),
    ("wavelength", "8e-6", "14e-6", "250", "typical LWIR band, cold"),
    ("wavelength", "1e-6", "2e-6", "1500", "SWIR band, furnace"),
    ("wavelength", "1e-6", "2e-6", "300", "far Wien tail"),
    ("wavelength", "3e-6", "5e-6", "500", "MWIR band"),
    ("wavelength", "3e-6", "5e-6", "1000", "MWIR band"),
    ("wavelength", "3e-6", "3.3e-6", "50", "far-tail narrow band, cold"),
    ("wavelength", "10e-6", "10.3e-6", "50", "0.3 um band, cold"),
    ("wavelength", "0.3e-6", "0.6e-6", "50", "far tail, x ~ 480..960"),
    ("wavelength", "0.65e-6", "0.66e-6", "1337.33", "narrow visible band"),
    ("wavelength", "10e-6", "10.001e-6", "300", "very narrow band"),
    ("wavelength", "10e-6", "10.000000001e-6", "300", "1e-10 relative width"),
    ("wavelength", "1e-9", "1", "1e6", "1 nm to 1 m at 1e6 K"),
    ("wavelength", "1e-9", "1", "1e-3", "1 nm to 1 m at 1 mK"),
    ("wavelength", "1e-3", "1", "1e-3", "mm band at 1 mK"),
    ("wavelength", "1e-9", "1e-8", "1e6", "EUV band, 1e6 K"),
    ("wavelength", "0.5e-6", "50e-6", "2000", "wide band"),
    ("wavelength", "5e-6", "7e-6", "600", "straddles x = 2..5"),
    ("wavelength", "9e-6", "11e-6", "600", "near x = 2"),
    ("wavenumber", "7.14e4", "1.25e5", "300", "8-14 um as wavenumber"),
    ("wavenumber", "1e3", "1e4", "300", "far infrared"),
    ("wavenumber", "2e5", "2.001e5", "1000", "narrow wavenumber band"),
    ("frequency", "2.14e13", "3.75e13", "300", "8-14 um as frequency"),
    ("frequency", "1e9", "3e11", "2.725", "microwave band, CMB-like temperature"),
    ("frequency", "1e14", "1.0001e14", "3000", "narrow frequency band"),
    ("frequency", "1e12", "1e16", "1e4", "wide frequency band"),
]
for var, lo, hi, T, note in band_cases:
    for q in ("energy", "photon"):
        for d_dt in (False, True):
            xa, xb = sorted([reduced(var, lo, T, C2_CODATA), reduced(var, hi, T, C2_CODATA)])
            pl = polylog_band(var, q, lo, hi, T, C2_CODATA, d_dt)
            if pl < mpf("1e-290"):
                if not d_dt:
                    add(kind="band_zero", variable=var, quantity=q, lower=lo, upper=hi,
                        temperature_k=T, note=note + " (true value below 1e-290)",
                        expected=pl)
                continue
            narrow = (xb - xa) / (xa + xb) < mpf("1e-3")
            if narrow:
                # Cancellation defeats the polylog difference for very narrow bands; the
                # quadrature is the oracle there (and the relative width is resolved exactly).
                val = quad_band(var, q, lo, hi, T, C2_CODATA, d_dt, pieces=1)
            else:
                val = quad_band(var, q, lo, hi, T, C2_CODATA, d_dt)
                assert abs(val / pl - 1) < mpf("1e-25"), (var, lo, hi, T, q, d_dt, val, pl)
            add(kind="band_d_dt" if d_dt else "band", variable=var, quantity=q, lower=lo,
                upper=hi, temperature_k=T, c2="codata2018", reduced_lower=xa, reduced_upper=xb,
                note=note, expected=val)
            if not d_dt:
                total = (C1L * (f64(T) / C2_CODATA) ** 4 * mp.pi**4 / 15 if q == "energy"
                         else 2 * C * (f64(T) / C2_CODATA) ** 3 * 2 * mp.zeta(3))
                add(kind="band_fraction", variable=var, quantity=q, lower=lo, upper=hi,
                    temperature_k=T, c2="codata2018", note=note, expected=val / total)

# 3b. ITS-90 second radiation constant (c2 = 0.014388 m K in the exponent, prefactor unchanged).
for var, lo, hi, T, note in [
    ("wavelength", "0.645e-6", "0.655e-6", "1337.33", "ITS-90 c2, narrow red band at the gold point"),
    ("wavelength", "0.8e-6", "1.1e-6", "1800", "ITS-90 c2, silicon-detector band"),
    ("frequency", "2.14e13", "3.75e13", "300", "ITS-90 c2, 8-14 um as frequency"),
]:
    for q in ("energy", "photon"):
        for d_dt in (False, True):
            xa, xb = sorted([reduced(var, lo, T, C2_ITS90), reduced(var, hi, T, C2_ITS90)])
            val = quad_band(var, q, lo, hi, T, C2_ITS90, d_dt)
            pl = polylog_band(var, q, lo, hi, T, C2_ITS90, d_dt)
            assert abs(val / pl - 1) < mpf("1e-25"), (var, lo, hi, T, q, d_dt)
            add(kind="band_d_dt" if d_dt else "band", variable=var, quantity=q, lower=lo,
                upper=hi, temperature_k=T, c2="its90", reduced_lower=xa, reduced_upper=xb,
                note=note, expected=val)

# 4. Dimensionless kernels: upper tails, lower heads, intervals.
for kern in ("photon", "energy", "photon_derivative", "energy_derivative"):
    for x in ("1e-6", "0.01", "0.5", "1", "1.9", "2", "2.1", "3", "5", "10", "30", "50", "100",
              "200", "500"):
        xv = f64(x)
        up = kernel_upper(kern, xv)
        q = nquad(lambda t: kernel_integrand(kern, t), [xv, xv + 1, xv + 4, xv + 16, xv + 64, xv + 256])
        assert abs(q / up - 1) < mpf("1e-28"), (kern, x)
        add(kind="planck_integral_upper", kernel=kern, x=x, expected=up)
        low = nquad(lambda t: kernel_integrand(kern, t), [mpf(0) + xv * mpf('1e-30'), xv]) if xv < 50 else \
            kernel_total(kern) - up
        add(kind="planck_integral_lower", kernel=kern, x=x, expected=low)
    for a, b in (("0.1", "0.11"), ("1.95", "2.05"), ("3", "3.5"), ("40", "40.5"), ("0.5", "4"),
                 ("1e-3", "1.000001e-3"), ("100", "100.25")):
        val = nquad(lambda t: kernel_integrand(kern, t), [f64(a), f64(b)])
        add(kind="planck_integral", kernel=kern, x_lower=a, x_upper=b, expected=val)

# 4b. Seeded random intervals of the dimensionless kernels, crossing the library's internal
#     switch points (x = 2, the narrow-interval rule) many times.
import random  # noqa: E402

rng = random.Random(20261201)
for kern in ("photon", "energy", "photon_derivative", "energy_derivative"):
    for _ in range(40):
        a = 10 ** rng.uniform(-3, 2.5)
        b = a * (1 + 10 ** rng.uniform(-6, 0.5))
        a_s, b_s = repr(a), repr(b)
        av, bv = f64(a_s), f64(b_s)
        if bv <= av:
            continue
        val = nquad(lambda t: kernel_integrand(kern, t), [av, (av + bv) / 2, bv])
        if (bv - av) / (av + bv) > mpf("1e-3"):
            ref = kernel_upper(kern, av) - kernel_upper(kern, bv)
            assert abs(val / ref - 1) < mpf("1e-25"), (kern, a_s, b_s)
        add(kind="planck_integral", kernel=kern, x_lower=a_s, x_upper=b_s, expected=val)

# 4c. Totals (Stefan-Boltzmann and photon analogues, as mp.quad of the density over all x) and
#     peak locations (mp.findroot of the numerical derivative mp.diff of ln density).
for T in ("1e-3", "2.725", "300", "1500", "5772", "1e6"):
    Tv = f64(T)
    for q in ("energy", "photon"):
        n = 3 if q == "energy" else 2
        integral = nquad(lambda t: t**n / mp.expm1(t), [mpf("1e-30"), 1, 4, 16, 64, 256, 1024])
        k = C1L if q == "energy" else 2 * C
        radiance = k * (Tv / C2_CODATA) ** (n + 1) * integral
        add(kind="total", quantity=q, geometry="radiance", temperature_k=T, expected=radiance)
        add(kind="total", quantity=q, geometry="exitance", temperature_k=T,
            expected=mp.pi * radiance)
    add(kind="photon_number_density", temperature_k=T,
        expected=2 * mp.zeta(3) / mp.pi**2 * (K * Tv / (H / (2 * mp.pi) * C)) ** 3)
    add(kind="mean_photon_energy", temperature_k=T,
        expected=(C1L * (Tv / C2_CODATA) ** 4 * mp.pi**4 / 15)
        / (2 * C * (Tv / C2_CODATA) ** 3 * 2 * mp.zeta(3)))
for T in ("300", "5772"):
    Tv = f64(T)
    for var, guess in (("wavelength", C2_CODATA / (4 * Tv)), ("wavenumber", 2 * Tv / C2_CODATA),
                       ("frequency", 2 * C * Tv / C2_CODATA)):
        for q in ("energy", "photon"):
            # d ln f / d ln v = 0, in u = ln(v/guess) so that the numbers are O(1).
            g = lambda u: mp.log(density(var, q, guess * mp.exp(u), T, C2_CODATA)[0])
            vmax = guess * mp.exp(mp.findroot(lambda u: mp.diff(g, u), mpf(0)))
            add(kind="peak", variable=var, quantity=q, temperature_k=T, expected=vmax)

# 5. Inverse blackbody fraction: lambda T at which F(0 -> lambda T) = f.
for frac in ("1e-12", "0.01", "0.1", "0.25", "0.5", "0.75", "0.9", "0.99", "0.999999"):
    for kern, kind in (("energy", "lambda_t_at_fraction"), ("photon", "photon_lambda_t_at_fraction")):
        f = f64(frac)
        z = kernel_total(kern)
        # Bisection in ln x (the fraction is monotone in x); 160 halvings of a 14-wide
        # interval resolve x to ~1e-47 relative.
        lo, hi = mp.log(mpf("1e-4")), mp.log(mpf(100))
        for _ in range(160):
            mid = (lo + hi) / 2
            if kernel_upper(kern, mp.exp(mid)) / z > f:
                lo = mid
            else:
                hi = mid
        x = mp.exp((lo + hi) / 2)
        assert abs(kernel_upper(kern, x) / z / f - 1) < mpf("1e-35"), (frac, kern)
        add(kind=kind, fraction=frac, expected=C2_CODATA / x)

header = {
    "generator": "tests/data/gen_core.py",
    "oracle": "mpmath quad (tanh-sinh) of the Planck spectral density in the original spectral "
              "variable, cross-checked against polylogarithm closed forms (mp.polylog); "
              "bisection on the polylog form for inverses",
    "oracle_version": "mpmath " + mpmath.__version__,
    "mp_dps": str(mp.dps),
    "constants": "CODATA 2018 / SI 2019 exact h, c, k; ITS-90 c2 = 0.014388 m K",
    "generated": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%M:%SZ"),
    "digits": str(DIGITS),
    "units": "SI: wavelength m, wavenumber 1/m, frequency Hz, temperature K, lambda_t m K; "
             "radiance W m-2 sr-1 (per spectral unit for spectral kinds) or photons s-1 m-2 sr-1",
}

out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "core_reference.json")
with open(out, "w", encoding="utf-8") as fh:
    fh.write("{\n")
    for k, v in header.items():
        fh.write("  %s: %s,\n" % (json.dumps(k), json.dumps(v, ensure_ascii=False)))
    fh.write('  "cases": [\n')
    for i, case in enumerate(cases):
        fh.write("    " + json.dumps(case, ensure_ascii=False) + ("," if i + 1 < len(cases) else "") + "\n")
    fh.write("  ]\n}\n")
print("wrote", len(cases), "cases to", out)
