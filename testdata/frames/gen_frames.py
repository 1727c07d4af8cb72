#!/usr/bin/python3
"""Reference values for the bodies/timescale, bodies/earthframe,
bodies/geodesy and bodies/sunmoon tests.

Run with Debian's interpreter (python3-erfa 2.0.0.1, liberfa 2.0.0):

    /usr/bin/python3 testdata/frames/gen_frames.py

from the repository root. It rewrites the CSV files beside it. CI does not
run it; the Go tests read the stored files. Every number written here comes
from an ERFA routine named in the column header or the comment line of each
file, never from the Go code under test.
"""
import csv
import math
import os

import erfa
import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))
AU_KM = 149597870.7  # IAU 2012 Resolution B2, exact
RNG = np.random.default_rng(20240601)


def path(name):
    return os.path.join(HERE, name)


def header(f, lines):
    for line in lines:
        f.write("# " + line + "\n")


def r(x):
    return repr(float(x))


# Epochs: fixed ones plus 52 seeded pseudo-random ones in 1980-2060 (UTC).
def epochs():
    fixed = [
        "1980-01-01T00:00:00.000Z",
        "1992-08-20T12:14:00.000Z",
        "2000-01-01T12:00:00.000Z",
        "2004-04-06T07:51:28.386Z",
        "2016-12-31T23:59:59.000Z",
        "2017-01-01T00:00:00.000Z",
        "2024-02-29T18:30:15.250Z",
        "2060-12-31T23:59:59.999Z",
    ]
    j0 = erfa.cal2jd(1980, 1, 1)
    j1 = erfa.cal2jd(2060, 12, 31)
    out = list(fixed)
    for _ in range(52):
        day = RNG.integers(0, int((j1[0] + j1[1]) - (j0[0] + j0[1])))
        ms = RNG.integers(0, 86400000)
        y, m, d, _f = erfa.jd2cal(j0[0] + j0[1] + day, 0.0)
        h = ms // 3600000
        mi = (ms // 60000) % 60
        s = (ms // 1000) % 60
        f = ms % 1000
        out.append("%04d-%02d-%02dT%02d:%02d:%02d.%03dZ" % (y, m, d, h, mi, s, f))
    return out


def parse(utc):
    y, mo, d = int(utc[0:4]), int(utc[5:7]), int(utc[8:10])
    h, mi = int(utc[11:13]), int(utc[14:16])
    sec = float(utc[17:-1])
    return y, mo, d, h, mi, sec


def utc_jd(utc):
    y, mo, d, h, mi, sec = parse(utc)
    return erfa.dtf2d("UTC", y, mo, d, h, mi, sec)


EPOCHS = epochs()
DUT1 = [0.0 if i % 3 == 0 else float(np.round(RNG.uniform(-0.9, 0.9), 6))
        for i in range(len(EPOCHS))]


def leap_table():
    # erfa.dat: TAI-UTC in seconds at 00:00 UTC of each table date, and at
    # 12:00 UTC of the day before (the previous value).
    dates = [(1972, 1), (1972, 7), (1973, 1), (1974, 1), (1975, 1), (1976, 1),
             (1977, 1), (1978, 1), (1979, 1), (1980, 1), (1981, 7), (1982, 7),
             (1983, 7), (1985, 7), (1988, 1), (1990, 1), (1991, 1), (1992, 7),
             (1993, 7), (1994, 7), (1996, 1), (1997, 7), (1999, 1), (2006, 1),
             (2009, 1), (2012, 7), (2015, 7), (2017, 1)]
    with open(path("leap_seconds.csv"), "w") as f:
        header(f, ["erfa.dat (ERFA 2.0.0 via pyerfa 2.0.0.1): TAI-UTC in s",
                   "date: a UTC date; dat_at_0h: erfa.dat at 00:00 of that date;",
                   "dat_day_before_12h: erfa.dat at 12:00 of the previous day"])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["date", "dat_at_0h", "dat_day_before_12h"])
        for y, m in dates:
            d0 = erfa.dat(y, m, 1, 0.0)
            j = erfa.cal2jd(y, m, 1)
            py, pm, pd, _ = erfa.jd2cal(j[0] + j[1] - 1, 0.0)
            d1 = erfa.dat(py, pm, pd, 0.5) if (y, m) != (1972, 1) else float("nan")
            w.writerow(["%04d-%02d-01" % (y, m), r(d0), r(d1)])
        # a date long after the last leap second
        w.writerow(["2025-06-15", r(erfa.dat(2025, 6, 15, 0.0)), r(erfa.dat(2025, 6, 14, 0.5))])


def times():
    rows = []
    extra = [("2016-12-31T23:59:60.500Z", 0.0), ("2016-12-31T23:59:60.000Z", 0.0),
             ("2015-06-30T23:59:60.999Z", 0.0), ("1972-06-30T23:59:60.250Z", 0.0)]
    for utc, dut1 in list(zip(EPOCHS, DUT1)) + extra:
        u1, u2 = utc_jd(utc)
        a1, a2 = erfa.utctai(u1, u2)
        t1, t2 = erfa.taitt(a1, a2)
        ut1, ut2 = erfa.utcut1(u1, u2, dut1)
        # TDB-TT from erfa.dtdb, geocentric (u = v = 0), ut = UT1 fraction
        dtr = erfa.dtdb(t1, t2, (ut1 - 0.5) % 1.0 + ut2, 0.0, 0.0, 0.0)
        b1, b2 = erfa.tttdb(t1, t2, dtr)
        rows.append([utc, r(dut1), r(a1), r(a2), r(t1), r(t2), r(ut1), r(ut2),
                     r(b1), r(b2)])
    with open(path("times.csv"), "w") as f:
        header(f, ["ERFA 2.0.0 via pyerfa 2.0.0.1: erfa.dtf2d('UTC') -> erfa.utctai,",
                   "erfa.taitt, erfa.utcut1(dut1), erfa.tttdb with erfa.dtdb(u=v=0).",
                   "Julian dates as two parts (jd1, jd2)."])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["utc", "dut1_s", "tai1", "tai2", "tt1", "tt2", "ut11", "ut12",
                    "tdb1", "tdb2"])
        w.writerows(rows)


