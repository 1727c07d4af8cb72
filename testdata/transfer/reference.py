#!/usr/bin/python3
"""Independent reference values for centra/orbit/transfer and centra/orbit/lambert.

Run with Debian's interpreter (python3-scipy 1.10.1, python3-numpy,
python3-mpmath 1.2.1):

    /usr/bin/python3 testdata/transfer/reference.py > testdata/transfer/reference.json

Nothing here shares code with the Go packages. The methods are deliberately
different from the Go ones:

* transfer budgets: vis-viva written out per burn; phasing orbits found by
  scipy.optimize.brentq on the period instead of the closed-form inversion;
  the optimal split of a combined plane change by brentq on the analytic
  derivative of the total over all of [0, 1], cross-checked with
  minimize_scalar (Go scans, minimises the total with Brent's method and
  then bisects its own derivative in a 1e-6 bracket);
  bi-elliptic/Hohmann crossover ratios by brentq on closed-form costs.
* Lambert: universal variables with Stumpff functions (Bate, Mueller and
  White 1971, ch. 5; Curtis 3rd ed. Algorithm 5.2), root in z by
  scipy.optimize.brentq on a bracket, multi-revolution branches split at the
  minimum of t(z) found by scipy.optimize.minimize_scalar. (Go uses Izzo's
  2015 Householder method in the x variable.) Near 0 and 180 degrees, where
  those formulas divide by a vanishing sin(transfer angle), a shooting method
  instead (scipy.optimize.fsolve on solve_ivp propagation). Each v1 is then
  polished with mpmath.findroot on a 40-digit universal-variable Kepler
  propagation, because double precision leaves ill-conditioned and strongly
  hyperbolic cases uncertain at 1e-9 km/s; the size of the polish is
  recorded. Every solution is finally propagated with
  scipy.integrate.solve_ivp (DOP853, rtol 1e-13) and the miss distance at the
  time of flight is recorded.
"""

import json
import math
import sys

import mpmath as mp
import numpy as np
import scipy
from scipy.integrate import solve_ivp
from scipy.optimize import brentq, fsolve, minimize_scalar

G0 = 9.80665e-3  # km/s^2, CGPM 1901 standard gravity

out = {
    "generator": "testdata/transfer/reference.py",
    "scipy": scipy.__version__,
    "numpy": np.__version__,
    "mpmath": mp.__version__,
}


def circ(mu, r):
    return math.sqrt(mu / r)


def visviva(mu, r, a):
    return math.sqrt(mu * (2.0 / r - 1.0 / a))


# ---------------------------------------------------------------- transfers
def hohmann_case(name, mu, r1, r2):
    at = 0.5 * (r1 + r2)
    dv1 = abs(visviva(mu, r1, at) - circ(mu, r1))
    dv2 = abs(circ(mu, r2) - visviva(mu, r2, at))
    return {"name": name, "mu": mu, "r1": r1, "r2": r2,
            "dv1": dv1, "dv2": dv2, "dv_total": dv1 + dv2,
            "tof": math.pi * math.sqrt(at ** 3 / mu)}


def bielliptic_case(name, mu, r1, r2, rb):
    a1 = 0.5 * (r1 + rb)
    a2 = 0.5 * (r2 + rb)
    dv1 = abs(visviva(mu, r1, a1) - circ(mu, r1))
    dv2 = abs(visviva(mu, rb, a2) - visviva(mu, rb, a1))
    dv3 = abs(circ(mu, r2) - visviva(mu, r2, a2))
    tof = math.pi * (math.sqrt(a1 ** 3 / mu) + math.sqrt(a2 ** 3 / mu))
    return {"name": name, "mu": mu, "r1": r1, "r2": r2, "rb": rb,
            "dv1": dv1, "dv2": dv2, "dv3": dv3,
            "dv_total": dv1 + dv2 + dv3, "tof": tof}


