package suborbital

import (
	"errors"
	"fmt"
	"math"

	"centra/bodies/atmosphere"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/propagate"
)

var (
	// ErrBurnout reports a burnout point or velocity that is not usable.
	ErrBurnout = errors.New("suborbital: invalid burnout")
	// ErrVehicle reports a vehicle whose mass, area and drag coefficient
	// are neither all zero (vacuum) nor all positive and finite.
	ErrVehicle = errors.New("suborbital: invalid vehicle")
	// ErrConfig reports an invalid configuration.
	ErrConfig = errors.New("suborbital: invalid configuration")
	// ErrEscape reports a burnout at or above escape speed.
	ErrEscape = errors.New("suborbital: burnout speed at or above escape speed")
	// ErrOrbit reports a burnout whose vacuum conic does not come down to
	// the impact surface: the vehicle reaches orbit.
	ErrOrbit = errors.New("suborbital: the arc reaches orbit")
	// ErrNoImpact reports an arc that did not reach the impact surface
	// within Config.MaxTime.
	ErrNoImpact = errors.New("suborbital: no impact")
)

// BurnoutError says which burnout value is wrong.
type BurnoutError struct {
	Field string  // "latitude", "longitude", "altitude", "speed", "flight-path angle", "azimuth"
	Value float64 // the value given, in internal units
	Why   string
}

func (e *BurnoutError) Error() string {
	return fmt.Sprintf("suborbital: invalid burnout %s %g: %s", e.Field, e.Value, e.Why)
}

// Unwrap returns [ErrBurnout].
func (e *BurnoutError) Unwrap() error { return ErrBurnout }

// Burnout is the state at the end of powered flight, in Earth-fixed terms.
type Burnout struct {
	Lat, Lon   float64 // geodetic latitude and longitude, rad
	Alt        float64 // height above the ellipsoid, km
	Speed      float64 // km/s, relative to the rotating Earth (inertial when Config.Omega is 0)
	FlightPath float64 // angle above the local horizontal, rad, in [-pi/2, pi/2]
	Azimuth    float64 // direction of the horizontal velocity from north through east, rad
}

// Vehicle is the drag model of the payload: a cannonball of mass Mass
// (kg), reference area Area (m^2) and constant drag coefficient Cd. The
// zero value is a vacuum arc; otherwise all three must be positive.
type Vehicle struct {
	Mass float64 // kg
	Area float64 // m^2
	Cd   float64 // dimensionless
}

// HasDrag reports whether v asks for drag: any of the three values set
// ([Vehicle.Validate] then requires all three).
func (v Vehicle) HasDrag() bool { return v.Mass != 0 || v.Area != 0 || v.Cd != 0 }

// BallisticCoefficient returns m / (Cd A) in kg/m^2 (0 for a vacuum arc).
func (v Vehicle) BallisticCoefficient() float64 {
	if !v.HasDrag() {
		return 0
	}
	return v.Mass / (v.Cd * v.Area)
}

// Validate returns an error wrapping [ErrVehicle] unless v is the zero
// value or has a positive, finite mass, area and drag coefficient.
func (v Vehicle) Validate() error {
	if !v.HasDrag() {
		return nil
	}
	for _, x := range []struct {
		name string
		v    float64
	}{{"mass", v.Mass}, {"area", v.Area}, {"drag coefficient", v.Cd}} {
		if !(x.v > 0) || math.IsInf(x.v, 0) {
			return fmt.Errorf("%w: %s %g must be positive and finite (or mass, area and drag coefficient all zero for a vacuum arc)", ErrVehicle, x.name, x.v)
		}
	}
	return nil
}

