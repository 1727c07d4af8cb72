package orbit

import (
	"errors"
	"math"
	"reflect"
	"testing"
)

// The stationary-orbit radius from the sidereal rotation rate of the
// Earth, omega = 7.292115e-5 rad/s (IERS Conventions 2010, Table 1.1), and
// GM = 398600.4418 km^3/s^2: a = (GM/omega^2)^(1/3) = 42164.17 km (common
// practice; recomputed in testdata/orbit/reference.py, key geo_iers).
func TestSemiMajorAxisFromPeriodGEO(t *testing.T) {
	ref := loadReference(t).GEO
	a, err := SemiMajorAxisFromPeriod(muEarth, 2*math.Pi/7.292115e-5)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(a-42164.17) > 0.005 { // km: half a unit of the printed 0.01 km
		t.Errorf("GEO radius = %.4f km, want 42164.17 km", a)
	}
	if relDiff(a, ref.A) > 1e-15 {
		t.Errorf("GEO radius = %.12f km, NumPy %.12f km", a, ref.A)
	}
	T, err := Period(muEarth, a)
	if err != nil {
		t.Fatal(err)
	}
	if relDiff(T, 2*math.Pi/7.292115e-5) > 1e-15 { // third law both ways
		t.Errorf("Period(GEO radius) = %.9f s, want 2 pi/omega = %.9f s", T, 2*math.Pi/7.292115e-5)
	}
}

// A 400 km circular LEO (a = 6778.137 km with the WGS 84 equatorial
// radius) has a period of about 92.6 minutes (common practice, no source).
func TestPeriodLEO(t *testing.T) {
	T, err := Period(muEarth, 6378.137+400)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(T/60-92.6) > 0.05 { // min: the quoted digit
		t.Errorf("Period(400 km LEO) = %.3f min, want about 92.6 min", T/60)
	}
}

// Geometry against the laws it must obey: Kepler II at the apsides (r_p v_p
// = r_a v_a = h), vis-viva at the apsides, energy -mu/(2a), and for a
// hyperbola the asymptotic relations v_inf^2 = v_p^2 - 2mu/r_p (energy),
// h = b v_inf (angular momentum at infinity), sin(delta/2) = 1/e and
// cos(nu_inf) = -1/e. No field of any geometry may be NaN or infinite.
func TestGeometryLaws(t *testing.T) {
	const tol = 1e-13
	tests := []struct {
		name string
		el   Elements
	}{
		{"circle", Elements{P: 7000}},
		{"ellipse", Elements{P: 11067.790, E: 0.83285}},
		{"very eccentric", Elements{A: 1e6, E: 0.9999}},
		{"parabola", Elements{P: 13356, E: 1}},
		{"hyperbola", Elements{A: -20000, E: 1.5}},
		{"near-parabolic hyperbola", Elements{P: 13356, E: 1 + 1e-9}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			g, err := GeometryOf(muEarth, tt.el)
			if err != nil {
				t.Fatal(err)
			}
			v := reflect.ValueOf(g)
			for k := range v.NumField() {
				if f, ok := v.Field(k).Interface().(float64); ok && !finite(f) {
					t.Errorf("%s = %g, want finite", v.Type().Field(k).Name, f)
				}
			}
			check := func(what string, got, want float64) {
				t.Helper()
				if relDiff(got, want) > tol {
					t.Errorf("%s: %.15g, want %.15g", what, got, want)
				}
			}
			vp, err := VisViva(muEarth, g.PeriapsisRadius, g.SemiMajorAxis)
			if err != nil {
				t.Fatal(err)
			}
			check("v_p vs vis-viva", g.SpeedPeriapsis, vp)
			check("Kepler II at periapsis", g.PeriapsisRadius*g.SpeedPeriapsis, g.AngularMomentum)
			switch g.Conic {
			case Ellipse:
				if !g.HasPeriod || !g.HasApoapsis || g.HasVInfinity || !g.HasSemiMajorAxis {
					t.Errorf("ellipse flags %+v", g)
				}
				va, err := VisViva(muEarth, g.ApoapsisRadius, g.SemiMajorAxis)
				if err != nil {
					t.Fatal(err)
				}
				check("v_a vs vis-viva", g.SpeedApoapsis, va)
				check("Kepler II at apoapsis", g.ApoapsisRadius*g.SpeedApoapsis, g.AngularMomentum)
				check("r_p + r_a = 2a", g.PeriapsisRadius+g.ApoapsisRadius, 2*g.SemiMajorAxis)
				check("energy", g.SpecificEnergy, -muEarth/(2*g.SemiMajorAxis))
				check("period", g.Period, 2*math.Pi*math.Sqrt(math.Pow(g.SemiMajorAxis, 3)/muEarth))
				check("b^2 = a p", g.SemiMinorAxis*g.SemiMinorAxis, g.SemiMajorAxis*g.SemiLatusRectum)
			case Parabola:
				if g.HasPeriod || g.HasApoapsis || !g.HasVInfinity || g.HasSemiMajorAxis {
					t.Errorf("parabola flags %+v", g)
				}
				check("escape speed at periapsis", g.SpeedPeriapsis, math.Sqrt(2*muEarth/g.PeriapsisRadius))
				if g.VInfinity != 0 || g.SpecificEnergy != 0 || g.Period != 0 || g.ApoapsisRadius != 0 {
					t.Errorf("parabola: %+v", g)
				}
			case Hyperbola:
				if g.HasPeriod || g.HasApoapsis || !g.HasVInfinity || !g.HasSemiMajorAxis {
					t.Errorf("hyperbola flags %+v", g)
				}
				vinf2 := g.SpeedPeriapsis*g.SpeedPeriapsis - 2*muEarth/g.PeriapsisRadius
				if math.Abs(g.VInfinity*g.VInfinity-vinf2) > 1e-12*g.SpeedPeriapsis*g.SpeedPeriapsis {
					t.Errorf("v_inf^2 = %.15g, v_p^2 - 2mu/r_p = %.15g", g.VInfinity*g.VInfinity, vinf2)
				}
				if tt.el.E-1 > 1e-6 { // the impact parameter is ill-conditioned next to the parabola
					check("h = b v_inf", g.SemiMinorAxis*g.VInfinity, g.AngularMomentum)
				}
				check("sin(delta/2) = 1/e", math.Sin(g.TurnAngle/2), 1/g.Eccentricity)
				check("cos(nu_inf) = -1/e", math.Cos(g.AsymptoteAnomaly), -1/g.Eccentricity)
			}
		})
	}
}

