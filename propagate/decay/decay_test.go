package decay

import (
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"testing"
	"time"

	"centra/bodies"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
)

const deg = math.Pi / 180

type earthConst struct {
	mu, re, j2, j3, omega float64
}

func earthOf(t testing.TB) earthConst {
	t.Helper()
	e, err := bodies.Lookup("earth")
	if err != nil {
		t.Fatal(err)
	}
	return earthConst{e.GM, e.EquatorialRadius, e.Jn(2), e.Jn(3), e.RotationRate}
}

func zonal3(e earthConst) propagate.Model {
	return propagate.Zonal(e.mu, e.re, []float64{0, 0, e.j2, e.j3}, 3)
}

func stateOf(t testing.TB, mu, re, hp, ha, incDeg float64) orbit.State {
	t.Helper()
	a := re + (hp+ha)/2
	e := (ha - hp) / (2 * a)
	s, err := orbit.StateFromElements(mu, orbit.Elements{A: a, P: a * (1 - e) * (1 + e), E: e, I: incDeg * deg, RAAN: 0.3, ArgP: 0.5, Nu: 0.1})
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// TestAveragedConstantDensity: in an atmosphere of constant density that
// does not rotate, with no zonal field, the averaged decay rate of a
// circular orbit is the published first-order result
// da/dt = -rho sqrt(mu a) Cd A / m (King-Hele, Satellite Orbits in an
// Atmosphere, 1987, ch. 2; Vallado, 4th ed., sec. 9.6; from memory), and
// of an eccentric orbit (2 a^2/mu) <v . a_drag> = -(rho/B)(a^2/mu) <v^3>
// (the energy law), with the time average <v^3> computed here in true
// anomaly, dt = r^2/(a^2 sqrt(1-e^2)) dnu / n, by Simpson's rule: an
// independent parametrization of the average the code takes in
// eccentric anomaly.
func TestAveragedConstantDensity(t *testing.T) {
	const mu, re = 398600.4418, 6378.137
	const rho, b = 3e-12, 40.0
	drag, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: b, Density: func(float64) float64 { return rho }})
	if err != nil {
		t.Fatal(err)
	}
	av := &averager{mu: mu, re: re, drag: drag}
	for _, c := range []struct{ a, e float64 }{{6778.137, 0}, {7000, 0.02}, {8000, 0.15}} {
		dst := make([]float64, 4)
		if err := av.rates(dst, 0, []float64{c.a, c.e, 0, 51.6 * deg}); err != nil {
			t.Fatal(err)
		}
		// <v^3> over time, Simpson in true anomaly.
		const n = 20000
		eta := math.Sqrt(1 - c.e*c.e)
		p := c.a * eta * eta
		sum := 0.0
		for k := 0; k <= n; k++ {
			nu := 2 * math.Pi * float64(k) / n
			r := p / (1 + c.e*math.Cos(nu))
			v := math.Sqrt(mu * (2/r - 1/c.a))
			w := 2.0
			if k == 0 || k == n {
				w = 1
			} else if k%2 == 1 {
				w = 4
			}
			sum += w * v * v * v * r * r / (c.a * c.a * eta)
		}
		v3 := sum * (2 * math.Pi / n) / 3 / (2 * math.Pi)
		want := -(1000 * rho / b) * c.a * c.a / mu * v3
		if c.e == 0 {
			published := -1000 * rho / b * math.Sqrt(mu*c.a)
			if math.Abs(want-published) > 1e-10*math.Abs(published) {
				t.Fatalf("energy-law rate %g differs from the published %g", want, published)
			}
		}
		if rel := math.Abs(dst[0]-want) / math.Abs(want); rel > 1e-9 {
			t.Errorf("a = %g km, e = %g: da/dt = %.12g km/s, want %.12g (rel %.2g)", c.a, c.e, dst[0], want, rel)
		}
		if c.e == 0 && (math.Abs(dst[1]) > 1e-20 || math.Abs(dst[2]) > 1e-20) {
			t.Errorf("circular orbit: de/dt = (%g, %g), want 0", dst[1], dst[2])
		}
		if math.Abs(dst[3]) > 1e-20 {
			t.Errorf("non-rotating atmosphere: di/dt = %g, want 0", dst[3])
		}
	}
}

