package orbit

import (
	"math"
	"math/rand/v2"
	"testing"
)

// KeplerChecks on Vallado 4th ed. Example 2-5 (see elements_test.go) and on
// random states of every family: every check passes, the closed-orbit
// checks are present exactly when the orbit is closed, and on
// well-conditioned orbits the agreement is far inside the tolerance (a
// formula error would show at 1e-3 or above).
func TestKeplerChecks(t *testing.T) {
	ref := loadReference(t).RV2COE
	checks, err := KeplerChecks(muEarth, State{R: ref.R, V: ref.V})
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"first_law_radius", "second_law_areal_rate", "third_law_period", "vis_viva_speed", "energy", "angular_momentum"}
	if len(checks) != len(want) {
		t.Fatalf("got %d checks, want %d: %+v", len(checks), len(want), checks)
	}
	for k, c := range checks {
		if c.Name != want[k] {
			t.Errorf("check %d is %q, want %q", k, c.Name, want[k])
		}
		if !c.Pass || c.RelativeError > 1e-12 || c.Tolerance != CheckTolerance {
			t.Errorf("%s: %+v", c.Name, c)
		}
	}
	// Third law on this orbit: 2 pi sqrt(a^3/mu) with a = 36127.343 km
	// (Vallado Ex. 2-5) is 68317 s.
	if T := checks[2].Expected; math.Abs(T-2*math.Pi*math.Sqrt(math.Pow(36127.343, 3)/muEarth)) > 0.1 {
		t.Errorf("third-law period %.3f s, want %.3f s from the book's a", T, 2*math.Pi*math.Sqrt(math.Pow(36127.343, 3)/muEarth))
	}

	rng := rand.New(rand.NewPCG(7, 7))
	for _, kind := range caseKinds {
		for range 300 {
			el := randomElements(rng, kind)
			if kind == "near-parabolic" { // the checks' tolerance covers |1-e| >= 1e-4
				el.E = 1 + math.Copysign(1e-4+1e-4*rng.Float64(), rng.Float64()-0.5)
			}
			s, err := StateFromElements(muEarth, el)
			if err != nil {
				t.Fatal(err)
			}
			checks, err := KeplerChecks(muEarth, s)
			if err != nil {
				t.Fatalf("%s: %v", kind, err)
			}
			has := map[string]bool{}
			for _, c := range checks {
				has[c.Name] = true
				if !c.Pass {
					t.Errorf("%s e = %.12g: %s failed: %+v", kind, el.E, c.Name, c)
				}
			}
			closed := el.E < 1
			if has["third_law_period"] != closed {
				t.Errorf("%s e = %g: third_law_period present = %v", kind, el.E, has["third_law_period"])
			}
			if has["angular_momentum"] != (el.E != 1) || !has["second_law_areal_rate"] || !has["first_law_radius"] {
				t.Errorf("%s e = %g: checks %v", kind, el.E, has)
			}
		}
	}
}

// The adaptive quadrature behind the second-law check, against closed
// forms: the K15 rule is exact for polynomials of degree 22, and the
// sector area of a whole ellipse, 1/2 integral of r^2 dnu, is pi a b.
func TestIntegrate(t *testing.T) {
	poly := func(x float64) float64 { return 3*math.Pow(x, 22) - x*x + 1 }
	want := 3.0/23*(math.Pow(2, 23)-math.Pow(-1, 23)) - (8.0+1)/3 + 3 // integral over [-1, 2]
	if got, _ := gk15(poly, -1, 2); relDiff(got, want) > 1e-14 {
		t.Errorf("gk15(x^22 poly) = %.17g, want %.17g", got, want)
	}
	for _, e := range []float64{0, 0.5, 0.9, 0.99} {
		p := 10000.0
		f := func(nu float64) float64 { r := p / (1 + e*math.Cos(nu)); return r * r / 2 }
		a := p / (1 - e*e)
		b := a * math.Sqrt(1-e*e)
		if got := integrate(f, 0, 2*math.Pi, 1e-14); relDiff(got, math.Pi*a*b) > 1e-13 {
			t.Errorf("area of the ellipse e = %g: %.15g, want pi a b = %.15g", e, got, math.Pi*a*b)
		}
	}
}
