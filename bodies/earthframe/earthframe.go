package earthframe

import (
	"math"

	"centra/bodies/timescale"
)

// Angle and time constants.
const (
	twoPi = 2 * math.Pi
	// ArcsecToRad converts arcseconds to radians.
	ArcsecToRad = math.Pi / (180 * 3600)
	// turnArcsec is one turn in arcseconds.
	turnArcsec = 1296000.0
	j2000      = timescale.J2000
	century    = timescale.DaysPerCentury

	// OmegaEarth is the rate of the Earth rotation angle in rad/s:
	// 2pi * 1.00273781191135448 / 86400 (IERS Conventions 2010, eq. 5.15;
	// the nominal value 7.292115e-5 rad/s of WGS 84, NIMA TR8350.2
	// section 3.2.4, agrees to 1.5e-12 rad/s).
	OmegaEarth = twoPi * 1.00273781191135448 / 86400
)

// Mat is a 3x3 rotation matrix, row-major.
type Mat = [3][3]float64

// Vec is a 3-vector.
type Vec = [3]float64

// ERA returns the Earth rotation angle in [0, 2pi) at the UT1 Julian date
// ut1a+ut1b (IERS Conventions 2010, eq. 5.15):
// 2pi (0.7790572732640 + 1.00273781191135448 (JD_UT1 - 2451545.0)).
func ERA(ut1a, ut1b float64) float64 {
	t := (ut1a - j2000) + ut1b
	f := math.Mod(ut1a, 1) + math.Mod(ut1b, 1)
	return anp(twoPi * (f + 0.7790572732640 + 0.00273781191135448*t))
}

// GMST returns Greenwich mean sidereal time in [0, 2pi), IAU 2006 (IERS
// Conventions 2010, eq. 5.32; Capitaine et al. 2005), from the UT1 and TT
// Julian dates.
func GMST(ut1a, ut1b, tta, ttb float64) float64 {
	t := ((tta - j2000) + ttb) / century
	return anp(ERA(ut1a, ut1b) + (0.014506+
		(4612.156534+
			(1.3915817+
				(-0.00000044+
					(-0.000029956+
						(-0.0000000368)*t)*t)*t)*t)*t)*ArcsecToRad)
}

// GAST returns Greenwich apparent sidereal time in [0, 2pi): ERA minus
// the equation of the origins (IERS Conventions 2010, eq. 5.30), with the
// precession-nutation of this package.
func GAST(ut1a, ut1b, tta, ttb float64) float64 {
	return anp(ERA(ut1a, ut1b) - EquationOfOrigins(tta, ttb))
}

// MeanObliquity returns the mean obliquity of the ecliptic, IAU 2006
// (IERS Conventions 2010, eq. 5.40), in radians.
func MeanObliquity(tta, ttb float64) float64 {
	t := ((tta - j2000) + ttb) / century
	return (84381.406 +
		(-46.836769+
			(-0.0001831+
				(0.00200340+
					(-0.000000576+
						(-0.0000000434)*t)*t)*t)*t)*t) * ArcsecToRad
}

// PrecessionAngles returns the IAU 2006 Fukushima-Williams
// bias-precession angles gamma_bar, phi_bar, psi_bar and the mean
// obliquity eps_A, in radians (IERS Conventions 2010, eq. 5.40; P03,
// Capitaine et al. 2003; frame bias included).
func PrecessionAngles(tta, ttb float64) (gamb, phib, psib, epsa float64) {
	t := ((tta - j2000) + ttb) / century
	gamb = (-0.052928 +
		(10.556378+
			(0.4932044+
				(-0.00031238+
					(-0.000002788+
						(0.0000000260)*t)*t)*t)*t)*t) * ArcsecToRad
	phib = (84381.412819 +
		(-46.811016+
			(0.0511268+
				(0.00053289+
					(-0.000000440+
						(-0.0000000176)*t)*t)*t)*t)*t) * ArcsecToRad
	psib = (-0.041775 +
		(5038.481484+
			(1.5584175+
				(-0.00018522+
					(-0.000026452+
						(-0.0000000148)*t)*t)*t)*t)*t) * ArcsecToRad
	return gamb, phib, psib, MeanObliquity(tta, ttb)
}

// delaunay returns the fundamental arguments l, l', F, D, Omega of Simon
// et al. (1994), linear in t (as used by IAU 2000B), in radians.
func delaunay(t float64) [5]float64 {
	return [5]float64{
		math.Mod(485868.249036+1717915923.2178*t, turnArcsec) * ArcsecToRad,
		math.Mod(1287104.79305+129596581.0481*t, turnArcsec) * ArcsecToRad,
		math.Mod(335779.526232+1739527262.8478*t, turnArcsec) * ArcsecToRad,
		math.Mod(1072260.70369+1602961601.2090*t, turnArcsec) * ArcsecToRad,
		math.Mod(450160.398036-6962890.5431*t, turnArcsec) * ArcsecToRad,
	}
}

