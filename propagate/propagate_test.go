package propagate_test

import (
	"errors"
	"math"
	"testing"

	"centra/orbit"
	"centra/propagate"
)

// analyticCase is a two-body orbit whose periapsis lies in LEO.
type analyticCase struct {
	name   string
	rp, e  float64 // periapsis radius km, eccentricity
	span   float64 // s
	start  float64 // s relative to periapsis passage
	relTol float64 // integration tolerance of the case (fast path and Cartesian engine)
	// relTolPolar is the tolerance for the polar engine: its error per
	// unit tolerance is up to twice the Cartesian one on eccentric and open
	// orbits (the along-track error of theta), so two cases need 1e-14
	relTolPolar float64
}

func analyticCases() []analyticCase {
	period := func(a float64) float64 { return 2 * math.Pi * math.Sqrt(a*a*a/earthMu) }
	hypA := 7000.0 / (1.5 - 1) // |a| of the e = 1.5 hyperbola with rp = 7000 km
	return []analyticCase{
		// tolerances: the loosest of 1e-12, 1e-13, 1e-14 that meets the budget
		{"circular 500 km", earthRe + 500, 0, 10 * period(earthRe+500), 0, 1e-12, 1e-12},
		{"e=0.1", 6750, 0.1, 10 * period(6750/0.9), 0, 1e-13, 1e-12},
		{"e=0.7", 6600, 0.7, 10 * period(6600/0.3), 0, 1e-13, 1e-14},
		{"e=0.95", 7000, 0.95, 10 * period(7000/0.05), 0, 1e-14, 1e-14},
		// the hyperbola is followed from 5 "periods" 2 pi sqrt(|a|^3/mu) before
		// periapsis to 5 after it
		{"hyperbola e=1.5", 7000, 1.5, 10 * period(hypA), -5 * period(hypA), 1e-13, 1e-14},
	}
}

// TestPointMassAgainstAnalytic compares numerical propagation with the
// universal-variable analytic solution orbit.Propagate (an independent
// method: Kepler's equation, no integration) over 10 periods (the
// hyperbola: 10 times 2 pi sqrt(|a|^3/mu), through periapsis), sampling
// 1000 states. The budget is 1 mm of position error per day propagated.
func TestPointMassAgainstAnalytic(t *testing.T) {
	for _, tc := range analyticCases() {
		for _, eq := range []propagate.Equations{propagate.FastPath, propagate.EnginePolar, propagate.Engine} {
			if eq == propagate.Engine && tc.e != 0.7 {
				continue // the Cartesian engine is the fast path's equations (TestFastPathMatchesEngine); one case suffices
			}
			t.Run(tc.name+"/"+eq.String(), func(t *testing.T) {
				budget := 1e-6 * tc.span / day // km: 1 mm per day
				p := tc.rp * (1 + tc.e)
				peri := conicState(earthMu, p, tc.e, 51.6, 30, 40, 0)
				s0, err := orbit.Propagate(earthMu, peri, tc.start)
				if err != nil {
					t.Fatal(err)
				}
				relTol := tc.relTol
				if eq == propagate.EnginePolar {
					relTol = tc.relTolPolar
				}
				prop, err := propagate.New(propagate.PointMass(earthMu), propagate.Options{RelTol: relTol, Equations: eq})
				if err != nil {
					t.Fatal(err)
				}
				var worst, worstT float64
				rows := 0
				res, err := prop.Run(s0, tc.span, &propagate.Output{
					Step: tc.span / 1000,
					OnState: func(tt float64, s orbit.State) error {
						want, err := orbit.Propagate(earthMu, s0, tt)
						if err != nil {
							return err
						}
						if d := dist(s.R, want.R); d > worst {
							worst, worstT = d, tt
						}
						rows++
						return nil
					},
				})
				if err != nil {
					t.Fatal(err)
				}
				if rows != 1001 {
					t.Errorf("%d rows, want 1001", rows)
				}
				t.Logf("rtol %g: worst position error %.3g mm at t = %.0f s (budget %.3g mm over %.2f d); steps %d, evaluations %d",
					relTol, worst*1e6, worstT, budget*1e6, tc.span/day, res.Stats.Steps, res.Stats.Evaluations)
				if !(worst <= budget) {
					t.Errorf("worst position error %.3g km, want <= %.3g km (1 mm/day)", worst, budget)
				}
			})
		}
	}
}

