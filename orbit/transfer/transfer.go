package transfer

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// Method names, as they appear in Plan.Method (and in reports).
const (
	MethodHohmann            = "hohmann"
	MethodBiElliptic         = "bi-elliptic"
	MethodApsis              = "apsis-transfer"
	MethodPlaneChange        = "plane-change"
	MethodHohmannPlaneChange = "hohmann+plane-change"
	MethodPhasing            = "phasing"
)

// Burn is one impulsive manoeuvre of a Plan.
type Burn struct {
	Label       string  // what the burn does, e.g. "departure", "arrival"
	Radius      float64 // distance from the centre at the burn, km
	TrueAnomaly float64 // true anomaly of the burn point on its transfer orbit, rad (see package doc)
	DeltaV      float64 // magnitude of the velocity change, km/s (>= 0)
	SpeedChange float64 // speed after minus speed before, km/s (negative when braking)
	Cumulative  float64 // sum of DeltaV up to and including this burn, km/s
	Time        float64 // time of the burn from the first burn, s
	PlaneChange float64 // angle by which the burn turns the orbit plane, rad, in [0, π]
}

// Leg is an orbit flown between two burns (a transfer ellipse or a phasing
// orbit).
type Leg struct {
	Label         string  // e.g. "transfer", "phasing"
	Periapsis     float64 // periapsis radius, km
	Apoapsis      float64 // apoapsis radius, km
	SemiMajorAxis float64 // km
	Eccentricity  float64
	Period        float64 // orbital period, s
	Duration      float64 // time spent on this leg in the plan, s
}

// Plan is the result of every manoeuvre function.
type Plan struct {
	Method       string  // one of the Method constants
	Burns        []Burn  // in time order
	DVTotal      float64 // sum of the burns' DeltaV, km/s
	TransferTime float64 // time from the first to the last burn, s
	Legs         []Leg   // orbits flown between burns, in order
	// Split is the fraction of the total plane change done at the first
	// burn (MethodHohmannPlaneChange only; 0 otherwise).
	Split float64
	// Revs is the number of revolutions on the phasing orbit
	// (MethodPhasing only; 0 otherwise).
	Revs int
}

// Ellipse is a closed orbit given by its apsis radii (km, from the centre of
// the body). A circle has Periapsis == Apoapsis; see [Circular].
type Ellipse struct {
	Periapsis float64 // km
	Apoapsis  float64 // km
}

// Circular returns the circular orbit of radius r (km) as an Ellipse.
func Circular(r float64) Ellipse { return Ellipse{Periapsis: r, Apoapsis: r} }

// SemiMajorAxis returns (Periapsis + Apoapsis) / 2, km.
func (e Ellipse) SemiMajorAxis() float64 { return 0.5 * (e.Periapsis + e.Apoapsis) }

// Eccentricity returns (Apoapsis - Periapsis) / (Apoapsis + Periapsis).
func (e Ellipse) Eccentricity() float64 {
	return (e.Apoapsis - e.Periapsis) / (e.Apoapsis + e.Periapsis)
}

// Apsis names one of the two apses of an orbit.
type Apsis int

const (
	Periapsis Apsis = iota // the zero value
	Apoapsis
)

// String returns "periapsis" or "apoapsis".
func (a Apsis) String() string {
	switch a {
	case Periapsis:
		return "periapsis"
	case Apoapsis:
		return "apoapsis"
	}
	return fmt.Sprintf("Apsis(%d)", int(a))
}

// Sentinel errors. Functions return them wrapped in *InputError (or
// *PhasingError); test for them with errors.Is.
var (
	ErrMu                = errors.New("transfer: gravitational parameter must be positive and finite")
	ErrRadius            = errors.New("transfer: radius must be positive and finite")
	ErrApses             = errors.New("transfer: apoapsis radius must not be below periapsis radius")
	ErrApsis             = errors.New("transfer: apsis must be Periapsis or Apoapsis")
	ErrIntermediate      = errors.New("transfer: intermediate apoapsis radius must be at least the larger of the two orbit radii")
	ErrAngle             = errors.New("transfer: plane change angle must be between 0 and 180 deg")
	ErrAnomaly           = errors.New("transfer: true anomaly must be finite")
	ErrSpeed             = errors.New("transfer: speed must be positive and finite")
	ErrFlightPathAngle   = errors.New("transfer: flight path angle must be strictly between -90 and 90 deg")
	ErrPhaseAngle        = errors.New("transfer: phase angle must be finite and strictly between -360 and 360 deg")
	ErrRevs              = errors.New("transfer: phasing revolutions must be at least 1")
	ErrMinRadius         = errors.New("transfer: minimum radius must be non-negative, finite and below the orbit radius")
	ErrPhasingIntersects = errors.New("transfer: phasing orbit periapsis below the minimum radius")
	ErrDeltaV            = errors.New("transfer: delta-v must be non-negative and finite")
	ErrIsp               = errors.New("transfer: specific impulse must be positive and finite")
	ErrMass              = errors.New("transfer: mass must be positive and finite")
	ErrMassOrder         = errors.New("transfer: final mass must not exceed initial mass")
	ErrMassRatio         = errors.New("transfer: mass ratio too large to represent")
	ErrRange             = errors.New("transfer: inputs so extreme that the result is out of floating-point range")
)

