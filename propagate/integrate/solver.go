package integrate

import (
	"errors"
	"fmt"
	"math"
)

// Func evaluates the right-hand side dst = dy/dt = f(t, y). It must not
// retain y or dst. A returned error stops the integration; it is wrapped in
// a [*StepError] that carries the time and state.
type Func func(dst []float64, t float64, y []float64) error

// Settings control the step-size selection. The zero value is usable: every
// field documents what zero means.
type Settings struct {
	// RelTol is the relative tolerance of the local error test
	// (dop853.f RTOL). Zero means 1e-10. Must not be below 1e-15.
	RelTol float64
	// AbsTol is the absolute tolerance, in the units of y (dop853.f
	// ATOL). Zero means RelTol. Must not be negative.
	AbsTol float64
	// RelTolVec and AbsTolVec, when not nil, give one tolerance per
	// component (dop853.f ITOL = 1) and override RelTol and AbsTol; they
	// must have the system's dimension. A zero relative tolerance makes a
	// component purely absolute (for an angle that grows without bound).
	RelTolVec, AbsTolVec []float64
	// MaxSteps bounds the number of attempted steps (accepted plus
	// rejected) in one Integrate call (dop853.f NMAX). Zero means 1,000,000.
	MaxSteps int
	// InitialStep is the magnitude of the first trial step. Zero means the
	// automatic choice of dop853.f (function HINIT).
	InitialStep float64
	// MaxStep bounds the step magnitude. Zero means |t1 - t0|.
	MaxStep float64
}

// Default values used when the corresponding Settings field is zero.
const (
	DefaultRelTol   = 1e-10
	DefaultMaxSteps = 1_000_000
)

// Step-size control parameters of dop853.f (its defaults for WORK(2..5)).
const (
	safe  = 0.9   // safety factor
	fac1  = 0.333 // smallest ratio hnew/h
	fac2  = 6.0   // largest ratio hnew/h
	beta  = 0.0   // Lund stabilisation exponent
	expo1 = 1.0/8 - beta*0.2
	facc1 = 1 / fac1
	facc2 = 1 / fac2
)

// Stats counts the work done since the last [Solver.Reset].
type Stats struct {
	Steps       int // accepted steps
	Rejected    int // rejected steps (not counted before the first acceptance, as in dop853.f)
	Evaluations int // calls of the right-hand side
}

var (
	// ErrStepSize reports that the step size fell below the resolution
	// of the time variable (dop853.f "STEP SIZE TOO SMALL"), for example
	// at a collision with a point mass.
	ErrStepSize = errors.New("integrate: step size too small")
	// ErrMaxSteps reports that Settings.MaxSteps steps did not reach the end.
	ErrMaxSteps = errors.New("integrate: maximum number of steps reached")
	// ErrSettings reports invalid settings or arguments.
	ErrSettings = errors.New("integrate: invalid settings")
	// ErrNotFinite reports a non-finite initial state or derivative.
	ErrNotFinite = errors.New("integrate: non-finite state or derivative")
)

// StepError is returned when the integration stops before its end: it
// carries the time reached, the last accepted state, the step being tried
// and the cause (one of the sentinels above or the right-hand side's error).
type StepError struct {
	T   float64   // time of the last accepted state
	Y   []float64 // last accepted state (a copy)
	H   float64   // step size being tried
	Err error
}

func (e *StepError) Error() string {
	return fmt.Sprintf("%v at t = %.17g (step %.3g, state %.10g)", e.Err, e.T, e.H, e.Y)
}

func (e *StepError) Unwrap() error { return e.Err }

// Solver integrates y' = f(t, y) with the explicit embedded Runge-Kutta
// pair of Dormand and Prince of order 8(5,3) and its continuous extension of
// order 7. A Solver holds all its scratch space: after [New] no step
// allocates. It is not safe for concurrent use.
type Solver struct {
	f          Func
	n          int
	set        Settings
	rtol, atol []float64

	t0, t, t1, dir float64
	attempts       int
	h              float64 // next trial step (signed)
	hmax           float64
	facold         float64
	reject         bool
	started        bool
	done           bool

	y  []float64     // current state
	k  [16][]float64 // stage derivatives; k[0] = f(t, y); views of kf
	kf []float64     // the 16 stages, stage j at kf[j*n : (j+1)*n]
	ys []float64     // stage state
	yn []float64     // new state

	// last accepted step, for dense output
	told, hold float64
	yold       []float64
	cont       [7][]float64
	denseReady bool
	fsalReady  bool // k[12] holds f(t, y) of the current state

	stats Stats

	// event scratch
	gPrev  []float64
	hits   []hit
	yEvent []float64
}