// TestJ2Reference compares two-body + J2 propagation with the SciPy DOP853
// reference (testdata/propagate/j2_reference.json, rtol 1e-13) at every
// 10-minute state of one day: within 1 m at rtol 1e-12, and within 1 m at
// the default tolerance.
func TestJ2Reference(t *testing.T) {
	const tolKm = 1e-3 // 1 m, brief
	ref := loadReference(t)
	if math.Abs(ref.J2-earthJ2) > 1e-18 || ref.Mu != earthMu || ref.Re != earthRe {
		t.Fatalf("reference constants mu %v re %v J2 %v differ from the test's", ref.Mu, ref.Re, ref.J2)
	}
	for _, c := range ref.Cases {
		for _, tc := range []struct {
			eq     propagate.Equations
			relTol float64
		}{
			{propagate.FastPath, 1e-12},
			{propagate.FastPath, 0},
			{propagate.Engine, 1e-12},
		} {
			t.Run(c.Name+"/"+tc.eq.String(), func(t *testing.T) {
				prop, err := propagate.New(propagate.J2(ref.Mu, ref.Re, ref.J2), propagate.Options{RelTol: tc.relTol, Equations: tc.eq})
				if err != nil {
					t.Fatal(err)
				}
				k := 0
				var worst float64
				res, err := prop.Run(stateOf(c.State0), ref.Span, &propagate.Output{
					Step: ref.Step,
					OnState: func(tt float64, s orbit.State) error {
						row := c.States[k]
						if tt != row[0] {
							t.Fatalf("row %d at t = %v, reference at %v", k, tt, row[0])
						}
						d := dist(s.R, [3]float64{row[1], row[2], row[3]})
						worst = math.Max(worst, d)
						k++
						return nil
					},
				})
				if err != nil {
					t.Fatal(err)
				}
				if k != len(c.States) {
					t.Errorf("%d rows, reference has %d", k, len(c.States))
				}
				t.Logf("rtol %g: worst position difference %.3g m (reference self-consistency %.2g m); steps %d, evaluations %d",
					prop.Options().RelTol, worst*1e3, c.SelfDiff*1e3, res.Stats.Steps, res.Stats.Evaluations)
				if !(worst <= tolKm) {
					t.Errorf("worst position difference %.4g km, want <= %g km", worst, tolKm)
				}
			})
		}
	}
}

// TestCollision: a radial fall into the point mass (no angular momentum)
// reaches the centre at t = (pi/2) sqrt(r0^3/(2 mu)) (free-fall time,
// closed form of the rectilinear Kepler problem). The run must stop with
// ErrStepSize near that time, carrying the state, instead of hanging.
func TestCollision(t *testing.T) {
	r0 := 7000.0
	tFall := math.Pi / 2 * math.Sqrt(r0*r0*r0/(2*earthMu))
	for _, eq := range []propagate.Equations{propagate.FastPath, propagate.Engine, propagate.EnginePolar} {
		t.Run(eq.String(), func(t *testing.T) {
			prop, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{Equations: eq})
			s0 := orbit.State{R: [3]float64{r0 / math.Sqrt(3), r0 / math.Sqrt(3), r0 / math.Sqrt(3)}}
			_, err := prop.Run(s0, 3600, nil)
			var se *propagate.StepError
			if !errors.Is(err, propagate.ErrStepSize) || !errors.As(err, &se) {
				t.Fatalf("err = %v, want ErrStepSize in a *StepError", err)
			}
			if math.Abs(se.T-tFall) > 1e-3 { // s
				t.Errorf("stopped at t = %.6f s, free-fall time %.6f s", se.T, tFall)
			}
			if r := math.Sqrt(se.State.R[0]*se.State.R[0] + se.State.R[1]*se.State.R[1] + se.State.R[2]*se.State.R[2]); !(r < 1) {
				t.Errorf("stopped at r = %g km, want near 0", r)
			}
			t.Logf("%v", err)
		})
	}
}

