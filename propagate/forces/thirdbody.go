package forces

import (
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
)

// ThirdBodyAcceleration returns the perturbing acceleration (km/s^2) on a
// satellite at r (km, relative to the central body) by a point mass of
// gravitational parameter gm (km^3/s^2) at s (km, relative to the central
// body): the direct attraction of the satellite less the attraction of
// the central body,
//
//	a = gm [ (s - r)/|s - r|^3 - s/|s|^3 ].
//
// It is evaluated in the form free of the cancellation between the two
// nearly equal terms (Battin, An Introduction to the Mathematics and
// Methods of Astrodynamics, rev. ed. 1999, sec. 8.4, eqs. 8.60-8.61;
// Montenbruck and Gill, Satellite Orbits, 2000, sec. 3.3.1): with
// d = s - r and q = r.(r - 2s)/|s|^2, so that |d|^2 = |s|^2 (1 + q),
//
//	a = -gm/|d|^3 [ r + f(q) s ],  f(q) = (1+q)^(3/2) - 1 = q (3 + 3q + q^2) / (1 + (1+q)^(3/2)).
func ThirdBodyAcceleration(gm float64, r, s [3]float64) [3]float64 {
	s2 := s[0]*s[0] + s[1]*s[1] + s[2]*s[2]
	q := (r[0]*(r[0]-2*s[0]) + r[1]*(r[1]-2*s[1]) + r[2]*(r[2]-2*s[2])) / s2
	onePlusQ32 := (1 + q) * math.Sqrt(1+q)
	f := q * (3 + 3*q + q*q) / (1 + onePlusQ32)
	d2 := s2 * (1 + q)
	k := -gm / (d2 * math.Sqrt(d2))
	return [3]float64{k * (r[0] + f*s[0]), k * (r[1] + f*s[1]), k * (r[2] + f*s[2])}
}

// ThirdBody is a point mass perturbing an orbit about the central body.
type ThirdBody struct {
	Name string  // for labels, for example "moon"
	GM   float64 // km^3/s^2
	// Position returns the body's position in km relative to the central
	// body at t s from the epoch of the propagation, for example
	// [Ephemeris.Position].
	Position func(t float64) [3]float64
}

// Validate checks GM and Position.
func (tb *ThirdBody) Validate() error {
	if !(tb.GM > 0) || math.IsInf(tb.GM, 0) {
		return fmt.Errorf("%w: third body %q has GM %g km^3/s^2, want positive and finite", ErrConfig, tb.Name, tb.GM)
	}
	if tb.Position == nil {
		return fmt.Errorf("%w: third body %q has no position function", ErrConfig, tb.Name)
	}
	return nil
}

// Acceleration returns the perturbing acceleration at time t and position r.
func (tb *ThirdBody) Acceleration(t float64, r [3]float64) [3]float64 {
	return ThirdBodyAcceleration(tb.GM, r, tb.Position(t))
}

// Perturbation returns the third body's attraction as a model
// perturbation; t is in s from the epoch of Position.
func (tb *ThirdBody) Perturbation() propagate.Perturbation {
	return func(t float64, s orbit.State) ([3]float64, error) { return tb.Acceleration(t, s.R), nil }
}
