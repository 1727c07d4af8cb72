package main

import (
	"bufio"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// The catalogue of bad input: each case runs the built binary and wants
// exit 2 (1 for expectations) with one line "centra: WHAT; FIX" that
// names the input, and nothing on stdout. Cases already in the commands'
// own tests (cli_test.go, ephemeris_test.go, lifetime_test.go,
// passes_cmd_test.go, ballistic_test.go, atmosphere_test.go,
// mission_test.go) are not repeated here.
func TestReliabilityCatalogue(t *testing.T) {
	dir := t.TempDir()
	tiny := filepath.Join(dir, "pin.toml")
	// A body with the Earth's GM and a 1 mm radius: a trajectory through
	// its centre makes the step collapse before any surface is reached.
	os.WriteFile(tiny, []byte("[body.pin]\ndescription = \"a point-like body for a test\"\nsource = \"invented for a test\"\ngm_km3_s2 = 398600.4418\nequatorial_radius_km = 1e-6\nflattening = 0\nrotation_rate_rad_s = 0\n"), 0o644)
	// OPMs with epochs the parser used to mishandle (an 8-character EPOCH
	// panicked; epochs beyond 2200 or TAI before 1972 were accepted).
	opm, err := os.ReadFile("../../testdata/ccsds/opm-example1.txt")
	if err != nil {
		t.Fatal(err)
	}
	opmWith := func(name, epoch, system string) string {
		text := string(opm)
		for _, kv := range [][2]string{{"EPOCH", epoch}, {"TIME_SYSTEM", system}} {
			i := strings.Index(text, kv[0]+" = ")
			j := i + strings.Index(text[i:], "\n")
			text = text[:i] + kv[0] + " = " + kv[1] + text[j:]
		}
		p := filepath.Join(dir, name)
		os.WriteFile(p, []byte(text), 0o644)
		return p
	}
	fifo := filepath.Join(dir, "pipe")
	if err := syscall.Mkfifo(fifo, 0o644); err != nil {
		t.Fatal(err)
	}
	const ep = " --epoch 2027-01-01T00:00:00Z"
	tests := []struct {
		name, args string
		code       int
		msgs       []string // each must appear in stderr
	}{
		// mass, area, eccentricity where they matter
		{"lifetime zero mass", "lifetime --altitude 400 --mass 0 --area 0.1" + ep, 2, []string{"--mass must be positive, got 0 kg"}},
		{"lifetime zero area", "lifetime --altitude 400 --mass 4 --area 0" + ep, 2, []string{"--area must be positive, got 0 m2"}},
		{"lifetime negative area", "lifetime --altitude 400 --mass 4 --area -0.03" + ep, 2, []string{"--area must be positive"}},
		{"lifetime NaN area", "lifetime --altitude 400 --mass 4 --area NaN" + ep, 2, []string{`--area "NaN" is not a valid area`}},
		{"ballistic negative mass", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --mass -10 --area 0.1 --cd 1", 2, []string{"--mass must be positive, got -10 kg"}},
		{"ballistic zero area", "ballistic --site 57,-7 --burnout-alt 35 --burnout-speed 2 --flight-path-angle 90 --mass 10 --area 0 --cd 1", 2, []string{"--area must be positive, got 0 m2"}},
		{"negative eccentricity with periapsis", "orbit --periapsis-alt 400 --eccentricity -0.1" + ep, 2, []string{"--eccentricity -0.1 is negative"}},
		{"NaN eccentricity", "orbit --periapsis-alt 400 --eccentricity NaN" + ep, 2, []string{`--eccentricity "NaN"`}},
		{"eccentric circular orbit", "orbit --altitude 500 --eccentricity 0.1" + ep, 2, []string{"--altitude is a circular orbit, but --eccentricity is 0.1"}},
		{"parabola by semi-major axis", "orbit --semi-major-axis 7000 --eccentricity 1" + ep, 2, []string{"a parabola has no finite semi-major axis", "--periapsis-alt H --eccentricity 1"}},
		// a hyperbola cannot be given by its apsides: the message says how
		{"hyperbola by apsides", "orbit --periapsis-alt 400 --apoapsis-alt -7000" + ep, 2, []string{"--apoapsis-alt -7000 km is below --periapsis-alt 400 km", "--periapsis-alt H --eccentricity E with E > 1"}},
		// below the surface: propagating commands refuse or name the impact
		{"ephemeris starts inside the body", "ephemeris --altitude -100 --span 1h" + ep, 2, []string{"the initial state is inside earth", "100.000 km below its surface"}},
		{"ephemeris impact", "ephemeris --position 7000,0,0 --velocity 0,0.01,0 --model point --span 1h" + ep, 2, []string{"reaches the surface of earth at 2027-01-01T00:06:25", "t = 385.", "radius 6378.137 km", "shorten --span"}},
		{"ephemeris impact of a low perigee", "--format csv ephemeris --periapsis-alt -50 --apoapsis-alt 300 --true-anomaly 180 --span 1d --out " + filepath.Join(dir, "impact.csv") + ep, 2, []string{"reaches the surface of earth"}},
		// the step collapses: the time and the radius where it stopped
		{"step collapse at a point mass", "--bodies " + tiny + " ephemeris --body pin --position 7000,0,0 --velocity 0,1e-4,0 --model point --span 1h" + ep, 2, []string{"propagation stopped at t = 1030.", "radius ", "step size too small"}},
		// epochs outside 1972..2200
		{"epoch after 2200", "orbit --altitude 500 --epoch 2200-01-02T00:00:00Z", 2, []string{"--epoch 2200-01-02T00:00:00Z is beyond the supported range", "before 2200"}},
		{"ephemeris epoch after 2200", "ephemeris --altitude 500 --epoch 2300-01-01T00:00:00Z", 2, []string{"beyond the supported range"}},
		{"eclipses epoch before 1972", "eclipses --altitude 500 --epoch 1971-12-31T23:59:59Z", 2, []string{"is before 1972"}},
		{"passes epoch before 1972", "passes --altitude 500 --site 47,8 --epoch 1960-01-01T00:00:00Z", 2, []string{"is before 1972"}},
		// unknown bodies, sites on other bodies
		{"ephemeris unknown body", "ephemeris --body vulcan --altitude 500" + ep, 2, []string{`unknown body "vulcan"`, "--bodies FILE"}},
		// NaN, Inf and empty values
		{"infinite altitude", "orbit --altitude Inf" + ep, 2, []string{`--altitude "Inf"`}},
		{"infinite inclination", "orbit --altitude 500 --inclination -inf" + ep, 2, []string{`--inclination "-inf"`}},
		{"NaN in a vector", "orbit --position 7000,NaN,0 --velocity 0,7.5,0" + ep, 2, []string{`--position "7000,NaN,0"`, "part 2"}},
		{"infinite span", "ephemeris --altitude 500 --span Inf" + ep, 2, []string{`--span "Inf"`}},
		{"NaN step", "ephemeris --altitude 500 --step NaN" + ep, 2, []string{`--step "NaN"`}},
		{"empty epoch", "ephemeris --altitude 500 --epoch=", 2, []string{`--epoch "" is not a valid time`}},
		{"empty step", "ephemeris --altitude 500 --step=" + ep, 2, []string{"--step"}},
		{"empty site", "passes --altitude 500 --site=" + ep, 2, []string{"--site"}},
		// absurd spans and steps on the other propagating commands
		{"eclipses negative span", "eclipses --altitude 500 --span -1d" + ep, 2, []string{"--span -1d is not positive"}},
		{"passes absurd span", "passes --altitude 500 --site 47,8 --span 1e12" + ep, 2, []string{"--span 1e12"}},
		{"ephemeris absurd rows", "ephemeris --altitude 500 --span 200y --step 1ms" + ep, 2, []string{"rows"}},
		// unknown flags on every kind of command
		{"unknown flag passes", "passes --altitude 500 --site 47,8 --min-elev 5", 2, []string{"unknown flag --min-elev for centra passes"}},
		{"unknown flag lifetime", "lifetime --altitude 400 --mas 4", 2, []string{"unknown flag --mas for centra lifetime"}},
		{"unknown flag atmosphere", "atmosphere --altitude 5", 2, []string{"unknown flag --altitude for centra atmosphere"}},
		{"unknown flag bodies", "bodies --verbose", 2, []string{"unknown flag --verbose for centra bodies"}},
		{"unknown flag eclipses", "eclipses --altitude 500 --step 10s", 2, []string{"unknown flag --step for centra eclipses"}},
		{"unknown global flag", "--colour orbit --altitude 500", 2, []string{"--colour"}},
		// an orbit too low for the orbit-averaged decay (it used to end in
		// "propagation stopped ... (radius 0 km)")
		{"lifetime too low for averaging", "lifetime --altitude 110 --ballistic-coefficient 50" + ep, 2, []string{"the orbit-averaged decay stopped", "use --method full"}},
		// OPM epochs
		{"OPM eight-character epoch", "orbit --from-opm " + opmWith("short.opm", "2027-001", "UTC"), 2, []string{`EPOCH "2027-001" is not a CCSDS time`}},
		{"OPM epoch after 2200", "orbit --from-opm " + opmWith("late.opm", "2300-01-01T00:00:00", "UTC"), 2, []string{"EPOCH 2300-01-01T00:00:00 is beyond the supported range"}},
		{"OPM TAI epoch before UTC 1972", "orbit --from-opm " + opmWith("early.opm", "1972-01-01T00:00:05", "TAI"), 2, []string{"is before 1972 in UTC"}},
		// --out that cannot be a file
		{"out is a directory", "orbit --altitude 500 --out " + dir + ep, 2, []string{"is a directory", "give a file name"}},
		// with --force the rename that commits the file would have replaced
		// the device itself (as root, /dev/null became a regular file)
		{"out is a named pipe", "orbit --altitude 500 --force --out " + fifo + ep, 2, []string{"is a named pipe, not a regular file"}},
		{"out is a device", "orbit --altitude 500 --force --out " + os.DevNull + ep, 2, []string{`--out "/dev/null" is a device, not a regular file`, "redirect stdout"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			out, stderr, code := runBinary(t, strings.Fields(tt.args)...)
			if code != tt.code {
				t.Fatalf("centra %s: exit %d, want %d; stderr %q", tt.args, code, tt.code, stderr)
			}
			for _, m := range tt.msgs {
				if !strings.Contains(stderr, m) {
					t.Errorf("centra %s: stderr %q lacks %q", tt.args, stderr, m)
				}
			}
			// The error is the last line; the only lines before it are the
			// warnings of the orbit that a propagating command printed
			// before the failure ("intersects the surface").
			lines := strings.Split(strings.TrimRight(stderr, "\n"), "\n")
			last := lines[len(lines)-1]
			if !strings.HasPrefix(last, "centra: ") || strings.HasPrefix(last, "centra: warning: ") || !strings.Contains(last, "; ") {
				t.Errorf("centra %s: the last stderr line is not 'centra: WHAT; FIX': %q", tt.args, stderr)
			}
			for _, l := range lines[:len(lines)-1] {
				if !strings.HasPrefix(l, "centra: warning: ") {
					t.Errorf("centra %s: stderr line %q is neither a warning nor the error", tt.args, l)
				}
			}
			// ephemeris streams its rows: a run that fails midway has
			// printed those before the failure (an --out file has none).
			if tt.code == 2 && !strings.Contains(tt.args, "ephemeris") && out != "" {
				t.Errorf("centra %s: exit 2 with stdout %q", tt.args, out)
			}
		})
	}
	// Nothing was left behind by the failing --out runs.
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if e.Name() != "pin.toml" && e.Name() != "pipe" && !strings.HasSuffix(e.Name(), ".opm") {
			t.Errorf("failed runs left %s in the output directory", e.Name())
		}
	}
}

// Mission files whose values have the wrong type are refused with the
// file, line and key (the unknown-key and list-type cases are in
// mission_test.go).
func TestReliabilityMissionTypes(t *testing.T) {
	good := "[[spacecraft]]\nid = \"a\"\naltitude = \"500 km\"\n\n[[site]]\nid = \"s\"\nlat = 47\nlon = 8\n\n[[output]]\nkind = \"summary\"\nspacecraft = \"a\"\n"
	tests := []struct{ name, text, want string }{
		{"title a number", good + "title = 3\n", "m.toml:13 (key output.title): wrong type int64; give title as a string"},
		{"spacecraft a number", strings.Replace(good, `spacecraft = "a"`, "spacecraft = 1", 1), "m.toml:12 (key output.spacecraft): wrong type int64"},
		{"format a boolean", good + "format = true\n", "(key output.format): wrong type bool"},
		{"force a string", good + "out = \"x.json\"\nforce = \"yes\"\n", "(key output.force): wrong type string; give force as true or false"},
		{"site list of numbers", good + "site = [1, 2]\n", "(key output.site): wrong type []interface {}; give site as a site id or a list of site ids"},
		{"kind a number", strings.Replace(good, `kind = "summary"`, "kind = 7", 1), "(key output.kind): wrong type int64"},
		{"flags a string", good + "flags = \"--span 1d\"\n", "flags must be a table"},
		{"spacecraft value a table", strings.Replace(good, `altitude = "500 km"`, "altitude = { km = 500 }", 1), "(key spacecraft.altitude): wrong type"},
		{"mission name a number", "[mission]\nname = 5\n" + good, "m.toml"},
	}
	dir := t.TempDir()
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			path := filepath.Join(dir, "m.toml")
			if err := os.WriteFile(path, []byte(tt.text), 0o644); err != nil {
				t.Fatal(err)
			}
			out, stderr, code := runBinary(t, "run", path)
			if code != 2 || !strings.Contains(stderr, tt.want) || strings.Count(strings.TrimSpace(stderr), "\n") > 0 || out != "" {
				t.Errorf("exit %d, stdout %q, stderr %q; want 2, nothing on stdout and %q", code, out, stderr, tt.want)
			}
		})
	}
}

