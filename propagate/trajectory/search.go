package trajectory

import (
	"math"
	"sort"
)

// Window is an interval of time on which a function is positive.
type Window struct {
	Start, End float64 // s
	// FromStart and ToEnd are set when the window is cut by the start or
	// the end of the searched interval (f > 0 there).
	FromStart, ToEnd bool
}

// Duration returns End - Start, s.
func (w Window) Duration() float64 { return w.End - w.Start }

// Root returns a time in [a, b] where f changes sign, by bisection until
// the bracket is at most tol long; fa = f(a) and fb = f(b) must lie on
// different sides of zero (f > 0 on one side, f <= 0 on the other). The
// result is the midpoint of the last bracket.
func Root(f func(float64) float64, a, b, fa, fb, tol float64) float64 {
	pa := fa > 0
	if pa == (fb > 0) {
		panic("trajectory: Root without a sign change")
	}
	for b-a > tol {
		m := 0.5 * (a + b)
		if m <= a || m >= b {
			break
		}
		if (f(m) > 0) == pa {
			a = m
		} else {
			b = m
		}
	}
	return 0.5 * (a + b)
}

var invPhi = (math.Sqrt(5) - 1) / 2

// GoldenMax returns the time of the maximum of f on [a, b] (assumed
// unimodal there) to tol by golden-section search, and the value there.
// The ends are candidates too.
func GoldenMax(f func(float64) float64, a, b, tol float64) (t, fmax float64) {
	lo, hi := a, b
	x1 := hi - invPhi*(hi-lo)
	x2 := lo + invPhi*(hi-lo)
	f1, f2 := f(x1), f(x2)
	for hi-lo > tol {
		if f1 < f2 {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + invPhi*(hi-lo)
			f2 = f(x2)
		} else {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - invPhi*(hi-lo)
			f1 = f(x1)
		}
	}
	t, fmax = x1, f1
	if f2 > fmax {
		t, fmax = x2, f2
	}
	for _, e := range [2]float64{a, b} {
		if fe := f(e); fe > fmax {
			t, fmax = e, fe
		}
	}
	return t, fmax
}

// grid returns n >= 1 and the times t0 + i (t1-t0)/n, i = 0..n, of the
// coarsest uniform grid of [t0, t1] with a step of at most step.
func grid(t0, t1, step float64) []float64 {
	n := int(math.Ceil((t1-t0)/step - 1e-9))
	if n < 1 {
		n = 1
	}
	ts := make([]float64, n+1)
	for i := range ts {
		ts[i] = t0 + (t1-t0)*float64(i)/float64(n)
	}
	ts[n] = t1
	return ts
}

// Maximize returns the time in [t0, t1] where f is largest, and the value:
// f is sampled at a step of at most step, and the best sample is refined by
// golden-section search between its neighbours to tol.
func Maximize(f func(float64) float64, t0, t1, step, tol float64) (t, fmax float64) {
	if !(t1 > t0) {
		return t0, f(t0)
	}
	ts := grid(t0, t1, step)
	best, fbest := 0, math.Inf(-1)
	for i, ti := range ts {
		if fi := f(ti); fi > fbest {
			best, fbest = i, fi
		}
	}
	a, b := ts[max(best-1, 0)], ts[min(best+1, len(ts)-1)]
	t, fmax = GoldenMax(f, a, b, tol)
	if fmax < fbest {
		return ts[best], fbest
	}
	return t, fmax
}

// Windows returns the maximal intervals of [t0, t1] on which f > 0, in
// time order, with their ends located to tol (s). f is sampled at a step
// of at most step; see the package documentation for what is found
// between samples.
func Windows(f func(float64) float64, t0, t1, step, tol float64) []Window {
	if !(t1 > t0) {
		return nil
	}
	ts := grid(t0, t1, step)
	fs := make([]float64, len(ts))
	for i, t := range ts {
		fs[i] = f(t)
	}
	return windowsOf(f, ts, fs, tol)
}

// WindowsAt is [Windows] on the given increasing sample times with the
// values fs = f(ts) already computed.
func WindowsAt(f func(float64) float64, ts, fs []float64, tol float64) []Window {
	if len(ts) != len(fs) {
		panic("trajectory: WindowsAt with mismatched slices")
	}
	if len(ts) < 2 {
		return nil
	}
	return windowsOf(f, ts, fs, tol)
}

func windowsOf(f func(float64) float64, ts, fs []float64, tol float64) []Window {
	n := len(ts) - 1
	var cross []float64
	for i := range n {
		if (fs[i] > 0) != (fs[i+1] > 0) {
			cross = append(cross, Root(f, ts[i], ts[i+1], fs[i], fs[i+1], tol))
		}
	}
	neg := func(x float64) float64 { return -f(x) }
	for i := 0; i <= n; i++ {
		lo, hi := max(i-1, 0), min(i+1, n)
		if fs[lo] > 0 != (fs[i] > 0) || fs[hi] > 0 != (fs[i] > 0) {
			continue // a sign change next to it is found above
		}
		// Strict on the left, so a plateau of equal samples counts once.
		isMax := (i == 0 || fs[i] > fs[i-1]) && (i == n || fs[i] >= fs[i+1])
		isMin := (i == 0 || fs[i] < fs[i-1]) && (i == n || fs[i] <= fs[i+1])
		if fs[i] <= 0 && isMax {
			// Bracket the hidden maximum; at the ends of the grid the
			// maximum may lie in the one interval beside the end.
			tm, fm := GoldenMax(f, ts[lo], ts[hi], tol)
			if fm > 0 && tm > ts[lo] && tm < ts[hi] {
				cross = append(cross, Root(f, ts[lo], tm, fs[lo], fm, tol), Root(f, tm, ts[hi], fm, fs[hi], tol))
			}
		}
		if fs[i] > 0 && isMin {
			tm, fm := GoldenMax(neg, ts[lo], ts[hi], tol)
			fm = -fm
			if fm <= 0 && tm > ts[lo] && tm < ts[hi] {
				cross = append(cross, Root(f, ts[lo], tm, fs[lo], fm, tol), Root(f, tm, ts[hi], fm, fs[hi], tol))
			}
		}
	}
	sort.Float64s(cross)
	var out []Window
	open := fs[0] > 0
	cur := Window{Start: ts[0], FromStart: open}
	for _, c := range cross {
		if open {
			cur.End = c
			out = append(out, cur)
		} else {
			cur = Window{Start: c}
		}
		open = !open
	}
	if open {
		cur.End, cur.ToEnd = ts[n], true
		out = append(out, cur)
	}
	return out
}
