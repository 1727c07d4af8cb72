package orbit

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

const muEarth = 398600.4418 // km^3/s^2, WGS 84 / EGM96 value used by Vallado 4th ed.

// Vallado, Fundamentals of Astrodynamics and Applications, 4th ed.,
// Example 2-5 (RV2COE), values from memory: p = 11067.790 km, a =
// 36127.343 km, e = 0.832853, i = 87.870 deg, RAAN = 227.89 deg, argp =
// 53.38 deg, nu = 92.335 deg, longitude of periapsis 247.806 deg. Each is
// also recomputed by an independent NumPy formulation (arccos with
// quadrant checks) in testdata/orbit/reference.py.
func TestElementsFromStateVallado25(t *testing.T) {
	ref := loadReference(t).RV2COE
	s := State{R: ref.R, V: ref.V}
	el, err := ElementsFromState(muEarth, s)
	if err != nil {
		t.Fatal(err)
	}
	const numpyTol = 1e-12 // relative; angles 1e-10 deg (arccos loses ~1/sin of the angle)
	tests := []struct {
		name           string
		got, book, tol float64 // tol: one unit of the book's last printed digit
		numpy          float64
	}{
		// The book's p and a differ from a direct double-precision
		// evaluation of the printed state by 8 and 5 units of their last
		// printed digit, so they are held to 0.01 km.
		{"p km", el.P, 11067.790, 0.01, ref.P},
		{"a km", el.A, 36127.343, 0.01, ref.A},
		{"e", el.E, 0.832853, 1e-6, ref.E},
		{"i deg", el.I / deg, 87.870, 0.001, ref.IDeg},
		{"RAAN deg", el.RAAN / deg, 227.89, 0.01, ref.RAANDeg},
		{"argp deg", el.ArgP / deg, 53.38, 0.01, ref.ArgPDeg},
		{"nu deg", el.Nu / deg, 92.335, 0.001, ref.NuDeg},
		{"arg. latitude deg", wrap2Pi(el.ArgP+el.Nu) / deg, math.NaN(), 0, ref.ArgLat},
	}
	for _, tt := range tests {
		if !math.IsNaN(tt.book) && math.Abs(tt.got-tt.book) > tt.tol {
			t.Errorf("%s = %.9f, want %g +- %g (Vallado Ex. 2-5)", tt.name, tt.got, tt.book, tt.tol)
		}
		tol := numpyTol * math.Abs(tt.numpy)
		if strings.HasSuffix(tt.name, "deg") {
			tol = 1e-10
		}
		if d := math.Abs(tt.got - tt.numpy); d > tol {
			t.Errorf("%s = %.15g, NumPy %.15g, |diff| %.3g", tt.name, tt.got, tt.numpy, d)
		}
	}
}

// Vallado 4th ed. Example 2-6 (COE2RV), from memory: p = 11067.790 km, e =
// 0.83285, i = 87.87 deg, RAAN = 227.89 deg, argp = 53.38 deg, nu = 92.335
// deg give r = (6525.368, 6861.532, 6449.119) km and v = (4.902279,
// 5.533140, -1.975710) km/s. Recomputed with explicit rotation matrices
// (NumPy) in testdata/orbit/reference.py.
func TestStateFromElementsVallado26(t *testing.T) {
	ref := loadReference(t).COE2RV
	el := Elements{P: 11067.790, E: 0.83285, I: 87.87 * deg, RAAN: 227.89 * deg, ArgP: 53.38 * deg, Nu: 92.335 * deg}
	s, err := StateFromElements(muEarth, el)
	if err != nil {
		t.Fatal(err)
	}
	bookR := [3]float64{6525.368, 6861.532, 6449.119}
	bookV := [3]float64{4.902279, 5.533140, -1.975710}
	const (
		tolR     = 5e-4  // km: half a unit of the printed 1e-3 km
		tolV     = 5e-7  // km/s: half a unit of the printed 1e-6 km/s
		numpyTol = 1e-13 // relative to |r|, |v|
	)
	for k := range 3 {
		if math.Abs(s.R[k]-bookR[k]) > tolR {
			t.Errorf("r[%d] = %.6f km, want %.3f (Vallado Ex. 2-6)", k, s.R[k], bookR[k])
		}
		if math.Abs(s.V[k]-bookV[k]) > tolV {
			t.Errorf("v[%d] = %.9f km/s, want %.6f (Vallado Ex. 2-6)", k, s.V[k], bookV[k])
		}
	}
	if d := vecRelDiff(s.R, ref.R); d > numpyTol {
		t.Errorf("r = %v, NumPy %v, relative diff %.3g", s.R, ref.R, d)
	}
	if d := vecRelDiff(s.V, ref.V); d > numpyTol {
		t.Errorf("v = %v, NumPy %v, relative diff %.3g", s.V, ref.V, d)
	}
}

