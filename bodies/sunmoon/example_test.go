package sunmoon_test

import (
	"fmt"
	"math"

	"centra/bodies/sunmoon"
	"centra/bodies/timescale"
)

func ExampleSun() {
	e := timescale.MustParseUTC("2024-03-20T03:06:00Z") // near the March equinox
	s := sunmoon.Sun(e)
	r := math.Sqrt(s[0]*s[0] + s[1]*s[1] + s[2]*s[2])
	fmt.Printf("%.4f au, RA %.2f deg, Dec %.2f deg\n", r/sunmoon.AU,
		math.Mod(math.Atan2(s[1], s[0])*180/math.Pi+360, 360), math.Asin(s[2]/r)*180/math.Pi)
	// Output:
	// 0.9959 au, RA 359.70 deg, Dec -0.13 deg
}

func ExampleMoonEcliptic() {
	// Meeus, Astronomical Algorithms, 2nd ed., Example 47.a (geometric).
	lon, lat, dist := sunmoon.MoonEcliptic(2448724.5, 0)
	fmt.Printf("lambda %.6f deg, beta %.6f deg, %.1f km\n", lon*180/math.Pi, lat*180/math.Pi, dist)
	// Output:
	// lambda 133.162861 deg, beta -3.229126 deg, 368409.7 km
}
