// Package geodesy converts between geodetic coordinates on the WGS 84
// ellipsoid and Earth-fixed Cartesian coordinates, and gives the
// topocentric view (azimuth, elevation, range, range rate) from a site.
//
//	r := geodesy.WGS84.ToECEF(lat, lon, h)      // geodetic -> ITRF, km
//	lat, lon, h := geodesy.WGS84.FromECEF(r)    // and back
//	st, err := geodesy.NewStation(geodesy.Site{Lat: lat, Lon: lon, Alt: 0.4})
//	look := st.Look(rITRF, vITRF)               // az, el, range, range rate
//
// # Units
//
// Latitudes and longitudes in radians, heights and positions in km,
// velocities in km/s, range rate in km/s.
//
// # Frames
//
// Earth-fixed Cartesian (ECEF) coordinates are ITRF (polar motion
// ignored, see package earthframe); geodetic latitude and height refer to
// the WGS 84 ellipsoid, a = 6378.137 km, 1/f = 298.257223563 (NIMA
// TR8350.2, 3rd ed., Table 3.1). The local frame of a site is east, north,
// up (ENU), with up along the ellipsoid normal.
//
// # Conventions
//
// Geodetic -> Cartesian is the closed form (for example NIMA TR8350.2
// eq. 4-14). Cartesian -> geodetic is the exact closed-form solution of
// Vermeille, "An analytical method to transform geocentric into geodetic
// coordinates", J. Geodesy 85 (2011) 105-117, including the branch for
// points inside the evolute (within about 43 km of the Earth's centre); it
// needs no iteration. Tested to 0.1 mm (measured: 0.0002 mm) against the
// geodetic coordinates of points that ERFA gd2gc placed from 1 km below
// the surface to 400000 km, poles and equator included, and against ERFA
// gc2gd (Fukushima 2006, whose own error grows to about 1 mm at 400000 km);
// FromECEF inverts ToECEF everywhere from the centre to 1e6 km.
//
// Latitude is in [-pi/2, pi/2], longitude in (-pi, pi], azimuth from
// north through east in [0, 2pi), elevation in [-pi/2, pi/2]. At the poles
// the longitude returned is atan2(y, x) (0 on the axis). The geodetic
// latitude of a point on the equatorial plane inside the evolute is not
// unique; the northern solution is returned.
//
// For passes over many sites, build a [Station] per site once: it holds
// the site's ECEF position and ENU matrix, so [Station.Look] costs a few
// dozen floating-point operations. For inertial states, rotate once per
// epoch with earthframe.NewRotation and call [Station.LookInertial] for
// each station.
package geodesy
