package gravity

import (
	"errors"
	"fmt"
	"math"
)

// MaxDegree is the highest zonal degree supported.
const MaxDegree = 6

var (
	// ErrMu reports a gravitational parameter that is not finite and positive.
	ErrMu = errors.New("gravity: gravitational parameter must be finite and positive")
	// ErrRadius reports a reference radius that is not finite and positive.
	ErrRadius = errors.New("gravity: reference radius must be finite and positive")
	// ErrDegree reports a degree outside 0..MaxDegree or beyond the coefficients given.
	ErrDegree = errors.New("gravity: zonal degree out of range")
	// ErrCoefficient reports a non-finite zonal coefficient.
	ErrCoefficient = errors.New("gravity: zonal coefficient not finite")
)

// Zonal is the gravity field of an axially symmetric body: a point mass
// plus the zonal harmonics J2..J_Degree about the inertial z axis. Build it
// with [New]; the zero value is not usable.
type Zonal struct {
	Mu     float64                // gravitational parameter, km^3/s^2
	Re     float64                // reference (equatorial) radius of the coefficients, km
	J      [MaxDegree + 1]float64 // J[n] = J_n, unnormalized and dimensionless; J[0], J[1] are zero
	Degree int                    // highest degree in use: 0 (point mass) or 2..MaxDegree
}

// New returns the field of gravitational parameter mu (km^3/s^2) with
// zonal coefficients j (j[n] = J_n, unnormalized; j[0] and j[1] are
// ignored) up to degree (0 or 1 mean a point mass). Coefficients above
// degree are ignored; re is needed only when degree >= 2.
func New(mu, re float64, j []float64, degree int) (Zonal, error) {
	if !(mu > 0) || math.IsInf(mu, 0) {
		return Zonal{}, fmt.Errorf("%w: mu = %g km^3/s^2", ErrMu, mu)
	}
	if degree < 0 || degree > MaxDegree {
		return Zonal{}, fmt.Errorf("%w: degree %d, want 0..%d", ErrDegree, degree, MaxDegree)
	}
	z := Zonal{Mu: mu, Re: re}
	if degree < 2 {
		return z, nil
	}
	if !(re > 0) || math.IsInf(re, 0) {
		return Zonal{}, fmt.Errorf("%w: re = %g km", ErrRadius, re)
	}
	if len(j) <= degree {
		return Zonal{}, fmt.Errorf("%w: degree %d needs J[0..%d], have %d coefficients", ErrDegree, degree, degree, len(j))
	}
	for n := 2; n <= degree; n++ {
		if math.IsNaN(j[n]) || math.IsInf(j[n], 0) {
			return Zonal{}, fmt.Errorf("%w: J%d = %g", ErrCoefficient, n, j[n])
		}
		z.J[n] = j[n]
	}
	z.Degree = degree
	return z, nil
}

// Acceleration returns the gravitational acceleration (km/s^2) at position
// r (km). It is the gradient of -[Zonal.Potential]:
//
//	a = -mu/r^2 { u [1 - sum J_n (Re/r)^n P'_{n+1}(s)] + z^ sum J_n (Re/r)^n P'_n(s) }
//
// with u = r/|r|, s = z/|r| and P_n the Legendre polynomials. The form has
// no singularity at the poles. At r = 0 the result is not finite.
func (f *Zonal) Acceleration(r [3]float64) [3]float64 {
	x, y, z := r[0], r[1], r[2]
	r2 := x*x + y*y + z*z
	switch {
	case f.Degree < 2:
		k := -f.Mu / (r2 * math.Sqrt(r2))
		return [3]float64{k * x, k * y, k * z}
	case f.Degree == 2:
		// P'_2 = 3s, P'_3 = (15 s^2 - 3)/2
		rn := math.Sqrt(r2)
		inv2 := 1 / r2
		k := -f.Mu * inv2 / rn
		s2 := z * z * inv2
		q := f.J[2] * f.Re * f.Re * inv2
		kr := k * (1 - 1.5*q*(5*s2-1))
		kz := k * (1 - 1.5*q*(5*s2-3))
		return [3]float64{kr * x, kr * y, kz * z}
	}
	rn := math.Sqrt(r2)
	inv := 1 / rn
	s := z * inv
	rho := f.Re * inv
	// Legendre P_n and derivatives P'_n by the Bonnet recurrence and
	// P'_{n+1} = s P'_n + (n+1) P_n.
	pPrev, p := 1.0, s // P_{n-1}, P_n at n = 1
	dpn := 1.0         // P'_1
	var sumU, sumZ float64
	rhon := rho
	for n := 2; n <= f.Degree; n++ {
		pn := (float64(2*n-1)*s*p - float64(n-1)*pPrev) / float64(n)
		dpn = s*dpn + float64(n)*p // P'_n = s P'_{n-1} + n P_{n-1}
		pPrev, p = p, pn
		rhon *= rho
		dnext := s*dpn + float64(n+1)*pn // P'_{n+1}
		jr := f.J[n] * rhon
		sumU += jr * dnext
		sumZ += jr * dpn
	}
	k := -f.Mu * inv * inv
	ku := k * (1 - sumU) * inv
	return [3]float64{ku * x, ku * y, ku*z + k*sumZ}
}

// Potential returns the gravitational potential energy per unit mass
// (km^2/s^2) at r (km),
//
//	U = -mu/r [1 - sum_{n=2..Degree} J_n (Re/r)^n P_n(z/r)],
//
// so that the acceleration is -grad U and the specific energy is
// v^2/2 + U.
func (f *Zonal) Potential(r [3]float64) float64 {
	rn := math.Sqrt(r[0]*r[0] + r[1]*r[1] + r[2]*r[2])
	if f.Degree < 2 {
		return -f.Mu / rn
	}
	s := r[2] / rn
	rho := f.Re / rn
	pPrev, p := 1.0, s
	rhon := rho
	var sum float64
	for n := 2; n <= f.Degree; n++ {
		pn := (float64(2*n-1)*s*p - float64(n-1)*pPrev) / float64(n)
		pPrev, p = p, pn
		rhon *= rho
		sum += f.J[n] * rhon * pn
	}
	return -f.Mu / rn * (1 - sum)
}