// New returns a solver for a system of dimension n. Settings are validated
// here; see [Settings] for the defaults.
func New(n int, f Func, s Settings) (*Solver, error) {
	if n <= 0 || f == nil {
		return nil, fmt.Errorf("%w: dimension %d, f nil: %t", ErrSettings, n, f == nil)
	}
	if s.RelTol == 0 {
		s.RelTol = DefaultRelTol
	}
	if s.AbsTol == 0 {
		s.AbsTol = s.RelTol
	}
	if s.MaxSteps == 0 {
		s.MaxSteps = DefaultMaxSteps
	}
	switch {
	case !(s.RelTol >= 1e-15) || math.IsInf(s.RelTol, 0):
		return nil, fmt.Errorf("%w: RelTol %g must be in [1e-15, inf)", ErrSettings, s.RelTol)
	case !(s.AbsTol >= 0) || math.IsInf(s.AbsTol, 0):
		return nil, fmt.Errorf("%w: AbsTol %g must be finite and non-negative", ErrSettings, s.AbsTol)
	case s.MaxSteps < 0:
		return nil, fmt.Errorf("%w: MaxSteps %d is negative", ErrSettings, s.MaxSteps)
	case !(s.InitialStep >= 0) || math.IsInf(s.InitialStep, 0):
		return nil, fmt.Errorf("%w: InitialStep %g must be finite and non-negative", ErrSettings, s.InitialStep)
	case !(s.MaxStep >= 0):
		return nil, fmt.Errorf("%w: MaxStep %g is negative", ErrSettings, s.MaxStep)
	}
	sv := &Solver{f: f, n: n, set: s}
	sv.rtol = make([]float64, n)
	sv.atol = make([]float64, n)
	for i := range n {
		sv.rtol[i], sv.atol[i] = s.RelTol, s.AbsTol
	}
	if s.RelTolVec != nil || s.AbsTolVec != nil {
		if (s.RelTolVec != nil && len(s.RelTolVec) != n) || (s.AbsTolVec != nil && len(s.AbsTolVec) != n) {
			return nil, fmt.Errorf("%w: tolerance vectors of length %d, %d for dimension %d", ErrSettings, len(s.RelTolVec), len(s.AbsTolVec), n)
		}
		if s.RelTolVec != nil {
			copy(sv.rtol, s.RelTolVec)
		}
		if s.AbsTolVec != nil {
			copy(sv.atol, s.AbsTolVec)
		}
		for i := range n {
			if !(sv.rtol[i] >= 0) || !(sv.atol[i] >= 0) || sv.rtol[i]+sv.atol[i] == 0 || math.IsInf(sv.rtol[i]+sv.atol[i], 0) {
				return nil, fmt.Errorf("%w: component %d tolerances rtol %g, atol %g", ErrSettings, i, sv.rtol[i], sv.atol[i])
			}
		}
	}
	buf := make([]float64, n*(16+3+1+7+1))
	next := func() []float64 {
		v := buf[:n:n]
		buf = buf[n:]
		return v
	}
	sv.kf = buf[: 16*n : 16*n]
	for i := range sv.k {
		sv.k[i] = next()
	}
	sv.y, sv.ys, sv.yn, sv.yold = next(), next(), next(), next()
	for i := range sv.cont {
		sv.cont[i] = next()
	}
	sv.yEvent = next()
	return sv, nil
}

// Dim returns the dimension of the system.
func (s *Solver) Dim() int { return s.n }

// Settings returns the settings in force, with defaults filled in.
func (s *Solver) Settings() Settings { return s.set }

// Stats returns the work counters since the last Reset.
func (s *Solver) Stats() Stats { return s.stats }

// T returns the time of the current state.
func (s *Solver) T() float64 { return s.t }

// Y returns the current state. The slice belongs to the solver: it is
// overwritten by the next step.
func (s *Solver) Y() []float64 { return s.y }

// Done reports whether the current state is at the end time.
func (s *Solver) Done() bool { return s.done }

// LastStep returns the interval [from, to] of the last accepted step, in
// integration order (to < from when integrating backwards).
func (s *Solver) LastStep() (from, to float64) { return s.told, s.told + s.hold }