// randomCase draws elements from one of the families the conversions must
// handle; kind selects the family (see the switch).
type elementCase struct {
	kind string
	el   Elements
}

var caseKinds = []string{
	"ellipse", "high-e ellipse", "near-circular", "circular", "near-equatorial",
	"equatorial", "retrograde-equatorial", "circular-equatorial", "near-parabolic",
	"parabola", "hyperbola",
}

func randomElements(rng *rand.Rand, kind string) Elements {
	u := rng.Float64
	logU := func(lo, hi float64) float64 { return math.Pow(10, lo+(hi-lo)*u()) }
	el := Elements{
		P:    6000 + 44000*u(),
		E:    0.95 * u(),
		I:    math.Pi * u(),
		RAAN: 2 * math.Pi * u(),
		ArgP: 2 * math.Pi * u(),
		Nu:   2 * math.Pi * u(),
	}
	openNu := func(lim float64) float64 { return (2*u() - 1) * lim }
	switch kind {
	case "high-e ellipse":
		el.E = 0.95 + 0.049*u()
	case "near-circular":
		el.E = logU(-16, -6)
	case "circular":
		el.E = 0
	case "near-equatorial":
		el.I = logU(-16, -6)
		if u() < 0.5 {
			el.I = math.Pi - el.I
		}
	case "equatorial":
		el.I = 0
	case "retrograde-equatorial":
		el.I = math.Pi
	case "circular-equatorial":
		el.E = []float64{0, logU(-16, -8)}[rng.IntN(2)]
		el.I = []float64{0, math.Pi, logU(-16, -8), math.Pi - logU(-16, -8)}[rng.IntN(4)]
	case "near-parabolic":
		el.E = 1 + (2*u()-1)*1e-6
		el.Nu = openNu(150 * deg)
	case "parabola":
		el.E = 1
		el.Nu = openNu(150 * deg)
	case "hyperbola":
		el.E = 1 + logU(-3, 1.5)
		el.Nu = openNu(0.95 * math.Acos(-1/el.E))
	}
	return el
}

