#!/usr/bin/python3
"""50-digit values of the non-dimensional Lambert time of flight T(x; lambda, N)
(Izzo 2015, Celest. Mech. Dyn. Astron. 121, eq. 18, Lancaster's form), used to
check the double-precision evaluation in centra/orbit/lambert, which must stay
accurate where the formula cancels (lambda near +-1, x near 1, x large).

    /usr/bin/python3 testdata/transfer/izzo_tof_mpmath.py > testdata/transfer/izzo_tof.json

Uses mpmath (Debian python3-mpmath) at 60 significant digits. lambda and x are
taken as the exact binary doubles printed in the JSON.
"""
import json
import sys

import mpmath as mp

mp.mp.dps = 60


def T(lam, x, n):
    lam = mp.mpf(lam)
    x = mp.mpf(x)
    y = mp.sqrt(1 - lam ** 2 * (1 - x ** 2))
    if x < 1:
        psi = mp.acos(x * y + lam * (1 - x ** 2))
        return ((psi + n * mp.pi) / mp.sqrt(1 - x ** 2) - x + lam * y) / (1 - x ** 2)
    if x > 1:
        psi = mp.acosh(x * y - lam * (x ** 2 - 1))
        return (-psi / mp.sqrt(x ** 2 - 1) + x - lam * y) / (x ** 2 - 1)
    return mp.mpf(2) / 3 * (1 - lam ** 3)


lams = [-1 + 2.0 ** -30, -0.9999991273357546, -0.999, -0.7, -0.2, 0.0, 1e-8, 0.3, 0.8,
        0.999, 0.9999991273357546, 1 - 2.0 ** -30]
xs0 = [-0.999, -0.9, -0.7059476670367042, -0.5, -0.1, 0.0, 0.2, 0.5, 0.8, 0.95, 0.99,
       0.995, 0.9999, 1.0001, 1.005, 1.02, 1.1, 1.3, 2.0, 5.0, 30.0, 1000.0]
xs1 = [-0.999, -0.9, -0.5, 0.0, 0.3, 0.7, 0.9, 0.99, 0.995, 0.9999]
cases = []
for lam in lams:
    for x in xs0:
        cases.append({"lam": lam, "x": x, "n": 0, "T": float(T(lam, x, 0))})
    for n in (1, 3):
        for x in xs1:
            cases.append({"lam": lam, "x": x, "n": n, "T": float(T(lam, x, n))})
json.dump({"generator": "testdata/transfer/izzo_tof_mpmath.py", "mpmath": mp.__version__,
           "dps": mp.mp.dps, "cases": cases}, sys.stdout, indent=0)
sys.stdout.write("\n")
