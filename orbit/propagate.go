package orbit

import "math"

// stumpff returns the Stumpff functions C(z) = (1 - cos sqrt z)/z and
// S(z) = (sqrt z - sin sqrt z)/z^(3/2), continued analytically to z <= 0
// with cosh and sinh. For |z| < 1 their Taylor series are used.
func stumpff(z float64) (c, s float64) {
	switch {
	case math.Abs(z) < 1:
		// C = sum_k (-z)^k/(2k+2)!, S = sum_k (-z)^k/(2k+3)!, k = 0..10;
		// the first omitted terms are below 1e-24.
		y := -z
		c = 1.0 / 1124000727777607680000   // 1/22!
		c = c*y + 1.0/2432902008176640000  // 1/20!
		c = c*y + 1.0/6402373705728000     // 1/18!
		c = c*y + 1.0/20922789888000       // 1/16!
		c = c*y + 1.0/87178291200          // 1/14!
		c = c*y + 1.0/479001600            // 1/12!
		c = c*y + 1.0/3628800              // 1/10!
		c = c*y + 1.0/40320                // 1/8!
		c = c*y + 1.0/720                  // 1/6!
		c = c*y + 1.0/24                   // 1/4!
		c = c*y + 1.0/2                    // 1/2!
		s = 1.0 / 25852016738884976640000  // 1/23!
		s = s*y + 1.0/51090942171709440000 // 1/21!
		s = s*y + 1.0/121645100408832000   // 1/19!
		s = s*y + 1.0/355687428096000      // 1/17!
		s = s*y + 1.0/1307674368000        // 1/15!
		s = s*y + 1.0/6227020800           // 1/13!
		s = s*y + 1.0/39916800             // 1/11!
		s = s*y + 1.0/362880               // 1/9!
		s = s*y + 1.0/5040                 // 1/7!
		s = s*y + 1.0/120                  // 1/5!
		s = s*y + 1.0/6                    // 1/3!
		return c, s
	case z > 0:
		sz := math.Sqrt(z)
		h := math.Sin(sz / 2)
		return 2 * h * h / z, (sz - math.Sin(sz)) / (z * sz)
	default:
		sz := math.Sqrt(-z)
		h := math.Sinh(sz / 2)
		return 2 * h * h / -z, (math.Sinh(sz) - sz) / (-z * sz)
	}
}

// universal returns the universal functions U0..U3 of the universal
// anomaly chi (km^(1/2)) for alpha = 1/a (1/km):
// U0 = 1 - z C, U1 = chi (1 - z S), U2 = chi^2 C, U3 = chi^3 S, z = alpha chi^2.
func universal(chi, alpha float64) (u0, u1, u2, u3 float64) {
	x2 := chi * chi
	z := alpha * x2
	c, s := stumpff(z)
	return 1 - z*c, chi * (1 - z*s), x2 * c, x2 * chi * s
}

// Propagate advances the state s by dt seconds (forwards or backwards) on
// the two-body conic about a body with gravitational parameter mu
// (km^3/s^2). Any conic is accepted: ellipse, parabola or hyperbola.
//
// The method is the universal-variable formulation of Kepler's equation,
//
//	sqrt(mu) dt = r0 U1(chi) + sigma0 U2(chi) + U3(chi),  sigma0 = r0.v0/sqrt(mu),
//
// with the Stumpff functions, followed by the Lagrange f and g
// coefficients. For an ellipse dt is first reduced modulo the period, so
// dt of many periods costs nothing extra. The universal anomaly chi is
// found by the Laguerre-Conway iteration inside a bracket that always
// contains the root (the left side increases with chi at the rate r >=
// periapsis radius), with bisection whenever a step would leave it, so
// the iteration converges for every eccentricity and every dt.
//
// Errors wrap [ErrInvalidMu], [ErrNonFinite], [ErrZeroPosition],
// [ErrRectilinear] (the f and g formulation needs h != 0) or
// [ErrNoConvergence] (only when the result would overflow).
func Propagate(mu float64, s State, dt float64) (State, error) {
	const op = "Propagate"
	r0, v0, h, err := checkState(op, mu, s)
	if err != nil {
		return State{}, err
	}
	if !finite(dt) {
		return State{}, inputErr(op, ErrNonFinite, fmtVal("dt", dt, "s"))
	}
	if dt == 0 {
		return s, nil
	}
	R0, V0 := s.R, s.V
	sqmu := math.Sqrt(mu)
	sigma0 := dot(R0, V0) / sqmu
	alpha := 2/r0 - v0*v0/mu
	if alpha > 0 {
		// Ellipse: reduce dt into (-T/2, T/2].
		T := 2 * math.Pi / (sqmu * alpha * math.Sqrt(alpha))
		if finite(T) && math.Abs(dt) > T/2 {
			dt = math.Remainder(dt, T)
			if dt == 0 {
				return s, nil
			}
		}
	}
	chi, err := solveUniversal(op, r0, v0, sigma0, alpha, sqmu, norm(h), dot(R0, V0), mu, dt)
	if err != nil {
		return State{}, err
	}
	u0, u1, u2, _ := universal(chi, alpha)
	r := r0*u0 + sigma0*u1 + u2
	f := 1 - u2/r0
	g := (r0*u1 + sigma0*u2) / sqmu
	fd := -sqmu * u1 / (r * r0)
	gd := 1 - u2/r
	var out State
	for k := range 3 {
		out.R[k] = f*R0[k] + g*V0[k]
		out.V[k] = fd*R0[k] + gd*V0[k]
	}
	if !finite3(out.R) || !finite3(out.V) {
		return State{}, inputErr(op, ErrNoConvergence, fmtVal("dt", dt, "s")+": the propagated state overflows")
	}
	return out, nil
}