// TestExponentialAtmosphereLifetime: a circular orbit about a spherical,
// non-rotating Earth without zonal terms in the atmosphere
// rho = rho0 exp(-(h - h0)/H) obeys da/dt = -(1000 rho/B) sqrt(mu a), so
// the time from a0 to the reentry radius is the integral
// T = int_{ar}^{a0} B / (1000 rho(a) sqrt(mu a)) da (the same first-order
// rate as above), computed here by Simpson's rule. Both methods must give
// it; the averaged one to its integration tolerance.
func TestExponentialAtmosphereLifetime(t *testing.T) {
	const mu, re = 398600.4418, 6378.137
	const rho0, h0, hs, b = 3e-12, 400.0, 55.0, 50.0
	density := func(h float64) float64 { return rho0 * math.Exp(-(h-h0)/hs) }
	sphere := geodesy.NewEllipsoid(re, 0)
	drag, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: b, Density: density, Ellipsoid: &sphere})
	if err != nil {
		t.Fatal(err)
	}
	a0, hr := re+330, 150.0
	ar := re + hr
	const n = 20000
	sum := 0.0
	for k := 0; k <= n; k++ {
		a := ar + (a0-ar)*float64(k)/n
		f := b / (1000 * density(a-re) * math.Sqrt(mu*a))
		w := 2.0
		if k == 0 || k == n {
			w = 1
		} else if k%2 == 1 {
			w = 4
		}
		sum += w * f
	}
	want := sum * (a0 - ar) / n / 3
	s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: a0, P: a0, I: 30 * deg})
	for _, c := range []struct {
		m   Method
		tol float64
	}{{Averaged, 1e-5}, {Full, 2e-3}} {
		res, err := Lifetime(Config{Gravity: propagate.Model{Mu: mu, Re: re}, Drag: drag, Method: c.m, ReentryAltitude: hr}, s0)
		if err != nil {
			t.Fatal(err)
		}
		if !res.Reentered {
			t.Fatalf("%v: no reentry", c.m)
		}
		if rel := math.Abs(res.T-want) / want; rel > c.tol {
			t.Errorf("%v: lifetime %.6f d, quadrature %.6f d (rel %.2g), want within %g", c.m, res.T/86400, want/86400, rel, c.tol)
		}
	}
}

// TestAveragedAgainstFull: the averaged method against the full
// integration of the equations of motion (zonal J2, J3, drag in the
// co-rotating US Standard Atmosphere 1976 / exponential table) on orbits
// that decay within days to months.
func TestAveragedAgainstFull(t *testing.T) {
	e := earthOf(t)
	grav := zonal3(e)
	cases := []struct {
		name         string
		hp, ha, incl float64
		b            float64
	}{
		{"300 km, 51.6 deg", 300, 300, 51.6, 50},
		{"250 km sun-synchronous", 250, 250, 97, 20},
		{"200 x 700 km, 28.5 deg", 200, 700, 28.5, 50},
		{"280 km retrograde 140 deg", 280, 280, 140, 50},
	}
	if !testing.Short() {
		cases = append(cases, struct {
			name         string
			hp, ha, incl float64
			b            float64
		}{"350 km equatorial", 350, 350, 0, 100})
	}
	const relTol = 0.015
	for _, c := range cases {
		s0 := stateOf(t, e.mu, e.re, c.hp, c.ha, c.incl)
		drag, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: c.b, RotationRate: e.omega})
		if err != nil {
			t.Fatal(err)
		}
		var lt [2]float64
		for k, m := range []Method{Averaged, Full} {
			res, err := Lifetime(Config{Gravity: grav, Drag: drag, Method: m, Options: propagate.Options{RelTol: 1e-9}}, s0)
			if err != nil {
				t.Fatalf("%s, %v: %v", c.name, m, err)
			}
			if !res.Reentered {
				t.Fatalf("%s, %v: no reentry", c.name, m)
			}
			lt[k] = res.T
		}
		if rel := math.Abs(lt[0]-lt[1]) / lt[1]; rel > relTol {
			t.Errorf("%s: averaged %.4f d, full %.4f d (rel %.3g), want within %g", c.name, lt[0]/86400, lt[1]/86400, rel, relTol)
		}
	}
}