// Flight-path angle against tan(gamma) = e sin(nu)/(1 + e cos(nu))
// (Vallado 4th ed. Sec. 2.3; Curtis 3rd ed. eq. 2.51), zero at the apsides.
func TestFlightPathAngle(t *testing.T) {
	for _, e := range []float64{0, 0.1, 0.83285, 1, 2.5} {
		for _, nu := range []float64{0, 0.3, 1.2, 1.9, -1.0} { // 1.9 rad is inside the asymptote of e = 2.5 (1.982 rad)
			el := Elements{P: 9000, E: e, I: 0.7, RAAN: 2, ArgP: 1, Nu: nu}
			s, err := StateFromElements(muEarth, el)
			if err != nil {
				t.Fatal(err)
			}
			want := math.Atan2(e*math.Sin(nu), 1+e*math.Cos(nu))
			if got := FlightPathAngle(s); math.Abs(got-want) > 1e-14 {
				t.Errorf("FlightPathAngle(e = %g, nu = %g) = %.15g, want %.15g", e, nu, got, want)
			}
		}
	}
	if g := FlightPathAngle(State{}); g != 0 {
		t.Errorf("FlightPathAngle(zero state) = %g, want 0", g)
	}
}

func TestGeometryErrors(t *testing.T) {
	tests := []struct {
		name    string
		f       func() error
		wantErr error
	}{
		{"GeometryOf bad mu", func() error { _, err := GeometryOf(-1, Elements{P: 7000}); return err }, ErrInvalidMu},
		{"GeometryOf no size", func() error { _, err := GeometryOf(muEarth, Elements{}); return err }, ErrSize},
		{"GeometryOf negative e", func() error { _, err := GeometryOf(muEarth, Elements{P: 1, E: -1}); return err }, ErrEccentricity},
		{"Period open", func() error { _, err := Period(muEarth, -7000); return err }, ErrOpenOrbit},
		{"Period bad mu", func() error { _, err := Period(0, 7000); return err }, ErrInvalidMu},
		{"SemiMajorAxisFromPeriod zero", func() error { _, err := SemiMajorAxisFromPeriod(muEarth, 0); return err }, ErrPeriod},
		{"VisViva beyond apoapsis", func() error { _, err := VisViva(muEarth, 15000, 7000); return err }, ErrRadius},
		{"VisViva r = 0", func() error { _, err := VisViva(muEarth, 0, 7000); return err }, ErrRadius},
		{"VisViva NaN", func() error { _, err := VisViva(muEarth, math.NaN(), 7000); return err }, ErrNonFinite},
		{"GeometryOfState rectilinear", func() error {
			_, err := GeometryOfState(muEarth, State{R: [3]float64{7000, 0, 0}, V: [3]float64{1, 0, 0}})
			return err
		}, ErrRectilinear},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			if err := tt.f(); !errors.Is(err, tt.wantErr) {
				t.Errorf("error = %v, want %v", err, tt.wantErr)
			}
		})
	}
	// vis-viva for a parabola (a = 0 by the Elements convention) is the
	// escape speed.
	v, err := VisViva(muEarth, 7000, 0)
	if err != nil || relDiff(v, math.Sqrt(2*muEarth/7000)) > 1e-15 {
		t.Errorf("VisViva(r, a = 0) = %g, %v; want the escape speed %g", v, err, math.Sqrt(2*muEarth/7000))
	}
}