// Round trip state -> elements -> state to 1e-12 relative over 1e5
// states: random elements of every family, plus raw random state vectors.
// Near-parabolic and parabolic cases keep |nu| <= 150 deg: beyond it the
// radius p/(1 + e cos nu) amplifies the rounding of e by 1/(1 + e cos nu),
// an ill-conditioning of the classical elements themselves (raw states
// that land there are held to 1e-15/(1 + e cos nu) instead).
func TestRoundTripStateElementsState(t *testing.T) {
	const tolRT = 1e-12 // relative, in |r| and |v|
	rng := rand.New(rand.NewPCG(1, 1))
	const n = 100000
	illCond := 0
	worst := map[string]float64{}
	for k := range n {
		var s State
		kind := "raw state"
		if k%(len(caseKinds)+1) < len(caseKinds) {
			kind = caseKinds[k%(len(caseKinds)+1)]
			var err error
			s, err = StateFromElements(muEarth, randomElements(rng, kind))
			if err != nil {
				t.Fatalf("%s: StateFromElements: %v", kind, err)
			}
		} else {
			r := 6500 + 60000*rng.Float64()
			vesc := math.Sqrt(2 * muEarth / r)
			s.R = scale(r, randomUnit(rng))
			s.V = scale((0.05+1.5*rng.Float64())*vesc, randomUnit(rng))
		}
		el, err := ElementsFromState(muEarth, s)
		if err != nil {
			t.Fatalf("%s: ElementsFromState(%v): %v", kind, s, err)
		}
		back, err := StateFromElements(muEarth, el)
		if err != nil {
			t.Fatalf("%s: StateFromElements(%+v): %v", kind, el, err)
		}
		dr, dv := vecRelDiff(back.R, s.R), vecRelDiff(back.V, s.V)
		worst[kind] = math.Max(worst[kind], math.Max(dr, dv))
		// A raw state may sit near the apoapsis of a nearly parabolic
		// ellipse, where the elements are ill-conditioned: there the bound
		// is the rounding of e amplified by 1/(1 + e cos nu).
		tol := tolRT
		if den := 1 + el.E*math.Cos(el.Nu); den < 1e-3 {
			tol = 1e-15 / den
			illCond++
		}
		if dr > tol || dv > tol {
			t.Errorf("%s: round trip of %v via %+v: relative error r %.3g, v %.3g", kind, s, el, dr, dv)
		}
	}
	for kind, w := range worst {
		t.Logf("%-22s worst relative error %.3g", kind, w)
	}
	t.Logf("%d of %d raw states had 1 + e cos nu < 1e-3", illCond, n)
}

func randomUnit(rng *rand.Rand) [3]float64 {
	for {
		v := [3]float64{2*rng.Float64() - 1, 2*rng.Float64() - 1, 2*rng.Float64() - 1}
		if n := norm(v); n > 0.1 && n <= 1 {
			return scale(1/n, v)
		}
	}
}

// Elements -> state -> elements returns the original elements where they
// are well defined (e and sin i not small), angles to 1e-11 rad.
func TestRoundTripElementsStateElements(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 3))
	for _, kind := range []string{"ellipse", "high-e ellipse", "hyperbola"} {
		for range 5000 {
			el := randomElements(rng, kind)
			if el.E < 1e-3 || math.Sin(el.I) < 1e-3 {
				continue
			}
			s, err := StateFromElements(muEarth, el)
			if err != nil {
				t.Fatal(err)
			}
			got, err := ElementsFromState(muEarth, s)
			if err != nil {
				t.Fatal(err)
			}
			// angle tolerance: rounding of r and v (1e-16) divided by e
			// for argp and nu, by sin i for RAAN.
			tolAng := 1e-13 / math.Min(el.E, math.Sin(el.I))
			if relDiff(got.P, el.P) > 1e-13 || math.Abs(got.E-el.E) > 1e-13 ||
				math.Abs(got.I-el.I) > 1e-13 || angDiff(got.RAAN, el.RAAN) > tolAng ||
				angDiff(got.ArgP, el.ArgP) > tolAng || angDiff(got.Nu, el.Nu) > tolAng {
				t.Errorf("%s: %+v -> %+v", kind, el, got)
			}
		}
	}
}

