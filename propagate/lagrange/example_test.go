package lagrange_test

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/num/hyperdual"

	"centra/orbit"
	"centra/propagate/lagrange"
)

// A plane pendulum of length l in gravity g, L = l^2 thetadot^2/2 +
// g l cos(theta) per unit mass: the engine derives
// thetaddot = -(g/l) sin(theta).
func ExampleSystem_Accelerations() {
	const g, l = 9.81, 2.0
	pendulum := func(_ hyperdual.Number, q, qd []hyperdual.Number) hyperdual.Number {
		kinetic := hyperdual.Scale(l*l/2, hyperdual.Mul(qd[0], qd[0]))
		return hyperdual.Add(kinetic, hyperdual.Scale(g*l, hyperdual.Cos(q[0])))
	}
	sys, err := lagrange.New(1, pendulum, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	acc := make([]float64, 1)
	theta := 0.5
	if err := sys.Accelerations(acc, 0, []float64{theta}, []float64{0.3}); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("engine %.12f, -(g/l) sin(theta) %.12f\n", acc[0], -g/l*math.Sin(theta))
	// Output:
	// engine -2.351582266854, -(g/l) sin(theta) -2.351582266854
}

// The polar form of a Keplerian state: an orbit plane and (r, theta,
// rdot, thetadot).
func ExampleToPolar() {
	pl, p, err := lagrange.ToPolar(orbitState())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("r = %.3f km, rdot = %.6f km/s, thetadot = %.9f rad/s, W = (%.3f, %.3f, %.3f)\n",
		p.R, p.RDot, p.ThetaDot, pl.W[0], pl.W[1], pl.W[2])
	// Output:
	// r = 7000.000 km, rdot = 1.000000 km/s, thetadot = 0.001000000 rad/s, W = (0.000, 0.000, 1.000)
}

func orbitState() orbit.State {
	return orbit.State{R: [3]float64{7000, 0, 0}, V: [3]float64{1, 7, 0}}
}
