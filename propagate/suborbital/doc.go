// Package suborbital computes ballistic arcs from burnout to impact: the
// burnout state from a point on the ellipsoid with speed, flight-path angle
// and azimuth, the free flight in the zonal gravity field of a rotating
// Earth with optional cannonball drag, the events of the arc (apogee, the
// crossings of an altitude such as 100 km, impact) and the Monte Carlo
// dispersion of the impact point with its impact ellipses.
//
// The common calls are
//
//	f, err := suborbital.New(suborbital.Config{Gravity: propagate.J2(mu, re, j2), Omega: 7.292115e-5, Above: 100})
//	arc, err := f.Fly(suborbital.Burnout{Lat: lat, Lon: lon, Alt: 0.3, Speed: 1.9, FlightPath: 84 * deg, Azimuth: 100 * deg},
//		suborbital.Vehicle{}, nil)
//	res, err := suborbital.Disperse(cfg, burnout, vehicle, suborbital.Dispersion{Cases: 1000, Seed: 1, Sigma: sigma})
//
// [Disperse] returns every case's impact point ([DispersionResult.Cases]) so
// that a plot can draw them; [Draw] gives the perturbed burnout of one case.
//
// # Units
//
// Internally and in every argument and result: km, km/s, km/s^2, s and rad;
// the gravitational parameter in km^3/s^2. The vehicle's mass is in kg and
// its reference area in m^2 (the drag coefficient is dimensionless); the
// atmosphere's density is in kg/m^3, and the drag acceleration
// 1/2 rho Cd A/m |v| v is converted to km/s^2 with the factor 1000 m/km.
// Times are seconds from burnout; the caller relates them to an epoch.
//
// # Frames
//
// The arc is integrated in the inertial frame whose axes coincide with the
// Earth-fixed frame (ITRF, polar motion ignored) at burnout, with z along
// the rotation axis; the Earth turns about z at [Config.Omega] rad/s, so the
// Earth-fixed position at time t is r_f = R3(Omega t) r. Precession and
// nutation of the axis over a flight of minutes to hours (below 1e-7 rad
// in an hour) are ignored, and so is polar motion. The zonal field
// ([Config.Gravity]) is symmetric about the same axis. Because the
// atmosphere is static and there are no Sun or Moon terms, an arc does not
// depend on the epoch: the epoch only labels its times.
//
// Latitudes are geodetic and heights are above the ellipsoid
// ([Config.Ellipsoid], WGS 84 by default), so "altitude" everywhere means
// geodetic height. The local horizontal at a point is the plane normal to
// the ellipsoid normal through it; the flight-path angle is measured from
// that plane, the azimuth from north through east. Speeds are relative to
// the rotating Earth (the air at rest) unless Omega is 0, when the Earth
// does not turn and relative and inertial speeds agree.
//
// # Conventions
//
// Ground range is the length of the geodesic on the ellipsoid from the
// point below burnout to the impact point, by Vincenty's inverse method
// ([Inverse]); for the nearly antipodal pairs where that iteration does not
// converge it is the great-circle distance on the sphere of mean radius
// (2a+b)/3, flagged in [Arc.RangeApprox].
//
// The apogee is the highest geodetic height of the arc (the event dh/dt = 0
// falling). The time above [Config.Above] is the total time the geodetic
// height exceeds it. Impact is the first descending crossing of
// [Config.ImpactAlt]. Events are located on the integrator's dense output to
// propagate.Options.EventTol (1e-11 s by default); the arc is integrated in
// two legs, burnout to apogee and apogee to impact, so that an altitude
// crossed once on each leg is never missed inside one integration step.
//
// Impact ellipses come from the sample covariance (divisor N-1) of the
// impact points projected orthographically onto the east-north tangent
// plane at the mean impact point (the mean of the Earth-fixed impact
// positions, taken back to the impact surface). The k-sigma ellipse has
// semi-axes k sqrt(lambda) for the covariance eigenvalues lambda; for a
// two-dimensional normal distribution the 1-sigma ellipse holds 39.3 % of
// the impacts and the 3-sigma one 98.9 %.
//
// A [Flight] keeps its propagators and is not safe for concurrent use;
// [Disperse] makes one per worker. Inputs are never modified. Everything a
// user's input can cause is a returned error: [ErrBurnout], [ErrVehicle],
// [ErrConfig], [ErrEscape], [ErrOrbit], [ErrNoImpact], [ErrDispersion]
// ([ErrNoConvergence] from [Inverse]);
// a failed dispersion case is a [*CaseError], a collapsed step a
// propagate.StepError.
//
// Results are planning estimates. Winds are not modelled, the atmosphere is
// a static mean model and the drag coefficient a constant; impact areas
// and hazard zones are for the launch range's safety office to set.
package suborbital
