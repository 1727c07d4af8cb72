package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
)

// TestReliabilityConcurrentRuns drives, in-process, the code that runs on
// several goroutines: sweep's workers, passes over several sites,
// ballistic dispersions, and several runs at once writing --out files
// (the temporary-file registry and its signal handler). CI runs it under
// the race detector (.ci/run); here it also checks each result.
func TestReliabilityConcurrentRuns(t *testing.T) {
	dir := t.TempDir()
	t.Run("sweep workers", func(t *testing.T) {
		out, stderr, code := runApp("--format", "csv", "--quiet", "sweep", "--workers", "4", "--vary", "altitude=400:1000:100",
			"--outputs", "period_s", "orbit", "--epoch", "2027-01-01T00:00:00Z")
		if code != 0 || strings.Count(out, "\n") != 8 {
			t.Fatalf("exit %d, %d lines; stderr %q\n%s", code, strings.Count(out, "\n"), stderr, out)
		}
	})
	t.Run("passes over sites", func(t *testing.T) {
		_, stderr, code := runApp("--format", "json", "--quiet", "passes", "--epoch", "2027-01-01T00:00:00Z", "--altitude", "500", "--inclination", "97.4",
			"--site", "a=47,8", "--site", "b=-33,151", "--site", "c=64,-21", "--site", "d=0,0", "--span", "1d")
		if code != 0 {
			t.Fatalf("exit %d: %s", code, stderr)
		}
	})
	t.Run("ballistic dispersions", func(t *testing.T) {
		_, stderr, code := runApp("--format", "json", "--quiet", "ballistic", "--site", "57.35,-7.33", "--burnout-alt", "35", "--burnout-speed", "2",
			"--flight-path-angle", "84", "--azimuth", "290", "--dispersions", "40", "--sigma-speed", "10m/s", "--seed", "3")
		if code != 0 {
			t.Fatalf("exit %d: %s", code, stderr)
		}
	})
	t.Run("runs at once with --out", func(t *testing.T) {
		var wg sync.WaitGroup
		errs := make([]string, 6)
		for i := range 6 {
			wg.Add(1)
			go func() {
				defer wg.Done()
				// One app per goroutine, with help hidden as sweep's case
				// runners do: urfave/cli v2.27.7 writes to its global
				// HelpFlag on every Run, a race of the library between apps.
				var out, errb bytes.Buffer
				app := newApp(&out, &errb)
				app.HideHelp = true
				for _, c := range app.Commands {
					c.HideHelp = true
				}
				args := []string{"centra", "--format", "csv", "--quiet", "ephemeris", "--epoch", "2027-01-01T00:00:00Z", "--altitude", fmt.Sprint(400 + 50*i),
					"--span", "2h", "--step", "1min", "--out", filepath.Join(dir, fmt.Sprintf("e%d.csv", i))}
				if i%3 == 2 {
					args = append(args[:len(args)-2], "--step", "0") // a failing run among them
				}
				if code := exitCode(app.Run(args), &errb); (code != 0) != (i%3 == 2) {
					errs[i] = fmt.Sprintf("run %d: exit %d: %s", i, code, errb.String())
				}
			}()
		}
		wg.Wait()
		for _, e := range errs {
			if e != "" {
				t.Error(e)
			}
		}
		entries, _ := os.ReadDir(dir)
		if len(entries) != 4 {
			var names []string
			for _, e := range entries {
				names = append(names, e.Name())
			}
			t.Errorf("directory holds %v, want the 4 files of the good runs", names)
		}
		tempMu.Lock()
		left := len(tempFiles)
		tempMu.Unlock()
		if left != 0 {
			t.Errorf("%d temporary files still registered", left)
		}
	})
}
