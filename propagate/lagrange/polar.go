package lagrange

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
)

// ErrState reports an inertial state that has no polar form: a position at
// the origin or non-finite components.
var ErrState = errors.New("lagrange: state has no polar form")

// Plane is an orthonormal right-handed inertial basis of an orbit plane: P
// points to the position at the reference epoch (theta = 0), Q completes
// the plane in the sense of motion and W = P x Q is along the angular
// momentum.
type Plane struct {
	P, Q, W [3]float64
}

// Polar holds planar polar coordinates in a [Plane] and their rates:
// R in km, Theta in rad from P towards Q, RDot in km/s, ThetaDot in rad/s.
type Polar struct {
	R, Theta, RDot, ThetaDot float64
}

// ToPolar returns the plane carried by the inertial state s (km, km/s) and
// the polar coordinates of s in it (Theta = 0). For rectilinear motion
// (angular momentum zero to rounding) the plane contains the line of
// motion and the coordinate axis least aligned with it.
func ToPolar(s orbit.State) (Plane, Polar, error) {
	for _, v := range [6]float64{s.R[0], s.R[1], s.R[2], s.V[0], s.V[1], s.V[2]} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return Plane{}, Polar{}, fmt.Errorf("%w: non-finite component in %v", ErrState, s)
		}
	}
	r := norm(s.R)
	if r == 0 {
		return Plane{}, Polar{}, fmt.Errorf("%w: position at the origin", ErrState)
	}
	p := scale3(1/r, s.R)
	h := cross(s.R, s.V)
	hn := norm(h)
	var w [3]float64
	if hn > 1e-14*r*norm(s.V) && hn > 0 {
		w = scale3(1/hn, h)
	} else {
		// rectilinear: any plane through the line will do
		var axis [3]float64
		axis[axis0(p)] = 1
		c := cross(p, axis)
		w = scale3(1/norm(c), c)
		hn = 0
	}
	q := cross(w, p)
	return Plane{P: p, Q: q, W: w}, Polar{R: r, RDot: dot(s.R, s.V) / r, ThetaDot: hn / (r * r)}, nil
}

// axis0 returns the index of the smallest |component| of v.
func axis0(v [3]float64) int {
	i := 0
	for k := 1; k < 3; k++ {
		if math.Abs(v[k]) < math.Abs(v[i]) {
			i = k
		}
	}
	return i
}

// State returns the inertial state (km, km/s) of the polar coordinates p
// in the plane.
func (pl Plane) State(p Polar) orbit.State {
	sn, cs := math.Sincos(p.Theta)
	var s orbit.State
	for i := range 3 {
		er := cs*pl.P[i] + sn*pl.Q[i]
		et := -sn*pl.P[i] + cs*pl.Q[i]
		s.R[i] = p.R * er
		s.V[i] = p.RDot*er + p.R*p.ThetaDot*et
	}
	return s
}

// Polar returns the polar coordinates in the plane of an inertial state
// lying in it; the component along W is ignored. Theta is in (-pi, pi].
func (pl Plane) Polar(s orbit.State) Polar {
	x, y := dot(s.R, pl.P), dot(s.R, pl.Q)
	vx, vy := dot(s.V, pl.P), dot(s.V, pl.Q)
	r := math.Hypot(x, y)
	return Polar{R: r, Theta: math.Atan2(y, x), RDot: (x*vx + y*vy) / r, ThetaDot: (x*vy - y*vx) / (r * r)}
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm(a [3]float64) float64   { return math.Sqrt(dot(a, a)) }
func scale3(f float64, a [3]float64) [3]float64 {
	return [3]float64{f * a[0], f * a[1], f * a[2]}
}
func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
