package integrate

import (
	"fmt"
	"math"
)

// Event describes a scalar function g(t, y) whose sign changes are located
// on the dense output.
type Event struct {
	// G is the event function. It must not retain y.
	G func(t float64, y []float64) float64
	// Direction filters crossings by the sense in which g changes as time
	// increases (whatever the direction of integration): +1 only rising
	// (negative to positive), -1 only falling, 0 both.
	Direction int
	// Terminal stops the integration at the first crossing that passes
	// the filter.
	Terminal bool
}

// Hit is one located event.
type Hit struct {
	Index     int       // index of the event in Observer.Events
	T         float64   // time of the crossing
	Y         []float64 // state at T from the dense output; valid only during the callback
	Direction int       // +1 rising, -1 falling (in increasing time)
}

// DefaultEventTol is the absolute time tolerance of event location used
// when Observer.EventTol is zero, in the units of t.
const DefaultEventTol = 1e-11

// Observer receives the solution while [Solver.Integrate] runs. The zero
// value observes nothing.
type Observer struct {
	// Step is the magnitude of the fixed output step: Sample is called at
	// t0, t0 ± Step, t0 ± 2 Step, ... up to and including t1 when |t1-t0|
	// is a multiple of Step (within 1e-9 Step), from the dense output; the
	// integration steps are never shortened for output. Zero means no
	// fixed-step output.
	Step float64
	// Sample receives fixed-step states; y is valid only during the call.
	// A returned error stops the integration and is returned unchanged.
	Sample func(t float64, y []float64) error
	// Events are located to EventTol on the dense output after every step.
	// Two crossings of one function within a single step (or MaxCheck
	// piece) cancel and are not seen.
	Events []Event
	// OnEvent receives every hit, in time order with the samples. A
	// returned error stops the integration and is returned unchanged.
	OnEvent func(h Hit) error
	// MaxCheck, when positive, is the longest interval over which an event
	// function is assumed to change sign at most once: longer steps are
	// cut, on the dense output, into pieces no longer than MaxCheck, and
	// each piece is searched. Zero means one piece per step.
	MaxCheck float64
	// EventTol is the absolute tolerance of event times. Zero means
	// DefaultEventTol; it is raised to 4 ulp of t when t is large.
	EventTol float64
}

type hit struct {
	index int
	t     float64
	dir   int
}

