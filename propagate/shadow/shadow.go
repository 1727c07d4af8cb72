package shadow

import (
	"fmt"
	"math"

	"centra/orbit"
	"centra/propagate/trajectory"
)

// SunRadius is the nominal solar radius R_sun^N = 695700 km (IAU 2015
// Resolution B3).
const SunRadius = 695700.0

// Light says how much of the Sun a point sees.
type Light int

const (
	// Sunlit: all of the Sun's disc is visible.
	Sunlit Light = iota
	// Penumbra: part of the disc is hidden (also the antumbra).
	Penumbra
	// Umbra: all of the disc is hidden.
	Umbra
)

func (l Light) String() string {
	switch l {
	case Sunlit:
		return "sunlit"
	case Penumbra:
		return "penumbra"
	case Umbra:
		return "umbra"
	}
	return fmt.Sprintf("Light(%d)", int(l))
}

// Angles returns, seen from r, the apparent radius a of the Sun (at sun,
// radius rs), the apparent radius b of the body (at the origin, radius
// rb) and the angle c between their centres, all rad. A point inside the
// body sees it as a hemisphere (b = pi/2).
func Angles(r, sun [3]float64, rb, rs float64) (a, b, c float64) {
	d := [3]float64{sun[0] - r[0], sun[1] - r[1], sun[2] - r[2]}
	nd, nr := norm(d), norm(r)
	a = asin1(rs / nd)
	b = asin1(rb / nr)
	m := [3]float64{-r[0], -r[1], -r[2]}
	c = math.Atan2(norm(cross(m, d)), dot(m, d))
	return a, b, c
}

func asin1(x float64) float64 {
	if x >= 1 {
		return math.Pi / 2
	}
	return math.Asin(x)
}

// PenumbraFunction returns a + b - c: positive when some of the Sun is
// hidden (penumbra, umbra or antumbra), rad.
func PenumbraFunction(r, sun [3]float64, rb, rs float64) float64 {
	a, b, c := Angles(r, sun, rb, rs)
	return a + b - c
}

// UmbraFunction returns b - a - c: positive when all of the Sun is
// hidden, rad.
func UmbraFunction(r, sun [3]float64, rb, rs float64) float64 {
	a, b, c := Angles(r, sun, rb, rs)
	return b - a - c
}

// Classify returns the light at r.
func Classify(r, sun [3]float64, rb, rs float64) Light {
	a, b, c := Angles(r, sun, rb, rs)
	switch {
	case c <= b-a:
		return Umbra
	case c < a+b:
		return Penumbra
	}
	return Sunlit
}

// Eclipse is one window in the shadow.
type Eclipse struct {
	Kind        Light   // Penumbra (first to last contact) or Umbra (second to third)
	Entry, Exit float64 // s from the trajectory start
	// FromStart and ToEnd mark a window cut by the start or the end of
	// the span.
	FromStart, ToEnd bool
}

// Duration returns Exit - Entry, s.
func (e Eclipse) Duration() float64 { return e.Exit - e.Entry }

// Find returns the penumbra and umbra windows of the trajectory in the
// shadow of a body of radius rb (km) centred at the origin, with the Sun
// of radius rs at sun(t). Windows are sorted by entry; a penumbra window
// comes before the umbra window it contains. Ends are located to tol s.
func Find(tr *trajectory.Trajectory, sun func(t float64) [3]float64, rb, rs, tol float64) []Eclipse {
	pen := func(t float64) float64 { return PenumbraFunction(tr.Position(t), sun(t), rb, rs) }
	umb := func(t float64) float64 { return UmbraFunction(tr.Position(t), sun(t), rb, rs) }
	n := tr.Len()
	ts := make([]float64, n)
	fp := make([]float64, n)
	fu := make([]float64, n)
	for k := range n {
		t := tr.Time(k)
		ts[k] = t
		a, b, c := Angles(tr.Sample(k).R, sun(t), rb, rs)
		fp[k], fu[k] = a+b-c, b-a-c
	}
	var out []Eclipse
	pw := trajectory.WindowsAt(pen, ts, fp, tol)
	uw := trajectory.WindowsAt(umb, ts, fu, tol)
	j := 0
	for _, w := range pw {
		out = append(out, Eclipse{Kind: Penumbra, Entry: w.Start, Exit: w.End, FromStart: w.FromStart, ToEnd: w.ToEnd})
		for j < len(uw) && uw[j].Start <= w.End {
			u := uw[j]
			out = append(out, Eclipse{Kind: Umbra, Entry: u.Start, Exit: u.End, FromStart: u.FromStart, ToEnd: u.ToEnd})
			j++
		}
	}
	for ; j < len(uw); j++ { // cannot happen: the umbra lies in the penumbra
		u := uw[j]
		out = append(out, Eclipse{Kind: Umbra, Entry: u.Start, Exit: u.End, FromStart: u.FromStart, ToEnd: u.ToEnd})
	}
	return out
}

// Beta returns the beta angle of the orbit through state s with the Sun
// at sun (same frame), rad in [-pi/2, pi/2].
func Beta(s orbit.State, sun [3]float64) float64 {
	h := cross(s.R, s.V)
	nh, ns := norm(h), norm(sun)
	if nh == 0 || ns == 0 {
		return 0
	}
	x := dot(h, sun) / (nh * ns)
	return math.Asin(math.Max(-1, math.Min(1, x)))
}

// SunTrack is the Sun tabulated over a span and interpolated linearly
// (see the package documentation for the error). Safe for concurrent use.
type SunTrack struct {
	step float64
	pos  [][3]float64
}

// sunNodeStep is the longest interval between the nodes of a SunTrack, s.
const sunNodeStep = 3600.0

// NewSunTrack tabulates sun(t) at nodes at most an hour apart over
// [0, span].
func NewSunTrack(sun func(t float64) [3]float64, span float64) *SunTrack {
	n := int(math.Ceil(span/sunNodeStep - 1e-9))
	if n < 1 {
		n = 1
	}
	st := &SunTrack{step: math.Max(span, 1) / float64(n), pos: make([][3]float64, n+1)}
	for k := range st.pos {
		st.pos[k] = sun(float64(k) * st.step)
	}
	return st
}

// At returns the interpolated Sun position at t (km); times outside the
// span are extrapolated from the nearest interval.
func (st *SunTrack) At(t float64) [3]float64 {
	x := t / st.step
	k := int(math.Floor(x))
	k = max(0, min(k, len(st.pos)-2))
	w := x - float64(k)
	a, b := &st.pos[k], &st.pos[k+1]
	return [3]float64{a[0] + w*(b[0]-a[0]), a[1] + w*(b[1]-a[1]), a[2] + w*(b[2]-a[2])}
}

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm(a [3]float64) float64   { return math.Sqrt(dot(a, a)) }
func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
