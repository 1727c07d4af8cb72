package suborbital

import (
	"math"
	"math/rand/v2"
	"testing"

	"centra/bodies/geodesy"
)

// TestDragHeight compares the fast height used for the density with the
// exact closed form of geodesy (Vermeille 2011) at random points from -5
// to 2000 km above WGS 84 and at the poles and the equator.
func TestDragHeight(t *testing.T) {
	const tolKm = 1e-9 // 1 micrometre, far below any effect on the density
	f := &Flight{el: geodesy.WGS84}
	rng := rand.New(rand.NewPCG(1, 2))
	worst := 0.0
	check := func(lat, lon, h float64) {
		r := f.el.ToECEF(lat, lon, h)
		_, _, want := f.el.FromECEF(r)
		got := f.dragHeight(r)
		d := math.Abs(got - want)
		worst = math.Max(worst, d)
		if !(d <= tolKm) {
			t.Errorf("dragHeight at lat %.6f deg, h %.3f km = %.9f km, want %.9f km (FromECEF)", lat*180/math.Pi, h, got, want)
		}
	}
	for _, lat := range []float64{-math.Pi / 2, -1, 0, 0.5, math.Pi / 4, 1.2, math.Pi / 2} {
		for _, h := range []float64{-5, 0, 100, 1000, 2000} {
			check(lat, 0.3, h)
		}
	}
	for range 100000 {
		check(math.Asin(2*rng.Float64()-1), 2*math.Pi*rng.Float64(), -5+2005*rng.Float64())
	}
	t.Logf("largest difference %.3g km", worst)
}
