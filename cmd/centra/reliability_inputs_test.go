package main

import (
	"bytes"
	"fmt"
	"io"
	"math/rand/v2"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/urfave/cli/v2"
)

// validBases are quick, valid command lines of each command; the
// invalid-input test spoils their flags one at a time.
func validBases(dir string) map[string][]string {
	ep := []string{"--epoch", "2027-01-01T00:00:00Z"}
	return map[string][]string{
		"orbit":      append([]string{"--altitude", "500", "--inclination", "51.6"}, ep...),
		"ephemeris":  append([]string{"--altitude", "500", "--span", "10min", "--step", "5min"}, ep...),
		"passes":     append([]string{"--altitude", "500", "--inclination", "51.6", "--site", "47,8", "--span", "3h"}, ep...),
		"eclipses":   append([]string{"--altitude", "500", "--span", "3h"}, ep...),
		"lifetime":   append([]string{"--altitude", "300", "--ballistic-coefficient", "50"}, ep...),
		"atmosphere": {"--alt", "5"},
		"bodies":     {"earth"},
		"ballistic":  {"--site", "57,-7", "--burnout-alt", "35", "--burnout-speed", "2", "--flight-path-angle", "90"},
		"transfer":   {"--from-alt", "300", "--to-alt", "35786", "--plane-change", "28.5", "--isp", "300", "--mass", "2000"},
		"lambert":    {"--r1", "15945.34,0,0", "--r2", "12214.83899,10249.46731,0", "--tof", "76min"},
		"sweep":      {"--vary", "altitude=400:500:100", "--outputs", "period_s", "orbit", "--epoch", "2027-01-01T00:00:00Z"},
		"plot":       append([]string{"--kind", "orbit", "--altitude", "500", "--out", filepath.Join(dir, "p.svg"), "--force"}, ep...),
	}
}

// freeText are flags whose value is any text by design (names and
// labels), or that a bad value cannot reach (file paths of other
// tests); they are not spoiled.
var freeText = map[string]bool{
	"object-name": true, "object-id": true, "title": true, "name": true,
	"out": true, "bodies": true, "leap-seconds": true, "from-opm": true, "mask": true,
	"help": true,
}

// badValues are texts no numeric, vector, time, name or choice flag may
// accept.
var badValues = []string{"NaN", "Inf", "-Inf", "nan km", "1e400", "abc", "5 furlongs", "1,2,3,4", "\x00", "--", "0x1p-2000000", "½"}

// TestReliabilityInvalidInputs: for random invalid combinations (one or
// two flags of a valid command line given a bad value, or an unknown
// flag), every command exits 2 with one line "centra: WHAT; FIX" and
// prints nothing on stdout. In-process through run().
func TestReliabilityInvalidInputs(t *testing.T) {
	dir := t.TempDir()
	bases := validBases(dir)
	app := newApp(io.Discard, io.Discard)
	flagsOf := map[string][]string{}
	for _, c := range app.Commands {
		if _, ok := bases[c.Name]; !ok {
			continue
		}
		for _, f := range c.Flags {
			if _, isBool := f.(*cli.BoolFlag); isBool {
				continue
			}
			name := f.Names()[0]
			if !freeText[name] {
				flagsOf[c.Name] = append(flagsOf[c.Name], name)
			}
		}
	}
	rng := rand.New(rand.NewPCG(12, 3))
	cmds := make([]string, 0, len(bases))
	for c := range bases {
		cmds = append(cmds, c)
	}
	// Every flag of every command once with the first bad value, then
	// random combinations.
	type trial struct {
		cmd   string
		flags []string
		vals  []string
	}
	var trials []trial
	for _, c := range cmds {
		for _, f := range flagsOf[c] {
			trials = append(trials, trial{c, []string{f}, []string{badValues[0]}})
		}
	}
	for range 400 {
		c := cmds[rng.IntN(len(cmds))]
		fl := flagsOf[c]
		tr := trial{cmd: c}
		for range 1 + rng.IntN(2) {
			tr.flags = append(tr.flags, fl[rng.IntN(len(fl))])
			tr.vals = append(tr.vals, badValues[rng.IntN(len(badValues))])
		}
		trials = append(trials, tr)
	}
	for i := range 20 {
		c := cmds[i%len(cmds)]
		trials = append(trials, trial{c, []string{"no-such-flag-" + strconv.Itoa(i)}, []string{"1"}})
	}
	accepted := map[string]bool{}
	for _, tr := range trials {
		// Replace the flag where the base sets it, else add it.
		argv := append([]string(nil), bases[tr.cmd]...)
		for k, f := range tr.flags {
			replaced := false
			for j := 0; j+1 < len(argv); j++ {
				if argv[j] == "--"+f {
					argv[j+1] = tr.vals[k]
					replaced = true
				}
			}
			if !replaced {
				// in front: sweep's own flags come before its command
				argv = append([]string{"--" + f + "=" + tr.vals[k]}, argv...)
			}
		}
		full := append([]string{"centra", "--quiet", "--format", "json", tr.cmd}, argv...)
		var out, errb bytes.Buffer
		code := run(full, &out, &errb)
		key := fmt.Sprintf("%s --%s=%q", tr.cmd, tr.flags[0], tr.vals[0])
		if code == 0 && len(tr.flags) == 1 {
			accepted[key] = true
			continue
		}
		if code == 0 {
			continue // one of the two may be the accepted kind below
		}
		if code != 2 || out.Len() != 0 && tr.cmd != "ephemeris" {
			t.Errorf("%q: exit %d, stdout %q, stderr %q", full, code, out.String(), errb.String())
			continue
		}
		if strings.Count(errb.String(), "\n") != 1 || !strings.HasPrefix(errb.String(), "centra: ") || !strings.Contains(errb.String(), "; ") {
			t.Errorf("%q: stderr is not one line 'centra: WHAT; FIX': %q", full, errb.String())
		}
	}
	for k := range accepted {
		t.Errorf("accepted a bad value: %s", k)
	}
}
