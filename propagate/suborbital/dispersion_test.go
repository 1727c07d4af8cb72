package suborbital_test

import (
	"errors"
	"math"
	"reflect"
	"testing"

	"centra/bodies/geodesy"
	"centra/propagate"
	"centra/propagate/suborbital"
)

func dispersionSetup() (suborbital.Config, suborbital.Burnout, suborbital.Vehicle) {
	b := earth()
	cfg := suborbital.Config{Gravity: propagate.J2(b.GM, b.EquatorialRadius, b.Jn(2)), Omega: b.RotationRate, Above: 100}
	bo := suborbital.Burnout{Lat: 57.4 * deg, Lon: -7.3 * deg, Alt: 35, Speed: 2.0, FlightPath: 82 * deg, Azimuth: 290 * deg}
	return cfg, bo, suborbital.Vehicle{Mass: 25, Area: 0.02, Cd: 0.9}
}

// TestDispersionLinear: for small sigmas the Monte Carlo impact ellipse
// agrees with the linear propagation of the covariance,
// P = sum_k sigma_k^2 J_k J_k^T, J_k the sensitivity of the impact point
// (east, north) to parameter k by central finite differences (an
// independent method: no random numbers). Bound 10 % on the semi-axes
// (the sampling error of a standard deviation from N = 2000 cases is
// 1/sqrt(2N) = 1.6 %) and 3 deg on the orientation of the major axis.
func TestDispersionLinear(t *testing.T) {
	cfg, nominal, veh := dispersionSetup()
	sig := suborbital.Sigma{Speed: 0.004, FlightPath: 0.15 * deg, Azimuth: 0.4 * deg, Cd: 0.03}
	res, err := suborbital.Disperse(cfg, nominal, veh, suborbital.Dispersion{Cases: 2000, Seed: 7, Sigma: sig})
	if err != nil {
		t.Fatal(err)
	}
	f, err := suborbital.New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	nom, err := f.Fly(nominal, veh, nil)
	if err != nil {
		t.Fatal(err)
	}
	el := geodesy.WGS84
	r0 := el.ToECEF(nom.Impact.Lat, nom.Impact.Lon, 0)
	enu := geodesy.ENU(nom.Impact.Lat, nom.Impact.Lon)
	en := func(b suborbital.Burnout, v suborbital.Vehicle) [2]float64 {
		arc, err := f.Fly(b, v, nil)
		if err != nil {
			t.Fatal(err)
		}
		r := el.ToECEF(arc.Impact.Lat, arc.Impact.Lon, 0)
		d := [3]float64{r[0] - r0[0], r[1] - r0[1], r[2] - r0[2]}
		return [2]float64{enu[0][0]*d[0] + enu[0][1]*d[1] + enu[0][2]*d[2], enu[1][0]*d[0] + enu[1][1]*d[1] + enu[1][2]*d[2]}
	}
	var cov [2][2]float64
	for k, s := range []float64{sig.Speed, sig.FlightPath, sig.Azimuth, sig.Cd} {
		bp, bm, vp, vm := nominal, nominal, veh, veh
		switch k {
		case 0:
			bp.Speed += s
			bm.Speed -= s
		case 1:
			bp.FlightPath += s
			bm.FlightPath -= s
		case 2:
			bp.Azimuth += s
			bm.Azimuth -= s
		case 3:
			vp.Cd += s
			vm.Cd -= s
		}
		p, m := en(bp, vp), en(bm, vm)
		j := [2]float64{(p[0] - m[0]) / 2, (p[1] - m[1]) / 2} // km per sigma
		for a := range 2 {
			for b := range 2 {
				cov[a][b] += j[a] * j[b]
			}
		}
	}
	lin := suborbital.EllipseOf(cov, 1)
	mc := res.Sigma1
	t.Logf("Monte Carlo 1-sigma: %.4f x %.4f km at %.2f deg; linear: %.4f x %.4f km at %.2f deg", mc.SemiMajor, mc.SemiMinor, mc.Azimuth/deg, lin.SemiMajor, lin.SemiMinor, lin.Azimuth/deg)
	if math.Abs(mc.SemiMajor/lin.SemiMajor-1) > 0.1 || math.Abs(mc.SemiMinor/lin.SemiMinor-1) > 0.1 {
		t.Errorf("1-sigma semi-axes %.4f, %.4f km; linear covariance %.4f, %.4f km", mc.SemiMajor, mc.SemiMinor, lin.SemiMajor, lin.SemiMinor)
	}
	if d := math.Abs(math.Remainder(mc.Azimuth-lin.Azimuth, math.Pi)); d > 3*deg {
		t.Errorf("major axis at %.3f deg, linear %.3f deg", mc.Azimuth/deg, lin.Azimuth/deg)
	}
	if s3 := res.Sigma3; math.Abs(s3.SemiMajor-3*mc.SemiMajor) > 1e-12 || s3.Azimuth != mc.Azimuth {
		t.Errorf("3-sigma ellipse %+v is not 3 times the 1-sigma %+v", s3, mc)
	}
	// The mean impact point lies within 3 standard errors of the nominal.
	s, _, _, err := suborbital.Inverse(el, nom.Impact.Lat, nom.Impact.Lon, res.MeanLat, res.MeanLon)
	if err != nil || s > 3*mc.SemiMajor/math.Sqrt(2000)+0.01*mc.SemiMajor {
		t.Errorf("mean impact %.4f km from the nominal (1-sigma major axis %.4f km)", s, mc.SemiMajor)
	}
}

