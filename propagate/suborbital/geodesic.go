package suborbital

import (
	"errors"
	"math"

	"centra/bodies/geodesy"
)

// ErrNoConvergence reports that Vincenty's inverse iteration did not
// converge, which happens only for nearly antipodal points.
var ErrNoConvergence = errors.New("suborbital: geodesic iteration did not converge (nearly antipodal points)")

// Inverse returns the length s (km) of the geodesic on the ellipsoid el
// from (lat1, lon1) to (lat2, lon2) (geodetic, rad) and its azimuths at
// both ends (rad from north through east, [0, 2pi)), by the inverse
// method of T. Vincenty, "Direct and inverse solutions of geodesics on
// the ellipsoid with application of nested equations", Survey Review 23
// (176), 1975, 88-93 (the formulae written from memory; the tests check
// them against an independent numerical geodesic), iterated on lambda to
// 1e-12 rad. It is accurate to well below 1 mm on the Earth; coincident
// points give 0.
// For nearly antipodal points, where the iteration does not converge, it
// returns [ErrNoConvergence].
func Inverse(el geodesy.Ellipsoid, lat1, lon1, lat2, lon2 float64) (s, az1, az2 float64, err error) {
	a, f := el.A, el.F
	b := a * (1 - f)
	L := math.Remainder(lon2-lon1, 2*math.Pi)
	u1 := math.Atan((1 - f) * math.Tan(lat1))
	u2 := math.Atan((1 - f) * math.Tan(lat2))
	su1, cu1 := math.Sincos(u1)
	su2, cu2 := math.Sincos(u2)
	lambda := L
	var sinS, cosS, sigma, cos2A, cos2Sm, sinL, cosL float64
	// eval fills the auxiliary-sphere quantities for the current lambda;
	// false for coincident points.
	eval := func() bool {
		sinL, cosL = math.Sincos(lambda)
		t1 := cu2 * sinL
		t2 := cu1*su2 - su1*cu2*cosL
		sinS = math.Hypot(t1, t2)
		if sinS == 0 {
			return false
		}
		cosS = su1*su2 + cu1*cu2*cosL
		sigma = math.Atan2(sinS, cosS)
		sinA := cu1 * cu2 * sinL / sinS
		cos2A = 1 - sinA*sinA
		cos2Sm = 0 // on the equator (cos2A = 0)
		if cos2A != 0 {
			cos2Sm = cosS - 2*su1*su2/cos2A
		}
		return true
	}
	converged := false
	for iter := 0; iter < 200; iter++ {
		if !eval() {
			return 0, 0, 0, nil // coincident (or both at the same pole)
		}
		sinA := cu1 * cu2 * sinL / sinS
		c := f / 16 * cos2A * (4 + f*(4-3*cos2A))
		prev := lambda
		lambda = L + (1-c)*f*sinA*(sigma+c*sinS*(cos2Sm+c*cosS*(-1+2*cos2Sm*cos2Sm)))
		if math.Abs(lambda-prev) < 1e-12 {
			converged = true
			break
		}
		if math.Abs(lambda) > math.Pi {
			break
		}
	}
	// Evaluate once more at the converged lambda, so that sigma belongs to
	// it and not to the previous iterate.
	if !converged || !eval() {
		return 0, 0, 0, ErrNoConvergence
	}
	u2sq := cos2A * (a*a - b*b) / (b * b)
	A := 1 + u2sq/16384*(4096+u2sq*(-768+u2sq*(320-175*u2sq)))
	B := u2sq / 1024 * (256 + u2sq*(-128+u2sq*(74-47*u2sq)))
	dS := B * sinS * (cos2Sm + B/4*(cosS*(-1+2*cos2Sm*cos2Sm)-B/6*cos2Sm*(-3+4*sinS*sinS)*(-3+4*cos2Sm*cos2Sm)))
	s = b * A * (sigma - dS)
	az1 = wrap2Pi(math.Atan2(cu2*sinL, cu1*su2-su1*cu2*cosL))
	az2 = wrap2Pi(math.Atan2(cu1*sinL, -su1*cu2+cu1*su2*cosL))
	return s, az1, az2, nil
}

// greatCircle returns the central angle (rad) between two points on a
// sphere (latitudes taken as spherical) by the haversine-stable atan2
// form, and the initial azimuth.
func greatCircle(lat1, lon1, lat2, lon2 float64) (angle, az float64) {
	s1, c1 := math.Sincos(lat1)
	s2, c2 := math.Sincos(lat2)
	sd, cd := math.Sincos(lon2 - lon1)
	x := c2 * sd
	y := c1*s2 - s1*c2*cd
	angle = math.Atan2(math.Hypot(x, y), s1*s2+c1*c2*cd)
	return angle, wrap2Pi(math.Atan2(x, y))
}

func wrap2Pi(x float64) float64 {
	x = math.Mod(x, 2*math.Pi)
	if x < 0 {
		x += 2 * math.Pi
	}
	if x >= 2*math.Pi {
		x = 0
	}
	return x
}
