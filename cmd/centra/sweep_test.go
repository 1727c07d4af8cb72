package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"math"
	"strconv"
	"strings"
	"testing"

	"centra/orbit"
)

// fixedEpoch keeps the sweeps' outputs free of the clock.
const fixedEpoch = "2026-01-01T00:00:00Z"

// Every error path of sweep, through the built binary: exit 2 and one
// line naming the bad input.
func TestSweepErrors(t *testing.T) {
	tests := []struct {
		name string
		args []string
		msg  string
	}{
		{"no command", []string{"sweep", "--vary", "inclination=40:60:5"}, "sweep needs a COMMAND"},
		{"nothing varied", []string{"sweep", "orbit", "--altitude", "500"}, "nothing is varied"},
		{"zero step", []string{"sweep", "--vary", "inclination=40:60:0", "orbit", "--altitude", "500"}, `--vary "inclination=40:60:0": values out of range: STEP is zero`},
		{"two parts", []string{"sweep", "--vary", "inclination=40:60", "orbit", "--altitude", "500"}, "a range has three parts FROM:TO:STEP, got 2"},
		{"wrong direction", []string{"sweep", "--vary", "inclination=60:40:5", "orbit", "--altitude", "500"}, "use STEP -5 to go from 60 to 40"},
		{"mixed units", []string{"sweep", "--vary", "altitude=400km:0.8e6m:100km", "orbit"}, `units "km" and "m" differ`},
		{"compound", []string{"sweep", "--vary", "span=1d:2d:1d6h", "ephemeris", "--final", "--altitude", "500"}, "compound quantity"},
		{"no name", []string{"sweep", "--vary", "40:60:5", "orbit", "--altitude", "500"}, "no NAME="},
		{"zero sigma", []string{"sweep", "--draw", "altitude=normal(500,0)", "--cases", "10", "orbit"}, "SIGMA 0 is not positive"},
		{"reversed uniform", []string{"sweep", "--draw", "raan=uniform(360,0)", "--cases", "10", "orbit", "--altitude", "500"}, "LO 360 is not below HI 0"},
		{"unknown distribution", []string{"sweep", "--draw", "raan=poisson(3,1)", "--cases", "10", "orbit", "--altitude", "500"}, `unknown distribution "poisson"`},
		{"grid in draw", []string{"sweep", "--draw", "raan=0:360:10", "--cases", "10", "orbit", "--altitude", "500"}, "is not normal(...) or uniform(...)"},
		{"draw in vary", []string{"sweep", "--vary", "raan=uniform(0,360)", "orbit", "--altitude", "500"}, "distributions belong to --draw"},
		{"draw without cases", []string{"sweep", "--draw", "raan=uniform(0,360)", "orbit", "--altitude", "500"}, "draws need --cases"},
		{"cases without draw", []string{"sweep", "--vary", "raan=0:90:45", "--cases", "10", "orbit", "--altitude", "500"}, "--cases needs a --draw"},
		{"bad cases", []string{"sweep", "--draw", "raan=uniform(0,360)", "--cases", "ten", "orbit", "--altitude", "500"}, `--cases "ten"`},
		{"unknown flag", []string{"sweep", "--vary", "incl=40:60:5", "orbit", "--altitude", "500"}, "orbit has no flag --incl"},
		{"varied twice", []string{"sweep", "--vary", "raan=0:90:45", "--draw", "raan=uniform(0,1)", "--cases", "2", "orbit", "--altitude", "500"}, "raan is varied twice"},
		{"varied and given", []string{"sweep", "--vary", "inclination=40:60:5", "orbit", "--altitude", "500", "--inclination", "3"}, "--inclination is both varied and given to orbit"},
		{"shard zero", []string{"sweep", "--shard", "0/4", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, "K = 0 is outside 1..4"},
		{"shard beyond", []string{"sweep", "--shard", "5/4", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, "K = 5 is outside 1..4"},
		{"shard form", []string{"sweep", "--shard", "3", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, "--shard K/N"},
		{"seed", []string{"sweep", "--seed", "-1", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, `--seed "-1" is not a seed`},
		{"workers", []string{"sweep", "--workers", "0", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, `--workers "0"`},
		{"unknown output", []string{"sweep", "--vary", "raan=0:90:45", "--outputs", "period_s,perid_s", "orbit", "--altitude", "500"}, `orbit has no key "perid_s"; choose from the keys of 'orbit': body, epoch_utc, semi_major_axis_km`},
		{"list output", []string{"sweep", "--vary", "raan=0:90:45", "--outputs", "checks", "orbit", "--altitude", "500"}, `--outputs "checks" is a list or object`},
		{"bad path", []string{"sweep", "--vary", "raan=0:90:45", "--outputs", "checks.nosuch.pass", "orbit", "--altitude", "500"}, `no element "nosuch"`},
		{"ephemeris without final", []string{"sweep", "--vary", "raan=0:90:45", "--outputs", "final_x_km", "ephemeris", "--altitude", "500"}, "add --final to ephemeris"},
		{"unknown command", []string{"sweep", "--vary", "raan=0:90:45", "orbits", "--altitude", "500"}, `"orbits" is not a command that sweep can run; sweep one of:`},
		{"sweep of sweep", []string{"sweep", "--vary", "raan=0:90:45", "sweep", "orbit"}, `"sweep" is not a command that sweep can run`},
		{"format in command", []string{"sweep", "--vary", "raan=0:90:45", "orbit", "--altitude", "500", "--format", "csv"}, "--format cannot be given to the swept command; put --format before 'sweep'"},
		{"out in command", []string{"sweep", "--vary", "raan=0:90:45", "orbit", "--altitude", "500", "--out=x.csv"}, "--out cannot be given to the swept command"},
		{"format of sweep", []string{"--format", "oem", "sweep", "--vary", "raan=0:90:45", "orbit", "--altitude", "500"}, `--format "oem" is not a format of "sweep"`},
		{"nominal fails", []string{"sweep", "--vary", "altitude=-7000:-6500:500", "orbit"}, "the nominal case (--altitude -7000) fails: --altitude -7000 km puts the orbit inside the centre of earth; give an altitude above the body's centre"},
		{"nominal bad unit", []string{"sweep", "--vary", "altitude=400furlong:500furlong:100furlong", "orbit"}, `the nominal case (--altitude 400furlong) fails: --altitude "400furlong" is not a valid length`},
		{"nominal bad flag", []string{"sweep", "--vary", "altitude=400:500:100", "orbit", "--altitud", "3"}, "the nominal case (--altitude 400) fails: unknown flag --altitud for centra orbit"},
		{"unknown sweep flag", []string{"sweep", "--vari", "altitude=400:500:100", "orbit"}, "unknown flag --vari for centra sweep"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			stdout, stderr, code := runBinary(t, tt.args...)
			if code != 2 {
				t.Errorf("centra %s: exit %d, want 2 (stderr %q)", strings.Join(tt.args, " "), code, stderr)
			}
			if !strings.Contains(stderr, tt.msg) {
				t.Errorf("centra %s: stderr %q does not contain %q", strings.Join(tt.args, " "), stderr, tt.msg)
			}
			if lines := strings.Count(strings.TrimSpace(stderr), "\n"); lines != 0 || !strings.HasPrefix(stderr, "centra: ") {
				t.Errorf("centra %s: stderr %q is not one line 'centra: ...'", strings.Join(tt.args, " "), stderr)
			}
			if stdout != "" {
				t.Errorf("centra %s: stdout %q, want nothing", strings.Join(tt.args, " "), stdout)
			}
		})
	}
}

// readCSV parses a sweep's CSV into its header and rows.
func readCSV(t *testing.T, s string) ([]string, [][]string) {
	t.Helper()
	recs, err := csv.NewReader(strings.NewReader(s)).ReadAll()
	if err != nil || len(recs) == 0 {
		t.Fatalf("output is not CSV (%v):\n%s", err, s)
	}
	return recs[0], recs[1:]
}

func num(t *testing.T, s string) float64 {
	t.Helper()
	x, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("cell %q is not a number", s)
	}
	return x
}

// WGS 84 (NIMA TR8350.2, 3rd ed., Table 3.1 and 3.4): a = 6378137 m,
// GM = 3986004.418e8 m^3/s^2; the catalogue's Earth.
const (
	wgs84GM = 398600.4418 // km^3/s^2
	wgs84A  = 6378.137    // km
)

// The grid of the example: columns and units as documented, and
// every row obeys Kepler's third law, T = 2 pi sqrt(a^3/GM) with a = Re + h
// of that row, and the J2 secular node rate of a circular orbit,
// dOmega/dt = -3/2 n J2 (Re/a)^2 cos i (Vallado, Fundamentals of
// Astrodynamics and Applications, 4th ed., eq. 9-41; Curtis, Orbital
// Mechanics for Engineering Students, 3rd ed., eq. 4.52): the rate divided
// by cos(i) a^-7/2 is the same constant in every row. The law checks show
// the varied values reach the right flags.
func TestSweepGridLaws(t *testing.T) {
	stdout, stderr, code := runBinary(t, "--format", "csv", "sweep", "--vary", "inclination=40:60:5", "--vary", "altitude=400:800:100",
		"--outputs", "period_s,raan_rate_deg_day", "orbit", "--eccentricity", "0", "--epoch", fixedEpoch)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	head, rows := readCSV(t, stdout)
	if got, want := strings.Join(head, ","), "case,inclination_deg,altitude_km,period_s,raan_rate_deg_day,error"; got != want {
		t.Fatalf("header %s, want %s", got, want)
	}
	if len(rows) != 25 {
		t.Fatalf("%d rows, want 5 x 5 = 25", len(rows))
	}
	const relTol = 1e-12 // both sides are double-precision closed forms
	var k0 float64
	for i, r := range rows {
		if r[0] != strconv.Itoa(i) || r[5] != "" {
			t.Errorf("row %d: case %s, error %q", i, r[0], r[5])
		}
		incl, alt := num(t, r[1]), num(t, r[2])
		if wantI, wantH := 40+5*float64(i/5), 400+100*float64(i%5); incl != wantI || alt != wantH {
			t.Errorf("row %d: inclination %v altitude %v, want %v %v (first --vary outermost)", i, incl, alt, wantI, wantH)
		}
		a := wgs84A + alt
		if T, want := num(t, r[3]), 2*math.Pi*math.Sqrt(a*a*a/wgs84GM); math.Abs(T-want) > relTol*want {
			t.Errorf("row %d: period %v s, Kepler's third law %v s", i, T, want)
		}
		k := num(t, r[4]) / (math.Cos(incl*math.Pi/180) * math.Pow(a, -3.5))
		if i == 0 {
			k0 = k
		} else if math.Abs(k-k0) > relTol*math.Abs(k0) {
			t.Errorf("row %d: rate / (cos i a^-3.5) = %v, row 0 %v", i, k, k0)
		}
	}
}

// A point-mass propagation swept over the span reaches the states of the
// analytic Kepler solution (orbit.Propagate, an independent method)
// within the integrator's accuracy.
func TestSweepEphemerisFinalKepler(t *testing.T) {
	stdout, stderr, code := runApp("--format", "csv", "sweep", "--vary", "span=10min:100min:30min", "--vary", "model=point",
		"--outputs", "final_x_km,final_y_km,final_z_km,final_vx_km_s,final_vy_km_s,final_vz_km_s",
		"ephemeris", "--final", "--periapsis-alt", "300", "--apoapsis-alt", "3000", "--inclination", "63.4", "--raan", "20", "--arg-periapsis", "270",
		"--tolerance", "1e-12", "--epoch", fixedEpoch)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	head, rows := readCSV(t, stdout)
	if got, want := strings.Join(head, ","), "case,span_min,model,final_x_km,final_y_km,final_z_km,final_vx_km_s,final_vy_km_s,final_vz_km_s,error"; got != want {
		t.Fatalf("header %s, want %s", got, want)
	}
	rp, ra := wgs84A+300, wgs84A+3000
	el := orbit.Elements{A: (rp + ra) / 2, E: (ra - rp) / (ra + rp), I: 63.4 * math.Pi / 180, RAAN: 20 * math.Pi / 180, ArgP: 270 * math.Pi / 180}
	el.P = el.A * (1 - el.E*el.E)
	s0, err := orbit.StateFromElements(wgs84GM, el)
	if err != nil {
		t.Fatal(err)
	}
	const tolKm, tolKmS = 1e-5, 1e-8 // DOP853 at rtol 1e-12 over < 1 orbit: ~1e-7 km
	for i, r := range rows {
		dt := num(t, r[1]) * 60
		want, err := orbit.Propagate(wgs84GM, s0, dt)
		if err != nil {
			t.Fatal(err)
		}
		for k := range 3 {
			if d := math.Abs(num(t, r[3+k]) - want.R[k]); d > tolKm {
				t.Errorf("row %d (span %v s): r[%d] off the Kepler solution by %.3g km", i, dt, k, d)
			}
			if d := math.Abs(num(t, r[6+k]) - want.V[k]); d > tolKmS {
				t.Errorf("row %d (span %v s): v[%d] off the Kepler solution by %.3g km/s", i, dt, k, d)
			}
		}
	}
}

// Vallado, Fundamentals of Astrodynamics and Applications, 4th ed.,
// Example 2-4, from memory (also in orbit/propagate_test.go, where it is
// recomputed by SciPy in testdata/orbit/reference.py): r0 = (1131.340,
// -2282.343, 6672.423) km, v0 = (-5.64305, 4.30333, 2.42879) km/s, 40 min
// later r = (-4219.7527, 4363.0292, -3958.7666) km, v = (3.689866,
// -1.916735, -6.112511) km/s. Here it is reached by 'ephemeris --final'
// with the point-mass model and checked again against orbit.Propagate.
func TestEphemerisFinalVallado24(t *testing.T) {
	stdout, stderr, code := runBinary(t, "--format", "json", "ephemeris", "--final", "--model", "point", "--tolerance", "1e-12",
		"--position", "1131.340,-2282.343,6672.423", "--velocity", "-5.64305,4.30333,2.42879", "--span", "40min", "--epoch", fixedEpoch)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var got map[string]any
	if err := json.Unmarshal([]byte(stdout), &got); err != nil {
		t.Fatalf("not one JSON object: %v\n%s", err, stdout)
	}
	bookR := [3]float64{-4219.7527, 4363.0292, -3958.7666}
	bookV := [3]float64{3.689866, -1.916735, -6.112511}
	const tolR, tolV = 5e-5, 5e-7 // half a unit of the printed digits
	kepler, err := orbit.Propagate(wgs84GM, orbit.State{R: [3]float64{1131.340, -2282.343, 6672.423}, V: [3]float64{-5.64305, 4.30333, 2.42879}}, 2400)
	if err != nil {
		t.Fatal(err)
	}
	for k, axis := range []string{"x", "y", "z"} {
		r, _ := got["final_"+axis+"_km"].(float64)
		v, _ := got["final_v"+axis+"_km_s"].(float64)
		if math.Abs(r-bookR[k]) > tolR || math.Abs(v-bookV[k]) > tolV {
			t.Errorf("%s: r %.6f km v %.8f km/s, want %.4f %.6f (Vallado Ex. 2-4)", axis, r, v, bookR[k], bookV[k])
		}
		if math.Abs(r-kepler.R[k]) > 1e-6 || math.Abs(v-kepler.V[k]) > 1e-9 {
			t.Errorf("%s: r %.9f km v %.12f km/s, Kepler %.9f %.12f", axis, r, v, kepler.R[k], kepler.V[k])
		}
	}
	if got["span_s"] != 2400.0 || got["final_utc"] != "2026-01-01T00:40:00.000Z" {
		t.Errorf("span_s %v final_utc %v, want 2400 and 00:40", got["span_s"], got["final_utc"])
	}
}

// The end state's radius does not depend on the frame (the rotation to
// ITRF preserves length); --checks adds the scalar relative errors, which
// --expect can test; OEM is refused.
func TestEphemerisFinalOptions(t *testing.T) {
	base := []string{"ephemeris", "--final", "--altitude", "700", "--inclination", "98", "--span", "6h", "--epoch", fixedEpoch}
	radius := func(extra ...string) float64 {
		stdout, stderr, code := runBinary(t, append(append([]string{"--format", "json"}, base...), extra...)...)
		if code != 0 {
			t.Fatalf("exit %d: %s", code, stderr)
		}
		var got map[string]any
		if err := json.Unmarshal([]byte(stdout), &got); err != nil {
			t.Fatal(err)
		}
		r, _ := got["final_radius_km"].(float64)
		return r
	}
	inertial, fixed := radius(), radius("--frame", "fixed")
	if math.Abs(inertial-fixed) > 1e-9*inertial {
		t.Errorf("final radius %v km inertial, %v km fixed", inertial, fixed)
	}
	_, stderr, code := runBinary(t, append(base, "--checks", "--expect", "energy_conservation_relative_error=0±1e-7")...)
	if code != 0 {
		t.Errorf("--final --checks --expect: exit %d: %s", code, stderr)
	}
	_, stderr, code = runBinary(t, append(base, "--expect", "final_radius_km=1±1")...)
	if code != 1 || !strings.Contains(stderr, "1 of 1 expectations failed") {
		t.Errorf("--final failing --expect: exit %d, stderr %q", code, stderr)
	}
	_, stderr, code = runBinary(t, append([]string{"--format", "oem"}, base...)...)
	if code != 2 || !strings.Contains(stderr, "--final prints one record, not an OEM") {
		t.Errorf("--final --format oem: exit %d, stderr %q", code, stderr)
	}
}

// sweepBody returns the data rows of a CSV sweep.
func sweepBody(t *testing.T, args ...string) []string {
	t.Helper()
	stdout, stderr, code := runApp(args...)
	if code != 0 {
		t.Fatalf("centra %s: exit %d: %s", strings.Join(args, " "), code, stderr)
	}
	lines := strings.Split(strings.TrimSuffix(stdout, "\n"), "\n")
	return lines[1:]
}

// The union of all shards is the unsharded run, row for row, whatever
// the number of shards and of workers: case i's values depend on (seed,
// i) only.
func TestSweepShardUnion(t *testing.T) {
	study := []string{"--vary", "model=point,j2", "--draw", "altitude=uniform(400km,900km)", "--draw", "inclination=normal(60,10)",
		"--cases", "19", "--seed", "2027", "--outputs", "final_radius_km,final_z_km,steps"}
	cmd := []string{"ephemeris", "--final", "--span", "2h", "--raan", "10", "--epoch", fixedEpoch}
	run := func(extra ...string) []string {
		return sweepBody(t, append(append(append([]string{"--format", "csv", "sweep"}, extra...), study...), cmd...)...)
	}
	whole := run()
	if len(whole) != 38 {
		t.Fatalf("%d rows, want 2 x 19", len(whole))
	}
	for _, n := range []int{1, 3, 5, 38, 50} {
		var union []string
		for k := 1; k <= n; k++ {
			union = append(union, run("--shard", strconv.Itoa(k)+"/"+strconv.Itoa(n), "--workers", strconv.Itoa(1+k%3))...)
		}
		union = dropEmpty(union)
		if strings.Join(union, "\n") != strings.Join(whole, "\n") {
			t.Errorf("%d shards: union differs from the unsharded run:\n%s", n, diffLines(strings.Join(whole, "\n"), strings.Join(union, "\n")))
		}
	}
	// A different seed gives other draws for the same cases.
	other := sweepBody(t, append(append([]string{"--format", "csv", "sweep", "--seed", "2028"}, study[:len(study)-4]...), append([]string{"--outputs", "final_radius_km"}, cmd...)...)...)
	if strings.Split(other[0], ",")[2] == strings.Split(whole[0], ",")[2] {
		t.Errorf("seeds 2027 and 2028 drew the same altitude %s", strings.Split(whole[0], ",")[2])
	}
}

// dropEmpty drops the empty rows an empty shard leaves.
func dropEmpty(rows []string) []string {
	out := rows[:0]
	for _, r := range rows {
		if r != "" {
			out = append(out, r)
		}
	}
	return out
}

// A case runner that keeps its app between cases prints what a fresh
// app prints for each command line.
func TestCaseRunnerReuse(t *testing.T) {
	lines := [][]string{
		{"orbit", "--altitude", "500", "--inclination", "51.6"},
		{"orbit", "--periapsis-alt", "300", "--apoapsis-alt", "35786", "--expect", "period_s=1±1"},
		{"ephemeris", "--final", "--altitude", "600", "--model", "zonal", "--degree", "4", "--span", "3h"},
		{"orbit", "--altitude", "500"},
		{"ephemeris", "--final", "--altitude", "600", "--span", "3h", "--checks"},
		{"orbit", "--altitude", "-7000"},
	}
	r := newCaseRunner()
	for _, l := range lines {
		argv := append([]string{"centra", "--format", "json", "--quiet"}, append(l, "--epoch", fixedEpoch)...)
		got := r.run(argv)
		var out, errb bytes.Buffer
		err := newApp(&out, &errb).Run(argv)
		if string(got.record) != out.String() && got.err == nil {
			t.Errorf("%v: reused runner printed\n%s\nfresh app\n%s", l, got.record, out.String())
		}
		gotErr, wantErr := "", ""
		if got.err != nil {
			gotErr = got.err.Error()
		} else if got.expected != nil {
			gotErr = got.expected.Error()
		}
		if err != nil {
			wantErr = err.Error()
		}
		if gotErr != wantErr {
			t.Errorf("%v: reused runner error %q, fresh app %q", l, gotErr, wantErr)
		}
	}
}

// Failing cases are rows with their message; the sweep warns and exits 0.
// A failed --expect in a case sets exit code 1.
func TestSweepCaseFailures(t *testing.T) {
	stdout, stderr, code := runBinary(t, "--format", "csv", "sweep", "--vary", "periapsis-alt=300,-7000,500", "--outputs", "final_radius_km",
		"ephemeris", "--final", "--apoapsis-alt", "1000", "--model", "point", "--span", "2h", "--epoch", fixedEpoch)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	_, rows := readCSV(t, stdout)
	if len(rows) != 3 {
		t.Fatalf("%d rows, want 3", len(rows))
	}
	for i, r := range rows {
		wantErr := ""
		if i == 1 {
			wantErr = "--periapsis-alt -7000 km is below the centre of earth; raise the periapsis"
		}
		if r[3] != wantErr || (r[2] == "") != (wantErr != "") {
			t.Errorf("row %d: radius %q error %q, want error %q", i, r[2], r[3], wantErr)
		}
	}
	if !strings.Contains(stderr, "1 of 3 cases failed; the error column says why") {
		t.Errorf("stderr %q has no warning", stderr)
	}
	_, stderr, code = runBinary(t, "--format", "csv", "sweep", "--vary", "altitude=400:800:200", "--outputs", "period_s",
		"orbit", "--expect", "period_s=5553.6±1", "--epoch", fixedEpoch)
	if code != 1 || !strings.Contains(stderr, "2 of 3 expectations failed") {
		t.Errorf("--expect per case: exit %d, stderr %q, want 1 and 2 of 3", code, stderr)
	}
}

// Without --epoch every case gets the same (current) epoch.
func TestSweepPinsEpoch(t *testing.T) {
	stdout, stderr, code := runApp("--format", "csv", "sweep", "--vary", "altitude=400:2000:100", "--outputs", "epoch_utc", "orbit")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	_, rows := readCSV(t, stdout)
	for _, r := range rows {
		if r[2] != rows[0][2] {
			t.Fatalf("epochs %s and %s in one sweep", rows[0][2], r[2])
		}
	}
}

func TestSweepGolden(t *testing.T) {
	grid := []string{"sweep", "--vary", "inclination=40:60:10", "--vary", "altitude=400km:800km:200km",
		"--outputs", "period_s,raan_rate_deg_day,position_km,checks.energy.pass", "orbit", "--epoch", fixedEpoch}
	draws := []string{"sweep", "--vary", "model=point,j2", "--draw", "altitude=normal(550km,20km)", "--draw", "raan=uniform(0,360)", "--cases", "2", "--seed", "11",
		"--outputs", "final_radius_km,steps", "ephemeris", "--final", "--inclination", "97.6", "--span", "90min", "--epoch", fixedEpoch}
	tests := []struct {
		name string
		args []string
	}{
		{"grid_csv", append([]string{"--format", "csv"}, grid...)},
		{"grid_table", grid},
		{"draws_json", append([]string{"--format", "json"}, draws...)},
		{"draws_jsonl", append([]string{"--format", "jsonl"}, draws...)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			stdout, stderr, code := runBinary(t, tt.args...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			golden(t, "sweep/"+tt.name, stdout)
			if strings.HasPrefix(tt.name, "draws_json") {
				for _, line := range strings.Split(strings.TrimSpace(stdout), "\n") {
					line = strings.TrimSuffix(strings.TrimSpace(line), ",")
					if tt.name == "draws_json" && !strings.HasPrefix(line, `{"case"`) {
						continue
					}
					var m map[string]any
					if err := json.Unmarshal([]byte(line), &m); err != nil {
						t.Errorf("case line %q is not a JSON object: %v", line, err)
					}
				}
				if tt.name == "draws_json" {
					var doc struct{ Cases []map[string]any }
					if err := json.Unmarshal([]byte(stdout), &doc); err != nil || len(doc.Cases) != 4 {
						t.Errorf("json: %v, %d cases, want one object with 4 cases", err, len(doc.Cases))
					}
				}
			}
		})
	}
}

// BenchmarkSweepCase is the cost of one case of the 10,000-orbit target:
// a day of J2 propagation through 'ephemeris --final', in-process.
func BenchmarkSweepCase(b *testing.B) {
	argv := []string{"centra", "--format", "json", "--quiet", "ephemeris", "--final", "--altitude", "500", "--inclination", "51.6", "--epoch", fixedEpoch}
	r := newCaseRunner()
	b.ReportAllocs()
	for b.Loop() {
		if cr := r.run(argv); cr.err != nil {
			b.Fatal(cr.err)
		}
	}
}

// A sweep prints, for each case, what the command itself prints for the
// same command line: the plumbing adds and loses nothing.
func TestSweepMatchesDirect(t *testing.T) {
	tests := []struct {
		name   string
		vary   string
		output string
		cmd    []string
	}{
		{"orbit", "apoapsis-alt=1000km,20000km", "period_s", []string{"orbit", "--periapsis-alt", "400", "--inclination", "28.5"}},
		{"ephemeris", "model=point,j2,zonal", "final_z_km", []string{"ephemeris", "--final", "--altitude", "800", "--inclination", "98", "--span", "12h"}},
		{"ballistic", "burnout-speed=1.8km/s,2.1km/s", "apogee_alt_km", []string{"ballistic", "--site", "57.35,-7.33", "--burnout-alt", "35", "--flight-path-angle", "84", "--azimuth", "290"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			cmd := append(tt.cmd, "--epoch", fixedEpoch)
			args := append([]string{"--format", "csv", "sweep", "--vary", tt.vary, "--outputs", tt.output}, cmd...)
			stdout, stderr, code := runApp(args...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			_, rows := readCSV(t, stdout)
			name, list, _ := strings.Cut(tt.vary, "=")
			for i, v := range strings.Split(list, ",") {
				out, errs, code := runApp(append([]string{"--format", "json", "--quiet"}, append(cmd, "--"+name, v)...)...)
				if code != 0 {
					t.Fatalf("direct run: exit %d: %s", code, errs)
				}
				var rec map[string]json.RawMessage
				if err := json.Unmarshal([]byte(out), &rec); err != nil {
					t.Fatal(err)
				}
				if got, want := rows[i][2], string(rec[tt.output]); got != want {
					t.Errorf("--%s %s: sweep %s = %s, command %s", name, v, tt.output, got, want)
				}
			}
		})
	}
}
