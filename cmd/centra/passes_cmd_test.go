package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// Every error path of passes (and of the site flags), run through the
// built binary: exit 2 and one line that names the input and the fix.
func TestPassesErrorPaths(t *testing.T) {
	dir := t.TempDir()
	badMask := filepath.Join(dir, "bad-mask.txt")
	os.WriteFile(badMask, []byte("# az el\n0 5\n90 high\n"), 0o644)
	unordered := filepath.Join(dir, "unordered.txt")
	os.WriteFile(unordered, []byte("90 5\n45 6\n"), 0o644)
	emptyMask := filepath.Join(dir, "empty.txt")
	os.WriteFile(emptyMask, []byte("# nothing\n"), 0o644)
	orbit := "passes --epoch 2027-04-13T00:00:00Z --altitude 500 --inclination 97.4 "
	tests := []struct {
		name, args, msg string
	}{
		{"missing site", orbit, "passes needs a ground site; give --site"},
		{"site not numbers", orbit + "--site abc", `--site "abc" is not LAT,LON[,ALT_M]`},
		{"site one part", orbit + "--site 47.4", `--site "47.4" is not LAT,LON[,ALT_M]`},
		{"site four parts", orbit + "--site 1,2,3,4", `is not LAT,LON[,ALT_M]`},
		{"site bad part", orbit + "--site 47.4,east", `"east" is not a number`},
		{"site nan", orbit + "--site NaN,8", `"NaN" is not a number`},
		{"site empty name", orbit + "--site =47,8", "empty name"},
		{"latitude beyond 90", orbit + "--site 90.5,8", "latitude 90.5 deg is beyond ±90 deg; give a geodetic latitude from -90 to 90 deg"},
		{"latitude beyond -90", orbit + "--site -91,8", "latitude -91 deg is beyond ±90 deg"},
		{"longitude outside 360", orbit + "--site 47,361", "longitude 361 deg is outside ±360 deg; give a longitude from -180 to 180 deg"},
		{"longitude outside -360", orbit + "--site 47,-400", "longitude -400 deg is outside ±360 deg"},
		{"height out of range", orbit + "--site 47,8,200000", "height 200000 m is out of range"},
		{"duplicate names", orbit + "--site a=1,2 --site a=3,4", `two sites are named "a"`},
		{"min elevation above 90", orbit + "--site 47,8 --min-elevation 95", "--min-elevation 95 is outside -5..90 deg; give a minimum elevation from -5 to 90 deg"},
		{"min elevation below -5", orbit + "--site 47,8 --min-elevation -6deg", "--min-elevation -6deg is outside -5..90 deg"},
		{"min elevation in rad", orbit + "--site 47,8 --min-elevation 2rad", "--min-elevation 2rad is outside -5..90 deg"},
		{"min elevation not an angle", orbit + "--site 47,8 --min-elevation high", `--min-elevation "high" is not a valid angle`},
		{"min elevation count", orbit + "--site a=1,2 --site b=3,4 --site c=5,6 --min-elevation 5 --min-elevation 6", "2 --min-elevation values for 3 sites; give one --min-elevation for all sites or one per --site"},
		{"mask missing", orbit + "--site 47,8 --mask /nonexistent/hill.txt", `--mask "/nonexistent/hill.txt" cannot be read`},
		{"mask bad line", orbit + "--site 47,8 --mask " + badMask, `line 3 "90 high": want two numbers: azimuth_deg elevation_deg; write one 'AZIMUTH_DEG ELEVATION_DEG' pair per line`},
		{"mask unordered", orbit + "--site 47,8 --mask " + unordered, "azimuth 45 deg does not increase"},
		{"mask empty", orbit + "--site 47,8 --mask " + emptyMask, "no points"},
		{"mask count", orbit + "--site a=1,2 --site b=3,4 --site c=5,6 --mask " + emptyMask + " --mask " + emptyMask, "2 --mask values for 3 sites"},
		{"frequency negative", orbit + "--site 47,8 --frequency -5", "--frequency -5 is not positive; give the carrier frequency in MHz"},
		{"frequency zero", orbit + "--site 47,8 --frequency 0", "--frequency 0 is not positive"},
		{"frequency unit", orbit + "--site 47,8 --frequency 5furlongs", `--frequency "5furlongs" is not a valid frequency`},
		{"site on mars", "passes --epoch 2027-04-13T00:00:00Z --body mars --altitude 300 --site 0,0", "ground sites on mars are not supported; use --body earth"},
		{"span negative", orbit + "--site 47,8 --span -1d", "--span -1d is not positive"},
		{"span too long", orbit + "--site 47,8 --span 200d", "--span 200d is too long for passes; give a span of at most 100d"},
		{"orbit below surface", "passes --epoch 2027-04-13T00:00:00Z --periapsis-alt -200 --apoapsis-alt 500 --site 47,8", "periapsis altitude -200.000 km is below the surface of earth"},
		{"dut1", orbit + "--site 47,8 --dut1 1.5", `--dut1 "1.5" is not usable`},
		{"expect unknown key", orbit + "--site 47,8 --expect passes_total=3±1", `no result named "passes_total"`},
		{"stray argument", orbit + "--site 47,8 extra", `unexpected argument "extra"`},
		{"eclipses on mars", "eclipses --epoch 2027-04-13T00:00:00Z --body mars --altitude 300", "eclipses need the Sun's position relative to the central body, which centra has for the Earth only (not mars); use --body earth"},
		{"eclipses span", "eclipses --epoch 2027-04-13T00:00:00Z --altitude 500 --span 400d", "--span 400d is too long for eclipses"},
		{"eclipses below surface", "eclipses --epoch 2027-04-13T00:00:00Z --periapsis-alt -50 --apoapsis-alt 500", "is below the surface"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, stderr, code := runBinary(t, strings.Fields(tt.args)...)
			if code != 2 {
				t.Errorf("centra %s: exit %d, want 2 (stderr %q)", tt.args, code, stderr)
			}
			if !strings.Contains(stderr, tt.msg) {
				t.Errorf("centra %s:\nstderr %q\ndoes not contain %q", tt.args, stderr, tt.msg)
			}
			if !strings.HasPrefix(stderr, "centra: ") || strings.Count(strings.TrimSpace(stderr), "\n") != 0 || !strings.Contains(stderr, "; ") {
				t.Errorf("centra %s: stderr is not one 'centra: what; fix' line: %q", tt.args, stderr)
			}
		})
	}
}

