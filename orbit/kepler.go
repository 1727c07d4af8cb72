package orbit

import "math"

// 2*pi split into a float64 head and the remainder, for reducing large
// angles without losing the low-order bits.
const (
	twoPiHi = 6.283185307179586      // float64(2*pi)
	twoPiLo = 2.4492935982947064e-16 // 2*pi - twoPiHi
)

// reduce returns x - 2*pi*k in [-pi, pi] (to rounding) and the integer k
// (as a float64). It is branch-free; for k = 0 it returns x unchanged.
func reduce(x float64) (float64, float64) {
	k := math.Floor(x*(1/twoPiHi) + 0.5)
	r := math.FMA(-k, twoPiLo, math.FMA(-k, twoPiHi, x))
	if r > 3.2 || r < -3.2 {
		// |x| beyond about 1e15, where x/2pi rounds to the wrong integer:
		// the exact IEEE remainder (x itself carries no fraction of a
		// revolution there, so any consistent answer will do).
		r = math.Remainder(x, twoPiHi)
		k = math.Round((x - r) / twoPiHi)
	}
	return r, k
}

// unreduce adds back the k revolutions removed by reduce.
func unreduce(r, k float64) float64 {
	return math.FMA(k, twoPiHi, math.FMA(k, twoPiLo, r))
}

// xMinusSinSeries is the Taylor series of x - sin(x) through x^21, for
// |x| < 1 (the first omitted term is below 2e-20 of the sum).
func xMinusSinSeries(x float64) float64 {
	y := x * x
	s := -1.0 / 51090942171709440000 // -1/21!
	s = s*y + 1.0/121645100408832000 // 1/19!
	s = s*y - 1.0/355687428096000    // 1/17!
	s = s*y + 1.0/1307674368000      // 1/15!
	s = s*y - 1.0/6227020800         // 1/13!
	s = s*y + 1.0/39916800           // 1/11!
	s = s*y - 1.0/362880             // 1/9!
	s = s*y + 1.0/5040               // 1/7!
	s = s*y - 1.0/120                // 1/5!
	s = s*y + 1.0/6                  // 1/3!
	return s * y * x
}

// sinhMinusX returns sinh(x) - x, without cancellation for small |x|.
func sinhMinusX(x float64) float64 {
	if math.Abs(x) >= 1 {
		return math.Sinh(x) - x
	}
	y := x * x
	s := 1.0 / 51090942171709440000
	s = s*y + 1.0/121645100408832000
	s = s*y + 1.0/355687428096000
	s = s*y + 1.0/1307674368000
	s = s*y + 1.0/6227020800
	s = s*y + 1.0/39916800
	s = s*y + 1.0/362880
	s = s*y + 1.0/5040
	s = s*y + 1.0/120
	s = s*y + 1.0/6
	return s * y * x
}

// keplerMeanElliptic returns M = E - e sin E for 0 <= e < 1, computed as
// (1-e)E + e(E - sin E) where that avoids cancellation (e near 1, E small).
func keplerMeanElliptic(E, e float64) float64 {
	r, k := reduce(E)
	var m float64
	if e >= 0.5 && math.Abs(r) < 1 {
		m = (1-e)*r + e*xMinusSinSeries(r) // 1-e is exact for e >= 0.5
	} else {
		m = r - e*math.Sin(r)
	}
	return unreduce(m, k)
}

// keplerMeanHyperbolic returns M = e sinh H - H for e > 1, computed as
// (e-1)H + e(sinh H - H).
func keplerMeanHyperbolic(H, e float64) float64 {
	return (e-1)*H + e*sinhMinusX(H)
}

