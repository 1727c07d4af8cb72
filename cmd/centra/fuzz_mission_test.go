package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"centra/orbit"
)

// missionSeeds are the shipped missions and a few broken ones; the
// fuzzer starts from them (and from testdata/fuzz/FuzzLoadMission).
func missionSeeds(f *testing.F) {
	f.Add(demoMission)
	files, _ := filepath.Glob("../../testdata/missions/*.toml")
	for _, p := range files {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
	for _, s := range []string{
		"",
		"[mission]\nname = 1\n",
		"[[spacecraft]]\nid = \"a\"\naltitude = [1, 2]\n[[output]]\nkind = \"summary\"\nspacecraft = \"a\"\n",
		"[[spacecraft]]\nid = \"a\"\naltitude = 500\n[[output]]\nkind = \"summary\"\nspacecraft = \"b\"\n",
		"[[site]]\nid = \"s\"\nlat = 47\nlon = 8\n[[output]]\nkind = \"passes\"\nsite = [\"s\", 3]\n",
		"[[output]]\nkind = \"ephemeris\"\nflags = { span = \"1d\", step = [1, {a = 1}] }\n",
		"[[output]]\nkind = \"ephemeris\"\nflags = \"span\"\nexpect = 3\n",
		"[[output]]\nkind = \"orbit\"\nexpect = [\"period_s=1±1\", 2]\n",
		"[[spacecraft]]\nid = \"a\"\nlaunch_site = \"nowhere\"\n[[output]]\nkind = \"ballistic\"\nspacecraft = \"a\"\n",
		"[mission]\nunknown = 1\n[[output]]\nkind = \"orbit\"\n",
		"[[output]]\nkind = 7\n",
		"[[output]]\nkind = \"orbit\"\nout = \"x.csv\"\nforce = true\nformat = 3\n",
		"\xff\xfe[[output]]",
	} {
		f.Add([]byte(s))
	}
}

// FuzzLoadMission: any bytes either load, and every output then turns
// into a command line or an input error, or fail with one input error
// naming the file; nothing panics.
func FuzzLoadMission(f *testing.F) {
	missionSeeds(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		mr, err := loadMission("fuzz.toml", data)
		if err != nil {
			var ie *inputError
			if !errors.As(err, &ie) {
				t.Fatalf("loadMission error %T %v is not an input error", err, err)
			}
			if !strings.HasPrefix(ie.What, "fuzz.toml") || ie.Fix == "" {
				t.Fatalf("loadMission error %q does not name the file or has no fix", err)
			}
			return
		}
		mr.format = "json"
		for i := range mr.m.Output {
			cmd, _, argv, err := mr.args(i)
			if err != nil {
				var ie *inputError
				if !errors.As(err, &ie) || ie.Fix == "" {
					t.Fatalf("output %d: error %T %v is not an input error with a fix", i, err, err)
				}
				continue
			}
			if cmd == "" || len(argv) < 4 || argv[0] != "centra" {
				t.Fatalf("output %d: command %q, argv %q", i, cmd, argv)
			}
		}
	})
}

// orbitForms build an orbit command line from five fuzzed texts; each
// form exercises one of the shape forms of the contract (and --expect,
// --body, --epoch).
var orbitForms = []func(a, b, c, d, e string) []string{
	func(a, b, c, d, e string) []string {
		return []string{"--altitude=" + a, "--inclination=" + b, "--raan=" + c, "--arg-periapsis=" + d, "--true-anomaly=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--periapsis-alt=" + a, "--apoapsis-alt=" + b, "--inclination=" + c, "--mean-anomaly=" + d, "--raan=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--semi-major-axis=" + a, "--eccentricity=" + b, "--inclination=" + c, "--true-anomaly=" + d, "--arg-periapsis=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--semi-major-axis=" + a, "--eccentricity=" + b, "--mean-anomaly=" + c, "--body=" + d, "--epoch=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--position=" + a, "--velocity=" + b, "--body=" + c, "--epoch=" + d, "--expect=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--altitude=" + a, "--sun-synchronous", "--eccentricity=" + b, "--body=" + c, "--expect=" + d, "--raan=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--repeat=" + a, "--eccentricity=" + b, "--inclination=" + c, "--arg-periapsis=" + d, "--true-anomaly=" + e}
	},
	func(a, b, c, d, e string) []string {
		return []string{"--altitude=" + a, "--frozen", "--inclination=" + b, "--body=" + c, "--mean-anomaly=" + d, "--expect=" + e}
	},
}

