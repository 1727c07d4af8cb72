package visibility

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sync"

	"centra/bodies/geodesy"
	"centra/propagate/shadow"
	"centra/propagate/trajectory"
)

// ErrSite reports a site or threshold that cannot be used.
var ErrSite = errors.New("visibility: invalid site")

// Threshold limits, rad: the minimum elevation lies within -5..90 deg.
const (
	MinThreshold = -5 * deg
	MaxThreshold = 90 * deg
)

// DarkSunElevation is the Sun elevation below which a site counts as
// dark: -6 deg, the end of civil twilight.
const DarkSunElevation = -6 * deg

// Site is a ground station and its visibility threshold.
type Site struct {
	Name    string
	Station geodesy.Station
	// MinElevation is the least elevation of a pass, rad.
	MinElevation float64
	// Mask, when not nil, raises the threshold by azimuth: the threshold
	// is the larger of MinElevation and the mask.
	Mask *Mask
	// Refraction compares the apparent elevation (see [Refraction])
	// with the threshold and reports apparent elevations.
	Refraction bool
}

// NewSite validates the geodetic site s and the threshold.
func NewSite(name string, s geodesy.Site, minElevation float64, mask *Mask, refraction bool) (Site, error) {
	st, err := geodesy.NewStation(s)
	if err != nil {
		return Site{}, fmt.Errorf("%w: %w", ErrSite, err)
	}
	if !(minElevation >= MinThreshold && minElevation <= MaxThreshold) {
		return Site{}, fmt.Errorf("%w: minimum elevation %g deg outside -5..90 deg", ErrSite, minElevation/deg)
	}
	return Site{Name: name, Station: st, MinElevation: minElevation, Mask: mask, Refraction: refraction}, nil
}

// threshold returns the least elevation at azimuth az.
func (s *Site) threshold(az float64) float64 {
	if s.Mask == nil {
		return s.MinElevation
	}
	return math.Max(s.MinElevation, s.Mask.At(az))
}

// lowestThreshold returns the threshold's minimum over all azimuths.
func (s *Site) lowestThreshold() float64 {
	if s.Mask == nil {
		return s.MinElevation
	}
	return math.Max(s.MinElevation, s.Mask.Min())
}

// Look returns what the site sees of the trajectory at t: azimuth,
// elevation (apparent with Refraction), range and range rate.
func (s *Site) Look(tr *trajectory.Trajectory, fr Frame, t float64) geodesy.Look {
	r, v := tr.At(t)
	rot := fr.Rotation(t)
	rf, vf := rot.StateToITRF(r, v)
	l := s.Station.Look(rf, vf)
	if s.Refraction {
		l.El = Apparent(l.El)
	}
	return l
}

// SunElevation returns the geometric elevation (rad) of the Sun, at GCRF
// position sun (km), seen from the site at t.
func (s *Site) SunElevation(fr Frame, t float64, sun [3]float64) float64 {
	rot := fr.Rotation(t)
	return s.Station.Look(rot.ToITRF(sun), [3]float64{}).El
}

// Pass is one visibility window of a site.
type Pass struct {
	AOS, TCA, LOS float64 // s from the trajectory start
	// Looks at AOS, TCA (greatest elevation) and LOS; elevations are
	// apparent when the site applies refraction.
	AOSLook, TCALook, LOSLook geodesy.Look
	MinRange                  float64 // km
	MinRangeTime              float64 // s
	// PartialStart and PartialEnd mark a pass cut by the start or the
	// end of the span (AOS = 0 or LOS = span).
	PartialStart, PartialEnd bool

	// Set by [Annotate].
	Sunlit       bool    // the spacecraft is outside the umbra at TCA (some of the Sun visible)
	SiteDark     bool    // the Sun is below DarkSunElevation at the site at TCA
	SunElevation float64 // geometric Sun elevation at the site at TCA, rad
}

// Duration returns LOS - AOS, s.
func (p *Pass) Duration() float64 { return p.LOS - p.AOS }

// MaxElevation returns the greatest elevation of the pass, rad.
func (p *Pass) MaxElevation() float64 { return p.TCALook.El }

// Partial reports whether the span cuts the pass.
func (p *Pass) Partial() bool { return p.PartialStart || p.PartialEnd }

// Result is what a site sees over the span.
type Result struct {
	Passes []Pass
	// Highest is the greatest elevation reached over the whole span (rad;
	// apparent with refraction), at HighestTime (s): the answer to "how
	// close did it come" when there is no pass.
	Highest, HighestTime float64
}

// Default option values.
const (
	DefaultTol      = 1e-4 // s
	DefaultMaskStep = 1.0  // s
)

// Options of the search. The zero value is usable.
type Options struct {
	// Tol is the accuracy of AOS, LOS and TCA on the interpolated
	// trajectory, s. Zero means DefaultTol.
	Tol float64
	// MaskStep is the sampling step of the search above a terrain mask,
	// s. Zero means DefaultMaskStep.
	MaskStep float64
}

func (o Options) withDefaults() Options {
	if !(o.Tol > 0) {
		o.Tol = DefaultTol
	}
	if !(o.MaskStep > 0) {
		o.MaskStep = DefaultMaskStep
	}
	return o
}

// Track is a trajectory with its Earth-fixed positions at the samples,
// computed once and shared by the sites. It is immutable and safe for
// concurrent use.
type Track struct {
	tr    *trajectory.Trajectory
	fr    Frame
	fixed [][3]float64 // ITRF positions at the samples, km
	times []float64
}

// NewTrack rotates the samples of tr into the Earth-fixed frame fr.
func NewTrack(tr *trajectory.Trajectory, fr Frame) *Track {
	n := tr.Len()
	k := &Track{tr: tr, fr: fr, fixed: make([][3]float64, n), times: make([]float64, n)}
	for i := range n {
		t := tr.Time(i)
		rot := fr.Rotation(t)
		k.times[i] = t
		k.fixed[i] = rot.ToITRF(tr.Sample(i).R)
	}
	return k
}

