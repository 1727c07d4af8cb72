package main

import (
	"encoding/csv"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// ballisticBase is a burnout over an invented launcher; the epoch is
// inside the leap-second table so that stderr stays empty.
const ballisticBase = "ballistic --epoch 2026-03-01T12:00:00Z --site 57.35,-7.33 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 84 --azimuth 290"

const ballisticDrag = " --mass 25 --area 0.02 --cd 0.9"

// Every error path of the ballistic command, through the built binary:
// exit 2 and one line "centra: <what>; <fix>".
func TestBallisticErrors(t *testing.T) {
	tests := []struct {
		name, args, msg string
	}{
		{"no burnout height", "ballistic --site 57,-7 --burnout-speed 2 --flight-path-angle 90", "needs the burnout height"},
		{"no point", "ballistic --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", "needs the burnout point"},
		{"half point", "ballistic --burnout-lat 57 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", "both its latitude and its longitude"},
		{"no speed", "ballistic --site 57,-7 --burnout-alt 35 --flight-path-angle 90", "needs the burnout speed"},
		{"no flight path", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2", "needs the flight-path angle"},
		{"no azimuth", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 80", "azimuth is needed"},
		{"bad site", "ballistic --site 57 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", "is not LAT,LON"},
		{"site latitude", "ballistic --site 95,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", "beyond ±90 deg"},
		{"burnout latitude", "ballistic --burnout-lat 91 --burnout-lon 0 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", "beyond ±90 deg"},
		{"bad unit", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2furlong --flight-path-angle 90", `"2furlong" is not a valid speed`},
		{"zero speed", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 0 --flight-path-angle 90", "--burnout-speed 0 is out of range"},
		{"nan speed", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed NaN --flight-path-angle 90", "--burnout-speed"},
		{"flight path range", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 100", "outside -90..90 deg"},
		{"below impact surface", "ballistic --site 57,-7 --burnout-alt 0.5 --impact-alt 1 --burnout-speed 2 --flight-path-angle 90", "--burnout-alt 0.5 is out of range"},
		{"descending from the surface", "ballistic --site 57,-7 --burnout-alt 0 --burnout-speed 2 --flight-path-angle -10 --azimuth 0", "must climb"},
		{"above below impact", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --above 0 --impact-alt 1", "not above the impact surface"},
		{"escape", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 12 --flight-path-angle 90", "escape speed"},
		{"orbit", "ballistic --site 57,-7 --burnout-alt 300 --burnout-speed 7.8 --flight-path-angle 0 --azimuth 90", "reaches orbit"},
		{"orbit with drag", "ballistic --site 0,0 --burnout-alt 400 --burnout-speed 7.2 --flight-path-angle 0 --azimuth 90 --mass 100 --area 1 --cd 2.2", "no impact"},
		{"partial vehicle", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --mass 10 --area 0.1", "mass, reference area and drag coefficient"},
		{"zero cd", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --mass 10 --area 0.1 --cd 0", "--cd must be positive"},
		{"cd too large", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --mass 10 --area 0.1 --cd 40", "is not a drag coefficient"},
		{"bc and cd", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --ballistic-coefficient 100 --cd 1", "both set the drag"},
		{"drag flag", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --drag", "--drag is not used by ballistic"},
		{"third body", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --third-body sun", "--third-body is not used"},
		{"density scale", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --density-scale 2", "--density-scale is not used"},
		{"polar with drag", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --model point --equations polar --mass 10 --area 0.1 --cd 1", "use --equations fast or engine"},
		{"degree", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --model zonal --degree 9", "is not a zonal degree"},
		{"step", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --step 0", "--step 0 is below 1 ms"},
		{"too many rows", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --step 1ms", "rows over the"},
		{"sigma without dispersions", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --sigma-speed 0.01", "--sigma-speed needs --dispersions"},
		{"nothing to disperse", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 10", "nothing to disperse"},
		{"one case", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 1 --sigma-speed 0.01", `--dispersions "1" is not usable`},
		{"negative sigma", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 5 --sigma-azimuth -1", "is negative"},
		{"huge sigma", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 5 --sigma-speed 1", "too large"},
		{"sigma cd without drag", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 5 --sigma-cd 0.1", "--sigma-cd needs drag"},
		{"bad seed", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --dispersions 5 --sigma-speed 0.01 --seed x", `--seed "x" is not usable`},
		{"dispersed into orbit", "ballistic --site 0,0 --burnout-alt 300 --burnout-speed 7.9 --flight-path-angle 0 --azimuth 270 --dispersions 50 --sigma-speed 0.2", "dispersion case"},
		{"expect unknown key", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --expect apogee_km=100±1", `no result named "apogee_km"`},
		{"stray argument", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 extra", `unexpected argument "extra"`},
		{"unknown flag", "ballistic --site 57,-7 --burnout-alt 35 --burnout-sped 2", "burnout-sped"},
		{"bad format", "--format oem ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90", `--format "oem"`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			args := append(strings.Fields(tt.args), "--epoch", "2026-03-01T12:00:00Z")
			if tt.name == "stray argument" {
				args = strings.Fields(tt.args)
			}
			stdout, stderr, code := runBinary(t, args...)
			if code != 2 {
				t.Fatalf("centra %s: exit %d, want 2 (stderr %q)", tt.args, code, stderr)
			}
			if !strings.Contains(stderr, tt.msg) {
				t.Errorf("centra %s: stderr %q does not contain %q", tt.args, stderr, tt.msg)
			}
			if !strings.HasPrefix(stderr, "centra: ") || strings.Count(strings.TrimSpace(stderr), "\n") != 0 || !strings.Contains(stderr, "; ") {
				t.Errorf("centra %s: stderr is not one 'centra: <what>; <fix>' line: %q", tt.args, stderr)
			}
			if stdout != "" {
				t.Errorf("centra %s: printed %q on stdout", tt.args, stdout)
			}
		})
	}
}

// Golden files of the ballistic output in each format. Their numbers are
// checked against the world by the tests of propagate/suborbital (flat
// Earth, conic free flight, the westward deflection, SciPy arcs,
// terminal speed, the linear covariance); these pin the layout.
func TestBallisticGolden(t *testing.T) {
	cases := []struct{ name, args string }{
		{"ballistic/vacuum-table", ballisticBase},
		{"ballistic/drag-table-arc", ballisticBase + ballisticDrag + " --step 60s"},
		{"ballistic/drag-dispersion-table", ballisticBase + ballisticDrag + " --dispersions 100 --sigma-speed 10m/s --sigma-flight-path-angle 0.5 --sigma-azimuth 1 --sigma-cd 0.05"},
		{"ballistic/vacuum-csv", "--format csv " + ballisticBase},
		{"ballistic/arc-csv", "--format csv --quiet " + ballisticBase + " --step 100s"},
		{"ballistic/dispersion-json", "--format json " + ballisticBase + ballisticDrag + " --dispersions 4 --sigma-speed 10m/s --sigma-cd 0.05 --step 150s"},
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

// TestBallisticJSON checks the contract's keys, the lists and that every
// number is finite.
func TestBallisticJSON(t *testing.T) {
	out, stderr, code := runBinary(t, strings.Fields("--format json "+ballisticBase+ballisticDrag+" --dispersions 20 --sigma-speed 10m/s --sigma-azimuth 1 --step 30s")...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, out)
	}
	for _, k := range []string{"apogee_alt_km", "time_to_apogee_s", "time_above_s", "flight_time_s", "impact_lat_deg", "impact_lon_deg",
		"ground_range_km", "impact_speed_km_s", "apogee_utc", "apogee_lat_deg", "apogee_lon_deg", "impact_utc",
		"ellipse_1sigma_major_km", "ellipse_1sigma_minor_km", "ellipse_3sigma_major_km", "ellipse_3sigma_minor_km", "ellipse_major_azimuth_deg",
		"mean_impact_lat_deg", "mean_impact_lon_deg", "apogee_alt_mean_km", "apogee_alt_std_km", "time_above_mean_s", "time_above_std_s"} {
		if _, ok := m[k]; !ok {
			t.Errorf("JSON has no %q", k)
		}
	}
	if c, _ := m["cautions"].([]any); len(c) < 3 {
		t.Errorf("cautions %v", m["cautions"])
	}
	if c, _ := m["cases"].([]any); len(c) != 20 {
		t.Errorf("%d cases, want 20", len(c))
	}
	arc, _ := m["arc"].([]any)
	if len(arc) < 10 {
		t.Fatalf("arc has %d points", len(arc))
	}
	last := arc[len(arc)-1].(map[string]any)
	if last["t_s"] != m["flight_time_s"] || last["lat_deg"] != m["impact_lat_deg"] {
		t.Errorf("the last arc point %v is not the impact", last)
	}
	if strings.Contains(out, "NaN") || strings.Contains(out, "Inf") {
		t.Error("non-finite number in the JSON")
	}
}

// TestBallisticVerticalAtThePole: at the pole the ellipsoid normal is the
// radius, so a vertical launch in a point-mass field over a non-rotating
// Earth climbs to the radius r_a of energy conservation,
// v^2/2 - mu/r0 = -mu/r_a (vis-viva at the turning point), and falls back
// onto the launch point; the time up is that of the radial Kepler problem
// t = sqrt(a^3/mu) (E - sin E)|, with a = r_a/2 and cos E = 1 - r/a
// (Kepler's equation M = E - e sin E for the rectilinear ellipse e = 1;
// E runs from E0 to pi). Checks the command's units end to end.
func TestBallisticVerticalAtThePole(t *testing.T) {
	const (
		mu = 398600.4418                      // km^3/s^2, WGS 84
		b  = 6378.137 * (1 - 1/298.257223563) // km, WGS 84 polar radius
		v  = 3.0                              // km/s
		h0 = 20.0                             // km
	)
	out, stderr, code := runBinary(t, "--format", "json", "ballistic", "--epoch", "2026-03-01T12:00:00Z", "--burnout-lat", "90", "--burnout-lon", "0",
		"--burnout-alt", "20", "--burnout-speed", "3000m/s", "--flight-path-angle", "90", "--model", "point", "--non-rotating", "--impact-alt", "20", "--tolerance", "1e-12")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	r0 := b + h0
	ra := 1 / (1/r0 - v*v/(2*mu))
	a := ra / 2
	e0 := math.Acos(1 - r0/a)
	tUp := math.Sqrt(a*a*a/mu) * (math.Pi - (e0 - math.Sin(e0)))
	for _, c := range []struct {
		key       string
		want, tol float64
	}{
		{"apogee_alt_km", ra - b, 1e-6},
		{"time_to_apogee_s", tUp, 1e-6},
		{"flight_time_s", 2 * tUp, 1e-6},
		{"impact_speed_km_s", v, 1e-9},
		{"ground_range_km", 0, 1e-6},
	} {
		got, _ := m[c.key].(float64)
		if math.Abs(got-c.want) > c.tol {
			t.Errorf("%s = %.12g, want %.12g ± %g (energy, radial Kepler)", c.key, got, c.want, c.tol)
		}
	}
}

// TestBallisticExpect: --expect against the apogee of a vertical launch
// from the pole of a non-rotating Earth in a point-mass field, from
// energy conservation (see TestBallisticVerticalAtThePole): 1/r_a =
// 1/r0 - v^2/(2 mu).
func TestBallisticExpect(t *testing.T) {
	const (
		mu = 398600.4418                      // km^3/s^2, WGS 84
		b  = 6378.137 * (1 - 1/298.257223563) // km, WGS 84 polar radius
	)
	r0 := b + 20
	apogee := 1/(1/r0-3.0*3.0/(2*mu)) - b
	args := strings.Fields("ballistic --epoch 2026-03-01T12:00:00Z --burnout-lat 90 --burnout-lon 0 --burnout-alt 20 --burnout-speed 3 --flight-path-angle 90 --model point --non-rotating --impact-alt 20 --tolerance 1e-12")
	pass := append(args, "--expect", "apogee_alt_km="+strconv.FormatFloat(apogee, 'f', 9, 64)+"±1e-6", "--expect", "ground_range_km=0±1m")
	if _, stderr, code := runBinary(t, pass...); code != 0 {
		t.Errorf("passing expectations: exit %d, %s", code, stderr)
	}
	fail := append(args, "--expect", "apogee_alt_km="+strconv.FormatFloat(apogee+1, 'f', 9, 64)+"±1e-3")
	out, stderr, code := runBinary(t, fail...)
	if code != 1 || !strings.Contains(stderr, "1 of 1 expectations failed") || !strings.Contains(out, "Expectations") {
		t.Errorf("failing expectation: exit %d, stderr %q", code, stderr)
	}
}

// TestBallisticStreams: CSV keeps stdout one document and puts the
// cautions on stderr unless --quiet.
func TestBallisticStreams(t *testing.T) {
	out, stderr, code := runBinary(t, strings.Fields("--format csv "+ballisticBase)...)
	if code != 0 || !strings.Contains(stderr, "Planning estimate only") || strings.Contains(out, "Planning") {
		t.Errorf("csv: exit %d, cautions not on stderr only: %q", code, stderr)
	}
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil || len(rows) != 2 || rows[0][0] != "burnout_utc" {
		t.Errorf("csv: %d rows, %v", len(rows), err)
	}
	_, stderr, _ = runBinary(t, strings.Fields("--format csv --quiet "+ballisticBase)...)
	if stderr != "" {
		t.Errorf("csv --quiet: stderr %q", stderr)
	}
	out, stderr, _ = runBinary(t, strings.Fields("--format csv "+ballisticBase+" --step 10s")...)
	if !strings.HasPrefix(out, "utc,t_s,lat_deg,lon_deg,alt_km,speed_km_s\n") || !strings.Contains(stderr, "apogee_alt_km") {
		t.Errorf("csv --step: stdout %.60q, stderr %.60q", out, stderr)
	}
	out, _, _ = runBinary(t, strings.Fields(ballisticBase)...)
	for _, want := range []string{"Cautions", "safety office", "impact point uncertainty", "apogee_alt_km", "ground_range_km"} {
		if !strings.Contains(out, want) {
			t.Errorf("table has no %q", want)
		}
	}
}

func TestBallisticDispersionsOut(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "cases.csv")
	args := strings.Fields(ballisticBase + ballisticDrag + " --dispersions 30 --sigma-speed 10m/s --sigma-cd 0.05 --dispersions-out " + path)
	_, stderr, code := runBinary(t, args...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(f).ReadAll()
	f.Close()
	if err != nil || len(rows) != 31 || strings.Join(rows[0], ",") != "case,speed_km_s,flight_path_angle_deg,azimuth_deg,cd,apogee_alt_km,time_above_s,flight_time_s,impact_lat_deg,impact_lon_deg,east_km,north_km" {
		t.Fatalf("%d rows, header %v, %v", len(rows), rows[0], err)
	}
	// The same seed gives the same file; an existing file needs --force.
	_, stderr, code = runBinary(t, args...)
	if code != 2 || !strings.Contains(stderr, "--dispersions-out") || !strings.Contains(stderr, "already exists") {
		t.Errorf("existing file: exit %d, %q", code, stderr)
	}
	first, _ := os.ReadFile(path)
	_, _, code = runBinary(t, append(args, "--force")...)
	second, _ := os.ReadFile(path)
	if code != 0 || string(first) != string(second) {
		t.Errorf("--force: exit %d, the same seed gave another file", code)
	}
	_, stderr, code = runBinary(t, strings.Fields(ballisticBase+" --dispersions-out "+filepath.Join(dir, "x.csv"))...)
	if code != 2 || !strings.Contains(stderr, "needs --dispersions") {
		t.Errorf("--dispersions-out alone: exit %d, %q", code, stderr)
	}
	_, stderr, code = runBinary(t, strings.Fields(ballisticBase+" --dispersions 5 --sigma-speed 0.01 --dispersions-out /nonexistent/dir/x.csv")...)
	if code != 2 || !strings.Contains(stderr, "--dispersions-out") {
		t.Errorf("bad directory: exit %d, %q", code, stderr)
	}
}

func TestBallisticHelpAndDemo(t *testing.T) {
	out, _, code := runBinary(t, "ballistic", "--help")
	if code != 0 || !strings.Contains(out, "examples:") || !strings.Contains(out, "centra ballistic --site") {
		t.Errorf("ballistic --help: exit %d:\n%s", code, out)
	}
	out, stderr, code := runBinary(t, "demo")
	if code != 0 || !strings.Contains(out, "HERON-S") || !strings.Contains(out, "Impact dispersion, 200 cases") {
		t.Errorf("demo: exit %d, %s", code, stderr)
	}
}
