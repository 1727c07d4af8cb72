package lambert

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// Branch selects one of the two solutions that exist for a given number of
// complete revolutions N > 0. It is ignored for N = 0. See the package
// documentation for the geometry of each branch.
type Branch int

const (
	// Left is Izzo's solution with x < x_M: the larger swept eccentric
	// anomaly (nearer 2π(N+1)); for long flights the period tends to tof/(N+1).
	// It is the zero value.
	Left Branch = iota
	// Right is Izzo's solution with x > x_M: the smaller swept eccentric
	// anomaly (nearer 2πN); for long flights the period tends to tof/N.
	Right
)

// String returns "left" or "right".
func (b Branch) String() string {
	switch b {
	case Left:
		return "left"
	case Right:
		return "right"
	}
	return fmt.Sprintf("Branch(%d)", int(b))
}

// Options select which of the solutions of Lambert's problem is wanted. The
// zero value asks for the prograde, zero-revolution (direct) transfer.
type Options struct {
	// Retrograde false (zero value): motion counter-clockwise about +z.
	// Retrograde true: clockwise.
	Retrograde bool
	// Revs is the number of complete revolutions before arrival; 0 (zero
	// value) is the direct transfer. Must not be negative.
	Revs int
	// Branch picks Left (zero value) or Right when Revs > 0.
	Branch Branch
}

// Sentinel errors. They are returned wrapped in *InputError or *RevsError;
// test for them with errors.Is.
var (
	ErrMu             = errors.New("lambert: gravitational parameter must be positive and finite")
	ErrPosition       = errors.New("lambert: position must be finite and not zero")
	ErrTimeOfFlight   = errors.New("lambert: time of flight must be positive and finite")
	ErrRevs           = errors.New("lambert: number of revolutions must not be negative")
	ErrBranch         = errors.New("lambert: branch must be Left or Right")
	ErrPlaneUndefined = errors.New("lambert: transfer plane undefined: the positions are collinear with the centre (transfer angle 0 or 180 deg); move one end point off that line or split the transfer")
	ErrNoSolution     = errors.New("lambert: no solution: time of flight below the minimum for the requested revolutions")
	ErrNoConvergence  = errors.New("lambert: iteration did not converge")
)

// InputError reports a bad input: which one, its value, and the sentinel.
type InputError struct {
	Param string  // e.g. "mu", "r1", "tof", "transfer angle (deg)"
	Value float64 // the offending value (a norm for vectors)
	Err   error   // one of the sentinel errors
}

func (e *InputError) Error() string {
	return fmt.Sprintf("lambert: %s = %g: %s", e.Param, e.Value, strings.TrimPrefix(e.Err.Error(), "lambert: "))
}

func (e *InputError) Unwrap() error { return e.Err }

// RevsError reports a time of flight too short for the requested number of
// complete revolutions. It wraps ErrNoSolution.
type RevsError struct {
	Revs   int     // requested complete revolutions
	TOF    float64 // requested time of flight, s
	MinTOF float64 // shortest time of flight with Revs revolutions, s
}

func (e *RevsError) Error() string {
	return fmt.Sprintf("lambert: no solution with %d revolutions in %.6g s: the minimum for this geometry is %.6g s; lengthen the time of flight or ask for fewer revolutions",
		e.Revs, e.TOF, e.MinTOF)
}

func (e *RevsError) Unwrap() error { return ErrNoSolution }

// collinearSin is the sine of the transfer angle below which the end points
// count as collinear with the centre.
const collinearSin = 1e-12

// problem holds the non-dimensional geometry of one Lambert problem
// (notation of Izzo 2015).
type problem struct {
	mu      float64
	r1n     float64 // |r1|, km
	r2n     float64 // |r2|, km
	c       float64 // chord, km
	s       float64 // semi-perimeter, km
	lam     float64 // λ, signed
	lam2    float64 // λ²
	oml2    float64 // 1 - λ² = c/s, computed without cancellation
	sigma   float64 // sqrt(1 - ρ²), ρ = (r1 - r2)/c
	tNorm   float64 // sqrt(2 mu / s³), 1/s
	ir1     [3]float64
	ir2     [3]float64
	it1     [3]float64
	it2     [3]float64
	angleSw float64 // transfer angle, rad, for messages
}