// The documented conventions of the degenerate cases, each checked against
// an angle computed here directly from the state.
func TestDegenerateConventions(t *testing.T) {
	v := math.Sqrt(muEarth / 7000)
	c, s := math.Cos(0.4), math.Sin(0.4)
	tests := []struct {
		name                   string
		st                     State
		wantE, wantI, wantRAAN float64
		wantArgP, wantNu       float64
		conic                  Conic
	}{
		// circular inclined: i = 0.5 rad about the node on +y (RAAN 90
		// deg); the satellite is 0.4 rad past the node: Nu = u = 0.4.
		{"circular inclined",
			State{R: [3]float64{-7000 * s * math.Cos(0.5), 7000 * c, 7000 * s * math.Sin(0.5)},
				V: [3]float64{-v * c * math.Cos(0.5), -v * s, v * c * math.Sin(0.5)}},
			0, 0.5, math.Pi / 2, 0, 0.4, Ellipse},
		// circular equatorial prograde: Nu = true longitude atan2(y, x).
		{"circular equatorial", State{R: [3]float64{7000 * c, 7000 * s, 0}, V: [3]float64{-v * s, v * c, 0}},
			0, 0, 0, 0, 0.4, Ellipse},
		// circular equatorial retrograde: angles run in the direction of
		// motion, Nu = atan2(-y, x).
		{"circular retrograde equatorial", State{R: [3]float64{7000 * c, -7000 * s, 0}, V: [3]float64{-v * s, -v * c, 0}},
			0, math.Pi, 0, 0, 0.4, Ellipse},
		// elliptic equatorial at periapsis 0.4 rad from +x: ArgP =
		// longitude of periapsis = 0.4, Nu = 0.
		{"elliptic equatorial", State{R: [3]float64{7000 * c, 7000 * s, 0}, V: [3]float64{-1.1 * v * s, 1.1 * v * c, 0}},
			0.21, 0, 0, 0.4, 0, Ellipse},
		// the same retrograde: ArgP = atan2(-y_p, x_p) = 0.4.
		{"elliptic retrograde equatorial", State{R: [3]float64{7000 * c, -7000 * s, 0}, V: [3]float64{-1.1 * v * s, -1.1 * v * c, 0}},
			0.21, math.Pi, 0, 0.4, 0, Ellipse},
		// parabola: periapsis speed sqrt(2) v; E = 1 exactly, A = 0.
		{"parabola at periapsis", State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, 0, math.Sqrt2 * v}},
			1, math.Pi / 2, 0, 0, 0, Parabola},
		// hyperbola at periapsis: speed k times circular gives e = k^2 - 1
		// (the elliptic cases above have k = 1.1, e = 0.21).
		{"hyperbola at periapsis", State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, 1.5 * v, 0}},
			1.25, 0, 0, 0, 0, Hyperbola},
	}
	const tol = 1e-13
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			el, err := ElementsFromState(muEarth, tt.st)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(el.E-tt.wantE) > tol || math.Abs(el.I-tt.wantI) > tol || angDiff(el.RAAN, tt.wantRAAN) > tol ||
				angDiff(el.ArgP, tt.wantArgP) > tol || angDiff(el.Nu, tt.wantNu) > tol {
				t.Errorf("ElementsFromState = {E %.15g I %.15g RAAN %.15g ArgP %.15g Nu %.15g}, want {%g %g %g %g %g}",
					el.E, el.I, el.RAAN, el.ArgP, el.Nu, tt.wantE, tt.wantI, tt.wantRAAN, tt.wantArgP, tt.wantNu)
			}
			if got := el.Conic(); got != tt.conic {
				t.Errorf("Conic() = %v, want %v", got, tt.conic)
			}
			if tt.conic == Parabola && el.A != 0 {
				t.Errorf("parabola: A = %g, want 0", el.A)
			}
			if tt.conic == Hyperbola && !(el.A < 0) {
				t.Errorf("hyperbola: A = %g, want < 0", el.A)
			}
			if el.RAAN < 0 || el.RAAN >= 2*math.Pi || el.ArgP < 0 || el.ArgP >= 2*math.Pi {
				t.Errorf("angles out of [0, 2pi): %+v", el)
			}
		})
	}
}

