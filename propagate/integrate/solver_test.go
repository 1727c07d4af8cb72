package integrate

import (
	"errors"
	"math"
	"testing"
)

// TestCoefficientOrderConditions checks the copied coefficients
// against the Runge-Kutta order conditions (Hairer, Norsett & Wanner,
// Solving ODEs I, 2nd ed., Section II.2, Table 2.2 and Theorem 2.13): they
// hold exactly in rational arithmetic, so the residual is rounding only.
func TestCoefficientOrderConditions(t *testing.T) {
	const tol = 2e-14 // relative to the largest term of each sum (30-digit constants, float64 sums)
	check := func(name string, terms []float64, want float64) {
		t.Helper()
		var sum, big float64
		for _, v := range terms {
			sum += v
			big = math.Max(big, math.Abs(v))
		}
		big = math.Max(big, math.Abs(want))
		if math.Abs(sum-want) > tol*big {
			t.Errorf("%s = %.17g, want %.17g (residual %.3g, scale %.3g)", name, sum, want, sum-want, big)
		}
	}
	// Row sums: c_i = sum_j a_ij for every stage, including the FSAL row
	// and the three dense-output stages.
	for i := 1; i < 16; i++ {
		check("row sum "+itoa(i), a[i][:i], c[i])
	}
	b := a[12][:12]
	pow := func(x float64, k int) float64 { return math.Pow(x, float64(k)) }
	// Bushy trees: sum b_i c_i^(k-1) = 1/k, k = 1..8.
	for k := 1; k <= 8; k++ {
		var terms []float64
		for i := range b {
			terms = append(terms, b[i]*pow(c[i], k-1))
		}
		check("sum b c^"+itoa(k-1), terms, 1/float64(k))
	}
	// sum b_i a_ij c_j^(k-1) = 1/(k(k+1)), order k+1 <= 8.
	for k := 1; k <= 7; k++ {
		var terms []float64
		for i := range b {
			for j := 0; j < i; j++ {
				terms = append(terms, b[i]*a[i][j]*pow(c[j], k-1))
			}
		}
		check("sum b a c^"+itoa(k-1), terms, 1/float64(k*(k+1)))
	}
	// sum b_i c_i a_ij c_j^(k-1) = 1/(k(k+2)), order k+2 <= 8.
	for k := 1; k <= 6; k++ {
		var terms []float64
		for i := range b {
			for j := 0; j < i; j++ {
				terms = append(terms, b[i]*c[i]*a[i][j]*pow(c[j], k-1))
			}
		}
		check("sum b c a c^"+itoa(k-1), terms, 1/float64(k*(k+2)))
	}
	// sum b_i a_ij a_jl c_l^(k-1) = 1/(k(k+1)(k+2)), order k+2 <= 8.
	for k := 1; k <= 6; k++ {
		var terms []float64
		for i := range b {
			for j := 0; j < i; j++ {
				for l := 0; l < j; l++ {
					terms = append(terms, b[i]*a[i][j]*a[j][l]*pow(c[l], k-1))
				}
			}
		}
		check("sum b a a c^"+itoa(k-1), terms, 1/float64(k*(k+1)*(k+2)))
	}
	// The 5th-order embedded weights bhat = b - e5 satisfy the bushy
	// conditions up to k = 5, so sum e5_i c_i^(k-1) = 0.
	for k := 1; k <= 5; k++ {
		var terms []float64
		for i := 0; i < 12; i++ {
			terms = append(terms, e5[i]*pow(c[i], k-1), -b[i]*pow(c[i], k-1))
		}
		check("sum e5 c^"+itoa(k-1), append(terms, 1/float64(k)), 0)
	}
	// The 3rd-order weights bhh on stages 0, 8, 11: sum = 1/k, k = 1..3.
	for k := 1; k <= 3; k++ {
		terms := []float64{bhh1 * pow(c[0], k-1), bhh2 * pow(c[8], k-1), bhh3 * pow(c[11], k-1)}
		check("sum bhh c^"+itoa(k-1), terms, 1/float64(k))
	}
}

