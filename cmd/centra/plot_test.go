package main

import (
	"bytes"
	"encoding/json"
	"encoding/xml"
	"image"
	_ "image/png"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// orbitArgs is a 530 km sun-synchronous orbit at a fixed epoch.
var plotOrbitArgs = []string{"--altitude", "530", "--sun-synchronous", "--raan", "112.5", "--epoch", "2027-04-12T09:30:00Z"}

func plotArgs(kind, out string, extra ...string) []string {
	args := append([]string{"--quiet", "plot", "--kind", kind, "--out", out}, plotOrbitArgs...)
	return append(args, extra...)
}

// TestPlotErrors runs the binary with mistakes: each is exit 2 with one
// line naming the problem, and no file is left behind.
func TestPlotErrors(t *testing.T) {
	dir := t.TempDir()
	exists := filepath.Join(dir, "exists.svg")
	if err := os.WriteFile(exists, []byte("keep"), 0o644); err != nil {
		t.Fatal(err)
	}
	svg := filepath.Join(dir, "p.svg")
	cases := []struct {
		name string
		args []string
		want string
	}{
		{"no kind", []string{"plot", "--altitude", "500", "--out", svg}, "plot needs --kind"},
		{"no out", []string{"plot", "--kind", "orbit", "--altitude", "500"}, "needs --out"},
		{"pdf", []string{"plot", "--kind", "orbit", "--altitude", "500", "--out", filepath.Join(dir, "p.pdf")}, "is not a picture format"},
		{"unknown kind", plotArgs("pie", svg), `--kind "pie" is not a picture`},
		{"width without unit", plotArgs("orbit", svg, "--width", "8"), `--width "8" has no unit`},
		{"tiny picture", plotArgs("orbit", svg, "--width", "0.5in"), "picture size"},
		{"huge png", plotArgs("orbit", filepath.Join(dir, "p.png"), "--width", "60in", "--height", "60in", "--dpi", "300"), "million pixels"},
		{"bad dpi", plotArgs("orbit", svg, "--dpi", "5000"), "--dpi 5000 is out of range"},
		{"site on orbit", plotArgs("orbit", svg, "--site", "47,8"), "--site does not apply to --kind orbit"},
		{"speed on orbit", plotArgs("orbit", svg, "--speed"), "--speed applies to --kind altitude only"},
		{"ground track of the Moon", []string{"plot", "--kind", "groundtrack", "--body", "moon", "--altitude", "100", "--out", svg}, "Earth only"},
		{"sky without site", plotArgs("sky", svg), "one site, got 0"},
		{"sky with two sites", plotArgs("sky", svg, "--site", "47,8", "--site", "40,-3"), "one site, got 2"},
		{"sky backwards", plotArgs("sky", svg, "--site", "47,8", "--span", "-1d"), "negative"},
		{"site latitude", plotArgs("groundtrack", svg, "--site", "95,8"), "--site \"95,8\""},
		{"site syntax", plotArgs("groundtrack", svg, "--site", "47"), "is not LAT,LON[,ALT_M]"},
		{"min elevation", plotArgs("groundtrack", svg, "--site", "47,8", "--min-elevation", "95"), "--min-elevation 95 is outside -5..90 deg"},
		{"zero step", plotArgs("altitude", svg, "--step", "0s"), "--step 0s is not positive"},
		{"too many samples", plotArgs("orbit", svg, "--span", "100d", "--step", "1s"), "a picture takes at most"},
		{"no orbit", []string{"plot", "--kind", "orbit", "--out", svg}, "no orbit size and shape given"},
		{"exists", plotArgs("orbit", exists), "already exists"},
		{"dispersion without cases", []string{"plot", "--kind", "dispersion", "--site", "57.35,-7.33", "--burnout-alt", "35", "--burnout-speed", "2", "--flight-path-angle", "84", "--azimuth", "290", "--out", svg}, "draws a dispersion run"},
		{"dispersion with an orbit", []string{"plot", "--kind", "dispersion", "--altitude", "500", "--out", svg}, "--altitude does not apply to --kind dispersion"},
		{"burnout on an orbit", plotArgs("orbit", svg, "--burnout-speed", "2"), "--burnout-speed does not apply to --kind orbit"},
		{"two launchers", []string{"plot", "--kind", "dispersion", "--site", "57,-7", "--site", "58,-7", "--burnout-alt", "35", "--out", svg}, "one launcher, got 2"},
		{"no directory", plotArgs("orbit", filepath.Join(dir, "none", "p.svg")), "does not exist"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			stdout, stderr, code := runBinary(t, c.args...)
			if code != exitInput {
				t.Fatalf("exit %d, want %d; stderr %q", code, exitInput, stderr)
			}
			if !strings.HasPrefix(stderr, "centra: ") || strings.Count(stderr, "\n") != 1 || !strings.Contains(stderr, "; ") {
				t.Errorf("stderr %q is not one line 'centra: what; fix'", stderr)
			}
			if !strings.Contains(stderr, c.want) {
				t.Errorf("stderr %q does not say %q", stderr, c.want)
			}
			if stdout != "" {
				t.Errorf("stdout %q, want nothing", stdout)
			}
		})
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		var names []string
		for _, e := range entries {
			names = append(names, e.Name())
		}
		t.Errorf("files left in the output directory: %v", names)
	}
	if b, _ := os.ReadFile(exists); string(b) != "keep" {
		t.Errorf("existing file changed to %q", b)
	}
}