// harmonics holds cos(k a_j), sin(k a_j) for k = 0..4 of the five
// fundamental arguments, so each series term costs complex products
// instead of a sine and a cosine.
type harmonics struct{ c, s [5][5]float64 }

func newHarmonics(a [5]float64) harmonics {
	var h harmonics
	for j, x := range a {
		s1, c1 := math.Sincos(x)
		h.c[j][0], h.s[j][0] = 1, 0
		for k := 1; k < 5; k++ {
			h.c[j][k] = h.c[j][k-1]*c1 - h.s[j][k-1]*s1
			h.s[j][k] = h.s[j][k-1]*c1 + h.c[j][k-1]*s1
		}
	}
	return h
}

// sincos returns sin and cos of sum_j n_j a_j (|n_j| <= 4).
func (h *harmonics) sincos(n *[5]int8) (s, c float64) {
	c, s = 1, 0
	for j, m := range n {
		if m == 0 {
			continue
		}
		k := int(m)
		sj := 1.0
		if k < 0 {
			k, sj = -k, -1
		}
		cc, ss := h.c[j][k], sj*h.s[j][k]
		c, s = c*cc-s*ss, s*cc+c*ss
	}
	return s, c
}

// Fixed offsets of IAU 2000B in lieu of the planetary terms (McCarthy &
// Luzum 2003): -0.135 mas in longitude, +0.388 mas in obliquity.
const (
	dpsiPlanetary = -0.135e-3 * ArcsecToRad
	depsPlanetary = 0.388e-3 * ArcsecToRad
	unit01uas     = ArcsecToRad / 1e7
)

// Nutation returns the IAU 2000B nutation in longitude and obliquity, in
// radians, at the TT Julian date tta+ttb: the 77 luni-solar terms plus
// the fixed planetary offsets (McCarthy & Luzum 2003).
func Nutation(tta, ttb float64) (dpsi, deps float64) {
	t := ((tta - j2000) + ttb) / century
	h := newHarmonics(delaunay(t))
	return nutation(t, &h)
}

func nutation(t float64, h *harmonics) (dpsi, deps float64) {
	var dp, de float64
	for i := len(nut2000B) - 1; i >= 0; i-- { // smallest first
		x := &nut2000B[i]
		s, c := h.sincos(&x.n)
		dp += (x.ps+x.pst*t)*s + x.pc*c
		de += (x.ec+x.ect*t)*c + x.es*s
	}
	return dp*unit01uas + dpsiPlanetary, de*unit01uas + depsPlanetary
}

// sTerm is one term of the series for s + XY/2: multipliers of (l, l',
// F, D, Omega) and sine and cosine amplitudes in microarcseconds.
type sTerm struct {
	n    [5]int8
	s, c float64
}

// The IAU 2006 series for s + XY/2 (IERS Conventions 2010, Table 5.2d,
// as tabulated in ERFA 2.0.0 s06.c), truncated to |amplitude| >= 0.5 uas.
var (
	sPoly = [6]float64{94.00, 3808.65, -122.68, -72574.11, 27.98, 15.62}
	s0    = [...]sTerm{
		{[5]int8{0, 0, 0, 0, 1}, -2640.73, 0.39},
		{[5]int8{0, 0, 0, 0, 2}, -63.53, 0.02},
		{[5]int8{0, 0, 2, -2, 3}, -11.75, -0.01},
		{[5]int8{0, 0, 2, -2, 1}, -11.21, -0.01},
		{[5]int8{0, 0, 2, -2, 2}, 4.57, 0},
		{[5]int8{0, 0, 2, 0, 3}, -2.02, 0},
		{[5]int8{0, 0, 2, 0, 1}, -1.98, 0},
		{[5]int8{0, 0, 0, 0, 3}, 1.72, 0},
		{[5]int8{0, 1, 0, 0, 1}, 1.41, 0.01},
		{[5]int8{0, 1, 0, 0, -1}, 1.26, 0.01},
		{[5]int8{1, 0, 0, 0, -1}, 0.63, 0},
		{[5]int8{1, 0, 0, 0, 1}, 0.63, 0},
	}
	s1 = [...]sTerm{
		{[5]int8{0, 0, 0, 0, 2}, -0.07, 3.57},
		{[5]int8{0, 0, 0, 0, 1}, 1.73, -0.03},
	}
	s2 = [...]sTerm{
		{[5]int8{0, 0, 0, 0, 1}, 743.52, -0.17},
		{[5]int8{0, 0, 2, -2, 2}, 56.91, 0.06},
		{[5]int8{0, 0, 2, 0, 2}, 9.84, -0.01},
		{[5]int8{0, 0, 0, 0, 2}, -8.85, 0.01},
		{[5]int8{0, 1, 0, 0, 0}, -6.38, -0.05},
		{[5]int8{1, 0, 0, 0, 0}, -3.07, 0},
		{[5]int8{0, 1, 2, -2, 2}, 2.23, 0},
		{[5]int8{0, 0, 2, 0, 1}, 1.67, 0},
		{[5]int8{1, 0, 2, 0, 2}, 1.30, 0},
		{[5]int8{0, 1, -2, 2, -2}, 0.93, 0},
		{[5]int8{1, 0, 0, -2, 0}, 0.68, 0},
		{[5]int8{0, 0, 2, -2, 1}, -0.55, 0},
		{[5]int8{1, 0, -2, 0, -2}, 0.53, 0},
	}
	s3 = [...]sTerm{
		{[5]int8{0, 0, 0, 0, 1}, 0.30, -23.42},
		{[5]int8{0, 0, 2, -2, 2}, -0.03, -1.46},
	}
)

