package trajectory

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
)

// ErrTrajectory reports a trajectory that cannot be sampled: a span that
// is not positive and finite, or a state whose orbit has no finite
// periapsis radius and speed.
var ErrTrajectory = errors.New("trajectory: cannot sample")

// Default option values, used when the corresponding field is zero.
const (
	DefaultPositionTol = 1e-4  // km (0.1 m)
	DefaultMaxStep     = 300.0 // s
	DefaultMinStep     = 0.5   // s
	// DefaultMaxSamples bounds the memory of one trajectory: 48 bytes per
	// sample, about 190 MB at the bound.
	DefaultMaxSamples = 4_000_000
)

// Options control the sampling. The zero value is usable.
type Options struct {
	// PositionTol is the bound on the interpolation error of the
	// position, km. Zero means DefaultPositionTol.
	PositionTol float64
	// MaxStep and MinStep bound the sampling step, s. Zero means
	// DefaultMaxStep and DefaultMinStep. When MinStep is needed to meet
	// PositionTol is smaller than MinStep, MinStep is used and the larger
	// bound is reported by [Trajectory.Bound].
	MaxStep, MinStep float64
	// MaxSamples bounds the number of samples; a span that would need
	// more is refused with ErrTrajectory. Zero means DefaultMaxSamples.
	MaxSamples int
	// Stop, when not nil, is located during the propagation (for example
	// the entry into the body's surface); if it occurs, Sample returns a
	// [*StopError] instead of a trajectory. Its Terminal field is ignored.
	Stop *propagate.Event
}

// StopError reports that Options.Stop occurred at T s, in state State,
// before the end of the span.
type StopError struct {
	Event string
	T     float64
	State orbit.State
}

func (e *StopError) Error() string {
	return fmt.Sprintf("trajectory: event %q at t = %.3f s, before the end of the span", e.Event, e.T)
}

// Bound is the proven bound of the interpolation error (see the package
// documentation).
type Bound struct {
	Position float64 // km
	Velocity float64 // km/s
	Fourth   float64 // bound on |d^4 r/dt^4| used, km/s^4
}

// Trajectory is a propagated orbit sampled at a fixed step. It is
// immutable after [Sample] and safe for concurrent use.
type Trajectory struct {
	span  float64
	step  float64
	n     int          // number of intervals; samples 0..n
	r, v  [][3]float64 // samples
	bound Bound
	mu    float64
}

// FourthDerivativeBound returns the bound 2 mu^2/r^5 + 21 mu v^2/r^4 on
// |d^4 r/dt^4| (km/s^4) of Keplerian motion that never comes closer than
// rmin (km) to the centre nor moves faster than vmax (km/s).
func FourthDerivativeBound(mu, rmin, vmax float64) float64 {
	r4 := rmin * rmin * rmin * rmin
	return 2*mu*mu/(r4*rmin) + 21*mu*vmax*vmax/r4
}

// HermiteBound returns the bounds of the vector interpolation error of a
// step h (s) for a fourth-derivative bound m4 (km/s^4):
// sqrt(3) m4 h^4/384 (km) and 3 m4 h^3/216 (km/s).
func HermiteBound(m4, h float64) (pos, vel float64) {
	h3 := h * h * h
	return math.Sqrt(3) * m4 * h3 * h / 384, 3 * m4 * h3 / 216
}

// stepFor returns the step whose position bound is tol.
func stepFor(m4, tol float64) float64 {
	return math.Pow(384*tol/(math.Sqrt(3)*m4), 0.25)
}

// perturbationMargin covers the zonal harmonics and other perturbations
// in the Keplerian fourth-derivative bound (see the package doc).
const perturbationMargin = 1.1

// periapsis returns the osculating periapsis radius and speed of s.
func periapsis(mu float64, s orbit.State) (rp, vp float64, ok bool) {
	r := norm(s.R)
	v2 := dot(s.V, s.V)
	h := norm(cross(s.R, s.V))
	if !(r > 0) || !(h > 0) || math.IsInf(r, 0) || math.IsInf(v2, 0) {
		return 0, 0, false
	}
	energy := v2/2 - mu/r
	e2 := 1 + 2*energy*h*h/(mu*mu)
	e := math.Sqrt(math.Max(e2, 0))
	rp = h * h / mu / (1 + e)
	vp = h / rp
	return rp, vp, rp > 0 && !math.IsInf(vp, 0)
}

