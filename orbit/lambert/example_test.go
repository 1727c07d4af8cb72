package lambert_test

import (
	"errors"
	"fmt"

	"centra/orbit/lambert"
)

// The Lambert problem of Curtis, Orbital Mechanics for Engineering Students,
// 3rd ed., Example 5.2: the printed digits match the book's answer.
func ExampleSolve() {
	const mu = 398600.0 // km^3/s^2
	r1 := [3]float64{5000, 10000, 2100}
	r2 := [3]float64{-14600, 2500, 7000}
	v1, v2, err := lambert.Solve(mu, r1, r2, 3600, lambert.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("v1 = [%.5g %.5g %.5g] km/s\n", v1[0], v1[1], v1[2])
	fmt.Printf("v2 = [%.5g %.5g %.5g] km/s\n", v2[0], v2[1], v2[2])
	// Output:
	// v1 = [-5.9925 1.9254 3.2456] km/s
	// v2 = [-3.3125 -4.1966 -0.38529] km/s
}

// Asking for more complete revolutions than the time of flight allows
// returns the minimum time of flight in the error.
func ExampleSolve_revolutions() {
	const mu = 398600.4418 // km^3/s^2
	r1 := [3]float64{7000, 0, 0}
	r2 := [3]float64{-3000, 6500, 2000}
	_, _, err := lambert.Solve(mu, r1, r2, 10000, lambert.Options{Revs: 2})
	var re *lambert.RevsError
	if errors.As(err, &re) {
		fmt.Printf("%d revolutions need at least %.4g s\n", re.Revs, re.MinTOF)
	}
	v1, _, err := lambert.Solve(mu, r1, r2, 20000, lambert.Options{Revs: 2, Branch: lambert.Right})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("right branch v1 = [%.4f %.4f %.4f] km/s\n", v1[0], v1[1], v1[2])
	// Output:
	// 2 revolutions need at least 1.326e+04 s
	// right branch v1 = [-1.7102 7.9436 2.4442] km/s
}