// solveUniversal solves the universal Kepler equation for chi.
func solveUniversal(op string, r0, v0, sigma0, alpha, sqmu, hm, rv, mu, dt float64) (float64, error) {
	target := sqmu * dt
	// F(chi) is increasing with derivative r(chi) >= rmin, the periapsis
	// radius, so |chi| <= sqmu |dt| / rmin bounds the root. e from
	// e^2 = 1 - p alpha may be too small by the cancellation (near a
	// circle, by up to ~1e-8), so the bound is widened by a factor 2.
	p := hm * hm / mu
	e := math.Sqrt(math.Max(0, 1-p*alpha))
	rmin := math.Min(r0, p/(1+e))
	bound := 2 * sqmu * math.Abs(dt) / rmin
	if alpha > 0 {
		// |dt| <= T/2 means |Delta E| <= pi + 2e, chi = Delta E/sqrt(alpha).
		if b := (math.Pi + 2.5) / math.Sqrt(alpha); b < bound {
			bound = b
		}
	}
	lo, hi := 0.0, bound
	if dt < 0 {
		lo, hi = -bound, 0
	}

	// Starting value (Vallado, Fundamentals of Astrodynamics and
	// Applications, 4th ed., Algorithm 8), clamped into the bracket.
	var chi float64
	switch {
	case alpha*r0 > 1e-6:
		chi = sqmu * dt * alpha
	case alpha*r0 < -1e-6:
		a := 1 / alpha
		sg := math.Copysign(1, dt)
		arg := -2 * mu * alpha * dt / (rv + sg*math.Sqrt(-mu*a)*(1-r0*alpha))
		if arg > 0 {
			chi = sg * math.Sqrt(-a) * math.Log(arg)
		}
	}
	if !(chi > lo && chi < hi) {
		chi = sqmu * dt / r0
		if !(chi > lo && chi < hi) {
			chi = (lo + hi) / 2
		}
	}

	const n = 5 // Laguerre-Conway order
	for range 200 {
		u0, u1, u2, u3 := universal(chi, alpha)
		F := r0*u1 + sigma0*u2 + u3 - target
		if !finite(F) {
			// sinh overflowed: chi is far beyond the root.
			if chi > 0 {
				hi = chi
			} else {
				lo = chi
			}
			chi = lo + (hi-lo)/2
			continue
		}
		if F == 0 {
			return chi, nil
		}
		if F < 0 {
			lo = chi
		} else {
			hi = chi
		}
		Fp := r0*u0 + sigma0*u1 + u2       // = r
		Fpp := sigma0*u0 + (1-alpha*r0)*u1 // = dr/dchi
		disc := math.Abs(float64((n-1)*(n-1))*Fp*Fp - float64(n*(n-1))*F*Fpp)
		den := Fp + math.Copysign(math.Sqrt(disc), Fp)
		delta := n * F / den
		next := chi - delta
		if !(next > lo && next < hi) {
			next = lo + (hi-lo)/2
			delta = chi - next
		}
		if math.Abs(delta) <= 1e-14*math.Abs(next) || next == chi {
			return next, nil
		}
		chi = next
		if hi-lo <= 4e-16*math.Max(math.Abs(lo), math.Abs(hi)) {
			return chi, nil
		}
	}
	return 0, inputErr(op, ErrNoConvergence, fmtVal("dt", dt, "s"))
}

// PropagateElements advances the elements el by dt seconds on the
// unperturbed conic about a body with gravitational parameter mu
// (km^3/s^2): the mean anomaly grows at the mean motion of [GeometryOf]
// and the true anomaly follows from [TrueFromMean]; the other elements
// are unchanged. It is the element-form counterpart of [Propagate]. The
// new Nu is in [0, 2pi) for an ellipse and between the asymptotes for an
// open orbit. Errors are those of [GeometryOf] and [MeanFromTrue].
func PropagateElements(mu float64, el Elements, dt float64) (Elements, error) {
	const op = "PropagateElements"
	if !finite(dt) {
		return Elements{}, inputErr(op, ErrNonFinite, fmtVal("dt", dt, "s"))
	}
	g, err := GeometryOf(mu, el)
	if err != nil {
		return Elements{}, err
	}
	m0, err := MeanFromTrue(el.Nu, el.E)
	if err != nil {
		return Elements{}, err
	}
	m := m0 + g.MeanMotion*dt
	out := el
	nu := TrueFromMean(m, el.E)
	if g.Conic == Ellipse {
		out.Nu = wrap2Pi(nu)
	} else {
		out.Nu = nu
	}
	return out, nil
}
