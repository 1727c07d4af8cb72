package propagate

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate/gravity"
	"centra/propagate/integrate"
	"centra/propagate/lagrange"
)

// Stats counts the work of one propagation.
type Stats struct {
	Steps       int // accepted integration steps
	Rejected    int // rejected steps
	Evaluations int // evaluations of the equations of motion
}

// Propagator integrates orbits of one [Model] with one set of [Options].
// It keeps its scratch space between runs: after [New] a run allocates
// only a few objects at its start, never per step or per output row. It is
// not safe for concurrent use; make one per goroutine.
type Propagator struct {
	model  Model
	opt    Options
	field  gravity.Zonal
	solver *integrate.Solver
	polar  bool
	plane  lagrange.Plane
	y0, y  []float64
	sr     orbit.State // scratch for the fast path
}

// New validates the model and options and returns a propagator.
func New(m Model, opt Options) (*Propagator, error) {
	deg := m.Degree
	if deg == 1 {
		deg = 0
	}
	field, err := gravity.New(m.Mu, m.Re, m.J, deg)
	if err != nil {
		return nil, fmt.Errorf("%w: %w", ErrModel, err)
	}
	if opt.RelTol == 0 {
		opt.RelTol = DefaultRelTol
	}
	if opt.AbsTol == 0 {
		opt.AbsTol = opt.RelTol * 1e-3
	}
	if opt.MaxSteps == 0 {
		opt.MaxSteps = DefaultMaxSteps
	}
	if opt.EventTol == 0 {
		opt.EventTol = DefaultEventTol
	}
	switch {
	case !(opt.RelTol >= 1e-15 && opt.RelTol <= 1e-3):
		return nil, fmt.Errorf("%w: RelTol %g, want 1e-15..1e-3", ErrOptions, opt.RelTol)
	case !(opt.AbsTol > 0) || math.IsInf(opt.AbsTol, 0):
		return nil, fmt.Errorf("%w: AbsTol %g, want finite and positive", ErrOptions, opt.AbsTol)
	case opt.MaxSteps < 0:
		return nil, fmt.Errorf("%w: MaxSteps %d is negative", ErrOptions, opt.MaxSteps)
	case !(opt.EventTol > 0) || math.IsInf(opt.EventTol, 0):
		return nil, fmt.Errorf("%w: EventTol %g s, want finite and positive", ErrOptions, opt.EventTol)
	}
	p := &Propagator{model: m, opt: opt, field: field}
	var f integrate.Func
	n := 6
	switch opt.Equations {
	case FastPath:
		switch {
		case m.Perturbation != nil || deg > 2:
			f = p.fast
		case deg == 2:
			f = p.fastJ2
		default:
			f = p.fastPoint
		}
	case Engine:
		l, err := lagrange.ZonalCartesian(m.Mu, m.Re, m.J, deg)
		if err != nil {
			return nil, fmt.Errorf("%w: %w", ErrModel, err)
		}
		var force lagrange.Force
		if m.Perturbation != nil {
			force = func(dst []float64, t float64, q, qd []float64) error {
				a, err := m.Perturbation(t, orbit.State{R: [3]float64{q[0], q[1], q[2]}, V: [3]float64{qd[0], qd[1], qd[2]}})
				copy(dst, a[:])
				return err
			}
		}
		sys, err := lagrange.New(3, l, force)
		if err != nil {
			return nil, fmt.Errorf("%w: %w", ErrModel, err)
		}
		f = sys.Derivative
	case EnginePolar:
		if deg >= 2 || m.Perturbation != nil {
			return nil, fmt.Errorf("%w: polar equations carry a point mass without perturbation only (degree %d)", ErrModel, m.Degree)
		}
		l, err := lagrange.PointMassPolar(m.Mu)
		if err != nil {
			return nil, fmt.Errorf("%w: %w", ErrModel, err)
		}
		sys, _ := lagrange.New(2, l, nil)
		f = sys.Derivative
		n = 4
		p.polar = true
	default:
		return nil, fmt.Errorf("%w: unknown equations %d", ErrOptions, int(opt.Equations))
	}
	set := integrate.Settings{RelTol: opt.RelTol, AbsTol: opt.AbsTol, MaxSteps: opt.MaxSteps}
	if p.polar {
		// theta grows by 2 pi per orbit: hold it to RelTol in absolute
		// terms (a position error of r RelTol), not relative to its size
		set.RelTolVec = []float64{opt.RelTol, 0, opt.RelTol, opt.RelTol}
		set.AbsTolVec = []float64{opt.AbsTol, opt.RelTol, opt.AbsTol, opt.AbsTol}
	}
	p.solver, err = integrate.New(n, f, set)
	if err != nil {
		return nil, fmt.Errorf("%w: %w", ErrOptions, err)
	}
	p.y0 = make([]float64, n)
	p.y = make([]float64, n)
	return p, nil
}