// TestStages: the unrolled stage sums equal the plain sums over all
// coefficients of a (the zeros included), to rounding.
func TestStages(t *testing.T) {
	const n = 5
	var k [16][]float64
	for j := range k {
		k[j] = make([]float64, n)
		for i := range k[j] {
			k[j][i] = math.Sin(float64(7*j+i+1)) * 3
		}
	}
	y := []float64{1, -2, 3, 0.5, 7}
	ys := make([]float64, n)
	const h = 0.37
	for st := 1; st < 16; st++ {
		stage(st, ys, y, h, &k)
		for i := range ys {
			var sum, scale float64
			for j := 0; j < st; j++ {
				sum += a[st][j] * k[j][i]
				scale += math.Abs(a[st][j] * k[j][i])
			}
			if want := y[i] + h*sum; math.Abs(ys[i]-want) > 1e-14*(math.Abs(y[i])+h*scale) {
				t.Errorf("stage %d component %d: %.17g, want %.17g", st, i, ys[i], want)
			}
		}
	}
}

func itoa(i int) string {
	if i < 10 {
		return string(rune('0' + i))
	}
	return string(rune('0'+i/10)) + string(rune('0'+i%10))
}

// TestPolynomialExactness: an 8th-order step integrates y' = 8 t^7 exactly
// at the step ends, and the 7th-order continuous extension reproduces
// y = t^7 (y' = 7 t^6) everywhere inside the steps (closed form).
func TestPolynomialExactness(t *testing.T) {
	const tol = 1e-14 // absolute, on values of order 1
	for _, tc := range []struct {
		name   string
		f      func(t float64) float64
		y      func(t float64) float64
		dense  bool
		t0, t1 float64
	}{
		{"ends y'=8t^7", func(t float64) float64 { return 8 * math.Pow(t, 7) }, func(t float64) float64 { return math.Pow(t, 8) }, false, 0, 1},
		{"dense y'=7t^6", func(t float64) float64 { return 7 * math.Pow(t, 6) }, func(t float64) float64 { return math.Pow(t, 7) }, true, 0, 1},
		{"dense backward", func(t float64) float64 { return 7 * math.Pow(t, 6) }, func(t float64) float64 { return math.Pow(t, 7) }, true, 1, -0.5},
	} {
		t.Run(tc.name, func(t *testing.T) {
			f := func(dst []float64, tt float64, y []float64) error { dst[0] = tc.f(tt); return nil }
			// a fixed first step of 0.1 and a loose tolerance keep several steps
			s, err := New(1, f, Settings{RelTol: 1e-3, AbsTol: 1e-3, InitialStep: 0.1, MaxStep: 0.1})
			if err != nil {
				t.Fatal(err)
			}
			if err := s.Reset(tc.t0, []float64{tc.y(tc.t0)}, tc.t1); err != nil {
				t.Fatal(err)
			}
			yi := make([]float64, 1)
			steps := 0
			for !s.Done() {
				if err := s.Step(); err != nil {
					t.Fatal(err)
				}
				steps++
				if got, want := s.Y()[0], tc.y(s.T()); math.Abs(got-want) > tol {
					t.Errorf("y(%g) = %.17g, want %.17g", s.T(), got, want)
				}
				if !tc.dense {
					continue
				}
				from, to := s.LastStep()
				for _, x := range []float64{0.1, 0.3, 0.5, 0.77, 0.95} {
					tt := from + x*(to-from)
					if err := s.Interpolate(yi, tt); err != nil {
						t.Fatal(err)
					}
					if want := tc.y(tt); math.Abs(yi[0]-want) > tol {
						t.Errorf("dense y(%g) = %.17g, want %.17g", tt, yi[0], want)
					}
				}
			}
			if steps < 5 {
				t.Errorf("only %d steps; the test needs several", steps)
			}
		})
	}
}

// arenstorf is the restricted three-body problem of Hairer, Norsett &
// Wanner, Solving ODEs I, 2nd ed., Section II.0, eq. (0.1), with
// mu = 0.012277471 and y = (y1, y2, y1', y2').
func arenstorf(dst []float64, _ float64, y []float64) error {
	const mu = 0.012277471 // HNW II.0
	const mup = 1 - mu
	y1, y2, v1, v2 := y[0], y[1], y[2], y[3]
	d1 := math.Pow((y1+mu)*(y1+mu)+y2*y2, 1.5)
	d2 := math.Pow((y1-mup)*(y1-mup)+y2*y2, 1.5)
	dst[0] = v1
	dst[1] = v2
	dst[2] = y1 + 2*v2 - mup*(y1+mu)/d1 - mu*(y1-mup)/d2
	dst[3] = y2 - 2*v1 - mup*y2/d1 - mu*y2/d2
	return nil
}