// Sample propagates s0 over span seconds (positive) with p and samples
// the solution at a step chosen so that the interpolation error bound is
// at most opt.PositionTol. If the samples show a closer or faster
// periapsis than s0 (perturbations), it samples again at a shorter step.
func Sample(p *propagate.Propagator, s0 orbit.State, span float64, opt Options) (*Trajectory, error) {
	if !(span > 0) || math.IsInf(span, 0) {
		return nil, fmt.Errorf("%w: span %g s, want positive and finite", ErrTrajectory, span)
	}
	tol := opt.PositionTol
	if tol == 0 {
		tol = DefaultPositionTol
	}
	maxStep, minStep := opt.MaxStep, opt.MinStep
	if maxStep == 0 {
		maxStep = DefaultMaxStep
	}
	if minStep == 0 {
		minStep = DefaultMinStep
	}
	maxSamples := opt.MaxSamples
	if maxSamples == 0 {
		maxSamples = DefaultMaxSamples
	}
	if !(tol > 0) || !(minStep > 0) || !(maxStep >= minStep) || maxSamples < 2 {
		return nil, fmt.Errorf("%w: options %+v", ErrTrajectory, opt)
	}
	mu := p.Model().Mu
	rp, vp, ok := periapsis(mu, s0)
	if !ok {
		return nil, fmt.Errorf("%w: the orbit of the initial state has no periapsis (r = %v km, v = %v km/s)", ErrTrajectory, s0.R, s0.V)
	}
	// The first step aims at 90% of the tolerance, so that the closer
	// periapses met along the way (the zonal harmonics move the osculating
	// periapsis by tens of km) rarely force a second pass.
	target := 0.9 * tol
	for range 4 {
		m4 := perturbationMargin * FourthDerivativeBound(mu, rp, vp)
		h := math.Min(math.Max(stepFor(m4, target), minStep), maxStep)
		n := int(math.Ceil(span/h - 1e-9))
		if n < 1 {
			n = 1
		}
		if n+1 > maxSamples {
			return nil, fmt.Errorf("%w: %d samples needed (step %.3g s over %.6g s), more than %d", ErrTrajectory, n+1, h, span, maxSamples)
		}
		tr, err := sampleAt(p, s0, span, n, opt.Stop)
		if err != nil {
			return nil, err
		}
		// The closest and fastest periapsis met along the way.
		rpMin, vpMax := rp, vp
		for k := range tr.r {
			if r, v, ok := periapsis(mu, orbit.State{R: tr.r[k], V: tr.v[k]}); ok {
				rpMin, vpMax = math.Min(rpMin, r), math.Max(vpMax, v)
			}
		}
		m4 = perturbationMargin * FourthDerivativeBound(mu, rpMin, vpMax)
		pos, vel := HermiteBound(m4, tr.step)
		tr.bound, tr.mu = Bound{Position: pos, Velocity: vel, Fourth: m4}, mu
		if pos <= tol*(1+1e-9) || tr.step <= minStep*(1+1e-9) {
			return tr, nil
		}
		rp, vp, target = rpMin, vpMax, 0.99*tol
	}
	return nil, fmt.Errorf("%w: the step did not settle (periapsis changing fast)", ErrTrajectory)
}

