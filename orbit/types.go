package orbit

// State is a position and velocity in an inertial frame centred on the
// body (GCRF for Earth): R in km, V in km/s.
type State struct {
	R, V [3]float64
}

// Elements are classical (Keplerian) orbital elements; angles are in
// radians. The conventions, including those of the circular, equatorial
// and parabolic cases, are those of [ElementsFromState]; in short:
//
//   - P is always set and is the size that counts: [StateFromElements]
//     uses A only when P is zero.
//   - A is the semi-major axis, negative for a hyperbola and 0 for a
//     parabola (whose A is infinite); A = P/(1-E^2) otherwise.
//   - E == 1 exactly is the parabola.
//   - Circular orbits have ArgP = 0 and Nu = argument of latitude;
//     equatorial orbits have RAAN = 0 and ArgP = longitude of periapsis;
//     circular equatorial orbits have Nu = true longitude. All angles run
//     in the direction of motion (clockwise seen from +z when I = pi).
type Elements struct {
	A    float64 // semi-major axis, km (negative for hyperbolas; 0 for a parabola)
	P    float64 // semi-latus rectum, km (always set)
	E    float64 // eccentricity
	I    float64 // inclination, rad, [0, pi]
	RAAN float64 // right ascension of the ascending node, rad, [0, 2pi)
	ArgP float64 // argument of periapsis, rad, [0, 2pi)
	Nu   float64 // true anomaly, rad, [0, 2pi) (hyperbola, parabola: (-nu_inf, nu_inf))
}

// Conic returns the kind of conic, from E.
func (el Elements) Conic() Conic { return ConicOf(el.E) }

// MeanAnomaly returns the mean anomaly at Nu in the conventions of
// [MeanFromTrue] (elliptic, Barker's parabolic or hyperbolic).
func (el Elements) MeanAnomaly() (float64, error) { return MeanFromTrue(el.Nu, el.E) }

// ArgumentOfLatitude returns ArgP + Nu in [0, 2pi): the angle from the
// ascending node to the position, in the direction of motion.
func (el Elements) ArgumentOfLatitude() float64 { return wrap2Pi(el.ArgP + el.Nu) }

// LongitudeOfPeriapsis returns RAAN + ArgP in [0, 2pi). With the
// equatorial convention (RAAN = 0) it is ArgP, measured from +x in the
// direction of motion also for a retrograde orbit.
func (el Elements) LongitudeOfPeriapsis() float64 { return wrap2Pi(el.RAAN + el.ArgP) }

// TrueLongitude returns RAAN + ArgP + Nu in [0, 2pi), with the same
// convention as [Elements.LongitudeOfPeriapsis].
func (el Elements) TrueLongitude() float64 { return wrap2Pi(el.RAAN + el.ArgP + el.Nu) }

// Check is one comparison of a derived number against the law it must
// obey: a Kepler law, vis-viva, or a conservation law (see [KeplerChecks]).
type Check struct {
	Name          string  // short identifier, for example "third_law_period"
	Description   string  // one line for people, with the unit of Expected and Measured
	Expected      float64 // the value the law predicts
	Measured      float64 // the value computed another way
	RelativeError float64 // |Measured-Expected| / scale, scale = |Expected| (for the energy: mu/r)
	Tolerance     float64 // relative tolerance the check was held to
	Pass          bool    // RelativeError <= Tolerance
}
