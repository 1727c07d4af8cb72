package propagate

import (
	"fmt"
	"math"

	"centra/orbit"
)

// Tolerances of the checks made by [Checks].
const (
	// CheckTolFactor times Options.RelTol is the relative tolerance of the
	// conservation, period, apsis and areal-rate checks. DOP853's
	// accumulated error in these quantities stays below it with a margin:
	// in the tests, from a factor 4 (e = 0.95 over 30 days with the polar
	// equations) to 10^4, and more than 10 over 100 LEO orbits at the
	// default tolerance (TestChecksMargins). A failure therefore means a
	// broken model, integrator or tolerance, not an unlucky step.
	CheckTolFactor = 1e3
	// J2RateTol is the relative tolerance of the measured secular J2 rates
	// against the first-order closed forms of [orbit.J2Rates]: the
	// difference between osculating and mean elements and the neglected
	// J2^2 terms are a few 1e-3.
	J2RateTol = 0.02
	// zonalPeriodFactor times sum_n |J_n| (Re/p)^n is the tolerance of the
	// nodal period of a zonal model against Kepler's third law with the
	// osculating semi-major axis: the zonal harmonics change the nodal
	// period, and the osculating a differs from the mean a, by that order.
	zonalPeriodFactor = 10
	// areaChunks is the number of equal times over which the swept areas
	// are compared (Kepler's second law).
	areaChunks = 16
)

// Checks propagates s0 over span seconds with model m and returns the
// checks of the result against the laws it must obey:
//
//   - energy_conservation: v^2/2 + U(r), U including the zonal potential,
//     worst deviation over the samples (relative to max(|E0|, mu/r0));
//   - angular_momentum_conservation (point mass: all components, relative
//     to |h0|) or angular_momentum_z_conservation (zonal: the polar
//     component only, relative to |h0|);
//   - third_law_period: the interval between successive periapsides (point
//     mass, e >= 1e-3), ascending nodes (zonal, inclined) or crossings of
//     the initial radius direction, against 2 pi sqrt(a^3/mu);
//   - second_law_areal_rate (point mass, e outside (0.999, 1.001)): the
//     area swept in each of 16 equal times of the span, measured
//     geometrically on the initial conic from the directions of the
//     propagated positions, divided by the time, against h/2; Measured is
//     the worst of the 16;
//   - periapsis_radius, apoapsis_radius (point mass, e >= 1e-3): radii at
//     the located apsides against a(1-e), a(1+e) (p/(1+e) for open orbits);
//   - j2_nodal_regression, j2_apsidal_rotation (J2 the only zonal, elliptic,
//     span of 3 periods or more; nodal: sin i > 0.05; apsidal: e >= 0.05 and
//     |5 cos^2 i - 1| > 0.2): slopes fitted by least squares to the
//     osculating RAAN and argument of periapsis, against [orbit.J2Rates].
//
// Checks that do not apply to the orbit or span are left out. Models with
// a Perturbation are refused (ErrModel): they conserve nothing.
func Checks(m Model, s0 orbit.State, span float64, opt Options) ([]orbit.Check, error) {
	return checks(m, s0, span, opt, m.Mu)
}

