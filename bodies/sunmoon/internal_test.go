package sunmoon

import (
	"math"
	"testing"

	"centra/bodies/earthframe"
)

// TestEclipticToGCRF: the folded rotation equals the matrix of
// earthframe.EclipticOfDate transposed (1e-15 relative), 1800-2200.
func TestEclipticToGCRF(t *testing.T) {
	for _, tc := range []float64{-2, -0.5, 0, 0.24, 0.6, 2} {
		jd := 2451545.0 + tc*36525
		for _, ll := range [][2]float64{{0, 0}, {1, 0.1}, {4, -0.09}, {6.2, 0.5}} {
			got := eclipticToGCRF(jd, 0, ll[0], ll[1], 1)
			m := earthframe.EclipticOfDate(jd, 0)
			v := [3]float64{math.Cos(ll[1]) * math.Cos(ll[0]), math.Cos(ll[1]) * math.Sin(ll[0]), math.Sin(ll[1])}
			want := earthframe.MulVecT(&m, v)
			for i := range 3 {
				if math.Abs(got[i]-want[i]) > 1e-15 {
					t.Errorf("t=%g lon=%g lat=%g: %v, matrix %v", tc, ll[0], ll[1], got, want)
					break
				}
			}
		}
	}
}
