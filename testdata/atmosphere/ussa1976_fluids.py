#!/usr/bin/python3
"""Reference values of the U.S. Standard Atmosphere 1976 (0-86 km) for the
centra/bodies/atmosphere tests, from an independent implementation:
fluids.atmosphere.ATMOSPHERE_1976 of the Debian package python3-fluids 1.0.22.

Run with Debian's interpreter:
    /usr/bin/python3 testdata/atmosphere/ussa1976_fluids.py > testdata/atmosphere/ussa1976_fluids.csv
CI does not run this script; the tests read the CSV it wrote.

Columns: geometric altitude (km), temperature (K; fluids returns the
molecular-scale temperature T_M, which equals the kinetic temperature below
80 km), pressure (Pa), density (kg/m^3).
"""
import fluids
from fluids.atmosphere import ATMOSPHERE_1976

ALTITUDES_KM = [-5, -1, 0, 0.5, 1, 5, 11, 15, 20, 25, 32, 40, 47, 50, 51, 60, 71, 80, 84, 85, 86]

print("# python3-fluids %s fluids.atmosphere.ATMOSPHERE_1976; script ussa1976_fluids.py" % fluids.__version__)
print("alt_km,temperature_k,pressure_pa,density_kg_m3")
for z in ALTITUDES_KM:
    a = ATMOSPHERE_1976(z * 1000.0)
    print("%r,%r,%r,%r" % (float(z), float(a.T), float(a.P), float(a.rho)))