var errTest = errors.New("test: callback error")

func TestErrors(t *testing.T) {
	good := conicState(earthMu, 7000, 0, 51.6, 0, 0, 0)
	for _, tc := range []struct {
		name string
		m    propagate.Model
		opt  propagate.Options
		want error
	}{
		{"mu zero", propagate.PointMass(0), propagate.Options{}, propagate.ErrModel},
		{"radius zero", propagate.J2(earthMu, 0, 1e-3), propagate.Options{}, propagate.ErrModel},
		{"degree 7", propagate.Zonal(earthMu, earthRe, make([]float64, 8), 7), propagate.Options{}, propagate.ErrModel},
		{"too few J", propagate.Zonal(earthMu, earthRe, []float64{0, 0, 1e-3}, 4), propagate.Options{}, propagate.ErrModel},
		{"polar with J2", propagate.J2(earthMu, earthRe, earthJ2), propagate.Options{Equations: propagate.EnginePolar}, propagate.ErrModel},
		{"rtol too small", propagate.PointMass(earthMu), propagate.Options{RelTol: 1e-16}, propagate.ErrOptions},
		{"rtol too large", propagate.PointMass(earthMu), propagate.Options{RelTol: 0.1}, propagate.ErrOptions},
		{"atol negative", propagate.PointMass(earthMu), propagate.Options{AbsTol: -1}, propagate.ErrOptions},
		{"max steps negative", propagate.PointMass(earthMu), propagate.Options{MaxSteps: -1}, propagate.ErrOptions},
		{"equations unknown", propagate.PointMass(earthMu), propagate.Options{Equations: 9}, propagate.ErrOptions},
	} {
		if _, err := propagate.New(tc.m, tc.opt); !errors.Is(err, tc.want) {
			t.Errorf("%s: New err = %v, want %v", tc.name, err, tc.want)
		}
	}
	prop, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{})
	for _, tc := range []struct {
		name string
		s    orbit.State
		span float64
		out  *propagate.Output
		want error
	}{
		{"NaN state", orbit.State{R: [3]float64{math.NaN(), 0, 0}}, 10, nil, propagate.ErrState},
		{"origin", orbit.State{V: [3]float64{1, 0, 0}}, 10, nil, propagate.ErrState},
		{"NaN span", good, math.NaN(), nil, propagate.ErrSpan},
		{"infinite span", good, math.Inf(1), nil, propagate.ErrSpan},
		{"negative step", good, 10, &propagate.Output{Step: -1}, propagate.ErrSpan},
		{"custom event without G", good, 10, &propagate.Output{Events: []propagate.Event{{Kind: propagate.Custom}}}, propagate.ErrOptions},
		{"bad direction", good, 10, &propagate.Output{Events: []propagate.Event{{Kind: propagate.Custom, Direction: 2, G: func(float64, orbit.State) float64 { return 1 }}}}, propagate.ErrOptions},
		{"altitude without radius", good, 10, &propagate.Output{Events: []propagate.Event{{Kind: propagate.Altitude}}}, propagate.ErrOptions},
		{"unknown event kind", good, 10, &propagate.Output{Events: []propagate.Event{{Kind: 42}}}, propagate.ErrOptions},
		{"callback error", good, 100, &propagate.Output{Step: 10, OnState: func(float64, orbit.State) error { return errTest }}, errTest},
	} {
		if _, err := prop.Run(tc.s, tc.span, tc.out); !errors.Is(err, tc.want) {
			t.Errorf("%s: Run err = %v, want %v", tc.name, err, tc.want)
		}
	}
	few, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{MaxSteps: 5})
	if _, err := few.Run(good, day, nil); !errors.Is(err, propagate.ErrMaxSteps) {
		t.Errorf("MaxSteps 5 over a day: err = %v, want ErrMaxSteps", err)
	}
	// a perturbation's error stops the run, wrapped with time and state
	failing := propagate.PointMass(earthMu)
	failing.Perturbation = func(tt float64, _ orbit.State) ([3]float64, error) {
		if tt > 100 {
			return [3]float64{}, errTest
		}
		return [3]float64{}, nil
	}
	for _, eq := range []propagate.Equations{propagate.FastPath, propagate.Engine} {
		fp, _ := propagate.New(failing, propagate.Options{Equations: eq})
		_, err := fp.Run(good, 1000, nil)
		var se *propagate.StepError
		if !errors.Is(err, errTest) || !errors.As(err, &se) || se.T > 100 {
			t.Errorf("%v: failing perturbation err = %v, want errTest in a StepError before 100 s", eq, err)
		}
	}
}

