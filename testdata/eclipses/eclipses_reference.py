#!/usr/bin/python3
"""Reference eclipses for centra/propagate/shadow and `centra eclipses`.

Two parts, each computed here with numpy, SciPy and ERFA only:

1. Fixed geometry. A circular orbit of radius R + h in the plane z = 0,
   the Sun fixed at 1 au in the direction (cos beta, 0, sin beta). The
   conical shadow model (Montenbruck and Gill, Satellite Orbits, 2000, sec.
   3.4.2: apparent radii a = asin(Rs/|s - r|), b = asin(R/|r|), separation c
   of the centres; umbra c < b - a, penumbra c < a + b) is written out below;
   the angles of the first to fourth contacts are located with
   scipy.optimize.brentq (xtol 1e-13 rad) and turned into times with the
   mean motion. The cylindrical duration (Vallado, Fundamentals of
   Astrodynamics and Applications, 4th ed., sec. 5.3)
   T/pi * acos(sqrt(h^2 + 2Rh) / ((R + h) cos beta)) is written beside it.

2. A propagated case. An orbit integrated with solve_ivp (DOP853, rtol 1e-12,
   atol 1e-12) under two-body + J2 gravity, the Sun from ERFA epv00
   (geocentric Sun = minus the heliocentric Earth, ICRS axes = GCRF; TT used
   for TDB), the contacts located by scanning every 10 s and brentq
   (xtol 1e-7 s); the beta angle asin(h.s/|h||s|) at the start of each day.

Run with Debian's interpreter (python3-erfa 2.0.0.1, python3-scipy 1.10.1,
python3-numpy 1.24.2) from the repository root:

    /usr/bin/python3 testdata/eclipses/eclipses_reference.py

It writes eclipses_reference.json beside itself; CI does not run it.

Constants:
  mu = 398600.4418 km^3/s^2, R = 6378.137 km   WGS 84 (NIMA TR8350.2, Table 3.1)
  J2 = -C20 sqrt(5), C20 = -4.84165143790815e-4 (EGM2008, fully normalized)
  Rs = 695700 km                                IAU 2015 Resolution B3 (nominal solar radius)
  au = 149597870.7 km                           IAU 2012 Resolution B2
"""
import json
import math
import os

import erfa
import numpy as np
import scipy
from scipy.integrate import solve_ivp
from scipy.optimize import brentq

MU = 398600.4418
RE = 6378.137
RS = 695700.0
AU = 149597870.7
C20 = -4.84165143790815e-4
J2 = -C20 * math.sqrt(5.0)
HERE = os.path.dirname(os.path.abspath(__file__))
deg = math.pi / 180


def angles(r, s):
    d = s - r
    a = math.asin(RS / np.linalg.norm(d))
    b = math.asin(RE / np.linalg.norm(r))
    m = -r
    c = math.atan2(np.linalg.norm(np.cross(m, d)), np.dot(m, d))
    return a, b, c


def umbra(r, s):
    a, b, c = angles(r, s)
    return b - a - c


def penumbra(r, s):
    a, b, c = angles(r, s)
    return a + b - c


# --- 1. fixed geometry -------------------------------------------------------
fixed = []
for h, beta_deg in [(500.0, 0.0), (500.0, 30.0), (500.0, 60.0), (500.0, 66.0), (35786.0, 0.0), (35786.0, 5.0), (500.0, 75.0)]:
    r = RE + h
    n = math.sqrt(MU / r ** 3)
    T = 2 * math.pi / n
    beta = beta_deg * deg
    s = AU * np.array([math.cos(beta), 0.0, math.sin(beta)])
    pos = lambda phi: r * np.array([math.cos(phi), math.sin(phi), 0.0])
    x = math.sqrt(h * h + 2 * RE * h) / (r * math.cos(beta))
    cyl = T / math.pi * math.acos(x) if x < 1 else 0.0
    out = dict(alt_km=h, beta_deg=beta_deg, period_s=T, cylindrical_s=cyl)
    for name, f in (("umbra", umbra), ("penumbra", penumbra)):
        g = lambda phi: f(pos(phi), s)
        if g(math.pi) <= 0:
            out[name + "_s"] = 0.0
            continue
        # g > 0 around phi = pi (behind the Earth); find where it ends.
        lo = brentq(g, math.pi / 2, math.pi, xtol=1e-13)
        hi = brentq(g, math.pi, 1.5 * math.pi, xtol=1e-13)
        out[name + "_s"] = (hi - lo) / n
    fixed.append(out)

# --- 2. propagated case --------------------------------------------------------


