package track_test

import (
	"math"
	"testing"

	"centra/bodies/geodesy"
	"centra/propagate"
	"centra/propagate/suborbital"
	"centra/propagate/track"
)

// TestLayOutImpacts: the nominal point projected by LayOutImpacts lands
// where suborbital.Disperse puts a case with the same impact point (its
// own projection, other code), and the centre is the mean of the cases.
// A second check against geometry: a point due north of the mean by a
// small angle dphi on the ellipsoid lies north by M dphi (M the meridian
// radius of curvature, NIMA TR8350.2 eq. 4-18 form M = a(1-e^2)/W^3).
func TestLayOutImpacts(t *testing.T) {
	cfg := suborbital.Config{Gravity: propagate.J2(earthMu, earthRe, 1.08262668e-3), Omega: 7.292115e-5}
	nominal := suborbital.Burnout{Lat: 57.35 * deg, Lon: -7.33 * deg, Alt: 35, Speed: 2, FlightPath: 84 * deg, Azimuth: 290 * deg}
	res, err := suborbital.Disperse(cfg, nominal, suborbital.Vehicle{}, suborbital.Dispersion{Cases: 20, Seed: 3, Sigma: suborbital.Sigma{Speed: 0.01, Azimuth: 1 * deg}})
	if err != nil {
		t.Fatal(err)
	}
	c := res.Cases[7]
	im := track.LayOutImpacts(&res, geodesy.WGS84, 0, c.ImpactLat, c.ImpactLon)
	const tolKm = 1e-9
	if math.Abs(im.NominalEast-c.East) > tolKm || math.Abs(im.NominalNorth-c.North) > tolKm {
		t.Errorf("case 7 projected to (%.12f, %.12f) km, Disperse says (%.12f, %.12f)", im.NominalEast, im.NominalNorth, c.East, c.North)
	}
	me, mn := 0.0, 0.0
	for i, k := range res.Cases {
		if im.East[i] != k.East || im.North[i] != k.North {
			t.Fatalf("case %d copied as (%g, %g), is (%g, %g)", i, im.East[i], im.North[i], k.East, k.North)
		}
		me += k.East / 20
		mn += k.North / 20
	}
	if math.Abs(im.CentreEast-me) > 1e-12 || math.Abs(im.CentreNorth-mn) > 1e-12 {
		t.Errorf("centre (%g, %g), mean (%g, %g)", im.CentreEast, im.CentreNorth, me, mn)
	}
	const dphi = 1e-5 // rad, about 64 m: the chord and the arc agree to 1e-10 relative
	north := track.LayOutImpacts(&res, geodesy.WGS84, 0, res.MeanLat+dphi, res.MeanLon)
	a, f := geodesy.WGS84A, 1/geodesy.WGS84InvF
	e2 := f * (2 - f)
	s := math.Sin(res.MeanLat + dphi/2)
	m := a * (1 - e2) / math.Pow(1-e2*s*s, 1.5)
	if want := m * dphi; math.Abs(north.NominalNorth-want) > 1e-6*want || math.Abs(north.NominalEast) > 1e-9 {
		t.Errorf("a point %g rad north of the mean at (%.9f, %.9f) km, want (0, %.9f)", dphi, north.NominalEast, north.NominalNorth, want)
	}
}
