package propagate_test

import (
	"errors"
	"math"
	"testing"

	"centra/orbit"
	"centra/propagate"
)

func checkMap(cs []orbit.Check) map[string]orbit.Check {
	m := make(map[string]orbit.Check, len(cs))
	for _, c := range cs {
		m[c.Name] = c
	}
	return m
}

// TestChecksPointMass: every conservation and Kepler-law check applies and
// passes for point-mass orbits, with both equation sets. The laws are the
// references (energy and angular momentum conservation; Kepler's third law
// 2 pi sqrt(a^3/mu); the second law, area swept at h/2; apsides of the
// conic a(1 -+ e)). The margin test below shows the checks sit far from
// their tolerances.
func TestChecksPointMass(t *testing.T) {
	hypA := 7000.0 / 0.5
	for _, tc := range []struct {
		name string
		s0   orbit.State
		span float64
		want []string
	}{
		{"circular", conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0), day,
			[]string{"energy_conservation", "angular_momentum_conservation", "third_law_period", "second_law_areal_rate"}},
		{"e=0.1", conicState(earthMu, 6750*1.1, 0.1, 51.6, 30, 40, 10), day,
			[]string{"energy_conservation", "angular_momentum_conservation", "third_law_period", "second_law_areal_rate", "periapsis_radius", "apoapsis_radius"}},
		{"e=0.7", conicState(earthMu, 6600*1.7, 0.7, 63.4, 30, 270, 0), 5 * day,
			[]string{"energy_conservation", "angular_momentum_conservation", "third_law_period", "second_law_areal_rate", "periapsis_radius", "apoapsis_radius"}},
		{"e=0.95 backward", conicState(earthMu, 7000*1.95, 0.95, 10, 0, 0, 180), -30 * day,
			[]string{"energy_conservation", "angular_momentum_conservation", "third_law_period", "second_law_areal_rate", "periapsis_radius", "apoapsis_radius"}},
		{"hyperbola", conicState(earthMu, 7000*2.5, 1.5, 28.5, 0, 0, -100), 2 * math.Pi * math.Sqrt(hypA*hypA*hypA/earthMu) * 5,
			[]string{"energy_conservation", "angular_momentum_conservation", "second_law_areal_rate", "periapsis_radius"}},
	} {
		for _, eq := range []propagate.Equations{propagate.FastPath, propagate.EnginePolar} {
			t.Run(tc.name+"/"+eq.String(), func(t *testing.T) {
				cs, err := propagate.Checks(propagate.PointMass(earthMu), tc.s0, tc.span, propagate.Options{Equations: eq})
				if err != nil {
					t.Fatal(err)
				}
				m := checkMap(cs)
				for _, name := range tc.want {
					c, ok := m[name]
					if !ok {
						t.Errorf("check %s missing", name)
						continue
					}
					t.Logf("%-30s expected %-14.10g measured %-14.10g rel %.2g (tol %.2g)", c.Name, c.Expected, c.Measured, c.RelativeError, c.Tolerance)
					if !c.Pass || !(c.RelativeError <= c.Tolerance) {
						t.Errorf("%s failed: %+v", name, c)
					}
				}
				if len(cs) != len(tc.want) {
					t.Errorf("%d checks, want %d: %+v", len(cs), len(tc.want), cs)
				}
			})
		}
	}
}

