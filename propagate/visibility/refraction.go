package visibility

import "math"

const (
	deg    = math.Pi / 180
	arcmin = deg / 60
	// refractionFloor is the lowest true elevation the refraction formula
	// is evaluated at, rad; below it the refraction is held constant.
	refractionFloor = -1 * deg
)

// Refraction returns the atmospheric refraction (rad, positive: the
// object appears higher) of an object at true elevation h (rad), by the
// formula of Saemundsson in Meeus, Astronomical Algorithms, 2nd ed., eq.
// 16.4, with the zenith constant 0.0019279 arcmin; held at its -1 deg
// value below -1 deg. See the package documentation.
func Refraction(h float64) float64 {
	hd := math.Max(h, refractionFloor) / deg
	return (1.02/math.Tan((hd+10.3/(hd+5.11))*deg) + 0.0019279) * arcmin
}

// Apparent returns the apparent elevation h + Refraction(h), rad.
func Apparent(h float64) float64 { return h + Refraction(h) }

// BennettRefraction returns the refraction (rad) of an object seen at
// apparent elevation h0 (rad) by the formula of Bennett (Journal of
// Navigation 35 (1982) 255) as given by Meeus, Astronomical Algorithms,
// 2nd ed., eq. 16.3: R = 1' / tan(h0 + 7.31/(h0 + 4.4)), h0 in degrees.
// It is the inverse direction of [Refraction] and serves to check it.
func BennettRefraction(h0 float64) float64 {
	hd := h0 / deg
	return arcmin / math.Tan((hd+7.31/(hd+4.4))*deg)
}

// SpeedOfLight is c in km/s (exact, SI definition of the metre).
const SpeedOfLight = 299792.458

// Doppler returns the non-relativistic Doppler shift (Hz) of a carrier of
// f Hz seen at range rate rr (km/s, positive receding): -f rr / c.
func Doppler(f, rr float64) float64 { return -f * rr / SpeedOfLight }
