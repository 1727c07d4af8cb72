#!/usr/bin/python3
"""Reference visible fractions of the solar disc across the Earth's
penumbra, for propagate/forces TestShadowAgainstSciPy.

Run with Debian's interpreter (python3-scipy 1.10.1):

    /usr/bin/python3 testdata/forces/shadow_scipy.py

from the repository root; it rewrites shadow_scipy.json beside it. The
fraction is the area of the solar disc (apparent radius a, centred at
angular distance c from the Earth's centre) outside the Earth's disc
(apparent radius b), integrated over the solar disc in
polar coordinates (the angular integral in closed form, the radial one by
scipy.integrate.quad), divided by pi a^2: flat discs in angle, the model of
Montenbruck and Gill (2000), sec. 3.4.2. Nothing here comes from the Go
code.
"""
import json
import math
import os

from scipy import integrate

AU = 149597870.7          # km, IAU 2012 B2
RE = 6378.137             # km, WGS 84 a
RS = 695700.0             # km, IAU 2015 B3 nominal solar radius


def fraction(r, sun):
    d = [sun[i] - r[i] for i in range(3)]
    rn = math.sqrt(sum(x * x for x in r))
    dn = math.sqrt(sum(x * x for x in d))
    a = math.asin(RS / dn)
    b = math.asin(RE / rn)
    c = math.acos(-sum(r[i] * d[i] for i in range(3)) / (rn * dn))

    def arc(rho):
        # angle of the circle of radius rho about the Sun's centre that
        # lies inside the Earth's disc, times rho (the area element)
        if rho == 0:
            return 0.0
        q = (c * c + rho * rho - b * b) / (2 * c * rho)
        if q >= 1:
            return 0.0
        if q <= -1:
            return 2 * math.pi * rho
        return 2 * math.acos(q) * rho

    kinks = [x for x in (abs(c - b), c + b) if 0 < x < a]
    area, _ = integrate.quad(arc, 0, a, points=kinks or None, epsabs=1e-16, epsrel=1e-12, limit=200)
    return 1 - area / (math.pi * a * a)


def main():
    sun = [AU, 0.0, 0.0]
    cases = []
    for y in [6340.0, 6350.0, 6360.0, 6370.0, 6380.0, 6390.0, 6400.0, 6410.0]:
        r = [-7000.0, y, 0.0]
        cases.append({"r_km": r, "sun_km": sun, "visible_fraction": fraction(r, sun)})
    for z in [6250.0, 6350.0, 6450.0]:  # GEO distance, near the shadow edge
        r = [-41700.0, 0.0, z]
        cases.append({"r_km": r, "sun_km": sun, "visible_fraction": fraction(r, sun)})
    out = {"source": "scipy.integrate.quad (SciPy 1.10.1), script shadow_scipy.py",
           "body_radius_km": RE, "sun_radius_km": RS, "cases": cases}
    with open(os.path.join(os.path.dirname(os.path.abspath(__file__)), "shadow_scipy.json"), "w") as f:
        json.dump(out, f, indent=1)


if __name__ == "__main__":
    main()
