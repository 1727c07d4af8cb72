package suborbital_test

import (
	"fmt"
	"math"

	"centra/bodies/geodesy"
	"centra/propagate"
	"centra/propagate/suborbital"
)

// A sounding payload, burnout 35 km above a coastal range at 2 km/s and
// 84 deg, in the J2 field of a rotating Earth, without and with drag.
func ExampleFlight_Fly() {
	const (
		mu, re, j2 = 398600.4418, 6378.137, 1.0826e-3
		omega      = 7.292115e-5
		deg        = math.Pi / 180
	)
	f, err := suborbital.New(suborbital.Config{Gravity: propagate.J2(mu, re, j2), Omega: omega, Above: 100})
	if err != nil {
		fmt.Println(err)
		return
	}
	b := suborbital.Burnout{Lat: 57.4 * deg, Lon: -7.3 * deg, Alt: 35, Speed: 2.0, FlightPath: 84 * deg, Azimuth: 290 * deg}
	for _, v := range []suborbital.Vehicle{{}, {Mass: 25, Area: 0.02, Cd: 0.9}} {
		arc, err := f.Fly(b, v, nil)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("apogee %.1f km after %.0f s, %.0f s above 100 km, impact after %.0f s at %.1f km towards %.0f deg, %.3f km/s\n",
			arc.Apogee.Alt, arc.Apogee.T, arc.TimeAbove, arc.FlightTime, arc.GroundRange, arc.RangeAzimuth/deg, arc.Impact.Speed)
	}
	// Output:
	// apogee 245.2 km after 214 s, 356 s above 100 km, impact after 444 s at 92.8 km towards 291 deg, 2.164 km/s
	// apogee 236.4 km after 209 s, 344 s above 100 km, impact after 465 s at 88.8 km towards 291 deg, 0.167 km/s
}

// The impact ellipses of 500 dispersed arcs; the cases carry the impact
// points for a plot.
func ExampleDisperse() {
	const deg = math.Pi / 180
	cfg := suborbital.Config{Gravity: propagate.J2(398600.4418, 6378.137, 1.0826e-3), Omega: 7.292115e-5, Above: 100}
	b := suborbital.Burnout{Lat: 57.4 * deg, Lon: -7.3 * deg, Alt: 35, Speed: 2.0, FlightPath: 84 * deg, Azimuth: 290 * deg}
	res, err := suborbital.Disperse(cfg, b, suborbital.Vehicle{Mass: 25, Area: 0.02, Cd: 0.9}, suborbital.Dispersion{
		Cases: 500, Seed: 1, Sigma: suborbital.Sigma{Speed: 0.01, FlightPath: 0.5 * deg, Azimuth: 1 * deg, Cd: 0.05}})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("mean impact %.3f deg, %.3f deg\n", res.MeanLat/deg, res.MeanLon/deg)
	fmt.Printf("3-sigma ellipse %.1f x %.1f km, major axis at %.0f deg\n", res.Sigma3.SemiMajor, res.Sigma3.SemiMinor, res.Sigma3.Azimuth/deg)
	fmt.Printf("apogee %.1f ± %.1f km\n", res.Apogee.Mean, res.Apogee.Std)
	fmt.Printf("%d impact points, the first at %.3f deg, %.3f deg\n", len(res.Cases), res.Cases[0].ImpactLat/deg, res.Cases[0].ImpactLon/deg)
	// Output:
	// mean impact 57.671 deg, -8.691 deg
	// 3-sigma ellipse 20.6 x 4.4 km, major axis at 110 deg
	// apogee 236.3 ± 2.1 km
	// 500 impact points, the first at 57.655 deg, -8.643 deg
}

// The ground range of a flight on the WGS 84 ellipsoid.
func ExampleInverse() {
	const deg = math.Pi / 180
	s, az1, _, err := suborbital.Inverse(geodesy.WGS84, 57.4*deg, -7.3*deg, 57.9*deg, -9.6*deg)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.6f km towards %.4f deg\n", s, az1/deg)
	// Output:
	// 148.181053 km towards 293.0408 deg
}
