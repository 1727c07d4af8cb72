package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Every example mission runs.
func TestExampleMissionsRun(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "..", "testdata", "missions", "*.toml"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no example missions: %v", err)
	}
	for _, f := range files {
		t.Run(filepath.Base(f), func(t *testing.T) {
			out, stderr, code := runBinary(t, "run", f)
			if code != 0 {
				t.Fatalf("centra run %s: exit %d\n%s", f, code, stderr)
			}
			if !strings.Contains(out, "[1/") {
				t.Errorf("no section headings in output:\n%s", out)
			}
		})
	}
}

func TestDemoRuns(t *testing.T) {
	out, stderr, code := runBinary(t, "demo")
	if code != 0 {
		t.Fatalf("centra demo: exit %d\n%s", code, stderr)
	}
	for _, want := range []string{"LARK-1", "Kepler", "Ephemeris", "Planning estimates"} {
		if !strings.Contains(out, want) {
			t.Errorf("demo output lacks %q", want)
		}
	}
	printed, _, _ := runBinary(t, "demo", "--print")
	if printed != string(demoMission) {
		t.Errorf("demo --print differs from the embedded mission")
	}
}

// Mission-file errors name the file, the line and the key.
func TestMissionErrors(t *testing.T) {
	good := `[mission]
name = "t"

[[spacecraft]]
id = "a"
altitude = "500 km"

[[output]]
kind = "summary"
spacecraft = "a"
`
	tests := []struct {
		name, text, want string
	}{
		{"unknown spacecraft key", strings.Replace(good, `altitude = "500 km"`, `altitud = "500 km"`, 1), "m.toml:6 (key spacecraft.altitud): unknown key"},
		{"unknown top key", good + "\n[extra]\nx = 1\n", "m.toml:12 (key extra): unknown key"},
		{"unknown mission key", strings.Replace(good, `name = "t"`, "nmae = \"t\"", 1), "m.toml:2 (key mission.nmae): unknown key"},
		{"wrong type", strings.Replace(good, `altitude = "500 km"`, `altitude = [500]`, 1), "m.toml:6 (key spacecraft.altitude): wrong type"},
		{"bad toml", strings.Replace(good, `id = "a"`, `id = "a`, 1), "m.toml:5"},
		{"missing id", strings.Replace(good, `id = "a"`+"\n", "", 1), "spacecraft 1 has no id"},
		{"no outputs", good[:strings.Index(good, "[[output]]")], "asks for no outputs"},
		{"unknown kind", strings.Replace(good, `kind = "summary"`, `kind = "sumary"`, 1), `m.toml:9 (key output.kind): unknown output kind "sumary"`},
		{"unknown spacecraft ref", strings.Replace(good, `spacecraft = "a"`, `spacecraft = "b"`, 1), `m.toml:10 (key output.spacecraft): no spacecraft with id "b"`},
		{"bad flag", strings.Replace(good, `spacecraft = "a"`, "spacecraft = \"a\"\nflags = { spn = \"1d\" }", 1), "output.flags.spn"},
		{"bad value reaches command", strings.Replace(good, `"500 km"`, `"500 furlong"`, 1), `--altitude "500 furlong"`},
		{"expect on mission", strings.Replace(good, `spacecraft = "a"`, "spacecraft = \"a\"\nexpect = \"period_s=1±1\"", 1), "expect must be a list"},
	}
	dir := t.TempDir()
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			path := filepath.Join(dir, "m.toml")
			if err := os.WriteFile(path, []byte(tt.text), 0o644); err != nil {
				t.Fatal(err)
			}
			_, stderr, code := runBinary(t, "run", path)
			if code != 2 || !strings.Contains(stderr, tt.want) || strings.Count(strings.TrimSpace(stderr), "\n") > 0 {
				t.Errorf("exit %d, stderr %q; want 2 and %q", code, stderr, tt.want)
			}
		})
	}
	// A failing expectation in a mission file exits 1.
	path := filepath.Join(dir, "e.toml")
	os.WriteFile(path, []byte(strings.Replace(good, `spacecraft = "a"`, "spacecraft = \"a\"\nexpect = [\"period_s=1±1\"]", 1)), 0o644)
	if _, stderr, code := runBinary(t, "run", path); code != 1 || !strings.Contains(stderr, "1 of 1 expectations failed") {
		t.Errorf("failing expectation: exit %d, %q", code, stderr)
	}
	if _, stderr, code := runBinary(t, "run", filepath.Join(dir, "missing.toml")); code != 2 || !strings.Contains(stderr, "cannot be read") {
		t.Errorf("missing file: exit %d, %q", code, stderr)
	}
}
