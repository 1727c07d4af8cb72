// Command driver times centra's propagator in-process for the SciPy
// comparison of testdata/bench/compare.py. It reads problems as JSON on
// stdin and writes one JSON result per problem on stdout:
//
//	{"problems": [{"name": "leo-1d-j2", "mu_km3_s2": 398600.4418,
//	  "re_km": 6378.137, "j2": 0.00108262617, "state0": [x, y, z, vx, vy, vz],
//	  "span_s": 86400, "rtol": 1e-10, "checkpoints": 48}], "repeats": 20}
//
//	[{"name": ..., "rtol": ..., "final": [x, y, z, vx, vy, vz],
//	  "evaluations": n, "steps": n, "ns_best": t, "ns_median": t,
//	  "samples": [[t, x, y, z], ...]}]
//
// j2 = 0 means the point mass. Times are of propagate.(*Propagator).Run
// alone (the propagator is built once, as the commands do), best and
// median of the repeats, without output. samples are the positions at
// span/checkpoints intervals from one more, untimed run with fixed-step
// output (the dense output of the same steps). Units km, km/s, s.
//
// It lives under testdata so that 'go build ./...' and CI skip it; run it
// as 'go run ./testdata/bench/driver' from the repository root.
package main

import (
	"encoding/json"
	"fmt"
	"os"
	"sort"
	"time"

	"centra/orbit"
	"centra/propagate"
)

type problem struct {
	Name   string     `json:"name"`
	Mu     float64    `json:"mu_km3_s2"`
	Re     float64    `json:"re_km"`
	J2     float64    `json:"j2"`
	State0 [6]float64 `json:"state0"`
	Span   float64    `json:"span_s"`
	RelTol float64    `json:"rtol"`
	Checks int        `json:"checkpoints"`
}

type result struct {
	Name        string       `json:"name"`
	RelTol      float64      `json:"rtol"`
	Final       [6]float64   `json:"final"`
	Evaluations int          `json:"evaluations"`
	Steps       int          `json:"steps"`
	NsBest      int64        `json:"ns_best"`
	NsMedian    int64        `json:"ns_median"`
	Samples     [][4]float64 `json:"samples"`
}

func main() {
	var in struct {
		Problems []problem `json:"problems"`
		Repeats  int       `json:"repeats"`
	}
	if err := json.NewDecoder(os.Stdin).Decode(&in); err != nil {
		fmt.Fprintln(os.Stderr, "driver: reading problems:", err)
		os.Exit(2)
	}
	if in.Repeats < 1 {
		in.Repeats = 10
	}
	var out []result
	for _, p := range in.Problems {
		m := propagate.PointMass(p.Mu)
		if p.J2 != 0 {
			m = propagate.J2(p.Mu, p.Re, p.J2)
		}
		prop, err := propagate.New(m, propagate.Options{RelTol: p.RelTol})
		if err != nil {
			fmt.Fprintln(os.Stderr, "driver:", p.Name, err)
			os.Exit(2)
		}
		s0 := orbit.State{R: [3]float64{p.State0[0], p.State0[1], p.State0[2]}, V: [3]float64{p.State0[3], p.State0[4], p.State0[5]}}
		var res propagate.Result
		times := make([]int64, in.Repeats)
		for k := range in.Repeats {
			start := time.Now()
			res, err = prop.Run(s0, p.Span, nil)
			times[k] = time.Since(start).Nanoseconds()
			if err != nil {
				fmt.Fprintln(os.Stderr, "driver:", p.Name, err)
				os.Exit(1)
			}
		}
		sort.Slice(times, func(i, j int) bool { return times[i] < times[j] })
		r := result{Name: p.Name, RelTol: p.RelTol, Evaluations: res.Stats.Evaluations, Steps: res.Stats.Steps,
			NsBest: times[0], NsMedian: times[len(times)/2]}
		copy(r.Final[:3], res.State.R[:])
		copy(r.Final[3:], res.State.V[:])
		if p.Checks > 0 {
			onState := func(t float64, s orbit.State) error {
				r.Samples = append(r.Samples, [4]float64{t, s.R[0], s.R[1], s.R[2]})
				return nil
			}
			if _, err := prop.Run(s0, p.Span, &propagate.Output{Step: p.Span / float64(p.Checks), OnState: onState}); err != nil {
				fmt.Fprintln(os.Stderr, "driver:", p.Name, err)
				os.Exit(1)
			}
		}
		out = append(out, r)
	}
	enc := json.NewEncoder(os.Stdout)
	enc.SetIndent("", " ")
	if err := enc.Encode(out); err != nil {
		fmt.Fprintln(os.Stderr, "driver:", err)
		os.Exit(1)
	}
}
