package orbit

import (
	"errors"
	"math"
)

// Orbit design helpers: frozen eccentricity (J2 with J3), repeat ground
// tracks (J2 secular rates), sun-synchronous combinations of both, and the
// first-order J2 short-period terms that turn the mean elements these
// helpers produce into an osculating state (and back).
//
// Every helper works with mean elements in the sense of first-order
// secular J2 theory (Brouwer 1959; Vallado, Fundamentals of
// Astrodynamics and Applications, 4th ed., sec. 9.6): a is the average of
// the osculating semi-major axis over one revolution, and the rates are
// those of [J2Rates].

var (
	// ErrNoFrozen reports a body whose J2 or J3 is zero or not finite:
	// no frozen eccentricity is defined.
	ErrNoFrozen = errors.New("orbit: frozen orbits need nonzero J2 and J3")
	// ErrNoRepeat reports a repeat ground track that has no solution: the
	// orbit would be inside the body, or no semi-major axis gives the
	// ratio of revolutions to days.
	ErrNoRepeat = errors.New("orbit: no repeat ground track")
)

// FrozenEccentricity returns the mean eccentricity and argument of
// periapsis (rad) of the frozen orbit of mean semi-major axis a (km) and
// inclination i (rad) about a body of reference radius re (km) with zonal
// coefficients j2 and j3:
//
//	e_f = -(J3 Re sin i) / (2 J2 a),   argp = 90 deg  (270 deg and |e_f| when e_f < 0).
//
// It is the point where the long-period J3 change of the eccentricity
// vector balances the secular J2 rotation of periapsis, to first order in
// e (Vallado, 4th ed., sec. 11.4.2, frozen orbits; Chobotov, Orbital
// Mechanics, 3rd ed., sec. 11.4; both from memory, and the tests recompute
// it from a numerical propagation with J2 and J3). For the Earth (J3 < 0)
// e_f is about 0.001 near 700 km and argp is 90 deg. At the critical
// inclination the J2 apsidal rate vanishes and the balance is not there;
// the formula is then meaningless, and callers should not be near it
// (|5 cos^2 i - 1| small). Errors wrap [ErrNoFrozen], [ErrInclination] or
// [ErrOpenOrbit] (a not positive).
func FrozenEccentricity(re, j2, j3, a, i float64) (e, argp float64, err error) {
	const op = "FrozenEccentricity"
	switch {
	case !(re > 0) || math.IsInf(re, 0):
		return 0, 0, inputErr(op, ErrJ2, fmtVal("re", re, "km"))
	case !finite(j2) || !finite(j3) || j2 == 0 || j3 == 0:
		return 0, 0, inputErr(op, ErrNoFrozen, fmtVal("j2", j2, "")+", "+fmtVal("j3", j3, ""))
	case !(a > 0) || math.IsInf(a, 0):
		return 0, 0, inputErr(op, ErrOpenOrbit, fmtVal("a", a, "km"))
	case !(i >= 0 && i <= math.Pi):
		return 0, 0, inputErr(op, ErrInclination, fmtVal("i", i, "rad"))
	}
	e = -j3 * re * math.Sin(i) / (2 * j2 * a)
	argp = math.Pi / 2
	if e < 0 {
		e, argp = -e, 3*math.Pi/2
	}
	return e, argp, nil
}

// NodalPeriod returns the time in s between successive ascending nodes of
// the mean orbit (a km, e, i rad) under J2: 2 pi / (argpDot + meanAnomalyDot)
// with the rates of [J2Rates]. Errors are those of J2Rates.
func NodalPeriod(mu, re, j2, a, e, i float64) (float64, error) {
	_, w, m, err := J2Rates(mu, re, j2, a, e, i)
	if err != nil {
		return 0, err
	}
	if !(w+m > 0) {
		return 0, inputErr("NodalPeriod", ErrOpenOrbit, fmtVal("argument of latitude rate", w+m, "rad/s"))
	}
	return 2 * math.Pi / (w + m), nil
}