// SolveKeplerElliptic returns the eccentric anomaly E (rad) that solves
// Kepler's equation M = E - e sin E for the mean anomaly M (rad) and the
// eccentricity 0 <= e < 1.
//
// M may take any finite value; E is returned in the same revolution as M
// (E - M lies in [-e, e]), so M in [0, 2pi) gives E in [0, 2pi). The
// residual |E - e sin E - M|, evaluated for M reduced to [-pi, pi], is
// at most 1e-15 rad for all e in [0, 0.999999]; e closer to 1 still
// converges, with the residual held near the rounding of M.
//
// The method is Markley's non-iterative solver (F. L. Markley, "Kepler
// equation solver", Celestial Mechanics and Dynamical Astronomy 63,
// 101-111, 1995): a cubic starter accurate everywhere, then one
// fifth-order correction (here in series-reversion form, one division),
// with the residual E - e sin E - M computed without cancellation near
// e = 1, M = 0. The cube root, sine and cosine are inlined, branch-free
// kernels; about 45 ns per solve on a 2020s x86-64 core.
//
// Like the functions of package math, it returns NaN for e outside
// [0, 1) and for a NaN or infinite M; callers that take e and M from a
// user validate them first (see [TrueFromMean] and [StateFromElements]).
func SolveKeplerElliptic(M, e float64) float64 {
	if e == 0 {
		return M
	}
	if !(e > 0 && e < 1) || math.IsInf(M, 0) {
		return math.NaN() // also for NaN M, through the arithmetic below
	}
	m, k := reduce(M)
	return unreduce(markley(m, e), k)
}

// markley solves Kepler's equation for m in [-pi, pi] and 0 < e < 1.
func markley(m, e float64) float64 {
	const (
		pi2 = math.Pi * math.Pi
		// alpha = (3 pi^2 + 1.6 pi (pi - |M|)/(1+e)) / (pi^2 - 6)
		a0 = 3 * pi2 / (pi2 - 6)
		a1 = 1.6 * math.Pi / (pi2 - 6)
	)
	if m == 0 {
		return m // keeps the sign of zero
	}
	ome := 1 - e
	alpha := math.FMA(a1, (math.Pi-math.Abs(m))/(1+e), a0)
	d := math.FMA(alpha, e, 3*ome)
	m2 := m * m
	ad := alpha * d
	q := math.FMA(2*ad, ome, -m2)
	r := math.FMA(3*ad, d-ome, m2) * m
	disc := math.FMA(q*q, q, r*r)
	if disc < 0 {
		disc = 0
	}
	w := pow23(math.Abs(r) + math.Sqrt(disc))
	den := math.FMA(w, w+q, q*q)
	E := math.FMA(2*r, w, m*den) / (den * d)

	// Fifth-order correction. With f(E) = E - e sin E - M and its
	// derivatives f0..f4 at the starter, the root E + delta of the
	// quartic Taylor polynomial follows by series reversion,
	// delta = u - g2 u^2 + (2g2^2 - g3)u^3 + (5g2 g3 - 5g2^3 - g4)u^4,
	// u = -f0/f1, g_k = f_k/(k! f1); the error is O(u^5), as for
	// Markley's nested form, with one division instead of three.
	sn, cs := sincosPi(E)
	f2 := e * sn
	f1 := math.FMA(-e, cs, 1)
	inv := 1 / f1
	var f0 float64
	if e >= 0.5 && math.Abs(E) < 1 {
		// cancellation-free residual near the parabolic corner
		f0 = math.FMA(ome, E, math.FMA(e, xMinusSinSeries(E), -m))
	} else {
		f0 = E - f2 - m
	}
	u := -f0 * inv
	g2 := 0.5 * f2 * inv
	g3 := (1.0 / 6) * (1 - f1) * inv // f3 = e cos E = 1 - f1
	g4 := (-1.0 / 24) * f2 * inv     // f4 = -e sin E
	c3 := math.FMA(2*g2, g2, -g3)
	c4 := math.FMA(5*g2, math.FMA(-g2, g2, g3), -g4)
	return math.FMA(u, math.FMA(u, math.FMA(u, math.FMA(u, c4, c3), -g2), 1), E)
}

