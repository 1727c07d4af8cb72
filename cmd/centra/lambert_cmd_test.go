package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"centra/orbit"
)

// Tests of `centra lambert` through the built binary, against the
// textbooks' worked examples, every Lambert case of
// testdata/transfer/reference.json (universal variables or shooting with
// SciPy, polished at 40 digits by reference.py), and Kepler's laws.

type lambertRef struct {
	Name       string
	Mu         float64
	R1, R2     [3]float64
	TOF        float64
	Retrograde bool
	Revs       int
	Branch     string
	V1, V2     [3]float64
	SigmaMin   float64 `json:"sigma_min_s"`
}

func loadLambertRef(t *testing.T) []lambertRef {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "transfer", "reference.json"))
	if err != nil {
		t.Fatal(err)
	}
	var r struct {
		Lambert []lambertRef `json:"lambert"`
	}
	if err := json.Unmarshal(data, &r); err != nil {
		t.Fatal(err)
	}
	if len(r.Lambert) < 10 {
		t.Fatalf("reference.json has %d Lambert cases", len(r.Lambert))
	}
	return r.Lambert
}

func vecArg(v [3]float64) string { return fstr(v[0]) + "," + fstr(v[1]) + "," + fstr(v[2]) }

func jsonVec(t *testing.T, m map[string]any, key string) [3]float64 {
	t.Helper()
	a, ok := m[key].([]any)
	if !ok || len(a) != 3 {
		t.Fatalf("key %q = %v, want a vector", key, m[key])
	}
	var v [3]float64
	for i := range 3 {
		v[i] = a[i].(float64)
	}
	return v
}

func vdiff(a, b [3]float64) float64 {
	return math.Sqrt((a[0]-b[0])*(a[0]-b[0]) + (a[1]-b[1])*(a[1]-b[1]) + (a[2]-b[2])*(a[2]-b[2]))
}

// The textbooks' worked examples with --expect on the components. Both
// are recalled from memory and recomputed independently in
// TestLambertReference (reference.json cases vallado-7-5 and curtis-5-2).
func TestLambertTextbook(t *testing.T) {
	bodiesPath := refBodiesFile(t)
	tests := []struct {
		name string
		args []string
		want map[string]string // key -> VALUE±TOL
	}{
		{
			// Vallado, Fundamentals of Astrodynamics and Applications, 4th
			// ed., Example 7-5 (from memory): v1 = (2.058913, 2.915965, 0),
			// v2 = (-3.451565, 0.910315, 0) km/s, printed to 1e-6 km/s; one
			// unit of the last digit allowed, as in the package test (the
			// example carries canonical-unit intermediates).
			name: "vallado-7-5",
			args: []string{"lambert", "--r1", "15945.34,0,0", "--r2", "12214.83899,10249.46731,0", "--tof", "76min"},
			want: map[string]string{
				"v1_x_km_s": "2.058913±1e-6", "v1_y_km_s": "2.915965±1e-6", "v1_z_km_s": "0±1e-12",
				"v2_x_km_s": "-3.451565±1e-6", "v2_y_km_s": "0.910315±1e-6", "v2_z_km_s": "0±1e-12",
			},
		},
		{
			// Curtis, Orbital Mechanics for Engineering Students, 3rd ed.,
			// Example 5.2 (from memory), mu = 398600 km^3/s^2: v1 =
			// (-5.9925, 1.9254, 3.2456), v2 = (-3.3125, -4.1966, -0.38529)
			// km/s; half a unit of the last printed digit.
			name: "curtis-5-2",
			args: []string{"--bodies", bodiesPath, "lambert", "--body", "curtis", "--r1", "5000,10000,2100", "--r2", "-14600,2500,7000", "--tof", "1h"},
			want: map[string]string{
				"v1_x_km_s": "-5.9925±5e-5", "v1_y_km_s": "1.9254±5e-5", "v1_z_km_s": "3.2456±5e-5",
				"v2_x_km_s": "-3.3125±5e-5", "v2_y_km_s": "-4.1966±5e-5", "v2_z_km_s": "-0.38529±5e-6",
			},
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			args := append([]string(nil), tt.args...)
			for k, v := range tt.want {
				args = append(args, "--expect", k+"="+v)
			}
			out, stderr, code := runBinary(t, args...)
			if code != 0 {
				t.Fatalf("exit %d: %s\n%s", code, stderr, out)
			}
			if n := strings.Count(out, "| yes  |"); n != len(tt.want) {
				t.Errorf("%d of %d expectations passed:\n%s", n, len(tt.want), out)
			}
		})
	}
}

