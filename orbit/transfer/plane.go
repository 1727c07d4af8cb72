package transfer

import "math"

// PlaneChangeDV returns the delta-v (km/s) of a burn that turns the orbit
// plane by di (rad, in [0, π]) at a node where the speed is v (km/s) and the
// flight path angle (above the local horizontal) is gamma (rad, in
// (-π/2, π/2)). Only the horizontal component v cos(gamma) turns, so
// dv = 2 v cos(gamma) sin(di/2); on a circular orbit gamma = 0.
func PlaneChangeDV(v, gamma, di float64) (float64, error) {
	const fn = "PlaneChangeDV"
	if !finite(v) || v <= 0 {
		return 0, &InputError{Func: fn, Param: "v", Value: v, Err: ErrSpeed}
	}
	if !(gamma > -math.Pi/2 && gamma < math.Pi/2) {
		return 0, &InputError{Func: fn, Param: "gamma", Value: gamma, Err: ErrFlightPathAngle}
	}
	if err := checkAngle(fn, "di", di); err != nil {
		return 0, err
	}
	dv := 2 * v * math.Cos(gamma) * math.Sin(0.5*di)
	if err := checkResult(fn, dv); err != nil {
		return 0, err
	}
	return dv, nil
}

// PlaneChange returns the single-burn plan that turns the plane of orbit o by
// di (rad, in [0, π]) at true anomaly nu (rad) on it; the burn point must be
// a node of the two planes. The burn changes neither the size nor the shape
// of the orbit. For a circular orbit use Circular(r) (nu is then
// immaterial). Plane changes are cheapest where the horizontal speed is
// least: at apoapsis.
func PlaneChange(mu float64, o Ellipse, nu, di float64) (Plan, error) {
	const fn = "PlaneChange"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkEllipse(fn, "o", o); err != nil {
		return Plan{}, err
	}
	if !finite(nu) {
		return Plan{}, &InputError{Func: fn, Param: "nu", Value: nu, Err: ErrAnomaly}
	}
	if err := checkAngle(fn, "di", di); err != nil {
		return Plan{}, err
	}
	a := o.SemiMajorAxis()
	e := o.Eccentricity()
	p := a * (1 - e) * (1 + e)
	den := 1 + e*math.Cos(nu)
	r := p / den
	v := visViva(mu, r, a)
	gamma := math.Atan2(e*math.Sin(nu), den)
	dv := 2 * v * math.Cos(gamma) * math.Sin(0.5*di)
	nu = math.Mod(nu, 2*math.Pi)
	if nu < 0 {
		nu += 2 * math.Pi
	}
	plan := Plan{
		Method: MethodPlaneChange,
		Burns:  []Burn{{Label: "plane change", Radius: r, TrueAnomaly: nu, DeltaV: dv, PlaneChange: di}},
	}
	if err := finish(fn, &plan); err != nil {
		return Plan{}, err
	}
	return plan, nil
}

// hohmannSpeeds returns the circular speeds at r1 and r2 and the transfer
// ellipse speeds at r1 and r2.
func hohmannSpeeds(mu, r1, r2 float64) (v1, vt1, vt2, v2 float64) {
	v1 = math.Sqrt(mu / r1)
	v2 = math.Sqrt(mu / r2)
	vt1 = math.Sqrt(2 * mu * r2 / (r1 * (r1 + r2)))
	vt2 = math.Sqrt(2 * mu * r1 / (r2 * (r2 + r1)))
	return
}

// HohmannPlaneChangeSplit returns the Hohmann transfer from the circular
// orbit r1 to the circular orbit r2 (km) that also turns the orbit plane by
// di1 (rad) at the first burn and di2 (rad) at the second, each in [0, π];
// each burn is the vector difference of the velocities before and after.
func HohmannPlaneChangeSplit(mu, r1, r2, di1, di2 float64) (Plan, error) {
	const fn = "HohmannPlaneChangeSplit"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r1", r1); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r2", r2); err != nil {
		return Plan{}, err
	}
	if err := checkAngle(fn, "di1", di1); err != nil {
		return Plan{}, err
	}
	if err := checkAngle(fn, "di2", di2); err != nil {
		return Plan{}, err
	}
	return hohmannPlane(fn, mu, r1, r2, di1, di2)
}

func hohmannPlane(fn string, mu, r1, r2, di1, di2 float64) (Plan, error) {
	v1, vt1, vt2, v2 := hohmannSpeeds(mu, r1, r2)
	at := 0.5 * (r1 + r2)
	tof := math.Pi * math.Sqrt(at*at*at/mu)
	split := 0.0
	if di1+di2 > 0 {
		split = di1 / (di1 + di2)
	}
	p := Plan{
		Method: MethodHohmannPlaneChange,
		Burns: []Burn{
			{Label: "departure", Radius: r1, TrueAnomaly: anomalyAt(r1, r2), DeltaV: combine(v1, vt1, di1), SpeedChange: vt1 - v1, PlaneChange: di1},
			{Label: "arrival", Radius: r2, TrueAnomaly: anomalyAt(r2, r1), DeltaV: combine(vt2, v2, di2), SpeedChange: v2 - vt2, PlaneChange: di2, Time: tof},
		},
		Legs:  []Leg{leg(mu, "transfer", r1, r2, tof)},
		Split: split,
	}
	if err := finish(fn, &p); err != nil {
		return Plan{}, err
	}
	return p, nil
}

