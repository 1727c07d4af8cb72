package gravity_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"centra/propagate/gravity"
	"centra/propagate/lagrange"
)

const (
	earthMu = 398600.4418 // km^3/s^2, WGS 84 (NIMA TR8350.2, Table 3.1)
	earthRe = 6378.137    // km, WGS 84 semi-major axis (NIMA TR8350.2, Table 3.1)
)

// egm2008J returns J_n = -C_n0 sqrt(2n+1) from the fully normalized EGM2008
// zonal coefficients (EGM2008 tide-free model, Pavlis et al. 2012). C20 is
// the value given in the project brief; C30..C60 are from memory. They are
// only inputs here: every check compares two computations made with the
// same coefficients, so any realistic values serve.
func egm2008J() []float64 {
	c := [7]float64{2: -0.484165143790815e-3, 3: 0.957161207093473e-6, 4: 0.539965866638991e-6, 5: 0.686702913736681e-7, 6: -0.149953927978527e-6}
	j := make([]float64, 7)
	for n := 2; n <= 6; n++ {
		j[n] = -c[n] * math.Sqrt(float64(2*n+1))
	}
	return j
}

// randomState draws a position between 6300 and 50,000 km in a random
// direction (a tenth of them within 1e-3 rad of a pole or of the equator)
// and a random velocity.
func randomState(rng *rand.Rand) (r, v [3]float64) {
	rad := 6300 + 43700*rng.Float64()
	lon := 2 * math.Pi * rng.Float64()
	sinLat := 2*rng.Float64() - 1
	switch rng.IntN(20) {
	case 0:
		sinLat = math.Copysign(1-1e-7*rng.Float64(), sinLat) // near a pole
	case 1:
		sinLat = 1e-3 * (rng.Float64() - 0.5) // near the equator
	}
	cosLat := math.Sqrt(1 - sinLat*sinLat)
	r = [3]float64{rad * cosLat * math.Cos(lon), rad * cosLat * math.Sin(lon), rad * sinLat}
	for i := range v {
		v[i] = 16 * (rng.Float64() - 0.5)
	}
	return r, v
}

// TestFastPathMatchesEngine is the proof that the closed-form accelerations
// may be used: at 10^4 random states they agree with the Euler-Lagrange
// equations the engine derives from L = v^2/2 - U(r, sin(lat)) to 1e-13
// relative (|a_fast - a_engine| / |a_engine|), for every degree.
func TestFastPathMatchesEngine(t *testing.T) {
	const tolRel = 1e-13 // brief
	j := egm2008J()
	for deg := 0; deg <= gravity.MaxDegree; deg++ {
		if deg == 1 {
			continue
		}
		f, err := gravity.New(earthMu, earthRe, j, deg)
		if err != nil {
			t.Fatal(err)
		}
		l, err := lagrange.ZonalCartesian(earthMu, earthRe, j, deg)
		if err != nil {
			t.Fatal(err)
		}
		sys, _ := lagrange.New(3, l, nil)
		rng := rand.New(rand.NewPCG(1, 1))
		var worst float64
		var ae [3]float64
		for range 10000 {
			r, v := randomState(rng)
			if err := sys.Accelerations(ae[:], 0, r[:], v[:]); err != nil {
				t.Fatal(err)
			}
			af := f.Acceleration(r)
			d := math.Sqrt(sq(af[0]-ae[0]) + sq(af[1]-ae[1]) + sq(af[2]-ae[2]))
			rel := d / math.Sqrt(sq(ae[0])+sq(ae[1])+sq(ae[2]))
			if !(rel <= tolRel) {
				t.Fatalf("degree %d, r = %v: fast %v, engine %v, relative difference %.3g", deg, r, af, ae, rel)
			}
			worst = math.Max(worst, rel)
			// the engine's energy is the fast path's v^2/2 + U
			e := sys.Energy(0, r[:], v[:])
			want := (v[0]*v[0]+v[1]*v[1]+v[2]*v[2])/2 + f.Potential(r)
			if math.Abs(e-want) > 1e-13*(math.Abs(f.Potential(r))) {
				t.Fatalf("degree %d: engine energy %.17g, fast path %.17g", deg, e, want)
			}
		}
		t.Logf("degree %d: worst relative difference fast path vs engine %.2g over 10^4 states", deg, worst)
	}
}