// Every Lambert case of reference.json through the binary, with the
// package test's tolerance: 1e-12 km/s plus the velocity error that a
// 4-ulp position error causes, 1e-15 |r2| / sigma_min.
func TestLambertReference(t *testing.T) {
	bodiesPath := refBodiesFile(t)
	for _, c := range loadLambertRef(t) {
		t.Run(c.Name, func(t *testing.T) {
			body, _ := refBody(t, c.Mu)
			tol := 1e-12 + 1e-15*math.Sqrt(c.R2[0]*c.R2[0]+c.R2[1]*c.R2[1]+c.R2[2]*c.R2[2])/c.SigmaMin
			args := []string{"--bodies", bodiesPath, "lambert", "--body", body, "--r1", vecArg(c.R1), "--r2", vecArg(c.R2), "--tof", fstr(c.TOF)}
			if c.Retrograde {
				args = append(args, "--retrograde")
			}
			if c.Revs == 0 {
				m := runJSON(t, args...)
				if d := vdiff(jsonVec(t, m, "v1_km_s"), c.V1); d > tol {
					t.Errorf("v1 differs from reference.py by %.3g km/s (tol %.3g)", d, tol)
				}
				if d := vdiff(jsonVec(t, m, "v2_km_s"), c.V2); d > tol {
					t.Errorf("v2 differs from reference.py by %.3g km/s (tol %.3g)", d, tol)
				}
				return
			}
			args = append(args, "--revs", fmt.Sprint(c.Revs))
			short := runJSON(t, append(args, "--branch", "short")...)
			long := runJSON(t, append(args, "--branch", "long")...)
			// Short is the shorter period, whichever of Izzo's branches it is.
			if ps, pl := jsonNum(t, short, "period_s"), jsonNum(t, long, "period_s"); !(ps < pl) {
				t.Errorf("short period %g s is not below long period %g s", ps, pl)
			}
			var m map[string]any
			for _, x := range []map[string]any{short, long} {
				if x["izzo_branch"] == c.Branch {
					m = x
				}
			}
			if m == nil || short["izzo_branch"] == long["izzo_branch"] {
				t.Fatalf("izzo_branch: short %v, long %v; want one of them %s", short["izzo_branch"], long["izzo_branch"], c.Branch)
			}
			if d := vdiff(jsonVec(t, m, "v1_km_s"), c.V1); d > tol {
				t.Errorf("v1 differs from reference.py by %.3g km/s (tol %.3g)", d, tol)
			}
			if d := vdiff(jsonVec(t, m, "v2_km_s"), c.V2); d > tol {
				t.Errorf("v2 differs from reference.py by %.3g km/s (tol %.3g)", d, tol)
			}
			if mt := jsonNum(t, m, "min_tof_s"); !(mt > 0 && mt < c.TOF) {
				t.Errorf("min_tof_s = %g, want in (0, %g)", mt, c.TOF)
			}
		})
	}
}

