package main

import (
	"bytes"
	"flag"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"centra/bodies/timescale"
)

var update = flag.Bool("update", false, "update .golden files")

// binary is the centra executable built once for the tests that run
// the program as a user would.
var binary string

func TestMain(m *testing.M) {
	flag.Parse()
	// A fuzz worker runs only the fuzz target, in-process; building the
	// binary in every worker would take most of a short fuzz run.
	if f := flag.Lookup("test.fuzzworker"); f != nil && f.Value.String() == "true" {
		nowEpoch = func() epoch { return timescale.MustParseUTC("2027-04-12T09:30:00Z") }
		os.Exit(m.Run())
	}
	dir, err := os.MkdirTemp("", "centra-test-")
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(2)
	}
	binary = filepath.Join(dir, "centra")
	out, err := exec.Command("go", "build", "-o", binary, ".").CombinedOutput()
	if err != nil {
		fmt.Fprintf(os.Stderr, "building centra: %v\n%s", err, out)
		os.Exit(2)
	}
	// A fixed clock keeps default epochs reproducible in-process.
	nowEpoch = func() epoch { return timescale.MustParseUTC("2027-04-12T09:30:00Z") }
	code := m.Run()
	os.RemoveAll(dir)
	os.Exit(code)
}

// runBinary runs the built program and returns stdout, stderr and the
// exit code.
func runBinary(t *testing.T, args ...string) (string, string, int) {
	t.Helper()
	cmd := exec.Command(binary, args...)
	var out, errb bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errb
	err := cmd.Run()
	code := 0
	if ee, ok := err.(*exec.ExitError); ok {
		code = ee.ExitCode()
	} else if err != nil {
		t.Fatalf("running centra %v: %v", args, err)
	}
	return out.String(), errb.String(), code
}

// runBinaryIn runs the built program in directory dir.
func runBinaryIn(t *testing.T, dir string, args ...string) (string, string, int) {
	t.Helper()
	cmd := exec.Command(binary, args...)
	cmd.Dir = dir
	var out, errb bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errb
	err := cmd.Run()
	code := 0
	if ee, ok := err.(*exec.ExitError); ok {
		code = ee.ExitCode()
	} else if err != nil {
		t.Fatalf("running centra %v: %v", args, err)
	}
	return out.String(), errb.String(), code
}

// runApp runs the app in-process.
func runApp(args ...string) (string, string, int) {
	var out, errb bytes.Buffer
	code := run(append([]string{"centra"}, args...), &out, &errb)
	return out.String(), errb.String(), code
}

// golden compares got with testdata/<name>.golden, rewriting it under -update.
func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("..", "..", "testdata", "golden", name+".golden")
	if *update {
		os.MkdirAll(filepath.Dir(path), 0o755)
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("reading golden file: %v (run go test ./cmd/centra -update)", err)
	}
	if string(want) != got {
		t.Errorf("output differs from %s:\n%s", path, diffLines(string(want), got))
	}
}

func diffLines(want, got string) string {
	w, g := strings.Split(want, "\n"), strings.Split(got, "\n")
	var b strings.Builder
	for i := 0; i < len(w) || i < len(g); i++ {
		var wl, gl string
		if i < len(w) {
			wl = w[i]
		}
		if i < len(g) {
			gl = g[i]
		}
		if wl != gl {
			fmt.Fprintf(&b, "line %d:\n- %s\n+ %s\n", i+1, wl, gl)
		}
	}
	return b.String()
}