// checkRun checks the contract on one in-process run: exit 0 with one
// JSON object free of NaN and Inf, exit 1 only when expect was given,
// exit 2 with nothing on stdout and one line "centra: WHAT; FIX" on
// stderr.
func checkRun(t *testing.T, argv []string, stdout, stderr string, code int, expect bool) {
	t.Helper()
	switch code {
	case 0, 1:
		if code == 1 && !expect {
			t.Fatalf("%q: exit 1 without --expect; stderr %q", argv, stderr)
		}
		var v any
		if err := json.Unmarshal([]byte(stdout), &v); err != nil {
			t.Fatalf("%q: exit %d, stdout is not JSON: %v\n%s", argv, code, err, stdout)
		}
		if bad := nonFinite(v, ""); bad != "" {
			t.Fatalf("%q: %s", argv, bad)
		}
		for _, l := range strings.Split(strings.TrimRight(stderr, "\n"), "\n") {
			if l != "" && !strings.HasPrefix(l, "centra: ") {
				t.Fatalf("%q: stderr line %q lacks the centra: prefix", argv, l)
			}
		}
	case 2:
		if stdout != "" {
			t.Fatalf("%q: exit 2 but stdout has %q", argv, stdout)
		}
		if strings.Count(stderr, "\n") != 1 || !strings.HasPrefix(stderr, "centra: ") || !strings.Contains(stderr, "; ") {
			t.Fatalf("%q: exit 2, stderr is not one line 'centra: WHAT; FIX': %q", argv, stderr)
		}
	default:
		t.Fatalf("%q: exit %d; stderr %q", argv, code, stderr)
	}
}

// nonFinite walks decoded JSON and names the first string that spells a
// non-finite number or an absurd magnitude (JSON itself cannot hold NaN).
func nonFinite(v any, path string) string {
	switch x := v.(type) {
	case map[string]any:
		for k, e := range x {
			if s := nonFinite(e, path+"."+k); s != "" {
				return s
			}
		}
	case []any:
		for i, e := range x {
			if s := nonFinite(e, path+"["+strconv.Itoa(i)+"]"); s != "" {
				return s
			}
		}
	case float64:
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return path + " is not finite"
		}
	case string:
		if l := strings.ToLower(x); l == "nan" || l == "inf" || l == "+inf" || l == "-inf" {
			return path + " = " + x
		}
	}
	return ""
}

