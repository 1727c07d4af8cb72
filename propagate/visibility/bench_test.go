package visibility_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"centra/bodies/geodesy"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
	"centra/propagate/visibility"
)

// benchmarkWeek is the whole computation behind seven days of passes of
// a 500 km sun-synchronous orbit with J2 over nSites sites: propagation,
// sampling, the Earth frame and the search (in parallel over the sites).
func benchmarkWeek(b *testing.B, nSites int) {
	start := timescale.MustParseUTC("2027-04-13T00:00:00Z")
	el := orbit.Elements{A: earthRe + 500, P: earthRe + 500, I: 97.4 * deg, RAAN: 1}
	s0, err := orbit.StateFromElements(earthMu, el)
	if err != nil {
		b.Fatal(err)
	}
	p, err := propagate.New(propagate.J2(earthMu, earthRe, 1.0826266835531513e-3), propagate.Options{})
	if err != nil {
		b.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(1, 1))
	sites := make([]visibility.Site, nSites)
	for i := range sites {
		lat := math.Asin(2*rng.Float64() - 1) // uniform over the sphere
		sites[i], err = visibility.NewSite(fmt.Sprint(i), geodesy.Site{Lat: lat, Lon: (rng.Float64()*360 - 180) * deg, Alt: 0.2}, 5*deg, nil, false)
		if err != nil {
			b.Fatal(err)
		}
	}
	const span = 7 * 86400
	passes := 0
	for b.Loop() {
		tr, err := trajectory.Sample(p, s0, span, trajectory.Options{})
		if err != nil {
			b.Fatal(err)
		}
		fr := visibility.NewEarthFrame(start, 0, span)
		passes = 0
		for _, r := range visibility.FindAll(tr, fr, sites, visibility.Options{}) {
			passes += len(r.Passes)
		}
	}
	b.ReportMetric(float64(passes), "passes")
}

func BenchmarkWeekOneSite(b *testing.B)      { benchmarkWeek(b, 1) }
func BenchmarkWeekHundredSites(b *testing.B) { benchmarkWeek(b, 100) }
