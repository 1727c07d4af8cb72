package orbit

import "math"

// Small helpers on [3]float64; vectors are passed by value.

func dot(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }

func cross(a, b [3]float64) [3]float64 {
	return [3]float64{
		a[1]*b[2] - a[2]*b[1],
		a[2]*b[0] - a[0]*b[2],
		a[0]*b[1] - a[1]*b[0],
	}
}

func norm(a [3]float64) float64 { return math.Sqrt(dot(a, a)) }

func scale(k float64, a [3]float64) [3]float64 { return [3]float64{k * a[0], k * a[1], k * a[2]} }

func finite3(a [3]float64) bool { return finite(a[0]) && finite(a[1]) && finite(a[2]) }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// wrap2Pi returns x reduced to [0, 2pi).
func wrap2Pi(x float64) float64 {
	if x >= 0 && x < 2*math.Pi {
		return x
	}
	y := math.Mod(x, 2*math.Pi)
	if y < 0 {
		y += 2 * math.Pi
	}
	if y >= 2*math.Pi { // y was -tiny: y + 2pi rounds to 2pi
		y = 0
	}
	return y
}

// wrapPi returns x reduced to (-pi, pi].
func wrapPi(x float64) float64 {
	if x > -math.Pi && x <= math.Pi {
		return x
	}
	y := math.Remainder(x, 2*math.Pi) // [-pi, pi]
	if y <= -math.Pi {
		y += 2 * math.Pi
	}
	return y
}
