package trajectory_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
)

const (
	earthMu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	earthRe = 6378.137    // km, WGS 84 semi-major axis (NIMA TR8350.2, Table 3.1)
)

// The Hermite error constants of the package doc (Birkhoff and Priver
// 1967, from memory) are attained by x(t) = t^4/24 on [0, 1], whose fourth
// derivative is 1: the error is then exactly t^2 (t-1)^2 / 24 (the
// Hermite remainder formula, e.g. Burden and Faires, Numerical Analysis,
// Theorem 3.9), whose maximum is 1/384 at t = 1/2, and its derivative
// t (t-1) (2t-1) / 12 has the maximum sqrt(3)/216 at t = 1/2 - sqrt(3)/6.
// Recomputed here from the interpolant, per component and for the vector
// (all three components equal: sqrt(3) times).
func TestHermiteBoundAttained(t *testing.T) {
	x := func(s float64) float64 { return s * s * s * s / 24 }
	dx := func(s float64) float64 { return s * s * s / 6 }
	r := [][3]float64{{x(0), x(0), x(0)}, {x(1), x(1), x(1)}}
	v := [][3]float64{{dx(0), dx(0), dx(0)}, {dx(1), dx(1), dx(1)}}
	tr, err := trajectory.FromSamples(1, r, v, trajectory.Bound{})
	if err != nil {
		t.Fatal(err)
	}
	wantPos, wantVel := trajectory.HermiteBound(1, 1)
	var maxPos, maxVel float64
	for i := 0; i <= 100000; i++ {
		s := float64(i) / 100000
		p, q := tr.At(s)
		maxPos = math.Max(maxPos, math.Sqrt(3)*math.Abs(p[0]-x(s)))
		maxVel = math.Max(maxVel, math.Sqrt(3)*math.Abs(q[0]-dx(s)))
		if p[0] != p[1] || p[0] != p[2] {
			t.Fatalf("components differ at %v: %v", s, p)
		}
		// The closed-form error t^2 (t-1)^2 / 24 (remainder formula).
		if e := x(s) - p[0]; math.Abs(e-s*s*(s-1)*(s-1)/24) > 1e-15 {
			t.Fatalf("error at %v = %v, want %v", s, e, s*s*(s-1)*(s-1)/24)
		}
	}
	const rel = 1e-8 // the grid of 1e-5 finds the maxima to this
	if math.Abs(maxPos-wantPos) > rel*wantPos || math.Abs(maxPos-math.Sqrt(3)/384) > rel*wantPos {
		t.Errorf("max position error %v, want sqrt(3)/384 = %v (HermiteBound %v)", maxPos, math.Sqrt(3)/384, wantPos)
	}
	if math.Abs(maxVel-3.0/216) > rel || wantVel < maxVel*(1-rel) || wantVel > maxVel*(1+rel) {
		t.Errorf("max velocity error %v, want sqrt(3)*sqrt(3)/216 = %v (HermiteBound %v)", maxVel, 3.0/216, wantVel)
	}
}

// fourthFG is r”” of Keplerian motion from the t^4 coefficients of the
// f and g series (from memory: f4 = u^2 + 3uq - 15up^2, g4 = 6up; e.g.
// Bate, Mueller and White, Fundamentals of Astrodynamics, 1971, sec. 5.6),
// recomputed below by finite differences of the analytic propagation.
func fourthFG(mu float64, s orbit.State) [3]float64 {
	r := math.Sqrt(dot(s.R, s.R))
	u := mu / (r * r * r)
	p := dot(s.R, s.V) / (r * r)
	q := dot(s.V, s.V)/(r*r) - u
	f4 := u*u + 3*u*q - 15*u*p*p
	g4 := 6 * u * p
	return [3]float64{f4*s.R[0] + g4*s.V[0], f4*s.R[1] + g4*s.V[1], f4*s.R[2] + g4*s.V[2]}
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }

// randomState returns a state of an ellipse with periapsis altitude 200
// to 2000 km and eccentricity up to 0.8 at a random anomaly.
func randomState(rng *rand.Rand) orbit.State {
	rp := earthRe + 200 + 1800*rng.Float64()
	e := 0.8 * rng.Float64()
	el := orbit.Elements{P: rp * (1 + e), E: e, I: math.Pi * rng.Float64(), RAAN: 2 * math.Pi * rng.Float64(),
		ArgP: 2 * math.Pi * rng.Float64(), Nu: 2 * math.Pi * rng.Float64()}
	el.A = el.P / (1 - e*e)
	s, err := orbit.StateFromElements(earthMu, el)
	if err != nil {
		panic(err)
	}
	return s
}