// passesJSON is the JSON contract of passes.
type passesJSON struct {
	Site *struct {
		Name string `json:"name"`
	} `json:"site"`
	Sites []struct {
		Name      string `json:"name"`
		PassCount int    `json:"pass_count"`
	} `json:"sites"`
	PassCount int `json:"pass_count"`
	Passes    []struct {
		Site        string  `json:"site"`
		AOSUTC      string  `json:"aos_utc"`
		TCAUTC      string  `json:"tca_utc"`
		LOSUTC      string  `json:"los_utc"`
		AOS         float64 `json:"aos_t_s"`
		TCA         float64 `json:"tca_t_s"`
		LOS         float64 `json:"los_t_s"`
		Duration    float64 `json:"duration_s"`
		MaxEl       float64 `json:"max_elevation_deg"`
		AOSAz       float64 `json:"aos_azimuth_deg"`
		LOSAz       float64 `json:"los_azimuth_deg"`
		MinRange    float64 `json:"min_range_km"`
		Sunlit      *bool   `json:"sunlit"`
		SiteDark    *bool   `json:"site_dark"`
		Partial     bool    `json:"partial"`
		RRTCA       float64 `json:"range_rate_tca_km_s"`
		DopplerTCA  float64 `json:"doppler_tca_hz"`
		DopplerAOS  float64 `json:"doppler_aos_hz"`
		RRAOS       float64 `json:"range_rate_aos_km_s"`
		SunElDeg    float64 `json:"sun_elevation_deg"`
		AOSElDeg    float64 `json:"aos_elevation_deg"`
		TCAAzimuth  float64 `json:"tca_azimuth_deg"`
		AOSRangeKm  float64 `json:"aos_range_km"`
		LOSRangeKm  float64 `json:"los_range_km"`
		LOSElDeg    float64 `json:"los_elevation_deg"`
		RRLOS       float64 `json:"range_rate_los_km_s"`
		DopplerLOS  float64 `json:"doppler_los_hz"`
		RangeRateTC float64 `json:"-"`
	} `json:"passes"`
	Notes []string `json:"notes"`
}