def earth():
    with open(path("earth_rotation.csv"), "w") as f:
        header(f, ["ERFA 2.0.0 via pyerfa 2.0.0.1: erfa.era00, erfa.gmst06,",
                   "erfa.gst06a, erfa.eo06a, erfa.nut00b (rad) and erfa.c2t06a(tt, ut1, xp=0, yp=0)",
                   "row-major m11..m33 (GCRS -> ITRS); UT1 = UTC + dut1 by erfa.utcut1."])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["utc", "dut1_s", "era", "gmst06", "gst06a", "eo06a", "dpsi00b", "deps00b"] +
                   ["m%d%d" % (i, j) for i in (1, 2, 3) for j in (1, 2, 3)])
        for utc, dut1 in zip(EPOCHS, DUT1):
            u1, u2 = utc_jd(utc)
            a1, a2 = erfa.utctai(u1, u2)
            t1, t2 = erfa.taitt(a1, a2)
            ut1, ut2 = erfa.utcut1(u1, u2, dut1)
            m = erfa.c2t06a(t1, t2, ut1, ut2, 0.0, 0.0)
            w.writerow([utc, r(dut1), r(erfa.era00(ut1, ut2)),
                        r(erfa.gmst06(ut1, ut2, t1, t2)), r(erfa.gst06a(ut1, ut2, t1, t2)),
                        r(erfa.eo06a(t1, t2))] + [r(x) for x in erfa.nut00b(t1, t2)] +
                       [r(x) for x in m.reshape(9)])