// TestPlotWrites draws each kind through the binary and decodes the file.
func TestPlotWrites(t *testing.T) {
	dir := t.TempDir()
	site := "47.412,8.917,612"
	cases := []struct {
		name, kind, file string
		extra            []string
		samplesKey       string
	}{
		{"orbit svg", "orbit", "orbit.svg", nil, "samples"},
		{"orbit drift png", "orbit", "drift.png", []string{"--model", "zonal", "--degree", "4", "--span", "2d", "--width", "1000px", "--height", "1000px", "--dpi", "100"}, "samples"},
		{"ground track png", "groundtrack", "track.png", []string{"--site", site, "--site", "-77.8,166.7", "--min-elevation", "10", "--span", "1d"}, "samples"},
		{"altitude svg", "altitude", "alt.svg", []string{"--speed", "--model", "point"}, "samples"},
		{"sky png", "sky", "sky.png", []string{"--site", site, "--min-elevation", "10"}, "passes"},
	}
	disp := []string{"--format", "json", "--quiet", "plot", "--kind", "dispersion", "--site", "57.35,-7.33", "--burnout-alt", "35", "--burnout-speed", "2",
		"--flight-path-angle", "84", "--azimuth", "290", "--dispersions", "200", "--sigma-speed", "10m/s", "--sigma-azimuth", "1", "--epoch", "2027-04-12T09:30:00Z"}
	cases = append(cases, struct {
		name, kind, file string
		extra            []string
		samplesKey       string
	}{"dispersion svg", "dispersion", "impacts.svg", nil, "cases"})
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(dir, c.file)
			args := append([]string{"--format", "json"}, plotArgs(c.kind, path, c.extra...)...)
			if c.kind == "dispersion" {
				args = append(disp, "--out", path)
			}
			stdout, stderr, code := runBinary(t, args...)
			if code != exitOK {
				t.Fatalf("exit %d; stderr %q", code, stderr)
			}
			var rec map[string]any
			if err := json.Unmarshal([]byte(stdout), &rec); err != nil {
				t.Fatalf("stdout is not JSON: %v\n%s", err, stdout)
			}
			if rec["kind"] != c.kind || rec["file"] != path || rec[c.samplesKey] == nil {
				t.Errorf("summary %v", rec)
			}
			b, err := os.ReadFile(path)
			if err != nil {
				t.Fatal(err)
			}
			if strings.HasSuffix(path, ".png") {
				img, _, err := image.Decode(bytes.NewReader(b))
				if err != nil {
					t.Fatalf("PNG does not decode: %v", err)
				}
				w, h := rec["width_px"].(float64), rec["height_px"].(float64)
				if bb := img.Bounds(); bb.Dx() != int(w) || bb.Dy() != int(h) {
					t.Errorf("PNG is %d x %d px, summary says %v x %v", bb.Dx(), bb.Dy(), w, h)
				}
				return
			}
			dec := xml.NewDecoder(bytes.NewReader(b))
			for {
				_, err := dec.Token()
				if err == io.EOF {
					break
				}
				if err != nil {
					t.Fatalf("SVG does not parse: %v", err)
				}
			}
		})
	}
	// The default PNG is 1200 x 750 px.
	path := filepath.Join(dir, "default.png")
	if _, stderr, code := runBinary(t, plotArgs("orbit", path)...); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	f, _ := os.Open(path)
	defer f.Close()
	cfg, _, err := image.DecodeConfig(f)
	if err != nil || cfg.Width != 1200 || cfg.Height != 750 {
		t.Errorf("default PNG %d x %d (%v), want 1200 x 750", cfg.Width, cfg.Height, err)
	}
}

// TestPlotTableSummary fixes the table that plot prints (the file name
// is relative, so the output does not depend on the temporary directory).
func TestPlotTableSummary(t *testing.T) {
	dir := t.TempDir()
	args := []string{"plot", "--kind", "altitude", "--out", "alt.png", "--periapsis-alt", "300", "--apoapsis-alt", "1500",
		"--inclination", "63.4", "--epoch", "2027-04-12T09:30:00Z", "--model", "point", "--span", "3h"}
	out, errb, code := runBinaryIn(t, dir, args...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errb)
	}
	golden(t, "plot/altitude_table", out)
}
