#!/usr/bin/env python3
"""Generate tests/data/design_reference.json: reference values for quantaband::design.

Oracle: mpmath 1.3.0 at mp.dps = 40, never the library's closed forms:
  * projected solid angles and etendues by quadrature over the aperture (cos t1 cos t2 / s^2),
    not by the 4F^2 + 1 or view-factor closed forms; disc-to-disc and off-axis cases by a double
    quadrature whose azimuth integral is done with the standard result
    int_0^2pi (a - b cos p)^-2 dp = 2 pi a / (a^2 - b^2)^(3/2) (the derivative in a of
    int_0^2pi (a - b cos p)^-1 dp = 2 pi / sqrt(a^2 - b^2)); the formula is checked here against
    plain quadrature over the angle;
  * band photon and energy radiances and their temperature derivatives by mp.quad of Planck's
    law in wavelength (not the library's series);
  * NETD of an ideal photon detector by quadrature of D*(lambda) = D*p lambda/lambda_p times the
    energy radiance derivative (not the hc/lambda_p photon identity the library uses);
  * background photon flux for BLIP D* by quadrature over polar angle (0...theta of the cold
    stop) times quadrature of the photon radiance over 0...lambda_c (in x = c2/(lambda T), so
    that cold backgrounds stay accurate), cross-checked against polylogarithms;
  * size-of-source-corrected temperatures by mp.findroot on a quadrature band signal;
  * cavity effective emissivities by a radiosity solution of the diffuse integral equation
    (ring and disc elements with exact disc-algebra view factors, double precision,
    discretisation error estimated by halving the elements), independent of Gouffe's formula;
    the solver is first checked against the exact result for a spherical cavity.

Run from the repository root:  python3 tests/data/gen_design.py   (about a minute)
Inputs are decimal strings; the oracle evaluates at the exact value of the nearest f64 (what
Rust's parser gives). Expected values are decimal strings with 25 significant digits.
"""
import datetime
import json
import math
import os

import mpmath
from mpmath import mp, mpf

mp.dps = 40

H = mpf("6.62607015e-34")
C = mpf("299792458")
K = mpf("1.380649e-23")
Q = mpf("1.602176634e-19")
C2 = H * C / K
DIGITS = 25


def f64(v):
    return mpf(float(v)) if isinstance(v, str) else mpf(v)


def s(v):
    return mpmath.nstr(mpf(v), DIGITS, min_fixed=1, max_fixed=0)


# ---------------------------------------------------------------------------------------------
# Planck's law in wavelength (vacuum, blackbody), energy and photon, and d/dT.
def L(lam, T):
    return 2 * H * C**2 / lam**5 / mp.expm1(C2 / (lam * T))


def dL(lam, T):
    x = C2 / (lam * T)
    return L(lam, T) * x / (-mp.expm1(-x)) / T


def Lq(lam, T):
    return L(lam, T) * lam / (H * C)


def dLq(lam, T):
    return dL(lam, T) * lam / (H * C)


def band(f, a, b, T):
    pts = [a + (b - a) * k / 8 for k in range(9)]
    return mp.quad(lambda l: f(l, T), pts)


def photon_band_from_zero(b, T):
    """int_0^b L_q,lambda dlambda, by quadrature in x = c2/(lambda T) (the integrand in lambda
    is too steep near b for a cold background): 2c (T/c2)^3 int_xb^inf x^2/(e^x - 1) dx.
    Cross-checked against the polylogarithm form x^2 Li1(q) + 2x Li2(q) + 2 Li3(q), q = e^-x."""
    T = mpf(T)
    xb = C2 / (b * T)
    pts = [xb, xb + 2, xb + 10, xb + 40, xb + 150, mp.inf]
    # Normalise by the integrand at xb so quad's absolute tolerance is relative here.
    scale = xb**2 / mp.expm1(xb) if xb < 1e5 else xb**2 * mp.exp(-xb)
    integral = scale * mp.quad(lambda x: (x**2 / mp.expm1(x)) / scale, pts)
    q = mp.exp(-xb)
    poly = xb**2 * (-mp.log1p(-q)) + 2 * xb * mp.polylog(2, q) + 2 * mp.polylog(3, q)
    assert abs(integral / poly - 1) < mpf("1e-30"), (b, T, integral, poly)
    return 2 * C * (T / C2) ** 3 * integral


