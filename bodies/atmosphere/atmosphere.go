package atmosphere

import (
	"errors"
	"fmt"
	"math"
	"strconv"
)

// Model names reported in [Conditions.Model].
const (
	// ModelUSSA1976 is the U.S. Standard Atmosphere 1976, -5 to 86 km.
	ModelUSSA1976 = "ussa1976"
	// ModelExponential is the exponential density table of Vallado,
	// Fundamentals of Astrodynamics and Applications, 4th ed., Table 8-4,
	// above 86 km.
	ModelExponential = "exponential-vallado-table-8-4"
)

// Altitude limits, km.
const (
	// MinAltitudeKm is the lowest altitude the model covers: the U.S.
	// Standard Atmosphere 1976 tables begin at -5 km.
	MinAltitudeKm = -5.0
	// USSATopKm is the highest altitude given by the U.S. Standard
	// Atmosphere 1976 here; above it the exponential table is used.
	USSATopKm = 86.0
)

// ErrAltitude is the class of altitudes the model does not cover.
var ErrAltitude = errors.New("atmosphere: altitude out of range")

// ErrDensityScale is the class of unusable density scale factors.
var ErrDensityScale = errors.New("atmosphere: bad density scale")

// AltitudeError reports an altitude the model does not cover.
type AltitudeError struct {
	AltitudeKm float64
	Err        error // ErrAltitude
}

func (e *AltitudeError) Error() string {
	alt := strconv.FormatFloat(e.AltitudeKm, 'g', -1, 64)
	if math.IsNaN(e.AltitudeKm) || math.IsInf(e.AltitudeKm, 0) {
		return fmt.Sprintf("atmosphere: altitude %s km is not a finite number; give a finite altitude in km", alt)
	}
	return fmt.Sprintf("atmosphere: altitude %s km is below the model's lowest altitude %g km; give an altitude of at least %g km",
		alt, MinAltitudeKm, MinAltitudeKm)
}

// Unwrap returns the error class.
func (e *AltitudeError) Unwrap() error { return e.Err }

// Conditions are the atmosphere's state at one altitude, as returned by
// [Properties].
type Conditions struct {
	DensityKgM3    float64 // density, kg/m^3
	TemperatureK   float64 // molecular-scale temperature T_M, K; 0 when HasTemperature is false
	PressurePa     float64 // pressure, Pa; 0 when HasPressure is false
	HasTemperature bool    // false above 86 km, where the model gives density only
	HasPressure    bool    // false above 86 km, where the model gives density only
	Model          string  // ModelUSSA1976 or ModelExponential
}

// Properties returns density, temperature and pressure at geometric
// altitude altKm. Temperature and pressure are given up to 86 km only (see
// the package documentation). An altitude that is NaN, infinite or below
// [MinAltitudeKm] returns an *[AltitudeError] wrapping [ErrAltitude].
func Properties(altKm float64) (Conditions, error) {
	if math.IsNaN(altKm) || math.IsInf(altKm, 0) || altKm < MinAltitudeKm {
		return Conditions{}, &AltitudeError{AltitudeKm: altKm, Err: ErrAltitude}
	}
	if altKm <= USSATopKm {
		t, p, rho := ussa1976(altKm)
		return Conditions{DensityKgM3: rho, TemperatureK: t, PressurePa: p,
			HasTemperature: true, HasPressure: true, Model: ModelUSSA1976}, nil
	}
	return Conditions{DensityKgM3: exponential(altKm), Model: ModelExponential}, nil
}

// Density returns the density in kg/m^3 at geometric altitude altKm,
// unscaled. It does not allocate. Below [MinAltitudeKm] it returns the
// density at MinAltitudeKm; for +Inf it returns 0 and for NaN it returns
// NaN (callers validate user input with [Properties]).
func Density(altKm float64) float64 {
	switch {
	case altKm <= USSATopKm:
		if altKm < MinAltitudeKm {
			altKm = MinAltitudeKm
		}
		_, _, rho := ussa1976(altKm)
		return rho
	case altKm > USSATopKm:
		return exponential(altKm)
	}
	return altKm // NaN
}

// DensityScale is a dimensionless factor a caller multiplies into the
// model density, to represent solar activity or other departures from the
// mean model (for example 0.5 and 3 to bracket a lifetime estimate). The
// model never applies it by itself. Valid values are finite and lie in
// (0, [MaxDensityScale]]; use [NominalDensityScale] for the model as
// published. The zero value is not valid: check with Validate before use.
type DensityScale float64

// NominalDensityScale leaves the model density unchanged.
const NominalDensityScale DensityScale = 1

// MaxDensityScale is the largest accepted density scale. Solar-cycle
// variations reach about a factor of 10 at 400 km and 100 at 800 km; a
// larger factor is certainly an input error.
const MaxDensityScale = 1000

// Validate returns an error wrapping [ErrDensityScale] unless s is finite
// and in (0, MaxDensityScale].
func (s DensityScale) Validate() error {
	x := float64(s)
	if math.IsNaN(x) || math.IsInf(x, 0) || x <= 0 || x > MaxDensityScale {
		return fmt.Errorf("%w: %s is not in (0, %d]; give a positive factor, 1 for the model as published",
			ErrDensityScale, strconv.FormatFloat(x, 'g', -1, 64), MaxDensityScale)
	}
	return nil
}

// Density returns s times [Density](altKm), in kg/m^3.
func (s DensityScale) Density(altKm float64) float64 { return float64(s) * Density(altKm) }
