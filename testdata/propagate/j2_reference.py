#!/usr/bin/python3
"""Reference ephemerides for centra/propagate: two-body + J2 motion.

Integrates r'' = -mu r/|r|^3 + a_J2(r) with SciPy's solve_ivp, method
DOP853, rtol 1e-13, atol 1e-15 (km, km/s), and writes states every 600 s
over one day for two cases to j2_reference.json beside this script.

Run with Debian's interpreter (python3-scipy 1.10.1, python3-numpy 1.24.2):
    /usr/bin/python3 testdata/propagate/j2_reference.py

CI does not run this script; the Go tests read the JSON it wrote.

Constants:
  mu = 398600.4418 km^3/s^2   WGS 84 (NIMA TR8350.2, Table 3.1)
  Re = 6378.137 km             WGS 84 semi-major axis (NIMA TR8350.2, Table 3.1)
  J2 = -C20 sqrt(5), C20 = -4.84165143790815e-4 (EGM2008, fully normalized)

The J2 acceleration is the closed form obtained by differentiating the
potential U = -mu/r [1 - J2 (Re/r)^2 P2(z/r)], P2(s) = (3 s^2 - 1)/2:
  a = -mu r/r^3 [1 - 3/2 J2 (Re/r)^2 (5 z^2/r^2 - 1)] for x, y,
  a_z = -mu z/r^3 [1 - 3/2 J2 (Re/r)^2 (5 z^2/r^2 - 3)].

Initial states come from classical elements through the perifocal-to-
inertial rotation R3(-RAAN) R1(-i) R3(-argp) (Vallado, Fundamentals of
Astrodynamics and Applications, 4th ed., algorithm COE2RV; algorithm number
not quoted), written out here with numpy.

The error of the reference itself is estimated by repeating each case at
rtol 1e-12 and recording the largest position difference (the 1e-13 run is
more accurate than that).
"""
import json
import math
import os

import numpy as np
import scipy
from scipy.integrate import solve_ivp

MU = 398600.4418
RE = 6378.137
C20 = -4.84165143790815e-4
J2 = -C20 * math.sqrt(5.0)


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
    r_pqw = np.array([p * math.cos(nu) / (1 + e * math.cos(nu)), p * math.sin(nu) / (1 + e * math.cos(nu)), 0.0])
    v_pqw = np.array([-math.sqrt(MU / p) * math.sin(nu), math.sqrt(MU / p) * (e + math.cos(nu)), 0.0])

    def r3(t):
        c, s = math.cos(t), math.sin(t)
        return np.array([[c, s, 0.0], [-s, c, 0.0], [0.0, 0.0, 1.0]])

    def r1(t):
        c, s = math.cos(t), math.sin(t)
        return np.array([[1.0, 0.0, 0.0], [0.0, c, s], [0.0, -s, c]])

    m = r3(-raan) @ r1(-i) @ r3(-argp)
    return list(m @ r_pqw) + list(m @ v_pqw)


CASES = [
    # name, a km, e, i deg, raan deg, argp deg, nu deg
    ("leo-500km-51.6deg", RE + 500.0, 0.0, 51.6, 30.0, 0.0, 0.0),
    ("eccentric-0.7", 24000.0, 0.7, 28.5, 45.0, 270.0, 10.0),
]

SPAN = 86400.0
STEP = 600.0


def run(y0, rtol, atol):
    t_eval = np.arange(0.0, SPAN + STEP / 2, STEP)
    sol = solve_ivp(rhs, (0.0, SPAN), y0, method="DOP853", rtol=rtol, atol=atol, t_eval=t_eval)
    assert sol.success, sol.message
    return sol


def main():
    out = {
        "source": "scipy.integrate.solve_ivp DOP853, SciPy %s, NumPy %s; script j2_reference.py" % (scipy.__version__, np.__version__),
        "mu_km3_s2": MU,
        "re_km": RE,
        "j2": J2,
        "rtol": 1e-13,
        "atol": 1e-15,
        "step_s": STEP,
        "span_s": SPAN,
        "cases": [],
    }
    for name, a, e, i, raan, argp, nu in CASES:
        y0 = coe2rv(a, e, math.radians(i), math.radians(raan), math.radians(argp), math.radians(nu))
        sol = run(y0, 1e-13, 1e-15)
        loose = run(y0, 1e-12, 1e-14)
        diff = float(np.max(np.linalg.norm(sol.y[:3] - loose.y[:3], axis=0)))
        out["cases"].append({
            "name": name,
            "elements": {"a_km": a, "e": e, "i_deg": i, "raan_deg": raan, "argp_deg": argp, "nu_deg": nu},
            "state0": [float(v) for v in y0],
            "evaluations": int(sol.nfev),
            "rtol12_vs_rtol13_max_km": diff,
            "states": [[float(sol.t[k])] + [float(v) for v in sol.y[:, k]] for k in range(len(sol.t))],
        })
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "j2_reference.json")
    with open(path, "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
