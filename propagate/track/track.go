package track

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
)

// MaxSamples bounds the samples of one trajectory: a picture gains
// nothing from more, and memory stays below about 60 MB.
const MaxSamples = 1_000_000

var (
	// ErrSamples reports a span and step that give more than MaxSamples
	// samples, or a step that is not positive and finite.
	ErrSamples = errors.New("track: too many samples or invalid step")
	// ErrGeometry reports a visibility geometry that does not exist (an
	// altitude or elevation outside the domain of the central angle).
	ErrGeometry = errors.New("track: invalid geometry")
)

// Apsis is a located periapsis or apoapsis (a zero of the radial
// velocity on the dense output, to propagate.Options.EventTol).
type Apsis struct {
	T         float64     // s from the initial state
	Periapsis bool        // true at a periapsis, false at an apoapsis
	State     orbit.State // km, km/s
}

// Trajectory is a propagation sampled at a fixed step.
type Trajectory struct {
	T       []float64     // s from the initial state: 0, ±step, ±2 step, ...
	States  []orbit.State // km, km/s, inertial
	Apsides []Apsis       // in time order
}

// Propagate runs p from s0 over span seconds (negative: backwards),
// keeping the states at t = 0, ±step, ... and every periapsis and
// apoapsis. A span that is not a multiple of step also keeps the state
// at the end of the span, so the trajectory covers the whole span.
func Propagate(p *propagate.Propagator, s0 orbit.State, span, step float64) (*Trajectory, error) {
	return PropagateUntil(p, s0, span, step, nil)
}

// PropagateUntil is Propagate with a stop event (for example the entry
// into the body's surface), located during the run: if it occurs, the
// result is a [*trajectory.StopError] instead of a trajectory. A nil stop
// is Propagate.
func PropagateUntil(p *propagate.Propagator, s0 orbit.State, span, step float64, stop *propagate.Event) (*Trajectory, error) {
	if !(step > 0) || math.IsInf(step, 0) || math.IsNaN(span) || math.IsInf(span, 0) {
		return nil, fmt.Errorf("%w: span %g s, step %g s", ErrSamples, span, step)
	}
	n := math.Abs(span)/step + 2
	if n > MaxSamples {
		return nil, fmt.Errorf("%w: span %g s at step %g s gives %.3g samples, more than %d", ErrSamples, span, step, n, MaxSamples)
	}
	tr := &Trajectory{T: make([]float64, 0, int(n)), States: make([]orbit.State, 0, int(n))}
	out := &propagate.Output{
		Step: step,
		OnState: func(t float64, s orbit.State) error {
			tr.T = append(tr.T, t)
			tr.States = append(tr.States, s)
			return nil
		},
		Events: []propagate.Event{{Kind: propagate.Periapsis}, {Kind: propagate.Apoapsis}},
		OnEvent: func(h propagate.EventHit) error {
			if h.Kind == propagate.Periapsis || h.Kind == propagate.Apoapsis {
				tr.Apsides = append(tr.Apsides, Apsis{T: h.T, Periapsis: h.Kind == propagate.Periapsis, State: h.State})
			}
			return nil
		},
	}
	if stop != nil {
		ev := *stop
		ev.Terminal = true
		out.Events = append(out.Events, ev)
	}
	res, err := p.Run(s0, span, out)
	if err != nil {
		return nil, err
	}
	if res.Terminated {
		return nil, &trajectory.StopError{Event: stop.Name, T: res.T, State: res.State}
	}
	if len(tr.T) == 0 || math.Abs(res.T-tr.T[len(tr.T)-1]) > 1e-9*math.Max(1, math.Abs(res.T)) {
		tr.T = append(tr.T, res.T)
		tr.States = append(tr.States, res.State)
	}
	return tr, nil
}

// Sample is the altitude and speed of one state.
type Sample struct {
	T     float64 // s from the initial state
	Alt   float64 // km above the sphere of radius Re (|r| - Re)
	Speed float64 // km/s, inertial
}

// SampleApsis is a Sample at a located apsis.
type SampleApsis struct {
	Sample
	Periapsis bool // true at a periapsis, false at an apoapsis
}

// Profile returns the altitude above the sphere of radius re and the
// inertial speed of each sample, and the same at each apsis.
func (tr *Trajectory) Profile(re float64) (samples []Sample, apsides []SampleApsis) {
	samples = make([]Sample, len(tr.T))
	for i, s := range tr.States {
		samples[i] = Sample{T: tr.T[i], Alt: norm(s.R) - re, Speed: norm(s.V)}
	}
	apsides = make([]SampleApsis, len(tr.Apsides))
	for i, a := range tr.Apsides {
		apsides[i] = SampleApsis{Sample{T: a.T, Alt: norm(a.State.R) - re, Speed: norm(a.State.V)}, a.Periapsis}
	}
	return samples, apsides
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm(a [3]float64) float64   { return math.Sqrt(dot(a, a)) }
func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