// FuzzOrbitCommand drives the orbit command in-process with fuzzed flag
// values: whatever the text, the run keeps the contract of checkRun.
func FuzzOrbitCommand(f *testing.F) {
	f.Add(uint8(0), "400", "51.6", "10", "20", "30")
	f.Add(uint8(0), "-6378.137", "180.0001", "NaN", "1e308", "Inf")
	f.Add(uint8(1), "300", "200", "97", "10", "5")
	f.Add(uint8(1), "200", "35786", "0", "1rad", "-720")
	f.Add(uint8(2), "-20000", "1.5", "30", "40", "0")
	f.Add(uint8(2), "7000", "0.99999999", "90", "179.999", "0")
	f.Add(uint8(2), "7000", "1", "0", "0", "0")
	f.Add(uint8(2), "1e-300", "0.5", "0", "0", "0")
	f.Add(uint8(3), "-7000", "1.000000001", "1e6", "moon", "2027-01-01T00:00:00Z")
	f.Add(uint8(3), "8000", "0.1", "10", "earth", "1969-07-20T20:17:00Z")
	f.Add(uint8(3), "8000", "0.1", "10", "earth", "2300-01-01T00:00:00Z")
	f.Add(uint8(4), "7000,0,0", "0,7.5,1", "earth", "2027-01-01T00:00:00Z", "period_s=5800±1")
	f.Add(uint8(4), "7000,0,0", "7.5,0,0", "earth", "2027-01-01T00:00:00Z", "eccentricity=1±0")
	f.Add(uint8(4), "0,0,0", "0,0,0", "mars", "2027-01-01T00:00:00Z", "x=1±1")
	f.Add(uint8(4), "1e-9,0,0", "0,1e9,0", "sun", "2027-01-01T00:00:00Z", "period_s=1")
	f.Add(uint8(5), "700", "0.001", "earth", "inclination_deg=98.2±0.1", "0")
	f.Add(uint8(5), "70000", "0", "moon", "inclination_deg=98.2±0.1", "0")
	f.Add(uint8(6), "15/1", "0", "98", "0", "0")
	f.Add(uint8(6), "1/100", "0.9", "0", "0", "0")
	f.Add(uint8(7), "800", "98.6", "earth", "0", "eccentricity=0.001±1%")
	f.Add(uint8(7), "800", "63.43", "venus", "0", "period_s=1+-1")
	f.Fuzz(func(t *testing.T, form uint8, a, b, c, d, e string) {
		flags := orbitForms[int(form)%len(orbitForms)](a, b, c, d, e)
		hasEpoch := false
		for _, fl := range flags {
			hasEpoch = hasEpoch || strings.HasPrefix(fl, "--epoch=")
		}
		argv := []string{"centra", "--format", "json", "--quiet", "orbit"}
		if !hasEpoch {
			argv = append(argv, "--epoch", "2027-01-01T00:00:00Z")
		}
		argv = append(argv, flags...)
		var out, errb bytes.Buffer
		code := run(argv, &out, &errb)
		checkRun(t, argv, out.String(), errb.String(), code, strings.Contains(strings.Join(flags, " "), "--expect="))
	})
}

// FuzzParseRepeat: parseRepeat never panics; what it accepts is within
// the design limits.
func FuzzParseRepeat(f *testing.F) {
	for _, s := range []string{"15/1", "233/16", " 14 / 1 ", "0/1", "1/0", "-1/-1", "15", "15/1/2", "9999999999999999999/1", "1e3/1", "/"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		revs, days, err := parseRepeat(s)
		if err != nil {
			var ie *inputError
			if !errors.As(err, &ie) || ie.Fix == "" {
				t.Fatalf("parseRepeat(%q) error %T %v is not an input error with a fix", s, err, err)
			}
			return
		}
		if revs < 1 || days < 1 || revs > orbit.MaxRepeatRevs || days > orbit.MaxRepeatDays {
			t.Fatalf("parseRepeat(%q) = %d, %d", s, revs, days)
		}
	})
}

// FuzzOPMEpoch: an OPM's EPOCH and TIME_SYSTEM either give an instant in
// the supported span, which prints as a UTC time that reads back, or an
// error; nothing panics (an 8-character EPOCH such as "2027-001" used to
// index past its end: testdata/fuzz/FuzzOPMEpoch).
func FuzzOPMEpoch(f *testing.F) {
	for _, s := range []string{"1998-12-18T14:28:15.1172", "2027-032T12:00:00", "2027-001", "2027-0010", "1972-01-01T00:00:05", "2199-12-31T23:59:59.999", "9999-12-31T00:00:00", "2016-12-31T23:59:60"} {
		for _, ts := range []string{"UTC", "TAI", "TT", "GPS", "TDB"} {
			f.Add(s, ts)
		}
	}
	f.Fuzz(func(t *testing.T, s, system string) {
		e, err := opmEpoch(s, system)
		if err != nil {
			return
		}
		if e.Sub(latestEpoch) >= 0 {
			t.Fatalf("opmEpoch(%q, %q) = %s, beyond the supported range", s, system, e.FormatUTC())
		}
		out := e.FormatUTC()
		back, err := parseEpoch("epoch", out)
		if err != nil {
			t.Fatalf("opmEpoch(%q, %q) prints as %q, which does not read back: %v", s, system, out, err)
		}
		if d := back.Sub(e); d > 0.0005+1e-9 || d < -0.0005-1e-9 {
			t.Fatalf("opmEpoch(%q, %q) = %q moves %g s on reading back", s, system, out, d)
		}
	})
}