// Initial value and period of the Arenstorf orbit, HNW Solving ODEs I,
// 2nd ed., Section II.0, eq. (0.2) and the period given after it.
var (
	arenstorfY0 = []float64{0.994, 0, 0, -2.00158510637908252240537862224}
	arenstorfT  = 17.0652165601579625588917206249
)

func TestArenstorf(t *testing.T) {
	const tolState = 1e-6 // brief: return to y0 within 1e-6 after one period at tol 1e-12
	for _, tc := range []struct {
		name   string
		t0, t1 float64
	}{
		{"forward", 0, arenstorfT},
		{"backward", arenstorfT, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s, err := New(4, arenstorf, Settings{RelTol: 1e-12, AbsTol: 1e-12})
			if err != nil {
				t.Fatal(err)
			}
			y := make([]float64, 4)
			tEnd, err := s.Integrate(y, tc.t0, arenstorfY0, tc.t1, nil)
			if err != nil {
				t.Fatal(err)
			}
			if tEnd != tc.t1 {
				t.Errorf("end time %v, want %v", tEnd, tc.t1)
			}
			var worst float64
			for i := range y {
				worst = math.Max(worst, math.Abs(y[i]-arenstorfY0[i]))
			}
			st := s.Stats()
			t.Logf("Arenstorf %s, tol 1e-12: max |y(T)-y0| = %.3g, steps %d, rejected %d, evaluations %d",
				tc.name, worst, st.Steps, st.Rejected, st.Evaluations)
			if worst > tolState {
				t.Errorf("max |y(T) - y0| = %.3g, want <= %g", worst, tolState)
			}
		})
	}
}

// oscillator is x” = -x; with x(0) = 1, x'(0) = 0 the solution is
// x = cos t, x' = -sin t (closed form).
func oscillator(dst []float64, _ float64, y []float64) error {
	dst[0] = y[1]
	dst[1] = -y[0]
	return nil
}

func TestEventsOscillator(t *testing.T) {
	const tolT = 1e-9 // s: brief's event-location requirement
	type want struct {
		t   float64
		dir int
	}
	// Zeros of cos t: pi/2 + k pi; cos falls through zero at pi/2 + 2k pi.
	zeros := func(from, to float64) []want {
		var w []want
		lo, hi := math.Min(from, to), math.Max(from, to)
		for k := -20; k <= 20; k++ {
			tz := math.Pi/2 + float64(k)*math.Pi
			if tz > lo && tz < hi {
				dir := 1
				if k%2 == 0 {
					dir = -1
				}
				w = append(w, want{tz, dir})
			}
		}
		if to < from { // reported in integration order
			for i, j := 0, len(w)-1; i < j; i, j = i+1, j-1 {
				w[i], w[j] = w[j], w[i]
			}
		}
		return w
	}
	filter := func(w []want, dir int) []want {
		var out []want
		for _, x := range w {
			if dir == 0 || x.dir == dir {
				out = append(out, x)
			}
		}
		return out
	}
	for _, tc := range []struct {
		name      string
		t1        float64
		direction int
		terminal  bool
	}{
		{"forward both", 20, 0, false},
		{"forward rising", 20, 1, false},
		{"forward falling", 20, -1, false},
		{"backward both", -20, 0, false},
		{"backward rising", -20, 1, false},
		{"terminal falling", 20, -1, true},
		{"terminal backward rising", -20, 1, true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s, err := New(2, oscillator, Settings{RelTol: 1e-13, AbsTol: 1e-13})
			if err != nil {
				t.Fatal(err)
			}
			var got []Hit
			obs := &Observer{
				Events:  []Event{{G: func(_ float64, y []float64) float64 { return y[0] }, Direction: tc.direction, Terminal: tc.terminal}},
				OnEvent: func(h Hit) error { h.Y = append([]float64(nil), h.Y...); got = append(got, h); return nil },
			}
			y := make([]float64, 2)
			tEnd, err := s.Integrate(y, 0, []float64{1, 0}, tc.t1, obs)
			if err != nil {
				t.Fatal(err)
			}
			w := filter(zeros(0, tc.t1), tc.direction)
			if tc.terminal {
				w = w[:1]
				if math.Abs(tEnd-w[0].t) > tolT {
					t.Errorf("terminal end time %.15g, want %.15g", tEnd, w[0].t)
				}
				if math.Abs(y[0]) > 1e-10 {
					t.Errorf("terminal state x = %g, want 0", y[0])
				}
			}
			if len(got) != len(w) {
				t.Fatalf("%d events, want %d: %+v", len(got), len(w), got)
			}
			for i := range w {
				if math.Abs(got[i].T-w[i].t) > tolT || got[i].Direction != w[i].dir {
					t.Errorf("event %d at %.15g dir %d, want %.15g dir %d (error %.3g s)",
						i, got[i].T, got[i].Direction, w[i].t, w[i].dir, got[i].T-w[i].t)
				}
				if math.Abs(got[i].Y[0]) > 1e-10 {
					t.Errorf("event %d state x = %g, want 0", i, got[i].Y[0])
				}
			}
		})
	}
}

