#!/usr/bin/python3
"""Reference passes for centra/propagate/visibility and `centra passes`.

An orbit is integrated with SciPy (solve_ivp, DOP853, rtol 1e-12,
atol 1e-12 km and km/s) under two-body + J2 gravity; every position is
rotated into the Earth-fixed frame with ERFA c2t06a (IAU 2006/2000A,
CIO based, polar motion xp = yp = 0); sites are placed on the WGS 84
ellipsoid with ERFA gd2gc; elevation, azimuth and range are computed here
from the local east-north-up frame with numpy. AOS and LOS are located
with scipy.optimize.brentq (xtol 1e-7 s), the greatest elevation and the
least range with scipy.optimize.minimize_scalar (bounded, xatol 1e-7 s),
and the zero of the range rate (the Doppler shift's sign change) with
brentq. Range rates are central differences of the range over +-0.05 s
(fourth-order five-point stencil).

Run with Debian's interpreter (python3-erfa 2.0.0.1, python3-scipy 1.10.1,
python3-numpy 1.24.2) from the repository root:

    /usr/bin/python3 testdata/passes/passes_reference.py

It writes passes_reference.json beside itself. CI does not run it; the Go
tests read the JSON. Nothing here comes from the Go code under test.

Conventions shared with centra (and stated in its DESIGN):
  * UT1 = UTC + DUT1 with DUT1 = 0 at the epoch, then UT1 runs on uniformly
    with TT (no leap second falls in the span).
  * The J2 field is symmetric about the z axis of the GCRF.
  * Elevation is geometric (no refraction), relative to the plane normal to
    the WGS 84 ellipsoid normal at the site.

Constants:
  mu = 398600.4418 km^3/s^2   WGS 84 (NIMA TR8350.2, Table 3.1)
  Re = 6378.137 km             WGS 84 semi-major axis (NIMA TR8350.2, Table 3.1)
  J2 = -C20 sqrt(5), C20 = -4.84165143790815e-4 (EGM2008, fully normalized)
The initial state is given in GCRF from classical elements through the
perifocal rotation R3(-RAAN) R1(-i) R3(-argp), written out with numpy.
"""
import json
import math
import os

import erfa
import numpy as np
import scipy
from scipy.integrate import solve_ivp
from scipy.optimize import brentq, minimize_scalar

MU = 398600.4418
RE = 6378.137
C20 = -4.84165143790815e-4
J2 = -C20 * math.sqrt(5.0)
HERE = os.path.dirname(os.path.abspath(__file__))

EPOCH = (2027, 4, 13, 0, 0, 0.0)
SPAN = 86400.0


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


utc1, utc2 = erfa.dtf2d("UTC", *EPOCH)
tai1, tai2 = erfa.utctai(utc1, utc2)
TT1, TT2 = erfa.taitt(tai1, tai2)
UT11, UT12 = erfa.utcut1(utc1, utc2, 0.0)


def c2t(t):
    d = t / 86400.0
    return erfa.c2t06a(TT1, TT2 + d, UT11, UT12 + d, 0.0, 0.0)


def utc_of(t):
    """UTC string of t s after the epoch (no leap second in the span)."""
    iy, im, idd, ihmsf = erfa.d2dtf("UTC", 6, utc1, utc2 + t / 86400.0)
    h, m, s, f = ihmsf
    return "%04d-%02d-%02dT%02d:%02d:%02d.%06dZ" % (iy, im, idd, h, m, s, f)


deg = math.pi / 180
# A dawn-dusk-ish 500 km orbit, slightly eccentric.
ELEMENTS = dict(a=RE + 500.0, e=0.0012, i=97.4 * deg, raan=200.0 * deg, argp=40.0 * deg, nu=10.0 * deg)
r0, v0 = coe2rv(**ELEMENTS)
sol = solve_ivp(rhs, (0.0, SPAN), np.concatenate([r0, v0]), method="DOP853", rtol=1e-12, atol=1e-12, dense_output=True)
assert sol.success
# Error estimate of the reference: the same at rtol 1e-13.
sol13 = solve_ivp(rhs, (0.0, SPAN), np.concatenate([r0, v0]), method="DOP853", rtol=1e-13, atol=1e-13, dense_output=True)
ref_err_km = max(np.linalg.norm(sol.sol(t)[:3] - sol13.sol(t)[:3]) for t in np.linspace(0, SPAN, 97))


def fixed(t):
    return c2t(t) @ sol.sol(t)[:3]


def site_frame(lat_deg, lon_deg, alt_m):
    xyz = np.array(erfa.gd2gc(1, lon_deg * deg, lat_deg * deg, alt_m)) / 1000.0
    la, lo = lat_deg * deg, lon_deg * deg
    e = np.array([-math.sin(lo), math.cos(lo), 0.0])
    n = np.array([-math.sin(la) * math.cos(lo), -math.sin(la) * math.sin(lo), math.cos(la)])
    u = np.array([math.cos(la) * math.cos(lo), math.cos(la) * math.sin(lo), math.sin(la)])
    return xyz, e, n, u