// checks is Checks with the gravitational parameter of the laws (the
// conic, Kepler's third law, the J2 rates) given apart from the model's,
// so that tests can show that a wrong propagation fails.
func checks(m Model, s0 orbit.State, span float64, opt Options, mu float64) ([]orbit.Check, error) {
	if m.Perturbation != nil {
		return nil, fmt.Errorf("%w: checks need a conservative model (no perturbation)", ErrModel)
	}
	p, err := New(m, opt)
	if err != nil {
		return nil, err
	}
	if !finiteState(s0) || s0.R == [3]float64{} {
		return nil, fmt.Errorf("%w: %v", ErrState, s0)
	}
	if math.IsNaN(span) || math.IsInf(span, 0) || span == 0 {
		return nil, fmt.Errorf("%w: span %g s", ErrSpan, span)
	}
	zonal := p.field.Degree >= 2
	tolLaw := CheckTolFactor * p.opt.RelTol

	r0 := norm3(s0.R)
	v0 := norm3(s0.V)
	h0 := cross3(s0.R, s0.V)
	h0n := norm3(h0)
	if h0n == 0 {
		return nil, fmt.Errorf("%w: rectilinear motion has no Kepler-law checks", ErrState)
	}
	e0 := p.Energy(s0)
	eScale := math.Max(math.Abs(e0), m.Mu/r0)
	// the conic of the initial state
	ecc := eccVector(mu, s0)
	e := norm3(ecc)
	semiLatus := h0n * h0n / mu
	a := 1 / (2/r0 - v0*v0/mu)
	elliptic := e < 1 && a > 0
	var period float64
	if elliptic {
		period = 2 * math.Pi * math.Sqrt(a*a*a/mu)
	}
	w := scale3(1/h0n, h0)
	pp := scale3(1/r0, s0.R) // periapsis direction; the initial radius for circles
	if e > 1e-12 {
		pp = scale3(1/e, ecc)
	}
	qp := cross3(w, pp)
	sinI := math.Hypot(w[0], w[1])

	// Sampling step: short enough for the eccentric anomaly to advance by
	// less than pi between samples, and dividing the span into
	// areaChunks chunks of equal duration for the second law.
	absSpan := math.Abs(span)
	var step float64
	if elliptic {
		n := 2 * math.Pi / period
		step = math.Min(2*math.Pi/64, 0.5*(1-e)) / n
		step = math.Max(step, absSpan/200000)
	} else {
		step = absSpan / 2000
	}
	chunk := absSpan / areaChunks
	perChunk := int(math.Ceil(chunk / step))
	step = chunk / float64(perChunk)

	// J2 rate checks: conditions
	onlyJ2 := zonal && p.field.J[2] != 0
	for n := 3; n <= p.field.Degree; n++ {
		if p.field.J[n] != 0 {
			onlyJ2 = false
		}
	}
	var el0 orbit.Elements
	wantRates := onlyJ2 && elliptic && absSpan >= 3*period
	if wantRates {
		el0, err = orbit.ElementsFromState(mu, s0)
		if err != nil {
			wantRates = false
		}
	}
	fitNode := wantRates && sinI > 0.05
	ci := math.Cos(el0.I)
	fitApse := wantRates && e >= 0.05 && math.Abs(5*ci*ci-1) > 0.2

	// accumulators
	var worstE, worstH, worstHz, worstHzVal float64
	var worstEState, worstHState float64
	var area areaMeter
	area.init(e, a, semiLatus, pp, qp)
	doArea := !zonal && (e < 0.999 || e > 1.001)
	var worstRate, worstRateVal float64
	var prevX, sweptArea, chunkArea, chunkT float64
	sample := 0
	first := true
	var raanFit, argpFit lineFit
	var raanPrev, argpPrev, raanUnw, argpUnw float64

	out := &Output{Step: step}
	out.OnState = func(t float64, s orbit.State) error {
		if d := math.Abs(p.Energy(s) - e0); d >= worstE {
			worstE, worstEState = d, p.Energy(s)
		}
		h := cross3(s.R, s.V)
		if d := norm3(sub3(h, h0)); d >= worstH {
			worstH, worstHState = d, norm3(h)
		}
		if d := math.Abs(h[2] - h0[2]); d >= worstHz {
			worstHz, worstHzVal = d, h[2]
		}
		if doArea {
			x := area.at(s.R)
			if !first {
				sweptArea += area.delta(prevX, x)
			}
			prevX = x
			if sample%perChunk == 0 {
				if sample > 0 {
					rate := (sweptArea - chunkArea) / (t - chunkT)
					if d := math.Abs(rate - h0n/2); d >= worstRate {
						worstRate, worstRateVal = d, rate
					}
				}
				chunkArea, chunkT = sweptArea, t
			}
		}
		sample++
		if fitNode || fitApse {
			el, err := orbit.ElementsFromState(mu, s)
			if err == nil {
				if first {
					raanUnw, argpUnw = el.RAAN, el.ArgP
				} else {
					raanUnw += wrapPi(el.RAAN - raanPrev)
					argpUnw += wrapPi(el.ArgP - argpPrev)
				}
				raanPrev, argpPrev = el.RAAN, el.ArgP
				raanFit.add(t, raanUnw)
				argpFit.add(t, argpUnw)
			}
		}
		first = false
		return nil
	}
	// events: periapsis, apoapsis, ascending node, initial-direction crossing
	var periT, nodeT, refT []float64 // few: one per orbit
	var worstPeri, worstPeriVal, worstApo, worstApoVal float64
	rp := semiLatus / (1 + e)
	ra := a * (1 + e)
	usePeri := !zonal && e >= 1e-3
	q0 := cross3(w, scale3(1/r0, s0.R))
	out.Events = []Event{
		{Kind: Periapsis},
		{Kind: Apoapsis},
		{Kind: AscendingNode},
		{Name: "initial_direction", Kind: Custom, Direction: 1, G: func(_ float64, s orbit.State) float64 {
			// rises through zero where the radius sweeps past the initial
			// direction (theta = 0 mod 2 pi), falls at theta = pi
			if dot3(s.R, scale3(1/r0, s0.R)) < 0 {
				return 1 // far side: no crossing counted there
			}
			return dot3(s.R, q0)
		}},
	}
	out.OnEvent = func(hit EventHit) error {
		r := norm3(hit.State.R)
		switch hit.Index {
		case 0:
			periT = append(periT, hit.T)
			if d := math.Abs(r - rp); d >= worstPeri {
				worstPeri, worstPeriVal = d, r
			}
		case 1:
			if d := math.Abs(r - ra); d >= worstApo {
				worstApo, worstApoVal = d, r
			}
		case 2:
			nodeT = append(nodeT, hit.T)
		case 3:
			refT = append(refT, hit.T)
		}
		return nil
	}
	if _, err := p.Run(s0, span, out); err != nil {
		return nil, err
	}

	var checks []orbit.Check
	add := func(name, desc string, expected, measured, relErr, tol float64) {
		checks = append(checks, orbit.Check{Name: name, Description: desc, Expected: expected, Measured: measured,
			RelativeError: relErr, Tolerance: tol, Pass: relErr <= tol})
	}
	add("energy_conservation", "specific energy v^2/2 + U (zonal potential included), worst deviation over the span relative to max(|E0|, mu/r0), km^2/s^2",
		e0, worstEState, worstE/eScale, tolLaw)
	if zonal {
		add("angular_momentum_z_conservation", "polar component of the specific angular momentum (the only one the zonal field conserves), worst deviation relative to |h0|, km^2/s",
			h0[2], worstHzVal, worstHz/h0n, tolLaw)
	} else {
		add("angular_momentum_conservation", "specific angular momentum vector, worst |h - h0| relative to |h0|, km^2/s",
			h0n, worstHState, worstH/h0n, tolLaw)
	}
	if elliptic {
		var times []float64
		var how string
		switch {
		case usePeri:
			times, how = periT, "successive periapsides"
		case zonal && sinI > 1e-3:
			times, how = nodeT, "successive ascending nodes"
		default:
			times, how = refT, "successive crossings of the initial radius direction"
		}
		if len(times) >= 2 {
			measured := (times[len(times)-1] - times[0]) / float64(len(times)-1)
			if span < 0 {
				measured = -measured
			}
			tol := tolLaw
			if zonal {
				var sum float64
				for n := 2; n <= p.field.Degree; n++ {
					sum += math.Abs(p.field.J[n]) * math.Pow(p.field.Re/semiLatus, float64(n))
				}
				tol = math.Max(tol, zonalPeriodFactor*sum)
			}
			add("third_law_period", "period from "+how+" against 2 pi sqrt(a^3/mu) with the initial osculating a, s",
				period, measured, math.Abs(measured-period)/period, tol)
		}
	}
	if doArea && !first && worstRateVal != 0 {
		add("second_law_areal_rate", "area swept in each of 16 equal times (geometric, on the initial conic) divided by the time, worst of them, against h/2, km^2/s",
			h0n/2, worstRateVal, worstRate/(h0n/2), tolLaw)
	}
	if !zonal && e >= 1e-3 {
		if len(periT) > 0 {
			add("periapsis_radius", "radius at the located periapsides against the conic's p/(1+e), worst, km",
				rp, worstPeriVal, worstPeri/rp, tolLaw)
		}
		if elliptic && worstApoVal != 0 {
			add("apoapsis_radius", "radius at the located apoapsides against the conic's a(1+e), worst, km",
				ra, worstApoVal, worstApo/ra, tolLaw)
		}
	}
	if fitNode || fitApse {
		raanDot, argpDot, _, err := orbit.J2Rates(mu, p.field.Re, p.field.J[2], el0.A, el0.E, el0.I)
		if err == nil {
			if fitNode {
				got := raanFit.slope()
				add("j2_nodal_regression", "secular RAAN rate fitted to the osculating node against the first-order J2 rate, rad/s",
					raanDot, got, math.Abs(got-raanDot)/math.Abs(raanDot), J2RateTol)
			}
			if fitApse {
				got := argpFit.slope()
				add("j2_apsidal_rotation", "secular argument-of-periapsis rate fitted to the osculating elements against the first-order J2 rate, rad/s",
					argpDot, got, math.Abs(got-argpDot)/math.Abs(argpDot), J2RateTol)
			}
		}
	}
	return checks, nil
}

