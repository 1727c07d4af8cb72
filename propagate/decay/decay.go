package decay

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
)

// Method selects how the lifetime is computed.
type Method int

const (
	// Averaged integrates orbit-averaged rates of the mean elements.
	Averaged Method = iota
	// Full integrates the equations of motion.
	Full
)

func (m Method) String() string {
	switch m {
	case Averaged:
		return "averaged"
	case Full:
		return "full"
	}
	return fmt.Sprintf("Method(%d)", int(m))
}

// Defaults used when the corresponding Config field is zero.
const (
	DefaultReentryAltitude = 100.0                 // km
	DefaultMaxSpan         = 30 * 365.25 * 86400.0 // s, 30 Julian years
	// AveragedRelTol is the relative tolerance of the integration of the
	// averaged rates. The lifetime it gives changes by less than 1e-5
	// when the tolerance is tightened a hundredfold (tested).
	AveragedRelTol = 1e-8
)

// ErrConfig reports an unusable configuration.
var ErrConfig = errors.New("decay: invalid configuration")

// Config describes a lifetime computation.
type Config struct {
	// Gravity is the gravity model: Mu, Re and the zonal coefficients.
	// Full propagates with it; Averaged takes Mu, Re, J2 and J3 from it.
	// Its Perturbation must be nil (give Drag and Extra instead).
	Gravity propagate.Model
	// Drag is the drag force; required.
	Drag *forces.Drag
	// Extra holds further perturbations (third bodies, radiation
	// pressure), added by Full and ignored by Averaged; may be nil.
	Extra propagate.Perturbation
	// ReentryAltitude is the geodetic height in km below which the
	// satellite is taken to have reentered; zero means 100 km. It must
	// lie in [60, 200] km. (Below about 120 km an orbit decays within a
	// revolution, so the lifetime hardly depends on the choice.)
	ReentryAltitude float64
	// MaxSpan is the longest time computed, in s; zero means 30 years.
	MaxSpan float64
	// Method selects Averaged (the zero value) or Full.
	Method Method
	// Options are the integrator options of Full (zero: the defaults of
	// package propagate, with MaxSteps raised so that MaxSpan is reached).
	Options propagate.Options
	// HistoryStep, when positive, is the interval in s of Result.History.
	HistoryStep float64
	// Progress, when not nil, is called now and then with the time reached
	// and the mean perigee altitude in km: every HistoryStep when that is
	// set, otherwise every 1% of MaxSpan (Averaged) or every day (Full).
	Progress func(t, perigeeAltKm float64)
}

// Sample is one point of the decay history.
type Sample struct {
	T            float64 // s from the initial state
	PerigeeAltKm float64 // mean a(1-e) minus the equatorial radius
	ApogeeAltKm  float64 // mean a(1+e) minus the equatorial radius
}

// Result is the outcome of a lifetime computation.
type Result struct {
	// Reentered is true when the reentry altitude was reached within
	// MaxSpan.
	Reentered bool
	// T is the time of reentry, or MaxSpan, in s from the initial state.
	T float64
	// Initial and Final are the mean elements at the start and at T
	// (first-order J2 theory, [orbit.OsculatingToMean]).
	Initial, Final orbit.Elements
	// Steps counts the integration steps.
	Steps int
	// History holds samples every Config.HistoryStep, and the last state.
	History []Sample
	// Method is the method used.
	Method Method
}

// validate fills the defaults of c.
func (c *Config) validate() error {
	switch {
	case c.Drag == nil:
		return fmt.Errorf("%w: no drag force", ErrConfig)
	case c.Gravity.Perturbation != nil:
		return fmt.Errorf("%w: give perturbations as Drag and Extra, not in Gravity", ErrConfig)
	case !(c.Gravity.Mu > 0) || math.IsInf(c.Gravity.Mu, 0):
		return fmt.Errorf("%w: gravitational parameter %g km^3/s^2", ErrConfig, c.Gravity.Mu)
	case !(c.Gravity.Re > 0) || math.IsInf(c.Gravity.Re, 0):
		return fmt.Errorf("%w: the lifetime needs the body's radius (Gravity.Re), got %g km", ErrConfig, c.Gravity.Re)
	case c.Method != Averaged && c.Method != Full:
		return fmt.Errorf("%w: unknown method %d", ErrConfig, int(c.Method))
	}
	if c.ReentryAltitude == 0 {
		c.ReentryAltitude = DefaultReentryAltitude
	}
	if !(c.ReentryAltitude >= 60 && c.ReentryAltitude <= 200) {
		return fmt.Errorf("%w: reentry altitude %g km outside 60..200 km", ErrConfig, c.ReentryAltitude)
	}
	if c.MaxSpan == 0 {
		c.MaxSpan = DefaultMaxSpan
	}
	if !(c.MaxSpan > 0) || c.MaxSpan > 200*365.25*86400 {
		return fmt.Errorf("%w: maximum span %g s outside (0, 200 years]", ErrConfig, c.MaxSpan)
	}
	if !(c.HistoryStep >= 0) || math.IsInf(c.HistoryStep, 0) {
		return fmt.Errorf("%w: history step %g s", ErrConfig, c.HistoryStep)
	}
	return nil
}