def apsis_case(name, mu, rp1, ra1, rdep, rarr, rp2, ra2, isp, m0):
    """Tangent transfer from radius rdep (an apsis of orbit 1) to rarr (an
    apsis of orbit 2)."""
    a1 = 0.5 * (rp1 + ra1)
    a2 = 0.5 * (rp2 + ra2)
    at = 0.5 * (rdep + rarr)
    dv1 = abs(visviva(mu, rdep, at) - visviva(mu, rdep, a1))
    dv2 = abs(visviva(mu, rarr, a2) - visviva(mu, rarr, at))
    dv = dv1 + dv2
    return {"name": name, "mu": mu, "rp1": rp1, "ra1": ra1,
            "rdep": rdep, "rarr": rarr, "rp2": rp2, "ra2": ra2,
            "dv1": dv1, "dv2": dv2, "dv_total": dv,
            "tof": math.pi * math.sqrt(at ** 3 / mu),
            "isp": isp, "m0": m0,
            "propellant": m0 * (1.0 - math.exp(-dv / (isp * G0)))}


def combined_case(name, mu, r1, r2, di):
    """Hohmann with plane change di split between the two burns; optimal
    fraction s at the first burn by brentq on d(total)/ds = 0."""
    at = 0.5 * (r1 + r2)
    v1, vt1 = circ(mu, r1), visviva(mu, r1, at)
    vt2, v2 = visviva(mu, r2, at), circ(mu, r2)

    def dvs(s):
        a = math.sqrt(v1 * v1 + vt1 * vt1 - 2 * v1 * vt1 * math.cos(s * di))
        b = math.sqrt(vt2 * vt2 + v2 * v2 - 2 * vt2 * v2 * math.cos((1 - s) * di))
        return a, b

    def deriv(s):
        a, b = dvs(s)
        return di * (v1 * vt1 * math.sin(s * di) / a
                     - vt2 * v2 * math.sin((1 - s) * di) / b)

    s = brentq(deriv, 0.0, 1.0, xtol=1e-15, rtol=4 * np.finfo(float).eps)
    # Cross-check with a bounded minimiser (a second, cruder method).
    sm = minimize_scalar(lambda s: sum(dvs(s)), bounds=(0, 1),
                         method="bounded", options={"xatol": 1e-10}).x
    assert abs(sm - s) < 1e-6, (sm, s)
    a, b = dvs(s)
    only1 = sum(dvs(1.0))
    only2 = sum(dvs(0.0))
    return {"name": name, "mu": mu, "r1": r1, "r2": r2, "di": di,
            "split": s, "di1": s * di, "di2": (1 - s) * di,
            "dv1": a, "dv2": b, "dv_total": a + b,
            "dv_all_at_first": only1, "dv_all_at_second": only2,
            "tof": math.pi * math.sqrt(at ** 3 / mu)}


def phasing_case(name, mu, r, theta, revs):
    """theta: target angle minus chaser angle along the motion (rad)."""
    n = math.sqrt(mu / r ** 3)
    t = (2 * math.pi * revs - theta) / n
    period = lambda a: 2 * math.pi * math.sqrt(a ** 3 / mu)
    a = brentq(lambda a: revs * period(a) - t, 0.05 * r, 50 * r,
               xtol=1e-12, rtol=4 * np.finfo(float).eps)
    other = 2 * a - r
    dv1 = abs(visviva(mu, r, a) - circ(mu, r))
    return {"name": name, "mu": mu, "r": r, "theta": theta, "revs": revs,
            "a": a, "period": period(a),
            "periapsis": min(r, other), "apoapsis": max(r, other),
            "dv1": dv1, "dv2": dv1, "dv_total": 2 * dv1, "time": t}


def plane_change_case(name, mu, rp, ra, nu, di):
    a = 0.5 * (rp + ra)
    e = (ra - rp) / (ra + rp)
    p = a * (1 - e * e)
    r = p / (1 + e * math.cos(nu))
    h = math.sqrt(mu * p)
    vr = mu / h * e * math.sin(nu)
    vt = h / r
    # Rotate the velocity about the radius vector by di and take the
    # difference vector: only the horizontal part turns.
    before = np.array([vr, vt, 0.0])
    after = np.array([vr, vt * math.cos(di), vt * math.sin(di)])
    return {"name": name, "mu": mu, "rp": rp, "ra": ra, "nu": nu, "di": di,
            "radius": r, "speed": math.hypot(vr, vt),
            "gamma": math.atan2(vr, vt),
            "dv": float(np.linalg.norm(after - before))}


MU_V = 398600.4418  # Earth GM used in Vallado 4th ed. examples (from memory)
RE_V = 6378.137     # Earth radius used in Vallado 4th ed. examples (from memory)
MU_C = 398600.0     # Earth GM used in Curtis 3rd ed. examples (from memory)
RE_C = 6378.0       # Earth radius used in Curtis 3rd ed. examples (from memory)