func runPassesJSON(t *testing.T, args ...string) passesJSON {
	t.Helper()
	out, stderr, code := runBinary(t, append([]string{"--quiet", "--format", "json", "passes"}, args...)...)
	if code != 0 {
		t.Fatalf("centra passes %v: exit %d: %s", args, code, stderr)
	}
	var res passesJSON
	if err := json.Unmarshal([]byte(out), &res); err != nil {
		t.Fatalf("JSON: %v\n%s", err, out)
	}
	return res
}

// refPasses reads testdata/passes/passes_reference.json (SciPy DOP853
// with J2 and ERFA c2t06a, gd2gc; see the script beside it).
type refPasses struct {
	Epoch    string     `json:"epoch_utc"`
	Position [3]float64 `json:"position_km"`
	Velocity [3]float64 `json:"velocity_km_s"`
	Cases    []struct {
		Site struct {
			Name  string  `json:"name"`
			Lat   float64 `json:"lat_deg"`
			Lon   float64 `json:"lon_deg"`
			Alt   float64 `json:"alt_m"`
			MinEl float64 `json:"min_elevation_deg"`
		} `json:"site"`
		Passes []struct {
			AOS, TCA, LOS, MaxEl, AOSAz, LOSAz, MinRange, RRTCA, RRAOS float64
		} `json:"-"`
		Raw []map[string]any `json:"passes"`
	} `json:"cases"`
}

func loadRefPasses(t *testing.T) refPasses {
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "passes", "passes_reference.json"))
	if err != nil {
		t.Fatal(err)
	}
	var ref refPasses
	if err := json.Unmarshal(data, &ref); err != nil {
		t.Fatal(err)
	}
	return ref
}

func vec(v [3]float64) string { return fmt.Sprintf("%.15g,%.15g,%.15g", v[0], v[1], v[2]) }