// The f-g expression of r”” agrees with the fourth finite difference of
// orbit.Propagate (universal variables), and the bound of the package doc
// holds at the smallest radius and largest speed of the orbit.
func TestFourthDerivativeBound(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 200 {
		s := randomState(rng)
		el, _ := orbit.ElementsFromState(earthMu, s)
		rp := el.P / (1 + el.E)
		vp := math.Sqrt(earthMu * (2/rp - 1/el.A))
		// Fourth central differences of the position at steps h and h/2,
		// h = 0.02/sqrt(u) (u = mu/r^3), combined by Richardson
		// extrapolation (4 D(h/2) - D(h))/3, which removes the h^2 term;
		// the rest (h^4 terms, and rounding of 16 * 1e-15 r / (h/2)^4 =
		// 2e-6 r u^2) is below 1e-5 of |r''''|.
		r := math.Sqrt(dot(s.R, s.R))
		h0 := 0.02 / math.Sqrt(earthMu/(r*r*r))
		diff4 := func(h float64) (d [3]float64) {
			for k, c := range []float64{1, -4, 6, -4, 1} {
				st, err := orbit.Propagate(earthMu, s, float64(k-2)*h)
				if err != nil {
					t.Fatal(err)
				}
				for i := range 3 {
					d[i] += c * st.R[i] / (h * h * h * h)
				}
			}
			return d
		}
		dh, dh2 := diff4(h0), diff4(h0/2)
		var d4 [3]float64
		for i := range 3 {
			d4[i] = (4*dh2[i] - dh[i]) / 3
		}
		fg := fourthFG(earthMu, s)
		n := math.Sqrt(dot(fg, fg))
		diff := [3]float64{d4[0] - fg[0], d4[1] - fg[1], d4[2] - fg[2]}
		if math.Sqrt(dot(diff, diff)) > 1e-5*n {
			t.Errorf("r'''' f-g %v, finite difference %v", fg, d4)
		}
		if b := trajectory.FourthDerivativeBound(earthMu, rp, vp); n > b {
			t.Errorf("|r''''| = %v above the bound %v (rp %v, vp %v)", n, b, rp, vp)
		}
	}
}

// Sampling a point-mass orbit and interpolating it agrees with the
// analytic two-body solution (orbit.Propagate, universal variables)
// within the reported bound plus the integrator's error.
func TestSampleWithinBound(t *testing.T) {
	tests := []struct {
		name   string
		rp, e  float64 // km, -
		span   float64 // s
		tol    float64 // km
		incDeg float64
	}{
		{"LEO 500 km", earthRe + 500, 0, 86400, 0, 51.6},
		{"eccentric", earthRe + 300, 0.3, 86400, 0, 63.4},
		{"Molniya-like", earthRe + 600, 0.72, 2 * 86400, 1e-3, 63.4},
		{"GEO", 42164.17, 0, 3 * 86400, 0, 0.05},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			el := orbit.Elements{P: tt.rp * (1 + tt.e), E: tt.e, I: tt.incDeg * math.Pi / 180, RAAN: 1, ArgP: 2, Nu: 0.3}
			el.A = el.P / (1 - tt.e*tt.e)
			s0, err := orbit.StateFromElements(earthMu, el)
			if err != nil {
				t.Fatal(err)
			}
			p, err := propagate.New(propagate.PointMass(earthMu), propagate.Options{RelTol: 1e-13})
			if err != nil {
				t.Fatal(err)
			}
			tr, err := trajectory.Sample(p, s0, tt.span, trajectory.Options{PositionTol: tt.tol})
			if err != nil {
				t.Fatal(err)
			}
			b := tr.Bound()
			tol := tt.tol
			if tol == 0 {
				tol = trajectory.DefaultPositionTol
			}
			if b.Position > tol*(1+1e-9) && tr.Step() > trajectory.DefaultMinStep {
				t.Errorf("bound %v km above the tolerance %v km at step %v s", b.Position, tol, tr.Step())
			}
			// Integrator error at rtol 1e-13 over these spans: below 1e-6 km
			// (measured against the analytic solution at the samples).
			const integ = 1e-6 // km
			var worst, worstV, atSamples float64
			for k := 0; k < tr.Len(); k += 97 {
				ex, _ := orbit.Propagate(earthMu, s0, tr.Time(k))
				atSamples = math.Max(atSamples, dist(ex.R, tr.Sample(k).R))
			}
			if atSamples > integ {
				t.Fatalf("integrator error %v km at the samples, above %v km", atSamples, integ)
			}
			rng := rand.New(rand.NewPCG(2, 2))
			for range 2000 {
				tm := tr.Span() * rng.Float64()
				r, v := tr.At(tm)
				ex, err := orbit.Propagate(earthMu, s0, tm)
				if err != nil {
					t.Fatal(err)
				}
				worst = math.Max(worst, dist(r, ex.R))
				worstV = math.Max(worstV, dist(v, ex.V))
			}
			if worst > b.Position+integ {
				t.Errorf("interpolation error %v km above the bound %v km + %v km", worst, b.Position, integ)
			}
			if worstV > b.Velocity+integ {
				t.Errorf("velocity error %v km/s above the bound %v km/s + %v", worstV, b.Velocity, integ)
			}
			t.Logf("step %.2f s, %d samples, bound %.3g km (measured %.3g km), velocity bound %.3g km/s (measured %.3g)",
				tr.Step(), tr.Len(), b.Position, worst, b.Velocity, worstV)
		})
	}
}