// Design is an orbit design problem. The size comes from A, or from a
// repeat ground track of Revs revolutions in Days nodal days when Revs is
// positive; the inclination from I, or from the sun-synchronous condition
// when SunSynchronous is set; the eccentricity and argument of periapsis
// from E and ArgP, or from the frozen condition when Frozen is set. Angles
// in rad, lengths in km, rates in rad/s.
type Design struct {
	Mu, Re, J2, J3 float64 // body: km^3/s^2, km, unnormalized J2 and J3 (J3 only for Frozen)
	RotationRate   float64 // body's sidereal rotation rate, rad/s (only for Revs > 0)

	A          float64 // mean semi-major axis, km; ignored when Revs > 0
	Revs, Days int     // repeat ground track: Revs nodal periods in Days nodal days (0: not a repeat design)

	E, ArgP        float64 // mean eccentricity and argument of periapsis; ignored when Frozen
	I              float64 // inclination; ignored when SunSynchronous
	SunSynchronous bool
	Frozen         bool
}

// DesignResult is the solution of a [Design]: mean elements and the
// rates and periods that define them.
type DesignResult struct {
	A, E, I, ArgP float64 // mean elements, km and rad
	RAANRate      float64 // J2 secular nodal rate, rad/s
	ArgPRate      float64 // J2 secular apsidal rate, rad/s
	NodalPeriod   float64 // s, see [NodalPeriod]
	// NodalDay is the time in s for the body to turn once relative to
	// the precessing node, 2 pi / (RotationRate - RAANRate); 0 when
	// RotationRate is 0.
	NodalDay float64
	// Iterations counts the passes over the coupled conditions (size,
	// inclination and eccentricity depend on each other).
	Iterations int
}

// Maximum repeat cycle accepted, in revolutions and in days.
const (
	MaxRepeatRevs = 100000
	MaxRepeatDays = 1000
)

// Solve solves the design. A repeat ground track satisfies
//
//	Revs * NodalPeriod = Days * 2 pi / (RotationRate - RAANRate),
//
// solved for a by bisection. The rates are first order in J2: the nodal
// period is off by about 1e-6 to 1e-5 of itself and the nodal rate by a few
// J2 (Re/a)^2 of itself, so the track drifts by about 0.1 km per day for
// sun-synchronous orbits and up to 1.5 km per day at low inclinations, which
// a planner removes with a propagation or by orbit maintenance.
// Sun-synchronous orbits take the inclination
// of [SunSynchronousInclination], and frozen orbits the eccentricity of
// [FrozenEccentricity]. Because each condition depends on the others
// (weakly: through e^2 and the inclination), they are solved in turn until
// a changes by less than 1e-9 km. Errors wrap [ErrNoRepeat],
// [ErrNoSunSynchronous], [ErrNoFrozen] or the errors of the functions
// named.
func (d Design) Solve() (DesignResult, error) {
	const op = "Design.Solve"
	if !validMu(d.Mu) {
		return DesignResult{}, inputErr(op, ErrInvalidMu, fmtVal("mu", d.Mu, "km^3/s^2"))
	}
	if !(d.Re > 0) || math.IsInf(d.Re, 0) || !finite(d.J2) || d.J2 == 0 {
		return DesignResult{}, inputErr(op, ErrJ2, fmtVal("re", d.Re, "km")+", "+fmtVal("j2", d.J2, ""))
	}
	repeat := d.Revs != 0 || d.Days != 0
	if repeat {
		switch {
		case d.Revs <= 0 || d.Days <= 0 || d.Revs > MaxRepeatRevs || d.Days > MaxRepeatDays:
			return DesignResult{}, inputErr(op, ErrNoRepeat, "repeat cycle "+itoa(d.Revs)+" revolutions in "+itoa(d.Days)+" days is outside 1..100000 revolutions and 1..1000 days")
		case !(d.RotationRate > 0) || math.IsInf(d.RotationRate, 0):
			return DesignResult{}, inputErr(op, ErrNoRepeat, fmtVal("rotation rate", d.RotationRate, "rad/s")+" (a repeat ground track needs a body turning prograde)")
		}
	} else if !(d.A > 0) || math.IsInf(d.A, 0) {
		return DesignResult{}, inputErr(op, ErrOpenOrbit, fmtVal("a", d.A, "km"))
	}
	a, e, i, argp := d.A, d.E, d.I, d.ArgP
	if d.Frozen {
		e = 0
	}
	if !finite(e) || e < 0 || e >= 1 {
		return DesignResult{}, inputErr(op, ErrEccentricity, fmtVal("e", e, ""))
	}
	var res DesignResult
	for it := 1; it <= 50; it++ {
		res.Iterations = it
		prevA, prevE, prevI := a, e, i
		if repeat {
			var err error
			a, i, err = d.solveRepeat(e, i)
			if err != nil {
				return DesignResult{}, err
			}
		} else if d.SunSynchronous {
			var err error
			i, err = SunSynchronousInclination(d.Mu, d.Re, d.J2, a, e)
			if err != nil {
				return DesignResult{}, err
			}
		}
		if d.Frozen {
			var err error
			e, argp, err = FrozenEccentricity(d.Re, d.J2, d.J3, a, i)
			if err != nil {
				return DesignResult{}, err
			}
		}
		if it > 1 && math.Abs(a-prevA) < 1e-9 && math.Abs(e-prevE) < 1e-15 && math.Abs(i-prevI) < 1e-15 {
			break
		}
	}
	if a*(1-e) <= d.Re {
		return DesignResult{}, inputErr(op, ErrNoRepeat, fmtVal("a", a, "km")+", "+fmtVal("periapsis radius", a*(1-e), "km")+" is inside the body")
	}
	if !(i >= 0 && i <= math.Pi) {
		return DesignResult{}, inputErr(op, ErrInclination, fmtVal("i", i, "rad"))
	}
	raanDot, argpDot, _, err := J2Rates(d.Mu, d.Re, d.J2, a, e, i)
	if err != nil {
		return DesignResult{}, err
	}
	tn, err := NodalPeriod(d.Mu, d.Re, d.J2, a, e, i)
	if err != nil {
		return DesignResult{}, err
	}
	res.A, res.E, res.I, res.ArgP = a, e, i, wrap2Pi(argp)
	res.RAANRate, res.ArgPRate, res.NodalPeriod = raanDot, argpDot, tn
	if d.RotationRate > raanDot {
		res.NodalDay = 2 * math.Pi / (d.RotationRate - raanDot)
	}
	return res, nil
}

