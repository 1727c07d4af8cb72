package atmosphere_test

import (
	"fmt"

	"centra/bodies/atmosphere"
)

func ExampleProperties() {
	for _, h := range []float64{0, 11, 86, 400} {
		p, err := atmosphere.Properties(h)
		if err != nil {
			fmt.Println(err)
			continue
		}
		if p.HasTemperature {
			fmt.Printf("%4.0f km  %-8s  rho %.5g kg/m^3  T %.3f K  P %.5g Pa\n", h, p.Model, p.DensityKgM3, p.TemperatureK, p.PressurePa)
		} else {
			fmt.Printf("%4.0f km  %s  rho %.5g kg/m^3\n", h, p.Model, p.DensityKgM3)
		}
	}
	_, err := atmosphere.Properties(-6)
	fmt.Println(err)
	// Output:
	//    0 km  ussa1976  rho 1.225 kg/m^3  T 288.150 K  P 1.0132e+05 Pa
	//   11 km  ussa1976  rho 0.3648 kg/m^3  T 216.774 K  P 22700 Pa
	//   86 km  ussa1976  rho 6.9578e-06 kg/m^3  T 186.946 K  P 0.37338 Pa
	//  400 km  exponential-vallado-table-8-4  rho 3.725e-12 kg/m^3
	// atmosphere: altitude -6 km is below the model's lowest altitude -5 km; give an altitude of at least -5 km
}

func ExampleDensityScale() {
	scale := atmosphere.DensityScale(2) // e.g. high solar activity
	if err := scale.Validate(); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.4g kg/m^3\n", scale.Density(400))
	fmt.Println(atmosphere.DensityScale(0).Validate())
	// Output:
	// 7.45e-12 kg/m^3
	// atmosphere: bad density scale: 0 is not in (0, 1000]; give a positive factor, 1 for the model as published
}
