package track

import (
	"centra/bodies/geodesy"
	"centra/propagate/suborbital"
)

// Impacts is a dispersion run laid out for a picture: every case's
// impact point in the east-north tangent plane at the mean impact point
// (as suborbital.DispersionResult gives them, km), their sample mean (the
// centre of the covariance ellipses) and the nominal impact point.
type Impacts struct {
	East, North               []float64 // km
	CentreEast, CentreNorth   float64   // km: the mean of East and North
	NominalEast, NominalNorth float64   // km: the undispersed arc's impact point
}

// LayOutImpacts returns the impacts of res and the nominal impact point
// (lat, lon in rad on the surface at impactAlt km above ellipsoid el),
// projected like the cases: the ECEF difference from the mean impact
// point onto its east and north unit vectors (geodesy.ENU).
func LayOutImpacts(res *suborbital.DispersionResult, el geodesy.Ellipsoid, impactAlt, lat, lon float64) Impacts {
	n := len(res.Cases)
	out := Impacts{East: make([]float64, n), North: make([]float64, n)}
	for i, c := range res.Cases {
		out.East[i], out.North[i] = c.East, c.North
		out.CentreEast += c.East
		out.CentreNorth += c.North
	}
	if n > 0 {
		out.CentreEast /= float64(n)
		out.CentreNorth /= float64(n)
	}
	r0 := el.ToECEF(res.MeanLat, res.MeanLon, impactAlt)
	r := el.ToECEF(lat, lon, impactAlt)
	enu := geodesy.ENU(res.MeanLat, res.MeanLon)
	d := [3]float64{r[0] - r0[0], r[1] - r0[1], r[2] - r0[2]}
	out.NominalEast = enu[0][0]*d[0] + enu[0][1]*d[1] + enu[0][2]*d[2]
	out.NominalNorth = enu[1][0]*d[0] + enu[1][1]*d[1] + enu[1][2]*d[2]
	return out
}
