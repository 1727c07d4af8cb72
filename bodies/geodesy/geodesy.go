package geodesy

import (
	"math"
)

// Ellipsoid is a reference ellipsoid of revolution. Build one with
// [NewEllipsoid]; the derived fields are filled there.
type Ellipsoid struct {
	A  float64 // equatorial radius, km
	F  float64 // flattening (a-b)/a
	B  float64 // polar radius a(1-f), km
	E2 float64 // first eccentricity squared f(2-f)

	e4, invA2, oneMinusE2 float64
}

// NewEllipsoid returns the ellipsoid with equatorial radius a (km) and
// flattening f (0 <= f < 1).
func NewEllipsoid(a, f float64) Ellipsoid {
	e2 := f * (2 - f)
	return Ellipsoid{A: a, F: f, B: a * (1 - f), E2: e2, e4: e2 * e2, invA2: 1 / (a * a), oneMinusE2: 1 - e2}
}

// WGS 84 defining parameters (NIMA TR8350.2, 3rd ed. amendment 1, 2000,
// Table 3.1).
const (
	WGS84A    = 6378.137      // semi-major axis, km (exact, defining)
	WGS84InvF = 298.257223563 // reciprocal flattening (exact, defining)
)

// WGS84 is the WGS 84 ellipsoid.
var WGS84 = NewEllipsoid(WGS84A, 1/WGS84InvF)

// ToECEF returns the Earth-fixed Cartesian position (km) of the point at
// geodetic latitude lat, longitude lon (rad) and height h (km) above the
// ellipsoid: ((N+h) cos lat cos lon, (N+h) cos lat sin lon,
// (N(1-e^2)+h) sin lat) with N = a / sqrt(1 - e^2 sin^2 lat).
func (el *Ellipsoid) ToECEF(lat, lon, h float64) [3]float64 {
	sp, cp := math.Sincos(lat)
	sl, cl := math.Sincos(lon)
	n := el.A / math.Sqrt(1-el.E2*sp*sp)
	return [3]float64{(n + h) * cp * cl, (n + h) * cp * sl, (n*el.oneMinusE2 + h) * sp}
}

// FromECEF returns the geodetic latitude, longitude (rad) and height (km)
// of the Earth-fixed position r (km), by Vermeille's (2011) closed form.
// Every finite r gives finite results (the centre gives lat = pi/2,
// h = -b).
func (el *Ellipsoid) FromECEF(r [3]float64) (lat, lon, h float64) {
	x, y, z := r[0], r[1], r[2]
	e2, e4 := el.E2, el.e4
	rho2 := x*x + y*y
	rho := math.Sqrt(rho2)
	p := rho2 * el.invA2
	q := el.oneMinusE2 * z * z * el.invA2
	rr := (p + q - e4) / 6
	lon = math.Atan2(y, x)
	border := 8*rr*rr*rr + e4*p*q
	if border > 0 || q != 0 {
		var u float64
		if border > 0 { // outside the evolute
			rad1 := math.Sqrt(border)
			rad2 := math.Sqrt(e4 * p * q)
			if border > 10*e2 {
				rad3 := math.Cbrt((rad1 + rad2) * (rad1 + rad2))
				u = rr + 0.5*rad3 + 2*rr*rr/rad3
			} else {
				u = rr + 0.5*math.Cbrt((rad1+rad2)*(rad1+rad2)) + 0.5*math.Cbrt((rad1-rad2)*(rad1-rad2))
			}
		} else { // inside the evolute, off the equatorial plane
			rad1 := math.Sqrt(-border)
			rad2 := math.Sqrt(-8 * rr * rr * rr)
			rad3 := math.Sqrt(e4 * p * q)
			a := math.Atan2(rad3, rad1+rad2) * 2 / 3
			u = -4 * rr * math.Sin(a) * math.Cos(math.Pi/6+a)
		}
		v := math.Sqrt(u*u + e4*q)
		w := e2 * (u + v - q) / (2 * v)
		k := (u + v) / (math.Sqrt(w*w+u+v) + w)
		d := k * rho / (k + e2)
		s := math.Sqrt(d*d + z*z)
		h = (k + e2 - 1) * s / k
		lat = 2 * math.Atan2(z, s+d)
		return lat, lon, h
	}
	// On the equatorial plane inside the evolute: the normals through the
	// point come from latitudes +-phi with cos^2 phi =
	// p(1-e^2) / (e^2 (e^2 - p)); h = -N(1-e^2) (negative).
	c2 := p * el.oneMinusE2 / (e2 * (e2 - p))
	lat = math.Atan2(math.Sqrt(1-c2), math.Sqrt(c2))
	h = -el.A * math.Sqrt(el.oneMinusE2) * math.Sqrt(e2-p) / math.Sqrt(e2)
	return lat, lon, h
}

// GeocentricLatitude returns the geocentric latitude (rad) of the point
// at geodetic latitude lat and height h (km): atan2(z, sqrt(x^2+y^2)).
// On the surface it is atan((1-e^2) tan lat).
func (el *Ellipsoid) GeocentricLatitude(lat, h float64) float64 {
	sp, cp := math.Sincos(lat)
	n := el.A / math.Sqrt(1-el.E2*sp*sp)
	return math.Atan2((n*el.oneMinusE2+h)*sp, (n+h)*cp)
}

// ENU returns the rotation from Earth-fixed coordinates to the local
// east-north-up frame at geodetic latitude lat and longitude lon: its
// rows are the unit vectors east, north and up in ECEF coordinates.
func ENU(lat, lon float64) [3][3]float64 {
	sp, cp := math.Sincos(lat)
	sl, cl := math.Sincos(lon)
	return [3][3]float64{
		{-sl, cl, 0},
		{-sp * cl, -sp * sl, cp},
		{cp * cl, cp * sl, sp},
	}
}
