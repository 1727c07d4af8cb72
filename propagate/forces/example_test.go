package forces_test

import (
	"fmt"
	"math"

	"centra/bodies/timescale"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/forces"
)

// A day of a 400 km orbit with J2, drag and the Moon.
func Example() {
	const mu, re, j2 = 398600.4418, 6378.137, 1.0826e-3
	ep := timescale.MustParseUTC("2027-04-12T09:30:00Z")
	drag, err := forces.NewDrag(forces.DragConfig{
		BallisticCoefficient: forces.BallisticCoefficient(4.2, 2.2, 0.034), // kg/m^2
		RotationRate:         7.292115e-5,                                  // rad/s
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	moon := &forces.ThirdBody{Name: "moon", GM: 4902.800118, Position: forces.NewMoonEphemeris(ep).Position}
	m := propagate.J2(mu, re, j2)
	m.Perturbation = forces.Combine(drag.Perturbation(), moon.Perturbation())
	p, err := propagate.New(m, propagate.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	a := re + 400
	s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: a, P: a, I: 51.6 * math.Pi / 180})
	s1, err := p.Propagate(s0, 86400)
	if err != nil {
		fmt.Println(err)
		return
	}
	r := math.Sqrt(s1.R[0]*s1.R[0] + s1.R[1]*s1.R[1] + s1.R[2]*s1.R[2])
	fmt.Printf("B = %.4g kg/m^2, radius after a day %.1f km\n", drag.BallisticCoefficient(), r)
	// Output:
	// B = 56.15 kg/m^2, radius after a day 6766.5 km
}

// The fraction of the Sun visible across the Earth's penumbra.
func ExampleShadowFunction() {
	sun := [3]float64{forces.AU, 0, 0}
	for _, y := range []float64{6330, 6360, 6390, 6420} {
		nu := forces.ShadowFunction([3]float64{-7000, y, 0}, sun, 6378.137, forces.SunRadius)
		fmt.Printf("y = %.0f km: %.3f\n", y, nu)
	}
	// Output:
	// y = 6330 km: 0.000
	// y = 6360 km: 0.160
	// y = 6390 km: 0.722
	// y = 6420 km: 1.000
}
