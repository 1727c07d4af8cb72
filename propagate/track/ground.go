package track

import (
	"fmt"
	"math"

	"centra/bodies/geodesy"
	"centra/bodies/sunmoon"
	"centra/bodies/timescale"
	"centra/propagate/shadow"
	"centra/propagate/visibility"
)

// GroundPoint is one sample of a ground track.
type GroundPoint struct {
	T        float64 // s from the initial state
	Lat, Lon float64 // geodetic latitude in [-pi/2, pi/2], longitude east in (-pi, pi], rad
	Alt      float64 // km above the WGS 84 ellipsoid
	Sunlit   bool    // outside the Earth's umbra (conical shadow)
}

// GroundTrack is a trajectory seen from the rotating Earth.
type GroundTrack struct {
	Points []GroundPoint
	// InView[k][i] says whether Points[i] is above the threshold of
	// site k as a pass of package visibility is: the larger of the
	// site's minimum elevation and its terrain mask at the azimuth,
	// compared with the apparent elevation when the site applies
	// refraction (topocentric elevation on WGS 84).
	InView [][]bool
	// MeanAlt is the mean of Points[i].Alt, km.
	MeanAlt float64
}

// Ground returns the ground track of tr, whose t = 0 is the epoch ep,
// with UT1-UTC = dut1 (s), the visibility from each site and the
// sunlight: a point is sunlit unless it is in the umbra of the Earth,
// a sphere of radius re (km), in the conical shadow of package shadow
// (the convention of the passes' "sunlit"). The Earth rotation is
// visibility.EarthFrame and the Sun shadow.SunTrack over the span.
func Ground(tr *Trajectory, ep timescale.Epoch, dut1, re float64, sites []visibility.Site) (*GroundTrack, error) {
	if err := timescale.CheckDUT1(dut1); err != nil {
		return nil, err
	}
	if !(re > 0) || math.IsInf(re, 0) {
		return nil, fmt.Errorf("%w: body radius %g km", ErrGeometry, re)
	}
	for _, s := range sites {
		if !(s.MinElevation >= visibility.MinThreshold && s.MinElevation <= visibility.MaxThreshold) {
			return nil, fmt.Errorf("%w: site %q minimum elevation %g rad, want -5..90 deg", ErrGeometry, s.Name, s.MinElevation)
		}
	}
	g := &GroundTrack{Points: make([]GroundPoint, len(tr.T)), InView: make([][]bool, len(sites))}
	for k := range sites {
		g.InView[k] = make([]bool, len(tr.T))
	}
	if len(tr.T) == 0 {
		return g, nil
	}
	// The frame and the Sun are tabulated from the earliest time, so
	// that a backward track is covered too.
	t0, t1 := tr.T[0], tr.T[0]
	for _, t := range tr.T {
		t0, t1 = math.Min(t0, t), math.Max(t1, t)
	}
	start := ep.Add(t0)
	fr := visibility.NewEarthFrame(start, dut1, t1-t0)
	sun := shadow.NewSunTrack(func(t float64) [3]float64 { return sunmoon.Sun(start.Add(t)) }, t1-t0)
	sum := 0.0
	for i, s := range tr.States {
		u := tr.T[i] - t0
		rot := fr.Rotation(u)
		rf, vf := rot.StateToITRF(s.R, s.V)
		lat, lon, alt := geodesy.WGS84.FromECEF(rf)
		lit := shadow.Classify(s.R, sun.At(u), re, shadow.SunRadius) != shadow.Umbra
		g.Points[i] = GroundPoint{T: tr.T[i], Lat: lat, Lon: lon, Alt: alt, Sunlit: lit}
		sum += alt
		for k := range sites {
			g.InView[k][i] = Above(&sites[k], rf, vf)
		}
	}
	g.MeanAlt = sum / float64(len(tr.T))
	return g, nil
}

// Above reports whether the site sees the Earth-fixed (ITRF) state
// rf, vf (km, km/s) above its threshold, as visibility.Find counts a
// pass: the elevation (apparent with the site's refraction) exceeds the
// larger of the minimum elevation and the mask at the azimuth.
func Above(s *visibility.Site, rf, vf [3]float64) bool {
	l := s.Station.Look(rf, vf)
	el := l.El
	if s.Refraction {
		el = visibility.Apparent(el)
	}
	thr := s.MinElevation
	if s.Mask != nil {
		thr = math.Max(thr, s.Mask.At(l.Az))
	}
	return el > thr
}