// Reset prepares the integration from (t0, y0) to t1, which may lie before
// t0 (backward integration). It evaluates f(t0, y0) and chooses the first
// step. The counters restart from zero.
func (s *Solver) Reset(t0 float64, y0 []float64, t1 float64) error {
	if len(y0) != s.n {
		panic(fmt.Sprintf("integrate: len(y0) = %d, want %d", len(y0), s.n))
	}
	if math.IsNaN(t0) || math.IsInf(t0, 0) || math.IsNaN(t1) || math.IsInf(t1, 0) {
		return fmt.Errorf("%w: times t0 = %g, t1 = %g must be finite", ErrSettings, t0, t1)
	}
	for _, v := range y0 {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &StepError{T: t0, Y: append([]float64(nil), y0...), Err: ErrNotFinite}
		}
	}
	s.stats = Stats{}
	s.t0, s.t, s.t1 = t0, t0, t1
	s.attempts = 0
	copy(s.y, y0)
	s.dir = 1
	if t1 < t0 {
		s.dir = -1
	}
	s.hmax = s.set.MaxStep
	if s.hmax == 0 || s.hmax > math.Abs(t1-t0) {
		s.hmax = math.Abs(t1 - t0)
	}
	s.facold = 1e-4
	s.reject = false
	s.started = true
	s.done = t0 == t1
	s.denseReady = false
	s.told, s.hold = t0, 0
	copy(s.yold, y0)
	if err := s.eval(s.k[0], t0, s.y); err != nil {
		return err
	}
	copy(s.k[12], s.k[0])
	s.fsalReady = true
	if s.done {
		s.h = 0
		return nil
	}
	if s.set.InitialStep > 0 {
		s.h = s.dir * math.Min(s.set.InitialStep, s.hmax)
	} else {
		h, err := s.initialStep()
		if err != nil {
			return err
		}
		s.h = h
	}
	return nil
}

func (s *Solver) eval(dst []float64, t float64, y []float64) error {
	s.stats.Evaluations++
	if err := s.f(dst, t, y); err != nil {
		return &StepError{T: s.t, Y: append([]float64(nil), s.y...), H: s.h, Err: err}
	}
	return nil
}

// initialStep is function HINIT of dop853.f (order IORD = 8).
func (s *Solver) initialStep() (float64, error) {
	atol, rtol := s.atol, s.rtol
	f0 := s.k[0]
	var dnf, dny float64
	for i, yi := range s.y {
		sk := atol[i] + rtol[i]*math.Abs(yi)
		dnf += (f0[i] / sk) * (f0[i] / sk)
		dny += (yi / sk) * (yi / sk)
	}
	var h float64
	if dnf <= 1e-10 || dny <= 1e-10 {
		h = 1e-6
	} else {
		h = math.Sqrt(dny/dnf) * 0.01
	}
	h = math.Min(h, s.hmax) * s.dir
	y1, f1 := s.ys, s.k[1]
	for i := range y1 {
		y1[i] = s.y[i] + h*f0[i]
	}
	if err := s.eval(f1, s.t+h, y1); err != nil {
		return 0, err
	}
	var der2 float64
	for i, yi := range s.y {
		sk := atol[i] + rtol[i]*math.Abs(yi)
		d := (f1[i] - f0[i]) / sk
		der2 += d * d
	}
	der2 = math.Sqrt(der2) / math.Abs(h)
	der12 := math.Max(math.Abs(der2), math.Sqrt(dnf))
	var h1 float64
	if der12 <= 1e-15 || math.IsNaN(der12) {
		h1 = math.Max(1e-6, math.Abs(h)*1e-3)
	} else {
		h1 = math.Pow(0.01/der12, 1.0/8)
	}
	h = math.Min(math.Min(100*math.Abs(h), h1), s.hmax)
	return h * s.dir, nil
}