// TestAveragedTolerance: tightening the integration of the averaged
// rates a hundredfold changes the lifetime by less than 1e-5.
func TestAveragedTolerance(t *testing.T) {
	e := earthOf(t)
	drag, _ := forces.NewDrag(forces.DragConfig{BallisticCoefficient: 56, RotationRate: e.omega})
	s0 := stateOf(t, e.mu, e.re, 500, 520, 97.4)
	cfg := Config{Gravity: zonal3(e), Drag: drag}
	r1, err := Lifetime(cfg, s0)
	if err != nil {
		t.Fatal(err)
	}
	defer func(v float64) { averagedRelTol = v }(averagedRelTol)
	averagedRelTol /= 100
	r2, err := Lifetime(cfg, s0)
	if err != nil {
		t.Fatal(err)
	}
	if rel := math.Abs(r1.T-r2.T) / r2.T; rel > 1e-5 {
		t.Errorf("lifetime %.6f d at rtol %g, %.6f d at a hundredth (rel %.2g)", r1.T/86400, AveragedRelTol, r2.T/86400, rel)
	}
}

// TestTwentyFiveYears: a lifetime of decades is computed by the averaged
// method well within the 30 s allowed, and scales with the density: at
// double density the lifetime is shorter, at half longer.
func TestTwentyFiveYears(t *testing.T) {
	e := earthOf(t)
	s0 := stateOf(t, e.mu, e.re, 640, 640, 98)
	var lt [3]float64
	for k, scale := range []float64{0.5, 1, 2} {
		drag, _ := forces.NewDrag(forces.DragConfig{BallisticCoefficient: 50, RotationRate: e.omega, DensityScale: 1})
		if scale != 1 {
			drag, _ = forces.NewDrag(forces.DragConfig{BallisticCoefficient: 50 / scale, RotationRate: e.omega})
		}
		start := time.Now()
		res, err := Lifetime(Config{Gravity: zonal3(e), Drag: drag, MaxSpan: 100 * 365.25 * 86400}, s0)
		if err != nil {
			t.Fatal(err)
		}
		if el := time.Since(start); el > 30*time.Second {
			t.Errorf("density x%g: %v for a lifetime of %.1f years, want under 30 s", scale, el, res.T/86400/365.25)
		}
		lt[k] = res.T / 86400 / 365.25
	}
	if !(lt[1] > 15 && lt[1] < 40) {
		t.Errorf("640 km, B 50: lifetime %.2f years, the test wants a case of about 25 years", lt[1])
	}
	if !(lt[0] > lt[1] && lt[1] > lt[2]) {
		t.Errorf("lifetimes at density x0.5, x1, x2: %.2f, %.2f, %.2f years, want decreasing", lt[0], lt[1], lt[2])
	}
}

func TestNoReentryAndHistory(t *testing.T) {
	e := earthOf(t)
	drag, _ := forces.NewDrag(forces.DragConfig{BallisticCoefficient: 50, RotationRate: e.omega})
	s0 := stateOf(t, e.mu, e.re, 800, 800, 98)
	year := 365.25 * 86400
	res, err := Lifetime(Config{Gravity: zonal3(e), Drag: drag, MaxSpan: year, HistoryStep: 30 * 86400}, s0)
	if err != nil {
		t.Fatal(err)
	}
	if res.Reentered || res.T != year {
		t.Errorf("800 km over a year: reentered %v at %g s, want no reentry at %g s", res.Reentered, res.T, year)
	}
	if n := len(res.History); n != 14 {
		t.Errorf("history has %d samples, want 13 monthly and the last", n)
	}
	for i := 1; i < len(res.History); i++ {
		if res.History[i].T <= res.History[i-1].T {
			t.Errorf("history not in time order at %d", i)
		}
	}
	// Full: a short span gives a history too.
	s1 := stateOf(t, e.mu, e.re, 250, 250, 51.6)
	var calls int
	res, err = Lifetime(Config{Gravity: zonal3(e), Drag: drag, Method: Full, HistoryStep: 86400, Progress: func(float64, float64) { calls++ }}, s1)
	if err != nil {
		t.Fatal(err)
	}
	if !res.Reentered || len(res.History) < 2 || calls == 0 {
		t.Errorf("full: reentered %v, %d samples, %d progress calls", res.Reentered, len(res.History), calls)
	}
	for i := 1; i < len(res.History); i++ {
		if res.History[i].PerigeeAltKm >= res.History[i-1].PerigeeAltKm {
			t.Errorf("full: mean perigee altitude rises at sample %d: %v", i, res.History)
		}
	}
}