// Kepler's laws give the answer when the two points lie on a known orbit:
// the Lambert arc between them in the time the orbit takes is the orbit
// itself, so the departure and arrival burns onto and off it vanish. The
// orbit's second point comes from the orbit package's universal-variable
// propagator (checked against SciPy in testdata/orbit), the circle's from
// uniform circular motion. Also checks the transfer angle, the semi-major
// axis (vis-viva) and the lowest altitude on the arc.
func TestLambertOnKnownOrbits(t *testing.T) {
	const mu = 398600.4418 // centra's Earth GM (WGS 84)
	const re = 6378.137
	const tolKmS = 1e-8 // the solver converges to ~1e-12; the 17-digit text round trip is exact
	circle := func(r, deg float64) [3]float64 {
		a := deg * math.Pi / 180
		return [3]float64{r * math.Cos(a), r * math.Sin(a), 0}
	}
	rc := 7000.0
	vc := math.Sqrt(mu / rc)
	tests := []struct {
		name      string
		s0        orbit.State
		tof       float64
		revs      int
		retro     bool
		angleDeg  float64 // expected transfer angle
		smaKm     float64 // expected semi-major axis
		minAltKm  float64 // expected lowest altitude on the arc
		minAltTol float64
	}{
		{
			name: "circle-100deg", s0: orbit.State{R: circle(rc, 0), V: [3]float64{0, vc, 0}},
			tof: 100.0 / 360 * 2 * math.Pi * math.Sqrt(rc*rc*rc/mu), angleDeg: 100, smaKm: rc, minAltKm: rc - re, minAltTol: 1e-6,
		},
		{
			// retrograde: clockwise about +z, so 100 deg of motion ends at -100 deg.
			name: "circle-retrograde-100deg", s0: orbit.State{R: circle(rc, 0), V: [3]float64{0, -vc, 0}},
			tof: 100.0 / 360 * 2 * math.Pi * math.Sqrt(rc*rc*rc/mu), retro: true, angleDeg: 100, smaKm: rc, minAltKm: rc - re, minAltTol: 1e-6,
		},
		{
			// Periapsis 7000 km, e = 0.3, leaving 30 deg before periapsis:
			// the arc passes periapsis, so its lowest point is r_p.
			name: "ellipse-through-periapsis", s0: ellipseState(mu, 7000, 0.3, -30), tof: 2400, smaKm: 7000 / 0.7, minAltKm: 7000 - re, minAltTol: 1e-6,
		},
		{
			// The same ellipse one full revolution and 2400 s later: a
			// multi-revolution solution (the long or short branch).
			name: "ellipse-1rev", s0: ellipseState(mu, 7000, 0.3, -30), tof: 2400 + 2*math.Pi*math.Sqrt(math.Pow(7000/0.7, 3)/mu), revs: 1, smaKm: 7000 / 0.7, minAltKm: 7000 - re, minAltTol: 1e-6,
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s1, err := orbit.Propagate(mu, tt.s0, tt.tof)
			if err != nil {
				t.Fatal(err)
			}
			args := []string{"lambert", "--r1", vecArg(tt.s0.R), "--r2", vecArg(s1.R), "--tof", fstr(tt.tof),
				"--v1-before", vecArg(tt.s0.V), "--v2-after", vecArg(s1.V)}
			if tt.retro {
				args = append(args, "--retrograde")
			}
			if tt.revs > 0 {
				// One of the two branches is the orbit itself.
				best := math.Inf(1)
				for _, br := range []string{"short", "long"} {
					m := runJSON(t, append(args, "--revs", fmt.Sprint(tt.revs), "--branch", br)...)
					best = math.Min(best, jsonNum(t, m, "dv_total_km_s"))
				}
				if best > 2*tolKmS {
					t.Errorf("neither branch is the orbit: smallest dv_total_km_s %.3g", best)
				}
				return
			}
			m := runJSON(t, args...)
			for _, k := range []string{"dv_departure_km_s", "dv_arrival_km_s"} {
				if v := jsonNum(t, m, k); v > tolKmS {
					t.Errorf("%s = %.3g km/s, want 0 (the points lie on the orbit)", k, v)
				}
			}
			if got := jsonNum(t, m, "dv_total_km_s"); math.Abs(got-jsonNum(t, m, "dv_departure_km_s")-jsonNum(t, m, "dv_arrival_km_s")) > 1e-15 {
				t.Errorf("dv_total_km_s %g is not the sum of the burns", got)
			}
			if tt.angleDeg > 0 {
				if got := jsonNum(t, m, "transfer_angle_deg"); math.Abs(got-tt.angleDeg) > 1e-9 {
					t.Errorf("transfer_angle_deg = %.12g, want %g", got, tt.angleDeg)
				}
			}
			if got := jsonNum(t, m, "semi_major_axis_km"); math.Abs(got-tt.smaKm) > 1e-6 {
				t.Errorf("semi_major_axis_km = %.12g, want %g", got, tt.smaKm)
			}
			if got := jsonNum(t, m, "min_alt_km"); math.Abs(got-tt.minAltKm) > tt.minAltTol {
				t.Errorf("min_alt_km = %.12g, want %g", got, tt.minAltKm)
			}
		})
	}
}