// TestMaxCheck: y' = 1 is integrated exactly in one step over [0, 20];
// g = sin(y) has zeros at k pi (closed form) that a single sign test per
// step misses, and MaxCheck pieces find.
func TestMaxCheck(t *testing.T) {
	f := func(dst []float64, _ float64, _ []float64) error { dst[0] = 1; return nil }
	for _, tc := range []struct {
		maxCheck float64
		want     int
	}{{0, 0}, {0.5, 6}} {
		s, _ := New(1, f, Settings{InitialStep: 20})
		var got []float64
		obs := &Observer{
			MaxCheck: tc.maxCheck,
			Events:   []Event{{G: func(_ float64, y []float64) float64 { return math.Sin(y[0]) }}},
			OnEvent:  func(h Hit) error { got = append(got, h.T); return nil },
		}
		y := make([]float64, 1)
		if _, err := s.Integrate(y, 0, []float64{0.1}, 20, obs); err != nil {
			t.Fatal(err)
		}
		if s.Stats().Steps != 1 {
			t.Fatalf("set-up: %d steps, want 1", s.Stats().Steps)
		}
		if len(got) != tc.want {
			t.Fatalf("MaxCheck %g: %d events %v, want %d", tc.maxCheck, len(got), got, tc.want)
		}
		for k, tt := range got {
			if want := float64(k+1)*math.Pi - 0.1; math.Abs(tt-want) > 1e-9 {
				t.Errorf("event %d at %.15g, want %.15g", k, tt, want)
			}
		}
	}
}

// TestFixedStepOutput: samples come from the dense output at exact
// multiples of the step, and sampling never changes the integration steps.
func TestFixedStepOutput(t *testing.T) {
	const tolY = 1e-10 // absolute, for rtol 1e-12 over 20 periods of cos t
	for _, tc := range []struct {
		name       string
		t1, step   float64
		wantSample int
	}{
		{"forward multiple", 100, 0.25, 401},
		{"forward not multiple", 100, 0.3, 334},
		{"backward", -100, 0.25, 401},
		{"step above span", 1, 5, 1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			plain, _ := New(2, oscillator, Settings{RelTol: 1e-12, AbsTol: 1e-12})
			y := make([]float64, 2)
			if _, err := plain.Integrate(y, 0, []float64{1, 0}, tc.t1, nil); err != nil {
				t.Fatal(err)
			}
			s, _ := New(2, oscillator, Settings{RelTol: 1e-12, AbsTol: 1e-12})
			n := 0
			lastT := math.NaN()
			obs := &Observer{Step: tc.step, Sample: func(tt float64, y []float64) error {
				want := float64(n) * tc.step * math.Copysign(1, tc.t1)
				if n > 0 && math.Abs(want) > math.Abs(tc.t1) {
					t.Errorf("sample %d at %g beyond the end %g", n, tt, tc.t1)
				}
				if tt != want && !(math.Abs(want-tc.t1) < 1e-9*tc.step && tt == tc.t1) {
					t.Errorf("sample %d at t = %.17g, want %.17g", n, tt, want)
				}
				if math.Abs(y[0]-math.Cos(tt)) > tolY || math.Abs(y[1]+math.Sin(tt)) > tolY {
					t.Errorf("y(%g) = %v, want (cos, -sin) = (%g, %g)", tt, y, math.Cos(tt), -math.Sin(tt))
				}
				n++
				lastT = tt
				return nil
			}}
			if _, err := s.Integrate(y, 0, []float64{1, 0}, tc.t1, obs); err != nil {
				t.Fatal(err)
			}
			if n != tc.wantSample {
				t.Errorf("%d samples (last at %g), want %d", n, lastT, tc.wantSample)
			}
			if s.Stats().Steps != plain.Stats().Steps {
				t.Errorf("steps with output %d, without %d: output must not change the steps", s.Stats().Steps, plain.Stats().Steps)
			}
		})
	}
}