# ---------------------------------------------------------------------------------------------
# Geometry by quadrature.
def omega_cone_quad(F):
    """Projected solid angle of the cone tan(theta) = 1/(2F): int cos dOmega."""
    th = mp.atan(1 / (2 * F))
    return mp.quad(lambda t: 2 * mp.pi * mp.sin(t) * mp.cos(t), [0, th])


def omega_disc_axial_quad(D, d):
    """Projected solid angle of a disc of diameter D at distance d from an axial point."""
    return mp.quad(lambda r: 2 * mp.pi * r * d**2 / (d**2 + r**2) ** 2, [0, D / 2])


def azimuth(a, b):
    """int_0^2pi (a - b cos p)^-2 dp for a > |b|."""
    return 2 * mp.pi * a / (a * a - b * b) ** mpf(1.5)


def omega_disc_offaxis_quad(D, d, h):
    """Projected solid angle of a disc (diameter D, distance d) seen from a point at lateral
    offset h in a plane parallel to it: int_disc d^2/(d^2 + |q - h|^2)^2 dA."""
    r2 = D / 2
    return mp.quad(lambda sr: sr * d**2 * azimuth(d**2 + h**2 + sr**2, 2 * h * sr), [0, r2 / 2, r2])


def etendue_discs_quad(D1, D2, d):
    """Double quadrature; 25 digits are plenty for a binary64 reference and keep it fast."""
    r1 = D1 / 2
    with mp.workdps(25):
        return mp.quad(lambda rho: 2 * mp.pi * rho * omega_disc_offaxis_quad(D2, d, rho), [0, r1 / 2, r1])


def check_azimuth_formula():
    """The closed azimuth integral against plain quadrature over the angle."""
    for a, b in [(mpf(3), mpf(1)), (mpf("1.0001"), mpf(1)), (mpf(5), mpf("0.01"))]:
        direct = mp.quad(lambda p: (a - b * mp.cos(p)) ** -2, [0, mp.pi / 2, mp.pi, 3 * mp.pi / 2, 2 * mp.pi])
        assert abs(direct / azimuth(a, b) - 1) < mpf("1e-25"), (a, b)


# ---------------------------------------------------------------------------------------------
# Cavity radiosity (double precision).
def G_af(a, b, h):
    """Area x view factor from a disc of radius a to a coaxial parallel disc of radius b at
    distance h (symmetric in a, b)."""
    if a <= 0 or b <= 0:
        return 0.0
    if h <= 0:
        return math.pi * min(a, b) ** 2
    X = a * a + b * b + h * h
    sq = math.sqrt((h * h + (a - b) ** 2) * (h * h + (a + b) ** 2))
    return 2 * math.pi * a * a * b * b / (X + sq)