// The whole command against the independent SciPy/ERFA passes of two
// sites in one run (sites computed in parallel): AOS and LOS within
// 0.01 s (the issue asks for 1 s), greatest elevation within 1e-4 deg
// (the issue asks for 0.01 deg), the least range within 1 m, the Doppler
// shift -f rr/c at AOS from the reference range rate within 0.1 Hz at
// 437.5 MHz (the range rate within 2e-5 km/s, the trajectory's velocity
// bound, is 0.03 Hz). See TestPassesAgainstSciPyERFA in package
// visibility for the error budget.
func TestPassesCommandAgainstReference(t *testing.T) {
	ref := loadRefPasses(t)
	args := []string{"--epoch", "2027-04-13T00:00:00Z", "--position", vec(ref.Position), "--velocity", vec(ref.Velocity), "--frequency", "437.5"}
	for _, c := range ref.Cases {
		args = append(args, "--site", fmt.Sprintf("%s=%g,%g,%g", c.Site.Name, c.Site.Lat, c.Site.Lon, c.Site.Alt), "--min-elevation", fmt.Sprint(c.Site.MinEl))
	}
	res := runPassesJSON(t, args...)
	if res.Site != nil || len(res.Sites) != 2 {
		t.Fatalf("site %v, sites %v: want no single site and two sites", res.Site, res.Sites)
	}
	const c = 299792.458 // km/s, exact (SI)
	total := 0
	for _, cs := range ref.Cases {
		var got []int
		for i, p := range res.Passes {
			if p.Site == cs.Site.Name {
				got = append(got, i)
			}
		}
		if len(got) != len(cs.Raw) {
			t.Fatalf("site %s: %d passes, want %d", cs.Site.Name, len(got), len(cs.Raw))
		}
		total += len(got)
		for k, w := range cs.Raw {
			g := res.Passes[got[k]]
			num := func(key string) float64 { return w[key].(float64) }
			checks := []struct {
				name      string
				got, want float64
				tol       float64
			}{
				{"aos_t_s", g.AOS, num("aos_t_s"), 0.01},
				{"los_t_s", g.LOS, num("los_t_s"), 0.01},
				{"tca_t_s", g.TCA, num("tca_t_s"), 0.05},
				{"duration_s", g.Duration, num("duration_s"), 0.02},
				{"max_elevation_deg", g.MaxEl, num("max_elevation_deg"), 1e-4},
				{"aos_azimuth_deg", g.AOSAz, num("aos_azimuth_deg"), 1e-3},
				{"los_azimuth_deg", g.LOSAz, num("los_azimuth_deg"), 1e-3},
				{"min_range_km", g.MinRange, num("min_range_km"), 1e-3},
				{"doppler_aos_hz", g.DopplerAOS, -437.5e6 * num("range_rate_aos_km_s") / c, 0.1},
				{"sun_elevation_deg", g.SunElDeg, num("sun_elevation_deg"), 0.01},
			}
			for _, ch := range checks {
				if math.Abs(ch.got-ch.want) > ch.tol {
					t.Errorf("site %s pass %d %s = %.9g, want %.9g ± %g", cs.Site.Name, k, ch.name, ch.got, ch.want, ch.tol)
				}
			}
			if g.AOSUTC[:19] != w["aos_utc"].(string)[:19] && math.Abs(math.Mod(g.AOS, 1)-0.5) > 0.01 {
				t.Errorf("aos_utc %s, reference %s", g.AOSUTC, w["aos_utc"])
			}
			if g.Sunlit == nil || g.SiteDark == nil {
				t.Errorf("pass without sunlit or site_dark")
			} else if *g.SiteDark != (num("sun_elevation_deg") < -6) {
				t.Errorf("site_dark %v with the reference Sun at %.3f deg", *g.SiteDark, num("sun_elevation_deg"))
			}
		}
	}
	// Passes of all sites are in time order.
	for i := 1; i < len(res.Passes); i++ {
		if res.Passes[i].AOS < res.Passes[i-1].AOS {
			t.Errorf("passes not in time order at %d", i)
		}
	}
	if res.PassCount != total {
		t.Errorf("pass_count %d, want %d", res.PassCount, total)
	}
}

