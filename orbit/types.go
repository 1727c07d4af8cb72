package orbit

// State is a position and velocity in an inertial frame centred on the
// body (GCRF for Earth): R in km, V in km/s.
type State struct {
	R, V [3]float64
}

// Elements are classical (Keplerian) orbital elements. A is the
// semi-major axis in km (negative for a hyperbola, +Inf is not used: a
// parabola stores its semi-latus rectum in P and A = 0); angles are in
// radians.
type Elements struct {
	A    float64 // semi-major axis, km (negative for hyperbolas; 0 for a parabola)
	P    float64 // semi-latus rectum, km (always set)
	E    float64 // eccentricity
	I    float64 // inclination, rad, [0, pi]
	RAAN float64 // right ascension of the ascending node, rad, [0, 2pi)
	ArgP float64 // argument of periapsis, rad, [0, 2pi)
	Nu   float64 // true anomaly, rad, [0, 2pi) (hyperbola: (-nu_inf, nu_inf))
}

// Check is one comparison of a derived number against the law it must
// obey: a Kepler law, vis-viva, or a conservation law.
type Check struct {
	Name          string  // short identifier, for example "third_law_period"
	Description   string  // one line for people
	Expected      float64 // the value the law predicts
	Measured      float64 // the value computed another way
	RelativeError float64 // |measured-expected| / max(|expected|, tiny)
	Tolerance     float64 // relative tolerance the check was held to
	Pass          bool
}