// TestChecksMargins: at the default tolerance, over 100 LEO orbits, the
// conservation and Kepler-law errors stay at least 10 times below the
// tolerance CheckTolFactor * RelTol (the basis of that factor).
func TestChecksMargins(t *testing.T) {
	s0 := conicState(earthMu, 6750*1.1, 0.1, 51.6, 30, 40, 10)
	period := 2 * math.Pi * math.Sqrt(math.Pow(7500, 3)/earthMu)
	cs, err := propagate.Checks(propagate.PointMass(earthMu), s0, 100*period, propagate.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range cs {
		t.Logf("%-30s rel %.2g (tol %.2g)", c.Name, c.RelativeError, c.Tolerance)
		if !(c.RelativeError <= c.Tolerance/10) {
			t.Errorf("%s: relative error %.3g within a factor 10 of the tolerance %.3g", c.Name, c.RelativeError, c.Tolerance)
		}
	}
}

// TestChecksJ2: with J2 the energy (zonal potential included) and the polar
// angular momentum are conserved, and the secular rates measured from the
// propagation agree within 2% with the first-order closed forms of
// orbit.J2Rates (the first-order secular rates of the node and of the
// argument of perigee as in Vallado, Fundamentals of Astrodynamics and
// Applications, 4th ed., chapter 9; equation number not quoted), which
// TestNodalRegressionFromNodes also recomputes from the written-out formula.
func TestChecksJ2(t *testing.T) {
	for _, tc := range []struct {
		name string
		s0   orbit.State
		span float64
		want []string
	}{
		{"LEO 500 km 51.6 deg", conicState(earthMu, earthRe+500, 0.001, 51.6, 30, 0, 0), 5 * day,
			[]string{"energy_conservation", "angular_momentum_z_conservation", "third_law_period", "j2_nodal_regression"}},
		{"e=0.1 98 deg", conicState(earthMu, 7200*0.99, 0.1, 98, 30, 40, 0), 5 * day,
			[]string{"energy_conservation", "angular_momentum_z_conservation", "third_law_period", "j2_nodal_regression", "j2_apsidal_rotation"}},
		{"e=0.7 28.5 deg", conicState(earthMu, 24000*0.51, 0.7, 28.5, 45, 270, 10), 30 * day,
			[]string{"energy_conservation", "angular_momentum_z_conservation", "third_law_period", "j2_nodal_regression", "j2_apsidal_rotation"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			cs, err := propagate.Checks(propagate.J2(earthMu, earthRe, earthJ2), tc.s0, tc.span, propagate.Options{})
			if err != nil {
				t.Fatal(err)
			}
			m := checkMap(cs)
			for _, name := range tc.want {
				c, ok := m[name]
				if !ok {
					t.Errorf("check %s missing", name)
					continue
				}
				t.Logf("%-32s expected %-14.8g measured %-14.8g rel %.2g (tol %.2g)", c.Name, c.Expected, c.Measured, c.RelativeError, c.Tolerance)
				if !c.Pass {
					t.Errorf("%s failed: %+v", name, c)
				}
			}
			if len(cs) != len(tc.want) {
				t.Errorf("%d checks, want %d", len(cs), len(tc.want))
			}
		})
	}
}

// TestNodalRegressionFromNodes measures the nodal regression a second way,
// from the osculating node at successive ascending-node events (the short
// periodic terms repeat at the same argument of latitude), against the
// first-order J2 rate of orbit.J2Rates, itself recomputed here from the
// written-out closed form -3/2 n J2 (Re/p)^2 cos i, within 2%.
func TestNodalRegressionFromNodes(t *testing.T) {
	s0 := conicState(earthMu, earthRe+500, 0, 51.6, 30, 0, 0)
	prop, _ := propagate.New(propagate.J2(earthMu, earthRe, earthJ2), propagate.Options{})
	var times, raans []float64
	_, err := prop.Run(s0, 3*day, &propagate.Output{
		Events: []propagate.Event{{Kind: propagate.AscendingNode}},
		OnEvent: func(h propagate.EventHit) error {
			hv := [3]float64{
				h.State.R[1]*h.State.V[2] - h.State.R[2]*h.State.V[1],
				h.State.R[2]*h.State.V[0] - h.State.R[0]*h.State.V[2],
				h.State.R[0]*h.State.V[1] - h.State.R[1]*h.State.V[0],
			}
			times = append(times, h.T)
			raans = append(raans, math.Atan2(hv[0], -hv[1]))
			return nil
		},
	})
	if err != nil {
		t.Fatal(err)
	}
	if len(times) < 40 {
		t.Fatalf("%d nodes in 3 days", len(times))
	}
	var unwrapped float64
	for k := 1; k < len(raans); k++ {
		d := math.Remainder(raans[k]-raans[k-1], 2*math.Pi)
		unwrapped += d
	}
	got := unwrapped / (times[len(times)-1] - times[0])
	el, err := orbit.ElementsFromState(earthMu, s0)
	if err != nil {
		t.Fatal(err)
	}
	want, _, _, err := orbit.J2Rates(earthMu, earthRe, earthJ2, el.A, el.E, el.I)
	if err != nil {
		t.Fatal(err)
	}
	// independent first-order closed form, written out: -3/2 n J2 (Re/p)^2 cos i
	n := math.Sqrt(earthMu / math.Pow(el.A, 3))
	closed := -1.5 * n * earthJ2 * math.Pow(earthRe/(el.A*(1-el.E*el.E)), 2) * math.Cos(el.I)
	if math.Abs(want-closed) > 1e-12*math.Abs(closed) {
		t.Errorf("orbit.J2Rates raanDot %.10g, closed form %.10g", want, closed)
	}
	t.Logf("nodal regression from %d nodes: %.6f deg/day, first-order J2 %.6f deg/day", len(times), got*day*180/math.Pi, want*day*180/math.Pi)
	if math.Abs(got-want) > 0.02*math.Abs(want) {
		t.Errorf("nodal regression %.6g rad/s, want %.6g within 2%%", got, want)
	}
}

func TestChecksZonalAndErrors(t *testing.T) {
	s0 := conicState(earthMu, earthRe+800, 0.01, 98.6, 30, 0, 0)
	cs, err := propagate.Checks(propagate.Zonal(earthMu, earthRe, egm2008J(), 6), s0, 2*day, propagate.Options{})
	if err != nil {
		t.Fatal(err)
	}
	m := checkMap(cs)
	for _, name := range []string{"energy_conservation", "angular_momentum_z_conservation", "third_law_period"} {
		if c, ok := m[name]; !ok || !c.Pass {
			t.Errorf("zonal degree 6: check %s = %+v", name, c)
		}
	}
	if _, ok := m["j2_nodal_regression"]; ok {
		t.Error("J2 rate checks made with J3..J6 present (their long-period terms are not in the closed form)")
	}
	pert := propagate.PointMass(earthMu)
	pert.Perturbation = func(float64, orbit.State) ([3]float64, error) { return [3]float64{}, nil }
	if _, err := propagate.Checks(pert, s0, day, propagate.Options{}); !errors.Is(err, propagate.ErrModel) {
		t.Errorf("perturbed model: err = %v, want ErrModel", err)
	}
	if _, err := propagate.Checks(propagate.PointMass(earthMu), s0, 0, propagate.Options{}); !errors.Is(err, propagate.ErrSpan) {
		t.Errorf("zero span: err = %v, want ErrSpan", err)
	}
	radial := orbit.State{R: [3]float64{7000, 0, 0}, V: [3]float64{1, 0, 0}}
	if _, err := propagate.Checks(propagate.PointMass(earthMu), radial, 100, propagate.Options{}); !errors.Is(err, propagate.ErrState) {
		t.Errorf("rectilinear: err = %v, want ErrState", err)
	}
}