def cavity_solution(profile, depth, mouth_radius, ap, eps_list, n_side, n_bot, n_lid):
    """Radiosity of an isothermal diffuse grey convex axisymmetric cavity. The side wall has
    radius profile(z) for z in [0, depth] (bottom at z = 0), a flat bottom if profile(0) > 0,
    and at z = depth a lid annulus [ap, mouth_radius] around the aperture disc [0, ap].
    Returns {eps: (hemispherical, normal)} effective emissivities of the aperture: flux out of
    the aperture over the blackbody flux, and the projected-area average of the radiosity
    seen through the aperture along the axis."""
    L = depth
    r = profile
    zs = [L * (0.5 - 0.5 * math.cos(math.pi * i / n_side)) for i in range(n_side + 1)]
    els = []
    for i in range(n_side):
        a1, a2 = zs[i], zs[i + 1]
        ra, rb = r(a1), r(a2)
        els.append(("s", a1, a2, math.pi * (ra + rb) * math.hypot(a2 - a1, rb - ra)))
    r0 = r(0.0)
    if r0 > 0:
        rs = [r0 * math.sqrt(i / n_bot) for i in range(n_bot + 1)]
        for i in range(n_bot):
            els.append(("b", rs[i], rs[i + 1], math.pi * (rs[i + 1] ** 2 - rs[i] ** 2)))
    if ap < mouth_radius:
        rs = [ap + (mouth_radius - ap) * (0.5 - 0.5 * math.cos(math.pi * i / n_lid)) for i in range(n_lid + 1)]
        for i in range(n_lid):
            els.append(("l", rs[i], rs[i + 1], math.pi * (rs[i + 1] ** 2 - rs[i] ** 2)))
    els.append(("a", 0.0, ap, math.pi * ap * ap))
    n = len(els)

    def ann(p1, p2, q1, q2, h):
        return G_af(p2, q2, h) - G_af(p2, q1, h) - G_af(p1, q2, h) + G_af(p1, q1, h)

    def AF(e, f):
        te, a1, a2, A = e
        tf, b1, b2, _ = f
        if te != "s" and tf != "s":
            if (te == "b") == (tf == "b"):
                return 0.0  # coplanar
            return ann(a1, a2, b1, b2, L)
        if te == "s" and tf == "s":
            if (a1, a2) == (b1, b2):
                return A - math.pi * r(a2) ** 2 - math.pi * r(a1) ** 2 + 2 * G_af(r(a1), r(a2), a2 - a1)
            if a2 <= b1:
                d = lambda z: G_af(r(z), r(b1), b1 - z) - G_af(r(z), r(b2), b2 - z)
                return d(a2) - d(a1)
            return AF(f, e)
        if te == "s":
            return AF(f, e)
        if te == "b":
            d = lambda z: G_af(a2, r(z), z) - G_af(a1, r(z), z)
            return d(b1) - d(b2)
        d = lambda z: G_af(a2, r(z), L - z) - G_af(a1, r(z), L - z)
        return d(b2) - d(b1)

    A = [e[3] for e in els]
    F = [[AF(els[i], els[j]) / A[i] for j in range(n)] for i in range(n - 1)]
    worst = max(abs(sum(F[i]) - 1) for i in range(n - 1))
    assert worst < 1e-9, worst
    out = {}
    m = n - 1
    for eps in eps_list:
        # (I - (1-eps) F) J = eps, Gaussian elimination with partial pivoting.
        M = [[(1.0 if i == j else 0.0) - (1 - eps) * F[i][j] for j in range(m)] + [eps] for i in range(m)]
        for c in range(m):
            p = max(range(c, m), key=lambda i: abs(M[i][c]))
            M[c], M[p] = M[p], M[c]
            piv = M[c][c]
            rowc = M[c]
            for i in range(c + 1, m):
                fct = M[i][c] / piv
                if fct != 0.0:
                    rowi = M[i]
                    for j in range(c, m + 1):
                        rowi[j] -= fct * rowc[j]
        J = [0.0] * m
        for i in range(m - 1, -1, -1):
            J[i] = (M[i][m] - sum(M[i][j] * J[j] for j in range(i + 1, m))) / M[i][i]
        hemi = sum(A[i] * F[i][m] * J[i] for i in range(m)) / A[m]
        num = den = 0.0
        for e, j in zip(els, J):
            t, a1, a2, _ = e
            if t == "b" or (t == "s" and r0 == 0):
                lo = a1 if t == "b" else r(a1)
                hi = min(a2 if t == "b" else r(a2), ap)
                if hi > lo:
                    w = math.pi * (hi * hi - lo * lo)
                    num += w * j
                    den += w
        out[eps] = (hemi, num / den)
    return out


def check_sphere_solver():
    """Exact: a diffuse spherical cavity with a cap-shaped opening of area fraction f has
    eps_eff = eps/(eps(1 - f) + f) (its walls irradiate the whole sphere uniformly)."""
    rho = 1.0
    worst = 0.0
    for ap in (0.3, 0.6):
        L = rho + math.sqrt(rho * rho - ap * ap)
        prof = lambda z: math.sqrt(max(z * (2 * rho - z), 0.0))
        f = (2 * rho - L) / (2 * rho)
        sol = cavity_solution(prof, L, ap, ap, [0.5, 0.9], 120, 1, 1)
        for eps, (hemi, _) in sol.items():
            worst = max(worst, abs(hemi - eps / (eps * (1 - f) + f)))
    assert worst < 1e-5, worst
    return worst


def cavities():
    rows = []
    worst_halving = 0.0
    for shape in ("cylinder", "cone"):
        for LR in (0.5, 1, 2, 4, 8, 16):
            for aR in (0.25, 0.5, 1.0):
                if LR < 2 * aR:
                    continue
                R, L, a = 1.0, float(LR), float(aR)
                prof = (lambda z: R) if shape == "cylinder" else (lambda z, L=L: R * z / L)
                eps_list = [0.5, 0.8, 0.9, 0.95]
                fine = cavity_solution(prof, L, R, a, eps_list, 96, 24, 24)
                if LR in (2, 8) and aR == 0.5:
                    coarse = cavity_solution(prof, L, R, a, eps_list, 48, 12, 12)
                    for e in eps_list:
                        worst_halving = max(worst_halving, abs(fine[e][1] - coarse[e][1]), abs(fine[e][0] - coarse[e][0]))
                for e in eps_list:
                    hemi, normal = fine[e]
                    rows.append(
                        {
                            "shape": shape,
                            "radius_m": repr(R),
                            "depth_m": repr(L),
                            "aperture_radius_m": repr(a),
                            "wall_emissivity": repr(e),
                            "hemispherical": "%.8f" % hemi,
                            "normal": "%.8f" % normal,
                        }
                    )
    return rows, worst_halving


