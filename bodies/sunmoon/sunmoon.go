package sunmoon

import (
	"math"

	"centra/bodies/earthframe"
	"centra/bodies/timescale"
)

// AU is the astronomical unit in km, exact (IAU 2012 Resolution B2).
const AU = 149597870.7

const deg = math.Pi / 180

// vsopTerm is A cos(B + C tau) of VSOP87 (tau in Julian millennia of TDB
// from J2000), stored as A cos B and A sin B for one frequency slot.
type vsopTerm struct {
	slot   int     // index into the frequency table
	ac, as float64 // A cos B, A sin B (1e-8 rad or 1e-8 au)
}

// Frequencies (rad per Julian millennium) of the retained VSOP87 Earth
// terms (Meeus 1998, Appendix III). Slot 0 is 6283.07585 (one year);
// slot 1 is its double, computed from slot 0.
var vsopFreq = [...]float64{
	6283.0758500, 12566.1517000, 5753.3849, 3.5231, 77713.7715,
	7860.4194, 3930.2097, 11506.7698, 529.6910, 1577.3435,
}

// Retained terms: amplitude A, phase B, frequency slot (Meeus 1998,
// Appendix III, Earth; A in 1e-8 rad or 1e-8 au).
var (
	vL0 = mk([][3]float64{
		{3341656, 4.6692568, 0}, {34894, 4.62610, 1}, {3497, 2.7441, 2}, {3418, 2.8289, 3},
		{3136, 3.6277, 4}, {2676, 4.4181, 5}, {2343, 6.1352, 6}, {1324, 0.7425, 7},
		{1273, 2.0371, 8}, {1199, 1.1096, 9},
	})
	vL1 = mk([][3]float64{{206059, 2.678235, 0}, {4303, 2.6351, 1}})
	vL2 = mk([][3]float64{{8720, 1.0721, 0}})
	vR0 = mk([][3]float64{
		{1670700, 3.0984635, 0}, {13956, 3.05525, 1}, {3084, 5.1985, 4}, {1628, 1.1739, 2},
		{1576, 2.8469, 5},
	})
	vR1 = mk([][3]float64{{103019, 1.107490, 0}, {1721, 1.0644, 1}})
	vR2 = mk([][3]float64{{4359, 5.7846, 0}})
)

// Constant terms (B = C = 0) of the series.
const (
	vL0c = 175347046.0
	vL1c = 628331966747.0
	vL2c = 52919.0
	vR0c = 100013989.0
	vR1c = 0.0
	vR2c = 0.0
)

func mk(t [][3]float64) []vsopTerm {
	out := make([]vsopTerm, len(t))
	for i, x := range t {
		s, c := math.Sincos(x[1])
		out[i] = vsopTerm{slot: int(x[2]), ac: x[0] * c, as: x[0] * s}
	}
	return out
}

func vsum(ts []vsopTerm, c, s *[len(vsopFreq)]float64) float64 {
	var w float64
	for i := len(ts) - 1; i >= 0; i-- {
		x := &ts[i]
		w += x.ac*c[x.slot] - x.as*s[x.slot]
	}
	return w
}

// SunEcliptic returns the Sun's geometric geocentric ecliptic longitude
// (rad, [0, 2pi)) and distance (km), referred to the mean ecliptic and
// equinox of date, at the TT Julian date tt1+tt2. The ecliptic latitude
// (below 1.2 arcsec) is taken as zero.
func SunEcliptic(tt1, tt2 float64) (lon, dist float64) {
	tau := ((tt1 - timescale.J2000) + tt2) / 365250
	var c, s [len(vsopFreq)]float64
	for i, f := range vsopFreq {
		if i == 1 { // double angle of slot 0
			s[1], c[1] = 2*s[0]*c[0], c[0]*c[0]-s[0]*s[0]
			continue
		}
		s[i], c[i] = math.Sincos(f * tau)
	}
	l := (vL0c + vsum(vL0, &c, &s)) +
		tau*((vL1c+vsum(vL1, &c, &s))+
			tau*(vL2c+vsum(vL2, &c, &s)))
	r := (vR0c + vsum(vR0, &c, &s)) +
		tau*((vR1c+vsum(vR1, &c, &s))+
			tau*(vR2c+vsum(vR2, &c, &s)))
	lon = math.Mod(l*1e-8+math.Pi, 2*math.Pi)
	if lon < 0 {
		lon += 2 * math.Pi
	}
	return lon, r * 1e-8 * AU
}

// SunJD returns the geocentric position of the Sun in the GCRF (km) at
// the TT Julian date tt1+tt2.
func SunJD(tt1, tt2 float64) [3]float64 {
	lon, r := SunEcliptic(tt1, tt2)
	return eclipticToGCRF(tt1, tt2, lon, 0, r)
}

// phi0 is the constant term of the Fukushima-Williams angle phi_bar,
// 84381.412819 arcsec (IERS Conventions 2010, eq. 5.40).
var sinPhi0, cosPhi0 = math.Sincos(84381.412819 / 3600 * deg)