// Solve returns the velocities v1 at r1 and v2 at r2 (km/s) of the two-body
// orbit about a body of gravitational parameter mu (km^3/s^2) that leaves r1
// and reaches r2 (km) after tof seconds, with the direction, number of
// complete revolutions and branch chosen by opts.
//
// Errors: ErrMu, ErrPosition (zero or non-finite position), ErrTimeOfFlight,
// ErrRevs, ErrBranch and ErrPlaneUndefined (inside *InputError);
// ErrNoSolution (inside *RevsError, which carries the minimum time of flight)
// when opts.Revs > 0 and tof is too short; ErrNoConvergence should not occur
// and is reported rather than hidden.
func Solve(mu float64, r1, r2 [3]float64, tof float64, opts Options) (v1, v2 [3]float64, err error) {
	var p problem
	if err = p.setup(mu, r1, r2, tof, opts); err != nil {
		return v1, v2, err
	}
	T := tof * p.tNorm
	var x float64
	if opts.Revs == 0 {
		x, err = p.solveSingle(T)
	} else {
		x, err = p.solveMulti(T, opts.Revs, opts.Branch, tof)
	}
	if err != nil {
		return v1, v2, err
	}
	v1, v2 = p.velocities(x)
	for i := range 3 {
		if !finite(v1[i]) || !finite(v2[i]) {
			return [3]float64{}, [3]float64{}, &InputError{Param: "tof", Value: tof, Err: ErrNoConvergence}
		}
	}
	return v1, v2, nil
}

// MinTimeOfFlight returns the shortest time of flight (s) for which a
// solution with opts.Revs complete revolutions exists between r1 and r2 in the
// direction opts.Retrograde; opts.Branch is ignored. For Revs = 0 it is 0: a
// direct transfer exists for every positive time of flight (fast ones are
// hyperbolic).
func MinTimeOfFlight(mu float64, r1, r2 [3]float64, opts Options) (float64, error) {
	opts.Branch = Left
	var p problem
	if err := p.setup(mu, r1, r2, 1, opts); err != nil {
		return 0, err
	}
	if opts.Revs == 0 {
		return 0, nil
	}
	_, tmin, err := p.minimumT(opts.Revs)
	if err != nil {
		return 0, err
	}
	return tmin / p.tNorm, nil
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

func norm(a [3]float64) float64 { return math.Sqrt(a[0]*a[0] + a[1]*a[1] + a[2]*a[2]) }

func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}

func scale(k float64, a [3]float64) [3]float64 { return [3]float64{k * a[0], k * a[1], k * a[2]} }