// Config is the world an arc flies in. Gravity.Mu is required; the other
// zero values are documented per field.
type Config struct {
	// Gravity is the gravity field: a point mass and optionally zonal
	// harmonics about the rotation axis (propagate.PointMass, J2, Zonal).
	// A Perturbation set here is added to the drag acceleration; it
	// receives t in s from burnout and the inertial state of the frame of
	// the package documentation (tests use it for special fields).
	Gravity propagate.Model
	// Ellipsoid is the surface over which heights, latitudes and ground
	// range are measured. The zero value means geodesy.WGS84.
	Ellipsoid geodesy.Ellipsoid
	// Omega is the rotation rate of the Earth and of its atmosphere about
	// the z axis, rad/s (7.292115e-5 for WGS 84). Zero means a
	// non-rotating Earth: the burnout velocity is then inertial.
	Omega float64
	// Density returns the air density in kg/m^3 at a geodetic height in
	// km. Nil means atmosphere.Density (U.S. Standard Atmosphere 1976
	// below 86 km, exponential table above).
	Density func(altKm float64) float64
	// Above is the height in km whose crossings give the time above it
	// (100 km is the usual boundary of space); zero means 0 km.
	Above float64
	// ImpactAlt is the geodetic height of the impact surface, km; zero
	// means the ellipsoid itself.
	ImpactAlt float64
	// Options are the integrator settings (zero value usable).
	Options propagate.Options
	// MaxTime bounds the flight, s. Zero means 1.25 periods of the vacuum
	// point-mass conic of the burnout state, at most 30 days.
	MaxTime float64
}

// Point is a point of the arc in Earth-fixed terms.
type Point struct {
	T     float64 // s from burnout
	Lat   float64 // geodetic latitude, rad
	Lon   float64 // longitude, rad, (-pi, pi]
	Alt   float64 // geodetic height, km
	Speed float64 // km/s relative to the rotating Earth (inertial when Omega is 0)
	// State is the inertial state in the frame of the package
	// documentation (axes of the Earth-fixed frame at burnout).
	State orbit.State
}

// Arc is the outcome of one flight from burnout to impact.
type Arc struct {
	Burnout Point
	Apogee  Point // the highest point; the burnout point when the arc only descends
	Impact  Point // Alt is Config.ImpactAlt (the crossing located; the state's height agrees to ~1e-12 km)
	// AboveUp and AboveDown are the times of the first rise through
	// Config.Above and the last fall through it (0 for AboveUp when the
	// burnout is already above). Both are meaningful only when WasAbove.
	AboveUp, AboveDown float64
	TimeAbove          float64 // s, total time above Config.Above
	WasAbove           bool    // the arc rose above Config.Above
	FlightTime         float64 // s, burnout to impact
	GroundRange        float64 // km, geodesic from below burnout to the impact point
	RangeAzimuth       float64 // rad, azimuth of that geodesic at the burnout point, [0, 2pi)
	RangeApprox        bool    // GroundRange is the mean-sphere great circle (Vincenty did not converge)
	Stats              propagate.Stats
}

// Output asks [Flight.Fly] for the tabulated arc.
type Output struct {
	// Step is the output step in s; points are produced at t = 0, Step,
	// 2 Step, ... before impact (the impact itself is Arc.Impact). Zero
	// means no tabulation.
	Step float64
	// OnPoint receives each point; a returned error stops the flight and
	// is returned unchanged.
	OnPoint func(p Point) error
}

// Flight flies arcs in one [Config]. It keeps its propagators between
// flights and is not safe for concurrent use.
type Flight struct {
	cfg     Config
	el      geodesy.Ellipsoid
	density func(float64) float64
	extra   propagate.Perturbation
	vac     *propagate.Propagator // gravity (+ extra)
	drag    *propagate.Propagator // gravity + drag (+ extra), made on first use
	k       float64               // 1/2 Cd A / m * 1000 m/km, km^-1 * (kg/m^3)^-1
	t0      float64               // time of the current leg's start, s from burnout
	events  [2][]propagate.Event  // the events of the ascending and the descending leg
	// geodetic coordinates of the last position converted: the drag, the
	// three event functions and the next step's first stage all ask for
	// the same point
	cR             [3]float64
	cLat, cLon, cH float64
	cValid         bool
}

// geodetic returns FromECEF(r), from the one-entry cache when r repeats.
func (f *Flight) geodetic(r [3]float64) (lat, lon, h float64) {
	if f.cValid && r == f.cR {
		return f.cLat, f.cLon, f.cH
	}
	lat, lon, h = f.el.FromECEF(r)
	f.cR, f.cLat, f.cLon, f.cH, f.cValid = r, lat, lon, h, true
	return lat, lon, h
}