out["hohmann"] = [
    # Vallado 4th ed. Example 6-1: 191.34411 km altitude to 35781.34857 km.
    hohmann_case("vallado-6-1", MU_V, RE_V + 191.34411, RE_V + 35781.34857),
    # Inward: the same orbits the other way.
    hohmann_case("vallado-6-1-inward", MU_V, RE_V + 35781.34857, RE_V + 191.34411),
]
out["bielliptic"] = [
    # Vallado 4th ed. Example 6-2 (as recalled): 191.34411 km altitude to
    # 376310 km altitude via 503873 km altitude.
    bielliptic_case("vallado-6-2", MU_V, RE_V + 191.34411, RE_V + 376310.0,
                    RE_V + 503873.0),
    # Same orbits as Example 6-1 with rb = 503873 km (radius).
    bielliptic_case("geo-rb-503873", MU_V, RE_V + 191.34411, RE_V + 35781.34857,
                    503873.0),
]
out["apsis"] = [
    # Curtis 3rd ed. Example 6.1 (as recalled): 480 x 800 km orbit, burn at
    # perigee into 480 x 16000 km ellipse, circularise at 16000 km;
    # 2000 kg, Isp 300 s.
    apsis_case("curtis-6-1", MU_C, RE_C + 480, RE_C + 800, RE_C + 480,
               RE_C + 16000, RE_C + 16000, RE_C + 16000, 300.0, 2000.0),
    # Burn at apogee of the same 480 x 800 km orbit down to a 250 km circle.
    apsis_case("apogee-to-lower-circle", MU_C, RE_C + 480, RE_C + 800,
               RE_C + 800, RE_C + 250, RE_C + 250, RE_C + 250, 300.0, 2000.0),
    # From the perigee of 480 x 800 to the apogee of a 7000 x 20000 km ellipse.
    apsis_case("ellipse-to-ellipse", MU_C, RE_C + 480, RE_C + 800,
               RE_C + 480, RE_C + 20000, RE_C + 7000, RE_C + 20000, 300.0, 2000.0),
]
out["combined"] = [
    # LEO of Vallado Example 6-1 at 28.5 deg to GEO at 0 deg.
    combined_case("leo-geo-28.5", MU_V, RE_V + 191.34411, RE_V + 35781.34857,
                  math.radians(28.5)),
    # Radii recalled from Vallado 4th ed. Example 6-6 (7143.51 km to
    # 42159.4855 km, 28.5 deg).
    combined_case("vallado-6-6-radii", MU_V, 7143.51, 42159.4855, math.radians(28.5)),
    # Inward with a large angle.
    combined_case("inward-60", MU_V, 42159.4855, 7143.51, math.radians(60.0)),
]
out["phasing"] = [
    # Curtis 3rd ed. Example 6.8 problem (as recalled): move a GEO satellite
    # 12 deg westward in three revolutions: the slot is 12 deg behind.
    phasing_case("curtis-6-8-geo-west-12", MU_C, 42164.0, math.radians(-12.0), 3),
    # Target 20 deg ahead in a 2 Earth-radii circle, one revolution.
    phasing_case("lead-20-1rev", MU_V, 2 * RE_V, math.radians(20.0), 1),
    # Target 20 deg ahead, two revolutions.
    phasing_case("lead-20-2rev", MU_V, 2 * RE_V, math.radians(20.0), 2),
    # Target 300 deg ahead in a 2 Earth-radii circle, six revolutions.
    phasing_case("lead-300-6rev", MU_V, 2 * RE_V, math.radians(300.0), 6),
]
out["plane_change"] = [
    # Circular 500 km altitude orbit, 10 deg.
    plane_change_case("circular-10", MU_V, RE_V + 500, RE_V + 500, 0.0, math.radians(10)),
    # Molniya-like ellipse at true anomaly 100 deg, 5 deg.
    plane_change_case("ellipse-nu100", MU_V, 7000.0, 46000.0, math.radians(100), math.radians(5)),
    # Same ellipse at apoapsis, 30 deg.
    plane_change_case("ellipse-apoapsis", MU_V, 7000.0, 46000.0, math.pi, math.radians(30)),
]


