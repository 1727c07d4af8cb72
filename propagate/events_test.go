package propagate_test

import (
	"math"
	"sort"
	"testing"

	"centra/orbit"
	"centra/propagate"
)

// keplerTimes returns the times (s, relative to the state at true anomaly
// nu0) in (t0, t1) at which an ellipse of semi-major axis a and
// eccentricity e passes true anomaly nu, from Kepler's equation
// M = E - e sin E (closed form; Kepler's second law).
func keplerTimes(a, e, nu0, nu, t0, t1 float64) []float64 {
	n := math.Sqrt(earthMu / (a * a * a))
	mean := func(nu float64) float64 {
		E := math.Atan2(math.Sqrt(1-e*e)*math.Sin(nu), e+math.Cos(nu))
		return E - e*math.Sin(E)
	}
	period := 2 * math.Pi / n
	dt := math.Mod(mean(nu)-mean(nu0), 2*math.Pi) / n
	var out []float64
	for k := -50; k <= 50; k++ {
		if tt := dt + float64(k)*period; tt > math.Min(t0, t1) && tt < math.Max(t0, t1) {
			out = append(out, tt)
		}
	}
	sort.Float64s(out)
	if t1 < t0 {
		for i, j := 0, len(out)-1; i < j; i, j = i+1, j-1 {
			out[i], out[j] = out[j], out[i]
		}
	}
	return out
}

// TestEventsAgainstKepler locates periapsides, apoapsides, nodes, altitude
// crossings and a custom event on an e = 0.3 orbit and compares their times
// with Kepler's equation.
func TestEventsAgainstKepler(t *testing.T) {
	// The event times differ from Kepler's by the integration error (the
	// along-track error over 3 days at rtol 1e-13 is below 1 mm, so below
	// 2e-7 s at 7 km/s); tolT allows five times that. The location itself,
	// on the dense output, is checked through the state at the event:
	// |z| <= 1e-9 km at a node (2e-10 s at 5 km/s), |r - rx| <= 1e-9 km at
	// an altitude crossing, |r.v|/r <= 1e-11 km/s at an apsis (4e-9 s at
	// rddot = 2.4e-3 km/s^2).
	const tolT = 1e-6 // s
	const rad = math.Pi / 180
	const e, rp, incl, raan, argp, nu0 = 0.3, 7000.0, 51.6, 30.0, 40.0, 30.0
	a := rp / (1 - e)
	p := a * (1 - e*e)
	s0 := conicState(earthMu, p, e, incl, raan, argp, nu0)
	rx := 8000.0 // km: altitude crossing radius
	nux := math.Acos((p/rx - 1) / e)
	for _, tc := range []struct {
		name string
		span float64
		eq   propagate.Equations
	}{
		{"forward fast path", 3 * day, propagate.FastPath},
		{"backward fast path", -3 * day, propagate.FastPath},
		{"forward polar engine", 3 * day, propagate.EnginePolar},
		{"forward Cartesian engine", day, propagate.Engine},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m := propagate.PointMass(earthMu)
			m.Re = earthRe // reference sphere of the altitude events
			prop, _ := propagate.New(m, propagate.Options{RelTol: 1e-13, Equations: tc.eq})
			events := []propagate.Event{
				{Kind: propagate.Periapsis},
				{Kind: propagate.Apoapsis},
				{Kind: propagate.AscendingNode},
				{Kind: propagate.DescendingNode},
				{Kind: propagate.Altitude, Altitude: rx - earthRe, Direction: 1},
				{Kind: propagate.Altitude, Altitude: rx - earthRe, Direction: -1},
				{Name: "z", Kind: propagate.Custom, Direction: 1, G: func(_ float64, s orbit.State) float64 { return s.R[2] }},
			}
			want := [][]float64{
				keplerTimes(a, e, nu0*rad, 0, 0, tc.span),
				keplerTimes(a, e, nu0*rad, math.Pi, 0, tc.span),
				keplerTimes(a, e, nu0*rad, -argp*rad, 0, tc.span),
				keplerTimes(a, e, nu0*rad, math.Pi-argp*rad, 0, tc.span),
				keplerTimes(a, e, nu0*rad, nux, 0, tc.span),
				keplerTimes(a, e, nu0*rad, -nux, 0, tc.span),
				keplerTimes(a, e, nu0*rad, -argp*rad, 0, tc.span),
			}
			got := make([][]float64, len(events))
			lastT := 0.0
			_, err := prop.Run(s0, tc.span, &propagate.Output{
				Events: events,
				OnEvent: func(h propagate.EventHit) error {
					if (h.T-lastT)*tc.span < 0 {
						t.Errorf("event %s at %g after one at %g: not in time order", h.Name, h.T, lastT)
					}
					lastT = h.T
					got[h.Index] = append(got[h.Index], h.T)
					r := math.Sqrt(h.State.R[0]*h.State.R[0] + h.State.R[1]*h.State.R[1] + h.State.R[2]*h.State.R[2])
					rdot := (h.State.R[0]*h.State.V[0] + h.State.R[1]*h.State.V[1] + h.State.R[2]*h.State.V[2]) / r
					switch h.Kind {
					case propagate.Periapsis, propagate.Apoapsis:
						if math.Abs(rdot) > 1e-11 || (h.Kind == propagate.Periapsis && math.Abs(r-rp) > 1e-6) {
							t.Errorf("%s at r = %.9f km, rdot = %.3g km/s; want rdot 0 (periapsis %.9f)", h.Kind, r, rdot, rp)
						}
					case propagate.AscendingNode, propagate.DescendingNode, propagate.Custom:
						if math.Abs(h.State.R[2]) > 1e-9 {
							t.Errorf("%s at z = %g km, want 0", h.Kind, h.State.R[2])
						}
					case propagate.Altitude:
						if math.Abs(r-rx) > 1e-9 || h.Direction != events[h.Index].Direction {
							t.Errorf("altitude event at r = %.9f km dir %d, want %.9f dir %d", r, h.Direction, rx, events[h.Index].Direction)
						}
					}
					return nil
				},
			})
			if err != nil {
				t.Fatal(err)
			}
			for i, ev := range events {
				if len(got[i]) != len(want[i]) || len(want[i]) == 0 {
					t.Errorf("%s %s: %d events, want %d", ev.Kind, ev.Name, len(got[i]), len(want[i]))
					continue
				}
				var worst float64
				for k := range want[i] {
					worst = math.Max(worst, math.Abs(got[i][k]-want[i][k]))
				}
				if worst > tolT {
					t.Errorf("%s %s: worst time error %.3g s, want <= %g s", ev.Kind, ev.Name, worst, tolT)
				}
			}
		})
	}
}