// HohmannPlaneChange returns the Hohmann transfer from the circular orbit r1
// to the circular orbit r2 (km) that also turns the orbit plane by di (rad,
// in [0, π]), with di split between the two burns so as to minimise the total
// delta-v. Plan.Split is the fraction done at the first burn and each
// Burn.PlaneChange its angle.
//
// The split is found by a coarse scan of [0, 1], Brent's minimisation
// (golden section with parabolic steps; R. P. Brent, Algorithms for
// Minimization without Derivatives, 1973, ch. 5) in the best bracket, and a
// bisection on the analytic derivative of the total that pins the split to
// about 1e-15 (a minimiser alone locates a flat minimum only to about
// sqrt(machine epsilon)). The ends (all the plane change at one burn) are
// considered too.
func HohmannPlaneChange(mu, r1, r2, di float64) (Plan, error) {
	const fn = "HohmannPlaneChange"
	if err := checkMu(fn, mu); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r1", r1); err != nil {
		return Plan{}, err
	}
	if err := checkRadius(fn, "r2", r2); err != nil {
		return Plan{}, err
	}
	if err := checkAngle(fn, "di", di); err != nil {
		return Plan{}, err
	}
	v1, vt1, vt2, v2 := hohmannSpeeds(mu, r1, r2)
	s := optimalSplit(v1, vt1, vt2, v2, di)
	return hohmannPlane(fn, mu, r1, r2, s*di, (1-s)*di)
}

// optimalSplit returns the fraction s in [0, 1] of di done at the first burn
// that minimises combine(v1, vt1, s di) + combine(vt2, v2, (1-s) di).
func optimalSplit(v1, vt1, vt2, v2, di float64) float64 {
	if di == 0 {
		return 0
	}
	total := func(s float64) float64 { return combine(v1, vt1, s*di) + combine(vt2, v2, (1-s)*di) }
	// d total / ds; the 0/0 of a burn with no speed change and no plane
	// change is avoided by evaluating strictly inside (0, 1) only.
	deriv := func(s float64) float64 {
		a := combine(v1, vt1, s*di)
		b := combine(vt2, v2, (1-s)*di)
		return di * (v1*vt1*math.Sin(s*di)/a - vt2*v2*math.Sin((1-s)*di)/b)
	}
	const n = 16
	best, fbest := 0, total(0)
	for i := 1; i <= n; i++ {
		if f := total(float64(i) / n); f < fbest {
			best, fbest = i, f
		}
	}
	lo := math.Max(0, float64(best-1)/n)
	hi := math.Min(1, float64(best+1)/n)
	s, fs := brentMin(total, lo, hi, 1e-12)
	if fs > fbest {
		s = float64(best) / n
	}
	// Polish: bisection on the derivative across a small bracket around s.
	const w = 1e-6
	a, b := math.Max(s-w, 1e-300), math.Min(s+w, 1-1e-16)
	if a < b {
		da, db := deriv(a), deriv(b)
		if da < 0 && db > 0 {
			for range 100 {
				m := 0.5 * (a + b)
				if m <= a || m >= b {
					break
				}
				if deriv(m) < 0 {
					a = m
				} else {
					b = m
				}
			}
			s = 0.5 * (a + b)
		}
	}
	// The ends: all of the plane change at one burn.
	for _, e := range [2]float64{0, 1} {
		if total(e) < total(s) {
			s = e
		}
	}
	return s
}

// brentMin minimises f on [a, b] by Brent's method (golden section search
// with successive parabolic interpolation; Brent 1973, ch. 5, procedure
// localmin). tol is the absolute tolerance on x; the relative one is
// sqrt(machine epsilon).
func brentMin(f func(float64) float64, a, b, tol float64) (xmin, fmin float64) {
	const (
		golden = 0.3819660112501051 // (3 - sqrt(5)) / 2
		eps    = 1.4901161193847656e-08
	)
	v := a + golden*(b-a)
	w, x := v, v
	fx := f(x)
	fv, fw := fx, fx
	var d, e float64
	for range 200 {
		xm := 0.5 * (a + b)
		tol1 := eps*math.Abs(x) + tol/3
		tol2 := 2 * tol1
		if math.Abs(x-xm) <= tol2-0.5*(b-a) {
			break
		}
		parabolic := false
		if math.Abs(e) > tol1 {
			r := (x - w) * (fx - fv)
			q := (x - v) * (fx - fw)
			p := (x-v)*q - (x-w)*r
			q = 2 * (q - r)
			if q > 0 {
				p = -p
			}
			q = math.Abs(q)
			etemp := e
			e = d
			if math.Abs(p) < math.Abs(0.5*q*etemp) && p > q*(a-x) && p < q*(b-x) {
				d = p / q
				u := x + d
				if u-a < tol2 || b-u < tol2 {
					d = math.Copysign(tol1, xm-x)
				}
				parabolic = true
			}
		}
		if !parabolic {
			if x >= xm {
				e = a - x
			} else {
				e = b - x
			}
			d = golden * e
		}
		var u float64
		if math.Abs(d) >= tol1 {
			u = x + d
		} else {
			u = x + math.Copysign(tol1, d)
		}
		fu := f(u)
		if fu <= fx {
			if u >= x {
				a = x
			} else {
				b = x
			}
			v, fv = w, fw
			w, fw = x, fx
			x, fx = u, fu
		} else {
			if u < x {
				a = u
			} else {
				b = u
			}
			if fu <= fw || w == x {
				v, fv = w, fw
				w, fw = u, fu
			} else if fu <= fv || v == x || v == w {
				v, fv = u, fu
			}
		}
	}
	return x, fx
}