# Bi-elliptic versus Hohmann crossovers, cost in units of sqrt(mu/r1).
def hoh_cost(R):
    return math.sqrt(2 * R / (1 + R)) - 1 + math.sqrt(1 / R) * (1 - math.sqrt(2 / (1 + R)))


def be_inf_cost(R):
    return (math.sqrt(2) - 1) * (1 + math.sqrt(1 / R))


def be_cost(R, B):  # B = rb / r1
    return (math.sqrt(2 * B / (1 + B)) - 1
            + math.sqrt(2 / B) * (math.sqrt(R / (R + B)) - math.sqrt(1 / (1 + B)))
            + math.sqrt(1 / R) * (math.sqrt(2 * B / (R + B)) - 1))


def dbe_dB_at_R(R):
    """Right derivative of the bi-elliptic cost in B at B = R (second-order
    one-sided difference; the third burn's magnitude has a kink at B = R)."""
    h = 1e-5 * R
    assert abs(be_cost(R, R) - hoh_cost(R)) < 1e-15
    return (-3 * be_cost(R, R) + 4 * be_cost(R, R + h) - be_cost(R, R + 2 * h)) / (2 * h)


x_inf = brentq(lambda R: be_inf_cost(R) - hoh_cost(R), 5, 20, xtol=1e-13)
x_r2 = brentq(dbe_dB_at_R, 12, 20, xtol=1e-10)
cubic = np.roots([1, -(7 + 4 * math.sqrt(2)), 3 + 4 * math.sqrt(2), -1])
out["crossover"] = {
    "rb_infinite": x_inf,
    "rb_equal_r2": x_r2,
    "cubic_roots": sorted(float(c.real) for c in cubic if abs(c.imag) < 1e-12),
}


# ----------------------------------------------------------------- Lambert
def stumpC(z):
    if z > 1e-8:
        return 2 * math.sin(0.5 * math.sqrt(z)) ** 2 / z
    if z < -1e-8:
        return (math.cosh(math.sqrt(-z)) - 1) / (-z)
    return 0.5 - z / 24 + z * z / 720


def stumpS(z):
    if z > 1e-8:
        s = math.sqrt(z)
        return (s - math.sin(s)) / s ** 3
    if z < -1e-8:
        s = math.sqrt(-z)
        return (math.sinh(s) - s) / s ** 3
    return 1 / 6 - z / 120 + z * z / 5040


def uv_lambert(mu, r1, r2, tof, retro=False, revs=0, branch="left"):
    r1 = np.asarray(r1, float)
    r2 = np.asarray(r2, float)
    n1, n2 = np.linalg.norm(r1), np.linalg.norm(r2)
    cosd = np.dot(r1, r2) / (n1 * n2)
    dnu = math.acos(max(-1.0, min(1.0, cosd)))
    hz = np.cross(r1, r2)[2]
    if (not retro and hz < 0) or (retro and hz >= 0):
        dnu = 2 * math.pi - dnu
    A = math.sin(dnu) * math.sqrt(n1 * n2 / (1 - math.cos(dnu)))

    def y(z):
        return n1 + n2 + A * (z * stumpS(z) - 1) / math.sqrt(stumpC(z))

    def t(z):
        yz = y(z)
        if yz < 0:
            return -1.0
        chi = math.sqrt(yz / stumpC(z))
        return (chi ** 3 * stumpS(z) + A * math.sqrt(yz)) / math.sqrt(mu)

    eps = 1e-7
    if revs == 0:
        hi = (2 * math.pi) ** 2 * (1 - eps)
        lo = -4.0
        while t(lo) < 0 or t(lo) > tof:
            if t(lo) < 0:
                lo = lo / 2 if lo < 0 else lo + 0.1
            else:
                lo *= 2
            if abs(lo) > 1e6:
                raise RuntimeError("no bracket")
        # t is increasing in z; y(lo) may be negative for short tofs with A>0
        zlo = lo
        while t(zlo) < 0:
            zlo += 0.01
        z = brentq(lambda z: t(z) - tof, zlo, hi, xtol=1e-15, rtol=4 * np.finfo(float).eps,
                   maxiter=500)
    else:
        zl = (2 * math.pi * revs) ** 2 * (1 + eps)
        zh = (2 * math.pi * (revs + 1)) ** 2 * (1 - eps)
        m = minimize_scalar(t, bounds=(zl, zh), method="bounded",
                            options={"xatol": 1e-12})
        zm = m.x
        if t(zm) > tof:
            raise RuntimeError("tof below minimum for revs")
        if branch == "left":  # larger z: swept eccentric anomaly nearer 2pi(N+1)
            z = brentq(lambda z: t(z) - tof, zm, zh, xtol=1e-15,
                       rtol=4 * np.finfo(float).eps, maxiter=500)
        else:
            z = brentq(lambda z: t(z) - tof, zl, zm, xtol=1e-15,
                       rtol=4 * np.finfo(float).eps, maxiter=500)
    yz = y(z)
    f = 1 - yz / n1
    g = A * math.sqrt(yz / mu)
    gdot = 1 - yz / n2
    v1 = (r2 - f * r1) / g
    v2 = (gdot * r2 - r1) / g
    return v1, v2, z


