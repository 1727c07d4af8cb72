package forces

import (
	"math"

	"centra/bodies/sunmoon"
	"centra/bodies/timescale"
)

// Chebyshev fits of an ephemeris: segments of SegmentLength seconds, each
// interpolating the series at chebNodes Chebyshev points of the first
// kind. The Moon's position has no term faster than about four cycles per
// month, so over a one-day segment (a phase change of at most 0.9 rad of
// its fastest term) a degree-13 fit leaves an error below 1e-9 of the
// distance, 0.4 m for the Moon: the tests compare the fit with the series
// at random times.
const (
	SegmentLength = 86400.0
	chebNodes     = 14
)

// cosTable[k][j] = cos(pi k (j + 1/2) / N), the Chebyshev transform.
var cosTable = func() (c [chebNodes][chebNodes]float64) {
	for k := range chebNodes {
		for j := range chebNodes {
			c[k][j] = math.Cos(math.Pi * float64(k) * (float64(j) + 0.5) / chebNodes)
		}
	}
	return c
}()

type segment struct {
	index int64 // segment k covers t in [k L, (k+1) L)
	valid bool
	coef  [3][chebNodes]float64
}

// Ephemeris gives the position of a body (km, GCRF, relative to the
// Earth's centre) at t seconds from an epoch, from Chebyshev fits of a
// series built lazily in one-day segments. It keeps the two segments used
// last; a propagation that runs monotonically in time recomputes each
// segment once. It is not safe for concurrent use.
type Ephemeris struct {
	name   string
	epoch  timescale.Epoch
	series func(timescale.Epoch) [3]float64
	seg    [2]segment
	next   int
	// Fits counts the segments computed (for tests and benchmarks).
	Fits int
}

// NewEphemeris returns an ephemeris of the series f (GCRF km at an epoch)
// with t = 0 at epoch.
func NewEphemeris(name string, epoch timescale.Epoch, f func(timescale.Epoch) [3]float64) *Ephemeris {
	return &Ephemeris{name: name, epoch: epoch, series: f}
}

// NewSunEphemeris returns the Sun's geocentric position from
// [sunmoon.Sun], with t = 0 at epoch.
func NewSunEphemeris(epoch timescale.Epoch) *Ephemeris {
	return NewEphemeris("sun", epoch, sunmoon.Sun)
}

// NewMoonEphemeris returns the Moon's geocentric position from
// [sunmoon.Moon], with t = 0 at epoch.
func NewMoonEphemeris(epoch timescale.Epoch) *Ephemeris {
	return NewEphemeris("moon", epoch, sunmoon.Moon)
}

// Name returns the name given to the ephemeris.
func (e *Ephemeris) Name() string { return e.name }

// Epoch returns the epoch of t = 0.
func (e *Ephemeris) Epoch() timescale.Epoch { return e.epoch }

// Position returns the position in km at t seconds from the epoch. A t
// that is not finite gives a non-finite position.
func (e *Ephemeris) Position(t float64) [3]float64 {
	if math.IsNaN(t) || math.IsInf(t, 0) {
		return [3]float64{math.NaN(), math.NaN(), math.NaN()}
	}
	k := int64(math.Floor(t / SegmentLength))
	s := e.find(k)
	// x in [-1, 1] across the segment; Clenshaw's recurrence.
	x := 2*(t/SegmentLength-float64(k)) - 1
	var p [3]float64
	for c := range 3 {
		b1, b2 := 0.0, 0.0
		for j := chebNodes - 1; j >= 1; j-- {
			b1, b2 = 2*x*b1-b2+s.coef[c][j], b1
		}
		p[c] = x*b1 - b2 + s.coef[c][0]/2
	}
	return p
}

func (e *Ephemeris) find(k int64) *segment {
	for i := range e.seg {
		if e.seg[i].valid && e.seg[i].index == k {
			return &e.seg[i]
		}
	}
	s := &e.seg[e.next]
	e.next = 1 - e.next
	e.fit(s, k)
	return s
}

// fit computes the Chebyshev coefficients of segment k.
func (e *Ephemeris) fit(s *segment, k int64) {
	e.Fits++
	var f [3][chebNodes]float64
	for j := range chebNodes {
		x := math.Cos(math.Pi * (float64(j) + 0.5) / chebNodes)
		t := (float64(k) + 0.5 + 0.5*x) * SegmentLength
		p := e.series(e.epoch.Add(t))
		for c := range 3 {
			f[c][j] = p[c]
		}
	}
	for c := range 3 {
		for n := range chebNodes {
			sum := 0.0
			for j := range chebNodes {
				sum += f[c][j] * cosTable[n][j]
			}
			s.coef[c][n] = 2 * sum / chebNodes
		}
	}
	s.index, s.valid = k, true
}
