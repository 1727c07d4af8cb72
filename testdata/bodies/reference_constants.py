#!/usr/bin/python3
"""Reference constants for centra/bodies tests, from Astropy and ERFA.

Run with Debian's interpreter (python3-astropy 5.2.1, python3-erfa 2.0.0.1):
    /usr/bin/python3 testdata/bodies/reference_constants.py > testdata/bodies/reference_constants.json
CI does not run this script; the tests read the JSON it wrote.
"""
import json
import math

import astropy
import erfa
from astropy.constants import iau2015, iau2012

out = {
    "generator": "testdata/bodies/reference_constants.py",
    "libraries": {"astropy": astropy.__version__, "erfa": erfa.__version__},
    # astropy.constants.iau2015: IAU 2015 Resolution B3 nominal values, SI -> km.
    "iau2015_gm_sun_km3_s2": iau2015.GM_sun.to_value("km3/s2"),
    "iau2015_r_sun_km": iau2015.R_sun.to_value("km"),
    "iau2015_gm_earth_km3_s2": iau2015.GM_earth.to_value("km3/s2"),
    "iau2015_r_earth_km": iau2015.R_earth.to_value("km"),
    "iau2015_gm_jup_km3_s2": iau2015.GM_jup.to_value("km3/s2"),
    "iau2015_r_jup_km": iau2015.R_jup.to_value("km"),
    # astropy.constants.iau2012.au: IAU 2012 Resolution B2.
    "iau2012_au_km": iau2012.au.to_value("km"),
}

# erfa.eform(1): WGS 84 ellipsoid (ERFA eraEform, WGS84 = 1).
a_m, f = erfa.eform(erfa.WGS84)
out["erfa_wgs84_a_km"] = a_m / 1000.0
out["erfa_wgs84_f"] = f

# erfa.era00: Earth rotation angle (IAU 2000). Its rate, from one day's
# advance (the angle gains 2*pi*1.00273781191135448 rad per UT1 day).
e0 = erfa.era00(2451545.0, 0.0)
e1 = erfa.era00(2451545.0, 10.0)
advance = (e1 - e0) % (2 * math.pi) + 10 * 2 * math.pi
out["erfa_era00_rate_rad_s"] = advance / (10 * 86400.0)

print(json.dumps(out, indent=2, sort_keys=True))
