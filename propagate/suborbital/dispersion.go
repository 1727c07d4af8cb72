package suborbital

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"runtime"
	"sync"
	"sync/atomic"

	"centra/bodies/geodesy"
)

// ErrDispersion reports invalid dispersion settings.
var ErrDispersion = errors.New("suborbital: invalid dispersion")

// MaxCases bounds Dispersion.Cases.
const MaxCases = 10_000_000

// Sigma holds the 1-sigma uncertainties of the burnout and the drag
// coefficient. Zero means no dispersion in that value.
type Sigma struct {
	Speed      float64 // km/s
	FlightPath float64 // rad
	Azimuth    float64 // rad
	Cd         float64 // dimensionless (absolute, not relative)
}

// Dispersion says how to disperse an arc.
type Dispersion struct {
	Cases int    // number of Monte Carlo cases, 2..MaxCases
	Seed  uint64 // seed of the random draws; case i uses PCG(Seed, i)
	Sigma Sigma
	// Workers is the number of goroutines; zero means runtime.GOMAXPROCS(0).
	// The result does not depend on it.
	Workers int
}

// Case is one dispersed arc.
type Case struct {
	Index                int
	Burnout              Burnout
	Cd                   float64 // drag coefficient of the case; 0 for a vacuum arc
	Apogee               float64 // km
	TimeAbove            float64 // s
	FlightTime           float64 // s
	ImpactLat, ImpactLon float64 // rad
	// East and North place the impact point in the tangent plane at the
	// mean impact point, km.
	East, North float64
}

// Ellipse is an impact ellipse in the east-north tangent plane.
type Ellipse struct {
	SemiMajor, SemiMinor float64 // km
	Azimuth              float64 // direction of the major axis from north through east, rad, [0, pi)
}

// Spread is the sample mean and standard deviation (divisor N-1) of a
// quantity over the cases.
type Spread struct{ Mean, Std float64 }

// DispersionResult is the outcome of [Disperse].
type DispersionResult struct {
	Cases            []Case  // in index order
	MeanLat, MeanLon float64 // mean impact point, rad (geodetic, on the impact surface)
	// Covariance of (east, north) in km^2 about the mean impact point.
	Covariance [2][2]float64
	Sigma1     Ellipse // 1-sigma impact ellipse
	Sigma3     Ellipse // 3-sigma impact ellipse
	Apogee     Spread  // km
	TimeAbove  Spread  // s
	FlightTime Spread  // s
}

// CaseError reports a dispersed case that did not give an impact point.
type CaseError struct {
	Index   int
	Burnout Burnout
	Err     error
}

func (e *CaseError) Error() string {
	return fmt.Sprintf("suborbital: dispersion case %d (speed %.6f km/s, flight-path angle %.4f deg, azimuth %.4f deg): %v",
		e.Index, e.Burnout.Speed, e.Burnout.FlightPath*180/math.Pi, e.Burnout.Azimuth*180/math.Pi, e.Err)
}

func (e *CaseError) Unwrap() error { return e.Err }

// Validate checks the settings for a nominal vehicle v.
func (d Dispersion) Validate(v Vehicle) error {
	if d.Cases < 2 || d.Cases > MaxCases {
		return fmt.Errorf("%w: %d cases, want 2..%d", ErrDispersion, d.Cases, MaxCases)
	}
	if d.Workers < 0 {
		return fmt.Errorf("%w: %d workers", ErrDispersion, d.Workers)
	}
	for _, x := range []struct {
		name string
		v    float64
	}{{"speed", d.Sigma.Speed}, {"flight-path angle", d.Sigma.FlightPath}, {"azimuth", d.Sigma.Azimuth}, {"Cd", d.Sigma.Cd}} {
		if !(x.v >= 0) || math.IsInf(x.v, 0) {
			return fmt.Errorf("%w: sigma of the %s %g must be zero or positive and finite", ErrDispersion, x.name, x.v)
		}
	}
	if d.Sigma.Cd > 0 && !v.HasDrag() {
		return fmt.Errorf("%w: a sigma of Cd needs a vehicle with drag", ErrDispersion)
	}
	return nil
}

