package propagate

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate/integrate"
)

// Model is the force model of a propagation: a point mass of
// gravitational parameter Mu, optionally the zonal harmonics J2..J_Degree
// of a body of reference radius Re, and optionally a non-conservative
// perturbation. Build one with [PointMass], [J2] or [Zonal], or fill the
// fields directly; [New] validates it.
type Model struct {
	Mu     float64   // gravitational parameter, km^3/s^2
	Re     float64   // reference (equatorial) radius of the zonal coefficients, km; needed when Degree >= 2
	J      []float64 // J[n] = J_n, unnormalized, dimensionless; J[0], J[1] ignored
	Degree int       // highest zonal degree: 0 (or 1) point mass, 2..6 zonal field

	// Perturbation, when not nil, adds a non-conservative acceleration
	// (drag, radiation pressure, thrust). It enters the engine as the
	// generalized force of the Cartesian coordinates.
	Perturbation Perturbation
}

// Perturbation returns an acceleration in km/s^2, in the inertial frame,
// at time t (s from the initial state) and state s (km, km/s). It is called
// at every evaluation of the equations of motion and must not allocate if
// the propagation is to stay allocation-free. A returned error stops the
// propagation.
type Perturbation func(t float64, s orbit.State) ([3]float64, error)

// PointMass returns the model of an inverse-square field.
func PointMass(mu float64) Model { return Model{Mu: mu} }

// J2 returns the model of a point mass plus the J2 zonal harmonic.
func J2(mu, re, j2 float64) Model {
	return Model{Mu: mu, Re: re, J: []float64{0, 0, j2}, Degree: 2}
}

// Zonal returns the model of a point mass plus the zonal harmonics
// J2..J_degree, j[n] = J_n. The slice is copied.
func Zonal(mu, re float64, j []float64, degree int) Model {
	return Model{Mu: mu, Re: re, J: append([]float64(nil), j...), Degree: degree}
}

// Equations selects how the equations of motion are evaluated.
type Equations int

const (
	// FastPath uses closed-form Cartesian accelerations (package
	// gravity), proven equal to the engine-derived ones to 1e-13 relative.
	FastPath Equations = iota
	// Engine uses the Euler-Lagrange equations derived by the Lagrangian
	// engine (hyperdual numbers) in Cartesian coordinates.
	Engine
	// EnginePolar uses the engine in planar polar coordinates (r, theta)
	// of the initial orbit plane. Point mass without perturbation only.
	// theta, which grows by 2 pi per orbit, is held to RelTol in absolute
	// terms (rad) rather than relative to its size.
	EnginePolar
)

func (e Equations) String() string {
	switch e {
	case FastPath:
		return "fast path"
	case Engine:
		return "engine (Cartesian)"
	case EnginePolar:
		return "engine (polar)"
	}
	return fmt.Sprintf("Equations(%d)", int(e))
}

// Default option values, used when the corresponding field is zero.
const (
	DefaultRelTol   = 1e-10      // about 4 mm after one day of a 500 km LEO with J2
	DefaultMaxSteps = 10_000_000 // about a decade of LEO at the default tolerance
	DefaultEventTol = 1e-11      // s
)

// Options control the integration. The zero value is usable.
type Options struct {
	// RelTol is the relative local error tolerance of the DOP853 step
	// control. Zero means DefaultRelTol. Must lie in [1e-15, 1e-3].
	RelTol float64
	// AbsTol is the absolute local error tolerance, applied alike to km
	// and km/s components (and to rad, rad/s for EnginePolar). Zero means
	// RelTol * 1e-3, so that the relative test governs positions of
	// thousands of km and velocities of km/s alike.
	AbsTol float64
	// MaxSteps bounds the attempted steps of one propagation. Zero means
	// DefaultMaxSteps.
	MaxSteps int
	// EventTol is the absolute accuracy of event times in s on the dense
	// output. Zero means DefaultEventTol.
	EventTol float64
	// Equations selects the fast path (the zero value) or the engine.
	Equations Equations
}

var (
	// ErrModel reports an invalid force model.
	ErrModel = errors.New("propagate: invalid model")
	// ErrOptions reports invalid options.
	ErrOptions = errors.New("propagate: invalid options")
	// ErrState reports an initial state that cannot be propagated.
	ErrState = errors.New("propagate: invalid state")
	// ErrSpan reports a span or output step that is not finite, or an
	// output step that is negative.
	ErrSpan = errors.New("propagate: invalid span or step")
	// ErrStepSize reports that the step size collapsed, for example at a
	// collision with a point mass; the error is a *StepError with the time
	// and state reached.
	ErrStepSize = integrate.ErrStepSize
	// ErrMaxSteps reports that Options.MaxSteps steps did not reach the
	// end of the span; the error is a *StepError.
	ErrMaxSteps = integrate.ErrMaxSteps
)

// StepError reports a propagation stopped before the end of its span, with
// the time (s from the initial state) and the last accepted state.
type StepError struct {
	T     float64
	State orbit.State
	Err   error
}

func (e *StepError) Error() string {
	return fmt.Sprintf("propagate: %v at t = %.6f s, r = %.6f km, v = %.9f km/s", e.Err, e.T, e.State.R, e.State.V)
}

func (e *StepError) Unwrap() error { return e.Err }

func finiteState(s orbit.State) bool {
	for i := range 3 {
		if math.IsNaN(s.R[i]) || math.IsInf(s.R[i], 0) || math.IsNaN(s.V[i]) || math.IsInf(s.V[i], 0) {
			return false
		}
	}
	return true
}