// TestStepCollapse: radial fall into a point mass, x” = -1/x^2 from rest
// at x = 1, reaches the centre at t = (pi/2) sqrt(x0^3 / (2 mu)) (closed
// form of the rectilinear Kepler problem, e.g. the free-fall time). The
// solver must stop with ErrStepSize near that time, without hanging.
func TestStepCollapse(t *testing.T) {
	f := func(dst []float64, _ float64, y []float64) error {
		dst[0] = y[1]
		dst[1] = -1 / (y[0] * y[0])
		return nil
	}
	tc := math.Pi / 2 * math.Sqrt(0.5) // free-fall time, mu = 1, x0 = 1
	s, _ := New(2, f, Settings{RelTol: 1e-10, AbsTol: 1e-10})
	y := make([]float64, 2)
	_, err := s.Integrate(y, 0, []float64{1, 0}, 2, nil)
	var se *StepError
	if !errors.Is(err, ErrStepSize) || !errors.As(err, &se) {
		t.Fatalf("err = %v, want ErrStepSize in a *StepError", err)
	}
	if math.Abs(se.T-tc) > 1e-6 { // s: the fall ends within 1e-6 s of the closed-form time
		t.Errorf("collapse at t = %.12g, want near %.12g", se.T, tc)
	}
	if len(se.Y) != 2 || !(se.Y[0] < 1e-3) {
		t.Errorf("state at collapse %v, want x near 0", se.Y)
	}
	t.Logf("collapse at t = %.15g (closed form %.15g), x = %.3g, steps %d", se.T, tc, se.Y[0], s.Stats().Steps)
}

var errStop = errors.New("test: stop")

func TestErrors(t *testing.T) {
	if _, err := New(0, oscillator, Settings{}); !errors.Is(err, ErrSettings) {
		t.Errorf("New(0) err = %v, want ErrSettings", err)
	}
	for _, st := range []Settings{{RelTol: -1}, {RelTol: 1e-20}, {AbsTol: -1}, {MaxSteps: -1}, {InitialStep: math.NaN()}, {MaxStep: -1},
		{RelTolVec: []float64{1e-10}}, {AbsTolVec: []float64{1, 2, 3}}, {RelTolVec: []float64{0, 1e-10}, AbsTolVec: []float64{0, 1}}} {
		if _, err := New(2, oscillator, st); !errors.Is(err, ErrSettings) {
			t.Errorf("New(%+v) err = %v, want ErrSettings", st, err)
		}
	}
	y := make([]float64, 2)
	s, _ := New(2, oscillator, Settings{MaxSteps: 10})
	if _, err := s.Integrate(y, 0, []float64{1, 0}, 1000, nil); !errors.Is(err, ErrMaxSteps) {
		t.Errorf("MaxSteps 10 over 1000 s: err = %v, want ErrMaxSteps", err)
	}
	s, _ = New(2, oscillator, Settings{})
	if _, err := s.Integrate(y, 0, []float64{math.NaN(), 0}, 1, nil); !errors.Is(err, ErrNotFinite) {
		t.Errorf("NaN state: err = %v, want ErrNotFinite", err)
	}
	if _, err := s.Integrate(y, 0, []float64{1, 0}, math.Inf(1), nil); !errors.Is(err, ErrSettings) {
		t.Errorf("infinite end: err = %v, want ErrSettings", err)
	}
	calls := 0
	failing := func(dst []float64, t float64, y []float64) error {
		calls++
		if t > 0.5 {
			return errStop
		}
		return oscillator(dst, t, y)
	}
	s, _ = New(2, failing, Settings{})
	_, err := s.Integrate(y, 0, []float64{1, 0}, 1, nil)
	var se *StepError
	if !errors.Is(err, errStop) || !errors.As(err, &se) || se.T > 0.5 {
		t.Errorf("failing f: err = %v, want errStop in a StepError before t = 0.5", err)
	}
	s, _ = New(2, oscillator, Settings{})
	if _, err := s.Integrate(y, 0, []float64{1, 0}, 10, &Observer{Step: 1, Sample: func(float64, []float64) error { return errStop }}); err != errStop {
		t.Errorf("sample error: err = %v, want errStop unchanged", err)
	}
	if _, err := s.Integrate(y, 0, []float64{1, 0}, 10, &Observer{Step: -1}); !errors.Is(err, ErrSettings) {
		t.Errorf("negative output step: err = %v, want ErrSettings", err)
	}
	// a non-finite derivative far from the start is rejected and the
	// step shrinks until it collapses, with an error rather than a hang
	wall := func(dst []float64, t float64, y []float64) error {
		dst[0] = 1
		if y[0] > 0.5 {
			dst[0] = math.NaN()
		}
		return nil
	}
	s, _ = New(1, wall, Settings{})
	if _, err := s.Integrate(y[:1], 0, []float64{0}, 1, nil); !errors.Is(err, ErrStepSize) {
		t.Errorf("NaN wall: err = %v, want ErrStepSize", err)
	}
}

