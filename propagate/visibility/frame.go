package visibility

import (
	"math"

	"centra/bodies/earthframe"
	"centra/bodies/timescale"
)

// Frame gives the rotation from the inertial frame of a trajectory to the
// Earth-fixed frame at time t (s from the start of the trajectory). It must
// be safe for concurrent use.
type Frame interface {
	Rotation(t float64) earthframe.Rotation
}

// maxNodeStep is the longest interval between the nodes of the slowly
// varying part of the Earth rotation, s.
const maxNodeStep = 3600.0

// EarthFrame is the GCRF -> ITRF rotation of package earthframe over a
// span, cheap to evaluate at many times (see the package documentation).
type EarthFrame struct {
	tt1, tt2   float64 // TT Julian date at t = 0
	ut1, ut2   float64 // UT1 Julian date at t = 0
	era0       float64 // Earth rotation angle at t = 0, rad
	span, step float64
	slow       []earthframe.Mat // R3(-ERA) M at the nodes
}

// NewEarthFrame returns the Earth rotation from start (UT1-UTC = dut1 s at
// start) over span seconds.
func NewEarthFrame(start timescale.Epoch, dut1, span float64) *EarthFrame {
	f := &EarthFrame{span: math.Max(span, 0)}
	f.tt1, f.tt2 = start.JDTT()
	f.ut1, f.ut2 = start.JDUT1(dut1)
	f.era0 = earthframe.ERA(f.ut1, f.ut2)
	n := int(math.Ceil(f.span/maxNodeStep - 1e-9))
	if n < 1 {
		n = 1
	}
	f.step = f.span / float64(n)
	if f.step == 0 {
		f.step = 1
	}
	f.slow = make([]earthframe.Mat, n+1)
	for k := range f.slow {
		t := float64(k) * f.step
		d := t / 86400
		m := earthframe.GCRFToITRF(f.tt1, f.tt2+d, f.ut1, f.ut2+d)
		s, c := math.Sincos(f.era(t))
		// R3(-theta) M: undo the Earth rotation angle.
		for j := range 3 {
			f.slow[k][0][j] = c*m[0][j] - s*m[1][j]
			f.slow[k][1][j] = s*m[0][j] + c*m[1][j]
			f.slow[k][2][j] = m[2][j]
		}
	}
	return f
}

// era returns the Earth rotation angle at t: linear in UT1 (IERS
// Conventions 2010, eq. 5.15), so ERA(t) = ERA(0) + OmegaEarth t exactly;
// not reduced to [0, 2pi).
func (f *EarthFrame) era(t float64) float64 { return f.era0 + earthframe.OmegaEarth*t }

// Rotation returns the rotation at t (s from start); times outside the
// span use the nearest end's slowly varying part.
func (f *EarthFrame) Rotation(t float64) earthframe.Rotation {
	x := t / f.step
	k := int(math.Floor(x))
	if k > len(f.slow)-2 {
		k = len(f.slow) - 2
	}
	if k < 0 {
		k = 0
	}
	w := math.Min(math.Max(x-float64(k), 0), 1)
	if len(f.slow) == 1 {
		w = 0
	}
	a, b := &f.slow[k], &f.slow[min(k+1, len(f.slow)-1)]
	var p earthframe.Mat
	for i := range 3 {
		for j := range 3 {
			p[i][j] = a[i][j] + w*(b[i][j]-a[i][j])
		}
	}
	s, c := math.Sincos(f.era(t))
	var m earthframe.Mat
	for j := range 3 {
		m[0][j] = c*p[0][j] + s*p[1][j]
		m[1][j] = -s*p[0][j] + c*p[1][j]
		m[2][j] = p[2][j]
	}
	return earthframe.Rotation{M: m, Omega: earthframe.OmegaEarth}
}
