#!/usr/bin/python3
"""Reference geodesics on the WGS 84 ellipsoid for the centra ballistic
ground range (propagate/suborbital.Inverse, Vincenty's method), computed by
an independent method: the geodesic differential equation integrated with
SciPy and solved by shooting.

A unit-speed curve x(s) on the surface F(x) = (x^2+y^2)/a^2 + z^2/b^2 - 1 = 0
is a geodesic when its acceleration is normal to the surface:

    x'' = -lambda grad F,   lambda = (x'^T H x') / |grad F|^2,   H = diag(2/a^2, 2/a^2, 2/b^2).

From the first point the initial azimuth alpha and the length S are adjusted
(scipy.optimize.fsolve) until the end point reaches the second point; the
integration is scipy.integrate.solve_ivp(method="DOP853", rtol=1e-13,
atol=1e-12 km). Also given: the length of the quarter meridian, the integral
of the meridian radius of curvature a(1-e^2)/(1-e^2 sin^2 phi)^(3/2) from 0
to 90 deg (scipy.integrate.quad).

Run with Debian's interpreter (SciPy 1.10.1, NumPy 1.24.2):
    /usr/bin/python3 testdata/ballistic/geodesic_scipy.py > testdata/ballistic/geodesic_scipy.json
CI does not run this script; the tests read the JSON it wrote.
"""
import json
import math

import numpy as np
import scipy
from scipy.integrate import quad, solve_ivp
from scipy.optimize import fsolve

A = 6378.137                   # km, WGS 84 (NIMA TR8350.2 Table 3.1)
F = 1 / 298.257223563
B = A * (1 - F)
E2 = F * (2 - F)
H = np.array([2 / A**2, 2 / A**2, 2 / B**2])


def ecef(lat, lon):
    n = A / math.sqrt(1 - E2 * math.sin(lat) ** 2)
    return np.array([n * math.cos(lat) * math.cos(lon), n * math.cos(lat) * math.sin(lon), n * (1 - E2) * math.sin(lat)])


def enu(lat, lon):
    sp, cp, sl, cl = math.sin(lat), math.cos(lat), math.sin(lon), math.cos(lon)
    return np.array([-sl, cl, 0.0]), np.array([-sp * cl, -sp * sl, cp])


def rhs(_s, y):
    x, v = y[:3], y[3:]
    g = H * x
    lam = np.dot(v, H * v) / np.dot(g, g)
    return np.concatenate([v, -lam * g])


def shoot(lat1, lon1, alpha, length):
    e, n = enu(lat1, lon1)
    y0 = np.concatenate([ecef(lat1, lon1), math.cos(alpha) * n + math.sin(alpha) * e])
    sol = solve_ivp(rhs, (0, length), y0, method="DOP853", rtol=1e-13, atol=1e-12)
    return sol.y[:, -1]


def geodesic(lat1, lon1, lat2, lon2):
    p2 = ecef(lat2, lon2)
    e2v, n2v = enu(lat2, lon2)
    # first guess: great circle on the mean sphere
    d = math.acos(max(-1, min(1, math.sin(lat1) * math.sin(lat2) + math.cos(lat1) * math.cos(lat2) * math.cos(lon2 - lon1))))
    az = math.atan2(math.cos(lat2) * math.sin(lon2 - lon1),
                    math.cos(lat1) * math.sin(lat2) - math.sin(lat1) * math.cos(lat2) * math.cos(lon2 - lon1))

    def miss(u):
        end = shoot(lat1, lon1, u[0], u[1])[:3] - p2
        return [np.dot(end, e2v), np.dot(end, n2v)]

    u = fsolve(miss, [az, 6371.0 * d], xtol=1e-14)
    end = shoot(lat1, lon1, u[0], u[1])
    miss_km = float(np.linalg.norm(end[:3] - p2))
    v2 = end[3:]
    az2 = math.atan2(np.dot(v2, e2v), np.dot(v2, n2v))
    return u[1], u[0] % (2 * math.pi), az2 % (2 * math.pi), miss_km


CASES = [  # name, lat1, lon1, lat2, lon2 (deg)
    ("short 1 km east", 45.0, 10.0, 45.0, 10.0 + 1.0 / 78.8),
    ("sounding range 150 km", 57.4, -7.3, 57.9, -9.6),
    ("meridian 500 km", 10.0, 20.0, 14.5, 20.0),
    ("equator 1000 km", 0.0, 0.0, 0.0, 8.98),
    ("across the equator 2000 km", -8.0, 30.0, 9.0, 25.0),
    ("long 8000 km", 28.5, -80.6, -7.9, -14.4),
    ("near the pole", 88.0, 0.0, 87.0, 150.0),
    ("southern 18500 km", -33.9, 18.4, 21.3, -157.9),
]


def main():
    out = {"source": "testdata/ballistic/geodesic_scipy.py: shooting on the geodesic equation, scipy %s, numpy %s" % (scipy.__version__, np.__version__),
           "a_km": A, "inv_f": 1 / F, "cases": []}
    for name, la1, lo1, la2, lo2 in CASES:
        s, az1, az2, miss = geodesic(*[math.radians(x) for x in (la1, lo1, la2, lo2)])
        assert miss < 1e-9, (name, miss)
        out["cases"].append({"name": name, "lat1_deg": la1, "lon1_deg": lo1, "lat2_deg": la2, "lon2_deg": lo2,
                             "s_km": s, "az1_deg": math.degrees(az1), "az2_deg": math.degrees(az2), "miss_km": miss})
    m = lambda phi: A * (1 - E2) / (1 - E2 * math.sin(phi) ** 2) ** 1.5
    q, qerr = quad(m, 0, math.pi / 2, epsabs=1e-13, epsrel=1e-15)
    out["quarter_meridian_km"] = q
    print(json.dumps(out, indent=1))


main()
