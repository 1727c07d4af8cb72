package geodesy_test

import (
	"fmt"
	"math"

	"centra/bodies/geodesy"
)

func ExampleEllipsoid_FromECEF() {
	// Vallado 4th ed. Example 7-1 site, printed to 0.1 m.
	lat, lon, h := geodesy.WGS84.FromECEF([3]float64{-1275.1219, -4797.9890, 3994.2975})
	fmt.Printf("%.5f deg %.5f deg %.4f km\n", lat*180/math.Pi, lon*180/math.Pi, h)
	// Output:
	// 39.00700 deg -104.88300 deg 2.1870 km
}

func ExampleStation_Look() {
	st, err := geodesy.NewStation(geodesy.Site{Lat: 39.007 * math.Pi / 180, Lon: -104.883 * math.Pi / 180, Alt: 2.187})
	if err != nil {
		fmt.Println(err)
		return
	}
	// An object 500 km straight above the station, climbing at 1 km/s.
	up := st.ENU[2]
	r := [3]float64{st.R[0] + 500*up[0], st.R[1] + 500*up[1], st.R[2] + 500*up[2]}
	v := [3]float64{up[0], up[1], up[2]}
	l := st.Look(r, v)
	fmt.Printf("el %.4f deg, range %.3f km, range rate %.3f km/s\n", l.El*180/math.Pi, l.Range, l.RangeRate)
	_, err = geodesy.NewStation(geodesy.Site{Lat: 2, Lon: 0, Alt: 0})
	fmt.Println(err)
	// Output:
	// el 90.0000 deg, range 500.000 km, range rate 1.000 km/s
	// geodesy: invalid site latitude 114.592 deg; give a latitude from -90 to 90 deg
}
