package propagate_test

import (
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate"
)

// A circular orbit at 500 km altitude with J2, streamed every 30 minutes
// for three hours, with its ascending nodes.
func ExamplePropagator_Run() {
	const mu, re, j2 = 398600.4418, 6378.137, 1.08262668e-3
	r := re + 500
	v := math.Sqrt(mu / r)
	inc := 51.6 * math.Pi / 180
	s0 := orbit.State{R: [3]float64{r, 0, 0}, V: [3]float64{0, v * math.Cos(inc), v * math.Sin(inc)}}

	p, err := propagate.New(propagate.J2(mu, re, j2), propagate.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	res, err := p.Run(s0, 3*3600, &propagate.Output{
		Step: 1800,
		OnState: func(t float64, s orbit.State) error {
			fmt.Printf("t = %5.0f s  z = %9.3f km\n", t, s.R[2])
			return nil
		},
		Events: []propagate.Event{{Kind: propagate.AscendingNode}},
		OnEvent: func(h propagate.EventHit) error {
			fmt.Printf("%s at t = %.3f s\n", h.Name, h.T)
			return nil
		},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("steps %d\n", res.Stats.Steps)
	// Output:
	// t =     0 s  z =     0.000 km
	// t =  1800 s  z =  4903.652 km
	// t =  3600 s  z = -4049.455 km
	// t =  5400 s  z = -1560.377 km
	// ascending_node at t = 5665.361 s
	// t =  7200 s  z =  5335.855 km
	// t =  9000 s  z = -2846.265 km
	// t = 10800 s  z = -2986.601 km
	// steps 61
}

// The conservation and Kepler-law checks of one day of an e = 0.1 orbit.
func ExampleChecks() {
	const mu = 398600.4418
	rp, e := 6750.0, 0.1
	vp := math.Sqrt(mu * (1 + e) / rp)
	s0 := orbit.State{R: [3]float64{rp, 0, 0}, V: [3]float64{0, vp, 0}}
	checks, err := propagate.Checks(propagate.PointMass(mu), s0, 86400, propagate.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, c := range checks {
		fmt.Printf("%-30s %-14.8g pass %v\n", c.Name, c.Expected, c.Pass)
	}
	// Output:
	// energy_conservation            -26.573363     pass true
	// angular_momentum_conservation  54402.282      pass true
	// third_law_period               6464.0227      pass true
	// second_law_areal_rate          27201.141      pass true
	// periapsis_radius               6750           pass true
	// apoapsis_radius                8250           pass true
}

// One period of a Keplerian ellipse brings the state back, here with the
// equations derived by the Lagrangian engine in polar coordinates.
func ExamplePropagator_Propagate() {
	const mu = 398600.4418
	rp, e := 7000.0, 0.3
	a := rp / (1 - e)
	s0 := orbit.State{R: [3]float64{rp, 0, 0}, V: [3]float64{0, 0, math.Sqrt(mu * (1 + e) / rp)}}
	p, _ := propagate.New(propagate.PointMass(mu), propagate.Options{RelTol: 1e-12, Equations: propagate.EnginePolar})
	s1, err := p.Propagate(s0, 2*math.Pi*math.Sqrt(a*a*a/mu))
	if err != nil {
		fmt.Println(err)
		return
	}
	d := math.Sqrt((s1.R[0]-s0.R[0])*(s1.R[0]-s0.R[0]) + s1.R[1]*s1.R[1] + s1.R[2]*s1.R[2])
	fmt.Printf("r = %.6f km, back within 1 mm: %v\n", math.Sqrt(s1.R[0]*s1.R[0]+s1.R[1]*s1.R[1]+s1.R[2]*s1.R[2]), d < 1e-6)
	// Output:
	// r = 7000.000000 km, back within 1 mm: true
}