def rhs(t, y):
    x, yy, z = y[0], y[1], y[2]
    r2 = x * x + yy * yy + z * z
    r = math.sqrt(r2)
    k = -MU / (r2 * r)
    q = 1.5 * J2 * RE * RE / r2
    s2 = z * z / r2
    kr = k * (1.0 - q * (5.0 * s2 - 1.0))
    kz = k * (1.0 - q * (5.0 * s2 - 3.0))
    return [y[3], y[4], y[5], kr * x, kr * yy, kz * z]


def coe2rv(a, e, i, raan, argp, nu):
    p = a * (1.0 - e * e)
    rp = np.array([p * math.cos(nu) / (1 + e * math.cos(nu)), p * math.sin(nu) / (1 + e * math.cos(nu)), 0.0])
    vp = np.array([-math.sqrt(MU / p) * math.sin(nu), math.sqrt(MU / p) * (e + math.cos(nu)), 0.0])

    def r3(a):
        c, s = math.cos(a), math.sin(a)
        return np.array([[c, s, 0], [-s, c, 0], [0, 0, 1]])

    def r1(a):
        c, s = math.cos(a), math.sin(a)
        return np.array([[1, 0, 0], [0, c, s], [0, -s, c]])

    m = r3(-raan) @ r1(-i) @ r3(-argp)
    return m @ rp, m @ vp


EPOCH = (2027, 4, 13, 0, 0, 0.0)
SPAN = 2 * 86400.0
utc1, utc2 = erfa.dtf2d("UTC", *EPOCH)
tai1, tai2 = erfa.utctai(utc1, utc2)
TT1, TT2 = erfa.taitt(tai1, tai2)


def sun(t):
    pvh, _ = erfa.epv00(TT1, TT2 + t / 86400.0)
    return -np.array(pvh[0]) * AU


r0, v0 = coe2rv(RE + 420.0, 0.0005, 51.6 * deg, 30.0 * deg, 80.0 * deg, 0.0)
sol = solve_ivp(rhs, (0.0, SPAN), np.concatenate([r0, v0]), method="DOP853", rtol=1e-12, atol=1e-12, dense_output=True)
assert sol.success
pos = lambda t: sol.sol(t)[:3]

events = []
for kind, f in (("penumbra", penumbra), ("umbra", umbra)):
    g = lambda t: f(pos(t), sun(t))
    ts = np.arange(0.0, SPAN + 1e-9, 10.0)
    gs = [g(t) for t in ts]
    entry = 0.0 if gs[0] > 0 else None
    for k in range(len(ts) - 1):
        if gs[k] <= 0 < gs[k + 1]:
            entry = brentq(g, ts[k], ts[k + 1], xtol=1e-7, rtol=1e-15)
        elif gs[k] > 0 >= gs[k + 1]:
            exit_ = brentq(g, ts[k], ts[k + 1], xtol=1e-7, rtol=1e-15)
            st = sol.sol(entry)
            h = np.cross(st[:3], st[3:])
            s = sun(entry)
            beta = math.asin(np.dot(h, s) / (np.linalg.norm(h) * np.linalg.norm(s)))
            events.append(dict(kind=kind, entry_t_s=entry, exit_t_s=exit_, duration_s=exit_ - entry, beta_deg=beta / deg, partial=(entry == 0.0)))
    if gs[-1] > 0:
        events.append(dict(kind=kind, entry_t_s=entry, exit_t_s=SPAN, duration_s=SPAN - entry, partial=True))
events.sort(key=lambda e: (e["entry_t_s"], e["kind"] != "penumbra"))

betas = []
for t in np.arange(0.0, SPAN + 1e-9, 86400.0):
    st = sol.sol(t)
    h = np.cross(st[:3], st[3:])
    s = sun(t)
    betas.append(dict(t_s=t, beta_deg=math.asin(np.dot(h, s) / (np.linalg.norm(h) * np.linalg.norm(s))) / deg))

doc = dict(
    source="testdata/eclipses/eclipses_reference.py: SciPy %s solve_ivp DOP853 rtol 1e-12 with J2, brentq; ERFA %s epv00; conical model written out" % (scipy.__version__, erfa.__version__),
    fixed=fixed,
    propagated=dict(epoch_utc="2027-04-13T00:00:00Z", span_s=SPAN, position_km=list(r0), velocity_km_s=list(v0),
                    elements=dict(alt_km=420.0, e=0.0005, i_deg=51.6, raan_deg=30.0, argp_deg=80.0, nu_deg=0.0),
                    events=events, beta=betas),
)
with open(os.path.join(HERE, "eclipses_reference.json"), "w") as f:
    json.dump(doc, f, indent=1)
for c in fixed:
    print(c)
print(len(events), "events; first", events[:2], "beta", betas)