func TestLifetimeErrors(t *testing.T) {
	e := earthOf(t)
	drag, _ := forces.NewDrag(forces.DragConfig{BallisticCoefficient: 50, RotationRate: e.omega})
	s0 := stateOf(t, e.mu, e.re, 400, 400, 51.6)
	low := stateOf(t, e.mu, e.re, 90, 90, 51.6)
	cases := []struct {
		name string
		cfg  Config
		s    orbit.State
		want error
	}{
		{"no drag", Config{Gravity: zonal3(e)}, s0, ErrConfig},
		{"reentry altitude", Config{Gravity: zonal3(e), Drag: drag, ReentryAltitude: 20}, s0, ErrConfig},
		{"max span", Config{Gravity: zonal3(e), Drag: drag, MaxSpan: -1}, s0, ErrConfig},
		{"perturbation in gravity", Config{Gravity: propagate.Model{Mu: e.mu, Re: e.re, Perturbation: drag.Perturbation()}, Drag: drag}, s0, ErrConfig},
		{"below reentry", Config{Gravity: zonal3(e), Drag: drag}, low, ErrBelowReentry},
		{"open orbit", Config{Gravity: zonal3(e), Drag: drag}, orbit.State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, 12, 0}}, propagate.ErrState},
	}
	for _, c := range cases {
		if _, err := Lifetime(c.cfg, c.s); !errors.Is(err, c.want) {
			t.Errorf("%s: error %v, want %v", c.name, err, c.want)
		}
	}
}

func BenchmarkLifetime(b *testing.B) {
	e := earthOf(b)
	drag, _ := forces.NewDrag(forces.DragConfig{BallisticCoefficient: forces.BallisticCoefficient(4.2, 2.2, 0.034), RotationRate: e.omega})
	for _, c := range []struct {
		name   string
		hp, ha float64
	}{{"530km", 524, 541}, {"640km", 640, 640}} {
		b.Run(c.name, func(b *testing.B) {
			s0 := stateOf(b, e.mu, e.re, c.hp, c.ha, 97.5)
			var res Result
			for b.Loop() {
				res, _ = Lifetime(Config{Gravity: zonal3(e), Drag: drag, MaxSpan: 100 * 365.25 * 86400}, s0)
			}
			b.ReportMetric(res.T/86400/365.25, "years")
			b.ReportMetric(float64(res.Steps), "steps")
		})
	}
}

// TestExponentialAgainstSciPy: lifetimes of circular orbits in
// exponential atmospheres about a spherical, non-rotating Earth, against
// the quadrature of the first-order decay rate by scipy.integrate.quad
// (SciPy 1.10.1; testdata/lifetime/exponential_scipy.json and its
// script). The averaged method must reproduce it to its integration
// tolerance, 1e-5.
func TestExponentialAgainstSciPy(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "lifetime", "exponential_scipy.json"))
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Mu    float64 `json:"mu_km3_s2"`
		Re    float64 `json:"re_km"`
		Cases []struct {
			Alt      float64 `json:"altitude_km"`
			Reentry  float64 `json:"reentry_alt_km"`
			Rho0     float64 `json:"rho0_kg_m3"`
			H0       float64 `json:"h0_km"`
			H        float64 `json:"scale_height_km"`
			B        float64 `json:"ballistic_coefficient_kg_m2"`
			Lifetime float64 `json:"lifetime_s"`
		} `json:"cases"`
	}
	if err := json.Unmarshal(data, &ref); err != nil {
		t.Fatal(err)
	}
	sphere := geodesy.NewEllipsoid(ref.Re, 0)
	for _, c := range ref.Cases {
		density := func(h float64) float64 { return c.Rho0 * math.Exp(-(h-c.H0)/c.H) }
		drag, err := forces.NewDrag(forces.DragConfig{BallisticCoefficient: c.B, Density: density, Ellipsoid: &sphere})
		if err != nil {
			t.Fatal(err)
		}
		a := ref.Re + c.Alt
		s0, _ := orbit.StateFromElements(ref.Mu, orbit.Elements{A: a, P: a, I: 45 * deg})
		res, err := Lifetime(Config{Gravity: propagate.Model{Mu: ref.Mu, Re: ref.Re}, Drag: drag, ReentryAltitude: c.Reentry}, s0)
		if err != nil {
			t.Fatal(err)
		}
		if rel := math.Abs(res.T-c.Lifetime) / c.Lifetime; rel > 1e-5 {
			t.Errorf("%g km to %g km: lifetime %.6f d, SciPy %.6f d (rel %.2g)", c.Alt, c.Reentry, res.T/86400, c.Lifetime/86400, rel)
		}
	}
}
