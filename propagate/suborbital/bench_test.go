package suborbital_test

import (
	"testing"

	"centra/propagate/suborbital"
)

// benchmarkFly flies the arc of dispersionSetup (burnout 35 km, 2 km/s,
// 82 deg, apogee ~ 225 km) with vehicle v and reports the integration
// steps and evaluations of one flight.
func benchmarkFly(b *testing.B, v suborbital.Vehicle) {
	cfg, bo, _ := dispersionSetup()
	f, err := suborbital.New(cfg)
	if err != nil {
		b.Fatal(err)
	}
	arc, err := f.Fly(bo, v, nil)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := f.Fly(bo, v, nil); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(arc.Stats.Steps), "steps")
	b.ReportMetric(float64(arc.Stats.Rejected), "rejected")
	b.ReportMetric(float64(arc.Stats.Evaluations), "evals")
}

// BenchmarkFlyVacuum: one vacuum arc to impact (target <= 0.5 ms).
func BenchmarkFlyVacuum(b *testing.B) { benchmarkFly(b, suborbital.Vehicle{}) }

// BenchmarkFlyDrag: the same arc with drag.
func BenchmarkFlyDrag(b *testing.B) {
	_, _, v := dispersionSetup()
	benchmarkFly(b, v)
}

// BenchmarkDisperse10000Drag: 10,000 dispersed arcs with drag on all
// cores (target <= 5 s on two cores).
func BenchmarkDisperse10000Drag(b *testing.B) {
	cfg, bo, v := dispersionSetup()
	d := suborbital.Dispersion{Cases: 10000, Seed: 1, Sigma: suborbital.Sigma{Speed: 0.01, FlightPath: 0.5 * deg, Azimuth: 1 * deg, Cd: 0.05}}
	for b.Loop() {
		if _, err := suborbital.Disperse(cfg, bo, v, d); err != nil {
			b.Fatal(err)
		}
	}
}
