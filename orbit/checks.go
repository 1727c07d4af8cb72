package orbit

import "math"

// CheckTolerance is the relative tolerance of every check in
// [KeplerChecks]. Each check compares two double-precision computations
// that share no intermediate result, so for a well-conditioned orbit they
// agree to about 1e-14; the loss grows like 1/|1-e| near the parabola,
// where a = p/(1-e^2) and -mu/(2 eps) are both computed through a
// cancellation. 1e-9 leaves room for that loss down to |1-e| ~ 1e-4 while
// still exposing any error in a formula, a unit or a frame, which shows
// up at the 1e-3 level or above: 1e5 random orbits of every kind pass for
// |1-e| >= 1e-4, and the worst seen below that was 3.4e-9 (vis-viva) at
// |1-e| = 6e-5. Nearly parabolic orbits (|1-e| < 1e-4) may fail a check
// because the state itself does not fix a to 1e-9; the orbit command warns
// about them.
const CheckTolerance = 1e-9

// KeplerChecks checks the state s about a body with gravitational
// parameter mu (km^3/s^2) against Kepler's three laws and the
// conservation laws. Each [Check] compares a value predicted by a law
// with the same quantity reached by an independent path:
//
//   - first_law_radius: p/(1 + e cos nu), with p, e and nu from the
//     angular momentum and eccentricity vector, against |r|;
//   - second_law_areal_rate: the area swept by the radius vector while
//     [Propagate] advances the state by tau (adaptive quadrature of
//     r(nu)^2/2 between the two true anomalies), divided by tau, against
//     |r x v|/2 (for an ellipse the quadrature runs over the eccentric
//     anomalies of the two true anomalies, where the integrand is smooth);
//   - third_law_period (ellipses only: open orbits have no period and the
//     check is omitted): 2 pi sqrt(a^3/mu) with a = -mu/(2 eps) from the
//     energy, against 2 pi tau/Delta M, the mean motion measured from the
//     advance of the mean anomaly (Kepler's equation) over tau = T/4 of
//     analytic propagation;
//   - vis_viva_speed: sqrt(mu (2/r - 1/a)), with a = p/(1-e^2) from the
//     elements, against |v|;
//   - energy: -mu/(2a) from the elements against v^2/2 - mu/r from the
//     state, relative to mu/r (the energy of a parabola is zero);
//   - angular_momentum (omitted for a parabola, where a is infinite):
//     sqrt(mu a (1-e^2)) with a from the energy and e from the
//     eccentricity vector, against |r x v|.
//
// For open orbits tau is the shorter of p sqrt(p/mu) and one unit of the
// hyperbolic mean anomaly, sqrt(|a|^3/mu). Every check is
// held to [CheckTolerance]. Errors are those of [ElementsFromState] and
// [Propagate].
func KeplerChecks(mu float64, s State) ([]Check, error) {
	el, err := ElementsFromState(mu, s)
	if err != nil {
		return nil, err
	}
	r, v := norm(s.R), norm(s.V)
	hv := cross(s.R, s.V)
	h := norm(hv)
	eps := dot(s.V, s.V)/2 - mu/r
	e, p := el.E, el.P
	var invA float64 // 1/a from the elements; 0 for a parabola
	if e != 1 {
		invA = (1 - e) * (1 + e) / p
	}
	var out []Check
	add := func(name, desc string, expected, measured, scale float64) {
		rel := math.Abs(measured-expected) / scale
		out = append(out, Check{
			Name: name, Description: desc,
			Expected: expected, Measured: measured,
			RelativeError: rel, Tolerance: CheckTolerance,
			Pass: rel <= CheckTolerance,
		})
	}

	rExp := p / (1 + e*math.Cos(el.Nu))
	add("first_law_radius", "Kepler I: radius p/(1+e cos nu) from the elements vs |r| (km)", rExp, r, rExp)

	// Propagate over tau and measure the swept true anomaly in the
	// initial orbit plane (independent of the noisy periapsis direction
	// of a near-circular orbit).
	// tau: a quarter period for an ellipse (a from the energy), and the
	// parabolic time unit p sqrt(p/mu) for an open orbit.
	closed := e < 1 && eps < 0
	var tau, T float64
	if closed {
		aE := -mu / (2 * eps)
		T = 2 * math.Pi * aE * math.Sqrt(aE/mu)
		tau = T / 4
	} else {
		tau = p * math.Sqrt(p/mu)
		// A hyperbola far from the parabola covers (e^2-1)^(3/2) units of
		// mean anomaly in that time (10^9 for e = 1000), running out to
		// where the integrand r^2 is ill-conditioned; one unit, 1/n, keeps
		// the interval short.
		if eps > 0 {
			aE := mu / (2 * eps) // |a|
			tau = math.Min(tau, aE*math.Sqrt(aE/mu))
		}
	}
	s1, err := Propagate(mu, s, tau)
	if err != nil {
		return nil, err
	}
	hh := scale(1/h, hv)
	dnu := math.Atan2(dot(hh, cross(s.R, s1.R)), dot(s.R, s1.R))
	if dnu < 0 {
		dnu += 2 * math.Pi
	}
	nu0 := el.Nu
	nu1 := nu0 + dnu
	rOf := func(nu float64) float64 { x := p / (1 + e*math.Cos(nu)); return x * x / 2 }
	var area float64
	if closed {
		// The same integral in the eccentric anomaly of the two true
		// anomalies, r^2 dnu = a b (1 - e cos E) dE: smooth, where r(nu)^2
		// peaks by ((1+e)/(1-e))^2 at apoapsis and defeats the quadrature
		// for e near 1.
		E0, E1 := EccentricFromTrue(nu0, e), EccentricFromTrue(nu1, e)
		ab := p * p / math.Pow((1-e)*(1+e), 1.5)
		area = integrate(func(E float64) float64 { return ab * (1 - e*math.Cos(E)) / 2 }, E0, E1, 1e-14)
	} else {
		area = integrate(rOf, nu0, nu1, 1e-14)
	}
	add("second_law_areal_rate", "Kepler II: area swept over an interval of analytic propagation / its duration vs |r x v|/2 (km^2/s)", h/2, area/tau, h/2)

	if closed {
		M0, err0 := MeanFromTrue(nu0, e)
		M1, err1 := MeanFromTrue(nu1, e)
		if err0 == nil && err1 == nil && M1 > M0 {
			add("third_law_period", "Kepler III: period 2 pi sqrt(a^3/mu), a from the energy, vs 2 pi tau/(mean-anomaly advance over tau = T/4 of propagation) (s)", T, 2*math.Pi*tau/(M1-M0), T)
		}
	}

	vExp := math.Sqrt(mu * (2/r - invA))
	add("vis_viva_speed", "vis-viva: sqrt(mu (2/r - 1/a)), a from the elements, vs |v| (km/s)", vExp, v, vExp)

	add("energy", "energy: -mu/(2a) from the elements vs v^2/2 - mu/r from the state, relative to mu/r (km^2/s^2)", -mu*invA/2, eps, mu/r)

	if e != 1 && eps != 0 {
		aE := -mu / (2 * eps)
		hExp := math.Sqrt(mu * aE * (1 - e) * (1 + e))
		add("angular_momentum", "angular momentum: sqrt(mu a (1-e^2)), a from the energy, e from the eccentricity vector, vs |r x v| (km^2/s)", hExp, h, hExp)
	}
	return out, nil
}