// areaMeter measures the area swept from the focus along a conic, as a
// function of the direction of the position (Kepler's second law in its
// geometric form): ellipse ab/2 (E - e sin E), hyperbola |a| b/2
// (e sinh H - H), parabola p^2/4 (D + D^3/3), with E, H or D from the true
// anomaly of the position on the conic.
type areaMeter struct {
	e, a, p float64
	pp, qp  [3]float64
	k       float64 // ab/2 or |a|b/2
}

func (m *areaMeter) init(e, a, p float64, pp, qp [3]float64) {
	*m = areaMeter{e: e, a: a, p: p, pp: pp, qp: qp}
	switch {
	case e < 1:
		m.k = a * a * math.Sqrt(1-e*e) / 2
	case e > 1:
		m.k = a * a * math.Sqrt(e*e-1) / 2
	}
}

// at returns the anomaly (E, H or D) of the position r.
func (m *areaMeter) at(r [3]float64) float64 {
	nu := math.Atan2(dot3(r, m.qp), dot3(r, m.pp))
	switch {
	case m.e < 1:
		return math.Atan2(math.Sqrt(1-m.e*m.e)*math.Sin(nu), m.e+math.Cos(nu))
	case m.e > 1:
		return 2 * math.Atanh(math.Sqrt((m.e-1)/(m.e+1))*math.Tan(nu/2))
	}
	return math.Tan(nu / 2)
}

