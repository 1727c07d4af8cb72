package orbit

import "math"

// Thresholds that decide the degenerate cases of [ElementsFromState].
// They sit far below anything a mission would call circular or
// equatorial, and close to the noise floor of double precision, so that
// snapping a value to the degenerate case moves the state by no more
// than about 1e-13 of its size: the round trip state -> elements ->
// state stays accurate to 1e-12 relative.
const (
	// CircularTolerance: an orbit with e < CircularTolerance is circular
	// (E = 0, ArgP = 0, Nu = argument of latitude).
	CircularTolerance = 1e-13
	// ParabolicTolerance: an orbit with |e - 1| < ParabolicTolerance is
	// parabolic (E = 1, A = 0).
	ParabolicTolerance = 1e-13
	// EquatorialTolerance: an orbit with sin(i) < EquatorialTolerance
	// is equatorial (I = 0 or pi, RAAN = 0).
	EquatorialTolerance = 1e-13
	// RectilinearTolerance: a state with |r x v| <= RectilinearTolerance
	// |r||v| is rectilinear and has no classical elements.
	RectilinearTolerance = 1e-12
)

func validMu(mu float64) bool { return mu > 0 && !math.IsInf(mu, 1) }

// checkState validates mu and s and returns |r|, |v| and h = r x v.
func checkState(op string, mu float64, s State) (r, v float64, h [3]float64, err error) {
	if !validMu(mu) {
		return 0, 0, h, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	if !finite3(s.R) || !finite3(s.V) {
		return 0, 0, h, inputErr(op, ErrNonFinite, "state has a NaN or infinite component")
	}
	r = norm(s.R)
	if r == 0 {
		return 0, 0, h, inputErr(op, ErrZeroPosition, "|r| = 0 km")
	}
	v = norm(s.V)
	h = cross(s.R, s.V)
	if hm := norm(h); !(hm > RectilinearTolerance*r*v) {
		return 0, 0, h, inputErr(op, ErrRectilinear, fmtVal("|r x v|", hm, "km^2/s"))
	}
	return r, v, h, nil
}

// ElementsFromState returns the classical elements of the state s about a
// body with gravitational parameter mu (km^3/s^2).
//
// Conventions, including the degenerate cases decided by
// [CircularTolerance], [EquatorialTolerance] and [ParabolicTolerance]:
//
//   - I in [0, pi] from the angular momentum h = r x v.
//   - RAAN in [0, 2pi) is the direction of z x h. Equatorial orbits
//     (prograde I = 0 or retrograde I = pi) have RAAN = 0: the node is
//     taken on the +x axis.
//   - ArgP in [0, 2pi) is measured from the node to periapsis in the
//     direction of motion. Circular orbits have ArgP = 0 (periapsis
//     taken at the node), so Nu is the argument of latitude; for an
//     elliptic equatorial orbit ArgP is the longitude of periapsis, and
//     for a circular equatorial orbit Nu is the true longitude. All
//     these angles are measured in the direction of motion, so for a
//     retrograde equatorial orbit they run clockwise seen from +z.
//   - Nu is in [0, 2pi) for an ellipse and in (-nu_inf, nu_inf), nu_inf =
//     arccos(-1/e), for a hyperbola or parabola.
//   - P = h^2/mu always; A = P/(1-e^2) (negative for a hyperbola), and
//     A = 0 for a parabola.
//
// The argument of latitude u = ArgP + Nu is computed directly from r and
// the node, and Nu = u - ArgP, so the position in the orbit stays exact
// even when e or i are so small that ArgP or RAAN are ill-determined.
//
// Errors wrap [ErrInvalidMu], [ErrNonFinite], [ErrZeroPosition] or
// [ErrRectilinear] (|r x v| <= [RectilinearTolerance] |r||v|).
func ElementsFromState(mu float64, s State) (Elements, error) {
	r, _, h, err := checkState("ElementsFromState", mu, s)
	if err != nil {
		return Elements{}, err
	}
	R, V := s.R, s.V
	hm := norm(h)
	v2 := dot(V, V)
	rv := dot(R, V)

	// Eccentricity vector e = ((v^2 - mu/r) r - (r.v) v)/mu.
	c1 := (v2 - mu/r) / mu
	c2 := rv / mu
	ev := [3]float64{c1*R[0] - c2*V[0], c1*R[1] - c2*V[1], c1*R[2] - c2*V[2]}
	e := norm(ev)
	p := hm * hm / mu

	// Inclination and the node direction n (unit vector in the xy-plane).
	nxy := math.Sqrt(h[0]*h[0] + h[1]*h[1])
	inc := math.Atan2(nxy, h[2])
	var raan float64
	var n, hh [3]float64
	if nxy >= EquatorialTolerance*hm {
		n = [3]float64{-h[1] / nxy, h[0] / nxy, 0}
		raan = wrap2Pi(math.Atan2(n[1], n[0]))
		hh = scale(1/hm, h)
	} else {
		n = [3]float64{1, 0, 0}
		if h[2] > 0 {
			inc, hh = 0, [3]float64{0, 0, 1}
		} else {
			inc, hh = math.Pi, [3]float64{0, 0, -1}
		}
	}
	m := cross(hh, n) // in the orbit plane, 90 deg ahead of the node

	u := math.Atan2(dot(R, m), dot(R, n)) // argument of latitude
	el := Elements{P: p, I: inc, RAAN: raan}
	if e < CircularTolerance {
		el.A = p
		el.Nu = wrap2Pi(u)
		return el, nil
	}
	argp := math.Atan2(dot(ev, m), dot(ev, n))
	nu := u - argp
	el.ArgP = wrap2Pi(argp)
	switch {
	case math.Abs(e-1) < ParabolicTolerance:
		el.E, el.A, el.Nu = 1, 0, wrapPi(nu)
	case e < 1:
		el.E, el.A, el.Nu = e, p/((1-e)*(1+e)), wrap2Pi(nu)
	default:
		el.E, el.A, el.Nu = e, p/((1-e)*(1+e)), wrapPi(nu)
	}
	return el, nil
}

// semiLatusRectum validates the size and shape of el and returns p (km).
// P takes precedence; when P is zero it is derived from A and E.
func semiLatusRectum(op string, el Elements) (float64, error) {
	if !finite(el.E) || el.E < 0 {
		return 0, inputErr(op, ErrEccentricity, fmtVal("e", el.E, ""))
	}
	p := el.P
	if p == 0 {
		switch {
		case el.E == 1:
			return 0, inputErr(op, ErrSize, "a parabola needs its semi-latus rectum P")
		case !finite(el.A):
			return 0, inputErr(op, ErrSize, fmtVal("a", el.A, "km"))
		}
		p = el.A * (1 - el.E) * (1 + el.E)
	}
	if !(p > 0) || math.IsInf(p, 1) {
		return 0, inputErr(op, ErrSize, fmtVal("p", p, "km")+" from "+fmtVal("a", el.A, "km")+", "+fmtVal("e", el.E, ""))
	}
	return p, nil
}

// StateFromElements returns the state of the elements el about a body with
// gravitational parameter mu (km^3/s^2); it is the inverse of
// [ElementsFromState] and accepts the same conventions.
//
// The size is taken from el.P when it is positive, otherwise from
// el.A(1 - e^2) (so a parabola needs P). I must lie in [0, pi]; RAAN,
// ArgP and Nu may be any finite angles. On an open orbit Nu must lie
// strictly between the asymptotes.
//
// Errors wrap [ErrInvalidMu], [ErrNonFinite], [ErrEccentricity],
// [ErrSize], [ErrInclination] or [ErrBeyondAsymptote].
func StateFromElements(mu float64, el Elements) (State, error) {
	const op = "StateFromElements"
	if !validMu(mu) {
		return State{}, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	if !finite(el.I) || !finite(el.RAAN) || !finite(el.ArgP) || !finite(el.Nu) {
		return State{}, inputErr(op, ErrNonFinite, "an angle is NaN or infinite")
	}
	p, err := semiLatusRectum(op, el)
	if err != nil {
		return State{}, err
	}
	if el.I < -angleSlack || el.I > math.Pi+angleSlack {
		return State{}, inputErr(op, ErrInclination, fmtVal("i", el.I, "rad"))
	}
	e := el.E
	snu, cnu := math.Sincos(el.Nu)
	den := 1 + e*cnu
	if !(den > 0) {
		return State{}, inputErr(op, ErrBeyondAsymptote, fmtVal("nu", el.Nu, "rad")+", "+fmtVal("e", e, ""))
	}
	r := p / den
	su, cu := math.Sincos(el.ArgP + el.Nu)
	sO, cO := math.Sincos(el.RAAN)
	si, ci := math.Sincos(el.I)
	// Radial and along-track unit vectors R3(-RAAN) R1(-I) R3(-u) [x, y].
	rh := [3]float64{cO*cu - sO*su*ci, sO*cu + cO*su*ci, su * si}
	th := [3]float64{-cO*su - sO*cu*ci, -sO*su + cO*cu*ci, cu * si}
	sq := math.Sqrt(mu / p)
	vr := sq * e * snu // radial velocity
	vt := sq * den     // transverse velocity h/r
	var s State
	for k := range 3 {
		s.R[k] = r * rh[k]
		s.V[k] = vr*rh[k] + vt*th[k]
	}
	if !finite3(s.R) || !finite3(s.V) {
		return State{}, inputErr(op, ErrBeyondAsymptote, "the state overflows (nu too close to the asymptote)")
	}
	return s, nil
}

// angleSlack is how far outside [0, pi] an inclination may be, to absorb
// degree-radian conversion rounding.
const angleSlack = 1e-12