// Model returns the model of the propagator.
func (p *Propagator) Model() Model { return p.model }

// Options returns the options in force, with defaults filled in.
func (p *Propagator) Options() Options { return p.opt }

// Field returns the gravity field of the model (point mass and zonals).
func (p *Propagator) Field() gravity.Zonal { return p.field }

// Energy returns the specific mechanical energy v^2/2 + U(r) of s in the
// model's gravity field (km^2/s^2), the integral conserved without
// perturbation.
func (p *Propagator) Energy(s orbit.State) float64 {
	return (s.V[0]*s.V[0]+s.V[1]*s.V[1]+s.V[2]*s.V[2])/2 + p.field.Potential(s.R)
}

// fast is the right-hand side of the fast path: y = (r, v), dst = (v, a).
func (p *Propagator) fast(dst []float64, t float64, y []float64) error {
	a := p.field.Acceleration([3]float64{y[0], y[1], y[2]})
	if p.model.Perturbation != nil {
		s := &p.sr
		s.R = [3]float64{y[0], y[1], y[2]}
		s.V = [3]float64{y[3], y[4], y[5]}
		ap, err := p.model.Perturbation(t, *s)
		if err != nil {
			return err
		}
		a[0] += ap[0]
		a[1] += ap[1]
		a[2] += ap[2]
	}
	dst[0], dst[1], dst[2] = y[3], y[4], y[5]
	dst[3], dst[4], dst[5] = a[0], a[1], a[2]
	return nil
}

// fastPoint is fast for a point mass without perturbation, written out so
// that the whole right-hand side is one call with no bounds checks after
// the first (the commonest model and the one compared with other tools).
func (p *Propagator) fastPoint(dst []float64, _ float64, y []float64) error {
	y, dst = y[:6], dst[:6]
	x, yy, z := y[0], y[1], y[2]
	r2 := x*x + yy*yy + z*z
	k := -p.field.Mu / (r2 * math.Sqrt(r2))
	dst[0], dst[1], dst[2] = y[3], y[4], y[5]
	dst[3], dst[4], dst[5] = k*x, k*yy, k*z
	return nil
}

// fastJ2 is fast for the field to degree 2 without perturbation; the
// arithmetic is that of gravity.Zonal.Acceleration (TestFastPathsAgree).
func (p *Propagator) fastJ2(dst []float64, _ float64, y []float64) error {
	y, dst = y[:6], dst[:6]
	x, yy, z := y[0], y[1], y[2]
	r2 := x*x + yy*yy + z*z
	rn := math.Sqrt(r2)
	inv2 := 1 / r2
	k := -p.field.Mu * inv2 / rn
	s2 := z * z * inv2
	q := p.field.J[2] * p.field.Re * p.field.Re * inv2
	kr := k * (1 - 1.5*q*(5*s2-1))
	kz := k * (1 - 1.5*q*(5*s2-3))
	dst[0], dst[1], dst[2] = y[3], y[4], y[5]
	dst[3], dst[4], dst[5] = kr*x, kr*yy, kz*z
	return nil
}

// encode writes the integration variables of s into y (setting the orbit
// plane for polar equations).
func (p *Propagator) encode(y []float64, s orbit.State) error {
	if p.polar {
		pl, pc, err := lagrange.ToPolar(s)
		if err != nil {
			return fmt.Errorf("%w: %w", ErrState, err)
		}
		p.plane = pl
		y[0], y[1], y[2], y[3] = pc.R, pc.Theta, pc.RDot, pc.ThetaDot
		return nil
	}
	copy(y[:3], s.R[:])
	copy(y[3:], s.V[:])
	return nil
}

// decode returns the inertial state of the integration variables y.
func (p *Propagator) decode(y []float64) orbit.State {
	if p.polar {
		return p.plane.State(lagrange.Polar{R: y[0], Theta: y[1], RDot: y[2], ThetaDot: y[3]})
	}
	return orbit.State{R: [3]float64{y[0], y[1], y[2]}, V: [3]float64{y[3], y[4], y[5]}}
}