func sq(x float64) float64 { return x * x }

// TestClosedForms: on the polar axis and in the equatorial plane the field
// reduces to one-dimensional closed forms obtained by differentiating
// U = -mu/r [1 - sum J_n (Re/r)^n P_n(s)] by hand:
//   - axis (s = +-1, P_n(+-1) = (+-1)^n): a_z = -sign(z) mu/z^2 [1 - sum (n+1) J_n rho^n (+-1)^n];
//   - equator (s = 0): a_r = -mu/r^2 [1 - sum J_n rho^n P'_{n+1}(0)] and
//     a_z = -mu/r^2 sum J_n rho^n P'_n(0), with P'_n(0) read off the explicit
//     polynomials: P'_n(0) = 0 for even n, P'_1(0) = 1, P'_3(0) = -3/2 from
//     P_3 = (5s^3 - 3s)/2, P'_5(0) = 15/8 from P_5 = (63s^5 - 70s^3 + 15s)/8,
//     P'_7(0) = -35/16 from P_7 = (429s^7 - 693s^5 + 315s^3 - 35s)/16.
func TestClosedForms(t *testing.T) {
	const tol = 1e-15 // relative
	j := egm2008J()
	f, _ := gravity.New(earthMu, earthRe, j, 6)
	for _, z := range []float64{6500, -6500, 26000, -42164} {
		a := f.Acceleration([3]float64{0, 0, z})
		rho := earthRe / math.Abs(z)
		sgn := math.Copysign(1, z)
		var sum float64
		for n := 2; n <= 6; n++ {
			sum += float64(n+1) * j[n] * math.Pow(rho, float64(n)) * math.Pow(sgn, float64(n))
		}
		want := -sgn * earthMu / (z * z) * (1 - sum)
		if math.Abs(a[2]-want) > tol*math.Abs(want) || a[0] != 0 || a[1] != 0 {
			t.Errorf("axis z = %g: a = %v, want (0, 0, %.17g)", z, a, want)
		}
	}
	// derivatives of Legendre polynomials at 0: P'_n(0) = 0 for even n;
	// P'_1 = 1, P'_3 = -3/2, P'_5 = 15/8, P'_7 = -35/16.
	dp0 := [8]float64{1: 1, 3: -1.5, 5: 15.0 / 8, 7: -35.0 / 16}
	for _, r := range []float64{6378.137, 7000, 42164} {
		a := f.Acceleration([3]float64{r / math.Sqrt2, r / math.Sqrt2, 0})
		rho := earthRe / r
		var sr, sz float64
		for n := 2; n <= 6; n++ {
			sr += j[n] * math.Pow(rho, float64(n)) * dp0[n+1]
			sz += j[n] * math.Pow(rho, float64(n)) * dp0[n]
		}
		wr := -earthMu / (r * r) * (1 - sr)
		wz := -earthMu / (r * r) * sz
		gr := math.Hypot(a[0], a[1]) * -1
		if math.Abs(gr-wr) > tol*math.Abs(wr) || math.Abs(a[2]-wz) > tol*math.Abs(wz) {
			t.Errorf("equator r = %g: radial %.17g, z %.17g; want %.17g, %.17g", r, gr, a[2], wr, wz)
		}
	}
	// J2 alone in the equatorial plane: |a| = mu/r^2 (1 + 3/2 J2 (Re/r)^2)
	f2, _ := gravity.New(earthMu, earthRe, j, 2)
	a := f2.Acceleration([3]float64{7000, 0, 0})
	if want := earthMu / 49e6 * (1 + 1.5*j[2]*sq(earthRe/7000)); math.Abs(-a[0]-want) > tol*want || a[1] != 0 || a[2] != 0 {
		t.Errorf("J2 equator: a = %v, want (%.17g, 0, 0)", a, -want)
	}
}

