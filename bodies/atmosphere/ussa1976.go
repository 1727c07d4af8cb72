package atmosphere

import "math"

// U.S. Standard Atmosphere 1976 (NOAA-S/T 76-1562), Part 1 constants.
const (
	g0    = 9.80665                // m/s^2, standard acceleration of gravity (sea-level value at 45.5425 deg latitude)
	rStar = 8.31432e3              // J/(kmol K), universal gas constant as adopted by the standard (8.31432 J/(mol K))
	m0    = 28.9644                // kg/kmol, sea-level mean molecular weight
	r0Km  = 6356.766               // km, effective Earth radius for the geopotential altitude
	t0    = 288.15                 // K, sea-level temperature
	p0    = 101325.0               // Pa, sea-level pressure
	hTop  = 84.852                 // km', geopotential altitude of the top of the seventh layer (86 km geometric)
	gmrKm = g0 * m0 / rStar * 1000 // K/km': g0 M0 / R* per geopotential km (34.1632 K/km')
)

// layer is one of the standard's seven geopotential layers.
type layer struct {
	hb float64 // base geopotential altitude, km'
	lb float64 // molecular-scale temperature gradient, K/km'
	tb float64 // molecular-scale temperature at the base, K (derived)
	pb float64 // pressure at the base, Pa (derived)
}

// layers holds the standard's Table 4 layer definitions; tb and pb are
// filled in by init from T0, P0 and the hydrostatic equations, exactly as
// the standard derives them. The last entry is the standard's base b = 7 at
// 84.852 km' (T_M = 186.946 K): 86 km geometric is 84.852046 km', a little
// above it, and the last 0.05 m' are taken as isothermal at 186.946 K.
var layers = [...]layer{
	{hb: 0, lb: -6.5},
	{hb: 11, lb: 0},
	{hb: 20, lb: 1.0},
	{hb: 32, lb: 2.8},
	{hb: 47, lb: 0},
	{hb: 51, lb: -2.8},
	{hb: 71, lb: -2.0},
	{hb: hTop, lb: 0},
}

func init() {
	layers[0].tb, layers[0].pb = t0, p0
	for i := 1; i < len(layers); i++ {
		prev := &layers[i-1]
		layers[i].tb = prev.tb + prev.lb*(layers[i].hb-prev.hb)
		layers[i].pb = layerPressure(prev, layers[i].hb)
	}
}

// layerPressure is the standard's closed-form solution of the hydrostatic
// equation within one layer (its equations 33a and 33b).
func layerPressure(l *layer, h float64) float64 {
	if l.lb == 0 {
		return l.pb * math.Exp(-gmrKm*(h-l.hb)/l.tb)
	}
	return l.pb * math.Pow(l.tb/(l.tb+l.lb*(h-l.hb)), gmrKm/l.lb)
}

// geopotential converts geometric altitude Z (km) to geopotential
// altitude H (km'), H = r0 Z / (r0 + Z).
func geopotential(zKm float64) float64 { return r0Km * zKm / (r0Km + zKm) }

// ussa1976 returns molecular-scale temperature (K), pressure (Pa) and
// density (kg/m^3) at geometric altitude zKm in [-5, 86].
func ussa1976(zKm float64) (t, p, rho float64) {
	h := geopotential(zKm)
	i := len(layers) - 1
	for i > 0 && h < layers[i].hb {
		i--
	}
	l := &layers[i]
	t = l.tb + l.lb*(h-l.hb)
	p = layerPressure(l, h)
	rho = p * m0 / (rStar * t)
	return t, p, rho
}