// TestTerminalImpact: a suborbital arc from 100 km altitude ends at the
// first descending crossing of altitude 0 (a terminal event). The impact
// time comes from Kepler's equation between the true anomalies of burnout
// (climbing, in (0, pi)) and of the descending crossing of r = Re.
func TestTerminalImpact(t *testing.T) {
	const rad = math.Pi / 180
	r0 := earthRe + 100
	// burnout: 3 km/s at 45 degrees flight-path angle, in the equatorial plane
	v0, gam := 3.0, 45*rad
	s0 := orbit.State{R: [3]float64{r0, 0, 0}, V: [3]float64{v0 * math.Sin(gam), v0 * math.Cos(gam), 0}}
	h := r0 * v0 * math.Cos(gam)
	p := h * h / earthMu
	a := 1 / (2/r0 - v0*v0/earthMu)
	e := math.Sqrt(1 - p/a)
	nuB := math.Acos((p/r0 - 1) / e)       // climbing
	nuI := -math.Acos((p/earthRe - 1) / e) // descending
	want := keplerTimes(a, e, nuB, nuI, 0, 3600)
	if len(want) == 0 {
		t.Fatal("set-up: no impact time")
	}
	m := propagate.PointMass(earthMu)
	m.Re = earthRe
	prop, _ := propagate.New(m, propagate.Options{RelTol: 1e-12})
	res, err := prop.Run(s0, 3600, &propagate.Output{Events: []propagate.Event{{Name: "impact", Kind: propagate.Altitude, Altitude: 0, Direction: -1, Terminal: true}}})
	if err != nil {
		t.Fatal(err)
	}
	if !res.Terminated || math.Abs(res.T-want[0]) > 1e-6 {
		t.Errorf("run ended at %.9f s (terminated %v), impact at %.9f s from Kepler's equation", res.T, res.Terminated, want[0])
	}
	if r := math.Sqrt(res.State.R[0]*res.State.R[0] + res.State.R[1]*res.State.R[1]); math.Abs(r-earthRe) > 1e-9 {
		t.Errorf("final radius %.9f km, want %.9f", r, earthRe)
	}
}
