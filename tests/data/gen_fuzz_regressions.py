#!/usr/bin/env python3
"""Reference values of tests/fuzz_regressions.rs (the cases the property-based fuzz found).

Each value evaluates the defining formula (or an integral, or a root) with mpmath at 50 digits,
at the exact binary64 value of every input; no code of quantaband is used. Run:

    python3 tests/data/gen_fuzz_regressions.py

and compare the printed values with the literals in tests/fuzz_regressions.rs (each literal
there names the expression it comes from). Needs only python3 with mpmath (tested with 1.3.0).
"""
from mpmath import mp, mpf, pi, exp, expm1, log, log1p, sqrt, coth, gamma, quad, findroot, cot, diff, inf, betainc

mp.dps = 50

# SI 2019 exact constants and CODATA 2018 m_e.
h = mpf('6.62607015e-34')
c = mpf(299792458)
k = mpf('1.380649e-23')
e = mpf('1.602176634e-19')
me = mpf('9.1093837015e-31')
c2 = h * c / k
M = mpf(2) ** 1024 * (1 - mpf(2) ** -53)  # f64::MAX


def f(x):
    """A Python float (binary64) as an exact mpf."""
    return mpf(float(x))


def show(name, value):
    print(f"{name:58s} {mp.nstr(value, 17)}")


# TemperatureUnit::difference_to_kelvin(Fahrenheit, f64::MAX): M*5/9
show("difference_to_kelvin(F, MAX)", M * 5 / 9)

# Y factor, T_R = 0, Planck loads at 2 K and 1.99 K, 1e15 Hz: T_P(hot)/T_P(cold)
def t_planck(freq, t):
    x = h * freq / (k * t)
    return (h * freq / k) / expm1(x)


def t_cw(freq, t):
    x = h * freq / (2 * k * t)
    return (h * freq / (2 * k)) * coth(x)


show("y_factor(0, 2, 1.99, 1e15, Planck)", t_planck(f(1e15), f(2.0)) / t_planck(f(1e15), f(1.99)))
# (M + M)/(1 + M)
show("y_factor(MAX, MAX, 1, 1e9, RJ)", (M + M) / (1 + M))

# Y-factor receiver temperatures with the hot load at f64::MAX, y = 1e306 (Planck convention)
fr = f(2.1877252847785945e13)
y = f(1e306)
th, tc = M, f(1e-3)
show("y_factor_noise_temperature: planck_k", (t_planck(fr, th) - y * t_planck(fr, tc)) / (y - 1))
show("y_factor_noise_temperature: callen_welton_k", (t_cw(fr, th) - y * t_cw(fr, tc)) / (y - 1))


# F_{1/2}(eta) = 1/Gamma(3/2) * integral of sqrt(t)/(exp(t - eta) + 1), by quadrature
def fd_half(eta):
    g = lambda t: sqrt(t) / (exp(t - eta) + 1)
    return quad(g, [0, eta - 200, eta, eta + 200, inf]) / gamma(mpf(3) / 2)


show("F_1/2(3.5e205)", fd_half(f(3.5e205)))
show("band_carrier_density(1e-100, 1e250)", f(1e-100) * fd_half(f(1e250)))

# Fermi level from an electron density with N_c beyond f64 (m* = 1e200, T = 1 K, n = 1e6 m^-3):
# non-degenerate, E_F = E_g + kT ln(n/N_c), N_c = 2(2 pi m* m_e k T/h^2)^(3/2)
def nc(m, t):
    return 2 * (2 * pi * m * me * k * t / h ** 2) ** (mpf(3) / 2)


eg = f(1.8e-19)
show("fermi_level_from_electron_density", eg + k * log(f(1e6) / nc(f(1e200), 1)))
# intrinsic level (both bands non-degenerate): E_g/2 + (kT/2) ln(N_v/N_c)
show("intrinsic fermi_level_j", eg / 2 + k / 2 * log(nc(1, 1) / nc(f(1e200), 1)))

# Type A with huge observations: s = |x1 - x2|/sqrt(2)
show("type_a([1.896e154, 0]).standard_deviation", f(1.8961503816218355e154) / sqrt(2))
xs = [M, -M, M / 2]
ys = [mpf(1), mpf(2), mpf(3)]
mx, my = sum(xs) / 3, sum(ys) / 3
sxy = sum((a - mx) * (b - my) for a, b in zip(xs, ys))
sxx = sum((a - mx) ** 2 for a in xs)
syy = sum((b - my) ** 2 for b in ys)
show("type_a_correlation([M, -M, M/2], [1, 2, 3])", sxy / sqrt(sxx * syy))

# GUM: U = k u_c with u_c = f64::MAX, k = z_0.75 (normal, p = 0.5)
z75 = findroot(lambda z: (1 + mp.erf(z / sqrt(2))) / 2 - mpf('0.75'), 0.67)
show("z_0.75", z75)


# Student's t quantiles far in the tail: F(t) = I_{nu/(nu+t^2)}(nu/2, 1/2)/2 for t < 0
def t_cdf_lower(t, nu):
    return betainc(nu / 2, mpf(1) / 2, 0, nu / (nu + t * t), regularized=True) / 2