// New validates cfg and returns a Flight.
func New(cfg Config) (*Flight, error) {
	f := &Flight{cfg: cfg, el: cfg.Ellipsoid, density: cfg.Density, extra: cfg.Gravity.Perturbation}
	if f.el.A == 0 {
		f.el = geodesy.WGS84
	}
	if !(f.el.A > 0) || math.IsInf(f.el.A, 0) || !(f.el.F >= 0 && f.el.F < 1) {
		return nil, fmt.Errorf("%w: ellipsoid a = %g km, f = %g", ErrConfig, f.el.A, f.el.F)
	}
	f.el = geodesy.NewEllipsoid(f.el.A, f.el.F) // derived fields, whatever the caller filled in
	if f.density == nil {
		f.density = atmosphere.Density
	}
	for _, x := range []struct {
		name string
		v    float64
	}{{"Omega", cfg.Omega}, {"Above", cfg.Above}, {"ImpactAlt", cfg.ImpactAlt}, {"MaxTime", cfg.MaxTime}} {
		if math.IsNaN(x.v) || math.IsInf(x.v, 0) {
			return nil, fmt.Errorf("%w: %s = %g", ErrConfig, x.name, x.v)
		}
	}
	if cfg.MaxTime < 0 {
		return nil, fmt.Errorf("%w: MaxTime %g s is negative", ErrConfig, cfg.MaxTime)
	}
	if cfg.ImpactAlt <= -f.el.B/2 {
		return nil, fmt.Errorf("%w: ImpactAlt %g km is deep inside the body", ErrConfig, cfg.ImpactAlt)
	}
	m := cfg.Gravity
	m.Perturbation = nil
	if f.extra != nil {
		m.Perturbation = f.extraOnly
	}
	var err error
	if f.vac, err = propagate.New(m, cfg.Options); err != nil {
		return nil, fmt.Errorf("%w: %w", ErrConfig, err)
	}
	for leg := range f.events {
		f.events[leg] = []propagate.Event{
			evApogee: {Name: "apogee", Kind: propagate.Custom, G: f.heightRate, Direction: -1, Terminal: leg == 0},
			evAbove:  {Name: "above", Kind: propagate.Custom, G: f.aboveG},
			evImpact: {Name: "impact", Kind: propagate.Custom, G: f.impactG, Direction: -1, Terminal: true},
		}
	}
	return f, nil
}

// Indices of the events of a leg.
const (
	evApogee = iota // dh/dt falls through zero
	evAbove         // h - Above, both senses
	evImpact        // h - ImpactAlt falling, terminal
)

// Config returns the configuration of f.
func (f *Flight) Config() Config { return f.cfg }

// Ellipsoid returns the surface of f (WGS 84 when the Config left it zero).
func (f *Flight) Ellipsoid() geodesy.Ellipsoid { return f.el }

func (f *Flight) extraOnly(t float64, s orbit.State) ([3]float64, error) {
	return f.extra(t+f.t0, s)
}

// dragAccel is the perturbation of the drag propagator: cannonball drag
// relative to the atmosphere turning with the Earth, plus Config's own.
func (f *Flight) dragAccel(t float64, s orbit.State) ([3]float64, error) {
	var a [3]float64
	if f.extra != nil {
		var err error
		if a, err = f.extra(t+f.t0, s); err != nil {
			return a, err
		}
	}
	w := f.cfg.Omega
	vr := [3]float64{s.V[0] + w*s.R[1], s.V[1] - w*s.R[0], s.V[2]}
	h := f.dragHeight(s.R)
	rho := f.density(h)
	if !(rho >= 0) || math.IsInf(rho, 0) {
		return a, fmt.Errorf("%w: density %g kg/m^3 at %g km", ErrConfig, rho, h)
	}
	c := -f.k * rho * math.Sqrt(vr[0]*vr[0]+vr[1]*vr[1]+vr[2]*vr[2])
	a[0] += c * vr[0]
	a[1] += c * vr[1]
	a[2] += c * vr[2]
	return a, nil
}