// LowestThreshold returns the least elevation (rad) at which the site
// can see anything: its minimum elevation, or the lowest point of its
// mask if that is higher. A visibility circle drawn for it bounds every
// pass.
func LowestThreshold(s *visibility.Site) float64 {
	if s.Mask == nil {
		return s.MinElevation
	}
	return math.Max(s.MinElevation, s.Mask.Min())
}

// ThresholdProfile returns the site's threshold at n+1 azimuths from 0
// to 2 pi (the last repeats the first): the larger of the minimum
// elevation and the mask, rad.
func ThresholdProfile(s *visibility.Site, n int) []SkyPoint {
	n = max(n, 4)
	out := make([]SkyPoint, n+1)
	for k := range out {
		az := 2 * math.Pi * float64(k%n) / float64(n)
		thr := s.MinElevation
		if s.Mask != nil {
			thr = math.Max(thr, s.Mask.At(az))
		}
		out[k] = SkyPoint{Az: az, El: thr}
	}
	return out
}

// CentralAngle returns the Earth central angle (rad) between a site and
// the sub-satellite point of a satellite at altitude h (km) above a
// sphere of radius re (km) that the site sees at elevation el (rad):
// lambda = acos(re cos(el) / (re + h)) - el. The satellite is in view
// above el everywhere within lambda of the site. el may be slightly
// negative (a site above its horizon, down to -10 deg).
func CentralAngle(re, h, el float64) (float64, error) {
	if !(re > 0) || math.IsInf(re, 0) || !(h > 0) || math.IsInf(h, 0) || !(el >= -10*math.Pi/180 && el <= math.Pi/2) {
		return 0, fmt.Errorf("%w: central angle needs re > 0, h > 0 and el in [-10, 90] deg; got re = %g km, h = %g km, el = %g rad", ErrGeometry, re, h, el)
	}
	return math.Max(0, math.Acos(re*math.Cos(el)/(re+h))-el), nil
}

// LatLon is a point on a sphere, rad.
type LatLon struct {
	Lat, Lon float64
}

// VisibilityCircle returns n+1 points (the last repeats the first) of
// the small circle of angular radius lambda (rad, in [0, pi]) about
// (lat, lon) on a sphere, starting due north of the centre and turning
// through east. Longitudes are in (-pi, pi]; a circle that encloses a
// pole or crosses the date line is returned as it is, for the caller to
// cut where its longitude wraps. n is at least 4.
func VisibilityCircle(lat, lon, lambda float64, n int) ([]LatLon, error) {
	if !(lat >= -math.Pi/2 && lat <= math.Pi/2) || math.IsNaN(lon) || math.IsInf(lon, 0) || !(lambda >= 0 && lambda <= math.Pi) {
		return nil, fmt.Errorf("%w: circle about lat %g rad, lon %g rad, radius %g rad", ErrGeometry, lat, lon, lambda)
	}
	if n < 4 {
		n = 4
	}
	sl, cl := math.Sincos(lat)
	sd, cd := math.Sincos(lambda)
	out := make([]LatLon, n+1)
	for k := 0; k <= n; k++ {
		az := 2 * math.Pi * float64(k%n) / float64(n)
		sa, ca := math.Sincos(az)
		// Spherical law of cosines for the side and the four-part
		// formula for the longitude difference (destination point).
		s2 := sl*cd + cl*sd*ca
		s2 = math.Max(-1, math.Min(1, s2))
		lat2 := math.Asin(s2)
		dlon := math.Atan2(sa*sd*cl, cd-sl*s2)
		if cl < 1e-12 {
			// At a pole, azimuth az leaves along the meridian lon+pi-az
			// (north pole) or lon+az (south pole).
			dlon = math.Pi - az
			if lat < 0 {
				dlon = az
			}
		}
		out[k] = LatLon{Lat: lat2, Lon: wrapPi(lon + dlon)}
	}
	return out, nil
}

// wrapPi returns x in (-pi, pi].
func wrapPi(x float64) float64 {
	x = math.Remainder(x, 2*math.Pi)
	if x <= -math.Pi {
		x += 2 * math.Pi
	}
	return x
}
