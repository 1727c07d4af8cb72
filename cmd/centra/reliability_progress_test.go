package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// fakeClock advances by step at each reading.
type fakeClock struct {
	t    time.Time
	step time.Duration
}

func (c *fakeClock) now() time.Time { c.t = c.t.Add(c.step); return c.t }

func TestProgressBarDraws(t *testing.T) {
	var buf bytes.Buffer
	clk := &fakeClock{t: time.Unix(0, 0), step: 100 * time.Millisecond}
	p := &progressBar{w: &buf, on: true, label: "ephemeris", total: 1000, stride: 1, now: clk.now}
	p.start = p.now()
	// The first second draws nothing.
	for i := range 9 {
		p.Update(float64(i))
	}
	if buf.Len() != 0 {
		t.Fatalf("drew %q before a second had passed", buf.String())
	}
	// Then at most one redraw per progressPeriod (two readings here).
	for i := range 10 {
		p.Update(250 + float64(i))
	}
	lines := strings.Split(buf.String(), "\r")[1:]
	if len(lines) < 4 || len(lines) > 6 {
		t.Fatalf("%d redraws in 1 s of updates, want about 5: %q", len(lines), buf.String())
	}
	if !strings.HasPrefix(lines[0], "centra: ephemeris  25.0% [######..................] 0:01 elapsed, about 0:03 left") {
		t.Errorf("line %q", lines[0])
	}
	// A shorter line is padded over the longer one; Clear blanks it.
	w := p.width
	p.total = 1e30
	p.last = time.Time{}
	buf.Reset()
	p.Update(1)
	if got := buf.String(); len(got) != w+1 || !strings.HasSuffix(got, " ") {
		t.Errorf("shorter line %q (len %d) does not cover the old one (len %d)", got, len(got), w)
	}
	w = p.width // the padding beyond it is blank already
	buf.Reset()
	p.Clear()
	if got := buf.String(); got != "\r"+strings.Repeat(" ", w)+"\r" {
		t.Errorf("Clear wrote %q", got)
	}
	buf.Reset()
	p.Clear()
	if buf.Len() != 0 {
		t.Errorf("second Clear wrote %q", buf.String())
	}
	var nilBar *progressBar
	nilBar.Update(1)
	nilBar.Clear()
}

func TestProgressBarOnlyOnATerminal(t *testing.T) {
	devnull, err := os.OpenFile(os.DevNull, os.O_WRONLY, 0)
	if err != nil {
		t.Fatal(err)
	}
	defer devnull.Close()
	pipeR, pipeW, err := os.Pipe()
	if err != nil {
		t.Fatal(err)
	}
	defer pipeR.Close()
	defer pipeW.Close()
	file, err := os.Create(filepath.Join(t.TempDir(), "rows.csv"))
	if err != nil {
		t.Fatal(err)
	}
	defer file.Close()
	var buf bytes.Buffer
	// /dev/null is a character device, so it stands in for a terminal.
	tests := []struct {
		name string
		o    *output
		want bool
	}{
		{"stderr a buffer", &output{Stderr: &buf, W: pipeW}, false},
		{"stderr a pipe", &output{Stderr: pipeW, W: file}, false},
		{"stderr a file", &output{Stderr: file, W: pipeW}, false},
		{"terminal, rows to a pipe", &output{Stderr: devnull, W: pipeW}, true},
		{"terminal, rows to --out", &output{Stderr: devnull, W: file, file: file}, true},
		{"terminal, rows to the terminal", &output{Stderr: devnull, W: devnull}, false},
		{"quiet", &output{Stderr: devnull, W: pipeW, Quiet: true}, false},
	}
	for _, tt := range tests {
		if got := newProgressBar(tt.o, "x", 10, true).on; got != tt.want {
			t.Errorf("%s: on = %v, want %v", tt.name, got, tt.want)
		}
	}
	if !newProgressBar(&output{Stderr: devnull, W: devnull}, "x", 10, false).on {
		t.Error("off for a command that writes after the run, with stdout on the terminal")
	}
	if newProgressBar(&output{Stderr: devnull, W: pipeW}, "x", 0, true).on {
		t.Error("on for zero work")
	}
}

func TestProgressClock(t *testing.T) {
	for _, tt := range []struct {
		d    time.Duration
		want string
	}{{0, "0:00"}, {1499 * time.Millisecond, "0:01"}, {61 * time.Second, "1:01"}, {3*time.Hour + 5*time.Minute + 7*time.Second, "3:05:07"}, {-time.Second, "0:00"}} {
		if got := clock(tt.d); got != tt.want {
			t.Errorf("clock(%v) = %q, want %q", tt.d, got, tt.want)
		}
	}
}

// On a pipe (as in CI and scripts) a long run writes no progress.
func TestProgressNotOnPipes(t *testing.T) {
	out := filepath.Join(t.TempDir(), "e.csv")
	_, stderr, code := runBinary(t, "--format", "csv", "ephemeris", "--epoch", "2027-01-01T00:00:00Z", "--altitude", "500", "--span", "3d", "--step", "1s", "--out", out)
	if code != 0 || strings.Contains(stderr, "\r") || strings.Contains(stderr, "elapsed") {
		t.Errorf("exit %d, stderr %q", code, stderr)
	}
}
