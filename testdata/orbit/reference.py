#!/usr/bin/python3
"""Independent reference values for the tests of package centra/orbit.

Run with Debian's interpreter from the repository root:

    /usr/bin/python3 testdata/orbit/reference.py > testdata/orbit/reference.json

Nothing here shares code with the Go package. Each block recomputes a
published worked example (cited in the Go tests, values there) by a
different method:

  * RV2COE / COE2RV: NumPy, with the arccos-plus-quadrant-check formulation
    and explicit rotation matrices (the Go code uses atan2 projections onto
    the node/orbit-plane basis and closed-form unit vectors);
  * Kepler's equation: scipy.optimize.brentq on the plain equation, and
    times of flight by event location in a numerical integration;
  * propagation: numerical integration of the two-body equations of motion
    with scipy.integrate.solve_ivp (DOP853, rtol 1e-13), no Kepler equation;
  * sun-synchronous inclination and J2 rates: scipy.optimize.brentq on the
    nodal-rate equation, and the rates evaluated as orbit averages of the
    Gauss variational equations with the J2 acceleration from the gradient
    of the potential (scipy.integrate.quad), not from the closed forms.

Library versions are recorded in the output.
"""
import json
import sys

import numpy as np
import scipy
from scipy.integrate import quad, solve_ivp
from scipy.optimize import brentq

MU_VALLADO = 398600.4418  # km^3/s^2, Vallado 4th ed. (EGM-96 value)
MU_CURTIS = 398600.0      # km^3/s^2, Curtis 3rd ed.
RE_CURTIS = 6378.0        # km
J2_CURTIS = 1.08263e-3


def rv2coe(mu, r, v):
    r = np.asarray(r, float)
    v = np.asarray(v, float)
    rm, vm = np.linalg.norm(r), np.linalg.norm(v)
    h = np.cross(r, v)
    hm = np.linalg.norm(h)
    n = np.cross([0.0, 0.0, 1.0], h)
    nm = np.linalg.norm(n)
    ev = ((vm**2 - mu / rm) * r - np.dot(r, v) * v) / mu
    e = np.linalg.norm(ev)
    p = hm**2 / mu
    a = p / (1 - e**2)
    i = np.arccos(h[2] / hm)
    raan = np.arccos(n[0] / nm)
    if n[1] < 0:
        raan = 2 * np.pi - raan
    argp = np.arccos(np.dot(n, ev) / (nm * e))
    if ev[2] < 0:
        argp = 2 * np.pi - argp
    nu = np.arccos(np.dot(ev, r) / (e * rm))
    if np.dot(r, v) < 0:
        nu = 2 * np.pi - nu
    u = np.arccos(np.dot(n, r) / (nm * rm))
    if r[2] < 0:
        u = 2 * np.pi - u
    lam = np.arccos(r[0] / rm)
    if r[1] < 0:
        lam = 2 * np.pi - lam
    lonper = np.arccos(ev[0] / e)
    if ev[1] < 0:
        lonper = 2 * np.pi - lonper
    d = np.degrees
    return dict(p_km=p, a_km=a, e=e, i_deg=d(i), raan_deg=d(raan), argp_deg=d(argp),
                nu_deg=d(nu), arglat_deg=d(u), truelon_deg=d(lam), lonper_deg=d(lonper))


def rot1(t):
    c, s = np.cos(t), np.sin(t)
    return np.array([[1, 0, 0], [0, c, s], [0, -s, c]])


def rot3(t):
    c, s = np.cos(t), np.sin(t)
    return np.array([[c, s, 0], [-s, c, 0], [0, 0, 1]])


def coe2rv(mu, p, e, i, raan, argp, nu):
    i, raan, argp, nu = np.radians([i, raan, argp, nu])
    den = 1 + e * np.cos(nu)
    rpqw = np.array([p * np.cos(nu) / den, p * np.sin(nu) / den, 0.0])
    vpqw = np.array([-np.sqrt(mu / p) * np.sin(nu), np.sqrt(mu / p) * (e + np.cos(nu)), 0.0])
    m = rot3(-raan) @ rot1(-i) @ rot3(-argp)
    return m @ rpqw, m @ vpqw


def integrate(mu, r0, v0, dt):
    def f(_, y):
        r = y[:3]
        return np.concatenate([y[3:], -mu * r / np.linalg.norm(r)**3])
    sol = solve_ivp(f, (0.0, dt), np.concatenate([r0, v0]), method="DOP853",
                    rtol=1e-13, atol=1e-12)
    y = sol.y[:, -1]
    return list(y[:3]), list(y[3:])


