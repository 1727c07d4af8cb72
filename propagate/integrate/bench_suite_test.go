package integrate

import (
	"fmt"
	"math"
	"testing"
)

// Work-precision of DOP853: the error reached against the evaluations
// spent, at tolerances 1e-6 .. 1e-13 (RelTol = AbsTol = tol), on two
// periodic problems whose exact solution after one period is the initial
// value:
//
//   - the Arenstorf orbit (Hairer, Norsett & Wanner, Solving ODEs I, 2nd
//     ed., Section II.0, eqs. (0.1)-(0.2) and the period after them);
//   - a Kepler ellipse of eccentricity 0.9, mu = 1, a = 1, started at
//     periapsis r = (1-e, 0), v = (0, sqrt((1+e)/(1-e))) (vis-viva), whose
//     period is 2 pi (Kepler's third law, T = 2 pi sqrt(a^3/mu)).
//
// The error is |y(T) - y(0)| / |y(0)| (Euclidean norms).

type wpProblem struct {
	name string
	f    Func
	y0   []float64
	t    float64
}

const keplerE = 0.9

func kepler(dst []float64, _ float64, y []float64) error {
	r2 := y[0]*y[0] + y[1]*y[1]
	k := -1 / (r2 * math.Sqrt(r2))
	dst[0], dst[1], dst[2], dst[3] = y[2], y[3], k*y[0], k*y[1]
	return nil
}

func wpProblems() []wpProblem {
	return []wpProblem{
		{"arenstorf", arenstorf, arenstorfY0, arenstorfT},
		{"kepler-e0.9", kepler, []float64{1 - keplerE, 0, 0, math.Sqrt((1 + keplerE) / (1 - keplerE))}, 2 * math.Pi},
	}
}

// wpTolerances are the tolerances of the curve, 1e-6 .. 1e-13.
var wpTolerances = []float64{1e-6, 1e-7, 1e-8, 1e-9, 1e-10, 1e-11, 1e-12, 1e-13}

type wpPoint struct {
	tol   float64
	evals int
	steps int
	err   float64 // relative
}

func workPrecision(tb testing.TB, p wpProblem) []wpPoint {
	var pts []wpPoint
	y := make([]float64, len(p.y0))
	for _, tol := range wpTolerances {
		s, err := New(len(p.y0), p.f, Settings{RelTol: tol, AbsTol: tol})
		if err != nil {
			tb.Fatal(err)
		}
		if _, err := s.Integrate(y, 0, p.y0, p.t, nil); err != nil {
			tb.Fatalf("%s at tol %g: %v", p.name, tol, err)
		}
		var d2, n2 float64
		for i := range y {
			d2 += (y[i] - p.y0[i]) * (y[i] - p.y0[i])
			n2 += p.y0[i] * p.y0[i]
		}
		st := s.Stats()
		pts = append(pts, wpPoint{tol, st.Evaluations, st.Steps, math.Sqrt(d2 / n2)})
	}
	return pts
}

// plateauFloor is the relative error below which rounding may stop the
// error from falling (the bound: no plateau above 1e-12).
const plateauFloor = 1e-12

// conditioningFloor is the error that the problem itself puts on y(T) in
// double precision: the largest relative change of y(T) when one
// component of y(0) moves by one unit in the last place (at tol 1e-13).
// The Arenstorf orbit passes close to the Moon and amplifies it to about
// 3e-10, so no float64 integration can show its error below that against
// the periodic solution; the e = 0.9 ellipse to about 2e-12 (a change of
// energy changes the period, and the phase drifts).
func conditioningFloor(tb testing.TB, p wpProblem) float64 {
	run := func(y0 []float64) []float64 {
		s, err := New(len(y0), p.f, Settings{RelTol: 1e-13, AbsTol: 1e-13})
		if err != nil {
			tb.Fatal(err)
		}
		y := make([]float64, len(y0))
		if _, err := s.Integrate(y, 0, y0, p.t, nil); err != nil {
			tb.Fatal(err)
		}
		return y
	}
	base := run(p.y0)
	var n2, worst float64
	for _, v := range p.y0 {
		n2 += v * v
	}
	for i := range p.y0 {
		y0 := append([]float64(nil), p.y0...)
		y0[i] = math.Nextafter(y0[i], math.Inf(1))
		y := run(y0)
		var d2 float64
		for k := range y {
			d2 += (y[k] - base[k]) * (y[k] - base[k])
		}
		worst = math.Max(worst, math.Sqrt(d2/n2))
	}
	return worst
}

