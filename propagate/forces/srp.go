package forces

import (
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
)

// SolarPressure1AU is the solar radiation pressure on a perfectly
// absorbing surface facing the Sun at 1 AU, 4.56e-6 N/m^2: the solar flux
// of about 1367 W/m^2 divided by the speed of light (Montenbruck and
// Gill, Satellite Orbits, 2000, sec. 3.4.1, eq. 3.69; from memory, and
// recomputed from the flux in the tests).
const SolarPressure1AU = 4.56e-6

// AU is the astronomical unit in km (IAU 2012 Resolution B2, exact).
const AU = 149597870.7

// SunRadius is the solar radius in km used by the shadow function
// (IAU 2015 Resolution B3 nominal solar radius, 6.957e8 m).
const SunRadius = 695700.0

// ShadowFunction returns the fraction of the solar disc visible from r
// (km, relative to the occulting body's centre) with the Sun at sun (km,
// same origin), for a spherical occulting body of radius bodyRadius and a
// Sun of radius sunRadius (km): 1 in sunlight, 0 in the umbra, between in
// the penumbra, and 1 - (b/a)^2 in an annular eclipse. It is the conical
// model of Montenbruck and Gill, Satellite Orbits, 2000, sec. 3.4.2,
// eqs. 3.85-3.89: with the apparent radii a = asin(R_sun/|sun - r|) of the
// Sun and b = asin(R_body/|r|) of the body and their apparent separation c,
// the occulted area of the solar disc is that of two overlapping circles,
//
//	A = a^2 acos(x/a) + b^2 acos((c-x)/b) - c y,  x = (c^2 + a^2 - b^2)/(2c),  y = sqrt(a^2 - x^2),
//
// and the visible fraction is 1 - A/(pi a^2). The Sun's limb darkening and
// the body's atmosphere are ignored. A position inside the body returns 0.
func ShadowFunction(r, sun [3]float64, bodyRadius, sunRadius float64) float64 {
	rn := math.Sqrt(r[0]*r[0] + r[1]*r[1] + r[2]*r[2])
	if rn <= bodyRadius {
		return 0
	}
	d := [3]float64{sun[0] - r[0], sun[1] - r[1], sun[2] - r[2]}
	dn := math.Sqrt(d[0]*d[0] + d[1]*d[1] + d[2]*d[2])
	if dn <= sunRadius {
		return 1
	}
	a := math.Asin(sunRadius / dn)
	b := math.Asin(bodyRadius / rn)
	cosC := -(r[0]*d[0] + r[1]*d[1] + r[2]*d[2]) / (rn * dn)
	c := math.Acos(clamp1(cosC))
	switch {
	case c >= a+b:
		return 1
	case c <= b-a:
		return 0
	case c <= a-b:
		return 1 - (b*b)/(a*a)
	}
	x := (c*c + a*a - b*b) / (2 * c)
	y := math.Sqrt(math.Max(a*a-x*x, 0))
	area := a*a*math.Acos(clamp1(x/a)) + b*b*math.Acos(clamp1((c-x)/b)) - c*y
	nu := 1 - area/(math.Pi*a*a)
	return math.Min(math.Max(nu, 0), 1)
}

func clamp1(x float64) float64 { return math.Min(math.Max(x, -1), 1) }

// RadiationPressureConfig configures [NewRadiationPressure].
type RadiationPressureConfig struct {
	Cr     float64 // radiation pressure coefficient, 1 (absorbing) to 2 (mirror); required
	AreaM2 float64 // area facing the Sun, m^2; required
	MassKg float64 // mass, kg; required
	// Sun returns the Sun's position (km, relative to the central body)
	// at t s from the epoch, for example [Ephemeris.Position]; required.
	Sun func(t float64) [3]float64
	// ShadowRadius is the radius in km of the central body's shadow
	// (spherical); zero means no shadow.
	ShadowRadius float64
}

// RadiationPressure is the cannonball solar radiation pressure,
//
//	a = nu P0 Cr (A/m) (AU/|d|)^2 d/|d|,   d = r - r_sun,
//
// pointing away from the Sun, with P0 = [SolarPressure1AU], the shadow
// function nu of [ShadowFunction] and the inverse-square fall of the flux
// with the distance |d| from the Sun. P0 (A/m) is in m/s^2; the
// acceleration in km/s^2 carries a factor 1/1000.
type RadiationPressure struct {
	k      float64 // P0 Cr A/m AU^2 / 1000, km^3/s^2
	cr     float64
	am     float64
	sun    func(float64) [3]float64
	shadow float64
}

// NewRadiationPressure validates c and returns the force.
func NewRadiationPressure(c RadiationPressureConfig) (*RadiationPressure, error) {
	switch {
	case !(c.Cr >= 1 && c.Cr <= 2):
		return nil, fmt.Errorf("%w: radiation pressure coefficient %g, want 1 to 2", ErrConfig, c.Cr)
	case !(c.AreaM2 > 0) || math.IsInf(c.AreaM2, 0):
		return nil, fmt.Errorf("%w: radiation pressure area %g m^2, want positive", ErrConfig, c.AreaM2)
	case !(c.MassKg > 0) || math.IsInf(c.MassKg, 0):
		return nil, fmt.Errorf("%w: mass %g kg, want positive", ErrConfig, c.MassKg)
	case c.Sun == nil:
		return nil, fmt.Errorf("%w: radiation pressure needs the Sun's position", ErrConfig)
	case !(c.ShadowRadius >= 0) || math.IsInf(c.ShadowRadius, 0):
		return nil, fmt.Errorf("%w: shadow radius %g km", ErrConfig, c.ShadowRadius)
	}
	am := c.AreaM2 / c.MassKg
	if am > 100 {
		return nil, fmt.Errorf("%w: area-to-mass ratio %g m^2/kg is above 100 m^2/kg", ErrConfig, am)
	}
	return &RadiationPressure{k: SolarPressure1AU * c.Cr * am * AU * AU / 1000, cr: c.Cr, am: am, sun: c.Sun, shadow: c.ShadowRadius}, nil
}

// AreaToMass returns A/m in m^2/kg.
func (p *RadiationPressure) AreaToMass() float64 { return p.am }

// Cr returns the radiation pressure coefficient.
func (p *RadiationPressure) Cr() float64 { return p.cr }

// Acceleration returns the acceleration in km/s^2 at time t, position r.
func (p *RadiationPressure) Acceleration(t float64, r [3]float64) [3]float64 {
	s := p.sun(t)
	nu := 1.0
	if p.shadow > 0 {
		nu = ShadowFunction(r, s, p.shadow, SunRadius)
		if nu == 0 {
			return [3]float64{}
		}
	}
	d := [3]float64{r[0] - s[0], r[1] - s[1], r[2] - s[2]}
	d2 := d[0]*d[0] + d[1]*d[1] + d[2]*d[2]
	k := nu * p.k / (d2 * math.Sqrt(d2))
	return [3]float64{k * d[0], k * d[1], k * d[2]}
}

// Perturbation returns the radiation pressure as a model perturbation.
func (p *RadiationPressure) Perturbation() propagate.Perturbation {
	return func(t float64, s orbit.State) ([3]float64, error) { return p.Acceleration(t, s.R), nil }
}
