package orbit

import (
	"math"
	"testing"
)

// Summarize ties the pieces together: Vallado 4th ed. Example 2-5's state
// (elements checked in elements_test.go) with the EGM2008 J2 and WGS 84
// radius; a hyperbola (Curtis 3rd ed. Ex. 3.5 perigee state) has no
// period, apoapsis or J2 rates, and v_inf = sqrt(v_p^2 - 2 mu/r_p).
func TestSummarize(t *testing.T) {
	ref := loadReference(t).RV2COE
	const re, j2 = 6378.137, 1.08262668e-3
	s, err := Summarize(muEarth, re, j2, State{R: ref.R, V: ref.V})
	if err != nil {
		t.Fatal(err)
	}
	if !s.HasPeriod || !s.HasApoapsis || s.HasVInfinity || !s.HasJ2Rates {
		t.Errorf("flags: %+v", s)
	}
	dO, dw, dM, _ := J2Rates(muEarth, re, j2, s.SemiMajorAxis, s.Elements.E, s.Elements.I)
	if s.RAANRate != dO || s.ArgPeriapsisRate != dw || s.MeanAnomalyRate != dM {
		t.Errorf("J2 rates %g %g %g, want %g %g %g", s.RAANRate, s.ArgPeriapsisRate, s.MeanAnomalyRate, dO, dw, dM)
	}
	if math.Abs(s.SemiMajorAxis-36127.343) > 0.01 { // km, Vallado Ex. 2-5 (see elements_test.go)
		t.Errorf("a = %.4f km", s.SemiMajorAxis)
	}
	E := EccentricFromTrue(s.Elements.Nu, s.Elements.E)
	if want := E - s.Elements.E*math.Sin(E); math.Abs(s.MeanAnomaly-want) > 1e-14 {
		t.Errorf("mean anomaly %.15g, want E - e sin E = %.15g", s.MeanAnomaly, want)
	}
	if relDiff(s.Radius, norm(ref.R)) > 1e-15 || relDiff(s.Speed, norm(ref.V)) > 1e-15 {
		t.Errorf("radius %g speed %g", s.Radius, s.Speed)
	}

	h, err := Summarize(398600, 6378, 1.08263e-3, State{R: [3]float64{6678, 0, 0}, V: [3]float64{0, 15, 0}})
	if err != nil {
		t.Fatal(err)
	}
	if h.HasPeriod || h.HasApoapsis || !h.HasVInfinity || h.HasJ2Rates || h.Conic != Hyperbola {
		t.Errorf("hyperbola flags: %+v", h)
	}
	if want := math.Sqrt(15*15 - 2*398600/6678.0); relDiff(h.VInfinity, want) > 1e-14 {
		t.Errorf("v_inf = %.15g, want %.15g", h.VInfinity, want)
	}
}
