package orbit_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"centra/bodies"
	"centra/orbit"
	"centra/propagate"
)

const designDeg = math.Pi / 180

type designEarth struct{ mu, re, j2, j3, omega float64 }

func designBody(t testing.TB) designEarth {
	t.Helper()
	e, err := bodies.Lookup("earth")
	if err != nil {
		t.Fatal(err)
	}
	return designEarth{e.GM, e.EquatorialRadius, e.Jn(2), e.Jn(3), e.RotationRate}
}

// osculatingState returns the state of the mean elements m.
func osculatingState(t testing.TB, e designEarth, m orbit.Elements) orbit.State {
	t.Helper()
	osc, err := orbit.MeanToOsculating(e.mu, e.re, e.j2, m)
	if err != nil {
		t.Fatal(err)
	}
	s, err := orbit.StateFromElements(e.mu, osc)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

func meanOf(t testing.TB, e designEarth, s orbit.State) orbit.Elements {
	t.Helper()
	osc, err := orbit.ElementsFromState(e.mu, s)
	if err != nil {
		t.Fatal(err)
	}
	m, err := orbit.OsculatingToMean(e.mu, e.re, e.j2, osc)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func slope(ts, ys []float64) float64 {
	var st, sy, stt, sty float64
	n := float64(len(ts))
	for i := range ts {
		st += ts[i]
		sy += ys[i]
		stt += ts[i] * ts[i]
		sty += ts[i] * ys[i]
	}
	return (n*sty - st*sy) / (n*stt - st*st)
}

// TestMeanElementsUnderJ2: propagated with J2, the osculating semi-major
// axis of a LEO swings by tens of km in each revolution, while the mean
// semi-major axis of OsculatingToMean stays constant, as first-order
// theory requires (no secular or long-period change of a under J2:
// Brouwer, Astron. J. 64, 1959; Vallado, 4th ed., sec. 9.6), and the mean
// node turns at the secular rate of J2Rates. This checks the short-period
// terms of MeanToOsculating against the equations of motion.
func TestMeanElementsUnderJ2(t *testing.T) {
	e := designBody(t)
	for _, c := range []struct {
		a, ecc, inc float64
	}{{7000, 0.001, 51.6}, {6878, 0, 97.4}, {7200, 0.01, 30}} {
		mean0 := orbit.Elements{A: c.a, P: c.a * (1 - c.ecc*c.ecc), E: c.ecc, I: c.inc * designDeg, RAAN: 1, ArgP: 0.5, Nu: 0.3}
		s0 := osculatingState(t, e, mean0)
		p, err := propagate.New(propagate.J2(e.mu, e.re, e.j2), propagate.Options{RelTol: 1e-12})
		if err != nil {
			t.Fatal(err)
		}
		var ts, ms, raans []float64
		oscMin, oscMax := math.Inf(1), math.Inf(-1)
		meanMin, meanMax := math.Inf(1), math.Inf(-1)
		iMin, iMax := math.Inf(1), math.Inf(-1)
		raan0 := 0.0
		out := &propagate.Output{Step: 60, OnState: func(tt float64, s orbit.State) error {
			osc, _ := orbit.ElementsFromState(e.mu, s)
			m := meanOf(t, e, s)
			oscMin, oscMax = math.Min(oscMin, osc.A), math.Max(oscMax, osc.A)
			meanMin, meanMax = math.Min(meanMin, m.A), math.Max(meanMax, m.A)
			iMin, iMax = math.Min(iMin, m.I), math.Max(iMax, m.I)
			if tt == 0 {
				raan0 = m.RAAN
			}
			ts = append(ts, tt)
			ms = append(ms, m.A)
			raans = append(raans, math.Remainder(m.RAAN-raan0, 2*math.Pi))
			return nil
		}}
		if _, err := p.Run(s0, 86400, out); err != nil {
			t.Fatal(err)
		}
		if oscMax-oscMin < 2 {
			t.Fatalf("a = %g: osculating a swings only %g km; the test needs the short-period terms", c.a, oscMax-oscMin)
		}
		// Terms of order J2^2 a and e J2 a: a few tens of m.
		if d := meanMax - meanMin; d > 0.05 {
			t.Errorf("a = %g km, e = %g, i = %g: mean a varies by %.4f km over a day (osculating %.3f km), want <= 0.05 km", c.a, c.ecc, c.inc, d, oscMax-oscMin)
		}
		// The short-period terms of i neglect e J2 (Re/a)^2.
		k := e.j2 * (e.re / c.a) * (e.re / c.a)
		if d, tol := iMax-iMin, 3e-6+2*c.ecc*k; d > tol {
			t.Errorf("a = %g km: mean inclination varies by %.3g rad, want <= %.3g rad", c.a, d, tol)
		}
		// The first-order nodal rate is good to a few J2 (Re/a)^2.
		want, _, _, _ := orbit.J2Rates(e.mu, e.re, e.j2, c.a, c.ecc, c.inc*designDeg)
		if got := slope(ts, raans); math.Abs(got-want) > 4*k*math.Abs(want) {
			t.Errorf("a = %g km: mean nodal rate %.6g rad/s, J2Rates %.6g rad/s", c.a, got, want)
		}
		if s := slope(ts, ms); math.Abs(s)*86400 > 0.02 {
			t.Errorf("a = %g km: mean a drifts by %.3g km/day", c.a, s*86400)
		}
	}
}

// nodeLongitudes propagates s0 with J2 over span and returns the
// longitudes (rad) of the ascending nodes in a frame turning with the
// body at omega about z, with their times.
func nodeLongitudes(t *testing.T, e designEarth, s0 orbit.State, span float64) (lon, tn []float64) {
	t.Helper()
	p, err := propagate.New(propagate.J2(e.mu, e.re, e.j2), propagate.Options{RelTol: 1e-12})
	if err != nil {
		t.Fatal(err)
	}
	out := &propagate.Output{Events: []propagate.Event{{Kind: propagate.AscendingNode}}, OnEvent: func(h propagate.EventHit) error {
		lon = append(lon, math.Atan2(h.State.R[1], h.State.R[0])-e.omega*h.T)
		tn = append(tn, h.T)
		return nil
	}}
	if _, err := p.Run(s0, span, out); err != nil {
		t.Fatal(err)
	}
	return lon, tn
}

// TestRepeatGroundTrack designs repeat orbits and propagates them with J2:
// after REVS nodal periods the ascending node must be back over the same
// longitude of the turning Earth (the definition of the repeat; an
// independent check of the J2 rates and of the mean-to-osculating
// conversion). The 233/16 sun-synchronous case is the WRS-2 cycle of
// Landsat 8, whose orbit is given as about 705 km and 98.2 deg (Landsat 8
// Data Users Handbook, from memory; 705 km is a nominal altitude, so only
// within 10 km).
func TestRepeatGroundTrack(t *testing.T) {
	if testing.Short() {
		t.Skip("propagates 16 days")
	}
	e := designBody(t)
	cases := []struct {
		name       string
		revs, days int
		sso        bool
		inc        float64
		altKm      float64 // expected mean altitude, from memory; 0: none
	}{
		{"233/16 sun-synchronous", 233, 16, true, 0, 705},
		{"15/1 at 51.6 deg", 15, 1, false, 51.6, 0},
		{"43/3 at 65 deg", 43, 3, false, 65, 0},
		{"44/3 at 30 deg", 44, 3, false, 30, 0},
	}
	for _, c := range cases {
		res, err := orbit.Design{Mu: e.mu, Re: e.re, J2: e.j2, RotationRate: e.omega, Revs: c.revs, Days: c.days,
			SunSynchronous: c.sso, I: c.inc * designDeg}.Solve()
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if c.altKm != 0 && math.Abs(res.A-e.re-c.altKm) > 10 {
			t.Errorf("%s: mean altitude %.2f km, published about %g km", c.name, res.A-e.re, c.altKm)
		}
		if c.sso {
			if math.Abs(res.I/designDeg-98.2) > 0.05 {
				t.Errorf("%s: inclination %.4f deg, published 98.2 deg", c.name, res.I/designDeg)
			}
			// Sun-synchronous: the Earth turns once relative to the node
			// in a mean solar day (common practice, no source; 2 pi /
			// (omega_E - n_sun) with the WGS 84 rate is 86400.01 s).
			if math.Abs(res.NodalDay-86400) > 0.1 {
				t.Errorf("%s: nodal day %.3f s, want a mean solar day", c.name, res.NodalDay)
			}
		}
		// Start 0.3 rad before the ascending node.
		mean := orbit.Elements{A: res.A, P: res.A * (1 - res.E*res.E), E: res.E, I: res.I, RAAN: 0.7, ArgP: res.ArgP, Nu: 2*math.Pi - 0.3 - res.ArgP}
		s0 := osculatingState(t, e, mean)
		span := float64(c.days)*res.NodalDay + res.NodalPeriod/2
		lon, tn := nodeLongitudes(t, e, s0, span)
		if len(lon) < c.revs+1 {
			t.Fatalf("%s: %d ascending nodes in %g s, want %d", c.name, len(lon), span, c.revs+1)
		}
		drift := math.Remainder(lon[c.revs]-lon[0], 2*math.Pi) * e.re // km along the equator
		// The first-order rates leave errors of second order in J2, with
		// k = J2 (Re/a)^2: up to about 15 k^2 relative in the nodal period
		// and 3 k relative in the nodal rate (TestMeanElementsUnderJ2
		// allows 4 k); the track drifts along the equator by
		// REVS T_N Re (15 k^2 omega_E + 3 k |RAANRate|).
		k := e.j2 * (e.re / res.A) * (e.re / res.A)
		tol := float64(c.revs) * res.NodalPeriod * e.re * (15*k*k*e.omega + 3*k*math.Abs(res.RAANRate))
		t.Logf("%s: drift %.3f km after %d days (tolerance %.3f km)", c.name, drift, c.days, tol)
		if math.Abs(drift) > tol {
			t.Errorf("%s: the track drifts %.3f km along the equator after %d revolutions, want <= %g km", c.name, drift, c.revs, tol)
		}
		period := (tn[c.revs] - tn[0]) / float64(c.revs)
		if math.Abs(period-res.NodalPeriod) > 15*k*k*res.NodalPeriod {
			t.Errorf("%s: measured nodal period %.4f s, designed %.4f s", c.name, period, res.NodalPeriod)
		}
	}
}

// TestFrozenOrbit: propagated with J2 and J3, the mean eccentricity
// vector of a frozen orbit stays where it starts, while that of an orbit
// with twice the eccentricity circles about it at the J2 apsidal rate
// (the frozen condition of FrozenEccentricity: Vallado, 4th ed., sec.
// 11.4.2; Chobotov, Orbital Mechanics, 3rd ed., sec. 11.4; from memory).
// Near 700 km sun-synchronous orbits have frozen eccentricities of about
// 0.001 with the perigee at 90 deg (common practice, no source).
func TestFrozenOrbit(t *testing.T) {
	e := designBody(t)
	a, inc := e.re+700, 98.19*designDeg
	ef, argp, err := orbit.FrozenEccentricity(e.re, e.j2, e.j3, a, inc)
	if err != nil {
		t.Fatal(err)
	}
	if !(ef > 0.0009 && ef < 0.0012) || argp != math.Pi/2 {
		t.Errorf("frozen e = %g at argp %g deg, want about 0.001 at 90 deg", ef, argp/designDeg)
	}
	m := propagate.Zonal(e.mu, e.re, []float64{0, 0, e.j2, e.j3}, 3)
	wander := func(ecc float64) float64 {
		mean := orbit.Elements{A: a, P: a * (1 - ecc*ecc), E: ecc, I: inc, RAAN: 0.2, ArgP: math.Pi / 2}
		s0 := osculatingState(t, e, mean)
		p, err := propagate.New(m, propagate.Options{RelTol: 1e-11})
		if err != nil {
			t.Fatal(err)
		}
		// Mean eccentricity vector averaged over each revolution.
		period := 2 * math.Pi * math.Sqrt(a*a*a/e.mu)
		const per = 32
		var ex, ey []float64
		var sx, sy float64
		k := 0
		out := &propagate.Output{Step: period / per, OnState: func(_ float64, s orbit.State) error {
			mm := meanOf(t, e, s)
			sw, cw := math.Sincos(mm.ArgP)
			sx += mm.E * cw
			sy += mm.E * sw
			k++
			if k == per {
				ex, ey = append(ex, sx/per), append(ey, sy/per)
				sx, sy, k = 0, 0, 0
			}
			return nil
		}}
		if _, err := p.Run(s0, 30*86400, out); err != nil {
			t.Fatal(err)
		}
		w := 0.0
		for i := range ex {
			w = math.Max(w, math.Hypot(ex[i]-ex[0], ey[i]-ey[0]))
		}
		return w
	}
	frozen, control := wander(ef), wander(2*ef)
	if frozen > 1e-4 || frozen > 0.1*control {
		t.Errorf("30 days with J2, J3: frozen e vector wanders %.3g, the one at twice e %.3g; want <= 1e-4 and a tenth of it", frozen, control)
	}
	t.Logf("e_f = %.6g; wander frozen %.3g, control %.3g", ef, frozen, control)
}

// TestSunSynchronousPropagated: the inclination that makes an 800 km
// circular orbit sun-synchronous is 98.6 deg (tables of sun-synchronous
// orbits, e.g. Vallado 4th ed. sec. 11.4; from memory), and the mean node
// of the designed orbit, propagated with J2, turns at the Sun's mean
// motion, 0.9856 deg/day.
func TestSunSynchronousPropagated(t *testing.T) {
	e := designBody(t)
	res, err := orbit.Design{Mu: e.mu, Re: e.re, J2: e.j2, A: e.re + 800, SunSynchronous: true}.Solve()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(res.I/designDeg-98.6) > 0.05 {
		t.Errorf("800 km sun-synchronous inclination %.4f deg, tabulated 98.6 deg", res.I/designDeg)
	}
	s0 := osculatingState(t, e, orbit.Elements{A: res.A, P: res.A, I: res.I, RAAN: 1})
	p, _ := propagate.New(propagate.J2(e.mu, e.re, e.j2), propagate.Options{RelTol: 1e-11})
	var ts, rs []float64
	raan0 := math.NaN()
	out := &propagate.Output{Step: 600, OnState: func(tt float64, s orbit.State) error {
		m := meanOf(t, e, s)
		if math.IsNaN(raan0) {
			raan0 = m.RAAN
		}
		ts, rs = append(ts, tt), append(rs, math.Remainder(m.RAAN-raan0, 2*math.Pi))
		return nil
	}}
	if _, err := p.Run(s0, 5*86400, out); err != nil {
		t.Fatal(err)
	}
	got := slope(ts, rs) * 86400 / designDeg
	if math.Abs(got-0.98564736) > 0.005 {
		t.Errorf("mean nodal rate %.5f deg/day, want the Sun's 0.98565 deg/day", got)
	}
}

func TestDesignErrors(t *testing.T) {
	e := designBody(t)
	base := orbit.Design{Mu: e.mu, Re: e.re, J2: e.j2, J3: e.j3, RotationRate: e.omega}
	cases := []struct {
		name string
		d    func(orbit.Design) orbit.Design
		want error
	}{
		{"inside the body", func(d orbit.Design) orbit.Design { d.Revs, d.Days = 20, 1; return d }, orbit.ErrNoRepeat},
		{"too high to be sun-synchronous", func(d orbit.Design) orbit.Design { d.Revs, d.Days, d.SunSynchronous = 1, 1, true; return d }, orbit.ErrNoRepeat},
		{"no cycle", func(d orbit.Design) orbit.Design { d.Revs, d.Days = -1, 1; return d }, orbit.ErrNoRepeat},
		{"no J3", func(d orbit.Design) orbit.Design { d.A, d.Frozen, d.J3 = 7000, true, 0; return d }, orbit.ErrNoFrozen},
		{"no size", func(d orbit.Design) orbit.Design { return d }, orbit.ErrOpenOrbit},
		{"no J2", func(d orbit.Design) orbit.Design { d.A, d.J2 = 7000, 0; return d }, orbit.ErrJ2},
		{"sun-synchronous too high", func(d orbit.Design) orbit.Design { d.A, d.SunSynchronous = 20000, true; return d }, orbit.ErrNoSunSynchronous},
	}
	for _, c := range cases {
		if _, err := c.d(base).Solve(); !errors.Is(err, c.want) {
			t.Errorf("%s: error %v, want %v", c.name, err, c.want)
		}
	}
	if _, err := orbit.MeanToOsculating(e.mu, e.re, e.j2, orbit.Elements{A: -7000, E: 1.5}); !errors.Is(err, orbit.ErrOpenOrbit) {
		t.Errorf("MeanToOsculating of a hyperbola: %v", err)
	}
}

// A sun-synchronous, frozen orbit that repeats its ground track after 233
// revolutions in 16 days.
func ExampleDesign_Solve() {
	const mu, re = 398600.4418, 6378.137
	const j2, j3 = 1.0826267e-3, -2.5326e-6
	res, err := orbit.Design{Mu: mu, Re: re, J2: j2, J3: j3, RotationRate: 7.292115e-5,
		Revs: 233, Days: 16, SunSynchronous: true, Frozen: true}.Solve()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("mean altitude %.1f km, inclination %.2f deg, e %.5f, argp %.0f deg, nodal period %.1f min\n",
		res.A-re, res.I*180/math.Pi, res.E, res.ArgP*180/math.Pi, res.NodalPeriod/60)
	// Output:
	// mean altitude 699.6 km, inclination 98.19 deg, e 0.00104, argp 90 deg, nodal period 98.9 min
}
