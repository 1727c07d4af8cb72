package forces_test

import (
	"math"
	"testing"

	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
)

// TestGEOInclinationGrowth propagates an equatorial geostationary orbit
// for a year under the Sun and Moon (point-mass Earth) and compares the
// secular growth of its inclination with the first-order averaged theory,
// evaluated independently with the series positions of the Sun and Moon:
// averaged over the satellite's circular orbit, the tidal quadrupole of a
// body at distance r3 in direction s turns the orbit normal h at
//
//	dh/dt = (3 mu3 / (2 n r3^3)) (h.s) (s x h)
//
// (the averaged form of the third-body disturbing function, Battin 1999,
// sec. 8.4, and Soop, Handbook of Geostationary Orbits, 1994, ch. 4, from
// memory; its further average over a circular third-body orbit of pole p
// is the familiar -(3/4) mu3/(n r3^3) (h.p) (p x h), whose magnitude
// for h = z is (3/4) mu3/(n r3^3) sin(eps) cos(eps)). Octupole terms
// vanish on a circular orbit; the next (hexadecapole) terms are of relative size
// (a/r_moon)^2 = 1.2% in the lunar part, which sets the 2% tolerance.
// The change of h over the year is compared with the integral of this
// rate along the series positions, so that the monthly and semi-annual
// terms of both cancel. The result also lies in the band of 0.75 to 0.95 deg/year that
// depends on the epoch through the 18.6-year cycle of the lunar node
// (common practice, no source): the node was near the vernal equinox in
// 2006 (lunar orbit inclined up to 28.6 deg to the equator) and near the
// autumnal equinox in 2015 (18.3 deg) (from memory; the computed
// inclinations show it).
func TestGEOInclinationGrowth(t *testing.T) {
	if testing.Short() {
		t.Skip("one year of GEO twice")
	}
	const mu = 398600.4418
	const sunGM, moonGM = 1.3271244e11, 4902.800118 // as the bodies catalogue
	a := math.Cbrt(mu * math.Pow(86164.0905/(2*math.Pi), 2))
	n := math.Sqrt(mu / (a * a * a))
	year := 365.25 * 86400
	cases := []struct {
		epoch      string
		lo, hi     float64 // deg/year band, common practice
		moonIncDeg float64 // rough inclination of the lunar orbit to the equator, from memory
	}{
		{"2006-03-20T00:00:00Z", 0.85, 0.97, 28.6},
		{"2015-09-23T00:00:00Z", 0.70, 0.82, 18.3},
	}
	for _, c := range cases {
		ep := timescale.MustParseUTC(c.epoch)
		sun, moon := forces.NewSunEphemeris(ep), forces.NewMoonEphemeris(ep)
		third := []*forces.ThirdBody{{Name: "sun", GM: sunGM, Position: sun.Position}, {Name: "moon", GM: moonGM, Position: moon.Position}}
		m := propagate.PointMass(mu)
		m.Perturbation = forces.Combine(third[0].Perturbation(), third[1].Perturbation())
		p, err := propagate.New(m, propagate.Options{RelTol: 1e-10})
		if err != nil {
			t.Fatal(err)
		}
		s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: a, P: a})
		// The closed form, integrated along the year with the series
		// positions and the propagated orbit normal h(t) (midpoint rule).
		const ns = 4000
		dt := year / ns
		var wx, wy, moonInc float64
		unitH := func(s orbit.State) [3]float64 {
			r, v := s.R, s.V
			h := [3]float64{r[1]*v[2] - r[2]*v[1], r[2]*v[0] - r[0]*v[2], r[0]*v[1] - r[1]*v[0]}
			hn := norm(h)
			return [3]float64{h[0] / hn, h[1] / hn, h[2] / hn}
		}
		var hPrev [3]float64
		out := &propagate.Output{Step: dt / 2, OnState: func(tt float64, st orbit.State) error {
			k := math.Round(tt / (dt / 2))
			if int(k)%2 == 0 { // ends of the intervals: keep h for the record
				hPrev = unitH(st)
				return nil
			}
			h := unitH(st) // midpoint
			for i, tb := range third {
				r3 := tb.Position(tt)
				d := norm(r3)
				sv := [3]float64{r3[0] / d, r3[1] / d, r3[2] / d}
				f := 1.5 * tb.GM / (n * d * d * d) * (h[0]*sv[0] + h[1]*sv[1] + h[2]*sv[2]) * dt
				// s x h
				wx += f * (sv[1]*h[2] - sv[2]*h[1])
				wy += f * (sv[2]*h[0] - sv[0]*h[2])
				if i == 1 {
					v := sub(tb.Position(tt+60), r3)
					hm := [3]float64{r3[1]*v[2] - r3[2]*v[1], r3[2]*v[0] - r3[0]*v[2], r3[0]*v[1] - r3[1]*v[0]}
					moonInc += math.Acos(hm[2]/norm(hm)) / deg / ns
				}
			}
			return nil
		}}
		if _, err := p.Run(s0, year, out); err != nil {
			t.Fatal(err)
		}
		hEnd := hPrev
		measured := math.Hypot(hEnd[0], hEnd[1]) / deg // deg in one year
		theory := math.Hypot(wx, wy) / deg
		if rel := math.Hypot(hEnd[0]-wx, hEnd[1]-wy) / math.Hypot(wx, wy); rel > 0.02 {
			t.Errorf("%s: inclination vector after a year (%.5f, %.5f) deg, averaged theory (%.5f, %.5f) deg (rel %.3f), want within 2%% (the neglected hexadecapole is (a/r_moon)^2 = 1.2%% of the lunar part)",
				c.epoch, hEnd[0]/deg, hEnd[1]/deg, wx/deg, wy/deg, rel)
		}
		if measured < c.lo || measured > c.hi {
			t.Errorf("%s: inclination grows %.4f deg/year, outside the band %.2f..%.2f deg/year", c.epoch, measured, c.lo, c.hi)
		}
		if math.Abs(moonInc-c.moonIncDeg) > 1.5 {
			t.Errorf("%s: mean lunar inclination to the equator %.2f deg, expected about %.1f deg", c.epoch, moonInc, c.moonIncDeg)
		}
		t.Logf("%s: measured %.4f deg/year, theory %.4f deg/year, lunar inclination %.2f deg", c.epoch, measured, theory, moonInc)
	}
}
