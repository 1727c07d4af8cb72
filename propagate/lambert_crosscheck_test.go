package propagate_test

import (
	"math"
	"testing"

	"centra/orbit"
	"centra/orbit/lambert"
	"centra/propagate"
)

// The Lambert solver and the numerical integrator are independent: the
// solver inverts the two-body time-of-flight equation (Izzo 2015), the
// propagator integrates the Euler-Lagrange equations of the point-mass
// Lagrangian with DOP853. Flying the Lambert v1 from r1 for the time of
// flight must reach r2 (to 1 m) with the Lambert v2 (to 1 mm/s), for direct,
// retrograde, hyperbolic and multi-revolution transfers on both branches.
// The geometries are those of the textbook and reference cases of
// testdata/transfer (Vallado 4th ed. Ex. 7-5, Curtis 3rd ed. Ex. 5.2,
// both from memory; the others invented), each also run with the
// engine-derived equations.
func TestLambertPropagatorCrossCheck(t *testing.T) {
	const (
		muV      = 398600.4418 // km^3/s^2, WGS 84 (Vallado's examples, from memory)
		muC      = 398600.0    // km^3/s^2, Curtis's examples (from memory)
		tolKm    = 1e-3        // 1 m
		tolKmS   = 1e-6        // 1 mm/s
		relTol   = 1e-13       // integrator tolerance: tight, far below tolKm
		multiR2x = -1389.1854213354425
	)
	multiR2 := [3]float64{multiR2x, 6302.769619278131, 4727.077214458598}
	tests := []struct {
		name   string
		mu     float64
		r1, r2 [3]float64
		tof    float64
		opts   lambert.Options
	}{
		{"vallado-7-5", muV, [3]float64{15945.34, 0, 0}, [3]float64{12214.83899, 10249.46731, 0}, 76 * 60, lambert.Options{}},
		{"curtis-5-2", muC, [3]float64{5000, 10000, 2100}, [3]float64{-14600, 2500, 7000}, 3600, lambert.Options{}},
		{"curtis-5-2-retrograde", muC, [3]float64{5000, 10000, 2100}, [3]float64{-14600, 2500, 7000}, 3600, lambert.Options{Retrograde: true}},
		{"curtis-5-2-hyperbolic", muC, [3]float64{5000, 10000, 2100}, [3]float64{-14600, 2500, 7000}, 900, lambert.Options{}},
		{"near-180", muV, [3]float64{7000, 0, 0}, [3]float64{-9000, 1e-3, 0}, 3960, lambert.Options{}},
		{"polar-plane", muV, [3]float64{7000, 0, 0}, [3]float64{0, 0, 8000}, 2000, lambert.Options{}},
		{"multi-1-left", muV, [3]float64{7000, 0, 0}, multiR2, 5 * 3600, lambert.Options{Revs: 1, Branch: lambert.Left}},
		{"multi-1-right", muV, [3]float64{7000, 0, 0}, multiR2, 5 * 3600, lambert.Options{Revs: 1, Branch: lambert.Right}},
		{"multi-2-left", muV, [3]float64{7000, 0, 0}, multiR2, 5 * 3600, lambert.Options{Revs: 2, Branch: lambert.Left}},
		{"multi-2-right", muV, [3]float64{7000, 0, 0}, multiR2, 5 * 3600, lambert.Options{Revs: 2, Branch: lambert.Right}},
		{"multi-3-right-retrograde", muV, [3]float64{-6500, 2000, 1000}, [3]float64{4000, 9000, -3000}, 12 * 3600, lambert.Options{Revs: 3, Branch: lambert.Right, Retrograde: true}},
	}
	for _, eq := range []propagate.Equations{propagate.FastPath, propagate.Engine} {
		for _, tt := range tests {
			t.Run(eq.String()+"/"+tt.name, func(t *testing.T) {
				v1, v2, err := lambert.Solve(tt.mu, tt.r1, tt.r2, tt.tof, tt.opts)
				if err != nil {
					t.Fatalf("Solve: %v", err)
				}
				p, err := propagate.New(propagate.PointMass(tt.mu), propagate.Options{RelTol: relTol, Equations: eq})
				if err != nil {
					t.Fatal(err)
				}
				end, err := p.Propagate(orbit.State{R: tt.r1, V: v1}, tt.tof)
				if err != nil {
					t.Fatalf("Propagate: %v", err)
				}
				if d := lambertMiss(end.R, tt.r2); d > tolKm {
					t.Errorf("propagated Lambert v1 ends %.3g km from r2 (tolerance %g km)", d, tolKm)
				}
				if d := lambertMiss(end.V, v2); d > tolKmS {
					t.Errorf("propagated velocity differs from the Lambert v2 by %.3g km/s (tolerance %g)", d, tolKmS)
				}
				t.Logf("miss %.2g km, |dv2| %.2g km/s", lambertMiss(end.R, tt.r2), lambertMiss(end.V, v2))
			})
		}
	}
}

func lambertMiss(a, b [3]float64) float64 {
	return math.Sqrt((a[0]-b[0])*(a[0]-b[0]) + (a[1]-b[1])*(a[1]-b[1]) + (a[2]-b[2])*(a[2]-b[2]))
}
