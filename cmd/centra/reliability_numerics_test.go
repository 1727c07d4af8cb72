package main

import (
	"encoding/json"
	"math"
	"math/big"
	"strconv"
	"strings"
	"testing"
)

// bigP returns the semi-latus rectum h^2/mu of a state, in km, computed
// with 256-bit floats: an independent, extended-precision path.
func bigP(r, v [3]float64, mu float64) float64 {
	f := func(x float64) *big.Float { return new(big.Float).SetPrec(256).SetFloat64(x) }
	mul := func(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(256).Mul(a, b) }
	sub := func(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(256).Sub(a, b) }
	add := func(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(256).Add(a, b) }
	hx := sub(mul(f(r[1]), f(v[2])), mul(f(r[2]), f(v[1])))
	hy := sub(mul(f(r[2]), f(v[0])), mul(f(r[0]), f(v[2])))
	hz := sub(mul(f(r[0]), f(v[1])), mul(f(r[1]), f(v[0])))
	h2 := add(add(mul(hx, hx), mul(hy, hy)), mul(hz, hz))
	p, _ := new(big.Float).SetPrec(256).Quo(h2, f(mu)).Float64()
	return p
}

// Near-parabolic and near-rectilinear orbits through the orbit command:
// the state, the semi-latus rectum and the periapsis keep full precision
// (checked against h^2/mu computed in 256-bit floats; p = h^2/mu is the
// two-body relation between the semi-latus rectum and the angular
// momentum, from memory, and recomputed here independently of the code's
// float64 path), and where the semi-major
// axis, period and energy lose digits the command says why in its
// warnings; a rectilinear state is refused with its |r x v|.
func TestReliabilityNearParabolicAndRectilinear(t *testing.T) {
	const mu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, table 3.1), the catalogue's Earth GM
	const relTolP = 1e-13  // p = h^2/mu: two products and a quotient, a few roundings
	cases := []struct {
		name   string
		r, v   [3]float64
		warns  bool // nearly parabolic warning expected
		refuse string
	}{
		{"escape speed less 1e-7", [3]float64{7000, 0, 0}, [3]float64{0, math.Sqrt(2*mu/7000) * (1 - 5e-8), 0}, true, ""},
		{"escape speed plus 1e-7", [3]float64{7000, 0, 0}, [3]float64{0, math.Sqrt(2*mu/7000) * (1 + 5e-8), 0}, true, ""},
		{"moderately eccentric", [3]float64{7000, 0, 0}, [3]float64{0, 9, 0}, false, ""},
		{"near-rectilinear ellipse", [3]float64{7000, 1, 0}, [3]float64{-3, 1e-6, 0}, true, ""},
		{"near-rectilinear hyperbola", [3]float64{7000, 0, 1}, [3]float64{20, 0, 1e-6}, true, ""}, // h -> 0 gives e -> 1 whatever the energy
		{"rectilinear", [3]float64{7000, 0, 0}, [3]float64{7, 1e-12, 0}, false, "angular momentum is zero (rectilinear motion)"},
	}
	g := func(x float64) string { return strconv.FormatFloat(x, 'g', 17, 64) }
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			out, stderr, code := runBinary(t, "--quiet", "--format", "json", "orbit", "--epoch", "2027-01-01T00:00:00Z",
				"--position", g(tc.r[0])+","+g(tc.r[1])+","+g(tc.r[2]), "--velocity", g(tc.v[0])+","+g(tc.v[1])+","+g(tc.v[2]))
			if tc.refuse != "" {
				if code != 2 || !strings.Contains(stderr, tc.refuse) || !strings.Contains(stderr, "|r x v| = ") {
					t.Fatalf("exit %d, %q; want 2 naming |r x v| and %q", code, stderr, tc.refuse)
				}
				return
			}
			if code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			var rec struct {
				P, Rp, E float64
				R, V     [3]float64
				Warnings []string
			}
			var raw map[string]json.RawMessage
			if err := json.Unmarshal([]byte(out), &raw); err != nil {
				t.Fatal(err)
			}
			json.Unmarshal(raw["semi_latus_rectum_km"], &rec.P)
			json.Unmarshal(raw["periapsis_radius_km"], &rec.Rp)
			json.Unmarshal(raw["eccentricity"], &rec.E)
			json.Unmarshal(raw["position_km"], &rec.R)
			json.Unmarshal(raw["velocity_km_s"], &rec.V)
			json.Unmarshal(raw["warnings"], &rec.Warnings)
			if rec.R != tc.r || rec.V != tc.v {
				t.Errorf("state %v %v, want the input %v %v", rec.R, rec.V, tc.r, tc.v)
			}
			p := bigP(tc.r, tc.v, mu)
			if d := math.Abs(rec.P-p) / p; d > relTolP {
				t.Errorf("semi_latus_rectum_km = %.17g, 256-bit h^2/mu = %.17g (rel %.2g > %g)", rec.P, p, d, relTolP)
			}
			if d := math.Abs(rec.Rp-p/(1+rec.E)) / rec.Rp; d > relTolP {
				t.Errorf("periapsis_radius_km = %.17g, p/(1+e) = %.17g", rec.Rp, p/(1+rec.E))
			}
			said := strings.Contains(strings.Join(rec.Warnings, " "), "nearly parabolic")
			if said != tc.warns {
				t.Errorf("warnings %q: nearly-parabolic warning %v, want %v (|1-e| = %.2g)", rec.Warnings, said, tc.warns, math.Abs(1-rec.E))
			}
		})
	}
}
