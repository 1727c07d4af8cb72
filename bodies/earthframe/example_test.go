package earthframe_test

import (
	"fmt"
	"math"

	"centra/bodies/earthframe"
	"centra/bodies/timescale"
)

func ExampleNewRotation() {
	e := timescale.MustParseUTC("2024-03-20T03:06:00Z")
	rot := earthframe.NewRotation(e, 0) // DUT1 = 0
	r := [3]float64{7000, 0, 0}         // km, GCRF
	v := [3]float64{0, 7.5, 0}          // km/s
	rf, vf := rot.StateToITRF(r, v)
	fmt.Printf("r_ITRF = %.3f %.3f %.3f km\n", rf[0], rf[1], rf[2])
	fmt.Printf("v_ITRF = %.6f %.6f %.6f km/s\n", vf[0], vf[1], vf[2])
	// Output:
	// r_ITRF = -5006.778 4892.024 16.411 km
	// v_ITRF = -4.884736 -4.999321 0.000289 km/s
}

func ExampleGMST() {
	// Vallado 4th ed. Example 3-5: 1992-08-20 12:14 UT1.
	ut1a, ut1b := 2448854.5, (12*60+14)/1440.0
	g := earthframe.GMST(ut1a, ut1b, ut1a, ut1b+59.184/86400)
	fmt.Printf("GMST = %.6f deg\n", g*180/math.Pi)
	// Output:
	// GMST = 152.578798 deg
}
