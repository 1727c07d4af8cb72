// Package forces builds the perturbing accelerations of package propagate
// that are not part of the zonal gravity field: atmospheric drag, the
// point-mass attraction of third bodies (Sun, Moon) and solar radiation
// pressure, each as a value whose Perturbation method returns a
// [propagate.Perturbation], and [Combine] to add several into the one
// Model.Perturbation a propagation takes.
//
//	drag, err := forces.NewDrag(forces.DragConfig{
//		BallisticCoefficient: forces.BallisticCoefficient(4.2, 2.2, 0.034), // kg/m^2
//		DensityScale:         1,
//		RotationRate:         earth.RotationRate,
//	})
//	sun := forces.NewSunEphemeris(epoch)
//	moon := forces.NewMoonEphemeris(epoch)
//	third := []*forces.ThirdBody{{Name: "sun", GM: sunGM, Position: sun.Position}, {Name: "moon", GM: moonGM, Position: moon.Position}}
//	m := propagate.Zonal(mu, re, j, 4)
//	m.Perturbation = forces.Combine(drag.Perturbation(), third[0].Perturbation(), third[1].Perturbation())
//
// Every force enters the engine as a generalized force of the Cartesian
// coordinates (see package propagate). The Sun and Moon are conservative
// but time-dependent; they are added as forces rather than potential terms
// so that one mechanism serves all perturbations, and the conservation
// checks of propagate refuse any model with a perturbation.
//
// # Units
//
// Positions km, velocities km/s, accelerations km/s^2, time t in s from
// the epoch the ephemerides were built for, GM in km^3/s^2, rotation rates
// rad/s. Spacecraft properties are SI, as users give them: mass kg, area
// m^2, ballistic coefficient B = m/(Cd A) in kg/m^2, density kg/m^3,
// radiation pressure N/m^2. The factor 1000 m/km between the two is applied
// inside each force and stated beside its formula.
//
// # Frames
//
// States are in the GCRF, centred on the central body. The atmosphere
// co-rotates with the body about the GCRF z axis at the body's rotation
// rate, and the geodetic height that selects the density is computed by
// [geodesy.Ellipsoid.FromECEF] of the GCRF position: geodetic latitude and
// height do not change under a rotation about z, so the Earth rotation
// angle is not needed. Both treat the GCRF z axis as the Earth's rotation
// axis. The true pole of date is offset from it by precession and
// nutation, about 20 arcsec per year since 2000 (9 arcmin in 2027): this
// turns the co-rotation velocity (at most 0.5 km/s) by that angle, a wind
// error below 2 m/s (3e-4 of the relative speed), and tilts the ellipsoid
// by it, a height error below 60 m. Both are far below the uncertainty of
// the density. Sun and Moon positions come from package sunmoon
// (geometric, GCRF, geocentric), so third bodies and radiation pressure
// are for an Earth-centred propagation only.
//
// # Conventions
//
// Constructors validate their configuration and return errors wrapping
// [ErrConfig]; a force built that way never returns an error or a NaN for a
// finite state off the body's centre. The methods allocate nothing per
// call. [Ephemeris] caches Chebyshev fits of the Sun or Moon position in
// one-day segments and is not safe for concurrent use; build one per
// propagation (they are cheap). Inputs are never modified.
package forces