// dragHeight returns the geodetic height (km) of r for the density, by
// the formula of B. R. Bowring, "Transformation from spatial to
// geographical coordinates", Survey Review 23 (181), 1976, 323-327: one
// step from the reduced latitude, with sines and cosines from square roots
// only. It costs a fifth of [geodesy.Ellipsoid.FromECEF];
// TestDragHeight shows it within 1 micrometre of FromECEF from -5 to
// 2000 km at every latitude (measured: 5e-12 km).
func (f *Flight) dragHeight(r [3]float64) float64 {
	a, b, e2 := f.el.A, f.el.B, f.el.E2
	x, y, z := r[0], r[1], r[2]
	p := math.Sqrt(x*x + y*y)
	zt, pt := z*a, p*b
	n := math.Sqrt(zt*zt + pt*pt)
	st, ct := zt/n, pt/n
	num := z + e2/(1-e2)*b*st*st*st
	den := p - e2*a*ct*ct*ct
	m := math.Sqrt(num*num + den*den)
	sp, cp := num/m, den/m
	return p*cp + z*sp - a*math.Sqrt(1-e2*sp*sp)
}

// heightRate is dh/dt = n . v, n the ellipsoid normal (the gradient of
// the geodetic height); h is invariant under rotation about z, so the
// inertial velocity gives the same rate as the Earth-relative one.
func (f *Flight) heightRate(_ float64, s orbit.State) float64 {
	lat, lon, _ := f.geodetic(s.R)
	sp, cp := math.Sincos(lat)
	sl, cl := math.Sincos(lon)
	return cp*cl*s.V[0] + cp*sl*s.V[1] + sp*s.V[2]
}

func (f *Flight) height(s orbit.State) float64 {
	_, _, h := f.geodetic(s.R)
	return h
}

func (f *Flight) aboveG(_ float64, s orbit.State) float64  { return f.height(s) - f.cfg.Above }
func (f *Flight) impactG(_ float64, s orbit.State) float64 { return f.height(s) - f.cfg.ImpactAlt }

// State returns the inertial burnout state (km, km/s) in the frame of the
// package documentation.
func (f *Flight) State(b Burnout) (orbit.State, error) {
	if err := f.checkBurnout(b); err != nil {
		return orbit.State{}, err
	}
	r := f.el.ToECEF(b.Lat, b.Lon, b.Alt)
	enu := geodesy.ENU(b.Lat, b.Lon)
	sg, cg := math.Sincos(b.FlightPath)
	sa, ca := math.Sincos(b.Azimuth)
	ve, vn, vu := b.Speed*cg*sa, b.Speed*cg*ca, b.Speed*sg
	var v [3]float64
	for i := range 3 {
		v[i] = ve*enu[0][i] + vn*enu[1][i] + vu*enu[2][i]
	}
	w := f.cfg.Omega
	v[0] -= w * r[1]
	v[1] += w * r[0]
	return orbit.State{R: r, V: v}, nil
}