// The overhead pass of the reference crosses the zenith: it rises in the
// north-north-east and sets in the south-south-west (azimuths 11.13 and
// 192.80 deg, from the reference), and its Doppler shift changes sign
// within 1 s of TCA; --expect reads the reference values.
func TestPassesOverheadAndExpect(t *testing.T) {
	ref := loadRefPasses(t)
	s := ref.Cases[0].Site
	w := ref.Cases[0].Raw[0]
	base := []string{"--epoch", "2027-04-13T00:00:00Z", "--position", vec(ref.Position), "--velocity", vec(ref.Velocity),
		"--site", fmt.Sprintf("%g,%g,%g", s.Lat, s.Lon, s.Alt), "--span", "1h", "--frequency", "2250"}
	res := runPassesJSON(t, base...)
	if len(res.Passes) != 1 || res.Site == nil {
		t.Fatalf("passes %+v", res.Passes)
	}
	p := res.Passes[0]
	swing := func(a, b float64) float64 { return math.Mod(b-a+720, 360) }
	if d, want := swing(p.AOSAz, p.LOSAz), swing(w["aos_azimuth_deg"].(float64), w["los_azimuth_deg"].(float64)); math.Abs(d-want) > 0.002 || math.Abs(d-180) > 5 {
		t.Errorf("azimuth swing %v deg, want %v (reference %v -> %v)", d, want, w["aos_azimuth_deg"], w["los_azimuth_deg"])
	}
	// The Doppler shift at TCA is the range rate there times -f/c; its
	// zero lies within 1 s: |rr(TCA)| < 1 s * (the range acceleration at
	// the zenith, v^2/h = 7.6^2/519 = 0.11 km/s^2).
	if math.Abs(p.RRTCA) > 0.11 {
		t.Errorf("range rate at TCA %v km/s: its zero is more than 1 s away", p.RRTCA)
	}
	if want := -2250e6 * p.RRTCA / 299792.458; math.Abs(p.DopplerTCA-want) > 1e-9*math.Abs(want)+1e-9 {
		t.Errorf("doppler_tca_hz %v, want -f rr/c = %v", p.DopplerTCA, want)
	}
	expect := append([]string{"--quiet", "passes"}, base...)
	pass := append(append([]string(nil), expect...),
		"--expect", "pass_count=1±0",
		"--expect", fmt.Sprintf("first_max_elevation_deg=%.6f±0.001", w["max_elevation_deg"]),
		"--expect", fmt.Sprintf("first_aos_t_s=%.3f±0.01", w["aos_t_s"]),
		"--expect", fmt.Sprintf("first_duration_s=%.3fs±0.02s", w["duration_s"]))
	if out, stderr, code := runBinary(t, pass...); code != 0 {
		t.Errorf("expectations from the reference fail: exit %d\n%s%s", code, out, stderr)
	}
	fail := append(append([]string(nil), expect...), "--expect", "pass_count=2±0")
	if _, stderr, code := runBinary(t, fail...); code != 1 || !strings.Contains(stderr, "1 of 1 expectations failed") {
		t.Errorf("a wrong pass_count: exit %d, stderr %q; want 1", code, stderr)
	}
}

// A geostationary spacecraft over the site never sets: one window over
// the span, partial, with a note; from the far side it never rises: an
// empty list and a note. (At this epoch the spacecraft of --altitude 35786
// with the default angles stands over longitude 159.4 deg, as
// 'centra ephemeris --frame geodetic' shows.)
func TestPassesGeostationaryAndNever(t *testing.T) {
	args := []string{"--epoch", "2027-04-13T00:00:00Z", "--altitude", "35786", "--model", "point", "--span", "12h"}
	res := runPassesJSON(t, append(args, "--site", "0,150")...)
	if len(res.Passes) != 1 || !res.Passes[0].Partial || res.Passes[0].AOS != 0 || res.Passes[0].LOS != 43200 {
		t.Fatalf("geostationary passes %+v: want one partial window over the span", res.Passes)
	}
	if len(res.Notes) != 1 || !strings.Contains(res.Notes[0], "stays above 0 deg for the whole span") {
		t.Errorf("notes %q", res.Notes)
	}
	far := runPassesJSON(t, append(args, "--site", "far=0,-20")...)
	if len(far.Passes) != 0 || far.PassCount != 0 {
		t.Fatalf("passes from the far side %+v", far.Passes)
	}
	if len(far.Notes) != 1 || !strings.HasPrefix(far.Notes[0], "far: no pass above 0 deg over the span; the highest elevation reached is -") {
		t.Errorf("notes %q", far.Notes)
	}
	// CSV of no passes: the header alone.
	out, _, code := runBinary(t, append([]string{"--quiet", "--format", "csv", "passes"}, append(args, "--site", "far=0,-20")...)...)
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if code != 0 || err != nil || len(rows) != 1 || rows[0][0] != "site" || rows[0][1] != "aos_utc" {
		t.Errorf("CSV without passes: exit %d, %v, %q", code, err, out)
	}
}

