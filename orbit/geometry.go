package orbit

import "math"

// Conic is the kind of a two-body orbit.
type Conic int

const (
	Ellipse   Conic = iota // 0 <= e < 1, including the circle
	Parabola               // e == 1
	Hyperbola              // e > 1
)

// String returns "ellipse", "parabola" or "hyperbola".
func (c Conic) String() string {
	switch c {
	case Ellipse:
		return "ellipse"
	case Parabola:
		return "parabola"
	case Hyperbola:
		return "hyperbola"
	}
	return "conic(?)"
}

// ConicOf returns the kind of conic of eccentricity e (e == 1 exactly is
// the parabola; [ElementsFromState] snaps e to 1 within
// [ParabolicTolerance]).
func ConicOf(e float64) Conic {
	switch {
	case e < 1:
		return Ellipse
	case e == 1:
		return Parabola
	}
	return Hyperbola
}

// Geometry holds the size, shape and the characteristic speeds and times
// of a conic orbit. Quantities that an orbit does not have are zero and
// flagged by the Has* fields, so no field is ever NaN or infinite:
//
//   - HasSemiMajorAxis: false for a parabola (a is infinite);
//   - HasPeriod and HasApoapsis: true only for an ellipse;
//   - HasVInfinity: true only for a parabola (V_inf = 0) or hyperbola.
type Geometry struct {
	Conic           Conic
	Eccentricity    float64 // e
	SemiLatusRectum float64 // p, km
	SemiMajorAxis   float64 // a, km; negative for a hyperbola; 0 for a parabola
	// SemiMinorAxis is b = a sqrt(1-e^2) for an ellipse and the impact
	// parameter b = |a| sqrt(e^2-1) for a hyperbola, km; 0 for a parabola.
	SemiMinorAxis   float64
	PeriapsisRadius float64 // r_p = p/(1+e), km
	ApoapsisRadius  float64 // r_a = p/(1-e), km; HasApoapsis
	Period          float64 // 2 pi sqrt(a^3/mu), s; HasPeriod
	// MeanMotion is the rate of the mean anomaly in rad/s:
	// sqrt(mu/a^3) for an ellipse, sqrt(mu/(-a)^3) for a hyperbola and
	// sqrt(mu/p^3) for a parabola (Barker's convention, see [SolveBarker]).
	MeanMotion      float64
	SpecificEnergy  float64 // -mu/(2a), km^2/s^2; 0 for a parabola
	AngularMomentum float64 // specific angular momentum h = sqrt(mu p), km^2/s
	SpeedPeriapsis  float64 // h/r_p, km/s
	SpeedApoapsis   float64 // h/r_a, km/s; HasApoapsis
	VInfinity       float64 // sqrt(-mu/a), km/s; 0 for a parabola; HasVInfinity
	// AsymptoteAnomaly is the true anomaly of the outgoing asymptote,
	// arccos(-1/e) (pi for a parabola), rad; HasVInfinity.
	AsymptoteAnomaly float64
	// TurnAngle is the angle between the incoming and outgoing
	// asymptotes, 2 arcsin(1/e) (pi for a parabola), rad; HasVInfinity.
	TurnAngle float64

	HasSemiMajorAxis, HasPeriod, HasApoapsis, HasVInfinity bool
}