// Integrate integrates from (t0, y0) to t1 (t1 < t0 integrates backwards),
// feeds obs (which may be nil) and writes the final state into dst. It
// returns the final time: t1, or the time of a terminal event. Integrate
// does not allocate per step.
func (s *Solver) Integrate(dst []float64, t0 float64, y0 []float64, t1 float64, obs *Observer) (float64, error) {
	if len(dst) != s.n {
		panic(fmt.Sprintf("integrate: len(dst) = %d, want %d", len(dst), s.n))
	}
	if obs == nil {
		obs = &Observer{}
	}
	if !(obs.Step >= 0) || math.IsInf(obs.Step, 0) {
		return t0, fmt.Errorf("%w: output step %g must be finite and non-negative", ErrSettings, obs.Step)
	}
	if !(obs.EventTol >= 0) || math.IsInf(obs.EventTol, 0) {
		return t0, fmt.Errorf("%w: EventTol %g must be finite and non-negative", ErrSettings, obs.EventTol)
	}
	if !(obs.MaxCheck >= 0) || math.IsInf(obs.MaxCheck, 0) {
		return t0, fmt.Errorf("%w: MaxCheck %g must be finite and non-negative", ErrSettings, obs.MaxCheck)
	}
	for i, ev := range obs.Events {
		if ev.G == nil {
			return t0, fmt.Errorf("%w: event %d has no function", ErrSettings, i)
		}
	}
	if err := s.Reset(t0, y0, t1); err != nil {
		return t0, err
	}
	tol := obs.EventTol
	if tol == 0 {
		tol = DefaultEventTol
	}
	ne := len(obs.Events)
	if cap(s.gPrev) < ne {
		s.gPrev = make([]float64, ne)
		s.hits = make([]hit, 0, 4*ne)
	}
	gPrev := s.gPrev[:ne]
	for i, ev := range obs.Events {
		gPrev[i] = ev.G(t0, s.y)
	}
	span := math.Abs(t1 - t0)
	sampling := obs.Step > 0 && obs.Sample != nil
	var nSamples int64 // number of samples inside the span
	if sampling {
		nSamples = int64(math.Floor(span/obs.Step + 1e-9))
		if err := obs.Sample(t0, s.y); err != nil {
			return t0, err
		}
	}
	kNext := int64(1)
	sampleTime := func(k int64) float64 {
		if k == nSamples && math.Abs(float64(k)*obs.Step-span) <= 1e-9*obs.Step {
			return t1
		}
		return t0 + s.dir*float64(k)*obs.Step
	}
	// emit writes the samples strictly before (or at, when inclusive) tEnd.
	emit := func(tEnd float64, inclusive bool) error {
		for sampling && kNext <= nSamples {
			tk := sampleTime(kNext)
			dt := s.dir * (tk - tEnd)
			if dt > 0 || (dt == 0 && !inclusive) {
				return nil
			}
			var y []float64
			if tk == s.t {
				y = s.y
			} else {
				if err := s.Interpolate(s.yEvent, tk); err != nil {
					return err
				}
				y = s.yEvent
			}
			if err := obs.Sample(tk, y); err != nil {
				return err
			}
			kNext++
		}
		return nil
	}
	for !s.done {
		if err := s.Step(); err != nil {
			return s.t, err
		}
		ta, tb := s.told, s.t
		hits := s.hits[:0]
		pieces := 1
		if obs.MaxCheck > 0 && math.Abs(tb-ta) > obs.MaxCheck {
			pieces = int(math.Min(math.Ceil(math.Abs(tb-ta)/obs.MaxCheck), 1e6))
		}
		for i, ev := range obs.Events {
			tA, gA := ta, gPrev[i]
			for k := 1; k <= pieces; k++ {
				tB := tb
				var gB float64
				if k < pieces {
					tB = ta + (tb-ta)*float64(k)/float64(pieces)
					if err := s.Interpolate(s.yEvent, tB); err != nil {
						return s.t, err
					}
					gB = ev.G(tB, s.yEvent)
				} else {
					gB = ev.G(tb, s.y)
				}
				ga, tSeg := gA, tA
				tA, gA = tB, gB
				if ga == 0 || !(ga*gB <= 0) {
					continue
				}
				// sense in increasing time
				dir := 1
				if (ga > 0) == (s.dir > 0) {
					dir = -1
				}
				if ev.Direction != 0 && ev.Direction != dir {
					continue
				}
				th, err := s.locate(ev.G, tSeg, tB, ga, gB, tol)
				if err != nil {
					return s.t, err
				}
				hits = append(hits, hit{index: i, t: th, dir: dir})
			}
			gPrev[i] = gA
		}
		s.hits = hits[:0]
		// order the hits along the integration (insertion sort: few hits)
		for i := 1; i < len(hits); i++ {
			for j := i; j > 0 && s.dir*(hits[j].t-hits[j-1].t) < 0; j-- {
				hits[j], hits[j-1] = hits[j-1], hits[j]
			}
		}
		for _, h := range hits {
			if err := emit(h.t, true); err != nil {
				return s.t, err
			}
			if err := s.Interpolate(s.yEvent, h.t); err != nil {
				return s.t, err
			}
			if obs.OnEvent != nil {
				if err := obs.OnEvent(Hit{Index: h.index, T: h.t, Y: s.yEvent, Direction: h.dir}); err != nil {
					return s.t, err
				}
			}
			if obs.Events[h.index].Terminal {
				if err := s.Interpolate(dst, h.t); err != nil {
					return s.t, err
				}
				return h.t, nil
			}
		}
		if err := emit(tb, true); err != nil {
			return s.t, err
		}
	}
	copy(dst, s.y)
	return s.t, nil
}

// locate finds the root of g(t, y(t)) on the dense output of the last step
// between ta and tb, where g changes sign (ga, gb), with Brent's method
// (R. P. Brent, Algorithms for Minimization without Derivatives, 1973,
// chapter 4, procedure zero). It returns a time within tol of the root of
// the interpolated function, on the side of the bracket reached last.
func (s *Solver) locate(g func(float64, []float64) float64, ta, tb, ga, gb, tol float64) (float64, error) {
	if gb == 0 {
		return tb, nil
	}
	y := s.yEvent
	eval := func(t float64) (float64, error) {
		if err := s.Interpolate(y, t); err != nil {
			return 0, err
		}
		return g(t, y), nil
	}
	const eps = 0x1p-52
	a, b, fa, fb := ta, tb, ga, gb
	c, fc := b, fb
	var d, e float64
	for iter := 0; iter < 200; iter++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol1 := 2*eps*math.Abs(b) + 0.5*tol
		xm := 0.5 * (c - b)
		if math.Abs(xm) <= tol1 || fb == 0 {
			return b, nil
		}
		if math.Abs(e) >= tol1 && math.Abs(fa) > math.Abs(fb) {
			var p, q, r float64
			sr := fb / fa
			if a == c {
				p = 2 * xm * sr
				q = 1 - sr
			} else {
				q = fa / fc
				r = fb / fc
				p = sr * (2*xm*q*(q-r) - (b-a)*(r-1))
				q = (q - 1) * (r - 1) * (sr - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			if 2*p < math.Min(3*xm*q-math.Abs(tol1*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = xm
				e = d
			}
		} else {
			d = xm
			e = d
		}
		a, fa = b, fb
		if math.Abs(d) > tol1 {
			b += d
		} else {
			b += math.Copysign(tol1, xm)
		}
		var err error
		if fb, err = eval(b); err != nil {
			return b, err
		}
	}
	return b, nil
}
