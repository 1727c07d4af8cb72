// Package shadow finds eclipses of a spacecraft by its central body in a
// conical shadow model, and the beta angle of its orbit.
//
//	sun := shadow.NewSunTrack(func(t float64) [3]float64 { return sunmoon.Sun(start.Add(t)) }, span)
//	ecl := shadow.Find(tr, sun.At, earthRadius, shadow.SunRadius, 1e-4)
//	beta := shadow.Beta(state, sun.At(t))
//
// # Units
//
// Positions km, angles rad, times s from the start of the trajectory.
//
// # Frames
//
// The spacecraft and the Sun are given in the same body-centred inertial
// frame (GCRF for the Earth, with the Sun from package
// [centra/bodies/sunmoon]).
//
// # Conventions
//
// The body and the Sun are spheres of radii R and Rs; the Sun's is the IAU
// 2015 nominal solar radius [SunRadius]. Seen from the spacecraft at r,
// with the Sun at s, the Sun's apparent radius is a = asin(Rs/|s-r|), the
// body's b = asin(R/|r|), and the angle between their centres c (the
// conical model of Montenbruck and Gill, Satellite Orbits, 2000, sec.
// 3.4.2). The spacecraft is
//
//   - sunlit when c >= a + b,
//   - in the penumbra when |a - b| < c < a + b (part of the Sun hidden),
//   - in the umbra when c <= b - a (all of the Sun hidden; needs b > a,
//     true below the umbra's apex, 1.4 million km behind the Earth),
//   - in the antumbra when c <= a - b (an annular eclipse beyond the apex),
//     counted here as penumbra.
//
// [Find] reports two kinds of windows: [Penumbra] from the first contact
// (entry into the penumbra, c = a + b) to the last (exit from it): the
// whole time any part of the Sun is hidden, which contains the umbra; and
// [Umbra] from the second contact to the third (c = b - a). The Earth is a
// sphere of its equatorial radius: its flattening (21 km at the poles)
// shifts shadow boundaries crossed at high latitude by up to a few
// seconds, and the atmosphere, which dims the Sun near the shadow's edge,
// is ignored. No Moon shadows.
//
// In the cylindrical shadow model (the body's shadow a cylinder of radius
// R) a circular orbit of radius R + h at beta angle beta spends
//
//	T_ecl = (T/pi) acos( sqrt(h^2 + 2 R h) / ((R + h) cos beta) )
//
// per revolution of period T in the shadow (Vallado, Fundamentals of
// Astrodynamics and Applications, 4th ed., sec. 5.3). The cone of the
// umbra narrows behind the body by (Rs - R)/D per km (D the Sun's
// distance, 1/217), so the umbra of the conical model is shorter than the
// cylinder's shadow, and the penumbra longer, by about 8 s for a 500 km
// orbit at beta = 0 and about 2 min for a geostationary one; the tests
// check this first-order correction.
//
// The Sun's geometric position is used; the 20 arcsec of aberration
// would move a LEO shadow boundary by about 0.25 km (0.1 s).
//
// The beta angle is the angle between the orbit plane and the direction
// to the Sun, positive when the Sun is on the side of the angular momentum
// (north of the plane of a prograde orbit): beta = asin(h.s/(|h||s|)).
//
// [SunTrack] tabulates the Sun at nodes at most one hour apart and
// interpolates linearly: the chord of the Sun's apparent orbit (0.042 deg
// an hour) departs from the arc by at most 1.5e8 km * (7.3e-4)^2/8 = 10
// km, a direction error of 7e-8 rad, which moves a LEO shadow boundary by
// 0.5 mm.
package shadow
