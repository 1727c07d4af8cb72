package orbit

import "math"

// Gauss-Kronrod 7-15 rule on [-1, 1] (nodes and weights of QUADPACK's
// qk15, R. Piessens et al., QUADPACK, Springer 1983). Kronrod nodes
// xgk[1], xgk[3], xgk[5], xgk[7] are the Gauss nodes, with weights wg.
var (
	xgk = [8]float64{
		0.991455371120812639206854697526329,
		0.949107912342758524526189684047851,
		0.864864423359769072789712788640926,
		0.741531185599394439863864773280788,
		0.586087235467691130294144845693013,
		0.405845151377397166906606412076961,
		0.207784955007898467600689403773245,
		0,
	}
	wgk = [8]float64{
		0.022935322010529224963732008058970,
		0.063092092629978553290700663189204,
		0.104790010322250183839876322541518,
		0.140653259715525918745189590510238,
		0.169004726639267902826583426598550,
		0.190350578064785409913256402421014,
		0.204432940075298892414161999234649,
		0.209482141084727828012999174891714,
	}
	wg = [4]float64{
		0.129484966168869693270611432679082,
		0.279705391489276667901467771423780,
		0.381830050505118944950369775488975,
		0.417959183673469387755102040816327,
	}
)

// gk15 returns the Kronrod estimate of the integral of f over [a, b] and
// the difference from the embedded Gauss estimate.
func gk15(f func(float64) float64, a, b float64) (k, diff float64) {
	c, h := (a+b)/2, (b-a)/2
	fc := f(c)
	resK := wgk[7] * fc
	resG := wg[3] * fc
	for j := range 7 {
		x := h * xgk[j]
		s := f(c-x) + f(c+x)
		resK += wgk[j] * s
		if j%2 == 1 {
			resG += wg[j/2] * s
		}
	}
	return resK * h, (resK - resG) * h
}

// integrate returns the integral of the smooth function f over [a, b] by
// adaptive Gauss-Kronrod 7-15 quadrature to the relative tolerance tol.
// The |Kronrod - Gauss| error estimate is pessimistic for smooth f (the
// Kronrod result is far more accurate), and the bisection stops at 1e-15
// of the total, the rounding floor, and after at most 1000 panels.
func integrate(f func(float64) float64, a, b, tol float64) float64 {
	whole, diff := gk15(f, a, b)
	q := quadState{f: f, floor: 1e-15 * math.Abs(whole), budget: 1000}
	return q.adapt(a, b, whole, diff, math.Max(tol*math.Abs(whole), q.floor))
}

type quadState struct {
	f      func(float64) float64
	floor  float64
	budget int
}

func (q *quadState) adapt(a, b, whole, diff, atol float64) float64 {
	if math.Abs(diff) <= atol || q.budget <= 0 {
		return whole
	}
	q.budget -= 2
	m := (a + b) / 2
	l, dl := gk15(q.f, a, m)
	r, dr := gk15(q.f, m, b)
	sub := math.Max(atol/2, q.floor/64)
	return q.adapt(a, m, l, dl, sub) + q.adapt(m, b, r, dr, sub)
}