// TestZeroAllocs: steps, dense output, sampling and events allocate nothing.
func TestZeroAllocs(t *testing.T) {
	s, _ := New(4, arenstorf, Settings{RelTol: 1e-10, AbsTol: 1e-10})
	y := make([]float64, 4)
	if err := s.Reset(0, arenstorfY0, 1e6); err != nil {
		t.Fatal(err)
	}
	allocs := testing.AllocsPerRun(1000, func() {
		if err := s.Step(); err != nil {
			t.Fatal(err)
		}
		if err := s.Interpolate(y, s.T()); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("Step+Interpolate: %v allocations per step, want 0", allocs)
	}
	var nh, ns int
	obs := &Observer{
		Step:    0.01,
		Sample:  func(float64, []float64) error { ns++; return nil },
		Events:  []Event{{G: func(_ float64, y []float64) float64 { return y[1] }}},
		OnEvent: func(Hit) error { nh++; return nil },
	}
	if _, err := s.Integrate(y, 0, arenstorfY0, arenstorfT, obs); err != nil { // warm up
		t.Fatal(err)
	}
	steps := s.Stats().Steps
	allocs = testing.AllocsPerRun(5, func() {
		if _, err := s.Integrate(y, 0, arenstorfY0, arenstorfT, obs); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("Integrate with sampling and events: %v allocations per run (%d steps), want 0", allocs, steps)
	}
	if nh == 0 || ns == 0 {
		t.Errorf("observer saw %d hits, %d samples", nh, ns)
	}
}

func BenchmarkArenstorf(b *testing.B) {
	for _, tol := range []float64{1e-8, 1e-12} {
		b.Run("tol="+fmtTol(tol), func(b *testing.B) {
			s, _ := New(4, arenstorf, Settings{RelTol: tol, AbsTol: tol})
			y := make([]float64, 4)
			b.ReportAllocs()
			for b.Loop() {
				if _, err := s.Integrate(y, 0, arenstorfY0, arenstorfT, nil); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(s.Stats().Evaluations), "evals/op")
			b.ReportMetric(float64(s.Stats().Steps), "steps/op")
		})
	}
}

func fmtTol(x float64) string {
	return "1e-" + itoa(int(-math.Round(math.Log10(x))))
}

// BenchmarkStepOverhead is the cost of one accepted step on a trivial
// right-hand side of dimension 6 (the integrator's own arithmetic).
func BenchmarkStepOverhead(b *testing.B) {
	f := func(dst []float64, _ float64, y []float64) error {
		dst[0], dst[1], dst[2], dst[3], dst[4], dst[5] = y[3], y[4], y[5], -y[0], -y[1], -y[2]
		return nil
	}
	s, _ := New(6, f, Settings{RelTol: 1e-10, AbsTol: 1e-13, MaxSteps: math.MaxInt})
	if err := s.Reset(0, []float64{1, 0, 0, 0, 1, 0}, 1e12); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if err := s.Step(); err != nil {
			b.Fatal(err)
		}
	}
}
