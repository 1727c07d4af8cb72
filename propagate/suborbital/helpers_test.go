package suborbital_test

import (
	"math"

	"centra/bodies"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/propagate"
)

const deg = math.Pi / 180

// earth returns the catalogue's Earth (WGS 84 GM, ellipsoid and rotation
// rate, EGM2008 J2..J6).
func earth() *bodies.Body {
	b, err := bodies.Lookup("earth")
	if err != nil {
		panic(err)
	}
	return b
}

// uniformGravity is a test field: in the frame turning with the Earth at
// omega rad/s it is the constant acceleration g (km/s^2) along minus the
// ellipsoid normal at (lat, lon), the vertical of the formulas of
// uniform-gravity mechanics. It is built as a propagate.Model whose point
// mass mu (kept so that the integrator's event search interval and the
// orbit checks of the package see an Earth-like arc) is cancelled exactly
// by its Perturbation, which adds the uniform field rotated into the
// inertial frame of the package, g_I(t) = R3(omega t)^T g_f, and
// omega x (omega x r) = -omega^2 (x, y, 0), which cancels the
// centrifugal acceleration of the rotating frame (its Coriolis term is
// left, as in the formulas). With omega = 0 it is the flat-Earth field.
func uniformGravity(mu, g, omega, lat, lon float64) propagate.Model {
	up := geodesy.ENU(lat, lon)[2]
	gf := [3]float64{-g * up[0], -g * up[1], -g * up[2]}
	return propagate.Model{Mu: mu, Perturbation: func(t float64, s orbit.State) ([3]float64, error) {
		x, y, z := s.R[0], s.R[1], s.R[2]
		r2 := x*x + y*y + z*z
		k := mu / (r2 * math.Sqrt(r2))
		sn, c := math.Sincos(omega * t)
		gi := [3]float64{c*gf[0] - sn*gf[1], sn*gf[0] + c*gf[1], gf[2]}
		w2 := omega * omega
		return [3]float64{k*x + gi[0] - w2*x, k*y + gi[1] - w2*y, k*z + gi[2]}, nil
	}}
}