// TestPerturbation: a constant along-track thrust is the same whether it
// enters the fast path as an added acceleration or the engine as the
// generalized force of the Cartesian coordinates; and it changes the
// energy at the rate a.v (work-energy theorem), checked over a short arc.
func TestPerturbation(t *testing.T) {
	s0 := conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0)
	const acc = 1e-6 // km/s^2, along the velocity
	m := propagate.PointMass(earthMu)
	m.Perturbation = func(_ float64, s orbit.State) ([3]float64, error) {
		v := math.Sqrt(s.V[0]*s.V[0] + s.V[1]*s.V[1] + s.V[2]*s.V[2])
		return [3]float64{acc * s.V[0] / v, acc * s.V[1] / v, acc * s.V[2] / v}, nil
	}
	var final [2]orbit.State
	for i, eq := range []propagate.Equations{propagate.FastPath, propagate.Engine} {
		p, err := propagate.New(m, propagate.Options{RelTol: 1e-12, Equations: eq})
		if err != nil {
			t.Fatal(err)
		}
		if final[i], err = p.Propagate(s0, 3000); err != nil {
			t.Fatal(err)
		}
	}
	if d := dist(final[0].R, final[1].R); d > 1e-6 {
		t.Errorf("fast path and engine differ by %.3g km with a perturbation", d)
	}
	// energy gained = integral of a v dt = acc * path length; on a near
	// circular orbit the path length is |v| t to first order
	p, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{})
	gain := p.Energy(final[0]) - p.Energy(s0)
	v0 := math.Sqrt(earthMu / (earthRe + 500))
	if want := acc * v0 * 3000; math.Abs(gain-want) > 1e-3*want {
		t.Errorf("energy gained %.6g km^2/s^2, want about a v t = %.6g", gain, want)
	}
}

// TestBackward: propagating forwards then backwards returns to the start,
// and a negative span matches the analytic solution at negative times.
func TestBackward(t *testing.T) {
	s0 := conicState(earthMu, 7000*1.3, 0.3, 63.4, 10, 20, 30)
	for _, eq := range []propagate.Equations{propagate.FastPath, propagate.EnginePolar} {
		p, _ := propagate.New(propagate.PointMass(earthMu), propagate.Options{RelTol: 1e-13, Equations: eq})
		back, err := p.Propagate(s0, -day)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := orbit.Propagate(earthMu, s0, -day)
		if d := dist(back.R, want.R); d > 1e-6 { // km: 1 mm per day budget
			t.Errorf("%v: backward one day off the analytic state by %.3g km", eq, d)
		}
		again, _ := p.Propagate(back, day)
		if d := dist(again.R, s0.R); d > 2e-6 {
			t.Errorf("%v: forward-backward round trip off by %.3g km", eq, d)
		}
	}
}