// A read-only output directory is refused before anything is computed.
// Root writes through the permission bits, so the case is skipped there.
func TestReliabilityReadOnlyOutDir(t *testing.T) {
	if os.Geteuid() == 0 {
		t.Skip("running as root: chmod 0555 does not stop root's writes")
	}
	dir := filepath.Join(t.TempDir(), "ro")
	if err := os.Mkdir(dir, 0o555); err != nil {
		t.Fatal(err)
	}
	defer os.Chmod(dir, 0o755)
	_, stderr, code := runBinary(t, "orbit", "--altitude", "500", "--out", filepath.Join(dir, "o.json"))
	if code != 2 || !strings.Contains(stderr, "cannot be written") || !strings.Contains(stderr, "permission") {
		t.Errorf("read-only directory: exit %d, %q", code, stderr)
	}
}

// SIGINT during a long ephemeris --out run leaves no partial file: the
// run exits 130 with one line, and the directory is as it was.
func TestReliabilityInterruptLeavesNoFile(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "track.csv")
	cmd := exec.Command(binary, "--quiet", "--format", "csv", "ephemeris", "--epoch", "2027-01-01T00:00:00Z",
		"--altitude", "500", "--inclination", "51.6", "--span", "60d", "--step", "1s", "--out", target)
	stderr, err := cmd.StderrPipe()
	if err != nil {
		t.Fatal(err)
	}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	// Wait until the temporary file holds data, so the run is mid-write.
	deadline := time.Now().Add(20 * time.Second)
	for {
		matches, _ := filepath.Glob(filepath.Join(dir, ".track.csv.*.tmp"))
		if len(matches) == 1 {
			if fi, err := os.Stat(matches[0]); err == nil && fi.Size() > 1<<16 {
				break
			}
		}
		if time.Now().After(deadline) {
			cmd.Process.Kill()
			cmd.Wait()
			t.Fatal("the temporary --out file never grew")
		}
		time.Sleep(20 * time.Millisecond)
	}
	if err := cmd.Process.Signal(syscall.SIGINT); err != nil {
		t.Fatal(err)
	}
	var lines []string
	sc := bufio.NewScanner(stderr)
	for sc.Scan() {
		lines = append(lines, sc.Text())
	}
	err = cmd.Wait()
	code := 0
	if ee, ok := err.(*exec.ExitError); ok {
		code = ee.ExitCode()
	}
	if code != 130 || len(lines) != 1 || !strings.Contains(lines[0], "interrupted") || !strings.Contains(lines[0], "no output file was written") {
		t.Errorf("after SIGINT: exit %d, stderr %q; want 130 and one line", code, lines)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 0 {
		t.Errorf("after SIGINT the directory holds %d entries (%v), want none", len(entries), entries[0].Name())
	}
}

// A lifetime of a few revolutions by the orbit-averaged method comes
// with a warning to use --method full (at 150 km the averaged lifetime
// was 0.031 d against 0.046 d by --method full).
func TestReliabilityLifetimeAveragingWarning(t *testing.T) {
	_, stderr, code := runBinary(t, "--format", "json", "lifetime", "--epoch", "2027-01-01T00:00:00Z", "--altitude", "150", "--ballistic-coefficient", "50")
	if code != 0 || !strings.Contains(stderr, "too few for the orbit-averaged method") || !strings.Contains(stderr, "use --method full") {
		t.Errorf("exit %d, stderr %q", code, stderr)
	}
	_, stderr, code = runBinary(t, "--format", "json", "lifetime", "--epoch", "2027-01-01T00:00:00Z", "--altitude", "300", "--ballistic-coefficient", "50")
	if code != 0 || strings.Contains(stderr, "orbit-averaged") {
		t.Errorf("300 km: exit %d, stderr %q", code, stderr)
	}
}