# ---------------------------------------------------------------------------------------------
def main():
    out = {
        "meta": {
            "generator": "tests/data/gen_design.py",
            "oracle": "mpmath %s, mp.dps = %d; cavities: double-precision radiosity" % (mpmath.__version__, mp.dps),
            "constants": "CODATA 2018 / SI 2019 exact h, c, k, e",
            "generated": datetime.date.today().isoformat(),
        }
    }

    # Projected solid angle of a cone from an f-number (exact cone).
    out["solid_angle"] = [{"f_number": F, "expected": s(omega_cone_quad(f64(F)))} for F in ["0.5", "1", "1.4", "2", "4", "8", "100"]]

    # Etendue of a small axial area through an aperture.
    rows = []
    for A, D, d in [("1e-6", "0.01", "0.05"), ("2.89e-10", "0.025", "0.025"), ("1e-8", "0.002", "1.5"), ("4e-6", "0.1", "0.01")]:
        rows.append({"area_m2": A, "aperture_diameter_m": D, "distance_m": d, "expected": s(f64(A) * omega_disc_axial_quad(f64(D), f64(d)))})
    out["etendue_aperture"] = rows

    # Etendue between coaxial discs.
    rows = []
    for D1, D2, d in [("0.002", "0.002", "0.001"), ("0.001", "0.02", "0.1"), ("0.05", "0.05", "0.5"), ("0.01", "0.03", "0.002"), ("3e-4", "0.025", "0.2")]:
        rows.append({"stop_diameter_m": D1, "aperture_diameter_m": D2, "distance_m": d, "expected": s(etendue_discs_quad(f64(D1), f64(D2), f64(d)))})
    out["etendue_discs"] = rows
    check_azimuth_formula()

    # Off-axis projected solid angle of a flat aperture (exact) vs the cos^4 law.
    rows = []
    for F, deg in [("2", "10"), ("2", "20"), ("5", "20"), ("20", "20"), ("5", "30")]:
        Ff = f64(F)
        th = f64(deg) * mp.pi / 180
        Dap, f = mpf(1), Ff  # aperture diameter 1, distance F
        exact = omega_disc_offaxis_quad(Dap, f, f * mp.tan(th))
        rows.append({"f_number": F, "field_angle_rad": repr(float(th)), "expected": s(exact)})
    out["off_axis"] = rows

    # In-band photon and energy radiance and derivatives, and pixel flux.
    rows = []
    for lo, hi, T in [("3e-6", "5e-6", "300"), ("3.7e-6", "4.8e-6", "300"), ("8e-6", "14e-6", "300"), ("8e-6", "12e-6", "250"), ("3e-6", "5e-6", "1000"), ("8e-6", "14e-6", "500")]:
        a_, b_, T_ = f64(lo), f64(hi), f64(T)
        rows.append(
            {
                "lower_m": lo,
                "upper_m": hi,
                "temperature_k": T,
                "photon": s(band(Lq, a_, b_, T_)),
                "d_photon_dt": s(band(dLq, a_, b_, T_)),
                "energy": s(band(L, a_, b_, T_)),
                "d_energy_dt": s(band(dL, a_, b_, T_)),
            }
        )
    out["band"] = rows

    rows = []
    for lo, hi, T, F, tau, A in [("8e-6", "14e-6", "300", "1", "0.9", "2.89e-10"), ("3e-6", "5e-6", "300", "2", "0.85", "2.25e-10"), ("3.7e-6", "4.8e-6", "350", "4", "0.95", "6.4e-11")]:
        a_, b_, T_ = f64(lo), f64(hi), f64(T)
        g = f64(A) * omega_cone_quad(f64(F)) * f64(tau)
        rows.append(
            {
                "lower_m": lo,
                "upper_m": hi,
                "temperature_k": T,
                "f_number": F,
                "transmittance": tau,
                "pixel_area_m2": A,
                "photon_rate": s(g * band(Lq, a_, b_, T_)),
                "d_photon_rate_dt": s(g * band(dLq, a_, b_, T_)),
                "power_w": s(g * band(L, a_, b_, T_)),
                "d_power_dt": s(g * band(dL, a_, b_, T_)),
            }
        )
    out["pixel_flux"] = rows

    # Narrow band vs the midpoint (Line) approximation: exact band values.
    rows = []
    for c, w, T in [("10e-6", "0.1e-6", "300"), ("4e-6", "0.05e-6", "300"), ("0.65e-6", "0.01e-6", "1500")]:
        cc, ww = f64(c), f64(w)
        rows.append({"centre_m": c, "width_m": w, "temperature_k": T, "photon": s(band(Lq, cc - ww / 2, cc + ww / 2, f64(T)))})
    out["line"] = rows

    # NETD from D*: flat D* (energy) and ideal photon D* (lambda/lambda_p weighting).
    rows = []
    for lo, hi, T, F, tau, A, tint, dstar, shape, lp in [
        ("8e-6", "14e-6", "300", "1", "0.9", "2.89e-10", "0.0167", "1e9", "flat", None),
        ("8e-6", "12e-6", "250", "1.2", "0.8", "1.44e-10", "0.0333", "5e8", "flat", None),
        ("3.7e-6", "4.8e-6", "300", "2", "0.9", "2.25e-10", "0.001", "1e9", "photon", "4.8e-6"),
        ("3e-6", "5e-6", "400", "2.5", "0.7", "4e-10", "0.002", "3e9", "photon", "5e-6"),
    ]:
        a_, b_, T_ = f64(lo), f64(hi), f64(T)
        df = 1 / (2 * f64(tint))
        if shape == "flat":
            dint = band(dL, a_, b_, T_)
        else:
            lpm = f64(lp)
            dint = mp.quad(lambda l: dL(l, T_) * l / lpm, [a_ + (b_ - a_) * k / 8 for k in range(9)])
        for cone in ("exact", "smallAngle"):
            Ff = f64(F)
            # exact: flat aperture, tan(theta) = 1/(2F); small angle: the aplanatic cone
            # sin(theta) = 1/(2F), whose projected solid angle is pi/(4F^2).
            th = mp.atan(1 / (2 * Ff)) if cone == "exact" else mp.asin(1 / (2 * Ff))
            omega = mp.quad(lambda u: 2 * mp.pi * mp.sin(u) * mp.cos(u), [0, th])
            # NEP / dP/dT with dP/dT = A tau Omega int D*(l)/D* dL/dT dl
            netd = mp.sqrt(f64(A) * df) / (f64(dstar) * f64(A) * f64(tau) * omega * dint)
            rows.append(
                {
                    "lower_m": lo,
                    "upper_m": hi,
                    "temperature_k": T,
                    "f_number": F,
                    "transmittance": tau,
                    "pixel_area_m2": A,
                    "integration_time_s": tint,
                    "d_star": dstar,
                    "shape": shape,
                    "peak_wavelength_m": lp,
                    "cone": cone,
                    "expected": s(netd),
                }
            )
    out["netd_d_star"] = rows

    # Detector chain: photon band with a quantum efficiency, energy band with a responsivity.
    rows = []
    for name, lo, hi, T, F, tau, A, conv, val, tint, well, idark, rn, bg in [
        ("mwir_doc", "3.7e-6", "4.8e-6", "300", "2", "0.9", "2.25e-10", "qe", "0.7", "0.001", "1.1e7", "1e-12", "200", "0"),
        ("mwir_hot", "3.7e-6", "4.8e-6", "600", "2", "0.9", "2.25e-10", "qe", "0.7", "0.001", "1.1e7", "1e-12", "200", "0"),
        ("lwir_qe", "8e-6", "9.5e-6", "295", "2", "0.8", "5.76e-10", "qe", "0.6", "0.0002", "2e7", "5e-11", "500", "1e9"),
        ("swir_resp", "0.9e-6", "1.7e-6", "900", "4", "0.9", "2.5e-11", "resp", "0.9", "0.01", "1e5", "1e-14", "30", "2e4"),
    ]:
        a_, b_, T_ = f64(lo), f64(hi), f64(T)
        g = f64(A) * omega_cone_quad(f64(F)) * f64(tau)
        t = f64(tint)
        if conv == "qe":
            rate = f64(val) * g * band(Lq, a_, b_, T_)
            drate = f64(val) * g * band(dLq, a_, b_, T_)
        else:
            rate = f64(val) * g * band(L, a_, b_, T_) / Q
            drate = f64(val) * g * band(dL, a_, b_, T_) / Q
        ns, dns = rate * t, drate * t
        nb = f64(bg) * t
        nd = f64(idark) * t / Q
        sigma = mp.sqrt(ns + nb + nd + f64(rn) ** 2)
        rows.append(
            {
                "name": name,
                "lower_m": lo,
                "upper_m": hi,
                "temperature_k": T,
                "f_number": F,
                "transmittance": tau,
                "pixel_area_m2": A,
                "conversion": conv,
                "conversion_value": val,
                "integration_time_s": tint,
                "full_well_electrons": well,
                "dark_current_a": idark,
                "read_noise_electrons": rn,
                "background_electrons_per_s": bg,
                "signal_electrons": s(ns),
                "photocurrent_a": s(rate * Q),
                "noise_electrons": s(sigma),
                "snr": s(ns / sigma),
                "well_fill": s((ns + nb + nd) / f64(well)),
                "netd_k": s(sigma / dns),
            }
        )
    out["detector"] = rows

    # Background photon flux and BLIP D*: double quadrature over wavelength and polar angle.
    rows = []
    for lc, TB, view, F, cone in [
        ("5e-6", "300", "hemisphere", None, None),
        ("12e-6", "300", "hemisphere", None, None),
        ("5e-6", "300", "coldStop", "2", "exact"),
        ("5e-6", "300", "coldStop", "2", "smallAngle"),
        ("12e-6", "295", "coldStop", "1", "exact"),
        ("4.8e-6", "77", "coldStop", "3", "exact"),
        ("5e-6", "20", "hemisphere", None, None),
        ("5e-6", "3", "hemisphere", None, None),
    ]:
        lcm, T_ = f64(lc), f64(TB)
        if view == "hemisphere":
            th = mp.pi / 2
        else:
            Ff = f64(F)
            th = mp.atan(1 / (2 * Ff)) if cone == "exact" else mp.asin(1 / (2 * Ff))
        omega = mp.quad(lambda t: 2 * mp.pi * mp.sin(t) * mp.cos(t), [0, th])
        phi = omega * photon_band_from_zero(lcm, T_)
        hc = H * C
        for mech, m in (("photovoltaic", 2), ("photoconductive", 4)):
            for eta in ("1", "0.6"):
                rows.append(
                    {
                        "cutoff_wavelength_m": lc,
                        "background_temperature_k": TB,
                        "view": view,
                        "f_number": F,
                        "cone": cone,
                        "mechanism": mech,
                        "quantum_efficiency": eta,
                        "background_photon_flux": s(phi),
                        "d_star": s(lcm / hc * mp.sqrt(f64(eta) / (m * phi))),
                    }
                )
    out["blip"] = rows

    # Size-of-source correction with a rectangular 8-14 um band model: findroot on quadrature.
    rows = []
    for lo, hi, S, delta in [("8e-6", "14e-6", "120", "-0.003"), ("8e-6", "14e-6", "400", "0.002"), ("0.9e-6", "1.1e-6", "1e-2", "-0.01")]:
        a_, b_ = f64(lo), f64(hi)
        Sv, dv = f64(S), f64(delta)

        def solve(target):
            g = lambda T: mp.log(band(L, a_, b_, T) / target)
            t0 = mpf(500)
            return mp.findroot(g, t0, tol=mpf(10) ** -30)

        rows.append(
            {
                "lower_m": lo,
                "upper_m": hi,
                "signal": S,
                "relative_change": delta,
                "temperature_k": s(solve(Sv / (1 + dv))),
                "uncorrected_temperature_k": s(solve(Sv)),
            }
        )
    out["sse"] = rows

    # Cavities.
    sphere_err = check_sphere_solver()
    rows, halving = cavities()
    out["cavity"] = rows
    out["meta"]["cavity_solver"] = {
        "sphere_check_max_abs_error": "%.1e" % sphere_err,
        "halving_max_abs_change": "%.1e" % halving,
        "elements": "96 side rings (cosine-graded), 24 bottom annuli, 24 lid annuli",
    }

    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "design_reference.json")
    with open(path, "w") as fh:
        json.dump(out, fh, indent=1)
        fh.write("\n")
    n = sum(len(v) for k, v in out.items() if k != "meta")
    print("wrote %s: %d rows; sphere check %.1e, halving %.1e" % (path, n, sphere_err, halving))


if __name__ == "__main__":
    main()