def geodesy():
    pts = []
    # (lat_deg, lon_deg, h_km): poles, equator, heights from -1 km to 400000 km
    heights = [-1.0, -0.5, 0.0, 0.001, 1.0, 10.0, 400.0, 2000.0, 20200.0,
               35786.0, 100000.0, 400000.0]
    for h in heights:
        for lat in (90.0, -90.0, 0.0, 45.0, -30.0, 89.999999, 1e-9):
            pts.append((lat, 0.0 if abs(lat) == 90 else 123.456, h))
    for _ in range(120):
        lat = float(np.degrees(np.arcsin(RNG.uniform(-1, 1))))
        lon = float(RNG.uniform(-180, 180))
        h = float(10 ** RNG.uniform(-3, math.log10(400000.0))) if RNG.uniform() > 0.1 \
            else float(RNG.uniform(-1, 0))
        pts.append((lat, lon, h))
    with open(path("geodesy.csv"), "w") as f:
        header(f, ["ERFA 2.0.0 via pyerfa 2.0.0.1, WGS 84 (n=1): erfa.gd2gc(lon, lat, h)",
                   "gives x,y,z; erfa.gc2gd of that x,y,z gives lat2, lon2, h2.",
                   "Angles in degrees, lengths in km (erfa works in m)."])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["lat_deg", "lon_deg", "h_km", "x_km", "y_km", "z_km",
                    "lat2_deg", "lon2_deg", "h2_km"])
        for lat, lon, h in pts:
            xyz = erfa.gd2gc(1, math.radians(lon), math.radians(lat), h * 1000.0)
            lon2, lat2, h2 = erfa.gc2gd(1, xyz)
            w.writerow([r(lat), r(lon), r(h)] + [r(v / 1000.0) for v in xyz] +
                       [r(math.degrees(lat2)), r(math.degrees(lon2)), r(h2 / 1000.0)])


def topocentric():
    # Site from erfa.gd2gc; direction site->target as hour angle and
    # declination with respect to the Earth's axis and the site meridian;
    # erfa.hd2ae with the geodetic latitude (the ellipsoid normal is the
    # local vertical) gives azimuth (from north through east) and elevation.
    rng = np.random.default_rng(7)
    with open(path("topocentric.csv"), "w") as f:
        header(f, ["ERFA 2.0.0 via pyerfa 2.0.0.1: site = erfa.gd2gc(WGS84, lon, lat, h);",
                   "d = target - site; H = lon - atan2(dy, dx), dec = asin(dz/|d|);",
                   "az, el = erfa.hd2ae(H, dec, lat). Degrees and km."])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["lat_deg", "lon_deg", "alt_km", "tx_km", "ty_km", "tz_km",
                    "az_deg", "el_deg", "range_km"])
        for i in range(60):
            lat = float(np.degrees(np.arcsin(rng.uniform(-1, 1))))
            if i == 0:
                lat = 89.9
            lon = float(rng.uniform(-180, 180))
            alt = float(rng.uniform(-0.4, 5.0))
            site = erfa.gd2gc(1, math.radians(lon), math.radians(lat), alt * 1000.0) / 1000.0
            # target: a random point 300 km .. 42000 km from the Earth centre
            u = rng.normal(size=3)
            t = u / np.linalg.norm(u) * rng.uniform(6700.0, 42200.0)
            d = t - site
            ha = math.radians(lon) - math.atan2(d[1], d[0])
            dec = math.asin(d[2] / np.linalg.norm(d))
            az, el = erfa.hd2ae(ha, dec, math.radians(lat))
            w.writerow([r(lat), r(lon), r(alt)] + [r(v) for v in t] +
                       [r(math.degrees(az)), r(math.degrees(el)), r(np.linalg.norm(d))])


def ecliptic_of_date(t1, t2):
    gamb, phib, psib, _epsa = erfa.pfw06(t1, t2)
    return erfa.fw2m(gamb, phib, psib, 0.0)  # GCRS -> mean ecliptic of date


