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
	rtfail := map[string]int{}
	rtworst := map[string]float64{}
	for range 100000 {
		ro := drawOrbit(rng, earth)
		cls := strings.Fields(ro.Class)[0]
		checks, _ := orbit.KeplerChecks(earth.GM, ro.State)
		for _, ch := range checks {
			k := cls + "/" + ch.Name
			worst[k] = math.Max(worst[k], ch.RelativeError)
			if !ch.Pass {
				fail[k]++
			}
		}
		el, _ := orbit.ElementsFromState(earth.GM, ro.State)
		s2, _ := orbit.StateFromElements(earth.GM, el)
		d := math.Max(relDiff3(s2.R, ro.State.R), relDiff3(s2.V, ro.State.V))
		rtworst[cls] = math.Max(rtworst[cls], d)
		if d > 1e-12 {
			rtfail[cls]++
		}
	}
	t.Logf("check fails %v", fail)
	for k, v := range worst {
		if v > 1e-11 {
			t.Logf("worst %s %.3g", k, v)
		}
	}
	t.Logf("rt fails %v worst %v", rtfail, rtworst)
}