def twobody(t, s, mu):
    r = s[:3]
    a = -mu * r / np.linalg.norm(r) ** 3
    return np.concatenate([s[3:], a])


def miss(mu, r1, v1, r2, v2, tof):
    sol = solve_ivp(twobody, (0, tof), np.concatenate([r1, v1]), args=(mu,),
                    method="DOP853", rtol=1e-13, atol=1e-10)
    end = sol.y[:, -1]
    return (float(np.linalg.norm(end[:3] - np.asarray(r2))),
            float(np.linalg.norm(end[3:] - v2)))


def propagate(mu, r1, v1, tof):
    sol = solve_ivp(twobody, (0, tof), np.concatenate([r1, v1]), args=(mu,),
                    method="DOP853", rtol=1e-13, atol=1e-10)
    return sol.y[:3, -1], sol.y[3:, -1]


def mp_propagate(mu, r0, v0, dt):
    """40-digit universal-variable Kepler propagation (Curtis 3rd ed.
    Algorithms 3.3 and 3.4). Arguments are mpf or floats; returns mpf lists."""
    mu = mp.mpf(mu)
    dt = mp.mpf(dt)
    r0 = [mp.mpf(x) for x in r0]
    v0 = [mp.mpf(x) for x in v0]

    def C(z):
        if z > 0:
            return (1 - mp.cos(mp.sqrt(z))) / z
        if z < 0:
            return (mp.cosh(mp.sqrt(-z)) - 1) / (-z)
        return mp.mpf(1) / 2

    def S(z):
        if z > 0:
            q = mp.sqrt(z)
            return (q - mp.sin(q)) / q ** 3
        if z < 0:
            q = mp.sqrt(-z)
            return (mp.sinh(q) - q) / q ** 3
        return mp.mpf(1) / 6

    rn = mp.sqrt(sum(x * x for x in r0))
    vr = sum(a * b for a, b in zip(r0, v0)) / rn
    al = 2 / rn - sum(x * x for x in v0) / mu
    sm = mp.sqrt(mu)
    F = lambda x: (rn * vr / sm * x ** 2 * C(al * x ** 2) + (1 - al * rn) * x ** 3 * S(al * x ** 2)
                   + rn * x - sm * dt)
    # F increases with x: bracket by doubling from a small value, then
    # refine with the Illinois (regula falsi) solver.
    lo, hi = mp.mpf(0), mp.mpf("1e-3")
    while F(hi) <= 0:
        lo, hi = hi, 2 * hi
    x = mp.findroot(F, (lo, hi), solver="illinois", tol=mp.mpf(10) ** (-(mp.mp.dps - 8)))
    z = al * x ** 2
    f = 1 - x ** 2 / rn * C(z)
    g = dt - x ** 3 * S(z) / sm
    r = [f * a + g * b for a, b in zip(r0, v0)]
    rr = mp.sqrt(sum(q * q for q in r))
    fd = sm / (rr * rn) * (z * S(z) - 1) * x
    gd = 1 - x ** 2 / rr * C(z)
    v = [fd * a + gd * b for a, b in zip(r0, v0)]
    return r, v