// eclipticToGCRF returns the GCRF vector of the point at longitude lon,
// latitude lat (rad) and distance r on the mean ecliptic and equinox of
// date: transpose(R3(-psi_bar) R1(phi_bar) R3(gamma_bar)) applied as
// R3(-gamma_bar) R1(-phi_bar) R3(psi_bar), the last folded into the
// longitude. It equals earthframe.EclipticOfDate transposed times the
// vector, with the sines and cosines of the small angles gamma_bar and
// phi_bar - phi0 (below 2e-4 rad for |t| < 4 centuries) from their
// Taylor series (error below 1e-18).
func eclipticToGCRF(tt1, tt2, lon, lat, r float64) [3]float64 {
	g, p, psi, _ := earthframe.PrecessionAngles(tt1, tt2)
	sl, cl := math.Sincos(lon - psi)
	sb, cb := math.Sincos(lat)
	x, y, z := r*cb*cl, r*cb*sl, r*sb
	d := p - 84381.412819/3600*deg
	d2 := d * d
	sd, cd := d*(1-d2/6), 1-d2/2*(1-d2/12)
	sp, cp := sinPhi0*cd+cosPhi0*sd, cosPhi0*cd-sinPhi0*sd
	y, z = cp*y-sp*z, sp*y+cp*z
	g2 := g * g
	sg, cg := g*(1-g2/6), 1-g2/2*(1-g2/12)
	return [3]float64{cg*x - sg*y, sg*x + cg*y, z}
}

// Sun returns the geocentric position of the Sun in the GCRF (km) at e.
func Sun(e timescale.Epoch) [3]float64 { return SunJD(e.JDTT()) }

// poly evaluates c0 + c1 t + c2 t^2 + c3 t^3 + c4 t^4 (degrees) and
// returns radians.
func poly(t, c0, c1, c2, c3, c4 float64) float64 {
	return math.Mod(c0+(c1+(c2+(c3+c4*t)*t)*t)*t, 360) * deg
}

// MoonEcliptic returns the Moon's geometric geocentric ecliptic longitude
// (rad, [0, 2pi)), latitude (rad) and distance (km), referred to the mean
// ecliptic and equinox of date, at the TT Julian date tt1+tt2 (Meeus
// 1998, chapter 47).
func MoonEcliptic(tt1, tt2 float64) (lon, lat, dist float64) {
	t := ((tt1 - timescale.J2000) + tt2) / timescale.DaysPerCentury
	// Mean elements (Meeus eqs. 47.1-47.5; L' of Simon et al. 1994
	// without the light-time constant).
	lp := poly(t, 218.31665436, 481267.88123421, -0.0015786, 1/538841.0, -1/65194000.0)
	d := poly(t, 297.8501921, 445267.1114034, -0.0018819, 1/545868.0, -1/113065000.0)
	m := poly(t, 357.5291092, 35999.0502909, -0.0001536, 1/24490000.0, 0)
	mp := poly(t, 134.9633964, 477198.8675055, 0.0087414, 1/69699.0, -1/14712000.0)
	f := poly(t, 93.2720950, 483202.0175233, -0.0036539, -1/3526000.0, 1/863310000.0)
	a1 := poly(t, 119.75, 131.849, 0, 0, 0)
	a2 := poly(t, 53.09, 479264.290, 0, 0, 0)
	a3 := poly(t, 313.45, 481266.484, 0, 0, 0)
	e := 1 + (-0.002516-0.0000074*t)*t // eq. 47.6
	ef := [3]float64{1, e, e * e}

	// cos/sin of k*arg for k = 0..4 and the four arguments.
	var hc, hs [4][5]float64
	for j, x := range [4]float64{d, m, mp, f} {
		s1, c1 := math.Sincos(x)
		hc[j][0], hs[j][0] = 1, 0
		for k := 1; k < 5; k++ {
			hc[j][k] = hc[j][k-1]*c1 - hs[j][k-1]*s1
			hs[j][k] = hs[j][k-1]*c1 + hc[j][k-1]*s1
		}
	}
	arg := func(n *[4]int8) (s, c float64, mabs int) {
		c, s = 1, 0
		for j, k := range n {
			if k == 0 {
				continue
			}
			kk, sg := int(k), 1.0
			if kk < 0 {
				kk, sg = -kk, -1
			}
			cc, ss := hc[j][kk], sg*hs[j][kk]
			c, s = c*cc-s*ss, s*cc+c*ss
		}
		mabs = int(n[1])
		if mabs < 0 {
			mabs = -mabs
		}
		return s, c, mabs
	}
	var sl, sr, sb float64
	for i := len(moonTabLR) - 1; i >= 0; i-- {
		x := &moonTabLR[i]
		s, c, ma := arg(&x.n)
		sl += x.l * ef[ma] * s
		sr += x.r * ef[ma] * c
	}
	for i := len(moonTabB) - 1; i >= 0; i-- {
		x := &moonTabB[i]
		s, _, ma := arg(&x.n)
		sb += x.b * ef[ma] * s
	}
	// Additive terms (Meeus p. 338), degrees.
	sl += 0.003958*math.Sin(a1) + 0.001962*math.Sin(lp-f) + 0.000318*math.Sin(a2)
	sb += -0.002235*math.Sin(lp) + 0.000382*math.Sin(a3) + 0.000175*math.Sin(a1-f) +
		0.000175*math.Sin(a1+f) + 0.000127*math.Sin(lp-mp) - 0.000115*math.Sin(lp+mp)

	lon = math.Mod(lp+sl*deg, 2*math.Pi)
	if lon < 0 {
		lon += 2 * math.Pi
	}
	return lon, sb * deg, 385000.56 + sr/1000
}

// MoonJD returns the geocentric position of the Moon in the GCRF (km) at
// the TT Julian date tt1+tt2.
func MoonJD(tt1, tt2 float64) [3]float64 {
	lon, lat, r := MoonEcliptic(tt1, tt2)
	return eclipticToGCRF(tt1, tt2, lon, lat, r)
}

// Moon returns the geocentric position of the Moon in the GCRF (km) at e.
func Moon(e timescale.Epoch) [3]float64 { return MoonJD(e.JDTT()) }