// Two packages, one answer: a Lambert transfer between circular orbits
// over (180 - 0.001) deg in the Hohmann transfer time needs the Hohmann
// budget of reference.py (case vallado-6-1, the radii of Vallado 4th ed.
// Ex. 6-1). The geometry departs from 180 deg by eps = 1.7e-5 rad, and the
// burns change as eps^2 times the speeds (about 2e-9 km/s; the Hohmann
// ellipse is the symmetric case), hence 1e-8 km/s.
func TestLambertNearHohmann(t *testing.T) {
	ref := loadTransferRef(t).Hohmann[0]
	if ref.Name != "vallado-6-1" {
		t.Fatalf("reference case %q", ref.Name)
	}
	const tolKmS = 1e-8
	mu := ref.Mu // centra's built-in Earth has the same GM (WGS 84)
	ang := (180 - 1e-3) * math.Pi / 180
	c, s := math.Cos(ang), math.Sin(ang)
	r2 := [3]float64{ref.R2 * c, ref.R2 * s, 0}
	v2 := math.Sqrt(mu / ref.R2)
	m := runJSON(t, "lambert", "--r1", vecArg([3]float64{ref.R1, 0, 0}), "--r2", vecArg(r2), "--tof", fstr(ref.TOF),
		"--v1-before", vecArg([3]float64{0, math.Sqrt(mu / ref.R1), 0}), "--v2-after", vecArg([3]float64{-v2 * s, v2 * c, 0}))
	for _, k := range []struct {
		key  string
		want float64
	}{{"dv_departure_km_s", ref.DV1}, {"dv_arrival_km_s", ref.DV2}, {"dv_total_km_s", ref.DVTotal}} {
		if got := jsonNum(t, m, k.key); math.Abs(got-k.want) > tolKmS {
			t.Errorf("%s = %.12f, Hohmann %.12f (reference.py): differ by %.3g km/s", k.key, got, k.want, got-k.want)
		}
	}
	// The transfer ellipse is the Hohmann one: a = (r1 + r2) / 2.
	if got, want := jsonNum(t, m, "semi_major_axis_km"), (ref.R1+ref.R2)/2; math.Abs(got-want) > 1e-6 {
		t.Errorf("semi_major_axis_km = %.9f, want %.9f", got, want)
	}
}

// ellipseState is the state at true anomaly nuDeg on the ellipse with
// periapsis radius rp and eccentricity e in the xy plane, periapsis on +x.
func ellipseState(mu, rp, e, nuDeg float64) orbit.State {
	s, err := orbit.StateFromElements(mu, orbit.Elements{P: rp * (1 + e), E: e, Nu: nuDeg * math.Pi / 180})
	if err != nil {
		panic(err)
	}
	return s
}