// j returns J_n of the gravity model (0 when absent).
func (c *Config) j(n int) float64 {
	if n < len(c.Gravity.J) && n <= c.Gravity.Degree {
		return c.Gravity.J[n]
	}
	return 0
}

// ErrBelowReentry reports an initial state already below the reentry
// altitude.
var ErrBelowReentry = errors.New("decay: the orbit starts below the reentry altitude")

// Lifetime computes the time until the orbit starting at s0 (osculating,
// GCRF) falls below the reentry altitude.
func Lifetime(c Config, s0 orbit.State) (Result, error) {
	if err := c.validate(); err != nil {
		return Result{}, err
	}
	osc, err := orbit.ElementsFromState(c.Gravity.Mu, s0)
	if err != nil {
		return Result{}, fmt.Errorf("%w: %w", propagate.ErrState, err)
	}
	if osc.E >= 1 {
		return Result{}, fmt.Errorf("%w: the orbit is open (e = %g): it never decays", propagate.ErrState, osc.E)
	}
	mean, err := orbit.OsculatingToMean(c.Gravity.Mu, c.Gravity.Re, c.j(2), osc)
	if err != nil {
		return Result{}, fmt.Errorf("%w: %w", propagate.ErrState, err)
	}
	if h := c.Drag.Height(s0.R); h < c.ReentryAltitude {
		return Result{}, fmt.Errorf("%w: height %.3f km, reentry altitude %g km", ErrBelowReentry, h, c.ReentryAltitude)
	}
	if c.Method == Full {
		return full(&c, s0, mean)
	}
	return averaged(&c, mean)
}

// sampleOf returns the history sample of mean elements el at t.
func sampleOf(re float64, t float64, el orbit.Elements) Sample {
	a := el.A
	return Sample{T: t, PerigeeAltKm: a*(1-el.E) - re, ApogeeAltKm: a*(1+el.E) - re}
}

// full integrates the equations of motion.
func full(c *Config, s0 orbit.State, mean0 orbit.Elements) (Result, error) {
	m := c.Gravity
	m.Perturbation = forces.Combine(c.Drag.Perturbation(), c.Extra)
	opt := c.Options
	if opt.MaxSteps == 0 {
		opt.MaxSteps = 1 << 40
	}
	p, err := propagate.New(m, opt)
	if err != nil {
		return Result{}, err
	}
	res := Result{Initial: mean0, Method: Full}
	drag := c.Drag
	hr := c.ReentryAltitude
	out := &propagate.Output{
		Events: []propagate.Event{{Name: "reentry", Kind: propagate.Custom, Direction: -1, Terminal: true,
			G: func(_ float64, s orbit.State) float64 { return drag.Height(s.R) - hr }}},
	}
	step := c.HistoryStep
	if c.Progress != nil && step == 0 {
		step = 86400
	}
	nextHistory := 0.0
	if step > 0 {
		out.Step = step
		out.OnState = func(t float64, s orbit.State) error {
			el, err := orbit.ElementsFromState(m.Mu, s)
			if err != nil || el.E >= 1 {
				return nil // a sample that is no orbit is not recorded
			}
			mean, err := orbit.OsculatingToMean(m.Mu, m.Re, c.j(2), el)
			if err != nil {
				return nil
			}
			smp := sampleOf(m.Re, t, mean)
			if c.HistoryStep > 0 && t >= nextHistory-1e-6 {
				res.History = append(res.History, smp)
				nextHistory += c.HistoryStep
			}
			if c.Progress != nil {
				c.Progress(t, smp.PerigeeAltKm)
			}
			return nil
		}
	}
	r, err := p.Run(s0, c.MaxSpan, out)
	res.Steps = r.Stats.Steps
	if err != nil {
		return res, err
	}
	res.T, res.Reentered = r.T, r.Terminated
	final, err := orbit.ElementsFromState(m.Mu, r.State)
	if err == nil && final.E < 1 {
		if fm, err := orbit.OsculatingToMean(m.Mu, m.Re, c.j(2), final); err == nil {
			res.Final = fm
		} else {
			res.Final = final
		}
	}
	if c.HistoryStep > 0 && res.Final.A > 0 {
		res.History = append(res.History, sampleOf(m.Re, res.T, res.Final))
	}
	return res, nil
}