// sampleAt propagates over span and stores n+1 samples at k span/n.
func sampleAt(p *propagate.Propagator, s0 orbit.State, span float64, n int, stop *propagate.Event) (*Trajectory, error) {
	h := span / float64(n)
	tr := &Trajectory{span: span, step: h, n: n, r: make([][3]float64, 0, n+1), v: make([][3]float64, 0, n+1)}
	var badT float64
	bad := false
	out := &propagate.Output{Step: h, OnState: func(t float64, s orbit.State) error {
		k := len(tr.r)
		if k > n || math.Abs(t-float64(k)*h) > 1e-6*h {
			bad, badT = true, t
			return errors.New("trajectory: sample out of order")
		}
		tr.r = append(tr.r, s.R)
		tr.v = append(tr.v, s.V)
		return nil
	}}
	if stop != nil {
		ev := *stop
		ev.Terminal = true
		out.Events = []propagate.Event{ev}
	}
	res, err := p.Run(s0, span, out)
	if bad {
		panic(fmt.Sprintf("trajectory: propagator sampled t = %v, want multiples of %v", badT, h))
	}
	if err != nil {
		return nil, err
	}
	if res.Terminated {
		return nil, &StopError{Event: stop.Name, T: res.T, State: res.State}
	}
	if len(tr.r) == n { // the end was not taken as a multiple of the step
		tr.r = append(tr.r, res.State.R)
		tr.v = append(tr.v, res.State.V)
	}
	if len(tr.r) != n+1 {
		panic(fmt.Sprintf("trajectory: %d samples, want %d", len(tr.r), n+1))
	}
	return tr, nil
}

// FromSamples builds a trajectory from n+1 states at t_k = k span/n, for
// tests and for callers that have their own samples; bound is reported
// as given.
func FromSamples(span float64, r, v [][3]float64, bound Bound) (*Trajectory, error) {
	if len(r) < 2 || len(r) != len(v) || !(span > 0) || math.IsInf(span, 0) {
		return nil, fmt.Errorf("%w: %d positions, %d velocities, span %g s", ErrTrajectory, len(r), len(v), span)
	}
	n := len(r) - 1
	return &Trajectory{span: span, step: span / float64(n), n: n, r: append([][3]float64(nil), r...), v: append([][3]float64(nil), v...), bound: bound}, nil
}

// Span returns the length of the trajectory, s.
func (tr *Trajectory) Span() float64 { return tr.span }

// Step returns the sampling step, s.
func (tr *Trajectory) Step() float64 { return tr.step }

// Len returns the number of samples.
func (tr *Trajectory) Len() int { return tr.n + 1 }

// Time returns the time of sample k, s.
func (tr *Trajectory) Time(k int) float64 {
	if k == tr.n {
		return tr.span
	}
	return float64(k) * tr.step
}

// Sample returns sample k.
func (tr *Trajectory) Sample(k int) orbit.State { return orbit.State{R: tr.r[k], V: tr.v[k]} }

// Bound returns the proven bound of the interpolation error.
func (tr *Trajectory) Bound() Bound { return tr.bound }

// At returns the interpolated position (km) and velocity (km/s) at t
// (s, within [0, Span]; times beyond it by more than 1e-9 Span panic).
func (tr *Trajectory) At(t float64) (r, v [3]float64) {
	if !(t >= -1e-9*tr.span && t <= tr.span*(1+1e-9)) {
		panic(fmt.Sprintf("trajectory: time %v s outside the span [0, %v]", t, tr.span))
	}
	x := t / tr.step
	k := int(x)
	if k >= tr.n {
		k = tr.n - 1
	}
	if k < 0 {
		k = 0
	}
	h := tr.step
	s := (t - float64(k)*h) / h
	s2 := s * s
	s3 := s2 * s
	// Basis of the cubic Hermite polynomial and its derivative in s.
	h00, h10, h01, h11 := 2*s3-3*s2+1, s3-2*s2+s, -2*s3+3*s2, s3-s2
	d00, d10, d01, d11 := (6*s2-6*s)/h, 3*s2-4*s+1, (-6*s2+6*s)/h, 3*s2-2*s
	p0, p1, m0, m1 := &tr.r[k], &tr.r[k+1], &tr.v[k], &tr.v[k+1]
	for i := range 3 {
		r[i] = h00*p0[i] + h*(h10*m0[i]+h11*m1[i]) + h01*p1[i]
		v[i] = d00*p0[i] + d10*m0[i] + d01*p1[i] + d11*m1[i]
	}
	return r, v
}

// Position returns the interpolated position at t.
func (tr *Trajectory) Position(t float64) [3]float64 {
	r, _ := tr.At(t)
	return r
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm(a [3]float64) float64   { return math.Sqrt(dot(a, a)) }
func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