func sum(ts []sTerm, h *harmonics) float64 {
	var w float64
	for i := len(ts) - 1; i >= 0; i-- {
		s, c := h.sincos(&ts[i].n)
		w += ts[i].s*s + ts[i].c*c
	}
	return w
}

// cioS returns the CIO locator s in radians given X, Y.
func cioS(t, x, y float64, h *harmonics) float64 {
	w0 := sPoly[0] + sum(s0[:], h)
	w1 := sPoly[1] + sum(s1[:], h)
	w2 := sPoly[2] + sum(s2[:], h)
	w3 := sPoly[3] + sum(s3[:], h)
	w := w0 + (w1+(w2+(w3+(sPoly[4]+sPoly[5]*t)*t)*t)*t)*t
	return w*1e-6*ArcsecToRad - x*y/2
}

// rx, rz return the passive rotation matrices R1(a), R3(a).
func rx(a float64) Mat {
	s, c := math.Sincos(a)
	return Mat{{1, 0, 0}, {0, c, s}, {0, -s, c}}
}

func rz(a float64) Mat {
	s, c := math.Sincos(a)
	return Mat{{c, s, 0}, {-s, c, 0}, {0, 0, 1}}
}

// MatMul returns a*b.
func MatMul(a, b Mat) Mat {
	var m Mat
	for i := range 3 {
		for j := range 3 {
			m[i][j] = a[i][0]*b[0][j] + a[i][1]*b[1][j] + a[i][2]*b[2][j]
		}
	}
	return m
}

// Transpose returns m transposed (the inverse of a rotation).
func Transpose(m Mat) Mat {
	return Mat{
		{m[0][0], m[1][0], m[2][0]},
		{m[0][1], m[1][1], m[2][1]},
		{m[0][2], m[1][2], m[2][2]},
	}
}

// MulVec returns m*v.
func MulVec(m *Mat, v Vec) Vec {
	return Vec{
		m[0][0]*v[0] + m[0][1]*v[1] + m[0][2]*v[2],
		m[1][0]*v[0] + m[1][1]*v[1] + m[1][2]*v[2],
		m[2][0]*v[0] + m[2][1]*v[1] + m[2][2]*v[2],
	}
}

// MulVecT returns transpose(m)*v.
func MulVecT(m *Mat, v Vec) Vec {
	return Vec{
		m[0][0]*v[0] + m[1][0]*v[1] + m[2][0]*v[2],
		m[0][1]*v[0] + m[1][1]*v[1] + m[2][1]*v[2],
		m[0][2]*v[0] + m[1][2]*v[1] + m[2][2]*v[2],
	}
}

// fw2m returns R1(-eps) R3(-psi) R1(phi) R3(gam) (IERS Conventions 2010,
// eq. 5.39 with the Fukushima-Williams angles).
func fw2m(gam, phi, psi, eps float64) Mat {
	return MatMul(rx(-eps), MatMul(rz(-psi), MatMul(rx(phi), rz(gam))))
}

// EclipticOfDate returns the matrix from GCRF to the mean ecliptic and
// equinox of date (IAU 2006, frame bias included): R3(-psi_bar)
// R1(phi_bar) R3(gamma_bar).
func EclipticOfDate(tta, ttb float64) Mat {
	g, p, s, _ := PrecessionAngles(tta, ttb)
	return MatMul(rz(-s), MatMul(rx(p), rz(g)))
}

// BiasPrecession returns the matrix from GCRF to the mean equator and
// equinox of date (IAU 2006, frame bias included).
func BiasPrecession(tta, ttb float64) Mat {
	g, p, s, e := PrecessionAngles(tta, ttb)
	return fw2m(g, p, s, e)
}