// TestWorkPrecision checks that the curve is monotone: the evaluations
// rise at every tighter tolerance and, while the error is above the floor,
// it falls at every tighter tolerance and by at least 10x over every two
// decades (a plateau, an error no longer governed by the tolerance, fails
// that; tolerance proportionality gives about 100x). The floor is
// 1e-12 relative, or three times the problem's own conditioning floor
// where that is higher (errors that close to it scatter: every step's
// rounding is amplified like the initial one). It logs the curve
// (go test -run WorkPrecision -v).
func TestWorkPrecision(t *testing.T) {
	for _, p := range wpProblems() {
		t.Run(p.name, func(t *testing.T) {
			pts := workPrecision(t, p)
			cond := conditioningFloor(t, p)
			floor := math.Max(plateauFloor, 3*cond)
			t.Logf("conditioning floor %.3g (1 ulp in y0), checked down to %.3g", cond, floor)
			t.Logf("%-12s %8s %6s %10s", "tol", "evals", "steps", "rel_error")
			for _, q := range pts {
				t.Logf("%-12g %8d %6d %10.3e", q.tol, q.evals, q.steps, q.err)
			}
			for k := 1; k < len(pts); k++ {
				a, b := pts[k-1], pts[k]
				if b.evals <= a.evals {
					t.Errorf("tol %g: %d evaluations, not more than %d at tol %g", b.tol, b.evals, a.evals, a.tol)
				}
				if a.err > floor && b.err > floor && !(b.err < a.err) {
					t.Errorf("not monotone: error %.3e at tol %g, %.3e at tol %g", b.err, b.tol, a.err, a.tol)
				}
				if k >= 2 {
					if c := pts[k-2]; c.err > floor && b.err > floor && !(10*b.err <= c.err) {
						t.Errorf("plateau: error %.3e at tol %g, %.3e at tol %g (want 10x smaller over two decades above %.3g)", b.err, b.tol, c.err, c.tol, floor)
					}
				}
			}
			if last := pts[len(pts)-1]; last.err > math.Max(floor, 1e-9) {
				t.Errorf("error %.3e at tol %g: the curve stops above the floor %.3g", last.err, last.tol, floor)
			}
		})
	}
}

// BenchmarkWorkPrecision reports, per problem and tolerance, the time, the
// evaluations and the relative error reached (metric log10_rel_err).
func BenchmarkWorkPrecision(b *testing.B) {
	for _, p := range wpProblems() {
		for _, tol := range wpTolerances {
			b.Run(fmt.Sprintf("%s/tol=%g", p.name, tol), func(b *testing.B) {
				s, err := New(len(p.y0), p.f, Settings{RelTol: tol, AbsTol: tol})
				if err != nil {
					b.Fatal(err)
				}
				y := make([]float64, len(p.y0))
				b.ReportAllocs()
				for b.Loop() {
					if _, err := s.Integrate(y, 0, p.y0, p.t, nil); err != nil {
						b.Fatal(err)
					}
				}
				var d2, n2 float64
				for i := range y {
					d2 += (y[i] - p.y0[i]) * (y[i] - p.y0[i])
					n2 += p.y0[i] * p.y0[i]
				}
				b.ReportMetric(float64(s.Stats().Evaluations), "evals")
				// Go prints metrics below 1 with few decimals: report the
				// exponent (-9.3 is a relative error of 5e-10).
				b.ReportMetric(math.Log10(math.Sqrt(d2/n2)), "log10_rel_err")
			})
		}
	}
}