// solveRepeat returns the mean semi-major axis (and, for sun-synchronous
// designs, the inclination) of the repeat ground track for eccentricity e
// and inclination i. It finds the root of
//
//	g(a) = (RotationRate - RAANDot) - (Days/Revs) (ArgPDot + MDot),
//
// which rises with a (the mean motion falls as a^-3/2 while the nodal rate
// changes little), by bisection.
func (d Design) solveRepeat(e, i float64) (float64, float64, error) {
	const op = "Design.Solve"
	ratio := float64(d.Days) / float64(d.Revs)
	g := func(a float64) (float64, float64, bool) {
		inc := i
		if d.SunSynchronous {
			var err error
			inc, err = SunSynchronousInclination(d.Mu, d.Re, d.J2, a, e)
			if err != nil {
				return 0, 0, false
			}
		}
		raanDot, argpDot, mDot, err := J2Rates(d.Mu, d.Re, d.J2, a, e, inc)
		if err != nil {
			return 0, 0, false
		}
		return (d.RotationRate - raanDot) - ratio*(argpDot+mDot), inc, true
	}
	detail := itoa(d.Revs) + " revolutions in " + itoa(d.Days) + " days"
	if d.SunSynchronous {
		detail += " (sun-synchronous)"
	}
	// Keplerian first guess: n = (Revs/Days) * rotation rate.
	n0 := d.RotationRate / ratio
	a0 := math.Cbrt(d.Mu / (n0 * n0))
	lo, hi := 0.5*a0, 2*a0
	flo, _, okLo := g(lo)
	fhi, _, okHi := g(hi)
	// The sun-synchronous condition has no solution for high orbits:
	// shrink the bracket to where it has one.
	for k := 0; k < 80 && okLo && !okHi; k++ {
		hi = lo + (hi-lo)*0.75
		fhi, _, okHi = g(hi)
	}
	if d.SunSynchronous {
		if _, err := SunSynchronousInclination(d.Mu, d.Re, d.J2, a0, e); err != nil {
			return 0, 0, inputErr(op, ErrNoRepeat, detail+" needs a near "+fmtVal("a", a0, "km")+", too high for J2 to make it sun-synchronous")
		}
	}
	if !okLo || !okHi || !(flo < 0 && fhi > 0) {
		return 0, 0, inputErr(op, ErrNoRepeat, detail+" has no solution")
	}
	for k := 0; k < 200 && hi-lo > 1e-13*hi; k++ {
		mid := (lo + hi) / 2
		fm, _, ok := g(mid)
		if !ok {
			return 0, 0, inputErr(op, ErrNoRepeat, detail+" has no solution")
		}
		if fm < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	a := (lo + hi) / 2
	_, inc, _ := g(a)
	return a, inc, nil
}

func itoa(n int) string {
	neg := n < 0
	if neg {
		n = -n
	}
	var b [20]byte
	p := len(b)
	for {
		p--
		b[p] = byte('0' + n%10)
		n /= 10
		if n == 0 {
			break
		}
	}
	if neg {
		p--
		b[p] = '-'
	}
	return string(b[p:])
}

// ShortPeriodJ2 are the first-order short-period J2 terms, osculating
// minus mean, of one point of a mean orbit (see [MeanToOsculating]).
type ShortPeriodJ2 struct {
	A          float64 // km
	EX, EY     float64 // components of the eccentricity vector along the node and 90 deg ahead of it
	I, RAAN, U float64 // rad; U is the argument of latitude
}

// shortPeriod returns the short-period terms at the mean orbit
// (a, ex, ey, i) at mean argument of latitude u.
func shortPeriod(re, j2, a, ex, ey, i, u float64) ShortPeriodJ2 {
	e2 := ex*ex + ey*ey
	eta2 := 1 - e2
	eta := math.Sqrt(eta2)
	p := a * eta2
	// 1 + e cos nu, with nu = u - argp: e cos nu = ex cos u + ey sin u.
	su, cu := math.Sincos(u)
	r := p / (1 + ex*cu + ey*su)
	ar3 := (a / r) * (a / r) * (a / r)
	s, c := math.Sincos(i)
	s2 := s * s
	k := j2 * (re / a) * (re / a)
	s2u, c2u := math.Sincos(2 * u)
	s3u, c3u := math.Sincos(3 * u)
	var sp ShortPeriodJ2
	sp.A = j2 * re * re / a * ((3*c*c-1)/2*(ar3-1/(eta2*eta)) + 1.5*s2*ar3*c2u)
	sp.EX = k * ((1.5-15.0/8*s2)*cu + 7.0/8*s2*c3u)
	sp.EY = k * ((1.5-21.0/8*s2)*su + 7.0/8*s2*s3u)
	sp.I = 0.75 * k * s * c * c2u
	sp.RAAN = 0.75 * k * c * s2u
	// Keep the along-track position: a node shift dRAAN moves the point
	// along the track by cos i dRAAN.
	sp.U = -c * sp.RAAN
	return sp
}

// MeanToOsculating returns the osculating elements of the mean elements
// mean (first-order secular J2 theory) at the same point of the orbit,
// about a body with gravitational parameter mu (km^3/s^2), reference
// radius re (km) and zonal coefficient j2. The short-period terms are
// those of first order in J2 for a near-circular orbit, derived from
// Gauss's equations with the J2 acceleration on the circular orbit
// (Vallado, 4th ed., sec. 9.6, eqs. 9-24 and the J2 components in
// RSW), with k = J2 (Re/a)^2, s = sin i, c = cos i and u the argument of
// latitude:
//
//	da  = (J2 Re^2/a) [ (3c^2-1)/2 ((a/r)^3 - (1-e^2)^(-3/2)) + 3/2 s^2 (a/r)^3 cos 2u ]   (exact in e: from the energy integral)
//	dex = k [ (3/2 - 15/8 s^2) cos u + 7/8 s^2 cos 3u ],  ex = e cos argp
//	dey = k [ (3/2 - 21/8 s^2) sin u + 7/8 s^2 sin 3u ],  ey = e sin argp
//	di  = 3/4 k s c cos 2u
//	dRAAN = 3/4 k c sin 2u
//
// The terms of the eccentricity vector, inclination and node neglect
// e k against k; the along-track short-period terms are not applied: the
// argument of latitude is changed by -cos i dRAAN only, which keeps the
// point where it is along the track, so the position along the orbit is
// that of the mean argument of latitude to within about k rad (a few km).
// These leave errors of order k^2 and e k in the elements; the tests show
// that the mean elements of a propagated J2 orbit computed by
// [OsculatingToMean] stay constant (a) or turn at the secular rates (e, RAAN)
// to that order. Elliptic orbits only (ErrOpenOrbit).
func MeanToOsculating(mu, re, j2 float64, mean Elements) (Elements, error) {
	return applyShortPeriod("MeanToOsculating", mu, re, j2, mean, 1)
}

// OsculatingToMean inverts [MeanToOsculating] by fixed-point iteration
// (mean = osc - short-period terms at mean; four passes reach the order of
// the theory).
func OsculatingToMean(mu, re, j2 float64, osc Elements) (Elements, error) {
	const op = "OsculatingToMean"
	if err := checkDesignElements(op, mu, re, j2, osc); err != nil {
		return Elements{}, err
	}
	mean := osc
	for range 4 {
		m, err := shiftElements(op, re, j2, mean, osc, -1)
		if err != nil {
			return Elements{}, err
		}
		mean = m
	}
	return mean, nil
}

func checkDesignElements(op string, mu, re, j2 float64, el Elements) error {
	switch {
	case !validMu(mu):
		return inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	case !(re > 0) || math.IsInf(re, 0) || !finite(j2):
		return inputErr(op, ErrJ2, fmtVal("re", re, "km")+", "+fmtVal("j2", j2, ""))
	case !finite(el.E) || el.E < 0:
		return inputErr(op, ErrEccentricity, fmtVal("e", el.E, ""))
	case el.E >= 1:
		return inputErr(op, ErrOpenOrbit, fmtVal("e", el.E, ""))
	}
	return nil
}

func applyShortPeriod(op string, mu, re, j2 float64, mean Elements, sign float64) (Elements, error) {
	if err := checkDesignElements(op, mu, re, j2, mean); err != nil {
		return Elements{}, err
	}
	return shiftElements(op, re, j2, mean, mean, sign)
}

// shiftElements returns base + sign * (short-period terms at at).
func shiftElements(op string, re, j2 float64, at, base Elements, sign float64) (Elements, error) {
	aAt := semiMajor(at)
	aBase := semiMajor(base)
	if !(aAt > 0) || !(aBase > 0) {
		return Elements{}, inputErr(op, ErrOpenOrbit, fmtVal("a", aAt, "km"))
	}
	sw, cw := math.Sincos(at.ArgP)
	u := at.ArgP + at.Nu
	sp := shortPeriod(re, j2, aAt, at.E*cw, at.E*sw, at.I, u)
	sb, cb := math.Sincos(base.ArgP)
	a := aBase + sign*sp.A
	ex := base.E*cb + sign*sp.EX
	ey := base.E*sb + sign*sp.EY
	inc := base.I + sign*sp.I
	raan := base.RAAN + sign*sp.RAAN
	ub := base.ArgP + base.Nu + sign*sp.U
	// |di| <= 3/4 k sin i is far smaller than i and pi - i: the
	// inclination stays in [0, pi] but for rounding.
	inc = math.Min(math.Max(inc, 0), math.Pi)
	e := math.Hypot(ex, ey)
	if !(e < 1) || !(a > 0) {
		return Elements{}, inputErr(op, ErrOpenOrbit, fmtVal("a", a, "km")+", "+fmtVal("e", e, ""))
	}
	argp := 0.0
	if e > 0 {
		argp = math.Atan2(ey, ex)
	}
	out := Elements{A: a, P: a * (1 - e) * (1 + e), E: e, I: inc, RAAN: wrap2Pi(raan), ArgP: wrap2Pi(argp), Nu: wrap2Pi(ub - argp)}
	return out, nil
}

// semiMajor returns A, or P/(1-e^2) when A is zero.
func semiMajor(el Elements) float64 {
	if el.A != 0 {
		return el.A
	}
	return el.P / ((1 - el.E) * (1 + el.E))
}
