package orbit_test

import (
	"errors"
	"fmt"
	"math"

	"centra/orbit"
)

const deg = math.Pi / 180

// The state of Vallado, Fundamentals of Astrodynamics and Applications,
// 4th ed., Example 2-5.
func ExampleElementsFromState() {
	s := orbit.State{
		R: [3]float64{6524.834, 6862.875, 6448.296},  // km
		V: [3]float64{4.901327, 5.533756, -1.976341}, // km/s
	}
	el, err := orbit.ElementsFromState(398600.4418, s)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("p = %.3f km, a = %.3f km, e = %.6f\n", el.P, el.A, el.E)
	fmt.Printf("i = %.3f deg, RAAN = %.3f deg, argp = %.3f deg, nu = %.3f deg\n",
		el.I/deg, el.RAAN/deg, el.ArgP/deg, el.Nu/deg)
	// Output:
	// p = 11067.798 km, a = 36127.338 km, e = 0.832853
	// i = 87.869 deg, RAAN = 227.898 deg, argp = 53.385 deg, nu = 92.335 deg
}

// Vallado 4th ed. Example 2-1: M = 235.4 deg, e = 0.4.
func ExampleSolveKeplerElliptic() {
	E := orbit.SolveKeplerElliptic(235.4*deg, 0.4)
	fmt.Printf("E = %.9f deg\n", E/deg)
	fmt.Printf("nu = %.6f deg\n", orbit.TrueFromEccentric(E, 0.4)/deg)
	// Output:
	// E = 220.512074768 deg
	// nu = 207.163992 deg
}

// Vallado 4th ed. Example 2-4: 40 minutes of two-body motion.
func ExamplePropagate() {
	s0 := orbit.State{
		R: [3]float64{1131.340, -2282.343, 6672.423},
		V: [3]float64{-5.64305, 4.30333, 2.42879},
	}
	s, err := orbit.Propagate(398600.4418, s0, 40*60)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("r = [%.4f %.4f %.4f] km\n", s.R[0], s.R[1], s.R[2])
	fmt.Printf("v = [%.6f %.6f %.6f] km/s\n", s.V[0], s.V[1], s.V[2])
	// Output:
	// r = [-4219.7527 4363.0292 -3958.7666] km
	// v = [3.689866 -1.916735 -6.112511] km/s
}

// A circular orbit 800 km above the WGS 84 equator, EGM2008 J2.
func ExampleSunSynchronousInclination() {
	const re = 6378.137
	i, err := orbit.SunSynchronousInclination(398600.4418, re, 1.08262668e-3, re+800, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("i = %.3f deg\n", i/deg)
	// 8000 km up, J2 cannot turn the plane as fast as the Sun moves.
	_, err = orbit.SunSynchronousInclination(398600.4418, re, 1.08262668e-3, re+8000, 0)
	fmt.Println(errors.Is(err, orbit.ErrNoSunSynchronous))
	// Output:
	// i = 98.603 deg
	// true
}