def time_to_angle(mu, y0, theta, tmax):
    """Time for the two-body motion from y0 (in the xy-plane) to reach the
    polar angle theta (rad), by event location during the integration."""
    def f(_, y):
        r = y[:3]
        return np.concatenate([y[3:], -mu * r / np.linalg.norm(r)**3])

    def g(_, y):
        return np.sin(np.arctan2(y[1], y[0]) - theta)
    g.terminal, g.direction = True, 1
    sol = solve_ivp(f, (0.0, tmax), y0, method="DOP853", rtol=1e-13, atol=1e-12, events=g)
    return sol.t_events[0][0], sol.y_events[0][0]


def j2_gauss_average(mu, re, j2, a, e, inc):
    """Secular rates of RAAN, argp and M as time averages over one orbit of
    the Gauss variational equations, J2 acceleration from the potential
    gradient, elements held fixed (first-order averaging)."""
    p = a * (1 - e**2)
    n = np.sqrt(mu / a**3)
    h = np.sqrt(mu * p)
    b = a * np.sqrt(1 - e**2)
    raan, argp = 0.3, 0.7  # the averages do not depend on them

    def rates(M):
        E = brentq(lambda E: E - e * np.sin(E) - M, M - 1.1, M + 1.1, xtol=1e-15)
        nu = 2 * np.arctan2(np.sqrt(1 + e) * np.sin(E / 2), np.sqrt(1 - e) * np.cos(E / 2))
        r, v = coe2rv(mu, p, e, np.degrees(inc), np.degrees(raan), np.degrees(argp), np.degrees(nu))
        rm = np.linalg.norm(r)
        x, y, z = r
        k = -1.5 * j2 * mu * re**2 / rm**5
        f = k * np.array([x * (1 - 5 * z**2 / rm**2), y * (1 - 5 * z**2 / rm**2), z * (3 - 5 * z**2 / rm**2)])
        rh = r / rm
        hv = np.cross(r, v)
        wh = hv / np.linalg.norm(hv)
        th = np.cross(wh, rh)
        fr, ft, fn = f @ rh, f @ th, f @ wh
        u = argp + nu
        draan = rm * np.sin(u) * fn / (h * np.sin(inc))
        dargp = (-p * np.cos(nu) * fr + (p + rm) * np.sin(nu) * ft) / (h * e) \
            - rm * np.sin(u) * np.cos(inc) * fn / (h * np.sin(inc))
        dM = b / (a * h * e) * ((p * np.cos(nu) - 2 * e * rm) * fr - (p + rm) * np.sin(nu) * ft)
        return draan, dargp, dM

    opts = dict(limit=200, epsabs=1e-17, epsrel=1e-12)
    out = []
    for k in range(3):
        val, _ = quad(lambda M: rates(M)[k], 0, 2 * np.pi, **opts)
        out.append(val / (2 * np.pi))
    return out[0], out[1], n + out[2]