func (f *Flight) checkBurnout(b Burnout) error {
	bad := func(field string, v float64, why string) error {
		return &BurnoutError{Field: field, Value: v, Why: why}
	}
	fin := func(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
	switch {
	case !(b.Lat >= -math.Pi/2 && b.Lat <= math.Pi/2):
		return bad("latitude", b.Lat, "must lie in [-pi/2, pi/2] rad")
	case !fin(b.Lon):
		return bad("longitude", b.Lon, "must be finite")
	case !fin(b.Alt):
		return bad("altitude", b.Alt, "must be finite")
	case b.Alt < f.cfg.ImpactAlt:
		return bad("altitude", b.Alt, fmt.Sprintf("is below the impact surface at %g km", f.cfg.ImpactAlt))
	case !(b.Speed > 0) || math.IsInf(b.Speed, 0):
		return bad("speed", b.Speed, "must be positive and finite")
	case !(b.FlightPath >= -math.Pi/2 && b.FlightPath <= math.Pi/2):
		return bad("flight-path angle", b.FlightPath, "must lie in [-pi/2, pi/2] rad")
	case b.Alt == f.cfg.ImpactAlt && !(b.FlightPath > 0):
		return bad("flight-path angle", b.FlightPath, "must be positive for a burnout on the impact surface")
	case !fin(b.Azimuth):
		return bad("azimuth", b.Azimuth, "must be finite")
	}
	return nil
}

// point describes the inertial state s at time t (s from burnout).
func (f *Flight) point(t float64, s orbit.State) Point {
	lat, lon, h := f.el.FromECEF(s.R)
	w := f.cfg.Omega
	lon = wrapPi(lon - w*t)
	vr := [3]float64{s.V[0] + w*s.R[1], s.V[1] - w*s.R[0], s.V[2]}
	return Point{T: t, Lat: lat, Lon: lon, Alt: h, Speed: math.Sqrt(vr[0]*vr[0] + vr[1]*vr[1] + vr[2]*vr[2]), State: s}
}

// wrapPi returns x in (-pi, pi].
func wrapPi(x float64) float64 {
	x = math.Remainder(x, 2*math.Pi)
	if x <= -math.Pi {
		x += 2 * math.Pi
	}
	return x
}

// maxTime returns the flight-time bound for the inertial burnout state s,
// or ErrEscape / ErrOrbit from its vacuum point-mass conic.
func (f *Flight) maxTime(s orbit.State, drag bool) (float64, error) {
	mu := f.cfg.Gravity.Mu
	r := math.Sqrt(s.R[0]*s.R[0] + s.R[1]*s.R[1] + s.R[2]*s.R[2])
	v2 := s.V[0]*s.V[0] + s.V[1]*s.V[1] + s.V[2]*s.V[2]
	energy := v2/2 - mu/r
	if !(energy < 0) {
		return 0, fmt.Errorf("%w: inertial speed %.6f km/s at radius %.3f km, escape speed %.6f km/s", ErrEscape, math.Sqrt(v2), r, math.Sqrt(2*mu/r))
	}
	a := -mu / (2 * energy)
	hx := s.R[1]*s.V[2] - s.R[2]*s.V[1]
	hy := s.R[2]*s.V[0] - s.R[0]*s.V[2]
	hz := s.R[0]*s.V[1] - s.R[1]*s.V[0]
	p := (hx*hx + hy*hy + hz*hz) / mu
	e := math.Sqrt(math.Max(0, 1-p/a))
	rp := a * (1 - e)
	// Without drag a conic whose perigee clears the highest point of the
	// impact surface (the equator) by 1 km does not come down; zonal terms
	// move the perigee by far less over one revolution.
	if !drag && rp > f.el.A+f.cfg.ImpactAlt+1 {
		return 0, fmt.Errorf("%w: perigee altitude about %.1f km above the equatorial radius", ErrOrbit, rp-f.el.A)
	}
	if f.cfg.MaxTime > 0 {
		return f.cfg.MaxTime, nil
	}
	period := 2 * math.Pi * math.Sqrt(a*a*a/mu)
	return math.Min(1.25*period, 30*86400), nil
}

// Fly flies one arc from burnout b with vehicle v (the zero Vehicle is a
// vacuum arc), tabulating it into out when out is not nil.
func (f *Flight) Fly(b Burnout, v Vehicle, out *Output) (Arc, error) {
	if err := v.Validate(); err != nil {
		return Arc{}, err
	}
	s0, err := f.State(b)
	if err != nil {
		return Arc{}, err
	}
	drag := v.HasDrag()
	tMax, err := f.maxTime(s0, drag)
	if err != nil {
		return Arc{}, err
	}
	p := f.vac
	if drag {
		if f.drag == nil {
			m := f.cfg.Gravity
			m.Perturbation = f.dragAccel
			if f.drag, err = propagate.New(m, f.cfg.Options); err != nil {
				return Arc{}, fmt.Errorf("%w: %w", ErrConfig, err)
			}
		}
		p = f.drag
		f.k = 0.5 * v.Cd * v.Area / v.Mass * 1000
	}
	arc := Arc{Burnout: f.point(0, s0)}
	arc.Apogee = arc.Burnout
	h0 := arc.Burnout.Alt
	above := h0 > f.cfg.Above || (h0 == f.cfg.Above && f.heightRate(0, s0) > 0)
	if above {
		arc.WasAbove = true
	}
	var start float64 // when the current stretch above began
	var impact *Point
	onEvent := func(hit propagate.EventHit) error {
		t := hit.T + f.t0
		switch hit.Index {
		case evApogee:
			pt := f.point(t, hit.State)
			if pt.Alt > arc.Apogee.Alt {
				arc.Apogee = pt
			}
		case evAbove:
			if hit.Direction > 0 && !above {
				above, start = true, t
				if !arc.WasAbove {
					arc.WasAbove, arc.AboveUp = true, t
				}
			} else if hit.Direction < 0 && above {
				above = false
				arc.TimeAbove += t - start
				arc.AboveDown = t
			}
		case evImpact:
			pt := f.point(t, hit.State)
			pt.Alt = f.cfg.ImpactAlt // the located crossing; the state's own height agrees to ~1e-12 km
			impact = &pt
		}
		return nil
	}
	// Leg 1: burnout to apogee (or to impact when the arc only descends).
	// Leg 2: apogee to impact; later apogees (grazing arcs over the
	// ellipsoid) are still recorded.
	f.t0 = 0
	res, err := p.Run(s0, tMax, &propagate.Output{Events: f.events[0], OnEvent: onEvent})
	addStats(&arc.Stats, res.Stats)
	if err != nil {
		return arc, stepError(err, f.t0)
	}
	if impact == nil && res.Terminated {
		f.t0 = res.T
		res, err = p.Run(res.State, tMax-res.T, &propagate.Output{Events: f.events[1], OnEvent: onEvent})
		addStats(&arc.Stats, res.Stats)
		if err != nil {
			return arc, stepError(err, f.t0)
		}
	}
	f.t0 = 0
	if impact == nil {
		return arc, fmt.Errorf("%w within %.0f s of burnout (height %.3f km at the end); the arc may be nearly orbital", ErrNoImpact, tMax, f.height(res.State))
	}
	arc.Impact = *impact
	arc.FlightTime = impact.T
	if above {
		arc.TimeAbove += impact.T - start
		arc.AboveDown = impact.T
	}
	arc.GroundRange, arc.RangeAzimuth, arc.RangeApprox = f.groundRange(b.Lat, b.Lon, impact.Lat, impact.Lon)
	if out != nil && out.Step > 0 && out.OnPoint != nil {
		if err := f.tabulate(p, s0, arc.FlightTime, out); err != nil {
			return arc, err
		}
	}
	return arc, nil
}

// tabulate runs the arc again, without events, for the fixed-step points
// strictly before impact.
func (f *Flight) tabulate(p *propagate.Propagator, s0 orbit.State, tEnd float64, out *Output) error {
	if !(out.Step > 0) || math.IsInf(out.Step, 0) {
		return fmt.Errorf("%w: output step %g s", ErrConfig, out.Step)
	}
	f.t0 = 0
	_, err := p.Run(s0, tEnd, &propagate.Output{Step: out.Step, OnState: func(t float64, s orbit.State) error {
		if t >= tEnd {
			return nil
		}
		return out.OnPoint(f.point(t, s))
	}})
	if err != nil {
		var se *propagate.StepError
		if errors.As(err, &se) {
			return stepError(err, 0)
		}
		return err
	}
	return nil
}

func (f *Flight) groundRange(lat1, lon1, lat2, lon2 float64) (float64, float64, bool) {
	s, az, _, err := Inverse(f.el, lat1, lon1, lat2, lon2)
	if err == nil {
		return s, az, false
	}
	r := (2*f.el.A + f.el.B) / 3
	d, az := greatCircle(lat1, lon1, lat2, lon2)
	return r * d, az, true
}

func addStats(dst *propagate.Stats, s propagate.Stats) {
	dst.Steps += s.Steps
	dst.Rejected += s.Rejected
	dst.Evaluations += s.Evaluations
}

// stepError shifts a propagate.StepError of a leg to time from burnout.
func stepError(err error, t0 float64) error {
	var se *propagate.StepError
	if errors.As(err, &se) {
		c := *se
		c.T += t0
		return &c
	}
	return err
}