// A short branch that dips below the surface is flagged; the
// minimum time of flight printed with the error is the one the
// successful runs report.
func TestLambertWarningsAndMinimum(t *testing.T) {
	r1, r2 := "7000,0,0", "-1389.1854213354425,6302.769619278131,4727.077214458598"
	out, _, code := runBinary(t, "lambert", "--r1", r1, "--r2", r2, "--tof", "5h", "--revs", "1", "--branch", "short")
	if code != 0 || !strings.Contains(out, "WARNING: the arc passes periapsis at -") || !strings.Contains(out, "below the surface of earth: this transfer hits the body") {
		t.Errorf("exit %d: want the warning that the arc hits the Earth in\n%s", code, out)
	}
	sm := runJSON(t, "--quiet", "lambert", "--r1", r1, "--r2", r2, "--tof", "5h", "--revs", "1", "--branch", "short")
	// A multi-revolution arc passes periapsis, so its lowest point is the
	// periapsis, recomputed here from v1 by vis-viva and h = |r x v|.
	const mu, re = 398600.4418, 6378.137 // centra's Earth (WGS 84)
	rv, vv := [3]float64{7000, 0, 0}, jsonVec(t, sm, "v1_km_s")
	a := 1 / (2/7000.0 - (vv[0]*vv[0]+vv[1]*vv[1]+vv[2]*vv[2])/mu)
	hx, hy, hz := rv[1]*vv[2]-rv[2]*vv[1], rv[2]*vv[0]-rv[0]*vv[2], rv[0]*vv[1]-rv[1]*vv[0]
	e := math.Sqrt(1 - (hx*hx+hy*hy+hz*hz)/mu/a)
	if got, want := jsonNum(t, sm, "min_alt_km"), a*(1-e)-re; math.Abs(got-want) > 1e-6 || !(want < 0) {
		t.Errorf("min_alt_km = %.9g, periapsis altitude from v1 = %.9g (want below 0)", got, want)
	}
	_, stderr, _ := runBinary(t, "--format", "json", "lambert", "--r1", r1, "--r2", r2, "--tof", "5h", "--revs", "1", "--branch", "short")
	if !strings.HasPrefix(stderr, "centra: warning: the arc passes periapsis") {
		t.Errorf("JSON: the warning goes to stderr; got %q", stderr)
	}
	m := runJSON(t, "--quiet", "lambert", "--r1", r1, "--r2", r2, "--tof", "5h", "--revs", "1", "--branch", "long")
	if m["warnings"] != nil || jsonNum(t, m, "min_alt_km") < 0 {
		t.Errorf("long branch: warnings %v, min_alt_km %v", m["warnings"], m["min_alt_km"])
	}
	minTOF := jsonNum(t, m, "min_tof_s")
	_, stderr, code = runBinary(t, "lambert", "--r1", r1, "--r2", r2, "--tof", fstr(minTOF*0.999), "--revs", "1", "--branch", "long")
	want := fmt.Sprintf("give --tof %.3f (seconds) or more", math.Ceil(minTOF*1000)/1000)
	if code != 2 || !strings.Contains(stderr, want) {
		t.Errorf("below the minimum: exit %d, stderr %q, want %q", code, stderr, want)
	}
	if _, stderr, code := runBinary(t, "lambert", "--r1", r1, "--r2", r2, "--tof", fmt.Sprintf("%.3f", math.Ceil(minTOF*1000)/1000), "--revs", "1", "--branch", "long"); code != 0 {
		t.Errorf("at the printed minimum: exit %d: %s", code, stderr)
	}
}