// BPN returns the matrix from GCRF to the true equator and equinox of
// date: IAU 2006 bias-precession with IAU 2000B nutation.
func BPN(tta, ttb float64) Mat {
	t := ((tta - j2000) + ttb) / century
	h := newHarmonics(delaunay(t))
	return bpn(tta, ttb, t, &h)
}

func bpn(tta, ttb, t float64, h *harmonics) Mat {
	g, p, s, e := PrecessionAngles(tta, ttb)
	dpsi, deps := nutation(t, h)
	return fw2m(g, p, s+dpsi, e+deps)
}

// q returns the GCRF -> CIRS-without-s matrix of IERS Conventions 2010
// eq. 5.10 from the CIP unit vector (X, Y, Z) (third row of BPN).
func qMatrix(x, y, z float64) Mat {
	a := 1 / (1 + z)
	return Mat{
		{1 - a*x*x, -a * x * y, -x},
		{-a * x * y, 1 - a*y*y, -y},
		{x, y, z},
	}
}

// EquationOfOrigins returns the equation of the origins ERA - GAST in
// radians (IERS Conventions 2010, eq. 5.31), from this package's
// precession-nutation and s.
func EquationOfOrigins(tta, ttb float64) float64 {
	t := ((tta - j2000) + ttb) / century
	hv := newHarmonics(delaunay(t))
	h := &hv
	m := bpn(tta, ttb, t, h)
	x, y, z := m[2][0], m[2][1], m[2][2]
	s := cioS(t, x, y, h)
	q := qMatrix(x, y, z)
	v := MulVec(&q, m[0]) // the equinox in CIRS, before R3(-s)
	// The equinox's right ascension in the CIRS is atan2(v_y, v_x) + s
	// (R3(-s) adds s); its hour angle is GAST = ERA - that, so EO is it.
	return math.Atan2(v[1], v[0]) + s
}

// GCRFToITRF returns the matrix from GCRF to ITRF (polar motion zero) at
// the TT date tta+ttb and UT1 date ut1a+ut1b.
func GCRFToITRF(tta, ttb, ut1a, ut1b float64) Mat {
	t := ((tta - j2000) + ttb) / century
	hv := newHarmonics(delaunay(t))
	h := &hv
	m := bpn(tta, ttb, t, h)
	x, y, z := m[2][0], m[2][1], m[2][2]
	s := cioS(t, x, y, h)
	sp := -47e-6 * t * ArcsecToRad // TIO locator, IERS Conventions 2010 eq. 5.13
	q := qMatrix(x, y, z)
	r := rz(ERA(ut1a, ut1b) + sp - s)
	return MatMul(r, q)
}

// Rotation is the GCRF <-> ITRF transformation at one epoch. Build it
// once per epoch with [NewRotation] and apply it to many vectors.
type Rotation struct {
	// M rotates GCRF coordinates into ITRF: r_ITRF = M r_GCRF.
	M Mat
	// Omega is the Earth's rotation rate about the ITRF z axis, rad/s.
	Omega float64
}

// NewRotation returns the rotation at epoch e with UT1-UTC = dut1
// seconds (0 if unknown; check it with [timescale.CheckDUT1]).
func NewRotation(e timescale.Epoch, dut1 float64) Rotation {
	t1, t2 := e.JDTT()
	u1, u2 := e.JDUT1(dut1)
	return Rotation{M: GCRFToITRF(t1, t2, u1, u2), Omega: OmegaEarth}
}

// ToITRF rotates a GCRF position (or any vector) into ITRF.
func (r *Rotation) ToITRF(p Vec) Vec { return MulVec(&r.M, p) }

// ToGCRF rotates an ITRF position (or any vector) into GCRF.
func (r *Rotation) ToGCRF(p Vec) Vec { return MulVecT(&r.M, p) }

// StateToITRF transforms a GCRF position and velocity into ITRF:
// r_f = M r, v_f = M v - omega x r_f.
func (r *Rotation) StateToITRF(p, v Vec) (pf, vf Vec) {
	pf = MulVec(&r.M, p)
	vf = MulVec(&r.M, v)
	vf[0] += r.Omega * pf[1]
	vf[1] -= r.Omega * pf[0]
	return pf, vf
}

// StateToGCRF transforms an ITRF position and velocity into GCRF:
// r = M^T r_f, v = M^T (v_f + omega x r_f).
func (r *Rotation) StateToGCRF(pf, vf Vec) (p, v Vec) {
	p = MulVecT(&r.M, pf)
	w := Vec{vf[0] - r.Omega*pf[1], vf[1] + r.Omega*pf[0], vf[2]}
	return p, MulVecT(&r.M, w)
}

// anp normalizes an angle to [0, 2pi).
func anp(a float64) float64 {
	a = math.Mod(a, twoPi)
	if a < 0 {
		a += twoPi
	}
	if a >= twoPi { // a tiny negative a gives a+2pi == 2pi
		a = 0
	}
	return a
}
