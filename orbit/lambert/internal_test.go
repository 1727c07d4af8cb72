package lambert

import (
	"encoding/json"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"
)

// TestTimeOfFlightPrecision compares the double-precision T(x; λ, N) with
// 60-digit values from testdata/transfer/izzo_tof_mpmath.py (mpmath 1.2.1),
// including the cancelling regions: λ near ±1, x near the parabola x = 1, and
// large x.
func TestTimeOfFlightPrecision(t *testing.T) {
	b, err := os.ReadFile(filepath.Join("..", "..", "testdata", "transfer", "izzo_tof.json"))
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Cases []struct {
			Lam, X, T float64
			N         int
		}
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	if len(ref.Cases) < 100 {
		t.Fatalf("only %d cases", len(ref.Cases))
	}
	// 1e-13 relative: about 450 ulp, the precision a solve needs so that
	// the velocities carry 13 significant digits.
	const relTol = 1e-13
	worst := 0.0
	for _, c := range ref.Cases {
		p := problem{lam: c.Lam, lam2: c.Lam * c.Lam, oml2: (1 - c.Lam) * (1 + c.Lam)}
		got := p.tof(c.X, c.N)
		rel := math.Abs(got-c.T) / math.Abs(c.T)
		worst = math.Max(worst, rel)
		if !(rel <= relTol) {
			t.Errorf("T(x=%v; λ=%v, N=%d) = %.17g, want %.17g (mpmath): relative error %.2g", c.X, c.Lam, c.N, got, c.T, rel)
		}
	}
	t.Logf("worst relative error %.3g over %d cases", worst, len(ref.Cases))
}

// TestFallbacks checks the bisection fallbacks, which Householder's iteration
// has not needed in any test, against the Householder solutions: same x on
// the same branch.
func TestFallbacks(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 3))
	const mu = 398600.4418 // km^3/s^2, any positive value
	compared := 0
	for i := range 200 {
		var r1, r2 [3]float64
		for k := range 3 {
			r1[k] = 20000 * (2*rng.Float64() - 1)
			r2[k] = 20000 * (2*rng.Float64() - 1)
		}
		o := Options{Retrograde: rng.IntN(2) == 1, Revs: rng.IntN(3), Branch: Branch(rng.IntN(2))}
		tof := 600 + rng.Float64()*3*86400
		var p problem
		if err := p.setup(mu, r1, r2, tof, o); err != nil {
			t.Fatal(err)
		}
		T := tof * p.tNorm
		var xh, xf float64
		var err error
		if o.Revs == 0 {
			if xh, err = p.solveSingle(T); err != nil {
				t.Fatal(err)
			}
			if xf, err = p.fallbackSingle(T); err != nil {
				t.Fatal(err)
			}
		} else {
			xm, tm, err := p.minimumT(o.Revs)
			if err != nil {
				t.Fatal(err)
			}
			if T < tm*1.01 { // skip: none, or x ill-determined where dT/dx = 0
				continue
			}
			if xh, err = p.solveMulti(T, o.Revs, o.Branch, tof); err != nil {
				t.Fatal(err)
			}
			xf = p.fallbackMulti(T, o.Revs, o.Branch, xm)
		}
		// Bisection stops at adjacent doubles; T(x) carries ~1e-13
		// relative error, so x agrees to about 1e-13 / |x dT/dx / T|.
		if math.Abs(xh-xf) > 1e-10 {
			t.Errorf("case %d %+v: Householder x = %.17g, bisection x = %.17g", i, o, xh, xf)
		}
		compared++
	}
	if compared < 100 {
		t.Errorf("only %d of 200 cases compared", compared)
	}
	t.Logf("%d cases compared", compared)
}