// A terrain mask: a hill in the north delays the overhead pass, which
// comes from azimuth 11 deg; the mask and the refraction flag reach the
// result.
func TestPassesMaskAndRefraction(t *testing.T) {
	ref := loadRefPasses(t)
	s := ref.Cases[0].Site
	mask := filepath.Join(t.TempDir(), "hill.txt")
	os.WriteFile(mask, []byte("# a hill to the north\n0 25\n60 2\n300 2\n"), 0o644)
	base := []string{"--epoch", "2027-04-13T00:00:00Z", "--position", vec(ref.Position), "--velocity", vec(ref.Velocity),
		"--site", fmt.Sprintf("%g,%g,%g", s.Lat, s.Lon, s.Alt), "--span", "1h"}
	plain := runPassesJSON(t, base...)
	two := runPassesJSON(t, append(base, "--min-elevation", "2")...)
	hill := runPassesJSON(t, append(base, "--mask", mask)...)
	refr := runPassesJSON(t, append(base, "--refraction")...)
	if len(plain.Passes) != 1 || len(hill.Passes) != 1 || len(refr.Passes) != 1 {
		t.Fatalf("passes: %d plain, %d with the hill, %d with refraction", len(plain.Passes), len(hill.Passes), len(refr.Passes))
	}
	// The pass sets at azimuth 193 deg, where the mask is 2 deg.
	if len(two.Passes) != 1 || !(hill.Passes[0].AOS > two.Passes[0].AOS+30) || math.Abs(hill.Passes[0].LOS-two.Passes[0].LOS) > 1e-3 {
		t.Errorf("hill: AOS %v, LOS %v; above 2 deg: %+v", hill.Passes[0].AOS, hill.Passes[0].LOS, two.Passes)
	}
	// Refraction lifts the horizon: the pass starts earlier and ends later,
	// by the time the spacecraft needs to climb the 0.58 deg of horizontal
	// refraction (about 10 s at a 0.05 deg/s elevation rate: 5..20 s).
	if d := plain.Passes[0].AOS - refr.Passes[0].AOS; d < 5 || d > 20 {
		t.Errorf("refraction moves AOS by %v s", d)
	}
	if math.Abs(refr.Passes[0].AOSElDeg) > 1e-4 {
		t.Errorf("apparent elevation at AOS %v deg, want 0", refr.Passes[0].AOSElDeg)
	}
}

