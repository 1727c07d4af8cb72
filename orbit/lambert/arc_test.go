package lambert_test

import (
	"math"
	"testing"

	"centra/orbit"
	"centra/orbit/lambert"
)

// TestArcGeometry: the swept angle and the lowest radius of arcs on
// conics built from their elements, against the conic equation
// r = p / (1 + e cos nu) (Bate, Mueller & White 1971, eq. 1.5-4).
func TestArcGeometry(t *testing.T) {
	const mu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	deg := math.Pi / 180
	cases := []struct {
		name          string
		e, p          float64 // eccentricity, semi-latus rectum km
		nu1, nu2      float64 // true anomalies of the ends, rad
		revs          int
		wantSweep     float64
		wantPeriapsis bool // the arc passes periapsis
	}{
		{"ellipse from periapsis, quarter turn", 0.2, 8000, 0, 90 * deg, 0, 90 * deg, false},
		{"ellipse across periapsis", 0.2, 8000, 300 * deg, 30 * deg, 0, 90 * deg, true},
		{"ellipse before periapsis", 0.2, 8000, 100 * deg, 200 * deg, 0, 100 * deg, false},
		{"ellipse with a revolution", 0.2, 8000, 100 * deg, 200 * deg, 1, 100 * deg, true},
		{"ellipse the long way", 0.2, 8000, 30 * deg, 300 * deg, 0, 270 * deg, false},
		{"ellipse the long way across periapsis", 0.2, 8000, 200 * deg, 100 * deg, 0, 260 * deg, true},
		{"hyperbola across periapsis", 1.5, 9000, -30 * deg, 40 * deg, 0, 70 * deg, true},
		{"hyperbola after periapsis", 1.5, 9000, 10 * deg, 60 * deg, 0, 50 * deg, false},
	}
	for _, c := range cases {
		el1 := orbit.Elements{A: c.p / (1 - c.e*c.e), P: c.p, E: c.e, I: 0.3, RAAN: 0.4, ArgP: 0.5, Nu: c.nu1}
		el2 := el1
		el2.Nu = c.nu2
		s1, err := orbit.StateFromElements(mu, el1)
		if err != nil {
			t.Fatal(err)
		}
		s2, err := orbit.StateFromElements(mu, el2)
		if err != nil {
			t.Fatal(err)
		}
		if got := lambert.SweptAngle(s1.R, s2.R, s1.V); math.Abs(got-c.wantSweep) > 1e-12 {
			t.Errorf("%s: swept %.15g rad, want %.15g", c.name, got, c.wantSweep)
		}
		el, err := orbit.ElementsFromState(mu, s1)
		if err != nil {
			t.Fatal(err)
		}
		g, err := orbit.GeometryOfState(mu, s1)
		if err != nil {
			t.Fatal(err)
		}
		rConic := func(nu float64) float64 { return c.p / (1 + c.e*math.Cos(nu)) }
		want := math.Min(rConic(c.nu1), rConic(c.nu2))
		if c.wantPeriapsis {
			want = c.p / (1 + c.e)
		}
		if got := lambert.LowestRadius(el, g, c.wantSweep, c.revs, s1.R, s2.R); math.Abs(got-want) > 1e-9*want {
			t.Errorf("%s: lowest radius %.12g km, want %.12g", c.name, got, want)
		}
	}
}
