// Package frametest reads the reference tables under testdata/frames for
// the tests of the time, Earth-orientation, geodesy and Sun/Moon
// packages. The tables were made by testdata/frames/gen_frames.py with
// ERFA; see the comment lines at the top of each file.
package frametest

import (
	"encoding/csv"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"testing"
)

// Dir returns the absolute path of testdata/frames.
func Dir() string {
	_, file, _, _ := runtime.Caller(0)
	return filepath.Join(filepath.Dir(file), "..", "..", "..", "testdata", "frames")
}

// Row is one CSV record keyed by column name.
type Row map[string]string

// F returns column k as a float64, failing the test if it is missing or
// malformed.
func (r Row) F(t testing.TB, k string) float64 {
	t.Helper()
	s, ok := r[k]
	if !ok {
		t.Fatalf("frametest: no column %q", k)
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("frametest: column %q: %v", k, err)
	}
	return v
}

// Read reads testdata/frames/name, skipping lines that start with '#'.
func Read(t testing.TB, name string) []Row {
	t.Helper()
	b, err := os.ReadFile(filepath.Join(Dir(), name))
	if err != nil {
		t.Fatalf("frametest: %v", err)
	}
	var lines []string
	for _, l := range strings.Split(string(b), "\n") {
		if !strings.HasPrefix(l, "#") && strings.TrimSpace(l) != "" {
			lines = append(lines, l)
		}
	}
	recs, err := csv.NewReader(strings.NewReader(strings.Join(lines, "\n"))).ReadAll()
	if err != nil {
		t.Fatalf("frametest: %s: %v", name, err)
	}
	if len(recs) < 2 {
		t.Fatalf("frametest: %s: no data rows", name)
	}
	rows := make([]Row, 0, len(recs)-1)
	for _, rec := range recs[1:] {
		r := Row{}
		for i, k := range recs[0] {
			r[k] = rec[i]
		}
		rows = append(rows, r)
	}
	return rows
}

// Values reads a name,value CSV (examples.csv) into a map.
func Values(t testing.TB, name string) map[string]float64 {
	t.Helper()
	out := map[string]float64{}
	for _, r := range Read(t, name) {
		out[r["name"]] = r.F(t, "value")
	}
	return out
}