func TestElementsFromStateErrors(t *testing.T) {
	good := State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, 7.5, 0}}
	tests := []struct {
		name    string
		mu      float64
		s       State
		wantErr error
	}{
		{"zero mu", 0, good, ErrInvalidMu},
		{"negative mu", -1, good, ErrInvalidMu},
		{"NaN mu", math.NaN(), good, ErrInvalidMu},
		{"r = 0", muEarth, State{V: [3]float64{1, 0, 0}}, ErrZeroPosition},
		{"v = 0", muEarth, State{R: [3]float64{7000, 0, 0}}, ErrRectilinear},
		{"radial velocity", muEarth, State{R: [3]float64{7000, 0, 0}, V: [3]float64{-3, 0, 0}}, ErrRectilinear},
		{"NaN component", muEarth, State{R: [3]float64{7000, math.NaN(), 0}, V: [3]float64{0, 7.5, 0}}, ErrNonFinite},
		{"Inf component", muEarth, State{R: [3]float64{7000, 0, 0}, V: [3]float64{0, math.Inf(1), 0}}, ErrNonFinite},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ElementsFromState(tt.mu, tt.s)
			if !errors.Is(err, tt.wantErr) {
				t.Fatalf("ElementsFromState(%g, %v) error = %v, want %v", tt.mu, tt.s, err, tt.wantErr)
			}
			var ie *InputError
			if !errors.As(err, &ie) || ie.Op != "ElementsFromState" {
				t.Errorf("error %v is not an *InputError from ElementsFromState", err)
			}
		})
	}
}

func TestStateFromElementsErrors(t *testing.T) {
	tests := []struct {
		name    string
		mu      float64
		el      Elements
		wantErr error
	}{
		{"zero mu", 0, Elements{P: 7000}, ErrInvalidMu},
		{"negative e", muEarth, Elements{P: 7000, E: -0.1}, ErrEccentricity},
		{"NaN e", muEarth, Elements{P: 7000, E: math.NaN()}, ErrEccentricity},
		{"no size", muEarth, Elements{E: 0.1}, ErrSize},
		{"negative p", muEarth, Elements{P: -7000}, ErrSize},
		{"ellipse with negative a", muEarth, Elements{A: -7000, E: 0.1}, ErrSize},
		{"hyperbola with positive a", muEarth, Elements{A: 7000, E: 1.5}, ErrSize},
		{"parabola without p", muEarth, Elements{E: 1}, ErrSize},
		{"inclination > pi", muEarth, Elements{P: 7000, I: 3.5}, ErrInclination},
		{"inclination < 0", muEarth, Elements{P: 7000, I: -0.1}, ErrInclination},
		{"NaN angle", muEarth, Elements{P: 7000, RAAN: math.NaN()}, ErrNonFinite},
		{"hyperbola beyond asymptote", muEarth, Elements{P: 7000, E: 2, Nu: 2.2}, ErrBeyondAsymptote}, // acos(-1/2) = 2.094
		{"parabola at nu = pi", muEarth, Elements{P: 7000, E: 1, Nu: math.Pi}, ErrBeyondAsymptote},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := StateFromElements(tt.mu, tt.el)
			if !errors.Is(err, tt.wantErr) {
				t.Errorf("StateFromElements(%g, %+v) error = %v, want %v", tt.mu, tt.el, err, tt.wantErr)
			}
		})
	}
	// A alone sets the size: a = 7000 km, e = 0.1 -> p = 6930 km.
	s, err := StateFromElements(muEarth, Elements{A: 7000, E: 0.1})
	if err != nil {
		t.Fatal(err)
	}
	if r := norm(s.R); math.Abs(r-6300) > 1e-9 { // periapsis a(1-e) at nu = 0
		t.Errorf("|r| at periapsis = %.12g km, want 6300 km", r)
	}
}

func TestInputErrorMessage(t *testing.T) {
	_, err := ElementsFromState(muEarth, State{})
	const want = "orbit.ElementsFromState: |r| = 0 km: position is at the centre of the body"
	if err == nil || err.Error() != want {
		t.Errorf("error = %q, want %q", err, want)
	}
}