func TestLambertErrors(t *testing.T) {
	tests := []struct {
		name, args, msg string
	}{
		{"no args", "lambert", "--r1 is required"},
		{"no tof", "lambert --r1 7000,0,0 --r2 0,9000,0", "--tof is required"},
		{"180 deg", "lambert --r1 7000,0,0 --r2 -9000,0,0 --tof 1h", "transfer angle 180 deg), so the plane of the transfer is undefined; use a non-collinear geometry"},
		{"0 deg", "lambert --r1 7000,0,0 --r2 9000,0,0 --tof 1h", "transfer angle 0 deg"},
		{"same point", "lambert --r1 7000,0,0 --r2 7000,0,0 --tof 1h --revs 1 --branch short", "plane of the transfer is undefined"},
		{"r1 zero", "lambert --r1 0,0,0 --r2 0,9000,0 --tof 1h", "--r1 is the centre of earth (|r1| = 0 km)"},
		{"r2 zero", "lambert --r1 7000,0,0 --r2 0m,0km,0 --tof 1h", "--r2 is the centre of earth"},
		{"tof zero", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 0", "--tof must be positive"},
		{"tof negative", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof -1h", "--tof must be positive"},
		{"tof bad", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof soon", `--tof "soon" is not a valid duration`},
		{"too short for revs", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h --revs 1 --branch short", "the minimum time of flight for this geometry is 8115.57 s (2.254 h); give --tof 8115.570 (seconds) or more"},
		{"revs no branch", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 5h --revs 1", "add --branch short"},
		{"branch no revs", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h --branch long", "with --revs 0 the solution is unique"},
		{"bad branch", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 5h --revs 1 --branch left", `--branch "left" is not short or long`},
		{"bad revs", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 5h --revs -1", `--revs "-1" is not a whole number`},
		{"bad vector", "lambert --r1 7000,0 --r2 0,9000,0 --tof 1h", "three parts"},
		{"bad unit", "lambert --r1 7000furlong,0,0 --r2 0,9000,0 --tof 1h", `--r1 "7000furlong,0,0" is not a valid length`},
		{"nan", "lambert --r1 NaN,0,0 --r2 0,9000,0 --tof 1h", `--r1 "NaN,0,0"`},
		{"bad v1", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h --v1-before 7.5", "--v1-before"},
		{"overflow", "lambert --r1 7000,0,0 --r2 1e300,1e300,0 --tof 1h", "position must be finite"},
		{"tiny tof", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1e-300", "did not converge"},
		{"unknown body", "lambert --body vulcan --r1 7000,0,0 --r2 0,9000,0 --tof 1h", `unknown body "vulcan"`},
		{"stray", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h extra", `unexpected argument "extra"`},
		{"expect vector", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h --expect v1_km_s=1±1", `"v1_km_s" is not a number`},
		{"expect unknown", "lambert --r1 7000,0,0 --r2 0,9000,0 --tof 1h --expect v1_w_km_s=1±1", `no result named "v1_w_km_s"`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			out, stderr, code := runBinary(t, strings.Fields(tt.args)...)
			if code != 2 {
				t.Errorf("centra %s: exit %d, want 2 (stderr %q)", tt.args, code, stderr)
			}
			if out != "" {
				t.Errorf("centra %s: printed %q on stdout", tt.args, out)
			}
			if !strings.Contains(stderr, tt.msg) {
				t.Errorf("centra %s: stderr %q does not contain %q", tt.args, stderr, tt.msg)
			}
			if !strings.HasPrefix(stderr, "centra: ") || strings.Count(strings.TrimSpace(stderr), "\n") != 0 || !strings.Contains(stderr, "; ") {
				t.Errorf("centra %s: stderr is not one 'centra: what; fix' line: %q", tt.args, stderr)
			}
		})
	}
}

func TestLambertGolden(t *testing.T) {
	cases := []struct {
		name, args string
	}{
		{"lambert/vallado-7-5-table", "lambert --r1 15945.34,0,0 --r2 12214.83899,10249.46731,0 --tof 76min"},
		{"lambert/multi-rev-long-table", "lambert --r1 7000,0,0 --r2 -1389.1854213354425,6302.769619278131,4727.077214458598 --tof 5h --revs 1 --branch long"},
		{"lambert/retrograde-json", "--format json lambert --r1 5000,10000,2100 --r2 -14600,2500,7000 --tof 1h --retrograde"},
		{"lambert/dv-csv", "--format csv lambert --r1 7000,0,0 --r2 -42003.6,3674.8,0 --tof 5h --v1-before 0,7.546,0 --v2-after -0.26797,-3.063,0"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			out, stderr, code := runBinary(t, strings.Fields(tc.args)...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			golden(t, tc.name, out)
		})
	}
}

func TestLambertHelp(t *testing.T) {
	out, _, code := runBinary(t, "lambert", "--help")
	for _, want := range []string{"examples:", "centra lambert --r1", "Izzo", "--branch short picks the one with", "the shorter period (smaller semi-major axis)", "collinear"} {
		if code != 0 || !strings.Contains(out, want) {
			t.Errorf("centra lambert --help: exit %d, no %q", code, want)
		}
	}
}

func BenchmarkLambertCommand(b *testing.B) {
	for b.Loop() {
		if _, stderr, code := runApp("--format", "json", "lambert", "--r1", "15945.34,0,0", "--r2", "12214.83899,10249.46731,0", "--tof", "76min"); code != 0 {
			b.Fatal(stderr)
		}
	}
}
