package gravity_test

import (
	"fmt"
	"math"

	"centra/propagate/gravity"
)

// The Earth's gravitational acceleration at 500 km altitude over the
// equator and over the pole, point mass and J2.
func ExampleZonal_Acceleration() {
	const mu, re = 398600.4418, 6378.137
	j2 := 4.84165143790815e-4 * math.Sqrt(5) // -C20 sqrt(5), EGM2008
	f, err := gravity.New(mu, re, []float64{0, 0, j2}, 2)
	if err != nil {
		fmt.Println(err)
		return
	}
	r := re + 500
	eq := f.Acceleration([3]float64{r, 0, 0})
	pole := f.Acceleration([3]float64{0, 0, r})
	fmt.Printf("equator %.6f m/s^2, pole %.6f m/s^2, point mass %.6f m/s^2\n", -eq[0]*1e3, -pole[2]*1e3, mu/(r*r)*1e3)
	// Output:
	// equator 8.437274 m/s^2, pole 8.401978 m/s^2, point mass 8.425509 m/s^2
}