// Output says what a run reports while it integrates. The zero value (or
// nil) reports nothing but the final state.
type Output struct {
	// Step is the fixed output step in s (positive; its sign is taken
	// from the span). States are produced at t = 0, ±Step, ±2 Step, ...
	// within the span, from the 7th-order dense output: the integration
	// steps are never shortened for output and nothing is stored. The end
	// of the span is included when it is a multiple of Step. Zero means no
	// fixed-step output.
	Step float64
	// OnState receives each fixed-step state; t is in s from the initial
	// state. A returned error stops the run and is returned unchanged.
	OnState func(t float64, s orbit.State) error
	// Events are located on the dense output during the run. Each step
	// is searched in pieces of at most an eighth of the initial conic's
	// period 2 pi sqrt(|a|^3/mu), so events at least that far apart are
	// all found.
	Events []Event
	// OnEvent receives the events in time order, interleaved with the
	// states. A returned error stops the run and is returned unchanged.
	OnEvent func(h EventHit) error
}

// Result is the outcome of a run.
type Result struct {
	T          float64     // time reached, s from the initial state: the span, or a terminal event's time
	State      orbit.State // state at T
	Terminated bool        // a terminal event stopped the run
	Stats      Stats
}

// Propagate returns the state span seconds after s (before it for a
// negative span).
func (p *Propagator) Propagate(s orbit.State, span float64) (orbit.State, error) {
	r, err := p.Run(s, span, nil)
	return r.State, err
}

// Run integrates from s over span seconds (negative: backwards in time),
// streaming states and events to out (which may be nil).
func (p *Propagator) Run(s orbit.State, span float64, out *Output) (Result, error) {
	if !finiteState(s) {
		return Result{}, fmt.Errorf("%w: non-finite component in %v", ErrState, s)
	}
	if s.R == [3]float64{} {
		return Result{}, fmt.Errorf("%w: position at the centre of the body", ErrState)
	}
	if math.IsNaN(span) || math.IsInf(span, 0) {
		return Result{}, fmt.Errorf("%w: span %g s", ErrSpan, span)
	}
	if out == nil {
		out = &Output{}
	}
	if !(out.Step >= 0) || math.IsInf(out.Step, 0) {
		return Result{}, fmt.Errorf("%w: output step %g s, want finite and non-negative", ErrSpan, out.Step)
	}
	if err := p.encode(p.y0, s); err != nil {
		return Result{}, err
	}
	obs := &integrate.Observer{EventTol: p.opt.EventTol, MaxCheck: checkInterval(p.model.Mu, s)}
	terminated := false
	if out.Step > 0 && out.OnState != nil {
		obs.Step = out.Step
		onState := out.OnState
		obs.Sample = func(t float64, y []float64) error { return onState(t, p.decode(y)) }
	}
	if len(out.Events) > 0 {
		evs, err := p.events(out.Events)
		if err != nil {
			return Result{}, err
		}
		obs.Events = evs
		onEvent := out.OnEvent
		list := out.Events
		obs.OnEvent = func(h integrate.Hit) error {
			ev := list[h.Index]
			if ev.Terminal {
				terminated = true
			}
			if onEvent == nil {
				return nil
			}
			return onEvent(EventHit{Index: h.Index, Name: ev.name(), Kind: ev.Kind, T: h.T, State: p.decode(h.Y), Direction: h.Direction})
		}
	}
	tEnd, err := p.solver.Integrate(p.y, 0, p.y0, span, obs)
	st := p.solver.Stats()
	res := Result{T: tEnd, State: p.decode(p.y), Stats: Stats{Steps: st.Steps, Rejected: st.Rejected, Evaluations: st.Evaluations}}
	res.Terminated = err == nil && terminated
	if err != nil {
		var se *integrate.StepError
		if errors.As(err, &se) {
			res.State = s
			if len(se.Y) == len(p.y) {
				res.State = p.decode(se.Y)
			}
			res.T = se.T
			return res, &StepError{T: se.T, State: res.State, Err: se.Err}
		}
		return res, err
	}
	return res, nil
}

// checkInterval returns the longest interval over which event functions
// are searched for one sign change: an eighth of 2 pi sqrt(|a|^3/mu) for
// the osculating conic of s (the semi-latus rectum for a parabola).
func checkInterval(mu float64, s orbit.State) float64 {
	r := norm3(s.R)
	v2 := dot3(s.V, s.V)
	a := math.Abs(1 / (2/r - v2/mu))
	if math.IsInf(a, 0) || math.IsNaN(a) || a == 0 {
		h := norm3(cross3(s.R, s.V))
		a = math.Max(h*h/mu, r)
	}
	return 2 * math.Pi * math.Sqrt(a*a*a/mu) / 8
}
