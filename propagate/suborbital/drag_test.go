package suborbital_test

import (
	"bufio"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"centra/bodies/geodesy"
	"centra/propagate"
	"centra/propagate/suborbital"
)

// ussaDensity reads the density at altKm from the stored U.S. Standard
// Atmosphere 1976 values of python3-fluids 1.0.22
// (testdata/atmosphere/ussa1976_fluids.csv, ATMOSPHERE_1976).
func ussaDensity(t *testing.T, altKm float64) float64 {
	t.Helper()
	fh, err := os.Open(filepath.Join("..", "..", "testdata", "atmosphere", "ussa1976_fluids.csv"))
	if err != nil {
		t.Fatal(err)
	}
	defer fh.Close()
	sc := bufio.NewScanner(fh)
	for sc.Scan() {
		p := strings.Split(sc.Text(), ",")
		if len(p) != 4 {
			continue
		}
		z, err1 := strconv.ParseFloat(p[0], 64)
		rho, err2 := strconv.ParseFloat(p[3], 64)
		if err1 == nil && err2 == nil && z == altKm {
			return rho
		}
	}
	t.Fatalf("no fluids density at %g km", altKm)
	return 0
}

// TestTerminalSpeed: a light, draggy body dropped through still air
// settles at the terminal speed v_t = sqrt(2 m g / (rho Cd A)), where drag
// balances weight (any fluid-mechanics text; the definition of terminal
// velocity). Non-rotating sphere, point-mass gravity g = mu / r^2 at the
// impact height, density of the U.S. Standard Atmosphere 1976 from the
// fluids reference values. The body (1 kg, 1 m^2, Cd 1: v_t ~ 4 m/s)
// relaxes to v_t in tau = v_t / g ~ 0.4 s; v_t changes with height as
// rho^(-1/2), by 1/(2 H) ~ 6e-5 per metre (scale height H ~ 8.4 km), and
// the body lags about v_t tau ~ 2 m behind it: 1.2e-4 relative. The
// tolerance is 1e-3 relative.
func TestTerminalSpeed(t *testing.T) {
	const (
		mu = 398600.4418 // km^3/s^2 (WGS 84)
		re = 6378.137    // km
	)
	v := suborbital.Vehicle{Mass: 1, Area: 1, Cd: 1}
	for _, impactKm := range []float64{0, 5} {
		rho := ussaDensity(t, impactKm)
		g := mu / ((re + impactKm) * (re + impactKm)) * 1000   // m/s^2
		want := math.Sqrt(2*v.Mass*g/(rho*v.Cd*v.Area)) / 1000 // km/s
		f, err := suborbital.New(suborbital.Config{Gravity: propagate.PointMass(mu), Ellipsoid: geodesy.NewEllipsoid(re, 0),
			ImpactAlt: impactKm, Above: impactKm + 1})
		if err != nil {
			t.Fatal(err)
		}
		arc, err := f.Fly(suborbital.Burnout{Lat: 0.5, Lon: 0.5, Alt: impactKm + 2, Speed: 0.001, FlightPath: -math.Pi / 2}, v, nil)
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("impact at %g km: %.9f km/s, terminal speed %.9f km/s (%+.2g relative)", impactKm, arc.Impact.Speed, want, arc.Impact.Speed/want-1)
		if got := arc.Impact.Speed; math.Abs(got-want) > 1e-3*want {
			t.Errorf("impact at %g km: speed %.9f km/s, want terminal speed %.9f km/s ± 0.1%%", impactKm, got, want)
		}
	}
}

