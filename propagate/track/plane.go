package track

import (
	"fmt"
	"math"

	"centra/orbit"
)

// Perifocal is the frame of an orbit's plane: unit vectors P (toward
// periapsis), Q (90 deg ahead of P in the direction of motion) and W
// (along the angular momentum), in the inertial frame of the state.
type Perifocal struct {
	P, Q, W [3]float64
}

// PerifocalOf returns the perifocal frame of el (RAAN, inclination and
// argument of periapsis; the size, shape and anomaly are not used):
// the columns of R3(-RAAN) R1(-i) R3(-argp). With the conventions of
// orbit.Elements, P points to the ascending node for a circular orbit and
// to +x for a circular equatorial one.
func PerifocalOf(el orbit.Elements) Perifocal {
	so, co := math.Sincos(el.RAAN)
	si, ci := math.Sincos(el.I)
	sw, cw := math.Sincos(el.ArgP)
	return Perifocal{
		P: [3]float64{co*cw - so*sw*ci, so*cw + co*sw*ci, sw * si},
		Q: [3]float64{-co*sw - so*cw*ci, -so*sw + co*cw*ci, cw * si},
		W: [3]float64{so * si, -co * si, ci},
	}
}

// Project returns the perifocal coordinates of the inertial vector r:
// x along P, y along Q, z along W.
func (f Perifocal) Project(r [3]float64) (x, y, z float64) {
	return dot(r, f.P), dot(r, f.Q), dot(r, f.W)
}

// PlanePoint is a position in the perifocal frame.
type PlanePoint struct {
	T    float64 // s from the initial state
	X, Y float64 // km, in the plane: along P and Q
	Z    float64 // km, out of the plane (along W): nonzero when the plane drifts
}

// PlaneApsis is an apsis in the perifocal frame.
type PlaneApsis struct {
	PlanePoint
	Periapsis bool    // true at a periapsis, false at an apoapsis
	Radius    float64 // |r|, km
}

// InPlane projects the trajectory on the perifocal frame f (usually the
// frame of the initial osculating elements).
func (tr *Trajectory) InPlane(f Perifocal) (points []PlanePoint, apsides []PlaneApsis) {
	points = make([]PlanePoint, len(tr.T))
	for i, s := range tr.States {
		x, y, z := f.Project(s.R)
		points[i] = PlanePoint{T: tr.T[i], X: x, Y: y, Z: z}
	}
	apsides = make([]PlaneApsis, len(tr.Apsides))
	for i, a := range tr.Apsides {
		x, y, z := f.Project(a.State.R)
		apsides[i] = PlaneApsis{PlanePoint: PlanePoint{T: a.T, X: x, Y: y, Z: z}, Periapsis: a.Periapsis, Radius: norm(a.State.R)}
	}
	return points, apsides
}

// DefaultSpan returns a span that shows the orbit of el about a body of
// gravitational parameter mu (km^3/s^2) whole: one period of an ellipse;
// for a parabola or hyperbola, the time from the state (through periapsis
// if it is inbound) out to the radius max(4 r_p, 2 r) on the outgoing leg,
// from Kepler's equation in the form of orbit.MeanFromTrue.
func DefaultSpan(mu float64, el orbit.Elements) (float64, error) {
	g, err := orbit.GeometryOf(mu, el)
	if err != nil {
		return 0, err
	}
	if g.HasPeriod {
		return g.Period, nil
	}
	p, e := g.SemiLatusRectum, g.Eccentricity
	r0 := p / (1 + e*math.Cos(el.Nu))
	rt := math.Max(4*g.PeriapsisRadius, 2*r0)
	nuT := math.Acos(math.Max(-1, math.Min(1, (p/rt-1)/e)))
	m0, err := orbit.MeanFromTrue(el.Nu, e)
	if err != nil {
		return 0, err
	}
	m1, err := orbit.MeanFromTrue(nuT, e)
	if err != nil {
		return 0, err
	}
	span := (m1 - m0) / g.MeanMotion
	if !(span > 0) || math.IsInf(span, 0) {
		return 0, fmt.Errorf("%w: no outbound leg from true anomaly %g rad (e = %g)", ErrGeometry, el.Nu, e)
	}
	return span, nil
}
