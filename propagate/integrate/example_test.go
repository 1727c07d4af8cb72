package integrate_test

import (
	"fmt"
	"math"

	"centra/propagate/integrate"
)

// The harmonic oscillator x” = -x from x = 1 at rest: x = cos t. Its
// falling zeros (t = pi/2 + 2 k pi) are located on the dense output, and
// the state is sampled every pi/2.
func ExampleSolver_Integrate() {
	f := func(dst []float64, _ float64, y []float64) error {
		dst[0], dst[1] = y[1], -y[0]
		return nil
	}
	s, err := integrate.New(2, f, integrate.Settings{RelTol: 1e-12, AbsTol: 1e-12})
	if err != nil {
		fmt.Println(err)
		return
	}
	obs := &integrate.Observer{
		Step: math.Pi / 2,
		Sample: func(t float64, y []float64) error {
			fmt.Printf("t = %.4f  x = %.9f\n", t, math.Round(y[0]*1e9)/1e9+0)
			return nil
		},
		Events: []integrate.Event{{G: func(_ float64, y []float64) float64 { return y[0] }, Direction: -1}},
		OnEvent: func(h integrate.Hit) error {
			fmt.Printf("x falls through 0 at t = %.12f (pi/2 = %.12f)\n", h.T, math.Pi/2)
			return nil
		},
	}
	y := make([]float64, 2)
	if _, err := s.Integrate(y, 0, []float64{1, 0}, 2*math.Pi, obs); err != nil {
		fmt.Println(err)
		return
	}
	// Output:
	// t = 0.0000  x = 1.000000000
	// t = 1.5708  x = 0.000000000
	// x falls through 0 at t = 1.570796326795 (pi/2 = 1.570796326795)
	// t = 3.1416  x = -1.000000000
	// t = 4.7124  x = 0.000000000
	// t = 6.2832  x = 1.000000000
}
