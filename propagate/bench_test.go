package propagate_test

import (
	"testing"

	"centra/orbit"
	"centra/propagate"
)

// benchmarkLEODay propagates one day of the 500 km, 51.6 deg orbit of the
// SciPy reference (testdata/propagate/j2_reference.json) with J2 and
// reports steps, evaluations, allocations per step and the final position
// error against the reference (SciPy DOP853 at rtol 1e-13).
func benchmarkLEODay(b *testing.B, opt propagate.Options) {
	ref := loadReference(b)
	c := ref.Cases[0]
	s0 := stateOf(c.State0)
	last := c.States[len(c.States)-1]
	prop, err := propagate.New(propagate.J2(ref.Mu, ref.Re, ref.J2), opt)
	if err != nil {
		b.Fatal(err)
	}
	res, err := prop.Run(s0, ref.Span, nil)
	if err != nil {
		b.Fatal(err)
	}
	errM := dist(res.State.R, [3]float64{last[1], last[2], last[3]}) * 1e3
	allocs := testing.AllocsPerRun(3, func() { _, _ = prop.Run(s0, ref.Span, nil) })
	b.ReportAllocs()
	for b.Loop() {
		if _, err := prop.Run(s0, ref.Span, nil); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(res.Stats.Steps), "steps")
	b.ReportMetric(float64(res.Stats.Evaluations), "evals")
	b.ReportMetric(allocs/float64(res.Stats.Steps), "allocs/step")
	b.ReportMetric(errM, "err_m")
}

func BenchmarkLEODayJ2(b *testing.B) {
	b.Run("rtol=1e-10", func(b *testing.B) { benchmarkLEODay(b, propagate.Options{RelTol: 1e-10}) })
	b.Run("rtol=1e-10,atol=1e-6", func(b *testing.B) { benchmarkLEODay(b, propagate.Options{RelTol: 1e-10, AbsTol: 1e-6}) })
	b.Run("rtol=1e-12", func(b *testing.B) { benchmarkLEODay(b, propagate.Options{RelTol: 1e-12}) })
	b.Run("engine,rtol=1e-10", func(b *testing.B) { benchmarkLEODay(b, propagate.Options{RelTol: 1e-10, Equations: propagate.Engine}) })
}

// BenchmarkStream is one day at 10 s output (8,641 rows) with J2.
func BenchmarkStream(b *testing.B) {
	s0 := conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0)
	prop, _ := propagate.New(propagate.J2(earthMu, earthRe, earthJ2), propagate.Options{})
	rows := 0
	out := &propagate.Output{Step: 10, OnState: func(float64, orbit.State) error { rows++; return nil }}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := prop.Run(s0, day, out); err != nil {
			b.Fatal(err)
		}
	}
}