// TestDragOffIsVacuum: a vehicle in an atmosphere of zero density flies
// the vacuum arc (the drag path adds nothing by itself).
func TestDragOffIsVacuum(t *testing.T) {
	b := earth()
	cfg := suborbital.Config{Gravity: propagate.J2(b.GM, b.EquatorialRadius, b.Jn(2)), Omega: b.RotationRate, Above: 100}
	bo := suborbital.Burnout{Lat: 0.9, Lon: -0.1, Alt: 30, Speed: 2.1, FlightPath: 83 * deg, Azimuth: 280 * deg}
	vac, err := suborbital.New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	a1, err := vac.Fly(bo, suborbital.Vehicle{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	cfg.Density = func(float64) float64 { return 0 }
	nodrag, _ := suborbital.New(cfg)
	a2, err := nodrag.Fly(bo, suborbital.Vehicle{Mass: 10, Area: 0.01, Cd: 1}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(a1.GroundRange-a2.GroundRange) > 1e-9 || math.Abs(a1.FlightTime-a2.FlightTime) > 1e-9 {
		t.Errorf("zero density: range %.12f km, time %.12f s; vacuum %.12f km, %.12f s", a2.GroundRange, a2.FlightTime, a1.GroundRange, a1.FlightTime)
	}
	// With the real atmosphere the arc is lower and shorter, and lands slower.
	cfg.Density = nil
	withDrag, _ := suborbital.New(cfg)
	a3, err := withDrag.Fly(bo, suborbital.Vehicle{Mass: 10, Area: 0.01, Cd: 1}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !(a3.Apogee.Alt < a1.Apogee.Alt && a3.GroundRange < a1.GroundRange && a3.Impact.Speed < a1.Impact.Speed) {
		t.Errorf("drag: apogee %.3f, range %.3f, impact speed %.4f; vacuum %.3f, %.3f, %.4f", a3.Apogee.Alt, a3.GroundRange, a3.Impact.Speed, a1.Apogee.Alt, a1.GroundRange, a1.Impact.Speed)
	}
}

// TestJacobiIntegral: without drag the zonal field does not change in
// the frame turning with the Earth, so the Jacobi integral
// C = |v_rel|^2 / 2 + U(r) - omega^2 (x^2 + y^2) / 2 is conserved (any
// mechanics text: the energy in a uniformly rotating frame, e.g. Landau
// and Lifshitz, Mechanics, sec. 39). Checked at burnout, apogee and
// impact, to 1e-10 relative of the gravitational potential.
func TestJacobiIntegral(t *testing.T) {
	b := earth()
	model := propagate.Zonal(b.GM, b.EquatorialRadius, b.J[:7], 6)
	p, err := propagate.New(model, propagate.Options{})
	if err != nil {
		t.Fatal(err)
	}
	field := p.Field()
	w := b.RotationRate
	f, err := suborbital.New(suborbital.Config{Gravity: model, Omega: w, Above: 100})
	if err != nil {
		t.Fatal(err)
	}
	arc, err := f.Fly(suborbital.Burnout{Lat: 67.9 * deg, Lon: 21.1 * deg, Alt: 45, Speed: 2.4, FlightPath: 78 * deg, Azimuth: 340 * deg}, suborbital.Vehicle{}, nil)
	if err != nil {
		t.Fatal(err)
	}
	jacobi := func(pt suborbital.Point) float64 {
		r, v := pt.State.R, pt.State.V
		vr := [3]float64{v[0] + w*r[1], v[1] - w*r[0], v[2]}
		return (vr[0]*vr[0]+vr[1]*vr[1]+vr[2]*vr[2])/2 + field.Potential(r) - w*w*(r[0]*r[0]+r[1]*r[1])/2
	}
	c0 := jacobi(arc.Burnout)
	scale := math.Abs(field.Potential(arc.Burnout.State.R))
	for _, pt := range []suborbital.Point{arc.Apogee, arc.Impact} {
		t.Logf("Jacobi integral at t = %.3f s: change %.2g relative", pt.T, math.Abs(jacobi(pt)-c0)/scale)
		if d := math.Abs(jacobi(pt) - c0); d > 1e-10*scale {
			t.Errorf("Jacobi integral at t = %.3f s changed by %.3g km^2/s^2 (%.3g relative)", pt.T, d, d/scale)
		}
		// The speed relative to the Earth follows from it too.
		if math.Abs(pt.Speed*pt.Speed/2-(c0-field.Potential(pt.State.R)+w*w*(pt.State.R[0]*pt.State.R[0]+pt.State.R[1]*pt.State.R[1])/2)) > 1e-9*scale {
			t.Errorf("relative speed %.9f km/s at t = %.3f s does not match the Jacobi integral", pt.Speed, pt.T)
		}
	}
}
