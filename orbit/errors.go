package orbit

import (
	"errors"
	"strings"
)

// Sentinel errors. Functions return them wrapped in an [*InputError] that
// names the function and the offending value; test for them with
// [errors.Is].
var (
	// ErrInvalidMu reports a gravitational parameter that is not a
	// positive finite number.
	ErrInvalidMu = errors.New("orbit: gravitational parameter mu must be positive and finite")
	// ErrNonFinite reports a NaN or infinite component in an input.
	ErrNonFinite = errors.New("orbit: input is not finite")
	// ErrZeroPosition reports a state at the centre of the body (|r| = 0).
	ErrZeroPosition = errors.New("orbit: position is at the centre of the body")
	// ErrRectilinear reports a state whose angular momentum vanishes
	// (velocity zero or along the radius): the conic degenerates into a
	// line and the classical elements are undefined.
	ErrRectilinear = errors.New("orbit: angular momentum is zero (rectilinear motion)")
	// ErrEccentricity reports an eccentricity that is negative or not finite.
	ErrEccentricity = errors.New("orbit: eccentricity must be finite and non-negative")
	// ErrSize reports a semi-major axis or semi-latus rectum that does not
	// describe a conic of the given eccentricity.
	ErrSize = errors.New("orbit: size of the conic is invalid for its eccentricity")
	// ErrInclination reports an inclination outside [0, pi].
	ErrInclination = errors.New("orbit: inclination must lie in [0, pi]")
	// ErrBeyondAsymptote reports a true anomaly that an open orbit never
	// reaches (|nu| >= arccos(-1/e)).
	ErrBeyondAsymptote = errors.New("orbit: true anomaly is beyond the asymptote of the open orbit")
	// ErrOpenOrbit reports a request that needs a closed (elliptic) orbit.
	ErrOpenOrbit = errors.New("orbit: the orbit is open (parabolic or hyperbolic)")
	// ErrRadius reports a radius that is not positive or that the orbit
	// cannot reach.
	ErrRadius = errors.New("orbit: radius is not positive or not reachable on this orbit")
	// ErrNoSunSynchronous reports an orbit for which no inclination makes
	// the J2 nodal rate equal the mean motion of the Sun (|cos i| > 1).
	ErrNoSunSynchronous = errors.New("orbit: no sun-synchronous inclination exists")
	// ErrJ2 reports a reference radius or J2 that is not positive and finite.
	ErrJ2 = errors.New("orbit: reference radius and J2 must be positive and finite")
	// ErrPeriod reports a period or time that is not positive and finite.
	ErrPeriod = errors.New("orbit: period must be positive and finite")
	// ErrNoConvergence reports an iteration that did not converge; it
	// indicates an input far outside the tested range.
	ErrNoConvergence = errors.New("orbit: iteration did not converge")
)

// InputError gives the context of an error: the function (Op), what was
// wrong with the input in words and numbers (Detail), and the sentinel
// (Err) it wraps.
type InputError struct {
	Op     string // function name, for example "ElementsFromState"
	Detail string // the offending value, for example "|r| = 0 km"
	Err    error  // one of the sentinel errors of this package
}

func (e *InputError) Error() string {
	msg := strings.TrimPrefix(e.Err.Error(), "orbit: ")
	if e.Detail == "" {
		return "orbit." + e.Op + ": " + msg
	}
	return "orbit." + e.Op + ": " + e.Detail + ": " + msg
}

// Unwrap returns the sentinel error.
func (e *InputError) Unwrap() error { return e.Err }

func inputErr(op string, err error, detail string) error {
	return &InputError{Op: op, Detail: detail, Err: err}
}