func (p *problem) setup(mu float64, r1, r2 [3]float64, tof float64, o Options) error {
	if !finite(mu) || mu <= 0 {
		return &InputError{Param: "mu", Value: mu, Err: ErrMu}
	}
	if !finite(tof) || tof <= 0 {
		return &InputError{Param: "tof", Value: tof, Err: ErrTimeOfFlight}
	}
	if o.Revs < 0 {
		return &InputError{Param: "revs", Value: float64(o.Revs), Err: ErrRevs}
	}
	if o.Branch != Left && o.Branch != Right {
		return &InputError{Param: "branch", Value: float64(o.Branch), Err: ErrBranch}
	}
	p.mu = mu
	p.r1n, p.r2n = norm(r1), norm(r2)
	if !finite(p.r1n) || p.r1n == 0 {
		return &InputError{Param: "|r1|", Value: p.r1n, Err: ErrPosition}
	}
	if !finite(p.r2n) || p.r2n == 0 {
		return &InputError{Param: "|r2|", Value: p.r2n, Err: ErrPosition}
	}
	p.ir1 = scale(1/p.r1n, r1)
	p.ir2 = scale(1/p.r2n, r2)
	h := cross(p.ir1, p.ir2)
	sinT := norm(h)
	cosT := p.ir1[0]*p.ir2[0] + p.ir1[1]*p.ir2[1] + p.ir1[2]*p.ir2[2]
	p.angleSw = math.Atan2(sinT, cosT)
	if sinT <= collinearSin {
		return &InputError{Param: "transfer angle (deg)", Value: math.Round(p.angleSw*180/math.Pi*1e9) / 1e9, Err: ErrPlaneUndefined}
	}
	ih := scale(1/sinT, h)
	c := [3]float64{r2[0] - r1[0], r2[1] - r1[1], r2[2] - r1[2]}
	p.c = norm(c)
	p.s = 0.5 * (p.c + p.r1n + p.r2n)
	// λ = sqrt(r1 r2) cos(θ/2) / s and sqrt(1-ρ²) = sqrt(r1 r2) sin(θ/2) * 2/c,
	// with the half-angle functions from |ir1 ± ir2| / 2, which keeps full
	// relative precision near 0 and 180 degrees.
	var sum, dif [3]float64
	for i := range 3 {
		sum[i] = p.ir1[i] + p.ir2[i]
		dif[i] = p.ir2[i] - p.ir1[i]
	}
	sq := math.Sqrt(p.r1n * p.r2n)
	p.lam = sq * 0.5 * norm(sum) / p.s
	p.sigma = math.Min(1, sq*norm(dif)/p.c)
	p.lam2 = p.lam * p.lam
	p.oml2 = p.c / p.s
	if ih[2] < 0 {
		p.lam = -p.lam
		p.it1 = cross(p.ir1, ih)
		p.it2 = cross(p.ir2, ih)
	} else {
		p.it1 = cross(ih, p.ir1)
		p.it2 = cross(ih, p.ir2)
	}
	if o.Retrograde {
		p.lam = -p.lam
		p.it1 = scale(-1, p.it1)
		p.it2 = scale(-1, p.it2)
	}
	p.it1 = scale(1/norm(p.it1), p.it1)
	p.it2 = scale(1/norm(p.it2), p.it2)
	p.tNorm = math.Sqrt(2 * mu / (p.s * p.s * p.s))
	return nil
}

// aux holds the combinations of x and λ that the time of flight and the
// velocities need, each computed without cancellation:
// y = sqrt(1 - λ²(1 - x²)), q = λy - x, p = λy + x, w = y - λx, u = y + λx.
// The identities p·q = (1 - λ²)(λ² - x²(1 + λ²)) and w·u = 1 - λ² give the
// member of each pair that would cancel from the one that does not.
type aux struct{ y, q, p, w, u float64 }

func (p *problem) aux(x float64) aux {
	lam := p.lam
	var a aux
	a.y = math.Sqrt(p.oml2 + p.lam2*x*x)
	lx := lam * x
	switch {
	case lx > 0: // λy ≈ x and y ≈ λx are possible: q and w would cancel
		a.u = a.y + lx
		a.w = p.oml2 / a.u
		a.p = lam*a.y + x
		a.q = p.oml2 * (p.lam2 - x*x*(1+p.lam2)) / a.p
	case lx < 0: // p and u would cancel
		a.w = a.y - lx
		a.u = p.oml2 / a.w
		a.q = lam*a.y - x
		a.p = p.oml2 * (p.lam2 - x*x*(1+p.lam2)) / a.q
	default:
		a.q, a.p, a.w, a.u = lam*a.y-x, lam*a.y+x, a.y, a.y
	}
	return a
}

// tof returns the non-dimensional time of flight T(x) for N revolutions:
// Izzo 2015 eq. 18 (Lancaster's form) with the anomaly ψ taken from atan2 or
// asinh of cancellation-free arguments, and Battin's hypergeometric series
// (Izzo 2015 eq. 20) within 0.01 of the parabola x = 1, where Lancaster's
// form is 0/0.
func (p *problem) tof(x float64, n int) float64 {
	const battin = 0.01
	lam := p.lam
	a := p.aux(x)
	if math.Abs(x-1) < battin {
		eta := a.w
		s1 := 0.5 * (1 - lam - x*eta)
		q := 4.0 / 3.0 * hypergeometricF(s1)
		t := (eta*eta*eta*q + 4*lam*eta) / 2
		if n > 0 {
			rho := math.Abs((x - 1) * (x + 1))
			t += float64(n) * math.Pi / (rho * math.Sqrt(rho))
		}
		return t
	}
	if x < 1 {
		omx2 := (1 - x) * (1 + x)
		sq := math.Sqrt(omx2)
		psi := math.Atan2(sq*a.w, x*a.y+lam*omx2)
		return ((psi+float64(n)*math.Pi)/sq + a.q) / omx2
	}
	e := (x - 1) * (x + 1)
	sq := math.Sqrt(e)
	psi := math.Asinh(sq * a.w)
	return (-a.q - psi/sq) / e
}

