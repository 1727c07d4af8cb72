#!/usr/bin/python3
"""Reference lifetimes of circular orbits in an exponential atmosphere,
for propagate/decay TestExponentialAgainstSciPy.

Run with Debian's interpreter (python3-scipy 1.10.1):

    /usr/bin/python3 testdata/lifetime/exponential_scipy.py

from the repository root; it rewrites exponential_scipy.json beside it.
About a spherical, non-rotating Earth without zonal terms, a circular
orbit in the atmosphere rho = rho0 exp(-(h - h0)/H) decays at the
first-order rate da/dt = -(rho/B) sqrt(mu a) (King-Hele, Satellite Orbits
in an Atmosphere, 1987; with rho/B in 1/m, times 1000 for km), so the
lifetime from a0 to the reentry radius ar is
T = int_ar^a0 B / (1000 rho(a - Re) sqrt(mu a)) da,
evaluated by scipy.integrate.quad. Nothing here comes from the Go code.
"""
import json
import math
import os

from scipy import integrate

MU = 398600.4418   # km^3/s^2, WGS 84
RE = 6378.137      # km, WGS 84 a


def lifetime(h0_alt, hr, rho0, h_ref, scale_h, b):
    def rho(h):
        return rho0 * math.exp(-(h - h_ref) / scale_h)

    def f(a):
        return b / (1000 * rho(a - RE) * math.sqrt(MU * a))

    t, _ = integrate.quad(f, RE + hr, RE + h0_alt, epsabs=0, epsrel=1e-13, limit=200)
    return t


def main():
    cases = []
    for h0_alt, hr, rho0, h_ref, scale_h, b in [
        (330.0, 150.0, 3e-12, 400.0, 55.0, 50.0),
        (450.0, 120.0, 6.967e-13, 500.0, 63.822, 30.0),
        (250.0, 100.0, 2.789e-10, 200.0, 37.105, 80.0),
    ]:
        cases.append({"altitude_km": h0_alt, "reentry_alt_km": hr, "rho0_kg_m3": rho0, "h0_km": h_ref,
                      "scale_height_km": scale_h, "ballistic_coefficient_kg_m2": b,
                      "lifetime_s": lifetime(h0_alt, hr, rho0, h_ref, scale_h, b)})
    out = {"source": "scipy.integrate.quad (SciPy 1.10.1), script exponential_scipy.py", "mu_km3_s2": MU,
           "re_km": RE, "cases": cases}
    with open(os.path.join(os.path.dirname(os.path.abspath(__file__)), "exponential_scipy.json"), "w") as f:
        json.dump(out, f, indent=1)


if __name__ == "__main__":
    main()