// sincosPi returns sin(x) and cos(x) for |x| <= 4, branch-free: x is
// reduced by k pi/2 (pi/2 split in three parts as in package math) to
// |r| <= pi/4, where the polynomial kernels of package math (from Cephes)
// apply, and the quadrant is applied by table. Accuracy is that of
// math.Sincos (about 1 ulp).
func sincosPi(x float64) (sin, cos float64) {
	const (
		p1 = 2 * 7.85398125648498535156e-1  // pi/2 in three parts (twice
		p2 = 2 * 3.77489470793079817668e-8  // math's PI4A, PI4B, PI4C);
		p3 = 2 * 2.69515142907905952645e-15 // k*p1 and k*p2 are exact.
	)
	k := math.Floor(x*(2/math.Pi) + 0.5)
	r := ((x - k*p1) - k*p2) - k*p3
	z := r * r
	s := math.FMA(z, 1.58962301576546568060e-10, -2.50507477628578072866e-8)
	s = math.FMA(s, z, 2.75573136213857245213e-6)
	s = math.FMA(s, z, -1.98412698295895385996e-4)
	s = math.FMA(s, z, 8.33333333332211858878e-3)
	s = math.FMA(s, z, -1.66666666666666307295e-1)
	s = math.FMA(r*z, s, r)
	c := math.FMA(z, -1.13585365213876817300e-11, 2.08757008419747316778e-9)
	c = math.FMA(c, z, -2.75573141792967388112e-7)
	c = math.FMA(c, z, 2.48015872888517045348e-5)
	c = math.FMA(c, z, -1.38888888888730564116e-3)
	c = math.FMA(c, z, 4.16666666666665929218e-2)
	c = math.FMA(z*z, c, math.FMA(-0.5, z, 1))
	q := int(k) & 3
	a, b := quadA[q], quadB[q]
	return a*s + b*c, a*c - b*s
}

var (
	quadA = [4]float64{1, 0, -1, 0}
	quadB = [4]float64{0, 1, 0, -1}
)

// pow23 returns x^(2/3) for x > 0 as x * x^(-1/3), with the inverse cube
// root from a bit-level estimate (|1 - x y^3| < 0.11) refined by one
// division-free step of the binomial series of (1-d)^(-1/3) to order d^4
// (relative error below 3e-6, ample for the starter, which the
// fifth-order correction then makes exact).
func pow23(x float64) float64 {
	if x < 0x1p-1000 || x > 0x1p1000 {
		c := math.Cbrt(x)
		return c * c
	}
	y := math.Float64frombits(0x553ef00000000000 - math.Float64bits(x)/3)
	d := math.FMA(-x*y, y*y, 1)
	p := math.FMA(d, 35.0/243, 14.0/81)
	p = math.FMA(d, p, 2.0/9)
	p = math.FMA(d, p, 1.0/3)
	return x * math.FMA(y*d, p, y)
}

// SolveKeplerHyperbolic returns the hyperbolic anomaly H that solves
// M = e sinh H - H for the hyperbolic mean anomaly M and the
// eccentricity e > 1. It is odd in M.
//
// The start is an upper bound on the root for M > 0 (the root of the
// cubic (e-1)H + e H^3/6 = M, tightened by one step of H = asinh((M+H)/e));
// Newton's method from there decreases monotonically onto the root,
// because f(H) = e sinh H - H - M is increasing and convex for H > 0.
// The residual is evaluated as (e-1)H + e(sinh H - H) - M, without
// cancellation near e = 1. |M| up to 1e300 is supported.
//
// It returns NaN for e <= 1, for a NaN e or M, and returns M for M = +-Inf.
func SolveKeplerHyperbolic(M, e float64) float64 {
	if !(e > 1) || math.IsInf(e, 0) || math.IsNaN(M) {
		return math.NaN()
	}
	if M == 0 || math.IsInf(M, 0) {
		return M
	}
	m := math.Abs(M)
	var g float64 // an upper bound on the root
	if m < 1e10 {
		// Root of (e/6)H^3 + (e-1)H - m = 0, stable form of Cardano's
		// solution: H = 2Q/(t^2 + P + P^2/t^2), t^3 = Q + sqrt(Q^2 + P^3).
		P := (e - 1) * 2 / e // (e-1)/(3 e/6)
		Q := 3 * m / e       // m/(2 e/6)
		t := math.Cbrt(Q + math.Sqrt(Q*Q+P*P*P))
		g = 2 * Q / (t*t + P + P*P/(t*t))
	} else {
		g = m // e sinh m >= 2m for m >= 2.2, so m bounds the root
	}
	if u := math.Asinh((m + g) / e); u < g {
		g = u
	}
	H := g
	for range 100 {
		f := keplerMeanHyperbolic(H, e) - m
		fp := e*math.Cosh(H) - 1
		dH := f / fp
		H -= dH
		if math.Abs(dH) <= 2e-16*H {
			break
		}
	}
	if M < 0 {
		return -H
	}
	return H
}