show("student_t_quantile(1e-200, 1)  (-cot(pi p))", -cot(pi * f(1e-200)))
p, nu = f(1e-300), mpf(3) / 2
u = findroot(lambda u: log(t_cdf_lower(-exp(u), nu)) - log(p), 460)
show("student_t_quantile(1e-300, 1.5)", -exp(u))

# Raman: F = ((1 + p)/(1 - p))^4 with p = shift*lambda, shift = 1000 m^-1, lambda = 5e-324 m
pp = f(1000) * f(5e-324)
show("raman_frequency_factor(1000, 5e-324)", ((1 + pp) / (1 - pp)) ** 4)
# anti-Stokes/Stokes ratio at theta/T below 1/f64::MAX: F*exp(-theta/T), F = ((1+p)/(1-p))^4
s, lam = f(2.2250738585072014e-308), f(2e-7)
pp = s * lam
show("anti_stokes_stokes_ratio", ((1 + pp) / (1 - pp)) ** 4 * exp(-c2 * s / 1))

# Two-colour: lambda1 = 4e-7, lambda2 = 5.1666302911784e-7, r = 5e-324, rho = 9.655481441952772e-303;
# dT/drho = -(g/g')/rho with g(T) = rho*L1/L2 the ratio model at the solution
l1, l2 = f(4e-7), f(5.1666302911784e-7)
r, rho = f(5e-324), f(9.655481441952772e-303)


def lratio(t):
    return (l2 / l1) ** 5 * expm1(c2 / (l2 * t)) / expm1(c2 / (l1 * t))


tt = findroot(lambda t: log(rho * lratio(t)) - log(r), 160)
show("two_colour T", tt)
g = rho * lratio(tt)
show("two_colour dT/drho", -(g / (rho * diff(lratio, tt))) / rho)

# Ratio-temperature sensitivity dT/dr at r = 1.5823629058437957e188 (T near 2.54e156 K),
# lambda = 400 nm, T_X = 429.7485 K (In)
tx = f(429.7485)
lam = f(4e-7)
r0 = f(1.5823629058437957e188)


A = expm1(c2 / (lam * tx))


def t_of_r(rr):
    return c2 / (lam * log1p(A / rr))


show("ratio sensitivities: T", t_of_r(r0))
# d/dr of c2/(lam ln(1 + A/r)), by hand: c2 (A/r^2) / (lam (1 + A/r) ln^2(1 + A/r))
w = log1p(A / r0)
show("ratio sensitivities: dT/dr", c2 * (A / r0 ** 2) / (lam * (1 + A / r0) * w ** 2))

# Cavity (cylinder R = 1e300, L = 1e-30, a = 1e-31): Gouffe with eps = 0.5,
# f = (a/R)^2/(2L/R + 2), f0 = (a/L)^2: eps0 = eps/(eps(1-f)+f)*(1 + (1-eps)(f - f0))
R, L, a = f(1e300), f(1e-30), f(1e-31)
ff = (a / R) ** 2 / (2 * L / R + 2)
f0 = (a / L) ** 2
eps = mpf('0.5')
show("cavity_emissivity_gouffe", eps / (eps * (1 - ff) + ff) * (1 + (1 - eps) * (ff - f0)))

# noise budget with sigma_r = 1e200 and with N_s = N_b = f64::MAX
show("noise_budget total (MAX, MAX, 0, 0)", sqrt(2 * M))

# electron rate: flux 1e-3 W times 1.701955221933048e291 A/W over e
show("electron_rate flux", f(1e-3) * f(1.701955221933048e291) / e)

# Background photon flux through an F = 1e-160 small-angle cold stop, cutoff 1 um, T = 14.388 K:
# Omega * integral_{1/lc}^inf 2 c s^2/(exp(c2 s/T) - 1) ds (wavenumber photon radiance)
lc, tb, fno = f(1e-6), f(14.388), f(1e-160)
omega = pi / (4 * fno ** 2)
# x = c2 s/T = x0 + u; the integrand scaled by e^{x0} (mp.quad stops on an absolute error
# estimate, so an integrand of size e^-1000 must be normalised):
# band = 2c (T/c2)^3 e^{-x0} quad(x^2 e^{-u}/(1 - e^{-x}), u in [0, inf))
a = c2 / tb
x0 = a / lc
scaled = quad(lambda u: (x0 + u) ** 2 * exp(-u) / (-expm1(-(x0 + u))), [0, 1, 10, 100, inf])
band = 2 * c / a ** 3 * exp(-x0) * scaled
show("background_photon_flux", omega * band)

# Etendue between discs, small angle: pi^2 (r1 r2/d)^2, r = D/2
r1, r2, d = f(1e-300) / 2, f(2.1144682391281893e63) / 2, f(5e-324)
show("etendue_between_discs small angle", pi ** 2 * (r1 * r2 / d) ** 2)

# BLIP D* from a flux: lambda/(h c) sqrt(eta/2)/sqrt(Phi) at lambda = M, eta = 5e-324, Phi = 1e10
show("blip_d_star_from_flux(MAX, 5e-324, 1e10, PV)", M / (h * c) * sqrt(f(5e-324) / 2) / sqrt(f(1e10)))