func dist(a, b [3]float64) float64 {
	d := [3]float64{a[0] - b[0], a[1] - b[1], a[2] - b[2]}
	return math.Sqrt(dot(d, d))
}

func TestSampleErrors(t *testing.T) {
	p, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{})
	s0 := orbit.State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, 7.5, 0}}
	for _, span := range []float64{0, -10, math.NaN(), math.Inf(1)} {
		if _, err := trajectory.Sample(p, s0, span, trajectory.Options{}); err == nil {
			t.Errorf("Sample(span %v) = nil error", span)
		}
	}
	radial := orbit.State{R: [3]float64{7000, 0, 0}, V: [3]float64{1, 0, 0}}
	if _, err := trajectory.Sample(p, radial, 100, trajectory.Options{}); err == nil {
		t.Error("Sample(radial orbit) = nil error")
	}
	if _, err := trajectory.Sample(p, s0, 365*86400, trajectory.Options{MaxSamples: 1000}); err == nil {
		t.Error("Sample beyond MaxSamples = nil error")
	}
}

func TestAtOutsideSpanPanics(t *testing.T) {
	tr, _ := trajectory.FromSamples(10, [][3]float64{{1, 0, 0}, {2, 0, 0}}, [][3]float64{{0, 0, 0}, {0, 0, 0}}, trajectory.Bound{})
	defer func() {
		if recover() == nil {
			t.Error("At(11) did not panic")
		}
	}()
	tr.At(11)
}

// BenchmarkSample is seven days of a 500 km orbit with J2 at the default
// tolerance: the trajectory behind a week of passes.
func BenchmarkSample(b *testing.B) {
	el := orbit.Elements{A: earthRe + 500, P: earthRe + 500, I: 97.4 * math.Pi / 180}
	s0, _ := orbit.StateFromElements(earthMu, el)
	p, _ := propagate.New(propagate.J2(earthMu, earthRe, 1.0826266835531513e-3), propagate.Options{})
	for b.Loop() {
		if _, err := trajectory.Sample(p, s0, 7*86400, trajectory.Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkAt(b *testing.B) {
	el := orbit.Elements{A: earthRe + 500, P: earthRe + 500, I: 97.4 * math.Pi / 180}
	s0, _ := orbit.StateFromElements(earthMu, el)
	p, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{})
	tr, _ := trajectory.Sample(p, s0, 86400, trajectory.Options{})
	t := 0.0
	for b.Loop() {
		tr.At(t)
		t += 7.3
		if t > 86400 {
			t = 0
		}
	}
}

// TestSampleStop: a stop event ends the sampling with a StopError at the
// event. The orbit has periapsis 100 km below a 6478.137 km "surface"
// sphere (its apoapsis far above), so the radius first reaches the sphere
// where r = p/(1 + e cos nu) equals it: from r = a(1 - e cos E), at the
// eccentric anomaly E with cos E = (1 - r/a)/e, and Kepler's equation
// gives the time from apoapsis, where the run starts.
func TestSampleStop(t *testing.T) {
	const rs = earthRe + 100
	rp, ra := earthRe, earthRe+2000
	a, e := (rp+ra)/2, (ra-rp)/(ra+rp)
	va := math.Sqrt(earthMu * (2/ra - 1/a))
	s0 := orbit.State{R: [3]float64{-ra, 0, 0}, V: [3]float64{0, -va, 0}}
	p, err := propagate.New(propagate.PointMass(earthMu), propagate.Options{RelTol: 1e-12})
	if err != nil {
		t.Fatal(err)
	}
	g := func(_ float64, s orbit.State) float64 {
		return math.Sqrt(s.R[0]*s.R[0]+s.R[1]*s.R[1]+s.R[2]*s.R[2]) - rs
	}
	stop := propagate.Event{Name: "surface", Kind: propagate.Custom, G: g, Direction: -1}
	_, err = trajectory.Sample(p, s0, 86400, trajectory.Options{Stop: &stop})
	var se *trajectory.StopError
	if !errors.As(err, &se) {
		t.Fatalf("Sample: %v, want a StopError", err)
	}
	n := math.Sqrt(earthMu / (a * a * a))
	cosE := (1 - rs/a) / e
	E := math.Acos(cosE) // in (0, pi): descending from apoapsis (E = pi)
	want := (math.Pi - (E - e*math.Sin(E))) / n
	if se.Event != "surface" || math.Abs(se.T-want) > 1e-6 {
		t.Errorf("stopped by %q at t = %.9f s, want surface at %.9f s", se.Event, se.T, want)
	}
	if r := math.Sqrt(se.State.R[0]*se.State.R[0] + se.State.R[1]*se.State.R[1] + se.State.R[2]*se.State.R[2]); math.Abs(r-rs) > 1e-6 {
		t.Errorf("radius at the stop %.9f km, want %.9f", r, rs)
	}
	// without the event the same orbit samples (it is a valid ellipse)
	if _, err := trajectory.Sample(p, s0, 86400, trajectory.Options{}); err != nil {
		t.Errorf("Sample without a stop: %v", err)
	}
}