// InputError reports a bad argument: the function, the parameter, its value
// and the sentinel error.
type InputError struct {
	Func  string  // e.g. "Hohmann"
	Param string  // e.g. "r1"
	Value float64 // the offending value, in the function's units
	Err   error   // one of the sentinel errors
}

func (e *InputError) Error() string {
	return fmt.Sprintf("transfer: %s: %s = %g: %s", e.Func, e.Param, e.Value, strings.TrimPrefix(e.Err.Error(), "transfer: "))
}

func (e *InputError) Unwrap() error { return e.Err }

// PhasingError reports a phasing orbit whose periapsis would be below the
// allowed minimum radius. It wraps ErrPhasingIntersects.
type PhasingError struct {
	Periapsis float64 // periapsis radius the phasing orbit would need, km (may be <= 0)
	MinRadius float64 // the smallest allowed radius, km
}

func (e *PhasingError) Error() string {
	return fmt.Sprintf("transfer: Phasing: the phasing orbit would need a periapsis radius of %.6g km, below the minimum %.6g km; use more revolutions or phase the other way round",
		e.Periapsis, e.MinRadius)
}

func (e *PhasingError) Unwrap() error { return ErrPhasingIntersects }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

func checkMu(fn string, mu float64) error {
	if !finite(mu) || mu <= 0 {
		return &InputError{Func: fn, Param: "mu", Value: mu, Err: ErrMu}
	}
	return nil
}

func checkRadius(fn, name string, r float64) error {
	if !finite(r) || r <= 0 {
		return &InputError{Func: fn, Param: name, Value: r, Err: ErrRadius}
	}
	return nil
}

func checkEllipse(fn, name string, e Ellipse) error {
	if err := checkRadius(fn, name+".Periapsis", e.Periapsis); err != nil {
		return err
	}
	if err := checkRadius(fn, name+".Apoapsis", e.Apoapsis); err != nil {
		return err
	}
	if e.Apoapsis < e.Periapsis {
		return &InputError{Func: fn, Param: name + ".Apoapsis", Value: e.Apoapsis, Err: ErrApses}
	}
	return nil
}

func checkAngle(fn, name string, di float64) error {
	if !(di >= 0 && di <= math.Pi) {
		return &InputError{Func: fn, Param: name, Value: di, Err: ErrAngle}
	}
	return nil
}

// visViva returns the speed at radius r on an orbit of semi-major axis a.
func visViva(mu, r, a float64) float64 { return math.Sqrt(mu * (2/r - 1/a)) }

// period returns the period of an orbit of semi-major axis a.
func period(mu, a float64) float64 { return 2 * math.Pi * math.Sqrt(a*a*a/mu) }

// leg builds the Leg between radii ra and rb (either order).
func leg(mu float64, label string, ra, rb, duration float64) Leg {
	lo, hi := math.Min(ra, rb), math.Max(ra, rb)
	a := 0.5 * (lo + hi)
	return Leg{Label: label, Periapsis: lo, Apoapsis: hi, SemiMajorAxis: a,
		Eccentricity: (hi - lo) / (hi + lo), Period: period(mu, a), Duration: duration}
}

// anomalyAt returns the true anomaly (0 or π) of radius r on the orbit with
// apses r and other.
func anomalyAt(r, other float64) float64 {
	if r <= other {
		return 0
	}
	return math.Pi
}

// combine returns the magnitude of the difference of two velocities of
// magnitudes va and vb separated by angle theta, without cancellation:
// |Δv|² = (va - vb)² + 4 va vb sin²(θ/2).
func combine(va, vb, theta float64) float64 {
	s := math.Sin(0.5 * theta)
	d := va - vb
	return math.Sqrt(d*d + 4*va*vb*s*s)
}

// finish fills Cumulative and the totals, and refuses a plan with a value
// out of floating-point range (possible only for absurd inputs).
func finish(fn string, p *Plan) error {
	sum := 0.0
	for i := range p.Burns {
		sum += p.Burns[i].DeltaV
		p.Burns[i].Cumulative = sum
	}
	p.DVTotal = sum
	if n := len(p.Burns); n > 0 {
		p.TransferTime = p.Burns[n-1].Time
	}
	bad := func(xs ...float64) (float64, bool) {
		for _, x := range xs {
			if !finite(x) {
				return x, true
			}
		}
		return 0, false
	}
	for _, b := range p.Burns {
		if x, ok := bad(b.Radius, b.TrueAnomaly, b.DeltaV, b.SpeedChange, b.Cumulative, b.Time, b.PlaneChange); ok {
			return &InputError{Func: fn, Param: "result", Value: x, Err: ErrRange}
		}
	}
	for _, l := range p.Legs {
		if x, ok := bad(l.Periapsis, l.Apoapsis, l.SemiMajorAxis, l.Eccentricity, l.Period, l.Duration); ok {
			return &InputError{Func: fn, Param: "result", Value: x, Err: ErrRange}
		}
	}
	if x, ok := bad(p.DVTotal, p.TransferTime, p.Split); ok {
		return &InputError{Func: fn, Param: "result", Value: x, Err: ErrRange}
	}
	return nil
}

// checkResult refuses a scalar result out of floating-point range.
func checkResult(fn string, x float64) error {
	if !finite(x) {
		return &InputError{Func: fn, Param: "result", Value: x, Err: ErrRange}
	}
	return nil
}
