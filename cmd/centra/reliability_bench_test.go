package main

import (
	"bytes"
	"io"
	"testing"
	"time"
)

// BenchmarkProgressBarUpdate is the cost per ephemeris row of the
// progress display when it is on (stride 64, as ephemeris uses it).
func BenchmarkProgressBarUpdate(b *testing.B) {
	p := &progressBar{w: io.Discard, on: true, label: "ephemeris", total: 1e9, stride: 64, now: time.Now}
	p.start = p.now()
	x := 0.0
	for b.Loop() {
		x++
		p.Update(x)
	}
}

// BenchmarkLoadMission is the demo mission's load and command-line
// building, the path FuzzLoadMission drives.
func BenchmarkLoadMission(b *testing.B) {
	for b.Loop() {
		mr, err := loadMission("demo", demoMission)
		if err != nil {
			b.Fatal(err)
		}
		for i := range mr.m.Output {
			if _, _, _, err := mr.args(i); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkOrbitCommandInProcess is one in-process orbit run with JSON
// output, the unit of FuzzOrbitCommand and the property tests.
func BenchmarkOrbitCommandInProcess(b *testing.B) {
	argv := []string{"centra", "--format", "json", "--quiet", "orbit", "--epoch", "2027-01-01T00:00:00Z", "--altitude", "500", "--inclination", "51.6"}
	var out, errb bytes.Buffer
	for b.Loop() {
		out.Reset()
		errb.Reset()
		if code := run(argv, &out, &errb); code != 0 {
			b.Fatal(errb.String())
		}
	}
}

// BenchmarkEphemerisFinalCommand is the command of the SciPy comparison
// (testdata/bench/compare.py) in-process: a one-day point-mass propagation
// (about a third of the time) plus flags, setup and the JSON record.
func BenchmarkEphemerisFinalCommand(b *testing.B) {
	argv := []string{"centra", "--format", "json", "--quiet", "ephemeris", "--final", "--model", "point",
		"--position", "6878.137,0,0", "--velocity", "0,7.612,0.5", "--span", "86400", "--tolerance", "1e-10",
		"--epoch", "2026-01-01T00:00:00Z"}
	var out, errb bytes.Buffer
	b.ReportAllocs()
	for b.Loop() {
		out.Reset()
		errb.Reset()
		if code := run(argv, &out, &errb); code != 0 {
			b.Fatal(errb.String())
		}
	}
}
