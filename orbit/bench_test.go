package orbit

import (
	"math"
	"math/rand/v2"
	"testing"
)

var (
	sinkF  float64
	sinkS  State
	sinkEl Elements
)

// BenchmarkSolveKeplerElliptic solves over 4096 precomputed (e, M) pairs,
// e uniform in [0, 0.999999] and M uniform in [0, 2pi).
func BenchmarkSolveKeplerElliptic(b *testing.B) {
	rng := rand.New(rand.NewPCG(1, 1))
	const n = 4096
	es, ms := make([]float64, n), make([]float64, n)
	for i := range n {
		es[i] = 0.999999 * rng.Float64()
		ms[i] = 2 * math.Pi * rng.Float64()
	}
	i := 0
	for b.Loop() {
		sinkF += SolveKeplerElliptic(ms[i], es[i])
		i = (i + 1) & (n - 1)
	}
}

// BenchmarkSolveKeplerHyperbolic: e in (1, 11], |M| up to 100.
func BenchmarkSolveKeplerHyperbolic(b *testing.B) {
	rng := rand.New(rand.NewPCG(1, 1))
	const n = 4096
	es, ms := make([]float64, n), make([]float64, n)
	for i := range n {
		es[i] = 1 + 10*rng.Float64() + 1e-9
		ms[i] = (2*rng.Float64() - 1) * 100
	}
	i := 0
	for b.Loop() {
		sinkF += SolveKeplerHyperbolic(ms[i], es[i])
		i = (i + 1) & (n - 1)
	}
}

func benchElements(n int) []Elements {
	rng := rand.New(rand.NewPCG(1, 1))
	out := make([]Elements, n)
	for i := range out {
		out[i] = randomElements(rng, caseKinds[i%len(caseKinds)])
	}
	return out
}

func benchStates(b *testing.B, n int) []State {
	els := benchElements(n)
	out := make([]State, n)
	for i, el := range els {
		s, err := StateFromElements(muEarth, el)
		if err != nil {
			b.Fatal(err)
		}
		out[i] = s
	}
	return out
}

// BenchmarkElementsFromState over 1024 states of every family.
func BenchmarkElementsFromState(b *testing.B) {
	const n = 1024
	ss := benchStates(b, n)
	i := 0
	for b.Loop() {
		el, _ := ElementsFromState(muEarth, ss[i])
		sinkF += el.Nu
		i = (i + 1) & (n - 1)
	}
}

// BenchmarkStateFromElements over 1024 element sets of every family.
func BenchmarkStateFromElements(b *testing.B) {
	const n = 1024
	els := benchElements(n)
	i := 0
	for b.Loop() {
		s, _ := StateFromElements(muEarth, els[i])
		sinkF += s.R[0]
		i = (i + 1) & (n - 1)
	}
}

// BenchmarkPropagate over 1024 states of every family, each by a step of
// up to +-3 periods (ellipses) or +-3 units of mean anomaly (open orbits).
func BenchmarkPropagate(b *testing.B) {
	const n = 1024
	ss := benchStates(b, n)
	els := benchElements(n)
	rng := rand.New(rand.NewPCG(2, 2))
	dts := make([]float64, n)
	for i, el := range els {
		g, err := GeometryOf(muEarth, el)
		if err != nil {
			b.Fatal(err)
		}
		dts[i] = (2*rng.Float64() - 1) * 3 * 2 * math.Pi / g.MeanMotion
	}
	i := 0
	for b.Loop() {
		s, _ := Propagate(muEarth, ss[i], dts[i])
		sinkF += s.R[0]
		i = (i + 1) & (n - 1)
	}
}

// BenchmarkKeplerChecks: the full set of checks for one state.
func BenchmarkKeplerChecks(b *testing.B) {
	s := State{R: [3]float64{6524.834, 6862.875, 6448.296}, V: [3]float64{4.901327, 5.533756, -1.976341}}
	for b.Loop() {
		c, _ := KeplerChecks(muEarth, s)
		sinkF += c[0].Measured
	}
}
