package trajectory_test

import (
	"fmt"
	"math"
	"testing"

	"centra/propagate/trajectory"
)

// Windows of functions whose positive intervals are known in closed
// form: sin t > c has roots asin(c) + 2k pi and pi - asin(c) + 2k pi;
// a - (t - m)^2 > 0 on m +- sqrt(a).
func TestWindows(t *testing.T) {
	const tol = 1e-9 // s
	type win struct {
		a, b        float64
		from, toEnd bool
	}
	tests := []struct {
		name   string
		f      func(float64) float64
		t0, t1 float64
		step   float64
		want   []win
	}{
		{"sine above 0.5", func(x float64) float64 { return math.Sin(x) - 0.5 }, 0, 4 * math.Pi, 0.3,
			[]win{{math.Pi / 6, 5 * math.Pi / 6, false, false}, {2*math.Pi + math.Pi/6, 2*math.Pi + 5*math.Pi/6, false, false}}},
		{"cut at both ends", func(x float64) float64 { return math.Cos(x) }, -1, 2*math.Pi + 1, 0.25,
			[]win{{-1, math.Pi / 2, true, false}, {3 * math.Pi / 2, 2*math.Pi + 1, false, true}}},
		{"always positive", func(float64) float64 { return 1 }, 0, 10, 1, []win{{0, 10, true, true}}},
		{"never positive", func(x float64) float64 { return -1 - x*x }, -3, 3, 1, nil},
		// A window of 0.063 s between samples 1 s apart: found through the
		// local maximum of the samples.
		{"hidden bump", func(x float64) float64 { return 0.001 - (x-5.3)*(x-5.3) }, 0, 10, 1,
			[]win{{5.3 - math.Sqrt(0.001), 5.3 + math.Sqrt(0.001), false, false}}},
		// A bump in the first interval, next to the start.
		{"hidden bump at start", func(x float64) float64 { return 0.001 - (x-0.2)*(x-0.2) }, 0, 10, 1,
			[]win{{0.2 - math.Sqrt(0.001), 0.2 + math.Sqrt(0.001), false, false}}},
		// A short dip below zero between positive samples splits a window.
		{"hidden dip", func(x float64) float64 { return (x-5.3)*(x-5.3) - 0.001 }, 0, 10, 1,
			[]win{{0, 5.3 - math.Sqrt(0.001), true, false}, {5.3 + math.Sqrt(0.001), 10, false, true}}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := trajectory.Windows(tt.f, tt.t0, tt.t1, tt.step, tol)
			if len(got) != len(tt.want) {
				t.Fatalf("Windows = %v, want %v", got, tt.want)
			}
			for i, w := range tt.want {
				g := got[i]
				// Bisection returns the midpoint of a bracket of at most tol.
				if math.Abs(g.Start-w.a) > tol || math.Abs(g.End-w.b) > tol || g.FromStart != w.from || g.ToEnd != w.toEnd {
					t.Errorf("window %d = %+v, want [%v, %v] from %v to end %v", i, g, w.a, w.b, w.from, w.toEnd)
				}
			}
		})
	}
}

// The maximum of a parabola and of sin on a wide interval.
func TestMaximize(t *testing.T) {
	const tol = 1e-7
	tm, fm := trajectory.Maximize(func(x float64) float64 { return 3 - (x-1.234567)*(x-1.234567) }, -10, 10, 0.5, tol)
	// Golden-section search brackets the argument to tol; the value of a
	// parabola is then within tol^2 of 3.
	if math.Abs(tm-1.234567) > tol || math.Abs(fm-3) > 1e-12 {
		t.Errorf("Maximize parabola = %v, %v; want 1.234567, 3", tm, fm)
	}
	tm, fm = trajectory.Maximize(math.Sin, 0, 3, 0.1, tol)
	if math.Abs(tm-math.Pi/2) > 1e-6 || math.Abs(fm-1) > 1e-12 {
		t.Errorf("Maximize sin = %v, %v; want pi/2, 1", tm, fm)
	}
	// A maximum at the end of the interval.
	tm, fm = trajectory.Maximize(func(x float64) float64 { return x }, 0, 7, 1, tol)
	if tm != 7 || fm != 7 {
		t.Errorf("Maximize identity = %v, %v; want 7, 7", tm, fm)
	}
}

func TestRootPanicsWithoutSignChange(t *testing.T) {
	defer func() {
		if recover() == nil {
			t.Error("Root without a sign change did not panic")
		}
	}()
	trajectory.Root(math.Sin, 0.1, 0.2, math.Sin(0.1), math.Sin(0.2), 1e-9)
}

func ExampleWindows() {
	// Where is sin t above 1/2 during two turns?
	ws := trajectory.Windows(func(t float64) float64 { return math.Sin(t) - 0.5 }, 0, 4*math.Pi, 0.1, 1e-9)
	for _, w := range ws {
		fmt.Printf("%.6f .. %.6f (%.6f)\n", w.Start, w.End, w.Duration())
	}
	// Output:
	// 0.523599 .. 2.617994 (2.094395)
	// 6.806784 .. 8.901179 (2.094395)
}
