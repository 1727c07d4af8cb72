package visibility_test

import (
	"fmt"

	"centra/bodies/geodesy"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
	"centra/propagate/visibility"
)

func Example() {
	// A 500 km sun-synchronous orbit (J2) seen from a site at 47.4 N,
	// 8.9 E, 612 m, above 10 deg, over one day.
	const mu, re, j2 = 398600.4418, 6378.137, 1.0826266835531513e-3
	start := timescale.MustParseUTC("2027-04-13T00:00:00Z")
	s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: re + 500, P: re + 500, I: 97.4 * deg})
	p, _ := propagate.New(propagate.J2(mu, re, j2), propagate.Options{})
	tr, _ := trajectory.Sample(p, s0, 86400, trajectory.Options{})
	fr := visibility.NewEarthFrame(start, 0, 86400)
	site, _ := visibility.NewSite("ashgrove", geodesy.Site{Lat: 47.412 * deg, Lon: 8.917 * deg, Alt: 0.612}, 10*deg, nil, false)
	for _, ps := range visibility.Find(tr, fr, site, visibility.Options{}).Passes {
		fmt.Printf("AOS %s  %5.1f s  max %4.1f deg\n", start.Add(ps.AOS).FormatUTC()[:21], ps.Duration(), ps.MaxElevation()/deg)
	}
	// Output:
	// AOS 2027-04-13T08:05:16.6  157.8 s  max 11.6 deg
	// AOS 2027-04-13T09:36:01.5  441.5 s  max 68.3 deg
	// AOS 2027-04-13T22:34:35.6  440.2 s  max 81.1 deg
}
