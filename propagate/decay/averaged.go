package decay

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
	"centra/propagate/integrate"
)

// averager evaluates the orbit-averaged rates of the mean elements
// y = (a, ex, ey, i), ex = e cos argp, ey = e sin argp.
type averager struct {
	mu, re, j2, j3 float64
	drag           *forces.Drag
	// Evaluations counts calls of rates.
	evaluations int
}

// averagedRelTol is AveragedRelTol; tests tighten it.
var averagedRelTol = AveragedRelTol

// errDecayed stops the averaged integration when a trial state has no
// periapsis above the centre (only reached by a trial step far beyond
// reentry).
var errDecayed = errors.New("decay: orbit decayed through the body")

// nodes returns the number of points in eccentric anomaly of the average
// over one revolution. The density along the orbit varies as
// exp(beta cos E) with beta = a e / H (H the density scale height near
// periapsis); the N-point trapezoidal rule of a periodic function then
// errs by about 2 exp(-N^2 / (2 beta)), below 1e-8 for N >= 6.1 sqrt(beta).
// At least 32 points follow the oblate shape of the Earth (a height term
// in cos 2u) and the short-period terms (up to 3u).
func (av *averager) nodes(a, e float64) int {
	hp := a*(1-e) - av.re
	r0, r1 := av.drag.DensityAtHeight(hp), av.drag.DensityAtHeight(hp+1)
	h := 50.0
	if r0 > 0 && r1 > 0 && r0 > r1 {
		h = 1 / math.Log(r0/r1)
	}
	h = math.Max(h, 1)
	beta := a * e / h
	n := 16 + 8*int(math.Ceil(0.8*math.Sqrt(beta)))
	n = (n + 7) / 8 * 8
	return min(n, 2048)
}

// point returns the osculating state at eccentric anomaly E of the mean
// orbit (a, e, i, argp) with the node on +x (the forces are symmetric
// about z), with the mean-orbit quantities the Gauss equations need.
type point struct {
	s          orbit.State
	r, nu, u   float64
	sinNu      float64
	sinU, cosU float64
}

func (av *averager) point(a, e, i, argp, cosE, sinE float64) (point, error) {
	eta := math.Sqrt((1 - e) * (1 + e))
	den := 1 - e*cosE
	cosNu := (cosE - e) / den
	sinNu := eta * sinE / den
	nu := math.Atan2(sinNu, cosNu)
	u := argp + nu
	mean := orbit.Elements{A: a, P: a * eta * eta, E: e, I: i, ArgP: argp, Nu: nu}
	osc, err := orbit.MeanToOsculating(av.mu, av.re, av.j2, mean)
	if err != nil {
		return point{}, err
	}
	s, err := orbit.StateFromElements(av.mu, osc)
	if err != nil {
		return point{}, err
	}
	su, cu := math.Sincos(u)
	return point{s: s, r: a * den, nu: nu, u: u, sinNu: sinNu, sinU: su, cosU: cu}, nil
}

// elements returns a, e, i, argp of y, or an error when y is no orbit.
func elementsOf(y []float64, re float64) (a, e, i, argp float64, err error) {
	a, ex, ey, i := y[0], y[1], y[2], y[3]
	e = math.Hypot(ex, ey)
	if !(a > 0) || !(e < 0.99) || !(a*(1-e) > 0.5*re) || math.IsNaN(i) {
		return 0, 0, 0, 0, errDecayed
	}
	if e > 0 {
		argp = math.Atan2(ey, ex)
	}
	return a, e, math.Min(math.Max(i, 0), math.Pi), argp, nil
}

// rates writes dy/dt of the mean elements y into dst.
func (av *averager) rates(dst []float64, _ float64, y []float64) error {
	av.evaluations++
	a, e, i, argp, err := elementsOf(y, av.re)
	if err != nil {
		return err
	}
	ex, ey := y[1], y[2]
	p := a * (1 - e) * (1 + e)
	h := math.Sqrt(av.mu * p)
	n := av.nodes(a, e)
	var da, dex, dey, di float64
	for k := range n {
		sinE, cosE := math.Sincos(2 * math.Pi * float64(k) / float64(n))
		pt, err := av.point(a, e, i, argp, cosE, sinE)
		if err != nil {
			return err
		}
		f := av.drag.Acceleration(pt.s)
		// RSW frame of the osculating state.
		rr, vv := pt.s.R, pt.s.V
		rn := math.Sqrt(rr[0]*rr[0] + rr[1]*rr[1] + rr[2]*rr[2])
		rh := [3]float64{rr[0] / rn, rr[1] / rn, rr[2] / rn}
		hv := [3]float64{rr[1]*vv[2] - rr[2]*vv[1], rr[2]*vv[0] - rr[0]*vv[2], rr[0]*vv[1] - rr[1]*vv[0]}
		hn := math.Sqrt(hv[0]*hv[0] + hv[1]*hv[1] + hv[2]*hv[2])
		wh := [3]float64{hv[0] / hn, hv[1] / hn, hv[2] / hn}
		sh := [3]float64{wh[1]*rh[2] - wh[2]*rh[1], wh[2]*rh[0] - wh[0]*rh[2], wh[0]*rh[1] - wh[1]*rh[0]}
		fr := f[0]*rh[0] + f[1]*rh[1] + f[2]*rh[2]
		fs := f[0]*sh[0] + f[1]*sh[1] + f[2]*sh[2]
		fw := f[0]*wh[0] + f[1]*wh[1] + f[2]*wh[2]
		w := 1 - e*cosE // dM = (1 - e cos E) dE
		r := pt.r
		da += w * (2 * a * a / h) * (e*pt.sinNu*fr + p/r*fs)
		dex += w / h * (p*pt.sinU*fr + ((p+r)*pt.cosU+r*ex)*fs)
		dey += w / h * (-p*pt.cosU*fr + ((p+r)*pt.sinU+r*ey)*fs)
		di += w * r * pt.cosU * fw / h
	}
	inv := 1 / float64(n)
	da, dex, dey, di = da*inv, dex*inv, dey*inv, di*inv
	// Secular J2 rotation of periapsis about the long-period J3 frozen
	// point (0, e_f): d(ex)/dt = -argpDot (ey - e_f), d(ey)/dt = argpDot ex,
	// with argpDot e_f finite at the critical inclination.
	if av.j2 != 0 {
		_, argpDot, _, err := orbit.J2Rates(av.mu, av.re, av.j2, a, e, i)
		if err != nil {
			return err
		}
		ef := 0.0
		if av.j3 != 0 {
			ef = -av.j3 * av.re * math.Sin(i) / (2 * av.j2 * a)
		}
		dex += -argpDot * (ey - ef)
		dey += argpDot * ex
	}
	dst[0], dst[1], dst[2], dst[3] = da, dex, dey, di
	return nil
}

