package lagrange

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/num/hyperdual"
)

// MaxZonalDegree is the highest zonal degree of [ZonalCartesian].
const MaxZonalDegree = 6

// ErrParameter reports a physical parameter that is not finite and
// positive, or zonal coefficients that do not fit the degree.
var ErrParameter = errors.New("lagrange: invalid parameter")

// Potential is a central potential energy per unit mass U(r) (km^2/s^2 for
// r in km), written over hyperdual numbers.
type Potential func(r hyperdual.Number) hyperdual.Number

// Hyperdual shorthands used by the built-in Lagrangians.
func num(x float64) hyperdual.Number { return hyperdual.Number{Real: x} }

func add(x, y hyperdual.Number) hyperdual.Number { return hyperdual.Add(x, y) }
func sub(x, y hyperdual.Number) hyperdual.Number { return hyperdual.Sub(x, y) }
func mul(x, y hyperdual.Number) hyperdual.Number { return hyperdual.Mul(x, y) }
func scale(f float64, x hyperdual.Number) hyperdual.Number {
	return hyperdual.Scale(f, x)
}

// Sqrt is the hyperdual square root (exact first and second derivatives),
// cheaper than hyperdual.Sqrt; it is NaN for x.Real <= 0.
func Sqrt(x hyperdual.Number) hyperdual.Number {
	if !(x.Real > 0) {
		nan := math.NaN()
		return hyperdual.Number{Real: nan, E1mag: nan, E2mag: nan, E1E2mag: nan}
	}
	r := math.Sqrt(x.Real)
	d1 := 0.5 / r            // d sqrt/dx
	d2 := -0.5 * d1 / x.Real // d2 sqrt/dx2 = -1/(4 x^{3/2})
	return hyperdual.Number{
		Real:    r,
		E1mag:   d1 * x.E1mag,
		E2mag:   d1 * x.E2mag,
		E1E2mag: d1*x.E1E2mag + d2*x.E1mag*x.E2mag,
	}
}

// Kinetic energy per unit mass in planar polar coordinates,
// T = (rdot^2 + r^2 thetadot^2)/2.
func polarKinetic(q, qd []hyperdual.Number) hyperdual.Number {
	r, rd, thd := q[0], qd[0], qd[1]
	rth := mul(r, thd)
	return scale(0.5, add(mul(rd, rd), mul(rth, rth)))
}

// PointMassPolar returns the Lagrangian per unit mass of a point mass in
// the inverse-square field of gravitational parameter mu (km^3/s^2), in
// planar polar coordinates q = (r, theta) (km, rad) of the orbit plane:
//
//	L = (rdot^2 + r^2 thetadot^2)/2 + mu/r.
//
// Use it with [New](2, ...), and [ToPolar] / [Plane.State] to pass between
// an inertial state and the plane.
func PointMassPolar(mu float64) (Func, error) {
	if !(mu > 0) || math.IsInf(mu, 0) {
		return nil, fmt.Errorf("%w: mu = %g km^3/s^2", ErrParameter, mu)
	}
	return func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		return add(polarKinetic(q, qd), scale(mu, hyperdual.Inv(q[0])))
	}, nil
}

// CentralPolar returns the Lagrangian per unit mass of motion in an
// arbitrary central potential U(r), in planar polar coordinates
// q = (r, theta):
//
//	L = (rdot^2 + r^2 thetadot^2)/2 - U(r).
func CentralPolar(u Potential) (Func, error) {
	if u == nil {
		return nil, fmt.Errorf("%w: nil potential", ErrParameter)
	}
	return func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		return sub(polarKinetic(q, qd), u(q[0]))
	}, nil
}

// ZonalCartesian returns the Lagrangian per unit mass of motion in the
// field of an axially symmetric body, in Cartesian inertial coordinates
// q = (x, y, z) (km), qdot in km/s:
//
//	L = |qdot|^2/2 - U(r, sin phi),
//	U = -mu/r [1 - sum_{n=2..degree} J_n (Re/r)^n P_n(sin phi)],
//
// with r = |q|, sin phi = z/r (phi the geocentric latitude) and P_n the
// Legendre polynomials (Bonnet recurrence). The polar form of U is evaluated
// from the Cartesian coordinates, so poles and equator are regular points.
// j[n] = J_n (unnormalized); degree 0 or 1 gives a point mass; re (km) is
// needed only for degree >= 2.
func ZonalCartesian(mu, re float64, j []float64, degree int) (Func, error) {
	if !(mu > 0) || math.IsInf(mu, 0) {
		return nil, fmt.Errorf("%w: mu = %g km^3/s^2", ErrParameter, mu)
	}
	if degree < 0 || degree > MaxZonalDegree {
		return nil, fmt.Errorf("%w: degree %d, want 0..%d", ErrParameter, degree, MaxZonalDegree)
	}
	var jj [MaxZonalDegree + 1]float64
	if degree >= 2 {
		if !(re > 0) || math.IsInf(re, 0) {
			return nil, fmt.Errorf("%w: reference radius %g km", ErrParameter, re)
		}
		if len(j) <= degree {
			return nil, fmt.Errorf("%w: degree %d needs %d coefficients, have %d", ErrParameter, degree, degree+1, len(j))
		}
		for n := 2; n <= degree; n++ {
			if math.IsNaN(j[n]) || math.IsInf(j[n], 0) {
				return nil, fmt.Errorf("%w: J%d = %g", ErrParameter, n, j[n])
			}
			jj[n] = j[n]
		}
	}
	return func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		t := scale(0.5, add(add(mul(qd[0], qd[0]), mul(qd[1], qd[1])), mul(qd[2], qd[2])))
		r := Sqrt(add(add(mul(q[0], q[0]), mul(q[1], q[1])), mul(q[2], q[2])))
		inv := hyperdual.Inv(r)
		bracket := num(1)
		if degree >= 2 {
			s := mul(q[2], inv)
			rho := scale(re, inv)
			pPrev, p := num(1), s
			rhon := rho
			for n := 2; n <= degree; n++ {
				pn := scale(1/float64(n), sub(scale(float64(2*n-1), mul(s, p)), scale(float64(n-1), pPrev)))
				pPrev, p = p, pn
				rhon = mul(rhon, rho)
				bracket = sub(bracket, scale(jj[n], mul(rhon, pn)))
			}
		}
		// L = T - U = T + mu/r [1 - sum ...]
		return add(t, scale(mu, mul(inv, bracket)))
	}, nil
}
