package transfer

import "math"

// Phasing returns the two-burn manoeuvre that lets a chaser in a circular
// orbit of radius r (km) meet a target in the same orbit: the chaser burns
// tangentially onto a phasing ellipse with one apsis at r, flies revs (>= 1)
// complete revolutions on it while the target also makes revs revolutions,
// and burns back onto the circle where the target then is.
//
// phaseAngle (rad) is the target's angular position minus the chaser's along
// the direction of motion, strictly between -2π and 2π. A target ahead
// (phaseAngle > 0, the chaser lags) needs a shorter period: the phasing orbit
// drops below r, which is its apoapsis. A target behind (phaseAngle < 0, the
// chaser leads) needs a longer period: the phasing orbit rises above r,
// which is its periapsis. A target 300 deg ahead can also be reached as one
// 60 deg behind; call Phasing with both and compare.
//
// The time is (2π revs - phaseAngle) / n with n = sqrt(mu/r^3), the phasing
// period is that time over revs, and Kepler's third law gives its
// semi-major axis. minRadius (km, >= 0 and below r) is the smallest allowed
// periapsis radius, typically the body's radius plus a safe altitude; a
// phasing orbit reaching below it is refused with a *PhasingError (so is
// one whose periapsis would not be positive, even with minRadius = 0).
func Phasing(mu, r, phaseAngle float64, revs int, minRadius float64) (Plan, error) {
	const fn = "Phasing"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r", r); err != nil {
		return Plan{}, err
	}
	if !(math.Abs(phaseAngle) < 2*math.Pi) {
		return Plan{}, &InputError{Func: fn, Param: "phaseAngle", Value: phaseAngle, Err: ErrPhaseAngle}
	}
	if revs < 1 {
		return Plan{}, &InputError{Func: fn, Param: "revs", Value: float64(revs), Err: ErrRevs}
	}
	if !(minRadius >= 0 && minRadius < r) {
		return Plan{}, &InputError{Func: fn, Param: "minRadius", Value: minRadius, Err: ErrMinRadius}
	}
	n := math.Sqrt(mu / (r * r * r))
	k := float64(revs)
	t := (2*math.Pi*k - phaseAngle) / n
	tph := t / k
	// Kepler's third law: a = (mu (T / 2π)^2)^(1/3), written as
	// r ((T/T0)^2)^(1/3) with T0 = 2π/n, the circular period.
	a := r * math.Cbrt((tph*n/(2*math.Pi))*(tph*n/(2*math.Pi)))
	other := 2*a - r
	if other <= 0 || other < minRadius {
		return Plan{}, &PhasingError{Periapsis: other, MinRadius: minRadius}
	}
	vc := math.Sqrt(mu / r)
	vp := visViva(mu, r, a)
	nu := anomalyAt(r, other)
	ph := leg(mu, "phasing", r, other, t)
	p := Plan{
		Method: MethodPhasing,
		Burns: []Burn{
			{Label: "phasing entry", Radius: r, TrueAnomaly: nu, DeltaV: math.Abs(vp - vc), SpeedChange: vp - vc},
			{Label: "phasing exit", Radius: r, TrueAnomaly: nu, DeltaV: math.Abs(vc - vp), SpeedChange: vc - vp, Time: t},
		},
		Legs: []Leg{ph},
		Revs: revs,
	}
	if err := finish(fn, &p); err != nil {
		return Plan{}, err
	}
	return p, nil
}