def look(site, t):
    xyz, e, n, u = site
    d = fixed(t) - xyz
    rng = np.linalg.norm(d)
    el = math.asin(np.dot(d, u) / rng)
    az = math.atan2(np.dot(d, e), np.dot(d, n)) % (2 * math.pi)
    return az, el, rng


def rng_rate(site, t):
    h = 0.05
    f = [look(site, t + k * h)[2] for k in (-2, -1, 1, 2)]
    return (f[0] - 8 * f[1] + 8 * f[2] - f[3]) / (12 * h)


def sun_gcrf(t):
    d = t / 86400.0
    pvh, pvb = erfa.epv00(TT1, TT2 + d)  # TT for TDB: < 2 ms
    return -np.array(pvh[0]) * 149597870.7


def passes(site, min_el_deg):
    thr = min_el_deg * deg
    g = lambda t: look(site, t)[1] - thr
    ts = np.arange(0.0, SPAN + 1e-9, 5.0)
    gs = [g(t) for t in ts]
    out = []
    if gs[0] > 0 or gs[-1] > 0:
        raise SystemExit("choose a span that does not cut a pass: %s %s" % (gs[0], gs[-1]))
    aos = None
    for k in range(len(ts) - 1):
        if gs[k] <= 0 < gs[k + 1]:
            aos = brentq(g, ts[k], ts[k + 1], xtol=1e-7, rtol=1e-15)
        elif gs[k] > 0 >= gs[k + 1] and aos is not None:
            los = brentq(g, ts[k], ts[k + 1], xtol=1e-7, rtol=1e-15)
            m = minimize_scalar(lambda t: -look(site, t)[1], bounds=(aos, los), method="bounded", options=dict(xatol=1e-7))
            tca = m.x
            mr = minimize_scalar(lambda t: look(site, t)[2], bounds=(aos, los), method="bounded", options=dict(xatol=1e-7))
            # The sign change of the range rate near the closest approach.
            t0 = brentq(lambda t: rng_rate(site, t), max(aos, tca - 120), min(los, tca + 120), xtol=1e-6)
            a0, e0, r0_ = look(site, aos)
            a1, e1, r1_ = look(site, tca)
            a2, e2, r2_ = look(site, los)
            s = sun_gcrf(tca)
            sun_fixed = c2t(tca) @ s
            xyz, e_, n_, u_ = site
            ds = sun_fixed - xyz
            sun_el = math.asin(np.dot(ds, u_) / np.linalg.norm(ds))
            out.append(dict(
                aos_t_s=aos, tca_t_s=tca, los_t_s=los,
                aos_utc=utc_of(aos), tca_utc=utc_of(tca), los_utc=utc_of(los),
                duration_s=los - aos,
                max_elevation_deg=e1 / deg,
                aos_azimuth_deg=a0 / deg, tca_azimuth_deg=a1 / deg, los_azimuth_deg=a2 / deg,
                min_range_km=mr.fun, min_range_t_s=mr.x,
                range_rate_aos_km_s=rng_rate(site, aos), range_rate_tca_km_s=rng_rate(site, tca), range_rate_los_km_s=rng_rate(site, los),
                range_rate_zero_t_s=t0,
                sun_elevation_deg=sun_el / deg,
            ))
            aos = None
    return out


# Site A under the ground track 25 min after the epoch: an overhead pass.
rA = fixed(1500.0)
latA, lonA, altA = erfa.gc2gd(1, rA * 1000.0)[1] / deg, erfa.gc2gd(1, rA * 1000.0)[0] / deg, 250.0
latA, lonA = round(latA, 4), round(lonA, 4)
SITES = [
    dict(name="under-track", lat_deg=latA, lon_deg=lonA, alt_m=altA, min_elevation_deg=0.0),
    dict(name="southern", lat_deg=-33.95, lon_deg=18.47, alt_m=40.0, min_elevation_deg=10.0),
]
cases = []
for s in SITES:
    fr = site_frame(s["lat_deg"], s["lon_deg"], s["alt_m"])
    cases.append(dict(site=s, passes=passes(fr, s["min_elevation_deg"])))

doc = dict(
    source="testdata/passes/passes_reference.py: SciPy %s solve_ivp DOP853 rtol 1e-12 with J2; ERFA %s c2t06a (xp = yp = 0), gd2gc (WGS 84); brentq / minimize_scalar" % (scipy.__version__, erfa.__version__),
    epoch_utc=utc_of(0.0),
    span_s=SPAN,
    mu_km3_s2=MU, re_km=RE, j2=J2,
    elements=dict(a_km=ELEMENTS["a"], e=ELEMENTS["e"], i_deg=97.4, raan_deg=200.0, argp_deg=40.0, nu_deg=10.0),
    position_km=list(r0), velocity_km_s=list(v0),
    reference_error_km=ref_err_km,
    cases=cases,
)
with open(os.path.join(HERE, "passes_reference.json"), "w") as f:
    json.dump(doc, f, indent=1)
print("reference error %.3g km" % ref_err_km)
for c in cases:
    print(c["site"]["name"], len(c["passes"]), "passes; max elevations", [round(p["max_elevation_deg"], 3) for p in c["passes"]])