// Golden files of the output formats. Their numbers are checked against
// the world in TestPassesCommandAgainstReference and the visibility
// package's tests; these pin the layout.
func TestPassesGolden(t *testing.T) {
	cases := []struct{ name, args string }{
		{"passes/leo-table", "--quiet passes --epoch 2027-04-13T00:00:00Z --altitude 500 --inclination 97.4 --site ashgrove=47.412,8.917,612 --min-elevation 10 --frequency 437.5"},
		{"passes/two-sites-csv", "--quiet --format csv passes --epoch 2027-04-13T00:00:00Z --altitude 550 --inclination 53 --site north=64.84,-147.72,200 --site south=-33.95,18.47,40 --span 12h"},
		{"passes/geo-json", "--quiet --format json passes --epoch 2027-04-13T00:00:00Z --altitude 35786 --model point --site 0,150 --site far=0,-20 --span 6h"},
		{"eclipses/iss-like-table", "--quiet eclipses --epoch 2027-04-13T00:00:00Z --altitude 420 --inclination 51.6 --raan 30 --span 6h"},
		{"eclipses/geo-equinox-csv", "--quiet --format csv eclipses --epoch 2027-03-20T00:00:00Z --altitude 35786 --span 2d"},
		{"eclipses/dawn-dusk-json", "--quiet --format json eclipses --epoch 2027-04-12T09:30:00Z --periapsis-alt 524 --apoapsis-alt 541 --sun-synchronous --raan 112.5 --span 3h"},
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

// The examples of the help text run as written (in a directory with the
// mask file the last one names).
func TestPassesHelpExamplesRun(t *testing.T) {
	for _, cmd := range []string{"passes", "eclipses"} {
		help, _, code := runBinary(t, cmd, "--help")
		if code != 0 || !strings.Contains(help, "examples:") || !strings.Contains(help, "planning estimates") {
			t.Fatalf("centra %s --help: exit %d, no examples or caution:\n%s", cmd, code, help)
		}
		dir := t.TempDir()
		os.WriteFile(filepath.Join(dir, "hill.txt"), []byte("0 25\n60 2\n300 2\n"), 0o644)
		n := 0
		block := help[strings.Index(help, "examples:"):]
		block = block[:strings.Index(block, "\n\n")]
		for _, line := range strings.Split(block, "\n")[1:] {
			line = strings.TrimSpace(line)
			n++
			args := strings.Fields(line)[1:]
			run := exec.Command(binary, append([]string{"--quiet"}, args...)...)
			run.Dir = dir
			var errb bytes.Buffer
			run.Stderr = &errb
			if err := run.Run(); err != nil {
				t.Errorf("example %q: %v: %s", line, err, errb.String())
			}
		}
		if n < 3 {
			t.Errorf("centra %s --help has %d runnable examples", cmd, n)
		}
	}
}

// The demo mission shows the passes over the ground station and the
// eclipse summary, and stays fast.
func TestDemoHasPassesAndEclipses(t *testing.T) {
	out, stderr, code := runBinary(t, "--quiet", "demo")
	if code != 0 {
		t.Fatalf("centra demo: exit %d: %s", code, stderr)
	}
	for _, want := range []string{" passes --", "--site ashgrove=47.412,8.917,612 --min-elevation '10 deg'", "Site ashgrove", " eclipses --", "shadow passages"} {
		if !strings.Contains(out, want) {
			t.Errorf("demo output lacks %q", want)
		}
	}
}

// parseSiteSpec never panics; what it accepts lies within the limits.
func FuzzParseSiteSpec(f *testing.F) {
	for _, s := range []string{"47.412,8.917,612", "a=1,2", "=1,2", "90.5,8", "47,361", "1,2,3,4", "NaN,1", "47.4", "x=y=1,2", " 1 , 2 , 3 "} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, text string) {
		name, lat, lon, alt, err := parseSiteSpec(text)
		if err != nil {
			if _, ok := err.(*inputError); !ok {
				t.Fatalf("error %T %v is not an input error", err, err)
			}
			return
		}
		if name == "" && strings.TrimSpace(text) != "" || !(lat >= -90 && lat <= 90) || !(lon >= -360 && lon <= 360) || !(alt >= minSiteAltM && alt <= maxSiteAltM) {
			t.Fatalf("parseSiteSpec(%q) = %q, %v, %v, %v", text, name, lat, lon, alt)
		}
	})
}

// TestPassesEclipsesStopAtSurface: an orbit that decays into the Earth
// during the span (150 km, drag on a 5 kg, 0.1 m^2 spacecraft: about an
// hour and a half, as 'lifetime --method full' also finds) is an input
// error naming the time of entry, not windows computed under the ground.
func TestPassesEclipsesStopAtSurface(t *testing.T) {
	decaying := "--epoch 2027-01-01T00:00:00Z --altitude 150 --inclination 51.6 --drag --mass 5 --area 0.1 --span 7d"
	picture := filepath.Join(t.TempDir(), "track.svg")
	for _, cmd := range []string{"passes --site 45,10 ", "eclipses ", "plot --kind ground-track --out " + picture + " ",
		"plot --kind sky --site 45,10 --out " + picture + " ", "plot --kind altitude --out " + picture + " "} {
		out, stderr, code := runBinary(t, strings.Fields(cmd+decaying)...)
		if code != 2 || !strings.Contains(stderr, "the trajectory reaches the surface of earth at 2027-01-01T0") || out != "" {
			t.Errorf("%s: exit %d, stdout %q, stderr %q; want exit 2 and the surface entry within hours", cmd, code, out, stderr)
		}
	}
	if _, err := os.Stat(picture); !os.IsNotExist(err) {
		t.Errorf("a picture was written for a trajectory into the ground (stat: %v)", err)
	}
}
