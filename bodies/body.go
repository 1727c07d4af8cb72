package bodies

import (
	"fmt"
	"math"
)

// Source names the published origin of one constant, for example
// "WGS 84, NIMA TR8350.2 3rd ed. (2000) Table 3.1". It is shown to users
// by `centra bodies NAME`.
type Source string

// MaxZonalDegree is the highest zonal degree n for which a J_n can be
// given, in the built-in catalogue and in a bodies file.
const MaxZonalDegree = 20

// Body is a central body: the constants the two-body mathematics, the
// perturbation models and the geodesy need. Lengths are in km, GM in
// km^3/s^2, rates in rad/s; zonal coefficients are unnormalized and
// dimensionless.
//
// A Body obtained from [Lookup] or [Catalogue.Lookup] is a copy: changing
// it (or its J slice) does not change the catalogue.
type Body struct {
	// Name is the catalogue name in lower case, for example "earth".
	Name string
	// Description is one line for people, for example
	// "Earth (WGS 84 ellipsoid, EGM2008 zonal coefficients)". It may be
	// empty.
	Description string
	// GM is the gravitational parameter in km^3/s^2.
	GM float64
	// EquatorialRadius is the reference (equatorial) radius in km; it is
	// also the reference radius of the zonal coefficients J.
	EquatorialRadius float64
	// MeanRadius is the mean radius in km, or 0 when not given.
	MeanRadius float64
	// Flattening is (a-b)/a of the reference ellipsoid; 0 for a sphere.
	Flattening float64
	// J holds the unnormalized zonal coefficients: J[n] is J_n for
	// n >= 2; J[0] and J[1] are always 0. A nil or short slice means the
	// missing coefficients are not published here (treated as 0).
	J []float64
	// RotationRate is the sidereal rotation rate in rad/s, positive
	// for prograde rotation about the body's north pole and negative for
	// retrograde rotation (Venus, Uranus).
	RotationRate float64

	// Sources of each number above, shown by `centra bodies NAME`.
	GMSource, RadiusSource, FlatteningSource, JSource, RotationSource Source
	// MeanRadiusSource is the source of MeanRadius ("" when it is 0).
	MeanRadiusSource Source
}

// PolarRadius returns the polar radius in km, a(1-f).
func (b *Body) PolarRadius() float64 { return b.EquatorialRadius * (1 - b.Flattening) }

// Jn returns the zonal coefficient J_n, or 0 when it is not known.
func (b *Body) Jn(n int) float64 {
	if n < 2 || n >= len(b.J) {
		return 0
	}
	return b.J[n]
}

// Degree returns the highest n with a known J_n, or 0 when none is known.
func (b *Body) Degree() int {
	for n := len(b.J) - 1; n >= 2; n-- {
		if b.J[n] != 0 {
			return n
		}
	}
	return 0
}

// Clone returns a deep copy of b (the J slice is copied).
func (b *Body) Clone() *Body {
	c := *b
	if b.J != nil {
		c.J = append([]float64(nil), b.J...)
	}
	return &c
}

// Validate reports whether b is physical: a valid name, positive finite
// GM and equatorial radius, a mean radius that is 0 or positive and
// finite, flattening in [0, 1), a finite rotation rate, J[0] = J[1] = 0,
// at most [MaxZonalDegree] zonal degrees and every |J_n| <= 1. The error
// is a *[BodyError] wrapping [ErrInvalidBody].
func (b *Body) Validate() error {
	bad := func(field string, v float64, why string) error {
		return &BodyError{Body: b.Name, Field: field, Value: v, Reason: why, Err: ErrInvalidBody}
	}
	if !validName(b.Name) {
		return &BodyError{Body: b.Name, Field: "name", Reason: nameRule, Err: ErrInvalidBody}
	}
	if !finite(b.GM) || b.GM <= 0 {
		return bad("gm_km3_s2", b.GM, "GM must be a finite number greater than 0 km^3/s^2")
	}
	if !finite(b.EquatorialRadius) || b.EquatorialRadius <= 0 {
		return bad("equatorial_radius_km", b.EquatorialRadius, "the equatorial radius must be a finite number greater than 0 km")
	}
	if !finite(b.MeanRadius) || b.MeanRadius < 0 {
		return bad("mean_radius_km", b.MeanRadius, "the mean radius must be 0 (not given) or a finite number greater than 0 km")
	}
	if !finite(b.Flattening) || b.Flattening < 0 || b.Flattening >= 1 {
		return bad("flattening", b.Flattening, "the flattening (a-b)/a must lie in [0, 1)")
	}
	if !finite(b.RotationRate) {
		return bad("rotation_rate_rad_s", b.RotationRate, "the rotation rate must be a finite number of rad/s")
	}
	if len(b.J) > MaxZonalDegree+1 {
		return bad("j", float64(len(b.J)-1), fmt.Sprintf("zonal coefficients are supported up to degree %d", MaxZonalDegree))
	}
	for n, j := range b.J {
		switch {
		case n < 2 && j != 0:
			return bad(fmt.Sprintf("j%d", n), j, "J0 and J1 must be 0 (J1 vanishes in a centre-of-mass frame)")
		case !finite(j) || math.Abs(j) > 1:
			return bad(fmt.Sprintf("j%d", n), j, "zonal coefficients are unnormalized, finite and |J_n| <= 1")
		}
	}
	return nil
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
