package decay_test

import (
	"fmt"
	"math"

	"centra/bodies/atmosphere"
	"centra/orbit"
	"centra/propagate"
	"centra/propagate/decay"
	"centra/propagate/forces"
)

// The lifetime of a 3U CubeSat released at 400 km, bracketed for solar
// activity by half and double the model density.
func ExampleLifetime() {
	const mu, re = 398600.4418, 6378.137
	j := []float64{0, 0, 1.0826e-3, -2.532e-6}
	a := re + 400
	s0, _ := orbit.StateFromElements(mu, orbit.Elements{A: a, P: a, I: 51.6 * math.Pi / 180})
	for _, scale := range []float64{0.5, 1, 2} {
		drag, err := forces.NewDrag(forces.DragConfig{
			BallisticCoefficient: forces.BallisticCoefficient(4, 2.2, 0.03), // kg/m^2
			DensityScale:         atmosphere.DensityScale(scale),
			RotationRate:         7.292115e-5, // rad/s
		})
		if err != nil {
			fmt.Println(err)
			return
		}
		res, err := decay.Lifetime(decay.Config{Gravity: propagate.Zonal(mu, re, j, 3), Drag: drag}, s0)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("density x%g: %.0f days\n", scale, res.T/86400)
	}
	// Output:
	// density x0.5: 401 days
	// density x1: 201 days
	// density x2: 100 days
}