// hypergeometricF is the Gauss series 2F1(3, 1; 5/2; z) used by Battin's form.
func hypergeometricF(z float64) float64 {
	sj, cj := 1.0, 1.0
	for j := 0; j < 200; j++ {
		fj := float64(j)
		cj = cj * (3 + fj) * (1 + fj) / (2.5 + fj) * z / (fj + 1)
		sj += cj
		if math.Abs(cj) < 1e-16 {
			break
		}
	}
	return sj
}

// derivatives returns dT/dx, d²T/dx², d³T/dx³ at x where T = T(x)
// (Izzo 2015 eq. 22).
func (p *problem) derivatives(x, t float64) (dt, ddt, dddt float64) {
	l2 := p.lam2
	l3 := l2 * p.lam
	l5 := l3 * l2
	umx2 := 1 - x*x
	y := math.Sqrt(p.oml2 + l2*x*x)
	y2 := y * y
	y3 := y2 * y
	dt = (3*t*x - 2 + 2*l3*x/y) / umx2
	ddt = (3*t + 5*x*dt + 2*p.oml2*l3/y3) / umx2
	dddt = (7*x*ddt + 8*dt - 6*p.oml2*l5*x/(y3*y2)) / umx2
	return dt, ddt, dddt
}

// householder iterates x towards T(x) = target with Householder's
// third-order method; ok is false if it did not settle in maxIter steps.
func (p *problem) householder(target, x float64, n int, tol float64) (float64, bool) {
	const maxIter = 15
	for range maxIter {
		t := p.tof(x, n)
		dt, ddt, dddt := p.derivatives(x, t)
		delta := t - target
		dt2 := dt * dt
		xn := x - delta*(dt2-delta*ddt/2)/(dt*(dt2-delta*ddt)+dddt*delta*delta/6)
		if !finite(xn) {
			return x, false
		}
		if math.Abs(xn-x) < tol {
			return xn, true
		}
		x = xn
	}
	return x, false
}