// sinElevation returns the sine of the geometric elevation of the
// Earth-fixed position r seen from the station.
func sinElevation(st *geodesy.Station, r [3]float64) float64 {
	d := [3]float64{r[0] - st.R[0], r[1] - st.R[1], r[2] - st.R[2]}
	u := st.ENU[2][0]*d[0] + st.ENU[2][1]*d[1] + st.ENU[2][2]*d[2]
	rng := math.Sqrt(d[0]*d[0] + d[1]*d[1] + d[2]*d[2])
	if rng == 0 {
		return 0
	}
	return u / rng
}

// trueThreshold returns the geometric elevation whose apparent elevation
// is the threshold thr (rad): thr itself without refraction; with it, the
// root of h + Refraction(h) = thr (increasing in h), by bisection.
func (s *Site) trueThreshold(thr float64) float64 {
	if !s.Refraction {
		return thr
	}
	lo, hi := thr-2*deg, thr
	for range 60 {
		m := 0.5 * (lo + hi)
		if Apparent(m) > thr {
			hi = m
		} else {
			lo = m
		}
	}
	return 0.5 * (lo + hi)
}

// Find returns the passes of the trajectory over site, in time order.
func Find(tr *trajectory.Trajectory, fr Frame, site Site, opt Options) Result {
	return NewTrack(tr, fr).Find(site, opt)
}

// Find returns the passes of the track over site, in time order.
func (k *Track) Find(site Site, opt Options) Result {
	opt = opt.withDefaults()
	tr, fr := k.tr, k.fr
	// The windows above the lowest threshold: the sign of sin(el) minus
	// the sine of the geometric elevation of that threshold, which is the
	// sign of the (apparent) elevation minus the threshold.
	low := site.lowestThreshold()
	sinLow := math.Sin(site.trueThreshold(low))
	g0 := func(t float64) float64 {
		r, _ := tr.At(t)
		rot := fr.Rotation(t)
		return sinElevation(&site.Station, rot.ToITRF(r)) - sinLow
	}
	n := len(k.times)
	fs := make([]float64, n)
	best := 0
	for i := range n {
		fs[i] = sinElevation(&site.Station, k.fixed[i]) - sinLow
		if fs[i] > fs[best] {
			best = i
		}
	}
	el := func(t float64) float64 { return site.Look(tr, fr, t).El }
	var res Result
	res.HighestTime, res.Highest = trajectory.GoldenMax(el, k.times[max(best-1, 0)], k.times[min(best+1, n-1)], opt.Tol)
	windows := trajectory.WindowsAt(g0, k.times, fs, opt.Tol)
	if site.Mask != nil {
		f := func(t float64) float64 {
			l := site.Look(tr, fr, t)
			return l.El - site.threshold(l.Az)
		}
		var cut []trajectory.Window
		for _, w := range windows {
			for _, s := range trajectory.Windows(f, w.Start, w.End, opt.MaskStep, opt.Tol) {
				s.FromStart = s.FromStart && w.FromStart
				s.ToEnd = s.ToEnd && w.ToEnd
				cut = append(cut, s)
			}
		}
		windows = cut
	}
	step := tr.Step()
	negRange := func(t float64) float64 { return -site.Look(tr, fr, t).Range }
	for _, w := range windows {
		p := Pass{AOS: w.Start, LOS: w.End, PartialStart: w.FromStart, PartialEnd: w.ToEnd}
		p.TCA, _ = trajectory.Maximize(el, w.Start, w.End, step, opt.Tol)
		var nr float64
		p.MinRangeTime, nr = trajectory.Maximize(negRange, w.Start, w.End, step, opt.Tol)
		p.MinRange = -nr
		p.AOSLook = site.Look(tr, fr, p.AOS)
		p.TCALook = site.Look(tr, fr, p.TCA)
		p.LOSLook = site.Look(tr, fr, p.LOS)
		res.Passes = append(res.Passes, p)
		if p.TCALook.El > res.Highest {
			res.Highest, res.HighestTime = p.TCALook.El, p.TCA
		}
	}
	return res
}

// FindAll runs [Find] for every site, in parallel on up to GOMAXPROCS
// goroutines sharing the trajectory, the frame and one [Track]; results
// are in the order of sites.
func FindAll(tr *trajectory.Trajectory, fr Frame, sites []Site, opt Options) []Result {
	out := make([]Result, len(sites))
	if len(sites) == 0 {
		return out
	}
	k := NewTrack(tr, fr)
	workers := min(runtime.GOMAXPROCS(0), len(sites))
	jobs := make(chan int)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				out[i] = k.Find(sites[i], opt)
			}
		}()
	}
	for i := range sites {
		jobs <- i
	}
	close(jobs)
	wg.Wait()
	return out
}

// Annotate sets Sunlit, SiteDark and SunElevation of each pass at its
// TCA: sun returns the GCRF position of the Sun (km) at t, bodyRadius is
// the radius of the Earth's shadow-casting sphere (km, conical shadow of
// package shadow).
func Annotate(passes []Pass, tr *trajectory.Trajectory, fr Frame, site Site, sun func(t float64) [3]float64, bodyRadius float64) {
	for i := range passes {
		p := &passes[i]
		s := sun(p.TCA)
		r, _ := tr.At(p.TCA)
		p.Sunlit = shadow.Classify(r, s, bodyRadius, shadow.SunRadius) != shadow.Umbra
		p.SunElevation = site.SunElevation(fr, p.TCA, s)
		p.SiteDark = p.SunElevation < DarkSunElevation
	}
}
