package orbit

import "math"

// TropicalYear is the mean tropical year in SI seconds:
// 365.2421896698 days of 86400 s, the constant term of Laskar's
// expression for the mean tropical year at J2000 (J. Laskar, "Secular
// terms of classical planetary theories using the results of general
// theory", Astronomy and Astrophysics 157, 59-70, 1986; value from memory).
const TropicalYear = 365.2421896698 * 86400

// SunMeanMotion is the mean motion of the Sun along the ecliptic as seen
// from the Earth, 2 pi per tropical year, in rad/s
// (1.99106385e-7 rad/s = 0.98564736 deg/day). A sun-synchronous orbit's
// node must advance at this rate.
const SunMeanMotion = 2 * math.Pi / TropicalYear

// J2Rates returns the secular (orbit-averaged, first order in J2) rates
// in rad/s of the right ascension of the ascending node, the argument of
// periapsis and the mean anomaly of an elliptic orbit of semi-major axis
// a (km), eccentricity e and inclination i (rad) about a body with
// gravitational parameter mu (km^3/s^2), reference radius re (km) and
// zonal coefficient j2 (unnormalized):
//
//	n0 = sqrt(mu/a^3),  k = j2 (re/p)^2,  p = a(1-e^2),  eta = sqrt(1-e^2)
//	raanDot = -3/2 n0 k cos i
//	argpDot =  3/4 n0 k (5 cos^2 i - 1)
//	meanAnomalyDot = n0 (1 + 3/4 k eta (3 cos^2 i - 1))
//
// Here a is the mean semi-major axis, so meanAnomalyDot includes the J2
// correction of the mean motion. Errors wrap [ErrInvalidMu], [ErrJ2]
// (re not positive, j2 not finite), [ErrOpenOrbit] (e >= 1 or a <= 0),
// [ErrEccentricity] or [ErrNonFinite].
func J2Rates(mu, re, j2, a, e, i float64) (raanDot, argpDot, meanAnomalyDot float64, err error) {
	n0, k, eta, err := j2Setup("J2Rates", mu, re, j2, a, e)
	if err != nil {
		return 0, 0, 0, err
	}
	if !finite(i) {
		return 0, 0, 0, inputErr("J2Rates", ErrNonFinite, fmtVal("i", i, "rad"))
	}
	c := math.Cos(i)
	c2 := c * c
	raanDot = -1.5 * n0 * k * c
	argpDot = 0.75 * n0 * k * (5*c2 - 1)
	meanAnomalyDot = n0 * (1 + 0.75*k*eta*(3*c2-1))
	return raanDot, argpDot, meanAnomalyDot, nil
}

func j2Setup(op string, mu, re, j2, a, e float64) (n0, k, eta float64, err error) {
	switch {
	case !validMu(mu):
		return 0, 0, 0, inputErr(op, ErrInvalidMu, fmtVal("mu", mu, "km^3/s^2"))
	case !(re > 0) || math.IsInf(re, 1) || !finite(j2):
		return 0, 0, 0, inputErr(op, ErrJ2, fmtVal("re", re, "km")+", "+fmtVal("j2", j2, ""))
	case !finite(e) || e < 0:
		return 0, 0, 0, inputErr(op, ErrEccentricity, fmtVal("e", e, ""))
	case e >= 1 || !(a > 0) || math.IsInf(a, 1):
		return 0, 0, 0, inputErr(op, ErrOpenOrbit, fmtVal("a", a, "km")+", "+fmtVal("e", e, ""))
	}
	omes := (1 - e) * (1 + e)
	p := a * omes
	n0 = math.Sqrt(mu/a) / a
	q := re / p
	return n0, j2 * q * q, math.Sqrt(omes), nil
}

// SunSynchronousInclination returns the inclination (rad) at which the
// secular J2 nodal rate of an elliptic orbit of semi-major axis a (km)
// and eccentricity e equals [SunMeanMotion]:
//
//	cos i = -SunMeanMotion / (3/2 n0 j2 (re/p)^2)
//
// with n0 = sqrt(mu/a^3) as in [J2Rates]. For an oblate body (j2 > 0) the
// orbit is retrograde, i in (90 deg, 180 deg]. Errors wrap
// [ErrNoSunSynchronous] when |cos i| > 1 (the orbit is too high for J2 to
// turn its plane fast enough, or j2 = 0), and otherwise the errors of
// [J2Rates].
func SunSynchronousInclination(mu, re, j2, a, e float64) (float64, error) {
	const op = "SunSynchronousInclination"
	n0, k, _, err := j2Setup(op, mu, re, j2, a, e)
	if err != nil {
		return 0, err
	}
	c := -SunMeanMotion / (1.5 * n0 * k)
	if !(math.Abs(c) <= 1) {
		return 0, inputErr(op, ErrNoSunSynchronous, fmtVal("a", a, "km")+", "+fmtVal("e", e, "")+", "+fmtVal("cos i", c, ""))
	}
	return math.Acos(c), nil
}

// CriticalInclination returns the prograde critical inclination
// arccos(1/sqrt(5)) = 63.4349488 deg in rad, at which the secular J2 rate
// of the argument of periapsis vanishes (5 cos^2 i = 1). The retrograde
// solution is pi minus this value.
func CriticalInclination() float64 { return math.Acos(1 / math.Sqrt(5)) }