// minHeight returns the lowest geodetic height in km over the osculating
// orbit of the mean elements y (64 points, periapsis included).
func (av *averager) minHeight(y []float64) float64 {
	a, e, i, argp, err := elementsOf(y, av.re)
	if err != nil {
		return -1e3
	}
	const m = 32
	hmin := math.Inf(1)
	for k := range m {
		sinE, cosE := math.Sincos(2 * math.Pi * float64(k) / m)
		pt, err := av.point(a, e, i, argp, cosE, sinE)
		if err != nil {
			return -1e3
		}
		hmin = math.Min(hmin, av.drag.Height(pt.s.R))
	}
	return hmin
}

// averaged integrates the averaged rates from the mean elements mean0.
func averaged(c *Config, mean0 orbit.Elements) (Result, error) {
	av := &averager{mu: c.Gravity.Mu, re: c.Gravity.Re, j2: c.j(2), j3: c.j(3), drag: c.Drag}
	a0 := mean0.A
	if a0 == 0 {
		a0 = mean0.P / ((1 - mean0.E) * (1 + mean0.E))
	}
	sw, cw := math.Sincos(mean0.ArgP)
	y0 := []float64{a0, mean0.E * cw, mean0.E * sw, mean0.I}
	set := integrate.Settings{
		RelTolVec: []float64{averagedRelTol, averagedRelTol, averagedRelTol, averagedRelTol},
		AbsTolVec: []float64{1e-5, 1e-8, 1e-8, 1e-8},
		MaxSteps:  10_000_000,
		// The eccentricity vector turns with the apsidal rate (a period of
		// two months or more in LEO); steps of at most 5 days follow it
		// and let the reentry event be found.
		MaxStep: 30 * 86400,
	}
	res := Result{Initial: mean0, Method: Averaged}
	hr := c.ReentryAltitude
	obs := &integrate.Observer{
		Events:   []integrate.Event{{G: func(_ float64, y []float64) float64 { return av.minHeight(y) - hr }, Direction: -1, Terminal: true}},
		EventTol: 1e-3,
	}
	step := c.HistoryStep
	if c.Progress != nil && step == 0 {
		step = c.MaxSpan / 100
	}
	nextHistory := 0.0
	if step > 0 {
		obs.Step = step
		obs.Sample = func(t float64, y []float64) error {
			a, e, _, _, err := elementsOf(y, av.re)
			if err != nil {
				return nil
			}
			smp := Sample{T: t, PerigeeAltKm: a*(1-e) - av.re, ApogeeAltKm: a*(1+e) - av.re}
			if c.HistoryStep > 0 && t >= nextHistory-1e-6 {
				res.History = append(res.History, smp)
				nextHistory += c.HistoryStep
			}
			if c.Progress != nil {
				c.Progress(t, smp.PerigeeAltKm)
			}
			return nil
		}
	}
	y := make([]float64, 4)
	t0 := 0.0
	var tEnd float64
	for restart := 0; ; restart++ {
		sol, err := integrate.New(4, av.rates, set)
		if err != nil {
			return Result{}, fmt.Errorf("%w: %w", ErrConfig, err)
		}
		tEnd, err = sol.Integrate(y, t0, y0, c.MaxSpan, obs)
		res.Steps += sol.Stats().Steps
		if err == nil {
			break
		}
		var se *integrate.StepError
		if errors.As(err, &se) && errors.Is(err, errDecayed) && restart < 40 && len(se.Y) == 4 {
			// A trial step went through the body before the reentry
			// event was seen: start again from the last accepted state
			// with steps a tenth as long.
			t0 = se.T
			copy(y0, se.Y)
			set.MaxStep = math.Max(math.Abs(se.H)/10, 1)
			set.InitialStep = set.MaxStep
			continue
		}
		if errors.As(err, &se) {
			return res, &propagate.StepError{T: se.T, Err: se.Err}
		}
		return res, err
	}
	res.T = tEnd
	res.Reentered = tEnd < c.MaxSpan*(1-1e-12)
	a, e, i, argp, err := elementsOf(y, av.re)
	if err == nil {
		res.Final = orbit.Elements{A: a, P: a * (1 - e) * (1 + e), E: e, I: i, ArgP: wrap(argp)}
		if c.HistoryStep > 0 {
			res.History = append(res.History, sampleOf(av.re, tEnd, res.Final))
		}
	}
	return res, nil
}

func wrap(x float64) float64 {
	x = math.Mod(x, 2*math.Pi)
	if x < 0 {
		x += 2 * math.Pi
	}
	return x
}
