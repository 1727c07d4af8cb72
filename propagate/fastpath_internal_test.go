package propagate

import (
	"math"
	"math/rand/v2"
	"testing"

	"centra/bodies"
)

// TestFastPathsAgree: the written-out point-mass and J2 right-hand sides
// give bit for bit what the general fast path (gravity.Zonal.Acceleration)
// gives, at random states from 100 km below to 40,000 km above the
// surface and at every latitude, so choosing one never changes a result.
func TestFastPathsAgree(t *testing.T) {
	earth, err := bodies.Lookup("earth")
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(11, 12))
	for _, deg := range []int{0, 2} {
		var m Model
		m.Mu, m.Re, m.Degree = earth.GM, earth.EquatorialRadius, deg
		if deg == 2 {
			m.J = []float64{0, 0, earth.J[2]}
		}
		p, err := New(m, Options{})
		if err != nil {
			t.Fatal(err)
		}
		special := p.fastPoint
		if deg == 2 {
			special = p.fastJ2
		}
		y := make([]float64, 6)
		got, want := make([]float64, 6), make([]float64, 6)
		for range 10000 {
			r := earth.EquatorialRadius - 100 + rng.Float64()*40100
			lat, lon := math.Asin(2*rng.Float64()-1), 2*math.Pi*rng.Float64()
			y[0], y[1], y[2] = r*math.Cos(lat)*math.Cos(lon), r*math.Cos(lat)*math.Sin(lon), r*math.Sin(lat)
			y[3], y[4], y[5] = rng.NormFloat64()*5, rng.NormFloat64()*5, rng.NormFloat64()*5
			if err := special(got, 0, y); err != nil {
				t.Fatal(err)
			}
			if err := p.fast(want, 0, y); err != nil {
				t.Fatal(err)
			}
			for i := range got {
				if math.Float64bits(got[i]) != math.Float64bits(want[i]) {
					t.Fatalf("degree %d at %v: component %d is %.17g, general path %.17g", deg, y, i, got[i], want[i])
				}
			}
		}
	}
}
