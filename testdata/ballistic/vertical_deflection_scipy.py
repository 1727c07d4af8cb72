#!/usr/bin/python3
"""Reference vertical launches from the equator of a rotating spherical Earth
in an inverse-square field (no drag), for the centra ballistic tests: an
independent computation with SciPy in inertial plane polar coordinates.

The body starts on the sphere r = R, moving outwards at v0 (relative to the
surface) and eastwards with the surface, so its angular momentum per unit
mass is L = R^2 omega. With r'' = L^2/r^3 - mu/r^2 and theta' = L/r^2
(scipy.integrate.solve_ivp, DOP853, rtol 1e-13) it comes down at r = R after
t_f, and the ground point below the launch has turned by omega t_f, so the
impact lies west by R (omega t_f - theta_f). v0 is found by the secant
method for apogee heights of 100 and 300 km; the uniform-gravity formula
(4/3) omega sqrt(8 h^3 / g), g = mu/R^2 - omega^2 R, is printed beside it.

Run with Debian's interpreter (SciPy 1.10.1, NumPy 1.24.2):
    /usr/bin/python3 testdata/ballistic/vertical_deflection_scipy.py > testdata/ballistic/vertical_deflection_scipy.json
CI does not run this script; the tests read the JSON it wrote.
"""
import json
import math

import numpy as np
import scipy
from scipy.integrate import solve_ivp

MU = 398600.4418      # km^3/s^2, WGS 84 GM (NIMA TR8350.2 Table 3.1)
R = 6378.137          # km, sphere of the WGS 84 equatorial radius
OMEGA = 7.292115e-5   # rad/s, WGS 84 rotation rate


def fly(v0):
    L = R * R * OMEGA

    def rhs(_t, y):
        r, _th, rd = y
        return [rd, L / r**2, L * L / r**3 - MU / r**2]

    def impact(_t, y):
        return y[0] - R
    impact.terminal, impact.direction = True, -1

    def apogee(_t, y):
        return y[2]
    apogee.direction = -1
    s = solve_ivp(rhs, (0, 5000), [R, 0.0, v0], method="DOP853", events=[impact, apogee], rtol=1e-13, atol=1e-12)
    tf = s.t_events[0][0]
    thf = s.y_events[0][0][1]
    h = s.y_events[1][0][0] - R
    return R * (OMEGA * tf - thf), h, tf, s.t_events[1][0]


def main():
    out = {"source": "testdata/ballistic/vertical_deflection_scipy.py, scipy %s, numpy %s" % (scipy.__version__, np.__version__),
           "mu_km3_s2": MU, "radius_km": R, "omega_rad_s": OMEGA, "cases": []}
    for H in (100.0, 300.0):
        v0 = math.sqrt(2 * (MU / R**2) * H)
        for _ in range(40):
            d, h, _, _ = fly(v0)
            _, h2, _, _ = fly(v0 * (1 + 1e-6))
            step = (h - H) * v0 * 1e-6 / (h2 - h)
            v0 -= step
            if abs(step) < 1e-15:
                break
        d, h, tf, ta = fly(v0)
        g = MU / R**2 - OMEGA**2 * R
        formula = 4 / 3 * OMEGA * math.sqrt(8 * H**3 / g)
        out["cases"].append({"apogee_alt_km": h, "burnout_speed_km_s": v0, "flight_time_s": tf, "time_to_apogee_s": ta,
                             "deflection_west_km": d, "formula_km": formula})
    print(json.dumps(out, indent=1))


main()