// SolveBarker returns the true anomaly nu (rad, in (-pi, pi)) of a
// parabolic orbit from its mean anomaly M, in the convention used
// throughout this package:
//
//	M = sqrt(mu/p^3) (t - T) = D/2 + D^3/6,  D = tan(nu/2),
//
// where p is the semi-latus rectum and T the time of periapsis passage
// (Barker's equation). The cubic D^3 + 3D - 6M = 0 is solved in closed
// form, D = B - 1/B with B^3 = 3M + sqrt(9M^2 + 1), evaluated without
// cancellation. It returns NaN for NaN M and +-pi for M = +-Inf.
func SolveBarker(M float64) float64 {
	if math.IsNaN(M) {
		return M
	}
	m := math.Abs(M)
	var D float64
	switch {
	case m == 0:
		return M
	case m < 1e100:
		s := math.Sqrt(1 + 9*m*m)
		w := 3*m + 9*m*m/(1+s) // B^3 - 1
		B := math.Cbrt(1 + w)
		D = w * (B + 1) / ((B*B + B + 1) * B) // (B^2 - 1)/B
	default:
		D = math.Cbrt(6 * m) // D^3 >> 3D
	}
	nu := 2 * math.Atan(D)
	if M < 0 {
		return -nu
	}
	return nu
}

// TrueFromEccentric returns the true anomaly of an elliptic orbit
// (0 <= e < 1) from the eccentric anomaly E, in the same revolution as
// E: tan(nu/2) = sqrt((1+e)/(1-e)) tan(E/2). NaN for e outside [0, 1).
func TrueFromEccentric(E, e float64) float64 {
	if !(e >= 0 && e < 1) {
		return math.NaN()
	}
	r, k := reduce(E)
	s, c := math.Sincos(r / 2) // c >= 0 for r in [-pi, pi]
	nu := 2 * math.Atan2(math.Sqrt(1+e)*s, math.Sqrt(1-e)*c)
	return unreduce(nu, k)
}

// EccentricFromTrue returns the eccentric anomaly of an elliptic orbit
// (0 <= e < 1) from the true anomaly nu, in the same revolution as nu.
// NaN for e outside [0, 1).
func EccentricFromTrue(nu, e float64) float64 {
	if !(e >= 0 && e < 1) {
		return math.NaN()
	}
	r, k := reduce(nu)
	s, c := math.Sincos(r / 2)
	E := 2 * math.Atan2(math.Sqrt(1-e)*s, math.Sqrt(1+e)*c)
	return unreduce(E, k)
}

// TrueFromHyperbolic returns the true anomaly (rad, within the
// asymptotes, |nu| < arccos(-1/e)) of a hyperbolic orbit (e > 1) from the
// hyperbolic anomaly H: tan(nu/2) = sqrt((e+1)/(e-1)) tanh(H/2).
// NaN for e <= 1.
func TrueFromHyperbolic(H, e float64) float64 {
	if !(e > 1) {
		return math.NaN()
	}
	return 2 * math.Atan(math.Sqrt((e+1)/(e-1))*math.Tanh(H/2))
}