def sunmoon():
    with open(path("sun_moon.csv"), "w") as f:
        header(f, ["ERFA 2.0.0 via pyerfa 2.0.0.1. Sun: -erfa.epv00(tdb) heliocentric",
                   "Earth position (BCRS, ICRS axes = GCRS axes), geometric, in km",
                   "(au = 149597870.7 km). Moon: erfa.moon98(tt), GCRS, in km.",
                   "TT and TDB from erfa.utctai, erfa.taitt, erfa.tttdb(dtdb u=v=0)."])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["utc", "sun_x_km", "sun_y_km", "sun_z_km",
                    "moon_x_km", "moon_y_km", "moon_z_km"])
        for utc in EPOCHS:
            u1, u2 = utc_jd(utc)
            a1, a2 = erfa.utctai(u1, u2)
            t1, t2 = erfa.taitt(a1, a2)
            b1, b2 = erfa.tttdb(t1, t2, erfa.dtdb(t1, t2, 0.0, 0.0, 0.0, 0.0))
            pvh, _pvb = erfa.epv00(b1, b2)
            sun = -pvh[0] * AU_KM
            moon = erfa.moon98(t1, t2)[0] * AU_KM
            w.writerow([utc] + [r(v) for v in sun] + [r(v) for v in moon])


def examples():
    vals = []
    # Vallado 4th ed. Example 3-5: 1992-08-20 12:14 UT1; TT = UT1 + 59.184 s
    # is not needed by gmst82 (UT1 only); gmst06 gets TT-UT1 = 58.9 s
    # (TAI-UTC = 27 s in 1992, + 32.184 s, DUT1 taken as 0).
    j = erfa.cal2jd(1992, 8, 20)
    fr = (12 * 60 + 14) / 1440.0
    vals.append(("vallado3_5_gmst82_deg", math.degrees(erfa.gmst82(j[0] + j[1], fr)),
                 "erfa.gmst82(1992-08-20 12:14 UT1)"))
    vals.append(("vallado3_5_gmst06_deg",
                 math.degrees(erfa.gmst06(j[0] + j[1], fr, j[0] + j[1], fr + 59.184 / 86400)),
                 "erfa.gmst06(UT1 1992-08-20 12:14, TT = UT1 + 59.184 s)"))
    # Vallado 4th ed. Example 7-1 site: 39.007 N, 104.883 W, 2187 m.
    xyz = erfa.gd2gc(1, math.radians(-104.883), math.radians(39.007), 2187.0) / 1000.0
    for k, v in zip("xyz", xyz):
        vals.append(("vallado7_1_site_%s_km" % k, v, "erfa.gd2gc(WGS84, 39.007 N, 104.883 W, 2187 m)"))
    # Meeus 2nd ed. Example 25.b (Sun) 1992 Oct 13.0 TD, and Example 47.a
    # (Moon) 1992 Apr 12.0 TD: ecliptic of date from epv00 / moon98.
    for name, jd in (("meeus25_sun", 2448908.5), ("meeus47_moon", 2448724.5)):
        if name.endswith("sun"):
            pvh, _ = erfa.epv00(jd, 0.0)
            p = -pvh[0] * AU_KM
        else:
            p = erfa.moon98(jd, 0.0)[0] * AU_KM
        q = ecliptic_of_date(jd, 0.0) @ p
        lon = math.degrees(math.atan2(q[1], q[0])) % 360.0
        lat = math.degrees(math.atan2(q[2], math.hypot(q[0], q[1])))
        src = "erfa.%s(JD %.1f) rotated by erfa.fw2m(erfa.pfw06 angles, eps=0)" % (
            "epv00" if name.endswith("sun") else "moon98", jd)
        vals.append((name + "_lon_deg", lon, src))
        vals.append((name + "_lat_deg", lat, src))
        vals.append((name + "_dist_km", float(np.linalg.norm(p)), src))
    with open(path("examples.csv"), "w") as f:
        header(f, ["Cross-checks of textbook examples with ERFA 2.0.0 (pyerfa 2.0.0.1)"])
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["name", "value", "source"])
        for n, v, s in vals:
            w.writerow([n, r(v), s])


if __name__ == "__main__":
    leap_table()
    times()
    earth()
    geodesy()
    topocentric()
    sunmoon()
    examples()