// Draw returns the burnout and drag coefficient of case i: the nominal
// values plus sigma times independent standard normal draws from a PCG
// generator seeded with (seed, i), taken in the order speed, flight-path
// angle, azimuth, Cd (four draws always, so a zero sigma does not shift
// the others). A draw that makes the speed or Cd zero or negative is
// drawn again (a truncated normal); a flight-path angle beyond +-90 deg is
// reflected over the vertical (gamma -> +-180 deg - gamma, azimuth + 180
// deg), which is the same direction.
func Draw(nominal Burnout, v Vehicle, sigma Sigma, seed uint64, i int) (Burnout, float64) {
	rng := rand.New(rand.NewPCG(seed, uint64(i)))
	b := nominal
	positive := func(x0, s float64) float64 {
		for n := 0; ; n++ {
			x := x0 + s*rng.NormFloat64()
			if x > 0 || n == 1000 {
				if x <= 0 {
					x = x0 // cannot happen for s < x0/4; keeps the case usable
				}
				return x
			}
		}
	}
	b.Speed = positive(nominal.Speed, sigma.Speed)
	b.FlightPath = nominal.FlightPath + sigma.FlightPath*rng.NormFloat64()
	b.Azimuth = nominal.Azimuth + sigma.Azimuth*rng.NormFloat64()
	cd := v.Cd
	if v.HasDrag() {
		cd = positive(v.Cd, sigma.Cd)
	} else {
		rng.NormFloat64()
	}
	// Reflect over the vertical until the angle is in [-pi/2, pi/2].
	for n := 0; n < 4 && (b.FlightPath > math.Pi/2 || b.FlightPath < -math.Pi/2); n++ {
		if b.FlightPath > math.Pi/2 {
			b.FlightPath = math.Pi - b.FlightPath
		} else {
			b.FlightPath = -math.Pi - b.FlightPath
		}
		b.Azimuth += math.Pi
	}
	b.FlightPath = math.Max(-math.Pi/2, math.Min(math.Pi/2, b.FlightPath))
	b.Azimuth = wrap2Pi(b.Azimuth)
	return b, cd
}

// Disperse flies d.Cases dispersed copies of the arc from nominal with
// vehicle v in parallel and returns every impact point and the impact
// ellipses. Case i always gets the same draws ([Draw]), whatever the
// number of workers and their scheduling, so the result is reproducible.
// When a case does not come down the error is the [*CaseError] of the
// lowest such index.
func Disperse(cfg Config, nominal Burnout, v Vehicle, d Dispersion) (DispersionResult, error) {
	if err := d.Validate(v); err != nil {
		return DispersionResult{}, err
	}
	if err := v.Validate(); err != nil {
		return DispersionResult{}, err
	}
	workers := d.Workers
	if workers == 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	workers = min(workers, d.Cases)
	flights := make([]*Flight, workers)
	for w := range flights {
		f, err := New(cfg)
		if err != nil {
			return DispersionResult{}, err
		}
		flights[w] = f
	}
	if _, err := flights[0].State(nominal); err != nil {
		return DispersionResult{}, err
	}
	cases := make([]Case, d.Cases)
	errs := make([]error, d.Cases)
	var next atomic.Int64
	var wg sync.WaitGroup
	for w := range workers {
		wg.Add(1)
		go func(f *Flight) {
			defer wg.Done()
			for {
				i := int(next.Add(1) - 1)
				if i >= d.Cases {
					return
				}
				b, cd := Draw(nominal, v, d.Sigma, d.Seed, i)
				vi := v
				vi.Cd = cd
				arc, err := f.Fly(b, vi, nil)
				if err != nil {
					errs[i] = &CaseError{Index: i, Burnout: b, Err: err}
					continue
				}
				cases[i] = Case{Index: i, Burnout: b, Cd: cd, Apogee: arc.Apogee.Alt, TimeAbove: arc.TimeAbove,
					FlightTime: arc.FlightTime, ImpactLat: arc.Impact.Lat, ImpactLon: arc.Impact.Lon}
			}
		}(flights[w])
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return DispersionResult{}, err
		}
	}
	return summarize(flights[0].el, cfg.ImpactAlt, cases), nil
}

