package geodesy

import (
	"errors"
	"fmt"
	"math"

	"centra/bodies/earthframe"
)

// ErrSite is returned for a site with impossible coordinates.
var ErrSite = errors.New("geodesy: invalid site")

// SiteError says which coordinate of a site is wrong.
type SiteError struct {
	Field string  // "latitude", "longitude" or "altitude"
	Value float64 // the value given (rad or km)
	Why   string  // what it must be
}

func (e *SiteError) Error() string {
	v := e.Value
	unit := "km"
	if e.Field != "altitude" {
		v, unit = e.Value*180/math.Pi, "deg"
	}
	return fmt.Sprintf("geodesy: invalid site %s %.6g %s; %s", e.Field, v, unit, e.Why)
}

// Unwrap returns [ErrSite].
func (e *SiteError) Unwrap() error { return ErrSite }

// MinSiteAlt is the lowest site height accepted, km: well above the
// region near the Earth's centre where geodetic coordinates stop being
// unique, and below any place on or under the Earth's surface.
const MinSiteAlt = -100.0

// Site is a place on or near the Earth: geodetic latitude and longitude
// on WGS 84 (rad) and height above the ellipsoid (km).
type Site struct {
	Lat, Lon, Alt float64
}

// Validate returns an error wrapping [ErrSite] unless the latitude is in
// [-pi/2, pi/2], the longitude finite and the height finite and at least
// [MinSiteAlt].
func (s Site) Validate() error {
	switch {
	case !(s.Lat >= -math.Pi/2 && s.Lat <= math.Pi/2):
		return &SiteError{"latitude", s.Lat, "give a latitude from -90 to 90 deg"}
	case math.IsNaN(s.Lon) || math.IsInf(s.Lon, 0):
		return &SiteError{"longitude", s.Lon, "give a finite longitude, e.g. from -180 to 180 deg"}
	case !(s.Alt >= MinSiteAlt) || math.IsInf(s.Alt, 1):
		return &SiteError{"altitude", s.Alt, fmt.Sprintf("give a finite height above the ellipsoid of at least %g km", MinSiteAlt)}
	}
	return nil
}

// ECEF returns the site's Earth-fixed position, km.
func (s Site) ECEF() [3]float64 { return WGS84.ToECEF(s.Lat, s.Lon, s.Alt) }

// Station is a site with its Earth-fixed position and local frame
// precomputed, for looking at many states.
type Station struct {
	Site Site
	R    [3]float64    // ECEF (ITRF) position, km
	ENU  [3][3]float64 // rows: east, north, up unit vectors in ECEF
}

// NewStation validates s and precomputes its position and ENU frame.
func NewStation(s Site) (Station, error) {
	if err := s.Validate(); err != nil {
		return Station{}, err
	}
	return Station{Site: s, R: s.ECEF(), ENU: ENU(s.Lat, s.Lon)}, nil
}

// Look is what a station sees of an object.
type Look struct {
	Az        float64 // azimuth from north through east, rad, [0, 2pi)
	El        float64 // elevation above the local horizontal plane, rad, [-pi/2, pi/2]
	Range     float64 // km
	RangeRate float64 // km/s, positive when the object recedes
}

// Look returns azimuth, elevation, range and range rate of the object at
// Earth-fixed (ITRF) position r (km) and velocity v (km/s). An object at
// the station itself gives the zero Look. No refraction is applied.
func (st *Station) Look(r, v [3]float64) Look {
	d := [3]float64{r[0] - st.R[0], r[1] - st.R[1], r[2] - st.R[2]}
	rng := math.Sqrt(d[0]*d[0] + d[1]*d[1] + d[2]*d[2])
	if rng == 0 {
		return Look{}
	}
	m := &st.ENU
	e := m[0][0]*d[0] + m[0][1]*d[1]
	n := m[1][0]*d[0] + m[1][1]*d[1] + m[1][2]*d[2]
	u := m[2][0]*d[0] + m[2][1]*d[1] + m[2][2]*d[2]
	az := math.Atan2(e, n)
	if az < 0 {
		az += 2 * math.Pi
		if az >= 2*math.Pi {
			az = 0
		}
	}
	return Look{
		Az:        az,
		El:        math.Atan2(u, math.Hypot(e, n)),
		Range:     rng,
		RangeRate: (d[0]*v[0] + d[1]*v[1] + d[2]*v[2]) / rng,
	}
}

// LookInertial is [Station.Look] for a GCRF position and velocity, with
// rot the Earth rotation at the state's epoch (earthframe.NewRotation;
// build it once per epoch for all stations).
func (st *Station) LookInertial(rot *earthframe.Rotation, r, v [3]float64) Look {
	rf, vf := rot.StateToITRF(r, v)
	return st.Look(rf, vf)
}