// GeometryOf returns the geometry of the conic described by the size and
// shape of el (P, or A when P is zero, and E; the orientation angles are
// not used) about a body with gravitational parameter mu (km^3/s^2).
// Errors wrap [ErrInvalidMu], [ErrEccentricity] or [ErrSize].
func GeometryOf(mu float64, el Elements) (Geometry, error) {
	const op = "GeometryOf"
	if !validMu(mu) {
		return Geometry{}, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	p, err := semiLatusRectum(op, el)
	if err != nil {
		return Geometry{}, err
	}
	e := el.E
	g := Geometry{Conic: ConicOf(e), Eccentricity: e, SemiLatusRectum: p}
	g.PeriapsisRadius = p / (1 + e)
	g.AngularMomentum = math.Sqrt(mu * p)
	g.SpeedPeriapsis = g.AngularMomentum / g.PeriapsisRadius
	switch g.Conic {
	case Ellipse:
		omes := (1 - e) * (1 + e) // 1 - e^2 without cancellation
		a := p / omes
		g.SemiMajorAxis, g.HasSemiMajorAxis = a, true
		g.SemiMinorAxis = p / math.Sqrt(omes)
		g.ApoapsisRadius, g.HasApoapsis = p/(1-e), true
		g.SpeedApoapsis = g.AngularMomentum / g.ApoapsisRadius
		g.MeanMotion = math.Sqrt(mu/a) / a
		g.Period, g.HasPeriod = 2*math.Pi/g.MeanMotion, true
		g.SpecificEnergy = -mu / (2 * a)
	case Parabola:
		g.MeanMotion = math.Sqrt(mu/p) / p
		g.HasVInfinity = true
		g.AsymptoteAnomaly, g.TurnAngle = math.Pi, math.Pi
	case Hyperbola:
		emos := (e - 1) * (e + 1)
		a := -p / emos
		g.SemiMajorAxis, g.HasSemiMajorAxis = a, true
		g.SemiMinorAxis = p / math.Sqrt(emos)
		g.MeanMotion = math.Sqrt(mu/-a) / -a
		g.SpecificEnergy = -mu / (2 * a)
		g.VInfinity, g.HasVInfinity = math.Sqrt(-mu/a), true
		g.AsymptoteAnomaly = math.Acos(-1 / e)
		g.TurnAngle = 2 * math.Asin(1/e)
	}
	if !finite(g.SemiMajorAxis) || !finite(g.ApoapsisRadius) || !finite(g.Period) || !finite(g.SemiMinorAxis) {
		// e so close to 1 that a overflows: report it as the parabola
		// it is indistinguishable from.
		return GeometryOf(mu, Elements{P: p, E: 1})
	}
	return g, nil
}

// GeometryOfState returns [GeometryOf] the elements of s.
func GeometryOfState(mu float64, s State) (Geometry, error) {
	el, err := ElementsFromState(mu, s)
	if err != nil {
		return Geometry{}, err
	}
	return GeometryOf(mu, el)
}

// FlightPathAngle returns the flight-path angle of s in rad, in
// [-pi/2, pi/2]: the elevation of the velocity above the local horizontal
// (the plane normal to r), positive while the radius grows. It is 0 when
// r or v is zero.
func FlightPathAngle(s State) float64 {
	return math.Atan2(dot(s.R, s.V), norm(cross(s.R, s.V)))
}

// Period returns the period 2 pi sqrt(a^3/mu) in s of an ellipse of
// semi-major axis a (km) about a body with gravitational parameter mu
// (km^3/s^2). Errors wrap [ErrInvalidMu], or [ErrOpenOrbit] for a <= 0.
func Period(mu, a float64) (float64, error) {
	const op = "Period"
	if !validMu(mu) {
		return 0, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	if !(a > 0) || math.IsInf(a, 1) {
		return 0, inputErr(op, ErrOpenOrbit, fmtVal("a", a, "km"))
	}
	return 2 * math.Pi * a * math.Sqrt(a/mu), nil
}

// SemiMajorAxisFromPeriod returns the semi-major axis in km of the ellipse
// with period T (s) about a body with gravitational parameter mu
// (km^3/s^2): a = (mu (T/2pi)^2)^(1/3), Kepler's third law. For T equal to
// the body's sidereal rotation period this is the radius of the
// stationary orbit. Errors wrap [ErrInvalidMu] or [ErrPeriod].
func SemiMajorAxisFromPeriod(mu, T float64) (float64, error) {
	const op = "SemiMajorAxisFromPeriod"
	if !validMu(mu) {
		return 0, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	if !(T > 0) || math.IsInf(T, 1) {
		return 0, inputErr(op, ErrPeriod, fmtVal("T", T, "s"))
	}
	x := T / (2 * math.Pi)
	return math.Cbrt(mu * x * x), nil
}

// VisViva returns the speed in km/s at radius r (km) on a conic of
// semi-major axis a (km; negative for a hyperbola, 0 for a parabola as in
// [Elements]) about a body with gravitational parameter mu (km^3/s^2):
// v = sqrt(mu (2/r - 1/a)). Errors wrap [ErrInvalidMu], [ErrNonFinite], or
// [ErrRadius] when r <= 0 or r > 2a (beyond the apoapsis of any ellipse of
// that size).
func VisViva(mu, r, a float64) (float64, error) {
	const op = "VisViva"
	if !validMu(mu) {
		return 0, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	}
	if !finite(r) || !finite(a) {
		return 0, inputErr(op, ErrNonFinite, fmtVal("r", r, "km")+", "+fmtVal("a", a, "km"))
	}
	if !(r > 0) {
		return 0, inputErr(op, ErrRadius, fmtVal("r", r, "km"))
	}
	x := 2 / r
	if a != 0 {
		x -= 1 / a
	}
	if x < 0 {
		return 0, inputErr(op, ErrRadius, fmtVal("r", r, "km")+" > 2a, "+fmtVal("a", a, "km"))
	}
	return math.Sqrt(mu * x), nil
}
