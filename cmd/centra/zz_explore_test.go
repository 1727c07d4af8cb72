package main

import (
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"centra/bodies"
	"centra/orbit"
)

func TestZZExplore(t *testing.T) {
	rng := rand.New(rand.NewPCG(12, 1))
	earth, _ := bodies.Lookup("earth")
	fail := map[string]int{}
	worst := map[string]float64{}
	for range 100000 {
		ro := drawOrbit(rng, earth)
		cls := strings.Fields(ro.Class)[0]
		if math.Abs(1-ro.El.E) < 1e-5 {
			continue
		}
		checks, _ := orbit.KeplerChecks(earth.GM, ro.State)
		for _, ch := range checks {
			k := cls + "/" + ch.Name
			worst[k] = math.Max(worst[k], ch.RelativeError)
			if !ch.Pass {
				fail[k]++
				el, _ := orbit.ElementsFromState(earth.GM, ro.State)
				M, _ := orbit.MeanFromTrue(el.Nu, el.E)
				if fail[k] < 8 {
					t.Logf("%s %s nu=%.9f M=%.9f rel %.3g exp %.9g meas %.9g", ro.Class, ch.Name, el.Nu, M, ch.RelativeError, ch.Expected, ch.Measured)
				}
			}
		}
	}
	t.Logf("check fails %v", fail)
	for k, v := range worst {
		if v > 1e-12 {
			t.Logf("worst %s %.3g", k, v)
		}
	}
}