// TestGradientOfPotential: the acceleration is -grad U, checked with
// central differences of Potential (an independent computation of U);
// 4th-order differences with step 1 km: truncation (h/r)^4 ~ 1e-15 and
// rounding eps|U|/(h|a|) ~ 1e-11, relative to |a|.
func TestGradientOfPotential(t *testing.T) {
	const tol = 1e-9 // relative to |a|: difference truncation and rounding
	j := egm2008J()
	rng := rand.New(rand.NewPCG(1, 1))
	for _, deg := range []int{0, 2, 3, 6} {
		f, _ := gravity.New(earthMu, earthRe, j, deg)
		for range 200 {
			r, _ := randomState(rng)
			a := f.Acceleration(r)
			an := math.Sqrt(sq(a[0]) + sq(a[1]) + sq(a[2]))
			for i := range 3 {
				const h = 1.0
				at := func(d float64) float64 { p := r; p[i] += d; return f.Potential(p) }
				g := (-at(2*h) + 8*at(h) - 8*at(-h) + at(-2*h)) / (12 * h)
				if math.Abs(-g-a[i]) > tol*an {
					t.Fatalf("degree %d, r = %v, component %d: a = %.15g, -dU/dx = %.15g", deg, r, i, a[i], -g)
				}
			}
		}
	}
}

func TestNewErrors(t *testing.T) {
	j := egm2008J()
	for _, tc := range []struct {
		name   string
		mu, re float64
		j      []float64
		deg    int
		want   error
	}{
		{"mu zero", 0, earthRe, j, 2, gravity.ErrMu},
		{"mu NaN", math.NaN(), earthRe, j, 2, gravity.ErrMu},
		{"radius zero", earthMu, 0, j, 2, gravity.ErrRadius},
		{"degree 7", earthMu, earthRe, j, 7, gravity.ErrDegree},
		{"degree -1", earthMu, earthRe, j, -1, gravity.ErrDegree},
		{"too few coefficients", earthMu, earthRe, j[:3], 4, gravity.ErrDegree},
		{"NaN coefficient", earthMu, earthRe, []float64{0, 0, math.NaN()}, 2, gravity.ErrCoefficient},
	} {
		if _, err := gravity.New(tc.mu, tc.re, tc.j, tc.deg); !errors.Is(err, tc.want) {
			t.Errorf("%s: New err = %v, want %v", tc.name, err, tc.want)
		}
	}
	if _, err := gravity.New(earthMu, 0, nil, 0); err != nil {
		t.Errorf("point mass needs no radius: %v", err)
	}
}

var sink [3]float64

func benchmarkAccel(b *testing.B, deg int) {
	f, _ := gravity.New(earthMu, earthRe, egm2008J(), deg)
	rng := rand.New(rand.NewPCG(1, 1))
	const m = 1024
	rs := make([][3]float64, m)
	for i := range rs {
		rs[i], _ = randomState(rng)
	}
	b.ReportAllocs()
	i := 0
	for b.Loop() {
		sink = f.Acceleration(rs[i&(m-1)])
		i++
	}
}

func BenchmarkAccelPointMass(b *testing.B) { benchmarkAccel(b, 0) }
func BenchmarkAccelJ2(b *testing.B)        { benchmarkAccel(b, 2) }
func BenchmarkAccelZonal6(b *testing.B)    { benchmarkAccel(b, 6) }

// BenchmarkEngineAccel is the same right-hand side derived by the
// Lagrangian engine (hyperdual numbers), for comparison.
func BenchmarkEngineAccel(b *testing.B) {
	for _, deg := range []int{0, 2, 6} {
		b.Run("degree="+string(rune('0'+deg)), func(b *testing.B) {
			l, _ := lagrange.ZonalCartesian(earthMu, earthRe, egm2008J(), deg)
			sys, _ := lagrange.New(3, l, nil)
			rng := rand.New(rand.NewPCG(1, 1))
			const m = 1024
			rs := make([][3]float64, m)
			vs := make([][3]float64, m)
			for i := range rs {
				rs[i], vs[i] = randomState(rng)
			}
			var a [3]float64
			b.ReportAllocs()
			i := 0
			for b.Loop() {
				k := i & (m - 1)
				if err := sys.Accelerations(a[:], 0, rs[k][:], vs[k][:]); err != nil {
					b.Fatal(err)
				}
				i++
			}
			sink = a
		})
	}
}
