package track

import (
	"fmt"
	"math"

	"centra/bodies/sunmoon"
	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/trajectory"
	"centra/propagate/visibility"
)

// SkyPoint is where a site sees the satellite.
type SkyPoint struct {
	T      float64 // s from the initial state
	Az, El float64 // azimuth from north through east in [0, 2pi), elevation, rad
}

// SkyPass is one pass over a site with its path across the sky.
type SkyPass struct {
	visibility.Pass
	// Path runs from AOS to LOS (both included) in time order.
	Path []SkyPoint
}

// SkyPathPoints bounds the points of one pass's path: at least
// MinSkyPathPoints, at most MaxSkyPathPoints, otherwise one per step.
const (
	MinSkyPathPoints = 24
	MaxSkyPathPoints = 2000
)

// Sky finds the passes of the orbit from s0 (propagated with p over a
// positive span, s) over site, with t = 0 at the epoch ep and UT1-UTC =
// dut1 (s), and samples each pass's azimuth and elevation every step
// seconds from AOS to LOS. The passes are those of visibility.Find on a
// trajectory.Sample of the orbit, annotated (visibility.Annotate) with
// the Sun of sunmoon.Sun and the Earth's shadow for a sphere of radius re
// (km).
func Sky(p *propagate.Propagator, s0 orbit.State, ep timescale.Epoch, dut1, span, step, re float64, site visibility.Site) ([]SkyPass, error) {
	return SkyUntil(p, s0, ep, dut1, span, step, re, site, nil)
}

// SkyUntil is Sky with a stop event, as [PropagateUntil]: if it occurs
// within the span, the result is a [*trajectory.StopError].
func SkyUntil(p *propagate.Propagator, s0 orbit.State, ep timescale.Epoch, dut1, span, step, re float64, site visibility.Site, stop *propagate.Event) ([]SkyPass, error) {
	if !(span > 0) || math.IsInf(span, 0) {
		return nil, fmt.Errorf("%w: the sky view needs a positive span, got %g s", ErrSamples, span)
	}
	if !(step > 0) || math.IsInf(step, 0) {
		return nil, fmt.Errorf("%w: step %g s", ErrSamples, step)
	}
	if err := timescale.CheckDUT1(dut1); err != nil {
		return nil, err
	}
	tr, err := trajectory.Sample(p, s0, span, trajectory.Options{Stop: stop})
	if err != nil {
		return nil, err
	}
	fr := visibility.NewEarthFrame(ep, dut1, span)
	res := visibility.Find(tr, fr, site, visibility.Options{})
	visibility.Annotate(res.Passes, tr, fr, site, func(t float64) [3]float64 { return sunmoon.Sun(ep.Add(t)) }, re)
	out := make([]SkyPass, len(res.Passes))
	for i, ps := range res.Passes {
		n := int(math.Ceil(ps.Duration() / step))
		n = max(MinSkyPathPoints, min(n, MaxSkyPathPoints))
		path := make([]SkyPoint, n+1)
		for k := range path {
			t := ps.AOS + ps.Duration()*float64(k)/float64(n)
			if k == n {
				t = ps.LOS
			}
			l := site.Look(tr, fr, t)
			path[k] = SkyPoint{T: t, Az: l.Az, El: l.El}
		}
		out[i] = SkyPass{Pass: ps, Path: path}
	}
	return out, nil
}
