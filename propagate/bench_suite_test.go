package propagate_test

import (
	"testing"

	"centra/orbit"
	"centra/propagate"
)

// The benchmark suite of the propagator: one day (and ten) of the 500 km,
// 51.6 deg LEO per force model and way of evaluating the equations, the
// 0.7-eccentricity orbit of the SciPy comparison (testdata/bench), and a
// day with fixed-step output and events. Each reports the work per run
// (evals, steps), the time per step and the allocations per step.

// benchCase is one propagation of the suite.
type benchCase struct {
	name  string
	model propagate.Model
	opt   propagate.Options
	s0    orbit.State
	span  float64 // s
}

func suiteCases() []benchCase {
	leo := conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0)
	// e = 0.7 with periapsis at 500 km altitude: p = rp (1 + e)
	ecc := conicState(earthMu, (earthRe+500)*1.7, 0.7, 63.4, 30, 270, 0)
	point := propagate.PointMass(earthMu)
	j2 := propagate.J2(earthMu, earthRe, earthJ2)
	zonal := propagate.Zonal(earthMu, earthRe, egm2008J(), 6)
	return []benchCase{
		{"point/1d", point, propagate.Options{}, leo, day},
		{"j2/1d", j2, propagate.Options{}, leo, day},
		{"zonal6/1d", zonal, propagate.Options{}, leo, day},
		{"engine-j2/1d", j2, propagate.Options{Equations: propagate.Engine}, leo, day},
		{"engine-polar/1d", point, propagate.Options{Equations: propagate.EnginePolar}, leo, day},
		{"point/10d", point, propagate.Options{}, leo, 10 * day},
		{"j2/10d", j2, propagate.Options{}, leo, 10 * day},
		{"point-e0.7/1d", point, propagate.Options{}, ecc, day},
		{"j2/1d/rtol=1e-12", j2, propagate.Options{RelTol: 1e-12}, leo, day},
	}
}

func BenchmarkPropagate(b *testing.B) {
	for _, c := range suiteCases() {
		b.Run(c.name, func(b *testing.B) {
			p, err := propagate.New(c.model, c.opt)
			if err != nil {
				b.Fatal(err)
			}
			res, err := p.Run(c.s0, c.span, nil)
			if err != nil {
				b.Fatal(err)
			}
			allocs := testing.AllocsPerRun(2, func() { _, _ = p.Run(c.s0, c.span, nil) })
			b.ReportAllocs()
			for b.Loop() {
				if _, err := p.Run(c.s0, c.span, nil); err != nil {
					b.Fatal(err)
				}
			}
			steps := float64(res.Stats.Steps)
			b.ReportMetric(float64(res.Stats.Evaluations), "evals")
			b.ReportMetric(steps, "steps")
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/steps, "ns/step")
			b.ReportMetric(allocs/steps, "allocs/step")
		})
	}
}

// BenchmarkPropagateEvents is a J2 day with a state every 60 s and the
// apsis and node events, as 'ephemeris' and 'passes' run it.
func BenchmarkPropagateEvents(b *testing.B) {
	s0 := conicState(earthMu, (earthRe+500)*1.01, 0.01, 51.6, 30, 0, 0)
	p, err := propagate.New(propagate.J2(earthMu, earthRe, earthJ2), propagate.Options{})
	if err != nil {
		b.Fatal(err)
	}
	rows, hits := 0, 0
	out := &propagate.Output{
		Step:    60,
		OnState: func(float64, orbit.State) error { rows++; return nil },
		Events:  []propagate.Event{{Kind: propagate.Periapsis}, {Kind: propagate.Apoapsis}, {Kind: propagate.AscendingNode}, {Kind: propagate.DescendingNode}},
		OnEvent: func(propagate.EventHit) error { hits++; return nil },
	}
	b.ReportAllocs()
	for b.Loop() {
		rows, hits = 0, 0
		if _, err := p.Run(s0, day, out); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(rows), "rows")
	b.ReportMetric(float64(hits), "events")
}

// A run allocates a fixed number of objects at its start and none per
// step, per output row or per event: ten days allocate what one day does.
// (The propagate package's stated goal; see its doc, # Conventions.)
func TestNoAllocationsPerStep(t *testing.T) {
	if testing.Short() {
		t.Skip("allocation counts in -short mode")
	}
	s0 := conicState(earthMu, (earthRe+500)*1.01, 0.01, 51.6, 30, 0, 0)
	out := &propagate.Output{
		Step:    60,
		OnState: func(float64, orbit.State) error { return nil },
		Events:  []propagate.Event{{Kind: propagate.Periapsis}, {Kind: propagate.AscendingNode}},
		OnEvent: func(propagate.EventHit) error { return nil },
	}
	for _, c := range suiteCases()[:5] {
		for _, o := range []*propagate.Output{nil, out} {
			p, err := propagate.New(c.model, c.opt)
			if err != nil {
				t.Fatal(err)
			}
			if _, err := p.Run(s0, day, o); err != nil { // warm up
				t.Fatal(err)
			}
			one := testing.AllocsPerRun(3, func() { _, _ = p.Run(s0, day, o) })
			ten := testing.AllocsPerRun(3, func() { _, _ = p.Run(s0, 10*day, o) })
			res, _ := p.Run(s0, 10*day, o)
			if ten > one {
				t.Errorf("%s (output %v): %v allocations for 10 days, %v for one: %.3g per step over %d extra steps",
					c.name, o != nil, ten, one, (ten-one)/float64(res.Stats.Steps*9/10), res.Stats.Steps*9/10)
			}
		}
	}
}