// Step advances the solution by one accepted step, trying as many step
// sizes as needed. After it returns nil, [Solver.Interpolate] covers the
// step just taken and [Solver.T], [Solver.Y] give its end. Step does not
// allocate.
func (s *Solver) Step() error {
	if !s.started {
		return fmt.Errorf("%w: Step before Reset", ErrSettings)
	}
	if s.done {
		return nil
	}
	n := s.n
	k := &s.k
	// FSAL: the derivative at the current state is k[12] of the last step.
	if s.fsalReady {
		copy(k[0], k[12])
		s.fsalReady = false
	}
	atol, rtol := s.atol[:n], s.rtol[:n]
	// Step-collapse threshold: dop853.f stops when 0.1|h| <= |t| uround,
	// the resolution of the time variable.
	tiny := 16 * 0x1p-52 * math.Max(math.Abs(s.t), math.Abs(s.t0))
	for {
		if s.attempts >= s.set.MaxSteps {
			return &StepError{T: s.t, Y: append([]float64(nil), s.y...), H: s.h, Err: ErrMaxSteps}
		}
		h := s.h
		if !(math.Abs(h) > tiny) {
			return &StepError{T: s.t, Y: append([]float64(nil), s.y...), H: h, Err: ErrStepSize}
		}
		s.attempts++
		last := false
		if (s.t+1.01*h-s.t1)*s.dir > 0 {
			h = s.t1 - s.t
			last = true
		}
		// stages 1..11
		y, ys := s.y[:n], s.ys[:n]
		for st := 1; st < 12; st++ {
			stage(st, ys, y, h, k)
			if err := s.eval(k[st], s.t+c[st]*h, ys); err != nil {
				return err
			}
		}
		err5, err3 := solution(s.yn[:n], y, h, k, atol, rtol)
		deno := err5 + 0.01*err3
		if deno <= 0 {
			deno = 1
		}
		errn := math.Abs(h) * err5 * math.Sqrt(1/(float64(n)*deno))
		if math.IsNaN(errn) || math.IsInf(errn, 0) {
			// a non-finite stage: shrink as much as dop853 allows
			s.h = h * fac1
			if s.stats.Steps >= 1 {
				s.stats.Rejected++
			}
			s.reject = true
			continue
		}
		fac11 := math.Sqrt(math.Sqrt(math.Sqrt(errn))) // errn^expo1, expo1 = 1/8 (beta = 0)
		fac := fac11                                   // / facold^beta, beta = 0
		fac = math.Max(facc2, math.Min(facc1, fac/safe))
		hnew := h / fac
		if errn <= 1 {
			s.facold = math.Max(errn, 1e-4)
			tn := s.t + h
			if last {
				tn = s.t1
			}
			if err := s.eval(k[12], tn, s.yn); err != nil {
				return err
			}
			s.fsalReady = true
			if math.Abs(hnew) > s.hmax {
				hnew = s.dir * s.hmax
			}
			if s.reject {
				hnew = s.dir * math.Min(math.Abs(hnew), math.Abs(h))
			}
			s.reject = false
			s.stats.Steps++
			s.told, s.hold = s.t, h
			copy(s.yold, s.y)
			copy(s.y, s.yn)
			s.t = tn
			s.h = hnew
			s.denseReady = false
			s.done = last
			return nil
		}
		hnew = h / math.Min(facc1, fac11/safe)
		s.reject = true
		if s.stats.Steps >= 1 {
			s.stats.Rejected++
		}
		s.h = hnew
	}
}

// prepareDense computes the three extra stages and the coefficients of the
// continuous extension for the last accepted step (dop853.f, "final
// preparation for dense output").
func (s *Solver) prepareDense() error {
	n, h := s.n, s.hold
	k := &s.k
	for st := 13; st < 16; st++ {
		stage(st, s.ys, s.yold, h, k)
		if err := s.eval(k[st], s.told+c[st]*h, s.ys); err != nil {
			return err
		}
	}
	for i := 0; i < n; i++ {
		dy := s.y[i] - s.yold[i]
		s.cont[0][i] = dy
		s.cont[1][i] = h*k[0][i] - dy
		s.cont[2][i] = 2*dy - h*(k[12][i]+k[0][i])
		for r := range 4 {
			var sum float64
			dr := &d[r]
			for j := 0; j < 16; j++ {
				sum += dr[j] * k[j][i]
			}
			s.cont[3+r][i] = h * sum
		}
	}
	s.denseReady = true
	return nil
}

// Interpolate writes into dst the continuous (dense) output of order 7 at
// time t, which should lie within the last accepted step (see
// [Solver.LastStep]); outside it the polynomial is extrapolated. The
// first call after a step costs three evaluations of f. Before any step it
// returns the initial state for t equal to t0.
func (s *Solver) Interpolate(dst []float64, t float64) error {
	if len(dst) != s.n {
		panic(fmt.Sprintf("integrate: len(dst) = %d, want %d", len(dst), s.n))
	}
	if s.hold == 0 {
		copy(dst, s.y)
		return nil
	}
	if !s.denseReady {
		if err := s.prepareDense(); err != nil {
			return err
		}
	}
	x := (t - s.told) / s.hold
	x1 := 1 - x
	c := &s.cont
	for i := range dst {
		v := c[6][i]
		v = c[5][i] + x*v
		v = c[4][i] + x1*v
		v = c[3][i] + x*v
		v = c[2][i] + x1*v
		v = c[1][i] + x*v
		v = c[0][i] + x1*v
		dst[i] = s.yold[i] + x*v
	}
	return nil
}