// bisect finds T(x) = target on [lo, hi] where T(lo) - target and
// T(hi) - target have opposite signs. It is the fallback when Householder's
// iteration does not land on the wanted branch.
func (p *problem) bisect(target, lo, hi float64, n int) (float64, bool) {
	flo := p.tof(lo, n) - target
	for range 200 {
		mid := 0.5 * (lo + hi)
		if mid == lo || mid == hi {
			return mid, true
		}
		fm := p.tof(mid, n) - target
		if fm == 0 {
			return mid, true
		}
		if (fm > 0) == (flo > 0) {
			lo, flo = mid, fm
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi), true
}

func (p *problem) solveSingle(T float64) (float64, error) {
	lam, l2 := p.lam, p.lam2
	l3 := l2 * lam
	t00 := math.Acos(lam) + lam*math.Sqrt(p.oml2)
	t1 := 2.0 / 3.0 * (1 - l3)
	var x0 float64
	switch {
	case T >= t00:
		x0 = -(T - t00) / (T - t00 + 4)
	case T <= t1:
		x0 = t1*(t1-T)/(2.0/5.0*(1-l2*l3)*T) + 1
	default:
		x0 = math.Pow(T/t00, math.Ln2/math.Log(t1/t00)) - 1
	}
	x, ok := p.householder(T, x0, 0, 1e-9)
	if ok && x > -1 {
		return x, nil
	}
	return p.fallbackSingle(T)
}

// fallbackSingle solves T(x) = T for N = 0 by bisection: T(x) decreases
// monotonically on (-1, inf).
func (p *problem) fallbackSingle(T float64) (float64, error) {
	hi := 1.0
	for p.tof(hi, 0) > T {
		hi = 2*hi + 1
		if hi > 1e12 {
			return 0, &InputError{Param: "tof", Value: T / p.tNorm, Err: ErrNoConvergence}
		}
	}
	lo := -1 + 1e-15
	if p.tof(lo, 0) < T {
		return 0, &InputError{Param: "tof", Value: T / p.tNorm, Err: ErrNoConvergence}
	}
	x, _ := p.bisect(T, lo, hi, 0)
	return x, nil
}

// minimumT returns x_M, where T(x) for n revolutions is least, and T(x_M),
// by Halley's iteration on dT/dx = 0 from x = 0 (Izzo 2015 sec. 3).
func (p *problem) minimumT(n int) (xm, tm float64, err error) {
	x := 0.0
	t := math.Acos(p.lam) + p.lam*math.Sqrt(p.oml2) + float64(n)*math.Pi
	for range 30 {
		dt, ddt, dddt := p.derivatives(x, t)
		xn := x
		if dt != 0 {
			xn = x - dt*ddt/(ddt*ddt-dt*dddt/2)
		}
		if !finite(xn) || xn <= -1 || xn >= 1 {
			return 0, 0, &InputError{Param: "revs", Value: float64(n), Err: ErrNoConvergence}
		}
		done := math.Abs(xn-x) < 1e-13
		x = xn
		t = p.tof(x, n)
		if done {
			return x, t, nil
		}
	}
	return 0, 0, &InputError{Param: "revs", Value: float64(n), Err: ErrNoConvergence}
}

func (p *problem) solveMulti(T float64, n int, b Branch, tofSec float64) (float64, error) {
	xm, tm, err := p.minimumT(n)
	if err != nil {
		return 0, err
	}
	if T < tm {
		return 0, &RevsError{Revs: n, TOF: tofSec, MinTOF: tm / p.tNorm}
	}
	fn := float64(n)
	var x0 float64
	if b == Left {
		tmp := math.Pow((fn*math.Pi+math.Pi)/(8*T), 2.0/3.0)
		x0 = (tmp - 1) / (tmp + 1)
	} else {
		tmp := math.Pow(8*T/(fn*math.Pi), 2.0/3.0)
		x0 = (tmp - 1) / (tmp + 1)
	}
	x, ok := p.householder(T, x0, n, 1e-11)
	if ok && ((b == Left && x > -1 && x <= xm) || (b == Right && x >= xm && x < 1)) {
		return x, nil
	}
	return p.fallbackMulti(T, n, b, xm), nil
}

// fallbackMulti solves T(x) = T for n > 0 revolutions on the wanted branch
// by bisection: T(x) decreases on (-1, x_M] and increases on [x_M, 1).
func (p *problem) fallbackMulti(T float64, n int, b Branch, xm float64) float64 {
	const edge = 1e-15
	var x float64
	if b == Left {
		x, _ = p.bisect(T, -1+edge, xm, n)
	} else {
		x, _ = p.bisect(T, xm, 1-edge, n)
	}
	return x
}

// velocities reconstructs v1 and v2 from x (Izzo 2015 sec. 2, Algorithm 1),
// with the cancellation-free combinations of aux.
func (p *problem) velocities(x float64) (v1, v2 [3]float64) {
	gamma := math.Sqrt(p.mu * p.s / 2)
	rho := (p.r1n - p.r2n) / p.c
	a := p.aux(x)
	vr1 := gamma * (a.q - rho*a.p) / p.r1n
	vr2 := -gamma * (a.q + rho*a.p) / p.r2n
	vt := gamma * p.sigma * a.u
	vt1 := vt / p.r1n
	vt2 := vt / p.r2n
	for i := range 3 {
		v1[i] = vr1*p.ir1[i] + vt1*p.it1[i]
		v2[i] = vr2*p.ir2[i] + vt2*p.it2[i]
	}
	return v1, v2
}
