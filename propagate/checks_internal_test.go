package propagate

import (
	"math"
	"testing"

	"centra/orbit"
)

// TestChecksCanFail: when the laws are evaluated with a gravitational
// parameter 1e-6 away from the one the orbit was propagated with, the
// Kepler-law checks (third law, second law, apsides) fail while the
// conservation checks, which do not involve the laws' mu, still pass.
func TestChecksCanFail(t *testing.T) {
	const mu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	// e = 0.1, p = 7425 km, true anomaly 1 rad: r = p/(1+e cos nu),
	// v = sqrt(mu/p) (-sin nu, e + cos nu) in the perifocal frame
	pp, e, nu := 7425.0, 0.1, 1.0
	r := pp / (1 + e*math.Cos(nu))
	k := math.Sqrt(mu / pp)
	s0 := orbit.State{R: [3]float64{r * math.Cos(nu), r * math.Sin(nu), 0}, V: [3]float64{-k * math.Sin(nu), k * (e + math.Cos(nu)), 0}}
	cs, err := checks(PointMass(mu), s0, 86400, Options{}, mu*(1+1e-6))
	if err != nil {
		t.Fatal(err)
	}
	wantFail := map[string]bool{"third_law_period": true, "second_law_areal_rate": true, "periapsis_radius": true, "apoapsis_radius": true}
	if len(cs) != 6 {
		t.Fatalf("%d checks, want 6", len(cs))
	}
	for _, c := range cs {
		if c.Pass == wantFail[c.Name] {
			t.Errorf("%s: pass = %v with a wrong mu for the laws (relative error %.3g, tolerance %.3g)", c.Name, c.Pass, c.RelativeError, c.Tolerance)
		}
	}
}

// gauss8 returns the positive nodes and the weights of the 8-point
// Gauss-Legendre rule on [-1, 1] (Abramowitz & Stegun, Table 25.4; digits
// from memory, verified by TestGauss8).
func gauss8() (x, w [4]float64) {
	return [4]float64{0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363},
		[4]float64{0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763}
}

// TestGauss8: the rule integrates x^k exactly for k <= 15 (integral
// 2/(k+1) for even k), which pins its nodes and weights.
func TestGauss8(t *testing.T) {
	x, w := gauss8()
	for k := 0; k <= 14; k += 2 {
		var sum float64
		for i := range x {
			sum += 2 * w[i] * math.Pow(x[i], float64(k))
		}
		if want := 2 / float64(k+1); math.Abs(sum-want) > 1e-15 {
			t.Errorf("sum w x^%d = %.17g, want %.17g", k, sum, want)
		}
	}
}

func TestAreaMeter(t *testing.T) {
	// The swept area between two true anomalies, by the closed forms of
	// areaMeter, against Gauss-Legendre quadrature of (1/2) r(nu)^2 dnu with
	// r = p/(1 + e cos nu) (the definition of the area in polar form).
	const tol = 1e-12 // relative
	px, qx := [3]float64{1, 0, 0}, [3]float64{0, 1, 0}
	for _, tc := range []struct {
		e, p, nu1, nu2 float64
	}{
		{0, 7000, 0.1, 2.5},
		{0.3, 9100, -1, 2.5}, // eccentric anomaly advancing by less than pi, as between samples
		{0.95, 13650, 2.9, -2.9 + 2*math.Pi},
		{1, 14000, -2, 2.5},
		{1.5, 17500, -2, 2},
	} {
		var a float64
		if tc.e != 1 {
			a = tc.p / (1 - tc.e*tc.e)
		}
		var m areaMeter
		m.init(tc.e, a, tc.p, px, qx)
		at := func(nu float64) float64 {
			r := tc.p / (1 + tc.e*math.Cos(nu))
			return m.at([3]float64{r * math.Cos(nu), r * math.Sin(nu), 0})
		}
		got := m.delta(at(tc.nu1), at(tc.nu2))
		x, w := gauss8()
		var want float64
		const panels = 64
		hw := (tc.nu2 - tc.nu1) / panels / 2
		for k := range panels {
			mid := tc.nu1 + (2*float64(k)+1)*hw
			for i := range x {
				for _, sgn := range []float64{-1, 1} {
					nu := mid + sgn*x[i]*hw
					r := tc.p / (1 + tc.e*math.Cos(nu))
					want += w[i] * hw * r * r / 2
				}
			}
		}
		if math.Abs(got-want) > tol*math.Abs(want) {
			t.Errorf("e = %g: area %.15g, quadrature %.15g", tc.e, got, want)
		}
	}
}