def polish(mu, r1, r2, tof, guess):
    """Newton polish (mpmath.findroot, 40 digits) of v1 so that the 40-digit
    Kepler propagation of (r1, v1) over tof ends at r2. In the plane z = 0
    (both positions) only (vx, vy) are solved: there the end point hardly
    depends on vz near 0 and 180 degrees. Returns v1, v2 as floats."""
    mp.mp.dps = 40
    planar = r1[2] == 0 and r2[2] == 0
    target = [mp.mpf(q) for q in r2]

    def resid(*v):
        vv = list(v) + [0] * (3 - len(v))
        r, _ = mp_propagate(mu, r1, vv, tof)
        return [r[i] - target[i] for i in range(len(v))]

    start = [mp.mpf(q) for q in (guess[:2] if planar else guess)]
    sol = mp.findroot(resid, tuple(start), tol=mp.mpf(10) ** -50)
    v1 = [sol[i] for i in range(len(start))] + ([mp.mpf(0)] if planar else [])
    _, v2 = mp_propagate(mu, r1, v1, tof)
    mp.mp.dps = 15
    return np.array([float(q) for q in v1]), np.array([float(q) for q in v2])


def shoot(mu, r1, r2, tof, guess):
    """Planar shooting (r1, r2 in the xy plane): find v1 = (vx, vy, 0) with
    propagate(r1, v1, tof) = r2 by scipy.optimize.fsolve on solve_ivp,
    started from guess. Used where the universal-variable formulas divide by
    a vanishing sin(transfer angle) (near 0 and 180 degrees)."""
    r1 = np.asarray(r1, float)
    r2 = np.asarray(r2, float)
    assert r1[2] == 0 and r2[2] == 0
    vxy = fsolve(lambda v: propagate(mu, r1, np.array([v[0], v[1], 0.0]), tof)[0][:2] - r2[:2],
                 np.asarray(guess[:2], float), xtol=1e-13, full_output=False)
    return np.array([vxy[0], vxy[1], 0.0])


def sensitivity(mu, r1, r2, tof, v1):
    """Smallest singular value (s) of the Jacobian d r(tof) / d v1 (in the
    plane for planar cases), by central differences on the 25-digit Kepler
    propagation. A velocity is determined only to about (position rounding) /
    sigma_min: the tests use this to set their tolerance."""
    mp.mp.dps = 25
    planar = r1[2] == 0 and r2[2] == 0
    k = 2 if planar else 3
    h = 1e-6
    J = np.zeros((k, k))
    for j in range(k):
        vp = list(map(float, v1))
        vm = list(map(float, v1))
        vp[j] += h
        vm[j] -= h
        rp, _ = mp_propagate(mu, r1, vp, tof)
        rm, _ = mp_propagate(mu, r1, vm, tof)
        for i in range(k):
            J[i, j] = float((rp[i] - rm[i]) / (2 * h))
    mp.mp.dps = 15
    return float(np.linalg.svd(J, compute_uv=False).min())


def lambert_case(name, mu, r1, r2, tof, retro=False, revs=0, branch="left",
                 guess_r2=None):
    """Universal variables give v1 (or, with guess_r2, they solve the nearby
    well-conditioned end point guess_r2 to seed a solve_ivp shooting for r2);
    then v1 is polished at 40 digits and checked with solve_ivp."""
    if guess_r2 is None:
        v1, _, z = uv_lambert(mu, r1, r2, tof, retro, revs, branch)
        method = "universal variables (brentq)"
    else:
        g1, _, _ = uv_lambert(mu, r1, guess_r2, tof, retro, revs, branch)
        v1 = shoot(mu, r1, r2, tof, g1)
        z = None
        method = ("shooting (fsolve on solve_ivp) seeded by universal variables at %s"
                  % (list(map(float, guess_r2)),))
    seed = v1.copy()
    v1, v2 = polish(mu, r1, r2, tof, v1)
    method += ", polished by mpmath.findroot on a 40-digit Kepler propagation"
    dr, dv = miss(mu, np.asarray(r1, float), v1, r2, v2, tof)
    sigma = sensitivity(mu, r1, r2, tof, v1)
    return {"name": name, "method": method, "sigma_min_s": sigma, "mu": mu, "r1": list(map(float, r1)),
            "r2": list(map(float, r2)), "tof": tof, "retrograde": retro,
            "revs": revs, "branch": branch,
            "v1": [float(x) for x in v1], "v2": [float(x) for x in v2],
            "polish_change_km_s": float(np.linalg.norm(v1 - seed)),
            "z": z, "ivp_miss_km": dr, "ivp_dv_km_s": dv}


def rot_z(r, ang):
    c, s = math.cos(ang), math.sin(ang)
    return [r * c, r * s, 0.0]