// summarize computes the mean impact point, the tangent-plane coordinates
// of every case, the covariance, the ellipses and the spreads, in index
// order (so the sums do not depend on scheduling).
func summarize(el geodesy.Ellipsoid, impactAlt float64, cases []Case) DispersionResult {
	n := float64(len(cases))
	var sum [3]float64
	for _, c := range cases {
		r := el.ToECEF(c.ImpactLat, c.ImpactLon, impactAlt)
		sum[0] += r[0]
		sum[1] += r[1]
		sum[2] += r[2]
	}
	mlat, mlon, _ := el.FromECEF([3]float64{sum[0] / n, sum[1] / n, sum[2] / n})
	r0 := el.ToECEF(mlat, mlon, impactAlt)
	enu := geodesy.ENU(mlat, mlon)
	var me, mn float64
	for i := range cases {
		c := &cases[i]
		r := el.ToECEF(c.ImpactLat, c.ImpactLon, impactAlt)
		d := [3]float64{r[0] - r0[0], r[1] - r0[1], r[2] - r0[2]}
		c.East = enu[0][0]*d[0] + enu[0][1]*d[1] + enu[0][2]*d[2]
		c.North = enu[1][0]*d[0] + enu[1][1]*d[1] + enu[1][2]*d[2]
		me += c.East
		mn += c.North
	}
	me /= n
	mn /= n
	var cov [2][2]float64
	for _, c := range cases {
		de, dn := c.East-me, c.North-mn
		cov[0][0] += de * de
		cov[0][1] += de * dn
		cov[1][1] += dn * dn
	}
	cov[0][0] /= n - 1
	cov[0][1] /= n - 1
	cov[1][1] /= n - 1
	cov[1][0] = cov[0][1]
	res := DispersionResult{Cases: cases, MeanLat: mlat, MeanLon: wrapPi(mlon), Covariance: cov,
		Sigma1: EllipseOf(cov, 1), Sigma3: EllipseOf(cov, 3)}
	res.Apogee = spreadOf(cases, func(c *Case) float64 { return c.Apogee })
	res.TimeAbove = spreadOf(cases, func(c *Case) float64 { return c.TimeAbove })
	res.FlightTime = spreadOf(cases, func(c *Case) float64 { return c.FlightTime })
	return res
}

func spreadOf(cases []Case, f func(*Case) float64) Spread {
	n := float64(len(cases))
	var m float64
	for i := range cases {
		m += f(&cases[i])
	}
	m /= n
	var s2 float64
	for i := range cases {
		d := f(&cases[i]) - m
		s2 += d * d
	}
	return Spread{Mean: m, Std: math.Sqrt(s2 / (n - 1))}
}

// EllipseOf returns the k-sigma ellipse of the east-north covariance cov
// (km^2): semi-axes k sqrt(lambda) for the eigenvalues lambda of cov, and
// the azimuth of the major axis. A covariance with equal variances and no
// correlation (a circle) gives azimuth 0.
func EllipseOf(cov [2][2]float64, k float64) Ellipse {
	a, b, c := cov[0][0], (cov[0][1]+cov[1][0])/2, cov[1][1]
	mid := (a + c) / 2
	rad := math.Hypot((a-c)/2, b)
	l1, l2 := mid+rad, math.Max(mid-rad, 0)
	// angle of the major axis from east towards north
	theta := 0.5 * math.Atan2(2*b, a-c)
	az := math.Mod(math.Pi/2-theta, math.Pi)
	if az < 0 {
		az += math.Pi
	}
	if rad == 0 {
		az = 0
	}
	return Ellipse{SemiMajor: k * math.Sqrt(l1), SemiMinor: k * math.Sqrt(l2), Azimuth: az}
}