// delta returns the area swept from anomaly x1 to x2 (km^2).
func (m *areaMeter) delta(x1, x2 float64) float64 {
	switch {
	case m.e < 1:
		d := wrapPi(x2 - x1)
		return m.k * (d - m.e*(math.Sin(x2)-math.Sin(x1)))
	case m.e > 1:
		return m.k * (m.e*(math.Sinh(x2)-math.Sinh(x1)) - (x2 - x1))
	}
	return m.p * m.p / 4 * ((x2 - x1) + (x2*x2*x2-x1*x1*x1)/3)
}

// lineFit is a streaming least-squares fit of y = c + slope t.
type lineFit struct {
	n, st, stt, sy, sty float64
	t0, y0              float64
}

func (f *lineFit) add(t, y float64) {
	if f.n == 0 {
		f.t0, f.y0 = t, y
	}
	t -= f.t0
	y -= f.y0
	f.n++
	f.st += t
	f.stt += t * t
	f.sy += y
	f.sty += t * y
}

func (f *lineFit) slope() float64 {
	d := f.n*f.stt - f.st*f.st
	if d == 0 {
		return math.NaN()
	}
	return (f.n*f.sty - f.st*f.sy) / d
}

func eccVector(mu float64, s orbit.State) [3]float64 {
	r := norm3(s.R)
	v2 := dot3(s.V, s.V)
	rv := dot3(s.R, s.V)
	var e [3]float64
	for i := range 3 {
		e[i] = ((v2-mu/r)*s.R[i] - rv*s.V[i]) / mu
	}
	return e
}

func wrapPi(x float64) float64 {
	x = math.Mod(x+math.Pi, 2*math.Pi)
	if x < 0 {
		x += 2 * math.Pi
	}
	return x - math.Pi
}

func dot3(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm3(a [3]float64) float64   { return math.Sqrt(dot3(a, a)) }
func sub3(a, b [3]float64) [3]float64 {
	return [3]float64{a[0] - b[0], a[1] - b[1], a[2] - b[2]}
}
func scale3(f float64, a [3]float64) [3]float64 {
	return [3]float64{f * a[0], f * a[1], f * a[2]}
}
func cross3(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