// HyperbolicFromTrue returns the hyperbolic anomaly of a hyperbolic orbit
// (e > 1) from the true anomaly nu, which is first reduced to (-pi, pi]:
// tanh(H/2) = sqrt((e-1)/(e+1)) tan(nu/2). It returns +-Inf at the
// asymptotes and NaN beyond them or for e <= 1; [MeanFromTrue] reports
// those cases as errors.
func HyperbolicFromTrue(nu, e float64) float64 {
	if !(e > 1) {
		return math.NaN()
	}
	x := math.Sqrt((e-1)/(e+1)) * math.Tan(wrapPi(nu)/2)
	if math.Abs(x) > 1 {
		return math.NaN()
	}
	return 2 * math.Atanh(x)
}

// MeanFromTrue returns the mean anomaly (rad) for the true anomaly nu
// (rad) on a conic of eccentricity e:
//
//   - ellipse (0 <= e < 1): M = E - e sin E, in the same revolution as nu;
//   - parabola (e == 1): Barker's M = D/2 + D^3/6 with D = tan(nu/2),
//     so that M = sqrt(mu/p^3)(t - T) (see [SolveBarker]);
//   - hyperbola (e > 1): M = e sinh H - H = sqrt(mu/(-a)^3)(t - T).
//
// For open orbits nu is reduced to (-pi, pi] and must lie strictly
// inside the asymptotes, |nu| < arccos(-1/e) (pi for the parabola);
// otherwise the error wraps [ErrBeyondAsymptote].
func MeanFromTrue(nu, e float64) (float64, error) {
	const op = "MeanFromTrue"
	if !finite(e) || e < 0 {
		return 0, inputErr(op, ErrEccentricity, fmtVal("e", e, ""))
	}
	if !finite(nu) {
		return 0, inputErr(op, ErrNonFinite, fmtVal("nu", nu, "rad"))
	}
	switch {
	case e < 1:
		return keplerMeanElliptic(EccentricFromTrue(nu, e), e), nil
	case e == 1:
		w := wrapPi(nu)
		if math.Abs(w) >= math.Pi {
			return 0, inputErr(op, ErrBeyondAsymptote, fmtVal("nu", nu, "rad"))
		}
		D := math.Tan(w / 2)
		return D/2 + D*D*D/6, nil
	default:
		w := wrapPi(nu)
		if 1+e*math.Cos(w) <= 0 {
			return 0, inputErr(op, ErrBeyondAsymptote, fmtVal("nu", nu, "rad")+", "+fmtVal("e", e, ""))
		}
		H := HyperbolicFromTrue(w, e)
		if !finite(H) {
			return 0, inputErr(op, ErrBeyondAsymptote, fmtVal("nu", nu, "rad")+", "+fmtVal("e", e, ""))
		}
		return keplerMeanHyperbolic(H, e), nil
	}
}

// TrueFromMean returns the true anomaly (rad) for the mean anomaly M
// (rad) on a conic of eccentricity e >= 0, in the conventions of
// [MeanFromTrue]: for an ellipse nu is in the same revolution as M (M in
// [0, 2pi) gives nu in [0, 2pi)); for a parabola and a hyperbola nu lies
// between the asymptotes. Every finite M has a solution, so the only
// failures are a NaN or negative e or a non-finite M, which give NaN
// (validate user input with [MeanFromTrue] or before the call).
func TrueFromMean(M, e float64) float64 {
	switch {
	case !(e >= 0) || math.IsInf(e, 0) || !finite(M):
		return math.NaN()
	case e < 1:
		return TrueFromEccentric(SolveKeplerElliptic(M, e), e)
	case e == 1:
		return SolveBarker(M)
	default:
		return TrueFromHyperbolic(SolveKeplerHyperbolic(M, e), e)
	}
}
