package forces_test

import (
	"testing"

	"centra/bodies"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
)

// leoModel is a 400 km, 51.6 deg orbit with zonal J2..J4, drag (B = 50
// kg/m^2, co-rotating atmosphere), the Sun and the Moon, starting at epoch.
func leoModel(tb testing.TB) (propagate.Model, orbit.State) {
	tb.Helper()
	e, err := bodies.Lookup("earth")
	if err != nil {
		tb.Fatal(err)
	}
	sunB, _ := bodies.Lookup("sun")
	moonB, _ := bodies.Lookup("moon")
	ep := timescale.MustParseUTC("2027-04-12T09:30:00Z")
	drag, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: 50, RotationRate: e.RotationRate})
	if err != nil {
		tb.Fatal(err)
	}
	sun := &forces.ThirdBody{Name: "sun", GM: sunB.GM, Position: forces.NewSunEphemeris(ep).Position}
	moon := &forces.ThirdBody{Name: "moon", GM: moonB.GM, Position: forces.NewMoonEphemeris(ep).Position}
	m := propagate.Zonal(e.GM, e.EquatorialRadius, []float64{0, 0, e.Jn(2), e.Jn(3), e.Jn(4)}, 4)
	m.Perturbation = forces.Combine(drag.Perturbation(), sun.Perturbation(), moon.Perturbation())
	a := e.EquatorialRadius + 400
	s0, _ := orbit.StateFromElements(e.GM, orbit.Elements{A: a, P: a, I: 51.6 * deg, RAAN: 0.5, Nu: 0.2})
	return m, s0
}

// BenchmarkLEODayPerturbed is one day of the 400 km orbit of leoModel at
// the tolerance that keeps the final position within 1 m of a run at
// rtol 1e-13 (err_m reports it).
func BenchmarkLEODayPerturbed(b *testing.B) {
	for _, tc := range []struct {
		name string
		rtol float64
	}{{"rtol=1e-10", 1e-10}, {"rtol=1e-9", 1e-9}} {
		b.Run(tc.name, func(b *testing.B) {
			m, s0 := leoModel(b)
			ref, err := propagate.New(m, propagate.Options{RelTol: 1e-13})
			if err != nil {
				b.Fatal(err)
			}
			want, err := ref.Propagate(s0, 86400)
			if err != nil {
				b.Fatal(err)
			}
			p, err := propagate.New(m, propagate.Options{RelTol: tc.rtol})
			if err != nil {
				b.Fatal(err)
			}
			res, err := p.Run(s0, 86400, nil)
			if err != nil {
				b.Fatal(err)
			}
			errM := norm(sub(res.State.R, want.R)) * 1000
			b.ReportAllocs()
			for b.Loop() {
				if _, err := p.Run(s0, 86400, nil); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(res.Stats.Steps), "steps")
			b.ReportMetric(errM, "err_m")
		})
	}
}

// BenchmarkAccelerations times one evaluation of each force.
func BenchmarkAccelerations(b *testing.B) {
	m, s0 := leoModel(b)
	b.Run("combined", func(b *testing.B) {
		for b.Loop() {
			_, _ = m.Perturbation(100, s0)
		}
	})
	b.Run("third-body", func(b *testing.B) {
		s := [3]float64{1.4e8, 3e7, 1e7}
		for b.Loop() {
			_ = forces.ThirdBodyAcceleration(1.3271244e11, s0.R, s)
		}
	})
}
