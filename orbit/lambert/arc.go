package lambert

import (
	"math"

	"centra/orbit"
)

// SweptAngle returns the transfer angle from r1 to r2 in the sense of the
// motion, the angular momentum r1 x v1, in rad in (0, 2π): above π for an
// arc the long way round. r1 and r2 must not be collinear with the centre.
func SweptAngle(r1, r2, v1 [3]float64) float64 {
	h := cross(r1, v1)
	c := cross(r1, r2)
	ang := math.Atan2(norm(c), dot(r1, r2))
	if dot(c, h) < 0 {
		ang = 2*math.Pi - ang
	}
	return ang
}

// LowestRadius returns the lowest radius (km) on the arc that leaves r1
// on the conic el (with geometry g, both of the departure state), sweeps
// the angle sweep (SweptAngle) plus revs complete revolutions and ends at
// r2: the periapsis radius when the arc passes periapsis, else the lower
// end point. On a circle it is the radius.
func LowestRadius(el orbit.Elements, g orbit.Geometry, sweep float64, revs int, r1, r2 [3]float64) float64 {
	lo := math.Min(norm(r1), norm(r2))
	if el.E == 0 {
		return lo
	}
	nu := el.Nu // [0, 2π) on an ellipse, (-ν∞, ν∞) on an open orbit
	passes := revs > 0
	if g.Conic == orbit.Ellipse {
		passes = passes || nu+sweep >= 2*math.Pi
	} else {
		passes = nu < 0 && nu+sweep > 0
	}
	if passes {
		return math.Min(lo, g.PeriapsisRadius)
	}
	return lo
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