// TestDispersionDeterministic: case i gets the same draws whatever the
// number of workers, so the results are identical bit for bit.
func TestDispersionDeterministic(t *testing.T) {
	cfg, nominal, veh := dispersionSetup()
	d := suborbital.Dispersion{Cases: 60, Seed: 3, Sigma: suborbital.Sigma{Speed: 0.02, FlightPath: 0.5 * deg, Azimuth: 1 * deg, Cd: 0.05}}
	var results []suborbital.DispersionResult
	for _, w := range []int{1, 2, 5} {
		d.Workers = w
		res, err := suborbital.Disperse(cfg, nominal, veh, d)
		if err != nil {
			t.Fatal(err)
		}
		results = append(results, res)
	}
	for i := 1; i < len(results); i++ {
		if !reflect.DeepEqual(results[0], results[i]) {
			t.Errorf("workers change the result: %+v vs %+v", results[0].Sigma1, results[i].Sigma1)
		}
	}
	for i, c := range results[0].Cases {
		b, cd := suborbital.Draw(nominal, veh, d.Sigma, d.Seed, i)
		if c.Index != i || c.Burnout != b || c.Cd != cd {
			t.Errorf("case %d: %+v, Draw gives %+v, Cd %g", i, c, b, cd)
		}
	}
	other, _ := suborbital.Draw(nominal, veh, d.Sigma, d.Seed+1, 0)
	if other == results[0].Cases[0].Burnout {
		t.Error("another seed gives the same draw")
	}
}

// TestDrawReflection: a flight-path angle drawn past the vertical is the
// same direction tilted the other way.
func TestDrawReflection(t *testing.T) {
	nominal := suborbital.Burnout{Lat: 0.1, Speed: 1, FlightPath: math.Pi / 2, Azimuth: 0.5}
	for i := range 200 {
		b, _ := suborbital.Draw(nominal, suborbital.Vehicle{}, suborbital.Sigma{FlightPath: 2 * deg}, 1, i)
		if b.FlightPath > math.Pi/2 || b.FlightPath < -math.Pi/2 || b.Azimuth < 0 || b.Azimuth >= 2*math.Pi {
			t.Fatalf("case %d: flight-path angle %.6f deg, azimuth %.6f deg", i, b.FlightPath/deg, b.Azimuth/deg)
		}
	}
}

// TestEllipseOf: the eigen decomposition of a 2x2 covariance built from
// known axes (cov = l1 u u^T + l2 w w^T, u at azimuth alpha).
func TestEllipseOf(t *testing.T) {
	for _, c := range []struct{ l1, l2, azDeg float64 }{{9, 4, 90}, {9, 4, 0}, {16, 1, 30}, {16, 1, 150}, {2, 0, 75}} {
		u := [2]float64{math.Sin(c.azDeg * deg), math.Cos(c.azDeg * deg)}
		w := [2]float64{u[1], -u[0]}
		var cov [2][2]float64
		for a := range 2 {
			for b := range 2 {
				cov[a][b] = c.l1*u[a]*u[b] + c.l2*w[a]*w[b]
			}
		}
		for _, k := range []float64{1, 3} {
			e := suborbital.EllipseOf(cov, k)
			if math.Abs(e.SemiMajor-k*math.Sqrt(c.l1)) > 1e-12 || math.Abs(e.SemiMinor-k*math.Sqrt(c.l2)) > 1e-7 ||
				math.Abs(math.Remainder(e.Azimuth/deg-c.azDeg, 180)) > 1e-9 || e.Azimuth < 0 || e.Azimuth >= math.Pi {
				t.Errorf("EllipseOf(%v, %g) = %+v (az %.9f deg), want %g x %g at %g deg", cov, k, e, e.Azimuth/deg, k*math.Sqrt(c.l1), k*math.Sqrt(c.l2), c.azDeg)
			}
		}
	}
}

func TestDispersionErrors(t *testing.T) {
	cfg, nominal, veh := dispersionSetup()
	for _, d := range []suborbital.Dispersion{
		{Cases: 1},
		{Cases: 10, Sigma: suborbital.Sigma{Speed: -1}},
		{Cases: 10, Sigma: suborbital.Sigma{Azimuth: math.NaN()}},
		{Cases: 10, Workers: -1},
	} {
		if _, err := suborbital.Disperse(cfg, nominal, veh, d); !errors.Is(err, suborbital.ErrDispersion) {
			t.Errorf("Disperse(%+v) = %v, want ErrDispersion", d, err)
		}
	}
	if _, err := suborbital.Disperse(cfg, nominal, suborbital.Vehicle{}, suborbital.Dispersion{Cases: 10, Sigma: suborbital.Sigma{Cd: 0.1}}); !errors.Is(err, suborbital.ErrDispersion) {
		t.Errorf("sigma Cd without drag: %v, want ErrDispersion", err)
	}
	// A case that reaches orbit is reported with its index.
	orbital := suborbital.Burnout{Alt: 300, Speed: 7.6, FlightPath: 0, Azimuth: math.Pi / 2}
	_, err := suborbital.Disperse(cfg, orbital, suborbital.Vehicle{}, suborbital.Dispersion{Cases: 20, Seed: 1, Sigma: suborbital.Sigma{Speed: 0.2}})
	var ce *suborbital.CaseError
	if !errors.As(err, &ce) || !errors.Is(err, suborbital.ErrOrbit) {
		t.Errorf("orbital cases: %v, want a CaseError wrapping ErrOrbit", err)
	}
}
