package forces

import (
	"errors"
	"fmt"
	"math"

	"centra/bodies/atmosphere"
	"centra/bodies/geodesy"
	"centra/orbit"
	"centra/propagate"
)

// ErrConfig is the class of invalid force configurations.
var ErrConfig = errors.New("forces: invalid configuration")

// BallisticCoefficient returns B = m/(Cd A) in kg/m^2 for a mass in kg, a
// drag coefficient Cd and a reference area in m^2. It returns NaN unless
// all three are positive and finite; [NewDrag] refuses that.
func BallisticCoefficient(massKg, cd, areaM2 float64) float64 {
	if !(massKg > 0 && cd > 0 && areaM2 > 0) || math.IsInf(massKg, 0) || math.IsInf(cd, 0) || math.IsInf(areaM2, 0) {
		return math.NaN()
	}
	return massKg / (cd * areaM2)
}

// Limits of the accepted ballistic coefficients, kg/m^2. A 1 kg sail of
// 10 m^2 has B = 0.045; a dense 1000 kg sphere of 1 m^2, B = 450. Values
// outside [MinBallistic, MaxBallistic] are certainly input errors.
const (
	MinBallistic = 1e-3
	MaxBallistic = 1e5
)

// DragConfig configures [NewDrag]. The zero values of the optional fields
// have the meanings given.
type DragConfig struct {
	// BallisticCoefficient is B = m/(Cd A) in kg/m^2, required, in
	// [MinBallistic, MaxBallistic].
	BallisticCoefficient float64
	// DensityScale multiplies the model density (solar activity and model
	// error); zero means 1.
	DensityScale atmosphere.DensityScale
	// RotationRate is the rate in rad/s at which the atmosphere turns
	// about the GCRF z axis with the body; zero means a non-rotating
	// atmosphere.
	RotationRate float64
	// Ellipsoid gives the geodetic height that selects the density; nil
	// means WGS 84.
	Ellipsoid *geodesy.Ellipsoid
	// Density returns the density in kg/m^3 at a height in km; nil means
	// [atmosphere.Density] (U.S. Standard Atmosphere 1976 to 86 km, the
	// exponential table above). Tests use a constant.
	Density func(altKm float64) float64
}

// Drag is the cannonball drag of an atmosphere co-rotating with the body:
//
//	a = -1/2 (rho / B) |v_rel| v_rel,   v_rel = v - omega x r,  omega = (0, 0, RotationRate)
//
// with rho = DensityScale * Density(h) at the geodetic height h of r. With
// rho in kg/m^3, B in kg/m^2 and v in km/s, rho/B is in 1/m and the
// acceleration in km/s^2 carries a factor 1000 m/km:
// a[km/s^2] = -500 (rho/B) |v_rel| v_rel.
type Drag struct {
	b, scale, omega float64
	ell             *geodesy.Ellipsoid
	density         func(float64) float64
}

// NewDrag validates c and returns the drag force.
func NewDrag(c DragConfig) (*Drag, error) {
	b := c.BallisticCoefficient
	if math.IsNaN(b) || b < MinBallistic || b > MaxBallistic {
		return nil, fmt.Errorf("%w: ballistic coefficient %g kg/m^2 outside [%g, %g]", ErrConfig, b, float64(MinBallistic), float64(MaxBallistic))
	}
	scale := c.DensityScale
	if scale == 0 {
		scale = atmosphere.NominalDensityScale
	}
	if err := scale.Validate(); err != nil {
		return nil, fmt.Errorf("%w: %w", ErrConfig, err)
	}
	if math.IsNaN(c.RotationRate) || math.Abs(c.RotationRate) > 1e-2 {
		return nil, fmt.Errorf("%w: rotation rate %g rad/s is not a body's", ErrConfig, c.RotationRate)
	}
	d := &Drag{b: b, scale: float64(scale), omega: c.RotationRate, ell: c.Ellipsoid, density: c.Density}
	if d.ell == nil {
		d.ell = &geodesy.WGS84
	}
	if d.density == nil {
		d.density = atmosphere.Density
	}
	return d, nil
}

// BallisticCoefficient returns B in kg/m^2.
func (d *Drag) BallisticCoefficient() float64 { return d.b }

// DensityScale returns the density factor in force.
func (d *Drag) DensityScale() float64 { return d.scale }

// RotationRate returns the atmosphere's rotation rate in rad/s.
func (d *Drag) RotationRate() float64 { return d.omega }

// Height returns the geodetic height in km of the GCRF position r.
func (d *Drag) Height(r [3]float64) float64 {
	_, _, h := d.ell.FromECEF(r)
	return h
}

// Density returns the scaled density in kg/m^3 at the GCRF position r.
func (d *Drag) Density(r [3]float64) float64 {
	return d.scale * d.density(d.Height(r))
}

// DensityAtHeight returns the scaled density in kg/m^3 at geodetic height
// h in km.
func (d *Drag) DensityAtHeight(h float64) float64 { return d.scale * d.density(h) }

// Acceleration returns the drag acceleration in km/s^2 at state s.
func (d *Drag) Acceleration(s orbit.State) [3]float64 {
	rho := d.Density(s.R)
	vx := s.V[0] + d.omega*s.R[1]
	vy := s.V[1] - d.omega*s.R[0]
	vz := s.V[2]
	k := -500 * rho / d.b * math.Sqrt(vx*vx+vy*vy+vz*vz)
	return [3]float64{k * vx, k * vy, k * vz}
}

// Perturbation returns the drag as a model perturbation (it does not
// depend on time).
func (d *Drag) Perturbation() propagate.Perturbation {
	return func(_ float64, s orbit.State) ([3]float64, error) { return d.Acceleration(s), nil }
}
