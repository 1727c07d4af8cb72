// Package earthframe rotates between the Geocentric Celestial Reference
// Frame (GCRF) and the International Terrestrial Reference Frame (ITRF,
// polar motion ignored), and gives the Earth rotation angle, sidereal
// time, precession and nutation behind that rotation.
//
// For a state vector at an epoch:
//
//	rot := earthframe.NewRotation(epoch, dut1)  // once per epoch
//	rf, vf := rot.StateToITRF(r, v)           // GCRF -> ITRF
//	r2, v2 := rot.StateToGCRF(rf, vf)         // and back
//
// # Units
//
// Angles are radians; the functions that return an angle of rotation
// ([ERA], [GMST], [GAST]) return it in [0, 2pi). Positions are km and
// velocities km/s (any consistent length unit works: the rotation is
// linear). Dates are two-part Julian dates (jd1+jd2) of TT or of UT1, as
// returned by the methods of [timescale.Epoch].
//
// # Frames
//
//   - GCRF: geocentric, axes of the ICRS. The inertial frame of centra.
//   - ITRF: Earth-fixed, realized here as the Terrestrial Intermediate
//     Reference System with polar motion set to zero (xp = yp = 0; the
//     neglect is up to about 0.5 arcsec, 15 m at the surface), including
//     the TIO locator s' = -47 uas * t.
//   - CIRS (celestial intermediate): the frame between them, whose pole
//     is the CIP and origin the CIO.
//   - True equator and equinox of date, and mean ecliptic and equinox of
//     date, for sidereal time and for the Sun and Moon series.
//
// GCRF -> ITRF is the CIO-based transformation of IERS Conventions 2010,
// chapter 5: W * R3(ERA) * Q^T with
//   - the Earth rotation angle ERA of eq. 5.15,
//   - the CIP coordinates X, Y taken from the IAU 2006 bias-precession
//     (Fukushima-Williams angles, eq. 5.40, P03 series, Capitaine et al.
//     2003; frame bias included) combined with IAU 2000B nutation,
//   - the CIO locator s from the IAU 2006 series for s + XY/2 (IERS
//     Conventions 2010, Table 5.2d) truncated to the terms larger than
//     0.5 uas (29 of 66 terms; the omitted ones add up to less than
//     10 uas over 1900-2100),
//   - W = R3(s') (polar motion zero).
//
// Nutation is IAU 2000B (McCarthy & Luzum 2003): all its 77 luni-solar
// terms with its fixed offsets in lieu of the planetary terms (-0.135 mas
// in longitude, +0.388 mas in obliquity), with the Simon et al. (1994)
// linear fundamental arguments. Its stated accuracy is 1 mas against IAU
// 2000A over 1995-2050. Against ERFA c2t06a (IAU 2006/2000A, xp = yp = 0)
// the whole rotation agrees to 0.6 mas at 60 stored epochs over 1980-2060
// (testdata/frames/earth_rotation.csv; tested to 1 mas, against the
// requirement of 0.1 arcsec); GAST and the equation of the origins, which
// carry the nutation in longitude, agree with ERFA gst06a and eo06a to
// 1.1 mas (tested to 2.5 mas).
//
// The velocity transformation adds omega x r with the ERA rate
// omega = [OmegaEarth] about the CIP; the rates of precession and
// nutation (below 1e-11 rad/s: 0.3 mm/s at GEO) are neglected.
//
// # Conventions
//
// Matrices are [3][3]float64, row-major, and rotate coordinates (passive
// rotations): v_ITRF = M v_GCRF. R1, R2, R3 are the passive rotations
// about x, y, z of IERS Conventions 2010 chapter 5. Vectors are
// [3]float64. No function modifies its arguments.
package earthframe
