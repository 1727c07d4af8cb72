// Package track turns a propagation into the geometric series that
// pictures and summaries need: states sampled at a fixed step with the
// apsides located on the dense output ([Propagate]), their projection on
// the plane of the initial osculating orbit ([PerifocalOf],
// [Trajectory.InPlane]), altitude and speed against time
// ([Trajectory.Profile]), the ground track with the visibility of sites and
// the Sun ([Ground]), the visibility circle of a site ([CentralAngle],
// [VisibilityCircle]), the passes over a site with their paths across the
// sky ([Sky], on packages trajectory and visibility) and the impact points
// of a dispersion run in the tangent plane ([LayOutImpacts]).
//
//	p, _ := propagate.New(propagate.J2(mu, re, j2), propagate.Options{})
//	tr, err := track.Propagate(p, s0, 86400, 30)       // one day, 30 s step
//	pl := tr.InPlane(track.PerifocalOf(el))            // km in the orbit plane
//	gt, err := track.Ground(tr, epoch, 0, re, sites)    // lat, lon, visibility, light
//
// It computes; it never draws or prints (package reports/plots draws).
//
// # Units
//
// Internally and in every argument and result: km, km/s, s, rad. Times t
// are seconds from the initial state, as in package propagate; the caller
// relates them to an epoch.
//
// # Frames
//
// States are inertial and centred on the body (GCRF for the Earth). The
// perifocal frame has P toward periapsis (toward the ascending node for a
// circular orbit, toward +x for a circular equatorial one, following the
// conventions of orbit.Elements), Q 90 deg ahead of P in the direction of
// motion and W along the angular momentum. The ground track is WGS 84
// geodetic (latitude and height on the ellipsoid, longitude east in
// (-pi, pi]) in ITRF with polar motion ignored, through
// earthframe.NewRotation; it is defined for the Earth only.
//
// # Conventions
//
// The visibility circle uses a spherical body of radius Re: the Earth
// central angle between a site and the sub-satellite point of a satellite
// at altitude h seen at elevation el is
//
//	lambda = acos(Re cos(el) / (Re + h)) - el
//
// (the triangle centre-site-satellite; the same relation as
// sin(eta) = Re cos(el)/(Re+h), lambda = 90 deg - el - eta in
// Wertz and Larson, Space Mission Analysis and Design, 3rd ed., sec. 5.2).
// Whether a sample is in view of a site is decided separately and exactly,
// from the site's topocentric elevation on the WGS 84 ellipsoid
// (geodesy.Station.Look), so the circle is a guide for the eye and the
// highlighted track is the truth.
//
// Sunlight is the conical shadow of package shadow (a sphere of radius Re
// and the Sun of radius shadow.SunRadius at sunmoon.Sun, GCRF, km): a
// sample is sunlit unless it is in the umbra, as the passes' "sunlit" is.
// The Earth rotation is visibility.EarthFrame (earthframe's IAU 2006/2000B
// rotation with the slow part interpolated hourly).
//
// Inputs are never modified; results are new slices. Everything a user's
// input can cause is a returned error: [ErrSamples] when a span and step
// would give more than [MaxSamples] samples, [ErrGeometry] for a
// visibility circle that does not exist, and the propagation's own errors
// (for example *propagate.StepError) unchanged. The ground track uses the
// Earth's rotation and ellipsoid: the caller offers it for the Earth only.
package track
