package propagate_test

import (
	"math"
	"testing"

	"centra/orbit"
	"centra/propagate"
)

// TestStreamingMemory: a run streams its rows and stores nothing, so the
// allocations of a run do not grow with its length or its number of rows
// (8,641 rows for one day at 10 s, 86,401 for ten days), and none happen
// per step.
func TestStreamingMemory(t *testing.T) {
	s0 := conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0)
	for _, eq := range []propagate.Equations{propagate.FastPath, propagate.Engine} {
		t.Run(eq.String(), func(t *testing.T) {
			prop, _ := propagate.New(propagate.J2(earthMu, earthRe, earthJ2), propagate.Options{Equations: eq})
			rows := 0
			var sum float64
			out := &propagate.Output{
				Step:    10,
				OnState: func(_ float64, s orbit.State) error { rows++; sum += s.R[0]; return nil },
				Events:  []propagate.Event{{Kind: propagate.AscendingNode}, {Kind: propagate.Periapsis}},
				OnEvent: func(propagate.EventHit) error { return nil },
			}
			measure := func(span float64) (allocs float64, steps int) {
				var res propagate.Result
				allocs = testing.AllocsPerRun(3, func() {
					var err error
					if res, err = prop.Run(s0, span, out); err != nil {
						t.Fatal(err)
					}
				})
				return allocs, res.Stats.Steps
			}
			a1, n1 := measure(day)
			a10, n10 := measure(10 * day)
			t.Logf("allocations per run: %v for 1 day (%d steps), %v for 10 days (%d steps); rows %d", a1, n1, a10, n10, rows)
			if a10 != a1 || n10 < 5*n1 {
				t.Errorf("allocations grow with the span: %v (1 day) vs %v (10 days)", a1, a10)
			}
			if a1 > 20 {
				t.Errorf("%v allocations per run, want a handful", a1)
			}
			if math.IsNaN(sum) {
				t.Error("NaN in streamed states")
			}
		})
	}
}