def main():
    ref = {"generator": "testdata/orbit/reference.py",
           "versions": {"python": sys.version.split()[0], "numpy": np.__version__, "scipy": scipy.__version__}}

    # Vallado 4th ed. Example 2-5 input state.
    r = [6524.834, 6862.875, 6448.296]
    v = [4.901327, 5.533756, -1.976341]
    ref["rv2coe_vallado_2_5"] = dict(mu=MU_VALLADO, r_km=r, v_km_s=v, **rv2coe(MU_VALLADO, r, v))

    # Vallado 4th ed. Example 2-6 input elements.
    el = dict(p_km=11067.790, e=0.83285, i_deg=87.87, raan_deg=227.89, argp_deg=53.38, nu_deg=92.335)
    rr, vv = coe2rv(MU_VALLADO, el["p_km"], el["e"], el["i_deg"], el["raan_deg"], el["argp_deg"], el["nu_deg"])
    ref["coe2rv_vallado_2_6"] = dict(mu=MU_VALLADO, **el, r_km=list(rr), v_km_s=list(vv))

    # Kepler's equation, Vallado 4th ed. Examples 2-1 (elliptic), 2-3 (hyperbolic).
    M = np.radians(235.4)
    e = 0.4
    Mr = M - 2 * np.pi
    E = brentq(lambda x: x - e * np.sin(x) - Mr, -np.pi, np.pi, xtol=1e-16, rtol=8.9e-16) + 2 * np.pi
    ref["kepler_vallado_2_1"] = dict(M_deg=235.4, e=e, E_rad=E, E_deg=np.degrees(E))
    e = 2.4
    H = brentq(lambda x: e * np.sinh(x) - x - M, 0, 10, xtol=1e-16, rtol=8.9e-16)
    ref["kepler_vallado_2_3"] = dict(M_deg=235.4, e=e, H_rad=H)

    # Vallado 4th ed. Example 2-4 (KEPLER), 40 min.
    r0 = np.array([1131.340, -2282.343, 6672.423])
    v0 = np.array([-5.64305, 4.30333, 2.42879])
    rr, vv = integrate(MU_VALLADO, r0, v0, 2400.0)
    ref["propagate_vallado_2_4"] = dict(mu=MU_VALLADO, r0_km=list(r0), v0_km_s=list(v0), dt_s=2400.0, r_km=rr, v_km_s=vv)

    # Curtis 3rd ed. universal-variable example, 60 min.
    r0 = np.array([7000.0, -12124.0, 0.0])
    v0 = np.array([2.6679, 4.6210, 0.0])
    rr, vv = integrate(MU_CURTIS, r0, v0, 3600.0)
    ref["propagate_curtis_3_7"] = dict(mu=MU_CURTIS, r0_km=list(r0), v0_km_s=list(v0), dt_s=3600.0, r_km=rr, v_km_s=vv)

    # Curtis 3rd ed. Examples 3.1 and 3.2: rp = 9600 km, ra = 21000 km,
    # from perigee on the +x axis.
    rp, ra = 9600.0, 21000.0
    h = np.sqrt(2 * MU_CURTIS * rp * ra / (rp + ra))
    y0 = np.array([rp, 0, 0, 0, h / rp, 0])
    t120, _ = time_to_angle(MU_CURTIS, y0, np.radians(120), 20000.0)
    rr, _ = integrate(MU_CURTIS, y0[:3], y0[3:], 10800.0)
    ref["curtis_3_1_3_2"] = dict(mu=MU_CURTIS, rp_km=rp, ra_km=ra, t_to_120deg_s=t120,
                                 nu_after_3h_deg=np.degrees(np.arctan2(rr[1], rr[0])) % 360)

    # Curtis 3rd ed. Example 3.5: hyperbola, perigee altitude 300 km
    # (radius 6678 km), perigee speed 15 km/s.
    y0 = np.array([6678.0, 0, 0, 0, 15.0, 0])
    t100, y100 = time_to_angle(MU_CURTIS, y0, np.radians(100), 20000.0)
    rr, vv = integrate(MU_CURTIS, y0[:3], y0[3:], t100 + 10800.0)
    ref["curtis_3_5"] = dict(mu=MU_CURTIS, rp_km=6678.0, vp_km_s=15.0, t_to_100deg_s=t100,
                             r_at_100deg_km=np.linalg.norm(y100[:3]),
                             r_3h_later_km=np.linalg.norm(rr), nu_3h_later_deg=np.degrees(np.arctan2(rr[1], rr[0])),
                             v_3h_later_km_s=np.linalg.norm(vv))

    # Sun-synchronous circular orbit of period 100 min (Curtis 3rd ed., Sec. 4.7).
    T = 6000.0
    a = (MU_CURTIS * (T / (2 * np.pi))**2)**(1 / 3)
    rate = 2 * np.pi / (365.2421896698 * 86400)
    n = np.sqrt(MU_CURTIS / a**3)
    inc = brentq(lambda i: -1.5 * n * J2_CURTIS * (RE_CURTIS / a)**2 * np.cos(i) - rate, np.pi / 2, np.pi, xtol=1e-15)
    ref["sso_curtis_100min"] = dict(mu=MU_CURTIS, re_km=RE_CURTIS, j2=J2_CURTIS, period_s=T, a_km=a, i_deg=np.degrees(inc))

    # J2 secular rates, 280 km x 400 km, i = 51.43 deg (Curtis 3rd ed., Sec. 4.7).
    rp, ra = RE_CURTIS + 280, RE_CURTIS + 400
    a = (rp + ra) / 2
    e = (ra - rp) / (ra + rp)
    inc = np.radians(51.43)
    dO, dw, dM = j2_gauss_average(MU_CURTIS, RE_CURTIS, J2_CURTIS, a, e, inc)
    ref["j2_curtis_shuttle"] = dict(mu=MU_CURTIS, re_km=RE_CURTIS, j2=J2_CURTIS, a_km=a, e=e, i_deg=51.43,
                                    raan_rate_rad_s=dO, argp_rate_rad_s=dw, mean_anomaly_rate_rad_s=dM,
                                    raan_rate_deg_day=np.degrees(dO) * 86400, argp_rate_deg_day=np.degrees(dw) * 86400)

    # Stationary orbit from the IERS Earth rotation rate.
    w = 7.292115e-5
    ref["geo_iers"] = dict(mu=MU_VALLADO, omega_rad_s=w, a_km=(MU_VALLADO / w**2)**(1 / 3))

    json.dump(ref, sys.stdout, indent=1, default=float)
    sys.stdout.write("\n")


if __name__ == "__main__":
    main()