cases = [
    # Vallado 4th ed. Example 7-5 inputs (as recalled).
    lambert_case("vallado-7-5", MU_V, [15945.34, 0, 0],
                 [12214.83899, 10249.46731, 0], 76 * 60.0),
    # Curtis 3rd ed. Example 5.2 inputs (as recalled).
    lambert_case("curtis-5-2", MU_C, [5000, 10000, 2100],
                 [-14600, 2500, 7000], 3600.0),
    lambert_case("curtis-5-2-retrograde", MU_C, [5000, 10000, 2100],
                 [-14600, 2500, 7000], 3600.0, retro=True),
    # Hyperbolic: the Curtis geometry in 15 minutes.
    lambert_case("curtis-5-2-fast", MU_C, [5000, 10000, 2100],
                 [-14600, 2500, 7000], 900.0),
    # Near 180 degrees: 7000 km to 9000 km, transfer angle 180 - 1e-6 deg
    # and 180 + 1e-6 deg, 1.1 h.
    lambert_case("near-180-short", MU_V, [7000.0, 0, 0],
                 rot_z(9000.0, math.radians(180 - 1e-6)), 3960.0,
                 guess_r2=rot_z(9000.0, math.radians(179))),
    lambert_case("near-180-long", MU_V, [7000.0, 0, 0],
                 rot_z(9000.0, math.radians(180 + 1e-6)), 3960.0,
                 guess_r2=rot_z(9000.0, math.radians(181))),
    # Near 0 degrees: 1e-3 deg the short way (a nearly radial up-and-down
    # arc) and, between equal radii, the long way round (nearly a circle).
    lambert_case("near-0-short", MU_V, [7000.0, 0, 0],
                 rot_z(7100.0, math.radians(1e-3)), 600.0,
                 guess_r2=rot_z(7100.0, math.radians(1e-3))),
    lambert_case("near-0-long", MU_V, [7000.0, 0, 0],
                 rot_z(7000.0, math.radians(1e-3)), 6000.0, retro=True,
                 guess_r2=rot_z(7000.0, math.radians(1))),
    # Strongly hyperbolic (about 700 km/s): 30 000 km in 78 s.
    lambert_case("hyperbolic-extreme", MU_V,
                 [4035.993909224628, -11144.187680863723, -28826.688291224928],
                 [-21400.00286749506, -4421.184209819943, 4042.705282654552], 77.83518416636505),
    # Multi-revolution: 7000 km to 8000 km at 100 deg, 5 h.
    lambert_case("multi-1-left", MU_V, [7000.0, 0, 0],
                 [8000 * math.cos(math.radians(100)), 8000 * math.sin(math.radians(100)) * 0.8,
                  8000 * math.sin(math.radians(100)) * 0.6], 5 * 3600.0, revs=1, branch="left"),
    lambert_case("multi-1-right", MU_V, [7000.0, 0, 0],
                 [8000 * math.cos(math.radians(100)), 8000 * math.sin(math.radians(100)) * 0.8,
                  8000 * math.sin(math.radians(100)) * 0.6], 5 * 3600.0, revs=1, branch="right"),
    lambert_case("multi-2-left", MU_V, [7000.0, 0, 0],
                 [8000 * math.cos(math.radians(100)), 8000 * math.sin(math.radians(100)) * 0.8,
                  8000 * math.sin(math.radians(100)) * 0.6], 5 * 3600.0, revs=2, branch="left"),
    lambert_case("multi-2-right", MU_V, [7000.0, 0, 0],
                 [8000 * math.cos(math.radians(100)), 8000 * math.sin(math.radians(100)) * 0.8,
                  8000 * math.sin(math.radians(100)) * 0.6], 5 * 3600.0, revs=2, branch="right"),
    lambert_case("multi-3-left-retro", MU_V, [-6500.0, 2000.0, 1000.0],
                 [4000.0, 9000.0, -3000.0], 12 * 3600.0, retro=True, revs=3, branch="left"),
    lambert_case("multi-3-right-retro", MU_V, [-6500.0, 2000.0, 1000.0],
                 [4000.0, 9000.0, -3000.0], 12 * 3600.0, retro=True, revs=3, branch="right"),
]
out["lambert"] = cases

json.dump(out, sys.stdout, indent=1)
sys.stdout.write("\n")
