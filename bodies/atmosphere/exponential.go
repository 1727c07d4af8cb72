package atmosphere

import "math"

// expRow is one row of the exponential density table.
type expRow struct {
	h0   float64 // base altitude, km
	rho0 float64 // nominal density at the base, kg/m^3
	h    float64 // scale height, km
}

// expTable is Vallado, Fundamentals of Astrodynamics and Applications,
// 4th ed. (Microcosm Press, 2013), Table 8-4 "Exponential Atmospheric
// Model" (CIRA-72 above 25 km, U.S. Standard Atmosphere 1976 from 0 to 25
// km), all rows as printed; from memory. The tests check that each scale
// height reproduces the ratio of the next two base densities to the
// table's printed precision, which every row but the first (0-25 km, off
// by 0.14%) does. Only rows from 80 km up are used, above 86 km.
var expTable = [...]expRow{
	{0, 1.225, 7.249},
	{25, 3.899e-2, 6.349},
	{30, 1.774e-2, 6.682},
	{40, 3.972e-3, 7.554},
	{50, 1.057e-3, 8.382},
	{60, 3.206e-4, 7.714},
	{70, 8.770e-5, 6.549},
	{80, 1.905e-5, 5.799},
	{90, 3.396e-6, 5.382},
	{100, 5.297e-7, 5.877},
	{110, 9.661e-8, 7.263},
	{120, 2.438e-8, 9.473},
	{130, 8.484e-9, 12.636},
	{140, 3.845e-9, 16.149},
	{150, 2.070e-9, 22.523},
	{180, 5.464e-10, 29.740},
	{200, 2.789e-10, 37.105},
	{250, 7.248e-11, 45.546},
	{300, 2.418e-11, 53.628},
	{350, 9.518e-12, 53.298},
	{400, 3.725e-12, 58.515},
	{450, 1.585e-12, 60.828},
	{500, 6.967e-13, 63.822},
	{600, 1.454e-13, 71.835},
	{700, 3.614e-14, 88.667},
	{800, 1.170e-14, 124.64},
	{900, 5.245e-15, 181.05},
	{1000, 3.019e-15, 268.00},
}

// exponential returns the table density at altitude hKm (> 86 km), using
// the row with the highest base not above hKm (the last row above 1000 km).
func exponential(hKm float64) float64 {
	// Binary search for the last row with h0 <= hKm.
	lo, hi := 0, len(expTable)-1
	for lo < hi {
		mid := (lo + hi + 1) / 2
		if expTable[mid].h0 <= hKm {
			lo = mid
		} else {
			hi = mid - 1
		}
	}
	r := &expTable[lo]
	return r.rho0 * math.Exp(-(hKm-r.h0)/r.h)
}
